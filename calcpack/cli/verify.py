"""``calcpack verify``: check a package's signatures, project files and results."""

from __future__ import annotations

import argparse
import datetime as dt
from typing import Any


def register(subparsers: Any) -> None:
    """Add the ``verify`` command."""
    parser = subparsers.add_parser(
        "verify",
        help="verify a package's signatures (and its project files and results)",
        description=(
            "Print, per signature, the signer, role and time, whether the signed bytes are "
            "intact, what was changed after it, and whether the signer is trusted. Exits "
            "non-zero on any failure. Nothing is fetched from the network: only the "
            "certificates given with --trust are trusted."
        ),
    )
    parser.add_argument("package", help="the package PDF")
    parser.add_argument(
        "--trust", action="append", default=[], metavar="CERT", help="trusted root (repeatable)"
    )
    parser.add_argument("--project", help="project directory: check the files' hashes")
    parser.add_argument(
        "--reproduce",
        action="store_true",
        help="re-execute the notebooks in --project and compare every recorded result",
    )
    parser.add_argument(
        "--require",
        metavar="ROLES",
        default="",
        help="comma-separated roles that must have signed, e.g. preparer,checker",
    )
    parser.add_argument(
        "--at",
        metavar="signing-time|DATE",
        help="when no timestamp proves the signing time: check the certificates at the time "
        "each signer claims (signing-time: the signer's claim, not a proof) or at DATE "
        "(e.g. 2031-05-01, UTC)",
    )
    parser.add_argument(
        "--crl",
        action="append",
        default=[],
        metavar="FILE",
        help="a revocation list newer than the one the package stores (calcpack keys crl): a "
        "key revoked before its signature's time fails (repeatable)",
    )
    parser.set_defaults(func=_verify)


def _at(text: str | None) -> dt.datetime | str | None:
    """``--at``: "signing-time" as is, a date or date-time as UTC."""
    from calcpack.errors import InputError

    if text is None or text == "signing-time":
        return text
    try:
        moment = dt.datetime.fromisoformat(text)
    except ValueError:
        raise InputError(
            f"--at must be signing-time or a date such as 2031-05-01 (got --at {text!r})",
            name="at",
            value=text,
            expected="signing-time | YYYY-MM-DD[THH:MM]",
        ) from None
    return moment if moment.tzinfo else moment.replace(tzinfo=dt.UTC)


def _verify(args: argparse.Namespace) -> int:
    from calcpack.package.reproduce import verify_package

    require = tuple(r.strip() for r in args.require.split(",") if r.strip())
    report = verify_package(
        args.package,
        args.trust,
        project=args.project,
        reproduce=args.reproduce,
        require=require,
        at=_at(args.at),
        crls=args.crl,
    )
    print(report.text())
    return 0 if report.ok else 1
