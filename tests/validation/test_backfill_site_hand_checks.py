"""Foundation walls in a site file (method notes §12), worked by hand from the named sources:
the maximum backfill before the floor with the wind on the part above it, the inside braces'
reaction and force, and the wind part's working limit. Per foot of wall.

The wall of these checks: 8 in cast concrete, 150 pcf (ASCE 7 Table C3.1-2, from memory), so
100 psf of face; 9 ft above a 3 ft x 1 ft footing on sandy gravel; f'c 3000 psi on the day.
Backfill SM at-rest, EFP 60 psf/ft (IBC 2018 Table 1610.1, from memory), K = 60 / 120 = 0.5.
Wind: 110 mph basic, exposure B, a 4-week period (factor 0.75, ASCE 37-14 Table 6.2-1, from
memory): V = 82.5 mph; q = 0.00256 x 0.575 x 0.85 x 82.5^2 = 8.5 psf at most (Kz at 15 ft,
exposure B, ASCE 7-16 Table 26.10-1, text; Eq. 26.10-1, secondary), q G Cf <= 8.5 x 0.85 x 1.8
= 13 psf, so the 16 psf minimum governs (ASCE 7-16 §29.7, from memory).
"""

import math

import pytest

from bracing.model import Site
from bracing.stages import foundation

WALL = {"mark": "FW-1", "material": "concrete", "length": 30.0, "height": 9.0, "thickness": 8.0,
        "footing": {"width": 3.0, "thickness": 1.0, "soil": "sandy_gravel"}, "build_day": 1,
        "release_after": ["deck"]}


def site(wall: dict | None = None, events: list | None = None) -> Site:
    return Site.model_validate({
        "version": 1,
        "site": {"name": "hand checks", "basic_wind_speed": 110.0, "exposure": "B",
                 "construction_period": "4 weeks"},
        "materials": {"concrete": {"kind": "concrete", "unit_weight": 150.0,
                                   "compressive_strength": 3000.0},
                      "framed": {"kind": "framed", "face_weight": 6.0}},
        "brace_types": {"shore": {"kind": "rated", "lengths": [8.0, 12.0],
                                  "loads": [6000.0, 6000.0], "tension_capacity": 4000.0}},
        "anchor_types": {"stake": {"kind": "stake", "rated_tension": 1500.0,
                                   "rated_shear": 4000.0}},
        "backfill": {"soil": "SM", "drained": True},
        "events": [{"name": "deck", "day": 9}],
        "foundation_walls": [{**WALL, **(wall or {})}],
        "backfill_events": events or [],
        "panels": [{"mark": "P", "material": "framed", "width": 10.0, "height": 8.0,
                    "thickness": 5.5}],
    })


def test_the_maximum_backfill_before_the_floor_by_hand():
    """Sliding on the footing governs (IBC Table 1806.2, text: sandy gravel 0.35, allowable,
    with 0.6D, ASCE 7-16 §2.4.1, from memory for H):
    capacity = 0.35 x 0.6 x (100 x 9 + 150 x 3 x 1) = 0.35 x 0.6 x 1,350 = 283.5 lb/ft.
    Demand at a backfill h: 1.0H + 0.6W = 60 h^2 / 2 + 0.6 x 16 x (9 - h)
    = 30 h^2 - 9.6 h + 86.4. At 283.5: 30 h^2 - 9.6 h - 197.1 = 0,
    h = (9.6 + sqrt(9.6^2 + 4 x 30 x 197.1)) / 60 = (9.6 + 154.09) / 60 = 2.728 ft.
    The others pass there (h = 2.728, exposed 6.272 ft, wind 16 x 6.272 = 100.4 lb/ft at
    2.728 + 0.55 x 6.272 = 6.178 ft): overturning about the toe, lever 1.5 ft for both weights,
    0.6 x 1,350 x 1.5 = 1,215 against 60 x 2.728^3 / 6 + 30 x 2.728^2 + 0.6 x 100.4 x (6.178 + 1)
    = 203.0 + 223.3 + 432.4 = 858.7 lb-ft/ft; plain concrete flexure phi Mn
    = 0.6 x 5 x sqrt(3000) x 128 / 12 = 1,752.7 (ACI 318-19 §14.5.2.1, from memory) against
    1.6 x 203.0 + 1.0 x 100.4 x 6.178 = 945.1 lb-ft/ft."""
    result = foundation.evaluate_foundation_walls(site())[0]
    hand = (9.6 + math.sqrt(9.6**2 + 4 * 30.0 * 197.1)) / 60.0
    assert hand == pytest.approx(2.728, abs=1e-3)
    assert result.max_height_ft == pytest.approx(hand, rel=0.02)
    assert result.wind.pressure_psf == 16.0  # the minimum governs (the premise above)


def test_a_compactor_lowers_the_day_s_allowed_height_by_hand():
    """A plate compactor of 50 psf on the day adds K q = 0.5 x 50 = 25 psf over the fill
    (method notes §12, common practice K = EFP / unit weight): 30 h^2 + 25 h - 9.6 h + 86.4
    = 283.5, 30 h^2 + 15.4 h - 197.1 = 0, h = (-15.4 + sqrt(15.4^2 + 23,652)) / 60
    = (-15.4 + 154.56) / 60 = 2.319 ft that day; 2.728 ft the day after."""
    s = site(events=[{"day": 4, "wall": "FW-1", "height": 2.0, "surcharge": 50.0}])
    days = {d.day: d for d in foundation.evaluate_foundation_walls(s)[0].days}
    hand = (-15.4 + math.sqrt(15.4**2 + 4 * 30.0 * 197.1)) / 60.0
    assert days[4].allowed_height_ft == pytest.approx(hand, rel=0.02)
    assert days[5].allowed_height_ft == pytest.approx(2.728, rel=0.02)
    assert not days[4].over and days[4].planned_height_ft == 2.0


def test_an_inside_brace_force_by_hand():
    """Backfill 6 ft, no surcharge: M_base = 60 x 6^3 / 6 = 2,160 lb-ft/ft (statics);
    braces 7 ft up, pinned base: R = 2,160 / 7 = 308.57 lb/ft; every 6 ft at 45 deg:
    P_H = 308.57 x 6 / cos 45 = 2,618.3 lb (1.0H, ASCE 7-16 §2.4.1, from memory).
    Wind on the 3 ft above the fill, 16 psf (§29.7 minimum, from memory), taken on the propped
    wall as a uniform 1.1 x 16 = 17.6 psf (its moment about the fill's top that of the
    resultant at 0.55 s, ASCE 7-16 Fig. 29.3-1; method notes §12): 52.8 lb/ft at 6 + 1.5 =
    7.5 ft, 396.0 lb-ft/ft about the base; 0.6 x 396.0 / 7 x 6 / cos 45 = 0.6 x 56.571 x
    8.4853 = 288.0 lb. Brace force 2,618.3 + 288.0 = 2,906.3 lb, against the rated 6,000 lb at
    its length 7 / sin 45 = 9.90 ft (maker's table, invented). The fixed base gives less
    (moment-area, R = 3 / h_b^3 x integral M_L (h_b - z) dz: the fill is below the braces),
    so the pinned base's reaction is the braces'."""
    s = site(wall={"inside_braces": {"height": 7.0, "spacing": 6.0, "angle": 45.0,
                                     "brace_type": "shore", "foot_anchor": "stake"}},
             events=[{"day": 3, "wall": "FW-1", "height": 6.0}])
    r = foundation.evaluate_foundation_walls(s)[0]
    brace = r.inside_brace
    assert r.needs_support and r.planned_height_ft == 6.0
    assert brace.reaction_plf == pytest.approx(2160.0 / 7.0, rel=1e-6)
    assert brace.length_ft == pytest.approx(7.0 / math.sin(math.radians(45.0)), rel=1e-9)
    assert brace.force_lb == pytest.approx(2618.3 + 288.0, rel=2e-4)
    assert brace.capacity_lb == pytest.approx(6000.0)
    # the stake: pushed away from the wall by P cos 45 = 2,055.1 lb against its 4,000 lb
    # rated shear, no uplift (T/Ta + V/Va, common practice): 0.514
    stake = next(c for c in r.checks if c.element == "brace foot anchor")
    assert stake.demand == pytest.approx(2906.3 * math.cos(math.radians(45.0)) / 4000.0, rel=2e-4)
    assert r.checks is not r.cantilever_checks and not r.fails


def test_the_wind_part_s_working_limit_by_hand():
    """With 2 ft of fill the wind acts on 7 ft of wall. Observed gust V: q = 0.00256 Kz V^2
    with Kd 1.0 (method notes §1), Kz at 15 ft, exposure B: 2.01 (15 / 1200)^(2/7) = 0.5747
    (ASCE 7-16 Table 26.11-1, text); G Cf = 0.85 x Cf(B/s = 30 / 7 = 4.286, s/h = 1): between
    1.35 at 4 and 1.35 at 5, 1.35 (Figure 29.3-1, secondary); p = 0.00256 x 0.5747 x 0.85 x
    1.35 V^2 = 1.6883e-3 V^2 psf, no minimum; 7 p on the exposed part, at 2 + 0.55 x 7 = 5.85 ft.
    Overturning about the toe governs (statics; 0.6D + 1.0H + 1.0W): resisting
    0.6 x 1,350 x 1.5 = 1,215; held 60 x 2^3 / 6 + 30 x 2^2 x 1 = 80 + 120 = 200 lb-ft/ft;
    wind 7 p (5.85 + 1) = 47.95 p = 0.080955 V^2; V = sqrt(1,015 / 0.080955) = 112.0 mph.
    (Sliding would allow sqrt((283.5 - 120) / (7 x 1.6883e-3)) = 117.6 mph.) Stand-down
    0.8 x 112.0 = 89.6 mph (the site rule's default ratio)."""
    s = site(events=[{"day": 3, "wall": "FW-1", "height": 2.0}])
    r = foundation.evaluate_foundation_walls(s)[0]
    kz = 2.01 * (15.0 / 1200.0) ** (2.0 / 7.0)
    p_per_v2 = 0.00256 * kz * 0.85 * 1.35
    hand = math.sqrt((1215.0 - 200.0) / (7.0 * p_per_v2 * 6.85))
    assert hand == pytest.approx(112.0, abs=0.1)
    assert math.sqrt((283.5 - 120.0) / (7.0 * p_per_v2)) > hand  # sliding allows more
    assert r.wind.working_limit_speed_mph == pytest.approx(hand, rel=1e-3)
    assert r.wind.stand_down_speed_mph == pytest.approx(0.8 * hand, rel=1e-3)
    assert r.days[3].stand_down_speed_mph == pytest.approx(0.8 * hand, rel=1e-3)
