"""evaluate(site) -> SiteResult: the whole site in one vectorised pass (design.md §2, §9).

The walls are gathered into numpy arrays once; the wind and stability formulas run over all of
them together, for the design wind, for observed gusts (working-limit speed) and for trial heights
(maximum unbraced height). Only the final step builds per-wall result objects.
"""

from __future__ import annotations

import functools
import gc
import re
from contextlib import contextmanager
from dataclasses import dataclass, fields, replace
from itertools import repeat
from operator import attrgetter

import numpy as np

from bracing import braced, layout, lines, members, plan, schedule, scope, stability
from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.braced import take
from bracing.data_members import PIPES
from bracing.model import Site, read_panels
from bracing.results import Check, Flag, PanelResult, SiteResult, UnbracedResult, WindResult
from bracing.wind import asce7, asce37, gusts

STUD_SOLIDITY = 1.5 / 16.0  # open framing: 1.5 in studs at 16 in on centre (common practice)
SPEED_BRACKET_MPH = (0.0, 400.0)
HEIGHT_BRACKET_FT = (0.01, 300.0)
TYPICAL_LIMIT_MPH = 90.0  # first trial of a speed search: near most working limits
ROOT_TOLERANCE = 1e-7  # a search settles where |g| (a utilization less 1) is below this
BRACED_WALLS_AT_ONCE = 8192  # braced walls checked in one pass of a search


@dataclass(frozen=True)
class Factors:
    """Load factors of one combination (ASCE 7-16 §2.3.1 / §2.4.1) and their names;
    `allowable`: the factors that allowable capacities take, where they differ (LRFD: ASD's,
    design.md §3, method notes §1)."""

    dead_resists: float
    dead_adds: float
    wind: float
    resisting: str
    adding: str
    wind_only: str
    allowable: Factors | None = None


_ASD = Factors(0.6, 1.0, 0.6, "0.6D + 0.6W", "D + 0.6W", "0.6W")  # ASCE 7-16 §2.4.1
COMBINATIONS = {
    "ASD": _ASD,
    "LRFD": Factors(0.9, 1.2, 1.0, "0.9D + 1.0W", "1.2D + 1.0W", "1.0W",  # ASCE 7-16 §2.3.1
                    allowable=_ASD),
}
# Capacities the working limit reads: allowable ones (ASD) whatever the basis, so that the
# service speeds are the same under either (design.md §3).
SERVICE_BASIS = "ASD"
# The observed wind as a service load (design.md §3): 1.0W, 0.6D where dead load resists.
SERVICE = Factors(0.6, 1.0, 1.0, "0.6D + 1.0W (observed gust)", "D + 1.0W (observed gust)",
                  "1.0W (observed gust)")


@dataclass(frozen=True)
class Walls:
    """Every wall of a site as arrays (one entry per panel)."""

    height: np.ndarray          # s, ft
    width: np.ndarray           # B, ft
    thickness_ft: np.ndarray
    base: np.ndarray            # base above grade, ft
    face_weight: np.ndarray     # psf of wall face
    solidity: np.ndarray
    centroid_ratio: np.ndarray  # solid area centroid height / s
    centroid_x_ratio: np.ndarray  # solid area centroid from the left edge / B
    rigid: np.ndarray           # bool: concrete panel checked as a whole
    fresh: np.ndarray           # bool: masonry with uncured mortar (weight only)
    masonry: np.ndarray
    framed: np.ndarray
    flex_tension: np.ndarray    # psi, 0 where not credited
    section: np.ndarray         # in^3 per ft of bed joint
    section_area: np.ndarray    # in^2 per ft
    footing_width: np.ndarray   # NaN where none
    footing_thickness: np.ndarray
    footing_psf: np.ndarray     # footing weight per ft^2 of plan (incl. soil over it)
    bearing: np.ndarray         # allowable psf
    footing_mu: np.ndarray
    base_mu: np.ndarray
    period_factor: np.ndarray
    groups: np.ndarray          # (n, G, 4): the wall alone, then its groups on its line
    #                             (lines.alone_and_on_lines; geometry in ft, NaN: none)
    exposure: str
    kzt: float
    ke: float

    @property
    def has_footing(self) -> np.ndarray:
        return ~np.isnan(self.footing_width)

    def at_height(self, height: np.ndarray) -> Walls:
        """The same walls at trial heights (openings kept as the same share and centroid ratio;
        the wind works out every coefficient that depends on the height afresh from them)."""
        return replace(self, height=height)


def gather(site: Site, columns: dict[str, tuple] | None = None,
           releases: lines.Releases | None = None) -> Walls:
    """Read the site's walls into arrays (`columns`: the panels' fields, model.read_panels;
    `releases`: the site's `lines.releases`; each read here when not given): the formulas run
    over arrays, and only walls with openings, return walls or a footing are visited again
    for those."""
    f = columns or read_panels(site)
    n = len(site.panels)
    material, openings, footing, return_walls = (
        f[k] for k in ("material", "openings", "footing", "return_walls"))
    thickness, face_weight, unit_weight, width, height, opening_area, mortar_age, \
        standing_time, base_elevation = (np.array(f[k], dtype=float) for k in (  # None: NaN
            "thickness", "face_weight", "unit_weight", "width", "height", "opening_area",
            "mortar_age", "standing_time", "base_elevation"))
    number = {name: k for k, name in enumerate(site.materials)}
    material = np.fromiter(map(number.__getitem__, material), int, n)
    kinds = [_material_columns(mat) for mat in site.materials.values()]
    concrete, masonry, framed, open_framing = (
        np.array([kind[c] for kind in kinds], dtype=bool)[material] for c in range(4))
    tension = np.array([kind[4] for kind in kinds], dtype=float)[material]  # None: NaN
    bedding = np.array([kind[5] for kind in kinds])[material]
    mat_face, mat_unit = (np.array([getattr(m, name) for m in site.materials.values()],
                                   dtype=float)[material] for name in ("face_weight", "unit_weight"))
    t_ft = thickness / 12.0
    # the panel's face weight, or its unit weight, or its material's face or unit weight
    face = np.where(~np.isnan(face_weight), face_weight, np.where(
        ~np.isnan(unit_weight), unit_weight * t_ft,
        np.where(~np.isnan(mat_face), mat_face, mat_unit * t_ft)))
    solid, centroid, centroid_x = width * height, height / 2.0, width / 2.0
    for k in [k for k, o in enumerate(openings) if o]:
        opens = [(o.x, o.y, o.width, o.height) for o in openings[k]]
        solid[k], centroid[k] = stability.rectangle_centroid(width[k], height[k], opens)
        _, centroid_x[k] = stability.rectangle_centroid(
            height[k], width[k], [(y, x, h, w) for x, y, w, h in opens])
    solid -= np.nan_to_num(opening_area)
    solidity = np.where(open_framing, STUD_SOLIDITY, solid / (width * height))
    cured = masonry & (mortar_age >= (site.rule_value("masonry_cure_days") or 0.0))
    returns = np.zeros((2, n))  # Lr (ft) at the left and right ends
    for k in [k for k, r in enumerate(return_walls) if r]:
        for r in return_walls[k]:
            returns[int(r.end == "right"), k] = r.length
    base = np.full((5, n), np.nan)  # footing width, thickness, psf of plan, bearing, friction
    for k in [k for k, given in enumerate(footing) if given is not None]:
        ftg = footing[k]
        base[:, k] = (ftg.width, ftg.thickness,
                      ftg.unit_weight * ftg.thickness + ftg.soil_unit_weight * ftg.soil_depth,
                      ftg.allowable_bearing, ftg.friction_coefficient)
    releases = lines.releases(site) if releases is None else releases
    planned = lines.planned_weeks(releases)
    period = site.site.construction_period
    weeks = np.where(~np.isnan(standing_time), standing_time,
                     np.where(np.isnan(planned), np.nan if period is None else period, planned))
    section, section_area = stability.masonry_section(thickness, bedding)
    period_factor = (np.full(n, site.site.period_factor) if site.site.period_factor
                     else asce37.period_factor(weeks))
    groups = lines.alone_and_on_lines(returns, width, lines.line_groups(site, releases, width, f))
    return Walls(
        height, width, t_ft, base_elevation, face, solidity, centroid / height,
        centroid_x / width, concrete, masonry & ~cured, masonry, framed,
        np.where(cured, tension, 0.0), section, section_area, *base,
        np.full(n, site.site.friction_coefficient), period_factor, groups,
        exposure=site.site.exposure, kzt=site.site.topographic_factor,
        ke=float(asce7.ke(site.site.ground_elevation)))


def _material_columns(mat) -> tuple:
    """What a wall's columns take from its material: concrete, masonry, framed, open framing,
    the masonry's flexural tension (psi) and how its units are bedded (TMS 402-16 §8.2)."""
    masonry = mat.kind == "masonry"
    grouting = "hollow" if mat.grouting == "partly" else mat.grouting  # partly: conservative
    tension = mat.flexural_tension
    if tension is None and masonry:
        tension = stability.FLEXURAL_TENSION_PSI[(grouting, mat.mortar)]
    return (mat.kind == "concrete", masonry, mat.kind == "framed",
            mat.kind == "framed" and not mat.sheathed, tension,
            "hollow" if grouting == "hollow" else "solid")


@dataclass(frozen=True)
class Wind:
    """Wind on every wall at one speed: pressures, coefficients and forces (arrays)."""

    kz: np.ndarray
    q: np.ndarray
    cf_case_a: np.ndarray       # Case A/B coefficient with openings
    opening: np.ndarray
    cf_whole: np.ndarray        # governing whole-panel coefficient (A/B or Case C summed)
    area: np.ndarray            # the area the coefficient applies to
    force_a: np.ndarray         # Case A force, lb
    force: np.ndarray           # governing whole-panel force, lb
    cf_end: np.ndarray          # per-foot coefficients of a solid strip
    cf_interior: np.ndarray
    cf_left: np.ndarray         # Case C over the wall's width, wind from its group's start
    x_left: np.ndarray          # (the largest of its groups) and where it acts, ft from the
    cf_right: np.ndarray        # wall's first edge; and from the far end
    x_right: np.ndarray
    line_end: np.ndarray        # per-foot forces, plf
    line_interior: np.ndarray
    lever: np.ndarray           # resultant height above the wall's base, ft
    lever_strip: np.ndarray
    minimum_governs: np.ndarray

    def scaled(self, factor) -> Wind:
        """The same wind with pressures and forces times `factor` (no minimum: observed gusts)."""
        return replace(self, q=self.q * factor, force_a=self.force_a * factor,
                       force=self.force * factor, line_end=self.line_end * factor,
                       line_interior=self.line_interior * factor)


def wind_on(w: Walls, speed, kd: float, minimum_psf: float | None) -> Wind:
    """The wind on each wall at `speed` (ASCE 7-16 §29.3); `minimum_psf` for design wind only.

    Every coefficient that depends on the walls' height (Kz, s/h, B/s, the Case C regions,
    the return walls' Lr/s, the wall lines') is worked out here from `w`, so walls at trial
    heights (`Walls.at_height`) get their own."""
    s = w.height
    top = w.base + s
    s_over_h = s / top
    b_over_s = w.width / s
    kz = asce7.kz(top, w.exposure)
    q = asce7.velocity_pressure(speed, kz, w.kzt, kd, w.ke)  # ASCE 7-16 Eq. 26.10-1
    g = asce7.GUST_FACTOR
    solid = w.solidity >= 0.7  # Figure 29.3-1 note 3; below 0.7 the wall is open
    opening = np.where(solid, asce7.opening_factor(np.minimum(w.solidity, 1.0)), 1.0)
    cf_ab = asce7.cf_cases_ab(b_over_s, s_over_h)
    # The wall alone and on its line each day: Case C from either end, enveloped (§4).
    line = lines.coefficients(w.groups, w.width, s, w.base)
    case_c = np.maximum(line.left_mean, line.right_mean)
    cf_open = asce7.cf_open(w.solidity)
    cf_case_a = np.where(solid, cf_ab * opening, cf_open)
    cf_whole = np.where(solid, np.maximum(cf_ab, case_c) * opening, cf_open)
    gross = w.width * s
    area = np.where(solid, gross, gross * w.solidity)  # open walls: Cf on the solid area
    # ASCE 7-16 §29.7: the minimum on As, the gross area of a solid wall and the solid area of
    # an open one (design.md §3)
    floor = 0.0 if minimum_psf is None else minimum_psf * area
    force_a = np.maximum(q * g * cf_case_a * area, floor)  # ASCE 7-16 Eq. 29.3-1
    force = np.maximum(q * g * cf_whole * area, floor)
    cf_end = np.where(solid, line.end, cf_open)
    cf_interior = np.where(solid, line.interior, cf_open)
    share = np.where(solid, 1.0, w.solidity)  # of a foot of wall, the area Cf applies to
    strip_floor = 0.0 if minimum_psf is None else minimum_psf * s * share
    line_end = np.maximum(q * g * cf_end * s * share, strip_floor)
    line_interior = np.maximum(q * g * cf_interior * s * share, strip_floor)
    ratio = asce7.resultant_height_ratio(s_over_h)
    # Figure 29.3-1: the resultant 0.05 h above the geometric centre where s/h = 1.
    lever = s * (w.centroid_ratio + (ratio - 0.5))
    return Wind(kz, q, cf_case_a, opening, cf_whole, area, force_a, force, cf_end, cf_interior,
                line.left_mean, line.left_x, line.right_mean, line.right_x,
                line_end, line_interior, lever, s * ratio,
                (q * g * cf_whole * area) < floor)


def stability_checks(w: Walls, wind: Wind, f: Factors) -> dict[str, tuple[np.ndarray, np.ndarray]]:
    """Demand and capacity of every check of a wall on its own, per name (arrays, NaN = n/a).

    Rigid panels as a whole; walls built in place per foot, end zone and interior (§5).
    """
    t, s, b = w.thickness_ft, w.height, w.width
    dead = w.face_weight * s * b * w.solidity
    dead_strip = w.face_weight * s
    ftg = w.has_footing
    ftg_w = np.where(ftg, w.footing_width, 0.0)
    ftg_d = np.where(ftg, w.footing_thickness, 0.0)
    ftg_strip = np.where(ftg, w.footing_psf * ftg_w, 0.0)  # lb per ft of wall
    rigid = w.rigid
    na = np.nan
    checks: dict[str, tuple[np.ndarray, np.ndarray]] = {}

    # Overturning of the wall about its leeward base edge (statics).
    checks["overturning|whole panel"] = (
        np.where(rigid, f.wind * wind.force * wind.lever, na),
        np.where(rigid, f.dead_resists * stability.rocking_resistance(dead, t), na))
    for region, line in (("end zone", wind.line_end), ("interior", wind.line_interior)):
        rocking = stability.rocking_resistance(f.dead_resists * dead_strip, t)
        flexure = stability.masonry_flexural_capacity(
            w.flex_tension, w.section, w.section_area, f.dead_resists * dead_strip)
        capacity = np.where(w.masonry & ~w.fresh, np.maximum(rocking, flexure), rocking)
        checks[f"overturning|{region}"] = (
            np.where(rigid, na, f.wind * line * wind.lever_strip), np.where(rigid, na, capacity))
        # Footing and wall as one block about the footing's toe, and the soil under it.
        checks[f"footing overturning|{region}"] = (
            np.where(ftg & ~rigid, f.wind * line * (wind.lever_strip + ftg_d), na),
            np.where(ftg & ~rigid, stability.footing_resistance(
                f.dead_resists * (dead_strip + ftg_strip), ftg_w), na))
        bearing = stability.max_soil_pressure(
            f.dead_adds * (dead_strip + ftg_strip), f.wind * line * (wind.lever_strip + ftg_d),
            np.where(ftg, ftg_w, 1.0), 1.0)
        checks[f"soil bearing|{region}"] = (np.where(ftg & ~rigid, bearing, na),
                                           np.where(ftg & ~rigid, w.bearing, na))
    ftg_panel = ftg_strip * b
    checks["footing overturning|whole panel"] = (
        np.where(ftg & rigid, f.wind * wind.force * (wind.lever + ftg_d), na),
        np.where(ftg & rigid, stability.footing_resistance(
            f.dead_resists * (dead + ftg_panel), ftg_w), na))
    checks["soil bearing|whole panel"] = (
        np.where(ftg & rigid, stability.max_soil_pressure(
            f.dead_adds * (dead + ftg_panel), f.wind * wind.force * (wind.lever + ftg_d),
            np.where(ftg, ftg_w, 1.0), b), na),
        np.where(ftg & rigid, w.bearing, na))
    # Sliding on the base (friction, 0.6D resisting) and of the footing on soil; walls built in
    # place per foot of their end zone.
    push = np.where(rigid, wind.force, wind.line_end)
    weight = np.where(rigid, dead, dead_strip)
    footing_weight = np.where(rigid, ftg_panel, ftg_strip)
    # A framed wall's sill is nailed or bolted down: that connection is the framer's, not friction.
    slides = ~w.framed
    friction = w.base_mu * f.dead_resists * weight
    bond = stability.masonry_bed_joint_shear(w.section_area, f.dead_resists * dead_strip)
    grip = np.where(w.masonry & ~w.fresh, np.maximum(friction, bond), friction)
    checks["sliding at base|*"] = (np.where(slides, f.wind * push, na), np.where(slides, grip, na))
    checks["footing sliding|*"] = (
        np.where(ftg, f.wind * push, na),
        np.where(ftg, w.footing_mu * f.dead_resists * (weight + footing_weight), na))
    return checks


CHECK_INFO = {
    "overturning": ("lb·ft", "resisting", "statics, W t/2 about the base edge"),
    "footing overturning": ("lb·ft", "resisting", "statics, W x footing width / 2"),
    "soil bearing": ("psf", "adding", "statics against IBC Table 1806.2 allowable bearing"),
    "sliding at base": ("lb", "resisting", "friction, ACI 318-19 §22.9.4.2 (mu 0.6)"),
    "footing sliding": ("lb", "resisting", "friction, IBC Table 1806.2 (allowable)"),
}


def governing_utilization(checks) -> np.ndarray:
    """The largest demand/capacity of each wall over the checks that apply to it."""
    ratios = (np.where(np.isnan(d), 0.0, _ratio(d, c)) for d, c in checks.values())
    # a check at a time: numpy's own reduction over so short an axis is many times slower
    return functools.reduce(np.maximum, ratios)


def _ratio(demand, capacity):
    with np.errstate(divide="ignore", invalid="ignore"):
        return np.where(capacity > 0, demand / capacity, np.where(demand > 0, np.inf, 0.0))


def solve_increasing(g, lo: float, hi: float, size: int, start=None, iterations: int = 60,
                     tolerance: float = ROOT_TOLERANCE) -> np.ndarray:
    """Root of an increasing g(x, rows) on [lo, hi] for many walls at once; NaN where none.

    `g(x, rows)` gives g of the walls `rows` (an index array) at their trial values `x`; each
    step asks only for the walls not yet settled. `start` (a value or one per wall) is tried
    first; then, while a wall's trials all fall on one side of its root, the value where its
    utilization (g + 1) would reach 1 if it grew in proportion to x (exact for a wind moment
    against a weight, in V^2), and the secant through its two trials (exact for any linear
    utilization). The ends of [lo, hi] are asked only where all three fall on one side. Then
    Illinois regula falsi (a bracketing secant step that halves a stale end's weight), the
    secant taken through log x and log utilization where both are positive (exact for a
    utilization that grows as a power of x, as a wind moment does with height), falling back
    to bisection where the step leaves the bracket: robust like bisection, fast like secant.
    """
    rows = np.arange(size)
    a = np.full(size, float(lo))
    b = np.full(size, float(hi))
    fa, fb = np.full(size, np.nan), np.full(size, np.nan)
    known_a, known_b = np.zeros(size, bool), np.zeros(size, bool)

    def settled():
        return (known_a & (np.abs(fa) < tolerance)) | (known_b & (np.abs(fb) < tolerance))

    def trial(x, before=None):
        """g at trial values x of the walls neither settled nor bracketed (NaN for others),
        each trial narrowing its wall's bracket."""
        x = np.clip(x, lo, hi)
        open_ = ~settled() & ~(known_a & known_b) & ~np.isnan(x)
        which = rows[open_ if before is None else open_ & (x != before)]
        gx = np.full(size, np.nan)
        if len(which):
            gx[which] = found = g(x[which], which)
            below, above = which[found < 0.0], which[found >= 0.0]  # NaN: neither
            move_a = below[~known_a[below] | (x[below] > a[below])]
            move_b = above[~known_b[above] | (x[above] < b[above])]
            a[move_a], fa[move_a], known_a[below] = x[move_a], gx[move_a], True
            b[move_b], fb[move_b], known_b[above] = x[move_b], gx[move_b], True
        return x, gx
    if start is not None:
        x0, g0 = trial(np.broadcast_to(np.asarray(start, dtype=float), size))
        with np.errstate(divide="ignore", invalid="ignore", over="ignore"):
            x1, g1 = trial(x0 / (1.0 + g0), x0)  # utilization in proportion to x
            trial(x1 - g1 * (x1 - x0) / (g1 - g0), x1)  # the secant through both
    # a trial at g = 0 settles its wall: the other end is not asked
    done = settled()
    fa[done & ~known_a], fb[done & ~known_b] = -np.inf, np.inf
    for x, f, known in ((a, fa, known_a | done), (b, fb, known_b | done)):
        need = rows[~known]
        if len(need):
            f[need] = g(x[need], need)
    at_lo = (a == lo) & (fa >= 0.0)  # g(lo) >= 0: the root is at (or below) lo
    no_root = (b == hi) & (fb < 0.0)
    side = np.zeros(size)
    # walls without a root need no search, nor those where a trial already gave g = 0
    active = rows[(fa < 0.0) & (fb >= 0.0) & (np.minimum(-fa, fb) >= tolerance)]
    for _ in range(iterations):
        if len(active) == 0:
            break
        ai, bi, fai, fbi = a[active], b[active], fa[active], fb[active]
        with np.errstate(divide="ignore", invalid="ignore"):
            x = (ai * fbi - bi * fai) / (fbi - fai)
            la, lb, ua, ub = np.log(ai), np.log(bi), np.log1p(fai), np.log1p(fbi)
            x_log = np.exp(la - ua * (lb - la) / (ub - ua))
        x = np.where(np.isfinite(x_log) & (x_log > ai) & (x_log < bi), x_log, x)
        x = np.where(np.isfinite(x) & (x > ai) & (x < bi), x, 0.5 * (ai + bi))
        gx = g(x, active)
        below = gx < 0.0
        a[active] = np.where(below, x, ai)
        fa[active] = np.where(below, gx, fai)
        b[active] = np.where(below, bi, x)
        fb[active] = np.where(below, fbi, gx)
        # Illinois: the end that stayed twice in a row has its value halved
        stale_b = below & (side[active] == 1)
        stale_a = ~below & (side[active] == -1)
        fb[active[stale_b]] /= 2.0
        fa[active[stale_a]] /= 2.0
        side[active] = np.where(below, 1, -1)
        settled = (np.abs(gx) < tolerance) | (
            b[active] - a[active] < tolerance * (1.0 + np.abs(b[active])))
        active = active[~settled]
    root = np.where(np.abs(fa) < np.abs(fb), a, b)
    root = np.where(at_lo, lo, root)
    return np.where(no_root, np.nan, root)


def solve_speed(g, size: int, start_mph=TYPICAL_LIMIT_MPH) -> np.ndarray:
    """Gust speed (mph) at which an increasing g of the squared speed crosses 0, many walls at
    once (NaN where none in the bracket).

    Wind loads grow with V^2 (ASCE 7-16 Eq. 26.10-1), so `g(v2, rows)` is given the squared
    speed: the utilizations are then nearly linear and the secant steps settle in a few passes.
    """
    lo, hi = SPEED_BRACKET_MPH
    return np.sqrt(solve_increasing(g, lo**2, hi**2, size, start=np.square(start_mph)))


@dataclass
class Evaluation:
    """Arrays of one evaluation pass, before they become per-wall result objects."""

    walls: Walls
    wind: Wind
    checks: dict
    utilization: np.ndarray
    limit: np.ndarray
    stand_down: np.ndarray
    max_height: np.ndarray
    max_at_limit: np.ndarray
    design_speed: np.ndarray
    braces: braced.BraceSet | None = None
    service_braces: braced.BraceSet | None = None  # the same with allowable capacities (ASD)
    braced_checks: dict | None = None
    brace_forces: braced.BraceForces | None = None
    braced_limit: np.ndarray | None = None
    braced_stand_down: np.ndarray | None = None
    braced_limit_missing: np.ndarray | None = None
    fresh_limit: np.ndarray | None = None       # masonry with fresh mortar (NaN: other walls)
    fresh_stand_down: np.ndarray | None = None
    columns: dict[str, tuple] | None = None  # the panels' fields (model.read_panels)


# Plan findings that depend on one wall alone go on the wall (and its days); crossings and
# overlaps between walls depend on which walls stand together and go on the days only.
ANCHOR_FINDINGS = {"anchor-off-slab", "anchor-near-edge", "ground-anchor-off-ground",
                   "anchor-not-located", "past-line-end"}
WALL_FINDINGS = ANCHOR_FINDINGS | {"brace-crosses-keep-clear", "zone-overlap",
                                   "zone-overlaps-crane-path"}


@contextmanager
def paused_cycle_collector():
    """Python's cycle collector paused (and resumed if it ran): an evaluation builds many
    thousands of objects, none in reference cycles, and each collection would walk them all
    again. On the way out they go straight to the oldest generation, where a young collection
    would have moved them after walking them once more; cycles among them are still found by
    the next full collection."""
    running = gc.isenabled()
    gc.disable()
    try:
        yield
    finally:
        gc.freeze()    # every tracked object to the permanent generation...
        gc.unfreeze()  # ...and back into the oldest one, the young counts reset
        if running:
            gc.enable()


@paused_cycle_collector()
def evaluate(site: Site, design: bool = False, base_dir=None) -> SiteResult:
    """Check every wall of the site and return the one result object.

    With `design`, walls that cannot stand and have no bracing get a designed layout first
    (the site's [design] options); the walls for which none passes say why. `base_dir` is the
    site file's folder (the forecast file is read from it).
    """
    columns = read_panels(site)
    releases = lines.releases(site, columns)  # designed layouts leave the lifts as they are
    places = plan.place(site, columns)
    e = evaluate_arrays(site, plan.foot_edge_distances_in(site, places) if places else {},
                        releases, columns)
    designs = {}
    if design and site.design is not None:
        rows = [i for i, p in enumerate(site.panels) if p.bracing is None
                and (e.utilization[i] > 1.0 or _masonry_over_limit(site, p))]
        if rows:
            found = layout.design(site, rows, e.walls, e.wind, COMBINATIONS[
                site.site.design_basis], site.rule_value("minimum_design_pressure_psf"))
            designs = {d.panel: d for d in found}
            site = layout.with_designs(site, found)
            columns = read_panels(site)
            places = plan.place(site, columns)
            e = evaluate_arrays(site, plan.foot_edge_distances_in(site, places) if places else {},
                                releases, columns)
    panels = _Results(site, e).panels()
    by_mark = {p.mark: p for p in panels}
    for i, d in designs.items():
        if d.layout is not None:
            panels[i].braces["designed"] = True
            panels[i].flags.append(Flag("designed-layout", "notice", "bracing laid out by the "
                                        "designer: check it against the site before use",
                                        "layout designer"))
        else:
            panels[i].flags.append(Flag("no-layout", "danger", d.message, "layout designer"))
    found = plan.findings(site, places) if places else []  # one look at every placed wall
    for f in found:
        if f.flag.code in WALL_FINDINGS:
            by_mark[f.mark].flags.append(f.flag)
    severity = attrgetter("severity")
    for p in panels:  # a danger flag on a braced wall (an anchor off the slab...) is unsafe
        if p.status == "braced" and "danger" in map(severity, p.flags):
            p.status = "unsafe"
    days, peak, wall_flags = schedule.build_days(site, panels, base_dir, releases,
                                                 judged=not places)
    for mark, flag in wall_flags:  # sign-off and period flags: the wall's checks stand as they are
        by_mark[mark].flags.append(flag)
    geometry = None
    if places:
        if days:
            geometry = plan.DayPlans(site, {d.day: d.standing for d in days})
            by_day, facts = plan.day_findings(found, days), schedule.wall_facts(by_mark)
            for d in days:  # crossings and zone overlaps depend on the walls standing together
                d.flags.extend(f for f in by_day[d.day] if f.code not in ANCHOR_FINDINGS)
                schedule.judge(d, by_mark, facts)  # the day's verdict with these findings in
        else:
            geometry = plan.plan_geometry(site)
    return SiteResult(
        name=site.site.name, basis=site.site.design_basis, basis_statement=basis_statement(site),
        panels=panels, days=days, peak_inventory=peak, plan=geometry,
        not_checked=scope.not_checked(site, columns))


@paused_cycle_collector()
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
    return [p for p in _Results(sub, e).panels() if p.mark in marks]


def _masonry_over_limit(site: Site, p) -> bool:
    limit = site.rule_value("masonry_unbraced_height_ft")
    return site.materials[p.material].kind == "masonry" and limit is not None and \
        p.height > limit


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
    # An observed gust: Kd 1.0, no minimum, no period factor (design.md §3); loads grow with
    # V^2, so the wind of a 1 mph gust is scaled rather than recomputed.
    unit = wind_on(w, 1.0, 1.0, None)
    checks = wall_checks(w, wind, factors)
    limit = solve_speed(
        lambda v2, rows: unbraced_at(take(w, rows), take(unit, rows).scaled(v2), SERVICE), n)

    def at_height(h, rows, speed, kd, floor, f):
        trial = take(w, rows).at_height(h)
        return unbraced_at(trial, wind_on(trial, np.broadcast_to(speed, n)[rows], kd, floor), f)
    max_height = solve_increasing(
        lambda h, rows: at_height(h, rows, design_speed, asce7.KD_WALLS, minimum, factors),
        *HEIGHT_BRACKET_FT, n, start=w.height)
    gust = site.site.limit_speed
    max_at_limit = (solve_increasing(lambda h, rows: at_height(h, rows, gust, 1.0, None, SERVICE),
                                     *HEIGHT_BRACKET_FT, n, start=w.height)
                    if gust else np.full(n, np.nan))
    e = Evaluation(w, wind, checks, governing_utilization(checks), limit,
                   stand_down_speeds(site, w, limit), max_height, max_at_limit, design_speed)
    e.columns = columns
    bs = braced.gather_braces(site, site.site.design_basis, edges, columns)
    if bs is not None:
        loads = braced.brace_loads(w, wind, bs, minimum)
        e.braces = bs
        # the service speeds read allowable capacities under either basis (design.md §3)
        e.service_braces = service = (bs if site.site.design_basis == SERVICE_BASIS else
                                      braced.gather_braces(site, SERVICE_BASIS, edges, columns))
        e.braced_checks, e.brace_forces = braced.braced_checks(w, wind, bs, factors, minimum,
                                                               loads)
        e.braced_checks.update(reverse_wind_checks(checks, bs))
        e.braced_limit = reverse_wind_limit(braced_limit(w, unit, service), bs, limit)
        e.braced_stand_down = stand_down_speeds(site, braced.take(w, bs.index), e.braced_limit)
        e.braced_limit_missing = reverse_wind_limit(
            braced_limit_one_missing(w, unit, service, e.braced_limit), bs, limit)
    e.fresh_limit, e.fresh_stand_down = fresh_mortar_limits(site, unit, e)
    return e


REVERSE = " (wind away from the braces)"  # a check of the wall alone, compression-only braces
REVERSE_INFO = {name + REVERSE: (unit, kind, f"{source}; the braces work in compression only "
                                 "(method notes §4)")
                for name, (unit, kind, source) in CHECK_INFO.items()}


def reverse_wind_checks(checks: dict, bs: braced.BraceSet) -> dict:
    """The checks of the walls on their own (`checks`, at the design wind), as braced checks of
    the walls whose braces work in compression only (NaN for the others): with the wind away
    from its braced face, such a wall stands alone (design.md §6)."""
    only = bs.compression_only
    out = {}
    for key, (demand, capacity) in checks.items():
        element, _, region = key.partition("|")
        name = f"{element}{REVERSE}|{'worst region' if region == '*' else region}"
        out[name] = (np.where(only, demand[bs.index], np.nan), capacity[bs.index])
    return out


def reverse_wind_limit(limit: np.ndarray, bs: braced.BraceSet, alone: np.ndarray) -> np.ndarray:
    """A braced wall's working limit, no higher than its limit on its own where its braces work
    in compression only (the wind away from them: design.md §6)."""
    return np.where(bs.compression_only, np.fmin(limit, alone[bs.index]), limit)


def unbraced_at(walls: Walls, wind: Wind, f: Factors) -> np.ndarray:
    """The largest utilization, less 1, of each wall standing on its own."""
    return governing_utilization(wall_checks(walls, wind, f)) - 1.0


# Checks of walls on their own against allowable values (IBC Table 1806.2 bearing and friction),
# and those of cured masonry (TMS 402-16 §8.2 allowable stresses): under LRFD they take the ASD
# combinations (design.md §3, method notes §1).
ALLOWABLE_ALONE = {"soil bearing", "footing sliding"}
ALLOWABLE_MASONRY = {"overturning", "sliding at base"}


def wall_checks(w: Walls, wind: Wind, f: Factors) -> dict[str, tuple[np.ndarray, np.ndarray]]:
    """`stability_checks` with the allowable ones on `f.allowable` where it has one (LRFD)."""
    checks = stability_checks(w, wind, f)
    if f.allowable is None:
        return checks
    allowable = stability_checks(w, wind, f.allowable)
    cured = w.masonry & ~w.fresh
    out = {}
    for key, pair in checks.items():
        element = key.partition("|")[0]
        rows = (True if element in ALLOWABLE_ALONE else
                cured if element in ALLOWABLE_MASONRY else False)
        out[key] = tuple(np.where(rows, a, v) for v, a in zip(pair, allowable[key]))
    return out


def fresh_mortar_limits(site: Site, unit: Wind, e: Evaluation) -> tuple[np.ndarray, np.ndarray]:
    """Working limit and stand-down gust of each masonry wall with fresh mortar (by weight
    only, no bond: TMS 402-16 §8.2, from memory), braced or on its own; NaN for other walls.

    A wall checked with fresh mortar keeps its own values; one checked with cured mortar that
    has a lift day is checked again as fresh, for the days after its lift while the mortar is
    younger than the cure rule (the day-by-day schedule). `unit`: the wind of a 1 mph gust."""
    w, bs = e.walls, e.service_braces
    limit = e.limit.copy()
    stand_down = e.stand_down.copy()
    if bs is not None:
        limit[bs.index], stand_down[bs.index] = e.braced_limit, e.braced_stand_down
    limit, stand_down = (np.where(w.masonry, v, np.nan) for v in (limit, stand_down))
    scheduled = np.array([day is not None for day in e.columns["lift_day"]], dtype=bool)
    again = w.masonry & ~w.fresh & scheduled
    if not again.any():
        return limit, stand_down
    fresh = replace(w, fresh=w.fresh | again, flex_tension=np.where(again, 0.0, w.flex_tension))
    has_braces = np.zeros(len(again), bool)
    if bs is not None:
        has_braces[bs.index] = True
    alone = np.flatnonzero(again & ~has_braces)
    if len(alone):
        limit[alone] = solve_speed(lambda v2, rows: unbraced_at(
            take(fresh, alone[rows]), take(unit, alone[rows]).scaled(v2), SERVICE), len(alone))
        stand_down[alone] = stand_down_speeds(site, take(fresh, alone), limit[alone])
    if bs is not None and again[bs.index].any():
        sub = braced.take(bs, np.flatnonzero(again[bs.index]))
        limit[sub.index] = braced_limit(fresh, unit, sub)
        stand_down[sub.index] = stand_down_speeds(site, take(fresh, sub.index), limit[sub.index])
    return limit, stand_down


def braced_utilization(w: Walls, unit: Wind, bs: braced.BraceSet, rows=None, mask=None):
    """g(v2, r): the largest strength utilization, less 1, of the braced walls `r` in an observed
    gust whose speed squared is v2 (mph^2).

    `unit` is the observed wind of a 1 mph gust on every wall. The walls are those of `bs`, or
    variants of them: `rows` gives the wall of `bs` of each (a wall listed as often as it has
    variants) and `mask` its braces (a brace missing, say); each variant is its own wall. The
    wind's loads are linear in q: worked out once at 1 mph, then scaled; the parts of the checks
    that do not depend on the wind are worked out once too, for each wall of `bs`.
    """
    rows = np.arange(len(bs.index)) if rows is None else rows
    mask = bs.mask if mask is None else mask
    loads = braced.brace_loads(w, unit, braced.for_loads(bs, rows, mask), None)
    standing = braced.standing_of(w, bs, SERVICE)
    checked = braced.for_checks(bs)

    def g(v2, r):
        parts = -(-len(r) // BRACED_WALLS_AT_ONCE)
        if parts > 1:  # in parts: the arrays of many more walls outgrow the processor's cache
            return np.concatenate([g(*part) for part in zip(np.array_split(v2, parts),
                                                            np.array_split(r, parts))])
        of_wall = rows[r]
        variant = replace(braced.take(checked, of_wall), mask=braced.rows_of(mask, r))
        checks, _ = braced.braced_checks(w, None, variant, SERVICE, None,
                                         loads.take(r).scaled(v2), standing.take(of_wall))
        return governing_utilization(strength_only(checks)) - 1.0
    return g


def braced_limit(w: Walls, unit: Wind, bs: braced.BraceSet) -> np.ndarray:
    """Working-limit gust of each braced wall: its most utilized element reaches 1.0 (§3)."""
    return solve_speed(braced_utilization(w, unit, bs), len(bs.index))


def braced_limit_one_missing(w: Walls, unit: Wind, bs: braced.BraceSet,
                             full: np.ndarray) -> np.ndarray:
    """The working-limit gust with the worst single brace missing (equipment strikes one).

    Of each wall's variants (one brace struck each), the one without the brace farthest from
    the wall's middle is searched first (the end brace carries the twist and the end zone: the
    worst in about nine walls in ten). The others are only checked at its limit: a variant
    whose utilization there is still within 1.0 cannot fail sooner. Those that do fail sooner,
    and every variant of a wall whose first search found no limit, are searched too. `full`
    (each wall's limit with all its braces) is where the searches start.
    """
    count = bs.mask.sum(axis=1)
    # One brace left cannot carry the twist of Case B (no base restraint credited, §6): 0 mph.
    out = np.where(count == 2, 0.0, np.nan)
    rows, slots = np.nonzero(bs.mask & (count >= 3)[:, None])
    if len(rows) == 0:
        return out
    mask = braced.rows_of(bs.mask, rows)
    mask[np.arange(len(rows)), slots] = False
    g = braced_utilization(w, unit, bs, rows, mask)
    start = np.where(np.isfinite(full[rows]), full[rows], TYPICAL_LIMIT_MPH)

    def search(which):
        return solve_speed(lambda v2, r: g(v2, which[r]), len(which), start[which])
    off_middle = np.abs(bs.positions[rows, slots] - w.width[bs.index[rows]] / 2.0)
    by_wall = np.lexsort((-off_middle, rows))  # farthest from the middle first
    first = by_wall[np.r_[True, np.diff(rows[by_wall]) != 0]]
    limits = np.full(len(rows), np.inf)  # not the least of its wall
    limits[first] = search(first)
    best = np.full(len(bs.index), np.nan)
    best[rows[first]] = limits[first]
    searched = np.zeros(len(rows), bool)
    searched[first] = True
    rest = np.flatnonzero(~searched)
    found = best[rows[rest]]
    known = rest[found > 0.0]  # a limit of 0 is the least there can be
    # (a mirror image of the first, say, is at 0 there, within the search's own tolerance)
    fails_sooner = known[g(np.square(best[rows[known]]), known) > ROOT_TOLERANCE]
    again = np.concatenate([fails_sooner, rest[np.isnan(found)]])
    if len(again):
        limits[again] = search(again)
    np.fmin.at(out, rows, limits)
    return out


def strength_only(checks: dict) -> dict:
    """The checks that count for status and speeds (not serviceability ones like cracking)."""
    return {k: v for k, v in checks.items() if k.split("|")[0] not in braced.SERVICEABILITY}


def stand_down_speeds(site: Site, w: Walls, limit: np.ndarray) -> np.ndarray:
    """Stand-down ratio x working limit, capped for masonry by the industry speeds (design.md §3)."""
    ratio = site.rule_value("stand_down_ratio")
    speed = (1.0 if ratio is None else ratio) * limit
    initial = site.rule_value("masonry_initial_speed_mph")
    intermediate = site.rule_value("masonry_intermediate_speed_mph")
    if initial is not None:  # fmin: a limit beyond the search range (NaN) still gets the cap
        speed = np.where(w.masonry & w.fresh, np.fmin(speed, initial), speed)
    if intermediate is not None:
        speed = np.where(w.masonry, np.fmin(speed, intermediate), speed)
    return speed


def basis_statement(site: Site) -> list[str]:
    """The declared design basis, shown on every report (design.md §3)."""
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


class _Results:
    """Builds the per-wall result objects from one evaluation's arrays.

    What decides each wall's values, checks and flags is worked out for every wall at once with
    numpy and read out as Python lists, which give single values far faster than numpy arrays
    do; each kind of flag is made in one pass over the walls that have it. What walls share is
    made once: rules and sources, the names, regions and sources of their checks, the flags
    that read the same on every wall.
    """

    def __init__(self, site: Site, e: Evaluation):
        self.site, self.e = site, e
        f = COMBINATIONS[site.site.design_basis]
        combos = {"resisting": f.resisting, "adding": f.adding, "wind": f.wind_only}
        self.rule = {name: site.rule_value(name) for name in (
            "masonry_unbraced_height_ft", "minimum_braces_per_panel", "brace_angle_min_deg",
            "brace_angle_max_deg", "insert_min_height_ratio")}
        self.source = {name: site.rule(name).source for name in self.rule}
        self.hardware: dict[tuple, tuple[dict, list[Flag], list[Flag]]] = {}
        w, wind, n = e.walls, e.wind, len(site.panels)
        mark, material, self.height, width, thickness, opening_area, bracing = (
            list(e.columns[k]) for k in ("mark", "material", "height", "width", "thickness",
                                         "opening_area", "bracing"))
        self.kind = np.select([w.rigid, w.masonry & ~w.fresh, w.masonry],
                              ["rigid", "masonry", "fresh"], "strip")
        # each wall's row in the checks of the walls on their own, or of the braced walls; a
        # braced wall's speeds are those of its bracing
        self.is_braced, self.row = np.zeros(n, dtype=bool), np.zeros(n, dtype=np.int64)
        limit, stand_down = e.limit, e.stand_down
        if e.braces is not None:
            bs = e.braces
            self.is_braced[bs.index] = True
            self.row[bs.index] = np.arange(len(bs.index))
            limit, stand_down = limit.copy(), stand_down.copy()
            limit[bs.index], stand_down[bs.index] = e.braced_limit, e.braced_stand_down
            self._braced_walls(e, combos, [bracing[i] for i in bs.index.tolist()])
        else:
            self.braced, self.records = _CheckSet([], [], [], {}, []), []
        self.alone = np.flatnonzero(~self.is_braced)
        self.row[self.alone] = np.arange(len(self.alone))
        # each wall's place in a list of the walls on their own followed by the braced walls
        self.place = np.where(self.is_braced, len(self.alone) + self.row, self.row).tolist()
        kinds, way = np.unique(self.kind[self.alone], return_inverse=True)
        self.unbraced = _check_set(
            {name: (d[self.alone], c[self.alone]) for name, (d, c) in e.checks.items()},
            CHECK_INFO, combos, [(k, UNBRACED_SOURCES[k], self._alone_combinations(k))
                                 for k in kinds.tolist()], way)
        over_height = self._over_height(w)
        self.stands = (e.utilization <= 1.0) & ~over_height
        self.wall_notes = self._wall_notes(w, e.utilization, over_height, material, opening_area)
        # the fields of every wall's PanelResult that come straight from its panel or the arrays
        self.columns = {
            "mark": mark, "material": list(map(
                {name: m.kind for name, m in site.materials.items()}.__getitem__, material)),
            "height_ft": self.height, "width_ft": width, "thickness_in": thickness,
            "weight_lb": (w.face_weight * w.height * w.width * w.solidity).tolist(),
            "wind": _each(
                WindResult, n, basic_speed_mph=site.site.basic_wind_speed,
                period_factor=w.period_factor.tolist(),
                period_factor_from="set" if site.site.period_factor else "standing time",
                design_speed_mph=e.design_speed.tolist(), kz=wind.kz.tolist(),
                kd=asce7.KD_WALLS, kzt=w.kzt, ke=w.ke, gust_factor=asce7.GUST_FACTOR,
                velocity_pressure_psf=wind.q.tolist(), force_coefficient=wind.cf_case_a.tolist(),
                opening_factor=wind.opening.tolist(), force_lb=wind.force_a.tolist(),
                resultant_height_ft=np.where(w.rigid, wind.lever, wind.lever_strip).tolist(),
                solidity=w.solidity.tolist(),
                minimum_pressure_governs=wind.minimum_governs.tolist(),
                end_zone_force_coefficient=wind.cf_end.tolist(),
                interior_force_coefficient=wind.cf_interior.tolist()),
            "unbraced": _each(
                UnbracedResult, n, utilization=e.utilization.tolist(),
                stands=self.stands.tolist(),
                working_limit_speed_mph=e.limit.tolist(),
                stand_down_speed_mph=e.stand_down.tolist(),
                max_height_ft=_or_none(self._capped(w, e.max_height)),
                max_height_at_limit_ft=_or_none(self._capped(w, e.max_at_limit)),
                max_height_structural_ft=_or_none(e.max_height)),
            "working_limit_speed_mph": limit.tolist(),
            "stand_down_speed_mph": stand_down.tolist(),
            "sustained_equivalents_mph": gusts.sustained_equivalents_of_each(stand_down),
            "fresh_working_limit_speed_mph": _or_none(e.fresh_limit),
            "fresh_stand_down_speed_mph": _or_none(e.fresh_stand_down),
            "fresh_sustained_equivalents_mph": _fresh_sustained(e.fresh_stand_down)}

    def _braced_walls(self, e: Evaluation, combos: dict, bracings: list):
        """The checks, §8 records, notes and hardware of the braced walls (`bracings`: their
        panels' bracing), by row."""
        site = self.site
        self.bracings = bracings
        self.brace_type, foot_anchor, wall_anchor = (
            list(e.columns[k]) for k in ("brace_type", "foot_anchor", "wall_anchor"))
        # brace and foot anchor types, and a sill fastening given or not: each way's checks'
        # sources and combinations
        sill = (~np.isnan(e.braces.sill)).tolist()
        ways: dict[tuple, int] = {}
        self.way = np.array([ways.setdefault(key, len(ways))
                             for key in zip(self.brace_type, foot_anchor, sill)], dtype=np.int64)
        self.hardware_of_way = [self._hardware(key[:2]) for key in ways]
        self.braced = _check_set(e.braced_checks, {**braced.CHECKS, **REVERSE_INFO}, combos,
                                 [("braced", sources, self._combinations(key))
                                  for (sources, *_), key in zip(self.hardware_of_way, ways)],
                                 self.way)
        self.notes = brace_notes(site, e, [site.brace_types[t] for t, *_ in ways], self.way)
        self.sill_uplift = self._sill_uplift(e)
        self.records = braced.braced_records(
            e.braces, e.brace_forces, self.brace_type, wall_anchor, foot_anchor,
            self.braced.brace_utilization, _or_none(e.braced_limit_missing), self.sill_uplift)

    def _sill_uplift(self, e: Evaluation) -> tuple[np.ndarray, np.ndarray]:
        """The sill uplift of each braced framed wall at the design wind, lb per brace and per
        ft of sill (NaN: not framed), from its sill uplift check: the lift less the factored
        weight (the check's capacity less the sill fastening)."""
        bs = e.braces
        lift, held = e.braced_checks["sill uplift"]
        width = e.walls.width[bs.index]
        weight = held - np.nan_to_num(bs.sill) * width
        return braced.sill_uplift(lift, weight, bs.mask.sum(axis=1), width)

    def _alone_combinations(self, kind: str) -> dict[str, str]:
        """`_combinations` of a wall standing on its own of `kind` (as in UNBRACED_SOURCES)."""
        f = COMBINATIONS[self.site.site.design_basis]
        if f.allowable is None:
            return {}
        allowable = ALLOWABLE_ALONE | (ALLOWABLE_MASONRY if kind == "masonry" else set())
        return {name: _on_allowable(f, kind_of) for name, (_, kind_of, _) in CHECK_INFO.items()
                if name in allowable}

    def _combinations(self, key: tuple) -> dict[str, str]:
        """The combination of each braced check of allowable capacity that differs from the
        basis's: under LRFD, the ASD combinations (design.md §3, method notes §1)."""
        f = COMBINATIONS[self.site.site.design_basis]
        if f.allowable is None:
            return {}
        brace_type, foot_anchor, sill = key
        fa = self.site.anchor_types[foot_anchor] if foot_anchor else None
        strength = braced.strength_checks(self.site.brace_types[brace_type],
                                          fa.kind if fa else None, sill)
        return {name: _on_allowable(f, kind) for name, (_, kind, _) in braced.CHECKS.items()
                if name not in strength}

    def panels(self) -> list[PanelResult]:
        """The result object of every wall, in the site's order (asked once: the objects take
        the lists and records made for this evaluation)."""
        alone, found = self.unbraced, self.braced
        status = self._in_site_order(
            ["stands" if ok else "needs_braces" for ok in self.stands[self.alone].tolist()],
            ["braced" if ok else "unsafe" for ok in found.strength_ok])
        return _each(PanelResult, len(self.place), status=status,
                     checks=self._in_site_order(alone.checks, found.checks),
                     flags=self._flags(),
                     governing_element=self._in_site_order(alone.governing, found.governing),
                     braces=self._in_site_order([None] * len(self.alone), self.records),
                     **self.columns)

    def _in_site_order(self, of_alone: list, of_braced: list) -> list:
        """Every wall's value in the site's order, from those of the walls on their own and of
        the braced walls, each by row."""
        return list(map((of_alone + of_braced).__getitem__, self.place))

    def _capped(self, w: Walls, height: np.ndarray) -> np.ndarray:
        """The tallest each wall may stand unbraced: masonry no taller than OSHA 1926.706(b)
        allows."""
        limit = self.rule["masonry_unbraced_height_ft"]
        return height if limit is None else np.where(w.masonry, np.minimum(height, limit), height)

    def _over_height(self, w: Walls) -> np.ndarray:
        """The masonry walls taller than OSHA 1926.706(b) lets stand unbraced."""
        limit = self.rule["masonry_unbraced_height_ft"]
        return w.masonry & (w.height > limit) if limit is not None else np.zeros_like(w.masonry)

    def _wall_notes(self, w: Walls, utilization: np.ndarray, over_height: np.ndarray,
                    material: list[str], opening_area: list) -> np.ndarray:
        """Per wall, what its own flags need, as bits; a braced wall's leave out how it would
        stand alone (its bracing answers for that)."""
        notes = np.zeros(len(material), dtype=np.int64)
        _note(notes, FAILS_UNBRACED, (utilization > 1.0) & ~self.is_braced)
        _note(notes, OVER_HEIGHT, over_height & ~self.is_braced)
        _note(notes, MOSTLY_OPEN, 1.0 - w.solidity > 0.3)
        _note(notes, OPENING_BY_AREA, np.array([bool(a) for a in opening_area], dtype=bool))
        _note(notes, RAISED_BASE, w.base > 0)
        _note(notes, FRESH_MORTAR, self.kind == "fresh")
        unsheathed = {name: m.kind == "framed" and not m.sheathed
                      for name, m in self.site.materials.items()}
        _note(notes, OPEN_FRAMING, np.array([unsheathed[m] for m in material], dtype=bool))
        return notes

    def _flags(self) -> list[list[Flag]]:
        """Every wall's flags in the site's order: those of the wall on its own, then those of
        its bracing."""
        flags: list[list[Flag]] = [[] for _ in self.place]
        self._wall_flags(flags)
        if self.e.braces is not None:
            self._braced_flags(flags)
        return flags

    def _wall_flags(self, flags: list[list[Flag]]):
        """Adds the flags of each wall standing on its own (`wall_notes` says which)."""
        e, rule, notes = self.e, self.rule, self.wall_notes
        at = np.flatnonzero(notes & FAILS_UNBRACED)
        _add(flags, at, [Flag("fails-unbraced", "danger",
                              f"cannot stand on its own at the design wind (utilization "
                              f"{utilization:.2f}): brace it before release from the crane",
                              "ASCE 7-16 §29.3, statics")
                         for utilization in e.utilization[at].tolist()])
        at = np.flatnonzero(notes & OVER_HEIGHT)
        _add(flags, at, [Flag("masonry-over-8ft", "danger",
                              f"masonry wall {self.height[k]:.1f} ft tall: over "
                              f"{rule['masonry_unbraced_height_ft']:g} ft it must be braced "
                              f"until permanent supports are in place",
                              self.source["masonry_unbraced_height_ft"]) for k in at.tolist()])
        at = np.flatnonzero(notes & MOSTLY_OPEN)
        _add(flags, at, [Flag("mostly-open", "warning",
                              f"{1.0 - solidity:.0%} open: checked as an open wall (open-sign "
                              f"coefficients on the solid area)", "ASCE 7-16 Figure 29.3-1 note 3")
                         for solidity in e.walls.solidity[at].tolist()])
        _add(flags, np.flatnonzero(notes & OPENING_BY_AREA),
             FIXED_FLAGS["opening-position-unknown"])
        at = np.flatnonzero(notes & RAISED_BASE)
        _add(flags, at, [Flag("raised-base", "notice",
                              f"base {self.site.panels[k].base_elevation:g} ft above grade: "
                              f"s/h < 1 coefficients", "ASCE 7-16 Figure 29.3-1")
                         for k in at.tolist()])
        _add(flags, np.flatnonzero(notes & FRESH_MORTAR), FIXED_FLAGS["fresh-mortar"])
        _add(flags, np.flatnonzero(notes & OPEN_FRAMING), FIXED_FLAGS["open-framing"])

    def _hardware(self, key: tuple[str, str | None]) -> tuple[dict, list[Flag], list[Flag]]:
        """The check sources, brace flags and anchor flags that follow from a brace and foot
        anchor type (`key`) alone, the same for every wall that uses them: worked out once."""
        if key not in self.hardware:
            site, (brace_type, foot_anchor) = self.site, key
            bt = site.brace_types[brace_type]
            fa = site.anchor_types[foot_anchor] if foot_anchor else None
            brace_flags, anchor_flags = [], []
            if bt.compression_only:
                brace_flags.append(Flag(
                    "compression-only", "notice", f"brace {brace_type} works in compression "
                    "only: with the wind away from it the wall stands on its own (checked as "
                    "such)", "method notes §4"))
            if bt.kind == "pipe":
                pipe = PIPES[bt.section]
                if not members.pipe_wall_nonslender(pipe.od_in, pipe.t_design_in,
                                                    bt.yield_strength / 1000.0):
                    brace_flags.append(Flag(
                        "slender-pipe-wall", "danger", f"{bt.section} at Fy "
                        f"{bt.yield_strength / 1000.0:g} ksi has a slender wall: its local "
                        "buckling is not checked here", "AISC 360-16 Table B4.1a"))
            if fa is not None:  # what its kind says of the type itself (anchor_kinds.KINDS)
                anchor_flags += [Flag(*made) for made in ANCHOR_KINDS[fa.kind].notes(
                    fa, foot_anchor)]
            self.hardware[key] = (braced.sources(bt.kind, fa.kind if fa else None),
                                  brace_flags, anchor_flags)
        return self.hardware[key]

    def _braced_flags(self, flags: list[list[Flag]]):
        """Adds the flags of each braced wall: its failing checks, rules of practice, robustness
        (§6), with those of its brace and anchor types (`notes` says which)."""
        e, rule, source, notes = self.e, self.rule, self.source, self.notes
        bs = e.braces
        wall = bs.index  # each row's wall
        walls = wall.tolist()
        failing = self.braced.failing
        for r, c in failing:
            serviceability = c.element in braced.SERVICEABILITY
            flags[walls[r]].append(Flag(
                f"{_code(c.element)}-over", "warning" if serviceability else "danger",
                f"{c.element}: utilization {c.utilization:.2f}"
                + (" (the wall would crack)" if serviceability else ""), c.source))
        lifted = sorted({r for r, c in failing if c.element == "base uplift"})
        _add(flags, wall[lifted], FIXED_FLAGS["braces-lift-wall"])
        per_brace, per_ft = self.sill_uplift
        rows = np.flatnonzero(per_ft > 0.0)
        _add(flags, wall[rows], [Flag(
            "sill-uplift", "danger" if not given > 0.0 or given < plf else "notice",
            f"the braces lift the sill: {plf:.0f} lb per ft ({lb:.0f} lb per brace) beyond its "
            f"weight, which the sill fastening must hold"
            + (f" ({given:.0f} lb per ft given)" if given > 0.0 else
               ": no sill_fastening is given") + "; the base kick-out then has no friction to "
            "rely on: the sill fastening holds it too", "statics, method notes §4")
            for lb, plf, given in zip(per_brace[rows].tolist(), per_ft[rows].tolist(),
                                      np.nan_to_num(bs.sill[rows]).tolist())])
        rows = np.flatnonzero(notes & TOO_FEW)
        _add(flags, wall[rows], [Flag("too-few-braces", "danger", f"{self.bracings[r].count} "
                                      f"brace(s); at least {rule['minimum_braces_per_panel']:g} "
                                      "per wall", source["minimum_braces_per_panel"])
                                 for r in rows.tolist()])
        rows = np.flatnonzero(notes & ANGLE_OUTSIDE)
        _add(flags, wall[rows], [Flag("brace-angle", "warning", f"brace angle {angle:.0f} deg is "
                                      f"outside {rule['brace_angle_min_deg']:g} to "
                                      f"{rule['brace_angle_max_deg']:g} deg",
                                      source["brace_angle_min_deg"])
                                 for angle in bs.angle[rows].tolist()])
        rows = np.flatnonzero(notes & LOW_INSERT)
        _add(flags, wall[rows], [Flag("low-insert", "notice", f"insert at "
                                      f"{self.bracings[r].insert_height / self.height[k]:.0%}"
                                      f" of the height, below {rule['insert_min_height_ratio']:.0%}",
                                      source["insert_min_height_ratio"])
                                 for r, k in zip(rows.tolist(), wall[rows].tolist())])
        _add(flags, wall[np.flatnonzero(notes & UNEQUAL_SHARING)], FIXED_FLAGS["unequal-sharing"])
        _add(flags, wall[np.flatnonzero(notes & TWO_BRACES)], FIXED_FLAGS["no-margin"])
        rows = np.flatnonzero((notes & (TWO_BRACES | STRUCK_BELOW_STAND_DOWN))
                              == STRUCK_BELOW_STAND_DOWN)  # two braces: the flag above instead
        speeds = list(zip(_whole_mph(e.braced_limit_missing[rows]),
                          _whole_mph(e.braced_stand_down[rows])))
        # one flag for the walls whose speeds read the same
        said = {(missing, stand_down): Flag(
            "no-margin", "notice", f"with one brace struck, the wall's limit falls to {missing} "
            f"mph, below the stand-down gust {stand_down} mph",
            "method notes §4, robustness") for missing, stand_down in set(speeds)}
        _add(flags, wall[rows], list(map(said.__getitem__, speeds)))
        rows = np.flatnonzero(notes & SLENDER)
        _add(flags, wall[rows], [Flag("slender-brace", "danger", f"brace slenderness "
                                      f"{slenderness:.0f} exceeds {limit:.0f}: add lateral struts "
                                      "or a knee brace", "AISC 360-16 §E2 user note / NDS 2018 "
                                      "§3.7.1.4")
                                 for slenderness, limit in zip(
                                     bs.slenderness[rows].tolist(),
                                     bs.slenderness_limit[rows].tolist())])
        self._shared_by_way(flags, [brace for _, brace, _ in self.hardware_of_way])
        rows = np.flatnonzero(notes & OUTSIDE_RATED)
        types = [self.site.brace_types[self.brace_type[r]] for r in rows.tolist()]
        _add(flags, wall[rows], [Flag("outside-rated-range", "danger", f"brace length "
                                      f"{length:.1f} ft is outside the rated table "
                                      f"({bt.lengths[0]:g} to {bt.lengths[-1]:g} ft): no rating",
                                      "maker's rated table")
                                 for length, bt in zip(bs.length[rows].tolist(), types)])
        self._shared_by_way(flags, [anchor for _, _, anchor in self.hardware_of_way])
        _add(flags, wall[np.isnan(e.braced_limit)], FIXED_FLAGS["capacity-unknown"])

    def _shared_by_way(self, flags: list[list[Flag]], of_way: list[list[Flag]]):
        """Adds to each braced wall the flags that `of_way` gives its brace and foot anchor
        types (by `way`)."""
        for way, shared in enumerate(of_way):
            walls = self.e.braces.index[self.way == way]
            for flag in shared:
                _add(flags, walls, flag)


# Flags that read the same on every wall they are on: made once, shared by those walls.
FIXED_FLAGS = {f.code: f for f in (
    Flag("opening-position-unknown", "notice",
         "openings given by area only: resultant kept at 0.55 h", "ASCE 7-16 Figure 29.3-1"),
    Flag("fresh-mortar", "notice",
         "mortar not yet cured: stability by weight only, no flexural tension",
         "TMS 402-16 §8.2 (unconfirmed value: confirm in TMS 402-16)"),
    Flag("open-framing", "notice", "unsheathed framing checked as an open wall",
         "ASCE 7-16 §29.3"),
    Flag("braces-lift-wall", "danger", "the braces in compression lift the wall off its base",
         "statics, method notes §4"),
    Flag("unequal-sharing", "notice",
         "3 or more braces share unevenly through slop unless pre-tensioned", "common practice"),
    Flag("no-margin", "notice", "if one of its two braces is struck, nothing but friction at "
         "the base holds the wall against twist (none is credited): keep equipment clear of the "
         "braces", "method notes §4, robustness"),
    Flag("capacity-unknown", "warning", "a brace or anchor capacity is unknown (outside its "
         "rated range?): no working-limit speed", "method notes §5"),
)}

# What a wall's own flags need, worked out for every wall at once (`_Results._wall_notes`).
FAILS_UNBRACED, OVER_HEIGHT, MOSTLY_OPEN, OPENING_BY_AREA, RAISED_BASE, FRESH_MORTAR, \
    OPEN_FRAMING = (1 << k for k in range(7))


# What a braced wall's flags need, worked out for every braced wall at once (`brace_notes`).
TOO_FEW, ANGLE_OUTSIDE, LOW_INSERT, UNEQUAL_SHARING, TWO_BRACES, STRUCK_BELOW_STAND_DOWN, \
    SLENDER, OUTSIDE_RATED = (1 << k for k in range(8))


def brace_notes(site: Site, e: Evaluation, types: list, way: np.ndarray) -> np.ndarray:
    """Per braced wall, the rules of practice and robustness notes it meets, as bits
    (`types[way]`: each wall's brace type)."""
    w, bs = e.walls, e.braces
    count = bs.mask.sum(axis=1)
    notes = np.zeros(len(bs.index), dtype=np.int64)
    least = site.rule_value("minimum_braces_per_panel")
    if least:
        _note(notes, TOO_FEW, count < least)
    lo, hi = site.rule_value("brace_angle_min_deg"), site.rule_value("brace_angle_max_deg")
    if lo and hi:
        _note(notes, ANGLE_OUTSIDE, ~((lo - 1e-9 <= bs.angle) & (bs.angle <= hi + 1e-9)))
    ratio = site.rule_value("insert_min_height_ratio")
    if ratio:
        _note(notes, LOW_INSERT, bs.insert < ratio * w.height[bs.index] - 1e-9)
    _note(notes, UNEQUAL_SHARING, (count >= 3) & ~bs.pretensioned)
    _note(notes, TWO_BRACES, count == 2)
    missing = e.braced_limit_missing
    with np.errstate(invalid="ignore"):
        _note(notes, STRUCK_BELOW_STAND_DOWN, (count > 2) & ~np.isnan(missing)
              & (missing < e.braced_stand_down))
        _note(notes, SLENDER, bs.slenderness > bs.slenderness_limit)
    rated = np.array([t.kind == "rated" for t in types], dtype=bool)[way]
    shortest = np.array([t.lengths[0] if t.kind == "rated" else np.nan for t in types])[way]
    longest = np.array([t.lengths[-1] if t.kind == "rated" else np.nan for t in types])[way]
    _note(notes, OUTSIDE_RATED, rated & ~((shortest <= bs.length) & (bs.length <= longest)))
    return notes


def _note(notes: np.ndarray, bit: int, where: np.ndarray):
    """Sets `bit` in the notes of the walls `where` holds."""
    np.bitwise_or(notes, np.where(where, bit, 0), out=notes)


def _add(flags: list[list[Flag]], walls: np.ndarray, made: list[Flag] | Flag):
    """Adds to the flags of each of `walls` its own of `made` (a list, one per wall), or the one
    flag `made` that they share."""
    for k, flag in zip(walls.tolist(), made if isinstance(made, list) else repeat(made)):
        flags[k].append(flag)


# The sources of a wall's own checks by how it stands: a rigid panel, cured or fresh masonry,
# another wall built in place.
UNBRACED_SOURCES = {
    "rigid": {},
    "masonry": {"overturning": "TMS 402-16 §8.2 flexural tension (unconfirmed value: confirm in TMS "
                "402-16), or W t/2 if "
                               "larger",
                "sliding at base": "TMS 402-16 §8.2.6.2 bed-joint shear (unconfirmed value: "
                "confirm in TMS 402-16), or "
                                   "friction if larger"},
    "fresh": {"overturning": "statics, W t/2 about the bed joint (fresh mortar: weight only)",
              "sliding at base": "friction, mu 0.6 (fresh mortar: no bond)"},
    "strip": {"overturning": "statics, W t/2 about the sill"},
}


@dataclass(frozen=True)
class _CheckSet:
    """The checks of the walls on their own, or of the braced walls, and per wall what the
    views ask of them first."""

    checks: list[list[Check]]             # each wall's checks that apply to it (demand known)
    governing: list[str]                  # the check of the largest strength utilization
    strength_ok: list[bool]               # every strength check passes
    failing: list[tuple[int, Check]]      # each check over 1.0 (serviceability too) and its
                                          # row, wall by wall
    brace_utilization: list[float | None]  # the largest of the brace's own checks


def _check_set(arrays: dict, info: dict, combos: dict, ways: list[tuple[str, dict]],
               way: np.ndarray) -> _CheckSet:
    """The checks of `arrays` (demand and capacity arrays by name, one entry per wall) with
    their summaries. Each wall is checked one of `ways` (`way` gives which): its kind as in
    UNBRACED_SOURCES or 'braced', which names the regions, the sources it has of its own and
    the combinations of its own (by element: allowable capacities under LRFD)."""
    names = [key.partition("|")[0] for key in arrays]
    demand = np.array([d for d, _ in arrays.values()]).reshape(len(arrays), len(way))
    capacity = np.array([c for _, c in arrays.values()]).reshape(demand.shape)
    ratios = np.where(np.isnan(demand), -np.inf, _ratio(demand, capacity))
    strength = np.where(np.array([n not in braced.SERVICEABILITY for n in names])[:, None],
                        ratios, -np.inf)
    brace = np.where(np.array([n.startswith("brace") for n in names])[:, None], ratios, -np.inf)
    brace = brace.max(axis=0, initial=-np.inf)
    # each way's checks, named once: element, region, unit, combination, source
    named = [(element, regions[kind], unit, over.get(element, combination),
              sources.get(element, source))
             for kind, sources, over in ways
             for element, regions, unit, combination, source in _check_columns(arrays, info,
                                                                                combos)]
    # every check that applies, wall by wall, in the order of the arrays; each field a list
    applies = ~np.isnan(demand.T)
    wall, column = np.nonzero(applies)
    which = way[wall] * len(arrays) + column
    element, region, unit, combination, source = np.array(
        named, dtype=object).reshape(-1, 5)[which].T.tolist()
    made = list(map(Check, element, region, demand.T[applies].tolist(),
                    capacity.T[applies].tolist(), unit, combination, source))
    ends = np.cumsum(applies.sum(axis=1)).tolist()
    # a wall with some check over 1.0: the checks that do not pass (Check.passes)
    fails = np.flatnonzero((ratios.max(axis=0, initial=-np.inf) > 1.0)[wall]
                           & ~(ratios.T[applies] <= 1.0))
    failing = list(zip(wall[fails].tolist(), map(made.__getitem__, fails.tolist())))
    governing = [f"{element} ({region})" for element, region, *_ in named]
    return _CheckSet([made[start:end] for start, end in zip([0, *ends], ends)],
                     [governing[k] for k in (way * len(arrays)
                                             + strength.argmax(axis=0)).tolist()],
                     (strength.max(axis=0, initial=-np.inf) <= 1.0).tolist(),
                     failing, np.where(brace == -np.inf, None, brace).tolist())


def _check_columns(arrays: dict, info: dict, combos: dict) -> list[tuple]:
    """Each check of a dict of demand/capacity arrays as (element, region by kind of wall, unit,
    combination, source).

    A key 'element|region' names its region; '*' is the whole panel, or the end zone of a wall
    built in place; no region is the worst brace. Walls built in place are checked per ft.
    """
    out = []
    for key in arrays:
        element, _, region = key.partition("|")
        unit, kind, source = info[element]
        regions = {"rigid": "whole panel" if region == "*" else region,
                   "braced": region or "worst brace"}
        strip = f"{'end zone' if region == '*' else region}, per ft"
        regions.update(masonry=strip, fresh=strip, strip=strip)
        out.append((element, regions, unit, combos[kind], source))
    return out


def _code(element: str) -> str:
    """A flag code from a check's name: its words joined by hyphens ('base kick-out' ->
    'base-kick-out'; 'overturning (wind away from the braces)' ->
    'overturning-wind-away-from-the-braces')."""
    return "-".join(re.findall(r"[a-z0-9]+(?:-[a-z0-9]+)*", element.lower()))


def _on_allowable(f: Factors, kind: str) -> str:
    """The name of the combination of `kind` ('resisting', 'adding', 'wind') that an allowable
    capacity takes under the basis `f` (LRFD): ASD's, and says so."""
    a = f.allowable
    named = {"resisting": a.resisting, "adding": a.adding, "wind": a.wind_only}
    return f"{named[kind]} (allowable capacity: ASD combination under LRFD)"


def _each(cls, n: int, **fields_of) -> list:
    """`n` objects of the dataclass `cls` from each field's values by name: a list holds one
    per object, anything else is every object's."""
    names = [f.name for f in fields(cls)]
    if set(fields_of) != set(names):
        raise TypeError(f"{cls.__name__} fields not given: {set(names) ^ set(fields_of)}")
    return list(map(cls, *(v if isinstance(v, list) else repeat(v, n)
                           for v in map(fields_of.get, names))))


def _whole_mph(speeds: np.ndarray) -> list[int]:
    """Speeds (finite, not negative) rounded to whole mph as f"{x:.0f}" rounds them (half to
    even), many at once."""
    return np.rint(speeds).astype(np.int64).tolist()


def _or_none(x: np.ndarray) -> list[float | None]:
    """The values as a list, None where not known (NaN)."""
    return np.where(np.isnan(x), None, x).tolist()


def _fresh_sustained(stand_down: np.ndarray) -> list[dict]:
    """The sustained equivalents of each wall's stand-down gust with fresh mortar, where it has
    one (none: an empty dict)."""
    means: list[dict] = [{} for _ in range(len(stand_down))]
    known = np.flatnonzero(~np.isnan(stand_down))
    for k, of_wall in zip(known.tolist(), gusts.sustained_equivalents_of_each(stand_down[known])):
        means[k] = of_wall
    return means
