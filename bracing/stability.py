"""Walls standing on their own (method notes §3): small pure formulas over numpy arrays."""

from __future__ import annotations

import numpy as np

# TMS 402-16 Table 8.2.4.2, allowable flexural tension normal to bed joints (psi), by unit
# and mortar ("M/S" portland cement/lime or mortar cement M or S, "N"). from memory.
FLEXURAL_TENSION_PSI = {
    ("solid", "M/S"): 53.0, ("solid", "N"): 40.0,
    ("hollow", "M/S"): 33.0, ("hollow", "N"): 25.0,
    ("grouted", "M/S"): 86.0, ("grouted", "N"): 84.0,
}
# ASTM C90 least face-shell thickness (in) by nominal unit width (in), from memory.
FACE_SHELL_IN = {4.0: 0.75, 6.0: 1.0, 8.0: 1.25, 10.0: 1.375, 12.0: 1.5}


def face_shell(thickness_in):
    """Face shell thickness of a hollow unit from its actual thickness.

    Parameters
    ----------
    thickness_in : float or array_like
        Actual unit thickness, in (nominal = actual + 3/8 in).

    Returns
    -------
    float or ndarray
        Least face-shell thickness, in, of the nearest nominal width in `FACE_SHELL_IN`.

    References
    ----------
    ASTM C90 least face-shell thickness by nominal width (from memory).

    Examples
    --------
    An 8 in unit (7-5/8 in actual): 1-1/4 in (from memory).

    >>> float(face_shell(7.625))
    1.25
    """
    nominal = np.asarray(thickness_in, dtype=float) + 0.375
    widths = np.array(list(FACE_SHELL_IN))
    shells = np.array(list(FACE_SHELL_IN.values()))
    return shells[np.clip(np.searchsorted(widths, nominal - 0.5), 0, len(widths) - 1)]


def rocking_resistance(weight, thickness_ft):
    """Moment that a wall's weight resists about its leeward base edge, W t / 2.

    Parameters
    ----------
    weight : float or array_like
        Weight of the wall (or per ft), lb (lb/ft).
    thickness_ft : float or array_like
        Wall thickness, ft.

    Returns
    -------
    float or ndarray
        Resisting moment, lb-ft (lb-ft/ft).

    References
    ----------
    Statics.

    Examples
    --------
    >>> rocking_resistance(1000.0, 0.5)
    250.0
    """
    return weight * thickness_ft / 2.0


def footing_resistance(weight, footing_width_ft):
    """Moment of the weight on a footing centred under the wall, about the toe, W B / 2.

    Parameters
    ----------
    weight : float or array_like
        Weight of wall and footing, lb (or lb/ft).
    footing_width_ft : float or array_like
        Footing width, ft.

    Returns
    -------
    float or ndarray
        Resisting moment, lb-ft (or lb-ft/ft).

    References
    ----------
    Statics.

    Examples
    --------
    >>> footing_resistance(1000.0, 3.0)
    1500.0
    """
    return weight * footing_width_ft / 2.0


def max_soil_pressure(vertical, moment, width_ft, length_ft):
    """Peak soil pressure under a footing: linear pressure, no tension.

    e <= W/6: P/A (1 + 6e/W); e < W/2: 2P / (3 L (W/2 - e)); e >= W/2: infinite (it tips).

    Parameters
    ----------
    vertical : float or array_like
        Vertical load P, lb.
    moment : float or array_like
        Overturning moment about the footing's centre, lb-ft (e = M / P).
    width_ft, length_ft : float or array_like
        Footing width W (in the moment's direction) and length L, ft.

    Returns
    -------
    float or ndarray
        Peak pressure, psf (inf where the resultant is outside the footing).

    References
    ----------
    Statics (the kern formula).

    Examples
    --------
    P 1,000 lb on a 3 ft x 1 ft footing: e = 0.1 ft inside the kern gives 333.3 x 1.2 = 400 psf;
    e = 1.0 ft gives 2,000 / (3 x 0.5) = 1,333 psf; e = 1.6 ft is past the edge.

    >>> [round(float(max_soil_pressure(1000.0, m, 3.0, 1.0))) for m in (100.0, 1000.0)]
    [400, 1333]
    >>> float(max_soil_pressure(1000.0, 1600.0, 3.0, 1.0))
    inf
    """
    e = moment / vertical
    inside = e <= width_ft / 6.0
    with np.errstate(divide="ignore", invalid="ignore"):
        trapezoid = vertical / (width_ft * length_ft) * (1.0 + 6.0 * e / width_ft)
        triangle = 2.0 * vertical / (3.0 * length_ft * (width_ft / 2.0 - e))
    q = np.where(inside, trapezoid, triangle)
    return np.where(e >= width_ft / 2.0, np.inf, q)


def masonry_section(thickness_in, grouting):
    """Section modulus and area per foot of a masonry wall's bed joint.

    Hollow units are bedded on their face shells only (TMS 402-16 net section; the face shell of
    ASTM C90, from memory); solid and grouted walls on the full thickness.

    Parameters
    ----------
    thickness_in : float or array_like
        Actual wall thickness t, in.
    grouting : str or array_like of str
        'hollow', 'grouted' or 'solid'.

    Returns
    -------
    section_in3 : float or ndarray
        Section modulus S per ft, in3.
    area_in2 : float or ndarray
        Net bedded area per ft, in2.

    References
    ----------
    TMS 402-16 §8.2 net section; statics of two face shells.

    Examples
    --------
    8 in hollow (t 7.625 in, face shells 1.25 in): I = 2 (12 x 1.25^3 / 12 + 12 x 1.25 x
    3.1875^2) = 308.7 in4, S = 308.7 / 3.8125 = 81.0 in3, A = 24 x 1.25 = 30 in2.

    >>> [round(float(v), 1) for v in masonry_section(7.625, "hollow")]
    [81.0, 30.0]
    """
    t = np.asarray(thickness_in, dtype=float)
    hollow = np.asarray(grouting) == "hollow"
    fs = np.minimum(face_shell(t), t / 2.0)
    lever = (t - fs) / 2.0
    i_hollow = 2.0 * (12.0 * fs**3 / 12.0 + 12.0 * fs * lever**2)
    s_hollow = i_hollow / (t / 2.0)
    s_solid = 12.0 * t**2 / 6.0
    return np.where(hollow, s_hollow, s_solid), np.where(hollow, 24.0 * fs, 12.0 * t)


def masonry_flexural_capacity(tension_psi, section_in3, area_in2, axial_lb):
    """Base-joint moment at which net flexural tension reaches the allowable.

    f_t = M/S - P/A <= F_t, so M <= F_t S + P S / A.

    Parameters
    ----------
    tension_psi : float or array_like
        Allowable flexural tension normal to bed joints F_t, psi (`FLEXURAL_TENSION_PSI`).
    section_in3, area_in2 : float or array_like
        Net section modulus and area per ft (`masonry_section`).
    axial_lb : float or array_like
        Axial load on the joint per ft, lb.

    Returns
    -------
    float or ndarray
        Moment capacity, lb-ft per ft.

    References
    ----------
    TMS 402-16 §8.2 (allowable stress); F_t from Table 8.2.4.2 (from memory).

    Examples
    --------
    8 in hollow units in type N mortar: F_t 25 psi (TMS 402-16 Table 8.2.4.2, from memory); no
    axial load: 25 x 80.97 / 12 = 168.7 lb-ft/ft.

    >>> FLEXURAL_TENSION_PSI[("hollow", "N")]
    25.0
    >>> s, a = masonry_section(7.625, "hollow")
    >>> round(float(masonry_flexural_capacity(25.0, s, a, 0.0)), 1)
    168.7
    """
    return (tension_psi * section_in3 + axial_lb * section_in3 / area_in2) / 12.0


def rectangle_centroid(width, height, openings):
    """Solid area and the height of its centroid, for a rectangle less rectangular openings.

    Parameters
    ----------
    width, height : float
        The wall's width and height, ft.
    openings : iterable of (x, y, w, h)
        Openings: x along the wall, y above its base, their width and height, ft.

    Returns
    -------
    solid_area : float
        ft2.
    centroid_height : float
        ft above the base.

    References
    ----------
    Statics.

    Examples
    --------
    A 10 x 10 ft wall with a 2 x 5 ft opening at its base: area 90 ft2, centroid
    (100 x 5 - 10 x 2.5) / 90 = 5.278 ft.

    >>> area, zc = rectangle_centroid(10.0, 10.0, [(0.0, 0.0, 2.0, 5.0)])
    >>> area, round(zc, 3)
    (90.0, 5.278)
    """
    area = width * height
    moment = area * height / 2.0
    for _, y, w, h in openings:
        area -= w * h
        moment -= w * h * (y + h / 2.0)
    return area, moment / area


def masonry_bed_joint_shear(area_in2, axial_lb, fm_psi=2000.0):
    """Allowable shear along a cured bed joint of running bond, per ft.

    Fv = least of 1.5 sqrt(f'm), 120 psi and 37 psi + 0.45 Nv/An.

    Parameters
    ----------
    area_in2 : float or array_like
        Net bedded area per ft An, in2.
    axial_lb : float or array_like
        Compressive force on the joint per ft Nv, lb.
    fm_psi : float, optional
        f'm, psi (2000).

    Returns
    -------
    float or ndarray
        Allowable shear, lb per ft.

    References
    ----------
    TMS 402-16 §8.2.6.2 (from memory).

    Examples
    --------
    8 in hollow (An 30 in2), no axial load: 37 psi governs, 37 x 30 = 1,110 lb/ft.

    >>> float(masonry_bed_joint_shear(30.0, 0.0))
    1110.0
    """
    fv = np.minimum(np.minimum(1.5 * np.sqrt(fm_psi), 120.0), 37.0 + 0.45 * axial_lb / area_in2)
    return fv * area_in2
