"""A wall in elevation, seen square to its braced face: its openings, each brace's insert point
and the dimensions the crew sets them by."""

from __future__ import annotations

from dataclasses import dataclass
from xml.sax.saxutils import escape, quoteattr

from bracing.plan import Elevation
from bracing.report.svg.layers import pick_plan
from bracing.report.svg.style import (
    BRACE,
    ELEVATION_MM,
    FONT,
    LEAST_TEXT_MM,
    TEXT_MM,
    lines_block,
    localized,
    num,
    text,
    text_width,
)
from bracing.results import CAUTION


# --- a wall in elevation --------------------------------------------------------------------------
def elevation_svgs(result, day: int | None = None, standalone: bool = False, *,
                   units: str = "us") -> dict[str, str]:
    """The elevation (`elevation_svg`) of every braced wall standing on a day, by mark: in the
    plan's order, from the day's plan (None: the busiest day's); a wall on no wall line, or a
    site without a plan, from its result alone (measured from the panel's first edge).
    `units`: 'us' or 'si' (the dimensions' words)."""
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
            out[mark] = elevation_svg(p, e, standalone, units=units)
    return out


def _elevation_of_result(panel_result):
    """The elevation of a wall that is on no wall line, from its result: the braces measured
    from the panel's first edge as the site file gives them."""
    b = panel_result.braces or {}
    return Elevation(width_ft=panel_result.width_ft, height_ft=panel_result.height_ft,
                     left_edge="first edge", right_edge="last edge", openings=[],
                     braces_from_left_ft=list(b.get("positions_ft") or []),
                     insert_height_ft=b.get("insert_height_ft"), first_edge_left=True)


@dataclass(frozen=True)
class _Sheet:
    """Where a wall's elevation goes on its sheet (mm): its left edge `x0`, its top, the scale
    `k` (mm per ft) and the wall's height (ft)."""

    x0: float
    top: float
    k: float
    height_ft: float

    def at(self, x: float, z: float) -> tuple[float, float]:
        """Sheet point of the wall point `x` ft from its left edge, `z` ft above its base."""
        return self.x0 + x * self.k, self.top + (self.height_ft - z) * self.k

    @property
    def base(self) -> float:
        """The wall's base line on the sheet (mm)."""
        return self.top + self.height_ft * self.k


def elevation_svg(panel_result, elevation=None, standalone: bool = False, *,
                  units: str = "us") -> str:
    """One wall seen square to its braced face (`ELEVATION_MM` wide, mm units): its outline, its
    openings, each brace's insert point with its distance from the named left edge (looking at
    the braced face; by the compass of the plan) and the insert height above the base.

    `elevation` is the wall's `bracing.plan.Elevation` (`PlanPanel.elevation` of the day's plan);
    None draws from the result alone, measuring from the panel's first edge. With `standalone`
    the caution is printed under it. `units`: 'us' or 'si' (the dimensions' words; the drawing
    stays in ft inside)."""
    p = panel_result
    e = elevation if elevation is not None else _elevation_of_result(p)
    w, h, hb = e.width_ft, e.height_ft, e.insert_height_ft
    xs = sorted(e.braces_from_left_ft)
    left_mm, right_mm = 4.0, 18.0
    k = min((ELEVATION_MM - left_mm - right_mm) / w, 60.0 / h)  # mm per ft
    items, y = lines_block([(f"{p.mark}: elevation, looking at the braced face", TEXT_MM,
                             "bold", "#000")], 1.5, 1.5, ELEVATION_MM - 3.0)
    stacked = (text_width(e.left_edge, LEAST_TEXT_MM, True)
               + text_width(e.right_edge, LEAST_TEXT_MM, True) + 2.0 > w * k)
    sheet = _Sheet(x0=left_mm + (ELEVATION_MM - left_mm - right_mm - w * k) / 2,
                   top=y + 4.0 + (1.3 * LEAST_TEXT_MM if stacked else 0.0), k=k, height_ft=h)
    items += _wall(e, sheet, stacked)
    if hb is None or not xs:
        items.append(text(sheet.x0 + w * k / 2, sheet.top + h * k / 2, "no braces", TEXT_MM,
                          "middle", "bold"))
        y = sheet.base + 2.0
    else:
        items += _inserts(xs, hb, w, sheet)
        y = sheet.base + 5.0 + 4.2 * (len(xs) + 1)  # rows of running dimensions under the wall
    items += _dim_h_mm(sheet.x0, sheet.x0 + w * k,
                       y - 4.2 if xs and hb is not None else sheet.base + 4.0,
                       f"wall {w:g} ft", "wall width")
    y = max(y, sheet.base + 6.0)
    note = (f"Insert points (dots) measured from the {e.left_edge} (left, looking at the "
            f"braced face), {hb:g} ft above the base." if hb is not None and xs
            else f"Left edge: {e.left_edge}, looking at the braced face.")
    if elevation is None:
        note += (" The wall stands on no wall line: its first edge is the one the site file "
                 "measures brace positions from.")
    more, y = lines_block([(note, LEAST_TEXT_MM, "normal", "#000")], y, 1.5,
                          ELEVATION_MM - 3.0)
    items += more
    if standalone:
        more, y = lines_block([(CAUTION, LEAST_TEXT_MM, "bold", "#000")], y + 1.0, 1.5,
                              ELEVATION_MM - 3.0)
        items += more
    return localized(_document(items, y + 2.0), units)


def _wall(e: Elevation, sheet: _Sheet, stacked: bool) -> list[str]:
    """The base line, the wall's outline with its openings, its edges named above it (one over
    the other when `stacked`) and its height dimensioned at the right."""
    w, k, x0, top, base = e.width_ft, sheet.k, sheet.x0, sheet.top, sheet.base
    items = [f'<line x1="1" y1="{num(base)}" x2="{num(ELEVATION_MM - 1)}" y2="{num(base)}" '
             'stroke="#000" stroke-width="0.4"/>',
             f'<rect class="wall" x="{num(x0)}" y="{num(top)}" width="{num(w * k)}" '
             f'height="{num(e.height_ft * k)}" fill="#d9d9d9" stroke="#000" '
             'stroke-width="0.35"/>']
    for ox, oy, ow, oh in e.openings:
        x1, y1 = sheet.at(ox, oy + oh)
        items.append(f'<rect class="opening" x="{num(x1)}" y="{num(y1)}" width="{num(ow * k)}" '
                     f'height="{num(oh * k)}" fill="#fff" stroke="#000" stroke-width="0.25"/>')
        items.append(f'<path d="M {num(x1)},{num(y1)} l {num(ow * k)},{num(oh * k)} m 0,'
                     f'{num(-oh * k)} l {num(-ow * k)},{num(oh * k)}" stroke="#888" '
                     'stroke-width="0.2"/>')
    items.append(text(x0, top - 1.0 - (1.3 * LEAST_TEXT_MM if stacked else 0.0), e.left_edge,
                      LEAST_TEXT_MM, weight="bold", extra=' class="edge"'))
    items.append(text(x0 + w * k, top - 1.0, e.right_edge, LEAST_TEXT_MM, "end", "bold",
                      extra=' class="edge"'))
    items += vertical_dimension(x0 + w * k + 3.0 + 8.0, base, top, f"{e.height_ft:g} ft", "wall")
    return items


def _inserts(xs: list[float], hb: float, w: float, sheet: _Sheet) -> list[str]:
    """The brace inserts at `xs` ft from the left edge, `hb` ft up: dots, the insert height
    dimensioned at the right and running dimensions from the left edge, one row per brace."""
    base, k, x0 = sheet.base, sheet.k, sheet.x0
    zx, zy = sheet.at(0, hb)
    items = []
    for x in xs:
        ix, iy = sheet.at(x, hb)
        items.append(f'<circle class="insert" cx="{num(ix)}" cy="{num(iy)}" r="0.9" '
                     f'fill="{BRACE}" stroke="#fff" stroke-width="0.2"/>')
        items.append(f'<line x1="{num(ix)}" y1="{num(iy)}" x2="{num(ix)}" '
                     f'y2="{num(base + 1)}" stroke="#000" stroke-width="0.15" '
                     'stroke-dasharray="0.8,0.6"/>')
    items.append(f'<line x1="{num(zx)}" y1="{num(zy)}" x2="{num(x0 + w * k)}" y2="{num(zy)}" '
                 f'stroke="{BRACE}" stroke-width="0.15" stroke-dasharray="1,0.8"/>')
    items += vertical_dimension(x0 + w * k + 3.0, base, zy, f"insert {hb:g} ft", "insert")
    for row, x in enumerate(xs):
        items += _dim_h_mm(x0, x0 + x * k, base + 4.0 + row * 4.2, f"{x:.2f} ft",
                           f"brace {row + 1}")
    return items


def _document(items: list[str], height: float) -> str:
    """An elevation's SVG, `ELEVATION_MM` wide and `height` mm tall, the caution in its desc."""
    return "\n".join([
        '<?xml version="1.0" encoding="UTF-8"?>',
        f'<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="{num(ELEVATION_MM)}mm" '
        f'height="{num(height)}mm" viewBox="0 0 {num(ELEVATION_MM)} {num(height)}" '
        f'font-family={quoteattr(FONT)}>',
        f"<desc>{escape(CAUTION)}</desc>",
        f'<rect x="0" y="0" width="{num(ELEVATION_MM)}" height="{num(height)}" fill="#fff"/>',
        *items, "</svg>", ""])


def _dim_h_mm(x0: float, x1: float, y: float, words: str, key: str) -> list[str]:
    """A horizontal dimension (sheet mm) from x0 to x1 at y, its words beside its end."""
    t = 0.8
    return [f'<g class="dimension" data-key={quoteattr(key)} stroke="#000" stroke-width="0.2">'
            f'<line x1="{num(x0)}" y1="{num(y)}" x2="{num(x1)}" y2="{num(y)}"/>'
            f'<line x1="{num(x0)}" y1="{num(y - t)}" x2="{num(x0)}" y2="{num(y + t)}"/>'
            f'<line x1="{num(x1)}" y1="{num(y - t)}" x2="{num(x1)}" y2="{num(y + t)}"/></g>',
            text(x1 + 1.0, y + 0.35 * LEAST_TEXT_MM, words, LEAST_TEXT_MM,
                 extra=' class="dim-text"')]


def vertical_dimension(x: float, y0: float, y1: float, words: str, key: str | None = None
                       ) -> list[str]:
    """A vertical dimension (sheet mm) at x from y0 up to y1, its words turned along it
    (`key`: a data-key naming it, where a test looks it up)."""
    t, mid = 0.8, (y0 + y1) / 2
    named = f" data-key={quoteattr(key)}" if key is not None else ""
    return [f'<g class="dimension"{named} stroke="#000" stroke-width="0.2">'
            f'<line x1="{num(x)}" y1="{num(y0)}" x2="{num(x)}" y2="{num(y1)}"/>'
            f'<line x1="{num(x - t)}" y1="{num(y0)}" x2="{num(x + t)}" y2="{num(y0)}"/>'
            f'<line x1="{num(x - t)}" y1="{num(y1)}" x2="{num(x + t)}" y2="{num(y1)}"/></g>',
            text(x - 0.8, mid, words, LEAST_TEXT_MM, "middle",
                 extra=f' class="dim-text" transform="rotate(-90 {num(x - 0.8)} {num(mid)})"')]


