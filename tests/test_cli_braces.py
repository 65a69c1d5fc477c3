"""`bracing panel` with braces (the §8 `braces` record and the braced speeds) and bad brace input
through both doors: the panel flags and a site file given to `bracing check`."""

import contextlib
import io
import json
import math

import pytest
from verdicts import exit_code_of

from bracing import braced, cli
from bracing import evaluate as ev
from bracing.model import Site

PANEL = ["panel", "--height", "30ft", "--width", "24ft", "--thickness", "7.25in",
         "--wind", "115mph", "--exposure", "C", "--duration", "5weeks"]
BRACED = PANEL + ["--braces", "2", "--insert-height", "20ft", "--brace-angle", "55deg"]
CAPACITY_LB = 9000.0
BRACES_KEYS = {"count", "angle_deg", "insert_height_ft", "anchor_distance_ft", "length_ft",
               "axial_force_lb", "anchor_uplift_lb", "anchor_shear_lb", "utilization"}

H, B, HB = 30.0, 24.0, 20.0  # the panel: height, width and insert height, ft
THETA = math.radians(55.0)
# lean at the top, slop at the insert: model defaults, common practice
LEAN_IN, SLOP_IN = 0.25, 0.125
KZ_30 = 2.01 * (30.0 / 900.0) ** (2.0 / 9.5)  # Table 26.10-1 note 1, Table 26.11-1 C (text)
CF = 1.49  # Fig. 29.3-1, s/h 1, B/s 0.8 between 1.55 and 1.45 (secondary)
G = 0.85  # ASCE 7-16 §26.11.1 rigid (secondary)


def record(args) -> dict:
    out = io.StringIO()
    with contextlib.redirect_stdout(out):
        code = cli.main(list(args) + ["--json"])
    got = json.loads(out.getvalue())
    assert code == exit_code_of(got)  # design.md §8a
    return got


@pytest.fixture(scope="module")
def rated() -> dict:
    return record(BRACED + ["--brace-capacity", f"{CAPACITY_LB:g}lb"])


@pytest.fixture(scope="module")
def unrated() -> dict:
    return record(BRACED)


def lean_per_brace(weight_lb: float) -> float:
    """D e / hb shared by two braces, e = (lean / s + slop / hb) z_c (statics, design.md §6)."""
    e = (LEAN_IN / 12.0 / H + SLOP_IN / 12.0 / HB) * (H / 2.0)
    return weight_lb * e / HB / 2.0


# --- the §8 braces record --------------------------------------------------------------------
def test_braces_record_carries_every_key_of_section_8(rated, unrated):
    for got in (rated, unrated):
        assert BRACES_KEYS <= set(got["braces"])
        assert got["braces"]["count"] == 2 and got["braces"]["insert_height_ft"] == HB
    assert unrated["braces"]["utilization"] is None  # no --brace-capacity: not known
    b = rated["braces"]
    assert b["utilization"] == pytest.approx(b["axial_force_lb"] / CAPACITY_LB, rel=1e-12)


@pytest.mark.parametrize("foot", [["--brace-angle", "55deg"], ["--anchor-distance", "14ft"]])
def test_brace_geometry_follows_the_section(foot):
    b = record(BRACED[:-2] + foot)["braces"]
    d, hb = b["anchor_distance_ft"], b["insert_height_ft"]
    assert math.degrees(math.atan(hb / d)) == pytest.approx(b["angle_deg"], rel=1e-12)  # statics
    assert math.hypot(hb, d) == pytest.approx(b["length_ft"], rel=1e-12)  # Pythagoras
    theta = math.radians(b["angle_deg"])
    p = b["axial_force_lb"]
    assert b["anchor_uplift_lb"] == pytest.approx(p * math.sin(theta), rel=1e-12)  # statics
    assert b["anchor_shear_lb"] == pytest.approx(p * math.cos(theta), rel=1e-12)
    if foot[0] == "--anchor-distance":
        assert d == 14.0


def test_two_brace_forces_by_hand(unrated):
    # statics (design.md §6), with the panel's design wind from the record itself:
    # F = 14,499 lb at z = 16.5 ft (ASCE 7-16 Eq. 29.3-1, 0.55 h), D = 65,250 lb.
    f, z = unrated["wind"]["force_lb"], unrated["wind"]["resultant_height_ft"]
    assert (round(f), z) == (14499, 0.55 * H)
    # Case A, ASD 0.6W (ASCE 7-16 §2.4.1): R = 0.6 F z / hb = 0.6 x 14,499 x 16.5 / 20
    # = 7,177 lb for the two braces, 3,589 lb each (equal sharing), P = R / cos 55 = 6,256 lb.
    r_total = 0.6 * f * z / HB
    assert r_total == pytest.approx(7177.0, abs=1.0)
    case_a = r_total / 2.0 / math.cos(THETA)
    assert case_a == pytest.approx(6256.5, abs=1.0)
    # Case B (Fig. 29.3-1): the same force 0.2 B = 4.8 ft off centre. Braces at 6 and 18 ft:
    # M_t = 0.6 x 14,499 x 4.8 = 41,757 lb-ft over sum((x - x_c)^2) = 72 ft^2, times the arm
    # 6 ft: +-3,480 lb on each brace; the lean of the wall adds D e / hb / 2 = 29.7 lb each.
    twist = 0.6 * f * 0.2 * B * 6.0 / 72.0
    lean = lean_per_brace(unrated["weight_lb"])
    assert (twist, lean) == (pytest.approx(3479.8, abs=0.1), pytest.approx(29.74, abs=0.01))
    # Governing brace: R_h = 3,589 + 3,480 + 30 = 7,098 lb, P = R_h / cos 55 = 12,375 lb.
    r_h = r_total / 2.0 + twist + lean
    b = unrated["braces"]
    assert b["anchor_shear_lb"] == pytest.approx(r_h, rel=1e-9)  # P cos(theta) = R_h
    assert b["axial_force_lb"] == pytest.approx(r_h / math.cos(THETA), rel=1e-9)
    assert b["axial_force_lb"] == pytest.approx(12375.0, abs=1.0)
    # Case B from either edge: each brace in turn takes the larger share
    assert b["brace_forces_lb"] == pytest.approx([b["axial_force_lb"]] * 2, rel=1e-12)
    # The base (design.md §6): shear F - sum(R_h), the lean's reaction among the braces' R_h:
    # 0.6 F - R - 2 x lean = 1,463 lb; lifted by sum(P sin) = (R + lean) tan 55.
    assert b["base_shear_lb"] == pytest.approx(0.6 * f - r_total - 2.0 * lean, rel=1e-9)
    assert b["base_shear_lb"] == pytest.approx(1462.9, abs=0.5)
    assert b["base_uplift_lb"] == pytest.approx((r_total + 2.0 * lean) * math.tan(THETA),
                                                rel=1e-9)


# --- the braced speeds -----------------------------------------------------------------------
def _governing_at(args, gust_mph: float) -> float:
    """Governing strength utilization of the braced panel of `bracing panel args` at an observed
    gust: 1.0W as a service load, Kd 1.0, no minimum pressure (design.md §3)."""
    site = Site.model_validate(cli.panel_site(cli.build_parser().parse_args(args)))
    w = ev.gather(site)
    bs = braced.gather_braces(site, site.site.design_basis)
    checks, _ = braced.braced_checks(w, ev.wind_on(w, gust_mph, 1.0, None), bs, ev.SERVICE, None)
    return float(ev.governing_utilization(ev.strength_only(checks))[0])


@pytest.mark.parametrize("capacity", [[], ["--brace-capacity", f"{CAPACITY_LB:g}lb"]],
                         ids=["unrated brace", "rated brace"])
def test_top_level_working_limit_is_the_braced_one(capacity):
    got = record(BRACED + capacity)
    v = got["working_limit_speed_mph"]
    assert v != got["unbraced"]["working_limit_speed_mph"]
    # design.md §3: at the working-limit gust the governing element is exactly fully used
    assert _governing_at(BRACED + capacity, v) == pytest.approx(1.0, abs=1e-6)
    assert _governing_at(BRACED + capacity, 0.98 * v) < 1.0
    # the stand-down speed: the site's ratio, 0.8 by default (team judgment), x the limit
    assert got["stand_down_speed_mph"] == pytest.approx(0.8 * v, rel=1e-12)


def test_stand_down_ratio_applies_to_the_braced_limit():
    got = record(BRACED + ["--stand-down-ratio", "0.7"])
    assert got["stand_down_speed_mph"] == pytest.approx(0.7 * got["working_limit_speed_mph"],
                                                        rel=1e-12)


def test_braced_working_limit_by_hand(rated):
    # The rated brace governs (its compression = its tension rating here): at the limit gust V,
    # P = [F (z / (2 hb) + 0.2 B x 6 / 72) + lean] / cos 55 = 9,000 lb with 1.0W (design.md §3).
    assert rated["governing_element"].startswith("brace")
    lean = lean_per_brace(rated["weight_lb"])
    f = (CAPACITY_LB * math.cos(THETA) - lean) / (0.55 * H / (2.0 * HB) + 0.2 * B * 6.0 / 72.0)
    # F = 6,317 lb = q G Cf A, A = 720 ft^2 -> q = 6.93 psf = 0.00256 Kz (1.0) V^2 (Kd 1.0),
    # ASCE 7-16 Eq. 26.10-1 and Eq. 29.3-1 (secondary): V = 52.5 mph
    q = f / (G * CF * H * B)
    v = math.sqrt(q / (0.00256 * KZ_30))
    assert (f, q) == (pytest.approx(6317.0, abs=1.0), pytest.approx(6.93, abs=0.01))
    assert rated["working_limit_speed_mph"] == pytest.approx(v, rel=1e-6)
    assert v == pytest.approx(52.5, abs=0.05)


# --- bad brace input through the panel flags -------------------------------------------------
BAD_FLAGS = [
    ("--insert-height", ["--insert-height", "35ft"], "above the wall's top"),
    ("--brace-angle", ["--brace-angle", "95deg"], "less than 90"),
    ("--brace-angle", ["--brace-angle", "90deg"], "less than 90"),
    ("--brace-angle", ["--brace-angle", "0deg"], "greater than 0"),
    ("--brace-angle", ["--brace-angle=-10deg"], "greater than 0"),
    ("--brace-angle", ["--brace-angle", "1.6rad"], "less than 90"),
    ("--anchor-distance", ["--anchor-distance=-3ft"], "greater than 0"),
    ("--brace-capacity", ["--brace-angle", "55deg", "--brace-capacity", "0lb"], "greater than 0"),
]


def _braced_with(change: list[str]) -> list[str]:
    """The braced panel's flags with the insert or the foot replaced."""
    base = PANEL + ["--braces", "2"]
    if change[0] != "--insert-height":
        base += ["--insert-height", "20ft"]
    if not any(c.startswith(("--brace-angle", "--anchor-distance")) for c in change):
        base += ["--brace-angle", "55deg"]
    return base + change


@pytest.mark.parametrize(("flag", "change", "words"), BAD_FLAGS,
                         ids=[" ".join(c[1]) for c in BAD_FLAGS])
def test_bad_brace_flags_exit_2_naming_the_flag(capsys, flag, change, words):
    assert cli.main(_braced_with(change)) == 2
    captured = capsys.readouterr()
    assert captured.out == ""
    assert captured.err.startswith(f"bracing: {flag}: ") and words in captured.err
    assert "Traceback" not in captured.err


def test_brace_flags_without_a_count_are_refused(capsys):
    assert cli.main(PANEL + ["--insert-height", "20ft", "--brace-angle", "55deg"]) == 2
    assert "need --braces N" in capsys.readouterr().err


def test_bad_brace_flag_end_to_end_has_no_traceback(helpers):
    done = helpers.run_bracing(*_braced_with(["--insert-height", "35ft"]), "--json")
    assert done.returncode == 2 and done.stdout == ""
    assert "--insert-height" in done.stderr and "Traceback" not in done.stderr


# --- bad brace input through a site file -----------------------------------------------------
SITE = """\
version = 1

[site]
name = "brace input"
basic_wind_speed = "115 mph"

[materials.tilt]
kind = "concrete"
unit_weight = "150 pcf"

[brace_types.adj]
kind = "rated"
lengths = ["24 ft", "28 ft", "32 ft"]    # the maker's table (invented)
loads = ["7200 lb", "6100 lb", "5000 lb"]
tension_capacity = "7200 lb"

[[panels]]
mark = "P-1"
material = "tilt"
width = "24 ft"
height = "30 ft"
thickness = "7.25 in"
[panels.bracing]
brace_type = "adj"
count = 2
insert_height = "20 ft"
angle = "55 deg"
"""
LENGTHS = 'lengths = ["24 ft", "28 ft", "32 ft"]'
BAD_FILES = [
    ("insert above the top", 'insert_height = "20 ft"', 'insert_height = "32 ft"',
     "panel P-1: bracing.insert_height is above the wall's top"),
    ("angle over 90", 'angle = "55 deg"', 'angle = "95 deg"', "panel P-1: bracing.angle: "),
    ("angle of 90", 'angle = "55 deg"', 'angle = "90 deg"', "panel P-1: bracing.angle: "),
    ("angle of 0", 'angle = "55 deg"', "angle = 0", "panel P-1: bracing.angle: "),
    ("negative angle", 'angle = "55 deg"', 'angle = "-10 deg"', "panel P-1: bracing.angle: "),
    ("lengths falling", LENGTHS, 'lengths = ["24 ft", "32 ft", "28 ft"]',
     "brace_type adj: rated table `lengths` must increase"),
    ("lengths repeated", LENGTHS, 'lengths = ["24 ft", "28 ft", "28 ft"]',
     "brace_type adj: rated table `lengths` must increase"),
]


@pytest.mark.parametrize(("case", "old", "new", "words"), BAD_FILES,
                         ids=[c[0] for c in BAD_FILES])
def test_bad_brace_input_in_a_site_file_exits_2_naming_the_field(capsys, write_site, case, old,
                                                                 new, words):
    assert old in SITE
    path = write_site(SITE.replace(old, new))
    assert cli.main(["check", str(path)]) == 2
    captured = capsys.readouterr()
    assert captured.out == "" and "Traceback" not in captured.err
    problems = [line.strip() for line in captured.err.splitlines()[1:]]
    assert len(problems) == 1, captured.err
    assert problems[0].startswith(f"{path}:") and words in problems[0], problems[0]


def test_the_good_site_file_checks(capsys, write_site):
    # a valid file whose wall is unsafe (its rated braces are short): exit 1 (design.md §8a)
    assert cli.main(["check", str(write_site(SITE)), "--json"]) == 1
    (p,) = json.loads(capsys.readouterr().out)["panels"]
    assert p["braces"]["angle_deg"] == pytest.approx(55.0, rel=1e-12)


def test_bad_site_file_end_to_end_has_no_traceback(helpers, write_site):
    path = write_site(SITE.replace(LENGTHS, 'lengths = ["32 ft", "28 ft", "24 ft"]'))
    done = helpers.run_bracing("check", path)
    assert done.returncode == 2 and done.stdout == ""
    assert "lengths" in done.stderr and "Traceback" not in done.stderr


@pytest.mark.parametrize(("old", "new"), [
    ('angle = "55 deg"', 'anchor_distance = "0.5 ft"\ninsert_offset = "12 in"'),
    ('angle = "55 deg"', 'angle = "55 deg"\nbase_below_slab = "25 ft"'),
], ids=["insert pin beyond the foot", "foot above the insert"])
def test_a_brace_that_cannot_exist_is_refused(capsys, write_site, old, new):
    path = write_site(SITE.replace(old, new))
    assert cli.main(["check", str(path), "--json"]) == 2
    assert "panel P-1: bracing" in capsys.readouterr().err

