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

The modules: `style` (sizes, colors, text and the SVG document), `labels` (placing labels clear
of each other), `layers` (a plan frame at a scale and the plan's layers in it), `plan_labels`
(what a plan frame labels), `legend` (the legend, the zones and the findings in words),
`elevation` and `section` (one wall); this module lays out the plan sheets.
"""

from __future__ import annotations

from dataclasses import replace

import shapely
from shapely.geometry import Polygon, box

from bracing.report.svg.elevation import elevation_svg, elevation_svgs
from bracing.report.svg.foundation import foundation_labels, with_backfill
from bracing.report.svg.labels import (
    Label,
    Placed,
    boxes_overlap,
    label_box_size,
    place_labels,
    placed_items,
)
from bracing.report.svg.layers import (
    Frame,
    drawn_items,
    frame_defs,
    frame_window,
    in_window,
    north_and_scale,
    number_findings,
    pick_plan,
    plan_layers,
)
from bracing.report.svg.legend import finding_lines, legend_block, legend_items, zone_summary
from bracing.report.svg.plan_labels import (
    area_labels,
    detail_labels,
    details_words,
    finding_labels,
    mark_label,
    status_of,
    unplaced_words,
)
from bracing.report.svg.section import section_svg
from bracing.report.svg.style import (
    _NARROW,
    _WIDE,
    AREA_STYLE,
    BRACE,
    DANGER,
    DETAIL_MAX_H_MM,
    ELEVATION_MM,
    EVACUATED,
    FONT,
    GROUND,
    HALO,
    KEEP_OUT,
    LABEL_MM,
    LEAST_PLAN_MM,
    LEAST_TEXT_MM,
    MARK_MM,
    MOST_FINDINGS,
    OVERVIEW_MAX_H_MM,
    PAD_MM,
    PAGE_MM,
    PX_WIDTH,
    SCALE_ROW_MM,
    SCALES_FT_PER_IN,
    SECTION_PX_WIDTH,
    SHEET_MM,
    SLAB,
    SLAB_EDGE,
    STATUS_WORDS,
    SYMBOLS,
    TEXT_MM,
    TITLE_MM,
    WALL,
    WARNING,
    ZONE,
    anchor_symbol,
    caution_box,
    hatch_defs,
    lines_block,
    localized,
    mm_document,
    num,
    text_width,
    wrap,
)

__all__ = [
    "AREA_STYLE",
    "BRACE",
    "DANGER",
    "DETAIL_MAX_H_MM",
    "ELEVATION_MM",
    "EVACUATED",
    "FONT",
    "GROUND",
    "HALO",
    "KEEP_OUT",
    "LABEL_MM",
    "LEAST_PLAN_MM",
    "LEAST_TEXT_MM",
    "MARK_MM",
    "MOST_FINDINGS",
    "OVERVIEW_MAX_H_MM",
    "PAD_MM",
    "PAGE_MM",
    "PX_WIDTH",
    "SCALES_FT_PER_IN",
    "SCALE_ROW_MM",
    "SECTION_PX_WIDTH",
    "SHEET_MM",
    "SLAB",
    "SLAB_EDGE",
    "STATUS_WORDS",
    "SYMBOLS",
    "TEXT_MM",
    "TITLE_MM",
    "WALL",
    "WARNING",
    "ZONE",
    "_NARROW",
    "_WIDE",
    "Label",
    "Placed",
    "anchor_symbol",
    "boxes_overlap",
    "detail_svgs",
    "elevation_svg",
    "elevation_svgs",
    "label_box_size",
    "overview_svg",
    "pick_plan",
    "place_labels",
    "plan_svg",
    "section_svg",
    "text_width",
    "wrap",
    "zone_summary",
]

def _labels(g, fr: Frame, numbered, marks: list[str] | None, status, details=(),
            own=None) -> tuple[list[str], list[str]]:
    """The frame's labels placed clear of each other and of the drawing: wall marks (`marks`;
    None: the detail plans' numbers instead; `own`: the marks drawn in black, None: all),
    finding numbers, then area names: (SVG items, the words of labels that found no room)."""
    lines = {line.name: line for line in g.lines}
    wanted = []
    if marks is None:
        wanted += detail_labels(g, fr, details)
    else:
        wanted += [mark_label(p, lines[p.line], fr, status, own is None or p.mark in own)
                   for p in g.panels if p.mark in marks and p.line in lines]
    wanted += foundation_labels(g, fr) + finding_labels(numbered, fr) + area_labels(g, fr)
    x0, y0, x1, y1 = fr.box
    wanted = [replace(w, at=(min(max(w.at[0], x0), x1), min(max(w.at[1], y0), y1)))
              for w in wanted]  # a point outside: the frame's edge
    placed = place_labels(wanted, drawn_items(g, fr, numbered),
                          (x0 + 0.5, y0 + 0.5, x1 - 0.5, y1 - 0.5))
    missing = [w.words for w, p in zip(wanted, placed, strict=True) if p is None]
    return north_and_scale(fr) + placed_items(placed), missing


def _day_words(g) -> str:
    """The day of a plan in words ('day 3'; 'all walls placed' with no day)."""
    return f"day {g.day}" if g.day is not None else "all walls placed"


def _overview_sheet(result, g, key: str, units: str = "us"
                    ) -> tuple[list[str], list[str], float]:
    """The overview sheet, on one page (`PAGE_MM` tall at most: the plan frame takes the room
    the texts leave, no more than `OVERVIEW_MAX_H_MM`; when the findings leave too little, the
    fewest are listed and the rest counted): (defs, items, height in mm)."""
    numbered = number_findings(g.findings)
    details = g.details()
    name = getattr(result, "name", "")
    standing = g.standing
    items, y = lines_block([
        (f"Site plan, {_day_words(g)}: {name}", TITLE_MM, "bold", "#000"),
        (f"Overview. Standing ({len(standing)}): {', '.join(standing) or 'none'}",
         LEAST_TEXT_MM, "normal", "#000")], PAD_MM)
    caution, y = caution_box(getattr(result, "caution", ""), y + 1.5)
    items += caution

    def tail(top: float, most: int) -> tuple[list[str], float]:
        """What stands under the plan frame from `top` down, listing `most` findings at most:
        (items, the y below them)."""
        words = [details_words(details)] if details else []
        out, yy = lines_block([(w, LEAST_TEXT_MM, "normal", "#000") for w in words],
                              top + SCALE_ROW_MM)
        legend, yy = legend_block(legend_items(g.panels, g.areas, g.foundation_walls), yy + 1.0,
                                  key + "L")
        more, yy = lines_block([(s, LEAST_TEXT_MM, "normal", "#000")
                                for s in zone_summary(g.panels)]
                               + finding_lines(numbered, most=most), yy + 0.5)
        return out + legend + more, yy + PAD_MM

    most = MOST_FINDINGS
    while most > 0 and PAGE_MM - (y + 1.5) - tail(0.0, most)[1] < LEAST_PLAN_MM:
        most -= 1
    room = max(PAGE_MM - (y + 1.5) - tail(0.0, most)[1], LEAST_PLAN_MM)
    fr = Frame(frame_window(g.bounds, 0.04 * max(g.bounds[2] - g.bounds[0],
                                                 g.bounds[3] - g.bounds[1], 10.0)),
               y + 1.5, min(OVERVIEW_MAX_H_MM, room), key, units)
    widths = [p.width_ft for p in g.panels if p.standing]
    one_by_one = bool(widths) and min(widths) * fr.k >= 1.3 * max(
        text_width(m, MARK_MM, True) for m in standing)
    labels, placed = _labels(g, fr, numbered, standing if one_by_one else None,
                             status_of(result), details)
    items += plan_layers(g, fr, numbered) + labels
    more, y = tail(fr.top + fr.height, most)
    unplaced = unplaced_words(placed).strip()
    if unplaced:
        note, y = lines_block([(unplaced, LEAST_TEXT_MM, "normal", "#000")], y - PAD_MM)
        more += note
        y += PAD_MM
    return frame_defs(fr) + hatch_defs(key + "L", 1.2, 0.25), items + more, y


def _detail_sheet(result, g, d, number: tuple[int, int], key: str, *, standalone: bool,
                  units: str = "us") -> tuple[list[str], list[str], float]:
    """One detail plan sheet, detail `number` = (i, of n): (defs, items, height in mm)."""
    i, n = number
    numbered = number_findings(g.findings)
    stretch = f", part {d.part} of {d.parts}" if d.parts > 1 else ""
    walls = d.marks[0] if len(d.marks) == 1 else f"{d.marks[0]} to {d.marks[-1]}"
    items, y = lines_block([
        (f"Detail {i} of {n}, {_day_words(g)}: {d.line}{stretch}, walls {walls}", TITLE_MM,
         "bold", "#000")], PAD_MM)
    fr = Frame(frame_window(d.bounds, 6.0), y + 1.5, DETAIL_MAX_H_MM, key, units)
    labels, placed = _labels(g, fr, numbered, _marks_in(g, fr), status_of(result),
                             own=set(d.marks))
    items += plan_layers(g, fr, numbered) + labels
    y = fr.top + fr.height
    inside = {m for m, f in numbered if any(in_window(pt, fr.window) for pt in f.at)
              or (f.mark in d.marks and not f.at)}
    shown = [p for p in g.panels if p.mark in d.marks]
    areas = [a for a in g.areas if shapely.intersects(
        shapely.make_valid(Polygon(a.coords)), box(*fr.window))] if g.areas else []
    more, y = lines_block([(f"Walls on this detail: {', '.join(d.marks)}."
                            + unplaced_words(placed), LEAST_TEXT_MM, "normal", "#000")],
                          y + SCALE_ROW_MM)
    items += more
    legend, y = legend_block(legend_items(shown, areas), y + 1.0, key + "L")
    items += legend
    more, y = lines_block([(s, LEAST_TEXT_MM, "normal", "#000") for s in zone_summary(shown)]
                          + finding_lines(numbered, inside), y + 0.5)
    items += more
    if standalone:
        caution, y = caution_box(getattr(result, "caution", ""), y + 1.5)
        items += caution
    return frame_defs(fr) + hatch_defs(key + "L", 1.2, 0.25), items, y + PAD_MM


def _marks_in(g, fr: Frame) -> list[str]:
    """The walls standing whose face's middle lies inside the frame."""
    out = []
    for p in g.panels:
        (x0, y0), (x1, y1) = p.face
        if p.standing and in_window(((x0 + x1) / 2, (y0 + y1) / 2), fr.window):
            out.append(p.mark)
    return out


def _key(g, what: str) -> str:
    """Ids of one drawing's clip paths and patterns: the same for the same day and drawing, so
    that drawings inlined in one HTML page never take another's."""
    return f"{what}{g.day if g.day is not None else 'all'}"


def overview_svg(result, day: int | None = None, *, units: str = "us") -> str:
    """The whole site on one letter-width sheet (`SHEET_MM` wide, mm units): title, the
    caution, the plan at a standard scale with each wall line named (or each wall where there is
    room), the legend, the zones summarized by rule and the numbered findings. `day`: the day
    (None: the busiest). A sheet saying so when the result has no plan. `units`: 'us' or 'si'
    (the words and the scale; the drawing stays in ft inside)."""
    g = with_backfill(pick_plan(getattr(result, "plan", None), day), result)
    if g is None:
        return _no_plan_svg(result)
    defs, items, h = _overview_sheet(result, g, _key(g, "ov"), units)
    return localized(mm_document(defs, items, h, getattr(result, "caution", "")), units)


def detail_svgs(result, day: int | None = None, standalone: bool = False, *,
                units: str = "us") -> list[tuple]:
    """The detail plans of a day, one per wall line standing (a long line in stretches of at most
    `plan.DETAIL_LONGEST_FT`), each `SHEET_MM` wide in mm, at a standard scale at which marks,
    braces, anchors and zones stand apart: a list of (`bracing.plan.Detail`, SVG text). Each
    names its walls, lists the findings inside it and, with `standalone`, carries the caution
    (a crew sheet that shows the caution on the page need not repeat it). `units`: 'us' or 'si'
    (the words and the scale; the drawing stays in ft inside)."""
    g = with_backfill(pick_plan(getattr(result, "plan", None), day), result)
    if g is None:
        return []
    details = g.details()
    out = []
    for i, d in enumerate(details, 1):
        defs, items, h = _detail_sheet(result, g, d, (i, len(details)), _key(g, f"dt{i}-"),
                                       standalone=standalone, units=units)
        out.append((d, localized(mm_document(defs, items, h, getattr(result, "caution", "")),
                                 units)))
    return out


def plan_svg(result, day: int | None = None, *, units: str = "us") -> str:
    """The plan of a day as one printable SVG (what `bracing plan` writes): the overview sheet
    with the caution, then each detail plan below it. `day`: None for the busiest day;
    `units`: 'us' or 'si'."""
    g = with_backfill(pick_plan(getattr(result, "plan", None), day), result)
    if g is None:
        return _no_plan_svg(result)
    defs, items, y = _overview_sheet(result, g, _key(g, "ov"), units)
    details = g.details()
    for i, d in enumerate(details, 1):
        more_defs, more, h = _detail_sheet(result, g, d, (i, len(details)),
                                           _key(g, f"dt{i}-"), standalone=False, units=units)
        defs += more_defs
        items += [f'<line x1="0" y1="{num(y + 2)}" x2="{num(SHEET_MM)}" y2="{num(y + 2)}" '
                  'stroke="#000" stroke-width="0.3" stroke-dasharray="2,1"/>',
                  f'<g transform="translate(0 {num(y + 4)})">', *more, "</g>"]
        y += 4 + h
    return localized(mm_document(defs, items, y, getattr(result, "caution", "")), units)


def _no_plan_svg(result) -> str:
    """A sheet saying there is no plan to draw, with the caution."""
    items, y = lines_block([(f"Site plan: {getattr(result, 'name', '')}", TITLE_MM, "bold",
                             "#000"),
                            ("No plan to draw: no wall is placed on a wall line.", TEXT_MM,
                              "normal", "#000")], PAD_MM)
    caution, y = caution_box(getattr(result, "caution", ""), y + 1.5)
    return mm_document([], items + caution, y + PAD_MM, getattr(result, "caution", ""))


