"""The "Lightest that passes" control every member panel shares: a search, its ranking, a pick.

A member panel (steel column, steel or timber beam, glulam beam, timber post) gives the control
two functions: ``search(count, order, max_depth)`` returning a
:class:`calcpack.sizing.SizingResult` (the panel builds it from its inputs file with the same
trial it checks the section on screen with), and ``use(name)`` writing the picked section into
the inputs file through the panel's edit loop. The control shows the passing sections (lightest
first, or shallowest first when ranked by depth) with each one's governing check and
utilisation, the next lighter one with the check it fails, or -- when nothing passes -- says so
and shows the closest. A depth limit that no section meets is reported at the depth field.
"""

from __future__ import annotations

from collections.abc import Callable, Sequence
from html import escape
from typing import Any

import ipywidgets as ipw

from calcpack.errors import CalcpackError
from calcpack.inputs import parse_quantity
from calcpack.inputs.file import Spec, require_input
from calcpack.sizing import SizingResult
from calcpack.sizing.search import Order, Trial
from calcpack.units import Quantity

__all__ = ["SearchControl", "sizing_table_html"]

ORDERS: tuple[tuple[str, Order], ...] = (("by weight", "weight"), ("by depth", "depth"))


def _row(t: Trial, css: str) -> str:
    u = "—" if t.utilisation is None else f"{t.utilisation:.3f}"
    depth = "" if t.depth is None else f"{t.depth.to('inch'):.3g~P}"
    return (
        f'<tr class="{css}" data-name="{escape(t.name)}" data-u="{t.utilisation!r}">'
        f"<td>{escape(t.name)}</td><td>{t.weight:.3g~P}</td><td>{depth}</td><td>{u}</td>"
        f"<td>{escape(t.verdict)}</td><td>{escape(t.governing)}</td></tr>"
    )


def sizing_table_html(found: SizingResult, *, what: str = "section") -> str:
    """The search's ranking as HTML: the passing sections in search order, then the next
    lighter (or shallower) one and the check it fails; when nothing passes, a sentence saying
    so and the closest section."""
    head = (
        '<table class="cp-panel-results" style="font-size:12px"><tr><th>Section</th>'
        "<th>Weight</th><th>Depth</th><th>Governing utilisation</th><th>Verdict</th>"
        "<th>Governing check</th></tr>"
    )
    rows = [_row(t, "cp-candidate") for t in found.passing]
    if found.next_lighter is not None:
        rows.append(_row(found.next_lighter, "cp-next-lighter"))
    if found.closest is not None:
        rows.append(_row(found.closest, "cp-closest"))
    ranked = "lightest" if found.order == "weight" else "shallowest"
    out = (
        f"<p>{len(found.tried)} tried, {ranked} first; a section marked passes passes every "
        "check of every combination.</p>"
        if found.passing
        else ""
    )
    out += head + "".join(rows) + "</table>"
    if found.next_lighter is not None:
        t = found.next_lighter
        nxt = "lighter" if found.order == "weight" else "shallower"
        out += f"<p>Next {nxt}: {escape(t.name)} {escape(t.verdict)} ({escape(t.governing)}).</p>"
    if not found.passing:
        near = found.closest
        out += (
            f"<p class='cp-error cp-none-passes'>No {escape(what)} of the "
            f"{len(found.tried)} tried passes every check"
            + (
                f"; the closest is {escape(near.name)} ({escape(near.governing)})."
                if near is not None
                else "."
            )
            + "</p>"
        )
    return out


class SearchControl:
    """The search row of a member panel (see the module docstring).

    Args:
        search: ``(count, order, max_depth) -> SizingResult``; may raise a CalcpackError.
        use: writes the picked section's name into the inputs file.
        what: the word for a candidate in messages ("shape", "size").
        more: widgets shown as a row under the search row (e.g. the grades a timber search
            covers).

    Attributes:
        widget: the box to show under the panel. found: the last ranking (None before a search
        or after a refused one). pick, ranking, order, max_depth: the widgets.
    """

    def __init__(
        self,
        search: Callable[[int, Order, Quantity | None], SizingResult],
        use: Callable[[str], Any],
        *,
        what: str = "section",
        more: Sequence[ipw.Widget] = (),
    ) -> None:
        self._search = search
        self._use = use
        self.what = what
        self.found: SizingResult | None = None
        self.button = ipw.Button(
            description="Lightest that passes", layout=ipw.Layout(width="170px")
        )
        self.button.add_class("cp-search")
        self.button.on_click(lambda _b: self.run())
        self.order = ipw.Dropdown(
            options=list(ORDERS), value="weight", layout=ipw.Layout(width="110px")
        )
        self.order.add_class("cp-search-order")
        self.max_depth = ipw.Text(
            value="", placeholder="e.g. 12 in", layout=ipw.Layout(width="90px")
        )
        self.max_depth.add_class("cp-search-max-depth")
        deepest = ipw.HTML("deepest", layout=ipw.Layout(margin="0 4px 0 8px"))
        self.pick = ipw.Dropdown(options=[], layout=ipw.Layout(width="190px"))
        self.pick.add_class("cp-search-pick")
        self.use_button = ipw.Button(description=f"Use this {what}", disabled=True)
        self.use_button.add_class("cp-search-use")
        self.use_button.on_click(lambda _b: self.use(self.pick.value))
        self.ranking = ipw.HTML()
        self.ranking.add_class("cp-search-results")
        self.widget = ipw.VBox(
            [
                ipw.HBox(
                    [self.button, self.order, deepest, self.max_depth],
                    layout=ipw.Layout(flex_flow="row wrap"),
                ),
                *([ipw.HBox(list(more))] if more else []),
                ipw.HBox([self.pick, self.use_button]),
                self.ranking,
            ]
        )
        self.widget.add_class("cp-search-box")

    def _error(self, message: str) -> None:
        self.found = None
        self.pick.options = []
        self.use_button.disabled = True
        self.ranking.value = f'<span class="cp-error">{escape(message)}</span>'

    def run(self, count: int = 5) -> SizingResult | None:
        """Rank the lightest (or shallowest) sections that pass; None if refused (the reason
        is shown: a bad depth limit, one no section meets, inputs that do not validate)."""
        text = self.max_depth.value.strip()
        self.ranking.value = '<span class="cp-searching">Searching…</span>'
        try:
            limit = (
                require_input(
                    parse_quantity(text, "deepest"), Spec("[length]", positive=True), "deepest"
                )
                if text
                else None
            )
            found = self._search(count, self.order.value, limit)
        except CalcpackError as exc:
            self._error(f"No search: {exc}")
            return None
        self.found = found
        self.ranking.value = sizing_table_html(found, what=self.what)
        names = [t.name for t in found.passing]
        self.pick.options = names
        self.pick.value = names[0] if names else None  # the lightest, ready to use
        self.use_button.disabled = not names
        return found

    def use(self, name: str | None) -> None:
        """Write ``name`` into the inputs file (as if typed in the panel)."""
        if name:
            self._use(name)
