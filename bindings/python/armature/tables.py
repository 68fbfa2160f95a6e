"""Results as tables (pandas), and one floor compared across codes.

Everything here rearranges results of the C++ kernel; no engineering rule
is evaluated in Python.
"""
import copy

from ._core import InputError


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
    return pd.DataFrame([{k: c[k] for k in columns} for c in result["checks"]], columns=columns)


def _with_code(request, spec):
    code, _, variant = spec.partition(":")
    req = copy.deepcopy(request)
    req["code"] = code
    if variant:
        req["variant"] = variant
    else:
        req.pop("variant", None)
    return req


def compare(request, codes):
    """Design one request to several codes; one row per code and region.

    `codes` are ids with an optional variant: "EN1992-1-1:UK", "ACI318-19".
    The request must be valid for every code named (leave out the fields
    only one code has, such as bar names, exposure names or a strength
    class); a field that one code refuses raises InputError naming it.
    """
    from . import design

    pd = _pandas()
    rows = []
    for spec in codes:
        try:
            res = design(_with_code(request, spec))
        except InputError as e:
            raise InputError("\n".join(f"{spec}: {line}" for line in str(e).splitlines())) from None
        deflection = {c["where"]: c for c in res["checks"] if c["id"] == "deflection"}
        for g in res["regions"]:
            worst = max(g["checks"], key=lambda c: c["utilisation"])
            span_check = deflection.get(g["where"]) if g["face"] == "bottom" else None
            rows.append({
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
                "utilisation": worst["utilisation"],
                "governing_check": worst["id"],
                "thickness_check": span_check["utilisation"] if span_check else float("nan"),
                "status": res["status"],
                "max_utilisation": res["max_utilisation"],
                "governing": f'{res["governing"]["check"]} at {res["governing"]["where"]}',
            })
    return pd.DataFrame(rows)
