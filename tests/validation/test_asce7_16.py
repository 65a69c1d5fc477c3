"""ASCE 7-16 wind (Ch. 26, §29.3 Figure 29.3-1) and its commentary's gust factors.

Every check value names its source and the certainty mark of references.md:
text / secondary / from memory, or common practice / team's reading (design.md).
"""

import numpy as np
import pytest

from bracing.verification import CF_ROW_S_OVER_H_1, KE_TABLE_26_9_1, KZ_TABLE_26_10_1, published
from bracing.wind import (
    GUST_FACTOR,
    KD_WALLS,
    KNOT_MPH,
    MIN_PRESSURE_PSF,
    SUSTAINED_RATIOS,
    anemometer_factor,
    case_c_cf,
    case_c_mean,
    cf_cases_ab,
    cf_open,
    ke,
    kz,
    opening_factor,
    reference_gust_from_reading,
    resultant_height_ratio,
    sustained_equivalents,
    terrain_constants,
    velocity_pressure,
)

# --- Table 26.11-1 and Table 26.10-1 -------------------------------------------------------------


@pytest.mark.parametrize(
    ("exposure", "alpha", "zg_ft"),
    [("B", 7.0, 1200.0), ("C", 9.5, 900.0), ("D", 11.5, 700.0)],  # Table 26.11-1, text
)
def test_terrain_constants_table_26_11_1(exposure, alpha, zg_ft):
    assert terrain_constants(exposure) == (alpha, zg_ft)


def test_terrain_constants_vectorised_and_unknown_exposure_named():
    alpha, zg = terrain_constants(["B", "C", "D", "c"])
    np.testing.assert_array_equal(alpha, [7.0, 9.5, 11.5, 9.5])
    np.testing.assert_array_equal(zg, [1200.0, 900.0, 700.0, 900.0])
    with pytest.raises(ValueError, match="'E'"):
        terrain_constants(["C", "E"])


# Table 26.10-1 Kz (text as ASCE 7-05 Table 6-3 case 2; secondary for 7-16), held in
# bracing/verification.py. The formula is compared with the printed 2-decimal table within 0.01
# (C at 60 ft: formula 1.137, table 1.13).


@pytest.mark.parametrize("z_ft", sorted(KZ_TABLE_26_10_1))
@pytest.mark.parametrize(("column", "exposure"), [(0, "B"), (1, "C"), (2, "D")])
def test_kz_table_26_10_1(z_ft, column, exposure):
    assert kz(z_ft, exposure) == pytest.approx(KZ_TABLE_26_10_1[z_ft][column], abs=0.01)


def test_kz_vectorised_over_walls():
    z = np.array(sorted(KZ_TABLE_26_10_1), dtype=float)
    expected = np.array([KZ_TABLE_26_10_1[h][1] for h in sorted(KZ_TABLE_26_10_1)])
    np.testing.assert_allclose(kz(z, np.full(z.shape, "C")), expected, atol=0.01)  # secondary


# --- Table 26.9-1, Eq. 26.10-1, Table 26.6-1, §26.11.1, §29.7 ------------------------------------


@pytest.mark.parametrize(
    ("elevation_ft", "ke_table"), sorted(KE_TABLE_26_9_1.items()),  # Table 26.9-1, secondary
)
def test_ke_table_26_9_1(elevation_ft, ke_table):
    assert ke(elevation_ft) == pytest.approx(ke_table, abs=0.005)  # Table 26.9-1, secondary


def test_ke_table_26_9_1_at_4000_ft_rounding():
    # Table 26.9-1 prints 0.86 at 4000 ft (secondary); its own note's formula gives 0.8652, which
    # rounds to 0.87 (the table rounds 0.8971 up to 0.90 at 3000 ft): agree within 0.006.
    assert ke(4000) == pytest.approx(0.86, abs=0.006)


def test_velocity_pressure_eq_26_10_1_115_mph_30_ft_exposure_c():
    # Eq. 26.10-1 (secondary) with Kz 0.98 (Table 26.10-1, C at 30 ft, secondary) and Kd 0.85:
    # 0.00256 x 0.98 x 0.85 x 115^2 = 28.2 psf.
    q = published("asce7-q-115-30-C")  # 28.2 psf, secondary
    assert velocity_pressure(115.0, 0.98, kd=0.85) == pytest.approx(q, abs=0.005)
    assert velocity_pressure(115.0, kz(30.0, "C")) == pytest.approx(q, rel=0.01)


def test_design_constants():
    assert GUST_FACTOR == published("asce7-gust-factor")  # §26.11.1 rigid, 0.85, secondary
    assert KD_WALLS == published("asce7-kd-walls")  # Table 26.6-1 walls and signs, 0.85, secondary
    assert MIN_PRESSURE_PSF == 16.0  # §29.7 minimum design wind load, from memory


# --- Figure 29.3-1, Cases A and B ----------------------------------------------------------------

AB_B_OVER_S = [0.05, 0.1, 0.2, 0.5, 1, 2, 4, 5, 10, 20, 30, 45]
# Figure 29.3-1 Cases A and B (text via a code copying ASCE 7-05; three cells confirmed for 7-16,
# secondary), rows by s/h.
AB_ROWS = {
    1.0: list(CF_ROW_S_OVER_H_1.values()),  # held in bracing/verification.py
    0.9: [1.85, 1.75, 1.70, 1.60, 1.55, 1.50, 1.45, 1.45, 1.40, 1.40, 1.40, 1.40],
    0.7: [1.90, 1.85, 1.75, 1.70, 1.65, 1.60, 1.60, 1.55, 1.55, 1.55, 1.55, 1.55],
    0.5: [1.95, 1.85, 1.80, 1.75, 1.75, 1.70, 1.70, 1.70, 1.70, 1.70, 1.70, 1.75],
    0.3: [1.95, 1.90, 1.85, 1.80, 1.80, 1.80, 1.80, 1.80, 1.80, 1.85, 1.85, 1.85],
    0.2: [1.95, 1.90, 1.85, 1.80, 1.80, 1.80, 1.80, 1.80, 1.85, 1.90, 1.90, 1.95],
    0.16: [1.95, 1.90, 1.85, 1.85, 1.80, 1.80, 1.85, 1.85, 1.85, 1.90, 1.90, 1.95],
}


@pytest.mark.parametrize("s_over_h", sorted(AB_ROWS))
def test_cf_cases_ab_every_tabulated_cell(s_over_h):
    got = cf_cases_ab(np.array(AB_B_OVER_S), s_over_h)
    np.testing.assert_allclose(got, AB_ROWS[s_over_h], rtol=0, atol=1e-12)  # secondary


def test_cf_cases_ab_clamped_outside_the_table():
    # Figure 29.3-1 headings "<= 0.05", ">= 45", "<= 0.16" (secondary)
    assert cf_cases_ab(0.01, 1.0) == pytest.approx(1.80, abs=1e-12)
    assert cf_cases_ab(200.0, 1.0) == pytest.approx(1.30, abs=1e-12)
    assert cf_cases_ab(45.0, 0.05) == pytest.approx(1.95, abs=1e-12)


def test_cf_cases_ab_linear_interpolation_note_5():
    # Note 5: linear interpolation in B/s and s/h (secondary). B/s 3 on grade: (1.40 + 1.35)/2;
    # s/h 0.8 at B/s 2: (1.60 + 1.50)/2.
    assert cf_cases_ab(3.0, 1.0) == pytest.approx(published("asce7-cf-interpolated"), abs=1e-12)
    assert cf_cases_ab(2.0, 0.8) == pytest.approx(1.55, abs=1e-12)


# --- Figure 29.3-1, Case C -----------------------------------------------------------------------

# Case C regions by B/s (secondary): (x/s at the region's centre, Cf).
CASE_C_COLUMNS = {
    2: [2.25, 1.50],
    3: [2.60, 1.70, 1.15],
    4: [2.90, 1.90, 1.30, 1.10],
    5: [3.10, 2.00, 1.45, 1.05],
    6: [3.30, 2.15, 1.55, 1.05],
    7: [3.40, 2.25, 1.65, 1.05],
    8: [3.55, 2.30, 1.70, 1.05],
    9: [3.65, 2.35, 1.75, 1.00],
    10: [3.75, 2.45, 1.85, 0.95],
}
CENTRES_TO_10S = [0.5, 1.5, 2.5, 6.5]  # 0-s, s-2s, 2s-3s, 3s-10s
CASE_C_LONG = {  # B/s 13 and >= 45 (secondary): 0-s ... 5s-10s, beyond 10s
    13: [4.00, 2.60, 2.00, 1.50, 1.35, 0.90, 0.55],
    45: [4.30, 2.55, 1.95, 1.85, 1.85, 1.10, 0.55],
}
CENTRES_LONG = [0.5, 1.5, 2.5, 3.5, 4.5, 7.5, 11.0]


@pytest.mark.parametrize("b_over_s", sorted(CASE_C_COLUMNS))
def test_case_c_cells_at_region_centres(b_over_s):
    values = CASE_C_COLUMNS[b_over_s]
    got = case_c_cf(np.array(CENTRES_TO_10S[: len(values)]), b_over_s, 0.5)  # s/h <= 0.8
    np.testing.assert_allclose(got, values, rtol=0, atol=1e-12)


@pytest.mark.parametrize("b_over_s", sorted(CASE_C_LONG))
def test_case_c_long_walls_at_region_centres(b_over_s):
    got = case_c_cf(np.array(CENTRES_LONG), b_over_s, 0.5)
    np.testing.assert_allclose(got, CASE_C_LONG[b_over_s], rtol=0, atol=1e-12)


def test_case_c_beyond_45_uses_the_45_column():
    assert case_c_cf(0.5, 100.0, 0.5) == pytest.approx(4.30, abs=1e-12)  # heading ">= 45"


@pytest.mark.parametrize(
    ("s_over_h", "factor"),
    [(1.0, 0.8), (0.9, 0.9), (0.8, 1.0), (0.5, 1.0)],  # note 4: x (1.8 - s/h) for s/h > 0.8
)
def test_case_c_tall_wall_factor(s_over_h, factor):
    got = case_c_cf(np.array([0.5, 1.5, 2.5, 6.5]), 5.0, s_over_h)
    np.testing.assert_allclose(got, np.array([3.10, 2.00, 1.45, 1.05]) * factor, atol=1e-12)


@pytest.mark.parametrize(
    ("return_ratio", "reduction"),
    [(0.3, 0.90), (1.0, 0.75), (2.0, 0.60), (4.0, 0.60)],  # return-corner note, secondary
)
def test_case_c_return_corner_on_asterisked_cells(return_ratio, reduction):
    assert case_c_cf(0.5, 10.0, 0.5, return_ratio) == pytest.approx(3.75 * reduction, abs=1e-12)
    assert case_c_cf(0.5, 13.0, 1.0, return_ratio) == pytest.approx(
        4.00 * reduction * 0.8, abs=1e-12)  # with note 4 on a wall on grade
    assert case_c_cf(1.5, 10.0, 0.5, return_ratio) == pytest.approx(2.45, abs=1e-12)  # no star
    assert case_c_cf(0.5, 4.0, 0.5, return_ratio) == pytest.approx(2.90, abs=1e-12)  # no star


def test_case_c_return_corner_below_0_3_team_reading():
    # Team's reading (design.md §4): 1.0 at Lr/s 0, linear to 0.90 at 0.3.
    assert case_c_cf(0.5, 5.0, 0.5, 0.15) == pytest.approx(3.10 * 0.95, abs=1e-12)


def test_case_c_interpolated_by_position_team_reading():
    # design.md §4 (team's reading of note 5): interpolate in B/s at the same x. B/s 11.5 lies
    # midway between the 10 and 13 columns. At x = 3.5 s: 10 gives 0.95 (3s-10s), 13 gives 1.50
    # (3s-4s); beyond 10 s: 10 carries its last region 0.95, 13 gives 0.55.
    got = case_c_cf(np.array([0.5, 3.5, 11.0]), 11.5, 0.5)
    np.testing.assert_allclose(got, [3.875, 1.225, 0.75], atol=1e-12)


def test_case_c_below_b_over_s_2_returns_cases_a_b():
    # Case C is required for B/s >= 2 only (Figure 29.3-1 notes, secondary).
    assert case_c_cf(0.5, 1.5, 1.0) == pytest.approx(cf_cases_ab(1.5, 1.0), abs=1e-12)
    assert case_c_mean(0.0, 1.5, 1.5, 1.0) == pytest.approx((cf_cases_ab(1.5, 1.0), 0.75))


def test_case_c_mean_of_a_whole_wall_b_over_s_10():
    # Regions of B/s 10 (secondary): s x 3.75 + s x 2.45 + s x 1.85 + 7 s x 0.95 over 10 s.
    mean, centroid = case_c_mean(0.0, 10.0, 10.0, 0.5)
    assert mean == pytest.approx(1.47, abs=1e-12)
    moment = 3.75 * 0.5 + 2.45 * 1.5 + 1.85 * 2.5 + 0.95 * 7 * 6.5
    assert centroid == pytest.approx(moment / 14.7, abs=1e-12)


# --- Figure 29.3-1 notes: openings, resultant height; open signs ---------------------------------


@pytest.mark.parametrize(("solidity", "factor"), [(0.9, 0.968), (0.8, 0.911), (0.7, 0.836)])
def test_opening_factor_note_3(solidity, factor):
    assert opening_factor(solidity) == pytest.approx(factor, abs=0.0005)  # secondary


def test_opening_factor_solid_wall():
    assert opening_factor(1.0) == 1.0  # note 3: 1 - (1 - 1)^1.5


@pytest.mark.parametrize(("solidity", "cf"), [(0.05, 2.0), (0.1, 1.8), (0.29, 1.8), (0.3, 1.6),
                                              (0.69, 1.6)])
def test_cf_open_signs_flat_members(solidity, cf):
    assert cf_open(solidity) == cf  # ASCE 7-16 Ch. 29 open signs, flat members, from memory


def test_resultant_height_ratio():
    # Figure 29.3-1 notes (secondary): geometric centre where s/h < 1; 0.05 h above it at s/h 1.
    np.testing.assert_array_equal(resultant_height_ratio(np.array([1.0, 0.9, 0.2])),
                                  [0.55, 0.5, 0.5])


# --- Third-party worked sheet (ASCE 7-05 Figure 6-20, same table; secondary) ---------------------


def test_worked_sheet_freestanding_sign_exposure_c_90_mph():
    """Exposure C, V 90 mph, h 35 ft, s 8 ft, B 100 ft (secondary, reproduced by hand).

    The sheet's Cf 1.848 is the Case A/B coefficient interpolated bilinearly at B/s = 12.5
    (between the 10 and 20 columns) and s/h = 8/35 = 0.229 (between the 0.2 and 0.3 rows):
    rows give 1.8625 and 1.8125, hence 1.8482. Its moment is about grade, with the resultant at
    the sign's centre (s/h < 1): 35 - 8 + 4 = 31 ft; its torsion is Case B's 0.2 B offset.
    """
    h_ft, s_ft, b_ft = 35.0, 8.0, 100.0
    assert kz(h_ft, "C") == pytest.approx(1.01, abs=0.01)  # sheet interpolates Table 6-3: 1.01
    q_h = velocity_pressure(90.0, 1.01, kd=0.85)
    assert q_h == pytest.approx(17.80, abs=0.005)  # sheet: q_h 17.80 psf
    cf = cf_cases_ab(b_ft / s_ft, s_ft / h_ft)
    assert cf == pytest.approx(1.848, abs=0.0005)  # sheet: Cf 1.848
    force_lb = q_h * GUST_FACTOR * cf * b_ft * s_ft  # ASCE 7-16 Eq. 29.3-1
    assert force_lb / 1000 == pytest.approx(22.37, abs=0.005)  # sheet: F 22.37 kips
    arm_ft = h_ft - s_ft + resultant_height_ratio(s_ft / h_ft) * s_ft
    assert force_lb * arm_ft / 1000 == pytest.approx(693.6, abs=0.05)  # sheet: 693.6 ft-kips
    assert force_lb * 0.2 * b_ft / 1000 == pytest.approx(447.5, abs=0.05)  # sheet: 447.5 ft-kips


# --- ASCE 7-16 commentary gust factors; weather-service units ------------------------------------


def test_sustained_ratios_commentary_gust_factor_curve():
    # ASCE 7 commentary gust-factor curve, open terrain (from memory)
    assert SUSTAINED_RATIOS == {"1-min": 1.22, "2-min": 1.30, "10-min": 1.43, "1-hour": 1.52}
    got = sustained_equivalents(np.array([61.0, 26.0]))
    np.testing.assert_allclose(got["1-min"], [50.0, 26.0 / 1.22])
    assert sustained_equivalents(65.0)["2-min"] == pytest.approx(50.0)
    assert sustained_equivalents(71.5)["10-min"] == pytest.approx(50.0)


def test_knot():
    assert KNOT_MPH == 1.151  # 1 kt = 1.151 mph, secondary


def test_anemometer_at_the_reference_reads_the_reference_gust():
    # Reference gust: 3 s, 33 ft, exposure C (ASCE 7-16 §26.5, design.md §3)
    assert anemometer_factor(33.0, "C") == pytest.approx(1.0, abs=1e-12)
    assert reference_gust_from_reading(40.0, 33.0, "C") == pytest.approx(40.0, abs=1e-12)


def test_anemometer_low_in_suburban_terrain_reads_low():
    """An anemometer 10 ft up in exposure B against the reference (33 ft, exposure C): factor
    sqrt(Kz_B(10 ft) / Kz_C(33 ft)), the power law of Table 26.10-1 note 1 without its 15 ft
    floor (design.md §3), alpha and zg from Table 26.11-1 (text), worked by hand:
    Kz_B(10) = 2.01 (10/1200)^(2/7) = 2.01 x 0.25465 = 0.51185;
    Kz_C(33) = 2.01 (33/900)^(2/9.5) = 2.01 x 0.49859 = 1.00216;
    factor = sqrt(0.51185 / 1.00216) = sqrt(0.51075) = 0.71467: a 30 mph reading there is a
    30 / 0.71467 = 41.98 mph reference gust."""
    assert anemometer_factor(10.0, "B") == pytest.approx(0.71467, abs=2e-5)
    assert reference_gust_from_reading(30.0, 10.0, "B") == pytest.approx(41.98, abs=0.01)
