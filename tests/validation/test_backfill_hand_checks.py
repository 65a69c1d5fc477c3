"""Backfill against a wall before the floor (method notes §12), worked by hand from the named
sources. Per foot of wall; b = 12 in."""

import json

import pytest

from bracing import backfill
from bracing.backfill import Soil, Wall
from bracing.cli import main


def _plain_wall(**kw):
    """8 ft plain concrete wall, 8 in thick, f'c 2500 psi, 150 pcf x 8/12 ft = 100 psf."""
    return Wall(**{"height": 8.0, "thickness": 8.0, "material": "plain", "face_weight": 100.0,
                   "fc": 2500.0, **kw})


SM_AT_REST = Soil(efp=60.0, source="IBC 2018 Table 1610.1")  # SM at-rest 60 psf/ft (from memory)


def test_plain_concrete_base_moment_capacity():
    """ACI 318-19 §14.5.2.1 (from memory): Mn = 5 lambda sqrt(f'c) S, phi 0.60 (§21.2.1).
    8 in wall, f'c 2500 psi: S = 12 x 8^2 / 6 = 128 in^3; Mn = 5 x 1.0 x 50 x 128
    = 32,000 lb-in = 2,666.7 lb-ft; phi Mn = 0.60 x 2,666.7 = 1,600 lb-ft per ft."""
    assert backfill.plain_concrete_moment(2500.0, 8.0) == pytest.approx(1600.0, rel=1e-6)


def test_reinforced_concrete_stress_block():
    """ACI 318-19 §22.2.2.4.1 and §22.3 (text: Whitney block 0.85 f'c), phi 0.90 Table 21.2.2.
    Worked example: 8 in wall, #5 at 12 in (A_bar 0.31 in^2, ASTM A615, text), 2 in cover to
    the bar from the backfill face, f'c 3000 psi, fy 60,000 psi.
    d = 8 - 2 - 0.625/2 = 5.6875 in; As = 0.31 in^2/ft;
    a = 0.31 x 60,000 / (0.85 x 3000 x 12) = 18,600 / 30,600 = 0.6078 in;
    Mn = 18,600 x (5.6875 - 0.3039) = 18,600 x 5.3836 = 100,135 lb-in;
    phi Mn = 0.9 x 100,135 = 90,121 lb-in = 7,510 lb-ft per ft.
    Shear, ACI 318-19 §22.5.5.1: phi Vc = 0.75 x 2 x sqrt(3000) x 12 x 5.6875
    = 0.75 x 2 x 54.772 x 68.25 = 5,607 lb per ft."""
    d = 8.0 - 2.0 - 0.625 / 2.0
    assert backfill.reinforced_concrete_moment(0.31, 60000.0, d, 3000.0) == pytest.approx(
        7510.1, rel=1e-3)
    assert backfill.concrete_shear(3000.0, d) == pytest.approx(5607.3, rel=1e-3)


def test_heavily_reinforced_concrete_takes_a_lower_phi():
    """ACI 318-19 Table 21.2.2 (phi by net tensile strain) and Table 22.2.2.4.3 (beta_1 0.85 at
    f'c <= 4000 psi), text. The wall above with As = 1.2 in^2/ft:
    a = 1.2 x 60,000 / 30,600 = 2.3529 in; c = 2.3529 / 0.85 = 2.7682 in;
    eps_t = 0.003 x (5.6875 - 2.7682) / 2.7682 = 0.0031638; eps_ty = 60,000 / 29,000,000
    = 0.0020690; the transition ends at eps_ty + 0.003 (ACI 318-19, text);
    phi = 0.65 + 0.25 x (0.0031638 - 0.0020690) / 0.003 = 0.7412.
    Mn = 72,000 x (5.6875 - 1.1765) = 324,794 lb-in; phi Mn = 0.7412 x 324,794 = 240,750 lb-in
    = 20,062 lb-ft per ft."""
    d = 8.0 - 2.0 - 0.625 / 2.0
    assert backfill.reinforced_concrete_moment(1.2, 60000.0, d, 3000.0) == pytest.approx(
        20062.5, rel=1e-3)


def test_a_textbook_beam_by_the_rectangular_stress_block():
    """A textbook's singly reinforced rectangular section, after Nilson, Darwin and Dolan,
    Design of Concrete Structures, the chapter on flexure (from memory: its inputs b 12 in,
    d 17.5 in, four No. 9 bars As 4.00 in^2, f'c 4,000 psi, fy 60,000 psi, and its Mn of
    about 291 ft-kips are unconfirmed). By ACI 318-19 §22.2 (text):
    a = 4.00 x 60,000 / (0.85 x 4,000 x 12) = 240,000 / 40,800 = 5.882 in;
    Mn = 240,000 x (17.5 - 2.941) = 3,494,118 lb-in = 291,176 lb-ft (291 ft-kips);
    c = 5.882 / 0.85 = 6.920 in; eps_t = 0.003 x (17.5 - 6.920) / 6.920 = 0.004586, below
    eps_ty + 0.003 = 0.005069: phi = 0.65 + 0.25 x (0.004586 - 0.002069) / 0.003 = 0.8598
    (Table 21.2.2); phi Mn = 0.8598 x 291,176 = 250,346 lb-ft. The section is 12 in wide, so
    the per-foot value is the beam's."""
    assert backfill.stress_block_moment(4.0, 60000.0, 17.5, 4000.0, 0.85) == pytest.approx(
        291176.0, rel=1e-4)
    assert backfill.reinforced_concrete_moment(4.0, 60000.0, 17.5, 4000.0) == pytest.approx(
        250346.0, rel=1e-4)


def test_reinforced_masonry_stress_block():
    """TMS 402-16 §9.3.2 (from memory): a = As fy / (0.80 f'm b), phi 0.90.
    8 in CMU (7.625 in), #5 at 24 in centred: As = 0.31 x 12/24 = 0.155 in^2/ft,
    d = 7.625 / 2 = 3.8125 in, f'm 2000 psi, fy 60,000 psi.
    a = 0.155 x 60,000 / (0.80 x 2000 x 12) = 9,300 / 19,200 = 0.4844 in;
    Mn = 9,300 x (3.8125 - 0.2422) = 9,300 x 3.5703 = 33,204 lb-in;
    phi Mn = 0.9 x 33,204 = 29,883 lb-in = 2,490 lb-ft per ft."""
    steel = backfill.steel_per_foot(0.31, 24.0)
    assert backfill.reinforced_masonry_moment(steel, 60000.0, 3.8125, 2000.0) == pytest.approx(
        2490.3, rel=1e-3)


def test_unreinforced_masonry_allowable_moment():
    """TMS 402-16 §8.2.4, Table 8.2.4.2 (from memory): fully grouted, mortar M or S, 86 psi
    normal to bed joints; f_t = M/S - P/A.
    9 ft wall, 8 in CMU grouted (7.625 in), face weight 36 psf (HUD RSDG Table 3.2, secondary,
    the lightest CMU: conservative): P = 36 x 9 = 324 lb/ft.
    S = 12 x 7.625^2 / 6 = 116.28 in^3; A = 12 x 7.625 = 91.5 in^2.
    M = (86 x 116.28 + 324 x 116.28 / 91.5) / 12 = (10,000.2 + 411.7) / 12 = 867.7 lb-ft/ft."""
    wall = Wall(height=9.0, thickness=7.625, material="masonry", face_weight=36.0,
                tension=86.0, grouting="grouted")
    flexure = backfill.cantilever_checks(wall, SM_AT_REST, 4.0)[0]
    assert flexure.capacity == pytest.approx(867.7, rel=1e-3)
    # IBC 2018 Table 1610.1 (from memory), at-rest 60 psf/ft, 4 ft: M = 60 x 64 / 6 = 640 lb-ft
    # at ASD, 1.0H (ASCE 7-16 §2.4.1, from memory)
    assert flexure.demand == pytest.approx(640.0)


def test_fresh_masonry_takes_no_backfill():
    """method notes §12 (TMS 402-16 credits flexural tension of cured masonry only): a wall
    whose mortar is not cured has no backfill height at all."""
    wall = Wall(height=9.0, thickness=7.625, material="masonry", face_weight=36.0,
                tension=86.0, grouting="grouted", cured=False)
    assert backfill.max_height(wall, SM_AT_REST) == pytest.approx(0.0, abs=1e-6)


def test_pressure_resultants_with_surcharge_and_water():
    """method notes §12: p = K q_s + EFP z + gamma_w (1 - K) below the water.
    EFP 60 psf/ft, gamma 120 pcf (common practice): K = 0.5; q_s 250 psf; 6 ft of backfill,
    water 3 ft above the base (62.4 pcf, so 62.4 x 0.5 = 31.2 psf/ft more below it).
    V = 0.5 x 250 x 6 + 60 x 36 / 2 + 31.2 x 9 / 2 = 750 + 1,080 + 140.4 = 1,970.4 lb/ft;
    M = 125 x 36 / 2 + 60 x 216 / 6 + 31.2 x 27 / 6 = 2,250 + 2,160 + 140.4 = 4,550.4 lb-ft/ft."""
    shear, moment = Soil(60.0, "", surcharge=250.0, water=3.0).at(6.0)
    assert shear == pytest.approx(1970.4)
    assert moment == pytest.approx(4550.4)


def test_overturning_and_sliding_of_wall_and_footing():
    """Statics about the toe, ASCE 7-16 §2.4.1 0.6D + 1.0H (from memory); IBC Table 1806.2
    friction 0.25 on silty sand (text, allowable). Wall 100 psf x 8 ft = 800 lb/ft centred on a
    2 ft x 1 ft footing (150 x 2 x 1 = 300 lb/ft); lever of the wall 1.0 ft, of the footing 1.0 ft.
    4 ft of SM at rest (60 psf/ft): V = 60 x 16 / 2 = 480, M = 60 x 64 / 6 = 640.
    Overturning: 640 + 480 x 1 = 1,120 against 0.6 x (800 + 300) x 1.0 = 660 lb-ft/ft.
    Sliding: 480 against 0.25 x 0.6 x 1,100 = 165 lb/ft."""
    wall = _plain_wall(footing_width=2.0, footing_thickness=1.0)
    _, _, tipping, sliding = backfill.cantilever_checks(wall, SM_AT_REST, 4.0, "ASD")
    assert (tipping.demand, tipping.capacity) == pytest.approx((1120.0, 660.0))
    assert (sliding.demand, sliding.capacity) == pytest.approx((480.0, 165.0))


def test_maximum_backfill_height_by_hand():
    """The 8 in plain wall of test_plain_concrete_base_moment_capacity, no footing given,
    SM at rest 60 psf/ft (IBC 2018 Table 1610.1, from memory), 1.6H (ASCE 7-16 §2.3.1, from
    memory): 1.6 x 60 H^3 / 6 = 16 H^3 = phi Mn = 1,600 -> H^3 = 100 -> H = 4.642 ft.
    (Shear there: 1.6 x 60 x 4.642^2 / 2 = 1,034 < phi Vn = 0.6 x 4/3 x 50 x 96 = 3,840.)
    Within 2 %."""
    assert backfill.max_height(_plain_wall(), SM_AT_REST) == pytest.approx(4.642, rel=0.02)


def test_irc_plain_masonry_wall():
    """IRC R404.1, Table R404.1.1(1) (secondary; confirm the table): a 9 ft wall of 8 in solid
    or fully grouted unreinforced masonry takes 4 ft of unbalanced backfill. Without top
    support the engine must not allow far more (here: not over 5 ft) in any suitable soil,
    at rest (the default)."""
    for soil in ("GW", "SM", "CL"):
        for mortar_tension in (86.0, 84.0):  # grouted, M/S and N, TMS 402-16 Table 8.2.4.2
            wall = Wall(height=9.0, thickness=7.625, material="masonry", face_weight=36.0,
                        tension=mortar_tension, grouting="grouted")
            efp = backfill.equivalent_fluid_pressure(soil)
            assert backfill.max_height(wall, Soil(efp, "")) <= 5.0


def test_inside_brace_force_by_hand(capsys):
    """Statics, the wall pinned at its base (method notes §12): 7 ft of SM at rest
    (60 psf/ft): M_base = 60 x 343 / 6 = 3,430 lb-ft/ft; brace at 6 ft: R = 3,430 / 6
    = 571.7 lb/ft; braces every 6 ft at 45 degrees: P = 571.7 x 6 / cos 45 = 3,430 / 0.70711
    = 4,850.8 lb; against a 6,000 lb rating: 0.81."""
    code = main(["backfill", "--height", "8ft", "--thickness", "8in", "--fc", "3000psi",
                 "--soil", "SM", "--backfill-height", "7ft", "--brace-height", "6ft",
                 "--brace-spacing", "6ft", "--brace-angle", "45deg", "--brace-capacity",
                 "6000lb", "--drained", "--json"])
    record = json.loads(capsys.readouterr().out)
    brace = record["inside_brace"]
    assert brace["reaction_plf"] == pytest.approx(571.67, rel=1e-4)
    assert brace["force_lb"] == pytest.approx(4850.8, rel=1e-4)
    axial = next(c for c in brace["checks"] if c["element"] == "inside brace")
    assert axial["utilization"] == pytest.approx(4850.8 / 6000.0, rel=1e-4)
    assert code == (0 if record["passes"] else 1)


def test_inside_braces_that_lift_the_wall():
    """Statics and ASCE 7-16 §2.4.1 0.6D (from memory): braces in compression push the wall up
    by R tan(theta). The 8 in plain wall (100 psf x 8 ft = 800 lb/ft), 7 ft of SM at rest,
    braces at 6 ft: R = 571.7 lb/ft. At 45 degrees: 571.7 x 1.0 = 571.7 lb/ft against
    0.6 x 800 = 480 lb/ft (fails, 1.19); at 30 degrees: 571.7 x 0.57735 = 330.1 lb/ft (0.69)."""
    def lift(angle):
        brace = backfill.InsideBrace(height=6.0, spacing=6.0, angle=angle, capacity=1e9)
        checks = backfill.braced_checks(_plain_wall(), SM_AT_REST, 7.0, brace)
        return next(c for c in checks if c.region == "lifted by the braces")
    steep, flat = lift(45.0), lift(30.0)
    assert (steep.demand, steep.capacity) == pytest.approx((571.67, 480.0), rel=1e-4)
    assert not steep.passes
    assert flat.demand == pytest.approx(330.06, rel=1e-4) and flat.passes
