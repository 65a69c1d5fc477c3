"""Period slips: a wall standing into a band of ASCE 37-14 Table 6.2-1 whose factor is above
the one its wind check used is flagged `period-slip` (warning), once per band."""

from __future__ import annotations

import numpy as np

from bracing import lines
from bracing.model import Site
from bracing.results import Flag, PanelResult
from bracing.schedule.walls import Scheduled
from bracing.wind import asce37

PERIOD_SOURCE = "ASCE 37-14 Table 6.2-1"
PLANNED_FROM = np.array(["the wall's standing_time", "its release events",
                         "the site's construction_period"], dtype=object)


def period_slips(site: Site, walls: Scheduled, results: list[PanelResult], release: np.ndarray,
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
    checked = _checked_all(site, walls, results, np.unique(k))
    out: dict[int, list[tuple[str, Flag]]] = {}
    for d, j, mark, weeks, now in zip(on.tolist(), k.tolist(), walls.marks[k].tolist(),
                                      (stood[band] / 7.0).tolist(), factor[band].tolist(),
                                      strict=True):
        out.setdefault(d, []).append((mark, Flag(
            "period-slip", "warning", f"{mark}: stood {weeks:.1f} weeks on day {d}, past "
            f"{checked[j]}; factor now {now:.2f}: re-check the wall", PERIOD_SOURCE)))
    return out


def _checked_all(site: Site, walls: Scheduled, results: list[PanelResult],
                 slipping: np.ndarray) -> dict[int, str]:
    """What the wind check of each of the walls `slipping` took its factor from."""
    planned, planned_from = _planned(site, walls.index[slipping], walls.lift[slipping],
                                     walls.event_day[slipping])
    return {j: _checked(results[j].wind, limit, weeks, source) for j, limit, weeks, source
            in zip(slipping.tolist(), asce37.period_band_limit_weeks(planned).tolist(),
                   planned.tolist(), planned_from.tolist(), strict=True)}


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


def _checked(wind, band_weeks: float, planned_weeks: float, planned_from: str) -> str:
    """What a wall's wind check took its period factor from, for its period-slip flag."""
    if wind.period_factor_from == "set":
        return f"the factor {wind.period_factor:.2f} set for the site"
    return (f"the {band_weeks:.0f}-week band of its check (planned {planned_weeks:.1f} weeks "
            f"from {planned_from}, factor {wind.period_factor:.2f})")
