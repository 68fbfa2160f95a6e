"""Detailing of two-way slabs on walls (request and result `detailing`):
each row and column of bays detailed as a strip on the plate's envelope,
counted over its width on the plan; corner-zone bars; the U-bars and edge
bars of a free edge. Values are checked against the request's geometry,
the regions' bars, EN 1992-1-1 8.4 evaluated here, and the unit mass
0.00617 d² kg/m (common practice). The slabs are our own workshop
scenarios."""
import copy
import math

import pytest

import armature
from test_detailing import en_anchorage_by_hand

UNIT_MASS = 0.00617  # kg/m per mm² of d² (common practice)

# The workshop's ground floor over the store: two bays by two on walls.
GROUND = {
    "code": "EN1992-1-1", "variant": "recommended",
    "slab": {"type": "two_way", "x_spans_m": [5.4, 6.0], "y_spans_m": [4.2, 4.2], "thickness_mm": 200,
             "edges": {"x0": "pinned", "x1": "pinned", "y0": "pinned", "y1": "fixed"}},
    "concrete": {"class": "C30/37"},
    "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0, "imposed_category": "C"},
    "detailing": {"stock_length_m": 12.0},
}

# The loading bay canopy slab: one bay, a free edge at y1.
CANOPY = copy.deepcopy(GROUND)
CANOPY["slab"].update({"x_spans_m": [5.0], "y_spans_m": [3.6],
                       "edges": {"x0": "pinned", "x1": "pinned", "y0": "fixed", "y1": "free"}})


def lines(spans):
    out = [0.0]
    for s in spans:
        out.append(out[-1] + s)
    return out


def bars_of(d, where, face, direction):
    return [b for b in d["bars"] if b["where"] == where and b["face"] == face and b.get("direction") == direction]


def count_over(width_m, spacing_mm):
    # floor(width / spacing) + 1: the count convention of issue 17 (common practice)
    return math.floor(width_m * 1000 / spacing_mm + 1e-9) + 1


@pytest.fixture(scope="module")
def ground():
    return armature.design(GROUND)


def test_every_bay_and_line_has_its_bars_over_its_width(ground):
    r = ground
    d = r["detailing"]
    X, Y = lines(GROUND["slab"]["x_spans_m"]), lines(GROUND["slab"]["y_spans_m"])
    for g in r["regions"]:
        if g["where"].startswith("corner"):
            continue
        bars = bars_of(d, g["where"], g["face"], g["direction"])
        assert bars, g["where"]
        for b in bars:
            assert b["bar"] == g["bars"]["bar"] and b["spacing_mm"] == g["bars"]["spacing_mm"]
        # Counted over the row's (bars in x) or column's (bars in y) width on the plan.
        lo, hi = bars[0]["across_m"]["from"], bars[0]["across_m"]["to"]
        across = Y if g["direction"] == "x" else X
        assert any(abs(lo - a) < 1e-9 and abs(hi - b) < 1e-9 for a, b in zip(across, across[1:]))
        if not any(b["laps"] for b in bars):
            assert sum(b["count"] for b in bars) == count_over(hi - lo, g["bars"]["spacing_mm"])


def test_bottom_bars_span_their_bay_and_top_bars_pass_their_line(ground):
    d = ground["detailing"]
    X, Y = lines(GROUND["slab"]["x_spans_m"]), lines(GROUND["slab"]["y_spans_m"])
    for direction, along in (("x", X), ("y", Y)):
        for i in range(len(X) - 1):
            for j in range(len(Y) - 1):
                e = i if direction == "x" else j
                bars = bars_of(d, f"bay {i + 1},{j + 1}", "bottom", direction)
                lo = min(b["start_m"] for b in bars)
                hi = max(b["end_m"] for b in bars)
                # The bay's bottom bars reach past both its supports.
                assert lo < along[e] and hi > along[e + 1]
        # Top bars over an interior line: past it on each side by at least
        # the shift and the anchorage (the hogging peaks on the line).
        k = 1
        for seg in range(1, (len(Y) if direction == "x" else len(X))):
            bars = bars_of(d, f"grid {direction}{k} segment {seg}", "top", direction)
            assert bars
            lo = min(b["start_m"] for b in bars)
            hi = max(b["end_m"] for b in bars)
            b = bars[0]
            need = (b["shift_mm"] + max(b["anchorage_mm"]["start"], b["anchorage_mm"]["end"])) / 1000
            assert lo <= along[k] - need + 1e-9 and hi >= along[k] + need - 1e-9


def test_anchorage_of_the_top_bars_is_en_8_4_by_hand(ground):
    """EN 1992-1-1 8.4.2–8.4.4 (good bond: a 200 mm slab, 8.4.2(2)): every
    top bar's end that is neither a lap nor a free edge is anchored by lbd."""
    r = ground
    checked = 0
    for b in r["detailing"]["bars"]:
        if b["face"] != "top" or b["role"] != "main":
            continue
        lbd, _ = en_anchorage_by_hand(b["diameter_mm"], r["cover_mm"]["top"], b["spacing_mm"])
        for side in ("start", "end"):
            if b["anchorage_mm"][side] > 0:
                assert b["anchorage_mm"][side] == pytest.approx(lbd, rel=1e-6), (b["where"], side)
                checked += 1
    assert checked > 0


def en_lap_by_hand(bar, r):
    """EN 1992-1-1 8.7.3 (8.10), (8.11), Table 8.3 with every bar lapped at
    the section (α6 = 1.5), σsd = fyd, good bond, α1 = α3 = α5 = 1."""
    phi, s, c = bar["diameter_mm"], bar["spacing_mm"], r["cover_mm"]["top"]
    _, lb_rqd = en_anchorage_by_hand(phi, c, s)
    cd = min((s - phi) / 2, c)
    a2 = min(max(1 - 0.15 * (cd - phi) / phi, 0.7), 1.0)
    return max(a2 * 1.5 * lb_rqd, 0.3 * 1.5 * lb_rqd, 15 * phi, 200.0)


def test_top_bars_of_neighbouring_lines_are_lapped_not_doubled(ground):
    """Where the top bars of two lines of a row would overlap by more than
    a lap they are lapped (EN 8.7.3, all the bars at one section: α6 = 1.5),
    so the row never carries two layers of top bars beyond the lap."""
    d = ground["detailing"]
    for direction in ("x", "y"):
        rows = {}
        for b in d["bars"]:
            if b["face"] == "top" and b.get("direction") == direction and not b["where"].startswith("corner"):
                rows.setdefault((b["across_m"]["from"], b["across_m"]["to"]), []).append(b)
        for bars in rows.values():
            bars.sort(key=lambda b: b["start_m"])
            for a, b in zip(bars, bars[1:]):
                overlap = a["end_m"] - b["start_m"]
                if overlap > 0:
                    (lap,) = [lp for lp in a["laps"] if lp in b["laps"]]
                    assert lap["from_m"] == pytest.approx(b["start_m"])
                    assert lap["length_mm"] == pytest.approx(max(en_lap_by_hand(a, ground), en_lap_by_hand(b, ground)))
                    assert lap["to_m"] <= a["end_m"] + 1e-9
                    assert a["anchorage_mm"]["end"] == 0 and b["anchorage_mm"]["start"] == 0


def test_corner_bars_cover_their_zone_and_are_anchored_past_it(ground):
    r = ground
    d = r["detailing"]
    corners = r["plate"]["corners"]
    assert corners
    for c in corners:
        for g in (g for g in r["regions"] if g["where"] == c["name"]):
            (b,) = bars_of(d, c["name"], g["face"], g["direction"])
            lo, hi = (c["x0_m"], c["x1_m"]) if g["direction"] == "x" else (c["y0_m"], c["y1_m"])
            a0, a1 = (c["y0_m"], c["y1_m"]) if g["direction"] == "x" else (c["x0_m"], c["x1_m"])
            anch = b["anchorage_mm"]["start"] / 1000
            assert b["start_m"] == pytest.approx(lo - anch)
            assert b["end_m"] >= hi + anch - 1e-9
            assert b["count"] == count_over(a1 - a0, g["bars"]["spacing_mm"])


def test_schedule_masses_and_the_plan_area(ground):
    d = ground["detailing"]
    total = 0.0
    for row in d["schedule"]:
        mass = row["count"] * row["length_mm"] / 1000 * UNIT_MASS * row["diameter_mm"] ** 2
        assert row["mass_kg"] == pytest.approx(mass, rel=1e-9)
        total += mass
        # Every bar of a mark adds to its count.
        assert row["count"] == sum(b["count"] for b in d["bars"] if b["mark"] == row["mark"])
    assert d["total_mass_kg"] == pytest.approx(total, rel=1e-9)
    area = sum(GROUND["slab"]["x_spans_m"]) * sum(GROUND["slab"]["y_spans_m"])
    assert d["mass_per_area_kg_m2"] == pytest.approx(total / area, rel=1e-9)


def test_cut_lengths_are_the_extent_rounded_up():
    # Cut lengths in whole 25 mm (common practice).
    d = armature.design(GROUND)["detailing"]
    for b in d["bars"]:
        if b["shape"] == "straight":
            raw = (b["end_m"] - b["start_m"]) * 1000
            assert b["length_mm"] == pytest.approx(raw, abs=1e-6)
            assert b["length_mm"] % 25 == pytest.approx(0, abs=1e-6) or b["length_mm"] % 25 == pytest.approx(25)


def test_free_edge_u_bars_edge_bars_and_the_bars_stopping_at_it():
    r = armature.design(CANOPY)
    d = r["detailing"]
    h = CANOPY["slab"]["thickness_mm"]
    ct, cb = r["cover_mm"]["top"], r["cover_mm"]["bottom"]
    c = max(ct, cb)
    edges = r["plate"]["free_edges"]
    assert edges
    y_edge = sum(CANOPY["slab"]["y_spans_m"])
    for fe in edges:
        u = [b for b in d["bars"] if b["where"] == f"{fe['edge']}, {fe['bay']}"]
        assert len(u) == 1
        u = u[0]
        # EN 9.3.1.4(2): legs 2h from the edge (value from memory), and at
        # least the lap with the bay's bars that stop at the edge (8.7.3).
        leg = max(fe["u_bar_leg_mm"] - c, en_lap_by_hand(u, r))
        assert u["shape"] == "U-bar"
        assert u["legs_mm"] == {"start": pytest.approx(leg), "end": pytest.approx(leg)}
        assert u["length_mm"] == math.ceil((2 * leg + h - ct - cb) / 25 - 1e-9) * 25
        assert u["count"] == count_over(fe["to_m"] - fe["from_m"], fe["u_bar_spacing_mm"])
        assert u["end_m"] == pytest.approx(y_edge - c / 1000)
        assert u["start_m"] == pytest.approx(y_edge - c / 1000 - leg / 1000)
    # One bar in each face along the whole free edge.
    along = [b for b in d["bars"] if b["where"] == "edge y1, edge bar"]
    assert sorted(b["face"] for b in along) == ["bottom", "top"]
    for b in along:
        assert b["count"] == 1 and b["start_m"] == pytest.approx(0.0)
        assert b["end_m"] >= sum(CANOPY["slab"]["x_spans_m"]) - 1e-9
    # The bay's bars in y stop at the free edge less the cover.
    (bottom_y,) = bars_of(d, "bay 1,1", "bottom", "y")
    assert bottom_y["end_m"] == pytest.approx(y_edge - cb / 1000)
    assert bottom_y["anchorage_mm"]["end"] == 0


def test_slab_width_is_not_used_on_a_plan_and_says_so():
    req = copy.deepcopy(GROUND)
    req["detailing"]["slab_width_m"] = 3.0
    r = armature.design(req)
    assert any("slab_width_m is not used" in w for w in r["warnings"])
    assert r["detailing"]["schedule"] == armature.design(GROUND)["detailing"]["schedule"]


def test_detailing_leaves_the_design_unchanged(ground):
    plain = copy.deepcopy(GROUND)
    del plain["detailing"]
    p = armature.design(plain)
    assert [g["bars"] for g in p["regions"]] == [g["bars"] for g in ground["regions"]]
    assert p["max_utilisation"] == ground["max_utilisation"]


# The workshop's studio floor on columns (our own scenario), in each code.
STUDIO_ACI = {"code": "ACI318-19", "concrete": {"cylinder_strength_MPa": 28},
              "slab": {"type": "flat", "x_spans_m": [6.0, 6.0], "y_spans_m": [5.5], "thickness_mm": 230,
                       "columns": {"size_mm": [400, 400], "height_m": 3.5}},
              "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0}, "detailing": {}}
STUDIO_EN = {"code": "EN1992-1-1", "variant": "recommended", "concrete": {"class": "C30/37"},
             "slab": {"type": "flat", "x_spans_m": [6.0, 6.0], "y_spans_m": [5.5, 5.5], "thickness_mm": 250,
                      "columns": {"size_mm": [400, 400]}},
             "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0}, "detailing": {}}


def aci_development_by_hand(db, cover, spacing, fy=420.0, fc=28.0):
    """ACI 318-19 25.4.2.4 (SI): ld = fy/(1.1 λ √f'c) · ψt ψe ψs ψg /
    ((cb + Ktr)/db) · db ≥ 300 mm; bottom bars ψt = 1, uncoated ψe = 1,
    ψs = 0.8 for No. 19 and smaller, ψg = 1.0 for Grade 420, Ktr = 0,
    (cb + Ktr)/db ≤ 2.5."""
    cb = min(cover + db / 2, spacing / 2)
    return max(fy / (1.1 * math.sqrt(fc)) * 0.8 / min(cb / db, 2.5) * db, 300.0)


@pytest.fixture(scope="module")
def studio_aci():
    return armature.design(STUDIO_ACI)


@pytest.mark.parametrize("req", [STUDIO_ACI, STUDIO_EN], ids=["ACI", "EN"])
def test_flat_strips_have_their_bars_over_each_span_band(req):
    r = armature.design(req)
    d = r["detailing"]
    strips = {s["name"]: s for s in r["plate"]["strips"]}
    seen = 0
    for g in r["regions"]:
        if " span " not in g["where"] or g["face"] != "bottom":
            continue
        name, span = g["where"].rsplit(" span ", 1)
        piece = strips[name]["spans"][int(span) - 1]
        lo, hi = (piece["y0_m"], piece["y1_m"]) if g["direction"] == "x" else (piece["x0_m"], piece["x1_m"])
        bars = bars_of(d, g["where"], "bottom", g["direction"])
        assert bars and all(b["bar"] == g["bars"]["bar"] for b in bars)
        # Counted over the strip's band in that span (the strip's width varies with the spans).
        for b in bars:
            assert (b["across_m"]["from"], b["across_m"]["to"]) == (pytest.approx(lo), pytest.approx(hi))
            assert b["count"] == count_over(hi - lo, g["bars"]["spacing_mm"])
        seen += 1
    assert seen > 0
    # Schedule masses at 0.00617 d² kg/m (common practice), over the slab's outline.
    total = sum(row["count"] * row["length_mm"] / 1000 * UNIT_MASS * row["diameter_mm"] ** 2 for row in d["schedule"])
    assert d["total_mass_kg"] == pytest.approx(total, rel=1e-9)
    x0, x1, y0, y1 = (r["plate"]["outline_m"][k] for k in ("x0", "x1", "y0", "y1")) \
        if isinstance(r["plate"]["outline_m"], dict) else r["plate"]["outline_m"]
    assert d["mass_per_area_kg_m2"] == pytest.approx(total / ((x1 - x0) * (y1 - y0)), rel=1e-9)


def test_aci_column_strip_top_bars_reach_the_figure_8_7_4_1_3_extents(studio_aci):
    """ACI 318-19 Figure 8.7.4.1.3: column strip top bars 0.30 ℓn past the
    face of an interior column (value from memory); ℓn the clear span."""
    d = studio_aci["detailing"]
    ln = 6.0 - 0.4
    (b,) = bars_of(d, "column strip y0 at x1", "top", "x")
    assert b["start_m"] <= 6.0 - 0.2 - 0.30 * ln + 1e-9
    assert b["end_m"] >= 6.0 + 0.2 + 0.30 * ln - 1e-9


def test_aci_column_strip_bottom_bars_are_lapped_over_columns_and_anchored_at_edges(studio_aci):
    """ACI 318-19 8.7.4.2.1: column strip bottom bars continuous or spliced
    with a Class B splice over the columns (25.5.2.1: 1.3 ld, ld by
    25.4.2.4); 8.7.4.2.2: anchored at exterior supports (here developed
    past the edge column's inner face)."""
    r = studio_aci
    d = r["detailing"]
    g = next(g for g in r["regions"] if g["where"] == "column strip y0 span 1")
    left = bars_of(d, "column strip y0 span 1", "bottom", "x")[0]
    right = bars_of(d, "column strip y0 span 2", "bottom", "x")[0]
    (lap,) = [lp for lp in left["laps"] if lp in right["laps"]]
    db_l, db_r = left["diameter_mm"], right["diameter_mm"]
    c = r["cover_mm"]["bottom"]
    need = max(1.3 * aci_development_by_hand(db_l, c, left["spacing_mm"]),
               1.3 * aci_development_by_hand(db_r, c, right["spacing_mm"]), 300.0)
    assert lap["length_mm"] == pytest.approx(need, rel=1e-6)
    assert (lap["from_m"] + lap["to_m"]) / 2 == pytest.approx(6.0)
    assert g["bars"]["bar"] == left["bar"]
    # At the edge column (x = 0, 400 mm wide): past its inner face by ld.
    ld = aci_development_by_hand(db_l, c, left["spacing_mm"])
    assert left["start_m"] <= 0.2 - ld / 1000 + 1e-9 or left["shape"] != "straight"


def test_flat_bands_take_their_bars_over_their_width(studio_aci):
    r = studio_aci
    d = r["detailing"]
    bands = r["plate"]["bands"]
    assert bands
    for band in bands:
        g = [g for g in r["regions"] if g["where"] == band["name"] and g["direction"] == band["direction"]]
        if not g:
            continue
        bars = bars_of(d, band["name"], "top", band["direction"])
        assert bars
        for b in bars:
            w = b["across_m"]["to"] - b["across_m"]["from"]
            assert b["count"] == count_over(w, g[0]["bars"]["spacing_mm"])


def test_record_draws_each_row_and_column_with_the_caution(tmp_path):
    import re
    r = armature.design(GROUND)
    path = armature.report(r, tmp_path / "ground.html")
    text = open(path).read()
    svgs = re.findall(r'<svg[^>]*aria-label="bar layout in elevation".*?</svg>', text, re.S)
    rows = len(GROUND["slab"]["y_spans_m"]) + len(GROUND["slab"]["x_spans_m"])
    assert len(svgs) == rows
    d = r["detailing"]
    drawn = [b for b in d["bars"] if not b["where"].startswith("corner")]
    # One thin line per drawn bar (no bent ends here), one heavy per lap.
    assert sum(len(re.findall(r'<line[^>]*stroke-width="1"/>', s)) for s in svgs) == len(drawn)
    assert sum(len(re.findall(r'<line[^>]*stroke-width="3"/>', s)) for s in svgs) == \
        sum(len(b["laps"]) for b in drawn)
    assert "<h4>Bar schedule</h4>" in text and armature.CAUTION in text


def test_bars_between_two_free_edges_keep_their_cover():
    """A bay spanning in y between walls with free edges at x0 and x1 (the
    workshop's bridge link): its bars in x stop at both edges less the
    cover, cut to a whole 25 mm (common practice) without losing cover."""
    req = copy.deepcopy(GROUND)
    req["slab"].update({"x_spans_m": [4.0], "y_spans_m": [4.5],
                        "edges": {"x0": "free", "x1": "free", "y0": "pinned", "y1": "pinned"}})
    r = armature.design(req)
    cb = r["cover_mm"]["bottom"] / 1000
    (b,) = bars_of(r["detailing"], "bay 1,1", "bottom", "x")
    assert b["start_m"] >= cb - 1e-9 and b["end_m"] <= 4.0 - cb + 1e-9
    assert b["end_m"] - b["start_m"] > 4.0 - 2 * cb - 0.025
    assert b["length_mm"] % 25 == pytest.approx(0, abs=1e-6)
    assert b["anchorage_mm"] == {"start": 0, "end": 0}


def narrow_bay_slab(x_spans, y_spans, edges):
    req = copy.deepcopy(GROUND)
    req["slab"].update({"x_spans_m": x_spans, "y_spans_m": y_spans, "edges": edges})
    return armature.design(req)


def test_top_bars_at_a_simple_edge_reach_a_fifth_of_the_span():
    """EN 1992-1-1 9.3.1.2(2): top steel at a simply supported edge over 0.2
    of the adjacent span (value from memory), also where the plate's twist
    gives the edge a little hogging."""
    r = narrow_bay_slab([6.0], [3.0], {"x0": "pinned", "x1": "pinned", "y0": "pinned", "y1": "pinned"})
    (b,) = bars_of(r["detailing"], "edge x0 segment 1", "top", "x")
    assert b["end_m"] >= 0.2 * 6.0 - 1e-9
    (b,) = bars_of(r["detailing"], "edge x1 segment 1", "top", "x")
    assert b["start_m"] <= 6.0 - 0.2 * 6.0 + 1e-9


def test_hogging_away_from_the_lines_is_covered_by_top_bars():
    """A narrow bay beside a wide one: the corner zone spans the narrow
    bay's width, and hogging in y inside the bay reaches no line. Every
    node of the field with hogging in y (outside the corner zones, off the
    supported sides) lies within the narrow column's top y bars."""
    r = narrow_bay_slab([1.2, 6.0], [6.0], {"x0": "pinned", "x1": "pinned", "y0": "pinned", "y1": "pinned"})
    f = r["plate"]["field"]
    xs, ys, top_y = f["x_m"], f["y_m"], f["design"]["top_y"]
    corners = r["plate"]["corners"]

    def in_corner(x, y):
        for c in corners:
            ix = x < c["x1_m"] - 1e-9 if c["x0_m"] <= 1e-9 else x > c["x0_m"] + 1e-9
            iy = y < c["y1_m"] - 1e-9 if c["y0_m"] <= 1e-9 else y > c["y0_m"] + 1e-9
            if ix and iy:
                return True
        return False
    bars = [b for b in r["detailing"]["bars"] if b["face"] == "top" and b.get("direction") == "y"
            and b["across_m"]["to"] <= 1.2 + 1e-9 and not b["where"].startswith("corner")]
    checked = 0
    for i, x in enumerate(xs):
        if not (0.0 < x < 1.2):
            continue
        for j, y in enumerate(ys):
            if top_y[j][i] > 1e-3 and not in_corner(x, y):
                assert any(b["start_m"] <= y <= b["end_m"] for b in bars), (x, y, top_y[j][i])
                checked += 1
    assert checked > 0


@pytest.mark.parametrize("base", [STUDIO_ACI, STUDIO_EN], ids=["ACI", "EN"])
def test_flat_bars_keep_their_cover_at_edge_columns(base):
    """A short span beside a long one (the workshop's stair bay): the
    hogging over the first interior column reaches near the edge column;
    no bar may leave the slab, whose edge is flush with the columns, nor
    enter its cover there (cut lengths rounded up to 25 mm included)."""
    req = copy.deepcopy(base)
    req["slab"]["x_spans_m"] = [3.0, 9.0]
    req["slab"]["columns"]["height_m"] = 3.5  # irregular spans: the columns' moments are needed
    r = armature.design(req)
    o = r["plate"]["outline_m"]
    for b in r["detailing"]["bars"]:
        lo, hi = (o["x0"], o["x1"]) if b["direction"] == "x" else (o["y0"], o["y1"])
        c = r["cover_mm"][b["face"]] / 1000
        assert b["start_m"] >= lo + c - 1e-9 and b["end_m"] <= hi - c + 1e-9, b["where"]


def test_en_top_bars_at_edge_columns_free_to_turn_reach_a_fifth_of_the_span():
    """EN 1992-1-1 9.3.1.2(2) (value from memory): columns free to turn are
    simple supports for the slab's top bars: 0.2 of the end span from the
    column's face."""
    r = armature.design(STUDIO_EN)
    (b,) = bars_of(r["detailing"], "column strip y0 at x0", "top", "x")
    assert b["end_m"] >= 0.2 + 0.2 * 6.0 - 1e-9


def test_aci_column_strip_bottom_bars_are_never_curtailed():
    """ACI 318-19 8.7.4.2.1: every column strip bottom bar continuous or
    spliced over the columns, so detailing.curtail "alternate" leaves them whole."""
    req = copy.deepcopy(STUDIO_ACI)
    req["detailing"]["curtail"] = "alternate"
    r = armature.design(req)
    d = r["detailing"]
    assert not any(b["role"] == "curtailed" and b["where"].startswith("column strip") for b in d["bars"])
    assert any("continuous over the columns" in w for w in r["warnings"])


def test_band_bars_take_the_place_of_the_column_strip_bars_within_the_band():
    """The band over an internal column is designed for at least the
    column strip's moment within its width, so the strip's bars over that
    column keep only the parts beside the band, each set from one spacing
    off the band's edge bar (common practice)."""
    r = armature.design(STUDIO_EN)
    d = r["detailing"]
    checked = 0
    for band in r["plate"]["bands"]:
        bb = bars_of(d, band["name"], "top", band["direction"])
        if not bb:
            continue
        b = bb[0]
        at = band["x0_m"] if band["direction"] == "x" else band["y0_m"]
        for s in d["bars"]:
            if not (s["where"].startswith("column strip") and s["face"] == "top" and s["direction"] == band["direction"]):
                continue
            lo, hi = s["across_m"]["from"], s["across_m"]["to"]
            line = s["where"].rsplit(" at ", 1)[1]
            lines = r["plate"]["x_lines_m"] if band["direction"] == "x" else r["plate"]["y_lines_m"]
            if abs(lines[int(line[1:])] - at) > 1e-6 or not (lo <= b["across_m"]["from"] and b["across_m"]["to"] <= hi):
                continue
            sp = s["spacing_mm"] / 1000
            expect = math.floor((b["across_m"]["from"] - lo) / sp + 1e-9) + math.floor((hi - b["across_m"]["to"]) / sp + 1e-9)
            assert s["count"] == expect
            checked += 1
    assert checked > 0


def test_cli_summary_states_the_schedule_totals(tmp_path):
    import json
    import subprocess
    from conftest import CLI
    r = armature.design(GROUND)
    run = subprocess.run([str(CLI), "design", "-"], input=json.dumps(GROUND), capture_output=True, text=True)
    assert run.returncode in (0, 1), run.stderr
    (line,) = [l for l in run.stdout.splitlines() if l.startswith("Bars ")]
    d = r["detailing"]
    assert f"{len(d['schedule'])} marks" in line
    kg = float(line.split(" marks, ")[1].split(" kg")[0])
    assert kg == pytest.approx(d["total_mass_kg"], rel=1e-3)
    assert "Caution" in run.stdout


def test_flat_free_edges_get_u_bars_and_edge_bars_between_the_columns():
    """EN 1992-1-1 9.3.1.4, Figure 9.8 (value from memory): along a free
    edge U-bars with legs 2h on each face and bars along the edge inside
    the U, the slab's own bars serving. On a flat slab the edge, flush with
    the edge columns, is free between them: each strip ending there gets
    U-bars of its bottom bars over its width, the whole edge is covered,
    and every bar stays inside the outline less the cover."""
    r = armature.design(STUDIO_EN)
    assert not any("not designed for flat slabs" in w for w in r["warnings"])
    o = r["plate"]["outline_m"]
    h = STUDIO_EN["slab"]["thickness_mm"]
    edges = r["plate"]["free_edges"]
    regions = {(g["where"], g["face"], g["direction"]): g for g in r["regions"]}
    for name, (lo, hi), across in (("edge x0", (o["y0"], o["y1"]), "x"), ("edge x1", (o["y0"], o["y1"]), "x"),
                                   ("edge y0", (o["x0"], o["x1"]), "y"), ("edge y1", (o["x0"], o["x1"]), "y")):
        mine = sorted((f for f in edges if f["edge"] == name), key=lambda f: f["from_m"])
        assert mine, name
        # The whole edge, strip after strip.
        assert mine[0]["from_m"] == pytest.approx(lo) and mine[-1]["to_m"] == pytest.approx(hi)
        for a, b in zip(mine, mine[1:]):
            assert b["from_m"] == pytest.approx(a["to_m"])
        for f in mine:
            g = regions[(f["bay"], "bottom", across)]
            assert f["u_bar"] == g["bars"]["bar"] and f["u_bar_spacing_mm"] == g["bars"]["spacing_mm"]
            assert f["u_bar_leg_mm"] == pytest.approx(2 * h)
    d = r["detailing"]
    c = max(r["cover_mm"].values()) / 1000
    loops = [b for b in d["bars"] if b["where"].startswith("edge ") and b["shape"] == "U-bar"]
    assert len(loops) == len(edges)
    for b in loops:
        f = next(f for f in edges if b["where"] == f["edge"] + ", " + f["bay"])
        width = f["to_m"] - f["from_m"]
        assert b["count"] == count_over(width, f["u_bar_spacing_mm"])
        assert b["legs_mm"]["start"] >= 2 * h - c * 1000 - 1e-6
        lo, hi = (o["x0"], o["x1"]) if b["direction"] == "x" else (o["y0"], o["y1"])
        assert b["start_m"] >= lo + c - 1e-9 and b["end_m"] <= hi - c + 1e-9
        assert min(b["end_m"] - lo, hi - b["start_m"]) <= (b["legs_mm"]["start"] / 1000 + c) + 1e-6
        # The flat leg laps the strip's bottom bars across the edge (EN 8.7.3, every bar at the
        # section): where they stop short of the edge (a column strip anchored past its column),
        # the leg reaches past their end by the lap.
        lap = next(x["length_mm"] for x in d["derivations"]
                   if x["where"] == b["where"] + ", U-bars" and x["what"].startswith("lap"))
        across = [x for x in d["bars"] if x["where"] == f["bay"] and x["face"] == "bottom"
                  and x["direction"] == b["direction"]]
        assert across
        at_low = b["start_m"] < (lo + hi) / 2
        end = min(x["start_m"] for x in across) if at_low else max(x["end_m"] for x in across)
        overlap = (b["end_m"] - end) if at_low else (end - b["start_m"])
        assert overlap * 1000 >= lap - 1e-6, (b["where"], overlap, lap)
    # One bar along each edge in each face, inside the outline less the cover.
    for name in ("edge x0", "edge x1", "edge y0", "edge y1"):
        along = [b for b in d["bars"] if b["where"] == name + ", edge bar"]
        for face in ("bottom", "top"):
            pieces = [b for b in along if b["face"] == face]
            assert pieces, (name, face)
            lo, hi = (o["y0"], o["y1"]) if name.startswith("edge x") else (o["x0"], o["x1"])
            assert min(b["start_m"] for b in pieces) >= lo + c - 1e-9
            assert max(b["end_m"] for b in pieces) <= hi - c + 1e-9
            # Reaches within a 25 mm rounding of the cover at both corners (both crossing edges are free).
            assert min(b["start_m"] for b in pieces) <= lo + c + 0.025 + 1e-9
            assert max(b["end_m"] for b in pieces) >= hi - c - 0.025 - 1e-9
    # The schedule carries them: mass = count × length × 0.00617 d² (common practice).
    for row in d["schedule"]:
        assert row["mass_kg"] == pytest.approx(row["count"] * row["length_mm"] / 1000 * UNIT_MASS * row["diameter_mm"] ** 2)


def test_aci_flat_slab_has_no_free_edge_rule():
    """ACI 318-19 sets no U-bar rule for a slab's free edge (value from
    memory): none designed, none scheduled."""
    r = armature.design(STUDIO_ACI)
    assert r["plate"]["free_edges"] == []
    assert not any(b["where"].startswith("edge ") for b in r["detailing"]["bars"])


def top_over_line_by_hand(r, strip, k):
    """The top steel over interior line k that falls to a column strip
    (mm²): its own bars over its width there, a band's more within the
    band's width, half of each neighbouring middle strip's (the whole of a
    middle strip with one column strip beside it: at a wall)."""
    p = r["plate"]
    axis = "x" if strip["direction"] == "x" else "y"
    lohi = ("y0_m", "y1_m") if axis == "x" else ("x0_m", "x1_m")
    regions = {(g["where"], g["face"], g["direction"]): g for g in r["regions"]}

    def width(s):
        a, b = s["spans"][k - 1], s["spans"][k]
        return min(a[lohi[0]], b[lohi[0]]), max(a[lohi[1]], b[lohi[1]])

    lo, hi = width(strip)
    own = regions[("%s at %s%d" % (strip["name"], axis, k), "top", axis)]["bars"]["As_prov_mm2"]
    total = own * (hi - lo)
    line = p["x_lines_m" if axis == "x" else "y_lines_m"][k]
    for band in p["bands"]:
        if band["direction"] != axis:
            continue
        q = band
        at = q["x0_m"] if axis == "x" else q["y0_m"]
        b0, b1 = q[lohi[0]], q[lohi[1]]
        if abs(at - line) < 1e-3 and b0 >= lo - 1e-3 and b1 <= hi + 1e-3:
            total += (regions[(band["name"], "top", axis)]["bars"]["As_prov_mm2"] - own) * (b1 - b0)
    def touch(a, b):
        return abs(a[1] - b[0]) < 1e-3 or abs(a[0] - b[1]) < 1e-3

    columns = [width(c) for c in p["strips"] if c["kind"] == "column" and c["direction"] == axis]
    for m in p["strips"]:
        if m["kind"] != "middle" or m["direction"] != axis:
            continue
        mw = width(m)
        if touch(mw, (lo, hi)):
            share = 1 / sum(1 for c in columns if touch(mw, c))
            total += regions[("%s at %s%d" % (m["name"], axis, k), "top", axis)]["bars"]["As_prov_mm2"] * (mw[1] - mw[0]) * share
    return total


@pytest.mark.parametrize("walls", [{}, {"x0": "columns", "x1": "columns", "y0": "wall", "y1": "wall"}], ids=["columns", "walls"])
def test_en_flat_slab_in_fire_gets_continuous_top_bars_in_its_column_strips(walls):
    """EN 1992-1-2 5.7.4(2) (value from memory): from REI 90, at least 20 %
    of the top reinforcement over the intermediate supports, in each
    direction, continuous over the full span, in the column strip. Each
    column strip gets bars of its own from the slab's end to its other end
    less the cover, as many of its largest top bar as 20 % of the largest
    interior line's top steel needs (counted here from the regions and the
    plate's strips), at least two."""
    req = copy.deepcopy(STUDIO_EN)
    req["fire"] = {"resistance_min": 90}
    if walls:
        req["slab"]["edges"] = walls
    r = armature.design(req)
    assert not any("5.7.4(2)" in w for w in r["warnings"])
    p, d = r["plate"], r["detailing"]
    o = p["outline_m"]
    c = r["cover_mm"]["top"] / 1000
    for strip in (s for s in p["strips"] if s["kind"] == "column"):
        axis = strip["direction"]
        n = len(p["x_lines_m" if axis == "x" else "y_lines_m"]) - 1
        need = 0.2 * max(top_over_line_by_hand(r, strip, k) for k in range(1, n))
        bars = [b for b in d["bars"] if b["where"] == strip["name"] + ", fire continuity"]
        assert bars, strip["name"]
        phi = bars[0]["diameter_mm"]
        tops = [g for g in r["regions"] if g["face"] == "top" and g["direction"] == axis
                and g["where"].startswith(strip["name"] + " at ") and not g["where"].endswith(("0", str(n)))]
        assert phi == max(g["bars"]["diameter_mm"] for g in tops)
        count = max(2, math.ceil(need / (math.pi * phi ** 2 / 4) - 1e-9))
        (deriv,) = [x for x in d["derivations"] if x["where"] == strip["name"] + ", fire continuity"]
        assert deriv["clause"] == "EN 1992-1-2 5.7.4(2)"
        # Every bar across the strip is continuous from end to end: the pieces of
        # each lapped set cover the whole length, and the sets hold `count` bars.
        lo, hi = (o["x0"], o["x1"]) if axis == "x" else (o["y0"], o["y1"])
        assert deriv["length_mm"] == pytest.approx((hi - lo - 2 * c) * 1000)
        assert min(b["start_m"] for b in bars) == pytest.approx(lo + c, abs=0.025 + 1e-9)
        assert max(b["end_m"] for b in bars) == pytest.approx(hi - c, abs=0.025 + 1e-9)
        assert all(b["start_m"] >= lo + c - 1e-9 and b["end_m"] <= hi - c + 1e-9 for b in bars)
        firsts = [b for b in bars if b["start_m"] == pytest.approx(min(x["start_m"] for x in bars))]
        assert sum(b["count"] for b in firsts) == count
    # Below REI 90 the clause asks nothing.
    req["fire"]["resistance_min"] = 60
    r60 = armature.design(req)
    assert not any(b["where"].endswith("fire continuity") for b in r60["detailing"]["bars"])
    # Without detailing the design says what the drawings must show.
    plain = copy.deepcopy(STUDIO_EN)
    plain["fire"] = {"resistance_min": 90}
    del plain["detailing"]
    assert any("5.7.4(2)" in w for w in armature.design(plain)["warnings"])


def test_bent_legs_keep_the_opposite_cover_or_say_they_do_not_fit():
    """A leg in the slab runs from the bar's face (an inner layer lies a bar
    deeper: d + φ/2 from the opposite face) to the opposite cover at most;
    a standard leg that does not fit is said (the workshop's EN flat slab
    on 300 mm columns, 200 mm thick, in two directions)."""
    req = copy.deepcopy(STUDIO_EN)
    req["slab"].update({"x_spans_m": [5.0, 5.0], "y_spans_m": [5.5, 5.5], "thickness_mm": 200,
                        "columns": {"size_mm": [300, 300], "height_m": 3.5}})
    r = armature.design(req)
    regions = {(g["where"], g["face"], g["direction"]): g for g in r["regions"]}
    checked = 0
    for b in r["detailing"]["bars"]:
        g = regions.get((b["where"], b["face"], b["direction"]))
        if g is None or b.get("body_mm"):
            continue
        opposite = "bottom" if b["face"] == "top" else "top"
        room = g["effective_depth_mm"] + b["diameter_mm"] / 2 - r["cover_mm"][opposite]
        for side in ("start", "end"):
            leg = b["legs_mm"][side]
            if leg <= 0:
                continue
            checked += 1
            if leg > room + 1e-6:
                assert any(w.startswith(b["where"] + ", " + b["face"]) and "does not fit the slab's depth (%g mm"
                           % float("%.4g" % room) in w for w in r["warnings"]), (b["where"], leg, room)
    assert checked > 0
