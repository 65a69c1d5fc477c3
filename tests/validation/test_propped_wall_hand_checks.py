"""A foundation wall propped by inside braces, with the wind on the part above the backfill
(method notes §12), worked by hand: beam formulas by equilibrium (statics) and the second
moment-area theorem for the fixed base (Mohr; text, any strength-of-materials book), the base
taken pinned and fixed and the envelope kept. Per foot of wall; b = 12 in.

The case: an 8 in plain concrete wall, f'c 3000 psi, 9 ft above its footing; SM backfill at
rest, EFP 60 psf/ft (IBC 2018 Table 1610.1, from memory), h_f = 6 ft, no surcharge, dry; inside
braces at h_b = 6 ft; the wind on the 3 ft above the fill p = 16 psf (the minimum design
pressure, ASCE 7-16 §29.7, from memory). Strength sections: 1.6H + 1.0W (ASCE 7-16 §2.3.1,
unconfirmed value).

Loads (factored): earth q(z) = 1.6 x 60 x (6 - z) = 96 (6 - z) psf, 576 psf at the base; wind
uniform 1.1 p = 17.6 psf on 6 to 9 ft (its moment about the fill's top 17.6 x 3^2 / 2 = 79.2
= 16 x 3 x 0.55 x 3, the resultant at 0.55 s of ASCE 7-16 Fig. 29.3-1), W = 52.8 lb at 7.5 ft,
toward the inside (+) or the outside (-). With u = 6 - z, the loads above a level of the
span: M_L(u) = 16 u^3 +/- 52.8 (1.5 + u), V_L(u) = 48 u^2 +/- 52.8; M > 0: backfill face in
tension.

Pinned base, R = M_L(0) / h_b (moments about the base):
  wind in:  R = (16 x 216 + 52.8 x 7.5) / 6 = (3456 + 396) / 6 = 642.0;
            M = 16 u^3 - 589.2 u + 79.2, least at u^2 = 589.2 / 48, u = 3.5036: -1297.0
  wind out: R = (3456 - 396) / 6 = 510.0;
            M = 16 u^3 - 562.8 u - 79.2, least at u^2 = 562.8 / 48, u = 3.4242: -1364.0
Fixed base, R = 3 / h_b^3 x integral_0^6 M_L u du (moment-area), integral 16 u^4 du = 24,883.2
and integral 52.8 (1.5 + u) u du = 52.8 x (27 + 72) = 5,227.2:
  wind in:  R = 3 x 30,110.4 / 216 = 418.2; base M = 3456 + 52.8 x 7.5 - 418.2 x 6 = +1342.8
  wind out: R = 3 x 19,656.0 / 216 = 273.0; base M = 3456 - 396 - 273 x 6 = +1422.0
  (earth alone: R = 3 x 24,883.2 / 216 = 345.6 = q0 L / 10 = 576 x 6 / 10, the beam formula
  of a propped cantilever under a load rising to its fixed end, and base M = 3456 - 2073.6 =
  1382.4 = q0 L^2 / 15 = 576 x 36 / 15 (AISC Manual beam diagrams, from memory).)
Span shear, largest at the base: 1728 +/- 52.8 - R: 1138.8, 1165.2 (pinned), 1362.6, 1402.2
(fixed); at the brace -R +/- 52.8, smaller.
Above the braces, a 3 ft cantilever: M = 17.6 x 3^2 / 2 = 79.2, V = 17.6 x 3 = 52.8, either
face.

Capacities (ACI 318-19 §14.5.2.1 and §14.5.5.1, phi 0.60, from memory): S = 12 x 8^2 / 6 =
128 in^3, phi Mn = 0.60 x 5 x sqrt(3000) x 128 / 12 = 0.60 x 5 x 54.772 x 10.667 = 1,752.7
lb-ft; phi Vn = 0.60 x 4/3 x 54.772 x 12 x 8 = 4,206.5 lb. Span flexure: backfill face 1422.0
/ 1752.7 = 0.811 governs the inside face's 1364.0 / 1752.7 = 0.778; shear 1402.2 / 4206.5 =
0.333.
"""

import json

import pytest

from bracing import backfill, propped_wall
from bracing.backfill import Soil, Wall
from bracing.cli import main

SM_AT_REST = Soil(efp=60.0, source="IBC 2018 Table 1610.1")  # SM at-rest 60 psf/ft (from memory)
WALL = Wall(height=9.0, thickness=8.0, material="plain", face_weight=100.0, fc=3000.0)
WIND = (16.0, 1.0, 0.6)  # p (psf); 1.0W beside 1.6H, 0.6W beside 1.0H (ASCE 7-16 §2.3.1/§2.4.1)


def test_the_envelope_of_the_propped_wall_by_hand():
    found = propped_wall.envelope(SM_AT_REST, 6.0, 9.0, 6.0, 1.6, 1.1 * 16.0)
    outside, inside, shear = found["span"]
    assert outside == pytest.approx(1422.0, rel=1e-3)   # fixed base, wind out
    assert inside == pytest.approx(1364.0, rel=1e-3)    # pinned base, wind out
    assert shear == pytest.approx(1402.2, rel=1e-3)
    assert found["above"] == pytest.approx((79.2, 79.2, 52.8), rel=1e-3)
    assert found["reaction"] == pytest.approx(642.0, rel=1e-3)  # pinned, wind in


def test_the_fixed_base_reaction_is_the_beam_formula():
    """Earth alone: R = q0 L / 10 = 345.6 and base M = q0 L^2 / 15 = 1382.4 (see above)."""
    found = propped_wall.envelope(SM_AT_REST, 6.0, 9.0, 6.0, 1.6)
    assert found["span"][0] == pytest.approx(1382.4, rel=1e-3)


def test_the_propped_wall_checks_by_hand():
    checks = {c.region: c for c in propped_wall.checks(WALL, SM_AT_REST, 6.0, 6.0, WIND)}
    span = checks["flexure between base and brace"]
    assert (span.demand, span.capacity) == pytest.approx((1422.0, 1752.7), rel=1e-3)
    assert span.utilization == pytest.approx(0.811, abs=1e-3)
    assert "backfill face in tension" in span.source and "ACI 318-19 §14.5.2.1" in span.source
    assert span.combination.startswith("1.6H") and span.combination.endswith("+ 1W")
    assert checks["shear between base and brace"].demand == pytest.approx(1402.2, rel=1e-3)
    assert checks["shear between base and brace"].capacity == pytest.approx(4206.5, rel=1e-4)
    assert checks["flexure above the brace"].demand == pytest.approx(79.2, rel=1e-3)
    assert checks["shear above the brace"].demand == pytest.approx(52.8, rel=1e-3)


def test_the_braced_checks_carry_them():
    brace = backfill.InsideBrace(height=6.0, spacing=6.0, angle=45.0, capacity=6000.0)
    regions = {c.region: c.demand for c in backfill.braced_checks(WALL, SM_AT_REST, 6.0, brace,
                                                                    WIND)}
    assert regions["flexure between base and brace"] == pytest.approx(1422.0, rel=1e-3)
    assert regions["flexure above the brace"] == pytest.approx(79.2, rel=1e-3)


def test_a_reinforced_wall_s_span_takes_the_inside_face_s_depth():
    """Bars near the backfill face (d = 5.6875 in from the inside face, tests above: 8 in wall,
    #5, 2 in cover) work at 8 - 5.6875 = 2.3125 in when the inside face is in tension (ACI
    318-19 §22.3, text). #5 at 16 in: As = 0.31 x 12 / 16 = 0.2325 in^2/ft; a = 0.2325 x
    60,000 / (0.85 x 3000 x 12) = 13,950 / 30,600 = 0.4559 in; c = a / 0.85 = 0.5363 in,
    eps_t = 0.003 x (2.3125 - 0.5363) / 0.5363 = 0.0099 > 0.0051: phi 0.90;
    phi Mn = 0.9 x 13,950 x (2.3125 - 0.2279) / 12 = 0.9 x 13,950 x 2.0846 / 12 = 2,181 lb-ft."""
    wall = Wall(height=9.0, thickness=8.0, material="reinforced", face_weight=100.0, fc=3000.0,
                steel=0.2325, depth=5.6875)
    outside, inside = propped_wall.faces(wall)
    assert inside.moment == pytest.approx(2181.0, rel=1e-3)
    assert outside.moment > 2 * inside.moment


def test_braces_low_on_a_full_fill_take_the_fixed_base_reaction():
    """Braces low on the wall carry more with the base fixed (text: moment-area, as above).
    A 9 ft wall filled to its top, SM at rest 60 psf/ft (from memory), braces at h_b = 3 ft,
    1.0H (ASCE 7-16 §2.4.1, unconfirmed value). Loads above z: M_L = 60 (9 - z)^3 / 6
    = 10 (9 - z)^3. Pinned: R = 10 x 729 / 3 = 2,430 lb/ft. Fixed, u = 3 - z, 9 - z = 6 + u:
    integral_0^3 10 (6 + u)^3 u du = 10 x (216 x 4.5 + 108 x 9 + 18 x 81 / 4 + 243 / 5)
    = 10 x (972 + 972 + 364.5 + 48.6) = 23,571; R = 3 x 23,571 / 27 = 2,619.0 lb/ft, the
    braces' (8 % over the pinned base's). Every 6 ft at 45 deg: P = 2,619.0 x 6 / cos 45
    = 22,222.8 lb."""
    reaction, words = propped_wall.brace_reaction(WALL, SM_AT_REST, 9.0, 3.0, 1.0)
    assert reaction == pytest.approx(2619.0, rel=1e-3) and words == ""
    brace = backfill.InsideBrace(height=3.0, spacing=6.0, angle=45.0, capacity=30000.0)
    axial = next(c for c in backfill.braced_checks(WALL, SM_AT_REST, 9.0, brace)
                 if c.element == "inside brace")
    assert axial.demand == pytest.approx(22222.8, rel=1e-3)


def test_the_one_wall_command_reports_the_force_it_checks(capsys):
    """`bracing backfill` on the same case (the 8 in wall of f'c 3000 psi, the 9 ft fill, SM
    at rest, braces at 3 ft every 6 ft at 45 deg): `reaction_plf` stays the pinned base's
    2,430 lb/ft (its documented meaning, earth only) and `force_lb` is the checked
    2,619.0 x 6 / cos 45 = 22,222.8 lb, not the pinned base's 2,430 x 6 / cos 45 = 20,618.8."""
    main(["backfill", "--height", "9ft", "--thickness", "8in", "--fc", "3000psi", "--soil",
          "SM", "--backfill-height", "9ft", "--brace-height", "3ft", "--brace-spacing", "6ft",
          "--brace-angle", "45deg", "--brace-capacity", "30000lb", "--drained", "--json"])
    brace = json.loads(capsys.readouterr().out)["inside_brace"]
    assert brace["reaction_plf"] == pytest.approx(2430.0, rel=1e-6)
    assert brace["force_lb"] == pytest.approx(22222.8, rel=1e-3)
