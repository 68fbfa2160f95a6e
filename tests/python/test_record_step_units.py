"""Units of the kernel's own derivation steps in the calculation record:
the bend at an end support (and the support's anchorage check that repeats
it) and the curtailment of alternate bottom bars are written in the units
of the code's edition, as the code's steps beside them are: inches (in²,
kip-ft, ft along the strip) under the US variant of ACI 318-19, whatever
report_units asks; millimetres under its SI variant. The result JSON stays
SI.

Sources: the inch and the foot, 25.4 mm and 0.3048 m exactly (their
definitions), and 1 lbf = 4.4482216152605 N (definition of the pound-force,
value from memory); ACI 318-19 Table 25.3.2 for the hook's inside bend
diameter, 6 db for #3 to #8 (value from memory). The slab is our own: the
community workshop's US sister building, its end walls given widths.
"""
import copy
import re

import pytest

import armature

IN = 25.4  # mm, exactly (definition of the inch)
FT = 304.8  # mm, exactly (definition of the foot)
KNM_PER_KIP_FT = 4.4482216152605 * 0.3048  # kN·m per kip·ft (definitions of the pound-force and the foot)

# The first floor of the US example with a built-in end on a 10 in wall:
# the straight ld of the top bars there does not fit 10 in less the cover,
# so they end in a standard hook (the "bend (start)" derivation).
FLOOR = {
    "code": "ACI318-19",
    "variant": "US",
    "slab": {"spans": ["14 ft", "16 ft", "14 ft"], "ends": ["fixed", "pinned"], "thickness": "7.5 in",
             "support_widths_mm": [254.0, 304.8, 304.8, 203.2]},
    "concrete": {"cylinder_strength": "4000 psi"},
    "reinforcement": {"yield_strength": "60 ksi", "bars": ["#4", "#5", "#6"]},
    "loads": {"dead": "20 psf", "imposed": "100 psf"},
    "durability": {"exposure": "interior"},
    "detailing": {"slab_width_m": 6.0},
}

# A step line of the Markdown record: "- symbol = ... = result unit (clause)".
STEP = re.compile(r"^- (?P<symbol>\S+) = (?P<body>.*) = (?P<value>-?[0-9.]+)(?: (?P<unit>[A-Za-z][A-Za-z0-9-]*))?"
                  r"(?: \((?P<clause>.*)\))?$")


def derivation(r, where, what):
    found = [d for d in r["detailing"]["derivations"] if d["where"] == where and d["what"] == what]
    assert len(found) == 1, (where, what)
    return found[0]


def record_steps(r, path, heading):
    """The steps under a heading of the Markdown record: symbol → (value, unit, substituted)."""
    armature.report(r, path)
    lines = path.read_text().splitlines()
    start = lines.index(heading)
    steps = {}
    for line in lines[start + 2:]:
        if not line.startswith("- "):
            break
        if line.startswith("- demand "):
            steps["verdict"] = line
            continue
        m = STEP.match(line)
        assert m, line
        steps[m["symbol"]] = (float(m["value"]), m["unit"], m["body"].split(" = ")[-1])
    return steps


def bend_si_values(r):
    """The bend's lengths in mm, from the result (SI) and the request."""
    top = [b for b in r["detailing"]["bars"] if b["where"] == "support 1" and b["face"] == "top"
           and b["role"] == "main"]
    assert len(top) == 1 and top[0]["shape"] == "L-bar"
    db = top[0]["diameter_mm"]
    return {
        "t": 254.0,  # the request's wall, 10 in
        "c": r["cover_mm"]["top"],
        "l,straight": derivation(r, "support 1, top", "anchorage")["length_mm"],
        "lb,prov": derivation(r, "support 1, top", "bend (start)")["length_mm"],
        "lb,req": derivation(r, "support 1, top", "hooked anchorage (start)")["length_mm"],
        "D": 6 * db,  # ACI 318-19 Table 25.3.2 (value from memory)
        "leg": top[0]["legs_mm"]["start"],
    }, db


def four_figures(v):
    return pytest.approx(v, rel=5e-4)  # the record prints four significant figures


@pytest.mark.parametrize("report_units", [None, "SI"], ids=["report-US", "report-SI"])
def test_us_bend_derivation_is_in_inches(tmp_path, report_units):
    req = copy.deepcopy(FLOOR)
    if report_units:
        req["report_units"] = report_units
    r = armature.design(req)
    si, db = bend_si_values(r)
    # The JSON stays SI: the bend provides t − c past the face, in mm.
    assert si["lb,prov"] == pytest.approx(si["t"] - si["c"])
    steps = record_steps(r, tmp_path / "record.md", "**bend (start) of support 1, top** (ACI 318-19 25.3, 25.4.3)")
    for symbol, mm in si.items():
        value, unit, _ = steps[symbol]
        assert unit == "in", (symbol, unit)
        assert value == four_figures(mm / IN), symbol
    # The substituted values are inches too: t − c, D/2 + φ + extension (12 db, Table 25.3.1).
    assert steps["lb,prov"][2] == "10 − 0.75"
    assert steps["leg"][2] == "3/2 + 0.5 + 6"
    assert steps["lb,req/lb,prov"][1] is None
    assert steps["lb,req/lb,prov"][2] == "6 / 9.25"
    assert steps["lb,req/lb,prov"][0] == four_figures(si["lb,req"] / si["lb,prov"])
    # The support's anchorage check repeats the bend, after the bar's size, in inches.
    check = record_steps(r, tmp_path / "record.md", "**anchorage at support 1** (ACI 318-19 25.3, 25.4.3)")
    assert check["φ"][:2] == (four_figures(db / IN), "in")
    for symbol in si:
        assert check[symbol][:2] == steps[symbol][:2], symbol
    # The code's own hook derivation beside it: ψr compares s with 6 db in inches (12 ≥ 3).
    hook = record_steps(r, tmp_path / "record.md",
                        "**hooked anchorage (start) of support 1, top** (ACI 318-19 25.3, 25.4.3)")
    assert hook["ψr"][2] == "12 ≥ 6 × 0.5"
    assert hook["ldh"][1] == "in" and hook["ldh"][0] == four_figures(si["lb,req"] / IN)


def test_si_variant_keeps_the_bend_in_millimetres_under_us_report_units(tmp_path):
    # ACI 318-19 (SI): its edition's steps are in mm, and so are the
    # kernel's beside them, though the record's tables are in US units.
    req = copy.deepcopy(FLOOR)
    req["variant"] = "SI"
    req["report_units"] = "US"
    req["reinforcement"] = {"yield_strength_MPa": 420}
    req["concrete"] = {"cylinder_strength_MPa": 28}
    r = armature.design(req)
    bend = derivation(r, "support 1, top", "bend (start)")
    steps = record_steps(r, tmp_path / "record.md", "**bend (start) of support 1, top** (ACI 318-19 25.3, 25.4.3)")
    assert steps["t"][:2] == (four_figures(254.0), "mm")
    assert steps["c"][:2] == (four_figures(r["cover_mm"]["top"]), "mm")
    assert steps["lb,prov"][:2] == (four_figures(bend["length_mm"]), "mm")


def test_us_curtailment_derivation_is_in_us_units(tmp_path):
    # Heavier loads on longer spans: half the bottom bars stop where the
    # rest carry the moment (detailing.curtail "alternate").
    req = copy.deepcopy(FLOOR)
    req["slab"] = {"spans": ["24 ft", "30 ft", "24 ft"], "ends": ["pinned", "pinned"], "thickness": "12 in"}
    req["loads"] = {"dead": "60 psf", "imposed": "250 psf"}
    req["detailing"] = {"slab_width_m": 6.0, "curtail": "alternate"}
    r = armature.design(req)
    stop = derivation(r, "span 1, bottom (curtailed bars)", "curtailment")
    span = [g for g in r["regions"] if g["where"] == "span 1" and g["face"] == "bottom"][0]
    steps = record_steps(r, tmp_path / "record.md",
                         "**curtailment of span 1, bottom (curtailed bars)** (ACI 318-19 7.7.3.3)")
    As_half = span["bars"]["As_prov_mm2"] / 2
    assert steps["As,A"][:2] == (four_figures(As_half / IN**2), "in2")
    # M_A = M_Ed As,A / As,req, in kip-ft (M_Ed per strip width from the result, kNm).
    M_A = span["design_moment_kNm"] * As_half / span["As_req_mm2"]
    assert steps["M_A"][:2] == (four_figures(M_A / KNM_PER_KIP_FT), "kip-ft")
    for symbol in ("x0", "x1"):
        assert steps[symbol][1] == "ft"
    assert steps["l"][:2] == (four_figures(stop["length_mm"] / FT), "ft")
