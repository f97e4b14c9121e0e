"""``calcpack build PROJECT``: execute the sheets and write the paginated PDF and manifest."""

from __future__ import annotations

import argparse
from collections.abc import Iterator, Sequence
from contextlib import contextmanager
from pathlib import Path
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    from calcpack.package.pipeline import SheetTime

__all__ = ["add_build_options", "progress_reporter", "register", "timeline_lines"]

_BAR = 24
"""Width of the timeline's bars, in characters."""


def _seconds(text: str) -> float:
    """``--timeout``: a positive number of seconds (0 or less would never stop a cell)."""
    import math

    try:
        value = float(text)
    except ValueError:
        value = math.nan
    if not (math.isfinite(value) and value > 0):
        raise argparse.ArgumentTypeError(
            f"must be a positive number of seconds (got --timeout {text})"
        )
    return value


def add_build_options(parser: argparse.ArgumentParser) -> None:
    """Options shared by ``build`` and ``demo``."""
    parser.add_argument(
        "--workers",
        type=int,
        default=2,
        metavar="N",
        help="worker processes executing sheets (default 2)",
    )
    parser.add_argument(
        "--timeout",
        type=_seconds,
        default=120.0,
        metavar="SECONDS",
        help="time limit per cell (default 120 s)",
    )
    parser.add_argument(
        "--no-cache", action="store_true", help="execute every sheet even if unchanged"
    )
    parser.add_argument(
        "--paper",
        choices=("A4", "Letter"),
        default=None,
        help="paper size (default: the project file's)",
    )
    parser.add_argument("--quiet", action="store_true", help="no progress display (for CI)")


def register(subparsers: Any) -> None:
    """Add the ``build`` command."""
    parser = subparsers.add_parser(
        "build",
        help="build the calc package (PDF + manifest) of a project",
        description="Execute every sheet notebook of a project (unchanged sheets come from the "
        "cache) and write the paginated PDF and its manifest.",
    )
    parser.add_argument("project", metavar="PROJECT", help="project folder (or its calcpack.toml)")
    parser.add_argument(
        "--out", metavar="DIR", default=None, help="output folder (default PROJECT/build)"
    )
    parser.add_argument(
        "--reviewer-copy",
        action="store_true",
        help="append the source of every sheet as an appendix",
    )
    parser.add_argument(
        "--force", action="store_true", help="rebuild even when the package is up to date"
    )
    parser.add_argument(
        "--supersede-signed",
        action="store_true",
        help="if the package there is signed and would change, move it into superseded/ beside "
        "it (never deleted) instead of refusing",
    )
    add_build_options(parser)
    parser.set_defaults(func=handler)


@contextmanager
def progress_reporter(quiet: bool) -> Iterator[Any]:
    """A rich progress display naming the sheet being executed and rendered (None if quiet)."""
    if quiet:
        yield None
        return
    from rich.console import Console
    from rich.progress import Progress, SpinnerColumn, TextColumn, TimeElapsedColumn

    console = Console(stderr=True)
    labels = {
        "executing": "Executing",
        "cached": "Unchanged, from cache",
        "executed": "Executed",
        "rendering": "Rendering",
        "layout": "Laying out",
        "writing": "Writing",
    }
    with Progress(
        SpinnerColumn(),
        TextColumn("{task.description}"),
        TimeElapsedColumn(),
        console=console,
        transient=True,
    ) as progress:
        task = progress.add_task("Reading project", total=None)

        def report(stage: str, detail: str) -> None:
            text = f"{labels.get(stage, stage)} {detail}"
            if stage in ("executed", "cached"):
                console.print(f"  {text}")
            else:
                progress.update(task, description=text)

        yield report


def timeline_lines(timeline: Sequence[SheetTime]) -> list[str]:
    """The build's timeline as text, one line per sheet in the order they started: a bar over
    the build's span (sheets run side by side overlap), start and finish in seconds from the
    first start, and the time it took; a sheet read from the cache says so. Empty when no
    sheet ran.
    """
    ran = [t for t in timeline if not t.from_cache]
    if not timeline:
        return []
    width = max(len(t.path) for t in timeline)
    lines = ["Sheet times (seconds from the first sheet's start):"]
    t0 = min((t.started_at for t in ran), default=0.0)
    span = max((t.finished_at for t in ran), default=t0) - t0
    for t in sorted(timeline, key=lambda t: (t.from_cache, t.started_at, t.path)):
        if t.from_cache:
            lines.append(f"  {t.path:<{width}}  {'':{_BAR}}  from cache")
            continue
        a, b = t.started_at - t0, t.finished_at - t0
        lo = int(_BAR * a / span) if span > 0 else 0
        hi = max(lo + 1, round(_BAR * b / span)) if span > 0 else _BAR
        bar = " " * lo + "#" * (min(hi, _BAR) - lo)
        lines.append(f"  {t.path:<{width}}  {bar:<{_BAR}}  {a:6.1f} to {b:6.1f}  ({b - a:.1f} s)")
    return lines


def handler(args: argparse.Namespace) -> int:
    """Run ``calcpack build``."""
    from calcpack.package.pipeline import build

    with progress_reporter(args.quiet) as report:
        result = build(
            Path(args.project),
            out_dir=args.out,
            workers=args.workers,
            timeout=args.timeout,
            use_cache=not args.no_cache,
            paper=args.paper,
            reviewer_copy=args.reviewer_copy,
            force=args.force,
            report=report,
            supersede_signed=args.supersede_signed,
        )
    import sys

    for warning in result.warnings:
        print(f"calcpack: warning: {warning}", file=sys.stderr)
    if result.up_to_date:
        print(f"Up to date: {result.pdf_path}")
    else:
        print(
            f"Wrote {result.pdf_path} ({result.page_count} pages; "
            f"{len(result.executed)} sheets executed, {len(result.cached)} from cache, "
            f"{result.seconds:.1f} s)"
        )
    print(f"Manifest {result.manifest_path}")
    if not args.quiet:
        for line in timeline_lines(result.timeline):
            print(line)
    if result.superseded is not None:
        print(f"The signed package it replaces was moved to {result.superseded}")
    return 0
