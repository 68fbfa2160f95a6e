"""armature.plot_plate and armature.plot_plan on a two-way result's "plate".

The field is Navier's double series for a simply supported rectangular
plate under a uniform load, computed here with numpy (Timoshenko &
Woinowsky-Krieger, Theory of Plates and Shells, §30, Navier solution; the
series from memory):

    w = Σ W_mn sin(αm x) sin(βn y), αm = mπ/a, βn = nπ/b, m, n odd,
    W_mn = 16 q / (π² D m n (αm² + βn²)²),
    mx = D Σ W (αm² + ν βn²) sin sin, my = D Σ W (βn² + ν αm²) sin sin,
    mxy = −D (1 − ν) Σ W αm βn cos cos   (sagging positive; D cancels).

The design moments are Wood–Armer's from them (Wood 1968, with the cases
where one design moment would be negative; from memory). Our scenario: a
bay of the workshop floor, 4.2 m by 5.4 m, ULS 14.8 kPa (1.35 × 6.5 +
1.5 × 4.0), the dead load alone 8.8 kPa for the other envelope.
"""
import math

import pytest

np = pytest.importorskip("numpy")
matplotlib = pytest.importorskip("matplotlib")
matplotlib.use("Agg")
import matplotlib.pyplot as plt  # noqa: E402
from matplotlib.colors import TwoSlopeNorm  # noqa: E402

import armature  # noqa: E402

A, B, NU = 4.2, 5.4, 0.2  # m, m, -
Q_ULS, Q_DEAD = 14.8, 1.35 * 6.5  # kPa


def navier(a, b, q, nu, x, y, terms=81):
    """mx, my, mxy (kNm/m) on the grid x × y (rows by y) of a simply
    supported a × b plate under q (kPa): the series above."""
    X, Y = np.meshgrid(x, y)
    mx = np.zeros_like(X)
    my = np.zeros_like(X)
    mxy = np.zeros_like(X)
    for m in range(1, terms + 1, 2):
        am = m * math.pi / a
        for n in range(1, terms + 1, 2):
            bn = n * math.pi / b
            W = 16 * q / (math.pi ** 2 * m * n * (am * am + bn * bn) ** 2)  # × D
            ss = np.sin(am * X) * np.sin(bn * Y)
            mx += W * (am * am + nu * bn * bn) * ss
            my += W * (bn * bn + nu * am * am) * ss
            mxy += -(1 - nu) * W * am * bn * np.cos(am * X) * np.cos(bn * Y)
    return mx, my, mxy


def wood_armer(mx, my, mxy):
    """Bottom and top design moments (magnitudes) for bars in x and y."""
    t = np.abs(mxy)
    bx, by = mx + t, my + t
    with np.errstate(divide="ignore", invalid="ignore"):
        bx_c, by_c = np.where(bx < 0, 0.0, bx), np.where(bx < 0, my + mxy ** 2 / np.abs(mx), by)
        bx_c, by_c = np.where(by_c < 0, mx + mxy ** 2 / np.abs(my), bx_c), np.where(by_c < 0, 0.0, by_c)
        tx, ty = mx - t, my - t
        tx_c, ty_c = np.where(tx > 0, 0.0, tx), np.where(tx > 0, my - mxy ** 2 / np.abs(mx), ty)
        tx_c, ty_c = np.where(ty_c > 0, mx - mxy ** 2 / np.abs(my), tx_c), np.where(ty_c > 0, 0.0, ty_c)
    return (np.maximum(bx_c, 0.0), np.maximum(by_c, 0.0), np.maximum(-tx_c, 0.0), np.maximum(-ty_c, 0.0))


def plate_result(edges=None):
    """A result holding only what the plots read: the "plate" object of a
    two-way design, and regions."""
    x = np.linspace(0, A, 15)  # odd counts: a sample at the centre
    y = np.linspace(0, B, 19)
    full = navier(A, B, Q_ULS, NU, x, y)
    dead = [m * (Q_DEAD / Q_ULS) for m in full]  # linear: the dead-load case
    field = {"x_m": x.tolist(), "y_m": y.tolist()}
    for name, f, d in zip(("mx", "my", "mxy"), full, dead):
        field[name] = {"max": np.maximum(f, d).tolist(), "min": np.minimum(f, d).tolist()}
    design = wood_armer(*full)
    field["design"] = {k: v.tolist() for k, v in zip(("bottom_x", "bottom_y", "top_x", "top_y"), design)}
    plate = {"x_lines_m": [0, A], "y_lines_m": [0, B],
             "edges": edges or {"x0": "pinned", "x1": "pinned", "y0": "pinned", "y1": "pinned"},
             "bays": [{"name": "bay 1,1", "x0_m": 0, "x1_m": A, "y0_m": 0, "y1_m": B}],
             "field": field, "reactions": []}
    return {"plate": plate, "regions": []}


def field_mesh(ax):
    meshes = [c for c in ax.collections if c.get_gid() == "armature-plate-field"]
    assert len(meshes) == 1
    return meshes[0]


def test_the_navier_field_is_the_published_one():
    # The series itself against T&W-K Table 8 (ν = 0.3), value from memory:
    # b/a = 1.0, centre mx = 0.0479 q a²; b/a = 1.5, mx = 0.0812 q a².
    for ratio, coefficient in ((1.0, 0.0479), (1.5, 0.0812)):
        mx, _, _ = navier(1.0, ratio, 1.0, 0.3, np.array([0.5]), np.array([ratio / 2]), terms=201)
        assert mx[0, 0] == pytest.approx(coefficient, abs=0.0002)


@pytest.mark.parametrize("quantity", ["mx", "my", "mxy", "bottom_x", "bottom_y", "top_x", "top_y"])
def test_plot_plate_draws_the_field_with_its_own_limits(quantity):
    result = plate_result()
    field = result["plate"]["field"]
    expected = np.asarray(field[quantity]["max"] if quantity in ("mx", "my", "mxy")
                          else field["design"][quantity])
    ax = armature.plot_plate(result, quantity)
    mesh = field_mesh(ax)
    plotted = np.asarray(mesh.get_array()).reshape(expected.shape)
    np.testing.assert_array_equal(plotted, expected)
    # One cell per sample, rows by y: the mesh's cell edges halfway between
    # the samples, clipped to the plate.
    coords = mesh.get_coordinates()
    assert coords.shape == (expected.shape[0] + 1, expected.shape[1] + 1, 2)
    assert coords[0, 0, 0] == 0 and coords[-1, -1, 0] == pytest.approx(A)
    assert coords[0, 1, 0] == pytest.approx(field["x_m"][1] / 2)
    # The colour limits are the field's minimum and maximum.
    assert mesh.norm.vmin == pytest.approx(expected.min())
    assert mesh.norm.vmax == pytest.approx(expected.max())
    signed = expected.min() < -1e-9 * np.abs(expected).max() and expected.max() > 0
    assert isinstance(mesh.norm, TwoSlopeNorm) == signed
    if signed:
        assert mesh.norm.vcenter == 0
    # The colour bar names the quantity and the unit; the caution is there.
    assert mesh.colorbar.ax.get_ylabel() == f"{quantity}, kNm/m"
    assert any(t.get_gid() == armature.plots.CAUTION_GID and armature.CAUTION in t.get_text().replace("\n", " ")
               for t in ax.figure.texts)
    plt.close(ax.figure)


def test_plot_plate_marks_the_largest_sagging_moment_at_the_centre():
    result = plate_result()
    ax = armature.plot_plate(result, "mx")
    (marker,) = [line for line in ax.lines if line.get_gid() == "armature-plate-max"]
    assert marker.get_xdata()[0] == pytest.approx(A / 2)
    assert marker.get_ydata()[0] == pytest.approx(B / 2)
    mx = np.asarray(result["plate"]["field"]["mx"]["max"])
    assert any(t.get_text() == f"max {mx.max():.4g} kNm/m" for t in ax.texts)
    # The mxy map: the twist is largest at the corners (same source, §30).
    ax2 = armature.plot_plate(result, "mxy")
    (marker,) = [line for line in ax2.lines if line.get_gid() == "armature-plate-max"]
    assert (marker.get_xdata()[0], marker.get_ydata()[0]) in ((A, 0.0), (0.0, B))
    plt.close("all")


def test_plot_plate_min_envelope_and_edges_by_condition():
    edges = {"x0": "pinned", "x1": "fixed", "y0": "pinned", "y1": "free"}
    result = plate_result(edges)
    ax = armature.plot_plate(result, "my", envelope="min")
    expected = np.asarray(result["plate"]["field"]["my"]["min"])
    np.testing.assert_array_equal(np.asarray(field_mesh(ax).get_array()).reshape(expected.shape), expected)
    gids = {line.get_gid() for line in ax.lines}
    assert {"edge-x0-pinned", "edge-x1-fixed", "edge-y0-pinned", "edge-y1-free"} <= gids
    widths = {line.get_gid(): line.get_linewidth() for line in ax.lines}
    assert widths["edge-x1-fixed"] > widths["edge-x0-pinned"] > widths["edge-y1-free"]
    # Triangles outside the pinned edges only.
    assert "edge-x0-pinned-marks" in gids and "edge-y0-pinned-marks" in gids
    assert not any(g and g.startswith(("edge-x1-fixed-", "edge-y1-free-")) for g in gids)
    legend = [t.get_text() for t in ax.get_legend().get_texts()]
    assert legend == ["pinned edge (triangles)", "fixed edge (hatched)", "free edge (thin line)"]
    plt.close("all")


def test_plot_plate_errors_name_the_argument():
    result = plate_result()
    with pytest.raises(ValueError, match="quantity"):
        armature.plot_plate(result, "mz")
    with pytest.raises(ValueError, match="envelope"):
        armature.plot_plate(result, "mx", envelope="mean")
    with pytest.raises(ValueError, match="envelope"):
        armature.plot_plate(result, "bottom_x", envelope="min")
    with pytest.raises(ValueError, match="'plate'"):
        armature.plot_plate({"regions": []}, "mx")
    with pytest.raises(ValueError, match="'plate'"):
        armature.plot_plan({"regions": []})
    bad = plate_result()
    bad["plate"]["edges"]["x1"] = "clamped"
    with pytest.raises(ValueError, match=r"plate\.edges\.x1"):
        armature.plot_plate(bad, "mx")
    bad = plate_result()
    bad["plate"]["field"]["mx"]["max"] = bad["plate"]["field"]["mx"]["max"][:-1]
    with pytest.raises(ValueError, match=r"plate\.field\.mx\.max"):
        armature.plot_plate(bad, "mx")
    bad = plate_result()
    del bad["plate"]["bays"][0]["x1_m"]
    with pytest.raises(ValueError, match=r"plate\.bays\[0\]\.x1_m"):
        armature.plot_plan(bad)
    bad = plate_result()
    del bad["plate"]["field"]["y_m"]
    with pytest.raises(ValueError, match=r"plate\.field\.y_m"):
        armature.plot_plate(bad, "mxy")
    plt.close("all")


def test_plot_plan_writes_each_bays_bars_and_the_top_bars_along_their_line():
    result = plate_result({"x0": "pinned", "x1": "fixed", "y0": "pinned", "y1": "free"})
    plate = result["plate"]
    plate["x_lines_m"] = [0, 5.4, 11.4]
    plate["y_lines_m"] = [0, 4.2, 8.4]
    plate["bays"] = [{"name": f"bay {i + 1},{j + 1}", "x0_m": plate["x_lines_m"][i], "x1_m": plate["x_lines_m"][i + 1],
                      "y0_m": plate["y_lines_m"][j], "y1_m": plate["y_lines_m"][j + 1]}
                     for j in range(2) for i in range(2)]

    def bars(bar, spacing):
        return {"bar": bar, "diameter_mm": float(bar), "spacing_mm": spacing, "As_prov_mm2": 0.0}

    result["regions"] = [
        {"where": "bay 1,1", "face": "bottom", "direction": "x", "x_m": 2.6, "y_m": 2.1, "bars": bars("12", 200)},
        {"where": "bay 1,1", "face": "bottom", "direction": "y", "x_m": 2.7, "y_m": 2.0, "bars": bars("10", 250)},
        {"where": "bay 2,2", "face": "bottom", "direction": "x", "x_m": 8.4, "y_m": 6.3, "bars": bars("16", 175)},
        {"where": "line x = 5.4 m, 1", "face": "top", "direction": "x", "x_m": 5.4, "y_m": 2.1,
         "bars": bars("12", 150)},
        {"where": "line y = 4.2 m, 1", "face": "top", "direction": "y", "x_m": 2.7, "y_m": 4.2,
         "bars": bars("10", 200)},
    ]
    ax = armature.plot_plan(result)
    texts = {t.get_text(): t for t in ax.texts}
    for name in ("bay 1,1", "bay 2,1", "bay 1,2", "bay 2,2"):
        assert name in texts
    assert "bottom x: ø12 @ 200 mm" in texts and "bottom y: ø10 @ 250 mm" in texts
    assert "bottom x: ø16 @ 175 mm" in texts
    # Bottom bars under the bay's name, at its centre.
    assert texts["bottom x: ø16 @ 175 mm"].xy == pytest.approx((8.4, 6.3))
    # Top bars at their design position, along their support line.
    assert texts["top x: ø12 @ 150 mm"].xy == (5.4, 2.1)
    assert texts["top x: ø12 @ 150 mm"].get_rotation() == 90
    assert texts["top y: ø10 @ 200 mm"].get_rotation() == 0
    assert sum(1 for line in ax.lines if line.get_gid() == "support-line") == 2
    assert any(t.get_gid() == armature.plots.CAUTION_GID for t in ax.figure.texts)
    bad = dict(result, regions=[{"where": "bay 1,1", "face": "bottom"}])
    with pytest.raises(ValueError, match=r"regions\[0\]\.direction"):
        armature.plot_plan(bad)
    plt.close("all")
