"""The searches for the limit speeds: working limits, one brace missing, fresh mortar,
stand-down gusts (method notes §5)."""

from __future__ import annotations

from dataclasses import replace

import numpy as np

from bracing.model import Site
from bracing.stages.alone import governing_utilization, unbraced_at
from bracing.stages.arrays import Walls, rows_of, take, take_each
from bracing.stages.brace_loads import brace_loads
from bracing.stages.brace_set import BraceSet, capacities_of, layout_of
from bracing.stages.braced import SERVICEABILITY, braced_checks, standing_of
from bracing.stages.evaluation import Evaluation
from bracing.stages.loads import SERVICE
from bracing.stages.search import ROOT_TOLERANCE, TYPICAL_LIMIT_MPH, solve_speed
from bracing.stages.wind import Wind

BRACED_WALLS_AT_ONCE = 8192  # braced walls checked in one pass of a search


def reverse_wind_limit(limit: np.ndarray, bs: BraceSet, alone: np.ndarray) -> np.ndarray:
    """A braced wall's working limit, no higher than its limit on its own where its braces work
    in compression only (the wind away from them: method notes §4)."""
    return np.where(bs.compression_only, np.fmin(limit, alone[bs.index]), limit)


def fresh_mortar_limits(site: Site, unit: Wind, e: Evaluation) -> tuple[np.ndarray, np.ndarray]:
    """Working limit and stand-down gust of each masonry wall with fresh mortar (by weight
    only, no bond: TMS 402-16 §8.2, from memory), braced or on its own; NaN for other walls.

    A wall checked with fresh mortar keeps its own values; one checked with cured mortar that
    has a lift day is checked again as fresh, for the days after its lift while the mortar is
    younger than the cure rule (the day-by-day schedule). `unit`: the wind of a 1 mph gust."""
    w, bs = e.walls, e.service_braces
    limit = e.limit.copy()
    stand_down = e.stand_down.copy()
    if bs is not None:
        limit[bs.index], stand_down[bs.index] = e.braced_limit, e.braced_stand_down
    limit, stand_down = (np.where(w.masonry, v, np.nan) for v in (limit, stand_down))
    scheduled = np.array([day is not None for day in e.columns["lift_day"]], dtype=bool)
    again = w.masonry & ~w.fresh & scheduled
    if not again.any():
        return limit, stand_down
    fresh = replace(w, fresh=w.fresh | again, flex_tension=np.where(again, 0.0, w.flex_tension))
    has_braces = np.zeros(len(again), bool)
    if bs is not None:
        has_braces[bs.index] = True
    alone = np.flatnonzero(again & ~has_braces)
    if len(alone):
        limit[alone] = solve_speed(lambda v2, rows: unbraced_at(
            take(fresh, alone[rows]), take(unit, alone[rows]).scaled(v2), SERVICE,
            take_each(e.held, alone[rows])), len(alone))
        stand_down[alone] = stand_down_speeds(site, take(fresh, alone), limit[alone])
    if bs is not None and again[bs.index].any():
        sub = take(bs, np.flatnonzero(again[bs.index]))
        limit[sub.index] = braced_limit(fresh, unit, sub, e.held)
        stand_down[sub.index] = stand_down_speeds(site, take(fresh, sub.index), limit[sub.index])
    return limit, stand_down


def braced_utilization(w: Walls, unit: Wind, bs: BraceSet, rows=None, mask=None,
                       held: tuple = ()):
    """g(v2, r): the largest strength utilization, less 1, of the braced walls `r` in an observed
    gust whose speed squared is v2 (mph^2).

    `unit` is the observed wind of a 1 mph gust on every wall. The walls are those of `bs`, or
    variants of them: `rows` gives the wall of `bs` of each (a wall listed as often as it has
    variants) and `mask` its braces (a brace missing, say); each variant is its own wall. The
    wind's loads are linear in q: worked out once at 1 mph, then scaled; the parts of the checks
    that do not depend on the wind are worked out once too, for each wall of `bs`.
    """
    rows = np.arange(len(bs.index)) if rows is None else rows
    mask = bs.mask if mask is None else mask
    loads = brace_loads(w, unit, layout_of(bs, rows, mask), None, held)
    standing = standing_of(w, bs, SERVICE)
    checked = capacities_of(bs)

    def g(v2, r):
        parts = -(-len(r) // BRACED_WALLS_AT_ONCE)
        if parts > 1:  # in parts: the arrays of many more walls outgrow the processor's cache
            return np.concatenate([g(*part) for part in zip(np.array_split(v2, parts),
                                                            np.array_split(r, parts),
                                                            strict=True)])
        of_wall = rows[r]
        variant = replace(take(checked, of_wall), mask=rows_of(mask, r))
        checks, _ = braced_checks(w, None, variant, SERVICE, None,
                                         loads.take(r).scaled(v2), standing.take(of_wall))
        return governing_utilization(strength_only(checks)) - 1.0
    return g


def braced_limit(w: Walls, unit: Wind, bs: BraceSet, held: tuple = ()) -> np.ndarray:
    """Working-limit gust of each braced wall: its most utilized element reaches 1.0 (§3)."""
    return solve_speed(braced_utilization(w, unit, bs, held=held), len(bs.index))


def braced_limit_one_missing(w: Walls, unit: Wind, bs: BraceSet, full: np.ndarray,
                             held: tuple = ()) -> np.ndarray:
    """The working-limit gust with the worst single brace missing (equipment strikes one).

    Of each wall's variants (one brace struck each), the one without the brace farthest from
    the wall's middle is searched first (the end brace carries the twist and the end zone: the
    worst in about nine walls in ten). The others are only checked at its limit: a variant
    whose utilization there is still within 1.0 cannot fail sooner. Those that do fail sooner,
    and every variant of a wall whose first search found no limit, are searched too. `full`
    (each wall's limit with all its braces) is where the searches start; `held`: the loads
    that do not grow with the wind, held as they are.
    """
    count = bs.mask.sum(axis=1)
    # One brace left cannot carry the twist of Case B (no base restraint credited, §6): 0 mph.
    out = np.where(count == 2, 0.0, np.nan)
    rows, slots = np.nonzero(bs.mask & (count >= 3)[:, None])
    if len(rows) == 0:
        return out
    mask = rows_of(bs.mask, rows)
    mask[np.arange(len(rows)), slots] = False
    g = braced_utilization(w, unit, bs, rows, mask, held)
    start = np.where(np.isfinite(full[rows]), full[rows], TYPICAL_LIMIT_MPH)

    def search(which):
        return solve_speed(lambda v2, r: g(v2, which[r]), len(which), start[which])
    off_middle = np.abs(bs.positions[rows, slots] - w.width[bs.index[rows]] / 2.0)
    by_wall = np.lexsort((-off_middle, rows))  # farthest from the middle first
    first = by_wall[np.r_[True, np.diff(rows[by_wall]) != 0]]
    limits = np.full(len(rows), np.inf)  # not the least of its wall
    limits[first] = search(first)
    best = np.full(len(bs.index), np.nan)
    best[rows[first]] = limits[first]
    searched = np.zeros(len(rows), bool)
    searched[first] = True
    rest = np.flatnonzero(~searched)
    found = best[rows[rest]]
    known = rest[found > 0.0]  # a limit of 0 is the least there can be
    # (a mirror image of the first, say, is at 0 there, within the search's own tolerance)
    fails_sooner = known[g(np.square(best[rows[known]]), known) > ROOT_TOLERANCE]
    again = np.concatenate([fails_sooner, rest[np.isnan(found)]])
    if len(again):
        limits[again] = search(again)
    np.fmin.at(out, rows, limits)
    return out


def strength_only(checks: dict) -> dict:
    """The checks that count for status and speeds (not serviceability ones like cracking)."""
    return {k: v for k, v in checks.items() if k.split("|")[0] not in SERVICEABILITY}


def stand_down_speeds(site: Site, w: Walls, limit: np.ndarray) -> np.ndarray:
    """Stand-down ratio x working limit, capped for masonry by the industry speeds (method
    notes §5)."""
    ratio = site.rule_value("stand_down_ratio")
    speed = (1.0 if ratio is None else ratio) * limit
    initial = site.rule_value("masonry_initial_speed_mph")
    intermediate = site.rule_value("masonry_intermediate_speed_mph")
    if initial is not None:  # fmin: a limit beyond the search range (NaN) still gets the cap
        speed = np.where(w.masonry & w.fresh, np.fmin(speed, initial), speed)
    if intermediate is not None:
        speed = np.where(w.masonry, np.fmin(speed, intermediate), speed)
    return speed
