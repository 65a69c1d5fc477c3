"""The inside braces of foundation walls placed along the wall (method notes §12): their places
in the result (`inside_brace.positions_ft`, JSON) and drawn on the plan on the days they are in
use, on the wall's inside (the braced side of its line, away from the backfill), labelled clear
of the other labels.

The demo basement (scenarios/basement-duplex.toml): FW-W runs 26 ft along "Basement west",
from (0, 26) south to (0, 0), its inside face on the line and its inside to the east (braced
side left, looking south); braces every 6 ft at most, 7 ft up at 45 degrees. By hand
(geometry): ceil(26 / 6) = 5 equal strips of 26 / 5 = 5.2 ft, braces at their centres
2.6, 7.8, 13.0, 18.2, 23.4 ft from the wall's start (the north end, y = 26 - those: 23.4, 18.2,
13.0, 7.8, 2.6); the foot 7 / tan 45 = 7.0 ft from the inside face, at x = 7. In use days 6 to
10 (tests/test_foundation_gear.py).
"""

from __future__ import annotations

import json
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest
from test_plan_drawings import text_boxes

from bracing import scenario
from bracing.evaluate import evaluate
from bracing.report import json_view, svg

NS = "{http://www.w3.org/2000/svg}"
BASEMENT = Path(__file__).resolve().parents[1] / "scenarios" / "basement-duplex.toml"
PLACES_FT = [2.6, 7.8, 13.0, 18.2, 23.4]


@pytest.fixture(scope="module")
def basement():
    return evaluate(scenario.load(BASEMENT).site, base_dir=BASEMENT.parent)


def _inside_lines(document: str) -> list[tuple[float, float, float, float]]:
    root = ET.fromstring(document.encode("utf-8"))
    return sorted((float(e.get("x1")), float(e.get("y1")), float(e.get("x2")), float(e.get("y2")))
                  for e in root.iter(f"{NS}line") if "inside-brace" in (e.get("class") or ""))


def test_their_places_along_the_wall_are_in_the_result_and_its_json(basement):
    west = next(w for w in basement.foundation_walls if w.mark == "FW-W").inside_brace
    assert west.positions_ft == pytest.approx(PLACES_FT, abs=1e-9)
    record = json.loads(json_view.dumps(json_view.site_record(basement)))
    brace = next(w for w in record["foundation_walls"] if w["mark"] == "FW-W")["inside_brace"]
    assert brace["positions_ft"] == pytest.approx(PLACES_FT, abs=1e-9)


def test_the_plan_draws_them_inside_on_the_days_they_are_in_use(basement):
    lines = _inside_lines(svg.plan_svg(basement, 6))
    assert len(lines) == 5
    for (x1, y1, x2, y2), y in zip(lines, sorted(26.0 - p for p in PLACES_FT), strict=True):
        assert (x1, x2) == pytest.approx((0.0, 7.0), abs=1e-3)   # face to foot, inside (east)
        assert (y1, y2) == pytest.approx((y, y), abs=1e-3)
    for day in (5, 11):  # before the backfill needs them, after the release
        assert _inside_lines(svg.plan_svg(basement, day)) == []


def test_their_label_is_placed_clear_of_the_other_labels(basement):
    root = ET.fromstring(svg.overview_svg(basement, 6).encode("utf-8"))
    labels = text_boxes(root)
    words = [w for w, _, _ in labels]
    assert "5 inside braces at 7 ft" in words
    mine = next(b for w, _, b in labels if w == "5 inside braces at 7 ft")
    for w, _, b in labels:
        if w != "5 inside braces at 7 ft":
            assert not svg.boxes_overlap(mine, b), w


def test_the_legend_names_their_foot_anchor_on_the_days_they_are_in_use(basement):
    """The plan's legend names the inside braces' foot anchor (FW-W's subgrade stakes, drawn as
    the stake's open triangle) on day 6, so that the crew does not read it as the warning's
    triangle; on day 5, no brace in use, it is not named."""
    from bracing.anchor_kinds import KINDS

    (fw_w,) = [w for w in basement.foundation_walls if w.mark == "FW-W"]
    foot = scenario.load(BASEMENT).site.anchor_types[fw_w.inside_brace.foot_anchor].kind
    words = KINDS[foot].words
    assert words in svg.overview_svg(basement, 6)
    assert words not in svg.overview_svg(basement, 5)
