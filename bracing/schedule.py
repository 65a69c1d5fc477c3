"""Days of the job: lifts, standing walls, releases, inventory and the wind go / no-go (design.md §7).

Day semantics (the team's rules, written here once; every view reads the result):

- Days are whole numbers from 1. With `[site] start_date`, day N falls on start_date + N - 1
  (calendar days). The job runs from day 1 to the last lift, release event, sign-off or forecast
  day of a scheduled wall.
- A wall with no `lift_day` is not scheduled: it appears in no day.
- A wall stands from its lift day. It is released on the day of a recorded sign-off by the
  engineer of record (OSHA 1926.704(a)), and only when every event in its `release_after` falls
  on or before that day; a sign-off before one of them is flagged `signoff-before-event`
  (danger) and the wall stays braced. A sign-off before the lift is flagged and ignored. Braces
  never come off from dates alone: a wall with no valid sign-off stands to the last day.
- A wall released on day N no longer stands on day N (as the wind engine counts it). Its braces
  and anchors still count as in use on day N: they come off after the sign-off, so the day's
  lifts cannot count on them (conservative).
- Standing time on day N is N - lift day + 1 days (the lift day counts), in weeks of 7 days, the
  measure of the planned time in `bracing.lines.planned_weeks`. When it reaches a band of ASCE
  37-14 Table 6.2-1 whose factor is above the one the wall was checked with, the wall is flagged
  `period-slip` (warning) with the new factor, once per band.
- In use each day: per brace type, the brace count of every wall in use; per anchor type, one
  wall anchor and one foot anchor per brace. Types with `on_hand` given are compared: `short`.
  The peak inventory is the largest day's count of each type over the job.
- The day's stand-down speed is the lowest among standing walls (and the wall that gives it);
  its working-limit speed the lowest working limit. Go when the forecast gust is below the
  stand-down speed and no thunderstorm is forecast (a warning nearby counts as exceeding,
  design.md §3); no standing wall, no go/no-go; no forecast row, no go/no-go ('no forecast');
  a standing wall with no known stand-down speed makes a forecast day a no-go.

Forecast file: CSV with a header row; columns `date` (ISO, needs start_date) or `day`,
`gust_mph` or `gust` (a unit allowed, "40 km/h"; bare numbers are mph), and optionally `storm`
(yes/no/true/false/1/0, blank = no). Gusts are forecast peak gusts, read as the reference 3-s
gust at 33 ft (design.md §3). Several rows for one day (hourly forecasts) give that day the
largest gust and any storm. Rows before day 1 are ignored. Blank lines and lines starting with
'#' are skipped. The path is relative to the site file's folder.
"""

from __future__ import annotations

import csv
import math
from dataclasses import dataclass, field, replace
from datetime import date, timedelta
from operator import itemgetter
from pathlib import Path

import numpy as np

from bracing import lines, plan, units
from bracing.braced import SERVICEABILITY
from bracing.model import DAY_LIMIT, Bracing, Panel, SignOff, Site, within
from bracing.results import DayFinding, DayResult, Flag, PanelResult
from bracing.scenario import SiteFileError, read_text
from bracing.wind import asce37

STORM_WORDS = {"yes": True, "true": True, "1": True, "no": False, "false": False, "0": False,
               "": False}
STORM_SOURCE = "method notes §6, Day verdict"
PERIOD_SOURCE = "ASCE 37-14 Table 6.2-1"
# The codes of the walls' schedule flags (each also on the day it happens).
SCHEDULE_CODES = ("signoff-before-lift", "signoff-before-event", "no-signoff", "period-slip")
RELEASE_SOURCE = "OSHA 29 CFR 1926.704(a); method notes §6"


@dataclass(frozen=True)
class ForecastDay:
    """The forecast of one day: its largest gust (mph) and whether a thunderstorm is forecast."""

    gust_mph: float
    storm: bool


@dataclass(frozen=True)
class Hardware:
    """What one wall's bracing uses: brace type, anchor types and the brace count."""

    brace_type: str | None
    wall_anchor: str | None
    foot_anchor: str | None
    count: int


def read_forecast(path: str | Path, start_date: date | None) -> dict[int, ForecastDay]:
    """The forecast by day number; raise SiteFileError naming the file and line of each problem."""
    path = Path(path)
    text = read_text(path, "forecast file")  # a regular file only: a pipe would hang the run
    rows, problems = [], []
    for n, line in enumerate(text.splitlines(), 1):
        if not line.strip() or line.lstrip().startswith("#"):
            continue
        try:
            rows.extend((n, cells) for cells in csv.reader([line]))
        except csv.Error as exc:  # a field past the csv module's size limit, a NUL byte
            problems.append(f"{path}:{n}: cannot read the line as CSV ({exc})")
    if problems:
        raise SiteFileError(str(path), problems)
    if not rows:
        raise SiteFileError(str(path), [f"{path}: empty forecast file (a header row and one row "
                                        "per day are expected)"])
    head_line, head = rows[0]
    columns = {name.strip().lower(): k for k, name in enumerate(head)}
    when = next((c for c in ("day", "date") if c in columns), None)
    gust = next((c for c in ("gust_mph", "gust") if c in columns), None)
    if when is None or gust is None:
        problems.append(f"{path}:{head_line}: header needs a `date` or `day` column and a "
                        f"`gust_mph` or `gust` column (found: {', '.join(head)})")
    elif when == "date" and start_date is None:
        problems.append(f"{path}:{head_line}: the forecast gives dates: set [site] start_date "
                        "(the date of day 1) in the site file")
    if problems:
        raise SiteFileError(str(path), problems)
    out: dict[int, ForecastDay] = {}
    for n, cells in rows[1:]:
        cell = {name: cells[k].strip() if k < len(cells) else "" for name, k in columns.items()}
        try:
            day = _day_of(cell[when], when, start_date)
            speed = within(units.parse(cell[gust], "speed"), "speed")
            if speed < 0:
                raise ValueError(f"negative gust {cell[gust]!r}")
            storm = STORM_WORDS.get(cell.get("storm", "").lower())
            if storm is None:
                raise ValueError(f"storm must be yes/no/true/false/1/0, got {units.shown(cell['storm'])}")
        except ValueError as exc:
            problems.append(f"{path}:{n}: {exc}")
            continue
        if day < 1:
            continue
        if day > DAY_LIMIT:
            problems.append(f"{path}:{n}: day {day:,} is beyond the last day a job can have "
                            f"({DAY_LIMIT:,}, method notes §9)")
            continue
        seen = out.get(day)
        out[day] = ForecastDay(max(speed, seen.gust_mph) if seen else speed,
                               storm or (seen.storm if seen else False))
    if problems:
        raise SiteFileError(str(path), problems)
    return out


def _day_of(text: str, column: str, start_date: date | None) -> int:
    """Day number of a forecast row from its `day` or ISO `date` cell."""
    if column == "date":
        try:
            return (date.fromisoformat(text) - start_date).days + 1
        except ValueError:
            raise ValueError(f"date must be ISO (YYYY-MM-DD), got {units.shown(text)}") from None
    try:
        day = int(text)
    except ValueError:
        raise ValueError(f"day must be a whole number, got {units.shown(text)}") from None
    if day < 1:
        raise ValueError(f"day numbers start at 1, got {day}")
    return day


def date_of(site: Site, day: int) -> str | None:
    """ISO date of day `day` (start_date + day - 1), or None without a start date."""
    start = site.site.start_date
    return None if start is None else (start + timedelta(days=day - 1)).isoformat()


def hardware(bracing: Bracing | None, panel: PanelResult) -> Hardware | None:
    """A wall's brace and anchor types and brace count, from its result's `braces` record where
    it names them (a designed layout), else from the site file's `bracing` (None: not named)."""
    b, d = bracing, panel.braces or {}
    if b is None and not d:
        return None
    return Hardware(d.get("brace_type", b.brace_type if b else None),
                    d.get("wall_anchor", b.wall_anchor if b else None),
                    d.get("foot_anchor", b.foot_anchor if b else None),
                    int(d.get("count", b.count if b else 0)))


def fall_zones(site: Site, panels: list[PanelResult]) -> dict[str, tuple[float, float, str]]:
    """Zone of each wall (design.md §7): reach (ft) out from the braced face, reach back from the
    braced face on the other side (through the wall), and its basis. Walls placed on a wall line take the plan's own
    (`bracing.plan.zone_reach`); the others the same rule: masonry height + the zone rule's
    extra on the braced side (OSHA 29 CFR 1926.706(a)), never less than the brace footprint;
    other walls height + brace footprint in front and their height behind (common practice).
    """
    out = dict(plan.zone_reach(site, plan.place(site), None, {p.mark for p in panels}))
    extra = site.rule_value("masonry_zone_extra_ft")
    for p in panels:
        if p.mark in out:
            continue
        h, footprint = p.height_ft, (p.braces or {}).get("anchor_distance_ft") or 0.0
        if p.material == "masonry" and extra is not None:
            reach = max(h + extra, h + footprint)  # OSHA 29 CFR 1926.706(a): h + 4 ft
            out[p.mark] = (reach, 0.0, f"{reach:.1f} ft on the braced (unscaffolded) side: wall "
                                       f"height + {extra:g} ft "
                                       f"({site.rule('masonry_zone_extra_ft').source})")
        else:
            out[p.mark] = (h + footprint, h + p.thickness_in / 12.0,
                           f"{h + footprint:.1f} ft on the braced side (height + brace "
                           f"footprint), {h:.1f} ft behind (height) (common practice)")
    return out


@dataclass
class _Walls:
    """The scheduled walls as arrays, in site order (the days are counted over all at once)."""

    index: np.ndarray          # row in site.panels
    marks: np.ndarray          # (object)
    lift: np.ndarray           # lift day
    release: np.ndarray        # release day; 0: no valid sign-off, stands to the last day
    event_day: np.ndarray      # day of the last event its release waits for (NaN: none)
    flags: list[Flag]          # sign-off and no-signoff flags, wall by wall
    flag_wall: np.ndarray      # the wall of each flag
    flag_day: np.ndarray       # the day of each flag


PLANNED_FROM = np.array(["the wall's standing_time", "its release events",
                         "the site's construction_period"], dtype=object)


def _walls(site: Site, releases: lines.Releases) -> _Walls:
    """The scheduled walls, their release days and sign-off flags (see the module), from the
    site's `releases`."""
    r = releases
    index = np.flatnonzero(~np.isnan(r.lift))
    lift = r.lift[index].astype(int)
    marks = np.array(r.marks, dtype=object)[index]
    release = r.release[index]
    release = np.where(np.isfinite(release), release, 0).astype(int)
    events = {e.name: e.day for e in site.events}
    early = [_early_flag(site.signoffs[j], site.panels[i], events)
             for j, i in zip(r.early.tolist(), r.early_wall.tolist())]
    stays = np.flatnonzero(release == 0)
    flags = early + [Flag("no-signoff", "notice", f"{m}: no valid sign-off recorded: it counts "
                          "as standing to the end of the schedule", RELEASE_SOURCE)
                     for m in marks[stays].tolist()]
    flag_wall = np.concatenate([np.searchsorted(index, r.early_wall), stays])
    flag_day = np.concatenate([r.early_day, lift[stays]])
    by_wall = np.argsort(flag_wall, kind="stable")  # a wall's `no-signoff` after its sign-offs
    return _Walls(index, marks, lift, release, r.event_day[index],
                  [flags[j] for j in by_wall.tolist()], flag_wall[by_wall], flag_day[by_wall])


def _planned(site: Site, index: np.ndarray, lift: np.ndarray, event_day: np.ndarray
             ) -> tuple[np.ndarray, np.ndarray]:
    """Planned standing time (weeks) of the walls at `index` in site.panels (lifted on days
    `lift`, the last event their release waits for on `event_day`) and what it comes from
    (PLANNED_FROM): the wall's own, its release events, or the site's."""
    own = np.array([site.panels[i].standing_time for i in index.tolist()], float)  # None: NaN
    source = np.where(np.isnan(own), np.where(np.isnan(event_day), 2, 1), 0)
    weeks = np.choose(source, [own, lines.weeks_to_release(lift, event_day),
                               site.site.construction_period])
    return weeks, PLANNED_FROM[source]


def _last_event(walls: _Walls, after: int) -> int:
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


def build_days(site: Site, panels: list[PanelResult], base_dir: str | Path | None = None,
               releases: lines.Releases | None = None, judged: bool = True
               ) -> tuple[list[DayResult], dict, list[tuple[str, Flag]]]:
    """The job day by day, the peak inventory and each wall's schedule flags (see the module).

    `panels` are the wall results of `site` (any order, by mark); the forecast file is read from
    `base_dir` (the site file's folder; default the working folder); `releases` are the site's
    `bracing.lines.releases` (read here when not given); `judged`: give each day its verdict
    (`judge`; a caller that adds findings to the days first judges them itself). Returns (days,
    {"braces": {type: peak}, "anchors": {type: peak}}, [(mark, flag)]).
    """
    walls = _walls(site, lines.releases(site) if releases is None else releases)
    if not len(walls.index):
        return [], {"braces": {}, "anchors": {}}, []
    forecast = (read_forecast(Path(base_dir or ".") / site.forecast.file, site.site.start_date)
                if site.forecast else {})
    last = max(int(walls.lift.max()), int(walls.release.max()), int(walls.flag_day.max(initial=0)))
    last = max(last, _last_event(walls, last))
    if not walls.release.all():  # a wall stands on: forecast days still count
        last = max([last, *forecast])
    result, marks = {p.mark: p for p in panels}, walls.marks.tolist()
    days, peak, slips = _days(site, walls, [result[m] for m in marks], forecast, last, judged)
    wall_flags = list(zip(walls.marks[walls.flag_wall].tolist(), walls.flags))
    wall_flags += [item for d in sorted(slips) for item in slips[d]]
    return days, peak, wall_flags


def whole_site(site: Site, panels: list[PanelResult]) -> DayResult:
    """Every wall of the site standing together, as day 0: the sheet of a site file that gives
    no lift days (inventory, stand-down speed; no forecast, no lifts, no releases)."""
    n, no_flags = len(site.panels), np.zeros(0, int)
    walls = _Walls(np.arange(n), np.array([p.mark for p in site.panels], dtype=object),
                   np.ones(n, int), np.zeros(n, int), np.full(n, np.nan), [], no_flags, no_flags)
    result = {p.mark: p for p in panels}
    days, _, _ = _days(site, walls, [result[m] for m in walls.marks.tolist()], {}, 1)
    return judge(replace(days[0], day=0, lifts=[]), {p.mark: p for p in panels})


# --- the day's verdict (method notes §6, Day verdict) -------------------------------------------
MARGINAL = 0.9  # a forecast at or above 0.9 x the stand-down gust is marginal (method notes §6)
VERDICT_SOURCE = "method notes §6, Day verdict"
RESTATED = ("unsafe-standing", "needs-braces-standing")  # the verdict names these walls itself
SEVERITY_RANK = {"danger": 0, "warning": 1, "notice": 2}


@dataclass
class WallFacts:
    """What the verdicts read of each wall, worked once for all days (`wall_facts`); arrays
    over the walls in the order of `marks`."""

    marks: np.ndarray               # (object)
    index: dict[str, int]           # mark: its row
    keys: dict[tuple, np.ndarray]   # a finding (rank, code, message, source): rows it is on
    fails: np.ndarray               # PanelResult.fails
    struck: np.ndarray              # working limit with one brace struck (mph); NaN: no braces
    seen: dict[tuple, tuple] = field(default_factory=dict)  # the last standing walls' answer

    def standing(self, marks: list[str]) -> tuple[np.ndarray, list[tuple[tuple, list[str]]]]:
        """A mask of the rows of `marks` and the findings of those walls with their marks
        (kept for the next days while they stand the same walls)."""
        key = tuple(marks)
        if key not in self.seen:
            up = np.zeros(len(self.marks), bool)
            up[[self.index[m] for m in marks]] = True
            found = []
            for finding, rows in self.keys.items():
                on = rows[up[rows]]
                if len(on):
                    found.append((finding, self.marks[on].tolist()))
            self.seen = {key: (up, found)}  # consecutive days often stand the same walls
        return self.seen[key]


def wall_facts(panels: dict[str, PanelResult]) -> WallFacts:
    """Each wall's findings for the days' verdicts (its failing checks, needing braces, its
    danger and warning flags but those the days carry), whether it fails, and its working
    limit with one brace struck."""
    rows: dict[tuple, list[int]] = {}
    fails = [p.fails for p in panels.values()]
    for k, p in enumerate(panels.values()):
        if p.status == "needs_braces":
            rows.setdefault(NEEDS_BRACES, []).append(k)
        for c in p.checks if fails[k] else ():  # why it fails (PanelResult.fails decides)
            if not c.passes and c.element not in SERVICEABILITY:  # a crack: its warning says
                rows.setdefault((0, "check-fails", f"{c.element} ({c.region}) over capacity "
                                 f"({c.combination})", c.source), []).append(k)
        for f in p.flags:  # a danger "...-over" repeats a failing check: listed as that
            if f.severity != "notice" and f.code not in SCHEDULE_CODES and not (
                    f.severity == "danger" and f.code.endswith("-over") and fails[k]):
                rows.setdefault((SEVERITY_RANK[f.severity], f.code, f.message, f.source),
                                []).append(k)
    marks = np.array(list(panels), dtype=object)
    return WallFacts(
        marks, {m: k for k, m in enumerate(panels)},
        {key: np.unique(np.array(r, int)) for key, r in rows.items()},
        np.array(fails, bool),
        np.array([(p.braces.get("working_limit_one_missing_mph") or 0.0) if p.braces
                  else np.nan for p in panels.values()], float))


NEEDS_BRACES = (0, "needs-braces", "cannot stand on its own and has no braces",
                "the wall's checks")
STRUCK = (1, "struck-brace", "today's forecast exceeds the wall's working limit with one brace "
          "struck (shown beside it): keep equipment clear of the braces and replace a struck "
          "brace before work goes on", VERDICT_SOURCE)


def judge(d: DayResult, panels: dict[str, PanelResult], facts: WallFacts | None = None
          ) -> DayResult:
    """Sets the day's verdict on `d` (and returns it), once every finding of the day is in its
    flags; `panels` by mark (`facts`: their `wall_facts`, worked here when not given). The rule
    (method notes §6):

    - a wall lifted or standing that day fails when `PanelResult.fails` or a danger finding of
      the day names it; a danger of the day that names no wall (short of braces) fails the day;
    - NO-GO when a wall already standing fails, the day fails, or the forecast gust reaches the
      day's stand-down gust (a thunderstorm counts, a standing wall without a known stand-down
      gust too);
    - else GO WITH EXCEPTIONS when some of today's lifts fail: do not lift those;
    - else GO when the forecast gust is below the stand-down gust; NO CALL without a forecast
      or without a wall standing.

    `go` is True for GO only, False for NO-GO and GO WITH EXCEPTIONS, None for NO CALL. Judging
    a day again (after more findings) gives its verdict afresh. Findings are grouped: one per
    code, message and source, with the walls it holds for (in site order)."""
    facts = facts or wall_facts(panels)
    up, found = facts.standing(d.standing)
    of_day: dict[tuple, dict[str, None]] = {}  # the day's own findings, the walls they name
    for f in d.flags:
        if f.code in RESTATED:
            continue
        head, _, rest = f.message.partition(": ")
        key = (SEVERITY_RANK[f.severity], f.code)
        if rest and head in facts.index and up[facts.index[head]]:
            of_day.setdefault(key + (rest, f.source), {})[head] = None
        else:
            of_day.setdefault(key + (f.message, f.source), {})
    groups = {key: list(marks) for key, marks in of_day.items()}
    for key, marks in found:  # the walls' own, worked once for the walls standing
        groups[key] = list(dict.fromkeys(groups[key] + marks)) if key in groups else marks
    gust = d.forecast_gust_mph
    if d.storm or gust is not None:  # design.md §6: a warning on a day whose forecast exceeds it
        with np.errstate(invalid="ignore"):
            struck = up & ~np.isnan(facts.struck) & (d.storm or facts.struck < (gust or 0.0))
        if struck.any():
            groups[STRUCK] = facts.marks[struck].tolist()
    # a finding's marks may be shared by the days that stand the same walls: never changed
    found = [DayFinding(code, ("danger", "warning", "notice")[rank], message, source, marks)
             for (rank, code, message, source), marks in sorted(
                 groups.items(), key=lambda item: item[0][0])]
    d.why = [f for f in found if f.severity == "danger"]
    d.findings = [f for f in found if f.severity != "danger"]
    failing = up & facts.fails  # a wall's own dangers make it fail; and those the day names:
    failing[[facts.index[m] for key, marks in of_day.items() if key[0] == 0 for m in marks]] = True
    lifts = set(d.lifts)
    d.do_not_lift = [m for m in d.lifts if failing[facts.index[m]]]
    d.failing_standing = [m for m in facts.marks[failing].tolist() if m not in lifts]
    day_danger = [f for f in d.why if not f.marks]
    wind_go = d.wind_go
    parts = []
    if d.failing_standing:
        parts.append(f"{', '.join(d.failing_standing)} stand and fail: keep everyone out of "
                     "their zones until they are made safe")
    parts += [f.message for f in day_danger]
    if d.do_not_lift:
        parts.append(f"do not lift {', '.join(d.do_not_lift)}")
    if d.failing_standing or day_danger or wind_go is False:
        d.verdict = "NO-GO"
    elif not d.standing or wind_go is None:
        d.verdict = "NO CALL"
    else:
        d.verdict = "GO WITH EXCEPTIONS" if d.do_not_lift else "GO"
    d.go = {"GO": True, "NO CALL": None}.get(d.verdict, False)
    d.reason = "; ".join(parts + [d.wind])
    stand_down = d.stand_down_speed_mph
    d.marginal = bool(wind_go and gust is not None and stand_down
                      and gust >= MARGINAL * stand_down)
    return d


def _days(site: Site, walls: _Walls, results: list[PanelResult],
          forecast: dict[int, ForecastDay], last: int, judged: bool = True):
    """Days 1 to `last` of the scheduled walls (`results` in their order): (days, peak
    inventory, period slips by day)."""
    day = np.arange(1, last + 1)[:, None]                                  # (days, 1)
    release = np.where(walls.release > 0, walls.release, last + 1)
    standing = (walls.lift <= day) & (day < release)                       # (days, walls)
    gear, which = _gear(site, walls.index, results)
    brace, wall_anchor, foot_anchor, count = zip(*gear)
    use = (which, walls.lift, release, np.array(count, int)[which], last)
    braces, anchors = _in_use([brace], *use), _in_use([wall_anchor, foot_anchor], *use)
    fresh = _fresh_mortar(site, walls, results, day)                      # (days, walls)
    stand_down = np.where(fresh, _speeds(results, "fresh_stand_down_speed_mph"),
                          _speeds(results, "stand_down_speed_mph"))
    limit = np.where(fresh, _speeds(results, "fresh_working_limit_speed_mph"),
                     _speeds(results, "working_limit_speed_mph"))
    slips = _period_slips(site, walls, results, release, last)
    on_day: dict[int, list[Flag]] = {}
    for d, f in zip(walls.flag_day.tolist(), walls.flags):
        if f.code != "no-signoff":
            on_day.setdefault(d, []).append(f)
    lifted, released = _by_day(walls.marks, walls.lift), _by_day(walls.marks, walls.release)
    marks = walls.marks
    by_mark = dict(zip(marks.tolist(), results))
    status = [r.status for r in results]
    failing = np.array([k for k, s in enumerate(status) if s in STATUS_WORDS], int)
    failing_flags = np.array(_status_flags(marks[failing].tolist(),
                                           [status[k] for k in failing.tolist()]),
                             dtype=object)
    known = np.isfinite(stand_down)
    # each day over the walls standing: the lowest stand-down speed (the first such wall) and
    # the lowest working limit (inf: none known)
    up_known = standing & known
    governing = np.where(up_known, stand_down, np.inf).argmin(axis=1)
    governed = up_known.any(axis=1)
    least_limit = np.where(standing & np.isfinite(limit), limit, np.inf).min(axis=1).tolist()
    anyone = standing.any(axis=1)

    facts = wall_facts(by_mark) if judged else None
    days = []
    for n in range(last):  # per day, numpy over the walls: a long job has many of both
        d = n + 1
        up = standing[n]
        use_b = {t: int(c) for t, c in zip(braces[0], braces[1][n]) if c}
        use_a = {t: int(c) for t, c in zip(anchors[0], anchors[1][n]) if c}
        short = {"braces": _short(use_b, site.brace_types),
                 "anchors": _short(use_a, site.anchor_types)}
        flags = on_day.get(d, []) + [f for _, f in slips.get(d, [])]
        flags += _short_flags(short) + failing_flags[up[failing]].tolist()
        young = np.flatnonzero(up & fresh[n])
        if len(young):
            flags.append(_fresh_flag(site, marks[young].tolist()))
        gov = int(governing[n]) if governed[n] else None
        fc = forecast.get(d)
        go, reason = _go(site, bool(anyone[n]), None if gov is None else results[gov],
                         gov is not None and bool(fresh[n, gov]),
                         marks[up & ~known[n]].tolist(), fc)
        days.append(DayResult(
            day=d, date=date_of(site, d),
            lifts=lifted.get(d, []), standing=marks[up].tolist(),
            braces_in_use=use_b, anchors_in_use=use_a, released=released.get(d, []),
            stand_down_speed_mph=None if gov is None else float(stand_down[n, gov]),
            working_limit_speed_mph=None if least_limit[n] == math.inf else least_limit[n],
            governing_wall=None if gov is None else marks[gov],
            forecast_gust_mph=fc.gust_mph if fc else None, storm=bool(fc and fc.storm),
            go=go, reason=reason, wind=reason, wind_go=go, short=short, flags=flags,
            fresh_mortar=marks[young].tolist()))
        if judged:
            judge(days[-1], by_mark, facts)
    peak = {"braces": {t: int(c) for t, c in zip(braces[0], braces[1].max(axis=0))},
            "anchors": {t: int(c) for t, c in zip(anchors[0], anchors[1].max(axis=0))}}
    return days, peak, slips


def _speeds(results: list[PanelResult], name: str) -> np.ndarray:
    """One speed of every wall (NaN where it has none)."""
    return np.array([getattr(r, name) for r in results], dtype=float)


def _fresh_mortar(site: Site, walls: _Walls, results: list[PanelResult], day: np.ndarray
                  ) -> np.ndarray:
    """(days, walls): the masonry walls whose mortar is fresh on each day, counted from their
    lift day against the cure rule (none when the rule is off)."""
    cure = site.rule_value("masonry_cure_days")
    if cure is None:
        return np.zeros((len(day), len(walls.lift)), bool)
    masonry = np.array([r.material == "masonry" for r in results], dtype=bool)
    return masonry & (day - walls.lift < cure)


def _fresh_flag(site: Site, marks: list[str]) -> Flag:
    cure = site.rule("masonry_cure_days")
    return Flag("fresh-mortar-standing", "notice", f"{', '.join(marks)}: mortar younger than "
                f"{cure.value:g} days (from the lift day): their speeds with fresh mortar apply",
                cure.source)


def _by_day(marks: np.ndarray, day: np.ndarray) -> dict[int, list[str]]:
    """Marks of the walls by their day in `day` (lift or release; 0: none), in site order."""
    order = np.argsort(day, kind="stable")
    groups = np.split(order, np.flatnonzero(np.diff(day[order])) + 1)
    return {int(day[g[0]]): marks[g].tolist() for g in groups if len(g) and day[g[0]]}


GEAR = ("brace_type", "wall_anchor", "foot_anchor", "count")


def _gear(site: Site, index: np.ndarray, results: list[PanelResult]
          ) -> tuple[list[tuple], np.ndarray]:
    """The distinct gear of the walls, each a brace type, wall anchor and foot anchor (None: not
    named) and brace count as `hardware` reads them, and which of them each wall has (`index`:
    the walls' rows in site.panels, `results` in their order). A site has few of them."""
    recorded, keys = itemgetter(*GEAR), frozenset(GEAR)
    distinct: dict[tuple, int] = {}
    which = []
    for r, i in zip(results, index.tolist()):
        d = r.braces
        if d is not None and d.keys() >= keys:  # a braced wall's result names them all
            gear = recorded(d)
        else:
            h = hardware(site.panels[i].bracing, r)
            gear = (None, None, None, 0) if h is None else (h.brace_type, h.wall_anchor,
                                                            h.foot_anchor, h.count)
        which.append(distinct.setdefault(gear, len(distinct)))
    return list(distinct), np.array(which, int)


def _in_use(types: list[list], which: np.ndarray, lift: np.ndarray, release: np.ndarray,
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


def _short(use: dict[str, int], types: dict) -> dict[str, int]:
    """How many of each type are missing: in use above the on-hand count, where it is given."""
    return {t: c - types[t].on_hand for t, c in use.items()
            if t in types and types[t].on_hand is not None and c > types[t].on_hand}


def _short_flags(short: dict) -> list[Flag]:
    return [Flag("short", "danger", f"short of {kind[:-1]} type {t}: {n} more needed than on "
                 "hand", "site inventory ([brace_types] / [anchor_types] on_hand)")
            for kind, items in short.items() for t, n in items.items()]


STATUS_WORDS = {"unsafe": "braced, but a check fails",
                "needs_braces": "cannot stand on its own and has no braces"}


def _status_flags(marks: list[str], statuses: list[str]) -> list[Flag]:
    """The flags of standing walls that fail: unsafe braced walls, walls that need braces and
    have none."""
    code = {s: f"{s.replace('_', '-')}-standing" for s in STATUS_WORDS}
    return [Flag(code[s], "danger", f"{m} stands today: {STATUS_WORDS[s]}",
                 "the wall's checks (`bracing check`)") for m, s in zip(marks, statuses)]


def _period_slips(site: Site, walls: _Walls, results: list[PanelResult], release: np.ndarray,
                  last: int) -> dict[int, list[tuple[str, Flag]]]:
    """(mark, flag) by day of walls whose standing time passes into a band of higher factor;
    `release`: the day each wall stops standing."""
    stood = np.arange(1, last + 1)                 # days stood, the lift day counted
    factor = asce37.period_factor(stood / 7.0)     # ASCE 37-14 Table 6.2-1, weeks stood
    enters = np.flatnonzero(np.r_[True, factor[1:] != factor[:-1]])  # a band's first day stood
    day = walls.lift[:, None] + enters             # (walls, bands): the day each band begins
    used = np.array([r.wind.period_factor for r in results], float)
    k, band = np.nonzero((day < release[:, None]) & (factor[enters] > used[:, None] + 1e-12))
    if not len(k):
        return {}
    on = day[k, band]
    by_day = np.lexsort((k, on))                   # day by day, walls in site order
    k, on, band = k[by_day], on[by_day], enters[band[by_day]]
    slipping = np.unique(k)
    planned, planned_from = _planned(site, walls.index[slipping], walls.lift[slipping],
                                     walls.event_day[slipping])
    checked = {j: _checked(results[j].wind, limit, weeks, source) for j, limit, weeks, source
               in zip(slipping.tolist(), asce37.period_band_limit_weeks(planned).tolist(),
                      planned.tolist(), planned_from.tolist())}
    out: dict[int, list[tuple[str, Flag]]] = {}
    for d, j, mark, weeks, now in zip(on.tolist(), k.tolist(), walls.marks[k].tolist(),
                                      (stood[band] / 7.0).tolist(), factor[band].tolist()):
        out.setdefault(d, []).append((mark, Flag(
            "period-slip", "warning", f"{mark}: stood {weeks:.1f} weeks on day {d}, past "
            f"{checked[j]}; factor now {now:.2f}: re-check the wall", PERIOD_SOURCE)))
    return out


def _checked(wind, band_weeks: float, planned_weeks: float, planned_from: str) -> str:
    """What a wall's wind check took its period factor from, for its period-slip flag."""
    if wind.period_factor_from == "set":
        return f"the factor {wind.period_factor:.2f} set for the site"
    return (f"the {band_weeks:.0f}-week band of its check (planned {planned_weeks:.1f} weeks "
            f"from {planned_from}, factor {wind.period_factor:.2f})")


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
    """The day's go / no-go and its reason (see the module); `anyone`: a wall stands, `gov`: the
    one with the lowest stand-down speed that day (`fresh`: its mortar is fresh that day)."""
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
