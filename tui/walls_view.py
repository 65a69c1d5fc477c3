"""The Walls view: every wall, worst first, with filters."""

from __future__ import annotations

from dataclasses import dataclass

from textual import on
from textual.app import ComposeResult
from textual.containers import Horizontal, Vertical
from textual.message import Message
from textual.reactive import var
from textual.widgets import DataTable, Label, Static

from bracing.results import STATUSES
from tui.choice import Choice
from tui.foundation_view import FoundationSection
from tui.widgets import (
    ALL,
    STATUS_LOOK,
    DrawnWhenShown,
    Table,
    day_options,
    plain,
    speed,
    utilization_text,
    verdict_of,
    wall_status_text,
    walls_in_order,
    when_changed,
)


class WallsView(DrawnWhenShown, Vertical):
    """Every wall, worst first: status, governing utilization, stand-down gust; with filters."""

    @dataclass
    class WallChosen(Message):
        """A wall to open."""

        view: WallsView
        mark: str

        @property
        def control(self) -> WallsView:
            return self.view

    result = var(None, always_update=True, init=False)
    site_file = var(None, always_update=True, init=False)
    units = var("us", init=False)

    # the essential columns first (they fit at 80 columns); wider terminals show the rest
    COLUMNS = ("Wall", "Status", "Stand-down", "Verdict", "Utilization", "Working limit",
               "Braces", "Lift", "Material", "Governing element")

    def compose(self) -> ComposeResult:
        with Horizontal(id="walls-filters"):
            yield Label("Day", classes="filter-label")
            yield Choice([("all", ALL)], value=ALL, allow_blank=False,
                         id="filter-day")
            yield Label("Status", classes="filter-label")
            yield Choice([("all", ALL)] + [(STATUS_LOOK[s][1].lower(), s)
                                                    for s in STATUSES],
                         value=ALL, allow_blank=False, id="filter-status")
            yield Label("Material", classes="filter-label")
            yield Choice([("all", ALL)] + [(m, m) for m in
                                                      ("concrete", "masonry", "framed")],
                         value=ALL, allow_blank=False, id="filter-material")
            yield Static("", id="walls-count")
        yield Table(id="walls-table", cursor_type="row", zebra_stripes=True)
        yield FoundationSection(id="walls-foundation")

    def on_mount(self) -> None:
        self.query_one("#walls-table", DataTable).add_columns(*self.COLUMNS)
        self._days_and_rows()  # whole when mounted: the app gives the attributes first

    @when_changed
    def watch_result(self) -> None:
        self.redraw(self._days_and_rows)

    def _days_and_rows(self) -> None:
        days = day_options(self.result.days if self.result else [])
        select = self.query_one("#filter-day", Choice)
        select.offer([("all", ALL)] + days,
                     select.value if select.value != Choice.BLANK else ALL)
        self.refill()

    @when_changed
    def watch_site_file(self) -> None:
        self.redraw(self.refill)

    @when_changed
    def watch_units(self) -> None:
        self.redraw(self.refill)

    @on(Choice.Changed)
    def _filter(self, event: Choice.Changed) -> None:
        event.stop()
        self.refill()

    def shown(self) -> list:
        """The walls the filters let through: those that fail first, then worst first."""
        if self.result is None:
            return []
        day = self.query_one("#filter-day", Choice).value
        status = self.query_one("#filter-status", Choice).value
        material = self.query_one("#filter-material", Choice).value
        standing = None
        if day not in (ALL, Choice.BLANK):
            d = next((d for d in self.result.days if d.day == day), None)
            standing = set(d.standing) | set(d.lifts) if d else set()
        return [p for p in walls_in_order(self.result)
                if (standing is None or p.mark in standing)
                and status in (ALL, Choice.BLANK, p.status)
                and material in (ALL, Choice.BLANK, p.material)]

    def refill(self) -> None:
        if not self.children:  # (from on_mount on: the view draws itself whole then)
            return
        table = self.query_one("#walls-table", DataTable)
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
        self._foundation()

    def _foundation(self) -> None:
        """The foundation walls under the filters: above the walls when one fails."""
        section = self.query_one(FoundationSection)
        table = self.query_one("#walls-table", DataTable)
        section.show(self.result, self.units, *(self.query_one(f"#filter-{k}", Choice).value
                                                for k in ("day", "status", "material")))
        first = self.children.index(section) < self.children.index(table)
        if section.failing != first:
            self.move_child(section, **{"before" if section.failing else "after": table})

    def _lift_days(self) -> dict[str, str]:
        """Each wall's lift day as the site file gives it."""
        panels = self.site_file.site.panels if self.site_file is not None else []
        return {p.mark: str(p.lift_day) for p in panels if p.lift_day is not None}

    @on(DataTable.RowSelected)
    def _open(self, event: DataTable.RowSelected) -> None:
        event.stop()
        self.post_message(self.WallChosen(self, event.row_key.value))
