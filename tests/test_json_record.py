"""The writer of `bracing check --json` (bracing.report.json_view): the record's layout, null for
what JSON lacks, the days' shared flags, and the text written piece by piece.

No engineering values are checked here: the record's values are the engine's (the golden records
of tests/test_golden_records.py hold them); these tests hold the way they are written.
"""

from __future__ import annotations

import copy
import io
import json
import math
from dataclasses import asdict
from pathlib import Path

import pytest

from bracing import cli, scenario
from bracing.evaluate import evaluate
from bracing.report import json_view

ROOT = Path(__file__).resolve().parents[1]
TOWNHOUSE = ROOT / "scenarios" / "townhouse-framing.toml"  # 24 walls, 20 days, shared day flags


@pytest.fixture(scope="module")
def result():
    return evaluate(scenario.load(TOWNHOUSE).site, base_dir=TOWNHOUSE.parent)


def test_each_top_level_key_wall_and_day_is_a_line_of_its_own(result):
    """A large site's record stays readable line by line: `{`, one line per top-level key, and
    inside `panels` and `days` one line per wall and per day."""
    text = json_view.dumps(json_view.site_record(result))
    record, lines = json.loads(text), text.splitlines()
    assert lines[0] == "{" and lines[-1] == "}"
    for key in ("panels", "days"):
        start = lines.index(f'  "{key}": [')
        items = lines[start + 1:start + 1 + len(record[key])]
        assert [json.loads(line.strip().rstrip(",")) for line in items] == record[key]
        assert lines[start + 1 + len(record[key])] == "  ],"
    top = [line for line in lines if line.startswith('  "')]
    assert [line.split('"')[1] for line in top] == list(record)


def test_nan_and_infinity_are_written_as_null(result):
    """JSON has no NaN or infinity: a result object's non-finite value is null, never the
    `NaN` or `Infinity` tokens that strict readers refuse."""
    wall = copy.deepcopy(result.panels[0])
    wall.weight_lb, wall.wind.kz = math.nan, math.inf
    text = json_view.dumps({"panels": [json_view.panel_record(wall, result.basis)]})
    assert "NaN" not in text and "Infinity" not in text
    written = json.loads(text)["panels"][0]
    assert written["weight_lb"] is None and written["wind"]["kz"] is None


def test_each_day_lists_its_own_flags_though_each_flag_is_written_once(result):
    """A flag object that stands on many days is written once and its text repeated: every day
    still lists exactly its own flags, in its own order."""
    shared = [f for d in result.days for f in d.flags]
    assert len({id(f) for f in shared}) < len(shared)  # the site does share flags between days
    days = json.loads(json_view.dumps(json_view.site_record(result)))["days"]
    assert [d["flags"] for d in days] == [[asdict(f) for f in d.flags] for d in result.days]


class _Stream(io.TextIOWrapper):
    """Standard output as the command has it, keeping each write to its bytes buffer."""

    def __init__(self):
        super().__init__(io.BytesIO(), encoding="utf-8")
        self.pieces: list[bytes] = []
        write = self.buffer.write
        self.buffer.write = lambda b: self.pieces.append(bytes(b)) or write(b)


def test_the_record_is_written_in_pieces_of_a_wall_or_a_day(result):
    """`write` gives the text of `dumps` and a line end, in pieces no longer than a wall's or a
    day's line, so that a large site's text is never whole in memory."""
    stream = _Stream()
    json_view.write(json_view.site_record(result), stream)
    whole = json_view.dumps(json_view.site_record(result)).encode() + b"\n"
    assert b"".join(stream.pieces) == whole
    longest_line = max(len(line) for line in whole.splitlines())
    assert max(len(piece) for piece in stream.pieces) <= longest_line + len(b",\n    ")
    assert len(stream.pieces) > len(result.panels) + len(result.days)


def test_check_json_prints_the_written_record(capsys):
    """`bracing check SITE --json` prints what `write` writes (the review block aside, which
    holds the date)."""
    code = cli.main(["check", str(TOWNHOUSE), "--json"])
    printed = json.loads(capsys.readouterr().out)
    printed.pop("review")
    site = evaluate(scenario.load(TOWNHOUSE).site, base_dir=TOWNHOUSE.parent)
    assert printed == json.loads(json_view.dumps(json_view.site_record(site)))
    assert code == cli.verdict(site)
