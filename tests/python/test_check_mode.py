"""Check mode, rationalisation and the search grid (contract-v2 section 3):
reinforcement.given, reinforcement.rationalise, reinforcement.spacing_step_mm
and reinforcement.min_spacing_mm.

Scenario: the first floor of the community workshop, a strip continuous
over three spans, designed to EN 1992-1-1 (UK) unless said otherwise.
Brute-force searches here go through check mode itself (each candidate
given in turn), independent of the kernel's bar search.
"""
import copy
import math

import pytest

import armature

EN_BARS = {"8": 8.0, "10": 10.0, "12": 12.0, "16": 16.0, "20": 20.0, "25": 25.0}


@pytest.fixture
def floor():
    return {
        "code": "EN1992-1-1", "variant": "UK",
        "slab": {"spans_m": [4.2, 4.8, 4.2], "ends": ["pinned", "pinned"], "thickness_mm": 200},
        "concrete": {"class": "C30/37"},
        "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0},
    }


def _with(request, **reinforcement):
    req = copy.deepcopy(request)
    req.setdefault("reinforcement", {}).update(reinforcement)
    return req


def _region(result, where):
    return next(g for g in result["regions"] if g["where"] == where)


def _area(bar, spacing_mm, width_mm=1000.0):
    return math.pi * EN_BARS[bar] ** 2 / 4 * width_mm / spacing_mm


def _problems(request):
    with pytest.raises(armature.InputError) as e:
        armature.design(request)
    return str(e.value).splitlines()


def _preferred_key(bar, spacing_mm):
    """contract.md's tie rule: least area, then the larger spacing, then the smaller bar."""
    return (round(_area(bar, spacing_mm), 6), -spacing_mm, EN_BARS[bar])


# --- check mode -------------------------------------------------------------

def test_given_bars_as_designed_give_the_designed_checks(floor):
    """The designed bars of span 2, given back, are checked exactly as the
    search checked them: same checks, same result, only bars_given differs."""
    designed = armature.design(floor)
    bars = _region(designed, "span 2")["bars"]
    given = armature.design(_with(floor, given=[
        {"where": "span 2", "face": "bottom", "bar": bars["bar"], "spacing_mm": bars["spacing_mm"]}]))
    assert [g["bars_given"] for g in given["regions"]] == [g["where"] == "span 2" for g in given["regions"]]
    assert all(not g["bars_given"] for g in designed["regions"])
    for a, b in zip(designed["regions"], given["regions"]):
        assert {k: v for k, v in a.items() if k != "bars_given"} == {k: v for k, v in b.items() if k != "bars_given"}
    assert designed["checks"] == given["checks"]
    assert designed["status"] == given["status"] == "pass"


def test_given_spacing_above_the_maximum_fails_its_check_not_the_input(floor):
    """ø10 at 400 mm in a 200 mm slab: EN 1992-1-1 9.3.1.1(3) allows at most
    2h = 400 > 250 mm for principal bars where the moment is largest (UK NA
    keeps the recommended values, from memory), so the spacing check fails."""
    res = armature.design(_with(floor, given=[
        {"where": "span 1", "face": "bottom", "direction": "x", "bar": "10", "spacing_mm": 400}]))
    spacing = next(c for c in _region(res, "span 1")["checks"]
                   if c["id"] == "spacing" and "9.3.1.1" in c["clause"])
    assert spacing["demand"] == 400 and spacing["capacity"] == pytest.approx(250.0)
    assert not spacing["pass"]
    assert res["status"] == "fail"
    assert _region(res, "span 1")["bars"]["spacing_mm"] == 400
    assert _region(res, "span 1")["bars_given"] is True


def test_given_region_bending_capacity_by_hand(floor):
    """ø12 @ 150 given in span 1 with a 25 mm cover: As = π 12²/4 × 1000/150
    = 754.0 mm²; d = 200 − 25 − 6 = 169 mm; rectangular stress block
    (EN 1992-1-1 3.1.7(3), λ = 0.8, η = 1 for fck ≤ 50): fcd = αcc fck/γc
    = 0.85 × 30/1.5 = 17.0 MPa (UK NA αcc = 0.85, value from memory),
    fyd = 500/1.15 = 434.8 MPa, λx = As fyd/(η fcd b), z = d − λx/2 (≤ 0.95d),
    M_Rd = As fyd z (EN 1992-1-1 6.1)."""
    req = _with(floor, given=[{"where": "span 1", "face": "bottom", "bar": "12", "spacing_mm": 150}])
    req["durability"] = {"cover_mm": 25}
    g = _region(armature.design(req), "span 1")
    As = math.pi * 12 ** 2 / 4 * 1000 / 150
    d = 200 - 25 - 12 / 2
    fcd, fyd = 0.85 * 30 / 1.5, 500 / 1.15
    lam_x = As * fyd / (1.0 * fcd * 1000)
    z = min(d - lam_x / 2, 0.95 * d)
    M_Rd_kNm = As * fyd * z * 1e-6
    assert g["bars"]["As_prov_mm2"] == pytest.approx(As, rel=1e-12)
    assert g["effective_depth_mm"] == pytest.approx(d)
    bending = next(c for c in g["checks"] if c["id"] == "bending")
    assert bending["capacity"] == pytest.approx(M_Rd_kNm, rel=1e-9)
    assert M_Rd_kNm == pytest.approx(52.24, abs=0.01)


def test_given_bar_outside_the_candidate_list_is_accepted_and_sets_its_face_cover(floor):
    """A given bar need only be in the code's catalogue; with no cover given,
    a given ø25 takes part in the bottom face's cover like a chosen bar:
    EN 1992-1-1 4.4.1.2(3) c_min,b = φ = 25 mm, + Δc_dev 10 mm (4.4.1.3,
    recommended) = 35 mm."""
    req = _with(floor, bars=["8", "10"],
                given=[{"where": "span 2", "face": "bottom", "bar": "25", "spacing_mm": 300}])
    res = armature.design(req)
    assert _region(res, "span 2")["bars"]["bar"] == "25"
    assert res["cover_mm"]["bottom"] == pytest.approx(35.0)
    # every other bottom region is checked with that face cover: d = 200 − 35 − φ/2
    for where in ("span 1", "span 3"):
        g = _region(res, where)
        assert g["bars"]["bar"] in ("8", "10") and not g["bars_given"]
        assert g["effective_depth_mm"] == pytest.approx(200 - 35 - g["bars"]["diameter_mm"] / 2)


def test_given_top_bars_at_an_interior_support_aci(floor):
    """ACI 318-19: #5 at 300 mm over the first interior support (checked), the
    rest designed; the summary and the record say "given" for that region."""
    req = {
        "code": "ACI318-19",
        "slab": {"spans_m": [4.2, 4.8, 4.2], "ends": ["pinned", "pinned"], "thickness_mm": 200},
        "concrete": {"cylinder_strength_MPa": 28}, "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0},
        "reinforcement": {"given": [{"where": "support 2", "face": "top", "bar": "#5", "spacing_mm": 300}]},
    }
    res = armature.design(req)
    g = _region(res, "support 2")
    assert g["bars_given"] and g["bars"]["bar"] == "#5" and g["bars"]["spacing_mm"] == 300
    # #5: 200 mm² nominal (ACI 318-19 Appendix A / ASTM A615, 0.31 in²)
    assert g["bars"]["As_prov_mm2"] == pytest.approx(0.31 * 645.16 * 1000 / 300, rel=0.01)
    frame = armature.tables.compare(req, ["ACI318-19"])
    assert frame.loc[frame["where"] == "support 2", "bars_given"].tolist() == [True]
    assert frame.loc[frame["where"] != "support 2", "bars_given"].tolist() == [False] * (len(frame) - 1)


def test_summary_and_record_mark_given_bars(floor, tmp_path):
    res = armature.design(_with(floor, given=[{"where": "span 2", "face": "bottom", "bar": "12", "spacing_mm": 200}]))
    out = tmp_path / "record.md"
    armature.report(res, str(out))
    text = out.read_text()
    assert "ø12 @ 200 mm, As,prov = 565.5 mm2 (given: the request's bars, checked, not searched)" in text
    assert text.count("(given:") == 1


# --- the search grid --------------------------------------------------------

def test_grid_step_10_minimum_100_is_the_least_area_on_that_grid(floor):
    """With spacing_step_mm 10 and min_spacing_mm 100 the chosen spacing is
    on 100, 110, 120, ... and the least-area passing arrangement of the
    grid by contract.md's tie rule: checked by brute force over the grid,
    each candidate given in span 2 in turn (the other regions as designed)."""
    req = _with(floor, spacing_step_mm=10, min_spacing_mm=100)
    res = armature.design(req)
    for g in res["regions"] + [dict(res["distribution"], where="distribution")]:
        s = g["bars"]["spacing_mm"] if "bars" in g else g["spacing_mm"]
        assert s >= 100 and (s - 100) % 10 == 0, g["where"]
    passing = []
    for bar in EN_BARS:
        for s in range(100, 260, 10):  # EN 9.3.1.1(3): at most 250 mm here
            trial = armature.design(_with(req, given=[{"where": "span 2", "face": "bottom", "bar": bar, "spacing_mm": s}]))
            if trial["status"] == "pass":
                passing.append((bar, s))
    best = min(passing, key=lambda c: _preferred_key(*c))
    chosen = _region(res, "span 2")["bars"]
    assert (chosen["bar"], chosen["spacing_mm"]) == (best[0], float(best[1]))


def test_default_grid_is_75_plus_25k(floor):
    """Defaults 75 and 25 mm (contract-v2 3): given explicitly, the same result."""
    assert armature.design(_with(floor, spacing_step_mm=25, min_spacing_mm=75)) == armature.design(floor)


# --- uniform bottom bars ----------------------------------------------------

def test_uniform_bottom_is_the_least_area_common_arrangement(floor):
    """Spans of 3.0, 5.4 and 3.0 m: the outer spans alone would take less steel
    than the middle one. rationalise uniform_bottom gives every span the same
    bars, each passing, and the least-area arrangement passing in all three
    (brute force over the grid, each candidate given in all three spans)."""
    floor["slab"]["spans_m"] = [3.0, 5.4, 3.0]
    own = armature.design(floor)
    res = armature.design(_with(floor, rationalise="uniform_bottom"))
    spans = [g for g in res["regions"] if g["face"] == "bottom"]
    assert len({(g["bars"]["bar"], g["bars"]["spacing_mm"]) for g in spans}) == 1
    assert res["status"] == "pass"
    assert all(c["pass"] for g in spans for c in g["checks"])
    own_areas = [g["bars"]["As_prov_mm2"] for g in own["regions"] if g["face"] == "bottom"]
    assert min(own_areas) < max(own_areas)  # the spans differ when each is searched alone
    passing = []
    for bar in EN_BARS:
        for s in range(75, 275, 25):
            given = [{"where": w, "face": "bottom", "bar": bar, "spacing_mm": s} for w in ("span 1", "span 2", "span 3")]
            if armature.design(_with(floor, given=given))["status"] == "pass":
                passing.append((bar, s))
    best = min(passing, key=lambda c: _preferred_key(*c))
    assert (spans[0]["bars"]["bar"], spans[0]["bars"]["spacing_mm"]) == (best[0], float(best[1]))
    # top bars stay per support, as designed without rationalising
    for a, b in zip(own["regions"], res["regions"]):
        if a["face"] == "top":
            assert a["bars"] == b["bars"]


def test_given_bars_take_precedence_over_rationalising(floor):
    floor["slab"]["spans_m"] = [3.0, 5.4, 3.0]
    res = armature.design(_with(floor, rationalise="uniform_bottom",
                                given=[{"where": "span 2", "face": "bottom", "bar": "16", "spacing_mm": 200}]))
    assert _region(res, "span 2")["bars"]["bar"] == "16" and _region(res, "span 2")["bars_given"]
    assert _region(res, "span 1")["bars"] == _region(res, "span 3")["bars"]
    assert _region(res, "span 1")["bars"]["bar"] != "16" or _region(res, "span 1")["bars"]["spacing_mm"] != 200


def test_rationalise_none_is_the_default(floor):
    assert armature.design(_with(floor, rationalise="none")) == armature.design(floor)


# --- bad input: each problem names its field, nothing is designed -----------

@pytest.mark.parametrize("reinforcement, field, words", [
    ({"spacing_step_mm": 2}, "reinforcement.spacing_step_mm", "between 5 and 100 mm"),
    ({"spacing_step_mm": 150}, "reinforcement.spacing_step_mm", "between 5 and 100 mm"),
    ({"spacing_step_mm": "25"}, "reinforcement.spacing_step_mm", "must be a number"),
    ({"min_spacing_mm": 10}, "reinforcement.min_spacing_mm", "between 20 and 300 mm"),
    ({"min_spacing_mm": 350}, "reinforcement.min_spacing_mm", "between 20 and 300 mm"),
    ({"rationalise": "uniform"}, "reinforcement.rationalise", "\"none\" or \"uniform_bottom\""),
    ({"rationalise": 1}, "reinforcement.rationalise", "must be a string"),
    ({"given": {"where": "span 1"}}, "reinforcement.given", "must be a list"),
    ({"given": ["span 1"]}, "reinforcement.given[0]", "must be an object"),
    ({"given": [{"where": "span 9", "face": "bottom", "bar": "12", "spacing_mm": 150}]},
     "reinforcement.given[0].where", "no region 'span 9'"),
    ({"given": [{"where": "span 1", "face": "top", "bar": "12", "spacing_mm": 150}]},
     "reinforcement.given[0].face", "'span 1' is a bottom region"),
    ({"given": [{"where": "span 1", "face": "side", "bar": "12", "spacing_mm": 150}]},
     "reinforcement.given[0].face", "\"top\" or \"bottom\""),
    ({"given": [{"where": "span 1", "face": "bottom", "bar": "14", "spacing_mm": 150}]},
     "reinforcement.given[0].bar", "unknown bar '14'"),
    ({"given": [{"where": "span 1", "face": "bottom", "bar": "12", "spacing_mm": 0}]},
     "reinforcement.given[0].spacing_mm", "greater than 0 mm"),
    ({"given": [{"where": "span 1", "face": "bottom", "bar": "12", "spacing_mm": -150}]},
     "reinforcement.given[0].spacing_mm", "greater than 0 mm"),
    ({"given": [{"where": "span 1", "face": "bottom", "bar": "12"}]},
     "reinforcement.given[0].spacing_mm", "required"),
    ({"given": [{"where": "span 1", "face": "bottom", "bar": "12", "spacing_mm": 150, "direction": "y"}]},
     "reinforcement.given[0].direction", "\"x\""),
    ({"given": [{"where": "span 1", "face": "bottom", "bar": "12", "spacing_mm": 150, "layer": 2}]},
     "reinforcement.given[0].layer", "unknown field"),
    ({"given": [{"where": "span 1", "face": "bottom", "bar": "12", "spacing_mm": 150},
                {"where": "span 1", "face": "bottom", "bar": "10", "spacing_mm": 150}]},
     "reinforcement.given[1].where", "already listed in reinforcement.given[0]"),
])
def test_bad_input_names_its_field(floor, reinforcement, field, words):
    lines = _problems(_with(floor, **reinforcement))
    assert any(line.startswith(field + ":") and words in line for line in lines), lines


def test_non_finite_given_spacing_is_refused(floor):
    """JSON has no NaN, but Python dicts do."""
    lines = _problems(_with(floor, given=[{"where": "span 1", "face": "bottom", "bar": "12", "spacing_mm": float("nan")}]))
    assert any(line.startswith("reinforcement.given[0].spacing_mm:") for line in lines), lines


def test_all_problems_together_with_the_regions_given(floor):
    """A wrong region is reported beside the request's other problems."""
    req = _with(floor, spacing_step_mm=1,
                given=[{"where": "span 4", "face": "bottom", "bar": "12", "spacing_mm": 150},
                       {"where": "support 3", "face": "bottom", "bar": "40x", "spacing_mm": 150}])
    req["concrete"]["class"] = "C31/38"
    fields = {line.split(":")[0] for line in _problems(req)}
    assert {"concrete.class", "reinforcement.spacing_step_mm", "reinforcement.given[0].where",
            "reinforcement.given[1].face", "reinforcement.given[1].bar"} <= fields


def test_a_pinned_end_has_top_bars_only_under_a_partial_fixity_rule(floor):
    """EN 1992-1-1 9.3.1.2(2): top steel at a pinned end (so 'support 1' is a
    region); ACI 318-19 asks for none, so 'support 1' is no region there."""
    given = [{"where": "support 1", "face": "top", "bar": "10", "spacing_mm": 250}]
    assert _region(armature.design(_with(floor, given=given)), "support 1")["bars_given"]
    aci = {
        "code": "ACI318-19",
        "slab": {"spans_m": [4.2, 4.8, 4.2], "ends": ["pinned", "pinned"], "thickness_mm": 200},
        "concrete": {"cylinder_strength_MPa": 28}, "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0},
        "reinforcement": {"given": [{"where": "support 1", "face": "top", "bar": "#4", "spacing_mm": 250}]},
    }
    lines = _problems(aci)
    assert lines[0].startswith("reinforcement.given[0].where: no region 'support 1'")
    assert "pinned end" in lines[0]


def test_a_cantilever_has_no_bottom_region(floor):
    floor["slab"]["spans_m"] = [4.2, 1.5]
    floor["slab"]["ends"] = ["pinned", "free"]
    lines = _problems(_with(floor, given=[{"where": "span 2", "face": "bottom", "bar": "12", "spacing_mm": 150}]))
    assert lines == ["reinforcement.given[0].where: no region 'span 2' in this strip; its regions are "
                     "support 1 (top), span 1 (bottom), support 2 (top)"]


def test_min_spacing_above_the_code_limit_fails_the_spacing_check(floor):
    """min_spacing_mm 300 in a 120 mm slab: EN 1992-1-1 9.3.1.1(3) allows
    min(2h, 250) = 240 mm, so every main region gets 300 mm and fails its
    spacing check: a failed design, not an input error."""
    floor["slab"]["thickness_mm"] = 120
    res = armature.design(_with(floor, min_spacing_mm=300))
    assert res["status"] == "fail"
    for g in res["regions"]:
        assert g["bars"]["spacing_mm"] == 300
        limit = next(c for c in g["checks"] if c["id"] == "spacing" and "9.3.1.1" in c["clause"])
        assert limit["capacity"] == pytest.approx(240.0) and not limit["pass"]


def test_sweep_over_given_spacings_marks_the_given_region(floor):
    """A sweep in check mode: the given region's column says bars_given,
    its bar and spacing are the swept ones, and its provided area is
    π φ²/4 × 1000/s (geometry); the other regions are designed."""
    base = _with(floor, given=[{"where": "span 2", "face": "bottom", "bar": "12", "spacing_mm": 150}])
    study = armature.sweep(base, {"reinforcement.given[0].spacing_mm": [125, 200, 300]})
    assert list(study["span 2 bars_given"]) == [True, True, True]
    assert list(study["span 1 bars_given"]) == [False, False, False]
    assert list(study["span 2 spacing_mm"]) == [125, 200, 300]
    for s, area in zip([125, 200, 300], study["span 2 As_prov_mm2"]):
        assert area == pytest.approx(_area("12", s), rel=1e-9)
    # Without check mode the study has no bars_given columns.
    plain = armature.sweep(floor, {"slab.thickness_mm": [200]})
    assert not [c for c in plain.columns if c.endswith("bars_given")]


def test_a_plate_region_takes_given_bars_in_each_direction_once():
    """A bay of a two-way slab has bottom bars in x and in y: both may be
    given; the same region, face and direction twice is refused, naming the
    entry."""
    base = {"code": "EN1992-1-1", "variant": "recommended", "concrete": {"class": "C30/37"},
            "slab": {"type": "two_way", "x_spans_m": [5.0], "y_spans_m": [4.0], "thickness_mm": 200,
                     "edges": {"x0": "pinned", "x1": "pinned", "y0": "pinned", "y1": "pinned"}},
            "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0}}
    both = copy.deepcopy(base)
    both["reinforcement"] = {"given": [
        {"where": "bay 1,1", "face": "bottom", "direction": "x", "bar": "10", "spacing_mm": 150},
        {"where": "bay 1,1", "face": "bottom", "direction": "y", "bar": "10", "spacing_mm": 200}]}
    r = armature.design(both)
    got = {g["direction"]: g for g in r["regions"] if g["where"] == "bay 1,1" and g["face"] == "bottom"}
    assert got["x"]["bars_given"] and got["x"]["bars"]["spacing_mm"] == 150
    assert got["y"]["bars_given"] and got["y"]["bars"]["spacing_mm"] == 200
    twice = copy.deepcopy(both)
    twice["reinforcement"]["given"][1]["direction"] = "x"
    lines = _problems(twice)
    assert any(line.startswith("reinforcement.given[1].where:") and "already listed in reinforcement.given[0]" in line
               for line in lines), lines
