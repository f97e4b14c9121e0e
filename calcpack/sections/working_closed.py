"""The working of a single plain shape: each property in one line from its closed form.

A rectangle, a circle or a tube needs no parts table: the checker reads A = b·d, I = b·d³/12,
S = b·d²/6 and the substitution, one line each (closed forms of common practice; also in any
strength-of-materials text's table of plane areas). Imported only from
:func:`calcpack.sections.working.section_working`.
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

import sympy

if TYPE_CHECKING:
    from calcpack.sections.properties import SectionProperties
    from calcpack.working import Step

__all__ = ["closed_form_steps", "has_closed_form"]


def has_closed_form(props: SectionProperties) -> bool:
    """Whether the section is one plain shape whose properties have a closed form here."""
    from calcpack.sections.shapes import Circle, HollowCircle, Rectangle

    return isinstance(props.section, Rectangle | Circle | HollowCircle)


def closed_form_steps(
    props: SectionProperties, show: frozenset[str], units: tuple[str, str, str, str]
) -> list[Step]:
    """The steps of the properties in ``show``, each from its closed form.

    Args:
        props: properties of a :class:`Rectangle`, :class:`Circle` or :class:`HollowCircle`
            (see :func:`has_closed_form`).
        show: property keys (see :data:`calcpack.sections.working.PROPERTIES`).
        units: pint units of length, area, first and second moment.
    """
    from calcpack.sections.shapes import Circle, HollowCircle, Rectangle
    from calcpack.working import Derived, Given, Term, Text, sqrt

    u1, u2, u3, u4 = units
    section = props.section
    name = section.name
    pi = Term(sympy.pi, {})
    steps: list[Any] = []
    values: dict[str, Any] = {}

    def derive(key: str, formula: Any, what: str, unit: str, ref: str) -> Any:
        step = Derived(key, formula, what, unit=unit, ref=ref)
        values[key] = step
        if key in show:
            steps.append(step)
        return step

    if isinstance(section, Rectangle):
        b = Given("b", section.b, "width", unit=u1, source=name)
        d = Given("d", section.d, "depth", unit=u1, source=name)
        steps += [b, d]
        A = derive("A", b * d, "area", u2, "rectangle, A = b·d")
        I_x = derive("I_x", b * d**3 / 12, "second moment about x", u4, "rectangle, b·d³/12")
        derive("S_x", b * d**2 / 6, "elastic modulus about x", u3, "rectangle, b·d²/6")
        derive("Z_x", b * d**2 / 4, "plastic modulus about x", u3, "rectangle, b·d²/4")
        I_y = derive("I_y", d * b**3 / 12, "second moment about y", u4, "rectangle, d·b³/12")
        derive("S_y", d * b**2 / 6, "elastic modulus about y", u3, "rectangle, d·b²/6")
        derive("Z_y", d * b**2 / 4, "plastic modulus about y", u3, "rectangle, d·b²/4")
    elif isinstance(section, Circle):
        D = Given("D", section.d, "diameter", unit=u1, source=name)
        steps.append(D)
        A = derive("A", pi * D**2 / 4, "area", u2, "circle, π·D²/4")
        I_x = derive("I_x", pi * D**4 / 64, "second moment about a diameter", u4, "circle")
        derive("S_x", pi * D**3 / 32, "elastic modulus", u3, "circle, π·D³/32")
        derive("Z_x", D**3 / 6, "plastic modulus", u3, "circle, D³/6")
        I_y = I_x
    else:
        assert isinstance(section, HollowCircle)  # has_closed_form
        D = Given("D", section.D, "outside diameter", unit=u1, source=name)
        t = Given("t", section.t, "wall thickness", unit=u1, source=name)
        steps += [D, t]
        d_i = Derived("d_i", D - 2 * t, "inside diameter", unit=u1)
        if show - {"J", "C_w"}:
            steps.append(d_i)
        A = derive("A", pi * (D**2 - d_i**2) / 4, "area", u2, "tube, π(D² − d²)/4")
        I_x = derive("I_x", pi * (D**4 - d_i**4) / 64, "second moment about a diameter", u4, "tube")
        derive("S_x", 2 * I_x / D, "elastic modulus", u3, "S = I/(D/2)")
        derive("Z_x", (D**3 - d_i**3) / 6, "plastic modulus", u3, "tube, (D³ − d³)/6")
        I_y = I_x
    if "principal" in show:
        steps.append(Text("Symmetric about x and y: these are the principal axes ($I_{xy} = 0$)."))
    if "r_x" in show:
        steps.append(Derived("r_x", sqrt(I_x / A), "radius of gyration about x", unit=u1))
    if "r_y" in show and isinstance(section, Rectangle):
        steps.append(Derived("r_y", sqrt(I_y / A), "radius of gyration about y", unit=u1))
    if "J" in show and props.J_value is not None:
        ref = (
            "Saint-Venant series for a rectangle"
            if isinstance(section, Rectangle)
            else "J = 2I, polar second moment"
        )
        steps.append(Derived("J", props.J_value, "torsion constant", unit=u4, ref=ref))
    return steps
