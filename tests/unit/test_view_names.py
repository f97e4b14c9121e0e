"""Every standard view is registered under the name its class really has: a class moved to
another module would otherwise lose its view silently (a sheet's steps showed nothing, and a
build's kernels failed, when Step moved to step_base)."""

from __future__ import annotations

import importlib

import pytest

from calcpack import notebook


@pytest.mark.parametrize(("type_name", "kind"), [(t, k) for t, k, _ in notebook._STANDARD])
def test_registered_name_is_the_class_name(type_name: str, kind: str) -> None:
    module, _, name = type_name.rpartition(".")
    cls = getattr(importlib.import_module(module), name)
    assert f"{cls.__module__}.{cls.__qualname__}" == type_name, kind
