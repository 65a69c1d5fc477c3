"""Reading a site file fast (issue 14, design.md §9): the data the standard library reads, and its
refusals; TOML 1.1's few additions, which the standard library (TOML 1.0) refuses, are read."""

import tomllib
from datetime import time
from pathlib import Path

import pytest
import tomlkit

from bracing import scenario

SCENARIOS = sorted((Path(__file__).resolve().parents[1] / "scenarios").glob("*.toml"))


@pytest.mark.parametrize("path", SCENARIOS, ids=lambda p: p.stem)
def test_a_site_is_read_as_the_standard_library_reads_it(path):
    text = path.read_text(encoding="utf-8")
    assert scenario.read_toml(text) == tomllib.loads(text)


def test_a_refused_text_is_refused_by_the_standard_library_with_its_line():
    # The site file's problems quote tomllib's words and line (tests/test_site_file.py).
    with pytest.raises(tomllib.TOMLDecodeError, match=r"at line 3"):
        scenario.read_toml('a = 1\nb = 2\na = 3\n')


def test_toml_1_1_additions_are_read_as_tomlkit_reads_them():
    """TOML v1.1.0 (from memory): an inline table may span lines and end in a comma, a time may
    leave out its seconds (07:32 is 07:32:00), and "\\x41" is "A". The standard library reads
    TOML 1.0 and refuses each; rtoml reads them, and so does tomlkit, which saves the file."""
    text = 'a = {b = 1,\n  c = 2,}\nt = 07:32\ns = "\\x41"\n'
    expected = {"a": {"b": 1, "c": 2}, "t": time(7, 32), "s": "A"}
    assert scenario.read_toml(text) == expected
    assert tomlkit.parse(text).unwrap() == expected
