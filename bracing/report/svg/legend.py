"""The words under a plan: the legend of what it shows, the zones summarized by rule, and the
numbered findings."""

from __future__ import annotations

from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.report.svg.foundation import BACKFILL
from bracing.report.svg.style import (
    AREA_STYLE,
    BRACE,
    DANGER,
    EVACUATED,
    GROUND,
    KEEP_OUT,
    LEAST_TEXT_MM,
    MOST_FINDINGS,
    PAD_MM,
    SHEET_MM,
    SLAB,
    SLAB_EDGE,
    TEXT_MM,
    WALL,
    WARNING,
    ZONE,
    anchor_symbol,
    num,
    text,
    wrap,
)


def legend_items(panels, areas, foundation=()) -> list[tuple[str, str]]:
    """(symbol kind, words) of the legend: what the plan shows (`foundation`: the plan's
    foundation walls, `bracing.plan.PlanFoundationWall`)."""
    items = [("slab", "slab"), ("hole", "slab hole or opening"), ("joint", "slab joint"),
             ("ground", "open ground")]
    kinds = dict.fromkeys(AREA_STYLE[a.kind][2] for a in areas)
    first_kind = {AREA_STYLE[a.kind][2]: a.kind for a in reversed(areas)}
    items += [(f"area:{first_kind[w]}", w + (" (braces stay out)" if first_kind[w] in KEEP_OUT
                                             else "")) for w in kinds]
    if any(w.built and w.backfill_ft > 0.0 for w in foundation):
        items.append(("backfill", "backfill against a foundation wall, on its backfill side"))
    items += [("wall", "wall standing"), ("ghost", "wall not standing"),
              ("line", "wall line (tick: braced side)"), ("brace", "brace")]
    feet = dict.fromkeys([p.foot_kind for p in panels if p.braces]
                         + [w.foot_kind for w in foundation if w.built and w.braced and w.braces])
    items += [(f"anchor:{k}", ANCHOR_KINDS[k].words if k in ANCHOR_KINDS
               else "foot (no anchor named)") for k in feet]
    names = dict.fromkeys(p.zone_name for p in panels if p.standing and p.zone_name)
    items += [("zone", f"{n} (authorized workers only, nothing stored)") for n in names]
    items += [("evacuated", "evacuated zone (nobody: at the stand-down gust, during lifts)"),
              ("danger", "DANGER: failing item, numbered"),
              ("warning", "warning, numbered")]
    return items


def _legend_symbol(kind: str, x: float, y: float, key: str) -> str:
    """A legend symbol 5 mm by 2.5 mm, left edge x, center line y (sheet mm)."""
    w, h, u = 5.0, 2.5, 0.25
    rect = f'x="{num(x)}" y="{num(y - h / 2)}" width="{num(w)}" height="{num(h)}"'
    line = f'x1="{num(x)}" y1="{num(y)}" x2="{num(x + w)}" y2="{num(y)}"'
    plain = _plain_symbols(rect, line, u, key)
    if kind in plain:
        return plain[kind]
    if kind.startswith("area:"):
        color, angle, _ = AREA_STYLE[kind[5:]]
        fill = (f'fill="url(#hatch-{kind[5:]}-{key})"' if angle is not None
                else f'fill="{color}" fill-opacity="0.15"')
        return f'<rect {rect} {fill} stroke="{color}" stroke-width="{num(2 * u)}"/>'
    if kind.startswith("anchor:"):
        return anchor_symbol(kind[7:], x + w / 2, y, 0.8, 1.2 * u, up=-1.0)
    return _finding_symbol(kind == "danger", x + w / 2, y)


def _plain_symbols(rect: str, line: str, u: float, key: str) -> dict[str, str]:
    """The legend symbols drawn as one rectangle or line (`rect`, `line`: its place), by kind."""
    return {
        "slab": f'<rect {rect} fill="{SLAB}" stroke="{SLAB_EDGE}" stroke-width="{num(2 * u)}"/>',
        "hole": (f'<rect {rect} fill="url(#hatch-hole-{key})" stroke="{SLAB_EDGE}" '
                 f'stroke-width="{num(u)}"/>'),
        "joint": (f'<line {line} stroke="#7f7f7f" stroke-width="{num(1.2 * u)}" '
                  f'stroke-dasharray="2.5,0.75,0.5,0.75"/>'),
        "ground": f'<rect {rect} fill="{GROUND}" stroke="#b8a77a" stroke-width="{num(u)}"/>',
        "wall": f'<rect {rect} fill="{WALL}" stroke="#000" stroke-width="{num(u)}"/>',
        "backfill": (f'<rect {rect} fill="{BACKFILL}" fill-opacity="0.35" stroke="{BACKFILL}" '
                     f'stroke-width="{num(u)}"/>'),
        "ghost": (f'<rect {rect} fill="#fff" stroke="{WALL}" stroke-width="{num(u)}" '
                  f'stroke-dasharray="0.75,0.5"/>'),
        "line": (f'<line {line} stroke="#888" stroke-width="{num(u)}" '
                 f'stroke-dasharray="2,0.75"/>'),
        "brace": f'<line {line} stroke="{BRACE}" stroke-width="{num(1.8 * u)}"/>',
        "zone": (f'<rect {rect} fill="{ZONE}" fill-opacity="0.14" stroke="{ZONE}" '
                 f'stroke-width="{num(1.5 * u)}" stroke-dasharray="1.5,1"/>'),
        "evacuated": (f'<rect {rect} fill="none" stroke="{EVACUATED}" '
                      f'stroke-width="{num(1.2 * u)}" stroke-dasharray="3.5,1.5"/>'),
    }


def _finding_symbol(danger: bool, cx: float, y: float) -> str:
    """The legend's circled cross of a danger, or triangle of a warning, centered at cx, y."""
    r = 1.1
    if danger:
        d = 0.7 * r
        return (f'<g stroke="{DANGER}" stroke-width="0.4" fill="none">'
                f'<circle cx="{num(cx)}" cy="{num(y)}" r="{num(r)}"/>'
                f'<line x1="{num(cx - d)}" y1="{num(y - d)}" x2="{num(cx + d)}" '
                f'y2="{num(y + d)}"/>'
                f'<line x1="{num(cx - d)}" y1="{num(y + d)}" x2="{num(cx + d)}" '
                f'y2="{num(y - d)}"/></g>')
    return (f'<polygon points="{num(cx)},{num(y - r)} {num(cx - r)},{num(y + 0.7 * r)} '
            f'{num(cx + r)},{num(y + 0.7 * r)}" fill="none" stroke="{WARNING}" '
            f'stroke-width="0.4"/>')


def legend_block(items, y: float, key: str) -> tuple[list[str], float]:
    """The legend in two columns from `y` down; (items, the y below it)."""
    col_w = (SHEET_MM - 2 * PAD_MM) / 2
    rows = -(-len(items) // 2)
    out = [text(PAD_MM, y + 1.25 * TEXT_MM, "Legend", TEXT_MM, weight="bold")]
    top = y + 1.25 * TEXT_MM + 0.8
    bottom = top
    for col in range(2):
        yy = top
        for kind, words in items[col * rows:(col + 1) * rows]:
            parts = wrap(words, LEAST_TEXT_MM, col_w - 8.0)
            x = PAD_MM + col * col_w
            out.append(_legend_symbol(kind, x, yy + 0.5 * 1.3 * LEAST_TEXT_MM + 0.2, key))
            for i, part in enumerate(parts):
                out.append(text(x + 6.5, yy + (i + 1) * 1.3 * LEAST_TEXT_MM - 0.2, part,
                                LEAST_TEXT_MM))
            yy += len(parts) * 1.3 * LEAST_TEXT_MM + 0.5
        bottom = max(bottom, yy)
    return out, bottom


def _range(values: list[float]) -> str:
    """'12 ft', or '8 to 14 ft', of some lengths (ft)."""
    lo, hi = min(values), max(values)
    return f"{lo:.0f} ft" if round(lo) == round(hi) else f"{lo:.0f} to {hi:.0f} ft"


def zone_summary(panels) -> list[str]:
    """The zones of the walls standing in a few sentences: one per zone rule, with how many
    walls it covers and the range of its reach, not a line per wall."""
    groups: dict[tuple[str, str], list] = {}
    for p in panels:
        if p.standing and p.zone_rule:
            groups.setdefault((p.zone_name, p.zone_rule), []).append(p)
    out = []
    for (name, rule), walls in groups.items():
        count = f"{len(walls)} wall" + ("s" if len(walls) != 1 else "")
        reach = f"it reaches {_range([p.zone_front_ft for p in walls])} out from the braced face"
        backs = [p.zone_back_ft for p in walls]
        if max(backs) > 0:
            reach += f" and {_range(backs)} behind the wall"
        out.append(f"{name[0].upper()}{name[1:]} of {count}: {rule}; {reach}, along the "
                   "wall's whole length.")
    if out:
        out.append("The evacuated zone has the same footprint: what changes is who may be "
                   "inside (nobody at the stand-down gust or during lifts).")
    return out


def finding_lines(numbered, only=None, most: int = MOST_FINDINGS) -> list[
        tuple[str, float, str, str]]:
    """The numbered findings as text lines (`only`: the numbers to list; None: all), the
    first `most` of them (the most severe first) and a count of the others."""
    shown = [(n, f) for n, f in numbered if only is None or n in only]
    if not shown:
        return []
    out = [(f"Findings of the plan ({len(shown)}):", TEXT_MM, "bold", "#000")]
    for n, f in shown[:most]:
        danger = f.flag.severity == "danger"
        color = {"danger": DANGER, "warning": WARNING}.get(f.flag.severity, "#000")
        out.append((f"{n}. {f.flag.severity.upper()} {f.mark} [{f.flag.code}] "
                    f"{f.flag.message}. Source: {f.flag.source}.", LEAST_TEXT_MM,
                    "bold" if danger else "normal", color))
    if len(shown) > most:
        out.append((f"... and {len(shown) - most} more: see the report and the detail plans",
                    LEAST_TEXT_MM, "normal", "#000"))
    return out


