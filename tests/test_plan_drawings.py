"""The plans that read (bracing.report.svg, bracing.plan): labels placed clear of each other,
detail plans per wall line, marks legible at print size, titles inside the sheet, keep-out
areas above the braces, zones summarized, and wall elevations measured from a named edge.

Sizes are read from the SVG itself: every plan sheet is laid out in mm (`width="190mm"` and a
viewBox 190 units wide, so one unit prints as 1 mm on letter or A4 paper with 13 mm margins).
Text widths are estimated here from DejaVu Sans Bold's advance widths (the font the drawings
name first; from memory: capitals about 0.64 to 0.84 em, W 1.03 em, digits 0.70 em, hyphen
0.42 em, space 0.35 em, lower case about 0.70 em): the test's own estimate, not the code's.
"""

import xml.etree.ElementTree as ET
from pathlib import Path

import pytest

from bracing import plan, scenario
from bracing.evaluate import evaluate
from bracing.model import Site
from bracing.report import svg

NS = "{http://www.w3.org/2000/svg}"
SCENARIOS = Path(__file__).resolve().parent.parent / "scenarios"
REGULAR = 0.85  # DejaVu Sans regular / bold widths, about (from memory)
CAP_HEIGHT_EM = 0.73  # DejaVu Sans capital height / em (font metrics, from memory)
BOLD_EM = {**dict.fromkeys("ABCDEFGHIJKLMNOPQRSTUVXYZ", 0.84), "W": 1.03, "M": 1.0,
           **dict.fromkeys("0123456789", 0.70), "-": 0.42, " ": 0.35, ".": 0.38, "I": 0.37}


def em_width(words: str) -> float:
    """The test's estimate of a bold line's width in em (lower case and others 0.72)."""
    return sum(BOLD_EM.get(c, 0.72) for c in words)


@pytest.fixture(scope="module")
def tilt_up():
    path = SCENARIOS / "tilt-up-warehouse.toml"
    return evaluate(scenario.load(path).site, base_dir=path.parent)


@pytest.fixture(scope="module")
def townhouse():
    path = SCENARIOS / "townhouse-framing.toml"
    return evaluate(scenario.load(path).site, base_dir=path.parent)


def root_of(document: str):
    return ET.fromstring(document.encode("utf-8"))


def mm_per_unit(root) -> float:
    """Printed mm per drawing unit: the width attribute (mm) over the viewBox width."""
    assert root.get("width").endswith("mm")
    return float(root.get("width")[:-2]) / float(root.get("viewBox").split()[2])


def text_boxes(root, css: str = "label"):
    """(words, size, box) of the texts of a class, the box from the text's anchor point, font
    size and the test's width estimate (bold), 1.0 em tall above the baseline less 0.2 em."""
    out = []
    for t in root.iter(f"{NS}text"):
        if css not in (t.get("class") or "").split():
            continue
        size, x, y = float(t.get("font-size")), float(t.get("x")), float(t.get("y"))
        w = em_width(t.text) * size
        left = {"start": x, "middle": x - w / 2, "end": x - w}[t.get("text-anchor")]
        out.append((t.text, size, (left, y - 0.8 * size, left + w, y + 0.2 * size)))
    return out


# --- place_labels: a pure function ----------------------------------------------------------------
def test_labels_at_one_point_do_not_overlap_and_stay_in_the_frame():
    """Five labels wanting the same point get five boxes that share no area, all inside the
    frame (hand-set geometry: a 100 x 60 frame, labels 3 units tall)."""
    labels = [svg.Label(f"k{i}", f"LABEL {i}", 3.0, (50.0, 30.0)) for i in range(5)]
    placed = svg.place_labels(labels, [], (0.0, 0.0, 100.0, 60.0))
    assert all(p is not None for p in placed)
    boxes = [p.box for p in placed]
    for i, a in enumerate(boxes):
        assert 0 <= a[0] and 0 <= a[1] and a[2] <= 100 and a[3] <= 60
        for b in boxes[i + 1:]:
            assert not svg.boxes_overlap(a, b)


def test_a_label_moves_off_a_drawn_item_when_there_is_room():
    """A label wanting the middle of a drawn square (20 to 40 both ways) is set outside it."""
    from shapely.geometry import box

    square = box(20, 20, 40, 40)
    [p] = svg.place_labels([svg.Label("k", "MARK", 3.0, (30.0, 30.0))], [(square, 5.0)],
                           (0.0, 0.0, 100.0, 100.0))
    assert not box(*p.box).intersects(square)
    assert p.leader or box(*p.box).distance(square) < 3.0  # beside it, or joined by a leader


def test_a_label_with_no_room_is_not_placed():
    """A frame 5 units wide cannot hold a label about 40 units wide."""
    placed = svg.place_labels([svg.Label("k", "A VERY LONG LABEL WORDS", 3.0, (2.0, 2.0))], [],
                              (0.0, 0.0, 5.0, 5.0))
    assert placed == [None]


# --- the detail plans of the tilt-up warehouse, day 5 ---------------------------------------------
def test_tilt_up_day_5_has_detail_plans_of_every_line_cut_where_long(tilt_up):
    """Day 5 stands 42 walls on four lines (12, 9, 12, 9 walls). The long walls (grid A and F)
    run about 300 ft, over the 200 ft of one detail: ceil(300 / 200) = 2 stretches each; the
    end walls run 225 ft: 2 each too. 8 details, every wall standing on exactly one."""
    details = svg.detail_svgs(tilt_up, 5)
    assert len(details) == 8
    marks = [m for d, _ in details for m in d.marks]
    assert sorted(marks) == sorted(tilt_up.plan[5].standing) and len(marks) == 42


def test_tilt_up_day_5_marks_are_legible_and_labels_do_not_overlap(tilt_up):
    """Each detail prints 190 mm wide (1 unit = 1 mm). Every mark of its walls is a label at
    least 2 mm tall in capitals (font size x 0.73, DejaVu Sans cap height); no two label boxes
    share any area."""
    for d, document in svg.detail_svgs(tilt_up, 5):
        root = root_of(document)
        assert mm_per_unit(root) == pytest.approx(1.0)
        labels = text_boxes(root)
        words = [w for w, _, _ in labels]
        for mark in d.marks:
            [(_, size, _)] = [lab for lab in labels if lab[0].split()[0] == mark]
            assert size * CAP_HEIGHT_EM >= 2.0, (mark, size)
        boxes = [b for _, _, b in labels]
        for i, a in enumerate(boxes):
            for j in range(i + 1, len(boxes)):
                assert not svg.boxes_overlap(a, boxes[j]), (words[i], words[j])


def test_titles_and_texts_fit_inside_every_sheet(tilt_up, townhouse):
    """No text of the overview or the details runs past the sheet's edges (the title of the
    warehouse is over 100 characters: it is wrapped)."""
    for result, day in ((tilt_up, 5), (townhouse, 2)):
        for document in [svg.overview_svg(result, day),
                         *(s for _, s in svg.detail_svgs(result, day))]:
            root = root_of(document)
            width = float(root.get("viewBox").split()[2])
            for t in root.iter(f"{NS}text"):
                if t.get("transform"):
                    continue
                size, x = float(t.get("font-size")), float(t.get("x"))
                w = em_width(t.text or "") * size * (
                    1.0 if t.get("font-weight") == "bold" else REGULAR)
                left = {"start": x, "middle": x - w / 2, "end": x - w}[t.get("text-anchor")]
                assert left >= 0 and left + w <= width, t.text
                assert size >= svg.LEAST_TEXT_MM


# --- keep-out areas above the braces --------------------------------------------------------------
def test_townhouse_day_2_gas_strip_is_drawn_above_the_braces_that_cross_it(townhouse):
    """The gas-line keep-clear strip lies under the stakes of L1-F11 and L1-F12: on every
    drawing it is drawn (again, bold) after each of their braces, so it shows above them."""
    name = "Gas service to units 11 and 12, marked: no stakes"
    drawings = [svg.overview_svg(townhouse, 2), svg.plan_svg(townhouse, 2)]
    drawings += [s for d, s in svg.detail_svgs(townhouse, 2) if "L1-F11" in d.marks]
    assert len(drawings) == 3
    for document in drawings:
        frames = [g for g in root_of(document).iter(f"{NS}g") if g.get("class") == "plan"]
        seen = 0
        for frame in frames:  # each plan frame (the composite has the overview and details)
            order = list(frame.iter())
            strip = [k for k, e in enumerate(order) if e.get("data-name") == name
                     and "keep-out" in (e.get("class") or "")]
            braces = [k for k, e in enumerate(order) if e.get("class") == "brace"
                      and e.get("data-mark") in ("L1-F11", "L1-F12")]
            if strip and braces:
                seen += 1
                assert min(strip) > max(braces)
        assert seen >= 1


# --- the overview ---------------------------------------------------------------------------------
def test_overview_summarizes_the_zones_and_spells_neighbor_once(tilt_up):
    """42 walls share one zone rule: one sentence for them, not a line per wall; the neighbor's
    area is named once (its name already says neighbour: no second '(neighbor)')."""
    document = svg.overview_svg(tilt_up, 5)
    words = " ".join(t.text or "" for t in root_of(document).iter(f"{NS}text"))
    assert "Restricted zone of 42 walls" in words
    assert "Zone of S-01" not in words
    assert "(neighbour) (neighbo" not in words
    assert "neighbor (braces stay out)" in words  # the legend, US spelling


# --- elevations -----------------------------------------------------------------------------------
def elevation_site() -> Site:
    """One wall on line A from (0, 0) to (40, 0), braced side left: braces to the north. The
    viewer setting them stands north of the wall facing south, so the east end is on the left."""
    return Site.model_validate({
        "version": 1,
        "site": {"name": "elevation", "basic_wind_speed": 115},
        "materials": {"tilt": {"kind": "concrete", "unit_weight": 150}},
        "brace_types": {"b": {"kind": "unrated"}},
        "lines": [{"name": "A", "start": [0, 0], "end": [40, 0], "braced_side": "left"}],
        "panels": [{"mark": "P-1", "material": "tilt", "width": 20, "height": 30,
                    "thickness": 7.25, "line": "A", "offset": 0,
                    "openings": [{"x": 2, "y": 0, "width": 3, "height": 7}],
                    "bracing": {"brace_type": "b", "count": 2, "insert_height": 20,
                                "anchor_distance": 14, "positions": [3, 12]}}],
    })


def test_elevation_measures_from_the_edge_on_the_viewers_left():
    """Hand-worked: the first edge (x = 0) is the west end, on the viewer's right; from the
    east end the braces at 3 and 12 ft are 20 - 3 = 17 and 20 - 12 = 8 ft; the opening 2 to
    5 ft from the west end is 20 - 5 = 15 ft from the east end."""
    e = plan.plan_geometry(elevation_site()).panels[0].elevation
    assert e.left_edge == "east end" and e.right_edge == "west end"
    assert e.first_edge_left is False
    assert e.braces_from_left_ft == pytest.approx([17.0, 8.0])
    assert e.openings == [pytest.approx((15.0, 0.0, 3.0, 7.0))]
    assert e.insert_height_ft == 20.0


def test_elevation_svg_shows_the_edge_the_positions_and_the_insert_height():
    site = elevation_site()
    result = evaluate(site)
    g = plan.plan_geometry(site)
    document = svg.elevation_svg(result.panels[0], g.panels[0].elevation)
    root = root_of(document)
    words = " ".join(t.text or "" for t in root.iter(f"{NS}text"))
    for piece in ("P-1", "east end", "west end", "8.00 ft", "17.00 ft", "insert 20 ft",
                  "wall 20 ft", "30 ft"):
        assert piece in words, piece
    assert len([e for e in root.iter(f"{NS}circle") if e.get("class") == "insert"]) == 2
    assert len([e for e in root.iter(f"{NS}rect") if e.get("class") == "opening"]) == 1


def test_elevations_of_a_day_are_given_by_mark(townhouse):
    drawn = svg.elevation_svgs(townhouse, 2)
    assert "L1-F11" in drawn and "west end" in drawn["L1-F11"]


def test_tilt_up_day_5_details_are_at_1_in_30_ft(tilt_up):
    """Hand-worked: a stretch of the 300 ft lines is about 150 ft, 162 ft with the 6 ft margins;
    at 1 in = 20 ft the 186 mm frame holds 186 / 25.4 x 20 = 146 ft (too short), at 30 ft 220 ft.
    The zones reach 59 ft out and 37 ft behind: 108 ft tall, 108 x 25.4 / 30 = 91 mm (within
    the 120 mm of a detail). The end walls' stretches (about 112 ft, 124 ft with margins) are
    124 ft tall on paper at 20 ft (157 mm, over 120 mm): 30 ft too."""
    for _, document in svg.detail_svgs(tilt_up, 5):
        words = " ".join(t.text or "" for t in root_of(document).iter(f"{NS}text"))
        assert "Scale 1 in = 30 ft printed 190 mm wide" in words


def test_a_label_with_no_room_is_named_under_the_plan(monkeypatch, townhouse):
    """When the placer finds no room for a label, the sheet says which under the plan (the
    placer is replaced by one that finds room for none)."""
    monkeypatch.setattr(svg, "place_labels", lambda labels, drawn, frame: [None] * len(labels))
    [(_, document)] = [x for x in svg.detail_svgs(townhouse, 2) if "L1-F11" in x[0].marks]
    words = " ".join(t.text or "" for t in root_of(document).iter(f"{NS}text"))
    assert "Not labelled on the plan for want of room:" in words
    assert "L1-F11 UNSAFE" in words


def test_drawings_of_two_days_share_no_ids(townhouse):
    """A crew sheet inlines the drawings of many days in one HTML page: a clip path or pattern
    id used by two different drawings would draw one day's plan with another's clip."""
    def ids(document):
        return {e.get("id") for e in root_of(document).iter() if e.get("id")}

    one = ids(svg.overview_svg(townhouse, 1)) | {i for _, s in svg.detail_svgs(townhouse, 1)
                                                 for i in ids(s)}
    two = ids(svg.overview_svg(townhouse, 2)) | {i for _, s in svg.detail_svgs(townhouse, 2)
                                                 for i in ids(s)}
    assert one and two and not one & two
