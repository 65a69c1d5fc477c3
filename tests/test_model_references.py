"""The cross-reference checks of raw site data (bracing.model.references): each small check
reports its own problem at its own key, in the order of the file's sections, so that a file's
problems are all shown at once."""

from __future__ import annotations

import copy

from bracing.model import SCHEMA_VERSION, reference_problems

# Raw data (as read from TOML) whose every name is given once and known: no problem.
GOOD = {
    "version": 1,
    "rules": {"stand_down_ratio": {"value": 0.8, "source": "memo"}},
    "materials": {"tilt": {}},
    "brace_types": {"pipe-3": {}},
    "anchor_types": {"insert": {}, "wedge": {}},
    "lines": [{"name": "north"}, {"name": "south"}],
    "events": [{"name": "roof"}],
    "panels": [{"mark": "P-1", "material": "tilt", "line": "north", "release_after": ["roof"],
                "bracing": {"brace_type": "pipe-3", "wall_anchor": "insert",
                            "foot_anchor": "wedge"}},
               {"mark": "P-2", "material": "tilt"}],
    "signoffs": [{"panel": "P-1"}],
}


def _broken() -> dict:
    """GOOD with one broken reference of every kind the checks know."""
    data = copy.deepcopy(GOOD)
    data["version"] = SCHEMA_VERSION + 1
    data["rules"]["stand_down_ratio"]["value"] = "1.5"  # read as text of a number, as the field
    data["rules"]["gust_ratio"] = {"value": 1.0, "source": "memo"}
    data["lines"].append({"name": "north"})
    data["events"].append({"name": "roof"})
    first = data["panels"][0]
    first.update(material="cmu12", line="east", release_after=["roof", "floor"])
    first["bracing"].update(brace_type="pipe-4", foot_anchor="helix")
    data["panels"][1]["mark"] = "P-1"
    data["panels"].append("not a table")  # left to the fields
    data["signoffs"].append({"panel": "P-9"})
    return data


def test_a_site_whose_names_are_all_known_has_no_problem():
    assert reference_problems(GOOD) == []


def test_every_broken_reference_is_reported_at_its_key_in_the_file_order():
    """The messages and the order as the site file's readers see them (test_site_file checks
    the same words through `bracing check`)."""
    assert reference_problems(_broken()) == [
        (("rules", "stand_down_ratio", "value"),
         "must be above 0 and at most 1 (method notes §9)", "1.5"),
        (("rules", "gust_ratio"),
         "unknown rule; known: minimum_design_pressure_psf, stand_down_ratio, "
         "masonry_unbraced_height_ft, masonry_zone_extra_ft, masonry_cure_days, "
         "minimum_braces_per_panel, brace_angle_min_deg, brace_angle_max_deg, "
         "insert_min_height_ratio, minimum_design_wind_mph, masonry_initial_speed_mph, "
         "masonry_intermediate_speed_mph, masonry_bracing_design_speed_mph", "gust_ratio"),
        (("lines", 2, "name"), "used twice", "north"),
        (("events", 1, "name"), "used twice", "roof"),
        (("panels", 0, "material"), "'cmu12' is not in [materials] (tilt)", "cmu12"),
        (("panels", 0, "bracing", "brace_type"), "'pipe-4' is not in [brace_types]", "pipe-4"),
        (("panels", 0, "bracing", "foot_anchor"), "'helix' is not in [anchor_types]", "helix"),
        (("panels", 0, "line"), "'east' is not a [[lines]] name", "east"),
        (("panels", 0, "release_after", 1), "'floor' is not an [[events]] name", "floor"),
        (("panels", 1, "mark"), "used twice (also panel #1)", "P-1"),
        (("signoffs", 1, "panel"), "'P-9' is not a panel mark", "P-9"),
        (("version",), f"version {SCHEMA_VERSION + 1} is newer than this program "
                       f"({SCHEMA_VERSION})", SCHEMA_VERSION + 1),
    ]


def test_a_section_of_the_wrong_shape_is_left_to_its_field():
    """[materials] not a table: its field error stands alone, no panel's material is blamed;
    [[panels]] not an array: no mark is read, so a sign-off's mark is unknown."""
    data = copy.deepcopy(GOOD)
    data["materials"] = 5
    data["panels"][0]["material"] = "cmu12"
    assert reference_problems(data) == []
    data["panels"] = {"mark": "P-1"}
    assert reference_problems(data) == [
        (("signoffs", 0, "panel"), "'P-1' is not a panel mark", "P-1")]
    assert reference_problems([GOOD]) == []
