"""The safety reviewer's tools: exit codes, `check --findings` (text and HTML), the review
record in `check --json`, the limits of the check (SiteResult.not_checked) and `bracing diff`.

Exit codes are design.md §8a. The demo sites and their hidden problems are scenarios/README.md's
review exercise.
"""

import hashlib
import json
import re
import shutil
import subprocess
from datetime import UTC, datetime, timedelta
from importlib.metadata import version
from pathlib import Path

import pytest
import tomlkit

from bracing import cli, scenario
from bracing.evaluate import evaluate
from bracing.layout import ADVICE
from bracing.results import CAUTION

ROOT = Path(__file__).resolve().parents[1]
TOWNHOUSE = ROOT / "scenarios" / "townhouse-framing.toml"
MIXED = ROOT / "scenarios" / "demo-mixed.toml"
WAREHOUSE = ROOT / "scenarios" / "tilt-up-warehouse.toml"
PASSING = ROOT / "tests" / "fixtures" / "one-braced-panel.toml"


def _run(capsys, *args) -> tuple[int, str]:
    code = cli.main([str(a) for a in args])
    return code, capsys.readouterr().out


# --- exit codes (design.md §8a) ---------------------------------------------------------------


def test_check_exits_1_on_the_townhouses_with_their_dangers(helpers):
    done = helpers.run_bracing("check", TOWNHOUSE)
    assert done.returncode == 1, done.stderr
    assert "Traceback" not in done.stderr


def test_check_exits_0_on_a_site_where_every_wall_passes(capsys):
    code, out = _run(capsys, "check", PASSING)
    assert code == 0
    assert "1 braced" in out and "DANGER" not in out


def test_check_exits_2_on_a_missing_file(capsys):
    assert cli.main(["check", "missing.toml"]) == 2
    assert "missing.toml" in capsys.readouterr().err


@pytest.mark.parametrize("command", [[], ["check"], ["panel"], ["diff"], ["verify"]])
def test_every_help_states_the_exit_codes(capsys, command):
    with pytest.raises(SystemExit):
        cli.main([*command, "--help"])
    out = capsys.readouterr().out
    assert "exit codes" in out
    assert re.search(r"^\s+1\s", out, re.MULTILINE)
    assert re.search(r"^\s+2\s+bad input", out, re.MULTILINE)


def test_panel_exits_1_when_the_wall_fails_and_0_when_it_stands(capsys):
    base = ["panel", "--width", "20ft", "--thickness", "7.25in", "--wind", "115mph"]
    assert cli.main(base + ["--height", "30ft"]) == 1  # cannot stand unbraced
    assert cli.main(base + ["--height", "3ft"]) == 0   # a 3 ft curb stands on its own


def test_schedule_and_plan_exit_1_on_a_failing_site(capsys, tmp_path):
    out = tmp_path / "sheet.txt"
    assert cli.main(["schedule", str(TOWNHOUSE), "--day", "2", "--format", "text",
                     "-o", str(out)]) == 1
    assert "CAUTION" in out.read_text(encoding="utf-8").split("\n\n")[1]  # after the verdict


# --- findings --------------------------------------------------------------------------------


@pytest.fixture(scope="module")
def townhouse_findings() -> str:
    import contextlib
    import io

    out = io.StringIO()
    with contextlib.redirect_stdout(out):
        assert cli.main(["check", str(TOWNHOUSE), "--findings"]) == 1
    return out.getvalue()


def test_findings_list_the_review_exercises_problems_once_each(townhouse_findings):
    out = townhouse_findings
    findings = re.findall(r"^\d+\. (DANGER|WARNING) (.+?): (\S+)$", out, re.MULTILINE)
    codes = [code for _, _, code in findings]
    assert len(codes) == len(set(codes)), codes  # each finding once
    by_code = {code: (severity, where) for severity, where, code in findings}
    # scenarios/README.md, the answer: the early sign-off and the stakes over the gas line
    assert by_code["signoff-before-event"] == ("DANGER", "L2-R12")
    assert by_code["brace-crosses-keep-clear"] == ("DANGER", "L1-F11, L1-F12")
    severities = [s for s, _, _ in findings]
    assert severities == sorted(severities, key=["DANGER", "WARNING"].index)  # worst first
    assert "unsafe-standing" not in out  # the days restate the walls' dangers: not again


def test_findings_end_with_what_was_not_checked(townhouse_findings):
    out = townhouse_findings
    tail = out.split("NOT CHECKED for this site")[1]
    assert "framed sill fastenings" in tail and "no capacity given" in tail
    assert "seismic during construction" in tail and "ASCE 37-14" in tail
    assert "stake and deck fastening ratings" in tail and "taken from the file as given" in tail


def test_findings_are_wrapped_to_100_columns_between_cautions(townhouse_findings):
    lines = townhouse_findings.rstrip("\n").splitlines()
    assert max(len(line) for line in lines) <= 100
    assert lines[0].startswith("CAUTION") and " ".join(lines[-2:]).endswith(CAUTION[-30:])


def test_a_failing_check_carries_its_numbers_and_the_designers_fix(capsys):
    code, out = _run(capsys, "check", MIXED, "--findings")
    assert code == 1
    # D-4: its pipe brace fails in compression (the engine's figures; the form is the point)
    block = re.search(r"^\d+\. DANGER D-4: brace compression\n(.*?)(?=^\d+\. |\nNOT CHECKED)",
                      out, re.MULTILINE | re.DOTALL).group(1)
    text = " ".join(block.split())
    assert re.search(r"demand [\d,]+ lb / capacity [\d,]+ lb = utilization \d+\.\d\d", text)
    assert "[D + 0.6W]" in text and "source: AISC 360-16" in text
    assert f"suggested fix: {' '.join(ADVICE['brace compression'].split())}" in text
    utilizations = [float(u) for u in re.findall(r"= utilization (\d+\.\d+)", " ".join(
        out.split()))]
    assert utilizations == sorted(utilizations, reverse=True)  # worst first
    wall_elements = re.findall(r"^\d+\. DANGER (\S+): (.+)$", out, re.MULTILINE)
    assert len(wall_elements) == len(set(wall_elements))  # a wall's element once (worst region)


@pytest.mark.parametrize("site", [TOWNHOUSE, MIXED], ids=["townhouse", "mixed"])
def test_findings_cite_what_users_have(capsys, site):
    # house rule: outputs cite published clauses or the method notes, and say "unconfirmed
    # value" (never a file users do not have, never "from memory")
    _, out = _run(capsys, "check", site, "--findings")
    assert "design.md" not in out and "from memory" not in out
    assert "method notes §" in out


def test_findings_as_printable_html_with_an_approval_block(capsys, tmp_path):
    page = tmp_path / "review.html"
    code, _ = _run(capsys, "check", TOWNHOUSE, "--findings", "--format", "html", "-o", page)
    assert code == 1
    html = page.read_text(encoding="utf-8")
    assert html.count(CAUTION.replace("'", "&#39;")) >= 2 and "@page" in html
    for blank in ("Name", "License no.", "Date", "Signature"):
        assert f"<th>{blank}</th><td></td>" in html
    assert "signoff-before-event" in html and "framed sill fastenings" in html
    assert hashlib.sha256(TOWNHOUSE.read_bytes()).hexdigest() in html


def test_html_needs_findings(capsys):
    assert cli.main(["check", str(PASSING), "--format", "html"]) == 2


# --- the review record -----------------------------------------------------------------------


@pytest.fixture(scope="module")
def record() -> dict:
    import contextlib
    import io

    out = io.StringIO()
    with contextlib.redirect_stdout(out):
        assert cli.main(["check", str(TOWNHOUSE), "--json"]) == 1
    return json.loads(out.getvalue())


def test_the_record_keeps_every_key_and_adds_the_review(record):
    assert {"site", "basis", "basis_statement", "caution", "panels", "days",
            "peak_inventory", "review"} <= set(record)
    review = record["review"]
    assert review["tool_version"] == version("wall-bracing")
    assert review["design_basis"]["basis"] == "ASD"
    assert review["design_basis"]["risk_category"] == "II"
    assert review["fails"] is True and set(review["failing_walls"]) >= {"L1-F11", "L1-F12"}
    assert any(n["item"] == "framed sill fastenings" for n in review["not_checked"])


def test_the_record_sha256_is_that_of_sha256sum(record):
    digest = record["review"]["site_file_sha256"]
    assert digest == hashlib.sha256(TOWNHOUSE.read_bytes()).hexdigest()
    if shutil.which("sha256sum"):
        done = subprocess.run(["sha256sum", str(TOWNHOUSE)], capture_output=True, text=True,
                              check=True)
        assert done.stdout.split()[0] == digest


def test_the_record_dates_the_review_in_utc(record):
    when = datetime.fromisoformat(record["review"]["date_utc"])
    assert when.utcoffset() == timedelta(0)
    assert abs(datetime.now(UTC) - when) < timedelta(days=1)


def test_the_record_lists_the_rules_in_force_with_their_sources(record):
    rules = {r["name"]: r for r in record["review"]["rules"]}
    assert rules["masonry_unbraced_height_ft"]["source"] == "OSHA 29 CFR 1926.706(b)"
    assert rules["stand_down_ratio"]["value"] == 0.8 and rules["stand_down_ratio"]["in_force"]
    assert rules["minimum_design_wind_mph"]["in_force"] is False  # off by default
    assert rules["minimum_design_pressure_psf"]["source"] == (
        "ASCE 7-16 §29.7 (unconfirmed value: confirm in ASCE 7-16 §29.7)")


# --- what was not checked (the engine's list) ------------------------------------------------


def test_a_deadman_without_its_size_is_listed_as_not_checked(tmp_path):
    text = PASSING.read_text(encoding="utf-8").replace("count = 2", (
        'count = 2\nfoot_anchor = "block"')).replace("[[panels]]", (
            '[anchor_types.block]\nkind = "deadman"\nweight = "9000 lb"\n\n[[panels]]'))
    path = tmp_path / "deadman.toml"
    path.write_text(text, encoding="utf-8")
    items = {n.item: n for n in evaluate(scenario.load(path).site).not_checked}
    assert items["deadman toe bearing"].walls == ["P-1"]
    assert items["deadman tipping"].walls == ["P-1"]
    assert "framed sill fastenings" not in items  # a concrete panel


# --- bracing diff ----------------------------------------------------------------------------


def _revised(tmp_path, source: Path, edit) -> Path:
    doc = tomlkit.parse(source.read_text(encoding="utf-8"))
    edit(doc)
    path = tmp_path / source.name
    path.write_text(tomlkit.dumps(doc), encoding="utf-8")
    for forecast in source.parent.glob(f"{source.stem}-forecast.csv"):
        shutil.copy(forecast, tmp_path)
    return path


def test_diff_of_a_brace_removed_names_the_wall_and_exits_1(capsys, tmp_path):
    def one_brace_less(doc):
        (panel,) = [p for p in doc["panels"] if p["mark"] == "S-03"]
        panel["bracing"]["count"] = 3
        panel["bracing"]["positions"] = [3, 9.36, 22.09]

    new = _revised(tmp_path, WAREHOUSE, one_brace_less)
    code, out = _run(capsys, "diff", WAREHOUSE, new)
    assert code == 1
    changed = out.split("Changed walls")[1]
    assert re.findall(r"^  (\S+): status", changed, re.MULTILINE) == ["S-03"]
    assert "bracing.count: 4 -> 3" in changed
    before, after = map(float, re.search(
        r"governing utilization (\d+\.\d+) \(.*?\) -> (\d+\.\d+)", changed).groups())
    assert before <= 1.0 < after
    assert "WORSE x" in changed


def test_diff_exits_1_when_the_limit_falls_below_the_old_stand_down(capsys, tmp_path):
    # braces rated 20,000 -> 11,000 lb: the wall still passes at the design wind, but its
    # working limit falls by more than the stand-down margin (the ratio 0.8)
    def weaker(doc):
        doc["brace_types"]["adj"]["loads"] = ["11000 lb", "11000 lb"]

    new = _revised(tmp_path, PASSING, weaker)
    code, out = _run(capsys, "diff", PASSING, new, "--json")
    assert code == 1
    (wall,) = json.loads(out)["walls"]
    assert wall["new_utilization"] < 1.0 and wall["new_status"] == "braced"
    assert wall["new_working_limit_mph"] < wall["old_stand_down_mph"]
    assert wall["worse"] and "stand-down gust it had before" in wall["worse"][0]
    (change,) = json.loads(out)["changes"]
    assert (change["kind"], change["item"], change["field"]) == ("brace type", "adj", "loads")
    assert change["old"] == pytest.approx([20000.0] * 2)
    assert change["new"] == pytest.approx([11000.0] * 2)


def test_diff_shows_a_sign_off_moved_and_what_it_does_to_the_neighbours(capsys, tmp_path):
    # scenarios/README.md's fix of the early release: sign L2-R12 off on day 16, not 15
    def later(doc):
        (signoff,) = [s for s in doc["signoffs"] if s["panel"] == "L2-R12"]
        signoff["day"] = 16

    code, out = _run(capsys, "diff", TOWNHOUSE, _revised(tmp_path, TOWNHOUSE, later))
    assert code == 1  # the stakes over the gas line are still there
    wall = out.split("  L2-R12: ")[1].split("\n  L")[0]
    assert ("days: sign-off: day 15 by M. Aziz, PE (engineer of record) -> day 16 by M. Aziz, "
            "PE (engineer of record)") in wall
    assert "(L1-F11, L1-F12)" in out.split("Verdict:")[1]


def test_diff_of_a_file_against_itself_exits_0(capsys, tmp_path):
    same = _revised(tmp_path, PASSING, lambda doc: None)
    code, out = _run(capsys, "diff", PASSING, same)
    assert code == 0
    assert "nothing" in out and "no wall got worse" in out


def test_diff_compares_the_models_not_the_text(capsys, tmp_path):
    def same_in_other_units(doc):
        doc["panels"][0]["height"] = "288 in"  # 24 ft

    code, out = _run(capsys, "diff", PASSING, _revised(tmp_path, PASSING, same_in_other_units))
    assert code == 0 and "Changed walls" not in out


def test_diff_exits_2_on_bad_input(capsys):
    assert cli.main(["diff", str(PASSING), "missing.toml"]) == 2


# --- bracing diff of foundation walls (method notes §12) --------------------------------------

BASEMENT = ROOT / "scenarios" / "basement-duplex.toml"


def _basement(tmp_path, name: str, *edits) -> Path:
    """The basement demo with FW-E's day-7 fill cut to 2 ft (the demo's own danger, so that the
    file passes), then `edits`, in tmp_path/name."""
    def edit(doc):
        for event in doc["backfill_events"]:
            if event.get("wall") == "FW-E":
                event["height"] = "2 ft"
        for more in edits:
            more(doc)
    folder = tmp_path / name
    folder.mkdir()
    return _revised(folder, BASEMENT, edit)


def _fill(wall: str, height: str):
    def edit(doc):
        (event,) = [e for e in doc["backfill_events"] if e.get("wall") == wall]
        event["height"] = height
    return edit


def test_diff_names_a_foundation_wall_whose_fill_now_exceeds_its_allowed_height(capsys, tmp_path):
    """FW-W's day-6 fill 6 -> 7.5 ft, above what its inside braces allow that day: the diff
    names the wall, the days over and the height allowed as `bracing check` gives it for the
    new file (the diff reports the engine's values; the hand checks of the propped wall are in
    tests/validation/). Its braces take more (the earth part grows as the cube of the fill,
    method notes §12), and the height allowed does not move with the fill."""
    old = _basement(tmp_path, "old")
    new = _basement(tmp_path, "new", _fill("FW-W", "7.5 ft"))
    assert _run(capsys, "diff", old, old)[0] == 0  # the fixed demo passes
    code, out = _run(capsys, "check", new, "--json")
    (checked,) = [w for w in json.loads(out)["foundation_walls"] if w["mark"] == "FW-W"]
    allowed = next(d["allowed_height_ft"] for d in checked["days"] if d["day"] == 6)
    code, out = _run(capsys, "diff", old, new)
    assert code == 1
    section = out.split("Changed foundation walls (before -> after):")[1]
    assert re.findall(r"^  (\S+): ", section, re.MULTILINE) == ["FW-W"]
    assert "FW-W: passes -> FAILS x" in section
    assert "day 6: planned fill 6.00 ft -> 7.50 ft" in section
    assert f"WORSE x: day 6: the planned fill 7.50 ft is above the {allowed:.2f} ft allowed" \
        in section
    assert "(FW-W)" in out.split("Verdict:")[1]
    code, out = _run(capsys, "diff", old, new, "--json")
    (wall,) = json.loads(out)["foundation_walls"]
    assert (wall["old_fails"], wall["new_fails"]) == (False, True)
    assert wall["new_brace_utilization"] > 1.0 >= wall["old_brace_utilization"]
    assert wall["new_brace_force_lb"] > wall["old_brace_force_lb"]
    assert wall["new_braced_max_height_ft"] == wall["old_braced_max_height_ft"]
    assert [d["day"] for d in wall["days"] if d["new_over"]] == [6, 7, 8, 9]
    assert json.loads(out)["new_failing_foundation_walls"] == ["FW-W"]


def test_diff_exits_1_when_a_foundation_walls_limit_falls_below_its_old_stand_down(capsys,
                                                                                  tmp_path):
    # FW-S's day-4 fill 2 -> 2.6 ft, no compactor: still under the 2.73 ft it takes as a
    # cantilever, so the new file passes, but less of it stands in the wind and more earth
    # loads it: its working-limit gust falls below the stand-down gust it had
    def south(doc):
        (event,) = [e for e in doc["backfill_events"]
                    if e.get("line") == "Basement south" and e["day"] == 4]
        event["height"] = "2.6 ft"
        del event["surcharge"]
    old, new = _basement(tmp_path, "old"), _basement(tmp_path, "new", south)
    assert _run(capsys, "check", new)[0] == 0
    code, out = _run(capsys, "diff", old, new, "--json")
    assert code == 1
    (wall,) = json.loads(out)["foundation_walls"]
    assert wall["mark"] == "FW-S" and not wall["new_fails"]
    assert wall["new_working_limit_mph"] < wall["old_stand_down_mph"]
    assert "stand-down gust it had before" in wall["worse"][0]


def test_diff_lists_foundation_walls_added_removed_and_their_changed_inputs(capsys, tmp_path):
    """FW-N renamed FW-N2 (one removed, one added) and FW-W's inside braces 6 -> 8 ft apart:
    each brace takes more, P = R s / cos(theta) with R per foot of wall unchanged (method notes
    §12), so its force grows by 8 / 6 = 1.3333 (by hand, exact) and the fill the braces allow
    falls; the wall's own span, not the braces, governs its utilization (unchanged); the file
    still passes (exit 0)."""
    def rename(doc):
        (wall,) = [w for w in doc["foundation_walls"] if w["mark"] == "FW-N"]
        wall["mark"] = "FW-N2"
        (signoff,) = [s for s in doc["signoffs"] if s["panel"] == "FW-N"]
        signoff["panel"] = "FW-N2"
        (event,) = [e for e in doc["backfill_events"] if e.get("wall") == "FW-N"]
        event["wall"] = "FW-N2"

    def wider(doc):
        (wall,) = [w for w in doc["foundation_walls"] if w["mark"] == "FW-W"]
        wall["inside_braces"]["spacing"] = "8 ft"
    old, new = _basement(tmp_path, "old"), _basement(tmp_path, "new", rename, wider)
    code, out = _run(capsys, "diff", old, new)
    assert code == 0
    assert "foundation walls added: FW-N2" in out and "foundation walls removed: FW-N" in out
    wall = out.split("  FW-W: ")[1]
    assert "inside braces: inside_braces.spacing: 6.0 -> 8.0" in wall
    code, out = _run(capsys, "diff", old, new, "--json")
    record = json.loads(out)
    assert record["foundation_walls_added"] == ["FW-N2"]
    assert record["foundation_walls_removed"] == ["FW-N"]
    (wall,) = record["foundation_walls"]
    assert wall["new_brace_force_lb"] / wall["old_brace_force_lb"] == pytest.approx(8 / 6,
                                                                                  rel=1e-9)
    assert 1.0 >= wall["new_brace_utilization"] >= wall["old_brace_utilization"]
    assert wall["new_braced_max_height_ft"] < wall["old_braced_max_height_ft"]
    assert not wall["worse"]
