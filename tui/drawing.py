"""Character drawings of a wall (section, elevation) and of the site plan.

Pure functions: they scale values the engine (or the site file's geometry) gives into a grid of
characters and return lines of text. They compute no engineering value; each drawing carries a
legend that prints the real values beside the symbols.
"""

from __future__ import annotations

from collections.abc import Iterable, Sequence
from itertools import pairwise

from bracing.report.text import fmt

CELL_ASPECT = 2.0  # a terminal cell is about twice as tall as it is wide

WALL, FOOTING, BRACE, INSERT, ANCHOR, WIND = "█", "▓", "╲", "●", "▲", "►"
CHOSEN = "◉"  # the brace chosen on the elevation
OPENING, GROUND = "░", "─"


class Canvas:
    """A grid of characters, row 0 at the top."""

    def __init__(self, cols: int, rows: int):
        self.cols, self.rows = max(cols, 1), max(rows, 1)
        self.cells = [[" "] * self.cols for _ in range(self.rows)]

    def put(self, col: int, row: int, ch: str) -> None:
        if 0 <= col < self.cols and 0 <= row < self.rows:
            self.cells[row][col] = ch

    def get(self, col: int, row: int) -> str:
        if 0 <= col < self.cols and 0 <= row < self.rows:
            return self.cells[row][col]
        return " "

    def text(self, col: int, row: int, words: str) -> None:
        for k, ch in enumerate(words):
            self.put(col + k, row, ch)

    def fill(self, c0: int, r0: int, c1: int, r1: int, ch: str) -> None:
        for row in range(min(r0, r1), max(r0, r1) + 1):
            for col in range(min(c0, c1), max(c0, c1) + 1):
                self.put(col, row, ch)

    def line(self, c0: int, r0: int, c1: int, r1: int, ch: str, over: str = " ") -> None:
        """Cells along a straight line; only cells holding one of `over` are drawn on."""
        steps = max(abs(c1 - c0), abs(r1 - r0), 1)
        for k in range(steps + 1):
            col = round(c0 + (c1 - c0) * k / steps)
            row = round(r0 + (r1 - r0) * k / steps)
            if self.get(col, row) in over:
                self.put(col, row, ch)

    def box(self, c0: int, r0: int, c1: int, r1: int) -> None:
        """A rectangle outline in box-drawing characters."""
        for col in range(c0 + 1, c1):
            self.put(col, r0, "─")
            self.put(col, r1, "─")
        for row in range(r0 + 1, r1):
            self.put(c0, row, "│")
            self.put(c1, row, "│")
        for col, row, ch in ((c0, r0, "┌"), (c1, r0, "┐"), (c0, r1, "└"), (c1, r1, "┘")):
            self.put(col, row, ch)

    def lines(self) -> list[str]:
        return ["".join(row).rstrip() for row in self.cells]


def section(height_ft: float, thickness_in: float, braces: dict | None,
            footing: tuple[float, float] | None, resultant_ft: float | None,
            units: str = "us", cols: int = 32, rows: int = 14) -> list[str]:
    """The wall cut across: wall, footing, brace, insert, foot anchor, with a legend.

    `braces` is PanelResult.braces (angle, insert height, anchor distance, length, count);
    `footing` is (width_ft, thickness_ft) from the site file.
    """
    t = thickness_in / 12.0
    fw, fd = footing if footing else (0.0, 0.0)
    reach = braces["anchor_distance_ft"] if braces else 0.25 * height_ft
    x_min = -max(t, fw / 2.0 + t / 2.0) - 1.0
    x_max = max(reach, fw / 2.0) + 2.0
    total_h = height_ft + fd
    sy = (rows - 3) / total_h
    sx = min(CELL_ASPECT * sy, (cols - 2) / (x_max - x_min))
    sy = min(sy, sx / CELL_ASPECT)
    wall_rows = max(2, round(height_ft * sy))
    foot_rows = round(fd * sy) if footing else 0
    canvas = Canvas(cols, wall_rows + foot_rows + 1)
    base, ground = wall_rows - 1, wall_rows

    def col(x: float) -> int:
        return 1 + round((x - x_min) * sx)

    def row(y: float) -> int:
        return base - round(y / height_ft * (wall_rows - 1))

    canvas.fill(0, ground, canvas.cols - 1, ground, GROUND)
    if footing:
        canvas.fill(col(-t / 2 - fw / 2), ground, col(-t / 2 + fw / 2), ground + foot_rows, FOOTING)
    face = col(0.0)
    canvas.fill(min(col(-t), face - 1), row(height_ft), face - 1, base, WALL)
    if resultant_ft is not None:
        canvas.put(min(col(-t), face - 1) - 1, row(resultant_ft), WIND)
    legend = [f"{WALL} wall {fmt(height_ft, 'ft', units, 1)} tall, "
              f"{fmt(thickness_in, 'in', units, 2)} thick"]
    if footing:
        legend.append(f"{FOOTING} footing {fmt(fw, 'ft', units, 1)} wide, "
                      f"{fmt(fd, 'ft', units, 1)} deep")
    if braces:
        top = row(braces["insert_height_ft"])
        foot = col(braces["anchor_distance_ft"])
        canvas.line(face, top, foot, base, BRACE, over=" ")
        canvas.put(face, top, INSERT)
        canvas.put(foot, ground, ANCHOR)
        legend += [
            f"{BRACE} {braces['count']} brace(s), {fmt(braces['length_ft'], 'ft', units, 1)} "
            f"long at {braces['angle_deg']:.0f}°",
            f"{INSERT} insert {fmt(braces['insert_height_ft'], 'ft', units, 1)} above the base",
            f"{ANCHOR} foot anchor {fmt(braces['anchor_distance_ft'], 'ft', units, 1)} "
            "from the face",
        ]
    else:
        legend.append("no braces")
    if resultant_ft is not None:
        legend.append(f"{WIND} design wind resultant {fmt(resultant_ft, 'ft', units, 1)} "
                      "above the base")
    return canvas.lines() + legend


def elevation(width_ft: float, height_ft: float, positions_ft: Sequence[float],
              insert_ft: float | None, openings: Iterable[tuple[float, float, float, float]],
              resultant_ft: float | None, units: str = "us", cols: int = 32,
              rows: int = 12, selected: int | None = None) -> list[str]:
    """The wall's face: outline, openings (x, y, width, height in ft), brace positions; the
    brace `selected` (an index) drawn heavier."""
    sx = (cols - 4) / width_ft
    sy = sx / CELL_ASPECT
    if height_ft * sy > rows - 2:
        sy = (rows - 2) / height_ft
        sx = min(sx, CELL_ASPECT * sy)
    openings = list(openings)
    right, top = max(2, round(width_ft * sx)), max(2, round(height_ft * sy))
    canvas = Canvas(right + 3, top + 2)

    def col(x: float) -> int:
        return round(x * sx)

    def row(y: float) -> int:
        return top - round(y * sy)

    for x, y, w, h in openings:
        c0, c1 = col(x) + 1, col(x + w) - 1
        r0, r1 = row(y + h) + 1, row(y) - 1
        if c1 >= c0 and r1 >= r0:
            canvas.fill(c0, r0, c1, r1, OPENING)
    canvas.box(0, 0, right, top)
    canvas.fill(0, top + 1, canvas.cols - 1, top + 1, GROUND)
    if insert_ft is not None:
        for k, x in enumerate(positions_ft):
            c = min(max(col(x), 1), right - 1)
            mine = k == selected
            canvas.line(c, row(insert_ft) + 1, c, top - 1, "┃" if mine else "┊",
                        over=" ┊" + OPENING)
            canvas.put(c, row(insert_ft), CHOSEN if mine else INSERT)
    if resultant_ft is not None:
        canvas.put(right + 1, row(resultant_ft), "◄")
    legend = [f"{fmt(width_ft, 'ft', units, 1)} wide x {fmt(height_ft, 'ft', units, 1)} tall"]
    if insert_ft is not None and positions_ft:
        where = ", ".join(fmt(x, "ft", units, 1) for x in positions_ft)
        legend.append(f"{INSERT} braces at {where} from the left edge")
    if openings:
        legend.append(f"{OPENING} opening")
    if resultant_ft is not None:
        legend.append(f"◄ wind resultant {fmt(resultant_ft, 'ft', units, 1)} above the base")
    return canvas.lines() + legend


def panel_elevation(p, openings: Iterable[tuple[float, float, float, float]],
                    units: str = "us", selected: int | None = None, cols: int = 32,
                    rows: int = 12) -> list[str]:
    """The elevation of a wall's result (`PanelResult`): its braces where the engine has them."""
    b = p.braces
    return elevation(p.width_ft, p.height_ft, b["positions_ft"] if b else [],
                     b["insert_height_ft"] if b else None, openings, p.wind.resultant_height_ft,
                     units, cols, rows, selected if b else None)


class PlanCanvas(Canvas):
    """A canvas in plan coordinates (ft): x to the right, y up, one scale for the whole site."""

    def __init__(self, bounds: tuple[float, float, float, float], cols: int, rows: int):
        x0, y0, x1, y1 = bounds
        span_x, span_y = max(x1 - x0, 1.0), max(y1 - y0, 1.0)
        self.scale = min((cols - 1) / span_x, CELL_ASPECT * (rows - 1) / span_y)
        super().__init__(round(span_x * self.scale) + 1,
                         round(span_y * self.scale / CELL_ASPECT) + 1)
        self.x0, self.y0 = x0, y0

    def at(self, x: float, y: float) -> tuple[int, int]:
        return (round((x - self.x0) * self.scale),
                self.rows - 1 - round((y - self.y0) * self.scale / CELL_ASPECT))

    def segment(self, a, b, ch: str, over: str = " ") -> None:
        self.line(*self.at(*a), *self.at(*b), ch, over=over)

    def ring(self, points: Sequence, ch: str, over: str = " ") -> None:
        pts = list(points)
        for a, b in zip(pts, pts[1:] + pts[:1], strict=True):
            self.segment(a, b, ch, over)

    def shade(self, points: Sequence, ch: str, over: str = " ") -> None:
        """Fill the cells whose centres lie inside the polygon (even-odd rule)."""
        pts = [self.at(*p) for p in points]
        for row in range(self.rows):
            crossings = []
            for (c0, r0), (c1, r1) in zip(pts, pts[1:] + pts[:1], strict=True):
                if (r0 <= row < r1) or (r1 <= row < r0):
                    crossings.append(c0 + (row - r0) * (c1 - c0) / (r1 - r0))
            crossings.sort()
            # in pairs; an odd one left (a vertex just on the row) starts no span
            for a, b in zip(crossings[::2], crossings[1::2], strict=False):
                for col in range(round(a), round(b) + 1):
                    if self.get(col, row) in over:
                        self.put(col, row, ch)


FOUNDATION, FOUNDATION_LATER = "▓", "╌"  # a foundation wall built that day, or not yet
# its backfill side: no backfill yet (outlined), backfilled that day, above what it takes
UNFILLED, FILLED, OVERFILLED = ":", "/", "X"
PLAN_SYMBOLS = (
    ("█", "wall standing"), ("□", "wall not yet standing"), ("•", "brace"),
    ("▲", "slab anchor"), ("◆", "ground anchor"), ("░", "fall zone"),
    ("#", "named area (below)"), ("·", "slab edge"), ("x", "slab hole"), ("┆", "slab joint"),
    ("~", "open ground"), ("!", "finding"), (FOUNDATION, "foundation wall"),
    (FOUNDATION_LATER, "foundation wall not yet built"), (UNFILLED, "backfill side, none yet"),
    (FILLED, "backfill (its side)"),
    (OVERFILLED, "backfill above what the wall takes: DANGER"),
)
AREA_WORDS = {"keep_clear": "keep clear", "crane_path": "crane path", "public_way": "public way",
              "neighbor": "neighbor", "office": "site office", "work": "work area"}


def pick_plan(plan, day: int | None, result=None):
    """The plan geometry of `day` when the result holds one per day (else the busiest day's),
    with its foundation walls' backfill of that day as the result gives it."""
    from bracing.report import svg  # with the Plan view, not at start
    from bracing.report.svg.foundation import with_backfill

    try:
        g = svg.pick_plan(plan, day)
    except ValueError:
        g = svg.pick_plan(plan, None)
    return with_backfill(g, result) if result is not None else g


def plan(g, cols: int = 100, rows: int = 30, units: str = "us") -> list[str]:
    """The site in plan from a `bracing.plan.PlanGeometry`: what stands that day, its braces,
    anchors and zones, the areas kept clear, with a legend and the plan's findings."""
    canvas = PlanCanvas(g.bounds, cols, rows)
    _ground(canvas, g)
    _walls(canvas, g)
    _marks(canvas, g)
    return canvas.lines() + ["", *_plan_legend(canvas, g, units)]


def _ground(canvas: PlanCanvas, g) -> None:
    """Fall zones, open ground, the slab with its holes and joints, the named areas."""
    for p in g.panels:
        if p.standing and len(p.restricted_zone) >= 3:
            canvas.shade(p.restricted_zone, "░")
    for ring in g.ground:
        canvas.ring(ring, "~", over=" ░")
    if len(g.slab) >= 3:
        canvas.ring(g.slab, "·", over=" ░~")
    for hole in g.slab_holes:
        canvas.ring(hole, "x", over=" ░·~")
    for joint in g.joints:
        for a, b in pairwise(joint):
            canvas.segment(a, b, "┆", over=" ░")
    for area in g.areas:
        canvas.ring(area.coords, "#", over=" ░·~┆")
    for w in g.foundation_walls:
        if w.built and w.backfill_ft > 0.0:
            canvas.shade(w.backfill, OVERFILLED if w.over else FILLED, over=" ░·~┆#")
        else:
            canvas.ring(w.backfill[:-1], UNFILLED, over=" ░~")


def _walls(canvas: PlanCanvas, g) -> None:
    """Braces, then the walls over them with their foot anchors, then the findings."""
    for p in g.panels:
        for a, b in p.braces:
            canvas.segment(a, b, "•", over=" ░·~┆#")
    for w in g.foundation_walls:  # inside braces, on the days they are in use
        for a, b in _inside_braces(w):
            canvas.segment(a, b, "•", over=" ░·~┆#")
    for p in g.panels:
        ch = "█" if p.standing else "□"
        pts = p.footprint[:-1] if len(p.footprint) > 1 and p.footprint[0] == p.footprint[-1] \
            else p.footprint
        canvas.ring(pts, ch, over=" ░·~┆#•□")
        for _, foot in p.braces:
            canvas.put(*canvas.at(*foot), "▲" if p.foot_kind == "slab" else "◆")
    for w in g.foundation_walls:
        canvas.ring(w.footprint[:-1], FOUNDATION if w.built else FOUNDATION_LATER,
                    over=f" ░·~┆#•□{UNFILLED}{FILLED}{OVERFILLED}")
        for _, foot in _inside_braces(w):
            canvas.put(*canvas.at(*foot), "▲" if w.foot_kind == "slab" else "◆")
    for f in g.findings:
        for point in f.at:
            canvas.put(*canvas.at(*point), "!")


def _marks(canvas: PlanCanvas, g) -> None:
    """Each wall's mark beside its face on its back side, where it finds room."""
    for p in g.panels:
        (x0, y0), (x1, y1) = p.face
        col, row = canvas.at((x0 + x1) / 2, (y0 + y1) / 2)
        label = f"{p.mark}"
        start = max(0, min(col - len(label) // 2, canvas.cols - len(label)))
        row = row - 1 if row > 0 else row + 1
        if all(canvas.get(start + k, row) in " ░·~" for k in range(len(label))):
            canvas.text(start, row, label)
    for w in g.foundation_walls:  # in the middle of its backfill side, over the hatch
        xs, ys = zip(*w.backfill[:-1], strict=True)
        col, row = canvas.at(sum(xs) / len(xs), sum(ys) / len(ys))
        middle, n = col - len(w.mark) // 2, len(w.mark)
        free = [start for start in sorted(range(col - n + 1, col + 1),
                                          key=lambda c, m=middle: abs(c - m))
                if all(canvas.get(start + k, row) in f" ░·~{UNFILLED}{FILLED}{OVERFILLED}"
                       for k in range(n)) and 0 <= start <= canvas.cols - n]
        if free:
            canvas.text(free[0], row, w.mark)


def _plan_legend(canvas: PlanCanvas, g, units: str) -> list[str]:
    """The symbols drawn, the scale, the areas, the zones' bases and the plan's findings."""
    used = set("".join(canvas.lines()))
    legend = "  ".join(f"{ch} {words}" for ch, words in PLAN_SYMBOLS if ch in used)
    scale = (f"one column = {fmt(1 / canvas.scale, 'ft', units, 1)}, one row = "
             f"{fmt(CELL_ASPECT / canvas.scale, 'ft', units, 1)}")
    out = [legend, scale + "; north is up"]
    out += [f"# {AREA_WORDS.get(a.kind, a.kind)}: {a.name}" for a in g.areas]
    out += [f"░ {p.mark} zone: {p.zone_basis}" for p in g.panels
            if p.standing and p.zone_basis]
    out += [f"! {f.mark}: {f.flag.severity.upper()}: {f.flag.message}" for f in g.findings]
    out += [_foundation_key(w, units) for w in g.foundation_walls]
    return out


def _inside_braces(w) -> list:
    """A foundation wall's inside braces, (insert, foot) in plan ft, on a day they are in use."""
    return w.braces if w.built and w.braced else []


def _foundation_key(w, units: str) -> str:
    """A foundation wall's line of the key: its backfill that day, DANGER where it is above
    what the wall takes (bracing.plan.PlanFoundationWall, filled from the result)."""
    if not w.built:
        return f"{FOUNDATION_LATER} {w.mark} ({w.line}): not yet built"
    if w.over:
        return (f"{OVERFILLED} {w.mark} ({w.line}): DANGER: backfill "
                f"{fmt(w.backfill_ft, 'ft', units, 1)}, above what the wall takes")
    fill = (f"backfill {fmt(w.backfill_ft, 'ft', units, 1)} on its {FILLED} side"
            if w.backfill_ft > 0.0 else f"no backfill yet on its {UNFILLED} side")
    braces = _inside_braces(w)
    held = (f"; {len(braces)} inside braces (•) at {fmt(w.brace_height_ft, 'ft', units, 1)}"
            if braces else "")
    return f"{FOUNDATION} {w.mark} ({w.line}): {fill}{held}"
