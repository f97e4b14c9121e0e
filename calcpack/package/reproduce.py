"""The archive check: re-execute a project's sheets and compare them with a signed package.

:func:`reproduce_manifest` re-executes every sheet (no cache) and returns the manifest's
records afresh; :func:`verify_package` is signing's verification
(:func:`calcpack.signing.verify.verify_package`) with this reproducer passed in. The build
depends on signing (it reads the review log and refuses to replace a signed package); signing
never imports the build, so the reproducer reaches it as an argument.
"""

from __future__ import annotations

import os
from collections.abc import Iterable
from pathlib import Path
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    from calcpack.signing.verify import Reproducer, VerifyReport

__all__ = ["reproduce_manifest", "verify_package"]


def reproduce_manifest(project: str | Path, *, workers: int = 2) -> dict[str, Any]:
    """Re-execute every sheet (no cache) and return the manifest's ``sheets`` records afresh.

    The archive check: the result is comparable with a package's manifest (same keys for each
    sheet: number, title, path, values, checks, assumptions, cautions; the links between
    sheets, each with the value it carried; the checker's independent checks, compared again).
    """
    import nbformat

    from calcpack.contract.manifest import Manifest
    from calcpack.contract.records import collect_records
    from calcpack.package.document import SheetDoc
    from calcpack.package.execute import execute_sheets
    from calcpack.package.links import link_records
    from calcpack.package.manifest import sheet_record
    from calcpack.package.project import load_project
    from calcpack.package.sheetdoc import sheet_title
    from calcpack.package.verification import compare_verifications

    loaded = load_project(project)
    found = []
    links: list[dict[str, Any]] = []
    for item in execute_sheets(loaded, workers=workers, use_cache=False):
        nb = nbformat.reads(item.notebook_json, as_version=4)
        records = collect_records(nb)
        title = sheet_title(item.entry, nb)
        found.append(
            (sheet_record(item.entry, title, records), SheetDoc(item.entry, title, "", records))
        )
        links += link_records(item.entry.path, records.imports)
    compared = compare_verifications(loaded, [doc for _, doc in found])
    return Manifest(
        sheets=tuple(s for s, _ in found),
        links=tuple(links),
        verifications=tuple(c.to_json() for c in compared),
    ).to_json()


def verify_package(
    pdf: str | os.PathLike[str],
    trust: Iterable[str | os.PathLike[str]] = (),
    *,
    reproducer: Reproducer | None = None,
    **options: Any,
) -> VerifyReport:
    """Verify a signed calc package: :func:`calcpack.signing.verify.verify_package`, whose
    arguments ``options`` are (``project``, ``reproduce``, ``at``, ``require``...); with
    ``reproduce=True`` the sheets in ``project`` are executed again by
    :func:`reproduce_manifest` unless another ``reproducer`` is given."""
    from calcpack.signing.verify import verify_package as verify

    return verify(pdf, trust, reproducer=reproducer or reproduce_manifest, **options)
