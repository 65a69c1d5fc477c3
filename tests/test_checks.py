"""The braced checks of issue 10 (design.md §3, §6): the sill uplift of framed walls, brace types
that state their tension or work in compression only, allowable capacities on the ASD
combinations under LRFD with the same service speeds, a failed deadman's finite utilization,
and one registry entry per anchor kind.

Brace and anchor ratings below are invented for the tests (a maker's data sheet would give them).
"""

from __future__ import annotations

import json
import math
from pathlib import Path

import pytest
from wall_materials import MATERIALS, THICKNESS_IN

from bracing import cli, scenario
from bracing import evaluate as ev
from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.model import AnchorType, Site
from bracing.report import svg

SCENARIOS = Path(__file__).parent.parent / "scenarios"


def _panel_json(capsys, *extra: str) -> dict:
    """`bracing panel --json` of a 9 ft x 20 ft framed wall (6 psf, the command's default for
    framed walls: HUD RSDG Table 3.2, secondary) on 2 braces at 7 ft, 50 deg, 2000 lb."""
    cli.main(["panel", "--material", "framed", "--height", "9ft", "--width", "20ft",
              "--thickness", "5.5in", "--wind", "115mph", "--braces", "2", "--insert-height",
              "7ft", "--brace-angle", "50deg", "--brace-capacity", "2000lb", "--json", *extra])
    return json.loads(capsys.readouterr().out)


# --- 1. sill uplift of framed walls ---------------------------------------------------------
def test_a_framed_wall_reports_its_sill_uplift_and_is_a_danger_without_a_sill_fastening(capsys):
    """The braces in compression lift the wall by sum(P sin theta) (statics, design.md §6);
    0.6D holds part of it (ASCE 7-16 §2.4.1):

    D = 6 psf x 9 ft x 20 ft = 1080 lb; 0.6 D = 648 lb.
    sill uplift = sum(P sin theta) - 648 lb (the record's base_uplift_lb is sum(P sin theta)),
    per brace / 2, per ft of sill / 20 ft. The sill uplift check: sum(P sin theta) against
    0.6 D = 648 lb (no fastening given)."""
    d = _panel_json(capsys)
    braces = d["braces"]
    lift = braces["base_uplift_lb"]
    assert lift > 648.0  # this wall is lifted: the rest of the test is about how much
    assert braces["sill_uplift_lb"] == pytest.approx((lift - 648.0) / 2.0, rel=1e-9)
    assert braces["sill_uplift_plf"] == pytest.approx((lift - 648.0) / 20.0, rel=1e-9)
    check = next(c for c in d["checks"] if c["element"] == "sill uplift")
    assert check["capacity"] == pytest.approx(648.0, rel=1e-9)
    assert check["demand"] == pytest.approx(lift, rel=1e-9)
    assert not check["passes"]
    flag = next(f for f in d["flags"] if f["code"] == "sill-uplift")
    assert flag["severity"] == "danger" and "no sill_fastening" in flag["message"]
    assert "kick-out" in flag["message"]  # no friction left to rely on


def test_a_sill_fastening_that_covers_the_uplift_clears_the_danger(capsys):
    """--sill-fastening 300plf: capacity 0.6 D + 300 plf x 20 ft = 648 + 6000 = 6648 lb."""
    d = _panel_json(capsys, "--sill-fastening", "300plf")
    check = next(c for c in d["checks"] if c["element"] == "sill uplift")
    assert check["capacity"] == pytest.approx(6648.0, rel=1e-9)
    assert check["passes"]
    assert [f["severity"] for f in d["flags"] if f["code"] == "sill-uplift"] == ["notice"]
    assert "danger" not in {f["severity"] for f in d["flags"]}


# --- 2. brace types state their tension, or work in compression only ------------------------
BAD_BRACES = [
    ('kind = "rated"\nlengths = ["24 ft", "32 ft"]\nloads = ["7200 lb", "5000 lb"]',
     "tension_capacity"),
    ('kind = "lumber"\nsize = "2x6"\nspecies = "SPF"\ngrade = "No.1/No.2"', "tension_capacity"),
    ('kind = "pipe"\nsection = "Pipe 3 STD"', "end_connection"),
]


@pytest.mark.parametrize(("brace", "field"), BAD_BRACES, ids=["rated", "lumber", "pipe"])
def test_a_brace_type_stating_neither_tension_nor_compression_only_is_refused(
        tmp_path, capsys, brace, field):
    """design.md §6: a brace type that says neither is a validation error: exit 2 naming the
    file, the brace type and the field."""
    path = tmp_path / "site.toml"
    path.write_text(_site_text(brace), encoding="utf-8")
    assert cli.main(["check", str(path)]) == 2
    err = capsys.readouterr().err
    assert str(path) in err and "brace_type adj" in err and field in err
    path.write_text(_site_text(brace + "\ncompression_only = true"), encoding="utf-8")
    assert scenario.load(path).site.brace_types["adj"].compression_only


def _site_text(brace: str) -> str:
    return f"""version = 1
[site]
name = "t"
basic_wind_speed = 115
[materials.tilt]
kind = "concrete"
unit_weight = 150
[brace_types.adj]
{brace}
[[panels]]
mark = "P-1"
material = "tilt"
width = 20
height = 24
thickness = 7.25
[panels.bracing]
brace_type = "adj"
count = 2
insert_height = 16
angle = 55
"""


def _site(panels, brace_types, anchor_types=None, basis="ASD", period_factor=None) -> Site:
    info = {"name": "checks", "basic_wind_speed": 100.0, "design_basis": basis}
    if period_factor:
        info["period_factor"] = period_factor
    return Site.model_validate({"site": info, "materials": MATERIALS,
                                "brace_types": brace_types, "anchor_types": anchor_types or {},
                                "panels": panels})


def _wall(mark, **bracing) -> dict:
    p = {"mark": mark, "material": "concrete", "height": 30.0, "width": 24.0,
         "thickness": THICKNESS_IN["concrete"]}
    if bracing:
        p["bracing"] = {"count": 2, "insert_height": 20.0, "angle": 55.0, **bracing}
    return p


def test_compression_only_braces_leave_the_wind_away_from_them_to_the_wall_alone():
    """design.md §6: with the wind away from its braces, a wall on compression-only braces
    stands alone. A 30 x 24 ft, 7.25 in concrete panel (150 pcf, ASCE 7 Table C3.1-2, from
    memory): D = 150 x 7.25/12 x 30 x 24 = 65,250 lb; overturning resisted by 0.6 D t/2 =
    0.6 x 65,250 x 7.25/24 = 11,826.6 lb-ft (statics, ASCE 7-16 §2.4.1), far below the wind's
    moment at 100 mph: the wall fails that way, and its working limit is no higher than the
    same wall's standing alone."""
    types = {"one-way": {"kind": "rated", "lengths": [1.0, 100.0], "loads": [60000.0, 60000.0],
                         "compression_only": True},
             "two-way": {"kind": "rated", "lengths": [1.0, 100.0], "loads": [60000.0, 60000.0],
                         "tension_capacity": 60000.0}}
    result = ev.evaluate(_site([_wall("ONE", brace_type="one-way"),
                                _wall("TWO", brace_type="two-way"), _wall("ALONE")], types))
    one, two, alone = result.panels
    reverse = next(c for c in one.checks if c.element == "overturning" + ev.REVERSE)
    assert reverse.capacity == pytest.approx(11826.5625, rel=1e-9)
    assert not reverse.passes and one.status == "unsafe" and one.fails
    assert {"compression-only", "overturning-wind-away-from-the-braces-over"} <= {
        f.code for f in one.flags}
    assert one.working_limit_speed_mph <= alone.working_limit_speed_mph + 1e-9
    assert "brace tension" not in {c.element for c in one.checks}
    assert two.status == "braced"
    assert not any(ev.REVERSE in c.element for c in two.checks)


# --- 3. LRFD without mixing bases -----------------------------------------------------------
@pytest.mark.parametrize("name", sorted(p.name for p in SCENARIOS.glob("*.toml")))
def test_the_service_speeds_of_every_demo_wall_are_the_same_under_lrfd(name):
    """design.md §3: the working-limit and stand-down speeds are service values, the same
    under either basis."""
    site = scenario.load(SCENARIOS / name).site
    lrfd = site.model_copy(update={"site": site.site.model_copy(
        update={"design_basis": "LRFD"})})
    asd_result = ev.evaluate(site, base_dir=SCENARIOS)
    lrfd_result = ev.evaluate(lrfd, base_dir=SCENARIOS)
    for a, b in zip(asd_result.panels, lrfd_result.panels, strict=True):
        assert (b.working_limit_speed_mph, b.stand_down_speed_mph,
                b.fresh_working_limit_speed_mph) == pytest.approx(
            (a.working_limit_speed_mph, a.stand_down_speed_mph,
             a.fresh_working_limit_speed_mph), rel=1e-12, nan_ok=True), a.mark


def test_a_braced_wall_under_lrfd_worked_by_hand():
    """A 20 x 20 ft, 8 in concrete panel alone on grade, exposure C, V = 100 mph (period factor
    1.0), two braces at the centres of equal strips (x = 5 and 15 ft), inserts at 15 ft, 45 deg,
    no lean or slop: a Pipe 3 STD brace (AISC 360-16: a strength value), a rated insert and a
    helical foot anchor (allowable values).

    Kz = 2.01 (20/900)^(2/9.5) = 0.90189 (ASCE 7-16 Table 26.11-1, text);
    q = 0.00256 x 0.90189 x 0.85 x 100^2 = 19.625 psf (Eq. 26.10-1, secondary);
    B/s = 1, s/h = 1: Cf = 1.45 (Figure 29.3-1, text); F = 19.625 x 0.85 x 1.45 x 400
    = 9,675.1 lb (Eq. 29.3-1), above 16 psf x 400 = 6,400 lb (§29.7, from memory);
    resultant at 0.55 h = 11 ft: sum R_h = 9,675.1 x 11 / 15 = 7,095.1 lb (statics);
    Case B, 0.2 B = 4 ft off centre: M_t = 38,700.5 lb-ft, share 38,700.5 x 5 / (2 x 5^2)
    = 3,870.1 lb: R_max = 7,095.1 / 2 + 3,870.1 = 7,417.6 lb (design.md §6);
    P = R / cos 45: LRFD 1.0W: 10,490.1 lb; ASD 0.6W: 6,294.0 lb (ASCE 7-16 §2.3.1, §2.4.1).
    Under LRFD the pipe's checks take 10,490.1 lb, the allowable ones (end fittings, insert,
    helical anchor) 6,294.0 lb and say so (design.md §3)."""
    types = {"pipe": {"kind": "pipe", "section": "Pipe 3 STD", "end_connection": 20000.0}}
    anchors = {"insert": {"kind": "insert", "rated_tension": 20000.0, "rated_shear": 20000.0},
               "helix": {"kind": "helical", "installation_torque": 3000.0}}
    panel = {"mark": "P", "material": "concrete", "height": 20.0, "width": 20.0,
             "thickness": 8.0, "bracing": {
                 "brace_type": "pipe", "wall_anchor": "insert", "foot_anchor": "helix",
                 "count": 2, "insert_height": 15.0, "angle": 45.0, "lean": 0.0, "slop": 0.0}}
    p = ev.evaluate(_site([panel], types, anchors, basis="LRFD", period_factor=1.0)).panels[0]
    by = {c.element: c for c in p.checks}
    for name in ("brace compression", "brace tension"):
        assert by[name].demand == pytest.approx(10490.1, rel=2e-5), name
        assert by[name].combination == "1.2D + 1.0W"
    for name in ("brace end fittings", "wall insert", "foot anchor"):
        assert by[name].demand == pytest.approx(6294.0, rel=2e-5), name
        assert "ASD combination under LRFD" in by[name].combination
    assert p.braces["axial_force_lb"] == pytest.approx(10490.1, rel=2e-5)


# --- 4. a failed deadman --------------------------------------------------------------------
def test_a_lifted_deadman_reports_a_finite_governing_utilization():
    """A 500 lb block under a 30 x 24 ft panel's brace is lifted off: its uplift check fails
    (0.6 x 500 = 300 lb against the brace's P sin theta); the sliding check stays finite
    (pull + mu x uplift against mu x 0.6 W, mu = 0.6 / 1.5 = 0.4: ACI 318-19 §22.9.4.2 over
    the factor of safety 1.5 of NAVFAC DM-7.02, both from memory), and the bearing under a
    block that is lifted off is not checked."""
    types = {"big": {"kind": "rated", "lengths": [1.0, 100.0], "loads": [60000.0, 60000.0],
                     "tension_capacity": 60000.0}}
    anchors = {"light": {"kind": "deadman", "weight": 500.0, "length": 4.0, "pin_height": 1.0,
                         "width": 2.0, "allowable_bearing": 2000.0}}
    p = ev.evaluate(_site([_wall("W", brace_type="big", foot_anchor="light")], types,
                          anchors)).panels[0]
    by = {c.element: c for c in p.checks}
    assert by["deadman uplift"].capacity == pytest.approx(300.0)
    assert not by["deadman uplift"].passes
    pull, up = p.braces["anchor_shear_lb"], p.braces["anchor_uplift_lb"]
    assert by["deadman sliding"].demand == pytest.approx(pull + 0.4 * up, rel=1e-9)
    assert by["deadman sliding"].capacity == pytest.approx(0.4 * 300.0, rel=1e-9)
    assert "deadman bearing" not in by
    assert math.isfinite(p.utilization) and p.utilization > 1.0


# --- 5. one registry entry per anchor kind ---------------------------------------------------
SAMPLES = {  # one anchor of each kind (invented ratings)
    "insert": {"kind": "insert", "rated_tension": 9000.0, "rated_shear": 9000.0},
    "slab": {"kind": "slab", "embedment": 4.5, "diameter": 0.75, "steel_area": 0.334,
             "pullout": 9000.0, "slab_thickness": 6.0, "concrete_strength": 3000.0},
    "helical": {"kind": "helical", "installation_torque": 3000.0},
    "deadman": {"kind": "deadman", "weight": 20000.0},
    "stake": {"kind": "stake", "rated_tension": 3000.0, "rated_shear": 3000.0},
    "deck": {"kind": "deck", "rated_tension": 1500.0, "rated_shear": 2500.0},
}
BIG = {"big": {"kind": "rated", "lengths": [1.0, 100.0], "loads": [60000.0, 60000.0],
               "tension_capacity": 60000.0}}


def test_every_anchor_kind_of_the_model_has_a_sample_here():
    assert set(SAMPLES) == set(AnchorType.model_fields["kind"].annotation.__args__) \
        == set(ANCHOR_KINDS)


def test_every_anchor_kind_produces_its_foot_anchor_checks_with_a_finite_capacity():
    """A foot anchor of any kind is checked: its registry entry's checks ("foot anchor", or a
    deadman's own), each with a finite capacity, its source, and its symbol drawn."""
    panels = [_wall(kind, brace_type="big", foot_anchor=kind) for kind in SAMPLES]
    result = ev.evaluate(_site(panels, BIG, SAMPLES))
    for p in result.panels:
        entry = ANCHOR_KINDS[p.mark]
        assert entry.checks, p.mark
        for name in entry.checks:
            check = next((c for c in p.checks if c.element == name), None)
            assert check is not None, (p.mark, name)
            assert math.isfinite(check.capacity) and check.capacity > 0.0, (p.mark, name)
        if entry.ratio is not None:
            assert next(c for c in p.checks if c.element == "foot anchor").source == entry.source
        assert entry.symbol in svg.SYMBOLS


def test_the_helical_anchor_is_checked_by_its_installation_torque():
    """ICC-ES AC358 (secondary): allowable Q = K_t T / FS = 10 /ft x 3000 ft-lb / 2 = 15,000 lb
    (K_t 10 /ft for a 1.5 in square shaft), on the brace's axis: the check's capacity."""
    p = ev.evaluate(_site([_wall("H", brace_type="big", foot_anchor="helical")], BIG,
                          SAMPLES)).panels[0]
    check = next(c for c in p.checks if c.element == "foot anchor")
    assert check.capacity == pytest.approx(15000.0, rel=1e-12)
    assert check.source == "ICC-ES AC358: K_t T / FS"
    assert check.demand == pytest.approx(p.braces["axial_force_lb"], rel=1e-12)


def test_a_wall_alone_checks_its_allowable_bearing_on_the_asd_combinations_under_lrfd():
    """IBC Table 1806.2 bearing is an allowable value (text): under LRFD the soil under a
    footing is checked with D + 0.6W as under ASD, and the check says so; overturning (statics)
    takes 0.9D + 1.0W (ASCE 7-16 §2.3.1), so its utilization rises by 1.0/0.6 over 0.9/0.6."""
    panel = {"mark": "F", "material": "concrete", "height": 10.0, "width": 10.0,
             "thickness": 8.0, "footing": {"width": 4.0, "thickness": 1.5}}
    asd, lrfd = (ev.evaluate(_site([panel], {}, basis=b)).panels[0] for b in ("ASD", "LRFD"))
    a, b = ({c.element: c for c in p.checks} for p in (asd, lrfd))
    assert b["soil bearing"].demand == pytest.approx(a["soil bearing"].demand, rel=1e-12)
    assert "ASD combination under LRFD" in b["soil bearing"].combination
    assert b["overturning"].utilization == pytest.approx(
        a["overturning"].utilization * (1.0 / 0.6) / (0.9 / 0.6), rel=1e-9)


def test_a_deadman_tipping_over_its_toe_fails_its_overturning_with_a_finite_utilization():
    """A 2 ft block of 20,000 lb with the brace pinned 3 ft up (mid-length in plan): the pull at
    3 ft against 0.6 W x 1 ft = 12,000 lb-ft about the toe (statics, ASCE 7-16 §2.4.1) tips
    it; under a tipping block the linear pressure has no finite peak, so its bearing check is
    not made and its overturning check gives the utilization."""
    types = {"big": {"kind": "rated", "lengths": [1.0, 100.0], "loads": [60000.0, 60000.0],
                     "tension_capacity": 60000.0}}
    anchors = {"tall": {"kind": "deadman", "weight": 20000.0, "length": 2.0, "pin_height": 3.0,
                        "width": 2.0, "allowable_bearing": 2000.0}}
    p = ev.evaluate(_site([_wall("W", brace_type="big", foot_anchor="tall")], types,
                          anchors)).panels[0]
    by = {c.element: c for c in p.checks}
    assert by["deadman overturning"].capacity == pytest.approx(12000.0)
    assert not by["deadman overturning"].passes
    assert by["deadman uplift"].passes  # 0.6 x 20,000 = 12,000 lb holds the uplift
    assert "deadman bearing" not in by
    assert math.isfinite(p.utilization) and p.utilization > 1.0
