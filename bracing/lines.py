"""Wall lines: panels standing edge to edge are one wall to the wind (design.md §4).

Each day, the panels standing on a line form groups (gaps no wider than the plan's joint gap).
A panel in a group takes the Case A and Case C pressures of the whole group over its own width,
from either end; a return wall standing at a corner cuts the end-zone value there (ASCE 7-16
Figure 29.3-1). The engine envelopes these line loads over every day the panel stands, together
with its own lone-panel Cases A and B (the state before its neighbours were set).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from bracing.model import Site
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


def standing_days(site: Site) -> tuple[np.ndarray, np.ndarray]:
    """(lift day, release day) of each panel; NaN lift = not scheduled, inf = not released.

    A wall releases on its sign-off day, and only when every event it waits for is done by then
    (OSHA 1926.704(a): braces stay until the permanent connections are complete).
    """
    events = {e.name: e.day for e in site.events}
    lift = np.array([np.nan if p.lift_day is None else p.lift_day for p in site.panels], float)
    release = np.full(len(site.panels), np.inf)
    by_mark = {p.mark: i for i, p in enumerate(site.panels)}
    for so in site.signoffs:  # the earliest valid sign-off: after the lift and every event
        i = by_mark[so.panel]
        p = site.panels[i]
        valid = (p.lift_day is not None and so.day >= p.lift_day
                 and all(events[n] <= so.day for n in p.release_after))
        if valid:
            release[i] = min(release[i], so.day)
    return lift, release


def planned_weeks(site: Site) -> np.ndarray:
    """Planned standing time (weeks) from lift to the last event that releases the wall."""
    events = {e.name: e.day for e in site.events}
    weeks = np.full(len(site.panels), np.nan)
    for i, p in enumerate(site.panels):
        if p.lift_day is not None and p.release_after:
            weeks[i] = max(1.0, max(events[n] for n in p.release_after) - p.lift_day + 1) / 7.0
    return weeks


def line_loads(site: Site) -> LineLoads | None:
    """The enveloped line loads of every panel (None when no panel stands on a line)."""
    n = len(site.panels)
    on_line = np.array([p.line is not None and p.lift_day is not None for p in site.panels])
    if not on_line.any():
        return None
    lift, release = standing_days(site)
    out = {k: np.full(n, np.nan) for k in LineLoads.__dataclass_fields__}
    best_left = np.full(n, -np.inf)
    best_right = np.full(n, -np.inf)
    gap = site.plan.joint_gap if site.plan else 1.0
    lines = {ln.name: ln for ln in site.lines}
    length = {name: float(np.hypot(*np.subtract(ln.end, ln.start))) for name, ln in lines.items()}
    start = np.array([p.offset for p in site.panels])
    width = np.array([p.width for p in site.panels])
    height = np.array([p.height for p in site.panels])
    top = height + np.array([p.base_elevation for p in site.panels])
    line_of = np.array([p.line or "" for p in site.panels], dtype=object)
    days = np.unique(np.concatenate([lift[on_line], release[on_line & np.isfinite(release)]]))
    for day in days:
        standing = on_line & (lift <= day) & (release > day)
        groups = {}  # (line, group) -> member indices
        for name in lines:
            members = np.nonzero(standing & (line_of == name))[0]
            if len(members) == 0:
                continue
            members = members[np.argsort(start[members])]
            ends = np.maximum.accumulate(start[members] + width[members])
            breaks = np.concatenate([[0], np.cumsum(start[members][1:] - ends[:-1] > gap)])
            for g in np.unique(breaks):
                groups[(name, g)] = members[breaks == g]
        if not groups:  # every wall on the lines released that day
            continue
        returns = _corner_returns(groups, lines, length, start, width)
        # every group of the day in one vectorised pass: each member with its group's extent
        members, lo, hi, ret_lo, ret_hi = [], [], [], [], []
        for (name, _), m in groups.items():
            g_lo = start[m].min()
            g_hi = (start[m] + width[m]).max()
            members.append(m)
            lo.append(np.full(len(m), g_lo))
            hi.append(np.full(len(m), g_hi))
            ret_lo.append(np.full(len(m), returns.get((name, g_lo), 0.0)))
            ret_hi.append(np.full(len(m), returns.get((name, g_hi), 0.0)))
        members = np.concatenate(members)
        lo, hi = np.concatenate(lo), np.concatenate(hi)
        s = height[members]
        ret_lo, ret_hi = np.concatenate(ret_lo) / s, np.concatenate(ret_hi) / s
        b_over_s = (hi - lo) / s
        s_over_h = s / top[members]
        x0 = (start[members] - lo) / s
        x1 = x0 + width[members] / s
        left, cx_left = asce7.case_c_mean(x0, x1, b_over_s, s_over_h, ret_lo)
        right, cx_right = asce7.case_c_mean(b_over_s - x1, b_over_s - x0, b_over_s, s_over_h,
                                            ret_hi)
        grid = x0[:, None] + np.linspace(0.0, 1.0, 9)[None, :] * (x1 - x0)[:, None]
        local = np.maximum(
            asce7.case_c_cf(grid, b_over_s[:, None], s_over_h[:, None], ret_lo[:, None]),
            asce7.case_c_cf(b_over_s[:, None] - grid, b_over_s[:, None], s_over_h[:, None],
                            ret_hi[:, None]))
        _keep(out, "case_a", members, asce7.cf_cases_ab(b_over_s, s_over_h))
        _keep(out, "local_max", members, local.max(axis=1))
        _keep(out, "local_mid", members, local[:, 4])
        # the resultant of each end's wind, from the panel's own first edge
        better = left > best_left[members]
        out["left_mean"][members[better]] = left[better]
        out["left_x"][members[better]] = (cx_left * s - (start[members] - lo))[better]
        best_left[members[better]] = left[better]
        better = right > best_right[members]
        out["right_mean"][members[better]] = right[better]
        out["right_x"][members[better]] = (hi - start[members] - cx_right * s)[better]
        best_right[members[better]] = right[better]
    return LineLoads(**out)


def _keep(out, key, members, values):
    """Envelope: keep the larger value for each member."""
    out[key][members] = np.fmax(out[key][members], values)


def _corner_returns(groups, lines, length, start, width) -> dict:
    """Length of wall standing at right angles at each group end that meets a corner.

    Returns {(line, group end position along the line): return length (ft)}.
    """
    tips = {}  # corner point -> [(line, along, group extent from that corner)]
    for (name, _), members in groups.items():
        lo = start[members].min()
        hi = (start[members] + width[members]).max()
        ln = lines[name]
        for along, point in ((lo, ln.start), (hi, ln.end)):
            at_tip = along <= CORNER_TOLERANCE_FT if point is ln.start else \
                along >= length[name] - CORNER_TOLERANCE_FT
            if at_tip:
                tips.setdefault(point, []).append((name, along, hi - lo))
    out = {}
    for point, here in tips.items():
        for other_point, there in tips.items():
            if np.hypot(point[0] - other_point[0], point[1] - other_point[1]) > \
                    CORNER_TOLERANCE_FT:
                continue
            for name, along, _ in here:
                other = [extent for n, _, extent in there if n != name]
                if other:
                    out[(name, along)] = max(out.get((name, along), 0.0), max(other))
    return out
