"""Site files: read, validate, report every error at once, and save without losing anything.

A site file is TOML kept by tomlkit, so a save keeps the user's comments and layout, its line
endings and its byte-order mark. Saves are atomic and keep the previous version as `NAME.bak`:
the new text goes to a temporary file beside the target (fsync), the old file is hard-linked
(or copied) to `NAME.bak`, then one `os.replace` puts the new file in place, so the target is
always there, old or new. Only regular files are read or written (a pipe must not hang a run).
"""

from __future__ import annotations

import codecs
import contextlib
import glob
import os
import re
import shutil
import stat
import tomllib
import uuid
from dataclasses import dataclass, replace
from functools import cached_property
from pathlib import Path
from typing import TYPE_CHECKING

import rtoml
from pydantic import ValidationError

from bracing.model import Site, error_message

if TYPE_CHECKING:  # tomlkit is imported where a file is saved or refused, not to read one
    import tomlkit


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
    newline: str = "\n"   # the file's line ending, kept by a save ("\r\n" stays)
    bom: bool = False     # the file began with a UTF-8 byte-order mark, kept by a save

    def __post_init__(self):
        if self.data is None:
            self.data = read_toml(self.text)

    @cached_property
    def document(self) -> tomlkit.TOMLDocument:
        """The file as tomlkit reads it (comments and layout kept), without the edits."""
        import tomlkit

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
        return replace(self, site=site, edits=self.edits + ((tuple(keys), value),), data=data)

    def written(self) -> tomlkit.TOMLDocument:
        """The document with the edits written into it."""
        import tomlkit

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
        """Write the file atomically, keeping the previous one as `.bak`; on an error (OSError,
        WriteRefused saying why) nothing is changed, neither the file nor this object."""
        import tomlkit

        target = Path(path) if path else self.path
        text = tomlkit.dumps(self.written())
        atomic_write(target, text, self.newline, self.bom)
        self.path, self.text, self.edits = target, text, ()
        self.__dict__.pop("document", None)
        return target


class WriteRefused(OSError):
    """A path that must not be written (a folder, a device or pipe, an input of the run, a
    missing folder); the message says why."""


# Temporary files of a save are named `.NAME.<random>.bracing-tmp` beside the target; a save
# killed half-way leaves one, and the next save of NAME removes them.
TEMP_SUFFIX = ".bracing-tmp"
LARGEST_FILE = 256 * 1024 * 1024  # bytes: a site or forecast file larger than this is a mistake


def check_target(target: str | Path) -> Path:
    """The real path a write to `target` goes to (a symbolic link is followed, never replaced),
    or WriteRefused: a folder, something not a regular file, or a folder that does not exist
    (none is created)."""
    path = Path(os.path.realpath(target))
    if path.is_dir():
        raise WriteRefused(f"{target} is a folder: give a file name")
    if path.exists() and not path.is_file():
        raise WriteRefused(f"{target} is not a regular file (a device or pipe): give a file name")
    if not path.parent.is_dir():
        raise WriteRefused(f"the folder {path.parent} does not exist: create it first")
    return path


def backup_of(path: Path) -> Path:
    return path.with_name(path.name + ".bak")


def check_output(output: str | Path, inputs: list[Path]) -> Path:
    """The real path of an output file (`check_target`), refused (WriteRefused) when it, or the
    `.bak` its write would make, is one of `inputs` or their `.bak`: an output never replaces
    what the run reads."""
    path = check_target(output)
    guarded = {Path(os.path.realpath(p)) for p in inputs}
    guarded |= {backup_of(p) for p in guarded}
    if path in guarded or backup_of(path) in guarded:
        raise WriteRefused(f"{output} is an input of this run (the site file, its forecast or a "
                           "backup of one): give another file name")
    return path


def inputs_of(site_path: str | Path) -> list[Path]:
    """The site file and the forecast file it names (best effort: an unreadable site file names
    none; its own errors are reported when it is loaded)."""
    site_path = Path(site_path)
    found = [site_path]
    try:
        data = read_toml(_read(site_path, "site file")[0])
        forecast = data.get("forecast", {}).get("file")
    except (SiteFileError, ValueError, RecursionError, AttributeError):
        return found
    if isinstance(forecast, str) and forecast:
        found.append(site_path.parent / forecast)
    return found


def _remove_stale(path: Path) -> None:
    """Remove the temporary files that killed saves of `path` left behind."""
    for stale in path.parent.glob(f".{glob.escape(path.name)}.*{TEMP_SUFFIX}"):
        with contextlib.suppress(OSError):
            stale.unlink()


def _temp_beside(path: Path) -> Path:
    return path.with_name(f".{path.name}.{uuid.uuid4().hex}{TEMP_SUFFIX}")


def atomic_write(target: str | Path, text: str, newline: str = "\n", bom: bool = False) -> Path:
    """Write `text` to `target` (its lines ending in `newline`) so that the target is always a
    complete file, old or new; the old one becomes `target.bak`. Returns the real path written.

    The steps: the new text into a temporary file beside the target, flushed to disk (fsync);
    the old file hard-linked (or copied, where links are not possible) to a second temporary
    name, which replaces `.bak`; then one os.replace of the target. Raises OSError
    (WriteRefused for a path that must not be written); the target is then untouched."""
    path = check_target(target)
    _remove_stale(path)
    data = ((codecs.BOM_UTF8 if bom else b"")
            + text.replace("\r\n", "\n").replace("\n", newline).encode("utf-8"))
    umask = os.umask(0)
    os.umask(umask)
    mode = stat.S_IMODE(path.stat().st_mode) if path.exists() else 0o666 & ~umask
    tmp = _temp_beside(path)
    made: list[Path] = []
    try:
        fd = os.open(tmp, os.O_WRONLY | os.O_CREAT | os.O_EXCL, 0o600)
        made.append(tmp)
        with os.fdopen(fd, "wb") as handle:
            os.fchmod(handle.fileno(), mode)  # the file's own or the usual permissions
            handle.write(data)
            handle.flush()
            os.fsync(handle.fileno())
        if path.exists():
            old = _temp_beside(path)
            try:
                os.link(path, old)
            except OSError:  # no hard links here (some file systems): a copy
                shutil.copy2(path, old)
            made.append(old)
            os.replace(old, backup_of(path))
            with contextlib.suppress(FileNotFoundError):  # a .bak that was already this same
                old.unlink()  # file (a save stopped after its link): rename leaves both names
        os.replace(tmp, path)
        _sync_folder(path.parent)
    except BaseException:
        for leftover in made:
            with contextlib.suppress(OSError):
                leftover.unlink()
        raise
    return path


def _sync_folder(folder: Path) -> None:
    """Flush the folder's entries (the rename) to disk where the system allows it."""
    try:
        fd = os.open(folder, os.O_RDONLY)
    except OSError:
        return
    try:
        os.fsync(fd)
    except OSError:
        pass
    finally:
        os.close(fd)


def _read(path: Path, what: str) -> tuple[str, str, bool]:
    """The text of a regular file (a byte-order mark dropped, line ends as "\n"), its line
    ending and whether it had the mark; SiteFileError naming the file and why it cannot be read.
    A pipe or device is refused without reading it (reading a pipe would wait forever)."""
    def refused(why: str) -> SiteFileError:
        return SiteFileError(str(path), [f"{path}: {why}"])

    try:
        fd = os.open(path, os.O_RDONLY | getattr(os, "O_NONBLOCK", 0))
    except OSError as exc:
        raise refused(f"cannot read the {what} ({exc.strerror})") from None
    info = os.fstat(fd)
    if not stat.S_ISREG(info.st_mode) or info.st_size > LARGEST_FILE:
        os.close(fd)
        if not stat.S_ISREG(info.st_mode):
            raise refused(f"not a regular file (a folder, device or pipe): give the {what}")
        raise refused(f"the {what} is {info.st_size:,} bytes, more than a {what} can be "
                      f"({LARGEST_FILE:,})")
    with os.fdopen(fd, "rb") as handle:
        try:
            raw = handle.read()
        except OSError as exc:
            raise refused(f"cannot read the {what} ({exc.strerror})") from None
    bom = raw.startswith(codecs.BOM_UTF8)
    try:
        text = raw.decode("utf-8-sig")
    except UnicodeDecodeError as exc:
        raise refused(f"not a UTF-8 text file (byte {exc.start + 3 * bom})") from None
    newline = "\r\n" if "\r\n" in text else "\n"
    return text.replace("\r\n", "\n"), newline, bom


def read_text(path: str | Path, what: str) -> str:
    """The text of a regular file (`_read`) for other readers (the forecast)."""
    return _read(Path(path), what)[0]


def load(path: str | Path) -> SiteFile:
    """Read and validate a site file; raise SiteFileError listing every problem. A UTF-8
    byte-order mark at the start is accepted (and kept by a save), as are CRLF line endings."""
    path = Path(path)
    text, newline, bom = _read(path, "site file")
    return replace(parse(text, str(path)), newline=newline, bom=bom)


def read_toml(text: str) -> dict:
    """The plain data of TOML text, read by rtoml (a TOML reader compiled from Rust: about three
    times faster than tomli, the standard library's parser compiled, on a large site). It reads
    TOML 1.1, whose few additions (an inline table over several lines or with a trailing comma,
    the `\\x` and `\\e` escapes, a time without seconds) the standard library's TOML 1.0 parser
    refuses and tomlkit, which saves the file, reads. A text it refuses is read again by the
    standard library's tomllib, so that a refusal is tomllib's, with its words and line."""
    try:
        return rtoml.loads(text)
    except Exception:  # noqa: BLE001 - tomllib raises its own error for the same text
        return tomllib.loads(text)


def parse(text: str, name: str = "<site>") -> SiteFile:
    """Parse and validate site-file text; `name` is used in messages."""
    try:
        data = read_toml(text)  # fast; tomlkit (style-keeping) is parsed only to save
    except tomllib.TOMLDecodeError as fast_error:
        raise SiteFileError(name, [_toml_problem(fast_error, text, name)]) from None
    except ValueError as exc:  # an integer of thousands of digits
        raise SiteFileError(name, [f"{name}: not valid TOML for a site file: a number too long "
                                   f"to read ({str(exc).split(' for ')[0]})"]) from None
    except RecursionError:
        raise SiteFileError(name, [f"{name}: not valid TOML for a site file: arrays or tables "
                                   "nested too deeply"]) from None
    return SiteFile(Path(name), text, validate_data(data, name, text), data=data)


def validate_data(data: dict, name: str, text: str) -> Site:
    """Validate plain site data into a Site, or raise SiteFileError with every problem."""
    try:
        return Site.model_validate(data)
    except ValidationError as exc:
        problems = [describe(err, data, name, text) for err in exc.errors()]
        raise SiteFileError(name, problems) from None


def describe(err: dict, data: dict, name: str, text: str) -> str:
    """One line for one validation error: file, line, item (panel mark) and field."""
    loc = tuple(err["loc"])
    message = error_message(err)
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
    import tomlkit
    from tomlkit.exceptions import TOMLKitError

    at = re.search(r"\(at line (\d+), column \d+\)", str(error))
    where = f"{name}:{at.group(1)}" if at else name
    why = re.sub(r"\s*\(at line \d+, column \d+\)", "", str(error))
    try:
        tomlkit.parse(text)
    except TOMLKitError as exc:
        why = re.sub(r"\s*at line \d+ col \d+$", "", str(exc)) or why
    except (ValueError, RecursionError):  # tomlkit's own limits: the standard parser's words
        pass
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
