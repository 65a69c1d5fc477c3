"""Backfill against a wall before the floor gives it top support (method notes §12).

Small pure formulas over floats or numpy arrays. Per foot of wall: forces in lb, moments in
lb-ft, heights in ft, thicknesses and depths in in, stresses in psi, pressures in psf and
equivalent fluid pressures in psf per ft of depth. Heights are measured up from the top of the
footing (the wall's base); the backfill is the unbalanced fill against the wall's outside face.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from bracing import anchors, stability
from bracing.anchor_kinds import KINDS
from bracing.results import Check

# IBC 2018 Table 1610.1, equivalent fluid pressure (psf per ft), (active, at-rest). from memory.
EFP_IBC_1610_1 = {
    "GW": (30.0, 60.0), "GP": (30.0, 60.0), "SW": (30.0, 60.0), "SP": (30.0, 60.0),
    "GM": (40.0, 60.0), "GC": (45.0, 60.0), "SM": (45.0, 60.0),
    "SM-SC": (45.0, 100.0), "SC": (60.0, 100.0), "ML": (45.0, 100.0),
    "ML-CL": (60.0, 100.0), "CL": (60.0, 100.0),
}
UNSUITABLE_IBC_1610_1 = ("OL", "OH", "MH", "CH")  # IBC 2018 Table 1610.1 note (from memory)
EFP_SOURCE = "IBC 2018 Table 1610.1 (unconfirmed value)"
SOIL_UNIT_WEIGHT_PCF = 120.0  # common practice
WATER_PCF = 62.4  # unit weight of water
CONCRETE_PCF = 150.0  # normal-weight concrete, ASCE 7 Table C3.1-2 (from memory)
# ASCE 7-16 §2.3.1 / §2.4.1: earth pressure H where it adds to the load effect (from memory).
LOAD_FACTOR_H = {"LRFD": 1.6, "ASD": 1.0}
COMBINATION = {"LRFD": "0.9D + 1.6H (ASCE 7-16 §2.3.1, unconfirmed value)",
               "ASD": "0.6D + 1.0H (ASCE 7-16 §2.4.1, unconfirmed value)"}
PHI_PLAIN = 0.60  # ACI 318-19 §21.2.1, plain concrete (from memory)
PHI_FLEXURE = 0.90  # tension-controlled, ACI 318-19 Table 21.2.2; TMS 402-16 §9.1.4.4, from memory
PHI_SHEAR_CONCRETE = 0.75  # ACI 318-19 Table 21.2.1
PHI_SHEAR_MASONRY = 0.80  # TMS 402-16 §9.1.4.5 (from memory)
# ASTM A615 deformed bars: nominal area (in^2) and diameter (in), text.
BARS = {"#3": (0.11, 0.375), "#4": (0.20, 0.500), "#5": (0.31, 0.625), "#6": (0.44, 0.750),
        "#7": (0.60, 0.875), "#8": (0.79, 1.000)}


class UnsuitableSoil(ValueError):
    """A soil class that IBC Table 1610.1 does not accept as backfill."""


def equivalent_fluid_pressure(soil: str, state: str = "at_rest") -> float:
    """Design lateral soil load of a soil class, as an equivalent fluid pressure.

    Parameters
    ----------
    soil : str
        Unified soil classification of the backfill ('GW', 'SM', 'CL', ...); case and
        surrounding blanks ignored.
    state : {'at_rest', 'active'}, optional
        At-rest (default; compaction locks it in) or active (a site rule).

    Returns
    -------
    float
        Equivalent fluid pressure, psf per ft of depth.

    Raises
    ------
    UnsuitableSoil
        For OL, OH, MH and CH, which the table does not accept as backfill.
    ValueError
        For an unknown soil class or state.

    References
    ----------
    IBC 2018 Table 1610.1 (from memory; confirm).

    Examples
    --------
    GW 30 active / 60 at-rest; CL 60 / 100 (from memory).

    >>> equivalent_fluid_pressure("GW", "active"), equivalent_fluid_pressure("GW")
    (30.0, 60.0)
    >>> equivalent_fluid_pressure("CL", "active"), equivalent_fluid_pressure("CL")
    (60.0, 100.0)
    """
    name = soil.strip().upper()
    if name in UNSUITABLE_IBC_1610_1:
        raise UnsuitableSoil(f"soil class {name} is unsuitable as backfill (IBC 2018 Table "
                             "1610.1): replace it, or give the geotechnical report's pressure")
    if name not in EFP_IBC_1610_1:
        raise ValueError(f"unknown soil class {soil!r}; one of {', '.join(EFP_IBC_1610_1)}")
    if state not in ("active", "at_rest"):
        raise ValueError(f"pressure state must be 'active' or 'at_rest', not {state!r}")
    active, at_rest = EFP_IBC_1610_1[name]
    return active if state == "active" else at_rest


def pressure_coefficient(efp, unit_weight=SOIL_UNIT_WEIGHT_PCF):
    """Lateral pressure coefficient K = EFP / soil unit weight (method notes §12).

    Parameters
    ----------
    efp : float or array_like
        Equivalent fluid pressure, psf per ft.
    unit_weight : float, optional
        Soil unit weight, pcf (default 120, common practice).

    Returns
    -------
    float or ndarray
        K, dimensionless.

    References
    ----------
    Statics: an equivalent fluid pressure is K gamma.

    Examples
    --------
    60 psf/ft (IBC 2018 Table 1610.1, GW at rest, from memory) over 120 pcf: K = 0.5.

    >>> float(pressure_coefficient(60.0))
    0.5
    """
    return np.asarray(efp, dtype=float) / unit_weight


def resultants(height, efp, unit_weight=SOIL_UNIT_WEIGHT_PCF, surcharge=0.0, water=0.0):
    """Shear and moment at the base of a backfill, per ft of wall, unfactored.

    Pressure at depth z: p = K q_s + EFP z + gamma_w (1 - K) s, with s the depth below the water
    level (water at 62.4 psf/ft plus the submerged soil, K (gamma - gamma_w) per ft; K above 1
    taken as 1, conservative). Integrated: V = K q H + EFP H^2/2 + c h_w^2/2 and
    M = K q H^2/2 + EFP H^3/6 + c h_w^3/6 (statics).

    Parameters
    ----------
    height : float or array_like
        Backfill height H above the base, ft (negative taken as 0).
    efp : float or array_like
        Equivalent fluid pressure, psf per ft.
    unit_weight : float, optional
        Soil unit weight, pcf (default 120, common practice).
    surcharge : float, optional
        Uniform surcharge q_s on the backfill's surface, psf.
    water : float, optional
        Water level above the base h_w, ft (0: drained).

    Returns
    -------
    shear : float or ndarray
        V at the base, lb per ft of wall.
    moment : float or ndarray
        M at the base, lb-ft per ft of wall.

    References
    ----------
    Statics of a triangular pressure; EFP from IBC 2018 Table 1610.1 (from memory).

    Examples
    --------
    8 ft of GW at rest (60 psf/ft, IBC 2018 Table 1610.1, from memory), dry, no surcharge:
    V = 60 x 8^2 / 2 = 1,920 lb/ft, M = 60 x 8^3 / 6 = 5,120 lb-ft/ft.

    >>> [float(v) for v in resultants(8.0, 60.0)]
    [1920.0, 5120.0]
    """
    h = np.maximum(np.asarray(height, dtype=float), 0.0)
    k = pressure_coefficient(efp, unit_weight)
    hw = np.clip(water, 0.0, h)
    extra = WATER_PCF * np.maximum(1.0 - k, 0.0)
    shear = k * surcharge * h + efp * h**2 / 2.0 + extra * hw**2 / 2.0
    moment = k * surcharge * h**2 / 2.0 + efp * h**3 / 6.0 + extra * hw**3 / 6.0
    return shear, moment


def resultants_at(level, height, efp, unit_weight=SOIL_UNIT_WEIGHT_PCF, surcharge=0.0,
                  water=0.0):
    """Shear and moment at a `level` above the base from the backfill above it: the fill above
    is a backfill of height H - y with its water at h_w - y (statics)."""
    return resultants(np.asarray(height) - level, efp, unit_weight, surcharge,
                      np.maximum(np.asarray(water) - level, 0.0))


# --- Wall capacities per foot of wall (b = 12 in) --------------------------------------------
def plain_concrete_moment(fc_psi, thickness_in, lam=1.0):
    """Design flexural strength of a plain concrete wall per ft, 0.60 x 5 lambda sqrt(f'c) S.

    Parameters
    ----------
    fc_psi : float or array_like
        f'c on the day, psi.
    thickness_in : float or array_like
        Wall thickness h, in (S = b h^2 / 6, b = 12 in).
    lam : float, optional
        Lightweight concrete factor lambda, 1.0 for normal weight.

    Returns
    -------
    float or ndarray
        phi Mn, lb-ft per ft of wall.

    References
    ----------
    ACI 318-19 §14.5.2.1, phi 0.60 by §21.2.1 (from memory).

    Examples
    --------
    8 in wall, f'c 2500 psi: S = 12 x 8^2 / 6 = 128 in3; 0.60 x 5 x 50 x 128 / 12 = 1,600
    lb-ft/ft.

    >>> float(plain_concrete_moment(2500.0, 8.0))
    1600.0
    """
    section = 12.0 * np.asarray(thickness_in, dtype=float) ** 2 / 6.0
    return PHI_PLAIN * 5.0 * lam * np.sqrt(fc_psi) * section / 12.0


def plain_concrete_shear(fc_psi, thickness_in, lam=1.0):
    """Design shear strength of a plain concrete wall per ft, 0.60 x 4/3 lambda sqrt(f'c) b h.

    Parameters
    ----------
    fc_psi : float or array_like
        f'c on the day, psi.
    thickness_in : float or array_like
        Wall thickness h, in (b = 12 in).
    lam : float, optional
        Lightweight concrete factor lambda, 1.0 for normal weight.

    Returns
    -------
    float or ndarray
        phi Vn, lb per ft of wall.

    References
    ----------
    ACI 318-19 §14.5.5.1, phi 0.60 by §21.2.1 (from memory).

    Examples
    --------
    8 in wall, f'c 2500 psi: 0.60 x 4/3 x 50 x 12 x 8 = 3,840 lb/ft.

    >>> round(float(plain_concrete_shear(2500.0, 8.0)), 6)
    3840.0
    """
    return PHI_PLAIN * 4.0 / 3.0 * lam * np.sqrt(fc_psi) * 12.0 * thickness_in


def steel_per_foot(bar_area_in2, spacing_in):
    """Bar area per foot of wall, As = A_bar x 12 / s (in^2/ft)."""
    return bar_area_in2 * 12.0 / spacing_in


def stress_block_moment(as_in2, fy_psi, d_in, strength_psi, block_factor):
    """Mn = As fy (d - a/2), a = As fy / (block_factor x f' x b), b = 12 in, lb-ft/ft:
    concrete 0.85 f'c (ACI 318-19 §22.2.2.4.1, §22.3), grouted masonry 0.80 f'm (TMS 402-16
    §9.3.2, from memory)."""
    a = as_in2 * fy_psi / (block_factor * strength_psi * 12.0)
    return as_in2 * fy_psi * (d_in - a / 2.0) / 12.0


def beta_1(fc_psi):
    """Stress block depth factor beta_1.

    Parameters
    ----------
    fc_psi : float or array_like
        f'c, psi.

    Returns
    -------
    float or ndarray
        0.85 up to 4000 psi, less 0.05 per 1000 psi above, at least 0.65; dimensionless.

    References
    ----------
    ACI 318-19 Table 22.2.2.4.3 (from memory).

    Examples
    --------
    >>> [round(float(b), 2) for b in beta_1([3000.0, 5000.0, 9000.0])]
    [0.85, 0.8, 0.65]
    """
    return np.clip(0.85 - 0.05 * (np.asarray(fc_psi, dtype=float) - 4000.0) / 1000.0, 0.65, 0.85)


def flexure_phi(as_in2, fy_psi, d_in, fc_psi, es_psi=29.0e6):
    """phi of a section by its net tensile strain, eps_t = 0.003 (d - c) / c, c = a / beta_1:
    0.90 at eps_t >= 0.005, 0.65 at eps_t <= fy/Es, linear between (ACI 318-19 Table 21.2.2)."""
    c = as_in2 * fy_psi / (0.85 * fc_psi * 12.0) / beta_1(fc_psi)
    strain = 0.003 * (d_in - c) / c
    yield_strain = fy_psi / es_psi
    return np.clip(0.65 + 0.25 * (strain - yield_strain) / (0.005 - yield_strain), 0.65, 0.90)


def reinforced_concrete_moment(as_in2, fy_psi, d_in, fc_psi):
    """phi Mn, ACI 318-19 Ch. 22 rectangular stress block, 0.85 f'c, phi by the net tensile
    strain."""
    return (flexure_phi(as_in2, fy_psi, d_in, fc_psi)
            * stress_block_moment(as_in2, fy_psi, d_in, fc_psi, 0.85))


def reinforced_masonry_moment(as_in2, fy_psi, d_in, fm_psi):
    """phi Mn, TMS 402-16 §9.3 strength design, 0.80 f'm, phi 0.90 (from memory)."""
    return PHI_FLEXURE * stress_block_moment(as_in2, fy_psi, d_in, fm_psi, 0.80)


def concrete_shear(fc_psi, d_in, lam=1.0):
    """One-way design shear strength of a concrete wall per ft, 0.75 x 2 lambda sqrt(f'c) b d.

    Parameters
    ----------
    fc_psi : float or array_like
        f'c on the day, psi.
    d_in : float or array_like
        Effective depth d, in (b = 12 in).
    lam : float, optional
        Lightweight concrete factor lambda, 1.0 for normal weight.

    Returns
    -------
    float or ndarray
        phi Vc, lb per ft of wall.

    References
    ----------
    ACI 318-19 §22.5.5.1, phi 0.75 by Table 21.2.1 (from memory).

    Examples
    --------
    f'c 2500 psi, d 4 in: 0.75 x 2 x 50 x 12 x 4 = 3,600 lb/ft.

    >>> float(concrete_shear(2500.0, 4.0))
    3600.0
    """
    return PHI_SHEAR_CONCRETE * 2.0 * lam * np.sqrt(fc_psi) * 12.0 * d_in


def reinforced_masonry_shear(fm_psi, thickness_in):
    """phi Vnm = 0.80 x 2.25 An sqrt(f'm): TMS 402-16 Eq. 9-21 at M/(V dv) = 1, no axial credit
    (conservative; from memory), An = 12 t of a grouted wall, lb/ft."""
    return PHI_SHEAR_MASONRY * 2.25 * 12.0 * np.asarray(thickness_in) * np.sqrt(fm_psi)


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


# --- One wall ---------------------------------------------------------------------------------
@dataclass(frozen=True)
class Soil:
    """The backfill: its equivalent fluid pressure and where it came from."""

    efp: float                      # psf per ft
    source: str
    unit_weight: float = SOIL_UNIT_WEIGHT_PCF
    surcharge: float = 0.0          # psf on the backfill surface
    water: float = 0.0              # water level above the base, ft (0: drained)

    def at(self, height, level=0.0):
        """Unfactored shear and moment per ft at `level` under a backfill of `height`."""
        return resultants_at(level, height, self.efp, self.unit_weight, self.surcharge,
                             self.water)


@dataclass(frozen=True)
class Wall:
    """A foundation wall as a cantilever from its footing, per foot of wall."""

    height: float                   # ft, above the top of the footing
    thickness: float                # in
    material: str                   # plain | reinforced | masonry | reinforced_masonry
    face_weight: float              # psf
    fc: float = 2500.0              # f'c on the day, psi
    lam: float = 1.0
    steel: float = 0.0              # As per ft, in^2
    fy: float = 60000.0
    depth: float = 0.0              # d, in
    fm: float = 2000.0              # f'm, psi
    tension: float = 0.0            # masonry allowable flexural tension normal to bed joints, psi
    grouting: str = "grouted"
    cured: bool = True              # masonry: mortar (and grout) cured
    footing_width: float | None = None      # ft
    footing_thickness: float = 1.0          # ft
    toe: float | None = None                # ft, inside projection (default: wall centred)
    friction: float = anchors.FRICTION_IBC_1806_2["silty_sand"]

    @property
    def weight(self) -> float:
        return self.face_weight * self.height

    def wall_lever(self) -> float:
        toe = (self.footing_width - self.thickness / 12.0) / 2.0 if self.toe is None else self.toe
        return toe + self.thickness / 24.0


STRENGTH = (LOAD_FACTOR_H["LRFD"], "1.6H (ASCE 7-16 §2.3.1, unconfirmed value)")
ALLOWABLE = (LOAD_FACTOR_H["ASD"], "1.0H (ASCE 7-16 §2.4.1, unconfirmed value)")


@dataclass(frozen=True)
class Section:
    """What a horizontal section of the wall resists, per ft, and on which combination."""

    moment: object                  # lb-ft/ft
    shear: object                   # lb/ft
    factor: float                   # on H
    combination: str
    moment_source: str
    shear_source: str


def section(wall: Wall, axial) -> Section:
    """The wall's section capacities (`axial`: the weight above the section, lb/ft, credited
    only by unreinforced masonry)."""
    t = wall.thickness
    if wall.material == "plain":
        return Section(plain_concrete_moment(wall.fc, t, wall.lam),
                       plain_concrete_shear(wall.fc, t, wall.lam), *STRENGTH,
                       "ACI 318-19 §14.5.2.1, phi 0.60 (unconfirmed value)",
                       "ACI 318-19 §14.5.5.1, phi 0.60 (unconfirmed value)")
    if wall.material == "reinforced":
        return Section(reinforced_concrete_moment(wall.steel, wall.fy, wall.depth, wall.fc),
                       concrete_shear(wall.fc, wall.depth, wall.lam), *STRENGTH,
                       "ACI 318-19 §22.3, phi by Table 21.2.2", "ACI 318-19 §22.5.5.1, phi 0.75")
    credit = 1.0 if wall.cured else 0.0  # fresh masonry takes no backfill (method notes §12)
    if wall.material == "reinforced_masonry":
        return Section(credit * reinforced_masonry_moment(wall.steel, wall.fy, wall.depth, wall.fm),
                       credit * reinforced_masonry_shear(wall.fm, t), *STRENGTH,
                       "TMS 402-16 §9.3.3, phi 0.90 (unconfirmed value)",
                       "TMS 402-16 §9.3.3.1.2, phi 0.80 (unconfirmed value)")
    s, a = stability.masonry_section(t, wall.grouting)
    return Section(credit * stability.masonry_flexural_capacity(wall.tension, s, a, axial),
                   credit * stability.masonry_bed_joint_shear(a, axial, wall.fm), *ALLOWABLE,
                   "TMS 402-16 §8.2.4 allowable flexural tension normal to bed joints "
                   "(unconfirmed value)",
                   "TMS 402-16 §8.2.6.2 bed-joint shear (unconfirmed value)")


def wall_checks(wall: Wall, sec: Section, moment, shear, region: str) -> list:
    """Flexure and shear of the wall's section under unfactored earth-pressure effects."""
    return [Check("wall", f"flexure {region}", sec.factor * moment, sec.moment, "lb·ft/ft",
                  sec.combination, sec.moment_source),
            Check("wall", f"shear {region}", sec.factor * shear, sec.shear, "lb/ft",
                  sec.combination, sec.shear_source)]


def block_checks(wall: Wall, shear, moment, basis: str) -> list:
    """The wall and footing as one block: overturning about the toe (by `basis`) and sliding on
    the footing's base (IBC Table 1806.2 friction, allowable: 0.6D + 1.0H)."""
    footing = CONCRETE_PCF * wall.footing_width * wall.footing_thickness
    dead = anchors.DEAD_LOAD_FACTOR_RESISTING[basis]
    resist = dead * block_overturning_resistance(wall.weight, wall.wall_lever(), footing,
                                                 wall.footing_width)
    tipping = LOAD_FACTOR_H[basis] * toe_moment(shear, moment, wall.footing_thickness)
    sliding = anchors.deadman_sliding(wall.weight + footing, 0.0, wall.friction)
    return [Check("wall and footing", "overturning about the toe", tipping, resist, "lb·ft/ft",
                  COMBINATION[basis], "statics, no slab credited (method notes §12)"),
            Check("wall and footing", "sliding on the footing base", ALLOWABLE[0] * shear,
                  sliding, "lb/ft", COMBINATION["ASD"], "IBC Table 1806.2 friction x 0.6D")]


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


def span_effects(soil: Soil, height, brace_height, reaction, points: int = 201):
    """Largest |moment| and |shear| per ft between the pinned base and the top of a propped
    wall (statics over `points` levels up to the backfill top)."""
    level = np.linspace(0.0, height, points)
    shear, moment = soil.at(height, level)
    below = level < brace_height
    moment = moment - reaction * np.maximum(brace_height - level, 0.0)
    shear = shear - np.where(below, reaction, 0.0)
    return float(np.max(np.abs(shear))), float(np.max(np.abs(moment)))


def braced_checks(wall: Wall, soil: Soil, height: float, brace: InsideBrace) -> list:
    """The propped wall (pinned at its base, conservative), its braces and their anchors."""
    reaction = brace_reaction(soil.at(height)[1], brace.height)
    axial = brace_force(reaction, brace.spacing, brace.angle)
    shear, moment = span_effects(soil, height, brace.height, reaction)
    checks = wall_checks(wall, section(wall, 0.0), moment, shear, "between base and brace")
    checks.append(Check("inside brace", "axial", ALLOWABLE[0] * float(axial), brace.capacity,
                        "lb", ALLOWABLE[1], "brace rating (allowable), R = M_base / h_b"))
    lift = ALLOWABLE[0] * float(brace_uplift(reaction, brace.angle))
    checks.append(Check("wall", "lifted by the braces", lift,
                        anchors.DEAD_LOAD_FACTOR_RESISTING["ASD"] * wall.weight, "lb/ft",
                        COMBINATION["ASD"], "statics, R tan(theta) against 0.6D"))
    if brace.anchor_tension is not None and brace.anchor_shear is not None:
        pull = ALLOWABLE[0] * float(reaction) * brace.spacing
        anchor = KINDS["stake"]
        checks.append(Check("brace foot anchor", "tension and shear",
                            float(anchor.ratio(0.0, pull, axial, brace.anchor_tension,
                                               brace.anchor_shear)),
                            1.0, "ratio", ALLOWABLE[1], anchor.source))
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

