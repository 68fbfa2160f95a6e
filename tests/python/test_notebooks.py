"""Each notebook executed top to bottom (nbclient), with an assertion on the
result it prints."""
import json
import os
import sys

import pytest

from conftest import BUILD, ROOT

nbformat = pytest.importorskip("nbformat")
nbclient = pytest.importorskip("nbclient")


@pytest.fixture(scope="module")
def kernel_name(tmp_path_factory):
    """A kernel spec that runs this interpreter with the built package."""
    home = tmp_path_factory.mktemp("jupyter")
    spec = home / "kernels" / "armature-test"
    spec.mkdir(parents=True)
    (spec / "kernel.json").write_text(json.dumps({
        "argv": [sys.executable, "-m", "ipykernel_launcher", "-f", "{connection_file}"],
        "display_name": "armature test", "language": "python",
        "env": {"PYTHONPATH": str(BUILD / "python"), "MPLBACKEND": "Agg"},
    }))
    os.environ["JUPYTER_PATH"] = str(home)
    return "armature-test"


def run_notebook(name, kernel_name, tmp_path):
    nb = nbformat.read(ROOT / "notebooks" / name, as_version=4)
    client = nbclient.NotebookClient(nb, kernel_name=kernel_name, timeout=600,
                                     resources={"metadata": {"path": str(tmp_path)}})
    client.execute()
    for cell in reversed(nb.cells):
        for out in cell.get("outputs", []):
            text = out.get("text", "")
            for line in text.splitlines():
                if line.startswith("RESULT: "):
                    return json.loads(line[len("RESULT: "):])
    raise AssertionError(f"{name} printed no RESULT line")


def test_economic_thickness(kernel_name, tmp_path):
    result = run_notebook("economic-thickness.ipynb", kernel_name, tmp_path)
    thickness = [result[k] for k in sorted(result, key=float)]
    assert len(thickness) == 6
    # Longer spans never need thinner slabs (span/depth rule, EN 1992-1-1 7.4.2).
    assert thickness == sorted(thickness)
    assert thickness[0] < thickness[-1]


def test_one_floor_three_codes(kernel_name, tmp_path):
    result = run_notebook("one-floor-three-codes.ipynb", kernel_name, tmp_path)
    assert result["codes"] == ["ACI318-19", "EN1992-1-1:UK", "EN1992-1-1:recommended"]
    # EN: 3 spans + 4 supports (partial fixity at pinned ends); ACI: 3 spans + 2 supports.
    assert result["rows"] == 7 + 7 + 5


def test_dask_sweep(kernel_name, tmp_path):
    result = run_notebook("dask-sweep.ipynb", kernel_name, tmp_path)
    assert result["rows"] == 8 * 7 * 4 * 4 * 2
    assert 0 < result["pass"] < result["rows"]
    assert result["same_as_local"]


def test_optimise_floor(kernel_name, tmp_path):
    result = run_notebook("optimise-floor.ipynb", kernel_name, tmp_path)
    assert result["rows"] == 16 * 3 * 2
    assert result["same_as_exhaustive"]
    for objective in ("cost", "carbon"):
        found = result[objective]
        assert found["status"] == "pass"
        assert found["pruned"] > 0
        front = found["front"]
        # Along a Pareto front a thicker slab is only there for a lower objective.
        assert [h for h, _ in front] == sorted(h for h, _ in front)
        assert all(b[1] < a[1] for a, b in zip(front, front[1:]) if b[0] > a[0])
        # The choice is the front's least objective.
        assert found["objective"] == min(o for _, o in front)
