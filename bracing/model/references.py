"""Cross-references of raw site data (names used before they are given, names given twice),
checked before the fields so that every problem of a file is reported at once."""

from __future__ import annotations

import math

from bracing.model.base import SCHEMA_VERSION
from bracing.model.rules import DEFAULT_RULES, RULE_RANGES


def _names_of(data: dict, section: str, problems: list) -> set:
    """The `name`s of an array of tables such as [[lines]]; a repeated name is a problem."""
    items = data.get(section)
    seen: set = set()
    for i, item in enumerate(items if isinstance(items, list) else []):
        name = item.get("name") if isinstance(item, dict) else None
        if isinstance(name, str) and name in seen:
            problems.append(((section, i, "name"), "used twice", name))
        elif isinstance(name, str):
            seen.add(name)
    return seen


def _number(value) -> float | None:
    """A rule's raw value as the model reads it (a number, or text of one), else None."""
    if isinstance(value, bool) or not isinstance(value, (int, float, str)):
        return None
    try:
        number = float(value)
    except (ValueError, OverflowError):
        return None
    return number if math.isfinite(number) else None  # the field itself refuses nan and inf


def reference_problems(data) -> list[tuple[tuple, str, object]]:
    """(location, message, value) of every unknown rule, material, brace or anchor type, wall
    line, event or signed-off panel, repeated mark or name and too-new version in raw site data;
    other shapes are left to the fields."""
    if not isinstance(data, dict):
        return []

    def names(section: str) -> set:
        value = data.get(section)
        return set(value) if isinstance(value, dict) else set()

    problems: list[tuple[tuple, str, object]] = []
    rules = data.get("rules") if isinstance(data.get("rules"), dict) else {}
    for rule, (low, high) in RULE_RANGES.items():
        value = rules.get(rule, {}).get("value") if isinstance(rules.get(rule), dict) else None
        number = _number(value)
        if number is not None and not low < number <= high:  # nan is in no range
            problems.append((("rules", rule, "value"), f"must be above {low:g} and at most "
                             f"{high:g} (method notes §9)", value))
    for rule in names("rules") - set(DEFAULT_RULES):
        problems.append((("rules", rule), f"unknown rule; known: {', '.join(DEFAULT_RULES)}", rule))
    lines = _names_of(data, "lines", problems)
    events = _names_of(data, "events", problems)
    panels = data.get("panels")
    first_of: dict[str, int] = {}
    known = {section: names(section) for section in ("materials", "brace_types", "anchor_types")}
    for i, p in enumerate(panels if isinstance(panels, list) else []):
        if not isinstance(p, dict):
            continue
        material = p.get("material")
        if isinstance(data.get("materials"), dict) and isinstance(material, str) \
                and material not in known["materials"]:
            problems.append((("panels", i, "material"), f"{material!r} is not in [materials] "
                             f"({', '.join(sorted(known['materials'])) or 'none given'})",
                             material))
        bracing = p.get("bracing")
        if isinstance(bracing, dict):
            refs = [("brace_type", "brace_types"), ("wall_anchor", "anchor_types"),
                    ("foot_anchor", "anchor_types")]
            for key, section in refs:
                name = bracing.get(key)
                if isinstance(name, str) and name not in known[section]:
                    problems.append((("panels", i, "bracing", key),
                                     f"{name!r} is not in [{section}]", name))
        mark = p.get("mark")
        if isinstance(mark, str) and mark in first_of:
            problems.append((("panels", i, "mark"),
                             f"used twice (also panel #{first_of[mark] + 1})",
                             mark))
        elif isinstance(mark, str):
            first_of[mark] = i
        line = p.get("line")
        if isinstance(line, str) and line not in lines:
            problems.append((("panels", i, "line"), f"{line!r} is not a [[lines]] name", line))
        after = p.get("release_after")
        for j, event in enumerate(after if isinstance(after, list) else []):
            if isinstance(event, str) and event not in events:
                problems.append((("panels", i, "release_after", j),
                                 f"{event!r} is not an [[events]] name", event))
    signoffs = data.get("signoffs")
    for i, s in enumerate(signoffs if isinstance(signoffs, list) else []):
        mark = s.get("panel") if isinstance(s, dict) else None
        if isinstance(mark, str) and mark not in first_of:
            problems.append((("signoffs", i, "panel"), f"{mark!r} is not a panel mark", mark))
    version = data.get("version")
    if isinstance(version, int) and not isinstance(version, bool) and version > SCHEMA_VERSION:
        problems.append((("version",), f"version {version} is newer than this program "
                                       f"({SCHEMA_VERSION})", version))
    return problems
