"""ASCE 7-16 wind: velocity pressure (Ch. 26) and solid freestanding walls (§29.3, Figure 29.3-1).

Every function is vectorised: floats or numpy arrays in, the broadcast shape out. Geometry follows
Figure 29.3-1: `s` is the wall's own height, `h` the height of its top above grade (so s/h = 1 for
a wall standing on grade), `B` its length along the wind line, `x` a distance from the windward end.
Velocity pressure lives here; Figure 29.3-1's Cases A and B in `asce7_cases_ab`, Case C in
`asce7_case_c`, all named here.
"""

import numpy as np

from bracing.wind.asce7_case_c import case_c_bins, case_c_cf, case_c_max, case_c_mean
from bracing.wind.asce7_cases_ab import (
    case_b_linear_factor,
    cf_cases_ab,
    cf_open,
    opening_factor,
    resultant_height_ratio,
)

__all__ = [
    "GUST_FACTOR",
    "KD_WALLS",
    "MIN_PRESSURE_PSF",
    "TERRAIN",
    "case_b_linear_factor",
    "case_c_bins",
    "case_c_cf",
    "case_c_max",
    "case_c_mean",
    "cf_cases_ab",
    "cf_open",
    "ke",
    "kz",
    "opening_factor",
    "resultant_height_ratio",
    "terrain_constants",
    "velocity_pressure",
]


# ASCE 7-16 Table 26.11-1: (alpha, zg ft) of each exposure
TERRAIN = {"B": (7.0, 1200.0), "C": (9.5, 900.0), "D": (11.5, 700.0)}
GUST_FACTOR = 0.85  # ASCE 7-16 §26.11.1, rigid structure
KD_WALLS = 0.85  # ASCE 7-16 Table 26.6-1, solid freestanding walls and signs
MIN_PRESSURE_PSF = 16.0  # ASCE 7-16 §29.7 minimum design wind load on As (from memory)


def terrain_constants(exposure):
    """Power-law exponent alpha and gradient height zg of an exposure category.

    Parameters
    ----------
    exposure : str or array_like of str
        Exposure category 'B', 'C' or 'D' (ASCE 7-16 §26.7); case and surrounding blanks ignored.

    Returns
    -------
    alpha : float or ndarray
        Power-law exponent, dimensionless.
    zg : float or ndarray
        Gradient height, ft.

    Raises
    ------
    ValueError
        For an exposure other than B, C or D.

    References
    ----------
    ASCE 7-16 Table 26.11-1.

    Examples
    --------
    Table 26.11-1, exposure C: alpha 9.5, zg 900 ft (text, same as ASCE 7-05).

    >>> alpha, zg = terrain_constants("C")
    >>> float(alpha), float(zg)
    (9.5, 900.0)
    """
    raw = np.asarray(exposure, dtype=str)
    codes = np.char.upper(np.char.strip(raw))
    alpha = np.empty(codes.shape)
    zg = np.empty(codes.shape)
    known = np.zeros(codes.shape, dtype=bool)
    for name, (a, z) in TERRAIN.items():  # ASCE 7-16 Table 26.11-1
        hit = codes == name
        alpha[hit], zg[hit] = a, z
        known |= hit
    if not known.all():
        unknown = sorted(set(np.atleast_1d(raw[~known]).tolist()))
        raise ValueError(f"unknown wind exposure {unknown}: expected 'B', 'C' or 'D'")
    return alpha[()], zg[()]


def kz(z_ft, exposure):
    """Velocity pressure exposure coefficient Kz at a height above grade.

    Parameters
    ----------
    z_ft : float or array_like
        Height above grade, ft. Heights below 15 ft take Kz at 15 ft.
    exposure : str or array_like of str
        Exposure category 'B', 'C' or 'D'.

    Returns
    -------
    float or ndarray
        Kz, dimensionless: 2.01 (z / zg)^(2 / alpha), z at least 15 ft.

    References
    ----------
    ASCE 7-16 Table 26.10-1 note 1; alpha and zg from Table 26.11-1.

    Examples
    --------
    Table 26.10-1 prints 0.57 / 0.85 / 1.03 for exposures B / C / D at 0 to 15 ft (text as ASCE
    7-05 Table 6-3 case 2, secondary for 7-16). By hand for C: 2.01 (15/900)^(2/9.5) =
    2.01 x 0.4223 = 0.849.

    >>> [round(float(kz(15.0, e)), 2) for e in "BCD"]
    [0.57, 0.85, 1.03]

    At 30 ft the table prints 0.70 / 0.98 / 1.16 (same marks); below 15 ft Kz stays at its 15 ft
    value.

    >>> [round(float(kz(30.0, e)), 2) for e in "BCD"]
    [0.7, 0.98, 1.16]
    >>> float(kz(5.0, "C")) == float(kz(15.0, "C"))
    True
    """
    alpha, zg = terrain_constants(exposure)
    z = np.maximum(np.asarray(z_ft, dtype=float), 15.0)
    return 2.01 * (z / zg) ** (2.0 / alpha)  # ASCE 7-16 Table 26.10-1 note 1


def ke(ground_elevation_ft):
    """Ground elevation factor Ke of a site above sea level.

    Parameters
    ----------
    ground_elevation_ft : float or array_like
        Ground elevation above sea level, ft.

    Returns
    -------
    float or ndarray
        Ke, dimensionless: exp(-0.0000362 z_g).

    References
    ----------
    ASCE 7-16 Table 26.9-1 and its note.

    Examples
    --------
    Table 26.9-1: 1.00 at sea level, 0.96 at 1,000 ft, 0.90 at 3,000 ft, 0.80 at 6,000 ft
    (secondary). By hand at 3,000 ft: exp(-0.1086) = 0.897.

    >>> [round(float(ke(z)), 2) for z in (0.0, 1000.0, 3000.0, 6000.0)]
    [1.0, 0.96, 0.9, 0.8]
    """
    return np.exp(-0.0000362 * np.asarray(ground_elevation_ft, dtype=float))  # Table 26.9-1 note


def velocity_pressure(v_mph, kz, kzt=1.0, kd=KD_WALLS, ke=1.0):
    """Velocity pressure q of a 3-second gust (33 ft, exposure C), psf.

    Parameters
    ----------
    v_mph : float or array_like
        Wind speed, 3-second gust at 33 ft in exposure C, mph.
    kz : float or array_like
        Velocity pressure exposure coefficient (`kz`).
    kzt : float, optional
        Topographic factor (§26.8), default 1.0.
    kd : float, optional
        Directionality factor, default 0.85 (`KD_WALLS`: solid freestanding walls and signs,
        Table 26.6-1).
    ke : float, optional
        Ground elevation factor (`ke`), default 1.0.

    Returns
    -------
    float or ndarray
        q = 0.00256 Kz Kzt Kd Ke V^2, psf.

    References
    ----------
    ASCE 7-16 Eq. 26.10-1 (secondary); Kd from Table 26.6-1 (secondary).

    Examples
    --------
    Kz 0.98 (Table 26.10-1, C at 30 ft, secondary), Kd 0.85 (Table 26.6-1, secondary), 115 mph:
    0.00256 x 0.98 x 0.85 x 115^2 = 28.2 psf.

    >>> KD_WALLS
    0.85
    >>> round(float(velocity_pressure(115.0, 0.98)), 1)
    28.2

    The third-party worked sheet (ASCE 7-05, secondary): V 90 mph, Kh 1.01, q_h 17.80 psf.

    >>> round(float(velocity_pressure(90.0, 1.01)), 2)
    17.8
    """
    v = np.asarray(v_mph, dtype=float)
    return 0.00256 * kz * kzt * kd * ke * v**2  # ASCE 7-16 Eq. 26.10-1
