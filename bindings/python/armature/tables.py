"""Results as tables (pandas), and one floor compared across codes.

Everything here rearranges results of the C++ kernel; no engineering rule
is evaluated in Python.
"""
import copy

from ._core import CAUTION, InputError
from ._paths import _check_paths, _set_path


def _pandas():
    try:
        import pandas
    except ImportError as e:  # pragma: no cover - depends on the machine
        raise ImportError("armature tables need pandas (Debian: python3-pandas)") from e
    return pandas


def to_frame(result):
    """The checks of one result as a DataFrame, one row per check."""
    pd = _pandas()
    columns = ["id", "where", "clause", "demand", "capacity", "unit", "utilisation", "pass"]
    frame = pd.DataFrame([{k: c[k] for k in columns} for c in result["checks"]], columns=columns)
    frame.attrs["caution"] = CAUTION
    return frame


SCHEDULE_COLUMNS = ["mark", "bar", "count", "length_mm", "shape", "mass_kg"]


def schedule(result):
    """The bar schedule of a result designed with `detailing`, as a
    DataFrame: one row per mark (mark, bar, count, length_mm, shape,
    mass_kg); attrs carry the total mass, the kg/m² and the caution."""
    if "detailing" not in result:
        raise InputError("detailing: the result has no bar schedule; design the request with "
                         "\"detailing\": {\"slab_width_m\": ...}")
    pd = _pandas()
    d = result["detailing"]
    rows = [{k: (int(row[k]) if k == "count" else row[k]) for k in SCHEDULE_COLUMNS} for row in d["schedule"]]
    frame = pd.DataFrame(rows, columns=SCHEDULE_COLUMNS)
    frame.attrs["total_mass_kg"] = d["total_mass_kg"]
    frame.attrs["mass_per_area_kg_m2"] = d["mass_per_area_kg_m2"]
    frame.attrs["caution"] = CAUTION
    return frame


def _with_code(request, spec):
    code, _, variant = spec.partition(":")
    req = copy.deepcopy(request)
    req["code"] = code
    if variant:
        req["variant"] = variant
    else:
        req.pop("variant", None)
    return req


def _overrides_for(spec, overrides):
    """The overrides that apply to the code `spec` ("EN1992-1-1:UK"): those
    given for its code id ("EN1992-1-1") first, then those for the spec
    itself, as (path, value) pairs."""
    code = spec.partition(":")[0]
    out = []
    for key in dict.fromkeys([code, spec]):
        out.extend(overrides.get(key, {}).items())
    return out


def _check_overrides(request, codes, overrides):
    if not isinstance(overrides, dict):
        raise InputError("overrides: must map a code (\"ACI318-19\", \"EN1992-1-1:UK\") to "
                         "{field path: value}")
    known = set(codes) | {spec.partition(":")[0] for spec in codes}
    for key, fields in overrides.items():
        if key not in known:
            raise InputError(f"overrides.{key}: not one of the codes compared ({', '.join(codes)})")
        if not isinstance(fields, dict):
            raise InputError(f"overrides.{key}: must map field paths to values, "
                             "such as {\"reinforcement.bars\": [\"#4\", \"#5\"]}")
        for path in fields:
            if path in ("code", "variant"):
                raise InputError(f"overrides.{key}.{path}: the code and variant come from `codes`")
    for spec in codes:
        pairs = _overrides_for(spec, overrides)
        if pairs:
            _check_paths(_with_code(request, spec), pairs, f"override for {spec}")


# Exact unit definitions (1 in = 25.4 mm, 1 ft = 0.3048 m, 1 lbf =
# 4.4482216152605 N), for a table in US customary units.
_MM_PER_IN = 25.4
_MM_PER_FT = 304.8
_KNM_PER_KIP_FT = 4.4482216152605 * 0.3048


def _strip_width_mm(result, request):
    """The design strip width of a result: as the result states it (a code
    whose practice strip is not a metre), else as the request gives it,
    else the contract's 1000 mm."""
    from ._core import given_strip_width_mm

    if "strip_width_mm" in result:
        return result["strip_width_mm"]
    given = given_strip_width_mm(request)
    return 1000.0 if given is None else given


def _us_row(row, strip_width_mm):
    """A row of the comparison in US customary units, per foot of slab
    (every moment and area of a result is for its strip width)."""
    per_ft = _MM_PER_FT / strip_width_mm
    out = {}
    for key, value in row.items():
        if key == "design_moment_kNm":
            out["design_moment_kip_ft_per_ft"] = value / _KNM_PER_KIP_FT * per_ft
        elif key == "effective_depth_mm":
            out["effective_depth_in"] = value / _MM_PER_IN
        elif key == "spacing_mm":
            out["spacing_in"] = value / _MM_PER_IN
        elif key in ("As_req_mm2", "As_min_mm2", "As_prov_mm2"):
            out[key[:-4] + "_in2_per_ft"] = value / _MM_PER_IN ** 2 * per_ft
        else:
            out[key] = value
    return out


def compare(request, codes, overrides=None, units="SI"):
    """Design one request to several codes; one row per code and region.

    `codes` are ids with an optional variant: "EN1992-1-1:UK", "ACI318-19".
    What only one code knows (bar names, exposure names, a strength class)
    goes in `overrides`: per code, field paths as in `sweep` axes and their
    values, for example ``{"ACI318-19": {"reinforcement.bars": ["#4", "#5"]},
    "EN1992-1-1": {"reinforcement.bars": ["10", "12"]}}``. A key is a code id
    (every variant of it) or an id with its variant (that one only, applied
    after the id's). A path that is not a request field raises InputError
    naming it; so does a field that one code refuses, with the code.
    The DataFrame's ``attrs`` hold the caution and, under "requests", the
    request designed for each code (for `design` and `report`).
    `units`: "SI" (each row for its strip width, kNm, mm, mm²) or "US"
    (per foot of slab: kip-ft/ft, in, in²/ft), whichever code designed it.
    """
    from . import design

    if units not in ("SI", "US"):
        raise InputError(f'units: must be "SI" or "US", got {units!r}')
    overrides = {} if overrides is None else overrides
    codes = list(codes)
    _check_overrides(request, codes, overrides)
    pd = _pandas()
    rows = []
    requests = {}
    for spec in codes:
        req = _with_code(request, spec)
        for path, value in _overrides_for(spec, overrides):
            _set_path(req, path, copy.deepcopy(value), req)
        requests[spec] = req
        try:
            res = design(req)
        except InputError as e:
            raise InputError("\n".join(f"{spec}: {line}" for line in str(e).splitlines())) from None
        deflection = {c["where"]: c for c in res["checks"] if c["id"] == "deflection"}
        for g in res["regions"]:
            # As the result's own headline: a passing spacing limit (the search
            # works up to it) does not govern.
            headline = [c for c in g["checks"] if c["id"] != "spacing" or not c["pass"]] or g["checks"]
            worst = max(headline, key=lambda c: c["utilisation"])
            span_check = deflection.get(g["where"]) if g["face"] == "bottom" else None
            row = {
                "code": spec,
                "variant": res["variant"],
                "where": g["where"],
                "face": g["face"],
                "design_moment_kNm": g["design_moment_kNm"],
                "effective_depth_mm": g["effective_depth_mm"],
                "bar": g["bars"]["bar"],
                "spacing_mm": g["bars"]["spacing_mm"],
                "As_req_mm2": g["As_req_mm2"],
                "As_min_mm2": g["As_min_mm2"],
                "As_prov_mm2": g["bars"]["As_prov_mm2"],
                "bars_given": g["bars_given"],
                "utilisation": worst["utilisation"],
                "governing_check": worst["id"],
                "thickness_check": span_check["utilisation"] if span_check else float("nan"),
                "status": res["status"],
                "max_utilisation": res["max_utilisation"],
                "governing": f'{res["governing"]["check"]} at {res["governing"]["where"]}',
            }
            rows.append(_us_row(row, _strip_width_mm(res, req)) if units == "US" else row)
    frame = pd.DataFrame(rows)
    frame.attrs["caution"] = CAUTION
    frame.attrs["units"] = units
    frame.attrs["requests"] = requests
    return frame
