"""Dialogs over the views: unsaved changes on quit, save as, export a day's schedule."""

from __future__ import annotations

import math
from dataclasses import dataclass
from pathlib import Path
from typing import ClassVar

from rich.text import Text
from textual import on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, Vertical, VerticalScroll
from textual.screen import ModalScreen
from textual.widgets import Button, Input, Label, RadioButton, RadioSet, Static

from bracing import scenario
from tui import drawing
from tui.choice import Choice

FORMATS = (("html", "HTML (print it)"), ("csv", "CSV (a spreadsheet)"), ("text", "plain text"))
EXTENSIONS = {"html": "html", "csv": "csv", "text": "txt"}
BY_EXTENSION = {".html": "html", ".htm": "html", ".csv": "csv", ".txt": "text", ".text": "text"}
EVERY_DAY = -1


class UnsavedChanges(ModalScreen[str]):
    """Quit with unsaved changes: save them, drop them or stay."""

    BINDINGS: ClassVar[list[Binding]] = [Binding("escape", "dismiss('stay')", "Stay"),
                Binding("s", "dismiss('save')", "Save and quit"),
                Binding("d", "dismiss('drop')", "Quit without saving")]

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog"):
            yield Static("The site file has unsaved changes.", classes="dialog-title")
            with Horizontal(classes="dialog-buttons"):
                yield Button("Save and quit (s)", id="save", variant="primary")
                yield Button("Quit without saving (d)", id="drop", variant="error")
                yield Button("Stay (Esc)", id="stay")

    @on(Button.Pressed)
    def _answer(self, event: Button.Pressed) -> None:
        self.dismiss(event.button.id)


class SaveAs(ModalScreen[str | None]):
    """Ask for the path to save the site file to."""

    BINDINGS: ClassVar[list[Binding]] = [Binding("escape", "dismiss(None)", "Cancel")]

    def __init__(self, path: str, forbidden: list[Path] = ()):
        """`forbidden`: files the site must never be saved over (its forecast)."""
        super().__init__()
        self.path = path
        self.forbidden = list(forbidden)

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog"):
            yield Static("Save the site file as", classes="dialog-title")
            yield Input(self.path, id="save-path")
            yield Static("", id="save-error", classes="field-error")
            with Horizontal(classes="dialog-buttons"):
                yield Button("Save (Enter)", id="save", variant="primary")
                yield Button("Cancel (Esc)", id="cancel")

    def on_mount(self) -> None:
        self.query_one(Input).focus()

    @on(Input.Submitted)
    @on(Button.Pressed, "#save")
    def _save(self) -> None:
        path = self.query_one(Input).value.strip()
        try:  # before anything is written: a folder, a device, a missing folder, the forecast
            if not path:
                raise scenario.WriteRefused("give a file name")
            scenario.check_output(path, self.forbidden)
        except OSError as exc:
            self.query_one("#save-error", Static).update(Text(f"✗ {exc.strerror or exc}"))
            return
        self.dismiss(path)

    @on(Button.Pressed, "#cancel")
    def _cancel(self) -> None:
        self.dismiss(None)


@dataclass(frozen=True)
class ExportRequest:
    fmt: str
    day: int | None
    path: str


class Export(ModalScreen[ExportRequest | None]):
    """Choose the format, the day and the file for the crew's schedule."""

    BINDINGS: ClassVar[list[Binding]] = [Binding("escape", "dismiss(None)", "Cancel")]

    def __init__(self, stem: str, days: list[tuple[str, int]], day: int | None,
                 folder: str | Path = ""):
        """`stem` names the file, written in `folder` (the site file's) by default."""
        super().__init__()
        self.stem = stem
        self.folder = Path(folder)
        self.suggested = {self._path("html")}  # names the dialog wrote (not the user)
        self.days = days
        self.day = day

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog"):
            yield Static("Export the day's brace schedule", classes="dialog-title")
            with RadioSet(id="export-format"):
                for i, (key, words) in enumerate(FORMATS):
                    yield RadioButton(words, value=i == 0, id=f"format-{key}")
            with Horizontal(classes="dialog-line"):
                yield Label("Day", classes="field-label")
                options = [("every day", EVERY_DAY)] + self.days
                value = self.day if any(v == self.day for _, v in self.days) else EVERY_DAY
                yield Choice(options, value=value, allow_blank=False, id="export-day")
            with Horizontal(classes="dialog-line"):
                yield Label("File", classes="field-label")
                yield Input(self._path("html"), id="export-path", compact=True)
            yield Static(self._format_words("html"), id="export-chosen")
            with Horizontal(classes="dialog-buttons"):
                yield Button("Export (Enter)", id="export", variant="primary")
                yield Button("Cancel (Esc)", id="cancel")

    def on_mount(self) -> None:
        self.query_one("#export", Button).focus()  # Enter exports at once

    @staticmethod
    def _format_words(fmt: str) -> Text:
        """The format chosen, in words (the radio buttons look alike in plain text)."""
        return Text(f"Format: {dict(FORMATS)[fmt]}, .{EXTENSIONS[fmt]}")

    def _fmt(self) -> str:
        pressed = self.query_one(RadioSet).pressed_button
        return pressed.id.removeprefix("format-") if pressed else "html"

    def _day(self) -> int | None:
        value = self.query_one("#export-day", Choice).value
        return None if value in (EVERY_DAY, Choice.BLANK) else int(value)

    def _path(self, fmt: str, day: int | None = None) -> str:
        when = f"-day{day}" if day is not None else ""
        return str(self.folder / f"{self.stem}-schedule{when}.{EXTENSIONS[fmt]}")

    @on(RadioSet.Changed)
    @on(Choice.Changed)
    def _suggest(self) -> None:
        """A suggested name follows the day and the format; a name typed keeps its stem and
        takes the extension of the format chosen."""
        box, fmt = self.query_one("#export-path", Input), self._fmt()
        typed = Path(box.value.strip())
        if box.value in self.suggested or not box.value.strip():
            box.value = self._path(fmt, self._day())
            self.suggested.add(box.value)
        elif BY_EXTENSION.get(typed.suffix.lower()) != fmt:
            box.value = str(typed.with_suffix(f".{EXTENSIONS[fmt]}"))
        self.query_one("#export-chosen", Static).update(self._format_words(fmt))

    @on(Input.Changed, "#export-path")
    def _follow_extension(self, event: Input.Changed) -> None:
        """A file name typed with a known extension chooses its format."""
        fmt = BY_EXTENSION.get(Path(event.value.strip()).suffix.lower())
        if fmt is not None and fmt != self._fmt():
            self.query_one(f"#format-{fmt}", RadioButton).value = True
            self.query_one("#export-chosen", Static).update(self._format_words(fmt))

    @on(Input.Submitted)
    @on(Button.Pressed, "#export")
    def _export(self) -> None:
        path = self.query_one("#export-path", Input).value.strip()
        if path:
            self.dismiss(ExportRequest(self._fmt(), self._day(), path))

    @on(Button.Pressed, "#cancel")
    def _cancel(self) -> None:
        self.dismiss(None)


def layout_lines(title: str, p, units: str) -> Text:
    """A wall's braces as the engine gives them: count, positions, insert height, angle and
    foot distance, brace type, utilization."""
    from bracing.report.text import fmt

    out = Text(f"{title}\n", style="bold")
    b = p.braces if p is not None else None
    if not b:
        out.append("no braces")
        return out
    places = ", ".join(fmt(x, "ft", units, 1) for x in b["positions_ft"])
    out.append(f"{b['count']} x {b['brace_type']}\nat {places}\n"
               f"insert {fmt(b['insert_height_ft'], 'ft', units, 1)}, angle "
               f"{b['angle_deg']:.1f}°\nfoot {fmt(b['anchor_distance_ft'], 'ft', units, 1)} "
               f"from the face\nanchors {b.get('wall_anchor') or '-'} / "
               f"{b.get('foot_anchor') or '-'}\nutilization {_ratio(b['utilization'])}")
    return out


def _ratio(value: float | None) -> str:
    """A utilization as shown: 'unknown' where the engine has none (a brace with no rating)."""
    return "unknown" if value is None or not math.isfinite(value) else f"{value:.2f}"


class DesignProposal(ModalScreen[bool]):
    """The layout designer's braces beside the wall's own: accept (one undoable edit) or
    refuse."""

    BINDINGS: ClassVar[list[Binding]] = [Binding("escape", "dismiss(False)", "Refuse")]

    def __init__(self, mark: str, current, proposal, units: str = "us", openings=()):
        """`openings`: the wall's, (x, y, width, height) in ft, for the drawings."""
        super().__init__()
        self.mark = mark
        self.current = current
        self.proposal = proposal
        self.units = units
        self.openings = list(openings)

    def _column(self, title: str, p) -> Text:
        """A layout in words over its elevation."""
        out = layout_lines(title, p, self.units)
        if p is not None:
            drawn = drawing.panel_elevation(p, self.openings, self.units, cols=30, rows=9)
            out.append("\n\n" + "\n".join(drawn))
        return out

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog"):
            yield Static(Text(f"The layout designer's braces for {self.mark}"),
                         classes="dialog-title")
            with VerticalScroll(classes="proposal"), Horizontal(classes="proposal-columns"):
                yield Static(self._column("Now", self.current), classes="layout")
                yield Static(self._column("Proposed", self.proposal.result)
                             if self.proposal.table else Text(f"No proposal: "
                                                              f"{self.proposal.message}"),
                             classes="layout")
            with Horizontal(classes="dialog-buttons"):
                if self.proposal.table:
                    yield Button("Accept (Enter)", id="accept", variant="primary")
                yield Button("Refuse (Esc)", id="refuse")

    def on_mount(self) -> None:
        self.query_one(Button).focus()

    @on(Button.Pressed)
    def _answer(self, event: Button.Pressed) -> None:
        self.dismiss(event.button.id == "accept")
