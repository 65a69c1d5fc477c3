"""The one result object every view reads (design.md §2): checks, flags, speeds, per wall and site.

Views (JSON, text, CSV, HTML/SVG, the terminal interface) format these values; none recomputes.
"""

from __future__ import annotations

import math
from dataclasses import asdict, dataclass, field

CAUTION = (
    "CAUTION: a planning aid, not a bracing design. A qualified person must design and approve "
    "the bracing. Follow local codes, the brace and anchor makers' ratings and the site "
    "safety plan."
)

SEVERITIES = ("danger", "warning", "notice")  # ANSI Z535 signal words, most severe first

STATUSES = {
    "unsafe": "braced, but a check fails",
    "needs_braces": "cannot stand on its own: brace it",
    "braced": "braced, every check passes",
    "stands": "stands on its own",
}
STATUS_ORDER = tuple(STATUSES)  # worst first


@dataclass(slots=True)
class Check:
    """One limit check: demand against capacity on a named load combination, with its source."""

    element: str
    region: str
    demand: float
    capacity: float
    unit: str
    combination: str
    source: str

    @property
    def utilization(self) -> float:
        """Demand / capacity; infinite when there is demand and no capacity."""
        if self.capacity > 0:
            return self.demand / self.capacity
        return 0.0 if self.demand <= 0 else math.inf

    @property
    def passes(self) -> bool:
        return self.utilization <= 1.0

    def as_dict(self) -> dict:
        return {"element": self.element, "region": self.region, "demand": self.demand,
                "capacity": self.capacity, "unit": self.unit, "combination": self.combination,
                "source": self.source, "utilization": _finite(self.utilization),
                "passes": self.passes}


@dataclass(slots=True)
class Flag:
    """Something the user must see, with its severity and where the rule comes from."""

    code: str
    severity: str
    message: str
    source: str = ""

    def as_dict(self) -> dict:
        return asdict(self)


@dataclass(slots=True)
class WindResult:
    """The design wind on one wall (ASCE 7-16 §29.3 with ASCE 37-14), Case A at strength level."""

    basic_speed_mph: float
    period_factor: float
    period_factor_from: str
    design_speed_mph: float
    kz: float
    kd: float
    kzt: float
    ke: float
    gust_factor: float
    velocity_pressure_psf: float
    force_coefficient: float
    opening_factor: float
    force_lb: float
    resultant_height_ft: float
    solidity: float
    minimum_pressure_governs: bool
    end_zone_force_coefficient: float
    interior_force_coefficient: float


@dataclass(slots=True)
class UnbracedResult:
    """The wall standing on its own."""

    utilization: float
    stands: bool
    working_limit_speed_mph: float
    stand_down_speed_mph: float
    max_height_ft: float | None
    max_height_at_limit_ft: float | None
    max_height_structural_ft: float | None = None  # before a rule's cap (OSHA 8 ft masonry)


@dataclass(frozen=True, slots=True)
class FallZone:
    """A wall's fall zone (design.md §7): reach out from its braced face and back behind it."""

    front_ft: float
    back_ft: float
    basis: str


@dataclass(frozen=True, slots=True)
class RuleUsed:
    """A site rule as the check applied it: value, in force, source and basis."""

    value: float | None
    enabled: bool
    source: str
    basis: str


@dataclass(frozen=True, slots=True)
class Hardware:
    """What one wall's bracing uses: brace type, anchor types and the brace count (None: not
    named)."""

    brace_type: str | None
    wall_anchor: str | None
    foot_anchor: str | None
    count: int


@dataclass(slots=True)
class PanelResult:
    """Everything the engine found for one wall."""

    mark: str
    material: str
    status: str
    weight_lb: float
    height_ft: float
    width_ft: float
    thickness_in: float
    wind: WindResult
    unbraced: UnbracedResult
    checks: list[Check]
    flags: list[Flag]
    working_limit_speed_mph: float
    stand_down_speed_mph: float
    governing_element: str
    braces: dict | None = None
    sustained_equivalents_mph: dict = field(default_factory=dict)
    # masonry: its speeds with fresh mortar, which the days use until the mortar has cured
    fresh_working_limit_speed_mph: float | None = None
    fresh_stand_down_speed_mph: float | None = None
    fresh_sustained_equivalents_mph: dict = field(default_factory=dict)
    # what the views show beside the checks, put here by `evaluate` (views compute nothing and
    # read no site file): the gear, the fall zone, the footing, who signed off the release
    hardware: Hardware | None = None  # None: no brace or anchor type named
    zone: FallZone | None = None
    footing_ft: tuple[float, float] | None = None  # (width, thickness); None: no footing
    released_by: str | None = None  # the engineer whose sign-off released it

    def speeds_on(self, fresh: bool) -> tuple[float, float, dict]:
        """(stand-down, working limit, sustained equivalents of the stand-down) as they apply
        on a day: with fresh mortar if `fresh` (a masonry wall in its first days)."""
        if fresh and self.fresh_stand_down_speed_mph is not None:
            return (self.fresh_stand_down_speed_mph, self.fresh_working_limit_speed_mph,
                    self.fresh_sustained_equivalents_mph)
        return (self.stand_down_speed_mph, self.working_limit_speed_mph,
                self.sustained_equivalents_mph)

    @property
    def utilization(self) -> float:
        """The governing (largest) utilization of the wall as checked."""
        return max((c.utilization for c in self.checks), default=0.0)

    @property
    def fails(self) -> bool:
        """True when the wall fails a strength check, cannot stand and has no braces, or has a
        danger finding: the one test behind every verdict and exit code (design.md §8a)."""
        return self.status in ("unsafe", "needs_braces") or any(
            f.severity == "danger" for f in self.flags)

    def worst_first(self) -> list[Check]:
        return sorted(self.checks, key=lambda c: -c.utilization)

    def flags_worst_first(self) -> list[Flag]:
        return sorted(self.flags, key=lambda f: SEVERITIES.index(f.severity))


@dataclass(slots=True)
class DayFinding:
    """A finding of a day, listed once: the walls it holds for (none: the day's own)."""

    code: str
    severity: str
    message: str
    source: str
    marks: list[str] = field(default_factory=list)


VERDICTS = ("GO", "GO WITH EXCEPTIONS", "NO-GO", "NO CALL")  # method notes §6, Day verdict


@dataclass(slots=True)
class DayResult:
    """One day of the job: lifts, standing walls, inventory in use, the wind go / no-go."""

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


@dataclass(slots=True)
class NotChecked:
    """Something the engine did not check for this site, and why: the limits of the check,
    which a reviewer must see as clearly as its results (method notes §11)."""

    item: str
    reason: str
    source: str
    walls: list[str] = field(default_factory=list)  # the walls it concerns; empty: the site

    def as_dict(self) -> dict:
        return asdict(self)


@dataclass(slots=True)
class SiteResult:
    """The whole site: every wall, worst first on demand, and the declared basis."""

    name: str
    basis: str
    basis_statement: list[str]
    panels: list[PanelResult]
    caution: str = CAUTION
    days: list[DayResult] = field(default_factory=list)
    peak_inventory: dict[str, dict[str, int]] = field(default_factory=dict)
    plan: object | None = None  # bracing.plan.PlanGeometry: coordinates for the views
    flags: list[Flag] = field(default_factory=list)  # site-wide findings
    not_checked: list[NotChecked] = field(default_factory=list)  # what the check leaves out
    # for the views, not in the JSON record: the site's rules as applied, the number on hand
    # of each brace and anchor type ({"braces": {type: n or None}, "anchors": ...}), and every
    # wall standing together as day 0 when the site file gives no lift days (`days` is empty)
    rules: dict[str, RuleUsed] = field(default_factory=dict)
    on_hand: dict[str, dict[str, int | None]] = field(default_factory=dict)
    together: DayResult | None = None

    def worst_first(self) -> list[PanelResult]:
        return sorted(self.panels, key=lambda p: (STATUS_ORDER.index(p.status), -p.utilization))

    def failing(self) -> list[PanelResult]:
        """The walls that fail (PanelResult.fails), worst first."""
        return [p for p in self.worst_first() if p.fails]

    @property
    def fails(self) -> bool:
        """True when a wall fails or a finding of the site or of a day is a danger (§8a)."""
        return bool(self.failing()) or any(
            f.severity == "danger" for f in self.flags + [g for d in self.days for g in d.flags])

    def panel(self, mark: str) -> PanelResult:
        return next(p for p in self.panels if p.mark == mark)


def _finite(x: float) -> float | None:
    """JSON has no infinity: an unbounded value becomes null."""
    return None if x is None or not math.isfinite(x) else x
