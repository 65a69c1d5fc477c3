"""A wall's bracing section, drawn to scale from the result's values."""

from __future__ import annotations

import math

from bracing.report.svg.style import (
    BRACE,
    SECTION_PX_WIDTH,
    WALL,
    localized,
    num,
    px_document,
    text,
)


# --- a wall's bracing section ---------------------------------------------------------------------
def section_svg(panel_result, *, units: str = "us") -> str:
    """A small section of one wall's bracing, drawn to scale from the result's values: wall
    height and thickness, insert height, the brace, its foot distance, angle and length.
    `units`: 'us' or 'si' (the dimensions' words; the drawing stays in ft inside)."""
    p = panel_result
    b = p.braces or {}
    height, t = p.height_ft, p.thickness_in / 12.0
    hb, d = b.get("insert_height_ft"), b.get("anchor_distance_ft")
    braced = hb is not None and d is not None
    span = max(height, d if braced else 0.0, 1.0)
    fs, u = span / 22.0, span / 400.0
    left, right = -t - 0.5 * span, (d if braced else 0.0) + 0.3 * span
    top, bottom = -(height + 0.25 * span), 0.3 * span  # screen y
    items = [text(left + 0.3 * fs, top + 1.3 * fs, f"{p.mark}: bracing section", 1.2 * fs,
                  weight="bold"),
             # ground line with ticks below it
             f'<line x1="{num(left + fs)}" y1="0" x2="{num(right - fs)}" y2="0" stroke="#000" '
             f'stroke-width="{num(1.5 * u)}"/>']
    x = left + fs
    while x < right - fs:
        items.append(f'<line x1="{num(x)}" y1="0" x2="{num(x - 0.4 * fs)}" y2="{num(0.4 * fs)}" '
                     f'stroke="#000" stroke-width="{num(u)}"/>')
        x += 0.8 * fs
    items.append(f'<rect x="{num(-t)}" y="{num(-height)}" width="{num(t)}" height="{num(height)}" '
                 f'fill="{WALL}" stroke="#000" stroke-width="{num(u)}"/>')
    items += _dimension_v(-t - 0.35 * span, 0.0, height, f"{height:g} ft", fs, u)
    items.append(text(-t / 2, -height - 0.4 * fs, f"{p.thickness_in:g} in", 0.8 * fs,
                      "middle"))
    if not braced:
        items.append(text(0.5 * fs, -height / 2, "no braces", fs))
    else:
        theta = b.get("angle_deg")
        length = b.get("length_ft")
        items += _dimension_v(-t - 0.15 * span, 0.0, hb, f"insert {hb:g} ft", fs, u)
        items.append(f'<line x1="0" y1="{num(-hb)}" x2="{num(d)}" y2="0" stroke="{BRACE}" '
                     f'stroke-width="{num(3 * u)}"/>')
        items.append(f'<circle cx="0" cy="{num(-hb)}" r="{num(0.3 * fs)}" fill="#fff" '
                     f'stroke="#000" stroke-width="{num(u)}"/>')
        items.append(f'<rect x="{num(d - 0.4 * fs)}" y="{num(-0.25 * fs)}" width="{num(0.8 * fs)}" '
                     f'height="{num(0.25 * fs)}" fill="#000"/>')  # the foot plate
        items += _dimension_h(0.0, d, 0.18 * span, f"{d:.2f} ft to the foot", fs, u)
        if theta is not None:
            r = 0.18 * span
            a = math.radians(theta)
            items.append(f'<path d="M {num(d - r)},0 A {num(r)},{num(r)} 0 0 1 '
                         f'{num(d - r * math.cos(a))},{num(-r * math.sin(a))}" fill="none" '
                         f'stroke="#000" stroke-width="{num(u)}"/>')
            items.append(text(d - 1.15 * r, -0.25 * r - 0.2 * fs, f"{theta:.1f}°", 0.9 * fs,
                              "end"))
        if length is not None:
            items.append(text(d / 2 + 0.6 * fs, -hb / 2, f"brace {length:.2f} ft", 0.9 * fs,
                              weight="bold", fill=BRACE))
        count = b.get("count")
        if count:
            items.append(text(left + 0.3 * fs, top + 2.7 * fs, f"{count} braces", 0.9 * fs))
    return localized(px_document((left, top, right - left, bottom - top), [], items, "",
                                 px_width=SECTION_PX_WIDTH), units)


def _dimension_v(x: float, y0: float, y1: float, words: str, fs: float, u: float) -> list[str]:
    """A vertical dimension at x from height y0 to y1 (ft), its text turned along it."""
    tick = 0.3 * fs
    mid = -(y0 + y1) / 2
    return [f'<g stroke="#000" stroke-width="{num(u)}">'
            f'<line x1="{num(x)}" y1="{num(-y0)}" x2="{num(x)}" y2="{num(-y1)}"/>'
            f'<line x1="{num(x - tick)}" y1="{num(-y0)}" x2="{num(x + tick)}" y2="{num(-y0)}"/>'
            f'<line x1="{num(x - tick)}" y1="{num(-y1)}" x2="{num(x + tick)}" y2="{num(-y1)}"/>'
            '</g>',
            text(x - 0.35 * fs, mid, words, 0.8 * fs, "middle",
                 extra=f' transform="rotate(-90 {num(x - 0.35 * fs)} {num(mid)})"')]


def _dimension_h(x0: float, x1: float, y: float, words: str, fs: float, u: float) -> list[str]:
    """A horizontal dimension at screen y from x0 to x1 (ft), text below it."""
    tick = 0.3 * fs
    return [f'<g stroke="#000" stroke-width="{num(u)}">'
            f'<line x1="{num(x0)}" y1="{num(y)}" x2="{num(x1)}" y2="{num(y)}"/>'
            f'<line x1="{num(x0)}" y1="{num(y - tick)}" x2="{num(x0)}" y2="{num(y + tick)}"/>'
            f'<line x1="{num(x1)}" y1="{num(y - tick)}" x2="{num(x1)}" y2="{num(y + tick)}"/>'
            '</g>',
            text((x0 + x1) / 2, y + 1.1 * fs, words, 0.8 * fs, "middle")]


