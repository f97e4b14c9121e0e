"""Errors write their message from their fields and survive pickling (a worker process raises
them as they are)."""

from __future__ import annotations

import pickle

import pytest

from calcpack.errors import (
    BuildError,
    CalcpackError,
    DimensionError,
    InputError,
    NotebookExecutionError,
    NoViewError,
    OutOfScopeError,
    SignedPackageError,
    SigningError,
    UndefinedSymbolError,
    UnstableStructureError,
    VerificationError,
    ZeroDivisorError,
)
from calcpack.units import ureg
from calcpack.validate import one_of, positive, within

ERRORS = [
    InputError("Span L must be positive (got L = -3 m)", name="L", value=-3, expected="> 0"),
    InputError(name="L", value=-3 * ureg.m, rule="must be positive"),
    DimensionError(name="w", value=3 * ureg.m, rule="must be a force per length"),
    ZeroDivisorError("A", "b*d", "d"),
    UnstableStructureError("Beam B1 is a mechanism: add a support", part="hinge H1"),
    NotebookExecutionError("sheets/01.ipynb", 3, "beam = Beam(", "InputError: L"),
    SignedPackageError("build/p.pdf", (("preparer", "A. Fenwick"),)),
    NoViewError("calcpack.x.Y", "figure", ("svg",)),
]


@pytest.mark.parametrize("error", ERRORS, ids=lambda e: type(e).__name__)
def test_errors_survive_pickling_with_their_fields_and_message(error: CalcpackError) -> None:
    again = pickle.loads(pickle.dumps(error))
    assert type(again) is type(error)
    assert str(again) == str(error)
    assert repr(vars(again)) == repr(vars(error))


def _every_error_class() -> set[type[CalcpackError]]:
    """CalcpackError and every subclass, those of calcpack.errors and those defined beside the
    code that raises them (the modules are imported so their classes exist)."""
    import calcpack.checks.scope
    import calcpack.inputs.file
    import calcpack.package.project  # noqa: F401

    found: set[type[CalcpackError]] = set()
    todo = [CalcpackError]
    while todo:
        cls = todo.pop()
        if cls.__module__.startswith("calcpack.") and cls not in found:
            found.add(cls)
            todo.extend(cls.__subclasses__())
    return found


def _one_of_each() -> dict[type[CalcpackError], CalcpackError]:
    from calcpack.checks.scope import MaterialOutOfScopeError
    from calcpack.inputs.file import InputsFileError
    from calcpack.package.project import ProjectFileError

    made: list[CalcpackError] = [
        CalcpackError("something went wrong"),
        *ERRORS,
        UndefinedSymbolError(name="b", value=None, rule="has no value on the sheet"),
        OutOfScopeError("AISC 360-16 §F9 is not covered for this section"),
        BuildError("Paper size must be 'A4' or 'Letter' (got paper = 'A3')"),
        SigningError("Key file 'k.p12' could not be opened"),
        VerificationError("'p.pdf' carries no calcpack manifest"),
        MaterialOutOfScopeError(
            "Fy", 900 * ureg.MPa, 200 * ureg.MPa, 700 * ureg.MPa, "AISC 360-16", "§A3.1a"
        ),
        ProjectFileError(
            "calcpack.toml: field 'job.number' is missing", name="job.number", expected="text"
        ),
        InputsFileError(name="beam.spans[2]", value="3 m m", expected="a length such as '3 m'"),
    ]
    return {type(e): e for e in made}


def test_every_error_class_survives_pickling_as_raised() -> None:
    """A worker process raises calcpack's errors as they are: each class, made with its own
    fields, comes back from pickle with the same type, fields and message."""
    samples = _one_of_each()
    missing = {c.__qualname__ for c in _every_error_class() - set(samples)}
    assert not missing, f"add an example of {sorted(missing)} to this test"
    for error in samples.values():
        again = pickle.loads(pickle.dumps(error))
        assert type(again) is type(error)
        assert str(again) == str(error)
        assert repr(vars(again)) == repr(vars(error))


def test_an_input_error_writes_itself_from_its_fields() -> None:
    e = InputError(name="L", value=-3 * ureg.m, rule="must be positive", note="L is a span")
    assert str(e) == "Input L must be positive (got L = -3 m); L is a span"
    assert str(InputError(name="grade", value="S355", expected="one of 'A992'")) == (
        "Input grade must be one of 'A992' (got grade = 'S355')"
    )


def test_zero_divisor_names_the_formula_and_the_zero() -> None:
    e = ZeroDivisorError("sigma", "M/S", "S")
    assert str(e) == "sigma = M/S divides by zero: S = 0; check the values it is made of"
    assert (e.name, e.value) == ("S", 0)


def test_notebook_execution_error_names_sheet_cell_and_source() -> None:
    e = NotebookExecutionError("sheets/01.ipynb", 3, "beam = Beam(", "InputError: L")
    assert str(e) == "Sheet 'sheets/01.ipynb' failed in cell 3 ('beam = Beam('): InputError: L"


def test_validators_fill_the_fields() -> None:
    with pytest.raises(InputError) as info:
        positive("t_w", -2 * ureg.mm)
    assert (info.value.name, info.value.rule) == ("t_w", "must be positive")
    assert str(info.value) == "Input t_w must be positive (got t_w = -2 mm)"
    with pytest.raises(InputError) as info:
        within("Fy", 80 * ureg.ksi, hi=70 * ureg.ksi, rule="AISC 360-16 §E3")
    assert str(info.value) == "Input Fy must be at most 70 ksi (got Fy = 80 ksi); AISC 360-16 §E3"
    with pytest.raises(InputError) as info:
        one_of("method", "LFRD", ("LRFD", "ASD"))
    assert info.value.note == "did you mean 'LRFD'?"
