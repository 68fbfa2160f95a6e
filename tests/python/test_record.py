"""The calculation record: every number of the JSON result appears with its
clause, the page is well formed, renders in a real browser, and is written
atomically without ever replacing the request."""
import html.parser
import json
import os
import pathlib
import re
import shutil
import subprocess
from decimal import Decimal

import pytest

import armature
from conftest import CAUTION, CLI, ROOT

DEMO = ROOT / "examples" / "workshop-first-floor.json"


def n4(v, scale=1.0):
    """Numbers as the record prints them: four significant figures in plain
    notation (no exponent), a value within 1e-9 of `scale` as 0."""
    if v == 0 or abs(v) <= 1e-9 * abs(scale):
        return "0"
    return format(Decimal(f"{v:.4g}"), "f")


def check_numbers(c):
    """A check's demand and capacity as printed: noise beside the larger is 0."""
    scale = max(abs(c["demand"]), abs(c["capacity"]))
    return n4(c["demand"], scale), n4(c["capacity"], scale)


def bars_text(bar, spacing_mm):
    """Bars as the record and the summary write them: by diameter "ø12 @ 175 mm",
    by catalogue name "#4 @ 300 mm"."""
    return ("ø" if bar[:1].isdigit() else "") + f"{bar} @ {n4(spacing_mm)} mm"


class Items(html.parser.HTMLParser):
    """The HTML record as a list of items in page order: ("h2"/"h3"/"h4", text),
    ("row", [cell texts]) for table rows, ("p", text) and ("li", text)."""
    BLOCKS = {"h1", "h2", "h3", "h4", "p", "li", "td", "th"}

    def __init__(self):
        super().__init__(convert_charrefs=True)
        self.items, self.row, self.text, self.depth, self.svg = [], None, None, 0, 0

    def handle_starttag(self, tag, attrs):
        if tag == "svg":
            self.svg += 1
        if self.svg:
            return
        if tag == "tr":
            self.row = []
        elif tag in self.BLOCKS and self.text is None:
            self.text, self.depth = [], 0
        elif self.text is not None:
            self.depth += 1

    def handle_endtag(self, tag):
        if tag == "svg":
            self.svg -= 1
            return
        if self.svg:
            return
        if tag == "tr":
            self.items.append(("row", self.row))
            self.row = None
        elif self.text is not None and self.depth:
            self.depth -= 1
        elif tag in self.BLOCKS and self.text is not None:
            text = "".join(self.text).strip()
            self.text = None
            if tag in ("td", "th"):
                self.row.append(text)
            else:
                self.items.append((tag, text))

    def handle_data(self, data):
        if self.text is not None and not self.svg:
            self.text.append(data)


def html_items(page):
    parser = Items()
    parser.feed(page)
    parser.close()
    return parser.items


def markdown_items(text):
    """The Markdown record as the same items as html_items: headings, the bold
    check headings `**id at where** (clause)` as ("h4", "id at where: clause"),
    table rows, bullet lines as ("li", text) and other lines as ("p", text)."""
    items = []
    for line in text.splitlines():
        if not line.strip() or re.fullmatch(r"\|[-:|]+\|", line):
            continue
        heading = re.match(r"(#{1,4}) (.*)", line)
        check = re.fullmatch(r"\*\*(.+?)\*\* \((.*)\)", line)
        if heading:
            items.append((f"h{len(heading.group(1))}", heading.group(2)))
        elif check:
            items.append(("h4", f"{check.group(1)}: {check.group(2)}"))
        elif line.startswith("| "):
            items.append(("row", [c.strip() for c in re.split(r"(?<!\\)\|", line.strip()[1:-1])]))
        elif line.startswith("- "):
            items.append(("li", line[2:]))
        else:
            items.append(("p", line))
    return items


def block(items, kind, predicate):
    """Items after the first heading of `kind` whose text satisfies `predicate`,
    up to the next heading of that level or higher."""
    levels = {"h1": 1, "h2": 2, "h3": 3, "h4": 4}
    for i, (k, text) in enumerate(items):
        if k == kind and predicate(text):
            out = []
            for item in items[i + 1:]:
                if item[0] in levels and levels[item[0]] <= levels[kind]:
                    break
                out.append(item)
            return out
    raise AssertionError(f"no {kind} heading matching in the record")


def labelled(items):
    """label → value of a block's two-cell rows (HTML) or `- label: value` lines (Markdown)."""
    out = {}
    for kind, body in items:
        if kind == "row" and len(body) == 2:
            out.setdefault(body[0], body[1])
        elif kind == "li" and ": " in body:
            label, value = body.split(": ", 1)
            out.setdefault(label, value)
    return out


def holds(text, number, unit):
    """`number unit` stands in `text` as a whole number (not a part of a longer one)."""
    return re.search(r"(?<![\w.\-])" + re.escape(number) + r"(?![\w]|\.\d) " + re.escape(unit), text) is not None


def verdict_text(c):
    unit = "" if c["unit"] == "-" else " " + c["unit"]
    demand, capacity = check_numbers(c)
    return (f'demand {demand}{unit} against capacity {capacity}{unit}: '
            f'utilisation {n4(c["utilisation"])}, {"satisfied" if c["pass"] else "NOT SATISFIED"}')


def assert_record_holds_result(items, res):
    """Every number and clause of the result in the row or derivation that should hold it."""
    # Summary of checks: one row per check, in the result's order, every cell as printed.
    rows = [body for kind, body in block(items, "h2", lambda t: t.endswith("Summary of checks"))
            if kind == "row"]
    header, rows = rows[0], rows[1:]
    assert header == ["check", "where", "clause", "demand", "capacity", "unit", "utilisation", "outcome"]
    assert len(rows) == len(res["checks"])
    for row, c in zip(rows, res["checks"]):
        assert row == [c["id"], c["where"], c["clause"], *check_numbers(c), c["unit"],
                       n4(c["utilisation"]), "ok" if c["pass"] else "fails"], row
    # Each check's derivation, under its own heading, ends in its verdict.
    for c in res["checks"]:
        steps = block(items, "h4", lambda t, c=c: t == f'{c["id"]} at {c["where"]}: {c["clause"]}')
        last = [body for kind, body in steps if kind in ("p", "li")][-1]
        assert last == verdict_text(c), (c["id"], c["where"], last)
    # Each region's table: moment, depth, areas and the bars provided.
    for g in res["regions"]:
        region = labelled(block(items, "h3", lambda t, g=g: t.startswith(g["where"] + ": ")
                                and t.endswith("steel (hogging)" if g["face"] == "top" else "steel (sagging)")))
        assert holds(region["Design moment M_Ed"], n4(g["design_moment_kNm"]), "kNm"), (g["where"], region)
        assert holds(region["Effective depth d"], n4(g["effective_depth_mm"]), "mm"), (g["where"], region)
        for key, label in (("As_req_mm2", "As,req"), ("As_min_mm2", "As,min"), ("As_max_mm2", "As,max")):
            assert holds(region[label], n4(g[key]), "mm2"), (g["where"], label, region)
        bars = g["bars"]
        assert region["Bars"].startswith(bars_text(bars["bar"], bars["spacing_mm"]) + ","), region["Bars"]
        assert holds(region["Bars"], n4(bars["As_prov_mm2"]), "mm2"), region["Bars"]
    # Each support's shear: the demand of the shear check under that support's heading.
    for s in res["supports"]:
        shear = block(items, "h3", lambda t, s=s: t == f'{s["where"]}: shear at the support')
        verdicts = [body for kind, body in shear if kind in ("p", "li") and body.startswith("demand ")]
        assert verdicts[0].startswith(f'demand {n4(s["design_shear_kN"])} kN against capacity '
                                      f'{n4(s["shear_resistance_kN"])} kN'), verdicts
    # Loads in the actions table.
    actions = labelled(block(items, "h2", lambda t: t.endswith("Actions and combinations")))
    loads = res["loads"]
    assert holds(actions["Self-weight"], n4(loads["self_weight_kPa"]), "kPa"), actions
    assert actions["Governing ULS load"] == f'{n4(loads["uls_kPa"])} kPa [{loads["combination"]}]', actions
    # The long-term load under the code's own name (EN: quasi-permanent, ACI: sustained).
    long_term = [v for k, v in actions.items() if k in ("Quasi-permanent load", "Sustained load")]
    assert len(long_term) == 1, actions
    assert holds(long_term[0], n4(loads["sls_quasi_permanent_kPa"]), "kPa"), actions


class Balance(html.parser.HTMLParser):
    VOID = {"meta", "br", "img", "hr", "input", "link", "circle", "line", "polyline", "polygon", "rect",
            "path"}

    def __init__(self):
        super().__init__()
        self.stack, self.errors = [], []

    def handle_starttag(self, tag, attrs):
        if tag not in self.VOID:
            self.stack.append(tag)

    def handle_startendtag(self, tag, attrs):
        pass

    def handle_endtag(self, tag):
        if tag in self.VOID:
            return
        if not self.stack or self.stack[-1] != tag:
            self.errors.append(f"</{tag}> closes {self.stack[-1] if self.stack else 'nothing'}")
        else:
            self.stack.pop()


@pytest.fixture(scope="module")
def demo_records(tmp_path_factory):
    d = tmp_path_factory.mktemp("records")
    res = json.loads(subprocess.run([str(CLI), "design", "--json", str(DEMO), "--report", str(d / "r.html")],
                                    capture_output=True, text=True, check=True).stdout)
    subprocess.run([str(CLI), "design", str(DEMO), "--report", str(d / "r.md")], capture_output=True,
                   check=True)
    return res, (d / "r.html").read_text(encoding="utf-8"), (d / "r.md").read_text(encoding="utf-8"), d


def test_every_number_and_clause_of_the_result_is_in_its_place_in_the_record(demo_records):
    res, page, markdown, _ = demo_records
    assert_record_holds_result(html_items(page), res)
    assert_record_holds_result(markdown_items(markdown), res)


def test_record_carries_title_block_caution_and_diagrams(demo_records):
    res, page, markdown, _ = demo_records
    assert "Community workshop" in page and "First floor slab, grid lines 1-4" in page
    # The caution heads the page and closes it, in the one wording, in both forms.
    assert page.count(CAUTION) == 2
    assert markdown.count(CAUTION) == 2
    assert 'aria-label="bending moment envelope"' in page
    assert 'aria-label="shear force envelope"' in page
    assert page.count('aria-label="cross-section of the strip') == len(res["regions"])
    assert "Request fingerprint" in page and armature.__version__ in page
    # Each check appears with its derivation steps in the record.
    assert page.count('<div class="check">') == len(res["checks"])
    assert "## 5 Summary of checks" in markdown


def test_html_is_well_formed_and_self_contained(demo_records):
    _, page, _, _ = demo_records
    parser = Balance()
    parser.feed(page)
    parser.close()
    assert parser.errors == []
    assert parser.stack == []
    for external in ("http://", "https://", "<link", "<script", "src="):
        if external == "http://":
            # The SVG namespace is the only URL, and it is never fetched.
            assert page.replace('xmlns="http://www.w3.org/2000/svg"', "").count("http://") == 0
        else:
            assert external not in page


def test_python_report_writes_the_same_record(tmp_path):
    req = json.loads(DEMO.read_text())
    res = armature.design(req)
    path = armature.report(res, tmp_path / "calc.md")
    text = pathlib.Path(path).read_text(encoding="utf-8")
    assert_record_holds_result(markdown_items(text), res)
    changed = armature.Result(dict(res, max_utilisation=0.1), req)
    with pytest.raises(ValueError, match="does not match its request"):
        armature.report(changed, tmp_path / "x.md")
    assert not (tmp_path / "x.md").exists()
    with pytest.raises(ValueError, match="report needs a result"):
        armature.report(dict(res), tmp_path / "y.md")
    with pytest.raises(armature.InputError, match=r"report: the record is written as \.html or \.md"):
        armature.report(res, tmp_path / "calc.pdf")


def test_record_never_replaces_the_request_and_writes_atomically(tmp_path):
    request = tmp_path / "floor.json"
    shutil.copy(DEMO, request)
    before = request.read_bytes()
    run = subprocess.run([str(CLI), "design", str(request), "--report", str(request)],
                         capture_output=True, text=True)
    assert run.returncode == 2 and run.stdout == ""
    assert request.read_bytes() == before
    # Into a directory that does not exist: an error, and nothing is left behind.
    run = subprocess.run([str(CLI), "design", str(request), "--report", str(tmp_path / "no" / "r.html")],
                         capture_output=True, text=True)
    assert run.returncode == 3 and "cannot write" in run.stderr
    # Replacing an older record leaves no temporary file.
    target = tmp_path / "r.html"
    target.write_text("old")
    subprocess.run([str(CLI), "design", str(request), "--report", str(target)], capture_output=True, check=True)
    assert target.read_text(encoding="utf-8").startswith("<!DOCTYPE html>")
    assert sorted(p.name for p in tmp_path.iterdir()) == ["floor.json", "r.html"]


CHROMIUM = shutil.which("chromium") or shutil.which("chromium-browser")


@pytest.mark.skipif(CHROMIUM is None, reason="Chromium is not installed (Debian package chromium); "
                                              "CI installs it so this runs there")
def test_record_renders_in_a_real_browser(demo_records):
    _, _, _, d = demo_records
    flags = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
             "--disable-background-networking", "--disable-component-update", "--disable-sync",
             f"--user-data-dir={d / 'profile'}"]
    url = (d / "r.html").as_uri()
    subprocess.run([CHROMIUM, *flags, f"--print-to-pdf={d / 'r.pdf'}", "--no-pdf-header-footer", url],
                   capture_output=True, timeout=120)
    subprocess.run([CHROMIUM, *flags, f"--screenshot={d / 'r.png'}", "--window-size=900,1300", url],
                   capture_output=True, timeout=120)
    pdf, png = (d / "r.pdf").read_bytes(), (d / "r.png").read_bytes()
    assert pdf.startswith(b"%PDF") and pdf.count(b"/Type /Page") >= 2
    assert png.startswith(b"\x89PNG") and len(png) > 20000
