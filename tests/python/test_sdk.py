"""Plug-ins from outside the repository: install armature into a temporary
prefix, build the example house-rules plug-in against it as a separate CMake
project, and use it from the installed CLI and from Python; data-only
national-annex variants."""
import json
import os
import pathlib
import shutil
import subprocess
import sys

import pytest

import armature
from conftest import BUILD, ROOT

EXAMPLE = ROOT / "codes" / "examples" / "house-rules"
DEMO = json.loads((ROOT / "examples" / "workshop-first-floor.json").read_text())


@pytest.fixture(scope="module")
def installed(tmp_path_factory):
    base = tmp_path_factory.mktemp("sdk")
    prefix, example_build = base / "prefix", base / "house-build"
    subprocess.run(["cmake", "--install", str(BUILD), "--prefix", str(prefix)], check=True,
                   capture_output=True)
    subprocess.run(["cmake", "-S", str(EXAMPLE), "-B", str(example_build),
                    f"-DCMAKE_PREFIX_PATH={prefix}", "-DCMAKE_BUILD_TYPE=Release"], check=True,
                   capture_output=True)
    subprocess.run(["cmake", "--build", str(example_build)], check=True, capture_output=True)
    return prefix, example_build


def clean_env(**extra):
    env = {k: v for k, v in os.environ.items() if k != "ARMATURE_CODE_PATH"}
    env.update(extra)
    return env


def test_installed_cli_finds_installed_plugins_without_environment(installed):
    prefix, _ = installed
    run = subprocess.run([str(prefix / "bin" / "armature"), "codes"], capture_output=True, text=True,
                         env=clean_env(), check=True)
    assert f"{prefix}/lib/armature/codes/armature_code_en1992.so" in run.stdout
    assert f"{prefix}/lib/armature/codes/armature_code_aci318.so" in run.stdout
    assert str(BUILD) not in run.stdout  # never reaches back into the build tree


def house_request():
    req = dict(DEMO, code="HOUSE-RULES")
    req.pop("variant")
    return req


def test_house_rules_from_the_installed_cli(installed):
    prefix, example_build = installed
    env = clean_env(ARMATURE_CODE_PATH=str(example_build))
    run = subprocess.run([str(prefix / "bin" / "armature"), "design", "--json", "-"],
                         input=json.dumps(house_request()), capture_output=True, text=True, env=env)
    # The demo floor meets the house rules too: every check passes, exit 0.
    assert run.returncode == 0, run.stderr
    res = json.loads(run.stdout)
    assert res["code"] == "HOUSE-RULES" and res["variant"] == "EN1992-UK"
    assert res["status"] == "pass"
    clauses = {c["clause"] for c in res["checks"]}
    assert {"house rule HR-2", "house rule HR-3", "house rule HR-4"} <= clauses
    hr3 = [c for c in res["checks"] if c["clause"] == "house rule HR-3"]
    assert all(c["demand"] == 175 and c["capacity"] == 200 for c in hr3)
    assert all(g["bars"]["spacing_mm"] <= 200 for g in res["regions"])
    # HR-4: 30 mm. EN's own cover is no more for the demo's bars (XC1, S2: cmin,dur 10 mm,
    # cmin,b = φ, + Δcdev 10 mm, up to 5 mm: 20 mm for ø8-ø10, 25 mm for ø12, 30 mm for ø16;
    # EN 1992-1-1 4.4.1, value from memory), so every region has d = 200 − 30 − φ/2.
    assert res["cover_mm"] == {"top": 30, "bottom": 30}
    for g in res["regions"]:
        assert g["effective_depth_mm"] == 200 - 30 - g["bars"]["diameter_mm"] / 2, g["where"]
    # The balcony root (support 4) is statically determinate: n L²/2 with
    # n = 1.35 (25 × 0.2 + 1.5) + 1.5 × 4.0 = 14.775 kPa (EN 1990 6.10), L = 1.5 m: 16.62 kNm.
    root = next(g for g in res["regions"] if g["where"] == "support 4")
    assert root["design_moment_kNm"] == pytest.approx(14.775 * 1.5 ** 2 / 2)


def test_house_rules_tighten_en_deflection_by_0_9(installed):
    _, example_build = installed
    # A span where EN (UK) already picks bars within the house limits
    # (spacing ≤ 200 mm, cover 30 mm given, h ≥ 175 mm): both designs use
    # the same bars, and the house allows 0.9 × EN's span/depth ratio.
    req = {
        "code": "EN1992-1-1", "variant": "UK",
        "slab": {"spans_m": [4.5], "ends": ["pinned", "pinned"], "thickness_mm": 200},
        "concrete": {"class": "C30/37"},
        "reinforcement": {"bars": ["12"]},
        "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0},
        "durability": {"cover_mm": 30},
    }
    code = f"""
import json, armature
req = json.loads({json.dumps(json.dumps(req))})
house = dict(req, code="HOUSE-RULES"); del house["variant"]
print(json.dumps([armature.design(house), armature.design(req)]))
"""
    env = clean_env(ARMATURE_CODE_PATH=str(example_build), PYTHONPATH=str(BUILD / "python"))
    run = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, env=env, check=True)
    house, en = json.loads(run.stdout)
    span_h = next(g for g in house["regions"] if g["where"] == "span 1")
    span_e = next(g for g in en["regions"] if g["where"] == "span 1")
    assert span_h["bars"] == span_e["bars"] and span_e["bars"]["spacing_mm"] <= 200
    h = next(c for c in house["checks"] if c["id"] == "deflection")
    e = next(c for c in en["checks"] if c["id"] == "deflection")
    assert h["clause"] == e["clause"] + "; house rule HR-1"
    assert h["demand"] == pytest.approx(e["demand"])
    assert h["capacity"] == pytest.approx(0.9 * e["capacity"])


NDP_UK = json.loads((ROOT / "codes" / "en1992" / "variants" / "UK.json").read_text())


def write_variant(directory, name, **changes):
    data = dict(NDP_UK, **changes)
    for key in [k for k, v in changes.items() if v is None]:
        del data[key]
    (directory / f"{name}.en1992.json").write_text(json.dumps(data))


def run_python(code, code_path):
    env = clean_env(ARMATURE_CODE_PATH=str(code_path), PYTHONPATH=str(BUILD / "python"))
    run = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, env=env)
    assert run.returncode == 0, run.stderr
    return json.loads(run.stdout)


def test_data_only_variant_changes_the_design_as_hand_calculation_predicts(tmp_path):
    write_variant(tmp_path, "acc", variant="UK-acc1", title="UK NA with alpha_cc = 1.0", alpha_cc=1.0)
    # A workshop store floor (our own case): 4.6 m, h 175, C25/30, ø12, cover 25, 7.5 kPa imposed.
    req = {
        "code": "EN1992-1-1", "variant": "UK",
        "slab": {"spans_m": [4.6], "ends": ["pinned", "pinned"], "thickness_mm": 175},
        "concrete": {"class": "C25/30"},
        "reinforcement": {"bars": ["12"]},
        "loads": {"dead_kPa": 2.0, "imposed_kPa": 7.5},
        "durability": {"cover_mm": 25},
    }
    uk, acc = run_python(f"""
import json, armature
req = json.loads({json.dumps(json.dumps(req))})
print(json.dumps([armature.design(req), armature.design(dict(req, variant="UK-acc1"))]))
""", tmp_path)
    g_uk = next(g for g in uk["regions"] if g["where"] == "span 1")
    g_acc = next(g for g in acc["regions"] if g["where"] == "span 1")
    # Hand calculation (EN 1990 6.10; EN 1992-1-1 6.1 with the UK NA's γc 1.5, γs 1.15):
    #   Gk = 25 × 0.175 + 2.0 = 6.375 kPa; n = 1.35 × 6.375 + 1.5 × 7.5 = 19.856 kPa
    #   M = 19.856 × 4.6² / 8 = 52.520 kNm; d = 175 − 25 − 12/2 = 144 mm
    #   K = 52.520e6 / (1000 × 144² × 25) = 0.10131, the same in both variants
    #   z = d [0.5 + √(0.25 − K/(2 αcc/γc))]:
    #     αcc 0.85 (UK): 144 [0.5 + √(0.25 − 0.10131/1.1333)] = 129.71 mm (below 0.95 d = 136.8)
    #     αcc 1.0:       144 [0.5 + √(0.25 − 0.10131/1.3333)] = 132.07 mm
    #   As,req = M / (434.78 z) = 931.3 mm² (UK) and 914.6 mm² (αcc 1.0)
    for g in (g_uk, g_acc):
        assert g["design_moment_kNm"] == pytest.approx(52.520, rel=1e-4)
        assert g["effective_depth_mm"] == 144
    assert g_uk["As_req_mm2"] == pytest.approx(931.3, rel=1e-4)
    assert g_acc["As_req_mm2"] == pytest.approx(914.6, rel=1e-4)
    # K' = η (αcc/γc) λ ξ (1 − λξ/2), ξ = 0.45: 0.1673 → 0.1968.
    duct_uk = next(c for c in uk["checks"] if c["id"] == "ductility" and c["where"] == "span 1")
    duct = next(c for c in acc["checks"] if c["id"] == "ductility" and c["where"] == "span 1")
    assert duct_uk["capacity"] == pytest.approx(0.1673, abs=5e-5)
    assert duct["capacity"] == pytest.approx(0.1968, abs=5e-5)
    assert duct["demand"] == pytest.approx(0.10131, rel=1e-4)


def test_bad_data_variants_name_the_file_and_key(tmp_path):
    write_variant(tmp_path, "typo", variant="T1", alfa_cc=1.0)
    write_variant(tmp_path, "missing", variant="T2", gamma_c=None)
    write_variant(tmp_path, "range", variant="T3", alpha_cc=1.3)
    write_variant(tmp_path, "clash", variant="UK")
    # A copied UK file that drops the l/d cap is refused, not read as "no cap".
    write_variant(tmp_path, "nocap", variant="T4", span_depth_cap_K=None)
    write_variant(tmp_path, "psi", variant="T5",
                  psi_factors=dict(NDP_UK["psi_factors"], H={"psi0": 1.2, "psi1": 0.0, "psi2": 0.0}))
    failures, variants = run_python("""
import json, armature
en = next(c for c in armature.codes() if c["id"] == "EN1992-1-1")
print(json.dumps([armature.plugin_failures(), en["variants"]]))
""", tmp_path)
    reasons = {pathlib.Path(f["path"]).name: f["reason"] for f in failures}
    assert reasons["typo.en1992.json"] == "alfa_cc: unknown parameter"
    assert reasons["missing.en1992.json"] == "gamma_c: missing"
    assert reasons["range.en1992.json"].startswith("alpha_cc: must be between 0.8 and 1, got 1.3")
    assert "already defined" in reasons["clash.en1992.json"]
    assert reasons["nocap.en1992.json"] == "span_depth_cap_K: missing (null for none)"
    assert reasons["psi.en1992.json"] == "psi_factors.H.psi0: must be between 0 and 1, got 1.2"
    assert set(variants) == {"UK", "recommended"}  # the shipped variants still load
