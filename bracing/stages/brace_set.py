"""The braced walls' layouts and their brace and anchor capacities as arrays (method notes §4)."""

from __future__ import annotations

from dataclasses import dataclass, fields

import numpy as np

from bracing import braces, members
from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.data_members import DRESSED_SIZES_IN, LUMBER_GRADES, PIPES
from bracing.model import BRACING_FIELDS, read_panels
from bracing.stages.arrays import rows_of

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


@dataclass(frozen=True)
class BraceLayout:
    """What `brace_loads` reads of braced walls: their layouts alone (arrays over m walls; a
    wall may be listed once for each variant of its layout, a brace struck say)."""

    index: np.ndarray           # panel index of each wall
    positions: np.ndarray       # (m, k) ft from the wall's left edge
    mask: np.ndarray            # (m, k) the braces there are
    insert: np.ndarray          # insert height above the wall's base, ft
    lean: np.ndarray            # ft at the top
    slop: np.ndarray            # ft at the insert
    stiff: np.ndarray           # a continuous stiff member ties the braces


def layout_of(bs: BraceSet, rows, mask) -> BraceLayout:
    """The layouts of the walls `rows` of `bs` with the braces `mask` marks."""
    return BraceLayout(index=bs.index[rows], positions=rows_of(bs.positions, rows), mask=mask,
                       insert=bs.insert[rows], lean=bs.lean[rows], slop=bs.slop[rows],
                       stiff=bs.stiff[rows])


@dataclass(frozen=True)
class BraceCapacities:
    """What `braced_checks` reads of braced walls once their loads and the parts that do not
    depend on the wind are worked out (`braced.Standing`), under one set of factors without
    allowable ones of their own (a search's): the braces' angle, mask and insert and the
    capacities (fields as in BraceSet)."""

    mask: np.ndarray
    angle: np.ndarray
    insert: np.ndarray
    compression: np.ndarray
    tension: np.ndarray
    connection: np.ndarray
    self_weight_ratio: np.ndarray
    euler_load: np.ndarray
    insert_tension: np.ndarray
    insert_shear: np.ndarray
    foot_kind: np.ndarray
    foot_tension: np.ndarray
    foot_shear: np.ndarray
    foot_mu: np.ndarray
    block_length: np.ndarray
    pin_height: np.ndarray
    pin_from_toe: np.ndarray
    block_width: np.ndarray
    block_bearing: np.ndarray
    basis: str


def capacities_of(bs: BraceSet) -> BraceCapacities:
    """The fields of `bs` a search's checks read (the arrays are shared, not copied)."""
    return BraceCapacities(**{f.name: getattr(bs, f.name) for f in fields(BraceCapacities)})


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
                           "slenderness", "slenderness_limit"), values, strict=True):
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
