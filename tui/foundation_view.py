"""Foundation walls in the terminal interface (method notes §12): their table on the Walls view,
and a wall's own screen (Enter on its row): its backfill planned against the most it may take,
soil, inside braces, checks worst first, days, findings and a section sketch.

What they show is the result's (`SiteResult.foundation_walls`); tui.foundation formats it.
"""

from __future__ import annotations

from typing import ClassVar

from rich.text import Text
from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Vertical, VerticalScroll
from textual.screen import Screen
from textual.widgets import DataTable, Footer, Static

from tui import foundation
from tui.choice import Choice
from tui.widgets import ALL, Caution


class FoundationSection(Vertical):
    """The foundation walls on the Walls view: failing first, planned against allowed backfill.
    Hidden on a site without them."""

    failing = False  # a foundation wall fails: the Walls view shows this table first

    def compose(self) -> ComposeResult:
        yield Static("", id="foundation-title")
        yield DataTable(id="foundation-table", cursor_type="row", zebra_stripes=True)

    def show(self, result, units: str, day=ALL, status=ALL, material=ALL) -> None:
        """Fill the table with the walls the Walls view's filters let through: on a day, those
        standing without their floor; status 'unsafe', those that fail; a material by kind."""
        every = foundation.walls(result)
        self.display = bool(every)
        self.failing = any(w.fails for w in every)
        day, status, material = (ALL if v == Choice.BLANK else v for v in (day, status, material))
        shown = [w for w in every
                 if (day == ALL or any(d.day == day and d.support != "top support"
                                       for d in w.days))
                 and (status == ALL or (status == "unsafe" and w.fails))
                 and material in (ALL, foundation.MATERIAL_OF.get(w.material))]
        table = self.query_one(DataTable)
        if not table.columns:
            table.add_columns(*foundation.COLUMNS)
        table.clear()
        for w in shown:
            table.add_row(*foundation.table_row(w, units), key=w.mark)
        failing = sum(w.fails for w in every)
        title = Text("Foundation walls, backfill before the floor: ", style="bold")
        title.append(f"{len(shown)} of {len(every)}, ")
        title.append(f"✗ {failing} fail(s)" if failing else "✓ none fails",
                     style="bold red" if failing else "green")
        title.append(" (Enter opens)", style="dim")
        self.query_one("#foundation-title", Static).update(title)

    @on(DataTable.RowSelected)
    def _open(self, event: DataTable.RowSelected) -> None:
        event.stop()
        self.app.push_screen(FoundationScreen(str(event.row_key.value)))


class FoundationScreen(Screen):
    """One foundation wall, over the views: Esc goes back."""

    BINDINGS: ClassVar[list[Binding]] = [
        Binding("escape,backspace", "app.pop_screen", "Back"),
        Binding("left_square_bracket", "step(-1)", "Previous", key_display="["),
        Binding("right_square_bracket", "step(1)", "Next", key_display="]"),
        # the views' keys go back to the views first
        *(Binding(k, f"leave(\"show('{v}')\")", show=False) for k, v in
          (("1", "walls"), ("2", "wall"), ("3", "day"), ("4", "plan"), ("5", "settings"),
           ("question_mark", "keys"))),
        *(Binding(k, f"leave('{a}')", show=False) for k, a in
          (("i", "edit"), ("m", "move_brace"), ("d", "design"), ("a", "toggle_foot"))),
    ]

    def __init__(self, mark: str):
        super().__init__()
        self.mark = mark

    def compose(self) -> ComposeResult:
        with Vertical(id="foundation-banner"):
            yield Caution()
        with VerticalScroll(id="foundation-body"):
            yield Static("", id="foundation-summary")
            yield Static("", id="foundation-flags")
            yield DataTable(id="foundation-checks", cursor_type="row", zebra_stripes=True)
            yield DataTable(id="foundation-days", cursor_type="row", zebra_stripes=True)
            yield Static("", id="foundation-section", classes="drawing")
        yield Footer()

    def on_mount(self) -> None:
        self.query_one("#foundation-checks", DataTable).add_columns(*foundation.CHECK_COLUMNS)
        self.query_one("#foundation-days", DataTable).add_columns(*foundation.DAY_COLUMNS)
        self.query_one("#foundation-checks").border_title = "Checks, worst first"
        self.query_one("#foundation-days").border_title = "Days before the floor"
        self.query_one("#foundation-section").border_title = "Section"
        self.watch(self.app, "result", lambda _: self.draw(), init=False)
        self.watch(self.app, "units", lambda _: self.draw(), init=False)
        self.draw()
        self.query_one("#foundation-body").focus()

    def wall(self):
        return next((w for w in foundation.walls(self.app.result) if w.mark == self.mark), None)

    def draw(self) -> None:
        result, units = self.app.result, self.app.units
        self.query_one(Caution).result = result
        w = self.wall()
        checks = self.query_one("#foundation-checks", DataTable)
        days = self.query_one("#foundation-days", DataTable)
        checks.clear()
        days.clear()
        if w is None:
            self.query_one("#foundation-summary", Static).update(
                f"No foundation wall {self.mark} in the result (Esc goes back).")
            return
        self.query_one("#foundation-summary", Static).update(foundation.summary(w, units))
        self.query_one("#foundation-flags", Static).update(foundation.flag_text(w, units))
        for c in sorted(w.checks, key=lambda c: -c.utilization):
            checks.add_row(*foundation.check_row(c, units))
        before = [d for d in w.days if d.support != "top support"]
        after = [d for d in w.days if d.support == "top support"][:1]  # the floor's first day
        for d in before + after:
            days.add_row(*foundation.day_row(d, units))
        self.query_one("#foundation-section", Static).update(
            Text("\n".join(foundation.section(w, units))))

    def action_step(self, delta: int) -> None:
        """The next or previous foundation wall (failing first)."""
        marks = [w.mark for w in foundation.walls(self.app.result)]
        if marks:
            k = marks.index(self.mark) if self.mark in marks else -delta
            self.mark = marks[(k + delta) % len(marks)]
            self.draw()

    async def action_leave(self, action: str) -> None:
        """Back to the views, then the key's own action there."""
        app = self.app
        app.pop_screen()
        await app.run_action(action)
