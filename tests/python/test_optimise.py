"""armature.optimise and `armature optimise`: the choice against an
exhaustive sweep with the objective computed here, independently of the
kernel, from the sweep's quantities; every row's objective by hand; bad
axes, rates and objective named by field; the least-failing candidate
when none passes.

The floor is our own scenario (the workshop's hall floor, two spans over a
wall). The rates and carbon factors are invented for the tests; they are
no one's prices or data. The objective's definition is the project's
(DEVELOPERS.md "Optimise"): cost per m² = concrete rate × thickness (m) +
steel rate per tonne × steel (kg/m²) / 1000 + formwork rate (one m² of
soffit per m² of slab); carbon per m² = the class's factor × thickness (m)
+ steel factor × steel (kg/m²)."""
import json
import subprocess
import warnings

import pytest

import armature
from conftest import CAUTION, CLI

HALL = {
    "code": "EN1992-1-1", "variant": "UK",
    "slab": {"spans_m": [5.4, 6.0], "ends": ["pinned", "pinned"], "thickness_mm": 200},
    "concrete": {"class": "C30/37"},
    "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0, "imposed_category": "C"},
}

# Invented, for the tests only.
RATES = {"concrete_per_m3": 120.0, "steel_per_tonne": 1100.0, "formwork_per_m2": 25.0,
         "carbon": {"concrete_per_m3": {"C25/30": 230.0, "C30/37": 260.0, "C40/50": 320.0},
                    "steel_per_kg": 1.5}}

VARY = {"slab.thickness_mm": [150, 160, 170, 180, 190, 200, 220, 240, 260, 280, 300],
        "concrete.class": ["C25/30", "C30/37", "C40/50"],
        "reinforcement.bars": [["10", "12"], ["12", "16"]]}


def cost(thickness_mm, steel_kg_m2, concrete_rate=RATES["concrete_per_m3"]):
    return (concrete_rate * thickness_mm / 1000 + RATES["steel_per_tonne"] * steel_kg_m2 / 1000
            + RATES["formwork_per_m2"])


def carbon(thickness_mm, steel_kg_m2, concrete_class):
    c = RATES["carbon"]
    return c["concrete_per_m3"][concrete_class] * thickness_mm / 1000 + c["steel_per_kg"] * steel_kg_m2


def objective_of(name, row):
    h, steel = row["slab.thickness_mm"], row["steel_kg_m2"]
    return {"cost": lambda: cost(h, steel), "carbon": lambda: carbon(h, steel, row["concrete.class"]),
            "depth": lambda: float(h), "steel_mass": lambda: steel}[name]()


def exhaustive_best(frame, name):
    """The passing row of least objective (then the thinner, then the
    first), by the objective computed here."""
    passing = [(objective_of(name, row), row["slab.thickness_mm"], i)
               for i, row in frame.iterrows() if row["status"] == "pass"]
    passing.sort()
    return passing


@pytest.fixture(scope="module")
def study():
    return armature.sweep(HALL, VARY)


@pytest.mark.parametrize("objective", ["cost", "carbon", "depth", "steel_mass"])
def test_choice_equals_the_best_of_an_exhaustive_sweep(study, objective):
    assert (study["status"] == "pass").any() and (study["status"] == "fail").any()
    ranked = exhaustive_best(study, objective)
    best_value, _, best_label = ranked[0]
    result, table = armature.optimise(HALL, VARY, objective=objective, rates=RATES)
    chosen = table.index[table["chosen"]].tolist()
    assert chosen == [best_label]
    assert table.loc[best_label, "objective"] == pytest.approx(best_value, rel=1e-12)
    # The full result is that candidate's design.
    assert result["status"] == "pass"
    assert result.request["slab"]["thickness_mm"] == study.loc[best_label, "slab.thickness_mm"]
    assert result.request == armature.request_for(study, best_label)
    assert result == armature.design(armature.request_for(study, best_label))
    # Pruning did not change any designed row.
    designed = table["status"] != "pruned"
    assert (table.loc[designed, "status"] == study.loc[designed, "status"]).all()
    assert table.loc[designed, "steel_kg_m2"].tolist() == pytest.approx(study.loc[designed, "steel_kg_m2"].tolist())
    if objective != "steel_mass":  # no bound for steel mass: everything is designed
        assert (~designed).any()
    else:
        assert designed.all()
    # Every pruned row would have cost more than the choice.
    for label in table.index[~designed]:
        if study.loc[label, "status"] == "pass":
            assert objective_of(objective, study.loc[label]) > best_value


def test_the_objective_of_each_row_is_the_hand_formula(study):
    _, table = armature.optimise(HALL, VARY, objective="cost", rates=RATES, prune=False)
    assert (table["status"] != "pruned").all()
    for label, row in table.iterrows():
        assert row["objective"] == pytest.approx(cost(row["slab.thickness_mm"], row["steel_kg_m2"]), rel=1e-12)
        assert row["thickness_mm"] == row["slab.thickness_mm"]
    _, table = armature.optimise(HALL, VARY, objective="carbon", rates=RATES, prune=False)
    for label, row in table.iterrows():
        assert row["objective"] == pytest.approx(
            carbon(row["slab.thickness_mm"], row["steel_kg_m2"], row["concrete.class"]), rel=1e-12)
    # Concrete priced per class (invented prices).
    by_class = dict(RATES, concrete_per_m3={"C25/30": 112.0, "C30/37": 118.0, "C40/50": 131.0})
    _, table = armature.optimise(HALL, {"slab.thickness_mm": [200, 240], "concrete.class": ["C25/30", "C40/50"]},
                                 rates=by_class, prune=False)
    for label, row in table.iterrows():
        rate = by_class["concrete_per_m3"][row["concrete.class"]]
        assert row["objective"] == pytest.approx(cost(row["slab.thickness_mm"], row["steel_kg_m2"], rate))


def test_the_pareto_front_is_the_passing_rows_no_thinner_row_beats(study):
    result, table = armature.optimise(HALL, VARY, objective="cost", rates=RATES, prune=False)
    passing = table[table["status"] == "pass"]
    expected = set()
    for label, row in passing.iterrows():
        dominated = ((passing["thickness_mm"] <= row["thickness_mm"]) & (passing["objective"] <= row["objective"])
                     & ((passing["thickness_mm"] < row["thickness_mm"]) | (passing["objective"] < row["objective"])))
        if not dominated.any():
            expected.add(label)
    assert set(table.index[table["pareto"]]) == expected and expected
    assert table["chosen"].sum() == 1 and table.loc[table["chosen"], "pareto"].all()
    # Pruning leaves the front as it is.
    _, pruned = armature.optimise(HALL, VARY, objective="cost", rates=RATES)
    assert set(pruned.index[pruned["pareto"]]) == expected


def test_attrs_carry_the_caution_base_request_and_axes():
    result, table = armature.optimise(HALL, {"slab.thickness_mm": range(180, 221, 20)}, objective="depth")
    assert table.attrs["caution"] == CAUTION and result["caution"] == CAUTION
    assert table.attrs["base_request"] == HALL and table.attrs["axes"] == ["slab.thickness_mm"]
    assert table.attrs["objective"] == "depth" and table.attrs["objective_unit"] == "mm"
    assert table.attrs["message"].startswith("the passing candidate of least depth, 180 mm, among 3 candidates")
    assert table["status"].tolist() == ["pass", "pruned", "pruned"]


def test_no_passing_design_returns_the_least_failing_with_status_fail():
    thin = {"slab.thickness_mm": [120, 130, 140], "concrete.class": ["C25/30", "C30/37"]}
    with pytest.warns(UserWarning, match="^no candidate passes every check: the least-failing is returned, "
                                         "with status fail"):
        result, table = armature.optimise(HALL, thin, objective="cost", rates=RATES)
    assert set(table["status"]) == {"fail"}
    label = table["max_utilisation"].idxmin()
    assert table["chosen"].tolist() == [i == label for i in table.index]
    assert result["status"] == "fail"
    assert result["max_utilisation"] == pytest.approx(table.loc[label, "max_utilisation"])
    assert not table["pareto"].any()


@pytest.mark.parametrize("kwargs, message", [
    ({"vary": {"slab.thicknes_mm": [180]}},
     r"^slab\.thicknes_mm: the optimise axis is not a request field \(did you mean slab\.thickness_mm\?\)$"),
    ({"vary": {"slab.thickness_mm": []}}, r"^vary\.slab\.thickness_mm: has no values$"),
    ({"vary": {"concrete.class": "C30/37"}}, r"^vary\.concrete\.class: must be a list of values"),
    ({"vary": {}}, r"^vary: give a mapping"),
    ({"vary": {"slab.thickness_mm": [180, "deep"]}},
     r"^vary\.slab\.thickness_mm\[1\]: a thickness must be a number of mm, got \"deep\"$"),
    ({"objective": "price"}, r"^objective: must be one of cost, carbon, depth, steel_mass, got 'price'$"),
    ({"rates": None}, r"^rates\.concrete_per_m3: missing: the cost objective needs"),
    ({"rates": {"concrete_per_m3": 120.0, "steel_per_tonne": 1100.0}},
     r"^rates\.formwork_per_m2: missing: the cost objective needs the rate for soffit formwork"),
    ({"rates": dict(RATES, steel_per_tonne="dear")}, r"^rates\.steel_per_tonne: must be a number, got \"dear\"$"),
    ({"rates": dict(RATES, concrete_per_m3=-1)}, r"^rates\.concrete_per_m3: must be zero or more, got -1$"),
    ({"rates": dict(RATES, labour_per_m2=4)}, r"^rates\.labour_per_m2: unknown field$"),
    ({"rates": dict(RATES, concrete_per_m3={})},
     r"^rates\.concrete_per_m3: give the rate of at least one concrete class"),
    ({"objective": "carbon", "vary": {"slab.thickness_mm": [200], "concrete.class": ["C30/37", "C35/45"]}},
     r'^rates\.carbon\.concrete_per_m3\["C35/45"\]: missing: the carbon objective needs the rate of concrete C35/45'),
    ({"objective": "carbon", "rates": {"carbon": {"concrete_per_m3": {"C30/37": 260.0}}}},
     r"^rates\.carbon\.steel_per_kg: missing"),
])
def test_bad_axes_rates_and_objective_are_input_errors_naming_the_field(kwargs, message):
    args = {"vary": {"slab.thickness_mm": [180, 200]}, "objective": "cost", "rates": RATES}
    args.update(kwargs)
    with pytest.raises(armature.InputError, match=message):
        armature.optimise(HALL, **args)


# ---- the command line -----------------------------------------------------

def run(args, stdin=None):
    return subprocess.run([str(CLI), *args], input=stdin, capture_output=True, text=True, timeout=120)


def test_cli_prints_the_choice_and_writes_its_result_and_record(tmp_path):
    request = tmp_path / "hall.json"
    request.write_text(json.dumps(HALL))
    rates = tmp_path / "rates.json"
    rates.write_text(json.dumps(RATES))
    args = ["optimise", str(request), "--vary", "slab.thickness_mm=150:300:10", "--vary",
            "concrete.class=C25/30,C30/37", "--objective", "cost", "--rates", str(rates)]
    vary = {"slab.thickness_mm": list(range(150, 301, 10)), "concrete.class": ["C25/30", "C30/37"]}
    result, table = armature.optimise(HALL, vary, objective="cost", rates=RATES)
    chosen = table[table["chosen"]].iloc[0]
    r = run(args)
    assert r.returncode == 0, r.stderr
    lines = r.stdout.splitlines()
    assert lines[0] == "Optimised  cost (per m2): " + table.attrs["message"]
    assert lines[1].startswith(f"Chosen     slab.thickness_mm={chosen['slab.thickness_mm']}, "
                               f"concrete.class={chosen['concrete.class']}: ")
    assert CAUTION in r.stdout and "PASS" in r.stdout
    r = run(args + ["--json", "--report", str(tmp_path / "chosen.md")])
    assert r.returncode == 0, r.stderr
    assert json.loads(r.stdout) == result
    record = (tmp_path / "chosen.md").read_text(encoding="utf-8")
    assert CAUTION in record and f"{chosen['slab.thickness_mm']} mm" in record
    # A JSON list of values, and an axis with no pruning bound.
    r = run(["optimise", str(request), "--vary", 'reinforcement.bars=[["10","12"],["12","16"]]',
             "--vary", "slab.thickness_mm=[180,200]", "--objective", "steel_mass", "--json"])
    assert r.returncode == 0, r.stderr
    _, table = armature.optimise(HALL, {"reinforcement.bars": [["10", "12"], ["12", "16"]],
                                        "slab.thickness_mm": [180, 200]}, objective="steel_mass")
    assert json.loads(r.stdout) == armature.design(armature.request_for(table, table.index[table["chosen"]][0]))


def test_cli_least_failing_exits_1_and_says_so(tmp_path):
    request = tmp_path / "hall.json"
    request.write_text(json.dumps(HALL))
    r = run(["optimise", str(request), "--vary", "slab.thickness_mm=120:140:10", "--objective", "depth"])
    assert r.returncode == 1
    assert r.stdout.splitlines()[0].startswith("Optimised  depth (mm): no candidate passes every check: "
                                               "the least-failing is returned, with status fail")
    assert r.stdout.splitlines()[1].startswith("Least-failing (FAIL) slab.thickness_mm=")


@pytest.mark.parametrize("extra, message", [
    (["--vary", "slab.thickness_mm=150:300:0"], "--vary slab.thickness_mm=150:300:0: the step of "
                                                "FIRST:LAST:STEP must be more than zero"),
    (["--vary", "slab.thickness_mm=300:150:10"], "--vary slab.thickness_mm=300:150:10: LAST of "
                                                 "FIRST:LAST:STEP is less than FIRST"),
    (["--vary", "slab.thickness_mm"], "--vary slab.thickness_mm: write PATH=VALUES"),
    (["--vary", "concrete.class=C25/30,,C30/37"], "--vary concrete.class=C25/30,,C30/37: an empty value"),
    (["--vary", "x=1", "--vary", "x=2"], "--vary x is given twice"),
    (["--objective", "price", "--vary", "slab.thickness_mm=150:200:10"],
     "--objective must be one of cost, carbon, depth, steel_mass, got price"),
    (["--objective", "cost", "--vary", "slab.thickness_mm=150:200:10"],
     "--rates is needed for the cost objective (no rate is built in)"),
    (["--objective", "depth"], "optimise needs at least one --vary PATH=VALUES"),
    (["--objective", "depth", "--vary", "slab.thickness_mm=150:200:10", "--rates"], "--rates needs a JSON file"),
    (["--objective", "depth", "--vary", "slab.thickness_mm=150:200:10", "--report", "out.pdf"], "--report"),
    (["--objective", "depth", "--vary", "slab.thickness_mm=150:200:10", "--rate", "r.json"],
     "unknown option --rate"),
])
def test_cli_bad_options_are_usage_errors_naming_the_option(tmp_path, extra, message):
    request = tmp_path / "hall.json"
    request.write_text(json.dumps(HALL))
    r = run(["optimise", str(request), *extra])
    assert r.returncode == 2 and r.stdout == ""
    assert r.stderr.startswith("armature: " + message)
    assert "usage: armature design" in r.stderr


def test_cli_bad_rates_and_axes_are_input_errors_naming_the_field(tmp_path):
    request = tmp_path / "hall.json"
    request.write_text(json.dumps(HALL))
    rates = tmp_path / "rates.json"
    rates.write_text(json.dumps({"concrete_per_m3": 120.0, "steel_per_tonne": "dear"}))
    r = run(["optimise", str(request), "--vary", "slab.thicknes_mm=150:200:10", "--rates", str(rates)])
    assert r.returncode == 2 and r.stdout == ""
    assert r.stderr.splitlines() == [
        'armature: rates.steel_per_tonne: must be a number, got "dear"',
        "armature: rates.formwork_per_m2: missing: the cost objective needs the rate for soffit formwork "
        "per m2 (no rate or factor is built in)",
    ]
    rates.write_text(json.dumps(RATES))
    r = run(["optimise", str(request), "--vary", "slab.thicknes_mm=150:200:10", "--rates", str(rates)])
    assert r.returncode == 2
    assert r.stderr.splitlines() == ["armature: vary.slab.thicknes_mm: not a request field"]
    rates.write_text("{not json")
    r = run(["optimise", str(request), "--vary", "slab.thickness_mm=150:200:10", "--rates", str(rates)])
    assert r.returncode == 2 and r.stderr.startswith("armature: (rates): not valid JSON")


def test_a_floor_given_by_strength_keys_its_concrete_by_strength():
    # The hall floor to ACI 318-19, concrete by f'c; the factors are invented.
    aci = {"code": "ACI318-19", "slab": dict(HALL["slab"]), "concrete": {"cylinder_strength_MPa": 28},
           "loads": {"dead_kPa": 1.5, "imposed_kPa": 4.0}}
    rates = {"carbon": {"concrete_per_m3": {"28 MPa": 250.0, "35 MPa": 300.0}, "steel_per_kg": 1.5}}
    vary = {"slab.thickness_mm": list(range(200, 301, 20)), "concrete.cylinder_strength_MPa": [28, 35]}
    study = armature.sweep(aci, vary)
    factor = {28: 250.0, 35: 300.0}
    ranked = sorted(factor[row["concrete.cylinder_strength_MPa"]] * row["slab.thickness_mm"] / 1000
                    + 1.5 * row["steel_kg_m2"] for _, row in study.iterrows() if row["status"] == "pass")
    assert ranked
    result, table = armature.optimise(aci, vary, objective="carbon", rates=rates)
    assert table.loc[table["chosen"], "objective"].iloc[0] == pytest.approx(ranked[0], rel=1e-12)
    with pytest.raises(armature.InputError, match=r'^rates\.carbon\.concrete_per_m3\["40 MPa"\]: missing'):
        armature.optimise(aci, {"slab.thickness_mm": [200], "concrete.cylinder_strength_MPa": [28, 40]},
                          objective="carbon", rates=rates)
