"""What the screen shows is the selected wall's and the engine's, whatever was on screen before:
the fixed fields follow the wall, Esc puts back the file's value, keys typed while a view is
being built reach the field, text from the site file is never read as markup, a wall that fails
(a danger finding too) never shows a pass mark, and the essentials fit at 80 x 24.

Checked against the result object and the site file, never against numbers of our own.
"""

from __future__ import annotations

import shutil
from pathlib import Path

from test_tui import SITE, cells, drive
from textual.widgets import DataTable, Footer, Input, Static

from bracing import scenario
from tui import app as tui_app
from tui.app import BracingApp
from tui.fields import wall_fields
from tui.walls_view import WallsView
from tui.widgets import KeyFooter, speed

SCENARIOS = Path(__file__).resolve().parents[1] / "scenarios"


def screen_text(app: BracingApp) -> str:
    """Every line the terminal shows, as plain text."""
    return "\n".join("".join(seg.text for seg in strip)
                     for strip in app.screen._compositor.render_strips())


def copy_site(name: str, folder: Path) -> Path:
    """A demo site and its forecast file copied to `folder`."""
    for source in SCENARIOS.glob(f"{name}*"):
        shutil.copy(source, folder / source.name)
    return folder / f"{name}.toml"


def test_the_mark_field_follows_three_walls_in_turn(tmp_path):
    """Three walls with the same fields (the form is refilled, not rebuilt)."""
    path = copy_site("townhouse-framing", tmp_path)
    app = BracingApp(path)

    def ids(mark):
        return [s.field_id for s in wall_fields(app.site_file, mark)]

    async def steps(pilot):
        await pilot.press("2")
        await pilot.pause()
        first = app.mark
        marks = [p.mark for p in app.site_file.site.panels
                 if p.mark != first and ids(p.mark) == ids(first)][:3]
        assert len(marks) == 3
        for mark in marks:
            app.mark = mark
            await pilot.pause()
        shown = app.query_one("#field-mark .field-fixed", Static).render()
        assert str(shown) == marks[2]

    drive(app, steps)


def test_keys_typed_as_the_form_opens_reach_the_field_and_esc_puts_the_value_back(tmp_path):
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    app = BracingApp(path)

    async def steps(pilot):
        await pilot.press("i", "5", "1")  # 5 and 1 would switch views if they missed the field
        assert app.view == "wall"
        box = app.focused
        assert isinstance(box, Input)
        stored = app.site_file.data["panels"][0]["height"]
        assert box.value == f"{stored}51"
        await pilot.press("escape")
        await pilot.pause()
        assert box.value == str(stored)
        app.mark = app.site_file.site.panels[1].mark  # another wall: its own value shows
        await pilot.pause()
        assert box.value == str(app.site_file.data["panels"][1]["height"])

    drive(app, steps)


def test_a_mark_written_like_markup_is_shown_as_written(tmp_path):
    path = tmp_path / "site.toml"
    path.write_text(SITE.replace('mark = "P-1"', 'mark = "P[/]1"'), encoding="utf-8")
    app = BracingApp(path)

    async def steps(pilot):
        assert "P[/]1" in [r[0] for r in cells(app, "#walls-table")]
        app.mark = "P[/]1"
        await pilot.press("2")
        await pilot.pause()
        assert str(app.query_one("#field-mark .field-fixed", Static).render()) == "P[/]1"

    drive(app, steps)


def test_a_wall_with_a_danger_finding_shows_no_pass_mark(tmp_path):
    """townhouse-framing's L2-R12: braced, but its sign-off comes before its roof event (a
    danger finding); PanelResult.fails is the one test. The failing walls come first."""
    path = copy_site("townhouse-framing", tmp_path)
    result = tui_app.compute(scenario.load(path))
    failing = {p.mark for p in result.panels if p.fails}
    assert "L2-R12" in failing and result.panel("L2-R12").status == "braced"
    app = BracingApp(path, result=result)

    async def steps(pilot):
        rows = cells(app, "#walls-table")
        for row in rows:
            if row[0] in failing:
                assert "✓" not in row[1] and row[3] == "✗ FAILS", row
        # the walls that fail lead the table, L2-R12 (utilization under 1) among them
        assert {row[0] for row in rows[:len(failing)]} == failing

    drive(app, steps)


def test_at_80_by_24_the_quit_key_the_caution_and_the_verdict_are_on_screen(tmp_path):
    path = copy_site("townhouse-framing", tmp_path)
    app = BracingApp(path)

    async def steps(pilot):
        text = screen_text(app)
        assert "⚠ " in text.splitlines()[0]
        assert "Quit" in text.splitlines()[-1]
        header = next(line for line in text.splitlines() if "Wall" in line and "Status" in line)
        for column in ("Stand-down", "Verdict"):
            assert column in header
        assert "FAILS" in text
        assert app.query_one(Footer)

    drive(app, steps, size=(80, 24))


def test_the_settings_labels_are_whole_words(tmp_path):
    path = tmp_path / "site.toml"
    path.write_text(SITE + "\n[rules.minimum_braces_per_panel]\nvalue = 3\nsource = \"test\"\n"
                    "basis = \"test\"\n", encoding="utf-8")
    app = BracingApp(path)

    async def steps(pilot):
        await pilot.press("5")
        await pilot.pause()
        text = screen_text(app)
        assert "Minimum braces per panel" in text and "per3" not in text

    drive(app, steps)


def test_a_view_off_screen_is_drawn_when_it_comes_back_not_at_each_edit(tmp_path, monkeypatch):
    """An edit on the Wall view redraws that view; the Walls table, off screen, is filled
    again only when it is shown, and then with the edited wall's new result (the engine's
    stand-down gust, as the table writes it)."""
    path = copy_site("demo-mixed", tmp_path)
    app = BracingApp(path)
    fills = []
    original = WallsView.refill
    monkeypatch.setattr(WallsView, "refill", lambda self: (fills.append(1), original(self)))

    async def steps(pilot):
        app.mark = "M-1"
        await pilot.press("2")
        await pilot.pause()
        fills.clear()
        box = app.query_one("#field-height Input", Input)
        box.focus()
        box.value = "9 ft"
        await pilot.press("enter")
        await app.workers.wait_for_complete()
        await pilot.pause()
        assert app.result.panel("M-1").height_ft == 9.0
        assert fills == []  # off screen: not drawn
        await pilot.press("escape", "1")
        await pilot.pause()
        assert fills
        table = app.query_one("#walls-table", DataTable)
        row = table.get_row("M-1")
        assert str(row[2]) == speed(app.result.panel("M-1").stand_down_speed_mph, "us")

    drive(app, steps)


def test_the_footer_is_built_again_only_when_its_keys_change(tmp_path, monkeypatch):
    """From the Walls view to the Wall view the footer gains [ and ] (built again, and shows
    them); from the Wall view to the Day view its keys stay the same (not built again)."""
    path = copy_site("demo-mixed", tmp_path)
    app = BracingApp(path)
    builds = []
    original = KeyFooter.recompose

    async def counted(self):
        builds.append(1)
        await original(self)

    monkeypatch.setattr(KeyFooter, "recompose", counted)

    async def steps(pilot):
        await pilot.press("2")
        await pilot.pause()
        assert builds and "Previous" in screen_text(app).splitlines()[-1]
        builds.clear()
        await pilot.press("3")
        await pilot.pause()
        assert builds == [] and "Previous" in screen_text(app).splitlines()[-1]

    drive(app, steps)


def test_the_walls_table_is_drawn_once_at_start_and_kept_across_view_switches(tmp_path,
                                                                              monkeypatch):
    """Textual's table draws all its lines again at each Resize event and each update of its
    styles (the focus, a view shown). The Walls table is drawn once at start and, back from the
    Wall view, shows the lines it drew (none drawn again); a change of theme draws them again
    (common practice: a kept line never shows an old look). Counted by rows drawn."""
    path = copy_site("tilt-up-warehouse", tmp_path)
    app = BracingApp(path)
    drawn = []
    original = DataTable._render_line_in_row

    def counted(self, row_key, *args, **kwargs):
        if self.id == "walls-table":
            drawn.append(row_key)
        return original(self, row_key, *args, **kwargs)

    monkeypatch.setattr(DataTable, "_render_line_in_row", counted)

    async def steps(pilot):
        rows = len(drawn)
        assert rows and len(set(drawn)) == rows  # each row on screen drawn once
        await pilot.press("2")
        await pilot.pause()
        drawn.clear()
        await pilot.press("1")
        await pilot.pause()
        assert app.focused is app.query_one("#walls-table") and drawn == []
        app.theme = "textual-light" if app.theme != "textual-light" else "textual-dark"
        await pilot.pause()
        assert len(drawn) >= rows

    drive(app, steps)


def test_a_brace_layout_with_no_known_utilization_reads_unknown():
    """A brace with no rating has no utilization (null in the record): the dialog's lines say
    'unknown' instead of failing to format it (common practice: never show a number not known)."""
    from types import SimpleNamespace

    from tui.dialogs import layout_lines

    wall = SimpleNamespace(braces={
        "count": 2, "brace_type": "unrated", "positions_ft": [3.0, 9.0], "insert_height_ft": 8.0,
        "angle_deg": 50.0, "anchor_distance_ft": 6.7, "wall_anchor": None, "foot_anchor": None,
        "utilization": None})
    assert "utilization unknown" in layout_lines("Now", wall, "us").plain


def test_the_first_screen_draws_the_walls_and_the_footer_once(tmp_path, monkeypatch):
    """At start the Walls table is filled once and the footer built once, with its keys and
    the walls on the first screen. Textual's data binding set every bound attribute again at
    mount (four fillings of the table), and its footer was empty until the first change of
    keys, then built again: both cost the first view a second layout."""
    filled, built = [], []
    refill, compose = WallsView.refill, KeyFooter.compose
    monkeypatch.setattr(WallsView, "refill", lambda view: filled.append(1) or refill(view))
    monkeypatch.setattr(KeyFooter, "compose",
                        lambda footer: built.append(1) or (yield from compose(footer)))
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    app = BracingApp(path)

    async def steps(pilot):
        assert app.query_one("#walls-table", DataTable).row_count == 4
        assert "q Quit" in screen_text(app)

    drive(app, steps)
    assert len(filled) == 1 and len(built) == 1, (filled, built)


def test_in_a_field_the_footer_shows_ctrl_q_to_quit(tmp_path):
    """q is typed into a field, so Textual leaves "q Quit" out of the footer there: the footer
    then shows ctrl+q, which quits everywhere; out of the field, q again (at 80 x 24)."""
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    app = BracingApp(path)

    def footer() -> str:
        return screen_text(app).splitlines()[-1]

    async def steps(pilot):
        assert "q Quit" in footer() and "^q" not in footer()
        await pilot.press("2", "i")
        await pilot.pause()
        assert isinstance(app.focused, Input)
        assert "^q Quit" in footer()
        await pilot.press("escape")
        await pilot.pause()
        assert "q Quit" in footer() and "^q" not in footer()

    drive(app, steps, size=(80, 24))
