"""ACI 318-19 (SI) single spans against an independent implementation of
aci318-basis.md written here (values from memory of ACI 318-19: 5.3.1,
7.3.1.1, 7.3.3.1, 7.6.1.1, 7.7.2.3, 20.5.1.3.1, 21.2.2, 22.2, 22.5.5.1,
24.3.2, 24.4.3), and switching codes."""
import math
import random

import pytest

import armature

BARS = {"#3": (9.5, 71), "#4": (12.7, 129), "#5": (15.9, 199), "#6": (19.1, 284),
        "#7": (22.2, 387), "#8": (25.4, 510)}  # ASTM A615M, value from memory


def independent_aci_single_span(h, span_m, fc, fy, dead, live, exposure="interior"):
    b = 1000.0
    D = 23.6 * h / 1000 + dead
    U = max(1.4 * D, 1.2 * D + 1.6 * live)
    Mu = U * 1e-3 * b * (span_m * 1000) ** 2 / 8
    Vu = U * 1e-3 * b * span_m * 1000 / 2
    beta1 = 0.85 if fc <= 28 else 0.65 if fc >= 55 else 0.85 - 0.05 * (fc - 28) / 7
    eps_ty = fy / 200000
    h_min = span_m * 1000 / 20 * (0.4 + fy / 700)
    fs = 2 / 3 * fy
    candidates = []
    for name, (db, area) in BARS.items():
        cover = 75 if exposure == "ground" else (50 if db >= 19 else 40) if exposure == "weather" else 20
        d = h - cover - db / 2
        s = 75
        while s <= min(3 * h, 450):
            As = area * b / s
            a = As * fy / (0.85 * fc * b)
            c = a / beta1
            eps_t = 0.003 * (d - c) / c
            phi = 0.9 if eps_t >= eps_ty + 0.003 else 0.65 if eps_t <= eps_ty else \
                0.65 + 0.25 * (eps_t - eps_ty) / 0.003
            rad = d * d - 2 * Mu / (0.9 * 0.85 * fc * b)
            lam_s = min(math.sqrt(2 / (1 + 0.004 * d)), 1.0)
            rfc = min(math.sqrt(fc), 8.3)
            Vc = min(0.66 * lam_s * (As / (b * d)) ** (1 / 3) * rfc, 0.42 * rfc) * b * d
            ok = (phi * As * fy * (d - a / 2) >= Mu and rad >= 0 and eps_t >= 0.004
                  and As >= 0.0018 * b * h and s <= min(380 * 280 / fs - 2.5 * cover, 300 * 280 / fs)
                  and h >= h_min and Vu <= 0.75 * Vc)
            if ok:
                candidates.append((As, -s, db, name, s, d))
            s += 25
    if not candidates:
        return None
    As, _, _, name, s, d = min(candidates, key=lambda t: (round(t[0], 9), t[1], t[2]))
    As_req = 0.85 * fc * b / fy * (d - math.sqrt(d * d - 2 * Mu / (0.9 * 0.85 * fc * b)))
    return {"bar": name, "spacing_mm": s, "As_prov_mm2": As, "d": d, "As_req": As_req, "Mu": Mu / 1e6}


def test_random_single_spans_agree_with_an_independent_implementation():
    rng = random.Random(318)
    compared = 0
    for _ in range(300):
        h = rng.choice([150, 175, 200, 225, 250, 300])
        span = round(rng.uniform(2.0, 6.0), 2)
        fc = rng.choice([21, 25, 28, 35, 42, 55])
        fy = rng.choice([280, 420, 520])
        dead, live = round(rng.uniform(0, 3), 2), round(rng.uniform(1.5, 7.5), 2)
        exposure = rng.choice(["interior", "weather"])
        res = armature.design({
            "code": "ACI318-19",
            "slab": {"spans_m": [span], "ends": ["pinned", "pinned"], "thickness_mm": h},
            "concrete": {"cylinder_strength_MPa": fc},
            "reinforcement": {"yield_strength_MPa": fy},
            "loads": {"dead_kPa": dead, "imposed_kPa": live},
            "durability": {"exposure": exposure},
        })
        expected = independent_aci_single_span(h, span, fc, fy, dead, live, exposure)
        g = res["regions"][0]
        assert g["design_moment_kNm"] == pytest.approx(expected["Mu"] if expected else g["design_moment_kNm"])
        if expected is None:
            assert res["status"] == "fail"
            continue
        assert res["status"] == "pass"
        assert (g["bars"]["bar"], g["bars"]["spacing_mm"]) == (expected["bar"], expected["spacing_mm"])
        assert g["bars"]["As_prov_mm2"] == pytest.approx(expected["As_prov_mm2"])
        assert g["effective_depth_mm"] == pytest.approx(expected["d"])
        assert g["As_req_mm2"] == pytest.approx(expected["As_req"])
        compared += 1
    assert compared > 100


def test_fire_is_reported_as_not_checked():
    res = armature.design({
        "code": "ACI318-19",
        "slab": {"spans_m": [4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200},
        "concrete": {"cylinder_strength_MPa": 28},
        "loads": {"imposed_kPa": 2.4},
        "fire": {"resistance_min": 60},
    })
    assert not any(c["id"] == "fire" for c in res["checks"])
    assert any("not checked by this code" in w for w in res["warnings"])


def test_metric_bar_names_are_aliases():
    base = {
        "code": "ACI318-19",
        "slab": {"spans_m": [4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200},
        "concrete": {"cylinder_strength_MPa": 28},
        "loads": {"imposed_kPa": 2.4},
    }
    a = armature.design(dict(base, reinforcement={"bars": ["#4", "#5"]}))
    b = armature.design(dict(base, reinforcement={"bars": ["No.13", "No.16"]}))
    assert a["regions"][0]["bars"]["As_prov_mm2"] == b["regions"][0]["bars"]["As_prov_mm2"]
    assert b["regions"][0]["bars"]["bar"] in ("No.13", "No.16")


def test_continuous_aci_follows_6_4_3_2_arrangements():
    # Two equal spans, 6.4.3.2: alternate spans (each alone) and both loaded
    # (the pair adjacent to the interior support). Support: the both-loaded
    # case gives wL²/8; span: one span loaded with the other at 1.2 D gives
    # the larger sagging (three-moment by hand below).
    D = 23.6 * 0.2 + 1.0
    L_kPa = 4.0
    wl, wd, L = 1.2 * D + 1.6 * L_kPa, 1.2 * D, 4.5
    res = armature.design({
        "code": "ACI318-19",
        "slab": {"spans_m": [L, L], "ends": ["pinned", "pinned"], "thickness_mm": 200},
        "concrete": {"cylinder_strength_MPa": 28},
        "loads": {"dead_kPa": 1.0, "imposed_kPa": L_kPa},
    })
    moments = {g["where"]: g["design_moment_kNm"] for g in res["regions"]}
    assert moments["support 2"] == pytest.approx(wl * L * L / 8)
    M_b = -(wl + wd) * L ** 2 / 16  # 4 M (2L) = −(wl + wd) L³/4 → M = −(wl + wd) L²/16
    R = wl * L / 2 + M_b / L
    assert moments["span 1"] == pytest.approx(R * R / (2 * wl))
    assert "support 1" not in moments  # no partial-fixity rule in ACI 318


def test_compare_one_floor_across_codes():
    floor = {
        "slab": {"spans_m": [4.2, 4.8, 4.2], "ends": ["pinned", "pinned"], "thickness_mm": 200},
        "concrete": {"cylinder_strength_MPa": 30},
        "reinforcement": {"yield_strength_MPa": 500},
        "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0},
    }
    table = armature.compare(floor, codes=["EN1992-1-1:UK", "EN1992-1-1:recommended", "ACI318-19"])
    assert set(table["code"]) == {"EN1992-1-1:UK", "EN1992-1-1:recommended", "ACI318-19"}
    for spec in ("EN1992-1-1:UK", "ACI318-19"):
        req = dict(floor, code=spec.split(":")[0])
        if ":" in spec:
            req["variant"] = spec.split(":")[1]
        res = armature.design(req)
        rows = table[table["code"] == spec]
        assert list(rows["where"]) == [g["where"] for g in res["regions"]]
        assert list(rows["As_prov_mm2"]) == [g["bars"]["As_prov_mm2"] for g in res["regions"]]
        assert list(rows["bar"]) == [g["bars"]["bar"] for g in res["regions"]]
    # A field one code refuses names the code and the field.
    with pytest.raises(armature.InputError, match=r"ACI318-19: concrete\.class: "):
        armature.compare(dict(floor, concrete={"class": "C30/37"}), codes=["EN1992-1-1", "ACI318-19"])


def test_to_frame_lists_every_check():
    res = armature.design({
        "code": "EN1992-1-1",
        "slab": {"spans_m": [4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200},
        "concrete": {"class": "C30/37"},
        "loads": {"imposed_kPa": 2.5},
    })
    frame = armature.to_frame(res)
    assert len(frame) == len(res["checks"])
    assert list(frame["utilisation"]) == [c["utilisation"] for c in res["checks"]]
