"""Brace geometry and forces (method notes §4): small pure formulas over numpy arrays.

Section: the wall pivots at its base; a brace pins to the wall at insert height `hb` and to the
slab or ground at distance `d` from the wall face. Plan: braces at positions `x_i` along the wall
share the wind by statics, carrying all the twist (no twist restraint credited at the base).
"""

from __future__ import annotations

import functools

import numpy as np


def brace_geometry(insert_height_ft, anchor_distance_ft, insert_offset_ft=0.0,
                   foot_offset_ft=0.0, base_below_slab_ft=0.0):
    """Run, rise, angle and pin-to-pin length of a brace.

    The insert pin stands `insert_offset` out from the face, the foot pin `foot_offset` above
    the slab, and the wall's base (its pivot) `base_below_slab` below the slab.

    Parameters
    ----------
    insert_height_ft : float or array_like
        Height of the insert on the wall above the slab, ft.
    anchor_distance_ft : float or array_like
        Distance of the foot anchor from the wall face, ft.
    insert_offset_ft, foot_offset_ft, base_below_slab_ft : float, optional
        The offsets above, ft (0 by default).

    Returns
    -------
    run, rise : float or ndarray
        Horizontal and vertical spans between the pins, ft.
    angle : float or ndarray
        Angle from horizontal, degrees.
    length : float or ndarray
        Pin-to-pin length, ft.

    References
    ----------
    Geometry.

    Examples
    --------
    Insert at 20 ft, foot 15 ft out: a 3-4-5 triangle, 25 ft long at 53.13 degrees.

    >>> run, rise, angle, length = brace_geometry(20.0, 15.0)
    >>> float(run), float(rise), round(float(angle), 2), float(length)
    (15.0, 20.0, 53.13, 25.0)
    """
    run = np.asarray(anchor_distance_ft, dtype=float) - insert_offset_ft
    rise = np.asarray(insert_height_ft, dtype=float) - base_below_slab_ft - foot_offset_ft
    return run, rise, np.degrees(np.arctan2(rise, run)), np.hypot(run, rise)


def anchor_distance_for_angle(insert_height_ft, angle_deg, insert_offset_ft=0.0,
                              foot_offset_ft=0.0, base_below_slab_ft=0.0):
    """Foot distance from the wall face that gives a brace an angle from horizontal.

    Parameters
    ----------
    insert_height_ft : float or array_like
        Height of the insert above the slab, ft.
    angle_deg : float or array_like
        Wanted angle from horizontal, degrees.
    insert_offset_ft, foot_offset_ft, base_below_slab_ft : float, optional
        As in `brace_geometry`, ft.

    Returns
    -------
    float or ndarray
        Distance of the foot from the wall face, ft.

    References
    ----------
    Geometry; WAC 296-155-691(4) asks for floor braces at 45 to 60 degrees where possible (text).

    Examples
    --------
    >>> round(float(anchor_distance_for_angle(20.0, 45.0)), 6)
    20.0
    """
    rise = np.asarray(insert_height_ft, dtype=float) - base_below_slab_ft - foot_offset_ft
    return rise / np.tan(np.radians(angle_deg)) + insert_offset_ft


def default_positions(width_ft, count, strip=None):
    """Centres of equal strips along a wall, where braces go by default (method notes §4).

    Parameters
    ----------
    width_ft : float or array_like
        Wall length, ft.
    count : int
        Number of strips (braces).
    strip : int or array_like, optional
        The strips wanted (default all; arrays broadcast, for many walls at once).

    Returns
    -------
    ndarray
        Positions from the wall's left end, ft.

    References
    ----------
    Geometry.

    Examples
    --------
    >>> [float(x) for x in default_positions(20.0, 2)]
    [5.0, 15.0]
    """
    return ((np.arange(count) if strip is None else strip) + 0.5) * width_ft / count


def total_brace_reaction(force_lb, lever_ft, insert_height_ft):
    """Sum of the braces' horizontal reactions, by moments about the base pivot: F z_F / hb.

    Parameters
    ----------
    force_lb : float or array_like
        Wind force on the wall F, lb.
    lever_ft : float or array_like
        Height of its resultant above the pivot z_F, ft.
    insert_height_ft : float or array_like
        Height of the inserts above the pivot hb, ft.

    Returns
    -------
    float or ndarray
        Sum of the horizontal reactions, lb.

    References
    ----------
    Statics (method notes §4).

    Examples
    --------
    F 1,000 lb at 16.5 ft, inserts at 20 ft: 1,000 x 16.5 / 20 = 825 lb.

    >>> total_brace_reaction(1000.0, 16.5, 20.0)
    825.0
    """
    return force_lb * lever_ft / insert_height_ft


def lean_reaction(weight_lb, centroid_height_ft, wall_height_ft, insert_height_ft,
                  lean_ft, slop_ft):
    """Horizontal brace reaction from the wall's weight leaning out of plumb.

    The centroid sits off the pivot by (lean / s + slop / hb) x z_c; the braces hold D e / hb.

    Parameters
    ----------
    weight_lb : float or array_like
        Wall weight D, lb.
    centroid_height_ft : float or array_like
        Height of its centroid z_c above the pivot, ft.
    wall_height_ft : float or array_like
        Wall height s, ft.
    insert_height_ft : float or array_like
        Height of the inserts hb, ft.
    lean_ft : float or array_like
        Out-of-plumb of the wall's top, ft.
    slop_ft : float or array_like
        Play in the braces at the inserts, ft.

    Returns
    -------
    float or ndarray
        Horizontal reaction, lb.

    References
    ----------
    Statics.

    Examples
    --------
    D 10,000 lb, centroid 10 ft up a 20 ft wall, 0.1 ft lean, inserts at 15 ft: e = 0.1 / 20 x
    10 = 0.05 ft, 10,000 x 0.05 / 15 = 33.3 lb.

    >>> round(lean_reaction(10000.0, 10.0, 20.0, 15.0, 0.1, 0.0), 1)
    33.3
    """
    offset = (lean_ft / wall_height_ft + slop_ft / insert_height_ft) * centroid_height_ft
    return weight_lb * offset / insert_height_ft


def brace_lever(positions_ft, mask):
    """Count, centroid, arms from the centroid and polar sum of a brace pattern (statics);
    constant for a layout, so computed once and shared by every load case."""
    n = slot_sum(mask, 0)
    x = np.where(mask, positions_ft, 0.0)
    xc = slot_sum(x) / n
    arm = np.where(mask, positions_ft - xc[..., None], 0.0)
    return n, xc, arm, slot_sum(arm**2)


def brace_shares(total_h, force_lb, force_at_ft, wall_centre_ft, positions_ft, mask, lever=None):
    """Horizontal reaction of each brace: the even share plus the twist (method notes §4).

    R_i = sum(R)/n + M_t (x_i - x_c) / sum((x_j - x_c)^2), with
    M_t = F (x_F - x_c) - (F - sum(R)) (x_w - x_c): the base takes its shear F - sum(R) at the
    wall's centre and no twist.

    Parameters
    ----------
    total_h : ndarray
        Sum of the horizontal reactions of each wall (`total_brace_reaction`), lb; shape
        (..., walls).
    force_lb : ndarray
        Wind force on each wall F, lb.
    force_at_ft : ndarray
        Position of the force along the wall x_F, ft.
    wall_centre_ft : ndarray
        Position of the wall's centre x_w, ft.
    positions_ft : ndarray
        Brace positions x_i, ft; shape (walls, braces).
    mask : ndarray of bool
        True where a brace exists.
    lever : tuple, optional
        `brace_lever` of the pattern, if the caller has it.

    Returns
    -------
    ndarray
        Each brace's reaction, lb; NaN in an empty slot (no brace there: not applicable); inf
        for braces at one point that cannot carry the twist left over.

    References
    ----------
    Statics (method notes §4).

    Examples
    --------
    A 24 ft wall, braces at 2, 8 and 20 ft (x_c = 10 ft), F = 1,000 lb at 16.8 ft and 16.5 ft
    up, inserts at 20 ft: sum R = 825 lb, base shear 175 lb at 12 ft, M_t = 1,000 x 6.8 - 175 x 2
    = 6,450 lb-ft, sum (x - x_c)^2 = 168 ft2; R_i = 275 + 38.393 (-8, -2, 10).

    >>> import numpy as np
    >>> r = brace_shares(np.array([825.0]), np.array([1000.0]), np.array([16.8]),
    ...                  np.array([12.0]), np.array([[2.0, 8.0, 20.0]]), np.ones((1, 3), bool))
    >>> [round(float(v), 2) for v in r[0]]
    [-32.14, 198.21, 658.93]
    """
    lever = lever if lever is not None else brace_lever(positions_ft, mask)
    share, per_arm = share_and_twist(total_h, force_lb, force_at_ft, wall_centre_ft, lever)
    with np.errstate(invalid="ignore"):
        return np.where(mask, each_share(share, per_arm, lever[2]), np.nan)


def each_share(share, per_arm, arm):
    """Each brace's reaction from the terms of `share_and_twist`: R_i = share + per_arm (x_i -
    x_c) (statics; `arm`: x_i - x_c of each slot, from `brace_lever`, 0 at an empty slot)."""
    return share[..., None] + per_arm[..., None] * arm


def share_and_twist(total_h, force_lb, force_at_ft, wall_centre_ft, lever):
    """The two terms of `brace_shares` for each wall: the even share sum(R)/n and the twist per
    ft of arm M_t / sum((x_j - x_c)^2); brace i then takes share + per_arm (x_i - x_c)."""
    n, xc, _, polar = lever
    twist = force_lb * (force_at_ft - xc) - (force_lb - total_h) * (wall_centre_ft - xc)
    apart = polar > 0
    if apart.all():  # every pattern has a lever against twist
        return total_h / n, twist / polar
    with np.errstate(divide="ignore", invalid="ignore"):
        per_arm = np.where(apart, twist / polar, 0.0)
    # Braces at one point (a single brace) have no lever against twist, and the base is given
    # none (method notes §4): any twist left is more than they can carry.
    loose = (polar <= 0) & (np.abs(twist) > 1e-9 * (np.abs(force_lb) + np.abs(total_h) + 1.0))
    return np.where(loose, np.inf, total_h / n), per_arm


def axial_force(horizontal_lb, angle_deg):
    """Brace axial force from its horizontal reaction, P = R_h / cos(theta).

    Parameters
    ----------
    horizontal_lb : float or array_like
        Horizontal reaction, lb.
    angle_deg : float or array_like
        Brace angle from horizontal, degrees.

    Returns
    -------
    float or ndarray
        Axial force, lb.

    References
    ----------
    Statics.

    Examples
    --------
    >>> round(float(axial_force(100.0, 60.0)), 6)
    200.0
    """
    with np.errstate(over="ignore"):
        return horizontal_lb / np.cos(np.radians(angle_deg))


def components(axial_lb, angle_deg=None, cos_sin=None):
    """Horizontal and vertical components of a brace force, P cos(theta) and P sin(theta)
    (statics); `cos_sin`: the angle's cosine and sine worked out beforehand (a search asks
    for the same angles many times), in place of `angle_deg`."""
    if cos_sin is None:
        theta = np.radians(angle_deg)
        cos_sin = np.cos(theta), np.sin(theta)
    return axial_lb * cos_sin[0], axial_lb * cos_sin[1]


def propped_wall_moments(line_load_plf, wall_height_ft, insert_height_ft):
    """Largest bending moments of a wall pinned at its base and propped by its braces, per ft.

    Uniform pressure w on a beam pinned at 0, propped at hb, overhanging to s: R_0 = w s -
    w s^2 / (2 hb); span moment R_0^2 / (2 w) where R_0 > 0; cantilever moment w (s - hb)^2 / 2
    at the prop.

    Parameters
    ----------
    line_load_plf : float or array_like
        Wind pressure times 1 ft, w, lb per ft of height.
    wall_height_ft : float or array_like
        Wall height s, ft.
    insert_height_ft : float or array_like
        Prop height hb, ft.

    Returns
    -------
    span : float or ndarray
        Largest moment between base and prop, lb-ft per ft.
    cantilever : float or ndarray
        Moment at the prop from the overhang, lb-ft per ft.

    References
    ----------
    Statics.

    Examples
    --------
    w 20 lb/ft, s 10 ft, hb 8 ft: R_0 = 200 - 125 = 75 lb, span 75^2 / 40 = 140.6 lb-ft,
    cantilever 20 x 4 / 2 = 40 lb-ft.

    >>> span, cantilever = propped_wall_moments(20.0, 10.0, 8.0)
    >>> round(float(span), 1), float(cantilever)
    (140.6, 40.0)
    """
    w, s, hb = line_load_plf, wall_height_ft, insert_height_ft
    base = w * s - w * s**2 / (2.0 * hb)
    with np.errstate(divide="ignore", invalid="ignore"):
        span = np.where(base > 0, base**2 / (2.0 * w), 0.0)
    cantilever = w * (s - hb) ** 2 / 2.0
    return span, cantilever


def modulus_of_rupture(fc_psi, lam=1.0):
    """Concrete modulus of rupture f_r = 7.5 lambda sqrt(f'c).

    Parameters
    ----------
    fc_psi : float or array_like
        f'c on the day, psi.
    lam : float, optional
        Lightweight concrete factor lambda, 1.0 for normal weight.

    Returns
    -------
    float or ndarray
        f_r, psi.

    References
    ----------
    ACI 318-19 Eq. 19.2.3.1 (from memory).

    Examples
    --------
    f'c 4000 psi: 7.5 x 63.25 = 474.3 psi.

    >>> round(float(modulus_of_rupture(4000.0)), 1)
    474.3
    """
    return 7.5 * lam * np.sqrt(fc_psi)


def cracking_moment(fr_psi, thickness_in):
    """Moment per ft of width that cracks a solid section, f_r S with S = 12 t^2 / 6.

    Parameters
    ----------
    fr_psi : float or array_like
        Modulus of rupture, psi (`modulus_of_rupture`).
    thickness_in : float or array_like
        Section thickness t, in.

    Returns
    -------
    float or ndarray
        Cracking moment, lb-ft per ft.

    References
    ----------
    Statics of an uncracked rectangle; f_r by ACI 318-19 Eq. 19.2.3.1 (from memory).

    Examples
    --------
    f_r 474.3 psi, t 8 in: S = 128 in3, 474.3 x 128 / 12 = 5,059 lb-ft/ft.

    >>> round(float(cracking_moment(474.3, 8.0)))
    5059
    """
    return fr_psi * 12.0 * thickness_in**2 / 6.0 / 12.0


def slot_sum(values, start=0.0):
    """Each wall's sum over its brace slots (the last axis), taken a slot at a time like
    `worst_brace`; with `start` 0 it counts the true slots of a mask."""
    return functools.reduce(np.add, np.moveaxis(values, -1, 0), start)


def worst_brace(values):
    """Each wall's largest value over its brace slots (the last axis), taken a slot at a time:
    numpy's own reduction over so short an axis is many times slower."""
    return functools.reduce(np.maximum, np.moveaxis(values, -1, 0))
