"""Site geometry in plan (method notes §6), with shapely 2.

Plan coordinates are in ft, x to the east and y to the north. A wall line runs from `start` to
`end` and is the braced face of the walls along it; a wall's thickness lies on the other side.
A panel occupies [offset, offset + width] along its line, its braces stand on the line's braced
side and each brace foot sits `anchor_distance` out from the face, square to the line.

`plan_geometry` gathers what a view draws (plain coordinate lists) and the findings: slab anchors
off the slab or too near its edge, a hole or a joint; ground anchors off open ground; braces
crossing each other, a wall or an area kept clear; zones over occupied areas, the public way, a
neighbor or the crane path.

The modules: `placement` (walls and braces along their lines), `slab` (the slab, the ground and
edge distances), `zone` (the zones kept around standing walls), `crossings` and `check` (the
findings), `drawing` (a day's plan for the views) and `records` (what the views read).
"""

from bracing.plan.check import day_findings, findings, plan_findings
from bracing.plan.drawing import DayPlans, plan_geometry
from bracing.plan.placement import (
    PanelPlace,
    Places,
    anchor_distance_ft,
    brace_points,
    braced_normal,
    place,
    wall_point,
)
from bracing.plan.records import (
    ALSO_ON_SLAB,
    AREA_WORDS,
    BRACE_IN_AREA,
    COMPASS,
    DETAIL_LONGEST_FT,
    GROUND_KINDS,
    IN_PER_FT,
    SLAB_KINDS,
    TOLERANCE_FT,
    ZONE_OVER_AREA,
    Coords,
    Detail,
    Elevation,
    PlanArea,
    PlanFinding,
    PlanGeometry,
    PlanLine,
    PlanPanel,
    Point,
)
from bracing.plan.slab import edge_distance_needed_in, foot_edge_distances_in
from bracing.plan.zone import zone_reach, zone_rule, zones

__all__ = [
    "ALSO_ON_SLAB", "AREA_WORDS", "BRACE_IN_AREA", "COMPASS", "DETAIL_LONGEST_FT", "GROUND_KINDS",
    "IN_PER_FT", "SLAB_KINDS", "TOLERANCE_FT", "ZONE_OVER_AREA", "Coords", "DayPlans", "Detail",
    "Elevation", "PanelPlace", "Places", "PlanArea", "PlanFinding", "PlanGeometry", "PlanLine",
    "PlanPanel", "Point", "anchor_distance_ft", "brace_points", "braced_normal", "day_findings",
    "edge_distance_needed_in", "findings", "foot_edge_distances_in", "place", "plan_findings",
    "plan_geometry", "wall_point", "zone_reach", "zone_rule", "zones",
]
