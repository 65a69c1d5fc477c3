"""The one result object every view reads (design.md §2): checks, flags, speeds, per wall and site.

Views (JSON, text, CSV, HTML/SVG, the terminal interface) format these values; none recomputes.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from bracing.day_results import VERDICTS, DayFinding, DayResult, NotChecked
from bracing.result_checks import SEVERITIES, Check, Flag

__all__ = [
    "CAUTION",
    "SEVERITIES",
    "STATUSES",
    "STATUS_ORDER",
    "VERDICTS",
    "Check",
    "DayFinding",
    "DayResult",
    "Flag",
    "NotChecked",
    "PanelResult",
    "SiteResult",
    "UnbracedResult",
    "WindResult",
]


CAUTION = (
    "CAUTION: a planning aid, not a bracing design. A qualified person must design and approve "
    "the bracing. Follow local codes, the brace and anchor makers' ratings and the site "
    "safety plan."
)

STATUSES = {
    "unsafe": "braced, but a check fails",
    "needs_braces": "cannot stand on its own: brace it",
    "braced": "braced, every check passes",
    "stands": "stands on its own",
}
STATUS_ORDER = tuple(STATUSES)  # worst first


@dataclass(slots=True)
class WindResult:
    """The design wind on one wall (ASCE 7-16 §29.3 with ASCE 37-14), Case A at strength level.

    Every field is known for every wall: none is None or NaN.

    Attributes
    ----------
    basic_speed_mph : float
        The site's basic wind speed V, mph (3-second gust at 33 ft, exposure C).
    period_factor : float
        ASCE 37-14 Table 6.2-1 factor on V for the wall's standing time, dimensionless.
    period_factor_from : str
        "standing time" (from the table) or "set" (the site file sets the factor).
    design_speed_mph : float
        period_factor x V, not below the site's minimum design wind rule, mph.
    kz, kd, kzt, ke, gust_factor : float
        ASCE 7-16 Kz at the top of the wall (Table 26.10-1), Kd (Table 26.6-1), Kzt (§26.8), Ke
        (Table 26.9-1) and G (§26.11.1), dimensionless.
    velocity_pressure_psf : float
        q_h by Eq. 26.10-1, psf.
    force_coefficient : float
        Case A Cf of Figure 29.3-1 (on the solid area of an open wall), dimensionless.
    opening_factor : float
        Figure 29.3-1 note 3 reduction for openings, 1.0 for a solid wall, dimensionless.
    force_lb : float
        Case A force q_h G Cf As (or the minimum pressure's, where it governs), lb.
    resultant_height_ft : float
        Height of that force above the wall's base, ft.
    solidity : float
        Solid area over gross area, dimensionless.
    minimum_pressure_governs : bool
        True where the ASCE 7-16 §29.7 minimum pressure governs the force.
    end_zone_force_coefficient, interior_force_coefficient : float
        The Cf of a wall checked per ft at its end zone (largest Case C value it touches) and in
        its interior (method notes §2), dimensionless.
    """

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
    """The wall standing on its own.

    Attributes
    ----------
    utilization : float
        Governing utilization of its own checks at the design wind, dimensionless; inf where a
        check has demand and no capacity.
    stands : bool
        True where every such check passes and no height rule forbids it.
    working_limit_speed_mph : float
        Observed gust at which its own governing check reaches 1.0, mph (service values, method
        notes §1). NaN: not known (no limit below the search's 400 mph, read as a capacity
        not known).
    stand_down_speed_mph : float
        The stand-down gust from that limit (the stand-down ratio, masonry caps), mph. NaN as
        above.
    max_height_ft : float
        Tallest the wall may stand unbraced at the design wind, ft, no taller than OSHA
        1926.706(b) lets masonry stand. inf: no height up to 300 ft fails (unbounded).
    max_height_at_limit_ft : float or None
        The same at the site's limit gust, ft; None where the site gives no limit gust (does not
        apply); inf as above.
    max_height_structural_ft : float or None
        `max_height_ft` before a rule's cap (the structural limit), ft; inf as above.
    """

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
    """Everything the engine found for one wall.

    A value that is missing is one of three kinds, kept apart: None where it does not apply
    (fresh-mortar speeds of a concrete wall, `braces` of a wall without braces); NaN where it
    is not known, named in `unknown` with why (in `braces`, the unknown `utilization` is None
    and `utilization_unknown_because` says why); inf where it is unbounded (a utilization with
    demand and no capacity, a height search without a limit). The JSON record writes null for
    all three; text views print "none", "unknown" and "unbounded".

    Attributes
    ----------
    mark, material : str
        The wall's mark and its material's kind ("concrete", "masonry", "framed").
    status : str
        One of `STATUSES`: "unsafe", "needs_braces", "braced", "stands".
    weight_lb : float
        Weight of the wall's solid area, lb.
    height_ft, width_ft : float
        Height and length of the wall, ft.
    thickness_in : float
        Thickness, in.
    wind : WindResult
        Its design wind.
    unbraced : UnbracedResult
        The wall standing on its own (braced or not).
    checks : list of Check
        Every check made, braced or on its own as the wall stands.
    flags : list of Flag
        Its findings.
    working_limit_speed_mph : float
        Observed gust at which its governing strength check reaches 1.0, with its braces if it
        has them, mph. NaN: not known (see `unknown`).
    stand_down_speed_mph : float
        The gust at which work stops and the fall zone is cleared, mph. NaN: not known.
    governing_element : str
        The check of the largest strength utilization, "element (region)".
    braces : dict or None
        The §8 braces record of a braced wall; None for a wall without braces. Keys: count;
        angle_deg; insert_height_ft, anchor_distance_ft, length_ft (ft); axial_force_lb,
        anchor_uplift_lb, anchor_shear_lb, base_shear_lb, base_uplift_lb (lb, governing brace,
        design wind); positions_ft, brace_forces_lb (one per brace); installation_torque_ftlb
        (helical foot anchors only, ft-lb); sill_uplift_lb, sill_uplift_plf (framed walls only);
        brace_type; wall_anchor and foot_anchor (None: none used); utilization (largest of the
        brace's own checks; None: not known, with utilization_unknown_because);
        working_limit_one_missing_mph (mph; 0 with two braces, None with one, or none found);
        designed (True where the layout designer chose the braces).
    sustained_equivalents_mph : dict of str to float
        1-min, 2-min, 10-min and 1-hour mean speeds matching the stand-down gust, mph.
    fresh_working_limit_speed_mph, fresh_stand_down_speed_mph : float or None
        A masonry wall's speeds with fresh mortar, which the days use until the mortar has
        cured, mph; None for other walls (does not apply); NaN: not known.
    fresh_sustained_equivalents_mph : dict of str to float
        Sustained equivalents of the fresh-mortar stand-down gust; empty where there is none.
    unknown : dict of str to str
        The wall's values that are not known, by field name ("braces.utilization" for a key of
        `braces`), with why; empty when every value is known.
    hardware : Hardware or None
        Its brace type, wall and foot anchors and brace count as the views show them (from
        `braces` where it names them, else the site file's bracing); None: none named.
    zone : FallZone or None
        Its fall zone (design.md §7), ft, with its basis; None only outside `evaluate`.
    footing_ft : (float, float) or None
        Its footing's width and thickness, ft; None: no footing.
    released_by : str or None
        Who signed off its release, on its release day; None: not released.
    """

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
    # the values of this wall that are not known (NaN, or None in `braces`), by field name
    # ("braces.utilization" for a key of `braces`), with why: see the class's glossary
    unknown: dict[str, str] = field(default_factory=dict)
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
        danger finding: the one test behind every verdict and exit code (method notes §8)."""
        return self.status in ("unsafe", "needs_braces") or any(
            f.severity == "danger" for f in self.flags)

    def worst_first(self) -> list[Check]:
        return sorted(self.checks, key=lambda c: -c.utilization)

    def flags_worst_first(self) -> list[Flag]:
        return sorted(self.flags, key=lambda f: SEVERITIES.index(f.severity))


@dataclass(slots=True)
class SiteResult:
    """The whole site: every wall, worst first on demand, and the declared basis.

    Attributes
    ----------
    name : str
        The site's name.
    basis : str
        "ASD" or "LRFD".
    basis_statement : list of str
        The design basis as every report states it at its head (method notes §1).
    panels : list of PanelResult
        Every wall in the site file's order.
    caution : str
        `CAUTION`, which every view shows.
    days : list of DayResult
        The day-by-day schedule; empty without lift days.
    peak_inventory : dict
        {"braces": {type: n}, "anchors": {type: n}}: the most in use on any day.
    plan : bracing.plan.PlanGeometry or None
        Coordinates for the drawings; None without a plan.
    flags : list of Flag
        Findings of the site as a whole.
    not_checked : list of NotChecked
        What the check leaves out.
    rules : dict of str to RuleUsed
        Every site rule as the check applied it (the defaults, then the site's own).
    on_hand : dict
        {"braces": {type: n or None}, "anchors": {type: n or None}}: the numbers on hand the
        site file gives (None: not given).
    together : DayResult or None
        Every wall standing together as day 0, for a site file that gives no lift days (then
        `days` is empty); None otherwise.
    """

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
    # bracing.foundation_results.FoundationWallResult of each foundation wall (method notes §12)
    foundation_walls: list = field(default_factory=list)
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
        """True when a wall fails, a foundation wall fails (its backfill over its limit on a
        day) or a finding of the site or of a day is a danger (§8a)."""
        walls = [*self.panels, *self.foundation_walls]
        return any(w.fails for w in walls) or any(
            f.severity == "danger" for f in self.flags + [g for d in self.days for g in d.flags])

    def panel(self, mark: str) -> PanelResult:
        return next(p for p in self.panels if p.mark == mark)
