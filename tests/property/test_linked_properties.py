"""Linked sheets: random chains of sheets with random values give the same values, to the last
bit, whatever order the project file lists the sheets in.

The sheets run in this process (``linkkit.run_in_process`` in place of a kernel), through the
build's own ordering, cache keys and value passing. The expected values are the same sums done
in Python floats, in the order the sheets write them (arithmetic).
"""

from __future__ import annotations

import tempfile
from pathlib import Path

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from linkkit import exported, run_in_process, write_linked_project

from calcpack.package import execute
from calcpack.package.project import load_project

_values = st.floats(min_value=-1e6, max_value=1e6, allow_nan=False).filter(lambda v: abs(v) > 1e-6)


@st.composite
def chains(draw: st.DrawFn) -> tuple[list[float], list[list[int]], list[int]]:
    n = draw(st.integers(2, 5))
    own = [draw(_values) for _ in range(n)]
    imports = [
        sorted(draw(st.sets(st.integers(0, i - 1), max_size=i))) if i else [] for i in range(n)
    ]
    order = draw(st.permutations(range(n)))
    return own, imports, list(order)


def _code(i: int, own: float, imports: list[int]) -> str:
    lines = [f'v{j} = s.import_value("s{j}", "V{j}", dimension="[force]")' for j in imports]
    total = " + ".join([f"v{j}" for j in imports] + [f"{own!r} * ureg.kN"])
    return "\n".join([*lines, f's.export(s.derive("V{i}", {total}, unit="kN"))'])


def _run(root: Path, own: list[float], imports: list[list[int]], order: list[int]) -> dict:
    sheets = {f"s{i}": _code(i, own[i], imports[i]) for i in range(len(own))}
    write_linked_project(root, sheets, [f"s{i}" for i in order])
    done = execute.execute_sheets(load_project(root), workers=1, use_cache=False)
    out = {}
    for item in done:
        out.update(exported(item.notebook_json))
    return out


@settings(
    max_examples=25, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture]
)
@given(chain=chains())
def test_random_chains_reproduce_exactly_after_a_shuffle(chain, monkeypatch: pytest.MonkeyPatch):
    monkeypatch.setattr(execute, "_execute", run_in_process)
    own, imports, order = chain
    expected: list[float] = []
    for i, value in enumerate(own):
        total = 0.0
        for k, j in enumerate(imports[i]):
            total = expected[j] if k == 0 else total + expected[j]
        expected.append(total + value if imports[i] else value)
    with tempfile.TemporaryDirectory() as a, tempfile.TemporaryDirectory() as b:
        listed = _run(Path(a), own, imports, list(range(len(own))))
        shuffled = _run(Path(b), own, imports, order)
    assert shuffled == listed
    for i, value in enumerate(expected):
        assert listed[f"V{i}"] == value
