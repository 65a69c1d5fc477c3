"""ASCE 37-14 construction-period factor on the basic wind speed (Table 6.2-1).

ASCE 37-14 was written against ASCE 7-10; the team applies it to ASCE 7-16 speeds (method notes §1).
"""

import numpy as np

WEEKS_PER_YEAR = 365.25 / 7.0

# ASCE 37-14 Table 6.2-1 (band upper bound in weeks, factor on V): less than 6 weeks 0.75 (from
# memory); 6 weeks to 1 year 0.8 (secondary); 1 to 2 years 0.85, 2 to 5 years 0.9 (from memory);
# beyond 5 years the permanent structure's wind, 1.0. Each band includes its lower end (a
# duration on a shared boundary takes the higher factor); 5 years itself is still 0.9.
PERIOD_BANDS = (
    (6.0, 0.75),
    (WEEKS_PER_YEAR, 0.8),
    (2.0 * WEEKS_PER_YEAR, 0.85),
    (5.0 * WEEKS_PER_YEAR, 0.9),
    (np.inf, 1.0),
)
_UPPER = np.array([upper for upper, _ in PERIOD_BANDS])
_FACTOR = np.array([factor for _, factor in PERIOD_BANDS])


def _band(duration_weeks):
    """Index into PERIOD_BANDS of the band a construction period (weeks) falls in."""
    d = np.asarray(duration_weeks, dtype=float)
    if not np.all(d >= 0.0):
        raise ValueError("construction period must be a number of weeks >= 0")
    band = np.searchsorted(_UPPER[:3], d, side="right")  # lower ends inclusive
    return np.where(d > _UPPER[3], 4, band)  # 2 to 5 years includes 5 years


def period_factor(duration_weeks):
    """Factor on the basic wind speed for a structure standing a given construction period.

    Parameters
    ----------
    duration_weeks : float or array_like
        Construction period, weeks (>= 0).

    Returns
    -------
    float or ndarray
        Factor on V, dimensionless: 0.75 under 6 weeks, 0.8 from 6 weeks to 1 year, 0.85 from
        1 to 2 years, 0.9 from 2 to 5 years, 1.0 beyond. Each band includes its lower end; 5
        years itself is still 0.9.

    Raises
    ------
    ValueError
        For a negative or NaN period.

    References
    ----------
    ASCE 37-14 Table 6.2-1, applied to ASCE 7-16 speeds (method notes §1).

    Examples
    --------
    Less than 6 weeks 0.75 (from memory); 6 weeks to 1 year 0.8 (secondary); 1 to 2 years 0.85
    and 2 to 5 years 0.9 (from memory).

    >>> [float(f) for f in period_factor([3.0, 6.0, 26.0, 80.0, 200.0])]
    [0.75, 0.8, 0.8, 0.85, 0.9]
    """
    return _FACTOR[_band(duration_weeks)][()]  # ASCE 37-14 Table 6.2-1


def period_band_limit_weeks(duration_weeks):
    """Upper end of the construction-period band a duration falls in; past it the factor rises.

    Parameters
    ----------
    duration_weeks : float or array_like
        Construction period, weeks (>= 0).

    Returns
    -------
    float or ndarray
        The band's upper end, weeks (inf for the band beyond 5 years).

    References
    ----------
    ASCE 37-14 Table 6.2-1.

    Examples
    --------
    10 weeks lies in the band "6 weeks to 1 year" (secondary), which ends at 365.25 / 7 weeks.

    >>> round(float(period_band_limit_weeks(10.0)), 2)
    52.18
    """
    return _UPPER[_band(duration_weeks)][()]  # ASCE 37-14 Table 6.2-1
