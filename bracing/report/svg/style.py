"""Sizes, colors and the small pieces every drawing is made of: numbers and text in SVG, text
widths and wrapping, blocks of lines, the caution box, hatch patterns, anchor symbols and the
SVG documents themselves."""

from __future__ import annotations

import re
from xml.sax.saxutils import escape, quoteattr

from bracing.anchor_kinds import KINDS as ANCHOR_KINDS

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


def num(v: float) -> str:
    """A coordinate for SVG, to 1/1000 of its unit."""
    s = f"{v:.3f}".rstrip("0").rstrip(".")
    return "0" if s in ("-0", "") else s


def plan_points(coords) -> str:
    """Points for a plan group, which turns y over itself."""
    return " ".join(f"{num(x)},{num(y)}" for x, y in coords)


def text(x, y, words, size, anchor="start", weight="normal", fill="#000", extra="") -> str:
    """An SVG text element at (x, y) in the drawing's units, its words escaped."""
    return (f'<text x="{num(x)}" y="{num(y)}" font-size="{num(size)}" text-anchor="{anchor}" '
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
    line stands on its own; a number stays with its unit (so that `localized` finds both)."""
    lines: list[str] = []
    for word in (w.replace("\0", " ") for w in _NUMBER_UNIT.sub("\\1\0", str(words)).split()):
        if lines and text_width(f"{lines[-1]} {word}", size, bold) <= width:
            lines[-1] = f"{lines[-1]} {word}"
        else:
            lines.append(word)
    return lines or [""]


SYMBOLS = ("disc", "crossed circle", "square", "triangle", "diamond", "open")  # anchor_symbol's


def anchor_symbol(kind: str, x: float, y: float, r: float, w: float, up: float = 1.0) -> str:
    """The symbol of a foot anchor of each kind (the shape its entry in anchor_kinds names) at
    (x, y), radius r, line width w, in the units of the drawing it goes in; `up` is +1 where y
    points up on paper (a plan group), -1 where it points down."""
    sx, sy = num(x), num(y)
    shape = ANCHOR_KINDS[kind].symbol if kind in ANCHOR_KINDS else "open"  # SYMBOLS
    if shape == "disc":
        return f'<circle class="anchor" cx="{sx}" cy="{sy}" r="{num(r)}" fill="#000"/>'
    if shape == "crossed circle":
        return (f'<g class="anchor" stroke="#000" stroke-width="{num(w)}"><circle cx="{sx}" '
                f'cy="{sy}" r="{num(r)}" fill="#fff"/><line x1="{num(x - r)}" y1="{sy}" '
                f'x2="{num(x + r)}" y2="{sy}"/><line x1="{sx}" y1="{num(y - r)}" x2="{sx}" '
                f'y2="{num(y + r)}"/></g>')
    if shape == "square":
        return (f'<rect class="anchor" x="{num(x - r)}" y="{num(y - r)}" width="{num(2 * r)}" '
                f'height="{num(2 * r)}" fill="#000"/>')
    if shape == "triangle":  # an open triangle, point up on paper
        return (f'<polygon class="anchor" points="{num(x)},{num(y + up * 1.2 * r)} {num(x - r)},'
                f'{num(y - up * 0.8 * r)} {num(x + r)},{num(y - up * 0.8 * r)}" fill="#fff" '
                f'stroke="#000" stroke-width="{num(w)}"/>')
    if shape == "diamond":
        return (f'<polygon class="anchor" points="{num(x)},{num(y - r)} {num(x + r)},{sy} '
                f'{num(x)},{num(y + r)} {num(x - r)},{sy}" fill="#000"/>')
    return (f'<circle class="anchor" cx="{sx}" cy="{sy}" r="{num(r)}" fill="#fff" stroke="#000" '
            f'stroke-width="{num(w)}"/>')


# --- sheets -------------------------------------------------------------------------------------
def lines_block(lines, y: float, x: float = PAD_MM, width: float = SHEET_MM - 2 * PAD_MM,
                extra: str = "") -> tuple[list[str], float]:
    """(words, size, weight, color) lines, each wrapped to `width`, from `y` down; (items, the
    y below them)."""
    out = []
    for words, size, weight, color in lines:
        for k, part in enumerate(wrap(words, size, width - 1.5 * size, weight == "bold")):
            y += 1.25 * size
            out.append(text(x + (1.5 * size if k else 0.0), y, part, size, weight=weight,
                            fill=color, extra=extra))
    return out, y


def caution_box(caution: str, y: float) -> tuple[list[str], float]:
    """The caution in a tinted box across the sheet from `y` down: (items, the y below it)."""
    inner = SHEET_MM - 2 * PAD_MM - 3.0
    lines = wrap(caution, TEXT_MM, inner, bold=True)
    h = len(lines) * 1.25 * TEXT_MM + 1.6
    out = [f'<rect x="{num(PAD_MM)}" y="{num(y)}" width="{num(SHEET_MM - 2 * PAD_MM)}" '
           f'height="{num(h)}" fill="#fff8e1" stroke="#000" stroke-width="0.35"/>']
    for i, words in enumerate(lines):
        out.append(text(PAD_MM + 1.5, y + 0.5 + (i + 1) * 1.25 * TEXT_MM - 0.25 * TEXT_MM,
                        words, TEXT_MM, weight="bold", extra=' class="caution"'))
    return out, y + h


def hatch_defs(key: str, step: float, u: float) -> list[str]:
    """The hatch patterns of the area kinds and of slab holes, `step` apart, lines `1.6 u` wide; ids
    end in `key`."""
    out = []
    hatches = {f"hatch-{k}": (c, a) for k, (c, a, _) in AREA_STYLE.items() if a is not None}
    hatches["hatch-hole"] = ("#4d4d4d", 45)
    for name, (color, angle) in hatches.items():
        out.append(f'<pattern id="{name}-{key}" patternUnits="userSpaceOnUse" '
                   f'width="{num(step)}" height="{num(step)}" patternTransform="rotate({angle})">'
                   f'<line x1="0" y1="0" x2="0" y2="{num(step)}" stroke="{color}" '
                   f'stroke-width="{num(1.6 * u)}"/></pattern>')
    return out


def mm_document(defs: list[str], items: list[str], height: float, caution: str) -> str:
    """An SVG sheet `SHEET_MM` wide laid out in mm (its viewBox), the caution in its desc."""
    return "\n".join([
        '<?xml version="1.0" encoding="UTF-8"?>',
        f'<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="{num(SHEET_MM)}mm" '
        f'height="{num(height)}mm" viewBox="0 0 {num(SHEET_MM)} {num(height)}" '
        f'font-family={quoteattr(FONT)}>',
        f"<desc>{escape(caution)}</desc>",
        "<defs>", *defs, "</defs>",
        f'<rect x="0" y="0" width="{num(SHEET_MM)}" height="{num(height)}" fill="#fff"/>',
        *items, "</svg>", ""])


def px_document(view: tuple[float, float, float, float], defs: list[str], items: list[str],
                caution: str, px_width: int = PX_WIDTH) -> str:
    """An SVG drawing `px_width` px wide on screen of the `view` (x, y, width, height in the
    drawing's units), the caution in its desc."""
    x, y, w, h = view
    px_h = px_width * h / w
    return "\n".join([
        '<?xml version="1.0" encoding="UTF-8"?>',
        f'<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="{px_width}" '
        f'height="{px_h:.0f}" viewBox="{num(x)} {num(y)} {num(w)} {num(h)}" '
        f'font-family={quoteattr(FONT)}>',
        f"<desc>{escape(caution)}</desc>",
        "<defs>", *defs, "</defs>",
        f'<rect x="{num(x)}" y="{num(y)}" width="{num(w)}" height="{num(h)}" fill="#fff"/>',
        *items, "</svg>", ""])




_TEXT_NODE = re.compile(r">([^<>]+)<")
_NUMBER_UNIT = re.compile(r"(\d) (?=(?:mph|ft|ft²|lbf?|lbs|psf|pcf|plf|psi|kips?|in)\b)")


def localized(svg_text: str, units: str) -> str:
    """A drawing's words in the chosen unit system: every text node through the text views'
    one formatter (`bracing.report.text.localize`); the geometry (attributes) is untouched and
    stays in ft inside. Unchanged for 'us'."""
    if units != "si":
        return svg_text
    from bracing.report.text import localize  # the views' formatter (no import cycle at load)

    return _TEXT_NODE.sub(lambda m: ">" + localize(m.group(1), units) + "<", svg_text)
