"""The wind on walls built in place and on wall lines (design.md §4, §5, §6), worked by hand.

Each test below guards one effect that a deliberate breakage once removed without a failing
test (tests/mutations.md, "Loads"): the wall-line loads, the Case C line loads on braced walls,
the return walls, the lone-wall Case C of a wall on a line, walls released from their braces
that still stand in the line, the 16 psf minimum on the solid area of open walls and the
height-dependent coefficients of the maximum unbraced height.

Coefficients: ASCE 7-16 Figure 29.3-1 (text via a national code copying ASCE 7-05, three cells
confirmed for 7-16: secondary), Case C times 1.8 - s/h = 0.8 for walls on grade (note 4).
Velocity pressure: Eq. 26.10-1 (secondary), Kz exposure C at 15 ft and below
2.01 (15/900)^(2/9.5) = 0.8489 (Table 26.11-1, text), Kd 0.85 (Table 26.6-1, secondary), G 0.85
(secondary). Ke = 1 at sea level. The 16 psf minimum: ASCE 7-16 §29.7, from memory.
"""

import numpy as np
import pytest
from wall_materials import MATERIALS, THICKNESS_IN

from bracing import braced, lines
from bracing import evaluate as ev
from bracing.model import Site
from bracing.wind import asce7

KZ_15 = 0.8489  # exposure C, z <= 15 ft (Table 26.10-1: 0.85)
V = 92.0  # 115 mph x period factor 0.8 (ASCE 37-14 Table 6.2-1, secondary)
Q = 0.00256 * KZ_15 * 0.85 * V**2  # = 15.63 psf, ASCE 7-16 Eq. 26.10-1
G = 0.85
BRACE = {"brace_type": "big", "insert_height": 9.0, "angle": 45.0, "lean": 0.0, "slop": 0.0}


def site_of(panels, lines_=(), signoffs=(), wind=115.0, materials=None) -> Site:
    return Site.model_validate({
        "site": {"name": "wall lines", "basic_wind_speed": wind, "period_factor": 0.8},
        "materials": materials or MATERIALS,
        "brace_types": {"big": {"kind": "rated", "lengths": [1.0, 100.0],
                                "loads": [60000.0, 60000.0], "tension_capacity": 60000.0}},
        "anchor_types": {}, "panels": list(panels),
        "lines": [{"braced_side": "left", **ln} for ln in lines_],
        "signoffs": list(signoffs)})


def masonry(mark, width, height=12.0, **extra):
    return {"mark": mark, "material": "masonry", "height": height, "width": width,
            "thickness": THICKNESS_IN["masonry"], "mortar_age": 1.0, **extra}


def strip_reactions(site: Site) -> np.ndarray:
    """Each brace's horizontal reaction to the design wind (unfactored, lb) of every braced
    wall, by the path `evaluate` takes."""
    w = ev.gather(site)
    wind = ev.wind_on(w, V, asce7.KD_WALLS, 16.0)
    bs = braced.gather_braces(site, "ASD")
    return braced.brace_loads(w, wind, bs, 16.0).most


def line_of_four(**bracing):
    """Four masonry walls 24 ft long and 12 ft tall edge to edge on one line (B = 96 ft,
    B/s = 8), all stood on day 1, braces at 6 and 18 ft."""
    walls = [masonry(f"W{k}", 24.0, line="L", offset=24.0 * k, lift_day=1,
                     bracing={**BRACE, "count": 2, "positions": [6.0, 18.0], **bracing})
             for k in range(4)]
    return site_of(walls, [{"name": "L", "start": [0.0, 0.0], "end": [96.0, 0.0]}])


def test_the_wall_line_loads_each_strip_by_hand():
    """Strips of walls built in place on a line (design.md §6), hand values.

    Line B/s = 96/12 = 8, Case C x 0.8: 0-s 3.55 -> 2.84; s-2s 2.30 -> 1.84; 2s-3s 1.70 -> 1.36;
    3s-10s 1.05 -> 0.84. The wall alone: B/s = 2, Case A Cf 1.40; Case B as a linear
    pressure on strips [0, 12] and [12, 24]: factor 1 + 2.4 |0.25 - 0.5| = 1.6, i.e. 2.24;
    its own Case C 0-s 2.25 x 0.8 = 1.80, s-2s 1.50 x 0.8 = 1.20.
    First wall: strip 1 in the line's 0-s region: max(2.84, 2.24, 1.80) = 2.84; strip 2 in its
    s-2s region (x = 12 ft belongs to it): max(1.84, 2.24) = 2.24.
    Second wall (24 to 48 ft): 2s-3s 1.36 and 3s-4s 0.84 from the near end, 0.84 from the far
    end: Case B 2.24 governs both strips.
    R = q G Cf s w z / hb with q = 15.63 psf, s = 12, w = 12, z = 0.55 x 12 = 6.6, hb = 9:
    q G s w z / hb = 15.63 x 0.85 x 144 x 0.7333 = 1,403 lb per unit Cf.
    """
    unit = Q * G * 12.0 * 12.0 * 6.6 / 9.0
    assert unit == pytest.approx(1403.0, abs=1.0)
    r = strip_reactions(line_of_four())
    assert r[0] == pytest.approx([2.84 * unit, 2.24 * unit], rel=1e-3)
    assert r[1] == pytest.approx([2.24 * unit, 2.24 * unit], rel=1e-3)
    # the far end mirrors the near one
    assert r[3] == pytest.approx([2.24 * unit, 2.84 * unit], rel=1e-3)


def test_a_wall_on_a_line_keeps_its_own_case_c():
    """A wall on a short line keeps its lone-wall Case C (design.md §4, issue item 1).

    Two masonry walls 30 ft long, 12 ft tall, 4 braces each (strips of 7.5 ft, centres 3.75,
    11.25, ...), line B/s = 60/12 = 5, the wall alone B/s = 2.5. The second wall's second
    strip [7.5, 15] lies at 37.5 to 45 ft on the line: from the line's start in its 3s-4s
    region (1.05 x 0.8 = 0.84), from its end at 15 to 22.5 ft, the s-2s region (2.00 x 0.8 =
    1.60). Alone, Case C at B/s 2.5 (halfway between columns 2 and 3), x 0.8: 0-s
    (2.25 + 2.60)/2 = 2.425 -> 1.94, and its 0-s region (0-12 ft) covers [7.5, 12].
    Case B alone: Cf_A at B/s 2.5 = 1.40 - 0.25 x 0.05 = 1.3875, factor 1 + 2.4 |0.375 - 0.5|
    = 1.3: 1.80. So the strip takes 1.94: the lone Case C.
    """
    walls = [masonry(f"W{k}", 30.0, line="L", offset=30.0 * k, lift_day=1,
                     bracing={**BRACE, "count": 4}) for k in range(2)]
    r = strip_reactions(site_of(walls, [{"name": "L", "start": [0, 0], "end": [60, 0]}]))
    unit = Q * G * 12.0 * 7.5 * 6.6 / 9.0
    assert r[1][1] == pytest.approx(1.94 * unit, rel=1e-3)


def test_zeroed_line_case_c_on_a_rigid_panel_is_caught():
    """A rigid panel at the end of a long line: its Case C load case is the line's (§4).

    Six concrete panels 20 ft wide, 30 ft tall: line B = 120 ft, B/s = 4, Case C 0-s
    2.90 x 0.8 = 2.32 over the first panel's whole width (0-30 ft), acting at its middle,
    10 ft. The panel alone (B/s 0.667) takes no Case C. Force q G Cf As with q at 30 ft:
    Kz = 2.01 (30/900)^(2/9.5) = 0.9823, q = 0.00256 x 0.9823 x 0.85 x 92^2 = 18.09 psf;
    F = 18.09 x 0.85 x 2.32 x 600 = 21,404 lb.
    """
    panels = [{"mark": f"P{k}", "material": "concrete", "height": 30.0, "width": 20.0,
               "thickness": 7.25, "line": "L", "offset": 20.0 * k, "lift_day": 1,
               "bracing": {**BRACE, "insert_height": 20.0, "count": 2}} for k in range(6)]
    site = site_of(panels, [{"name": "L", "start": [0, 0], "end": [120, 0]}])
    w = ev.gather(site)
    wind = ev.wind_on(w, V, asce7.KD_WALLS, 16.0)
    forces, at = braced._case_loads(w, wind, np.array([0]), 16.0)
    q30 = 0.00256 * 2.01 * (30 / 900) ** (2 / 9.5) * 0.85 * V**2
    assert q30 == pytest.approx(18.09, abs=0.01)
    expected = q30 * G * 2.32 * 600.0
    assert expected == pytest.approx(21404.0, abs=10.0)
    assert forces.max() == pytest.approx(expected, rel=1e-3)
    assert at[np.argmax(forces[:, 0]), 0] == pytest.approx(10.0)


def test_return_walls_cut_only_the_end_region():
    """A lone masonry wall 120 ft long, 12 ft tall (B/s = 10), a return wall 24 ft long at
    each end (Lr/s = 2): the 0-s cell 3.75 x 0.60 = 2.25, x 0.8 = 1.80; the s-2s cell is not
    reduced, 2.45 x 0.8 = 1.96 (Figure 29.3-1, return-corner note). The end zone is the
    largest local coefficient near the end: 1.96, never reported below the interior (1.96).
    Without the returns the end zone is 3.75 x 0.8 = 3.00.
    """
    returns = [{"end": "left", "length": 24.0}, {"end": "right", "length": 24.0}]
    site = site_of([masonry("R", 120.0, return_walls=returns), masonry("F", 120.0)])
    w = ev.gather(site)
    wind = ev.wind_on(w, V, asce7.KD_WALLS, 16.0)
    assert wind.cf_end[0] == pytest.approx(1.96, rel=1e-9)
    assert wind.cf_interior[0] == pytest.approx(1.96, rel=1e-9)
    assert wind.cf_end[1] == pytest.approx(3.00, rel=1e-9)
    assert wind.cf_interior[1] == pytest.approx(1.96, rel=1e-9)


def test_a_return_wall_at_a_corner_lowers_the_end_strip():
    """A masonry wall line of 4 x 24 ft (B/s = 8, as above) meeting a 24 ft line at its start
    (a corner): Lr/s = 2, the starred 0-s cell 3.55 x 0.60 = 2.13 -> x 0.8 = 1.704. The first
    strip [0, 12] then takes the largest of 1.704 (line), 2.24 (Case B alone), 1.80 (Case C
    alone): 2.24. Ignoring the return it would keep 2.84.
    """
    site = line_of_four()
    walls = [*[p.model_dump() for p in site.panels],
             masonry("C", 24.0, line="M", offset=0.0, lift_day=1)]
    corner = site_of(walls, [{"name": "L", "start": [0, 0], "end": [96, 0]},
                             {"name": "M", "start": [0, 0], "end": [0, 24]}])
    unit = Q * G * 12.0 * 12.0 * 6.6 / 9.0
    assert strip_reactions(corner)[0][0] == pytest.approx(2.24 * unit, rel=1e-3)


def test_a_released_wall_stays_in_the_wind_line():
    """Three walls 24 ft long, 12 ft tall on a line. The first is released on day 2 (signed
    off, waiting for nothing); the third is stood on day 3. It still stands (design.md §7):
    on day 3 the second wall is in the middle of a 72 ft line, not at the end of a 48 ft one.
    Its groups (ft: its first edge from the group's start, the group's length): day 1
    (0, 24) alone... day 1 the first two walls (24, 48), day 3 (24, 72); never (0, 48).
    """
    walls = [masonry("A", 24.0, line="L", offset=0.0, lift_day=1),
             masonry("B", 24.0, line="L", offset=24.0, lift_day=1,
                     bracing={**BRACE, "count": 2}),
             masonry("C", 24.0, line="L", offset=48.0, lift_day=3)]
    site = site_of(walls, [{"name": "L", "start": [0, 0], "end": [72, 0]}],
                   [{"panel": "A", "day": 2, "by": "engineer of record"}])
    groups = lines.line_groups(site, lines.releases(site), np.array([24.0] * 3))
    found = {tuple(g[:2]) for g in groups[1] if not np.isnan(g[0])}
    assert found == {(24.0, 48.0), (24.0, 72.0)}


def test_the_minimum_pressure_acts_on_the_solid_area_of_an_open_wall():
    """An unsheathed framed wall 20 ft long, 8 ft tall (solidity 1.5/16 = 0.094, common
    practice): open, Cf 2.0 on its solid area (open signs, eps < 0.1, from memory). At a 20 mph
    basic speed q G Cf is tiny and the 16 psf minimum governs, on the solid area (design.md
    §3): 16 x 0.09375 x 160 = 240 lb (on the gross area it would be 2,560 lb).
    """
    materials = {**MATERIALS, "open": {"kind": "framed", "face_weight": 3.0, "sheathed": False}}
    site = site_of([{"mark": "O", "material": "open", "height": 8.0, "width": 20.0,
                     "thickness": 3.5}], wind=20.0, materials=materials)
    w = ev.gather(site)
    wind = ev.wind_on(w, 16.0, asce7.KD_WALLS, 16.0)
    assert wind.force_a[0] == pytest.approx(16.0 * 0.09375 * 160.0, rel=1e-9)
    assert wind.line_end[0] == pytest.approx(16.0 * 0.09375 * 8.0, rel=1e-9)  # per ft


def test_the_tallest_unbraced_height_works_the_coefficients_afresh():
    """A fresh masonry wall (weight only) 78 ft long, standing 12 ft tall, checked for the
    height at which its end zone just stands (design.md §5).

    At s = 6 ft: B/s = 13, Case C 0-s 4.00 x 0.8 = 3.20; q = 15.63 psf (Kz at 15 ft). Per ft:
    overturning 0.6 q G 3.20 x 6 x 3.3 = 0.6 x 842.3 lb-ft against 0.6 x w 6 x t/2 with
    t = 7.625 in: w = 842.3 / (6 x 0.3177) = 441.9 psf makes it exactly 1.0 at 6 ft. (At the
    full 12 ft height B/s = 6.5 and the 0-s cell is only 3.35 x 0.8 = 2.68: reused at lower
    heights it would allow 6 x 3.20 / 2.68 = 7.16 ft.)
    """
    t = 7.625 / 12.0
    moment = Q * G * 3.20 * 6.0 * 3.3
    assert moment == pytest.approx(842.3, abs=0.5)
    face = moment / (6.0 * t / 2.0)
    materials = {**MATERIALS, "heavy": {"kind": "masonry", "face_weight": face}}
    site = site_of([{"mark": "H", "material": "heavy", "height": 12.0, "width": 78.0,
                     "thickness": 7.625, "mortar_age": 0.0}], materials=materials)
    e = ev.evaluate_arrays(site)
    assert e.max_height[0] == pytest.approx(6.0, rel=1e-4)


def test_a_stiff_member_makes_the_braces_share_as_on_a_rigid_panel():
    """The masonry wall of tests/validation (12 ft x 40 ft, four braces at 5, 15, 25, 35 ft,
    inserts 9 ft, 45 degrees) with a strongback tying its braces (`stiff_member`): the braces
    share each load case by statics with the twist (design.md §6).

    Case A force F = q G Cf_A As = 15.63 x 0.85 x 1.3667 x 480 = 8,718 lb at 0.55 x 12 = 6.6 ft:
    sum R = F x 6.6 / 9 = 0.7333 F. Case B puts F 0.2 B = 8 ft off centre: M_t = 8 F about
    the braces' centroid (the wall's centre), sum (x - x_c)^2 = 2 (15^2 + 5^2) = 500 ft^2.
    End brace: 0.7333 F / 4 + 8 F x 15 / 500 = 0.4233 F; inner: 0.1833 F + 8 F x 5 / 500 =
    0.2633 F. (Case C of the wall alone, mean 1.4507 at 16.27 ft from its end, gives less:
    0.295 x 1.0615 F at the end brace.) The lean, 33.3 lb at the centre, shares evenly. ASD:
    P = (0.6 R + 8.33) / cos 45: end 0.6 x 0.4233 x 8,718 = 2,214 + 8.33 -> 3,143 lb; inner
    0.6 x 0.2633 x 8,718 = 1,377 + 8.33 -> 1,959 lb.
    """
    bracing = {"brace_type": "big", "count": 4, "insert_height": 9.0, "angle": 45.0,
               "stiff_member": True}
    site = site_of([masonry("S", 40.0, bracing=bracing)])
    force = Q * G * 1.3667 * 480.0
    assert force == pytest.approx(8718.0, rel=1e-3)
    end = (0.6 * 0.42333 * force + 8.333) / np.cos(np.radians(45.0))
    inner = (0.6 * 0.26333 * force + 8.333) / np.cos(np.radians(45.0))
    assert (end, inner) == (pytest.approx(3143.0, abs=3.0), pytest.approx(1959.0, abs=3.0))
    found = ev.evaluate(site).panels[0].braces["brace_forces_lb"]
    assert found == pytest.approx([end, inner, inner, end], rel=2e-3)
