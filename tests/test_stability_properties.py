"""Physical properties of walls standing on their own (hypothesis), through the engine.

Each example is a small site of several walls evaluated at once (the engine is vectorised).
"""

import numpy as np
import pytest
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from bracing.evaluate import evaluate, gather, wind_on
from bracing.model import Site
from bracing.wind import KD_WALLS

FT_M = 0.3048  # international foot, exact by definition (NIST SP 811 App. B), from memory
LBF_N = 0.45359237 * 9.80665  # pound-force in newtons, exact by definition, from memory
MPH_MS = 1609.344 / 3600.0  # mile per hour in m/s, exact by definition, from memory
PCF_KN_M3 = LBF_N / FT_M**3 / 1e3
PSF_KPA = LBF_N / FT_M**2 / 1e3
MINIMUM_PSF = 16.0  # ASCE 7-16 §29.7, from memory

MATERIALS = {
    "concrete": {"kind": "concrete", "unit_weight": 150.0},  # ASCE 7 Table C3.1-2, from memory
    "hollow-cmu": {"kind": "masonry", "face_weight": 36.0,  # 8 in CMU: HUD RSDG Table 3.2,
                   "grouting": "hollow"},  # secondary
    "grouted-cmu": {"kind": "masonry", "face_weight": 80.0, "grouting": "solid"},  # secondary
    "sheathed-studs": {"kind": "framed", "face_weight": 6.0},  # HUD RSDG Table 3.2, secondary
    "open-studs": {"kind": "framed", "face_weight": 3.0, "sheathed": False},  # common practice
}
# The same materials in SI units (weights in kN/m^3 and kPa).
MATERIALS_SI = {
    f"{name}-si": {k: (f"{v * PCF_KN_M3!r} kN/m^3" if k == "unit_weight" else
                       f"{v * PSF_KPA!r} kPa" if k == "face_weight" else v)
                   for k, v in m.items()}
    for name, m in MATERIALS.items()
}

PROPERTY = settings(max_examples=50, deadline=None)
WHOLE_ENGINE = settings(max_examples=25, deadline=None)  # full evaluations, to keep the suite fast


@st.composite
def walls(draw) -> dict:
    """One solid wall (no openings): its material, size, base and footing, in US units."""
    wall = {
        "material": draw(st.sampled_from(sorted(MATERIALS))),
        "height": draw(st.floats(1.0, 60.0)),
        "width": draw(st.floats(1.0, 120.0)),
        "thickness": draw(st.floats(3.5, 12.0)),
        "base_elevation": draw(st.one_of(st.just(0.0), st.floats(0.5, 40.0))),
        "mortar_age": draw(st.sampled_from([0.0, 3.0, 60.0])),  # far from the 28-day cure rule
    }
    if draw(st.booleans()):
        wall["footing"] = {"width": draw(st.floats(1.0, 8.0)),
                           "thickness": draw(st.floats(0.5, 3.0))}
    return wall


wall_lists = st.lists(walls(), min_size=1, max_size=6)
speeds = st.floats(20.0, 200.0)


def site_of(ws: list[dict], *, wind=115.0, exposure="C") -> Site:
    return Site.model_validate({
        "site": {"name": "property", "basic_wind_speed": wind, "exposure": exposure},
        "materials": {**MATERIALS, **MATERIALS_SI},
        "panels": [{"mark": f"W-{i + 1}", **w} for i, w in enumerate(ws)],
    })


def design_wind(site: Site, minimum=MINIMUM_PSF):
    """The engine's design wind on every wall: V = f V_basic (ASCE 37-14), Kd 0.85."""
    w = gather(site)
    return wind_on(w, w.period_factor * site.site.basic_wind_speed, KD_WALLS, minimum)


def gross_area(ws: list[dict]) -> np.ndarray:
    return np.array([w["width"] * w["height"] for w in ws])


# --- Wind force ----------------------------------------------------------------------------------


@PROPERTY
# k v <= 300 mph, the speed range (method notes §9)
@given(wall_lists, speeds, st.floats(1.01, 1.5), st.sampled_from("BCD"))
def test_wind_force_grows_with_v_squared(ws, v, k, exposure):
    slow = design_wind(site_of(ws, wind=v, exposure=exposure))
    fast = design_wind(site_of(ws, wind=k * v, exposure=exposure))
    np.testing.assert_allclose(fast.q / slow.q, k**2, rtol=1e-12)  # Eq. 26.10-1
    free = slow.force_a > MINIMUM_PSF * gross_area(ws) * (1.0 + 1e-9)  # 16 psf does not govern
    np.testing.assert_allclose(fast.force_a[free] / slow.force_a[free], k**2, rtol=1e-9)
    free = slow.force > MINIMUM_PSF * gross_area(ws) * (1.0 + 1e-9)
    np.testing.assert_allclose(fast.force[free] / slow.force[free], k**2, rtol=1e-9)
    assert np.all(fast.force_a >= slow.force_a) and np.all(fast.force >= slow.force)


@PROPERTY
@given(wall_lists, st.lists(st.floats(0.01, 40.0), min_size=6, max_size=6), speeds,
       st.sampled_from("BCD"))
def test_wind_force_grows_with_height(ws, rises, v, exposure):
    # six rises for up to six walls: the first len(ws) of them
    taller = [{**w, "height": w["height"] + dh} for w, dh in zip(ws, rises, strict=False)]
    wind = design_wind(site_of(ws + taller, wind=v, exposure=exposure))
    n = len(ws)
    assert np.all(wind.force_a[n:] > wind.force_a[:n])  # Case A, the §8 force_lb
    assert np.all(wind.kz[n:] >= wind.kz[:n])


@PROPERTY
@given(wall_lists, speeds)
def test_wind_force_grows_from_exposure_b_to_c_to_d(ws, v):
    force = {}
    unfloored = {}
    for exposure in "BCD":
        site = site_of(ws, wind=v, exposure=exposure)
        force[exposure] = design_wind(site).force_a
        unfloored[exposure] = design_wind(site, minimum=None).force_a
    floor = MINIMUM_PSF * gross_area(ws)
    assert np.all(force["B"] <= force["C"]) and np.all(force["C"] <= force["D"])
    assert np.all(unfloored["B"] < unfloored["C"]) and np.all(unfloored["C"] < unfloored["D"])
    c_free, d_free = unfloored["C"] > floor, unfloored["D"] > floor
    assert np.all(force["C"][c_free] > force["B"][c_free])
    assert np.all(force["D"][d_free] > force["C"][d_free])


# --- Maximum unbraced height ----------------------------------------------------------------------


@WHOLE_ENGINE
@given(wall_lists, speeds, st.sampled_from("BCD"))
def test_utilization_is_one_at_the_maximum_unbraced_height(ws, v, exposure):
    result = evaluate(site_of(ws, wind=v, exposure=exposure))
    heights = [p.unbraced.max_height_structural_ft for p in result.panels]
    # Skip a root at a bracket end (stands at 300 ft, or fails at 0.01 ft) and a root where
    # Case C switches on at B/s = 2 (Figure 29.3-1: a step in Cf, so no height gives 1.0 there).
    inside = [i for i, h in enumerate(heights)
              if h is not None and h > 0.01 + 1e-9 and abs(ws[i]["width"] / h - 2.0) > 1e-6]
    assume(inside)
    at_root = [{**ws[i], "height": heights[i]} for i in inside]
    again = evaluate(site_of(at_root, wind=v, exposure=exposure))
    got = np.array([p.unbraced.utilization for p in again.panels])
    np.testing.assert_allclose(got, 1.0, atol=1e-6)


def test_a_short_fresh_masonry_wall_gets_the_highest_height_at_which_it_passes():
    """A 1.25 ft wall of fresh solid-grouted 12 in CMU, 3 ft long, on a 1 ft base (115 mph,
    exposure C). At very small heights its utilization falls as it grows (the 16 psf minimum,
    ASCE 7-16 §29.7 from memory, against the friction of a light wall: sliding governs), then
    rises (overturning). It passes at its own height, so its maximum unbraced height is at least
    1.25 ft; the search had returned 0.01 ft, a lower crossing. Stated as the property (method
    notes §3): the utilization at the returned height is <= 1.0 (within 1e-6 of it) and above
    1.0 a hair higher (0.01%)."""
    wall = {"material": "grouted-cmu", "height": 1.25, "width": 3.0, "thickness": 12.0,
            "base_elevation": 1.0, "mortar_age": 0.0}
    (own,) = evaluate(site_of([wall])).panels
    assert own.unbraced.utilization <= 1.0
    h = own.unbraced.max_height_structural_ft
    assert h >= 1.25
    at, above = evaluate(site_of([{**wall, "height": h},
                                  {**wall, "height": h * (1.0 + 1e-4)}])).panels
    assert 1.0 - 1e-6 <= at.unbraced.utilization <= 1.0
    assert above.unbraced.utilization > 1.0


# --- SI and US units -----------------------------------------------------------------------------


def in_si(wall: dict) -> dict:
    """The same wall with every quantity in SI units (exact conversions, 17 significant digits)."""
    si = {
        "material": f"{wall['material']}-si",
        "height": f"{wall['height'] * FT_M!r} m",
        "width": f"{wall['width'] * FT_M * 1000.0!r} mm",
        "thickness": f"{wall['thickness'] * 25.4!r} mm",
        "base_elevation": f"{wall['base_elevation'] * FT_M!r} m",
        "mortar_age": f"{wall['mortar_age'] * 24.0!r} hours",
    }
    if "footing" in wall:
        si["footing"] = {k: f"{x * FT_M!r} m" for k, x in wall["footing"].items()}
    return si


@WHOLE_ENGINE
@given(wall_lists, speeds, st.sampled_from("BCD"), st.booleans())
def test_the_same_wall_in_si_and_us_units_gives_the_same_results(ws, v, exposure, speed_in_si):
    wind = f"{v * MPH_MS!r} m/s" if speed_in_si else f"{v!r} mph"
    result = evaluate(site_of(ws + [in_si(w) for w in ws], wind=wind, exposure=exposure))
    n = len(ws)
    for i, wall in enumerate(ws):
        if abs(wall["width"] / wall["height"] - 2.0) < 1e-9:
            continue  # on the Case C step a rounding flips the branch (Figure 29.3-1)
        us, si = result.panels[i], result.panels[n + i]
        pairs = [
            (us.weight_lb, si.weight_lb),
            (us.unbraced.utilization, si.unbraced.utilization),
            (us.wind.force_lb, si.wind.force_lb),
            (us.wind.velocity_pressure_psf, si.wind.velocity_pressure_psf),
            (us.working_limit_speed_mph, si.working_limit_speed_mph),
            (us.stand_down_speed_mph, si.stand_down_speed_mph),
            (us.unbraced.max_height_ft, si.unbraced.max_height_ft),
        ]
        for a, b in pairs:
            if a is None or np.isnan(a):  # no root in the bracket: none in either
                assert b is None or np.isnan(b)
            else:
                assert b == pytest.approx(a, rel=1e-9, abs=1e-12)
        assert us.status == si.status


# --- Stand-down speeds ----------------------------------------------------------------------------


@WHOLE_ENGINE
@given(wall_lists, speeds, st.sampled_from("BCD"))
def test_stand_down_never_above_the_working_limit_and_masonry_capped(ws, v, exposure):
    result = evaluate(site_of(ws, wind=v, exposure=exposure))
    for wall, p in zip(ws, result.panels, strict=True):
        limit, stand_down = p.working_limit_speed_mph, p.stand_down_speed_mph
        if np.isnan(limit):
            continue  # beyond the speed bracket: see the test below
        assert stand_down <= 0.8 * limit * (1.0 + 1e-12)
        if wall["material"].endswith("cmu"):  # masonry industry practice, secondary
            assert stand_down <= (20.0 if wall["mortar_age"] < 28.0 else 35.0)
        else:
            assert stand_down == pytest.approx(0.8 * limit, rel=1e-12)  # team's default ratio


def test_masonry_stand_down_is_capped_even_when_the_working_limit_is_off_the_scale():
    # A 1 ft cured, grouted wall in exposure B stands past the 400 mph bracket.
    wall = {"material": "grouted-cmu", "height": 1.0, "width": 1.0, "thickness": 4.0,
            "base_elevation": 0.0, "mortar_age": 60.0}
    p = evaluate(site_of([wall], exposure="B")).panels[0]
    assert p.stand_down_speed_mph == 35.0  # intermediate period, industry practice, secondary
