"""Detailing of one-way strips (request and result `detailing`): every
bar's extent against an envelope worked out here from the result's moment
diagram, anchorage against the clauses evaluated by hand, laps, counts,
schedule masses and bad input. Strips are our own workshop-floor scenarios."""
import copy
import math
import random

import pytest

import armature
from conftest import BASE_REQUEST

UNIT_MASS = 0.00617  # kg/m per mm² of d²: 0.00617 d² kg/m (common practice)


def workshop(spans, ends, h=200, width=6.0, code="EN", **detailing):
    if code == "EN":
        req = {"code": "EN1992-1-1", "variant": "recommended", "concrete": {"class": "C30/37"},
               "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0}}
    else:
        req = {"code": "ACI318-19", "concrete": {"cylinder_strength_MPa": 28},
               "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0}}
    req["slab"] = {"spans_m": spans, "ends": ends, "thickness_mm": h}
    req["detailing"] = dict({"slab_width_m": width}, **detailing)
    return req


def strip_nodes(spans):
    X = [0.0]
    for L in spans:
        X.append(X[-1] + L)
    return X


def zones(envelope, sign):
    """Contiguous zones (x_from, x_to) of the envelope where sagging (sign +1,
    M_max > 0) or hogging (sign −1, M_min < 0), with zero points found by
    linear interpolation between the diagram's points."""
    peak = max(max(abs(p["M_max_kNm"]), abs(p["M_min_kNm"])) for p in envelope)
    tol = 1e-6 * peak
    key = "M_max_kNm" if sign > 0 else "M_min_kNm"
    pts = sorted(((p["x_m"], sign * p[key]) for p in envelope), key=lambda t: t[0])
    out, cur = [], None
    for i, (x, f) in enumerate(pts):
        if f > tol:
            if cur is None:
                if i > 0 and pts[i - 1][1] <= tol and pts[i - 1][0] < x:
                    xa, fa = pts[i - 1]
                    cur = [xa + (x - xa) * (0 - fa) / (f - fa) if f != fa else xa, x]
                else:
                    cur = [x, x]
            cur[1] = x
            nxt = pts[i + 1] if i + 1 < len(pts) else None
            if nxt is not None and nxt[1] <= tol and nxt[0] > x:
                xb, fb = nxt
                cur[1] = x + (xb - x) * f / (f - fb)
                out.append(tuple(cur))
                cur = None
        elif cur is not None and x > cur[1]:
            out.append(tuple(cur))
            cur = None
    if cur is not None:
        out.append(tuple(cur))
    return out


def en_anchorage_by_hand(phi, cover, spacing, fck=30.0, fyk=500.0, good=True):
    """EN 1992-1-1 8.4.2 (8.2), 8.4.3 (8.3), 8.4.4 (8.4), (8.6), Table 8.2
    (straight bar, α1 = α3 = α4 = α5 = 1), evaluated here."""
    fctm = 0.30 * fck ** (2 / 3)                  # Table 3.1
    fbd = 2.25 * (1.0 if good else 0.7) * 0.7 * fctm / 1.5
    lb_rqd = phi / 4 * (fyk / 1.15) / fbd
    cd = min((spacing - phi) / 2, cover)
    a2 = min(max(1 - 0.15 * (cd - phi) / phi, 0.7), 1.0)
    return max(a2 * lb_rqd, 0.3 * lb_rqd, 10 * phi, 100.0), lb_rqd


def main_bars(d):
    return [b for b in d["bars"] if b["role"] == "main"]


def check_cover_of_envelope(req, r):
    """Every sagging zone lies within a bottom bar, every hogging zone within
    a top bar, each shifted by the bar's shift and anchored beyond, except
    where the zone meets the strip's end: past an end support's line by the
    bar's end anchorage, or to a free tip less the cover."""
    d = r["detailing"]
    spans, ends = req["slab"]["spans_m"], req["slab"]["ends"]
    X = strip_nodes(spans)
    total = X[-1]
    eps = 1e-6
    for sign, face in ((1, "bottom"), (-1, "top")):
        bars = [b for b in main_bars(d) if b["face"] == face]
        # Laps: a located run is the union of its pieces; group by where.
        runs = {}
        for b in bars:
            lo, hi = runs.get(b["where"], (math.inf, -math.inf))
            runs[b["where"]] = (min(lo, b["start_m"]), max(hi, b["end_m"]))
        extra = {b["where"]: (b["shift_mm"], b["anchorage_mm"]) for b in bars}
        for z0, z1 in zones(d["envelope"], sign):
            covering = []
            for where, (lo, hi) in runs.items():
                shift, anch = extra[where]
                # Which bar claims this zone: the one whose extent contains it.
                # At a free tip the bars stop short by the cover.
                tip0 = r["cover_mm"][face] / 1000 if ends[0] == "free" and z0 <= eps else 0.0
                tip1 = r["cover_mm"][face] / 1000 if ends[1] == "free" and z1 >= total - eps else 0.0
                if lo <= z0 + tip0 + eps and hi >= z1 - tip1 - eps:
                    covering.append((where, lo, hi, shift, anch))
            assert covering, (face, z0, z1, runs)
            ok = False
            for where, lo, hi, shift, anch in covering:
                lo_need, hi_need = [], []
                for z, side, need in ((z0, "start", lo_need), (z1, "end", hi_need)):
                    at_end = (z <= eps) if side == "start" else (z >= total - eps)
                    end_i = 0 if side == "start" else 1
                    free = ends[end_i] == "free"
                    if at_end and free:
                        need.append(None)  # to the tip less the cover
                    elif at_end or (face == "bottom" and anch[side] > 0 and
                                    abs(z - (0 if side == "start" else total)) < eps):
                        need.append((0 if side == "start" else total) +
                                    (-1 if side == "start" else 1) * anch[side] / 1000)
                    else:
                        need.append(z + (-1 if side == "start" else 1) * (shift + anch[side]) / 1000)
                s_ok = lo_need[0] is None and lo <= 0.05 or lo_need[0] is not None and lo <= lo_need[0] + 1e-9
                e_ok = hi_need[0] is None and hi >= total - 0.05 or hi_need[0] is not None and hi >= hi_need[0] - 1e-9
                ok = ok or (s_ok and e_ok)
            assert ok, (face, z0, z1, covering)


def check_schedule(req, r):
    d = r["detailing"]
    width = req["detailing"]["slab_width_m"]
    for b in d["bars"]:
        # Cut length: the extent (along the strip, or across it for distribution bars), rounded up to 25 mm.
        if b["role"] in ("main", "curtailed"):
            assert b["length_mm"] == pytest.approx((b["end_m"] - b["start_m"]) * 1000, abs=1e-6)
        else:
            assert b["length_mm"] == pytest.approx((b["across_m"]["to"] - b["across_m"]["from"]) * 1000, abs=1e-6)
        assert b["length_mm"] % 25 == 0 or b["length_mm"] > req["detailing"].get("stock_length_m", 12) * 1000 - 25
    # Main bars at one location: floor(width / spacing) + 1 (split between alternate laps).
    per_where = {}
    for b in main_bars(d):
        per_where.setdefault(b["where"], []).append(b)
    for where, bs in per_where.items():
        expected = math.floor(width * 1000 / bs[0]["spacing_mm"] + 1e-9) + 1
        cut = [b for b in d["bars"] if b["where"] == where and b["role"] == "curtailed"]
        if cut:  # alternate sets at twice the bars' spacing: the continuing set takes the odd bars
            all_ = math.floor(width * 1000 / (bs[0]["spacing_mm"] / 2) + 1e-9) + 1
            expected = (all_ + 1) // 2
            assert sum(b["count"] for b in cut if b["start_m"] == min(c["start_m"] for c in cut)) == all_ // 2
        if any(b["laps"] for b in bs):
            # Alternate bars lapped at staggered positions: both sets start at the run's start.
            first = min(b["start_m"] for b in bs)
            assert sum(b["count"] for b in bs if b["start_m"] == pytest.approx(first, abs=1e-9)) == expected
        else:
            assert len(bs) == 1 and bs[0]["count"] == expected, (where, bs)
    # Schedule: one row per mark; count summed; mass = count × length × unit mass; total = sum.
    rows = {row["mark"]: row for row in d["schedule"]}
    assert len(rows) == len(d["schedule"])
    for mark, row in rows.items():
        bs = [b for b in d["bars"] if b["mark"] == mark]
        assert {(b["diameter_mm"], b["shape"], b["length_mm"]) for b in bs} == {
            (row["diameter_mm"], row["shape"], row["length_mm"])}
        assert row["count"] == sum(b["count"] for b in bs)
        assert row["mass_kg"] == pytest.approx(row["count"] * row["length_mm"] / 1000 * UNIT_MASS * row["diameter_mm"] ** 2,
                                               rel=1e-12)
    assert d["total_mass_kg"] == pytest.approx(sum(r_["mass_kg"] for r_ in d["schedule"]), rel=1e-12)
    total_m = sum(req["slab"]["spans_m"])
    assert d["mass_per_area_kg_m2"] == pytest.approx(d["total_mass_kg"] / (width * total_m), rel=1e-12)
    # Distinct marks for distinct bars.
    keys = [(row["diameter_mm"], row["shape"], row["length_mm"]) for row in d["schedule"]]
    assert len(set(keys)) == len(keys)


def check_curtailed(req, r):
    """Where the envelope exceeds what the continuing half of a span's
    bottom bars carries (EN rectangular block, evaluated here), its
    curtailed bars are developed: their ends lie at least the shift plus
    their anchorage beyond every such point, or at the continuing bars'
    ends. Returns the number of curtailed bar entries."""
    regions = {(g["where"], g["face"]): g for g in r["regions"]}
    X = strip_nodes(req["slab"]["spans_m"])
    cut = [b for b in r["detailing"]["bars"] if b["role"] == "curtailed"]
    for b in cut:
        g = regions[(b["where"], "bottom")]
        M_half = en_moment_resistance(g["bars"]["As_prov_mm2"] / 2, g["effective_depth_mm"]) * 1e-6
        cont = [c for c in r["detailing"]["bars"] if c["where"] == b["where"] and c["role"] == "main"]
        lo, hi = min(c["start_m"] for c in cont), max(c["end_m"] for c in cont)
        e = int(b["where"].split()[1]) - 1
        for p in r["detailing"]["envelope"]:
            if X[e] - 1e-9 <= p["x_m"] <= X[e + 1] + 1e-9 and p["M_max_kNm"] > M_half:
                assert b["start_m"] <= p["x_m"] - (b["shift_mm"] + b["anchorage_mm"]["start"]) / 1000 + 1e-9 \
                    or b["start_m"] <= lo + 1e-9
                assert b["end_m"] >= p["x_m"] + (b["shift_mm"] + b["anchorage_mm"]["end"]) / 1000 - 1e-9 \
                    or b["end_m"] >= hi - 1e-9
    return len(cut)


@pytest.mark.parametrize("seed", [3, 11, 29, 47, 88])
def test_random_en_strips_cover_the_envelope(seed):
    rng = random.Random(seed)
    n = rng.randint(1, 4)
    spans = [round(rng.uniform(2.5, 6.0), 2) for _ in range(n)]
    ends = [rng.choice(["pinned", "fixed"]), rng.choice(["pinned", "fixed"])]
    if n >= 2 and rng.random() < 0.6:
        spans[0] = round(rng.uniform(0.8, 1.6), 2)
        ends[0] = "free"
    req = workshop(spans, ends, h=rng.choice([180, 200, 220, 240]), width=round(rng.uniform(3.0, 9.0), 2))
    r = armature.design(req)
    check_cover_of_envelope(req, r)
    check_schedule(req, r)
    # The same strip with alternate bars stopped: the continuing bars still
    # cover the envelope; where the curtailed ones stop, the continuing half
    # carries the envelope (EN rectangular block, evaluated here).
    alt = copy.deepcopy(req)
    alt["detailing"]["curtail"] = "alternate"
    alt["loads"]["imposed_kPa"] = 6.0  # past the minimum steel, so that bars can stop
    ra = armature.design(alt)
    check_cover_of_envelope(alt, ra)
    check_schedule(alt, ra)
    check_curtailed(alt, ra)
    # Interior anchorage of main bars is EN lbd by hand (good bond: slab ≤ 250 mm, Figure 8.2).
    regions = {(g["where"], g["face"]): g for g in r["regions"]}
    for b in main_bars(r["detailing"]):
        g = regions[(b["where"], b["face"])]
        lbd, _ = en_anchorage_by_hand(b["diameter_mm"], r["cover_mm"][b["face"]], b["spacing_mm"])
        # al = d (9.2.1.3(2)).
        assert b["shift_mm"] == pytest.approx(g["effective_depth_mm"])
        for side in ("start", "end"):
            a = b["anchorage_mm"][side]
            assert a == 0 or a >= min(lbd, 100.0) - 1e-9
            if b["face"] == "top" and a > 0:
                assert a == pytest.approx(lbd, rel=1e-9)


@pytest.mark.parametrize("seed", [5, 17])
def test_random_aci_strips_cover_the_envelope(seed):
    rng = random.Random(seed)
    n = rng.randint(2, 3)
    spans = [round(rng.uniform(3.0, 5.5), 2) for _ in range(n)]
    ends = [rng.choice(["pinned", "fixed"]), "pinned"]
    req = workshop(spans, ends, h=190, width=5.0, code="ACI")
    r = armature.design(req)
    check_cover_of_envelope(req, r)
    check_schedule(req, r)
    for b in main_bars(r["detailing"]):
        # 25.4.2.1: ld ≥ 300 mm; 7.7.3.3: shift max(d, 12 db).
        g = next(g for g in r["regions"] if g["where"] == b["where"] and g["face"] == b["face"])
        assert b["shift_mm"] == pytest.approx(max(g["effective_depth_mm"], 12 * b["diameter_mm"]))
        for side in ("start", "end"):
            assert b["anchorage_mm"][side] in (0, 150) or b["anchorage_mm"][side] >= 300


def test_end_support_anchorage_of_a_simple_span():
    """EN 9.2.1.4: FE = VEd al/z (z = 0.9 d); with the small stress it gives,
    lb,min = max(0.3 lb,rqd, 10 φ, 100 mm) governs (evaluated here)."""
    req = workshop([4.2], ["pinned", "pinned"], h=200, width=6.0)
    r = armature.design(req)
    (b,) = [b for b in main_bars(r["detailing"]) if b["face"] == "bottom"]
    _, lb_rqd = en_anchorage_by_hand(b["diameter_mm"], r["cover_mm"]["bottom"], b["spacing_mm"])
    expected = max(0.3 * lb_rqd, 10 * b["diameter_mm"], 100)
    assert b["anchorage_mm"]["start"] == pytest.approx(expected, rel=1e-9)
    assert b["start_m"] == pytest.approx(-expected / 1000, abs=1e-9)
    assert b["end_m"] >= 4.2 + expected / 1000 - 1e-9
    assert b["clause"].endswith("9.2.1.4, 9.3.1.2")
    # 9.3.1.2(2): the top bars at each simple end run at least 0.2 × 4.2 = 0.84 m into the span.
    tops = sorted((b for b in main_bars(r["detailing"]) if b["face"] == "top"), key=lambda b: b["start_m"])
    assert len(tops) == 2
    assert tops[0]["end_m"] >= 0.84 - 1e-9 and tops[1]["start_m"] <= 4.2 - 0.84 + 1e-9
    assert any(dv["what"] == "extent into the span" and dv["length_mm"] == pytest.approx(840)
               for dv in r["detailing"]["derivations"])


def test_poor_bond_lengthens_anchorage_by_1_over_0_7():
    good = armature.design(workshop([3.6, 4.2], ["pinned", "pinned"], bond="good"))
    poor = armature.design(workshop([3.6, 4.2], ["pinned", "pinned"], bond="poor"))
    top_good = [b for b in main_bars(good["detailing"]) if b["face"] == "top"][0]
    top_poor = [b for b in main_bars(poor["detailing"]) if b["face"] == "top"][0]
    # 8.4.2(2): η1 = 0.7 (α2 and the minimum do not govern here).
    assert top_poor["anchorage_mm"]["end"] == pytest.approx(top_good["anchorage_mm"]["end"] / 0.7, rel=1e-9)


def test_laps_where_bars_are_longer_than_the_stock():
    req = workshop([7.5], ["fixed", "fixed"], h=240, width=4.0, stock_length_m=3.0)
    r = armature.design(req)
    d = r["detailing"]
    stock = 3000.0
    laps = [dv for dv in d["derivations"] if dv["what"] == "lap"]
    assert laps
    bottom = [b for b in main_bars(d) if b["face"] == "bottom"]
    lap = next(dv["length_mm"] for dv in laps if dv["where"] == "span 1, bottom")
    # EN 8.7.3: alternate bars lapped (50 % at a section): α6 = (50/25)^0.5; l0 by hand.
    phi, s = bottom[0]["diameter_mm"], bottom[0]["spacing_mm"]
    cover = r["cover_mm"]["bottom"]
    _, lb_rqd = en_anchorage_by_hand(phi, cover, s)
    cd = min((s - phi) / 2, cover)
    a2 = min(max(1 - 0.15 * (cd - phi) / phi, 0.7), 1.0)
    assert lap == pytest.approx(max(a2 * math.sqrt(2) * lb_rqd, 0.3 * math.sqrt(2) * lb_rqd, 15 * phi, 200), rel=1e-9)
    for b in bottom:
        assert b["length_mm"] <= stock
        for l_ in b["laps"]:
            assert l_["length_mm"] == pytest.approx(lap)
    # Consecutive pieces of each set overlap by at least the lap; the two sets' laps are staggered.
    count = math.floor(4000 / s + 1e-9) + 1
    sets = {}
    first = min(b["start_m"] for b in bottom)
    starters = sorted((b for b in bottom if b["start_m"] == pytest.approx(first, abs=1e-9)), key=lambda b: b["end_m"])
    assert len(starters) == 2 and sum(b["count"] for b in starters) == count
    # Each set: the pieces chained from its first one.
    for k, b0 in enumerate(starters):
        chain = [b0]
        while True:
            nxt = [b for b in bottom if b is not chain[-1] and b["count"] == b0["count"] and
                   chain[-1]["laps"] and b["start_m"] == pytest.approx(chain[-1]["laps"][-1]["from_m"], abs=1e-9)]
            if not nxt:
                break
            chain.append(nxt[0])
        sets[k] = chain
    centres = []
    for pieces in sets.values():
        pieces.sort(key=lambda b: b["start_m"])
        for a, b in zip(pieces, pieces[1:]):
            assert a["end_m"] - b["start_m"] >= lap / 1000 - 1e-9
        centres.append({round((l_["from_m"] + l_["to_m"]) / 2, 3) for b in pieces for l_ in b["laps"]})
    if len(centres) == 2:
        assert not (centres[0] & centres[1])
    check_schedule(req, r)


def test_detailing_leaves_the_design_unchanged():
    req = workshop([1.2, 4.2, 3.6], ["free", "pinned"])
    plain = copy.deepcopy(req)
    del plain["detailing"]
    a, b = armature.design(req), armature.design(plain)
    assert "detailing" not in b
    a = dict(a)
    del a["detailing"]
    assert a == dict(b)


@pytest.mark.parametrize("field,value,expected", [
    ("slab_width_m", 0, "detailing.slab_width_m"),
    ("slab_width_m", -2.0, "detailing.slab_width_m"),
    ("curtail", "sometimes", "detailing.curtail"),
    ("bond", "medium", "detailing.bond"),
    ("stock_length_m", 0, "detailing.stock_length_m"),
    ("colour", "red", "detailing.colour"),
])
def test_bad_detailing_input_names_the_field(field, value, expected):
    req = workshop([4.2], ["pinned", "pinned"])
    req["detailing"][field] = value
    with pytest.raises(armature.InputError) as info:
        armature.design(req)
    assert any(line.startswith(expected + ": ") for line in str(info.value).splitlines()), str(info.value)


def test_bad_detailing_fields_are_listed_together():
    req = workshop([4.2], ["pinned", "pinned"], curtail="sometimes", bond="medium")
    req["detailing"]["slab_width_m"] = 0
    with pytest.raises(armature.InputError) as info:
        armature.design(req)
    lines = str(info.value).splitlines()
    for f in ("detailing.slab_width_m", "detailing.curtail", "detailing.bond"):
        assert any(line.startswith(f + ": ") for line in lines), lines


def test_slab_width_is_required():
    req = workshop([4.2], ["pinned", "pinned"])
    del req["detailing"]["slab_width_m"]
    with pytest.raises(armature.InputError) as info:
        armature.design(req)
    assert "detailing.slab_width_m: " in str(info.value)


def test_stock_shorter_than_the_laps_is_refused():
    req = workshop([4.2], ["pinned", "pinned"], stock_length_m=0.5)
    with pytest.raises(armature.InputError) as info:
        armature.design(req)
    assert any(line.startswith("detailing.stock_length_m: ") for line in str(info.value).splitlines())


def test_schedule_dataframe_matches_the_result():
    req = workshop([1.2, 4.2, 3.6], ["free", "pinned"])
    r = armature.design(req)
    frame = armature.schedule(r)
    assert list(frame.columns) == ["mark", "bar", "count", "length_mm", "shape", "mass_kg"]
    assert len(frame) == len(r["detailing"]["schedule"])
    # mass = count × length × 0.00617 d² (common practice), total = sum.
    for (_, row), src in zip(frame.iterrows(), r["detailing"]["schedule"]):
        assert row["mark"] == src["mark"] and row["count"] == src["count"]
        assert row["mass_kg"] == pytest.approx(row["count"] * row["length_mm"] / 1000 * UNIT_MASS *
                                               src["diameter_mm"] ** 2)
    assert frame["mass_kg"].sum() == pytest.approx(frame.attrs["total_mass_kg"])
    assert frame.attrs["caution"] == armature.CAUTION
    with pytest.raises(armature.InputError):
        armature.schedule(armature.design(copy.deepcopy(BASE_REQUEST)))


def test_cli_writes_the_schedule_as_csv(tmp_path):
    import csv
    import json
    import subprocess
    from conftest import CLI
    req = workshop([3.6, 4.2], ["pinned", "fixed"], width=5.0)
    path = tmp_path / "bars.csv"
    run = subprocess.run([str(CLI), "design", "-", "--schedule", str(path)], input=json.dumps(req),
                         capture_output=True, text=True)
    assert run.returncode in (0, 1), run.stderr
    lines = path.read_text().splitlines()
    assert lines[0] == "# " + armature.CAUTION
    rows = list(csv.DictReader(lines[1:]))
    expected = armature.design(req)["detailing"]["schedule"]
    assert [r_["mark"] for r_ in rows] == [e["mark"] for e in expected]
    for r_, e in zip(rows, expected):
        assert int(r_["count"]) == e["count"] and float(r_["length_mm"]) == e["length_mm"]
        assert r_["shape"] == "straight" and r_["bar"] == e["bar"]
        assert float(r_["mass_kg"]) == pytest.approx(int(r_["count"]) * float(r_["length_mm"]) / 1000 * UNIT_MASS *
                                                     e["diameter_mm"] ** 2, abs=5e-4)
    # Without detailing: refused, exit 2.
    plain = copy.deepcopy(req)
    del plain["detailing"]
    run = subprocess.run([str(CLI), "design", "-", "--schedule", str(tmp_path / "none.csv")],
                         input=json.dumps(plain), capture_output=True, text=True)
    assert run.returncode == 2 and "--schedule" in run.stderr


def test_sweep_takes_its_steel_from_the_schedule():
    req = workshop([4.2, 3.6], ["pinned", "pinned"], width=6.0)
    frame = armature.sweep(req, {"slab.thickness_mm": [200, 240]})
    for _, row in frame.iterrows():
        one = copy.deepcopy(req)
        one["slab"]["thickness_mm"] = int(row["slab.thickness_mm"])
        assert row["steel_kg_m2"] == pytest.approx(armature.design(one)["detailing"]["mass_per_area_kg_m2"])


def test_record_draws_every_bar_and_derives_every_length(tmp_path):
    import json
    import re
    import subprocess
    from conftest import CLI
    req = workshop([1.2, 4.2, 3.6], ["free", "pinned"], width=6.0, stock_length_m=3.0)
    html, md = tmp_path / "record.html", tmp_path / "record.md"
    for path in (html, md):
        run = subprocess.run([str(CLI), "design", "-", "--report", str(path)], input=json.dumps(req),
                             capture_output=True, text=True)
        assert run.returncode in (0, 1), run.stderr
    r = armature.design(req)
    d = r["detailing"]
    text = html.read_text()
    svg = re.search(r'<svg[^>]*aria-label="bar layout in elevation".*?</svg>', text, re.S).group(0)
    mains = main_bars(d)
    # One thin line per main bar, one heavy line per lap, the mark of each bar.
    assert len(re.findall(r'<line[^>]*stroke-width="1"/>', svg)) == len(mains)
    assert len(re.findall(r'<line[^>]*stroke-width="3"/>', svg)) == sum(len(b["laps"]) for b in mains)
    assert sorted(re.findall(r"<text[^>]*>(\d\d)</text>", svg)) == sorted(b["mark"] for b in mains)
    # Every derivation with its clause; the schedule; the caution.
    for dv in d["derivations"]:
        assert f'{dv["what"]} of {dv["where"]}: {dv["clause"]}' in text
    assert len(re.findall(r"<h4>(shift|anchorage|lap|end support anchorage|interior support embedment|extent into the span)", text)) == \
        len(d["derivations"])
    assert "<h4>Bar schedule</h4>" in text and armature.CAUTION in text
    mtext = md.read_text()
    for row in d["schedule"]:
        assert f'| {row["mark"]} | {row["bar"]} | {int(row["count"])} |' in mtext
    assert armature.CAUTION in mtext


def en_moment_resistance(As, d, fck=30.0, fyk=500.0, b=1000.0, alpha_cc=1.0):
    """EN 1992-1-1 3.1.7(3) rectangular block (λ = 0.8, η = 1 for fck ≤ 50),
    6.1, recommended αcc = 1.0 (3.1.6(1)), γc = 1.5, γs = 1.15, evaluated
    here: x = As fyd / (0.8 b fcd), M = As fyd (d − 0.4 x), in N·mm."""
    fcd, fyd = alpha_cc * fck / 1.5, fyk / 1.15
    x = As * fyd / (0.8 * b * fcd)
    return As * fyd * (d - 0.4 * x)


@pytest.mark.parametrize("spans,ends", [([6.0], ["pinned", "pinned"]), ([5.5, 5.5], ["fixed", "pinned"])])
def test_alternate_bars_stop_where_the_rest_carry_the_envelope(spans, ends):
    """detailing.curtail "alternate": every other bottom bar stops inside
    the span. Where the envelope exceeds what the continuing half carries
    (EN rectangular block, evaluated here), the curtailed bars must be
    developed: their ends lie at least the shift (9.2.1.3(2)) plus their
    anchorage beyond every such point; the continuing bars still cover the
    whole sagging zone and are anchored at the supports."""
    req = workshop(spans, ends, curtail="alternate")
    req["loads"] = {"dead_kPa": 1.5, "imposed_kPa": 7.5}
    r = armature.design(req)
    d = r["detailing"]
    where = next(b["where"] for b in d["bars"] if b["role"] == "curtailed")
    e = int(where.split()[1]) - 1
    g = next(g for g in r["regions"] if g["where"] == where and g["face"] == "bottom")
    s = g["bars"]["spacing_mm"]
    cont = [b for b in d["bars"] if b["where"] == where and b["role"] == "main"]
    cut = [b for b in d["bars"] if b["where"] == where and b["role"] == "curtailed"]
    assert cont and cut
    assert all(b["spacing_mm"] == 2 * s for b in cont + cut)
    count = math.floor(6000 / s + 1e-9) + 1  # width over the spacing, plus one
    assert sum(b["count"] for b in cont) == (count + 1) // 2 and sum(b["count"] for b in cut) == count // 2
    check_cover_of_envelope(req, r)
    M_half = en_moment_resistance(g["bars"]["As_prov_mm2"] / 2, g["effective_depth_mm"]) * 1e-6
    assert M_half < g["design_moment_kNm"]  # the case needs the curtailed bars somewhere
    assert check_curtailed(req, r) >= 1
    [b] = cut
    X = strip_nodes(spans)
    assert X[e] < b["start_m"] and b["end_m"] < X[e + 1]  # stopped inside the span
    full = copy.deepcopy(req)
    full["detailing"]["curtail"] = "none"
    assert d["total_mass_kg"] < armature.design(full)["detailing"]["total_mass_kg"]
    check_schedule(req, r)


def test_alternate_curtailment_refused_below_minimum_steel_with_a_note():
    """Where half the bars would fall below the minimum steel (EN 1992-1-1
    9.3.1.1(1), 9.2.1.1), every bar runs through and the result says why."""
    req = workshop([3.0], ["pinned", "pinned"], curtail="alternate")
    req["loads"] = {"dead_kPa": 0.5, "imposed_kPa": 1.5}
    r = armature.design(req)
    assert not [b for b in r["detailing"]["bars"] if b["role"] == "curtailed"]
    assert any("span 1: every bottom bar runs through" in w and "minimum steel" in w for w in r["warnings"]), \
        r["warnings"]
