"""Working: formula → substitution with units → result, as data with renderers.

Build a sheet from values and formulas written with Python operators::

    from calcpack import ureg
    from calcpack.working import Sheet

    s = Sheet("Lintel L1")
    L = s.given("L", 3.2 * ureg.m, "clear span", source="drawing A-101")
    w = s.given("w", 8.5 * ureg.kN / ureg.m, "line load")
    M = s.derive("M_max", w * L**2 / 8, "maximum moment", unit="kN*m", ref="simple span")
"""

from calcpack.working.expr import (
    Abs,
    Max,
    Min,
    Term,
    atan,
    cos,
    evaluate,
    pi,
    sin,
    sqrt,
    symbol_latex,
    tan,
    to_latex,
    to_text,
)
from calcpack.working.figure import Figure, register_drawing
from calcpack.working.format import (
    format_number,
    format_quantity_latex,
    format_quantity_text,
    format_unit_latex,
    format_unit_text,
)
from calcpack.working.linked import Exports, Imported
from calcpack.working.sheet import Sheet
from calcpack.working.steps import (
    RECORDS_MIMETYPE,
    Assume,
    Block,
    Caution,
    Check,
    CheckRecord,
    Derived,
    Equation,
    Given,
    Heading,
    NotCovered,
    Record,
    Step,
    Table,
    Text,
    Unknown,
    Value,
    Verdict,
)

__all__ = [
    "RECORDS_MIMETYPE",
    "Abs",
    "Assume",
    "Block",
    "Caution",
    "Check",
    "CheckRecord",
    "Derived",
    "Equation",
    "Exports",
    "Figure",
    "Given",
    "Heading",
    "Imported",
    "Max",
    "Min",
    "NotCovered",
    "Record",
    "Sheet",
    "Step",
    "Table",
    "Term",
    "Text",
    "Unknown",
    "Value",
    "Verdict",
    "atan",
    "cos",
    "evaluate",
    "format_number",
    "format_quantity_latex",
    "format_quantity_text",
    "format_unit_latex",
    "format_unit_text",
    "pi",
    "register_drawing",
    "sin",
    "sqrt",
    "symbol_latex",
    "tan",
    "to_latex",
    "to_text",
]
