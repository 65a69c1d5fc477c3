"""Earth pressure of a backfill against a wall before the floor (method notes §12): IBC Table
1610.1 equivalent fluid pressures, the shear and moment they cause, and their load factors;
named in `bracing.backfill`.

Small pure formulas over floats or numpy arrays. Per foot of wall: forces in lb, moments in
lb-ft, heights in ft, pressures in psf and equivalent fluid pressures in psf per ft of depth.
Heights are measured up from the top of the footing (the wall's base).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

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
# ASCE 7-16 §2.3.1 / §2.4.1: earth pressure H where it adds to the load effect (from memory).
LOAD_FACTOR_H = {"LRFD": 1.6, "ASD": 1.0}
COMBINATION = {"LRFD": "0.9D + 1.6H (ASCE 7-16 §2.3.1, unconfirmed value)",
               "ASD": "0.6D + 1.0H (ASCE 7-16 §2.4.1, unconfirmed value)"}


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


# --- The backfill ------------------------------------------------------------------------------
def pressure_parts(level, height, efp, unit_weight, surcharge=0.0, water=0.0):
    """The unfactored lateral pressure (psf) at `level` ft above the base under a backfill of
    `height` ft, in its three parts (method notes §12, `p = K q_s + EFP z + 62.4 (1 - K) s`):
    the surcharge's `K q_s` (over the full height), the soil's `EFP z` (z the depth below the
    backfill's top) and the water's `62.4 (1 - K) s` (s the depth below the water level at
    `water` ft above the base; K above 1 taken as 1). Zero above the backfill."""
    y = np.asarray(level, dtype=float)
    k = pressure_coefficient(efp, unit_weight)
    below = y <= height
    depth = np.clip(height - y, 0.0, None)
    submerged = np.clip(np.minimum(water, height) - y, 0.0, None)
    return (np.where(below, k * surcharge, 0.0),
            efp * depth,
            WATER_PCF * np.maximum(1.0 - k, 0.0) * submerged)


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
