"""Physical properties of the brace formulas in `bracing.braces` (hypothesis).

Every property here is statics (design.md §6): the wall pivots at its base, the braces hold it at
the insert height, and in plan they carry all the twist (no twist restraint at the base).
"""

import numpy as np
import pytest
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from bracing import braces

FAST = settings(max_examples=50, deadline=None)

force_lb = st.floats(100.0, 200_000.0)
height_ft = st.floats(4.0, 60.0)
width_ft = st.floats(4.0, 60.0)
share = st.floats(0.05, 1.0)  # insert or resultant height as a share of the wall height
angle_deg = st.floats(15.0, 80.0)


@st.composite
def braced_wall(draw, least=2):
    """A wall's width, its brace positions (any count, anywhere on a 1/200 grid of the width)
    and a wind load."""
    b = draw(width_ft)
    n = draw(st.integers(least, 8))
    # distinct positions: braces at one point cannot carry twist (the model refuses them)
    x = draw(st.lists(st.integers(0, 200), min_size=n, max_size=n, unique=True))
    force = draw(force_lb)
    z = draw(share) * 30.0
    hb = draw(share) * 30.0
    at = draw(st.floats(0.0, 1.0)) * b  # the wind's resultant anywhere along the wall
    return b, np.array(x) / 200.0 * b, force, z, hb, at


def _shares(b, x, force, z, hb, at):
    """Horizontal reaction of each brace of one wall (one row, every slot a brace)."""
    total = braces.total_brace_reaction(force, z, hb)
    r = braces.brace_shares(np.array([total]), np.array([force]), np.array([at]),
                            np.array([b / 2.0]), x[None, :], np.ones((1, len(x)), dtype=bool))
    return total, r[0]


def _spread(x) -> bool:
    """At least two distinct brace positions: a polar moment that can carry twist."""
    return float(np.ptp(x)) > 0.0


def _rounding(*terms) -> float:
    """What floating-point sums of these terms may lose (a tolerance, not a physical margin)."""
    return 1e-12 * sum(float(np.abs(t).sum()) for t in terms)


# --- section: moments about the base pivot ---------------------------------------------------
@FAST
@given(braced_wall())
def test_brace_reactions_balance_the_wind_moment_about_the_base(wall):
    b, x, force, z, hb, at = wall
    _, r = _shares(b, x, force, z, hb, at)
    # statics, design.md §6: sum(R_h) hb = F z_F, whatever the count and positions
    assert r.sum() * hb == pytest.approx(force * z, rel=1e-9, abs=_rounding(r) * hb)


@FAST
@given(force_lb, height_ft, height_ft, height_ft)
def test_total_brace_reaction_falls_as_the_insert_rises(force, z, a, b):
    low, high = sorted((a, b))
    assume(high - low > 1e-6)
    # statics: R = F z_F / hb, smaller for a higher insert
    assert braces.total_brace_reaction(force, z, high) < braces.total_brace_reaction(force, z, low)


# --- plan: the braces carry all the twist -----------------------------------------------------
def test_brace_reactions_balance_the_twist():
    """Three braces at 2, 8 and 20 ft on a wall 24 ft long (its centre at 12 ft, the braces'
    centroid at x_c = 10 ft), F = 1,000 lb at 16.8 ft (Case B, 0.2 B off centre) and 16.5 ft
    up, inserts at 20 ft (design.md §6, statics), worked by hand:
    sum R = 1,000 x 16.5 / 20 = 825 lb; base shear F - sum R = 175 lb at the wall's centre;
    M_t = 1,000 (16.8 - 10) - 175 (12 - 10) = 6,450 lb-ft; sum (x - x_c)^2 = 64 + 4 + 100 =
    168 ft^2; R_i = 825/3 + 6,450 (x_i - 10)/168 = 275 + 38.393 (-8, -2, 10)
    = -32.14, 198.21, 658.93 lb."""
    r = braces.brace_shares(np.array([825.0]), np.array([1000.0]), np.array([16.8]),
                            np.array([12.0]), np.array([[2.0, 8.0, 20.0]]),
                            np.ones((1, 3), dtype=bool))
    assert r[0] == pytest.approx([-32.14, 198.21, 658.93], abs=0.01)


@FAST
@given(braced_wall(least=2))
def test_plan_moments_balance_about_the_wall_edge(wall):
    b, x, force, z, hb, at = wall
    assume(_spread(x))
    total, r = _shares(b, x, force, z, hb, at)
    # statics about the left edge: the wind at x_F is held by the braces at x_i and the base
    # shear F - sum(R) at the wall's centre
    held = (r * x).sum() + (force - total) * b / 2.0
    assert held == pytest.approx(force * at, rel=1e-9, abs=_rounding(r * x, force * b))


@FAST
@given(width_ft, st.integers(2, 8), force_lb, share, share)
def test_case_b_redistributes_the_case_a_total(b, n, force, z_share, hb_share):
    x = braces.default_positions(b, n)
    z, hb = z_share * 30.0, hb_share * 30.0
    total_a, case_a = _shares(b, x, force, z, hb, b / 2.0)
    # ASCE 7-16 Fig. 29.3-1 Case B: the same force 0.2 B off the centre, toward either edge
    for at in (0.7 * b, 0.3 * b):
        total_b, case_b = _shares(b, x, force, z, hb, at)
        assert total_b == total_a
        assert case_b.sum() == pytest.approx(case_a.sum(), rel=1e-9)  # same total, moved about
        assert case_b.max() >= case_a.max() - 1e-9 * total_a
    # Case A at the centre of symmetric braces: equal sharing (statics)
    assert case_a == pytest.approx(np.full(n, total_a / n), rel=1e-9)


def test_two_braces_case_b_by_hand():
    # 24 ft wall, braces at 6 and 18 ft (centres of two equal strips), F = 10,000 lb at 0.2 B =
    # 4.8 ft off the centre; R = F z / hb = 10,000 x 16.5 / 20 = 8,250 lb (statics).
    total, r = _shares(24.0, braces.default_positions(24.0, 2), 10_000.0, 16.5, 20.0, 16.8)
    # M_t = F x 4.8 = 48,000 lb-ft; polar sum((x - x_c)^2) = 2 x 6^2 = 72 ft^2;
    # R_i = 8,250 / 2 +- 48,000 x 6 / 72 = 4,125 +- 4,000 lb (design.md §6, statics)
    assert total == pytest.approx(8250.0, rel=1e-12)
    assert r == pytest.approx([125.0, 8125.0], rel=1e-12)


def test_brace_shares_vectorised_over_walls_with_ragged_counts():
    positions = np.array([[2.0, 10.0, 18.0], [5.0, 15.0, 0.0], [1.0, 4.0, 9.0]])
    mask = np.array([[True, True, True], [True, True, False], [True, True, True]])
    total = np.array([9000.0, 4000.0, 2500.0])
    force = np.array([12000.0, 7000.0, 3000.0])
    at = np.array([8.0, 13.0, 2.0])
    centre = np.array([10.0, 10.0, 5.0])
    together = braces.brace_shares(total, force, at, centre, positions, mask)
    for row in range(3):
        alone = braces.brace_shares(total[row:row + 1], force[row:row + 1], at[row:row + 1],
                                    centre[row:row + 1], positions[row:row + 1], mask[row:row + 1])
        np.testing.assert_allclose(together[row], alone[0], rtol=1e-12)
    assert np.isnan(together[1, 2])  # an empty slot carries nothing


# --- section geometry and components ---------------------------------------------------------
@FAST
@given(st.floats(3.0, 60.0), st.floats(1.0, 60.0))
def test_geometry_angle_and_length(hb, d):
    run, rise, theta, length = braces.brace_geometry(hb, d)
    assert (run, rise) == (d, hb)
    assert theta == pytest.approx(np.degrees(np.arctan(hb / d)), rel=1e-12)  # theta = atan(hb/d)
    assert length == pytest.approx(np.sqrt(hb**2 + d**2), rel=1e-12)  # Pythagoras


@FAST
@given(st.floats(6.0, 60.0), angle_deg, st.floats(0.0, 1.0), st.floats(0.0, 1.0),
       st.floats(0.0, 3.0))
def test_foot_distance_for_an_angle_gives_that_angle(hb, angle, pin_out, foot_up, below):
    distance = braces.anchor_distance_for_angle(hb, angle, pin_out, foot_up, below)
    _, _, theta, length = braces.brace_geometry(hb, distance, pin_out, foot_up, below)
    assert theta == pytest.approx(angle, rel=1e-9)  # pin to pin, hardware offsets included
    rise = hb - foot_up - below
    assert length == pytest.approx(rise / np.sin(np.radians(angle)), rel=1e-9)


@FAST
@given(st.floats(1.0, 100_000.0), angle_deg)
def test_axial_force_and_its_components(r_h, angle):
    p = braces.axial_force(r_h, angle)
    horizontal, vertical = braces.components(p, angle)
    assert p >= r_h  # a sloping brace carries more than its horizontal reaction
    assert horizontal == pytest.approx(r_h, rel=1e-12)  # P cos(theta) = R_h (statics)
    assert vertical == pytest.approx(r_h * np.tan(np.radians(angle)), rel=1e-12)
    assert np.hypot(horizontal, vertical) == pytest.approx(p, rel=1e-12)


@FAST
@given(st.floats(1000.0, 200_000.0), height_ft, share, st.floats(0.0, 2.0), st.floats(0.0, 1.0))
def test_lean_reaction_grows_with_lean_and_slop(weight, s, hb_share, lean_in, slop_in):
    hb, zc = hb_share * s, 0.5 * s
    r = braces.lean_reaction(weight, zc, s, hb, lean_in / 12.0, slop_in / 12.0)
    more = braces.lean_reaction(weight, zc, s, hb, (lean_in + 0.5) / 12.0, (slop_in + 0.25) / 12.0)
    assert 0.0 <= r < more
    assert braces.lean_reaction(weight, zc, s, hb, 0.0, 0.0) == 0.0  # plumb: nothing in still air
    # statics: R hb = D e with e = (lean / s + slop / hb) z_c
    assert r * hb == pytest.approx(weight * (lean_in / 12.0 / s + slop_in / 12.0 / hb) * zc,
                                   rel=1e-12)


# --- the wall spanning between its base and the braces ---------------------------------------
@FAST
@given(st.floats(5.0, 200.0), height_ft, st.floats(0.3, 1.0))
def test_propped_wall_moments_are_the_largest_of_the_moment_diagram(w, s, hb_share):
    hb = hb_share * s
    span, cantilever = braces.propped_wall_moments(w, s, hb)
    # statics of a beam pinned at 0, propped at hb, overhanging to s, uniform load w
    base = w * s - w * s**2 / (2.0 * hb)
    x = np.union1d(np.linspace(0.0, s, 20001), [hb])  # the prop itself on the grid
    moment = np.where(x <= hb, base * x - w * x**2 / 2.0, -w * (s - x) ** 2 / 2.0)
    sagging, hogging = max(moment.max(), 0.0), max(-moment.min(), 0.0)
    tol = 1e-6 * w * s**2
    assert span == pytest.approx(sagging, abs=tol)
    assert cantilever == pytest.approx(hogging, abs=tol)


def test_propped_at_the_top_is_a_simple_span():
    # prop at the top: w s^2 / 8 mid-span, no overhang (statics)
    span, cantilever = braces.propped_wall_moments(100.0, 20.0, 20.0)
    assert (span, cantilever) == (pytest.approx(100.0 * 20.0**2 / 8.0, rel=1e-12), 0.0)


def test_cracking_moment_by_hand():
    # ACI 318-19 Eq. 19.2.3.1 f_r = 7.5 sqrt(4000) = 474.3 psi (text); S = 12 x 7.25^2 / 6 =
    # 105.1 in^3 per ft; M_cr = 474.3 x 105.1 / 12 = 4,155 lb-ft per ft
    fr = braces.modulus_of_rupture(4000.0)
    assert fr == pytest.approx(474.34, abs=0.01)
    assert braces.cracking_moment(fr, 7.25) == pytest.approx(4155.4, abs=0.1)
