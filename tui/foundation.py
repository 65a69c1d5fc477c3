"""Foundation walls backfilled before the floor, as the terminal interface writes them (method
notes §12): a wall's status and verdict in words, its backfill planned against the most it may
take, its days, its checks, the rows of a day and a section sketch in characters.

Every value is the result's (`SiteResult.foundation_walls`, records of
bracing.foundation_results; a day's rows are bracing.report.backfill_sheet's); this module picks
and formats them, and scales the engine's pressure diagram into characters.
"""

from __future__ import annotations

from rich.text import Text

from bracing.report import backfill_sheet
from bracing.report.text import check_values, fmt, localize
from tui.drawing import ANCHOR, BRACE, CELL_ASPECT, FOOTING, GROUND, INSERT, WALL, Canvas
from tui.widgets import FLAG_LOOK, pass_text, plain, speed, utilization_text

MATERIAL_WORDS = {"plain": "plain concrete", "reinforced": "reinforced concrete",
                  "masonry": "masonry", "reinforced_masonry": "reinforced masonry"}
# the Walls view's material filter: its words against the foundation walls' materials
MATERIAL_OF = {"plain": "concrete", "reinforced": "concrete", "masonry": "masonry",
               "reinforced_masonry": "masonry"}
HELD_WORDS = {"cantilever": "cantilever", "inside braces": "inside braces",
              "top support": "floor on"}
SOIL, PRESSURE, LIMIT = "░", "◄", "┄"
COLUMNS = ("Wall", "Status", "Verdict", "Planned", "Allowed", "Utilization", "Danger days",
           "Held by", "Material", "Governing check")
DAY_COLUMNS = ("Day", "Planned", "Allowed", "Held by", "That day", "Stand-down")
# the essential columns first (they fit at 80 columns)
CHECK_COLUMNS = ("Result", "Utilization", "Region", "Demand", "Capacity", "Element",
                 "Combination", "Source")


def walls(result) -> list:
    """The foundation walls, those that fail first (`FoundationWallResult.fails`: a danger
    finding too), then the highest utilization first (as the `check` report lists them)."""
    found = getattr(result, "foundation_walls", None) or []
    return sorted(found, key=lambda w: (not w.fails, -w.utilization, w.mark))


def over_limit(w) -> bool:
    """The wall's backfill is planned above what it may take on a day (a danger flag)."""
    return any(f.code == "backfill-over-limit" for f in w.flags)


def status_text(w) -> Text:
    """The wall's state in words; a wall that fails never shows a pass mark."""
    if over_limit(w):
        return Text("✗ BACKFILL TOO HIGH", style="bold red")
    if w.utilization > 1.0:
        return Text("✗ UNSAFE", style="bold red")
    if w.fails:
        return Text("✗ DANGER", style="bold red")
    held = "inside braces" if w.inside_brace is not None and w.needs_support else "cantilever"
    return Text(f"✓ {held}", style="green")


def verdict_text(w) -> Text:
    """The wall's verdict from `FoundationWallResult.fails` (the one test)."""
    return Text("✗ FAILS", style="bold red") if w.fails else Text("✓ ok", style="green")


def allowed_ft(w) -> float:
    """The most the wall takes before the floor as it is held: with its inside braces where it
    has them, else as a cantilever (both the engine's)."""
    return w.inside_brace.max_height_ft if w.inside_brace is not None else w.max_height_ft


def held_by(w) -> str:
    return "inside braces" if w.inside_brace is not None else "cantilever"


def planned_text(w, units: str) -> str:
    return fmt(w.planned_height_ft, "ft", units, 1) + (
        f" (day {w.planned_day})" if w.planned_day is not None else "")


def runs(days: list[int]) -> str:
    """Day numbers in runs: [7, 8, 9, 12] -> '7-9, 12'."""
    out: list[list[int]] = []
    for d in days:
        if out and out[-1][1] == d - 1:
            out[-1][1] = d
        else:
            out.append([d, d])
    return ", ".join(str(a) if a == b else f"{a}-{b}" for a, b in out)


def danger_days(w) -> str:
    return runs([d.day for d in w.days if d.over]) or "none"


def governing(w) -> str:
    worst = max(w.checks, key=lambda c: c.utilization, default=None)
    return f"{worst.element}, {worst.region}" if worst else "-"


def table_row(w, units: str) -> list:
    """One foundation wall on the Walls view, in COLUMNS' order."""
    days = danger_days(w)
    return plain(w.mark, status_text(w), verdict_text(w), planned_text(w, units),
                 fmt(allowed_ft(w), "ft", units, 1), utilization_text(w.utilization),
                 Text(days, style="bold red") if days != "none" else days, held_by(w),
                 MATERIAL_WORDS.get(w.material, w.material), governing(w))


def check_row(c, units: str) -> list:
    """A check in CHECK_COLUMNS' order."""
    demand, capacity = check_values(c, units)
    return plain(pass_text(c.passes), utilization_text(c.utilization), c.region, demand,
                 capacity, c.element, c.combination, c.source)


def day_row(d, units: str) -> list:
    """One day of a wall (bracing.foundation_results.BackfillDay) in DAY_COLUMNS' order."""
    if d.over:
        that_day = Text("✗ DANGER", style="bold red")
    elif d.support == "top support":
        that_day = Text("floor on", style="dim")
    else:
        that_day = Text("✓ ok", style="green")
    return plain(str(d.day), fmt(d.planned_height_ft, "ft", units, 1),
                 fmt(d.allowed_height_ft, "ft", units, 1), HELD_WORDS.get(d.support, d.support),
                 that_day, speed(d.stand_down_speed_mph, units))


def summary(w, units: str) -> Text:
    """The wall, its verdict, its backfill planned against the most allowed, the soil, its
    days of support, its inside braces and the wind on the part above the backfill."""
    s, b, wind = w.soil, w.inside_brace, w.wind
    out = Text()
    out.append(f"{w.mark}  ", style="bold")
    out.append(f"{MATERIAL_WORDS.get(w.material, w.material)}, {fmt(w.height_ft, 'ft', units, 1)}"
               f" tall x {fmt(w.length_ft, 'ft', units, 1)} long x "
               f"{fmt(w.thickness_in, 'in', units, 2)}: ")
    out.append_text(status_text(w))
    out.append("\n")
    out.append_text(verdict_text(w))
    out.append(f": utilization {w.utilization:.2f} at the planned backfill, "
               + ("with its inside braces" if w.inside_brace is not None else
                  "standing as a cantilever"))
    if b is not None:
        out.append(f" (as a cantilever it would be {w.cantilever_utilization:.2f})")
    out.append("\nBackfill planned ", style="bold")
    out.append(f"{planned_text(w, units)}; ")
    out.append("allowed before the floor ", style="bold")
    out.append(f"{fmt(w.max_height_ft, 'ft', units, 1)} as a cantilever")
    if b is not None:
        out.append(f", {fmt(b.max_height_ft, 'ft', units, 1)} with its inside braces")
    out.append(f"\nSoil: {s.pressure_state.replace('_', '-')} "
               f"{fmt(s.equivalent_fluid_pressure_psf_per_ft, 'pcf', units)} equivalent fluid "
               f"pressure (K {s.coefficient:.2f}, {fmt(s.unit_weight_pcf, 'pcf', units)}; "
               f"{s.pressure_source}); surcharge {fmt(s.surcharge_psf, 'psf', units)}; "
               f"{s.drainage}"
               + (f", water {fmt(s.water_level_ft, 'ft', units, 1)} above the footing"
                  if s.water_level_ft > 0 else ""))
    out.append(f"\nBuilt day {w.build_day or 1}; floor deck (top support) "
               + (f"day {w.top_support_day}" if w.top_support_day is not None else "not given")
               + "; released "
               + (f"day {w.released_day}" if w.released_day is not None else "not yet")
               + (f"; line {w.line}, backfill on its {w.backfill_side}" if w.line else ""))
    if b is not None:
        out.append("\nInside braces: ", style="bold")
        out.append(f"{b.brace_type} at {fmt(b.height_ft, 'ft', units, 1)} on the wall, every "
                   f"{fmt(b.spacing_ft, 'ft', units, 1)}, {b.angle_deg:.0f}°, "
                   f"{fmt(b.length_ft, 'ft', units, 1)} long"
                   + (f", foot anchor {b.foot_anchor}" if b.foot_anchor else "")
                   + f"; reaction {fmt(b.reaction_plf, 'plf', units)}, force "
                   f"{fmt(b.force_lb, 'lbf', units)} each of {fmt(b.capacity_lb, 'lbf', units)}"
                   ": utilization ")
        out.append_text(utilization_text(b.utilization))
    out.append(f"\nWind on the {fmt(wind.exposed_height_ft, 'ft', units, 1)} above the "
               f"backfill: {fmt(wind.pressure_psf, 'psf', units, 1)}; stand-down gust "
               f"{speed(wind.stand_down_speed_mph, units)}, working limit "
               f"{speed(wind.working_limit_speed_mph, units)}"
               + (" (any wind: the backfill is over its limit)"
                  if wind.stand_down_speed_mph == 0.0 else ""))
    return out


def flag_text(w, units: str) -> Text:
    """The wall's findings, dangers first."""
    out = Text()
    order = ("danger", "warning", "notice")
    for f in sorted(w.flags, key=lambda f: order.index(f.severity) if f.severity in order else 3):
        symbol, style = FLAG_LOOK.get(f.severity, ("-", ""))
        out.append(f"{symbol} {f.severity.upper()}: ", style=style)
        out.append(localize(f.message, units))
        out.append(f"  [{f.source}]\n" if f.source else "\n", style="dim")
    return out


def day_lines(result, day: int, units: str) -> Text:
    """The foundation walls standing without their floor on `day`, the dangers first: planned
    against allowed, in the crew sheet's words (bracing.report.backfill_sheet.rows)."""
    found = backfill_sheet.rows(result, day, units)
    out = Text()
    if not found:
        return out
    out.append(f"Backfill before the floor (above the footing; {backfill_sheet.SOURCE}):\n",
               style="bold")
    for r in found:
        out.append("✗ DANGER " if r.danger else "✓ ok ",
                   style="bold red" if r.danger else "green")
        out.append(f"{r.mark}: ", style="bold")
        out.append(f"planned {r.planned}, allowed {r.allowed} {r.support}"
                   + (f": {r.action}\n" if r.danger else "\n"))
        if r.brace:
            out.append(f"    {r.brace}\n")
    return out


def section(w, units: str = "us", cols: int = 34, rows: int = 13) -> list[str]:
    """The wall cut across at its planned backfill, with a legend: wall, footing line, the
    backfill on its side, the engine's earth-pressure diagram (`w.pressure`) against the wall,
    the most it may take before the floor, and any inside brace."""
    height = max(w.height_ft, 0.1)
    wall_rows = max(4, rows - 1)
    canvas = Canvas(cols, wall_rows + 1)
    base, ground = wall_rows - 1, wall_rows
    inside, wall_at = cols // 3, cols // 3 + 1  # braces inside (left), backfill outside (right)

    def row(y: float) -> int:
        return base - round(min(max(y, 0.0), height) / height * (wall_rows - 1))

    canvas.fill(0, ground, cols - 1, ground, GROUND)
    canvas.fill(wall_at, row(height), wall_at + 1, base, WALL)
    canvas.fill(wall_at - 1, ground, wall_at + 2, ground, FOOTING)
    soil = wall_at + 2
    top = max((p.pressure_psf for p in w.pressure), default=0.0)
    if w.planned_height_ft > 0:
        canvas.fill(soil, row(w.planned_height_ft), cols - 1, base, SOIL)
        for r in range(row(w.planned_height_ft), base + 1):
            level = (base - r) / (wall_rows - 1) * height
            near = min(w.pressure, key=lambda p: abs(p.level_ft - level), default=None)
            if near is not None and top > 0:
                reach = round(near.pressure_psf / top * (cols - soil - 2))
                if reach > 0:
                    canvas.fill(soil, r, soil + reach - 1, r, PRESSURE)
    limit = allowed_ft(w)
    if limit < height:
        canvas.line(soil, row(limit), cols - 1, row(limit), LIMIT, over=" " + SOIL + PRESSURE)
    b = w.inside_brace
    if b is not None:
        reach = round(b.foot_distance_ft / height * (wall_rows - 1) * CELL_ASPECT)
        foot = max(0, wall_at - 1 - reach)
        canvas.line(wall_at - 1, row(b.height_ft), foot, base, BRACE, over=" ")
        canvas.put(wall_at - 1, row(b.height_ft), INSERT)
        canvas.put(foot, ground, ANCHOR)
    canvas.text(0, 0, "inside" if inside > 6 else "")
    canvas.text(cols - 8, 0, "backfill")
    legend = [f"{WALL} wall {fmt(w.height_ft, 'ft', units, 1)} tall, "
              f"{fmt(w.thickness_in, 'in', units, 2)} thick",
              f"{SOIL} backfill planned {planned_text(w, units)}",
              f"{PRESSURE} earth pressure, {fmt(top, 'psf', units)} at the base",
              f"{LIMIT} most allowed before the floor {fmt(limit, 'ft', units, 1)} "
              f"({held_by(w)})"]
    if b is not None:
        legend.append(f"{BRACE} inside brace at {fmt(b.height_ft, 'ft', units, 1)}, "
                      f"{b.angle_deg:.0f}°, {fmt(b.force_lb, 'lbf', units)} each")
    return canvas.lines() + legend
