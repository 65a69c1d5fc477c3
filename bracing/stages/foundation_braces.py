"""Foundation walls on inside braces (method notes §12): the braces' capacities, the propped
wall's checks and its limit; named in `bracing.stages.foundation`.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

import numpy as np

from bracing import backfill, braces
from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.model import Site
from bracing.results import Check
from bracing.stages import loads
from bracing.stages.brace_set import _brace_capacity
from bracing.stages.foundation_cantilever import Windward

# NDS 2018 Table 2.3.2: two months' duration 1.15 against the wind's 1.6; a lumber brace's
# capacity at CD 1.6 scaled by 1.15 / 1.6 is conservative (CP rises as Fc* falls).
LUMBER_EARTH_SCALE = 1.15 / 1.6


@dataclass(frozen=True)
class Support:
    """Inside braces as the site gives them, their capacities worked out."""

    spec: object        # model.foundation.InsideBraces
    brace: backfill.InsideBrace
    length: float
    foot_distance: float  # of the brace foot from the wall's inside face, ft
    source: str
    anchor: object      # model.AnchorType or None


def support_of(site: Site, spec) -> Support | None:
    """The inside braces' allowable compression (§6's capacities, ASD) at their length."""
    if spec is None:
        return None
    bt = site.brace_types[spec.brace_type]
    foot = float(braces.anchor_distance_for_angle(spec.height, spec.angle))
    length = float(braces.brace_geometry(spec.height, foot)[3])
    capacity = float(np.nan_to_num(_brace_capacity(bt, np.array([length]), spec.angle,
                                                   "ASD")[0])[0])
    source = {"rated": "maker's rated load at its length", "pipe": "AISC 360-16 E3, Pn/Ωc",
              "lumber": "NDS 2018 §3.7.1, CD 1.15 (two months)",
              "unrated": "no rating given"}[bt.kind]
    if bt.kind == "lumber":
        capacity *= LUMBER_EARTH_SCALE
    anchor = site.anchor_types[spec.foot_anchor] if spec.foot_anchor else None
    return Support(spec=spec, brace=backfill.InsideBrace(
        height=spec.height, spacing=spec.spacing, angle=spec.angle, capacity=capacity),
        length=length, foot_distance=foot, source=source, anchor=anchor)


def count_along(length: float, spacing: float) -> int:
    """Braces along a wall `length` ft long at most `spacing` ft apart: one at the centre of each
    of ceil(L / s) equal strips (braces.default_positions), so none carries more than the `s` ft
    of wall its force R s / cos(theta) takes (statics; method notes §12)."""
    return max(1, math.ceil(length / spacing - 1e-9))


def positions_along(length: float, spacing: float) -> list[float]:
    """Each inside brace's place along the wall, ft from its start: the centres of the
    `count_along` equal strips (braces.default_positions, method notes §4 and §12)."""
    return [float(x) for x in braces.default_positions(length, count_along(length, spacing))]


def braced(wall, soil, wind: Windward, height: float, s: Support) -> list:
    """The propped wall's checks (bracing.backfill.braced_checks) with the wind on the part
    above the backfill (the span, the part above the brace and the braces' reaction, method
    notes §12: 1.0W beside 1.6H, 0.6W beside 1.0H), and its foot anchor."""
    exposed = max(wall.height - height, 0.0)
    pressure = float(wind.pressure(exposed)) if exposed else 0.0
    factors = (loads.COMBINATIONS["LRFD"].wind, loads.COMBINATIONS["ASD"].wind)
    checks = []
    for c in backfill.braced_checks(wall, soil, height, s.brace, (pressure, *factors)):
        if c.element == "inside brace":
            c = replace(c, source=f"{s.source}; {backfill.BRACE_REACTION}")
        checks.append(c)
    if s.anchor is not None:
        checks.append(anchor_check(s, _axial(checks)))
    return checks


def scalars(checks: list) -> list:
    """Checks of one height with plain float demands and capacities (for the records)."""
    return [replace(c, demand=float(c.demand), capacity=float(c.capacity)) for c in checks]


def _axial(checks: list) -> float:
    return next(c.demand for c in checks if c.element == "inside brace")


def anchor_check(s: Support, axial: float) -> Check:
    """The brace foot in compression: it pushes the anchor away from the wall (P cos theta)
    and bears down (no uplift), against the anchor kind's allowable capacities (§6)."""
    fa = s.anchor
    kind = ANCHOR_KINDS[fa.kind]
    caps = kind.capacity(fa, np.inf, "ASD")
    push = axial * math.cos(math.radians(s.spec.angle))
    if kind.ratio is not None:
        value = float(kind.ratio(0.0, push, axial, caps.get("foot_tension", np.nan),
                                 caps.get("foot_shear", np.nan)))
        source = kind.source
    else:  # a deadman: sliding by friction on its weight alone (the push down not credited)
        value = float(push / (caps["foot_mu"] * caps["foot_tension"]))
        source = "weight and friction, the brace's push down not credited"
    return Check(element="brace foot anchor", region=kind.words, demand=value, capacity=1.0,
                 unit="ratio", combination=backfill.ALLOWABLE[1] + " + 0.6W", source=source)


def braced_max(wall, soil, wind, s: Support) -> float:
    """The highest backfill the braced wall takes (bisection, every check afresh)."""
    def worst(heights):
        return np.array([backfill.governing(braced(wall, soil, wind, float(h), s))
                         for h in np.atleast_1d(heights)]).reshape(np.shape(heights))
    return float(backfill.solve_max(worst, wall.height, iterations=30))
