"""SVG drawings from the result: the site plan of a day and one wall's bracing section.

Drawn from `SiteResult.plan` (a `bracing.plan.PlanGeometry`, or a dict of them by day) and from
a `PanelResult`: no engineering value is computed here. Only the standard library and shapely
(label points) are used. Colours and symbols are our own plain choices; every failing item also
carries a cross, a number and the word DANGER, never colour alone. Plan y points north.
"""

from __future__ import annotations

import math
import textwrap
from collections.abc import Mapping
from xml.sax.saxutils import escape, quoteattr

from shapely.geometry import Polygon

PX_WIDTH = 1000  # width on screen (px); the viewBox is in ft
CHAR = 0.6       # mean character width / font size, for wrapping (bold: BOLD_CHAR)
BOLD_CHAR = 0.66
SECTION_PX_WIDTH = 360
FONT = "DejaVu Sans, Arial, Helvetica, sans-serif"

# kind -> (colour, hatch angle in degrees or None for a tint only, legend words)
AREA_STYLE = {
    "keep_clear": ("#6e6e6e", 45, "keep-clear area"),
    "crane_path": ("#c96a12", -45, "crane path"),
    "public_way": ("#b03a2e", 45, "public way"),
    "neighbor": ("#6c3483", 90, "neighbor"),
    "office": ("#2471a3", None, "site office"),
    "work": ("#1e8449", None, "work area"),
}
SLAB, SLAB_EDGE, GROUND = "#e3e3e3", "#4d4d4d", "#efe5cc"
WALL, BRACE, ZONE, EVACUATED = "#3b3b3b", "#1f4e9c", "#e69b1e", "#b03a2e"
DANGER, WARNING = "#c0392b", "#b9770e"
ANCHOR_WORDS = {"slab": "slab anchor", "helical": "helical anchor", "deadman": "deadman",
                "stake": "stake", "insert": "insert", "deck": "deck anchor",
                "": "foot (no anchor named)"}
STATUS_WORDS = {"unsafe": "UNSAFE", "needs_braces": "NEEDS BRACES"}
MOST_FINDINGS = 40


def _f(v: float) -> str:
    """A coordinate for SVG, to 1/1000 ft."""
    s = f"{v:.3f}".rstrip("0").rstrip(".")
    return "0" if s in ("-0", "") else s


def _pts(coords) -> str:
    return " ".join(f"{_f(x)},{_f(-y)}" for x, y in coords)


def _text(x, y, words, size, anchor="start", weight="normal", fill="#000", extra="") -> str:
    return (f'<text x="{_f(x)}" y="{_f(y)}" font-size="{_f(size)}" text-anchor="{anchor}" '
            f'font-weight="{weight}" fill="{fill}"{extra}>{escape(str(words))}</text>')


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


class _Sheet:
    """Sizes of one plan sheet in ft: the plan frame, a font size and a stroke unit."""

    def __init__(self, bounds):
        minx, miny, maxx, maxy = bounds
        span = max(maxx - minx, maxy - miny, 10.0)
        margin = 0.06 * span
        cx = (minx + maxx) / 2
        half = max((maxx - minx) / 2 + margin, 0.45 * span)  # room for the text bands
        self.left, self.right = cx - half, cx + half
        self.top, self.bottom = -(maxy + margin), -(miny - margin)  # screen y of the frame
        self.width = self.right - self.left
        self.font = span / 60.0
        self.unit = span / 800.0  # stroke unit, about one screen px

    def wrap(self, text: str, size: float, bold: bool = False) -> list[str]:
        per_char = (BOLD_CHAR if bold else CHAR) * size
        return textwrap.wrap(text, max(20, int(self.width / per_char) - 3))


def plan_svg(result, day: int | None = None) -> str:
    """The site plan of a day as a printable SVG: slab, holes, joints, ground, areas, wall
    lines, walls, braces and anchors, zones, findings, a north arrow, a scale bar, a legend
    and the caution."""
    g = pick_plan(getattr(result, "plan", None), day)
    if g is None:
        return _no_plan_svg(result)
    sheet = _Sheet(g.bounds)
    fs, u = sheet.font, sheet.unit
    status = {p.mark: p.status for p in getattr(result, "panels", [])}
    numbered = _number_findings(g.findings)

    head = _title_band(result, g, sheet)
    body = [f'<rect x="{_f(sheet.left)}" y="{_f(sheet.top)}" width="{_f(sheet.width)}" '
            f'height="{_f(sheet.bottom - sheet.top)}" fill="#fff" stroke="#000" '
            f'stroke-width="{_f(u)}"/>']
    body += _ground_and_slab(g, u)
    body += _areas(g, fs, u)
    body += _zones(g, u)
    body += _lines(g, fs, u)
    body += _walls(g, status, fs, u)
    body += _braces(g, fs, u)
    body += _finding_marks(numbered, fs, u)
    body += _north_and_scale(sheet)
    foot, foot_height = _legend_and_findings(g, numbered, sheet, sheet.bottom + fs)
    top = sheet.top - head[1]
    height = sheet.bottom + fs + foot_height - top
    return _document(sheet.left, top, sheet.width, height, _defs(fs, u),
                     head[0] + body + foot, getattr(result, "caution", ""))


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


def _defs(fs: float, u: float) -> list[str]:
    """Hatch patterns, one per hatched area kind, and one for slab holes."""
    step = 0.8 * fs
    out = []
    hatches = {f"hatch-{k}": (c, a) for k, (c, a, _) in AREA_STYLE.items() if a is not None}
    hatches["hatch-hole"] = ("#4d4d4d", 45)
    for name, (colour, angle) in hatches.items():
        out.append(f'<pattern id="{name}" patternUnits="userSpaceOnUse" width="{_f(step)}" '
                   f'height="{_f(step)}" patternTransform="rotate({angle})">'
                   f'<line x1="0" y1="0" x2="0" y2="{_f(step)}" stroke="{colour}" '
                   f'stroke-width="{_f(1.2 * u)}"/></pattern>')
    return out


def _title_band(result, g, sheet: _Sheet) -> tuple[list[str], float]:
    """Title, what stands, and the caution in a box above the plan; (items, height)."""
    fs = sheet.font
    when = f"day {g.day}" if g.day is not None else "all walls placed"
    standing = g.standing
    shown = ", ".join(standing[:30]) + (f" and {len(standing) - 30} more" if len(standing) > 30
                                        else "")
    lines = [(f"Site plan, {when}: {getattr(result, 'name', '')}", 1.5 * fs, "bold"),
             (f"Standing ({len(standing)}): {shown or 'none'}", fs, "normal")]
    caution = sheet.wrap(getattr(result, "caution", ""), 1.05 * fs, bold=True)
    height = 1.5 * fs * 1.4 + fs * 1.4 + len(caution) * 1.05 * fs * 1.3 + 2.0 * fs
    y = sheet.top - height
    items = []
    for words, size, weight in lines:
        y += size * 1.4
        items.append(_text(sheet.left + 0.5 * fs, y, words, size, weight=weight))
    box_top = y + 0.5 * fs
    box_h = len(caution) * 1.05 * fs * 1.3 + 0.6 * fs
    items.append(f'<rect x="{_f(sheet.left + 0.3 * fs)}" y="{_f(box_top)}" '
                 f'width="{_f(sheet.width - 0.6 * fs)}" height="{_f(box_h)}" fill="#fff8e1" '
                 f'stroke="#000" stroke-width="{_f(2 * sheet.unit)}"/>')
    for i, words in enumerate(caution):
        items.append(_text(sheet.left + 0.7 * fs, box_top + (i + 1) * 1.05 * fs * 1.3,
                           words, 1.05 * fs, weight="bold", extra=' class="caution"'))
    return items, height


def _ground_and_slab(g, u: float) -> list[str]:
    out = [f'<polygon points="{_pts(r)}" fill="{GROUND}" stroke="#b8a77a" '
           f'stroke-width="{_f(u)}"/>' for r in g.ground]
    if g.slab:
        rings = [g.slab, *g.slab_holes]
        d = " ".join("M " + _pts(r) + " Z" for r in rings)
        out.append(f'<path d="{d}" fill="{SLAB}" fill-rule="evenodd" stroke="{SLAB_EDGE}" '
                   f'stroke-width="{_f(2 * u)}"/>')
    out += [f'<polygon points="{_pts(h)}" fill="url(#hatch-hole)" stroke="{SLAB_EDGE}" '
            f'stroke-width="{_f(2 * u)}"/>' for h in g.slab_holes]
    out += [f'<polyline points="{_pts(j)}" fill="none" stroke="#7f7f7f" '
            f'stroke-width="{_f(1.2 * u)}" stroke-dasharray="{_f(10 * u)},{_f(3 * u)},'
            f'{_f(2 * u)},{_f(3 * u)}"/>' for j in g.joints]
    return out


def _label_point(coords) -> tuple[float, float]:
    p = Polygon(coords).representative_point()
    return p.x, p.y


def _areas(g, fs: float, u: float) -> list[str]:
    out = []
    for a in g.areas:
        colour, angle, words = AREA_STYLE[a.kind]
        fill = f"url(#hatch-{a.kind})" if angle is not None else colour
        opacity = "1" if angle is not None else "0.15"
        out.append(f'<polygon points="{_pts(a.coords)}" fill="{fill}" fill-opacity="{opacity}" '
                   f'stroke="{colour}" stroke-width="{_f(1.5 * u)}"/>')
        x, y = _label_point(a.coords)
        out.append(_text(x, -y, f"{a.name} ({words})", 0.85 * fs, "middle", "bold", colour,
                         ' paint-order="stroke" stroke="#fff" stroke-width="'
                         f'{_f(3 * u)}"'))
    return out


def _zones(g, u: float) -> list[str]:
    out = []
    for p in g.panels:
        if p.restricted_zone:
            out.append(f'<polygon points="{_pts(p.restricted_zone)}" fill="{ZONE}" '
                       f'fill-opacity="0.16" stroke="{ZONE}" stroke-width="{_f(1.5 * u)}" '
                       f'stroke-dasharray="{_f(6 * u)},{_f(4 * u)}"/>')
        if p.evacuated_zone:
            out.append(f'<polygon points="{_pts(p.evacuated_zone)}" fill="none" '
                       f'stroke="{EVACUATED}" stroke-width="{_f(1.2 * u)}" '
                       f'stroke-dasharray="{_f(14 * u)},{_f(6 * u)}" '
                       f'stroke-dashoffset="{_f(5 * u)}"/>')
    return out


def _lines(g, fs: float, u: float) -> list[str]:
    """Wall lines, each named, with a tick toward its braced side."""
    out = []
    for line in g.lines:
        (x0, y0), (x1, y1) = line.start, line.end
        length = math.hypot(x1 - x0, y1 - y0) or 1.0
        ux, uy = (x1 - x0) / length, (y1 - y0) / length
        nx, ny = (-uy, ux) if line.braced_side == "left" else (uy, -ux)
        mx, my = (x0 + x1) / 2, (y0 + y1) / 2
        out.append(f'<line x1="{_f(x0)}" y1="{_f(-y0)}" x2="{_f(x1)}" y2="{_f(-y1)}" '
                   f'stroke="#888" stroke-width="{_f(u)}" stroke-dasharray="{_f(8 * u)},'
                   f'{_f(3 * u)}"/>')
        out.append(f'<line x1="{_f(mx)}" y1="{_f(-my)}" x2="{_f(mx + fs * nx)}" '
                   f'y2="{_f(-(my + fs * ny))}" stroke="#888" stroke-width="{_f(u)}"/>')
        out.append(_text(x0 - 1.2 * fs * ux - 0.6 * fs * nx,
                         -(y0 - 1.2 * fs * uy - 0.6 * fs * ny),
                         f"line {line.name}", 0.75 * fs, "middle", fill="#555"))
    return out


def _walls(g, status: dict, fs: float, u: float) -> list[str]:
    out = []
    for p in g.panels:
        if p.standing:
            out.append(f'<polygon points="{_pts(p.footprint)}" fill="{WALL}" stroke="#000" '
                       f'stroke-width="{_f(u)}"/>')
        else:
            out.append(f'<polygon points="{_pts(p.footprint)}" fill="#fff" stroke="{WALL}" '
                       f'stroke-width="{_f(u)}" stroke-dasharray="{_f(3 * u)},{_f(2 * u)}"/>')
        (fx0, fy0), (fx1, fy1) = p.face
        fx, fy = (fx0 + fx1) / 2, (fy0 + fy1) / 2
        cx, cy = _label_point(p.footprint)
        back = math.hypot(cx - fx, cy - fy) or 1.0
        lx = cx + (cx - fx) / back * 1.3 * fs
        ly = cy + (cy - fy) / back * 1.3 * fs
        word = STATUS_WORDS.get(status.get(p.mark, ""), "") if p.standing else "not standing"
        halo = f' paint-order="stroke" stroke="#fff" stroke-width="{_f(3 * u)}"'
        below = 1.0 if (cy - fy) <= 0 else -1.0  # a second line away from the wall
        out.append(_text(lx, -ly + 0.35 * fs, p.mark, fs, "middle", "bold", "#000", halo))
        if word:
            out.append(_text(lx, -ly + 0.35 * fs + below * 0.95 * fs, word, 0.7 * fs, "middle",
                             "bold", DANGER if p.standing else "#555", halo))
    return out


def _anchor(kind: str, x: float, y: float, r: float, u: float) -> str:
    """The foot anchor symbol of each kind at plan point (x, y)."""
    sx, sy = _f(x), _f(-y)
    w = _f(1.2 * u)
    if kind == "slab":
        return f'<circle cx="{sx}" cy="{sy}" r="{_f(r)}" fill="#000"/>'
    if kind == "helical":
        return (f'<g stroke="#000" stroke-width="{w}"><circle cx="{sx}" cy="{sy}" r="{_f(r)}" '
                f'fill="#fff"/><line x1="{_f(x - r)}" y1="{sy}" x2="{_f(x + r)}" y2="{sy}"/>'
                f'<line x1="{sx}" y1="{_f(-y - r)}" x2="{sx}" y2="{_f(-y + r)}"/></g>')
    if kind == "deadman":
        return (f'<rect x="{_f(x - r)}" y="{_f(-y - r)}" width="{_f(2 * r)}" '
                f'height="{_f(2 * r)}" fill="#000"/>')
    if kind == "stake":
        return (f'<polygon points="{_f(x)},{_f(-y - 1.2 * r)} {_f(x - r)},{_f(-y + 0.8 * r)} '
                f'{_f(x + r)},{_f(-y + 0.8 * r)}" fill="#000"/>')
    if kind == "deck":
        return (f'<polygon points="{_f(x)},{_f(-y - r)} {_f(x + r)},{sy} {_f(x)},{_f(-y + r)} '
                f'{_f(x - r)},{sy}" fill="#000"/>')
    return (f'<circle cx="{sx}" cy="{sy}" r="{_f(r)}" fill="#fff" stroke="#000" '
            f'stroke-width="{w}"/>')


def _braces(g, fs: float, u: float) -> list[str]:
    out = []
    for p in g.panels:
        for (ix, iy), (fx, fy) in p.braces:
            out.append(f'<line x1="{_f(ix)}" y1="{_f(-iy)}" x2="{_f(fx)}" y2="{_f(-fy)}" '
                       f'stroke="{BRACE}" stroke-width="{_f(2.2 * u)}"/>')
            out.append(_anchor(p.foot_kind, fx, fy, 0.4 * fs, u))
    return out


def _number_findings(findings) -> list[tuple[int, object]]:
    order = {"danger": 0, "warning": 1, "notice": 2}
    ranked = sorted(findings, key=lambda f: order.get(f.flag.severity, 3))
    return list(enumerate(ranked, 1))


def _finding_marks(numbered, fs: float, u: float) -> list[str]:
    """A circled cross (danger) or a triangle (warning) with its number, at each point."""
    out = []
    r = 0.8 * fs
    for n, f in numbered:
        for x, y in f.at:
            sx, sy = x, -y
            if f.flag.severity == "danger":
                out.append(
                    f'<g stroke="{DANGER}" stroke-width="{_f(2.5 * u)}" fill="none">'
                    f'<circle cx="{_f(sx)}" cy="{_f(sy)}" r="{_f(r)}"/>'
                    f'<line x1="{_f(sx - 0.7 * r)}" y1="{_f(sy - 0.7 * r)}" '
                    f'x2="{_f(sx + 0.7 * r)}" y2="{_f(sy + 0.7 * r)}"/>'
                    f'<line x1="{_f(sx - 0.7 * r)}" y1="{_f(sy + 0.7 * r)}" '
                    f'x2="{_f(sx + 0.7 * r)}" y2="{_f(sy - 0.7 * r)}"/></g>')
                colour = DANGER
            elif f.flag.severity == "warning":
                out.append(f'<polygon points="{_f(sx)},{_f(sy - r)} {_f(sx - r)},'
                           f'{_f(sy + 0.7 * r)} {_f(sx + r)},{_f(sy + 0.7 * r)}" fill="none" '
                           f'stroke="{WARNING}" stroke-width="{_f(2 * u)}"/>')
                colour = WARNING
            else:
                continue
            out.append(_text(sx + 1.1 * r, sy - 0.6 * r, str(n), 0.9 * fs, weight="bold",
                             fill=colour, extra=' paint-order="stroke" stroke="#fff" '
                             f'stroke-width="{_f(3 * u)}"'))
    return out


def _north_and_scale(sheet: _Sheet) -> list[str]:
    """A north arrow (plan y up) in the top right and a scale bar in the bottom left."""
    fs, u = sheet.font, sheet.unit
    x, y = sheet.right - 2.0 * fs, sheet.top + 4.2 * fs
    out = [f'<polygon points="{_f(x)},{_f(y - 3 * fs)} {_f(x - 0.8 * fs)},{_f(y)} '
           f'{_f(x)},{_f(y - 0.8 * fs)} {_f(x + 0.8 * fs)},{_f(y)}" fill="#000"/>',
           _text(x, y + 1.3 * fs, "N", 1.2 * fs, "middle", "bold")]
    raw = sheet.width / 5.0
    step = 10 ** math.floor(math.log10(raw))
    length = max(m * step for m in (1, 2, 5) if m * step <= raw)
    x0, y0, h = sheet.left + 1.0 * fs, sheet.bottom - 1.2 * fs, 0.45 * fs
    for i in range(4):
        fill = "#000" if i % 2 == 0 else "#fff"
        out.append(f'<rect x="{_f(x0 + i * length / 4)}" y="{_f(y0 - h)}" '
                   f'width="{_f(length / 4)}" height="{_f(h)}" fill="{fill}" stroke="#000" '
                   f'stroke-width="{_f(u)}"/>')
    out.append(_text(x0, y0 - h - 0.3 * fs, "0", 0.8 * fs, "middle"))
    out.append(_text(x0 + length, y0 - h - 0.3 * fs, f"{length:g} ft", 0.8 * fs, "middle"))
    return out


def _legend_items(g) -> list[tuple[str, str]]:
    """(symbol kind, words) of the legend: what this plan shows."""
    items = [("slab", "slab"), ("hole", "slab hole or opening"), ("joint", "slab joint"),
             ("ground", "open ground")]
    kinds = dict.fromkeys(a.kind for a in g.areas)
    items += [(f"area:{k}", AREA_STYLE[k][2]) for k in kinds]
    items += [("wall", "wall standing"), ("ghost", "wall not standing"),
              ("line", "wall line (tick: braced side)"), ("brace", "brace")]
    feet = dict.fromkeys(p.foot_kind for p in g.panels if p.braces)
    items += [(f"anchor:{k}", ANCHOR_WORDS.get(k, k)) for k in feet]
    items += [("zone", "restricted zone (authorized workers only, nothing stored)"),
              ("evacuated", "evacuated zone (nobody: at the stand-down speed, during lifts)"),
              ("danger", "DANGER: failing item, numbered below"),
              ("warning", "warning, numbered below")]
    return items


def _legend_symbol(kind: str, x: float, y: float, fs: float, u: float) -> str:
    """A legend symbol in a box about 1.6 fs by 0.8 fs, left edge x, centre line y."""
    w, h = 1.6 * fs, 0.8 * fs
    box = f'x="{_f(x)}" y="{_f(y - h / 2)}" width="{_f(w)}" height="{_f(h)}"'
    line = f'x1="{_f(x)}" y1="{_f(y)}" x2="{_f(x + w)}" y2="{_f(y)}"'
    if kind == "slab":
        return f'<rect {box} fill="{SLAB}" stroke="{SLAB_EDGE}" stroke-width="{_f(2 * u)}"/>'
    if kind == "hole":
        return f'<rect {box} fill="url(#hatch-hole)" stroke="{SLAB_EDGE}" stroke-width="{_f(u)}"/>'
    if kind == "joint":
        return (f'<line {line} stroke="#7f7f7f" stroke-width="{_f(1.2 * u)}" '
                f'stroke-dasharray="{_f(10 * u)},{_f(3 * u)},{_f(2 * u)},{_f(3 * u)}"/>')
    if kind == "ground":
        return f'<rect {box} fill="{GROUND}" stroke="#b8a77a" stroke-width="{_f(u)}"/>'
    if kind.startswith("area:"):
        k = kind[5:]
        colour, angle, _ = AREA_STYLE[k]
        fill = f'fill="url(#hatch-{k})"' if angle is not None else \
            f'fill="{colour}" fill-opacity="0.15"'
        return f'<rect {box} {fill} stroke="{colour}" stroke-width="{_f(1.5 * u)}"/>'
    if kind == "wall":
        return f'<rect {box} fill="{WALL}" stroke="#000" stroke-width="{_f(u)}"/>'
    if kind == "ghost":
        return (f'<rect {box} fill="#fff" stroke="{WALL}" stroke-width="{_f(u)}" '
                f'stroke-dasharray="{_f(3 * u)},{_f(2 * u)}"/>')
    if kind == "line":
        return (f'<line {line} stroke="#888" stroke-width="{_f(u)}" '
                f'stroke-dasharray="{_f(8 * u)},{_f(3 * u)}"/>')
    if kind == "brace":
        return f'<line {line} stroke="{BRACE}" stroke-width="{_f(2.2 * u)}"/>'
    if kind.startswith("anchor:"):
        return _anchor(kind[7:], x + w / 2, -y, 0.4 * fs, u)
    if kind == "zone":
        return (f'<rect {box} fill="{ZONE}" fill-opacity="0.16" stroke="{ZONE}" '
                f'stroke-width="{_f(1.5 * u)}" stroke-dasharray="{_f(6 * u)},{_f(4 * u)}"/>')
    if kind == "evacuated":
        return (f'<rect {box} fill="none" stroke="{EVACUATED}" stroke-width="{_f(1.2 * u)}" '
                f'stroke-dasharray="{_f(14 * u)},{_f(6 * u)}"/>')
    r = 0.38 * fs
    cx = x + w / 2
    if kind == "danger":
        return (f'<g stroke="{DANGER}" stroke-width="{_f(2.5 * u)}" fill="none">'
                f'<circle cx="{_f(cx)}" cy="{_f(y)}" r="{_f(r)}"/>'
                f'<line x1="{_f(cx - 0.7 * r)}" y1="{_f(y - 0.7 * r)}" x2="{_f(cx + 0.7 * r)}" '
                f'y2="{_f(y + 0.7 * r)}"/><line x1="{_f(cx - 0.7 * r)}" y1="{_f(y + 0.7 * r)}" '
                f'x2="{_f(cx + 0.7 * r)}" y2="{_f(y - 0.7 * r)}"/></g>')
    return (f'<polygon points="{_f(cx)},{_f(y - r)} {_f(cx - r)},{_f(y + 0.7 * r)} '
            f'{_f(cx + r)},{_f(y + 0.7 * r)}" fill="none" stroke="{WARNING}" '
            f'stroke-width="{_f(2 * u)}"/>')


def _legend_and_findings(g, numbered, sheet: _Sheet, y0: float) -> tuple[list[str], float]:
    """The legend in columns, each zone's basis, then the numbered findings; (items, height)."""
    fs, u = sheet.font, sheet.unit
    size = 0.8 * fs
    items = _legend_items(g)
    col_w = 2.6 * fs + max(len(w) for _, w in items) * CHAR * size
    cols = max(1, int(sheet.width // col_w))
    rows = -(-len(items) // cols)
    out = [_text(sheet.left + 0.5 * fs, y0 + fs, "Legend", fs, weight="bold")]
    top = y0 + 2.0 * fs
    for i, (kind, words) in enumerate(items):
        x = sheet.left + 0.5 * fs + (i // rows) * col_w
        y = top + (i % rows) * 1.3 * fs
        out.append(_legend_symbol(kind, x, y, fs, u))
        out.append(_text(x + 2.0 * fs, y + 0.3 * size, words, size))
    y = top + rows * 1.3 * fs + 0.5 * fs
    lines = [(f"Zone of {p.mark}: {p.zone_basis}", "#000", "normal")
             for p in g.panels if p.standing and p.zone_basis]
    lines += [("Same footprint for the evacuated zone: what changes is who may be inside.",
               "#000", "normal")] if lines else []
    if numbered:
        lines.append((f"Findings of the plan ({len(numbered)}):", "#000", "bold"))
    for n, f in numbered[:MOST_FINDINGS]:
        colour = {"danger": DANGER, "warning": WARNING}.get(f.flag.severity, "#000")
        words = f"{n}. {f.flag.severity.upper()} {f.mark} [{f.flag.code}] {f.flag.message}. " \
                f"Source: {f.flag.source}."
        for k, part in enumerate(sheet.wrap(words, size, f.flag.severity == "danger")):
            lines.append((("   " if k else "") + part, colour,
                          "bold" if f.flag.severity == "danger" else "normal"))
    if len(numbered) > MOST_FINDINGS:
        lines.append((f"... and {len(numbered) - MOST_FINDINGS} more in the report", "#000",
                      "normal"))
    for words, colour, weight in lines:
        y += 1.25 * size
        out.append(_text(sheet.left + 0.5 * fs, y, words, size, weight=weight, fill=colour))
    return out, y + fs - y0


def _no_plan_svg(result) -> str:
    """A sheet saying there is no plan to draw, with the caution."""
    w = 100.0
    fs = 2.2
    caution = textwrap.wrap(getattr(result, "caution", ""), int(w / (CHAR * fs)) - 2)
    items = [_text(2, 4, f"Site plan: {getattr(result, 'name', '')}", 1.4 * fs, weight="bold"),
             _text(2, 4 + 2.2 * fs, "No plan to draw: no wall is placed on a wall line.", fs)]
    items += [_text(2, 4 + (4 + 1.3 * i) * fs, words, fs, weight="bold",
                    extra=' class="caution"') for i, words in enumerate(caution)]
    h = 4 + (5 + 1.3 * len(caution)) * fs
    return _document(0.0, 0.0, w, h, [], items, getattr(result, "caution", ""))


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
