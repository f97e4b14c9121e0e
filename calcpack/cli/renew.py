"""``calcpack renew-timestamp``: add a fresh document timestamp to a signed package."""

from __future__ import annotations

import argparse
from typing import Any


def register(subparsers: Any) -> None:
    """Add the ``renew-timestamp`` command."""
    parser = subparsers.add_parser(
        "renew-timestamp",
        help="add a fresh document timestamp to a signed package (before the last one expires)",
        description=(
            "Add the validation data of the package's newest timestamp and a new document "
            "timestamp from the timestamp server (--timestamp-url or CALCPACK_TIMESTAMP_URL), "
            "as an incremental update: the signatures stay as they are. Run it for an issued "
            "package before the certificate of its newest timestamp expires, so that it stays "
            "verifiable."
        ),
    )
    parser.add_argument("package", help="the signed package PDF")
    parser.add_argument("--timestamp-url", help="RFC 3161 timestamp server URL")
    parser.add_argument(
        "--trust",
        action="append",
        default=[],
        metavar="CERT",
        help="root certificate of the earlier timestamps (repeatable)",
    )
    parser.add_argument("--out", help="write here instead of replacing PACKAGE")
    parser.set_defaults(func=_renew)


def _renew(args: argparse.Namespace) -> int:
    from calcpack.signing.longterm import renew_timestamp

    result = renew_timestamp(
        args.package, timestamp_url=args.timestamp_url, trust=tuple(args.trust), out=args.out
    )
    when = f"{result.time:%Y-%m-%d %H:%M:%S} UTC" if result.time else "unknown time"
    print(
        f"Added a document timestamp ({when}) to {result.output}; it carried "
        f"{result.previous} before"
    )
    return 0
