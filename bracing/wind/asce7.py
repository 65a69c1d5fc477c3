"""ASCE 7-16 wind: velocity pressure (Ch. 26) and solid freestanding walls (§29.3, Figure 29.3-1).

Every function is vectorised: floats or numpy arrays in, the broadcast shape out. Geometry follows
Figure 29.3-1: `s` is the wall's own height, `h` the height of its top above grade (so s/h = 1 for
a wall standing on grade), `B` its length along the wind line, `x` a distance from the windward end.
"""

import numpy as np

# ASCE 7-16 Table 26.11-1: (alpha, zg ft) of each exposure
TERRAIN = {"B": (7.0, 1200.0), "C": (9.5, 900.0), "D": (11.5, 700.0)}
GUST_FACTOR = 0.85  # ASCE 7-16 §26.11.1, rigid structure
KD_WALLS = 0.85  # ASCE 7-16 Table 26.6-1, solid freestanding walls and signs
MIN_PRESSURE_PSF = 16.0  # ASCE 7-16 §29.7 minimum design wind load on As (from memory)

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


def case_c_mean(x0_over_s, x1_over_s, b_over_s, s_over_h, return_ratio=0.0, bins=None,
                ab=None):
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
    x0, x1, b, r, lr = np.broadcast_arrays(*(np.asarray(a, dtype=float) for a in
                                             (x0_over_s, x1_over_s, b_over_s, s_over_h,
                                              return_ratio)))
    if bins is None:
        bins = case_c_bins(b, r, lr)
    lo, hi = np.minimum(x0, x1), np.maximum(x0, x1)
    start = np.maximum(lo[..., None], _C_BIN_LO)
    end = np.minimum(hi[..., None], _C_BIN_HI)
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
