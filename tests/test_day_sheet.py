"""The day's verdict and the crew sheet over the demo sites (issue 11): the verdict first in
every view, findings once, the text folded to 100 columns, SI throughout, sources a user can
follow.

The verdict rule is the method notes' (docs/method.md §6, Day verdict; a team rule, common
practice: no published source). The demo sites' days are read from their forecast files; the
walls that fail are the engine's (`PanelResult.fails`).
"""

from __future__ import annotations

import asyncio
import io
import json
import re
from contextlib import redirect_stdout
from dataclasses import replace
from pathlib import Path

import pytest

from bracing import cli, scenario, schedule
from bracing.evaluate import evaluate
from bracing.model import DEFAULT_RULES
from bracing.report import backfill_sheet, json_view, svg, text
from bracing.report import schedule as sheet

REPO = Path(__file__).resolve().parents[1]
SITES = sorted((REPO / "scenarios").glob("*.toml"))
US_UNITS = re.compile(r"(?<![A-Za-z_])(mph|ft|lbf?|lbs|psf|pcf|plf|psi|kips?)(?![A-Za-z_])")
SVG = re.compile(r"<svg.*?</svg>", re.DOTALL)


@pytest.fixture(scope="module")
def sites():
    """Each demo site file and its result, evaluated once for this module."""
    out = {}
    for path in SITES:
        site = scenario.load(path).site
        out[path.stem] = (site, evaluate(site, base_dir=path.parent))
    return out


def by_day(result, n):
    return next(d for d in result.days if d.day == n)


# --- the verdict ---------------------------------------------------------------------------------
def test_townhouse_day_2_says_first_which_walls_not_to_lift(sites):
    """Townhouse day 2: L1-F11 and L1-F12 are lifted with braces staked in the gas-line
    keep-clear strip (a danger finding of each wall); the forecast gust (21 mph) is below the
    day's stand-down gust. So not GO: GO WITH EXCEPTIONS, naming them, first in the text sheet,
    the HTML sheet and the check's day line; the finding listed once."""
    site, result = sites["townhouse-framing"]
    d = by_day(result, 2)
    assert d.verdict == "GO WITH EXCEPTIONS" and d.go is False
    assert d.do_not_lift == ["L1-F11", "L1-F12"]
    first = sheet.render(site, result, 2, "text", "us").splitlines()[0]
    assert first.startswith("GO WITH EXCEPTIONS") and "L1-F11" in first and "L1-F12" in first
    html = sheet.render(site, result, 2, "html", "us")
    body = re.sub(r"<[^>]+>", " ", html[html.index('<section class="day"'):])
    words = " ".join(body.split())
    assert words.startswith("▲ GO WITH EXCEPTIONS: do not lift L1-F11, L1-F12")
    day_line = next(line for line in text.site_text(result).splitlines()
                    if line.startswith("  day 2 "))
    assert "GO WITH EXCEPTIONS (do not lift L1-F11, L1-F12)" in day_line
    assert "License number" in html and "Daily inspection (common practice)" in html
    assert "foot anchor stake: set and tight" in html  # the anchor to check at each brace
    day2 = json.loads(json_view.dumps(json_view.site_record(result)))["days"][1]
    assert (day2["verdict"], day2["go"], day2["do_not_lift"]) == (
        "GO WITH EXCEPTIONS", False, ["L1-F11", "L1-F12"])  # JSON keys added, none renamed
    for out in (sheet.render(site, result, 2, "text", "us"), SVG.sub("", html)):
        assert out.count("enter the keep-clear area &#39;Gas service" if "<html" in out else
                         "enter the keep-clear area 'Gas service") == 1


def test_townhouse_day_2_in_the_day_view(sites):
    """The terminal interface's Day view opens with the same verdict (its first line)."""
    from tui.app import BracingApp

    app = BracingApp(str(REPO / "scenarios" / "townhouse-framing.toml"))

    async def run():
        async with app.run_test(size=(100, 30)) as pilot:
            await pilot.click("#--content-tab-day")
            await pilot.pause()
            app.day = 2
            await pilot.pause()
            verdict = str(app.query_one(".day-verdict").render())
            summary = str(app.query_one("#day-summary").render())
            assert verdict == "▲ GO WITH EXCEPTIONS"
            assert summary.startswith("▲ GO WITH EXCEPTIONS: do not lift L1-F11, L1-F12")
            assert summary.count("enter the keep-clear area 'Gas service") == 1

    asyncio.run(run())


def test_a_wall_standing_that_fails_makes_the_day_no_go(sites):
    """Townhouse day 4: L1-F11 and L1-F12 were lifted on day 2 and stand with the same danger;
    the forecast gust is below the stand-down gust, yet the day is NO-GO (they cannot be left
    unlifted), and `go` is False."""
    _, result = sites["townhouse-framing"]
    d = by_day(result, 4)
    assert d.wind_go is True
    assert (d.verdict, d.go, d.failing_standing) == ("NO-GO", False, ["L1-F11", "L1-F12"])


def test_go_only_with_the_forecast_below_every_stand_down_and_no_failing_wall(sites):
    """Every day of every demo site: GO exactly when the forecast is below the day's stand-down
    gust, no storm, and no wall standing that day fails or is named by a danger."""
    for _, result in sites.values():
        fails = {p.mark for p in result.failing()}
        for d in result.days:
            named = {m for f in d.why for m in f.marks}
            clear = not (fails & set(d.standing)) and not named and not d.why
            wind = (d.forecast_gust_mph is not None and not d.storm
                    and d.stand_down_speed_mph is not None
                    and d.forecast_gust_mph < d.stand_down_speed_mph)
            assert (d.verdict == "GO") == (clear and wind), d.day
            assert d.go is (True if d.verdict == "GO" else None if d.verdict == "NO CALL"
                            else False)


def test_marginal_day_within_10_percent(sites):
    """Method notes §6 (team rule): a day whose forecast gust is at least 0.9 of the stand-down
    gust is marginal. Tilt-up day 1 (stand-down 47 mph of S-12, nothing fails): at 0.95 x 47 =
    44.7 mph it is marginal; at 0.85 x 47 = 40.0 mph it is not; both are GO."""
    _, result = sites["tilt-up-warehouse"]
    panels = {p.mark: p for p in result.panels}
    d = by_day(result, 1)
    sd = d.stand_down_speed_mph
    near = schedule.judge(replace(d, forecast_gust_mph=0.95 * sd), panels)
    far = schedule.judge(replace(d, forecast_gust_mph=0.85 * sd), panels)
    assert (near.verdict, near.marginal) == ("GO", True)
    assert (far.verdict, far.marginal) == ("GO", False)
    assert "MARGINAL DAY" in sheet.actions(near, "us")[0]


def test_the_two_thresholds_as_actions(sites):
    """At the stand-down gust: stop lifting, clear the zones; at the working limit: everyone
    out, inspect before re-entry (design basis, method notes §5)."""
    site, result = sites["tilt-up-warehouse"]
    d = by_day(result, 5)
    out = sheet.render(site, result, 5, "text", "us")
    assert (f"At {d.stand_down_speed_mph:.0f} mph gusts: stop lifting, clear the zones."
            in out)
    assert (f"At {d.working_limit_speed_mph:.0f} mph gusts: everyone out; inspect braces and "
            "anchors before re-entry." in out)


# --- findings once, grouped ----------------------------------------------------------------------
def test_one_brace_struck_is_information_until_the_forecast_exceeds_it(sites):
    """Design basis (robustness): the limit with one brace struck is shown beside each wall; a
    warning only on a day whose forecast exceeds it. Tilt-up day 5: forecast 24 mph against
    one-brace-struck limits of 45-47 mph on every wall: no warning, and none of the 42
    `no-margin` lines that opened the sheet. Townhouse day 3 has a thunderstorm: one grouped
    warning naming every braced wall standing."""
    site, result = sites["tilt-up-warehouse"]
    out = sheet.render(site, result, 5, "text", "us")
    assert "WARNING" not in out and "no-margin" not in out
    assert out.count("one brace struck") == len(by_day(result, 5).standing)
    _, town = sites["townhouse-framing"]
    d3 = by_day(town, 3)
    struck = [f for f in d3.findings if f.code == "struck-brace"]
    assert len(struck) == 1 and struck[0].marks == d3.standing
    assert not [f for f in by_day(town, 1).findings if f.code == "struck-brace"]


def test_no_finding_twice_on_any_sheet(sites):
    """Every finding line of every day's text sheet appears once."""
    for site, result in sites.values():
        for page in sheet.render(site, result, None, "text", "us").split("=" * 100):
            found = [line for line in page.splitlines()
                     if re.match(r"\s+[✖▲•] (DANGER|WARNING|NOTICE):", line)]
            assert len(found) == len(set(found)), found


def test_check_says_the_rule_once_not_on_each_day(sites):
    """`check` of the tilt-up site: 40 day lines, none repeating the stand-down rule's
    sentence (its source is on the sheet and in the rules)."""
    _, result = sites["tilt-up-warehouse"]
    out = text.site_text(result)
    days = [line for line in out.splitlines() if line.startswith("  day ")]
    assert len(days) == 40
    assert not any("stand_down_ratio" in line or "team judgment" in line for line in days)
    assert out.splitlines()[0].startswith(("PASSES", "NOT GO"))


# --- every output -----------------------------------------------------------------------------
def outputs(site, result, units):
    """Every output of a site in `units`: check text, the schedule's text, CSV and HTML with the
    drawings embedded in it (overview, detail plans, elevations, sections: their words and
    scales), and the JSON (US by contract)."""
    yield "check", text.site_text(result, units)
    for form in ("text", "csv"):
        yield form, sheet.render(site, result, None, form, units)
    yield "html", sheet.render(site, result, None, "html", units)
    yield "plan", svg.plan_svg(result, None, units=units)


def test_si_outputs_hold_no_us_unit(sites):
    """--units si: no mph, ft, lb or psf in any output (findings' messages included); the JSON
    stays US with its documented keys."""
    for name, (site, result) in sites.items():
        for form, out in outputs(site, result, "si"):
            hit = US_UNITS.search(out)
            assert hit is None, (name, form, out[max(0, hit.start() - 80):hit.end() + 20])


def test_si_drawings_hold_no_us_unit(sites):
    """The drawings themselves with units='si' (as the crew sheet embeds them, and as any other
    caller gets them), the foundation walls' section sketches among them: no mph, ft, lb or psf
    in their words; the plans' scale as a ratio, e.g.
    1 in = 20 ft is 1:240 (20 ft x 12 in/ft; exact), 1 cm = 2.4 m. US by default."""
    for name, (site, result) in sites.items():
        days = [d.day for d in result.days] or [None]
        for day in days:
            drawn = [svg.overview_svg(result, day, units="si")]
            drawn += [s for _, s in backfill_sheet.sketches(result, day, "si")]
            drawn += [s for _, s in svg.detail_svgs(result, day, units="si")]
            drawn += list(svg.elevation_svgs(result, day, units="si").values())
            drawn += [svg.section_svg(p, units="si") for p in result.panels if p.braces]
            for out in drawn:
                words = " ".join(re.findall(r">([^<>]+)<", out))
                hit = US_UNITS.search(words)
                assert hit is None, (name, day, words[max(0, hit.start() - 80):hit.end() + 20])
            if svg.pick_plan(result.plan, day) is not None:
                assert re.search(r"Scale 1:\d+ \(1 cm = [\d.]+ m\)", drawn[0]), name
                assert "Scale 1 in = " in svg.overview_svg(result, day)  # US by default


def test_si_precision():
    """mm to the nearest 5, kN to 0.1, m/s to 0.1 (1 ft = 0.3048 m, 1 lbf = 4.448 N,
    1 mph = 0.44704 m/s, exact definitions)."""
    assert text.fmt(7.25, "in", "si") == "185 mm"        # 184.15 mm
    assert text.fmt(1200.0, "lbf", "si") == "5.3 kN"     # 5.338 kN
    assert text.fmt(58.0, "mph", "si") == "25.9 m/s"     # 25.93 m/s
    assert text.localize("stand-down 58 mph; foot 7.5 ft; 20 and 35 mph", "si") == \
        "stand-down 25.9 m/s; foot 2.29 m; 8.9 and 15.6 m/s"


def test_text_outputs_fold_to_100_columns(sites):
    """Letter and A4 portrait take 100 columns of text; SI quantities are folded as shown."""
    for site, result in sites.values():
        for units in ("us", "si"):
            for form, out in outputs(site, result, units):
                if form in ("check", "text"):
                    assert max(map(len, out.splitlines())) <= 100, (form, units)


def test_no_output_names_a_development_file_or_says_from_memory(sites):
    """Every output of every demo site (check, JSON, schedule text/CSV/HTML, plan, schema) and
    the site rules the Settings view lists: no 'design.md', no 'from memory'."""
    shown = [json.dumps(Site_schema())] + [f"{r.source} {r.basis}" for r in
                                           DEFAULT_RULES.values()]
    for site, result in sites.values():
        for units in ("us", "si"):
            shown += [out for _, out in outputs(site, result, units)]
        shown.append(json_view.dumps(json_view.site_record(result)))
        shown.append(svg.plan_svg(result, None))
    for out in shown:
        assert "design.md" not in out and "from memory" not in out.lower()
    assert any("unconfirmed value: confirm in" in out for out in shown)


def Site_schema():
    from bracing.model import Site

    return Site.model_json_schema()


# --- the command line ---------------------------------------------------------------------------
def run(*args) -> tuple[int, str]:
    out = io.StringIO()
    with redirect_stdout(out):
        code = cli.main(list(args))
    return code, out.getvalue()


def test_schedule_prints_text_and_writes_html_only_to_a_file(tmp_path):
    path = str(REPO / "scenarios" / "townhouse-framing.toml")
    code, out = run("schedule", path, "--day", "2")
    assert code == 1 and out.startswith("GO WITH EXCEPTIONS") and "<html" not in out
    assert run("schedule", path, "--day", "2", "--format", "html")[0] == 2
    page = tmp_path / "day2.html"
    # the townhouses fail (design.md §8a)
    assert run("schedule", path, "--day", "2", "-o", str(page))[0] == 1
    assert page.read_text(encoding="utf-8").startswith("<!DOCTYPE html>")


def test_site_units_default(tmp_path):
    """[site] units = "si" makes SI the default of the text outputs; --units us wins."""
    source = (REPO / "scenarios" / "townhouse-framing.toml").read_text(encoding="utf-8")
    site_file = tmp_path / "site.toml"
    site_file.write_text(source.replace("[site]\n", '[site]\nunits = "si"\n', 1),
                         encoding="utf-8")
    (tmp_path / "townhouse-framing-forecast.csv").write_text(
        (REPO / "scenarios" / "townhouse-framing-forecast.csv").read_text(encoding="utf-8"),
        encoding="utf-8")
    _, si = run("schedule", str(site_file), "--day", "2")
    assert " m/s" in si and not US_UNITS.search(si)
    _, us = run("schedule", str(site_file), "--day", "2", "--units", "us")
    assert " mph" in us


def test_neighbour_is_read_as_neighbor():
    """US spelling in site-file values; the older spelling is an alias."""
    from bracing.model import Area_

    assert Area_(name="x", kind="neighbour", polygon=[(0, 0), (1, 0), (1, 1)]).kind == \
        "neighbor"


def test_masonry_zones_use_the_regulations_term(sites):
    """OSHA 29 CFR 1926.706(a) (text): a masonry wall's zone is a 'limited access zone'."""
    site, result = sites["masonry-gym"]
    d = next(d for d in result.days if d.standing)
    out = sheet.render(site, result, d.day, "text", "us")
    walls = re.findall(r"; (limited access zone|zone) [\d.]+ ft braced side", " ".join(out.split()))
    assert walls and set(walls) == {"limited access zone"}  # every wall on the sheet is masonry


# --- the drawings on the crew sheet ---------------------------------------------------------------
@pytest.mark.parametrize("name, day", [("townhouse-framing", 2), ("tilt-up-warehouse", 5)])
def test_crew_sheet_carries_the_overview_a_detail_per_line_and_an_elevation_per_lift(
        sites, name, day):
    """The HTML crew sheet of a day holds the drawings themselves (issue 11): the overview of
    the site, one detail plan per wall line standing that day (every line with a standing wall
    appears among the details), each at full sheet width, and the elevation of each braced wall
    lifted that day under its brace table. No placeholder is left."""
    site, result = sites[name]
    html = sheet.render(site, result, day, "html", "us")
    overview = re.findall(r'<figure class="plan overview">\s*<svg', html)
    assert len(overview) == 1 and f"Site plan, day {day}:" in html
    g = svg.pick_plan(result.plan, day)
    lines_standing = {p.line for p in g.panels if p.standing}
    shown = re.findall(r'<figure class="plan detail" data-line="([^"]+)">\s*<svg', html)
    assert set(shown) == lines_standing and len(shown) == len(g.details())
    assert len(re.findall(r">Detail \d+ of \d+, day", html)) == len(shown)
    d = by_day(result, day)
    braced = {p.mark for p in result.panels if p.braces}
    lifted = [m for m in d.lifts if m in braced]
    drawn = re.findall(r'<div class="elevation" data-mark="([^"]+)">\s*<figure class="elevation">'
                       r'\s*<svg', html)
    assert sorted(drawn) == sorted(set(lifted)) and drawn
    assert "drawings' place" not in html


def test_the_plan_command_draws_in_the_units_asked_for(tmp_path):
    """`bracing plan --units si` (and a site whose [site] units are si): the plan's words hold
    no US unit; without it, US (1 in = 20 ft is 1:240, 20 ft x 12 in/ft: exact)."""
    site = Path(__file__).resolve().parents[1] / "scenarios" / "tilt-up-warehouse.toml"
    for extra, us in ((["--units", "si"], False), ([], True)):
        out = io.StringIO()
        with redirect_stdout(out):
            assert cli.main(["plan", str(site), *extra]) == 0
        words = " ".join(re.findall(r">([^<>]+)<", out.getvalue()))
        assert (US_UNITS.search(words) is not None) == us, extra
