"""Findings: the flags of the walls and of their bracing (method notes §4, §8).

Each flag is a rule object that holds its code, severity, condition, message and source
together (`FlagRule`); a condition is worked out for every wall (or braced wall) at once, and the
flags are made in one pass over the walls that have them. `WALL_RULES` are a wall's own,
`BRACED_RULES` its bracing's, in the order they are shown. A rule reads the evaluation through
`ctx`, the `records.Results` being built (its arrays, the site's rules and their sources).
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass
from itertools import repeat

import numpy as np

from bracing.results import Flag
from bracing.stages.braced import SERVICEABILITY
from bracing.stages.checkset import flag_code


@dataclass(frozen=True)
class FlagRule:
    """One kind of flag: where it stands (`when`: ctx -> a bool per row), its severity, its
    message (fixed words shared by every wall, or `says`: ctx, rows -> words per row) and its
    source (fixed, or a site rule's own: `rule`)."""

    code: str
    severity: str
    when: Callable[..., np.ndarray]
    says: str | Callable[..., list[str]]
    source: str = ""
    rule: str = ""              # a site rule whose source is the flag's

    def raise_on(self, ctx, walls: np.ndarray, flags: list[list[Flag]]):
        """Adds this flag to each row where it stands (`walls`: each row's wall)."""
        rows = np.flatnonzero(self.when(ctx))
        if len(rows) == 0:
            return
        source = ctx.source[self.rule] if self.rule else self.source
        if isinstance(self.says, str):  # one object, shared by the walls (never changed)
            made = Flag(code=self.code, severity=self.severity, message=self.says, source=source)
        else:
            made = [Flag(code=self.code, severity=self.severity, message=words, source=source)
                    for words in self.says(ctx, rows)]
        add(flags, walls[rows], made)


@dataclass(frozen=True)
class Step:
    """Flags that another part of the result gives, made in their place in the order."""

    raise_on: Callable[..., None]


def add(flags: list[list[Flag]], walls: np.ndarray, made: list[Flag] | Flag):
    """Adds to the flags of each of `walls` its own of `made` (a list, one per wall), or the one
    flag `made` that they share."""
    made = made if isinstance(made, list) else repeat(made)
    for k, flag in zip(walls.tolist(), made, strict=False):  # repeat: endless
        flags[k].append(flag)


def _no_rows(ctx) -> np.ndarray:
    return np.zeros(len(ctx.e.braces.index), bool)


def _count(ctx) -> np.ndarray:
    return ctx.e.braces.mask.sum(axis=1)


WALL_RULES = (
    FlagRule("fails-unbraced", "danger",
             lambda c: (c.e.utilization > 1.0) & ~c.is_braced,
             lambda c, rows: [f"cannot stand on its own at the design wind (utilization {u:.2f})"
                              ": brace it before release from the crane"
                              for u in c.e.utilization[rows].tolist()],
             "ASCE 7-16 §29.3, statics"),
    FlagRule("masonry-over-8ft", "danger", lambda c: c.over_height & ~c.is_braced,
             lambda c, rows: [f"masonry wall {c.height[k]:.1f} ft tall: over "
                              f"{c.rule['masonry_unbraced_height_ft']:g} ft it must be braced "
                              "until permanent supports are in place" for k in rows.tolist()],
             rule="masonry_unbraced_height_ft"),
    FlagRule("mostly-open", "warning", lambda c: 1.0 - c.e.walls.solidity > 0.3,
             lambda c, rows: [f"{1.0 - solidity:.0%} open: checked as an open wall (open-sign "
                              "coefficients on the solid area)"
                              for solidity in c.e.walls.solidity[rows].tolist()],
             "ASCE 7-16 Figure 29.3-1 note 3"),
    FlagRule("opening-position-unknown", "notice",
             lambda c: np.array([bool(a) for a in c.opening_area], dtype=bool),
             "openings given by area only: resultant kept at 0.55 h", "ASCE 7-16 Figure 29.3-1"),
    FlagRule("raised-base", "notice", lambda c: c.e.walls.base > 0,
             lambda c, rows: [f"base {c.site.panels[k].base_elevation:g} ft above grade: s/h < 1 "
                              "coefficients" for k in rows.tolist()],
             "ASCE 7-16 Figure 29.3-1"),
    FlagRule("fresh-mortar", "notice", lambda c: c.kind == "fresh",
             "mortar not yet cured: stability by weight only, no flexural tension",
             "TMS 402-16 §8.2 (unconfirmed value: confirm in TMS 402-16)"),
    FlagRule("open-framing", "notice",
             lambda c: np.array(list(map({name: m.kind == "framed" and not m.sheathed for name, m
                                          in c.site.materials.items()}.__getitem__, c.material)),
                                dtype=bool),
             "unsheathed framing checked as an open wall", "ASCE 7-16 §29.3"),
)


def _over(ctx, walls: np.ndarray, flags: list[list[Flag]]):
    """A flag for each braced check over 1.0 (a serviceability one warns)."""
    for r, c in ctx.braced.failing:
        serviceability = c.element in SERVICEABILITY
        flags[walls[r]].append(Flag(
            code=f"{flag_code(c.element)}-over",
            severity="warning" if serviceability else "danger",
            message=f"{c.element}: utilization {c.utilization:.2f}"
            + (" (the wall would crack)" if serviceability else ""), source=c.source))


def _lifted(ctx) -> np.ndarray:
    out = _no_rows(ctx)
    out[[r for r, c in ctx.braced.failing if c.element == "base uplift"]] = True
    return out


def _sill_held(ctx) -> np.ndarray:
    """The sill fastening given holds the braces' lift (statics, method notes §4)."""
    _, per_ft = ctx.sill_uplift
    given = np.nan_to_num(ctx.e.braces.sill)
    return (given > 0.0) & (given >= per_ft)


def _sill_says(ctx, rows) -> list[str]:
    per_brace, per_ft = ctx.sill_uplift
    given = np.nan_to_num(ctx.e.braces.sill[rows]).tolist()
    return [f"the braces lift the sill: {plf:.0f} lb per ft ({lb:.0f} lb per brace) beyond its "
            "weight, which the sill fastening must hold"
            + (f" ({g:.0f} lb per ft given)" if g > 0.0 else ": no sill_fastening is given")
            + "; the base kick-out then has no friction to rely on: the sill fastening holds "
            "it too" for lb, plf, g in zip(per_brace[rows].tolist(), per_ft[rows].tolist(),
                                           given, strict=True)]


def _angle_outside(ctx) -> np.ndarray:
    lo, hi = ctx.rule["brace_angle_min_deg"], ctx.rule["brace_angle_max_deg"]
    angle = ctx.e.braces.angle
    if not (lo and hi):
        return _no_rows(ctx)
    return ~((lo - 1e-9 <= angle) & (angle <= hi + 1e-9))


def _low_insert(ctx) -> np.ndarray:
    ratio, bs = ctx.rule["insert_min_height_ratio"], ctx.e.braces
    if not ratio:
        return _no_rows(ctx)
    return bs.insert < ratio * ctx.e.walls.height[bs.index] - 1e-9


def _struck_below_stand_down(ctx) -> np.ndarray:
    """Three braces or more, and with one struck the limit falls below the stand-down gust
    (two braces: the no-margin flag of its own instead)."""
    missing = ctx.e.braced_limit_missing
    with np.errstate(invalid="ignore"):
        return (_count(ctx) > 2) & ~np.isnan(missing) & (missing < ctx.e.braced_stand_down)


def _struck_says(ctx, rows) -> list[str]:
    e = ctx.e
    return [f"with one brace struck, the wall's limit falls to {missing} mph, below the "
            f"stand-down gust {stand_down} mph" for missing, stand_down in zip(
                whole_mph(e.braced_limit_missing[rows]), whole_mph(e.braced_stand_down[rows]),
                strict=True)]


def _slender(ctx) -> np.ndarray:
    bs = ctx.e.braces
    with np.errstate(invalid="ignore"):
        return bs.slenderness > bs.slenderness_limit


def _outside_rated(ctx) -> np.ndarray:
    """A rated brace longer or shorter than its maker's table."""
    bs, types = ctx.e.braces, [ctx.site.brace_types[t] for t in ctx.brace_type]
    shortest = np.array([t.lengths[0] if t.kind == "rated" else np.nan for t in types])
    longest = np.array([t.lengths[-1] if t.kind == "rated" else np.nan for t in types])
    rated = np.array([t.kind == "rated" for t in types], dtype=bool)
    return rated & ~((shortest <= bs.length) & (bs.length <= longest))


def _outside_says(ctx, rows) -> list[str]:
    types = [ctx.site.brace_types[ctx.brace_type[r]] for r in rows.tolist()]
    return [f"brace length {length:.1f} ft is outside the rated table ({bt.lengths[0]:g} to "
            f"{bt.lengths[-1]:g} ft): no rating"
            for length, bt in zip(ctx.e.braces.length[rows].tolist(), types, strict=True)]


def _of_hardware(which: int) -> Step:
    """The flags a brace type (0) or a foot anchor type (1) gives every wall that uses it."""
    def raise_on(ctx, walls: np.ndarray, flags: list[list[Flag]]):
        for way, hardware in enumerate(ctx.hardware_of_way):
            on_way = walls[ctx.way == way]
            for flag in hardware[1 + which]:
                add(flags, on_way, flag)
    return Step(raise_on)


BRACED_RULES = (
    Step(_over),
    FlagRule("braces-lift-wall", "danger", _lifted,
             "the braces in compression lift the wall off its base", "statics, method notes §4"),
    FlagRule("sill-uplift", "danger", lambda c: (c.sill_uplift[1] > 0.0) & ~_sill_held(c),
             _sill_says, "statics, method notes §4"),
    FlagRule("sill-uplift", "notice", lambda c: (c.sill_uplift[1] > 0.0) & _sill_held(c),
             _sill_says, "statics, method notes §4"),
    FlagRule("too-few-braces", "danger",
             lambda c: (_count(c) < c.rule["minimum_braces_per_panel"]
                        if c.rule["minimum_braces_per_panel"] else _no_rows(c)),
             lambda c, rows: [f"{c.bracings[r].count} brace(s); at least "
                              f"{c.rule['minimum_braces_per_panel']:g} per wall"
                              for r in rows.tolist()],
             rule="minimum_braces_per_panel"),
    FlagRule("brace-angle", "warning", _angle_outside,
             lambda c, rows: [f"brace angle {angle:.0f} deg is outside "
                              f"{c.rule['brace_angle_min_deg']:g} to "
                              f"{c.rule['brace_angle_max_deg']:g} deg"
                              for angle in c.e.braces.angle[rows].tolist()],
             rule="brace_angle_min_deg"),
    FlagRule("low-insert", "notice", _low_insert,
             lambda c, rows: [f"insert at {c.bracings[r].insert_height / c.height[k]:.0%} of "
                              f"the height, below {c.rule['insert_min_height_ratio']:.0%}"
                              for r, k in zip(rows.tolist(), c.e.braces.index[rows].tolist(),
                                              strict=True)],
             rule="insert_min_height_ratio"),
    FlagRule("unequal-sharing", "notice",
             lambda c: (_count(c) >= 3) & ~c.e.braces.pretensioned,
             "3 or more braces share unevenly through slop unless pre-tensioned",
             "common practice"),
    FlagRule("no-margin", "notice", lambda c: _count(c) == 2,
             "if one of its two braces is struck, nothing but friction at the base holds the "
             "wall against twist (none is credited): keep equipment clear of the braces",
             "method notes §4, robustness"),
    FlagRule("no-margin", "notice", _struck_below_stand_down, _struck_says,
             "method notes §4, robustness"),
    FlagRule("slender-brace", "danger", _slender,
             lambda c, rows: [f"brace slenderness {slenderness:.0f} exceeds {limit:.0f}: add "
                              "lateral struts or a knee brace" for slenderness, limit in zip(
                                  c.e.braces.slenderness[rows].tolist(),
                                  c.e.braces.slenderness_limit[rows].tolist(), strict=True)],
             "AISC 360-16 §E2 user note / NDS 2018 §3.7.1.4"),
    _of_hardware(0),
    FlagRule("outside-rated-range", "danger", _outside_rated, _outside_says,
             "maker's rated table"),
    _of_hardware(1),
    FlagRule("capacity-unknown", "warning", lambda c: np.isnan(c.e.braced_limit),
             "a brace or anchor capacity is unknown (outside its rated range?): no working-limit "
             "speed", "method notes §5"),
)


def whole_mph(speeds: np.ndarray) -> list[int]:
    """Speeds (finite, not negative) rounded to whole mph as f"{x:.0f}" rounds them (half to
    even), many at once."""
    return np.rint(speeds).astype(np.int64).tolist()
