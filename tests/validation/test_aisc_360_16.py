"""AISC 360-16 Chapter E, checked against AISC Design Examples v14, Example E.11 (secondary).

A53 Gr. B Pipe 10 STD, 30 ft, pinned, braced at mid-height about one axis (the pipe is round, so
the 30 ft axis governs): Lc/r 97.8, phi_c Pn 221 kips, Pn/Omega_c 147 kips.
"""

import pytest

from bracing.members import pipe_compression, slenderness
from bracing.verification import E11, published

AREA_IN2 = E11["area_in2"]  # 11.5 in2, Pipe 10 STD, AISC Manual Table 1-14 in E.11 (from memory)
R_IN = E11["r_in"]  # 3.68 in, Pipe 10 STD (from memory)
FY_KSI = E11["Fy_ksi"]  # 35 ksi, ASTM A53 Gr. B (text)


def test_e11_slenderness():
    # AISC Design Examples v14 E.11: Lc/r = 97.8 (secondary), tolerance 0.1
    assert slenderness(30.0, R_IN) == pytest.approx(published("aisc-e11-slenderness"), abs=0.1)


def test_e11_lrfd_available_strength():
    # AISC Design Examples v14 E.11: phi_c Pn = 221 kips (secondary), tolerance 1.5 %
    kips = pipe_compression(AREA_IN2, R_IN, FY_KSI, 15.0, 30.0, basis="LRFD") / 1000.0
    assert kips == pytest.approx(published("aisc-e11-lrfd"), rel=0.015)


def test_e11_asd_available_strength():
    # AISC Design Examples v14 E.11: Pn / Omega_c = 147 kips (secondary), tolerance 1.5 %
    kips = pipe_compression(AREA_IN2, R_IN, FY_KSI, 15.0, 30.0, basis="ASD") / 1000.0
    assert kips == pytest.approx(published("aisc-e11-asd"), rel=0.015)


def test_e11_governing_plane_is_the_unbraced_one():
    # AISC Design Examples v14 E.11: buckling about the axis braced at 30 ft governs (secondary)
    swapped = pipe_compression(AREA_IN2, R_IN, FY_KSI, 30.0, 15.0)
    assert swapped == pytest.approx(pipe_compression(AREA_IN2, R_IN, FY_KSI, 15.0, 30.0))
