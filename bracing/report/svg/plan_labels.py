"""What a plan frame labels: wall marks (with a failing wall's status), detail plan numbers,
finding numbers and area names, each at the point it names."""

from __future__ import annotations

import shapely
from shapely.geometry import Polygon, box

from bracing.report.svg.labels import Label
from bracing.report.svg.layers import Frame, in_window, line_geometry
from bracing.report.svg.style import AREA_STYLE, DANGER, LABEL_MM, MARK_MM, STATUS_WORDS, WARNING


# --- labels of a plan frame -----------------------------------------------------------------------
def _kind_words(a) -> str:
    """An area's kind in words."""
    return AREA_STYLE[a.kind][2]


def _area_words(a) -> str:
    """An area's name, with its kind unless the name already says it (either spelling)."""
    words = _kind_words(a)
    said = a.name.lower().replace("neighbour", "neighbor")
    return a.name if words in said else f"{a.name} ({words})"


def status_of(result) -> dict[str, str]:
    """Each wall's status by mark (`PanelResult.status`)."""
    return {p.mark: p.status for p in getattr(result, "panels", [])}


def mark_label(p, line, fr: Frame, status: dict[str, str], own: bool = True) -> Label:
    """A wall's mark (and its status when failing), its point just behind the wall's middle;
    a wall that is not `own` (a neighbor on a detail of other walls) in grey."""
    _, (nx, ny), _ = line_geometry(line)
    (x0, y0), (x1, y1) = p.face
    back = 1.0 + fr.ft(2.0)  # behind the footprint, away from the braces
    mx, my = (x0 + x1) / 2 - nx * back, (y0 + y1) / 2 - ny * back
    word = STATUS_WORDS.get(status.get(p.mark, ""), "")
    return Label(f"mark:{p.mark}", f"{p.mark} {word}".strip(), MARK_MM, fr.xy(mx, my),
                 color=(DANGER if word else "#000") if own else "#707070")


def finding_labels(numbered, fr: Frame) -> list[Label]:
    """One number per finding, at its first point inside the frame."""
    out = []
    for n, f in numbered:
        inside = [pt for pt in f.at if in_window(pt, fr.window)]
        if inside and f.flag.severity in ("danger", "warning"):
            color = DANGER if f.flag.severity == "danger" else WARNING
            out.append(Label(f"finding:{n}", str(n), LABEL_MM, fr.xy(*inside[0]), color=color))
    return out


def area_labels(g, fr: Frame) -> list[Label]:
    """Each area's name, at a point of it inside the frame."""
    out = []
    frame = box(*fr.window)
    for a in g.areas:
        if len(a.coords) < 3:
            continue
        part = shapely.make_valid(Polygon(a.coords)).intersection(frame)
        if part.is_empty or part.area <= 0:
            continue
        pt = part.representative_point()
        out.append(Label(f"area:{a.name}", _area_words(a), LABEL_MM, fr.xy(pt.x, pt.y),
                         color=AREA_STYLE[a.kind][0]))
    return out


def detail_labels(g, fr: Frame, details) -> list[Label]:
    """Each detail plan's number, behind the middle of its walls (the overview's key to them)."""
    lines = {line.name: line for line in g.lines}
    panels = {p.mark: p for p in g.panels}
    out = []
    for i, d in enumerate(details, 1):
        _, (nx, ny), _ = line_geometry(lines[d.line])
        faces = [panels[m].face for m in d.marks]
        mx = sum(a[0] + b[0] for a, b in faces) / (2 * len(faces))
        my = sum(a[1] + b[1] for a, b in faces) / (2 * len(faces))
        back = fr.ft(3.5)
        out.append(Label(f"detail:{i}", f"detail {i}", LABEL_MM,
                         fr.xy(mx - nx * back, my - ny * back)))
    return out


def details_words(details) -> str:
    """The detail plans in a sentence: number, line and walls."""
    parts = []
    for i, d in enumerate(details, 1):
        walls = d.marks[0] if len(d.marks) == 1 else f"{d.marks[0]} to {d.marks[-1]}"
        parts.append(f"{i}: {d.line}, {walls}")
    return "Detail plans follow, " + "; ".join(parts) + "."


def unplaced_words(missing: list[str]) -> str:
    """A sentence naming the labels that found no room on the plan (none: empty)."""
    return "" if not missing else (" Not labelled on the plan for want of room: "
                                   + ", ".join(missing) + ".")


