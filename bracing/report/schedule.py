"""The crew's brace schedule of a day (design.md §1, §7): HTML for print, CSV and plain text.

Every value comes from the result object (walls, days, zones, gear, rules, the numbers on
hand); this module only picks and formats them, and reads no site file. Each day is one page:
the caution at its top and bottom, the declared basis, the wind go / no-go, lifts and releases,
the brace schedule of the walls standing, the walls standing without braces, the inventory, the
plan and a section sketch of each braced wall. Pass or fail is shown by a symbol and a word as
well as colour. The three formats are in `schedule_formats`.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from markupsafe import Markup

from bracing.model import Site
from bracing.report import backfill_sheet
from bracing.report.schedule_formats import csv_text, html, number, plain_text
from bracing.report.text import fmt, localize
from bracing.results import DayResult, PanelResult, SiteResult

STATUS_SYMBOL = {"unsafe": "✖", "needs_braces": "▲", "braced": "✔", "stands": "○"}
STATUS_WORD = {"unsafe": "UNSAFE", "needs_braces": "NEEDS BRACES", "braced": "braced",
               "stands": "stands"}
FLAG_SYMBOL = {"danger": "✖", "warning": "▲", "notice": "•"}
VERDICT_LOOK = {"GO": ("✔", "GO", "go"), "GO WITH EXCEPTIONS": ("▲", "GO WITH EXCEPTIONS",
                                                               "except"),
                "NO-GO": ("✖", "NO-GO", "nogo"), "NO CALL": ("?", "NO CALL", "none")}
DAY_RULES = ("stand_down_ratio",)
MASONRY_RULES = ("masonry_initial_speed_mph", "masonry_intermediate_speed_mph",
                 "masonry_zone_extra_ft")


class NoSuchDay(ValueError):
    """A day the schedule does not have."""


@dataclass
class Row:
    """One standing wall on a day's sheet, formatted in the chosen units."""

    mark: str
    status: str
    symbol: str
    word: str
    today: str
    braced: bool
    count: str = ""
    positions: str = ""
    insert: str = ""
    anchor_distance: str = ""
    length: str = ""
    angle: str = ""
    brace_type: str = ""
    wall_anchor: str = ""
    foot_anchor: str = ""
    torque: str = ""
    to_check: str = ""  # the torque or pin the crew checks at each brace
    struck: str = ""  # working limit with one brace struck (information, method notes §4)
    hold: bool = False  # a lift not to make today
    zone_word: str = "zone"  # masonry: OSHA 1926.706(a)'s own term, "limited access zone"
    stand_down: str = ""
    sustained: str = ""
    zone_front: str = ""
    zone_back: str = ""
    numbers: dict = field(default_factory=dict)  # CSV cells: plain numbers in the units chosen


@dataclass
class Page:
    """One day's sheet."""

    day: DayResult
    title: str
    go: tuple[str, str, str]
    reason: str
    forecast: str
    stand_down: str
    sustained: str
    working_limit: str
    lifts: list[str]
    releases: list[str]
    verdict: str  # the headline: the verdict and the walls not to lift, first on the sheet
    why: list[tuple[str, str, str, str, str]]  # symbol, SEVERITY, walls, message, source
    actions: list[str]  # the two thresholds as actions, and a marginal day
    flags: list[tuple[str, str, str, str, str]]  # the day's other findings, grouped, as `why`
    walls: list[Row]  # standing, then released today, as the day lists them
    lifted: list[Row]  # today's lifts
    rows: list[Row]  # the braced ones
    unbraced: list[Row]
    inventory: list[tuple[str, str, str, str, str]]  # kind, type, in use, on hand, short
    rules: list[tuple[str, str, str, str]]  # name, value, source, basis
    overview_svg: Markup | None = None  # the whole site that day
    details: list[tuple[str, Markup]] = field(default_factory=list)  # (wall line, plan)
    elevations: dict[str, Markup] = field(default_factory=dict)  # today's lifts, by mark
    sections: list[tuple[str, Markup]] = field(default_factory=list)
    backfill: list = field(default_factory=list)  # backfill_sheet.BackfillRow, worst first
    backfill_sketches: list[tuple[str, Markup]] = field(default_factory=list)


def render(site: Site, result: SiteResult, day: int | None, fmt_name: str, units: str) -> str:
    """The schedule of `day` (None: every day something stands) as 'html', 'csv' or 'text'."""
    pages = build_pages(site, result, day, units, pictures=fmt_name == "html")
    if fmt_name == "html":
        return html(result, pages, units)
    if fmt_name == "csv":
        return csv_text(result, pages, units)
    if fmt_name == "text":
        return plain_text(result, pages, units)
    raise ValueError(f"unknown format {fmt_name!r} (html, csv or text)")


def pick_days(site: Site, result: SiteResult, day: int | None) -> list[DayResult]:
    """The days to print: one, every day with a wall standing, lifted or released, or day 0 (the
    whole site together) when the site file gives no lift days."""
    if not result.days:
        if any(p.lift_day is not None for p in site.panels) or result.together is None:
            raise ValueError("the result has no days: give the result of "
                             "bracing.evaluate.evaluate for this site")
        if day is not None:
            raise NoSuchDay(f"day {day}: the site file gives no lift days (leave out --day for "
                            "the sheet of every wall)")
        return [result.together]
    if day is None:
        return [d for d in result.days if d.standing or d.lifts or d.released
                or backfill_sheet.rows(result, d.day)]  # or a foundation wall to backfill
    found = [d for d in result.days if d.day == day]
    if not found:
        raise NoSuchDay(f"day {day} is not in the schedule (days {result.days[0].day} to "
                        f"{result.days[-1].day})")
    return found


def build_pages(site: Site, result: SiteResult, day: int | None, units: str,
                pictures: bool = False) -> list[Page]:
    """The formatted pages of the days asked for (pictures: the plan and section SVGs); `site`
    is the site `result` is of (it must have its days)."""
    days = pick_days(site, result, day)
    svg = _svg() if pictures else None
    by_mark = {p.mark: p for p in result.panels}
    sections: dict[str, Markup] = {}

    def drawn_section(p: PanelResult) -> Markup:  # drawn once per wall, shown every day
        if p.mark not in sections:
            sections[p.mark] = _inline(svg.section_svg(p, units=units))
        return sections[p.mark]

    pages = []
    for d in days:
        walls = [by_mark[m] for m in d.standing + d.released]
        rows = [_row(p, d, units) for p in walls]
        page = Page(
            day=d, title=_title(result, d), go=VERDICT_LOOK[d.verdict], reason=d.reason,
            forecast=_forecast(d, units),
            stand_down=(f"{_speed(d.stand_down_speed_mph, units)} ({d.governing_wall})"
                        if d.governing_wall else "none"),
            sustained=_sustained(result, d, units),
            working_limit=_speed(d.working_limit_speed_mph, units),
            lifts=d.lifts, releases=[_release(by_mark[m]) for m in d.released],
            verdict=headline(d, units), why=grouped(d.why), actions=actions(d, units),
            flags=grouped(d.findings), walls=rows, lifted=[r for r in rows if r.today ==
                                                            "lifted today"],
            rows=[r for r in rows if r.braced],
            unbraced=[r for r in rows if not r.braced], inventory=_inventory(result, d),
            rules=_rules(result, walls), backfill=backfill_sheet.rows(result, d.day, units))
        if svg is not None:
            page.backfill_sketches = [(m, _inline(drawing)) for m, drawing
                                      in backfill_sheet.sketches(result, d.day, units)]
            page.overview_svg = _inline(svg.overview_svg(result, d.day or None, units=units))
            page.details = [(detail.line, _inline(drawing)) for detail, drawing
                            in svg.detail_svgs(result, d.day or None, units=units)]
            lifted = {r.mark for r in page.lifted}
            page.elevations = {m: _inline(drawing) for m, drawing
                               in svg.elevation_svgs(result, d.day or None, units=units).items()
                               if m in lifted}
            page.sections = [(p.mark, drawn_section(p)) for p in walls if p.braces]
        pages.append(page)
    return pages


def _svg():
    from bracing.report import svg  # drawn by the plan views

    return svg


def _inline(svg_text: str) -> Markup:
    """An SVG document as markup to place inside HTML (its XML declaration dropped)."""
    if svg_text.startswith("<?xml"):
        svg_text = svg_text.split("?>", 1)[1].lstrip()
    return Markup(svg_text)


def _title(result: SiteResult, d: DayResult) -> str:
    if d.day == 0:
        return f"{result.name}: every wall standing together (the site file gives no lift days)"
    return f"{result.name}: day {d.day}" + (f", {d.date}" if d.date else "")


def _speed(mph: float | None, units: str) -> str:
    return fmt(mph, "mph", units, 0 if units == "us" else 1)


def _forecast(d: DayResult, units: str) -> str:
    if d.forecast_gust_mph is None:
        return "no forecast" + (", thunderstorm forecast" if d.storm else "")
    return f"gust {_speed(d.forecast_gust_mph, units)}" + (", THUNDERSTORM" if d.storm else "")


def _sustained(result: SiteResult, d: DayResult, units: str) -> str:
    """The sustained-wind equivalents of the day's stand-down gust (its governing wall's)."""
    if d.governing_wall is None:
        return ""
    if d.governing_wall in d.foundation_standing:  # a foundation wall's wind part
        eq = next(x.sustained_equivalents_mph for w in result.foundation_walls
                  if w.mark == d.governing_wall for x in w.days if x.day == d.day) or {}
    else:
        eq = result.panel(d.governing_wall).speeds_on(d.governing_wall in d.fresh_mortar)[2]
    return ", ".join(f"{name} mean {_speed(eq[name], units)}" for name in ("1-min", "2-min",
                                                                          "10-min") if name in eq)


def _release(p: PanelResult) -> str:
    by = p.released_by
    return f"{p.mark} (signed off by {by}: braces off after the sign-off)" if by else p.mark


def headline(d: DayResult, units: str = "us") -> str:
    """The day's verdict in one line: the word, then the walls not to lift or that stand and
    fail, else the forecast against the stand-down gust (as the engine judged it)."""
    parts = []
    if d.failing_standing:
        parts.append(f"{', '.join(d.failing_standing)} stand(s) and fail(s): keep out of the "
                     "zones")
    if d.do_not_lift:
        parts.append(f"do not lift {', '.join(d.do_not_lift)}")
    if not parts and any(not f.marks for f in d.why):
        parts.append(next(f.message for f in d.why if not f.marks))
    if not parts or d.wind_go is False:
        parts.append(_wind_short(d, units))
    return localize(f"{d.verdict}: {'; '.join(parts)}", units)


def _wind_short(d: DayResult, units: str) -> str:
    if d.storm:
        return "thunderstorm forecast (counts as exceeding the stand-down gust)"
    if d.forecast_gust_mph is None or d.stand_down_speed_mph is None:
        return d.wind
    sign = "<" if d.wind_go else ">="
    return (f"forecast gust {_speed(d.forecast_gust_mph, units)} {sign} stand-down "
            f"{_speed(d.stand_down_speed_mph, units)} ({d.governing_wall})")


def actions(d: DayResult, units: str) -> list[str]:
    """The day's two thresholds as actions (design.md §3 through method notes §5), and a word
    on a marginal day."""
    out = []
    if d.marginal:
        out.append("MARGINAL DAY: the forecast gust is within 10 % of the stand-down gust: "
                   "watch the wind and be ready to stop")
    if d.stand_down_speed_mph is not None:
        out.append(f"At {_speed(d.stand_down_speed_mph, units)} gusts: stop lifting, clear "
                   "the zones.")
    if d.working_limit_speed_mph is not None:
        out.append(f"At {_speed(d.working_limit_speed_mph, units)} gusts: everyone out; "
                   "inspect braces and anchors before re-entry.")
    return out


def grouped(found) -> list[tuple[str, str, str, str, str]]:
    """Grouped findings (DayFinding): symbol, SEVERITY, the walls (a count when many), message,
    source."""
    out = []
    for f in found:
        walls = ", ".join(f.marks)
        if len(f.marks) > 2:
            walls = f"{len(f.marks)} walls: {walls}"
        out.append((FLAG_SYMBOL[f.severity], f.severity.upper(), walls, f.message, f.source))
    return out


def _row(p: PanelResult, d: DayResult, units: str) -> Row:
    """One wall's line of the sheet: where its braces go, with what, and its zone."""
    front, back = p.zone.front_ft, p.zone.back_ft
    today = "lifted today" if p.mark in d.lifts else ""
    today = "released today" if p.mark in d.released else today
    stand_down, _, sustained = p.speeds_on(p.mark in d.fresh_mortar)  # fresh mortar today?
    row = Row(p.mark, p.status, STATUS_SYMBOL[p.status], STATUS_WORD[p.status], today,
              braced=bool(p.braces), stand_down=_speed(stand_down, units),
              sustained=_speed(sustained.get("1-min"), units),
              zone_front=fmt(front, "ft", units, 1), zone_back=fmt(back, "ft", units, 1),
              hold=p.mark in d.do_not_lift,
              zone_word="limited access zone" if p.material == "masonry" else "zone")
    row.numbers = {"stand_down": number(stand_down, "mph", units),
                   "sustained": number(sustained.get("1-min"), "mph", units),
                   "zone_front": number(front, "ft", units, 1),
                   "zone_back": number(back, "ft", units, 1)}
    if not p.braces:
        return row
    b = p.braces
    gear = p.hardware
    positions = b.get("positions_ft", [])
    row.count = str(b["count"])
    row.positions = ", ".join(fmt(x, "ft", units, 1) for x in positions)
    row.insert = fmt(b["insert_height_ft"], "ft", units, 1)
    row.anchor_distance = fmt(b["anchor_distance_ft"], "ft", units, 1)
    row.length = fmt(b["length_ft"], "ft", units, 2)
    row.angle = f"{b['angle_deg']:.0f}°"
    row.brace_type = gear.brace_type or "not named"
    row.wall_anchor = gear.wall_anchor or "none"
    row.foot_anchor = gear.foot_anchor or "none"
    torque = b.get("installation_torque_ftlb")
    row.torque = fmt(torque, "ft*lbf", units) if torque is not None else ""
    row.to_check = "; ".join(
        ([f"wall anchor {gear.wall_anchor}: pin or bolt in and tight"] if gear.wall_anchor
         else []) + [f"foot anchor {row.foot_anchor}: " + (
             f"installed to at least {row.torque}" if torque is not None else "set and tight")])
    row.struck = _speed(b.get("working_limit_one_missing_mph"), units)
    row.numbers.update(
        count=b["count"],
        positions="; ".join(str(number(x, "ft", units, 1)) for x in positions),
        insert=number(b["insert_height_ft"], "ft", units, 1),
        anchor_distance=number(b["anchor_distance_ft"], "ft", units, 1),
        length=number(b["length_ft"], "ft", units, 2),
        angle=round(b["angle_deg"], 1),
        torque="" if torque is None else number(torque, "ft*lbf", units),
        struck=number(b.get("working_limit_one_missing_mph"), "mph", units))
    return row


def _inventory(result: SiteResult, d: DayResult) -> list[tuple[str, str, str, str, str]]:
    """Braces and anchors in use by type against the number on hand, short ones marked."""
    rows = []
    for kind, used in (("braces", d.braces_in_use), ("anchors", d.anchors_in_use)):
        for name, n in sorted(used.items()):
            on_hand = result.on_hand.get(kind, {}).get(name)
            short = d.short.get(kind, {}).get(name)
            rows.append((kind[:-1], name, str(n), "not given" if on_hand is None else
                         str(on_hand), f"✖ SHORT {short}" if short else "✔ ok"))
    return rows


# a rule's unit, from the end of its name (shown with its value; SI by `localize`)
RULE_UNITS = {"_mph": " mph", "_ft": " ft", "_psf": " psf", "_deg": " deg", "_days": " days"}


def _rules(result: SiteResult, walls: list[PanelResult]) -> list[tuple[str, str, str, str]]:
    """The site rules behind the day's speeds and zones: value, source and basis (§7)."""
    names = list(DAY_RULES)
    if any(p.material == "masonry" for p in walls):
        names += MASONRY_RULES
    out = []
    for name in names:
        r = result.rules[name]
        unit = next((u for suffix, u in RULE_UNITS.items() if name.endswith(suffix)), "")
        value = "off" if not r.enabled or r.value is None else f"{r.value:g}{unit}"
        out.append((name, value, r.source, r.basis))
    return out
