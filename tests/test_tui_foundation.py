"""The demo basement's deliberate problem in the terminal interface (issue 15, item 4 and its
acceptance): FW-E, backfilled to 5.0 ft on day 7 before the floor deck of day 9, is shown as a
danger on the Walls view, on its own screen and in day 7's Day view, where the verdict names it;
no pass mark stands beside it, and at 80 x 24 the caution, the verdict and the quit key are on
screen.

The heights checked are the site file's own inputs (scenarios/basement-duplex.toml: FW-E's
backfill event of day 7 at 5.0 ft, the deck event of day 9); the rest is checked against the
result object (`FoundationWallResult.fails`, its days and checks), never against numbers of
our own.
"""

from __future__ import annotations

from test_tui import cells
from test_tui_screen import copy_site, drive, screen_text
from textual.widgets import DataTable

from bracing import scenario
from bracing.report.text import check_values
from tui import app as tui_app
from tui import foundation
from tui.app import BracingApp
from tui.drawing import (
    BRACE,
    FILLED,
    FOUNDATION,
    FOUNDATION_LATER,
    OVERFILLED,
    UNFILLED,
    WALL,
)
from tui.foundation_view import FoundationScreen

SMALL = (80, 24)


def _app(tmp_path):
    path = copy_site("basement-duplex", tmp_path)
    result = tui_app.compute(scenario.load(path))
    walls = {w.mark: w for w in result.foundation_walls}
    # the engine's verdict the screens must show: FW-E fails, over its limit on day 7
    assert walls["FW-E"].fails and next(d for d in walls["FW-E"].days if d.day == 7).over
    return BracingApp(path, result=result), result


def _screen_cells(app: BracingApp, table_id: str) -> list[list[str]]:
    """A table's cells on the screen on top (the foundation wall's)."""
    table = app.screen.query_one(table_id, DataTable)
    return [[str(c) for c in table.get_row_at(r)] for r in range(table.row_count)]


def _lines_with(text: str, word: str) -> list[str]:
    return [line for line in text.splitlines() if word in line]


def _essentials_on_screen(text: str) -> None:
    lines = text.splitlines()
    assert "⚠ CAUTION" in lines[0]
    assert "q Quit" in lines[-1]


def test_the_walls_view_lists_fw_e_as_a_danger_first_with_no_pass_mark(tmp_path):
    """FW-E leads the foundation walls' table (it fails: FoundationWallResult.fails), says
    'BACKFILL TOO HIGH' and 'FAILS' with its planned 5.0 ft of day 7 (the site file's event),
    and shows no pass mark; the status line counts it (no '✓ none ... fails'). At 80 x 24 the
    caution, the quit key and the table's essential columns are on screen."""
    app, result = _app(tmp_path)

    async def steps(pilot):
        rows = cells(app, "#foundation-table")
        assert rows[0][0] == "FW-E"
        assert rows[0][1] == "✗ BACKFILL TOO HIGH" and rows[0][2] == "✗ FAILS"
        assert rows[0][3] == "5.0 ft (day 7)"
        assert "✓" not in "".join(rows[0])
        text = screen_text(app)
        _essentials_on_screen(text)
        header = _lines_with(text, "Planned")[0]
        for column in ("Wall", "Status", "Verdict", "Planned", "Allowed"):
            assert column in header
        (fw_e,) = _lines_with(text, "FW-E")
        assert "BACKFILL TOO HIGH" in fw_e and "FAILS" in fw_e and "✓" not in fw_e
        failing = sum(w.fails for w in [*result.panels, *result.foundation_walls])
        assert f"✗ {failing} of 6 walls fail" in text and "✓ none" not in text
        # the foundation walls' table comes first (a wall of it fails) and has the cursor
        assert app.focused.id == "foundation-table"

    drive(app, steps, size=SMALL)


def test_day_7_names_fw_e_in_the_verdict_and_shows_its_backfill_row(tmp_path):
    """Day 7's verdict on screen is the engine's (DayResult.verdict, NO-GO) and names FW-E;
    the foundation walls' rows of the day follow, FW-E's a DANGER, planned 5.0 ft (the site
    file's event) against the allowed height of that day (BackfillDay.allowed_height_ft)."""
    app, result = _app(tmp_path)
    day = next(d for d in result.days if d.day == 7)
    fw_e = next(w for w in result.foundation_walls if w.mark == "FW-E")
    allowed = next(d for d in fw_e.days if d.day == 7).allowed_height_ft

    async def steps(pilot):
        await pilot.press("3")
        app.day = 7
        await pilot.pause()
        text = screen_text(app)
        _essentials_on_screen(text)
        verdict = _lines_with(text, day.verdict)
        assert day.verdict == "NO-GO" and any("✗ NO-GO: FW-E" in line for line in verdict)
        (row,) = _lines_with(text, "DANGER FW-E")
        assert f"planned 5.0 ft, allowed {allowed:.1f} ft" in row
        assert "✓" not in row

    drive(app, steps, size=SMALL)


def test_enter_on_fw_e_opens_its_screen_with_checks_worst_first_and_its_days(tmp_path):
    """Enter on FW-E's row: its own screen with the verdict in words, no pass mark beside it,
    its checks worst first as the result holds them, and its days 7 to 9 marked DANGER (the
    result's BackfillDay.over); Esc goes back to the views."""
    app, result = _app(tmp_path)
    fw_e = next(w for w in result.foundation_walls if w.mark == "FW-E")
    worst = max(fw_e.checks, key=lambda c: c.utilization)

    async def steps(pilot):
        await pilot.press("enter")
        await pilot.pause()
        assert isinstance(app.screen, FoundationScreen)
        text = screen_text(app)
        _essentials_on_screen(text)
        (title,) = _lines_with(text, "FW-E  ")
        assert "✗ BACKFILL TOO" in title and "✓" not in title
        assert "✗ FAILS" in text
        checks = _screen_cells(app, "#foundation-checks")
        assert checks[0][2] == worst.region
        assert checks[0][3:5] == list(check_values(worst, "us"))
        danger = [int(r[0]) for r in _screen_cells(app, "#foundation-days") if "DANGER" in r[4]]
        assert danger == [d.day for d in fw_e.days if d.over] == [7, 8, 9]
        await pilot.press("escape")
        await pilot.pause()
        assert not isinstance(app.screen, FoundationScreen)

    drive(app, steps, size=SMALL)


def test_a_site_without_foundation_walls_shows_no_foundation_table(tmp_path):
    """demo-mixed has no foundation walls: their table is hidden and the walls' table keeps
    the cursor."""
    app = BracingApp(copy_site("demo-mixed", tmp_path))

    async def steps(pilot):
        assert not app.query_one("#walls-foundation").display
        assert app.focused.id == "walls-table"

    drive(app, steps, size=SMALL)


def test_the_section_sketch_draws_the_limit_inside_the_backfill_only_where_it_is_over(tmp_path):
    """FW-E's backfill (5.0 ft planned, the site file) is over the most it takes as a
    cantilever (FoundationWallResult.max_height_ft, under 5.0 ft): the sketch's limit line runs
    through the backfill, below its top. FW-W (6.0 ft planned, with inside braces taking more,
    InsideBraceResult.max_height_ft) has its limit line above the backfill, and its brace
    drawn."""
    _, result = _app(tmp_path)
    walls = {w.mark: w for w in result.foundation_walls}
    assert walls["FW-E"].max_height_ft < 5.0 < walls["FW-E"].height_ft
    assert walls["FW-W"].inside_brace.max_height_ft > 6.0

    def rows_of(lines, marks):
        return [k for k, line in enumerate(lines) if any(m in line for m in marks)]

    for mark, over in (("FW-E", True), ("FW-W", False)):
        lines = foundation.section(walls[mark], "us")
        drawing_lines = lines[:lines.index(next(x for x in lines if x.startswith(WALL)))]
        fill = rows_of(drawing_lines, (foundation.SOIL, foundation.PRESSURE))
        (limit,) = rows_of(drawing_lines, (foundation.LIMIT,))
        assert (limit > min(fill)) is over, (mark, limit, fill)
        assert any(BRACE in line for line in drawing_lines) is (mark == "FW-W")


def _plan_canvas(app: BracingApp) -> tuple[str, str]:
    """The Plan view's drawing and its key (the symbols' line, the scale and what follows)."""
    lines = str(app.query_one("#plan-canvas").render()).splitlines()
    scale = next(i for i, line in enumerate(lines) if line.startswith("one column ="))
    return "\n".join(lines[1:scale - 1]), "\n".join(lines[scale - 1:])


def test_the_plan_draws_the_foundation_walls_of_the_day_and_marks_fw_e_over(tmp_path):
    """The Plan view (key 4) draws the foundation walls in their own character, with their
    backfill side hatched on the day it is in place, and FW-E's day-7 backfill (5.0 ft, the site
    file's event) marked by its own symbol and DANGER in words (BackfillDay.over, the result's),
    not by colour; the key lists each wall with its backfill. Day 1: FW-E and FW-W (built on day
    2, the site file) not yet built, no backfill anywhere: the backfill sides outlined."""
    app, result = _app(tmp_path)
    fw_e = next(w for w in result.foundation_walls if w.mark == "FW-E")
    assert next(d for d in fw_e.days if d.day == 7).over

    async def steps(pilot):
        await pilot.press("4")
        app.day = 7
        await pilot.pause()
        drawn, plan = _plan_canvas(app)
        assert FOUNDATION in drawn and OVERFILLED in drawn and FILLED in drawn
        assert WALL not in drawn  # no panel stands before day 10: only foundation walls
        (fw_e_row,) = [line for line in drawn.splitlines() if "FW-E" in line]
        assert OVERFILLED in fw_e_row  # its label sits in its hatched backfill side
        (key,) = _lines_with(plan, "FW-E (Basement east)")
        assert key.startswith(f"{OVERFILLED} ") and "DANGER: backfill 5.0 ft" in key
        (key,) = _lines_with(plan, "FW-W (Basement west)")
        assert "backfill 6.0 ft" in key and "DANGER" not in key
        assert f"{OVERFILLED} backfill above what the wall takes: DANGER" in plan
        app.day = 1
        await pilot.pause()
        drawn, plan = _plan_canvas(app)
        assert FOUNDATION_LATER in drawn and FILLED not in drawn and OVERFILLED not in drawn
        assert UNFILLED in drawn  # the backfill side outlined before any backfill
        assert "FW-E (Basement east): not yet built" in plan
        assert f"FW-S (Basement south): no backfill yet on its {UNFILLED} side" in plan

    drive(app, steps)


def test_the_plan_draws_fw_w_inside_braces_on_the_days_they_are_in_use(tmp_path):
    """FW-W's inside braces (the result's inside_brace: count, height, days in use) are drawn
    in the Plan view and named in its key on a day they are in use, and are gone the day after
    their last (the result's in_use_to_day)."""
    app, result = _app(tmp_path)
    brace = next(w for w in result.foundation_walls if w.mark == "FW-W").inside_brace

    async def steps(pilot):
        await pilot.press("4")
        app.day = brace.in_use_from_day
        await pilot.pause()
        drawn, plan = _plan_canvas(app)
        (key,) = _lines_with(plan, "FW-W (Basement west)")
        assert f"{brace.count} inside braces (•) at {brace.height_ft:.1f} ft" in key, key
        assert "•" in drawn
        app.day = brace.in_use_to_day + 1
        await pilot.pause()
        drawn, plan = _plan_canvas(app)
        (key,) = _lines_with(plan, "FW-W (Basement west)")
        assert "inside braces" not in key and "•" not in drawn

    drive(app, steps)
