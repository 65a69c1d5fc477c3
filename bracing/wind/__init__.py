"""Wind standards: ASCE 7-16 (Ch. 26, §29.3), ASCE 37-14 construction periods, gust conversions."""

from bracing.wind.asce7 import (
    GUST_FACTOR,
    KD_WALLS,
    MIN_PRESSURE_PSF,
    TERRAIN,
    case_c_cf,
    case_c_mean,
    cf_cases_ab,
    cf_open,
    ke,
    kz,
    opening_factor,
    resultant_height_ratio,
    terrain_constants,
    velocity_pressure,
)
from bracing.wind.asce37 import PERIOD_BANDS, period_band_limit_weeks, period_factor
from bracing.wind.gusts import (
    KNOT_MPH,
    SUSTAINED_RATIOS,
    anemometer_factor,
    reference_gust_from_reading,
    sustained_equivalents,
)

__all__ = [
    "GUST_FACTOR",
    "KD_WALLS",
    "KNOT_MPH",
    "MIN_PRESSURE_PSF",
    "PERIOD_BANDS",
    "SUSTAINED_RATIOS",
    "TERRAIN",
    "anemometer_factor",
    "case_c_cf",
    "case_c_mean",
    "cf_cases_ab",
    "cf_open",
    "ke",
    "kz",
    "opening_factor",
    "period_band_limit_weeks",
    "period_factor",
    "reference_gust_from_reading",
    "resultant_height_ratio",
    "sustained_equivalents",
    "terrain_constants",
    "velocity_pressure",
]
