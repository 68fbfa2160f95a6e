"""Plots with matplotlib: the envelopes of one design, and a study. Every
figure carries the caution as a one-line footnote."""
import textwrap

from . import _core
from ._core import CAUTION

CAUTION_GID = "armature-caution"  # the footnote's artist id, one per figure


def add_caution(figure):
    """Writes the caution as a one-line footnote along the bottom of a
    matplotlib figure, once per figure: the font shrinks (7 pt down to
    3.5 pt) until the line fits the figure's width; a figure narrower than
    about 5 inches gets it on more lines rather than cut. Returns the text
    artist (its gid is CAUTION_GID)."""
    for t in figure.texts:
        if t.get_gid() == CAUTION_GID:
            return t
    line = "Caution: " + CAUTION
    text = figure.text(0.5, 0.005, line, ha="center", va="bottom", fontsize=7, color="black",
                       gid=CAUTION_GID)
    try:
        renderer = figure.canvas.get_renderer()
    except AttributeError:  # pragma: no cover - a backend without a renderer at hand
        return text
    room = figure.get_figwidth() * figure.dpi * 0.98
    size = 7.0
    while size > 3.5 and text.get_window_extent(renderer).width > room:
        size -= 0.25
        text.set_fontsize(size)
    width = text.get_window_extent(renderer).width
    if width > room:
        text.set_text(textwrap.fill(line, max(20, int(len(line) * room / width * 0.95))))
    return text


def _pyplot():
    try:
        import matplotlib.pyplot as plt
    except ImportError as e:  # pragma: no cover - depends on the machine
        raise ImportError("armature plots need matplotlib (Debian: python3-matplotlib)") from e
    return plt


def plot_envelopes(result, axes=None):
    """Bending moment and shear envelopes of a result (from armature.design),
    with the design value of every region and support marked. Returns the
    two matplotlib axes."""
    plt = _pyplot()
    request = getattr(result, "request", None)
    if request is None:
        raise ValueError("plot_envelopes needs a result returned by armature.design")
    spans = _core.envelope_diagrams(request)
    if axes is None:
        fig, axes = plt.subplots(2, 1, sharex=True, figsize=(8, 5))
        fig.subplots_adjust(bottom=0.14)  # room for the caution under the x label
    ax_m, ax_v = axes
    add_caution(ax_m.figure)
    for k, s in enumerate(spans):
        label = k == 0
        ax_m.plot(s["x_m"], s["M_max_kNm"], color="black", lw=1, label="largest" if label else None)
        ax_m.plot(s["x_m"], s["M_min_kNm"], color="black", lw=1, ls="--", label="smallest" if label else None)
        ax_v.plot(s["x_m"], s["V_max_kN"], color="black", lw=1)
        ax_v.plot(s["x_m"], s["V_min_kN"], color="black", lw=1, ls="--")
    for g in result["regions"]:
        m = g["design_moment_kNm"] if g["face"] == "bottom" else -g["design_moment_kNm"]
        ax_m.plot([g["x_m"]], [m], "ko", ms=4)
        ax_m.annotate(g["where"], (g["x_m"], m), textcoords="offset points", xytext=(3, 4), fontsize=8)
    starts = [s["x_m"][0] for s in spans] + [spans[-1]["x_m"][-1]]
    for sup in result["supports"]:
        x = starts[int(sup["where"].split()[1]) - 1]
        ax_v.plot([x], [sup["design_shear_kN"]], "ko", ms=4)
    ax_m.axhline(0, color="black", lw=0.5)
    ax_v.axhline(0, color="black", lw=0.5)
    ax_m.invert_yaxis()  # sagging drawn below the axis
    ax_m.set_ylabel("M, kNm (sagging down)")
    ax_v.set_ylabel("V, kN")
    ax_v.set_xlabel("x, m")
    ax_m.legend(fontsize=8)
    return ax_m, ax_v


def plot_study(frame, x, y="steel_kg_m2", by=None, ax=None):
    """A study plot: `y` against `x`, one line per value of `by`; designs
    that fail are drawn as open, hatched markers. Returns the axes."""
    plt = _pyplot()
    if ax is None:
        fig, ax = plt.subplots(figsize=(8, 4.5))
        fig.subplots_adjust(bottom=0.17)  # room for the caution under the x label
    add_caution(ax.figure)
    groups = [(None, frame)] if by is None else list(frame.groupby(by, sort=True))
    for key, g in groups:
        g = g.sort_values(x)
        line, = ax.plot(g[x], g[y], lw=1, label=None if key is None else f"{by} = {key}")
        ok = g["status"] == "pass"
        ax.plot(g[x][ok], g[y][ok], "o", color=line.get_color(), ms=4)
        ax.plot(g[x][~ok], g[y][~ok], "o", mfc="none", color=line.get_color(), ms=7)
        for xv in g[x][~ok]:
            ax.axvspan(xv - 0.0, xv + 0.0, color="0.85")
    if (frame["status"] != "pass").any():
        ax.plot([], [], "o", mfc="none", color="black", label="fails a check")
    ax.set_xlabel(x)
    ax.set_ylabel(y)
    if ax.get_legend_handles_labels()[0]:  # nothing to explain: one line, every design passes
        ax.legend(fontsize=8)
    return ax


# ---- two-way slabs: the plate field and the plan ---------------------------------

PLATE_MOMENTS = ("mx", "my", "mxy")  # analysis moments, field[q][envelope]
PLATE_DESIGN_MOMENTS = ("bottom_x", "bottom_y", "top_x", "top_y")  # Wood–Armer, field["design"][q]
PLATE_ENVELOPES = ("max", "min")
EDGE_CONDITIONS = ("pinned", "fixed", "free")
FLAT_EDGES = {"columns": "free", "wall": "pinned"}  # a flat slab's edges, drawn as the condition they are
# The record's colour scale (kernel/src/record/plate_svg.cpp): blue for the
# most negative, white at zero, red for the most positive; lightness falls
# away from zero, so the map still reads in grey.
_PLATE_STOPS = ("#2166ac", "#92c5de", "#ffffff", "#f4a582", "#b2182b")
_EDGE_WORDS = {"fixed": "fixed edge (hatched)", "pinned": "pinned edge (triangles)",
               "free": "free edge (thin line)"}


def _plate_of(result, caller):
    """The result's "plate" object, checked enough to draw: the grid lines
    ascending and the four edges named by condition."""
    plate = result.get("plate") if hasattr(result, "get") else None
    if plate is None:
        raise ValueError(f"{caller} needs a result with a 'plate' (the field of a two-way design); "
                         "this result has none")
    problems = []
    for key in ("x_lines_m", "y_lines_m"):
        lines = plate.get(key)
        if lines is None or len(lines) < 2 or any(b <= a for a, b in zip(lines, lines[1:])):
            problems.append(f"plate.{key}: needs two ascending grid lines or more")
    edges = plate.get("edges") or {}
    flat = "strips" in plate
    allowed = tuple(FLAT_EDGES) if flat else EDGE_CONDITIONS
    for name in ("x0", "x1", "y0", "y1"):
        if edges.get(name) not in allowed:
            problems.append(f"plate.edges.{name}: {edges.get(name)!r} is not one of {', '.join(allowed)}")
    if flat and set((plate.get("outline_m") or {})) != {"x0", "x1", "y0", "y1"}:
        problems.append("plate.outline_m: a flat slab's outline needs x0, x1, y0 and y1")
    for k, bay in enumerate(plate.get("bays", [])):
        for key in ("name", "x0_m", "x1_m", "y0_m", "y1_m"):
            if key not in bay:
                problems.append(f"plate.bays[{k}].{key}: missing")
    if problems:
        raise ValueError("; ".join(problems))
    return plate


def _plate_scale(lo, hi):
    """Colour map and normalisation as the record's: signed values (both
    sides of zero beyond a billionth of the largest) on the diverging scale
    with white at zero, each side to its own extreme; values of one sign on
    the half of it from white, over [lo, hi]."""
    from matplotlib.colors import LinearSegmentedColormap, Normalize, TwoSlopeNorm
    noise = 1e-9 * max(abs(lo), abs(hi))
    if lo < -noise and hi > noise:
        return LinearSegmentedColormap.from_list("armature_signed", _PLATE_STOPS), TwoSlopeNorm(0.0, lo, hi)
    stops = _PLATE_STOPS[:3] if lo < -noise else _PLATE_STOPS[2:]
    return LinearSegmentedColormap.from_list("armature_one_sign", stops), Normalize(lo, hi)


def _cell_edges(at, lo, hi):
    """Cell bounds around the samples: halfway to the neighbours, the ends
    clipped to the plate (the record's cells)."""
    import numpy as np
    at = np.asarray(at, dtype=float)
    edges = np.empty(at.size + 1)
    edges[1:-1] = (at[:-1] + at[1:]) / 2
    if at.size > 1:
        edges[0] = max(lo, at[0] - (at[1] - at[0]) / 2)
        edges[-1] = min(hi, at[-1] + (at[-1] - at[-2]) / 2)
    else:
        edges[0], edges[-1] = lo, hi
    return edges


def _draw_plate_frame(ax, plate, bay_names_at="centre"):
    """Interior grid lines (line supports, dash-dot), the outer edges by
    condition, bay names and a legend of the styles used."""
    from matplotlib import patheffects
    from matplotlib.lines import Line2D
    xs, ys = list(plate["x_lines_m"]), list(plate["y_lines_m"])
    x_lo, x_hi, y_lo, y_hi = _plate_extent(plate)
    flat = "strips" in plate
    reach = 0.02 * max(x_hi - x_lo, y_hi - y_lo)  # triangles sit this far outside a pinned edge
    if flat:  # column lines, every one inside the outline
        for x in xs:
            if x_lo < x < x_hi:
                ax.plot([x, x], [y_lo, y_hi], color="grey", lw=0.6, ls="--", gid="column-line")
        for y in ys:
            if y_lo < y < y_hi:
                ax.plot([x_lo, x_hi], [y, y], color="grey", lw=0.6, ls="--", gid="column-line")
    else:
        for x in xs[1:-1]:
            ax.plot([x, x], [y_lo, y_hi], color="black", lw=1, ls="-.", gid="support-line")
        for y in ys[1:-1]:
            ax.plot([x_lo, x_hi], [y, y], color="black", lw=1, ls="-.", gid="support-line")
    # Each edge runs so that the plate lies on its right: the ticks of a
    # fixed edge (drawn to the path's right at angle 135°) fall outside.
    runs = {"x0": ((x_lo, y_lo), (x_lo, y_hi), (-1, 0)), "x1": ((x_hi, y_hi), (x_hi, y_lo), (1, 0)),
            "y0": ((x_hi, y_lo), (x_lo, y_lo), (0, -1)), "y1": ((x_lo, y_hi), (x_hi, y_hi), (0, 1))}
    used = set()
    for name, ((xa, ya), (xb, yb), (nx, ny)) in runs.items():
        kind = FLAT_EDGES[plate["edges"][name]] if flat else plate["edges"][name]
        used.add(kind)
        gid = f"edge-{name}-{kind}"
        if kind == "fixed":
            ax.plot([xa, xb], [ya, yb], color="black", lw=2.2, gid=gid,
                    path_effects=[patheffects.withTickedStroke(angle=135, spacing=6, length=0.8),
                                  patheffects.Normal()])
        elif kind == "pinned":
            ax.plot([xa, xb], [ya, yb], color="black", lw=1.5, gid=gid)
            count = max(2, int(round(max(abs(xb - xa), abs(yb - ya)) / (5 * reach))))
            t = [(k + 0.5) / count for k in range(count)]
            marker = {(-1, 0): ">", (1, 0): "<", (0, -1): "^", (0, 1): "v"}[(nx, ny)]
            ax.plot([xa + (xb - xa) * s + nx * reach for s in t], [ya + (yb - ya) * s + ny * reach for s in t],
                    ls="none", marker=marker, ms=6, mfc="white", mec="black", mew=0.8, gid=gid + "-marks",
                    clip_on=False)
        else:
            ax.plot([xa, xb], [ya, yb], color="black", lw=0.6, gid=gid)
    halo = [patheffects.withStroke(linewidth=2.5, foreground="white")]
    for bay in plate.get("bays", []):
        if bay_names_at == "corner":
            at = (bay["x0_m"] + 0.03 * (bay["x1_m"] - bay["x0_m"]), bay["y1_m"] - 0.04 * (bay["y1_m"] - bay["y0_m"]))
            ax.text(*at, bay["name"], ha="left", va="top", fontsize=8, fontweight="bold", path_effects=halo)
        else:
            ax.text((bay["x0_m"] + bay["x1_m"]) / 2, (bay["y0_m"] + bay["y1_m"]) / 2, bay["name"], ha="center",
                    va="bottom", fontsize=9, fontweight="bold", path_effects=halo)
    handles = []
    for kind in EDGE_CONDITIONS:
        if kind not in used:
            continue
        if kind == "fixed":
            h = Line2D([], [], color="black", lw=2.2,
                       path_effects=[patheffects.withTickedStroke(angle=135, spacing=6, length=0.8),
                                     patheffects.Normal()])
        elif kind == "pinned":
            h = Line2D([], [], color="black", lw=1.5, marker="^", ms=6, mfc="white", mec="black", markevery=[1])
        else:
            h = Line2D([], [], color="black", lw=0.6)
        h.set_label(_EDGE_WORDS[kind])
        handles.append(h)
    if flat:
        handles.append(Line2D([], [], color="grey", lw=0.6, ls="--", label="column line"))
    elif len(xs) > 2 or len(ys) > 2:
        handles.append(Line2D([], [], color="black", lw=1, ls="-.", label="interior line support"))
    ax.legend(handles=handles, loc="upper center", bbox_to_anchor=(0.5, -0.12), ncol=len(handles), fontsize=7,
              frameon=False, handlelength=3)
    pad = 2.5 * reach
    ax.set_xlim(x_lo - pad, x_hi + pad)
    ax.set_ylim(y_lo - pad, y_hi + pad)
    ax.set_aspect("equal")
    ax.set_xlabel("x, m")
    ax.set_ylabel("y, m")


def _plate_extent(plate):
    """The slab's outline x0, x1, y0, y1: a flat slab's own (half a column
    past its outer column lines), else the grid's."""
    if "outline_m" in plate:
        o = plate["outline_m"]
        return o["x0"], o["x1"], o["y0"], o["y1"]
    xs, ys = plate["x_lines_m"], plate["y_lines_m"]
    return xs[0], xs[-1], ys[0], ys[-1]


def _plate_axes(ax):
    plt = _pyplot()
    if ax is None:
        fig, ax = plt.subplots(figsize=(8, 6.5))
        fig.subplots_adjust(bottom=0.2)  # room for the legend and the caution
    add_caution(ax.figure)
    return ax


def plot_plate(result, quantity="mx", envelope="max", ax=None):
    """Colour map of one field of a two-way design's plate, kNm per metre:
    `quantity` mx, my, mxy (the analysis moments, sagging positive, of the
    `envelope` "max" or "min" over the ULS load cases) or bottom_x,
    bottom_y, top_x, top_y (the Wood–Armer design moments, magnitudes;
    envelope "max" only, they are already the largest). One cell per sample
    (pcolormesh, cells halfway to the neighbours), the scale diverging
    about zero for a signed field, a colour bar from the field's minimum to
    its maximum, the maximum marked; grid lines, edges by condition and bay
    names on top; the caution. Returns the axes."""
    import numpy as np
    from matplotlib import patheffects
    if quantity not in PLATE_MOMENTS + PLATE_DESIGN_MOMENTS:
        raise ValueError(f"quantity must be one of {', '.join(PLATE_MOMENTS + PLATE_DESIGN_MOMENTS)}; "
                         f"got {quantity!r}")
    if envelope not in PLATE_ENVELOPES:
        raise ValueError(f"envelope must be 'max' or 'min'; got {envelope!r}")
    if quantity in PLATE_DESIGN_MOMENTS and envelope != "max":
        raise ValueError(f"envelope must be 'max' for the design moment {quantity} (the largest over the "
                         f"load cases already); got {envelope!r}")
    plate = _plate_of(result, "plot_plate")
    field = plate.get("field")
    if field is None:
        raise ValueError("plot_plate: the result's plate has no 'field'")
    if quantity in PLATE_MOMENTS:
        path, values = f"plate.field.{quantity}.{envelope}", field.get(quantity, {}).get(envelope)
    else:
        path, values = f"plate.field.design.{quantity}", field.get("design", {}).get(quantity)
    if values is None:
        raise ValueError(f"{path}: missing from the result")
    for key in ("x_m", "y_m"):
        if not field.get(key):
            raise ValueError(f"plate.field.{key}: missing from the result")
    x, y = np.asarray(field["x_m"], dtype=float), np.asarray(field["y_m"], dtype=float)
    values = np.asarray(values, dtype=float)
    if values.shape != (y.size, x.size):
        raise ValueError(f"{path}: {values.shape[0] if values.ndim else 0} rows of "
                         f"{values.shape[1] if values.ndim > 1 else 0}, expected {y.size} rows (y_m) "
                         f"of {x.size} (x_m)")
    if not np.all(np.isfinite(values)):
        raise ValueError(f"{path}: a value is not finite")
    plt = _pyplot()
    ax = _plate_axes(ax)
    x_lo, x_hi, y_lo, y_hi = _plate_extent(plate)
    xs, ys = [x_lo, x_hi], [y_lo, y_hi]
    lo, hi = float(values.min()), float(values.max())
    cmap, norm = _plate_scale(lo, hi)
    mesh = ax.pcolormesh(_cell_edges(x, x_lo, x_hi), _cell_edges(y, y_lo, y_hi), values, shading="flat",
                         cmap=cmap, norm=norm, gid="armature-plate-field")
    _draw_plate_frame(ax, plate, bay_names_at="corner")
    bar = plt.colorbar(mesh, ax=ax, fraction=0.04, pad=0.03)
    bar.set_label(f"{quantity}, kNm/m")
    bar.set_ticks(sorted({lo, hi} | ({0.0} if lo < 0 < hi else set())))
    scale = max(abs(lo), abs(hi))  # noise beside it prints as 0, as in the record
    bar.set_ticklabels(["0" if abs(v) <= 1e-9 * scale else f"{v:.4g}" for v in bar.get_ticks()])
    j, i = np.unravel_index(int(np.argmax(values)), values.shape)
    ax.plot([x[i]], [y[j]], "o", color="black", mec="white", ms=5, gid="armature-plate-max")
    ax.annotate(f"max {hi:.4g} kNm/m", (x[i], y[j]), textcoords="offset points",
                xytext=(-5 if x[i] > (xs[0] + xs[-1]) / 2 else 5, -12 if y[j] > (ys[0] + ys[-1]) / 2 else 6),
                ha="right" if x[i] > (xs[0] + xs[-1]) / 2 else "left", fontsize=8,
                path_effects=[patheffects.withStroke(linewidth=2.5, foreground="white")])
    what = f"{quantity}, {envelope} of the load cases" if quantity in PLATE_MOMENTS else f"{quantity} design moment"
    ax.set_title(f"{what}, kNm per metre", fontsize=10)
    return ax


def _bars_text(bars):
    """A bar arrangement as the record writes it: "ø12 @ 200 mm" for a
    diameter, "#4 @ 300 mm" for a catalogue name."""
    bar = str(bars["bar"])
    return ("ø" if bar[:1].isdigit() else "") + f"{bar} @ {bars['spacing_mm']:.4g} mm"


def _plot_flat_plan(result, plate, ax):
    """plot_plan of a flat slab: column strips shaded, columns filled, each
    column's control perimeters dashed (drawn round the column at their
    distance, clipped to the slab) with its punching utilisation, the
    governing column ringed."""
    from matplotlib import patheffects
    from matplotlib.patches import FancyBboxPatch, Rectangle
    ax = _plate_axes(ax)
    _draw_plate_frame(ax, plate)
    x_lo, x_hi, y_lo, y_hi = _plate_extent(plate)
    outline = Rectangle((x_lo, y_lo), x_hi - x_lo, y_hi - y_lo, fill=False, lw=0)
    ax.add_patch(outline)
    for strip in plate["strips"]:
        if strip["kind"] != "column":
            continue
        for q in strip["spans"]:
            ax.add_patch(Rectangle((q["x0_m"], q["y0_m"]), q["x1_m"] - q["x0_m"], q["y1_m"] - q["y0_m"],
                                   color="#6a8fc7", alpha=0.12, lw=0, gid="column-strip"))
    halo = [patheffects.withStroke(linewidth=2.5, foreground="white")]
    worst, governing = -1.0, None
    for k, c in enumerate(result.get("columns", [])):
        for key in ("name", "x_m", "y_m", "size_mm", "perimeters", "checks"):
            if key not in c:
                raise ValueError(f"columns[{k}].{key}: missing from the result")
        bx, by = c["size_mm"][0] / 1000.0, c["size_mm"][1] / 1000.0
        x0, y0 = c["x_m"] - bx / 2, c["y_m"] - by / 2
        ax.add_patch(Rectangle((x0, y0), bx, by, color="black", gid="column"))
        for per in c["perimeters"]:
            a = per["distance_mm"] / 1000.0
            if a <= 0:
                continue
            p = FancyBboxPatch((x0, y0), bx, by, boxstyle=f"round,pad={a}", fill=False, ec="#b03020", lw=0.7,
                               ls="--", gid="perimeter")
            ax.add_patch(p)
            p.set_clip_path(outline)
        util = max((chk["utilisation"] for chk in c["checks"]), default=0.0)
        ax.annotate(f"{c['name']}\n{util:.2f}", (c["x_m"], c["y_m"]), textcoords="offset points", xytext=(6, 6),
                    fontsize=7, path_effects=halo, gid="armature-column")
        if util > worst:
            worst, governing = util, c
    if governing is not None:
        ax.plot([governing["x_m"]], [governing["y_m"]], "o", ms=16, mfc="none", mec="#b03020", mew=1.6,
                gid="armature-governing-column")
    ax.set_title("Plan of the flat slab: column strips shaded, punching perimeters dashed, "
                 "largest punching utilisation per column", fontsize=9)
    return ax


def plot_plan(result, ax=None):
    """Plan of a two-way design to scale: grid lines, edges by condition, bay
    names with their bottom bars (x and y) from the result's regions, and
    each top region's bars at its design position, written along its
    support line. A flat slab's plan shows its column strips, columns and
    punching perimeters instead, with each column's largest punching
    utilisation. Returns the axes."""
    plate = _plate_of(result, "plot_plan")
    if "strips" in plate:
        return _plot_flat_plan(result, plate, ax)
    regions = result.get("regions", [])
    for k, g in enumerate(regions):
        for key in ("where", "face", "direction", "x_m", "y_m", "bars"):
            if key not in g:
                raise ValueError(f"regions[{k}].{key}: missing from the result")
    from matplotlib import patheffects
    ax = _plate_axes(ax)
    _draw_plate_frame(ax, plate)
    halo = [patheffects.withStroke(linewidth=2.5, foreground="white")]
    bays = {b["name"]: b for b in plate.get("bays", [])}
    xs, ys = plate["x_lines_m"], plate["y_lines_m"]
    size = max(xs[-1] - xs[0], ys[-1] - ys[0])
    lines_below = {}
    for g in regions:
        text = f"{g['face']} {g['direction']}: {_bars_text(g['bars'])}"
        bay = bays.get(g["where"])
        if g["face"] == "bottom" and bay is not None:
            row = lines_below.get(g["where"], 0)
            lines_below[g["where"]] = row + 1
            ax.annotate(text, ((bay["x0_m"] + bay["x1_m"]) / 2, (bay["y0_m"] + bay["y1_m"]) / 2),
                        textcoords="offset points", xytext=(0, -4 - 11 * row), ha="center", va="top", fontsize=8,
                        path_effects=halo, gid="armature-bars")
            continue
        # A top region on a line along y (x on a grid line, y not) is
        # labelled up the page along the line.
        on_x_line = any(abs(g["x_m"] - x) <= 1e-6 * size for x in xs)
        on_y_line = any(abs(g["y_m"] - y) <= 1e-6 * size for y in ys)
        along_y = on_x_line and not on_y_line
        ax.plot([g["x_m"]], [g["y_m"]], "o", color="black", ms=3.5)
        ax.annotate(text, (g["x_m"], g["y_m"]), textcoords="offset points", xytext=(-3, 0) if along_y else (4, 3),
                    rotation=90 if along_y else 0, ha="center" if along_y else "left", va="bottom", rotation_mode="anchor", fontsize=7, path_effects=halo,
                    gid="armature-bars")
    ax.set_title("Plan of the slab: edges by condition, bays named, bars per bay", fontsize=10)
    return ax
