"""Wall lines: panels standing edge to edge are one wall to the wind (design.md §4).

Each day, the panels standing on a line form groups (gaps no wider than the plan's joint gap).
A panel in a group takes the Case A and Case C pressures of the whole group over its own width,
from either end; a return wall standing at a corner cuts the end-zone value there (ASCE 7-16
Figure 29.3-1). The engine envelopes these line loads over every day the panel stands, together
with its own lone-panel Cases A and B (the state before its neighbours were set).
"""

from __future__ import annotations

from dataclasses import dataclass
from itertools import chain, repeat

import numpy as np

from bracing.model import Site, read_panels
from bracing.wind import asce7

CORNER_TOLERANCE_FT = 1.0  # line ends closer than this meet at a corner


@dataclass(frozen=True)
class LineLoads:
    """Per panel, enveloped over its standing days; NaN where a panel is on no line.

    `left_*` is wind from the line's start end, `right_*` from its far end; x in ft from the
    panel's first edge. `local_max` and `local_mid` are the largest local Case C coefficient
    over the panel's width and the one at its middle (for walls checked per foot).
    """

    case_a: np.ndarray
    left_mean: np.ndarray
    left_x: np.ndarray
    right_mean: np.ndarray
    right_x: np.ndarray
    local_max: np.ndarray
    local_mid: np.ndarray


@dataclass(frozen=True)
class Releases:
    """Each panel's lift and release, read once per evaluation for the line loads, the planned
    standing time and the days of the job (`bracing.schedule`); panels in site order.

    A wall releases on its sign-off day, and only when every event it waits for is done by then
    (OSHA 1926.704(a): braces stay until the permanent connections are complete). A sign-off
    before the lift, or before one of those events, cannot release it.
    """

    marks: tuple[str, ...]
    lift: np.ndarray        # lift day (NaN: not scheduled)
    event_day: np.ndarray   # day of the last event the release waits for (NaN: none)
    release: np.ndarray     # release day (inf: not released)
    early: np.ndarray       # the sign-offs (rows of site.signoffs) before the one that releases
    #                         their wall, if any: wall by wall, day by day, then in file order
    early_wall: np.ndarray  # the wall (row of site.panels) of each
    early_day: np.ndarray   # and its day


def releases(site: Site, columns: dict[str, tuple] | None = None) -> Releases:
    """Each panel's lift, last release event and release day, from the sign-offs of its
    scheduled walls (see Releases); `columns`: the panels' fields, if already read."""
    panel = columns or read_panels(site)
    marks, lift, after = (panel[k] for k in ("mark", "lift_day", "release_after"))
    lift = np.array(lift, float)  # None: NaN
    event_day = _last_event_days(site, after)
    row = dict(zip(marks, range(len(marks)))) if site.signoffs else {}
    wall = np.array([row[s.panel] for s in site.signoffs], int)
    day = np.array([s.day for s in site.signoffs], int)
    order = np.lexsort((day, wall))                      # stable: same-day ones in file order
    order = order[~np.isnan(lift[wall[order]])]          # the sign-offs of scheduled walls
    wall, day = wall[order], day[order]
    valid = (day >= lift[wall]) & ~(event_day[wall] > day)  # after the lift and every event
    first = np.full(len(marks), len(order))              # each wall's first valid sign-off
    np.minimum.at(first, wall[valid], np.flatnonzero(valid))
    release = np.full(len(marks), np.inf)
    signed = first < len(order)
    release[signed] = day[first[signed]]
    early = np.flatnonzero(np.arange(len(order)) < first[wall])
    return Releases(marks, lift, event_day, release, order[early], wall[early], day[early])


def planned_weeks(releases: Releases) -> np.ndarray:
    """Planned standing time (weeks) from lift to the last event that releases the wall."""
    return weeks_to_release(releases.lift, releases.event_day)


def _last_event_days(site: Site, after: tuple[list[str], ...]) -> np.ndarray:
    """Day of the last event each panel's release waits for (`after`: the events of each);
    NaN where it waits for none."""
    events = {e.name: e.day for e in site.events}
    count = np.fromiter(map(len, after), int, len(after))
    day = np.fromiter(map(events.__getitem__, chain.from_iterable(after)), float, count.sum())
    last = np.full(len(after), np.nan)
    waits = count > 0
    if waits.any():
        last[waits] = np.maximum.reduceat(day, (np.cumsum(count) - count)[waits])
    return last


def weeks_to_release(lift_day, event_day):
    """Weeks from the lift to the last release event, both days counted (at least one day);
    NaN where either day is NaN."""
    return np.maximum(1.0, event_day - lift_day + 1.0) / 7.0


def line_loads(site: Site, releases: Releases, width: np.ndarray, height: np.ndarray,
               base: np.ndarray, columns: dict[str, tuple] | None = None) -> LineLoads | None:
    """The enveloped line loads of every panel (None when no panel stands on a line), from
    the site's `releases`, each panel's width, height and base elevation (ft) and its line
    and offset (`columns`: the panels' fields, if already read)."""
    n = len(site.panels)
    panel = columns or read_panels(site)
    line, offset = panel["line"], panel["offset"]
    offset = np.array(offset, dtype=float)  # None: NaN
    lift = releases.lift
    lines = {ln.name: ln for ln in site.lines}
    number = {name: k for k, name in enumerate(lines)}
    line_id = np.fromiter(map(number.get, line, repeat(-1)), int, n)  # -1: on no line
    line_id[np.isnan(lift)] = -1  # a wall not scheduled never stands on its line
    if not (line_id >= 0).any():
        return None
    groups = _standing_groups(site, lines, line_id, lift, releases.release, offset, width)
    if groups is None:  # every wall on the lines is released on its lift day
        return LineLoads(**{k: np.full(n, np.nan) for k in LineLoads.__dataclass_fields__})
    member, lo, hi, ret_lo, ret_hi = groups
    member = member.astype(int)
    start, width, s = offset[member], width[member], height[member]
    top = s + base[member]
    ret_lo, ret_hi = ret_lo / s, ret_hi / s
    b_over_s = (hi - lo) / s
    s_over_h = s / top
    x0 = (start - lo) / s
    x1 = x0 + width / s
    # the wind from the line's start (its return wall there) and from its end
    bins_lo = asce7.case_c_bins(b_over_s, s_over_h, ret_lo)
    bins_hi = asce7.case_c_bins(b_over_s, s_over_h, ret_hi)
    left, cx_left = asce7.case_c_mean(x0, x1, b_over_s, s_over_h, bins=bins_lo)
    right, cx_right = asce7.case_c_mean(b_over_s - x1, b_over_s - x0, b_over_s, s_over_h,
                                        bins=bins_hi)
    # Case C falls away from the windward end: over a panel's width its largest local value is
    # at the edge nearer that end, from either end of the line
    mid = (x0 + x1) / 2.0
    local_max = np.maximum(asce7.case_c_cf(x0, b_over_s, s_over_h, bins=bins_lo),
                           asce7.case_c_cf(b_over_s - x1, b_over_s, s_over_h, bins=bins_hi))
    local_mid = np.maximum(asce7.case_c_cf(mid, b_over_s, s_over_h, bins=bins_lo),
                           asce7.case_c_cf(b_over_s - mid, b_over_s, s_over_h, bins=bins_hi))
    out = {k: np.full(n, np.nan) for k in LineLoads.__dataclass_fields__}
    for key, values in (("case_a", asce7.cf_cases_ab(b_over_s, s_over_h)),
                        ("local_max", local_max), ("local_mid", local_mid)):
        np.fmax.at(out[key], member, values)  # the envelope: the larger value of each panel
    # each end's wind at its largest, with its resultant from the panel's own first edge
    for end, mean, at in (("left", left, cx_left * s - (start - lo)),
                          ("right", right, hi - start - cx_right * s)):
        largest = np.full(n, np.nan)
        np.fmax.at(largest, member, mean)
        best = np.full(n, len(mean))  # each panel's earliest row at its largest (none: len)
        at_largest = np.flatnonzero(mean == largest[member])
        np.minimum.at(best, member[at_largest], at_largest)
        found = best < len(mean)
        out[f"{end}_mean"][found] = mean[best[found]]
        out[f"{end}_x"][found] = at[best[found]]
    return LineLoads(**out)


def _standing_groups(site: Site, lines: dict, line_id: np.ndarray, lift: np.ndarray,
                     release: np.ndarray, start: np.ndarray, width: np.ndarray
                     ) -> tuple[np.ndarray, ...] | None:
    """The groups each wall on a line stands in, day by day: (panel index, the group's extent
    lo and hi along the line, the return wall at its start and at its end, ft), in day order.

    `lines` are the site's lines by name; `line_id`, `lift`, `release`, `start` and `width` each
    panel's line (its place in `lines`; -1: none, or not scheduled), lift and release day (inf:
    not released), offset along the line and width. A wall in the same group as on its last
    standing day is loaded the same, so only changes are listed (None when no wall on a line
    ever stands)."""
    gap = site.plan.joint_gap if site.plan else 1.0
    line_length = np.array([np.hypot(*np.subtract(ln.end, ln.start)) for ln in lines.values()])
    names = list(lines)
    on_line = line_id >= 0
    order = np.lexsort((start, line_id))
    order = order[on_line[order]]  # walls on lines, by line then along it
    lift_o, release_o, line_o, lo_o = lift[order], release[order], line_id[order], start[order]
    hi_o = lo_o + width[order]
    corners = _corners(lines)
    days = np.unique(np.concatenate([lift[on_line], release[on_line & np.isfinite(release)]]))
    found = []
    last = np.full((4, len(site.panels)), np.nan)  # each wall's group on its last standing day
    for day in days:
        up = (lift_o <= day) & (release_o > day)
        members = order[up]
        if len(members) == 0:  # every wall on the lines released that day
            continue
        # groups: a new one where the line changes or a gap wider than a joint opens
        lid, lo_m, hi_m = line_o[up], lo_o[up], hi_o[up]
        breaks = (np.diff(lid) != 0) | (lo_m[1:] - hi_m[:-1] > gap)
        first = np.concatenate([[0], np.nonzero(breaks)[0] + 1])
        group = np.cumsum(np.concatenate([[0], breaks]))
        g_lo = np.minimum.reduceat(lo_m, first)
        g_hi = np.maximum.reduceat(hi_m, first)
        ret_lo, ret_hi = _corner_returns(lid[first], g_lo, g_hi, names, line_length, corners)
        now = np.array([g_lo[group], g_hi[group], ret_lo[group], ret_hi[group]])
        changed = (last[:, members] != now).any(axis=0)
        last[:, members] = now
        found.append((members[changed], *now[:, changed]))
    if not found:
        return None
    return tuple(np.concatenate(column).astype(float) for column in zip(*found))


def _corners(lines: dict) -> dict[tuple[str, str], list[tuple[str, str]]]:
    """For each line end ('start'/'end'), the ends of other lines that meet it at a corner."""
    ends = [(name, tip) for name, ln in lines.items() for tip in ("start", "end")]
    if not ends:
        return {}
    xy = np.array([getattr(lines[name], tip) for name, tip in ends], float)
    by_x = np.argsort(xy[:, 0], kind="stable")
    out: dict[tuple[str, str], list[tuple[str, str]]] = {}
    for step in range(1, len(ends)):  # ends ever further apart in x, until none is near in x
        a, b = by_x[:-step], by_x[step:]
        near_x = xy[b, 0] - xy[a, 0] <= CORNER_TOLERANCE_FT
        if not near_x.any():
            break
        a, b = a[near_x], b[near_x]
        near = np.hypot(*(xy[a] - xy[b]).T) <= CORNER_TOLERANCE_FT
        for j, k in zip(a[near].tolist(), b[near].tolist()):
            if ends[j][0] != ends[k][0]:
                out.setdefault(ends[j], []).append(ends[k])
                out.setdefault(ends[k], []).append(ends[j])
    return out


def _corner_returns(g_line, g_lo, g_hi, names, length, corners) -> tuple[np.ndarray, ...]:
    """Length of wall standing at right angles where each group's start and end meet a corner
    (0 where none).

    Groups are given by their line's number in `names` and their extent along it; `length` is
    each line's length and `corners` comes from `_corners`.
    """
    returns = np.zeros((2, len(g_line)))
    if not corners:
        return returns[0], returns[1]
    at_tip = {}  # (line, 'start'|'end') -> (group, 0|1, extent of the group standing there)
    for end, (tip, at) in enumerate((("start", g_lo <= CORNER_TOLERANCE_FT),
                                     ("end", g_hi >= length[g_line] - CORNER_TOLERANCE_FT))):
        for g in np.nonzero(at)[0].tolist():
            at_tip[(names[g_line[g]], tip)] = (g, end, float(g_hi[g] - g_lo[g]))
    for tip, (g, end, _) in at_tip.items():
        other = [at_tip[p][2] for p in corners.get(tip, []) if p in at_tip]
        if other:
            returns[end, g] = max(other)
    return returns[0], returns[1]
