"""The exit code a `bracing` command owes a JSON record (design.md §8a), for tests that read it."""


def exit_code_of(record: dict) -> int:
    """1 when the wall fails a check (status unsafe or needs_braces) or carries a danger
    finding, else 0 (design.md §8a)."""
    fails = record["status"] in ("unsafe", "needs_braces") or any(
        f["severity"] == "danger" for f in record["flags"])
    return 1 if fails else 0
