"""ASCE 7-16 solid freestanding walls, Figure 29.3-1 Case C: Cf by distance from the windward
end, with the return-corner reduction; named in `bracing.wind.asce7`.

Every function is vectorised: floats or numpy arrays in, the broadcast shape out. Geometry follows
Figure 29.3-1: `s` is the wall's own height, `h` the height of its top above grade, `B` its length
along the wind line, `x` a distance from the windward end.
"""

import numpy as np

from bracing.wind.asce7_cases_ab import _interp_index, cf_cases_ab

# ASCE 7-16 Figure 29.3-1, Case C: Cf by region of x/s (bins) and B/s (rows). The region edges
# 1, 2, 3, 4, 5, 10 are shared by every column; where a column defines fewer regions (B/s 2 to
# 10 stop at 2s, 3s or 10s) its last region is carried on to the bins beyond it.
_C_B_OVER_S = np.array([2.0, 3.0, 4.0, 5.0, 6.0, 7.0, 8.0, 9.0, 10.0, 13.0, 45.0])
_C_EDGES = np.array([1.0, 2.0, 3.0, 4.0, 5.0, 10.0])  # x/s where the regions change
_C_BIN_LO = np.array([-np.inf, 1.0, 2.0, 3.0, 4.0, 5.0, 10.0])
_C_BIN_HI = np.array([1.0, 2.0, 3.0, 4.0, 5.0, 10.0, np.inf])
_C_CF = np.array([
    # 0-s   s-2s  2s-3s 3s-4s 4s-5s 5s-10s >10s
    [2.25, 1.50, 1.50, 1.50, 1.50, 1.50, 1.50],  # B/s 2
    [2.60, 1.70, 1.15, 1.15, 1.15, 1.15, 1.15],  # 3
    [2.90, 1.90, 1.30, 1.10, 1.10, 1.10, 1.10],  # 4
    [3.10, 2.00, 1.45, 1.05, 1.05, 1.05, 1.05],  # 5
    [3.30, 2.15, 1.55, 1.05, 1.05, 1.05, 1.05],  # 6
    [3.40, 2.25, 1.65, 1.05, 1.05, 1.05, 1.05],  # 7
    [3.55, 2.30, 1.70, 1.05, 1.05, 1.05, 1.05],  # 8
    [3.65, 2.35, 1.75, 1.00, 1.00, 1.00, 1.00],  # 9
    [3.75, 2.45, 1.85, 0.95, 0.95, 0.95, 0.95],  # 10
    [4.00, 2.60, 2.00, 1.50, 1.35, 0.90, 0.55],  # 13
    [4.30, 2.55, 1.95, 1.85, 1.85, 1.10, 0.55],  # >= 45
])
_C_STARRED = _C_B_OVER_S >= 5.0  # asterisked 0-s cells: B/s 5 to 10, 13, >= 45

# ASCE 7-16 Figure 29.3-1, Case C return-corner note: Lr/s 0.3, 1.0, >= 2 -> 0.90, 0.75, 0.60.
# Team's reading: 1.0 at Lr/s = 0 (no return), linear from 0 to 0.3 like the rest of the table.
_RETURN_RATIO = np.array([0.0, 0.3, 1.0, 2.0])
_RETURN_FACTOR = np.array([1.0, 0.90, 0.75, 0.60])


def _return_corner_factor(return_ratio):
    """Multiplier on the asterisked 0-s Case C cells for a return wall Lr/s long."""
    return np.interp(np.asarray(return_ratio, dtype=float), _RETURN_RATIO, _RETURN_FACTOR)


def case_c_bins(b_over_s, s_over_h, return_ratio=0.0):
    """Case C Cf in each x/s region of walls, interpolated in B/s, reduced for a return corner.

    Parameters
    ----------
    b_over_s : ndarray
        B/s of each wall.
    s_over_h : ndarray
        s/h of each wall (Cf times 1.8 - s/h where s/h > 0.8, Figure 29.3-1 note 4).
    return_ratio : float or ndarray, optional
        Lr/s of a return wall at the windward end, 0 for none; it reduces the asterisked 0-s
        cells (B/s 5 and over) by 0.90, 0.75, 0.60 at Lr/s 0.3, 1, 2 and more.

    Returns
    -------
    ndarray
        Cf by region on the last axis: 0-s, s-2s, 2s-3s, 3s-4s, 4s-5s, 5s-10s, beyond 10s.
        `case_c_cf`, `case_c_mean` and `case_c_max` take them from a caller that asks about
        several points of the same walls.

    References
    ----------
    ASCE 7-16 Figure 29.3-1, Case C and its notes (text via ASCE 7-05; secondary for 7-16).

    Examples
    --------
    B/s 5, s/h 0.5 (no reduction for height): 3.10, 2.00, 1.45, then 1.05 to the end.

    >>> import numpy as np
    >>> [float(c) for c in case_c_bins(np.array([5.0]), np.array([0.5]))[0]]
    [3.1, 2.0, 1.45, 1.05, 1.05, 1.05, 1.05]
    """
    i, w = _interp_index(_C_B_OVER_S, b_over_s)
    bins = (1.0 - w)[..., None] * _C_CF[i] + w[..., None] * _C_CF[i + 1]
    if np.any(return_ratio):
        reduction = _return_corner_factor(return_ratio)

        def first(k):  # the 0-s cell of one tabulated column
            return _C_CF[k, 0] * np.where(_C_STARRED[k], reduction, 1.0)
        bins[..., 0] = (1.0 - w) * first(i) + w * first(i + 1)
    tall = np.minimum(1.0, 1.8 - np.minimum(s_over_h, 1.0))  # Figure 29.3-1 note 4: s/h > 0.8
    return bins * tall[..., None]


def case_c_cf(x_over_s, b_over_s, s_over_h, return_ratio=0.0, bins=None, ab=None):
    """Local Case C Cf at a point of a wall, x/s from its windward end.

    Regions 0-s, s-2s, ... of Figure 29.3-1; a point on a region edge belongs to the region
    downwind of it. Between tabulated B/s the coefficient is interpolated linearly in B/s at the
    same position x. Where B/s < 2 Case C does not apply and the Case A/B value is returned, so
    callers may envelope freely.

    Parameters
    ----------
    x_over_s : float or array_like
        Distance from the windward end over the wall's height s.
    b_over_s, s_over_h : float or array_like
        B/s and s/h of the wall.
    return_ratio : float or array_like, optional
        Lr/s of a return wall at the windward end, 0 for none.
    bins : ndarray, optional
        The walls' `case_c_bins`, if the caller has them.
    ab : ndarray, optional
        The walls' `cf_cases_ab`, if the caller has them.

    Returns
    -------
    float or ndarray
        Cf at the point, dimensionless.

    References
    ----------
    ASCE 7-16 Figure 29.3-1, Case C (text via ASCE 7-05; secondary for 7-16).

    Examples
    --------
    B/s 5, s/h 0.5: 3.10 in the first s, 2.00 in the second. With s/h 1 the note's factor
    1.8 - 1 = 0.8 gives 3.10 x 0.8 = 2.48; a return wall Lr/s 0.3 takes the asterisked cell to
    3.10 x 0.90 = 2.79.

    >>> float(case_c_cf(0.5, 5.0, 0.5)), float(case_c_cf(1.5, 5.0, 0.5))
    (3.1, 2.0)
    >>> round(float(case_c_cf(0.5, 5.0, 1.0)), 2), round(float(case_c_cf(0.5, 5.0, 0.5, 0.3)), 2)
    (2.48, 2.79)

    Below B/s 2 it is Case A/B's value (s/h 1, B/s 1: 1.45).

    >>> float(case_c_cf(0.5, 1.0, 1.0))
    1.45
    """
    x, b, r, lr = np.broadcast_arrays(*(np.asarray(a, dtype=float) for a in
                                        (x_over_s, b_over_s, s_over_h, return_ratio)))
    if bins is None:
        bins = case_c_bins(b, r, lr)
    k = np.searchsorted(_C_EDGES, x, side="right")
    local = np.take_along_axis(bins, k[..., None], axis=-1)[..., 0]
    return _case_ab_below_two(local, b, r, ab)  # Case C for B/s >= 2 only


def case_c_mean(x0_over_s, x1_over_s, b_over_s, s_over_h, return_ratio=0.0, bins=None, ab=None):
    """Mean Case C Cf over [x0, x1] (in s from the windward end) and the load's centroid (in s).

    Exact integration of the piecewise-constant regional coefficients: a panel occupying
    [x0, x1] of a longer wall line takes mean_cf times its area, acting at centroid_over_s.
    Where B/s < 2 it returns the Case A/B value at the middle of the interval.

    Parameters
    ----------
    x0_over_s, x1_over_s : float or array_like
        Ends of the interval, in s from the windward end (either order).
    b_over_s, s_over_h : float or array_like
        B/s and s/h of the wall line.
    return_ratio : float or array_like, optional
        Lr/s of a return wall at the windward end, 0 for none.
    bins, ab : ndarray, optional
        The walls' `case_c_bins` and `cf_cases_ab`, if the caller has them.

    Returns
    -------
    mean_cf : float or ndarray
        Mean Cf over the interval, dimensionless.
    centroid_over_s : float or ndarray
        Position of the resultant, in s from the windward end.

    References
    ----------
    ASCE 7-16 Figure 29.3-1, Case C: each region's force through its centroid (text via ASCE
    7-05; secondary for 7-16).

    Examples
    --------
    B/s 5, s/h 0.5, over the first 2s: (3.10 + 2.00) / 2 = 2.55, centroid
    (3.10 x 0.5 + 2.00 x 1.5) / 5.10 = 0.892 s.

    >>> mean, centroid = case_c_mean(0.0, 2.0, 5.0, 0.5)
    >>> round(float(mean), 2), round(float(centroid), 3)
    (2.55, 0.892)
    """
    x0, x1, b, r, lr = np.broadcast_arrays(*(np.asarray(a, dtype=float) for a in (
        x0_over_s, x1_over_s, b_over_s, s_over_h, return_ratio)))
    if bins is None:
        bins = case_c_bins(b, r, lr)
    lo, hi = np.minimum(x0, x1), np.maximum(x0, x1)
    start, end = np.maximum(lo[..., None], _C_BIN_LO), np.minimum(hi[..., None], _C_BIN_HI)
    force = bins * np.maximum(end - start, 0.0)  # Cf x length, per region
    total = force.sum(axis=-1)
    moment = (force * 0.5 * (start + end)).sum(axis=-1)
    width = hi - lo
    with np.errstate(divide="ignore", invalid="ignore"):
        mean = total / width
        point = width <= 0.0  # an interval of no width: the local value there
        if point.any():
            mean = np.where(point, case_c_cf(lo, b, r, lr, np.broadcast_to(bins, force.shape)),
                            mean)
        centroid = np.where(total > 0.0, moment / total, 0.5 * (lo + hi))
    short = b < 2.0  # Case C applies for B/s >= 2 only
    mean = _case_ab_below_two(mean, b, r, ab)
    centroid = np.where(short, 0.5 * (lo + hi), centroid)
    return mean[()], centroid[()]


def case_c_max(x0_over_s, x1_over_s, b_over_s, s_over_h, return_ratio=0.0, bins=None,
               ab=None):
    """Largest local Case C Cf over [x0, x1] (in s from the windward end) of a wall B/s long.

    A strip of a wall built in place takes the largest regional coefficient it touches (method
    notes §2): beside a return wall the reduced 0-s region may be below the s-2s one, so no
    region is assumed to govern. A point on a region edge belongs to the region downwind of it,
    as in `case_c_cf`. Where B/s < 2 Case C does not apply and the Case A/B value is returned.

    Parameters
    ----------
    x0_over_s, x1_over_s : float or array_like
        Ends of the strip, in s from the windward end (either order).
    b_over_s, s_over_h : float or array_like
        B/s and s/h of the wall.
    return_ratio : float or array_like, optional
        Lr/s of a return wall at the windward end, 0 for none.
    bins, ab : ndarray, optional
        The walls' `case_c_bins` and `cf_cases_ab`, if the caller has them.

    Returns
    -------
    float or ndarray
        The largest Cf the strip touches, dimensionless.

    References
    ----------
    ASCE 7-16 Figure 29.3-1, Case C and its return-corner note (text via ASCE 7-05; secondary
    for 7-16).

    Examples
    --------
    B/s 5, s/h 0.5, a strip from 0.5s to 2.5s: 3.10 governs with no return wall; with a return
    wall Lr/s 2 the 0-s cell falls to 3.10 x 0.60 = 1.86 and the s-2s region's 2.00 governs.

    >>> float(case_c_max(0.5, 2.5, 5.0, 0.5)), float(case_c_max(0.5, 2.5, 5.0, 0.5, 2.0))
    (3.1, 2.0)
    """
    x0, x1, b, r, lr = np.broadcast_arrays(*(np.asarray(a, dtype=float) for a in
                                             (x0_over_s, x1_over_s, b_over_s, s_over_h,
                                              return_ratio)))
    if bins is None:
        bins = case_c_bins(b, r, lr)
    lo, hi = np.minimum(x0, x1), np.maximum(x0, x1)
    # the region holding lo, and every region after it that starts before hi
    first = np.searchsorted(_C_EDGES, lo, side="right")
    last = np.maximum(np.searchsorted(_C_EDGES, hi, side="left"), first)
    largest = np.full(np.shape(lo), -np.inf)
    for k in range(len(_C_BIN_LO)):  # a region at a time: a reduction over so short an axis
        #                              is many times slower
        largest = np.where((first <= k) & (k <= last), np.maximum(largest, bins[..., k]),
                           largest)
    return _case_ab_below_two(largest, b, r, ab)  # Case C for B/s >= 2 only


def _case_ab_below_two(case_c, b_over_s, s_over_h, ab=None):
    """`case_c`, with the Case A/B value where B/s < 2 (Case C does not apply there): from
    `ab` (the walls' `cf_cases_ab`, if the caller has them), else looked up for those walls
    only."""
    short = b_over_s < 2.0
    if not short.any():
        return case_c[()]
    out = np.array(case_c, dtype=float)
    out[short] = (cf_cases_ab(b_over_s[short], s_over_h[short]) if ab is None
                  else np.broadcast_to(ab, short.shape)[short])
    return out[()]
