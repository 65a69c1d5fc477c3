"""The pieces the views share: how a status, a verdict or a finding looks (a symbol and a word as
well as colour), a choice list, the caution, the status line and the forms of fields.
"""

from __future__ import annotations

import inspect
import math
from collections.abc import Callable
from dataclasses import dataclass

from rich.segment import Segment
from rich.style import Style
from rich.text import Text
from textual import events, on
from textual.app import ComposeResult
from textual.containers import Vertical
from textual.geometry import Region
from textual.message import Message
from textual.reactive import reactive, var
from textual.strip import Strip
from textual.widgets import DataTable, Footer, Input, Label, Static
from textual.widgets._footer import FooterKey

from bracing.report.text import fmt
from bracing.results import CAUTION
from tui.choice import BLANK, Choice
from tui.fields import FieldSpec

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


def walls_in_order(result) -> list:
    """The walls that fail first (`SiteResult.failing`: a danger finding too, whatever the
    utilization), then the others worst first."""
    failing = result.failing()
    marks = {p.mark for p in failing}
    return failing + [p for p in result.worst_first() if p.mark not in marks]


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


def day_options(days) -> list[tuple[str, int]]:
    """The schedule's days as a choice beside the word "Day" offers them: "7 (2027-05-09)"."""
    return [(f"{d.day}" + (f" ({d.date})" if d.date else ""), d.day) for d in days]


def speed(value: float | None, units: str) -> str:
    return fmt(value, "mph", units)


class Table(DataTable):
    """Textual's table, its lines drawn again only when they change. DataTable draws every
    line again at each Resize event, which Textual sends also when a table is shown at the
    size it was drawn at (at start, after the first screen; at each view switch), and at each
    update of its styles (a view shown, the focus gained or lost), although the lines it keeps
    are kept by the focus state they were drawn in: here they are dropped only when the width
    or the theme changes."""

    def render_lines(self, crop: Region) -> list[Strip]:
        self.__dict__["_drawn_width"] = self.size.width
        if self.__dict__.setdefault("_theme", self.app.theme) != self.app.theme:
            self.__dict__["_theme"] = self.app.theme
            self._clear_caches()
        return super().render_lines(crop)

    def notify_style_update(self) -> None:
        super(DataTable, self).notify_style_update()  # (not DataTable's: it drops every line)
        self._get_styles_to_render_cell.cache_clear()  # (a cell's look, by focus state)
        self.refresh()

    def _on_resize(self, event: events.Resize) -> None:
        if event.size.width == self.__dict__.get("_drawn_width"):
            event.prevent_default()  # (DataTable's handler would draw every line again)

    def _render_cell(self, row_index: int, column_index: int, base_style: Style, width: int,
                     cursor: bool = False, hover: bool = False) -> list[list[Segment]]:
        """A cell of one line of text, its segments made at once: DataTable hands every cell
        to Rich's layout (padding, wrapping, measuring), most of the time a table takes to
        draw. Other cells (a label column, several lines, text set right) go that way."""
        header = row_index == -1
        row_key = self._header_row_key if header else self._row_locations.get_key(row_index)
        height = self.header_height if header else self.rows[row_key].height
        cell = self._get_row_renderables(row_index).cells[column_index] \
            if column_index >= 0 else None
        if (height != 1 or not isinstance(cell, Text) or "\n" in cell.plain
                or cell.justify not in (None, "default", "left")):
            return super()._render_cell(row_index, column_index, base_style, width, cursor,
                                        hover)
        key = (row_key, self._column_locations.get_key(column_index), base_style, cursor,
               hover, self._show_hover_cursor, self._update_count, self._pseudo_class_state)
        lines = self._cell_render_cache.get(key)
        if lines is None:
            fixed = not header and (row_index < self.fixed_rows
                                    or column_index < self.fixed_columns)
            component, post = self._get_styles_to_render_cell(
                header, False, fixed, hover, cursor, self.show_cursor, self._show_hover_cursor,
                self.cursor_foreground_priority == "css",
                self.cursor_background_priority == "css")
            pad = " " * self.cell_padding
            console = self.app.console  # (Text.render leaves out the text's own style)
            text = Segment.apply_style(cell.render(console),
                                       console.get_style(cell.style, default=Style.null()))
            text = Segment.adjust_line_length(list(text), max(0, width - 2 * len(pad)))
            line = Segment.apply_style(
                [Segment(pad), *text, Segment(pad)],
                base_style + Style.from_meta({"row": row_index, "column": column_index})
                + component, post)
            lines = self._cell_render_cache[key] = [list(line)]
        return lines


def show_text(widget: Static, text: Text | str) -> None:
    """Put `text` in `widget` only when it differs from what the widget shows (an update lays
    the screen out again: the whole site's result after a wall's changes little on screen)."""
    text = Text(text) if isinstance(text, str) else text
    key = (text.plain, [(s.start, s.end, str(s.style)) for s in text.spans])
    if widget.__dict__.get("_shown") != key:
        widget.__dict__["_shown"] = key
        widget.update(text, layout=False)
        if not same_size(widget):  # the screen laid out again only when the size changes
            widget.refresh(layout=True)


def same_size(widget: Static) -> bool:
    """True when `widget` keeps its size on screen with the text it now holds: its width does
    not follow its text, and the height the layout would give that text (wrapped as the
    layout wraps it) is its height on screen."""
    size = widget.content_size
    if not size.width or (widget.styles.width is not None and widget.styles.width.is_auto):
        return False
    return widget.get_content_height(widget.size, widget.app.size, size.width) == size.height


def when_changed(watcher: Callable) -> Callable:
    """A view's watcher run only when its attribute holds another object. Textual's data
    binding sets every bound attribute once more, to the object it already holds, when the
    view is mounted, and an attribute that always updates runs its watchers then: each view
    drew itself three or four times at start. A view draws itself whole when mounted."""
    if inspect.iscoroutinefunction(watcher):
        async def run(self, old, new) -> None:
            if old is not new:
                await watcher(self)
    else:
        def run(self, old, new) -> None:
            if old is not new:
                watcher(self)
    run.__name__, run.__doc__ = watcher.__name__, watcher.__doc__
    return run


class DrawnWhenShown:
    """A view that draws only while its pane is on screen: a change made meanwhile is drawn
    when the view comes back (`catch_up`), so that an edit redraws what the user sees, not
    every view built so far."""

    def hidden(self, draw: Callable) -> bool:
        """True when the view is off screen: `draw` is then kept for `catch_up`."""
        pane = self.parent
        if self.is_mounted and pane is not None and not pane.display:
            self.__dict__.setdefault("_pending", {})[draw.__name__] = draw
            return True
        return False

    def redraw(self, draw: Callable) -> None:
        if not self.hidden(draw):
            draw()

    async def redraw_async(self, draw: Callable) -> None:
        if not self.hidden(draw):
            await draw()

    async def catch_up(self) -> None:
        """Draw what changed while the view was off screen."""
        pending = self.__dict__.pop("_pending", {})
        for draw in pending.values():
            done = draw()
            if inspect.isawaitable(done):
                await done


class KeyFooter(Footer):
    """Textual's footer, built again only when the keys it shows change (the footer builds a
    widget per key at every focus change: the better part of a view switch)."""

    @staticmethod
    def keys_shown(screen) -> tuple:
        return tuple((b.key, b.description, enabled)
                     for _, b, enabled, _ in screen.active_bindings.values() if b.show)

    def compose(self) -> ComposeResult:
        """The keys at once (Textual's footer is empty until the first change of the keys,
        then built again: a second layout of the first screen and a focus reset). Where q is
        typed into a field (Textual leaves it out then), ctrl+q, which quits everywhere."""
        self._bindings_ready = True
        shown = self.__dict__["_keys_shown"] = self.keys_shown(self.screen)
        yield from super().compose()
        if not any(key == "q" for key, _, _ in shown):
            self.styles.grid_size_columns += 1
            yield FooterKey("ctrl+q", "^q", "Quit", "app.quit",
                            tooltip="quit (asks first when there are unsaved changes)",
                            ).data_bind(compact=Footer.compact)

    def bindings_changed(self, screen) -> None:
        shown, before = self.keys_shown(screen), self.__dict__.get("_keys_shown")
        if shown == before and screen.app.app_focus:
            return
        if screen.app.app_focus:
            self.__dict__["_keys_shown"] = shown
        super().bindings_changed(screen)


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
            walls = [*self.result.panels, *self.result.foundation_walls]
            failing, total = sum(w.fails for w in walls), len(walls)
            out.append(f"✗ {failing} of {total} walls fail  " if failing else
                       "✗ a danger stands  " if self.result.fails else
                       f"✓ none of {total} walls fails  ",
                       style="bold red" if self.result.fails else "green")
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
        """The label and the box on one line (a grid); the message under them is added when
        there is one (fewer widgets: a form is built and laid out faster)."""
        s = self.spec
        yield Label(s.label, classes="field-label")
        if s.kind == "fixed":
            yield Static(Text(s.value), classes="field-fixed")
        elif s.kind == "choice":
            yield Choice([(Text(c), c) for c in s.choices], value=s.value or BLANK,
                         allow_blank=not s.value,
                         prompt=f"not set ({s.hint})" if s.hint else "not set")
        else:
            yield Input(s.value, placeholder=f"not set ({s.hint})" if s.hint else "not set",
                        compact=True, select_on_focus=False)

    def show(self, spec: FieldSpec) -> None:
        """Show `spec`'s value as the file holds it, whatever the field held before (a value
        typed for another wall and never applied does not linger)."""
        self.spec = spec
        self.set_reactive(FieldRow.value, spec.value)
        if spec.kind == "fixed":
            for fixed in self.query(".field-fixed").results(Static):
                show_text(fixed, spec.value)
        elif spec.kind == "choice":
            for choice in self.query(Choice).results(Choice):
                choice.offer([(Text(c), c) for c in spec.choices], spec.value)
        else:
            for box in self.query(Input).results(Input):
                box.value = spec.value  # (a row not composed yet shows its spec at compose)

    def watch_error(self, error: str) -> None:
        shown = self.query(".field-error")
        if error and not shown:
            self.mount(Static(f"✗ {error}", classes="field-error"))
        elif shown:
            shown.first(Static).update(f"✗ {error}" if error else "")
        self.set_class(bool(error), "-invalid")

    @on(Input.Submitted)
    def _submitted(self, event: Input.Submitted) -> None:
        event.stop()
        if event.value != self.value or self.error:  # (the value the file holds: no edit)
            self.post_message(self.Edited(self, self.spec, event.value))

    @on(Input.Blurred)
    def _left(self, event: Input.Blurred) -> None:
        if event.value != self.value and not self.error:
            self.post_message(self.Edited(self, self.spec, event.value))

    @on(Choice.Changed)
    def _chosen(self, event: Choice.Changed) -> None:
        event.stop()
        if event.value is not BLANK and event.value != self.value:
            self.post_message(self.Edited(self, self.spec, str(event.value)))

    def key_escape(self) -> None:
        """Escape puts back the file's value and leaves the field."""
        if self.spec.kind not in ("choice", "fixed"):
            self.query_one(Input).value = self.value
        self.error = ""
        self.screen.set_focus(None)


class Form(Vertical):
    """A column of fields; rebuilt when the set of fields changes, else only refilled."""

    errors = var(dict, always_update=True, init=False)

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
            # a form not composed yet has no rows: each shows its spec when composed
            for row, spec in zip(self.query(FieldRow), specs, strict=False):
                row.show(spec)
        self.watch_errors(self.errors)

    def watch_errors(self, errors: dict) -> None:
        for row in self.query(FieldRow):
            row.error = errors.get(row.spec.field_id, "")
