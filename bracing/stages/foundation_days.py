"""The days of foundation walls (method notes §12): each day's backfill against the height the
wall may take that day; named in `bracing.stages.foundation`.
"""

from __future__ import annotations

from dataclasses import replace

from bracing.foundation_results import BackfillDay
from bracing.model import DEFAULT_RULES, Site
from bracing.stages.foundation_braces import braced_max
from bracing.stages.foundation_cantilever import cantilever_max, engine_wall, soil_of, working_limit
from bracing.wind import gusts


def _events_of(site: Site, w) -> list:
    """The backfill events of a wall: its own, and its line's."""
    return [e for e in site.backfill_events
            if e.wall == w.mark or (e.line is not None and e.line == w.line)]


def _top_support(site: Site, w) -> tuple[int | None, int | None]:
    """(day of the last event the wall waits for, day of the first valid sign-off on or after
    it): released from the cantilever check from that sign-off (OSHA 1926.704(a)'s reading for
    braces, method notes §12)."""
    days = {e.name: e.day for e in site.events}
    if not w.release_after:
        return None, None
    event = max(days[n] for n in w.release_after)
    signed = [s.day for s in site.signoffs if s.panel == w.mark and s.day >= event]
    return event, min(signed, default=None)


class _Allowed:
    """The allowed height of one wall, by surcharge and cure, and its stand-down gust by
    backfill height (each worked once)."""

    def __init__(self, site, w, wind, support):
        self.site, self.w, self.wind, self.support = site, w, wind, support
        self.basis = site.site.design_basis
        self.seen: dict = {}

    def limits(self, surcharge: float, cured: bool) -> tuple[float, float | None]:
        """(the most it takes as a cantilever, with its inside braces or None)."""
        key = (surcharge, cured)
        if key not in self.seen:
            wall = engine_wall(self.site, self.w, cured)
            soil = soil_of(self.site, self.w, surcharge)
            alone = cantilever_max(wall, soil, self.wind, self.basis)
            propped = (braced_max(wall, soil, self.wind, self.support)
                       if self.support is not None and alone < wall.height else None)
            self.seen[key] = (alone, propped)
        return self.seen[key]

    def __call__(self, surcharge: float, cured: bool) -> tuple[float, str]:
        """The most it may take and how it is held: as a cantilever, or on its inside braces
        where they take more."""
        alone, propped = self.limits(surcharge, cured)
        if propped is not None and propped > alone:
            return propped, "inside braces"
        return alone, "cantilever"

    def speeds(self, placed: float, surcharge: float, cured: bool
               ) -> tuple[float | None, float | None]:
        """(working limit, stand-down gust), mph, of the cantilever under `placed` of backfill:
        the stand-down gust is the stand-down ratio x the working limit (None: on its inside
        braces, or nothing exposed)."""
        ratio = self.site.rule_value("stand_down_ratio")
        alone, propped = self.limits(surcharge, cured)
        if ratio is None or (propped is not None and placed > alone + 1e-9):
            return None, None
        key = ("wind", placed, surcharge, cured)
        if key not in self.seen:
            wall = engine_wall(self.site, self.w)
            if not cured:  # fresh masonry stands by its weight alone (method notes §3)
                wall = replace(wall, material="masonry", tension=0.0)
            self.seen[key] = working_limit(wall, soil_of(self.site, self.w, surcharge),
                                           self.wind, placed, self.basis)
        limit = self.seen[key]
        return (None, None) if limit is None else (limit, ratio * limit)


def _cured(site: Site, w, day: int) -> bool:
    """Masonry mortar cured on `day` (the site's masonry_cure_days): its age counted from the
    build day, else from its age on day 1; concrete, and masonry with neither: True (the
    latter with a warning)."""
    if site.materials[w.material].kind != "masonry":
        return True
    cure = site.rule_value("masonry_cure_days") or DEFAULT_RULES["masonry_cure_days"].value
    if w.build_day is not None:
        return day - w.build_day >= cure
    return w.mortar_age is None or w.mortar_age + day - 1 >= cure


def braces_in_use(site: Site, w, days: list[BackfillDay], allowed: _Allowed
                  ) -> tuple[int | None, int | None]:
    """(the first day the backfill needs the wall's inside braces, its release day): they are
    counted in use against on_hand from that day through the release (None: to the schedule's
    end), even on a later day the cantilever would take the fill (conservative; method notes
    §12). (None, None): never needed."""
    needed = [d.day for d in days if d.support != "top support" and d.planned_height_ft
              > allowed.limits(d.surcharge_psf, _cured(site, w, d.day))[0] + 1e-6]
    if not needed:
        return None, None
    return min(needed), _top_support(site, w)[1]


def wall_days(site: Site, w, allowed: _Allowed, last: int) -> list[BackfillDay]:
    """The wall's days from its build day (or day 1) to `last`: the backfill in place, the
    most it may take, and whether it is over."""
    events = _events_of(site, w)
    standing = soil_of(site, w).surcharge
    released = _top_support(site, w)[1]
    out = []
    for d in range(w.build_day or 1, last + 1):
        placed = max((e.height for e in events if e.day <= d), default=0.0)
        surcharge = max([standing] + [e.surcharge for e in events
                                      if e.day == d and e.surcharge is not None])
        working = stand_down = None
        if released is not None and d >= released:
            limit, support = w.height, "top support"
        else:
            limit, support = allowed(surcharge, _cured(site, w, d))
            if placed <= limit + 1e-6:  # over its limit, the danger speaks, not the wind
                working, stand_down = allowed.speeds(placed, surcharge, _cured(site, w, d))
        out.append(BackfillDay(day=d, planned_height_ft=placed, allowed_height_ft=limit,
                               surcharge_psf=surcharge, support=support,
                               over=placed > limit + 1e-6, working_limit_speed_mph=working,
                               stand_down_speed_mph=stand_down,
                               sustained_equivalents_mph=None if stand_down is None else {
                                   k: float(v) for k, v in
                                   gusts.sustained_equivalents(stand_down).items()}))
    return out
