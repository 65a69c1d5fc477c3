"""Foundation walls in the views (issue 15 item 4): the crew sheet's backfill table (planned
against allowed, dangers first, the danger in words), a section sketch per wall backfilled
that day, the text sheet and the `check` text, and the plan's backfill sides hatched.

The demo basement (scenarios/basement-duplex.toml) is the fixture: FW-E is backfilled to 5 ft
on day 7, above what it takes as a cantilever that day (its deliberate problem); FW-W has
inside braces. The heights are the engine's (`SiteResult.foundation_walls`, worked by hand in
tests/validation/test_backfill_site_hand_checks.py); these tests check that the views show
them, in order and in words, and compute none of their own.
"""

from __future__ import annotations

import re
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest

from bracing import scenario
from bracing.evaluate import evaluate
from bracing.report import backfill_sheet, svg, text
from bracing.report import schedule as sheet

DEMO = Path(__file__).resolve().parents[1] / "scenarios" / "basement-duplex.toml"
NS = "{http://www.w3.org/2000/svg}"


@pytest.fixture(scope="module")
def basement():
    site = scenario.load(DEMO).site
    return site, evaluate(site, base_dir=DEMO.parent)


def day_of(result, mark: str, day: int):
    wall = next(w for w in result.foundation_walls if w.mark == mark)
    return next(d for d in wall.days if d.day == day)


# --- the crew sheet ------------------------------------------------------------------------------
def test_day_7_table_puts_the_danger_first_with_its_heights(basement):
    """Day 7: FW-E's 5 ft of backfill is above what it takes (`over`), so it leads the table
    with DANGER in words and the stop height; the others follow, the least margin first."""
    _, result = basement
    found = backfill_sheet.rows(result, 7)
    assert found[0].mark == "FW-E"
    first = found[0]
    e = day_of(result, "FW-E", 7)
    assert e.over and first.danger and first.word == "DANGER" and first.symbol == "✖"
    assert first.planned == f"{e.planned_height_ft:.1f} ft"
    assert first.allowed == f"{e.allowed_height_ft:.1f} ft"
    assert f"stop the backfill at {e.allowed_height_ft:.1f} ft" in first.action
    margins = [day_of(result, r.mark, 7).allowed_height_ft - day_of(result, r.mark, 7)
               .planned_height_ft for r in found[1:]]
    assert margins == sorted(margins) and not any(r.danger for r in found[1:])
    braced = next(r for r in found if r.mark == "FW-W")
    assert braced.brace.startswith("inside braces short-pipe-brace at 7.0 ft")


def test_html_sheet_of_day_7_shows_the_table_and_a_section_per_backfilled_wall(basement):
    """The HTML crew sheet: the backfill table's rows in the same order, the danger row marked,
    and one section sketch per wall with backfill in place that day (FW-E's saying DANGER)."""
    site, result = basement
    html = sheet.render(site, result, 7, "html", "us")
    order = re.findall(r'<tr class="backfill[^"]*" data-mark="([^"]+)"', html)
    assert order == [r.mark for r in backfill_sheet.rows(result, 7)]
    assert re.search(r'<tr class="backfill hold" data-mark="FW-E">', html)
    drawn = re.findall(r'<div class="backfill-section" data-mark="([^"]+)">\s*'
                       r'<figure class="backfill-section">\s*<svg', html)
    backfilled = [w.mark for w in result.foundation_walls
                  if day_of(result, w.mark, 7).planned_height_ft > 0]
    assert sorted(drawn) == sorted(backfilled) and drawn[0] == "FW-E"
    fw_e = html[html.index('<div class="backfill-section" data-mark="FW-E">'):]
    fw_e = fw_e[:fw_e.index("</svg>")]
    assert "DANGER: backfill 5 ft" in fw_e


def test_days_with_only_backfill_get_a_sheet(basement):
    """The basement's days 1 to 9 have no wall panel standing; each still has a sheet, for
    its foundation walls (the superintendent plans the backfill on them)."""
    site, result = basement
    out = sheet.render(site, result, None, "text", "us")
    for day in range(2, 10):
        assert f"day {day}, " in out, day
    assert out.count("BACKFILL BEFORE THE FLOOR") >= 8


def test_text_sheet_of_day_7_says_it_in_words(basement):
    site, result = basement
    out = " ".join(sheet.render(site, result, 7, "text", "us").split())
    block = out[out.index("BACKFILL BEFORE THE FLOOR"):out.index("RELEASES TODAY")]
    assert block.index("DANGER: FW-E: planned 5.0 ft, allowed 2.3 ft") < block.index("FW-N")
    assert "inside braces short-pipe-brace" in block


# --- the check report ----------------------------------------------------------------------------
def test_check_text_names_the_wall_and_its_dangerous_day(basement):
    """`check`: the first line names FW-E among the failing; the foundation walls' block lists
    it first, FAILS, with its days in runs and day 7 marked DANGER."""
    _, result = basement
    out = text.site_text(result)
    assert "(FW-E)" in out.splitlines()[0]
    flat = " ".join(out.split())
    block = flat[flat.index("FOUNDATION WALLS BACKFILLED BEFORE THE FLOOR"):]
    assert block.index("FW-E plain") < block.index("FW-N plain")
    assert "FW-E plain 9.0 ft tall x 8.00 in: FAILS" in block
    assert "day 7: 5.0 ft of 2.3 ft DANGER" in block


def test_day_runs_join_days_alike():
    """Days with the same heights, support and danger are said once, as a run; the top support
    from its first day on."""
    class D:
        def __init__(self, day, planned, allowed, support="cantilever", over=False):
            self.day, self.planned_height_ft, self.allowed_height_ft = day, planned, allowed
            self.support, self.over = support, over

    days = [D(2, 0, 2.7), D(3, 0, 2.7), D(4, 2, 2.3), D(5, 2, 2.7, over=False),
            D(6, 5, 2.7, over=True), D(7, 5, 9, "top support"), D(8, 7, 9, "top support")]
    assert backfill_sheet.day_runs(days) == [
        "days 2-3: 0.0 ft of 2.7 ft", "day 4: 2.0 ft of 2.3 ft", "day 5: 2.0 ft of 2.7 ft",
        "day 6: 5.0 ft of 2.7 ft DANGER", "from day 7: top support"]


# --- the plan ------------------------------------------------------------------------------------
def backfill_polygons(document: str) -> dict[str, str]:
    root = ET.fromstring(document.encode())
    return {p.get("data-mark"): p.get("class") for p in root.iter(f"{NS}polygon")
            if (p.get("class") or "").split()[:1] == ["backfill"]}


def test_plan_hatches_the_backfill_side_of_walls_backfilled_that_day(basement):
    """Day 7: every wall with backfill in place has its backfill side hatched; FW-E's is the
    danger, labelled in words. Day 1: nothing is backfilled, nothing hatched. The hatch lies on
    the side away from the line's braced side (outside the basement)."""
    _, result = basement
    day7 = svg.overview_svg(result, 7)
    hatched = backfill_polygons(day7)
    backfilled = {w.mark for w in result.foundation_walls
                  if day_of(result, w.mark, 7).planned_height_ft > 0}
    assert set(hatched) == backfilled
    assert hatched["FW-E"] == "backfill danger"
    assert all(c == "backfill" for m, c in hatched.items() if m != "FW-E")
    assert ">FW-E DANGER: backfill 5 ft<" in day7
    assert "backfill against a foundation wall" in day7
    assert backfill_polygons(svg.overview_svg(result, 1)) == {}
    g = svg.pick_plan(result.plan, 7)
    south = next(w for w in g.foundation_walls if w.mark == "FW-S")
    assert max(y for _, y in south.backfill) <= 1e-9  # FW-S's fill lies south of its line


def test_si_sketches_and_plan_hold_no_us_unit(basement):
    """SI words throughout, and the sketch says the allowed height as the table does (rounded
    once, in metres: 2.72 ft = 0.83 m, not 2.7 ft = 0.82 m)."""
    _, result = basement
    sketches = dict(backfill_sheet.sketches(result, 7, "si"))
    for r in backfill_sheet.rows(result, 7, "si"):
        if r.mark in sketches and not r.danger and not r.brace:
            assert f">allowed {r.allowed} before the floor<" in sketches[r.mark], r.mark
    drawn = list(sketches.values())
    drawn.append(svg.overview_svg(result, 7, units="si"))
    for out in drawn:
        words = " ".join(re.findall(r">([^<>]+)<", out))
        hit = re.search(r"(?<![A-Za-z_])(mph|ft|lbf?|lbs|psf|pcf|plf|psi|in)(?![A-Za-z_])",
                        words)
        assert hit is None, words[max(0, hit.start() - 60):hit.end() + 20]


def test_a_day_governed_by_a_foundation_wall_gives_its_sustained_equivalents(basement):
    """Day 1 of the demo stands foundation walls only: the sheet's stand-down gust is the
    lowest of theirs (the wind part), and its sustained equivalents are that gust over the
    gust factors of the ASCE 7-16 commentary curve, open terrain (from memory): 1-min 1.22,
    2-min 1.30, 10-min 1.43; e.g. 94 mph / 1.22 = 77 mph."""
    site, result = basement
    day = next(d for d in result.days if d.day == 1)
    assert day.governing_wall in day.foundation_standing
    gust = day.stand_down_speed_mph
    out = " ".join(sheet.render(site, result, 1, "text", "us").split())
    assert f"stand-down gust {gust:.0f} mph ({day.governing_wall})" in out
    assert (f"1-min mean {gust / 1.22:.0f} mph, 2-min mean {gust / 1.30:.0f} mph, 10-min mean "
            f"{gust / 1.43:.0f} mph") in out
    assert "working limit none" not in out
