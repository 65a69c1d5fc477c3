"""The days of the job, one `DayResult` each (see `bracing.schedule` for the rules): who stands,
the gear in use, the stand-down and working-limit speeds, the forecast's go / no-go, and the
day's findings, each from a day rule (`DAY_RULES`), before the day's verdict (`judge`)."""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass, replace
from datetime import timedelta

import numpy as np

from bracing import lines
from bracing.model import Site
from bracing.results import DayResult, Flag, PanelResult
from bracing.schedule import gear
from bracing.schedule.forecast import ForecastDay
from bracing.schedule.slips import period_slips
from bracing.schedule.verdict import judge, wall_facts
from bracing.schedule.walls import Scheduled, every_wall, last_event, scheduled

STORM_SOURCE = "method notes §6, Day verdict"
STATUS_WORDS = {"unsafe": "braced, but a check fails",
                "needs_braces": "cannot stand on its own and has no braces"}


def build_days(site: Site, panels: list[PanelResult],
               forecast: dict[int, ForecastDay] | None = None,
               releases: lines.Releases | None = None, judged: bool = True
               ) -> tuple[list[DayResult], dict, list[tuple[str, Flag]]]:
    """The job day by day, the peak inventory and each wall's schedule flags (see
    `bracing.schedule`).

    `panels` are the wall results of `site` (any order, by mark); `forecast` the forecast by
    day (`bracing.schedule.site_forecast`, read at the edge; None: no forecast); `releases` are
    the site's `bracing.lines.releases` (read here when not given); `judged`: give each day its
    verdict (`judge`; a caller that adds findings to the days first judges them itself).
    Returns (days, {"braces": {type: peak}, "anchors": {type: peak}}, [(mark, flag)]).
    """
    walls = scheduled(site, lines.releases(site) if releases is None else releases)
    if not len(walls.index):
        return [], {"braces": {}, "anchors": {}}, []
    forecast = forecast or {}
    last = max(int(walls.lift.max()), int(walls.release.max()), int(walls.flag_day.max(initial=0)))
    last = max(last, last_event(walls, last))
    if not walls.release.all():  # a wall stands on: forecast days still count
        last = max([last, *forecast])
    result, marks = {p.mark: p for p in panels}, walls.marks.tolist()
    job = _job(site, walls, [result[m] for m in marks], forecast, last)
    days = _days(job, judged)
    wall_flags = list(zip(walls.marks[walls.flag_wall].tolist(), walls.flags, strict=True))
    wall_flags += [item for d in sorted(job.slips) for item in job.slips[d]]
    return days, job.peak(), wall_flags


def whole_site(site: Site, panels: list[PanelResult]) -> DayResult:
    """Every wall of the site standing together, as day 0: the sheet of a site file that gives
    no lift days (inventory, stand-down speed; no forecast, no lifts, no releases)."""
    walls = every_wall(site)
    result = {p.mark: p for p in panels}
    job = _job(site, walls, [result[m] for m in walls.marks.tolist()], {}, 1)
    days = _days(job, judged=False)
    return judge(replace(days[0], day=0, lifts=[]), {p.mark: p for p in panels})


def date_of(site: Site, day: int) -> str | None:
    """ISO date of day `day` (start_date + day - 1), or None without a start date."""
    start = site.site.start_date
    return None if start is None else (start + timedelta(days=day - 1)).isoformat()


@dataclass
class Job:
    """Every day of the scheduled walls as arrays (days, walls), worked once: what the days and
    their rules read."""

    site: Site
    walls: Scheduled
    results: list[PanelResult]  # in the order of walls.marks
    forecast: dict[int, ForecastDay]
    last: int                   # the last day
    standing: np.ndarray        # (days, walls)
    fresh: np.ndarray           # (days, walls): masonry with fresh mortar
    stand_down: np.ndarray      # (days, walls) mph; NaN: unknown
    limit: np.ndarray           # (days, walls) working limit, mph; NaN: unknown
    braces: tuple[list[str], np.ndarray]   # types, (days, types) in use
    anchors: tuple[list[str], np.ndarray]
    slips: dict[int, list[tuple[str, Flag]]]  # period slips by day
    on_day: dict[int, list[Flag]]            # sign-off flags by day
    failing: np.ndarray         # the walls that fail by their status
    failing_flags: np.ndarray   # (object) their flags

    def peak(self) -> dict[str, dict[str, int]]:
        """The largest day's count of each type over the job."""
        return {kind: {t: int(c) for t, c in zip(names, table.max(axis=0), strict=True)}
                for kind, (names, table) in (("braces", self.braces),
                                             ("anchors", self.anchors))}


@dataclass
class Today:
    """One day as the day rules read it."""

    day: int
    row: int                    # its row in the job's (days, walls) arrays
    up: np.ndarray              # the walls standing
    short: dict[str, dict[str, int]]
    young: np.ndarray           # the standing walls with fresh mortar


def _job(site: Site, walls: Scheduled, results: list[PanelResult],
         forecast: dict[int, ForecastDay], last: int) -> Job:
    """Days 1 to `last` of the scheduled walls (`results` in their order) as arrays."""
    day = np.arange(1, last + 1)[:, None]                                  # (days, 1)
    release = np.where(walls.release > 0, walls.release, last + 1)
    kinds, which = gear.distinct_gear(site, walls.index, results)
    brace, wall_anchor, foot_anchor, count = zip(*kinds, strict=True)
    use = (which, walls.lift, release, np.array(count, int)[which], last)
    fresh = _fresh_mortar(site, walls, results, day)                      # (days, walls)
    on_day: dict[int, list[Flag]] = {}
    for d, f in zip(walls.flag_day.tolist(), walls.flags, strict=True):
        if f.code != "no-signoff":
            on_day.setdefault(d, []).append(f)
    status = [r.status for r in results]
    failing = np.array([k for k, s in enumerate(status) if s in STATUS_WORDS], int)
    return Job(
        site=site, walls=walls, results=results, forecast=forecast, last=last,
        standing=(walls.lift <= day) & (day < release), fresh=fresh,
        stand_down=np.where(fresh, _speeds(results, "fresh_stand_down_speed_mph"),
                            _speeds(results, "stand_down_speed_mph")),
        limit=np.where(fresh, _speeds(results, "fresh_working_limit_speed_mph"),
                       _speeds(results, "working_limit_speed_mph")),
        braces=gear.in_use([brace], *use), anchors=gear.in_use([wall_anchor, foot_anchor], *use),
        slips=period_slips(site, walls, results, release, last), on_day=on_day, failing=failing,
        failing_flags=np.array(_status_flags(walls.marks[failing].tolist(),
                                             [status[k] for k in failing.tolist()]),
                               dtype=object))


def _days(job: Job, judged: bool) -> list[DayResult]:
    """The days of the job, judged (`judge`) if `judged`."""
    marks = job.walls.marks
    known = np.isfinite(job.stand_down)
    # each day over the walls standing: the lowest stand-down speed (the first such wall) and
    # the lowest working limit (inf: none known)
    up_known = job.standing & known
    governing = np.where(up_known, job.stand_down, np.inf).argmin(axis=1)
    governed = up_known.any(axis=1)
    least_limit = np.where(job.standing & np.isfinite(job.limit), job.limit,
                           np.inf).min(axis=1).tolist()
    anyone = job.standing.any(axis=1)
    lifted = _by_day(marks, job.walls.lift)
    released = _by_day(marks, job.walls.release)
    by_mark = dict(zip(marks.tolist(), job.results, strict=True))
    facts = wall_facts(by_mark) if judged else None
    days = []
    for n in range(job.last):  # per day, numpy over the walls: a long job has many of both
        d, up = n + 1, job.standing[n]
        use_b = _counts(job.braces, n)
        use_a = _counts(job.anchors, n)
        today = Today(day=d, row=n, up=up, young=np.flatnonzero(up & job.fresh[n]),
                      short={"braces": gear.short(use_b, job.site.brace_types),
                             "anchors": gear.short(use_a, job.site.anchor_types)})
        gov = int(governing[n]) if governed[n] else None
        fc = job.forecast.get(d)
        go, reason = _go(job.site, bool(anyone[n]),
                         None if gov is None else job.results[gov],
                         gov is not None and bool(job.fresh[n, gov]),
                         marks[up & ~known[n]].tolist(), fc)
        days.append(DayResult(
            day=d, date=date_of(job.site, d),
            lifts=lifted.get(d, []), standing=marks[up].tolist(),
            braces_in_use=use_b, anchors_in_use=use_a, released=released.get(d, []),
            stand_down_speed_mph=None if gov is None else float(job.stand_down[n, gov]),
            working_limit_speed_mph=None if least_limit[n] == math.inf else least_limit[n],
            governing_wall=None if gov is None else marks[gov],
            forecast_gust_mph=fc.gust_mph if fc else None, storm=bool(fc and fc.storm),
            go=go, reason=reason, wind=reason, wind_go=go, short=today.short,
            flags=[f for rule in DAY_RULES for f in rule(job, today)],
            fresh_mortar=marks[today.young].tolist()))
        if judged:
            judge(days[-1], by_mark, facts)
    return days


def _counts(in_use: tuple[list[str], np.ndarray], row: int) -> dict[str, int]:
    """The types in use on the day of `row` with their counts (none: left out)."""
    names, table = in_use
    return {t: int(c) for t, c in zip(names, table[row], strict=True) if c}


# --- the day rules: each gives the day's flags of one kind, in the order the day lists them ----
def _signoff_flags(job: Job, today: Today) -> list[Flag]:
    """Sign-offs that cannot release their wall, on their day."""
    return job.on_day.get(today.day, [])


def _slip_flags(job: Job, today: Today) -> list[Flag]:
    """Walls standing into a band of higher period factor, on the day they enter it."""
    return [f for _, f in job.slips.get(today.day, [])]


def _short_flags(job: Job, today: Today) -> list[Flag]:
    """Types the day is short of."""
    return gear.short_flags(today.short)


def _failing_flags(job: Job, today: Today) -> list[Flag]:
    """The walls standing that fail by their status."""
    return job.failing_flags[today.up[job.failing]].tolist()


def _fresh_flags(job: Job, today: Today) -> list[Flag]:
    """Masonry standing with fresh mortar: their speeds with fresh mortar apply."""
    if not len(today.young):
        return []
    cure = job.site.rule("masonry_cure_days")
    return [Flag("fresh-mortar-standing", "notice",
                 f"{', '.join(job.walls.marks[today.young].tolist())}: mortar younger than "
                 f"{cure.value:g} days (from the lift day): their speeds with fresh mortar "
                 "apply", cure.source)]


DayRule = Callable[[Job, Today], list[Flag]]
# A new check of the days (a backfill event, say) is one more rule here: a function of the job
# and the day giving its flags; `judge` then weighs them (a danger fails the walls it names,
# "MARK: ..." in its message, or the day when it names none).
DAY_RULES: list[DayRule] = [_signoff_flags, _slip_flags, _short_flags, _failing_flags,
                            _fresh_flags]


def _speeds(results: list[PanelResult], name: str) -> np.ndarray:
    """One speed of every wall (NaN where it has none)."""
    return np.array([getattr(r, name) for r in results], dtype=float)


def _fresh_mortar(site: Site, walls: Scheduled, results: list[PanelResult], day: np.ndarray
                  ) -> np.ndarray:
    """(days, walls): the masonry walls whose mortar is fresh on each day, counted from their
    lift day against the cure rule (none when the rule is off)."""
    cure = site.rule_value("masonry_cure_days")
    if cure is None:
        return np.zeros((len(day), len(walls.lift)), bool)
    masonry = np.array([r.material == "masonry" for r in results], dtype=bool)
    return masonry & (day - walls.lift < cure)


def _by_day(marks: np.ndarray, day: np.ndarray) -> dict[int, list[str]]:
    """Marks of the walls by their day in `day` (lift or release; 0: none), in site order."""
    order = np.argsort(day, kind="stable")
    groups = np.split(order, np.flatnonzero(np.diff(day[order])) + 1)
    return {int(day[g[0]]): marks[g].tolist() for g in groups if len(g) and day[g[0]]}


def _status_flags(marks: list[str], statuses: list[str]) -> list[Flag]:
    """The flags of standing walls that fail: unsafe braced walls, walls that need braces and
    have none."""
    code = {s: f"{s.replace('_', '-')}-standing" for s in STATUS_WORDS}
    return [Flag(code[s], "danger", f"{m} stands today: {STATUS_WORDS[s]}",
                 "the wall's checks (`bracing check`)")
            for m, s in zip(marks, statuses, strict=True)]


def stand_down_rule(site: Site, panel: PanelResult, fresh: bool = False) -> str:
    """Which site rule set a wall's stand-down speed (with fresh mortar, if `fresh`), with its
    value and source."""
    stand_down, limit, _ = panel.speeds_on(fresh)
    mortar = "fresh mortar: " if fresh else ""
    ratio = site.rule_value("stand_down_ratio") or 1.0
    if math.isclose(stand_down, ratio * limit, rel_tol=1e-6):
        r = site.rule("stand_down_ratio")
        return (f"{mortar}{r.value:g} x working limit {limit:.0f} mph; rule "
                f"stand_down_ratio: {r.source}")
    for name in ("masonry_initial_speed_mph", "masonry_intermediate_speed_mph"):
        value = site.rule_value(name)
        if value is not None and math.isclose(stand_down, value, rel_tol=1e-6):
            return f"{mortar}rule {name} {value:g} mph: {site.rule(name).source}"
    return "engine"


def _go(site: Site, anyone: bool, gov: PanelResult | None, fresh: bool, unknown: list[str],
        fc: ForecastDay | None) -> tuple[bool | None, str]:
    """The day's go / no-go and its reason (see `bracing.schedule`); `anyone`: a wall stands,
    `gov`: the one with the lowest stand-down speed that day (`fresh`: its mortar is fresh that
    day)."""
    if not anyone:
        return None, "no walls standing"
    if fc is None:
        return None, "no forecast"
    if fc.storm:
        return False, f"thunderstorm forecast: counts as exceeding the stand-down ({STORM_SOURCE})"
    if unknown:
        return False, (f"no stand-down speed is known for {', '.join(unknown)} (a brace or "
                       "anchor capacity is unknown)")
    stand_down = gov.speeds_on(fresh)[0]
    compare = (f"forecast gust {fc.gust_mph:.0f} mph {{}} stand-down {stand_down:.0f} mph of "
               f"{gov.mark} ({stand_down_rule(site, gov, fresh)})")
    if fc.gust_mph < stand_down:
        return True, compare.format("<")
    return False, compare.format(">=") + ": no lifts, clear the fall zones"
