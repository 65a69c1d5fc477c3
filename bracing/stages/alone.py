"""Walls on their own: every check of a wall standing without braces (design.md §5)."""

from __future__ import annotations

import functools

import numpy as np

from bracing import stability
from bracing.stages.arrays import Walls
from bracing.stages.brace_set import BraceSet
from bracing.stages.loads import Factors
from bracing.stages.wind import Wind


def stability_checks(w: Walls, wind: Wind, f: Factors) -> dict[str, tuple[np.ndarray, np.ndarray]]:
    """Demand and capacity of every check of a wall on its own, per name (arrays, NaN = n/a).

    Rigid panels as a whole; walls built in place per foot, end zone and interior (§5).
    """
    t, s, b = w.thickness_ft, w.height, w.width
    dead = w.face_weight * s * b * w.solidity
    dead_strip = w.face_weight * s
    ftg = w.has_footing
    ftg_w = np.where(ftg, w.footing_width, 0.0)
    ftg_d = np.where(ftg, w.footing_thickness, 0.0)
    ftg_strip = np.where(ftg, w.footing_psf * ftg_w, 0.0)  # lb per ft of wall
    rigid = w.rigid
    na = np.nan
    checks: dict[str, tuple[np.ndarray, np.ndarray]] = {}

    # Overturning of the wall about its leeward base edge (statics).
    checks["overturning|whole panel"] = (
        np.where(rigid, f.wind * wind.force * wind.lever, na),
        np.where(rigid, f.dead_resists * stability.rocking_resistance(dead, t), na))
    for region, line in (("end zone", wind.line_end), ("interior", wind.line_interior)):
        rocking = stability.rocking_resistance(f.dead_resists * dead_strip, t)
        flexure = stability.masonry_flexural_capacity(
            w.flex_tension, w.section, w.section_area, f.dead_resists * dead_strip)
        capacity = np.where(w.masonry & ~w.fresh, np.maximum(rocking, flexure), rocking)
        checks[f"overturning|{region}"] = (
            np.where(rigid, na, f.wind * line * wind.lever_strip), np.where(rigid, na, capacity))
        # Footing and wall as one block about the footing's toe, and the soil under it.
        checks[f"footing overturning|{region}"] = (
            np.where(ftg & ~rigid, f.wind * line * (wind.lever_strip + ftg_d), na),
            np.where(ftg & ~rigid, stability.footing_resistance(
                f.dead_resists * (dead_strip + ftg_strip), ftg_w), na))
        bearing = stability.max_soil_pressure(
            f.dead_adds * (dead_strip + ftg_strip), f.wind * line * (wind.lever_strip + ftg_d),
            np.where(ftg, ftg_w, 1.0), 1.0)
        checks[f"soil bearing|{region}"] = (np.where(ftg & ~rigid, bearing, na),
                                           np.where(ftg & ~rigid, w.bearing, na))
    ftg_panel = ftg_strip * b
    checks["footing overturning|whole panel"] = (
        np.where(ftg & rigid, f.wind * wind.force * (wind.lever + ftg_d), na),
        np.where(ftg & rigid, stability.footing_resistance(
            f.dead_resists * (dead + ftg_panel), ftg_w), na))
    checks["soil bearing|whole panel"] = (
        np.where(ftg & rigid, stability.max_soil_pressure(
            f.dead_adds * (dead + ftg_panel), f.wind * wind.force * (wind.lever + ftg_d),
            np.where(ftg, ftg_w, 1.0), b), na),
        np.where(ftg & rigid, w.bearing, na))
    # Sliding on the base (friction, 0.6D resisting) and of the footing on soil; walls built in
    # place per foot of their end zone.
    push = np.where(rigid, wind.force, wind.line_end)
    weight = np.where(rigid, dead, dead_strip)
    footing_weight = np.where(rigid, ftg_panel, ftg_strip)
    # A framed wall's sill is nailed or bolted down: that connection is the framer's, not friction.
    slides = ~w.framed
    friction = w.base_mu * f.dead_resists * weight
    bond = stability.masonry_bed_joint_shear(w.section_area, f.dead_resists * dead_strip)
    grip = np.where(w.masonry & ~w.fresh, np.maximum(friction, bond), friction)
    checks["sliding at base|*"] = (np.where(slides, f.wind * push, na), np.where(slides, grip, na))
    checks["footing sliding|*"] = (
        np.where(ftg, f.wind * push, na),
        np.where(ftg, w.footing_mu * f.dead_resists * (weight + footing_weight), na))
    return checks


CHECK_INFO = {
    "overturning": ("lb·ft", "resisting", "statics, W t/2 about the base edge"),
    "footing overturning": ("lb·ft", "resisting", "statics, W x footing width / 2"),
    "soil bearing": ("psf", "adding", "statics against IBC Table 1806.2 allowable bearing"),
    "sliding at base": ("lb", "resisting", "friction, ACI 318-19 §22.9.4.2 (mu 0.6)"),
    "footing sliding": ("lb", "resisting", "friction, IBC Table 1806.2 (allowable)"),
}


def governing_utilization(checks) -> np.ndarray:
    """The largest demand/capacity of each wall over the checks that apply to it."""
    ratios = (np.where(np.isnan(d), 0.0, demand_ratio(d, c)) for d, c in checks.values())
    # a check at a time: numpy's own reduction over so short an axis is many times slower
    return functools.reduce(np.maximum, ratios)


def demand_ratio(demand, capacity):
    with np.errstate(divide="ignore", invalid="ignore"):
        return np.where(capacity > 0, demand / capacity, np.where(demand > 0, np.inf, 0.0))


def unbraced_at(walls: Walls, wind: Wind, f: Factors) -> np.ndarray:
    """The largest utilization, less 1, of each wall standing on its own."""
    return governing_utilization(wall_checks(walls, wind, f)) - 1.0


# Checks of walls on their own against allowable values (IBC Table 1806.2 bearing and friction),
# and those of cured masonry (TMS 402-16 §8.2 allowable stresses): under LRFD they take the ASD
# combinations (design.md §3, method notes §1).
ALLOWABLE_ALONE = {"soil bearing", "footing sliding"}
ALLOWABLE_MASONRY = {"overturning", "sliding at base"}


def wall_checks(w: Walls, wind: Wind, f: Factors) -> dict[str, tuple[np.ndarray, np.ndarray]]:
    """`stability_checks` with the allowable ones on `f.allowable` where it has one (LRFD)."""
    checks = stability_checks(w, wind, f)
    if f.allowable is None:
        return checks
    allowable = stability_checks(w, wind, f.allowable)
    cured = w.masonry & ~w.fresh
    out = {}
    for key, pair in checks.items():
        element = key.partition("|")[0]
        rows = (True if element in ALLOWABLE_ALONE else
                cured if element in ALLOWABLE_MASONRY else False)
        out[key] = tuple(np.where(rows, a, v) for v, a in zip(pair, allowable[key]))
    return out


REVERSE = " (wind away from the braces)"  # a check of the wall alone, compression-only braces
REVERSE_INFO = {name + REVERSE: (unit, kind, f"{source}; the braces work in compression only "
                                 "(method notes §4)")
                for name, (unit, kind, source) in CHECK_INFO.items()}


def reverse_wind_checks(checks: dict, bs: BraceSet) -> dict:
    """The checks of the walls on their own (`checks`, at the design wind), as braced checks of
    the walls whose braces work in compression only (NaN for the others): with the wind away
    from its braced face, such a wall stands alone (design.md §6)."""
    only = bs.compression_only
    out = {}
    for key, (demand, capacity) in checks.items():
        element, _, region = key.partition("|")
        name = f"{element}{REVERSE}|{'worst region' if region == '*' else region}"
        out[name] = (np.where(only, demand[bs.index], np.nan), capacity[bs.index])
    return out
