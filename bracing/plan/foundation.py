"""Foundation walls on the plan (method notes §12): each wall placed along its wall line like a
panel (its offset from the line's start, a thickness-deep strip behind the line, on the side
away from the braced side), and a strip of ground beyond it on its backfill side."""

from __future__ import annotations

import numpy as np

from bracing.model import Site
from bracing.plan.placement import braced_normal, wall_point
from bracing.plan.records import IN_PER_FT, PlanFoundationWall

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

        out.append(PlanFoundationWall(mark=w.mark, line=line.name, footprint=ring(0.0, -t),
                                      backfill=ring(-t, -t - BACKFILL_STRIP_FT)))
    return out
