"""Braces, walls and zones that meet in plan what they must not (method notes §6): braces of
two walls crossing, a brace through another wall, a brace in an area kept clear, a zone over an
occupied area, two walls overlapping. Only walls whose bounding boxes meet are compared."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
import shapely
from shapely.geometry import Polygon

from bracing.model import Site
from bracing.plan.placement import BraceTable, Places
from bracing.plan.records import (
    AREA_WORDS,
    BRACE_IN_AREA,
    LIMITED_ACCESS,
    TOLERANCE_FT,
    ZONE_OVER_AREA,
    PlanFinding,
    xy_words,
)
from bracing.results import Flag


@dataclass(frozen=True)
class Reach:
    """How far the walls standing reach in plan, footprint and braces, as bounding boxes, and
    the pairs of them whose boxes meet: only their braces and footprints can meet each other."""

    rows: np.ndarray   # the walls' rows in the places
    lo: np.ndarray     # (n, 2) least x and y of each wall's footprint and braces
    hi: np.ndarray     # (n, 2) greatest
    first: np.ndarray  # each wall's first brace in the brace table
    count: np.ndarray  # and how many it has
    near: np.ndarray   # (2, p): positions in `rows` of the walls whose boxes meet, first < second


def reach_of(places: Places, rows: np.ndarray, t: BraceTable) -> Reach:
    """The reach of the walls at `rows` (in order) with their braces `t`."""
    lo, hi = _box(places.footprint_corners[rows])
    first = np.searchsorted(t.wall, rows)
    count = np.searchsorted(t.wall, rows, side="right") - first
    braced = count > 0  # a wall's braces are together in the table
    lo[braced] = np.minimum(lo[braced], np.minimum(np.minimum.reduceat(t.insert, first[braced]),
                                                   np.minimum.reduceat(t.foot, first[braced])))
    hi[braced] = np.maximum(hi[braced], np.maximum(np.maximum.reduceat(t.insert, first[braced]),
                                                   np.maximum.reduceat(t.foot, first[braced])))
    # the tree compares bounding boxes: each wall's is given by its diagonal
    diagonals = shapely.linestrings(np.stack([lo, hi], axis=1))
    a, b = shapely.STRtree(diagonals).query(diagonals)
    return Reach(rows, lo, hi, first, count, np.stack([a[a < b], b[a < b]]))


def _box(corners: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Least and greatest x and y of each outline of four `corners` (n, 4, 2), each (n, 2)."""
    c = corners
    return (np.minimum(np.minimum(c[:, 0], c[:, 1]), np.minimum(c[:, 2], c[:, 3])),
            np.maximum(np.maximum(c[:, 0], c[:, 1]), np.maximum(c[:, 2], c[:, 3])))


def _meets_any(lo: np.ndarray, hi: np.ndarray, shapes: np.ndarray) -> np.ndarray:
    """Whether each box (least and greatest x and y, each (n, 2)) meets the bounding box of
    any of `shapes`."""
    box = shapely.bounds(shapes)[:, :, None]  # a row per shape, a column per box
    return ((lo[:, 0] <= box[:, 2]) & (hi[:, 0] >= box[:, 0])
            & (lo[:, 1] <= box[:, 3]) & (hi[:, 1] >= box[:, 1])).any(axis=0)


def _every_pair(first_a, count_a, first_b, count_b) -> tuple[np.ndarray, np.ndarray]:
    """For each pair of ranges, range(first, first + count) of a and of b, every (i, j) with i
    of the one and j of the other, pair after pair, i then j in order."""
    n = count_a * count_b
    pair = np.repeat(np.arange(len(n)), n)
    step = np.arange(n.sum()) - np.repeat(np.cumsum(n) - n, n)
    return first_a[pair] + step // count_b[pair], first_b[pair] + step % count_b[pair]


def brace_crossings(t: BraceTable, reach: Reach) -> list[PlanFinding]:
    """Braces of different walls that cross in plan, with their heights where they cross."""
    one, two = reach.near
    a, b = _every_pair(reach.first[one], reach.count[one], reach.first[two], reach.count[two])
    by_brace = np.lexsort((b, a))
    a, b = a[by_brace], b[by_brace]
    seg_a, seg_b = t.segments(a), t.segments(b)
    meet = shapely.intersects(seg_a, seg_b)
    a, b, seg_a, seg_b = a[meet], b[meet], seg_a[meet], seg_b[meet]
    meet = shapely.point_on_surface(shapely.intersection(seg_a, seg_b))
    found = []
    for i, j, pt, seg_i, seg_j in zip(a, b, meet, seg_a, seg_b, strict=True):
        xy = (pt.x, pt.y)
        hi, hj = (t.top_ft[k] + (t.low_ft[k] - t.top_ft[k])
                  * shapely.line_locate_point(seg, pt, normalized=True)
                  for k, seg in ((i, seg_i), (j, seg_j)))
        for me, other, h_me, h_other in ((i, j, hi, hj), (j, i, hj, hi)):
            found.append(PlanFinding(t.mark[me], Flag(
                "braces-cross", "danger", f"brace {t.number[me]} crosses brace "
                f"{t.number[other]} of {t.mark[other]} at {xy_words(xy)}, {h_me:.1f} ft and "
                f"{h_other:.1f} ft above the slab there: one cannot be set as drawn",
                "common practice (method notes §6)"), [xy], (str(t.mark[other]),)))
    return found


def braces_through_walls(t: BraceTable, places: Places, reach: Reach) -> list[PlanFinding]:
    """Braces that run through another wall standing (a brace stands on its own wall's face)."""
    own, other = np.concatenate([reach.near, reach.near[::-1]], axis=1)
    a, w = _every_pair(reach.first[own], reach.count[own], other, np.ones_like(other))
    by_brace = np.lexsort((w, a))
    a, w = a[by_brace], reach.rows[w[by_brace]]
    segs, shapes = t.segments(a), places.footprints(w)
    keep = shapely.intersects(segs, shapes) & ~shapely.touches(segs, shapes)
    found = []
    for i, k, seg, shape in zip(a[keep], w[keep], segs[keep], shapes[keep], strict=True):
        pt = shapely.point_on_surface(shapely.intersection(seg, shape))
        wall = places.mark[k]
        found.append(PlanFinding(t.mark[i], Flag(
            "brace-crosses-wall", "danger", f"brace {t.number[i]} runs through wall "
            f"{wall} at {xy_words((pt.x, pt.y))}", "method notes §6"), [(pt.x, pt.y)],
            (str(wall),)))
    return found


def braces_in_areas(site: Site, t: BraceTable, reach: Reach) -> list[PlanFinding]:
    """Braces that enter an area of the plan kept clear of them (`BRACE_IN_AREA`)."""
    areas = [a for a in (site.plan.areas if site.plan else []) if a.kind in BRACE_IN_AREA]
    if not areas or len(t.wall) == 0:
        return []
    shapes = np.array([shapely.make_valid(Polygon(a.polygon)) for a in areas])
    # only the braces of a wall whose box meets an area's can enter it: the others are not drawn
    near = _meets_any(reach.lo, reach.hi, shapes)
    rows = np.flatnonzero(np.repeat(near, reach.count))
    segs = t.segments(rows)
    s, k = shapely.STRtree(shapes).query(segs, predicate="intersects")
    keep = ~shapely.touches(segs[s], shapes[k])
    s, k = s[keep], k[keep]
    found = []
    for mark, area in dict.fromkeys(zip(t.mark[rows[s]], k, strict=True)):
        mine = s[(t.mark[rows[s]] == mark) & (k == area)]
        a = areas[area]
        pts = [shapely.point_on_surface(shapely.intersection(segs[r], shapes[area]))
               for r in mine]
        found.append(PlanFinding(mark, Flag(
            "brace-crosses-keep-clear", BRACE_IN_AREA[a.kind], f"{t.numbers(rows[mine])} "
            f"{'enters' if len(mine) == 1 else 'enter'} the {AREA_WORDS[a.kind]} '{a.name}'",
            "site plan areas (method notes §6)"),
            [(p.x, p.y) for p in pts]))
    return found


def zone_overlaps(site: Site, places: Places, rows: np.ndarray,
                   corners: np.ndarray) -> list[PlanFinding]:
    """Zones (`corners`, of the walls at `rows`) over the plan's areas."""
    areas = [a for a in (site.plan.areas if site.plan else []) if a.kind in ZONE_OVER_AREA]
    if not areas or len(rows) == 0:
        return []
    shapes = np.array([shapely.make_valid(Polygon(a.polygon)) for a in areas])
    # only a zone whose bounding box meets an area's can overlap it: the others are not drawn
    near = _meets_any(*_box(corners), shapes)
    rows, zs = rows[near], shapely.polygons(corners[near])
    z, k = shapely.STRtree(shapes).query(zs, predicate="intersects")
    common = shapely.intersection(zs[z], shapes[k])
    size = shapely.area(common)
    masonry_source = site.rule("masonry_zone_extra_ft").source
    found = []
    for zi, ki, part, a_ft2 in zip(z, k, common, size, strict=True):
        if a_ft2 <= TOLERANCE_FT:
            continue
        area, mark = areas[ki], str(places.mark[rows[zi]])
        panel = site.panels[places.index[rows[zi]]]
        masonry = site.materials[panel.material].kind == "masonry" and \
            site.rule_value("masonry_zone_extra_ft") is not None
        code = "zone-overlaps-crane-path" if area.kind == "crane_path" else "zone-overlap"
        pt = shapely.point_on_surface(part)
        found.append(PlanFinding(mark, Flag(
            code, ZONE_OVER_AREA[area.kind], f"the wall's {'limited access ' if masonry else ''}"
            f"zone overlaps the {AREA_WORDS[area.kind]} '{area.name}' by {a_ft2:.0f} ft²: " + (
                LIMITED_ACCESS if masonry else "authorized workers only while the wall "
                "stands, nobody at the stand-down speed or during lifts"),
            masonry_source if masonry else "common practice (method notes §6)"), [(pt.x, pt.y)]))
    return found


def overlapping_walls(places: Places, reach: Reach) -> list[PlanFinding]:
    """Walls whose footprints overlap in plan."""
    a, b = reach.rows[reach.near]
    shapes_a, shapes_b = places.footprints(a), places.footprints(b)
    meet = shapely.intersects(shapes_a, shapes_b)
    a, b = a[meet], b[meet]
    common = shapely.intersection(shapes_a[meet], shapes_b[meet])
    found = []
    for i, j, part in zip(places.mark[a].tolist(), places.mark[b].tolist(), common, strict=True):
        if shapely.area(part) > TOLERANCE_FT:
            pt = shapely.point_on_surface(part)
            found.append(PlanFinding(i, Flag(
                "walls-overlap", "warning", f"overlaps wall {j} in plan: check the "
                "offsets along the wall line", "site file"), [(pt.x, pt.y)], (j,)))
    return found
