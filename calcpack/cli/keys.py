"""``calcpack keys new``: a self-signed certificate and password-protected PKCS#12 key file."""

from __future__ import annotations

import argparse
from pathlib import Path
from typing import Any

from calcpack.signing.authority import AUTHORITY_DAYS, CRL_DAYS
from calcpack.signing.keys import DEFAULT_VALIDITY_DAYS, MIN_PASSWORD_LENGTH

#: Environment variable read for the authority's password before falling back to a prompt.
AUTHORITY_ENV = "CALCPACK_AUTHORITY_PASSWORD"


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
    new.add_argument(
        "--authority",
        metavar="AUTHORITY.p12",
        help="issue the key from the firm's authority (calcpack keys authority) instead of "
        f"self-signing it, so that it can be revoked; its password is read from ${AUTHORITY_ENV}",
    )
    new.add_argument(
        "--crl-url",
        metavar="URL",
        help="with --authority: where the firm publishes its revocation list; written into the "
        "certificate so that signing fetches the list",
    )
    new.set_defaults(func=_new)
    ca = sub.add_parser(
        "authority",
        help="the firm's certificate authority, which issues keys and revokes them",
        description=(
            "Make the firm's certificate authority: FIRM-authority.p12 (its key: keep it "
            "offline), FIRM-authority.crt (the trust root to give whoever verifies) and "
            "FIRM-authority.crl (its revocation list). Its password is read from "
            f"${AUTHORITY_ENV}, else asked for twice."
        ),
    )
    ca.add_argument("--firm", required=True, help="the firm's name")
    ca.add_argument(
        "--days",
        type=int,
        default=AUTHORITY_DAYS,
        help=f"validity of the authority in days (default {AUTHORITY_DAYS})",
    )
    ca.add_argument("--out", default=".", help="directory for the files (default: here)")
    ca.add_argument("--force", action="store_true", help="replace existing authority files")
    ca.set_defaults(func=_authority)
    crl = sub.add_parser(
        "crl",
        help="issue a fresh revocation list, revoking keys",
        description=(
            "Issue the authority's revocation list anew (beside its key file, same name .crl): "
            "every key revoked before, plus those given with --revoke. Issue one before the "
            "current list's next update, and sign with the current one (calcpack sign --crl)."
        ),
    )
    crl.add_argument("--authority", required=True, metavar="AUTHORITY.p12")
    crl.add_argument(
        "--revoke",
        action="append",
        default=[],
        metavar="CERT",
        help="certificate of a key to revoke from now on (repeatable)",
    )
    crl.add_argument(
        "--days", type=int, default=CRL_DAYS, help=f"days until the next list (default {CRL_DAYS})"
    )
    crl.set_defaults(func=_crl)


def _new(args: argparse.Namespace) -> int:
    from calcpack.signing.keys import check_new_password, new_self_signed, read_password

    password = check_new_password(
        read_password(
            f"Password for the new key (at least {MIN_PASSWORD_LENGTH} characters): ",
            confirm=True,
        )
    )
    who: dict[str, Any] = {
        "name": args.name,
        "role": args.role,
        "password": password,
        "firm": args.firm,
        "email": args.email,
        "days": args.days,
        "overwrite": args.force,
    }
    if args.authority:
        from calcpack.signing.authority import issue_key

        files = issue_key(
            args.authority,
            _authority_password(f"Password for the authority {args.authority}: "),
            args.out,
            crl_url=args.crl_url,
            **who,
        )
    else:
        if args.crl_url:
            from calcpack.errors import InputError

            raise InputError(
                "--crl-url needs --authority: a self-signed key has no authority to revoke it",
                name="crl-url",
                value=args.crl_url,
            )
        files = new_self_signed(args.out, **who)
    print(f"Key file:    {files.key}")
    if args.authority:
        root = Path(args.authority).with_suffix(".crt")
        print(f"Certificate: {files.certificate}")
        print(f"Issued by:   {args.authority} (it can revoke the key: calcpack keys crl)")
        print(f"Trust root:  {root}  (give this to whoever verifies your signatures)")
    else:
        print(f"Certificate: {files.certificate}  (give this to whoever verifies your signatures)")
    from calcpack.signing.keys import load_certificates

    (cert,) = load_certificates([files.certificate])
    end = cert["tbs_certificate"]["validity"]["not_after"].native
    print(f"Valid until: {end:%Y-%m-%d} ({args.days} days)")
    return 0


def _authority_password(prompt: str, *, confirm: bool = False) -> str:
    """The authority's password from ``$CALCPACK_AUTHORITY_PASSWORD``, else a prompt."""
    import os

    from calcpack.signing.keys import PASSWORD_ENV, read_password

    value = os.environ.get(AUTHORITY_ENV)
    if value is not None:
        if not value:
            from calcpack.errors import SigningError

            raise SigningError(f"The authority password in ${AUTHORITY_ENV} is empty")
        return value
    saved = os.environ.pop(PASSWORD_ENV, None)  # the prompt, not the signer's key password
    try:
        return read_password(prompt, confirm=confirm)
    finally:
        if saved is not None:
            os.environ[PASSWORD_ENV] = saved


def _authority(args: argparse.Namespace) -> int:
    from calcpack.signing.authority import new_authority
    from calcpack.signing.keys import check_new_password

    password = check_new_password(
        _authority_password(
            f"Password for the new authority (at least {MIN_PASSWORD_LENGTH} characters): ",
            confirm=True,
        )
    )
    files = new_authority(
        args.out, firm=args.firm, password=password, days=args.days, overwrite=args.force
    )
    print(f"Authority key file: {files.key}  (keep it offline; it issues and revokes keys)")
    print(f"Trust root:         {files.certificate}  (give this to whoever verifies)")
    print(f"Revocation list:    {files.crl}  (none revoked; sign with --crl {files.crl})")
    print(f"Valid for {args.days} days; issue keys with calcpack keys new --authority {files.key}")
    return 0


def _crl(args: argparse.Namespace) -> int:
    from calcpack.signing.authority import issue_crl

    listing = issue_crl(
        args.authority,
        _authority_password(f"Password for the authority {args.authority}: "),
        revoke=args.revoke,
        days=args.days,
    )
    print(f"Revocation list: {listing.path}, {len(listing.revoked)} key(s) revoked")
    for holder, serial, when in listing.revoked:
        print(f"    {holder} (serial {serial:x}) since {when:%Y-%m-%d %H:%M} UTC")
    print(f"Next list due by {listing.next_update:%Y-%m-%d} (calcpack keys crl again)")
    return 0
