"""ACI 318-19, US variant: the CLI summary and the calculation record in US
units, the result JSON in SI with its strip width, compare(units="US"),
the US example, and the grid the variant searches.

Sources: ACI 318-19 (inch-pound edition), the sections named beside each
check (values from memory); exact unit definitions (1 in = 25.4 mm, 1 ft =
0.3048 m, 1 lbf = 4.4482216152605 N). The slabs are our own: the
community workshop's US sister building.
"""
import json
import pathlib
import re
import subprocess

import pytest

import armature
from conftest import CLI

IN = 25.4  # mm
KNM_PER_KIP_FT = 4.4482216152605 * 0.3048
EXAMPLE = pathlib.Path(__file__).resolve().parents[2] / "examples" / "workshop-us-first-floor.json"

FLOOR = {
    "code": "ACI318-19",
    "variant": "US",
    "slab": {"spans": ["14 ft", "14 ft"], "ends": ["pinned", "pinned"], "thickness": "7 in"},
    "concrete": {"cylinder_strength": "4000 psi"},
    "loads": {"dead": "15 psf", "imposed": "65 psf"},
}

# Words of EN 1990/1992 that an ACI record must not use.
EN_TERMS = re.compile(r"\bGk\b|\bQk\b|quasi-permanent|characteristic", re.I)


def _run(args, request):
    return subprocess.run([str(CLI), *args], input=json.dumps(request), capture_output=True, text=True,
                          timeout=60)


def test_summary_in_us_units_per_foot():
    run = _run(["design", "-"], FLOOR)
    assert run.returncode == 0, run.stderr
    out = run.stdout
    # The header names the variant and its units, not SI.
    first = out.splitlines()[0]
    assert "ACI318-19 (US)" in first and "inch-pound" in first and "SI" not in first
    # Loads by hand: 7/12 ft × 150 pcf = 87.5 psf; 5.3.1b 1.2 × 102.5 + 1.6 × 65 = 227 psf;
    # the sustained load D = 102.5 psf (the name of ACI 318-19 24.2.4.1).
    assert "self-weight 87.50 psf, ULS 227.00 psf [5.3.1b: 1.2 D + 1.6 L], sustained 102.50 psf" in out
    # Table 20.5.1.3.1 (in-lb): 3/4 in for interior slabs.
    assert "Cover      top 0.75 in, bottom 0.75 in" in out
    # Per foot: M of span 1 of two equal spans under pattern loading; the strip is 12 in.
    assert "M_Ed kip-ft/ft" in out and "As,prov in2/ft" in out
    assert "Quantities are per foot of slab (design strip 12.0 in wide)." in out
    # Bars at half-inch steps: every spacing printed is a multiple of 0.5 in.
    spacings = [float(s) for s in re.findall(r"#\d+ @ ([\d.]+) in", out)]
    assert spacings and all(abs(s * 2 - round(s * 2)) < 1e-9 for s in spacings)
    # Table 7.3.1.1 (in-lb), one end continuous: 168 in/24 × (0.4 + 60 000/100 000) = 7 in.
    defl = re.findall(r"^deflection +span \d +(\S+) +(\S+) +in ", out, re.M)
    assert defl == [("7", "7"), ("7", "7")]
    assert "Caution" in out


def test_result_json_stays_si_and_states_the_strip():
    res = armature.design(FLOOR)
    assert res["variant"] == "US"
    assert res["strip_width_mm"] == pytest.approx(12 * IN)
    assert res["cover_mm"]["bottom"] == pytest.approx(0.75 * IN)
    # Self-weight in kPa: 87.5 psf × 0.047880259 kPa/psf.
    assert res["loads"]["self_weight_kPa"] == pytest.approx(87.5 * 4.4482216152605 / 0.3048 ** 2 / 1000)
    for g in res["regions"]:
        # Spacings in mm on the grid 3 in + k × 1/2 in.
        k = (g["bars"]["spacing_mm"] - 3 * IN) / (0.5 * IN)
        assert k == pytest.approx(round(k))
    # The SI variant's result is as before: no strip width stated.
    assert "strip_width_mm" not in armature.design(dict(FLOOR, variant="SI"))


def test_spacing_step_mm_overrides_the_half_inch_grid():
    req = json.loads(json.dumps(FLOOR))
    req["reinforcement"] = {"spacing_step_mm": 25, "min_spacing_mm": 75}
    res = armature.design(req)
    for g in res["regions"]:
        assert (g["bars"]["spacing_mm"] - 75) % 25 == pytest.approx(0)


def test_record_in_us_units_without_en_terms(tmp_path):
    for variant in ("US", "SI"):
        for ext in ("md", "html"):
            path = tmp_path / f"floor-{variant}.{ext}"
            run = _run(["design", "-", "--report", str(path)], dict(FLOOR, variant=variant))
            assert run.returncode in (0, 1), run.stderr
            text = path.read_text()
            # Under ACI, in either variant: D, L, "sustained", no EN words.
            assert not EN_TERMS.search(text), EN_TERMS.search(text).group(0)
            assert "D (self-weight + superimposed dead)" in text and "Sustained load" in text
            assert "A design aid" in text  # the caution text stays
            if variant == "US":
                assert "ACI318-19 (US)" in text and "(SI)" not in text
                assert not re.search(r"\bkNm\b|\bkPa\b|\bkN\b", text)
                assert "psf" in text and "kip-ft" in text
                # The derivation shows the in-lb forms (Table 7.3.1.1, 24.3.2).
                assert "(0.4 + fy/100 000)" in text
                assert "min(15 (40 000/fs) − 2.5 cc, 12 (40 000/fs))" in text
                # Strip width in the defaults, from the variant.
                assert "a foot of slab (US variant)" in text


def test_record_names_a_roof_imposed_load_lr(tmp_path):
    # ACI 318-19 5.3.1: roof live load is Lr; an imposed action of EN
    # category H (roofs) is combined as Lr, and the record names it so.
    req = json.loads(json.dumps(FLOOR))
    req["loads"] = {"dead": "15 psf", "actions": [
        {"name": "roof access", "kind": "imposed", "category": "H", "kPa": 0.96},
        {"name": "workshop floor", "kind": "imposed", "category": "B", "kPa": 2.0}]}
    path = tmp_path / "roof.md"
    run = _run(["design", "-", "--report", str(path)], req)
    assert run.returncode in (0, 1), run.stderr
    text = path.read_text()
    roof = next(line for line in text.splitlines() if line.startswith("| Action: roof access"))
    floor = next(line for line in text.splitlines() if line.startswith("| Action: workshop floor"))
    assert "Lr (roof live)" in roof and "L (live)" not in roof
    assert "L (live)" in floor


def test_compare_in_us_units_per_foot():
    floor = {k: v for k, v in FLOOR.items() if k not in ("code", "variant")}
    si = armature.compare(floor, codes=["ACI318-19:SI", "ACI318-19:US"])
    us = armature.compare(floor, codes=["ACI318-19:SI", "ACI318-19:US"], units="US")
    assert us.attrs["units"] == "US" and "A design aid" in us.attrs["caution"]
    assert "design_moment_kip_ft_per_ft" in us.columns and "design_moment_kNm" not in us.columns
    for (_, a), (_, b) in zip(si.iterrows(), us.iterrows()):
        # Each row per foot: the SI variant's 1000 mm strip scaled by 304.8/1000, the US one as is.
        per_ft = 304.8 / (1000.0 if a["code"] == "ACI318-19:SI" else 304.8)
        assert b["design_moment_kip_ft_per_ft"] == pytest.approx(a["design_moment_kNm"] / KNM_PER_KIP_FT * per_ft)
        assert b["As_prov_in2_per_ft"] == pytest.approx(a["As_prov_mm2"] / IN ** 2 * per_ft)
        assert b["spacing_in"] == pytest.approx(a["spacing_mm"] / IN)
    # Both variants design the same floor: the moments per foot agree (the same
    # analysis; the self-weight 150 pcf against 23.6 kN/m³ differs by 0.16 %).
    m = dict(zip(us["code"] + " " + us["where"], us["design_moment_kip_ft_per_ft"]))
    assert m["ACI318-19:US span 1"] == pytest.approx(m["ACI318-19:SI span 1"], rel=2e-3)
    with pytest.raises(armature.InputError, match=r"units: must be"):
        armature.compare(floor, codes=["ACI318-19:US"], units="imperial")


def test_us_example_designs():
    request = json.loads(EXAMPLE.read_text())
    assert request["variant"] == "US"
    res = armature.design(request)
    assert res["status"] == "pass"
    run = subprocess.run([str(CLI), "design", str(EXAMPLE)], capture_output=True, text=True, timeout=60)
    assert run.returncode == 0 and "kip-ft/ft" in run.stdout


def test_bad_input_names_the_field():
    with pytest.raises(armature.InputError) as info:
        armature.design(dict(FLOOR, reinforcement={"bars": ["No.13", "#4"]}))
    assert "reinforcement.bars[0]: 'No.13' is a bar of the SI variant" in str(info.value)
    with pytest.raises(armature.InputError, match=r"variant: code ACI318-19 has no variant 'USA'"):
        armature.design(dict(FLOOR, variant="USA"))


def test_default_concrete_strength_of_the_us_variant():
    # f'c 4000 psi when the request gives no concrete strength (US variant only).
    bare = {k: v for k, v in FLOOR.items() if k != "concrete"}
    default, given = armature.design(bare), armature.design(FLOOR)
    assert [g["bars"] for g in default["regions"]] == [g["bars"] for g in given["regions"]]
    for a, b in zip(default["regions"], given["regions"]):
        # The same strength to the last digits of its conversion (4000 × 6.894757e-3 MPa).
        assert a["As_req_mm2"] == pytest.approx(b["As_req_mm2"], rel=1e-12)
    with pytest.raises(armature.InputError, match=r"concrete: required"):
        armature.design(dict(bare, variant="SI"))
    # A wrong type is still refused, and a class is refused by ACI 318.
    with pytest.raises(armature.InputError, match=r"concrete: "):
        armature.design(dict(bare, concrete=4000))
    with pytest.raises(armature.InputError, match=r"concrete\.class: ACI 318-19 specifies concrete by f'c"):
        armature.design(dict(bare, concrete={"class": "C30/37"}))
