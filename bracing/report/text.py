"""Plain-text reports for a terminal or a printout: caution first, failing checks first."""

from __future__ import annotations

import math

from bracing.results import SEVERITIES, STATUSES, Check, Flag, PanelResult, SiteResult
from bracing.units import convert

SYMBOL = {"danger": "!!", "warning": "! ", "notice": "- "}
SEVERITY_RANK = {s: i for i, s in enumerate(SEVERITIES)}


def fmt(value: float | None, unit: str, system: str = "us", digits: int = 0) -> str:
    """A value in the chosen unit system, e.g. '28 psf' or '1.35 kPa'."""
    if value is None or (isinstance(value, float) and not math.isfinite(value)):
        return "none" if value is None else "unbounded"
    shown, label = convert(value, unit, system)
    if system == "si" and label in ("kN", "kN·m", "kPa", "m", "MPa", "kN/m", "kN/m³"):
        digits = max(digits, 2)
    return f"{shown:,.{digits}f} {label}"


def utilization_mark(u: float) -> str:
    """Pass or fail in words and a symbol, never by colour alone."""
    return "FAIL x" if u > 1.0 else "ok"


def check_line(c: Check, system: str) -> str:
    u = c.utilization
    unit = {"lb·ft": "ft*lbf", "lb": "lbf", "psf": "psf"}.get(c.unit, c.unit)
    return (f"  {utilization_mark(u):6} {c.element} ({c.region}): "
            f"{fmt(c.demand, unit, system)} / {fmt(c.capacity, unit, system)} = "
            f"{'inf' if math.isinf(u) else f'{u:.2f}'}  [{c.combination}; {c.source}]")


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
    return lines


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
        f"{fmt(b['anchor_uplift_lb'], 'lbf', system)}, pull {fmt(b['anchor_shear_lb'], 'lbf', system)});"
        f" working limit with one brace struck "
        f"{fmt(b.get('working_limit_one_missing_mph'), 'mph', system)}",
    ]
    if b.get("installation_torque_ftlb"):
        lines.append(f"  helical anchors: install to at least "
                     f"{fmt(b['installation_torque_ftlb'], 'ft*lbf', system)} (ICC-ES AC358)")
    return lines


def site_text(result: SiteResult, system: str = "us") -> str:
    """A whole-site report: caution, basis, deficiencies by severity, then every wall worst first."""
    panels = result.worst_first()
    counts = {s: sum(p.status == s for p in panels) for s in STATUSES}
    lines = [result.caution, "", f"Site: {result.name}"]
    lines += [f"  {s}" for s in result.basis_statement]
    lines.append("  " + ", ".join(f"{n} {s.replace('_', ' ')}" for s, n in counts.items() if n))
    failing = sorted(((p, c) for p in panels for c in p.checks if not c.passes),
                     key=lambda pc: -pc[1].utilization)
    # flags that repeat a failing check ("...-over") are not listed twice; a warning that many
    # walls share is listed once with their marks
    found = [(p.mark, f) for p in panels for f in p.flags
             if f.severity == "danger" and not f.code.endswith("-over")]
    shared: dict[tuple, list[str]] = {}
    for p in panels:
        for f in p.flags:
            if f.severity == "warning":
                shared.setdefault((f.code, f.message if f.code != "no-margin" else ""),
                                  []).append(p.mark)
    for (code, _), marks in shared.items():
        f = next(f for p in panels for f in p.flags if f.code == code and p.mark == marks[0])
        if len(marks) > 1:
            f = Flag(f.code, f.severity, f"{f.code} on {len(marks)} walls; for {marks[0]}: "
                     f"{f.message}", f.source)
        found.append((", ".join(marks), f))
    found += [("site", f) for f in result.flags if f.severity != "notice"]
    found.sort(key=lambda mf: SEVERITY_RANK[mf[1].severity])
    if failing or found:
        lines += ["", f"DEFICIENCIES: {len(failing)} failing check(s), {len(found)} finding(s)"]
        for p, c in failing:
            lines.append(f"  {p.mark}:{check_line(c, system)[1:]}")
        for mark, f in found:
            lines.append(f"  {mark}: {SYMBOL[f.severity]} {f.severity.upper()}: {f.message} "
                         f"[{f.source}]")
    for day in result.days:
        lines.append(day_line(day, system))
    for p in panels:
        lines += [""] + panel_text(p, system)
    lines += ["", result.caution]
    return "\n".join(lines)


def day_line(day, system: str = "us") -> str:
    """One line per day: lifts, standing walls, stand-down gust against the forecast."""
    go = {True: "GO: ", False: "NO-GO x: ", None: ""}[day.go]
    return (f"  day {day.day}{f' ({day.date})' if day.date else ''}: {len(day.lifts)} lift(s), "
            f"{len(day.standing)} standing, stand-down {fmt(day.stand_down_speed_mph, 'mph', system)}"
            f", forecast {fmt(day.forecast_gust_mph, 'mph', system)}: {go}{day.reason}")
