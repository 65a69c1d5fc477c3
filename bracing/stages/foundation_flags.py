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


def windy_days(walls: list[FoundationWallResult], days) -> list:
    """The days whose forecast gust (or a thunderstorm) reaches the stand-down gust of a
    foundation wall standing as a cantilever that day: the wind part's stand-down (method notes
    §12). Each such day gets `wind_go` False and a sentence naming the walls; returns them."""
    changed = []
    for d in days:
        if d.forecast_gust_mph is None and not d.storm:
            continue
        low = [(x.stand_down_speed_mph, w.mark) for w in walls for x in w.days
               if x.day == d.day and x.stand_down_speed_mph is not None
               and (d.storm or d.forecast_gust_mph >= x.stand_down_speed_mph)]
        if low:
            names = ", ".join(f"{mark} ({speed:.0f} mph)" for speed, mark in sorted(low))
            d.wind_go = False
            d.wind = (d.wind + "; " if d.wind else "") + (
                f"forecast reaches the stand-down gust of foundation wall(s) {names}, the wind "
                "on the part above the backfill: no work beside them, clear their zones")
            changed.append(d)
    return changed


def not_checked(site: Site) -> list[NotChecked]:
    """What the foundation walls' checks leave out (method notes §12), with the walls."""
    walls = [w.mark for w in site.foundation_walls]
    braced_walls = [w.mark for w in site.foundation_walls if w.inside_braces is not None]
    items = [NotChecked(
        item="foundation walls: the wall-to-footing joint and the footing's bearing",
        reason="the wall is taken as a cantilever fixed in its footing (dowels, key) and the "
               "soil's bearing under the footing is not checked; after its release the wall "
               "held top and bottom is the permanent design's", source=SOURCE, walls=walls)]
    if braced_walls:
        items.append(NotChecked(
            item="inside braces of foundation walls",
            reason="their count is not compared with the brace and anchor types' on_hand, and "
                   "the propped wall's span under the wind above the brace is not checked",
            source=SOURCE, walls=braced_walls))
    return items if walls else []
