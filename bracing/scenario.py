"""Site files: read, validate, report every error at once, and save without losing anything.

A site file is TOML kept by tomlkit, so a save keeps the user's comments and layout. Saves are
atomic (write beside, then replace) and keep the previous version as `NAME.bak`.
"""

from __future__ import annotations

import os
import re
import tempfile
import tomllib
from dataclasses import dataclass
from functools import cached_property
from pathlib import Path

import tomlkit
from pydantic import ValidationError
from tomlkit.exceptions import TOMLKitError

from bracing.model import Site


class SiteFileError(Exception):
    """Every problem found in one site file, each naming the file, line, item and field."""

    def __init__(self, path: str, problems: list[str]):
        self.path = path
        self.problems = problems
        super().__init__("\n".join(problems))


REMOVE = object()  # with_value(keys, REMOVE) takes a key out of the file


@dataclass
class SiteFile:
    """A site file: its text as read or last saved, edits not yet written into it, the plain
    data with those edits, and the validated model.

    Edits are kept apart from the text so that changing one value re-validates the plain data
    only; the style-keeping TOML document (tomlkit, slow on a large file) is parsed when it is
    needed: to save, with the user's comments and layout.
    """

    path: Path
    text: str
    site: Site
    edits: tuple = ()
    data: dict | None = None

    def __post_init__(self):
        if self.data is None:
            self.data = tomllib.loads(self.text)

    @cached_property
    def document(self) -> tomlkit.TOMLDocument:
        """The file as tomlkit reads it (comments and layout kept), without the edits."""
        return tomlkit.parse(self.text)

    def with_value(self, keys: tuple, value) -> SiteFile:
        """A copy with one value changed, validated; raises SiteFileError and changes nothing.

        `value` REMOVE takes the key out of the file (an optional value back to its default)."""
        data = dict(self.data)
        node = data
        try:
            for key in keys[:-1]:
                child = node[key]
                child = list(child) if isinstance(child, list) else dict(child)
                node[key] = child
                node = child
        except (KeyError, IndexError, TypeError):
            where = ".".join(str(k) for k in keys[:-1])
            raise SiteFileError(str(self.path), [f"{self.path}: no {where} in the file"]) from None
        if value is REMOVE:
            node.pop(keys[-1], None)
        else:
            node[keys[-1]] = value
        site = validate_data(data, str(self.path), self.text)
        return SiteFile(self.path, self.text, site, self.edits + ((tuple(keys), value),), data)

    def written(self) -> tomlkit.TOMLDocument:
        """The document with the edits written into it."""
        document = tomlkit.parse(self.text) if self.edits else self.document
        for keys, value in self.edits:
            node = document
            for key in keys[:-1]:
                node = node[key]
            if value is REMOVE:
                if keys[-1] in node:
                    del node[keys[-1]]
            else:
                node[keys[-1]] = value
        return document

    def save(self, path: str | Path | None = None) -> Path:
        """Write the file atomically, keeping the previous one as `.bak`."""
        target = Path(path) if path else self.path
        text = tomlkit.dumps(self.written())
        atomic_write(target, text)
        self.path, self.text, self.edits = target, text, ()
        self.__dict__.pop("document", None)
        return target


def atomic_write(target: Path, text: str) -> None:
    """Write `text` to `target` through a temporary file; the old file becomes `target.bak`."""
    target = Path(target)
    target.parent.mkdir(parents=True, exist_ok=True)
    fd, tmp = tempfile.mkstemp(dir=target.parent, prefix=f".{target.name}.", suffix=".tmp")
    umask = os.umask(0)
    os.umask(umask)
    mode = target.stat().st_mode & 0o777 if target.exists() else 0o666 & ~umask
    try:
        os.chmod(tmp, mode)  # mkstemp makes 0600: keep the file's own or the usual permissions
        with os.fdopen(fd, "w", encoding="utf-8") as handle:
            handle.write(text)
            handle.flush()
            os.fsync(handle.fileno())
        if target.exists():
            backup = target.with_name(target.name + ".bak")
            os.replace(target, backup)
        os.replace(tmp, target)
    except BaseException:
        if os.path.exists(tmp):
            os.unlink(tmp)
        raise


def load(path: str | Path) -> SiteFile:
    """Read and validate a site file; raise SiteFileError listing every problem."""
    path = Path(path)
    try:
        text = path.read_text(encoding="utf-8")
    except OSError as exc:
        raise SiteFileError(str(path), [f"{path}: cannot read the file ({exc.strerror})"]) from None
    except UnicodeDecodeError as exc:
        raise SiteFileError(str(path), [f"{path}: not a UTF-8 text file (byte {exc.start})"]) \
            from None
    return parse(text, str(path))


def parse(text: str, name: str = "<site>") -> SiteFile:
    """Parse and validate site-file text; `name` is used in messages."""
    try:
        data = tomllib.loads(text)  # fast; tomlkit (style-keeping) is parsed only to save
    except tomllib.TOMLDecodeError as fast_error:
        raise SiteFileError(name, [_toml_problem(fast_error, text, name)]) from None
    return SiteFile(Path(name), text, validate_data(data, name, text), data=data)


def validate_data(data: dict, name: str, text: str) -> Site:
    """Validate plain site data into a Site, or raise SiteFileError with every problem."""
    try:
        return Site.model_validate(data)
    except ValidationError as exc:
        raise SiteFileError(name, [describe(err, data, name, text) for err in exc.errors()]) from None


def describe(err: dict, data: dict, name: str, text: str) -> str:
    """One line for one validation error: file, line, item (panel mark) and field."""
    loc = tuple(err["loc"])
    message = err["msg"].removeprefix("Value error, ")
    if err["type"] == "missing":
        message = "missing (this field is required)"
    elif err["type"] == "extra_forbidden":
        message = "unknown key (check the spelling; `bracing schema` lists the keys)"
    item, field = _item_and_field(loc, data)
    line = _line_of(loc, text)
    where = f"{name}:{line}" if line else name
    got = err.get("input")
    shown = f" (got {got!r})" if got is not None and not isinstance(got, (dict, list)) else ""
    if err["type"] in ("missing",):
        shown = ""
    parts = [p for p in (item, field) if p]
    return f"{where}: {': '.join(parts + [message])}{shown}"


def _item_and_field(loc: tuple, data: dict) -> tuple[str, str]:
    """'panel P-07' and 'footing.width' from a location like ('panels', 6, 'footing', 'width')."""
    if len(loc) >= 2 and isinstance(loc[1], int):
        section, index = loc[0], loc[1]
        try:
            entry = data[section][index]
            label = entry.get("mark") or entry.get("name") or f"#{index + 1}"
        except (KeyError, IndexError, TypeError, AttributeError):
            label = f"#{index + 1}"
        kind = section.removesuffix("s")
        return f"{kind} {label}", ".".join(str(p) for p in loc[2:])
    if len(loc) >= 2 and loc[0] in ("materials", "rules", "brace_types", "anchor_types"):
        return f"{loc[0][:-1]} {loc[1]}", ".".join(str(p) for p in loc[2:])
    return "", ".".join(str(p) for p in loc) or "(whole file)"


def _toml_problem(error: tomllib.TOMLDecodeError, text: str, name: str) -> str:
    """'file:line: not valid TOML: why', the line from the standard library's parser.

    tomlkit's own wording is kept where it says more (it names a repeated key), without its
    position, which some versions give a line late.
    """
    at = re.search(r"\(at line (\d+), column \d+\)", str(error))
    where = f"{name}:{at.group(1)}" if at else name
    why = re.sub(r"\s*\(at line \d+, column \d+\)", "", str(error))
    try:
        tomlkit.parse(text)
    except TOMLKitError as exc:
        why = re.sub(r"\s*at line \d+ col \d+$", "", str(exc)) or why
    return f"{where}: not valid TOML: {why}"


def _line_of(loc: tuple, text: str) -> int | None:
    """Best-effort line number (1-based) of the key at `loc` in the TOML text.

    Follows the table headers down the location ("[materials.tilt]", the n-th "[[panels]]", its
    "[[panels.openings]]"), then the key in that table's own body; stops at the deepest found.
    """
    lines = text.splitlines()
    header = re.compile(r"^\s*(\[\[?)\s*([^\]]+?)\s*\]")
    heads = {n: (m.group(1) == "[[", re.sub(r"[\s\"']", "", m.group(2)))
             for n, line in enumerate(lines) if (m := header.match(line))}

    def body_end(n: int) -> int:  # a table's own keys end at the next header
        return next((h for h in heads if h > n), len(lines))

    prefix, start, stop, found = "", -1, len(lines), None
    for key in loc:
        inside = [n for n in heads if start < n < stop]
        if isinstance(key, int):  # the key-th [[prefix]] of an array of tables
            hits = [n for n in inside if heads[n] == (True, prefix)]
            if key >= len(hits):
                break
            start = found = hits[key]
            stop = hits[key + 1] if key + 1 < len(hits) else stop
            continue
        name = f"{prefix}.{key}" if prefix else str(key)
        table = [n for n in inside if heads[n] == (False, name)]
        if table:
            start = found = table[0]
            prefix = name
            continue
        if any(heads[n][1] == name or heads[n][1].startswith(name + ".") for n in inside):
            prefix = name  # an array of tables, or a parent of dotted headers
            continue
        assign = re.compile(rf"^\s*[\"']?{re.escape(str(key))}[\"']?\s*=")
        hits = [n for n in range(start + 1, body_end(start)) if assign.match(lines[n])]
        found = hits[0] if hits else found
        break
    return None if found is None else found + 1
