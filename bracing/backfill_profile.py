"""The earth-pressure profile of a backfill as the section sketch draws it (method notes §12):
its three parts at chosen levels, and the height of their resultant. Small pure formulas; the
shear and moment they integrate to are `bracing.backfill.resultants`.
"""

from __future__ import annotations

import numpy as np

from bracing.backfill import WATER_PCF, pressure_coefficient


def pressure_parts(level, height, efp, unit_weight, surcharge=0.0, water=0.0):
    """The unfactored lateral pressure (psf) at `level` ft above the base under a backfill of
    `height` ft, in its three parts (method notes §12, `p = K q_s + EFP z + 62.4 (1 - K) s`):
    the surcharge's `K q_s` (over the full height), the soil's `EFP z` (z the depth below the
    backfill's top) and the water's `62.4 (1 - K) s` (s the depth below the water level at
    `water` ft above the base; K above 1 taken as 1). Zero above the backfill."""
    y = np.asarray(level, dtype=float)
    k = pressure_coefficient(efp, unit_weight)
    below = y <= height
    depth = np.clip(height - y, 0.0, None)
    submerged = np.clip(np.minimum(water, height) - y, 0.0, None)
    return (np.where(below, k * surcharge, 0.0),
            efp * depth,
            WATER_PCF * np.maximum(1.0 - k, 0.0) * submerged)


def resultant_height(shear, moment):
    """Height of the resultant above the base, M / V (statics); 0 without a load."""
    v = np.asarray(shear, dtype=float)
    return np.where(v > 0, np.asarray(moment, dtype=float) / np.where(v > 0, v, 1.0), 0.0)[()]
