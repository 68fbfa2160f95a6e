"""Continuous strips and cantilevers to EN 1992-1-1: region moments and
support shears against an independent three-moment solution (numpy) under
the load arrangements of EN 1992-1-1 5.1.3 (value from memory: UK NA all
spans loaded, recommended every pair of adjacent spans loaded, both with
alternate spans loaded both ways)."""
import random

import numpy as np
import pytest

import armature


def three_moment(spans, ends, q):
    """Support moments (sagging positive, kNm) by Clapeyron's equation."""
    n = len(spans)
    M = np.zeros(n + 1)
    known = [False] * (n + 1)
    known[0] = ends[0] != "fixed"
    known[n] = ends[1] != "fixed"
    if ends[0] == "free":
        M[1], known[1] = -q[0] * spans[0] ** 2 / 2, True
    if ends[1] == "free":
        M[n - 1], known[n - 1] = -q[-1] * spans[-1] ** 2 / 2, True
    unknown = [j for j in range(n + 1) if not known[j]]
    A = np.zeros((len(unknown), len(unknown)))
    b = np.zeros(len(unknown))
    for r, j in enumerate(unknown):
        L1, w1 = (spans[j - 1], q[j - 1]) if j > 0 else (0.0, 0.0)
        L2, w2 = (spans[j], q[j]) if j < n else (0.0, 0.0)
        b[r] = -w1 * L1 ** 3 / 4 - w2 * L2 ** 3 / 4
        A[r, r] = 2 * (L1 + L2)
        for node, L in ((j - 1, L1), (j + 1, L2)):
            if 0 <= node <= n and L > 0:
                if node in unknown:
                    A[r, unknown.index(node)] += L
                else:
                    b[r] -= M[node] * L
    if unknown:
        M[unknown] = np.linalg.solve(A, b)
    return M


def span_forces(L, w, M1, M2):
    """Left shear, largest sagging moment and right shear of one span (statics)."""
    V1 = (M2 - M1) / L + w * L / 2
    V2 = V1 - w * L
    sag = max(M1, M2)
    if w > 0 and 0 < V1 / w < L:
        x = V1 / w
        sag = max(sag, M1 + V1 * x - w * x * x / 2)
    return V1, sag, V2


def arrangements(n, variant):
    out = [[i % 2 == p for i in range(n)] for p in (0, 1)]
    if variant == "UK":
        out.append([True] * n)
    else:
        out += [[i in (k, k + 1) for i in range(n)] for k in range(n - 1)]
    return out


def expected_actions(req):
    spans, ends = req["slab"]["spans_m"], req["slab"]["ends"]
    n = len(spans)
    Gk = 25.0 * req["slab"]["thickness_mm"] / 1000 + req["loads"].get("dead_kPa", 0.0)
    Qk = req["loads"]["imposed_kPa"]
    loaded, unloaded = 1.35 * Gk + 1.5 * Qk, 1.35 * Gk  # 6.10, EN 1990 Table A1.2(B)
    sag = [-np.inf] * n
    hog = [0.0] * (n + 1)
    shear = [0.0] * (n + 1)
    for arr in arrangements(n, req["variant"]):
        q = [loaded if a else unloaded for a in arr]
        M = three_moment(spans, ends, q)
        for e in range(n):
            V1, s, V2 = span_forces(spans[e], q[e], M[e], M[e + 1])
            sag[e] = max(sag[e], s)
            hog[e] = max(hog[e], -M[e])
            hog[e + 1] = max(hog[e + 1], -M[e + 1])
            shear[e] = max(shear[e], abs(V1))
            shear[e + 1] = max(shear[e + 1], abs(V2))
    regions = {}
    for j in range(n + 1):
        has_support = not ((j == 0 and ends[0] == "free") or (j == n and ends[1] == "free"))
        if has_support:
            pinned_end = (j == 0 and ends[0] == "pinned") or (j == n and ends[1] == "pinned")
            if pinned_end:  # EN 1992-1-1 9.3.1.2(2): 25 % of the span moment
                regions[f"support {j + 1}"] = 0.25 * max(sag[0 if j == 0 else n - 1], 0.0)
            else:
                regions[f"support {j + 1}"] = hog[j]
        cantilever = j < n and ((j == 0 and ends[0] == "free") or (j == n - 1 and ends[1] == "free"))
        if j < n and not cantilever:
            regions[f"span {j + 1}"] = max(sag[j], 0.0)
    supports = {f"support {j + 1}": shear[j] for j in range(n + 1)
                if not ((j == 0 and ends[0] == "free") or (j == n and ends[1] == "free"))}
    return regions, supports


def random_strip(rng):
    while True:
        n = rng.randint(1, 5)
        ends = [rng.choice(["pinned", "fixed", "free"]) for _ in range(2)]
        supports = (n + 1) - sum(e == "free" for e in ends)
        if supports >= 2 or (supports == 1 and "fixed" in ends):
            break
    spans = [round(rng.uniform(2.5, 6.5), 2) for _ in range(n)]
    if ends[0] == "free":
        spans[0] = round(rng.uniform(0.8, 2.0), 2)
    if ends[1] == "free":
        spans[-1] = round(rng.uniform(0.8, 2.0), 2)
    return {
        "code": "EN1992-1-1",
        "variant": rng.choice(["UK", "recommended"]),
        "slab": {"spans_m": spans, "ends": ends, "thickness_mm": rng.choice([200, 225, 250, 300])},
        "concrete": {"class": "C30/37"},
        "loads": {"dead_kPa": round(rng.uniform(0, 3), 2), "imposed_kPa": round(rng.uniform(1.5, 7.5), 2)},
    }


def test_random_strips_match_three_moment_envelopes():
    rng = random.Random(31)
    for _ in range(150):
        req = random_strip(rng)
        res = armature.design(req)
        regions, supports = expected_actions(req)
        got = {g["where"]: g["design_moment_kNm"] for g in res["regions"]}
        assert got.keys() == regions.keys(), req
        for where, M in regions.items():
            assert got[where] == pytest.approx(M, rel=1e-7, abs=1e-9), (req, where)
        got_v = {s["where"]: s["design_shear_kN"] for s in res["supports"]}
        assert got_v.keys() == supports.keys(), req
        for where, V in supports.items():
            assert got_v[where] == pytest.approx(V, rel=1e-7), (req, where)


BALCONY = {
    "code": "EN1992-1-1", "variant": "UK",
    "slab": {"spans_m": [4.0, 4.0, 1.6], "ends": ["pinned", "free"], "thickness_mm": 225},
    "concrete": {"class": "C30/37"},
    "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0},
    "durability": {"cover_mm": 25},
}


def test_cantilever_has_root_steel_and_its_own_deflection_check():
    res = armature.design(BALCONY)
    root = next(g for g in res["regions"] if g["where"] == "support 3")
    assert root["face"] == "top"
    assert not any(g["where"] == "span 3" for g in res["regions"])
    # Root moment w Lc²/2 with the loaded ULS value (statics).
    Gk = 25 * 0.225 + 1.5
    assert root["design_moment_kNm"] == pytest.approx((1.35 * Gk + 1.5 * 4.0) * 1.6 ** 2 / 2)
    # The root by hand (EN 1992-1-1 with the UK NA, values from memory): M = 15.619 × 1.6²/2
    # = 19.992 kNm; ø10: d = 225 − 25 − 5 = 195; K = 19.992e6/(1000 × 195² × 30) = 0.017525;
    # z = 195 [0.5 + √(0.25 − K/1.1333)] = 191.9 > 0.95 d → 185.25 (6.1);
    # As,req = 19.992e6/(434.78 × 185.25) = 248.21 mm²; As,min = 0.26 × 2.8965/500 × 1000 × 195
    # = 293.70 mm² (9.2.1.1(1)) → ø10 @ 250 = 314.16 mm² (ø8 @ 175 = 287.2 is short of it).
    assert root["effective_depth_mm"] == 195
    assert root["As_req_mm2"] == pytest.approx(248.21, rel=1e-4)
    assert (root["bars"]["bar"], root["bars"]["spacing_mm"]) == ("10", 250)
    defl = next(c for c in res["checks"] if c["id"] == "deflection" and c["where"] == "span 3")
    # Actual l/d of the cantilever from the root's effective depth: 1600/195 = 8.205.
    assert defl["demand"] == pytest.approx(8.2051, rel=1e-4)
    # Allowed (7.4.2): K = 0.4 for a cantilever (Table 7.4N, value from memory) with ρ of the
    # root: ρ = 248.21/195000 = 0.0012729 < ρ0 = 0.0054772, ρ0/ρ = 4.3030 (7.16a):
    # 0.4 [11 + 1.5√30 × 4.3030 + 3.2√30 × 3.3030^1.5] = 0.4 × 151.57 = 60.63;
    # × 310/σs = (500/500)(314.16/248.21) = 1.2657 (7.17, under the 1.5 cap) → 76.73,
    # capped by the UK NA at 40 K = 40 × 0.4 = 16 (Table NA.5 Note 6, value from memory).
    assert defl["capacity"] == pytest.approx(16.0)


def test_redistribution_scales_support_moments_and_is_limited():
    req = {
        "code": "EN1992-1-1", "variant": "recommended",
        "slab": {"spans_m": [5.0, 5.0, 5.0], "ends": ["pinned", "pinned"], "thickness_mm": 250},
        "concrete": {"class": "C30/37"},
        "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0},
    }
    elastic = armature.design(req)
    req15 = dict(req, design={"redistribution_percent": 15})
    redistributed = armature.design(req15)
    m0 = {g["where"]: g["design_moment_kNm"] for g in elastic["regions"]}
    m15 = {g["where"]: g["design_moment_kNm"] for g in redistributed["regions"]}
    assert m15["support 2"] == pytest.approx(0.85 * m0["support 2"])
    # Span 2 sags most with it loaded and spans 1, 3 not (5.1.3(a)): w2 = 1.35 × 7.75 + 1.5 × 4.0
    # = 16.4625 kPa, w1 = w3 = 1.35 × 7.75 = 10.4625 kPa (Gk = 25 × 0.25 + 1.5). Three-moment
    # equation (Clapeyron) at support 2, equal spans, symmetry M2 = M3 = M:
    #   4M L + M L = −(w1 + w2) L³/4 → M = −(w1 + w2) L²/20 = −26.925 × 25/20 = −33.656 kNm.
    # Mid-span of span 2: w2 L²/8 + M = 51.445 − 33.656 = 17.789 kNm elastic; with the end
    # moments × 0.85 and the span rebuilt by equilibrium, 51.445 − 0.85 × 33.656 = 22.838 kNm.
    assert m0["span 2"] == pytest.approx(17.789, rel=1e-4)
    assert m15["span 2"] == pytest.approx(22.838, rel=1e-4)
    # K' with δ = 0.85, recommended k1 = 0.44, k2 = 1.25 (EN 1992-1-1 5.5(4)):
    # ξ = 0.41/1.25 = 0.328; K' = (1/1.5) 0.8 ξ (1 − 0.4 ξ) = 0.1520.
    duct = next(c for c in redistributed["checks"] if c["id"] == "ductility" and c["where"] == "support 2")
    xi = (0.85 - 0.44) / 1.25
    assert duct["capacity"] == pytest.approx(1 / 1.5 * 0.8 * xi * (1 - 0.8 * xi / 2))
    with pytest.raises(armature.InputError, match=r"design\.redistribution_percent: must be at most 30 %"):
        armature.design(dict(req, design={"redistribution_percent": 35}))


def _support_checks(res, where):
    region = next(g for g in res["regions"] if g["where"] == where)
    checks = [c for c in res["checks"] if c["where"] == where]
    xu = next(c for c in checks if c["id"] == "ductility" and "(5.10a)" in c["clause"])
    k = next(c for c in checks if c["id"] == "ductility" and c["clause"].endswith("6.1"))
    bending = next(c for c in checks if c["id"] == "bending")
    return region, xu, k, bending


def test_redistributed_supports_check_xu_of_the_bars_provided():
    """EN 1992-1-1 5.5(4) (5.10a), recommended k1 = 0.44, k2 = 1.25 (published
    clause text): at 30 %, δ = 0.7 needs xu/d ≤ (0.7 − 0.44)/1.25 = 0.208, with
    xu = As,prov fyd/(λ η fcd b), λ = 0.8, η = 1 (3.1.7(3)), fyd = 500/1.15,
    from the bars the design reports (by hand)."""
    # A workshop floor with light use: the support bars sit far inside the limit.
    light = armature.design({
        "code": "EN1992-1-1", "variant": "recommended",
        "slab": {"spans_m": [4.4, 5.2, 4.4], "ends": ["pinned", "pinned"], "thickness_mm": 220},
        "concrete": {"class": "C30/37"},
        "loads": {"dead_kPa": 1.4, "imposed_kPa": 3.5},
        "design": {"redistribution_percent": 30}})
    for where in ("support 2", "support 3"):
        region, xu, _, _ = _support_checks(light, where)
        xu_mm = region["bars"]["As_prov_mm2"] * (500 / 1.15) / (0.8 * 1.0 * (30 / 1.5) * 1000)
        assert xu["demand"] == pytest.approx(xu_mm / region["effective_depth_mm"], rel=1e-9)
        assert xu["capacity"] == pytest.approx(0.208, rel=1e-9)
        assert xu["pass"]
    # ø10 @ 250 over d = 195 (the design's own choice): xu = 8.537 mm, xu/d = 0.0438.
    assert _support_checks(light, "support 2")[1]["demand"] == pytest.approx(0.04378, abs=5e-5)
    # The ends of the strip are not redistributed: no (5.10a) check there.
    assert not any(c["id"] == "ductility" and "(5.10a)" in c["clause"] and c["where"] == "support 1"
                   for c in light["checks"])

    # A storage bay (C25/30, h 170, 7.5 kPa; bars 12 and 16): the moment needs
    # ø12 @ 125 (904.8 mm², d = 170 − 25 − 6 = 139 with the computed cover)
    # and K ≤ K' holds, yet xu = 904.8 × 434.78/(0.8 × 16.667 × 1000) = 29.50 mm,
    # xu/d = 0.2123 > 0.208: the bars provided make the redistribution too large.
    heavy = armature.design({
        "code": "EN1992-1-1", "variant": "recommended",
        "slab": {"spans_m": [5.4, 6.2, 5.4], "ends": ["pinned", "pinned"], "thickness_mm": 170},
        "concrete": {"class": "C25/30"},
        "reinforcement": {"bars": ["12", "16"]},
        "loads": {"dead_kPa": 1.4, "imposed_kPa": 7.5},
        "design": {"redistribution_percent": 30}})
    region, xu, k, bending = _support_checks(heavy, "support 2")
    assert (region["bars"]["bar"], region["bars"]["spacing_mm"], region["effective_depth_mm"]) == ("12", 125.0, 139.0)
    assert bending["pass"] and k["pass"]
    assert xu["demand"] == pytest.approx(0.2123, abs=5e-5)
    assert not xu["pass"]
    assert heavy["status"] == "fail"


def test_redistribution_between_unequal_spans_is_refused():
    """EN 1992-1-1 5.5(4) b): adjacent spans in the ratio 0.5 to 2. 2.0 m beside
    5.0 m (0.4) at 30 % is refused on design.redistribution_percent."""
    req = {"code": "EN1992-1-1",
           "slab": {"spans_m": [2.0, 5.0], "ends": ["pinned", "pinned"], "thickness_mm": 200},
           "concrete": {"class": "C30/37"},
           "loads": {"dead_kPa": 1.4, "imposed_kPa": 3.5},
           "design": {"redistribution_percent": 30}}
    with pytest.raises(armature.InputError,
                       match=r"design\.redistribution_percent: must be 0 for this strip: spans 1 and 2 "
                             r"\(2 m and 5 m, ratio 0\.4\)"):
        armature.design(req)
    # Without redistribution the strip designs, support 2 for its elastic
    # moment: both spans loaded, Clapeyron M = n (L1³ + L2³)/(8 (L1 + L2)),
    # n = 1.35 (25 × 0.2 + 1.4) + 1.5 × 3.5 = 13.89 kPa → 32.99 kNm (by hand).
    req["design"] = {"redistribution_percent": 0}
    res = armature.design(req)
    support = next(g for g in res["regions"] if g["where"] == "support 2")
    assert support["design_moment_kNm"] == pytest.approx(13.89 * (2.0 ** 3 + 5.0 ** 3) / (8 * 7.0), rel=1e-9)


def test_redistribution_without_an_interior_support_is_refused():
    req = dict(BALCONY, slab={"spans_m": [4.0, 1.6], "ends": ["pinned", "free"], "thickness_mm": 225},
               design={"redistribution_percent": 10})
    with pytest.raises(armature.InputError, match="largest allowed value is 0"):
        armature.design(req)


def test_unstable_strips_are_refused():
    for ends in (["pinned", "free"], ["free", "free"]):
        req = dict(BALCONY, slab={"spans_m": [4.0], "ends": ends, "thickness_mm": 225})
        with pytest.raises(armature.InputError, match=r"slab\.ends: "):
            armature.design(req)


def test_interior_support_shear_uses_the_top_bars():
    res = armature.design(BALCONY)
    top = next(g for g in res["regions"] if g["where"] == "support 2")
    support = next(s for s in res["supports"] if s["where"] == "support 2")
    # VRd,c from (6.2a)/(6.3N) with ρl of the top bars at the support.
    d, As, fck = top["effective_depth_mm"], top["bars"]["As_prov_mm2"], 30.0
    k = min(1 + (200 / d) ** 0.5, 2.0)
    rho = min(As / (1000 * d), 0.02)
    v = max(0.18 / 1.5 * k * (100 * rho * fck) ** (1 / 3), 0.035 * k ** 1.5 * fck ** 0.5)
    assert support["shear_resistance_kN"] == pytest.approx(v * 1000 * d / 1000)
