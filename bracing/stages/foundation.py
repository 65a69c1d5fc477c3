"""Foundation walls backfilled before the floor gives them top support (method notes §12).

Earth pressure is a lateral load kind of `bracing.stages.loads` ("earth", H, held: it does not
grow with the wind); like wind, its own stage (this one) works it out, here for the site's
foundation walls, which are not panels. Wind acts on the part of each wall above the backfill,
and only that part has a working limit and a stand-down speed; the backfill limit is a height.
The formulas are in `bracing.backfill`; this module reads the site, calls them, and builds the
records of `bracing.foundation_results` by keyword.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

import numpy as np

from bracing import backfill, stability
from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.foundation_results import (
    BackfillDay,
    BackfillSoilResult,
    BackfillWind,
    FoundationWallResult,
    InsideBraceResult,
    PressurePoint,
)
from bracing.model import DEFAULT_RULES, Site
from bracing.results import Check, Flag, NotChecked
from bracing.stages import loads
from bracing.stages.brace_set import _brace_capacity
from bracing.wind import asce7, asce37

EARTH = loads.register(loads.LoadKind(
    name="earth", symbol="H",
    factors={"ASD": backfill.LOAD_FACTOR_H["ASD"], "LRFD": backfill.LOAD_FACTOR_H["LRFD"],
             "service": 1.0},
    scales_with_wind=False,
    source=f"{backfill.EFP_SOURCE}; ASCE 7-16 §2.3.1 / §2.4.1 (unconfirmed value)"))

SOURCE = "method notes §12"
# NDS 2018 Table 2.3.2: two months' duration 1.15 against the wind's 1.6; a lumber brace's
# capacity at CD 1.6 scaled by 1.15 / 1.6 is conservative (CP rises as Fc* falls).
LUMBER_EARTH_SCALE = 1.15 / 1.6
PROFILE_POINTS = 9  # levels of the pressure diagram


@dataclass(frozen=True)
class Windward:
    """The design wind on a foundation wall's exposed part (strength level, per ft of wall)."""

    speed: float        # design speed, mph
    q: float            # design velocity pressure, psf (Kd 0.85)
    q_unit: float       # observed-gust velocity pressure per mph^2 (Kd 1.0)
    g_cf: object        # callable: exposed height -> G Cf
    minimum: float      # psf, strength level

    def pressure(self, exposed):
        """q G Cf on the exposed part, at least the minimum (ASCE 7-16 §29.3, §29.7)."""
        return np.maximum(self.q * self.g_cf(exposed), self.minimum)


def wind_of(site: Site, length: float) -> Windward:
    """The wind on a wall `length` long standing on grade (s/h = 1), its top under 15 ft
    (ASCE 7-16 Table 26.10-1 note 1: Kz at 15 ft)."""
    s = site.site
    factor = s.period_factor or float(asce37.period_factor(s.construction_period))
    speed = factor * s.basic_wind_speed
    kz = float(asce7.kz(0.0, s.exposure))
    ke = float(asce7.ke(s.ground_elevation))

    def g_cf(exposed):
        e = np.maximum(np.asarray(exposed, dtype=float), 1e-6)
        return asce7.GUST_FACTOR * asce7.cf_cases_ab(length / e, 1.0)

    return Windward(
        speed=speed,
        q=float(asce7.velocity_pressure(speed, kz, s.topographic_factor, asce7.KD_WALLS, ke)),
        q_unit=float(asce7.velocity_pressure(1.0, kz, s.topographic_factor, 1.0, ke)),
        g_cf=g_cf, minimum=site.rule_value("minimum_design_pressure_psf") or 0.0)


def wind_effects(pressure, height, exposed):
    """Shear and moment per ft at the wall's base from a pressure on the part above a backfill
    `height`, its resultant 0.55 of the part above the backfill (ASCE 7-16 Figure 29.3-1, s/h = 1;
    statics)."""
    shear = pressure * exposed
    return shear, shear * (height + 0.55 * exposed)


def with_wind(checks: list, wall: backfill.Wall, shear, moment, service: bool = False) -> list:
    """The cantilever checks with the wind's shear and moment at the base added at its factor
    in each check's combination (ASCE 7-16 §2.3.1 / §2.4.1): 1.0W beside the strength
    sections' 1.6H, 0.6W beside 1.0H (`service`: 1.0W, the observed gust)."""
    out = []
    for c in checks:
        if service:
            factor = loads.SERVICE.wind
        elif c.combination in (backfill.STRENGTH[1], backfill.COMBINATION["LRFD"]):
            factor = loads.COMBINATIONS["LRFD"].wind  # beside 1.6H: strength sections, LRFD
        else:
            factor = loads.COMBINATIONS["ASD"].wind
        if c.region.startswith("flexure"):
            extra = moment
        elif c.region.startswith("overturning"):
            extra = moment + shear * wall.footing_thickness
        else:
            extra = shear
        word = "W (observed gust)" if service else "W"
        out.append(Check(c.element, c.region, c.demand + factor * extra, c.capacity, c.unit,
                         f"{c.combination} + {factor:g}{word}", c.source))
    return out


def cantilever(wall, soil, wind: Windward, height, basis: str) -> list:
    """Every cantilever check under a backfill `height` (arrays) and the wind above it."""
    exposed = np.maximum(wall.height - np.asarray(height, dtype=float), 0.0)
    shear, moment = wind_effects(wind.pressure(exposed) * (exposed > 0), height, exposed)
    return with_wind(backfill.cantilever_checks(wall, soil, height, basis), wall, shear, moment)


def governing(checks: list):
    """The largest ratio over checks whose demands may be arrays."""
    return np.max([backfill.ratio(c.demand, c.capacity) for c in checks], axis=0)[()]


def cantilever_max(wall, soil, wind, basis: str) -> float:
    """The maximum backfill before the floor as a cantilever (solved; the exposed part's wind
    worked afresh at each trial height)."""
    return float(backfill.solve_max(lambda h: governing(cantilever(wall, soil, wind, h, basis)),
                                    wall.height))


def working_limit(wall, soil, wind: Windward, height: float, basis: str) -> float | None:
    """The observed gust (mph) at which the cantilever under `height` of backfill reaches its
    capacity with 1.0W (Kd 1.0, no minimum pressure, no period factor; method notes §12): per
    check, demand = a + b V^2, so V = sqrt((capacity - a) / b). None: no part exposed."""
    exposed = wall.height - height
    if exposed <= 0.0:
        return None
    held = backfill.cantilever_checks(wall, soil, height, basis)
    p = wind.q_unit * float(wind.g_cf(exposed))  # psf per mph^2
    shear, moment = wind_effects(p, height, exposed)
    unit = with_wind(held, wall, shear, moment, service=True)
    speeds = [math.sqrt(max(h.capacity - h.demand, 0.0) / (u.demand - h.demand))
              for h, u in zip(held, unit, strict=True) if u.demand > h.demand]
    return min(speeds, default=None)


@dataclass(frozen=True)
class Support:
    """Inside braces as the site gives them, their capacities worked out."""

    spec: object        # model.foundation.InsideBraces
    brace: backfill.InsideBrace
    length: float
    source: str
    anchor: object      # model.AnchorType or None


def support_of(site: Site, spec) -> Support | None:
    """The inside braces' allowable compression (§6's capacities, ASD) at their length."""
    if spec is None:
        return None
    bt = site.brace_types[spec.brace_type]
    length = spec.height / math.sin(math.radians(spec.angle))
    capacity = float(np.nan_to_num(_brace_capacity(bt, np.array([length]), spec.angle,
                                                   "ASD")[0])[0])
    source = {"rated": "maker's rated load at its length", "pipe": "AISC 360-16 E3, Pn/Ωc",
              "lumber": "NDS 2018 §3.7.1, CD 1.15 (two months)",
              "unrated": "no rating given"}[bt.kind]
    if bt.kind == "lumber":
        capacity *= LUMBER_EARTH_SCALE
    anchor = site.anchor_types[spec.foot_anchor] if spec.foot_anchor else None
    return Support(spec, backfill.InsideBrace(height=spec.height, spacing=spec.spacing,
                                              angle=spec.angle, capacity=capacity),
                   length, source, anchor)


def braced(wall, soil, wind: Windward, height: float, s: Support) -> list:
    """The propped wall's checks (bracing.backfill.braced_checks), its brace carrying the wind
    above the backfill too (0.6W, moments about the base), and its foot anchor."""
    exposed = max(wall.height - height, 0.0)
    pressure = float(wind.pressure(exposed)) if exposed else 0.0
    w_moment = wind_effects(pressure, height, exposed)[1]
    factor = loads.COMBINATIONS["ASD"].wind
    cos = math.cos(math.radians(s.spec.angle))
    extra = factor * float(w_moment) / s.spec.height * s.spec.spacing / cos
    checks = []
    for c in backfill.braced_checks(wall, soil, height, s.brace):
        if c.element == "inside brace":
            c = Check(c.element, c.region, c.demand + extra, c.capacity, c.unit,
                      f"{c.combination} + {factor:g}W", f"{s.source}; R = M_base / h_b")
        checks.append(c)
    if s.anchor is not None:
        checks.append(anchor_check(s, _axial(checks)))
    return checks


def scalars(checks: list) -> list:
    """Checks of one height with plain float demands and capacities (for the records)."""
    return [Check(c.element, c.region, float(c.demand), float(c.capacity), c.unit,
                  c.combination, c.source) for c in checks]


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
    return Check("brace foot anchor", kind.words, value, 1.0, "ratio",
                 backfill.ALLOWABLE[1] + " + 0.6W", source)


def braced_max(wall, soil, wind, s: Support) -> float:
    """The highest backfill the braced wall takes (bisection, every check afresh)."""
    def worst(heights):
        return np.array([backfill.governing(braced(wall, soil, wind, float(h), s))
                         for h in np.atleast_1d(heights)]).reshape(np.shape(heights))
    return float(backfill.solve_max(worst, wall.height, iterations=30))


# --- the walls and their days ------------------------------------------------------------------
def engine_wall(site: Site, w, cured: bool = True) -> backfill.Wall:
    """A site file's foundation wall as `bracing.backfill.Wall` (`cured`: masonry's mortar)."""
    mat = site.materials[w.material]
    masonry = mat.kind == "masonry"
    t = w.thickness
    fields: dict = {}
    if w.bars is not None:
        fields = {"steel": backfill.steel_per_foot(w.bars.bar_area(), w.bars.spacing),
                  "depth": w.bars.depth_in(t, masonry), "fy": w.bars.yield_strength}
    if masonry:
        grouting = "grouted" if w.bars is not None else (
            "hollow" if mat.grouting == "partly" else mat.grouting)
        tension = (mat.flexural_tension if mat.flexural_tension is not None
                   else stability.FLEXURAL_TENSION_PSI[(grouting, mat.mortar)])
        fields.update(material="reinforced_masonry" if w.bars is not None else "masonry",
                      fm=w.masonry_strength, grouting=grouting, tension=tension, cured=cured)
    else:
        fields.update(material="reinforced" if w.bars is not None else "plain",
                      fc=mat.compressive_strength)
    face = mat.face_weight if mat.face_weight is not None else mat.unit_weight * t / 12.0
    footing = {}
    if w.footing is not None:
        f = w.footing
        footing = {"footing_width": f.width, "footing_thickness": f.thickness, "toe": f.toe,
                   "friction": backfill.anchors.FRICTION_IBC_1806_2[f.soil]}
    return backfill.Wall(height=w.height, thickness=t, face_weight=face, **fields, **footing)


def soil_of(site: Site, w, surcharge: float | None = None) -> backfill.Soil:
    """The wall's backfill (its own, else the site's), at `surcharge` if given."""
    b = w.backfill or site.backfill
    efp, source = b.efp()
    return backfill.Soil(efp=efp, source=source, unit_weight=b.unit_weight,
                         surcharge=b.surcharge if surcharge is None else surcharge,
                         water=b.water_level or 0.0)


def pressure_profile(soil: backfill.Soil, height: float) -> list[PressurePoint]:
    """Earth pressure at levels of the backfill: the base shear's slope at each level,
    p = dV/dz of the fill above it (statics of bracing.backfill.resultants)."""
    if height <= 0.0:
        return []
    levels = np.linspace(0.0, height, PROFILE_POINTS)
    step = 1e-4 * height
    upper, _ = soil.at(height, np.minimum(levels + step, height))
    lower, _ = soil.at(height, np.maximum(levels - step, 0.0))
    slope = (lower - upper) / (np.minimum(levels + step, height) - np.maximum(levels - step, 0))
    return [PressurePoint(level_ft=float(z), pressure_psf=float(p))
            for z, p in zip(levels, slope, strict=True)]


def _events_of(site: Site, w) -> list:
    """The backfill events of a wall: its own, and its line's."""
    return [e for e in site.backfill_events
            if e.wall == w.mark or (e.line is not None and e.line == w.line)]


def _top_support(site: Site, w) -> tuple[int | None, int | None]:
    """(day of the last event the wall waits for, day of the first valid sign-off on or after
    it): released from the cantilever check from that sign-off (OSHA 1926.704(a)'s reading for
    braces, method notes §12)."""
    days = {e.name: e.day for e in site.events}
    if not w.release_after:
        return None, None
    event = max(days[n] for n in w.release_after)
    signed = [s.day for s in site.signoffs if s.panel == w.mark and s.day >= event]
    return event, min(signed, default=None)


class _Allowed:
    """The allowed height of one wall, by surcharge and cure, and its stand-down gust by
    backfill height (each worked once)."""

    def __init__(self, site, w, wind, support):
        self.site, self.w, self.wind, self.support = site, w, wind, support
        self.basis = site.site.design_basis
        self.seen: dict = {}

    def limits(self, surcharge: float, cured: bool) -> tuple[float, float | None]:
        """(the most it takes as a cantilever, with its inside braces or None)."""
        key = (surcharge, cured)
        if key not in self.seen:
            wall = engine_wall(self.site, self.w, cured)
            soil = soil_of(self.site, self.w, surcharge)
            alone = cantilever_max(wall, soil, self.wind, self.basis)
            propped = (braced_max(wall, soil, self.wind, self.support)
                       if self.support is not None and alone < wall.height else None)
            self.seen[key] = (alone, propped)
        return self.seen[key]

    def __call__(self, surcharge: float, cured: bool) -> tuple[float, str]:
        """The most it may take and how it is held: as a cantilever, or on its inside braces
        where they take more."""
        alone, propped = self.limits(surcharge, cured)
        if propped is not None and propped > alone:
            return propped, "inside braces"
        return alone, "cantilever"

    def stand_down(self, placed: float, surcharge: float, cured: bool) -> float | None:
        """The stand-down gust (mph) of the cantilever under `placed` of backfill: the
        stand-down ratio x its working limit (None: on its inside braces, or nothing
        exposed)."""
        ratio = self.site.rule_value("stand_down_ratio")
        alone, propped = self.limits(surcharge, cured)
        if ratio is None or (propped is not None and placed > alone + 1e-9):
            return None
        key = ("wind", placed, surcharge, cured)
        if key not in self.seen:
            wall = engine_wall(self.site, self.w)
            if not cured:  # fresh masonry stands by its weight alone (method notes §3)
                wall = replace(wall, material="masonry", tension=0.0)
            self.seen[key] = working_limit(wall, soil_of(self.site, self.w, surcharge),
                                           self.wind, placed, self.basis)
        limit = self.seen[key]
        return None if limit is None else ratio * limit


def _cured(site: Site, w, day: int) -> bool:
    """Masonry mortar cured on `day` (the site's masonry_cure_days): its age counted from the
    build day, else from its age on day 1; concrete, and masonry with neither: True (the
    latter with a warning)."""
    if site.materials[w.material].kind != "masonry":
        return True
    cure = site.rule_value("masonry_cure_days") or DEFAULT_RULES["masonry_cure_days"].value
    if w.build_day is not None:
        return day - w.build_day >= cure
    return w.mortar_age is None or w.mortar_age + day - 1 >= cure


def wall_days(site: Site, w, allowed: _Allowed, last: int) -> list[BackfillDay]:
    """The wall's days from its build day (or day 1) to `last`: the backfill in place, the
    most it may take, and whether it is over."""
    events = _events_of(site, w)
    standing = soil_of(site, w).surcharge
    released = _top_support(site, w)[1]
    out = []
    for d in range(w.build_day or 1, last + 1):
        placed = max((e.height for e in events if e.day <= d), default=0.0)
        surcharge = max([standing] + [e.surcharge for e in events
                                      if e.day == d and e.surcharge is not None])
        stand_down = None
        if released is not None and d >= released:
            limit, support = w.height, "top support"
        else:
            limit, support = allowed(surcharge, _cured(site, w, d))
            if placed <= limit + 1e-6:  # over its limit, the danger speaks, not the wind
                stand_down = allowed.stand_down(placed, surcharge, _cured(site, w, d))
        out.append(BackfillDay(day=d, planned_height_ft=placed, allowed_height_ft=limit,
                               surcharge_psf=surcharge, support=support,
                               over=placed > limit + 1e-6, stand_down_speed_mph=stand_down))
    return out


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
    days = wall_days(site, w, _Allowed(site, w, wind, support), last)
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
        brace = InsideBraceResult(
            height_ft=support.spec.height, spacing_ft=support.spec.spacing,
            angle_deg=support.spec.angle, length_ft=support.length,
            brace_type=support.spec.brace_type, foot_anchor=support.spec.foot_anchor,
            reaction_plf=reaction, force_lb=_axial(propped), capacity_lb=support.brace.capacity,
            max_height_ft=braced_max(wall, soil, wind, support),
            utilization=float(backfill.governing(propped)), checks=propped)
        if needs:
            checks = propped
    exposed = max(w.height - planned, 0.0)
    limit = working_limit(wall, soil, wind, planned, basis) if checks is alone else None
    ratio = site.rule_value("stand_down_ratio")
    return FoundationWallResult(
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


def over_flag(mark: str, d: BackfillDay) -> Flag:
    """The danger of a day whose backfill is above what the wall may take."""
    return Flag("backfill-over-limit", "danger",
                f"{mark}: backfill {d.planned_height_ft:.1f} ft on day {d.day} is above the "
                f"{d.allowed_height_ft:.1f} ft it may take before the floor ({d.support}): "
                "stop the backfill, or brace the wall inside first", SOURCE)


def _flags(site: Site, w, wall: backfill.Wall, days: list[BackfillDay]) -> list[Flag]:
    """The wall's findings: each day over its limit, and what the input leaves unsaid."""
    flags = [over_flag(w.mark, d) for d in days if d.over]
    b = w.backfill or site.backfill
    if not b.drained and b.water_level is None:
        flags.append(Flag("backfill-drainage-not-stated", "warning",
                          f"{w.mark}: no water level and no working drains stated: checked "
                          "dry; give water_level or drained = true", SOURCE))
    if w.footing is None:
        flags.append(Flag("backfill-footing-not-given", "warning",
                          f"{w.mark}: no footing given: overturning and sliding not checked",
                          SOURCE))
    masonry = site.materials[w.material].kind == "masonry"
    if masonry and w.mortar_age is None and w.build_day is None:
        flags.append(Flag("backfill-mortar-age-not-given", "warning",
                          f"{w.mark}: mortar age and build day not given: taken as cured",
                          SOURCE))
    event = _top_support(site, w)[0]
    early = [s for s in site.signoffs if s.panel == w.mark and event is not None
             and s.day < event]
    flags += [Flag("backfill-signoff-before-floor", "warning",
                   f"{w.mark}: sign-off by {s.by} on day {s.day} comes before its floor event "
                   f"(day {event}): ignored, the wall stays a cantilever",
                   "OSHA 29 CFR 1926.704(a)'s reading; " + SOURCE) for s in early]
    if not w.release_after:
        flags.append(Flag("backfill-no-top-support", "notice",
                          f"{w.mark}: no floor event named (release_after): checked as a "
                          "cantilever to the end of the schedule", SOURCE))
    return flags


def day_flags(walls: list[FoundationWallResult]) -> dict[int, list[Flag]]:
    """Each day's backfill dangers (for the day's verdict), by day."""
    out: dict[int, list[Flag]] = {}
    for w in walls:
        for d in w.days:
            if d.over:
                out.setdefault(d.day, []).append(over_flag(w.mark, d))
    return out


def site_flags(walls: list[FoundationWallResult]) -> list[Flag]:
    """Each foundation wall's first day over its limit, as a finding of the site (the wall
    named, its day given; the days carry every day of it)."""
    return [next(f for f in w.flags if f.code == "backfill-over-limit") for w in walls
            if any(d.over for d in w.days)]


def windy_days(walls: list[FoundationWallResult], days) -> list:
    """The days whose forecast gust (or a thunderstorm) reaches the stand-down gust of a
    foundation wall standing as a cantilever that day: the wind part's stand-down (method notes
    §12). Each such day gets `wind_go` False and a sentence naming the walls; returns them."""
    changed = []
    for d in days:
        if d.forecast_gust_mph is None and not d.storm:
            continue
        low = [(x.stand_down_speed_mph, w.mark) for w in walls for x in w.days
               if x.day == d.day and x.stand_down_speed_mph is not None
               and (d.storm or d.forecast_gust_mph >= x.stand_down_speed_mph)]
        if low:
            names = ", ".join(f"{mark} ({speed:.0f} mph)" for speed, mark in sorted(low))
            d.wind_go = False
            d.wind = (d.wind + "; " if d.wind else "") + (
                f"forecast reaches the stand-down gust of foundation wall(s) {names}, the wind "
                "on the part above the backfill: no work beside them, clear their zones")
            changed.append(d)
    return changed


def not_checked(site: Site) -> list[NotChecked]:
    """What the foundation walls' checks leave out (method notes §12), with the walls."""
    walls = [w.mark for w in site.foundation_walls]
    braced_walls = [w.mark for w in site.foundation_walls if w.inside_braces is not None]
    items = [NotChecked(
        item="foundation walls: the wall-to-footing joint and the footing's bearing",
        reason="the wall is taken as a cantilever fixed in its footing (dowels, key) and the "
               "soil's bearing under the footing is not checked; after its release the wall "
               "held top and bottom is the permanent design's", source=SOURCE, walls=walls)]
    if braced_walls:
        items.append(NotChecked(
            item="inside braces of foundation walls",
            reason="their count is not compared with the brace and anchor types' on_hand, and "
                   "the propped wall's span under the wind above the brace is not checked",
            source=SOURCE, walls=braced_walls))
    return items if walls else []
