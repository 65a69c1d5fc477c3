"""Braced walls (method notes §4): every element's check, vectorised over walls.

The checks read the brace forces (`brace_loads.brace_forces`) and never a load kind: a new
kind of lateral load reaches them through `brace_loads` alone."""

from __future__ import annotations

import math
from dataclasses import dataclass, fields, replace

import numpy as np

from bracing import anchors, braces, members, stability
from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.stages.arrays import rows_of
from bracing.stages.brace_loads import BraceForces, BraceLoads, brace_forces, brace_loads
from bracing.stages.brace_set import BraceSet

SERVICEABILITY = {"wall cracking"}  # shown and flagged, not counted in the status or the speeds
CHECKS = {
    # name: (unit, combination kind, source)
    "brace compression": ("lb", "adding", "maker's rated table / AISC 360-16 Ch. E and §H1.1 / "
                          "NDS 2018 §3.7.1"),
    "brace tension": ("lb", "adding", "maker's rating / AISC 360-16 §D2"),
    "brace end fittings": ("lb", "adding", "maker's rating"),
    "wall insert": ("lb", "adding", "maker's rating at the brace angle, T/Ta + V/Va <= 1 "
                    "(common practice)"),
    "foot anchor": ("lb", "wind", "ACI 318-19 §17.6-17.8 / ICC-ES AC358 / maker's rating"),
    "deadman uplift": ("lb", "resisting", "weight, ASCE 7-16 §2.4.1"),
    "deadman sliding": ("lb", "resisting", "friction, IBC Table 1806.2 / ACI 318-19 §22.9.4.2: "
                        "pull + mu x uplift against mu x factored weight"),
    "deadman overturning": ("lb·ft", "resisting", "statics about the block's toe, weight at "
                            "mid-length, ASCE 7-16 §2.4.1"),
    "deadman bearing": ("psf", "adding", "statics, linear pressure, against the "
                        "allowable bearing (IBC Table 1806.2)"),
    "base uplift": ("lb", "resisting", "statics: 0.6D - sum(P sin theta) >= 0"),
    "sill uplift": ("lb", "resisting", "statics: sum(P sin theta) against 0.6D plus the sill "
                    "fastening (method notes §4)"),
    "base kick-out": ("lb", "resisting", "friction, ACI 318-19 §22.9.4.2 (mu 0.6)"),
    "wall bending": ("lb·ft", "resisting", "TMS 402-16 §8.2 flexural tension, or weight above "
                     "(fresh mortar), per ft"),
    "wall cracking": ("lb·ft", "resisting", "ACI 318-19 Eq. 19.2.3.1 modulus of rupture, per ft "
                      "(serviceability: a crack, not a collapse)"),
}
# Checks whose capacity is a strength value or statics alone, whatever the hardware: they take
# the basis's own combinations (the others hold allowable capacities: method notes §1).
STRENGTH_CHECKS = {"base uplift", "base kick-out", "wall cracking"}


BRACE_SOURCE = {
    "rated": ("maker's rated table (allowable load by length)", "maker's tension rating"),
    "pipe": ("AISC 360-16 §E3, self-weight bending §H1.1 and Appendix 8",
             "AISC 360-16 §D2 (or the rating given)"),
    "lumber": ("NDS 2018 §3.7.1, C_D 1.6", "the rating given (end connection)"),
    "unrated": ("not rated", "the rating given"),
}


def sources(brace_kind: str, foot_kind: str | None) -> dict[str, str]:
    """The source of each braced check that depends on the brace and anchor used."""
    compression, tension = BRACE_SOURCE[brace_kind]
    out = {"brace compression": compression, "brace tension": tension}
    if foot_kind in ANCHOR_KINDS:
        out["foot anchor"] = ANCHOR_KINDS[foot_kind].source
    return out


def strength_checks(brace_type, foot_kind: str | None, sill_given: bool) -> set[str]:
    """The braced checks of a brace type, a foot anchor kind and a wall whose sill fastening is
    given or not, that take the LRFD combinations under LRFD (strength values: AISC 360-16
    phi Pn, ACI 318-19 phi Nn; statics): the others are allowable (method notes §1)."""
    out = set(STRENGTH_CHECKS)
    if brace_type.kind == "pipe":
        out.add("brace compression")
        if brace_type.tension_capacity is None:
            out.add("brace tension")
    if foot_kind in ANCHOR_KINDS and not ANCHOR_KINDS[foot_kind].allowable:
        out.add("foot anchor")
    if not sill_given:
        out.add("sill uplift")
    return out


def _strength_rows(bs: BraceSet) -> dict[str, np.ndarray]:
    """`strength_checks` row by row: True where the check takes the LRFD combinations."""
    foot_strength = np.isin(bs.foot_kind, [k for k, v in ANCHOR_KINDS.items()
                                           if not v.allowable])
    rows = {name: np.ones(len(bs.foot_kind), bool) for name in STRENGTH_CHECKS}
    rows.update({"brace compression": bs.brace_strength, "brace tension": bs.tension_strength,
                 "foot anchor": foot_strength, "sill uplift": np.isnan(bs.sill)})
    return rows


@dataclass(frozen=True)
class Standing:
    """What the braced walls' checks take from the walls and their braces whatever the wind,
    for one set of load factors (arrays over m walls): worked out once for a search."""

    cos: np.ndarray         # of each wall's brace angle
    sin: np.ndarray
    tan: np.ndarray
    held: np.ndarray        # the base is checked for uplift and kick-out (not framed walls)
    framed: np.ndarray      # framed walls: the sill uplift is checked instead
    weight: np.ndarray      # factored weight holding the base down, lb
    sill: np.ndarray        # the sill fastening's allowable uplift, lb (0: none given)
    base_mu: np.ndarray     # friction at the base
    area: np.ndarray        # the wall's face, ft^2
    height: np.ndarray      # the wall's, ft
    bending: np.ndarray     # masonry: moment capacity at the base joint, per ft (NaN: other)
    cracking: np.ndarray    # concrete: cracking moment, per ft (NaN: other)

    def take(self, rows) -> Standing:
        """The same of the walls `rows` only."""
        return replace(self, **{f.name: rows_of(getattr(self, f.name), rows)
                                for f in fields(self)})


def standing_of(walls, bs: BraceSet, f) -> Standing:
    """The wind-independent parts of the braced checks of `bs` with load factors `f`."""
    i = bs.index
    theta = np.radians(bs.angle)
    s, b = walls.height[i], walls.width[i]
    dead = walls.face_weight[i] * s * b * walls.solidity[i]
    masonry = walls.masonry[i]
    bending = (np.where(masonry, _masonry_bending(walls, bs, f, s), np.nan) if masonry.any()
               else np.full(len(i), np.nan))
    framed = walls.framed[i]
    return Standing(cos=np.cos(theta), sin=np.sin(theta), tan=np.tan(theta),
                    # A framed wall's sill is fastened down: its uplift is checked against the
                    # weight and the sill fastening; its kick-out is the sill's (method notes §4).
                    held=~framed, framed=framed, weight=f.dead_resists * dead,
                    sill=np.nan_to_num(bs.sill) * b, base_mu=walls.base_mu[i], area=b * s,
                    height=s, bending=bending,
                    cracking=braces.cracking_moment(bs.rupture, walls.thickness_ft[i] * 12.0))


def sill_uplift(lift, weight, count, width):
    """The uplift the sill fastening must hold, lb per brace and per ft of sill: the braces'
    vertical push sum(P sin theta) less the factored weight, none below zero (statics)."""
    net = np.maximum(np.asarray(lift, dtype=float) - weight, 0.0)
    return net / count, net / width


@np.errstate(divide="ignore", invalid="ignore", over="ignore")  # infinities and NaN mean 'fails'
def braced_checks(walls, wind, bs: BraceSet, f, minimum_psf, loads: BraceLoads | None = None,
                  standing: Standing | None = None, held: tuple = ()):
    """Demand and capacity of every braced element, worst brace of each wall (arrays over m).

    `loads` (from `brace_loads`) may be given to skip working out the wind's load cases (the
    wind is then not read), `standing` (from `standing_of`) the parts that do not depend on the
    wind; `held`: the lateral loads that do not grow with the wind, for `brace_loads`. A check
    that applies to none of the walls is NaN throughout. Where `f` has allowable factors of its
    own (LRFD), the checks of allowable capacities take those (method notes §1).
    """
    if loads is None:
        loads = brace_loads(walls, wind, bs, minimum_psf, held)
    checks, forces = _checks_at(walls, bs, f, loads, standing)
    if f.allowable is not None:
        allowable, _ = _checks_at(walls, bs, f.allowable, loads, None)
        strength = _strength_rows(bs)
        checks = {k: tuple(np.where(strength[k], v, a)
                           for v, a in zip(checks[k], allowable[k], strict=True))
                  if k in strength else allowable[k] for k in checks}
    return checks, forces


def _checks_at(walls, bs: BraceSet, f, loads: BraceLoads, standing: Standing | None):
    """`braced_checks` with every check on the load factors `f`."""
    if standing is None:
        standing = standing_of(walls, bs, f)
    forces = brace_forces(loads, bs, f)
    p = braces.worst_brace(forces.axial)
    na = np.full(len(p), np.nan)
    comp_cap = bs.compression
    pipe = bs.self_weight_ratio > 0
    if pipe.any():
        # Self-weight bending (dead load adds) amplified by B1, AISC 360-16 Appendix 8 Eq. A-8-3.
        amplified = f.dead_adds * bs.self_weight_ratio * members.amplifier_of(p, bs.euler_load,
                                                                              bs.basis)
        with np.errstate(divide="ignore", invalid="ignore"):  # a zero rating fails below, visibly
            ratio = np.asarray(members.pipe_axial_bending_ratio(p, bs.compression, amplified,
                                                                1.0))
        comp_cap = np.where(pipe & (p > 0), p / np.maximum(ratio, 1e-12), bs.compression)
    checks = {
        "brace compression": (p, comp_cap),
        "brace tension": (p, bs.tension),
        "brace end fittings": (p, bs.connection),
    }
    pull, up = braces.components(p, cos_sin=(standing.cos, standing.sin))
    # the insert: the horizontal component pulls it out of the face, the vertical one shears it
    insert_ratio = pull / bs.insert_tension + up / bs.insert_shear
    checks["wall insert"] = (p, p / np.maximum(insert_ratio, 1e-12))
    # The foot anchor with the brace in tension (uplift P sin, pull P cos): each kind's own
    # ratio (anchor_kinds.KINDS); a kind with checks of its own (a deadman) has them instead.
    foot_ratio = np.full(len(p), np.nan)
    kinds = bs.foot_kind
    for name, kind in ANCHOR_KINDS.items():
        sel = kinds == name
        if kind.ratio is not None and sel.any():
            foot_ratio[sel] = kind.ratio(up[sel], pull[sel], p[sel], bs.foot_tension[sel],
                                         bs.foot_shear[sel])
    checks["foot anchor"] = (p, p / np.maximum(foot_ratio, 1e-12))
    deadman = kinds == "deadman"
    checks.update(_deadman_checks(bs, f, deadman, pull, up, na) if deadman.any()
                  else dict.fromkeys(DEADMAN_CHECKS, (na, na)))
    # The wall's base: lifted by the braces in compression, pushed out by the base shear.
    lift = forces.total * standing.tan
    held = standing.held
    checks["base uplift"] = (np.where(held, lift, na), standing.weight)
    # A framed wall's sill: the lift against its weight and the sill fastening (method notes §4).
    checks["sill uplift"] = (np.where(standing.framed, lift, na),
                             standing.weight + standing.sill)
    checks["base kick-out"] = (np.where(held, forces.base_shear, na), standing.base_mu * np.maximum(
        standing.weight - lift, 0.0))
    # The wall spanning from its base to the braces, per ft of width.
    pressure = forces.lateral_force / standing.area
    span, cantilever = braces.propped_wall_moments(pressure, standing.height, bs.insert)
    moment = np.maximum(span, cantilever)
    checks["wall bending"] = (moment, standing.bending)
    checks["wall cracking"] = (moment, standing.cracking)
    # A check whose capacity is not known is not made (its element is not counted).
    checks = {k: (np.where(np.isnan(c), np.nan, d), c) for k, (d, c) in checks.items()}
    return checks, forces


DEADMAN_CHECKS = ("deadman uplift", "deadman sliding", "deadman overturning", "deadman bearing")


def _deadman_checks(bs: BraceSet, f, deadman, pull, up, na) -> dict:
    """The deadman checks (demand, capacity) of the walls whose braces stand on deadmen."""
    weight = np.where(deadman, bs.foot_tension, np.nan)
    # Tipping about the block's toe: the pull at the pin's height and the uplift at its distance
    # from the toe against the factored weight at mid-length (statics, ASCE 7-16 §2.4.1).
    sized = deadman & ~np.isnan(bs.block_length)
    # The soil under the block's more loaded edge (the toe, unless the uplift sits far back):
    # its weight (dead load adds) less the uplift, with the moment about its middle of the pull
    # at the pin's height and of the uplift off the middle (statics; linear pressure, no
    # tension), against the allowable bearing. A block lifted off (no weight left) bears on
    # nothing: its uplift check fails and the bearing check is not made.
    # A block that tips over its toe (no pressure left under its heel) fails its overturning
    # check: its bearing is not checked either (it would be infinite).
    net = f.dead_adds * weight - up
    moment = pull * bs.pin_height + up * (bs.pin_from_toe - bs.block_length / 2.0)
    peak = stability.max_soil_pressure(net, np.abs(moment), bs.block_length, bs.block_width)
    bearing = deadman & ~np.isnan(bs.block_width) & (net > 0.0) & (np.isfinite(peak)
                                                                   | (moment < 0.0))
    # Sliding: pull <= mu (0.6W - uplift), written pull + mu uplift <= mu 0.6W so that a block
    # lifted off still has a finite utilization (foot_mu is already over its factor of safety).
    return dict(zip(DEADMAN_CHECKS, (
        (np.where(deadman, up, na), anchors.deadman_uplift(weight, f.dead_resists)),
        (np.where(deadman, pull + bs.foot_mu * up, na),
         anchors.deadman_sliding(weight, 0.0, bs.foot_mu, basis=f.dead_resists)),
        (np.where(sized, anchors.deadman_overturning_moment(pull, up, bs.pin_height,
                                                            bs.pin_from_toe), na),
         np.where(sized, anchors.deadman_resisting_moment(weight, bs.block_length / 2.0,
                                                          f.dead_resists), na)),
        (np.where(bearing, peak, na), np.where(bearing, bs.block_bearing, na))), strict=True))


def _masonry_bending(walls, bs: BraceSet, f, s):
    """Moment capacity of the masonry walls at their base joint, per ft: rocking on the weight
    above, or the mortar's flexural tension (TMS 402-16 §8.2)."""
    i = bs.index
    above = f.dead_resists * walls.face_weight[i] * (s - bs.insert)
    return np.maximum(
        stability.rocking_resistance(above, walls.thickness_ft[i]),
        stability.masonry_flexural_capacity(walls.flex_tension[i], walls.section[i],
                                            walls.section_area[i], above))


# Why a braced wall's brace utilization is None: no check of the brace itself could be made.
UNKNOWN_BRACE_UTILIZATION = ("no capacity of the brace is known (an unrated brace): its forces "
                             "are computed, its capacity unchecked (method notes §11)")


def braced_records(bs: BraceSet, forces: BraceForces, brace_type: list[str],
                   wall_anchor: list[str | None], foot_anchor: list[str | None],
                   utilization: list[float | None], one_missing: list[float | None],
                   sill: tuple[np.ndarray, np.ndarray]) -> list[dict]:
    """The §8 `braces` record of every braced wall (design wind, governing brace), in row order,
    with its brace and anchor types, the largest utilization of its brace's own checks, its
    working limit with one brace missing (None: not known) and, for a framed wall, the sill
    uplift (`sill`: lb per brace and per ft, NaN for other walls; `sill_uplift`)."""
    count = bs.mask.sum(axis=1)
    p = braces.worst_brace(forces.axial)
    pull, up = braces.components(p, bs.angle)
    uplift = forces.total * np.tan(np.radians(bs.angle))
    helical = bs.foot_kind == "helical"
    # ICC-ES AC358: T = FS P / Kt, the torque the crew reaches
    torque = np.where(helical, anchors.required_torque(p, bs.torque_factor, bs.torque_safety),
                      np.nan)
    out = []
    for k, angle, insert, distance, length, axial, lift, shear, at, each, base, uplift_lb, \
            helix, torque_ftlb, brace, wall, foot, most, missing, sill_lb, sill_plf in zip(
                count.tolist(), bs.angle.tolist(), bs.insert.tolist(),
                bs.anchor_distance.tolist(), bs.length.tolist(), p.tolist(), up.tolist(),
                pull.tolist(), _of_braces(bs.positions, count), _of_braces(forces.axial, count),
                forces.base_shear.tolist(), uplift.tolist(), helical.tolist(), torque.tolist(),
                brace_type, wall_anchor, foot_anchor, utilization, one_missing,
                sill[0].tolist(), sill[1].tolist(), strict=True):
        record = {
            "count": k, "angle_deg": angle, "insert_height_ft": insert,
            "anchor_distance_ft": distance, "length_ft": length, "axial_force_lb": axial,
            "anchor_uplift_lb": lift, "anchor_shear_lb": shear, "positions_ft": at,
            "brace_forces_lb": each, "base_shear_lb": base, "base_uplift_lb": uplift_lb,
        }
        if helix:
            record["installation_torque_ftlb"] = torque_ftlb
        if not math.isnan(sill_lb):
            record["sill_uplift_lb"], record["sill_uplift_plf"] = sill_lb, sill_plf
        record["brace_type"], record["wall_anchor"], record["foot_anchor"] = brace, wall, foot
        record["utilization"], record["working_limit_one_missing_mph"] = most, missing
        if most is None:  # unknown, not inapplicable: say why (the JSON key only then)
            record["utilization_unknown_because"] = UNKNOWN_BRACE_UTILIZATION
        out.append(record)
    return out


def _of_braces(per_slot: np.ndarray, count: np.ndarray) -> list[list]:
    """Each wall's values of its braces (the first `count` of its slots), a list per wall: the
    walls of each count read out together."""
    out = [None] * len(count)
    for k in np.unique(count).tolist():
        rows = np.flatnonzero(count == k)
        for r, of_wall in zip(rows.tolist(), per_slot[rows, :k].tolist(), strict=True):
            out[r] = of_wall
    return out
