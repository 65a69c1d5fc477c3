"""Walls placed along their lines in plan, and their braces (method notes §6).

A wall line runs from `start` to `end` and is the braced face of the walls along it; a wall's
thickness lies on the other side. A panel occupies [offset, offset + width] along its line, its
braces stand on the line's braced side and each brace foot sits `anchor_distance` out from the
face, square to the line.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass
from functools import cached_property
from itertools import chain, repeat

import numpy as np
import shapely
from shapely.geometry import Polygon

from bracing import braces
from bracing.model import Bracing, Site, read_panels
from bracing.plan.records import IN_PER_FT
from bracing.plan.slab import SlabFeet, slab_feet


def braced_normal(direction, side) -> np.ndarray:
    """The unit vector square to a line toward its braced side: the left hand (-u_y, u_x),
    looking along the line's unit vector u = `direction` (..., 2), times `side` (+1: braced on
    the left, -1: on the right) (plane geometry)."""
    u = np.asarray(direction, dtype=float)
    return np.stack([-u[..., 1], u[..., 0]], axis=-1) * np.asarray(side, dtype=float)[..., None]


def wall_point(origin, direction, normal, along_ft, out_ft) -> np.ndarray:
    """The plan points `along_ft` along a wall's line from `origin` (its first edge on the face)
    and `out_ft` out from the face toward the braced side: origin + along u + out n, with u the
    unit vector along the line and n the one toward the braced side (plane geometry).

    The arrays broadcast over their leading axes; the result is (..., 2), x and y worked apart
    (numpy is slow over a last axis of two)."""
    a = np.asarray(along_ft, dtype=float)
    o = np.asarray(out_ft, dtype=float)
    return np.stack([origin[..., i] + a * direction[..., i] + o * normal[..., i]
                     for i in (0, 1)], axis=-1)


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
        return wall_point(self.origin, self.direction, self.normal, along_ft, out_ft)

    @property
    def face(self) -> np.ndarray:
        """The braced face, first edge to last edge, shape (2, 2)."""
        return self.at([0.0, self.width_ft], 0.0)


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
        self._read: tuple[Site, WallBracing, BraceTable, SlabFeet] | None = None

    def fields_of(self, site: Site) -> dict[str, tuple]:
        """The panels' fields of `site` (model.read_panels): those read to place it, if it is
        the site placed."""
        return self.columns if site is self.site else read_panels(site)

    @cached_property
    def _row(self) -> dict[str, int]:
        """Each mark's row, made when a wall is asked for by mark."""
        return dict(zip(self.mark.tolist(), range(len(self.mark)), strict=True))

    def bracing(self, site: Site) -> WallBracing:
        """The bracing of every wall placed, read from `site` (the site placed) only once for
        the foot edge distances and the findings."""
        return self._every(site)[1]

    def braces(self, site: Site) -> BraceTable:
        """Every brace of every wall placed (`brace_table`), worked out once as `bracing`."""
        return self._every(site)[2]

    def slab_feet(self, site: Site) -> SlabFeet:
        """Where the slab-anchor feet of every wall placed stand, worked out once as `bracing`."""
        return self._every(site)[3]

    def _every(self, site: Site) -> tuple[Site, WallBracing, BraceTable, SlabFeet]:
        """The site placed, then what `bracing`, `braces` and `slab_feet` give."""
        if self._read is None or self._read[0] is not site:
            bracing = bracing_of(site, self, self.rows())
            table = brace_table(self, bracing)
            self._read = (site, bracing, table, slab_feet(site, table))
        return self._read

    @cached_property
    def footprint_corners(self) -> np.ndarray:
        """Corners of each panel's footprint, a thickness-deep strip behind its face, (n, 4, 2)."""
        along = self.width_ft[:, None] * [0.0, 1.0, 1.0, 0.0]
        back = self.thickness_ft[:, None] * [0.0, 0.0, 1.0, 1.0]
        return self.at(self.rows()[:, None], along, -back)

    def at(self, rows, along_ft, out_ft) -> np.ndarray:
        """`PanelPlace.at` of the walls at `rows` (arrays broadcast; (..., 2))."""
        return wall_point(self.origin[rows], self.direction[rows], self.normal[rows], along_ft,
                          out_ft)

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
        return PanelPlace(index=int(self.index[k]), mark=mark, line=self.line[k],
                          origin=self.origin[k], direction=self.direction[k],
                          normal=self.normal[k], width_ft=float(self.width_ft[k]),
                          thickness_ft=self.thickness_ft[k], footprint=self.footprints(k))

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
    normal = braced_normal(u, sides[on])
    offset = np.array(offset, dtype=float)[rows]
    return Places(index=rows, mark=np.array(mark, dtype=object)[rows],
                  line=[line[i] for i in rows.tolist()],
                  origin=wall_point(ends[on, 0], u, normal, offset, 0.0),  # the first edge
                  direction=u, normal=normal,
                  width_ft=np.array(width, dtype=float)[rows],
                  thickness_ft=np.array(thickness, dtype=float)[rows] / IN_PER_FT,
                  offset_ft=offset, line_ft=length, site=site, columns=panel)


def standing_bracing(site: Site, places: Places, standing: set[str] | None) -> WallBracing:
    """The bracing of the walls standing (None: every placed wall, read once per places)."""
    if standing is None:
        return places.bracing(site)
    return bracing_of(site, places, places.rows(standing))


def anchor_distance_ft(b: Bracing) -> float:
    """Brace foot from the wall face (ft): as given, or from the brace angle (geometry)."""
    if b.anchor_distance is not None:
        return b.anchor_distance
    return float(braces.anchor_distance_for_angle(
        b.insert_height, b.angle, b.insert_offset / IN_PER_FT, b.foot_offset / IN_PER_FT,
        b.base_below_slab))


@dataclass(frozen=True)
class WallBracing:
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


def bracing_of(site: Site, places: Places, rows: np.ndarray) -> WallBracing:
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
    number = dict(zip([None, *names], range(len(names) + 1), strict=True))
    which = np.fromiter(map(number.__getitem__, panel["foot_anchor"]), int,
                        len(panel["foot_anchor"]))[picked]
    return WallBracing(
        walls=rows, braced=braced, count=np.array(panel["count"], dtype=int)[picked],
        given=given,
        positions=list(chain.from_iterable(panel["positions"][r]
                                           for r in picked[given].tolist())),
        anchor_ft=np.where(np.isnan(given_ft), for_angle_ft, given_ft),
        kind=np.array(["", *(site.anchor_types[a].kind for a in names)], dtype=str)[which],
        anchor=np.array(["", *names], dtype=str)[which], top_ft=height - base,
        low_ft=foot_offset)


def brace_points(site: Site, place: PanelPlace) -> tuple[np.ndarray, np.ndarray]:
    """Insert points on the face and foot points of a placed panel's braces, each (k, 2)."""
    b = site.panels[place.index].bracing
    if b is None:
        return np.empty((0, 2)), np.empty((0, 2))
    x = np.asarray(b.positions or braces.default_positions(place.width_ft, b.count), dtype=float)
    return place.at(x, 0.0), place.at(x, anchor_distance_ft(b))


@dataclass(frozen=True)
class BraceTable:
    """Every brace of the walls standing, one row each."""

    wall: np.ndarray    # its wall's row in the places
    mark: np.ndarray    # of str objects
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

    def numbers(self, rows) -> str:
        """'brace 2' or 'braces 1, 2' of the rows given."""
        numbers = [str(n) for n in self.number[rows]]
        return ("brace " if len(numbers) == 1 else "braces ") + ", ".join(numbers)


def brace_table(places: Places, bracing: WallBracing) -> BraceTable:
    """Every brace of the braced walls of `bracing`, computed for all braces at once."""
    count = bracing.count
    wall = np.repeat(bracing.walls[bracing.braced], count)
    first = np.repeat(np.cumsum(count) - count, count)
    number = np.arange(len(wall)) - first + 1
    # the centers of equal strips (braces.default_positions), or the positions given
    along = (number - 0.5) * places.width_ft[wall] / count.repeat(count)
    along[bracing.given.repeat(count)] = bracing.positions
    return BraceTable(
        wall=wall, mark=places.mark[wall], number=number, along_ft=along,
        insert=places.at(wall, along, 0.0),
        foot=places.at(wall, along, bracing.anchor_ft.repeat(count)),
        kind=bracing.kind.repeat(count), anchor=bracing.anchor.repeat(count),
        top_ft=bracing.top_ft.repeat(count), low_ft=bracing.low_ft.repeat(count))
