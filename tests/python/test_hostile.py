"""A battery of hostile requests through Python and the CLI: each is refused
as an input error naming the field (CLI: exit 2, nothing on stdout), never a
crash, a hang or partial output."""
import copy
import json
import math
import subprocess

import pytest

import armature
from conftest import BASE_REQUEST, CLI


def with_(path, value):
    req = copy.deepcopy(BASE_REQUEST)
    node = req
    for p in path[:-1]:
        node = node[p]
    node[path[-1]] = value
    return req


HOSTILE = [
    ("span as text", with_(["slab", "spans_m"], ["4.0"]), "slab.spans_m[0]"),
    ("zero span", with_(["slab", "spans_m"], [0]), "slab.spans_m[0]"),
    ("negative span", with_(["slab", "spans_m"], [-4.0]), "slab.spans_m[0]"),
    ("zero imposed load", with_(["loads", "imposed_kPa"], 0), "loads.imposed_kPa"),
    ("negative dead load", with_(["loads", "dead_kPa"], -1), "loads.dead_kPa"),
    ("thinner than cover plus bar", with_(["slab", "thickness_mm"], 55) | {"reinforcement": {"bars": ["32"]}},
     "slab.thickness_mm"),
    ("cover above half the depth", with_(["durability", "cover_mm"], 150), "durability.cover_mm"),
    ("unknown class", with_(["concrete", "class"], "C30/38x"), "concrete.class"),
    ("empty bar list", with_(["reinforcement", "bars"], []), "reinforcement.bars"),
    ("unknown bar", with_(["reinforcement", "bars"], ["13"]), "reinforcement.bars[0]"),
    ("thousands of spans", with_(["slab", "spans_m"], [4.0] * 5000), "slab.spans_m"),
    ("huge number", with_(["slab", "thickness_mm"], 1e308), "slab.thickness_mm"),
    ("boolean as number", with_(["slab", "thickness_mm"], True), "slab.thickness_mm"),
    ("null field", with_(["loads", "imposed_kPa"], None), "loads.imposed_kPa"),
    ("object for text", with_(["code"], {"id": "EN1992-1-1"}), "code"),
    ("face exposure besides the plain one", with_(["durability", "top"], {"exposure": "XC3"}),
     "durability.top.exposure"),
    ("unknown face exposure", with_(["durability"], {"bottom": {"exposure": "XC9"}}), "durability.bottom.exposure"),
    ("face cover above half the depth", with_(["durability"], {"top": {"cover_mm": 150}}), "durability.top.cover_mm"),
    ("face cover besides the plain one", with_(["durability", "bottom"], {"cover_mm": 30}),
     "durability.bottom.cover_mm"),
    ("face not an object", with_(["durability", "top"], "XC3"), "durability.top"),
    ("unknown key of a face", with_(["durability", "top"], {"colour": "grey"}), "durability.top.colour"),
    ("support widths too few", with_(["slab", "support_widths_mm"], [300]), "slab.support_widths_mm"),
    ("negative support width", with_(["slab", "support_widths_mm"], [300, -1]), "slab.support_widths_mm[1]"),
    ("support width as text", with_(["slab", "support_widths_mm"], ["300", 300]), "slab.support_widths_mm[0]"),
    ("support faces overlap", with_(["slab"], {"spans_m": [2.0], "ends": ["pinned", "pinned"], "thickness_mm": 200,
                                              "support_widths_mm": [2500, 1600]}), "slab.support_widths_mm[0]"),
    ("free end with a width", with_(["slab"], {"spans_m": [1.5, 4.0], "ends": ["free", "pinned"],
                                               "thickness_mm": 200, "support_widths_mm": [200, 300, 200]}),
     "slab.support_widths_mm[0]"),
]


@pytest.mark.parametrize("name,request_,field", HOSTILE, ids=[h[0] for h in HOSTILE])
def test_python_refuses(name, request_, field):
    with pytest.raises(armature.InputError) as info:
        armature.design(request_)
    assert any(line.startswith(field + ": ") for line in str(info.value).splitlines()), str(info.value)


@pytest.mark.parametrize("name,request_,field", HOSTILE, ids=[h[0] for h in HOSTILE])
def test_cli_refuses(name, request_, field):
    run = subprocess.run([str(CLI), "design", "--json", "-"], input=json.dumps(request_).encode(),
                         capture_output=True, timeout=60)
    assert run.returncode == 2 and run.stdout == b""
    assert f"armature: {field}: ".encode() in run.stderr, run.stderr


@pytest.mark.parametrize("value", [math.nan, math.inf, -math.inf])
def test_python_non_finite_numbers(value):
    with pytest.raises(armature.InputError, match=r"slab\.spans_m\[0\]: must be a finite number"):
        armature.design(with_(["slab", "spans_m"], [value]))


@pytest.mark.parametrize("value", [math.nan, math.inf])
def test_python_non_finite_support_width(value):
    with pytest.raises(armature.InputError, match=r"slab\.support_widths_mm\[1\]: must be between 0 and 3000 mm"):
        armature.design(with_(["slab", "support_widths_mm"], [300, value]))


def test_python_unpaired_surrogate_text():
    with pytest.raises(armature.InputError, match=r"concrete\.class: is not valid UTF-8 text"):
        armature.design(with_(["concrete", "class"], "C30\ud800"))


def test_python_deep_nesting():
    deep = []
    for _ in range(500):
        deep = [deep]
    with pytest.raises(armature.InputError, match="nested too deeply"):
        armature.design(with_(["slab", "spans_m"], deep))


@pytest.mark.parametrize("payload,message", [
    (b"[" * 100000 + b"]" * 100000, b"(request): must be a JSON object"),
    (b'{"code": "EN1992-1-1\xff"}', b"not valid JSON"),
    (b'{"slab": {"thickness_mm": NaN}}', b"not valid JSON"),
    (b'{"code": 1e99999}', b"not valid JSON"),
    (b" " * (2 << 20), b"larger than 1 MiB"),
    (b"", b"not valid JSON"),
], ids=["deep nesting", "invalid UTF-8", "NaN literal", "number overflow", "over 1 MiB", "empty"])
def test_cli_hostile_bytes(payload, message):
    run = subprocess.run([str(CLI), "design", "-"], input=payload, capture_output=True, timeout=60)
    assert run.returncode == 2 and run.stdout == b""
    assert message in run.stderr, run.stderr[:300]
