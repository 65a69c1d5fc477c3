"""What a foundation wall's horizontal section resists, per foot: plain and reinforced concrete
(ACI 318-19), unreinforced and reinforced masonry (TMS 402-16), and the checks of a section
under earth pressure (method notes §12); named in `bracing.backfill`.

Small pure formulas over floats or numpy arrays. Per foot of wall: forces in lb, moments in
lb-ft, thicknesses and depths in in, stresses in psi.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from bracing import anchors, stability
from bracing.earth_pressure import LOAD_FACTOR_H
from bracing.results import Check

PHI_PLAIN = 0.60  # ACI 318-19 §21.2.1, plain concrete (from memory)
PHI_FLEXURE = 0.90  # tension-controlled, ACI 318-19 Table 21.2.2; TMS 402-16 §9.1.4.4, from memory
PHI_SHEAR_CONCRETE = 0.75  # ACI 318-19 Table 21.2.1
PHI_SHEAR_MASONRY = 0.80  # TMS 402-16 §9.1.4.5 (from memory)
# ASTM A615 deformed bars: nominal area (in^2) and diameter (in), text.
BARS = {"#3": (0.11, 0.375), "#4": (0.20, 0.500), "#5": (0.31, 0.625), "#6": (0.44, 0.750),
        "#7": (0.60, 0.875), "#8": (0.79, 1.000)}


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
    0.90 at eps_t >= eps_ty + 0.003 (tension-controlled), 0.65 at eps_t <= eps_ty = fy/Es,
    linear between (ACI 318-19 Table 21.2.2; the limit 0.005 of earlier editions is not used)."""
    c = as_in2 * fy_psi / (0.85 * fc_psi * 12.0) / beta_1(fc_psi)
    strain = 0.003 * (d_in - c) / c
    yield_strain = fy_psi / es_psi
    return np.clip(0.65 + 0.25 * (strain - yield_strain) / 0.003, 0.65, 0.90)


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
    return [Check(element="wall", region=f"flexure {region}", demand=sec.factor * moment,
                  capacity=sec.moment, unit="lb·ft/ft", combination=sec.combination,
                  source=sec.moment_source),
            Check(element="wall", region=f"shear {region}", demand=sec.factor * shear,
                  capacity=sec.shear, unit="lb/ft", combination=sec.combination,
                  source=sec.shear_source)]
