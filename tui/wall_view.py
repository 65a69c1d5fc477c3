"""The Wall view: one wall's inputs as a form, every check, a section and an elevation."""

from __future__ import annotations

from dataclasses import dataclass
from typing import ClassVar

from rich.text import Text
from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, VerticalScroll
from textual.message import Message
from textual.reactive import reactive, var
from textual.widgets import DataTable, Label, Static

from bracing.report.text import fmt
from bracing.results import STATUSES
from tui import drawing, fields
from tui.choice import Choice
from tui.fields import panel_index, wall_fields
from tui.widgets import (
    UNIT_KEY,
    DrawnWhenShown,
    Form,
    Table,
    flag_lines,
    pass_text,
    plain,
    show_text,
    speed,
    utilization_text,
    wall_status_text,
    when_changed,
)


def openings_of(model) -> list[tuple[float, float, float, float]]:
    """A site-file panel's openings as (x, y, width, height) in ft."""
    return [(o.x, o.y, o.width, o.height) for o in model.openings] if model else []


class BraceElevation(Static, can_focus=True):
    """The wall's elevation. With the focus, up and down choose a brace, left and right move
    it by a step (`fields.MOVE_STEP`, in the units on screen); the app writes the move and the
    engine's force of that brace is shown under the drawing."""

    BINDINGS: ClassVar[list[Binding]] = [
        Binding("up", "choose(-1)", "Previous brace", show=False),
        Binding("down", "choose(1)", "Next brace", show=False),
        Binding("left", "move(-1)", "Move left", show=False),
        Binding("right", "move(1)", "Move right", show=False),
    ]

    @dataclass
    class BraceMoved(Message):
        """Move brace `index` of the wall on view by `step_ft` (a gesture: the moves made
        while the elevation keeps the focus, one undoable edit)."""

        elevation: BraceElevation
        index: int
        step_ft: float
        gesture: int

        @property
        def control(self) -> BraceElevation:
            return self.elevation

    selected = reactive(0, init=False)

    def __init__(self, **kwargs):
        super().__init__("", **kwargs)
        self.panel = None
        self.model = None
        self.units = "us"
        self.gesture = 0

    def draw(self, p, model, units: str) -> None:
        """Draw wall `p` (its result) with `model` (its site-file panel, for the openings)."""
        if self.panel is None or p.mark != self.panel.mark:
            self.set_reactive(BraceElevation.selected, 0)
        self.panel, self.model, self.units = p, model, units
        self._render_wall()

    def validate_selected(self, k: int) -> int:
        count = len(self.panel.braces["positions_ft"]) if self.panel and self.panel.braces \
            else 1
        return max(0, min(count - 1, k))

    def watch_selected(self) -> None:
        self._render_wall()

    def on_focus(self) -> None:
        self.gesture += 1
        self._render_wall()

    def on_blur(self) -> None:
        self._render_wall()

    def action_choose(self, delta: int) -> None:
        self.selected += delta

    def action_move(self, direction: int) -> None:
        if self.panel is not None and self.panel.braces:
            step = direction * fields.move_step_ft(self.units)
            self.post_message(self.BraceMoved(self, self.selected, step, self.gesture))

    def _render_wall(self) -> None:
        p, units = self.panel, self.units
        if p is None:
            show_text(self, "")
            return
        b = p.braces
        lines = drawing.panel_elevation(p, openings_of(self.model), units, self.selected)
        out = Text("\n".join(lines))
        if b:
            k = self.selected
            step = fmt(fields.move_step_ft(units), "ft", units, 1)
            out.append(f"\n{drawing.CHOSEN} brace {k + 1} of {b['count']} at "
                       f"{fmt(b['positions_ft'][k], 'ft', units, 1)}: force "
                       f"{fmt(b['brace_forces_lb'][k], 'lbf', units)}", style="bold")
            out.append(f"\n↑↓ choose a brace, ←→ move it {step}" if self.has_focus else
                       "\nm (or a click): choose a brace and move it", style="dim")
        show_text(self, out)


class WallView(DrawnWhenShown, Horizontal):
    """One wall: its inputs as a form; every check; a section and an elevation."""

    @dataclass
    class WallPicked(Message):
        """A wall chosen in the Wall view's own list."""

        view: WallView
        mark: str

        @property
        def control(self) -> WallView:
            return self.view

    result = var(None, always_update=True, init=False)
    site_file = var(None, always_update=True, init=False)
    mark = var("", init=False)
    units = var("us", init=False)
    errors = var(dict, always_update=True, init=False)

    CHECK_COLUMNS = ("Result", "Element", "Region", "Demand", "Capacity", "Utilization",
                     "Combination", "Source")

    def compose(self) -> ComposeResult:
        with VerticalScroll(id="wall-inputs"):
            with Horizontal(classes="field-line"):
                yield Label("Wall", classes="field-label")
                yield Choice([], prompt="choose a wall", id="wall-select")
            yield Static("Enter applies a value; Esc puts it back.", classes="hint")
            specs = wall_fields(self.site_file, self.mark) if self.site_file else []
            yield Form(specs, id="wall-form").data_bind(WallView.errors)
        with VerticalScroll(id="wall-results"):
            yield Static("", id="wall-summary")
            yield Static("", id="wall-flags")
            yield Table(id="checks-table", cursor_type="row", zebra_stripes=True)
            with Horizontal(id="wall-drawings"):
                yield Static("", id="wall-section", classes="drawing")
                yield BraceElevation(id="wall-elevation", classes="drawing")

    def on_mount(self) -> None:
        self.query_one("#checks-table", DataTable).add_columns(*self.CHECK_COLUMNS)
        self.query_one("#wall-section").border_title = "Section"
        self.query_one("#wall-elevation").border_title = "Elevation"
        self.query_one("#wall-select", Choice).offer(
            [(Text(p.mark), p.mark) for p in self.site_file.site.panels]
            if self.site_file else [], self.mark)
        self._results()  # whole when mounted: the app gives the attributes first

    @when_changed
    async def watch_site_file(self) -> None:
        await self.redraw_async(self._inputs)

    @when_changed
    async def watch_mark(self) -> None:
        await self.redraw_async(self._inputs)
        self.redraw(self._results)

    @when_changed
    def watch_result(self) -> None:
        self.redraw(self._results)

    @when_changed
    def watch_units(self) -> None:
        self.redraw(self._results)

    async def _inputs(self) -> None:
        if self.site_file is None:
            return
        marks = [p.mark for p in self.site_file.site.panels]
        self.query_one("#wall-select", Choice).offer([(Text(m), m) for m in marks], self.mark)
        await self.query_one(Form).show(wall_fields(self.site_file, self.mark))

    @on(Choice.Changed, "#wall-select")
    def _pick(self, event: Choice.Changed) -> None:
        event.stop()
        if event.value != Choice.BLANK and event.value != self.mark:
            self.post_message(self.WallPicked(self, str(event.value)))

    def _results(self) -> None:
        summary = self.query_one("#wall-summary", Static)
        p = next((p for p in self.result.panels if p.mark == self.mark), None) \
            if self.result else None
        if p is None:
            self._checks([])
            show_text(summary, "Choose a wall on the Walls view (Enter) or above.")
            for name in ("#wall-flags", "#wall-section", "#wall-elevation"):
                show_text(self.query_one(name, Static), "")
            self.query_one(BraceElevation).panel = None
            return
        show_text(summary, self._summary(p))
        show_text(self.query_one("#wall-flags", Static), flag_lines(p.flags_worst_first()))
        self._checks([plain(pass_text(c.passes), c.element, c.region,
                            fmt(c.demand, UNIT_KEY.get(c.unit, c.unit), self.units),
                            fmt(c.capacity, UNIT_KEY.get(c.unit, c.unit), self.units),
                            utilization_text(c.utilization), c.combination, c.source)
                      for c in p.worst_first()])
        self._drawings(p)

    def _checks(self, rows: list[list[Text]]) -> None:
        """The checks table, filled again only when a row changes (the table is the slowest
        part of the screen to draw)."""
        key = [[(c.plain, str(c.style)) for c in row] for row in rows]
        if self.__dict__.get("_checks_shown") == key:
            return
        self.__dict__["_checks_shown"] = key
        table = self.query_one("#checks-table", DataTable)
        table.clear()
        for row in rows:
            table.add_row(*row)

    def _summary(self, p) -> Text:
        u, w, units = p.unbraced, p.wind, self.units
        out = Text()
        out.append(f"{p.mark}  ", style="bold")
        out.append(f"{p.material}, {fmt(p.height_ft, 'ft', units, 1)} tall x "
                   f"{fmt(p.width_ft, 'ft', units, 1)} wide x "
                   f"{fmt(p.thickness_in, 'in', units, 2)}: ")
        out.append_text(wall_status_text(p))
        out.append(f" ({STATUSES[p.status]})\n")
        out.append(f"Governing: {p.governing_element}, utilization ")
        out.append_text(utilization_text(p.utilization))
        sustained = p.sustained_equivalents_mph
        out.append(f"\nStand-down gust {speed(p.stand_down_speed_mph, units)} "
                   f"(sustained 1-min {speed(sustained.get('1-min'), units)}, 10-min "
                   f"{speed(sustained.get('10-min'), units)}); working limit "
                   f"{speed(p.working_limit_speed_mph, units)}")
        if p.braces and p.braces.get("working_limit_one_missing_mph") is not None:
            out.append(f"; with one brace struck "
                       f"{speed(p.braces['working_limit_one_missing_mph'], units)}")
        out.append(f"\nDesign wind {speed(w.design_speed_mph, units)} (period factor "
                   f"{w.period_factor:.2f} from {w.period_factor_from}), q_h "
                   f"{fmt(w.velocity_pressure_psf, 'psf', units, 1)}, Cf "
                   f"{w.force_coefficient:.3f}, F {fmt(w.force_lb, 'lbf', units)} at "
                   f"{fmt(w.resultant_height_ft, 'ft', units, 1)}; weight "
                   f"{fmt(p.weight_lb, 'lbf', units)}")
        out.append(f"\nUnbraced: utilization {u.utilization:.2f}; tallest unbraced at the "
                   f"design wind {fmt(u.max_height_ft, 'ft', units, 1)}")
        if u.max_height_at_limit_ft is not None:
            out.append(f", at the limit gust {fmt(u.max_height_at_limit_ft, 'ft', units, 1)}")
        b = p.braces
        if b:
            out.append(f"\nBraces: {b['count']} x {fmt(b['length_ft'], 'ft', units, 1)} at "
                       f"{b['angle_deg']:.0f}°, insert {fmt(b['insert_height_ft'], 'ft', units, 1)}"
                       f", foot {fmt(b['anchor_distance_ft'], 'ft', units, 1)} from the face; "
                       f"brace force {fmt(b['axial_force_lb'], 'lbf', units)}, anchor uplift "
                       f"{fmt(b['anchor_uplift_lb'], 'lbf', units)}, shear "
                       f"{fmt(b['anchor_shear_lb'], 'lbf', units)}")
            if b.get("installation_torque_ftlb") is not None:
                torque = fmt(b["installation_torque_ftlb"], "ft*lbf", units)
                out.append(f"; helical installation torque {torque}")
            if b.get("designed"):
                out.append(" (laid out by the designer)")
        return out

    def _drawings(self, p) -> None:
        model = None
        if self.site_file is not None:
            i = panel_index(self.site_file, p.mark)
            model = self.site_file.site.panels[i] if i is not None else None
        b = p.braces
        section = drawing.section(p.height_ft, p.thickness_in, b, p.footing_ft,
                                  p.wind.resultant_height_ft, self.units)
        show_text(self.query_one("#wall-section", Static), "\n".join(section))
        self.query_one(BraceElevation).draw(p, model, self.units)
