"""Days of the job (bracing.schedule): lifts, standing walls, releases, inventory, go / no-go.

The tiny site's day-by-day inventory is counted by hand (the table in `test_inventory_by_hand`);
speeds come from the engine and are compared, not recomputed. Day rules are the team's (the
module docstring of bracing.schedule); period factors are ASCE 37-14 Table 6.2-1 values with
their marks from references.md.
"""

from __future__ import annotations

import json
from datetime import date

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from bracing import schedule
from bracing.evaluate import evaluate
from bracing.model import Site
from bracing.report import json_view
from bracing.scenario import SiteFileError, parse

TINY_TOML = """\
version = 1
[site]
name = "Tiny yard"
basic_wind_speed = "95 mph"
start_date = 2024-03-04
construction_period = "5 weeks"

[materials.tilt]
kind = "concrete"
unit_weight = "150 pcf"
compressive_strength = "3000 psi"

[brace_types.b1]
kind = "rated"
lengths = ["24 ft", "40 ft"]
loads = ["12000 lb", "9000 lb"]
tension_capacity = "12000 lb"
on_hand = 4

[anchor_types.ins]
kind = "insert"
rated_tension = "20000 lb"
rated_shear = "20000 lb"

[anchor_types.helix]
kind = "helical"
installation_torque = "5000 ft*lbf"
on_hand = 10

[plan]
slab = [[-10, -10], [80, -10], [80, 40], [-10, 40]]

[[lines]]
name = "north"
start = [0, 0]
end = [70, 0]
braced_side = "left"

[[events]]
name = "roof-1"
day = 4

[[signoffs]]
panel = "A"
day = 5
by = "J. Engineer, EOR"

[[signoffs]]
panel = "B"
day = 3
by = "J. Engineer, EOR"

[forecast]
file = "wx.csv"

[[panels]]
mark = "A"
material = "tilt"
width = "24 ft"
height = "30 ft"
thickness = "7.25 in"
line = "north"
offset = 0
lift_day = 1
release_after = ["roof-1"]
[panels.bracing]
brace_type = "b1"
wall_anchor = "ins"
foot_anchor = "helix"
count = 2
insert_height = "20 ft"
angle = "55 deg"

[[panels]]
mark = "B"
material = "tilt"
width = "30 ft"
height = "30 ft"
thickness = "7.25 in"
line = "north"
offset = "24.5 ft"
lift_day = 2
release_after = ["roof-1"]
[panels.bracing]
brace_type = "b1"
wall_anchor = "ins"
foot_anchor = "helix"
count = 3
insert_height = "20 ft"
angle = "55 deg"

[[panels]]
mark = "C"
material = "tilt"
width = "12 ft"
height = "6 ft"
thickness = "7.25 in"
line = "north"
offset = "55 ft"
lift_day = 3

[[panels]]
mark = "D"
material = "tilt"
width = "12 ft"
height = "6 ft"
thickness = "7.25 in"
"""

# Day 1 is 2024-03-04. 1 Mar is before day 1 (ignored); two rows on day 1 (the larger gust
# counts); a thunderstorm on day 2; 200 mph on day 3; nothing for days 4 and 5; day 6 calm.
WX_CSV = """\
date,gust_mph,storm
2024-03-01,90,no
2024-03-04,12,no
2024-03-04,20,no
2024-03-05,15,yes
2024-03-06,200,
2024-03-09,10,no
"""


def write_tiny(tmp_path, toml=TINY_TOML, wx=WX_CSV):
    (tmp_path / "site.toml").write_text(toml, encoding="utf-8")
    (tmp_path / "wx.csv").write_text(wx, encoding="utf-8")
    return tmp_path / "site.toml"


def tiny_result(tmp_path, toml=TINY_TOML, wx=WX_CSV):
    """The tiny site evaluated (its days and plans filled in), and its walls' schedule flags."""
    site = parse(toml, "site.toml").site
    (tmp_path / "wx.csv").write_text(wx, encoding="utf-8")
    result = evaluate(site, base_dir=tmp_path)
    days, peak, wall_flags = schedule.build_days(
        site, result.panels, schedule.site_forecast(site, tmp_path))
    assert [d.standing for d in days] == [d.standing for d in result.days]
    assert peak == result.peak_inventory
    return site, result, wall_flags


def no_forecast(toml=TINY_TOML) -> Site:
    return parse(toml).site.model_copy(update={"forecast": None})


@pytest.fixture
def tiny(tmp_path):
    return tiny_result(tmp_path)


def by_day(result):
    return {d.day: d for d in result.days}


def test_inventory_by_hand(tiny):
    """Hand count (team rule: a wall released on day N is not standing on day N, its braces
    still count that day). A 2 braces lifted day 1 released day 5; B 3 braces lifted day 2, never
    validly released; C unbraced lifted day 3; b1 on hand 4, helix 10, ins not given."""
    _, result, _ = tiny
    days = by_day(result)
    hand = {  # day: (lifts, standing, released, b1, ins, helix, b1 short)
        1: (["A"], ["A"], [], 2, 2, 2, 0),
        2: (["B"], ["A", "B"], [], 5, 5, 5, 1),
        3: (["C"], ["A", "B", "C"], [], 5, 5, 5, 1),
        4: ([], ["A", "B", "C"], [], 5, 5, 5, 1),
        5: ([], ["B", "C"], ["A"], 5, 5, 5, 1),
        6: ([], ["B", "C"], [], 3, 3, 3, 0),
    }
    assert sorted(days) == list(hand)
    for n, (lifts, standing, released, b1, ins, helix, short) in hand.items():
        d = days[n]
        assert (d.lifts, d.standing, d.released) == (lifts, standing, released), n
        assert d.braces_in_use == {"b1": b1}, n
        assert d.anchors_in_use == {"helix": helix, "ins": ins}, n
        assert d.short == {"braces": {"b1": short} if short else {}, "anchors": {}}, n
        assert any(f.code == "short" for f in d.flags) == bool(short), n
    assert result.peak_inventory == {"braces": {"b1": 5}, "anchors": {"helix": 5, "ins": 5}}


def test_wall_without_lift_day_is_in_no_day(tiny):
    _, result, _ = tiny
    assert all("D" not in d.standing + d.lifts + d.released for d in result.days)


def test_dates_follow_start_date(tiny):
    _, result, _ = tiny
    days = by_day(result)
    assert days[1].date == "2024-03-04" and days[6].date == "2024-03-09"


def test_signoff_before_its_event_keeps_the_wall(tiny):
    """B is signed off on day 3, before roof-1 on day 4: flagged, it stays braced."""
    _, result, wall_flags = tiny
    days = by_day(result)
    flag = next(f for f in days[3].flags if f.code == "signoff-before-event")
    assert flag.severity == "danger" and "B" in flag.message and "roof-1" in flag.message
    assert all("B" in days[n].standing for n in (3, 4, 5, 6))
    assert ("B", "signoff-before-event") in [(m, f.code) for m, f in wall_flags]
    assert ("B", "no-signoff") in [(m, f.code) for m, f in wall_flags]


def test_no_release_from_dates_alone(tmp_path):
    """Every event done by day 2, but no sign-off: the wall stands to the last day."""
    toml = TINY_TOML.replace('[[signoffs]]\npanel = "A"\nday = 5', '[[signoffs]]\npanel = "B"\n'
                             'day = 5')
    _, result, wall_flags = tiny_result(tmp_path, toml)
    assert all("A" in d.standing for d in result.days)
    assert not any(d.released == ["A"] for d in result.days)
    assert ("A", "no-signoff") in [(m, f.code) for m, f in wall_flags]


def test_stand_down_go_and_reasons(tiny):
    """Day stand-down = the lowest among standing walls; go only when the forecast gust is below
    it and no storm (design.md §3); no forecast, no call."""
    _, result, _ = tiny
    days = by_day(result)
    for d in result.days:
        walls = [result.panel(m) for m in d.standing]
        low = min(walls, key=lambda p: p.stand_down_speed_mph)
        assert d.stand_down_speed_mph == low.stand_down_speed_mph
        assert d.governing_wall == low.mark
        assert d.working_limit_speed_mph == min(p.working_limit_speed_mph for p in walls)
    assert days[1].stand_down_speed_mph > 20.0  # so 20 mph is a go
    assert (days[1].forecast_gust_mph, days[1].go) == (20.0, True)
    assert "stand_down_ratio" in days[1].reason and days[1].governing_wall in days[1].reason
    assert (days[2].storm, days[2].wind_go) == (True, False) and "thunderstorm" in days[2].wind
    assert (days[3].forecast_gust_mph, days[3].wind_go) == (200.0, False)
    assert "200 mph >=" in days[3].wind
    assert (days[4].wind_go, days[4].wind) == (None, "no forecast")
    assert (days[6].wind_go, days[6].forecast_gust_mph) == (True, 10.0)
    # the verdict: C (cannot stand, no braces) stands from day 3 and b1 is short from day 2
    assert [days[n].verdict for n in range(1, 7)] == ["GO"] + ["NO-GO"] * 5
    assert all(days[n].go is False for n in range(2, 7))


def test_walls_that_fail_are_flagged_on_their_days(tiny):
    """C cannot stand on its own and has no braces: flagged every day it stands."""
    _, result, _ = tiny
    assert result.panel("C").status == "needs_braces"
    for d in result.days:
        assert any(f.code == "needs-braces-standing" for f in d.flags) == ("C" in d.standing)


SLIP_TOML = """\
version = 1
[site]
name = "Slip"
basic_wind_speed = 115
{period}
[materials.tilt]
kind = "concrete"
unit_weight = 150
[[events]]
name = "roof"
day = 30
[[signoffs]]
panel = "P"
day = {signoff}
by = "EOR"
[[panels]]
mark = "P"
material = "tilt"
width = 20
height = 24
thickness = 8
lift_day = 1
release_after = ["roof"]
"""


def slip(signoff: int, period: str = ""):
    site = parse(SLIP_TOML.format(signoff=signoff, period=period)).site
    result = evaluate(site)
    days, _, flags = schedule.build_days(site, result.panels)
    return result, days, flags


def test_period_slip_flagged_with_the_new_factor():
    """Planned from the roof on day 30: 30 days (4.3 weeks), factor 0.75 (ASCE 37-14 Table
    6.2-1: less than 6 weeks 0.75, from memory). Signed off on day 50 instead: on day 42 the
    wall has stood 6 weeks, and 6 weeks to 1 year is 0.8 (secondary)."""
    result, days, flags = slip(50)
    assert result.panel("P").wind.period_factor == 0.75
    slips = [(d.day, f) for d in days for f in d.flags if f.code == "period-slip"]
    assert [day for day, _ in slips] == [42]
    assert slips[0][1].severity == "warning" and "factor now 0.80" in slips[0][1].message
    assert [m for m, f in flags if f.code == "period-slip"] == ["P"]


def test_no_slip_when_released_as_planned():
    _, days, flags = slip(30)
    assert not any(f.code == "period-slip" for _, f in flags)
    assert days[-1].released == ["P"]


def test_no_slip_with_a_period_factor_set_for_the_site():
    """The user set 0.8 (ASCE 37-14: 6 weeks to 1 year, secondary): 49 days never pass it."""
    result, _, flags = slip(50, "period_factor = 0.8")
    assert result.panel("P").wind.period_factor == 0.8
    assert not any(f.code == "period-slip" for _, f in flags)


# --- the forecast file --------------------------------------------------------------------------
def read(tmp_path, text, start=date(2024, 3, 4)):
    path = tmp_path / "wx.csv"
    path.write_text(text, encoding="utf-8")
    return schedule.read_forecast(path, start)


def test_forecast_by_day_with_units_and_storms(tmp_path):
    got = read(tmp_path, "# hourly gusts\nday,gust,storm\n1,30 mph,no\n1,40 mph,yes\n\n"
                         "2,\"40 km/h\",\n3,25 knot,0\n")
    assert got[1] == schedule.ForecastDay(40.0, True)  # largest gust, any storm
    assert got[2].gust_mph == pytest.approx(24.855, abs=1e-3)  # 40 km/h = 24.855 mph (exact)
    assert got[3].gust_mph == pytest.approx(28.77, abs=1e-2)  # 1 kt = 1.151 mph (secondary)
    assert not got[2].storm and not got[3].storm


@pytest.mark.parametrize("text, line, words", [
    ("day,gust_mph\n1,30\n2,fast\n", 3, "cannot read 'fast'"),
    ("day,gust_mph\n1,-5\n", 2, "negative gust"),
    ("day,gust_mph,storm\n1,30,maybe\n", 2, "storm must be"),
    ("day,gust_mph\n0,30\n", 2, "start at 1"),
    ("date,gust_mph\n2024-13-01,30\n", 2, "ISO"),
    ("when,gust_mph\n1,30\n", 1, "header needs"),
    ("day,speed\n1,30\n", 1, "header needs"),
])
def test_forecast_errors_name_the_file_and_line(tmp_path, text, line, words):
    with pytest.raises(SiteFileError) as err:
        read(tmp_path, text)
    assert err.value.path.endswith("wx.csv")
    assert any(f"wx.csv:{line}:" in p and words in p for p in err.value.problems), \
        err.value.problems


def test_forecast_dates_need_a_start_date(tmp_path):
    with pytest.raises(SiteFileError, match="start_date"):
        read(tmp_path, "date,gust_mph\n2024-03-04,30\n", start=None)


def test_forecast_file_missing_is_an_error_naming_it(tmp_path):
    site = parse(TINY_TOML).site
    panels = evaluate(no_forecast()).panels
    with pytest.raises(SiteFileError, match="elsewhere/wx.csv: cannot read the forecast file"):
        schedule.build_days(site, panels, schedule.site_forecast(site, tmp_path / "elsewhere"))


def test_forecast_path_is_relative_to_the_site_folder(tmp_path):
    """The same site read from another working folder finds its forecast beside it."""
    write_tiny(tmp_path)
    site = parse(TINY_TOML).site
    days, _, _ = schedule.build_days(site, evaluate(no_forecast()).panels,
                                     schedule.site_forecast(site, tmp_path))
    assert days[0].forecast_gust_mph == 20.0


# --- zones, the whole site, the JSON record -----------------------------------------------------
def test_zone_of_an_unplaced_wall_matches_the_plan_rule():
    """The same walls on a line (the plan's zone_reach) and on none (schedule's own rule)."""
    def site(on_line):
        panels = [{"mark": "T", "material": "tilt", "width": 20, "height": 30, "thickness": 8,
                   "bracing": {"brace_type": "b", "count": 2, "insert_height": 20,
                               "anchor_distance": 14}},
                  {"mark": "M", "material": "cmu", "width": 20, "height": 10, "thickness": 8,
                   "offset": 25}]
        for p in panels:
            if on_line:
                p["line"] = "L"
        return Site.model_validate({
            "version": 1, "site": {"name": "z", "basic_wind_speed": 115},
            "materials": {"tilt": {"kind": "concrete", "unit_weight": 150},
                          "cmu": {"kind": "masonry", "face_weight": 36}},
            "brace_types": {"b": {"kind": "unrated"}},
            "lines": [{"name": "L", "start": [0, 0], "end": [60, 0], "braced_side": "left"}],
            "panels": panels})
    placed, loose = site(True), site(False)
    on_plan = schedule.fall_zones(placed, evaluate(placed).panels)
    alone = schedule.fall_zones(loose, evaluate(loose).panels)
    for mark in ("T", "M"):
        assert alone[mark][:2] == pytest.approx(on_plan[mark][:2])
    assert alone["M"][0] == 14.0  # OSHA 1926.706(a): height 10 ft + 4 ft (text)
    assert alone["T"][0] == pytest.approx(30.0 + 14.0)  # height + footprint (common practice)


def test_whole_site_when_no_lift_days():
    """No lift days: day 0 has every wall standing and the site's whole inventory."""
    toml = "\n".join(line for line in TINY_TOML.splitlines() if not line.startswith("lift_day"))
    site = no_forecast(toml)
    result = evaluate(site)
    assert schedule.build_days(site, result.panels) == ([], {"braces": {}, "anchors": {}}, [])
    d = schedule.whole_site(site, result.panels)
    assert (d.day, d.standing, d.lifts) == (0, ["A", "B", "C", "D"], [])
    assert d.braces_in_use == {"b1": 5} and d.short == {"braces": {"b1": 1}, "anchors": {}}
    assert (d.wind_go, d.wind) == (None, "no forecast")
    assert (d.verdict, d.go, d.failing_standing) == ("NO-GO", False, ["C", "D"])


def test_json_record_has_days_and_peak_inventory(tiny):
    """Acceptance keys of the issue: days with their fields, and the peak inventory."""
    _, result, _ = tiny
    record = json.loads(json_view.dumps(json_view.site_record(result)))
    assert record["peak_inventory"] == {"braces": {"b1": 5}, "anchors": {"helix": 5, "ins": 5}}
    keys = {"day", "lifts", "standing", "braces_in_use", "anchors_in_use", "released",
            "stand_down_speed_mph", "forecast_gust_mph", "go"}
    assert all(keys <= set(d) for d in record["days"])
    day3 = record["days"][2]
    assert day3["day"] == 3 and day3["go"] is False and day3["forecast_gust_mph"] == 200.0
    assert {"code", "severity", "message", "source"} <= set(day3["flags"][0])
    assert {"mark", "status", "governing_utilization", "stand_down_speed_mph", "braces",
            "flags"} <= set(record["panels"][0])


# --- a property: the inventory is the count over walls, whatever the schedule -------------------
@pytest.fixture(scope="module")
def evaluated():
    site = no_forecast()
    return site, evaluate(site).panels


@settings(max_examples=60, deadline=None)
@given(lifts=st.lists(st.one_of(st.none(), st.integers(1, 12)), min_size=4, max_size=4),
       signs=st.lists(st.one_of(st.none(), st.integers(1, 15)), min_size=4, max_size=4),
       event=st.integers(1, 12))
def test_inventory_is_the_count_of_walls_in_use(evaluated, lifts, signs, event):
    """Any lift and sign-off days: a wall stands from its lift to the day before a sign-off on
    or after its event and lift; each day's braces are those of the walls standing or released
    that day; the peak is the largest day."""
    site0, panels = evaluated
    site = site0.model_copy(update={
        "events": [site0.events[0].model_copy(update={"day": event})],
        "signoffs": [site0.signoffs[0].model_copy(update={"panel": p.mark, "day": s})
                     for p, s in zip(site0.panels, signs, strict=True) if s is not None],
        "panels": [p.model_copy(update={"lift_day": n, "release_after": ["roof-1"]})
                   for p, n in zip(site0.panels, lifts, strict=True)]})
    days, peak, _ = schedule.build_days(site, panels)
    count = {p.mark: p.bracing.count if p.bracing else 0 for p in site.panels}
    for d in days:
        for p, lift, sign in zip(site.panels, lifts, signs, strict=True):
            valid = sign is not None and lift is not None and sign >= max(lift, event)
            up = lift is not None and lift <= d.day and not (valid and d.day >= sign)
            assert (p.mark in d.standing) == up
            assert (p.mark in d.released) == (valid and d.day == sign)
        in_use = sum(count[m] for m in d.standing + d.released)
        assert d.braces_in_use.get("b1", 0) == in_use
        assert d.anchors_in_use.get("ins", 0) == in_use == d.anchors_in_use.get("helix", 0)
    assert peak["braces"].get("b1", 0) == max((d.braces_in_use.get("b1", 0) for d in days),
                                              default=0)


MASONRY_TOML = """\
version = 1
[site]
name = "Block wall"
basic_wind_speed = 115
[materials.cmu]
kind = "masonry"
face_weight = 80
grouting = "solid"
[[events]]
name = "roof"
day = 40
[[signoffs]]
panel = "M"
day = 40
by = "EOR"
[[panels]]
mark = "M"
material = "cmu"
width = 12
height = 6
thickness = 7.625
mortar_age = 60
lift_day = 3
release_after = ["roof"]
"""


def test_masonry_days_use_its_fresh_mortar_speeds_until_the_mortar_has_cured():
    """Checked with cured mortar (60 days), but laid on day 3: on days 3 to 30 its mortar is
    younger than the 28-day cure rule (a site rule, default), so the days take its speeds with
    fresh mortar, weight only (TMS 402-16 §8.2, from memory); from day 31 its own."""
    site = parse(MASONRY_TOML).site
    result = evaluate(site)
    wall = result.panel("M")
    assert wall.fresh_stand_down_speed_mph < wall.stand_down_speed_mph
    assert wall.fresh_stand_down_speed_mph <= 20.0  # masonry_initial_speed_mph (secondary)
    by_day = {d.day: d for d in result.days}
    for day in (3, 30):
        assert by_day[day].stand_down_speed_mph == pytest.approx(wall.fresh_stand_down_speed_mph)
        assert by_day[day].working_limit_speed_mph == pytest.approx(
            wall.fresh_working_limit_speed_mph)
        assert any(f.code == "fresh-mortar-standing" for f in by_day[day].flags)
    for day in (31, 39):
        assert by_day[day].stand_down_speed_mph == pytest.approx(wall.stand_down_speed_mph)
        assert not any(f.code == "fresh-mortar-standing" for f in by_day[day].flags)


def test_fresh_mortar_speeds_are_only_for_masonry(tiny):
    _, result, _ = tiny
    for p in result.panels:
        assert (p.fresh_stand_down_speed_mph is None) == (p.material != "masonry")


# --- the days' extension point ------------------------------------------------------------------
def test_a_day_rule_adds_its_flags_and_the_verdict_weighs_them(tmp_path, monkeypatch):
    """A new check of the days is one function in `bracing.schedule.days.DAY_RULES`: its flags
    go on the day, and `judge` weighs them unchanged (method notes §6, Day verdict; a team
    rule, no published source): a danger naming a wall lifted that day holds that lift, one
    naming no wall makes the day NO-GO. Day 1 of the tiny site is GO without it."""
    from bracing.results import Flag
    from bracing.schedule import days as days_module

    _, result, _ = tiny_result(tmp_path)
    assert result.days[0].verdict == "GO" and result.days[0].lifts == ["A"]

    def held(job, today):
        if today.day != 1:
            return []
        return [Flag("held-wall", "danger", "A: held by the test", "the test"),
                Flag("held-day", "danger", "the day is held by the test", "the test")]

    monkeypatch.setattr(days_module, "DAY_RULES", [*days_module.DAY_RULES, held])
    _, result, _ = tiny_result(tmp_path)
    d = result.days[0]
    assert [f.code for f in d.flags][-2:] == ["held-wall", "held-day"]
    assert d.verdict == "NO-GO" and d.do_not_lift == ["A"]
    assert "the day is held by the test" in d.reason
    assert any(f.code == "held-wall" and f.marks == ["A"] and f.message == "held by the test"
               for f in d.why)
