"""The reviewer's findings report: only what needs action, worst first, each finding once, then
what the check left out (`SiteResult.not_checked`). Text (100 columns) and printable HTML.

It selects and orders what the result object holds; it computes no engineering value.
"""

from __future__ import annotations

import math
import textwrap
from dataclasses import dataclass, field
from pathlib import Path

from jinja2 import Environment, FileSystemLoader, select_autoescape
from markupsafe import Markup

from bracing.layout import ADVICE
from bracing.report.json_view import as_output
from bracing.report.text import fmt
from bracing.results import SEVERITIES, Check, DayResult, PanelResult, SiteResult

WIDTH = 100
TEMPLATES = Path(__file__).parent / "templates"
# flags that restate a failing check of the same wall ("...-over": a utilization past 1.0;
# "fails-unbraced": the wall's own overturning or sliding check)
RESTATES_A_CHECK = ("fails-unbraced",)
# day findings that restate a wall's own status
RESTATES_A_WALL = ("unsafe-standing",)
BRACE_IT = ("brace the wall before release from the crane; the layout designer (bracing check "
            "SITE --design) lays out the fewest braces that pass")


@dataclass(slots=True)
class Finding:
    """One thing to act on: a failing check of a wall, or a danger or warning finding."""

    severity: str
    where: list[str]            # wall marks, or "day N"
    element: str
    message: str
    source: str
    combination: str = ""
    demand: float | None = None
    capacity: float | None = None
    unit: str = ""
    utilization: float | None = None
    fix: str = ""
    also: list[str] = field(default_factory=list)  # other regions of the same element
    varies: bool = False  # a warning shared by walls whose messages differ (their figures)

    @property
    def rank(self) -> tuple:
        u = self.utilization
        return (SEVERITIES.index(self.severity), u is None, -(u if u is not None else 0.0))


def _check_finding(p: PanelResult, checks: list[Check]) -> Finding:
    worst = checks[0]
    fix = ADVICE.get(worst.element, "") if p.braces else BRACE_IT
    return Finding(
        severity="danger", where=[p.mark], element=worst.element,
        message=f"{worst.element} ({worst.region}) fails", source=worst.source,
        combination=worst.combination, demand=worst.demand, capacity=worst.capacity,
        unit=worst.unit, utilization=worst.utilization, fix=fix,
        also=[f"{c.region} {_u(c.utilization)}" for c in checks[1:]])


def collect(result: SiteResult) -> list[Finding]:
    """What needs action, worst first: failing checks (one per wall and element, the worst
    region), then danger and warning findings; a finding shared by walls or days is one entry."""
    found: list[Finding] = []
    grouped: dict[tuple, Finding] = {}
    wall_codes: set[str] = set()
    for p in result.worst_first():
        found += _wall_findings(p, grouped, wall_codes)
    for d in result.days:
        _day_findings(d, grouped, wall_codes)
    for f in result.flags:
        if f.severity != "notice":
            found.append(Finding(severity=f.severity, where=["site"], element=f.code,
                                 message=f.message, source=f.source))
    found += grouped.values()
    return sorted(found, key=lambda f: f.rank)


def _wall_findings(p: PanelResult, grouped: dict[tuple, Finding],
                   wall_codes: set[str]) -> list[Finding]:
    """A wall's failing checks (one finding per element); its danger and warning flags go into
    `grouped` (one entry per code, and per message for a danger), their codes into
    `wall_codes`."""
    failing: dict[str, list[Check]] = {}
    for c in p.worst_first():
        if not c.passes:
            failing.setdefault(c.element, []).append(c)
    for f in p.flags_worst_first():
        wall_codes.add(f.code)
        if f.severity == "notice" or f.code.endswith("-over") or (
                failing and f.code in RESTATES_A_CHECK):
            continue
        key = (f.code, f.message if f.severity == "danger" else "")
        if key in grouped:
            grouped[key].where.append(p.mark)
            grouped[key].varies |= f.message != grouped[key].message
            continue
        fix = BRACE_IT if f.code in RESTATES_A_CHECK else ""
        grouped[key] = Finding(severity=f.severity, where=[p.mark], element=f.code,
                               message=f.message, source=f.source, fix=fix)
    return [_check_finding(p, cs) for cs in failing.values()]


def _day_findings(d: DayResult, grouped: dict[tuple, Finding], wall_codes: set[str]) -> None:
    """A day's danger and warning flags into `grouped` (one entry per code and message), but
    those that restate a wall's."""
    for f in d.flags:
        if f.severity == "notice" or f.code in RESTATES_A_WALL or f.code in wall_codes:
            continue
        key = ("day", f.code, f.message)
        if key in grouped:
            grouped[key].where.append(f"day {d.day}")
            continue
        grouped[key] = Finding(severity=f.severity, where=[f"day {d.day}"], element=f.code,
                               message=f.message, source=f.source)


def _u(u: float | None) -> str:
    if u is None:
        return ""
    return "unbounded" if math.isinf(u) else f"{u:.2f}"


def _where(f: Finding) -> str:
    if len(f.where) > 6:
        return f"{', '.join(f.where[:6])} and {len(f.where) - 6} more ({len(f.where)} in all)"
    return ", ".join(f.where)


def _unit(unit: str) -> str:
    return {"lb·ft": "ft*lbf", "lb": "lbf"}.get(unit, unit)


def rows(result: SiteResult, system: str = "us") -> list[dict]:
    """The findings as the printed rows (text and HTML share them)."""
    out = []
    for i, f in enumerate(collect(result), 1):
        has_check = f.utilization is not None
        out.append({
            "n": i, "severity": f.severity, "where": _where(f), "walls": len(f.where),
            "element": f.element, "source": as_output(f.source),
            "message": f"for {f.where[0]} (the others alike): {f.message}" if f.varies
                       else f.message,
            "combination": f.combination,
            "demand": fmt(f.demand, _unit(f.unit), system) if has_check else "",
            "capacity": fmt(f.capacity, _unit(f.unit), system) if has_check else "",
            "utilization": _u(f.utilization), "fix": f.fix,
            "also": ", ".join(f.also),
        })
    return out


def rules_in_force(review: dict) -> list[dict]:
    return [{**r, "value": f"{r['value']:g}", "source": as_output(r["source"])}
            for r in review["rules"] if r["in_force"] and r["value"] is not None]




def not_checked_rows(result: SiteResult) -> list[dict]:
    return [{"item": n.item, "reason": n.reason, "source": n.source,
             "walls": (f"{len(n.walls)} wall(s): " + ", ".join(n.walls[:8])
                       + (" ..." if len(n.walls) > 8 else "")) if n.walls else "the site"}
            for n in result.not_checked]


def _wrap(text: str, indent: str = "", first: str | None = None) -> list[str]:
    return textwrap.wrap(text, WIDTH, initial_indent=indent if first is None else first,
                         subsequent_indent=indent, break_on_hyphens=False) or [indent]


def render_text(result: SiteResult, review: dict, system: str = "us") -> str:
    """The findings report as text wrapped to 100 columns, the caution first and last."""
    lines = _wrap(result.caution)
    lines += ["", *_wrap(f"FINDINGS for review: {result.name}")]
    lines += _wrap(f"site file {review['site_file']}, SHA-256 {review['site_file_sha256']}; "
                   f"{review['tool']} {review['tool_version']}; {review['date_utc']}", "  ")
    lines += _wrap(f"method: {review['method']}", "  ")
    for s in result.basis_statement:
        lines += _wrap(s, "  ")
    found = rows(result, system)
    verdict = ("FAILS: act on the findings below before work goes on" if result.fails else
               "no failing check and no danger finding")
    lines += ["", *_wrap(f"Verdict: {verdict}. {len(found)} finding(s), worst first.")]
    for r in found:
        head = f"{r['n']}. {r['severity'].upper()} {r['where']}: {r['element']}"
        lines += [""] + _wrap(head)
        if r["utilization"]:
            lines += _wrap(f"demand {r['demand']} / capacity {r['capacity']} = utilization "
                           f"{r['utilization']} [{r['combination']}]", "     ")
            if r["also"]:
                lines += _wrap(f"also failing: {r['also']}", "     ")
        else:
            lines += _wrap(r["message"], "     ")
        lines += _wrap(f"source: {r['source']}", "     ")
        if r["fix"]:
            lines += _wrap(f"suggested fix: {r['fix']}", "     ")
    lines += ["", *_wrap("RULES in force:")]
    for r in rules_in_force(review):
        lines += _wrap(f"{r['name']} = {r['value']} ({r['source']}; {r['basis']})", "    ",
                       "  - ")
    lines += ["", *_wrap("NOT CHECKED for this site (the limits of this check; method notes "
                         "§11):")]
    for n in not_checked_rows(result):
        lines += _wrap(f"{n['item']} ({n['walls']}): {n['reason']} [{n['source']}]", "    ",
                       "  - ")
    lines += ["", *_wrap(result.caution)]
    return "\n".join(lines)


def render_html(result: SiteResult, review: dict, system: str = "us") -> str:
    """The findings report as a printable page (Letter or A4) with an approval block."""
    env = Environment(loader=FileSystemLoader(TEMPLATES), autoescape=select_autoescape(
        ["html", "j2"]), trim_blocks=True, lstrip_blocks=True)
    caution = (result.caution.replace("\\", "\\\\").replace('"', '\\"')
               .replace("<", "\\3C ").replace("\n", " "))  # a CSS string
    return env.get_template("findings.html.j2").render(
        result=result, review=review, findings=rows(result, system),
        not_checked=not_checked_rows(result), rules=rules_in_force(review),
        caution_css=Markup(f'"{caution}"'))
