"""A foundation wall backfilled before the floor, in section (method notes §12): the wall on its
footing, the backfill against its outside face with its line and height, the earth-pressure
diagram (the surcharge's rectangle, the soil's triangle and the water below its level), their
resultant and its height, the highest backfill allowed before the floor, and any inside brace
with its height, angle and force.

Drawn from plain numbers (`bracing.backfill_profile.BackfillSketch`), worked out by the engine:
nothing is computed here but the drawing's own geometry. Laid out in mm, `ELEVATION_MM` wide, so
that a font size is its size on paper; labels are set clear of each other by `place_labels`.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from xml.sax.saxutils import escape, quoteattr

from shapely.geometry import LineString, Polygon, box

from bracing.backfill_profile import BackfillSketch, InsideBraceSketch  # noqa: F401 (its input)
from bracing.report.svg.elevation import vertical_dimension
from bracing.report.svg.labels import Label, place_labels, placed_items
from bracing.report.svg.style import (
    BRACE,
    DANGER,
    ELEVATION_MM,
    FONT,
    GROUND,
    LEAST_TEXT_MM,
    TEXT_MM,
    lines_block,
    num,
)
from bracing.results import CAUTION

PRESSURE, WATER = "#a04000", "#2e86c1"
DIAGRAM_MM = 30.0   # the largest pressure of a diagram, drawn this wide
RIGHT_MM = 28.0     # room right of the diagram for its labels
DIM_X_MM = 5.0      # the wall's height dimension, at the left
WALL_MAX_MM = 56.0  # the tallest a wall is drawn
NOTE = ("Pressures unfactored, per ft of wall; heights above the top of the footing. Backfill on "
        "the outside face (right); the floor not yet on, so the wall stands as a cantilever from "
        "its footing. Allowed: the highest backfill before the floor (method notes §12).")


@dataclass(frozen=True)
class _Frame:
    """The sketch on its sheet: the wall's inside face `xw` and base `yb` (mm), `k` mm per ft."""

    xw: float
    yb: float
    k: float

    def y(self, z: float) -> float:
        return self.yb - z * self.k


def backfill_section_svg(sketch: BackfillSketch, standalone: bool = False, *,
                         units: str = "us", notes: bool = True) -> str:
    """The section sketch of one foundation wall (`ELEVATION_MM` wide, mm units); with
    `standalone` the caution is printed under it (it is in the drawing's desc always); without
    `notes` the note on what it shows is left to the page that holds several (`NOTE`).
    `units`: 'us' or 'si' (the words; the drawing stays in ft inside)."""
    say = _Words(units)
    s = sketch
    title = f"{s.mark}: backfill section" + (f", {s.caption}" if s.caption else "")
    items, y = lines_block([(say(title), TEXT_MM, "bold", "#000")], 1.5, 1.5, ELEVATION_MM - 3)
    fr = _frame(s, y + 9.0)
    t = s.thickness_in / 12.0
    x0 = fr.xw + t * fr.k  # the outside face, the backfill's side
    bottom = fr.yb + s.footing_thickness_ft * fr.k + 3.0
    drawn: list = []
    items += _ground(s, fr, x0, bottom, drawn)
    items += _wall_and_footing(s, fr, drawn)
    labels: list[Label] = []
    items += _diagram(s, fr, x0, drawn, labels, say)
    items += _levels(s, fr, x0, drawn, labels, say)
    if s.brace is not None:
        items += _brace(s, fr, drawn, labels, say)
    labels.append(Label("thickness", say(f"{s.thickness_in:g} in"), LEAST_TEXT_MM,
                        (fr.xw + t * fr.k / 2, fr.y(s.wall_height_ft) - 1.5), bold=False))
    if s.footing_width_ft is not None:
        labels.append(Label("footing", say(f"footing {round(s.footing_width_ft, 2):g} x "
                                           f"{round(s.footing_thickness_ft, 2):g} ft"),
                            LEAST_TEXT_MM,
                            (fr.xw, fr.yb + s.footing_thickness_ft * fr.k / 2), bold=False))
    items += vertical_dimension(DIM_X_MM, fr.yb, fr.y(s.wall_height_ft),
                                say(f"wall {s.wall_height_ft:g} ft"))
    frame = (DIM_X_MM + 2.0, y + 0.5, ELEVATION_MM - 0.5, bottom + 7.0)
    items += placed_items(place_labels(labels, drawn, frame))
    notes = [(NOTE, LEAST_TEXT_MM, "normal", "#000")] if notes else []
    if s.footing_width_ft is None:
        notes.append(("Footing not given: overturning and sliding not checked.", LEAST_TEXT_MM,
                      "normal", "#000"))
    if standalone:
        notes.append((CAUTION, LEAST_TEXT_MM, "bold", "#000"))
    more, y = lines_block([(say(w), size, weight, color) for w, size, weight, color in notes],
                          bottom + 7.5, 1.5, ELEVATION_MM - 3)
    y = max(y, bottom + 7.0)
    return _document(items + more, y + 2.0, s)


class _Words:
    """The sketch's words in the chosen units: free text through the views' `localize`, a
    quantity through their `fmt` (rounded once, in the units shown)."""

    def __init__(self, units: str):
        from bracing.report.text import fmt, localize  # the views' one formatter

        self.units, self._fmt, self._localize = units, fmt, localize

    def __call__(self, words: str) -> str:
        return self._localize(words, self.units)

    def q(self, value: float, unit: str, digits: int = 0) -> str:
        return self._fmt(value, unit, self.units, digits)


def _frame(s: BackfillSketch, top: float) -> _Frame:
    """The scale and the wall's place: the inside (brace foot or footing toe), the wall and the
    diagram with its labels fill the width; the wall no taller than `WALL_MAX_MM`."""
    t = s.thickness_in / 12.0
    reach = 1.5
    if s.brace is not None:
        reach = max(reach, s.brace.height_ft / math.tan(math.radians(s.brace.angle_deg)))
    if s.footing_width_ft is not None:
        reach = max(reach, _toe(s))
    left = DIM_X_MM + 4.0
    k = min((ELEVATION_MM - left - 4.0 - DIAGRAM_MM - RIGHT_MM) / (reach + t),
            WALL_MAX_MM / s.wall_height_ft)
    return _Frame(xw=left + 2.0 + reach * k, yb=top + s.wall_height_ft * k, k=k)


def _toe(s: BackfillSketch) -> float:
    t = s.thickness_in / 12.0
    return (s.footing_width_ft - t) / 2.0 if s.toe_ft is None else s.toe_ft


def _ground(s, fr: _Frame, x0: float, bottom: float, drawn: list) -> list[str]:
    """The ground under the base and the backfill against the outside face."""
    top = fr.y(s.backfill_ft)
    line = DANGER if s.danger else "#6e4b1f"
    drawn.append((box(x0, top, ELEVATION_MM - 1.0, bottom), 0.2))
    drawn.append((LineString([(x0, top), (ELEVATION_MM - 1.0, top)]).buffer(0.3), 2.0))
    return [f'<rect class="ground" x="1" y="{num(fr.yb)}" width="{num(ELEVATION_MM - 2.0)}" '
            f'height="{num(bottom - fr.yb)}" fill="{GROUND}"/>',
            f'<rect class="backfill" x="{num(x0)}" y="{num(top)}" '
            f'width="{num(ELEVATION_MM - 1.0 - x0)}" height="{num(fr.yb - top)}" '
            f'fill="{GROUND}"/>',
            f'<line class="inside-grade" x1="1" y1="{num(fr.yb)}" x2="{num(fr.xw)}" '
            f'y2="{num(fr.yb)}" stroke="#000" stroke-width="0.35"/>',
            f'<line class="backfill-line" x1="{num(x0)}" y1="{num(top)}" '
            f'x2="{num(ELEVATION_MM - 1.0)}" y2="{num(top)}" stroke="{line}" '
            'stroke-width="0.6"/>']


def _wall_and_footing(s, fr: _Frame, drawn: list) -> list[str]:
    t, k = s.thickness_in / 12.0, fr.k
    wall = box(fr.xw, fr.y(s.wall_height_ft), fr.xw + t * k, fr.yb)
    drawn.append((wall, 3.0))
    out = []
    if s.footing_width_ft is not None:
        fx = fr.xw - _toe(s) * k
        foot = box(fx, fr.yb, fx + s.footing_width_ft * k, fr.yb + s.footing_thickness_ft * k)
        drawn.append((foot, 1.0))
        out.append(f'<rect class="footing" x="{num(fx)}" y="{num(fr.yb)}" '
                   f'width="{num(s.footing_width_ft * k)}" '
                   f'height="{num(s.footing_thickness_ft * k)}" fill="#bdbdbd" stroke="#000" '
                   'stroke-width="0.3"/>')
    x, y0, x1, y1 = wall.bounds
    out.append(f'<rect class="wall" x="{num(x)}" y="{num(y0)}" width="{num(x1 - x)}" '
               f'height="{num(y1 - y0)}" fill="#d9d9d9" stroke="#000" stroke-width="0.35"/>')
    return out


def _diagram(s, fr: _Frame, x0: float, drawn: list, labels: list, say) -> list[str]:
    """The pressure diagram against the outside face, its parts parted by thin lines, the base
    value and the resultant's arrow at its height."""
    rows = [(fr.y(z), a, b, c) for z, a, b, c in s.profile]
    peak = max((a + b + c for _, a, b, c in rows), default=0.0)
    if s.backfill_ft <= 0.0 or peak <= 0.0:
        labels.append(Label("pressure", say("no backfill"), LEAST_TEXT_MM, (x0 + 6.0, fr.yb - 2)))
        return []
    mm = DIAGRAM_MM / peak  # mm per psf
    edge = [(x0 + mm * (a + b + c), y) for y, a, b, c in rows]
    outline = [(x0, rows[0][0]), *edge, (x0, rows[-1][0])]
    drawn.append((Polygon(outline), 1.0))
    points = " ".join(f"{num(x)},{num(y)}" for x, y in outline)
    out = [f'<polygon class="pressure" points="{points}"'
           f' fill="{PRESSURE}" fill-opacity="0.22" stroke="{PRESSURE}" stroke-width="0.35"/>']
    top, base = rows[0], rows[-1]
    if base[1] > 0.0:  # the surcharge's rectangle
        xs = x0 + mm * base[1]
        out.append(f'<line class="pressure-part" x1="{num(xs)}" y1="{num(top[0])}" '
                   f'x2="{num(xs)}" y2="{num(base[0])}" stroke="{PRESSURE}" stroke-width="0.2" '
                   'stroke-dasharray="0.8,0.6"/>')
        labels.append(Label("surcharge", say(f"surcharge {say.q(s.surcharge_psf, 'psf')}: "
                                             f"{say.q(top[1], 'psf')} on the wall"), LEAST_TEXT_MM,
                            (xs, top[0]), bold=False, color=PRESSURE))
    if base[3] > 0.0:  # the water's triangle, from the water level to the base
        xw = x0 + mm * (base[1] + base[2])
        level = [r for r in rows if r[3] == 0.0][-1]  # the row at the water level
        xl = x0 + mm * (level[1] + level[2])
        out.append(f'<polygon class="water-pressure" points="{num(xl)},{num(level[0])} '
                   f'{num(edge[-1][0])},{num(base[0])} {num(xw)},{num(base[0])}" fill="{WATER}" '
                   f'fill-opacity="0.3" stroke="{WATER}" stroke-width="0.2"/>')
    labels.append(Label("base-pressure", say(f"{say.q(base[1] + base[2] + base[3], 'psf')} at "
                                             "the base"), LEAST_TEXT_MM, (edge[-1][0], base[0]),
                        color=PRESSURE))
    labels.append(Label("efp", say(f"EFP {say.q(s.efp_pcf, 'pcf')}"), LEAST_TEXT_MM,
                        (x0 + mm * (base[1] + base[2] / 3), fr.y(s.backfill_ft / 3)), bold=False,
                        color=PRESSURE))
    ya = fr.y(s.resultant_height_ft)
    tail = x0 + DIAGRAM_MM + 7.0
    drawn.append((LineString([(x0, ya), (tail, ya)]).buffer(0.5), 3.0))
    out.append(f'<g class="resultant" stroke="#000" stroke-width="0.45" fill="#000">'
               f'<line x1="{num(tail)}" y1="{num(ya)}" x2="{num(x0 + 1.6)}" y2="{num(ya)}"/>'
               f'<polygon points="{num(x0 + 0.2)},{num(ya)} {num(x0 + 2.0)},{num(ya - 0.9)} '
               f'{num(x0 + 2.0)},{num(ya + 0.9)}" stroke="none"/></g>')
    labels.insert(0, Label("resultant", say(f"P {say.q(s.resultant_plf, 'plf')} at "
                                            f"{say.q(s.resultant_height_ft, 'ft', 2)}"),
                           LEAST_TEXT_MM,
                           (tail + 0.5, ya)))
    return out


def _levels(s, fr: _Frame, x0: float, drawn: list, labels: list, say) -> list[str]:
    """The backfill's line, the allowed heights and the water level, each named at the right."""
    out = []
    right = ELEVATION_MM - 1.0
    held = s.brace.allowed_ft if s.brace is not None else s.allowed_ft
    words = (f"DANGER: backfill {s.backfill_ft:g} ft, allowed {say.q(held, 'ft', 1)}"
             if s.danger else f"backfill {s.backfill_ft:g} ft")
    middle = (x0 + right) / 2
    labels.insert(0, Label("backfill", say(words), LEAST_TEXT_MM, (middle, fr.y(s.backfill_ft)),
                           color=DANGER if s.danger else "#000"))
    levels = [("allowed", s.allowed_ft, "#000", "allowed {} before the floor")]
    if s.brace is not None:
        levels.append(("braced-allowed", s.brace.allowed_ft, BRACE, "with the inside braces {}"))
    for key, z, color, words in levels:
        words = words.format("the full height" if z >= s.wall_height_ft else say.q(z, "ft", 1))
        y = fr.y(min(z, s.wall_height_ft))
        out.append(f'<line class="{key}" x1="{num(x0)}" y1="{num(y)}" x2="{num(right)}" '
                   f'y2="{num(y)}" stroke="{color}" stroke-width="0.3" '
                   'stroke-dasharray="1.6,0.8"/>')
        drawn.append((LineString([(x0, y), (right, y)]).buffer(0.2), 1.5))
        labels.insert(1, Label(key, say(words), LEAST_TEXT_MM, (middle, y), color=color))
    if s.water_level_ft:
        y = fr.y(s.water_level_ft)
        out.append(f'<line class="water" x1="{num(x0)}" y1="{num(y)}" x2="{num(right)}" '
                   f'y2="{num(y)}" stroke="{WATER}" stroke-width="0.3" '
                   'stroke-dasharray="0.6,0.6"/>'
                   f'<polygon points="{num(right - 4.0)},{num(y)} {num(right - 5.0)},'
                   f'{num(y - 1.2)} {num(right - 3.0)},{num(y - 1.2)}" fill="{WATER}"/>')
        labels.append(Label("water", say(f"water {s.water_level_ft:g} ft"), LEAST_TEXT_MM,
                            (right - 10.0, y), bold=False, color=WATER))
    return out


def _brace(s, fr: _Frame, drawn: list, labels: list, say) -> list[str]:
    """The inside brace from its insert on the inside face down to its foot, its words beside."""
    b = s.brace
    d = b.height_ft / math.tan(math.radians(b.angle_deg))
    xi, yi = fr.xw, fr.y(b.height_ft)
    xf = fr.xw - d * fr.k
    drawn.append((LineString([(xi, yi), (xf, fr.yb)]).buffer(0.6), 3.0))
    labels.append(Label("brace", say(f"inside brace at {say.q(b.height_ft, 'ft', 1)}, "
                                     f"{b.angle_deg:g}°, every {say.q(b.spacing_ft, 'ft', 1)}: "
                                     f"{say.q(b.force_lb, 'lbf')} each"),
                        LEAST_TEXT_MM, ((xi + xf) / 2, (yi + fr.yb) / 2), color=BRACE))
    return [f'<line class="inside-brace" x1="{num(xi)}" y1="{num(yi)}" x2="{num(xf)}" '
            f'y2="{num(fr.yb)}" stroke="{BRACE}" stroke-width="0.9"/>',
            f'<circle cx="{num(xi)}" cy="{num(yi)}" r="0.7" fill="#fff" stroke="#000" '
            'stroke-width="0.25"/>',
            f'<rect x="{num(xf - 1.4)}" y="{num(fr.yb - 0.5)}" width="2.8" height="0.5" '
            'fill="#000"/>']



def _document(items: list[str], height: float, s: BackfillSketch) -> str:
    """The sketch's SVG, `ELEVATION_MM` wide and `height` mm tall, the caution in its desc."""
    return "\n".join([
        '<?xml version="1.0" encoding="UTF-8"?>',
        f'<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="{num(ELEVATION_MM)}mm" '
        f'height="{num(height)}mm" viewBox="0 0 {num(ELEVATION_MM)} {num(height)}" '
        f'font-family={quoteattr(FONT)} class="backfill-section" '
        f'data-mark={quoteattr(s.mark)}>',
        f"<desc>{escape(CAUTION)}</desc>",
        f'<rect x="0" y="0" width="{num(ELEVATION_MM)}" height="{num(height)}" fill="#fff"/>',
        *items, "</svg>", ""])
