"""Physical properties of the backfill checks (method notes §12), by hypothesis."""

import numpy as np
import pytest
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from bracing import backfill
from bracing.backfill import InsideBrace, Soil, Wall

PROPERTY = settings(max_examples=60, deadline=None)
WATER_PCF = 62.4  # unit weight of water (text)


@st.composite
def walls(draw):
    """A foundation wall of any of the four kinds, with or without a footing."""
    material = draw(st.sampled_from(["plain", "reinforced", "masonry", "reinforced_masonry"]))
    t = draw(st.floats(6.0, 12.0))
    fields = {"height": draw(st.floats(4.0, 12.0)), "thickness": t, "material": material,
              "face_weight": draw(st.floats(30.0, 150.0)), "fc": draw(st.floats(1500.0, 5000.0)),
              "steel": draw(st.floats(0.1, 0.6)), "depth": t / 2.0,
              "tension": draw(st.sampled_from([25.0, 40.0, 86.0])),
              "grouting": draw(st.sampled_from(["hollow", "grouted"]))}
    if draw(st.booleans()):
        fields.update(footing_width=draw(st.floats(1.5, 4.0)),
                      footing_thickness=draw(st.floats(0.67, 1.5)))
    return Wall(**fields)


soils = st.builds(Soil, efp=st.floats(30.0, 100.0), source=st.just(""),
                  unit_weight=st.floats(100.0, 130.0), surcharge=st.floats(0.0, 500.0),
                  water=st.floats(0.0, 8.0))


@PROPERTY
@given(walls(), soils, st.floats(0.2, 0.95), st.floats(0.01, 0.3))
def test_utilization_rises_with_backfill_height(wall, soil, fraction, more):
    low = fraction * wall.height
    high = min(low + more * wall.height, wall.height)
    assert backfill.utilization(wall, soil, high) > backfill.utilization(wall, soil, low)


@PROPERTY
@given(walls(), soils, st.floats(0.2, 1.0), st.floats(10.0, 500.0))
def test_utilization_rises_with_surcharge(wall, soil, fraction, more):
    height = fraction * wall.height
    heavier = Soil(soil.efp, "", soil.unit_weight, soil.surcharge + more, soil.water)
    assert backfill.utilization(wall, heavier, height) > backfill.utilization(wall, soil, height)


@PROPERTY
@given(walls(), soils)
def test_the_maximum_height_is_where_utilization_reaches_one(wall, soil):
    top = backfill.max_height(wall, soil)
    assume(0.01 < top < wall.height - 0.01)
    assert backfill.utilization(wall, soil, top) == pytest.approx(1.0, abs=1e-6)


@PROPERTY
@given(soils, st.floats(2.0, 10.0), st.floats(0.1, 1.0), st.floats(2.0, 10.0),
       st.floats(20.0, 70.0))
def test_the_brace_reaction_balances_the_earth_moment_about_the_base(soil, height, at,
                                                                     spacing, angle):
    """R h_b equals the moment of the pressure profile about the base (statics), integrated here
    by the midpoint rule from the pressure at each depth: the soil's vertical effective stress
    times K = EFP / gamma, plus the water below its level (method notes §12)."""
    k = soil.efp / soil.unit_weight
    y = (np.arange(20000) + 0.5) * height / 20000
    depth = height - y
    below_water = np.clip(min(soil.water, height) - y, 0.0, None)  # water in the fill
    effective = soil.surcharge + soil.unit_weight * depth - WATER_PCF * below_water
    pressure = k * effective + WATER_PCF * below_water
    moment = np.sum(pressure * y) * height / 20000
    assume(k <= 1.0)
    brace = InsideBrace(height=at * height, spacing=spacing, angle=angle, capacity=1e9)
    reaction = backfill.brace_reaction(soil.at(height)[1], brace.height)
    assert reaction * brace.height == pytest.approx(moment, rel=1e-4)
    # and the propped wall carries no moment at its pinned base
    _, base_moment = soil.at(height)
    assert base_moment - reaction * brace.height == pytest.approx(0.0, abs=1e-6 * moment + 1e-9)
    force = backfill.brace_force(reaction, spacing, angle)
    assert force * np.cos(np.radians(angle)) == pytest.approx(reaction * spacing)


@settings(max_examples=25, deadline=None)
@given(walls(), soils, st.floats(0.3, 1.0), st.floats(2.0, 8.0), st.floats(20.0, 60.0),
       st.floats(1000.0, 20000.0))
def test_the_braced_maximum_height_is_where_the_braced_checks_reach_one(wall, soil, at, spacing,
                                                                        angle, capacity):
    brace = InsideBrace(height=at * wall.height, spacing=spacing, angle=angle,
                        capacity=capacity)
    top = backfill.braced_max_height(wall, soil, brace)
    assume(0.01 < top < wall.height - 0.01)
    worst = backfill.governing(backfill.braced_checks(wall, soil, top, brace))
    assert worst == pytest.approx(1.0, abs=1e-6)
