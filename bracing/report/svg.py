"""SVG drawings from the result: the site plan of a day (an overview and detail plans of each
wall line), the elevation of a wall with its brace positions, and its bracing section.

Drawn from `SiteResult.plan` (a `bracing.plan.PlanGeometry`, or a mapping of them by day) and
from a `PanelResult`: no engineering value is computed here. Only the standard library, numpy
and shapely (to find free room for labels) are used. Colors and symbols are our own plain
choices; every failing item also carries a cross, a number and the word DANGER, never color
alone. Plan y points north.

The plan sheets are laid out in millimeters for print: every sheet is `SHEET_MM` wide (the
printable width of letter and of A4 portrait paper with 13 mm margins), so a font size in the
drawing is its size on paper. The plan itself is drawn in feet inside a scaled group, at a
standard engineering scale (1 in = 10, 20, 30, ... ft). Labels are set in sheet millimeters by
`place_labels`, clear of each other and of the drawing where there is room.

For the crew sheet (each function's docstring says more):
- `overview_svg(result, day)`: the whole site on one sheet, with legend and findings;
- `detail_svgs(result, day)`: a detail plan of each wall line (or stretch of a long one);
- `elevation_svg(panel_result, elevation)`, `elevation_svgs(result, day)`: walls in elevation;
- `section_svg(panel_result)`: one wall's bracing section;
- `plan_svg(result, day)`: the overview and the details on one sheet (`bracing plan`).
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass
from xml.sax.saxutils import escape, quoteattr

import numpy as np
import shapely
from shapely.geometry import LineString, Point, Polygon, box

from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.plan import Elevation
from bracing.results import CAUTION

PX_WIDTH = 1000  # width on screen (px) of the drawings not laid out in mm
SECTION_PX_WIDTH = 360
FONT = "DejaVu Sans, Arial, Helvetica, sans-serif"

SHEET_MM = 190.0        # printable width of letter (215.9 mm) and A4 (210 mm) less margins
PAD_MM = 2.0            # inner margin of a sheet
TITLE_MM = 4.2          # font sizes on paper (mm): a title (12 pt)
TEXT_MM = 2.8           # body text, legend, findings (8 pt)
MARK_MM = 3.2           # wall marks on the plans (9 pt: capitals 2.3 mm tall)
LABEL_MM = 2.6          # other plan labels: areas, lines, finding numbers (7.4 pt)
LEAST_TEXT_MM = 2.5     # no text on a sheet is smaller than this (7 pt)
OVERVIEW_MAX_H_MM = 170.0  # tallest plan frame of the overview
PAGE_MM = 250.0            # the overview fits one page: letter's printable height, 254 mm
LEAST_PLAN_MM = 90.0       # the overview's plan frame is never shorter than this
SCALE_ROW_MM = 9.0         # the row under a plan frame: scale bar, scale, north arrow
DETAIL_MAX_H_MM = 120.0    # and of a detail plan
ELEVATION_MM = 120.0       # width of a wall elevation on paper
SCALES_FT_PER_IN = (5, 10, 20, 30, 40, 50, 60, 80, 100, 150, 200, 300, 400, 500, 600, 800, 1000,
                    1500, 2000)  # engineering scales, 1 in = N ft

# kind -> (color, hatch angle in degrees or None for a tint only, legend words)
AREA_STYLE = {
    "keep_clear": ("#4a4a4a", 45, "keep-clear area"),
    "crane_path": ("#c96a12", -45, "crane path"),
    "public_way": ("#b03a2e", 45, "public way"),
    "neighbor": ("#6c3483", 90, "neighbor"),
    "office": ("#2471a3", None, "site office"),
    "work": ("#1e8449", None, "work area"),
}
# areas that braces must stay out of: drawn again above the braces so that they show
KEEP_OUT = ("keep_clear", "crane_path", "public_way", "neighbour", "neighbor")
SLAB, SLAB_EDGE, GROUND = "#e3e3e3", "#4d4d4d", "#efe5cc"
WALL, BRACE, ZONE, EVACUATED = "#3b3b3b", "#1f4e9c", "#e69b1e", "#b03a2e"
DANGER, WARNING = "#c0392b", "#b9770e"
STATUS_WORDS = {"unsafe": "UNSAFE", "needs_braces": "NEEDS BRACES"}
MOST_FINDINGS = 40
HALO = ' paint-order="stroke" stroke="#fff" stroke-linejoin="round"'


def _f(v: float) -> str:
    """A coordinate for SVG, to 1/1000 of its unit."""
    s = f"{v:.3f}".rstrip("0").rstrip(".")
    return "0" if s in ("-0", "") else s


def _plan_pts(coords) -> str:
    """Points for a plan group, which turns y over itself."""
    return " ".join(f"{_f(x)},{_f(y)}" for x, y in coords)


def _text(x, y, words, size, anchor="start", weight="normal", fill="#000", extra="") -> str:
    return (f'<text x="{_f(x)}" y="{_f(y)}" font-size="{_f(size)}" text-anchor="{anchor}" '
            f'font-weight="{weight}" fill="{fill}"{extra}>{escape(str(words))}</text>')


# --- text sizes and free room for labels ---------------------------------------------------------
_NARROW, _WIDE = set("ijlI.,:;'!|()[] "), set("mwMW@%")


def text_width(words: str, size: float, bold: bool = False) -> float:
    """Width of a line of text in the units of `size` (its font size), a little over that of
    DejaVu Sans or Arial: narrow letters 0.36 em, wide ones 1.0, capitals 0.8, digits 0.66, the
    rest 0.64; bold 15 % wider (the fonts' advance widths, rounded up)."""
    em = sum(0.36 if c in _NARROW else 1.0 if c in _WIDE else 0.8 if c.isupper() else
             0.66 if c.isdigit() else 0.64 for c in str(words))
    return em * size * (1.15 if bold else 1.0)


def wrap(words: str, size: float, width: float, bold: bool = False) -> list[str]:
    """`words` broken into lines no wider than `width` (`text_width`); a word longer than a
    line stands on its own."""
    lines: list[str] = []
    for word in str(words).split():
        if lines and text_width(f"{lines[-1]} {word}", size, bold) <= width:
            lines[-1] = f"{lines[-1]} {word}"
        else:
            lines.append(word)
    return lines or [""]


@dataclass(frozen=True)
class Label:
    """A label to place: its words, font size and weight, and the point (sheet units, y down)
    it names; `key` says what it names."""

    key: str
    words: str
    size: float
    at: tuple[float, float]
    bold: bool = True
    color: str = "#000"


@dataclass(frozen=True)
class Placed:
    """Where a label went: its box (least x, least y, greatest x, greatest y; y down) and
    whether it stands off its point (then a leader line joins them)."""

    label: Label
    box: tuple[float, float, float, float]
    leader: bool


def label_box_size(label: Label) -> tuple[float, float]:
    """Width and height of a label's box: its text's width and 1.2 of its font size (the
    descenders and the halo)."""
    return text_width(label.words, label.size, label.bold), 1.2 * label.size


def place_labels(labels: list[Label], drawn: list[tuple[object, float]],
                 frame: tuple[float, float, float, float]) -> list[Placed | None]:
    """Boxes for the labels, in order, none overlapping another, each inside `frame`.

    Candidates ring each label's point, nearest first (the point in the middle of the box, then
    boxes beside it in 16 directions at growing distances, then anywhere in the frame). A box
    may not meet a box already placed (with a gap of 0.15 of the font size); among the others
    the one with the least cost wins: the weights of the `drawn` items it covers (shapely
    geometries in sheet units, each with a weight) plus 0.1 for each label height it stands off
    its point (nearer winning ties). None for a label that finds no room."""
    lo_x, lo_y, hi_x, hi_y = frame
    shapes = np.array([s for s, _ in drawn], dtype=object)
    weights = np.array([w for _, w in drawn], dtype=float)
    tree = shapely.STRtree(shapes) if len(shapes) else None
    taken = np.empty((0, 4))
    out: list[Placed | None] = []
    turns = np.radians(np.arange(0, 360, 22.5))
    for label in labels:
        w, h = label_box_size(label)
        ax, ay = label.at
        rings = [0.0, 0.2, 0.6, 1.2, 2.0, 3.0, 4.5, 6.5, 9.0, 13.0]
        cx = [np.array([ax])]
        cy = [np.array([ay])]
        for r in rings:
            cx.append(ax + np.cos(turns) * (w / 2 + r * h))
            cy.append(ay + np.sin(turns) * (h / 2 + r * h))
        gx, gy = np.meshgrid(np.arange(lo_x + w / 2, hi_x - w / 2 + 1e-9, max(h, w / 4)),
                             np.arange(lo_y + h / 2, hi_y - h / 2 + 1e-9, h))
        cx.append(gx.ravel())
        cy.append(gy.ravel())
        cx, cy = np.concatenate(cx), np.concatenate(cy)
        boxes = np.stack([cx - w / 2, cy - h / 2, cx + w / 2, cy + h / 2], axis=1)
        inside = ((boxes[:, 0] >= lo_x) & (boxes[:, 1] >= lo_y) & (boxes[:, 2] <= hi_x)
                  & (boxes[:, 3] <= hi_y))
        gap = 0.15 * label.size
        if len(taken):
            meets = ((boxes[:, None, 0] < taken[None, :, 2] + gap)
                     & (boxes[:, None, 2] > taken[None, :, 0] - gap)
                     & (boxes[:, None, 1] < taken[None, :, 3] + gap)
                     & (boxes[:, None, 3] > taken[None, :, 1] - gap)).any(axis=1)
        else:
            meets = np.zeros(len(boxes), bool)
        free = np.flatnonzero(inside & ~meets)
        if len(free) == 0:
            out.append(None)
            continue
        cost = np.zeros(len(free))
        if tree is not None:
            hit_box, hit = tree.query(shapely.box(*boxes[free].T), predicate="intersects")
            cost = np.bincount(hit_box, weights=weights[hit], minlength=len(free))
        distance = np.hypot(cx[free] - ax, cy[free] - ay) / h
        best = free[np.lexsort((distance, np.round(cost + 0.1 * distance, 6)))[0]]
        b = boxes[best]
        taken = np.vstack([taken, b])
        near = box(*b).distance(Point(ax, ay)) > 0.6 * h
        out.append(Placed(label, tuple(float(v) for v in b), bool(near)))
    return out


def boxes_overlap(a, b) -> bool:
    """Whether two boxes (least x, least y, greatest x, greatest y) share any area."""
    return a[0] < b[2] and b[0] < a[2] and a[1] < b[3] and b[1] < a[3]


def _placed_items(placed: list[Placed | None]) -> list[str]:
    """The placed labels as SVG text with a white halo, and their leader lines."""
    out = []
    for p in placed:
        if p is None:
            continue
        x0, _, x1, y1 = p.box
        lab = p.label
        color = lab.color
        if p.leader:
            edge = box(*p.box).exterior
            near = edge.interpolate(edge.project(Point(lab.at)))
            out.append(f'<line x1="{_f(lab.at[0])}" y1="{_f(lab.at[1])}" x2="{_f(near.x)}" '
                       f'y2="{_f(near.y)}" stroke="{color}" stroke-width="0.2"/>')
        out.append(_text((x0 + x1) / 2, y1 - 0.3 * lab.size, lab.words, lab.size, "middle",
                         "bold" if lab.bold else "normal", color,
                         f' class="label" data-key={quoteattr(lab.key)}{HALO} '
                         f'stroke-width="{_f(0.35 * lab.size)}"'))
    return out


def pick_plan(plan, day: int | None = None):
    """The PlanGeometry to draw: the given day's, else the busiest day's (most walls standing,
    the earliest of equals); None when the result has no plan."""
    if plan is None or not isinstance(plan, Mapping):
        return plan
    if not plan:
        return None
    if day is not None:
        if day not in plan:
            raise ValueError(f"no plan for day {day}; days planned: "
                             f"{', '.join(str(d) for d in sorted(plan))}")
        return plan[day]
    if hasattr(plan, "busiest_day"):
        return plan[plan.busiest_day()]
    return max(sorted(plan.items()), key=lambda kv: (len(kv[1].standing), -kv[0]))[1]


# --- one plan frame at a scale --------------------------------------------------------------------
def _scale_ft_per_in(window_w: float, window_h: float, width_mm: float, height_mm: float) -> float:
    """The largest standard scale (fewest ft to the inch) at which the window fits."""
    need = max(window_w * 25.4 / width_mm, window_h * 25.4 / height_mm)
    return next((s for s in SCALES_FT_PER_IN if s >= need), need)


class _Frame:
    """A plan window (ft) drawn on the sheet at a scale: plan point -> sheet mm (y down)."""

    def __init__(self, window, top_mm: float, max_h_mm: float, key: str):
        minx, miny, maxx, maxy = window
        self.ft_per_in = _scale_ft_per_in(maxx - minx, maxy - miny, SHEET_MM - 2 * PAD_MM,
                                          max_h_mm)
        self.k = 25.4 / self.ft_per_in  # mm per ft
        # widen the window to the sheet's width (more of the site shows, same scale)
        extra = (SHEET_MM - 2 * PAD_MM) / self.k - (maxx - minx)
        self.window = (minx - extra / 2, miny, maxx + extra / 2, maxy)
        self.left, self.top = PAD_MM, top_mm
        self.width = SHEET_MM - 2 * PAD_MM
        self.height = (maxy - miny) * self.k
        self.key = key

    def xy(self, x: float, y: float) -> tuple[float, float]:
        minx, _, _, maxy = self.window
        return self.left + (x - minx) * self.k, self.top + (maxy - y) * self.k

    def ft(self, mm: float) -> float:
        """A length on paper (mm) in plan ft."""
        return mm / self.k

    @property
    def box(self) -> tuple[float, float, float, float]:
        return self.left, self.top, self.left + self.width, self.top + self.height

    def to_sheet(self, geometry):
        """A shapely geometry in plan ft moved to sheet mm."""
        minx, _, _, maxy = self.window
        k = self.k
        return shapely.transform(geometry, lambda c: np.stack(
            [self.left + (c[:, 0] - minx) * k, self.top + (maxy - c[:, 1]) * k], axis=1))

    def group(self, items: list[str]) -> list[str]:
        """The plan items in a group that scales ft to mm and turns y up, clipped to the frame."""
        minx, _, _, maxy = self.window
        k = self.k
        return [f'<clipPath id="clip-{self.key}"><rect x="{_f(self.left)}" y="{_f(self.top)}" '
                f'width="{_f(self.width)}" height="{_f(self.height)}"/></clipPath>',
                f'<g clip-path="url(#clip-{self.key})"><g class="plan" transform="matrix('
                f'{_f(k)} 0 0 {_f(-k)} {_f(self.left - minx * k)} {_f(self.top + maxy * k)})">',
                *items, "</g></g>",
                f'<rect x="{_f(self.left)}" y="{_f(self.top)}" width="{_f(self.width)}" '
                f'height="{_f(self.height)}" fill="none" stroke="#000" stroke-width="0.3"/>']


# --- the plan's layers, in plan ft inside a frame's group ----------------------------------------
def _defs(fr: _Frame) -> list[str]:
    """Hatch patterns of a frame (1.6 mm apart on paper)."""
    return _hatch_defs(fr.key, fr.ft(1.6), fr.ft(0.25))


def _ground_and_slab(g, fr: _Frame) -> list[str]:
    u = fr.ft(0.25)
    out = [f'<polygon points="{_plan_pts(r)}" fill="{GROUND}" stroke="#b8a77a" '
           f'stroke-width="{_f(u)}"/>' for r in g.ground]
    if g.slab:
        d = " ".join("M " + _plan_pts(r) + " Z" for r in [g.slab, *g.slab_holes])
        out.append(f'<path d="{d}" fill="{SLAB}" fill-rule="evenodd" stroke="{SLAB_EDGE}" '
                   f'stroke-width="{_f(2 * u)}"/>')
    out += [f'<polygon points="{_plan_pts(h)}" fill="url(#hatch-hole-{fr.key})" '
            f'stroke="{SLAB_EDGE}" stroke-width="{_f(2 * u)}"/>' for h in g.slab_holes]
    out += [f'<polyline points="{_plan_pts(j)}" fill="none" stroke="#7f7f7f" '
            f'stroke-width="{_f(1.2 * u)}" stroke-dasharray="{_f(10 * u)},{_f(3 * u)},'
            f'{_f(2 * u)},{_f(3 * u)}"/>' for j in g.joints]
    return out


def _area_fill(a, fr: _Frame, css: str, stroke_mm: float) -> str:
    color, angle, _ = AREA_STYLE[a.kind]
    fill = (f'fill="url(#hatch-{a.kind}-{fr.key})"' if angle is not None
            else f'fill="{color}" fill-opacity="0.15"')
    return (f'<polygon class="{css}" data-name={quoteattr(a.name)} '
            f'points="{_plan_pts(a.coords)}" {fill} stroke="{color}" '
            f'stroke-width="{_f(fr.ft(stroke_mm))}"/>')


def _areas(g, fr: _Frame) -> list[str]:
    """Every area, under the walls and braces."""
    return [_area_fill(a, fr, "area", 0.35) for a in g.areas]


def _keep_out_on_top(g, fr: _Frame) -> list[str]:
    """The areas braces must stay out of, drawn again above the braces and anchors (hatched, so
    what lies under them still shows), with a bold outline that a white edge sets apart."""
    out = []
    for a in g.areas:
        if a.kind in KEEP_OUT:
            out.append(f'<polygon points="{_plan_pts(a.coords)}" fill="none" stroke="#fff" '
                       f'stroke-width="{_f(fr.ft(1.1))}"/>')
            out.append(_area_fill(a, fr, "area keep-out", 0.6))
    return out


def _zones(g, fr: _Frame) -> list[str]:
    u = fr.ft(0.25)
    out = []
    for p in g.panels:
        if p.restricted_zone:
            out.append(f'<polygon points="{_plan_pts(p.restricted_zone)}" fill="{ZONE}" '
                       f'fill-opacity="0.14" stroke="{ZONE}" stroke-width="{_f(1.5 * u)}" '
                       f'stroke-dasharray="{_f(6 * u)},{_f(4 * u)}"/>')
        if p.evacuated_zone:
            out.append(f'<polygon points="{_plan_pts(p.evacuated_zone)}" fill="none" '
                       f'stroke="{EVACUATED}" stroke-width="{_f(1.2 * u)}" '
                       f'stroke-dasharray="{_f(14 * u)},{_f(6 * u)}" '
                       f'stroke-dashoffset="{_f(5 * u)}"/>')
    return out


def _line_geometry(line):
    """Unit vectors along a wall line and toward its braced side, and its middle."""
    (x0, y0), (x1, y1) = line.start, line.end
    length = math.hypot(x1 - x0, y1 - y0) or 1.0
    ux, uy = (x1 - x0) / length, (y1 - y0) / length
    nx, ny = (-uy, ux) if line.braced_side == "left" else (uy, -ux)
    return (ux, uy), (nx, ny), ((x0 + x1) / 2, (y0 + y1) / 2)


def _lines(g, fr: _Frame) -> list[str]:
    """Wall lines, each with a tick toward its braced side."""
    u, tick = fr.ft(0.25), fr.ft(2.5)
    out = []
    for line in g.lines:
        (x0, y0), (x1, y1) = line.start, line.end
        _, (nx, ny), (mx, my) = _line_geometry(line)
        out.append(f'<line x1="{_f(x0)}" y1="{_f(y0)}" x2="{_f(x1)}" y2="{_f(y1)}" '
                   f'stroke="#888" stroke-width="{_f(u)}" stroke-dasharray="{_f(8 * u)},'
                   f'{_f(3 * u)}"/>')
        out.append(f'<line x1="{_f(mx)}" y1="{_f(my)}" x2="{_f(mx + tick * nx)}" '
                   f'y2="{_f(my + tick * ny)}" stroke="#888" stroke-width="{_f(u)}"/>')
    return out


def _walls(g, fr: _Frame) -> list[str]:
    u = fr.ft(0.25)
    out = []
    for p in g.panels:
        if p.standing:
            out.append(f'<polygon class="wall" points="{_plan_pts(p.footprint)}" '
                       f'fill="{WALL}" stroke="#000" stroke-width="{_f(2.4 * u)}"/>')
        else:
            out.append(f'<polygon class="wall ghost" points="{_plan_pts(p.footprint)}" '
                       f'fill="#fff" stroke="{WALL}" stroke-width="{_f(u)}" '
                       f'stroke-dasharray="{_f(3 * u)},{_f(2 * u)}"/>')
    return out


SYMBOLS = ("disc", "crossed circle", "square", "triangle", "diamond", "open")  # anchor_symbol's


def anchor_symbol(kind: str, x: float, y: float, r: float, w: float, up: float = 1.0) -> str:
    """The symbol of a foot anchor of each kind (the shape its entry in anchor_kinds names) at
    (x, y), radius r, line width w, in the units of the drawing it goes in; `up` is +1 where y
    points up on paper (a plan group), -1 where it points down."""
    sx, sy = _f(x), _f(y)
    shape = ANCHOR_KINDS[kind].symbol if kind in ANCHOR_KINDS else "open"  # SYMBOLS
    if shape == "disc":
        return f'<circle class="anchor" cx="{sx}" cy="{sy}" r="{_f(r)}" fill="#000"/>'
    if shape == "crossed circle":
        return (f'<g class="anchor" stroke="#000" stroke-width="{_f(w)}"><circle cx="{sx}" '
                f'cy="{sy}" r="{_f(r)}" fill="#fff"/><line x1="{_f(x - r)}" y1="{sy}" '
                f'x2="{_f(x + r)}" y2="{sy}"/><line x1="{sx}" y1="{_f(y - r)}" x2="{sx}" '
                f'y2="{_f(y + r)}"/></g>')
    if shape == "square":
        return (f'<rect class="anchor" x="{_f(x - r)}" y="{_f(y - r)}" width="{_f(2 * r)}" '
                f'height="{_f(2 * r)}" fill="#000"/>')
    if shape == "triangle":  # an open triangle, point up on paper
        return (f'<polygon class="anchor" points="{_f(x)},{_f(y + up * 1.2 * r)} {_f(x - r)},'
                f'{_f(y - up * 0.8 * r)} {_f(x + r)},{_f(y - up * 0.8 * r)}" fill="#fff" '
                f'stroke="#000" stroke-width="{_f(w)}"/>')
    if shape == "diamond":
        return (f'<polygon class="anchor" points="{_f(x)},{_f(y - r)} {_f(x + r)},{sy} '
                f'{_f(x)},{_f(y + r)} {_f(x - r)},{sy}" fill="#000"/>')
    return (f'<circle class="anchor" cx="{sx}" cy="{sy}" r="{_f(r)}" fill="#fff" stroke="#000" '
            f'stroke-width="{_f(w)}"/>')


def _braces(g, fr: _Frame) -> list[str]:
    u, r = fr.ft(0.25), fr.ft(0.8)
    out = []
    for p in g.panels:
        for (ix, iy), (fx, fy) in p.braces:
            out.append(f'<line class="brace" data-mark={quoteattr(p.mark)} x1="{_f(ix)}" '
                       f'y1="{_f(iy)}" x2="{_f(fx)}" y2="{_f(fy)}" stroke="{BRACE}" '
                       f'stroke-width="{_f(1.8 * u)}"/>')
            out.append(anchor_symbol(p.foot_kind, fx, fy, r, 1.2 * u))
    return out


def _number_findings(findings) -> list[tuple[int, object]]:
    order = {"danger": 0, "warning": 1, "notice": 2}
    ranked = sorted(findings, key=lambda f: order.get(f.flag.severity, 3))
    return list(enumerate(ranked, 1))


def _finding_marks(numbered, fr: _Frame) -> list[str]:
    """An open circled cross (danger) or triangle (warning) at each point of a finding: thin
    lines, so that the item found still shows through them."""
    out = []
    r, u = fr.ft(1.3), fr.ft(0.25)
    for _, f in numbered:
        for x, y in f.at:
            if f.flag.severity == "danger":
                d = 0.7 * r
                out.append(
                    f'<g class="danger" stroke="{DANGER}" stroke-width="{_f(1.6 * u)}" '
                    f'fill="none"><circle cx="{_f(x)}" cy="{_f(y)}" r="{_f(r)}"/>'
                    f'<line x1="{_f(x - d)}" y1="{_f(y - d)}" x2="{_f(x + d)}" '
                    f'y2="{_f(y + d)}"/><line x1="{_f(x - d)}" y1="{_f(y + d)}" '
                    f'x2="{_f(x + d)}" y2="{_f(y - d)}"/></g>')
            elif f.flag.severity == "warning":
                out.append(f'<polygon class="warning" points="{_f(x)},{_f(y + r)} '
                           f'{_f(x - r)},{_f(y - 0.7 * r)} {_f(x + r)},{_f(y - 0.7 * r)}" '
                           f'fill="none" stroke="{WARNING}" stroke-width="{_f(1.6 * u)}"/>')
    return out


def _drawn_items(g, fr: _Frame, numbered) -> list[tuple[object, float]]:
    """What the labels should keep off, in sheet mm, with weights: walls, anchors and finding
    symbols most, braces and the keep-out areas next, lines and other area edges least."""
    items: list[tuple[object, float]] = []
    for p in g.panels:
        if len(p.footprint) >= 3:
            items.append((fr.to_sheet(Polygon(p.footprint)), 6.0 if p.standing else 2.0))
        for a, b in p.braces:
            items.append((fr.to_sheet(LineString([a, b])), 3.0))
            items.append((fr.to_sheet(Point(b)).buffer(1.0), 6.0))
    for _, f in numbered:
        for pt in f.at:
            items.append((fr.to_sheet(Point(pt)).buffer(1.5), 6.0))
    for a in g.areas:
        if len(a.coords) >= 3:
            shape = fr.to_sheet(shapely.make_valid(Polygon(a.coords)))
            items.append((shape.boundary, 0.3))
            if a.kind in KEEP_OUT and shapely.area(shape) < 400.0:  # a strip: keep it clear
                items.append((shape, 4.0))
    for line in g.lines:
        items.append((fr.to_sheet(LineString([line.start, line.end])), 0.5))
    return items


def _north_and_scale(fr: _Frame) -> list[str]:
    """The row under the frame (`SCALE_ROW_MM` tall, sheet mm): a scale bar of 1 in on paper in
    four parts, the scale in words, and a north arrow (plan y up) at the right."""
    length, h = 25.4, 1.2
    x0, y0 = fr.left + 1.0, fr.top + fr.height + 4.6  # the bar's lower edge
    out = []
    for i in range(4):
        fill = "#000" if i % 2 == 0 else "#fff"
        out.append(f'<rect x="{_f(x0 + i * length / 4)}" y="{_f(y0 - h)}" '
                   f'width="{_f(length / 4)}" height="{_f(h)}" fill="{fill}" stroke="#000" '
                   f'stroke-width="0.2"/>')
    out.append(_text(x0, y0 + 0.9 + 0.8 * LEAST_TEXT_MM, "0", LEAST_TEXT_MM, "middle"))
    out.append(_text(x0 + length, y0 + 0.9 + 0.8 * LEAST_TEXT_MM, f"{fr.ft_per_in:g} ft",
                     LEAST_TEXT_MM, "middle"))
    out.append(_text(x0 + length + 6.0, y0, _scale_words(fr), LEAST_TEXT_MM))
    x, y = fr.left + fr.width - 6.0, fr.top + fr.height + 8.0
    out += [f'<polygon points="{_f(x)},{_f(y - 6.5)} {_f(x - 1.8)},{_f(y)} {_f(x)},'
            f'{_f(y - 1.8)} {_f(x + 1.8)},{_f(y)}" fill="#000"/>',
            _text(x + 2.8, y - 1.0, "N", TEXT_MM, weight="bold")]
    return out


def _scale_words(fr: _Frame) -> str:
    return (f"Scale 1 in = {fr.ft_per_in:g} ft printed {SHEET_MM:g} mm wide "
            "(letter or A4 portrait)")


def _frame_window(bounds, margin_ft: float) -> tuple[float, float, float, float]:
    minx, miny, maxx, maxy = bounds
    return minx - margin_ft, miny - margin_ft, maxx + margin_ft, maxy + margin_ft


def _plan_layers(g, fr: _Frame, numbered) -> list[str]:
    """The plan in the frame, bottom to top: ground and slab, areas, zones, wall lines, walls,
    braces and anchors, the keep-out areas again, the finding symbols."""
    return fr.group(_ground_and_slab(g, fr) + _areas(g, fr) + _zones(g, fr) + _lines(g, fr)
                    + _walls(g, fr) + _braces(g, fr) + _keep_out_on_top(g, fr)
                    + _finding_marks(numbered, fr))


def _in_window(pt, window) -> bool:
    return window[0] <= pt[0] <= window[2] and window[1] <= pt[1] <= window[3]


# --- labels of a plan frame -----------------------------------------------------------------------
def _kind_words(a) -> str:
    return AREA_STYLE[a.kind][2]


def _area_words(a) -> str:
    """An area's name, with its kind unless the name already says it (either spelling)."""
    words = _kind_words(a)
    said = a.name.lower().replace("neighbour", "neighbor")
    return a.name if words in said else f"{a.name} ({words})"


def _status_of(result) -> dict[str, str]:
    return {p.mark: p.status for p in getattr(result, "panels", [])}


def _mark_label(p, line, fr: _Frame, status: dict[str, str], own: bool = True) -> Label:
    """A wall's mark (and its status when failing), its point just behind the wall's middle;
    a wall that is not `own` (a neighbor on a detail of other walls) in grey."""
    _, (nx, ny), _ = _line_geometry(line)
    (x0, y0), (x1, y1) = p.face
    back = 1.0 + fr.ft(2.0)  # behind the footprint, away from the braces
    mx, my = (x0 + x1) / 2 - nx * back, (y0 + y1) / 2 - ny * back
    word = STATUS_WORDS.get(status.get(p.mark, ""), "")
    return Label(f"mark:{p.mark}", f"{p.mark} {word}".strip(), MARK_MM, fr.xy(mx, my),
                 color=(DANGER if word else "#000") if own else "#707070")


def _finding_labels(numbered, fr: _Frame) -> list[Label]:
    """One number per finding, at its first point inside the frame."""
    out = []
    for n, f in numbered:
        inside = [pt for pt in f.at if _in_window(pt, fr.window)]
        if inside and f.flag.severity in ("danger", "warning"):
            color = DANGER if f.flag.severity == "danger" else WARNING
            out.append(Label(f"finding:{n}", str(n), LABEL_MM, fr.xy(*inside[0]), color=color))
    return out


def _area_labels(g, fr: _Frame) -> list[Label]:
    """Each area's name, at a point of it inside the frame."""
    out = []
    frame = box(*fr.window)
    for a in g.areas:
        if len(a.coords) < 3:
            continue
        part = shapely.make_valid(Polygon(a.coords)).intersection(frame)
        if part.is_empty or part.area <= 0:
            continue
        pt = part.representative_point()
        out.append(Label(f"area:{a.name}", _area_words(a), LABEL_MM, fr.xy(pt.x, pt.y),
                         color=AREA_STYLE[a.kind][0]))
    return out


def _detail_labels(g, fr: _Frame, details) -> list[Label]:
    """Each detail plan's number, behind the middle of its walls (the overview's key to them)."""
    lines = {line.name: line for line in g.lines}
    panels = {p.mark: p for p in g.panels}
    out = []
    for i, d in enumerate(details, 1):
        _, (nx, ny), _ = _line_geometry(lines[d.line])
        faces = [panels[m].face for m in d.marks]
        mx = sum(a[0] + b[0] for a, b in faces) / (2 * len(faces))
        my = sum(a[1] + b[1] for a, b in faces) / (2 * len(faces))
        back = fr.ft(3.5)
        out.append(Label(f"detail:{i}", f"detail {i}", LABEL_MM,
                         fr.xy(mx - nx * back, my - ny * back)))
    return out


def _details_words(details) -> str:
    """The detail plans in a sentence: number, line and walls."""
    parts = []
    for i, d in enumerate(details, 1):
        walls = d.marks[0] if len(d.marks) == 1 else f"{d.marks[0]} to {d.marks[-1]}"
        parts.append(f"{i}: {d.line}, {walls}")
    return "Detail plans follow, " + "; ".join(parts) + "."


def _labels(g, fr: _Frame, numbered, marks: list[str] | None, status, details=(),
            own=None) -> tuple[list[str], list[str]]:
    """The frame's labels placed clear of each other and of the drawing: wall marks (`marks`;
    None: the detail plans' numbers instead; `own`: the marks drawn in black, None: all),
    finding numbers, then area names: (SVG items, the words of labels that found no room)."""
    lines = {line.name: line for line in g.lines}
    wanted = []
    if marks is None:
        wanted += _detail_labels(g, fr, details)
    else:
        wanted += [_mark_label(p, lines[p.line], fr, status, own is None or p.mark in own)
                   for p in g.panels if p.mark in marks and p.line in lines]
    wanted += _finding_labels(numbered, fr) + _area_labels(g, fr)
    x0, y0, x1, y1 = fr.box
    wanted = [Label(w.key, w.words, w.size, (min(max(w.at[0], x0), x1), min(max(w.at[1], y0), y1)),
                    w.bold, w.color) for w in wanted]  # a point outside: the frame's edge
    placed = place_labels(wanted, _drawn_items(g, fr, numbered),
                          (x0 + 0.5, y0 + 0.5, x1 - 0.5, y1 - 0.5))
    missing = [w.words for w, p in zip(wanted, placed) if p is None]
    return _north_and_scale(fr) + _placed_items(placed), missing


def _unplaced_words(missing: list[str]) -> str:
    """A sentence naming the labels that found no room on the plan (none: empty)."""
    return "" if not missing else (" Not labelled on the plan for want of room: "
                                   + ", ".join(missing) + ".")


# --- sheets -------------------------------------------------------------------------------------
def _lines_block(lines, y: float, x: float = PAD_MM, width: float = SHEET_MM - 2 * PAD_MM,
                 extra: str = "") -> tuple[list[str], float]:
    """(words, size, weight, color) lines, each wrapped to `width`, from `y` down; (items, the
    y below them)."""
    out = []
    for words, size, weight, color in lines:
        for k, part in enumerate(wrap(words, size, width - 1.5 * size, weight == "bold")):
            y += 1.25 * size
            out.append(_text(x + (1.5 * size if k else 0.0), y, part, size, weight=weight,
                             fill=color, extra=extra))
    return out, y


def _caution_box(caution: str, y: float) -> tuple[list[str], float]:
    inner = SHEET_MM - 2 * PAD_MM - 3.0
    lines = wrap(caution, TEXT_MM, inner, bold=True)
    h = len(lines) * 1.25 * TEXT_MM + 1.6
    out = [f'<rect x="{_f(PAD_MM)}" y="{_f(y)}" width="{_f(SHEET_MM - 2 * PAD_MM)}" '
           f'height="{_f(h)}" fill="#fff8e1" stroke="#000" stroke-width="0.35"/>']
    for i, words in enumerate(lines):
        out.append(_text(PAD_MM + 1.5, y + 0.5 + (i + 1) * 1.25 * TEXT_MM - 0.25 * TEXT_MM,
                         words, TEXT_MM, weight="bold", extra=' class="caution"'))
    return out, y + h


def _hatch_defs(key: str, step: float, u: float) -> list[str]:
    out = []
    hatches = {f"hatch-{k}": (c, a) for k, (c, a, _) in AREA_STYLE.items() if a is not None}
    hatches["hatch-hole"] = ("#4d4d4d", 45)
    for name, (color, angle) in hatches.items():
        out.append(f'<pattern id="{name}-{key}" patternUnits="userSpaceOnUse" '
                   f'width="{_f(step)}" height="{_f(step)}" patternTransform="rotate({angle})">'
                   f'<line x1="0" y1="0" x2="0" y2="{_f(step)}" stroke="{color}" '
                   f'stroke-width="{_f(1.6 * u)}"/></pattern>')
    return out


def _legend_items(panels, areas) -> list[tuple[str, str]]:
    """(symbol kind, words) of the legend: what the plan shows."""
    items = [("slab", "slab"), ("hole", "slab hole or opening"), ("joint", "slab joint"),
             ("ground", "open ground")]
    kinds = dict.fromkeys(AREA_STYLE[a.kind][2] for a in areas)
    first_kind = {AREA_STYLE[a.kind][2]: a.kind for a in reversed(areas)}
    items += [(f"area:{first_kind[w]}", w + (" (braces stay out)" if first_kind[w] in KEEP_OUT
                                             else "")) for w in kinds]
    items += [("wall", "wall standing"), ("ghost", "wall not standing"),
              ("line", "wall line (tick: braced side)"), ("brace", "brace")]
    feet = dict.fromkeys(p.foot_kind for p in panels if p.braces)
    items += [(f"anchor:{k}", ANCHOR_KINDS[k].words if k in ANCHOR_KINDS
               else "foot (no anchor named)") for k in feet]
    names = dict.fromkeys(p.zone_name for p in panels if p.standing and p.zone_name)
    items += [("zone", f"{n} (authorized workers only, nothing stored)") for n in names]
    items += [("evacuated", "evacuated zone (nobody: at the stand-down gust, during lifts)"),
              ("danger", "DANGER: failing item, numbered"),
              ("warning", "warning, numbered")]
    return items


def _legend_symbol(kind: str, x: float, y: float, key: str) -> str:
    """A legend symbol 5 mm by 2.5 mm, left edge x, center line y (sheet mm)."""
    w, h, u = 5.0, 2.5, 0.25
    rect = f'x="{_f(x)}" y="{_f(y - h / 2)}" width="{_f(w)}" height="{_f(h)}"'
    line = f'x1="{_f(x)}" y1="{_f(y)}" x2="{_f(x + w)}" y2="{_f(y)}"'
    if kind == "slab":
        return f'<rect {rect} fill="{SLAB}" stroke="{SLAB_EDGE}" stroke-width="{_f(2 * u)}"/>'
    if kind == "hole":
        return (f'<rect {rect} fill="url(#hatch-hole-{key})" stroke="{SLAB_EDGE}" '
                f'stroke-width="{_f(u)}"/>')
    if kind == "joint":
        return (f'<line {line} stroke="#7f7f7f" stroke-width="{_f(1.2 * u)}" '
                f'stroke-dasharray="2.5,0.75,0.5,0.75"/>')
    if kind == "ground":
        return f'<rect {rect} fill="{GROUND}" stroke="#b8a77a" stroke-width="{_f(u)}"/>'
    if kind.startswith("area:"):
        k = kind[5:]
        color, angle, _ = AREA_STYLE[k]
        fill = (f'fill="url(#hatch-{k}-{key})"' if angle is not None
                else f'fill="{color}" fill-opacity="0.15"')
        return f'<rect {rect} {fill} stroke="{color}" stroke-width="{_f(2 * u)}"/>'
    if kind == "wall":
        return f'<rect {rect} fill="{WALL}" stroke="#000" stroke-width="{_f(u)}"/>'
    if kind == "ghost":
        return (f'<rect {rect} fill="#fff" stroke="{WALL}" stroke-width="{_f(u)}" '
                f'stroke-dasharray="0.75,0.5"/>')
    if kind == "line":
        return f'<line {line} stroke="#888" stroke-width="{_f(u)}" stroke-dasharray="2,0.75"/>'
    if kind == "brace":
        return f'<line {line} stroke="{BRACE}" stroke-width="{_f(1.8 * u)}"/>'
    if kind.startswith("anchor:"):
        return anchor_symbol(kind[7:], x + w / 2, y, 0.8, 1.2 * u, up=-1.0)
    if kind == "zone":
        return (f'<rect {rect} fill="{ZONE}" fill-opacity="0.14" stroke="{ZONE}" '
                f'stroke-width="{_f(1.5 * u)}" stroke-dasharray="1.5,1"/>')
    if kind == "evacuated":
        return (f'<rect {rect} fill="none" stroke="{EVACUATED}" stroke-width="{_f(1.2 * u)}" '
                f'stroke-dasharray="3.5,1.5"/>')
    r, cx = 1.1, x + w / 2
    if kind == "danger":
        d = 0.7 * r
        return (f'<g stroke="{DANGER}" stroke-width="0.4" fill="none">'
                f'<circle cx="{_f(cx)}" cy="{_f(y)}" r="{_f(r)}"/>'
                f'<line x1="{_f(cx - d)}" y1="{_f(y - d)}" x2="{_f(cx + d)}" y2="{_f(y + d)}"/>'
                f'<line x1="{_f(cx - d)}" y1="{_f(y + d)}" x2="{_f(cx + d)}" y2="{_f(y - d)}"/>'
                '</g>')
    return (f'<polygon points="{_f(cx)},{_f(y - r)} {_f(cx - r)},{_f(y + 0.7 * r)} '
            f'{_f(cx + r)},{_f(y + 0.7 * r)}" fill="none" stroke="{WARNING}" '
            f'stroke-width="0.4"/>')


def _legend(items, y: float, key: str) -> tuple[list[str], float]:
    """The legend in two columns from `y` down; (items, the y below it)."""
    col_w = (SHEET_MM - 2 * PAD_MM) / 2
    rows = -(-len(items) // 2)
    out = [_text(PAD_MM, y + 1.25 * TEXT_MM, "Legend", TEXT_MM, weight="bold")]
    top = y + 1.25 * TEXT_MM + 0.8
    bottom = top
    for col in range(2):
        yy = top
        for kind, words in items[col * rows:(col + 1) * rows]:
            parts = wrap(words, LEAST_TEXT_MM, col_w - 8.0)
            x = PAD_MM + col * col_w
            out.append(_legend_symbol(kind, x, yy + 0.5 * 1.3 * LEAST_TEXT_MM + 0.2, key))
            for i, part in enumerate(parts):
                out.append(_text(x + 6.5, yy + (i + 1) * 1.3 * LEAST_TEXT_MM - 0.2, part,
                                 LEAST_TEXT_MM))
            yy += len(parts) * 1.3 * LEAST_TEXT_MM + 0.5
        bottom = max(bottom, yy)
    return out, bottom


def _range(values: list[float]) -> str:
    lo, hi = min(values), max(values)
    return f"{lo:.0f} ft" if round(lo) == round(hi) else f"{lo:.0f} to {hi:.0f} ft"


def zone_summary(panels) -> list[str]:
    """The zones of the walls standing in a few sentences: one per zone rule, with how many
    walls it covers and the range of its reach, not a line per wall."""
    groups: dict[tuple[str, str], list] = {}
    for p in panels:
        if p.standing and p.zone_rule:
            groups.setdefault((p.zone_name, p.zone_rule), []).append(p)
    out = []
    for (name, rule), walls in groups.items():
        count = f"{len(walls)} wall" + ("s" if len(walls) != 1 else "")
        reach = f"it reaches {_range([p.zone_front_ft for p in walls])} out from the braced face"
        backs = [p.zone_back_ft for p in walls]
        if max(backs) > 0:
            reach += f" and {_range(backs)} behind the wall"
        out.append(f"{name[0].upper()}{name[1:]} of {count}: {rule}; {reach}, along the "
                   "wall's whole length.")
    if out:
        out.append("The evacuated zone has the same footprint: what changes is who may be "
                   "inside (nobody at the stand-down gust or during lifts).")
    return out


def _finding_lines(numbered, only=None, most: int = MOST_FINDINGS) -> list[
        tuple[str, float, str, str]]:
    """The numbered findings as text lines (`only`: the numbers to list; None: all), the
    first `most` of them (the most severe first) and a count of the others."""
    shown = [(n, f) for n, f in numbered if only is None or n in only]
    if not shown:
        return []
    out = [(f"Findings of the plan ({len(shown)}):", TEXT_MM, "bold", "#000")]
    for n, f in shown[:most]:
        danger = f.flag.severity == "danger"
        color = {"danger": DANGER, "warning": WARNING}.get(f.flag.severity, "#000")
        out.append((f"{n}. {f.flag.severity.upper()} {f.mark} [{f.flag.code}] "
                    f"{f.flag.message}. Source: {f.flag.source}.", LEAST_TEXT_MM,
                    "bold" if danger else "normal", color))
    if len(shown) > most:
        out.append((f"... and {len(shown) - most} more: see the report and the detail plans",
                    LEAST_TEXT_MM, "normal", "#000"))
    return out


def _day_words(g) -> str:
    return f"day {g.day}" if g.day is not None else "all walls placed"


def _overview_sheet(result, g, key: str) -> tuple[list[str], list[str], float]:
    """The overview sheet, on one page (`PAGE_MM` tall at most: the plan frame takes the room
    the texts leave, no more than `OVERVIEW_MAX_H_MM`; when the findings leave too little, the
    fewest are listed and the rest counted): (defs, items, height in mm)."""
    numbered = _number_findings(g.findings)
    details = g.details()
    name = getattr(result, "name", "")
    standing = g.standing
    items, y = _lines_block([
        (f"Site plan, {_day_words(g)}: {name}", TITLE_MM, "bold", "#000"),
        (f"Overview. Standing ({len(standing)}): {', '.join(standing) or 'none'}",
         LEAST_TEXT_MM, "normal", "#000")], PAD_MM)
    caution, y = _caution_box(getattr(result, "caution", ""), y + 1.5)
    items += caution

    def tail(top: float, most: int) -> tuple[list[str], float]:
        words = [_details_words(details)] if details else []
        out, yy = _lines_block([(w, LEAST_TEXT_MM, "normal", "#000") for w in words],
                               top + SCALE_ROW_MM)
        legend, yy = _legend(_legend_items(g.panels, g.areas), yy + 1.0, key + "L")
        more, yy = _lines_block([(s, LEAST_TEXT_MM, "normal", "#000")
                                 for s in zone_summary(g.panels)]
                                + _finding_lines(numbered, most=most), yy + 0.5)
        return out + legend + more, yy + PAD_MM

    most = MOST_FINDINGS
    while most > 0 and PAGE_MM - (y + 1.5) - tail(0.0, most)[1] < LEAST_PLAN_MM:
        most -= 1
    room = max(PAGE_MM - (y + 1.5) - tail(0.0, most)[1], LEAST_PLAN_MM)
    fr = _Frame(_frame_window(g.bounds, 0.04 * max(g.bounds[2] - g.bounds[0],
                                                   g.bounds[3] - g.bounds[1], 10.0)),
                y + 1.5, min(OVERVIEW_MAX_H_MM, room), key)
    widths = [p.width_ft for p in g.panels if p.standing]
    one_by_one = bool(widths) and min(widths) * fr.k >= 1.3 * max(
        text_width(m, MARK_MM, True) for m in standing)
    labels, placed = _labels(g, fr, numbered, standing if one_by_one else None,
                             _status_of(result), details)
    items += _plan_layers(g, fr, numbered) + labels
    more, y = tail(fr.top + fr.height, most)
    unplaced = _unplaced_words(placed).strip()
    if unplaced:
        text, y = _lines_block([(unplaced, LEAST_TEXT_MM, "normal", "#000")], y - PAD_MM)
        more += text
        y += PAD_MM
    return _defs(fr) + _hatch_defs(key + "L", 1.2, 0.25), items + more, y


def _detail_sheet(result, g, d, i: int, n: int, key: str, standalone: bool) -> tuple[
        list[str], list[str], float]:
    """One detail plan sheet: (defs, items, height in mm)."""
    numbered = _number_findings(g.findings)
    stretch = f", part {d.part} of {d.parts}" if d.parts > 1 else ""
    walls = d.marks[0] if len(d.marks) == 1 else f"{d.marks[0]} to {d.marks[-1]}"
    items, y = _lines_block([
        (f"Detail {i} of {n}, {_day_words(g)}: {d.line}{stretch}, walls {walls}", TITLE_MM,
         "bold", "#000")], PAD_MM)
    fr = _Frame(_frame_window(d.bounds, 6.0), y + 1.5, DETAIL_MAX_H_MM, key)
    labels, placed = _labels(g, fr, numbered, _marks_in(g, fr), _status_of(result),
                             own=set(d.marks))
    items += _plan_layers(g, fr, numbered) + labels
    y = fr.top + fr.height
    inside = {m for m, f in numbered if any(_in_window(pt, fr.window) for pt in f.at)
              or (f.mark in d.marks and not f.at)}
    shown = [p for p in g.panels if p.mark in d.marks]
    areas = [a for a in g.areas if shapely.intersects(
        shapely.make_valid(Polygon(a.coords)), box(*fr.window))] if g.areas else []
    more, y = _lines_block([(f"Walls on this detail: {', '.join(d.marks)}."
                             + _unplaced_words(placed), LEAST_TEXT_MM, "normal", "#000")],
                           y + SCALE_ROW_MM)
    items += more
    legend, y = _legend(_legend_items(shown, areas), y + 1.0, key + "L")
    items += legend
    more, y = _lines_block([(s, LEAST_TEXT_MM, "normal", "#000") for s in zone_summary(shown)]
                           + _finding_lines(numbered, inside), y + 0.5)
    items += more
    if standalone:
        caution, y = _caution_box(getattr(result, "caution", ""), y + 1.5)
        items += caution
    return _defs(fr) + _hatch_defs(key + "L", 1.2, 0.25), items, y + PAD_MM


def _marks_in(g, fr: _Frame) -> list[str]:
    """The walls standing whose face's middle lies inside the frame."""
    out = []
    for p in g.panels:
        (x0, y0), (x1, y1) = p.face
        if p.standing and _in_window(((x0 + x1) / 2, (y0 + y1) / 2), fr.window):
            out.append(p.mark)
    return out


def _mm_document(defs: list[str], items: list[str], height: float, caution: str) -> str:
    """An SVG sheet `SHEET_MM` wide laid out in mm (its viewBox), the caution in its desc."""
    return "\n".join([
        '<?xml version="1.0" encoding="UTF-8"?>',
        f'<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="{_f(SHEET_MM)}mm" '
        f'height="{_f(height)}mm" viewBox="0 0 {_f(SHEET_MM)} {_f(height)}" '
        f'font-family={quoteattr(FONT)}>',
        f"<desc>{escape(caution)}</desc>",
        "<defs>", *defs, "</defs>",
        f'<rect x="0" y="0" width="{_f(SHEET_MM)}" height="{_f(height)}" fill="#fff"/>',
        *items, "</svg>", ""])


def _key(g, what: str) -> str:
    """Ids of one drawing's clip paths and patterns: the same for the same day and drawing, so
    that drawings inlined in one HTML page never take another's."""
    return f"{what}{g.day if g.day is not None else 'all'}"


def overview_svg(result, day: int | None = None) -> str:
    """The whole site on one letter-width sheet (`SHEET_MM` wide, mm units): title, the
    caution, the plan at a standard scale with each wall line named (or each wall where there is
    room), the legend, the zones summarized by rule and the numbered findings. `day`: the day
    (None: the busiest). A sheet saying so when the result has no plan."""
    g = pick_plan(getattr(result, "plan", None), day)
    if g is None:
        return _no_plan_svg(result)
    defs, items, h = _overview_sheet(result, g, _key(g, "ov"))
    return _mm_document(defs, items, h, getattr(result, "caution", ""))


def detail_svgs(result, day: int | None = None, standalone: bool = False) -> list[tuple]:
    """The detail plans of a day, one per wall line standing (a long line in stretches of at most
    `plan.DETAIL_LONGEST_FT`), each `SHEET_MM` wide in mm, at a standard scale at which marks,
    braces, anchors and zones stand apart: a list of (`bracing.plan.Detail`, SVG text). Each
    names its walls, lists the findings inside it and, with `standalone`, carries the caution
    (a crew sheet that shows the caution on the page need not repeat it)."""
    g = pick_plan(getattr(result, "plan", None), day)
    if g is None:
        return []
    details = g.details()
    out = []
    for i, d in enumerate(details, 1):
        defs, items, h = _detail_sheet(result, g, d, i, len(details), _key(g, f"dt{i}-"),
                                       standalone)
        out.append((d, _mm_document(defs, items, h, getattr(result, "caution", ""))))
    return out


def plan_svg(result, day: int | None = None) -> str:
    """The plan of a day as one printable SVG (what `bracing plan` writes): the overview sheet
    with the caution, then each detail plan below it. `day`: None for the busiest day."""
    g = pick_plan(getattr(result, "plan", None), day)
    if g is None:
        return _no_plan_svg(result)
    defs, items, y = _overview_sheet(result, g, _key(g, "ov"))
    details = g.details()
    for i, d in enumerate(details, 1):
        more_defs, more, h = _detail_sheet(result, g, d, i, len(details), _key(g, f"dt{i}-"),
                                           False)
        defs += more_defs
        items += [f'<line x1="0" y1="{_f(y + 2)}" x2="{_f(SHEET_MM)}" y2="{_f(y + 2)}" '
                  'stroke="#000" stroke-width="0.3" stroke-dasharray="2,1"/>',
                  f'<g transform="translate(0 {_f(y + 4)})">', *more, "</g>"]
        y += 4 + h
    return _mm_document(defs, items, y, getattr(result, "caution", ""))


def _no_plan_svg(result) -> str:
    """A sheet saying there is no plan to draw, with the caution."""
    items, y = _lines_block([(f"Site plan: {getattr(result, 'name', '')}", TITLE_MM, "bold",
                              "#000"),
                             ("No plan to draw: no wall is placed on a wall line.", TEXT_MM,
                              "normal", "#000")], PAD_MM)
    caution, y = _caution_box(getattr(result, "caution", ""), y + 1.5)
    return _mm_document([], items + caution, y + PAD_MM, getattr(result, "caution", ""))


def _document(x, y, w, h, defs: list[str], items: list[str], caution: str,
              px_width: int = PX_WIDTH) -> str:
    px_h = px_width * h / w
    return "\n".join([
        '<?xml version="1.0" encoding="UTF-8"?>',
        f'<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="{px_width}" '
        f'height="{px_h:.0f}" viewBox="{_f(x)} {_f(y)} {_f(w)} {_f(h)}" '
        f'font-family={quoteattr(FONT)}>',
        f"<desc>{escape(caution)}</desc>",
        "<defs>", *defs, "</defs>",
        f'<rect x="{_f(x)}" y="{_f(y)}" width="{_f(w)}" height="{_f(h)}" fill="#fff"/>',
        *items, "</svg>", ""])


# --- a wall in elevation --------------------------------------------------------------------------
def elevation_svgs(result, day: int | None = None, standalone: bool = False) -> dict[str, str]:
    """The elevation (`elevation_svg`) of every braced wall standing on a day, by mark: in the
    plan's order, from the day's plan (None: the busiest day's); a wall on no wall line, or a
    site without a plan, from its result alone (measured from the panel's first edge)."""
    g = pick_plan(getattr(result, "plan", None), day)
    placed = {p.mark: p for p in g.panels} if g is not None else {}
    if g is not None:
        standing = g.standing
    else:
        days = [d for d in getattr(result, "days", []) if day is None or d.day == day]
        standing = [m for d in days for m in d.standing] if days else [
            p.mark for p in getattr(result, "panels", [])]
    by_mark = {p.mark: p for p in getattr(result, "panels", [])}
    out = {}
    for mark in dict.fromkeys(standing):
        p = by_mark.get(mark)
        if p is not None and p.braces:
            e = placed[mark].elevation if mark in placed else None
            out[mark] = elevation_svg(p, e, standalone)
    return out


def _elevation_of_result(panel_result):
    """The elevation of a wall that is on no wall line, from its result: the braces measured
    from the panel's first edge as the site file gives them."""
    b = panel_result.braces or {}
    return Elevation(width_ft=panel_result.width_ft, height_ft=panel_result.height_ft,
                     left_edge="first edge", right_edge="last edge", openings=[],
                     braces_from_left_ft=list(b.get("positions_ft") or []),
                     insert_height_ft=b.get("insert_height_ft"), first_edge_left=True)


def elevation_svg(panel_result, elevation=None, standalone: bool = False) -> str:
    """One wall seen square to its braced face (`ELEVATION_MM` wide, mm units): its outline, its
    openings, each brace's insert point with its distance from the named left edge (looking at
    the braced face; by the compass of the plan) and the insert height above the base.

    `elevation` is the wall's `bracing.plan.Elevation` (`PlanPanel.elevation` of the day's plan);
    None draws from the result alone, measuring from the panel's first edge. With `standalone`
    the caution is printed under it."""
    p = panel_result
    e = elevation if elevation is not None else _elevation_of_result(p)
    w, h, hb = e.width_ft, e.height_ft, e.insert_height_ft
    xs = sorted(e.braces_from_left_ft)
    dims_mm = 5.0 + 4.2 * (len(xs) + 1)  # rows of running dimensions under the wall
    left_mm, right_mm = 4.0, 18.0
    k = min((ELEVATION_MM - left_mm - right_mm) / w, 60.0 / h)  # mm per ft
    title, y = _lines_block([(f"{p.mark}: elevation, looking at the braced face", TEXT_MM,
                              "bold", "#000")], 1.5, 1.5, ELEVATION_MM - 3.0)
    x0 = left_mm + (ELEVATION_MM - left_mm - right_mm - w * k) / 2
    stacked = (text_width(e.left_edge, LEAST_TEXT_MM, True)
               + text_width(e.right_edge, LEAST_TEXT_MM, True) + 2.0 > w * k)
    top = y + 4.0 + (1.3 * LEAST_TEXT_MM if stacked else 0.0)

    def at(x: float, z: float) -> tuple[float, float]:
        return x0 + x * k, top + (h - z) * k

    base = top + h * k
    items = list(title)
    items.append(f'<line x1="1" y1="{_f(base)}" x2="{_f(ELEVATION_MM - 1)}" y2="{_f(base)}" '
                 'stroke="#000" stroke-width="0.4"/>')
    items.append(f'<rect class="wall" x="{_f(x0)}" y="{_f(top)}" width="{_f(w * k)}" '
                 f'height="{_f(h * k)}" fill="#d9d9d9" stroke="#000" stroke-width="0.35"/>')
    for ox, oy, ow, oh in e.openings:
        x1, y1 = at(ox, oy + oh)
        items.append(f'<rect class="opening" x="{_f(x1)}" y="{_f(y1)}" width="{_f(ow * k)}" '
                     f'height="{_f(oh * k)}" fill="#fff" stroke="#000" stroke-width="0.25"/>')
        items.append(f'<path d="M {_f(x1)},{_f(y1)} l {_f(ow * k)},{_f(oh * k)} m 0,'
                     f'{_f(-oh * k)} l {_f(-ow * k)},{_f(oh * k)}" stroke="#888" '
                     'stroke-width="0.2"/>')
    items.append(_text(x0, top - 1.0 - (1.3 * LEAST_TEXT_MM if stacked else 0.0), e.left_edge,
                       LEAST_TEXT_MM, weight="bold", extra=' class="edge"'))
    items.append(_text(x0 + w * k, top - 1.0, e.right_edge, LEAST_TEXT_MM, "end", "bold",
                       extra=' class="edge"'))
    # overall height at the right
    xr = x0 + w * k + 3.0
    items += _dim_v_mm(xr + 8.0, base, top, f"{h:g} ft", "wall")
    if hb is None or not xs:
        items.append(_text(x0 + w * k / 2, top + h * k / 2, "no braces", TEXT_MM, "middle",
                           "bold"))
        y = base + 2.0
    else:
        zx, zy = at(0, hb)
        for x in xs:
            ix, iy = at(x, hb)
            items.append(f'<circle class="insert" cx="{_f(ix)}" cy="{_f(iy)}" r="0.9" '
                         f'fill="{BRACE}" stroke="#fff" stroke-width="0.2"/>')
            items.append(f'<line x1="{_f(ix)}" y1="{_f(iy)}" x2="{_f(ix)}" y2="{_f(base + 1)}" '
                         'stroke="#000" stroke-width="0.15" stroke-dasharray="0.8,0.6"/>')
        items.append(f'<line x1="{_f(zx)}" y1="{_f(zy)}" x2="{_f(x0 + w * k)}" y2="{_f(zy)}" '
                     f'stroke="{BRACE}" stroke-width="0.15" stroke-dasharray="1,0.8"/>')
        items += _dim_v_mm(xr, base, zy, f"insert {hb:g} ft", "insert")
        # running dimensions from the left edge, one row per brace
        for row, x in enumerate(xs):
            yy = base + 4.0 + row * 4.2
            items += _dim_h_mm(x0, x0 + x * k, yy, f"{x:.2f} ft", f"brace {row + 1}")
        y = base + dims_mm
    items += _dim_h_mm(x0, x0 + w * k, y - 4.2 if xs and hb is not None else base + 4.0,
                       f"wall {w:g} ft", "wall width")
    y = max(y, base + 6.0)
    note = (f"Insert points (dots) measured from the {e.left_edge} (left, looking at the "
            f"braced face), {hb:g} ft above the base." if hb is not None and xs
            else f"Left edge: {e.left_edge}, looking at the braced face.")
    if elevation is None:
        note += (" The wall stands on no wall line: its first edge is the one the site file "
                 "measures brace positions from.")
    more, y = _lines_block([(note, LEAST_TEXT_MM, "normal", "#000")], y, 1.5,
                           ELEVATION_MM - 3.0)
    items += more
    if standalone:
        more, y = _lines_block([(CAUTION, LEAST_TEXT_MM, "bold", "#000")], y + 1.0, 1.5,
                               ELEVATION_MM - 3.0)
        items += more
    height = y + 2.0
    return "\n".join([
        '<?xml version="1.0" encoding="UTF-8"?>',
        f'<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="{_f(ELEVATION_MM)}mm" '
        f'height="{_f(height)}mm" viewBox="0 0 {_f(ELEVATION_MM)} {_f(height)}" '
        f'font-family={quoteattr(FONT)}>',
        f"<desc>{escape(CAUTION)}</desc>",
        f'<rect x="0" y="0" width="{_f(ELEVATION_MM)}" height="{_f(height)}" fill="#fff"/>',
        *items, "</svg>", ""])


def _dim_h_mm(x0: float, x1: float, y: float, words: str, key: str) -> list[str]:
    """A horizontal dimension (sheet mm) from x0 to x1 at y, its words beside its end."""
    t = 0.8
    return [f'<g class="dimension" data-key={quoteattr(key)} stroke="#000" stroke-width="0.2">'
            f'<line x1="{_f(x0)}" y1="{_f(y)}" x2="{_f(x1)}" y2="{_f(y)}"/>'
            f'<line x1="{_f(x0)}" y1="{_f(y - t)}" x2="{_f(x0)}" y2="{_f(y + t)}"/>'
            f'<line x1="{_f(x1)}" y1="{_f(y - t)}" x2="{_f(x1)}" y2="{_f(y + t)}"/></g>',
            _text(x1 + 1.0, y + 0.35 * LEAST_TEXT_MM, words, LEAST_TEXT_MM,
                  extra=' class="dim-text"')]


def _dim_v_mm(x: float, y0: float, y1: float, words: str, key: str) -> list[str]:
    """A vertical dimension (sheet mm) at x from y0 up to y1, its words turned along it."""
    t, mid = 0.8, (y0 + y1) / 2
    return [f'<g class="dimension" data-key={quoteattr(key)} stroke="#000" stroke-width="0.2">'
            f'<line x1="{_f(x)}" y1="{_f(y0)}" x2="{_f(x)}" y2="{_f(y1)}"/>'
            f'<line x1="{_f(x - t)}" y1="{_f(y0)}" x2="{_f(x + t)}" y2="{_f(y0)}"/>'
            f'<line x1="{_f(x - t)}" y1="{_f(y1)}" x2="{_f(x + t)}" y2="{_f(y1)}"/></g>',
            _text(x - 0.8, mid, words, LEAST_TEXT_MM, "middle",
                  extra=f' class="dim-text" transform="rotate(-90 {_f(x - 0.8)} {_f(mid)})"')]


# --- a wall's bracing section ---------------------------------------------------------------------
def section_svg(panel_result) -> str:
    """A small section of one wall's bracing, drawn to scale from the result's values: wall
    height and thickness, insert height, the brace, its foot distance, angle and length."""
    p = panel_result
    b = p.braces or {}
    height, t = p.height_ft, p.thickness_in / 12.0
    hb, d = b.get("insert_height_ft"), b.get("anchor_distance_ft")
    braced = hb is not None and d is not None
    span = max(height, d if braced else 0.0, 1.0)
    fs, u = span / 22.0, span / 400.0
    left, right = -t - 0.5 * span, (d if braced else 0.0) + 0.3 * span
    top, bottom = -(height + 0.25 * span), 0.3 * span  # screen y
    items = [_text(left + 0.3 * fs, top + 1.3 * fs, f"{p.mark}: bracing section", 1.2 * fs,
                   weight="bold"),
             # ground line with ticks below it
             f'<line x1="{_f(left + fs)}" y1="0" x2="{_f(right - fs)}" y2="0" stroke="#000" '
             f'stroke-width="{_f(1.5 * u)}"/>']
    x = left + fs
    while x < right - fs:
        items.append(f'<line x1="{_f(x)}" y1="0" x2="{_f(x - 0.4 * fs)}" y2="{_f(0.4 * fs)}" '
                     f'stroke="#000" stroke-width="{_f(u)}"/>')
        x += 0.8 * fs
    items.append(f'<rect x="{_f(-t)}" y="{_f(-height)}" width="{_f(t)}" height="{_f(height)}" '
                 f'fill="{WALL}" stroke="#000" stroke-width="{_f(u)}"/>')
    items += _dimension_v(-t - 0.35 * span, 0.0, height, f"{height:g} ft", fs, u)
    items.append(_text(-t / 2, -height - 0.4 * fs, f"{p.thickness_in:g} in", 0.8 * fs,
                       "middle"))
    if not braced:
        items.append(_text(0.5 * fs, -height / 2, "no braces", fs))
    else:
        theta = b.get("angle_deg")
        length = b.get("length_ft")
        items += _dimension_v(-t - 0.15 * span, 0.0, hb, f"insert {hb:g} ft", fs, u)
        items.append(f'<line x1="0" y1="{_f(-hb)}" x2="{_f(d)}" y2="0" stroke="{BRACE}" '
                     f'stroke-width="{_f(3 * u)}"/>')
        items.append(f'<circle cx="0" cy="{_f(-hb)}" r="{_f(0.3 * fs)}" fill="#fff" '
                     f'stroke="#000" stroke-width="{_f(u)}"/>')
        items.append(f'<rect x="{_f(d - 0.4 * fs)}" y="{_f(-0.25 * fs)}" width="{_f(0.8 * fs)}" '
                     f'height="{_f(0.25 * fs)}" fill="#000"/>')  # the foot plate
        items += _dimension_h(0.0, d, 0.18 * span, f"{d:.2f} ft to the foot", fs, u)
        if theta is not None:
            r = 0.18 * span
            a = math.radians(theta)
            items.append(f'<path d="M {_f(d - r)},0 A {_f(r)},{_f(r)} 0 0 1 '
                         f'{_f(d - r * math.cos(a))},{_f(-r * math.sin(a))}" fill="none" '
                         f'stroke="#000" stroke-width="{_f(u)}"/>')
            items.append(_text(d - 1.15 * r, -0.25 * r - 0.2 * fs, f"{theta:.1f}°", 0.9 * fs,
                               "end"))
        if length is not None:
            items.append(_text(d / 2 + 0.6 * fs, -hb / 2, f"brace {length:.2f} ft", 0.9 * fs,
                               weight="bold", fill=BRACE))
        count = b.get("count")
        if count:
            items.append(_text(left + 0.3 * fs, top + 2.7 * fs, f"{count} braces", 0.9 * fs))
    return _document(left, top, right - left, bottom - top, [], items, "", SECTION_PX_WIDTH)


def _dimension_v(x: float, y0: float, y1: float, words: str, fs: float, u: float) -> list[str]:
    """A vertical dimension at x from height y0 to y1 (ft), its text turned along it."""
    tick = 0.3 * fs
    mid = -(y0 + y1) / 2
    return [f'<g stroke="#000" stroke-width="{_f(u)}">'
            f'<line x1="{_f(x)}" y1="{_f(-y0)}" x2="{_f(x)}" y2="{_f(-y1)}"/>'
            f'<line x1="{_f(x - tick)}" y1="{_f(-y0)}" x2="{_f(x + tick)}" y2="{_f(-y0)}"/>'
            f'<line x1="{_f(x - tick)}" y1="{_f(-y1)}" x2="{_f(x + tick)}" y2="{_f(-y1)}"/></g>',
            _text(x - 0.35 * fs, mid, words, 0.8 * fs, "middle",
                  extra=f' transform="rotate(-90 {_f(x - 0.35 * fs)} {_f(mid)})"')]


def _dimension_h(x0: float, x1: float, y: float, words: str, fs: float, u: float) -> list[str]:
    """A horizontal dimension at screen y from x0 to x1 (ft), text below it."""
    tick = 0.3 * fs
    return [f'<g stroke="#000" stroke-width="{_f(u)}">'
            f'<line x1="{_f(x0)}" y1="{_f(y)}" x2="{_f(x1)}" y2="{_f(y)}"/>'
            f'<line x1="{_f(x0)}" y1="{_f(y - tick)}" x2="{_f(x0)}" y2="{_f(y + tick)}"/>'
            f'<line x1="{_f(x1)}" y1="{_f(y - tick)}" x2="{_f(x1)}" y2="{_f(y + tick)}"/></g>',
            _text((x0 + x1) / 2, y + 1.1 * fs, words, 0.8 * fs, "middle")]
