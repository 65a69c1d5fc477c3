"""The terminal interface survives what a user may type (issue 16), driven with Textual's pilot:
markup-like text in a field, a number too large for a float, "Save as" a folder, a failed save,
an export onto the site file. The edit is never lost and the file on disk never damaged.
"""

from __future__ import annotations

import asyncio
import os

from test_tui import SITE, drive, enter
from textual.app import App
from textual.widgets import Input

from bracing import scenario
from tui.app import BracingApp
from tui.choice import Choice, ChoiceList
from tui.dialogs import Export, SaveAs
from tui.widgets import FieldRow


async def _open_wall(pilot, mark: str = "M-2") -> None:
    pilot.app.mark = mark
    await pilot.press("2")
    await pilot.pause()


def _site(tmp_path):
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    return path


def test_typed_markup_and_huge_numbers_are_refused_as_plain_text(tmp_path):
    """`[/]` is shown as typed (it is not markup: it would close a style and crash the
    screen); `2**2000 ft`, `1e308 ft` and lift day 100,000,000 are refused by the field; the
    last valid state stays."""
    path = _site(tmp_path)
    app = BracingApp(path)

    async def steps(pilot):
        await _open_wall(pilot)
        before = app.site_file
        for field, text, words in (("height", "[/]", "[/]"),
                                   ("height", "[bold]x[/bold] ft", "[bold]x[/bold]"),
                                   ("height", "2**2000 ft", "cannot read"),
                                   ("height", "1e308 ft", "plausible range"),
                                   ("lift-day", "100000000", "3650")):
            row = await enter(pilot, field, text)
            assert words in row.error.replace("\\[", "["), row.error
            shown = str(row.query_one(".field-error").render())
            assert words in shown, shown  # rendered as the characters typed
            assert app.site_file is before and app.is_running
        assert not app.dirty

    drive(app, steps)
    assert path.read_text(encoding="utf-8") == SITE


def test_save_as_a_folder_is_refused_before_anything_is_written_and_the_edit_kept(tmp_path,
                                                                                  monkeypatch):
    path = _site(tmp_path)
    folder = tmp_path / "plans"
    folder.mkdir()
    (folder / "keep.txt").write_text("kept", encoding="utf-8")
    monkeypatch.chdir(tmp_path)
    app = BracingApp(path)

    async def steps(pilot):
        await _open_wall(pilot)
        await enter(pilot, "height", "5 ft")
        assert app.dirty
        await pilot.press("escape", "f2")
        await pilot.pause()
        for target, words in ((".", "is a folder"), (str(folder), "is a folder"),
                              (str(tmp_path / "missing" / "x.toml"), "does not exist"),
                              ("", "give a file name")):
            dialog = app.screen
            assert isinstance(dialog, SaveAs)
            dialog.query_one(Input).value = target
            await pilot.press("enter")
            await pilot.pause()
            assert isinstance(app.screen, SaveAs), target  # still asking
            assert words in str(app.screen.query_one("#save-error").render())
        await pilot.press("escape")
        await pilot.pause()
        assert app.is_running and app.dirty and app.site_file.edits

    drive(app, steps)
    assert path.read_text(encoding="utf-8") == SITE
    assert sorted(p.name for p in tmp_path.iterdir()) == ["plans", "site.toml"]
    assert [p.name for p in folder.iterdir()] == ["keep.txt"]


def test_a_failed_save_keeps_the_edit_and_the_file(tmp_path, monkeypatch):
    path = _site(tmp_path)
    app = BracingApp(path)

    def disk_full(*args, **kwargs):
        raise OSError(28, "No space left on device")

    async def steps(pilot):
        await _open_wall(pilot)
        await enter(pilot, "height", "5 ft")
        monkeypatch.setattr(scenario, "atomic_write", disk_full)
        await pilot.press("escape", "ctrl+s")
        await pilot.pause()
        assert app.is_running and app.dirty and app.site_file.edits
        monkeypatch.undo()
        await pilot.press("ctrl+s")  # the edit is still there to be saved
        await pilot.pause()
        assert not app.dirty

    drive(app, steps)
    assert 'height = "5 ft"' in path.read_text(encoding="utf-8")
    assert path.with_name("site.toml.bak").read_text(encoding="utf-8") == SITE


def test_an_export_onto_the_site_file_is_refused(tmp_path):
    path = _site(tmp_path)
    app = BracingApp(path)

    async def steps(pilot):
        await pilot.press("e")
        await pilot.pause()
        dialog = app.screen
        assert isinstance(dialog, Export)
        box = dialog.query_one("#export-path", Input)
        box.value = str(path)
        box.focus()
        await pilot.press("enter")
        await pilot.pause()
        assert app.is_running

    drive(app, steps)
    assert path.read_text(encoding="utf-8") == SITE
    assert sorted(os.listdir(tmp_path)) == ["site.toml"]


def test_a_choice_opens_its_list_chooses_with_enter_and_leaves_it_with_esc(tmp_path):
    """The one-widget choice (tui/choice.py): Enter opens its list over the screen at the
    value shown; Esc closes it with the value unchanged; down and Enter choose the next
    option, and the Walls table is filtered by it (the choice's Changed message)."""
    app = BracingApp(_site(tmp_path))

    async def steps(pilot):
        status = app.query_one("#filter-status", Choice)
        status.focus()
        await pilot.press("enter")
        await pilot.pause()
        assert isinstance(app.screen, ChoiceList)
        await pilot.press("escape")
        await pilot.pause()
        assert not isinstance(app.screen, ChoiceList)
        assert status.value == "*" and app.focused is status
        rows = app.query_one("#walls-table").row_count
        await pilot.press("enter", "down", "enter")
        await pilot.pause()
        assert status.value == status.options[1][1] != "*"
        assert app.query_one("#walls-table").row_count < rows

    drive(app, steps)


def test_enter_on_the_value_the_file_holds_makes_no_edit(tmp_path):
    """Enter in a field whose text is the file's value changes nothing: no unsaved changes,
    nothing to undo (it once counted as an edit and marked the file changed)."""
    app = BracingApp(_site(tmp_path))

    async def steps(pilot):
        await _open_wall(pilot)
        row = app.query_one("#field-height", FieldRow)
        await enter(pilot, "height", row.value)
        assert not app.dirty and not app.undo_stack

    drive(app, steps)


def test_a_choice_cut_to_its_width_keeps_its_mark():
    """A value longer than the choice is cut with an ellipsis and keeps " ▾" in sight (the
    demo's "adjustable-pipe-brace" lost it in a 22-column box)."""

    class Narrow(App):
        CSS = "Choice { width: 12; }"

        def compose(self):
            yield Choice([("adjustable-pipe-brace", 1)], value=1)

    async def run():
        app = Narrow()
        async with app.run_test(size=(40, 5)) as pilot:
            await pilot.pause()
            shown = app.query_one(Choice).render().plain
            assert shown.endswith("…" + " ▾") and len(shown) == 12, shown

    asyncio.run(run())
