"""US customary and SI quantity strings in requests (exact factors:
1 in = 25.4 mm, 1 ft = 0.3048 m, 1 psf = 0.047880259 kPa,
1 psi = 0.0068947573 MPa, by definition of the inch and the pound-force)."""
import json
import re
import subprocess

import pytest

import armature
from conftest import CLI

IN, FT = 25.4, 304.8  # mm
PSF = 4.4482216152605 / (0.3048 ** 2) / 1000  # kPa
PSI = 4.4482216152605 / (25.4 ** 2)           # MPa

US = {
    "code": "ACI318-19",
    "slab": {"spans": ["14 ft", "15 ft 6 in"], "ends": ["pinned", "pinned"], "thickness": "8 in"},
    "concrete": {"cylinder_strength": "4000 psi"},
    "reinforcement": {"yield_strength": "60 ksi", "bars": ["#4", "#5"]},
    "loads": {"dead": "15 psf", "imposed": "50 psf"},
    "durability": {"cover": "1 in"},
}
SI = {
    "code": "ACI318-19",
    "slab": {"spans_m": [14 * FT / 1000, (15 * FT + 6 * IN) / 1000], "ends": ["pinned", "pinned"],
             "thickness_mm": 8 * IN},
    "concrete": {"cylinder_strength_MPa": 4000 * PSI},
    "reinforcement": {"yield_strength_MPa": 60000 * PSI, "bars": ["#4", "#5"]},
    "loads": {"dead_kPa": 15 * PSF, "imposed_kPa": 50 * PSF},
    "durability": {"cover_mm": 1 * IN},
}


def assert_same(a, b):
    if isinstance(a, dict):
        assert a.keys() == b.keys()
        for k in a:
            assert_same(a[k], b[k])
    elif isinstance(a, list):
        assert len(a) == len(b)
        for x, y in zip(a, b):
            assert_same(x, y)
    elif isinstance(a, float):
        assert a == pytest.approx(b, rel=1e-12, abs=1e-12)
    else:
        assert a == b


def test_us_request_designs_as_its_si_equivalent():
    assert_same(armature.design(US), armature.design(SI))


def test_si_quantity_strings_too():
    req = {
        "code": "EN1992-1-1",
        "slab": {"spans": ["4.2 m"], "ends": ["pinned", "pinned"], "thickness": "200 mm"},
        "concrete": {"class": "C30/37"},
        "loads": {"dead": "2.5 kPa", "imposed": "3 kPa"},
    }
    plain = {
        "code": "EN1992-1-1",
        "slab": {"spans_m": [4.2], "ends": ["pinned", "pinned"], "thickness_mm": 200},
        "concrete": {"class": "C30/37"},
        "loads": {"dead_kPa": 2.5, "imposed_kPa": 3.0},
    }
    assert_same(armature.design(req), armature.design(plain))


@pytest.mark.parametrize("edit,field,message", [
    (("slab", "thickness_mm", 200), "slab.thickness", "not both"),
    (("slab", "thickness", "8 kg"), "slab.thickness", "unknown unit 'kg'"),
    (("slab", "thickness", "2 kPa"), "slab.thickness", "must be a length"),
    (("slab", "thickness", 8), "slab.thickness", "quantity with a unit"),
    (("loads", "imposed", "50 ft"), "loads.imposed", "must be a pressure"),
    (("slab", "spans", ["14 ft", "3 psi"]), "slab.spans[1]", "must be a length"),
    (("slab", "thickness", "1 in"), "slab.thickness", "must be between 50 and 1500 mm"),
])
def test_bad_quantities_name_the_field(edit, field, message):
    req = json.loads(json.dumps(US))
    req[edit[0]][edit[1]] = edit[2]
    with pytest.raises(armature.InputError) as info:
        armature.design(req)
    lines = [l for l in str(info.value).splitlines() if l.startswith(field + ": ")]
    assert lines and message in lines[0], str(info.value)


def test_us_report_units_in_the_summary():
    req = dict(US, report_units="US")
    run = subprocess.run([str(CLI), "design", "-"], input=json.dumps(req), capture_output=True,
                         text=True, timeout=60)
    # Every check of this floor passes: exit 0.
    assert run.returncode == 0, run.stderr
    assert "kip-ft" in run.stdout and "in2" in run.stdout
    # Loads by hand, in psf: self-weight 23.6 kN/m³ (the ACI basis' default, 150 lb/ft³,
    # common practice) × 8 in = 4.7955 kPa = 100.16 psf; ULS 1.2 D + 1.6 L (ACI 318-19
    # 5.3.1b) = 1.2 × (100.16 + 15) + 1.6 × 50 = 218.19 psf.
    assert "self-weight 100.16 psf, ULS 218.19 psf [5.3.1b: 1.2 D + 1.6 L]" in run.stdout
    # Minimum thickness, ACI 318-19 Table 7.3.1.1 (value from memory): one end continuous
    # ℓ/24 × (0.4 + fy/700), fy = 60 ksi = 413.69 MPa: 168 in/24 × 0.99098 = 6.937 in and
    # 186 in/24 × 0.99098 = 7.680 in, against h = 8 in (the summary's four figures).
    defl = {m.group(1): (m.group(2), m.group(3)) for m in
            re.finditer(r"^deflection +(span \d) +(\S+) +(\S+) +in ", run.stdout, re.M)}
    assert defl == {"span 1": ("6.937", "8"), "span 2": ("7.68", "8")}
    si_run = subprocess.run([str(CLI), "design", "-"], input=json.dumps(US), capture_output=True,
                            text=True, timeout=60)
    assert "kNm" in si_run.stdout and "kip-ft" not in si_run.stdout
    # The JSON result stays SI whatever the report units.
    js = subprocess.run([str(CLI), "design", "--json", "-"], input=json.dumps(req),
                        capture_output=True, text=True, timeout=60)
    assert_same(json.loads(js.stdout), armature.design(US))
    with pytest.raises(armature.InputError, match=r"report_units: must be"):
        armature.design(dict(US, report_units="imperial"))
