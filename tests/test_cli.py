"""The command line: `bracing panel --json` (the stable contract of design.md §8) and `bracing
schema`. Values are recomputed here by hand from the method, each with its source and mark."""

import contextlib
import io
import json
import math

import numpy as np
import pytest
from verdicts import exit_code_of

from bracing import cli
from bracing.results import CAUTION

PANEL = ["panel", "--height", "30ft", "--width", "24ft", "--thickness", "7.25in",
         "--wind", "115mph", "--exposure", "C", "--duration", "5weeks"]

TOP_KEYS = {"basis", "weight_lb", "wind", "unbraced", "braces", "working_limit_speed_mph",
            "stand_down_speed_mph", "governing_element", "flags", "caution"}
WIND_KEYS = {"basic_speed_mph", "period_factor", "design_speed_mph", "kz", "kd", "kzt", "ke",
             "gust_factor", "velocity_pressure_psf", "force_coefficient", "opening_factor",
             "force_lb", "resultant_height_ft"}
UNBRACED_KEYS = {"utilization", "stands", "working_limit_speed_mph", "stand_down_speed_mph",
                 "max_height_ft", "max_height_at_limit_ft"}
BRACES_KEYS = {"count", "angle_deg", "insert_height_ft", "anchor_distance_ft", "length_ft",
               "axial_force_lb", "anchor_uplift_lb", "anchor_shear_lb", "utilization"}

# By hand, 30 ft x 24 ft x 7.25 in concrete on grade, 115 mph, exposure C, standing 5 weeks.
H, B, T_FT = 30.0, 24.0, 7.25 / 12.0
AREA = H * B
WEIGHT = 150.0 * T_FT * AREA  # 150 pcf, ASCE 7 Table C3.1-2, from memory
KZ_30 = 2.01 * (30.0 / 900.0) ** (2.0 / 9.5)  # Table 26.10-1 note 1, Table 26.11-1 C (text)
CF = 1.55 + (B / H - 0.5) / (1.0 - 0.5) * (1.45 - 1.55)  # Fig. 29.3-1 s/h 1, B/s 0.5-1, secondary
G = 0.85  # ASCE 7-16 §26.11.1 rigid, secondary
LEVER = 0.55 * H  # Fig. 29.3-1 note: 0.05 h above the centre for s/h = 1, secondary
RESISTING = 0.6 * WEIGHT * T_FT / 2.0  # 0.6D (ASCE 7-16 §2.4.1), W t/2 about the toe (statics)


def _json(capsys, args) -> dict:
    code = cli.main(list(args) + ["--json"])
    record = json.loads(capsys.readouterr().out)
    assert code == exit_code_of(record)
    return record


@pytest.fixture(scope="module")
def quick() -> dict:
    """The §8 record of the 30 x 24 ft panel (computed once for the module)."""
    out = io.StringIO()
    with contextlib.redirect_stdout(out):
        assert cli.main(PANEL + ["--json"]) == 1  # it cannot stand unbraced (design.md §8a)
    return json.loads(out.getvalue())


def test_panel_json_carries_every_key_of_the_contract(quick):
    assert TOP_KEYS <= set(quick)
    assert WIND_KEYS <= set(quick["wind"])
    assert UNBRACED_KEYS <= set(quick["unbraced"])
    assert quick["braces"] is None  # no --braces
    assert quick["basis"] == "ASD"
    assert quick["caution"].startswith("CAUTION")
    assert quick["flags"], "a wall failing unbraced carries a flag"
    for flag in quick["flags"]:
        assert {"code", "severity", "message"} <= set(flag)
        assert flag["severity"] in ("danger", "warning", "notice")
        assert flag["code"] and flag["message"]


def test_panel_json_design_wind_follows_the_method(quick):
    w = quick["wind"]
    assert w["basic_speed_mph"] == 115.0
    assert w["period_factor"] == 0.75  # < 6 weeks, ASCE 37-14 Table 6.2-1, from memory
    assert w["design_speed_mph"] == pytest.approx(0.75 * 115.0, rel=1e-12)  # 86.25 mph
    assert w["kz"] == pytest.approx(0.98, abs=0.005)  # Table 26.10-1 C at 30 ft, secondary
    assert w["kz"] == pytest.approx(KZ_30, rel=1e-12)
    assert (w["kd"], w["kzt"], w["ke"], w["gust_factor"]) == (0.85, 1.0, 1.0, 0.85)  # secondary
    q_h = 0.00256 * KZ_30 * 1.0 * 0.85 * 1.0 * 86.25**2  # ASCE 7-16 Eq. 26.10-1, secondary
    assert w["velocity_pressure_psf"] == pytest.approx(q_h, rel=1e-12)
    assert w["force_coefficient"] == pytest.approx(CF, rel=1e-12)  # 1.49
    assert w["opening_factor"] == 1.0
    force = max(q_h * G * CF * AREA, 16.0 * AREA)  # Eq. 29.3-1; §29.7 16 psf, from memory
    assert w["force_lb"] == pytest.approx(force, rel=1e-12)
    assert w["resultant_height_ft"] == pytest.approx(LEVER, rel=1e-12)
    assert quick["weight_lb"] == pytest.approx(WEIGHT, rel=1e-12)  # 65,250 lb


def test_panel_json_unbraced_utilization_by_hand(quick):
    w = quick["wind"]
    demand = 0.6 * w["force_lb"] * LEVER  # 0.6W, ASCE 7-16 §2.4.1
    assert quick["unbraced"]["utilization"] == pytest.approx(demand / RESISTING, rel=1e-12)
    assert quick["unbraced"]["stands"] is False
    assert quick["status"] == "needs_braces"
    assert "fails-unbraced" in [f["code"] for f in quick["flags"]]


def test_working_limit_speed_brings_overturning_to_utilization_one(quick):
    v = quick["unbraced"]["working_limit_speed_mph"]
    q = 0.00256 * KZ_30 * 1.0 * v**2  # observed gust: Kd 1.0, no period factor, no minimum (§3)
    moment = 1.0 * q * G * CF * AREA * LEVER  # 1.0W as a service load (design.md §3)
    assert moment / RESISTING == pytest.approx(1.0, abs=1e-6)  # 0.6D resisting
    sliding = 1.0 * q * G * CF * AREA / (0.6 * 0.6 * WEIGHT)  # mu 0.6, ACI 318-19 §22.9.4.2
    assert sliding < 1.0  # overturning governs
    assert quick["working_limit_speed_mph"] == v  # unbraced: the wall's own speeds


def test_stand_down_speed_is_the_ratio_times_the_working_limit(quick):
    u = quick["unbraced"]
    assert u["stand_down_speed_mph"] == pytest.approx(0.8 * u["working_limit_speed_mph"],
                                                      rel=1e-12)  # team's default ratio 0.8
    assert quick["stand_down_speed_mph"] == u["stand_down_speed_mph"]


def test_max_unbraced_height_by_hand(quick):
    # At 3.1 ft, q_15 G Cf = 13.7 x 0.85 x 1.32 = 15.4 psf < 16 psf: the minimum governs and the
    # height solves 0.6 x 16 A x 0.55 h = 0.6 W t/2 with W = w_face A.
    face = 150.0 * T_FT
    assert quick["unbraced"]["max_height_ft"] == pytest.approx(face * T_FT / 2.0 / (16.0 * 0.55),
                                                               rel=1e-9)
    assert quick["unbraced"]["max_height_at_limit_ft"] is None  # no --limit-speed


def test_max_height_at_a_limit_gust_by_hand(capsys):
    got = _json(capsys, PANEL + ["--limit-speed", "20mph"])
    h = got["unbraced"]["max_height_at_limit_ft"]
    assert 12.0 < h < 30.0  # B/s between 0.8 and 2: Cases A and B only
    kz = 2.01 * (max(h, 15.0) / 900.0) ** (2.0 / 9.5)  # Table 26.10-1 note 1
    row_b_over_s = [0.5, 1.0, 2.0]
    row_cf = [1.55, 1.45, 1.40]  # Figure 29.3-1, s/h = 1, secondary
    cf = float(np.interp(B / h, row_b_over_s, row_cf))
    q = 0.00256 * kz * 1.0 * 20.0**2  # Kd 1.0, observed gust (design.md §3)
    moment = q * G * cf * B * h * 0.55 * h  # 1.0W
    resisting = 0.6 * 150.0 * T_FT * B * h * T_FT / 2.0  # 0.6D
    assert moment / resisting == pytest.approx(1.0, abs=1e-6)


def test_the_sixteen_psf_minimum_governs_a_low_design_wind(capsys):
    got = _json(capsys, PANEL[:-6] + ["--wind", "60mph"])
    w = got["wind"]
    assert w["velocity_pressure_psf"] * G * CF < 16.0
    assert w["force_lb"] == pytest.approx(16.0 * AREA, rel=1e-12)  # ASCE 7-16 §29.7, from memory
    assert w["minimum_pressure_governs"] is True


def test_period_factor_set_directly(capsys):
    got = _json(capsys, PANEL[:-2] + ["--period-factor", "0.8"])
    assert got["wind"]["period_factor"] == 0.8
    assert got["wind"]["design_speed_mph"] == pytest.approx(92.0, rel=1e-12)


def test_lrfd_basis_on_request(capsys):
    got = _json(capsys, PANEL + ["--basis", "LRFD"])
    assert got["basis"] == "LRFD"
    demand = 1.0 * got["wind"]["force_lb"] * LEVER  # 0.9D + 1.0W, ASCE 7-16 §2.3.1
    resisting = 0.9 * WEIGHT * T_FT / 2.0
    assert got["unbraced"]["utilization"] == pytest.approx(demand / resisting, rel=1e-12)


@pytest.mark.parametrize(("material", "face_psf"), [("masonry", 36.0), ("framed", 6.0)])
def test_default_weights_of_masonry_and_framed_walls(capsys, material, face_psf):
    # 8 in hollow CMU 36 psf and 2x4 sheathed wall 6 psf: HUD RSDG Table 3.2, secondary.
    got = _json(capsys, ["panel", "--height", "6ft", "--width", "20ft", "--thickness", "7.625in",
                         "--wind", "115mph", "--material", material])
    assert got["weight_lb"] == pytest.approx(face_psf * 6.0 * 20.0, rel=1e-12)


def test_panel_with_braces_fills_the_braces_record(capsys):
    got = _json(capsys, PANEL + ["--braces", "2", "--insert-height", "20ft", "--brace-angle",
                                 "55deg", "--brace-capacity", "8000lbf"])
    braces = got["braces"]
    assert BRACES_KEYS <= set(braces)
    assert braces["count"] == 2 and braces["insert_height_ft"] == 20.0
    theta = math.radians(55.0)
    assert braces["anchor_distance_ft"] == pytest.approx(20.0 / math.tan(theta), rel=1e-12)
    assert braces["length_ft"] == pytest.approx(20.0 / math.sin(theta), rel=1e-12)
    assert braces["anchor_uplift_lb"] == pytest.approx(braces["axial_force_lb"] * math.sin(theta),
                                                       rel=1e-12)
    assert braces["anchor_shear_lb"] == pytest.approx(braces["axial_force_lb"] * math.cos(theta),
                                                      rel=1e-12)
    assert braces["utilization"] == pytest.approx(braces["axial_force_lb"] / 8000.0, rel=1e-12)


def test_panel_text_output_starts_and_ends_with_the_caution(capsys):
    assert cli.main(PANEL) == 1  # the wall cannot stand unbraced: exit 1 (design.md §8a)
    out = capsys.readouterr().out.strip().splitlines()  # folded to 100 columns: two lines
    assert out[0].startswith("CAUTION") and out[-2].startswith("CAUTION")
    assert " ".join(" ".join(out[-2:]).split()) == CAUTION


def test_panel_end_to_end(helpers):
    done = helpers.run_bracing(*PANEL, "--json")
    assert done.returncode == 1, done.stderr  # fails unbraced (design.md §8a)
    assert TOP_KEYS <= set(json.loads(done.stdout))


def test_panel_bad_flag_end_to_end_has_no_traceback(helpers):
    done = helpers.run_bracing(*PANEL[:2], "30kg", *PANEL[3:], "--exposure", "E")
    assert done.returncode == 2 and done.stdout == ""
    assert "--height" in done.stderr and "--exposure" in done.stderr
    assert "Traceback" not in done.stderr


def test_a_missing_required_flag_is_an_argparse_error(capsys):
    with pytest.raises(SystemExit) as caught:
        cli.main(["panel", "--height", "30ft"])
    assert caught.value.code == 2
    assert "--width" in capsys.readouterr().err


def test_schema_is_valid_json_with_the_top_level_keys(capsys):
    assert cli.main(["schema"]) == 0
    schema = json.loads(capsys.readouterr().out)
    assert schema["type"] == "object"
    assert {"version", "site", "rules", "materials", "panels"} <= set(schema["properties"])
    assert {"site", "materials", "panels"} <= set(schema["required"])
    assert schema["additionalProperties"] is False  # unknown keys are errors
    height = schema["$defs"]["Panel"]["properties"]["height"]
    assert {"type": "number"} in height["anyOf"] and {"type": "string"} in height["anyOf"]
    assert "ft" in height["description"]


@pytest.mark.parametrize("ratio", ["5", "0", "-1"])
def test_a_stand_down_ratio_outside_0_to_1_is_refused(capsys, ratio):
    assert cli.main(PANEL + [f"--stand-down-ratio={ratio}"]) == 2
    assert "--stand-down-ratio" in capsys.readouterr().err


def test_a_negative_value_is_read_after_an_equals_sign(capsys):
    # argparse reads "--ground-elevation -282ft" as two flags; "=" keeps the value (Death Valley).
    got = _json(capsys, PANEL + ["--ground-elevation=-282ft"])
    assert got["wind"]["ke"] == pytest.approx(math.exp(-0.0000362 * -282.0), rel=1e-12)
