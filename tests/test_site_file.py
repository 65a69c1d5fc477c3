"""Site files: bad input is reported all at once, by file, line, panel mark and field, never with a
traceback; saving keeps the user's comments and layout, is atomic and keeps a backup."""

import os

import pytest

from bracing import cli, scenario

P1_HEIGHT = 'height = "30 ft"               # top of the panel above grade'
OPENING_PAST_THE_EDGE = ('thickness = "7.25 in"\n[[panels.openings]]\nx = "20 ft"\ny = 0\n'
                         'width = "8 ft"\nheight = "10 ft"\n')

# (id, text replaced, replacement, line fragment of the problem, panel mark, field, words)
BAD_INPUTS = [
    ("zero width", 'width = "24 ft"', "width = 0", "width = 0", "P-1", "width", "greater than 0"),
    ("negative height", P1_HEIGHT, 'height = "-3 ft"', 'height = "-3 ft"', "P-1", "height",
     "greater than 0"),
    ("height in kg", P1_HEIGHT, 'height = "30 kg"', 'height = "30 kg"', "P-1", "height",
     "not a length"),
    ("unknown exposure", 'exposure = "C"', 'exposure = "E"', 'exposure = "E"', None,
     "site.exposure", "'B', 'C' or 'D'"),
    ("missing field", 'thickness = "7.25 in"\n', "", "@P-1", "P-1", "thickness", "missing"),
    ("unknown key", 'mark = "M-1"', 'mark = "M-1"\ncolour = "grey"', "colour", "M-1", "colour",
     "unknown key"),
    ("opening outside the panel", 'thickness = "7.25 in"\n', OPENING_PAST_THE_EDGE, "@P-1",
     "P-1", "opening 1", "does not fit"),
    ("unknown material", 'material = "cmu8"', 'material = "cmu12"', 'material = "cmu12"', "M-1",
     "material", "'cmu12' is not in [materials]"),
    ("duplicate mark", 'mark = "M-1"', 'mark = "P-1"', "@P-1 again", "P-1", "mark", "used twice"),
    ("unknown rule", "[materials.tilt]", '[rules.stand_down]\nvalue = 0.8\nsource = "memo"\n\n'
     "[materials.tilt]", "[rules.stand_down]", None, "rule stand_down", "unknown rule"),
    ("unknown wall line", 'mark = "M-1"', 'mark = "M-1"\nline = "north"', 'line = "north"', "M-1",
     "line", "'north' is not a [[lines]] name"),
    ("unknown release event", 'mark = "M-1"', 'mark = "M-1"\nrelease_after = ["roof"]',
     "release_after", "M-1", "release_after", "'roof' is not an [[events]] name"),
    ("material without a weight", 'unit_weight = "150 pcf"        # normal-weight concrete\n', "",
     "[materials.tilt]", None, "material tilt", "unit_weight or face_weight"),
]


def _expected_line(helpers, text: str, fragment: str) -> int:
    """Line the problem should be reported at; '@P-1' is that panel's [[panels]] header."""
    if fragment == "@P-1":
        return helpers.line_of(text, 'mark = "P-1"') - 1
    if fragment == "@P-1 again":
        return [n for n, line in enumerate(text.splitlines(), 1) if line == 'mark = "P-1"'][1]
    return helpers.line_of(text, fragment)


@pytest.mark.parametrize(("case", "old", "new", "fragment", "mark", "field", "words"), BAD_INPUTS,
                         ids=[c[0] for c in BAD_INPUTS])
def test_bad_input_exits_2_naming_file_line_mark_and_field(
        capsys, helpers, write_site, case, old, new, fragment, mark, field, words):
    assert old in helpers.site_toml
    text = helpers.site_toml.replace(old, new, 1)
    path = write_site(text)
    assert cli.main(["check", str(path)]) == 2
    captured = capsys.readouterr()
    assert captured.out == ""
    problems = [line.strip() for line in captured.err.splitlines()[1:]]
    assert len(problems) == 1, captured.err
    problem = problems[0]
    assert problem.startswith(f"{path}:{_expected_line(helpers, text, fragment)}: "), problem
    if mark:
        assert f"panel {mark}:" in problem
    assert field in problem and words in problem
    assert "Traceback" not in captured.err


def test_malformed_toml_names_the_file_and_line(capsys, helpers, write_site):
    text = helpers.site_toml.replace("[materials.cmu8]", "[materials.cmu8")
    path = write_site(text)
    assert cli.main(["check", str(path)]) == 2
    err = capsys.readouterr().err
    assert f"{path}:{helpers.line_of(text, '[materials.cmu8')}: not valid TOML" in err


def test_a_key_given_twice_names_the_file_and_line(capsys, helpers, write_site):
    text = helpers.site_toml.replace('mark = "M-1"', 'mark = "M-1"\nheight = "7 ft"')
    path = write_site(text)
    assert cli.main(["check", str(path)]) == 2
    err = capsys.readouterr().err
    line = helpers.line_of(text, 'height = "6 ft"')  # the second height of M-1
    assert f"{path}:{line}: not valid TOML" in err
    assert "height" in err and "Traceback" not in err


def test_an_error_in_a_nested_table_of_the_second_panel_is_found_at_its_line(helpers):
    text = helpers.site_toml + ('[[panels.openings]]\nx = "2 ft"\ny = 0\nwidth = 0\n'
                                'height = "1 ft"\n')
    with pytest.raises(scenario.SiteFileError) as caught:
        scenario.parse(text, "site.toml")
    assert caught.value.problems == [
        f"site.toml:{len(text.splitlines()) - 1}: panel M-1: openings.0.width: "
        "Input should be greater than 0 (got 0.0)"]


SEVERAL = [
    (P1_HEIGHT, 'height = "30 kg"'),
    ('exposure = "C"', 'exposure = "E"'),
    ('mark = "M-1"', 'mark = "P-1"\ncolour = "grey"'),
    ('material = "cmu8"', 'material = "cmu12"'),
    ('mortar_age = "2 days"', 'mortar_age = "-2 days"'),
]


def _several_errors(site_toml: str) -> str:
    for old, new in SEVERAL:
        assert old in site_toml
        site_toml = site_toml.replace(old, new, 1)
    return site_toml


def test_a_file_with_several_errors_reports_every_one_at_once(capsys, helpers, write_site):
    path = write_site(_several_errors(helpers.site_toml))
    assert cli.main(["check", str(path)]) == 2
    err = capsys.readouterr().err
    assert err.splitlines()[0] == f"bracing: 6 problem(s) in {path}:"
    for words in ("panel P-1: height:", "site.exposure:", "colour: unknown key",
                  "material: 'cmu12' is not in [materials]", "mark: used twice",
                  "mortar_age: Input should be greater than or equal to 0"):
        assert words in err, words


def test_check_end_to_end_exits_2_without_a_traceback(helpers, write_site):
    path = write_site(_several_errors(helpers.site_toml))
    done = helpers.run_bracing("check", path)
    assert done.returncode == 2
    assert "Traceback" not in done.stderr + done.stdout
    assert done.stdout == "" and str(path) in done.stderr


def test_check_end_to_end_of_a_good_file(helpers, write_site):
    done = helpers.run_bracing("check", write_site(helpers.site_toml))
    assert done.returncode == 1, done.stderr  # valid; its walls cannot stand unbraced (§8a)
    # the verdict first (P-1 and M-1 fail), then the caution
    first, second = done.stdout.splitlines()[:2]
    assert first.startswith("NOT GO") and second.startswith("CAUTION")
    assert "P-1" in first and "M-1" in first


@pytest.mark.parametrize("kind", ["missing", "directory", "not text"])
def test_an_unreadable_file_is_named(capsys, tmp_path, kind):
    path = tmp_path / "site.toml"
    if kind == "directory":
        path.mkdir()
    elif kind == "not text":
        path.write_bytes(b"\xff\xfe\x00 not utf-8")
    assert cli.main(["check", str(path)]) == 2
    err = capsys.readouterr().err
    assert f"{path}:" in err and "Traceback" not in err


# --- Loading and saving ---------------------------------------------------------------------------


def test_a_good_file_loads_with_its_units(helpers, write_site):
    site = scenario.load(write_site(helpers.site_toml)).site
    assert [p.mark for p in site.panels] == ["P-1", "M-1"]
    assert site.panels[1].thickness == 7.625 and site.panels[1].mortar_age == 2.0
    assert site.site.basic_wind_speed == 115.0 and site.materials["tilt"].unit_weight == 150.0


def test_save_keeps_comments_and_layout_and_changes_only_the_value(helpers, write_site):
    path = write_site(helpers.site_toml)
    original = path.read_text(encoding="utf-8")
    changed = scenario.load(path).with_value(("panels", 0, "height"), "32 ft")
    assert changed.save() == path
    saved = path.read_text(encoding="utf-8")
    expected = original.replace('height = "30 ft"  ', 'height = "32 ft"  ')
    assert saved == expected  # every comment, blank line and alignment kept
    assert scenario.load(path).site.panels[0].height == 32.0


def test_save_keeps_the_previous_version_as_bak(helpers, write_site):
    path = write_site(helpers.site_toml)
    site_file = scenario.load(path)
    site_file.with_value(("site", "basic_wind_speed"), "120 mph").save()
    backup = path.with_name(path.name + ".bak")
    assert backup.read_text(encoding="utf-8") == helpers.site_toml
    scenario.load(path).with_value(("site", "basic_wind_speed"), "125 mph").save()
    assert scenario.load(backup).site.site.basic_wind_speed == 120.0  # the one before
    assert scenario.load(path).site.site.basic_wind_speed == 125.0
    assert sorted(p.name for p in path.parent.iterdir()) == ["site.toml", "site.toml.bak"]


def test_save_to_a_new_path_makes_no_backup(helpers, write_site, tmp_path):
    site_file = scenario.load(write_site(helpers.site_toml))
    target = tmp_path / "copy" / "new.toml"
    target.parent.mkdir()  # a missing folder is never created (test_robustness)
    assert site_file.save(target) == target
    assert target.read_text(encoding="utf-8") == helpers.site_toml
    assert not target.with_name("new.toml.bak").exists()


def test_a_failed_save_leaves_the_file_whole_and_no_litter(helpers, write_site, monkeypatch):
    path = write_site(helpers.site_toml)
    changed = scenario.load(path).with_value(("panels", 0, "height"), "32 ft")

    def disk_full(fd):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(scenario.os, "fsync", disk_full)
    with pytest.raises(OSError):
        changed.save()
    assert path.read_text(encoding="utf-8") == helpers.site_toml
    assert os.listdir(path.parent) == ["site.toml"]


@pytest.mark.parametrize(
    ("keys", "value", "words"),
    [
        (("panels", 0, "height"), "32 kg", "panel P-1: height: '32 kg' is not a length"),
        (("panels", 1, "width"), 0, "panel M-1: width: Input should be greater than 0"),
        (("site", "exposure"), "E", "site.exposure:"),
        (("panels", 1, "material"), "steel", "panel M-1: material: 'steel' is not in"),
        (("panels", 0, "colour"), "grey", "panel P-1: colour: unknown key"),
        (("panels", 5, "height"), "32 ft", "no panels.5 in the file"),
        (("panels", 0, "footing", "width"), "2 ft", "no panels.0.footing in the file"),
    ],
)
def test_an_invalid_with_value_raises_and_changes_nothing(helpers, write_site, keys, value, words):
    path = write_site(helpers.site_toml)
    site_file = scenario.load(path)
    before = (site_file.document.as_string(), site_file.site.model_dump())
    with pytest.raises(scenario.SiteFileError) as caught:
        site_file.with_value(keys, value)
    assert any(words in problem for problem in caught.value.problems), caught.value.problems
    assert all(problem.startswith(str(path)) for problem in caught.value.problems)
    assert (site_file.document.as_string(), site_file.site.model_dump()) == before
    assert path.read_text(encoding="utf-8") == helpers.site_toml


def test_with_value_returns_a_copy(helpers, write_site):
    site_file = scenario.load(write_site(helpers.site_toml))
    changed = site_file.with_value(("panels", 1, "mortar_age"), "30 days")
    assert changed.site.panels[1].mortar_age == 30.0
    assert site_file.site.panels[1].mortar_age == 2.0
    assert 'mortar_age = "2 days"' in site_file.document.as_string()
