"""Two-way slabs from Python: a sweep over a two-way request gives one row
per value with each region's bars by direction, and the result's `plate`
object has the shape the plotting reads.

Expected values come from designs of the same requests made on their own
(armature.design) or from the request's geometry; the steel estimate is
checked against its stated rule (bars over their bay, top bars reaching
0.3 of each adjacent span: common practice, as for strips; corner bars
over their zone)."""
import copy

import pytest

import armature

# The workshop's ground-floor store: two bays on walls (our own scenario).
STORE = {
    "code": "EN1992-1-1", "variant": "UK",
    "slab": {"type": "two_way", "x_spans_m": [5.4, 6.0], "y_spans_m": [4.2], "thickness_mm": 200,
             "edges": {"x0": "pinned", "x1": "pinned", "y0": "pinned", "y1": "fixed"}},
    "concrete": {"class": "C30/37"},
    "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0, "imposed_category": "C"},
}


def test_sweep_over_a_two_way_request_gives_rows():
    frame = armature.sweep(STORE, {"slab.thickness_mm": [175, 200, 250]})
    assert list(frame["slab.thickness_mm"]) == [175, 200, 250]
    assert list(frame["status"]) == ["pass", "pass", "pass"]
    for h, row in zip([175, 200, 250], frame.itertuples(index=False)):
        request = copy.deepcopy(STORE)
        request["slab"]["thickness_mm"] = h
        alone = armature.design(request)
        assert row.max_utilisation == alone["max_utilisation"]
        values = dict(zip(frame.columns, row))
        for g in alone["regions"]:
            key = g["where"] + " " + g["direction"]
            assert values[key + " bar"] == g["bars"]["bar"]
            assert values[key + " spacing_mm"] == g["bars"]["spacing_mm"]
    # Thicker slabs need more minimum steel.
    steel = list(frame["steel_kg_m2"])
    assert steel[0] < steel[1] < steel[2]


FREE_EDGE = copy.deepcopy(STORE)
FREE_EDGE["slab"]["edges"] = {"x0": "pinned", "x1": "pinned", "y0": "fixed", "y1": "free"}


@pytest.mark.parametrize("request_", [STORE, FREE_EDGE], ids=["store", "free edge"])
def test_steel_estimate_follows_its_rule(request_):
    result = armature.design(request_)
    plate = result["plate"]
    x_lines, y_lines = plate["x_lines_m"], plate["y_lines_m"]
    volume = 0.0  # mm²/m × m² → mm²·m
    for g in result["regions"]:
        corner = next((c for c in plate["corners"] if c["name"] == g["where"]), None)
        if corner:  # corner bars over their zone, counted in full
            area = (corner["x1_m"] - corner["x0_m"]) * (corner["y1_m"] - corner["y0_m"])
        elif g["face"] == "bottom":
            bay = next(b for b in plate["bays"] if b["name"] == g["where"])
            area = (bay["x1_m"] - bay["x0_m"]) * (bay["y1_m"] - bay["y0_m"])
        else:
            line = next(l for l in plate["reactions"] if l["line"] == g["where"])
            across = x_lines if line["runs_along"] == "y" else y_lines
            k = min(range(len(across)), key=lambda i: abs(across[i] - line["at_m"]))
            reach = (0.3 * (across[k] - across[k - 1]) if k > 0 else 0.0) + \
                    (0.3 * (across[k + 1] - across[k]) if k + 1 < len(across) else 0.0)
            area = (line["to_m"] - line["from_m"]) * reach
        volume += g["bars"]["As_prov_mm2"] * area
    for f in plate["free_edges"]:  # U-bars: top leg and bend (h) beyond the bottom bars
        g = next(g for g in result["regions"] if g["where"] == f["bay"] and g["face"] == "bottom"
                 and g["direction"] == ("x" if f["edge"] in ("edge x0", "edge x1") else "y"))
        volume += g["bars"]["As_prov_mm2"] * (f["to_m"] - f["from_m"]) * (f["u_bar_leg_mm"] + 200) / 1000
    assert bool(plate["free_edges"]) == (request_ is FREE_EDGE)
    slab_area = (x_lines[-1] - x_lines[0]) * (y_lines[-1] - y_lines[0])
    expected = volume * 1e-6 / slab_area * 7850.0
    frame = armature.sweep(request_, {"slab.thickness_mm": [200]})
    assert abs(frame["steel_kg_m2"][0] - expected) < 1e-6 * expected


def test_plate_object_has_the_shape_the_plots_read():
    result = armature.design(STORE)
    plate = result["plate"]
    assert plate["x_lines_m"] == [0.0, 5.4, 11.4]
    assert plate["y_lines_m"] == [0.0, 4.2]
    assert plate["edges"] == {"x0": "pinned", "x1": "pinned", "y0": "pinned", "y1": "fixed"}
    assert [b["name"] for b in plate["bays"]] == ["bay 1,1", "bay 2,1"]
    field = plate["field"]
    xs, ys = field["x_m"], field["y_m"]
    assert xs == sorted(xs) and ys == sorted(ys)
    assert xs[0] == 0.0 and abs(xs[-1] - 11.4) < 1e-9
    for name in ("mx", "my", "mxy"):
        for bound in ("max", "min"):
            grid = field[name][bound]
            assert len(grid) == len(ys) and all(len(row) == len(xs) for row in grid)
        assert all(hi >= lo for rh, rl in zip(field[name]["max"], field[name]["min"]) for hi, lo in zip(rh, rl))
    for name in ("bottom_x", "bottom_y", "top_x", "top_y"):
        grid = field["design"][name]
        assert len(grid) == len(ys) and all(len(row) == len(xs) and min(row) >= 0.0 for row in grid)
    # Each region's design moment is the design field's value where it is.
    for g in result["regions"]:
        i = min(range(len(xs)), key=lambda k: abs(xs[k] - g["x_m"]))
        j = min(range(len(ys)), key=lambda k: abs(ys[k] - g["y_m"]))
        name = ("bottom_" if g["face"] == "bottom" else "top_") + g["direction"]
        assert g["design_moment_kNm"] >= field["design"][name][j][i] - 1e-9
    names = [r["line"] for r in plate["reactions"]]
    assert "grid x1 segment 1" in names and "edge y1 segment 2" in names
    assert all(r["max_kN_per_m"] > 0.0 for r in plate["reactions"])
    assert result["caution"] == armature.CAUTION


def test_record_draws_the_plan_and_the_moment_maps(tmp_path):
    """The HTML record of a two-way slab draws the plan (bays with their
    bottom bars, the top bars marked) and six colour maps whose scales
    print the fields' own extremes; US units convert by 1 kip-ft/ft =
    4.448 kNm/m (1 lbf = 4.448222 N, 1 ft cancels: NIST SP 811 Appendix B)."""
    import re
    result = armature.design(STORE)
    html = (tmp_path / "store.html")
    armature.report(result, html)
    text = html.read_text(encoding="utf-8")
    plan = text[text.index("Plan of the slab"):]
    plan = plan[:plan.index("</svg>")]
    for g in result["regions"]:
        if g["face"] == "bottom":
            assert g["direction"] + ": " in plan
    assert plan.count('class="mark"') == sum(1 for g in result["regions"] if g["face"] == "top")
    maxima = [float(v) for v in re.findall(r'class="scale-max"[^>]*>max ([-0-9.]+)', text)]
    assert len(maxima) == 6
    field = result["plate"]["field"]
    expected = [max(max(row) for row in field["mx"]["max"]), max(max(row) for row in field["my"]["max"])] + \
        [max(max(row) for row in field["design"][n]) for n in ("bottom_x", "bottom_y", "top_x", "top_y")]
    for got, want in zip(maxima, expected):
        assert got == pytest.approx(want, rel=1e-3)
    assert text.count(armature.CAUTION[:40]) >= 7

    us = copy.deepcopy(STORE)
    us["report_units"] = "US"
    res_us = armature.design(us)
    html_us = tmp_path / "store-us.html"
    armature.report(res_us, html_us)
    us_text = html_us.read_text(encoding="utf-8")
    assert "kip-ft/ft" in us_text
    us_max = [float(v) for v in re.findall(r'class="scale-max"[^>]*>max ([-0-9.]+)', us_text)]
    for got, want in zip(us_max, expected):
        assert got == pytest.approx(want / 4.448222, rel=1e-3)


def test_record_places_the_actions_on_the_slab(tmp_path):
    """A two-way record describes actions over the slab or placed in plan,
    as the request gives them (not along a strip)."""
    req = copy.deepcopy(STORE)
    req["loads"]["actions"] = [{"name": "tank", "kind": "imposed", "category": "E", "point_kN": 12.0,
                                "x_m": 2.0, "y_m": 1.0}]
    path = tmp_path / "store.md"
    armature.report(armature.design(req), path)
    text = path.read_text(encoding="utf-8")
    assert "| Action: tank | imposed, category E, 12 kN at (2 m, 1 m) |" in text
    assert "3 kPa over the whole slab" in text
    assert "strip" not in text.split("## 3")[0].split("## 2")[1]
