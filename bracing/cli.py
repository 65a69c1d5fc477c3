"""The `bracing` command: panel, check, schema (and the site, schedule and interface commands).

Validation lives here and in the model: bad input exits with code 2 and a message naming the
file, item and field; never a traceback.
"""

from __future__ import annotations

import argparse
import hashlib
import json
import signal
import sys
from datetime import UTC
from pathlib import Path

from pydantic import ValidationError

from bracing import backfill_view, scenario
from bracing.cli_args import (
    DIFF_EXIT_CODES,
    EXIT_BAD_INPUT,
    EXIT_FAILS,
    BadInput,
    Parser,
    check_output,
    every_action,
    flags_given,
    given,
    internal_error,
    output_options,
)
from bracing.evaluate import evaluate
from bracing.model import Site
from bracing.panel_flags import flag_problem, panel_site
from bracing.report import json_view
from bracing.schedule import site_forecast


def main(argv: list[str] | None = None) -> int:
    if hasattr(signal, "SIGPIPE"):  # `bracing check ... | head` ends quietly
        signal.signal(signal.SIGPIPE, signal.SIG_DFL)
    parser = build_parser()
    args = parser.parse_args(argv)
    flags_given(parser, args)
    try:
        check_output(args)
        return args.run(args)
    except BadInput as exc:
        print(f"bracing: {exc}", file=sys.stderr)
        return EXIT_BAD_INPUT
    except scenario.SiteFileError as exc:
        print(f"bracing: {len(exc.problems)} problem(s) in {exc.path}:", file=sys.stderr)
        for problem in exc.problems:
            print(f"  {problem}", file=sys.stderr)
        return EXIT_BAD_INPUT
    except Exception:  # noqa: BLE001 - the last line of defence, not the way errors are handled
        return internal_error()


def build_parser() -> argparse.ArgumentParser:
    parser = Parser(
        prog="bracing",
        description="Plan and check the temporary bracing of walls standing before their "
                    "diaphragm exists. A planning aid: a qualified person designs and approves "
                    "the bracing.")
    commands = parser.add_subparsers(dest="command", required=True, parser_class=Parser)
    _panel_command(commands)
    backfill_view.add_command(commands).set_defaults(run=run_backfill)
    for add_command in (_check_command, _diff_command, _verify_command, _schema_command,
                        _schedule_command, _plan_command, _tui_command):
        add_command(commands)
    for action in every_action(parser):  # every value, flag or file name, must be given
        one_value = action.nargs is None or (action.nargs == "?" and not action.option_strings)
        if one_value and action.choices is None:
            action.type = given(action.type or str)
    return parser


def _panel_command(commands) -> None:
    panel = commands.add_parser("panel", help="quick check of one wall standing alone")
    add = panel.add_argument
    add("--height", required=True, help="wall height, e.g. 30ft (bare number: ft)")
    add("--width", required=True, help="wall length along the wind, e.g. 24ft (ft)")
    add("--thickness", required=True, help="e.g. 7.25in (bare number: in)")
    add("--material", choices=["concrete", "masonry", "framed"], default="concrete")
    weight = panel.add_mutually_exclusive_group()
    weight.add_argument("--unit-weight", help="e.g. 150pcf (pcf)")
    weight.add_argument("--face-weight", help="weight per face area, e.g. 36psf (psf)")
    add("--opening-area", help="openings by area, e.g. 96ft^2 (ft^2)")
    add("--wind", required=True, help="basic wind speed, e.g. 115mph (mph)")
    add("--exposure", default="C", help="B, C or D (default C)")
    period = panel.add_mutually_exclusive_group()
    period.add_argument("--duration", help="standing time, e.g. 5weeks (weeks)")
    period.add_argument("--period-factor", help="ASCE 37-14 factor set directly")
    add("--kzt", default="1.0", help="topographic factor (default 1.0)")
    add("--ground-elevation", help="site elevation for Ke, e.g. 2000ft (ft)")
    add("--footing-width", help="footing width across the wall (ft)")
    add("--footing-thickness", help="footing depth (ft)")
    add("--mortar-age", help="masonry mortar age, e.g. 3days (days)")
    _panel_brace_options(panel)
    add("--limit-speed", help="observed gust limit for the unbraced height, e.g. 20mph (mph)")
    add("--stand-down-ratio", help="stand-down speed / working-limit speed (default 0.8)")
    add("--basis", choices=["ASD", "LRFD"], default="ASD")
    output_options(panel)
    panel.set_defaults(run=run_panel)


def _panel_brace_options(panel) -> None:
    add = panel.add_argument
    add("--braces", type=int, help="number of braces (checked with the braces module)")
    add("--insert-height", help="brace insert height (ft)")
    angle = panel.add_mutually_exclusive_group()
    angle.add_argument("--brace-angle", help="brace angle from horizontal (deg)")
    angle.add_argument("--anchor-distance", help="brace foot distance from the wall face (ft)")
    add("--brace-capacity", help="allowable brace load (lb), in compression and in tension")
    add("--sill-fastening", help="framed walls: allowable uplift of the sill fastening per ft "
                                 "of sill, e.g. 200plf (plf)")


def _check_command(commands) -> None:
    check = commands.add_parser("check", help="check every wall of a site file")
    check.add_argument("site", help="site file (TOML)")
    check.add_argument("--design", action="store_true",
                       help="lay out braces for walls that need them and have none")
    output_options(check)
    check.add_argument("--findings", action="store_true",
                       help="the reviewer's report: only what needs action, worst first, then "
                            "what was not checked")
    check.add_argument("--format", choices=["text", "html"], default="text",
                       help="with --findings: text (100 columns) or printable HTML")
    check.add_argument("-o", "--output", help="file to write (default: print)")
    check.set_defaults(run=run_check)


def _diff_command(commands) -> None:
    diff = commands.add_parser(
        "diff", help="what changed between two revisions of a site file",
        epilog=DIFF_EXIT_CODES)
    diff.add_argument("old", help="the site file reviewed before (TOML)")
    diff.add_argument("new", help="the revised site file (TOML)")
    diff.add_argument("--design", action="store_true",
                      help="lay out braces in both for walls that need them and have none")
    diff.add_argument("--json", action="store_true", help="print one JSON object")
    diff.set_defaults(run=run_diff)


def _verify_command(commands) -> None:
    verify = commands.add_parser(
        "verify", help="reproduce the published worked examples and table values on this "
                       "installation")
    verify.add_argument("--json", action="store_true", help="print one JSON object")
    verify.set_defaults(run=run_verify)


def _schema_command(commands) -> None:
    schema = commands.add_parser("schema", help="print the JSON schema of the site file")
    schema.set_defaults(run=run_schema)


def _schedule_command(commands) -> None:
    schedule = commands.add_parser("schedule", help="print the crew's brace schedule")
    schedule.add_argument("site", help="site file (TOML)")
    schedule.add_argument("--day", type=int, help="one day (default: every day)")
    schedule.add_argument("--format", choices=["html", "csv", "text"],
                          help="text (default on the terminal), csv, or html (with -o only; "
                               "default for -o FILE.html)")
    schedule.add_argument("-o", "--output", help="file to write (default: print)")
    schedule.add_argument("--design", action="store_true",
                          help="lay out braces for walls that need them and have none")
    schedule.add_argument("--units", choices=["us", "si"],
                          help="units of the output (default: the site's [site] units, else us)")
    schedule.set_defaults(run=run_schedule)


def _plan_command(commands) -> None:
    plan = commands.add_parser("plan", help="draw the site plan of a day as SVG")
    plan.add_argument("site", help="site file (TOML)")
    plan.add_argument("--day", type=int, help="the day to draw (default: the busiest)")
    plan.add_argument("-o", "--output", help="SVG file to write (default: print)")
    plan.add_argument("--design", action="store_true",
                      help="lay out braces for walls that need them and have none")
    plan.add_argument("--units", choices=["us", "si"],
                      help="units of the drawing (default: the site's [site] units, else us)")
    plan.set_defaults(run=run_plan)


def _tui_command(commands) -> None:
    tui = commands.add_parser("tui", help="open the terminal interface")
    tui.add_argument("site", nargs="?", help="site file (default: a demo site)")
    tui.set_defaults(run=run_tui)


def run_panel(args) -> int:
    data = panel_site(args)
    try:
        site = Site.model_validate(data)
    except ValidationError as exc:
        raise BadInput("; ".join(flag_problem(e) for e in exc.errors())) from None
    result = evaluate(site)
    p = result.panels[0]
    if args.json:
        print(json_view.dumps(json_view.panel_record(p, result.basis, result.caution)))
    else:
        from bracing.report import text  # the text views only where printed

        units = args.units or "us"
        lines = ([result.caution, ""] + result.basis_statement + [""]
                 + text.panel_text(p, units) + ["", result.caution])
        print("\n".join(text.wrap(text.localize(line, units)) for line in lines))
    return EXIT_FAILS if p.fails else 0


def run_backfill(args) -> int:
    """`bracing backfill`: one foundation wall backfilled before the floor (method notes §12)."""
    try:
        record = backfill_view.evaluate(args)
    except backfill_view.FlagError as exc:
        raise BadInput(str(exc)) from None
    if args.svg:  # the section sketch, written quietly: stdout stays the text or the JSON
        try:
            scenario.atomic_write(Path(args.svg), backfill_view.section_svg(args, record))
        except OSError as exc:
            raise BadInput(f"--svg {args.svg}: not written ({exc.strerror or exc})") from None
    print(backfill_view.dumps(record) if args.json else backfill_view.text(record))
    return 0 if record["passes"] else EXIT_FAILS


def run_check(args) -> int:
    if args.format == "html" and not args.findings:
        raise BadInput("--format html needs --findings")
    if args.findings and args.json:
        raise BadInput("choose one of --findings and --json")
    site_file = scenario.load(args.site)
    result = _evaluate(site_file, args.site, args.design)
    units = args.units or site_file.site.site.units
    if args.json or args.findings:
        review = json_view.review_record(site_file.site, result, review_facts(args.site))
    if args.json and not args.output:  # streamed: a large site's text is never whole in memory
        json_view.write(json_view.site_record(result, review), sys.stdout)
        return verdict(result)
    if args.json:
        out = json_view.dumps(json_view.site_record(result, review))
    elif args.findings:
        from bracing.report import findings

        render = findings.render_html if args.format == "html" else findings.render_text
        out = render(result, review, units)
    else:
        from bracing.report import text

        out = text.site_text(result, units)
    return _write(args.output, out) or verdict(result)


def _evaluate(site_file: scenario.SiteFile, path: str, design: bool):
    """The site checked, its forecast file read first beside the site file (the edge)."""
    site = site_file.site
    return evaluate(site, design=design, forecast=site_forecast(site, Path(path).parent))


def verdict(result) -> int:
    """The exit code of a checked site (design.md §8a): SiteResult.fails is the one test."""
    return EXIT_FAILS if result.fails else 0


def review_facts(path: str) -> dict:
    """What makes a review record traceable: the file's SHA-256 (as `sha256sum` gives it), the
    tool's version, the date (UTC)."""
    from datetime import datetime
    from importlib.metadata import PackageNotFoundError, version

    try:
        digest = hashlib.sha256(Path(path).read_bytes()).hexdigest()
    except OSError as exc:
        raise BadInput(f"{path}: cannot read the file ({exc.strerror})") from None
    try:
        tool_version = version(DISTRIBUTION)
    except PackageNotFoundError:
        tool_version = "unknown (not installed as a package)"
    return {"site_file": str(path), "site_file_sha256": digest, "tool": DISTRIBUTION,
            "tool_version": tool_version,
            "date_utc": datetime.now(UTC).isoformat(timespec="seconds")}


DISTRIBUTION = "wall-bracing"  # pyproject.toml [project] name


def run_diff(args) -> int:
    from bracing import diff

    old_file, new_file = scenario.load(args.old), scenario.load(args.new)
    old = _evaluate(old_file, args.old, args.design)
    new = _evaluate(new_file, args.new, args.design)
    changes = diff.compare(old_file.site, old, new_file.site, new)
    if args.json:
        print(json_view.dumps(changes.as_dict()))
    else:
        print(diff.render_text(changes, args.old, args.new))
    return EXIT_FAILS if changes.fails else 0


def run_verify(args) -> int:
    from bracing import verification

    outcomes = verification.run()
    if args.json:
        print(json_view.dumps(verification.record(outcomes)))
    else:
        print(verification.render_text(outcomes))
    return EXIT_FAILS if any(not o.passes for o in outcomes) else 0


def run_schedule(args) -> int:
    from bracing.report import schedule

    site_file = scenario.load(args.site)
    result = _evaluate(site_file, args.site, args.design)
    form = args.format or ("text" if not args.output else
                           "csv" if args.output.lower().endswith(".csv") else
                           "text" if args.output.lower().endswith(".txt") else "html")
    if form == "html" and not args.output:
        raise BadInput("--format html: the printed sheet is written to a file; give -o FILE.html")
    try:
        text_out = schedule.render(site_file.site, result, args.day, form,
                                   args.units or site_file.site.site.units)
    except schedule.NoSuchDay as exc:
        raise BadInput(f"--day: {exc}") from None
    return _write(args.output, text_out) or verdict(result)


def run_plan(args) -> int:
    from bracing.report import svg

    site_file = scenario.load(args.site)
    result = _evaluate(site_file, args.site, args.design)
    try:
        drawing = svg.plan_svg(result, args.day, units=args.units or site_file.site.site.units)
    except ValueError as exc:
        raise BadInput(f"--day: {exc}") from None
    return _write(args.output, drawing) or verdict(result)


def run_tui(args) -> int:
    from tui.app import run

    return run(args.site)


def _write(output: str | None, text: str) -> int:
    """Print, or write atomically to `output` keeping the previous file (`scenario.atomic_write`;
    `main` has refused outputs onto the run's inputs); a failed write is exit 2 with its reason."""
    if output:
        try:
            scenario.atomic_write(Path(output), text)
        except OSError as exc:
            raise BadInput(f"-o {output}: not written ({exc.strerror or exc})") from None
        print(f"wrote {output}")
    else:
        print(text)
    return 0


def run_schema(args) -> int:
    print(json.dumps(Site.model_json_schema(), indent=2))
    return 0


if __name__ == "__main__":
    sys.exit(main())

