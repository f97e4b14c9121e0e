"""ANSI/AISC 360-16 Chapter J bolts, LRFD or ASD.

* :func:`check_aisc_bolts`: a group of n bolts of one grade and diameter sharing a shear V and
  a tension T equally: shear and tension rupture (§J3.6, R_n = F_n A_b), combined tension and
  shear in a bearing-type connection (§J3.7, Eq. J3-3a/b), bearing and tear-out at the bolt
  holes of each connected ply (§J3.10, Eq. J3-6a/c, deformation at service load a design
  consideration), minimum spacing (§J3.3) and edge distance (Table J3.4), and, when asked,
  slip resistance (§J3.8, Eq. J3-4 with k_sc of Eq. J3-5a/b) for standard holes.

Bolt grades (Table J3.2: A307, Group A, Group B and ASTM F1554 anchor rods) and sizes (Tables
J3.1, J3.3, J3.4) are read from ``aisc360_16_bolt_grades.csv`` and ``aisc360_16_bolt_sizes.csv``.
Refusals: slip-critical with a grade that is not pretensioned (A307, F1554); holes other than
standard (oversized and slotted holes change §J3.8 and §J3.10 and are not implemented).

Units: pint quantities; forces are magnitudes (V shear, T tension) on the whole group.
"""

from __future__ import annotations

import re
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.aisc360.member_data import check_method, member_standard
from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.errors import InputError, OutOfScopeError
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity, require
from calcpack.validate import one_of, positive, positive_fields, required, whole

__all__ = [
    "BOLT_FACTORS",
    "BoltGroup",
    "Ply",
    "SlipCritical",
    "bolt_grade",
    "bolt_logic",
    "bolt_size",
    "check_aisc_bolts",
    "factored",
]

Threads = Literal["included", "excluded"]
_GRADES = "aisc360_16_bolt_grades.csv"
_SIZES = "aisc360_16_bolt_sizes.csv"

# (φ, Ω, clause): declared once for the connection checks of Chapter J
BOLT_FACTORS: Mapping[str, tuple[float, float, str]] = {
    "bolt shear": (0.75, 2.00, "AISC 360-16 §J3.6"),
    "bolt tension": (0.75, 2.00, "AISC 360-16 §J3.6"),
    "bearing": (0.75, 2.00, "AISC 360-16 §J3.10"),
    "slip": (1.00, 1.50, "AISC 360-16 §J3.8(a)"),
    "weld": (0.75, 2.00, "AISC 360-16 Table J2.5"),
    "shear yielding": (1.00, 1.50, "AISC 360-16 §J4.2(a)"),
    "shear rupture": (0.75, 2.00, "AISC 360-16 §J4.2(b)"),
    "tension yielding": (0.90, 1.67, "AISC 360-16 §J4.1(a)"),
    "tension rupture": (0.75, 2.00, "AISC 360-16 §J4.1(b)"),
    "block shear": (0.75, 2.00, "AISC 360-16 §J4.3"),
}


def factored(c: Recorder, key: str, nominal: Any, method: str, *, name: str, unit: str) -> Any:
    """φR_n (LRFD) or R_n/Ω (ASD) of ``nominal`` with the factor of ``BOLT_FACTORS[key]`` shown."""
    phi, omega, clause = BOLT_FACTORS[key]
    if method == "LRFD":
        p = c.given(f"phi_{name}", phi, f"resistance factor, {key}", source=clause)
        return c.derive(name, p * nominal, f"design strength φR_n, {key}", unit=unit, ref=clause)
    o = c.given(f"Omega_{name}", omega, f"safety factor, {key}", source=clause)
    return c.derive(name, nominal / o, f"allowable strength R_n/Ω, {key}", unit=unit, ref=clause)


def bolt_grade(grade: str) -> Mapping[str, Any]:
    """The Table J3.2 row of ``grade`` ("A307", "Group A", "Group B", "F1554 Gr. 36"...)."""
    return read_table(_GRADES, key="grade").row(grade, what="bolt grade of AISC 360-16 Table J3.2")


def bolt_size(d: Quantity) -> Mapping[str, Any]:
    """The row of Tables J3.1/J3.3/J3.4 for diameter ``d`` (1/2 in. to 1-1/4 in.)."""
    t = read_table(_SIZES, key="d")
    d_in = float(d.to("inch").magnitude)
    for k, row in t.rows.items():
        if abs(float(k) - d_in) < 1e-6:
            return row
    raise InputError(
        f"Bolt diameter d = {d:~P} is not in AISC 360-16 Tables J3.3/J3.4 as shipped "
        f"(diameters {', '.join(k for k in t.rows)} in.)",
        name="d",
        value=d,
        expected="1/2, 5/8, 3/4, 7/8, 1, 1-1/8 or 1-1/4 in.",
    )


@dataclass(frozen=True)
class BoltGroup:
    """n bolts of one grade and diameter.

    Args:
        grade: a Table J3.2 grade ("A307", "Group A", "Group B", "F1554 Gr. 36", ...).
        d: nominal diameter. n: number of bolts. planes: shear planes per bolt (1 or 2).
        threads: threads "included" in (N) or "excluded" from (X) the shear planes.
    """

    grade: str
    d: Quantity
    n: int
    planes: int = 1
    threads: Threads = "included"

    def __post_init__(self) -> None:
        bolt_grade(self.grade)
        require(self.d, "[length]", "d", positive=True)
        bolt_size(self.d)
        for nm in ("n", "planes"):
            whole(nm, getattr(self, nm), lo=1)
        one_of("threads", self.threads, ("included", "excluded"))

    @property
    def hole(self) -> Quantity:
        """Standard hole diameter (Table J3.3)."""
        return Q_(float(bolt_size(self.d)["hole"]), "inch")

    @property
    def label(self) -> str:
        return f"{self.n} × {self.d.to('inch'):~P} {self.grade}"


@dataclass(frozen=True)
class Ply:
    """A connected part the bolts bear on, with its bolt pattern in the direction of force.

    Args:
        name: e.g. "cap plate". t: thickness. Fu: tensile strength (Fy for reference).
        along: bolts in each line parallel to the force. lines: lines of bolts.
        s: spacing along the force (None with one bolt per line). le: distance from the last
            bolt to the edge toward which the force acts (None: no edge in that direction,
            e.g. a continuous plate loaded away from its end). edge: least edge distance any
            way (Table J3.4). gauge: spacing between lines (None with one line).
    """

    name: str
    t: Quantity
    Fu: Quantity
    along: int = 1
    lines: int = 1
    s: Quantity | None = None
    le: Quantity | None = None
    edge: Quantity | None = None
    gauge: Quantity | None = None

    def __post_init__(self) -> None:
        require(self.t, "[length]", "t", positive=True)
        require(self.Fu, "[pressure]", "Fu", positive=True)
        positive_fields(self, "[length]", ("s", "le", "edge", "gauge"), optional=True)
        if self.along > 1:
            required(
                "s",
                self.s,
                expected="the bolt spacing along the force",
                when=f"for ply {self.name} with {self.along} bolts in a line",
            )

    @property
    def count(self) -> int:
        return self.along * self.lines


@dataclass(frozen=True)
class SlipCritical:
    """Slip-critical design (§J3.8). surface: "A" (μ = 0.30) or "B" (μ = 0.50); fillers:
    number of fillers between the plies (h_f = 1.0 for none or one, 0.85 for two or more)."""

    surface: Literal["A", "B"] = "A"
    fillers: int = 0

    def __post_init__(self) -> None:
        one_of("surface", self.surface, ("A", "B"))
        positive("fillers", self.fillers, allow_zero=True)


def check_aisc_bolts(
    bolts: BoltGroup,
    plies: Sequence[Ply] = (),
    *,
    V: Quantity,
    T: Quantity | None = None,
    method: str = "LRFD",
    slip: SlipCritical | None = None,
    mark: str = "BG1",
    combination: str | None = None,
) -> MemberChecks:
    """Bolts in shear (and tension) with bearing and tear-out of each ply (AISC 360-16 §J3).

    Args:
        V: required shear on the group (V_u LRFD, V_a ASD), shared equally.
        T: required tension on the group (None or 0: shear only).
        plies: connected parts the bolts bear on (each checked for bearing, tear-out,
            spacing and edge distance). slip: check slip resistance (§J3.8).

    Raises:
        OutOfScopeError: slip-critical with a grade that is not pretensioned.
    """
    method = check_method(method)
    require(V, "[force]", "V", nonnegative=True)
    if T is not None:
        require(T, "[force]", "T", nonnegative=True)
    g = bolt_grade(bolts.grade)
    sz = bolt_size(bolts.d)
    if slip is not None and g["pretensioned"] != "yes":
        raise OutOfScopeError(
            f"Slip-critical bolts must be pretensioned high-strength bolts (Group A or B, "
            f"AISC 360-16 §J3.8 and Table J3.1); {bolts.grade} is not"
        )
    for p in plies:
        if p.count != bolts.n:
            raise InputError(
                f"Input plies: ply {p.name} has {p.count} bolts (along × lines) but the "
                f"group has n = {bolts.n}",
                name="plies",
                value=p.count,
                expected=f"along × lines = {bolts.n}",
            )
    has_t = T is not None and T.magnitude > 0

    def logic(c: Recorder) -> None:
        c.assume(
            "The force is shared equally by the bolts (concentric); standard holes; "
            "deformation at the bolt holes at service load is a design consideration."
        )
        Vr = bolt_logic(c, bolts, V, T, method, combination)
        for p in plies:
            _ply_logic(c, bolts, p, Vr, method, combination)
        if slip is not None:
            _slip_logic(c, bolts, slip, sz, Vr, T if has_t else None, method, combination)

    title = f"Bolts {bolts.label}" + (", slip-critical" if slip else "")
    return run_checks(mark, title, member_standard(method), logic)


def bolt_logic(
    c: Recorder,
    bolts: BoltGroup,
    V: Quantity,
    T: Quantity | None,
    method: str,
    combination: str | None,
) -> Any:
    """Shear, and tension with shear, of a bolt group as working (§J3.6-§J3.7); returns the
    required shear handle."""
    g = bolt_grade(bolts.grade)
    src = f"AISC 360-16 Table J3.2 ({g['basis']})"
    has_t = T is not None and T.magnitude > 0
    c.heading("Bolt shear and tension, §J3.6-§J3.7", 3)
    d = c.given("d", bolts.d, f"bolt diameter, {bolts.grade}", source="given", unit="inch")
    Ab = c.derive("A_b", c.pi * d**2 / 4, "nominal bolt area", unit="inch**2",
                  ref="AISC 360-16 §J3.6")  # fmt: skip
    n = c.given("n", float(bolts.n), "number of bolts", source="given")
    ns = c.given("n_s", float(bolts.planes), "shear planes per bolt", source="given")
    fnv_col = "Fnv_N" if bolts.threads == "included" else "Fnv_X"
    Fnv = c.given("F_nv", Q_(float(g[fnv_col]), "ksi"),
                  f"nominal shear stress, threads {bolts.threads}", source=src)  # fmt: skip
    Rnv = c.derive("R_nv", Fnv * Ab * n * ns, "nominal shear strength of the group",
                   unit="kip", ref="AISC 360-16 Eq. (J3-1)")  # fmt: skip
    cap_v = factored(c, "bolt shear", Rnv, method, name="R_c_v", unit="kip")
    sym = "u" if method == "LRFD" else "a"
    Vr = c.given(f"V_{sym}", V, "required shear", source=combination or "given", unit="kip")
    c.check("Bolt shear", Vr, cap_v, ref="AISC 360-16 §J3.6", combination=combination)
    if has_t:
        assert T is not None
        Fnt = c.given("F_nt", Q_(float(g["Fnt"]), "ksi"), "nominal tensile stress",
                      source=src)  # fmt: skip
        Tr = c.given(f"T_{sym}", T, "required tension", source=combination or "given",
                     unit="kip")  # fmt: skip
        frv = c.derive("f_rv", Vr / (n * ns * Ab), "required shear stress", unit="ksi",
                       ref="AISC 360-16 §J3.7")  # fmt: skip
        phi, omega, _ = BOLT_FACTORS["bolt shear"]
        if method == "LRFD":
            Fpr = c.derive("F_nt_p", c.min(1.3 * Fnt - Fnt / (phi * Fnv) * frv, Fnt),
                           "F'_nt, tension reduced for shear", unit="ksi",
                           ref="AISC 360-16 Eq. (J3-3a)")  # fmt: skip
        else:
            Fpr = c.derive("F_nt_p", c.min(1.3 * Fnt - omega * Fnt / Fnv * frv, Fnt),
                           "F'_nt, tension reduced for shear", unit="ksi",
                           ref="AISC 360-16 Eq. (J3-3b)")  # fmt: skip
        if c.q(Fpr).magnitude <= 0:
            c.check("Bolt tension with shear", Tr, Q_(1e-9, "kip"),
                    ref="AISC 360-16 §J3.7", combination=combination,
                    description="shear alone exhausts the bolts")  # fmt: skip
        else:
            Rnt = c.derive("R_nt", Fpr * Ab * n, "nominal tensile strength with shear",
                           unit="kip", ref="AISC 360-16 Eq. (J3-2)")  # fmt: skip
            cap_t = factored(c, "bolt tension", Rnt, method, name="R_c_t", unit="kip")
            c.check("Bolt tension with shear", Tr, cap_t, ref="AISC 360-16 §J3.7",
                    combination=combination)  # fmt: skip
    return Vr


def symbol_part(name: str) -> str:
    """``name`` reduced to letters and digits, for use inside a symbol (``"cap plate"`` ->
    ``"capplate"``)."""
    return re.sub(r"[^A-Za-z0-9]", "", name) or "x"


def _ply_logic(
    c: Recorder, b: BoltGroup, p: Ply, Vr: Any, method: str, combination: str | None
) -> None:
    k = symbol_part(p.name)
    c.heading(f"Bearing and tear-out at the holes, {p.name} (§J3.10)", 3)
    sz = bolt_size(b.d)
    dh_q = b.hole
    t = c.given(f"t_{k}", p.t, f"thickness, {p.name}", source="given", unit="inch")
    Fu = c.given(f"F_u_{k}", p.Fu, f"tensile strength, {p.name}", source="given")
    d = c.given("d_b", b.d, "bolt diameter", source="given", unit="inch")
    dh = c.given("d_h", dh_q, "standard hole", source="AISC 360-16 Table J3.3", unit="inch")
    rb = c.derive(f"r_b_{k}", 2.4 * d * t * Fu, "bearing, one bolt", unit="kip",
                  ref="AISC 360-16 Eq. (J3-6a)")  # fmt: skip
    terms: list[Any] = []
    if p.along > 1:
        assert p.s is not None
        s = c.given(f"s_{k}", p.s, "spacing along the force", source="given", unit="inch")
        lci = c.derive(f"l_c_in_{k}", s - dh, "clear distance, inner bolts", unit="inch",
                       ref="AISC 360-16 §J3.10")  # fmt: skip
        ri = c.derive(f"r_in_{k}", c.min(1.2 * lci * t * Fu, rb),
                      "inner bolt: tear-out or bearing", unit="kip",
                      ref="AISC 360-16 Eq. (J3-6c)")  # fmt: skip
        terms.append((p.along - 1) * p.lines * ri)
    if p.le is not None:
        le = c.given(f"l_e_{k}", p.le, "end distance toward the loaded edge", unit="inch")
        lce = c.derive(f"l_c_e_{k}", le - dh / 2, "clear distance, end bolts", unit="inch",
                       ref="AISC 360-16 §J3.10")  # fmt: skip
        re_ = c.derive(f"r_e_{k}", c.min(1.2 * lce * t * Fu, rb),
                       "end bolt: tear-out or bearing", unit="kip",
                       ref="AISC 360-16 Eq. (J3-6c)")  # fmt: skip
        terms.append(p.lines * re_)
    else:
        terms.append(p.lines * rb)
    total = terms[0] if len(terms) == 1 else terms[0] + terms[1]
    Rn = c.derive(f"R_n_brg_{k}", total, "sum over the bolts", unit="kip",
                  ref="AISC 360-16 §J3.10")  # fmt: skip
    cap = factored(c, "bearing", Rn, method, name=f"R_c_brg_{k}", unit="kip")
    c.check(f"Bearing and tear-out, {p.name}", Vr, cap, ref="AISC 360-16 §J3.10",
            combination=combination)  # fmt: skip
    emin = Q_(float(sz["edge_min"]), "inch")
    for nm, val in (("edge", p.edge), ("le", p.le)):
        if val is not None:
            c.check(f"Edge distance ({nm}), {p.name}", emin, val.to("inch"),
                    ref="AISC 360-16 Table J3.4")  # fmt: skip
    smin = (8.0 / 3.0) * b.d.to("inch")
    for nm, val in (("s", p.s), ("gauge", p.gauge)):
        if val is not None:
            c.check(f"Bolt spacing ({nm}), {p.name}", smin, val.to("inch"),
                    ref="AISC 360-16 §J3.3")  # fmt: skip


def _slip_logic(
    c: Recorder,
    b: BoltGroup,
    sc: SlipCritical,
    sz: Mapping[str, Any],
    Vr: Any,
    T: Quantity | None,
    method: str,
    combination: str | None,
) -> None:
    c.heading("Slip resistance, §J3.8", 3)
    grp = bolt_grade(b.grade)["group"]
    mu = c.given("mu", 0.30 if sc.surface == "A" else 0.50, f"Class {sc.surface} surface",
                 source="AISC 360-16 §J3.8")  # fmt: skip
    Du = c.given("D_u", 1.13, "pretension multiplier", source="AISC 360-16 §J3.8")
    hf = c.given("h_f", 1.0 if sc.fillers <= 1 else 0.85, f"{sc.fillers} filler(s)",
                 source="AISC 360-16 §J3.8")  # fmt: skip
    Tb = c.given("T_b", Q_(float(sz[f"Tb_{grp}"]), "kip"), f"minimum pretension, Group {grp}",
                 source="AISC 360-16 Table J3.1 (from memory)")  # fmt: skip
    n = c.given("n_b", float(b.n), "bolts", source="given")
    ns = c.given("n_s_slip", float(b.planes), "slip planes", source="given")
    ksc: Any = 1.0
    if T is not None:
        sym = "u" if method == "LRFD" else "a"
        Tr = c.given(f"T_{sym}_slip", T, "required tension", source=combination or "given",
                     unit="kip")  # fmt: skip
        k = 1.0 if method == "LRFD" else 1.5
        ksc = c.derive("k_sc", 1 - k * Tr / (Du * Tb * n), "slip reduction for tension",
                       ref="AISC 360-16 Eq. (J3-5a)" if method == "LRFD"
                       else "AISC 360-16 Eq. (J3-5b)")  # fmt: skip
        if c.q(ksc).magnitude <= 0:
            c.check(
                "Slip resistance", Vr, Q_(1e-9, "kip"), ref="AISC 360-16 §J3.8",
                combination=combination, description="tension releases the clamping",
            )  # fmt: skip
            return
    Rn = c.derive("R_n_slip", mu * Du * hf * Tb * ns * n * ksc, "nominal slip resistance",
                  unit="kip", ref="AISC 360-16 Eq. (J3-4)")  # fmt: skip
    cap = factored(c, "slip", Rn, method, name="R_c_slip", unit="kip")
    c.check("Slip resistance", Vr, cap, ref="AISC 360-16 §J3.8", combination=combination)
