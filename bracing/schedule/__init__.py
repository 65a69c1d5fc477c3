"""Days of the job: lifts, standing walls, releases, inventory, go / no-go (design.md §7).

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

Forecast file: see `bracing.schedule.forecast` (read at the edge: `site_forecast`).

The package by topic: `forecast` (reading the forecast file), `walls` (the scheduled walls,
their releases and sign-off flags), `gear` (brace and anchor types in use, short), `zones`
(fall zones), `slips` (period slips), `days` (the days and their rules, `DAY_RULES`) and
`verdict` (the day's verdict, `judge`). The names other modules use are here.
"""

from bracing.results import Hardware
from bracing.schedule.days import (
    DAY_RULES,
    STATUS_WORDS,
    STORM_SOURCE,
    build_days,
    date_of,
    stand_down_rule,
    whole_site,
)
from bracing.schedule.forecast import STORM_WORDS, ForecastDay, read_forecast, site_forecast
from bracing.schedule.gear import GEAR, hardware, hardware_of
from bracing.schedule.slips import PERIOD_SOURCE, PLANNED_FROM
from bracing.schedule.verdict import (
    MARGINAL,
    NEEDS_BRACES,
    RESTATED,
    SCHEDULE_CODES,
    SEVERITY_RANK,
    STRUCK,
    VERDICT_SOURCE,
    WallFacts,
    judge,
    wall_facts,
)
from bracing.schedule.walls import RELEASE_SOURCE
from bracing.schedule.zones import fall_zones

__all__ = [
    "DAY_RULES", "GEAR", "MARGINAL", "NEEDS_BRACES", "PERIOD_SOURCE", "PLANNED_FROM",
    "RELEASE_SOURCE", "RESTATED", "SCHEDULE_CODES", "SEVERITY_RANK", "STATUS_WORDS",
    "STORM_SOURCE", "STORM_WORDS", "STRUCK", "VERDICT_SOURCE", "ForecastDay", "Hardware",
    "WallFacts", "build_days", "date_of", "fall_zones", "hardware", "hardware_of", "judge",
    "read_forecast", "site_forecast", "stand_down_rule", "wall_facts", "whole_site",
]
