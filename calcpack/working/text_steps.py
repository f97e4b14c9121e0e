"""Sheet steps that carry words and layout rather than values: headings, prose, assumptions,
cautions, tables and titled blocks."""

from __future__ import annotations

from collections.abc import Iterable, Sequence
from dataclasses import dataclass, field
from typing import Any

from calcpack.contract.records import Record
from calcpack.errors import InputError
from calcpack.units import DisplaySettings
from calcpack.working.prose import Citation, fill
from calcpack.working.step_base import Step

__all__ = ["Assume", "Block", "Caution", "Heading", "Table", "Text"]


class Heading(Step):
    """A heading inside a sheet (level 2 = section, 3 = subsection)."""

    kind = "heading"

    def __init__(self, text: str, level: int = 2) -> None:
        if level not in (1, 2, 3, 4):
            raise InputError(
                f"Heading level must be 1 to 4 (got {level!r})",
                name="level",
                value=level,
                expected="1, 2, 3 or 4",
            )
        self.title = text
        self.level = level


class Text(Step):
    """A paragraph of prose; ``$...$`` marks inline TeX math, blank lines separate paragraphs.

    Args:
        body: the prose; with ``citations``, a template from :func:`calcpack.working.prose.cite`
            (each citation's place marked), and ``body`` becomes its plain-text reading.
        citations: recorded values cited in the prose, typeset by the renderers.
    """

    kind = "text"

    def __init__(self, body: str, citations: tuple[Citation, ...] = ()) -> None:
        self.template = body
        self.citations = citations
        self.body = fill(body, citations, Citation.text) if citations else body

    @property
    def tex_body(self) -> str:
        """The prose with each citation as inline TeX (``$R_{A} = 2.61\\ \\mathrm{kip}$``)."""
        if not self.citations:
            return self.body
        return fill(self.template, self.citations, lambda c: f"${c.tex()}$")


class Assume(Text):
    """An assumption the sheet declares; collected into the package's assumptions block."""

    kind = "assume"

    def records(self) -> dict[str, list[Any]]:
        return {"assumptions": [self.tex_body]}


class Caution(Text):
    """A caution the sheet declares; collected into the package's caution block."""

    kind = "caution"

    def records(self) -> dict[str, list[Any]]:
        return {"cautions": [self.tex_body]}


class Table(Step):
    """A table: cells may be text (``$...$`` for TeX), numbers, quantities or values."""

    kind = "table"

    def __init__(
        self,
        columns: Sequence[str],
        rows: Iterable[Sequence[Any]],
        *,
        caption: str | None = None,
        settings: DisplaySettings | None = None,
        values: Sequence[Record] = (),
    ) -> None:
        """``values``: what the table states, recorded for the manifest (e.g. a table of loads
        records each magnitude and position as an input)."""
        self.columns = list(columns)
        self.rows = [list(r) for r in rows]
        self.values = tuple(values)
        for i, r in enumerate(self.rows):
            if len(r) != len(self.columns):
                raise InputError(
                    f"Table row {i + 1} has {len(r)} cells but there are {len(self.columns)} "
                    "columns",
                    name=f"rows[{i}]",
                    value=r,
                    expected=f"{len(self.columns)} cells",
                )
        self.caption = caption
        self.settings = settings

    def records(self) -> dict[str, list[Any]]:
        return {"values": [v.to_json() for v in self.values]} if self.values else {}


@dataclass
class Block(Step):
    """A titled group of steps, e.g. the reaction working an analysis produces."""

    steps: list[Step] = field(default_factory=list)
    title: str | None = None
    kind = "block"

    def records(self) -> dict[str, list[Any]]:
        out: dict[str, list[Any]] = {}
        for s in self.steps:
            for k, v in s.records().items():
                out.setdefault(k, []).extend(v)
        return out
