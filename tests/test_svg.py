"""SVG views (bracing.report.svg): well-formed XML, the caution, every mark, failing items marked
by more than colour, the day chosen; a wall's section from its result values."""

import xml.etree.ElementTree as ET
from dataclasses import fields

import pytest

from bracing import plan
from bracing.model import Site
from bracing.report import svg
from bracing.results import CAUTION, PanelResult, SiteResult, UnbracedResult, WindResult

NS = "{http://www.w3.org/2000/svg}"


def site() -> Site:
    """Two tilt-up walls on a slab; P-2's slab anchors stand 5 in from the edge (its type needs
    6 in, ACI 318-19 §17.9 with the type's own value); a masonry wall with no braces."""
    wedge = {"kind": "slab", "embedment": 4.5, "diameter": 0.75, "steel_area": 0.334,
             "slab_thickness": 6, "concrete_strength": 3000, "edge_distance": 6}
    return Site.model_validate({
        "version": 1,
        "site": {"name": "Yard & <Co>", "basic_wind_speed": 115},
        "materials": {"tilt": {"kind": "concrete", "unit_weight": 150},
                      "cmu": {"kind": "masonry", "face_weight": 36}},
        "brace_types": {"b": {"kind": "unrated"}},
        "anchor_types": {"wedge": wedge, "helix": {"kind": "helical",
                                                   "installation_torque": 3000}},
        "plan": {"slab": [[-10, -10], [80, -10], [80, 10 + 5 / 12], [-10, 10 + 5 / 12]],
                 "slab_holes": [[[60, 0], [65, 0], [65, 5], [60, 5]]],
                 "slab_joints": [[[35, -10], [35, 10 + 5 / 12]]],
                 "ground": [[[-10, 10 + 5 / 12], [80, 10 + 5 / 12], [80, 60], [-10, 60]]],
                 "areas": [{"name": "Main St", "kind": "public_way",
                            "polygon": [[-10, 50], [80, 50], [80, 60], [-10, 60]]},
                           {"name": "crane", "kind": "crane_path",
                            "polygon": [[-10, -30], [80, -30], [80, -25], [-10, -25]]},
                           {"name": "office", "kind": "office",
                            "polygon": [[70, 20], [78, 20], [78, 30], [70, 30]]}]},
        "lines": [{"name": "A", "start": [0, 0], "end": [70, 0], "braced_side": "left"}],
        "panels": [
            {"mark": "P-1", "material": "tilt", "width": 20, "height": 30, "thickness": 7.25,
             "line": "A", "offset": 0, "lift_day": 1,
             "bracing": {"brace_type": "b", "foot_anchor": "helix", "count": 2,
                         "insert_height": 20, "anchor_distance": 14}},
            {"mark": "P-2", "material": "tilt", "width": 20, "height": 30, "thickness": 7.25,
             "line": "A", "offset": 20.5, "lift_day": 2,
             "bracing": {"brace_type": "b", "foot_anchor": "wedge", "count": 2,
                         "insert_height": 20, "anchor_distance": 10}},
            {"mark": "M-1", "material": "cmu", "width": 20, "height": 8, "thickness": 7.625,
             "line": "A", "offset": 45, "lift_day": 2},
        ],
    })


def result_with(plan_value) -> SiteResult:
    return SiteResult(name="Yard & <Co>", basis="ASD", basis_statement=[], panels=[],
                      plan=plan_value)


def texts(document: str) -> str:
    """All text of the drawing, one space between the pieces."""
    root = ET.fromstring(document.encode("utf-8"))
    return " ".join(t.text or "" for t in root.iter(f"{NS}text"))


def test_plan_svg_parses_and_shows_the_caution_and_every_mark():
    s = site()
    document = svg.plan_svg(result_with(plan.plan_geometry(s, day=2)))
    root = ET.fromstring(document.encode("utf-8"))
    assert root.tag == f"{NS}svg" and root.get("viewBox")
    words = texts(document)
    assert CAUTION in words
    for mark in ("P-1", "P-2", "M-1"):
        assert mark in words
    assert "day 2" in words and "Yard & <Co>" in words


def test_failing_items_carry_a_word_and_a_cross_not_colour_alone():
    document = svg.plan_svg(result_with(plan.plan_geometry(site())))
    words = texts(document)
    assert "DANGER P-2 [anchor-near-edge]" in words
    root = ET.fromstring(document.encode("utf-8"))
    crosses = [g for g in root.iter(f"{NS}g") if g.get("stroke") == svg.DANGER
               and g.find(f"{NS}circle") is not None and len(g.findall(f"{NS}line")) == 2]
    assert len(crosses) >= 2  # one at each of P-2's two anchors, at least


def test_busiest_day_is_drawn_unless_a_day_is_given():
    s = site()
    days = {1: plan.plan_geometry(s, {"P-1"}, day=1),
            2: plan.plan_geometry(s, {"P-1", "P-2", "M-1"}, day=2)}
    assert "Site plan, day 2" in texts(svg.plan_svg(result_with(days)))
    assert "Site plan, day 1" in texts(svg.plan_svg(result_with(days), 1))
    with pytest.raises(ValueError, match="no plan for day 5"):
        svg.plan_svg(result_with(days), 5)


def test_no_plan_gives_a_sheet_with_the_caution():
    document = svg.plan_svg(result_with(None))
    words = texts(document)
    assert "No plan to draw" in words and CAUTION in words


def panel_result(braces: dict | None) -> PanelResult:
    zero = {f.name: 0.0 for f in fields(WindResult)}
    unbraced = {f.name: 0.0 for f in fields(UnbracedResult)}
    return PanelResult(mark="P-1", material="concrete", status="braced", weight_lb=0.0,
                       height_ft=30.0, width_ft=20.0, thickness_in=7.25,
                       wind=WindResult(**zero), unbraced=UnbracedResult(**unbraced), checks=[],
                       flags=[], working_limit_speed_mph=0.0, stand_down_speed_mph=0.0,
                       governing_element="", braces=braces)


def test_section_svg_shows_the_result_values():
    document = svg.section_svg(panel_result({
        "count": 2, "angle_deg": 55.0, "insert_height_ft": 20.0, "anchor_distance_ft": 14.0,
        "length_ft": 24.42}))
    words = texts(document)
    for piece in ("P-1", "30 ft", "7.25 in", "insert 20 ft", "14.00 ft", "55.0°",
                  "brace 24.42 ft", "2 braces"):
        assert piece in words


def test_section_svg_of_a_wall_without_braces():
    assert "no braces" in texts(svg.section_svg(panel_result(None)))


def test_plan_svg_holds_the_overview_then_each_detail_with_the_caution():
    document = svg.plan_svg(result_with(plan.plan_geometry(site(), day=2)))
    words = texts(document)
    assert "Site plan, day 2" in words and "Detail 1 of 1, day 2: A, walls P-1 to M-1" in words
    assert words.index("Site plan, day 2") < words.index("Detail 1 of 1")
    assert CAUTION.split(".")[0] in words


def test_drawings_without_a_plan():
    assert svg.detail_svgs(result_with(None)) == []
    assert svg.elevation_svgs(result_with(None)) == {}  # no walls either
    assert "No plan to draw" in texts(svg.overview_svg(result_with(None)))


def test_detail_shown_alone_carries_the_caution():
    [(d, alone)] = svg.detail_svgs(result_with(plan.plan_geometry(site(), day=2)),
                                   standalone=True)
    [(_, embedded)] = svg.detail_svgs(result_with(plan.plan_geometry(site(), day=2)))
    assert d.marks == ["P-1", "P-2", "M-1"]
    assert CAUTION.split(".")[0] in texts(alone)
    assert CAUTION.split(".")[0] not in texts(embedded)


def test_elevation_of_a_wall_on_no_line_measures_from_its_first_edge():
    """Without a plan, the braces at 5 and 15 ft (the centers of two 10 ft strips of a 20 ft
    wall) are measured from the panel's first edge, as the site file gives them."""
    document = svg.elevation_svg(panel_result({
        "count": 2, "insert_height_ft": 20.0, "anchor_distance_ft": 14.0,
        "positions_ft": [5.0, 15.0]}))
    words = texts(document)
    for piece in ("first edge", "5.00 ft", "15.00 ft", "insert 20 ft",
                  "wall 20 ft"):
        assert piece in words, piece
