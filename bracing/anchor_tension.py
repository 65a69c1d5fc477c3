"""Slab anchors in tension: concrete breakout, steel and pullout (ACI 318-19 §17.6); named in
`bracing.anchors`.

Pure functions over floats or numpy arrays. Forces in lb, lengths in in, f'c in psi; nominal
strengths (ACI 318 strength design). Cracked, normal-weight concrete by default.
"""

from __future__ import annotations

import numpy as np

from bracing.anchor_factors import LAMBDA_A_NORMAL_WEIGHT


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
