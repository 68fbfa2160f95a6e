"""The words and numbers of the calculation record and the CLI summary
(issue 12, items 8 and 14): the long-term load under the code's own name,
the defaults a request left out, the self-weight derived, no number in
exponent form, no derivation line that repeats itself, and bars written
the same way in the summary and the record."""
import json
import re
import subprocess

import pytest

from conftest import CLI, ROOT
from test_record import block, html_items, labelled, markdown_items

DEMO = ROOT / "examples" / "workshop-first-floor.json"

# Our own scenario: a 3.6 m single span of a garden-room floor, h 180,
# everything else left to the defaults.
MINIMAL = {
    "EN1992-1-1": {"code": "EN1992-1-1",
                   "slab": {"spans_m": [3.6], "ends": ["pinned", "pinned"], "thickness_mm": 180},
                   "concrete": {"class": "C25/30"}, "loads": {"imposed_kPa": 3.0}},
    "ACI318-19": {"code": "ACI318-19",
                  "slab": {"spans_m": [3.6], "ends": ["pinned", "pinned"], "thickness_mm": 180},
                  "concrete": {"cylinder_strength_MPa": 28}, "loads": {"imposed_kPa": 2.4}},
}


def run(request, tmp_path, name):
    """Summary (stdout), Markdown record and HTML record of one request, through the CLI."""
    path = tmp_path / f"{name}.json"
    path.write_text(json.dumps(request))
    md, html = tmp_path / f"{name}.md", tmp_path / f"{name}.html"
    summary = subprocess.run([str(CLI), "design", str(path), "--report", str(md)], capture_output=True,
                             text=True)
    assert summary.returncode in (0, 1), summary.stderr
    subprocess.run([str(CLI), "design", str(path), "--report", str(html)], capture_output=True, check=False)
    return summary.stdout, md.read_text(encoding="utf-8"), html.read_text(encoding="utf-8")


def defaults_table(markdown):
    """field → (value used, from) of the record's "Defaults used" table."""
    rows = [body for kind, body in block(markdown_items(markdown), "h3", lambda t: t.startswith("Defaults used"))
            if kind == "row"]
    assert rows[0] == ["field", "value used", "from"]
    return {r[0]: (r[1], r[2]) for r in rows[1:]}


def actions(markdown):
    return labelled(block(markdown_items(markdown), "h2", lambda t: t.endswith("Actions and combinations")))


def test_the_long_term_load_has_the_code_s_name(tmp_path, base_request):
    # EN 1990 (6.16b), quasi-permanent: Gk + ψ2 Qk = (25 × 0.2 + 1.0) + 0.3 × 2.5 = 6.75 kPa
    # (ψ2 = 0.3 for category A, EN 1990 Table A1.1, value from memory).
    summary, md, page = run(base_request, tmp_path, "en")
    assert "quasi-permanent 6.75 kPa" in summary
    assert actions(md)["Quasi-permanent load"] == "6.75 kPa"
    assert labelled(block(html_items(page), "h2", lambda t: t.endswith("Actions and combinations")))[
        "Quasi-permanent load"] == "6.75 kPa"
    assert "sustained" not in (summary + md + page).lower()
    # ACI 318-19 calls it the sustained load (24.2.4.1, Table 24.2.2); the plug-in takes D
    # alone: 23.6 × 0.2 + 0.8 = 5.52 kPa (150 lb/ft³ concrete, common practice).
    aci = {"code": "ACI318-19", "slab": {"spans_m": [3.6], "ends": ["pinned", "pinned"], "thickness_mm": 200},
           "concrete": {"cylinder_strength_MPa": 28}, "loads": {"dead_kPa": 0.8, "imposed_kPa": 2.4}}
    summary, md, page = run(aci, tmp_path, "aci")
    assert "sustained 5.52 kPa" in summary
    assert actions(md)["Sustained load"] == "5.52 kPa"
    assert labelled(block(html_items(page), "h2", lambda t: t.endswith("Actions and combinations")))[
        "Sustained load"] == "5.52 kPa"
    assert "quasi-permanent" not in (summary + md + page).lower()


def test_en_record_lists_the_defaults_of_a_minimal_request(tmp_path):
    _, md, page = run(MINIMAL["EN1992-1-1"], tmp_path, "en")
    table = defaults_table(md)
    values = {field: value for field, (value, _) in table.items()}
    assert values == {
        "variant": "recommended",
        "slab.strip_width_mm": "1000 mm",
        "loads.dead_kPa": "0 kPa",
        "design.redistribution_percent": "0 %",
        "design.combination": "6.10",
        # EN 1991-1-1 Table A.1, reinforced normal-weight concrete (value from memory).
        "concrete.density_kN_m3": "25 kN/m³",
        "concrete.aggregate_mm": "20 mm",
        "reinforcement.yield_strength_MPa": "500 MPa",
        "reinforcement.bars": "8, 10, 12, 16, 20, 25",
        "reinforcement.ductility_class": "B",
        "loads.imposed_category": "B",
        "durability.exposure": "XC1",
        "durability.design_life_years": "50 years",
        "durability.cover_mm": table["durability.cover_mm"][0],
    }
    assert "EN 1991-1-1 Table A.1" in table["concrete.density_kN_m3"][1]
    assert table["durability.cover_mm"][1] == "EN 1992-1-1 4.4.1"
    # The self-weight derived from that density: 25 × 0.18 = 4.5 kPa.
    assert actions(md)["Self-weight"] == "density × h = 25 kN/m³ × 0.18 m = 4.5 kPa"
    # The HTML record lists the same rows.
    rows = [body for kind, body in block(html_items(page), "h3", lambda t: t.startswith("Defaults used"))
            if kind == "row"]
    assert {r[0]: r[1] for r in rows[1:]} == values


def test_aci_record_lists_only_the_defaults_aci_uses(tmp_path):
    _, md, _ = run(MINIMAL["ACI318-19"], tmp_path, "aci")
    values = {field: value for field, (value, _) in defaults_table(md).items()}
    assert values == {
        "variant": "SI",
        "slab.strip_width_mm": "1000 mm",
        "loads.dead_kPa": "0 kPa",
        "design.redistribution_percent": "0 %",
        # 150 lb/ft³ = 23.56 kN/m³, taken as 23.6 (common practice, value from memory).
        "concrete.density_kN_m3": "23.6 kN/m³",
        "concrete.aggregate_mm": "20 mm",
        "reinforcement.yield_strength_MPa": "420 MPa",   # Grade 420 (Grade 60)
        "reinforcement.bars": "#3, #4, #5, #6, #7, #8",
        "durability.exposure": "interior",
        "durability.cover_mm": values["durability.cover_mm"],
    }
    # ACI has no ψ categories, design-life classes or ductility classes:
    # imposed_category, design_life_years and ductility_class are not listed.
    assert actions(md)["Self-weight"] == "density × h = 23.6 kN/m³ × 0.18 m = 4.248 kPa"


def test_fields_given_are_not_listed_as_defaults(tmp_path):
    # The density given under its plain name, strip width and exposure under their own.
    req = json.loads(json.dumps(MINIMAL["EN1992-1-1"]))
    req["concrete"]["density"] = "24 kN/m3"
    req["slab"]["strip_width_mm"] = 1200
    req["durability"] = {"exposure": "XC3"}
    _, md, _ = run(req, tmp_path, "given")
    table = defaults_table(md)
    for field in ("concrete.density_kN_m3", "slab.strip_width_mm", "durability.exposure", "slab.thickness_mm"):
        assert field not in table
    assert table["concrete.aggregate_mm"][0] == "20 mm"
    # 24 × 0.18 = 4.32 kPa.
    assert actions(md)["Self-weight"] == "density × h = 24 kN/m³ × 0.18 m = 4.32 kPa"


EXPONENT = re.compile(r"[0-9][eE][+-]?[0-9]")
FINGERPRINT = re.compile(r"\b[0-9a-f]{16}\b")


@pytest.mark.parametrize("request_of", ["demo", "EN1992-1-1", "ACI318-19"])
def test_no_number_is_written_in_exponent_form(tmp_path, request_of):
    req = json.loads(DEMO.read_text()) if request_of == "demo" else MINIMAL[request_of]
    summary, md, page = run(req, tmp_path, "r")
    for name, text in (("summary", summary), ("markdown", md), ("html", page)):
        text = FINGERPRINT.sub("", text)  # the request's hash is hexadecimal, not a number
        found = [text[max(m.start() - 30, 0):m.end() + 10] for m in EXPONENT.finditer(text)]
        assert found == [], (name, found)


def step_lines(markdown):
    """Derivation lines of the Markdown record: bullet lines under a check heading."""
    out, in_check = [], False
    for line in markdown.splitlines():
        if line.startswith("**"):
            in_check = True
        elif line.startswith("#"):
            in_check = False
        elif in_check and line.startswith("- ") and not line.startswith("- demand "):
            out.append(line[2:])
    return out


@pytest.mark.parametrize("request_of", ["demo", "EN1992-1-1", "ACI318-19"])
def test_no_derivation_line_repeats_itself(tmp_path, request_of):
    req = json.loads(DEMO.read_text()) if request_of == "demo" else MINIMAL[request_of]
    _, md, page = run(req, tmp_path, "r")
    lines = step_lines(md)
    assert len(lines) > 20
    for line in lines:
        parts = line.split(" = ")
        result = re.sub(r" \(.*\)$", "", parts[-1])      # "0.00591", "20 mm"
        number = result.split(" ")[0]
        assert all(a != b for a, b in zip(parts, parts[1:-1] + [result])), line
        assert parts[-2] not in (number, result), line
    # HTML: symbol | = expression | = substituted | = result | clause.
    rows = [body for kind, body in html_items(page) if kind == "row" and len(body) == 5
            and body[3].startswith("= ")]
    assert len(rows) == len(lines)
    for symbol, expression, substituted, result, _ in rows:
        assert expression != "= " + symbol, (symbol, expression)
        assert substituted[2:] not in (result[2:], result[2:].split(" ")[0]), (symbol, substituted, result)


def test_bars_are_written_alike_in_summary_and_record(tmp_path):
    summary, md, page = run(json.loads(DEMO.read_text()), tmp_path, "demo")
    bar = r"(?:ø\d+|#\d+) @ [\d.]+ (?:mm|in)"
    in_summary = {m.group(1): m.group(2) for m in re.finditer(
        rf"^((?:span|support) \d+)\s+(?:top|bottom)\s+.*?({bar})", summary, re.M)}
    assert len(in_summary) == 7
    for items in (markdown_items(md), html_items(page)):
        for where, text in in_summary.items():
            region = labelled(block(items, "h3", lambda t, w=where: t.startswith(w + ": ") and "steel" in t))
            assert region["Bars"].startswith(text + ", As,prov"), (where, region["Bars"], text)
    distribution = re.search(rf"^Distribution bars ({bar}) ", summary, re.M).group(1)
    # The demo's distribution steel: ø8 @ 400 mm = 125.7 mm² ≥ 0.2 × 448.8 = 89.8 mm² (20 % of the
    # largest main steel, EN 1992-1-1 9.3.1.1(2)), at the widest spacing the plug-in allows.
    assert distribution == "ø8 @ 400 mm"
    assert f"\n{distribution}: As,prov" in md
    assert f"<p>{distribution}: As,prov" in page
