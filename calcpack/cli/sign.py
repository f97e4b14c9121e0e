"""``calcpack sign``: sign a package as preparer, checker or approver."""

from __future__ import annotations

import argparse
from typing import Any


def register(subparsers: Any) -> None:
    """Add the ``sign`` command."""
    parser = subparsers.add_parser(
        "sign",
        help="sign a package in its sign-off block",
        description=(
            "Sign a calc package as preparer, checker or approver, with a visible stamp in the "
            "role's box of the sign-off block. The key password is read from the environment "
            "variable CALCPACK_KEY_PASSWORD, else asked for. A timestamp server is used when "
            "--timestamp-url or CALCPACK_TIMESTAMP_URL is set."
        ),
    )
    parser.add_argument("package", help="the package PDF")
    parser.add_argument("--role", required=True, choices=("preparer", "checker", "approver"))
    parser.add_argument("--key", required=True, help="PKCS#12 (.p12/.pfx) or PEM key file")
    parser.add_argument("--cert", help="certificate file, for a PEM key")
    parser.add_argument(
        "--chain",
        action="append",
        default=[],
        metavar="CERT",
        help="issuer certificate to embed when the key file lacks it (repeatable)",
    )
    parser.add_argument("--out", help="write the signed package here (default: replace PACKAGE)")
    parser.add_argument("--reason", help="reason shown in the stamp (a default per role)")
    parser.add_argument("--location", help="where you sign")
    parser.add_argument("--timestamp-url", help="RFC 3161 timestamp server URL")
    parser.add_argument(
        "--project", help="project directory with the review file (checker; default: beside)"
    )
    parser.add_argument(
        "--override-open-comments",
        metavar="REASON",
        help="checker: sign although review comments are not closed; REASON is recorded",
    )
    parser.add_argument(
        "--override-identity",
        metavar="REASON",
        help="sign although the key was made for another role or names another person than "
        "calcpack.toml; REASON is recorded in the signature (one signer never holds two roles)",
    )
    parser.add_argument(
        "--crl",
        action="append",
        default=[],
        metavar="FILE",
        help="the revocation list of the key's authority (calcpack keys crl), stored in the "
        "package so that it shows years later that the key was not revoked (repeatable)",
    )
    parser.set_defaults(func=_sign)


def _sign(args: argparse.Namespace) -> int:
    from calcpack.signing.keys import load_credentials, read_password
    from calcpack.signing.sign import sign_package

    password = read_password(f"Password for {args.key}: ")
    creds = load_credentials(args.key, password, certificate=args.cert, chain=args.chain)
    result = sign_package(
        args.package,
        args.role,
        creds,
        out=args.out,
        reason=args.reason,
        location=args.location,
        timestamp_url=args.timestamp_url,
        project=args.project,
        override_open_comments=args.override_open_comments,
        override_identity=args.override_identity,
        crls=args.crl,
    )
    extra = " with an RFC 3161 timestamp" if result.timestamped else ""
    print(f"Signed as {result.role} by {result.signer}{extra}: {result.output}")
    print(result.revocation)
    if result.identity_override is not None:
        print(f"The identity override is recorded in {result.identity_override}")
    if result.overridden:
        print(
            f"Review comments {', '.join(result.overridden)} were not closed; "
            "the override is recorded in the review log"
        )
    return 0
