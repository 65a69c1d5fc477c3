"""JSON views of the result object: the keys of design.md §8 (stable; add, never rename)."""

from __future__ import annotations

import re
from collections.abc import Callable, Iterator, Sequence
from dataclasses import dataclass, fields, is_dataclass
from functools import partial
from typing import TextIO

import orjson

from bracing.model import DEFAULT_RULES, Site
from bracing.results import DayResult, PanelResult, SiteResult

METHOD = ("method notes (docs/method.md, shipped with the tool), which cite the published "
          "clauses")


def panel_record(p: PanelResult, basis: str, caution: str | None = None) -> dict:
    """One wall as the §8 record, with its checks worst first; `caution` for a record that
    stands alone (`bracing panel`: a site record holds the caution once, at its top). The
    result objects in it (wind, unbraced, flags) are written as objects of their fields."""
    return {
        "mark": p.mark,
        "material": p.material,
        "status": p.status,
        "basis": basis,
        "weight_lb": p.weight_lb,
        "wind": p.wind,
        "unbraced": p.unbraced,
        "braces": p.braces,
        "working_limit_speed_mph": p.working_limit_speed_mph,
        "stand_down_speed_mph": p.stand_down_speed_mph,
        "sustained_equivalents_of_stand_down_mph": p.sustained_equivalents_mph,
        "fresh_mortar_working_limit_speed_mph": p.fresh_working_limit_speed_mph,
        "fresh_mortar_stand_down_speed_mph": p.fresh_stand_down_speed_mph,
        "governing_element": p.governing_element,
        "governing_utilization": p.utilization,
        "checks": [c.as_dict() for c in p.worst_first()],
        "flags": p.flags_worst_first(),
        **({"caution": caution} if caution is not None else {}),
    }


# The team's design sections some engine sources still name, and the method notes' sections
# (docs/method.md) that users have, which state the same readings.
NOTES_SECTION = {"§3": "§1", "§4": "§2", "§5": "§3", "§6": "§4", "§7": "§6", "§8": "§8",
                 "§8a": "§8"}


def as_output(source: str) -> str:
    """A source as reports print it: a value from memory is an unconfirmed value; the method
    is cited as the method notes users have, by section."""
    source = re.sub(r"design\.md( §\w+)?", lambda m: "method notes" + (
        f" {NOTES_SECTION.get(m.group(1).strip(), '')}".rstrip() if m.group(1) else ""), source)
    return source.replace("from memory", "unconfirmed value")


def review_record(site: Site, result: SiteResult, facts: dict) -> dict:
    """The review record: what was checked, with what, on what basis, when (`facts`: the site
    file's name and SHA-256, the tool's name and version, the date; read at the edge)."""
    rules = []
    for name in dict.fromkeys([*DEFAULT_RULES, *site.rules]):
        r = site.rule(name)
        rules.append({"name": name, "value": r.value, "in_force": r.enabled,
                      "source": as_output(r.source), "basis": r.basis})
    return {
        **facts,
        "design_basis": {"basis": result.basis, "risk_category": site.site.risk_category,
                         "statement": result.basis_statement},
        "rules": rules,
        "method": METHOD,
        "fails": result.fails,
        "failing_walls": [p.mark for p in result.failing()]
        + [w.mark for w in result.foundation_walls if w.fails],
        "not_checked": result.not_checked,  # written as objects of their fields
    }


def site_record(result: SiteResult, review: dict | None = None) -> dict:
    """The whole site, walls worst first; with `review`, the review record (review_record).
    The walls' records are made one by one as they are written (`Each`), not all at once: a
    10,000-wall site has 60,000 checks."""
    return {
        **({"review": review} if review is not None else {}),
        "site": result.name,
        "basis": result.basis,
        "basis_statement": result.basis_statement,
        "caution": result.caution,
        "panels": Each(result.worst_first(), partial(panel_record, basis=result.basis)),
        "days": Each(result.days, partial(day_record, written={})),
        "peak_inventory": result.peak_inventory,
        # foundation walls backfilled before the floor (method notes §12), when the site has any
        **({"foundation_walls": [w.as_dict() for w in result.foundation_walls]}
           if result.foundation_walls else {}),
    }


def day_record(day: DayResult, written: dict) -> dict:
    """One day as its record, the fields of DayResult. Its flags are the walls' own objects,
    listed again on every day that the walls stand (140,000 on the 35 days of a 10,000-wall
    site, 5,000 of them distinct): each is written once, kept in `written`, and its text
    repeated."""
    record = {name: getattr(day, name) for name in DAY_FIELDS}
    record["flags"] = [_once(flag, written) for flag in day.flags]
    return record


DAY_FIELDS = tuple(f.name for f in fields(DayResult))


def _once(value, written: dict) -> orjson.Fragment:
    """`value`'s JSON text, made once for each object (`written`, by id: the objects outlive
    the writing)."""
    text = written.get(id(value))
    if text is None:
        text = written[id(value)] = orjson.Fragment(_compact(value))
    return text


@dataclass(frozen=True)
class Each:
    """A list of the record whose items are made as they are written: `make` of each item."""

    items: Sequence
    make: Callable

    def __iter__(self) -> Iterator:
        return map(self.make, self.items)


def dumps(record: dict) -> str:
    """The record as JSON text (`pieces`)."""
    return b"".join(pieces(record)).decode()


def write(record: dict, stream: TextIO) -> None:
    """The record as JSON text and a line end, written to `stream` piece by piece (`pieces`;
    as bytes to its buffer where it has one): a large site's text (70 MB at 10,000 walls) is
    never whole in memory."""
    raw = getattr(stream, "buffer", None)
    if raw is None:
        stream.write(dumps(record) + "\n")
        return
    stream.flush()
    for piece in pieces(record):
        raw.write(piece)
    raw.write(b"\n")
    raw.flush()


def pieces(record: dict) -> Iterator[bytes]:
    """The record as JSON text in pieces: its top-level keys one per line, and each item of a
    top-level list of objects (a wall, a day) on a line of its own, so that a large site's
    record stays readable line by line. Result objects (dataclasses) are written as objects of
    their fields; NaN and infinity, which JSON lacks, as null."""
    yield b"{"
    for k, (key, value) in enumerate(record.items()):
        yield b"%s\n  %s: " % (b"," if k else b"", _compact(key))
        if isinstance(value, Each) or _objects(value):
            yield from _lines(value)
        else:
            yield _compact(value)
    yield b"\n}"


def _lines(items) -> Iterator[bytes]:
    """A list with each item on a line of its own."""
    before = b"[\n    "
    for item in items:
        yield before + _compact(item)
        before = b",\n    "
    yield b"\n  ]" if before == b",\n    " else b"[]"


def _objects(value) -> bool:
    """A non-empty list of objects (dicts or result dataclasses)."""
    return (isinstance(value, list) and bool(value)
            and (isinstance(value[0], dict) or is_dataclass(value[0])))


_OPTIONS = orjson.OPT_SERIALIZE_NUMPY | orjson.OPT_NON_STR_KEYS


def _compact(value) -> bytes:
    return orjson.dumps(value, option=_OPTIONS)
