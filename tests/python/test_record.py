"""The calculation record: every number of the JSON result appears with its
clause, the page is well formed, renders in a real browser, and is written
atomically without ever replacing the request."""
import html.parser
import json
import os
import pathlib
import shutil
import subprocess

import pytest

import armature
from conftest import CAUTION, CLI, ROOT

DEMO = ROOT / "examples" / "workshop-first-floor.json"


def n4(v):
    """Numbers as the record prints them: four significant figures."""
    return f"{v:.4g}"


def result_numbers(res):
    """(label, text) pairs that the record must show."""
    out = []
    for c in res["checks"]:
        for key in ("demand", "capacity", "utilisation"):
            out.append((f'{c["id"]} {c["where"]} {key}', n4(c[key])))
        out.append((f'{c["id"]} {c["where"]} clause', c["clause"]))
    for g in res["regions"]:
        for key in ("design_moment_kNm", "effective_depth_mm", "As_req_mm2", "As_min_mm2", "As_max_mm2"):
            out.append((f'{g["where"]} {key}', n4(g[key])))
        out.append((f'{g["where"]} As_prov', n4(g["bars"]["As_prov_mm2"])))
    for s in res["supports"]:
        out.append((f'{s["where"]} shear', n4(s["design_shear_kN"])))
    for key in ("self_weight_kPa", "uls_kPa", "sls_quasi_permanent_kPa"):
        out.append((key, n4(res["loads"][key])))
    out.append(("combination", res["loads"]["combination"]))
    return out


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


def test_every_number_and_clause_of_the_result_is_in_the_record(demo_records):
    res, page, markdown, _ = demo_records
    text = html.unescape(page)
    for label, value in result_numbers(res):
        assert value in text, f"{label}: {value} missing from the HTML record"
        assert value in markdown, f"{label}: {value} missing from the Markdown record"


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
    for label, value in result_numbers(res):
        assert value in text, label
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
