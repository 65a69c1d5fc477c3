"""The Settings and Keys views: the wind basis and site rules, and every key."""

from __future__ import annotations

from rich.text import Text
from textual.app import ComposeResult
from textual.containers import VerticalScroll
from textual.reactive import var
from textual.widgets import DataTable, Static

from bracing.model import DEFAULT_RULES
from tui.fields import site_fields
from tui.widgets import (
    DrawnWhenShown,
    Form,
    flag_lines,
    plain,
    when_changed,
)


class SettingsView(DrawnWhenShown, VerticalScroll):
    """The wind basis, exposure, period and the site rules with their sources."""

    result = var(None, always_update=True, init=False)
    site_file = var(None, always_update=True, init=False)
    errors = var(dict, always_update=True, init=False)

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
        self._basis()

    @when_changed
    async def watch_site_file(self) -> None:
        await self.redraw_async(self._inputs)

    async def _inputs(self) -> None:
        if self.site_file is None:
            return
        await self.query_one(Form).show(site_fields(self.site_file))
        self._rules()

    def _rules(self) -> None:
        if self.site_file is None or not self.children:
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

    @when_changed
    def watch_result(self) -> None:
        self.redraw(self._basis)

    def _basis(self) -> None:
        if self.result is None:
            return
        self.query_one("#settings-basis", Static).update(
            Text(f"Basis ({self.result.basis}):\n", style="bold")
            + Text("\n".join(f"  {s}" for s in self.result.basis_statement)))
        self.query_one("#settings-flags", Static).update(flag_lines(self.result.flags))


class KeysView(VerticalScroll):
    """Every key of the interface, and what the mouse does."""

    keys = var(list, always_update=True, init=False)

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
