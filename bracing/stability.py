"""Walls standing on their own (design.md §5): small pure formulas over numpy arrays."""

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
    """Face shell of a hollow unit from its actual thickness (nominal = actual + 3/8 in)."""
    nominal = np.asarray(thickness_in, dtype=float) + 0.375
    widths = np.array(list(FACE_SHELL_IN))
    shells = np.array(list(FACE_SHELL_IN.values()))
    return shells[np.clip(np.searchsorted(widths, nominal - 0.5), 0, len(widths) - 1)]


def rocking_resistance(weight, thickness_ft):
    """Moment that a wall's weight resists about its leeward base edge, W t / 2 (statics)."""
    return weight * thickness_ft / 2.0


def footing_resistance(weight, footing_width_ft):
    """Moment of the weight on a footing centred under the wall, about the toe (statics)."""
    return weight * footing_width_ft / 2.0


def max_soil_pressure(vertical, moment, width_ft, length_ft):
    """Peak soil pressure under a footing (linear pressure, no tension; statics).

    e <= W/6: P/A (1 + 6e/W); e < W/2: 2P / (3 L (W/2 - e)); e >= W/2: infinite (it tips).
    """
    e = moment / vertical
    inside = e <= width_ft / 6.0
    with np.errstate(divide="ignore", invalid="ignore"):
        trapezoid = vertical / (width_ft * length_ft) * (1.0 + 6.0 * e / width_ft)
        triangle = 2.0 * vertical / (3.0 * length_ft * (width_ft / 2.0 - e))
    q = np.where(inside, trapezoid, triangle)
    return np.where(e >= width_ft / 2.0, np.inf, q)


def masonry_section(thickness_in, grouting):
    """Section modulus (in^3) and area (in^2) per foot of a masonry wall's bed joint.

    Hollow units are bedded on their face shells only (TMS 402-16 net section; the face shell of
    ASTM C90, from memory); solid and grouted walls on the full thickness.
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
    """Base-joint moment (lb-ft per ft) at which net flexural tension reaches the allowable.

    f_t = M/S - P/A <= F_t  ->  M <= F_t S + P S / A (TMS 402-16 §8.2, allowable stress).
    """
    return (tension_psi * section_in3 + axial_lb * section_in3 / area_in2) / 12.0


def rectangle_centroid(width, height, openings):
    """Solid area and the height of its centroid for a rectangle less rectangular openings.

    `openings` rows are (x, y, w, h). Returns (solid_area, centroid_height).
    """
    area = width * height
    moment = area * height / 2.0
    for _, y, w, h in openings:
        area -= w * h
        moment -= w * h * (y + h / 2.0)
    return area, moment / area


def masonry_bed_joint_shear(area_in2, axial_lb, fm_psi=2000.0):
    """Allowable shear along a cured bed joint, running bond (lb per ft; TMS 402-16 §8.2.6.2).

    Fv = least of 1.5 sqrt(f'm), 120 psi and 37 psi + 0.45 Nv/An (from memory).
    """
    fv = np.minimum(np.minimum(1.5 * np.sqrt(fm_psi), 120.0), 37.0 + 0.45 * axial_lb / area_in2)
    return fv * area_in2
