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
