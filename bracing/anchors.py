"""Anchor capacity: slab anchors (ACI 318-19 Ch. 17); helical anchors (ICC-ES AC358) and
deadmen are in `bracing.ground_anchors` and named here too.

Pure functions over floats or numpy arrays. Forces in lb, lengths in in (anchors) or ft
(deadmen), f'c in psi. ACI 318 gives nominal strengths and strength design (phi Nn); the
team's ASD basis divides phi Nn by alpha = 1.0/0.6 (method notes §1: wind governs).
Cracked concrete and normal-weight concrete (lambda_a = 1.0) by default; single anchors only.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

# helical anchors and deadmen (bracing.ground_anchors), named here as well for the callers
from bracing.ground_anchors import (
    BEARING_IBC_1806_2_PSF,
    COHESION_IBC_1806_2_PSF,
    DEAD_LOAD_FACTOR_RESISTING,
    FRICTION_CONCRETE_ON_CONCRETE,
    FRICTION_IBC_1806_2,
    FRICTION_NAVFAC_DM7_02,
    FRICTION_TABLES,
    HELICAL_FACTOR_OF_SAFETY,
    KT_AC358_CERTAINTY,
    KT_AC358_PER_FT,
    SLIDING_FS_ULTIMATE,
    allowable_friction,
    deadman_overturning_moment,
    deadman_resisting_moment,
    deadman_sliding,
    deadman_uplift,
    helical_capacity,
    required_torque,
    soil_friction,
)

__all__ = [
    "ASD_FROM_STRENGTH",
    "BEARING_IBC_1806_2_PSF",
    "COHESION_IBC_1806_2_PSF",
    "DEAD_LOAD_FACTOR_RESISTING",
    "FRICTION_CONCRETE_ON_CONCRETE",
    "FRICTION_IBC_1806_2",
    "FRICTION_NAVFAC_DM7_02",
    "FRICTION_TABLES",
    "HELICAL_FACTOR_OF_SAFETY",
    "KT_AC358_CERTAINTY",
    "KT_AC358_PER_FT",
    "LAMBDA_A_NORMAL_WEIGHT",
    "PHI_CAST_IN",
    "PHI_POST_INSTALLED",
    "PHI_SHEAR_CONCRETE",
    "PHI_STEEL",
    "SLIDING_FS_ULTIMATE",
    "AnchorCapacity",
    "allowable_friction",
    "asd_from_strength",
    "basic_breakout_tension",
    "deadman_overturning_moment",
    "deadman_resisting_moment",
    "deadman_sliding",
    "deadman_uplift",
    "headed_pullout",
    "helical_capacity",
    "narrow_member_embedment",
    "near_three_or_more_edges",
    "phi_concrete_tension",
    "post_installed_embedment_ok",
    "projected_area_tension",
    "pryout",
    "psi_c_n",
    "psi_cp_n",
    "psi_ed_n",
    "reference_area_tension",
    "required_torque",
    "shear_breakout",
    "slab_anchor_capacity",
    "soil_friction",
    "steel_shear",
    "steel_tension",
    "tension_breakout",
    "tension_shear_interaction",
]

# --- Strength reduction factors, ACI 318-19 Table 17.5.3 (from memory unless noted) -----------
PHI_STEEL = {  # (a) steel: ductile / brittle element
    ("tension", True): 0.75, ("shear", True): 0.65,
    ("tension", False): 0.65, ("shear", False): 0.60,
}
PHI_CAST_IN = 0.70  # (b), (c) Condition B: tension breakout, pullout (text via design guide)
PHI_POST_INSTALLED = {1: 0.65, 2: 0.55, 3: 0.45}  # (b), (c) Condition B, anchor category
PHI_SHEAR_CONCRETE = 0.70  # (b) Condition B: shear breakout and pryout, any anchor type
ASD_FROM_STRENGTH = 0.6  # 1 / alpha, alpha = 1.0/0.6 (method notes §1; team's basis)
LAMBDA_A_NORMAL_WEIGHT = 1.0  # ACI 318-19 §17.2.4


def _on_basis(phi_nominal, basis):
    """Strength-design value phi*N on the requested basis (ASD: times 0.6)."""
    if basis == "ASD":
        return asd_from_strength(phi_nominal)
    if basis == "LRFD":
        return phi_nominal
    raise ValueError(f"basis must be 'ASD' or 'LRFD', not {basis!r}")


def asd_from_strength(phi_Nn):
    """Allowable value from an ACI strength-design value: phi Nn / alpha, alpha = 1.0/0.6.

    ACI 318-19 is strength design; the conversion is the team's ASD basis (method notes §1:
    wind governs, 0.6W).

    Parameters
    ----------
    phi_Nn : float or array_like
        Design strength phi Nn (or phi Vn), lb.

    Returns
    -------
    float or ndarray
        Allowable strength, lb: 0.6 phi Nn.

    References
    ----------
    ACI 318-19 §17.5 (strength design); ASCE 7-16 §2.4.1 0.6W against §2.3.1 1.0W.

    Examples
    --------
    >>> float(asd_from_strength(1000.0))
    600.0
    """
    return (np.asarray(phi_Nn, dtype=float) * ASD_FROM_STRENGTH)[()]


def phi_concrete_tension(cast_in=True, category=1):
    """phi for concrete breakout and pullout in tension, Condition B.

    Parameters
    ----------
    cast_in : bool or array_like, optional
        True for a cast-in anchor (default), False for post-installed.
    category : int or array_like, optional
        Anchor category 1, 2 or 3 of a post-installed anchor (its product report).

    Returns
    -------
    float or ndarray
        phi, dimensionless; NaN for an unknown category.

    References
    ----------
    ACI 318-19 Table 17.5.3(b), (c).

    Examples
    --------
    Cast-in, Condition B: 0.70 (text, verbatim in a published design guide); post-installed
    category 2: 0.55 (from memory).

    >>> float(phi_concrete_tension()), float(phi_concrete_tension(False, 2))
    (0.7, 0.55)
    """
    post = np.select([np.asarray(category) == k for k in PHI_POST_INSTALLED],
                     list(PHI_POST_INSTALLED.values()), default=np.nan)
    return np.where(cast_in, PHI_CAST_IN, post)[()]


# --- Tension -------------------------------------------------------------------------------
def basic_breakout_tension(hef_in, fc_psi, cast_in=True, lambda_a=LAMBDA_A_NORMAL_WEIGHT):
    """Basic concrete breakout strength Nb of one anchor in tension, cracked concrete.

    Parameters
    ----------
    hef_in : float or array_like
        Effective embedment depth, in.
    fc_psi : float or array_like
        Specified concrete strength f'c, psi.
    cast_in : bool or array_like, optional
        True (default) for kc = 24 cast-in, False for kc = 17 post-installed.
    lambda_a : float, optional
        Lightweight concrete modification factor, 1.0 for normal weight (§17.2.4).

    Returns
    -------
    float or ndarray
        Nb = kc lambda_a sqrt(f'c) hef^1.5, lb. Cast-in with 11 <= hef <= 25 in: not more than
        16 lambda_a sqrt(f'c) hef^(5/3) (Eq. 17.6.2.2.3; taken as the lesser, conservative
        whichever way it is read).

    References
    ----------
    ACI 318-19 Eq. 17.6.2.2.1 and 17.6.2.2.3.

    Examples
    --------
    Cast-in, hef 6 in, f'c 4000 psi: 24 x sqrt(4000) x 6^1.5 = 24 x 63.246 x 14.697 = 22,308 lb
    (text, verbatim in a published design guide).

    >>> round(float(basic_breakout_tension(6.0, 4000.0)))
    22308
    """
    hef = np.asarray(hef_in, dtype=float)
    root = lambda_a * np.sqrt(fc_psi)
    nb = np.where(cast_in, 24.0, 17.0) * root * hef**1.5
    deep = np.asarray(cast_in) & (hef >= 11.0) & (hef <= 25.0)
    return np.where(deep, np.minimum(nb, 16.0 * root * hef ** (5.0 / 3.0)), nb)[()]


def reference_area_tension(hef_in):
    """Projected breakout area of one anchor far from edges, A_Nco = 9 hef^2.

    Parameters
    ----------
    hef_in : float or array_like
        Effective embedment depth, in.

    Returns
    -------
    float or ndarray
        A_Nco, in2.

    References
    ----------
    ACI 318-19 Eq. 17.6.2.1.4.

    Examples
    --------
    hef 6 in: 9 x 36 = 324 in2 (text).

    >>> float(reference_area_tension(6.0))
    324.0
    """
    return (9.0 * np.asarray(hef_in, dtype=float) ** 2)[()]


def projected_area_tension(hef_in, c1_in=np.inf, c2_in=np.inf, c3_in=np.inf, c4_in=np.inf):
    """Projected breakout area A_Nc of one anchor with up to four edges.

    c1/c3 are the edge distances on opposite sides in one direction, c2/c4 in the other (inf
    where there is no edge); each side reaches at most 1.5 hef.

    Parameters
    ----------
    hef_in : float or array_like
        Effective embedment depth, in.
    c1_in, c2_in, c3_in, c4_in : float or array_like, optional
        Edge distances, in; inf (default) where there is no edge.

    Returns
    -------
    float or ndarray
        A_Nc, in2.

    References
    ----------
    ACI 318-19 §17.6.2.1.1, Fig. R17.6.2.1.1.

    Examples
    --------
    hef 6 in, one edge at 6 in: (6 + 9) x (9 + 9) = 270 in2 (text).

    >>> float(projected_area_tension(6.0, c1_in=6.0))
    270.0
    """
    reach = 1.5 * np.asarray(hef_in, dtype=float)
    return ((np.minimum(c1_in, reach) + np.minimum(c3_in, reach))
            * (np.minimum(c2_in, reach) + np.minimum(c4_in, reach)))[()]


def narrow_member_embedment(hef_in, c1_in=np.inf, c2_in=np.inf, c3_in=np.inf, c4_in=np.inf):
    """hef to use where an anchor is within 1.5 hef of three or more edges.

    Parameters
    ----------
    hef_in : float or array_like
        Effective embedment depth, in.
    c1_in, c2_in, c3_in, c4_in : float or array_like, optional
        Edge distances, in; inf (default) where there is no edge.

    Returns
    -------
    float or ndarray
        hef' = ca,max / 1.5, ca,max the largest edge distance under 1.5 hef; hef itself near
        fewer than three edges, in.

    References
    ----------
    ACI 318-19 §17.6.2.1.2 (single anchor: no spacing term).

    Examples
    --------
    hef 6 in with edges at 5, 6 and 7 in (all under 9 in): hef' = 7 / 1.5 = 4.67 in.

    >>> round(float(narrow_member_embedment(6.0, 5.0, 6.0, 7.0)), 2)
    4.67
    """
    hef = np.asarray(hef_in, dtype=float)
    edges = np.stack(np.broadcast_arrays(c1_in, c2_in, c3_in, c4_in, hef)[:4]).astype(float)
    near = edges < 1.5 * hef
    ca_max = np.max(np.where(near, edges, 0.0), axis=0)
    return np.where(np.sum(near, axis=0) >= 3, np.minimum(hef, ca_max / 1.5), hef)[()]


def near_three_or_more_edges(hef_in, c1_in=np.inf, c2_in=np.inf, c3_in=np.inf, c4_in=np.inf):
    """True where an anchor lies within 1.5 hef of three or more edges (ACI 318-19
    §17.6.2.1.2 applies). The reduced-hef rule is not monotonic in the edge distances (moving
    an edge away can lower N_cb): flag such anchors and move them rather than rely on it."""
    hef = np.asarray(hef_in, dtype=float)
    edges = np.stack(np.broadcast_arrays(c1_in, c2_in, c3_in, c4_in, hef)[:4]).astype(float)
    return np.sum(edges < 1.5 * hef, axis=0) >= 3


def psi_ed_n(ca_min_in, hef_in):
    """Edge-effect factor psi_ed,N for tension breakout.

    Parameters
    ----------
    ca_min_in : float or array_like
        Least edge distance, in.
    hef_in : float or array_like
        Effective embedment depth, in.

    Returns
    -------
    float or ndarray
        1.0 where ca,min >= 1.5 hef, else 0.7 + 0.3 ca,min / (1.5 hef); dimensionless.

    References
    ----------
    ACI 318-19 Eq. 17.6.2.4.1a/b.

    Examples
    --------
    hef 6 in, edge at 6 in: 0.7 + 0.3 x 6 / 9 = 0.90 (text).

    >>> round(float(psi_ed_n(6.0, 6.0)), 2)
    0.9
    """
    reach = 1.5 * np.asarray(hef_in, dtype=float)
    return np.where(ca_min_in >= reach, 1.0, 0.7 + 0.3 * np.asarray(ca_min_in) / reach)[()]


def psi_c_n(cracked=True, cast_in=True):
    """Cracking factor psi_c,N for tension breakout.

    Parameters
    ----------
    cracked : bool or array_like, optional
        True (default) for cracked concrete.
    cast_in : bool or array_like, optional
        True (default) for cast-in, False for post-installed (kc = 17).

    Returns
    -------
    float or ndarray
        1.0 cracked; uncracked 1.25 cast-in, 1.4 post-installed; dimensionless.

    References
    ----------
    ACI 318-19 §17.6.2.5.1.

    Examples
    --------
    The three values (text).

    >>> [float(psi_c_n(True)), float(psi_c_n(False, True)), float(psi_c_n(False, False))]
    [1.0, 1.25, 1.4]
    """
    return np.where(cracked, 1.0, np.where(cast_in, 1.25, 1.4))[()]


def psi_cp_n(ca_min_in, cac_in, hef_in, post_installed_uncracked):
    """Splitting factor: ca,min / cac, not less than 1.5 hef / cac, where ca,min < cac for a
    post-installed anchor designed as uncracked; 1.0 otherwise. ACI 318-19 Eq. 17.6.2.6.1a/b.
    """
    ratio = np.maximum(ca_min_in, 1.5 * np.asarray(hef_in, dtype=float)) / cac_in
    return np.where(post_installed_uncracked, np.minimum(ratio, 1.0), 1.0)[()]


def tension_breakout(hef_in, fc_psi, c1_in=np.inf, c2_in=np.inf, c3_in=np.inf, c4_in=np.inf,
                     cast_in=True, cracked=True, cac_in=None, lambda_a=LAMBDA_A_NORMAL_WEIGHT):
    """Nominal concrete breakout strength N_cb of one anchor in tension.

    N_cb = A_Nc / A_Nco psi_ed,N psi_c,N psi_cp,N N_b, with hef reduced near three or more
    edges (§17.6.2.1.2).

    Parameters
    ----------
    hef_in : float or array_like
        Effective embedment depth, in.
    fc_psi : float or array_like
        Specified concrete strength f'c, psi.
    c1_in, c2_in, c3_in, c4_in : float or array_like, optional
        Edge distances, in; inf (default) where there is no edge.
    cast_in, cracked : bool or array_like, optional
        Cast-in (default) or post-installed; cracked (default) or uncracked concrete.
    cac_in : float or array_like, optional
        Critical edge distance (§17.9.5), in; defaults to 4 hef, the largest tabulated
        (expansion anchors); used only for post-installed anchors in uncracked concrete.
    lambda_a : float, optional
        Lightweight concrete modification factor, 1.0 for normal weight.

    Returns
    -------
    float or ndarray
        N_cb, lb (nominal: apply phi, `phi_concrete_tension`).

    References
    ----------
    ACI 318-19 Eq. 17.6.2.1a.

    Examples
    --------
    Cast-in, hef 6 in, f'c 4000 psi, one edge at 6 in, cracked: 270 / 324 x 0.90 x 1.0 x 22,308
    = 16,731 lb (text).

    >>> round(float(tension_breakout(6.0, 4000.0, c1_in=6.0)))
    16731
    """
    hef_actual = np.asarray(hef_in, dtype=float)
    hef = narrow_member_embedment(hef_actual, c1_in, c2_in, c3_in, c4_in)
    ca_min = np.minimum(np.minimum(c1_in, c2_in), np.minimum(c3_in, c4_in))
    cac = 4.0 * hef_actual if cac_in is None else cac_in
    post_uncracked = ~np.asarray(cast_in, dtype=bool) & ~np.asarray(cracked, dtype=bool)
    area_ratio = (projected_area_tension(hef, c1_in, c2_in, c3_in, c4_in)
                  / reference_area_tension(hef))
    return (area_ratio * psi_ed_n(ca_min, hef) * psi_c_n(cracked, cast_in)
            * psi_cp_n(ca_min, cac, hef, post_uncracked)
            * basic_breakout_tension(hef, fc_psi, cast_in, lambda_a))[()]


def _futa_effective(futa_psi, fya_psi):
    """futa not more than 1.9 fya nor 125,000 psi. ACI 318-19 §17.6.1.2."""
    futa = np.minimum(np.asarray(futa_psi, dtype=float), 125_000.0)
    return futa if fya_psi is None else np.minimum(futa, 1.9 * np.asarray(fya_psi))


def steel_tension(Ase_in2, futa_psi, fya_psi=None):
    """Nominal steel strength of an anchor in tension, N_sa = A_se,N futa.

    Parameters
    ----------
    Ase_in2 : float or array_like
        Effective cross-sectional area in tension, in2.
    futa_psi : float or array_like
        Specified tensile strength of the anchor steel, psi (not more than 1.9 fya nor
        125,000 psi, §17.6.1.2).
    fya_psi : float or array_like, optional
        Specified yield strength, psi, for the 1.9 fya limit.

    Returns
    -------
    float or ndarray
        N_sa, lb.

    References
    ----------
    ACI 318-19 Eq. 17.6.1.2.

    Examples
    --------
    0.5 in2 at 60,000 psi: 30,000 lb; futa above 125,000 psi is taken as 125,000.

    >>> float(steel_tension(0.5, 60000.0)), float(steel_tension(0.5, 150000.0))
    (30000.0, 62500.0)
    """
    return (np.asarray(Ase_in2, dtype=float) * _futa_effective(futa_psi, fya_psi))[()]


def headed_pullout(Abrg_in2, fc_psi, cracked=True):
    """Nominal pullout strength of a headed stud or bolt, N_pn = psi_c,P 8 A_brg f'c.

    Parameters
    ----------
    Abrg_in2 : float or array_like
        Net bearing area of the head, in2.
    fc_psi : float or array_like
        Specified concrete strength f'c, psi.
    cracked : bool or array_like, optional
        True (default): psi_c,P 1.0; uncracked 1.4.

    Returns
    -------
    float or ndarray
        N_pn, lb.

    References
    ----------
    ACI 318-19 Eq. 17.6.3.1 and 17.6.3.2.2a, §17.6.3.3.1 (text, verbatim in a published design
    guide).

    Examples
    --------
    A_brg 1.0 in2, f'c 4000 psi, cracked: 8 x 1.0 x 4000 = 32,000 lb.

    >>> float(headed_pullout(1.0, 4000.0))
    32000.0
    """
    return (np.where(cracked, 1.0, 1.4) * 8.0 * np.asarray(Abrg_in2, dtype=float) * fc_psi)[()]


# --- Shear ---------------------------------------------------------------------------------
def steel_shear(Ase_in2, futa_psi, grout_pad=False, fya_psi=None):
    """Nominal steel strength in shear of a headed bolt or post-installed anchor.

    Parameters
    ----------
    Ase_in2 : float or array_like
        Effective cross-sectional area in shear, in2.
    futa_psi : float or array_like
        Specified tensile strength of the anchor steel, psi.
    grout_pad : bool or array_like, optional
        True where the base plate sits on a grout pad (times 0.80, §17.7.1.2.1).
    fya_psi : float or array_like, optional
        Specified yield strength, psi, for the 1.9 fya limit.

    Returns
    -------
    float or ndarray
        V_sa = 0.6 A_se,V futa, lb.

    References
    ----------
    ACI 318-19 Eq. 17.7.1.2b, §17.7.1.2.1 (from memory).

    Examples
    --------
    0.5 in2 at 60,000 psi: 0.6 x 0.5 x 60,000 = 18,000 lb.

    >>> float(steel_shear(0.5, 60000.0))
    18000.0
    """
    pad = np.where(grout_pad, 0.80, 1.0)
    return (0.6 * np.asarray(Ase_in2, dtype=float) * _futa_effective(futa_psi, fya_psi) * pad)[()]


def shear_breakout(ca1_in, le_in, da_in, fc_psi, ha_in, ca2_in=np.inf, ca2_other_in=np.inf,
                   cracked=True, lambda_a=LAMBDA_A_NORMAL_WEIGHT):
    """Nominal concrete breakout strength of one anchor in shear toward an edge, V_cb, lb.

    ca1: edge distance in the direction of the shear (inf: no edge, V_cb = inf); ca2,
    ca2_other: edge distances at right angles on either side; ha: member thickness.
    V_cb = A_Vc / A_Vco psi_ed,V psi_c,V psi_h,V V_b (ACI 318-19 Eq. 17.7.2.1a);
    A_Vco = 4.5 ca1^2 (Eq. 17.7.2.1.3); ca1 limited in narrow thin members (§17.7.2.1.2);
    V_b the lesser of 7 (le/da)^0.2 sqrt(da) lambda_a sqrt(f'c) ca1^1.5 and
    9 lambda_a sqrt(f'c) ca1^1.5 (Eq. 17.7.2.2.1a/b), le <= 8 da; psi_ed,V (Eq. 17.7.2.4.1a/b);
    psi_c,V 1.0 cracked without supplementary reinforcement, 1.4 uncracked (§17.7.2.5.1);
    psi_h,V = sqrt(1.5 ca1 / ha) >= 1.0 (Eq. 17.7.2.6.1).
    """
    ca1_actual = np.asarray(ca1_in, dtype=float)
    ha = np.asarray(ha_in, dtype=float)
    narrow = ((np.maximum(ca2_in, ca2_other_in) < 1.5 * ca1_actual)
              & (ha < 1.5 * ca1_actual))
    ca1_limit = np.maximum(np.maximum(ca2_in, ca2_other_in) / 1.5, ha / 1.5)
    ca1 = np.where(narrow, np.minimum(ca1_actual, ca1_limit), ca1_actual)
    reach = 1.5 * ca1
    le = np.minimum(le_in, 8.0 * np.asarray(da_in, dtype=float))
    root = lambda_a * np.sqrt(fc_psi)
    with np.errstate(invalid="ignore", divide="ignore"):
        vb = np.minimum(7.0 * (le / da_in) ** 0.2 * np.sqrt(da_in), 9.0) * root * ca1**1.5
        a_vc = (np.minimum(ca2_in, reach) + np.minimum(ca2_other_in, reach)) * np.minimum(ha, reach)
        a_vco = 4.5 * ca1**2
        ca2_min = np.minimum(ca2_in, ca2_other_in)
        psi_ed = np.where(ca2_min >= reach, 1.0, 0.7 + 0.3 * ca2_min / reach)
        psi_h = np.maximum(np.sqrt(reach / ha), 1.0)
        vcb = a_vc / a_vco * psi_ed * np.where(cracked, 1.0, 1.4) * psi_h * vb
    return np.where(np.isinf(ca1_actual), np.inf, vcb)[()]


def pryout(Ncp_lb, hef_in):
    """Nominal pryout strength V_cp = kcp N_cp.

    Parameters
    ----------
    Ncp_lb : float or array_like
        N_cp, lb: N_cb for cast-in, expansion, screw and undercut anchors.
    hef_in : float or array_like
        Effective embedment depth, in.

    Returns
    -------
    float or ndarray
        V_cp, lb: kcp 1.0 for hef < 2.5 in, else 2.0.

    References
    ----------
    ACI 318-19 Eq. 17.7.3.1a (from memory).

    Examples
    --------
    >>> float(pryout(1000.0, 2.0)), float(pryout(1000.0, 6.0))
    (1000.0, 2000.0)
    """
    return (np.where(np.asarray(hef_in) < 2.5, 1.0, 2.0) * np.asarray(Ncp_lb, dtype=float))[()]


def tension_shear_interaction(Nua, phiNn, Vua, phiVn):
    """Tension-shear interaction ratio of an anchor; passes at <= 1.0.

    Full strength in tension where V <= 0.2 phiVn, full strength in shear where N <= 0.2 phiNn
    (§17.8.1, 17.8.2): ratio = max(N/phiNn, V/phiVn); otherwise (N/phiNn + V/phiVn) / 1.2
    (Eq. 17.8.3), never below either single ratio. Works on either basis as long as demand and
    capacity share it.

    Parameters
    ----------
    Nua, phiNn : float or array_like
        Tension demand and capacity, same unit (magnitudes are used).
    Vua, phiVn : float or array_like
        Shear demand and capacity, same unit.

    Returns
    -------
    float or ndarray
        The ratio, dimensionless.

    References
    ----------
    ACI 318-19 §17.8 (from memory).

    Examples
    --------
    Half of each: (0.5 + 0.5) / 1.2 = 0.833; 0.9 in tension with 0.1 in shear: 0.9 alone.

    >>> round(float(tension_shear_interaction(0.5, 1.0, 0.5, 1.0)), 3)
    0.833
    >>> float(tension_shear_interaction(0.9, 1.0, 0.1, 1.0))
    0.9
    """
    n = np.abs(Nua) / np.asarray(phiNn, dtype=float)
    v = np.abs(Vua) / np.asarray(phiVn, dtype=float)
    single = np.maximum(n, v)
    return np.where((n <= 0.2) | (v <= 0.2), single, np.maximum(single, (n + v) / 1.2))[()]


@dataclass(frozen=True)
class AnchorCapacity:
    """Capacities of one slab anchor (or arrays of them), lb, on `basis`, by failure mode."""

    basis: str
    steel_tension: np.ndarray
    breakout_tension: np.ndarray
    pullout: np.ndarray
    steel_shear: np.ndarray
    breakout_shear: np.ndarray
    pryout: np.ndarray
    tension: np.ndarray
    shear: np.ndarray
    tension_mode: np.ndarray
    shear_mode: np.ndarray


def _governing(values, names):
    """Least capacity and its mode name; NaN (a mode that cannot be evaluated) propagates."""
    stack = np.stack(np.broadcast_arrays(*values)).astype(float)
    least = np.min(stack, axis=0)  # NaN wins: an unknown mode leaves the anchor unknown
    mode = np.asarray(names)[np.argmin(np.where(np.isnan(stack), -np.inf, stack), axis=0)]
    return least[()], mode


def slab_anchor_capacity(hef_in, fc_psi, Ase_in2, futa_psi, da_in, ha_in,
                         c1_in=np.inf, c2_in=np.inf, c3_in=np.inf, c4_in=np.inf,
                         cast_in=True, cracked=True, category=1, ductile=True,
                         Abrg_in2=None, pullout_lb=None, fya_psi=None, cac_in=None,
                         grout_pad=False, basis="ASD", lambda_a=LAMBDA_A_NORMAL_WEIGHT):
    """Tension and shear capacity of one anchor in a slab by every ACI 318-19 Ch. 17 mode.

    Edges: c1 in the direction of the shear (the foot's pull toward the wall for a brace in
    tension), c3 behind it, c2/c4 at the sides; inf where there is no edge. Pullout: headed
    (Abrg_in2) or the nominal value from the product's report (pullout_lb); with neither it
    is NaN and so is the governing tension (inf where the report says pullout does not
    govern). Adhesive bond (§17.6.5) is not covered. Condition B phi (Table 17.5.3).
    """
    ncb = tension_breakout(hef_in, fc_psi, c1_in=c1_in, c2_in=c2_in, c3_in=c3_in, c4_in=c4_in,
                           cast_in=cast_in, cracked=cracked, cac_in=cac_in, lambda_a=lambda_a)
    if Abrg_in2 is not None:
        npn = headed_pullout(Abrg_in2, fc_psi, cracked)
    elif pullout_lb is not None:
        npn = np.asarray(pullout_lb, dtype=float)
    else:
        npn = np.full(np.shape(ncb), np.nan)
    phi_concrete = phi_concrete_tension(cast_in, category)
    modes_t = (
        _on_basis(PHI_STEEL[("tension", ductile)] * steel_tension(Ase_in2, futa_psi, fya_psi),
                  basis),
        _on_basis(phi_concrete * ncb, basis),
        _on_basis(phi_concrete * npn, basis),
    )
    modes_v = (
        _on_basis(PHI_STEEL[("shear", ductile)]
                  * steel_shear(Ase_in2, futa_psi, grout_pad, fya_psi), basis),
        _on_basis(PHI_SHEAR_CONCRETE * shear_breakout(
            c1_in, hef_in, da_in, fc_psi, ha_in, ca2_in=c2_in, ca2_other_in=c4_in,
            cracked=cracked, lambda_a=lambda_a), basis),
        _on_basis(PHI_SHEAR_CONCRETE * pryout(ncb, hef_in), basis),
    )
    modes = [m[()] for m in np.broadcast_arrays(*modes_t, *modes_v)]
    modes_t, modes_v = modes[:3], modes[3:]
    tension, tension_mode = _governing(modes_t, ["steel", "concrete breakout", "pullout"])
    shear, shear_mode = _governing(modes_v, ["steel", "concrete breakout", "pryout"])
    return AnchorCapacity(
        basis=basis, steel_tension=modes_t[0], breakout_tension=modes_t[1], pullout=modes_t[2],
        steel_shear=modes_v[0], breakout_shear=modes_v[1], pryout=modes_v[2], tension=tension,
        shear=shear, tension_mode=tension_mode, shear_mode=shear_mode)


def post_installed_embedment_ok(hef_in, ha_in):
    """True where a post-installed anchor's embedment suits the slab's thickness.

    Parameters
    ----------
    hef_in : float or array_like
        Effective embedment depth, in.
    ha_in : float or array_like
        Slab thickness, in.

    Returns
    -------
    bool or ndarray
        hef <= max(2/3 ha, ha - 4 in): expansion, screw and undercut anchors.

    References
    ----------
    ACI 318-19 §17.9.4 (from memory).

    Examples
    --------
    A 6 in slab takes hef up to 4 in.

    >>> bool(post_installed_embedment_ok(4.0, 6.0)), bool(post_installed_embedment_ok(4.5, 6.0))
    (True, False)
    """
    ha = np.asarray(ha_in, dtype=float)
    return np.asarray(hef_in) <= np.maximum(2.0 * ha / 3.0, ha - 4.0)
