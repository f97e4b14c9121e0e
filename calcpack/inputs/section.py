"""A cross-section described in an inputs file: ``shape`` and its dimensions.

Example table::

    [section]
    shape = "rectangle"      # rectangle, i-section, channel, tee, circle, tube, box
    b = "90 mm"
    d = "300 mm"

The shape names and dimension keys are those of :mod:`calcpack.sections.shapes`.
"""

from __future__ import annotations

from collections.abc import Mapping
from pathlib import Path
from typing import Any

from calcpack.errors import CalcpackError, InputError
from calcpack.inputs.file import InputsFileError, Spec, require_input
from calcpack.inputs.layout import Table, refuse_unknown_keys

__all__ = ["SHAPES", "ShapeForm", "section_from_inputs", "section_inputs"]


class ShapeForm:
    """One shape an inputs file may name: its class name, required and optional dimensions.

    Attributes:
        key: the name written in the file (``"i-section"``).
        label: the name shown on a panel.
        required: dimension keys that must be given, in display order.
        optional: dimension keys that may be left out (fillet or corner radius).
        defaults: suggested starting values (unit strings) for a new section of this shape.
    """

    def __init__(
        self,
        key: str,
        label: str,
        cls_name: str,
        required: tuple[str, ...],
        optional: tuple[str, ...],
        defaults: Mapping[str, str],
        descriptions: Mapping[str, str],
    ) -> None:
        self.key = key
        self.label = label
        self.cls_name = cls_name
        self.required = required
        self.optional = optional
        self.defaults = dict(defaults)
        self.descriptions = dict(descriptions)

    @property
    def dims(self) -> tuple[str, ...]:
        return self.required + self.optional

    def build(self, values: Mapping[str, Any]) -> Any:
        from calcpack import sections

        cls = getattr(sections, self.cls_name)
        return cls(**{k: v for k, v in values.items() if k in self.dims})


_I_DESC = {
    "d": "overall depth",
    "bf": "flange width",
    "tf": "flange thickness",
    "tw": "web thickness",
    "r": "root radius",
}

SHAPES: dict[str, ShapeForm] = {
    f.key: f
    for f in (
        ShapeForm(
            "rectangle",
            "Rectangle",
            "Rectangle",
            ("b", "d"),
            (),
            {"b": "90 mm", "d": "240 mm"},
            {"b": "width", "d": "depth"},
        ),
        ShapeForm(
            "i-section",
            "I-section",
            "ISection",
            ("d", "bf", "tf", "tw"),
            ("r",),
            {"d": "310 mm", "bf": "165 mm", "tf": "9.7 mm", "tw": "5.8 mm", "r": "8.9 mm"},
            _I_DESC,
        ),
        ShapeForm(
            "channel",
            "Channel",
            "Channel",
            ("d", "bf", "tf", "tw"),
            ("r",),
            {"d": "200 mm", "bf": "75 mm", "tf": "12 mm", "tw": "6 mm", "r": "12 mm"},
            _I_DESC,
        ),
        ShapeForm(
            "tee",
            "Tee",
            "Tee",
            ("d", "bf", "tf", "tw"),
            ("r",),
            {"d": "150 mm", "bf": "150 mm", "tf": "10 mm", "tw": "8 mm", "r": "8 mm"},
            {**_I_DESC, "tw": "stem thickness"},
        ),
        ShapeForm(
            "circle",
            "Solid circle",
            "Circle",
            ("d",),
            (),
            {"d": "60 mm"},
            {"d": "diameter"},
        ),
        ShapeForm(
            "tube",
            "Circular hollow",
            "HollowCircle",
            ("D", "t"),
            (),
            {"D": "114.3 mm", "t": "5 mm"},
            {"D": "outside diameter", "t": "wall thickness"},
        ),
        ShapeForm(
            "box",
            "Rectangular hollow",
            "RectangularHollow",
            ("b", "d", "t"),
            ("r",),
            {"b": "100 mm", "d": "200 mm", "t": "6 mm", "r": "12 mm"},
            {"b": "width", "d": "depth", "t": "wall thickness", "r": "outside corner radius"},
        ),
    )
}


def section_from_inputs(
    table: Mapping[str, Any], *, key: str = "section", path: Path | str | None = None
) -> Any:
    """The :class:`calcpack.sections.Shape` a ``[section]`` table describes.

    Args:
        table: the loaded table (see :func:`calcpack.inputs.load_inputs`).
        key: the table's dotted key, used in messages.
        path: the inputs file, used in messages.

    Raises:
        InputsFileError: unknown shape, a missing dimension, a dimension that is not a length;
            the shape's own checks (e.g. web thicker than flange) with the key prefixed.
    """
    shape = require_input(
        table.get("shape"), Spec("text", choices=tuple(SHAPES)), f"{key}.shape", path=path
    )
    form = SHAPES[shape]
    refuse_unknown_keys(
        table,
        Table(dict.fromkeys(("shape", *form.dims)), note=f"for shape {shape!r}"),
        path=path,
        where=key,
    )
    values: dict[str, Any] = {}
    for dim in form.dims:
        if dim not in table:
            if dim in form.optional:
                continue
            raise InputsFileError(
                f"{Path(path).name + ': ' if path else ''}section shape {shape!r} needs "
                f"{key}.{dim} ({form.descriptions.get(dim, dim)}), which is missing; add e.g. "
                f'{dim} = "{form.defaults.get(dim, "100 mm")}"',
                name=f"{key}.{dim}",
                value=None,
                expected="a length",
            )
        values[dim] = require_input(
            table[dim],
            Spec("[length]", nonnegative=dim in form.optional),
            f"{key}.{dim}",
            path=path,
        )
    try:
        return form.build(values)
    except InputError as exc:
        name = f"{key}.{exc.name}" if exc.name else key
        raise InputsFileError(
            f"{Path(path).name + ': ' if path else ''}{key}: {exc}",
            name=name,
            value=exc.value,
            expected=exc.expected,
        ) from None
    except CalcpackError:
        raise


def section_inputs(data: Mapping[str, Any], *, path: Path | str | None = None) -> Any:
    """The shape of a section inputs file: its one ``[section]`` table (see
    :func:`section_from_inputs`).

    Raises:
        InputsFileError: a key other than ``[section]``, a missing table, or what
            :func:`section_from_inputs` refuses; the message names the file and the key.
    """
    refuse_unknown_keys(data, Table({"section": None}), path=path)
    table = data.get("section")
    if not isinstance(table, Mapping):
        raise InputsFileError(
            f"{Path(path).name + ': ' if path else ''}no [section] table (got {table!r})",
            name="section",
            value=table,
            expected="a [section] table with shape and its dimensions",
        )
    return section_from_inputs(table, path=path)
