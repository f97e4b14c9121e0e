"""A figure on a sheet: data to draw, the name of the drawing that reads it, and its words.

A :class:`Figure` step holds the result it shows (frozen data) and the *name* of a drawing,
never drawing code, so computation can put a figure on a sheet without importing matplotlib.
The renderers look the name up in :data:`FIGURE_DRAWINGS` (``"module:function"``, imported
only when the figure is drawn) or in drawings registered at run time with
:func:`register_drawing`. A drawing is ``fn(data, settings, **options) -> svg text``.

Every figure carries a caption and an alternative text (read aloud by a screen reader and
kept in the PDF's tag structure).
"""

from __future__ import annotations

import importlib
from collections.abc import Callable, Mapping
from typing import Any

from calcpack.errors import InputError
from calcpack.units import DisplaySettings
from calcpack.working.steps import Step

__all__ = ["FIGURE_DRAWINGS", "Figure", "draw_figure", "register_drawing"]

#: Drawing name -> "module:function" of the function that draws it (SVG text).
FIGURE_DRAWINGS: dict[str, str] = {
    "beam-combinations": "calcpack.plots.beam_combinations:combinations_svg",
    "beam": "calcpack.plots.beam:beam_svg",
    "footing": "calcpack.plots.footing:footing_svg",
    "roof-loads": "calcpack.plots.roof_loads:roof_loads_svg",
    "truss": "calcpack.plots.truss:truss_svg",
    "joint": "calcpack.plots.joint:joint_svg",
    "masonry-bearing": "calcpack.plots.masonry:masonry_bearing_drawing",
    "lintel": "calcpack.plots.lintel:lintel_drawing",
    "wind-elevation": "calcpack.plots.wind_elevation:elevation_svg",
    "wind-cc-plan": "calcpack.plots.wind_cc_plan:cc_plan_svg",
}

_REGISTERED: dict[str, Callable[..., str]] = {}


def register_drawing(name: str, fn: Callable[..., str]) -> None:
    """Register ``fn(data, settings, **options) -> svg`` as the drawing called ``name``."""
    _REGISTERED[name] = fn


class Figure(Step):
    """A figure drawn from ``data`` by the drawing called ``drawing``.

    Args:
        drawing: a name in :data:`FIGURE_DRAWINGS` or registered with :func:`register_drawing`.
        data: what the drawing reads (a frozen result).
        caption: the figure's caption, saying what it shows (cases, combinations, units).
        alt: alternative text for readers who cannot see the figure.
        options: keyword options passed to the drawing (e.g. a truss's ``case``).
    """

    kind = "figure"

    def __init__(
        self,
        drawing: str,
        data: Any,
        *,
        caption: str,
        alt: str,
        settings: DisplaySettings | None = None,
        options: Mapping[str, Any] | None = None,
    ) -> None:
        if drawing not in FIGURE_DRAWINGS and drawing not in _REGISTERED:
            known = sorted(set(FIGURE_DRAWINGS) | set(_REGISTERED))
            raise InputError(
                f"Figure drawing must be one of {known} (got drawing = {drawing!r})",
                name="drawing",
                value=drawing,
                expected=", ".join(known),
            )
        self.drawing = drawing
        self.data = data
        self.caption = caption
        self.alt = alt
        self.settings = settings
        self.options = dict(options or {})
        self._svg: str | None = None

    def svg(self) -> str:
        """The figure as SVG text (drawn once, then kept)."""
        if self._svg is None:
            self._svg = draw_figure(self.drawing, self.data, self.settings, **self.options)
        return self._svg


def draw_figure(drawing: str, data: Any, settings: DisplaySettings | None, **options: Any) -> str:
    """Draw ``data`` with the drawing called ``drawing``; SVG text."""
    fn = _REGISTERED.get(drawing)
    if fn is None:
        module, _, name = FIGURE_DRAWINGS[drawing].partition(":")
        fn = getattr(importlib.import_module(module), name)
    return fn(data, settings, **options)
