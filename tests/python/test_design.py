"""armature.design and friends from Python, against the contract and a
single span worked by hand (the same case as tests/cpp/test_design.cpp,
where the hand calculation is written out: EN 1992-1-1 with the UK NA)."""
import math
import random

import pytest

import armature
from conftest import CAUTION

CONTRACT_KEYS = {
    "code", "variant", "armature_version", "status", "max_utilisation", "governing",
    "loads", "cover_mm", "regions", "supports", "spans", "distribution", "checks",
    "warnings", "caution",
}
REGION_KEYS = {
    "where", "face", "x_m", "design_moment_kNm", "effective_depth_mm", "As_req_mm2",
    "As_min_mm2", "As_max_mm2", "bars", "bars_given", "checks",
}
CHECK_KEYS = {"id", "where", "clause", "demand", "capacity", "unit", "utilisation", "pass"}
CHECK_IDS = {"bending", "ductility", "min_steel", "max_steel", "spacing", "cracking",
             "deflection", "shear", "cover", "fire"}


def test_result_has_the_contract_keys(base_request):
    res = armature.design(base_request)
    assert set(res) == CONTRACT_KEYS
    assert set(res["regions"][0]) == REGION_KEYS
    # contract-v2 3: no reinforcement.given, so every region's bars are searched
    assert [g["bars_given"] for g in res["regions"]] == [False] * len(res["regions"])
    assert set(res["regions"][0]["bars"]) == {"bar", "diameter_mm", "spacing_mm", "As_prov_mm2"}
    assert set(res["supports"][0]) == {"where", "design_shear_kN", "shear_resistance_kN", "checks"}
    assert set(res["distribution"]) == {"bar", "diameter_mm", "spacing_mm", "As_req_mm2", "As_prov_mm2"}
    assert set(res["loads"]) == {"self_weight_kPa", "uls_kPa", "sls_quasi_permanent_kPa", "combination"}
    # One nominal cover per face with main bars (contract-v2 3): the given 25 mm.
    assert res["cover_mm"] == {"top": 25.0, "bottom": 25.0}
    for c in res["checks"]:
        assert set(c) == CHECK_KEYS
        assert c["id"] in CHECK_IDS
        assert c["clause"].startswith("EN 1992-1")
    assert res["caution"] == CAUTION == armature.CAUTION


def test_hand_worked_single_span(base_request):
    res = armature.design(base_request)
    assert res["code"] == "EN1992-1-1" and res["variant"] == "UK"
    assert res["loads"]["uls_kPa"] == pytest.approx(11.85)  # 1.35 × 6.0 + 1.5 × 2.5
    assert [g["where"] for g in res["regions"]] == ["support 1", "span 1", "support 2"]
    region = res["regions"][1]
    assert region["where"] == "span 1" and region["face"] == "bottom"
    assert region["x_m"] == pytest.approx(2.0)
    assert region["design_moment_kNm"] == pytest.approx(23.70)  # 11.85 × 4² / 8
    assert region["effective_depth_mm"] == pytest.approx(170.0)
    assert region["As_req_mm2"] == pytest.approx(337.52, rel=1e-4)
    assert region["bars"] == {"bar": "10", "diameter_mm": 10.0, "spacing_mm": 225.0,
                              "As_prov_mm2": pytest.approx(349.07, rel=1e-4)}
    assert [s["where"] for s in res["supports"]] == ["support 1", "support 2"]
    assert res["supports"][0]["design_shear_kN"] == pytest.approx(23.70)
    assert res["supports"][0]["shear_resistance_kN"] == pytest.approx(92.18, rel=1e-3)
    assert res["status"] == "pass"
    # Top bars at pinned ends sit at the widest spacing allowed (250/250), but
    # a passing spacing limit does not head the result: bending in the span
    # does, 23.70 / 24.51 (EN 1992-1-1 6.1, worked in test_design.cpp).
    spacing = [c for c in res["checks"] if c["id"] == "spacing" and c["where"] == "support 1"]
    assert spacing[0]["utilisation"] == pytest.approx(1.0)
    assert res["governing"] == {"check": "bending", "where": "span 1"}
    assert res["max_utilisation"] == pytest.approx(23.70 / 24.51, rel=1e-3)


def test_top_level_checks_are_those_of_regions_supports_and_spans(base_request):
    res = armature.design(base_request)
    nested = [c for part in ("regions", "supports", "spans") for item in res[part] for c in item["checks"]]
    assert res["checks"] == nested
    # The headline leaves out passing spacing limits (the search works up to them).
    headline = [c for c in res["checks"] if c["id"] != "spacing" or not c["pass"]]
    worst = max(headline, key=lambda c: c["utilisation"])
    assert res["max_utilisation"] == pytest.approx(worst["utilisation"])
    assert (res["governing"]["check"], res["governing"]["where"]) == (worst["id"], worst["where"])
    for c in res["checks"]:
        assert c["utilisation"] == pytest.approx(c["demand"] / c["capacity"])
        assert c["pass"] == (c["utilisation"] <= 1.0)


def test_failing_design_reports_fail_with_least_area_passing_bending(base_request):
    # A 140 mm slab over 6 m has the strength but not the stiffness.
    base_request["slab"]["spans_m"] = [6.0]
    base_request["slab"]["thickness_mm"] = 140
    base_request["durability"]["cover_mm"] = 20
    res = armature.design(base_request)
    assert res["status"] == "fail"
    failing = {c["id"] for c in res["checks"] if not c["pass"]}
    assert "deflection" in failing
    bending = next(c for c in res["checks"] if c["id"] == "bending")
    assert bending["pass"]


def test_codes_lists_en1992_with_its_variants():
    codes = armature.codes()
    en = next(c for c in codes if c["id"] == "EN1992-1-1")
    assert set(en) == {"id", "title", "variants", "path"}
    assert {"UK", "recommended"} <= set(en["variants"])
    assert en["path"].endswith("armature_code_en1992.so")


def test_default_variant_is_recommended(base_request):
    del base_request["variant"]
    res = armature.design(base_request)
    assert res["variant"] == "recommended"
    # Recommended αcc = 1.0 gives K' = 0.196 (value from memory).
    ductility = next(c for c in res["checks"] if c["id"] == "ductility")
    assert ductility["capacity"] == pytest.approx(0.196, abs=5e-4)


def test_design_many_equals_sequential_design():
    rng = random.Random(7)
    reqs = []
    for _ in range(60):
        reqs.append({
            "code": "EN1992-1-1",
            "variant": rng.choice(["UK", "recommended"]),
            "slab": {"spans_m": [rng.uniform(2.5, 6.5)], "ends": ["pinned", "pinned"],
                     "thickness_mm": rng.choice([150, 175, 200, 225, 250, 300])},
            "concrete": {"class": rng.choice(["C25/30", "C30/37", "C40/50"])},
            "loads": {"dead_kPa": rng.uniform(0, 3), "imposed_kPa": rng.uniform(1.5, 7.5)},
        })
    assert armature.design_many(reqs, threads=2) == [armature.design(r) for r in reqs]


def test_more_imposed_load_never_reduces_required_steel(base_request):
    rng = random.Random(11)
    for _ in range(40):
        req = dict(base_request)
        req["slab"] = dict(base_request["slab"], spans_m=[rng.uniform(2, 6)])
        req["loads"] = dict(base_request["loads"], imposed_kPa=rng.uniform(1, 8))
        heavier = dict(req, loads=dict(req["loads"], imposed_kPa=req["loads"]["imposed_kPa"] + 0.5))
        a = armature.design(req)["regions"][1]["As_req_mm2"]
        b = armature.design(heavier)["regions"][1]["As_req_mm2"]
        assert b >= a


def test_fire_checks_follow_table_5_8(base_request):
    # EN 1992-1-2 Table 5.8 (value from memory): REI 120 needs h ≥ 120 and a ≥ 40.
    base_request["fire"] = {"resistance_min": 120}
    res = armature.design(base_request)
    fire = [c for c in res["checks"] if c["id"] == "fire"]
    thickness = next(c for c in fire if "thickness" in c["clause"])
    axis = next(c for c in fire if "axis" in c["clause"])
    assert thickness["demand"] == 120 and thickness["capacity"] == 200
    assert axis["demand"] == 40
    # a = 25 + 10/2 = 30 < 40 for every bar with 25 mm cover: the design fails.
    assert not axis["pass"] and res["status"] == "fail"
    assert axis["where"] == "span 1"
    assert math.isclose(axis["capacity"], 25 + res["regions"][1]["bars"]["diameter_mm"] / 2)


def test_cover_per_face_follows_the_largest_bar_on_the_face():
    # EN 1992-1-1 recommended, XC1, C30/37 (S2: cmin,dur 10 mm; cmin,b = φ; Δcdev 10 mm;
    # 4.4.1, values from memory): ø12 top bars at the interior supports set the top
    # face's cover to 12 + 10 = 22 → 25 mm, the ø10 top bars at the ends included;
    # the bottom face has ø10 only: 20 mm.
    res = armature.design({"code": "EN1992-1-1", "variant": "recommended",
                           "slab": {"spans_m": [3.4, 6.0, 3.4], "ends": ["pinned", "pinned"],
                                    "thickness_mm": 200},
                           "concrete": {"class": "C30/37"}, "reinforcement": {"bars": ["10", "12"]},
                           "loads": {"dead_kPa": 1.2, "imposed_kPa": 3.0}})
    assert res["cover_mm"] == {"top": 25.0, "bottom": 20.0}
    for g in res["regions"]:
        c = res["cover_mm"][g["face"]]
        assert g["effective_depth_mm"] == pytest.approx(200 - c - g["bars"]["diameter_mm"] / 2), g["where"]
