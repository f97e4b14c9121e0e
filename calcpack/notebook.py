"""How calcpack's results show themselves in a notebook and on a sheet: the standard renderers.

Imported by ``import calcpack``. It only registers, by name, which renderer draws which result
(:mod:`calcpack.views`); nothing here is imported from plotting, widgets or Jupyter until a
result is first shown. Computation never imports this module: it asks the registry.
"""

from __future__ import annotations

from typing import Any

from calcpack.views import register

__all__ = [
    "beam_diagrams_svg",
    "beam_result_bundle",
    "properties_figure",
    "section_figure",
    "step_ipython_display",
]


def beam_result_bundle(result: Any) -> dict[str, Any]:
    """A beam result in Jupyter: its diagrams (SVG) and a one-line text summary."""
    ex = result.extremes
    text = (
        f"{result.beam.name}: {result.label}; M_max = {ex.M_max.value:~.4g} at "
        f"x = {ex.M_max.x:~.4g}, M_min = {ex.M_min.value:~.4g}, "
        f"V_max = {ex.V_max.value:~.4g}, V_min = {ex.V_min.value:~.4g}"
    )
    return {"image/svg+xml": result.figure().svg, "text/plain": text}


def section_figure(section: Any, **options: Any) -> Any:
    """A section sketched with its centroid and axes dimensioned (matplotlib, see plots)."""
    from calcpack.plots.section import section_figure as draw

    return draw(section, props=section.properties(), **options)


def properties_figure(props: Any, **options: Any) -> Any:
    """The sketch of the section whose properties these are."""
    from calcpack.plots.section import section_figure as draw

    return draw(props.section, props=props, **options)


def beam_diagrams_svg(diagrams: Any) -> str:
    """The beam panel's loading, V, M and deflection drawing of an evaluated beam, as SVG."""
    from calcpack.widgets.svg import beam_diagrams_svg as draw

    svg: str = draw(diagrams.outcome)
    return svg


def step_ipython_display(step: Any) -> None:
    """Publish a sheet step's display bundle once per cell.

    A sheet already showed the step when the cell's last line returns it again: the second
    showing in the same cell is skipped, so nothing is shown or recorded twice.
    """
    import IPython
    from IPython.display import publish_display_data

    count = getattr(IPython.get_ipython(), "execution_count", None)
    if step._shown_in is not None and step._shown_in == count:
        return
    step._shown_in = count
    publish_display_data(step._repr_mimebundle_())


_STANDARD = (
    ("calcpack.analysis.beam.result.BeamResult", "figure", "calcpack.plots.beam:beam_figure"),
    ("calcpack.analysis.beam.result.BeamResult", "mimebundle", beam_result_bundle),
    ("calcpack.analysis.truss_model.Truss", "diagram", "calcpack.plots.truss:TrussDiagram"),
    ("calcpack.analysis.truss_solve.TrussResult", "diagram", "calcpack.plots.truss:TrussDiagram"),
    (
        "calcpack.analysis.freebody.FreeBodyResult",
        "sketch",
        "calcpack.plots.freebody:FreeBodySketch",
    ),
    ("calcpack.sections.base.Section", "figure", section_figure),
    ("calcpack.sections.base.Section", "svg", "calcpack.plots.section:section_svg"),
    ("calcpack.sections.properties.SectionProperties", "figure", properties_figure),
    ("calcpack.inputs.beam_working.BeamDiagrams", "svg", beam_diagrams_svg),
    (
        "calcpack.checks.en1996.bearing.MasonryBearing",
        "svg",
        "calcpack.plots.masonry:masonry_bearing_svg",
    ),
    ("calcpack.working.step_base.Step", "ipython_display", step_ipython_display),
)

for _type_name, _kind, _renderer in _STANDARD:
    register(_type_name, _kind, _renderer)
