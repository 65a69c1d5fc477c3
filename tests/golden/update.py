"""Write the golden site records of the demo sites (tests/test_golden_records.py compares them).

Run after an intended change of the engine's results, and say in the commit what changed:
    python tests/golden/update.py
"""

from __future__ import annotations

import json
from pathlib import Path

HERE = Path(__file__).parent
SCENARIOS = HERE.parent.parent / "scenarios"
SITES = ("tilt-up-warehouse", "masonry-gym", "townhouse-framing", "demo-mixed", "basement-duplex")


def record(name: str) -> dict:
    """The site record `bracing check SITE --json` prints, without its review block (which
    holds the date)."""
    from bracing import scenario
    from bracing.evaluate import evaluate
    from bracing.report import json_view

    path = SCENARIOS / f"{name}.toml"
    result = evaluate(scenario.load(path).site, base_dir=path.parent)
    return json.loads(json_view.dumps(json_view.site_record(result)))


if __name__ == "__main__":
    for name in SITES:
        (HERE / f"{name}.json").write_text(
            json.dumps(record(name), indent=1, ensure_ascii=False) + "\n", encoding="utf-8")
        print(f"wrote tests/golden/{name}.json")
