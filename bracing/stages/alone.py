"""Walls on their own: every check of a wall standing without braces (method notes §3)."""

from __future__ import annotations

import functools
from dataclasses import dataclass

import numpy as np

from bracing import stability
from bracing.stages.arrays import Walls
from bracing.stages.brace_set import BraceSet
from bracing.stages.loads import Factors, FixedActions, fixed_actions
from bracing.stages.wind import Wind


def stability_checks(w: Walls, wind: Wind, f: Factors, held: tuple = ()
                     ) -> dict[str, tuple[np.ndarray, np.ndarray]]:
    """Demand and capacity of every check of a wall on its own, per name (arrays, NaN = n/a).

    Rigid panels as a whole; walls built in place per foot, end zone and interior (§5). `held`:
    the lateral loads that do not grow with the wind (loads.fixed_loads), added with their own
    factors in `f`.
    """
    push = Push(wind=wind, f=f, held=fixed_actions(held, f))
    checks = _overturning(w, push, f)
    checks.update(_on_footing(w, push, f))
    checks.update(_sliding(w, push, f))
    return checks


@dataclass(frozen=True)
class Push:
    """The factored lateral loads on each wall in one combination: the wind's (f.wind) and the
    held loads' (their own factors), as pushes and moments about a level `depth` ft below the
    wall's base (statics)."""

    wind: Wind
    f: Factors
    held: FixedActions | None

    def whole(self) -> np.ndarray:
        """On the whole wall, lb."""
        out = self.f.wind * self.wind.force
        return out if self.held is None else out + self.held.push

    def whole_moment(self, depth=0.0) -> np.ndarray:
        """Of the whole wall, lb-ft."""
        out = self.f.wind * self.wind.force * (self.wind.lever + depth)
        return out if self.held is None else out + self.held.moment + self.held.push * depth

    def strip(self, line) -> np.ndarray:
        """Per ft of a strip whose wind is `line` (plf)."""
        out = self.f.wind * line
        return out if self.held is None else out + self.held.line

    def strip_moment(self, line, depth=0.0) -> np.ndarray:
        """Per ft of a strip whose wind is `line`, lb-ft/ft."""
        out = self.f.wind * line * (self.wind.lever_strip + depth)
        return (out if self.held is None else
                out + self.held.line_moment + self.held.line * depth)


def _overturning(w: Walls, push: Push, f: Factors) -> dict:
    """The walls overturning about their leeward base edge (statics), and footing and wall as
    one block about the footing's toe, with the soil under it, per ft of a wall built in
    place."""
    t, rigid, ftg, na = w.thickness_ft, w.rigid, w.has_footing, np.nan
    dead_strip = w.face_weight * w.height
    ftg_w, ftg_d, ftg_strip = _footing(w)
    checks = {"overturning|whole panel": (
        np.where(rigid, push.whole_moment(), na),
        np.where(rigid, f.dead_resists * stability.rocking_resistance(_dead(w), t), na))}
    for region, line in (("end zone", push.wind.line_end),
                         ("interior", push.wind.line_interior)):
        rocking = stability.rocking_resistance(f.dead_resists * dead_strip, t)
        flexure = stability.masonry_flexural_capacity(
            w.flex_tension, w.section, w.section_area, f.dead_resists * dead_strip)
        capacity = np.where(w.masonry & ~w.fresh, np.maximum(rocking, flexure), rocking)
        checks[f"overturning|{region}"] = (
            np.where(rigid, na, push.strip_moment(line)), np.where(rigid, na, capacity))
        moment = push.strip_moment(line, ftg_d)
        checks[f"footing overturning|{region}"] = (
            np.where(ftg & ~rigid, moment, na),
            np.where(ftg & ~rigid, stability.footing_resistance(
                f.dead_resists * (dead_strip + ftg_strip), ftg_w), na))
        bearing = stability.max_soil_pressure(
            f.dead_adds * (dead_strip + ftg_strip), moment, np.where(ftg, ftg_w, 1.0), 1.0)
        checks[f"soil bearing|{region}"] = (np.where(ftg & ~rigid, bearing, na),
                                           np.where(ftg & ~rigid, w.bearing, na))
    return checks


def _on_footing(w: Walls, push: Push, f: Factors) -> dict:
    """A rigid panel and its footing as one block about the footing's toe, and the soil under
    it (statics)."""
    ftg, rigid, b, na = w.has_footing, w.rigid, w.width, np.nan
    ftg_w, ftg_d, ftg_strip = _footing(w)
    dead, ftg_panel = _dead(w), ftg_strip * b
    moment = push.whole_moment(ftg_d)
    return {
        "footing overturning|whole panel": (
            np.where(ftg & rigid, moment, na),
            np.where(ftg & rigid, stability.footing_resistance(
                f.dead_resists * (dead + ftg_panel), ftg_w), na)),
        "soil bearing|whole panel": (
            np.where(ftg & rigid, stability.max_soil_pressure(
                f.dead_adds * (dead + ftg_panel), moment, np.where(ftg, ftg_w, 1.0), b), na),
            np.where(ftg & rigid, w.bearing, na))}


def _sliding(w: Walls, push: Push, f: Factors) -> dict:
    """Sliding on the base (friction, 0.6D resisting) and of the footing on soil; walls built in
    place per foot of their end zone."""
    rigid, ftg, na = w.rigid, w.has_footing, np.nan
    _, _, ftg_strip = _footing(w)
    dead_strip = w.face_weight * w.height
    shear = np.where(rigid, push.whole(), push.strip(push.wind.line_end))
    weight = np.where(rigid, _dead(w), dead_strip)
    footing_weight = np.where(rigid, ftg_strip * w.width, ftg_strip)
    # A framed wall's sill is nailed or bolted down: that connection is the framer's, not friction.
    slides = ~w.framed
    friction = w.base_mu * f.dead_resists * weight
    bond = stability.masonry_bed_joint_shear(w.section_area, f.dead_resists * dead_strip)
    grip = np.where(w.masonry & ~w.fresh, np.maximum(friction, bond), friction)
    return {
        "sliding at base|*": (np.where(slides, shear, na), np.where(slides, grip, na)),
        "footing sliding|*": (
            np.where(ftg, shear, na),
            np.where(ftg, w.footing_mu * f.dead_resists * (weight + footing_weight), na))}


def _dead(w: Walls) -> np.ndarray:
    """Each wall's weight, lb."""
    return w.face_weight * w.height * w.width * w.solidity


def _footing(w: Walls) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Each wall's footing width and thickness (ft) and weight per ft of wall (lb), 0: none."""
    ftg = w.has_footing
    ftg_w = np.where(ftg, w.footing_width, 0.0)
    return (ftg_w, np.where(ftg, w.footing_thickness, 0.0),
            np.where(ftg, w.footing_psf * ftg_w, 0.0))


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


def unbraced_at(walls: Walls, wind: Wind, f: Factors, held: tuple = ()) -> np.ndarray:
    """The largest utilization, less 1, of each wall standing on its own."""
    return governing_utilization(wall_checks(walls, wind, f, held)) - 1.0


# Checks of walls on their own against allowable values (IBC Table 1806.2 bearing and friction),
# and those of cured masonry (TMS 402-16 §8.2 allowable stresses): under LRFD they take the ASD
# combinations (method notes §1).
ALLOWABLE_ALONE = {"soil bearing", "footing sliding"}
ALLOWABLE_MASONRY = {"overturning", "sliding at base"}


def wall_checks(w: Walls, wind: Wind, f: Factors, held: tuple = ()
                ) -> dict[str, tuple[np.ndarray, np.ndarray]]:
    """`stability_checks` with the allowable ones on `f.allowable` where it has one (LRFD)."""
    checks = stability_checks(w, wind, f, held)
    if f.allowable is None:
        return checks
    allowable = stability_checks(w, wind, f.allowable, held)
    cured = w.masonry & ~w.fresh
    out = {}
    for key, pair in checks.items():
        element = key.partition("|")[0]
        rows = (True if element in ALLOWABLE_ALONE else
                cured if element in ALLOWABLE_MASONRY else False)
        out[key] = tuple(np.where(rows, a, v) for v, a in zip(pair, allowable[key], strict=True))
    return out


REVERSE = " (wind away from the braces)"  # a check of the wall alone, compression-only braces
REVERSE_INFO = {name + REVERSE: (unit, kind, f"{source}; the braces work in compression only "
                                 "(method notes §4)")
                for name, (unit, kind, source) in CHECK_INFO.items()}


def reverse_wind_checks(checks: dict, bs: BraceSet) -> dict:
    """The checks of the walls on their own (`checks`, at the design wind), as braced checks of
    the walls whose braces work in compression only (NaN for the others): with the wind away
    from its braced face, such a wall stands alone (method notes §4)."""
    only = bs.compression_only
    out = {}
    for key, (demand, capacity) in checks.items():
        element, _, region = key.partition("|")
        name = f"{element}{REVERSE}|{'worst region' if region == '*' else region}"
        out[name] = (np.where(only, demand[bs.index], np.nan), capacity[bs.index])
    return out
