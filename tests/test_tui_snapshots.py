"""Snapshots of every view of the terminal interface at 120 x 40, on the small test site of
test_tui.py.

The pictures hold the engine's numbers: after a deliberate change to the engine, look at the
report (`snapshot_report.html`) and accept the new pictures with `--snapshot-update`.
"""

from __future__ import annotations

import pytest
from test_tui import SITE
from textual.widgets import Input

from bracing import scenario
from tui import app as tui_app
from tui.app import BracingApp

SIZE = (120, 40)


@pytest.fixture
def make_app(tmp_path):
    """A fresh app on the test site (its result computed once per test)."""
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    result = tui_app.compute(scenario.load(path))

    def make() -> BracingApp:
        return BracingApp(path, result=result)

    return make


@pytest.mark.parametrize("key", ["1", "2", "3", "4", "5", "question_mark"],
                         ids=["walls", "wall", "day", "plan", "settings", "keys"])
def test_each_view(snap_compare, make_app, key):
    assert snap_compare(make_app(), press=[key], terminal_size=SIZE)


def test_an_invalid_value_beside_its_field(snap_compare, make_app):
    async def type_a_bad_height(pilot):
        pilot.app.mark = "M-2"
        await pilot.press("2")
        await pilot.pause()
        box = pilot.app.query_one("#field-height Input", Input)
        box.focus()
        box.value = "-3 ft"
        await pilot.press("enter")
        await pilot.pause()
        pilot.app.screen.set_focus(None)  # no blinking cursor in the picture
        await pilot.pause()

    assert snap_compare(make_app(), run_before=type_a_bad_height, terminal_size=SIZE)
