"""The inside braces of foundation walls in the day's gear (method notes §12): counted by type,
braces and foot anchors, against the types' on_hand on every day from the first backfill that
needs them through the wall's release, a shortage flagged as for panels, in the text sheet, the
HTML crew sheet and `check --json`.

The demo basement (scenarios/basement-duplex.toml): FW-W is 26 ft long, braced inside every
6 ft (short-pipe-brace, foot anchor subgrade-stake, 8 of each on hand); its backfill reaches 6 ft
on day 6, above the 2.3 ft it takes as a cantilever that day (the engine's solved limit, worked
by hand in tests/validation/test_backfill_site_hand_checks.py), so its braces are needed from
day 6; the engineer signs it off on day 10 (after the deck, day 9): in use days 6 to 10.
Braces along it: one per strip of at most 6 ft, ceil(26 / 6) = ceil(4.33) = 5 (geometry).
"""

from __future__ import annotations

import json
import re

import pytest
from test_foundation_walls import BASEMENT
from test_foundation_walls import _edited as _site_with

from bracing import cli, scenario
from bracing.evaluate import evaluate
from bracing.report import json_view
from bracing.report import schedule as sheet


def _four_on_hand(doc):
    doc["brace_types"]["short-pipe-brace"]["on_hand"] = 4
    doc["anchor_types"]["subgrade-stake"]["on_hand"] = 4


@pytest.fixture(scope="module")
def basement():
    site = scenario.load(BASEMENT).site
    return site, evaluate(site, base_dir=BASEMENT.parent)


def test_the_inside_braces_are_in_the_day_s_gear_from_need_to_release(basement):
    _, result = basement
    west = next(w for w in result.foundation_walls if w.mark == "FW-W").inside_brace
    assert (west.count, west.in_use_from_day, west.in_use_to_day) == (5, 6, 10)
    days = {d.day: d for d in result.days}
    for n in range(6, 11):
        assert days[n].braces_in_use.get("short-pipe-brace") == 5
        assert days[n].anchors_in_use.get("subgrade-stake") == 5
    for n in (5, 11):  # before the backfill needs them, after the release
        assert "short-pipe-brace" not in days[n].braces_in_use
        assert "subgrade-stake" not in days[n].anchors_in_use
    assert result.peak_inventory["braces"]["short-pipe-brace"] == 5
    assert result.peak_inventory["anchors"]["subgrade-stake"] == 5


def test_the_day_s_sheets_list_them_not_none_in_use(basement):
    site, result = basement
    html = sheet.render(site, result, 6, "html", "us")
    words = " ".join(re.sub(r"<[^>]+>", " ", html[html.index("Inventory in use"):]).split())
    assert "None in use" not in words
    assert "brace short-pipe-brace 5 8 ✔ ok" in words
    assert "anchor subgrade-stake 5 8 ✔ ok" in words
    text = sheet.render(site, result, 6, "text", "us")
    assert "brace short-pipe-brace: 5 / 8" in text and "anchor subgrade-stake: 5 / 8" in text


def test_a_shortage_of_inside_braces_is_a_danger_of_the_day(tmp_path, capsys):
    """With 4 of each on hand, days 6 to 10 are short of 5 - 4 = 1 brace and 1 anchor: a
    danger of each such day (its verdict NO-GO), in `check --json` and on the sheets."""
    path = _site_with(tmp_path, _four_on_hand)
    site = scenario.load(path).site
    result = evaluate(site, base_dir=tmp_path)
    days = {d.day: d for d in result.days}
    for n in range(6, 11):
        assert days[n].short == {"braces": {"short-pipe-brace": 1},
                                 "anchors": {"subgrade-stake": 1}}
        assert {f.message for f in days[n].flags if f.code == "short"} == {
            "short of brace type short-pipe-brace: 1 more needed than on hand",
            "short of anchor type subgrade-stake: 1 more needed than on hand"}
        assert days[n].verdict == "NO-GO"
    assert days[5].short == {"braces": {}, "anchors": {}} and days[5].verdict == "GO"
    record = json.loads(json_view.dumps(json_view.site_record(result)))
    six = next(d for d in record["days"] if d["day"] == 6)
    assert six["braces_in_use"]["short-pipe-brace"] == 5 and six["short"]["braces"] == {
        "short-pipe-brace": 1}
    assert "✖ SHORT 1" in sheet.render(site, result, 6, "text", "us")
    assert "✖ SHORT 1" in sheet.render(site, result, 6, "html", "us")
    assert cli.main(["check", "--json", str(path)]) == 1
    out = json.loads(capsys.readouterr().out)
    assert next(d for d in out["days"] if d["day"] == 7)["short"]["anchors"] == {
        "subgrade-stake": 1}
