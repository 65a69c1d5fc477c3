"""Nothing nonsensical reaches a verdict, no input gives a traceback, no save or output leaves the
user without their site file (issue 16).

Each reproducer of the issue is a test here: a wrong input exits 2 with a message naming the
file, item and field, never a traceback and never the last-line guard's "internal error". The
ranges are the method notes §9 (the team's plausibility limits, `common practice`); the unit
definitions are NIST SP 811 Appendix B (exact by definition, from memory).
"""

from __future__ import annotations

import json
import math
import os
import signal
import subprocess
import sys
import tomllib
from pathlib import Path

import pytest
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st

from bracing import cli, model, scenario, schedule, units
from bracing.model import Site

REPO = Path(__file__).resolve().parents[1]

# A small site: a braced tilt-up panel on a wall line with a helical foot anchor, a masonry
# wall, a rule the site sets, a forecast. Every reproducer changes one line of it.
SITE = """\
version = 1

[site]
name = "Robust yard"
start_date = 2026-03-02
basic_wind_speed = "115 mph"
exposure = "C"

[rules.stand_down_ratio]
value = 0.8
source = "test rule"

[forecast]
file = "forecast.csv"

[materials.tilt]
kind = "concrete"
unit_weight = "150 pcf"

[materials.cmu8]
kind = "masonry"
face_weight = "36 psf"

[brace_types.adjustable]
kind = "rated"
lengths = ["24 ft", "40 ft"]
loads = ["7200 lb", "3400 lb"]
tension_capacity = "3400 lb"

[anchor_types.helix]
kind = "helical"
installation_torque = "4000 ft*lbf"
torque_factor = 10.0

[[lines]]
name = "north"
start = [0, 0]
end = [100, 0]
braced_side = "left"

[[panels]]
mark = "P-1"
material = "tilt"
width = "24 ft"
height = "30 ft"
thickness = "7.25 in"
line = "north"
lift_day = 1
[panels.bracing]
brace_type = "adjustable"
foot_anchor = "helix"
count = 2
insert_height = "20 ft"
angle = "55 deg"

[[panels]]
mark = "M-1"
material = "cmu8"
width = "40 ft"
height = "6 ft"
thickness = "7.625 in"
mortar_age = "2 days"
lift_day = 2
"""
FORECAST = "day,gust_mph,storm\n1,20,no\n2,25,no\n"

PANEL = ["panel", "--height", "30ft", "--width", "24ft", "--thickness", "7.25in",
         "--wind", "115mph"]


@pytest.fixture
def site(tmp_path) -> Path:
    """The site and its forecast in a temporary folder."""
    (tmp_path / "forecast.csv").write_text(FORECAST, encoding="utf-8")
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    return path


def run(capsys, *argv) -> tuple[int, str]:
    """`bracing ARGV` in this process: its exit code and what it wrote to stderr."""
    try:
        code = cli.main([str(a) for a in argv])
    except SystemExit as exc:  # argparse's own refusals
        code = exc.code
    err = capsys.readouterr().err
    return code, err


def refused(code: int, err: str, *words: str) -> None:
    """Exit 2 with a message, not a traceback, not the last-line guard; `words` in it."""
    assert code == 2, err
    assert "Traceback" not in err and "internal error" not in err, err
    for word in words:
        assert word in err, err


def changed(site: Path, old: str, new: str) -> Path:
    text = site.read_text(encoding="utf-8")
    assert text.count(old) == 1, old
    site.write_text(text.replace(old, new), encoding="utf-8")
    return site


def test_the_base_site_is_valid_and_checked(site, capsys):
    code, err = run(capsys, "check", site)
    assert code in (0, 1) and not err


# --- non-finite or wrong-kind values never reach the verdicts -------------------------------------
@pytest.mark.parametrize(("old", "new", "words"), [
    ('[rules.stand_down_ratio]\nvalue = 0.8',
     '[rules.minimum_design_wind_mph]\nvalue = nan', ("minimum_design_wind_mph", "finite")),
    ('[rules.stand_down_ratio]\nvalue = 0.8',
     '[rules.masonry_initial_speed_mph]\nvalue = inf', ("masonry_initial_speed_mph", "finite")),
    ('[rules.stand_down_ratio]\nvalue = 0.8',
     '[rules.masonry_intermediate_speed_mph]\nvalue = nan', ("masonry_intermediate",)),
    ('[rules.stand_down_ratio]\nvalue = 0.8',
     '[rules.minimum_design_wind_mph]\nvalue = 5000', ("minimum_design_wind_mph", "at most 300")),
    ('[rules.stand_down_ratio]\nvalue = 0.8',
     '[rules.stand_down_ratio]\nvalue = "nan"', ("stand_down_ratio",)),
    ('basic_wind_speed = "115 mph"', 'basic_wind_speed = "3 s"', ("basic_wind_speed", "speed")),
    ('height = "30 ft"', 'height = "2 s**2"', ("P-1", "height", "not a length")),
    ('torque_factor = 10.0', 'torque_factor = inf', ("helix", "torque_factor", "finite")),
    ('version = 1', 'version = -1', ("version",)),
    ('lift_day = 1', 'lift_day = 100000000', ("P-1", "lift_day", "3650")),
    ('basic_wind_speed = "115 mph"', 'basic_wind_speed = "2**2000 mph"', ("basic_wind_speed",)),
    ('basic_wind_speed = "115 mph"', 'basic_wind_speed = "9**9**9 mph"', ("basic_wind_speed",)),
    ('basic_wind_speed = "115 mph"', 'basic_wind_speed = "400 mph"', ("basic_wind_speed", "300")),
    ('basic_wind_speed = "115 mph"', 'basic_wind_speed = ' + "1" * 5000, ("too long",)),
    ('basic_wind_speed = "115 mph"', 'basic_wind_speed = ' + "1" * 400, ("basic_wind_speed",)),
    ('basic_wind_speed = "115 mph"', 'basic_wind_speed = ' + "[" * 3000 + "]" * 3000,
     ("nested too deeply",)),
    ('start = [0, 0]', 'start = [inf, 0]', ("line north", "start")),
    ('start = [0, 0]', 'start = [1e308, 0]', ("line north", "start")),
    ('height = "30 ft"', 'height = "1e308 ft"', ("P-1", "height", "plausible range")),
    ('height = "30 ft"', 'height = "250 ft"', ("P-1", "height", "200")),
    ('count = 2', 'count = 51', ("count", "50")),
    ('start_date = 2026-03-02', 'start_date = 9999-12-31', ("start_date",)),
    ('mortar_age = "2 days"', 'mortar_age = "1e6 days"', ("M-1", "mortar_age")),
    # found by the fuzz test below: a zero length in a rated table reached the engine
    ('lengths = ["24 ft", "40 ft"]', 'lengths = [0, "40 ft"]', ("adjustable", "positive")),
])
def test_a_nonsensical_site_value_exits_2_naming_the_field(site, capsys, old, new, words):
    code, err = run(capsys, "check", changed(site, old, new))
    refused(code, err, str(site), *words)


def test_a_byte_order_mark_is_accepted_and_kept_by_a_save(site, capsys):
    site.write_bytes(b"\xef\xbb\xbf" + SITE.encode("utf-8"))
    code, err = run(capsys, "check", site)
    assert code in (0, 1) and not err
    loaded = scenario.load(site)
    loaded.with_value(("panels", 0, "height"), "31 ft").save()
    saved = site.read_bytes()
    assert saved.startswith(b"\xef\xbb\xbf") and saved.count(b"\xef\xbb\xbf") == 1
    assert b'height = "31 ft"' in saved


@pytest.mark.parametrize(("row", "words"), [
    ("1,0.5 s,no", ("forecast.csv:2", "not a speed")),
    ("100000000,20,no", ("forecast.csv:2", "3,650")),
    ("1," + "9" * 300_000 + ",no", ("forecast.csv:2", "CSV")),
    ("1,2**2000 mph,no", ("forecast.csv:2",)),
    ("1,nan,no", ("forecast.csv:2", "finite")),
    ("1,500 mph,no", ("forecast.csv:2", "300")),
    ("2040-01-01,20,no", ("forecast.csv:2", "3,650")),  # day 5,054 of a job from 2026-03-02
    ("1,2 0,no", ("forecast.csv:2",)),  # not 0 mph: two numbers side by side are a slip
])
def test_a_nonsensical_forecast_row_exits_2_naming_the_line(site, capsys, row, words):
    header = "date,gust_mph,storm" if row.startswith("2040") else "day,gust_mph,storm"
    (site.parent / "forecast.csv").write_text(f"{header}\n{row}\n", encoding="utf-8")
    code, err = run(capsys, "check", site)
    refused(code, err, *words)


def test_a_nul_byte_in_the_forecast_is_named(site, capsys):
    (site.parent / "forecast.csv").write_bytes(b"day,gust_mph\n1,2\x000\n")
    refused(*run(capsys, "check", site), "forecast.csv:2")


@pytest.mark.parametrize("which", ["site", "forecast"])
def test_a_pipe_as_the_site_file_or_forecast_is_refused_without_waiting(site, which):
    """A FIFO nobody writes to would block a plain read forever: it is refused as not a regular
    file. Run as a child with a timeout, so a regression fails instead of hanging the suite."""
    target = site if which == "site" else site.parent / "forecast.csv"
    target.unlink()
    os.mkfifo(target)
    done = subprocess.run([sys.executable, "-m", "bracing.cli", "check", str(site)],
                          capture_output=True, text=True, cwd=REPO, timeout=60, check=False)
    refused(done.returncode, done.stderr, "not a regular file")


def test_a_folder_as_the_site_file_is_refused(tmp_path, capsys):
    refused(*run(capsys, "check", tmp_path), "not a regular file")


# --- flags ----------------------------------------------------------------------------------------
@pytest.mark.parametrize(("flags", "words"), [
    (["--wind=1 day"], ("--wind", "not a speed")),
    (["--wind=3 s"], ("--wind", "not a speed")),
    (["--wind=2**2000 mph"], ("--wind",)),
    (["--wind=1e999"], ("--wind", "finite")),
    (["--height=1e308 ft"], ("--height", "plausible range")),
    (["--height=2 s**2"], ("--height", "not a length")),
    (["--braces", "2", "--insert-height", "20ft", "--brace-angle", "55deg", "--brace-capacity="],
     ("--brace-capacity", "empty")),
    (["--kzt=--"], ("--kzt",)),
    (["--kzt="], ("--kzt", "empty")),
    (["--kzt=nan"], ("--kzt", "finite")),
    (["--wind=2 0"], ("--wind",)),
    (["--exposure="], ("--exposure",)),
    (["--braces=99999999999999999999", "--insert-height", "20ft", "--brace-angle", "55deg"],
     ("--braces",)),
    (["--duration=1e9 weeks"], ("--duration",)),
])
def test_a_nonsensical_flag_exits_2_naming_it(capsys, flags, words):
    base = [a for a in PANEL]
    for flag in flags:  # a flag given here replaces the base's
        name = flag.split("=")[0]
        if name in base:
            k = base.index(name)
            del base[k:k + 2]
    refused(*run(capsys, *base, *flags), *words)


def test_an_empty_site_file_name_is_refused(capsys):
    refused(*run(capsys, "check", ""), "empty")


# --- outputs never replace their inputs -----------------------------------------------------------
@pytest.mark.parametrize("name", ["site.toml", "forecast.csv", "site.toml.bak", "forecast.csv.bak"])
def test_an_output_onto_an_input_is_refused_and_the_input_unchanged(site, capsys, name):
    (site.parent / "site.toml.bak").write_text("the backup", encoding="utf-8")
    before = {p.name: p.read_bytes() for p in site.parent.iterdir()}
    code, err = run(capsys, "schedule", site, "--format", "text", "-o", site.parent / name)
    refused(code, err, "input of this run")
    assert {p.name: p.read_bytes() for p in site.parent.iterdir()} == before


def test_an_output_through_a_link_to_the_site_file_is_refused(site, capsys):
    link = site.parent / "link.txt"
    link.symlink_to(site)
    refused(*run(capsys, "schedule", site, "--format", "text", "-o", link), "input of this run")
    assert site.read_text(encoding="utf-8") == SITE and link.is_symlink()


def test_an_output_onto_a_link_writes_through_it_and_keeps_the_link(site, capsys):
    real = site.parent / "real.txt"
    real.write_text("old", encoding="utf-8")
    link = site.parent / "link.txt"
    link.symlink_to(real)
    code, _ = run(capsys, "schedule", site, "--format", "text", "-o", link)
    assert code in (0, 1) and link.is_symlink() and "P-1" in real.read_text(encoding="utf-8")
    assert (site.parent / "real.txt.bak").read_text(encoding="utf-8") == "old"


def test_an_output_onto_a_folder_or_a_device_is_refused_and_left_alone(site, capsys):
    folder = site.parent / "out"
    folder.mkdir()
    (folder / "keep.txt").write_text("kept", encoding="utf-8")
    refused(*run(capsys, "schedule", site, "-o", folder), "is a folder")
    refused(*run(capsys, "schedule", site, "-o", "."), "is a folder")
    assert [p.name for p in folder.iterdir()] == ["keep.txt"]
    assert not (site.parent / "out.bak").exists()
    pipe = site.parent / "pipe"
    os.mkfifo(pipe)
    refused(*run(capsys, "plan", site, "-o", pipe), "not a regular file")


def test_an_output_into_a_missing_folder_is_refused_not_created(site, capsys):
    refused(*run(capsys, "schedule", site, "-o", site.parent / "new" / "s.html"),
            "does not exist")
    assert not (site.parent / "new").exists()


def test_a_write_error_is_exit_2_with_its_reason(site, capsys):
    name = site.parent / ("x" * 300 + ".html")  # longer than a file name can be (255 bytes)
    refused(*run(capsys, "schedule", site, "-o", name), "too long")


def test_an_output_is_written_atomically_beside_its_previous_version(site, capsys):
    out = site.parent / "day.txt"
    out.write_text("old schedule", encoding="utf-8")
    code, _ = run(capsys, "schedule", site, "--format", "text", "--day", "1", "-o", out)
    assert code in (0, 1)
    assert "P-1" in out.read_text(encoding="utf-8")
    assert (site.parent / "day.txt.bak").read_text(encoding="utf-8") == "old schedule"
    assert not list(site.parent.glob(f"*{scenario.TEMP_SUFFIX}"))


# --- the last line of defence ---------------------------------------------------------------------
def test_an_unexpected_failure_is_an_internal_error_with_a_log(site, capsys, monkeypatch,
                                                                 tmp_path):
    def broken(*args, **kwargs):
        raise ZeroDivisionError("a bug")

    monkeypatch.setattr(cli, "evaluate", broken)
    monkeypatch.setenv("TMPDIR", str(tmp_path))
    import tempfile
    monkeypatch.setattr(tempfile, "tempdir", None)  # read TMPDIR again
    code, err = run(capsys, "check", site)
    assert code == 2 and "internal error, please report" in err and "Traceback" not in err
    logs = list(tmp_path.glob("bracing-internal-error-*.log"))
    assert len(logs) == 1 and str(logs[0]) in err
    assert "ZeroDivisionError: a bug" in logs[0].read_text(encoding="utf-8")


# --- units of the field's own kind ----------------------------------------------------------------
@pytest.mark.parametrize(("text", "kind"), [
    ("3 s", "speed"), ("0.5 s", "speed"), ("1 day", "speed"), ("2 s**2", "length"),
    ("1 s", "force"), ("2 kg*s", "force"), ("3 kg", "speed"), ("5 kg", "length"),
    ("1 kg/s", "force"), ("4 s", "pressure"), ("2**2000 mph", "speed"), ("9**9**9 mph", "speed"),
    ("(9**9)**9 mph", "speed"), ("1e400 mph", "speed"), ("x" * 101, "length"),
])
def test_a_unit_of_another_kind_is_refused(text, kind):
    with pytest.raises(units.UnitError):
        units.parse(text, kind)


@pytest.mark.parametrize(("text", "kind", "expected", "source"), [
    # A mass written for a weight is read as its weight under standard gravity, the trade's
    # way of writing loads (team's reading): NIST SP 811 App. B, exact definitions, from memory.
    ("1000 kg", "force", 1000.0 / 0.45359237, "1000 kg / 0.45359237 kg per lb = 2204.62 lbf"),
    ("2 t", "force", 2000.0 / 0.45359237, "metric ton = 1000 kg: 4409.25 lbf"),
    ("150 lb/ft**3", "unit_weight", 150.0, "pound mass per cubic foot = pcf"),
    ("50 kg/m**2", "pressure", 50.0 / 0.45359237 * 0.3048**2,
     "50 kg/m^2 = 110.23 lb / 10.764 ft^2 = 10.24 psf"),
])
def test_a_mass_written_for_a_weight_is_read_as_its_weight(text, kind, expected, source):
    assert units.parse(text, kind) == pytest.approx(expected, rel=1e-9), source


# --- ranges in one place, stated in the schema ----------------------------------------------------
def _bounded(metadata) -> bool:
    """An upper bound (le/lt) or the quantity factory's kind range among `metadata`."""
    metadata = [n for m in metadata for n in (m, *getattr(m, "metadata", ()))]  # Field(le=...)
    return any(isinstance(m, model._QuantitySchema) or getattr(m, "le", None) is not None
               or getattr(m, "lt", None) is not None for m in metadata)


def _unbounded_numbers(cls, seen: set):
    """'Model.field' of every int or float reachable from `cls` with no upper bound."""
    import typing

    if cls in seen:
        return
    seen.add(cls)
    for name, info in cls.model_fields.items():
        todo = [(info.annotation, _bounded(info.metadata))]
        while todo:
            kind, bounded = todo.pop()
            if isinstance(kind, type) and issubclass(kind, model.Strict):
                yield from _unbounded_numbers(kind, seen)
            elif kind in (int, float) and not bounded:
                yield f"{cls.__name__}.{name}"
            bounded = bounded or _bounded(getattr(kind, "__metadata__", ()))
            origin = getattr(kind, "__origin__", None)
            todo.extend((a, bounded) for a in (typing.get_args(kind)
                                               if not hasattr(kind, "__metadata__")
                                               else (origin,)) if a is not type(None))


def test_every_number_field_of_the_site_model_has_an_upper_bound():
    """A quantity has its kind's range from the factory; a plain int or float needs its own
    `le`/`lt` (method notes §9): a field added without one fails here. A rule's value is ranged
    by RULE_RANGES, the version by reference_problems (too new)."""
    unbounded = set(_unbounded_numbers(Site, set())) - {"Rule.value", "Site.version"}
    assert unbounded == set()


def test_every_rule_has_a_range():
    assert set(model.RULE_RANGES) == set(model.DEFAULT_RULES)
    for name, rule in model.DEFAULT_RULES.items():
        low, high = model.RULE_RANGES[name]
        assert low < rule.value <= high, name


def test_the_schema_states_the_ranges(capsys):
    assert cli.main(["schema"]) == 0
    defs = json.loads(capsys.readouterr().out)["$defs"]
    panel = defs["Panel"]["properties"]
    assert panel["height"]["maximum"] == 200 and panel["height"]["exclusiveMinimum"] == 0
    assert panel["lift_day"]["anyOf"][0]["maximum"] == 3650
    assert defs["SiteInfo"]["properties"]["basic_wind_speed"]["maximum"] == 300
    assert defs["Bracing"]["properties"]["count"]["maximum"] == 50
    assert defs["Opening"]["properties"]["x"]["maximum"] == 30000  # the length kind's bound


def test_the_ranges_refuse_no_real_job():
    """The demo sites, each a real kind of job, are inside every range."""
    for path in sorted((REPO / "scenarios").glob("*.toml")):
        scenario.load(path)


# --- saves ----------------------------------------------------------------------------------------
def test_a_save_keeps_crlf_line_endings(tmp_path):
    path = tmp_path / "site.toml"
    path.write_bytes(SITE.replace("\n", "\r\n").encode("utf-8"))
    scenario.load(path).with_value(("panels", 0, "height"), "31 ft").save()
    saved = path.read_bytes()
    assert saved.count(b"\r\n") == SITE.count("\n") and b"\n" not in saved.replace(b"\r\n", b"")
    assert b'height = "31 ft"\r\n' in saved
    assert (tmp_path / "site.toml.bak").read_bytes() == SITE.replace("\n", "\r\n").encode()


def test_a_save_removes_the_temporary_files_killed_saves_left(tmp_path):
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    stale = [tmp_path / f".site.toml.dead{k}{scenario.TEMP_SUFFIX}" for k in range(3)]
    other = tmp_path / f".other.toml.dead{scenario.TEMP_SUFFIX}"
    for p in [*stale, other]:
        p.write_text("half a file", encoding="utf-8")
    scenario.load(path).save()
    assert not any(p.exists() for p in stale) and other.exists()


def test_a_save_hard_links_the_old_file_to_bak_and_replaces_once(tmp_path, monkeypatch):
    """The old file's own data becomes `.bak` (a link, no copy), and the target is replaced by
    one os.replace onto it: at no moment is the target missing."""
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    inode = path.stat().st_ino
    replaced = []
    real = os.replace

    def watched(src, dst):
        assert path.exists()  # before each rename the target is there
        replaced.append(Path(dst).name)
        real(src, dst)

    monkeypatch.setattr(scenario.os, "replace", watched)
    scenario.load(path).with_value(("panels", 0, "height"), "31 ft").save()
    assert replaced == ["site.toml.bak", "site.toml"]
    assert (tmp_path / "site.toml.bak").stat().st_ino == inode


def test_a_save_after_one_stopped_between_its_link_and_its_replace_leaves_no_litter(tmp_path):
    """A save stopped after the old file was linked to `.bak` leaves `.bak` and the target one
    file; rename between two names of one file does nothing (POSIX rename), so the next save
    must remove its own link."""
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    os.link(path, tmp_path / "site.toml.bak")
    scenario.load(path).with_value(("panels", 0, "height"), "31 ft").save()
    assert sorted(p.name for p in tmp_path.iterdir()) == ["site.toml", "site.toml.bak"]
    assert (tmp_path / "site.toml.bak").read_text(encoding="utf-8") == SITE


def test_a_save_copies_to_bak_where_links_fail(tmp_path, monkeypatch):
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")

    def no_links(*args):
        raise OSError(1, "Operation not permitted")

    monkeypatch.setattr(scenario.os, "link", no_links)
    scenario.load(path).with_value(("panels", 0, "height"), "31 ft").save()
    assert (tmp_path / "site.toml.bak").read_text(encoding="utf-8") == SITE


def test_a_save_as_a_folder_or_into_a_missing_folder_changes_nothing(tmp_path):
    path = tmp_path / "site.toml"
    path.write_text(SITE, encoding="utf-8")
    edited = scenario.load(path).with_value(("panels", 0, "height"), "31 ft")
    for target in (tmp_path, tmp_path / "missing" / "site.toml", Path(".")):
        with pytest.raises(scenario.WriteRefused):
            edited.save(target)
    assert edited.edits and edited.path == path
    assert sorted(p.name for p in tmp_path.iterdir()) == ["site.toml"]


def _save_forever(path: Path, texts: tuple[str, str]) -> None:
    """The child: save the two versions in turn until killed."""
    k = 0
    while True:
        scenario.atomic_write(path, texts[k % 2])
        k += 1


def test_the_site_file_survives_200_kills_during_saves(tmp_path):
    """A child process saves a small site file over and over (two versions in turn) and is
    SIGKILLed at a random moment, 200 times: the file is there and complete every time (one of
    the two versions), and so is its backup; the next save removes any temporary file left."""
    import random

    path = tmp_path / "site.toml"
    texts = (SITE, SITE.replace('"30 ft"', '"31 ft"') + "# second version\n")
    path.write_text(texts[0], encoding="utf-8")
    chance = random.Random(16)
    for _ in range(200):
        ready_r, ready_w = os.pipe()
        child = os.fork()
        if child == 0:  # pragma: no cover - the child never returns
            try:
                os.close(ready_r)
                os.write(ready_w, b"1")
                _save_forever(path, texts)
            finally:
                os._exit(0)
        os.close(ready_w)
        os.read(ready_r, 1)  # the child is saving
        os.close(ready_r)
        spin = chance.randrange(0, 20000)
        while spin:  # a random moment into the saves
            spin -= 1
        os.kill(child, signal.SIGKILL)
        os.waitpid(child, 0)
        assert path.read_text(encoding="utf-8") in texts
        backup = path.with_name("site.toml.bak")
        assert not backup.exists() or backup.read_text(encoding="utf-8") in texts
    scenario.atomic_write(path, texts[0])
    assert not list(tmp_path.glob(f".*{scenario.TEMP_SUFFIX}"))
    assert sorted(p.name for p in tmp_path.iterdir()) == ["site.toml", "site.toml.bak"]


# --- the forecast reader on its own ---------------------------------------------------------------
def test_read_forecast_reads_a_field_of_any_size_as_a_problem_not_a_crash(tmp_path):
    path = tmp_path / "f.csv"
    path.write_text("day,gust_mph\n1,\"" + "9" * 1_000_000 + "\"\n", encoding="utf-8")
    with pytest.raises(scenario.SiteFileError) as caught:
        schedule.read_forecast(path, None)
    assert all(len(p) < 500 for p in caught.value.problems)


def test_the_base_site_data_is_tomllib_readable():
    tomllib.loads(SITE)


# --- fuzzing: random site-file mutations and flag values ------------------------------------------
NONFINITE = (float("nan"), float("inf"), float("-inf"))
ODD_TEXT = ["", " ", "--", "nan", "inf", "-inf", "1e999", "3 s", "0.5 s", "1 day", "2 s**2",
            "2**2000 mph", "9**9**9 mph", "1e308 ft", "1e308", "2 0", "20 mph 5", "[/]", "kg",
            "-5 ft", "100000000", "1" * 400, "\x00", "ft**9", "1/0", "0/0 ft", "1 kg*s"]
ODD_VALUES = st.one_of(
    st.sampled_from([*NONFINITE, 1e308, -1e308, 0, -1, 0.0, 10**30, 10**400, True, False,
                     *ODD_TEXT]),
    st.floats(allow_nan=True, allow_infinity=True),
    st.integers(),
    st.text(max_size=12),
    st.lists(st.one_of(st.integers(), st.floats()), max_size=3),
    st.dictionaries(st.sampled_from(["value", "x", "kind", "file"]), st.integers(), max_size=2),
)
FUZZ = settings(max_examples=120, deadline=None, derandomize=True,
                suppress_health_check=[HealthCheck.function_scoped_fixture,
                                       HealthCheck.too_slow])


def _leaves(node, path=()):
    """The path of every value in the plain site data (tables and arrays too)."""
    if path:
        yield path
    items = node.items() if isinstance(node, dict) else \
        enumerate(node) if isinstance(node, list) else ()
    for key, child in items:
        yield from _leaves(child, (*path, key))


BASE_DATA = tomllib.loads(SITE)
PATHS = list(_leaves(BASE_DATA))


def _set(data, path, value):
    node = data
    for key in path[:-1]:
        node = node[key]
    if value is _DELETE:
        del node[path[-1]]
    else:
        node[path[-1]] = value


_DELETE = object()


def _nonfinite(value) -> bool:
    if isinstance(value, float):
        return not math.isfinite(value)
    if isinstance(value, (list, tuple)):
        return any(_nonfinite(v) for v in value)
    if isinstance(value, dict):
        return any(_nonfinite(v) for v in value.values())
    return False


def _fuzz_site(tmp_path: Path) -> Path:
    path = tmp_path / "site.toml"
    (tmp_path / "forecast.csv").write_text(FORECAST, encoding="utf-8")
    return path


@FUZZ
@given(changes=st.lists(st.tuples(st.sampled_from(PATHS),
                                  st.one_of(ODD_VALUES, st.just(_DELETE))),
                        min_size=1, max_size=3))
def test_fuzz_a_mutated_site_file_never_gives_a_traceback(tmp_path, capsys, changes):
    """Property: whatever values a site file holds, `bracing check` exits 0, 1 or 2 with no
    traceback and no internal error; a non-finite number anywhere is always exit 2 (never a
    wall reported as passing)."""
    import copy

    import tomlkit

    data = copy.deepcopy(BASE_DATA)
    for path, value in changes:
        try:
            _set(data, path, value)
        except (KeyError, IndexError, TypeError):  # an earlier change took the path away
            continue
    try:
        text = tomlkit.dumps(data)
    except Exception:  # noqa: BLE001 - a value TOML cannot hold: nothing to test
        assume(False)
    site = _fuzz_site(tmp_path)
    site.write_text(text, encoding="utf-8")
    code, err = run(capsys, "check", site)
    assert code in (0, 1, 2), err
    assert "Traceback" not in err and "internal error" not in err, err
    if _nonfinite(data):
        assert code == 2, text


@FUZZ
@given(where=st.integers(0, len(SITE)), cut=st.integers(0, 40),
       insert=st.one_of(st.sampled_from(["[", "]", "=", '"', "\\", "\ufeff", "\r", "\x00",
                                         "[[panels]]\n", "nan", "inf", "\n[site]\n", "#",
                                         "1" * 5000, "[" * 3000]),
                        st.text(max_size=8)))
def test_fuzz_garbled_site_text_never_gives_a_traceback(tmp_path, capsys, where, cut, insert):
    """Property: any cut and insertion in the file's text exits 0, 1 or 2, never a traceback."""
    site = _fuzz_site(tmp_path)
    site.write_text(SITE[:where] + insert + SITE[where + cut:], encoding="utf-8",
                    errors="surrogatepass")
    code, err = run(capsys, "check", site)
    assert code in (0, 1, 2), err
    assert "Traceback" not in err and "internal error" not in err, err


FLAGS = ["--height", "--width", "--thickness", "--wind", "--unit-weight", "--face-weight",
         "--opening-area", "--exposure", "--duration", "--period-factor", "--kzt",
         "--ground-elevation", "--footing-width", "--footing-thickness", "--mortar-age",
         "--braces", "--insert-height", "--brace-angle", "--anchor-distance",
         "--brace-capacity", "--limit-speed", "--stand-down-ratio", "--basis", "--material",
         "--units"]
FLAG_TEXT = st.one_of(st.sampled_from(ODD_TEXT + ["30ft", "20ft", "55deg", "2", "9000lb",
                                                  "0.8", "masonry", "LRFD", "si"]),
                      st.text(max_size=10))


@FUZZ
@given(flags=st.lists(st.tuples(st.sampled_from(FLAGS), FLAG_TEXT), min_size=1, max_size=4))
def test_fuzz_flag_values_never_give_a_traceback(capsys, flags):
    """Property: any values of `bracing panel`'s flags exit 0, 1 or 2, never a traceback; a
    non-finite number is always exit 2."""
    argv = list(PANEL) + [f"{flag}={value}" for flag, value in flags]
    code, err = run(capsys, *argv)
    assert code in (0, 1, 2), err
    assert "Traceback" not in err and "internal error" not in err, err
    if any(value.strip().lower() in ("nan", "inf", "-inf", "1e999") for _, value in flags):
        assert code == 2, argv
