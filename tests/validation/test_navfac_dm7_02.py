"""NAVFAC DM-7.02 Table 1, ultimate friction of mass concrete on soil (from memory): the lower
end of each published range is kept, to be divided by a factor of safety."""

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
