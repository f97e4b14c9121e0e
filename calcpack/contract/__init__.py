"""The record and manifest contract: what the build, signing, verification, revision
comparison, panels and the summary of checks all read -- one definition each.

- :mod:`~calcpack.contract.verdict`: the :class:`Verdict` words and the one pass rule.
- :mod:`~calcpack.contract.records`: :class:`Record`, :class:`CheckRecord`, the records
  mimetype and :func:`collect_records` (reading them back from an executed notebook).
- :mod:`~calcpack.contract.manifest`: :class:`Manifest`, its format version and JSON form.
- :mod:`~calcpack.contract.compare`: :func:`diff_manifests`, the comparison of two manifests.

This package sits at the bottom of calcpack: it imports only the standard library and
:mod:`calcpack.errors`.
"""

from __future__ import annotations

from calcpack.contract.compare import REL_TOL, Change, ManifestDiff, diff_manifests
from calcpack.contract.manifest import (
    MANIFEST_FORMAT,
    MANIFEST_FORMAT_PREFIX,
    MANIFEST_NAME,
    Manifest,
    check_manifest,
    is_manifest,
    manifest_bytes,
)
from calcpack.contract.records import (
    RECORDS_MIMETYPE,
    CheckRecord,
    Record,
    SheetRecords,
    collect_records,
)
from calcpack.contract.verdict import PASS_TOLERANCE, Verdict, check_sort_key, passes

__all__ = [
    "MANIFEST_FORMAT",
    "MANIFEST_FORMAT_PREFIX",
    "MANIFEST_NAME",
    "PASS_TOLERANCE",
    "RECORDS_MIMETYPE",
    "REL_TOL",
    "Change",
    "CheckRecord",
    "Manifest",
    "ManifestDiff",
    "Record",
    "SheetRecords",
    "Verdict",
    "check_manifest",
    "check_sort_key",
    "collect_records",
    "diff_manifests",
    "is_manifest",
    "manifest_bytes",
    "passes",
]
