"""The slab and the open ground in plan: where the brace feet stand on them, and how far a
slab anchor stands from the slab's edge, a hole or a joint (ACI 318-19 §17.6.2.4, §17.7.2)."""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np
import shapely
from shapely.geometry import MultiLineString, Polygon

from bracing.model import Site
from bracing.plan.records import IN_PER_FT, SLAB_KINDS

if TYPE_CHECKING:
    from bracing.plan.placement import BraceTable, Places

@dataclass(frozen=True)
class Slab:
    """The slab as it stands in plan, and the lines a slab anchor keeps its distance from."""

    area: object               # the slab less its holes
    holes: object              # union of the holes (may be empty)
    edges: list[tuple[str, np.ndarray | None]]  # the edge, the holes, the joints: (what, pieces)


def _pieces(lines) -> np.ndarray | None:
    """The straight pieces of a line or lines, each by its two ends, shape (m, 2, 2); a lone
    point (the boundary of a slab drawn flat) is a piece of no length. None when shapely gives
    no boundary (that of a collection, from an outline drawn doubling back on itself)."""
    if lines is None:
        return None
    xy, part = shapely.get_coordinates(shapely.get_parts(lines), return_index=True)
    start = np.flatnonzero(part[1:] == part[:-1])
    alone = np.flatnonzero(np.bincount(part)[part] == 1)
    return np.concatenate([np.stack([xy[start], xy[start + 1]], axis=1),
                           np.stack([xy[alone], xy[alone]], axis=1)])


def read_slab(site: Site) -> Slab | None:
    """The site's slab (None: the plan has no slab outline)."""
    plan = site.plan
    if plan is None or len(plan.slab) < 3:
        return None
    outline = shapely.make_valid(Polygon(plan.slab))
    holes = shapely.union_all([shapely.make_valid(Polygon(h)) for h in plan.slab_holes
                               if len(h) >= 3])
    edges = [("the slab edge", _pieces(outline.boundary))]
    if not holes.is_empty:
        edges.append(("a slab hole", _pieces(holes.boundary)))
    joints = [j for j in plan.slab_joints if len(j) >= 2]
    if joints:
        edges.append(("a slab joint", _pieces(MultiLineString(joints))))
    return Slab(outline.difference(holes), holes, edges)


def read_ground(site: Site):
    """The open ground of the site's plan as one shape (None: the plan has none)."""
    plan = site.plan
    shapes = [shapely.make_valid(Polygon(g)) for g in (plan.ground if plan else []) if len(g) >= 3]
    return shapely.union_all(shapes) if shapes else None


def _distances_ft(points: np.ndarray, pieces: np.ndarray) -> np.ndarray:
    """Least distance (ft) of each point to the straight pieces (m, 2, 2): square to a piece
    where the foot of the perpendicular falls between its ends, else to its nearer end
    (geometry; the same arithmetic as shapely's distance, so the same values to the last bit)."""
    px, py = points.T  # a row of the arrays below per piece, a column per point
    least = np.full(len(points), np.inf)
    for block in range(0, len(pieces), 64):  # keeps the (pieces x points) arrays small
        (ax, ay), (bx, by) = pieces[block:block + 64, :, :, None].transpose(1, 2, 0, 3)
        dx, dy, ux, uy = bx - ax, by - ay, px - ax, py - ay
        len2 = dx * dx + dy * dy
        with np.errstate(divide="ignore", invalid="ignore"):  # a piece of no length: its end
            r = (ux * dx + uy * dy) / len2
            square = np.abs((uy * dx - ux * dy) / len2) * np.sqrt(len2)
        to_a = ((ax == bx) & (ay == by)) | (r <= 0.0)
        end2 = np.where(to_a, ux * ux + uy * uy, (px - bx) * (px - bx) + (py - by) * (py - by))
        d = np.where(to_a | (r >= 1.0), np.sqrt(end2), square)
        least = np.minimum(least, d.min(axis=0))
    return least


def edge_distances_ft(slab: Slab, points: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Least distance (ft) of each point to the slab edge, a hole or a joint, and which one
    (nan when one of them has no boundary: the distance is not known)."""
    d = np.stack([np.full(len(points), np.nan) if pieces is None else
                  _distances_ft(points, pieces) for _, pieces in slab.edges])
    return d.min(axis=0), d.argmin(axis=0)


@dataclass(frozen=True)
class SlabFeet:
    """The braces on slab anchors (`rows` of a brace table) and where their feet stand: on the
    slab or not, the least distance (ft) to its edge, a hole or a joint (nan: not known) and
    which of `slab.edges` that is (all off the slab when the plan has none)."""

    slab: Slab | None
    rows: np.ndarray
    on: np.ndarray
    edge_ft: np.ndarray
    edge: np.ndarray


def slab_feet(site: Site, t: BraceTable) -> SlabFeet:
    """Where the feet of the braces `t` on slab anchors stand on the site's slab."""
    slab, rows = read_slab(site), np.flatnonzero(np.isin(t.kind, SLAB_KINDS))
    if slab is None:
        return SlabFeet(slab=None, rows=rows, on=np.zeros(len(rows), bool),
                        edge_ft=np.full(len(rows), np.nan), edge=np.zeros(len(rows), int))
    feet = t.foot[rows]
    edge_ft, edge = edge_distances_ft(slab, feet)
    return SlabFeet(slab=slab, rows=rows, on=covered(slab.area, feet), edge_ft=edge_ft, edge=edge)


def covered(area, points: np.ndarray) -> np.ndarray:
    """Whether each point lies inside `area` or on its boundary."""
    return shapely.intersects_xy(area, points[:, 0], points[:, 1])


def foot_edge_distances_in(site: Site, places: Places) -> dict[str, float]:
    """Least distance (in) from each wall's slab-anchor feet to the slab edge, a hole or a joint,
    for ACI 318-19 §17.6.2.4 (psi_ed,N) and §17.7.2 (c_a1), by mark of each placed wall; 0
    where a foot is off the slab; inf where the wall has no slab anchor or the plan has no slab
    outline (walls not placed are not listed: they have no distance either)."""
    out = dict.fromkeys(places.mark.tolist(), np.inf)
    feet = places.slab_feet(site)
    if feet.slab is None or len(feet.rows) == 0:
        return out
    dist = np.where(feet.on, feet.edge_ft, 0.0) * IN_PER_FT
    wall = places.braces(site).wall[feet.rows]
    first = np.flatnonzero(np.r_[True, wall[1:] != wall[:-1]])  # a wall's braces are together
    least = np.fmin.reduceat(dist, first)  # a distance not known (nan) leaves the others
    out.update(zip(places.mark[wall[first]].tolist(), np.fmin(least, np.inf).tolist(),
                   strict=True))
    return out


def edge_distance_needed_in(site: Site, anchor: str) -> tuple[float, str]:
    """Least edge distance (in) a slab anchor type needs, and where the value comes from."""
    a = site.anchor_types[anchor]
    if a.edge_distance is not None:
        return a.edge_distance, f"type '{anchor}'"
    # ACI 318-19 §17.9.2: without the product's c_min, 6 d_a, the least of Table 17.9.2(a)
    # (from memory).
    return 6.0 * a.diameter, (f"6 d_a for type '{anchor}' (no edge distance given; unconfirmed "
                              "value: confirm in ACI 318-19 §17.9.2)")
