"""Reading the walls into arrays: one entry per wall, every formula runs over them (design.md
§2, §9)."""

from __future__ import annotations

from dataclasses import dataclass, fields, replace

import numpy as np

from bracing import lines, stability
from bracing.model import Site, read_panels
from bracing.wind import asce7, asce37

STUD_SOLIDITY = 1.5 / 16.0  # open framing: 1.5 in studs at 16 in on centre (common practice)


@dataclass(frozen=True)
class Walls:
    """Every wall of a site as arrays (one entry per panel)."""

    panel: np.ndarray           # each wall's panel (its index in the site's panels)
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
    mat_face, mat_unit = (
        np.array([getattr(m, name) for m in site.materials.values()], dtype=float)[material]
        for name in ("face_weight", "unit_weight"))
    t_ft = thickness / 12.0
    # the panel's face weight, or its unit weight, or its material's face or unit weight
    face = np.where(~np.isnan(face_weight), face_weight, np.where(
        ~np.isnan(unit_weight), unit_weight * t_ft,
        np.where(~np.isnan(mat_face), mat_face, mat_unit * t_ft)))
    solid, centroid, centroid_x = _solid_part(width, height, openings)
    solid -= np.nan_to_num(opening_area)
    solidity = np.where(open_framing, STUD_SOLIDITY, solid / (width * height))
    cured = masonry & (mortar_age >= (site.rule_value("masonry_cure_days") or 0.0))
    returns = np.zeros((2, n))  # Lr (ft) at the left and right ends
    for k in [k for k, r in enumerate(return_walls) if r]:
        for r in return_walls[k]:
            returns[int(r.end == "right"), k] = r.length
    base = _footings(footing)
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
        panel=np.arange(n), height=height, width=width, thickness_ft=t_ft, base=base_elevation,
        face_weight=face, solidity=solidity, centroid_ratio=centroid / height,
        centroid_x_ratio=centroid_x / width, rigid=concrete, fresh=masonry & ~cured,
        masonry=masonry, framed=framed, flex_tension=np.where(cured, tension, 0.0),
        section=section, section_area=section_area, footing_width=base[0],
        footing_thickness=base[1], footing_psf=base[2], bearing=base[3], footing_mu=base[4],
        base_mu=np.full(n, site.site.friction_coefficient), period_factor=period_factor,
        groups=groups, exposure=site.site.exposure, kzt=site.site.topographic_factor,
        ke=float(asce7.ke(site.site.ground_elevation)))


def _solid_part(width, height, openings):
    """Each wall's solid area (ft^2) and its centroid's height and distance from the first edge
    (ft): the whole face, less its openings where they are placed (statics)."""
    solid, centroid, centroid_x = width * height, height / 2.0, width / 2.0
    for k in [k for k, o in enumerate(openings) if o]:
        opens = [(o.x, o.y, o.width, o.height) for o in openings[k]]
        solid[k], centroid[k] = stability.rectangle_centroid(width[k], height[k], opens)
        _, centroid_x[k] = stability.rectangle_centroid(
            height[k], width[k], [(y, x, h, w) for x, y, w, h in opens])
    return solid, centroid, centroid_x


def _footings(footing: list) -> np.ndarray:
    """Each wall's footing as rows: width, thickness, weight per ft^2 of plan (the footing and
    the soil over it), allowable bearing, friction; NaN where it has none."""
    base = np.full((5, len(footing)), np.nan)
    for k in [k for k, given in enumerate(footing) if given is not None]:
        ftg = footing[k]
        base[:, k] = (ftg.width, ftg.thickness,
                      ftg.unit_weight * ftg.thickness + ftg.soil_unit_weight * ftg.soil_depth,
                      ftg.allowable_bearing, ftg.friction_coefficient)
    return base


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


def take(obj, rows):
    """The same arrays restricted (or repeated) to `rows` along their first axis; the object
    itself when `rows` is every row in order (its arrays are never changed in place)."""
    arrays = {f.name: v for f in fields(obj)
              if isinstance(v := getattr(obj, f.name), np.ndarray) and v.ndim >= 1}
    size = len(next(iter(arrays.values())))
    if len(rows) == size and np.array_equal(rows, np.arange(size)):
        return obj
    return replace(obj, **{name: rows_of(v, rows) for name, v in arrays.items()})


def take_each(objects: tuple, rows) -> tuple:
    """`take` of each of `objects`."""
    return tuple(take(obj, rows) for obj in objects)


def rows_of(array, rows):
    """`array[rows]` along the first axis (np.take copies the rows of a 2-D array many times
    faster than indexing does)."""
    return np.take(array, rows, axis=0)
