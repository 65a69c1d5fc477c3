"""`bracing backfill`: the quick check of one foundation wall backfilled before the floor
(method notes §12). Flags are read here, with their units, and refused naming the flag; the
formulas are in bracing.backfill; this module only reads, calls and formats.
"""

from __future__ import annotations

import json
import math

import numpy as np

from bracing import anchors, backfill, stability, units
from bracing.model import DEFAULT_RULES
from bracing.results import CAUTION, Flag

BARS = backfill.BARS
DEFAULT_FACE_WEIGHT = {"masonry": "36 psf"}  # 8 in hollow CMU, HUD RSDG Table 3.2 (lightest)


class FlagError(ValueError):
    """A flag whose value cannot be used; the message names the flag."""


def add_command(commands) -> None:
    """The `backfill` subparser, a sibling of `panel`."""
    p = commands.add_parser("backfill", help="quick check of one foundation wall backfilled "
                                             "before the floor gives it top support")
    add = p.add_argument
    add("--height", required=True, help="wall height above the footing, e.g. 8ft (ft)")
    add("--thickness", required=True, help="e.g. 8in (bare number: in)")
    add("--material", choices=["plain", "reinforced", "masonry"], default="plain",
        help="plain concrete, reinforced concrete, or masonry (reinforced when --bar is given)")
    add("--fc", help="concrete f'c on the day, e.g. 2500psi (psi); concrete walls need it")
    add("--fm", default="2000", help="masonry f'm (psi, default 2000)")
    add("--bar", choices=list(BARS), help="vertical bar size (reinforced walls)")
    add("--bar-spacing", help="vertical bar spacing, e.g. 16in (in)")
    add("--cover", help="cover from the backfill face to the bar (in); masonry: bars centred "
                        "when not given")
    add("--fy", default="60000", help="bar yield strength (psi, default 60000)")
    add("--grouting", choices=["hollow", "grouted", "solid"], default="hollow",
        help="unreinforced masonry units (default hollow)")
    add("--mortar", choices=["M/S", "N"], default="N", help="masonry mortar type (default N)")
    add("--mortar-age", help="masonry mortar age, e.g. 30days (days)")
    add("--face-weight", help="wall weight per face area (psf; concrete: 150 pcf x thickness)")
    soil = p.add_mutually_exclusive_group(required=True)
    soil.add_argument("--soil", help="backfill soil class (IBC Table 1610.1), e.g. SM")
    soil.add_argument("--pressure", help="equivalent fluid pressure from the geotechnical "
                                         "report, e.g. 55pcf (psf per ft)")
    add("--pressure-state", choices=["at-rest", "active"], default="at-rest",
        help="at-rest (default) or active, a site rule for a wall free to rotate")
    add("--soil-unit-weight", default="120", help="backfill unit weight (pcf, default 120)")
    add("--backfill-height", required=True, help="unbalanced backfill above the footing (ft)")
    add("--surcharge", default="0", help="uniform surcharge on the backfill (psf)")
    water = p.add_mutually_exclusive_group()
    water.add_argument("--water-level", help="water in the backfill, height above the footing "
                                             "(ft)")
    water.add_argument("--drained", action="store_true", help="the drains are working")
    add("--footing-width", help="footing width (ft); with it, overturning and sliding")
    add("--footing-thickness", default="1", help="footing depth (ft, default 1)")
    add("--footing-toe", help="footing projection on the inside (ft; default: wall centred)")
    add("--footing-soil", choices=list(anchors.FRICTION_IBC_1806_2), default="silty_sand",
        help="soil under the footing, IBC Table 1806.2 friction (default silty_sand)")
    add("--brace-height", help="inside braces or shores: height on the wall (ft)")
    add("--brace-spacing", help="brace spacing along the wall (ft)")
    add("--brace-angle", default="45", help="brace angle from horizontal (deg, default 45)")
    add("--brace-capacity", help="allowable brace load (lb)")
    add("--anchor-tension", help="rated allowable tension of a brace foot anchor (lb)")
    add("--anchor-shear", help="rated allowable shear of a brace foot anchor (lb)")
    add("--basis", choices=["ASD", "LRFD"], default="ASD")
    add("--json", action="store_true", help="print one JSON object")
    add("--svg", metavar="FILE", help="also write the wall's section sketch (SVG): the "
                                      "pressure diagram, the backfill line, the allowed height "
                                      "and any inside brace")
    add("--units", choices=["us", "si"], default="us",
        help="units of the section sketch's words (default us; text and JSON stay US)")
    return p


def _read(args, flag: str, kind: str, low: float = 0.0, high: float = math.inf,
          above: bool = True):
    """The flag's value in the engine unit of `kind`, in (low, high] (or [low, high] when not
    `above`); None when not given."""
    text = getattr(args, flag)
    if text is None:
        return None
    name = "--" + flag.replace("_", "-")
    try:
        value = units.parse(text, kind)
    except units.UnitError as exc:
        raise FlagError(f"{name}: {exc}") from None
    if (value <= low if above else value < low) or value > high:
        side = "more than" if above else "at least"
        raise FlagError(f"{name}: must be {side} {low:g} and at most {high:g} (got {text!r})")
    return value


def _needed(args, flag: str, kind: str, why: str, **limits):
    value = _read(args, flag, kind, **limits)
    if value is None:
        raise FlagError(f"--{flag.replace('_', '-')}: needed {why}")
    return value


def soil_from_flags(args, height: float) -> backfill.Soil:
    """The backfill from --soil or --pressure, its state, surcharge and water."""
    state = args.pressure_state.replace("-", "_")
    if args.soil is not None:
        try:
            efp = backfill.equivalent_fluid_pressure(args.soil, state)
        except ValueError as exc:
            raise FlagError(f"--soil: {exc}") from None
        source = f"{backfill.EFP_SOURCE}, {args.soil.strip().upper()} {args.pressure_state}"
    else:
        efp = _read(args, "pressure", "unit_weight", high=500.0)
        source = "the geotechnical report (given)"
    return backfill.Soil(
        efp=efp, source=source,
        unit_weight=_read(args, "soil_unit_weight", "unit_weight", low=30.0, high=200.0),
        surcharge=_read(args, "surcharge", "pressure", above=False, high=5000.0),
        water=_read(args, "water_level", "length", above=False, high=height) or 0.0)


def _masonry(args) -> dict:
    """Masonry fields: reinforced and grouted with --bar, else unreinforced by its units."""
    fm = _read(args, "fm", "stress", low=500.0, high=6000.0)
    age = _read(args, "mortar_age", "age", above=False, high=36500.0)
    cure = DEFAULT_RULES["masonry_cure_days"].value
    cured = age is None or age >= cure
    if args.bar is not None:
        return {"material": "reinforced_masonry", "fm": fm, "grouting": "grouted",
                "cured": cured}
    return {"material": "masonry", "fm": fm, "grouting": args.grouting,
            "tension": stability.FLEXURAL_TENSION_PSI[(args.grouting, args.mortar)],
            "cured": cured}


def _steel(args, thickness: float, masonry: bool) -> dict:
    """Bars per ft and their depth d from the backfill face (the cantilever's tension face)."""
    if args.bar is None:
        return {}
    area, diameter = BARS[args.bar]
    spacing = _needed(args, "bar_spacing", "thickness", "with --bar", high=120.0)
    cover = _read(args, "cover", "thickness", above=False, high=thickness)
    if cover is None and not masonry:
        raise FlagError("--cover: needed with --bar for a concrete wall")
    depth = thickness / 2.0 if cover is None else thickness - cover - diameter / 2.0
    if depth <= 0.0:
        raise FlagError(f"--cover: leaves no depth to the bar in a {thickness:g} in wall")
    return {"steel": backfill.steel_per_foot(area, spacing), "depth": depth,
            "fy": _read(args, "fy", "stress", low=20000.0, high=100000.0)}


def wall_from_flags(args) -> backfill.Wall:
    """The wall, its section and its footing from the flags."""
    height = _read(args, "height", "length", high=40.0)
    t = _read(args, "thickness", "thickness", high=48.0)
    masonry = args.material == "masonry"
    if args.material == "reinforced" and args.bar is None:
        raise FlagError("--bar: needed for a reinforced concrete wall")
    if args.material == "plain" and args.bar is not None:
        raise FlagError("--bar: a plain concrete wall has no bars (use --material reinforced)")
    fields: dict = _masonry(args) if masonry else {
        "material": args.material,
        "fc": _needed(args, "fc", "stress", "for a concrete wall (f'c on the day)", low=500.0,
                      high=20000.0)}
    fields.update(_steel(args, t, masonry))
    face = _read(args, "face_weight", "pressure", high=500.0)
    if face is None:
        face = (units.parse(DEFAULT_FACE_WEIGHT["masonry"], "pressure") if masonry
                else backfill.CONCRETE_PCF * t / 12.0)
    return backfill.Wall(height=height, thickness=t, face_weight=face,
                         **fields, **_footing(args, t))


def _footing(args, thickness: float) -> dict:
    width = _read(args, "footing_width", "length", low=thickness / 12.0, high=40.0)
    if width is None:
        return {}
    toe = _read(args, "footing_toe", "length", above=False, high=width - thickness / 12.0)
    return {"footing_width": width, "toe": toe,
            "footing_thickness": _read(args, "footing_thickness", "length", high=10.0),
            "friction": anchors.FRICTION_IBC_1806_2[args.footing_soil]}


def brace_from_flags(args, wall_height: float) -> backfill.InsideBrace | None:
    """The inside braces, or None without --brace-height."""
    height = _read(args, "brace_height", "length", high=wall_height)
    if height is None:
        others = ("brace_spacing", "brace_capacity", "anchor_tension", "anchor_shear")
        given = [f for f in others if getattr(args, f) is not None]
        if given:
            raise FlagError(f"--{given[0].replace('_', '-')}: needs --brace-height")
        return None
    tension = _read(args, "anchor_tension", "force")
    shear = _read(args, "anchor_shear", "force")
    if (tension is None) != (shear is None):
        raise FlagError("--anchor-tension, --anchor-shear: give both ratings or neither")
    return backfill.InsideBrace(
        height=height,
        spacing=_needed(args, "brace_spacing", "length", "with --brace-height", high=100.0),
        angle=_read(args, "brace_angle", "angle", high=89.0),
        capacity=_needed(args, "brace_capacity", "force", "with --brace-height (the brace's "
                         "allowable load)"),
        anchor_tension=tension, anchor_shear=shear)


def evaluate(args) -> dict:
    """Read the flags, work every check, and return the record (`bracing backfill --json`)."""
    wall = wall_from_flags(args)
    height = _needed(args, "backfill_height", "length", "", above=False, high=math.inf)
    if height > wall.height:
        raise FlagError(f"--backfill-height: {height:g} ft is above the {wall.height:g} ft wall")
    soil = soil_from_flags(args, height)
    brace = brace_from_flags(args, wall.height)
    shear, moment = soil.at(height)
    cantilever = backfill.cantilever_checks(wall, soil, height, args.basis)
    braced = backfill.braced_checks(wall, soil, height, brace) if brace else []
    reaction = float(backfill.brace_reaction(moment, brace.height)) if brace else None
    verdict_checks = braced or cantilever
    flags = _flags(args, wall)
    fails = backfill.governing(verdict_checks) > 1.0 or any(
        f.severity == "danger" for f in flags)
    return {
        "caution": CAUTION, "basis": args.basis,
        "wall": {"height_ft": wall.height, "thickness_in": wall.thickness,
                 "material": wall.material, "face_weight_psf": wall.face_weight},
        "backfill": {"height_ft": height, "equivalent_fluid_pressure_pcf": soil.efp,
                     "pressure_state": args.pressure_state, "pressure_source": soil.source,
                     "coefficient": float(backfill.pressure_coefficient(soil.efp,
                                                                        soil.unit_weight)),
                     "soil_unit_weight_pcf": soil.unit_weight, "surcharge_psf": soil.surcharge,
                     "water_level_ft": soil.water},
        "base_shear_plf": float(shear), "base_moment_lb_ft_per_ft": float(moment),
        "max_backfill_height_ft": float(backfill.max_height(wall, soil, args.basis)),
        "cantilever_utilization": backfill.governing(cantilever),
        "cantilever_checks": [c.as_dict() for c in cantilever],
        "inside_brace": None if brace is None else {
            "height_ft": brace.height, "spacing_ft": brace.spacing, "angle_deg": brace.angle,
            "reaction_plf": reaction,
            # as checked: the braces' larger reaction, base pinned or fixed (method notes §12)
            "force_lb": next(float(c.demand) for c in braced if c.element == "inside brace"),
            "utilization": backfill.governing(braced),
            "max_backfill_height_ft": backfill.braced_max_height(wall, soil, brace),
            "checks": [c.as_dict() for c in braced]},
        "utilization": backfill.governing(verdict_checks),
        "passes": not fails,
        "flags": [f.as_dict() for f in flags],
    }


def _flags(args, wall: backfill.Wall) -> list[Flag]:
    """What the user must see beside the checks."""
    flags = []
    if args.water_level is None and not args.drained:
        flags.append(Flag("backfill-drainage-not-stated", "warning",
                          "no water level and no working drains stated: checked dry; give "
                          "--water-level or --drained", "method notes §12"))
    masonry = wall.material in ("masonry", "reinforced_masonry")
    if masonry and not wall.cured:
        flags.append(Flag("backfill-fresh-masonry", "danger",
                          "mortar not yet cured: the wall takes no backfill", "method notes §12"))
    if masonry and args.mortar_age is None:
        flags.append(Flag("backfill-mortar-age-not-given", "warning",
                          "mortar age not given: taken as cured", "method notes §12"))
    if wall.footing_width is None:
        flags.append(Flag("backfill-footing-not-given", "warning",
                          "no footing given: overturning and sliding not checked",
                          "method notes §12"))
    return flags


def dumps(record: dict) -> str:
    """The record as one JSON object (infinite utilizations as null)."""
    def plain(value):
        if isinstance(value, np.generic):
            value = value.item()
        if isinstance(value, float) and not math.isfinite(value):
            return None
        if isinstance(value, dict):
            return {k: plain(v) for k, v in value.items()}
        if isinstance(value, list):
            return [plain(v) for v in value]
        return value
    return json.dumps(plain(record), indent=2, ensure_ascii=False)


def text(record: dict) -> str:
    """The record for a reader: verdict, heights, then every check, caution first and last."""
    w, b = record["wall"], record["backfill"]
    lines = [CAUTION, "",
             f"wall {w['height_ft']:g} ft tall x {w['thickness_in']:g} in, "
             f"{w['material'].replace('_', ' ')}; backfill {b['height_ft']:g} ft at "
             f"{b['equivalent_fluid_pressure_pcf']:g} psf/ft ({b['pressure_source']})",
             f"  {'PASSES' if record['passes'] else 'FAILS'}: utilization "
             f"{_num(record['utilization'])} ({record['basis']})",
             f"  maximum backfill before the floor (no inside braces): "
             f"{record['max_backfill_height_ft']:.2f} ft",
             f"  at the base, unfactored: V {record['base_shear_plf']:,.0f} lb/ft, "
             f"M {record['base_moment_lb_ft_per_ft']:,.0f} lb·ft/ft"]
    brace = record["inside_brace"]
    if brace:
        lines.append(f"  inside braces at {brace['height_ft']:g} ft, every "
                     f"{brace['spacing_ft']:g} ft, {brace['angle_deg']:g} deg: reaction "
                     f"{brace['reaction_plf']:,.0f} lb/ft, brace force "
                     f"{brace['force_lb']:,.0f} lb; with them, backfill up to "
                     f"{brace['max_backfill_height_ft']:.2f} ft")
    lines += [f"  {f['severity'].upper()}: {f['message']} [{f['source']}]"
              for f in record["flags"]]
    lines.append("  as a cantilever from its footing" + (
        " (not the verdict: inside braces are given)" if brace else "") + ":")
    lines += [_check_line(c) for c in record["cantilever_checks"]]
    if brace:
        lines.append("  with the inside braces, the wall pinned at its base (the verdict):")
        lines += [_check_line(c) for c in brace["checks"]]
    return "\n".join(lines + ["", CAUTION])


def _check_line(c: dict) -> str:
    digits = 2 if c["unit"] == "ratio" else 0
    return (f"    {'ok  ' if c['passes'] else 'FAIL'} {c['element']}, {c['region']}: "
            f"{c['demand']:,.{digits}f} / {c['capacity']:,.{digits}f} {c['unit']} = "
            f"{_num(c['utilization'])}  [{c['combination']}; {c['source']}]")


def _num(value) -> str:
    return "no capacity" if value is None or not math.isfinite(value) else f"{value:.2f}"


def sketch(args, record: dict):
    """What the section sketch (`--svg`) draws: the wall, its footing and the soil read again
    from the flags, the heights and the brace from the record (bracing.backfill_profile)."""
    from bracing import backfill_profile

    wall = wall_from_flags(args)
    height = record["backfill"]["height_ft"]
    soil = soil_from_flags(args, height)
    brace = record["inside_brace"]
    return backfill_profile.sketch(
        mark="wall", wall_height=wall.height, thickness=wall.thickness, backfill_height=height,
        allowed=record["max_backfill_height_ft"], efp=soil.efp, unit_weight=soil.unit_weight,
        surcharge=soil.surcharge, water=soil.water, footing_width=wall.footing_width,
        footing_thickness=wall.footing_thickness, toe=wall.toe,
        brace=None if brace is None else backfill_profile.InsideBraceSketch(
            height_ft=brace["height_ft"], angle_deg=brace["angle_deg"],
            force_lb=brace["force_lb"], spacing_ft=brace["spacing_ft"],
            allowed_ft=brace["max_backfill_height_ft"]),
        danger=not record["passes"], caption="the quick check")


def section_svg(args, record: dict) -> str:
    """The section sketch of the wall checked, standalone (the caution under it)."""
    from bracing.report.svg.backfill import backfill_section_svg

    return backfill_section_svg(sketch(args, record), standalone=True, units=args.units)
