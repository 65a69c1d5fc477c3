"""What is wrong in the plan (method notes §6): walls past their line's end, slab anchors off
the slab or too near its edge, ground anchors off open ground, and (from `crossings`) braces,
walls and zones that meet what they must not; then which days each finding holds on."""

from __future__ import annotations

import numpy as np

from bracing.model import Site
from bracing.plan.crossings import (
    brace_crossings,
    braces_in_areas,
    braces_through_walls,
    overlapping_walls,
    reach_of,
    zone_overlaps,
)
from bracing.plan.placement import BraceTable, Places, WallBracing, brace_table, standing_bracing
from bracing.plan.records import (
    ALSO_ON_SLAB,
    GROUND_KINDS,
    IN_PER_FT,
    TOLERANCE_FT,
    PlanFinding,
    xy_words,
)
from bracing.plan.slab import Slab, SlabFeet, covered, edge_distance_needed_in, read_ground
from bracing.plan.slab import slab_feet as read_slab_feet
from bracing.plan.zone import zone_corners, zone_reach_ft
from bracing.results import Flag


def plan_findings(site: Site, places: Places,
                  standing: set[str] | None = None) -> list[tuple[str, Flag]]:
    """(mark, flag) of everything wrong in the plan for the walls standing (None: all placed)."""
    bracing = standing_bracing(site, places, standing)
    table = brace_table(places, bracing)
    found = all_findings(site, places, bracing, table, read_slab_feet(site, table))
    return [(f.mark, f.flag) for f in found]


def all_findings(site: Site, places: Places, bracing: WallBracing, table: BraceTable,
                 feet: SlabFeet, heights: dict[str, float] | None = None) -> list[PlanFinding]:
    """Everything found in the plan with the walls of `bracing` standing (`table`: their braces,
    `feet`: those on slab anchors)."""
    rows = bracing.walls
    reach = reach_of(places, rows, table)
    return (_line_findings(places)
            + _slab_anchor_findings(site, table, feet)
            + _ground_anchor_findings(site, table, feet.slab)
            + brace_crossings(table, reach)
            + braces_through_walls(table, places, reach)
            + braces_in_areas(site, table, reach)
            + zone_overlaps(site, places, rows, zone_corners(
                places, bracing, zone_reach_ft(site, places, bracing, heights)))
            + overlapping_walls(places, reach))


def _line_findings(places: Places) -> list[PlanFinding]:
    """Walls running past the end of their line (the model checks that the line exists)."""
    end = places.offset_ft + places.width_ft
    return [PlanFinding(str(places.mark[k]), Flag(
        "past-line-end", "notice", f"the wall runs to {end[k]:.1f} ft along line "
        f"'{places.line[k]}', which is {places.line_ft[k]:.1f} ft long", "site file"), [])
        for k in np.flatnonzero(end > places.line_ft + TOLERANCE_FT)]


def _by_mark(marks: np.ndarray, mask: np.ndarray) -> dict[str, np.ndarray]:
    """Positions where `mask` holds, grouped by wall mark (in order of appearance)."""
    groups: dict[str, list[int]] = {}
    for k in np.nonzero(mask)[0]:
        groups.setdefault(str(marks[k]), []).append(k)
    return {m: np.array(rows) for m, rows in groups.items()}


def _slab_anchor_findings(site: Site, t: BraceTable, feet_on: SlabFeet) -> list[PlanFinding]:
    """Slab anchors off the slab, in a hole, or nearer its edge, a hole or a joint than their
    type allows."""
    sel, slab = feet_on.rows, feet_on.slab
    if len(sel) == 0:
        return []
    marks = t.mark[sel]
    if slab is None:
        return [PlanFinding(m, Flag(
            "anchor-not-located", "notice", "the plan has no slab outline: the slab anchors' "
            "positions and edge distances are not checked", "method notes §6"), [])
            for m in dict.fromkeys(marks)]
    feet, on, which = t.foot[sel], feet_on.on, feet_on.edge
    in_hole = covered(slab.holes, feet) if not slab.holes.is_empty else np.zeros_like(on)
    dist_in = feet_on.edge_ft * IN_PER_FT
    anchors = t.anchor[sel]
    need, need_in = {}, np.zeros(len(sel))
    for name in site.anchor_types:
        used = anchors == name
        if used.any():
            need[name] = edge_distance_needed_in(site, name)
            need_in[used] = need[name][0]
    found = []
    for mark, rows in _by_mark(marks, ~on).items():
        where = "in a slab hole" if in_hole[rows].any() else "off the slab"
        found.append(PlanFinding(mark, Flag(
            "anchor-off-slab", "danger", f"slab anchor at {t.numbers(sel[rows])} {where}, "
            f"as at {xy_words(feet[rows[0]])}: no concrete to hold it",
            "ACI 318-19 Ch. 17 (an anchor in concrete); method notes §6"),
            [tuple(p) for p in feet[rows]]))
    for mark, rows in _by_mark(marks, on & (dist_in < need_in - TOLERANCE_FT)).items():
        k = rows[np.argmin(dist_in[rows])]
        needed, said = need[anchors[k]]
        found.append(PlanFinding(mark, Flag(
            "anchor-near-edge", "danger", f"slab anchor at {t.numbers(sel[rows])}: "
            f"{dist_in[k]:.1f} in from {slab.edges[which[k]][0]}; {said} needs {needed:g} in",
            f"ACI 318-19 §17.9 (least edge distance, {needed:g} in); the distance found "
            "feeds psi_ed,N, §17.6.2.4.1"),
            [tuple(p) for p in feet[rows]]))
    return found


def _ground_anchor_findings(site: Site, t: BraceTable, slab: Slab | None) -> list[PlanFinding]:
    """Ground anchors whose feet are not on open ground (nor, for a deadman, on the slab)."""
    sel = np.nonzero(np.isin(t.kind, GROUND_KINDS))[0]
    if len(sel) == 0:
        return []
    ground = read_ground(site)
    feet, kinds, marks = t.foot[sel], t.kind[sel], t.mark[sel]
    deadman = np.isin(kinds, ALSO_ON_SLAB)  # may stand on the slab as well
    on_ground = covered(ground, feet) if ground is not None else np.zeros(len(sel), bool)
    on_slab = np.zeros(len(sel), bool)  # asked of the deadmen only
    if slab is not None:
        on_slab[deadman] = covered(slab.area, feet[deadman])
    drawn = (ground is not None) | (deadman & (slab is not None))
    found = [PlanFinding(mark, Flag(
        "anchor-not-located", "notice", f"the plan has no open ground: the {kinds[rows[0]]} "
        "anchors' positions are not checked", "method notes §6"), [])
        for mark, rows in _by_mark(marks, ~drawn).items()]
    for mark, rows in _by_mark(marks, drawn & ~(on_ground | (deadman & on_slab))).items():
        kind = kinds[rows[0]]
        where = "on open ground or on the slab" if kind in ALSO_ON_SLAB else "on open ground"
        found.append(PlanFinding(mark, Flag(
            "ground-anchor-off-ground", "danger", f"{kind} anchor at {t.numbers(sel[rows])} "
            f"not {where}, as at {xy_words(feet[rows[0]])}",
            "method notes §6 (ground anchors go in open ground)"), [tuple(p) for p in feet[rows]]))
    return found


def findings(site: Site, places: Places) -> list[PlanFinding]:
    """Everything found in the plan with every placed wall standing."""
    return all_findings(site, places, places.bracing(site), places.braces(site),
                        places.slab_feet(site))


def day_findings(found: list[PlanFinding], days) -> dict[int, list[Flag]]:
    """Each day's plan findings, from one look at every placed wall (`findings`): a finding
    holds on the days its wall and the walls it involves all stand; its message names the wall.

    `days` are the job's days in order (`DayResult`s): a wall stands from the day it is lifted
    until the day it is released."""
    out: dict[int, list[Flag]] = {d.day: [] for d in days}
    if not found:
        return out
    first, end = {}, {}
    for d in days:
        first.update(dict.fromkeys(d.lifts, d.day))
        end.update(dict.fromkeys(d.released, d.day))
    last = days[-1].day + 1
    for f in found:
        walls = (f.mark, *f.others)
        if not all(m in first for m in walls):
            continue  # a wall that never stands
        lo = max(first[m] for m in walls)
        hi = min(end.get(m, last) for m in walls)
        flag = Flag(f.flag.code, f.flag.severity, f"{f.mark}: {f.flag.message}", f.flag.source)
        for day in range(lo, hi):
            out[day].append(flag)
    return out
