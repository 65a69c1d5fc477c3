"""The day's verdict (method notes §6, Day verdict): GO, GO WITH EXCEPTIONS, NO-GO or NO CALL,
with the day's findings grouped once (`judge`), from each wall's facts worked once for all days
(`wall_facts`)."""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from bracing.braced import SERVICEABILITY
from bracing.results import DayFinding, DayResult, PanelResult

MARGINAL = 0.9  # a forecast at or above 0.9 x the stand-down gust is marginal (method notes §6)
VERDICT_SOURCE = "method notes §6, Day verdict"
RESTATED = ("unsafe-standing", "needs-braces-standing")  # the verdict names these walls itself
SEVERITY_RANK = {"danger": 0, "warning": 1, "notice": 2}
# The codes of the walls' schedule flags (each also on the day it happens).
SCHEDULE_CODES = ("signoff-before-lift", "signoff-before-event", "no-signoff", "period-slip")
NEEDS_BRACES = (0, "needs-braces", "cannot stand on its own and has no braces",
                "the wall's checks")
STRUCK = (1, "struck-brace", "today's forecast exceeds the wall's working limit with one brace "
          "struck (shown beside it): keep equipment clear of the braces and replace a struck "
          "brace before work goes on", VERDICT_SOURCE)


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
        for key in _findings_of_wall(p, fails[k]):
            rows.setdefault(key, []).append(k)
    return WallFacts(
        marks=np.array(list(panels), dtype=object), index={m: k for k, m in enumerate(panels)},
        keys={key: np.unique(np.array(r, int)) for key, r in rows.items()},
        fails=np.array(fails, bool),
        struck=np.array([(p.braces.get("working_limit_one_missing_mph") or 0.0) if p.braces
                         else np.nan for p in panels.values()], float))


def _findings_of_wall(p: PanelResult, fails: bool) -> list[tuple]:
    """A wall's findings as (rank, code, message, source) keys."""
    out = [NEEDS_BRACES] if p.status == "needs_braces" else []
    for c in p.checks if fails else ():  # why it fails (PanelResult.fails decides)
        if not c.passes and c.element not in SERVICEABILITY:  # a crack: its warning says
            out.append((0, "check-fails", f"{c.element} ({c.region}) over capacity "
                        f"({c.combination})", c.source))
    for f in p.flags:  # a danger "...-over" repeats a failing check: listed as that
        if f.severity != "notice" and f.code not in SCHEDULE_CODES and not (
                f.severity == "danger" and f.code.endswith("-over") and fails):
            out.append((SEVERITY_RANK[f.severity], f.code, f.message, f.source))
    return out


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
    code, message and source, with the walls it holds for (in site order). A new kind of day
    finding needs no change here: a day rule (`bracing.schedule.days.DAY_RULES`) adds its
    flag, and a danger fails the walls it names, or the day when it names none."""
    facts = facts or wall_facts(panels)
    up, found = facts.standing(d.standing)
    of_day = _of_day(d, facts, up)
    groups = {key: list(marks) for key, marks in of_day.items()}
    for key, marks in found:  # the walls' own, worked once for the walls standing
        groups[key] = list(dict.fromkeys(groups[key] + marks)) if key in groups else marks
    struck = _struck(d, facts, up)
    if struck:
        groups[STRUCK] = struck
    # a finding's marks may be shared by the days that stand the same walls: never changed
    listed = [DayFinding(code, ("danger", "warning", "notice")[rank], message, source, marks)
              for (rank, code, message, source), marks in sorted(
                  groups.items(), key=lambda item: item[0][0])]
    d.why = [f for f in listed if f.severity == "danger"]
    d.findings = [f for f in listed if f.severity != "danger"]
    failing = up & facts.fails  # a wall's own dangers make it fail; and those the day names:
    failing[[facts.index[m] for key, marks in of_day.items() if key[0] == 0 for m in marks]] = True
    lifts = set(d.lifts)
    d.do_not_lift = [m for m in d.lifts if failing[facts.index[m]]]
    d.failing_standing = [m for m in facts.marks[failing].tolist() if m not in lifts]
    _verdict(d)
    return d


def _of_day(d: DayResult, facts: WallFacts, up: np.ndarray) -> dict[tuple, dict[str, None]]:
    """The day's own findings (its flags but those the verdict restates) by key (rank, code,
    message, source), with the standing walls they name ("MARK: message")."""
    of_day: dict[tuple, dict[str, None]] = {}
    for f in d.flags:
        if f.code in RESTATED:
            continue
        head, _, rest = f.message.partition(": ")
        key = (SEVERITY_RANK[f.severity], f.code)
        if rest and head in facts.index and up[facts.index[head]]:
            of_day.setdefault(key + (rest, f.source), {})[head] = None
        else:
            of_day.setdefault(key + (f.message, f.source), {})
    return of_day


def _struck(d: DayResult, facts: WallFacts, up: np.ndarray) -> list[str]:
    """The standing walls whose working limit with one brace struck the day's forecast exceeds
    (a thunderstorm: every braced wall; design.md §6: a warning)."""
    gust = d.forecast_gust_mph
    if not (d.storm or gust is not None):
        return []
    with np.errstate(invalid="ignore"):
        struck = up & ~np.isnan(facts.struck) & (d.storm or facts.struck < (gust or 0.0))
    return facts.marks[struck].tolist() if struck.any() else []


def _verdict(d: DayResult) -> None:
    """The verdict, `go`, reason and marginal flag of a day whose failing walls are set."""
    day_danger = [f for f in d.why if not f.marks]
    parts = []
    if d.failing_standing:
        parts.append(f"{', '.join(d.failing_standing)} stand and fail: keep everyone out of "
                     "their zones until they are made safe")
    parts += [f.message for f in day_danger]
    if d.do_not_lift:
        parts.append(f"do not lift {', '.join(d.do_not_lift)}")
    if d.failing_standing or day_danger or d.wind_go is False:
        d.verdict = "NO-GO"
    elif not (d.standing or d.foundation_standing) or d.wind_go is None:
        d.verdict = "NO CALL"
    else:
        d.verdict = "GO WITH EXCEPTIONS" if d.do_not_lift else "GO"
    d.go = {"GO": True, "NO CALL": None}.get(d.verdict, False)
    d.reason = "; ".join(parts + [d.wind])
    gust, stand_down = d.forecast_gust_mph, d.stand_down_speed_mph
    d.marginal = bool(d.wind_go and gust is not None and stand_down
                      and gust >= MARGINAL * stand_down)
