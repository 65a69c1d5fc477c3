"""The editable inputs of a wall and of the site: where each lives in the file and its kind.

A field's value is shown as the file holds it ("32 ft", 0.8); what the user types goes back to
the file as a number when it is one, else as text with its unit, and the engine's validation
decides whether it is acceptable.
"""

from __future__ import annotations

from dataclasses import dataclass, replace

from bracing.model import DEFAULT_RULES, SiteInfo
from bracing.scenario import REMOVE, SiteFile, SiteFileError, validate_data
from bracing.units import convert


@dataclass(frozen=True)
class FieldSpec:
    """One input of a form."""

    field_id: str          # unique in its form, usable as a widget id
    label: str
    keys: tuple            # path in the site file
    kind: str              # "quantity", "int", "number", "choice" or "fixed"
    value: str             # as the file holds it ("" when absent)
    hint: str = ""         # the bare-number unit, shown as a placeholder
    choices: tuple = ()


def raw_text(node, key: str) -> str:
    """A value of a TOML table as text, "" when absent."""
    if node is None or key not in node:
        return ""
    value = node[key]
    value = value.unwrap() if hasattr(value, "unwrap") else value
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, float):
        return f"{value:g}"
    if isinstance(value, list):
        return ", ".join(f"{v:g}" if isinstance(v, float) else str(v) for v in value)
    return str(value)


def typed(text: str, kind: str):
    """What goes into the file for the text typed into a field of `kind`."""
    s = text.strip()
    if kind == "list":  # positions: "4 ft, 12 ft" or "4, 12"
        return [typed(part, "quantity") for part in s.split(",") if part.strip()]
    if kind in ("quantity", "number", "int"):
        try:
            number = float(s)
        except ValueError:
            return s  # text with a unit, or something validation will refuse with a message
        if kind == "int" or (number.is_integer() and "." not in s and "e" not in s.lower()):
            return int(number) if number.is_integer() else number
        return number
    return s


def panel_index(site_file: SiteFile, mark: str) -> int | None:
    return next((i for i, p in enumerate(site_file.site.panels) if p.mark == mark), None)


def wall_fields(site_file: SiteFile, mark: str) -> list[FieldSpec]:
    """The inputs of one wall, in the order a form shows them."""
    i = panel_index(site_file, mark)
    if i is None:
        return []
    site = site_file.site
    panel = site.panels[i]
    node = site_file.data["panels"][i]
    base = ("panels", i)

    def spec(key, label, kind, hint="", choices=(), table=None, prefix=()):
        keys = base + prefix + (key,)
        source = node if table is None else table
        return FieldSpec("-".join(str(k) for k in prefix + (key,)).replace("_", "-"), label,
                         keys, kind, raw_text(source, key), hint, tuple(choices))

    kind = site.materials[panel.material].kind
    specs = [
        FieldSpec("mark", "Mark", base + ("mark",), "fixed", panel.mark),
        spec("material", "Material", "choice", choices=sorted(site.materials)),
        spec("height", "Height", "quantity", "ft"),
        spec("width", "Width", "quantity", "ft"),
        spec("thickness", "Thickness", "quantity", "in"),
        spec("base_elevation", "Base above grade", "quantity", "ft"),
        spec("standing_time", "Standing time", "quantity", "weeks"),
    ]
    if kind == "masonry":
        specs.append(spec("mortar_age", "Mortar age", "quantity", "days"))
    specs.append(spec("lift_day", "Lift day", "int", "day"))
    if panel.footing is not None:
        table = node["footing"]
        specs += [spec("width", "Footing width", "quantity", "ft", table=table,
                       prefix=("footing",)),
                  spec("thickness", "Footing depth", "quantity", "ft", table=table,
                       prefix=("footing",))]
    if panel.bracing is not None:
        table, pre = node["bracing"], ("bracing",)
        b = panel.bracing
        specs += [
            spec("count", "Braces", "int", "count", table=table, prefix=pre),
            spec("brace_type", "Brace type", "choice", choices=sorted(site.brace_types),
                 table=table, prefix=pre),
            spec("positions", "Positions", "list", "ft from left, equal strips",
                 table=table, prefix=pre),
            spec("insert_height", "Insert height", "quantity", "ft", table=table, prefix=pre),
            spec("angle", "Brace angle (a)", "quantity", "deg", table=table, prefix=pre)
            if b.angle is not None else
            spec("anchor_distance", "Foot dist. (a)", "quantity", "ft", table=table,
                 prefix=pre),
            spec("lean", "Lean", "quantity", "in", table=table, prefix=pre),
            spec("slop", "Slop", "quantity", "in", table=table, prefix=pre),
        ]
        anchors = sorted(site.anchor_types)
        specs += [spec("wall_anchor", "Wall anchor", "choice", "none", choices=anchors,
                       table=table, prefix=pre),
                  spec("foot_anchor", "Foot anchor", "choice", "none", choices=anchors,
                       table=table, prefix=pre)]
    return specs


def with_values(site_file: SiteFile, changes: list[tuple[tuple, object]]) -> SiteFile:
    """`SiteFile.with_value` for changes that are valid only together (an angle taken out and
    a foot distance put in): applied in turn, validated once by the engine's validation;
    raises SiteFileError and changes nothing."""
    data = dict(site_file.data)
    for keys, value in changes:
        node = data
        try:
            for key in keys[:-1]:
                child = node[key]
                node[key] = child = list(child) if isinstance(child, list) else dict(child)
                node = child
        except (KeyError, IndexError, TypeError):
            raise SiteFileError(str(site_file.path), [f"{site_file.path}: no "
                                f"{'.'.join(map(str, keys[:-1]))} in the file"]) from None
        if value is REMOVE:
            node.pop(keys[-1], None)
        else:
            node[keys[-1]] = value
    site = validate_data(data, str(site_file.path), site_file.text)
    return replace(site_file, site=site, data=data, edits=site_file.edits + tuple(changes))


SITE_FIELDS = (
    ("basic_wind_speed", "Basic wind speed", "quantity", "mph", ()),
    ("exposure", "Exposure", "choice", "", ("B", "C", "D")),
    ("topographic_factor", "Kzt", "number", "", ()),
    ("ground_elevation", "Ground elevation", "quantity", "ft", ()),
    ("design_basis", "Design basis", "choice", "", ("ASD", "LRFD")),
    ("risk_category", "Risk category", "choice", "", ("I", "II", "III", "IV")),
    ("construction_period", "Standing period", "quantity", "weeks", ()),
    ("period_factor", "Period factor", "number", "from standing time", ()),
    ("limit_speed", "Limit gust", "quantity", "mph", ()),
)


def site_fields(site_file: SiteFile) -> list[FieldSpec]:
    """The site's wind basis, and the value of every rule the file itself sets."""
    node = site_file.data["site"]
    specs = []
    for key, label, kind, hint, choices in SITE_FIELDS:
        default = SiteInfo.model_fields[key].default
        if default is not None and not hint:
            hint = f"{default:g} by default" if isinstance(default, float) else \
                f"{default} by default"
        specs.append(FieldSpec(f"site-{key}".replace("_", "-"), label, ("site", key), kind,
                               raw_text(node, key), hint, choices))
    rules = site_file.data.get("rules", {})
    for name in DEFAULT_RULES:
        if name in rules and "value" in rules[name]:
            specs.append(FieldSpec(f"rule-{name}".replace("_", "-"),
                                   name.replace("_", " ").capitalize(),
                                   ("rules", name, "value"), "number",
                                   raw_text(rules[name], "value")))
    return specs


# A brace moved on the elevation goes by this step, in the units on screen.
MOVE_STEP = {"us": 0.5, "si": 0.15}  # ft, m


def move_step_ft(units: str) -> float:
    """The step of a brace moved on the elevation, in ft (the engine's unit)."""
    return MOVE_STEP[units] / convert(1.0, "ft", units)[0]


def length_text(x_ft: float, units: str) -> str:
    """A length for the site file in the units on screen ("6.5 ft", "1.98 m")."""
    shown, label = convert(x_ft, "ft", units)
    return f"{round(shown, 2):g} {label}"


def moved_brace(site_file: SiteFile, i: int, positions_ft: list[float], k: int,
                step_ft: float, units: str) -> SiteFile:
    """Wall `i` with its brace `k` moved by `step_ft` along the wall: that position written in
    the units on screen, the others as the file gives them (the engine's `positions_ft`,
    the centers of equal strips, when it gives none). A brace does not pass its neighbor;
    the engine's validation refuses a position off the wall (SiteFileError)."""
    keys = ("panels", i, "bracing", "positions")
    x = positions_ft[k] + step_ft
    if (k > 0 and x <= positions_ft[k - 1]) or \
            (k + 1 < len(positions_ft) and x >= positions_ft[k + 1]):
        raise SiteFileError(str(site_file.path), ["a brace does not pass its neighbor"])
    listed = list(site_file.data["panels"][i]["bracing"].get("positions") or
                  [length_text(p, units) for p in positions_ft])
    listed[k] = length_text(x, units)
    return site_file.with_value(keys, listed)
