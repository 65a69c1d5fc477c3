"""The lateral loads on the braced walls and each brace's reaction to them (method notes §2, §4)."""

from __future__ import annotations

from dataclasses import dataclass, fields, replace

import numpy as np

from bracing import braces, lines
from bracing.stages.arrays import rows_of
from bracing.stages.brace_set import BraceSet
from bracing.stages.loads import KINDS
from bracing.wind import asce7


@dataclass(frozen=True)
class BraceForces:
    """Factored forces of the braced walls under one wind (arrays over m walls, k braces)."""

    horizontal: np.ndarray  # (m, k) governing |R_h| of each brace, lb
    axial: np.ndarray       # (m, k) |P|, lb
    total: np.ndarray       # largest sum of R_h over the load cases, lb
    base_shear: np.ndarray  # largest |F - sum R_h| (plus lean), lb
    lateral_force: np.ndarray  # the whole wall's factored lateral force in that case, lb


@dataclass(frozen=True)
class BraceLoads:
    """Unfactored loads on the braced walls (lb): each brace's horizontal reaction to the wind,
    the largest and the least over a rigid panel's load cases (the even share plus the twist)
    or its own strip's largest of a wall built in place, and its share of the wall's weight
    leaning out of plumb, with each wall's sums. The wind is linear in q, so an observed gust's
    loads are those of 1 mph scaled by V^2; the lean does not scale."""

    most: np.ndarray        # (m, k) each brace's largest wind reaction over the load cases
    least: np.ndarray       # (m, k) and its least (a strip's brace: both its strip's); NaN at
    #                         an empty slot
    lean: np.ndarray        # (m, k) each brace's share of the lean
    total: np.ndarray       # (m,) largest sum of the braces' wind reactions over the cases
    wind_force: np.ndarray  # (m,) the whole wall's wind force in that case
    base_shear: np.ndarray  # (m,) F - sum R_h of the case where it is largest in size, signed:
    #                         it reverses where the insert is below the resultant
    lean_total: np.ndarray  # (m,) sum of the braces' horizontal reactions to the lean
    held: tuple[HeldReaction, ...] = ()  # the loads that do not grow with the wind, by kind

    def take(self, rows) -> BraceLoads:
        """The loads of the walls `rows` only."""
        return replace(self, held=tuple(h.take(rows) for h in self.held), **{
            f.name: rows_of(getattr(self, f.name), rows) for f in fields(self)
            if f.name != "held"})

    def scaled(self, factor) -> BraceLoads:
        """The wind times `factor` (one value, or one per wall); the lean as it is."""
        factor = np.asarray(factor, dtype=float)
        each = factor[..., None] if factor.ndim else factor
        return replace(self, most=self.most * each, least=self.least * each,
                       total=self.total * factor, wind_force=self.wind_force * factor,
                       base_shear=self.base_shear * factor)


@dataclass(frozen=True)
class HeldReaction:
    """The braces' unfactored reactions to one lateral load that does not grow with the wind
    (loads.LateralLoad), over m walls and k braces: worked out like the wind's, by statics."""

    kind: str               # its entry in loads.KINDS
    each: np.ndarray        # (m, k) each brace's horizontal reaction, lb (0 at an empty slot)
    total: np.ndarray       # (m,) their sum
    force: np.ndarray       # (m,) the load on the wall

    def take(self, rows) -> HeldReaction:
        """The same of the walls `rows` only."""
        return HeldReaction(kind=self.kind, each=rows_of(self.each, rows),
                            total=rows_of(self.total, rows), force=rows_of(self.force, rows))


def brace_loads(walls, wind, bs: BraceSet, minimum_psf, held: tuple = ()) -> BraceLoads:
    """The wind load cases on each braced wall and each brace's reactions (method notes §2, §4).

    A rigid panel's braces share each load case as a whole with the twist, and so do those of
    a wall built in place whose braces a continuous stiff member ties together (a strongback
    or waler); any other wall built in place gives each brace its own strip (each worked out
    for the walls that use it), under the worst of its pressure patterns. Worked out once for
    a wind: the reactions of any load factor and any scale follow from them. `held`: the
    lateral loads that do not grow with the wind (loads.fixed_loads), each shared the same way
    (`held_reactions`)."""
    rigid = walls.rigid[bs.index] | bs.stiff
    m, k = bs.mask.shape
    i = bs.index
    s, b = walls.height[i], walls.width[i]
    hb = bs.insert
    height = wind.lever[i]  # every strip's force at the wall's resultant height (§6)
    most, least = np.full((m, k), np.nan), np.full((m, k), np.nan)
    total, force, shear = np.zeros(m), np.zeros(m), np.zeros(m)
    lever = braces.brace_lever(bs.positions, bs.mask)
    rows = np.flatnonzero(rigid)
    if len(rows):  # a wall listed more than once (variants of its layout) is worked out once
        each, listed = np.unique(i[rows], return_inverse=True)
        case_force, case_at = (np.take(v, listed, axis=1)
                               for v in _case_loads(walls, wind, each, minimum_psf))
        sum_h = braces.total_brace_reaction(case_force, height[rows], hb[rows])
        arms = tuple(rows_of(v, rows) for v in lever)
        share, per_arm = braces.share_and_twist(sum_h, case_force, case_at, b[rows] / 2.0,
                                                arms)
        high, low = np.full(arms[2].shape, -np.inf), np.full(arms[2].shape, np.inf)
        pushed, sums, out = np.zeros(len(rows)), np.zeros(len(rows)), np.zeros(len(rows))
        for case, case_sum, even, twist in zip(case_force, sum_h, share, per_arm, strict=True):
            shares = braces.each_share(even, twist, arms[2])
            high, low = np.maximum(high, shares), np.minimum(low, shares)
            pushed = np.where(case_sum > sums, case, pushed)  # the first case of the largest sum
            sums = np.maximum(sums, case_sum)
            kick = case - case_sum  # F - sum(R_h): the base shear (§6), signed
            out = np.where(np.abs(kick) > np.abs(out), kick, out)
        most[rows], least[rows], total[rows], force[rows], shear[rows] = high, low, sums, \
            pushed, out
    rows = np.flatnonzero(~rigid)
    if len(rows):  # walls built in place: each brace takes its own strip of wall
        each, listed = np.unique(i[rows], return_inverse=True)  # each wall's wind once
        strip = _strip_loads(walls, wind, each, listed, rows_of(bs.positions, rows),
                             rows_of(bs.mask, rows), minimum_psf)
        strip_h = braces.total_brace_reaction(strip, height[rows][:, None], hb[rows][:, None])
        most[rows] = least[rows] = strip_h
        total[rows], force[rows] = braces.slot_sum(strip_h), braces.slot_sum(strip)
        shear[rows] = force[rows] - total[rows]
    most, least = np.where(bs.mask, most, np.nan), np.where(bs.mask, least, np.nan)
    dead = walls.face_weight[i] * s * b * walls.solidity[i]
    lean_total = braces.lean_reaction(dead, walls.centroid_ratio[i] * s, s, hb, bs.lean, bs.slop)
    lean = braces.brace_shares(lean_total, np.zeros(m), b / 2.0, b / 2.0, bs.positions,
                               bs.mask, lever)
    # walls built in place without a stiff member: the lean shares equally (§6)
    count = braces.slot_sum(bs.mask, 0)
    lean = np.where(rigid[:, None], lean, np.where(bs.mask, (lean_total / count)[:, None],
                                                   np.nan))
    return BraceLoads(most=most, least=least, lean=lean, total=total, wind_force=force,
                      base_shear=shear, lean_total=lean_total,
                      held=tuple(held_reactions(load, walls, bs, rigid, lever) for load in held))


def held_reactions(load, walls, bs: BraceSet, rigid, lever) -> HeldReaction:
    """The braces' reactions to one lateral load (loads.LateralLoad) held as it is (method
    notes §4): a rigid panel's, or those a stiff member ties, share its resultant with the twist
    (braces.brace_shares); any other brace takes its own strip's share of the loaded length
    (braces.total_brace_reaction), its resultant at the load's height."""
    i = bs.index
    force, height, at, line = (v[i] for v in (load.force, load.height, load.at, load.line))
    total_h = braces.total_brace_reaction(force, height, bs.insert)
    shared = np.where(bs.mask, braces.brace_shares(total_h, force, at, walls.width[i] / 2.0,
                                                   bs.positions, bs.mask, lever), 0.0)
    by_position, lo, hi = _strip_bounds(bs.positions, bs.mask, walls.width[i])
    length = np.maximum(np.minimum(hi, load.end[i][:, None])
                        - np.maximum(lo, load.start[i][:, None]), 0.0)
    strip = _in_slots(line[:, None] * length, by_position, bs.mask)
    own = braces.total_brace_reaction(strip, height[:, None], bs.insert[:, None])
    each = np.where(rigid[:, None], shared, own)
    return HeldReaction(kind=load.kind, each=each, total=braces.slot_sum(each),
                        force=np.where(rigid, force, braces.slot_sum(strip)))


LOAD_CASES = 5  # Case A, Case B from either edge, Case C from either end (alone or on a line)


def _case_loads(walls, wind, i, minimum_psf) -> tuple[np.ndarray, np.ndarray]:
    """Forces (lb) of a rigid panel's load cases and where they act from its first edge (ft).

    Cases A, B (either edge) and C (either end), the braces carrying the twist; Case C is the
    largest of the panel alone and on its line each day, over its width from either end
    (`Wind.cf_left`, `cf_right`). An open wall (solidity < 0.7) takes no Case C."""
    b = walls.width[i]
    solid = walls.solidity[i] >= 0.7

    def force_of(cf):
        return np.where(solid, np.maximum(
            wind.q[i] * asce7.GUST_FACTOR * cf * wind.opening[i] * wind.area[i],
            (minimum_psf or 0.0) * wind.area[i]), 0.0)  # ASCE 7-16 Eq. 29.3-1 and §29.7
    centroid = walls.centroid_x_ratio[i] * b
    forces = [wind.force_a[i]] * 3 + [force_of(wind.cf_left[i]), force_of(wind.cf_right[i])]
    at = [centroid, centroid + 0.2 * b, centroid - 0.2 * b, wind.x_left[i], wind.x_right[i]]
    return np.array(forces), np.array(at)


def brace_forces(loads: BraceLoads, bs: BraceSet, f) -> BraceForces:
    """Per-brace factored forces, the governing load case of each brace (method notes §4).

    Each brace's wind reaction (factored) plus its lean: the larger in size of its largest and
    least over the cases (|x + lean| is largest at one end of the reactions' range). The base
    shear is F - sum(R_h) with the lean among the braces' reactions: the lean's reaction comes
    off it (method notes §4; it reverses where the insert is below the wind's resultant). The held
    loads add to each brace's reaction and to the base shear with their own factors in `f`
    (loads.KINDS), pushing the same way as the wind (the worse way)."""
    lean_total, lean = f.dead_adds * loads.lean_total, f.dead_adds * loads.lean
    shear, lateral = f.wind * loads.base_shear - lean_total, f.wind * loads.wind_force
    for held in loads.held:
        factor = KINDS[held.kind].factor(f)
        lean = lean + factor * held.each
        lean_total = lean_total + factor * held.total
        shear = shear + factor * (held.force - held.total)
        lateral = lateral + factor * held.force
    horizontal = np.fmax(np.abs(f.wind * loads.most + lean), np.abs(f.wind * loads.least + lean))
    horizontal = np.where(bs.mask, horizontal, 0.0)
    axial = braces.axial_force(horizontal, bs.angle[:, None])
    return BraceForces(horizontal=horizontal, axial=axial,
                       total=f.wind * loads.total + lean_total, base_shear=np.abs(shear),
                       lateral_force=lateral)


def _strip_loads(walls, wind, i, listed, positions, mask, minimum_psf):
    """Wind on each brace's tributary strip of walls built in place (lb, in slot order):
    `positions` and `mask` are their braces as in BraceSet, a row for each layout, `listed` the
    wall of `i` of each (a wall may have more than one).

    Each strip runs from midway to its neighbours (the end strips to the wall's ends) and takes
    the worst of these patterns, each from either end (method notes §4): Case B of the wall alone
    as a pressure varying linearly along it, p_avg (1 + 2.4 (x/B - 1/2)) with p_avg =
    max(q G Cf_A, 16 psf) (it is never below Case A's uniform pressure, which needs no pattern
    of its own); and, on a solid wall, Case C by distance from the windward end of the wall
    alone and of its line each day, the largest coefficient over the strip.
    """
    s, b = walls.height[i], walls.width[i]
    solid = walls.solidity[i] >= 0.7
    share = np.where(solid, 1.0, walls.solidity[i])  # the area Cf applies to, per ft^2 of face
    s, b, solid, share, q, cf_a, opening, groups, base = (
        v[listed] for v in (s, b, solid, share, wind.q[i], wind.cf_case_a[i], wind.opening[i],
                            walls.groups[i], walls.base[i]))
    by_position, lo, hi = _strip_bounds(positions, mask, b)
    area = s[:, None] * np.maximum(hi - lo, 0.0) * share[:, None]
    floor = (minimum_psf or 0.0) * area  # ASCE 7-16 §29.7 on As (method notes §1)
    g = asce7.GUST_FACTOR
    p_avg = np.maximum(q * g * cf_a, minimum_psf or 0.0)  # ASCE 7-16 Eq. 29.3-1 and §29.7
    # Case B as a linear pressure, from whichever end loads the strip more (method notes §2)
    strip = p_avg[:, None] * area * asce7.case_b_linear_factor((lo + hi) / (2.0 * b[:, None]))
    if solid.any():  # Case C (Figure 29.3-1), the largest coefficient over each strip
        cf_c = lines.strip_case_c(groups, b, s, base, lo, hi) * opening[:, None]
        strip = np.where(solid[:, None], np.maximum(strip, np.maximum(
            q[:, None] * g * cf_c * area, floor)), strip)
    return _in_slots(strip, by_position, mask)


def _strip_bounds(positions, mask, b):
    """Each brace's tributary strip of a wall `b` ft long, from midway to its neighbours (the
    end strips to the wall's ends), in order of position (`by_position`: each's slot)."""
    x = np.where(mask, positions, np.nan)
    by_position = np.argsort(x, axis=1)  # the empty slots (NaN) last
    order = np.take_along_axis(x, by_position, axis=1)
    mids = (order[:, 1:] + order[:, :-1]) / 2.0
    lo = np.concatenate([np.zeros((len(b), 1)), mids], axis=1)
    hi = np.concatenate([mids, np.full((len(b), 1), np.inf)], axis=1)
    hi = np.minimum(np.where(np.isnan(hi), b[:, None], hi), b[:, None])
    count = braces.slot_sum(mask, 0)
    last = np.arange(mask.shape[1])[None, :] == (count - 1)[:, None]
    hi = np.where(last, b[:, None], hi)
    return by_position, np.where(np.isnan(lo), 0.0, lo), np.where(np.isnan(hi), 0.0, hi)


def _in_slots(values, by_position, mask):
    """Values in order of position put back in each brace's own slot (0 at an empty one)."""
    in_slots = np.empty_like(values)
    np.put_along_axis(in_slots, by_position, values, axis=1)
    return np.where(mask, in_slots, 0.0)
