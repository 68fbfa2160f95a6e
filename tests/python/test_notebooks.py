"""Each notebook executed top to bottom (nbclient), with an assertion on the
result it prints."""
import json
import math
import os
import sys

import pytest

from conftest import BUILD, ROOT

nbformat = pytest.importorskip("nbformat")
nbclient = pytest.importorskip("nbclient")


@pytest.fixture(scope="module")
def kernel_name(tmp_path_factory):
    """A kernel spec that runs this interpreter with the built package."""
    home = tmp_path_factory.mktemp("jupyter")
    spec = home / "kernels" / "armature-test"
    spec.mkdir(parents=True)
    (spec / "kernel.json").write_text(json.dumps({
        "argv": [sys.executable, "-m", "ipykernel_launcher", "-f", "{connection_file}"],
        "display_name": "armature test", "language": "python",
        "env": {"PYTHONPATH": str(BUILD / "python"), "MPLBACKEND": "Agg"},
    }))
    os.environ["JUPYTER_PATH"] = str(home)
    return "armature-test"


def run_notebook(name, kernel_name, tmp_path):
    nb = nbformat.read(ROOT / "notebooks" / name, as_version=4)
    client = nbclient.NotebookClient(nb, kernel_name=kernel_name, timeout=600,
                                     resources={"metadata": {"path": str(tmp_path)}})
    client.execute()
    for cell in reversed(nb.cells):
        for out in cell.get("outputs", []):
            text = out.get("text", "")
            for line in text.splitlines():
                if line.startswith("RESULT: "):
                    return json.loads(line[len("RESULT: "):])
    raise AssertionError(f"{name} printed no RESULT line")


def test_economic_thickness(kernel_name, tmp_path):
    result = run_notebook("economic-thickness.ipynb", kernel_name, tmp_path)
    thickness = [result[k] for k in sorted(result, key=float)]
    assert len(thickness) == 6
    # Longer spans never need thinner slabs (span/depth rule, EN 1992-1-1 7.4.2).
    assert thickness == sorted(thickness)
    assert thickness[0] < thickness[-1]


def test_one_floor_three_codes(kernel_name, tmp_path):
    result = run_notebook("one-floor-three-codes.ipynb", kernel_name, tmp_path)
    assert result["codes"] == ["ACI318-19", "EN1992-1-1:UK", "EN1992-1-1:recommended"]
    # EN: 3 spans + 4 supports (partial fixity at pinned ends); ACI: 3 spans + 2 supports.
    assert result["rows"] == 7 + 7 + 5


def test_dask_sweep(kernel_name, tmp_path):
    result = run_notebook("dask-sweep.ipynb", kernel_name, tmp_path)
    assert result["rows"] == 8 * 7 * 4 * 4 * 2
    assert 0 < result["pass"] < result["rows"]
    assert result["same_as_local"]


def test_optimise_floor(kernel_name, tmp_path):
    result = run_notebook("optimise-floor.ipynb", kernel_name, tmp_path)
    assert result["rows"] == 16 * 3 * 2
    assert result["same_as_exhaustive"]
    for objective in ("cost", "carbon"):
        found = result[objective]
        assert found["status"] == "pass"
        assert found["pruned"] > 0
        front = found["front"]
        # Along a Pareto front a thicker slab is only there for a lower objective.
        assert [h for h, _ in front] == sorted(h for h, _ in front)
        assert all(b[1] < a[1] for a, b in zip(front, front[1:]) if b[0] > a[0])
        # The choice is the front's least objective.
        assert found["objective"] == min(o for _, o in front)


# Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells, 2nd ed., Table 8
# (simply supported rectangle a × b under uniform q, ν = 0.3, centre moments
# Mx = β q a², My = β1 q a², a the shorter side), by b/a. Values from memory;
# the test below checks them against Navier's series (same book, §30).
TWK_TABLE_8 = {1.0: (0.0479, 0.0479), 1.2: (0.0627, 0.0501), 1.4: (0.0755, 0.0502),
               1.6: (0.0862, 0.0492), 1.8: (0.0948, 0.0479), 2.0: (0.1017, 0.0464)}
# The same book, Table 35 (clamped rectangle under uniform q, ν = 0.3): centre Mx,
# My and the edge moments at the middle of the long side (Mx, x = ±a/2) and of the
# short side (My, y = ±b/2), coefficients of q a². Values from memory. (Later
# series solutions give 0.0229 for the square's centre, about 1 % below the
# table's 0.0231; the tolerance covers it.)
TWK_TABLE_35 = {1.0: (0.0231, 0.0231, -0.0513, -0.0513), 1.2: (0.0299, 0.0228, -0.0639, -0.0554),
                1.4: (0.0349, 0.0212, -0.0726, -0.0568), 1.6: (0.0381, 0.0193, -0.0780, -0.0571),
                1.8: (0.0401, 0.0174, -0.0812, -0.0571), 2.0: (0.0412, 0.0158, -0.0829, -0.0571)}
PLATE_TOLERANCE = 0.02  # relative: mesh (10 per bay) plus the recalled tables' last digit
# The same book, Table 8's last column: the force holding down each corner of the
# simply supported square, R = n q a² with n = 0.065 (ν = 0.3), which is 2 Mxy at the
# corner. Value from memory; checked below against Navier's series.
TWK_TABLE_8_CORNER_N_SQUARE = 0.065
# The twist near a corner converges more slowly with the mesh than the moments at
# the centre (and Table 8's n has two digits): 3 %.
CORNER_TOLERANCE = 0.03


def _navier_centre(ratio, nu, terms=201):
    """Centre mx, my of a simply supported 1 × ratio plate under q = 1 (T&W-K §30)."""
    mx = my = 0.0
    for m in range(1, terms + 1, 2):
        am = m * math.pi
        for n in range(1, terms + 1, 2):
            bn = n * math.pi / ratio
            w = 16.0 / (math.pi ** 2 * m * n * (am * am + bn * bn) ** 2)
            s = math.sin(am / 2) * math.sin(bn * ratio / 2)
            mx += w * (am * am + nu * bn * bn) * s
            my += w * (bn * bn + nu * am * am) * s
    return mx, my


def _navier_moments(ratio, nu, xs, ys, terms=201):
    """mx, my, mxy at the points (xs[k], ys[k]) of a simply supported 1 × ratio plate
    under q = 1 (T&W-K §30, Navier's series with D = 1; mxy = -(1 - ν) w,xy)."""
    import numpy as np
    m = np.arange(1, terms + 1, 2, dtype=float)[None, :, None] * math.pi
    n = np.arange(1, terms + 1, 2, dtype=float)[None, None, :] * math.pi / ratio
    x, y = np.asarray(xs, dtype=float)[:, None, None], np.asarray(ys, dtype=float)[:, None, None]
    w = 16.0 / (math.pi ** 2 * (m / math.pi) * (n * ratio / math.pi) * (m * m + n * n) ** 2)
    s = np.sin(m * x) * np.sin(n * y)
    mx = (w * (m * m + nu * n * n) * s).sum(axis=(1, 2))
    my = (w * (n * n + nu * m * m) * s).sum(axis=(1, 2))
    mxy = -(1.0 - nu) * (w * m * n * np.cos(m * x) * np.cos(n * y)).sum(axis=(1, 2))
    return mx, my, mxy


def _wood_armer(mx, my, mxy):
    """Bottom design moments m*x, m*y (Wood 1968 with Armer's discussion, from
    memory): m + |mxy|; where one comes out negative it is nil and the other is
    m + mxy²/|m of the first|; never negative. The top face: the same on -mx, -my."""
    t = abs(mxy)
    bx, by = mx + t, my + t
    if bx < 0:
        bx, by = 0.0, my + t * t / abs(mx)
    elif by < 0:
        bx, by = mx + t * t / abs(my), 0.0
    return max(bx, 0.0), max(by, 0.0)


def test_two_way_floor(kernel_name, tmp_path):
    result = run_notebook("two-way-floor.ipynb", kernel_name, tmp_path)
    lx, ratios = result["lx_m"], result["ratios"]
    assert ratios == sorted(TWK_TABLE_8)
    at02, at03 = result["nu_0.2"], result["nu_0.3"]
    assert set(at02) == {"all pinned", "one long edge fixed", "two adjacent fixed", "all fixed"}
    for found in at02.values():
        assert all(s in ("pass", "fail") for s in found["status"])  # every bay designed

    # ULS load: EN 1990 (6.10) with Table A1.2(B) factors 1.35 and 1.5; self-weight
    # 25 kN/m³ × 0.200 m (EN 1991-1-1 Table A.1, reinforced concrete).
    q = 1.35 * (25.0 * 0.200 + 1.5) + 1.5 * 3.0
    for group in (at02, at03):
        for found in group.values():
            assert found["q_uls_kPa"] == pytest.approx([q] * len(ratios), rel=1e-9)
    ql2 = q * lx ** 2

    # Poisson's ratio: 0.2 by default (EN 1992-1-1 3.1.3(4)); 0.3 where asked.
    assert result["poisson_default"] == 0.2
    assert all(nu == 0.3 for found in at03.values() for nu in found["poisson_ratio"])

    # The recalled Table 8 agrees with Navier's series (guards the memory).
    for ratio, (beta, beta1) in TWK_TABLE_8.items():
        mx, my = _navier_centre(ratio, 0.3)
        assert mx == pytest.approx(beta, abs=0.0001) and my == pytest.approx(beta1, abs=0.0001)

    # Simply supported bay, ν = 0.3: centre moments against T&W-K Table 8 (the
    # elastic field at the centre node, as coefficients of q lx²: no load factor).
    pinned = at03["all pinned"]
    for k, ratio in enumerate(ratios):
        beta, beta1 = TWK_TABLE_8[ratio]
        assert pinned["centre_mx"][k] / ql2 == pytest.approx(beta, rel=PLATE_TOLERANCE)
        assert pinned["centre_my"][k] / ql2 == pytest.approx(beta1, rel=PLATE_TOLERANCE)

    # The design's own ν = 0.2: a simply supported plate's deflection under a
    # uniform load does not depend on ν (Navier's coefficients have no ν), so
    # Mx = A + ν B and My = B + ν A with A, B from Table 8's two ν = 0.3 values.
    pinned = at02["all pinned"]
    for k, ratio in enumerate(ratios):
        beta, beta1 = TWK_TABLE_8[ratio]
        a, b = (beta - 0.3 * beta1) / 0.91, (beta1 - 0.3 * beta) / 0.91
        assert pinned["centre_mx"][k] / ql2 == pytest.approx(a + 0.2 * b, rel=PLATE_TOLERANCE)
        assert pinned["centre_my"][k] / ql2 == pytest.approx(b + 0.2 * a, rel=PLATE_TOLERANCE)

    # Trends with ly/lx, all edges pinned (Table 8 by b/a, its b/a = ∞ row the
    # one-way strip q lx²/8): the short-span moment rises toward q lx²/8 and
    # stays below it; the long-span centre moment peaks near b/a 1.2 and falls.
    mx, my = pinned["centre_mx"], pinned["centre_my"]
    assert all(b > a for a, b in zip(mx, mx[1:]))
    assert all(m < ql2 / 8 for m in mx)
    assert all(b < a for a, b in zip(my[1:], my[2:])) and my[-1] < my[0]

    # Symmetry of the square bay and its load: mx = my at the centre and the
    # bottom bars' design moments the same both ways (all pinned, all fixed);
    # two adjacent edges fixed is symmetric about the diagonal.
    for name in ("all pinned", "all fixed"):
        found = at02[name]
        assert found["centre_mx"][0] == pytest.approx(found["centre_my"][0], rel=1e-6)
        assert found["design_x"][0] == pytest.approx(found["design_y"][0], rel=1e-6)
    corner = at02["two adjacent fixed"]
    assert corner["design_x"][0] == pytest.approx(corner["design_y"][0], rel=1e-6)
    assert corner["edge_x1_mid_mx"][0] == pytest.approx(corner["edge_y1_mid_my"][0], rel=1e-6)

    # Clamped bay, ν = 0.3: centre and mid-edge moments against T&W-K Table 35.
    fixed = at03["all fixed"]
    for k, ratio in enumerate(ratios):
        cx, cy, ex, ey = TWK_TABLE_35[ratio]
        assert fixed["centre_mx"][k] / ql2 == pytest.approx(cx, rel=PLATE_TOLERANCE)
        assert fixed["centre_my"][k] / ql2 == pytest.approx(cy, rel=PLATE_TOLERANCE)
        assert fixed["edge_x1_mid_mx"][k] / ql2 == pytest.approx(ex, rel=PLATE_TOLERANCE)
        assert fixed["edge_y1_mid_my"][k] / ql2 == pytest.approx(ey, rel=PLATE_TOLERANCE)

    # One-way limits (beam theory; Table 35's b/a = ∞ row from memory): a fixed
    # long edge hogs less than the strip's end moment and more as the bay
    # lengthens: q lx²/12 fixed at both ends, q lx²/8 for the propped strip (one
    # long edge fixed), whose span moment 9 q lx²/128 bounds the bay's.
    fixed = at02["all fixed"]
    hog = [-m for m in fixed["edge_x1_mid_mx"]]
    assert all(b > a for a, b in zip(hog, hog[1:])) and max(hog) < ql2 / 12
    assert max(fixed["centre_mx"]) < ql2 / 24
    propped = at02["one long edge fixed"]
    hog = [-m for m in propped["edge_x1_mid_mx"]]
    assert all(b > a for a, b in zip(hog, hog[1:])) and max(hog) < ql2 / 8
    assert max(propped["largest_mx"]) < 9 * ql2 / 128

    # Restraint takes moment from the span (Tables 8 and 35; the propped strip's
    # 9/128 against the pinned strip's 1/8): at every ratio the bay's largest
    # short-span moment falls from all pinned to one long edge fixed, to two
    # adjacent fixed, to all fixed.
    order = ("all pinned", "one long edge fixed", "two adjacent fixed", "all fixed")
    for k in range(len(ratios)):
        largest = [at02[name]["largest_mx"][k] for name in order]
        assert largest == sorted(largest, reverse=True) and len(set(largest)) == 4

    # Wood–Armer (Wood 1968, from memory): the bottom design moment is m + |mxy|
    # (or more where the other sags less), never below the analysis moment at a
    # node where the bay's bars are designed: outside the corner zones, the centre
    # among them (a zone reaches ly/5 <= 0.4 lx < lx/2 into the bay).
    for found in at02.values():
        for k in range(len(ratios)):
            assert found["design_x"][k] >= found["largest_mx_outside_corners"][k] - 1e-9
            assert found["largest_mx"][k] >= found["largest_mx_outside_corners"][k] >= found["centre_mx"][k] - 1e-9
            assert found["design_y"][k] >= found["centre_my"][k] - 1e-9

    # Corner zones (EN 1992-1-1 9.3.1.3 corner reinforcement where a corner is held
    # down): only where two pinned edges meet, since a fixed edge does not twist
    # along its length; a square reaching a fifth of the bay's longer span from the
    # corner each way (ACI 318-19 8.7.3.1.2, value from memory; EN sets no extent,
    # the same taken: common practice).
    meeting = {"all pinned": {"x0 y0", "x1 y0", "x0 y1", "x1 y1"}, "one long edge fixed": {"x0 y0", "x0 y1"},
               "two adjacent fixed": {"x0 y0"}, "all fixed": set()}
    for group in (at02, at03):
        for name, found in group.items():
            for k, ratio in enumerate(ratios):
                zones = {z["name"]: z for z in found["corners"][k]}
                assert set(zones) == {f"corner {c}" for c in meeting[name]}
                side, ly = ratio * lx / 5, ratio * lx
                for corner, z in zones.items():
                    _, at_x, at_y = corner.split()
                    x0 = 0.0 if at_x == "x0" else lx - side
                    y0 = 0.0 if at_y == "y0" else ly - side
                    assert (z["x0_m"], z["x1_m"], z["y0_m"], z["y1_m"]) == pytest.approx(
                        (x0, x0 + side, y0, y0 + side), abs=1e-9)
                has = bool(zones) and "corner x0 y0" in zones
                for key in ("corner_top_x", "corner_top_y", "corner_bottom_x", "corner_bottom_y"):
                    assert (found[key][k] is not None) == has
    # The square with two adjacent edges fixed is symmetric about its diagonal:
    # so is the corner where its pinned edges meet.
    corner = at02["two adjacent fixed"]
    assert corner["corner_top_x"][0] == pytest.approx(corner["corner_top_y"][0], rel=1e-6)
    assert corner["corner_bottom_x"][0] == pytest.approx(corner["corner_bottom_y"][0], rel=1e-6)

    # The recalled corner force of Table 8 agrees with Navier's series (guards the
    # memory): R = 2 |Mxy| at the corner of the square, ν = 0.3.
    _, _, mxy = _navier_moments(1.0, 0.3, [0.0], [0.0])
    assert 2 * abs(mxy[0]) == pytest.approx(TWK_TABLE_8_CORNER_N_SQUARE, abs=0.0005)

    # Simply supported bay against plate theory, Wood–Armer on Navier's moments at
    # the nodes of the mesh (coefficients of q lx², at the design's ν = 0.2 and the
    # tables' 0.3): the bay's bottom bars take the largest Wood–Armer moment outside
    # the corner zones, each corner region the largest inside its zone (EN: no
    # floor), and at the corner itself, on two pinned edges, mx = my = 0, so the top
    # design moment is |Mxy| there: for the square at ν = 0.3, Table 8's n/2.
    for group in (at02, at03):
        pinned = group["all pinned"]
        for k, ratio in enumerate(ratios):
            ql2 = pinned["q_uls_kPa"][k] * lx ** 2
            xs, ys = pinned["nodes_x_m"][k], pinned["nodes_y_m"][k]
            assert min(xs) == pytest.approx(0.0) and max(xs) == pytest.approx(lx)
            assert max(ys) == pytest.approx(ratio * lx)
            points = [(x, y) for y in ys for x in xs]
            nu = pinned["poisson_ratio"][k] if group is at03 else result["poisson_default"]
            mx, my, mxy = _navier_moments(ratio, nu, [x / lx for x, _ in points], [y / lx for _, y in points])
            _, _, corner_mxy = _navier_moments(ratio, nu, [0.0], [0.0])
            side = ratio * lx / 5 + 1e-9  # the corner region reads its zone, boundary included
            in_x0_y0 = [x <= side and y <= side for x, y in points]
            # The bay reads every node not strictly inside a zone (a node on a
            # zone's inner boundary is the bay's too: the corner bars end there).
            strict = ratio * lx / 5 - 1e-9
            in_any = [min(x, lx - x) < strict and min(y, ratio * lx - y) < strict for x, y in points]
            bottom = [_wood_armer(a, b, c) for a, b, c in zip(mx, my, mxy)]
            top = [_wood_armer(-a, -b, c) for a, b, c in zip(mx, my, mxy)]
            outside = [wa for wa, z in zip(bottom, in_any) if not z]
            inside = [wa for wa, z in zip(bottom, in_x0_y0) if z]
            inside_top = [wa for wa, z in zip(top, in_x0_y0) if z]
            for d, name in ((0, "x"), (1, "y")):
                assert pinned[f"design_{name}"][k] / ql2 == pytest.approx(
                    max(wa[d] for wa in outside), rel=PLATE_TOLERANCE)
                assert pinned[f"corner_bottom_{name}"][k] / ql2 == pytest.approx(
                    max(wa[d] for wa in inside), rel=CORNER_TOLERANCE)
                assert pinned[f"corner_top_{name}"][k] / ql2 == pytest.approx(
                    max(wa[d] for wa in inside_top), rel=CORNER_TOLERANCE)
                assert max(wa[d] for wa in inside_top) == pytest.approx(abs(corner_mxy[0]), rel=1e-9)
            if ratio == 2.0:
                # The twist near the corners gives the largest y bottom moment of the
                # whole bay in or on the edge of the zones; the bay keeps the nodes on
                # the zones' inner boundary (the corner bars end there), so its y bars
                # take the boundary's value and the corner region at least as much.
                assert max(wa[1] for wa in inside) >= (1 - PLATE_TOLERANCE) * max(wa[1] for wa in outside)
                assert pinned["corner_bottom_y"][k] >= (1 - PLATE_TOLERANCE) * pinned["design_y"][k]
    # The square at ν = 0.3 against the book itself: corner top = n q a² / 2.
    pinned = at03["all pinned"]
    for key in ("corner_top_x", "corner_top_y"):
        assert pinned[key][0] / (pinned["q_uls_kPa"][0] * lx ** 2) == pytest.approx(
            TWK_TABLE_8_CORNER_N_SQUARE / 2, rel=CORNER_TOLERANCE)


def test_flat_slab_punching(kernel_name, tmp_path):
    result = run_notebook("flat-slab-punching.ipynb", kernel_name, tmp_path)
    h = result["thickness_mm"]
    assert h == list(range(200, 341, 20))
    # Self-weight 25 kN/m³ × h (EN 1991-1-1 Table A.1, reinforced concrete).
    assert result["self_weight_kPa"] == pytest.approx([25.0 * t / 1000.0 for t in h], rel=1e-12)
    for columns in result["columns"]:
        assert len(columns) == 8  # 4 × 3 grid intersections, none on the wall along y0
        for c in columns:
            # EN 1992-1-1 6.4.3 (6.38): vEd = β VEd/(u1 d), β at least Figure
            # 6.21N's (1.15 internal, 1.4 edge, 1.5 corner) for a braced floor
            # whose adjacent spans differ by no more than 25 %: the columns are
            # restrained (storey heights given), so the larger of it and
            # 6.4.3(3)-(5) from the moments.
            beta = {"internal": 1.15, "edge": 1.4, "corner": 1.5}[c["position"]]
            assert c["transfer_factor"] >= beta - 1e-12
            assert c["v_MPa"] == pytest.approx(c["transfer_factor"] * c["reaction_kN"] * 1e3 / (c["u1_mm"] * c["d_mm"]),
                                               rel=1e-9)
            # Links where vEd exceeds vRd,c (6.4.3(2)), none where it does not.
            assert c["reinforcement_needed"] == (c["v_MPa"] > c["v_concrete_MPa"])
            # u1 at 2d from the column's faces (6.4.2(1)): an internal 400 × 400
            # column's is 4 × 400 + 2π × 2d.
            if c["position"] == "internal":
                assert c["u1_mm"] == pytest.approx(1600.0 + 4.0 * math.pi * c["d_mm"], rel=1e-9)
    # A thicker slab never needs links at more columns (vEd ∝ 1/(u1 d)).
    links = result["columns_with_links"]
    assert all(b <= a for a, b in zip(links, links[1:]))
    assert links[0] == 8 and links[-1] < links[0]
