"""Studies from Python: sweep axes checked before anything is designed, a
sweep row turned back into its request, one floor compared across codes
with per-code overrides, and the caution on every DataFrame and plot.

These are checks of the package's plumbing, not of engineering: each
expected value comes from a design of the same request made on its own
(armature.design) or from the input the test gives."""
import pytest

import armature
from armature import _core
from conftest import CAUTION

# The workshop's store room: two spans over a corridor wall (our own scenario).
STORE = {
    "code": "EN1992-1-1", "variant": "UK",
    "slab": {"spans_m": [3.6, 4.3], "ends": ["pinned", "pinned"], "thickness_mm": 190},
    "concrete": {"class": "C30/37"},
    "loads": {"dead_kPa": 1.3, "imposed_kPa": 3.5, "imposed_category": "B"},
}

# The workshop's first floor, with nothing that only one code knows.
FLOOR = {
    "slab": {"spans_m": [4.2, 4.8, 4.2], "ends": ["pinned", "pinned"], "thickness_mm": 200},
    "concrete": {"cylinder_strength_MPa": 30},
    "reinforcement": {"yield_strength_MPa": 500},
    "loads": {"dead_kPa": 1.5, "imposed_kPa": 3.0},
}


@pytest.fixture
def no_design(monkeypatch):
    """Records every call of the kernel's sweep, so a test can show that a
    bad axis stopped the study before any design."""
    calls = []
    real = _core.sweep_columns

    def spy(*args, **kwargs):
        calls.append(args)
        return real(*args, **kwargs)

    monkeypatch.setattr(_core, "sweep_columns", spy)
    return calls


# ---- B12: sweep axes -------------------------------------------------------

def test_misspelt_axis_raises_once_up_front_naming_it(no_design):
    with pytest.raises(armature.InputError) as e:
        armature.sweep(STORE, {"slab.thicknes_mm": [160, 190, 220], "loads.imposed_kPa": [2.5, 3.5]})
    lines = str(e.value).splitlines()
    assert lines == ["slab.thicknes_mm: the sweep axis is not a request field "
                     "(did you mean slab.thickness_mm?)"]
    assert isinstance(e.value, ValueError)
    assert no_design == []  # nothing was designed


def test_every_bad_axis_is_named_once():
    with pytest.raises(armature.InputError) as e:
        armature.sweep(STORE, {"slabs.thickness_mm": [160, 190], "loads.dead_kpa": [1.0, 1.3],
                               "slab.spans_m[2]": [4.0], "concrete.class": ["C25/30"]})
    lines = str(e.value).splitlines()
    # The list entry is checked while the axes are applied, before the fields.
    assert lines == ["slab.spans_m[2]: the request has no list entry 2 here (sweep axis)"]
    with pytest.raises(armature.InputError) as e:
        armature.sweep(STORE, {"slabs.thickness_mm": [160, 190], "loads.dead_kpa": [1.0, 1.3],
                               "concrete.class": ["C25/30"]})
    assert sorted(str(e.value).splitlines()) == [
        "loads.dead_kpa: the sweep axis is not a request field (did you mean loads.dead_kPa?)",
        "slabs.thickness_mm: the sweep axis is not a request field (slabs is unknown)",
    ]
    # A field given both under its plain name and its unit name.
    with pytest.raises(armature.InputError, match=r"^slab\.thickness: give either thickness or "
                                                  r"thickness_mm, not both \(sweep axis\)$"):
        armature.sweep(STORE, {"slab.thickness": ["8 in"]})


def test_valid_sweep_still_designs_every_row_including_fields_absent_from_the_base(no_design):
    axes = {"slab.thickness_mm": [160, 220], "durability.exposure": ["XC1", "XC3"],
            "design.redistribution_percent": [0, 10]}
    frame = armature.sweep(STORE, axes)
    assert len(no_design) == 1 and len(frame) == 8
    assert set(frame["status"]) <= {"pass", "fail"}, frame["error"].tolist()
    # Row 5 is 220 mm, XC1, 10 % (the first axis varies slowest).
    req = dict(STORE, slab=dict(STORE["slab"], thickness_mm=220), durability={"exposure": "XC1"},
               design={"redistribution_percent": 10})
    res = armature.design(req)
    assert frame["status"][5] == res["status"]
    assert frame["max_utilisation"][5] == pytest.approx(res["max_utilisation"])
    assert frame["support 2 As_prov_mm2"][5] == pytest.approx(
        next(g["bars"]["As_prov_mm2"] for g in res["regions"] if g["where"] == "support 2"))


def test_bad_values_still_mark_only_their_rows_invalid():
    frame = armature.sweep(STORE, {"slab.thickness_mm": [190, 30]})
    assert frame["status"].tolist()[1] == "invalid"
    assert frame["status"].tolist()[0] in ("pass", "fail")
    assert frame["error"][1].startswith("slab.thickness_mm: must be between 50 and 1500 mm")


# ---- B12: request_for ------------------------------------------------------

def _same_as_row(frame, label, res):
    row = frame.loc[label]
    assert res["status"] == row["status"]
    assert res["max_utilisation"] == pytest.approx(row["max_utilisation"], rel=1e-12)
    assert res["governing"]["check"] == row["governing_check"]
    for g in res["regions"]:
        assert g["bars"]["bar"] == row[f'{g["where"]} bar']
        assert g["bars"]["spacing_mm"] == pytest.approx(row[f'{g["where"]} spacing_mm'])


def test_request_for_rebuilds_the_request_of_a_row(tmp_path):
    axes = {"slab.thickness_mm": [170, 210], "slab.spans_m[1]": [3.9, 4.6],
            "code": ["EN1992-1-1:recommended", "EN1992-1-1", "ACI318-19"]}
    base = dict(STORE, concrete={"cylinder_strength_MPa": 30})
    frame = armature.sweep(base, axes)
    assert set(frame["status"]) <= {"pass", "fail"}, frame["error"].tolist()

    # By label: the lightest slab of the study.
    label = frame["steel_kg_m2"].idxmin()
    req = armature.request_for(frame, label)
    h, span, code = (frame.loc[label, p] for p in axes)
    assert req["slab"]["thickness_mm"] == h and type(req["slab"]["thickness_mm"]) is int
    assert req["slab"]["spans_m"] == [3.6, span]
    _same_as_row(frame, label, armature.design(req))

    # "EN1992-1-1" alone keeps the base's variant; "ID:variant" sets it; ACI drops the EN variant.
    assert armature.request_for(frame, 1)["variant"] == "UK"
    assert armature.request_for(frame, 0)["variant"] == "recommended"
    assert "variant" not in armature.request_for(frame, 2)

    # By row, from a filtered frame: every row rebuilds to its own design.
    for label, row in frame[frame["code"] == "ACI318-19"].iterrows():
        req = armature.request_for(frame, row)
        assert req["code"] == "ACI318-19"
        _same_as_row(frame, label, armature.design(req))
    assert base == dict(STORE, concrete={"cylinder_strength_MPa": 30})  # base untouched

    # The full record of a row.
    res = armature.design(armature.request_for(frame, frame.iloc[3]))
    armature.report(res, tmp_path / "row3.md")
    record = (tmp_path / "row3.md").read_text(encoding="utf-8")
    assert f'{frame.iloc[3]["slab.thickness_mm"]} mm' in record and CAUTION in record


def test_request_for_refuses_what_it_cannot_rebuild():
    frame = armature.sweep(STORE, {"slab.thickness_mm": [180, 200]})
    with pytest.raises(KeyError, match="no row 7"):
        armature.request_for(frame, 7)
    with pytest.raises(ValueError, match="no column 'slab.thickness_mm'"):
        armature.request_for(frame, frame.loc[0].drop("slab.thickness_mm"))
    other = armature.to_frame(armature.design(STORE))
    with pytest.raises(ValueError, match="needs a DataFrame returned by armature.sweep"):
        armature.request_for(other, 0)


# ---- B12: compare with per-code overrides ----------------------------------

def test_compare_designs_one_floor_with_code_specific_bars_and_exposure():
    codes = ["EN1992-1-1:UK", "EN1992-1-1:recommended", "ACI318-19"]
    overrides = {
        "ACI318-19": {"reinforcement.bars": ["#5"], "durability.exposure": "interior"},
        "EN1992-1-1": {"reinforcement.bars": ["12"], "durability.exposure": "XC1"},
        "EN1992-1-1:UK": {"reinforcement.bars": ["16"]},  # after the id's: wins for UK
    }
    table = armature.compare(FLOOR, codes=codes, overrides=overrides)
    bars = {c: set(table["bar"][table["code"] == c]) for c in codes}
    assert bars == {"EN1992-1-1:UK": {"16"}, "EN1992-1-1:recommended": {"12"}, "ACI318-19": {"#5"}}
    # Each code's rows are those of the floor designed on its own with its fields.
    by_hand = {
        "EN1992-1-1:UK": dict(FLOOR, code="EN1992-1-1", variant="UK", durability={"exposure": "XC1"},
                              reinforcement=dict(FLOOR["reinforcement"], bars=["16"])),
        "EN1992-1-1:recommended": dict(FLOOR, code="EN1992-1-1", variant="recommended",
                                       durability={"exposure": "XC1"},
                                       reinforcement=dict(FLOOR["reinforcement"], bars=["12"])),
        "ACI318-19": dict(FLOOR, code="ACI318-19", durability={"exposure": "interior"},
                          reinforcement=dict(FLOOR["reinforcement"], bars=["#5"])),
    }
    for spec, req in by_hand.items():
        res = armature.design(req)
        rows = table[table["code"] == spec]
        assert rows["spacing_mm"].tolist() == [g["bars"]["spacing_mm"] for g in res["regions"]]
        assert rows["status"].iloc[0] == res["status"]
        assert table.attrs["requests"][spec] == req
    assert "durability" not in FLOOR and "bars" not in FLOOR["reinforcement"]  # floor untouched
    # Without the overrides each code takes its own bar set: the override changed something.
    plain = armature.compare(FLOOR, codes=codes)
    assert set(plain["bar"][plain["code"] == "ACI318-19"]) != {"#5"}


def test_compare_names_bad_overrides():
    codes = ["EN1992-1-1:UK", "ACI318-19"]
    with pytest.raises(armature.InputError, match=r"^overrides\.ACI318-14: not one of the codes compared"):
        armature.compare(FLOOR, codes, overrides={"ACI318-14": {"reinforcement.bars": ["#4"]}})
    with pytest.raises(armature.InputError,
                       match=r"^reinforcement\.barz: the override for ACI318-19 is not a request field"):
        armature.compare(FLOOR, codes, overrides={"ACI318-19": {"reinforcement.barz": ["#4"]}})
    with pytest.raises(armature.InputError, match=r"^overrides\.EN1992-1-1:UK\.variant: the code and "
                                                  r"variant come from `codes`"):
        armature.compare(FLOOR, codes, overrides={"EN1992-1-1:UK": {"variant": "recommended"}})
    # A value one code refuses is named with that code.
    with pytest.raises(armature.InputError, match=r"^ACI318-19: reinforcement\.bars"):
        armature.compare(FLOOR, codes, overrides={"ACI318-19": {"reinforcement.bars": ["12"]}})


# ---- B13: the caution travels with every table and plot --------------------

def test_every_dataframe_carries_the_caution():
    assert armature.CAUTION == CAUTION
    study = armature.sweep(STORE, {"slab.thickness_mm": [180, 200]})
    table = armature.compare(FLOOR, codes=["EN1992-1-1:UK", "ACI318-19"])
    checks = armature.to_frame(armature.design(STORE))
    for frame in (study, table, checks):
        assert frame.attrs["caution"] == CAUTION
    # and keeps it through the usual selections
    assert study[study["status"] == "pass"].attrs["caution"] == CAUTION


def _footnotes(fig):
    notes = [t for t in fig.texts if t.get_gid() == "armature-caution"]
    for t in notes:
        assert " ".join(t.get_text().split()) == "Caution: " + CAUTION
    return notes


def _check_footnote(fig):
    notes = _footnotes(fig)
    assert len(notes) == 1
    fig.canvas.draw()  # places the axis labels
    renderer = fig.canvas.get_renderer()
    box = notes[0].get_window_extent(renderer)
    assert "\n" not in notes[0].get_text()
    assert box.x0 >= 0 and box.x1 <= fig.get_figwidth() * fig.dpi  # one line, inside the page
    for ax in fig.axes:  # under everything else
        assert box.y1 <= ax.xaxis.label.get_window_extent(renderer).y0 or not ax.get_xlabel()
    return notes[0]


def test_plots_carry_the_caution_as_a_one_line_footnote():
    matplotlib = pytest.importorskip("matplotlib")
    matplotlib.use("Agg")
    import matplotlib.pyplot as plt

    res = armature.design(STORE)
    ax_m, _ = armature.plot_envelopes(res)
    _check_footnote(ax_m.figure)
    study = armature.sweep(STORE, {"slab.thickness_mm": [150, 190, 230], "slab.spans_m[0]": [3.2, 3.6]})
    ax = armature.plot_study(study, x="slab.thickness_mm", by="slab.spans_m[0]")
    _check_footnote(ax.figure)
    # Drawing again on the same axes does not repeat it.
    armature.plot_study(study, x="slab.thickness_mm", y="max_utilisation", ax=ax)
    assert len(_footnotes(ax.figure)) == 1
    # On axes the user made, in a smaller figure, it still fits on one line;
    # in a very narrow one it takes more lines rather than being cut.
    fig, axes = plt.subplots(2, 1, figsize=(5.5, 4))
    armature.plot_envelopes(res, axes=axes)
    note = _footnotes(fig)[0]
    assert "\n" not in note.get_text()
    assert note.get_window_extent(fig.canvas.get_renderer()).width <= 5.5 * fig.dpi
    fig, axes = plt.subplots(2, 1, figsize=(3, 4))
    armature.plot_envelopes(res, axes=axes)
    note = _footnotes(fig)[0]
    assert note.get_text().count("\n") >= 1
    assert note.get_window_extent(fig.canvas.get_renderer()).width <= 3 * fig.dpi
    # Any other figure: add_caution puts the same footnote on it.
    fig2 = plt.figure()
    assert armature.add_caution(fig2) is armature.add_caution(fig2)
    assert len(_footnotes(fig2)) == 1
    plt.close("all")
