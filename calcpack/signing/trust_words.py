"""Words for the terminal: why a signer is or is not trusted at the moment checked."""

from __future__ import annotations

import datetime as dt
from typing import Any

from calcpack.signing.keys import certificate_name

__all__ = ["outside_validity", "trust_words"]

_TRUST_WORDS = {
    "NO_CERTIFICATE_CHAIN_FOUND": "untrusted: no chain to a trusted root",
    "EXPIRED": "expired certificate",
    "OUT_OF_BOUNDS_NO_POE": "expired certificate (outside its validity, no proof of time)",
    "OUT_OF_BOUNDS_NOT_REVOKED": "expired certificate (outside its validity)",
    "NOT_YET_VALID": "certificate not yet valid",
    "REVOKED": "revoked certificate",
    "REVOKED_NO_POE": "revoked certificate",
    "REVOKED_CA_NO_POE": "issuer certificate revoked",
    "CHAIN_CONSTRAINTS_FAILURE": "certificate chain constraints not met (e.g. key usage)",
    "CERTIFICATE_CHAIN_GENERAL_FAILURE": "certificate chain could not be validated",
}


def trust_words(status: Any, trusted: bool) -> str:
    if trusted:
        path = status.validation_path
        root = certificate_name(path[0]) if path is not None else "?"
        return f"trusted (root: {root})"
    indic = status.trust_problem_indic
    name = getattr(indic, "name", None)
    if name in _TRUST_WORDS:
        details = getattr(status, "revocation_details", None)
        since = f" (revoked {details.revocation_date:%Y-%m-%d %H:%M} UTC)" if details else ""
        return _TRUST_WORDS[name] + since
    return f"untrusted ({name.lower().replace('_', ' ') if name else 'no trust path'})"


def outside_validity(cert: Any, moment: dt.datetime) -> str | None:
    validity = cert["tbs_certificate"]["validity"]
    start, end = validity["not_before"].native, validity["not_after"].native
    if moment > end:
        return f"expired certificate (valid until {end:%Y-%m-%d %H:%M} UTC)"
    if moment < start:
        return f"certificate not yet valid (valid from {start:%Y-%m-%d %H:%M} UTC)"
    return None
