"""Figures of a truss on a sheet: its geometry with dimensions and names, the loads of each
load case (one figure per case, unfactored) and the member forces of a result, as
:class:`calcpack.working.Figure` steps. The drawing itself is :mod:`calcpack.plots.truss`,
looked up by name when the figure is shown; nothing here imports plotting."""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

from calcpack.working import Block, Figure

if TYPE_CHECKING:
    from calcpack.analysis.truss_model import Truss
    from calcpack.analysis.truss_solve import TrussResult

__all__ = ["forces_figure", "truss_figures"]


def forces_figure(result: TrussResult) -> Figure:
    """The member-force diagram of ``result`` as a figure step."""
    truss = result.truss
    n_t = sum(1 for m in truss.members if result.nature(m.name) == "T")
    n_c = sum(1 for m in truss.members if result.nature(m.name) == "C")
    return Figure(
        "truss",
        result,
        caption=f"{truss.name}: member forces, {result.label} (T tension, C compression)",
        alt=(
            f"Truss {truss.name} drawn to scale with each member's axial force, {result.label}: "
            f"{n_t} members in tension, {n_c} in compression; the table gives every value."
        ),
    )


def truss_figures(truss: Truss, *, dimensions: bool = True) -> Block:
    """The truss's geometry (with dimensions and member names) and one figure of the loads of
    each load case, unfactored."""
    steps: list[Any] = [
        Figure(
            "truss",
            truss,
            caption=f"{truss.name}: geometry, joint and member names"
            + (", dimensions" if dimensions else ""),
            alt=(
                f"Truss {truss.name}: {len(truss.nodes)} joints and {len(truss.members)} "
                f"members, supports at {', '.join(s.node for s in truss.supports)}."
            ),
            options={"loads": False, "dimensions": dimensions, "title": f"{truss.name}"},
        )
    ]
    for case in truss.load_cases:
        count = sum(1 for ld in truss.loads if ld.case == case)
        steps.append(
            Figure(
                "truss",
                truss,
                caption=f"{truss.name}: loads of case {case}, unfactored",
                alt=f"Truss {truss.name} with the {count} joint loads of case {case}.",
                options={"case": case, "title": f"{truss.name}: loads of case {case}"},
            )
        )
    return Block(steps=steps, title=f"{truss.name}: geometry and loads")
