"""`bracing diff` of foundation walls backfilled before the floor (method notes §12).

Foundation walls are matched by mark. For every one whose inputs or results changed it gives,
before and after: whether it fails (`FoundationWallResult.fails`), its utilization as checked,
the backfill it is allowed as a cantilever and with its inside braces, the inside braces'
utilization, its working-limit and stand-down gusts, and each day whose planned fill, allowed
height or verdict changed. It got worse when:

- its utilization rose and is now above 1.0;
- a day's planned fill is now above the height allowed that day and was not before;
- its working-limit gust fell below the stand-down gust it had before; or
- it fails now and did not before (a danger finding).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from bracing.diff import SAME_SPEED_MPH, SAME_UTILIZATION, Change, matched
from bracing.diff import _change_text as change_text
from bracing.diff import _mph as mph
from bracing.diff import _same_speed as same_speed
from bracing.diff import _u as utilization
from bracing.results import SiteResult

SAME_FORCE = 1e-3  # relative: a brace force within 0.1 % is the same

SAME_HEIGHT_FT = 0.005  # heights closer than this are the same (they are printed to 0.01 ft)


@dataclass(slots=True)
class FillDayChange:
    """A day of a foundation wall whose planned fill, allowed height or verdict changed (ft
    above the footing; None: the wall does not stand that day in that file)."""

    day: int
    old_planned_height_ft: float | None
    new_planned_height_ft: float | None
    old_allowed_height_ft: float | None
    new_allowed_height_ft: float | None
    old_over: bool | None          # planned above allowed: a danger
    new_over: bool | None


@dataclass(slots=True)
class FoundationWallChange:
    """A foundation wall in both files whose inputs or results changed. Heights in ft above
    the footing; gusts in mph (None: the wind does not govern it); the inside braces' values
    None where it has none."""

    mark: str
    changes: list[Change]
    old_fails: bool
    new_fails: bool
    old_utilization: float
    new_utilization: float
    old_max_height_ft: float        # the backfill it takes as a cantilever
    new_max_height_ft: float
    old_braced_max_height_ft: float | None  # ... with its inside braces
    new_braced_max_height_ft: float | None
    old_brace_utilization: float | None
    new_brace_utilization: float | None
    old_brace_force_lb: float | None  # each inside brace's force as checked
    new_brace_force_lb: float | None
    old_working_limit_mph: float | None
    new_working_limit_mph: float | None
    old_stand_down_mph: float | None
    new_stand_down_mph: float | None
    days: list[FillDayChange] = field(default_factory=list)
    worse: list[str] = field(default_factory=list)  # why the wall got worse, if it did

    def lines(self) -> list[str]:
        """The wall before and after, in words (`bracing diff`)."""
        lines = [f"  {self.mark}: {_verdict(self.old_fails)} -> {_verdict(self.new_fails)}"]
        lines += [f"    {c.kind}: {change_text(c)}" for c in self.changes]
        if not self.changes:
            lines.append("    its own inputs are unchanged: the backfill, its events or the "
                         "rules changed")
        lines.append(f"    utilization as checked {utilization(self.old_utilization)} -> "
                     f"{utilization(self.new_utilization)}")
        lines.append(f"    allowed backfill as a cantilever {_ft(self.old_max_height_ft)} -> "
                     f"{_ft(self.new_max_height_ft)}")
        if self.old_braced_max_height_ft is not None or self.new_braced_max_height_ft is not None:
            lines.append(f"    allowed backfill with its inside braces "
                         f"{_ft(self.old_braced_max_height_ft)} -> "
                         f"{_ft(self.new_braced_max_height_ft)}; inside-brace utilization "
                         f"{_maybe(self.old_brace_utilization)} -> "
                         f"{_maybe(self.new_brace_utilization)}; brace force "
                         f"{_lb(self.old_brace_force_lb)} -> {_lb(self.new_brace_force_lb)}")
        gusts = (self.old_working_limit_mph, self.new_working_limit_mph,
                 self.old_stand_down_mph, self.new_stand_down_mph)
        lines.append(f"    working-limit gust {_gust(gusts[0])} -> {_gust(gusts[1])}; "
                     f"stand-down gust {_gust(gusts[2])} -> {_gust(gusts[3])}"
                     + (" (none: the wind does not govern)" if None in gusts else ""))
        lines += [f"    {_days(run)}: {_day_text(run[0])}" for run in _runs(self.days)]
        lines += [f"    WORSE x: {why}" for why in self.worse]
        return lines


def compare_walls(old: SiteResult, new: SiteResult, changes: dict[str, list[Change]]
                  ) -> tuple[list[FoundationWallChange], list[str], list[str]]:
    """(the foundation walls in both files that changed, the marks added, the marks removed)."""
    pairs, added, removed = matched(old.foundation_walls, new.foundation_walls)
    records = [_change(a, b, changes.get(b.mark, [])) for a, b in pairs]
    return [r for r in records if r.changes or r.days or _moved(r)], added, removed


def _change(a, b, changes: list[Change]) -> FoundationWallChange:
    """The record of one foundation wall, a (old) and b (new) FoundationWallResult."""
    brace_a, brace_b = a.inside_brace, b.inside_brace
    record = FoundationWallChange(
        mark=b.mark, changes=changes, old_fails=a.fails, new_fails=b.fails,
        old_utilization=a.utilization, new_utilization=b.utilization,
        old_max_height_ft=a.max_height_ft, new_max_height_ft=b.max_height_ft,
        old_braced_max_height_ft=brace_a and brace_a.max_height_ft,
        new_braced_max_height_ft=brace_b and brace_b.max_height_ft,
        old_brace_utilization=brace_a and brace_a.utilization,
        new_brace_utilization=brace_b and brace_b.utilization,
        old_brace_force_lb=brace_a and brace_a.force_lb,
        new_brace_force_lb=brace_b and brace_b.force_lb,
        old_working_limit_mph=a.wind.working_limit_speed_mph,
        new_working_limit_mph=b.wind.working_limit_speed_mph,
        old_stand_down_mph=a.wind.stand_down_speed_mph,
        new_stand_down_mph=b.wind.stand_down_speed_mph,
        days=_day_changes(a.days, b.days))
    record.worse = _worse(record, b)
    return record


def _day_changes(old: list, new: list) -> list[FillDayChange]:
    """The days (bracing.foundation_results.BackfillDay) whose fill, limit or verdict moved."""
    a, b = {d.day: d for d in old}, {d.day: d for d in new}
    out = []
    for day in sorted(a.keys() | b.keys()):
        x, y = a.get(day), b.get(day)
        change = FillDayChange(
            day=day, old_planned_height_ft=x and x.planned_height_ft,
            new_planned_height_ft=y and y.planned_height_ft,
            old_allowed_height_ft=x and x.allowed_height_ft,
            new_allowed_height_ft=y and y.allowed_height_ft,
            old_over=x and x.over, new_over=y and y.over)
        if not (_same_height(change.old_planned_height_ft, change.new_planned_height_ft)
                and _same_height(change.old_allowed_height_ft, change.new_allowed_height_ft)
                and change.old_over == change.new_over):
            out.append(change)
    return out


def _moved(w: FoundationWallChange) -> bool:
    """Its results changed (inputs aside)."""
    return (w.old_fails != w.new_fails
            or abs(w.old_utilization - w.new_utilization) > SAME_UTILIZATION
            or not _same_height(w.old_max_height_ft, w.new_max_height_ft)
            or not _same_height(w.old_braced_max_height_ft, w.new_braced_max_height_ft)
            or not _same_optional(w.old_brace_utilization, w.new_brace_utilization)
            or not _same_force(w.old_brace_force_lb, w.new_brace_force_lb)
            or not _same_gust(w.old_working_limit_mph, w.new_working_limit_mph))


def _worse(w: FoundationWallChange, result) -> list[str]:
    """Why the wall got worse (module docstring), from its record and its new result."""
    why = []
    if w.new_utilization > 1.0 and w.new_utilization > w.old_utilization + SAME_UTILIZATION:
        why.append(f"utilization rose to {utilization(w.new_utilization)}, above 1.0")
    over = [d for d in w.days if d.new_over and not d.old_over]
    why += [f"{_days(run)}: the planned fill {_ft(run[0].new_planned_height_ft)} is above the "
            f"{_ft(run[0].new_allowed_height_ft)} allowed" for run in _runs(over)]
    if (w.new_working_limit_mph is not None and w.old_stand_down_mph is not None
            and w.new_working_limit_mph < w.old_stand_down_mph - SAME_SPEED_MPH):
        why.append(f"working-limit gust {mph(w.new_working_limit_mph)} is below the stand-down "
                   f"gust it had before, {mph(w.old_stand_down_mph)}")
    if w.new_fails and not w.old_fails and not why:
        danger = next((f.message for f in result.flags if f.severity == "danger"),
                      "a check over capacity")
        why.append(f"it fails now: {danger}")
    return why


def _same_height(a: float | None, b: float | None) -> bool:
    if a is None or b is None:
        return a is b
    if not (math.isfinite(a) and math.isfinite(b)):
        return a == b
    return abs(a - b) < SAME_HEIGHT_FT


def _same_optional(a: float | None, b: float | None) -> bool:
    if a is None or b is None:
        return a is b
    return abs(a - b) <= SAME_UTILIZATION


def _same_force(a: float | None, b: float | None) -> bool:
    if a is None or b is None:
        return a is b
    return math.isclose(a, b, rel_tol=SAME_FORCE)


def _same_gust(a: float | None, b: float | None) -> bool:
    if a is None or b is None:
        return a is b
    return same_speed(a, b)


def _verdict(fails: bool) -> str:
    return "FAILS x" if fails else "passes"


def _ft(value: float | None) -> str:
    if value is None:
        return "none"
    return "unbounded" if math.isinf(value) else f"{value:.2f} ft"


def _lb(value: float | None) -> str:
    return "none" if value is None else f"{value:,.0f} lb"


def _maybe(value: float | None) -> str:
    return "none" if value is None else utilization(value)


def _gust(value: float | None) -> str:
    return "none" if value is None else mph(value)


def _runs(days: list[FillDayChange]) -> list[list[FillDayChange]]:
    """Consecutive days with the same change, together (a change that holds for a week is
    one line)."""
    runs: list[list[FillDayChange]] = []
    for d in days:
        last = runs[-1][-1] if runs else None
        if last is not None and last.day == d.day - 1 and _day_text(last) == _day_text(d):
            runs[-1].append(d)
        else:
            runs.append([d])
    return runs


def _days(run: list[FillDayChange]) -> str:
    first, last = run[0].day, run[-1].day
    return f"day {first}" if first == last else f"days {first}-{last}"


def _day_text(d: FillDayChange) -> str:
    over = "; OVER the allowed height" if d.new_over else ""
    return (f"planned fill {_ft(d.old_planned_height_ft)} -> {_ft(d.new_planned_height_ft)}, "
            f"allowed {_ft(d.old_allowed_height_ft)} -> {_ft(d.new_allowed_height_ft)}{over}")
