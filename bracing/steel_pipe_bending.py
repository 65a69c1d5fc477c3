"""Steel pipe braces in bending and in axial force with bending (AISC 360-16 §F8, §H1,
Appendix 8); named in `bracing.members`.

Pure functions over floats or numpy arrays. Forces in lb, moments in lb-ft, lengths in ft,
section dimensions in in, steel stresses in ksi. Capacities are available strengths: allowable
(ASD, the default) or design (LRFD) by `basis`.
"""

from __future__ import annotations

import numpy as np

from bracing.data_members import STEEL_E_KSI
from bracing.steel_pipe import KSI_IN2_TO_LB, OMEGA_B, PHI_B, _available

ALPHA_B1 = {"ASD": 1.6, "LRFD": 1.0}  # AISC 360-16 Appendix 8 §8.2.1 (alpha)


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
