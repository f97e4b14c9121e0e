"""The renderer registry: how results are shown, registered from the layers above computation.

Computation (analysis, sections, checks, loads...) returns plain data. A result that offers a
picture or a rich Jupyter display asks this registry for it -- ``views.render("figure", self)``,
``views.mimebundle(self)`` -- and never imports plotting, widgets or Jupyter code itself. The
renderers are registered by the layer that owns them (:mod:`calcpack.notebook` registers the
standard ones when calcpack is imported), by the qualified name of the result class, so that
registering costs no import of either side; the renderer's module is imported on first use.

This module imports only the standard library and :mod:`calcpack.errors`.
"""

from __future__ import annotations

import importlib
from collections.abc import Callable
from typing import Any

from calcpack.errors import NoViewError

__all__ = ["mimebundle", "register", "registered", "render"]

Renderer = Callable[..., Any]

# (qualified class name, kind) -> renderer, or "module:function" until first used
_VIEWS: dict[tuple[str, str], Renderer | str] = {}


def _qualname(cls: type) -> str:
    return f"{cls.__module__}.{cls.__qualname__}"


def register(type_name: str, kind: str, renderer: Renderer | str) -> None:
    """Register how objects of a class (and its subclasses) are shown.

    Args:
        type_name: the class's module and qualified name (``"calcpack.sections.base.Section"``).
        kind: the view (``"figure"``, ``"svg"``, ``"mimebundle"``, ``"ipython_display"``...).
        renderer: a callable ``renderer(obj, **options)``, or ``"module:function"`` naming one,
            imported when first used.
    """
    _VIEWS[(type_name, kind)] = renderer


def registered(obj: Any) -> tuple[str, ...]:
    """The kinds of view registered for ``obj``'s class and its bases."""
    names = {_qualname(c) for c in type(obj).__mro__}
    return tuple(sorted({k for (t, k) in _VIEWS if t in names}))


def _lookup(kind: str, obj: Any) -> Renderer:
    for cls in type(obj).__mro__:
        key = (_qualname(cls), kind)
        found = _VIEWS.get(key)
        if found is None:
            continue
        if isinstance(found, str):
            module, _, attr = found.partition(":")
            found = getattr(importlib.import_module(module), attr)
            _VIEWS[key] = found
        return found
    raise NoViewError(_qualname(type(obj)), kind, registered(obj))


def render(kind: str, obj: Any, /, **options: Any) -> Any:
    """The view ``kind`` of ``obj``, from its registered renderer.

    Raises:
        calcpack.errors.NoViewError: nothing is registered for the class and kind.
    """
    return _lookup(kind, obj)(obj, **options)


def mimebundle(obj: Any, include: Any = None, exclude: Any = None) -> dict[str, Any]:
    """The Jupyter display bundle of ``obj`` (for a one-line ``_repr_mimebundle_``)."""
    bundle: dict[str, Any] = _lookup("mimebundle", obj)(obj)
    return bundle
