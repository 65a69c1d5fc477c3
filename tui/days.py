"""Dialogs over the lists of days of a site file: its events and its sign-offs.

Each shows the list as the file holds it; Enter adds the entry typed, a row chosen in the table
(Enter or a click) fills the fields to be changed or removed. A new list goes back to the app
only when `check` finds nothing against it (the file's validation, or a sign-off that would come
before its lift or its events); else the reason is shown and nothing changes.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass
from datetime import date
from typing import ClassVar

from rich.text import Text
from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, Vertical
from textual.screen import ModalScreen
from textual.widgets import Button, DataTable, Input, Label, Static

from tui.choice import Choice
from tui.widgets import plain

EVENT_KINDS = ("diaphragm", "connections", "pour_strip", "other")


@dataclass(frozen=True)
class Entry:
    """One field of a list's entries: its site-file key, label and kind ("text", "int",
    "date" or "choice"); an optional one left empty is left out of the entry."""

    key: str
    label: str
    kind: str = "text"
    choices: tuple = ()
    optional: bool = False


EVENT_FIELDS = (Entry("name", "Name"), Entry("day", "Day", "int"),
                Entry("kind", "Kind", "choice", EVENT_KINDS))


def signoff_fields(marks: list[str]) -> tuple[Entry, ...]:
    return (Entry("panel", "Wall", "choice", tuple(marks)), Entry("day", "Day", "int"),
            Entry("by", "By (name)"), Entry("license", "License no.", optional=True),
            Entry("date", "Date (YYYY-MM-DD)", "date", optional=True))


def value_of(text: str, kind: str):
    """What goes into the file for the text typed (text the validation refuses stays text, so
    that its message names it)."""
    s = text.strip()
    if kind == "int" and s.lstrip("-").isdigit():
        return int(s)
    if kind == "date":
        try:
            return date.fromisoformat(s)
        except ValueError:
            return s
    return s


class ListDialog(ModalScreen[list | None]):
    """Add, change or remove the entries of one list of the site file."""

    BINDINGS: ClassVar[list[Binding]] = [Binding("escape", "dismiss(None)", "Cancel")]

    def __init__(self, title: str, fields: tuple[Entry, ...], entries: list[dict],
                 check: Callable[[list[dict]], str | None], defaults: dict | None = None):
        super().__init__()
        self.title_text = title
        self.fields = fields
        self.entries = [dict(e) for e in entries]
        self.check = check
        self.defaults = defaults or {}

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog list-dialog"):
            yield Static(self.title_text, classes="dialog-title")
            yield DataTable(id="list-table", cursor_type="row", zebra_stripes=True)
            for f in self.fields:
                with Horizontal(classes="dialog-line"):
                    yield Label(f.label, classes="field-label")
                    yield self._box(f)
            yield Static("", id="list-error", classes="field-error")
            with Horizontal(classes="dialog-buttons"):
                yield Button("Add (Enter)", id="add", variant="primary")
                yield Button("Change row", id="change")
                yield Button("Remove row", id="remove", variant="error")
                yield Button("Cancel (Esc)", id="cancel")

    def _box(self, f: Entry):
        value = self.defaults.get(f.key)
        if f.kind == "choice":
            return Choice([(Text(c), c) for c in f.choices], allow_blank=False,
                          value=value if value in f.choices else f.choices[0],
                          id=f"entry-{f.key}")
        return Input("" if value is None else str(value), compact=True, id=f"entry-{f.key}")

    def on_mount(self) -> None:
        table = self.query_one(DataTable)
        table.add_columns(*(f.label for f in self.fields))
        for e in self.entries:
            table.add_row(*plain(*("" if e.get(f.key) is None else str(e[f.key])
                                   for f in self.fields)))
        boxes = list(self.query(Input))
        empty = [b for b in boxes if not b.value]  # the first field left to fill
        if boxes:
            (empty or boxes)[0].focus()

    def entry(self) -> dict:
        """The entry typed, as the file would hold it."""
        out = {}
        for f in self.fields:
            box = self.query_one(f"#entry-{f.key}")
            text = str(box.value) if box.value != Choice.BLANK else ""
            if f.optional and not text.strip():
                continue
            out[f.key] = value_of(text, f.kind)
        return out

    @on(DataTable.RowSelected)
    def _fill(self, event: DataTable.RowSelected) -> None:
        """A row chosen: its values in the fields, to change or remove."""
        e = self.entries[event.cursor_row]
        for f in self.fields:
            box = self.query_one(f"#entry-{f.key}")
            box.value = e.get(f.key, "") if f.kind == "choice" else \
                ("" if e.get(f.key) is None else str(e[f.key]))

    def _row(self) -> int | None:
        table = self.query_one(DataTable)
        return table.cursor_row if table.row_count else None

    @on(Input.Submitted)
    @on(Button.Pressed, "#add")
    def _add(self) -> None:
        self._offer([*self.entries, self.entry()])

    @on(Button.Pressed, "#change")
    def _change(self) -> None:
        k = self._row()
        if k is not None:
            self._offer([*self.entries[:k], self.entry(), *self.entries[k + 1:]])

    @on(Button.Pressed, "#remove")
    def _remove(self) -> None:
        k = self._row()
        if k is not None:
            self._offer(self.entries[:k] + self.entries[k + 1:])

    def _offer(self, entries: list[dict]) -> None:
        why = self.check(entries)
        if why:
            self.query_one("#list-error", Static).update(Text(f"✗ Refused: {why}"))
            return
        self.dismiss(entries)

    @on(Button.Pressed, "#cancel")
    def _cancel(self) -> None:
        self.dismiss(None)
