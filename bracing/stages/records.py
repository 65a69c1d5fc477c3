"""Result objects: the per-wall results (bracing.results) from one evaluation's arrays."""

from __future__ import annotations

import numpy as np

from bracing import members
from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.data_members import PIPES
from bracing.model import Site
from bracing.results import Flag, PanelResult, UnbracedResult, WindResult
from bracing.stages.alone import ALLOWABLE_ALONE, ALLOWABLE_MASONRY, CHECK_INFO, REVERSE_INFO
from bracing.stages.arrays import Walls
from bracing.stages.braced import (
    CHECKS,
    braced_records,
    sill_uplift,
    sources,
    strength_checks,
)
from bracing.stages.checkset import (
    UNBRACED_SOURCES,
    CheckSet,
    check_set,
    each_of,
    on_allowable,
)
from bracing.stages.evaluation import Evaluation
from bracing.stages.findings import BRACED_RULES, WALL_RULES
from bracing.stages.loads import COMBINATIONS
from bracing.stages.search import SPEED_BRACKET_MPH
from bracing.wind import asce7, gusts


class Results:
    """Builds the per-wall result objects from one evaluation's arrays.

    What decides each wall's values, checks and flags is worked out for every wall at once with
    numpy and read out as Python lists, which give single values far faster than numpy arrays
    do; each kind of flag is made in one pass over the walls that have it. What walls share is
    made once: rules and sources, the names, regions and sources of their checks, the flags
    that read the same on every wall.
    """

    def __init__(self, site: Site, e: Evaluation):
        self.site, self.e = site, e
        f = COMBINATIONS[site.site.design_basis]
        combos = {"resisting": f.resisting, "adding": f.adding, "wind": f.wind_only}
        self.rule = {name: site.rule_value(name) for name in (
            "masonry_unbraced_height_ft", "minimum_braces_per_panel", "brace_angle_min_deg",
            "brace_angle_max_deg", "insert_min_height_ratio")}
        self.source = {name: site.rule(name).source for name in self.rule}
        self.hardware: dict[tuple, tuple[dict, list[Flag], list[Flag]]] = {}
        w, n = e.walls, len(site.panels)
        self.material, self.height, self.opening_area = (
            list(e.columns[k]) for k in ("material", "height", "opening_area"))
        self.kind = np.select([w.rigid, w.masonry & ~w.fresh, w.masonry],
                              ["rigid", "masonry", "fresh"], "strip")
        # each wall's row in the checks of the walls on their own, or of the braced walls
        self.is_braced, self.row = np.zeros(n, dtype=bool), np.zeros(n, dtype=np.int64)
        if e.braces is not None:
            bs = e.braces
            self.is_braced[bs.index] = True
            self.row[bs.index] = np.arange(len(bs.index))
            bracing = e.columns["bracing"]
            self._braced_walls(e, combos, [bracing[i] for i in bs.index.tolist()])
        else:
            self.braced = CheckSet(checks=[], governing=[], strength_ok=[], failing=[],
                                   brace_utilization=[])
            self.records = []
        self.alone = np.flatnonzero(~self.is_braced)
        self.row[self.alone] = np.arange(len(self.alone))
        # each wall's place in a list of the walls on their own followed by the braced walls
        self.place = np.where(self.is_braced, len(self.alone) + self.row, self.row).tolist()
        kinds, way = np.unique(self.kind[self.alone], return_inverse=True)
        self.unbraced = check_set(
            {name: (d[self.alone], c[self.alone]) for name, (d, c) in e.checks.items()},
            CHECK_INFO, combos, [(k, UNBRACED_SOURCES[k], self._alone_combinations(k))
                                 for k in kinds.tolist()], way)
        self.over_height = self._over_height(w)
        self.stands = (e.utilization <= 1.0) & ~self.over_height
        self.columns = self._columns()

    def _columns(self) -> dict:
        """The fields of every wall's PanelResult that come straight from its panel or the
        arrays; a braced wall's speeds are those of its bracing."""
        site, e, w, n = self.site, self.e, self.e.walls, len(self.site.panels)
        limit, stand_down = e.limit, e.stand_down
        if e.braces is not None:
            limit, stand_down = limit.copy(), stand_down.copy()
            limit[e.braces.index] = e.braced_limit
            stand_down[e.braces.index] = e.braced_stand_down
        mark, width, thickness = (list(e.columns[k]) for k in ("mark", "width", "thickness"))
        return {
            "mark": mark, "material": list(map(
                {name: m.kind for name, m in site.materials.items()}.__getitem__,
                self.material)),
            "height_ft": self.height, "width_ft": width, "thickness_in": thickness,
            "weight_lb": (w.face_weight * w.height * w.width * w.solidity).tolist(),
            "wind": self._wind_results(),
            "unbraced": each_of(
                UnbracedResult, n, utilization=e.utilization.tolist(),
                stands=self.stands.tolist(),
                working_limit_speed_mph=e.limit.tolist(),
                stand_down_speed_mph=e.stand_down.tolist(),
                max_height_ft=self._capped(w, _unbounded(e.max_height)).tolist(),
                max_height_at_limit_ft=(self._capped(w, _unbounded(e.max_at_limit)).tolist()
                                        if site.site.limit_speed else None),
                max_height_structural_ft=_unbounded(e.max_height).tolist()),
            "working_limit_speed_mph": limit.tolist(),
            "stand_down_speed_mph": stand_down.tolist(),
            "sustained_equivalents_mph": gusts.sustained_equivalents_of_each(stand_down),
            "fresh_working_limit_speed_mph": _where(w.masonry, e.fresh_limit),
            "fresh_stand_down_speed_mph": _where(w.masonry, e.fresh_stand_down),
            "fresh_sustained_equivalents_mph": _fresh_sustained(e.fresh_stand_down),
            "unknown": _unknown_speeds({"working_limit_speed_mph": limit,
                                        "stand_down_speed_mph": stand_down,
                                        "fresh_working_limit_speed_mph": np.where(
                                            w.masonry, e.fresh_limit, 0.0),
                                        "fresh_stand_down_speed_mph": np.where(
                                            w.masonry, e.fresh_stand_down, 0.0)})}

    def _wind_results(self) -> list[WindResult]:
        """Every wall's design wind (ASCE 7-16 §29.3 with ASCE 37-14 §6.2)."""
        site, e, w, wind = self.site, self.e, self.e.walls, self.e.wind
        return each_of(
            WindResult, len(site.panels), basic_speed_mph=site.site.basic_wind_speed,
            period_factor=w.period_factor.tolist(),
            period_factor_from="set" if site.site.period_factor else "standing time",
            design_speed_mph=e.design_speed.tolist(), kz=wind.kz.tolist(),
            kd=asce7.KD_WALLS, kzt=w.kzt, ke=w.ke, gust_factor=asce7.GUST_FACTOR,
            velocity_pressure_psf=wind.q.tolist(), force_coefficient=wind.cf_case_a.tolist(),
            opening_factor=wind.opening.tolist(), force_lb=wind.force_a.tolist(),
            resultant_height_ft=np.where(w.rigid, wind.lever, wind.lever_strip).tolist(),
            solidity=w.solidity.tolist(),
            minimum_pressure_governs=wind.minimum_governs.tolist(),
            end_zone_force_coefficient=wind.cf_end.tolist(),
            interior_force_coefficient=wind.cf_interior.tolist())

    def flags(self) -> list[list[Flag]]:
        """Every wall's flags in the site's order: those of the wall on its own, then those of
        its bracing (findings.WALL_RULES, BRACED_RULES)."""
        flags: list[list[Flag]] = [[] for _ in self.place]
        walls = np.arange(len(self.place))
        for rule in WALL_RULES:
            rule.raise_on(self, walls, flags)
        if self.e.braces is not None:
            for rule in BRACED_RULES:
                rule.raise_on(self, self.e.braces.index, flags)
        return flags

    def _braced_walls(self, e: Evaluation, combos: dict, bracings: list):
        """The checks, §8 records and hardware of the braced walls (`bracings`: their
        panels' bracing), by row."""
        self.bracings = bracings
        self.brace_type, foot_anchor, wall_anchor = (
            list(e.columns[k]) for k in ("brace_type", "foot_anchor", "wall_anchor"))
        # brace and foot anchor types, and a sill fastening given or not: each way's checks'
        # sources and combinations
        sill = (~np.isnan(e.braces.sill)).tolist()
        ways: dict[tuple, int] = {}
        self.way = np.array([ways.setdefault(key, len(ways)) for key in zip(
            self.brace_type, foot_anchor, sill, strict=True)], dtype=np.int64)
        self.hardware_of_way = [self._hardware(key[:2]) for key in ways]
        self.braced = check_set(e.braced_checks, {**CHECKS, **REVERSE_INFO}, combos,
                                [("braced", sources, self._combinations(key))
                                 for (sources, *_), key in zip(self.hardware_of_way, ways,
                                                               strict=True)],
                                self.way)
        self.sill_uplift = self._sill_uplift(e)
        self.records = braced_records(
            e.braces, e.brace_forces, self.brace_type, wall_anchor, foot_anchor,
            self.braced.brace_utilization, _or_none(e.braced_limit_missing), self.sill_uplift)

    def _sill_uplift(self, e: Evaluation) -> tuple[np.ndarray, np.ndarray]:
        """The sill uplift of each braced framed wall at the design wind, lb per brace and per
        ft of sill (NaN: not framed), from its sill uplift check: the lift less the factored
        weight (the check's capacity less the sill fastening)."""
        bs = e.braces
        lift, held = e.braced_checks["sill uplift"]
        width = e.walls.width[bs.index]
        weight = held - np.nan_to_num(bs.sill) * width
        return sill_uplift(lift, weight, bs.mask.sum(axis=1), width)

    def _alone_combinations(self, kind: str) -> dict[str, str]:
        """`_combinations` of a wall standing on its own of `kind` (as in UNBRACED_SOURCES)."""
        f = COMBINATIONS[self.site.site.design_basis]
        if f.allowable is None:
            return {}
        allowable = ALLOWABLE_ALONE | (ALLOWABLE_MASONRY if kind == "masonry" else set())
        return {name: on_allowable(f, kind_of) for name, (_, kind_of, _) in CHECK_INFO.items()
                if name in allowable}

    def _combinations(self, key: tuple) -> dict[str, str]:
        """The combination of each braced check of allowable capacity that differs from the
        basis's: under LRFD, the ASD combinations (method notes §1)."""
        f = COMBINATIONS[self.site.site.design_basis]
        if f.allowable is None:
            return {}
        brace_type, foot_anchor, sill = key
        fa = self.site.anchor_types[foot_anchor] if foot_anchor else None
        strength = strength_checks(self.site.brace_types[brace_type],
                                          fa.kind if fa else None, sill)
        return {name: on_allowable(f, kind) for name, (_, kind, _) in CHECKS.items()
                if name not in strength}

    def panels(self) -> list[PanelResult]:
        """The result object of every wall, in the site's order (asked once: the objects take
        the lists and records made for this evaluation)."""
        alone, found = self.unbraced, self.braced
        status = self._in_site_order(
            ["stands" if ok else "needs_braces" for ok in self.stands[self.alone].tolist()],
            ["braced" if ok else "unsafe" for ok in found.strength_ok])
        made = each_of(PanelResult, len(self.place), status=status,
                       checks=self._in_site_order(alone.checks, found.checks),
                       flags=self.flags(),
                       governing_element=self._in_site_order(alone.governing, found.governing),
                       braces=self._in_site_order([None] * len(self.alone), self.records),
                       hardware=None, zone=None, footing_ft=None, released_by=None,  # evaluate's
                       **self.columns)
        for p in made:  # a braced wall whose brace capacity is not known says so
            if p.braces is not None and p.braces["utilization"] is None:
                p.unknown = {**p.unknown,
                             "braces.utilization": p.braces["utilization_unknown_because"]}
        return made

    def _in_site_order(self, of_alone: list, of_braced: list) -> list:
        """Every wall's value in the site's order, from those of the walls on their own and of
        the braced walls, each by row."""
        return list(map((of_alone + of_braced).__getitem__, self.place))

    def _capped(self, w: Walls, height: np.ndarray) -> np.ndarray:
        """The tallest each wall may stand unbraced: masonry no taller than OSHA 1926.706(b)
        allows."""
        limit = self.rule["masonry_unbraced_height_ft"]
        return height if limit is None else np.where(w.masonry, np.minimum(height, limit), height)

    def _over_height(self, w: Walls) -> np.ndarray:
        """The masonry walls taller than OSHA 1926.706(b) lets stand unbraced."""
        limit = self.rule["masonry_unbraced_height_ft"]
        return w.masonry & (w.height > limit) if limit is not None else np.zeros_like(w.masonry)

    def _hardware(self, key: tuple[str, str | None]) -> tuple[dict, list[Flag], list[Flag]]:
        """The check sources, brace flags and anchor flags that follow from a brace and foot
        anchor type (`key`) alone, the same for every wall that uses them: worked out once."""
        if key not in self.hardware:
            site, (brace_type, foot_anchor) = self.site, key
            bt = site.brace_types[brace_type]
            fa = site.anchor_types[foot_anchor] if foot_anchor else None
            brace_flags, anchor_flags = [], []
            if bt.compression_only:
                brace_flags.append(Flag(
                    "compression-only", "notice", f"brace {brace_type} works in compression "
                    "only: with the wind away from it the wall stands on its own (checked as "
                    "such)", "method notes §4"))
            if bt.kind == "pipe":
                pipe = PIPES[bt.section]
                if not members.pipe_wall_nonslender(pipe.od_in, pipe.t_design_in,
                                                    bt.yield_strength / 1000.0):
                    brace_flags.append(Flag(
                        "slender-pipe-wall", "danger", f"{bt.section} at Fy "
                        f"{bt.yield_strength / 1000.0:g} ksi has a slender wall: its local "
                        "buckling is not checked here", "AISC 360-16 Table B4.1a"))
            if fa is not None:  # what its kind says of the type itself (anchor_kinds.KINDS)
                anchor_flags += [Flag(*made) for made in ANCHOR_KINDS[fa.kind].notes(
                    fa, foot_anchor)]
            self.hardware[key] = (sources(bt.kind, fa.kind if fa else None),
                                  brace_flags, anchor_flags)
        return self.hardware[key]



def _or_none(x: np.ndarray) -> list[float | None]:
    """The values as a list, None where there is none (NaN)."""
    return np.where(np.isnan(x), None, x).tolist()


def _unbounded(x: np.ndarray) -> np.ndarray:
    """A height search's result with inf where it found no limit in its range (NaN): the wall
    stands at any height searched, which is unbounded, not unknown."""
    return np.where(np.isnan(x), np.inf, x)


def _where(applies: np.ndarray, x: np.ndarray) -> list[float | None]:
    """The values as a list: None where the value does not apply, NaN (unknown) kept."""
    return np.where(applies, x, None).tolist()


# Why a speed is NaN (unknown): the searches find no limit below the top of their range, which
# the engine reads as a capacity it does not know (findings: `capacity-unknown`).
UNKNOWN_SPEED = (f"no limit found below {SPEED_BRACKET_MPH[1]:g} mph: a brace or anchor "
                 "capacity is unknown (method notes §5)")


def _unknown_speeds(speeds: dict[str, np.ndarray]) -> list[dict[str, str]]:
    """Each wall's unknown speeds (NaN) by field name, with why (`PanelResult.unknown`)."""
    names = list(speeds)
    nan = np.isnan(np.array(list(speeds.values()), dtype=float))
    out: list[dict[str, str]] = [{} for _ in range(nan.shape[1])]
    for k, wall in zip(*np.nonzero(nan), strict=True):
        out[wall][names[k]] = UNKNOWN_SPEED
    return out


def _fresh_sustained(stand_down: np.ndarray) -> list[dict]:
    """The sustained equivalents of each wall's stand-down gust with fresh mortar, where it has
    one (none: an empty dict)."""
    means: list[dict] = [{} for _ in range(len(stand_down))]
    known = np.flatnonzero(~np.isnan(stand_down))
    found = gusts.sustained_equivalents_of_each(stand_down[known])
    for k, of_wall in zip(known.tolist(), found, strict=True):
        means[k] = of_wall
    return means
