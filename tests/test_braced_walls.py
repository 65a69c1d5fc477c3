"""Braced walls through the engine (design.md §6, §3): brace forces against the insert height,
the braced working-limit speed and the robustness figure with one brace missing.

Brace and anchor ratings below are invented for the tests (a maker's data sheet would give them).
"""

import gc
from dataclasses import replace

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from pydantic import ValidationError
from wall_materials import MATERIALS, THICKNESS_IN

from bracing import braced
from bracing import evaluate as ev
from bracing.model import Site
from bracing.wind import asce7

SOME = settings(max_examples=50, deadline=None)

BRACE_TYPES = {
    # an adjustable brace: the maker's table of allowable load by length (invented)
    "adjustable": {"kind": "rated", "lengths": [12.0, 24.0, 36.0, 48.0],
                   "loads": [12000.0, 9000.0, 6500.0, 4500.0], "tension_capacity": 8000.0,
                   "end_connection": 10000.0},
    "big": {"kind": "rated", "lengths": [1.0, 100.0], "loads": [60000.0, 60000.0],
            "tension_capacity": 60000.0},
    "pipe": {"kind": "pipe", "section": "Pipe 3 STD", "knee_brace": True,
             "end_connection": 20000.0},
    "stud": {"kind": "lumber", "size": "2x6", "species": "SPF", "grade": "No.1/No.2",
             "tension_capacity": 1200.0},
    "unrated": {"kind": "unrated"},
}
ANCHOR_TYPES = {
    "insert": {"kind": "insert", "rated_tension": 9000.0, "rated_shear": 9000.0},
    "wedge": {"kind": "slab", "embedment": 4.5, "diameter": 0.75, "steel_area": 0.334,
              "pullout": 9000.0, "slab_thickness": 6.0, "concrete_strength": 3000.0},
    "helix": {"kind": "helical", "installation_torque": 3000.0},
    "block": {"kind": "deadman", "weight": 8000.0},
    "sized block": {"kind": "deadman", "weight": 20000.0, "length": 8.0, "pin_height": 1.0,
                    "pin_from_toe": 2.0, "width": 4.0, "allowable_bearing": 2000.0},
    "stake": {"kind": "stake", "rated_tension": 3000.0, "rated_shear": 3000.0},
    "deck": {"kind": "deck", "rated_tension": 1500.0, "rated_shear": 2500.0},
}


def wall(mark, material="concrete", height=30.0, width=24.0, **bracing) -> dict:
    """One panel's raw data, braced when bracing fields are given."""
    p = {"mark": mark, "material": material, "height": height, "width": width,
         "thickness": THICKNESS_IN[material]}
    if material == "masonry":
        p["mortar_age"] = 1.0
    if bracing:
        p["bracing"] = {"brace_type": "big", **bracing}
    return p


def site_of(panels: list[dict], rules: dict | None = None, wind=115.0) -> Site:
    return Site.model_validate({
        "site": {"name": "braced walls", "basic_wind_speed": wind},
        "rules": rules or {}, "materials": MATERIALS, "brace_types": BRACE_TYPES,
        "anchor_types": ANCHOR_TYPES, "panels": panels})


def design_axial_forces(site: Site) -> np.ndarray:
    """Governing brace force of every braced wall at the design wind (the §8 `axial_force_lb`),
    by the array path that `evaluate` uses, without its speed searches (a hypothesis example
    then runs in milliseconds)."""
    w = ev.gather(site)
    speed = w.period_factor * site.site.basic_wind_speed  # ASCE 37-14 §6.2.1 V = f V_basic
    minimum = site.rule_value("minimum_design_pressure_psf")
    wind = ev.wind_on(w, speed, asce7.KD_WALLS, minimum)
    bs = braced.gather_braces(site, site.site.design_basis)
    _, forces = braced.braced_checks(w, wind, bs, ev.COMBINATIONS[site.site.design_basis],
                                     minimum)
    return forces.axial.max(axis=1)


# --- brace force against the insert height ---------------------------------------------------
@st.composite
def two_inserts(draw):
    """The same wall braced at two insert heights, all else equal."""
    material = draw(st.sampled_from(sorted(MATERIALS)))
    height = draw(st.floats(9.0, 40.0))
    width = draw(st.floats(6.0, 60.0))
    low = draw(st.floats(0.4, 0.95))
    high = draw(st.floats(low + 0.02, 1.0))
    fields = {"count": draw(st.integers(2, 5)), "angle": draw(st.floats(40.0, 65.0))}
    return [wall(f"W-{i}", material, height, width, insert_height=ratio * height, **fields)
            for i, ratio in enumerate((low, high))]


@SOME
@given(two_inserts(), st.floats(90.0, 180.0))
def test_brace_force_falls_as_the_insert_rises(panels, wind):
    low, high = design_axial_forces(site_of(panels, wind=wind))
    # statics, design.md §6: sum(R_h) = F z_F / hb and P = R_h / cos(theta) at a fixed angle
    assert high < low


def test_brace_force_falls_as_the_insert_rises_through_evaluate():
    heights = (15.0, 20.0, 25.5)  # 0.5, 0.67 and 0.85 of a 30 ft panel
    site = site_of([wall(f"P-{h}", insert_height=h, count=2, angle=55.0) for h in heights])
    got = [p.braces["axial_force_lb"] for p in ev.evaluate(site).panels]
    assert got[0] > got[1] > got[2]  # statics, design.md §6
    assert got == pytest.approx(list(design_axial_forces(site)), rel=1e-12)


# --- the braced working-limit speed ----------------------------------------------------------
LIMIT_SITE = [
    wall("T-1", brace_type="adjustable", wall_anchor="insert", foot_anchor="wedge", count=2,
         insert_height=20.0, angle=55.0),
    wall("T-2", height=36.0, width=20.0, brace_type="pipe", wall_anchor="insert",
         foot_anchor="helix", count=2, insert_height=24.0, anchor_distance=17.0),
    wall("T-3", height=26.0, width=60.0, brace_type="adjustable", foot_anchor="block", count=4,
         insert_height=18.0, angle=50.0),
    wall("T-4", brace_type="unrated", count=3, insert_height=21.0, angle=50.0),
    wall("T-5", width=18.0, brace_type="big", wall_anchor="insert", count=3,
         insert_height=20.0, angle=60.0, positions=[2.0, 6.0, 15.0]),
    wall("M-1", "masonry", height=14.0, width=40.0, brace_type="stud", foot_anchor="stake",
         count=5, insert_height=10.0, angle=50.0),
    wall("F-1", "framed", height=10.0, width=30.0, brace_type="stud", foot_anchor="helix",
         count=4, insert_height=8.0, angle=50.0, positions=[8.0, 14.0, 20.0, 28.0]),
    wall("U-1"),  # unbraced, in the same pass
]


@pytest.fixture(scope="module")
def limits():
    site = site_of(LIMIT_SITE)
    return site, ev.evaluate_arrays(site)


def _strength_utilization_at(e, speeds) -> np.ndarray:
    """Governing strength utilization of each braced wall at observed gusts `speeds` (by wall),
    with the observed wind as a service load (design.md §3: 1.0W, Kd 1.0, no minimum)."""
    gust = np.zeros(len(e.walls.height))
    gust[e.braces.index] = speeds
    wind = ev.wind_on(e.walls, gust, 1.0, None)
    checks, _ = braced.braced_checks(e.walls, wind, e.braces, ev.SERVICE, None)
    return ev.governing_utilization(ev.strength_only(checks))


def test_at_the_working_limit_the_governing_element_is_fully_used(limits):
    _, e = limits
    assert not np.isnan(e.braced_limit).any()
    assert (e.braced_limit > 10.0).all()
    # design.md §3: the gust at which the most utilized element reaches its working limit
    np.testing.assert_allclose(_strength_utilization_at(e, e.braced_limit), 1.0, atol=1e-6)
    below = _strength_utilization_at(e, 0.99 * e.braced_limit)
    assert (below < 1.0).all()


def test_one_brace_missing_never_raises_the_working_limit(limits):
    _, e = limits
    assert not np.isnan(e.braced_limit_missing).any()  # every wall here has 2 braces or more
    assert (e.braced_limit_missing <= e.braced_limit + 1e-9).all()


def _without_each_brace(p: dict) -> list[dict]:
    """The wall re-braced without each one of its braces in turn (explicit positions)."""
    b = p["bracing"]
    n = b["count"]
    x = b.get("positions") or [(i + 0.5) * p["width"] / n for i in range(n)]
    return [{**p, "mark": f"{p['mark']}-{k}",
             "bracing": {**b, "count": n - 1, "positions": x[:k] + x[k + 1:]}} for k in range(n)]


def _one_missing_cases():
    by_mark = {p["mark"]: p for p in LIMIT_SITE}
    return [pytest.param(by_mark["T-5"], id="rigid panel, uneven positions"),
            pytest.param(by_mark["M-1"], id="masonry, even positions"),
            pytest.param(by_mark["F-1"], id="framed, uneven positions")]


@pytest.mark.parametrize("p", _one_missing_cases())
def test_one_missing_limit_is_the_worst_wall_rebraced_without_one_brace(p):
    variants = _without_each_brace(p)
    e = ev.evaluate_arrays(site_of([p] + variants))
    rebraced = e.braced_limit[1:]
    # design.md §6 robustness: the working limit with any one brace missing, the worst of them
    assert e.braced_limit_missing[0] == pytest.approx(rebraced.min(), rel=1e-6)


@st.composite
def spread_layouts(draw):
    """A wall on 3 to 5 braces at uneven positions, rigid or built in place."""
    base = draw(st.sampled_from([p for p in LIMIT_SITE if p["mark"] in ("T-5", "M-1", "F-1")]))
    count = draw(st.integers(3, 5))
    width = base["width"]
    cuts = sorted(draw(st.lists(st.floats(0.05, 0.95), min_size=count, max_size=count,
                                unique=True)))
    positions = [round(c * width, 2) for c in cuts]
    if len(set(positions)) < count:
        positions = [(i + 0.5) * width / count for i in range(count)]
    return {**base, "bracing": {**base["bracing"], "count": count, "positions": positions}}


@settings(max_examples=25, deadline=None)
@given(spread_layouts())
def test_one_missing_limit_is_the_least_of_every_wall_rebraced_without_one_brace(p):
    # design.md §6 robustness: the engine searches only the variant most utilized at the intact
    # limit and checks the others there; the answer must be the least over all of them
    variants = _without_each_brace(p)
    e = ev.evaluate_arrays(site_of([p] + variants))
    assert e.braced_limit_missing[0] == pytest.approx(e.braced_limit[1:].min(), rel=1e-6)


def test_forces_of_a_wall_built_in_place_ignore_an_empty_slot(limits):
    site, e = limits
    r = [site.panels[i].mark for i in e.braces.index].index("F-1")
    one = braced.take(e.braces, [r])
    n = int(one.mask.sum())
    holed = one.mask.copy()
    holed[0, 0] = False  # the first of the four braces missing
    packed = np.zeros_like(one.positions)  # the other three in the first three slots
    packed[0, :n - 1] = one.positions[0, 1:n]
    first = np.arange(one.mask.shape[1])[None, :] < n - 1
    # 0.75 x 115 mph (ASCE 37-14 Table 6.2-1, from memory), 16 psf (ASCE 7-16 §29.7, from memory)
    wind = ev.wind_on(e.walls, 86.25, asce7.KD_WALLS, 16.0)
    f = ev.COMBINATIONS["ASD"]
    _, with_hole = braced.braced_checks(e.walls, wind, replace(one, mask=holed), f, 16.0)
    _, without = braced.braced_checks(e.walls, wind, replace(one, positions=packed, mask=first),
                                      f, 16.0)
    # statics: each standing brace takes its own tributary strip, whichever slot holds it
    np.testing.assert_allclose(with_hole.horizontal[0, 1:n], without.horizontal[0, :n - 1],
                               rtol=1e-9)
    assert with_hole.total == pytest.approx(without.total, rel=1e-9)


# --- twist that no brace pattern can carry ---------------------------------------------------
def test_two_braces_at_one_point_are_refused():
    # design.md §6: braces at one point have no lever against the twist of Case B
    with pytest.raises(ValidationError, match="same position"):
        site_of([wall("P-1", insert_height=20.0, angle=55.0, count=2, positions=[12.0, 12.0])])


@pytest.mark.parametrize("bracing", [pytest.param({"count": 1}, id="a single brace")])
def test_braces_that_cannot_carry_twist_do_not_pass(bracing):
    rules = {"minimum_braces_per_panel": {"value": 2, "source": "common practice",
                                          "enabled": False}}
    site = site_of([wall("P-1", insert_height=20.0, angle=55.0, **bracing)], rules=rules)
    # design.md §6: no twist restraint is credited at the base; the braces carry all of it, so
    # Case B (ASCE 7-16 Fig. 29.3-1, 0.2 B off centre) cannot be held by braces at one point
    assert ev.evaluate(site).panels[0].status != "braced"


@pytest.mark.parametrize("running", [True, False])
def test_an_evaluation_leaves_the_cycle_collector_as_it_found_it(running):
    site = site_of(LIMIT_SITE[:2])
    was = gc.isenabled()
    try:
        (gc.enable if running else gc.disable)()
        ev.evaluate(site)
        assert gc.isenabled() is running
    finally:
        (gc.enable if was else gc.disable)()


def test_a_sized_deadman_is_checked_for_tipping_about_its_toe():
    site = site_of([wall("D-1", brace_type="adjustable", foot_anchor="sized block", count=2,
                         insert_height=20.0, angle=50.0)])
    p = ev.evaluate(site).panels[0]
    b = p.braces
    pull, uplift = b["anchor_shear_lb"], b["anchor_uplift_lb"]
    tipping = next(c for c in p.checks if c.element == "deadman overturning")
    # Statics about the toe: the pull at the pin's height, the uplift at its distance from the
    # toe; resisting 0.6 W (ASCE 7-16 §2.4.1, ASD) at mid-length: 0.6 x 20,000 x 4 = 48,000
    assert tipping.demand == pytest.approx(pull * 1.0 + uplift * 2.0, rel=1e-9)
    assert tipping.capacity == pytest.approx(48_000.0, rel=1e-12)
    assert tipping.combination == "0.6D + 0.6W" and tipping.passes
    assert "deadman-tipping-unchecked" not in {f.code for f in p.flags}
    # The soil under it (statics, linear pressure, no tension): N = D - uplift, M about the
    # middle = pull x 1.0 + uplift x (2.0 - 4.0); 8 ft long, 4 ft wide, e = M / N
    n = 20_000.0 - uplift
    e = abs(pull * 1.0 - uplift * 2.0) / n
    assert e < 8.0 / 2.0  # it does not tip
    peak = n / 32.0 * (1.0 + 6.0 * e / 8.0) if e <= 8.0 / 6.0 else 2.0 * n / (3.0 * 4.0 * (4.0 - e))
    bearing = next(c for c in p.checks if c.element == "deadman bearing")
    assert bearing.demand == pytest.approx(peak, rel=1e-9)
    assert bearing.capacity == 2000.0 and bearing.combination == "D + 0.6W"


def test_a_deadman_without_its_size_is_flagged_unchecked_for_tipping():
    site = site_of([wall("D-1", brace_type="adjustable", foot_anchor="block", count=2,
                         insert_height=20.0, angle=50.0)])
    p = ev.evaluate(site).panels[0]
    assert "deadman overturning" not in {c.element for c in p.checks}
    flag = next(f for f in p.flags if f.code == "deadman-tipping-unchecked")
    assert flag.severity == "warning" and "length and pin_height" in flag.message


@pytest.mark.parametrize("block, words", [
    ({"length": 6.0}, "both length and pin_height"),
    ({"length": 6.0, "pin_height": 2.0, "pin_from_toe": 7.0}, "within the block's length"),
    ({"length": 6.0, "pin_height": 2.0, "width": 4.0}, "width and allowable_bearing"),
    ({"width": 4.0, "allowable_bearing": 2000.0}, "with length and pin_height"),
])
def test_a_deadman_size_must_be_whole(block, words):
    anchors = {**ANCHOR_TYPES, "odd": {"kind": "deadman", "weight": 8000.0, **block}}
    with pytest.raises(ValidationError, match=words):
        Site.model_validate({"site": {"name": "x", "basic_wind_speed": 115.0},
                             "materials": MATERIALS, "brace_types": BRACE_TYPES,
                             "anchor_types": anchors, "panels": [wall("D-1")]})


def test_a_brace_fastened_to_an_upper_floor_deck_is_checked_by_its_ratings():
    site = site_of([wall("F-2", "framed", height=9.0, width=20.0, brace_type="stud",
                         foot_anchor="deck", count=3, insert_height=7.0, angle=45.0)])
    p = ev.evaluate(site).panels[0]
    foot = next(c for c in p.checks if c.element == "foot anchor")
    b = p.braces
    # common practice: linear interaction of the ratings, T/Ta + V/Va <= 1
    ratio = b["anchor_uplift_lb"] / 1500.0 + b["anchor_shear_lb"] / 2500.0
    assert foot.demand == pytest.approx(b["axial_force_lb"], rel=1e-12)
    assert foot.utilization == pytest.approx(ratio, rel=1e-9)
    assert "deck fastening" in foot.source
