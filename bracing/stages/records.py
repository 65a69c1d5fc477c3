"""Result objects: the per-wall results (bracing.results) from one evaluation's arrays."""

from __future__ import annotations

from dataclasses import fields
from itertools import repeat

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
    SERVICEABILITY,
    braced_records,
    sill_uplift,
    sources,
    strength_checks,
)
from bracing.stages.checkset import UNBRACED_SOURCES, CheckSet, check_set, flag_code, on_allowable
from bracing.stages.evaluation import Evaluation
from bracing.stages.findings import (
    ANGLE_OUTSIDE,
    FAILS_UNBRACED,
    FIXED_FLAGS,
    FRESH_MORTAR,
    LOW_INSERT,
    MOSTLY_OPEN,
    OPEN_FRAMING,
    OPENING_BY_AREA,
    OUTSIDE_RATED,
    OVER_HEIGHT,
    RAISED_BASE,
    SLENDER,
    STRUCK_BELOW_STAND_DOWN,
    TOO_FEW,
    TWO_BRACES,
    UNEQUAL_SHARING,
    _add,
    _note,
    _whole_mph,
    brace_notes,
)
from bracing.stages.loads import COMBINATIONS
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
        w, wind, n = e.walls, e.wind, len(site.panels)
        mark, material, self.height, width, thickness, opening_area, bracing = (
            list(e.columns[k]) for k in ("mark", "material", "height", "width", "thickness",
                                         "opening_area", "bracing"))
        self.kind = np.select([w.rigid, w.masonry & ~w.fresh, w.masonry],
                              ["rigid", "masonry", "fresh"], "strip")
        # each wall's row in the checks of the walls on their own, or of the braced walls; a
        # braced wall's speeds are those of its bracing
        self.is_braced, self.row = np.zeros(n, dtype=bool), np.zeros(n, dtype=np.int64)
        limit, stand_down = e.limit, e.stand_down
        if e.braces is not None:
            bs = e.braces
            self.is_braced[bs.index] = True
            self.row[bs.index] = np.arange(len(bs.index))
            limit, stand_down = limit.copy(), stand_down.copy()
            limit[bs.index], stand_down[bs.index] = e.braced_limit, e.braced_stand_down
            self._braced_walls(e, combos, [bracing[i] for i in bs.index.tolist()])
        else:
            self.braced, self.records = CheckSet([], [], [], {}, []), []
        self.alone = np.flatnonzero(~self.is_braced)
        self.row[self.alone] = np.arange(len(self.alone))
        # each wall's place in a list of the walls on their own followed by the braced walls
        self.place = np.where(self.is_braced, len(self.alone) + self.row, self.row).tolist()
        kinds, way = np.unique(self.kind[self.alone], return_inverse=True)
        self.unbraced = check_set(
            {name: (d[self.alone], c[self.alone]) for name, (d, c) in e.checks.items()},
            CHECK_INFO, combos, [(k, UNBRACED_SOURCES[k], self._alone_combinations(k))
                                 for k in kinds.tolist()], way)
        over_height = self._over_height(w)
        self.stands = (e.utilization <= 1.0) & ~over_height
        self.wall_notes = self._wall_notes(w, e.utilization, over_height, material, opening_area)
        # the fields of every wall's PanelResult that come straight from its panel or the arrays
        self.columns = {
            "mark": mark, "material": list(map(
                {name: m.kind for name, m in site.materials.items()}.__getitem__, material)),
            "height_ft": self.height, "width_ft": width, "thickness_in": thickness,
            "weight_lb": (w.face_weight * w.height * w.width * w.solidity).tolist(),
            "wind": _each(
                WindResult, n, basic_speed_mph=site.site.basic_wind_speed,
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
                interior_force_coefficient=wind.cf_interior.tolist()),
            "unbraced": _each(
                UnbracedResult, n, utilization=e.utilization.tolist(),
                stands=self.stands.tolist(),
                working_limit_speed_mph=e.limit.tolist(),
                stand_down_speed_mph=e.stand_down.tolist(),
                max_height_ft=_or_none(self._capped(w, e.max_height)),
                max_height_at_limit_ft=_or_none(self._capped(w, e.max_at_limit)),
                max_height_structural_ft=_or_none(e.max_height)),
            "working_limit_speed_mph": limit.tolist(),
            "stand_down_speed_mph": stand_down.tolist(),
            "sustained_equivalents_mph": gusts.sustained_equivalents_of_each(stand_down),
            "fresh_working_limit_speed_mph": _or_none(e.fresh_limit),
            "fresh_stand_down_speed_mph": _or_none(e.fresh_stand_down),
            "fresh_sustained_equivalents_mph": _fresh_sustained(e.fresh_stand_down)}

    def _braced_walls(self, e: Evaluation, combos: dict, bracings: list):
        """The checks, §8 records, notes and hardware of the braced walls (`bracings`: their
        panels' bracing), by row."""
        site = self.site
        self.bracings = bracings
        self.brace_type, foot_anchor, wall_anchor = (
            list(e.columns[k]) for k in ("brace_type", "foot_anchor", "wall_anchor"))
        # brace and foot anchor types, and a sill fastening given or not: each way's checks'
        # sources and combinations
        sill = (~np.isnan(e.braces.sill)).tolist()
        ways: dict[tuple, int] = {}
        self.way = np.array([ways.setdefault(key, len(ways))
                             for key in zip(self.brace_type, foot_anchor, sill)], dtype=np.int64)
        self.hardware_of_way = [self._hardware(key[:2]) for key in ways]
        self.braced = check_set(e.braced_checks, {**CHECKS, **REVERSE_INFO}, combos,
                                 [("braced", sources, self._combinations(key))
                                  for (sources, *_), key in zip(self.hardware_of_way, ways)],
                                 self.way)
        self.notes = brace_notes(site, e, [site.brace_types[t] for t, *_ in ways], self.way)
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
        basis's: under LRFD, the ASD combinations (design.md §3, method notes §1)."""
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
        return _each(PanelResult, len(self.place), status=status,
                     checks=self._in_site_order(alone.checks, found.checks),
                     flags=self._flags(),
                     governing_element=self._in_site_order(alone.governing, found.governing),
                     braces=self._in_site_order([None] * len(self.alone), self.records),
                     **self.columns)

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

    def _wall_notes(self, w: Walls, utilization: np.ndarray, over_height: np.ndarray,
                    material: list[str], opening_area: list) -> np.ndarray:
        """Per wall, what its own flags need, as bits; a braced wall's leave out how it would
        stand alone (its bracing answers for that)."""
        notes = np.zeros(len(material), dtype=np.int64)
        _note(notes, FAILS_UNBRACED, (utilization > 1.0) & ~self.is_braced)
        _note(notes, OVER_HEIGHT, over_height & ~self.is_braced)
        _note(notes, MOSTLY_OPEN, 1.0 - w.solidity > 0.3)
        _note(notes, OPENING_BY_AREA, np.array([bool(a) for a in opening_area], dtype=bool))
        _note(notes, RAISED_BASE, w.base > 0)
        _note(notes, FRESH_MORTAR, self.kind == "fresh")
        unsheathed = {name: m.kind == "framed" and not m.sheathed
                      for name, m in self.site.materials.items()}
        _note(notes, OPEN_FRAMING, np.array([unsheathed[m] for m in material], dtype=bool))
        return notes

    def _flags(self) -> list[list[Flag]]:
        """Every wall's flags in the site's order: those of the wall on its own, then those of
        its bracing."""
        flags: list[list[Flag]] = [[] for _ in self.place]
        self._wall_flags(flags)
        if self.e.braces is not None:
            self._braced_flags(flags)
        return flags

    def _wall_flags(self, flags: list[list[Flag]]):
        """Adds the flags of each wall standing on its own (`wall_notes` says which)."""
        e, rule, notes = self.e, self.rule, self.wall_notes
        at = np.flatnonzero(notes & FAILS_UNBRACED)
        _add(flags, at, [Flag("fails-unbraced", "danger",
                              f"cannot stand on its own at the design wind (utilization "
                              f"{utilization:.2f}): brace it before release from the crane",
                              "ASCE 7-16 §29.3, statics")
                         for utilization in e.utilization[at].tolist()])
        at = np.flatnonzero(notes & OVER_HEIGHT)
        _add(flags, at, [Flag("masonry-over-8ft", "danger",
                              f"masonry wall {self.height[k]:.1f} ft tall: over "
                              f"{rule['masonry_unbraced_height_ft']:g} ft it must be braced "
                              f"until permanent supports are in place",
                              self.source["masonry_unbraced_height_ft"]) for k in at.tolist()])
        at = np.flatnonzero(notes & MOSTLY_OPEN)
        _add(flags, at, [Flag("mostly-open", "warning",
                              f"{1.0 - solidity:.0%} open: checked as an open wall (open-sign "
                              f"coefficients on the solid area)", "ASCE 7-16 Figure 29.3-1 note 3")
                         for solidity in e.walls.solidity[at].tolist()])
        _add(flags, np.flatnonzero(notes & OPENING_BY_AREA),
             FIXED_FLAGS["opening-position-unknown"])
        at = np.flatnonzero(notes & RAISED_BASE)
        _add(flags, at, [Flag("raised-base", "notice",
                              f"base {self.site.panels[k].base_elevation:g} ft above grade: "
                              f"s/h < 1 coefficients", "ASCE 7-16 Figure 29.3-1")
                         for k in at.tolist()])
        _add(flags, np.flatnonzero(notes & FRESH_MORTAR), FIXED_FLAGS["fresh-mortar"])
        _add(flags, np.flatnonzero(notes & OPEN_FRAMING), FIXED_FLAGS["open-framing"])

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

    def _braced_flags(self, flags: list[list[Flag]]):
        """Adds the flags of each braced wall: its failing checks, rules of practice, robustness
        (§6), with those of its brace and anchor types (`notes` says which)."""
        e, rule, source, notes = self.e, self.rule, self.source, self.notes
        bs = e.braces
        wall = bs.index  # each row's wall
        walls = wall.tolist()
        failing = self.braced.failing
        for r, c in failing:
            serviceability = c.element in SERVICEABILITY
            flags[walls[r]].append(Flag(
                f"{flag_code(c.element)}-over", "warning" if serviceability else "danger",
                f"{c.element}: utilization {c.utilization:.2f}"
                + (" (the wall would crack)" if serviceability else ""), c.source))
        lifted = sorted({r for r, c in failing if c.element == "base uplift"})
        _add(flags, wall[lifted], FIXED_FLAGS["braces-lift-wall"])
        per_brace, per_ft = self.sill_uplift
        rows = np.flatnonzero(per_ft > 0.0)
        _add(flags, wall[rows], [Flag(
            "sill-uplift", "danger" if not given > 0.0 or given < plf else "notice",
            f"the braces lift the sill: {plf:.0f} lb per ft ({lb:.0f} lb per brace) beyond its "
            f"weight, which the sill fastening must hold"
            + (f" ({given:.0f} lb per ft given)" if given > 0.0 else
               ": no sill_fastening is given") + "; the base kick-out then has no friction to "
            "rely on: the sill fastening holds it too", "statics, method notes §4")
            for lb, plf, given in zip(per_brace[rows].tolist(), per_ft[rows].tolist(),
                                      np.nan_to_num(bs.sill[rows]).tolist())])
        rows = np.flatnonzero(notes & TOO_FEW)
        _add(flags, wall[rows], [Flag("too-few-braces", "danger", f"{self.bracings[r].count} "
                                      f"brace(s); at least {rule['minimum_braces_per_panel']:g} "
                                      "per wall", source["minimum_braces_per_panel"])
                                 for r in rows.tolist()])
        rows = np.flatnonzero(notes & ANGLE_OUTSIDE)
        _add(flags, wall[rows], [Flag("brace-angle", "warning", f"brace angle {angle:.0f} deg is "
                                      f"outside {rule['brace_angle_min_deg']:g} to "
                                      f"{rule['brace_angle_max_deg']:g} deg",
                                      source["brace_angle_min_deg"])
                                 for angle in bs.angle[rows].tolist()])
        rows = np.flatnonzero(notes & LOW_INSERT)
        _add(flags, wall[rows], [Flag("low-insert", "notice", f"insert at "
                                      f"{self.bracings[r].insert_height / self.height[k]:.0%}"
                                      f" of the height, below {rule['insert_min_height_ratio']:.0%}",
                                      source["insert_min_height_ratio"])
                                 for r, k in zip(rows.tolist(), wall[rows].tolist())])
        _add(flags, wall[np.flatnonzero(notes & UNEQUAL_SHARING)], FIXED_FLAGS["unequal-sharing"])
        _add(flags, wall[np.flatnonzero(notes & TWO_BRACES)], FIXED_FLAGS["no-margin"])
        rows = np.flatnonzero((notes & (TWO_BRACES | STRUCK_BELOW_STAND_DOWN))
                              == STRUCK_BELOW_STAND_DOWN)  # two braces: the flag above instead
        speeds = list(zip(_whole_mph(e.braced_limit_missing[rows]),
                          _whole_mph(e.braced_stand_down[rows])))
        # one flag for the walls whose speeds read the same
        said = {(missing, stand_down): Flag(
            "no-margin", "warning", f"with one brace struck, the wall's limit falls to {missing} "
            f"mph, below the stand-down gust {stand_down} mph",
            "design.md §6 robustness (team rule)") for missing, stand_down in set(speeds)}
        _add(flags, wall[rows], list(map(said.__getitem__, speeds)))
        rows = np.flatnonzero(notes & SLENDER)
        _add(flags, wall[rows], [Flag("slender-brace", "danger", f"brace slenderness "
                                      f"{slenderness:.0f} exceeds {limit:.0f}: add lateral struts "
                                      "or a knee brace", "AISC 360-16 §E2 user note / NDS 2018 "
                                      "§3.7.1.4")
                                 for slenderness, limit in zip(
                                     bs.slenderness[rows].tolist(),
                                     bs.slenderness_limit[rows].tolist())])
        self._shared_by_way(flags, [brace for _, brace, _ in self.hardware_of_way])
        rows = np.flatnonzero(notes & OUTSIDE_RATED)
        types = [self.site.brace_types[self.brace_type[r]] for r in rows.tolist()]
        _add(flags, wall[rows], [Flag("outside-rated-range", "danger", f"brace length "
                                      f"{length:.1f} ft is outside the rated table "
                                      f"({bt.lengths[0]:g} to {bt.lengths[-1]:g} ft): no rating",
                                      "maker's rated table")
                                 for length, bt in zip(bs.length[rows].tolist(), types)])
        self._shared_by_way(flags, [anchor for _, _, anchor in self.hardware_of_way])
        _add(flags, wall[np.isnan(e.braced_limit)], FIXED_FLAGS["capacity-unknown"])

    def _shared_by_way(self, flags: list[list[Flag]], of_way: list[list[Flag]]):
        """Adds to each braced wall the flags that `of_way` gives its brace and foot anchor
        types (by `way`)."""
        for way, shared in enumerate(of_way):
            walls = self.e.braces.index[self.way == way]
            for flag in shared:
                _add(flags, walls, flag)


def _each(cls, n: int, **fields_of) -> list:
    """`n` objects of the dataclass `cls` from each field's values by name: a list holds one
    per object, anything else is every object's."""
    names = [f.name for f in fields(cls)]
    if set(fields_of) != set(names):
        raise TypeError(f"{cls.__name__} fields not given: {set(names) ^ set(fields_of)}")
    return list(map(cls, *(v if isinstance(v, list) else repeat(v, n)
                           for v in map(fields_of.get, names))))


def _or_none(x: np.ndarray) -> list[float | None]:
    """The values as a list, None where not known (NaN)."""
    return np.where(np.isnan(x), None, x).tolist()


def _fresh_sustained(stand_down: np.ndarray) -> list[dict]:
    """The sustained equivalents of each wall's stand-down gust with fresh mortar, where it has
    one (none: an empty dict)."""
    means: list[dict] = [{} for _ in range(len(stand_down))]
    known = np.flatnonzero(~np.isnan(stand_down))
    for k, of_wall in zip(known.tolist(), gusts.sustained_equivalents_of_each(stand_down[known])):
        means[k] = of_wall
    return means
