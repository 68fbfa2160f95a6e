"""Parametric studies: the product of a few input axes, designed on all
cores by the kernel and returned as one DataFrame built column by column
(no Python dict per design on this path)."""
import collections
import copy
import warnings

from . import _core
from ._core import CAUTION, InputError
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
    m² of slab, an estimate: see DEVELOPERS.md; the bar schedule's mass
    when the request gives ``detailing``), ``concrete_m3_m2``, and
    per region its bar, spacing and provided area (and, when some region
    of the study is checked with given bars, ``<region> bars_given``).
    ``attrs`` holds the caution, the base request and the axis paths (for
    `request_for`).
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


Optimum = collections.namedtuple("Optimum", ["result", "table"])
Optimum.__doc__ = """What `optimise` returns: the chosen design's full result and the table
of every candidate."""

OBJECTIVES = ("cost", "carbon", "depth", "steel_mass")


def optimise(request, vary, objective="cost", rates=None, threads=0, prune=True):
    """The best passing slab among every combination of `vary` applied to
    `request`, under `objective`.

    `vary` maps dotted field paths to sequences of values, as `sweep`'s
    axes: ``{"slab.thickness_mm": range(150, 301, 10), "concrete.class":
    ["C25/30", "C30/37"], "reinforcement.bars": [["10", "12"], ["12", "16"]]}``.
    `objective` is "cost" (per m² of slab, in the currency of `rates`),
    "carbon" (kgCO2e per m²), "depth" (mm) or "steel_mass" (kg/m², the
    estimate of DEVELOPERS.md). `rates` are the user's; none is built in:
    ``{"concrete_per_m3": ..., "steel_per_tonne": ..., "formwork_per_m2": ...,
    "carbon": {"concrete_per_m3": {"C30/37": ...}, "steel_per_kg": ...}}``
    (cost needs the first three, and ``concrete_per_m3`` may be an object by
    concrete class; carbon needs the factors of every concrete class
    searched, keyed by ``concrete.class``, or "28 MPa" for a request that
    gives ``cylinder_strength_MPa``). Bad axes, rates or objective raise InputError naming the
    field, before anything is designed.

    The search runs in the kernel on all cores. With `prune` (the default)
    thicknesses are designed thinnest first and a candidate whose objective
    with no steel already exceeds that of a passing candidate no thicker is
    not designed (status "pruned"): the choice is the one an exhaustive
    search makes.

    Returns ``Optimum(result, table)``: the full result of the chosen
    design (the least objective, then the thinner; when nothing passes, the
    least-failing, whose status is "fail", with a warning saying so) and a
    DataFrame of every candidate: the axis values, ``status`` (pass, fail,
    invalid, pruned), ``objective``, ``thickness_mm``, ``pareto`` (on the
    front of objective against thickness among passing candidates),
    ``chosen``, and the columns of `sweep`. ``attrs`` holds the caution,
    the base request, the axes, the objective, its unit and the message.
    """
    pd = _pandas()
    if not hasattr(vary, "items") or not vary:
        raise InputError("vary: give a mapping of field paths to lists of values, "
                         "for example {\"slab.thickness_mm\": range(150, 301, 10)}")
    if not isinstance(objective, str) or objective not in OBJECTIVES:
        raise InputError(f"objective: must be one of {', '.join(OBJECTIVES)}, got {objective!r}")
    paths = list(vary)
    values = []
    bad = []
    for path in paths:
        axis = vary[path]
        if isinstance(axis, (str, bytes, dict)) or not hasattr(axis, "__iter__"):
            bad.append(f"vary.{path}: must be a list of values, got {axis!r}")
            continue
        axis = list(axis)
        if not axis:
            bad.append(f"vary.{path}: has no values")
        values.append(axis)
    if bad:
        raise InputError("\n".join(bad))
    _check_paths(request, [(p, v[0]) for p, v in zip(paths, values)], "optimise axis")
    found = _core.optimise_columns(request, paths, values, objective, rates, threads, prune)
    frame = pd.DataFrame(found["columns"])
    frame.attrs["caution"] = CAUTION
    frame.attrs["base_request"] = copy.deepcopy(request)
    frame.attrs["axes"] = paths
    frame.attrs["objective"] = objective
    frame.attrs["objective_unit"] = found["unit"]
    frame.attrs["message"] = found["message"]
    from . import design  # the package's design (a Result that keeps its request)

    result = design(request_for(frame, found["chosen"]))
    if not found["chosen_passes"]:
        warnings.warn(found["message"], stacklevel=2)
    return Optimum(result, frame)


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
        raise ValueError("request_for needs a DataFrame returned by armature.sweep or armature.optimise "
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
