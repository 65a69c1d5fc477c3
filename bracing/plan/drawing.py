"""A day's plan as the views draw it (`PlanGeometry`): the site's outlines, each placed wall with
its braces, zone and elevation, and the findings; and `DayPlans`, the plans of a job's days."""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import replace

import numpy as np

from bracing.model import Site
from bracing.plan.check import all_findings
from bracing.plan.foundation import foundation_walls
from bracing.plan.placement import (
    BraceTable,
    Places,
    WallBracing,
    brace_table,
    place,
    standing_bracing,
)
from bracing.plan.records import (
    COMPASS,
    Coords,
    Elevation,
    PlanArea,
    PlanGeometry,
    PlanLine,
    PlanPanel,
)
from bracing.plan.slab import slab_feet
from bracing.plan.zone import reach_words, zone_corners, zone_reach_ft, zone_rule


def plan_geometry(site: Site, standing: set[str] | None = None, day: int | None = None,
                  heights: dict[str, float] | None = None) -> PlanGeometry:
    """The plan of a day (`standing`: marks standing; None: every placed wall) for the views."""
    places = place(site)
    bracing = standing_bracing(site, places, standing)
    t = brace_table(places, bracing)
    plan = site.plan
    geometry = PlanGeometry(
        day=day,
        slab=[tuple(p) for p in plan.slab] if plan else [],
        slab_holes=[[tuple(p) for p in h] for h in plan.slab_holes] if plan else [],
        joints=[[tuple(p) for p in j] for j in plan.slab_joints] if plan else [],
        ground=[[tuple(p) for p in g] for g in plan.ground] if plan else [],
        areas=[PlanArea(name=a.name, kind=a.kind, coords=[tuple(p) for p in a.polygon])
               for a in (plan.areas if plan else [])],
        lines=[PlanLine(name=line.name, start=tuple(line.start), end=tuple(line.end),
                        braced_side=line.braced_side) for line in site.lines],
        panels=_panels(site, places, bracing, t, heights),
        findings=all_findings(site, places, bracing, t, slab_feet(site, t), heights),
        bounds=(0.0, 0.0, 1.0, 1.0), foundation_walls=foundation_walls(site))
    geometry.bounds = _bounds(geometry)
    return geometry


def _rings(corners: np.ndarray) -> list[Coords]:
    """Each outline of `corners` (n, k, 2) as a closed ring of plan points."""
    return [[*map(tuple, c), tuple(c[0])] for c in corners.tolist()]


def _panels(site: Site, places: Places, bracing: WallBracing, t: BraceTable,
            heights: dict[str, float] | None) -> list[PlanPanel]:
    """Every placed wall as drawn: braces and zone for those standing (`bracing`, braces `t`),
    the foot anchor and the elevation for all."""
    reach_ft = zone_reach_ft(site, places, bracing, heights)
    zones = _zone_fields(site, places, bracing, reach_ft)
    pairs = list(zip(map(tuple, t.insert.tolist()), map(tuple, t.foot.tolist()), strict=True))
    first = np.searchsorted(t.wall, np.arange(len(places) + 1)).tolist()  # walls in order
    kind, anchor = _foot_anchors(places.bracing(site), len(places))
    faces = places.at(places.rows()[:, None], places.width_ft[:, None] * [0.0, 1.0], 0.0)
    every_braces = places.braces(site)  # every placed wall's braces, for the elevations
    along = every_braces.along_ft.tolist()
    every_first = np.searchsorted(every_braces.wall, np.arange(len(places) + 1)).tolist()
    panels: list[PlanPanel] = []
    for k, (mark, i, footprint, face) in enumerate(zip(
            places.mark.tolist(), places.index.tolist(), _rings(places.footprint_corners),
            faces.tolist(), strict=True)):
        p = site.panels[i]
        panels.append(PlanPanel(
            mark=mark, line=places.line[k], standing=k in zones,
            height_ft=heights.get(mark, p.height) if heights else p.height,
            footprint=footprint, face=(tuple(face[0]), tuple(face[1])),
            braces=pairs[first[k]:first[k + 1]], foot_kind=kind[k], foot_anchor=anchor[k],
            **zones.get(k, {"restricted_zone": [], "evacuated_zone": [], "zone_basis": ""}),
            offset_ft=float(places.offset_ft[k]), width_ft=float(places.width_ft[k]),
            elevation=_elevation(p, places, k, along[every_first[k]:every_first[k + 1]])))
    return panels


def _zone_fields(site: Site, places: Places, bracing: WallBracing, reach_ft) -> dict[int, dict]:
    """The zone fields of each standing wall's `PlanPanel`, by its row in the places."""
    reach = reach_words(site, places, bracing, reach_ft)
    out = {}
    for k, mark, masonry, ring in zip(
            bracing.walls.tolist(), places.mark[bracing.walls].tolist(),
            reach_ft.masonry.tolist(), _rings(zone_corners(places, bracing, reach_ft)),
            strict=True):
        front, back, basis = reach[mark]
        out[k] = {"restricted_zone": ring, "evacuated_zone": list(ring), "zone_basis": basis,
                  "zone_front_ft": front, "zone_back_ft": back,
                  "zone_rule": zone_rule(site, masonry),
                  "zone_name": "limited access zone" if masonry else "restricted zone"}
    return out


def _foot_anchors(every: WallBracing, n: int) -> tuple[list[str], list[str | None]]:
    """The foot anchor kind ('' none) and type (None: none) of each of the `n` placed walls,
    from the bracing of every one of them, standing or not."""
    kind, anchor = [""] * n, [None] * n
    for k, foot_kind, foot_anchor in zip(every.walls[every.braced].tolist(), every.kind.tolist(),
                                         every.anchor.tolist(), strict=True):
        kind[k], anchor[k] = foot_kind, foot_anchor or None
    return kind, anchor


def _compass(direction) -> str:
    """The compass word of a plan direction (x east, y north), to the nearest eighth."""
    angle = np.degrees(np.arctan2(direction[1], direction[0]))
    return COMPASS[int(np.round(angle / 45.0)) % 8]


def _elevation(panel, places: Places, k: int, along: list[float]) -> Elevation:
    """The wall at row `k` of the places seen square to its braced face, its braces at `along`
    (ft from its first edge). The viewer faces against the braced side's normal n, so the
    viewer's left hand points along (n_y, -n_x) (plane geometry)."""
    u, n = places.direction[k], places.normal[k]
    left = np.array([n[1], -n[0]])
    first_left = bool(np.dot(u, left) < 0.0)  # the first edge is where u points away from
    w = float(places.width_ft[k])

    def from_left(x: float, width: float = 0.0) -> float:
        """A distance from the first edge (of a thing `width` wide) as one from the left."""
        return x if first_left else w - x - width

    b = panel.bracing
    return Elevation(
        width_ft=w, height_ft=panel.height, left_edge=f"{_compass(left)} end",
        right_edge=f"{_compass(-left)} end",
        openings=[(from_left(o.x, o.width), o.y, o.width, o.height) for o in panel.openings],
        braces_from_left_ft=[from_left(x) for x in along],
        insert_height_ft=b.insert_height if b is not None else None,
        first_edge_left=first_left)


class DayPlans(Mapping):
    """The plan of each day, drawn when a view first asks for it, once per set of walls standing
    (drawing every day of a long job up front would cost more than the whole engine)."""

    def __init__(self, site: Site, standing_by_day: dict[int, list[str]]):
        self._site = site
        self._standing = standing_by_day
        self._drawn: dict[frozenset, PlanGeometry] = {}

    def __getitem__(self, day: int) -> PlanGeometry:
        key = frozenset(self._standing[day])
        if key not in self._drawn:
            self._drawn[key] = plan_geometry(self._site, set(key))
        return replace(self._drawn[key], day=day)

    def __iter__(self):
        return iter(self._standing)

    def __len__(self) -> int:
        return len(self._standing)

    def busiest_day(self) -> int:
        """The day with the most walls standing (the earliest of equals)."""
        return max(sorted(self._standing), key=lambda d: (len(self._standing[d]), -d))


def _bounds(g: PlanGeometry) -> tuple[float, float, float, float]:
    """Least and greatest x and y of everything drawn on the plan."""
    pts = [*g.slab, *(p for h in g.slab_holes for p in h), *(p for j in g.joints for p in j),
           *(p for r in g.ground for p in r), *(p for a in g.areas for p in a.coords),
           *(p for line in g.lines for p in (line.start, line.end)),
           *(p for w in g.panels for p in w.footprint + w.restricted_zone),
           *(p for w in g.panels for b in w.braces for p in b),
           *(p for w in g.foundation_walls for p in w.footprint + w.backfill),
           *(p for w in g.foundation_walls for b in w.braces for p in b)]
    if not pts:
        return (0.0, 0.0, 1.0, 1.0)
    xy = np.array(pts, dtype=float)
    lo, hi = xy.min(axis=0), xy.max(axis=0)
    return (float(lo[0]), float(lo[1]), float(hi[0]), float(hi[1]))
