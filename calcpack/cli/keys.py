"""``calcpack keys new``: a self-signed certificate and password-protected PKCS#12 key file."""

from __future__ import annotations

import argparse
from typing import Any


def register(subparsers: Any) -> None:
    """Add the ``keys`` command."""
    parser = subparsers.add_parser(
        "keys",
        help="make signing keys",
        description="Make signing keys for in-house or demo use.",
    )
    sub = parser.add_subparsers(dest="keys_command", metavar="ACTION", required=True)
    new = sub.add_parser(
        "new",
        help="a self-signed certificate and a password-protected PKCS#12 key file",
        description=(
            "Make a self-signed certificate (NAME.crt, hand it to whoever verifies) and a "
            "password-protected PKCS#12 key file (NAME.p12). The password is read from the "
            "environment variable CALCPACK_KEY_PASSWORD, else asked for twice; it is never "
            "taken from the command line and never written anywhere."
        ),
    )
    new.add_argument("--name", required=True, help="the signer's full name")
    new.add_argument(
        "--role", required=True, choices=("preparer", "checker", "approver"), help="sign-off role"
    )
    new.add_argument("--firm", help="the signer's firm")
    new.add_argument("--email", help="the signer's e-mail address")
    new.add_argument("--days", type=int, default=365, help="validity in days (default 365)")
    new.add_argument("--out", default=".", help="directory for the files (default: here)")
    new.add_argument("--force", action="store_true", help="replace existing files")
    new.set_defaults(func=_new)


def _new(args: argparse.Namespace) -> int:
    from calcpack.signing.keys import new_self_signed, read_password

    password = read_password("Password for the new key: ", confirm=True)
    files = new_self_signed(
        args.out,
        name=args.name,
        role=args.role,
        password=password,
        firm=args.firm,
        email=args.email,
        days=args.days,
        overwrite=args.force,
    )
    print(f"Key file:    {files.key}")
    print(f"Certificate: {files.certificate}  (give this to whoever verifies your signatures)")
    return 0
