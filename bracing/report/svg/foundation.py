"""Foundation walls on the plan (method notes §12): each wall's footprint, its backfill side
hatched on a day it is backfilled, outlined with DANGER in words where that backfill is above
what the wall takes, and its inside braces (insert to foot, the foot anchor's symbol, labelled
with their count and height) on the days they are in use; the day's values are the result's
(`SiteResult.foundation_walls`)."""

from __future__ import annotations

from dataclasses import replace

from shapely.geometry import LineString, Point, Polygon

from bracing.report.svg.labels import Label
from bracing.report.svg.style import (
    BRACE,
    DANGER,
    LABEL_MM,
    MARK_MM,
    WALL,
    anchor_symbol,
    num,
    plan_points,
)

BACKFILL = "#8a5a14"  # the backfill's hatch


def with_backfill(g, result):
    """The plan `g` with its foundation walls' state on its day from the result: built (the
    wall has a record that day), the backfill in place, whether it is over, and whether its
    inside braces are in use (no day: the highest planned, over where the wall fails, braced
    where its braces are ever in use)."""
    if g is None or not g.foundation_walls:
        return g
    by_mark = {w.mark: w for w in getattr(result, "foundation_walls", []) or []}
    walls = []
    for pw in g.foundation_walls:
        w = by_mark.get(pw.mark)
        if w is None:
            walls.append(pw)
            continue
        b = w.inside_brace
        first = None if b is None else b.in_use_from_day
        if g.day is None:
            walls.append(replace(pw, backfill_ft=w.planned_height_ft, over=w.fails,
                                 braced=first is not None))
            continue
        d = next((d for d in w.days if d.day == g.day), None)
        walls.append(replace(pw, built=d is not None,
                             backfill_ft=d.planned_height_ft if d is not None else 0.0,
                             over=bool(d is not None and d.over),
                             braced=first is not None and first <= g.day and (
                                 b.in_use_to_day is None or g.day <= b.in_use_to_day)))
    return replace(g, foundation_walls=walls)


def foundation_items(g, fr) -> list[str]:
    """The walls in plan ft (inside the frame's group): the hatch pattern, each backfilled
    wall's backfill side hatched (a danger outlined in red), then the footprints (dashed
    outline before the wall is built)."""
    if not g.foundation_walls:
        return []
    u, step = fr.ft(0.25), fr.ft(1.2)
    key = f"backfill-{fr.key}"
    out = [f'<defs><pattern id="{key}" patternUnits="userSpaceOnUse" width="{num(step)}" '
           f'height="{num(step)}" patternTransform="rotate(-45)"><line x1="0" y1="0" x2="0" '
           f'y2="{num(step)}" stroke="{BACKFILL}" stroke-width="{num(1.6 * u)}"/></pattern>'
           '</defs>']
    for w in g.foundation_walls:
        if w.built and w.backfill_ft > 0.0:
            edge = (f'stroke="{DANGER}" stroke-width="{num(3 * u)}"' if w.over else
                    f'stroke="{BACKFILL}" stroke-width="{num(u)}"')
            out.append(f'<polygon class="backfill{" danger" if w.over else ""}" '
                       f'data-mark="{w.mark}" points="{plan_points(w.backfill)}" '
                       f'fill="url(#{key})" {edge}/>')
    for w in g.foundation_walls:
        look = (f'fill="{WALL}" stroke="#000" stroke-width="{num(2.4 * u)}"' if w.built else
                f'fill="#fff" stroke="{WALL}" stroke-width="{num(u)}" '
                f'stroke-dasharray="{num(3 * u)},{num(2 * u)}"')
        out.append(f'<polygon class="foundation-wall" data-mark="{w.mark}" '
                   f'points="{plan_points(w.footprint)}" {look}/>')
    r = fr.ft(0.8)
    for w in g.foundation_walls:  # inside braces, as panels' braces are drawn
        for (ix, iy), (fx, fy) in w.braces if w.braced else []:
            out.append(f'<line class="brace inside-brace" data-mark="{w.mark}" x1="{num(ix)}" '
                       f'y1="{num(iy)}" x2="{num(fx)}" y2="{num(fy)}" stroke="{BRACE}" '
                       f'stroke-width="{num(1.8 * u)}"/>')
            out.append(anchor_symbol(w.foot_kind, fx, fy, r, 1.2 * u))
    return out


def foundation_labels(g, fr) -> list[Label]:
    """Each foundation wall's mark at the middle of its backfill side, with DANGER and its
    backfill where that is over what the wall takes."""
    out = []
    for w in g.foundation_walls:
        c = Polygon(w.backfill).centroid
        words = f"{w.mark} DANGER: backfill {w.backfill_ft:g} ft" if w.over else w.mark
        out.append(Label(f"mark:{w.mark}", words, MARK_MM, fr.xy(c.x, c.y),
                         color=DANGER if w.over else "#000"))
        if w.braced and w.braces:  # beside the middle brace's foot
            x, y = w.braces[len(w.braces) // 2][1]
            out.append(Label(f"inside:{w.mark}", f"{len(w.braces)} inside braces at "
                             f"{w.brace_height_ft:g} ft", LABEL_MM, fr.xy(x, y), color=BRACE))
    return out


def foundation_drawn(g, fr) -> list[tuple[object, float]]:
    """What labels keep off: the footprints (walls), the inside braces and their feet (as
    panels' braces), and the backfill strips (less)."""
    return ([(fr.to_sheet(Polygon(w.footprint)), 6.0) for w in g.foundation_walls]
            + [(fr.to_sheet(Polygon(w.backfill)), 0.5) for w in g.foundation_walls
               if w.built and w.backfill_ft > 0.0]
            + [item for w in g.foundation_walls if w.braced for a, b in w.braces
               for item in ((fr.to_sheet(LineString([a, b])), 3.0),
                            (fr.to_sheet(Point(b)).buffer(1.0), 6.0))])
