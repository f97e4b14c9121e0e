"""The base of every sheet step: display settings, records, and how a step shows itself
(its Jupyter display is asked of the renderer registry)."""

from __future__ import annotations

from typing import Any

from calcpack import views
from calcpack.errors import InputError
from calcpack.units import DisplaySettings, get_display

__all__ = ["Step"]


class Step:
    """Base of every sheet step. ``settings`` are the owning sheet's display settings."""

    kind = "step"
    settings: DisplaySettings | None = None

    @property
    def sig(self) -> int:
        return (self.settings or get_display()).sig_figs

    def records(self) -> dict[str, list[Any]]:
        """This step's contribution to the manifest (values, checks, assumptions, cautions)."""
        return {}

    def latex(self) -> str:
        from calcpack.working import render

        return render.step_latex(self)

    def html(self) -> str:
        from calcpack.working import render

        return render.step_html(self)

    def text(self) -> str:
        from calcpack.working import render

        return render.step_text(self)

    def _repr_latex_(self) -> str:
        return self.latex()

    def _repr_html_(self) -> str:
        return self.html()

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        from calcpack.working import render

        return render.mimebundle(self)

    # The cell in which a sheet already showed this step; a second showing in the same cell
    # (the cell's last line returning the step) is skipped so nothing is shown or recorded twice.
    _shown_in: int | None = None

    def _ipython_display_(self) -> None:
        views.render("ipython_display", self)

    def __str__(self) -> str:
        return self.text()


def _settings_or_global(settings: DisplaySettings | None) -> DisplaySettings:
    return settings or get_display()


def _check_name(name: object) -> str:
    if not isinstance(name, str) or not name or not name.replace("_", "a").isalnum():
        raise InputError(
            f"A value's name must be a symbol like 'L', 'M_max' or 'sigma_b' (got {name!r})",
            name="name",
            value=name,
            expected="letters and digits joined by underscores",
        )
    return name
