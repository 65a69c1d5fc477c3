"""NDS 2018 §3.7.1 column stability, checked against HUD Residential Structural Design Guide
Example 5.6 (secondary): SPF No. 2 4x4 column, 7.3 ft, C_D 1.0, P 4,800 lb."""

import pytest

from bracing.members import column_stability_factor, lumber_compression
from bracing.verification import RSDG_5_6, published

FC_PSI = RSDG_5_6["Fc_psi"]  # 1150 psi, SPF No. 1/No. 2, NDS Supplement Table 4A (secondary)
EMIN_PSI = RSDG_5_6["Emin_psi"]  # 510,000 psi, SPF No. 1/No. 2 (secondary)
CF_4IN = RSDG_5_6["CF"]  # 1.15, size factor for Fc, 2 to 4 in wide (secondary)
SIDE_IN = RSDG_5_6["side_in"]  # 3.5 in, dressed 4x4 (from memory)
LENGTH_FT = RSDG_5_6["length_ft"]  # 7.3 ft


def test_column_stability_factor():
    # HUD RSDG Example 5.6: C_P = 0.4378 (secondary), tolerance 1 %
    cp = column_stability_factor(FC_PSI * CF_4IN, EMIN_PSI, LENGTH_FT * 12.0 / SIDE_IN)
    assert cp == pytest.approx(published("nds-cp"), rel=0.01)


def test_adjusted_compression_stress():
    # HUD RSDG Example 5.6: F_c' = 579 psi (secondary), tolerance 1 %
    p = lumber_compression(SIDE_IN, SIDE_IN, LENGTH_FT, LENGTH_FT, FC_PSI, EMIN_PSI,
                           CD=1.0, CF=CF_4IN)
    assert p / SIDE_IN**2 == pytest.approx(published("nds-fc-prime"), rel=0.01)


def test_example_column_carries_its_load():
    # HUD RSDG Example 5.6: f_c = 391.8 psi under P = 4,800 lb, below F_c' (secondary)
    assert 4800.0 / SIDE_IN**2 == pytest.approx(391.8, rel=0.001)
    p = lumber_compression(SIDE_IN, SIDE_IN, LENGTH_FT, LENGTH_FT, FC_PSI, EMIN_PSI,
                           CD=1.0, CF=CF_4IN)
    assert p > 4800.0
