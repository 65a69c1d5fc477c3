"""Backfill against a wall before the floor gives it top support (method notes §12).

Small pure formulas over floats or numpy arrays. Per foot of wall: forces in lb, moments in
lb-ft, heights in ft, thicknesses and depths in in, stresses in psi, pressures in psf and
equivalent fluid pressures in psf per ft of depth. Heights are measured up from the top of the
footing (the wall's base); the backfill is the unbalanced fill against the wall's outside face.
Earth pressure lives in `bracing.earth_pressure`, the wall's section capacities in
`bracing.wall_sections`, all named here; this module holds the wall and footing as a cantilever
and the wall on inside braces.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from bracing import anchors, propped_wall
from bracing.anchor_kinds import KINDS
from bracing.earth_pressure import (
    COMBINATION,
    EFP_IBC_1610_1,
    EFP_SOURCE,
    LOAD_FACTOR_H,
    SOIL_UNIT_WEIGHT_PCF,
    UNSUITABLE_IBC_1610_1,
    WATER_PCF,
    Soil,
    UnsuitableSoil,
    equivalent_fluid_pressure,
    pressure_coefficient,
    resultants,
    resultants_at,
)
from bracing.results import Check
from bracing.wall_sections import (
    ALLOWABLE,
    BARS,
    PHI_FLEXURE,
    PHI_PLAIN,
    PHI_SHEAR_CONCRETE,
    PHI_SHEAR_MASONRY,
    STRENGTH,
    Section,
    Wall,
    beta_1,
    concrete_shear,
    flexure_phi,
    plain_concrete_moment,
    plain_concrete_shear,
    reinforced_concrete_moment,
    reinforced_masonry_moment,
    reinforced_masonry_shear,
    section,
    steel_per_foot,
    stress_block_moment,
    wall_checks,
)

__all__ = [
    "ALLOWABLE",
    "BARS",
    "BRACE_REACTION",
    "COMBINATION",
    "CONCRETE_PCF",
    "EFP_IBC_1610_1",
    "EFP_SOURCE",
    "LOAD_FACTOR_H",
    "PHI_FLEXURE",
    "PHI_PLAIN",
    "PHI_SHEAR_CONCRETE",
    "PHI_SHEAR_MASONRY",
    "SOIL_UNIT_WEIGHT_PCF",
    "STRENGTH",
    "UNSUITABLE_IBC_1610_1",
    "WATER_PCF",
    "InsideBrace",
    "Section",
    "Soil",
    "UnsuitableSoil",
    "Wall",
    "beta_1",
    "block_checks",
    "block_overturning_resistance",
    "brace_force",
    "brace_reaction",
    "brace_uplift",
    "braced_checks",
    "braced_max_height",
    "cantilever_checks",
    "concrete_shear",
    "equivalent_fluid_pressure",
    "flexure_phi",
    "governing",
    "max_height",
    "plain_concrete_moment",
    "plain_concrete_shear",
    "pressure_coefficient",
    "ratio",
    "reinforced_concrete_moment",
    "reinforced_masonry_moment",
    "reinforced_masonry_shear",
    "resultants",
    "resultants_at",
    "section",
    "solve_max",
    "steel_per_foot",
    "stress_block_moment",
    "toe_moment",
    "utilization",
    "wall_checks",
]


BRACE_REACTION = "R: base pinned or fixed, the larger (method notes §12)"
CONCRETE_PCF = 150.0  # normal-weight concrete, ASCE 7 Table C3.1-2 (from memory)


def block_overturning_resistance(wall_weight, wall_lever, footing_weight, footing_width):
    """Moment of the wall and footing weights about the footing's inside edge (the toe), lb-ft
    per ft; no soil on the heel, no slab (statics)."""
    return wall_weight * wall_lever + footing_weight * footing_width / 2.0


def toe_moment(base_shear, base_moment, footing_thickness):
    """Earth-pressure moment about the toe at the footing's underside, M + V t_f (statics)."""
    return base_moment + base_shear * footing_thickness


def brace_reaction(base_moment, brace_height):
    """Inside brace reaction with the wall pinned at its base, R = M_base / h_b per ft (statics:
    moments about the base)."""
    return base_moment / brace_height


def brace_force(reaction_plf, spacing_ft, angle_deg):
    """Axial force in one brace, P = R s / cos(theta) (statics), theta from horizontal."""
    return reaction_plf * spacing_ft / np.cos(np.radians(angle_deg))


def solve_max(utilization, upper, lower=0.0, iterations=60):
    """The largest x in [lower, upper] with utilization(x) <= 1, by bisection over arrays
    (`utilization` rises with x). upper itself where it passes there; lower where even lower
    fails."""
    lo = np.asarray(lower, dtype=float) + np.zeros_like(np.asarray(upper, dtype=float))
    hi = np.asarray(upper, dtype=float) + np.zeros_like(lo)
    top_passes = np.asarray(utilization(hi)) <= 1.0
    for _ in range(iterations):
        mid = (lo + hi) / 2.0
        ok = np.asarray(utilization(mid)) <= 1.0
        lo, hi = np.where(ok, mid, lo), np.where(ok, hi, mid)
    return np.where(top_passes, upper, lo)[()]


def block_checks(wall: Wall, shear, moment, basis: str) -> list:
    """The wall and footing as one block: overturning about the toe (by `basis`) and sliding on
    the footing's base (IBC Table 1806.2 friction, allowable: 0.6D + 1.0H)."""
    footing = CONCRETE_PCF * wall.footing_width * wall.footing_thickness
    dead = anchors.DEAD_LOAD_FACTOR_RESISTING[basis]
    resist = dead * block_overturning_resistance(wall.weight, wall.wall_lever(), footing,
                                                 wall.footing_width)
    tipping = LOAD_FACTOR_H[basis] * toe_moment(shear, moment, wall.footing_thickness)
    sliding = anchors.deadman_sliding(wall.weight + footing, 0.0, wall.friction)
    return [Check(element="wall and footing", region="overturning about the toe",
                  demand=tipping, capacity=resist, unit="lb·ft/ft",
                  combination=COMBINATION[basis],
                  source="statics, no slab credited (method notes §12)"),
            Check(element="wall and footing", region="sliding on the footing base",
                  demand=ALLOWABLE[0] * shear, capacity=sliding, unit="lb/ft",
                  combination=COMBINATION["ASD"], source="IBC Table 1806.2 friction x 0.6D")]


def cantilever_checks(wall: Wall, soil: Soil, height, basis: str = "ASD") -> list:
    """Every check of the wall as a cantilever from its footing under a backfill `height`."""
    shear, moment = soil.at(height)
    checks = wall_checks(wall, section(wall, wall.weight), moment, shear, "at base")
    if wall.footing_width is not None:
        checks += block_checks(wall, shear, moment, basis)
    return checks


def ratio(demand, capacity):
    """Demand / capacity over arrays; infinite with demand and no capacity."""
    d, c = np.asarray(demand, dtype=float), np.asarray(capacity, dtype=float)
    with np.errstate(divide="ignore", invalid="ignore"):
        return np.where(c > 0, d / np.where(c > 0, c, 1.0), np.where(d > 0, np.inf, 0.0))[()]


def utilization(wall: Wall, soil: Soil, height, basis: str = "ASD"):
    """The governing utilization of the cantilever checks (arrays over `height`)."""
    checks = cantilever_checks(wall, soil, height, basis)
    return np.max([ratio(c.demand, c.capacity) * np.ones_like(height, dtype=float)
                   for c in checks], axis=0)[()]


def max_height(wall: Wall, soil: Soil, basis: str = "ASD"):
    """The maximum backfill height before the floor (ft): every height-dependent effect worked
    afresh at each trial height, by bisection up to the wall's height."""
    return solve_max(lambda h: utilization(wall, soil, h, basis), wall.height)


@dataclass(frozen=True)
class InsideBrace:
    """Braces or shores on the wall's inside face, their feet on the ground or slab inside."""

    height: float                   # ft above the base
    spacing: float                  # ft along the wall
    angle: float                    # deg from horizontal
    capacity: float                 # allowable axial load, lb
    anchor_tension: float | None = None     # rated, lb
    anchor_shear: float | None = None       # rated, lb


def brace_uplift(reaction_plf, angle_deg):
    """Upward push on the wall per ft from braces in compression, R tan(theta) (statics)."""
    return reaction_plf * np.tan(np.radians(angle_deg))


def braced_checks(wall: Wall, soil: Soil, height: float, brace: InsideBrace,
                  wind: tuple[float, float, float] | None = None) -> list:
    """The propped wall (base pinned and fixed, `propped_wall.checks`; `wind` as there), its
    braces and their anchors under the braces' largest reaction (`propped_wall.brace_reaction`,
    1.0H and the wind at its allowable factor)."""
    reaction, words = propped_wall.brace_reaction(wall, soil, height, brace.height,
                                                  ALLOWABLE[0], wind)
    axial = brace_force(reaction, brace.spacing, brace.angle)
    checks = propped_wall.checks(wall, soil, height, brace.height, wind)
    how = BRACE_REACTION
    checks.append(Check(element="inside brace", region="axial", demand=float(axial),
                        capacity=brace.capacity, unit="lb", combination=ALLOWABLE[1] + words,
                        source=f"brace rating (allowable), {how}"))
    lift = float(brace_uplift(reaction, brace.angle))
    checks.append(Check(element="wall", region="lifted by the braces", demand=lift,
                        capacity=anchors.DEAD_LOAD_FACTOR_RESISTING["ASD"] * wall.weight,
                        unit="lb/ft", combination=COMBINATION["ASD"] + words,
                        source=f"statics, R tan(theta) against 0.6D; {how}"))
    if brace.anchor_tension is not None and brace.anchor_shear is not None:
        pull = float(reaction) * brace.spacing
        anchor = KINDS["stake"]
        checks.append(Check(element="brace foot anchor", region="tension and shear",
                            demand=float(anchor.ratio(0.0, pull, axial, brace.anchor_tension,
                                                      brace.anchor_shear)),
                            capacity=1.0, unit="ratio", combination=ALLOWABLE[1] + words,
                            source=anchor.source))
    return checks


def braced_max_height(wall: Wall, soil: Soil, brace: InsideBrace) -> float:
    """The highest backfill (ft) the braced wall takes, by bisection up to the wall's height
    with every braced check worked afresh at each trial height."""
    def worst(heights):
        return np.array([governing(braced_checks(wall, soil, float(h), brace))
                         for h in np.atleast_1d(heights)]).reshape(np.shape(heights))
    return float(solve_max(worst, wall.height, iterations=40))


def governing(checks: list) -> float:
    """The largest utilization of scalar checks."""
    return max((c.utilization for c in checks), default=0.0)
