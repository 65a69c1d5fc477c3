"""Quantities with units at the edges: units.parse, the site model and `bracing panel` flags.

Conversion factors are the exact definitions (international foot 0.3048 m, inch 25.4 mm, avoirdupois
pound 0.45359237 kg, standard gravity 9.80665 m/s^2, NIST SP 811 Appendix B, from memory).
"""

import json
import math

import pytest
from pydantic import ValidationError
from verdicts import exit_code_of

from bracing import cli, units
from bracing.model import Site

FT_M = 0.3048  # NIST SP 811 App. B, exact by definition, from memory
LBF_N = 0.45359237 * 9.80665  # pound-force in newtons, exact by definition, from memory
MPH_MS = 1609.344 / 3600.0  # mile = 5280 ft exactly, from memory

# (text, kind, value in the engine unit of design.md §3, where the value comes from)
WITH_UNITS = [
    ("31ft", "length", 31.0, "same unit"),
    ("9.5m", "length", 9.5 / FT_M, "exact definition"),
    ("7.25in", "thickness", 7.25, "same unit"),
    ("190 mm", "thickness", 190.0 / 25.4, "exact definition"),
    ("150pcf", "unit_weight", 150.0, "same unit"),
    ("23.5 kN/m^3", "unit_weight", 23.5e3 * FT_M**3 / LBF_N, "exact definition"),
    ("36psf", "pressure", 36.0, "same unit"),
    ("2 kPa", "pressure", 2e3 * FT_M**2 / LBF_N, "exact definition"),
    ("96ft^2", "area", 96.0, "same unit"),
    ("96 ft**2", "area", 96.0, "same unit"),
    ("10 m^2", "area", 10.0 / FT_M**2, "exact definition"),
    ("115mph", "speed", 115.0, "same unit"),
    ("50m/s", "speed", 50.0 / MPH_MS, "exact definition"),
    ("55deg", "angle", 55.0, "same unit"),
    ("1 rad", "angle", 180.0 / math.pi, "definition of the radian"),
    ("5weeks", "duration", 5.0, "same unit"),
    ("35 days", "duration", 5.0, "7 days a week"),
    ("3days", "age", 3.0, "same unit"),
    ("3000 psi", "stress", 3000.0, "same unit"),
    ("20 MPa", "stress", 20e6 * (FT_M / 12.0) ** 2 / LBF_N, "exact definition"),
    ("5 kip", "force", 5000.0, "kip = 1000 lbf, from memory"),
    ("10 kN", "force", 10e3 / LBF_N, "exact definition"),
    ("1000 kg", "force", 1000.0 / 0.45359237, "a mass read as its weight (team's reading)"),
    ("2000 ft*lbf", "moment", 2000.0, "same unit"),
]


@pytest.mark.parametrize(("text", "kind", "expected", "source"), WITH_UNITS)
def test_every_kind_accepts_values_with_units(text, kind, expected, source):
    assert units.parse(text, kind) == pytest.approx(expected, rel=1e-12), source


@pytest.mark.parametrize(("value", "kind"), [
    (30, "length"), (7.25, "thickness"), (150, "unit_weight"),
    (36.0, "pressure"), (115, "speed"), (55, "angle"),
    (5, "duration"), ("30", "length"), (" 30 ", "length")])
def test_a_bare_number_takes_the_documented_unit(value, kind):
    assert units.parse(value, kind) == float(value)


@pytest.mark.parametrize(
    ("value", "kind", "words"),
    [
        ("30 kg", "length", "not a length"),
        ("5 mph", "length", "not a length"),
        ("12 psf", "unit_weight", "not a unit weight"),
        ("150 pcf", "pressure", "not a pressure"),
        ("96 ft", "area", "not an area"),
        ("1 ft", "speed", "not a speed"),
        ("1 ft", "angle", "not an angle"),
        ("5 kg", "duration", "not a duration"),
        ("10 %", "length", "not a length"),
        ("2 rad", "length", "not a length"),
        ("abc", "length", "cannot read"),
        ("", "length", "cannot read"),
        (True, "length", "expected a length"),
        ([30], "length", "expected a length"),
        ("inf ft", "length", "finite"),
        ("nan", "length", "finite"),
        (math.inf, "length", "finite"),
    ],
)
def test_a_value_of_the_wrong_kind_is_refused_with_the_kind_named(value, kind, words):
    with pytest.raises(units.UnitError, match=words):
        units.parse(value, kind)


def test_unit_error_is_a_value_error():
    # pydantic turns a ValueError raised in a validator into a field error, never a traceback.
    assert issubclass(units.UnitError, ValueError)


def test_display_conversion_round_trips():
    shown, label = units.convert(30.0, "ft", "si")
    assert (shown, label) == (pytest.approx(30.0 * FT_M, rel=1e-12), "m")
    assert units.convert(30.0, "ft", "us") == (30.0, "ft")
    assert units.convert(1000.0, "lbf", "si")[0] == pytest.approx(LBF_N, rel=1e-12)


# --- Through the site model -----------------------------------------------------------------------


def _site(panel=None, material=None, site=None):
    return {
        "site": {"name": "t", "basic_wind_speed": "115 mph", **(site or {})},
        "materials": {"m": {"kind": "concrete", "unit_weight": "150 pcf", **(material or {})}},
        "panels": [{"mark": "P-1", "material": "m", "width": "24 ft", "height": "30 ft",
                    "thickness": "7.25 in", **(panel or {})}],
    }


@pytest.mark.parametrize(
    ("where", "field", "text", "expected"),
    [
        ("panel", "height", "9.144 m", 30.0),  # 30 ft exactly
        ("panel", "width", "288 in", 24.0),
        ("panel", "thickness", "184.15 mm", 7.25),
        ("panel", "opening_area", "96ft^2", 96.0),
        ("panel", "standing_time", "5weeks", 5.0),
        ("panel", "mortar_age", "3days", 3.0),
        ("panel", "face_weight", "36psf", 36.0),
        ("material", "unit_weight", "150pcf", 150.0),
        ("material", "compressive_strength", "3000 psi", 3000.0),
        ("site", "basic_wind_speed", "51.4096 m/s", 115.0),  # 115 mph exactly
        ("site", "ground_elevation", "304.8 m", 1000.0),
        ("site", "limit_speed", "20mph", 20.0),
    ],
)
def test_site_model_reads_every_quantity_field_with_units(where, field, text, expected):
    site = Site.model_validate(_site(**{where: {field: text}}))
    holder = {"panel": site.panels[0], "material": site.materials["m"], "site": site.site}[where]
    assert getattr(holder, field) == pytest.approx(expected, rel=1e-12)


def test_site_model_bare_numbers_take_the_documented_units():
    data = _site(panel={"height": 30, "width": 24, "thickness": 7.25},
                 material={"unit_weight": 150}, site={"basic_wind_speed": 115})
    site = Site.model_validate(data)
    p = site.panels[0]
    assert (p.height, p.width, p.thickness) == (30.0, 24.0, 7.25)
    assert (site.materials["m"].unit_weight, site.site.basic_wind_speed) == (150.0, 115.0)


@pytest.mark.parametrize(
    ("where", "field", "text", "loc"),
    [
        ("panel", "height", "30 kg", ("panels", 0, "height")),
        ("panel", "thickness", "7 psf", ("panels", 0, "thickness")),
        ("material", "unit_weight", "36 psf", ("materials", "m", "unit_weight")),
        ("site", "basic_wind_speed", "115 ft", ("site", "basic_wind_speed")),
        ("panel", "standing_time", "5 kg", ("panels", 0, "standing_time")),
        ("panel", "height", "inf ft", ("panels", 0, "height")),
    ],
)
def test_site_model_refuses_the_wrong_kind_and_names_the_field(where, field, text, loc):
    with pytest.raises(ValidationError) as caught:
        Site.model_validate(_site(**{where: {field: text}}))
    errors = caught.value.errors()
    assert [e["loc"] for e in errors] == [loc]
    assert repr(text) in errors[0]["msg"]


# --- Through `bracing panel` flags ----------------------------------------------------------------

BASE = ["panel", "--height", "30ft", "--width", "24ft", "--thickness", "7.25in", "--wind", "115mph"]


def _with(flag: str, value: str, extra=()) -> list[str]:
    args = list(BASE)
    if flag in args:
        args[args.index(flag) + 1] = value
    else:
        args += [flag, value]
    return args + list(extra)


def _panel_json(capsys, args) -> dict:
    code = cli.main(args + ["--json"])
    record = json.loads(capsys.readouterr().out)
    assert code == exit_code_of(record)  # design.md §8a
    return record


def test_panel_flags_in_si_units_give_the_same_answer(capsys):
    us = _panel_json(capsys, BASE)
    si = _panel_json(capsys, ["panel", "--height", "9.144m", "--width", "7.3152m", "--thickness",
                              "184.15mm", "--wind", "51.4096m/s", "--unit-weight",
                              f"{150.0 * LBF_N / FT_M**3 / 1e3!r}kN/m^3"])
    for key in ("utilization", "working_limit_speed_mph", "max_height_ft"):
        assert si["unbraced"][key] == pytest.approx(us["unbraced"][key], rel=1e-9)
    for key in ("force_lb", "velocity_pressure_psf", "design_speed_mph"):
        assert si["wind"][key] == pytest.approx(us["wind"][key], rel=1e-9)
    assert si["weight_lb"] == pytest.approx(us["weight_lb"], rel=1e-9)


def test_panel_bare_numbers_take_the_documented_units(capsys):
    bare = _panel_json(capsys, ["panel", "--height", "30", "--width", "24", "--thickness", "7.25",
                                "--wind", "115", "--duration", "5", "--unit-weight", "150"])
    with_units = _panel_json(capsys, BASE + ["--duration", "5weeks", "--unit-weight", "150pcf"])
    assert bare == with_units


def test_panel_reads_every_kind_of_flag_with_units(capsys):
    got = _panel_json(capsys, BASE + ["--opening-area", "96ft^2", "--duration", "5weeks",
                                      "--ground-elevation", "304.8m", "--limit-speed", "20mph",
                                      "--footing-width", "36in", "--footing-thickness", "1ft"])
    assert got["wind"]["solidity"] == pytest.approx(1.0 - 96.0 / 720.0, rel=1e-12)
    assert got["wind"]["period_factor"] == 0.75  # 5 weeks: ASCE 37-14 Table 6.2-1, from memory
    assert got["wind"]["ke"] == pytest.approx(math.exp(-0.0000362 * 1000.0), rel=1e-12)
    assert got["unbraced"]["max_height_at_limit_ft"] is not None


@pytest.mark.parametrize(
    ("flag", "value", "extra"),
    [
        ("--height", "30kg", ()),
        ("--width", "24mph", ()),
        ("--thickness", "7.25psf", ()),
        ("--wind", "115kg", ()),
        ("--unit-weight", "36psf", ()),
        ("--face-weight", "150pcf", ()),
        ("--opening-area", "96ft", ()),
        ("--duration", "5kg", ()),
        ("--ground-elevation", "1000mph", ()),
        ("--limit-speed", "20ft", ()),
        ("--footing-width", "3kg", ("--footing-thickness", "1ft")),
        ("--height", "10%", ()),
        ("--height", "inf", ()),
        ("--mortar-age", "3kg", ("--material", "masonry")),
    ],
)
def test_panel_refuses_the_wrong_kind_and_names_the_flag(capsys, flag, value, extra):
    assert cli.main(_with(flag, value, extra)) == 2
    captured = capsys.readouterr()
    assert flag in captured.err and value in captured.err
    assert captured.out == "" and "Traceback" not in captured.err


@pytest.mark.parametrize("angle", ["55deg", "55", f"{math.radians(55.0)!r}rad"])
def test_panel_reads_a_brace_angle_with_units(capsys, angle):
    got = _panel_json(capsys, BASE + ["--braces", "2", "--insert-height", "20ft",
                                      "--brace-angle", angle])
    assert got["braces"]["angle_deg"] == pytest.approx(55.0, rel=1e-12)
    assert got["braces"]["insert_height_ft"] == 20.0


def test_panel_refuses_a_brace_angle_of_the_wrong_kind(capsys):
    assert cli.main(BASE + ["--braces", "2", "--insert-height", "20ft", "--brace-angle",
                            "55kg"]) == 2
    assert "--brace-angle" in capsys.readouterr().err


# --- the common spellings read without pint -------------------------------------------------------


def test_the_shipped_factors_are_pints_own():
    # bracing/unit_factors.py is generated from pint (python -m bracing.units): it must not drift.
    from bracing.unit_factors import DISPLAY_FACTORS, FACTORS

    assert units.pint_factors() == (FACTORS, DISPLAY_FACTORS)


@pytest.mark.parametrize(("text", "kind"), [
    ("9.5 m", "length"), ("190mm", "thickness"), ("-2.5e3 lb", "force"), ("35 days", "duration"),
    ("23.5 kN/m^3", "unit_weight"), (".75 in", "length"), ("12", "pressure"),
    ("1E2 kPa", "pressure"),
])
def test_the_table_reads_a_value_as_pint_does(text, kind):
    unit, word = units.KINDS[kind]
    assert units.parse(text, kind) == pytest.approx(units._pint_value(text, text, unit, word),
                                                    rel=1e-15, abs=0.0)


def test_a_spelling_outside_the_table_is_read_by_pint():
    # 1 yd = 36 in exactly (NIST SP 811 App. B, from memory): 3 yd = 108 in
    assert units.parse("3 yd", "thickness") == pytest.approx(108.0, rel=1e-12)


def test_the_demo_sites_are_read_without_importing_pint():
    # pint's import and registry took longer than reading a whole 600-wall site (issue 14).
    import subprocess
    import sys
    from pathlib import Path

    code = ("import pathlib, sys; from bracing import scenario; "
            "[scenario.load(p) for p in sorted(pathlib.Path('scenarios').glob('*.toml'))]; "
            "print('pint' in sys.modules)")
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True,
                          cwd=Path(__file__).resolve().parents[1])
    assert done.stdout.strip() == "False"
