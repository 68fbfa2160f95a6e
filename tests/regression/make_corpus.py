"""Record the regression corpus: a few hundred version-1 requests and the
results the current code gives for them (tests/regression/corpus.json).

    PYTHONPATH=build/python /usr/bin/python3 tests/regression/make_corpus.py

The requests are drawn from a fixed seed, so a rerun on unchanged code
writes the same file byte for byte. Every request is checked with
armature.design first and skipped when it is an input error (for example
EN 5.5(4) refusing a redistribution), so the corpus holds valid requests
only; designs that fail a check are kept, they are results too.

This is a record of the project's own earlier results, not an engineering
reference: it says "unchanged", never "right". Regenerate only for a
deliberate, reviewed change of results (DEVELOPERS.md, "Regression corpus").

`compact(result)` is also used by tests/python/test_regression_corpus.py,
so the stored form and the compared form are made by one function.
"""
import json
import math
import pathlib
import random
import sys

SEED = 20240613
COUNTS = {("EN1992-1-1", "recommended"): 125, ("EN1992-1-1", "UK"): 95, ("ACI318-19", None): 110}
CORPUS = pathlib.Path(__file__).resolve().with_name("corpus.json")

CHECK_FIELDS = ["id", "where", "clause", "demand", "capacity", "unit", "utilisation", "pass"]
REGION_FIELDS = ["where", "face", "x_m", "design_moment_kNm", "effective_depth_mm",
                 "As_req_mm2", "As_min_mm2", "As_max_mm2"]
BAR_FIELDS = ["bar", "diameter_mm", "spacing_mm", "As_prov_mm2"]


def _finite(v):
    """A non-finite number as the string "inf", "-inf" or "nan" (strict JSON
    has none; the result writer's JSON says null), anything else as it is."""
    return repr(v) if isinstance(v, float) and not math.isfinite(v) else v


def compact(result):
    """Every field of a result but the steps, the caution and the version.
    Checks appear once, in the top-level order, as lists in CHECK_FIELDS
    order; each region, support and span keeps the count of its own checks
    (the top-level list is theirs in order), so a check that moves between
    them is still seen. Non-finite numbers become strings (_finite)."""
    def bars(b):
        return {k: b[k] for k in BAR_FIELDS}

    out = {
        "code": result["code"],
        "variant": result["variant"],
        "status": result["status"],
        "max_utilisation": result["max_utilisation"],
        "governing": dict(result["governing"]),
        "loads": dict(result["loads"]),
        "cover_mm": dict(result["cover_mm"]),
        "regions": [dict({k: g[k] for k in REGION_FIELDS}, bars=bars(g["bars"]), n_checks=len(g["checks"]))
                    for g in result["regions"]],
        "supports": [{"where": s["where"], "design_shear_kN": s["design_shear_kN"],
                      "shear_resistance_kN": s["shear_resistance_kN"], "n_checks": len(s["checks"])}
                     for s in result["supports"]],
        "spans": [{"where": s["where"], "n_checks": len(s["checks"])} for s in result["spans"]],
        "distribution": dict(bars(result["distribution"]), As_req_mm2=result["distribution"]["As_req_mm2"]),
        "checks": [[c[k] for k in CHECK_FIELDS] for c in result["checks"]],
        "warnings": list(result["warnings"]),
    }
    return _map_numbers(out)


def _map_numbers(o):
    if isinstance(o, dict):
        return {k: _map_numbers(v) for k, v in o.items()}
    if isinstance(o, list):
        return [_map_numbers(v) for v in o]
    return _finite(o)


def _spans(rng, n, ends, close):
    """Spans in m (two decimals); a cantilever span shorter; `close` keeps
    adjacent spans within a ratio of 1.6 so a redistribution can be valid."""
    spans = []
    for i in range(n):
        cantilever = (i == 0 and ends[0] == "free") or (i == n - 1 and ends[1] == "free")
        if cantilever:
            spans.append(round(rng.uniform(0.6, 2.4), 2))
        elif close and spans:
            spans.append(round(min(max(spans[-1] * rng.uniform(0.7, 1.4), 1.6), 7.4), 2))
        else:
            spans.append(round(rng.uniform(1.6, 7.4), 2))
    return spans


def _ends(rng, n):
    pick = lambda: rng.choices(["pinned", "fixed", "free"], weights=[5, 3, 2])[0]
    ends = [pick(), pick()]
    if n == 1 and "free" in ends:  # a lone cantilever: the other end fixed
        ends[1 - ends.index("free")] = "fixed"
    return ends


def _common(rng, code):
    n = rng.choices([1, 2, 3, 4, 5, 6], weights=[5, 4, 3, 2, 1, 1])[0]
    ends = _ends(rng, n)
    redistribute = code == "EN1992-1-1" and n >= 2 and rng.random() < 0.3
    slab = {"spans_m": _spans(rng, n, ends, redistribute), "ends": ends,
            "thickness_mm": rng.choice(range(120, 401, 5))}
    if rng.random() < 0.25:
        slab["strip_width_mm"] = rng.choice([300, 500, 750, 1200, 1500, 2400])
    loads = {"imposed_kPa": round(rng.uniform(0.8, 11.5), 2)}
    if rng.random() < 0.85:
        loads["dead_kPa"] = round(rng.uniform(0.0, 4.5), 2)
    return n, slab, loads, redistribute


def en_request(rng, variant):
    n, slab, loads, redistribute = _common(rng, "EN1992-1-1")
    classes = ["C20/25", "C25/30", "C30/37", "C35/45", "C40/50", "C45/55", "C50/60", "C55/67", "C60/75"]
    if variant == "UK":
        classes += ["C28/35", "C32/40"]
    concrete = ({"class": rng.choice(classes)} if rng.random() < 0.8
                else {"cylinder_strength_MPa": rng.choice([22, 27, 33, 38, 42])})
    if rng.random() < 0.3:
        concrete["aggregate_mm"] = rng.choice([10, 14, 16, 32])
    if rng.random() < 0.15:
        concrete["density_kN_m3"] = round(rng.uniform(23.0, 26.0), 1)
    bar_sets = [["8", "10", "12", "16"], ["10", "12", "16", "20"], ["12", "16", "20", "25"],
                ["8", "10"], ["16"], ["10", "16", "25", "32"], ["6", "8", "10", "12"]]
    reinforcement = {"bars": rng.choice(bar_sets)}
    if rng.random() < 0.4:
        reinforcement["yield_strength_MPa"] = rng.choice([450, 500, 550])
    if rng.random() < 0.4 or redistribute:
        reinforcement["ductility_class"] = rng.choice(["A", "B", "C"] if not redistribute else ["B", "B", "C", "A"])
    loads["imposed_category"] = rng.choice("ABCDEFGH")
    durability = {}
    if rng.random() < 0.7:
        durability["exposure"] = rng.choice(["X0", "XC1", "XC2", "XC3", "XC4", "XD1", "XD2", "XS1", "XS3"])
    if rng.random() < 0.4:
        durability["cover_mm"] = rng.choice([15, 20, 25, 30, 35, 40, 45, 55])
    if rng.random() < 0.2:
        durability["design_life_years"] = rng.choice([50, 100])
    req = {"code": "EN1992-1-1", "variant": variant, "slab": slab, "concrete": concrete,
           "reinforcement": reinforcement, "loads": loads}
    if durability:
        req["durability"] = durability
    if rng.random() < 0.35:
        req["fire"] = {"resistance_min": rng.choice([30, 60, 90, 120, 180, 240])}
    design = {}
    if rng.random() < 0.4:
        design["combination"] = rng.choice(["6.10", "6.10a/b"])
    if redistribute:
        design["redistribution_percent"] = rng.choice([5, 10, 15, 20, 25, 30])
    if design:
        req["design"] = design
    if variant == "recommended" and rng.random() < 0.3:
        del req["variant"]  # the default variant, by omission
    return req


def aci_request(rng):
    n, slab, loads, _ = _common(rng, "ACI318-19")
    concrete = {"cylinder_strength_MPa": rng.choice([21, 24, 28, 32, 35, 40, 45, 55])}
    if rng.random() < 0.3:
        concrete["aggregate_mm"] = rng.choice([10, 14, 19, 25, 38])
    if rng.random() < 0.15:
        concrete["density_kN_m3"] = round(rng.uniform(22.0, 25.0), 1)
    bar_sets = [["#3", "#4", "#5", "#6"], ["#4", "#5"], ["#5", "#6", "#7", "#8"], ["#3"],
                ["No.10", "No.13", "No.16"], ["#4", "#6", "#8"]]
    reinforcement = {"bars": rng.choice(bar_sets)}
    if rng.random() < 0.35:
        reinforcement["yield_strength_MPa"] = rng.choice([280, 420, 520])
    if rng.random() < 0.3:
        loads["imposed_category"] = rng.choice("ABCE")  # ignored by ACI 318-19
    durability = {}
    if rng.random() < 0.6:
        durability["exposure"] = rng.choice(["interior", "weather", "ground"])
    if rng.random() < 0.35:
        durability["cover_mm"] = rng.choice([19, 20, 25, 40, 50, 75])
    req = {"code": "ACI318-19", "slab": slab, "concrete": concrete, "reinforcement": reinforcement,
           "loads": loads}
    if durability:
        req["durability"] = durability
    if rng.random() < 0.1:
        req["fire"] = {"resistance_min": rng.choice([60, 120])}  # reported as not checked
    return req


def build(armature):
    """The requests, in a fixed order, each one valid; and the skip count."""
    rng = random.Random(SEED)
    requests, skipped = [], 0
    for (code, variant), count in COUNTS.items():
        made = 0
        while made < count:
            req = en_request(rng, variant) if code == "EN1992-1-1" else aci_request(rng)
            try:
                armature.design(req)
            except armature.InputError:
                skipped += 1
                continue
            requests.append(req)
            made += 1
    return requests, skipped


def main():
    import armature
    requests, skipped = build(armature)
    results = armature.design_many(requests, threads=1)
    corpus = {
        "about": ("Regression record of armature's own version-1 results, made after the rule-corrections "
                  "issue and before the version 2 refactor; not an engineering reference. "
                  "Regenerate only for a deliberate, reviewed change (DEVELOPERS.md, 'Regression corpus')."),
        "armature_version": results[0]["armature_version"] if results else None,
        "seed": SEED,
        "check_fields": CHECK_FIELDS,
        "cases": [{"request": q, "result": compact(r)} for q, r in zip(requests, results)],
    }
    text = json.dumps(corpus, separators=(",", ":"), allow_nan=False)
    CORPUS.write_text(text.replace('{"request":', '\n{"request":') + "\n")
    statuses = [r["status"] for r in results]
    print(f"{len(requests)} requests ({skipped} invalid drawn and skipped), "
          f"{statuses.count('pass')} pass, {statuses.count('fail')} fail; "
          f"{CORPUS.stat().st_size / 1e6:.2f} MB -> {CORPUS}", file=sys.stderr)


if __name__ == "__main__":
    main()
