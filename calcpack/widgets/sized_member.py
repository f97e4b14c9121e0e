"""Member panels that size by trying and by search: a beam's member (steel shape, sawn size or
glulam section) for the analysis the sheet gives it, and a sawn timber post.

Both are :class:`calcpack.widgets.panel.InputsPanel` subclasses with the shared
:class:`calcpack.widgets.search.SearchControl`; the computation is in
:mod:`calcpack.inputs.beam_member` and :mod:`calcpack.inputs.timber_post`, which the sheet's
calc cells call too, so a build reproduces what the panel shows from the inputs file.
"""

from __future__ import annotations

from collections.abc import Sequence
from pathlib import Path
from typing import Any, ClassVar

import ipywidgets as ipw

from calcpack.checks.nds.values import nds_sawn_grades
from calcpack.errors import CalcpackError
from calcpack.inputs.beam_member import (
    BeamDemand,
    BeamMemberCase,
    beam_member_inputs,
    beam_pick_changes,
    evaluate_beam_member,
    lightest_beam_member,
)
from calcpack.inputs.sized import SizedOutcome
from calcpack.inputs.timber_post import (
    DURATIONS,
    PostLoad,
    TimberPostCase,
    evaluate_timber_post,
    lightest_timber_post,
    post_pick_changes,
    timber_post_inputs,
)
from calcpack.sizing import SizingResult
from calcpack.sizing.search import Order
from calcpack.units import Quantity
from calcpack.widgets.panel import InputsPanel, checks_outputs
from calcpack.widgets.search import SearchControl

__all__ = ["BeamMemberPanel", "TimberPostPanel", "beam_member_panel", "timber_post_panel"]


class _SizingPanel(InputsPanel):
    """What both member panels share: outputs, the search row, and a pick written through the
    edit loop (so a pick that does not evaluate is refused like a typed value)."""

    output_names: ClassVar[tuple[str, ...]] = ("bars", "results")
    what: ClassVar[str] = "section"

    # the member's own functions (of calcpack.inputs), set by each panel as static methods
    @staticmethod
    def check_case(case: Any) -> SizedOutcome:
        """Check the table's section (as the sheet's cells do)."""
        raise NotImplementedError

    @staticmethod
    def rank_case(
        case: Any, *, count: int, order: Order, max_depth: Quantity | None
    ) -> SizingResult:
        """The sections that pass, lightest (or shallowest) first."""
        raise NotImplementedError

    @staticmethod
    def changes_for(case: Any, name: str) -> dict[str, Any]:
        """The inputs-file edits that make ``name`` the member."""
        raise NotImplementedError

    def case(self, data: Any) -> Any:
        """The validated table (raises naming the key)."""
        raise NotImplementedError

    def evaluate(self, data: dict[str, Any]) -> SizedOutcome:
        return type(self).check_case(self.case(data))

    def render(self, outcome: SizedOutcome) -> dict[str, str]:
        out = checks_outputs(outcome.checks)
        out["results"] = (
            f'<p class="cp-section" data-name="{outcome.section}">Section: '
            f"<b>{outcome.section}</b>, {outcome.weight:.3g~P}</p>" + out["results"]
        )
        return out

    def search_options(self) -> list[ipw.Widget]:
        """Widgets of the panel's own shown under the search row (none by default)."""
        return []

    def extra(self) -> list[ipw.Widget]:
        more = self.search_options()
        self.searcher = SearchControl(self._search, self.use, what=self.what, more=more)
        return [self.searcher.widget]

    def _search(self, count: int, order: Order, limit: Quantity | None) -> SizingResult:
        rank = type(self).rank_case
        return rank(self.case(self.data), count=count, order=order, max_depth=limit)

    def search(self, count: int = 5) -> SizingResult | None:
        """Rank the lightest (or shallowest) sections that pass (see SearchControl.run)."""
        return self.searcher.run(count)

    def use(self, name: str | None) -> bool:
        """Write the section ``name`` (a candidate of the search) into the inputs file, as if
        typed, and redraw the form; False if refused."""
        if not name:
            return False
        ok = self.edit(type(self).changes_for(self.case(self.data), name))
        self._build_form()
        return ok


class BeamMemberPanel(_SizingPanel):
    """Edit a beam member table (see :mod:`calcpack.inputs.beam_member`) checked for the
    sheet's analysis ``demand``.

    Args:
        path: the inputs file. demand: the analysis from the sheet's cells above.
        table: the member's table in the file.
    """

    kind: ClassVar[str] = "Beam member panel"
    css_class: ClassVar[str] = "cp-beam-member-panel"
    check_case = staticmethod(evaluate_beam_member)
    rank_case = staticmethod(lightest_beam_member)
    changes_for = staticmethod(beam_pick_changes)

    def __init__(self, path: str | Path, demand: BeamDemand, *, table: str = "member") -> None:
        self.demand = demand
        self.table = table
        super().__init__(path, tables=(table,))

    def case(self, data: Any) -> BeamMemberCase:
        return beam_member_inputs(data, self.demand, table=self.table, path=self.path)

    def search_options(self) -> list[ipw.Widget]:
        """The grades a sawn member's search covers: the species' Table 4A grades, lower grades
        listed first (at equal size the one listed first is offered first); the table's own
        grade alone by default."""
        self.grades = ipw.SelectMultiple(options=[], rows=4, layout=ipw.Layout(width="190px"))
        self.grades.add_class("cp-search-grades")
        self.grades_box = ipw.HBox(
            [ipw.HTML("grades searched", layout=ipw.Layout(margin="0 6px 0 0")), self.grades]
        )
        self.grades_box.add_class("cp-search-grades-box")
        self.grades_box.layout.display = "none"
        return [self.grades_box]

    def _grade_options(self, species: Any, grade: Any) -> None:
        try:
            names = list(reversed(nds_sawn_grades(str(species))))
        except CalcpackError:  # an unknown species is marked at its field; offer the grade alone
            names = [str(grade)]
        if str(grade) not in names:
            names.append(str(grade))
        kept = [g for g in self.grades.value if g in names] or [str(grade)]
        self.grades.options = names
        self.grades.value = tuple(kept)
        self.grades_box.layout.display = ""

    def searched_grades(self) -> list[str] | None:
        """The grades picked for the search, in the list's order; None when the search covers
        the table's grade only (or the member is not sawn)."""
        t = self.data[self.table]
        if t.get("material") != "sawn" or not self.grades.value:
            return None
        picked = [g for g in self.grades.options if g in self.grades.value]
        return None if picked == [t.get("grade")] else picked

    def _search(self, count: int, order: Order, limit: Quantity | None) -> SizingResult:
        return lightest_beam_member(
            self.case(self.data), count=count, order=order, max_depth=limit,
            grades=self.searched_grades(),
        )  # fmt: skip

    def form(self) -> list[ipw.Widget]:
        t = self.table
        m = self.data[t]
        material = m.get("material")
        parts: list[ipw.Widget] = [ipw.HTML(f"<b>Member</b> ({material})")]
        self.grades_box.layout.display = "none"  # shown for a sawn member only
        if material == "steel":
            parts += [self.text(f"{t}.section", "Shape (AISC designation)"),
                      self.quantity(f"{t}.Fy", "F_y (yield stress)")]  # fmt: skip
        elif material == "sawn":
            parts += [self.text(f"{t}.size", "Size (nominal)"),
                      self.text(f"{t}.species", "Species", width="220px"),
                      self.text(f"{t}.grade", "Grade")]  # fmt: skip
            if "plies" in m:
                parts.append(self.number(f"{t}.plies", "Plies"))
            self._grade_options(m.get("species"), m.get("grade"))
        else:
            parts += [self.text(f"{t}.stress_class", "Stress class"),
                      self.quantity(f"{t}.width", "b (width)"),
                      self.quantity(f"{t}.depth", "d (depth)")]  # fmt: skip
        return parts


class TimberPostPanel(_SizingPanel):
    """Edit a sawn timber post table (see :mod:`calcpack.inputs.timber_post`).

    Args:
        path: the inputs file. table: the post's table. loads, le: the force sets and
            buckling length from the sheet (else the file's ``[[forces]]`` and ``le``).
        extra_keys: other keys the table holds for other cells.
    """

    kind: ClassVar[str] = "Timber post panel"
    css_class: ClassVar[str] = "cp-timber-post-panel"
    what: ClassVar[str] = "size"
    check_case = staticmethod(evaluate_timber_post)
    rank_case = staticmethod(lightest_timber_post)
    changes_for = staticmethod(post_pick_changes)

    def __init__(
        self,
        path: str | Path,
        *,
        table: str = "post",
        loads: Sequence[PostLoad] | None = None,
        le: Quantity | None = None,
        extra_keys: Sequence[str] = (),
    ) -> None:
        self.table = table
        self.loads = tuple(loads) if loads is not None else None
        self.le = le
        self.extra_keys = tuple(extra_keys)
        super().__init__(path, tables=(table,) if loads is not None else None)

    def case(self, data: Any) -> TimberPostCase:
        return timber_post_inputs(data, table=self.table, loads=self.loads, le=self.le,
                                  path=self.path, extra_keys=self.extra_keys)  # fmt: skip

    def form(self) -> list[ipw.Widget]:
        t = self.table
        p = self.data[t]
        parts: list[ipw.Widget] = [
            ipw.HTML("<b>Post</b>"),
            self.text(f"{t}.size", "Size (nominal)"),
            self.text(f"{t}.species", "Species", width="220px"),
            self.text(f"{t}.grade", "Grade"),
        ]
        if "table" in p:
            parts.append(self.choice(f"{t}.table", "NDS Supplement table", ("4A", "4D")))
        for k, what in (("le", "l_e (K_e·ℓ)"), ("le_b", "l_e across b")):
            if k in p:
                parts.append(self.quantity(f"{t}.{k}", what))
        if self.loads is None:
            parts.append(ipw.HTML("<b>Forces</b> (ASD, by combination)"))
            for i, row in enumerate(self.data.get("forces", []), start=1):
                parts.append(ipw.HTML(f"<i>{row.get('combination', i)}</i>"))
                parts.append(self.quantity(f"forces[{i}].P", "    P"))
                if "M_d" in row:
                    parts.append(self.quantity(f"forces[{i}].M_d", "    M_d"))
                parts.append(self.choice(f"forces[{i}].duration", "    duration", DURATIONS))
        return parts


def beam_member_panel(
    path: str | Path, demand: BeamDemand, *, table: str = "member"
) -> BeamMemberPanel:
    """Show the beam member panel (nothing is shown during a build)."""
    return BeamMemberPanel(path, demand, table=table)


def timber_post_panel(
    path: str | Path,
    *,
    table: str = "post",
    loads: Sequence[PostLoad] | None = None,
    le: Quantity | None = None,
    extra_keys: Sequence[str] = (),
) -> TimberPostPanel:
    """Show the timber post panel (nothing is shown during a build)."""
    return TimberPostPanel(path, table=table, loads=loads, le=le, extra_keys=extra_keys)
