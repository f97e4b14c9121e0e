"""Cross-section shapes, composite assembly and section properties.

Shapes are built from their dimensions (pint lengths, keyword-only) and validated at
construction. ``shape.properties()`` or ``composite(...).properties()`` returns a frozen
:class:`SectionProperties` of quantities; ``.working()`` builds the parts table and the
parallel-axis working for a sheet, and ``.figure()`` sketches the section (both imported lazily).
"""

from __future__ import annotations

from calcpack.sections.composite import CompositeSection, Part, composite
from calcpack.sections.properties import PartRow, SectionProperties
from calcpack.sections.shapes import (
    Angle,
    Channel,
    Circle,
    HollowCircle,
    ISection,
    Polygon,
    Rectangle,
    RectangularHollow,
    Shape,
    Tee,
    Triangle,
)

__all__ = [
    "Angle",
    "Channel",
    "Circle",
    "CompositeSection",
    "HollowCircle",
    "ISection",
    "Part",
    "PartRow",
    "Polygon",
    "Rectangle",
    "RectangularHollow",
    "SectionProperties",
    "Shape",
    "Tee",
    "Triangle",
    "composite",
]
