"""The formula layer's docstring examples run as tests (issue 14 item 6).

The examples quote published table values (ASCE 7-16, ASCE 37-14, IBC, ACI 318-19, AISC 360-16,
NDS 2018), each marked with its certainty as references.md marks it; a wrong quoted value, or a
formula that no longer gives it, fails here. Run with the README's test command (`python -m
pytest`), or alone: `python -m pytest --doctest-modules bracing/wind bracing/stability.py ...`.
"""

import doctest
import importlib

import pytest

FORMULA_MODULES = [
    "bracing.wind.asce7",
    "bracing.wind.asce7_cases_ab",
    "bracing.wind.asce7_case_c",
    "bracing.wind.asce37",
    "bracing.wind.gusts",
    "bracing.stability",
    "bracing.braces",
    "bracing.members",
    "bracing.steel_pipe",
    "bracing.steel_pipe_bending",
    "bracing.lumber",
    "bracing.anchors",
    "bracing.anchor_factors",
    "bracing.anchor_tension",
    "bracing.anchor_shear",
    "bracing.ground_anchors",
    "bracing.earth_pressure",
    "bracing.wall_sections",
]
FLAGS = doctest.ELLIPSIS | doctest.NORMALIZE_WHITESPACE


@pytest.mark.parametrize("name", FORMULA_MODULES)
def test_docstring_examples(name):
    module = importlib.import_module(name)
    finder = doctest.DocTestFinder(exclude_empty=True)
    runner = doctest.DocTestRunner(optionflags=FLAGS)
    tests = [t for t in finder.find(module, name) if t.examples]
    assert tests, f"{name} has no docstring examples"
    for test in tests:
        runner.run(test)
    result = runner.summarize(verbose=False)
    assert result.failed == 0, f"{result.failed} docstring example(s) of {name} failed (above)"
