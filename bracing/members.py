"""Brace member capacity: rated tables, steel pipe (AISC 360-16), sawn lumber (NDS 2018).

Pure functions over floats or numpy arrays. Forces in lb, moments in lb-ft, lengths in ft,
section dimensions in in, steel stresses in ksi, wood stresses in psi. Capacities are
available strengths: allowable (ASD, the default) or design (LRFD) by `basis`.
Rated values (end connections, inserts, driven stakes) are used as entered: no function here.
"""

from __future__ import annotations

import numpy as np

from bracing.data_members import SIZE_FACTOR_FC_VALUES, SIZE_FACTOR_FC_WIDTHS_IN, STEEL_E_KSI

OMEGA_C, PHI_C = 1.67, 0.90  # AISC 360-16 §E1 compression
OMEGA_T, PHI_T = 1.67, 0.90  # AISC 360-16 §D2(a) tensile yielding
OMEGA_B, PHI_B = 1.67, 0.90  # AISC 360-16 §F1 flexure
ALPHA_B1 = {"ASD": 1.6, "LRFD": 1.0}  # AISC 360-16 Appendix 8 §8.2.1 (alpha)
LC_OVER_R_ADVISORY = 200.0  # AISC 360-16 §E2 user note
CD_WIND = 1.6  # NDS 2018 Table 2.3.2, wind load duration
C_SAWN = 0.8  # NDS 2018 §3.7.1, c for sawn lumber
LE_OVER_D_MAX = 50.0  # NDS 2018 §3.7.1.4
LE_OVER_D_MAX_CONSTRUCTION = 75.0  # NDS 2018 §3.7.1.4, during construction (from memory)
KSI_IN2_TO_LB = 1000.0


def _available(nominal, basis, phi, omega):
    """Available strength: nominal / Omega (ASD) or phi * nominal (LRFD)."""
    if basis == "ASD":
        return nominal / omega
    if basis == "LRFD":
        return phi * nominal
    raise ValueError(f"basis must be 'ASD' or 'LRFD', not {basis!r}")


# --- Rated (adjustable / telescoping) braces: maker's table ----------------------------------
def validate_rated_table(lengths_ft, loads_lb):
    """Raise ValueError unless lengths strictly increase and every rated load is positive."""
    lengths = np.asarray(lengths_ft, dtype=float)
    loads = np.asarray(loads_lb, dtype=float)
    if lengths.ndim != 1 or lengths.shape != loads.shape or lengths.size < 2:
        raise ValueError("a rated table needs two or more (length, load) pairs of equal count")
    if not (np.all(np.isfinite(lengths)) and np.all(np.diff(lengths) > 0) and lengths[0] > 0):
        raise ValueError("rated table lengths must be positive and strictly increasing")
    if not (np.all(np.isfinite(loads)) and np.all(loads > 0)):
        raise ValueError("rated table loads must be positive")


def rated_capacity(length_ft, table_lengths_ft, table_loads_lb):
    """Maker's rated safe working load of a brace at a length, linear between table rows.

    Parameters
    ----------
    length_ft : float or array_like
        Brace length, ft.
    table_lengths_ft : array_like
        The maker's lengths, ft, strictly increasing (`validate_rated_table`).
    table_loads_lb : array_like
        The maker's rated safe working loads at those lengths, lb (allowable).

    Returns
    -------
    float or ndarray
        Rated load, lb. NaN outside the table's length range: the rating is unknown there
        ("outside the rated range"), never extrapolated.

    References
    ----------
    The brace maker's rated table (used as entered, method notes §1).

    Examples
    --------
    A table of 5,000 lb at 6 ft and 4,000 lb at 10 ft, then 2,000 lb at 20 ft:

    >>> [float(c) for c in rated_capacity([8.0, 12.0, 30.0], [6.0, 10.0, 20.0],
    ...                                   [5000.0, 4000.0, 2000.0])]
    [4500.0, 3600.0, nan]
    """
    validate_rated_table(table_lengths_ft, table_loads_lb)
    return np.interp(length_ft, table_lengths_ft, table_loads_lb, left=np.nan, right=np.nan)[()]


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


def pipe_wall_nonslender(D_in, t_in, Fy_ksi, E_ksi=STEEL_E_KSI):
    """True where a round pipe's wall is nonslender in compression, D/t <= 0.11 E/Fy.

    Parameters
    ----------
    D_in, t_in : float or array_like
        Outside diameter and design wall thickness, in.
    Fy_ksi : float or array_like
        Specified minimum yield stress, ksi.
    E_ksi : float, optional
        Modulus of elasticity, ksi.

    Returns
    -------
    bool or ndarray

    References
    ----------
    AISC 360-16 Table B4.1a case 9.

    Examples
    --------
    Pipe 2 STD, 2.375 in x 0.93 x 0.154 in (ASME B36.10, text; design wall from memory):
    D/t = 16.6 against 0.11 x 29,000 / 35 = 91.1.

    >>> bool(pipe_wall_nonslender(2.375, 0.93 * 0.154, 35.0))
    True
    """
    return np.asarray(D_in / t_in) <= 0.11 * E_ksi / Fy_ksi


def pipe_flexure(D_in, t_in, Fy_ksi, basis="ASD", E_ksi=STEEL_E_KSI):
    """Available flexural strength of a round pipe (design wall t).

    Compact (D/t <= 0.07 E/Fy, Table B4.1b case 20): Mn = Mp = Fy Z (Eq. F8-1); noncompact
    (<= 0.31 E/Fy): Mn = (0.021 E/(D/t) + Fy) S (Eq. F8-2); slender: Mn = 0.33 E/(D/t) S
    (Eq. F8-3, F8-4).

    Parameters
    ----------
    D_in, t_in : float or array_like
        Outside diameter and design wall thickness, in.
    Fy_ksi : float or array_like
        Specified minimum yield stress, ksi.
    basis : {'ASD', 'LRFD'}, optional
        ASD Mn / 1.67 (default) or LRFD 0.90 Mn (§F1).
    E_ksi : float, optional
        Modulus of elasticity, ksi.

    Returns
    -------
    float or ndarray
        Available moment, lb-ft; NaN beyond D/t = 0.45 E/Fy, outside §F8's scope (not known).

    References
    ----------
    AISC 360-16 §F8.

    Examples
    --------
    Pipe 2 STD (2.375 in, design wall 0.93 x 0.154 in; ASME B36.10 text, design wall from
    memory), A53 Gr. B (Fy 35 ksi, text): compact, Z = (2.375^3 - 2.0886^3) / 6 = 0.7144 in3,
    Mp = 35 x 0.7144 = 25.00 kip-in = 2,084 lb-ft, / 1.67 = 1,248 lb-ft.

    >>> round(float(pipe_flexure(2.375, 0.93 * 0.154, 35.0)))
    1248
    """
    D = np.asarray(D_in, dtype=float)
    inner = D - 2.0 * t_in
    z = (D**3 - inner**3) / 6.0  # plastic modulus of a tube
    s = np.pi * (D**4 - inner**4) / (32.0 * D)  # elastic modulus of a tube
    dt = D / t_in
    mn = np.select(
        [dt <= 0.07 * E_ksi / Fy_ksi, dt <= 0.31 * E_ksi / Fy_ksi, dt <= 0.45 * E_ksi / Fy_ksi],
        [Fy_ksi * z, (0.021 * E_ksi / dt + Fy_ksi) * s, 0.33 * E_ksi / dt * s],
        default=np.nan,
    )
    return _available(mn * KSI_IN2_TO_LB / 12.0, basis, PHI_B, OMEGA_B)[()]


def self_weight_moment(weight_plf, length_ft, angle_deg):
    """Mid-span moment from a sloping brace's own weight, w cos(theta) L^2 / 8.

    Simply supported span; with a knee brace in the plane, pass the longer segment as the span.

    Parameters
    ----------
    weight_plf : float or array_like
        Brace weight, lb per ft.
    length_ft : float or array_like
        Span, ft.
    angle_deg : float or array_like
        Angle from horizontal, degrees.

    Returns
    -------
    float or ndarray
        Moment, lb-ft.

    References
    ----------
    Statics.

    Examples
    --------
    3.65 lb/ft (Pipe 2 STD, from memory), 20 ft, level: 3.65 x 400 / 8 = 182.5 lb-ft.

    >>> float(self_weight_moment(3.65, 20.0, 0.0))
    182.5
    """
    return (np.asarray(weight_plf, dtype=float) * np.cos(np.radians(angle_deg))
            * np.asarray(length_ft, dtype=float) ** 2 / 8.0)[()]


def euler_load(E_ksi, I_in4, Lc_ft):
    """Elastic critical load Pe1 = pi^2 EI / Lc^2, lb (AISC 360-16 Eq. A-8-5, EI* = EI, K = 1)."""
    return np.pi**2 * E_ksi * I_in4 / (12.0 * np.asarray(Lc_ft, dtype=float)) ** 2 * KSI_IN2_TO_LB


def moment_amplifier_b1(Pr_lb, E_ksi, I_in4, Lc_ft, basis="ASD"):
    """P-delta amplifier of the self-weight moment, B1 = Cm / (1 - alpha Pr / Pe1) >= 1.

    Parameters
    ----------
    Pr_lb : float or array_like
        Required axial compression, lb (tension, Pr <= 0, gives 1.0).
    E_ksi : float or array_like
        Modulus of elasticity, ksi.
    I_in4 : float or array_like
        Moment of inertia, in4.
    Lc_ft : float or array_like
        Effective length, ft.
    basis : {'ASD', 'LRFD'}, optional
        alpha 1.6 (ASD, default) or 1.0 (LRFD).

    Returns
    -------
    float or ndarray
        B1, dimensionless; inf where alpha Pr >= Pe1.

    References
    ----------
    AISC 360-16 Appendix 8 Eq. A-8-3, Cm = 1.0 (transverse load, §8.2.1(b)); Pe1 = pi^2 EI /
    Lc^2 (Eq. A-8-5, EI* = EI, K = 1).

    Examples
    --------
    I 0.627 in4 (Pipe 2 STD, from memory), 20 ft: Pe1 = pi^2 x 29,000 x 0.627 / 240^2 = 3.116
    kips; Pr 1,000 lb on ASD: 1 / (1 - 1.6 x 1,000 / 3,116) = 2.056.

    >>> round(float(moment_amplifier_b1(1000.0, 29000.0, 0.627, 20.0)), 3)
    2.056
    """
    return amplifier_of(Pr_lb, euler_load(E_ksi, I_in4, Lc_ft), basis)


def amplifier_of(Pr_lb, pe1_lb, basis="ASD"):
    """B1 from a known Pe1 (lb): AISC 360-16 Appendix 8 Eq. A-8-3 with Cm = 1.0."""
    if basis not in ALPHA_B1:
        raise ValueError(f"basis must be 'ASD' or 'LRFD', not {basis!r}")
    margin = 1.0 - ALPHA_B1[basis] * np.maximum(Pr_lb, 0.0) / pe1_lb
    with np.errstate(divide="ignore"):
        b1 = np.where(margin > 0, 1.0 / margin, np.inf)
    return np.maximum(b1, 1.0)[()]


def pipe_axial_bending_ratio(Pr, Pc, Mr, Mc):
    """Combined axial force and bending ratio; passes at <= 1.0.

    Pr/Pc >= 0.2: Pr/Pc + 8/9 Mr/Mc (Eq. H1-1a); else Pr/(2 Pc) + Mr/Mc (Eq. H1-1b). The two
    equations meet at Pr/Pc = 0.2 only where Mr/Mc = 0.9: above that (failing either way) the
    ratio can dip as Pr grows; pass/fail never does.

    Parameters
    ----------
    Pr, Pc : float or array_like
        Required and available axial strength, the same force unit (magnitudes are used).
    Mr, Mc : float or array_like
        Required and available flexural strength, the same moment unit.

    Returns
    -------
    float or ndarray
        The ratio, dimensionless.

    References
    ----------
    AISC 360-16 §H1.1.

    Examples
    --------
    Half of each: 0.5 + 8/9 x 0.5 = 0.944; a tenth of the axial strength: 0.05 + 0.5 = 0.55.

    >>> round(float(pipe_axial_bending_ratio(0.5, 1.0, 0.5, 1.0)), 3)
    0.944
    >>> round(float(pipe_axial_bending_ratio(0.1, 1.0, 0.5, 1.0)), 2)
    0.55
    """
    p = np.abs(Pr) / np.asarray(Pc, dtype=float)
    m = np.abs(Mr) / np.asarray(Mc, dtype=float)
    return np.where(p >= 0.2, p + 8.0 / 9.0 * m, p / 2.0 + m)[()]


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
