"""Converting wind speeds: gust to sustained averages, anemometer readings to the reference gust.

The reference gust is the ASCE 7 basis: a peak 3-second gust at 33 ft in exposure C (open terrain).
"""

import numpy as np

from bracing.wind.asce7 import terrain_constants

KNOT_MPH = 1.151  # 1 knot in mph (secondary)

# ASCE 7-16 commentary gust-factor curve, open terrain (from memory): 3-s gust / mean over ...
SUSTAINED_RATIOS = {"1-min": 1.22, "2-min": 1.30, "10-min": 1.43, "1-hour": 1.52}


def sustained_equivalents(gust_mph):
    """Mean speeds over 1 min, 2 min, 10 min and 1 hour that match a 3-second gust, open terrain.

    Parameters
    ----------
    gust_mph : float or array_like
        3-second gust, mph.

    Returns
    -------
    dict of str to float or ndarray
        Mean speed, mph, by averaging time: "1-min", "2-min", "10-min", "1-hour".

    References
    ----------
    ASCE 7 commentary, gust-factor curve over open terrain (from memory): the 3-second gust is
    1.22, 1.30, 1.43 and 1.52 times those means.

    Examples
    --------
    A 122 mph gust: 122 / 1.22 = 100 mph over a minute, 122 / 1.30 = 93.8 mph over two (from
    memory).

    >>> {k: round(float(v), 1) for k, v in sustained_equivalents(122.0).items()}
    {'1-min': 100.0, '2-min': 93.8, '10-min': 85.3, '1-hour': 80.3}
    """
    gust = np.asarray(gust_mph, dtype=float)
    return {name: (gust / ratio)[()] for name, ratio in SUSTAINED_RATIOS.items()}


def sustained_equivalents_of_each(gust_mph) -> list[dict[str, float]]:
    """`sustained_equivalents` of each gust of an array: one dict of plain floats per gust."""
    gust = np.asarray(gust_mph, dtype=float)
    one_min, two_min, ten_min, one_hour = ((gust / ratio).tolist()
                                           for ratio in SUSTAINED_RATIOS.values())
    # the names of SUSTAINED_RATIOS in its order, written out: such a dict is made at once
    return [{"1-min": a, "2-min": b, "10-min": c, "1-hour": d}
            for a, b, c, d in zip(one_min, two_min, ten_min, one_hour, strict=True)]


def _kz_power_law(z_ft, exposure):
    """Kz by the power law WITHOUT the 15 ft floor (for speeds at a measuring height)."""
    alpha, zg = terrain_constants(exposure)
    return 2.01 * (np.asarray(z_ft, dtype=float) / zg) ** (2.0 / alpha)  # Table 26.10-1 note 1


def anemometer_factor(z_ft, exposure):
    """Gust at a height in an exposure divided by the reference gust (33 ft, exposure C).

    sqrt(Kz_site(z) / Kz_C(33 ft)) by the power law without its 15 ft floor (design.md §3):
    an anemometer there reads the reference gust times this factor.

    Parameters
    ----------
    z_ft : float or array_like
        Height of the anemometer above grade, ft (> 0).
    exposure : str or array_like of str
        Exposure category around it, 'B', 'C' or 'D'.

    Returns
    -------
    float or ndarray
        Ratio of speeds, dimensionless.

    Raises
    ------
    ValueError
        For a height at or below grade.

    References
    ----------
    ASCE 7-16 Table 26.10-1 note 1 (the power law) and Eq. 26.10-1 (q proportional to Kz V^2);
    alpha and zg from Table 26.11-1 (text).

    Examples
    --------
    At 33 ft in exposure C it is 1 by definition. At 10 ft in exposure B: Kz_B(10) = 2.01
    (10/1200)^(2/7) = 0.51185, Kz_C(33) = 2.01 (33/900)^(2/9.5) = 1.00216, sqrt(0.51075) = 0.7147.

    >>> float(anemometer_factor(33.0, "C"))
    1.0
    >>> round(float(anemometer_factor(10.0, "B")), 4)
    0.7147
    """
    z = np.asarray(z_ft, dtype=float)
    if not np.all(z > 0.0):
        raise ValueError("anemometer height must be above grade (z_ft > 0)")
    reference = _kz_power_law(33.0, "C")
    return np.sqrt(_kz_power_law(z, exposure) / reference)[()]  # q ~ Kz V^2, Eq. 26.10-1


def reference_gust_from_reading(reading_mph, z_ft, exposure):
    """Reference gust (3-second, 33 ft, exposure C) from a gust read at a height in an exposure.

    Parameters
    ----------
    reading_mph : float or array_like
        Gust read by the anemometer, mph.
    z_ft : float or array_like
        Height of the anemometer above grade, ft.
    exposure : str or array_like of str
        Exposure category around it.

    Returns
    -------
    float or ndarray
        The reading divided by `anemometer_factor`, mph.

    References
    ----------
    ASCE 7-16 Table 26.10-1 note 1 and Eq. 26.10-1 (design.md §3).

    Examples
    --------
    50 mph read at 10 ft in exposure B: 50 / 0.7147 = 70.0 mph reference gust.

    >>> round(float(reference_gust_from_reading(50.0, 10.0, "B")), 1)
    70.0
    """
    return (np.asarray(reading_mph, dtype=float) / anemometer_factor(z_ft, exposure))[()]

