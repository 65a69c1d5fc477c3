"""Steel pipe braces in compression and tension (AISC 360-16 §E3, §D2); named in
`bracing.members`.

Pure functions over floats or numpy arrays. Forces in lb, lengths in ft, section dimensions in
in, steel stresses in ksi. Capacities are available strengths: allowable (ASD, the default) or
design (LRFD) by `basis`.
"""

from __future__ import annotations

import numpy as np

from bracing.data_members import STEEL_E_KSI

OMEGA_C, PHI_C = 1.67, 0.90  # AISC 360-16 §E1 compression
OMEGA_T, PHI_T = 1.67, 0.90  # AISC 360-16 §D2(a) tensile yielding
OMEGA_B, PHI_B = 1.67, 0.90  # AISC 360-16 §F1 flexure
LC_OVER_R_ADVISORY = 200.0  # AISC 360-16 §E2 user note
KSI_IN2_TO_LB = 1000.0


def _available(nominal, basis, phi, omega):
    """Available strength: nominal / Omega (ASD) or phi * nominal (LRFD)."""
    if basis == "ASD":
        return nominal / omega
    if basis == "LRFD":
        return phi * nominal
    raise ValueError(f"basis must be 'ASD' or 'LRFD', not {basis!r}")


# --- Steel pipe: AISC 360-16 ---------------------------------------------------------------
def slenderness(lc_ft, r_in):
    """Effective slenderness Lc / r of a member.

    Parameters
    ----------
    lc_ft : float or array_like
        Effective length Lc = K L, ft.
    r_in : float or array_like
        Radius of gyration, in.

    Returns
    -------
    float or ndarray
        Lc / r, dimensionless (Lc converted to in).

    References
    ----------
    AISC 360-16 §E2.

    Examples
    --------
    AISC Design Examples v14 E.11, Pipe 10 STD (r 3.68 in, from memory) at 30 ft: Lc/r 97.8
    (secondary).

    >>> round(float(slenderness(30.0, 3.68)), 1)
    97.8
    """
    return 12.0 * np.asarray(lc_ft, dtype=float) / r_in


def euler_stress(E_ksi, slenderness_ratio):
    """Elastic buckling stress Fe = pi^2 E / (Lc/r)^2.

    Parameters
    ----------
    E_ksi : float or array_like
        Modulus of elasticity, ksi.
    slenderness_ratio : float or array_like
        Lc / r.

    Returns
    -------
    float or ndarray
        Fe, ksi (inf at zero slenderness).

    References
    ----------
    AISC 360-16 Eq. E3-4.

    Examples
    --------
    E 29,000 ksi, Lc/r 100: pi^2 x 29,000 / 10,000 = 28.62 ksi.

    >>> round(float(euler_stress(29000.0, 100.0)), 2)
    28.62
    """
    with np.errstate(divide="ignore"):
        return (np.pi**2 * E_ksi / np.asarray(slenderness_ratio, dtype=float) ** 2)[()]


def critical_stress(Fy_ksi, E_ksi, slenderness_ratio):
    """Flexural buckling stress Fcr of a compression member.

    Parameters
    ----------
    Fy_ksi : float or array_like
        Specified minimum yield stress, ksi.
    E_ksi : float or array_like
        Modulus of elasticity, ksi.
    slenderness_ratio : float or array_like
        Lc / r.

    Returns
    -------
    float or ndarray
        Fcr, ksi: 0.658^(Fy/Fe) Fy where Lc/r <= 4.71 sqrt(E/Fy) (Eq. E3-2), else 0.877 Fe
        (Eq. E3-3).

    References
    ----------
    AISC 360-16 §E3 (secondary, consistent across sources).

    Examples
    --------
    A53 Gr. B (Fy 35 ksi, text) at Lc/r 97.8: Fe = 29.92 ksi, Fcr = 0.658^1.170 x 35 = 21.45 ksi.

    >>> round(float(critical_stress(35.0, 29000.0, 97.8)), 2)
    21.45
    """
    fe = euler_stress(E_ksi, slenderness_ratio)
    with np.errstate(divide="ignore", invalid="ignore"):
        inelastic = 0.658 ** (Fy_ksi / fe) * Fy_ksi  # AISC 360-16 Eq. E3-2
    elastic = 0.877 * fe  # AISC 360-16 Eq. E3-3
    limit = 4.71 * np.sqrt(E_ksi / Fy_ksi)  # AISC 360-16 §E3(a)/(b)
    return np.where(np.asarray(slenderness_ratio) <= limit, inelastic, elastic)[()]


def knee_brace_lengths(length_ft, knee_at_fraction=0.5):
    """Effective lengths in and out of the brace's plane, for a brace with a knee brace.

    The knee brace supports the brace in its own vertical plane only; out of plane the full
    length buckles unless lateral struts are added.

    Parameters
    ----------
    length_ft : float or array_like
        Brace length, ft.
    knee_at_fraction : float or array_like, optional
        Where the knee brace meets the brace, as a fraction of its length (0 to 1, exclusive).

    Returns
    -------
    in_plane : float or ndarray
        Lc in the brace's plane, ft: the longer segment.
    out_of_plane : float or ndarray
        Lc out of plane, ft: the whole length.

    References
    ----------
    AISC 360-16 §E2, Lc = K L with K = 1.

    Examples
    --------
    >>> [float(v) for v in knee_brace_lengths(20.0, 0.4)]
    [12.0, 20.0]
    """
    f = np.asarray(knee_at_fraction, dtype=float)
    if np.any((f <= 0) | (f >= 1)):
        raise ValueError("knee_at_fraction must lie strictly between 0 and 1")
    length = np.asarray(length_ft, dtype=float)
    return (length * np.maximum(f, 1.0 - f))[()], length[()]


def pipe_compression(area_in2, r_in, Fy_ksi, Lc_in_plane_ft, Lc_out_of_plane_ft, basis="ASD",
                     E_ksi=STEEL_E_KSI):
    """Available axial compression of a round pipe, in its governing plane (the longer Lc).

    Nonslender wall assumed: check `pipe_wall_nonslender`.

    Parameters
    ----------
    area_in2 : float or array_like
        Gross area Ag, in2.
    r_in : float or array_like
        Radius of gyration, in.
    Fy_ksi : float or array_like
        Specified minimum yield stress, ksi.
    Lc_in_plane_ft, Lc_out_of_plane_ft : float or array_like
        Effective lengths in and out of the brace's plane, ft.
    basis : {'ASD', 'LRFD'}, optional
        ASD Pn / 1.67 (default) or LRFD 0.90 Pn (§E1).
    E_ksi : float, optional
        Modulus of elasticity, ksi (29,000).

    Returns
    -------
    float or ndarray
        Available strength, lb.

    References
    ----------
    AISC 360-16 Eq. E3-1, §E1.

    Examples
    --------
    AISC Design Examples v14 E.11, A53 Gr. B Pipe 10 STD (A 11.5 in2, r 3.68 in, from memory),
    30 ft about the axis braced at mid-height: phi_c Pn 221 kips, Pn/Omega_c 147 kips (secondary;
    11.5 x 21.45 = 246.7 kips, x 0.90 = 222, / 1.67 = 148: within 1 % of the example's rounding).

    >>> round(float(pipe_compression(11.5, 3.68, 35.0, 15.0, 30.0, "LRFD")) / 1000.0)
    222
    >>> round(float(pipe_compression(11.5, 3.68, 35.0, 15.0, 30.0, "ASD")) / 1000.0)
    148
    """
    kl_r = slenderness(np.maximum(Lc_in_plane_ft, Lc_out_of_plane_ft), r_in)
    pn = critical_stress(Fy_ksi, E_ksi, kl_r) * area_in2 * KSI_IN2_TO_LB
    return _available(pn, basis, PHI_C, OMEGA_C)[()]


def pipe_tension(area_in2, Fy_ksi, basis="ASD"):
    """Available tensile yielding strength of a pipe, Pn = Fy Ag.

    Parameters
    ----------
    area_in2 : float or array_like
        Gross area Ag, in2.
    Fy_ksi : float or array_like
        Specified minimum yield stress, ksi.
    basis : {'ASD', 'LRFD'}, optional
        ASD Pn / 1.67 (default) or LRFD 0.90 Pn (§D2(a)).

    Returns
    -------
    float or ndarray
        Available strength, lb.

    References
    ----------
    AISC 360-16 Eq. D2-1.

    Examples
    --------
    Pipe 2 STD (A 1.02 in2, AISC Manual Table 1-14, from memory), A53 Gr. B (Fy 35 ksi, text):
    35.7 / 1.67 = 21.4 kips.

    >>> round(float(pipe_tension(1.02, 35.0)) / 1000.0, 1)
    21.4
    """
    pn = np.asarray(Fy_ksi * area_in2, dtype=float) * KSI_IN2_TO_LB
    return _available(pn, basis, PHI_T, OMEGA_T)[()]
