"""The static layering test: reads every import in the package (those inside functions
included, and ``importlib.import_module("...")`` with a literal name) and fails when a layer
imports one it must not. The rules are in ``tests/layering.py``."""

from __future__ import annotations

import ast
import sys
from collections.abc import Iterator
from pathlib import Path

import pytest

from tests.layering import ABOVE, BOTTOM, COMPUTATION, FORBIDDEN

PACKAGE = Path(__file__).resolve().parents[2] / "calcpack"


def _module_name(path: Path) -> str:
    parts = path.relative_to(PACKAGE.parent).with_suffix("").parts
    return ".".join(parts[:-1] if parts[-1] == "__init__" else parts)


def _within(name: str, prefixes: tuple[str, ...] | str) -> bool:
    prefixes = (prefixes,) if isinstance(prefixes, str) else prefixes
    return any(name == p or name.startswith(p + ".") for p in prefixes)


def _imports(path: Path, module: str | None = None) -> Iterator[tuple[int, str]]:
    """(line, absolute module name) of every import in a file, lazy ones included."""
    module = module or _module_name(path)
    package = module if path.name == "__init__.py" else module.rpartition(".")[0]
    tree = ast.parse(path.read_text(encoding="utf-8"), str(path))
    for node in ast.walk(tree):
        if isinstance(node, ast.Import):
            for alias in node.names:
                yield node.lineno, alias.name
        elif isinstance(node, ast.ImportFrom):
            if node.level:
                base = package.split(".")[: len(package.split(".")) - node.level + 1]
                name = ".".join([*base, *([node.module] if node.module else [])])
            else:
                name = node.module or ""
            yield node.lineno, name
            for alias in node.names:  # "from calcpack import plots" imports calcpack.plots
                yield node.lineno, f"{name}.{alias.name}"
        elif (
            isinstance(node, ast.Call)
            and isinstance(node.func, ast.Attribute | ast.Name)
            and getattr(node.func, "attr", getattr(node.func, "id", "")) == "import_module"
            and node.args
            and isinstance(node.args[0], ast.Constant)
            and isinstance(node.args[0].value, str)
        ):
            yield node.lineno, node.args[0].value


def _files(layers: tuple[str, ...]) -> list[Path]:
    return [p for p in sorted(PACKAGE.rglob("*.py")) if _within(_module_name(p), layers)]


def test_the_rules_cover_real_modules() -> None:
    for layer in (*COMPUTATION, *BOTTOM, *ABOVE):
        assert _files((layer,)), f"{layer} names no module of calcpack"
    assert len(_files(COMPUTATION)) > 50


@pytest.mark.parametrize("layer", COMPUTATION)
def test_computation_never_imports_rendering_build_or_jupyter(layer: str) -> None:
    found = [
        f"{p.relative_to(PACKAGE.parent)}:{line} imports {name}"
        for p in _files((layer,))
        for line, name in _imports(p)
        if _within(name, FORBIDDEN)
    ]
    assert found == []


@pytest.mark.parametrize("layer", sorted(BOTTOM))
def test_the_bottom_imports_only_the_standard_library(layer: str) -> None:
    allowed = BOTTOM[layer]
    found = []
    for p in _files((layer,)):
        for line, name in _imports(p):
            top = name.partition(".")[0]
            if top == "calcpack":
                if name != "calcpack" and not _within(name, allowed):
                    found.append(f"{p.relative_to(PACKAGE.parent)}:{line} imports {name}")
            elif top not in sys.stdlib_module_names and top != "__future__":
                found.append(f"{p.relative_to(PACKAGE.parent)}:{line} imports {name}")
    assert found == []


@pytest.mark.parametrize("layer", sorted(ABOVE))
def test_the_layers_above_computation_depend_one_way(layer: str) -> None:
    found = [
        f"{p.relative_to(PACKAGE.parent)}:{line} imports {name}"
        for p in _files((layer,))
        for line, name in _imports(p)
        if _within(name, ABOVE[layer])
    ]
    assert found == []


def test_the_reader_sees_lazy_and_dynamic_imports(tmp_path: Path) -> None:
    sample = PACKAGE / "analysis" / "beam" / "result.py"
    names = {name for _, name in _imports(sample)}
    assert "calcpack.views" in names
    probe = tmp_path / "probe.py"
    probe.write_text(
        "def f():\n    from ..plots import beam\n"
        "def g():\n    import importlib\n    importlib.import_module('matplotlib')\n",
        encoding="utf-8",
    )
    names = {name for _, name in _imports(probe, "calcpack.analysis.probe")}
    assert {"calcpack.plots", "calcpack.plots.beam", "matplotlib"} <= names
