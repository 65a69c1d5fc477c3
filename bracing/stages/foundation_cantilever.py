"""Foundation walls as cantilevers from their footings (method notes §12): the wind on the part
above the backfill, the checks with it, and the limits; named in `bracing.stages.foundation`.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

import numpy as np

from bracing import backfill, stability
from bracing.model import Site
from bracing.stages import loads
from bracing.wind import asce7, asce37


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
        out.append(replace(c, demand=c.demand + factor * extra,
                           combination=f"{c.combination} + {factor:g}{word}"))
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
