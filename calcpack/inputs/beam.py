"""A continuous beam described in an inputs file, and its evaluation for the beam panel and sheet.

Layout of the tables (see ``templates/sheets/beam.inputs.toml``)::

    [beam]
    name = "B1"
    spans = ["3.6 m", "4.2 m", "3.6 m"]          # left to right
    supports = ["pin", "roller", "roller", "roller"]  # pin, roller, fixed or free, per line

    [section]                                     # see calcpack.inputs.section
    shape = "rectangle"
    b = "90 mm"
    d = "300 mm"

    [material]
    E = "11 GPa"          # modulus of elasticity
    f_b = "16 MPa"        # design bending strength, compared with M / S_x

    [[loads]]             # any number; case names are free text ("D", "L", "G", "Q", "W"...)
    case = "D"
    type = "uniform"      # uniform: w, and optionally span = 2 (1-based) or start/end
    w = "1.5 kN/m"

    [[loads]]
    case = "L"
    type = "point"        # point: P at x from the left end
    P = "6 kN"
    x = "5.4 m"

    [combinations]        # load factors by case
    strength = { D = 1.2, L = 1.6 }
    service = { D = 1.0, L = 1.0 }

    [limits]
    deflection_ratio = 300   # each span's deflection limit is span / ratio

:func:`beam_inputs` validates the tables (every error names the key); :func:`evaluate_beam`
solves the beam per load case, combines, and makes the bending and deflection checks. The
beam panel and the sheet's calc cells call the same two functions, so they show the same numbers.
"""

from __future__ import annotations

import itertools
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from functools import cached_property
from pathlib import Path
from typing import Any

from calcpack.inputs.file import (
    InputsFileError,
    Spec,
    cached_unit,
    require_input,
)
from calcpack.inputs.layout import Table, Tables, refuse_unknown_keys
from calcpack.inputs.section import section_from_inputs
from calcpack.units import Q_, Quantity, si

__all__ = [
    "SUPPORT_KINDS",
    "BeamInputs",
    "BeamOutcome",
    "SpanDeflection",
    "beam_inputs",
    "evaluate_beam",
]

SUPPORT_KINDS = ("pin", "roller", "fixed", "free")
LOAD_TYPES = ("uniform", "point")

LAYOUT = Table(
    {
        "beam": Table({"name": None, "spans": None, "supports": None}),
        "section": None,  # its keys depend on its shape: section_from_inputs checks them
        "material": Table({"E": None, "f_b": None}),
        "loads": Tables(
            Table(dict.fromkeys(("case", "type", "w", "span", "start", "end", "P", "x")))
        ),
        "combinations": Table(
            {"strength": Table(free=True), "service": Table(free=True)}  # factors by load case
        ),
        "limits": Table({"deflection_ratio": None}),
    }
)
"""The keys a beam inputs file may hold (see the module notes)."""


def _where(path: Path | str | None) -> str:
    return f"{Path(path).name}: " if path is not None else ""


@dataclass(frozen=True)
class BeamInputs:
    """The validated beam inputs (quantities as given in the file).

    Attributes:
        name: the member mark. spans: span lengths left to right [length]. supports: the
        kind at each support line (len(spans) + 1). section: a calcpack.sections Shape.
        E: modulus of elasticity [pressure]. f_b: design bending strength [pressure].
        loads: calcpack.loads objects with their case names. strength, service: load factors
        by case. deflection_ratio: the span / deflection limit ratio (a number).
    """

    name: str
    spans: tuple[Quantity, ...]
    supports: tuple[str, ...]
    section: Any
    E: Quantity
    f_b: Quantity
    loads: tuple[Any, ...]
    strength: dict[str, float]
    service: dict[str, float]
    deflection_ratio: float

    @property
    def length(self) -> Quantity:
        return self.support_x[-1]

    @cached_property
    def support_x_m(self) -> tuple[float, ...]:
        """Position of each support line from the left end, in metres (worked out once: the
        panel's drawings read them many times per edit)."""
        m = cached_unit("m")
        x_m = [0.0]
        for s in self.spans:
            x_m.append(x_m[-1] + float(s.to(m).magnitude))
        return tuple(x_m)

    @property
    def support_x(self) -> tuple[Quantity, ...]:
        """Position of each support line from the left end."""
        m = cached_unit("m")
        return tuple(Q_(x, m) for x in self.support_x_m)

    def model(self, EI: Quantity) -> Any:
        """The :class:`calcpack.analysis.beam.Beam` with flexural stiffness ``EI``."""
        from calcpack.analysis.beam import Beam, Fixed, Pin, Roller

        kinds = {"pin": Pin, "roller": Roller, "fixed": Fixed}
        names = iter("ABCDEFGHJKLMNPQRSTUVWXYZ")
        supports = []
        for kind, x in zip(self.supports, self.support_x, strict=True):
            label = next(names)
            if kind != "free":
                supports.append(kinds[kind](x, name=label))
        return Beam(
            length=self.length, supports=supports, loads=list(self.loads), EI=EI, name=self.name
        )


def _table(data: Mapping[str, Any], key: str, path: Path | str | None) -> Mapping[str, Any]:
    value = data.get(key)
    if not isinstance(value, Mapping):
        raise InputsFileError(
            f"{_where(path)}table [{key}] is missing" + ("" if value is None else " (not a table)"),
            name=key,
            value=value,
            expected=f"a [{key}] table",
        )
    return value


def _factors(table: Any, key: str, path: Path | str | None) -> dict[str, float]:
    if not isinstance(table, Mapping) or not table:
        raise InputsFileError(
            f"{_where(path)}{key} must be a table of load factors by case, e.g. "
            "{ D = 1.2, L = 1.6 } (got " + repr(table) + ")",
            name=key,
            value=table,
            expected="{ case = factor, ... }",
        )
    return {
        str(c): float(require_input(f, Spec("number", nonnegative=True), f"{key}.{c}", path=path))
        for c, f in table.items()
    }


def _load(item: Any, key: str, spans_x: Sequence[Quantity], path: Path | str | None) -> Any:
    from calcpack.loads import PointLoad, UniformLoad

    if not isinstance(item, Mapping):
        raise InputsFileError(
            f"{_where(path)}{key} must be a table ([[loads]]) (got {item!r})",
            name=key,
            value=item,
            expected="a [[loads]] table",
        )
    case = require_input(item.get("case", "D"), "text", f"{key}.case", path=path)
    kind = require_input(
        item.get("type"), Spec("text", choices=LOAD_TYPES), f"{key}.type", path=path
    )
    if kind == "uniform":
        w = require_input(item.get("w"), "[force] / [length]", f"{key}.w", path=path)
        start = end = None
        if "span" in item:
            n = require_input(item["span"], Spec("number", positive=True), f"{key}.span", path=path)
            if int(n) != n or not 1 <= n <= len(spans_x) - 1:
                raise InputsFileError(
                    f"{_where(path)}{key}.span must be a span number from 1 to "
                    f"{len(spans_x) - 1} (got {n})",
                    name=f"{key}.span",
                    value=n,
                    expected=f"1 to {len(spans_x) - 1}",
                )
            start, end = spans_x[int(n) - 1], spans_x[int(n)]
        if "start" in item:
            start = require_input(
                item["start"], Spec("[length]", nonnegative=True), f"{key}.start", path=path
            )
        if "end" in item:
            end = require_input(
                item["end"], Spec("[length]", positive=True), f"{key}.end", path=path
            )
        extra: dict[str, Any] = {}
        if start is not None:
            extra["start"] = start
        extra["end"] = end if end is not None else spans_x[-1]
        return _build(UniformLoad, key, path, w=w, case=case, **extra)
    P = require_input(item.get("P"), "[force]", f"{key}.P", path=path)
    x = require_input(item.get("x"), Spec("[length]", nonnegative=True), f"{key}.x", path=path)
    if si(x) > si(spans_x[-1]) * (1 + 1e-12):
        raise InputsFileError(
            f"{_where(path)}{key}.x must lie on the beam, 0 to {spans_x[-1]:~P} (got x = {x:~P})",
            name=f"{key}.x",
            value=x,
            expected=f"0 <= x <= {spans_x[-1]:~P}",
        )
    return _build(PointLoad, key, path, x=x, P=P, case=case)


def _build(cls: Any, key: str, path: Path | str | None, **kwargs: Any) -> Any:
    from calcpack.errors import InputError

    try:
        return cls(**kwargs)
    except InputError as exc:
        raise InputsFileError(
            f"{_where(path)}{key}: {exc}",
            name=f"{key}.{exc.name}" if exc.name else key,
            value=exc.value,
            expected=exc.expected,
        ) from None


def beam_inputs(data: Mapping[str, Any], *, path: Path | str | None = None) -> BeamInputs:
    """Validate the beam tables of loaded inputs (see the module docstring for the layout).

    Raises:
        InputsFileError, DimensionError: a missing or malformed value; the message names the
            key (``"beam.spans[2]"``, ``"loads[3].w"``) and the file.
    """
    refuse_unknown_keys(data, LAYOUT, path=path)
    beam = _table(data, "beam", path)
    name = require_input(beam.get("name", "B1"), "text", "beam.name", path=path)
    spans_raw = beam.get("spans")
    if not isinstance(spans_raw, list) or not spans_raw:
        raise InputsFileError(
            f"{_where(path)}beam.spans must be a list of span lengths, e.g. "
            f'["3.6 m", "4.2 m"] (got {spans_raw!r})',
            name="beam.spans",
            value=spans_raw,
            expected="a non-empty list of lengths",
        )
    spans = tuple(
        require_input(s, Spec("[length]", positive=True), f"beam.spans[{i}]", path=path)
        for i, s in enumerate(spans_raw, start=1)
    )
    sup_raw = beam.get("supports")
    if not isinstance(sup_raw, list) or len(sup_raw) != len(spans) + 1:
        raise InputsFileError(
            f"{_where(path)}beam.supports must list one support per support line, "
            f"{len(spans) + 1} for {len(spans)} span(s) (got {sup_raw!r})",
            name="beam.supports",
            value=sup_raw,
            expected=f"a list of {len(spans) + 1} of {', '.join(SUPPORT_KINDS)}",
        )
    supports = tuple(
        require_input(s, Spec("text", choices=SUPPORT_KINDS), f"beam.supports[{i}]", path=path)
        for i, s in enumerate(sup_raw, start=1)
    )
    section = section_from_inputs(_table(data, "section", path), path=path)
    material = _table(data, "material", path)
    E = require_input(material.get("E"), Spec("[pressure]", positive=True), "material.E", path=path)
    f_b = require_input(
        material.get("f_b"), Spec("[pressure]", positive=True), "material.f_b", path=path
    )
    x_lines = [Q_(0.0, cached_unit("m"))]
    for s in spans:
        x_lines.append(x_lines[-1] + s.to(cached_unit("m")))
    loads_raw = data.get("loads", [])
    if not isinstance(loads_raw, list):
        raise InputsFileError(
            f"{_where(path)}loads must be an array of tables ([[loads]]) (got {loads_raw!r})",
            name="loads",
            value=loads_raw,
            expected="[[loads]] tables",
        )
    loads = tuple(
        _load(item, f"loads[{i}]", x_lines, path) for i, item in enumerate(loads_raw, start=1)
    )
    combos = _table(data, "combinations", path)
    strength = _factors(combos.get("strength"), "combinations.strength", path)
    service = _factors(combos.get("service"), "combinations.service", path)
    cases = {ld.case for ld in loads}
    for combo_key, factors in (("strength", strength), ("service", service)):
        for case in factors:
            if case not in cases:
                raise InputsFileError(
                    f"{_where(path)}combinations.{combo_key}.{case}: no load has case "
                    f"{case!r} (load cases: {sorted(cases)})",
                    name=f"combinations.{combo_key}.{case}",
                    value=factors[case],
                    expected=f"one of {sorted(cases)}",
                )
        # A case left out of a combination would silently drop its loads from the checks.
        for case in sorted(cases - set(factors)):
            raise InputsFileError(
                f"{_where(path)}combinations.{combo_key} has no factor for load case {case!r}; "
                f"add {case} = <factor> (0 if the case does not act in this combination)",
                name=f"combinations.{combo_key}.{case}",
                value=None,
                expected="a load factor for every load case",
            )
    limits = data.get("limits", {})
    ratio = require_input(
        limits.get("deflection_ratio", 360) if isinstance(limits, Mapping) else limits,
        Spec("number", positive=True),
        "limits.deflection_ratio",
        path=path,
    )
    return BeamInputs(
        name=name,
        spans=spans,
        supports=supports,
        section=section,
        E=E,
        f_b=f_b,
        loads=loads,
        strength=strength,
        service=service,
        deflection_ratio=float(ratio),
    )


@dataclass(frozen=True)
class SpanDeflection:
    """The largest deflection in one span under the service combination (downward +)."""

    span: int
    length: Quantity
    delta: Quantity
    x: Quantity
    limit: Quantity

    @property
    def utilisation(self) -> float:
        return abs(si(self.delta)) / si(self.limit)


@dataclass(frozen=True)
class BeamOutcome:
    """The evaluated beam: section properties, results per case and combination, checks.

    Attributes:
        inputs: the validated inputs. properties: the section's SectionProperties.
        EI: the flexural stiffness used. cases: load case -> BeamResult.
        strength, service: the combined results. M_design: the largest |M| under the
        strength combination, at x_M. sigma: M_design / S_x. bending_utilisation: sigma / f_b.
        deflections: per span, the largest service deflection and its limit.
    """

    inputs: BeamInputs
    properties: Any
    EI: Quantity
    cases: dict[str, Any]
    strength: Any
    service: Any
    M_design: Quantity
    x_M: Quantity
    sigma: Quantity
    bending_utilisation: float
    deflections: tuple[SpanDeflection, ...]

    @property
    def deflection_utilisation(self) -> float:
        return max(d.utilisation for d in self.deflections)

    @property
    def governing_deflection(self) -> SpanDeflection:
        return max(self.deflections, key=lambda d: d.utilisation)

    def working(self, sheet: Any, *, source: str = "inputs file") -> None:
        """Add the working (inputs, section, analysis, checks) to ``sheet``, a
        :class:`calcpack.working.Sheet`; built lazily, never on the panel's path."""
        from calcpack.inputs.beam_working import beam_working

        beam_working(self, sheet, source=source)

    def diagrams(self) -> Any:
        """The loading / V / M / δ diagrams -- the drawing the beam panel shows -- for display
        (SVG)."""
        from calcpack.inputs.beam_working import BeamDiagrams

        return BeamDiagrams(self)


def evaluate_beam(inputs: BeamInputs) -> BeamOutcome:
    """Solve the beam for each load case, combine, and make the bending and deflection checks.

    Sign convention (as in :mod:`calcpack.analysis.beam`): loads downward +, M sagging +,
    deflection downward +.

    Raises:
        UnstableStructureError: the supports cannot carry the loads.
        InputsFileError: no loads, or a combination without loads.
    """
    from calcpack.analysis.beam import combine, solve_cases

    if not inputs.loads:
        raise InputsFileError(
            "The beam has no loads: add a [[loads]] table",
            name="loads",
            value=[],
            expected="at least one load",
        )
    props = inputs.section.properties()
    u = cached_unit
    EI = (inputs.E * props.Ix).to(u("kN*m**2"))
    beam = inputs.model(EI)
    cases = solve_cases(beam)
    strength = combine(cases, inputs.strength)
    service = combine(cases, inputs.service)
    ext = strength.extremes
    if abs(si(ext.M_max.value)) >= abs(si(ext.M_min.value)):
        M, x_M = ext.M_max.value, ext.M_max.x
    else:
        M, x_M = ext.M_min.value, ext.M_min.x
    M_abs = abs(M).to(u("kN*m"))
    sigma = (M_abs / props.Sx).to(u("MPa"))
    util = float((sigma / inputs.f_b).to(u("")).magnitude)
    lines = inputs.support_x_m
    defl = []
    for i, (a, b) in enumerate(itertools.pairwise(lines), start=1):
        peak = service.range_extremes("deflection", Q_(a, u("m")), Q_(b, u("m"))).magnitude
        span = inputs.spans[i - 1]
        limit = (span / inputs.deflection_ratio).to(u("mm"))
        defl.append(SpanDeflection(i, span, peak.value.to(u("mm")), peak.x, limit))
    return BeamOutcome(
        inputs=inputs,
        properties=props,
        EI=EI,
        cases=cases,
        strength=strength,
        service=service,
        M_design=M_abs,
        x_M=x_M,
        sigma=sigma,
        bending_utilisation=util,
        deflections=tuple(defl),
    )
