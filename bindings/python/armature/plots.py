"""Plots with matplotlib: the envelopes of one design, and a study."""
from . import _core


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
        _, axes = plt.subplots(2, 1, sharex=True, figsize=(8, 5))
    ax_m, ax_v = axes
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
        _, ax = plt.subplots(figsize=(7, 4))
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
    ax.legend(fontsize=8)
    return ax
