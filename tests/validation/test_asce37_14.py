"""ASCE 37-14 Table 6.2-1: factor on the basic wind speed by construction period.

Marks from references.md: less than 6 weeks 0.75 (from memory); 6 weeks to 1 year 0.8
(secondary); 1 to 2 years 0.85 and 2 to 5 years 0.9 (from memory).
"""

import numpy as np
import pytest

from bracing.verification import PERIOD_FACTORS_6_2_1
from bracing.wind import PERIOD_BANDS, period_band_limit_weeks, period_factor
from bracing.wind.asce37 import WEEKS_PER_YEAR

YEAR = WEEKS_PER_YEAR
# Table 6.2-1 by band, held in bracing/verification.py (marks as above)
LESS_THAN_6_WEEKS, TO_1_YEAR, TO_2_YEARS, TO_5_YEARS = PERIOD_FACTORS_6_2_1.values()


@pytest.mark.parametrize(
    ("weeks", "factor"),
    [
        (0.0, LESS_THAN_6_WEEKS),  # 0.75, from memory
        (5.99, LESS_THAN_6_WEEKS),  # from memory
        (6.0, TO_1_YEAR),  # 0.8: "6 weeks to 1 year" includes 6 weeks, secondary
        (26.0, TO_1_YEAR),  # secondary
        (365.0 / 7.0, TO_1_YEAR),  # 365 days, still within the first year, secondary
        (1.5 * YEAR, TO_2_YEARS),  # 0.85, 1 to 2 years, from memory
        (3.0 * YEAR, TO_5_YEARS),  # 0.9, 2 to 5 years, from memory
        (5.0 * YEAR, TO_5_YEARS),  # 5 years is the top of "2 to 5 years", from memory
        (6.0 * YEAR, 1.0),  # beyond the table: the permanent structure's wind (design.md §4)
    ],
)
def test_period_factor_table_6_2_1(weeks, factor):
    assert period_factor(weeks) == factor


def test_shared_boundary_takes_the_higher_factor():
    # "6 weeks to 1 year" and "1 to 2 years" both name 1 year: team's reading, the higher factor.
    assert period_factor(YEAR) == 0.85
    assert period_factor(2.0 * YEAR) == 0.9


def test_period_factor_vectorised():
    weeks = np.array([[2.0, 8.0], [80.0, 150.0]])
    np.testing.assert_array_equal(period_factor(weeks), [[0.75, 0.8], [0.85, 0.9]])


def test_band_limit_flags_a_slip():
    # A wall planned for 5 weeks stands in the "< 6 weeks" band; a slip to 7 weeks crosses it.
    assert period_band_limit_weeks(5.0) == 6.0
    assert period_factor(7.0) > period_factor(5.0)
    np.testing.assert_array_equal(period_band_limit_weeks(np.array([10.0, 60.0, 120.0, 300.0])),
                                  [YEAR, 2 * YEAR, 5 * YEAR, np.inf])


def test_bands_data():
    assert [factor for _, factor in PERIOD_BANDS] == [0.75, 0.8, 0.85, 0.9, 1.0]
    assert [upper for upper, _ in PERIOD_BANDS][:1] == [6.0]


@pytest.mark.parametrize("weeks", [-1.0, np.nan])
def test_invalid_period_rejected(weeks):
    with pytest.raises(ValueError):
        period_factor(weeks)
