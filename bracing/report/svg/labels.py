"""Labels placed clear of each other and of the drawing (`place_labels`), and drawn with a
white halo and, where one stands off its point, a leader line."""

from __future__ import annotations

from dataclasses import dataclass
from xml.sax.saxutils import quoteattr

import numpy as np
import shapely
from shapely.geometry import Point, box

from bracing.report.svg.style import HALO, num, text, text_width


@dataclass(frozen=True)
class Label:
    """A label to place: its words, font size and weight, and the point (sheet units, y down)
    it names; `key` says what it names."""

    key: str
    words: str
    size: float
    at: tuple[float, float]
    bold: bool = True
    color: str = "#000"


@dataclass(frozen=True)
class Placed:
    """Where a label went: its box (least x, least y, greatest x, greatest y; y down) and
    whether it stands off its point (then a leader line joins them)."""

    label: Label
    box: tuple[float, float, float, float]
    leader: bool


def label_box_size(label: Label) -> tuple[float, float]:
    """Width and height of a label's box: its text's width and 1.2 of its font size (the
    descenders and the halo)."""
    return text_width(label.words, label.size, label.bold), 1.2 * label.size


def place_labels(labels: list[Label], drawn: list[tuple[object, float]],
                 frame: tuple[float, float, float, float]) -> list[Placed | None]:
    """Boxes for the labels, in order, none overlapping another, each inside `frame`.

    Candidates ring each label's point, nearest first (the point in the middle of the box, then
    boxes beside it in 16 directions at growing distances, then anywhere in the frame). A box
    may not meet a box already placed (with a gap of 0.15 of the font size); among the others
    the one with the least cost wins: the weights of the `drawn` items it covers (shapely
    geometries in sheet units, each with a weight) plus 0.1 for each label height it stands off
    its point (nearer winning ties). None for a label that finds no room."""
    lo_x, lo_y, hi_x, hi_y = frame
    shapes = np.array([s for s, _ in drawn], dtype=object)
    weights = np.array([w for _, w in drawn], dtype=float)
    tree = shapely.STRtree(shapes) if len(shapes) else None
    taken = np.empty((0, 4))
    out: list[Placed | None] = []
    turns = np.radians(np.arange(0, 360, 22.5))
    for label in labels:
        w, h = label_box_size(label)
        ax, ay = label.at
        rings = [0.0, 0.2, 0.6, 1.2, 2.0, 3.0, 4.5, 6.5, 9.0, 13.0]
        cx = [np.array([ax])]
        cy = [np.array([ay])]
        for r in rings:
            cx.append(ax + np.cos(turns) * (w / 2 + r * h))
            cy.append(ay + np.sin(turns) * (h / 2 + r * h))
        gx, gy = np.meshgrid(np.arange(lo_x + w / 2, hi_x - w / 2 + 1e-9, max(h, w / 4)),
                             np.arange(lo_y + h / 2, hi_y - h / 2 + 1e-9, h))
        cx.append(gx.ravel())
        cy.append(gy.ravel())
        cx, cy = np.concatenate(cx), np.concatenate(cy)
        boxes = np.stack([cx - w / 2, cy - h / 2, cx + w / 2, cy + h / 2], axis=1)
        inside = ((boxes[:, 0] >= lo_x) & (boxes[:, 1] >= lo_y) & (boxes[:, 2] <= hi_x)
                  & (boxes[:, 3] <= hi_y))
        gap = 0.15 * label.size
        if len(taken):
            meets = ((boxes[:, None, 0] < taken[None, :, 2] + gap)
                     & (boxes[:, None, 2] > taken[None, :, 0] - gap)
                     & (boxes[:, None, 1] < taken[None, :, 3] + gap)
                     & (boxes[:, None, 3] > taken[None, :, 1] - gap)).any(axis=1)
        else:
            meets = np.zeros(len(boxes), bool)
        free = np.flatnonzero(inside & ~meets)
        if len(free) == 0:
            out.append(None)
            continue
        cost = np.zeros(len(free))
        if tree is not None:
            hit_box, hit = tree.query(shapely.box(*boxes[free].T), predicate="intersects")
            cost = np.bincount(hit_box, weights=weights[hit], minlength=len(free))
        distance = np.hypot(cx[free] - ax, cy[free] - ay) / h
        best = free[np.lexsort((distance, np.round(cost + 0.1 * distance, 6)))[0]]
        b = boxes[best]
        taken = np.vstack([taken, b])
        near = box(*b).distance(Point(ax, ay)) > 0.6 * h
        out.append(Placed(label, tuple(float(v) for v in b), bool(near)))
    return out


def boxes_overlap(a, b) -> bool:
    """Whether two boxes (least x, least y, greatest x, greatest y) share any area."""
    return a[0] < b[2] and b[0] < a[2] and a[1] < b[3] and b[1] < a[3]


def placed_items(placed: list[Placed | None]) -> list[str]:
    """The placed labels as SVG text with a white halo, and their leader lines."""
    out = []
    for p in placed:
        if p is None:
            continue
        x0, _, x1, y1 = p.box
        lab = p.label
        color = lab.color
        if p.leader:
            edge = box(*p.box).exterior
            near = edge.interpolate(edge.project(Point(lab.at)))
            out.append(f'<line x1="{num(lab.at[0])}" y1="{num(lab.at[1])}" x2="{num(near.x)}" '
                       f'y2="{num(near.y)}" stroke="{color}" stroke-width="0.2"/>')
        out.append(text((x0 + x1) / 2, y1 - 0.3 * lab.size, lab.words, lab.size, "middle",
                        weight="bold" if lab.bold else "normal", fill=color,
                        extra=f' class="label" data-key={quoteattr(lab.key)}{HALO} '
                        f'stroke-width="{num(0.35 * lab.size)}"'))
    return out


