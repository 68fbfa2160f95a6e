"""Malformed requests through Python and through the CLI: each is refused
with a message naming the field (CLI: exit 2, nothing on stdout)."""
import copy
import json
import math
import subprocess

import pytest

import armature
from conftest import BASE_REQUEST, CLI


def edit(path, value):
    """A copy of the base request with one field set (value None deletes it)."""
    req = copy.deepcopy(BASE_REQUEST)
    *parents, last = path
    node = req
    for p in parents:
        node = node[p]
    if value is None:
        del node[last]
    else:
        node[last] = value
    return req


def with_both_strengths():
    req = copy.deepcopy(BASE_REQUEST)
    req["concrete"]["cylinder_strength_MPa"] = 30
    return req


MALFORMED = [
    ("missing code", edit(["code"], None), "code"),
    ("unknown code", edit(["code"], "EN1992-9"), "code"),
    ("unknown variant", edit(["variant"], "Ruritania"), "variant"),
    ("negative thickness", edit(["slab", "thickness_mm"], -200), "slab.thickness_mm"),
    ("thickness as text", edit(["slab", "thickness_mm"], "thick"), "slab.thickness_mm"),
    ("no spans", edit(["slab", "spans_m"], []), "slab.spans_m"),
    ("zero span", edit(["slab", "spans_m"], [0.0]), "slab.spans_m[0]"),
    ("unknown end", edit(["slab", "ends"], ["pinned", "glued"]), "slab.ends[1]"),
    ("strip width zero", edit(["slab", "strip_width_mm"], 0), "slab.strip_width_mm"),
    ("unknown top-level field", edit(["loadz"], {"imposed_kPa": 2}), "loadz"),
    ("misspelt load", edit(["loads", "imposed_kpa"], 3.0), "loads.imposed_kpa"),
    ("unknown strength class", edit(["concrete", "class"], "C33/41"), "concrete.class"),
    ("class and fck both", with_both_strengths(), "concrete"),
    ("fck out of range", edit(["concrete"], {"cylinder_strength_MPa": 100}), "concrete.cylinder_strength_MPa"),
    ("fyk out of range", edit(["reinforcement", "yield_strength_MPa"], 250), "reinforcement.yield_strength_MPa"),
    ("unknown bar", edit(["reinforcement", "bars"], ["10", "11"]), "reinforcement.bars[1]"),
    ("empty bar list", edit(["reinforcement", "bars"], []), "reinforcement.bars"),
    ("bar as number", edit(["reinforcement", "bars"], [12]), "reinforcement.bars[0]"),
    ("unknown ductility class", edit(["reinforcement", "ductility_class"], "D"), "reinforcement.ductility_class"),
    ("ductility class as number", edit(["reinforcement", "ductility_class"], 1), "reinforcement.ductility_class"),
    ("missing imposed load", edit(["loads", "imposed_kPa"], None), "loads.imposed_kPa"),
    ("negative imposed load", edit(["loads", "imposed_kPa"], -2.0), "loads.imposed_kPa"),
    ("unknown category", edit(["loads", "imposed_category"], "Z"), "loads.imposed_category"),
    ("unknown exposure", edit(["durability", "exposure"], "XC7"), "durability.exposure"),
    ("cover over half the depth", edit(["durability", "cover_mm"], 120), "durability.cover_mm"),
    ("untabulated fire period", edit(["fire"], {"resistance_min": 45}), "fire.resistance_min"),
    ("unknown combination", edit(["design"], {"combination": "6.11"}), "design.combination"),
    ("redistribution on one span", edit(["design"], {"redistribution_percent": 10}),
     "design.redistribution_percent"),
    ("slab not an object", edit(["slab"], [4.0]), "slab"),
]


@pytest.mark.parametrize("name,request_,field", MALFORMED, ids=[m[0] for m in MALFORMED])
def test_python_names_the_field(name, request_, field):
    with pytest.raises(armature.InputError) as info:
        armature.design(request_)
    assert isinstance(info.value, ValueError)
    lines = str(info.value).splitlines()
    assert any(line.startswith(field + ": ") for line in lines), lines


@pytest.mark.parametrize("name,request_,field", MALFORMED, ids=[m[0] for m in MALFORMED])
def test_cli_names_the_field(name, request_, field):
    run = subprocess.run([str(CLI), "design", "-"], input=json.dumps(request_),
                         capture_output=True, text=True, timeout=60)
    assert run.returncode == 2
    assert run.stdout == ""
    assert f"armature: {field}: " in run.stderr, run.stderr


def test_every_problem_is_listed_once():
    req = edit(["slab", "thickness_mm"], -5)
    req["loads"]["imposed_category"] = "Q"
    req["durability"]["exposure"] = "XZ"
    with pytest.raises(armature.InputError) as info:
        armature.design(req)
    lines = str(info.value).splitlines()
    assert sorted(line.split(":")[0] for line in lines) == [
        "durability.exposure", "loads.imposed_category", "slab.thickness_mm"]


def test_nan_and_infinity_from_python_are_refused():
    for bad in (math.nan, math.inf):
        with pytest.raises(armature.InputError, match=r"slab\.thickness_mm: must be a finite number"):
            armature.design(edit(["slab", "thickness_mm"], bad))


def test_cli_refuses_text_that_is_not_json():
    run = subprocess.run([str(CLI), "design", "-"], input="{not json", capture_output=True,
                         text=True, timeout=60)
    assert run.returncode == 2 and run.stdout == ""
    assert "not valid JSON" in run.stderr


def test_request_that_is_not_an_object():
    with pytest.raises(armature.InputError, match=r"\(request\): must be a JSON object"):
        armature.design([1, 2, 3])
