"""The vectorised pass: design wind, observed-gust limits and trial heights, all walls."""

from __future__ import annotations

import numpy as np

from bracing import lines
from bracing.model import Site, read_panels
from bracing.stages.alone import (
    governing_utilization,
    reverse_wind_checks,
    unbraced_at,
    wall_checks,
)
from bracing.stages.arrays import gather, take, take_each
from bracing.stages.brace_loads import brace_loads
from bracing.stages.brace_set import gather_braces
from bracing.stages.braced import braced_checks
from bracing.stages.evaluation import Evaluation
from bracing.stages.limits import (
    braced_limit,
    braced_limit_one_missing,
    fresh_mortar_limits,
    reverse_wind_limit,
    stand_down_speeds,
)
from bracing.stages.loads import COMBINATIONS, SERVICE, SERVICE_BASIS, fixed_loads
from bracing.stages.search import HEIGHT_BRACKET_FT, solve_increasing, solve_speed
from bracing.stages.wind import wind_on
from bracing.wind import asce7


def evaluate_arrays(site: Site, edges: dict[str, float] | None = None,
                    releases: lines.Releases | None = None,
                    columns: dict[str, tuple] | None = None) -> Evaluation:
    """The vectorised pass: design wind, observed-gust limits and trial heights, all walls
    (`releases`: the site's `lines.releases`; `columns`: its panels' fields, model.read_panels;
    each read when not given)."""
    columns = columns or read_panels(site)
    w = gather(site, columns, releases)
    n = len(site.panels)
    factors = COMBINATIONS[site.site.design_basis]
    floor_rule = site.rule_value("minimum_design_wind_mph")
    design_speed = w.period_factor * site.site.basic_wind_speed
    if floor_rule:
        design_speed = np.maximum(design_speed, floor_rule)
    minimum = site.rule_value("minimum_design_pressure_psf")

    wind = wind_on(w, design_speed, asce7.KD_WALLS, minimum)
    # An observed gust: Kd 1.0, no minimum, no period factor (method notes §1); loads grow with
    # V^2, so the wind of a 1 mph gust is scaled rather than recomputed.
    unit = wind_on(w, 1.0, 1.0, None)
    held = fixed_loads(site, w)  # the lateral loads that do not grow with the wind
    checks = wall_checks(w, wind, factors, held)
    limit = solve_speed(lambda v2, rows: unbraced_at(
        take(w, rows), take(unit, rows).scaled(v2), SERVICE, take_each(held, rows)), n)

    def at_height(h, rows, speed, kd, floor, f):
        trial = take(w, rows).at_height(h)
        return unbraced_at(trial, wind_on(trial, np.broadcast_to(speed, n)[rows], kd, floor), f,
                           fixed_loads(site, trial))
    max_height = solve_increasing(
        lambda h, rows: at_height(h, rows, design_speed, asce7.KD_WALLS, minimum, factors),
        *HEIGHT_BRACKET_FT, n, start=w.height, highest=True)
    gust = site.site.limit_speed
    max_at_limit = (solve_increasing(lambda h, rows: at_height(h, rows, gust, 1.0, None, SERVICE),
                                     *HEIGHT_BRACKET_FT, n, start=w.height, highest=True)
                    if gust else np.full(n, np.nan))
    e = Evaluation(walls=w, wind=wind, checks=checks, utilization=governing_utilization(checks),
                   limit=limit, stand_down=stand_down_speeds(site, w, limit),
                   max_height=max_height, max_at_limit=max_at_limit, design_speed=design_speed)
    e.columns, e.held = columns, held
    bs = gather_braces(site, site.site.design_basis, edges, columns)
    if bs is not None:
        loads = brace_loads(w, wind, bs, minimum, held)
        e.braces = bs
        # the service speeds read allowable capacities under either basis (method notes §1)
        e.service_braces = service = (bs if site.site.design_basis == SERVICE_BASIS else
                                      gather_braces(site, SERVICE_BASIS, edges, columns))
        e.braced_checks, e.brace_forces = braced_checks(w, wind, bs, factors, minimum,
                                                               loads)
        e.braced_checks.update(reverse_wind_checks(checks, bs))
        e.braced_limit = reverse_wind_limit(braced_limit(w, unit, service, held), bs, limit)
        e.braced_stand_down = stand_down_speeds(site, take(w, bs.index), e.braced_limit)
        e.braced_limit_missing = reverse_wind_limit(
            braced_limit_one_missing(w, unit, service, e.braced_limit, held), bs, limit)
    e.fresh_limit, e.fresh_stand_down = fresh_mortar_limits(site, unit, e)
    return e
