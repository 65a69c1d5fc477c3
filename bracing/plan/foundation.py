"""Foundation walls on the plan (method notes §12): each wall placed along its wall line like a
panel (its offset from the line's start, a thickness-deep strip behind the line, on the side
away from the braced side), a strip of ground beyond it on its backfill side, and its inside
braces on the braced side at their places along it (the engine's `positions_along`, the foot
at `braces.anchor_distance_for_angle` from the inside face, as the result has them)."""

from __future__ import annotations

import numpy as np

from bracing import braces
from bracing.model import Site
from bracing.plan.placement import braced_normal, wall_point
from bracing.plan.records import IN_PER_FT, PlanFoundationWall
from bracing.stages.foundation_braces import positions_along

BACKFILL_STRIP_FT = 4.0  # how deep the backfill side is drawn on the plan (a picture, no value)


def foundation_walls(site: Site) -> list[PlanFoundationWall]:
    """The site's foundation walls that name a wall line, placed along it."""
    lines = {line.name: line for line in site.lines}
    out = []
    for w in site.foundation_walls:
        line = lines.get(w.line) if w.line is not None else None
        if line is None:
            continue
        start, end = np.array(line.start, dtype=float), np.array(line.end, dtype=float)
        u = (end - start) / (np.hypot(*(end - start)) or 1.0)
        n = braced_normal(u, 1.0 if line.braced_side == "left" else -1.0)
        t = w.thickness / IN_PER_FT

        def ring(out_from: float, out_to: float, u=u, n=n, w=w, start=start):
            along = np.array([0.0, w.length, w.length, 0.0, 0.0])
            out_ = np.array([out_from, out_from, out_to, out_to, out_from])
            origin = wall_point(start, u, n, w.offset, 0.0)
            return [tuple(p) for p in wall_point(origin, u, n, along, out_).tolist()]

        origin = wall_point(start, u, n, w.offset, 0.0)
        out.append(PlanFoundationWall(mark=w.mark, line=line.name, footprint=ring(0.0, -t),
                                      backfill=ring(-t, -t - BACKFILL_STRIP_FT),
                                      **_inside_braces(site, w, origin, u, n)))
    return out


def _inside_braces(site: Site, w, origin, u, n) -> dict:
    """The plan fields of a wall's inside braces: each (insert on the inside face, foot) and
    their foot anchor's kind (none: no fields)."""
    b = w.inside_braces
    if b is None:
        return {}
    along = np.array(positions_along(w.length, b.spacing))
    foot = float(braces.anchor_distance_for_angle(b.height, b.angle))
    inserts = wall_point(origin, u, n, along, np.zeros_like(along)).tolist()
    feet = wall_point(origin, u, n, along, np.full_like(along, foot)).tolist()
    kind = site.anchor_types[b.foot_anchor].kind if b.foot_anchor else ""
    return {"braces": [(tuple(a), tuple(f)) for a, f in zip(inserts, feet, strict=True)],
            "foot_kind": kind, "brace_height_ft": b.height}
