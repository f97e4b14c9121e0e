"""``calcpack keys new``: a self-signed certificate and password-protected PKCS#12 key file."""

from __future__ import annotations

import argparse
from typing import Any

from calcpack.signing.keys import DEFAULT_VALIDITY_DAYS, MIN_PASSWORD_LENGTH


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
    new.add_argument(
        "--days",
        type=int,
        default=DEFAULT_VALIDITY_DAYS,
        help=f"validity of the certificate in days (default {DEFAULT_VALIDITY_DAYS}); "
        "signatures with a timestamp stay verifiable after it",
    )
    new.add_argument("--out", default=".", help="directory for the files (default: here)")
    new.add_argument("--force", action="store_true", help="replace existing key files")
    new.set_defaults(func=_new)


def _new(args: argparse.Namespace) -> int:
    from calcpack.signing.keys import check_new_password, new_self_signed, read_password

    password = check_new_password(
        read_password(
            f"Password for the new key (at least {MIN_PASSWORD_LENGTH} characters): ",
            confirm=True,
        )
    )
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
    from calcpack.signing.keys import load_certificates

    (cert,) = load_certificates([files.certificate])
    end = cert["tbs_certificate"]["validity"]["not_after"].native
    print(f"Valid until: {end:%Y-%m-%d} ({args.days} days)")
    return 0
