"""A one-line choice: the chosen value in one widget, its list opened on demand.

Textual's `Select` is five widgets (its value, its arrow and an option list kept mounted);
a form of a dozen of them is sixty widgets to lay out and style at every view switch. This
choice draws itself on one line and builds its list only when opened (Enter, space or a
click): up / down, Enter to choose, Esc to leave it as it was. Letters and digits stay free
for the app's keys.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import ClassVar

from rich.text import Text
from textual import events, on
from textual.app import ComposeResult
from textual.binding import Binding
from textual.message import Message
from textual.reactive import reactive
from textual.screen import ModalScreen
from textual.widget import Widget
from textual.widgets import OptionList


class _Blank:
    """No value chosen."""

    def __repr__(self) -> str:
        return "BLANK"

    def __bool__(self) -> bool:
        return False


BLANK = _Blank()


class ChoiceList(ModalScreen):
    """The list of a choice, drawn over the screen under the choice; dismissed with the
    position of the option chosen, or None."""

    BINDINGS: ClassVar[list[Binding]] = [Binding("escape", "dismiss(None)", "Leave", show=False)]

    def __init__(self, labels: list[Text], current: int | None, x: int, y: int, width: int):
        super().__init__(classes="choice-list-screen")
        self.labels, self.current = labels, current
        self.place = (x, y, width)

    def compose(self) -> ComposeResult:
        yield OptionList(*self.labels, id="choice-list")

    def on_mount(self) -> None:
        options = self.query_one(OptionList)
        x, y, width = self.place
        height = min(len(self.labels), 12) + 2  # (its border)
        screen_w, screen_h = self.app.size
        y = y + 1 if y + 1 + height <= screen_h else max(0, y - height)
        options.styles.width = min(max(width, max((len(t) for t in self.labels), default=0) + 6),
                                   screen_w)
        options.styles.max_height = height
        options.styles.offset = (max(0, min(x, screen_w - width)), y)
        options.highlighted = self.current if self.current is not None else 0
        options.focus()

    @on(OptionList.OptionSelected)
    def _chosen(self, event: OptionList.OptionSelected) -> None:
        event.stop()
        self.dismiss(event.option_index)

    def on_click(self, event: events.Click) -> None:
        if self.get_widget_at(event.screen_x, event.screen_y)[0] is self:
            self.dismiss(None)  # a click beside the list leaves it


class Choice(Widget, can_focus=True):
    """A choice among (label, value) options; `value` is BLANK when none is chosen."""

    BLANK: ClassVar[_Blank] = BLANK
    BINDINGS: ClassVar[list[Binding]] = [
        Binding("enter,space,down", "open", "Choose", show=False),
    ]

    @dataclass
    class Changed(Message):
        """The user (or the program) changed the value."""

        choice: Choice
        value: object

        @property
        def control(self) -> Choice:
            return self.choice

    value = reactive(BLANK, init=False, always_update=False)

    def __init__(self, options, value=BLANK, allow_blank: bool = True, prompt: str = "",
                 **kwargs):
        super().__init__(**kwargs)
        self.options: list[tuple[Text | str, object]] = list(options)
        self.allow_blank = allow_blank
        self.prompt = prompt
        if value is BLANK and not allow_blank and self.options:
            value = self.options[0][1]
        self.set_reactive(Choice.value, value)

    def render(self) -> Text:
        """The value (or the prompt), and the mark of a choice kept in sight when the value
        is cut to the width."""
        label = next((Text(label) if isinstance(label, str) else label.copy()
                      for label, v in self.options if v == self.value), None)
        if label is None:
            label = Text(self.prompt, style="dim")
        room = self.content_size.width - 2
        if 0 < room < label.cell_len:
            label.truncate(room, overflow="ellipsis")
        label.append(" ▾", style="dim")
        return label

    def watch_value(self, value: object) -> None:
        self.post_message(self.Changed(self, value))

    def set_options(self, options) -> None:
        """New options; the value stays only when it is still offered."""
        self.options = list(options)
        if not any(v == self.value for _, v in self.options):
            self.value = self.options[0][1] if self.options and not self.allow_blank else BLANK
        self.refresh()

    def offer(self, options, value) -> None:
        """New options only when they change; a value only when it is offered."""
        if list(options) != self.options:
            self.set_options(options)
        if any(v == value for _, v in self.options) and self.value != value:
            self.value = value

    def action_open(self) -> None:
        if not self.options:
            return
        labels = [Text(label) if isinstance(label, str) else label for label, _ in self.options]
        current = next((k for k, (_, v) in enumerate(self.options) if v == self.value), None)
        region = self.region

        def chosen(index: int | None) -> None:
            if index is not None:
                self.value = self.options[index][1]
            self.focus()

        self.app.push_screen(ChoiceList(labels, current, region.x, region.y, region.width),
                             chosen)

    def on_click(self, event: events.Click) -> None:
        event.stop()
        self.focus()
        self.action_open()
