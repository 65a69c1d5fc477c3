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
from pathlib import Path

import numpy as np

from bracing import lines, plan, units
from bracing.model import Bracing, Site
from bracing.results import DayResult, Flag, PanelResult
from bracing.scenario import SiteFileError
from bracing.wind import asce37

STORM_WORDS = {"yes": True, "true": True, "1": True, "no": False, "false": False, "0": False,
               "": False}
STORM_SOURCE = "design.md §3, team rule"
PERIOD_SOURCE = "ASCE 37-14 Table 6.2-1"
# The codes of the walls' schedule flags (each also on the day it happens).
SCHEDULE_CODES = ("signoff-before-lift", "signoff-before-event", "no-signoff", "period-slip")
RELEASE_SOURCE = "OSHA 29 CFR 1926.704(a); design.md §7"


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


@dataclass
class WallDays:
    """One scheduled wall: lift and release days, its planned standing time, its flags."""

    index: int
    mark: str
    lift: int
    release: int | None
    planned_weeks: float
    planned_from: str
    flags: list[Flag] = field(default_factory=list)
    flag_days: list[int] = field(default_factory=list)


def read_forecast(path: str | Path, start_date: date | None) -> dict[int, ForecastDay]:
    """The forecast by day number; raise SiteFileError naming the file and line of each problem."""
    path = Path(path)
    try:
        text = path.read_text(encoding="utf-8-sig")
    except OSError as exc:
        raise SiteFileError(str(path), [f"{path}: cannot read the forecast file "
                                        f"({exc.strerror})"]) from None
    except UnicodeDecodeError as exc:
        raise SiteFileError(str(path), [f"{path}: not a UTF-8 text file (byte {exc.start})"]) \
            from None
    rows = [(n, cells) for n, line in enumerate(text.splitlines(), 1)
            if line.strip() and not line.lstrip().startswith("#")
            for cells in csv.reader([line])]
    if not rows:
        raise SiteFileError(str(path), [f"{path}: empty forecast file (a header row and one row "
                                        "per day are expected)"])
    head_line, head = rows[0]
    columns = {name.strip().lower(): k for k, name in enumerate(head)}
    problems = []
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
            speed = units.parse(cell[gust], "speed")
            if speed < 0:
                raise ValueError(f"negative gust {cell[gust]!r}")
            storm = STORM_WORDS.get(cell.get("storm", "").lower())
            if storm is None:
                raise ValueError(f"storm must be yes/no/true/false/1/0, got {cell['storm']!r}")
        except ValueError as exc:
            problems.append(f"{path}:{n}: {exc}")
            continue
        if day < 1:
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
            raise ValueError(f"date must be ISO (YYYY-MM-DD), got {text!r}") from None
    try:
        day = int(text)
    except ValueError:
        raise ValueError(f"day must be a whole number, got {text!r}") from None
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


def wall_days(site: Site) -> list[WallDays]:
    """Lift and release day of every scheduled wall, with the sign-off flags (see the module)."""
    events = {e.name: e for e in site.events}
    planned = lines.planned_weeks(site)
    signed: dict[str, list] = {}
    for s in site.signoffs:
        signed.setdefault(s.panel, []).append(s)
    out = []
    for i, p in enumerate(site.panels):
        if p.lift_day is None:
            continue
        if p.standing_time is not None:
            weeks, source = p.standing_time, "the wall's standing_time"
        elif p.release_after:
            weeks, source = float(planned[i]), "its release events"
        else:
            weeks, source = site.site.construction_period, "the site's construction_period"
        w = WallDays(i, p.mark, p.lift_day, None, weeks, source)
        for s in sorted(signed.get(p.mark, []), key=lambda s: s.day):
            pending = [n for n in p.release_after if events[n].day > s.day]
            if s.day < p.lift_day:
                _flag(w, s.day, "signoff-before-lift", "warning",
                      f"{p.mark}: sign-off by {s.by} on day {s.day} is before its lift on day "
                      f"{p.lift_day}: ignored")
            elif pending:
                _flag(w, s.day, "signoff-before-event", "danger",
                      f"{p.mark}: sign-off by {s.by} on day {s.day} comes before "
                      + ", ".join(f"{n} (day {events[n].day})" for n in pending)
                      + ": the braces stay")
            else:
                w.release = s.day
                break
        if w.release is None:
            _flag(w, p.lift_day, "no-signoff", "notice",
                  f"{p.mark}: no valid sign-off recorded: its braces stay to the end of the "
                  "schedule")
        out.append(w)
    return out


def _flag(w: WallDays, day: int, code: str, severity: str, message: str,
          source: str = RELEASE_SOURCE) -> None:
    w.flags.append(Flag(code, severity, message, source))
    w.flag_days.append(day)


def build_days(site: Site, panels: list[PanelResult], base_dir: str | Path | None = None
               ) -> tuple[list[DayResult], dict, list[tuple[str, Flag]]]:
    """The job day by day, the peak inventory and each wall's schedule flags (see the module).

    `panels` are the wall results of `site` (any order, by mark); the forecast file is read from
    `base_dir` (the site file's folder; default the working folder). Returns (days,
    {"braces": {type: peak}, "anchors": {type: peak}}, [(mark, flag)]).
    """
    walls = wall_days(site)
    if not walls:
        return [], {"braces": {}, "anchors": {}}, []
    forecast = (read_forecast(Path(base_dir or ".") / site.forecast.file, site.site.start_date)
                if site.forecast else {})
    events = {e.name: e.day for e in site.events}
    last = max([w.lift for w in walls] + [w.release or 0 for w in walls]
               + [events[n] for w in walls for n in site.panels[w.index].release_after]
               + [d for w in walls for d in w.flag_days])
    if any(w.release is None for w in walls):  # a wall stands on: forecast days still count
        last = max([last, *forecast])
    days, peak, slips = _days(site, walls, {p.mark: p for p in panels}, forecast, last)
    wall_flags = [(w.mark, f) for w in walls for f in w.flags]
    wall_flags += [item for d in sorted(slips) for item in slips[d]]
    return days, peak, wall_flags


def whole_site(site: Site, panels: list[PanelResult]) -> DayResult:
    """Every wall of the site standing together, as day 0: the sheet of a site file that gives
    no lift days (inventory, stand-down speed; no forecast, no lifts, no releases)."""
    walls = [WallDays(i, p.mark, 1, None, 0.0, "") for i, p in enumerate(site.panels)]
    days, _, _ = _days(site, walls, {p.mark: p for p in panels}, {}, 1)
    return replace(days[0], day=0, lifts=[])


def _days(site: Site, walls: list[WallDays], result: dict[str, PanelResult],
          forecast: dict[int, ForecastDay], last: int):
    """Days 1 to `last` of the scheduled walls: (days, peak inventory, period slips by day)."""
    day = np.arange(1, last + 1)[:, None]                                  # (days, 1)
    lift = np.array([w.lift for w in walls])
    release = np.array([w.release or last + 1 for w in walls])
    standing = (lift <= day) & (day < release)                             # (days, walls)
    in_use = (lift <= day) & (day <= release)  # braces come off after the release sign-off
    gear = [hardware(site.panels[w.index].bracing, result[w.mark]) for w in walls]
    braces, anchors = _counts(gear, lambda g: [(g.brace_type, g.count)]), _counts(
        gear, lambda g: [(g.wall_anchor, g.count), (g.foot_anchor, g.count)])
    brace_use = in_use.astype(int) @ braces[1] if braces[0] else np.zeros((last, 0), int)
    anchor_use = in_use.astype(int) @ anchors[1] if anchors[0] else np.zeros((last, 0), int)
    stand_down = np.array([result[w.mark].stand_down_speed_mph for w in walls], float)
    limit = np.array([result[w.mark].working_limit_speed_mph for w in walls], float)
    slips = _period_slips(walls, result, standing, lift)
    on_day: dict[int, list[Flag]] = {}
    for w in walls:
        for f, fd in zip(w.flags, w.flag_days):
            if f.code != "no-signoff":
                on_day.setdefault(fd, []).append(f)
    lifted, released = _by_day(walls, lambda w: w.lift), _by_day(walls, lambda w: w.release)
    marks = np.array([w.mark for w in walls], dtype=object)
    failing = np.array([result[w.mark].status in STATUS_WORDS for w in walls], dtype=bool)
    failing_flag = dict(zip(np.nonzero(failing)[0].tolist(),
                            _status_flags([w for w, f in zip(walls, failing) if f], result)))
    known_speed = np.isfinite(stand_down)

    days = []
    for n in range(last):  # per day, numpy over the walls: a long job has many of both
        d = n + 1
        up = np.nonzero(standing[n])[0]
        use_b = {t: int(c) for t, c in zip(braces[0], brace_use[n]) if c}
        use_a = {t: int(c) for t, c in zip(anchors[0], anchor_use[n]) if c}
        short = {"braces": _short(use_b, site.brace_types),
                 "anchors": _short(use_a, site.anchor_types)}
        flags = on_day.get(d, []) + [f for _, f in slips.get(d, [])]
        flags += _short_flags(short) + [failing_flag[k] for k in up[failing[up]].tolist()]
        known = up[known_speed[up]]
        gov = int(known[np.argmin(stand_down[known])]) if len(known) else None
        unknown = marks[up[~known_speed[up]]].tolist()
        fc = forecast.get(d)
        go, reason = _go(site, len(up) > 0, None if gov is None else walls[gov], result, unknown,
                         fc)
        days.append(DayResult(
            day=d, date=date_of(site, d),
            lifts=lifted.get(d, []), standing=marks[up].tolist(),
            braces_in_use=use_b, anchors_in_use=use_a, released=released.get(d, []),
            stand_down_speed_mph=None if gov is None else float(stand_down[gov]),
            working_limit_speed_mph=_least(limit[up]),
            governing_wall=None if gov is None else walls[gov].mark,
            forecast_gust_mph=fc.gust_mph if fc else None, storm=bool(fc and fc.storm),
            go=go, reason=reason, short=short, flags=flags))
    peak = {"braces": {t: int(c) for t, c in zip(braces[0], brace_use.max(axis=0))},
            "anchors": {t: int(c) for t, c in zip(anchors[0], anchor_use.max(axis=0))}}
    return days, peak, slips


def _by_day(walls: list[WallDays], day_of) -> dict[int, list[str]]:
    """Marks of the walls by the day `day_of` gives them (lift or release), in site order."""
    out: dict[int, list[str]] = {}
    for w in walls:
        if day_of(w) is not None:
            out.setdefault(day_of(w), []).append(w.mark)
    return out


def _counts(gear: list[Hardware | None], pick) -> tuple[list[str], np.ndarray]:
    """Type names and a (walls, types) matrix of how many of each type every wall uses."""
    names = sorted({t for g in gear if g for t, _ in pick(g) if t})
    matrix = np.zeros((len(gear), len(names)), int)
    for k, g in enumerate(gear):
        for t, c in pick(g) if g else []:
            if t:
                matrix[k, names.index(t)] += c
    return names, matrix


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


def _status_flags(here: list[WallDays], result: dict) -> list[Flag]:
    """Standing walls that fail: unsafe braced walls, walls that need braces and have none."""
    return [Flag(f"{result[w.mark].status.replace('_', '-')}-standing", "danger",
                 f"{w.mark} stands today: {STATUS_WORDS[result[w.mark].status]}",
                 "the wall's checks (`bracing check`)")
            for w in here if result[w.mark].status in STATUS_WORDS]


def _period_slips(walls: list[WallDays], result: dict, standing: np.ndarray, lift: np.ndarray
                  ) -> dict[int, list[tuple[str, Flag]]]:
    """(mark, flag) by day of walls whose standing time passes into a band of higher factor."""
    days = np.arange(1, standing.shape[0] + 1)[:, None]
    weeks = (days - lift + 1) / 7.0                         # standing time on each day, weeks
    needed = np.where(standing, asce37.period_factor(np.maximum(weeks, 0.0)), 0.0)
    out: dict[int, list[tuple[str, Flag]]] = {}
    for k, w in enumerate(walls):
        wind = result[w.mark].wind
        used = wind.period_factor
        checked = (f"the factor {used:.2f} set for the site" if wind.period_factor_from == "set"
                   else f"the {float(asce37.period_band_limit_weeks(w.planned_weeks)):.0f}-week "
                        f"band of its check (planned {w.planned_weeks:.1f} weeks from "
                        f"{w.planned_from}, factor {used:.2f})")
        for n in np.nonzero(needed[:, k] > used + 1e-12)[0]:
            if n > 0 and needed[n - 1, k] == needed[n, k]:
                continue  # flagged when it entered this band
            out.setdefault(int(n) + 1, []).append((w.mark, Flag(
                "period-slip", "warning",
                f"{w.mark}: stood {weeks[n, k]:.1f} weeks on day {n + 1}, past {checked}; "
                f"factor now {needed[n, k]:.2f}: re-check the wall", PERIOD_SOURCE)))
    return out


def _least(values: np.ndarray) -> float | None:
    finite = values[np.isfinite(values)]
    return float(finite.min()) if len(finite) else None


def stand_down_rule(site: Site, panel: PanelResult) -> str:
    """Which site rule set a wall's stand-down speed, with its value and source."""
    ratio = site.rule_value("stand_down_ratio") or 1.0
    if math.isclose(panel.stand_down_speed_mph, ratio * panel.working_limit_speed_mph,
                    rel_tol=1e-6):
        r = site.rule("stand_down_ratio")
        return (f"{r.value:g} x working limit {panel.working_limit_speed_mph:.0f} mph; rule "
                f"stand_down_ratio: {r.source}")
    for name in ("masonry_initial_speed_mph", "masonry_intermediate_speed_mph"):
        value = site.rule_value(name)
        if value is not None and math.isclose(panel.stand_down_speed_mph, value, rel_tol=1e-6):
            return f"rule {name} {value:g} mph: {site.rule(name).source}"
    return "engine"


def _go(site: Site, anyone: bool, gov: WallDays | None, result: dict,
        unknown: list[str], fc: ForecastDay | None) -> tuple[bool | None, str]:
    """The day's go / no-go and its reason (see the module); `anyone`: a wall stands."""
    if not anyone:
        return None, "no walls standing"
    if fc is None:
        return None, "no forecast"
    if fc.storm:
        return False, f"thunderstorm forecast: counts as exceeding the stand-down ({STORM_SOURCE})"
    if unknown:
        return False, (f"no stand-down speed is known for {', '.join(unknown)} (a brace or "
                       "anchor capacity is unknown)")
    p = result[gov.mark]
    compare = (f"forecast gust {fc.gust_mph:.0f} mph {{}} stand-down {p.stand_down_speed_mph:.0f}"
               f" mph of {gov.mark} ({stand_down_rule(site, p)})")
    if fc.gust_mph < p.stand_down_speed_mph:
        return True, compare.format("<")
    return False, compare.format(">=") + ": no lifts, clear the fall zones"
