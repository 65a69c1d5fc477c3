"""Brace geometry and forces (design.md §6): small pure formulas over numpy arrays.

Section: the wall pivots at its base; a brace pins to the wall at insert height `hb` and to the
slab or ground at distance `d` from the wall face. Plan: braces at positions `x_i` along the wall
share the wind by statics, carrying all the twist (no twist restraint credited at the base).
"""

from __future__ import annotations

import functools

import numpy as np


def brace_geometry(insert_height_ft, anchor_distance_ft, insert_offset_ft=0.0,
                   foot_offset_ft=0.0, base_below_slab_ft=0.0):
    """Run, rise, angle (deg) and pin-to-pin length of a brace (geometry).

    The insert pin stands `insert_offset` out from the face, the foot pin `foot_offset` above
    the slab, and the wall's base (its pivot) `base_below_slab` below the slab.
    """
    run = np.asarray(anchor_distance_ft, dtype=float) - insert_offset_ft
    rise = np.asarray(insert_height_ft, dtype=float) - base_below_slab_ft - foot_offset_ft
    return run, rise, np.degrees(np.arctan2(rise, run)), np.hypot(run, rise)


def anchor_distance_for_angle(insert_height_ft, angle_deg, insert_offset_ft=0.0,
                              foot_offset_ft=0.0, base_below_slab_ft=0.0):
    """Foot distance from the wall face that gives a brace `angle_deg` from horizontal."""
    rise = np.asarray(insert_height_ft, dtype=float) - base_below_slab_ft - foot_offset_ft
    return rise / np.tan(np.radians(angle_deg)) + insert_offset_ft


def default_positions(width_ft, count, strip=None):
    """Centres of `count` equal strips along a wall `width_ft` long (design.md §6); `strip`
    numbers the strips wanted (default all; arrays broadcast, for many walls at once)."""
    return ((np.arange(count) if strip is None else strip) + 0.5) * width_ft / count


def total_brace_reaction(force_lb, lever_ft, insert_height_ft):
    """Sum of the braces' horizontal reactions: moments about the base pivot, F z_F / hb."""
    return force_lb * lever_ft / insert_height_ft


def lean_reaction(weight_lb, centroid_height_ft, wall_height_ft, insert_height_ft,
                  lean_ft, slop_ft):
    """Horizontal brace reaction from the wall's weight leaning out of plumb (statics).

    The centroid sits off the pivot by (lean / s + slop / hb) x z_c; the braces hold D e / hb.
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
    """Horizontal reaction of each brace: the even share plus the twist (design.md §6).

    R_i = sum(R)/n + M_t (x_i - x_c) / sum((x_j - x_c)^2), with
    M_t = F (x_F - x_c) - (F - sum(R)) (x_w - x_c). Arrays: (..., walls) for loads, (walls,
    braces) for positions with `mask` true where a brace exists; `lever` from `brace_lever`.
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
    # none (design.md §6): any twist left is more than they can carry.
    loose = (polar <= 0) & (np.abs(twist) > 1e-9 * (np.abs(force_lb) + np.abs(total_h) + 1.0))
    return np.where(loose, np.inf, total_h / n), per_arm


def axial_force(horizontal_lb, angle_deg):
    """Brace axial force from its horizontal reaction, P = R_h / cos(theta) (statics)."""
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
    """Largest bending moments (lb-ft per ft of width) of a wall pinned at its base and propped.

    Uniform pressure w on a beam pinned at 0, propped at hb, overhanging to s (statics):
    R_0 = w s - w s^2 / (2 hb); span moment R_0^2 / (2 w) where R_0 > 0; cantilever
    moment w (s - hb)^2 / 2 at the prop.
    """
    w, s, hb = line_load_plf, wall_height_ft, insert_height_ft
    base = w * s - w * s**2 / (2.0 * hb)
    with np.errstate(divide="ignore", invalid="ignore"):
        span = np.where(base > 0, base**2 / (2.0 * w), 0.0)
    cantilever = w * (s - hb) ** 2 / 2.0
    return span, cantilever


def modulus_of_rupture(fc_psi, lam=1.0):
    """Concrete modulus of rupture f_r = 7.5 lambda sqrt(f'c), psi (ACI 318-19 Eq. 19.2.3.1)."""
    return 7.5 * lam * np.sqrt(fc_psi)


def cracking_moment(fr_psi, thickness_in):
    """Moment per ft of width that cracks a solid section, f_r S with S = 12 t^2 / 6 (lb-ft/ft)."""
    return fr_psi * 12.0 * thickness_in**2 / 6.0 / 12.0


def slot_sum(values, start=0.0):
    """Each wall's sum over its brace slots (the last axis), taken a slot at a time like
    `worst_brace`; with `start` 0 it counts the true slots of a mask."""
    return functools.reduce(np.add, np.moveaxis(values, -1, 0), start)


def worst_brace(values):
    """Each wall's largest value over its brace slots (the last axis), taken a slot at a time:
    numpy's own reduction over so short an axis is many times slower."""
    return functools.reduce(np.maximum, np.moveaxis(values, -1, 0))
