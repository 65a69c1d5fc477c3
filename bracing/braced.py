"""Braced walls (design.md §6): brace forces and every element's check, vectorised over walls.

`gather_braces` reads each braced wall's layout and its brace and anchor capacities into arrays
once; `braced_checks` then gives demand and capacity of each element for any wind (design or an
observed gust), so the working-limit speed is found by bisection like the unbraced one.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, fields, replace

import numpy as np

from bracing import anchors, braces, lines, members, stability
from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.data_members import DRESSED_SIZES_IN, LUMBER_GRADES, PIPES
from bracing.model import BRACING_FIELDS, read_panels
from bracing.wind import asce7

IN = 1.0 / 12.0  # ft per in
HARDWARE = ("brace_type", "wall_anchor", "foot_anchor")  # a layout's type names


@dataclass(frozen=True)
class BraceSet:
    """The braced walls of a site as arrays: m walls by k brace slots (mask marks real braces)."""

    index: np.ndarray           # panel index of each braced wall
    positions: np.ndarray       # (m, k) ft from the wall's left edge
    mask: np.ndarray            # (m, k)
    insert: np.ndarray          # insert height above the wall's base, ft
    anchor_distance: np.ndarray  # foot from the wall face, ft
    angle: np.ndarray           # deg from horizontal
    length: np.ndarray          # pin to pin, ft
    lean: np.ndarray            # ft at the top
    slop: np.ndarray            # ft at the insert
    compression: np.ndarray     # allowable brace compression (lb) before self-weight bending
    tension: np.ndarray         # allowable brace tension (lb)
    connection: np.ndarray      # rated end fittings (lb), NaN if not given
    compression_only: np.ndarray  # the brace type works in compression only
    brace_strength: np.ndarray  # its compression capacity is a strength value (phi Pn, LRFD)
    tension_strength: np.ndarray  # its tension capacity is (AISC 360-16 §D2, not a rating)
    sill: np.ndarray            # framed walls: the sill fastening's allowable uplift, plf (NaN)
    self_weight_ratio: np.ndarray  # pipe: self-weight moment / available moment (0 otherwise)
    euler_load: np.ndarray      # pipe: Pe1 for the moment amplifier (lb), inf otherwise
    insert_tension: np.ndarray  # wall insert ratings (lb), NaN if no wall anchor given
    insert_shear: np.ndarray
    foot_kind: np.ndarray       # '' or a kind of anchor_kinds.KINDS
    foot_tension: np.ndarray    # slab/stake allowable tension, helical allowable, deadman weight
    foot_shear: np.ndarray      # slab/stake allowable shear
    foot_mu: np.ndarray         # deadman friction / FS
    block_length: np.ndarray    # deadman length along the brace, ft (NaN: not given)
    pin_height: np.ndarray      # deadman: brace foot pin above the block's base, ft
    pin_from_toe: np.ndarray    # deadman: the pin from the toe (the edge nearer the wall), ft
    block_width: np.ndarray     # deadman width across the brace, ft (NaN: not given)
    block_bearing: np.ndarray   # allowable bearing under the block, psf
    torque_factor: np.ndarray   # helical K_t (1/ft) and factor of safety, for the torque
    torque_safety: np.ndarray
    rupture: np.ndarray         # concrete modulus of rupture, psi (NaN: not concrete)
    pretensioned: np.ndarray
    stiff: np.ndarray           # a continuous stiff member (strongback, waler) ties the braces
    slenderness: np.ndarray     # governing Lc/r (pipe) or le/d (lumber), NaN for rated braces
    slenderness_limit: np.ndarray
    basis: str                  # "ASD" | "LRFD" (the amplifier's alpha)


def take(obj, rows):
    """The same arrays restricted (or repeated) to `rows` along their first axis; the object
    itself when `rows` is every row in order (its arrays are never changed in place)."""
    arrays = {f.name: v for f in fields(obj)
              if isinstance(v := getattr(obj, f.name), np.ndarray) and v.ndim >= 1}
    size = len(next(iter(arrays.values())))
    if len(rows) == size and np.array_equal(rows, np.arange(size)):
        return obj
    return replace(obj, **{name: rows_of(v, rows) for name, v in arrays.items()})


UNCHECKED = ("index", "positions", "mask", "anchor_distance", "length", "lean", "slop",
             "pretensioned", "stiff", "slenderness", "slenderness_limit", "torque_factor",
             "torque_safety", "rupture", "compression_only", "brace_strength",
             "tension_strength", "sill")
LOADED = ("index", "positions", "insert", "lean", "slop", "stiff")  # and the mask: what
#                                                                    brace_loads reads


def for_checks(bs: BraceSet) -> BraceSet:
    """`bs` without the arrays `braced_checks` does not read and without its mask (None: `take`
    leaves them), for a search that takes its rows again at every step, with each row's mask;
    its loads and standing parts are worked out beforehand."""
    return replace(bs, **dict.fromkeys(UNCHECKED))


def for_loads(bs: BraceSet, rows, mask) -> BraceSet:
    """The layouts of the walls `rows` of `bs` (a wall listed once for each of its variants)
    with the braces `mask` marks: only what `brace_loads` reads, the rest None."""
    unread = [f.name for f in fields(bs) if f.name not in LOADED and f.name != "basis"]
    return replace(take(replace(bs, **dict.fromkeys(unread)), rows), mask=mask)


def rows_of(array, rows):
    """`array[rows]` along the first axis (np.take copies the rows of a 2-D array many times
    faster than indexing does)."""
    return np.take(array, rows, axis=0)


def gather_braces(site, basis: str, edges: dict[str, float] | None = None,
                  columns: dict[str, tuple] | None = None) -> BraceSet | None:
    """Read every braced wall's layout and capacities (None when no wall is braced).

    `edges`: least edge distance (in) of each wall's slab-anchor feet from the plan; `columns`:
    the panels' fields (model.read_panels), if already read."""
    panel = columns or read_panels(site)
    rows = list(panel["braced"])
    if not rows:
        return None
    width, marks = ([panel[k][i] for i in rows] for k in ("width", "mark"))
    column = {name: panel[name] for name in BRACING_FIELDS}
    count, given = np.array(column.pop("count")), column.pop("positions")
    strip = np.arange(count.max())
    positions = np.where(strip < count[:, None], braces.default_positions(
        np.array(width)[:, None], count[:, None], strip), np.nan)
    for r in [r for r, at in enumerate(given) if at]:
        positions[r, :count[r]] = given[r]
    distance, angle = (np.array(column.pop(k), dtype=float) for k in ("anchor_distance", "angle"))
    column = {k: np.array(v, dtype=object if k in HARDWARE else None) for k, v in column.items()}
    edge_of = edges or {}
    column["edge_distance"] = np.array([edge_of.get(mark, np.inf) for mark in marks])
    return brace_set(site, np.array(rows), positions, distance, angle, column, basis)


def brace_set(site, rows, positions, anchor_distance, angle, column: dict, basis) -> BraceSet:
    """A BraceSet from layout columns (arrays over m walls); NaN positions are empty slots.

    `anchor_distance` or `angle` gives the foot (NaN where the other is given); `column` holds
    insert_height, insert_offset (in), foot_offset (in), base_below_slab, lean (in), slop (in),
    pretensioned, stiff_member (optional: none) and the type names brace_type, wall_anchor,
    foot_anchor.
    """
    c = column
    offsets = (c["insert_offset"] * IN, c["foot_offset"] * IN, c["base_below_slab"])
    distance = np.where(np.isnan(anchor_distance), braces.anchor_distance_for_angle(
        c["insert_height"], np.where(np.isnan(angle), 45.0, angle), *offsets), anchor_distance)
    _, _, theta, length = braces.brace_geometry(c["insert_height"], distance, *offsets)
    caps = _capacities(site, rows, c, length, theta, basis)
    return BraceSet(index=rows, positions=np.nan_to_num(positions), mask=~np.isnan(positions),
                    insert=c["insert_height"].astype(float), anchor_distance=distance,
                    angle=theta, length=length, lean=c["lean"] * IN, slop=c["slop"] * IN,
                    pretensioned=c["pretensioned"].astype(bool),
                    stiff=np.asarray(c.get("stiff_member", np.zeros(len(rows))), dtype=bool),
                    **caps,
                    basis=basis)


def _capacities(site, rows, c, length, angle, basis) -> dict[str, np.ndarray]:
    """Brace and anchor capacities of each braced wall, one vectorised call per type."""
    m = len(rows)
    out = {n: np.full(m, np.nan) for n in (
        "compression", "tension", "connection", "insert_tension", "insert_shear",
        "foot_tension", "foot_shear", "foot_mu", "block_length", "pin_height", "pin_from_toe",
        "block_width", "block_bearing", "torque_factor", "torque_safety", "slenderness",
        "slenderness_limit")}
    out["self_weight_ratio"] = np.zeros(m)
    out["euler_load"] = np.full(m, np.inf)
    out["foot_kind"] = np.full(m, "", dtype=object)
    out["compression_only"], out["brace_strength"], out["tension_strength"] = (
        np.zeros(m, bool) for _ in range(3))
    rupture = {name: braces.modulus_of_rupture(mat.compressive_strength or 2500.0)
               if mat.kind == "concrete" else np.nan for name, mat in site.materials.items()}
    material = [site.panels[i].material for i in rows]
    out["rupture"] = np.array([rupture[k] for k in material], dtype=float)
    sill = {name: np.nan if mat.sill_fastening is None else mat.sill_fastening
            for name, mat in site.materials.items()}
    out["sill"] = np.array([sill[k] for k in material], dtype=float)
    for name in set(c["brace_type"]):
        sel = c["brace_type"] == name
        bt = site.brace_types[name]
        values = _brace_capacity(bt, length[sel], angle[sel], basis)
        for key, v in zip(("compression", "tension", "self_weight_ratio", "euler_load",
                           "slenderness", "slenderness_limit"), values):
            out[key][sel] = v
        # A compression-only brace takes no tension: its tension and end fittings in
        # tension are not checked; the wind away from it is (evaluate.reverse_wind_checks).
        out["connection"][sel] = np.nan if bt.compression_only else (bt.end_connection
                                                                      or np.nan)
        out["compression_only"][sel] = bt.compression_only
        # AISC 360-16 strengths (phi Pn under LRFD); ratings and NDS ASD values are allowable
        out["brace_strength"][sel] = bt.kind == "pipe"
        out["tension_strength"][sel] = bt.kind == "pipe" and bt.tension_capacity is None
    for name in set(c["wall_anchor"]) - {None}:
        sel = c["wall_anchor"] == name
        wa = site.anchor_types[name]
        out["insert_tension"][sel] = wa.rated_tension or np.nan
        out["insert_shear"][sel] = wa.rated_shear or np.nan
    for name in set(c["foot_anchor"]) - {None}:
        sel = c["foot_anchor"] == name
        fa = site.anchor_types[name]
        out["foot_kind"][sel] = fa.kind
        plan_edge = c["edge_distance"][sel] if "edge_distance" in c else np.inf
        for key, value in ANCHOR_KINDS[fa.kind].capacity(fa, plan_edge, basis).items():
            out[key][sel] = value
    out["foot_kind"] = out["foot_kind"].astype(str)  # numpy strings compare many times faster
    return out


def _brace_capacity(bt, length, angle, basis):
    """(compression, tension, self-weight moment ratio, Euler load, slenderness, its limit)."""
    nan = np.full(np.shape(length), np.nan)
    if bt.kind == "unrated":
        return nan, bt.tension_capacity or nan, 0.0, np.inf, nan, nan
    # Tension as stated (model.BraceType: stated or compression_only, method notes §4).
    if bt.kind == "rated":
        # Outside the maker's table there is no rating: capacity 0, so the check fails visibly.
        comp = np.nan_to_num(members.rated_capacity(length, bt.lengths, bt.loads))
        return comp, bt.tension_capacity or nan, 0.0, np.inf, nan, nan
    if bt.kind == "pipe":
        s = PIPES[bt.section]
        fy = bt.yield_strength / 1000.0
        lc_in, lc_out = (members.knee_brace_lengths(length) if bt.knee_brace
                         else (length, length))
        if bt.lateral_struts:
            lc_out = length / (bt.lateral_struts + 1)
        comp = members.pipe_compression(s.area_in2, s.r_in, fy, lc_in, lc_out, basis)
        ten = (nan if bt.compression_only else
               bt.tension_capacity or members.pipe_tension(s.area_in2, fy, basis))
        span = lc_in  # self weight bends the brace in its vertical plane between supports
        m_sw = members.self_weight_moment(s.weight_plf, span, angle)
        mc = members.pipe_flexure(s.od_in, s.t_design_in, fy, basis)
        pe = members.euler_load(members.STEEL_E_KSI, s.i_in4, span)
        kl_r = members.slenderness(np.maximum(lc_in, lc_out), s.r_in)
        return comp, ten, m_sw / mc, pe, kl_r, members.LC_OVER_R_ADVISORY
    d_thin, d_wide = DRESSED_SIZES_IN[bt.size]
    grade = next(g for key, g in LUMBER_GRADES.items()
                 if key[0] == bt.species and key[1] == bt.grade)
    cf = (float(members.size_factor_fc(float(bt.size.split("x")[1])))
          if grade.size_class == "dimension" else 1.0)
    lc_in = length / 2.0 if bt.knee_brace else length
    lc_out = length / (bt.lateral_struts + 1)
    comp = members.lumber_compression(d_wide, d_thin, lc_in, lc_out, grade.fc_psi,
                                      grade.emin_psi, CF=cf)
    le_d = members.lumber_slenderness(d_wide, d_thin, lc_in, lc_out)
    return (comp, bt.tension_capacity or nan, 0.0, np.inf, le_d,
            members.LE_OVER_D_MAX_CONSTRUCTION)


@dataclass(frozen=True)
class BraceForces:
    """Factored forces of the braced walls under one wind (arrays over m walls, k braces)."""

    horizontal: np.ndarray  # (m, k) governing |R_h| of each brace, lb
    axial: np.ndarray       # (m, k) |P|, lb
    total: np.ndarray       # largest sum of R_h over the load cases, lb
    base_shear: np.ndarray  # largest |F - sum R_h| (plus lean), lb
    wind_force: np.ndarray  # the whole wall's force for that case, lb


@dataclass(frozen=True)
class BraceLoads:
    """Unfactored loads on the braced walls (lb): each brace's horizontal reaction to the wind,
    the largest and the least over a rigid panel's load cases (the even share plus the twist)
    or its own strip's largest of a wall built in place, and its share of the wall's weight
    leaning out of plumb, with each wall's sums. The wind is linear in q, so an observed gust's
    loads are those of 1 mph scaled by V^2; the lean does not scale."""

    most: np.ndarray        # (m, k) each brace's largest wind reaction over the load cases
    least: np.ndarray       # (m, k) and its least (a strip's brace: both its strip's); NaN at
    #                         an empty slot
    lean: np.ndarray        # (m, k) each brace's share of the lean
    total: np.ndarray       # (m,) largest sum of the braces' wind reactions over the cases
    wind_force: np.ndarray  # (m,) the whole wall's wind force in that case
    base_shear: np.ndarray  # (m,) F - sum R_h of the case where it is largest in size, signed:
    #                         it reverses where the insert is below the resultant
    lean_total: np.ndarray  # (m,) sum of the braces' horizontal reactions to the lean

    def take(self, rows) -> BraceLoads:
        """The loads of the walls `rows` only."""
        return BraceLoads(*(rows_of(getattr(self, f.name), rows) for f in fields(self)))

    def scaled(self, factor) -> BraceLoads:
        """The wind times `factor` (one value, or one per wall); the lean as it is."""
        factor = np.asarray(factor, dtype=float)
        each = factor[..., None] if factor.ndim else factor
        return replace(self, most=self.most * each, least=self.least * each,
                       total=self.total * factor, wind_force=self.wind_force * factor,
                       base_shear=self.base_shear * factor)


def brace_loads(walls, wind, bs: BraceSet, minimum_psf) -> BraceLoads:
    """The wind load cases on each braced wall and each brace's reactions (design.md §4, §6).

    A rigid panel's braces share each load case as a whole with the twist, and so do those of
    a wall built in place whose braces a continuous stiff member ties together (a strongback
    or waler); any other wall built in place gives each brace its own strip (each worked out
    for the walls that use it), under the worst of its pressure patterns. Worked out once for
    a wind: the reactions of any load factor and any scale follow from them."""
    rigid = walls.rigid[bs.index] | bs.stiff
    m, k = bs.mask.shape
    i = bs.index
    s, b = walls.height[i], walls.width[i]
    hb = bs.insert
    height = wind.lever[i]  # every strip's force at the wall's resultant height (§6)
    most, least = np.full((m, k), np.nan), np.full((m, k), np.nan)
    total, force, shear = np.zeros(m), np.zeros(m), np.zeros(m)
    lever = braces.brace_lever(bs.positions, bs.mask)
    rows = np.flatnonzero(rigid)
    if len(rows):  # a wall listed more than once (variants of its layout) is worked out once
        each, listed = np.unique(i[rows], return_inverse=True)
        case_force, case_at = (np.take(v, listed, axis=1)
                               for v in _case_loads(walls, wind, each, minimum_psf))
        sum_h = braces.total_brace_reaction(case_force, height[rows], hb[rows])
        arms = tuple(rows_of(v, rows) for v in lever)
        share, per_arm = braces.share_and_twist(sum_h, case_force, case_at, b[rows] / 2.0,
                                                arms)
        high, low = np.full(arms[2].shape, -np.inf), np.full(arms[2].shape, np.inf)
        pushed, sums, out = np.zeros(len(rows)), np.zeros(len(rows)), np.zeros(len(rows))
        for case, case_sum, even, twist in zip(case_force, sum_h, share, per_arm):
            shares = even[:, None] + twist[:, None] * arms[2]  # as braces.brace_shares
            high, low = np.maximum(high, shares), np.minimum(low, shares)
            pushed = np.where(case_sum > sums, case, pushed)  # the first case of the largest sum
            sums = np.maximum(sums, case_sum)
            kick = case - case_sum  # F - sum(R_h): the base shear (§6), signed
            out = np.where(np.abs(kick) > np.abs(out), kick, out)
        most[rows], least[rows], total[rows], force[rows], shear[rows] = high, low, sums, \
            pushed, out
    rows = np.flatnonzero(~rigid)
    if len(rows):  # walls built in place: each brace takes its own strip of wall
        each, listed = np.unique(i[rows], return_inverse=True)  # each wall's wind once
        strip = _strip_loads(walls, wind, each, listed, rows_of(bs.positions, rows),
                             rows_of(bs.mask, rows), minimum_psf)
        strip_h = braces.total_brace_reaction(strip, height[rows][:, None], hb[rows][:, None])
        most[rows] = least[rows] = strip_h
        total[rows], force[rows] = braces.slot_sum(strip_h), braces.slot_sum(strip)
        shear[rows] = force[rows] - total[rows]
    most, least = np.where(bs.mask, most, np.nan), np.where(bs.mask, least, np.nan)
    dead = walls.face_weight[i] * s * b * walls.solidity[i]
    lean_total = braces.lean_reaction(dead, walls.centroid_ratio[i] * s, s, hb, bs.lean, bs.slop)
    lean = braces.brace_shares(lean_total, np.zeros(m), b / 2.0, b / 2.0, bs.positions,
                               bs.mask, lever)
    # walls built in place without a stiff member: the lean shares equally (§6)
    count = braces.slot_sum(bs.mask, 0)
    lean = np.where(rigid[:, None], lean, np.where(bs.mask, (lean_total / count)[:, None],
                                                   np.nan))
    return BraceLoads(most, least, lean, total, force, shear, lean_total)


LOAD_CASES = 5  # Case A, Case B from either edge, Case C from either end (alone or on a line)


def _case_loads(walls, wind, i, minimum_psf) -> tuple[np.ndarray, np.ndarray]:
    """Forces (lb) of a rigid panel's load cases and where they act from its first edge (ft).

    Cases A, B (either edge) and C (either end), the braces carrying the twist; Case C is the
    largest of the panel alone and on its line each day, over its width from either end
    (`Wind.cf_left`, `cf_right`). An open wall (solidity < 0.7) takes no Case C."""
    b = walls.width[i]
    solid = walls.solidity[i] >= 0.7

    def force_of(cf):
        return np.where(solid, np.maximum(
            wind.q[i] * asce7.GUST_FACTOR * cf * wind.opening[i] * wind.area[i],
            (minimum_psf or 0.0) * wind.area[i]), 0.0)  # ASCE 7-16 Eq. 29.3-1 and §29.7
    centroid = walls.centroid_x_ratio[i] * b
    forces = [wind.force_a[i]] * 3 + [force_of(wind.cf_left[i]), force_of(wind.cf_right[i])]
    at = [centroid, centroid + 0.2 * b, centroid - 0.2 * b, wind.x_left[i], wind.x_right[i]]
    return np.array(forces), np.array(at)


def brace_forces(loads: BraceLoads, bs: BraceSet, f) -> BraceForces:
    """Per-brace factored forces, the governing load case of each brace (design.md §6).

    Each brace's wind reaction (factored) plus its lean: the larger in size of its largest and
    least over the cases (|x + lean| is largest at one end of the reactions' range). The base
    shear is F - sum(R_h) with the lean among the braces' reactions: the lean's reaction comes
    off it (design.md §6; it reverses where the insert is below the wind's resultant)."""
    lean_total, lean = f.dead_adds * loads.lean_total, f.dead_adds * loads.lean
    horizontal = np.fmax(np.abs(f.wind * loads.most + lean), np.abs(f.wind * loads.least + lean))
    horizontal = np.where(bs.mask, horizontal, 0.0)
    axial = braces.axial_force(horizontal, bs.angle[:, None])
    return BraceForces(horizontal, axial, f.wind * loads.total + lean_total,
                       np.abs(f.wind * loads.base_shear - lean_total), loads.wind_force)


def _strip_loads(walls, wind, i, listed, positions, mask, minimum_psf):
    """Wind on each brace's tributary strip of walls built in place (lb, in slot order):
    `positions` and `mask` are their braces as in BraceSet, a row for each layout, `listed` the
    wall of `i` of each (a wall may have more than one).

    Each strip runs from midway to its neighbours (the end strips to the wall's ends) and takes
    the worst of these patterns, each from either end (design.md §6): Case B of the wall alone
    as a pressure varying linearly along it, p_avg (1 + 2.4 (x/B - 1/2)) with p_avg =
    max(q G Cf_A, 16 psf) (it is never below Case A's uniform pressure, which needs no pattern
    of its own); and, on a solid wall, Case C by distance from the windward end of the wall
    alone and of its line each day, the largest coefficient over the strip.
    """
    s, b = walls.height[i], walls.width[i]
    solid = walls.solidity[i] >= 0.7
    share = np.where(solid, 1.0, walls.solidity[i])  # the area Cf applies to, per ft^2 of face
    s, b, solid, share, q, cf_a, opening, groups, base = (
        v[listed] for v in (s, b, solid, share, wind.q[i], wind.cf_case_a[i], wind.opening[i],
                            walls.groups[i], walls.base[i]))
    x = np.where(mask, positions, np.nan)
    by_position = np.argsort(x, axis=1)  # the empty slots (NaN) last
    order = np.take_along_axis(x, by_position, axis=1)
    mids = (order[:, 1:] + order[:, :-1]) / 2.0
    lo = np.concatenate([np.zeros((len(s), 1)), mids], axis=1)
    hi = np.concatenate([mids, np.full((len(s), 1), np.inf)], axis=1)
    hi = np.minimum(np.where(np.isnan(hi), b[:, None], hi), b[:, None])
    count = braces.slot_sum(mask, 0)
    last = np.arange(mask.shape[1])[None, :] == (count - 1)[:, None]
    hi = np.where(last, b[:, None], hi)
    lo, hi = np.where(np.isnan(lo), 0.0, lo), np.where(np.isnan(hi), 0.0, hi)
    area = s[:, None] * np.maximum(hi - lo, 0.0) * share[:, None]
    floor = (minimum_psf or 0.0) * area  # ASCE 7-16 §29.7 on As (design.md §3)
    g = asce7.GUST_FACTOR
    p_avg = np.maximum(q * g * cf_a, minimum_psf or 0.0)  # ASCE 7-16 Eq. 29.3-1 and §29.7
    # Case B as a linear pressure, from whichever end loads the strip more (method notes §2)
    strip = p_avg[:, None] * area * asce7.case_b_linear_factor((lo + hi) / (2.0 * b[:, None]))
    if solid.any():  # Case C (Figure 29.3-1), the largest coefficient over each strip
        cf_c = lines.strip_case_c(groups, b, s, base, lo, hi) * opening[:, None]
        strip = np.where(solid[:, None], np.maximum(strip, np.maximum(
            q[:, None] * g * cf_c * area, floor)), strip)
    # strips follow the sorted positions: put them back in each brace's own slot
    in_slots = np.empty_like(strip)
    np.put_along_axis(in_slots, by_position, strip, axis=1)
    return np.where(mask, in_slots, 0.0)


SERVICEABILITY = {"wall cracking"}  # shown and flagged, not counted in the status or the speeds
CHECKS = {
    # name: (unit, combination kind, source)
    "brace compression": ("lb", "adding", "maker's rated table / AISC 360-16 Ch. E and §H1.1 / "
                          "NDS 2018 §3.7.1"),
    "brace tension": ("lb", "adding", "maker's rating / AISC 360-16 §D2"),
    "brace end fittings": ("lb", "adding", "maker's rating"),
    "wall insert": ("lb", "adding", "maker's rating at the brace angle, T/Ta + V/Va <= 1 "
                    "(common practice)"),
    "foot anchor": ("lb", "wind", "ACI 318-19 §17.6-17.8 / ICC-ES AC358 / maker's rating"),
    "deadman uplift": ("lb", "resisting", "weight, ASCE 7-16 §2.4.1"),
    "deadman sliding": ("lb", "resisting", "friction, IBC Table 1806.2 / ACI 318-19 §22.9.4.2: "
                        "pull + mu x uplift against mu x factored weight"),
    "deadman overturning": ("lb·ft", "resisting", "statics about the block's toe, weight at "
                            "mid-length, ASCE 7-16 §2.4.1"),
    "deadman bearing": ("psf", "adding", "statics, linear pressure, against the "
                        "allowable bearing (IBC Table 1806.2)"),
    "base uplift": ("lb", "resisting", "statics: 0.6D - sum(P sin theta) >= 0"),
    "sill uplift": ("lb", "resisting", "statics: sum(P sin theta) against 0.6D plus the sill "
                    "fastening (method notes §4)"),
    "base kick-out": ("lb", "resisting", "friction, ACI 318-19 §22.9.4.2 (mu 0.6)"),
    "wall bending": ("lb·ft", "resisting", "TMS 402-16 §8.2 flexural tension, or weight above "
                     "(fresh mortar), per ft"),
    "wall cracking": ("lb·ft", "resisting", "ACI 318-19 Eq. 19.2.3.1 modulus of rupture, per ft "
                      "(serviceability: a crack, not a collapse)"),
}
# Checks whose capacity is a strength value or statics alone, whatever the hardware: they take
# the basis's own combinations (the others hold allowable capacities: method notes §1).
STRENGTH_CHECKS = {"base uplift", "base kick-out", "wall cracking"}


BRACE_SOURCE = {
    "rated": ("maker's rated table (allowable load by length)", "maker's tension rating"),
    "pipe": ("AISC 360-16 §E3, self-weight bending §H1.1 and Appendix 8",
             "AISC 360-16 §D2 (or the rating given)"),
    "lumber": ("NDS 2018 §3.7.1, C_D 1.6", "the rating given (end connection)"),
    "unrated": ("not rated", "the rating given"),
}


def sources(brace_kind: str, foot_kind: str | None) -> dict[str, str]:
    """The source of each braced check that depends on the brace and anchor used."""
    compression, tension = BRACE_SOURCE[brace_kind]
    out = {"brace compression": compression, "brace tension": tension}
    if foot_kind in ANCHOR_KINDS:
        out["foot anchor"] = ANCHOR_KINDS[foot_kind].source
    return out


def strength_checks(brace_type, foot_kind: str | None, sill_given: bool) -> set[str]:
    """The braced checks of a brace type, a foot anchor kind and a wall whose sill fastening is
    given or not, that take the LRFD combinations under LRFD (strength values: AISC 360-16
    phi Pn, ACI 318-19 phi Nn; statics): the others are allowable (method notes §1)."""
    out = set(STRENGTH_CHECKS)
    if brace_type.kind == "pipe":
        out.add("brace compression")
        if brace_type.tension_capacity is None:
            out.add("brace tension")
    if foot_kind in ANCHOR_KINDS and not ANCHOR_KINDS[foot_kind].allowable:
        out.add("foot anchor")
    if not sill_given:
        out.add("sill uplift")
    return out


def _strength_rows(bs: BraceSet) -> dict[str, np.ndarray]:
    """`strength_checks` row by row: True where the check takes the LRFD combinations."""
    foot_strength = np.isin(bs.foot_kind, [k for k, v in ANCHOR_KINDS.items()
                                           if not v.allowable])
    rows = {name: np.ones(len(bs.foot_kind), bool) for name in STRENGTH_CHECKS}
    rows.update({"brace compression": bs.brace_strength, "brace tension": bs.tension_strength,
                 "foot anchor": foot_strength, "sill uplift": np.isnan(bs.sill)})
    return rows


@dataclass(frozen=True)
class Standing:
    """What the braced walls' checks take from the walls and their braces whatever the wind,
    for one set of load factors (arrays over m walls): worked out once for a search."""

    cos: np.ndarray         # of each wall's brace angle
    sin: np.ndarray
    tan: np.ndarray
    held: np.ndarray        # the base is checked for uplift and kick-out (not framed walls)
    framed: np.ndarray      # framed walls: the sill uplift is checked instead
    weight: np.ndarray      # factored weight holding the base down, lb
    sill: np.ndarray        # the sill fastening's allowable uplift, lb (0: none given)
    base_mu: np.ndarray     # friction at the base
    area: np.ndarray        # the wall's face, ft^2
    height: np.ndarray      # the wall's, ft
    bending: np.ndarray     # masonry: moment capacity at the base joint, per ft (NaN: other)
    cracking: np.ndarray    # concrete: cracking moment, per ft (NaN: other)

    def take(self, rows) -> Standing:
        """The same of the walls `rows` only."""
        return Standing(*(rows_of(getattr(self, f.name), rows) for f in fields(self)))


def standing_of(walls, bs: BraceSet, f) -> Standing:
    """The wind-independent parts of the braced checks of `bs` with load factors `f`."""
    i = bs.index
    theta = np.radians(bs.angle)
    s, b = walls.height[i], walls.width[i]
    dead = walls.face_weight[i] * s * b * walls.solidity[i]
    masonry = walls.masonry[i]
    bending = (np.where(masonry, _masonry_bending(walls, bs, f, s), np.nan) if masonry.any()
               else np.full(len(i), np.nan))
    framed = walls.framed[i]
    return Standing(np.cos(theta), np.sin(theta), np.tan(theta),
                    # A framed wall's sill is fastened down: its uplift is checked against the
                    # weight and the sill fastening; its kick-out is the sill's (method notes §4).
                    ~framed, framed, f.dead_resists * dead, np.nan_to_num(bs.sill) * b,
                    walls.base_mu[i], b * s, s, bending,
                    braces.cracking_moment(bs.rupture, walls.thickness_ft[i] * 12.0))


def sill_uplift(lift, weight, count, width):
    """The uplift the sill fastening must hold, lb per brace and per ft of sill: the braces'
    vertical push sum(P sin theta) less the factored weight, none below zero (statics)."""
    net = np.maximum(np.asarray(lift, dtype=float) - weight, 0.0)
    return net / count, net / width


@np.errstate(divide="ignore", invalid="ignore", over="ignore")  # infinities and NaN mean 'fails'
def braced_checks(walls, wind, bs: BraceSet, f, minimum_psf, loads: BraceLoads | None = None,
                  standing: Standing | None = None):
    """Demand and capacity of every braced element, worst brace of each wall (arrays over m).

    `loads` (from `brace_loads`) may be given to skip working out the wind's load cases (the
    wind is then not read), `standing` (from `standing_of`) the parts that do not depend on the
    wind. A check that applies to none of the walls is NaN throughout. Where `f` has allowable
    factors of its own (LRFD), the checks of allowable capacities take those (method notes §1).
    """
    if loads is None:
        loads = brace_loads(walls, wind, bs, minimum_psf)
    checks, forces = _checks_at(walls, bs, f, loads, standing)
    if f.allowable is not None:
        allowable, _ = _checks_at(walls, bs, f.allowable, loads, None)
        strength = _strength_rows(bs)
        checks = {k: tuple(np.where(strength[k], v, a) for v, a in zip(checks[k], allowable[k]))
                  if k in strength else allowable[k] for k in checks}
    return checks, forces


def _checks_at(walls, bs: BraceSet, f, loads: BraceLoads, standing: Standing | None):
    """`braced_checks` with every check on the load factors `f`."""
    if standing is None:
        standing = standing_of(walls, bs, f)
    forces = brace_forces(loads, bs, f)
    p = braces.worst_brace(forces.axial)
    na = np.full(len(p), np.nan)
    comp_cap = bs.compression
    pipe = bs.self_weight_ratio > 0
    if pipe.any():
        # Self-weight bending (dead load adds) amplified by B1, AISC 360-16 Appendix 8 Eq. A-8-3.
        amplified = f.dead_adds * bs.self_weight_ratio * members.amplifier_of(p, bs.euler_load,
                                                                              bs.basis)
        with np.errstate(divide="ignore", invalid="ignore"):  # a zero rating fails below, visibly
            ratio = np.asarray(members.pipe_axial_bending_ratio(p, bs.compression, amplified,
                                                                1.0))
        comp_cap = np.where(pipe & (p > 0), p / np.maximum(ratio, 1e-12), bs.compression)
    checks = {
        "brace compression": (p, comp_cap),
        "brace tension": (p, bs.tension),
        "brace end fittings": (p, bs.connection),
    }
    pull, up = p * standing.cos, p * standing.sin  # as braces.components
    # the insert: the horizontal component pulls it out of the face, the vertical one shears it
    insert_ratio = pull / bs.insert_tension + up / bs.insert_shear
    checks["wall insert"] = (p, p / np.maximum(insert_ratio, 1e-12))
    # The foot anchor with the brace in tension (uplift P sin, pull P cos): each kind's own
    # ratio (anchor_kinds.KINDS); a kind with checks of its own (a deadman) has them instead.
    foot_ratio = np.full(len(p), np.nan)
    kinds = bs.foot_kind
    for name, kind in ANCHOR_KINDS.items():
        sel = kinds == name
        if kind.ratio is not None and sel.any():
            foot_ratio[sel] = kind.ratio(up[sel], pull[sel], p[sel], bs.foot_tension[sel],
                                         bs.foot_shear[sel])
    checks["foot anchor"] = (p, p / np.maximum(foot_ratio, 1e-12))
    deadman = kinds == "deadman"
    checks.update(_deadman_checks(bs, f, deadman, pull, up, na) if deadman.any()
                  else dict.fromkeys(DEADMAN_CHECKS, (na, na)))
    # The wall's base: lifted by the braces in compression, pushed out by the base shear.
    lift = forces.total * standing.tan
    held = standing.held
    checks["base uplift"] = (np.where(held, lift, na), standing.weight)
    # A framed wall's sill: the lift against its weight and the sill fastening (design.md §6).
    checks["sill uplift"] = (np.where(standing.framed, lift, na),
                             standing.weight + standing.sill)
    checks["base kick-out"] = (np.where(held, forces.base_shear, na), standing.base_mu * np.maximum(
        standing.weight - lift, 0.0))
    # The wall spanning from its base to the braces, per ft of width.
    pressure = f.wind * forces.wind_force / standing.area
    span, cantilever = braces.propped_wall_moments(pressure, standing.height, bs.insert)
    moment = np.maximum(span, cantilever)
    checks["wall bending"] = (moment, standing.bending)
    checks["wall cracking"] = (moment, standing.cracking)
    # A check whose capacity is not known is not made (its element is not counted).
    checks = {k: (np.where(np.isnan(c), np.nan, d), c) for k, (d, c) in checks.items()}
    return checks, forces


DEADMAN_CHECKS = ("deadman uplift", "deadman sliding", "deadman overturning", "deadman bearing")


def _deadman_checks(bs: BraceSet, f, deadman, pull, up, na) -> dict:
    """The deadman checks (demand, capacity) of the walls whose braces stand on deadmen."""
    weight = np.where(deadman, bs.foot_tension, np.nan)
    # Tipping about the block's toe: the pull at the pin's height and the uplift at its distance
    # from the toe against the factored weight at mid-length (statics, ASCE 7-16 §2.4.1).
    sized = deadman & ~np.isnan(bs.block_length)
    # The soil under the block's more loaded edge (the toe, unless the uplift sits far back):
    # its weight (dead load adds) less the uplift, with the moment about its middle of the pull
    # at the pin's height and of the uplift off the middle (statics; linear pressure, no
    # tension), against the allowable bearing. A block lifted off (no weight left) bears on
    # nothing: its uplift check fails and the bearing check is not made.
    # A block that tips over its toe (no pressure left under its heel) fails its overturning
    # check: its bearing is not checked either (it would be infinite).
    net = f.dead_adds * weight - up
    moment = pull * bs.pin_height + up * (bs.pin_from_toe - bs.block_length / 2.0)
    peak = stability.max_soil_pressure(net, np.abs(moment), bs.block_length, bs.block_width)
    bearing = deadman & ~np.isnan(bs.block_width) & (net > 0.0) & (np.isfinite(peak)
                                                                   | (moment < 0.0))
    # Sliding: pull <= mu (0.6W - uplift), written pull + mu uplift <= mu 0.6W so that a block
    # lifted off still has a finite utilization (foot_mu is already over its factor of safety).
    return dict(zip(DEADMAN_CHECKS, (
        (np.where(deadman, up, na), anchors.deadman_uplift(weight, f.dead_resists)),
        (np.where(deadman, pull + bs.foot_mu * up, na),
         anchors.deadman_sliding(weight, 0.0, bs.foot_mu, basis=f.dead_resists)),
        (np.where(sized, anchors.deadman_overturning_moment(pull, up, bs.pin_height,
                                                            bs.pin_from_toe), na),
         np.where(sized, anchors.deadman_resisting_moment(weight, bs.block_length / 2.0,
                                                          f.dead_resists), na)),
        (np.where(bearing, peak, na), np.where(bearing, bs.block_bearing, na)))))


def _masonry_bending(walls, bs: BraceSet, f, s):
    """Moment capacity of the masonry walls at their base joint, per ft: rocking on the weight
    above, or the mortar's flexural tension (TMS 402-16 §8.2)."""
    i = bs.index
    above = f.dead_resists * walls.face_weight[i] * (s - bs.insert)
    return np.maximum(
        stability.rocking_resistance(above, walls.thickness_ft[i]),
        stability.masonry_flexural_capacity(walls.flex_tension[i], walls.section[i],
                                            walls.section_area[i], above))


def braced_records(bs: BraceSet, forces: BraceForces, brace_type: list[str],
                   wall_anchor: list[str | None], foot_anchor: list[str | None],
                   utilization: list[float | None], one_missing: list[float | None],
                   sill: tuple[np.ndarray, np.ndarray]) -> list[dict]:
    """The §8 `braces` record of every braced wall (design wind, governing brace), in row order,
    with its brace and anchor types, the largest utilization of its brace's own checks, its
    working limit with one brace missing (None: not known) and, for a framed wall, the sill
    uplift (`sill`: lb per brace and per ft, NaN for other walls; `sill_uplift`)."""
    count = bs.mask.sum(axis=1)
    p = braces.worst_brace(forces.axial)
    pull, up = braces.components(p, bs.angle)
    uplift = forces.total * np.tan(np.radians(bs.angle))
    helical = bs.foot_kind == "helical"
    # ICC-ES AC358: T = FS P / Kt, the torque the crew reaches
    torque = np.where(helical, anchors.required_torque(p, bs.torque_factor, bs.torque_safety),
                      np.nan)
    out = []
    for k, angle, insert, distance, length, axial, lift, shear, at, each, base, uplift_lb, \
            helix, torque_ftlb, brace, wall, foot, most, missing, sill_lb, sill_plf in zip(
                count.tolist(), bs.angle.tolist(), bs.insert.tolist(),
                bs.anchor_distance.tolist(), bs.length.tolist(), p.tolist(), up.tolist(),
                pull.tolist(), _of_braces(bs.positions, count), _of_braces(forces.axial, count),
                forces.base_shear.tolist(), uplift.tolist(), helical.tolist(), torque.tolist(),
                brace_type, wall_anchor, foot_anchor, utilization, one_missing,
                sill[0].tolist(), sill[1].tolist()):
        record = {
            "count": k, "angle_deg": angle, "insert_height_ft": insert,
            "anchor_distance_ft": distance, "length_ft": length, "axial_force_lb": axial,
            "anchor_uplift_lb": lift, "anchor_shear_lb": shear, "positions_ft": at,
            "brace_forces_lb": each, "base_shear_lb": base, "base_uplift_lb": uplift_lb,
        }
        if helix:
            record["installation_torque_ftlb"] = torque_ftlb
        if not math.isnan(sill_lb):
            record["sill_uplift_lb"], record["sill_uplift_plf"] = sill_lb, sill_plf
        record["brace_type"], record["wall_anchor"], record["foot_anchor"] = brace, wall, foot
        record["utilization"], record["working_limit_one_missing_mph"] = most, missing
        out.append(record)
    return out


def _of_braces(per_slot: np.ndarray, count: np.ndarray) -> list[list]:
    """Each wall's values of its braces (the first `count` of its slots), a list per wall: the
    walls of each count read out together."""
    out = [None] * len(count)
    for k in np.unique(count).tolist():
        rows = np.flatnonzero(count == k)
        for r, of_wall in zip(rows.tolist(), per_slot[rows, :k].tolist()):
            out[r] = of_wall
    return out
