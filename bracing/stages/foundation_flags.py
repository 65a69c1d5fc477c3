"""The findings of foundation walls (method notes §12): their flags, the days' dangers and
stand-downs, and what their checks leave out; named in `bracing.stages.foundation`.
"""

from __future__ import annotations

from bracing import backfill
from bracing.foundation_results import BackfillDay, FoundationWallResult
from bracing.model import Site
from bracing.results import Flag, NotChecked
from bracing.stages.foundation_days import _top_support

SOURCE = "method notes §12"


def over_flag(mark: str, d: BackfillDay) -> Flag:
    """The danger of a day whose backfill is above what the wall may take."""
    return Flag("backfill-over-limit", "danger",
                f"{mark}: backfill {d.planned_height_ft:.1f} ft on day {d.day} is above the "
                f"{d.allowed_height_ft:.1f} ft it may take before the floor ({d.support}): "
                "stop the backfill, or brace the wall inside first", SOURCE)


def _flags(site: Site, w, wall: backfill.Wall, days: list[BackfillDay]) -> list[Flag]:
    """The wall's findings: each day over its limit, and what the input leaves unsaid."""
    flags = [over_flag(w.mark, d) for d in days if d.over]
    b = w.backfill or site.backfill
    if not b.drained and b.water_level is None:
        flags.append(Flag("backfill-drainage-not-stated", "warning",
                          f"{w.mark}: no water level and no working drains stated: checked "
                          "dry; give water_level or drained = true", SOURCE))
    if w.footing is None:
        flags.append(Flag("backfill-footing-not-given", "warning",
                          f"{w.mark}: no footing given: overturning and sliding not checked",
                          SOURCE))
    masonry = site.materials[w.material].kind == "masonry"
    if masonry and w.mortar_age is None and w.build_day is None:
        flags.append(Flag("backfill-mortar-age-not-given", "warning",
                          f"{w.mark}: mortar age and build day not given: taken as cured",
                          SOURCE))
    event = _top_support(site, w)[0]
    early = [s for s in site.signoffs if s.panel == w.mark and event is not None
             and s.day < event]
    flags += [Flag("backfill-signoff-before-floor", "warning",
                   f"{w.mark}: sign-off by {s.by} on day {s.day} comes before its floor event "
                   f"(day {event}): ignored, the wall stays a cantilever",
                   "OSHA 29 CFR 1926.704(a)'s reading; " + SOURCE) for s in early]
    if not w.release_after:
        flags.append(Flag("backfill-no-top-support", "notice",
                          f"{w.mark}: no floor event named (release_after): checked as a "
                          "cantilever to the end of the schedule", SOURCE))
    return flags


def day_flags(walls: list[FoundationWallResult]) -> dict[int, list[Flag]]:
    """Each day's backfill dangers (for the day's verdict), by day."""
    out: dict[int, list[Flag]] = {}
    for w in walls:
        for d in w.days:
            if d.over:
                out.setdefault(d.day, []).append(over_flag(w.mark, d))
    return out


def site_flags(walls: list[FoundationWallResult]) -> list[Flag]:
    """Each foundation wall's first day over its limit, as a finding of the site (the wall
    named, its day given; the days carry every day of it)."""
    return [next(f for f in w.flags if f.code == "backfill-over-limit") for w in walls
            if any(d.over for d in w.days)]


def stand_on_days(walls: list[FoundationWallResult], days) -> list:
    """The foundation walls standing each day before their top support (as cantilevers or on
    inside braces) in `DayResult.foundation_standing`, and the day's wind against them (method
    notes §12): the stand-down gust of their wind part joins the day's lowest; a forecast gust
    at or above it, or a thunderstorm, makes the day NO-GO by wind; a day on which only
    foundation walls stand is judged by their gusts alone. Returns the days they stand on."""
    changed = []
    for d in days:
        standing = [(w.mark, x) for w in walls for x in w.days
                    if x.day == d.day and x.support != "top support"]
        if not standing:
            continue
        d.foundation_standing = [mark for mark, _ in standing]
        gusts = sorted((x.stand_down_speed_mph, mark) for mark, x in standing
                       if x.stand_down_speed_mph is not None)
        if gusts and (d.stand_down_speed_mph is None or gusts[0][0] < d.stand_down_speed_mph):
            d.stand_down_speed_mph, d.governing_wall = gusts[0]
        limits = [x.working_limit_speed_mph for _, x in standing
                  if x.working_limit_speed_mph is not None]
        if limits and (d.working_limit_speed_mph is None
                       or min(limits) < d.working_limit_speed_mph):
            d.working_limit_speed_mph = min(limits)
        _wind_on_day(d, gusts)
        changed.append(d)
    return changed


def _wind_on_day(d, gusts: list[tuple[float, str]]) -> None:
    """The day's wind go / no-go with the foundation walls' stand-down gusts (`gusts`, lowest
    first) beside the panels' (already on the day)."""
    if d.forecast_gust_mph is None and not d.storm:
        if not d.standing:
            d.wind_go, d.wind = None, "no forecast"
        return
    low = [(speed, mark) for speed, mark in gusts if d.storm or d.forecast_gust_mph >= speed]
    if low or (d.storm and not d.standing):
        names = ", ".join(f"{mark} ({speed:.0f} mph)" for speed, mark in low)
        d.wind_go = False
        d.wind = (d.wind + "; " if d.standing and d.wind else "") + (
            f"forecast reaches the stand-down gust of foundation wall(s) {names}, the wind "
            "on the part above the backfill: no work beside them, clear their zones" if names
            else "thunderstorm forecast: counts as exceeding the stand-down gust of the "
                 "foundation walls standing")
    elif not d.standing:  # only foundation walls stand: their gusts decide
        d.wind_go = True
        d.wind = (f"forecast gust {d.forecast_gust_mph:.0f} mph < stand-down "
                  f"{gusts[0][0]:.0f} mph of foundation wall {gusts[0][1]} (the wind on the "
                  "part above the backfill)" if gusts else
                  "no foundation wall standing has a stand-down gust (braced inside, or no "
                  "part above the backfill takes the wind)")


def not_checked(site: Site) -> list[NotChecked]:
    """What the foundation walls' checks leave out (method notes §12), with the walls."""
    walls = [w.mark for w in site.foundation_walls]
    items = [NotChecked(
        item="foundation walls: the wall-to-footing joint and the footing's bearing",
        reason="the wall is taken as a cantilever fixed in its footing (dowels, key) and the "
               "soil's bearing under the footing is not checked; after its release the wall "
               "held top and bottom is the permanent design's", source=SOURCE, walls=walls)]
    braced_walls = [w.mark for w in site.foundation_walls if w.inside_braces is not None]
    if braced_walls:
        items.append(NotChecked(
            item="foundation walls on inside braces: the wall spanning between the braces",
            reason="each brace is taken to hold its strip of wall (its spacing) along a line at "
                   "its height; the wall's horizontal span between the braces (or the waler "
                   "that spreads their push) is not checked",
            source=SOURCE, walls=braced_walls))
    return items if walls else []
