"""Plain-text reports for a terminal or a printout: caution first, failing checks first."""

from __future__ import annotations

import math
import re
import textwrap

from bracing.results import SEVERITIES, STATUSES, VERDICTS, Check, PanelResult, SiteResult
from bracing.units import convert

SYMBOL = {"danger": "!!", "warning": "! ", "notice": "- "}
SEVERITY_RANK = {s: i for i, s in enumerate(SEVERITIES)}


# SI precision by display unit: (decimals, step); mm to the nearest 5, kN to 0.1
SI_PRECISION = {"m": (2, 0), "mm": (0, 5), "kN": (1, 0), "kN·m": (1, 0), "kPa": (2, 0),
                "MPa": (1, 0), "m/s": (1, 0), "kN/m": (2, 0), "kN/m³": (1, 0), "m²": (1, 0),
                "mm²": (0, 5)}


def fmt(value: float | None, unit: str, system: str = "us", digits: int = 0) -> str:
    """A value in the chosen unit system, e.g. '28 psf' or '1.35 kPa' (SI at SI_PRECISION);
    'none' where it does not apply (None), 'unknown' (NaN), 'unbounded' (inf)."""
    if value is None or (isinstance(value, float) and not math.isfinite(value)):
        return "none" if value is None else "unknown" if math.isnan(value) else "unbounded"
    shown, label = convert(value, unit, system)
    if system == "si" and label in SI_PRECISION:
        digits, step = SI_PRECISION[label]
        if step:
            shown = step * round(shown / step)
        elif 0 < abs(shown) < 1:  # a small value keeps two figures
            digits = max(digits, 2)
    return f"{shown:,.{digits}f} {label}"


# US quantities written in free text (findings' messages, reasons, the basis, drawings' labels):
# the one way every view shows them in SI (`localize`). The engine writes US units.
_NUMBER = r"(\d+/\d+|\d{1,3}(?:,\d{3})+(?:\.\d+)?|\d+(?:\.\d+)?)"
_TEXT_UNITS = (  # (pattern, engine unit, factor), longest first
    (r"ft²|ft\^2|sq ?ft|square feet", "ft**2", 1.0), (r"in²|in\^2", "in**2", 1.0),
    (r"lb·ft|lb-ft|ft-lbs?|ft·lbf?|ft\*lbf|lbf·ft", "ft*lbf", 1.0), (r"mph", "mph", 1.0),
    (r"kips?", "lbf", 1000.0), (r"lbf|lbs|lb", "lbf", 1.0), (r"psf", "psf", 1.0),
    (r"pcf", "pcf", 1.0), (r"plf", "plf", 1.0), (r"psi", "psi", 1.0),
    (r"feet|foot|ft", "ft", 1.0),
    (r"in(?!\s+(?:the|use|a|an|its|each|one|plan|place|line|front|all|service|any)\b)|inch(?:es)?",
     "in", 1.0),
)
_QUANTITY = re.compile(
    rf"(?<![\w.]){_NUMBER}(?:(\s*(?:and|to|or|-|–)\s*){_NUMBER})?\s?(?:-\s?)?("
    + "|".join(f"(?:{p})" for p, _, _ in _TEXT_UNITS) + r")(?![A-Za-z0-9_²^])")
_UNIT_OF = [(re.compile(rf"(?:{p})$"), unit, factor) for p, unit, factor in _TEXT_UNITS]


def _number(text: str) -> float:
    if "/" in text:
        top, bottom = text.split("/")
        return float(top) / float(bottom)
    return float(text.replace(",", ""))


def _si_quantity(match: re.Match) -> str:
    first, joint, second, token = match.groups()
    unit, factor = next((u, f) for rx, u, f in _UNIT_OF if rx.match(token))
    decimals = max((len(n.partition(".")[2]) for n in (first, second) if n), default=0)
    shown = [fmt(_number(n) * factor, unit, "si", decimals) for n in (first, second) if n]
    if len(shown) == 2:  # "20 and 35 mph": both numbers converted, the unit said once
        return f"{shown[0].rsplit(' ', 1)[0]}{joint}{shown[1]}"
    return shown[0]


_PER = re.compile(r"\bper (?:foot|ft)(?![A-Za-z0-9_²^])")


def localize(text: str, system: str) -> str:
    """`text` with its US quantities ("58 mph", "7.5 ft", "1,200 lb", "per ft") in the chosen
    system; unchanged for 'us'."""
    if system != "si":
        return text
    text = _PER.sub("per m", _QUANTITY.sub(_si_quantity, text))
    return _SAID_TWICE.sub(r"\1", text)  # "115 mph (51.4 m/s)" reads "51.4 m/s" once


_SAID_TWICE = re.compile(r"(\d[\d,.]* [^\s()]+) \(\1\)")


WIDTH = 100  # text outputs' columns: they print on letter and A4 portrait
NUMBER_AND_UNIT = re.compile(r"(\d) (?=[A-Za-z°/%²³·]+\b)")


def wrap(line: str) -> str:
    """A line folded to WIDTH columns, its continuation indented under its text; a number
    stays with its unit."""
    if len(line) <= WIDTH:
        return line
    indent = " " * (len(line) - len(line.lstrip()) + 4)
    kept = NUMBER_AND_UNIT.sub("\\1\0", line)
    return "\n".join(textwrap.wrap(kept, WIDTH, subsequent_indent=indent,
                                    break_on_hyphens=False)).replace("\0", " ")


def utilization_mark(u: float) -> str:
    """Pass or fail in words and a symbol, never by colour alone."""
    return "FAIL x" if u > 1.0 else "ok"


# a check per ft of wall: lb·ft per ft is a force (kN·m per m), lb per ft a line load
PER_FOOT = {"ft*lbf": ("lbf", "kN·m/m"), "lbf": ("plf", "kN/m")}
PER_FOOT_UNITS = {"lb·ft/ft": "ft*lbf", "lb/ft": "lbf"}  # checks' units per ft of wall


def check_line(c: Check, system: str) -> str:
    u = c.utilization
    demand, capacity = check_values(c, system)
    return (f"  {utilization_mark(u):6} {c.element} ({c.region}): {demand} / {capacity} = "
            f"{'inf' if math.isinf(u) else f'{u:.2f}'}  [{c.combination}; {c.source}]")


def check_values(c: Check, system: str) -> tuple[str, str]:
    """A check's demand and capacity in the chosen units (a foundation wall's per ft of wall,
    per m in SI)."""
    unit = {"lb·ft": "ft*lbf", "lb": "lbf", "psf": "psf"}.get(c.unit, c.unit)
    per_foot = "per ft" in c.region
    if system == "si" and c.unit in PER_FOOT_UNITS:  # a foundation wall's, per ft of wall
        unit, per_foot = PER_FOOT_UNITS[c.unit], True
    demand, capacity = fmt(c.demand, unit, system), fmt(c.capacity, unit, system)
    if system == "si" and per_foot and unit in PER_FOOT:  # per m of wall in SI
        unit, label = PER_FOOT[unit]
        demand, capacity = (fmt(v, unit, system).replace(convert(1.0, unit, system)[1], label)
                            for v in (c.demand, c.capacity))
    return demand, capacity


def panel_text(p: PanelResult, system: str = "us") -> list[str]:
    """The lines of one wall's report, failing checks and worst flags first."""
    w, u = p.wind, p.unbraced
    lines = [
        f"{p.mark}  {p.material}  {fmt(p.height_ft, 'ft', system, 1)} tall x "
        f"{fmt(p.width_ft, 'ft', system, 1)} wide x {fmt(p.thickness_in, 'in', system, 2)}: "
        f"{p.status.replace('_', ' ').upper()} ({STATUSES[p.status]})",
        f"  governing: {p.governing_element}, utilization {p.utilization:.2f}",
        f"  stand-down gust {fmt(p.stand_down_speed_mph, 'mph', system)} "
        f"(sustained 1-min {fmt(p.sustained_equivalents_mph.get('1-min'), 'mph', system)}, "
        f"10-min {fmt(p.sustained_equivalents_mph.get('10-min'), 'mph', system)}); working limit "
        f"{fmt(p.working_limit_speed_mph, 'mph', system)}",
        f"  design wind {fmt(w.design_speed_mph, 'mph', system)} (period factor "
        f"{w.period_factor:.2f} from {w.period_factor_from}), q_h "
        f"{fmt(w.velocity_pressure_psf, 'psf', system, 1)}, Cf {w.force_coefficient:.3f}, "
        f"F {fmt(w.force_lb, 'lbf', system)} at {fmt(w.resultant_height_ft, 'ft', system, 1)}",
        f"  unbraced: utilization {u.utilization:.2f}; tallest unbraced at design wind "
        f"{fmt(u.max_height_ft, 'ft', system, 1)}",
    ]
    if p.fresh_stand_down_speed_mph is not None and (
            p.fresh_stand_down_speed_mph != p.stand_down_speed_mph):
        lines.append(f"  with fresh mortar (its first days): stand-down gust "
                     f"{fmt(p.fresh_stand_down_speed_mph, 'mph', system)}, working limit "
                     f"{fmt(p.fresh_working_limit_speed_mph, 'mph', system)}")
    if p.braces:
        lines += brace_lines(p.braces, system)
    for f in p.flags_worst_first():
        lines.append(f"  {SYMBOL[f.severity]} {f.severity.upper()}: {f.message} [{f.source}]")
    lines += [check_line(c, system) for c in p.worst_first()]
    return [wrap(localize(line, system)) for line in lines]


def brace_lines(b: dict, system: str) -> list[str]:
    """The bracing layout as the crew sets it out."""
    at = ", ".join(fmt(x, "ft", system, 1) for x in b["positions_ft"])
    hardware = " / ".join(str(b[k]) for k in ("brace_type", "wall_anchor", "foot_anchor")
                          if b.get(k))
    lines = [
        f"  braces: {b['count']}{' (designed)' if b.get('designed') else ''}"
        f"{f' [{hardware}]' if hardware else ''} at {at} from the first edge; insert "
        f"{fmt(b['insert_height_ft'], 'ft', system, 2)}, foot "
        f"{fmt(b['anchor_distance_ft'], 'ft', system, 2)} from the face, angle "
        f"{b['angle_deg']:.1f} deg, length {fmt(b['length_ft'], 'ft', system, 2)}",
        f"  governing brace force {fmt(b['axial_force_lb'], 'lbf', system)} (anchor uplift "
        f"{fmt(b['anchor_uplift_lb'], 'lbf', system)}, pull "
        f"{fmt(b['anchor_shear_lb'], 'lbf', system)}); working limit with one brace struck "
        f"{fmt(b.get('working_limit_one_missing_mph'), 'mph', system)}",
    ]
    if b.get("installation_torque_ftlb"):
        lines.append(f"  helical anchors: install to at least "
                     f"{fmt(b['installation_torque_ftlb'], 'ft*lbf', system)} (ICC-ES AC358)")
    return lines


def site_text(result: SiteResult, system: str = "us") -> str:
    """A whole-site report: caution, basis, deficiencies by severity, then every wall worst first
    and the foundation walls backfilled before the floor."""
    from bracing.report import backfill_sheet  # it formats with this module's helpers

    panels = result.worst_first()
    counts = {s: sum(p.status == s for p in panels) for s in STATUSES}
    lines = [site_verdict(result), result.caution, "", f"Site: {result.name}"]
    lines += [f"  {s}" for s in result.basis_statement]
    lines.append("  " + ", ".join(f"{n} {s.replace('_', ' ')}" for s, n in counts.items() if n))
    failing = sorted(((p, c) for p in panels for c in p.checks if not c.passes),
                     key=lambda pc: -pc[1].utilization)
    # flags that repeat a failing check ("...-over") are not listed twice; a finding that many
    # walls share is listed once with their count and marks
    shared: dict[tuple, list[str]] = {}
    for p in panels:
        for f in p.flags:
            if f.severity == "notice" or (f.severity == "danger" and f.code.endswith("-over")):
                continue
            message = f.message.removeprefix(f"{p.mark}: ")
            shared.setdefault((SEVERITY_RANK[f.severity], f.code, message, f.source),
                              []).append(p.mark)
    found = sorted(shared.items(), key=lambda item: item[0][0])
    found += [((SEVERITY_RANK[f.severity], f.code, f.message, f.source), ["site"])
              for f in result.flags if f.severity != "notice"]
    if failing or found:
        lines += ["", f"DEFICIENCIES: {len(failing)} failing check(s), {len(found)} finding(s)"]
        for p, c in failing:
            lines.append(f"  {p.mark}:{check_line(c, system)[1:]}")
        for (rank, _, message, source), marks in found:
            walls = f"{len(marks)} walls: " if len(marks) > 2 else ""
            severity = SEVERITIES[rank]
            lines.append(f"  {walls}{', '.join(marks)}: {SYMBOL[severity]} {severity.upper()}: "
                         f"{message} [{source}]")
    if result.days:
        lines += ["", "DAYS (the day's stand-down gust is the lowest of the walls standing; "
                  "verdicts by method notes §6)"]
    for day in result.days:
        lines.append(day_line(day, system))
    for p in panels:
        lines += [""] + panel_text(p, system)
    lines += backfill_sheet.wall_lines(result, system)
    lines += ["", result.caution]
    return "\n".join(wrap(localize(line, system)) for line in lines)


def site_verdict(result: SiteResult) -> str:
    """The first line of `check`: whether any wall fails or a finding is a danger
    (SiteResult.fails), and the days' verdicts counted."""
    failing = [p.mark for p in result.failing()] + [
        w.mark for w in getattr(result, "foundation_walls", []) if w.fails]
    if result.fails:
        head = (f"NOT GO: {len(failing)} wall(s) fail or have a danger finding"
                + (f" ({', '.join(failing)})" if failing else "") if failing else
                "NOT GO: a finding of the site or of a day is a danger")
    else:
        head = "PASSES: every wall passes its checks and no finding is a danger"
    counts = {v: sum(d.verdict == v for d in result.days) for v in VERDICTS}
    days = ", ".join(f"{n} {v}" for v, n in counts.items() if n)
    return head + (f"; days: {days}" if days else "")


def day_line(day, system: str = "us") -> str:
    """One line per day: its verdict and the walls it names first, then lifts, standing walls,
    the forecast and the stand-down gust (the rule behind it is on the sheet of the day)."""
    named = []
    if day.failing_standing:
        named.append(f"{', '.join(day.failing_standing)} stand(s) and fail(s)")
    if day.do_not_lift:
        named.append(f"do not lift {', '.join(day.do_not_lift)}")
    if day.marginal:
        named.append("marginal")
    said = f" ({'; '.join(named)})" if named else ""
    return (f"  day {day.day}{f' ({day.date})' if day.date else ''}: {day.verdict}{said}; "
            f"{len(day.lifts)} lift(s), "
            f"{len(day.standing)} standing"
            + (f", {len(day.foundation_standing)} foundation wall(s) before the floor"
               if day.foundation_standing else "")
            + f"; forecast {fmt(day.forecast_gust_mph, 'mph', system)}"
            f"{' with a thunderstorm' if day.storm else ''}, stand-down "
            f"{fmt(day.stand_down_speed_mph, 'mph', system)}"
            f"{f' ({day.governing_wall})' if day.governing_wall else ''}")
