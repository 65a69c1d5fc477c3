"""Reading a site file fast (issue 14, design.md §9) without changing what is read or refused."""

import tomllib
from pathlib import Path

import pytest

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
