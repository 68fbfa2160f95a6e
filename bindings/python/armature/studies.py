"""Parametric studies: the product of a few input axes, designed on all
cores by the kernel and returned as one DataFrame built column by column
(no Python dict per design on this path)."""
from . import _core
from .tables import _pandas


def sweep(base_request, axes, threads=0):
    """Design every combination of `axes` applied to `base_request`.

    `axes` maps dotted field paths to sequences of values:
    ``{"slab.thickness_mm": [175, 200, 225], "slab.spans_m[0]": [4.0, 5.0],
    "concrete.class": ["C25/30", "C30/37"], "code": ["EN1992-1-1:UK", "ACI318-19"]}``.
    The first axis varies slowest. Returns a DataFrame, one row per
    combination: the axis values, ``status`` (pass, fail, or invalid with the
    message in ``error``), ``max_utilisation``, the governing check and
    where, ``steel_kg_m2`` (reinforcement mass per m² of slab, an estimate:
    see DEVELOPERS.md), ``concrete_m3_m2``, and per region its bar, spacing
    and provided area.
    """
    pd = _pandas()
    paths = list(axes)
    values = [list(axes[p]) for p in paths]
    columns = _core.sweep_columns(base_request, paths, values, threads)
    return pd.DataFrame(columns)
