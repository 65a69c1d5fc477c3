"""Foundation walls backfilled before the floor gives them top support (method notes §12).

Earth pressure is a lateral load kind of `bracing.stages.loads` ("earth", H, held: it does not
grow with the wind); like wind, its own stage (this one) works it out, here for the site's
foundation walls, which are not panels. Wind acts on the part of each wall above the backfill,
and only that part has a working limit and a stand-down speed; the backfill limit is a height.
The formulas are in `bracing.backfill`; this module reads the site, calls them, and builds the
records of `bracing.foundation_results` by keyword.
By topic, and all named here: the wall and its soil and wind as a cantilever
(`foundation_cantilever`), the inside braces (`foundation_braces`), the days (`foundation_days`),
the findings (`foundation_flags`).
"""

from __future__ import annotations

import numpy as np

from bracing import backfill, backfill_profile
from bracing.earth_pressure import pressure_parts
from bracing.foundation_results import (
    BackfillSoilResult,
    BackfillWind,
    FoundationWallResult,
    InsideBraceResult,
    PressurePoint,
)
from bracing.model import Site
from bracing.stages import loads
from bracing.stages.foundation_braces import (
    LUMBER_EARTH_SCALE,
    Support,
    _axial,
    anchor_check,
    braced,
    braced_max,
    count_along,
    positions_along,
    scalars,
    support_of,
)
from bracing.stages.foundation_cantilever import (
    Windward,
    cantilever,
    cantilever_max,
    engine_wall,
    governing,
    soil_of,
    wind_effects,
    wind_of,
    with_wind,
    working_limit,
)
from bracing.stages.foundation_days import _Allowed, _top_support, braces_in_use, wall_days
from bracing.stages.foundation_flags import (
    SOURCE,
    _flags,
    day_flags,
    not_checked,
    over_flag,
    site_flags,
    stand_on_days,
)
from bracing.wind import asce7

__all__ = [
    "EARTH",
    "LUMBER_EARTH_SCALE",
    "PROFILE_POINTS",
    "SOURCE",
    "Support",
    "Windward",
    "anchor_check",
    "backfill_side",
    "braced",
    "braced_max",
    "cantilever",
    "cantilever_max",
    "count_along",
    "day_flags",
    "engine_wall",
    "evaluate_foundation_walls",
    "governing",
    "not_checked",
    "over_flag",
    "positions_along",
    "pressure_profile",
    "scalars",
    "site_flags",
    "soil_of",
    "stand_on_days",
    "support_of",
    "wall_days",
    "wind_effects",
    "wind_of",
    "with_wind",
    "working_limit",
]


EARTH = loads.register(loads.LoadKind(
    name="earth", symbol="H",
    factors={"ASD": backfill.LOAD_FACTOR_H["ASD"], "LRFD": backfill.LOAD_FACTOR_H["LRFD"],
             "service": 1.0},
    scales_with_wind=False,
    source=f"{backfill.EFP_SOURCE}; ASCE 7-16 §2.3.1 / §2.4.1 (unconfirmed value)"))
PROFILE_POINTS = 9  # levels of the pressure diagram


def pressure_profile(soil: backfill.Soil, height: float) -> list[PressurePoint]:
    """Earth pressure at levels of the backfill, its three parts added
    (bracing.earth_pressure.pressure_parts)."""
    if height <= 0.0:
        return []
    levels = np.linspace(0.0, height, PROFILE_POINTS)
    pressure = sum(pressure_parts(levels, height, soil.efp, soil.unit_weight, soil.surcharge,
                                  soil.water))
    return [PressurePoint(level_ft=float(z), pressure_psf=float(p))
            for z, p in zip(levels, pressure, strict=True)]


def backfill_side(site: Site, w) -> str | None:
    """The side of the wall's line away from its braced side (the inside)."""
    line = next((ln for ln in site.lines if ln.name == w.line), None)
    if line is None:
        return None
    return "left" if line.braced_side == "right" else "right"


def evaluate_foundation_walls(site: Site) -> list[FoundationWallResult]:
    """Every foundation wall of the site, checked at its planned backfill, day by day."""
    if not site.foundation_walls:
        return []
    last = max([e.day for e in site.backfill_events] + [e.day for e in site.events]
               + [s.day for s in site.signoffs] + [w.build_day or 1 for w in site.foundation_walls]
               + [p.lift_day or 1 for p in site.panels])
    return [_one(site, w, last) for w in site.foundation_walls]


def _one(site: Site, w, last: int) -> FoundationWallResult:
    basis = site.site.design_basis
    wind = wind_of(site, w.length)
    support = support_of(site, w.inside_braces)
    allowed = _Allowed(site, w, wind, support)
    days = wall_days(site, w, allowed, last)
    event_day, released = _top_support(site, w)
    before = [d for d in days if d.support != "top support"]
    worst = max(before, key=lambda d: (d.planned_height_ft, -d.day), default=None)
    planned = worst.planned_height_ft if worst else 0.0
    wall, soil = engine_wall(site, w), soil_of(site, w)
    alone = scalars(cantilever(wall, soil, wind, planned, basis))
    max_alone = cantilever_max(wall, soil, wind, basis)
    needs = planned > max_alone + 1e-6
    brace = None
    checks = alone
    if support is not None:
        propped = scalars(braced(wall, soil, wind, planned, support))
        reaction = float(backfill.brace_reaction(soil.at(planned)[1], support.spec.height))
        first, to = braces_in_use(site, w, days, allowed)
        brace = InsideBraceResult(
            height_ft=support.spec.height, spacing_ft=support.spec.spacing,
            angle_deg=support.spec.angle, length_ft=support.length,
            foot_distance_ft=support.foot_distance,
            brace_type=support.spec.brace_type, foot_anchor=support.spec.foot_anchor,
            reaction_plf=reaction, force_lb=_axial(propped), capacity_lb=support.brace.capacity,
            max_height_ft=braced_max(wall, soil, wind, support),
            utilization=float(backfill.governing(propped)), checks=propped,
            count=count_along(w.length, support.spec.spacing), in_use_from_day=first,
            in_use_to_day=to, positions_ft=positions_along(w.length, support.spec.spacing))
        if needs:
            checks = propped
    exposed = max(w.height - planned, 0.0)
    limit = working_limit(wall, soil, wind, planned, basis) if checks is alone else None
    ratio = site.rule_value("stand_down_ratio")
    result = FoundationWallResult(
        mark=w.mark, material=wall.material, height_ft=w.height, length_ft=w.length,
        thickness_in=w.thickness, line=w.line, offset_ft=w.offset,
        backfill_side=backfill_side(site, w), build_day=w.build_day,
        top_support_day=event_day, released_day=released,
        soil=_soil_record(site, w, soil), planned_height_ft=planned,
        planned_day=worst.day if worst and planned > 0 else None,
        max_height_ft=max_alone, needs_support=needs,
        utilization=float(backfill.governing(checks)), checks=checks,
        cantilever_utilization=float(backfill.governing(alone)), cantilever_checks=alone,
        inside_brace=brace,
        wind=BackfillWind(
            design_speed_mph=wind.speed, velocity_pressure_psf=wind.q,
            force_coefficient=float(wind.g_cf(exposed) / asce7.GUST_FACTOR) if exposed else 0.0,
            pressure_psf=float(wind.pressure(exposed)) if exposed else 0.0,
            exposed_height_ft=exposed, working_limit_speed_mph=limit,
            stand_down_speed_mph=None if limit is None or ratio is None else ratio * limit),
        pressure=pressure_profile(soil, planned), days=days,
        flags=_flags(site, w, wall, days))
    result.sketches = backfill_profile.day_sketches(result, w.footing)
    return result


def _soil_record(site: Site, w, soil: backfill.Soil) -> BackfillSoilResult:
    b = w.backfill or site.backfill
    return BackfillSoilResult(
        equivalent_fluid_pressure_psf_per_ft=soil.efp, pressure_source=soil.source,
        pressure_state=b.pressure_state,
        coefficient=float(backfill.pressure_coefficient(soil.efp, soil.unit_weight)),
        unit_weight_pcf=soil.unit_weight, surcharge_psf=soil.surcharge,
        water_level_ft=soil.water,
        drainage="drained" if b.drained else (
            "water level given" if b.water_level is not None else "not stated"))
