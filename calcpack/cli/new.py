"""``calcpack new PROJECT``: scaffold a project folder with a project file and one sheet."""

from __future__ import annotations

import argparse
from pathlib import Path
from typing import Any

__all__ = ["register"]


def register(subparsers: Any) -> None:
    """Add the ``new`` command."""
    parser = subparsers.add_parser(
        "new",
        help="start a new project folder with one sheet",
        description="Create PROJECT with a calcpack.toml to fill in and one sheet notebook.",
    )
    parser.add_argument("project", metavar="PROJECT", help="folder to create")
    parser.add_argument("--job-number", default="0000", help="job number (default 0000)")
    parser.add_argument("--title", default="New job", help="job title")
    parser.add_argument("--units", choices=("SI", "US"), default="SI", help="unit system")
    parser.add_argument("--paper", choices=("A4", "Letter"), default="A4", help="paper size")
    parser.add_argument(
        "--sheet",
        metavar="TEMPLATE",
        help="also add a sheet from a template (beam, section, ...) with its inputs file",
    )
    parser.set_defaults(func=handler)


def handler(args: argparse.Namespace) -> int:
    """Run ``calcpack new``."""
    from calcpack.package.scaffold import new_project

    project_file = new_project(
        Path(args.project),
        number=args.job_number,
        title=args.title,
        units=args.units,
        paper=args.paper,
    )
    print(f"Created {project_file}")
    if args.sheet:
        from calcpack.package.sheet_templates import add_sheet

        added = add_sheet(Path(args.project), args.sheet)
        print(f"Added sheet {added.number}: {added.notebook.as_posix()}")
    print(f"Edit it, write the sheets in JupyterLab, then: calcpack build {args.project}")
    return 0
