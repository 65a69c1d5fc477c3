"""The demo sites' records stay what they were: a restructuring of the engine changes no result.

An intended change of results rewrites the records with `python tests/golden/update.py`; the
commit says what changed and why.
"""

from __future__ import annotations

import json
import math
import sys
from pathlib import Path

import pytest

sys.path.insert(0, str(Path(__file__).parent / "golden"))
import update

REL = 1e-7  # float noise: the same formulas summed in another order


def _same(old, new, where="") -> list[str]:
    """Where `new` differs from `old` beyond float noise."""
    if isinstance(old, float) or isinstance(new, float):
        if isinstance(old, (int, float)) and isinstance(new, (int, float)) and math.isclose(
                old, new, rel_tol=REL, abs_tol=1e-9):
            return []
        return [f"{where}: {old!r} -> {new!r}"]
    if isinstance(old, dict) and isinstance(new, dict):
        keys = list(dict.fromkeys([*old, *new]))
        return [d for k in keys for d in _same(old.get(k), new.get(k), f"{where}.{k}")]
    if isinstance(old, list) and isinstance(new, list) and len(old) == len(new):
        return [d for k, (a, b) in enumerate(zip(old, new, strict=True))
                for d in _same(a, b, f"{where}[{k}]")]
    return [] if old == new else [f"{where}: {old!r} -> {new!r}"]


@pytest.mark.parametrize("name", update.SITES)
def test_the_demo_site_records_are_unchanged(name):
    golden = json.loads((update.HERE / f"{name}.json").read_text(encoding="utf-8"))
    differences = _same(golden, update.record(name))
    assert not differences, "\n".join(differences[:20])


def test_a_changed_result_is_caught():
    """The comparison itself: a utilization moved in the 4th digit is a difference."""
    golden = {"panels": [{"governing_utilization": 0.8123}]}
    assert _same(golden, {"panels": [{"governing_utilization": 0.8124}]})
    assert not _same(golden, {"panels": [{"governing_utilization": 0.8123 * (1 + 1e-12)}]})
