"""Wall lines: panels standing edge to edge are one wall to the wind (method notes §2).

Each day, the panels standing on a line (braced or already released: a released wall still
stands) form groups (gaps no wider than the plan's joint gap). A panel in a group takes the
Case A and Case C pressures of the whole group over its own width, from either end; a return
wall standing at a corner cuts the end-zone value there (ASCE 7-16 Figure 29.3-1). The groups
are kept as geometry (`line_groups`), so that their coefficients are worked out at any height
(`coefficients`, `strip_case_c`), enveloped with the panel alone (the state before its
neighbours were set) over every day the panel stands braced.
"""

from __future__ import annotations

from dataclasses import dataclass
from itertools import chain, repeat

import numpy as np

from bracing.model import Site, read_panels
from bracing.wind import asce7

CORNER_TOLERANCE_FT = 1.0  # line ends closer than this meet at a corner


# A group a wall stands in, as the columns of `Walls.groups` (ft): the wall's first edge from
# the group's start, the group's length, the return walls at its start and at its end.
GROUP_COLUMNS = 4


@dataclass(frozen=True)
class LineLoads:
    """Per wall, the coefficients of its groups at its height, enveloped over them (the wall
    alone, and on its line each day it stands): wind from the group's start end (`left_*`) and
    from its far end (`right_*`), x in ft from the wall's first edge. `end` and `interior` are
    the per-foot coefficients of a wall built in place (method notes §3)."""

    case_a: np.ndarray
    left_mean: np.ndarray
    left_x: np.ndarray
    right_mean: np.ndarray
    right_x: np.ndarray
    end: np.ndarray
    interior: np.ndarray


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
    row = dict(zip(marks, range(len(marks)), strict=True)) if site.signoffs else {}
    wall = np.array([row.get(s.panel, -1) for s in site.signoffs], int)  # -1: a foundation wall
    day = np.array([s.day for s in site.signoffs], int)
    order = np.lexsort((day, wall))                      # stable: same-day ones in file order
    order = order[wall[order] >= 0]                      # the panels' sign-offs
    order = order[~np.isnan(lift[wall[order]])]          # the sign-offs of scheduled walls
    wall, day = wall[order], day[order]
    valid = (day >= lift[wall]) & ~(event_day[wall] > day)  # after the lift and every event
    first = np.full(len(marks), len(order))              # each wall's first valid sign-off
    np.minimum.at(first, wall[valid], np.flatnonzero(valid))
    release = np.full(len(marks), np.inf)
    signed = first < len(order)
    release[signed] = day[first[signed]]
    early = np.flatnonzero(np.arange(len(order)) < first[wall])
    return Releases(marks=marks, lift=lift, event_day=event_day, release=release,
                    early=order[early], early_wall=wall[early], early_day=day[early])


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


def alone_and_on_lines(returns: np.ndarray, width: np.ndarray, on_lines: np.ndarray | None
                       ) -> np.ndarray:
    """Every wall's groups, (n, G, GROUP_COLUMNS): first the wall alone (the state before its
    neighbours were set), with its own return walls (`returns`, ft, at its left and right
    ends), then its groups on its line (`on_lines`, from `line_groups`; NaN rows: none). The
    coefficients follow from them at any height (`coefficients`)."""
    alone = np.stack([np.zeros_like(width), width, returns[0], returns[1]], axis=-1)[:, None]
    return alone if on_lines is None else np.concatenate([alone, on_lines], axis=1)


def line_groups(site: Site, releases: Releases, width: np.ndarray,
                columns: dict[str, tuple] | None = None) -> np.ndarray | None:
    """The groups each wall stands in on its line, over the days it stands braced, as rows of
    GROUP_COLUMNS (n, G, 4; NaN where a wall has fewer): from the site's `releases`, each
    panel's width (ft) and its line and offset (`columns`: the panels' fields, if already
    read). None when no wall stands on a line. Geometry only: the coefficients follow at any
    height (`coefficients`), so a search over heights works them out afresh."""
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
    found = _standing_groups(site, lines, line_id, releases, offset, width)
    if found is None:  # every wall on the lines is released on its lift day
        return None
    member, lo, hi, ret_lo, ret_hi = found
    member = member.astype(int)
    rows = np.stack([offset[member] - lo, hi - lo, ret_lo, ret_hi], axis=-1)
    # each wall's groups side by side: its k-th group in column k
    order = np.argsort(member, kind="stable")
    member, rows = member[order], rows[order]
    first = np.searchsorted(member, member)
    rank = np.arange(len(member)) - first
    out = np.full((n, rank.max() + 1, GROUP_COLUMNS), np.nan)
    out[member, rank] = rows
    return out


def coefficients(groups: np.ndarray, width: np.ndarray, height: np.ndarray,
                 base: np.ndarray) -> LineLoads:
    """The Case A and Case C coefficients of each wall's groups (`alone_and_on_lines`) at its
    height `height` (s, ft) with its base `base` ft above grade, enveloped over the groups
    (ASCE 7-16 Figure 29.3-1; method notes §2, §3). Worked afresh at every trial height: B/s,
    s/h, the return walls' Lr/s and the regions all change with s.

    `end` is the largest local Case C coefficient over the wall's width, from either end of
    each group (beside a return wall the s-2s region may be larger than the reduced 0-s one);
    `interior` the largest beyond s from a lone wall's ends (its s-2s region) or at the middle
    of a wall on a line, never above `end`. Neither is below Case A.
    """
    filled = np.isnan(groups[..., 1])
    g = np.where(filled[..., None], groups[:, :1], groups)  # an empty slot: the wall alone again
    s = height[:, None]
    d, length, r0, r1 = (g[..., k] for k in range(GROUP_COLUMNS))
    b_over_s, s_over_h = length / s, s / (base[:, None] + s)
    x0 = d / s
    x1 = x0 + width[:, None] / s
    mid = (x0 + x1) / 2.0
    bins_lo, bins_hi = _end_bins(b_over_s, s_over_h, r0 / s, r1 / s)
    case_a = asce7.cf_cases_ab(b_over_s, s_over_h)
    of = {"b_over_s": b_over_s, "s_over_h": s_over_h, "ab": case_a}
    left, cx_left = asce7.case_c_mean(x0, x1, bins=bins_lo, **of)
    right, cx_right = asce7.case_c_mean(b_over_s - x1, b_over_s - x0, bins=bins_hi, **of)
    local = np.maximum(asce7.case_c_max(x0, x1, bins=bins_lo, **of),
                       asce7.case_c_max(b_over_s - x1, b_over_s - x0, bins=bins_hi, **of))
    at_mid = np.maximum(asce7.case_c_cf(mid, bins=bins_lo, **of),
                        asce7.case_c_cf(b_over_s - mid, bins=bins_hi, **of))
    # a wall alone: its interior is the s-2s region (the largest beyond s from both ends)
    beyond_s = np.where(b_over_s > 2.0, asce7.case_c_cf(1.0, bins=bins_lo, **of), local)
    interior = np.where(np.arange(g.shape[1]) == 0, beyond_s, at_mid)
    best_a = case_a.max(axis=1)
    end = np.maximum(local.max(axis=1), best_a)
    out = {"case_a": best_a, "end": end,
           "interior": np.minimum(np.maximum(interior.max(axis=1), best_a), end)}
    # each end's wind at its largest, with its resultant from the wall's own first edge
    for side, mean, at in (("left", left, cx_left * s - d),
                           ("right", right, length - d - cx_right * s)):
        k = mean.argmax(axis=1)[:, None]
        out[f"{side}_mean"] = np.take_along_axis(mean, k, axis=1)[:, 0]
        out[f"{side}_x"] = np.take_along_axis(at, k, axis=1)[:, 0]
    return LineLoads(**out)


def _end_bins(b_over_s, s_over_h, return_start, return_end):
    """The Case C bins (asce7.case_c_bins) of groups for wind from their start and from their
    end, each end's return wall (Lr/s) cutting its own 0-s cell; worked out once where the
    returns are the same at both ends."""
    bins = asce7.case_c_bins(b_over_s, s_over_h, return_start)
    if np.array_equal(return_start, return_end):
        return bins, bins
    return bins, asce7.case_c_bins(b_over_s, s_over_h, return_end)


def strip_case_c(groups: np.ndarray, width: np.ndarray, height: np.ndarray, base: np.ndarray,
                 lo: np.ndarray, hi: np.ndarray) -> np.ndarray:
    """The largest local Case C coefficient over each strip [lo, hi] (ft from the wall's first
    edge; arrays (m, k)) of m walls, over their groups (`alone_and_on_lines`, (m, G, 4)) and
    wind from either end of each (ASCE 7-16 Figure 29.3-1; method notes §4). `width`, `height`
    and `base` are the walls' (m,). Case A/B where a group is shorter than 2 s."""
    filled = np.isnan(groups[..., 1])
    g = np.where(filled[..., None], groups[:, :1], groups)
    s = height[:, None]
    d, length, r0, r1 = (g[..., k] for k in range(GROUP_COLUMNS))
    b_over_s, s_over_h = length / s, s / (base[:, None] + s)
    bins_lo, bins_hi = (bins[:, :, None] for bins in _end_bins(b_over_s, s_over_h, r0 / s,
                                                                r1 / s))
    x0 = (d[..., None] + lo[:, None]) / s[..., None]  # (m, G, k) in s from the group's start
    x1 = (d[..., None] + hi[:, None]) / s[..., None]
    bos, soh = b_over_s[..., None], s_over_h[..., None]
    largest = np.maximum(asce7.case_c_max(x0, x1, bos, soh, bins=bins_lo),
                         asce7.case_c_max(bos - x1, bos - x0, bos, soh, bins=bins_hi))
    return largest.max(axis=1)


def _standing_groups(site: Site, lines: dict, line_id: np.ndarray, releases: Releases,
                     start: np.ndarray, width: np.ndarray) -> tuple[np.ndarray, ...] | None:
    """The groups each wall on a line stands in braced, day by day: (panel index, the group's
    extent lo and hi along the line, the return wall at its start and at its end, ft), in day
    order. A released wall still stands (method notes §6): it stays in its group for the wind on
    its neighbours, but is not listed itself after its release.

    `lines` are the site's lines by name; `line_id`, `start` and `width` each panel's line (its
    place in `lines`; -1: none, or not scheduled), offset along the line and width; `releases`
    their lift and release days (inf: not released). A wall in the same group as on its last
    standing day is loaded the same, so only changes are listed (None when no wall on a line
    ever stands)."""
    gap = site.plan.joint_gap if site.plan else 1.0
    lift, release = releases.lift, releases.release
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
        up = lift_o <= day  # standing, braced or released
        braced = (release_o > day)[up]
        if not braced.any():  # every wall on the lines released that day
            continue
        members = order[up]
        # groups: a new one where the line changes or a gap wider than a joint opens
        lid, lo_m, hi_m = line_o[up], lo_o[up], hi_o[up]
        breaks = (np.diff(lid) != 0) | (lo_m[1:] - hi_m[:-1] > gap)
        first = np.concatenate([[0], np.nonzero(breaks)[0] + 1])
        group = np.cumsum(np.concatenate([[0], breaks]))
        g_lo = np.minimum.reduceat(lo_m, first)
        g_hi = np.maximum.reduceat(hi_m, first)
        ret_lo, ret_hi = _corner_returns(lid[first], g_lo, g_hi, names, line_length, corners)
        now = np.array([g_lo[group], g_hi[group], ret_lo[group], ret_hi[group]])[:, braced]
        members = members[braced]
        changed = (last[:, members] != now).any(axis=0)
        last[:, members] = now
        found.append((members[changed], *now[:, changed]))
    if not found:
        return None
    return tuple(np.concatenate(column).astype(float) for column in zip(*found, strict=True))


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
        for j, k in zip(a[near].tolist(), b[near].tolist(), strict=True):
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
