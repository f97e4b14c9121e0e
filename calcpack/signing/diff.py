"""Comparing two packages, manifest files or project directories.

The comparison itself is :func:`calcpack.contract.diff_manifests`; this module adds reading the
manifests from PDFs (re-exporting the comparison's names for existing imports).
"""

from __future__ import annotations

import os

from calcpack.contract.compare import REL_TOL, Change, ManifestDiff, diff_manifests
from calcpack.signing.manifest import load_manifest

__all__ = ["REL_TOL", "Change", "ManifestDiff", "diff_manifests", "diff_packages"]


def diff_packages(
    old: str | os.PathLike[str], new: str | os.PathLike[str], *, rel_tol: float = REL_TOL
) -> ManifestDiff:
    """Compare two packages, manifest files or project directories (see ``load_manifest``).

    Raises:
        VerificationError: either source is not a calcpack package or manifest.
    """
    return diff_manifests(load_manifest(old), load_manifest(new), rel_tol=rel_tol)
