"""Every published value of bracing/verification.py, the table `bracing verify` prints.

Each entry there names its source and certainty (text / secondary / from memory, as the team's
reference list marks them) beside the published value; the values are the standards' and the
worked examples' own numbers, never computed by the code under test.
"""

import json

import pytest

from bracing import cli, verification
from bracing.results import CAUTION
from bracing.verification import PUBLISHED


@pytest.mark.parametrize("entry", PUBLISHED, ids=[e.key for e in PUBLISHED])
def test_the_engine_reproduces_the_published_value(entry):
    assert entry.certainty in verification.CERTAINTIES
    tolerance = ({"rel": entry.tolerance} if entry.relative
                 else {"abs": entry.tolerance, "rel": 0})
    assert entry.compute() == pytest.approx(entry.published, **tolerance), entry.source


def test_at_least_25_values_from_at_least_6_sources():
    assert len(PUBLISHED) >= 25
    standards = {" ".join(e.source.split()[:2]) for e in PUBLISHED}
    assert len(standards) >= 6, standards
    assert len({e.key for e in PUBLISHED}) == len(PUBLISHED)


def test_verify_prints_the_table_and_exits_0(capsys):
    assert cli.main(["verify"]) == 0
    out = capsys.readouterr().out
    assert out.startswith("CAUTION") and out.rstrip().endswith(CAUTION)
    for column in verification.COLUMNS:
        assert column in out
    assert f"{len(PUBLISHED)} of {len(PUBLISHED)} values reproduced" in out
    assert "from memory" not in out  # outputs say "unconfirmed value" and where to confirm it
    assert "unconfirmed value: confirm in TMS 402-16 Table 8.2.4.2" in out


def test_a_broken_formula_makes_verify_exit_1(monkeypatch, capsys):
    # ASCE 7-16 Table 26.10-1 (secondary): Kz 0.98 at 30 ft, exposure C. A Kz formula that
    # forgets the 15 ft floor and the 2/alpha power (z/zg alone) misses every table cell.
    from bracing.wind import asce7

    monkeypatch.setattr(asce7, "kz", lambda z_ft, exposure: z_ft / 900.0)
    assert cli.main(["verify", "--json"]) == 1
    record = json.loads(capsys.readouterr().out)
    failed = {v["key"] for v in record["values"] if not v["passes"]}
    assert "asce7-kz-C-30" in failed and record["passes"] is False
    assert not any(k.startswith("aci-") for k in failed)  # the others still pass


def test_a_formula_that_raises_fails_its_entry_without_a_crash(monkeypatch, capsys):
    from bracing import anchors

    def broken(*args, **kwargs):
        raise ZeroDivisionError("broken on purpose")

    monkeypatch.setattr(anchors, "tension_breakout", broken)
    assert cli.main(["verify"]) == 1
    assert "FAIL x ZeroDivisionError" in capsys.readouterr().out
