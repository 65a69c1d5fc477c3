"""What the plan gives the views: plain coordinates (ft) of a day's plan and its findings, and
the constants the plan's modules share."""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
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
# A zone over an area of each kind (occupied areas, the public way, neighbors).
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


def xy_words(p) -> str:
    """A plan point in words, '(12.0, 3.5) ft'."""
    return f"({p[0]:.1f}, {p[1]:.1f}) ft"


@dataclass(slots=True)
class PlanArea:
    """An area of the site plan (a kind of `ZONE_OVER_AREA` or `BRACE_IN_AREA`, or another)."""

    name: str
    kind: str
    coords: Coords


@dataclass(slots=True)
class PlanLine:
    """A wall line: its ends and the side its walls are braced on ('left' or 'right')."""

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
class PlanFoundationWall:
    """A foundation wall on the plan (method notes §12): its footprint, a strip of ground on its
    backfill side (away from its line's braced side), and that day's backfill as the result
    gives it (`bracing.report.svg.foundation` fills the day's values)."""

    mark: str
    line: str
    footprint: Coords
    backfill: Coords              # the strip hatched when the wall is backfilled that day
    built: bool = True            # standing that day
    backfill_ft: float = 0.0      # backfill in place that day
    over: bool = False            # that backfill is above what the wall takes: a danger
    # its inside braces (method notes §12), each (insert on the inside face, foot), at their
    # places along the wall (the result's inside_brace.positions_ft), on the braced side of its
    # line, away from the backfill; drawn on the days they are in use (`braced`)
    braces: list[tuple[Point, Point]] = field(default_factory=list)
    foot_kind: str = ""           # their foot anchor's kind (anchor_kinds.KINDS) or ''
    braced: bool = False          # in use that day
    brace_height_ft: float = 0.0  # where they bear on the wall


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
    foundation_walls: list[PlanFoundationWall] = field(default_factory=list)

    @property
    def standing(self) -> list[str]:
        """The marks of the walls standing that day."""
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
                out.append(Detail(
                    line=line.name, marks=[p.mark for p in group],
                    bounds=(float(lo[0]), float(lo[1]), float(hi[0]), float(hi[1])),
                    part=k, parts=len(groups)))
        return out
