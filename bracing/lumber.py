"""Sawn lumber braces in compression (NDS 2018 §3.7); named in `bracing.members`.

Pure functions over floats or numpy arrays. Forces in lb, lengths in ft, section dimensions in
in, wood stresses in psi. Capacities are allowable (ASD).
"""

from __future__ import annotations

import numpy as np

from bracing.data_members import SIZE_FACTOR_FC_VALUES, SIZE_FACTOR_FC_WIDTHS_IN

CD_WIND = 1.6  # NDS 2018 Table 2.3.2, wind load duration
C_SAWN = 0.8  # NDS 2018 §3.7.1, c for sawn lumber
LE_OVER_D_MAX = 50.0  # NDS 2018 §3.7.1.4
LE_OVER_D_MAX_CONSTRUCTION = 75.0  # NDS 2018 §3.7.1.4, during construction (from memory)


# --- Sawn lumber: NDS 2018 (ASD only) ------------------------------------------------------
def size_factor_fc(nominal_width_in, nominal_thickness_in=2.0):
    """Size factor CF for Fc of sawn lumber by nominal width.

    Parameters
    ----------
    nominal_width_in : float or array_like
        Nominal width, in.
    nominal_thickness_in : float or array_like, optional
        Nominal thickness, in; 5 in and more (posts and timbers, Table 4D) take CF = 1.0.

    Returns
    -------
    float or ndarray
        CF, dimensionless.

    References
    ----------
    NDS 2018 Supplement Table 4A.

    Examples
    --------
    2 to 4 in wide 1.15, 5 to 6 in 1.10 (secondary).

    >>> [float(c) for c in size_factor_fc([4.0, 6.0])]
    [1.15, 1.1]
    """
    w = np.asarray(nominal_width_in, dtype=float)
    cf = np.select([w <= edge for edge in SIZE_FACTOR_FC_WIDTHS_IN],
                   SIZE_FACTOR_FC_VALUES[:-1], default=SIZE_FACTOR_FC_VALUES[-1])
    return np.where(np.asarray(nominal_thickness_in) >= 5.0, 1.0, cf)[()]


def column_stability_factor(Fc_star_psi, Emin_prime_psi, le_over_d, c=C_SAWN):
    """Column stability factor CP of a wood member.

    Parameters
    ----------
    Fc_star_psi : float or array_like
        Fc*, the reference compression stress times every factor but CP, psi.
    Emin_prime_psi : float or array_like
        Emin', the adjusted modulus for stability, psi.
    le_over_d : float or array_like
        Governing slenderness le/d (0 or less: CP = 1).
    c : float, optional
        0.8 for sawn lumber (§3.7.1).

    Returns
    -------
    float or ndarray
        CP = (1 + a)/(2c) - sqrt(((1 + a)/(2c))^2 - a/c), a = F_cE / Fc*,
        F_cE = 0.822 Emin' / (le/d)^2; dimensionless.

    References
    ----------
    NDS 2018 Eq. 3.7-1.

    Examples
    --------
    HUD RSDG Example 5.6 (secondary): SPF No. 2 4x4 (Fc 1150 psi, CF 1.15, Emin 510,000 psi,
    secondary), 7.3 ft, C_D 1.0: le/d = 87.6 / 3.5 = 25.03, CP 0.4378.

    >>> round(float(column_stability_factor(1150.0 * 1.15, 510000.0, 7.3 * 12.0 / 3.5)), 4)
    0.4378
    """
    with np.errstate(divide="ignore", invalid="ignore"):
        fce = 0.822 * np.asarray(Emin_prime_psi, dtype=float) / np.asarray(le_over_d) ** 2
        a = fce / Fc_star_psi
        half = (1.0 + a) / (2.0 * c)
        cp = half - np.sqrt(np.maximum(half**2 - a / c, 0.0))
    return np.where(np.asarray(le_over_d) > 0, cp, 1.0)[()]


def lumber_slenderness(d_in_plane_in, d_out_of_plane_in, le_in_plane_ft, le_out_of_plane_ft):
    """Governing le/d of a rectangular sawn member.

    Parameters
    ----------
    d_in_plane_in, d_out_of_plane_in : float or array_like
        Dressed dimensions in and out of the brace's plane, in.
    le_in_plane_ft, le_out_of_plane_ft : float or array_like
        Effective lengths in and out of the plane, ft.

    Returns
    -------
    float or ndarray
        The larger of the two le/d, dimensionless.

    References
    ----------
    NDS 2018 §3.7.1.3.

    Examples
    --------
    A 2x4 (3.5 x 1.5 in) 10 ft long, held at mid-length about its weak axis: max(120 / 3.5,
    60 / 1.5) = 40.

    >>> float(lumber_slenderness(3.5, 1.5, 10.0, 5.0))
    40.0
    """
    return np.maximum(12.0 * np.asarray(le_in_plane_ft, dtype=float) / d_in_plane_in,
                      12.0 * np.asarray(le_out_of_plane_ft, dtype=float) / d_out_of_plane_in)[()]


def lumber_too_slender(le_over_d, during_construction=False):
    """True where le/d exceeds 50, or 75 during construction.

    Parameters
    ----------
    le_over_d : float or array_like
        Governing slenderness.
    during_construction : bool, optional
        True for the limit of 75 during construction.

    Returns
    -------
    bool or ndarray

    References
    ----------
    NDS 2018 §3.7.1.4 (75 during construction: from memory).

    Examples
    --------
    >>> bool(lumber_too_slender(60.0)), bool(lumber_too_slender(60.0, during_construction=True))
    (True, False)
    """
    limit = LE_OVER_D_MAX_CONSTRUCTION if during_construction else LE_OVER_D_MAX
    return np.asarray(le_over_d) > limit


def lumber_compression(d_in_plane_in, d_out_of_plane_in, le_in_plane_ft, le_out_of_plane_ft,
                       Fc_psi, Emin_psi, CD=CD_WIND, CF=1.0, CM_Fc=1.0, CM_E=1.0, Ct=1.0,
                       basis="ASD"):
    """Allowable axial compression of a sawn-lumber brace.

    Fc* = Fc CD CM Ct CF; Emin' = Emin CM Ct (Table 4.3.1); F'c = Fc* CP at the governing le/d;
    P = F'c b d. ASD only: NDS LRFD format conversion is not implemented.

    Parameters
    ----------
    d_in_plane_in, d_out_of_plane_in : float or array_like
        Dressed dimensions in and out of the brace's vertical plane, in.
    le_in_plane_ft, le_out_of_plane_ft : float or array_like
        Effective lengths paired with them, ft.
    Fc_psi, Emin_psi : float or array_like
        Reference compression stress parallel to grain and Emin, psi.
    CD : float, optional
        Load duration factor, 1.6 for wind (NDS 2018 Table 2.3.2, secondary).
    CF : float, optional
        Size factor; 1.0 by default (conservative for dimension lumber up to 12 in wide): use
        `size_factor_fc`.
    CM_Fc, CM_E, Ct : float, optional
        Wet service and temperature factors.
    basis : {'ASD'}, optional

    Returns
    -------
    float
        Allowable load, lb.

    Raises
    ------
    NotImplementedError
        For basis 'LRFD'.

    References
    ----------
    NDS 2018 §3.6, §3.7.1, Table 4.3.1.

    Examples
    --------
    HUD RSDG Example 5.6 (secondary): F'c 579 psi for the SPF No. 2 4x4 at 7.3 ft, C_D 1.0.

    >>> p = lumber_compression(3.5, 3.5, 7.3, 7.3, 1150.0, 510000.0, CD=1.0, CF=1.15)
    >>> round(float(p) / 3.5**2)
    579
    """
    if basis != "ASD":
        raise NotImplementedError("sawn lumber is checked on the ASD basis only (NDS 2018 ASD)")
    fc_star = np.asarray(Fc_psi, dtype=float) * CD * CM_Fc * Ct * CF
    emin_prime = np.asarray(Emin_psi, dtype=float) * CM_E * Ct
    le_d = lumber_slenderness(d_in_plane_in, d_out_of_plane_in, le_in_plane_ft,
                              le_out_of_plane_ft)
    cp = column_stability_factor(fc_star, emin_prime, le_d)
    return (fc_star * cp * np.asarray(d_in_plane_in) * d_out_of_plane_in)[()]
