"""The connection panel for a deck ledger: fastener, members, pattern and joist reaction in
the inputs file, the spacing and edge-distance checks live (see :mod:`calcpack.inputs.ledger`),
on the shared panel machinery."""

from __future__ import annotations

from pathlib import Path
from typing import Any, ClassVar

import ipywidgets as ipw

from calcpack.checks.base import MemberChecks
from calcpack.inputs.ledger import evaluate_ledger, ledger_inputs
from calcpack.widgets.panel import InputsPanel, checks_outputs

__all__ = ["LedgerPanel", "ledger_panel"]


class LedgerPanel(InputsPanel):
    """Edit a deck ledger's inputs file and watch its fastener checks."""

    kind: ClassVar[str] = "Connection panel (deck ledger)"
    css_class: ClassVar[str] = "cp-ledger-panel"
    output_names: ClassVar[tuple[str, ...]] = ("bars", "results")

    def form(self) -> list[ipw.Widget]:
        t = self.data["ledger"]
        parts: list[ipw.Widget] = [
            ipw.HTML("<b>Fastener</b>"),
            self.choice("ledger.fastener", "kind", ("bolt", "lag screw")),
            self.quantity("ledger.diameter", "diameter"),
            self.quantity("ledger.length", "length"),
            ipw.HTML("<b>Ledger and rim board</b>"),
            self.text("ledger.ledger_species", "ledger species"),
            self.quantity("ledger.ledger_thickness", "ledger thickness"),
            self.quantity("ledger.ledger_depth", "ledger depth"),
            self.text("ledger.rim_species", "rim species"),
            self.quantity("ledger.rim_thickness", "rim thickness"),
            self.quantity("ledger.rim_depth", "rim depth"),
            ipw.HTML("<b>Pattern</b>"),
            self.quantity("ledger.spacing", "spacing"),
            self.number("ledger.rows", "rows (1 or 2)"),
        ]
        parts += [self.quantity(f"ledger.{k}", k) for k in ("top", "bottom", "end") if k in t]
        parts += [
            ipw.HTML("<b>Load</b> (ASD)"),
            self.quantity("load.R", "joist reaction R"),
            self.quantity("load.joist_spacing", "joist spacing"),
            self.choice("load.service", "service", ("dry", "wet")),
        ]
        return parts

    def evaluate(self, data: dict[str, Any]) -> MemberChecks:
        return evaluate_ledger(ledger_inputs(data, path=self.path))

    def render(self, outcome: MemberChecks) -> dict[str, str]:
        return checks_outputs([outcome])


def ledger_panel(path: str | Path) -> LedgerPanel:
    """Show the deck-ledger connection panel for ``path`` (nothing is shown during a build)."""
    return LedgerPanel(path)
