"""Durability per face and support widths through Python: the result's
cover per face and the design moment at a support face.

Sources beside each value; the scenario is our own (the workshop's
balcony and a two-span floor strip)."""
import copy

import pytest

import armature

BALCONY = {
    "code": "EN1992-1-1",
    "slab": {"spans_m": [1.5, 4.0], "ends": ["free", "pinned"], "thickness_mm": 220},
    "concrete": {"class": "C30/37"},
    "reinforcement": {"bars": ["10", "12"]},
    "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0, "imposed_category": "C"},
}


def test_balcony_top_face_xc3_takes_30_mm_cover():
    """Top XC3: Table 4.3N S3 (C30/37 gives no reduction for XC3), Table
    4.4N S3 XC3 c_min,dur = 20 mm, + Δc_dev 10 mm = 30 mm (EN 1992-1-1
    4.4.1, recommended values, value by table from memory). The bottom
    stays as the all-XC1 design has it."""
    req = copy.deepcopy(BALCONY)
    req["durability"] = {"top": {"exposure": "XC3"}}
    res = armature.design(req)
    base = armature.design(copy.deepcopy(BALCONY))
    assert res["cover_mm"]["top"] == 30
    assert base["cover_mm"]["top"] < 30
    assert res["cover_mm"]["bottom"] == base["cover_mm"]["bottom"]
    span = [g for g in res["regions"] if g["where"] == "span 2"][0]
    span_base = [g for g in base["regions"] if g["where"] == "span 2"][0]
    assert span["bars"] == span_base["bars"]


def test_support_width_gives_the_face_moment_aci():
    """ACI 318-19 7.4.1.3 (from memory), two 4.0 m spans, 300 mm interior
    support; 1.2 D + 1.6 L with D = 23.6 × 0.2 + 1.0 = 5.72 kPa and L =
    4.0 kPa: w = 13.264 kN/m. Beam tables (from memory): M_c = wL²/8 =
    26.528 kNm, V = 5wL/8 = 33.16 kN; hand statics at 0.15 m from the
    centreline: 26.528 − 33.16 × 0.15 + 13.264 × 0.15²/2 = 21.70322 kNm."""
    req = {
        "code": "ACI318-19",
        "slab": {"spans_m": [4.0, 4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200,
                 "support_widths_mm": [200, 300, 200]},
        "concrete": {"cylinder_strength_MPa": 28},
        "loads": {"dead_kPa": 1.0, "imposed_kPa": 4.0},
    }
    res = armature.design(req)
    support = [g for g in res["regions"] if g["where"] == "support 2"][0]
    assert support["design_moment_kNm"] == pytest.approx(21.70322, rel=1e-9)


def test_a_bad_thickness_does_not_hide_a_bad_support_width_list():
    """Every problem is reported together: the widths are judged against the
    spans and ends alone, so a thickness out of range (contract.md: 50 to
    1500 mm) and a widths list one entry short both name their fields."""
    req = copy.deepcopy(BALCONY)
    req["slab"]["thickness_mm"] = 20
    req["slab"]["support_widths_mm"] = [0, 300]
    with pytest.raises(armature.InputError) as err:
        armature.design(req)
    lines = str(err.value).splitlines()
    assert any(line.startswith("slab.thickness_mm: ") for line in lines), lines
    assert any(line.startswith("slab.support_widths_mm: ") for line in lines), lines
