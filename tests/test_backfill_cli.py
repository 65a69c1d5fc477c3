"""`bracing backfill`: exit codes, the flag named in every refusal, the JSON contract
(README, method notes §12)."""

import json

import pytest

from bracing.cli import main
from bracing.results import CAUTION

WALL = ["backfill", "--height", "8ft", "--thickness", "8in", "--fc", "2500psi", "--soil", "SM",
        "--drained"]
RECORD_KEYS = {"caution", "basis", "wall", "backfill", "base_shear_plf",
               "base_moment_lb_ft_per_ft", "max_backfill_height_ft", "cantilever_utilization",
               "cantilever_checks", "inside_brace", "utilization", "passes", "flags"}


def _run(capsys, *extra):
    code = main([*WALL, *extra])
    out = capsys.readouterr()
    return code, out


def test_a_low_backfill_passes_and_a_high_one_fails(capsys):
    # 8 in plain wall, f'c 2500: max 4.64 ft at rest in SM (tests/validation, by hand)
    assert _run(capsys, "--backfill-height", "4ft")[0] == 0
    assert _run(capsys, "--backfill-height", "5ft")[0] == 1


def test_the_json_record_keeps_its_documented_keys(capsys):
    code, out = _run(capsys, "--backfill-height", "3ft", "--json")
    record = json.loads(out.out)
    assert set(record) == RECORD_KEYS
    assert record["caution"] == CAUTION
    assert record["passes"] is (code == 0)
    assert {"demand", "capacity", "utilization", "combination", "source"} <= set(
        record["cantilever_checks"][0])


def test_the_text_carries_the_caution_first_and_last(capsys):
    _, out = _run(capsys, "--backfill-height", "3ft")
    lines = out.out.strip().splitlines()
    assert lines[0] == CAUTION and lines[-1] == CAUTION


def test_units_of_another_system_are_read(capsys):
    # 0.3048 m = 1 ft exactly (NIST SP 811 App. B, from memory): 2.4384 m = 8 ft
    _, out = _run(capsys, "--backfill-height", "1.2192m", "--json")
    assert json.loads(out.out)["backfill"]["height_ft"] == pytest.approx(4.0)


@pytest.mark.parametrize("bars", [[], ["--bar", "#5", "--bar-spacing", "16in"]])
def test_fresh_masonry_fails_with_a_danger(capsys, bars):
    # method notes §12: masonry whose mortar is not cured takes no backfill, grouted and
    # reinforced or not (28 days, the team's cure rule)
    code = main(["backfill", "--height", "8ft", "--thickness", "7.625in", "--material",
                 "masonry", "--mortar-age", "3days", "--soil", "GW", "--backfill-height",
                 "1ft", "--drained", "--json", *bars])
    record = json.loads(capsys.readouterr().out)
    assert code == 1
    assert any(f["severity"] == "danger" for f in record["flags"])
    assert record["max_backfill_height_ft"] == 0.0


def test_a_failing_cantilever_is_held_by_inside_braces(capsys):
    braces = ["--brace-height", "6ft", "--brace-spacing", "4ft", "--brace-capacity", "6000lb"]
    assert _run(capsys, "--backfill-height", "6ft")[0] == 1
    code, out = _run(capsys, "--backfill-height", "6ft", *braces, "--json")
    record = json.loads(out.out)
    assert record["cantilever_utilization"] > 1.0
    assert code == 0 and record["inside_brace"]["utilization"] <= 1.0


@pytest.mark.parametrize(("extra", "flag"), [
    (["--soil", "CH", "--backfill-height", "3ft"], "--soil"),
    (["--backfill-height", "9ft"], "--backfill-height"),
    (["--backfill-height", "3ft", "--height", "3kg"], "--height"),
    (["--backfill-height", "3ft", "--brace-capacity", "5000lb"], "--brace-capacity"),
    (["--backfill-height", "3ft", "--brace-height", "5ft"], "--brace-spacing"),
    (["--backfill-height", "3ft", "--brace-height", "9ft", "--brace-spacing", "4ft",
      "--brace-capacity", "5000lb"], "--brace-height"),
    (["--backfill-height", "3ft", "--surcharge=-10psf"], "--surcharge"),
    (["--backfill-height", "3ft", "--footing-width", "0.5ft"], "--footing-width"),
])
def test_bad_input_exits_2_naming_the_flag(capsys, extra, flag):
    args = [a for a in WALL if a not in ("--drained",)]
    if "--soil" in extra:
        i = args.index("--soil")
        del args[i:i + 2]
    code = main([*args, *extra])
    err = capsys.readouterr().err
    assert code == 2
    assert flag in err


def test_water_above_the_backfill_is_refused(capsys):
    code = main([*WALL[:-1], "--backfill-height", "3ft", "--water-level", "4ft"])
    assert code == 2 and "--water-level" in capsys.readouterr().err


def test_a_reinforced_wall_needs_its_cover(capsys):
    code = main([*WALL, "--material", "reinforced", "--bar", "#5", "--bar-spacing", "12in",
                 "--backfill-height", "3ft"])
    assert code == 2 and "--cover" in capsys.readouterr().err
