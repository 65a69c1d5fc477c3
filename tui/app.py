"""The terminal interface: it owns the site file, the engine's result and the undo stack.

Views get what they show as attributes and ask for changes by messages. An edit goes through
`SiteFile.with_value` (the engine's validation); a valid one is recomputed by the engine in a
worker thread (the latest edit wins), an invalid one is shown beside its field and changes
nothing.
"""

from __future__ import annotations

import asyncio
import sys
import time
from dataclasses import replace
from pathlib import Path
from typing import ClassVar

from rich.markup import escape
from textual import on, work
from textual.app import App, ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.reactive import var
from textual.screen import Screen
from textual.widgets import Input, Static, TabbedContent, TabPane

from bracing import scenario
from bracing.results import SiteResult
from bracing.scenario import REMOVE, SiteFile, SiteFileError
from tui.choice import Choice
from tui.engine import compute, problems_text, quick
from tui.fields import typed
from tui.files import Files
from tui.fixes import Fixes
from tui.settings_view import KeysView, SettingsView
from tui.wall_view import WallView
from tui.walls_view import WallsView
from tui.widgets import (
    Caution,
    DrawnWhenShown,
    FieldRow,
    KeyFooter,
    StatusLine,
    walls_in_order,
)

DEMO = Path(__file__).resolve().parents[1] / "scenarios" / "demo-mixed.toml"

VIEWS = {"walls": "1 Walls", "wall": "2 Wall", "day": "3 Day", "plan": "4 Plan",
         "settings": "5 Settings", "keys": "? Keys"}
FOCUS = {"walls": "#walls-view DataTable",  # the first: foundation walls' when one fails
         "wall": "#wall-results", "day": "#day-inventory",
         "plan": "#plan-body", "settings": "#rules-table", "keys": "#keys-table"}

PREBUILD_AFTER_S = 0.5  # the first screen drawn and its first frames settled
# A site whose whole evaluation takes less than this is evaluated whole after an edit; a
# slower one gets the edited wall's checks first (about 30 ms for one wall, whatever the site)
WHOLE_SITE_AT_ONCE_S = 0.1

KEY_NAMES = {"question_mark": "?", "left_square_bracket": "[", "right_square_bracket": "]",
             "plus": "+", "equals_sign": "=", "minus": "-"}

# Keys handled by the widgets themselves, for the Keys view (the app's own come from BINDINGS).
WIDGET_KEYS = (
    ("ctrl+q", "quit, also from inside a field (asks first when there are unsaved changes)",
     "everywhere"),
    ("up / down, page up / down", "move in a table or list", "tables"),
    ("enter", "open the wall under the cursor", "Walls"),
    ("enter", "apply the value typed", "a field"),
    ("esc", "put back the file's value and leave the field", "a field"),
    ("tab / shift+tab", "next / previous field, filter or table", "everywhere"),
    ("enter / space", "open a list of choices", "a choice"),
    ("left / right", "previous / next tab", "the tabs"),
    ("mouse", "click a tab, a row, a field or a button; the wheel scrolls", "everywhere"),
)


class MainScreen(Screen):
    """The views' screen: the Walls table has the focus before the screen is first drawn (a
    focus given after it draws the table a second time, 60 ms at start)."""

    AUTO_FOCUS = "#walls-table"


class BracingApp(Fixes, Files, App[int]):
    """Walls, a wall, a day, the plan and the settings of one site file."""

    CSS_PATH = "app.tcss"
    TITLE = "Wall bracing"
    ENABLE_COMMAND_PALETTE = False
    BINDINGS: ClassVar[list[Binding]] = [
        # the tabs show the number keys, so the footer leaves them out (room for q at 80x24)
        Binding("1", "show('walls')", "Walls", show=False,
                tooltip="the Walls view: every wall, worst first, with filters"),
        Binding("2", "show('wall')", "Wall", show=False,
                tooltip="the Wall view: its inputs, checks and drawings"),
        Binding("3", "show('day')", "Day", show=False,
                tooltip="the Day view: lifts, braces and anchors, go / no-go"),
        Binding("4", "show('plan')", "Plan", show=False,
                tooltip="the Plan view: the site in plan on a day"),
        Binding("5", "show('settings')", "Settings", show=False,
                tooltip="the Settings view: wind basis, exposure, period, rules"),
        Binding("question_mark,f1", "show('keys')", "Keys", key_display="?",
                tooltip="the Keys view: this list"),
        Binding("left_square_bracket", "step(-1)", "Previous", key_display="[",
                tooltip="previous wall (worst first) or day"),
        Binding("right_square_bracket", "step(1)", "Next", key_display="]",
                tooltip="next wall (worst first) or day"),
        Binding("plus,equals_sign", "zoom(2)", "Zoom in", key_display="+", show=False,
                tooltip="zoom the plan in (x2, x4, x8)"),
        Binding("minus", "zoom(0.5)", "Zoom out", key_display="-", show=False,
                tooltip="zoom the plan out"),
        Binding("i", "edit", "Edit inputs", show=False, tooltip="go to the first input"),
        Binding("d", "design", "Design", show=False,
                tooltip="the layout designer's braces for the wall, beside its own; accept or "
                        "refuse"),
        Binding("s", "signoff", "Sign-off", show=False,
                tooltip="add, change or remove a sign-off (a wall's release: who, license, "
                        "date); refused with the reason when it comes before the wall's lift "
                        "or its events"),
        Binding("m", "move_brace", "Move a brace", show=False,
                tooltip="choose a brace on the wall's elevation (up / down) and move it (left / "
                        "right); its force follows"),
        Binding("v", "events", "Events", show=False,
                tooltip="add, change or remove an event (the permanent work walls wait for); "
                        "refused with the reason when a sign-off would then come before it"),
        Binding("a", "toggle_foot", "Angle/foot", show=False,
                tooltip="give the wall's braces by their foot distance, or by their angle"),
        Binding("ctrl+z", "undo", "Undo", tooltip="undo the last change of a value"),
        Binding("ctrl+y", "redo", "Redo", show=False, tooltip="redo the change undone"),
        Binding("ctrl+s", "save", "Save",
                tooltip="save the site file (comments kept, the old file kept as .bak)"),
        Binding("f2", "save_as", "Save as", show=False, tooltip="save the site file as ..."),
        Binding("e", "export", "Export",
                tooltip="export a day's brace schedule (HTML, CSV, text)"),
        Binding("u", "toggle_units", "US/SI", show=False, tooltip="US or SI units"),
        Binding("escape", "leave_field", "Leave", show=False,
                tooltip="leave the field (its value as the file holds it)"),
        Binding("q", "quit", "Quit", tooltip="quit (asks first when there are unsaved changes)"),
    ]

    # vars, not reactives: the app draws nothing of its own, and a reactive of the app
    # repaints the whole screen at each change (the views bound to them draw what changes)
    result: var[SiteResult | None] = var(None, always_update=True, init=False)
    site_file: var[SiteFile | None] = var(None, always_update=True, init=False)
    mark = var("", init=False)
    day: var[int | None] = var(None, init=False)
    units = var("us", init=False)
    errors = var(dict, always_update=True, init=False)
    busy = var(False, init=False)
    dirty = var(False, init=False)
    file_name = var("", init=False)
    keys = var(list, init=False)

    def __init__(self, path: str | Path | None = None, result: SiteResult | None = None):
        """Open `path` (a demo site when None); `result` may give its result already computed.

        Raises SiteFileError when the file cannot be read or is not valid.
        """
        super().__init__()
        self.animation_level = "none"  # no sliding tab underline: a view is shown at once
        self.demo = path is None
        site_file = scenario.load(DEMO if path is None else path)
        started = time.perf_counter()
        first = result if result is not None else compute(site_file)
        self.evaluation_s = time.perf_counter() - started  # the whole site's, the last time
        self.set_reactive(BracingApp.site_file, site_file)
        self.set_reactive(BracingApp.result, first)
        self.set_reactive(BracingApp.mark, walls_in_order(first)[0].mark if first.panels else "")
        self.set_reactive(BracingApp.day, first.days[0].day if first.days else None)
        self.set_reactive(BracingApp.keys, self.key_list())
        self.set_reactive(BracingApp.file_name, self._file_label(site_file))
        self.saved_text = site_file.text
        self.undo_stack: list[SiteFile] = []
        self.redo_stack: list[SiteFile] = []
        self.generation = 0
        self.view = "walls"
        self.quit_after_save = False
        self.edit_next = False
        self.gesture: tuple | None = None  # the edit that the next of its kind joins
        self.builds: dict[str, asyncio.Task] = {}

    def compose(self) -> ComposeResult:
        with Vertical(id="banner"):
            yield Caution(id="caution").data_bind(BracingApp.result)
            yield StatusLine(id="status").data_bind(
                BracingApp.result, BracingApp.file_name, BracingApp.dirty, BracingApp.busy,
                BracingApp.units)
        with TabbedContent(initial="walls", id="views"):
            for view, title in VIEWS.items():
                with TabPane(title, id=view):
                    # a view is built when first shown; until then the pane says so in words
                    yield self.make_view(view) if view == "walls" else \
                        Static("Loading…", classes="loading")
        yield KeyFooter()

    def make_view(self, view: str):
        """A view, its attributes bound to the app's (a view is built when first shown) and
        given their values at once, so that it is whole when it is mounted."""
        widget = self._bound_view(view)
        for name in widget._reactive_connect or {}:
            widget.set_reactive(getattr(type(widget), name), getattr(self, name))
        return widget

    def _bound_view(self, view: str):
        app = BracingApp
        if view == "walls":
            return WallsView(id="walls-view").data_bind(app.result, app.site_file, app.units)
        if view == "wall":
            return WallView(id="wall-view").data_bind(app.result, app.site_file, app.mark,
                                                      app.units, app.errors)
        if view == "day":
            return self._day_module().DayView(id="day-view").data_bind(
                app.result, app.site_file, app.day, app.units)
        if view == "plan":
            return self._day_module().PlanView(id="plan-view").data_bind(
                app.result, app.day, app.units)
        if view == "settings":
            return SettingsView(id="settings-view").data_bind(app.result, app.site_file,
                                                              app.errors)
        return KeysView(id="keys-view").data_bind(app.keys)

    @staticmethod
    def _day_module():
        """The Day and Plan views' module, loaded when one is first shown (with the schedule's
        words and the plan's drawing): not waited for at start."""
        from tui import day_view
        return day_view

    def get_default_screen(self) -> Screen:
        return MainScreen(id="_default")

    def on_mount(self) -> None:
        first = self.query(FOCUS["walls"]).first()  # the foundation walls' when one fails
        if first.id != "walls-table":  # else the Walls table has it already (MainScreen)
            first.focus()
        # the Wall view built (off screen) while the first screen is read: opening a wall is
        # then a switch, not a build (a key pressed sooner builds it at once)
        self.set_timer(PREBUILD_AFTER_S, lambda: self._building("wall"))

    # --- what is shown ------------------------------------------------------------------------
    @classmethod
    def key_list(cls) -> list[tuple[str, str, str]]:
        """Every key: the app's bindings, then the keys the widgets handle."""
        where = {"step": "Wall, Day and Plan", "edit": "Wall and Settings", "zoom": "Plan",
                 "design": "Wall", "toggle_foot": "Wall", "signoff": "everywhere",
                 "move_brace": "Wall", "events": "everywhere"}
        rows = []
        for b in cls.BINDINGS:
            keys = " / ".join(KEY_NAMES.get(k.strip(), k.strip()) for k in b.key.split(","))
            action = b.action.split("(")[0]
            rows.append((keys, b.tooltip or b.description, where.get(action, "everywhere")))
        return rows + list(WIDGET_KEYS)

    def _file_label(self, site_file: SiteFile) -> str:
        name = Path(site_file.path).name
        return f"{name} (demo: save as to keep changes)" if self.demo else name

    def check_action(self, action: str, parameters: tuple) -> bool | None:
        if action == "step":
            return self.view in ("wall", "day", "plan")
        if action == "zoom":
            return self.view == "plan"
        return True

    def _building(self, view: str) -> asyncio.Task:
        """The building of `view` in its pane, in place of the placeholder: started once, and
        waited for by whoever asks for the view meanwhile."""
        if view not in self.builds:
            self.builds[view] = asyncio.create_task(self._build(view))
        return self.builds[view]

    async def _build(self, view: str) -> None:
        pane = next(iter(self.query(f"#{view}").results(TabPane)), None) \
            if self.is_running else None
        if pane is None:  # (the app closing when the timer comes)
            return
        placeholder = pane.query(".loading")
        if placeholder:
            await placeholder.remove()
            await pane.mount(self.make_view(view))

    async def _ensure_view(self, view: str) -> None:
        """Build `view` if it is not built yet, then draw what changed while it was off
        screen."""
        await self._building(view)
        pane = self.query_one(f"#{view}", TabPane)
        for widget in pane.children:  # (a view just built: what its bindings gave it)
            if isinstance(widget, DrawnWhenShown):
                await widget.catch_up()

    @on(TabbedContent.TabActivated)
    async def _tab(self, event: TabbedContent.TabActivated) -> None:
        """A tab chosen with the mouse or the tab keys (the number keys go by action_show)."""
        view = event.pane.id or "walls"
        if view == self.view:
            return
        self.view = view
        await self._ensure_view(view)
        self.refresh_bindings()
        self._focus_view()

    def _focus_view(self) -> None:
        if self.edit_next and self.view in ("wall", "settings"):
            self.edit_next = False
            form = "#wall-form" if self.view == "wall" else "#settings-form"
            fields = self.query(f"{form} Input")  # a box takes the keys typed next
            if fields:
                fields.first().focus()
                return
        target = self.query(FOCUS[self.view])
        if target:  # the view stays at its top (Settings' table is below its form)
            target.first().focus(scroll_visible=False)

    async def action_show(self, view: str) -> None:
        """Show a view and focus it before the next key is read (keys typed meanwhile reach
        the focused field, never the app's view keys)."""
        tabs = self.query_one(TabbedContent)
        with self.batch_update():  # drawn once, the view shown and focused
            if tabs.active != view:
                await self._ensure_view(view)
                self.screen.set_focus(None)  # focus left in the old view would bring it back
                self.view = view
                tabs.active = view
                self.refresh_bindings()
                # laid out before it is drawn: the view left is not drawn again on the way
                self.screen.refresh(layout=True)
            self._focus_view()

    def action_step(self, delta: int) -> None:
        """The next or previous wall (worst first) or day."""
        if self.view == "wall":
            marks = [p.mark for p in walls_in_order(self.result)]
            if marks:
                k = marks.index(self.mark) if self.mark in marks else -delta
                self.mark = marks[(k + delta) % len(marks)]
        elif self.view in ("day", "plan"):
            days = [d.day for d in self.result.days]
            if days:
                k = days.index(self.day) if self.day in days else -delta
                self.day = days[max(0, min(len(days) - 1, k + delta))]

    def action_zoom(self, factor: float) -> None:
        view = self.query_one("#plan-view")
        view.zoom = view.zoom * factor  # PlanView.validate_zoom keeps it in range

    async def action_edit(self) -> None:
        """Go to the first input of the Wall view (or of Settings when it is on view)."""
        self.edit_next = True
        await self.action_show(self.view if self.view in ("wall", "settings") else "wall")

    def action_leave_field(self) -> None:
        if isinstance(self.focused, (Input, Choice)):
            self.screen.set_focus(None)

    def action_toggle_units(self) -> None:
        self.units = "si" if self.units == "us" else "us"

    def watch_mark(self) -> None:
        self.errors = {}  # a message belongs to the field of the wall it was typed for

    @on(WallsView.WallChosen)
    async def _open_wall(self, event: WallsView.WallChosen) -> None:
        self.mark = event.mark
        await self.action_show("wall")

    @on(WallView.WallPicked)
    def _pick_wall(self, event: WallView.WallPicked) -> None:
        self.mark = event.mark

    def on_day_picker_day_picked(self, event) -> None:
        """A day chosen (DayPicker.DayPicked; its module is loaded with the Day view)."""
        self.day = event.day

    # --- editing ------------------------------------------------------------------------------
    @on(FieldRow.Edited)
    def _edited(self, event: FieldRow.Edited) -> None:
        spec = event.spec
        value = typed(event.text, spec.kind) if event.text.strip() else REMOVE
        try:
            changed = self.site_file.with_value(spec.keys, value)
        except SiteFileError as exc:  # shown as plain text: typed "[/]" is not markup
            self.errors = {spec.field_id: escape(problems_text(exc))}
            return
        self.apply(changed, spec.keys)

    def apply(self, changed: SiteFile, keys: tuple = (), gesture: tuple | None = None) -> None:
        """Make a valid edit the current state, as one undoable step; the engine recomputes.
        Edits of one `gesture` (a brace moved step by step) make one step together."""
        if gesture is None or gesture != self.gesture:
            self.undo_stack.append(self.site_file)
        self.gesture = gesture
        self.redo_stack.clear()
        self._install(changed)
        if self.evaluation_s < WHOLE_SITE_AT_ONCE_S:
            return  # (the edited wall alone costs about as much: its fixed costs dominate)
        try:
            sooner = quick(self.result, changed, keys)
        except Exception:  # noqa: BLE001 - the whole site's evaluation reports the failure
            sooner = None
        if sooner is not None:
            self.result = sooner  # the whole site's result replaces it when it is ready

    def _install(self, site_file: SiteFile) -> None:
        """Make `site_file` the current state (its path is the current file's) and recompute."""
        if self.site_file is not None and site_file.path != self.site_file.path:
            site_file = replace(site_file, path=self.site_file.path)
        self.site_file = site_file
        self.errors = {}
        self.dirty = bool(site_file.edits) or site_file.text is not self.saved_text
        self.generation += 1
        self.busy = True
        # the whole site once the edited wall is on screen: a worker started now would share
        # the interpreter with the drawing of that wall, and delay it
        self.call_after_refresh(self._evaluate, self.generation, site_file)

    # (described in words: by default the worker's description is its arguments' repr, the
    # whole site file and its model, 5 to 10 ms at every edit)
    @work(thread=True, exclusive=True, group="evaluate", exit_on_error=False,
          description="the whole site's evaluation")
    def _evaluate(self, generation: int, site_file: SiteFile) -> None:
        started = time.perf_counter()
        try:
            result = compute(site_file)
        except Exception as exc:  # noqa: BLE001 - an engine failure must not end the session
            self.call_from_thread(self._failed, generation, exc)
            return
        self.call_from_thread(self._computed, generation, result,
                              time.perf_counter() - started)

    def _computed(self, generation: int, result: SiteResult, took_s: float) -> None:
        self.evaluation_s = took_s
        if generation != self.generation:
            return  # a later edit is on its way
        marks = {p.mark for p in result.panels}
        if self.mark not in marks and result.panels:
            self.mark = walls_in_order(result)[0].mark
        if result.days and self.day not in {d.day for d in result.days}:
            self.day = result.days[0].day
        self.result = result
        self.busy = False

    def _failed(self, generation: int, exc: Exception) -> None:
        if generation != self.generation:
            return
        self.busy = False
        self.notify(f"The engine could not check this input ({exc}); the last valid state is "
                    "kept.", severity="error", timeout=10, markup=False)
        if self.undo_stack:
            self.site_file = self.undo_stack.pop()
            self.dirty = bool(self.site_file.edits) or self.site_file.text is not self.saved_text

    def action_undo(self) -> None:
        """Undo the last edit. The key is always on the footer: showing and hiding it would
        rebuild the footer at each edit."""
        self.gesture = None
        if not self.undo_stack:
            self.notify("Nothing to undo.")
            return
        self.redo_stack.append(self.site_file)
        self._install(self.undo_stack.pop())

    def action_redo(self) -> None:
        self.gesture = None
        if not self.redo_stack:
            self.notify("Nothing to redo.")
            return
        self.undo_stack.append(self.site_file)
        self._install(self.redo_stack.pop())

def run(path: str | None = None) -> int:
    """Open the interface on a site file (a demo site when None); the exit code."""
    try:
        app = BracingApp(path)
    except SiteFileError as exc:
        print(f"bracing: {len(exc.problems)} problem(s) in {exc.path}:", file=sys.stderr)
        for problem in exc.problems:
            print(f"  {problem}", file=sys.stderr)
        return 2
    app.run()
    return app.return_code or 0
