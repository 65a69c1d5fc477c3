"""Views compute nothing (issue 14 item 3): the reports and the terminal views format the
result object; the engine runs in `evaluate`, and files are read at the edges.

No published values here: these tests guard where the work is done, not its numbers (the
numbers are guarded by tests/test_golden_records.py and the sheet tests).
"""

from __future__ import annotations

import ast
from dataclasses import replace
from pathlib import Path

import pytest
from test_schedule import TINY_TOML, WX_CSV

from bracing import schedule
from bracing.evaluate import evaluate
from bracing.report import schedule as sheet
from bracing.results import FallZone
from bracing.scenario import SiteFileError, parse

REPO = Path(__file__).resolve().parents[1]
ENGINE = ("bracing.schedule", "bracing.evaluate", "bracing.stages")
# the terminal interface's two edges: they run the engine (in a worker), as the command does
TUI_EDGES = {"engine.py", "design.py"}


def _imports(path: Path) -> set[str]:
    """The modules a file imports, at any depth (lazy imports inside functions included)."""
    out = set()
    for node in ast.walk(ast.parse(path.read_text(encoding="utf-8"))):
        if isinstance(node, ast.Import):
            out.update(a.name for a in node.names)
        elif isinstance(node, ast.ImportFrom) and node.module:
            out.add(node.module)
            out.update(f"{node.module}.{a.name}" for a in node.names)
    return out


def _views() -> list[Path]:
    report = sorted((REPO / "bracing" / "report").rglob("*.py"))
    tui = [p for p in sorted((REPO / "tui").glob("*.py")) if p.name not in TUI_EDGES]
    return report + tui


@pytest.mark.parametrize("path", _views(), ids=lambda p: str(p.relative_to(REPO)))
def test_views_do_not_import_the_engines_computing_modules(path):
    """No report module, and no terminal view but the two that run the engine, imports the
    days, the evaluation or its stages: what they show is in SiteResult."""
    used = [m for m in _imports(path) if any(m == e or m.startswith(e + ".") for e in ENGINE)]
    assert not used, f"{path.name} imports {used}"


def _site():
    return parse(TINY_TOML, "site.toml").site


def test_evaluate_takes_the_forecast_read_at_the_edge(tmp_path):
    """The forecast's contents passed in are used, and no file is read: the site names
    wx.csv, which is not there."""
    forecast = {1: schedule.ForecastDay(gust_mph=20.0, storm=False),
                2: schedule.ForecastDay(gust_mph=15.0, storm=True)}
    result = evaluate(_site(), base_dir=tmp_path, forecast=forecast)
    assert [(d.forecast_gust_mph, d.storm) for d in result.days[:2]] == [(20.0, False),
                                                                        (15.0, True)]
    with pytest.raises(SiteFileError, match="wx.csv"):  # without it: read from base_dir
        evaluate(_site(), base_dir=tmp_path)


def test_the_forecast_is_read_beside_the_site_file(tmp_path):
    """`site_forecast` is the edge: the site's [forecast] file, relative to its folder."""
    (tmp_path / "wx.csv").write_text(WX_CSV, encoding="utf-8")
    forecast = schedule.site_forecast(_site(), tmp_path)
    assert forecast[1] == schedule.ForecastDay(gust_mph=20.0, storm=False)


@pytest.fixture(scope="module")
def tiny(tmp_path_factory):
    folder = tmp_path_factory.mktemp("tiny")
    (folder / "wx.csv").write_text(WX_CSV, encoding="utf-8")
    site = _site()
    return site, evaluate(site, base_dir=folder)


def _unwrapped(text: str) -> str:
    """The sheet's text with its lines folded back (words apart by one space)."""
    return " ".join(text.split())


def test_the_sheet_shows_the_zone_and_gear_the_result_holds(tiny):
    """The crew sheet prints the fall zone and the brace type of the result, not ones it works
    out again from the site: a zone and a type changed in the result show on the sheet."""
    site, result = tiny
    a = result.panel("A")
    zone, hardware = a.zone, a.hardware
    a.zone = FallZone(front_ft=123.4, back_ft=56.7, basis="changed")
    a.hardware = replace(a.hardware, brace_type="other-brace")
    try:
        out = _unwrapped(sheet.render(site, result, 1, "text", "us"))
    finally:
        a.zone, a.hardware = zone, hardware
    assert "zone 123.4 ft braced side, 56.7 ft behind" in out
    assert "braces other-brace" in out


def test_the_sheet_shows_the_numbers_on_hand_and_rules_the_result_holds(tiny):
    """Inventory and rules come from the result (SiteResult.on_hand, SiteResult.rules)."""
    site, result = tiny
    on_hand, rules = result.on_hand, result.rules
    result.on_hand = {"braces": {"b1": 77}, "anchors": {}}
    result.rules = {**rules, "stand_down_ratio": replace(rules["stand_down_ratio"],
                                                         source="changed source")}
    try:
        out = _unwrapped(sheet.render(site, result, 1, "text", "us"))
    finally:
        result.on_hand, result.rules = on_hand, rules
    assert "brace b1: 2 / 77 ✔ ok" in out
    assert "stand_down_ratio = 0.8 (changed source;" in out


def test_the_whole_site_day_is_in_the_result():
    """A site file without lift days: the sheet of every wall standing together is day 0 of
    the result (SiteResult.together), which the sheet prints."""
    toml = "\n".join(line for line in TINY_TOML.splitlines() if not line.startswith("lift_day"))
    site = parse(toml).site.model_copy(update={"forecast": None})
    result = evaluate(site)
    assert result.days == [] and result.together.day == 0
    result.together = replace(result.together, standing=["A"], released=[])
    out = sheet.render(site, result, None, "text", "us")
    assert "WALLS STANDING (1)" in out
