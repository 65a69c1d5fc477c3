"""IBC Table 1806.2 presumptive lateral sliding resistance (text, 2012 edition; the 2018 edition
is taken as unchanged: from memory). The coefficients are allowable values."""

import pytest
from braced_foot import foot_capacities

from bracing.anchors import COHESION_IBC_1806_2_PSF, FRICTION_IBC_1806_2, deadman_sliding


def test_friction_coefficients():
    # IBC Table 1806.2: sedimentary rock 0.35, sandy gravel 0.35, sand / silty / clayey sand
    # and gravel 0.25 (text)
    assert FRICTION_IBC_1806_2["sedimentary_rock"] == 0.35
    assert FRICTION_IBC_1806_2["sandy_gravel"] == 0.35
    assert FRICTION_IBC_1806_2["silty_sand"] == 0.25


def test_crystalline_bedrock():
    # IBC Table 1806.2: crystalline bedrock 0.70 (from memory)
    assert FRICTION_IBC_1806_2["crystalline_bedrock"] == 0.70


def test_clay_cohesion():
    # IBC Table 1806.2: clays and silts 130 psf times the contact area (text)
    assert COHESION_IBC_1806_2_PSF["clay_silt"] == 130.0


def test_allowable_values_take_no_extra_factor_of_safety():
    # IBC Table 1806.2 (text): 0.35 x 0.6 x 10,000 lb on sandy gravel = 2,100 lb
    sliding = deadman_sliding(10_000.0, 0.0, FRICTION_IBC_1806_2["sandy_gravel"])
    assert sliding == pytest.approx(2100.0)


@pytest.mark.parametrize(("soil", "expected"), [("sandy_gravel", 0.35), ("silty_sand", 0.25),
                                                ("sedimentary_rock", 0.35)])
def test_the_engine_reads_a_deadmans_friction_from_the_table(soil, expected):
    # IBC Table 1806.2 (text): sandy gravel 0.35, silty sand 0.25, sedimentary rock 0.35;
    # allowable values, used with 0.6D and no further factor of safety
    bs = foot_capacities({"kind": "deadman", "weight": 8000.0, "soil": soil})
    assert bs.foot_mu[0] == pytest.approx(expected)
