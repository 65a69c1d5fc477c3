"""The crew's printed schedule (bracing.report.schedule): HTML for print, CSV and text.

The HTML is rendered by headless Chromium (the Debian package, installed by .ci/run): each day's
page has its table, its plan and the caution; the pages fit A4's width and each day starts a new
sheet on A4 and on Letter. Paper sizes: ISO 216 A4 210 x 297 mm = 595 x 842 pt, ANSI Letter
8.5 x 11 in = 612 x 792 pt (text).
"""

from __future__ import annotations

import csv
import io
import os
import re
import shutil
import subprocess
from html.parser import HTMLParser
from pathlib import Path

import pytest
from test_schedule import tiny_result

from bracing import scenario
from bracing.evaluate import evaluate
from bracing.report import schedule as sheet

REPO = Path(__file__).resolve().parents[1]


@pytest.fixture
def tiny(tmp_path):
    site, result, _ = tiny_result(tmp_path)
    return site, result


def test_text_sheet_has_the_verdict_first_and_the_caution(tiny):
    """Day 2: B is lifted and fails (short of b1 braces, a danger of the day), a thunderstorm is
    forecast: NO-GO, said before anything else; the caution right after it and last."""
    site, result = tiny
    text = sheet.render(site, result, 2, "text", "us")
    lines = text.strip().splitlines()
    assert lines[0].startswith("NO-GO: ") and "thunderstorm" in lines[0]
    assert "do not lift B" in lines[0]
    caution = " ".join(result.caution.split())
    assert caution in " ".join(text.split()[:200]) and " ".join(lines[-2:]).split() == \
        caution.split()
    assert "Tiny yard: day 2, 2024-03-05" in text
    assert "brace b1: 5 / 4  ✖ SHORT 1" in text
    lifts = text[text.index("LIFTS TODAY"):text.index("RELEASES TODAY")]
    assert re.search(r"^\s+B\s+. \w+ \(lifted today\)", lifts, re.MULTILINE)
    assert "3 braces b1" in lifts and "DO NOT LIFT" in lifts
    standing = text[text.index("WALLS STANDING"):text.index("FINDINGS")]
    assert re.search(r"^\s+A\s+✔ braced\s+2 braces b1", standing, re.MULTILINE)
    assert "B: sign-off" not in text and "sign-off" not in text  # on day 3, the day it happens
    assert "License number" in text and "DAILY INSPECTION (common practice)" in text
    assert max(map(len, text.splitlines())) <= 100


def test_text_sheet_in_si_units(tiny):
    site, result = tiny
    text = sheet.render(site, result, 1, "text", "si")
    lifts = text[text.index("LIFTS TODAY"):text.index("RELEASES TODAY")]
    assert " m/s" in lifts and "6.10 m" in lifts  # insert 20 ft = 6.096 m (exact conversion)
    assert not US_UNITS.search(text), US_UNITS.search(text)


US_UNITS = re.compile(r"(?<![A-Za-z_])(mph|ft|lbf?|lbs|psf|pcf|plf|psi|kips?)(?![A-Za-z_])")


def test_csv_one_row_per_wall_per_day(tiny):
    """The header row first, a row for each wall standing or released on each day, with plain
    numbers a spreadsheet can add up, and the caution in a last row starting with '#'."""
    site, result = tiny
    text = sheet.render(site, result, None, "csv", "us")
    rows = list(csv.reader(io.StringIO(text)))
    assert rows[-1] == [f"# {result.caution}"]
    header = rows[0]
    assert header[:3] == ["day", "date", "go"] and "insert height (ft)" in header
    body = [dict(zip(header, r, strict=True)) for r in rows[1:-1]]
    expected = [(d.day, m) for d in result.days for m in d.standing + d.released]
    assert [(int(r["day"]), r["wall"]) for r in body] == expected
    released = next(r for r in body if r["day"] == "5" and r["wall"] == "A")
    assert released["today"] == "released today"
    a1 = next(r for r in body if r["day"] == "1")
    assert (a1["braces"], float(a1["insert height (ft)"])) == ("2", 20.0)
    assert float(a1["brace angle (deg)"]) == 55.0
    assert a1["positions from first edge (ft)"] == "6.0; 18.0"  # centres of 2 strips of 24 ft
    assert float(a1["helical torque (lb-ft)"]) > 0
    assert text.isascii()  # opens cleanly in any spreadsheet


def test_csv_in_si_units(tiny):
    site, result = tiny
    header = next(csv.reader(io.StringIO(sheet.render(site, result, 1, "csv", "si"))))
    assert "insert height (m)" in header and "forecast gust (m/s)" in header


def test_asking_for_a_day_not_in_the_schedule(tiny):
    site, result = tiny
    with pytest.raises(sheet.NoSuchDay, match="day 9 is not in the schedule"):
        sheet.render(site, result, 9, "text", "us")


def test_site_without_lift_days_prints_every_wall():
    """The demo site gives no lift days: one sheet with every wall standing together."""
    site = scenario.load(REPO / "scenarios" / "demo-mixed.toml").site
    result = evaluate(site)
    text = sheet.render(site, result, None, "text", "us")
    assert "every wall standing together" in " ".join(text.split())
    for p in site.panels:
        assert re.search(rf"^\s+{re.escape(p.mark)}[\s:]", text, re.MULTILINE), p.mark


# --- the HTML ----------------------------------------------------------------------------------
class Days(HTMLParser):
    """Each <section class="day">: the classes of elements inside it and its caution texts."""

    def __init__(self):
        super().__init__()
        self.days: list[dict] = []
        self.depth = 0
        self.caution_tag: str | None = None

    def handle_starttag(self, tag, attrs):
        a = dict(attrs)
        classes = set((a.get("class") or "").split())
        if tag == "section" and "day" in classes:
            self.days.append({"day": a.get("data-day"), "found": set(), "cautions": [],
                              "marks": []})
            self.depth = 1
            return
        if not self.depth:
            return
        if tag not in ("br", "col", "img", "meta", "path", "line", "rect", "circle", "polyline",
                       "polygon"):
            self.depth += 1
        day = self.days[-1]
        day["found"] |= {f"{tag}.{c}" for c in classes} | {tag}
        if "caution" in classes:
            self.caution_tag = tag
            day["cautions"].append([tag, ""])
        if tag == "tr" and "wall" in classes:
            day["marks"].append(a.get("data-mark"))

    def handle_endtag(self, tag):
        if not self.depth:
            return
        if tag not in ("br", "col", "img", "meta", "path", "line", "rect", "circle", "polyline",
                       "polygon"):
            self.depth -= 1
        if tag == self.caution_tag:
            self.caution_tag = None

    def handle_data(self, data):
        if self.depth and self.caution_tag:
            self.days[-1]["cautions"][-1][1] += data


def check_pages(html: str, result, days) -> None:
    """Each day's page: its schedule table, its plan, the caution at its top and bottom."""
    parser = Days()
    parser.feed(html)
    assert [d["day"] for d in parser.days] == [str(d.day) for d in days]
    for page, d in zip(parser.days, days, strict=True):
        found = page["found"]
        assert "table.schedule" in found and "table.inventory" in found, d.day
        assert "figure.plan" in found and "svg" in found, d.day
        tags = [tag for tag, text in page["cautions"] if text.strip() == result.caution]
        assert tags[0] == "header" and tags[-1] == "footer", d.day
        assert sorted(page["marks"]) == sorted(d.standing + d.released), d.day


def test_html_pages_have_their_table_plan_and_caution(tiny):
    pytest.importorskip("bracing.report.svg")
    site, result = tiny
    html = sheet.render(site, result, None, "html", "us")
    check_pages(html, result, result.days)
    assert "✖ SHORT 1" in html and "@page" in html and "break-after: page" in html


# --- headless Chromium -------------------------------------------------------------------------
def chromium() -> str:
    """The Chromium binary; skip only outside CI when it is absent (CI must have it)."""
    found = next((p for p in ("/usr/bin/chromium", shutil.which("chromium")) if p and
                  Path(p).exists()), None)
    if found is None:
        if os.environ.get("CI"):
            pytest.fail("CI is set but chromium is not installed (.ci/run installs it)")
        pytest.skip("chromium is not installed")
    return found


def run_chromium(tmp_path: Path, page: Path, *args: str) -> subprocess.CompletedProcess:
    profile = tmp_path / f"profile-{len(list(tmp_path.glob('profile-*')))}"
    done = subprocess.run(
        [chromium(), "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic",
         "--no-first-run", "--disable-background-networking", "--disable-component-update",
         "--disable-sync", f"--user-data-dir={profile}", *args, page.as_uri()],
        capture_output=True, text=True, timeout=180, check=False)
    assert done.returncode == 0, done.stderr[-2000:]
    return done


def pdf_pages(tmp_path: Path, html: str, paper: str, name: str) -> tuple[int, list[str]]:
    """Pages and page sizes of the HTML printed by Chromium on `paper` (A4 or letter)."""
    page = tmp_path / f"{name}.html"
    page.write_text(html.replace("</head>", f"<style>@page {{ size: {paper}; }}</style></head>"),
                    encoding="utf-8")
    pdf = tmp_path / f"{name}.pdf"
    run_chromium(tmp_path, page, "--no-pdf-header-footer", f"--print-to-pdf={pdf}")
    data = pdf.read_bytes()
    boxes = re.findall(rb"/MediaBox\s*\[\s*([\d.\s]+)\]", data)
    sizes = {" ".join(f"{float(v):.0f}" for v in b.split()[2:]) for b in boxes}
    return len(re.findall(rb"/Type\s*/Page(?![s\w])", data)), sorted(sizes)


@pytest.fixture
def rendered(tiny, tmp_path):
    pytest.importorskip("bracing.report.svg")
    chromium()
    site, result = tiny
    return site, result, sheet.render(site, result, None, "html", "us")


def test_chromium_renders_each_day_with_table_plan_and_caution(rendered, tmp_path):
    _, result, html = rendered
    page = tmp_path / "schedule.html"
    page.write_text(html, encoding="utf-8")
    dom = run_chromium(tmp_path, page, "--dump-dom").stdout
    check_pages(dom, result, result.days)


def test_pages_fit_the_width_of_a4(rendered, tmp_path):
    """At A4's printable width (210 mm - 2 x 12 mm = 186 mm = 703 CSS px), nothing sticks out."""
    _, _, html = rendered
    probe = ("<script>addEventListener('load', () => { const e = document.documentElement;"
             " document.body.dataset.overflow = String(e.scrollWidth - e.clientWidth); });"
             "</script></body>")
    page = tmp_path / "probe.html"
    page.write_text(html.replace("</body>", probe), encoding="utf-8")
    dom = run_chromium(tmp_path, page, "--window-size=703,900", "--hide-scrollbars",
                       "--dump-dom").stdout
    assert re.search(r'data-overflow="(-?\d+)"', dom).group(1) == "0"


@pytest.mark.parametrize("paper, size", [("A4", "595 842"), ("letter", "612 792")])
def test_each_day_starts_a_new_sheet(tiny, tmp_path, paper, size):
    """Printed together, three days take exactly the sheets they take printed one by one."""
    pytest.importorskip("bracing.report.svg")
    chromium()
    site, result = tiny
    days = result.days[:3]
    result.days = days
    together, sizes = pdf_pages(tmp_path, sheet.render(site, result, None, "html", "us"),
                                paper, "all")
    assert sizes == [size]
    alone = [pdf_pages(tmp_path, sheet.render(site, result, d.day, "html", "us"), paper,
                       f"day{d.day}")[0] for d in days]
    assert together == sum(alone) and all(n >= 1 for n in alone)
