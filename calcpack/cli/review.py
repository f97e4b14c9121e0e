"""``calcpack review``: the checker's comments, kept in review.toml beside the notebooks."""

from __future__ import annotations

import argparse
import getpass
import os
from typing import Any

#: Environment variable with the name recorded as "who" when --by is not given.
USER_ENV = "CALCPACK_USER"


def register(subparsers: Any) -> None:
    """Add the ``review`` command."""
    parser = subparsers.add_parser(
        "review",
        help="add, answer, close and list review comments",
        description="Review comments of a project, stored in review.toml beside the notebooks.",
    )
    sub = parser.add_subparsers(dest="review_command", metavar="ACTION", required=True)

    def common(p: argparse.ArgumentParser) -> None:
        p.add_argument("--project", default=".", help="project directory (default: here)")
        p.add_argument("--by", help=f"your name (default: ${USER_ENV} or your login name)")

    add = sub.add_parser("add", help="open a comment on a sheet")
    add.add_argument("sheet", help="the sheet notebook, relative to the project directory")
    add.add_argument("text", help="the comment")
    add.add_argument("--quantity", help="the quantity the comment is about (e.g. M_max)")
    common(add)
    add.set_defaults(func=_add)

    for action, helptext in (
        ("answer", "answer a comment"),
        ("close", "close a comment (answer accepted, or withdrawn)"),
        ("reopen", "reopen a comment"),
    ):
        p = sub.add_parser(action, help=helptext)
        p.add_argument("id", help="comment id, e.g. C3")
        p.add_argument("text", nargs="?" if action == "close" else None, default="")
        common(p)
        p.set_defaults(func=_transition, action=action)

    listing = sub.add_parser("list", help="print the review log")
    listing.add_argument("--open", action="store_true", help="only comments not closed")
    listing.add_argument("--project", default=".", help="project directory (default: here)")
    listing.set_defaults(func=_list)


def _who(args: argparse.Namespace) -> str:
    return str(args.by or os.environ.get(USER_ENV) or getpass.getuser())


def _add(args: argparse.Namespace) -> int:
    from calcpack.signing.review import add_comment

    c = add_comment(
        args.project, sheet=args.sheet, text=args.text, who=_who(args), quantity=args.quantity
    )
    print(f"{c.id} opened on {c.sheet}" + (f", {c.quantity}" if c.quantity else ""))
    return 0


def _transition(args: argparse.Namespace) -> int:
    from calcpack.signing import review

    func = {
        "answer": review.answer_comment,
        "close": review.close_comment,
        "reopen": review.reopen_comment,
    }[args.action]
    c = func(args.project, args.id, text=args.text or "", who=_who(args))
    print(f"{c.id} is now {c.status}")
    return 0


def _list(args: argparse.Namespace) -> int:
    from calcpack.signing.review import load_review

    print(load_review(args.project).text(include_closed=not args.open))
    return 0
