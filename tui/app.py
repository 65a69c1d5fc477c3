"""The terminal interface: it owns the site file, the engine's result and the undo stack.

Views get what they show as attributes and ask for changes by messages. An edit goes through
`SiteFile.with_value` (the engine's validation); a valid one is recomputed by the engine in a
worker thread (the latest edit wins), an invalid one is shown beside its field and changes
nothing.
"""

from __future__ import annotations

import re
import sys
from dataclasses import replace
from pathlib import Path
from typing import ClassVar

from rich.markup import escape
from textual import on, work
from textual.app import App, ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.reactive import reactive
from textual.widgets import Footer, Input, Select, Static, TabbedContent, TabPane

from bracing import scenario
from bracing.evaluate import evaluate, evaluate_walls
from bracing.results import SiteResult
from bracing.scenario import REMOVE, SiteFile, SiteFileError
from tui import design
from tui.day_view import DayPicker, DayView, PlanView
from tui.days import EVENT_FIELDS, ListDialog, signoff_fields
from tui.dialogs import (
    DesignProposal,
    Export,
    ExportRequest,
    SaveAs,
    UnsavedChanges,
)
from tui.fields import moved_brace, panel_index, typed, with_values
from tui.settings_view import KeysView, SettingsView
from tui.wall_view import BraceElevation, WallView, openings_of
from tui.walls_view import WallsView
from tui.widgets import Caution, FieldRow, StatusLine

DEMO = Path(__file__).resolve().parents[1] / "scenarios" / "demo-mixed.toml"

VIEWS = {"walls": "1 Walls", "wall": "2 Wall", "day": "3 Day", "plan": "4 Plan",
         "settings": "5 Settings", "keys": "? Keys"}
FOCUS = {"walls": "#walls-table", "wall": "#wall-results", "day": "#day-inventory",
         "plan": "#plan-body", "settings": "#rules-table", "keys": "#keys-table"}

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


def compute(site_file: SiteFile) -> SiteResult:
    """The engine's result for a site file (the interface computes nothing itself); the
    forecast file is read from the site file's folder."""
    return evaluate(site_file.site, base_dir=Path(site_file.path).parent)


def quick(result: SiteResult, site_file: SiteFile, keys: tuple) -> SiteResult | None:
    """After an edit to one wall: the engine's checks of that wall spliced into the last
    result at once (the days and the plan follow with the whole site's result)."""
    if result is None or len(keys) < 2 or keys[0] != "panels":
        return None
    mark = site_file.site.panels[keys[1]].mark
    fresh = {p.mark: p for p in evaluate_walls(site_file.site, {mark})}
    if mark not in {p.mark for p in result.panels}:
        return None
    return replace(result, panels=[fresh.get(p.mark, p) for p in result.panels])


def early_signoffs(result: SiteResult) -> list[str]:
    """The engine's findings of sign-offs that come before their wall's lift or an event its
    release waits for."""
    early = ("signoff-before-event", "signoff-before-lift")
    flags = [f for p in result.panels for f in p.flags] + [f for d in result.days
                                                           for f in d.flags]
    return list(dict.fromkeys(f.message for f in flags if f.code in early))


def problems_text(exc: SiteFileError) -> str:
    """The validation problems without the file name (the field is beside the message)."""
    prefix = re.compile(rf"^{re.escape(str(exc.path))}(:\d+)?: ")
    return "; ".join(prefix.sub("", p) for p in exc.problems)


class BracingApp(App[int]):
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
        Binding("4", "show('plan')", "Plan", show=False, tooltip="the Plan view: the site in plan on a day"),
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

    result: reactive[SiteResult | None] = reactive(None, always_update=True, init=False)
    site_file: reactive[SiteFile | None] = reactive(None, always_update=True, init=False)
    mark = reactive("", init=False)
    day: reactive[int | None] = reactive(None, init=False)
    units = reactive("us", init=False)
    errors = reactive(dict, always_update=True, init=False)
    busy = reactive(False, init=False)
    dirty = reactive(False, init=False)
    file_name = reactive("", init=False)
    keys = reactive(list, init=False)

    def __init__(self, path: str | Path | None = None, result: SiteResult | None = None):
        """Open `path` (a demo site when None); `result` may give its result already computed.

        Raises SiteFileError when the file cannot be read or is not valid.
        """
        super().__init__()
        self.animation_level = "none"  # no sliding tab underline: a view is shown at once
        self.demo = path is None
        site_file = scenario.load(DEMO if path is None else path)
        first = result if result is not None else compute(site_file)
        self.set_reactive(BracingApp.site_file, site_file)
        self.set_reactive(BracingApp.result, first)
        self.set_reactive(BracingApp.mark, first.worst_first()[0].mark if first.panels else "")
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
        yield Footer()

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
            return DayView(id="day-view").data_bind(app.result, app.site_file, app.day,
                                                    app.units)
        if view == "plan":
            return PlanView(id="plan-view").data_bind(app.result, app.day, app.units)
        if view == "settings":
            return SettingsView(id="settings-view").data_bind(app.result, app.site_file,
                                                              app.errors)
        return KeysView(id="keys-view").data_bind(app.keys)

    def on_mount(self) -> None:
        self.query_one("#walls-table").focus()

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
        if action == "undo":
            return True if self.undo_stack else None
        if action == "redo":
            return True if self.redo_stack else None
        return True

    async def _ensure_view(self, view: str) -> None:
        """Build `view` in its pane (in place of the placeholder) if it is not built yet."""
        pane = self.query_one(f"#{view}", TabPane)
        placeholder = pane.query(".loading")
        if placeholder:
            await placeholder.remove()
            widget = self.make_view(view)
            await pane.mount(widget)

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
        if tabs.active != view:
            await self._ensure_view(view)
            self.screen.set_focus(None)  # focus left in the old view would bring it back
            self.view = view
            tabs.active = view
            self.refresh_bindings()
        self._focus_view()

    def action_step(self, delta: int) -> None:
        """The next or previous wall (worst first) or day."""
        if self.view == "wall":
            marks = [p.mark for p in self.result.worst_first()]
            if marks:
                k = marks.index(self.mark) if self.mark in marks else -delta
                self.mark = marks[(k + delta) % len(marks)]
        elif self.view in ("day", "plan"):
            days = [d.day for d in self.result.days]
            if days:
                k = days.index(self.day) if self.day in days else -delta
                self.day = days[max(0, min(len(days) - 1, k + delta))]

    def action_zoom(self, factor: float) -> None:
        view = self.query_one(PlanView)
        view.zoom = view.zoom * factor  # PlanView.validate_zoom keeps it in range

    async def action_edit(self) -> None:
        """Go to the first input of the Wall view (or of Settings when it is on view)."""
        self.edit_next = True
        await self.action_show(self.view if self.view in ("wall", "settings") else "wall")

    def action_leave_field(self) -> None:
        if isinstance(self.focused, (Input, Select)):
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

    @on(DayPicker.DayPicked)
    def _pick_day(self, event: DayPicker.DayPicked) -> None:
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
        self.refresh_bindings()
        self.generation += 1
        self.busy = True
        self._evaluate(self.generation, site_file)

    @work(thread=True, exclusive=True, group="evaluate", exit_on_error=False)
    def _evaluate(self, generation: int, site_file: SiteFile) -> None:
        try:
            result = compute(site_file)
        except Exception as exc:  # noqa: BLE001 - an engine failure must not end the session
            self.call_from_thread(self._failed, generation, exc)
            return
        self.call_from_thread(self._computed, generation, result)

    def _computed(self, generation: int, result: SiteResult) -> None:
        if generation != self.generation:
            return  # a later edit is on its way
        marks = {p.mark for p in result.panels}
        if self.mark not in marks and result.panels:
            self.mark = result.worst_first()[0].mark
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
            self.refresh_bindings()

    def _wall_index(self) -> int | None:
        return panel_index(self.site_file, self.mark) if self.view == "wall" else None

    def action_toggle_foot(self) -> None:
        """The wall's braces given by their foot distance instead of their angle, or back; the
        value carried over is the engine's for the present layout."""
        i = self._wall_index()
        table = self.site_file.data["panels"][i].get("bracing") if i is not None else None
        braces = self.result.panel(self.mark).braces if table else None
        if not braces:
            self.notify("Open a wall with braces (the Wall view) to switch angle and foot "
                        "distance.", severity="warning")
            return
        base = ("panels", i, "bracing")
        if "angle" in table:
            changes = [(base + ("angle",), REMOVE),
                       (base + ("anchor_distance",), f"{braces['anchor_distance_ft']:.2f} ft")]
        else:
            changes = [(base + ("anchor_distance",), REMOVE),
                       (base + ("angle",), f"{braces['angle_deg']:.1f} deg")]
        try:
            self.apply(with_values(self.site_file, changes), base)
        except SiteFileError as exc:
            self.notify(f"Not switched: {problems_text(exc)}", severity="error", markup=False)

    def action_design(self) -> None:
        """The layout designer's proposal for the wall on view, beside its present layout."""
        i = self._wall_index()
        if i is None:
            self.notify("Open a wall (the Wall view) to design its braces.", severity="warning")
            return
        proposal = design.propose(self.site_file, i)
        current = self.result.panel(self.mark)
        openings = openings_of(self.site_file.site.panels[i])
        self.push_screen(DesignProposal(self.mark, current, proposal, self.units, openings),
                         lambda accept: self._design_answer(i, proposal, accept))

    def _design_answer(self, i: int, proposal, accept: bool | None) -> None:
        if not accept or proposal.table is None:
            return
        try:
            changed = self.site_file.with_value(("panels", i, "bracing"), proposal.table)
        except SiteFileError as exc:
            self.notify(f"Not accepted: {problems_text(exc)}", severity="error", markup=False)
            return
        self.apply(changed, ("panels", i, "bracing"))

    def action_signoff(self) -> None:
        """The sign-offs (a wall's release: wall, day, who, license, date)."""
        marks = [p.mark for p in self.site_file.site.panels]
        defaults = {"panel": self.mark, "day": self.day}
        self._edit_list("signoffs", "Sign-offs: the release of a wall's braces (OSHA "
                        "1926.704(a))", signoff_fields(marks), defaults)

    def action_events(self) -> None:
        """The events: the permanent work that makes walls eligible for release."""
        self._edit_list("events", "Events: the permanent work that releases walls",
                        EVENT_FIELDS, {"day": self.day})

    def _edit_list(self, key: str, title: str, entries_fields, defaults: dict) -> None:
        listed = list(self.site_file.data.get(key, []))

        def answer(entries: list[dict] | None) -> None:
            if entries is not None:
                self.apply(self.site_file.with_value((key,), entries), (key,))

        self.push_screen(ListDialog(title, entries_fields, listed,
                                    lambda entries: self._list_refused(key, entries),
                                    defaults), answer)

    def _list_refused(self, key: str, entries: list[dict]) -> str | None:
        """Why a new list of events or sign-offs cannot be recorded: the file's validation, or
        the engine's finding of a sign-off that would then come before its wall's lift or an
        event its release waits for (one not found before the change)."""
        try:
            changed = self.site_file.with_value((key,), entries)
        except SiteFileError as exc:
            return problems_text(exc)
        before = early_signoffs(compute(self.site_file) if self.busy else self.result)
        found = [m for m in early_signoffs(compute(changed)) if m not in before]
        return found[0] if found else None

    async def action_move_brace(self) -> None:
        """Focus the elevation of the wall on view: choose a brace and move it."""
        await self.action_show("wall")
        self.query_one(BraceElevation).focus(scroll_visible=True)

    @on(BraceElevation.BraceMoved)
    def _move_brace(self, event: BraceElevation.BraceMoved) -> None:
        i = panel_index(self.site_file, self.mark)
        p = self.result.panel(self.mark)
        if i is None or not p.braces:
            return
        listed = self.site_file.site.panels[i].bracing.positions or p.braces["positions_ft"]
        try:
            changed = moved_brace(self.site_file, i, listed, event.index, event.step_ft,
                                  self.units)
        except SiteFileError as exc:
            self.notify(f"Not moved: {problems_text(exc)}", severity="warning", markup=False)
            return
        self.apply(changed, ("panels", i, "bracing"),
                   gesture=("move", self.mark, event.index, event.gesture))

    def action_undo(self) -> None:
        self.gesture = None
        if not self.undo_stack:
            return
        self.redo_stack.append(self.site_file)
        self._install(self.undo_stack.pop())

    def action_redo(self) -> None:
        self.gesture = None
        if not self.redo_stack:
            return
        self.undo_stack.append(self.site_file)
        self._install(self.redo_stack.pop())

    # --- files --------------------------------------------------------------------------------
    def action_save(self) -> None:
        if self.demo:
            self.action_save_as()
        elif self.save_to(None) and self.quit_after_save:
            self.exit(0)

    def action_save_as(self) -> None:
        default = "my-site.toml" if self.demo else str(self.site_file.path)
        forecast = scenario.inputs_of(self.site_file.path)[1:]  # never over the forecast
        self.push_screen(SaveAs(default, forecast), self._save_as_chosen)

    def _save_as_chosen(self, path: str | None) -> None:
        if path is None:
            self.quit_after_save = False
            return
        if self.save_to(Path(path)) and self.quit_after_save:
            self.exit(0)

    def save_to(self, path: Path | None) -> bool:
        """Save atomically (the old file kept as .bak); say so, or say why not. A failed save
        changes nothing: the file on disk stays whole and the edits stay unsaved here."""
        try:
            target = self.site_file.save(path)
        except Exception as exc:  # noqa: BLE001 - an edit must never be lost to a failed save
            self.notify(f"Not saved: {exc}", severity="error", timeout=10, markup=False)
            self.quit_after_save = False
            return False
        self.saved_text = self.site_file.text
        self.demo = False
        self.dirty = False
        self.file_name = self._file_label(self.site_file)
        self.notify(f"Saved {target}", markup=False)
        return True

    def action_export(self) -> None:
        if self.busy:
            self.notify("Wait for the recompute to finish, then export.", severity="warning")
            return
        days = [(f"day {d.day}" + (f" ({d.date})" if d.date else ""), d.day)
                for d in self.result.days]
        stem = Path(self.site_file.path).stem
        self.push_screen(Export(stem, days, self.day, Path(self.site_file.path).parent),
                         self.export)

    def export(self, request: ExportRequest | None) -> None:
        """Write the schedule the engine's report renders, atomically."""
        if request is None:
            return
        try:
            from bracing.report import schedule
        except ImportError:
            self.notify("The schedule export is not available in this version of the engine.",
                        severity="error", timeout=10)
            return
        try:
            scenario.check_output(request.path, scenario.inputs_of(self.site_file.path))
            text = schedule.render(self.site_file.site, self.result, request.day, request.fmt,
                                   self.units)
            scenario.atomic_write(Path(request.path), text)
        except (ValueError, OSError) as exc:  # WriteRefused says why (an input, a folder...)
            self.notify(f"Not exported: {exc}", severity="error", timeout=10, markup=False)
            return
        self.notify(f"Wrote {request.path}", markup=False)

    def action_quit(self) -> None:
        if not self.dirty:
            self.exit(0)
            return
        self.push_screen(UnsavedChanges(), self._quit_answer)

    def _quit_answer(self, answer: str | None) -> None:
        if answer == "drop":
            self.exit(0)
        elif answer == "save":
            self.quit_after_save = True
            self.action_save()


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
