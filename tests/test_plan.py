"""Site geometry in plan (bracing.plan): placement, brace feet, zones and the plan's findings.

Every expected value is hand-checked geometry (coordinates worked out on paper, noted beside
each) unless it names a published source with its certainty mark from references.md.
"""

import math

import numpy as np
import pytest
import shapely
from hypothesis import given
from hypothesis import strategies as st
from pydantic import ValidationError

from bracing import plan
from bracing.model import Site

SLAB_WEDGE = {"kind": "slab", "embedment": 4.5, "diameter": 0.75, "steel_area": 0.334,
              "slab_thickness": 6, "concrete_strength": 3000, "edge_distance": 6}
ANCHORS = {
    "wedge": SLAB_WEDGE,  # needs 6 in from an edge (the type's own value)
    "wedge-no-edge": {k: v for k, v in SLAB_WEDGE.items() if k != "edge_distance"},
    "helix": {"kind": "helical", "installation_torque": 3000},
    "block": {"kind": "deadman", "weight": 4000},
}
EAST = {"name": "A", "start": [0, 0], "end": [40, 0], "braced_side": "left"}  # braces go north


def make_site(panels, lines=(EAST,), plan_data=None) -> Site:
    data = {
        "version": 1,
        "site": {"name": "plan test", "basic_wind_speed": 115},
        "materials": {"tilt": {"kind": "concrete", "unit_weight": 150},
                      "cmu": {"kind": "masonry", "face_weight": 36}},
        "brace_types": {"b": {"kind": "unrated"}},
        "anchor_types": ANCHORS,
        "lines": list(lines),
        "panels": panels,
    }
    if plan_data is not None:
        data["plan"] = plan_data
    return Site.model_validate(data)


def wall(mark="P-1", material="tilt", height=30.0, width=20.0, thickness=12.0, line="A",
         offset=0.0, **bracing) -> dict:
    """A panel; keyword arguments, when given, make its bracing (2 braces by default)."""
    p = {"mark": mark, "material": material, "height": height, "width": width,
         "thickness": thickness, "line": line, "offset": offset}
    if bracing:
        p["bracing"] = {"brace_type": "b", "count": 2, "insert_height": 12.0, **bracing}
    return p


def rect(x0, y0, x1, y1):
    return [[x0, y0], [x1, y0], [x1, y1], [x0, y1]]


def codes(found):
    return [(mark, f.code, f.severity) for mark, f in found]


def findings(site, standing=None):
    return plan.plan_findings(site, plan.place(site), standing)


# --- placing walls and braces ---------------------------------------------------------------
def test_panel_placed_along_a_diagonal_line():
    # Hand-checked: line (0,0)->(30,40) is 50 ft long, u = (0.6, 0.8); braced on the right, so
    # n = (0.8, -0.6). Offset 10 ft: first edge (6, 8); width 20: last edge (18, 24); the wall
    # is 12 in = 1 ft deep behind the face: back corners (18, 24) - n = (17.2, 24.6) and
    # (6, 8) - n = (5.2, 8.6). Footprint 20 ft x 1 ft = 20 ft^2.
    line = {"name": "D", "start": [0, 0], "end": [30, 40], "braced_side": "right"}
    site = make_site([wall(line="D", offset=10.0)], lines=[line])
    p = plan.place(site)["P-1"]
    assert p.origin == pytest.approx([6.0, 8.0])
    assert p.direction == pytest.approx([0.6, 0.8])
    assert p.normal == pytest.approx([0.8, -0.6])
    assert p.face == pytest.approx(np.array([[6.0, 8.0], [18.0, 24.0]]))
    corners = np.array(p.footprint.exterior.coords)[:4]
    assert corners == pytest.approx(np.array([[6, 8], [18, 24], [17.2, 24.6], [5.2, 8.6]]))
    assert p.footprint.area == pytest.approx(20.0)


def test_braced_side_sets_the_normal():
    # Hand-checked: looking east along (0,0)->(40,0), left is north (0, 1), right is south.
    for side, normal in (("left", [0.0, 1.0]), ("right", [0.0, -1.0])):
        site = make_site([wall()], lines=[{**EAST, "braced_side": side}])
        assert plan.place(site)["P-1"].normal == pytest.approx(normal)


def test_panels_without_a_line_are_skipped():
    site = make_site([wall(), {**wall("P-2"), "line": None}])
    assert list(plan.place(site)) == ["P-1"]
    assert findings(site) == []


def test_brace_feet_for_a_given_angle():
    # Hand-checked: insert 12 ft, 60 deg: d = 12 / tan 60 = 6.9282 ft. Default positions of 2
    # braces on a 20 ft wall: 5 and 15 ft from its first edge, which is 5 ft along the line.
    site = make_site([wall(offset=5.0, angle=60.0)])
    inserts, feet = plan.brace_points(site, plan.place(site)["P-1"])
    assert inserts == pytest.approx(np.array([[10.0, 0.0], [20.0, 0.0]]))
    assert feet == pytest.approx(np.array([[10.0, 6.9282], [20.0, 6.9282]]), abs=1e-4)


def test_brace_feet_with_pin_offsets_and_given_positions():
    # Hand-checked: pins 6 in off the face and 6 in above the slab: the brace rises 11.5 ft
    # over 11.5 / tan 60 = 6.6395 ft from the insert pin, which is 0.5 ft off the face:
    # d = 7.1395 ft. Positions 2 and 18 ft from the first edge (offset 5): x = 7 and 23.
    site = make_site([wall(offset=5.0, angle=60.0, insert_offset=6.0, foot_offset=6.0,
                           positions=[2.0, 18.0])])
    _, feet = plan.brace_points(site, plan.place(site)["P-1"])
    assert feet == pytest.approx(np.array([[7.0, 7.1395], [23.0, 7.1395]]), abs=1e-4)


# --- zones ----------------------------------------------------------------------------------
def test_masonry_zone_is_height_plus_four_feet_on_one_side():
    # OSHA 29 CFR 1926.706(a) (text): wall height + 4 ft on the unscaffolded side, the whole
    # length: a 10 ft wall 20 ft long -> (10 + 4) x 20 = 280 ft^2, from the face to y = 14.
    site = make_site([wall("M-1", material="cmu", height=10.0, thickness=7.625)])
    zone = plan.zones(site, plan.place(site))["M-1"]
    assert zone.area == pytest.approx(280.0)
    assert zone.bounds == pytest.approx((0.0, 0.0, 20.0, 14.0))


def test_other_walls_zone_is_height_plus_brace_footprint_and_height_behind():
    # common practice (design.md §7): braced side 30 + 15 = 45 ft from the face; the other side
    # 30 ft behind the 1 ft back face: (45 + 1 + 30) x 20 = 1520 ft^2.
    site = make_site([wall(anchor_distance=15.0)])
    zone = plan.zones(site, plan.place(site))["P-1"]
    assert zone.bounds == pytest.approx((0.0, -31.0, 20.0, 45.0))
    assert zone.area == pytest.approx(1520.0)


def test_zone_follows_the_height_of_the_day():
    # OSHA 29 CFR 1926.706(a) (text): a masonry wall built to 6 ft so far: (6 + 4) x 20 ft.
    site = make_site([wall("M-1", material="cmu", height=10.0, thickness=7.625)])
    zone = plan.zones(site, plan.place(site), heights={"M-1": 6.0})["M-1"]
    assert zone.area == pytest.approx(200.0)


def test_only_standing_walls_have_zones():
    site = make_site([wall(), wall("P-2", offset=20.0)])
    assert list(plan.zones(site, plan.place(site), standing={"P-2"})) == ["P-2"]


# --- slab anchors ---------------------------------------------------------------------------
def slab_site(edge_in: float, anchor="wedge", holes=(), joints=()):
    """Feet at y = 10 ft (anchor distance 10), the slab's north edge `edge_in` beyond them."""
    top = 10.0 + edge_in / 12.0
    return make_site([wall(offset=5.0, anchor_distance=10.0, foot_anchor=anchor)],
                     plan_data={"slab": rect(-10, -10, 60, top), "slab_holes": list(holes),
                                "slab_joints": list(joints)})


def test_slab_anchor_5_in_from_the_edge_is_refused_for_a_type_needing_6():
    # ACI 318-19 §17.9 with the type's least edge distance, 6 in (the type's own value).
    site = slab_site(5.0)
    found = findings(site)
    assert codes(found) == [("P-1", "anchor-near-edge", "danger")]
    message = found[0][1].message
    assert "5.0 in from the slab edge" in message and "needs 6 in" in message
    assert "ACI 318-19" in found[0][1].source
    assert plan.foot_edge_distances_in(site, plan.place(site))["P-1"] == pytest.approx(5.0)


def test_slab_anchor_7_in_from_the_edge_passes():
    # ACI 318-19 §17.9 with the type's least edge distance, 6 in: 7 in is enough.
    site = slab_site(7.0)
    assert findings(site) == []
    assert plan.foot_edge_distances_in(site, plan.place(site))["P-1"] == pytest.approx(7.0)


def test_slab_anchor_near_a_joint_is_refused():
    # Hand-checked: a saw-cut joint 4 in south of the feet (y = 10 - 4/12), slab edge 24 in.
    joint = [[-10, 10 - 4 / 12], [60, 10 - 4 / 12]]
    found = findings(slab_site(24.0, joints=[joint]))
    assert codes(found) == [("P-1", "anchor-near-edge", "danger")]
    assert "4.0 in from a slab joint" in found[0][1].message


def test_slab_anchor_in_a_hole_is_off_the_slab():
    # Hand-checked: a pit 4 ft square around the foot at (10, 10).
    site = slab_site(36.0, holes=[rect(8, 8, 12, 12)])
    found = findings(site)
    assert codes(found) == [("P-1", "anchor-off-slab", "danger")]
    assert "in a slab hole" in found[0][1].message
    assert plan.foot_edge_distances_in(site, plan.place(site))["P-1"] == 0.0


@pytest.mark.parametrize("key, polygon, words", [
    ("slab", [[0, 0], [40, 0], [0, 30], [40, 30]], "the slab outline crosses"),  # a bow tie
    ("slab_holes", [[[8, 8], [12, 8], [10, 8], [10, 12]]], "outline 1 crosses"),  # doubles back
    ("ground", [[[0, 0], [10, 0]]], "outline 1 needs at least 3 corners"),
])
def test_an_outline_that_is_not_one_simple_loop_is_refused(key, polygon, words):
    # A crossed or doubled-back outline has no clear edge: the anchors' edge distances could
    # not be measured, so the file is refused instead of the check going quiet.
    data = {"slab": rect(-10, -10, 50, 50), key: polygon}
    with pytest.raises(ValidationError, match=words):
        make_site([wall()], plan_data=data)


def test_slab_anchor_past_the_slab_edge_is_off_the_slab():
    found = findings(slab_site(-12.0))  # the slab stops 1 ft short of the feet
    assert codes(found) == [("P-1", "anchor-off-slab", "danger")]
    assert "off the slab" in found[0][1].message


def test_slab_anchor_type_without_an_edge_distance_needs_six_diameters():
    # ACI 318-19 §17.9.2, 6 d_a (from memory): 6 x 0.75 in = 4.5 in; 4 in fails, 5 in passes.
    assert codes(findings(slab_site(4.0, anchor="wedge-no-edge"))) == [
        ("P-1", "anchor-near-edge", "danger")]
    assert findings(slab_site(5.0, anchor="wedge-no-edge")) == []


def test_edge_distance_is_infinite_without_a_slab_anchor_or_a_plan():
    site = make_site([wall(anchor_distance=10.0, foot_anchor="helix"), wall("P-2", offset=20.0,
                                                                           anchor_distance=10.0,
                                                                           foot_anchor="wedge")])
    assert plan.foot_edge_distances_in(site, plan.place(site)) == {"P-1": math.inf,
                                                                   "P-2": math.inf}
    assert ("P-2", "anchor-not-located", "notice") in codes(findings(site))


# --- ground anchors -------------------------------------------------------------------------
def ground_site(anchor: str, ground, slab=None):
    data = {"ground": [ground]}
    if slab:
        data["slab"] = slab
    return make_site([wall(offset=5.0, anchor_distance=10.0, foot_anchor=anchor)],
                     plan_data=data)


def test_helical_anchor_on_open_ground_passes_and_off_it_is_flagged():
    assert findings(ground_site("helix", rect(0, 5, 40, 20))) == []
    assert codes(findings(ground_site("helix", rect(0, 12, 40, 20)))) == [
        ("P-1", "ground-anchor-off-ground", "danger")]


def test_deadman_may_sit_on_the_slab():
    ground = rect(0, 30, 40, 40)  # away from the feet
    assert findings(ground_site("block", ground, slab=rect(-5, -5, 45, 20))) == []
    assert codes(findings(ground_site("block", ground, slab=rect(-5, -5, 45, 8)))) == [
        ("P-1", "ground-anchor-off-ground", "danger")]


# --- braces against braces, walls and areas --------------------------------------------------
def corner_site():
    # Hand-checked: wall A along the x axis (first edge at x = 0, 30 ft), braces north at
    # x = 7.5 and 22.5 with feet at y = 12 (insert 12 ft). Wall B on the line x = 35 running
    # north, braced to the west (left), first edge at y = 4, 20 ft wide: braces at y = 9 and
    # 19, feet at x = 15 (anchor distance 20, insert 16 ft). A's brace at x = 22.5 meets B's
    # brace at y = 9 at (22.5, 9): A's brace there is 9/12 of the way down from 12 ft: 3 ft up;
    # B's is (35 - 22.5)/20 = 0.625 of the way down from 16 ft: 6 ft up.
    north = {"name": "B", "start": [35, 2], "end": [35, 40], "braced_side": "left"}
    return make_site([wall("A-1", width=30.0, anchor_distance=12.0),
                      wall("B-1", line="B", offset=2.0, anchor_distance=20.0,
                           insert_height=16.0)], lines=[EAST, north])


def test_crossing_braces_are_flagged_on_both_walls():
    found = [(m, f) for m, f in findings(corner_site()) if f.code == "braces-cross"]
    assert sorted(m for m, _ in found) == ["A-1", "B-1"]
    a = next(f for m, f in found if m == "A-1")
    assert "(22.5, 9.0) ft" in a.message and "3.0 ft and 6.0 ft" in a.message
    geometry = plan.plan_geometry(corner_site())
    points = [f.at for f in geometry.findings if f.flag.code == "braces-cross"]
    assert points[0][0] == pytest.approx((22.5, 9.0))


def test_braces_of_a_wall_not_standing_are_not_checked():
    assert [f for _, f in findings(corner_site(), standing={"A-1"})
            if f.code == "braces-cross"] == []


def test_brace_crossing_a_keep_clear_area_is_flagged():
    # Hand-checked: a crane path across y = 4..6 is crossed by both braces (feet at y = 10).
    areas = [{"name": "crane", "kind": "crane_path", "polygon": rect(-5, 4, 45, 6)},
             {"name": "laydown", "kind": "work", "polygon": rect(-5, 7, 45, 9)}]
    site = make_site([wall(anchor_distance=10.0)], plan_data={"areas": areas})
    found = [(m, f) for m, f in findings(site) if f.code.startswith("brace")]
    assert codes(found) == [("P-1", "brace-crosses-keep-clear", "danger")]
    assert "braces 1, 2" in found[0][1].message and "crane" in found[0][1].message


def test_brace_running_through_another_wall_is_flagged():
    # Hand-checked: wall W-2 on a line at y = 6 (east, braced north) lies across P-1's braces,
    # whose feet are at y = 10; its footprint is y = 5..6.
    other = {"name": "F", "start": [-5, 6], "end": [45, 6], "braced_side": "left"}
    site = make_site([wall(anchor_distance=10.0), wall("W-2", line="F", width=40.0)],
                     lines=[EAST, other])
    found = [(m, f) for m, f in findings(site) if f.code == "brace-crosses-wall"]
    assert [(m, f.severity) for m, f in found] == [("P-1", "danger"), ("P-1", "danger")]
    assert "W-2" in found[0][1].message


def test_walls_side_by_side_are_not_flagged():
    site = make_site([wall(anchor_distance=10.0, positions=[0.0, 20.0]),
                      wall("P-2", offset=20.0, anchor_distance=10.0)])
    assert findings(site) == []  # a brace at the shared edge touches P-2, it does not cross


# --- zones against areas --------------------------------------------------------------------
def test_zone_over_the_public_way_work_area_and_crane_path():
    # Hand-checked: the 10 ft masonry wall's zone reaches y = 14 (OSHA 29 CFR 1926.706(a),
    # text); a public way from y = 12 overlaps it by 2 x 20 = 40 ft^2.
    areas = [{"name": "Main St", "kind": "public_way", "polygon": rect(-5, 12, 45, 20)},
             {"name": "yard", "kind": "work", "polygon": rect(15, 1, 25, 3)},
             {"name": "crane", "kind": "crane_path", "polygon": rect(-5, 5, 2, 6)},
             {"name": "far", "kind": "neighbour", "polygon": rect(-5, 30, 45, 40)}]
    site = make_site([wall("M-1", material="cmu", height=10.0, thickness=7.625)],
                     plan_data={"areas": areas})
    found = findings(site)
    assert sorted(codes(found)) == [("M-1", "zone-overlap", "danger"),
                                    ("M-1", "zone-overlap", "warning"),
                                    ("M-1", "zone-overlaps-crane-path", "warning")]
    public = next(f for _, f in found if f.severity == "danger")
    assert "40 ft²" in public.message and "1926.706(a)" in public.source


# --- the plan as the views read it ---------------------------------------------------------
def test_plan_geometry_of_a_day():
    site = make_site([wall(anchor_distance=10.0, foot_anchor="wedge"),
                      wall("P-2", offset=20.0, anchor_distance=10.0)],
                     plan_data={"slab": rect(-10, -10, 60, 30),
                                "slab_holes": [rect(40, 20, 45, 25)]})
    g = plan.plan_geometry(site, standing={"P-1"}, day=3)
    assert g.day == 3 and g.standing == ["P-1"]
    p1, p2 = g.panels
    assert p1.braces == [((5.0, 0.0), (5.0, 10.0)), ((15.0, 0.0), (15.0, 10.0))]
    assert p1.foot_kind == "slab" and p1.restricted_zone == p1.evacuated_zone
    assert p2.braces == [] and p2.restricted_zone == []
    assert g.bounds == pytest.approx((-10.0, -31.0, 60.0, 40.0))  # P-1's zone: -31 to 40


def test_plan_geometry_without_a_plan_or_lines():
    g = plan.plan_geometry(make_site([{**wall(), "line": None}], lines=()))
    assert g.panels == [] and g.findings == [] and g.bounds == (0.0, 0.0, 1.0, 1.0)


def test_wall_past_the_end_of_its_line_is_noted():
    # Hand-checked: offset 25 + width 20 = 45 ft along a 40 ft line.
    assert codes(findings(make_site([wall(offset=25.0)]))) == [
        ("P-1", "past-line-end", "notice")]


# --- properties -----------------------------------------------------------------------------
angles = st.floats(0.0, 2 * math.pi)
sides = st.sampled_from(["left", "right"])


@given(angles, sides, st.floats(1.0, 40.0), st.floats(4.0, 16.0), st.floats(2.0, 30.0))
def test_geometry_does_not_depend_on_the_line_direction(theta, side, width, thickness, d):
    # Footprint width x thickness; every foot d from the face line on the braced side;
    # masonry zone (h + 4) x width (OSHA 29 CFR 1926.706(a), text), all for any direction.
    end = [50 * math.cos(theta), 50 * math.sin(theta)]
    line = {"name": "A", "start": [0, 0], "end": end, "braced_side": side}
    site = make_site([wall(width=width, thickness=thickness, anchor_distance=d),
                      wall("M-1", material="cmu", height=10.0, width=width, offset=width)],
                     lines=[line])
    places = plan.place(site)
    p = places["P-1"]
    assert p.footprint.area == pytest.approx(width * thickness / 12.0)
    _, feet = plan.brace_points(site, p)
    u = np.array(end) / 50.0
    cross = u[0] * feet[:, 1] - u[1] * feet[:, 0]  # signed distance, + on the left
    assert cross == pytest.approx(np.full(2, d if side == "left" else -d))
    assert plan.zones(site, places)["M-1"].area == pytest.approx(14.0 * width)


@given(angles, sides, st.floats(2.0, 30.0), st.floats(-10.0, 60.0), st.floats(-10.0, 50.0))
def test_foot_edge_distance_is_the_distance_to_the_nearest_edge(theta, side, d, x, y):
    # Geometry: the least distance from a wall's slab-anchor feet to the slab edge, a hole or a
    # joint (0 for a foot off the slab), equal to shapely's point-to-line distance to the bit.
    slab = [[0, 0], [50, -5], [65, 30], [30, 55], [-5, 35]]
    hole, joint = rect(20, 20, 26, 24), [[-5, 10], [40, 52]]
    line = {"name": "A", "start": [x, y], "end": [x + 30 * math.cos(theta),
                                                 y + 30 * math.sin(theta)], "braced_side": side}
    site = make_site([wall(anchor_distance=d, foot_anchor="wedge", count=3)], lines=[line],
                     plan_data={"slab": slab, "slab_holes": [hole], "slab_joints": [joint]})
    places = plan.place(site)
    _, feet = plan.brace_points(site, places["P-1"])
    area = shapely.Polygon(slab).difference(shapely.Polygon(hole))
    edges = [shapely.Polygon(slab).exterior, shapely.Polygon(hole).exterior,
             shapely.LineString(joint)]
    pts = shapely.points(feet)
    near = np.min([shapely.distance(e, pts) for e in edges], axis=0)
    expected = np.where(shapely.covers(area, pts), near, 0.0).min() * 12.0
    assert plan.foot_edge_distances_in(site, places)["P-1"] == expected
