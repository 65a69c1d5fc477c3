"""ASCE 7-16 solid freestanding walls, Figure 29.3-1 Cases A and B: Cf, openings, the Case B
linear distribution and the height of the resultant; named in `bracing.wind.asce7`.

Every function is vectorised: floats or numpy arrays in, the broadcast shape out. Geometry follows
Figure 29.3-1: `s` is the wall's own height, `h` the height of its top above grade, `B` its length
along the wind line.
"""

import numpy as np

# ASCE 7-16 Figure 29.3-1, Cases A and B: Cf by s/h (rows, ascending) and B/s (columns).
_AB_B_OVER_S = np.array([0.05, 0.1, 0.2, 0.5, 1.0, 2.0, 4.0, 5.0, 10.0, 20.0, 30.0, 45.0])
_AB_S_OVER_H = np.array([0.16, 0.2, 0.3, 0.5, 0.7, 0.9, 1.0])
_AB_CF = np.array([
    [1.95, 1.90, 1.85, 1.85, 1.80, 1.80, 1.85, 1.85, 1.85, 1.90, 1.90, 1.95],  # s/h <= 0.16
    [1.95, 1.90, 1.85, 1.80, 1.80, 1.80, 1.80, 1.80, 1.85, 1.90, 1.90, 1.95],  # 0.2
    [1.95, 1.90, 1.85, 1.80, 1.80, 1.80, 1.80, 1.80, 1.80, 1.85, 1.85, 1.85],  # 0.3
    [1.95, 1.85, 1.80, 1.75, 1.75, 1.70, 1.70, 1.70, 1.70, 1.70, 1.70, 1.75],  # 0.5
    [1.90, 1.85, 1.75, 1.70, 1.65, 1.60, 1.60, 1.55, 1.55, 1.55, 1.55, 1.55],  # 0.7
    [1.85, 1.75, 1.70, 1.60, 1.55, 1.50, 1.45, 1.45, 1.40, 1.40, 1.40, 1.40],  # 0.9
    [1.80, 1.70, 1.65, 1.55, 1.45, 1.40, 1.35, 1.35, 1.30, 1.30, 1.30, 1.30],  # 1
])


def _interp_index(grid, x):
    """Left index and weight for linear interpolation on an ascending grid, clamped at its ends."""
    x = np.clip(x, grid[0], grid[-1])
    i = np.clip(np.searchsorted(grid, x, side="right") - 1, 0, len(grid) - 2)
    return i, (x - grid[i]) / (grid[i + 1] - grid[i])


def cf_cases_ab(b_over_s, s_over_h):
    """Force coefficient Cf of a solid freestanding wall for Cases A and B, on its gross area.

    Parameters
    ----------
    b_over_s : float or array_like
        B/s, the wall's length over its height.
    s_over_h : float or array_like
        s/h, the wall's height over the height of its top above grade (1 on grade).

    Returns
    -------
    float or ndarray
        Cf, dimensionless, bilinear in B/s and s/h (Figure 29.3-1 note 5), clamped to the
        table's edges (B/s <= 0.05 and >= 45, s/h <= 0.16 and 1).

    References
    ----------
    ASCE 7-16 Figure 29.3-1, Cases A and B (text via a national code copying ASCE 7-05; three
    cells confirmed for 7-16, secondary).

    Examples
    --------
    Tabulated cells: s/h 1, B/s 1: 1.45; s/h 0.5, B/s 10: 1.70.

    >>> float(cf_cases_ab(1.0, 1.0)), float(cf_cases_ab(10.0, 0.5))
    (1.45, 1.7)

    The third-party worked sheet (ASCE 7-05, secondary): s 8 ft, h 35 ft, B 100 ft gives Cf 1.848.

    >>> round(float(cf_cases_ab(100.0 / 8.0, 8.0 / 35.0)), 3)
    1.848
    """
    b, r = np.broadcast_arrays(np.asarray(b_over_s, dtype=float), np.asarray(s_over_h, dtype=float))
    i, u = _interp_index(_AB_B_OVER_S, b)
    j, v = _interp_index(_AB_S_OVER_H, r)
    lower = (1.0 - u) * _AB_CF[j, i] + u * _AB_CF[j, i + 1]
    upper = (1.0 - u) * _AB_CF[j + 1, i] + u * _AB_CF[j + 1, i + 1]
    return ((1.0 - v) * lower + v * upper)[()]  # ASCE 7-16 Figure 29.3-1, Cases A and B


def opening_factor(solidity):
    """Reduction of Cf for openings in a wall.

    Parameters
    ----------
    solidity : float or array_like
        Solid area over gross area, eps (1.0 for a solid wall); clipped to [0, 1].

    Returns
    -------
    float or ndarray
        1 - (1 - eps)^1.5, dimensionless.

    References
    ----------
    ASCE 7-16 Figure 29.3-1 note 3 (text via ASCE 7-05).

    Examples
    --------
    The note's reduction is 0.968 at eps 0.9, 0.911 at 0.8 and 0.836 at 0.7.

    >>> [round(float(f), 3) for f in opening_factor([0.9, 0.8, 0.7])]
    [0.968, 0.911, 0.836]
    """
    eps = np.clip(np.asarray(solidity, dtype=float), 0.0, 1.0)
    return 1.0 - (1.0 - eps) ** 1.5  # ASCE 7-16 Figure 29.3-1 note 3


def cf_open(solidity):
    """Cf on the solid area of an open wall (solidity under 0.7), flat-sided members.

    Parameters
    ----------
    solidity : float or array_like
        Solid area over gross area, eps.

    Returns
    -------
    float or ndarray
        Cf on the solid area: 2.0 below 0.1, 1.8 from 0.1 to 0.29, 1.6 from 0.3 (also above 0.7:
        callers use it only below 0.7).

    References
    ----------
    ASCE 7-16 Ch. 29, open signs and lattice frameworks (from memory).

    Examples
    --------
    The table's three rows (from memory).

    >>> [float(c) for c in cf_open([0.05, 0.2, 0.5])]
    [2.0, 1.8, 1.6]
    """
    eps = np.asarray(solidity, dtype=float)
    return np.where(eps < 0.1, 2.0, np.where(eps < 0.3, 1.8, 1.6))[()]


def case_b_linear_factor(middle_over_b):
    """Case B of a wall built in place, as a pressure varying linearly along it.

    The strip centred `middle_over_b` (a fraction of B from either end) takes p_avg times this
    factor over its area, wind from whichever end loads it more. p(x) = p_avg (1 + 2.4 (x/B -
    1/2)) has its resultant 0.2 B off centre, as Figure 29.3-1 places Case B's (method notes §2);
    over a strip it averages to its value at the strip's middle, and from the worse end that is
    1 + 2.4 |x/B - 1/2| (at least 1: Case A's uniform pressure never exceeds it).

    Parameters
    ----------
    middle_over_b : float or array_like
        Middle of the strip as a fraction of the wall's length B.

    Returns
    -------
    float or ndarray
        Factor on the average pressure, dimensionless, 1.0 to 2.2.

    References
    ----------
    ASCE 7-16 Figure 29.3-1, Case B: resultant 0.2 B toward the windward edge (text via ASCE
    7-05); the linear profile is the project's reading (method notes §2).

    Examples
    --------
    The resultant of the linear profile sits at B/2 + 2.4/12 B = 0.7 B, 0.2 B off centre as the
    figure places it; the ends take 1 + 2.4 x 0.5 = 2.2 and the middle 1.0.

    >>> [round(float(f), 2) for f in case_b_linear_factor([0.0, 0.5, 1.0])]
    [2.2, 1.0, 2.2]
    """
    return 1.0 + 2.4 * np.abs(np.asarray(middle_over_b, dtype=float) - 0.5)


def resultant_height_ratio(s_over_h):
    """Height of the resultant above the wall's base, as a fraction of s, for a solid wall.

    Parameters
    ----------
    s_over_h : float or array_like
        s/h of the wall (1 for a wall standing on grade).

    Returns
    -------
    float or ndarray
        0.5 (the geometric centre) where s/h < 1; 0.55 where s/h = 1.

    References
    ----------
    ASCE 7-16 Figure 29.3-1 notes: for s/h = 1 the resultant acts 0.05 h above the geometric
    centre (text via ASCE 7-05).

    Examples
    --------
    >>> [float(r) for r in resultant_height_ratio([0.5, 1.0])]
    [0.5, 0.55]
    """
    on_grade = np.asarray(s_over_h, dtype=float) >= 1.0 - 1e-9
    return np.where(on_grade, 0.55, 0.5)[()]
