"""The terminal interface, driven as a user drives it (Textual's pilot): open a site, move between
the views, edit a value and see the engine's answer, refuse an invalid value without losing the
last valid state, undo, save and reload with comments intact, export a day's schedule, quit.

The interface computes nothing: every value it shows comes from the engine's result object, so
these tests check what is shown against that object, never against numbers of their own.
"""

from __future__ import annotations

import asyncio
import csv
import io
from pathlib import Path

import pytest
from textual.widgets import DataTable, Input, RadioButton, TabbedContent

from bracing import scenario
from bracing.results import CAUTION
from tui import app as tui_app
from tui import dialogs, drawing
from tui.app import BracingApp, run
from tui.choice import Choice
from tui.dialogs import Export, SaveAs, UnsavedChanges
from tui.fields import typed, wall_fields
from tui.widgets import Caution, FieldRow

SIZE = (120, 40)

# A small site: a braced panel and an unbraced one on a wall line, lift days, a slab and a crane
# path, a fresh masonry wall and a low cured one that stands. Comments must survive a save.
SITE = """\
# Test site for the terminal interface. Comments must survive a save.
version = 1

[site]
name = "Test yard"
start_date = 2026-03-02
basic_wind_speed = "115 mph"   # ASCE 7-16 basic wind speed
exposure = "C"                 # open terrain
construction_period = "5 weeks"

[rules.stand_down_ratio]
value = 0.8
source = "test rule"
basis = "stand-down speed = ratio x working-limit speed"

[materials.tilt]
kind = "concrete"
unit_weight = "150 pcf"        # normal-weight concrete
compressive_strength = "3000 psi"

[materials.cmu8]
kind = "masonry"
face_weight = "36 psf"         # 8 in hollow CMU
grouting = "hollow"

[brace_types.adjustable-40]
kind = "rated"
lengths = ["24 ft", "28 ft", "32 ft", "36 ft", "40 ft"]
loads = ["7200 lb", "6100 lb", "5000 lb", "4100 lb", "3400 lb"]
tension_capacity = "6000 lb"
on_hand = 3

[anchor_types.panel-insert]
kind = "insert"
rated_tension = "9000 lb"
rated_shear = "9000 lb"

[anchor_types.slab-wedge]
kind = "slab"
embedment = "4.5 in"
diameter = "0.75 in"
steel_area = "0.334 in^2"
pullout = "9000 lb"
slab_thickness = "6 in"
concrete_strength = "3000 psi"
edge_distance = "12 in"
on_hand = 10

[plan]
slab = [[0, 0], [80, 0], [80, 50], [0, 50]]
[[plan.areas]]
name = "Crane path"
kind = "crane_path"
polygon = [[50, 30], [78, 30], [78, 48], [50, 48]]

[[lines]]
name = "north"
start = [5, 5]
end = [75, 5]
braced_side = "left"

# ---- panels ----
[[panels]]
mark = "P-1"
material = "tilt"
width = "24 ft"
height = "30 ft"               # top of the panel above grade
thickness = "7.25 in"
line = "north"
offset = "0 ft"
lift_day = 1
[panels.bracing]
brace_type = "adjustable-40"
wall_anchor = "panel-insert"
foot_anchor = "slab-wedge"
count = 2
insert_height = "20 ft"
angle = "55 deg"

[[panels]]
mark = "P-2"
material = "tilt"
width = "24 ft"
height = "30 ft"
thickness = "7.25 in"
line = "north"
offset = "24.5 ft"
lift_day = 2

[[panels]]
mark = "M-1"
material = "cmu8"
width = "40 ft"
height = "6 ft"
thickness = "7.625 in"
mortar_age = "2 days"
lift_day = 2

[[panels]]
mark = "M-2"
material = "cmu8"
width = "24 ft"
height = "4 ft"                # a low garden wall
thickness = "7.625 in"
mortar_age = "40 days"
lift_day = 3
"""


@pytest.fixture(scope="session")
def demo_result():
    return tui_app.compute(scenario.load(tui_app.DEMO))


@pytest.fixture
def site_path(tmp_path):
    """The test site written to a temporary folder."""
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    return path


def drive(app: BracingApp, steps, size=SIZE) -> None:
    """Run the app headless (at 120 x 40 unless `size` says) and play `steps(pilot)`."""
    async def main():
        async with app.run_test(size=size) as pilot:
            await pilot.pause()
            await steps(pilot)
    asyncio.run(main())


async def settle(pilot) -> None:
    """Wait for the engine's recompute and the redraw."""
    await pilot.app.workers.wait_for_complete()
    await pilot.pause()


async def enter(pilot, field_id: str, text: str) -> FieldRow:
    """Type `text` into a field of the form on view and press Enter."""
    row = pilot.app.query_one(f"#field-{field_id}", FieldRow)
    box = row.query_one(Input)
    box.focus()
    await pilot.pause()
    box.value = text
    await pilot.press("enter")
    await settle(pilot)
    return row


def cells(app: BracingApp, table_id: str) -> list[list[str]]:
    table = app.query_one(table_id, DataTable)
    return [[str(c) for c in table.get_row_at(r)] for r in range(table.row_count)]


def caution_on_top(app: BracingApp) -> bool:
    widget, _ = app.screen.get_widget_at(3, 0)
    return isinstance(widget, Caution) and str(widget.render()).startswith("⚠ " + CAUTION[:20])


# --- opening and moving between views ---------------------------------------------------------
def test_demo_site_opens_and_every_view_shows_the_caution(demo_result):
    app = BracingApp(None, result=demo_result)
    assert app.demo and Path(app.site_file.path) == tui_app.DEMO

    async def steps(pilot):
        tabs = app.query_one(TabbedContent)
        for key, view in (("1", "walls"), ("2", "wall"), ("3", "day"), ("4", "plan"),
                          ("5", "settings"), ("question_mark", "keys"), ("1", "walls")):
            await pilot.press(key)
            await pilot.pause()
            assert tabs.active == view
            assert caution_on_top(app), view
        rows = cells(app, "#walls-table")
        assert [r[0] for r in rows] == [p.mark for p in demo_result.worst_first()]
        keys = {r[0] for r in cells(app, "#keys-table")}
        assert {"1", "2", "3", "4", "5", "? / f1", "[", "]", "ctrl+z", "ctrl+s", "e", "q"} <= keys
        app.query_one("#walls-table", DataTable).move_cursor(row=1)
        await pilot.press("enter")  # the keyboard opens the wall under the cursor
        await pilot.pause()
        assert tabs.active == "wall" and app.mark == rows[1][0]

    drive(app, steps)


def test_walls_worst_first_filters_then_a_wall_with_every_check_and_its_drawings(site_path):
    app = BracingApp(site_path)

    async def steps(pilot):
        rows = cells(app, "#walls-table")
        worst = app.result.worst_first()
        assert [r[0] for r in rows] == [p.mark for p in worst]
        for row, p in zip(rows, worst, strict=True):  # a symbol and a word, never colour alone
            assert row[1] == {"unsafe": "✗ UNSAFE", "needs_braces": "▲ NEEDS BRACES",
                              "braced": "✓ braced", "stands": "✓ stands"}[p.status] \
                or (p.fails and row[1] == f"✗ {p.status}, DANGER")
            assert row[3] == ("✗ FAILS" if p.fails else "✓ ok")
            assert row[4].endswith("✗") == (p.utilization > 1.0)
        app.query_one("#filter-status", Choice).value = "stands"
        await pilot.pause()
        assert [r[0] for r in cells(app, "#walls-table")] == \
            [p.mark for p in worst if p.status == "stands"]
        app.query_one("#filter-status", Choice).value = "*"
        app.query_one("#filter-day", Choice).value = 1
        await pilot.pause()
        assert [r[0] for r in cells(app, "#walls-table")] == ["P-1"]  # day 1: only P-1 stands
        app.query_one("#filter-day", Choice).value = "*"
        app.query_one("#filter-material", Choice).value = "masonry"
        await pilot.pause()
        assert {r[0] for r in cells(app, "#walls-table")} == {"M-1", "M-2"}
        app.query_one("#filter-material", Choice).value = "*"
        await pilot.pause()

        for _ in range(2):  # the mouse: a click on a row marks it, a second click opens it
            await pilot.click("#walls-table", offset=(3, 1))
            await pilot.pause()
        assert app.query_one(TabbedContent).active == "wall"
        p = worst[0]
        assert app.mark == p.mark == "P-1"
        rows = cells(app, "#checks-table")
        assert [(r[1], r[2]) for r in rows] == [(c.element, c.region) for c in p.worst_first()]
        for row, c in zip(rows, p.worst_first(), strict=True):
            assert row[0] == ("✓ ok" if c.passes else "✗ FAIL")
            assert row[7] == c.source and row[6] == c.combination
        summary = str(app.query_one("#wall-summary").render())
        assert "✗ UNSAFE" in summary and p.governing_element in summary
        section = str(app.query_one("#wall-section").render())
        assert "●" in section and "▲" in section and f"{p.braces['angle_deg']:.0f}°" in section
        elevation = str(app.query_one("#wall-elevation").render())
        assert elevation.count("●") >= p.braces["count"]
        ids = [s.field_id for s in wall_fields(app.site_file, "P-1")]
        assert {"height", "width", "thickness", "bracing-count", "bracing-insert-height",
                "bracing-angle"} <= set(ids)
        await pilot.press("right_square_bracket")  # the next wall, worst first
        await pilot.pause()
        assert app.mark == worst[1].mark

    drive(app, steps)


def test_day_and_plan_views_show_the_days_result(site_path):
    app = BracingApp(site_path)

    async def steps(pilot):
        await pilot.click("#--content-tab-day")  # the mouse on the tab
        await pilot.pause()
        assert app.query_one(TabbedContent).active == "day"
        d = app.result.days[0]
        summary = str(app.query_one("#day-summary").render())
        assert f"Lifts ({len(d.lifts)}): {', '.join(d.lifts)}" in summary
        # the verdict first: no forecast, and P-1 (lifted today) fails: do not lift it
        assert str(app.query_one(".day-verdict").render()) == "? NO CALL"
        assert summary.startswith("? NO CALL: do not lift P-1")
        assert "no forecast gust" in summary.lower()
        inventory = cells(app, "#day-inventory")
        assert ["adjustable-40", "brace", "2", "3", "✓ enough"] in inventory
        await pilot.press("right_square_bracket")
        await pilot.pause()
        assert app.day == 2
        assert "Walls standing (3)" in str(app.query_one("#day-summary").render())
        await pilot.press("4")
        await pilot.pause()
        canvas = str(app.query_one("#plan-canvas").render())
        assert "█" in canvas and "P-2" in canvas and "░" in canvas and "crane path" in canvas
        await pilot.press("plus")
        await pilot.pause()
        zoomed = str(app.query_one("#plan-canvas").render())
        assert zoomed.startswith("Zoom x2")  # the slab's top edge, twice as long
        assert len(zoomed.splitlines()[1]) > 1.8 * len(canvas.splitlines()[1])

    drive(app, steps)


# --- editing ----------------------------------------------------------------------------------
def test_edit_recompute_refuse_invalid_undo_redo_save_and_reload(site_path):
    """One wall's height: edited (its status changes), refused when invalid (the message by the
    field, the last valid state kept), undone and redone, two quick edits (the latest wins);
    the site's wind speed edited in the settings; then saved (comments kept, the old file as
    .bak) and reloaded."""
    app = BracingApp(site_path)

    async def steps(pilot):
        assert app.result.panel("M-2").status == "stands"
        app.mark = "M-2"
        await pilot.press("2")
        await pilot.pause()
        row = await enter(pilot, "height", "12 ft")
        assert app.result.panel("M-2").status == "needs_braces"
        assert app.result.panel("M-2").height_ft == 12.0
        assert "▲ NEEDS BRACES" in str(app.query_one("#wall-summary").render())
        assert app.dirty and row.error == ""

        before_file, before_result = app.site_file, app.result
        for text, words in (("-3 ft", "greater than 0"), ("31 kg", "not a length"),
                            ("", "required")):
            await enter(pilot, "height", text)
            assert words in row.error and row.has_class("-invalid")
            assert str(row.query_one(".field-error").render()).startswith("✗ ")
            assert app.site_file is before_file and app.result is before_result
            assert len(app.undo_stack) == 1

        await pilot.press("ctrl+z")
        await settle(pilot)
        assert row.query_one(Input).value == "4 ft" and row.error == ""
        assert app.result.panel("M-2").status == "stands" and not app.dirty
        await pilot.press("ctrl+y")
        await settle(pilot)
        assert app.result.panel("M-2").status == "needs_braces"

        box = row.query_one(Input)
        box.focus()
        for text in ("9 ft", "5 ft"):
            box.value = text
            await pilot.press("enter")
        await settle(pilot)
        assert app.result.panel("M-2").height_ft == 5.0 and not app.busy

        await pilot.press("escape", "5")  # leave the field; the settings: rules, wind basis
        await pilot.pause()
        rules = {r[0]: r for r in cells(app, "#rules-table")}
        assert rules["stand down ratio"][3] == "test rule"
        assert rules["minimum design wind mph"][2] == "✗ no (off)"
        assert app.result.basis_statement[0][:40] in str(app.query_one("#settings-basis").render())
        before = app.result.panel("P-1").wind.design_speed_mph
        await enter(pilot, "site-basic-wind-speed", "130 mph")
        assert app.result.panel("P-1").wind.basic_speed_mph == 130.0
        assert app.result.panel("P-1").wind.design_speed_mph > before

        await pilot.press("ctrl+s")
        await pilot.pause()
        assert not app.dirty

    drive(app, steps)
    saved = site_path.read_text(encoding="utf-8")
    assert saved == SITE.replace(
        'height = "4 ft"                # a low garden wall',
        'height = "5 ft"                # a low garden wall').replace(
        'basic_wind_speed = "115 mph"   # ASCE 7-16', 'basic_wind_speed = "130 mph"   # ASCE 7-16')
    assert site_path.with_name("site.toml.bak").read_text(encoding="utf-8") == SITE
    reloaded = scenario.load(site_path).site
    assert reloaded.panels[3].height == 5.0 and reloaded.site.basic_wind_speed == 130.0


# --- files ------------------------------------------------------------------------------------
def test_save_as_writes_a_new_file_the_demo_is_never_overwritten_and_q_quits(tmp_path, demo_result,
                                                                      monkeypatch):
    monkeypatch.chdir(tmp_path)
    demo_text = tui_app.DEMO.read_text(encoding="utf-8")
    app = BracingApp(None, result=demo_result)

    async def steps(pilot):
        await pilot.press("ctrl+s")  # a demo site asks for a name
        await pilot.pause()
        assert isinstance(app.screen, SaveAs)
        app.screen.query_one(Input).value = str(tmp_path / "mine.toml")
        await pilot.press("enter")
        await pilot.pause()
        assert not app.demo and app.file_name == "mine.toml"
        await pilot.press("q")  # nothing unsaved: quits at once
        await pilot.pause()

    drive(app, steps)
    assert app.return_code == 0
    assert (tmp_path / "mine.toml").read_text(encoding="utf-8") == demo_text
    assert tui_app.DEMO.read_text(encoding="utf-8") == demo_text


def test_quit_asks_when_there_are_unsaved_changes(site_path):
    app = BracingApp(site_path)

    async def steps(pilot):
        app.mark = "M-2"
        await pilot.press("2")
        await pilot.pause()
        await enter(pilot, "height", "5 ft")
        await pilot.press("escape", "q")
        await pilot.pause()
        assert isinstance(app.screen, UnsavedChanges)
        await pilot.press("escape")  # stay
        await pilot.pause()
        assert not isinstance(app.screen, UnsavedChanges) and app.is_running
        await pilot.press("q", "d")  # quit without saving
        await pilot.pause()

    drive(app, steps)
    assert app.return_code == 0
    assert site_path.read_text(encoding="utf-8") == SITE


def test_export_writes_the_days_schedule_in_each_format(site_path, tmp_path):
    app = BracingApp(site_path)

    async def steps(pilot):
        for fmt in ("html", "csv", "text"):
            await pilot.press("e")
            await pilot.pause()
            dialog = app.screen
            assert isinstance(dialog, Export)
            dialog.query_one(f"#format-{fmt}", RadioButton).value = True
            dialog.query_one("#export-day", Choice).value = 2
            await pilot.pause()
            path = dialog.query_one("#export-path", Input)
            assert path.value == str(site_path.parent /
                                     f"site-schedule-day2.{dialogs.EXTENSIONS[fmt]}")
            path.value = str(tmp_path / f"out.{fmt}")
            path.focus()
            await pilot.press("enter")
            await pilot.pause()
            assert not isinstance(app.screen, Export)

    drive(app, steps)
    for fmt in ("html", "csv", "text"):
        text = (tmp_path / f"out.{fmt}").read_text(encoding="utf-8")
        if fmt == "csv":
            assert list(csv.reader(io.StringIO(text)))
        elif fmt == "html":
            assert "<html" in text.lower()
        assert "P-2" in text and "CAUTION" in text


def test_run_refuses_a_bad_site_file_with_code_2(tmp_path, capsys):
    bad = tmp_path / "bad.toml"
    bad.write_text(SITE.replace('height = "4 ft"', 'height = "-4 ft"'), encoding="utf-8")
    assert run(str(bad)) == 2
    err = capsys.readouterr().err
    assert "panel M-2: height" in err and "Traceback" not in err


# --- pieces -----------------------------------------------------------------------------------
def test_typed_values_go_to_the_file_as_numbers_or_text_with_units():
    assert typed("31", "quantity") == 31 and isinstance(typed("31", "quantity"), int)
    assert typed("7.25", "quantity") == 7.25
    assert typed(" 31 ft ", "quantity") == "31 ft"
    assert typed("3", "int") == 3 and typed("2.5", "int") == 2.5
    assert typed("LRFD", "choice") == "LRFD"


def test_section_and_elevation_draw_the_results_values():
    braces = {"count": 2, "angle_deg": 55.0, "insert_height_ft": 22.0,
              "anchor_distance_ft": 15.4, "length_ft": 26.9}
    section = drawing.section(32.0, 7.25, braces, (2.5, 1.0), 17.6)
    assert "26.9 ft long at 55°" in "\n".join(section)
    assert any("▓" in line for line in section) and any("▲" in line for line in section)
    elevation = drawing.elevation(26.0, 32.0, [6.0, 18.0], 22.0, [(8.0, 0.0, 10.0, 12.0)], 17.6)
    picture = "\n".join(elevation)
    assert picture.count("●") == 3  # two braces and the legend
    assert "░" in picture and "6.0 ft, 18.0 ft from the left edge" in picture
    si = drawing.section(32.0, 7.25, braces, None, None, units="si")
    assert "9.75 m tall" in "\n".join(si)


@pytest.mark.parametrize("keys, text", [(("panels", 0, "height"), "30 ft"),
                                        (("panels", 3, "thickness"), "9.25 in")])
def test_the_quick_answer_after_a_wall_edit_is_the_whole_site_answer_for_that_wall(keys, text):
    """The wall checked alone with its line-mates gives what the whole site's check gives it."""
    site_file = scenario.load(Path(__file__).parent.parent / "scenarios" / "tilt-up-warehouse.toml")
    changed = site_file.with_value(keys, text)
    sooner = tui_app.quick(tui_app.compute(site_file), changed, keys)
    full = tui_app.compute(changed)
    mark = changed.site.panels[keys[1]].mark
    a, b = sooner.panel(mark), full.panel(mark)
    assert a.status == b.status
    assert a.utilization == pytest.approx(b.utilization, rel=1e-9)
    assert a.stand_down_speed_mph == pytest.approx(b.stand_down_speed_mph, rel=1e-6)
