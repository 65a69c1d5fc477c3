"""evaluate(site) -> SiteResult: the whole site in one vectorised pass (design.md §2, §9).

The pipeline is file -> Site (bracing.model) -> evaluate -> SiteResult (bracing.results) ->
views (bracing.report, tui), and evaluate's stages stand in `bracing.stages`, one module each:
reading the walls into arrays (`arrays`), loads (`loads`, `wind`), walls on their own
(`alone`), braced walls (`brace_set`, `brace_loads`, `braced`), the limit searches (`search`,
`limits`), the pass that runs them (`passes`), findings (`findings`) and the result objects
(`checkset`, `records`). This module orders them; it keeps the names other modules import.
"""

from __future__ import annotations

from operator import attrgetter

from bracing import layout, lines, plan, schedule, scope
from bracing.model import DEFAULT_RULES, Site, read_panels
from bracing.results import FallZone, Flag, PanelResult, RuleUsed, SiteResult
from bracing.schedule import ForecastDay
from bracing.stages import foundation
from bracing.stages.alone import (  # noqa: F401  (names other modules import from here)
    CHECK_INFO,
    REVERSE,
    governing_utilization,
    stability_checks,
    unbraced_at,
    wall_checks,
)
from bracing.stages.arrays import Walls, gather  # noqa: F401
from bracing.stages.evaluation import Evaluation  # noqa: F401
from bracing.stages.limits import strength_only  # noqa: F401
from bracing.stages.loads import COMBINATIONS, SERVICE, Factors  # noqa: F401
from bracing.stages.passes import evaluate_arrays
from bracing.stages.records import Results
from bracing.stages.search import solve_increasing, solve_speed  # noqa: F401
from bracing.stages.wind import Wind, wind_on  # noqa: F401

# Plan findings that depend on one wall alone go on the wall (and its days); crossings and
# overlaps between walls depend on which walls stand together and go on the days only.
ANCHOR_FINDINGS = {"anchor-off-slab", "anchor-near-edge", "ground-anchor-off-ground",
                   "anchor-not-located", "past-line-end"}
WALL_FINDINGS = ANCHOR_FINDINGS | {"brace-crosses-keep-clear", "zone-overlap",
                                   "zone-overlaps-crane-path"}


def evaluate(site: Site, design: bool = False, base_dir=None,
             forecast: dict[int, ForecastDay] | None = None) -> SiteResult:
    """Check every wall of the site and return the one result object.

    With `design`, walls that cannot stand and have no bracing get a designed layout first
    (the site's [design] options); the walls for which none passes say why. `forecast` is the
    site's forecast by day, read at the edge (`bracing.schedule.site_forecast`); a caller that
    holds only the site file's folder gives it as `base_dir` and the forecast is read from it
    first (the one file read here, before anything is checked).
    """
    if forecast is None:
        forecast = schedule.site_forecast(site, base_dir)
    columns = read_panels(site)
    releases = lines.releases(site, columns)  # designed layouts leave the lifts as they are
    places = plan.place(site, columns)
    e = evaluate_arrays(site, _edges(site, places), releases, columns)
    designs = {}
    if design and site.design is not None:
        site, designs, places, e = _with_designs(site, e, places, releases)
    panels = Results(site, e).panels()
    _designer_flags(panels, designs)
    by_mark = {p.mark: p for p in panels}
    found = plan.findings(site, places) if places else []  # one look at every placed wall
    for f in found:
        if f.flag.code in WALL_FINDINGS:
            by_mark[f.mark].flags.append(f.flag)
    severity = attrgetter("severity")
    for p in panels:  # a danger flag on a braced wall (an anchor off the slab...) is unsafe
        if p.status == "braced" and "danger" in map(severity, p.flags):
            p.status = "unsafe"
    days, peak, wall_flags = schedule.build_days(site, panels, forecast, releases,
                                                 judged=not places)
    for mark, flag in wall_flags:  # sign-off and period flags: the wall's checks stand as they are
        by_mark[mark].flags.append(flag)
    geometry = _plan_of_days(site, places, days, found, by_mark)
    walls = foundation.evaluate_foundation_walls(site)
    _backfill_days(site, days, walls, by_mark, peak)
    _for_views(site, places, panels, days)
    return SiteResult(
        name=site.site.name, basis=site.site.design_basis, basis_statement=basis_statement(site),
        panels=panels, days=days, peak_inventory=peak, plan=geometry,
        not_checked=scope.not_checked(site, columns) + foundation.not_checked(site),
        foundation_walls=walls, flags=foundation.site_flags(walls), rules=rules_used(site),
        on_hand={"braces": {n: t.on_hand for n, t in site.brace_types.items()},
                 "anchors": {n: t.on_hand for n, t in site.anchor_types.items()}},
        together=schedule.whole_site(site, panels) if not days and panels else None)


def _backfill_days(site: Site, days, walls, by_mark: dict, peak: dict) -> None:
    """Each day's foundation walls standing, its backfill dangers (a wall backfilled above what
    it may take that day) among the day's findings, its forecast against the foundation walls'
    stand-down gusts, their inside braces in its gear counted against on_hand (and `peak`), and
    the day judged again with them (method notes §6, §12)."""
    on_day = foundation.day_flags(walls)
    standing = {d.day for d in foundation.stand_on_days(walls, days)}
    standing |= {d.day for d in schedule.gear.with_inside_braces(days, walls, site, peak)}
    if not on_day and not standing:
        return
    facts = schedule.wall_facts(by_mark)
    for d in days:
        if d.day in on_day or d.day in standing:
            d.flags.extend(on_day.get(d.day, []))
            schedule.judge(d, by_mark, facts)


def _edges(site: Site, places) -> dict[str, float]:
    """The least edge distance (in) of each wall's slab-anchor feet, from the plan."""
    return plan.foot_edge_distances_in(site, places) if places else {}


def _with_designs(site: Site, e, places, releases):
    """The site with designed layouts for the walls that cannot stand and have none, and its
    evaluation again: (site, designs by panel, places, evaluation)."""
    rows = [i for i, p in enumerate(site.panels) if p.bracing is None
            and (e.utilization[i] > 1.0 or _masonry_over_limit(site, p))]
    if not rows:
        return site, {}, places, e
    found = layout.design(site, rows, e.walls, e.wind, COMBINATIONS[site.site.design_basis],
                          site.rule_value("minimum_design_pressure_psf"), e.held)
    site = layout.with_designs(site, found)
    columns = read_panels(site)
    places = plan.place(site, columns)
    return (site, {d.panel: d for d in found}, places,
            evaluate_arrays(site, _edges(site, places), releases, columns))


def _designer_flags(panels: list[PanelResult], designs: dict):
    """What the layout designer says of the walls it laid out, or could not."""
    for i, d in designs.items():
        if d.layout is not None:
            panels[i].braces["designed"] = True
            panels[i].flags.append(Flag(
                code="designed-layout", severity="notice", message="bracing laid out by the "
                "designer: check it against the site before use", source="layout designer"))
        else:
            panels[i].flags.append(Flag(code="no-layout", severity="danger", message=d.message,
                                        source="layout designer"))


def _plan_of_days(site: Site, places, days, found, by_mark: dict):
    """The plan's geometry (None: no wall placed), each day's with its crossings and zone
    overlaps (they depend on the walls standing together), and each day's verdict with these
    findings in (`by_mark`: the walls' results)."""
    if not places and not any(w.line for w in site.foundation_walls):
        return None  # nothing on a wall line to draw
    if not days:
        return plan.plan_geometry(site)
    by_day, facts = plan.day_findings(found, days), schedule.wall_facts(by_mark)
    for d in days:
        d.flags.extend(f for f in by_day[d.day] if f.code not in ANCHOR_FINDINGS)
        schedule.judge(d, by_mark, facts)
    return plan.DayPlans(site, {d.day: d.standing for d in days})


def _for_views(site: Site, places, panels: list[PanelResult], days) -> None:
    """What the views show of each wall beside its checks: its gear, fall zone, footing and
    the sign-off that released it (views compute nothing and read no site file)."""
    zones = schedule.fall_zones(site, panels, places)
    signed: dict[tuple[str, int], str] = {}
    for s in site.signoffs:  # the first sign-off of a wall on a day names who released it
        signed.setdefault((s.panel, s.day), s.by)
    released = {m: d.day for d in days for m in d.released}
    gear = schedule.hardware_of(site, panels)
    for p, model, h in zip(panels, site.panels, gear, strict=True):
        p.hardware = h
        front, back, basis = zones[p.mark]
        p.zone = FallZone(front_ft=front, back_ft=back, basis=basis)
        f = model.footing
        p.footing_ft = None if f is None else (f.width, f.thickness)
        p.released_by = signed.get((p.mark, released[p.mark])) if p.mark in released else None


def rules_used(site: Site) -> dict[str, RuleUsed]:
    """Every rule of the site (the defaults, then its own) as the check applied it."""
    return {name: RuleUsed(value=r.value, enabled=r.enabled, source=r.source, basis=r.basis)
            for name in dict.fromkeys([*DEFAULT_RULES, *site.rules]) for r in [site.rule(name)]}


def evaluate_walls(site: Site, marks: set[str]) -> list[PanelResult]:
    """The wall checks of `marks` alone, fast: the walls and those on the same wall lines (they
    load each other), without the days and the plan findings (`evaluate` gives those).

    For a quick answer after an edit to one wall while the whole site is checked again."""
    lines_of = {p.line for p in site.panels if p.mark in marks and p.line is not None}
    keep = [p for p in site.panels if p.mark in marks or (p.line is not None
                                                            and p.line in lines_of)]
    kept = {p.mark for p in keep}
    sub = site.model_copy(update={
        "panels": keep, "signoffs": [s for s in site.signoffs if s.panel in kept]})
    places = plan.place(sub)
    e = evaluate_arrays(sub, plan.foot_edge_distances_in(sub, places) if places else {})
    panels = Results(sub, e).panels()
    _for_views(sub, places, panels, [])  # no days: no release named
    return [p for p in panels if p.mark in marks]


def _masonry_over_limit(site: Site, p) -> bool:
    limit = site.rule_value("masonry_unbraced_height_ft")
    return site.materials[p.material].kind == "masonry" and limit is not None and \
        p.height > limit


def basis_statement(site: Site) -> list[str]:
    """The declared design basis, shown on every report (method notes §1)."""
    s = site.site
    factor = (f"period factor {s.period_factor} set by the user" if s.period_factor
              else "period factor from each wall's standing time (ASCE 37-14 Table 6.2-1)")
    return [
        f"Construction-stage wind: ASCE 37-14 applied with ASCE 7-16 wind (ASCE 37-14 was written "
        f"against ASCE 7-10); Risk Category {s.risk_category}; {factor}.",
        f"Basic wind speed {s.basic_wind_speed:.0f} mph ({s.basic_wind_speed * 0.44704:.1f} m/s), "
        f"exposure {s.exposure}, Kzt "
        f"{s.topographic_factor:g}, ground elevation {s.ground_elevation:.0f} ft.",
        f"Load combinations: {site.site.design_basis} (ASCE 7-16 §2.4.1 / §2.3.1).",
        "Speeds the crew reads are peak 3-second gusts at 33 ft in open terrain (Kd 1.0, no "
        "minimum pressure, no period factor).",
    ]
