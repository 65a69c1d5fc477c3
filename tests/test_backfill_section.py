"""The section sketch of a foundation wall backfilled before the floor (issue 15, method notes
§12): the pressure diagram to its values, the resultant at its height, the inside brace at its
height and angle, the allowed height marked, the danger in words, labels apart, SI words.

Read from the SVG itself: the sketch is laid out in mm (`width="120mm"`, a viewBox 120 units
wide). Text widths are the test's own estimate (DejaVu Sans Bold advance widths, from memory,
as in tests/test_plan_drawings.py), not the code's.
"""

import json
import re
import xml.etree.ElementTree as ET

import pytest

from bracing.backfill_profile import BackfillSketch, InsideBraceSketch
from bracing.cli import main
from bracing.report.svg.backfill import backfill_section_svg
from bracing.report.svg.labels import boxes_overlap
from bracing.results import CAUTION

NS = "{http://www.w3.org/2000/svg}"
US_UNITS = re.compile(r"(?<![A-Za-z_])(mph|ft|lbf?|lbs|psf|pcf|plf|psi|kips?|in)(?![A-Za-z_])")
BOLD_EM = {**dict.fromkeys("ABCDEFGHIJKLMNOPQRSTUVXYZ", 0.84), "W": 1.03, "M": 1.0,
           **dict.fromkeys("0123456789", 0.70), "-": 0.42, " ": 0.35, ".": 0.38, "I": 0.37,
           ",": 0.38, ":": 0.40}
# The quick check of the worked wall: 9 ft plain wall, 8 in, SM at rest (60 psf/ft, IBC 2018
# Table 1610.1, from memory), 6 ft of backfill, 250 psf surcharge, water 2 ft above the base,
# a 2 ft footing, inside braces at 6 ft every 6 ft at 45 deg.
WORKED = ["backfill", "--height", "9ft", "--thickness", "8in", "--fc", "2500psi", "--soil",
          "SM", "--backfill-height", "6ft", "--surcharge", "250psf", "--water-level", "2ft",
          "--footing-width", "2ft", "--brace-height", "6ft", "--brace-spacing", "6ft",
          "--brace-capacity", "6000lb"]


REGULAR = 0.85  # DejaVu Sans regular / bold widths, about (from memory)
WITHOUT_BRACES = WORKED[:-6]


def em_width(words: str) -> float:
    return sum(BOLD_EM.get(c, 0.72) for c in words)


def quick_sketch(tmp_path, capsys, *extra) -> tuple[ET.Element, str, dict]:
    """The sketch `bracing backfill --svg` writes, its text, and the JSON record."""
    path = tmp_path / "wall.svg"
    main([*WORKED, *extra, "--svg", str(path), "--json"])
    record = json.loads(capsys.readouterr().out)  # stdout stays one JSON object
    document = path.read_text()
    return ET.fromstring(document.encode()), document, record


def words_of(root) -> list[str]:
    return [t.text or "" for t in root.iter(f"{NS}text")]


def text_boxes(root):
    """(words, box) of every unturned text: its anchor point, font size and the test's width
    estimate (bold; regular 0.85 of it), 1.0 em tall above the baseline less 0.2 em."""
    out = []
    for t in root.iter(f"{NS}text"):
        if t.get("transform"):
            continue
        size, x, y = float(t.get("font-size")), float(t.get("x")), float(t.get("y"))
        w = em_width(t.text or "") * size * (1.0 if t.get("font-weight") == "bold" else REGULAR)
        left = {"start": x, "middle": x - w / 2, "end": x - w}[t.get("text-anchor")]
        out.append((t.text, (left, y - 0.8 * size, left + w, y + 0.2 * size)))
    return out


def points(element) -> list[tuple[float, float]]:
    return [tuple(map(float, p.split(","))) for p in element.get("points").split()]


def the(root, tag: str, css: str):
    [found] = [e for e in root.iter(f"{NS}{tag}") if css in (e.get("class") or "").split()]
    return found


# --- the pressure diagram ----------------------------------------------------------------------
def test_pressure_diagram_base_value_and_shape(tmp_path, capsys):
    """K = EFP / unit weight = 60 / 120 = 0.5 (method notes §12; 120 pcf common practice).
    At the base of 6 ft of fill: surcharge K q_s = 0.5 x 250 = 125 psf, soil EFP H = 60 x 6 =
    360 psf, water 62.4 (1 - K) h_w = 62.4 x 0.5 x 2 = 62.4 psf: 547.4 psf, "547 psf at the
    base". The diagram's width is the pressure: at the top 125 psf, so top / base = 125 / 547.4
    = 0.2284; at the water level (4 ft down) 125 + 60 x 4 = 365 psf, 365 / 547.4 = 0.6668."""
    root, _, _ = quick_sketch(tmp_path, capsys)
    assert "547 psf at the base" in words_of(root)
    diagram = points(the(root, "polygon", "pressure"))
    face = diagram[0][0]
    top, water, base = (x - face for x, _ in diagram[1:4])
    assert top / base == pytest.approx(125.0 / 547.4, rel=1e-3)
    assert water / base == pytest.approx(365.0 / 547.4, rel=1e-3)
    assert "surcharge 250 psf: 125 psf on the wall" in words_of(root)


def test_pressure_diagram_without_surcharge_or_water_is_a_triangle(tmp_path, capsys):
    """No surcharge, drained: p = EFP z only, 60 x 6 = 360 psf at the base, nothing at the
    top (IBC 2018 Table 1610.1 SM at rest 60 psf/ft, from memory)."""
    root, _, _ = quick_sketch(tmp_path, capsys, "--surcharge", "0", "--water-level", "0ft")
    assert "360 psf at the base" in words_of(root)
    diagram = points(the(root, "polygon", "pressure"))
    assert diagram[1][0] == pytest.approx(diagram[0][0], abs=1e-3)  # no width at the top


def test_resultant_at_its_height(tmp_path, capsys):
    """By statics over the profile above (method notes §12):
    V = K q H + EFP H^2/2 + c h_w^2/2 = 125 x 6 + 60 x 36/2 + 31.2 x 4/2 = 750 + 1,080 + 62.4
    = 1,892.4 lb/ft; M = 125 x 36/2 + 60 x 216/6 + 31.2 x 8/6 = 2,250 + 2,160 + 41.6
    = 4,451.6 lb-ft/ft; its height M / V = 2.352 ft, drawn 2.352 / 6 of the way up the fill."""
    root, _, _ = quick_sketch(tmp_path, capsys)
    assert "P 1,892 plf at 2.35 ft" in words_of(root)
    arrow = next(the(root, "g", "resultant").iter(f"{NS}line"))
    diagram = points(the(root, "polygon", "pressure"))
    fill_top, base = diagram[0][1], diagram[-1][1]
    assert (base - float(arrow.get("y1"))) / (base - fill_top) == pytest.approx(2.352 / 6,
                                                                                 rel=1e-3)


def test_inside_brace_at_its_height_and_angle_with_its_force(tmp_path, capsys):
    """Pinned base (method notes §12): R = M / h_b = 4,451.6 / 6 = 741.9 lb/ft; P = R s /
    cos 45 = 741.9 x 6 / 0.70711 = 6,295.6 lb, "6,296 lb each". Drawn from the inside face at
    6 ft of the 9 ft wall down to its foot at 45 deg."""
    root, _, record = quick_sketch(tmp_path, capsys)
    assert "inside brace at 6.0 ft, 45°, every 6.0 ft: 6,296 lb each" in words_of(root)
    brace = the(root, "line", "inside-brace")
    wall = the(root, "rect", "wall")
    x1, y1, x2, y2 = (float(brace.get(a)) for a in ("x1", "y1", "x2", "y2"))
    wall_top, wall_h = float(wall.get("y")), float(wall.get("height"))
    assert x1 == pytest.approx(float(wall.get("x")), abs=1e-3)  # on the inside face
    assert (wall_top + wall_h - y1) / wall_h == pytest.approx(6.0 / 9.0, rel=1e-3)
    assert (y2 - y1) / (x1 - x2) == pytest.approx(1.0, rel=1e-3)  # tan 45 deg
    held = record["inside_brace"]["max_backfill_height_ft"]
    assert f"with the inside braces {held:.1f} ft" in words_of(root)


def test_allowed_height_marked_and_danger_said_in_words(tmp_path, capsys):
    """The quick check's maximum before the floor is drawn as a line at its height and named;
    6 ft of fill on this wall fails without braces (record), so the backfill line is named
    DANGER with the height allowed; 1 ft with the braces passes and says no danger."""
    path = tmp_path / "wall.svg"
    main([*WITHOUT_BRACES, "--svg", str(path), "--json"])
    record = json.loads(capsys.readouterr().out)
    root = ET.fromstring(path.read_bytes())
    allowed = record["max_backfill_height_ft"]
    assert record["passes"] is False
    words = words_of(root)
    assert f"allowed {allowed:.1f} ft before the floor" in words
    assert any(w.startswith("DANGER: backfill 6 ft") for w in words)
    line, wall = the(root, "line", "allowed"), the(root, "rect", "wall")
    base = float(wall.get("y")) + float(wall.get("height"))
    assert (base - float(line.get("y1"))) / float(wall.get("height")) == pytest.approx(
        allowed / 9.0, rel=1e-3)
    root, _, record = quick_sketch(tmp_path, capsys, "--backfill-height", "1ft",
                                   "--water-level", "0.5ft")
    assert record["passes"] is True
    assert not any("DANGER" in w for w in words_of(root))
    assert "backfill 1 ft" in words_of(root)


# --- reading -----------------------------------------------------------------------------------
SKETCHES = {
    "worked": WORKED,
    "no braces, no footing": WORKED[:11] + ["--drained"],
    "tall wall, flat brace": ["backfill", "--height", "12ft", "--thickness", "10in", "--fc",
                              "3000psi", "--soil", "CL", "--backfill-height", "10ft",
                              "--surcharge", "400psf", "--footing-width", "3ft",
                              "--brace-height", "9ft", "--brace-angle", "30",
                              "--brace-spacing", "4ft", "--brace-capacity", "8000lb"],
    "masonry, low fill": ["backfill", "--height", "8ft", "--thickness", "7.625in",
                          "--material", "masonry", "--soil", "GW", "--backfill-height", "2ft",
                          "--drained", "--footing-width", "20in"],
}


@pytest.mark.parametrize("units", ["us", "si"])
@pytest.mark.parametrize("name", SKETCHES)
def test_texts_apart_and_inside_the_sheet(tmp_path, name, units):
    """No two texts of a sketch share any area and none runs past its edges, US or SI."""
    path = tmp_path / "s.svg"
    main([*SKETCHES[name], "--svg", str(path), "--units", units])
    root = ET.fromstring(path.read_bytes())
    width = float(root.get("viewBox").split()[2])
    assert root.get("width") == f"{width:g}mm"
    boxes = text_boxes(root)
    for i, (words, b) in enumerate(boxes):
        assert b[0] >= 0 and b[2] <= width, words
        for other, c in boxes[i + 1:]:
            assert not boxes_overlap(b, c), (words, other)


@pytest.mark.parametrize("name", SKETCHES)
def test_si_sketch_holds_no_us_unit_and_us_is_the_default(tmp_path, name):
    """--units si: no ft, in, lb, psf, pcf or plf in the sketch's words (1 psf = 47.88 Pa,
    1 ft = 0.3048 m, exact definitions); US by default. The caution is printed under it."""
    for units, us in (("si", False), (None, True)):
        path = tmp_path / "s.svg"
        main([*SKETCHES[name], "--svg", str(path), *(["--units", units] if units else [])])
        root = ET.fromstring(path.read_bytes())
        words = " ".join(words_of(root))
        assert (US_UNITS.search(words) is not None) is us, words
        assert CAUTION.split(":")[0] in words
    assert "kPa at the base" in backfill_section_svg(_plain(), units="si")


def _plain() -> BackfillSketch:
    """A sketch from plain numbers alone (no engine): 8 ft wall, 4 ft of fill at 60 psf/ft,
    240 psf at the base (60 x 4), V = 60 x 16 / 2 = 480 lb/ft at 4 / 3 = 1.33 ft."""
    return BackfillSketch(mark="W1", wall_height_ft=8.0, thickness_in=8.0, backfill_ft=4.0,
                          allowed_ft=4.6, profile=((4.0, 0.0, 0.0, 0.0), (0.0, 0.0, 240.0, 0.0)),
                          resultant_plf=480.0, resultant_height_ft=4.0 / 3.0, efp_pcf=60.0,
                          brace=InsideBraceSketch(height_ft=5.0, angle_deg=50.0, force_lb=900.0,
                                                  spacing_ft=8.0, allowed_ft=8.0))


def test_a_sketch_from_plain_numbers(tmp_path):
    """The dataclass alone drives it (for the site's days as for the quick check): the caution
    in its desc, the braced allowance at the full height said in words."""
    document = backfill_section_svg(_plain())
    root = ET.fromstring(document.encode())
    assert root.find(f"{NS}desc").text == CAUTION
    assert "240 psf at the base" in words_of(root)
    assert "with the inside braces the full height" in words_of(root)
