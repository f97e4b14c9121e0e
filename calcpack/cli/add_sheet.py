"""``calcpack add-sheet TEMPLATE``: add a sheet made from a starting template to a project."""

from __future__ import annotations

import argparse
from pathlib import Path
from typing import Any

__all__ = ["register"]


def register(subparsers: Any) -> None:
    """Add the ``add-sheet`` command."""
    parser = subparsers.add_parser(
        "add-sheet",
        help="add a sheet from a template (calcpack add-sheet --list names them)",
        description="Add a sheet notebook (and its inputs file) made from a starting template "
        "to the project, and list it in calcpack.toml.",
    )
    parser.add_argument(
        "template",
        metavar="TEMPLATE",
        nargs="?",
        help="template name; omit with --list to see them",
    )
    parser.add_argument("--title", help="sheet title (default: the template's name)")
    parser.add_argument("--name", help="file name after the sheet number (default: the title)")
    parser.add_argument("--project", default=".", help="project folder (default: here)")
    parser.add_argument("--list", action="store_true", help="list the templates and stop")
    parser.set_defaults(func=handler)


def handler(args: argparse.Namespace) -> int:
    """Run ``calcpack add-sheet``."""
    from calcpack.errors import InputError
    from calcpack.package.sheet_templates import add_sheet, sheet_template_names

    if args.list:
        print("\n".join(sheet_template_names()))
        return 0
    if not args.template:
        raise InputError(
            "add-sheet needs a TEMPLATE (one of " + ", ".join(sheet_template_names()) + ")",
            name="TEMPLATE",
            value=None,
            expected="a template name",
        )
    added = add_sheet(Path(args.project), args.template, title=args.title, name=args.name)
    print(f"Added sheet {added.number}: {added.notebook.as_posix()}")
    if added.inputs is not None:
        print(f"  inputs: {added.inputs.as_posix()}")
    return 0
