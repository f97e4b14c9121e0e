"""Generic elastic checks for any material with a stated allowable: bending stress M·c/I (or
M/S), shear stress V·Q/(I·t) (1.5·V/A for a rectangle), bearing R/A, and deflection against
span/limit (span/360 live and span/240 total are the usual building-code limits, e.g. IBC
Table 1604.3 for floor members; the ratio is an input).

Allowable values are inputs with their source; nothing is assumed. Demands come from combined
beam results (the governing combination is named) or are given directly.
"""

from __future__ import annotations

from typing import Any

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.checks.demand import as_combinations, max_abs
from calcpack.errors import InputError
from calcpack.units import Q_, Quantity, require, ureg
from calcpack.validate import finite, instance, non_empty, positive, required

__all__ = ["ELASTIC", "SERVICEABILITY", "check_deflection", "check_elastic_beam"]

ELASTIC = Standard(
    "elastic stress checks against stated allowable values",
    "first principles (M·c/I, V·Q/(I·t), R/A, span/limit)",
)


SERVICEABILITY = Standard(
    "span/limit deflection limits",
    "serviceability of members in bending",
    caution_text=(
        "Deflection limits are span/limit ratios of the kind building codes set; confirm each "
        "limit against the building code in force and any stricter need of the finishes, "
        "glazing or equipment the member carries."
    ),
)


def _need_source(source: str | None, what: str) -> str:
    return non_empty(
        "allowable_source",
        source,
        expected=f"the source of the {what}, e.g. 'BS 5268-2 Table 17' or 'client spec. §4'",
    )


def _section_value(
    rec: Recorder, symbol: str, q: Any, dim: str, what: str, *, name: str | None = None
) -> Any:
    """A section property given on the sheet: positive, of dimension ``dim``, named ``name``
    (the argument; the symbol by default) in a refusal."""
    value = require(q, dim, name or symbol, positive=True)
    return rec.given(symbol, value, what, source="section properties")


def _governing(demand: Any, what: str) -> tuple[Quantity, str]:
    best: tuple[Quantity, str] | None = None
    for name, r in as_combinations(demand).items():
        v, _ = max_abs(r, what)
        if best is None or v > best[0]:
            best = (v, name)
    assert best is not None
    return best


def _demand_value(
    combos: Any,
    given: Any,
    combination: str | None,
    action: str,
    name: str,
    dimension: str,
    check: str,
) -> tuple[Quantity, str | None]:
    """The governing action from the combinations, else the value given directly.

    Returns the quantity and the combination it comes from (None when given without one).
    Raises InputError naming ``name`` when neither is given.
    """
    if combos is not None:
        return _governing(combos, action)
    what = f"a {'moment' if action == 'moment' else 'force'}"
    required(name, given, expected=f"{what}, or demand=", when=f"for the {check} check")
    return require(given, dimension, name), combination


def check_elastic_beam(
    *,
    member: str,
    allowable_source: str,
    demand: Any = None,
    M: Quantity | None = None,
    V: Quantity | None = None,
    combination: str | None = None,
    S: Quantity | None = None,
    I: Quantity | None = None,
    c: Quantity | None = None,
    sigma_allow: Quantity | None = None,
    A_rect: Quantity | None = None,
    Q: Quantity | None = None,
    t: Quantity | None = None,
    tau_allow: Quantity | None = None,
    R: Quantity | None = None,
    bearing_area: Quantity | None = None,
    bearing_allow: Quantity | None = None,
) -> MemberChecks:
    """Bending, shear and bearing stresses against stated allowables.

    Args:
        member: member mark. allowable_source: where the allowable stresses come from.
        demand: combined beam results (governing |M|, |V| and largest reaction found), or
            give ``M``, ``V``, ``R`` directly with ``combination``.
        S, or I and c: section modulus, or second moment and extreme-fibre distance.
        sigma_allow: allowable bending stress.
        A_rect: area of a rectangular section (τ = 1.5·V/A), or Q, I and t (τ = V·Q/(I·t)).
        tau_allow: allowable shear stress.
        R: bearing force (default: the largest reaction), bearing_area, bearing_allow.

    Raises:
        InputError: a stress check with missing section values or allowable, no check asked.
    """
    src = _need_source(allowable_source, "allowable stresses")
    combos = as_combinations(demand) if demand is not None else None

    def logic(rec: Recorder) -> None:
        made = False
        if sigma_allow is not None:
            require(sigma_allow, "[pressure]", "sigma_allow", positive=True)
            Mq, combo = _demand_value(
                combos, M, combination, "moment", "M", "[force]*[length]", "Bending"
            )
            rec.heading("Bending stress", 3)
            Mh = rec.given("M", Mq, "largest |M|", source=combo or "given")
            if S is not None:
                Sh = _section_value(rec, "S", S, "[length]**3", "section modulus")
                sig = rec.derive(
                    "sigma_b", Mh / Sh, "bending stress", ref="M/S", unit=str(sigma_allow.units)
                )
            elif I is not None and c is not None:
                Ih = _section_value(rec, "I", I, "[length]**4", "second moment of area")
                ch = _section_value(rec, "c", c, "[length]", "extreme fibre distance")
                sig = rec.derive(
                    "sigma_b",
                    Mh * ch / Ih,
                    "bending stress",
                    ref="M·c/I",
                    unit=str(sigma_allow.units),
                )
            else:
                required("S", S, expected="S, or I and c", when="for the bending check")
            al = rec.given("sigma_allow", sigma_allow, "allowable bending stress", source=src)
            rec.check("Bending stress", sig, al, ref=src, combination=combo)
            made = True
        if tau_allow is not None:
            require(tau_allow, "[pressure]", "tau_allow", positive=True)
            Vq, combo = _demand_value(combos, V, combination, "shear", "V", "[force]", "Shear")
            rec.heading("Shear stress", 3)
            Vh = rec.given("V", Vq, "largest |V|", source=combo or "given")
            if A_rect is not None:
                Ah = _section_value(
                    rec,
                    "A",
                    A_rect,
                    "[length]**2",
                    "area of the rectangular section",
                    name="A_rect",
                )
                tau = rec.derive(
                    "tau",
                    1.5 * Vh / Ah,
                    "peak shear stress, rectangle",
                    ref="1.5·V/A",
                    unit=str(tau_allow.units),
                )
            elif Q is not None and I is not None and t is not None:
                Qh = _section_value(
                    rec, "Q", Q, "[length]**3", "first moment of area above the neutral axis"
                )
                Ih = rec.given("I", I, "second moment of area", source="section properties")
                th = _section_value(rec, "t", t, "[length]", "width at the neutral axis")
                tau = rec.derive(
                    "tau",
                    Vh * Qh / (Ih * th),
                    "peak shear stress",
                    ref="V·Q/(I·t)",
                    unit=str(tau_allow.units),
                )
            else:
                required(
                    "A_rect", A_rect, expected="A_rect (rectangle), or Q, I and t", when="for shear"
                )
            al = rec.given("tau_allow", tau_allow, "allowable shear stress", source=src)
            rec.check("Shear stress", tau, al, ref=src, combination=combo)
            made = True
        if bearing_allow is not None:
            require(bearing_allow, "[pressure]", "bearing_allow", positive=True)
            required("bearing_area", bearing_area, expected="an area", when="for bearing")
            require(bearing_area, "[length]**2", "bearing_area", positive=True)
            if R is not None:
                Rq, combo = require(R, "[force]", "R"), combination
            elif combos is not None:
                best: tuple[Quantity, str] | None = None
                for name, r in combos.items():
                    for rea in r.reactions:
                        if best is None or abs(rea.Fy) > best[0]:
                            best = (abs(rea.Fy), f"{name}, support {rea.support}")
                assert best is not None
                Rq, combo = best[0], best[1]
            else:
                required("R", R, expected="a force, or demand=", when="for bearing")
            rec.heading("Bearing", 3)
            Rh = rec.given("R", Rq, "largest reaction", source=combo or "given")
            Ab = rec.given("A_b", bearing_area, "bearing area", source="detail")
            fbr = rec.derive(
                "sigma_br", Rh / Ab, "bearing stress", ref="R/A", unit=str(bearing_allow.units)
            )
            al = rec.given("sigma_br_allow", bearing_allow, "allowable bearing stress", source=src)
            rec.check("Bearing", fbr, al, ref=src, combination=combo)
            made = True
        if not made:
            raise InputError(
                "No check asked for: give sigma_allow, tau_allow and/or bearing_allow",
                name="sigma_allow",
                value=None,
                expected="at least one allowable",
            )

    return run_checks(member, f"{member}: elastic stress checks", ELASTIC, logic)


def _truss_deflection(name: str, result: Any) -> tuple[Quantity, str]:
    """The largest vertical joint displacement of a truss result, and where it is."""
    if result.displacements is None:
        raise InputError(
            f"Truss result {name!r} has no joint displacements: give each member's EA when "
            "building the truss",
            name="EA",
            value=None,
            expected="an axial stiffness on every member",
        )
    joint, (_, uy) = max(result.displacements.items(), key=lambda kv: abs(kv[1][1]))
    finite(f"deflection of {name!r} at {joint}", uy)
    return abs(uy), f"{name}, joint {joint}"


def check_deflection(
    *,
    member: str,
    demand: Any,
    span: Quantity,
    limit: float = 360.0,
    label: str = "live",
    ref: str = "span/limit (usual building-code limit, e.g. IBC Table 1604.3)",
) -> MemberChecks:
    """Largest deflection of the results against span/limit.

    Args:
        member: member mark. demand: serviceability results (combined results, a mapping, or
            one result such as the live-load case alone) with deflection (EI given) -- of a
            beam, or of a truss (EA given: the largest vertical joint displacement, by the
            stiffness method, is the deflection).
        span: the span the limit refers to (for a cantilever, twice its length is the usual
            convention -- give it explicitly). limit: the ratio (360 for span/360).
        label: what deflects ("live", "total"). ref: the limit's source.

    Raises:
        InputError: limit not positive, a result without deflection (no EI).
    """
    require(span, "[length]", "span", positive=True)
    positive("limit", instance("limit", limit, (int, float), expected="a ratio such as 360"))
    combos = as_combinations(demand)
    best: tuple[Quantity, str] | None = None
    for name, r in combos.items():
        if hasattr(r, "displacements") and not hasattr(r, "extremes"):
            cand = _truss_deflection(name, r)
            if best is None or cand[0] > best[0]:
                best = cand
            continue
        if not getattr(r, "has_deflection", True):
            raise InputError(
                f"Result {name!r} has no deflection: give EI when building the beam",
                name="EI",
                value=None,
                expected="a flexural stiffness",
            )
        ex = r.extremes
        cands = [e.value for e in (ex.deflection_down, ex.deflection_up) if e is not None]
        if best is None:
            best = (Q_(0.0, "mm"), name)  # a result that nowhere moves: δ = 0
        for v in cands:
            finite(f"deflection of {name!r}", v)
            if abs(v) > best[0]:
                best = (abs(v), name)
    if best is None:
        raise InputError(
            "Deflection check needs at least one result (got none)",
            name="demand",
            value=demand,
            expected="a result with deflection, or a mapping of them",
        )
    dq, combo = best

    # show the deflection in the span's family of units (inches for a span in feet)
    us = any(span.units == ureg.Unit(u) for u in ("foot", "inch", "yard", "mile"))
    dunit = "inch" if us else "mm"

    def logic(rec: Recorder) -> None:
        rec.heading(f"Deflection ({label})", 3)
        d = rec.given(
            "delta", dq, f"largest deflection ({label})", source=combo, unit=dunit, result=True
        )
        Lh = rec.given("L_span", span, "span for the limit", source="geometry")
        n = rec.given("n_lim", float(limit), "deflection limit ratio", source=ref)
        lim = rec.derive("delta_lim", Lh / n, f"limit span/{limit:g}", unit=dunit, ref=ref)
        rec.check(f"Deflection ({label})", d, lim, ref=ref, combination=combo)

    return run_checks(member, f"{member}: deflection ({label})", SERVICEABILITY, logic)
