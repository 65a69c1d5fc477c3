"""Module and function sizes of the engine (issue 14): no module under `bracing/` over 450
lines, no function over 60 lines (common practice: the team's limits, issue 14's acceptance).

A module that grows past its limit is split by topic into siblings, its old import path kept as
the home that names them all (DEVELOPERS.md, "Module sizes").
"""

import ast
from pathlib import Path

BRACING = Path(__file__).resolve().parents[1] / "bracing"
MODULE_LINES = 450
FUNCTION_LINES = 60

# Nothing is allowed past the limits now that every part is split (kept as the place to name an
# exception, with its issue and its present size, should one ever be needed).
ALLOWED_MODULES: dict[str, int] = {}
ALLOWED_FUNCTIONS: dict[str, int] = {}


def _modules():
    for path in sorted(BRACING.rglob("*.py")):
        yield path.relative_to(BRACING.parent).as_posix(), path.read_text(encoding="utf-8")


def module_sizes() -> dict[str, int]:
    """Lines of every module under bracing/."""
    return {name: len(text.splitlines()) for name, text in _modules()}


def function_sizes() -> dict[str, int]:
    """Lines of every function and method under bracing/ (its def line to its last line),
    by 'module:name'; a name defined twice in a module keeps its longest."""
    sizes: dict[str, int] = {}
    for name, text in _modules():
        for node in ast.walk(ast.parse(text)):
            if isinstance(node, (ast.FunctionDef, ast.AsyncFunctionDef)):
                key = f"{name}:{node.name}"
                sizes[key] = max(sizes.get(key, 0), node.end_lineno - node.lineno + 1)
    return sizes


def over(sizes: dict[str, int], limit: int, allowed: dict[str, int]) -> dict[str, int]:
    """The entries over the limit and over what the allow-list lets them keep."""
    return {k: n for k, n in sizes.items() if n > max(limit, allowed.get(k, 0))}


def test_no_module_under_bracing_is_over_450_lines():
    assert over(module_sizes(), MODULE_LINES, ALLOWED_MODULES) == {}


def test_no_function_under_bracing_is_over_60_lines():
    assert over(function_sizes(), FUNCTION_LINES, ALLOWED_FUNCTIONS) == {}


def test_the_measures_see_the_modules_and_functions():
    # bracing/anchors.py holds slab_anchor_capacity (its def line to its return, 40-odd lines):
    # a measure that found nothing would pass the two tests above with no work done.
    sizes = function_sizes()
    assert 30 < sizes["bracing/anchors.py:slab_anchor_capacity"] <= FUNCTION_LINES
    assert 100 < module_sizes()["bracing/anchors.py"] <= MODULE_LINES


def constructor_calls_over(limit: int) -> list[str]:
    """Calls of a class (a capitalized name) with more than `limit` positional arguments, as
    'module:line': records are built by keyword (common practice: the team's rule, issue 14)."""
    found = []
    for name, text in _modules():
        for node in ast.walk(ast.parse(text)):
            if isinstance(node, ast.Call):
                callee = node.func.attr if isinstance(node.func, ast.Attribute) else \
                    getattr(node.func, "id", "")
                if callee[:1].isupper() and len(node.args) > limit:
                    found.append(f"{name}:{node.lineno}")
    return found


def test_no_record_is_built_from_more_than_6_positional_values():
    assert constructor_calls_over(6) == []


def test_the_positional_count_sees_a_call():
    """The measure finds calls at all (a limit of 0 flags the many one-argument calls)."""
    assert constructor_calls_over(0)
