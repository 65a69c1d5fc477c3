"""The views: each is given the result object (and the site file) as attributes and formats them.

Attributes come down from the app; a view asks for something (open a wall, pick a day, change a
value) by posting a message up. Pass and fail are shown by a symbol and a word as well as colour.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from rich.text import Text
from textual import on
from textual.app import ComposeResult
from textual.containers import Horizontal, ScrollableContainer, Vertical, VerticalScroll
from textual.message import Message
from textual.reactive import reactive
from textual.widgets import DataTable, Input, Label, Select, Static

from bracing.model import DEFAULT_RULES
from bracing.report.schedule import actions, grouped, headline
from bracing.report.text import fmt, localize
from bracing.results import CAUTION, STATUSES
from tui import drawing
from tui.fields import FieldSpec, panel_index, site_fields, wall_fields

# status: (symbol, word, style); a symbol and a word, never colour alone
STATUS_LOOK = {
    "unsafe": ("✗", "UNSAFE", "bold red"),
    "needs_braces": ("▲", "NEEDS BRACES", "bold yellow"),
    "braced": ("✓", "braced", "green"),
    "stands": ("✓", "stands", "green"),
}
FLAG_LOOK = {"danger": ("✗", "bold red"), "warning": ("!", "bold yellow"), "notice": ("i", "cyan")}
UNIT_KEY = {"lb": "lbf", "lb·ft": "ft*lbf"}  # check units to the converter's names
ALL = "*"


def status_text(status: str) -> Text:
    symbol, word, style = STATUS_LOOK[status]
    return Text(f"{symbol} {word}", style=style)


def wall_status_text(p) -> Text:
    """A wall's status; a wall that fails (`PanelResult.fails`: a danger finding too) never
    shows a pass mark."""
    if p.fails and p.status in ("braced", "stands"):
        return Text(f"✗ {p.status}, DANGER", style="bold red")
    return status_text(p.status)


def verdict_of(p) -> Text:
    """The wall's verdict in a word and a symbol, from `PanelResult.fails` (the one test)."""
    return Text("✗ FAILS", style="bold red") if p.fails else Text("✓ ok", style="green")


def plain(*cells) -> list:
    """Table cells: text as written, never read as markup (a mark may hold "[/]")."""
    return [Text(c) if isinstance(c, str) else c for c in cells]


def utilization_text(u: float) -> Text:
    shown = "inf" if math.isinf(u) else f"{u:.2f}"
    return Text(f"{shown} ✗", style="bold red") if u > 1.0 else Text(f"{shown} ok")


def pass_text(passes: bool) -> Text:
    return Text("✓ ok", style="green") if passes else Text("✗ FAIL", style="bold red")


def flag_lines(flags) -> Text:
    out = Text()
    for f in flags:
        symbol, style = FLAG_LOOK.get(f.severity, ("-", ""))
        out.append(f"{symbol} {f.severity.upper()}: ", style=style)
        out.append(f"{f.message}")
        out.append(f"  [{f.source}]\n" if f.source else "\n", style="dim")
    return out


def speed(value: float | None, units: str) -> str:
    return fmt(value, "mph", units)


class Choice(Select):
    """A one-line list of choices; letters and digits stay free for the app's keys."""

    def __init__(self, options, **kwargs):
        super().__init__(options, compact=True, type_to_search=False, **kwargs)
        self.offered = list(options)

    def offer(self, options: list[tuple[str, object]], value) -> None:
        """New options only when they change; a value only when it is offered."""
        if options != self.offered:
            self.offered = options
            self.set_options(options)
        if any(v == value for _, v in options) and self.value != value:
            self.value = value


class Caution(Static):
    """The caution, docked on every screen."""

    result = reactive(None, always_update=True)

    def render(self) -> Text:
        return Text("⚠ " + (self.result.caution if self.result is not None else CAUTION))


class StatusLine(Static):
    """The site's name, the file, unsaved changes, units and whether a recompute is running."""

    result = reactive(None, always_update=True)
    file_name = reactive("")
    dirty = reactive(False)
    busy = reactive(False)
    units = reactive("us")

    def render(self) -> Text:
        out = Text()
        if self.result is not None:
            failing, total = len(self.result.failing()), len(self.result.panels)
            out.append(f"✗ {failing} of {total} walls fail  " if failing else
                       f"✓ none of {total} walls fails  ",
                       style="bold red" if failing else "green")
        out.append(f"·  {self.file_name}")
        if self.dirty:
            out.append("  ·  unsaved changes", style="bold")
        out.append(f"  ·  {self.units.upper()} units")
        if self.busy:
            out.append("  ·  recomputing…", style="italic")
        if self.result is not None:
            out.append(f"  ·  {self.result.name}", style="bold")
        return out


class FieldRow(Vertical):
    """One input of a form: its label, the value as the file holds it, and any message."""

    @dataclass
    class Edited(Message):
        """The user asks for a new value in the file."""

        row: FieldRow
        spec: FieldSpec
        text: str

        @property
        def control(self) -> FieldRow:
            return self.row

    value = reactive("", init=False)
    error = reactive("", init=False)

    def __init__(self, spec: FieldSpec):
        super().__init__(id=f"field-{spec.field_id}", classes="field")
        self.spec = spec
        self.set_reactive(FieldRow.value, spec.value)

    def compose(self) -> ComposeResult:
        s = self.spec
        with Horizontal(classes="field-line"):
            yield Label(s.label, classes="field-label")
            if s.kind == "fixed":
                yield Static(Text(s.value), classes="field-fixed")
            elif s.kind == "choice":
                yield Choice([(Text(c), c) for c in s.choices], value=s.value or Select.NULL,
                             allow_blank=not s.value,
                             prompt=f"not set ({s.hint})" if s.hint else "not set")
            else:
                yield Input(s.value, placeholder=f"not set ({s.hint})" if s.hint else "not set",
                            compact=True, select_on_focus=False)
        yield Static("", classes="field-error")

    def show(self, spec: FieldSpec) -> None:
        """Show `spec`'s value as the file holds it, whatever the field held before (a value
        typed for another wall and never applied does not linger)."""
        self.spec = spec
        self.set_reactive(FieldRow.value, spec.value)
        if spec.kind == "fixed":
            for fixed in self.query(".field-fixed").results(Static):
                fixed.update(Text(spec.value))
        elif spec.kind == "choice":
            for choice in self.query(Choice).results(Choice):
                choice.offer([(Text(c), c) for c in spec.choices], spec.value)
        else:
            for box in self.query(Input).results(Input):
                box.value = spec.value  # (a row not composed yet shows its spec at compose)

    def watch_error(self, error: str) -> None:
        self.query_one(".field-error", Static).update(f"✗ {error}" if error else "")
        self.set_class(bool(error), "-invalid")

    @on(Input.Submitted)
    def _submitted(self, event: Input.Submitted) -> None:
        event.stop()
        self.post_message(self.Edited(self, self.spec, event.value))

    @on(Input.Blurred)
    def _left(self, event: Input.Blurred) -> None:
        if event.value != self.value and not self.error:
            self.post_message(self.Edited(self, self.spec, event.value))

    @on(Select.Changed)
    def _chosen(self, event: Select.Changed) -> None:
        event.stop()
        if event.value != Select.NULL and event.value != self.value:
            self.post_message(self.Edited(self, self.spec, str(event.value)))

    def key_escape(self) -> None:
        """Escape puts back the file's value and leaves the field."""
        if self.spec.kind not in ("choice", "fixed"):
            self.query_one(Input).value = self.value
        self.error = ""
        self.screen.set_focus(None)


class Form(Vertical):
    """A column of fields; rebuilt when the set of fields changes, else only refilled."""

    errors = reactive(dict, always_update=True, init=False)

    def __init__(self, specs: list[FieldSpec] = (), **kwargs):
        super().__init__(**kwargs)
        self.specs: list[FieldSpec] = list(specs)

    def compose(self) -> ComposeResult:
        yield from (FieldRow(s) for s in self.specs)

    async def show(self, specs: list[FieldSpec]) -> None:
        if [(s.field_id, s.choices) for s in specs] != [(s.field_id, s.choices)
                                                         for s in self.specs]:
            self.specs = specs
            await self.recompose()
        else:
            self.specs = specs
            for row, spec in zip(self.query(FieldRow), specs):
                row.show(spec)
        self.watch_errors(self.errors)

    def watch_errors(self, errors: dict) -> None:
        for row in self.query(FieldRow):
            row.error = errors.get(row.spec.field_id, "")


class WallsView(Vertical):
    """Every wall, worst first: status, governing utilization, stand-down gust; with filters."""

    @dataclass
    class WallChosen(Message):
        """A wall to open."""

        view: WallsView
        mark: str

        @property
        def control(self) -> WallsView:
            return self.view

    result = reactive(None, always_update=True, init=False)
    site_file = reactive(None, always_update=True, init=False)
    units = reactive("us", init=False)

    # the essential columns first (they fit at 80 columns); wider terminals show the rest
    COLUMNS = ("Wall", "Status", "Stand-down", "Verdict", "Utilization", "Working limit",
               "Braces", "Lift", "Material", "Governing element")

    def compose(self) -> ComposeResult:
        with Horizontal(id="walls-filters"):
            yield Label("Day", classes="filter-label")
            yield Choice([("every day", ALL)], value=ALL, allow_blank=False,
                         id="filter-day")
            yield Label("Status", classes="filter-label")
            yield Choice([("every status", ALL)] + [(STATUS_LOOK[s][1].lower(), s)
                                                    for s in STATUSES],
                         value=ALL, allow_blank=False, id="filter-status")
            yield Label("Material", classes="filter-label")
            yield Choice([("every material", ALL)] + [(m, m) for m in
                                                      ("concrete", "masonry", "framed")],
                         value=ALL, allow_blank=False, id="filter-material")
            yield Static("", id="walls-count")
        yield DataTable(id="walls-table", cursor_type="row", zebra_stripes=True)

    def on_mount(self) -> None:
        self.query_one(DataTable).add_columns(*self.COLUMNS)
        self.refill()

    def watch_result(self) -> None:
        days = [(f"day {d.day}" + (f" ({d.date})" if d.date else ""), d.day)
                for d in (self.result.days if self.result else [])]
        select = self.query_one("#filter-day", Choice)
        select.offer([("every day", ALL)] + days,
                     select.value if select.value != Select.NULL else ALL)
        self.refill()

    def watch_site_file(self) -> None:
        self.refill()

    def watch_units(self) -> None:
        self.refill()

    @on(Select.Changed)
    def _filter(self, event: Select.Changed) -> None:
        event.stop()
        self.refill()

    def shown(self) -> list:
        """The walls the filters let through, worst first."""
        if self.result is None:
            return []
        day = self.query_one("#filter-day", Select).value
        status = self.query_one("#filter-status", Select).value
        material = self.query_one("#filter-material", Select).value
        standing = None
        if day not in (ALL, Select.NULL):
            d = next((d for d in self.result.days if d.day == day), None)
            standing = set(d.standing) | set(d.lifts) if d else set()
        return [p for p in self.result.worst_first()
                if (standing is None or p.mark in standing)
                and status in (ALL, Select.NULL, p.status)
                and material in (ALL, Select.NULL, p.material)]

    def refill(self) -> None:
        if not self.is_mounted:
            return
        table = self.query_one(DataTable)
        current = None
        if table.row_count:
            current = table.coordinate_to_cell_key(table.cursor_coordinate).row_key.value
        table.clear()
        panels = self.shown()
        lift = self._lift_days()
        for p in panels:
            table.add_row(*plain(
                p.mark, wall_status_text(p), speed(p.stand_down_speed_mph, self.units),
                verdict_of(p), utilization_text(p.utilization),
                speed(p.working_limit_speed_mph, self.units),
                str(p.braces["count"]) if p.braces else "-", lift.get(p.mark, "-"),
                p.material, p.governing_element), key=p.mark)
        marks = [p.mark for p in panels]
        if current in marks:
            table.move_cursor(row=marks.index(current), animate=False)
        total = len(self.result.panels) if self.result else 0
        self.query_one("#walls-count", Static).update(f"{len(panels)} of {total} walls")

    def _lift_days(self) -> dict[str, str]:
        """Each wall's lift day as the site file gives it."""
        panels = self.site_file.site.panels if self.site_file is not None else []
        return {p.mark: str(p.lift_day) for p in panels if p.lift_day is not None}

    @on(DataTable.RowSelected)
    def _open(self, event: DataTable.RowSelected) -> None:
        event.stop()
        self.post_message(self.WallChosen(self, event.row_key.value))


class WallView(Horizontal):
    """One wall: its inputs as a form; every check; a section and an elevation."""

    @dataclass
    class WallPicked(Message):
        """A wall chosen in the Wall view's own list."""

        view: WallView
        mark: str

        @property
        def control(self) -> WallView:
            return self.view

    result = reactive(None, always_update=True, init=False)
    site_file = reactive(None, always_update=True, init=False)
    mark = reactive("", init=False)
    units = reactive("us", init=False)
    errors = reactive(dict, always_update=True, init=False)

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
            yield DataTable(id="checks-table", cursor_type="row", zebra_stripes=True)
            with Horizontal(id="wall-drawings"):
                yield Static("", id="wall-section", classes="drawing")
                yield Static("", id="wall-elevation", classes="drawing")

    def on_mount(self) -> None:
        self.query_one("#checks-table", DataTable).add_columns(*self.CHECK_COLUMNS)
        self.query_one("#wall-section").border_title = "Section"
        self.query_one("#wall-elevation").border_title = "Elevation"
        self.query_one("#wall-select", Choice).offer(
            [(Text(p.mark), p.mark) for p in self.site_file.site.panels]
            if self.site_file else [], self.mark)
        self._results()  # whole when mounted: the app gives the attributes first

    async def watch_site_file(self) -> None:
        await self._inputs()

    async def watch_mark(self) -> None:
        await self._inputs()
        self._results()

    def watch_result(self) -> None:
        self._results()

    def watch_units(self) -> None:
        self._results()

    async def _inputs(self) -> None:
        if self.site_file is None:
            return
        marks = [p.mark for p in self.site_file.site.panels]
        self.query_one("#wall-select", Choice).offer([(Text(m), m) for m in marks], self.mark)
        await self.query_one(Form).show(wall_fields(self.site_file, self.mark))

    @on(Select.Changed, "#wall-select")
    def _pick(self, event: Select.Changed) -> None:
        event.stop()
        if event.value != Select.NULL and event.value != self.mark:
            self.post_message(self.WallPicked(self, str(event.value)))

    def _results(self) -> None:
        summary = self.query_one("#wall-summary", Static)
        table = self.query_one("#checks-table", DataTable)
        table.clear()
        p = next((p for p in self.result.panels if p.mark == self.mark), None) \
            if self.result else None
        if p is None:
            summary.update("Choose a wall on the Walls view (Enter) or above.")
            for name in ("#wall-flags", "#wall-section", "#wall-elevation"):
                self.query_one(name, Static).update("")
            return
        summary.update(self._summary(p))
        self.query_one("#wall-flags", Static).update(flag_lines(p.flags_worst_first()))
        for c in p.worst_first():
            unit = UNIT_KEY.get(c.unit, c.unit)
            table.add_row(*plain(pass_text(c.passes), c.element, c.region,
                                 fmt(c.demand, unit, self.units),
                                 fmt(c.capacity, unit, self.units),
                                 utilization_text(c.utilization), c.combination, c.source))
        self._drawings(p)

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
        footing = (model.footing.width, model.footing.thickness) \
            if model is not None and model.footing is not None else None
        openings = [(o.x, o.y, o.width, o.height) for o in model.openings] if model else []
        b = p.braces
        section = drawing.section(p.height_ft, p.thickness_in, b, footing,
                                  p.wind.resultant_height_ft, self.units)
        elevation = drawing.elevation(p.width_ft, p.height_ft, b["positions_ft"] if b else [],
                                      b["insert_height_ft"] if b else None, openings,
                                      p.wind.resultant_height_ft, self.units)
        self.query_one("#wall-section", Static).update(Text("\n".join(section)))
        self.query_one("#wall-elevation", Static).update(Text("\n".join(elevation)))


class DayPicker(Horizontal):
    """A day chooser shared by the Day and Plan views."""

    @dataclass
    class DayPicked(Message):
        """A day chosen."""

        picker: DayPicker
        day: int

        @property
        def control(self) -> DayPicker:
            return self.picker

    result = reactive(None, always_update=True, init=False)
    day = reactive(None, init=False)

    def compose(self) -> ComposeResult:
        yield Label("Day", classes="filter-label")
        yield Choice([], prompt="no days in the schedule")
        yield Static("", classes="day-verdict")

    def watch_result(self) -> None:
        self._sync()

    def watch_day(self) -> None:
        self._sync()

    def _sync(self) -> None:
        days = self.result.days if self.result is not None else []
        options = [(f"day {d.day}" + (f" ({d.date})" if d.date else ""), d.day) for d in days]
        self.query_one(Choice).offer(options, self.day)
        d = next((d for d in days if d.day == self.day), None)
        self.query_one(".day-verdict", Static).update(verdict_badge(d) if d else "")

    @on(Select.Changed)
    def _picked(self, event: Select.Changed) -> None:
        event.stop()
        if event.value != Select.NULL and event.value != self.day:
            self.post_message(self.DayPicked(self, int(event.value)))


VERDICT_LOOK = {"GO": ("✓", "bold green"), "GO WITH EXCEPTIONS": ("▲", "bold yellow"),
                "NO-GO": ("✗", "bold red"), "NO CALL": ("?", "bold yellow")}


def verdict_text(d, units: str = "us") -> Text:
    """The day's verdict (the engine's) in a symbol and words, with the walls not to lift."""
    symbol, style = VERDICT_LOOK[d.verdict]
    out = Text()
    out.append(f"{symbol} {headline(d, units)}", style=style)
    return out


def verdict_badge(d) -> Text:
    """The verdict's word and symbol, beside the day picker (the walls it names are in the
    view below)."""
    symbol, style = VERDICT_LOOK[d.verdict]
    out = Text()
    out.append(f"{symbol} {d.verdict}", style=style)
    return out


def verdict_details(d, units: str) -> Text:
    """Why the verdict: the findings that make walls fail, then the two thresholds as actions
    and a marginal day."""
    out = grouped_lines(d.why, units)
    for line in actions(d, units):
        out.append(f"{line}\n", style="bold" if line.startswith(("MARGINAL", "At")) else "")
    return out


def grouped_lines(found, units: str) -> Text:
    """Grouped findings (DayFinding): the walls that share one on its line, with their count."""
    out = Text()
    for sym, sev, walls, message, source in grouped(found):
        symbol, style = FLAG_LOOK.get(sev.lower(), ("-", ""))
        out.append(f"{symbol} {sev}: " + (f"{walls}: " if walls else ""), style=style)
        out.append(localize(message, units))
        out.append(f"  [{source}]\n" if source else "\n", style="dim")
    return out


def shortage(d, kind: str, name: str) -> int:
    """How many of a type the day is short (DayResult.short, by kind or flat)."""
    by_kind = d.short.get("braces" if kind == "brace" else "anchors")
    table = by_kind if isinstance(by_kind, dict) else d.short
    return int(table.get(name, 0) or 0)


NO_SCHEDULE = ("No days to show: the site file gives no lift days, or the schedule is not "
               "available in this version of the engine.")


class RedrawsForTheDay:
    """A view that draws itself again when the result, the day or the units change."""

    def watch_result(self) -> None:
        self._show()

    def watch_day(self) -> None:
        self._show()

    def watch_units(self) -> None:
        self._show()


class DayView(RedrawsForTheDay, Vertical):
    """A day: lifts, walls standing, braces and anchors in use against those on hand, go/no-go."""

    result = reactive(None, always_update=True, init=False)
    site_file = reactive(None, always_update=True, init=False)
    day = reactive(None, init=False)
    units = reactive("us", init=False)

    def compose(self) -> ComposeResult:
        yield DayPicker(id="day-picker").data_bind(DayView.result, DayView.day)
        with VerticalScroll(id="day-body"):
            yield Static("", id="day-summary")
            yield DataTable(id="day-inventory", cursor_type="row", zebra_stripes=True)
            yield Static("", id="day-flags")

    def on_mount(self) -> None:
        self.query_one(DataTable).add_columns("Item", "Kind", "In use", "On hand", "Short")
        self._show()

    def _show(self) -> None:
        if not self.is_mounted:
            return
        table = self.query_one(DataTable)
        table.clear()
        d = None
        if self.result is not None:
            d = next((d for d in self.result.days if d.day == self.day), None)
        summary = self.query_one("#day-summary", Static)
        if d is None:
            summary.update(NO_SCHEDULE)
            self.query_one("#day-flags", Static).update("")
            return
        units = self.units
        out = Text()
        out.append_text(verdict_text(d, units))
        out.append("\n")
        out.append_text(verdict_details(d, units))
        out.append(f"Day {d.day}" + (f", {d.date}" if d.date else "") + ": ", style="bold")
        forecast = ("no forecast gust" if d.forecast_gust_mph is None else
                    f"forecast gust {speed(d.forecast_gust_mph, units)}")
        out.append(forecast
                   + ("  (thunderstorm warning: counts as exceeding)" if d.storm else "")
                   + f"; stand-down gust {speed(d.stand_down_speed_mph, units)}"
                   + (f" (governing wall {d.governing_wall})" if d.governing_wall else "")
                   + f"; working limit {speed(d.working_limit_speed_mph, units)}\n")
        out.append(f"Lifts ({len(d.lifts)}): {', '.join(d.lifts) or 'none'}\n")
        out.append(f"Walls standing ({len(d.standing)}): {', '.join(d.standing) or 'none'}\n")
        out.append(f"Released ({len(d.released)}): {', '.join(d.released) or 'none'}")
        peak = self.result.peak_inventory
        if any(peak.get(k) for k in ("braces", "anchors")):
            most = ", ".join(f"{n} {name}" for k in ("braces", "anchors")
                             for name, n in peak.get(k, {}).items())
            out.append(f"\nMost in use on any day of the job: {most}")
        summary.update(out)
        site = self.site_file.site if self.site_file is not None else None
        for kind, used, stock in (("brace", d.braces_in_use, site and site.brace_types),
                                  ("anchor", d.anchors_in_use, site and site.anchor_types)):
            for name, n in used.items():
                on_hand = stock[name].on_hand if stock and name in stock else None
                short = shortage(d, kind, name)
                table.add_row(*plain(name, kind, str(n), "-" if on_hand is None else str(on_hand),
                                     Text(f"✗ {short} short", style="bold red") if short
                                     else Text("✓ enough", style="green")))
        self.query_one("#day-flags", Static).update(grouped_lines(d.findings, units))
        self.query_one("#day-body").scroll_home(animate=False)  # the verdict in sight


class PlanView(RedrawsForTheDay, Vertical):
    """The site in plan for a chosen day: walls, braces, anchors, fall zones, keep-clear areas."""

    result = reactive(None, always_update=True, init=False)
    day = reactive(None, init=False)
    units = reactive("us", init=False)
    zoom = reactive(1, init=False)

    ZOOM_LIMITS = (1, 8)

    def validate_zoom(self, zoom: float) -> int:
        """x1 to x8."""
        low, high = self.ZOOM_LIMITS
        return int(min(high, max(low, zoom)))

    def compose(self) -> ComposeResult:
        yield DayPicker(id="plan-picker").data_bind(PlanView.result, PlanView.day)
        with ScrollableContainer(id="plan-body"):
            yield Static("", id="plan-canvas")

    def on_mount(self) -> None:
        self._show()

    def on_resize(self) -> None:
        self._show()

    def watch_zoom(self) -> None:
        self._show()

    def _show(self) -> None:
        if not self.is_mounted:
            return
        plan = drawing.pick_plan(self.result.plan, self.day) if self.result is not None else None
        canvas = self.query_one("#plan-canvas", Static)
        if plan is None:
            canvas.update("No plan to draw: the site file gives no plan geometry, or the plan is "
                          "not available in this version of the engine.")
            return
        cols = max(self.size.width - 4, 40) * self.zoom
        rows = max(self.size.height - 8, 12) * self.zoom
        lines = drawing.plan(plan, cols, rows, self.units)
        if plan.day is None:
            lines.insert(0, "Every wall placed (the result holds no plan of each day).")
        elif plan.day != self.day:
            lines.insert(0, f"The plan of day {plan.day} (the result holds none for day "
                            f"{self.day}).")
        lines.insert(0, f"Zoom x{self.zoom} (+ and - keys)" + (": scroll with the arrows or the "
                                                                 "wheel" if self.zoom > 1 else ""))
        canvas.update(Text("\n".join(lines)))


class SettingsView(VerticalScroll):
    """The wind basis, exposure, period and the site rules with their sources."""

    result = reactive(None, always_update=True, init=False)
    site_file = reactive(None, always_update=True, init=False)
    errors = reactive(dict, always_update=True, init=False)

    def compose(self) -> ComposeResult:
        yield Static("Wind basis and the rules the site file sets (Enter applies a value)",
                     classes="section-title")
        specs = site_fields(self.site_file) if self.site_file else []
        yield Form(specs, id="settings-form").data_bind(SettingsView.errors)
        yield Static("", id="settings-basis")
        yield Static("Site rules: value, source and basis", classes="section-title")
        yield DataTable(id="rules-table", cursor_type="row", zebra_stripes=True)
        yield Static("", id="settings-flags")

    def on_mount(self) -> None:
        """Whole when mounted: the app gives the attributes before it mounts the view."""
        self.query_one(DataTable).add_columns("Rule", "Value", "In force", "Source", "Basis")
        self._rules()
        self.watch_result()

    async def watch_site_file(self) -> None:
        if self.site_file is None:
            return
        await self.query_one(Form).show(site_fields(self.site_file))
        self._rules()

    def _rules(self) -> None:
        if self.site_file is None or not self.is_mounted:
            return
        table = self.query_one(DataTable)
        table.clear()
        site = self.site_file.site
        for name in DEFAULT_RULES:
            rule = site.rule(name)
            table.add_row(*plain(name.replace("_", " "),
                                 "-" if rule.value is None else f"{rule.value:g}",
                                 "✓ yes" if rule.enabled else "✗ no (off)", rule.source,
                                 rule.basis), key=name)

    def watch_result(self) -> None:
        if self.result is None:
            return
        self.query_one("#settings-basis", Static).update(
            Text(f"Basis ({self.result.basis}):\n", style="bold")
            + Text("\n".join(f"  {s}" for s in self.result.basis_statement)))
        self.query_one("#settings-flags", Static).update(flag_lines(self.result.flags))


class KeysView(VerticalScroll):
    """Every key of the interface, and what the mouse does."""

    keys = reactive(list, always_update=True, init=False)

    def compose(self) -> ComposeResult:
        yield Static("Keys (the mouse works too: click a tab, a row, a field or a button)",
                     classes="section-title")
        yield DataTable(id="keys-table", cursor_type="row", zebra_stripes=True)

    def on_mount(self) -> None:
        self.query_one(DataTable).add_columns("Key", "What it does", "Where")
        self.watch_keys(self.keys)

    def watch_keys(self, keys: list) -> None:
        if not self.is_mounted:
            return
        table = self.query_one(DataTable)
        table.clear()
        for key, what, where in keys:
            table.add_row(*plain(key, what, where))
