"""Converting wind speeds: gust to sustained averages, anemometer readings to the reference gust.

The reference gust is the ASCE 7 basis: a peak 3-second gust at 33 ft in exposure C (open terrain).
"""

import numpy as np

from bracing.wind.asce7 import terrain_constants

KNOT_MPH = 1.151  # 1 knot in mph (secondary)

# ASCE 7-16 commentary gust-factor curve, open terrain (from memory): 3-s gust / mean over ...
SUSTAINED_RATIOS = {"1-min": 1.22, "2-min": 1.30, "10-min": 1.43, "1-hour": 1.52}


def sustained_equivalents(gust_mph):
    """Mean speeds (mph) over 1 min, 2 min, 10 min and 1 hour matching a 3-s gust, open terrain."""
    gust = np.asarray(gust_mph, dtype=float)
    return {name: (gust / ratio)[()] for name, ratio in SUSTAINED_RATIOS.items()}


def sustained_equivalents_of_each(gust_mph) -> list[dict[str, float]]:
    """`sustained_equivalents` of each gust of an array: one dict of plain floats per gust."""
    gust = np.asarray(gust_mph, dtype=float)
    one_min, two_min, ten_min, one_hour = ((gust / ratio).tolist()
                                           for ratio in SUSTAINED_RATIOS.values())
    # the names of SUSTAINED_RATIOS in its order, written out: such a dict is made at once
    return [{"1-min": a, "2-min": b, "10-min": c, "1-hour": d}
            for a, b, c, d in zip(one_min, two_min, ten_min, one_hour, strict=True)]


def _kz_power_law(z_ft, exposure):
    """Kz by the power law WITHOUT the 15 ft floor (for speeds at a measuring height)."""
    alpha, zg = terrain_constants(exposure)
    return 2.01 * (np.asarray(z_ft, dtype=float) / zg) ** (2.0 / alpha)  # Table 26.10-1 note 1


def anemometer_factor(z_ft, exposure):
    """Gust at height z_ft in the given exposure divided by the reference gust (33 ft, C).

    sqrt(Kz_site(z) / Kz_C(33 ft)), unfloored power law (design.md §3): an anemometer there
    reads the reference gust times this factor.
    """
    z = np.asarray(z_ft, dtype=float)
    if not np.all(z > 0.0):
        raise ValueError("anemometer height must be above grade (z_ft > 0)")
    reference = _kz_power_law(33.0, "C")
    return np.sqrt(_kz_power_law(z, exposure) / reference)[()]  # q ~ Kz V^2, Eq. 26.10-1


def reference_gust_from_reading(reading_mph, z_ft, exposure):
    """Reference gust (3-s, 33 ft, exposure C) from a gust read at height z_ft in that exposure."""
    return (np.asarray(reading_mph, dtype=float) / anemometer_factor(z_ft, exposure))[()]

