"""The working a checker reads for a section, built from calcpack.working steps on demand.

Imported only from the ``working()`` methods of section results, never at package import.
The parts table (Aᵢ, ȳᵢ, Aᵢȳᵢ, Īᵢ, dᵢ, Aᵢdᵢ² and their sums) is followed by the centroid
x̄ = ΣAᵢx̄ᵢ / ΣAᵢ and the parallel-axis theorem I = Σ(Īᵢ + Aᵢdᵢ²) with the sums substituted,
then the radii of gyration, elastic and plastic moduli.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import TYPE_CHECKING, Any

from calcpack.units import Q_, Quantity

if TYPE_CHECKING:
    from calcpack.sections.integrals import RadiusOfGyration, RegionIntegrals
    from calcpack.sections.properties import SectionProperties
    from calcpack.working import Block

__all__ = [
    "DEFAULT_SHOW",
    "PROPERTIES",
    "radius_working",
    "region_working",
    "resolve_show",
    "section_working",
]

_UNITS = {"SI": ("mm", "mm²", "mm³", "mm⁴"), "US": ("in", "in²", "in³", "in⁴")}
_PINT = {"SI": ("mm", "mm**2", "mm**3", "mm**4"), "US": ("inch", "inch**2", "inch**3", "inch**4")}


def _system(system: str | None, sheet: Any = None) -> str:
    from calcpack.units import get_display, validate_display

    validate_display(system, None)
    if system is None and sheet is not None:
        return str(sheet.settings.system)
    return system or get_display().system


def _finish(block: Block, sheet: Any) -> Block:
    """Give the steps the sheet's display settings and add the block to it, if one is given."""
    if sheet is not None:
        for step in [block, *block.steps]:
            if getattr(step, "settings", None) is None:
                step.settings = sheet.settings
        sheet.add(block)
    return block


def _num(value_si: float, power: int, system: str) -> Quantity:
    return Q_(value_si, f"m**{power}" if power > 1 else "m").to(_PINT[system][power - 1])


PROPERTIES = (
    "A", "I_x", "S_x", "r_x", "Z_x", "I_y", "S_y", "r_y", "Z_y", "principal", "J", "C_w",
)  # fmt: skip
"""The properties a section's working can show (``show=``), in the order shown."""

DEFAULT_SHOW = ("A", "I_x", "S_x")
"""What a bending check reads: the working shows these unless asked for more."""

_NEEDS = {
    "S_x": {"I_x"},
    "r_x": {"I_x", "A"},
    "S_y": {"I_y"},
    "r_y": {"I_y", "A"},
    "principal": {"I_x", "I_y"},
}
_Y_AXIS = {"I_y", "S_y", "r_y", "Z_y", "principal"}


def resolve_show(show: str | Sequence[str] | None, axes: str = "both") -> frozenset[str]:
    """The set of property keys to show: ``None`` the default, ``"all"`` every one.

    Raises:
        InputError: an unknown key, naming it and the valid ones.
    """
    from calcpack.errors import InputError
    from calcpack.validate import one_of

    one_of("axes", axes, ("x", "both"))
    if show is None:
        keys = set(DEFAULT_SHOW)
    elif show == "all":
        keys = set(PROPERTIES)
    else:
        keys = {show} if isinstance(show, str) else set(show)
        unknown = sorted(keys - set(PROPERTIES))
        if unknown:
            raise InputError(
                name="show",
                value=unknown[0],
                expected=f"'all' or some of {', '.join(PROPERTIES)}",
            )
    if axes == "x":
        keys -= _Y_AXIS
    for key in list(keys):
        keys |= _NEEDS.get(key, set())
    return frozenset(keys)


def section_working(
    props: SectionProperties,
    *,
    show: str | Sequence[str] | None = None,
    system: str | None = None,
    axes: str = "both",
    title: str | None = None,
    sheet: Any = None,
) -> Block:
    """The working of a section's properties, in proportion to the section.

    One plain shape (rectangle, circle, tube) shows each property in one line from its closed
    form (A = b·d, I = b·d³/12, S = b·d²/6); a section of several parts shows the parts table,
    the centroid and the parallel-axis theorem.

    Args:
        props: the section's properties.
        show: the properties to show (see :data:`PROPERTIES`): by default those a bending
            check reads, :data:`DEFAULT_SHOW`; ``"all"`` for every one (a section sheet).
            What a shown property needs (I_x for S_x) is shown with it.
        system: "SI" (mm) or "US" (in); default the global display setting.
        axes: "x" leaves out every y-axis property, "both" keeps those asked for.
        title: the block title (default: "Section properties: <name>").
        sheet: a :class:`calcpack.working.Sheet`: its unit system and figures are used (unless
            ``system`` is given) and the block is added to it.

    Returns:
        a :class:`calcpack.working.Block` to ``sheet.add(...)`` or display.

    Raises:
        InputError: an unknown property in ``show`` or axes other than "x" and "both".
    """
    from calcpack.sections.working_closed import closed_form_steps, has_closed_form
    from calcpack.working import Block, Derived, Table, Text, sqrt

    keys = resolve_show(show, axes)
    sysname = _system(system, sheet)
    name = props.section.name
    block_title = title or f"Section properties: {name}"
    if has_closed_form(props):
        steps_closed = closed_form_steps(props, keys, _PINT[sysname])
        return _finish(Block(steps=steps_closed, title=block_title), sheet)
    L, L2, L3, L4 = _UNITS[sysname]
    u1, u2, u3, u4 = _PINT[sysname]
    rows = props.rows
    transformed = any(abs(abs(r.weight) - 1.0) > 1e-12 for r in rows)
    steps: list[Any] = []
    single = len(rows) == 1
    if transformed:
        steps.append(
            Text(
                "Transformed section: each part's area counts $n_i$ times, "
                "$n_i = E_i / E_{ref}$ (modular ratio); holes count negative."
            )
        )
    elif any(r.A < 0 for r in rows):
        steps.append(Text("Holes enter the table with negative area."))

    def table(axis: str) -> Table:
        c = "y" if axis == "x" else "x"
        cols = ["Part"]
        if transformed:
            cols.append("$n_i$")
        cols += [
            f"$A_i$ ({L2})",
            rf"$\bar{{{c}}}_i$ ({L})",
            rf"$A_i \bar{{{c}}}_i$ ({L3})",
            rf"$\bar{{I}}_{{{axis},i}}$ ({L4})",
            rf"$d_i = \bar{{{c}}}_i - \bar{{{c}}}$ ({L})",
            rf"$A_i d_i^2$ ({L4})",
        ]
        body: list[list[Any]] = []
        sums = [0.0, 0.0, 0.0, 0.0]
        for r in rows:
            pos = r.y if axis == "x" else r.x
            own = r.Ix if axis == "x" else r.Iy
            d = r.dy if axis == "x" else r.dx
            cells: list[Any] = [r.name]
            if transformed:
                cells.append(abs(r.weight))
            vals = [r.A, pos, r.A * pos, own, d, r.A * d * d]
            powers = [2, 1, 3, 4, 1, 4]
            cells += [
                float(_num(v, p, sysname).magnitude) for v, p in zip(vals, powers, strict=True)
            ]
            body.append(cells)
            sums[0] += r.A
            sums[1] += r.A * pos
            sums[2] += own
            sums[3] += r.A * d * d
        total: list[Any] = ["**Σ**"] + ([""] if transformed else [])
        total += [
            float(_num(sums[0], 2, sysname).magnitude),
            "",
            float(_num(sums[1], 3, sysname).magnitude),
            float(_num(sums[2], 4, sysname).magnitude),
            "",
            float(_num(sums[3], 4, sysname).magnitude),
        ]
        body.append(total)
        return Table(
            columns=cols,
            rows=body,
            caption=f"Parts of {name}, about the {axis} axis",
        )

    def q(v: float, p: int) -> Quantity:
        return _num(v, p, sysname)

    sum_A = sum(r.A for r in rows)
    want_x = bool(keys & {"I_x", "S_x", "r_x", "principal"})
    want_y = bool(keys & {"I_y", "S_y", "r_y", "principal"})
    if single:
        # One part: no table of one row; its own properties, from the shape.
        A = Derived("A", q(sum_A, 2), "area", ref=name, unit=u2)
        steps.append(A)
        I_x = Derived("I_x", q(rows[0].Ix, 4), "second moment about x", ref=name, unit=u4)
        I_y = Derived("I_y", q(rows[0].Iy, 4), "second moment about y", ref=name, unit=u4)
        y_bar = Derived("y_bar", props.y_bar, "height of the centroid", unit=u1,
                        latex=r"\bar{y}", ref=name)  # fmt: skip
        x_bar = Derived("x_bar", props.x_bar, "position of the centroid", unit=u1,
                        latex=r"\bar{x}", ref=name)  # fmt: skip
        if want_x or keys & {"Z_x"}:
            steps.append(y_bar)
        if want_x:
            steps.append(I_x)
        if want_y or keys & {"Z_y"}:
            steps.append(x_bar)
        if want_y:
            steps.append(I_y)
    else:
        steps.append(table("x"))
        A = Derived("A", q(sum_A, 2), "area, Σ Aᵢ", ref="parts table", unit=u2)
        S_Ay = Derived(
            "Sigma_Ay", q(sum(r.A * r.y for r in rows), 3), "Σ Aᵢȳᵢ", ref="parts table",
            unit=u3, latex=r"\Sigma A_i \bar{y}_i",
        )  # fmt: skip
        y_bar = Derived(
            "y_bar", S_Ay / A, "height of the centroid", unit=u1, latex=r"\bar{y}",
            ref="first moment of area",
        )  # fmt: skip
        steps += [A, S_Ay, y_bar]
        if want_x:
            S_Ix = Derived(
                "Sigma_Ix", q(sum(r.Ix for r in rows), 4), "Σ Īₓᵢ, own second moments",
                unit=u4, ref="parts table", latex=r"\Sigma \bar{I}_{x,i}",
            )  # fmt: skip
            S_Ady2 = Derived(
                "Sigma_Ady2", q(sum(r.A * r.dy**2 for r in rows), 4), "Σ Aᵢdᵢ²", unit=u4,
                ref="parts table", latex=r"\Sigma A_i d_{i}^2",
            )  # fmt: skip
            I_x = Derived(
                "I_x", S_Ix + S_Ady2, "second moment about the centroidal x axis", unit=u4,
                ref="parallel-axis theorem",
            )  # fmt: skip
            steps += [S_Ix, S_Ady2, I_x]
        if want_y or keys & {"Z_y"}:
            steps.append(table("y"))
            S_Ax = Derived(
                "Sigma_Ax", q(sum(r.A * r.x for r in rows), 3), "Σ Aᵢx̄ᵢ", ref="parts table",
                unit=u3, latex=r"\Sigma A_i \bar{x}_i",
            )  # fmt: skip
            x_bar = Derived(
                "x_bar", S_Ax / A, "position of the centroid", unit=u1, latex=r"\bar{x}",
                ref="first moment of area",
            )  # fmt: skip
            steps += [S_Ax, x_bar]
        if want_y:
            S_Iy = Derived(
                "Sigma_Iy", q(sum(r.Iy for r in rows), 4), "Σ Īᵧᵢ", unit=u4,
                ref="parts table", latex=r"\Sigma \bar{I}_{y,i}",
            )  # fmt: skip
            S_Adx2 = Derived(
                "Sigma_Adx2", q(sum(r.A * r.dx**2 for r in rows), 4), "Σ Aᵢdᵢ² (x distances)",
                unit=u4, ref="parts table", latex=r"\Sigma A_i d_{x,i}^2",
            )  # fmt: skip
            I_y = Derived(
                "I_y", S_Iy + S_Adx2, "second moment about the centroidal y axis", unit=u4,
                ref="parallel-axis theorem",
            )  # fmt: skip
            steps += [S_Iy, S_Adx2, I_y]

    if "principal" in keys:
        steps += _principal_steps(props, rows, I_x, I_y, q, u4)
    if "r_x" in keys:
        steps.append(Derived("r_x", sqrt(I_x / A), "radius of gyration about x", unit=u1))
    if "r_y" in keys:
        steps.append(Derived("r_y", sqrt(I_y / A), "radius of gyration about y", unit=u1))
    if "S_x" in keys:
        y_top = Derived(
            "y_top", props.y_bar + props.c_top, "level of the top fibre", unit=u1, ref="geometry"
        )
        c_t = Derived("c_top", y_top - y_bar, "centroid to top fibre", unit=u1)
        y_bot = Derived(
            "y_bot", props.y_bar - props.c_bottom, "level of the bottom fibre", unit=u1,
            ref="geometry",
        )  # fmt: skip
        c_b = Derived("c_bot", y_bar - y_bot, "centroid to bottom fibre", unit=u1)
        S_t = Derived("S_x_top", I_x / c_t, "elastic modulus, top fibre", unit=u3)
        S_b = Derived("S_x_bot", I_x / c_b, "elastic modulus, bottom fibre", unit=u3)
        steps += [y_top, y_bot, c_t, c_b, S_t, S_b]
    if "S_y" in keys:
        x_r = Derived(
            "x_right", props.x_bar + props.c_right, "right extreme fibre", unit=u1, ref="geometry"
        )
        x_l = Derived(
            "x_left", props.x_bar - props.c_left, "left extreme fibre", unit=u1, ref="geometry"
        )
        c_r = Derived("c_right", x_r - x_bar, "centroid to right fibre", unit=u1)
        c_l = Derived("c_left", x_bar - x_l, "centroid to left fibre", unit=u1)
        S_r = Derived("S_y_right", I_y / c_r, "elastic modulus, right fibre", unit=u3)
        S_l = Derived("S_y_left", I_y / c_l, "elastic modulus, left fibre", unit=u3)
        steps += [x_r, x_l, c_r, c_l, S_r, S_l]
    steps += _other_steps(props, keys, sysname)
    return _finish(Block(steps=steps, title=block_title), sheet)


def _principal_steps(
    props: SectionProperties, rows: Any, I_x: Any, I_y: Any, q: Any, u4: str
) -> list[Any]:
    """Product of area and principal axes (Mohr's circle), or the note that x and y are."""
    from calcpack.working import Derived, Text, sqrt

    ixy = sum(r.Ixy + r.A * r.dx * r.dy for r in rows)
    scale = max(abs(si_of(props.Ix)), abs(si_of(props.Iy)))
    if abs(ixy) <= 1e-9 * scale:
        return [Text("The product of area $I_{xy}$ is zero: x and y are the principal axes.")]
    I_xy = Derived(
        "I_xy", q(ixy, 4), "product of area Σ(Īₓᵧᵢ + Aᵢ dₓᵢ dᵧᵢ)", unit=u4,
        ref="parallel-axis theorem",
    )  # fmt: skip
    R = Derived(
        "R_Mohr", sqrt(((I_x - I_y) / 2) ** 2 + I_xy**2), "radius of Mohr's circle",
        unit=u4, latex=r"R",
    )  # fmt: skip
    I_1 = Derived("I_1", (I_x + I_y) / 2 + R, "major principal second moment", unit=u4)
    I_2 = Derived("I_2", (I_x + I_y) / 2 - R, "minor principal second moment", unit=u4)
    theta = Derived(
        "theta_p", props.theta_p,
        "angle from x to the major principal axis, ½ atan2(−2Iₓᵧ, Iₓ − Iᵧ), "
        "counter-clockwise",
        unit="degree", ref="Mohr's circle",
    )  # fmt: skip
    return [I_xy, R, I_1, I_2, theta]


def _other_steps(props: SectionProperties, keys: frozenset[str], sysname: str) -> list[Any]:
    """Plastic moduli, torsion and warping constants, when asked for."""
    from calcpack.working import Derived, Text

    u1, _, u3, u4 = _PINT[sysname]
    steps: list[Any] = []
    if keys & {"Z_x", "Z_y"} and props.Zx_value is None:
        steps.append(
            Text(
                "Plastic modulus not given: the parts are of different materials "
                "(one yield stress needed)."
            )
        )
    plastic = (
        ("Z_x", props.Zx_value, "x", "y", props.y_pna_value, "above and below"),
        ("Z_y", props.Zy_value, "y", "x", props.x_pna_value, "left and right"),
    )
    for key, Z, axis, across, pna, halves in plastic:
        if key not in keys or Z is None or pna is None:
            continue
        first, second = halves.split(" and ")
        steps.append(
            Derived(
                f"{across}_p",
                pna,
                f"plastic neutral axis: equal area {halves}",
                unit=u1,
                ref=f"A_{first} = A_{second} = A/2",
            )
        )
        steps.append(
            Derived(
                key,
                Z,
                f"plastic modulus about {axis}",
                unit=u3,
                ref=f"Z = ∫|{across} − {across}_p| dA",
            )
        )
    if "J" in keys and props.J_value is not None:
        steps.append(Derived("J", props.J_value, "torsion constant", unit=u4, ref=_j_ref(props)))
    if "C_w" in keys and props.Cw_value is not None:
        steps.append(
            Derived(
                "C_w",
                props.Cw_value,
                "warping constant",
                unit=u4.replace("4", "6"),
                ref="Cw = Iy h0²/4 (doubly symmetric I)",
            )
        )
    return steps


def si_of(q: Quantity) -> float:
    return float(q.to_base_units().magnitude)


def _j_ref(props: SectionProperties) -> str:
    from calcpack.sections.shapes import Circle, HollowCircle, Rectangle, RectangularHollow

    s = props.section
    if isinstance(s, Circle | HollowCircle):
        return "J = π(D⁴ − d⁴)/32"
    if isinstance(s, RectangularHollow):
        return "Bredt–Batho, J = 4Aₘ²t/pₘ"
    if isinstance(s, Rectangle):
        return "Saint-Venant series for a rectangle"
    return "thin-walled open section, J = Σ b t³/3"


def radius_working(r: RadiusOfGyration, *, system: str | None = None, sheet: Any = None) -> Block:
    """Given k and A, derive I = k² A (the definition of the radius of gyration)."""
    from calcpack.working import Block, Derived, Given

    sysname = _system(system, sheet)
    u1, u2, _, u4 = _PINT[sysname]
    k = Given("k", r.k, "radius of gyration", unit=u1)
    A = Given("A", r.A, "area", unit=u2)
    I = Derived("I", k**2 * A, "second moment of area", unit=u4, ref="I = k²A")
    return _finish(Block(steps=[k, A, I], title="Second moment from the radius of gyration"), sheet)


def region_working(r: RegionIntegrals, *, system: str | None = None, sheet: Any = None) -> Block:
    """The integral forms for a region bounded by functions, with their exact values."""
    import sympy

    from calcpack.working import Block, Derived, Step, Text

    region = r.region
    u, l = region.expressions
    a, b = region.limits
    unit = region.unit
    ex = r.exact

    def integral(f: Any) -> str:
        return rf"\int_{{{sympy.latex(a)}}}^{{{sympy.latex(b)}}} {sympy.latex(f)}\,dx"

    ints = region.integrands()
    lines: list[Step] = [
        Text(
            f"Region between $y = {sympy.latex(l)}$ and $y = {sympy.latex(u)}$ for "
            f"${sympy.latex(a)} \\le x \\le {sympy.latex(b)}$ ({unit}); integrals evaluated "
            "exactly."
        ),
        Text(f"$A = \\int dA = {integral(ints['A'])} = {sympy.latex(ex['A'])}$ {unit}²"),
        Text(
            f"$\\bar{{x}} = \\frac{{\\int x\\,dA}}{{A}} = \\frac{{{integral(ints['Sy'])}}}{{A}} "
            f"= \\frac{{{sympy.latex(ex['Sy'])}}}{{{sympy.latex(ex['A'])}}} = "
            f"{sympy.latex(ex['x_bar'])}$ {unit}"
        ),
        Text(
            f"$\\bar{{y}} = \\frac{{\\int y\\,dA}}{{A}} = \\frac{{{integral(ints['Sx'])}}}{{A}} "
            f"= \\frac{{{sympy.latex(ex['Sx'])}}}{{{sympy.latex(ex['A'])}}} = "
            f"{sympy.latex(ex['y_bar'])}$ {unit}"
        ),
        Text(
            f"$I_{{x,0}} = \\int y^2\\,dA = {integral(ints['Ix_origin'])} = "
            f"{sympy.latex(ex['Ix_origin'])}$ {unit}⁴"
        ),
        Text(
            f"$I_{{y,0}} = \\int x^2\\,dA = {integral(ints['Iy_origin'])} = "
            f"{sympy.latex(ex['Iy_origin'])}$ {unit}⁴"
        ),
        Text(
            "About the centroid (parallel-axis theorem): "
            f"$I_x = I_{{x,0}} - A\\bar{{y}}^2 = {sympy.latex(ex['Ix'])}$ {unit}⁴, "
            f"$I_y = I_{{y,0}} - A\\bar{{x}}^2 = {sympy.latex(ex['Iy'])}$ {unit}⁴"
        ),
    ]
    sysname = _system(system, sheet)
    u1, u2, _, u4 = _PINT[sysname]
    lines += [
        Derived("A", r.A, "area", unit=u2, ref="∫ dA"),
        Derived("x_bar", r.x_bar, "centroid", unit=u1, latex=r"\bar{x}", ref="∫ x dA / A"),
        Derived("y_bar", r.y_bar, "centroid", unit=u1, latex=r"\bar{y}", ref="∫ y dA / A"),
        Derived("I_x", r.Ix, "about the centroidal x axis", unit=u4, ref="∫ y² dA − Aȳ²"),
        Derived("I_y", r.Iy, "about the centroidal y axis", unit=u4, ref="∫ x² dA − Ax̄²"),
    ]
    return _finish(
        Block(steps=lines, title=f"Section properties by integration: {region.name}"), sheet
    )
