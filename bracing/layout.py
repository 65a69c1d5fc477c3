"""The layout designer: the fewest braces that pass every check (method notes §4, issue on braces).

For each wall it tries, from the fewest braces allowed upward, a grid of insert heights (from
the site's lowest insert ratio to 85 % of the height), brace angles (within the site's range)
and every brace and foot-anchor type offered, all candidates of a brace count checked in one
vectorised pass. The first count with a passing candidate wins; among those, the lowest
governing utilization. When nothing passes it says which element stops it and what would help.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from bracing import braces
from bracing.model import Bracing, Site
from bracing.stages import brace_set as braced_layouts
from bracing.stages import braced

INSERT_RATIO_TOP = 0.85  # highest insert tried, as a share of the wall height (common practice)
INSERT_STEPS = 5
ANGLE_STEP_DEG = 2.5

ADVICE = {
    "brace compression": "a stronger or shorter brace, a knee brace or lateral struts, "
                         "or more braces",
    "brace tension": "a brace with a higher tension rating",
    "brace end fittings": "end fittings with a higher rating",
    "wall insert": "an insert with a higher rating, or more braces",
    "foot anchor": "another foot anchor (deeper embedment, a helical anchor or a deadman)",
    "deadman uplift": "a heavier deadman, or a flatter brace",
    "deadman sliding": "a heavier deadman or one keyed into the ground",
    "deadman overturning": "a longer or heavier deadman, or the brace pinned lower on it",
    "deadman bearing": "a longer or wider deadman, or the brace pinned lower on it",
    "base uplift": "flatter braces (a smaller angle) or a heavier wall base",
    "base kick-out": "a base restraint (dowels, a shoe or a kicker), or an insert nearer the "
                     "wind's resultant",
    "wall bending": "an insert nearer the top, or two rows of braces",
}


@dataclass
class Design:
    """The designer's answer for one wall: a layout, or why none was found."""

    panel: int
    layout: Bracing | None
    utilization: float
    governing: str
    message: str


def design(site: Site, rows: list[int], walls, wind, factors, minimum_psf,
           held: tuple = ()) -> list[Design]:
    """Design bracing for the walls `rows` of the site (they need braces and have none);
    `held`: the lateral loads that do not grow with the wind (stages.loads.fixed_loads)."""
    options = site.design
    least = int(site.rule_value("minimum_braces_per_panel") or 1)
    lo = site.rule_value("brace_angle_min_deg") or 45.0
    hi = site.rule_value("brace_angle_max_deg") or 60.0
    ratio = site.rule_value("insert_min_height_ratio") or 0.5
    angles = np.arange(lo, hi + 1e-9, ANGLE_STEP_DEG)
    ratios = np.linspace(ratio, max(ratio, INSERT_RATIO_TOP), INSERT_STEPS)
    feet = options.foot_anchors or [None]
    combos = [(b, a, r, t) for b in options.brace_types for a in feet
              for r in ratios for t in angles]
    if not combos or least > options.most_braces:
        why = ("the site's brace angle range is empty" if not len(angles) else
               f"the minimum of {least} braces is above most_braces ({options.most_braces})")
        return [Design(w, None, np.inf, "", f"no layout can be tried: {why}") for w in rows]
    pending = np.array(rows)
    best: dict[int, Design] = {}
    for count in range(least, options.most_braces + 1):
        if len(pending) == 0:
            break
        wall, column, angle = _candidates(options, combos, pending, walls)
        insert = column["insert_height"]
        positions = braces.default_positions(walls.width[wall][:, None], count)
        bs = braced_layouts.brace_set(site, wall, positions, np.full(len(wall), np.nan), angle,
                                      column, site.site.design_basis)
        checks, _ = braced.braced_checks(walls, wind, bs, factors, minimum_psf, held=held)
        util, element = _governing(checks)
        usable = ~(np.nan_to_num(bs.slenderness) > np.nan_to_num(bs.slenderness_limit,
                                                                 nan=np.inf))
        if options.room is not None:
            usable &= bs.anchor_distance <= options.room + 1e-9
        shape = (len(pending), len(combos))
        passing = (usable & (util <= 1.0)).reshape(shape)
        ranked = np.where(usable, util, np.inf).reshape(shape)
        pick_best = np.where(passing.any(axis=1),
                             np.argmin(np.where(passing, ranked, np.inf), axis=1),
                             np.argmin(ranked, axis=1))
        choice = np.arange(len(pending)) * len(combos) + pick_best
        done = []
        for w, j in zip(pending, choice, strict=True):
            layout = Bracing(brace_type=column["brace_type"][j],
                             wall_anchor=column["wall_anchor"][j],
                             foot_anchor=column["foot_anchor"][j], count=count,
                             insert_height=float(insert[j]),
                             angle=float(angle[j]), insert_offset=options.insert_offset,
                             foot_offset=options.foot_offset)
            best[int(w)] = Design(int(w), layout, float(util[j]), str(element[j]), "")
            if usable[j] and util[j] <= 1.0:
                done.append(w)
        pending = np.array([w for w in pending if w not in done])
    for w in pending:
        d = best[int(w)]
        d.message = (f"no layout with up to {options.most_braces} braces passes: the best "
                     f"reaches utilization {d.utilization:.2f} in {d.governing}; try "
                     f"{ADVICE.get(d.governing, 'another brace or anchor')}")
        d.layout = None
    return [best[int(w)] for w in rows]


def _candidates(options, combos: list[tuple], pending: np.ndarray, walls):
    """Every candidate layout of each pending wall, one row each: (wall, layout columns as
    `brace_set` reads them, angle)."""
    wall = np.repeat(pending, len(combos))
    pick = np.tile(np.arange(len(combos)), len(pending))
    n = len(wall)
    column = {
        "insert_height": walls.height[wall] * np.array([combos[j][2] for j in pick]),
        "insert_offset": np.full(n, options.insert_offset),
        "foot_offset": np.full(n, options.foot_offset),
        "base_below_slab": np.zeros(n),
        "lean": np.full(n, 0.25), "slop": np.full(n, 0.125),
        "pretensioned": np.zeros(n, dtype=bool),
        "brace_type": np.array([combos[j][0] for j in pick], dtype=object),
        "wall_anchor": np.full(n, options.wall_anchor, dtype=object),
        "foot_anchor": np.array([combos[j][1] for j in pick], dtype=object),
    }
    return wall, column, np.array([combos[j][3] for j in pick])


def _governing(checks: dict) -> tuple[np.ndarray, np.ndarray]:
    """Largest strength utilization of each candidate and the element that gives it."""
    names = [k for k in checks if k not in braced.SERVICEABILITY]
    with np.errstate(divide="ignore", invalid="ignore"):
        ratios = np.stack([np.where(np.isnan(checks[k][0]), 0.0,
                                    np.where(checks[k][1] > 0, checks[k][0] / checks[k][1],
                                             np.inf)) for k in names])
    top = np.argmax(ratios, axis=0)
    return ratios.max(axis=0), np.array(names)[top]


def with_designs(site: Site, designs: list[Design]) -> Site:
    """A copy of the site with the designed layouts set on their walls."""
    panels = list(site.panels)
    for d in designs:
        if d.layout is not None:
            panels[d.panel] = panels[d.panel].model_copy(update={"bracing": d.layout})
    return site.model_copy(update={"panels": panels})
