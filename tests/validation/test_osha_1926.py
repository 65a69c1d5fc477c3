"""OSHA 29 CFR 1926 Subpart Q (concrete and masonry construction), as site rules and flags.

1926.706(b): "All masonry walls over eight feet in height shall be adequately braced to prevent
overturning and to prevent collapse unless the wall is adequately supported so that it will not
overturn or collapse." text (via a state plan that repeats it word for word, references.md).
1926.706(a): limited access zone, wall height + 4 ft, on the unscaffolded side. text.
"""

import json

import pytest

from bracing import cli
from bracing.model import DEFAULT_RULES
from bracing.verification import published

# A cured, fully grouted 8 in CMU wall, 12 ft long: it stands on its own at the design wind at
# 8 to 8.5 ft (utilization about 0.45), so only the rule makes it need braces.
GROUTED = {"grouted": {"kind": "masonry", "face_weight": 80.0, "grouting": "solid"}}


def _wall(helpers, height_ft, material="grouted", materials=GROUTED, rules=None):
    data = helpers.build_site(
        [helpers.panel(material=material, height=height_ft, width=12.0, thickness=7.625,
                       mortar_age=40.0)],
        materials=materials, rules=rules)
    return helpers.evaluate_data(data).panels[0]


def test_rule_values_and_sources():
    over = DEFAULT_RULES["masonry_unbraced_height_ft"]
    # 8 ft, text
    assert over.value == published("osha-masonry-8ft") and "1926.706(b)" in over.source
    zone = DEFAULT_RULES["masonry_zone_extra_ft"]
    assert zone.value == published("osha-zone-4ft") and "1926.706(a)" in zone.source  # 4 ft, text


def test_masonry_over_eight_feet_is_flagged_even_where_it_would_stand(helpers):
    wall = _wall(helpers, 8.5)  # 1926.706(b), text: over 8 ft
    assert wall.unbraced.utilization < 1.0  # it would stand by statics
    flags = {f.code: f for f in wall.flags}
    assert flags["masonry-over-8ft"].severity == "danger"
    assert "1926.706(b)" in flags["masonry-over-8ft"].source
    assert wall.status == "needs_braces"


@pytest.mark.parametrize("height", [8.0, "96 in", "2.4384 m", 7.5])
def test_masonry_at_eight_feet_or_less_is_not_flagged(helpers, height):
    wall = _wall(helpers, height)  # 1926.706(b), text: "over eight feet"
    assert "masonry-over-8ft" not in [f.code for f in wall.flags]
    assert wall.status == "stands"


@pytest.mark.parametrize("kind", ["concrete", "framed"])
def test_the_rule_is_for_masonry_only(helpers, kind):
    materials = {"m": {"kind": kind, "face_weight": 80.0}}
    wall = _wall(helpers, 8.5, material="m", materials=materials)
    assert "masonry-over-8ft" not in [f.code for f in wall.flags]


def test_the_rule_flags_in_the_panel_quick_check(capsys):
    assert cli.main(["panel", "--material", "masonry", "--height", "8.5ft", "--width", "12ft",
                     "--thickness", "7.625in", "--wind", "115mph", "--json"]) == 1  # danger: exit 1
    record = json.loads(capsys.readouterr().out)
    severities = {f["code"]: f["severity"] for f in record["flags"]}
    assert severities["masonry-over-8ft"] == "danger"
    assert record["status"] == "needs_braces"
