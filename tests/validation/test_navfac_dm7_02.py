"""NAVFAC DM-7.02 Table 1, ultimate friction of mass concrete on soil (from memory): the lower
end of each published range is kept, to be divided by a factor of safety."""

import pytest
from braced_foot import foot_capacities

from bracing.anchors import FRICTION_NAVFAC_DM7_02, SLIDING_FS_ULTIMATE


def test_ultimate_friction_lower_bounds():
    # NAVFAC DM-7.02 Table 1 (from memory): clean gravel / coarse sand 0.55-0.60, fine to
    # medium sand 0.45-0.55, fine sand / silty sand 0.35-0.45, stiff clay 0.30-0.35
    assert FRICTION_NAVFAC_DM7_02 == {
        "sandy_gravel": 0.55, "medium_sand": 0.45, "silty_sand": 0.35, "stiff_clay": 0.30,
    }


def test_factor_of_safety():
    # factor of safety 1.5 on ultimate sliding friction (from memory)
    assert SLIDING_FS_ULTIMATE == 1.5


@pytest.mark.parametrize(("soil", "expected"), [("sandy_gravel", 0.55 / 1.5),
                                                ("medium_sand", 0.45 / 1.5),
                                                ("stiff_clay", 0.30 / 1.5)])
def test_the_engine_reads_a_deadmans_ultimate_friction_over_its_factor_of_safety(soil, expected):
    # NAVFAC DM-7.02 Table 1 (from memory): gravel 0.55, medium sand 0.45, stiff clay 0.30,
    # ultimate: over the factor of safety 1.5 (from memory): 0.367, 0.300, 0.200
    bs = foot_capacities({"kind": "deadman", "weight": 8000.0, "soil": soil,
                          "soil_table": "NAVFAC"})
    assert bs.foot_mu[0] == pytest.approx(expected)


def test_a_block_on_the_slab_takes_concrete_on_concrete_friction_over_the_factor_of_safety():
    # ACI 318-19 Table 22.9.4.2: mu 0.6 concrete on hardened concrete (from memory), a nominal
    # value: over the factor of safety 1.5 (NAVFAC DM-7.02, from memory): 0.6 / 1.5 = 0.4
    assert foot_capacities({"kind": "deadman", "weight": 8000.0}).foot_mu[0] == pytest.approx(0.4)
