"""The scheduled walls as arrays: lift and release days, the events their release waits for,
and the flags of sign-offs that cannot release them (OSHA 29 CFR 1926.704(a); method notes §6).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from bracing import lines
from bracing.model import Panel, SignOff, Site
from bracing.results import Flag

RELEASE_SOURCE = "OSHA 29 CFR 1926.704(a); method notes §6"


@dataclass
class Scheduled:
    """The scheduled walls as arrays, in site order (the days are counted over all at once)."""

    index: np.ndarray          # row in site.panels
    marks: np.ndarray          # (object)
    lift: np.ndarray           # lift day
    release: np.ndarray        # release day; 0: no valid sign-off, stands to the last day
    event_day: np.ndarray      # day of the last event its release waits for (NaN: none)
    flags: list[Flag]          # sign-off and no-signoff flags, wall by wall
    flag_wall: np.ndarray      # the wall of each flag
    flag_day: np.ndarray       # the day of each flag


def scheduled(site: Site, releases: lines.Releases) -> Scheduled:
    """The scheduled walls, their release days and sign-off flags (see `bracing.schedule`),
    from the site's `releases`."""
    r = releases
    index = np.flatnonzero(~np.isnan(r.lift))
    lift = r.lift[index].astype(int)
    marks = np.array(r.marks, dtype=object)[index]
    release = r.release[index]
    release = np.where(np.isfinite(release), release, 0).astype(int)
    events = {e.name: e.day for e in site.events}
    early = [_early_flag(site.signoffs[j], site.panels[i], events)
             for j, i in zip(r.early.tolist(), r.early_wall.tolist(), strict=True)]
    stays = np.flatnonzero(release == 0)
    flags = early + [Flag("no-signoff", "notice", f"{m}: no valid sign-off recorded: it counts "
                          "as standing to the end of the schedule", RELEASE_SOURCE)
                     for m in marks[stays].tolist()]
    flag_wall = np.concatenate([np.searchsorted(index, r.early_wall), stays])
    flag_day = np.concatenate([r.early_day, lift[stays]])
    by_wall = np.argsort(flag_wall, kind="stable")  # a wall's `no-signoff` after its sign-offs
    return Scheduled(index=index, marks=marks, lift=lift, release=release,
                     event_day=r.event_day[index], flags=[flags[j] for j in by_wall.tolist()],
                     flag_wall=flag_wall[by_wall], flag_day=flag_day[by_wall])


def every_wall(site: Site) -> Scheduled:
    """Every wall of the site standing together from day 1, never released, with no flags (the
    sheet of a site file that gives no lift days)."""
    n, no_flags = len(site.panels), np.zeros(0, int)
    return Scheduled(index=np.arange(n), marks=np.array([p.mark for p in site.panels],
                                                        dtype=object),
                     lift=np.ones(n, int), release=np.zeros(n, int),
                     event_day=np.full(n, np.nan), flags=[], flag_wall=no_flags,
                     flag_day=no_flags)


def last_event(walls: Scheduled, after: int) -> int:
    """The last day after day `after` on which falls an event the release of a scheduled wall
    waits for (0: none)."""
    last = np.fmax.reduce(walls.event_day, initial=-np.inf)  # NaN: waits for none
    return int(last) if last > after else 0


def _early_flag(signoff: SignOff, panel: Panel, events: dict[str, int]) -> Flag:
    """The flag of a sign-off that cannot release its wall (OSHA 1926.704(a)): before the lift,
    or before an event the release waits for."""
    s, p = signoff, panel
    if s.day < p.lift_day:
        return Flag("signoff-before-lift", "warning", f"{p.mark}: sign-off by {s.by} on day "
                    f"{s.day} is before its lift on day {p.lift_day}: ignored", RELEASE_SOURCE)
    pending = [n for n in p.release_after if events[n] > s.day]
    return Flag("signoff-before-event", "danger", f"{p.mark}: sign-off by {s.by} on day "
                f"{s.day} comes before " + ", ".join(f"{n} (day {events[n]})" for n in pending)
                + ": the braces stay", RELEASE_SOURCE)
