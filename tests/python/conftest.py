import copy
import os
import pathlib
import sys

import pytest

ROOT = pathlib.Path(__file__).resolve().parents[2]
BUILD = pathlib.Path(os.environ.get("ARMATURE_BUILD_DIR", ROOT / "build"))
sys.path.insert(0, str(BUILD / "python"))

CLI = BUILD / "bin" / "armature"

# The caution in the wording agreed for every place a result can travel
# (issue 12, item 13); the kernel's caution_text must say exactly this.
CAUTION = ("A design aid: its results must be checked and adopted by an engineer qualified, "
           "and where required licensed or registered, for the place of the works, under the "
           "codes that govern it, local rules first.")
TEST_PLUGINS = BUILD / "test-plugins"

BASE_REQUEST = {
    "code": "EN1992-1-1",
    "variant": "UK",
    "slab": {"spans_m": [4.0], "ends": ["pinned", "pinned"], "thickness_mm": 200},
    "concrete": {"class": "C30/37"},
    "reinforcement": {"yield_strength_MPa": 500, "bars": ["10", "12"]},
    "loads": {"dead_kPa": 1.0, "imposed_kPa": 2.5, "imposed_category": "A"},
    "durability": {"cover_mm": 25, "exposure": "XC1"},
}


@pytest.fixture
def base_request():
    return copy.deepcopy(BASE_REQUEST)
