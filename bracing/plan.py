"""Site geometry in plan (design.md §7), with shapely 2.

Plan coordinates are in ft, x to the east and y to the north. A wall line runs from `start` to
`end` and is the braced face of the walls along it; a wall's thickness lies on the other side.
A panel occupies [offset, offset + width] along its line, its braces stand on the line's braced
side and each brace foot sits `anchor_distance` out from the face, square to the line.

`plan_geometry` gathers what a view draws (plain coordinate lists) and the findings: slab anchors
off the slab or too near its edge, a hole or a joint; ground anchors off open ground; braces
crossing each other, a wall or an area kept clear; zones over occupied areas, the public way, a
neighbor or the crane path.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, replace
from functools import cached_property
from itertools import chain, repeat

import numpy as np
import shapely
from shapely.geometry import MultiLineString, Polygon

from bracing import braces
from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.model import Bracing, Site, read_panels
from bracing.results import Flag

IN_PER_FT = 12.0
DETAIL_LONGEST_FT = 200.0  # longest run of walls on one detail plan (about 1 in = 30 ft on letter)
COMPASS = ("east", "northeast", "north", "northwest", "west", "southwest", "south", "southeast")
TOLERANCE_FT = 1e-6  # a point on a boundary counts as on it
# anchor kinds whose feet the plan places on open ground (some of them also on the slab)
GROUND_KINDS = tuple(k for k, v in ANCHOR_KINDS.items() if "ground" in v.stands_on)
ALSO_ON_SLAB = tuple(k for k in GROUND_KINDS if "slab" in ANCHOR_KINDS[k].stands_on)
SLAB_KINDS = tuple(k for k, v in ANCHOR_KINDS.items() if v.stands_on == {"slab"})

# A brace or its foot inside an area of each kind ('work' areas are not kept clear of braces).
BRACE_IN_AREA = {"keep_clear": "danger", "crane_path": "danger", "public_way": "danger",
                 "neighbor": "danger", "office": "warning"}
# A zone over an area of each kind (design.md §7: occupied areas, the public way, neighbours).
# OSHA 29 CFR 1926.706(a): a masonry wall's limited access zone, the regulation's own term
LIMITED_ACCESS = ("limited access zone: only those building the wall may enter while it stands, "
                  "nobody at the stand-down speed")
ZONE_OVER_AREA = {"public_way": "danger", "neighbor": "danger", "office": "warning",
                  "work": "warning", "crane_path": "warning", "keep_clear": "notice"}
AREA_WORDS = {"keep_clear": "keep-clear area", "crane_path": "crane path",
              "public_way": "public way", "neighbor": "neighbor", "office": "site office",
              "work": "work area"}

Point = tuple[float, float]
Coords = list[Point]


@dataclass(frozen=True)
class PanelPlace:
    """Where a panel stands: its first edge on the face, unit vectors along its line and toward
    the braced side, its thickness and its footprint (a thickness-deep strip behind the face)."""

    index: int  # in site.panels
    mark: str
    line: str
    origin: np.ndarray
    direction: np.ndarray
    normal: np.ndarray
    width_ft: float
    thickness_ft: float
    footprint: Polygon

    def at(self, along_ft, out_ft) -> np.ndarray:
        """Plan points `along_ft` from the first edge and `out_ft` out from the face toward the
        braced side (arrays broadcast; shape (..., 2))."""
        a = np.asarray(along_ft, dtype=float)[..., None]
        o = np.asarray(out_ft, dtype=float)[..., None]
        return self.origin + a * self.direction + o * self.normal

    @property
    def face(self) -> np.ndarray:
        """The braced face, first edge to last edge, shape (2, 2)."""
        return self.at([0.0, self.width_ft], 0.0)


@dataclass(slots=True)
class PlanArea:
    name: str
    kind: str
    coords: Coords


@dataclass(slots=True)
class PlanLine:
    name: str
    start: Point
    end: Point
    braced_side: str


@dataclass(slots=True)
class PlanPanel:
    """One placed wall as the views draw it; zones and braces only when it stands that day."""

    mark: str
    line: str
    standing: bool
    height_ft: float
    footprint: Coords
    face: tuple[Point, Point]
    braces: list[tuple[Point, Point]]  # (insert point on the face, foot point)
    foot_kind: str  # a kind of anchor_kinds.KINDS or ''
    foot_anchor: str | None
    restricted_zone: Coords
    evacuated_zone: Coords
    zone_basis: str  # the zone's reach on each side and its source
    zone_front_ft: float = 0.0  # the zone's reach out from the braced face
    zone_back_ft: float = 0.0   # and back from it, behind the wall
    zone_rule: str = ""         # the zone's rule, without this wall's numbers (for legends)
    zone_name: str = ""         # "limited access zone" (masonry) or "restricted zone"
    offset_ft: float = 0.0      # first edge from the start of its line
    width_ft: float = 0.0
    elevation: Elevation | None = None


@dataclass(slots=True)
class Elevation:
    """A wall seen square to its braced face, as the crew sees it when setting the braces (ft):
    x from the edge on the viewer's left, y up from the wall's base."""

    width_ft: float
    height_ft: float
    left_edge: str   # that edge in words: "west end", by the compass of the plan
    right_edge: str
    openings: list[tuple[float, float, float, float]]  # x, y of the lower left corner, w, h
    braces_from_left_ft: list[float]  # each brace's insert from the left edge, in brace order
    insert_height_ft: float | None    # above the wall's base (None: no braces)
    first_edge_left: bool  # whether the panel's first edge (its offset's end) is on the left


@dataclass(slots=True)
class Detail:
    """A part of the plan drawn at a larger scale: the walls standing on one wall line, or on a
    stretch of it when the line is long, with the window (plan ft) that holds their footprints,
    braces and zones."""

    line: str
    marks: list[str]  # in order along the line
    bounds: tuple[float, float, float, float]  # min x, min y, max x, max y
    part: int = 1     # which stretch of the line (1 when the line is drawn whole)
    parts: int = 1


@dataclass(slots=True)
class PlanFinding:
    """A finding of the plan for one wall, with the plan points where it lies."""

    mark: str
    flag: Flag
    at: list[Point]
    others: tuple[str, ...] = ()  # other walls involved: it holds on days they all stand


@dataclass(slots=True)
class PlanGeometry:
    """Plain coordinates (ft) of a site's plan on one day, and what was found in it."""

    day: int | None
    slab: Coords
    slab_holes: list[Coords]
    joints: list[Coords]
    ground: list[Coords]
    areas: list[PlanArea]
    lines: list[PlanLine]
    panels: list[PlanPanel]
    findings: list[PlanFinding]
    bounds: tuple[float, float, float, float]  # min x, min y, max x, max y

    @property
    def standing(self) -> list[str]:
        return [p.mark for p in self.panels if p.standing]

    def details(self, longest_ft: float | None = None) -> list[Detail]:
        """The detail plans of the day: the walls standing on each wall line, in line order,
        a line whose walls run longer than `longest_ft` (default DETAIL_LONGEST_FT) cut into
        stretches of about equal length at the walls' joints."""
        longest_ft = DETAIL_LONGEST_FT if longest_ft is None else longest_ft
        out = []
        for line in self.lines:
            walls = sorted((p for p in self.panels if p.standing and p.line == line.name),
                           key=lambda p: p.offset_ft)
            if not walls:
                continue
            run = walls[-1].offset_ft + walls[-1].width_ft - walls[0].offset_ft
            parts = max(1, int(np.ceil(run / longest_ft - 1e-9)))
            cut = [walls[0].offset_ft + run * k / parts for k in range(1, parts)]
            groups = [[] for _ in range(parts)]
            for p in walls:  # each wall in the stretch that holds its middle
                groups[int(np.searchsorted(cut, p.offset_ft + p.width_ft / 2))].append(p)
            groups = [g for g in groups if g]
            for k, group in enumerate(groups, 1):
                pts = [q for p in group for q in (*p.footprint, *p.restricted_zone,
                                                  *(x for b in p.braces for x in b))]
                xy = np.array(pts, dtype=float)
                lo, hi = xy.min(axis=0), xy.max(axis=0)
                out.append(Detail(line.name, [p.mark for p in group],
                                  (float(lo[0]), float(lo[1]), float(hi[0]), float(hi[1])),
                                  k, len(groups)))
        return out


# --- placing walls and braces -------------------------------------------------------------------
@dataclass(eq=False)
class Places(Mapping):
    """Every panel that names a wall line, by mark in site order (what `place` returns): arrays
    over all of them, one row each, and the `PanelPlace` of one built when it is asked for."""

    index: np.ndarray      # rows in site.panels
    mark: np.ndarray       # of str objects
    line: list[str]
    origin: np.ndarray     # (n, 2) first edges on the face
    direction: np.ndarray  # (n, 2) unit vectors along the lines
    normal: np.ndarray     # (n, 2) unit vectors toward the braced sides
    width_ft: np.ndarray
    thickness_ft: np.ndarray
    offset_ft: np.ndarray  # from the line's start to the first edge
    line_ft: np.ndarray    # the line's length
    site: Site             # the site placed
    columns: dict          # the fields of its panels (model.read_panels)

    def __post_init__(self):
        self._read: tuple[Site, _Bracing, _Braces, _SlabFeet] | None = None

    def fields_of(self, site: Site) -> dict[str, tuple]:
        """The panels' fields of `site` (model.read_panels): those read to place it, if it is
        the site placed."""
        return self.columns if site is self.site else read_panels(site)

    @cached_property
    def _row(self) -> dict[str, int]:
        """Each mark's row, made when a wall is asked for by mark."""
        return dict(zip(self.mark.tolist(), range(len(self.mark))))

    def bracing(self, site: Site) -> _Bracing:
        """The bracing of every wall placed, read from `site` (the site placed) only once for
        the foot edge distances and the findings."""
        return self._every(site)[1]

    def braces(self, site: Site) -> _Braces:
        """Every brace of every wall placed (`_brace_table`), worked out once as `bracing`."""
        return self._every(site)[2]

    def slab_feet(self, site: Site) -> _SlabFeet:
        """Where the slab-anchor feet of every wall placed stand, worked out once as `bracing`."""
        return self._every(site)[3]

    def _every(self, site: Site) -> tuple[Site, _Bracing, _Braces, _SlabFeet]:
        """The site placed, then what `bracing`, `braces` and `slab_feet` give."""
        if self._read is None or self._read[0] is not site:
            bracing = _bracing(site, self, self.rows())
            table = _brace_table(self, bracing)
            self._read = (site, bracing, table, _slab_feet(site, table))
        return self._read

    @cached_property
    def footprint_corners(self) -> np.ndarray:
        """Corners of each panel's footprint, a thickness-deep strip behind its face, (n, 4, 2)."""
        along = self.width_ft[:, None] * [0.0, 1.0, 1.0, 0.0]
        back = self.thickness_ft[:, None] * [0.0, 0.0, 1.0, 1.0]
        return _at(self, self.rows()[:, None], along, -back)

    def footprints(self, rows) -> np.ndarray:
        """The footprints of the panels at `rows`, as shapes."""
        return shapely.polygons(self.footprint_corners[rows])

    def rows(self, standing: set[str] | None = None) -> np.ndarray:
        """Rows of the walls standing (None: all), in site order."""
        if standing is None:
            return np.arange(len(self.mark))
        return np.array([k for m, k in self._row.items() if m in standing], dtype=int)

    def __getitem__(self, mark: str) -> PanelPlace:
        k = self._row[mark]
        return PanelPlace(int(self.index[k]), mark, self.line[k], self.origin[k],
                          self.direction[k], self.normal[k], float(self.width_ft[k]),
                          self.thickness_ft[k], self.footprints(k))

    def __iter__(self):
        return iter(self._row)

    def __len__(self) -> int:
        return len(self.mark)


def place(site: Site, columns: dict[str, tuple] | None = None) -> Places:
    """Every panel that names a wall line, placed along it (the others are skipped);
    `columns`: the panels' fields (model.read_panels), if already read."""
    panel = columns or read_panels(site)
    line_no = {line.name: k for k, line in enumerate(site.lines)}
    ends = np.array([(line.start, line.end) for line in site.lines], dtype=float).reshape(-1, 2, 2)
    sides = np.array([1.0 if line.braced_side == "left" else -1.0 for line in site.lines])
    line, mark, offset, width, thickness = (
        panel[k] for k in ("line", "mark", "offset", "width", "thickness"))
    on = np.fromiter(map(line_no.get, line, repeat(-1)), int, len(line))  # -1: on no line
    rows = np.flatnonzero(on >= 0)
    on = on[rows]
    run = ends[on, 1] - ends[on, 0]
    length = np.hypot(run[:, 0], run[:, 1])
    u = run / length[:, None]
    left = np.stack([-u[:, 1], u[:, 0]], axis=1)  # the left hand, looking from start to end
    normal = left * sides[on][:, None]
    offset = np.array(offset, dtype=float)[rows]
    return Places(rows, np.array(mark, dtype=object)[rows], [line[i] for i in rows.tolist()],
                  ends[on, 0] + offset[:, None] * u, u, normal,
                  np.array(width, dtype=float)[rows],
                  np.array(thickness, dtype=float)[rows] / IN_PER_FT, offset, length, site, panel)


def _at(places: Places, rows, along_ft, out_ft) -> np.ndarray:
    """`PanelPlace.at` of the walls at `rows` of the places (arrays broadcast; (..., 2)), x and
    y worked apart (numpy is slow over a last axis of two)."""
    a = np.asarray(along_ft, dtype=float)
    o = np.asarray(out_ft, dtype=float)
    return np.stack([places.origin[rows, i] + a * places.direction[rows, i]
                     + o * places.normal[rows, i] for i in (0, 1)], axis=-1)


def _read_bracing(site: Site, places: Places, standing: set[str] | None) -> _Bracing:
    """The bracing of the walls standing (None: every placed wall, read once per places)."""
    if standing is None:
        return places.bracing(site)
    return _bracing(site, places, places.rows(standing))


def anchor_distance_ft(b: Bracing) -> float:
    """Brace foot from the wall face (ft): as given, or from the brace angle (geometry)."""
    if b.anchor_distance is not None:
        return b.anchor_distance
    return float(braces.anchor_distance_for_angle(
        b.insert_height, b.angle, b.insert_offset / IN_PER_FT, b.foot_offset / IN_PER_FT,
        b.base_below_slab))


@dataclass(frozen=True)
class _Bracing:
    """The bracing of some walls: which are braced, then one row per braced wall."""

    walls: np.ndarray      # rows in the places
    braced: np.ndarray     # which of the walls have bracing
    count: np.ndarray
    given: np.ndarray      # whether the wall gives its brace positions
    positions: list[float]  # those given, wall after wall
    anchor_ft: np.ndarray  # foot from the wall face (`anchor_distance_ft`)
    kind: np.ndarray       # foot anchor kind, '' when none named
    anchor: np.ndarray     # foot anchor type name, '' when none named
    top_ft: np.ndarray     # brace pin heights above the slab, at the insert and at the foot
    low_ft: np.ndarray


def _bracing(site: Site, places: Places, rows: np.ndarray) -> _Bracing:
    """The bracing of the walls at `rows` of the places, from the panels' fields."""
    panel = places.fields_of(site)
    layout_row = np.full(len(panel["mark"]), -1)  # each panel's row among the braced ones
    layout_row[list(panel["braced"])] = np.arange(len(panel["braced"]))
    layout_row = layout_row[places.index[rows]]
    braced = layout_row >= 0
    picked = layout_row[braced]
    height, base, foot_offset, given_ft, angle, insert_offset = (
        np.array(panel[k], dtype=float)[picked] for k in (  # None: NaN
            "insert_height", "base_below_slab", "foot_offset", "anchor_distance", "angle",
            "insert_offset"))
    foot_offset = foot_offset / IN_PER_FT
    for_angle_ft = braces.anchor_distance_for_angle(
        height, angle, insert_offset / IN_PER_FT, foot_offset, base)
    given = np.array(list(map(bool, panel["positions"])), dtype=bool)[picked]
    # the foot anchor of each layout by its type's number among those named (0: none named)
    names = sorted(set(panel["foot_anchor"]) - {None})
    number = dict(zip([None, *names], range(len(names) + 1)))
    which = np.fromiter(map(number.__getitem__, panel["foot_anchor"]), int,
                        len(panel["foot_anchor"]))[picked]
    return _Bracing(
        rows, braced, np.array(panel["count"], dtype=int)[picked], given,
        list(chain.from_iterable(panel["positions"][r] for r in picked[given].tolist())),
        np.where(np.isnan(given_ft), for_angle_ft, given_ft),
        np.array(["", *(site.anchor_types[a].kind for a in names)], dtype=str)[which],
        np.array(["", *names], dtype=str)[which], height - base, foot_offset)


def brace_points(site: Site, place: PanelPlace) -> tuple[np.ndarray, np.ndarray]:
    """Insert points on the face and foot points of a placed panel's braces, each (k, 2)."""
    b = site.panels[place.index].bracing
    if b is None:
        return np.empty((0, 2)), np.empty((0, 2))
    x = np.asarray(b.positions or braces.default_positions(place.width_ft, b.count), dtype=float)
    return place.at(x, 0.0), place.at(x, anchor_distance_ft(b))


@dataclass(frozen=True)
class _Braces:
    """Every brace of the walls standing, one row each."""

    wall: np.ndarray    # its wall's row in the places
    mark: np.ndarray       # of str objects
    number: np.ndarray  # 1-based within its wall
    along_ft: np.ndarray  # from the wall's first edge
    insert: np.ndarray  # (m, 2)
    foot: np.ndarray    # (m, 2)
    kind: np.ndarray    # foot anchor kind, '' when none named
    anchor: np.ndarray  # foot anchor type name, '' when none named
    top_ft: np.ndarray  # brace pin heights above the slab, at the insert and at the foot
    low_ft: np.ndarray

    def segments(self, rows) -> np.ndarray:
        """The braces at `rows` as plan segments, insert to foot."""
        return shapely.linestrings(np.stack([self.insert[rows], self.foot[rows]], axis=-2))


def _brace_table(places: Places, bracing: _Bracing) -> _Braces:
    """Every brace of the braced walls of `bracing`, computed for all braces at once."""
    count = bracing.count
    wall = np.repeat(bracing.walls[bracing.braced], count)
    first = np.repeat(np.cumsum(count) - count, count)
    number = np.arange(len(wall)) - first + 1
    # the centers of equal strips (braces.default_positions), or the positions given
    along = (number - 0.5) * places.width_ft[wall] / count.repeat(count)
    along[bracing.given.repeat(count)] = bracing.positions
    insert = np.stack([places.origin[wall, i] + along * places.direction[wall, i]
                       for i in (0, 1)], axis=-1)  # x and y apart, as in _at
    foot = _at(places, wall, along, bracing.anchor_ft.repeat(count))
    return _Braces(wall, places.mark[wall], number, along, insert, foot, bracing.kind.repeat(count),
                   bracing.anchor.repeat(count), bracing.top_ft.repeat(count),
                   bracing.low_ft.repeat(count))


# --- slab and ground ----------------------------------------------------------------------------
@dataclass(frozen=True)
class _Slab:
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


def _slab(site: Site) -> _Slab | None:
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
    return _Slab(outline.difference(holes), holes, edges)


def _ground(site: Site):
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


def _edge_distances_ft(slab: _Slab, points: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Least distance (ft) of each point to the slab edge, a hole or a joint, and which one
    (nan when one of them has no boundary: the distance is not known)."""
    d = np.stack([np.full(len(points), np.nan) if pieces is None else
                  _distances_ft(points, pieces) for _, pieces in slab.edges])
    return d.min(axis=0), d.argmin(axis=0)


@dataclass(frozen=True)
class _SlabFeet:
    """The braces on slab anchors (`rows` of a brace table) and where their feet stand: on the
    slab or not, the least distance (ft) to its edge, a hole or a joint (nan: not known) and
    which of `slab.edges` that is (all off the slab when the plan has none)."""

    slab: _Slab | None
    rows: np.ndarray
    on: np.ndarray
    edge_ft: np.ndarray
    edge: np.ndarray


def _slab_feet(site: Site, t: _Braces) -> _SlabFeet:
    """Where the feet of the braces `t` on slab anchors stand on the site's slab."""
    slab, rows = _slab(site), np.flatnonzero(np.isin(t.kind, SLAB_KINDS))
    if slab is None:
        return _SlabFeet(None, rows, np.zeros(len(rows), bool), np.full(len(rows), np.nan),
                         np.zeros(len(rows), int))
    feet = t.foot[rows]
    return _SlabFeet(slab, rows, _covered(slab.area, feet), *_edge_distances_ft(slab, feet))


def _covered(area, points: np.ndarray) -> np.ndarray:
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
    out.update(zip(places.mark[wall[first]].tolist(), np.fmin(least, np.inf).tolist()))
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


# --- zones --------------------------------------------------------------------------------------
def _zone_reach_ft(site: Site, places: Places, bracing: _Bracing,
                   heights: dict[str, float] | None):
    """Heights, which are masonry under the zone rule, and the reach out in front and back
    behind (ft) of the walls of `bracing` (the rules are in `zone_reach`)."""
    extra = site.rule_value("masonry_zone_extra_ft")
    panel = places.fields_of(site)
    rows = places.index[bracing.walls]
    h = np.array(panel["height"], dtype=float)[rows]
    if heights:
        h = np.array([heights.get(m, x) for m, x in zip(places.mark[bracing.walls].tolist(),
                                                         h.tolist())], dtype=float)
    footprint = np.zeros(len(rows))
    footprint[bracing.braced] = bracing.anchor_ft
    masonry_kind = {name: m.kind == "masonry" and extra is not None
                    for name, m in site.materials.items()}
    masonry = np.fromiter(map(masonry_kind.__getitem__, panel["material"]), bool,
                          len(panel["material"]))[rows]
    front = h + footprint
    if extra is not None:  # OSHA 29 CFR 1926.706(a): h + 4 ft
        front = np.where(masonry, np.maximum(h + extra, front), front)
    back = np.where(masonry, 0.0, places.thickness_ft[bracing.walls] + h)
    return h, masonry, front, back


def zone_reach(site: Site, places: Places, heights: dict[str, float] | None = None,
               standing: set[str] | None = None) -> dict[str, tuple[float, float, str]]:
    """Reach of each standing wall's zone (ft): out from the face on the braced side, back from
    the face on the other side, and its basis (design.md §7).

    Masonry: height + `masonry_zone_extra_ft` (OSHA 29 CFR 1926.706(a)) on the unscaffolded
    side, taken as the braced side, never less than the brace footprint. Other walls (common
    practice: a wall can fall either way): height + brace footprint on the braced side, the
    height behind its back face. Both run the wall's whole length, no farther.
    """
    return _zone_reach(site, places, _read_bracing(site, places, standing), heights)


def _zone_reach(site: Site, places: Places, bracing: _Bracing,
                heights: dict[str, float] | None) -> dict[str, tuple[float, float, str]]:
    """`zone_reach` of the walls of `bracing`."""
    return _reach_words(site, places, bracing, _zone_reach_ft(site, places, bracing, heights))


def _reach_words(site: Site, places: Places, bracing: _Bracing,
                 reach_ft) -> dict[str, tuple[float, float, str]]:
    """`zone_reach` from the heights, masonry flags and reaches of `_zone_reach_ft`."""
    h, masonry, front, back = reach_ft
    rows = bracing.walls
    extra = site.rule_value("masonry_zone_extra_ft")
    source = site.rule("masonry_zone_extra_ft").source
    out = {}
    for mark, m, hh, f, b in zip(places.mark[rows].tolist(), masonry.tolist(), h.tolist(),
                                 front.tolist(), back.tolist()):
        if m:
            out[mark] = (f, 0.0, f"{f:.1f} ft on the braced (unscaffolded) side: "
                                 f"wall height + {extra:g} ft ({source})")
        else:
            out[mark] = (f, b, f"{f:.1f} ft on the braced side (height + brace footprint), "
                               f"{hh:.1f} ft behind (height) (common practice)")
    return out


def zone_rule(site: Site, masonry: bool) -> str:
    """The zone rule of a masonry wall or of another wall in words, without one wall's numbers
    (a legend's summary; `zone_reach` gives each wall's)."""
    if masonry:
        return (f"wall height + {site.rule_value('masonry_zone_extra_ft'):g} ft on the braced "
                f"(unscaffolded) side ({site.rule('masonry_zone_extra_ft').source})")
    return ("height + brace footprint on the braced side, the height behind the wall "
            "(common practice)")


def _zone_corners(site: Site, places: Places, bracing: _Bracing,
                  heights: dict[str, float] | None) -> np.ndarray:
    """Corners of the zones of the walls of `bracing`, rectangles along their length,
    (n, 4, 2)."""
    *_, front, back = _zone_reach_ft(site, places, bracing, heights)
    rows = bracing.walls
    along = places.width_ft[rows][:, None] * [0.0, 1.0, 1.0, 0.0]
    out = np.stack([-back, -back, front, front], axis=1)
    return _at(places, rows[:, None], along, out).reshape(-1, 4, 2)


def zones(site: Site, places: Places, heights: dict[str, float] | None = None,
          standing: set[str] | None = None) -> dict[str, Polygon]:
    """Restricted zone of each standing wall (design.md §7), a rectangle along its length.

    The evacuated zone (nobody inside, at the stand-down speed and during lifts) is given the
    same footprint: OSHA 29 CFR 1926.706(a) and the common practice name one zone, and no
    published reason was found to make it larger; what changes is who may be inside.
    """
    bracing = _read_bracing(site, places, standing)
    corners = _zone_corners(site, places, bracing, heights)
    return dict(zip(places.mark[bracing.walls].tolist(), shapely.polygons(corners)))


# --- findings -----------------------------------------------------------------------------------
def plan_findings(site: Site, places: Places,
                  standing: set[str] | None = None) -> list[tuple[str, Flag]]:
    """(mark, flag) of everything wrong in the plan for the walls standing (None: all placed)."""
    bracing = _read_bracing(site, places, standing)
    table = _brace_table(places, bracing)
    return [(f.mark, f.flag) for f in _findings(site, places, bracing, table,
                                                 _slab_feet(site, table))]


def _findings(site: Site, places: Places, bracing: _Bracing, table: _Braces, feet: _SlabFeet,
              heights: dict[str, float] | None = None) -> list[PlanFinding]:
    """Everything found in the plan with the walls of `bracing` standing (`table`: their braces,
    `feet`: those on slab anchors)."""
    rows = bracing.walls
    reach = _reach(places, rows, table)
    return (_line_findings(places)
            + _slab_anchor_findings(site, table, feet)
            + _ground_anchor_findings(site, table, feet.slab)
            + _brace_crossings(table, reach)
            + _braces_through_walls(table, places, reach)
            + _braces_in_areas(site, table, reach)
            + _zone_overlaps(site, places, rows, _zone_corners(site, places, bracing, heights))
            + _overlapping_walls(places, reach))


def _xy(p) -> str:
    return f"({p[0]:.1f}, {p[1]:.1f}) ft"


def _line_findings(places: Places) -> list[PlanFinding]:
    """Walls running past the end of their line (the model checks that the line exists)."""
    end = places.offset_ft + places.width_ft
    return [PlanFinding(str(places.mark[k]), Flag(
        "past-line-end", "notice", f"the wall runs to {end[k]:.1f} ft along line "
        f"'{places.line[k]}', which is {places.line_ft[k]:.1f} ft long", "site file"), [])
        for k in np.flatnonzero(end > places.line_ft + TOLERANCE_FT)]


def _by_mark(marks: np.ndarray, mask: np.ndarray) -> dict[str, np.ndarray]:
    """Positions where `mask` holds, grouped by wall mark (in order of appearance)."""
    groups: dict[str, list[int]] = {}
    for k in np.nonzero(mask)[0]:
        groups.setdefault(str(marks[k]), []).append(k)
    return {m: np.array(rows) for m, rows in groups.items()}


def _slab_anchor_findings(site: Site, t: _Braces, slab_feet: _SlabFeet) -> list[PlanFinding]:
    sel, slab = slab_feet.rows, slab_feet.slab
    if len(sel) == 0:
        return []
    marks = t.mark[sel]
    if slab is None:
        return [PlanFinding(m, Flag(
            "anchor-not-located", "notice", "the plan has no slab outline: the slab anchors' "
            "positions and edge distances are not checked", "method notes §6"), [])
            for m in dict.fromkeys(marks)]
    feet, on, which = t.foot[sel], slab_feet.on, slab_feet.edge
    in_hole = _covered(slab.holes, feet) if not slab.holes.is_empty else np.zeros_like(on)
    dist_in = slab_feet.edge_ft * IN_PER_FT
    anchors = t.anchor[sel]
    need, need_in = {}, np.zeros(len(sel))
    for name in site.anchor_types:
        used = anchors == name
        if used.any():
            need[name] = edge_distance_needed_in(site, name)
            need_in[used] = need[name][0]
    found = []
    for mark, rows in _by_mark(marks, ~on).items():
        where = "in a slab hole" if in_hole[rows].any() else "off the slab"
        found.append(PlanFinding(mark, Flag(
            "anchor-off-slab", "danger", f"slab anchor at {_numbers(t, sel[rows])} {where}, "
            f"as at {_xy(feet[rows[0]])}: no concrete to hold it",
            "ACI 318-19 Ch. 17 (an anchor in concrete); method notes §6"),
            [tuple(p) for p in feet[rows]]))
    for mark, rows in _by_mark(marks, on & (dist_in < need_in - TOLERANCE_FT)).items():
        k = rows[np.argmin(dist_in[rows])]
        needed, said = need[anchors[k]]
        found.append(PlanFinding(mark, Flag(
            "anchor-near-edge", "danger", f"slab anchor at {_numbers(t, sel[rows])}: "
            f"{dist_in[k]:.1f} in from {slab.edges[which[k]][0]}; {said} needs {needed:g} in",
            f"ACI 318-19 §17.9 (least edge distance, {needed:g} in); the distance found "
            "feeds psi_ed,N, §17.6.2.4.1"),
            [tuple(p) for p in feet[rows]]))
    return found


def _ground_anchor_findings(site: Site, t: _Braces, slab: _Slab | None) -> list[PlanFinding]:
    sel = np.nonzero(np.isin(t.kind, GROUND_KINDS))[0]
    if len(sel) == 0:
        return []
    ground = _ground(site)
    feet, kinds, marks = t.foot[sel], t.kind[sel], t.mark[sel]
    deadman = np.isin(kinds, ALSO_ON_SLAB)  # may stand on the slab as well
    on_ground = _covered(ground, feet) if ground is not None else np.zeros(len(sel), bool)
    on_slab = np.zeros(len(sel), bool)  # asked of the deadmen only
    if slab is not None:
        on_slab[deadman] = _covered(slab.area, feet[deadman])
    drawn = (ground is not None) | (deadman & (slab is not None))
    found = [PlanFinding(mark, Flag(
        "anchor-not-located", "notice", f"the plan has no open ground: the {kinds[rows[0]]} "
        "anchors' positions are not checked", "method notes §6"), [])
        for mark, rows in _by_mark(marks, ~drawn).items()]
    for mark, rows in _by_mark(marks, drawn & ~(on_ground | (deadman & on_slab))).items():
        kind = kinds[rows[0]]
        where = "on open ground or on the slab" if kind in ALSO_ON_SLAB else "on open ground"
        found.append(PlanFinding(mark, Flag(
            "ground-anchor-off-ground", "danger", f"{kind} anchor at {_numbers(t, sel[rows])} "
            f"not {where}, as at {_xy(feet[rows[0]])}",
            "method notes §6 (ground anchors go in open ground)"), [tuple(p) for p in feet[rows]]))
    return found


def _numbers(t: _Braces, rows) -> str:
    """'brace 2' or 'braces 1, 2' of the rows given."""
    numbers = [str(n) for n in t.number[rows]]
    return ("brace " if len(numbers) == 1 else "braces ") + ", ".join(numbers)


@dataclass(frozen=True)
class _Reach:
    """How far the walls standing reach in plan, footprint and braces, as bounding boxes, and
    the pairs of them whose boxes meet: only their braces and footprints can meet each other."""

    rows: np.ndarray   # the walls' rows in the places
    lo: np.ndarray     # (n, 2) least x and y of each wall's footprint and braces
    hi: np.ndarray     # (n, 2) greatest
    first: np.ndarray  # each wall's first brace in the brace table
    count: np.ndarray  # and how many it has
    near: np.ndarray   # (2, p): positions in `rows` of the walls whose boxes meet, first < second


def _reach(places: Places, rows: np.ndarray, t: _Braces) -> _Reach:
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
    return _Reach(rows, lo, hi, first, count, np.stack([a[a < b], b[a < b]]))


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


def _brace_crossings(t: _Braces, reach: _Reach) -> list[PlanFinding]:
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
    for i, j, pt, seg_i, seg_j in zip(a, b, meet, seg_a, seg_b):
        xy = (pt.x, pt.y)
        hi, hj = (t.top_ft[k] + (t.low_ft[k] - t.top_ft[k])
                  * shapely.line_locate_point(seg, pt, normalized=True)
                  for k, seg in ((i, seg_i), (j, seg_j)))
        for me, other, h_me, h_other in ((i, j, hi, hj), (j, i, hj, hi)):
            found.append(PlanFinding(t.mark[me], Flag(
                "braces-cross", "danger", f"brace {t.number[me]} crosses brace "
                f"{t.number[other]} of {t.mark[other]} at {_xy(xy)}, {h_me:.1f} ft and "
                f"{h_other:.1f} ft above the slab there: one cannot be set as drawn",
                "common practice (method notes §6)"), [xy], (str(t.mark[other]),)))
    return found


def _braces_through_walls(t: _Braces, places: Places, reach: _Reach) -> list[PlanFinding]:
    """Braces that run through another wall standing (a brace stands on its own wall's face)."""
    own, other = np.concatenate([reach.near, reach.near[::-1]], axis=1)
    a, w = _every_pair(reach.first[own], reach.count[own], other, np.ones_like(other))
    by_brace = np.lexsort((w, a))
    a, w = a[by_brace], reach.rows[w[by_brace]]
    segs, shapes = t.segments(a), places.footprints(w)
    keep = shapely.intersects(segs, shapes) & ~shapely.touches(segs, shapes)
    found = []
    for i, k, seg, shape in zip(a[keep], w[keep], segs[keep], shapes[keep]):
        pt = shapely.point_on_surface(shapely.intersection(seg, shape))
        wall = places.mark[k]
        found.append(PlanFinding(t.mark[i], Flag(
            "brace-crosses-wall", "danger", f"brace {t.number[i]} runs through wall "
            f"{wall} at {_xy((pt.x, pt.y))}", "method notes §6"), [(pt.x, pt.y)], (str(wall),)))
    return found


def _braces_in_areas(site: Site, t: _Braces, reach: _Reach) -> list[PlanFinding]:
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
    for mark, area in dict.fromkeys(zip(t.mark[rows[s]], k)):
        mine = s[(t.mark[rows[s]] == mark) & (k == area)]
        a = areas[area]
        pts = [shapely.point_on_surface(shapely.intersection(segs[r], shapes[area]))
               for r in mine]
        found.append(PlanFinding(mark, Flag(
            "brace-crosses-keep-clear", BRACE_IN_AREA[a.kind], f"{_numbers(t, rows[mine])} "
            f"{'enters' if len(mine) == 1 else 'enter'} the {AREA_WORDS[a.kind]} '{a.name}'", "site plan areas (method notes §6)"),
            [(p.x, p.y) for p in pts]))
    return found


def _zone_overlaps(site: Site, places: Places, rows: np.ndarray,
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
    for zi, ki, part, a_ft2 in zip(z, k, common, size):
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
            f"zone overlaps the "
            f"{AREA_WORDS[area.kind]} '{area.name}' by {a_ft2:.0f} ft²: " + (
                LIMITED_ACCESS if masonry else "authorized workers only while the wall "
                "stands, nobody at the stand-down speed or during lifts"),
            masonry_source if masonry else "common practice (method notes §6)"), [(pt.x, pt.y)]))
    return found


def _overlapping_walls(places: Places, reach: _Reach) -> list[PlanFinding]:
    a, b = reach.rows[reach.near]
    shapes_a, shapes_b = places.footprints(a), places.footprints(b)
    meet = shapely.intersects(shapes_a, shapes_b)
    a, b = a[meet], b[meet]
    common = shapely.intersection(shapes_a[meet], shapes_b[meet])
    found = []
    for i, j, part in zip(places.mark[a].tolist(), places.mark[b].tolist(), common):
        if shapely.area(part) > TOLERANCE_FT:
            pt = shapely.point_on_surface(part)
            found.append(PlanFinding(i, Flag(
                "walls-overlap", "warning", f"overlaps wall {j} in plan: check the "
                "offsets along the wall line", "site file"), [(pt.x, pt.y)], (j,)))
    return found


# --- the whole plan -----------------------------------------------------------------------------
def _rings(corners: np.ndarray) -> list[Coords]:
    """Each outline of `corners` (n, k, 2) as a closed ring of plan points."""
    return [[*map(tuple, c), tuple(c[0])] for c in corners.tolist()]


def plan_geometry(site: Site, standing: set[str] | None = None, day: int | None = None,
                  heights: dict[str, float] | None = None) -> PlanGeometry:
    """The plan of a day (`standing`: marks standing; None: every placed wall) for the views."""
    places = place(site)
    bracing = _read_bracing(site, places, standing)
    reach_ft = _zone_reach_ft(site, places, bracing, heights)
    reach = _reach_words(site, places, bracing, reach_ft)
    masonry = dict(zip(places.mark[bracing.walls].tolist(), reach_ft[1].tolist()))
    zone_of = dict(zip(bracing.walls.tolist(),
                       _rings(_zone_corners(site, places, bracing, heights))))
    t = _brace_table(places, bracing)
    pairs = list(zip(map(tuple, _at(places, t.wall, t.along_ft, 0.0).tolist()),
                     map(tuple, t.foot.tolist())))
    first = np.searchsorted(t.wall, np.arange(len(places) + 1)).tolist()  # walls in order
    every = places.bracing(site)  # the foot anchors of every placed wall, standing or not
    kind, anchor = [""] * len(places), [None] * len(places)
    for k, foot_kind, foot_anchor in zip(every.walls[every.braced].tolist(), every.kind.tolist(),
                                         every.anchor.tolist()):
        kind[k], anchor[k] = foot_kind, foot_anchor or None
    faces = _at(places, places.rows()[:, None], places.width_ft[:, None] * [0.0, 1.0], 0.0)
    every_braces = places.braces(site)  # every placed wall's braces, for the elevations
    along = every_braces.along_ft.tolist()
    every_first = np.searchsorted(every_braces.wall, np.arange(len(places) + 1)).tolist()
    panels: list[PlanPanel] = []
    for k, (mark, i, footprint, face) in enumerate(zip(
            places.mark.tolist(), places.index.tolist(), _rings(places.footprint_corners),
            faces.tolist())):
        p = site.panels[i]
        zone = zone_of.get(k, [])
        panels.append(PlanPanel(
            mark=mark, line=places.line[k], standing=k in zone_of,
            height_ft=heights.get(mark, p.height) if heights else p.height,
            footprint=footprint, face=(tuple(face[0]), tuple(face[1])),
            braces=pairs[first[k]:first[k + 1]], foot_kind=kind[k], foot_anchor=anchor[k],
            restricted_zone=zone, evacuated_zone=list(zone),
            zone_basis=reach[mark][2] if k in zone_of else "",
            zone_front_ft=reach[mark][0] if k in zone_of else 0.0,
            zone_back_ft=reach[mark][1] if k in zone_of else 0.0,
            zone_rule=zone_rule(site, masonry[mark]) if k in zone_of else "",
            zone_name=(("limited access zone" if masonry[mark] else "restricted zone")
                       if k in zone_of else ""),
            offset_ft=float(places.offset_ft[k]), width_ft=float(places.width_ft[k]),
            elevation=_elevation(p, places, k, along[every_first[k]:every_first[k + 1]])))
    plan = site.plan
    geometry = PlanGeometry(
        day=day,
        slab=[tuple(p) for p in plan.slab] if plan else [],
        slab_holes=[[tuple(p) for p in h] for h in plan.slab_holes] if plan else [],
        joints=[[tuple(p) for p in j] for j in plan.slab_joints] if plan else [],
        ground=[[tuple(p) for p in g] for g in plan.ground] if plan else [],
        areas=[PlanArea(a.name, a.kind, [tuple(p) for p in a.polygon])
               for a in (plan.areas if plan else [])],
        lines=[PlanLine(line.name, tuple(line.start), tuple(line.end), line.braced_side)
               for line in site.lines],
        panels=panels,
        findings=_findings(site, places, bracing, t, _slab_feet(site, t), heights),
        bounds=(0.0, 0.0, 1.0, 1.0))
    geometry.bounds = _bounds(geometry)
    return geometry


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


def findings(site: Site, places: Places) -> list[PlanFinding]:
    """Everything found in the plan with every placed wall standing."""
    return _findings(site, places, places.bracing(site), places.braces(site),
                     places.slab_feet(site))


def day_findings(found: list[PlanFinding], days) -> dict[int, list[Flag]]:
    """Each day's plan findings, from one look at every placed wall (`findings`): a finding
    holds on the days its wall and the walls it involves all stand; its message names the wall.

    `days` are the job's days in order (`DayResult`s): a wall stands from the day it is lifted
    until the day it is released."""
    out: dict[int, list[Flag]] = {d.day: [] for d in days}
    if not found:
        return out
    first, end = {}, {}
    for d in days:
        first.update(dict.fromkeys(d.lifts, d.day))
        end.update(dict.fromkeys(d.released, d.day))
    last = days[-1].day + 1
    for f in found:
        walls = (f.mark, *f.others)
        if not all(m in first for m in walls):
            continue  # a wall that never stands
        lo = max(first[m] for m in walls)
        hi = min(end.get(m, last) for m in walls)
        flag = Flag(f.flag.code, f.flag.severity, f"{f.mark}: {f.flag.message}", f.flag.source)
        for day in range(lo, hi):
            out[day].append(flag)
    return out


def _bounds(g: PlanGeometry) -> tuple[float, float, float, float]:
    pts = [*g.slab, *(p for h in g.slab_holes for p in h), *(p for j in g.joints for p in j),
           *(p for r in g.ground for p in r), *(p for a in g.areas for p in a.coords),
           *(p for line in g.lines for p in (line.start, line.end)),
           *(p for w in g.panels for p in w.footprint + w.restricted_zone),
           *(p for w in g.panels for b in w.braces for p in b)]
    if not pts:
        return (0.0, 0.0, 1.0, 1.0)
    xy = np.array(pts, dtype=float)
    lo, hi = xy.min(axis=0), xy.max(axis=0)
    return (float(lo[0]), float(lo[1]), float(hi[0]), float(hi[1]))
