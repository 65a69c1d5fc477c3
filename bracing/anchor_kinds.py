"""Anchor kinds: each kind is ONE entry here (design.md §2: a new kind is a registry entry).

An entry declares what the site file must give for it, how its capacities are worked out
(`capacity`, from the pure formulas of `anchors.py`), the ratio of its foot-anchor check
(`ratio`) and its source, whether its capacity is an allowable value (checked against the ASD
combinations under either basis, method notes §1) or a strength value, where it may stand on
the plan and the symbol the plan drawing gives it. The site model, the braced checks, the plan
findings and the drawing all read this table; none of them lists the kinds again.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass

import numpy as np

from bracing import anchors


@dataclass(frozen=True)
class AnchorKind:
    """What one anchor kind is and does."""

    words: str                # how reports and the plan's legend name it
    needs: tuple[str, ...]    # AnchorType fields the site file must give
    # capacity(fa, plan_edge_in, basis) -> {BraceSet field: value or array over its walls}
    capacity: Callable
    # ratio(uplift, pull, axial, tension, shear) -> the foot anchor's demand/capacity (arrays)
    ratio: Callable | None    # None: checked by its own checks (`own_checks`)
    source: str               # of its foot-anchor check
    allowable: bool           # an allowable capacity (ASD combinations under either basis)
    stands_on: frozenset      # where the plan lets it stand: 'slab', 'ground' (empty: not placed)
    symbol: str               # report.svg's shape for it
    # braced checks of its own beside (or instead of) "foot anchor"
    own_checks: tuple[str, ...] = ()
    # notes(fa, name) -> [(code, severity, message, source)]: findings on the type itself
    notes: Callable = lambda fa, name: []

    @property
    def checks(self) -> tuple[str, ...]:
        """The braced checks a foot anchor of this kind gets."""
        return (("foot anchor",) if self.ratio is not None else ()) + self.own_checks


def _rated(fa, plan_edge, basis):
    """Rated inserts, stakes and deck fastenings: the allowable ratings as given."""
    return {"foot_tension": fa.rated_tension, "foot_shear": fa.rated_shear}


def _rated_ratio(up, pull, p, tension, shear):
    """Linear interaction of the ratings, T/Ta + V/Va <= 1 (common practice)."""
    return up / tension + pull / shear


def _slab(fa, plan_edge, basis):
    """ACI 318-19 Ch. 17 at the edge distance the plan gives (0 off the slab: no capacity),
    else the least the type needs (ACI 318-19 §17.6.2.4, §17.7.2)."""
    edge = np.where(np.isfinite(plan_edge), plan_edge, fa.edge_distance or np.inf)
    cap = anchors.slab_anchor_capacity(
        fa.embedment, fa.concrete_strength, fa.steel_area, fa.steel_strength, fa.diameter,
        fa.slab_thickness, c1_in=np.maximum(edge, 1e-6), cast_in=fa.cast_in,
        cracked=fa.cracked, category=fa.category, Abrg_in2=fa.bearing_area,
        pullout_lb=fa.pullout if fa.pullout else (None if fa.bearing_area else np.inf),
        basis=basis)
    off_slab = edge <= 0.0
    return {"foot_tension": np.where(off_slab, 0.0, cap.tension),
            "foot_shear": np.where(off_slab, 0.0, cap.shear)}


def _slab_ratio(up, pull, p, tension, shear):
    """ACI 318-19 §17.8 tension-shear interaction."""
    return anchors.tension_shear_interaction(up, tension, pull, shear)


def _slab_notes(fa, name):
    """A post-installed anchor set deeper than its slab allows (ACI 318-19 §17.9.4)."""
    if fa.cast_in or bool(anchors.post_installed_embedment_ok(fa.embedment, fa.slab_thickness)):
        return []
    return [("anchor-too-deep", "warning", f"post-installed anchor {name}: h_ef "
             f"{fa.embedment:g} in is more than the {fa.slab_thickness:g} in slab allows",
             "ACI 318-19 §17.9.4 (unconfirmed value: confirm in ACI 318-19)")]


def _deadman_notes(fa, name):
    """A deadman without its size: its tipping about the toe is not checked."""
    if fa.length is not None:
        return []
    return [("deadman-tipping-unchecked", "warning", f"deadman {name}: its overturning about "
             "the toe is not checked; give its length and pin_height", "statics")]


def _helical(fa, plan_edge, basis):
    """ICC-ES AC358: K_t T / FS, installed along the brace line (allowable)."""
    return {"foot_tension": float(anchors.helical_capacity(
                fa.installation_torque, fa.torque_factor, fa.factor_of_safety)),
            "torque_factor": fa.torque_factor, "torque_safety": fa.factor_of_safety}


def _helical_ratio(up, pull, p, tension, shear):
    """Installed along the brace line: the whole brace force on its axis."""
    return p / tension


def _deadman(fa, plan_edge, basis):
    """Weight and friction (IBC Table 1806.2 values allowable; NAVFAC DM-7.02 ultimate and
    concrete on concrete nominal, over their factor of safety), and its size if given."""
    out = {"foot_tension": fa.weight,
           "foot_mu": anchors.allowable_friction(fa.friction_coefficient, fa.friction_basis)}
    if fa.length is not None:
        out.update(block_length=fa.length, pin_height=fa.pin_height,
                   pin_from_toe=fa.length / 2.0 if fa.pin_from_toe is None else fa.pin_from_toe)
    if fa.width is not None:
        out.update(block_width=fa.width, block_bearing=fa.allowable_bearing)
    return out


RATED_SOURCE = "T/Ta + V/Va <= 1 (common practice)"

KINDS: dict[str, AnchorKind] = {
    "insert": AnchorKind(
        words="insert", needs=("rated_tension", "rated_shear"), capacity=_rated,
        ratio=_rated_ratio, source=f"maker's ratings, {RATED_SOURCE}", allowable=True,
        stands_on=frozenset(), symbol="open"),
    "slab": AnchorKind(
        words="slab anchor",
        needs=("embedment", "diameter", "steel_area", "slab_thickness", "concrete_strength"),
        capacity=_slab, ratio=_slab_ratio,
        source="ACI 318-19 §17.6-17.8 (cracked), phi Nn x 0.6 for ASD", allowable=False,
        stands_on=frozenset({"slab"}), symbol="disc", notes=_slab_notes),
    "helical": AnchorKind(
        words="helical anchor", needs=("installation_torque",), capacity=_helical,
        ratio=_helical_ratio, source="ICC-ES AC358: K_t T / FS", allowable=True,
        stands_on=frozenset({"ground"}), symbol="crossed circle"),
    "deadman": AnchorKind(
        words="deadman", needs=("weight",), capacity=_deadman, ratio=None,
        source="weight and friction", allowable=True, stands_on=frozenset({"ground", "slab"}),
        symbol="square", own_checks=("deadman uplift", "deadman sliding"),
        notes=_deadman_notes),
    "stake": AnchorKind(
        words="stake", needs=("rated_tension", "rated_shear"), capacity=_rated,
        ratio=_rated_ratio, source=f"maker's ratings, {RATED_SOURCE}", allowable=True,
        stands_on=frozenset({"ground"}), symbol="triangle"),
    "deck": AnchorKind(
        words="deck anchor", needs=("rated_tension", "rated_shear"), capacity=_rated,
        ratio=_rated_ratio, source=f"ratings of the deck fastening, {RATED_SOURCE}",
        allowable=True, stands_on=frozenset(), symbol="diamond"),
}
