"""``calcpack demo``: build the bundled example project into a folder here and print the PDF.

The command is a sequence of steps: copy the demo project, build it, then the steps after the
build (``AFTER_BUILD``: signing as preparer and checker with demo certificates).
"""

from __future__ import annotations

import argparse
from collections.abc import Callable
from pathlib import Path
from typing import Any

from calcpack.cli.build import add_build_options, progress_reporter

__all__ = ["AFTER_BUILD", "DEFAULT_FOLDER", "register", "run_demo"]

DEFAULT_FOLDER = "calcpack-demo"

AfterBuild = Callable[[Any, Path, argparse.Namespace], None]


def _sign(result: Any, folder: Path, args: argparse.Namespace) -> None:
    from calcpack.signing.demo import after_build_sign

    after_build_sign(result, folder, args)


AFTER_BUILD: list[AfterBuild] = [_sign]
"""Steps run on the build result (BuildResult, demo folder, arguments): signing by the demo
preparer and checker (calcpack.signing.demo)."""


def register(subparsers: Any) -> None:
    """Add the ``demo`` command."""
    parser = subparsers.add_parser(
        "demo",
        help="build and sign the bundled demo package in ./calcpack-demo",
        description="Copy the bundled demo project into a folder in the current directory, "
        "build its calc package there and print the path of the PDF.",
    )
    parser.add_argument(
        "--dir",
        default=DEFAULT_FOLDER,
        metavar="DIR",
        help=f"folder to build in (default ./{DEFAULT_FOLDER})",
    )
    add_build_options(parser)
    parser.set_defaults(func=handler)


def run_demo(
    folder: Path,
    *,
    workers: int = 2,
    timeout: float = 120.0,
    use_cache: bool = True,
    paper: str | None = None,
    report: Any = None,
) -> Any:
    """Copy the demo project into ``folder/project`` and build it into ``folder``."""
    from calcpack.package.pipeline import build
    from calcpack.package.scaffold import copy_demo_project

    folder.mkdir(parents=True, exist_ok=True)
    project = copy_demo_project(folder / "project")
    return build(
        project,
        out_dir=folder,
        workers=workers,
        timeout=timeout,
        use_cache=use_cache,
        paper=paper,
        report=report,
        supersede_signed=True,  # a demo package signed by an earlier run is moved aside
    )


def handler(args: argparse.Namespace) -> int:
    """Run ``calcpack demo``."""
    folder = Path(args.dir).resolve()
    with progress_reporter(args.quiet) as report:
        result = run_demo(
            folder,
            workers=args.workers,
            timeout=args.timeout,
            use_cache=not args.no_cache,
            paper=args.paper,
            report=report,
        )
    for step in AFTER_BUILD:
        step(result, folder, args)
    print(f"Demo project: {folder / 'project'}")
    print(f"Manifest: {result.manifest_path}")
    print(f"Package: {result.pdf_path}")
    return 0
