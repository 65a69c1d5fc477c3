"""The days of the result object (`bracing.results`): each day's result and findings, and what
the check leaves out; named in `bracing.results`.

Views format these values; none recomputes.
"""

from __future__ import annotations

from dataclasses import asdict, dataclass, field

from bracing.result_checks import Flag


@dataclass(slots=True)
class DayFinding:
    """A finding of a day, listed once: the walls it holds for (none: the day's own).

    Attributes
    ----------
    code, severity, message, source : str
        As in `Flag`.
    marks : list of str
        The walls it holds for; empty for a finding of the day itself.
    """

    code: str
    severity: str
    message: str
    source: str
    marks: list[str] = field(default_factory=list)


VERDICTS = ("GO", "GO WITH EXCEPTIONS", "NO-GO", "NO CALL")  # method notes §6, Day verdict


@dataclass(slots=True)
class DayResult:
    """One day of the job: lifts, standing walls, inventory in use, the wind go / no-go.

    Attributes
    ----------
    day : int
        Day number, 1 for the first.
    date : str or None
        Its date (ISO 8601) where the site gives a start date; None otherwise.
    lifts, standing, released : list of str
        Marks of the walls lifted, standing and released from their braces that day.
    braces_in_use, anchors_in_use : dict of str to int
        Count in use by type.
    stand_down_speed_mph, working_limit_speed_mph : float or None
        The lowest stand-down gust and working limit of the walls standing, mph; None with no
        wall standing (does not apply) or none known.
    governing_wall : str or None
        The wall of that stand-down gust; None as above.
    forecast_gust_mph : float or None
        The forecast gust, mph; None without a forecast.
    storm : bool
        A thunderstorm is forecast.
    go, wind_go : bool or None
        The forecast against the stand-down gust alone; None without a forecast or a wall
        standing (no call).
    reason, wind : str
        That comparison in a sentence.
    short : dict
        {"braces": {type: n}, "anchors": {type: n}}: how many more are needed than on hand.
    flags : list of Flag
        The day's findings.
    fresh_mortar : list of str
        Masonry walls standing with fresh mortar.
    foundation_standing : list of str
        Foundation walls standing that day before their top support (as cantilevers or on
        inside braces); their wind part's stand-down gust counts in the day's lowest.
    verdict : str
        One of `VERDICTS` (method notes §6); `go` is True only for "GO".
    marginal : bool
        The forecast is within 10 % of the stand-down gust.
    do_not_lift, failing_standing : list of str
        Today's lifts that fail; walls up from earlier days that fail.
    why, findings : list of DayFinding
        What makes those walls fail, grouped; the rest, grouped, worst first.
    """

    day: int
    date: str | None
    lifts: list[str]
    standing: list[str]
    braces_in_use: dict[str, int]
    anchors_in_use: dict[str, int]
    released: list[str]
    stand_down_speed_mph: float | None
    working_limit_speed_mph: float | None
    governing_wall: str | None
    forecast_gust_mph: float | None
    storm: bool
    go: bool | None
    reason: str
    short: dict[str, dict[str, int]] = field(default_factory=dict)  # {"braces": {type: n}, ...}
    flags: list[Flag] = field(default_factory=list)
    fresh_mortar: list[str] = field(default_factory=list)  # masonry standing with fresh mortar
    # the day's verdict (bracing.schedule.judge, method notes §6): `go` is True only for "GO"
    verdict: str = "NO CALL"
    wind: str = ""  # the forecast against the stand-down gust, in a sentence
    wind_go: bool | None = None  # that comparison alone (None: no forecast or no wall standing)
    marginal: bool = False  # forecast within 10 % of the stand-down gust
    do_not_lift: list[str] = field(default_factory=list)  # today's lifts that fail
    failing_standing: list[str] = field(default_factory=list)  # walls up before today that fail
    why: list[DayFinding] = field(default_factory=list)  # what makes those walls fail, grouped
    findings: list[DayFinding] = field(default_factory=list)  # the rest, grouped, worst first
    # foundation walls standing before their top support (method notes §12)
    foundation_standing: list[str] = field(default_factory=list)


@dataclass(slots=True)
class NotChecked:
    """Something the engine did not check for this site, and why: the limits of the check,
    which a reviewer must see as clearly as its results (method notes §11).

    Attributes
    ----------
    item, reason, source : str
        What is not checked, why, and where the method says so.
    walls : list of str
        The walls it concerns; empty: the whole site.
    """

    item: str
    reason: str
    source: str
    walls: list[str] = field(default_factory=list)  # the walls it concerns; empty: the site

    def as_dict(self) -> dict:
        return asdict(self)
