"""pip install of the package into a virtual environment that sees Debian's
packages, from a copy of the source tree; the installed package finds its
own plug-ins with no environment variable set."""
import json
import os
import shutil
import subprocess
import sys

import pytest

from conftest import ROOT


def test_pip_install_into_a_venv(tmp_path):
    src = tmp_path / "src"
    shutil.copytree(ROOT, src, ignore=shutil.ignore_patterns("build", "build-*", ".git", "out",
                                                             "__pycache__", "*.egg-info"))
    venv = tmp_path / "venv"
    subprocess.run([sys.executable, "-m", "venv", "--system-site-packages", str(venv)], check=True)
    py = venv / "bin" / "python"
    env = {k: v for k, v in os.environ.items() if k not in ("PYTHONPATH", "ARMATURE_CODE_PATH")}
    run = subprocess.run([str(py), "-m", "pip", "install", "--no-build-isolation", "--no-index", "-q",
                          str(src)], capture_output=True, text=True, env=env, timeout=1500)
    assert run.returncode == 0, run.stdout[-3000:] + run.stderr[-3000:]
    check = subprocess.run([str(py), "-c", """
import json, armature
codes = {c["id"]: c for c in armature.codes()}
res = armature.design({"code": "EN1992-1-1", "slab": {"spans_m": [4.0], "ends": ["pinned", "pinned"],
                       "thickness_mm": 200}, "concrete": {"class": "C30/37"}, "loads": {"imposed_kPa": 2.5}})
print(json.dumps({"file": armature.__file__, "codes": sorted(codes),
                  "paths": [c["path"] for c in codes.values()], "status": res["status"]}))
"""], capture_output=True, text=True, env=env, cwd=tmp_path)
    assert check.returncode == 0, check.stderr
    out = json.loads(check.stdout)
    assert out["file"].startswith(str(venv))
    assert out["codes"] == ["ACI318-19", "EN1992-1-1"]
    assert all(p.startswith(str(venv)) for p in out["paths"])
    assert out["status"] == "pass"
