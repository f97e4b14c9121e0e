"""Keys, signatures by role and verification of calc packages.

The heavy libraries (pyHanko, cryptography, fontTools) are imported inside the functions, so
importing this package is cheap.
"""

from __future__ import annotations

from calcpack.signing.authority import (
    AuthorityFiles,
    RevocationList,
    issue_crl,
    issue_key,
    new_authority,
)
from calcpack.signing.diff import Change, ManifestDiff, diff_manifests, diff_packages
from calcpack.signing.keys import (
    PASSWORD_ENV,
    ROLES,
    Credentials,
    DemoCredentials,
    KeyFiles,
    load_credentials,
    make_demo_credentials,
    new_self_signed,
    read_password,
)
from calcpack.signing.manifest import MANIFEST_NAME, load_manifest
from calcpack.signing.review import (
    REVIEW_FILE,
    Comment,
    ReviewLog,
    add_comment,
    answer_comment,
    close_comment,
    load_review,
    reopen_comment,
)
from calcpack.signing.sign import TIMESTAMP_URL_ENV, SignResult, sign_package
from calcpack.signing.verify import FileCheck, SignatureReport, VerifyReport, verify_package

__all__ = [
    "MANIFEST_NAME",
    "PASSWORD_ENV",
    "REVIEW_FILE",
    "ROLES",
    "TIMESTAMP_URL_ENV",
    "AuthorityFiles",
    "Change",
    "Comment",
    "Credentials",
    "DemoCredentials",
    "FileCheck",
    "KeyFiles",
    "ManifestDiff",
    "ReviewLog",
    "RevocationList",
    "SignResult",
    "SignatureReport",
    "VerifyReport",
    "add_comment",
    "answer_comment",
    "close_comment",
    "diff_manifests",
    "diff_packages",
    "issue_crl",
    "issue_key",
    "load_credentials",
    "load_manifest",
    "load_review",
    "make_demo_credentials",
    "new_authority",
    "new_self_signed",
    "read_password",
    "reopen_comment",
    "sign_package",
    "verify_package",
]
