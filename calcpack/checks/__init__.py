"""Design checks: one module per design standard behind one small common interface
(:mod:`calcpack.checks.base`): each clause is written once and either computed
(:class:`CheckResult` data) or shown as working with its clause reference.

Modules: :mod:`~calcpack.checks.elastic` (any material with stated allowables),
:mod:`~calcpack.checks.aisc360` (ANSI/AISC 360-16 §F2, §G2, LRFD and ASD),
:mod:`~calcpack.checks.nds` (NDS 2018 sawn lumber, ASD). :func:`summary_table` makes the
sheet-level summary of checks.
"""

from calcpack.checks.aisc360 import AISC360_EDITION, IShape, check_aisc_beam
from calcpack.checks.base import (
    NOT_COVERED,
    NOT_OK,
    OK,
    CheckResult,
    MemberChecks,
    Recorder,
    SheetRecorder,
    Standard,
    run_checks,
)
from calcpack.checks.elastic import ELASTIC, check_deflection, check_elastic_beam
from calcpack.checks.nds import (
    DURATION_FACTORS,
    NDS_EDITION,
    ReferenceDesignValues,
    SawnMember,
    ServiceConditions,
    check_nds_beam,
)
from calcpack.checks.summary import SUMMARY_COLUMNS, check_records, summary_table

__all__ = [
    "AISC360_EDITION",
    "DURATION_FACTORS",
    "ELASTIC",
    "NDS_EDITION",
    "NOT_COVERED",
    "NOT_OK",
    "OK",
    "SUMMARY_COLUMNS",
    "CheckResult",
    "IShape",
    "MemberChecks",
    "Recorder",
    "ReferenceDesignValues",
    "SawnMember",
    "ServiceConditions",
    "SheetRecorder",
    "Standard",
    "check_aisc_beam",
    "check_deflection",
    "check_elastic_beam",
    "check_nds_beam",
    "check_records",
    "run_checks",
    "summary_table",
]
