"""A plan frame: a window of the plan (ft) drawn on the sheet at a standard scale (`Frame`), and
the plan's layers inside it, bottom to top, with the scale bar and north arrow under it."""

from __future__ import annotations

import math
from collections.abc import Mapping
from xml.sax.saxutils import quoteattr

import numpy as np
import shapely
from shapely.geometry import LineString, Point, Polygon

from bracing.plan import braced_normal
from bracing.report.svg.foundation import foundation_drawn, foundation_items
from bracing.report.svg.style import (
    AREA_STYLE,
    BRACE,
    DANGER,
    EVACUATED,
    GROUND,
    KEEP_OUT,
    LEAST_TEXT_MM,
    PAD_MM,
    SCALES_FT_PER_IN,
    SHEET_MM,
    SLAB,
    SLAB_EDGE,
    TEXT_MM,
    WALL,
    WARNING,
    ZONE,
    anchor_symbol,
    hatch_defs,
    num,
    plan_points,
    text,
)


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


class Frame:
    """A plan window (ft) drawn on the sheet at a scale: plan point -> sheet mm (y down)."""

    def __init__(self, window, top_mm: float, max_h_mm: float, key: str, units: str = "us"):
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
        self.units = units  # the scale's words: 'us' (1 in = N ft) or 'si' (1:N)

    def xy(self, x: float, y: float) -> tuple[float, float]:
        """A plan point (ft) on the sheet (mm, y down)."""
        minx, _, _, maxy = self.window
        return self.left + (x - minx) * self.k, self.top + (maxy - y) * self.k

    def ft(self, mm: float) -> float:
        """A length on paper (mm) in plan ft."""
        return mm / self.k

    @property
    def box(self) -> tuple[float, float, float, float]:
        """The frame on the sheet (least x, least y, greatest x, greatest y; mm)."""
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
        return [f'<clipPath id="clip-{self.key}"><rect x="{num(self.left)}" y="{num(self.top)}" '
                f'width="{num(self.width)}" height="{num(self.height)}"/></clipPath>',
                f'<g clip-path="url(#clip-{self.key})"><g class="plan" transform="matrix('
                f'{num(k)} 0 0 {num(-k)} {num(self.left - minx * k)} {num(self.top + maxy * k)})">',
                *items, "</g></g>",
                f'<rect x="{num(self.left)}" y="{num(self.top)}" width="{num(self.width)}" '
                f'height="{num(self.height)}" fill="none" stroke="#000" stroke-width="0.3"/>']


# --- the plan's layers, in plan ft inside a frame's group ----------------------------------------
def frame_defs(fr: Frame) -> list[str]:
    """Hatch patterns of a frame (1.6 mm apart on paper)."""
    return hatch_defs(fr.key, fr.ft(1.6), fr.ft(0.25))


def _ground_and_slab(g, fr: Frame) -> list[str]:
    """The open ground, the slab with its holes hatched, and the slab joints."""
    u = fr.ft(0.25)
    out = [f'<polygon points="{plan_points(r)}" fill="{GROUND}" stroke="#b8a77a" '
           f'stroke-width="{num(u)}"/>' for r in g.ground]
    if g.slab:
        d = " ".join("M " + plan_points(r) + " Z" for r in [g.slab, *g.slab_holes])
        out.append(f'<path d="{d}" fill="{SLAB}" fill-rule="evenodd" stroke="{SLAB_EDGE}" '
                   f'stroke-width="{num(2 * u)}"/>')
    out += [f'<polygon points="{plan_points(h)}" fill="url(#hatch-hole-{fr.key})" '
            f'stroke="{SLAB_EDGE}" stroke-width="{num(2 * u)}"/>' for h in g.slab_holes]
    out += [f'<polyline points="{plan_points(j)}" fill="none" stroke="#7f7f7f" '
            f'stroke-width="{num(1.2 * u)}" stroke-dasharray="{num(10 * u)},{num(3 * u)},'
            f'{num(2 * u)},{num(3 * u)}"/>' for j in g.joints]
    return out


def _area_fill(a, fr: Frame, css: str, stroke_mm: float) -> str:
    """An area's outline, hatched or tinted in its kind's color (`AREA_STYLE`)."""
    color, angle, _ = AREA_STYLE[a.kind]
    fill = (f'fill="url(#hatch-{a.kind}-{fr.key})"' if angle is not None
            else f'fill="{color}" fill-opacity="0.15"')
    return (f'<polygon class="{css}" data-name={quoteattr(a.name)} '
            f'points="{plan_points(a.coords)}" {fill} stroke="{color}" '
            f'stroke-width="{num(fr.ft(stroke_mm))}"/>')


def _areas(g, fr: Frame) -> list[str]:
    """Every area, under the walls and braces."""
    return [_area_fill(a, fr, "area", 0.35) for a in g.areas]


def _keep_out_on_top(g, fr: Frame) -> list[str]:
    """The areas braces must stay out of, drawn again above the braces and anchors (hatched, so
    what lies under them still shows), with a bold outline that a white edge sets apart."""
    out = []
    for a in g.areas:
        if a.kind in KEEP_OUT:
            out.append(f'<polygon points="{plan_points(a.coords)}" fill="none" stroke="#fff" '
                       f'stroke-width="{num(fr.ft(1.1))}"/>')
            out.append(_area_fill(a, fr, "area keep-out", 0.6))
    return out


def _zones(g, fr: Frame) -> list[str]:
    """Each standing wall's restricted zone (tinted, dashed) and evacuated zone (dashed red)."""
    u = fr.ft(0.25)
    out = []
    for p in g.panels:
        if p.restricted_zone:
            out.append(f'<polygon points="{plan_points(p.restricted_zone)}" fill="{ZONE}" '
                       f'fill-opacity="0.14" stroke="{ZONE}" stroke-width="{num(1.5 * u)}" '
                       f'stroke-dasharray="{num(6 * u)},{num(4 * u)}"/>')
        if p.evacuated_zone:
            out.append(f'<polygon points="{plan_points(p.evacuated_zone)}" fill="none" '
                       f'stroke="{EVACUATED}" stroke-width="{num(1.2 * u)}" '
                       f'stroke-dasharray="{num(14 * u)},{num(6 * u)}" '
                       f'stroke-dashoffset="{num(5 * u)}"/>')
    return out


def line_geometry(line):
    """Unit vectors along a wall line and toward its braced side, and its middle."""
    (x0, y0), (x1, y1) = line.start, line.end
    length = math.hypot(x1 - x0, y1 - y0) or 1.0
    ux, uy = (x1 - x0) / length, (y1 - y0) / length
    nx, ny = braced_normal((ux, uy), 1.0 if line.braced_side == "left" else -1.0).tolist()
    return (ux, uy), (nx, ny), ((x0 + x1) / 2, (y0 + y1) / 2)


def _lines(g, fr: Frame) -> list[str]:
    """Wall lines, each with a tick toward its braced side."""
    u, tick = fr.ft(0.25), fr.ft(2.5)
    out = []
    for line in g.lines:
        (x0, y0), (x1, y1) = line.start, line.end
        _, (nx, ny), (mx, my) = line_geometry(line)
        out.append(f'<line x1="{num(x0)}" y1="{num(y0)}" x2="{num(x1)}" y2="{num(y1)}" '
                   f'stroke="#888" stroke-width="{num(u)}" stroke-dasharray="{num(8 * u)},'
                   f'{num(3 * u)}"/>')
        out.append(f'<line x1="{num(mx)}" y1="{num(my)}" x2="{num(mx + tick * nx)}" '
                   f'y2="{num(my + tick * ny)}" stroke="#888" stroke-width="{num(u)}"/>')
    return out


def _walls(g, fr: Frame) -> list[str]:
    """Each wall's footprint: filled when standing, dashed outline when not."""
    u = fr.ft(0.25)
    out = []
    for p in g.panels:
        if p.standing:
            out.append(f'<polygon class="wall" points="{plan_points(p.footprint)}" '
                       f'fill="{WALL}" stroke="#000" stroke-width="{num(2.4 * u)}"/>')
        else:
            out.append(f'<polygon class="wall ghost" points="{plan_points(p.footprint)}" '
                       f'fill="#fff" stroke="{WALL}" stroke-width="{num(u)}" '
                       f'stroke-dasharray="{num(3 * u)},{num(2 * u)}"/>')
    return out


def _braces(g, fr: Frame) -> list[str]:
    """Each brace, insert to foot, with its foot anchor's symbol."""
    u, r = fr.ft(0.25), fr.ft(0.8)
    out = []
    for p in g.panels:
        for (ix, iy), (fx, fy) in p.braces:
            out.append(f'<line class="brace" data-mark={quoteattr(p.mark)} x1="{num(ix)}" '
                       f'y1="{num(iy)}" x2="{num(fx)}" y2="{num(fy)}" stroke="{BRACE}" '
                       f'stroke-width="{num(1.8 * u)}"/>')
            out.append(anchor_symbol(p.foot_kind, fx, fy, r, 1.2 * u))
    return out


def number_findings(findings) -> list[tuple[int, object]]:
    """The findings numbered 1, 2, ... dangers first, then warnings, then notices."""
    order = {"danger": 0, "warning": 1, "notice": 2}
    ranked = sorted(findings, key=lambda f: order.get(f.flag.severity, 3))
    return list(enumerate(ranked, 1))


def _finding_marks(numbered, fr: Frame) -> list[str]:
    """An open circled cross (danger) or triangle (warning) at each point of a finding: thin
    lines, so that the item found still shows through them."""
    out = []
    r, u = fr.ft(1.3), fr.ft(0.25)
    for _, f in numbered:
        for x, y in f.at:
            if f.flag.severity == "danger":
                d = 0.7 * r
                out.append(
                    f'<g class="danger" stroke="{DANGER}" stroke-width="{num(1.6 * u)}" '
                    f'fill="none"><circle cx="{num(x)}" cy="{num(y)}" r="{num(r)}"/>'
                    f'<line x1="{num(x - d)}" y1="{num(y - d)}" x2="{num(x + d)}" '
                    f'y2="{num(y + d)}"/><line x1="{num(x - d)}" y1="{num(y + d)}" '
                    f'x2="{num(x + d)}" y2="{num(y - d)}"/></g>')
            elif f.flag.severity == "warning":
                out.append(f'<polygon class="warning" points="{num(x)},{num(y + r)} '
                           f'{num(x - r)},{num(y - 0.7 * r)} {num(x + r)},{num(y - 0.7 * r)}" '
                           f'fill="none" stroke="{WARNING}" stroke-width="{num(1.6 * u)}"/>')
    return out


def drawn_items(g, fr: Frame, numbered) -> list[tuple[object, float]]:
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
    return items + foundation_drawn(g, fr)


def north_and_scale(fr: Frame) -> list[str]:
    """The row under the frame (`SCALE_ROW_MM` tall, sheet mm): a scale bar of 1 in on paper in
    four parts, the scale in words, and a north arrow (plan y up) at the right."""
    length, h = 25.4, 1.2
    x0, y0 = fr.left + 1.0, fr.top + fr.height + 4.6  # the bar's lower edge
    out = []
    for i in range(4):
        fill = "#000" if i % 2 == 0 else "#fff"
        out.append(f'<rect x="{num(x0 + i * length / 4)}" y="{num(y0 - h)}" '
                   f'width="{num(length / 4)}" height="{num(h)}" fill="{fill}" stroke="#000" '
                   f'stroke-width="0.2"/>')
    out.append(text(x0, y0 + 0.9 + 0.8 * LEAST_TEXT_MM, "0", LEAST_TEXT_MM, "middle"))
    out.append(text(x0 + length, y0 + 0.9 + 0.8 * LEAST_TEXT_MM, _bar_words(fr),
                    LEAST_TEXT_MM, "middle"))
    out.append(text(x0 + length + 6.0, y0, _scale_words(fr), LEAST_TEXT_MM))
    x, y = fr.left + fr.width - 6.0, fr.top + fr.height + 8.0
    out += [f'<polygon points="{num(x)},{num(y - 6.5)} {num(x - 1.8)},{num(y)} {num(x)},'
            f'{num(y - 1.8)} {num(x + 1.8)},{num(y)}" fill="#000"/>',
            text(x + 2.8, y - 1.0, "N", TEXT_MM, weight="bold")]
    return out


def _bar_words(fr: Frame) -> str:
    """What the scale bar's 1 in (25.4 mm) of paper measures on site, in the frame's units."""
    if fr.units == "si":
        return f"{fr.ft_per_in * FT_M:.2f} m"
    return f"{fr.ft_per_in:g} ft"


def _scale_words(fr: Frame) -> str:
    """The frame's scale in words, with the paper it holds on: '1 in = 20 ft' (US) or the same
    scale as a ratio, '1:240 (1 cm = 2.4 m)' (SI; 1 in = 12 in, 1 ft = 0.3048 m exactly)."""
    if fr.units == "si":
        ratio = 12.0 * fr.ft_per_in
        return (f"Scale 1:{ratio:g} (1 cm = {ratio / 100:g} m) printed {SHEET_MM:g} mm wide "
                "(letter or A4 portrait)")
    return (f"Scale 1 in = {fr.ft_per_in:g} ft printed {SHEET_MM:g} mm wide "
            "(letter or A4 portrait)")


FT_M = 0.3048  # m per ft, exact (international foot)


def frame_window(bounds, margin_ft: float) -> tuple[float, float, float, float]:
    """The plan window (ft) of `bounds` with `margin_ft` all round."""
    minx, miny, maxx, maxy = bounds
    return minx - margin_ft, miny - margin_ft, maxx + margin_ft, maxy + margin_ft


def plan_layers(g, fr: Frame, numbered) -> list[str]:
    """The plan in the frame, bottom to top: ground and slab, areas, zones, wall lines, walls,
    braces and anchors, the keep-out areas again, the finding symbols."""
    return fr.group(_ground_and_slab(g, fr) + _areas(g, fr) + _zones(g, fr) + _lines(g, fr)
                    + _walls(g, fr) + foundation_items(g, fr) + _braces(g, fr)
                    + _keep_out_on_top(g, fr)
                    + _finding_marks(numbered, fr))


def in_window(pt, window) -> bool:
    """Whether a plan point lies inside a window (least x, y, greatest x, y)."""
    return window[0] <= pt[0] <= window[2] and window[1] <= pt[1] <= window[3]


