"""The Python package: parallel designs, sweeps, pickling, worker processes,
quantities and plots."""
import itertools
import multiprocessing
import pickle
import random

import pytest

import armature

EN = {
    "code": "EN1992-1-1", "variant": "UK",
    "slab": {"spans_m": [4.0, 4.5], "ends": ["pinned", "pinned"], "thickness_mm": 200},
    "concrete": {"class": "C30/37"},
    "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0},
}
ACI = {
    "code": "ACI318-19",
    "slab": {"spans_m": [4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200},
    "concrete": {"cylinder_strength_MPa": 28},
    "loads": {"dead_kPa": 1.0, "imposed_kPa": 2.4},
}


def random_requests(n, seed):
    rng = random.Random(seed)
    out = []
    for _ in range(n):
        req = dict(rng.choice([EN, ACI]))
        req["slab"] = dict(req["slab"], thickness_mm=rng.choice([175, 200, 250]))
        req["loads"] = dict(req["loads"], imposed_kPa=round(rng.uniform(1.5, 7.5), 2))
        out.append(req)
    return out


def test_design_many_with_mixed_codes_equals_sequential():
    reqs = random_requests(200, 5)
    many = armature.design_many(reqs, threads=2)
    assert many == [armature.design(r) for r in reqs]
    assert {r["code"] for r in many} == {"EN1992-1-1", "ACI318-19"}
    assert all(m.request is r for m, r in zip(many, reqs))


def test_design_many_names_the_bad_request():
    reqs = random_requests(5, 1)
    reqs[3] = dict(reqs[3], slab=dict(reqs[3]["slab"], thickness_mm=-1))
    with pytest.raises(armature.InputError, match=r"requests\[3\] slab\.thickness_mm: must be between"):
        armature.design_many(reqs)


def test_sweep_rows_columns_and_values_match_single_designs():
    axes = {"slab.thickness_mm": [175, 225], "slab.spans_m[0]": [3.5, 5.0],
            "concrete.class": ["C25/30", "C40/50"], "variant": ["UK", "recommended"]}
    frame = armature.sweep(EN, axes)
    assert len(frame) == 16
    for col in ("status", "max_utilisation", "governing_check", "governing_where", "steel_kg_m2",
                "concrete_m3_m2", "span 1 bar", "span 1 spacing_mm", "span 1 As_prov_mm2",
                "support 2 As_prov_mm2", "error"):
        assert col in frame.columns
    for row, combo in zip(frame.itertuples(index=False), itertools.product(*axes.values())):
        h, span, cls, variant = combo
        req = dict(EN, variant=variant, concrete={"class": cls},
                   slab=dict(EN["slab"], thickness_mm=h, spans_m=[span, 4.5]))
        res = armature.design(req)
        r = dict(zip(frame.columns, row))
        assert (r["slab.thickness_mm"], r["slab.spans_m[0]"], r["concrete.class"], r["variant"]) == combo
        assert r["status"] == res["status"]
        assert r["max_utilisation"] == pytest.approx(res["max_utilisation"])
        assert r["governing_check"] == res["governing"]["check"]
        for g in res["regions"]:
            assert r[f'{g["where"]} bar'] == g["bars"]["bar"]
            assert r[f'{g["where"]} As_prov_mm2'] == pytest.approx(g["bars"]["As_prov_mm2"])
        assert r["concrete_m3_m2"] == pytest.approx(h / 1000)


def test_sweep_over_codes_and_invalid_combinations():
    base = dict(ACI, concrete={"cylinder_strength_MPa": 30})
    frame = armature.sweep(base, {"code": ["EN1992-1-1:UK", "ACI318-19"],
                                  "slab.thickness_mm": [200, 40]})
    assert list(frame["status"][frame["slab.thickness_mm"] == 40]) == ["invalid", "invalid"]
    assert frame["error"][1].startswith("slab.thickness_mm: must be between 50 and 1500 mm")
    ok = frame[frame["slab.thickness_mm"] == 200]
    assert set(ok["status"]) <= {"pass", "fail"}
    assert ok["support 1 bar"].isna().tolist() == [False, True]  # EN asks for partial-fixity steel, ACI not


def test_steel_mass_follows_the_documented_estimate():
    res = armature.design(EN)
    b, spans = 1000.0, [4000.0, 4500.0]
    total = sum(spans)
    volume = res["distribution"]["As_prov_mm2"] * total
    for g in res["regions"]:
        As = g["bars"]["As_prov_mm2"]
        if g["face"] == "bottom":
            volume += As * spans[int(g["where"].split()[1]) - 1]
        else:
            j = int(g["where"].split()[1]) - 1
            # top bars over 0.3 of each adjacent span (common practice estimate)
            volume += As * sum(0.3 * spans[e] for e in (j - 1, j) if 0 <= e < len(spans))
    expected = volume / (b * total) * 1e-3 * 7850  # kg/m²; steel 7850 kg/m³ (common practice)
    frame = armature.sweep(EN, {"slab.thickness_mm": [200]})
    assert frame["steel_kg_m2"][0] == pytest.approx(expected)


def test_results_pickle_with_their_request():
    res = armature.design(EN)
    back = pickle.loads(pickle.dumps(res))
    assert back == res and back.request == EN
    assert isinstance(back, armature.Result)


def _design_in_worker(request):
    import armature as a  # the worker opens its codes by id
    return a.design(request)


def test_designs_in_worker_processes():
    reqs = random_requests(12, 9)
    with multiprocessing.get_context("spawn").Pool(2) as pool:
        results = pool.map(_design_in_worker, reqs)
    assert results == [armature.design(r) for r in reqs]


def test_plots_draw_the_envelopes_and_a_study():
    matplotlib = pytest.importorskip("matplotlib")
    matplotlib.use("Agg")
    res = armature.design(EN)
    ax_m, ax_v = armature.plot_envelopes(res)
    # Two lines per span, one marker per region, and the axis line.
    assert len(ax_m.lines) == 2 * 2 + len(res["regions"]) + 1
    sag = max(max(line.get_ydata()) for line in ax_m.lines[:4])
    span_moments = [g["design_moment_kNm"] for g in res["regions"] if g["face"] == "bottom"]
    assert sag == pytest.approx(max(span_moments), rel=0.01)  # sampled at 25 points a span
    frame = armature.sweep(EN, {"slab.thickness_mm": [125, 150, 200, 250], "slab.spans_m[0]": [4.0, 6.0]})
    ax = armature.plot_study(frame, x="slab.thickness_mm", by="slab.spans_m[0]")
    assert ax.get_xlabel() == "slab.thickness_mm"
