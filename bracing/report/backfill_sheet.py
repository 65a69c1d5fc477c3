"""The foundation walls on a day's sheet (method notes §12): each wall's allowed and planned
backfill height that day, a danger where the plan is higher, worst first; their section
sketches; and the same in text for the crew sheet and the `check` report.

Every value comes from the result (`SiteResult.foundation_walls`, records of
bracing.foundation_results); this module picks and formats them. The sketches' numbers are
built by bracing.backfill_profile.
"""

from __future__ import annotations

from dataclasses import dataclass

from bracing.report.text import fmt

SOURCE = "method notes §12"
SUPPORT_WORDS = {"cantilever": "as a cantilever (no top support yet)",
                 "inside braces": "with its inside braces", "top support": "floor on: top support"}


@dataclass
class BackfillRow:
    """One foundation wall on a day's sheet, formatted in the chosen units."""

    mark: str
    planned: str
    allowed: str
    support: str
    danger: bool
    symbol: str
    word: str
    action: str
    brace: str = ""  # the inside braces as the crew sets them, where the wall has them


def _day_of(wall, day: int):
    """The wall's record of `day` (bracing.foundation_results.BackfillDay), or None."""
    return next((d for d in wall.days if d.day == day), None)


def rows(result, day: int, units: str = "us") -> list[BackfillRow]:
    """The foundation walls standing without their top support on `day` (built, the floor not
    yet holding them), the dangers first, then by how close the plan comes to what is
    allowed."""
    found = [(w, d) for w in getattr(result, "foundation_walls", []) or []
             if (d := _day_of(w, day)) is not None and d.support != "top support"]
    found.sort(key=lambda wd: (not wd[1].over, wd[1].allowed_height_ft - wd[1].planned_height_ft,
                               wd[0].mark))
    return [_row(w, d, units) for w, d in found]


def _row(w, d, units: str) -> BackfillRow:
    planned = fmt(d.planned_height_ft, "ft", units, 1)
    allowed = fmt(d.allowed_height_ft, "ft", units, 1)
    if d.over:
        action = (f"stop the backfill at {allowed} until the floor is on"
                  + (" or inside braces are set" if d.support == "cantilever" else ""))
    else:
        action = f"backfill no higher than {allowed} today"
    b = w.inside_brace
    brace = "" if b is None or d.support != "inside braces" else (
        f"inside braces {b.brace_type} at {fmt(b.height_ft, 'ft', units, 1)} on the wall, every "
        f"{fmt(b.spacing_ft, 'ft', units, 1)}, {b.angle_deg:.0f}°, "
        f"{fmt(b.force_lb, 'lbf', units)} each")
    return BackfillRow(mark=w.mark, planned=planned, allowed=allowed,
                       support=SUPPORT_WORDS.get(d.support, d.support), danger=d.over,
                       symbol="✖" if d.over else "✔", word="DANGER" if d.over else "ok",
                       action=action, brace=brace)


def text_lines(found: list[BackfillRow]) -> list[str]:
    """The day's foundation walls in text, worst first (none: no lines)."""
    if not found:
        return []
    lines = [f"BACKFILL BEFORE THE FLOOR ({len(found)} foundation wall(s); heights above the "
             f"top of the footing; {SOURCE})"]
    for r in found:
        lines.append(f"  {r.symbol} {r.word}: {r.mark}: planned {r.planned}, allowed "
                     f"{r.allowed} {r.support}: {r.action}")
        if r.brace:
            lines.append(f"      {r.brace}")
    return lines


def sketches(result, day: int, units: str = "us") -> list[tuple[str, str]]:
    """(mark, SVG) of each foundation wall's section on `day` at that day's backfill, in the
    order of `rows`; none once the floor holds its top (the sketches are the result's)."""
    from bracing.report.svg.backfill import backfill_section_svg

    by_mark = {w.mark: w for w in result.foundation_walls}
    out = []
    for r in rows(result, day, units):
        picture = by_mark[r.mark].sketches.get(day)
        if picture is not None:
            out.append((r.mark, backfill_section_svg(picture, units=units, notes=False)))
    return out


def wall_lines(result, system: str = "us") -> list[str]:
    """The foundation walls in the `check` report, failing ones first: the backfill planned
    before the floor against the most the wall takes, the day by day heights, the inside
    braces, the flags and every check (none: no lines)."""
    from bracing.report.text import SYMBOL, check_line

    walls = sorted(getattr(result, "foundation_walls", []) or [],
                   key=lambda w: (not w.fails, -w.utilization, w.mark))
    if not walls:
        return []
    lines = ["", f"FOUNDATION WALLS BACKFILLED BEFORE THE FLOOR ({len(walls)}; heights above the "
             f"top of the footing; {SOURCE})"]
    for w in walls:
        held = "inside braces" if w.inside_brace is not None else "cantilever"
        lines += ["", f"{w.mark}  {w.material.replace('_', ' ')}  "
                  f"{fmt(w.height_ft, 'ft', system, 1)} tall x "
                  f"{fmt(w.thickness_in, 'in', system, 2)}: "
                  f"{'FAILS' if w.fails else 'passes'} (utilization {w.utilization:.2f}, {held})",
                  f"  planned {fmt(w.planned_height_ft, 'ft', system, 1)}"
                  + (f" (day {w.planned_day})" if w.planned_day is not None else "")
                  + f"; most before the floor as a cantilever "
                  f"{fmt(w.max_height_ft, 'ft', system, 1)}"
                  + ("" if w.inside_brace is None else
                     ", with its inside braces "
                     f"{fmt(w.inside_brace.max_height_ft, 'ft', system, 1)}")]
        days = day_runs(w.days, system)
        if days:
            lines.append("  by day (planned of allowed): " + "; ".join(days))
        lines += [f"  {SYMBOL[f.severity]} {f.severity.upper()}: {f.message} [{f.source}]"
                  for f in sorted(w.flags, key=lambda f: ("danger", "warning", "notice").index(
                      f.severity))]
        lines += [check_line(c, system) for c in sorted(w.checks, key=lambda c: -c.utilization)]
    return lines


def day_runs(days, system: str = "us") -> list[str]:
    """A wall's days in words, days alike (the same heights, support and danger) in one run:
    'days 2-6: 0.0 ft of 2.7 ft', 'day 7: 5.0 ft of 2.3 ft DANGER', 'from day 10: top
    support'."""
    runs: list[list] = []
    for d in days:
        said = ("top support" if d.support == "top support" else
                f"{fmt(d.planned_height_ft, 'ft', system, 1)} of "
                f"{fmt(d.allowed_height_ft, 'ft', system, 1)}"
                + (" with inside braces" if d.support == "inside braces" else "")
                + (" DANGER" if d.over else ""))
        if runs and runs[-1][2] == said and runs[-1][1] == d.day - 1:
            runs[-1][1] = d.day
        else:
            runs.append([d.day, d.day, said])
    out = []
    for k, (first, last, said) in enumerate(runs):
        when = (f"from day {first}" if said == "top support" and k == len(runs) - 1 else
                f"day {first}" if first == last else f"days {first}-{last}")
        out.append(f"{when}: {said}")
    return out
