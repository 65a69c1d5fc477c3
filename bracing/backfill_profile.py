"""What the section sketch of a foundation wall draws (method notes §12), as plain numbers
(`BackfillSketch`), and the small pure formulas it needs beside `bracing.backfill`: the
earth-pressure profile in its three parts at chosen levels, and the height of their resultant
(the shear and moment they integrate to are `bracing.backfill.resultants`). The builders read
the quick check's record or a foundation wall's result and call the formulas; the drawing
(bracing.report.svg.backfill) computes nothing.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from bracing import backfill
from bracing.earth_pressure import pressure_parts


@dataclass(frozen=True)
class InsideBraceSketch:
    """Inside braces or shores as drawn: height on the wall (ft), angle from horizontal (deg),
    the force in each (lb, on the basis checked), their spacing (ft), and the highest backfill
    the braced wall takes (ft)."""

    height_ft: float
    angle_deg: float
    force_lb: float
    spacing_ft: float
    allowed_ft: float


@dataclass(frozen=True)
class BackfillSketch:
    """What the section sketch of one foundation wall draws, in engine units (ft, in, psf,
    pcf, plf, lb). `profile`: the unfactored pressure in its parts, (level above the base in
    ft, surcharge psf, soil psf, water psf), from the backfill's top down to the base, with a
    row at the water level where there is one. `danger`: the backfill drawn is above what the
    wall (with its inside braces, if any) may take before the floor."""

    mark: str
    wall_height_ft: float
    thickness_in: float
    backfill_ft: float
    allowed_ft: float
    profile: tuple[tuple[float, float, float, float], ...]
    resultant_plf: float
    resultant_height_ft: float
    efp_pcf: float
    surcharge_psf: float = 0.0
    water_level_ft: float | None = None
    footing_width_ft: float | None = None
    footing_thickness_ft: float = 1.0
    toe_ft: float | None = None         # the footing's inside projection; None: wall centred
    brace: InsideBraceSketch | None = None
    danger: bool = False
    caption: str = ""                   # e.g. "day 3, planned"


def resultant_height(shear, moment):
    """Height of the resultant above the base, M / V (statics); 0 without a load."""
    v = np.asarray(shear, dtype=float)
    return np.where(v > 0, np.asarray(moment, dtype=float) / np.where(v > 0, v, 1.0), 0.0)[()]


def sketch(*, mark: str, wall_height: float, thickness: float, backfill_height: float,
           allowed: float, efp: float, unit_weight: float, surcharge: float = 0.0,
           water: float = 0.0, footing_width: float | None = None,
           footing_thickness: float = 1.0, toe: float | None = None,
           brace: InsideBraceSketch | None = None, danger: bool = False,
           caption: str = "") -> BackfillSketch:
    """The sketch of a wall (ft, in) under `backfill_height` ft of fill: the pressure's parts at
    the fill's top, the water level and the base, and the resultant `V` (bracing.backfill
    .resultants) at its height `M / V`."""
    h = backfill_height
    levels = [h] + ([water] if 0.0 < water < h else []) + [0.0]
    parts = pressure_parts(levels, h, efp, unit_weight, surcharge, water)
    shear, moment = backfill.resultants(h, efp, unit_weight, surcharge, water)
    return BackfillSketch(
        mark=mark, wall_height_ft=wall_height, thickness_in=thickness, backfill_ft=h,
        allowed_ft=allowed,
        profile=tuple((z, float(a), float(b), float(c))
                      for z, a, b, c in zip(levels, *parts, strict=True)),
        resultant_plf=float(shear), resultant_height_ft=float(resultant_height(shear, moment)),
        efp_pcf=efp, surcharge_psf=surcharge, water_level_ft=water if water > 0.0 else None,
        footing_width_ft=footing_width, footing_thickness_ft=footing_thickness, toe_ft=toe,
        brace=brace, danger=danger, caption=caption)


def day_sketches(w, footing) -> dict:
    """Each day's sketch of a foundation wall (`w`, its FoundationWallResult with its days;
    `footing`, the site file's WallFooting or None), for the days it holds backfill: the day's
    height, surcharge and support (the inside braces where they hold it), the allowed height,
    and danger where the day's fill is over it. Made with the result, so that the sheets only
    draw them."""
    out = {}
    for d in w.days:
        if d.planned_height_ft <= 0.0:
            continue
        b = w.inside_brace if d.support == "inside braces" else None
        out[d.day] = sketch(
            mark=w.mark, wall_height=w.height_ft, thickness=w.thickness_in,
            backfill_height=d.planned_height_ft,
            allowed=w.max_height_ft if b is not None else d.allowed_height_ft,
            efp=w.soil.equivalent_fluid_pressure_psf_per_ft, unit_weight=w.soil.unit_weight_pcf,
            surcharge=d.surcharge_psf, water=w.soil.water_level_ft,
            footing_width=footing.width if footing else None,
            footing_thickness=footing.thickness if footing else 1.0,
            toe=footing.toe if footing else None,
            brace=None if b is None else InsideBraceSketch(
                height_ft=b.height_ft, angle_deg=b.angle_deg, force_lb=b.force_lb,
                spacing_ft=b.spacing_ft, allowed_ft=d.allowed_height_ft),
            danger=d.over, caption=f"day {d.day}")
    return out
