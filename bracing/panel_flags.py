"""`bracing panel`'s flags as a one-wall site (design.md §8): the quick check builds the same site
model a site file gives, and names the flag behind any validation error."""

from __future__ import annotations

from bracing.cli_args import BadInput
from bracing.model import error_message

# `bracing panel` flag -> (path in the one-panel site, how the value is stored)
PANEL_FLAGS = {
    "height": ("panels.0.height",), "width": ("panels.0.width",),
    "thickness": ("panels.0.thickness",), "unit_weight": ("materials.wall.unit_weight",),
    "face_weight": ("materials.wall.face_weight",), "opening_area": ("panels.0.opening_area",),
    "wind": ("site.basic_wind_speed",), "exposure": ("site.exposure",),
    "duration": ("panels.0.standing_time",), "period_factor": ("site.period_factor",),
    "kzt": ("site.topographic_factor",), "ground_elevation": ("site.ground_elevation",),
    "footing_width": ("panels.0.footing.width",),
    "footing_thickness": ("panels.0.footing.thickness",),
    "limit_speed": ("site.limit_speed",), "basis": ("site.design_basis",),
    "mortar_age": ("panels.0.mortar_age",),
    "sill_fastening": ("materials.wall.sill_fastening",),
}
DEFAULT_WEIGHT = {"concrete": {"unit_weight": "150 pcf"},  # ASCE 7 Table C3.1-2 (from memory)
                  "masonry": {"face_weight": "36 psf"},    # 8 in hollow CMU, HUD RSDG Table 3.2
                  "framed": {"face_weight": "6 psf"}}      # 2x4 sheathed wall, HUD RSDG Table 3.2


def panel_site(args) -> dict:
    """The one-wall site that `bracing panel` checks, built from its flags."""
    material = {"kind": args.material}
    if not (args.unit_weight or args.face_weight):
        material.update(DEFAULT_WEIGHT[args.material])
    site: dict = {
        "version": 1,
        "site": {"name": "quick check", "basic_wind_speed": args.wind},
        "materials": {"wall": material},
        "panels": [{"mark": "wall", "material": "wall"}],
    }
    for flag, (path,) in PANEL_FLAGS.items():
        value = getattr(args, flag, None)
        if value is None:
            continue
        node = site
        *parents, leaf = path.split(".")
        for key in parents:
            node = node[int(key)] if key.isdigit() else node.setdefault(key, {})
        node[leaf] = _number_or_text(value)
    if args.braces is not None:
        capacity = _number_or_text(args.brace_capacity) if args.brace_capacity else None
        brace = ({"kind": "rated", "lengths": [0.1, 1000.0], "loads": [capacity] * 2,
                  "tension_capacity": capacity}  # the one allowable load, either way
                 if capacity is not None else {"kind": "unrated"})
        site["brace_types"] = {"brace": brace}
        bracing = {"brace_type": "brace", "count": args.braces}
        for flag, key in (("insert_height", "insert_height"), ("brace_angle", "angle"),
                          ("anchor_distance", "anchor_distance")):
            value = getattr(args, flag)
            if value is not None:
                bracing[key] = _number_or_text(value)
        site["panels"][0]["bracing"] = bracing
    elif any(getattr(args, f) for f in ("insert_height", "brace_angle", "anchor_distance",
                                        "brace_capacity")):
        raise BadInput("--insert-height, --brace-angle, --anchor-distance and --brace-capacity "
                       "need --braces N")
    if args.stand_down_ratio is not None:
        site["rules"] = {"stand_down_ratio": {
            "value": _number_or_text(args.stand_down_ratio),
            "source": "set on the command line", "basis": "stand-down / working-limit speed"}}
    return site


def _number_or_text(value: str):
    try:
        return float(value)
    except ValueError:
        return value


def flag_problem(err: dict) -> str:
    """Name the command-line flag behind a validation error."""
    loc = ".".join(str(p) for p in err["loc"])
    flag = next((f for f, (path,) in PANEL_FLAGS.items() if path == loc), None)
    if flag is None and loc.startswith("rules.stand_down_ratio"):
        flag = "stand_down_ratio"
    brace_flags = {"count": "braces", "insert_height": "insert_height", "angle": "brace_angle",
                   "anchor_distance": "anchor_distance"}
    if flag is None and loc.startswith("panels.0.bracing"):
        flag = brace_flags.get(loc.rsplit(".", 1)[-1], "braces")
    if flag is None and loc.startswith("brace_types"):
        flag = "brace_capacity"
    if flag is None and loc.startswith("panels.0") and "insert_height" in err["msg"]:
        flag = "insert_height"
    name = f"--{flag.replace('_', '-')}" if flag else loc or "input"
    message = error_message(err)
    got = err.get("input")
    shown = f" (got {got!r})" if isinstance(got, (str, int, float)) else ""
    return f"{name}: {message}{shown}"
