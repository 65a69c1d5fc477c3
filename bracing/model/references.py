"""Cross-references of raw site data (names used before they are given, names given twice),
checked before the fields so that every problem of a file is reported at once."""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from bracing.model import foundation
from bracing.model.base import SCHEMA_VERSION
from bracing.model.rules import DEFAULT_RULES, RULE_RANGES

# (location, message, value): one problem, reported at its own key with the value found there.
Problem = tuple[tuple, str, object]


@dataclass
class Known:
    """What entries of raw site data may refer to: the keys of its tables, and the names and
    marks the checks before have read (the checks run in the order of CHECKS)."""

    data: dict
    lines: set = field(default_factory=set)            # [[lines]] names
    events: set = field(default_factory=set)           # [[events]] names
    marks: dict = field(default_factory=dict)          # panel mark -> index of its first panel
    tables: dict = field(default_factory=dict)         # table name -> its keys, once read

    def keys(self, section: str) -> set:
        """The keys of a table such as [materials]; none when it is not a table."""
        if section not in self.tables:
            value = self.data.get(section)
            self.tables[section] = set(value) if isinstance(value, dict) else set()
        return self.tables[section]


def _entries(data: dict, section: str) -> list:
    """The entries of an array of tables such as [[panels]]; none when it is not an array."""
    items = data.get(section)
    return items if isinstance(items, list) else []


def _names_of(data: dict, section: str, problems: list) -> set:
    """The `name`s of an array of tables such as [[lines]]; a repeated name is a problem."""
    seen: set = set()
    for i, item in enumerate(_entries(data, section)):
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


# --- checks of the whole site: (data, known) -> problems ----------------------------------------
def _rule_ranges(data: dict, known: Known) -> list[Problem]:
    """A rule's value outside its range (RULE_RANGES, method notes §9)."""
    rules = data.get("rules") if isinstance(data.get("rules"), dict) else {}
    problems = []
    for rule, (low, high) in RULE_RANGES.items():
        value = rules.get(rule, {}).get("value") if isinstance(rules.get(rule), dict) else None
        number = _number(value)
        if number is not None and not low < number <= high:  # nan is in no range
            problems.append((("rules", rule, "value"), f"must be above {low:g} and at most "
                             f"{high:g} (method notes §9)", value))
    return problems


def _unknown_rules(data: dict, known: Known) -> list[Problem]:
    """A rule that is not one of DEFAULT_RULES."""
    return [(("rules", rule), f"unknown rule; known: {', '.join(DEFAULT_RULES)}", rule)
            for rule in known.keys("rules") - set(DEFAULT_RULES)]


def _line_names(data: dict, known: Known) -> list[Problem]:
    """A wall line's name given twice; the names are kept for the panels' `line`."""
    problems: list[Problem] = []
    known.lines = _names_of(data, "lines", problems)
    return problems


def _event_names(data: dict, known: Known) -> list[Problem]:
    """An event's name given twice; the names are kept for the panels' `release_after`."""
    problems: list[Problem] = []
    known.events = _names_of(data, "events", problems)
    return problems


def _panels(data: dict, known: Known) -> list[Problem]:
    """Every check of PANEL_CHECKS on each panel, panel by panel."""
    problems = []
    for i, panel in enumerate(_entries(data, "panels")):
        if isinstance(panel, dict):
            for check in PANEL_CHECKS:
                problems += check(i, panel, known)
    return problems


def _signed_off_panels(data: dict, known: Known) -> list[Problem]:
    """A sign-off of a panel mark no panel has."""
    problems, marks = [], known.marks.keys() | foundation.marks(data)
    for i, s in enumerate(_entries(data, "signoffs")):
        mark = s.get("panel") if isinstance(s, dict) else None
        if isinstance(mark, str) and mark not in marks:
            problems.append((("signoffs", i, "panel"), f"{mark!r} is not a panel mark", mark))
    return problems


def _foundation_walls(data: dict, known: Known) -> list[Problem]:
    """The foundation walls' names, lines, events and days (bracing.model.foundation)."""
    return foundation.reference_problems(data, known.lines, known.events, set(known.marks))


def _version(data: dict, known: Known) -> list[Problem]:
    """A file format version newer than this program reads."""
    version = data.get("version")
    if isinstance(version, int) and not isinstance(version, bool) and version > SCHEMA_VERSION:
        return [(("version",), f"version {version} is newer than this program "
                               f"({SCHEMA_VERSION})", version)]
    return []


# --- checks of one panel: (index, panel, known) -> problems -------------------------------------
def _material(i: int, p: dict, known: Known) -> list[Problem]:
    """A panel's material that is not in [materials] (when [materials] is a table)."""
    material, materials = p.get("material"), known.keys("materials")
    if isinstance(known.data.get("materials"), dict) and isinstance(material, str) \
            and material not in materials:
        return [(("panels", i, "material"), f"{material!r} is not in [materials] "
                 f"({', '.join(sorted(materials)) or 'none given'})", material)]
    return []


# The keys of a wall's bracing that name a brace or anchor type, and the table each names.
HARDWARE = (("brace_type", "brace_types"), ("wall_anchor", "anchor_types"),
            ("foot_anchor", "anchor_types"))


def _hardware(i: int, p: dict, known: Known) -> list[Problem]:
    """A brace or anchor type of a panel's bracing that is not in its table."""
    bracing = p.get("bracing")
    if not isinstance(bracing, dict):
        return []
    problems = []
    for key, section in HARDWARE:
        name = bracing.get(key)
        if isinstance(name, str) and name not in known.keys(section):
            problems.append((("panels", i, "bracing", key),
                             f"{name!r} is not in [{section}]", name))
    return problems


def _mark(i: int, p: dict, known: Known) -> list[Problem]:
    """A panel mark given twice; the first panel of each mark is kept for the sign-offs."""
    mark = p.get("mark")
    if isinstance(mark, str) and mark in known.marks:
        return [(("panels", i, "mark"), f"used twice (also panel #{known.marks[mark] + 1})",
                 mark)]
    if isinstance(mark, str):
        known.marks[mark] = i
    return []


def _line(i: int, p: dict, known: Known) -> list[Problem]:
    """A panel's wall line that is not a [[lines]] name."""
    line = p.get("line")
    if isinstance(line, str) and line not in known.lines:
        return [(("panels", i, "line"), f"{line!r} is not a [[lines]] name", line)]
    return []


def _release_after(i: int, p: dict, known: Known) -> list[Problem]:
    """An event a panel's release waits for that is not an [[events]] name."""
    after = p.get("release_after")
    return [(("panels", i, "release_after", j), f"{event!r} is not an [[events]] name", event)
            for j, event in enumerate(after if isinstance(after, list) else [])
            if isinstance(event, str) and event not in known.events]


# The checks, in the order their problems are reported; a new cross-reference is one small
# function added here (a check that reads names runs after the one that keeps them).
PANEL_CHECKS = (_material, _hardware, _mark, _line, _release_after)
CHECKS = (_rule_ranges, _unknown_rules, _line_names, _event_names, _panels, _signed_off_panels,
          _foundation_walls, _version)


def reference_problems(data) -> list[Problem]:
    """(location, message, value) of every unknown rule, material, brace or anchor type, wall
    line, event or signed-off panel, repeated mark or name and too-new version in raw site data;
    other shapes are left to the fields."""
    if not isinstance(data, dict):
        return []
    known = Known(data)
    problems: list[Problem] = []
    for check in CHECKS:
        problems += check(data, known)
    return problems
