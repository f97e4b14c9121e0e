"""Cross-section shapes, composite assembly and section properties.

Shapes are built from their dimensions (pint lengths, keyword-only) and validated at
construction. ``shape.properties()`` or ``composite(...).properties()`` returns a frozen
:class:`SectionProperties` of quantities; ``.working()`` builds the parts table and the
parallel-axis working for a sheet, and ``.figure()`` sketches the section (both imported lazily).
"""

from __future__ import annotations

from calcpack.sections.composite import CompositeSection, Part, composite
from calcpack.sections.integrals import (
    BoundedRegion,
    RadiusOfGyration,
    RegionIntegrals,
    second_moment_from_radius,
)
from calcpack.sections.properties import PartRow, SectionProperties
from calcpack.sections.rolled import Angle, Channel, ISection, Tee
from calcpack.sections.shapes import (
    Circle,
    HollowCircle,
    Polygon,
    Rectangle,
    RectangularHollow,
    Shape,
    Triangle,
)
from calcpack.sections.timber import DRESSED_SIZE_TABLE, DressedSize, dressed_size, sawn_timber

__all__ = [
    "DRESSED_SIZE_TABLE",
    "Angle",
    "BoundedRegion",
    "Channel",
    "Circle",
    "CompositeSection",
    "DressedSize",
    "HollowCircle",
    "ISection",
    "Part",
    "PartRow",
    "Polygon",
    "RadiusOfGyration",
    "Rectangle",
    "RectangularHollow",
    "RegionIntegrals",
    "SectionProperties",
    "Shape",
    "Tee",
    "Triangle",
    "composite",
    "dressed_size",
    "sawn_timber",
    "second_moment_from_radius",
]
