"""The working of an evaluated beam for a sheet: inputs, section, analysis results and checks.

Built with calcpack.working steps (imported here, never on the panel's numeric path). The
checks use the same numbers the beam panel shows: utilisation = demand / capacity.
"""

from __future__ import annotations

from typing import Any

from calcpack import views
from calcpack.inputs.beam import BeamOutcome

__all__ = ["BeamDiagrams", "beam_working"]


class BeamDiagrams:
    """Loading, shear, moment and deflection diagrams of an outcome, displayed as SVG (the same
    drawing the beam panel shows)."""

    def __init__(self, outcome: BeamOutcome) -> None:
        self.outcome = outcome

    def svg(self) -> str:
        svg: str = views.render("svg", self)
        return svg

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        svg = self.svg()
        # SVG only: JupyterLab shows it as an image, and the package build turns it into a
        # vector figure the same way.
        return {
            "image/svg+xml": svg,
            "text/plain": f"Beam diagrams: {self.outcome.inputs.name}",
        }


def beam_working(outcome: BeamOutcome, sheet: Any, *, source: str = "inputs file") -> None:
    """Add the beam's working to ``sheet`` (a :class:`calcpack.working.Sheet`).

    Args:
        outcome: from :func:`calcpack.inputs.evaluate_beam`.
        sheet: the sheet the steps are added to (each is displayed in a kernel).
        source: where the inputs came from, shown beside each given value.
    """
    from calcpack.working import Min, Value
    from calcpack.working.format import format_cell

    inp = outcome.inputs
    s = sheet
    s.heading(f"Beam {inp.name}: inputs")
    spans = [
        s.given(f"L_{i}", span, f"span {i}", source=source)
        for i, span in enumerate(inp.spans, start=1)
    ]
    lines = [chr(ord("A") + i) for i in range(len(inp.supports))]
    s.table(
        ["Support line", "x", "Support"],
        [[n, x, kind] for n, x, kind in zip(lines, inp.support_x, inp.supports, strict=True)],
        caption="Supports, left to right (free: no support)",
    )

    def at(x: Any) -> str:
        return format_cell(x.to(s.settings.unit_for(x) or x.units), s.settings.sig_figs, s.settings)

    rows = []
    for i, ld in enumerate(inp.loads, start=1):
        if hasattr(ld, "w"):
            rows.append([i, ld.case, "uniform", ld.w, f"x = {at(ld.start)} to {at(ld.end)}"])
        else:
            rows.append([i, ld.case, "point", ld.P, f"x = {at(ld.x)}"])
    s.table(
        ["Load", "Case", "Type", "Magnitude", "Position"],
        rows,
        caption="Loads by case (downward positive)",
    )
    combos = [
        [name, " + ".join(f"{f:g}{c}" if f != 1 else c for c, f in factors.items())]
        for name, factors in (("strength", inp.strength), ("service", inp.service))
    ]
    s.table(["Combination", "Load factors"], combos, caption="Load combinations")
    E = s.given("E", inp.E, "modulus of elasticity", source=source)
    f_b = s.given("f_b", inp.f_b, "design bending strength", source=source)

    s.heading("Section")
    # The properties the checks below read (A, I_x, S_x), in proportion to the section.
    block = s.add(outcome.properties.working())
    found = {step.name: step for step in block.steps if isinstance(step, Value)}
    I = found["I_x"]
    S = found.get("S_x") or s.derive(
        "S_x",
        Min(found["S_x_top"], found["S_x_bot"]),
        "elastic section modulus, the smaller",
        unit="mm**3",
    )
    s.derive("EI", E * I, "flexural stiffness", unit="kN*m**2")

    s.heading("Analysis")
    s.text(
        f"Continuous beam solved exactly for each load case ({outcome.inputs.name}, "
        f"{outcome.strength.classification.describe()}); combinations by superposition."
    )
    s.table(
        ["Support", "x", f"R ({outcome.strength.label})", f"R ({outcome.service.label})"],
        [
            [a.support, a.x, a.Fy, b.Fy]
            for a, b in zip(outcome.strength.reactions, outcome.service.reactions, strict=True)
        ],
        caption="Vertical reactions (upward positive)",
    )

    s.heading("Checks")
    M = s.given(
        "M_Ed",
        outcome.M_design,
        f"largest |M|, {outcome.strength.label}, at x = {at(outcome.x_M)}",
        source="analysis above",
    )
    sigma = s.derive("sigma_b", M / S, "bending stress", unit="MPa")
    s.check(
        "Bending",
        sigma,
        f_b,
        member=inp.name,
        combination=outcome.strength.label,
        ref="σ = M / S_x ≤ f_b",
    )
    ratio = s.given(
        "n_delta", inp.deflection_ratio, "deflection limit ratio (span / n)", source=source
    )
    for d, L in zip(outcome.deflections, spans, strict=True):
        delta = s.given(
            f"delta_{d.span}",
            abs(d.delta),
            f"largest deflection in span {d.span} ({outcome.service.label}) at x = {at(d.x)}",
            source="analysis above",
        )
        limit = s.derive(
            f"delta_lim_{d.span}", L / ratio, f"deflection limit, span {d.span}", unit="mm"
        )
        s.check(
            f"Deflection span {d.span}",
            delta,
            limit,
            member=inp.name,
            combination=outcome.service.label,
            ref="δ ≤ L / n",
        )
