"""The top-level package re-exports the public API lazily: every listed name resolves, and
importing calcpack alone loads no computation or rendering library."""

from __future__ import annotations

import subprocess
import sys

import pytest

import calcpack


@pytest.mark.parametrize("name", calcpack.__all__)
def test_every_public_name_resolves(name):
    assert getattr(calcpack, name) is not None


def test_unknown_name_is_an_attribute_error():
    with pytest.raises(AttributeError, match="no_such_thing"):
        calcpack.no_such_thing


def test_bare_import_is_light():
    code = (
        "import sys, calcpack; "
        "print(sorted(m for m in ('sympy', 'pint', 'numpy') if m in sys.modules))"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "[]"


def test_the_typing_imports_match_the_lazy_table():
    """calcpack/_api.py (read by type checkers) names each public name from the module the
    run-time table loads it from, and nothing else."""
    import ast
    from pathlib import Path

    from calcpack._lazy import PUBLIC

    tree = ast.parse(Path(calcpack.__file__).with_name("_api.py").read_text("utf-8"))
    typed = {}
    for node in tree.body:
        if isinstance(node, ast.ImportFrom) and node.module != "__future__":
            for alias in node.names:
                assert alias.asname == alias.name, f"{alias.name} must be imported as itself"
                typed[alias.name] = node.module
    assert typed == PUBLIC
