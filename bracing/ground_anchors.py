"""Ground anchors: helical anchors (ICC-ES AC358) and deadmen (weight and friction).

Pure functions over floats or numpy arrays. Forces in lb, lengths in ft, torque in ft-lb.
"""

from __future__ import annotations

import numpy as np

# --- Helical anchors, ICC-ES AC358: torque correlation factor Kt (1/ft) -----------------------
KT_AC358_PER_FT = {"1.5in_square": 10.0, "2.875in_round": 9.0, "3.5in_round": 7.0}
KT_AC358_CERTAINTY = {"1.5in_square": "secondary", "2.875in_round": "from memory",
                      "3.5in_round": "from memory"}
HELICAL_FACTOR_OF_SAFETY = 2.0  # ICC-ES AC358 (secondary)

# --- Deadman friction and bearing ------------------------------------------------------------
# IBC Table 1806.2 lateral sliding resistance coefficients: ALLOWABLE values, times dead load.
# text (2012 edition), except crystalline bedrock (from memory).
FRICTION_IBC_1806_2 = {
    "crystalline_bedrock": 0.70,
    "sedimentary_rock": 0.35,  # sedimentary and foliated rock
    "sandy_gravel": 0.35,  # sandy gravel and/or gravel (GW, GP)
    "silty_sand": 0.25,  # sand, silty sand, clayey sand, silty and clayey gravel (SW..GC)
}
# IBC Table 1806.2 clays and silts (CL, ML, MH, CH): cohesion 130 psf times the contact area,
# at most half the dead load (text, 2012 edition).
COHESION_IBC_1806_2_PSF = {"clay_silt": 130.0}
# IBC Table 1806.2 presumptive allowable foundation pressure, psf (from memory).
BEARING_IBC_1806_2_PSF = {
    "crystalline_bedrock": 12_000.0, "sedimentary_rock": 4_000.0, "sandy_gravel": 3_000.0,
    "silty_sand": 2_000.0, "clay_silt": 1_500.0,
}
# NAVFAC DM-7.02 Table 1, mass concrete on soil: ULTIMATE friction factors, lower end of each
# published range (from memory): divide by SLIDING_FS_ULTIMATE.
FRICTION_NAVFAC_DM7_02 = {
    "sandy_gravel": 0.55,  # clean gravel, gravel-sand mixtures, coarse sand: 0.55-0.60
    "medium_sand": 0.45,  # clean fine to medium sand, silty medium to coarse sand: 0.45-0.55
    "silty_sand": 0.35,  # clean fine sand, silty or clayey fine to medium sand: 0.35-0.45
    "stiff_clay": 0.30,  # medium stiff and stiff clay and silty clay: 0.30-0.35
}
# Block resting on a slab: ACI 318-19 Table 22.9.4.2, concrete against hardened concrete not
# intentionally roughened, mu = 0.6 lambda (from memory); a nominal value, so divide by the FS.
FRICTION_CONCRETE_ON_CONCRETE = 0.6
SLIDING_FS_ULTIMATE = 1.5  # on ultimate or nominal friction (NAVFAC DM-7.02, from memory)
DEAD_LOAD_FACTOR_RESISTING = {"ASD": 0.6, "LRFD": 0.9}  # ASCE 7-16 §2.4.1 / §2.3.1
# The tables a deadman's `soil` reads its friction from, and the basis of their values.
FRICTION_TABLES = {"IBC": (FRICTION_IBC_1806_2, "allowable"),
                   "NAVFAC": (FRICTION_NAVFAC_DM7_02, "ultimate")}




def soil_friction(soil: str, table: str = "IBC") -> tuple[float, str]:
    """Friction coefficient of concrete on a soil, and whether it is allowable or ultimate.

    Parameters
    ----------
    soil : str
        A key of the table: 'sandy_gravel', 'silty_sand', ... (`FRICTION_IBC_1806_2`,
        `FRICTION_NAVFAC_DM7_02`).
    table : {'IBC', 'NAVFAC'}, optional
        IBC Table 1806.2 (allowable, default) or NAVFAC DM-7.02 Table 1 (ultimate, the lower end
        of its range: divide by `SLIDING_FS_ULTIMATE`).

    Returns
    -------
    mu : float
        Friction coefficient, dimensionless.
    basis : {'allowable', 'ultimate'}

    References
    ----------
    IBC Table 1806.2 (text, 2012 edition); NAVFAC DM-7.02 Table 1 (references.md lists its
    ranges).

    Examples
    --------
    IBC Table 1806.2: sand, silty or clayey sand 0.25 (text); NAVFAC clean gravel or coarse sand
    0.55 to 0.60, the lower end taken.

    >>> soil_friction("silty_sand")
    (0.25, 'allowable')
    >>> soil_friction("sandy_gravel", "NAVFAC")
    (0.55, 'ultimate')
    """
    values, basis = FRICTION_TABLES[table]
    return values[soil], basis


def allowable_friction(mu, basis: str):
    """The friction coefficient to use with 0.6D: an allowable value (IBC Table 1806.2) as it
    is; an ultimate or nominal one (NAVFAC DM-7.02, concrete on concrete, ACI 318-19
    §22.9.4.2) over SLIDING_FS_ULTIMATE."""
    return (np.asarray(mu, dtype=float) / (1.0 if basis == "allowable"
                                           else SLIDING_FS_ULTIMATE))[()]


def _dead_load_factor(basis):
    """The factor on dead load that resists: by basis name, or given as a number (a load
    combination's own factor, such as 0.6 for an observed gust)."""
    if isinstance(basis, (int, float)):
        return float(basis)
    if basis not in DEAD_LOAD_FACTOR_RESISTING:
        raise ValueError(f"basis must be 'ASD' or 'LRFD', not {basis!r}")
    return DEAD_LOAD_FACTOR_RESISTING[basis]


# --- Helical ground anchors: ICC-ES AC358 ----------------------------------------------------
def helical_capacity(torque_ftlb, Kt_per_ft=10.0, factor_of_safety=HELICAL_FACTOR_OF_SAFETY):
    """Allowable tension of a helical anchor from its final installation torque.

    Parameters
    ----------
    torque_ftlb : float or array_like
        Final installation torque T, ft-lb.
    Kt_per_ft : float or array_like, optional
        Torque correlation factor, 1/ft: 10 for a 1.5 in square shaft (secondary); 9 for
        2-7/8 in and 7 for 3-1/2 in round shafts (from memory).
    factor_of_safety : float, optional
        2 (ICC-ES AC358, secondary).

    Returns
    -------
    float or ndarray
        Allowable tension Kt T / FS, lb.

    References
    ----------
    ICC-ES AC358.

    Examples
    --------
    3,000 ft-lb on a 1.5 in square shaft: 10 x 3,000 / 2 = 15,000 lb (secondary).

    >>> float(helical_capacity(3000.0))
    15000.0
    """
    return (np.asarray(Kt_per_ft, dtype=float) * torque_ftlb / factor_of_safety)[()]


def required_torque(load_lb, Kt_per_ft=10.0, factor_of_safety=HELICAL_FACTOR_OF_SAFETY):
    """Final installation torque for an allowable load, T = FS P / Kt, ft-lb (ICC-ES AC358)."""
    return (factor_of_safety * np.asarray(load_lb, dtype=float) / Kt_per_ft)[()]


# --- Deadman blocks ------------------------------------------------------------------------
def deadman_uplift(weight_lb, basis="ASD"):
    """Uplift a deadman resists by weight alone, lb: 0.6 W (ASD) or 0.9 W (LRFD).

    ASCE 7-16 §2.4.1 (0.6D + 0.6W) / §2.3.1 (0.9D + 1.0W); compare with the uplift demand.
    """
    return (_dead_load_factor(basis) * np.asarray(weight_lb, dtype=float))[()]


def deadman_sliding(weight_lb, uplift_lb, mu, factor_of_safety=1.0, basis="ASD"):
    """Horizontal force a deadman resists by friction, lb: mu / FS (0.6 W - uplift) >= 0.

    IBC Table 1806.2 coefficients are already allowable (FS 1.0); NAVFAC DM-7.02 ultimate
    values and concrete on concrete (ACI 318-19 Table 22.9.4.2) take SLIDING_FS_ULTIMATE.
    Dead load factor by basis (ASCE 7-16 §2.4.1 / §2.3.1); uplift is on the same basis.
    """
    normal = _dead_load_factor(basis) * np.asarray(weight_lb, dtype=float) - uplift_lb
    return (np.asarray(mu, dtype=float) / factor_of_safety * np.maximum(normal, 0.0))[()]


def deadman_overturning_moment(pull_lb, uplift_lb, attach_height_ft, attach_from_toe_ft):
    """Overturning moment about the deadman's toe (its edge nearer the wall), lb-ft.

    The brace foot pulls horizontally (pull_lb) at attach_height_ft above the block's base
    and lifts (uplift_lb) at attach_from_toe_ft from the toe in plan (statics).
    """
    return (np.asarray(pull_lb, dtype=float) * attach_height_ft
            + np.asarray(uplift_lb, dtype=float) * attach_from_toe_ft)[()]


def deadman_resisting_moment(weight_lb, toe_to_centroid_ft, basis="ASD"):
    """Moment of the deadman's factored weight about its toe, lb-ft (0.6 W ASD, 0.9 W LRFD)."""
    return (deadman_uplift(weight_lb, basis) * np.asarray(toe_to_centroid_ft, dtype=float))[()]
