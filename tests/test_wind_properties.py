"""Physical properties of the wind functions (hypothesis)."""

import numpy as np
from hypothesis import given
from hypothesis import strategies as st

from bracing.wind import (
    anemometer_factor,
    case_c_cf,
    case_c_mean,
    cf_cases_ab,
    kz,
    opening_factor,
    period_factor,
    reference_gust_from_reading,
    sustained_equivalents,
    velocity_pressure,
)

speeds = st.floats(1.0, 250.0)
heights = st.floats(0.0, 600.0)  # well below every gradient height zg
b_over_s = st.floats(0.01, 100.0)
s_over_h = st.floats(0.05, 1.0)
returns = st.floats(0.0, 5.0)


@given(speeds, st.floats(0.1, 10.0), st.floats(0.5, 2.2))
def test_pressure_grows_with_v_squared(v, k, kz_value):
    ratio = velocity_pressure(k * v, kz_value) / velocity_pressure(v, kz_value)
    assert np.isclose(ratio, k**2, rtol=1e-12)


@given(heights, st.floats(0.0, 100.0))
def test_kz_grows_with_height_and_from_b_to_c_to_d(z, dz):
    for exposure in "BCD":
        assert kz(z + dz, exposure) >= kz(z, exposure)
    b, c, d = kz(z, ["B", "C", "D"])
    assert b < c < d


@given(b_over_s, s_over_h, st.floats(0.0, 1.0), returns)
def test_force_coefficients_never_negative(b, r, fraction, lr):
    x = fraction * b
    assert cf_cases_ab(b, r) > 0.0
    assert case_c_cf(x, b, r, lr) > 0.0
    mean, _ = case_c_mean(0.0, x, b, r, lr)
    assert mean > 0.0


@given(st.floats(2.0, 60.0), s_over_h, returns)
def test_case_c_mean_of_whole_wall_equals_the_integral(b, r, lr):
    mean, centroid = case_c_mean(0.0, b, b, r, lr)
    n = 40_000  # midpoint rule over the piecewise-constant regional coefficients
    x = (np.arange(n) + 0.5) * b / n
    cf = case_c_cf(x, b, r, lr)
    assert np.isclose(mean * b, cf.sum() * b / n, rtol=1e-3)
    assert np.isclose(centroid, (cf * x).sum() / cf.sum(), rtol=1e-3)


@given(st.floats(0.0, 60.0), st.floats(0.0, 30.0), st.floats(0.0, 30.0), st.floats(2.0, 60.0),
       s_over_h, returns)
def test_case_c_mean_splits_consistently(a, ab, bc, b, r, lr):
    mid, end = a + ab, a + ab + bc
    whole, x_whole = case_c_mean(a, end, b, r, lr)
    left, x_left = case_c_mean(a, mid, b, r, lr)
    right, x_right = case_c_mean(mid, end, b, r, lr)
    assert np.isclose(whole * (ab + bc), left * ab + right * bc, rtol=1e-9, atol=1e-9)
    if ab > 0.0 and bc > 0.0:
        moment = left * ab * x_left + right * bc * x_right
        assert np.isclose(x_whole * whole * (ab + bc), moment, rtol=1e-9, atol=1e-9)


@given(st.floats(0.0, 60.0), st.floats(0.0, 30.0), st.floats(2.0, 60.0), s_over_h, returns)
def test_case_c_mean_lies_within_its_interval(a, width, b, r, lr):
    _, centroid = case_c_mean(a, a + width, b, r, lr)
    assert a - 1e-9 <= centroid <= a + width + 1e-9


def test_case_c_vectorised_matches_scalar():
    rng = np.random.default_rng(1)
    x, b, r, lr = rng.uniform(0, 20, 50), rng.uniform(0.5, 50, 50), rng.uniform(0.1, 1, 50), \
        rng.uniform(0, 3, 50)
    got = case_c_cf(x, b, r, lr)
    assert np.array_equal(got, [case_c_cf(*args) for args in zip(x, b, r, lr, strict=True)])
    mean, centroid = case_c_mean(0.0, x, b, r, lr)
    scalar = [case_c_mean(0.0, *args) for args in zip(x, b, r, lr, strict=True)]
    assert np.allclose(mean, [m for m, _ in scalar])
    assert np.allclose(centroid, [c for _, c in scalar])


@given(st.floats(0.0, 1.0), st.floats(0.0, 1.0))
def test_opening_factor_between_0_and_1_and_grows_with_solidity(e1, e2):
    lo, hi = sorted((e1, e2))
    assert 0.0 <= opening_factor(lo) <= opening_factor(hi) <= 1.0


@given(st.floats(0.0, 400.0), st.floats(0.0, 400.0))
def test_period_factor_never_falls_as_the_wall_stands_longer(w1, w2):
    lo, hi = sorted((w1, w2))
    assert period_factor(lo) <= period_factor(hi)


@given(speeds)
def test_sustained_means_below_the_gust_and_ordered(gust):
    means = sustained_equivalents(gust)
    assert gust > means["1-min"] > means["2-min"] > means["10-min"] > means["1-hour"] > 0.0


@given(st.floats(1.0, 300.0), st.floats(1.0, 300.0), st.sampled_from("BCD"), speeds)
def test_anemometer_reads_more_higher_up_and_converts_back(z1, z2, exposure, reading):
    lo, hi = sorted((z1, z2))
    assert anemometer_factor(lo, exposure) <= anemometer_factor(hi, exposure)
    reference = reference_gust_from_reading(reading, lo, exposure)
    assert np.isclose(reference * anemometer_factor(lo, exposure), reading, rtol=1e-12)
