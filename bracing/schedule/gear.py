"""The gear in use: each wall's brace and anchor types and brace count, counted day by day
against the numbers on hand (`short`; method notes §6)."""

from __future__ import annotations

from operator import itemgetter

import numpy as np

from bracing.model import Bracing, Site
from bracing.results import Flag, Hardware, PanelResult

GEAR = ("brace_type", "wall_anchor", "foot_anchor", "count")
SHORT_SOURCE = "site inventory ([brace_types] / [anchor_types] on_hand)"


def hardware(bracing: Bracing | None, panel: PanelResult) -> Hardware | None:
    """A wall's brace and anchor types and brace count, from its result's `braces` record where
    it names them (a designed layout), else from the site file's `bracing` (None: not named)."""
    b, d = bracing, panel.braces or {}
    if b is None and not d:
        return None
    return Hardware(brace_type=d.get("brace_type", b.brace_type if b else None),
                    wall_anchor=d.get("wall_anchor", b.wall_anchor if b else None),
                    foot_anchor=d.get("foot_anchor", b.foot_anchor if b else None),
                    count=int(d.get("count", b.count if b else 0)))


def hardware_of(site: Site, panels: list[PanelResult]) -> list[Hardware | None]:
    """`hardware` of every wall (`panels` in site order); walls with the same gear share one
    record (a site has few kinds)."""
    recorded, keys = itemgetter(*GEAR), frozenset(GEAR)
    shared: dict[tuple, Hardware] = {}
    out = []
    for p, model in zip(panels, site.panels, strict=True):
        d = p.braces
        if d is None or not d.keys() >= keys:
            out.append(hardware(model.bracing, p))
            continue
        gear = recorded(d)
        if gear not in shared:
            shared[gear] = hardware(model.bracing, p)
        out.append(shared[gear])
    return out


def distinct_gear(site: Site, index: np.ndarray, results: list[PanelResult]
                  ) -> tuple[list[tuple], np.ndarray]:
    """The distinct gear of the walls, each a brace type, wall anchor and foot anchor (None: not
    named) and brace count as `hardware` reads them, and which of them each wall has (`index`:
    the walls' rows in site.panels, `results` in their order). A site has few of them."""
    recorded, keys = itemgetter(*GEAR), frozenset(GEAR)
    distinct: dict[tuple, int] = {}
    which = []
    for r, i in zip(results, index.tolist(), strict=True):
        d = r.braces
        if d is not None and d.keys() >= keys:  # a braced wall's result names them all
            gear = recorded(d)
        else:
            h = hardware(site.panels[i].bracing, r)
            gear = (None, None, None, 0) if h is None else (h.brace_type, h.wall_anchor,
                                                            h.foot_anchor, h.count)
        which.append(distinct.setdefault(gear, len(distinct)))
    return list(distinct), np.array(which, int)


def in_use(types: list[list], which: np.ndarray, lift: np.ndarray, release: np.ndarray,
           count: np.ndarray, last: int) -> tuple[list[str], np.ndarray]:
    """Type names and a (days, types) table of how many of each are in use each day: each
    column of `types` names one piece per brace of each distinct gear, `which` is each wall's,
    in use from its lift to its release day."""
    column = dict.fromkeys(set().union(*types), -1)  # -1: not named
    names = sorted(t for t in column if t)
    column.update((t, j) for j, t in enumerate(names))
    change = np.zeros((last + 3, len(names)), int)  # on at the lift, off the day after release
    for col in types:
        j = np.array([column[t] for t in col], int)[which]
        named = j >= 0
        np.add.at(change, (lift[named], j[named]), count[named])
        np.add.at(change, (release[named] + 1, j[named]), -count[named])
    return names, np.cumsum(change, axis=0)[1:last + 1]


def short(use: dict[str, int], types: dict) -> dict[str, int]:
    """How many of each type are missing: in use above the on-hand count, where it is given."""
    return {t: c - types[t].on_hand for t, c in use.items()
            if t in types and types[t].on_hand is not None and c > types[t].on_hand}


def short_flags(missing: dict) -> list[Flag]:
    """A danger for each type the day is short of."""
    return [Flag("short", "danger", f"short of {kind[:-1]} type {t}: {n} more needed than on "
                 "hand", SHORT_SOURCE)
            for kind, items in missing.items() for t, n in items.items()]


def inside_in_use(walls, day: int) -> tuple[dict[str, int], dict[str, int]]:
    """The inside braces of foundation walls (`FoundationWallResult`s) in use on `day`, braces
    and foot anchors by type: each wall's count from the first day its backfill needs them
    through its release (method notes §12)."""
    use: tuple[dict[str, int], dict[str, int]] = ({}, {})
    for w in walls:
        b = w.inside_brace
        if b is None or b.in_use_from_day is None or day < b.in_use_from_day or (
                b.in_use_to_day is not None and day > b.in_use_to_day):
            continue
        for counted, name in zip(use, (b.brace_type, b.foot_anchor), strict=True):
            if name:
                counted[name] = counted.get(name, 0) + b.count
    return use


def with_inside_braces(days, walls, site: Site, peak: dict) -> list:
    """The days with the foundation walls' inside braces added to the gear in use, counted
    against on_hand (`short`, its danger flags in place of the day's) as the panels' are, and
    `peak` (the job's largest count of each type) raised to match. Returns the days changed."""
    changed = []
    for d in days:
        braces, anchors = inside_in_use(walls, d.day)
        if not braces and not anchors:
            continue
        for kind, used, extra in (("braces", d.braces_in_use, braces),
                                  ("anchors", d.anchors_in_use, anchors)):
            for t, n in extra.items():
                used[t] = used.get(t, 0) + n
                peak[kind][t] = max(peak[kind].get(t, 0), used[t])
        d.short = {"braces": short(d.braces_in_use, site.brace_types),
                   "anchors": short(d.anchors_in_use, site.anchor_types)}
        d.flags = [f for f in d.flags if f.code != "short"] + short_flags(d.short)
        changed.append(d)
    return changed
