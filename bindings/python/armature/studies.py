"""Parametric studies: the product of a few input axes, designed on all
cores by the kernel and returned as one DataFrame built column by column
(no Python dict per design on this path)."""
import copy

from . import _core
from ._core import CAUTION
from ._paths import _check_paths, _set_path
from .tables import _pandas


def sweep(base_request, axes, threads=0):
    """Design every combination of `axes` applied to `base_request`.

    `axes` maps dotted field paths to sequences of values:
    ``{"slab.thickness_mm": [175, 200, 225], "slab.spans_m[0]": [4.0, 5.0],
    "concrete.class": ["C25/30", "C30/37"], "code": ["EN1992-1-1:UK", "ACI318-19"]}``.
    Every path is checked against the request fields first: one that is
    not a field (a misspelling) raises InputError naming it, before
    anything is designed. The first axis varies slowest. Returns a
    DataFrame, one row per combination: the axis values, ``status`` (pass,
    fail, or invalid with the message in ``error``), ``max_utilisation``,
    the governing check and where, ``steel_kg_m2`` (reinforcement mass per
    m² of slab, an estimate: see DEVELOPERS.md), ``concrete_m3_m2``, and
    per region its bar, spacing and provided area. ``attrs`` holds the
    caution, the base request and the axis paths (for `request_for`).
    """
    pd = _pandas()
    paths = list(axes)
    values = [list(axes[p]) for p in paths]
    _check_paths(base_request, [(p, v[0] if v else None) for p, v in zip(paths, values)], "sweep axis")
    columns = _core.sweep_columns(base_request, paths, values, threads)
    frame = pd.DataFrame(columns)
    frame.attrs["caution"] = CAUTION
    frame.attrs["base_request"] = copy.deepcopy(base_request)
    frame.attrs["axes"] = paths
    return frame


def _plain(value):
    """A value read back from a DataFrame as a plain Python object (numpy
    scalars to int, float, str, bool)."""
    item = getattr(value, "item", None)
    if item is not None and type(value).__module__ == "numpy":
        return item()
    return copy.deepcopy(value)


def request_for(study, row):
    """The request of one row of a `sweep`: the base request with that
    row's axis values set. `row` is an index label of the study (the
    default index counts the combinations from 0; `idxmin()` and the like
    give labels) or a row of it (a Series, from ``study.loc[...]`` or
    ``iterrows()``). Design it with `armature.design` for the full result
    and `armature.report` for its record."""
    base = study.attrs.get("base_request")
    paths = study.attrs.get("axes")
    if base is None or paths is None:
        raise ValueError("request_for needs a DataFrame returned by armature.sweep "
                         "(its attrs keep the base request and the axes)")
    pd = _pandas()
    if not isinstance(row, pd.Series):
        if row not in study.index:
            raise KeyError(f"the study has no row {row!r}")
        row = study.loc[row]
    req = copy.deepcopy(base)
    for path in paths:
        if path not in row.index:
            raise ValueError(f"the row has no column {path!r} (an axis of the study)")
        _set_path(req, path, _plain(row[path]), base)
    return req
