"""Slab anchors in shear: steel, concrete breakout and pryout (ACI 318-19 §17.7), and tension
with shear (§17.8); named in `bracing.anchors`.

Pure functions over floats or numpy arrays. Forces in lb, lengths in in, f'c in psi; nominal
strengths (ACI 318 strength design). Cracked, normal-weight concrete by default.
"""

from __future__ import annotations

import numpy as np

from bracing.anchor_factors import LAMBDA_A_NORMAL_WEIGHT
from bracing.anchor_tension import _futa_effective


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
