"""Lateral loads that are not wind (bracing.stages.loads): a kind added through the registry
reaches the checks of walls on their own and the brace forces, with no change to the braced-wall
module, and the limit-speed searches hold it as it is."""

from __future__ import annotations

import math

import numpy as np
import pytest
from test_braced_walls import site_of, wall

from bracing.evaluate import evaluate, gather
from bracing.stages import loads

PSF = {"uniform": 10.0}  # the held pressure of these tests (invented)


def uniform(site, walls):
    """A uniform pressure of PSF over every wall's face, not growing with the wind."""
    return loads.pressure_load("uniform", walls, PSF["uniform"], PSF["uniform"])


@pytest.fixture
def held_pressure():
    """The documented extension point: a kind registered in loads.KINDS (taken out after)."""
    loads.register(loads.LoadKind(
        name="uniform", symbol="L", factors={"ASD": 1.0, "LRFD": 1.0, "service": 1.0},
        scales_with_wind=False, source="a test load", on=uniform))
    yield
    del loads.KINDS["uniform"]


def test_a_pressure_profile_is_turned_into_its_resultant_by_statics():
    """Statics (text): a uniform 10 psf on a wall 12 ft tall, 20 ft long: 10 x 12 = 120 plf,
    120 x 20 = 2,400 lb at 12 / 2 = 6 ft up and 20 / 2 = 10 ft along. A triangle of 60 psf at
    the base to 0 at 6 ft up: 60 x 6 / 2 = 180 plf at 6 / 3 = 2 ft up."""
    site = site_of([wall("A", height=12.0, width=20.0)])
    w = gather(site)
    flat = loads.pressure_load("uniform", w, 10.0, 10.0)
    assert (flat.line[0], flat.force[0], flat.height[0], flat.at[0]) == pytest.approx(
        (120.0, 2400.0, 6.0, 10.0))
    triangle = loads.pressure_load("backfill", w, 60.0, 0.0, top_ft=6.0)
    assert (triangle.line[0], triangle.height[0]) == pytest.approx((180.0, 2.0))


def test_a_kind_is_registered_once():
    with pytest.raises(ValueError, match="already registered"):
        loads.register(loads.KINDS["wind"])


def braced_panel():
    """A concrete panel 30 ft tall, 24 ft wide, two braces at 6 and 18 ft (the centres of two
    equal strips), inserts 20 ft up, 45 deg."""
    return site_of([wall("P-1", count=2, insert_height=20.0, angle=45.0)])


def test_the_brace_forces_include_a_held_pressure(request):
    """Statics (text), ASD with the test load's factor 1.0: F = 10 psf x 24 ft x 30 ft = 7,200 lb
    at 30 / 2 = 15 ft; the braces' sum F z / hb = 7,200 x 15 / 20 = 5,400 lb, centred between
    two braces at 6 and 18 ft: 2,700 lb each, and 2,700 / cos 45 = 3,818.3 lb along each."""
    site = braced_panel()
    before = evaluate(site).panels[0].braces["brace_forces_lb"]
    request.getfixturevalue("held_pressure")
    after = evaluate(site).panels[0].braces["brace_forces_lb"]
    added = 7200.0 * 15.0 / 20.0 / 2.0 / math.cos(math.radians(45.0))
    assert np.subtract(after, before) == pytest.approx([added, added], rel=1e-9)


def test_a_strip_of_a_wall_built_in_place_takes_its_own_share(request):
    """Statics (text): a masonry wall 12 ft tall, 24 ft long, two braces at 6 and 18 ft take the
    strips 0-12 and 12-24 ft: 10 psf x 12 ft x 12 ft = 1,440 lb each at 6 ft, inserts 10 ft up:
    1,440 x 6 / 10 = 864 lb, and 864 / cos 50 = 1,344.1 lb along the brace."""
    site = site_of([wall("M-1", material="masonry", height=12.0, width=24.0, count=2,
                         insert_height=10.0, angle=50.0)])
    before = evaluate(site).panels[0].braces["brace_forces_lb"]
    request.getfixturevalue("held_pressure")
    after = evaluate(site).panels[0].braces["brace_forces_lb"]
    added = 1440.0 * 6.0 / 10.0 / math.cos(math.radians(50.0))
    assert np.subtract(after, before) == pytest.approx([added, added], rel=1e-9)


def overturning(site) -> float:
    """The whole-panel overturning demand of the site's first wall, lb-ft."""
    return next(c.demand for c in evaluate(site).panels[0].checks
                if c.element == "overturning" and c.region == "whole panel")


def test_a_wall_on_its_own_is_checked_with_a_held_pressure(request):
    """Statics (text): the panel of 30 x 24 ft gains 10 x 24 x 30 = 7,200 lb at 15 ft:
    108,000 lb-ft about its base (factor 1.0)."""
    site = site_of([wall("P-1")])
    before = overturning(site)
    request.getfixturevalue("held_pressure")
    assert overturning(site) - before == pytest.approx(108000.0, rel=1e-9)


def test_the_speed_searches_hold_a_load_that_does_not_grow_with_the_wind(request, monkeypatch):
    """At the working limit the wall's utilization is 1.0 with the held load as it is: the wind
    moment there plus the held moment M equals the capacity C. With the held load the
    limit falls; and the wind moment at it, which grows with V^2 (ASCE 7-16 Eq. 26.10-1), is
    the capacity less M: V_held^2 / V^2 = (C - M) / C, M = 0.5 psf x 40 x 20 ft x 10 ft =
    4,000 lb-ft (statics, text)."""
    site = site_of([wall("P-1", width=40.0, height=20.0)])
    monkeypatch.setitem(PSF, "uniform", 0.5)
    r = evaluate(site).panels[0]
    capacity = next(c.capacity for c in r.checks if c.element == "overturning")
    speed = r.unbraced.working_limit_speed_mph
    request.getfixturevalue("held_pressure")
    held = evaluate(site).panels[0].unbraced.working_limit_speed_mph
    moment = 0.5 * 40.0 * 20.0 * 10.0  # 0.5 psf x 40 x 20 ft at 10 ft = 4,000 lb-ft
    governs = next(c for c in r.checks if c.utilization == max(k.utilization for k in r.checks))
    assert governs.element == "overturning"
    assert held**2 / speed**2 == pytest.approx((capacity - moment) / capacity, rel=1e-6)
