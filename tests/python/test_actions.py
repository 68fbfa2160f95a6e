"""Named actions (loads.actions): input errors naming the field, located
loads against beam-table closed forms, the choice of leading variable
action, and the actions and combinations listed in the result.

Scenarios are our own: the small community workshop building (a roof slab
over the workshop, the first floor with benches and a water tank)."""
import copy
import math

import pytest

import armature

BASE = {
    "code": "EN1992-1-1",
    "variant": "recommended",
    "slab": {"spans_m": [5.0], "ends": ["pinned", "pinned"], "thickness_mm": 200},
    "concrete": {"class": "C30/37"},
    "reinforcement": {"yield_strength_MPa": 500},
    "loads": {"actions": []},
    "durability": {"cover_mm": 25, "exposure": "XC1"},
}
SELF_WEIGHT_KPA = 25.0 * 0.2  # EN 1991-1-1 Table A.1: 25 kN/m³ (value from memory) × 0.2 m


def request(actions, spans=(5.0,), ends=("pinned", "pinned"), **loads):
    r = copy.deepcopy(BASE)
    r["slab"]["spans_m"] = list(spans)
    r["slab"]["ends"] = list(ends)
    r["loads"] = dict(loads, actions=actions)
    return r


def region(result, where):
    return next(g for g in result["regions"] if g["where"] == where)


def problems_of(req):
    with pytest.raises(armature.InputError) as e:
        armature.design(req)
    return str(e.value).splitlines()


# ---- bad input: every problem named by its field, all together -------------

TANK = {"name": "tank", "kind": "imposed", "category": "E", "point_kN": 12.0, "span": 1, "at_m": 2.0,
        "effective_width_m": 1.2}

BAD = [
    ("negative kPa", {"name": "a", "kind": "permanent", "kPa": -1.0}, "loads.actions[0].kPa"),
    ("kPa not finite", {"name": "a", "kind": "permanent", "kPa": "1e999"}, "loads.actions[0].kPa"),
    ("negative line load", {"name": "a", "kind": "permanent", "line_kN_per_m": -3, "span": 1, "at_m": 1},
     "loads.actions[0].line_kN_per_m"),
    ("line load outside its span", {"name": "a", "kind": "permanent", "line_kN_per_m": 3, "span": 1, "at_m": 5.5},
     "loads.actions[0].at_m"),
    ("negative position", {"name": "a", "kind": "permanent", "line_kN_per_m": 3, "span": 1, "at_m": -0.5},
     "loads.actions[0].at_m"),
    ("line load without position", {"name": "a", "kind": "permanent", "line_kN_per_m": 3, "span": 1},
     "loads.actions[0].at_m"),
    ("line load without span", {"name": "a", "kind": "permanent", "line_kN_per_m": 3, "at_m": 1},
     "loads.actions[0].span"),
    ("span out of range", {"name": "a", "kind": "permanent", "kPa": 1, "span": 3}, "loads.actions[0].span"),
    ("span not whole", {"name": "a", "kind": "permanent", "kPa": 1, "span": 1.5}, "loads.actions[0].span"),
    ("from after to", {"name": "a", "kind": "permanent", "kPa": 1, "span": 1, "from_m": 3, "to_m": 2},
     "loads.actions[0].to_m"),
    ("to beyond the span", {"name": "a", "kind": "permanent", "kPa": 1, "span": 1, "to_m": 6},
     "loads.actions[0].to_m"),
    ("from without span", {"name": "a", "kind": "permanent", "kPa": 1, "from_m": 1}, "loads.actions[0].from_m"),
    ("unknown kind", {"name": "a", "kind": "wind", "kPa": 1}, "loads.actions[0].kind"),
    ("unknown category", {"name": "a", "kind": "imposed", "category": "Z", "kPa": 1},
     "loads.actions[0].category"),
    ("imposed without category", {"name": "a", "kind": "imposed", "kPa": 1}, "loads.actions[0].category"),
    ("category on snow", {"name": "a", "kind": "snow", "category": "A", "kPa": 1}, "loads.actions[0].category"),
    ("unknown key", {"name": "a", "kind": "permanent", "kPa": 1, "height_m": 2}, "loads.actions[0].height_m"),
    ("two distributions", {"name": "a", "kind": "permanent", "kPa": 1, "point_kN": 2}, "loads.actions[0]"),
    ("no distribution", {"name": "a", "kind": "permanent"}, "loads.actions[0]"),
    ("point load without effective width", {k: v for k, v in TANK.items() if k != "effective_width_m"},
     "loads.actions[0].effective_width_m"),
    ("zero effective width", dict(TANK, effective_width_m=0), "loads.actions[0].effective_width_m"),
    ("empty name", {"name": " ", "kind": "permanent", "kPa": 1}, "loads.actions[0].name"),
    ("missing name", {"kind": "permanent", "kPa": 1}, "loads.actions[0].name"),
    ("name taken by the self-weight", {"name": "self-weight", "kind": "permanent", "kPa": 1},
     "loads.actions[0].name"),
    ("not an object", "snow", "loads.actions[0]"),
]


@pytest.mark.parametrize("name,action,field", BAD, ids=[b[0] for b in BAD])
def test_bad_action_names_its_field(name, action, field):
    if action == {"name": "a", "kind": "permanent", "kPa": "1e999"}:
        action = {"name": "a", "kind": "permanent", "kPa": math.inf}
    lines = problems_of(request([action]))
    assert any(line.startswith(field + ": ") for line in lines), lines


def test_point_load_without_width_says_what_is_missing():
    lines = problems_of(request([{k: v for k, v in TANK.items() if k != "effective_width_m"}]))
    assert any("effective width" in line and "neither EN 1992-1-1 nor ACI 318-19" in line for line in lines), lines


def test_every_problem_is_raised_together():
    lines = problems_of(request([
        {"name": "wall", "kind": "permanent", "line_kN_per_m": 7.5, "span": 1, "at_m": 9.0},
        {"name": "wall", "kind": "imposed", "category": "Q", "kPa": 2.0},
    ]))
    fields = {line.split(": ")[0] for line in lines}
    assert {"loads.actions[0].at_m", "loads.actions[1].name", "loads.actions[1].category"} <= fields, lines


def test_imposed_shorthand_is_required_without_actions():
    r = request([])
    del r["loads"]["actions"]
    assert any(line.startswith("loads.imposed_kPa: required") for line in problems_of(r))


# ---- located loads against closed forms -------------------------------------

def test_point_load_on_a_simple_span_gives_the_moment_under_the_load():
    """Simply supported span, point load P at a (b = L - a): M = P a b / L
    under the load (any beam table; value from memory), with the
    self-weight's 1.35 g x (L - x) / 2 there. EN 1990 (6.10) recommended:
    1.35 Gk + 1.5 Qk (Table A1.2(B))."""
    L, a, P, beff = 5.0, 2.0, 20.0, 1.0
    res = armature.design(request([dict(TANK, point_kN=P, at_m=a, effective_width_m=beff)]))
    g = region(res, "span 1")
    expected = 1.35 * SELF_WEIGHT_KPA * a * (L - a) / 2 + 1.5 * P * a * (L - a) / L
    assert g["design_moment_kNm"] == pytest.approx(expected, rel=1e-9)
    assert g["x_m"] == pytest.approx(a, rel=1e-12)  # exactly under the load


def test_point_load_is_spread_over_its_effective_width():
    """The 1 m strip takes P b / beff: the load per metre in the loaded band
    (DEVELOPERS.md). Half the width, twice the point-load moment."""
    L, a, P = 5.0, 2.0, 20.0
    wide = region(armature.design(request([dict(TANK, point_kN=P, at_m=a, effective_width_m=2.0)])), "span 1")
    narrow = region(armature.design(request([dict(TANK, point_kN=P, at_m=a, effective_width_m=0.5)])), "span 1")
    sw = 1.35 * SELF_WEIGHT_KPA * a * (L - a) / 2
    point = 1.5 * P * a * (L - a) / L
    assert wide["design_moment_kNm"] == pytest.approx(sw + point / 2, rel=1e-9)
    assert narrow["design_moment_kNm"] == pytest.approx(sw + point * 2, rel=1e-9)


def test_line_load_across_the_strip():
    """A block wall on a simple 4 m span at 1.5 m, 10 kN/m along the wall:
    the 1 m strip takes 10 kN there, M = 1.35 P a b / L + 1.35 g x (L - x)/2
    under the wall (beam table, value from memory)."""
    L, a, q = 4.0, 1.5, 10.0
    res = armature.design(request([{"name": "block wall", "kind": "permanent", "line_kN_per_m": q, "span": 1,
                                    "at_m": a}], spans=(L,)))
    g = region(res, "span 1")
    assert g["design_moment_kNm"] == pytest.approx(1.35 * (q * a * (L - a) / L + SELF_WEIGHT_KPA * a * (L - a) / 2),
                                                   rel=1e-9)
    assert g["x_m"] == pytest.approx(a, rel=1e-12)


def test_partial_uniform_load_by_statics():
    """Stored benches over the left half of a simple 5 m span, 6 kPa
    permanent on [0, 2.5]: R_A = g L / 2 + 3 q L / 8; V = 0 at x0 = R_A /
    (g + q) within the loaded half; M = R_A x0 - (g + q) x0^2 / 2 (statics of
    the span), all times 1.35."""
    L, q, g = 5.0, 6.0, SELF_WEIGHT_KPA
    res = armature.design(request([{"name": "benches", "kind": "permanent", "kPa": q, "span": 1, "from_m": 0,
                                    "to_m": L / 2}]))
    R_A = g * L / 2 + 3 * q * L / 8
    x0 = R_A / (g + q)
    assert x0 < L / 2
    M = R_A * x0 - (g + q) * x0 ** 2 / 2
    r = region(res, "span 1")
    assert r["design_moment_kNm"] == pytest.approx(1.35 * M, rel=1e-9)
    assert r["x_m"] == pytest.approx(x0, rel=1e-9)


def test_two_equal_spans_with_central_point_loads():
    """Two equal continuous spans, a permanent point load at each mid-span:
    support moment 3 P L / 16, plus w L^2 / 8 of the self-weight (beam
    tables, value from memory); 1.35 on both by 6.10 (no variable action)."""
    L, P = 4.0, 30.0
    actions = [{"name": f"plinth {k}", "kind": "permanent", "point_kN": P, "span": k, "at_m": L / 2,
                "effective_width_m": 1.0} for k in (1, 2)]
    res = armature.design(request(actions, spans=(L, L)))
    top = region(res, "support 2")
    assert top["design_moment_kNm"] == pytest.approx(1.35 * (3 * P * L / 16 + SELF_WEIGHT_KPA * L ** 2 / 8), rel=1e-9)
    assert res["loads"]["combination"] == "6.10: 1.35 Gk"


def test_uniform_action_equals_the_shorthand():
    """A whole-strip kPa action is the same load as loads.dead_kPa: the same
    design moments (the result lists the actions only with loads.actions)."""
    short = armature.design(request([{"name": "screed", "kind": "permanent", "kPa": 1.8},
                                     {"name": "benches", "kind": "imposed", "category": "C", "kPa": 4.0}]))
    base = copy.deepcopy(BASE)
    base["loads"] = {"dead_kPa": 1.8, "imposed_kPa": 4.0, "imposed_category": "C"}
    v1 = armature.design(base)
    assert "actions" not in v1["loads"]
    for a, b in zip(short["regions"], v1["regions"]):
        assert a["design_moment_kNm"] == pytest.approx(b["design_moment_kNm"], rel=1e-12)
    assert short["loads"]["uls_kPa"] == pytest.approx(v1["loads"]["uls_kPa"], rel=1e-12)


# ---- the leading variable action -------------------------------------------

def test_floor_with_imposed_and_snow_leads_with_imposed():
    """Category C 4.0 kPa with 0.6 kPa snow (a terrace floor), recommended
    values: leading imposed 1.35 G + 1.5 x 4.0 + 1.5 x 0.5 x 0.6 = 1.35 G +
    6.45; leading snow 1.35 G + 1.5 x 0.6 + 1.5 x 0.7 x 4.0 = 1.35 G + 5.1
    (EN 1990 (6.10), Table A1.1: ψ0 = 0.7 for C, 0.5 for snow)."""
    res = armature.design(request([{"name": "benches", "kind": "imposed", "category": "C", "kPa": 4.0},
                                   {"name": "snow", "kind": "snow", "kPa": 0.6}]))
    loads = res["loads"]
    assert loads["uls_kPa"] == pytest.approx(1.35 * SELF_WEIGHT_KPA + 6.45, rel=1e-12)
    assert loads["combination"] == "6.10, leading imposed: 1.35 Gk + 1.5 benches + 0.75 snow"
    labels = [c["label"] for c in loads["combinations"] if c["limit_state"] == "ULS"]
    assert "6.10, leading snow: 1.35 Gk + 1.05 benches + 1.5 snow" in labels


def test_roof_with_imposed_and_snow_takes_them_apart():
    """Roof over the workshop: roof imposed 0.4 kPa (category H) and snow
    0.8 kPa. Roof imposed loads are not combined with snow (EN 1991-1-1
    3.3.2(1), from memory): 1.35 G + 1.5 x 0.8 governs over 1.35 G + 1.5 x 0.4."""
    res = armature.design(request([{"name": "roof maintenance", "kind": "roof", "kPa": 0.4},
                                   {"name": "snow", "kind": "snow", "kPa": 0.8}]))
    loads = res["loads"]
    assert loads["uls_kPa"] == pytest.approx(1.35 * SELF_WEIGHT_KPA + 1.5 * 0.8, rel=1e-12)
    assert loads["combination"] == "6.10, leading snow: 1.35 Gk + 1.5 snow"
    uls = [c for c in loads["combinations"] if c["limit_state"] == "ULS"]
    for c in uls:  # never both
        assert c["factors"]["roof maintenance"] == 0 or c["factors"]["snow"] == 0, c


def test_result_lists_actions_and_combinations():
    """Every action by name with kind, value and place; every combination
    with its factor per action (a factor that could be wrong: 1.5 x 0.7)."""
    res = armature.design(request([{"name": "screed", "kind": "permanent", "kPa": 1.8}, TANK,
                                   {"name": "snow", "kind": "snow", "kPa": 0.6}], dead_kPa=0.5))
    names = [a["name"] for a in res["loads"]["actions"]]
    assert names == ["self-weight", "superimposed dead", "screed", "tank", "snow"]
    tank = res["loads"]["actions"][3]
    assert tank == {"name": "tank", "kind": "imposed", "category": "E", "distribution": "point",
                    "point_kN": 12.0, "span": 1, "at_m": 2.0, "effective_width_m": 1.2}
    lead_snow = next(c for c in res["loads"]["combinations"] if c["label"].startswith("6.10, leading snow"))
    # EN 1990 Table A1.1: ψ0 = 1.0 for category E (storage), recommended.
    assert lead_snow["factors"]["tank"] == pytest.approx(1.5 * 1.0)
    assert lead_snow["factors"]["snow"] == 1.5
    qp = next(c for c in res["loads"]["combinations"] if c["limit_state"] == "SLS quasi-permanent")
    assert qp["factors"]["tank"] == pytest.approx(0.8)  # ψ2 of category E
    assert qp["factors"]["snow"] == 0.0                 # ψ2 of snow, altitude ≤ 1000 m


def test_aci_reads_kinds_as_D_L_Lr_S():
    """ACI 318-19 5.3.1: with D, L and S: (b) 1.2 D + 1.6 L + 0.5 S and (c)
    1.2 D + 1.6 S + 1.0 L (5.3.3's 0.5 L not taken)."""
    r = request([{"name": "benches", "kind": "imposed", "category": "C", "kPa": 4.0},
                 {"name": "snow", "kind": "snow", "kPa": 1.0}])
    r["code"] = "ACI318-19"
    del r["variant"]
    r["concrete"] = {"cylinder_strength_MPa": 28}
    r["reinforcement"] = {"yield_strength_MPa": 420}
    r["durability"] = {"cover_mm": 20}
    res = armature.design(r)
    labels = [c["label"] for c in res["loads"]["combinations"] if c["limit_state"] == "ULS"]
    assert labels == ["5.3.1a: 1.4 D", "5.3.1b: 1.2 D + 1.6 L + 0.5 S", "5.3.1c: 1.2 D + 1.6 S + 1 L"]
    sw = 23.6 * 0.2  # 150 lb/ft³ (common practice)
    assert res["loads"]["uls_kPa"] == pytest.approx(1.2 * sw + 1.6 * 4.0 + 0.5 * 1.0, rel=1e-12)


def test_aci_reads_an_imposed_category_h_load_as_roof_live_load():
    """EN 1990 category H (roofs not accessible but for maintenance) is
    ACI 318-19's roof live load Lr: (b) 1.2 D + 0.5 Lr with no L (ACI
    5.3.1, by equation), the same as kind "roof"."""
    def labels(kind):
        r = request([{"name": "maintenance", "kind": kind, "category": "H", "kPa": 0.6}])
        r["code"] = "ACI318-19"
        del r["variant"]
        r["concrete"] = {"cylinder_strength_MPa": 28}
        r["reinforcement"] = {"yield_strength_MPa": 420}
        r["durability"] = {"cover_mm": 20}
        return [c["label"] for c in armature.design(r)["loads"]["combinations"] if c["limit_state"] == "ULS"]
    assert labels("imposed") == labels("roof")
    assert any(label.endswith("1.6 Lr") for label in labels("imposed"))


# ---- EQU: uplift at the back span's far support --------------------------------

def balcony(wall_kN_per_m):
    """A 4 m back span pinned at its far end with a 1.5 m cantilever
    balcony carrying a planter wall at its tip and 4 kPa category C."""
    return request([{"name": "benches", "kind": "imposed", "category": "C", "kPa": 4.0},
                    {"name": "planter wall", "kind": "permanent", "line_kN_per_m": wall_kN_per_m, "span": 2,
                     "at_m": 1.5}], spans=(4.0, 1.5), ends=("pinned", "free"))


def equilibrium_check(res):
    found = [c for s in res["supports"] for c in s["checks"] if c["id"] == "equilibrium"]
    assert len(found) == 1, found
    return found[0]


@pytest.mark.parametrize("wall,uplift", [(20.0, True), (2.0, False)])
def test_cantilever_equilibrium_by_hand_statics(wall, uplift):
    """EN 1990 Table A1.2(A) (recommended): γG,inf 0.90 on the back span,
    γG,sup 1.10 and γQ 1.5 on the cantilever only. Moments about the
    cantilever's root (statics): R_stb = 0.9 g L / 2; R_dst = (1.1 g Lc^2 / 2
    + 1.1 P Lc + 1.5 q Lc^2 / 2) / L, g the self-weight."""
    L, Lc, g, q = 4.0, 1.5, SELF_WEIGHT_KPA, 4.0
    res = armature.design(balcony(wall))
    c = equilibrium_check(res)
    R_stb = 0.9 * g * L / 2
    R_dst = (1.1 * g * Lc ** 2 / 2 + 1.1 * wall * Lc + 1.5 * q * Lc ** 2 / 2) / L
    assert c["where"] == "support 1"
    assert c["capacity"] == pytest.approx(R_stb, rel=1e-9)
    assert c["demand"] == pytest.approx(R_dst, rel=1e-9)
    assert c["pass"] is (not uplift)
    assert (res["status"] == "fail") if uplift else True


def test_equilibrium_is_checked_for_a_shorthand_request():
    """A request of the shorthands alone (version 1 form) with a cantilever
    gets the same EQU check: a 2.4 m cantilever on a 3.0 m back span lifts
    off. EN 1990 Table A1.2(A) (recommended), moments about the root
    (statics): R_stb = 0.9 (g + gd) L / 2, R_dst = (1.1 (g + gd) + 1.5 q) Lc^2 / (2 L)."""
    r = copy.deepcopy(BASE)
    r["slab"].update(spans_m=[3.0, 2.4], ends=["pinned", "free"])
    r["loads"] = {"dead_kPa": 1.0, "imposed_kPa": 4.0, "imposed_category": "C"}
    res = armature.design(r)
    c = equilibrium_check(res)
    L, Lc, G, q = 3.0, 2.4, SELF_WEIGHT_KPA + 1.0, 4.0
    assert c["where"] == "support 1"
    assert c["capacity"] == pytest.approx(0.9 * G * L / 2, rel=1e-9)
    assert c["demand"] == pytest.approx((1.1 * G + 1.5 * q) * Lc ** 2 / (2 * L), rel=1e-9)
    assert c["pass"] is False and res["status"] == "fail"
    assert "actions" not in res["loads"]  # the version 1 loads object


def test_aci_cantilever_equilibrium_by_hand_statics():
    """ACI 318-19 5.3.1 (a) 1.4D and (b) 1.2D + 1.6L with L on the span
    that lifts the far support, here the cantilever alone (D at one factor
    on every span; 0.9D goes only with W or E): the least far-support
    reaction of the two, by moments about the root."""
    L, Lc, P, q = 4.0, 1.5, 12.0, 4.0
    r = balcony(P)
    r["code"] = "ACI318-19"
    del r["variant"]
    r["concrete"] = {"cylinder_strength_MPa": 28}
    r["reinforcement"] = {"yield_strength_MPa": 420}
    r["durability"] = {"cover_mm": 20}
    c = equilibrium_check(armature.design(r))
    g = 23.6 * 0.2  # 150 lb/ft³ (common practice)
    cases = []
    for d, l in ((1.4, 0.0), (1.2, 1.6)):
        stb = d * g * L / 2
        dst = (d * g * Lc ** 2 / 2 + d * P * Lc + l * q * Lc ** 2 / 2) / L
        cases.append((stb - dst, stb, dst))
    _, stb, dst = min(cases)
    assert c["capacity"] == pytest.approx(stb, rel=1e-9)
    assert c["demand"] == pytest.approx(dst, rel=1e-9)
    assert c["clause"] == "ACI 318-19 5.3.1, L on the spans that lift the support"


def reactions_by_stiffness(spans, ends, w_per_span, elements=8):
    """Support reactions (kN, upward) of a continuous beam under uniform
    loads per span (kN/m), by a general stiffness solution with numpy
    (Euler-Bernoulli elements with consistent loads; uniform EI); ends
    "pinned" or "free". Independent of the project's analysis."""
    np = pytest.importorskip("numpy")
    xs = [0.0]
    for L in spans:
        xs += [xs[-1] + L * (i + 1) / elements for i in range(elements)]
    nn = len(xs)
    K = np.zeros((2 * nn, 2 * nn))
    F = np.zeros(2 * nn)
    for e in range(nn - 1):
        span = e // elements
        le = xs[e + 1] - xs[e]
        k = np.array([[12, 6 * le, -12, 6 * le], [6 * le, 4 * le ** 2, -6 * le, 2 * le ** 2],
                      [-12, -6 * le, 12, -6 * le], [6 * le, 2 * le ** 2, -6 * le, 4 * le ** 2]]) / le ** 3
        dofs = [2 * e, 2 * e + 1, 2 * e + 2, 2 * e + 3]
        K[np.ix_(dofs, dofs)] += k
        w = w_per_span[span]
        F[dofs] += -w * np.array([le / 2, le ** 2 / 12, le / 2, -le ** 2 / 12])
    support_nodes = [i * elements for i in range(len(spans) + 1)]
    if ends[0] == "free":
        support_nodes = support_nodes[1:]
    if ends[1] == "free":
        support_nodes = support_nodes[:-1]
    fixed = [2 * i for i in support_nodes]
    free = [d for d in range(2 * nn) if d not in fixed]
    u = np.zeros(2 * nn)
    u[free] = np.linalg.solve(K[np.ix_(free, free)], F[free])
    R = K @ u - F
    return {i // elements: R[2 * i] for i in support_nodes}  # keyed by support index


def test_equilibrium_counts_every_span_that_lifts_the_far_support():
    """A 1.0 m cantilever on spans of 3, 3 and 6 m (200 mm slab, 5 kPa
    category C): the far span's loads also lift support 3 (influence of a
    reaction changes sign only at supports), so it takes γG,sup 1.1 and
    γQ 1.5 like the cantilever; spans that hold support 3 down take γG,inf
    0.9 (EN 1990 Table A1.2(A), recommended). Each span's share of the
    reaction by an independent stiffness solution (numpy)."""
    spans, ends, q = [1.0, 3.0, 3.0, 6.0], ["free", "pinned"], 5.0
    r = copy.deepcopy(BASE)
    r["slab"].update(spans_m=spans, ends=ends)
    r["loads"] = {"imposed_kPa": q, "imposed_category": "C"}
    c = equilibrium_check(armature.design(r))
    g = SELF_WEIGHT_KPA
    R_stb = R_dst = 0.0
    for e in range(len(spans)):
        unit = [1.0 if k == e else 0.0 for k in range(len(spans))]
        share = reactions_by_stiffness(spans, ends, unit)[2]  # support 3, per kN/m on span e
        if share < 0:
            R_dst -= (1.1 * g + 1.5 * q) * share
        else:
            R_stb += 0.9 * g * share
    assert c["where"] == "support 3"
    assert c["capacity"] == pytest.approx(R_stb, rel=1e-6)
    assert c["demand"] == pytest.approx(R_dst, rel=1e-6)
    assert R_dst > R_stb and c["pass"] is False  # the far span's loads lift it too
