"""Slab anchors' strength reduction factors (ACI 318-19 Table 17.5.3) and the conversion of
strength-design values to the team's ASD basis (method notes §1); named in `bracing.anchors`.

Pure functions over floats or numpy arrays. Forces in lb.
"""

from __future__ import annotations

import numpy as np

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
