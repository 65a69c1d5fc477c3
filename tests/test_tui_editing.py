"""Every fix the interface shows can be made in it, on a copy of the demo site: the layout
designer's braces for D-2 accepted, a wall's angle turned into a foot distance of 6 ft (the
review exercise's fix), one brace moved on the elevation, a sign-off added; each undone, then
redone; saved, the file validates, keeps its comments, and `bracing check` shows the changes.

The interface computes nothing: the expected values are the ones typed, read back from the
engine's result and from `bracing check --json`.
"""

from __future__ import annotations

import json
import subprocess
import sys
from datetime import date

from test_tui import drive
from test_tui_screen import copy_site
from textual.widgets import DataTable, Input

from bracing import scenario
from tui.app import BracingApp
from tui.dialogs import DesignProposal
from tui.widgets import FieldRow


async def settle(pilot) -> None:
    await pilot.app.workers.wait_for_complete()
    await pilot.pause()


async def enter(pilot, field_id: str, text: str) -> None:
    box = pilot.app.query_one(f"#field-{field_id}", FieldRow).query_one(Input)
    box.focus()
    await pilot.pause()
    box.value = text
    await pilot.press("enter")
    await settle(pilot)


async def add_signoff(pilot, mark: str, day: str, by: str) -> None:
    await pilot.press("s")
    await pilot.pause()
    dialog = pilot.app.screen
    dialog.query_one("#entry-panel").value = mark
    dialog.query_one("#entry-day", Input).value = day
    dialog.query_one("#entry-by", Input).value = by
    dialog.query_one("#entry-by", Input).focus()
    await pilot.press("enter")
    await settle(pilot)


def test_design_switch_to_a_foot_distance_move_a_brace_undo_redo_and_save(tmp_path):
    path = copy_site("demo-mixed", tmp_path)
    app = BracingApp(path)
    original = app.site_file.data
    panels = original["panels"]
    d2 = next(i for i, p in enumerate(panels) if p["mark"] == "D-2")
    assert "bracing" not in panels[d2]
    assert "angle" in panels[0]["bracing"] and panels[0]["mark"] == "D-1"

    async def steps(pilot):
        app.mark = "D-2"
        await pilot.press("2")
        await pilot.press("d")  # the designer's proposal beside the wall's own (none)
        await pilot.pause()
        assert isinstance(app.screen, DesignProposal)
        proposal = app.screen.proposal
        assert proposal.table is not None
        await pilot.press("enter")  # accept
        await settle(pilot)
        assert app.site_file.data["panels"][d2]["bracing"] == proposal.table
        assert app.result.panel("D-2").braces["count"] == proposal.table["count"]

        app.mark = "D-1"
        await pilot.pause()
        await pilot.press("a")  # angle -> foot distance
        await settle(pilot)
        assert "angle" not in app.site_file.data["panels"][0]["bracing"]
        await enter(pilot, "bracing-anchor-distance", "6 ft")
        assert app.result.panel("D-1").braces["anchor_distance_ft"] == 6.0
        # D-1: two braces on a 24 ft wall, at the centers of equal strips, 6 and 18 ft; the
        # second moved two steps of 0.5 ft to the right on the elevation: 19 ft
        await pilot.press("escape", "m", "down", "right", "right")  # out of the field first
        await settle(pilot)
        assert app.result.panel("D-1").braces["positions_ft"] == [6.0, 19.0]
        await add_signoff(pilot, "D-3", "20", "A. Engineer, PE")
        assert app.site_file.data["signoffs"][-1]["panel"] == "D-3"
        final = app.site_file.data

        app.screen.set_focus(None)
        for _ in range(5):  # the designer's, the switch, 6 ft, the move, the sign-off
            await pilot.press("ctrl+z")
        await settle(pilot)
        assert app.site_file.data == original
        for _ in range(5):
            await pilot.press("ctrl+y")
        await settle(pilot)
        assert app.site_file.data == final
        await pilot.press("ctrl+s")
        await pilot.pause()

    drive(app, steps)

    saved = scenario.load(path)  # validates
    assert saved.text.startswith("# Demo site: a small mixed job")
    assert "# A dock door at the base" in saved.text
    run = subprocess.run([sys.executable, "-c", "from bracing.cli import main; main()", "check",
                          str(path), "--json"],
                         check=False, capture_output=True, text=True, cwd=tmp_path)
    record = {p["mark"]: p for p in json.loads(run.stdout)["panels"]}
    assert record["D-1"]["braces"]["anchor_distance_ft"] == 6.0
    assert record["D-1"]["braces"]["positions_ft"] == [6.0, 19.0]
    assert (saved.site.signoffs[-1].panel, saved.site.signoffs[-1].day) == ("D-3", 20)
    assert record["D-2"]["braces"]["count"] == app.site_file.data["panels"][d2]["bracing"]["count"]


def test_e_then_enter_exports_beside_the_site_file_and_the_extension_chooses_the_format(tmp_path):
    path = copy_site("demo-mixed", tmp_path)
    app = BracingApp(path)

    async def steps(pilot):
        await pilot.press("e")
        await pilot.pause()
        await pilot.press("enter")  # the initial focus: Export
        await pilot.pause()
        await pilot.press("e")
        await pilot.pause()
        box = app.screen.query_one("#export-path", Input)
        box.value = str(tmp_path / "crew.txt")  # a .txt name: plain text
        await pilot.pause()
        assert "plain text" in str(app.screen.query_one("#export-chosen").render())
        await pilot.press("enter")
        await pilot.pause()

    drive(app, steps)
    written = sorted(p.name for p in tmp_path.glob("demo-mixed-schedule*"))
    assert written and written[0].endswith(".html")
    text = (tmp_path / "crew.txt").read_text(encoding="utf-8")
    assert "<html" not in text.lower() and "CAUTION" in text


def test_a_sign_off_before_its_event_is_refused_with_the_reason_a_later_one_is_recorded(
        tmp_path):
    """townhouse-framing: the roof over units 11-12 is sheathed on day 16 (its [[events]]); a
    sign-off of a wall whose release waits for it, on day 10, comes before it."""
    path = copy_site("townhouse-framing", tmp_path)
    app = BracingApp(path)
    data = app.site_file.data
    mark = next(p["mark"] for p in data["panels"]
                if "Roof sheathed, units 11-12" in p.get("release_after", []))
    before = list(data["signoffs"])

    async def steps(pilot):
        await pilot.press("s")
        await pilot.pause()
        dialog = app.screen
        dialog.query_one("#entry-panel").value = mark
        dialog.query_one("#entry-day", Input).value = "10"
        dialog.query_one("#entry-by", Input).value = "A. Engineer, PE"
        await pilot.press("enter")
        await pilot.pause()
        assert app.screen is dialog  # refused, with the reason
        why = str(dialog.query_one("#list-error").render())
        assert "Refused" in why and "Roof sheathed, units 11-12 (day 16)" in why
        assert app.site_file.data["signoffs"] == before
        dialog.query_one("#entry-day", Input).value = "17"
        dialog.query_one("#entry-by", Input).focus()
        await pilot.press("enter")
        await settle(pilot)
        assert app.screen is not dialog
        assert app.site_file.data["signoffs"][-1] == {"panel": mark, "day": 17,
                                                      "by": "A. Engineer, PE"}
        await pilot.press("ctrl+z")
        await settle(pilot)
        assert app.site_file.data["signoffs"] == before

    drive(app, steps)


def test_a_brace_moved_on_the_elevation_its_force_follows_and_one_undo_puts_it_back(tmp_path):
    """D-1 of the demo: two braces on a 24 ft wall at the centers of equal strips (24 / 2 =
    12 ft strips: 6 and 18 ft). The second, chosen with the down key, moved three steps of
    0.5 ft to the right: 18 + 3 x 0.5 = 19.5 ft, written to the file; one step back left:
    19 ft. Its force is the engine's, shown under the drawing; the moves are one undo step."""
    path = copy_site("demo-mixed", tmp_path)
    app = BracingApp(path)
    original = app.site_file.data

    async def steps(pilot):
        app.mark = "D-1"
        await pilot.press("m")
        await pilot.pause()
        before = app.result.panel("D-1").braces["brace_forces_lb"][1]
        await pilot.press("down", "right", "right", "right", "left")
        await settle(pilot)
        braces = app.result.panel("D-1").braces
        assert braces["positions_ft"] == [6.0, 19.0]
        assert app.site_file.data["panels"][0]["bracing"]["positions"] == ["6 ft", "19 ft"]
        force = braces["brace_forces_lb"][1]
        assert force != before
        shown = str(app.query_one("#wall-elevation").render())
        assert f"brace 2 of 2 at 19.0 ft: force {force:,.0f} lb" in shown
        await pilot.press("escape", "ctrl+z")
        await settle(pilot)
        assert app.site_file.data == original
        assert app.result.panel("D-1").braces["brace_forces_lb"][1] == before

    drive(app, steps)
    app.site_file.save(None)
    assert scenario.load(path).site.panels[0].bracing.positions == []


def test_events_added_changed_and_removed_refused_where_a_sign_off_would_come_first(tmp_path):
    """townhouse-framing: "Roof sheathed, units 9-10" on day 14 (third of its [[events]]);
    L2-F9, among the walls whose release waits for it, is signed off on day 15. The event
    moved to day 18 would come after that sign-off: refused with the engine's finding. Moved to
    day 13: recorded. An event added on day 20, then removed; removing the roof event that
    walls wait for is refused by the file's validation. Three edits: undone, then redone."""
    path = copy_site("townhouse-framing", tmp_path)
    app = BracingApp(path)
    original = app.site_file.data
    roof = 2
    assert original["events"][roof] == {"name": "Roof sheathed, units 9-10", "day": 14,
                                        "kind": "diaphragm"}

    async def open_row(pilot, row: int):
        await pilot.press("v")
        await pilot.pause()
        table = app.screen.query_one("#list-table", DataTable)
        table.focus()
        table.move_cursor(row=row)
        await pilot.press("enter")  # the row's values in the fields
        await pilot.pause()
        return app.screen

    async def steps(pilot):
        dialog = await open_row(pilot, roof)
        assert dialog.query_one("#entry-name", Input).value == "Roof sheathed, units 9-10"
        dialog.query_one("#entry-day", Input).value = "18"
        await pilot.click("#change")
        await pilot.pause()
        assert app.screen is dialog
        why = str(dialog.query_one("#list-error").render())
        assert "Refused: L2-F9: sign-off by" in why and "units 9-10 (day 18)" in why
        dialog.query_one("#entry-day", Input).value = "13"
        while dialog.query_one("#change").has_class("-active"):  # a button ignores a click
            await pilot.pause(0.05)  # while it still shows the last one (Textual, 0.2 s)
        await pilot.click("#change")
        await settle(pilot)
        assert app.screen is not dialog
        assert app.site_file.data["events"][roof]["day"] == 13

        await pilot.press("v")
        await pilot.pause()
        dialog = app.screen
        dialog.query_one("#entry-name", Input).value = "Parapet braced"
        dialog.query_one("#entry-day", Input).value = "20"
        dialog.query_one("#entry-kind").value = "other"
        dialog.query_one("#entry-name", Input).focus()
        await pilot.press("enter")  # added
        await settle(pilot)
        assert app.site_file.data["events"][-1] == {"name": "Parapet braced", "day": 20,
                                                    "kind": "other"}
        dialog = await open_row(pilot, 4)
        await pilot.click("#remove")
        await settle(pilot)
        assert [e["name"] for e in app.site_file.data["events"]] == \
            [e["name"] for e in original["events"]]
        changed = app.site_file.data

        dialog = await open_row(pilot, roof)
        await pilot.click("#remove")
        await pilot.pause()
        assert app.screen is dialog and "Refused" in str(dialog.query_one("#list-error").render())
        await pilot.press("escape")
        await pilot.pause()

        for _ in range(3):
            await pilot.press("ctrl+z")
        await settle(pilot)
        assert app.site_file.data == original
        for _ in range(3):
            await pilot.press("ctrl+y")
        await settle(pilot)
        assert app.site_file.data == changed

    drive(app, steps)


def test_a_sign_off_keeps_who_license_and_date_and_the_saved_file_validates(tmp_path):
    """A sign-off of L2-R12 on day 17 (after its roof event, day 16) by an engineer with a
    license number and a calendar date: written as typed, the date a TOML date."""
    path = copy_site("townhouse-framing", tmp_path)
    app = BracingApp(path)

    async def steps(pilot):
        await pilot.press("s")
        await pilot.pause()
        dialog = app.screen
        dialog.query_one("#entry-panel").value = "L2-R12"
        dialog.query_one("#entry-day", Input).value = "17"
        dialog.query_one("#entry-by", Input).value = "A. Engineer, PE"
        dialog.query_one("#entry-license", Input).value = "PE 012345"
        dialog.query_one("#entry-date", Input).value = "2027-08-18"
        dialog.query_one("#entry-by", Input).focus()
        await pilot.press("enter")
        await settle(pilot)
        await pilot.press("ctrl+s")
        await pilot.pause()

    drive(app, steps)
    saved = scenario.load(path)
    last = saved.site.signoffs[-1]
    assert (last.panel, last.day, last.by, last.license, last.date) == \
        ("L2-R12", 17, "A. Engineer, PE", "PE 012345", date(2027, 8, 18))
    assert "date = 2027-08-18" in saved.text


def test_the_designers_proposal_is_drawn_beside_the_walls_own_braces(tmp_path):
    """D-4 of the demo has braces of its own; the designer's proposal and the present layout
    are each drawn as an elevation, their braces at the engine's positions (refused: no
    change)."""
    path = copy_site("demo-mixed", tmp_path)
    app = BracingApp(path)

    async def steps(pilot):
        app.mark = "D-4"
        await pilot.press("2", "d")
        await pilot.pause()
        dialog = app.screen
        now, proposed = (str(s.render()) for s in dialog.query(".layout"))
        for text, p in ((now, app.result.panel("D-4")), (proposed, dialog.proposal.result)):
            where = ", ".join(f"{x:.1f} ft" for x in p.braces["positions_ft"])
            assert "┌" in text and f"braces at {where} from the left edge" in text
        assert now != proposed
        await pilot.press("escape")
        await pilot.pause()
        assert not app.undo_stack

    drive(app, steps)


def test_an_edit_is_evaluated_whole_on_a_fast_site_and_wall_first_on_a_slow_one(tmp_path,
                                                                                monkeypatch):
    """After an edit, a site evaluated whole in under WHOLE_SITE_AT_ONCE_S is evaluated whole
    at once (the edited wall alone costs about as much); a slower site gets the edited wall's
    checks first (`tui.engine.quick`), then the whole site's. Either way the wall shows the
    height typed, as the engine's result gives it."""
    from test_tui import SITE, enter, settle

    from tui import app as tui_app

    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    app = BracingApp(path)
    calls = []
    quick = tui_app.quick
    monkeypatch.setattr(tui_app, "quick", lambda *a: calls.append(1) or quick(*a))

    async def steps(pilot):
        app.mark = "P-1"
        await pilot.press("2")
        await settle(pilot)
        app.evaluation_s = 0.01  # a fast site
        await enter(pilot, "height", "31 ft")
        assert not calls and app.result.panel("P-1").height_ft == 31.0
        app.evaluation_s = 2.0  # a slow one
        await enter(pilot, "height", "32 ft")
        assert calls == [1] and app.result.panel("P-1").height_ft == 32.0

    drive(app, steps)
