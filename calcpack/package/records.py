"""The sheet records the build collects (the contract lives in :mod:`calcpack.contract`).

Kept so existing imports (``from calcpack.package.records import collect_records``) work.
"""

from __future__ import annotations

from calcpack.contract.records import RECORDS_MIMETYPE, SheetRecords, collect_records
from calcpack.contract.verdict import check_sort_key

__all__ = ["RECORDS_MIMETYPE", "SheetRecords", "check_sort_key", "collect_records"]
