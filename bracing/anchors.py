"""Anchor capacity: slab anchors (ACI 318-19 Ch. 17); helical anchors (ICC-ES AC358) and
deadmen are in `bracing.ground_anchors` and named here too. The slab anchor's modes live by
topic in `bracing.anchor_factors` (phi, the ASD basis), `bracing.anchor_tension` and
`bracing.anchor_shear`, all named here; this module combines them (`slab_anchor_capacity`).

Pure functions over floats or numpy arrays. Forces in lb, lengths in in (anchors) or ft
(deadmen), f'c in psi. ACI 318 gives nominal strengths and strength design (phi Nn); the
team's ASD basis divides phi Nn by alpha = 1.0/0.6 (method notes §1: wind governs).
Cracked concrete and normal-weight concrete (lambda_a = 1.0) by default; single anchors only.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from bracing.anchor_factors import (
    ASD_FROM_STRENGTH,
    LAMBDA_A_NORMAL_WEIGHT,
    PHI_CAST_IN,
    PHI_POST_INSTALLED,
    PHI_SHEAR_CONCRETE,
    PHI_STEEL,
    _on_basis,
    asd_from_strength,
    phi_concrete_tension,
)
from bracing.anchor_shear import pryout, shear_breakout, steel_shear, tension_shear_interaction
from bracing.anchor_tension import (
    basic_breakout_tension,
    headed_pullout,
    narrow_member_embedment,
    near_three_or_more_edges,
    projected_area_tension,
    psi_c_n,
    psi_cp_n,
    psi_ed_n,
    reference_area_tension,
    steel_tension,
    tension_breakout,
)

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
