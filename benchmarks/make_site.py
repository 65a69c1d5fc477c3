"""Write a synthetic site file of N walls for the benchmarks (design.md §9).

    python benchmarks/make_site.py --panels 10000 -o /tmp/site-10000.toml

The site is invented and valid: wall lines in a grid, each line one material (tilt-up
concrete, grouted masonry segments, framed walls) with its walls edge to edge, most braced
(rated braces on cast-in slab anchors, masonry braces on helical anchors, lumber braces on
stakes) and some standing on their own; lift days, release events, some sign-offs, a plan with
a slab, open ground and named areas, and a forecast file written beside the site file.

The job always runs over the same days whatever its size (lifts on days 1 to 10, release events
on days 20 to 28, a 35-day forecast), so that a larger site differs in its walls only.
The file is written as plain text (quantities with their units, like a user's file); the same
seed gives the same file.
"""

from __future__ import annotations

import argparse
import random
from datetime import date, timedelta
from pathlib import Path

PER_LINE = 20             # walls on each line
COLUMN_SPACING_FT = 560.0  # lines in a grid, a line of 20 walls is at most 510 ft long;
ROW_SPACING_FT = 120.0     # far enough apart that braces and zones do not meet
LIFT_DAYS = 10
FORECAST_DAYS = 35
START = date(2027, 1, 4)
JOINT_FT = 0.04           # 1/2 in between walls on a line

HEAD = """\
# Synthetic benchmark site ({n} walls on {lines} lines), written by benchmarks/make_site.py.
# Invented from end to end; valid against the site file schema.
version = 1

[site]
name = "Synthetic benchmark site, {n} walls"
start_date = {start}
basic_wind_speed = "115 mph"
exposure = "C"
ground_elevation = "600 ft"
construction_period = "5 weeks"

[materials.tilt]
kind = "concrete"
unit_weight = "150 pcf"
compressive_strength = "3500 psi"

[materials.cmu]
kind = "masonry"
face_weight = "80 psf"
grouting = "solid"

[materials.stud]
kind = "framed"
face_weight = "7 psf"

[brace_types.adj-45]
kind = "rated"
lengths = ["24 ft", "28 ft", "32 ft", "36 ft", "40 ft", "45 ft"]
loads = ["10800 lb", "9900 lb", "8900 lb", "7800 lb", "6600 lb", "5200 lb"]
tension_capacity = "9000 lb"
end_connection = "10000 lb"

[brace_types.masonry-wall-brace]
kind = "rated"
lengths = ["12 ft", "16 ft", "20 ft", "24 ft", "28 ft"]
loads = ["5200 lb", "4500 lb", "3700 lb", "2900 lb", "2200 lb"]
tension_capacity = "3600 lb"

[brace_types.lumber-2x4]
kind = "lumber"
size = "2x4"
species = "DF-L"
grade = "No.2"
lateral_struts = 1
tension_capacity = "900 lb"

[anchor_types.coil-insert]
kind = "insert"
rated_tension = "10000 lb"
rated_shear = "11000 lb"

[anchor_types.wall-plate]
kind = "insert"
rated_tension = "4000 lb"
rated_shear = "4500 lb"

[anchor_types.slab-loop]
kind = "slab"
cast_in = true
embedment = "5 in"
diameter = "1 in"
steel_area = "0.606 in^2"
pullout = "20000 lb"
slab_thickness = "7 in"
concrete_strength = "4000 psi"
edge_distance = "24 in"

[anchor_types.helix]
kind = "helical"
installation_torque = "2000 ft*lbf"

[anchor_types.stake]
kind = "stake"
rated_tension = "700 lb"
rated_shear = "1100 lb"

[plan]
slab = [[-60.0, -60.0], [{x1}, -60.0], [{x1}, {y1}], [-60.0, {y1}]]
ground = [[[-60.0, -60.0], [{x1}, -60.0], [{x1}, {y1}], [-60.0, {y1}]]]

[[plan.areas]]
name = "Crane path"
kind = "crane_path"
polygon = [[-55.0, -55.0], [{x1}, -55.0], [{x1}, -50.0], [-55.0, -50.0]]

[[plan.areas]]
name = "Public way"
kind = "public_way"
polygon = [[-60.0, {y0}], [{x1}, {y0}], [{x1}, {y1}], [-60.0, {y1}]]

[[events]]
name = "Connections"
day = 18
kind = "connections"
"""

# material: (brace type, wall anchor, foot anchor, insert share of height, angle, braces)
KINDS = {
    "tilt": ("adj-45", "coil-insert", "slab-loop", 0.75, 50.0, 4),
    "cmu": ("masonry-wall-brace", "wall-plate", "helix", 0.75, 50.0, 4),
    "stud": ("lumber-2x4", None, "stake", 0.83, 45.0, 5),
}


def wall_size(material: str, rng: random.Random) -> tuple[float, float, float]:
    """(width ft, height ft, thickness in) of one wall of the material."""
    if material == "tilt":
        return rng.choice((20.0, 22.0, 24.0, 25.0)), rng.choice((28.0, 32.0, 36.0)), 9.25
    if material == "cmu":
        return rng.choice((16.0, 20.0, 22.0)), rng.choice((6.0, 12.0, 16.0, 20.0)), 7.625
    return rng.choice((16.0, 20.0, 22.0)), rng.choice((8.0, 9.0, 10.0)), 6.0


def site_text(panels: int, seed: int = 1) -> tuple[str, str]:
    """(site file text, forecast CSV text) of a synthetic site with `panels` walls."""
    rng = random.Random(seed)
    n_lines = -(-panels // PER_LINE)
    columns = max(1, round(n_lines ** 0.5))
    rows = -(-n_lines // columns)
    x1 = columns * COLUMN_SPACING_FT + 60.0
    y1 = rows * ROW_SPACING_FT + 60.0
    parts = [HEAD.format(n=panels, lines=n_lines, start=START.isoformat(), x1=x1, y1=y1,
                         y0=y1 - 5.0)]
    for k in range(5):
        parts.append(f'[[events]]\nname = "Roof zone {k + 1}"\nday = {20 + 2 * k}\n'
                     'kind = "diaphragm"\n')
    parts.append('[forecast]\nfile = "{}"\n')
    walls, signoffs = [], []
    count = 0
    for line in range(n_lines):
        material = ("tilt", "tilt", "cmu", "stud")[line % 4]
        x0 = (line % columns) * COLUMN_SPACING_FT
        y0 = (line // columns) * ROW_SPACING_FT
        side = "left" if line % 2 else "right"
        day = 1 + line % LIFT_DAYS
        zone = line % 5 + 1
        sizes = [wall_size(material, rng) for _ in range(min(PER_LINE, panels - count))]
        length = sum(w for w, _, _ in sizes) + JOINT_FT * (len(sizes) - 1)
        name = f"L{line + 1}"
        parts.append(f'[[lines]]\nname = "{name}"\nstart = [{x0}, {y0}]\n'
                     f'end = [{x0 + length:.2f}, {y0}]\nbraced_side = "{side}"\n')
        offset = 0.0
        for width, height, thickness in sizes:
            count += 1
            mark = f"P{count:05d}"
            walls.append(_wall(mark, material, name, offset, width, height, thickness, day,
                               zone, rng))
            if rng.random() < 0.3:
                signoffs.append(f'[[signoffs]]\npanel = "{mark}"\nday = {21 + 2 * zone}\n'
                                'by = "engineer of record (synthetic)"\n')
            offset += width + JOINT_FT
    forecast = ["date,gust_mph,storm"] + [
        f"{(START + timedelta(days=d)).isoformat()},{rng.randint(12, 45)},"
        f"{'yes' if rng.random() < 0.08 else 'no'}" for d in range(FORECAST_DAYS)]
    return "\n".join(parts + signoffs + walls), "\n".join(forecast) + "\n"


def _wall(mark, material, line, offset, width, height, thickness, day, zone, rng) -> str:
    """One [[panels]] entry; most walls are braced, some stand on their own."""
    text = (f'[[panels]]\nmark = "{mark}"\nmaterial = "{material}"\nline = "{line}"\n'
            f'offset = "{offset:.2f} ft"\nwidth = "{width:g} ft"\nheight = "{height:g} ft"\n'
            f'thickness = "{thickness:g} in"\nlift_day = {day}\n'
            f'release_after = ["Connections", "Roof zone {zone}"]\n')
    if material == "cmu":
        text += f'mortar_age = "{rng.choice((3, 10, 30, 45))} days"\n'
    if material == "tilt" and rng.random() < 0.15:
        text += ('[[panels.openings]]\nx = "4 ft"\ny = 0\nwidth = "10 ft"\n'
                 'height = "12 ft"\n')
    unbraced = (material == "cmu" and height <= 8.0) or rng.random() < 0.1
    if unbraced:
        return text
    brace, wall_anchor, foot, share, angle, braces = KINDS[material]
    text += (f'[panels.bracing]\nbrace_type = "{brace}"\nfoot_anchor = "{foot}"\n'
             f'count = {braces}\ninsert_height = "{share * height:.2f} ft"\n'
             f'angle = "{angle:g} deg"\n')
    if wall_anchor:
        text += f'wall_anchor = "{wall_anchor}"\n'
    return text


def write_site(panels: int, output: str | Path, seed: int = 1) -> Path:
    """Write the site file and its forecast (`<stem>-forecast.csv` beside it)."""
    output = Path(output)
    output.parent.mkdir(parents=True, exist_ok=True)
    forecast = output.with_name(f"{output.stem}-forecast.csv")
    site, csv = site_text(panels, seed)
    output.write_text(site.replace('file = "{}"', f'file = "{forecast.name}"', 1),
                      encoding="utf-8")
    forecast.write_text(csv, encoding="utf-8")
    return output


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description="Write a synthetic site file of N walls.")
    parser.add_argument("--panels", type=int, required=True, help="number of walls (>= 1)")
    parser.add_argument("-o", "--output", required=True, help="site file to write (TOML)")
    parser.add_argument("--seed", type=int, default=1, help="random seed (default 1)")
    args = parser.parse_args(argv)
    if args.panels < 1:
        parser.error("--panels must be at least 1")
    path = write_site(args.panels, args.output, args.seed)
    print(f"wrote {path} ({args.panels} walls)")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
