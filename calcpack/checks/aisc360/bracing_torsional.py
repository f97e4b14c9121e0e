"""ANSI/AISC 360-16 Appendix 6.3.2: torsional bracing of beams (cross-frames, diaphragms, a
deck or joists framing into the beam), required strength and stiffness, LRFD or ASD.

* point torsional bracing (§6.3.2a): M_br = 0.02 M_r (Eq. A-6-9); β_Tbr = β_T/(1 − β_T/β_sec)
  (A-6-10) with β_T = (1/φ) 3.6 L M_r²/(n E I_yeff C_b²) [Ω (...)] (A-6-11) and the web
  distortional stiffness β_sec = (3.3E/h_o)(1.5 h_o t_w³/12 + t_s b_s³/12) (A-6-12);
* continuous torsional bracing (§6.3.2b): the stiffness with L/n = 1.0, so β_T is per unit
  length, and β_sec = 3.3 E t_w³/(12 h_o) (A-6-14); its required strength per unit length is
  not implemented (reported NOT COVERED);

φ = 0.75, Ω = 3.00 (``FACTORS["torsional bracing"]``). Doubly symmetric rolled I-shapes (W, M,
S, HP), for which I_yeff = I_y (Eq. A-6-13 with t = c); other shapes are refused. Where
β_T ≥ β_sec no brace is stiff enough: the web needs stiffeners, and the check says so.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

from calcpack.checks.aisc360.bracing import required_stiffness
from calcpack.checks.aisc360.member_data import FACTORS, Method, check_method, member_standard
from calcpack.checks.aisc360.shape import E_SOURCE, E_STEEL
from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.checks.scope import material_in_scope
from calcpack.errors import OutOfScopeError
from calcpack.sections.aisc_database import SteelShape
from calcpack.units import Quantity
from calcpack.validate import dimension, one_of, positive, positive_fields, required, whole, within

__all__ = ["TorsionalBraceCase", "check_aisc_torsional_bracing"]

TorsionalKind = Literal["point", "continuous"]
_I = ("W", "M", "S", "HP")


@dataclass(frozen=True)
class TorsionalBraceCase:
    """A beam braced against twist, and what the bracing provides.

    Args:
        shape: the beam, a doubly symmetric rolled I-shape (W, M, S, HP).
        kind: "point" (cross-frames, diaphragms at points) or "continuous" (a deck).
        Mr: largest required flexural strength of the beam within the span (LRFD or ASD).
        Cb: lateral-torsional buckling modification factor of the span (§F1), 1.0 to 3.0.
        L: length of the span. n: number of braced points within the span (point bracing).
        ts, bs: thickness and width of the web stiffener at a point brace (bs: twice the width
            of a one-sided stiffener); None: no stiffener.
        brace_strength: flexural strength of the brace (per unit length for continuous
            bracing); brace_stiffness: its rotational stiffness (per unit length for
            continuous bracing). Both optional, checked when given.
        E: modulus of elasticity. combination: the load combination of M_r.
    """

    shape: SteelShape
    kind: TorsionalKind
    Mr: Quantity
    Cb: float = 1.0
    L: Quantity | None = None
    n: int | None = None
    ts: Quantity | None = None
    bs: Quantity | None = None
    brace_strength: Quantity | None = None
    brace_stiffness: Quantity | None = None
    E: Quantity = E_STEEL
    combination: str | None = None

    def __post_init__(self) -> None:
        one_of("kind", self.kind, ("point", "continuous"))
        if not isinstance(self.shape, SteelShape) or self.shape.type not in _I:
            raise OutOfScopeError(
                f"Torsional bracing of {getattr(self.shape, 'designation', self.shape)!r}: AISC "
                "360-16 Appendix 6.3.2 is implemented here for doubly symmetric rolled I-shapes "
                "(W, M, S, HP) only, where I_yeff = I_y"
            )
        positive("Mr", dimension("Mr", self.Mr, "[force]*[length]"))
        within("Cb", float(self.Cb), 1.0, 3.0, rule="AISC 360-16 §F1 (1.0 ≤ C_b ≤ 3.0)")
        material_in_scope("AISC 360-16|steel|E", "E", self.E)
        per = "/[length]" if self.kind == "continuous" else ""
        if self.kind == "point":
            positive("L", dimension("L", self.L, "[length]"))
            whole("n", self.n, lo=1)
            if (self.ts is None) != (self.bs is None):
                name, other = ("bs", "ts") if self.bs is None else ("ts", "bs")
                required(
                    name,
                    None,
                    expected=f"a length, or {other} = None too",
                    when=f"with {other} (a stiffener has both)",
                )
            positive_fields(self, "[length]", ("ts", "bs"), optional=True)
        if self.brace_strength is not None:
            positive(
                "brace_strength",
                dimension("brace_strength", self.brace_strength, f"[force]*[length]{per}"),
            )
        if self.brace_stiffness is not None:
            positive(
                "brace_stiffness",
                dimension("brace_stiffness", self.brace_stiffness, f"[force]*[length]{per}"),
            )


def check_aisc_torsional_bracing(
    case: TorsionalBraceCase, *, method: Method = "LRFD", mark: str = "TB1"
) -> MemberChecks:
    """Required strength and stiffness of torsional beam bracing, AISC 360-16 Appendix 6.3.2.

    Units: M_br in kip·ft (point) or kip·ft/ft (continuous); β in kip·ft/rad (point) or
    kip·ft/rad per ft (continuous); radians are not written.

    Returns:
        MemberChecks: "Web distortional stiffness" (β_T < β_sec) and, when the brace's
        strength and stiffness are given, "Brace strength" and "Brace stiffness"; otherwise the
        brace is NOT COVERED with the requirement stated.

    Raises:
        InputError: bad method, units or values. OutOfScopeError: not a rolled I-shape.
    """
    method = check_method(method)  # type: ignore[assignment]
    b = case
    s = b.shape
    f = FACTORS["torsional bracing"]
    point = b.kind == "point"
    mu = "kip*ft" if point else "kip*ft/ft"

    def logic(c: Recorder) -> None:
        c.heading(f"Torsional bracing of a beam, {b.kind} (Appendix 6.3.2)", 3)
        c.assume("Doubly symmetric I-shape: I_yeff = I_y (AISC 360-16 Eq. A-6-13 with t = c).")
        E = c.given("E", b.E, "modulus of elasticity", source=E_SOURCE)
        Iy = c.given("I_yeff", s["Iy"], "effective moment of inertia about y", source=s.source)
        tw = c.given("t_w", s["tw"], "web thickness", source=s.source)
        ho = c.given("h_o", s["ho"], "distance between flange centroids", source=s.source)
        Mr = c.given(
            "M_r",
            b.Mr,
            "required flexural strength in the span",
            source=b.combination or "given",
            unit="kip*ft",
            result=True,
        )
        Cb = c.given("C_b", float(b.Cb), "LTB modification factor", source="given (§F1)")
        if point:
            L = c.given("L", b.L, "span length", source="given", unit="ft")
            n = c.given("n", float(b.n or 1), "braced points within the span", source="given")
            base = 3.6 * L * Mr**2 / (n * E * Iy * Cb**2)
            Mbr = c.derive(
                "M_br",
                0.02 * Mr,
                "required flexural strength of the brace",
                unit=mu,
                ref="AISC 360-16 Eq. (A-6-9)",
            )
            if b.ts is not None and b.bs is not None:
                ts = c.given("t_s", b.ts, "web stiffener thickness", source="given", unit="inch")
                bs = c.given("b_s", b.bs, "web stiffener width", source="given", unit="inch")
                sec = 3.3 * E / ho * (1.5 * ho * tw**3 / 12 + ts * bs**3 / 12)
            else:
                c.text("No web stiffener at the brace: t_s = 0 in Eq. (A-6-12).")
                sec = 3.3 * E / ho * (1.5 * ho * tw**3 / 12)
            bsec = c.derive(
                "beta_sec",
                sec,
                "web distortional stiffness",
                unit=mu,
                ref="AISC 360-16 Eq. (A-6-12)",
            )
        else:
            c.text("Continuous bracing: L/n = 1.0, so β is per unit length (§6.3.2b).")
            base = 3.6 * Mr**2 / (E * Iy * Cb**2)
            Mbr = None
            bsec = c.derive(
                "beta_sec",
                3.3 * E * tw**3 / (12 * ho),
                "web distortional stiffness per length",
                unit=mu,
                ref="AISC 360-16 Eq. (A-6-14)",
            )
        bT = required_stiffness(
            c,
            f,
            method,
            base,
            name="beta_T",
            what="overall stiffness required",
            unit=mu,
            ref="AISC 360-16 Eq. (A-6-11)",
            factor_for="torsional bracing",
        )
        web = c.check(
            "Web distortional stiffness",
            bT,
            bsec,
            ref="AISC 360-16 Eq. (A-6-10)",
            combination=b.combination,
            description="β_T must be less than β_sec for any brace to suffice",
        )
        if web.utilisation is not None and web.utilisation >= 1.0:
            c.not_covered(
                "Brace stiffness",
                "β_T ≥ β_sec: no brace is stiff enough with this web; add web stiffeners at the "
                "braces (t_s, b_s in Eq. A-6-12)",
                ref="AISC 360-16 Eq. (A-6-10)",
            )
            return
        bTbr = c.derive(
            "beta_Tbr",
            bT / (1 - bT / bsec),
            "required stiffness of the brace",
            unit=mu,
            ref="AISC 360-16 Eq. (A-6-10)",
        )
        if Mbr is None:
            c.not_covered(
                "Brace strength",
                "the required strength per unit length of continuous torsional bracing is not "
                "implemented: determine it separately",
                ref="AISC 360-16 Appendix 6.3.2b",
            )
        if b.brace_strength is None or b.brace_stiffness is None:
            c.not_covered(
                "Brace",
                "brace strength and stiffness not given: the brace must provide at least the "
                "required strength and stiffness β_Tbr above",
                ref="AISC 360-16 Appendix 6.3.2",
            )
            return
        got = c.given("M_brace", b.brace_strength, "strength of the brace", source="given", unit=mu)
        k = c.given(
            "beta_brace", b.brace_stiffness, "stiffness of the brace", source="given", unit=mu
        )
        if Mbr is not None:
            c.check(
                "Brace strength", Mbr, got, ref="AISC 360-16 Eq. (A-6-9)", combination=b.combination
            )
        c.check(
            "Brace stiffness", bTbr, k, ref="AISC 360-16 Eq. (A-6-10)", combination=b.combination
        )

    title = f"{b.kind.capitalize()} torsional bracing of {s.designation}"
    return run_checks(mark, title, member_standard(method), logic)
