"""The armature command line: output forms, exit codes and plug-in listing."""
import json
import os
import re
import subprocess

import pytest

import armature
from conftest import CAUTION, CLI, ROOT, TEST_PLUGINS


def run(args, stdin=None, env=None):
    return subprocess.run([str(CLI), *args], input=stdin, capture_output=True, text=True,
                          timeout=60, env=env)


def test_version():
    r = run(["--version"])
    assert r.returncode == 0
    assert r.stdout.strip() == f"armature {armature.__version__}"


@pytest.mark.parametrize("args", [["--help"], ["-h"], ["design", "--help"], ["codes", "-h"],
                                  ["optimise", "--help"]])
def test_help_prints_usage_and_the_caution_on_stdout(args):
    r = run(args)
    assert r.returncode == 0 and r.stderr == ""
    assert r.stdout.startswith(f"armature {armature.__version__}: ")
    usage = r.stdout.splitlines()[1:8]
    assert usage == ["usage: armature design FILE|- [--json] [--report RECORD.html|RECORD.md]",
                     "       armature optimise FILE|- --vary PATH=VALUES [--vary ...] [--objective OBJECTIVE]",
                     "                [--rates RATES.json] [--json] [--report RECORD.html|RECORD.md]",
                     "       armature codes", "       armature --version", "       armature --help", ""]
    assert r.stdout.rstrip().endswith("Caution: " + CAUTION)


def test_usage_error_still_goes_to_stderr_with_exit_2():
    r = run(["desing"])
    assert r.returncode == 2 and r.stdout == ""
    assert r.stderr.startswith("armature: unknown command desing\nusage: armature design")


def test_json_output_equals_python_result(base_request):
    r = run(["design", "--json", "-"], stdin=json.dumps(base_request))
    assert r.returncode == 0, r.stderr
    assert json.loads(r.stdout) == armature.design(base_request)


def test_summary_names_checks_clauses_and_caution(base_request):
    r = run(["design", "-"], stdin=json.dumps(base_request))
    assert r.returncode == 0
    assert "EN 1992-1-1 6.2.2(1)" in r.stdout
    assert "ø10 @ 225" in r.stdout
    assert CAUTION in r.stdout
    assert "PASS" in r.stdout


def test_failing_design_exits_1(base_request):
    # EN 1992-1-2 Table 5.8 (value from memory): REI 240 needs a ≥ 65 mm;
    # 25 mm cover + φ/2 falls short, so the design fails.
    base_request["fire"] = {"resistance_min": 240}
    r = run(["design", "--json", "-"], stdin=json.dumps(base_request))
    assert r.returncode == 1
    assert json.loads(r.stdout)["status"] == "fail"


def test_demo_request_designs():
    r = run(["design", "--json", str(ROOT / "examples" / "workshop-first-floor.json")])
    # The demo floor passes every check: exit 0 (README's exit codes).
    assert r.returncode == 0, r.stderr
    res = json.loads(r.stdout)
    assert res["status"] == "pass"
    # Loads by hand (EN 1991-1-1 Table A.1 25 kN/m³; EN 1990 6.10 with γG 1.35, γQ 1.5;
    # ψ2 = 0.6 for category C, Table A1.1; values from memory):
    #   Gk = 25 × 0.2 + 1.5 = 6.5 kPa, Qk = 4.0 kPa; n = 8.775 + 6.0 = 14.775 kPa;
    #   quasi-permanent 6.5 + 0.6 × 4.0 = 8.9 kPa.
    assert res["loads"]["self_weight_kPa"] == pytest.approx(5.0)
    assert res["loads"]["uls_kPa"] == pytest.approx(14.775)
    assert res["loads"]["sls_quasi_permanent_kPa"] == pytest.approx(8.9)
    # The 1.5 m balcony is statically determinate: root moment n L²/2 = 16.62 kNm.
    root = next(g for g in res["regions"] if g["where"] == "support 4")
    assert root["design_moment_kNm"] == pytest.approx(14.775 * 1.5 ** 2 / 2)
    # Three spans and a cantilever balcony: bottom steel in spans 1-3, top
    # steel at every support; the balcony root is support 4.
    wheres = [(g["where"], g["face"]) for g in res["regions"]]
    assert ("span 4", "bottom") not in wheres
    assert ("support 4", "top") in wheres and ("span 3", "bottom") in wheres
    assert [s["where"] for s in res["supports"]] == ["support 1", "support 2", "support 3", "support 4"]


def test_usage_errors_exit_2():
    assert run([]).returncode == 2
    assert run(["design"]).returncode == 2
    assert run(["design", "a.json", "--frobnicate"]).returncode == 2
    r = run(["design", "/nonexistent/request.json"])
    assert r.returncode == 2 and r.stdout == "" and "cannot read" in r.stderr


def test_broken_plugins_on_the_path_are_reported_and_design_goes_on(base_request):
    env = dict(os.environ, ARMATURE_CODE_PATH=f"{TEST_PLUGINS}:/nonexistent/armature-codes")
    listing = run(["codes"], env=env)
    assert listing.returncode == 0
    assert "EN1992-1-1" in listing.stdout and "TEST-THROWING" in listing.stdout
    assert re.search(r"armature_code_wrongabi.so: plug-in ABI version (\d+), this kernel expects (\d+)",
                     listing.stdout)
    assert "armature_code_noentry.so: no entry point" in listing.stdout
    assert "/nonexistent/armature-codes: plug-in directory does not exist" in listing.stdout
    designed = run(["design", "--json", "-"], stdin=json.dumps(base_request), env=env)
    assert designed.returncode == 0
    throwing = dict(base_request, code="TEST-THROWING")
    del throwing["variant"]
    failed = run(["design", "-"], stdin=json.dumps(throwing), env=env)
    assert failed.returncode == 3 and failed.stdout == ""
    assert "TEST-THROWING" in failed.stderr and "'bending'" in failed.stderr
