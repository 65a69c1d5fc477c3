"""A missing value says which kind it is (issue 14 item 6): None where the value does not apply,
NaN (listed in `PanelResult.unknown` with why) where it is not known, inf where it is unbounded.
The JSON record writes null for all three, as before, and adds the reason where it is cheap."""

import math

import numpy as np
from test_braced_walls import site_of, wall

from bracing import evaluate as ev
from bracing.report.text import fmt
from bracing.stages import braced, records


def test_a_brace_of_unknown_capacity_says_why():
    # method notes §11: an unrated brace has its forces computed and its capacity unchecked, so
    # its utilization is unknown (not inapplicable); a rated brace's is known and says nothing
    site = site_of([wall("T-4", brace_type="unrated", count=3, insert_height=21.0, angle=50.0),
                    wall("T-1", count=2, insert_height=20.0, angle=55.0),
                    wall("U-1")])
    unrated, rated, alone = ev.evaluate(site).panels
    assert unrated.braces["utilization"] is None
    assert unrated.braces["utilization_unknown_because"] == braced.UNKNOWN_BRACE_UTILIZATION
    assert unrated.unknown == {"braces.utilization": braced.UNKNOWN_BRACE_UTILIZATION}
    assert rated.braces["utilization"] is not None
    assert "utilization_unknown_because" not in rated.braces and rated.unknown == {}
    # a concrete wall's fresh-mortar speeds do not apply: None, and not listed as unknown
    assert alone.braces is None and alone.fresh_stand_down_speed_mph is None
    assert alone.unknown == {}


def test_a_speed_not_found_is_unknown_with_its_reason():
    # the searches' NaN (no limit below the top of their range) is read as a capacity not known
    # (findings `capacity-unknown`, method notes §5); a speed found is not listed
    got = records._unknown_speeds({"working_limit_speed_mph": np.array([30.0, np.nan]),
                                   "fresh_stand_down_speed_mph": np.array([np.nan, 0.0])})
    assert got == [{"fresh_stand_down_speed_mph": records.UNKNOWN_SPEED},
                   {"working_limit_speed_mph": records.UNKNOWN_SPEED}]


def test_a_height_search_without_a_limit_is_unbounded_not_unknown():
    got = records._unbounded(np.array([12.5, np.nan]))
    assert got[0] == 12.5 and math.isinf(got[1])


def test_views_print_none_unknown_and_unbounded_apart():
    assert fmt(None, "mph") == "none"  # does not apply
    assert fmt(math.nan, "mph") == "unknown"
    assert fmt(math.inf, "mph") == "unbounded"
    assert fmt(42.0, "mph") == "42 mph"
