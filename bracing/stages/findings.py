"""Findings: the flags of the walls and of their bracing (design.md §6, §8)."""

from __future__ import annotations

from itertools import repeat

import numpy as np

from bracing.model import Site
from bracing.results import Flag
from bracing.stages.evaluation import Evaluation

FIXED_FLAGS = {f.code: f for f in (
    Flag("opening-position-unknown", "notice",
         "openings given by area only: resultant kept at 0.55 h", "ASCE 7-16 Figure 29.3-1"),
    Flag("fresh-mortar", "notice",
         "mortar not yet cured: stability by weight only, no flexural tension",
         "TMS 402-16 §8.2 (from memory)"),
    Flag("open-framing", "notice", "unsheathed framing checked as an open wall",
         "ASCE 7-16 §29.3"),
    Flag("braces-lift-wall", "danger", "the braces in compression lift the wall off its base",
         "statics, design.md §6"),
    Flag("unequal-sharing", "notice",
         "3 or more braces share unevenly through slop unless pre-tensioned", "common practice"),
    Flag("no-margin", "warning", "if one of its two braces is struck, nothing but friction at "
         "the base holds the wall against twist (none is credited): keep equipment clear of the "
         "braces", "design.md §6 robustness"),
    Flag("capacity-unknown", "warning", "a brace or anchor capacity is unknown (outside its "
         "rated range?): no working-limit speed", "design.md §3"),
)}

# What a wall's own flags need, worked out for every wall at once (`_Results._wall_notes`).
FAILS_UNBRACED, OVER_HEIGHT, MOSTLY_OPEN, OPENING_BY_AREA, RAISED_BASE, FRESH_MORTAR, \
    OPEN_FRAMING = (1 << k for k in range(7))


# What a braced wall's flags need, worked out for every braced wall at once (`brace_notes`).
TOO_FEW, ANGLE_OUTSIDE, LOW_INSERT, UNEQUAL_SHARING, TWO_BRACES, STRUCK_BELOW_STAND_DOWN, \
    SLENDER, OUTSIDE_RATED = (1 << k for k in range(8))


def brace_notes(site: Site, e: Evaluation, types: list, way: np.ndarray) -> np.ndarray:
    """Per braced wall, the rules of practice and robustness notes it meets, as bits
    (`types[way]`: each wall's brace type)."""
    w, bs = e.walls, e.braces
    count = bs.mask.sum(axis=1)
    notes = np.zeros(len(bs.index), dtype=np.int64)
    least = site.rule_value("minimum_braces_per_panel")
    if least:
        _note(notes, TOO_FEW, count < least)
    lo, hi = site.rule_value("brace_angle_min_deg"), site.rule_value("brace_angle_max_deg")
    if lo and hi:
        _note(notes, ANGLE_OUTSIDE, ~((lo - 1e-9 <= bs.angle) & (bs.angle <= hi + 1e-9)))
    ratio = site.rule_value("insert_min_height_ratio")
    if ratio:
        _note(notes, LOW_INSERT, bs.insert < ratio * w.height[bs.index] - 1e-9)
    _note(notes, UNEQUAL_SHARING, (count >= 3) & ~bs.pretensioned)
    _note(notes, TWO_BRACES, count == 2)
    missing = e.braced_limit_missing
    with np.errstate(invalid="ignore"):
        _note(notes, STRUCK_BELOW_STAND_DOWN, (count > 2) & ~np.isnan(missing)
              & (missing < e.braced_stand_down))
        _note(notes, SLENDER, bs.slenderness > bs.slenderness_limit)
    rated = np.array([t.kind == "rated" for t in types], dtype=bool)[way]
    shortest = np.array([t.lengths[0] if t.kind == "rated" else np.nan for t in types])[way]
    longest = np.array([t.lengths[-1] if t.kind == "rated" else np.nan for t in types])[way]
    _note(notes, OUTSIDE_RATED, rated & ~((shortest <= bs.length) & (bs.length <= longest)))
    return notes


def _note(notes: np.ndarray, bit: int, where: np.ndarray):
    """Sets `bit` in the notes of the walls `where` holds."""
    np.bitwise_or(notes, np.where(where, bit, 0), out=notes)


def _add(flags: list[list[Flag]], walls: np.ndarray, made: list[Flag] | Flag):
    """Adds to the flags of each of `walls` its own of `made` (a list, one per wall), or the one
    flag `made` that they share."""
    for k, flag in zip(walls.tolist(), made if isinstance(made, list) else repeat(made)):
        flags[k].append(flag)


def _whole_mph(speeds: np.ndarray) -> list[int]:
    """Speeds (finite, not negative) rounded to whole mph as f"{x:.0f}" rounds them (half to
    even), many at once."""
    return np.rint(speeds).astype(np.int64).tolist()
