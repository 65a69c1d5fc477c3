"""The Day and Plan views: a day's verdict, lifts, braces and anchors, and the site in plan."""

from __future__ import annotations

from dataclasses import dataclass

from rich.text import Text
from textual import on
from textual.app import ComposeResult
from textual.containers import Horizontal, ScrollableContainer, Vertical, VerticalScroll
from textual.message import Message
from textual.reactive import reactive
from textual.widgets import DataTable, Label, Static

from bracing.report.schedule import actions, grouped, headline
from bracing.report.text import localize
from tui import drawing, foundation
from tui.choice import Choice
from tui.widgets import (
    FLAG_LOOK,
    DrawnWhenShown,
    day_options,
    plain,
    show_text,
    speed,
    when_changed,
)


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

    @when_changed
    def watch_result(self) -> None:
        self._sync()

    @when_changed
    def watch_day(self) -> None:
        self._sync()

    def _sync(self) -> None:
        days = self.result.days if self.result is not None else []
        options = day_options(days)
        self.query_one(Choice).offer(options, self.day)
        d = next((d for d in days if d.day == self.day), None)
        show_text(self.query_one(".day-verdict", Static), verdict_badge(d) if d else "")

    @on(Choice.Changed)
    def _picked(self, event: Choice.Changed) -> None:
        event.stop()
        if event.value != Choice.BLANK and event.value != self.day:
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


class RedrawsForTheDay(DrawnWhenShown):
    """A view that draws itself again when the result, the day or the units change."""

    @when_changed
    def watch_result(self) -> None:
        self.redraw(self._show)

    @when_changed
    def watch_day(self) -> None:
        self.redraw(self._show)

    @when_changed
    def watch_units(self) -> None:
        self.redraw(self._show)


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
        if not self.children:  # (from on_mount on: the view draws itself whole then)
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
        out.append_text(foundation.day_lines(self.result, d.day, units))
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
        hand = self.result.on_hand
        for kind, used, stock in (("brace", d.braces_in_use, hand.get("braces", {})),
                                  ("anchor", d.anchors_in_use, hand.get("anchors", {}))):
            for name, n in used.items():
                on_hand = stock.get(name)
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
        self.redraw(self._show)

    def watch_zoom(self) -> None:
        self.redraw(self._show)

    def _show(self) -> None:
        if not self.children:
            return
        plan = (drawing.pick_plan(self.result.plan, self.day, self.result)
                if self.result is not None else None)
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
