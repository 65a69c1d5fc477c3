"""Walls built in place (masonry, framed) worked by hand under design.md §6: each brace carries
its own strip of wall under the worst of Case B as a linear pressure and Case C by region.

Sources and certainty (references.md):
- ASCE 7-16 Eq. 26.10-1 q = 0.00256 Kz Kzt Kd Ke V^2 (secondary);
  Kz = 2.01 (max(z, 15)/zg)^(2/alpha),
  Table 26.11-1 B: 7.0, 1200 ft; C: 9.5, 900 ft (text); Kd 0.85 (secondary); G 0.85 (secondary);
  Ke = exp(-0.0000362 z_g) (secondary).
- ASCE 7-16 Figure 29.3-1, Cases A/B (row s/h = 1) and C, note 4 (x (1.8 - s/h) for s/h > 0.8):
  secondary. Case B on strips as p(x) = p_avg (1 + 2.4 (x/B - 1/2)), p_avg = max(q G Cf_A,
  16 psf): design.md §6 (the team's reading of Case B, method notes §2).
- ASCE 7-16 §29.7 minimum 16 psf: from memory. ASCE 37-14 period factor: set directly.
- ASCE 7-16 §2.4.1 ASD: 0.6W; D + 0.6W for the braces (the lean adds), secondary.
- Lean: D e / hb, e = (lean / s + slop / hb) z_c, defaults 1/4 in and 1/8 in (common practice),
  shared equally by the braces of a wall built in place (design.md §6).
- ACI 318-19 Ch. 17 (text in a published design guide): N_b = 17 sqrt(f'c) h_ef^1.5, V_sa =
  0.6 A_se f_uta, phi (Condition B) 0.65 post-installed category 1 and steel in shear, 0.75
  steel in tension, interaction (N/phiNn + V/phiVn)/1.2 (§17.8.3); ASD phi Nn x 0.6
  (design.md §3). Pryout k_cp 2 for h_ef >= 2.5 in.
- NDS 2018 §3.7.1 column stability factor C_P, c = 0.8 (secondary); SPF No.1/No.2 F_c 1150 psi,
  E_min 510,000 psi, C_F 1.10 for a 2x6 (NDS Supplement Table 4A, secondary); C_D 1.6.

The demo walls are read with `bracing check --json`; every expected value below is worked from
the numbers in the site file, not from the engine. Agreement within 2 % (issue 10).
"""

import contextlib
import io
import json
import math
from pathlib import Path

import pytest

from bracing import cli

SCENARIOS = Path(__file__).resolve().parents[2] / "scenarios"
COS50, SIN50 = math.cos(math.radians(50.0)), math.sin(math.radians(50.0))


def run(args) -> dict:
    out = io.StringIO()
    with contextlib.redirect_stdout(out):
        cli.main(list(args) + ["--json"])
    return json.loads(out.getvalue())


def demo_wall(site: str, mark: str) -> dict:
    return next(p for p in run(["check", str(SCENARIOS / site)])["panels"] if p["mark"] == mark)


def test_masonry_wall_with_case_b_on_strips():
    """Masonry wall 12 ft tall, 40 ft long, on grade, exposure C, 115 mph x 0.8 = 92 mph,
    36 psf, four braces at the centres of 10 ft strips, inserts at 9 ft, 45 degrees.

    Kz(15 ft) = 2.01 (15/900)^(2/9.5) = 0.8489; q = 0.00256 x 0.8489 x 0.85 x 92^2 = 15.63 psf.
    B/s = 3.333: Cf_A = 1.40 - 0.05 x 1.333/2 = 1.3667; Case C between columns 3 and 4 (w 1/3),
    x 0.8: 0-s (2.60 + 0.30/3) 0.8 = 2.160, s-2s (1.70 + 0.20/3) 0.8 = 1.413.
    Case B: p_avg = q G Cf_A = 15.63 x 0.85 x 1.3667 = 18.16 psf (over 16). Strips [0, 10],
    [10, 20], ...: the end strips' factor 1 + 2.4 |0.125 - 0.5| = 1.9 -> 34.50 psf; the inner
    1.3 -> 23.60 psf. Case C: every strip touches a 0-s region (0-12 ft from one end or the
    other): q G 2.160 = 28.70 psf. End strips 34.50 (Case B), inner 28.70 (Case C).
    Forces on 120 ft^2: 4,140 and 3,444 lb; R = F x 0.55 x 12 / 9 = 3,036 and 2,526 lb.
    Lean: D = 36 x 12 x 40 = 17,280 lb, e = (0.25/144 + 0.125/108) x 6 = 0.01736 ft,
    D e / hb = 33.3 lb, 8.33 lb a brace. ASD: H = 0.6 R + 8.33 = 1,830 and 1,524 lb;
    P = H / cos 45 = 2,588 and 2,155 lb.
    """
    q = 0.00256 * 0.8489 * 0.85 * 92.0**2
    assert q == pytest.approx(15.63, abs=0.01)
    end = 0.6 * (q * 0.85 * 1.3667 * 1.9 * 120.0) * 6.6 / 9.0 + 8.333
    inner = 0.6 * (q * 0.85 * 2.160 * 120.0) * 6.6 / 9.0 + 8.333
    assert (end / math.cos(math.radians(45)), inner / math.cos(math.radians(45))) == (
        pytest.approx(2588.0, abs=2.0), pytest.approx(2155.0, abs=2.0))
    b = run(["panel", "--height", "12ft", "--width", "40ft", "--thickness", "7.625in",
             "--material", "masonry", "--face-weight", "36psf", "--wind", "115mph",
             "--exposure", "C", "--period-factor", "0.8", "--braces", "4",
             "--insert-height", "9ft", "--brace-angle", "45deg"])["braces"]
    p_end, p_inner = (h / math.cos(math.radians(45)) for h in (end, inner))
    assert b["brace_forces_lb"] == pytest.approx([p_end, p_inner, p_inner, p_end], rel=0.005)


def test_framed_wall_with_case_b_on_strips_and_the_minimum():
    """Framed wall 8 ft tall, 20 ft long, on grade, exposure B, 115 mph x 0.75 = 86.25 mph,
    6 psf, three braces at the centres of 6.667 ft strips, inserts at 6 ft, 45 degrees.

    Kz(15 ft) = 2.01 (15/1200)^(2/7) = 0.5747; q = 0.00256 x 0.5747 x 0.85 x 86.25^2 = 9.30 psf.
    B/s = 2.5: Cf_A = 1.40 - 0.05 x 0.25 = 1.3875; q G Cf_A = 10.97 psf < 16: p_avg = 16 psf.
    Case C at B/s 2.5 x 0.8: 0-s (2.25 + 2.60)/2 x 0.8 = 1.94: q G 1.94 = 15.34 psf < 16 ->
    16 psf. End strips: 16 x (1 + 2.4 |1/6 - 1/2|) = 16 x 1.8 = 28.8 psf; the middle strip
    max(16 x 1.0, 16) = 16 psf. On 53.33 ft^2: 1,536 and 853.3 lb; R = F x 4.4 / 6: 1,126.4
    and 625.8 lb. Lean: D = 960 lb, e = (0.25/96 + 0.125/72) x 4 = 0.01736 ft, D e / hb =
    2.78 lb, 0.926 lb a brace. ASD: H = 676.8 and 376.4 lb, P = 957.2 and 532.4 lb.
    """
    b = run(["panel", "--height", "8ft", "--width", "20ft", "--thickness", "4.5in",
             "--material", "framed", "--face-weight", "6psf", "--wind", "115mph",
             "--exposure", "B", "--period-factor", "0.75", "--braces", "3",
             "--insert-height", "6ft", "--brace-angle", "45deg"])["braces"]
    assert b["brace_forces_lb"] == pytest.approx([957.2, 532.4, 957.2], rel=0.002)


def test_bracing_panel_masonry_four_braces_share_unequally():
    """design.md §6: strips, not the rigid share: the end braces of the masonry wall above
    carry more than the inner ones (2,588 against 2,155 lb by hand)."""
    b = run(["panel", "--height", "12ft", "--width", "40ft", "--thickness", "7.625in",
             "--material", "masonry", "--wind", "115mph", "--braces", "4",
             "--insert-height", "9ft", "--brace-angle", "45deg"])["braces"]
    forces = b["brace_forces_lb"]
    assert forces[0] == forces[3] > forces[1] == forces[2]


def test_demo_masonry_wall_gd1_by_hand():
    """masonry-gym.toml GD-1: 8 in grouted CMU 80 psf, 14 ft tall, 26.98 ft long, on the line
    "Storage rooms, grid D" with GD-2 (both stood on day 7: B = 53.98 + 0.04 = 54 ft), exposure
    B, 115 mph x 0.75 (5 weeks) = 86.25 mph, ground 780 ft; 4 braces at 2, 9.66, 17.32,
    24.98 ft, inserts 10.5 ft, 50 degrees, wedge anchors in the slab.

    Kz(15 ft) B = 0.5747, Ke = exp(-0.0000362 x 780) = 0.9722; q = 0.00256 x 0.5747 x 0.85 x
    0.9722 x 86.25^2 = 9.044 psf.
    The wall alone: B/s = 1.927, Cf_A = 1.45 - 0.05 x 0.927 = 1.4036 (no Case C below 2).
    The line: B/s = 3.857, Case C x 0.8: 0-s (2.60 + 0.857 x 0.30) 0.8 = 2.2857 over 0-14 ft.
    Strips: [0, 5.83], [5.83, 13.49], [13.49, 21.15], [21.15, 26.98] (ft), all but the last
    touching the 0-s region from the line's start; the last its s-2s region either way.
    Design: p_avg = max(q G 1.4036 = 10.79, 16) = 16 psf; end strip factor 1 + 2.4 |2.915/26.98
    - 0.5| = 1.9407 -> 31.05 psf (Case C 2.2857 q G = 17.57 psf); F = 31.05 x 14 x 5.83 =
    2,534 lb; R = F x 0.55 x 14 / 10.5 = 1,858.6 lb. Lean: D = 80 x 14 x 26.98 = 30,218 lb,
    e = (0.25/168 + 0.125/126) x 7 = 0.017361 ft, D e / hb = 49.96 lb, 12.49 lb a brace.
    ASD: H = 0.6 x 1,858.6 + 12.49 = 1,127.6 lb; P = H / cos 50 = 1,754.3 lb; the anchor:
    uplift P sin 50 = 1,343.9 lb, pull P cos 50 = 1,127.6 lb.
    The wedge anchor (1/2 in, h_ef 3.25 in, f'c 3500 psi, A_se 0.142 in^2, f_uta 75 ksi,
    pullout 5,400 lb; its edges in the plan at 35.8 in or more, beyond 1.5 h_ef): N_b = 17 x
    sqrt(3500) x 3.25^1.5 = 5,893 lb, phi 0.65: 3,830; pullout 0.65 x 5,400 = 3,510; steel
    0.75 x 10,650 = 7,988: tension 3,510 x 0.6 = 2,106 lb (ASD). Shear: steel 0.65 x 0.6 x
    0.142 x 75,000 = 4,154 (pryout 0.70 x 2 x 5,893 = 8,250; breakout toward an edge 35.8 in
    away larger still): 4,154 x 0.6 = 2,492 lb. Interaction: (1,343.9/2,106 + 1,127.6/2,492)
    / 1.2 = (0.6381 + 0.4525)/1.2 = 0.9088: the governing utilization.
    Working limit (observed gust: Kd 1.0, no minimum, 1.0W): the inner strip's Case C now
    governs (2.2857 x 7.66 ft against Case B 1.4036 x 1.9407 x 5.83 ft): R per mph^2 =
    0.00256 x 0.5747 x 0.9722 x 0.85 x 2.2857 x 14 x 7.66 x 0.7333 = 0.2185 lb; the anchor
    reaches 1.0 at P = 1,754.3 / 0.9088 = 1,930.3 lb, H = 1,240.8 lb: V^2 = (1,240.8 - 12.49)
    / 0.2185 -> V = 74.97 mph.
    """
    p = demo_wall("masonry-gym.toml", "GD-1")
    b = p["braces"]
    assert b["axial_force_lb"] == pytest.approx(1754.3, rel=0.02)
    assert b["anchor_uplift_lb"] == pytest.approx(1343.9, rel=0.02)
    assert b["anchor_shear_lb"] == pytest.approx(1127.6, rel=0.02)
    assert p["governing_utilization"] == pytest.approx(0.9088, rel=0.02)
    assert p["governing_element"].startswith("foot anchor")
    assert p["working_limit_speed_mph"] == pytest.approx(74.97, rel=0.02)


def test_demo_framed_wall_f1_by_hand():
    """demo-mixed.toml F-1: framed wall 7 psf, 10 ft tall, 30 ft long, alone, on grade,
    exposure C, 115 mph x 0.75 (5 weeks) = 86.25 mph, ground 850 ft; 4 braces at the centres of
    7.5 ft strips (3.75, 11.25, ... ft), inserts 8 ft, 50 degrees, 2x6 SPF braces, helical feet.

    Kz(15 ft) C = 0.8489, Ke = exp(-0.0000362 x 850) = 0.9697; q = 0.00256 x 0.8489 x 0.85 x
    0.9697 x 86.25^2 = 13.32 psf. B/s = 3: Cf_A = 1.375; Case C x 0.8: 0-s 2.60 -> 2.08 over
    0-10 ft from either end, which every strip touches.
    Design: p_avg = max(q G 1.375 = 15.57, 16) = 16 psf; end strips 16 x (1 + 2.4 x 0.375) =
    30.4 psf (Case C q G 2.08 = 23.56 psf), F = 30.4 x 75 = 2,280 lb, R = F x 5.5 / 8 =
    1,567.5 lb. Lean: D = 2,100 lb, e = (0.25/120 + 0.125/96) x 5 = 0.016927 ft, D e / hb =
    4.443 lb, 1.111 lb a brace. ASD: H = 0.6 x 1,567.5 + 1.11 = 941.6 lb, P = 941.6 / cos 50
    = 1,464.9 lb; the anchor: uplift 1,122.2 lb, pull 941.6 lb.
    The brace: length sqrt(8^2 + (8 / tan 50)^2) = 10.443 ft; weak axis le/d = 125.3 / 1.5 =
    83.5; F_cE = 0.822 x 510,000 / 83.5^2 = 60.07 psi; F_c* = 1150 x 1.10 x 1.6 = 2,024 psi;
    a = 0.02968; C_P = 1.02968/1.6 - sqrt((1.02968/1.6)^2 - 0.02968/0.8) = 0.02950; P_allow =
    0.02950 x 2,024 x 8.25 = 492.6 lb: utilization 1,464.9 / 492.6 = 2.974.
    Interior strips (7.5-15 and 15-22.5 ft): Case B at their centers from the far end 16 x (1 +
    2.4 x 0.125) = 20.8 psf, under the Case C 0-s region they touch, 23.56 psf; F = 23.56 x 75
    = 1,767 lb, R = 1,214.8 lb, H = 0.6 x 1,214.8 + 1.11 = 730.0 lb, P = 1,135.7 lb.
    Sill uplift (design.md §6, method notes §4; the per-brace envelopes summed, conservative):
    sum P sin 50 = (2 x 1,464.9 + 2 x 1,135.7) x 0.76604 = 3,984.2 lb against 0.6D = 1,260 lb
    (no sill fastening given): utilization 3.162, which governs.
    Working limit (Kd 1.0, no minimum, 1.0W): R per mph^2 = 0.00256 x 0.8489 x 0.9697 x 0.85 x
    Cf x 75 x 0.6875 = 0.092360 Cf lb; end strips Case B 1.375 x 1.9 = 2.6125 (over Case C
    2.08): 0.24129; interior strips Case C 2.08 (over Case B 1.375 x 1.3): 0.19211; sum 0.86680.
    The sill governs: (0.86680 V^2 + 4 x 1.11) x tan 50 = 1,260 -> V^2 = 1,214.6, V = 34.85 mph
    (the brace alone would reach 492.6 lb at V = 36.16 mph).
    """
    le_d = math.hypot(8.0, 8.0 / math.tan(math.radians(50.0))) * 12.0 / 1.5
    fce, fc = 0.822 * 510000.0 / le_d**2, 1150.0 * 1.10 * 1.6
    a = fce / fc
    cp = (1 + a) / 1.6 - math.sqrt(((1 + a) / 1.6) ** 2 - a / 0.8)
    assert cp == pytest.approx(0.02950, abs=0.0001)
    allowable = cp * fc * 8.25
    assert allowable == pytest.approx(492.6, abs=0.5)
    p = demo_wall("demo-mixed.toml", "F-1")
    b = p["braces"]
    assert b["axial_force_lb"] == pytest.approx(1464.9, rel=0.02)
    assert b["anchor_uplift_lb"] == pytest.approx(1122.2, rel=0.02)
    assert b["anchor_shear_lb"] == pytest.approx(941.6, rel=0.02)
    assert b["brace_forces_lb"] == pytest.approx([1464.9, 1135.7, 1135.7, 1464.9], rel=0.02)
    assert b["utilization"] == pytest.approx(1464.9 / 492.6, rel=0.02)
    assert p["governing_element"].startswith("sill uplift")
    assert p["governing_utilization"] == pytest.approx(3984.2 / 1260.0, rel=0.02)
    assert p["working_limit_speed_mph"] == pytest.approx(34.85, rel=0.02)
