"""The crew's day sheets in their three formats (`bracing.report.schedule` builds the pages):
HTML for print, CSV and plain text. Formatting only: every value is on the pages."""

from __future__ import annotations

import csv
import io
from pathlib import Path
from typing import TYPE_CHECKING

from jinja2 import Environment, FileSystemLoader, select_autoescape
from markupsafe import Markup

from bracing.report import backfill_sheet
from bracing.report.text import SI_PRECISION, WIDTH, localize, wrap
from bracing.results import SiteResult
from bracing.units import convert

if TYPE_CHECKING:
    from bracing.report.schedule import Page, Row

TEMPLATES = Path(__file__).with_name("templates")
ASCII = str.maketrans({"·": "-", "²": "^2", "³": "^3", "✔": "ok", "✖": "X", "▲": "!",
                       "○": "-", "•": "-", "—": "-"})


def number(value: float | None, unit: str, units: str, digits: int = 0):
    """A plain number in the chosen units for a spreadsheet cell ('' when there is none)."""
    if value is None:
        return ""
    shown, label = convert(value, unit, units)
    if units == "si" and label in SI_PRECISION:
        digits, step = SI_PRECISION[label]
        if step:
            shown = step * round(shown / step)
    return round(shown, digits) if digits else round(shown)


def _label(unit: str, units: str) -> str:
    return convert(1.0, unit, units)[1].translate(ASCII)


def html(result: SiteResult, pages: list[Page], units: str = "us") -> str:
    """The sheets as one HTML document for print, in the chosen units."""
    env = Environment(loader=FileSystemLoader(TEMPLATES), autoescape=select_autoescape(
        ["html", "j2"]), trim_blocks=True, lstrip_blocks=True)
    caution = (result.caution.replace("\\", "\\\\").replace('"', '\\"')
               .replace("<", "\\3C ").replace("\n", " "))  # a CSS string
    return localize(env.get_template("schedule.html.j2").render(
        result=result, pages=pages, caution_css=Markup(f'"{caution}"'),
        inspection=INSPECTION, inspection_basis=INSPECTION_BASIS, approval=APPROVAL), units)


CSV_COLUMNS = (
    ("day", None), ("date", None), ("go", None), ("forecast gust", "mph"),
    ("day stand-down gust", "mph"), ("wall", None), ("status", None), ("today", None),
    ("braces", None), ("positions from first edge", "ft"), ("insert height", "ft"),
    ("anchor distance from face", "ft"), ("brace length", "ft"), ("brace angle", "deg"),
    ("brace type", None), ("wall anchor", None), ("foot anchor", None),
    ("helical torque", "ft*lbf"), ("wall stand-down gust", "mph"),
    ("1-min sustained equivalent", "mph"), ("zone braced side", "ft"), ("zone behind", "ft"),
    ("working limit with one brace struck", "mph"),
)


def csv_text(result: SiteResult, pages: list[Page], units: str) -> str:
    """The header row first, one row per standing wall per day, then the caution in a last
    row of its own that starts with '#' (a spreadsheet keeps the header; a reader of data can
    skip it as a comment)."""
    out = io.StringIO()
    w = csv.writer(out)
    w.writerow([f"{name} ({unit if unit == 'deg' else _label(unit, units)})" if unit else name
                for name, unit in CSV_COLUMNS])
    for page in pages:
        d = page.day
        for r in page.walls:
            n = r.numbers
            w.writerow([
                d.day, d.date or "", d.verdict, number(d.forecast_gust_mph, "mph", units),
                number(d.stand_down_speed_mph, "mph", units), r.mark,
                f"{r.word} {r.symbol}".translate(ASCII), r.today, n.get("count", ""),
                n.get("positions", ""), n.get("insert", ""), n.get("anchor_distance", ""),
                n.get("length", ""), n.get("angle", ""), r.brace_type, r.wall_anchor,
                r.foot_anchor, n.get("torque", ""), n["stand_down"], n["sustained"],
                n["zone_front"], n["zone_back"], n.get("struck", "")])
    w.writerow([f"# {result.caution}"])
    return out.getvalue()


def plain_text(result: SiteResult, pages: list[Page], units: str = "us") -> str:
    """The same sheets as plain text, each at most WIDTH columns: the verdict first, then the
    caution, the lifts with their braces, the walls standing and their zones, the releases,
    the findings once each, inventory, rules, the daily inspection and the approval block."""
    out = []
    for page in pages:
        lines = [page.verdict]
        lines += [f"  {sym} {sev}: {walls}: {msg} [{src}]" if walls else
                  f"  {sym} {sev}: {msg} [{src}]" for sym, sev, walls, msg, src in page.why]
        lines += [f"  {a}" for a in page.actions]
        lines += [f"  Forecast {page.forecast}; stand-down gust {page.stand_down}; working "
                  f"limit {page.working_limit}",
                  f"  Stand-down as sustained wind: {page.sustained or 'none'}",
                  "", result.caution, "", page.title,
                  *(f"  {s}" for s in result.basis_statement)]
        lines += ["", f"LIFTS TODAY ({len(page.lifted)})"]
        lines += [x for r in page.lifted for x in _wall_lines(r)] or ["  none"]
        lines += [""] + backfill_sheet.text_lines(page.backfill) if page.backfill else []
        lines += ["", "RELEASES TODAY"] + [f"  {r}" for r in page.releases] or ["  none"]
        if not page.releases:
            lines.append("  none")
        lines += ["", f"WALLS STANDING ({len(page.walls)}) AND THEIR ZONES"]
        lines += [x for r in page.walls if r.today != "lifted today"
                  for x in _wall_lines(r, full=False)] \
            or ["  none besides today's lifts"]
        lines += ["", "FINDINGS (each once; walls that share one on one line)"]
        lines += [f"  {sym} {sev}: {walls}: {msg} [{src}]" if walls else
                  f"  {sym} {sev}: {msg} [{src}]" for sym, sev, walls, msg, src in page.flags] \
            or ["  none"]
        lines += ["", "INVENTORY (type: in use / on hand)"]
        lines += [f"  {kind} {name}: {n} / {hand}  {short}"
                  for kind, name, n, hand, short in page.inventory] or ["  none in use"]
        lines += ["", "RULES"] + [f"  {name} = {value} ({source}; {basis})"
                                  for name, value, source, basis in page.rules]
        lines += ["", f"DAILY INSPECTION ({INSPECTION_BASIS})"]
        lines += [f"  [ ] {item}" for item in INSPECTION]
        lines += ["", "APPROVED BY THE QUALIFIED PERSON (fill in before work starts)"]
        lines += [f"  {label}: {'_' * 40}" for label in APPROVAL]
        lines += ["", result.caution]
        out.append("\n".join(wrap(localize(line, units)) for line in lines))
        if page is not pages[-1]:
            out.append("=" * WIDTH)
    return "\n".join(out) + "\n"


INSPECTION_BASIS = "common practice"
INSPECTION = (
    "Every brace in place, as listed: count, insert height and foot distance.",
    "Brace pins, bolts and locking collars in place and tight; no bent or damaged brace.",
    "Wall inserts and foot anchors tight, no cracking or pull-out at the slab or ground.",
    "Helical anchors: torque as listed; stakes and deadmen not moved or undermined.",
    "Zones marked and kept clear; no equipment or stored material against the braces.",
    "After a gust above the stand-down gust, a struck brace or a night: inspect all again.",
)
APPROVAL = ("Name", "License number", "Date", "Signature")


def _wall_lines(r: Row, full: bool = True) -> list[str]:
    """One wall on the text sheet: its braces as the crew sets them (in brief unless `full`),
    its speeds and zone."""
    head = f"  {r.mark}  {r.symbol} {r.word}" + (f" ({r.today})" if r.today else "")
    if r.hold:
        head += "  ✖ DO NOT LIFT TODAY"
    lines = [head]
    if r.braced and not full:
        head += f"  {r.count} braces {r.brace_type}, insert {r.insert}, foot {r.anchor_distance}"
        lines = [head]
    elif r.braced:
        lines += [f"      {r.count} braces {r.brace_type} at {r.positions} from the first edge; "
                  f"insert {r.insert}, foot {r.anchor_distance} from the face, length "
                  f"{r.length}, {r.angle}",
                  f"      check: {r.to_check}"]
    speeds = f"stand-down {r.stand_down} (1-min mean {r.sustained})"
    if r.braced:
        speeds += f"; one brace struck {r.struck}"
    lines.append(f"      {speeds}; {r.zone_word} {r.zone_front} braced side, {r.zone_back} "
                 "behind")
    return lines
