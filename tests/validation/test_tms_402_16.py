"""TMS 402-16 unreinforced masonry by allowable stress (§8.2), for walls standing on their own.

Table 8.2.4.2 allowable flexural tension normal to bed joints: from memory (references.md).
Section properties per foot of wall: NCMA TEK 14-1B, from memory. §8.2.6.2 bed-joint shear:
from memory. The 28-day cure before tension is credited is the team's default (ASTM C270).
"""

import pytest

from bracing.stability import (
    FLEXURAL_TENSION_PSI,
    masonry_bed_joint_shear,
    masonry_flexural_capacity,
    masonry_section,
)
from bracing.verification import TMS_TABLE_8_2_4_2, published

# TMS 402-16 Table 8.2.4.2, psi, (units, mortar): from memory (held in bracing/verification.py).
TABLE_8_2_4_2 = TMS_TABLE_8_2_4_2


def test_allowable_flexural_tension_table_8_2_4_2():
    assert FLEXURAL_TENSION_PSI == TABLE_8_2_4_2  # from memory


def test_section_of_8_in_hollow_cmu_face_shell_bedded():
    s_in3, a_in2 = masonry_section(7.625, "hollow")
    assert s_in3 == pytest.approx(81.0, rel=0.005)  # NCMA TEK 14-1B, S_n, from memory
    assert a_in2 == pytest.approx(30.0, rel=0.005)  # TEK 14-1B, A_n, from memory


def test_section_of_8_in_solid_or_grouted_cmu():
    s_in3, a_in2 = masonry_section(7.625, "solid")
    assert s_in3 == pytest.approx(116.3, rel=0.005)  # TEK 14-1B, from memory (12 t^2 / 6)
    assert a_in2 == pytest.approx(91.5, rel=0.005)  # TEK 14-1B, from memory (12 t)


def test_flexural_capacity_net_tension_at_the_allowable():
    # §8.2.4: f_t = M/S - P/A_n <= F_t, so M = (F_t + P/A_n) S; 8 in hollow, M/S mortar.
    assert masonry_flexural_capacity(33.0, 81.0, 30.0, 0.0) == pytest.approx(33.0 * 81.0 / 12.0)
    assert masonry_flexural_capacity(33.0, 81.0, 30.0, 300.0) == pytest.approx(
        (33.0 + 300.0 / 30.0) * 81.0 / 12.0)  # lb-ft per ft


def test_bed_joint_shear_running_bond_not_grouted():
    # §8.2.6.2 (from memory): least of 1.5 sqrt(f'm), 120 psi, 37 psi + 0.45 N_v/A_n.
    fv = published("tms-bed-joint-shear")  # 37 psi, from memory
    assert masonry_bed_joint_shear(30.0, 0.0, 2000.0) == pytest.approx(fv * 30.0)
    assert masonry_bed_joint_shear(30.0, 1000.0, 2000.0) == pytest.approx(
        (37.0 + 0.45 * 1000.0 / 30.0) * 30.0)
    assert masonry_bed_joint_shear(30.0, 1e6, 2000.0) == pytest.approx(
        1.5 * 2000.0**0.5 * 30.0)  # 1.5 sqrt(f'm) governs under a large load


@pytest.mark.parametrize(("mortar_age_days", "cured"), [(40.0, True), (28.0, True), (27.0, False)])
def test_tension_credited_only_once_the_mortar_has_cured(helpers, mortar_age_days, cured):
    # A 6 ft x 20 ft wall of 8 in hollow CMU (36 psf, HUD RSDG Table 3.2, secondary), M/S mortar.
    data = helpers.build_site([helpers.panel(material="masonry", height=6.0, width=20.0,
                                             thickness=7.625, mortar_age=mortar_age_days)])
    wall = helpers.evaluate_data(data).panels[0]
    capacity = {c.region.split(",")[0]: c.capacity for c in wall.checks
                if c.element == "overturning"}
    dead = 0.6 * 36.0 * 6.0  # 0.6D per ft of wall, ASCE 7-16 §2.4.1
    rocking = dead * 7.625 / 12.0 / 2.0  # W t/2 (statics)
    flexure = (33.0 + dead / 30.0) * 81.0 / 12.0  # Table 8.2.4.2 hollow M/S; TEK 14-1B S, A
    expected = max(rocking, flexure) if cured else rocking
    assert capacity["end zone"] == pytest.approx(expected, rel=0.005)
    assert capacity["interior"] == pytest.approx(expected, rel=0.005)
    assert ("fresh-mortar" in [f.code for f in wall.flags]) is not cured
