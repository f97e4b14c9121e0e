"""``calcpack diff``: what changed between two revisions of a package."""

from __future__ import annotations

import argparse
from typing import Any


def register(subparsers: Any) -> None:
    """Add the ``diff`` command."""
    parser = subparsers.add_parser(
        "diff",
        help="list changed inputs, results and verdicts between two packages",
        description=(
            "Compare the manifests of two packages (PDFs), two manifest JSON files or two "
            "project directories, and print the changed inputs, results and check verdicts "
            "per sheet with old and new values."
        ),
    )
    parser.add_argument("old", help="the earlier package, manifest or project directory")
    parser.add_argument("new", help="the later package, manifest or project directory")
    parser.set_defaults(func=_diff)


def _diff(args: argparse.Namespace) -> int:
    from calcpack.signing.diff import diff_packages

    print(diff_packages(args.old, args.new).table())
    return 0
