"""Foundation walls on the plan (method notes §12): each wall's footprint, its backfill side
hatched on a day it is backfilled, outlined with DANGER in words where that backfill is above
what the wall takes; the day's values are the result's (`SiteResult.foundation_walls`)."""

from __future__ import annotations

from dataclasses import replace

from shapely.geometry import Polygon

from bracing.report.svg.labels import Label
from bracing.report.svg.style import DANGER, MARK_MM, WALL, num, plan_points

BACKFILL = "#8a5a14"  # the backfill's hatch


def with_backfill(g, result):
    """The plan `g` with its foundation walls' state on its day from the result: built (the
    wall has a record that day), the backfill in place and whether it is over (no day: the
    highest planned, over where the wall fails)."""
    if g is None or not g.foundation_walls:
        return g
    by_mark = {w.mark: w for w in getattr(result, "foundation_walls", []) or []}
    walls = []
    for pw in g.foundation_walls:
        w = by_mark.get(pw.mark)
        if w is None:
            walls.append(pw)
            continue
        if g.day is None:
            walls.append(replace(pw, backfill_ft=w.planned_height_ft, over=w.fails))
            continue
        d = next((d for d in w.days if d.day == g.day), None)
        walls.append(replace(pw, built=d is not None,
                             backfill_ft=d.planned_height_ft if d is not None else 0.0,
                             over=bool(d is not None and d.over)))
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
    return out


def foundation_drawn(g, fr) -> list[tuple[object, float]]:
    """What labels keep off: the footprints (walls) and the backfill strips (less)."""
    return ([(fr.to_sheet(Polygon(w.footprint)), 6.0) for w in g.foundation_walls]
            + [(fr.to_sheet(Polygon(w.backfill)), 0.5) for w in g.foundation_walls
               if w.built and w.backfill_ft > 0.0])
