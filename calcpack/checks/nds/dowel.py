"""NDS 2018 Chapter 12 dowel-type fasteners: the fastener, the members it joins, the dowel
bearing strengths and the yield limit equations.

* :func:`nds_fastener` looks up a bolt, lag screw, wood screw or nail (common, box, sinker) by
  its trade designation (``"1/2 in. bolt"``, ``"16d common nail"``) in
  ``nds_2018_fasteners.csv`` (NDS Appendix L dimensions, F_yb from the Table 12.3.3 / Appendix I
  notes); :class:`Fastener` can also be built directly with its source.
* :class:`WoodMember` (species from Table 12.3.3A, or G given) and :class:`SteelPlate` are the
  members; :class:`DowelJoint` puts a fastener through a side member into a main member in
  single or double shear.
* :func:`yield_limits` runs the six yield limit equations of Table 12.3.1A (four in double
  shear) with the terms k1, k2, k3 and R_d of Table 12.3.1B, the dowel bearing strengths of
  Table 12.3.3 footnote 2 (F_e∥ = 11 200 G, F_e⊥ = 6 100 G^1.45/√D for 1/4 in. ≤ D ≤ 1 in.;
  F_e = 16 600 G^1.84 for D < 1/4 in.) at the load angle by Hankinson's formula (§12.3.4), and
  returns every mode with the governing (least) one.

Sign and units: the load angle θ is measured from the grain, 0° to 90°; thicknesses and
diameters are lengths (inches in the working), strengths are stresses (psi), Z is a force (lbf).
The equations are applied as written in Table 12.3.1A, which is dimensionally consistent.
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Any, Literal

from calcpack.checks.base import Recorder
from calcpack.errors import InputError, OutOfScopeError
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity, require
from calcpack.validate import lookup, one_of, positive_fields, required, within

__all__ = [
    "DowelJoint",
    "Embedment",
    "Fastener",
    "FastenerKind",
    "SteelPlate",
    "WoodMember",
    "YieldLimits",
    "nds_fastener",
    "nds_specific_gravity",
    "yield_limits",
    "yield_logic",
]

FastenerKind = Literal["bolt", "lag screw", "wood screw", "nail"]
ShearPlanes = Literal["single", "double"]
KINDS: tuple[str, ...] = ("bolt", "lag screw", "wood screw", "nail")

_TABLE_G = "nds_2018_specific_gravity.csv"
_TABLE_F = "nds_2018_fasteners.csv"
_DOWEL_MAX = Q_(1.0, "inch")  # Table 12.3.1B covers D ≤ 1 in.
_SMALL = Q_(0.25, "inch")  # D < 1/4 in.: F_e = 16 600 G^1.84 and R_d = K_D
# minimum penetration into the main member as multiples of D (§12.1.4.6 lag screws, §12.1.5.6
# wood screws, §12.1.6.5 nails): from memory, confirm against the edition adopted
MIN_PENETRATION: Mapping[str, float] = {"lag screw": 4.0, "wood screw": 6.0, "nail": 6.0}


def nds_specific_gravity(species: str) -> tuple[float, str]:
    """G of ``species`` from NDS 2018 Table 12.3.3A, with its source line.

    Raises:
        InputError: unknown species (with the closest names).
    """
    t = read_table(_TABLE_G, key="species")
    row = t.row(species, what="species of NDS 2018 Table 12.3.3A")
    return float(row["G"]), f"NDS 2018 Table 12.3.3A ({row['basis']})"


@dataclass(frozen=True)
class Fastener:
    """A dowel-type fastener.

    Args:
        designation: e.g. ``"1/2 in. bolt"``. kind: "bolt", "lag screw", "wood screw", "nail".
        D: shank diameter. Fyb: dowel bending yield strength. source: where D and F_yb come
            from. Dr: root diameter of the threads (lag and wood screws). tip: length E of the
            tapered tip of a lag screw (not counted in penetration, NDS Appendix L).
        length: length of the fastener (under the head); None: not checked.
    """

    designation: str
    kind: FastenerKind
    D: Quantity
    Fyb: Quantity
    source: str
    Dr: Quantity | None = None
    tip: Quantity | None = None
    length: Quantity | None = None

    def __post_init__(self) -> None:
        one_of("kind", self.kind, KINDS)
        require(self.D, "[length]", "D", positive=True)
        require(self.Fyb, "[pressure]", "Fyb", positive=True)
        positive_fields(self, "[length]", ("Dr", "tip", "length"), optional=True)
        if self.Dr is not None:
            within("Dr", self.Dr, hi=self.D, rule="the root diameter is not more than D")
        if self.D > _DOWEL_MAX:
            raise OutOfScopeError(
                f"Fastener {self.designation}: D = {self.D:~P} is more than 1 in.; the reduction "
                "terms of NDS 2018 Table 12.3.1B cover D ≤ 1 in. only"
            )

    def with_length(self, length: Quantity) -> Fastener:
        """The same fastener with its length (bolts, lag and wood screws are sold by length)."""
        return Fastener(
            self.designation, self.kind, self.D, self.Fyb, self.source, self.Dr, self.tip, length
        )


def nds_fastener(designation: str, *, length: Quantity | None = None) -> Fastener:
    """A fastener from the shipped table (NDS 2018 Appendix L), e.g. ``"16d common nail"``.

    Args:
        length: for bolts and screws, the length under the head (nails have their table length).

    Raises:
        InputError: unknown designation (with the closest names).
    """
    t = read_table(_TABLE_F, key="designation")
    row = t.row(designation, what="fastener of NDS 2018 Appendix L")

    def _len(col: str) -> Quantity | None:
        v = row[col]
        return None if v is None else Q_(float(v), "inch")

    if length is not None:
        require(length, "[length]", "length", positive=True)
    return Fastener(
        designation=str(row["designation"]),
        kind=row["kind"],
        D=Q_(float(row["D"]), "inch"),
        Fyb=Q_(float(row["Fyb"]), "psi"),
        source=f"NDS 2018 Appendix L, Table 12.3.3 notes ({row['basis']})",
        Dr=_len("Dr"),
        tip=_len("E"),
        length=length if length is not None else _len("L"),
    )


@dataclass(frozen=True)
class WoodMember:
    """A wood member of a dowel joint.

    Args:
        thickness: member thickness (bearing length of the dowel through it).
        species: species combination of Table 12.3.3A (``"Douglas Fir-Larch"``), or give
            ``G`` with ``source``. angle: angle θ of the load to the grain, 0° to 90°.
        end_grain: the fastener is driven into end grain (C_eg applies; only as a main member).
    """

    thickness: Quantity
    species: str | None = None
    G: float | None = None
    angle: Quantity = field(default_factory=lambda: Q_(0.0, "degree"))
    end_grain: bool = False
    source: str = ""

    def __post_init__(self) -> None:
        require(self.thickness, "[length]", "thickness", positive=True)
        require(self.angle, "[]", "angle")
        within(
            "angle",
            self.angle.to("degree"),
            Q_(0.0, "degree"),
            Q_(90.0, "degree"),
            rule="θ is measured from the grain, 0° to 90°",
        )
        if self.G is None:
            required(
                "species",
                self.species,
                expected="a species of NDS 2018 Table 12.3.3A (e.g. 'Douglas Fir-Larch'), or G "
                "with its source",
                when="for a wood member without G",
            )
        if self.G is None:
            assert self.species is not None
            nds_specific_gravity(self.species)  # unknown species fails here, at construction
        else:
            within("G", float(self.G), 0.31, 0.73, rule="NDS 2018 Table 12.3.3 covers G 0.31-0.73")

    @property
    def gravity(self) -> tuple[float, str]:
        """G and its source."""
        if self.G is not None:
            return float(self.G), self.source or "given"
        assert self.species is not None
        return nds_specific_gravity(self.species)

    @property
    def label(self) -> str:
        return self.species or f"wood, G = {self.G}"


@dataclass(frozen=True)
class SteelPlate:
    """A steel side (or main) plate of a dowel joint.

    Args:
        thickness: plate thickness. Fu: specified tensile strength (58 ksi for ASTM A36).
        Fe: dowel bearing strength; None: 1.5 F_u for hot-rolled plate (NDS 2018 Table 12.3.3
            footnote, from memory; use 1.375 F_u for cold-formed steel and give it here).
    """

    thickness: Quantity
    Fu: Quantity = field(default_factory=lambda: Q_(58.0, "ksi"))
    Fe: Quantity | None = None
    grade: str = "ASTM A36"

    def __post_init__(self) -> None:
        require(self.thickness, "[length]", "thickness", positive=True)
        require(self.Fu, "[pressure]", "Fu", positive=True)
        if self.Fe is not None:
            require(self.Fe, "[pressure]", "Fe", positive=True)

    @property
    def label(self) -> str:
        return f"steel plate {self.grade}"


@dataclass(frozen=True)
class Embedment:
    """A bolt embedded in concrete or grouted masonry as the main member (a ledger or sill
    bolted to a wall). The wood side follows Table 12.3.1A with the dowel bearing strength of
    the concrete or masonry; the anchorage itself (breakout, pullout) is not covered here.

    Args:
        thickness: embedment length ℓ_m of the bolt. Fe: dowel bearing strength (7 500 psi
            as in the NDS wood-to-concrete bolt table, from memory). material: its name.
    """

    thickness: Quantity
    Fe: Quantity = field(default_factory=lambda: Q_(7500.0, "psi"))
    material: str = "concrete or grouted masonry"

    def __post_init__(self) -> None:
        require(self.thickness, "[length]", "thickness", positive=True)
        require(self.Fe, "[pressure]", "Fe", positive=True)

    @property
    def label(self) -> str:
        return self.material


Member = WoodMember | SteelPlate | Embedment


@dataclass(frozen=True)
class DowelJoint:
    """One fastener through a side member into a main member.

    Args:
        fastener: the fastener. side: the side member (both side members in double shear,
            which are taken alike). main: the main member. shear: "single" or "double".
        penetration: for lag screws, wood screws and nails in single shear, the length of the
            fastener in the main member (excluding a lag screw's tapered tip); None: from the
            fastener length minus the side member (and tip). Bolts go through: ℓ_m = t_m.
        threads_in_shear_plane: use the root diameter D_r in the yield equations (§12.3.7).
    """

    fastener: Fastener
    side: Member
    main: Member
    shear: ShearPlanes = "single"
    penetration: Quantity | None = None
    threads_in_shear_plane: bool = False

    def __post_init__(self) -> None:
        one_of("shear", self.shear, ("single", "double"))
        f = self.fastener
        if isinstance(self.side, Embedment):
            raise InputError(
                "Input side: concrete or masonry is the main member, into which the bolt is "
                "embedded (got an Embedment as the side member)",
                name="side",
                value=self.side,
                expected="a WoodMember or SteelPlate",
            )
        if isinstance(self.main, Embedment) and f.kind != "bolt":
            raise OutOfScopeError(
                f"A {f.kind} into concrete or masonry: only embedded bolts (anchor bolts) are "
                "covered here; use the screw-anchor manufacturer's evaluation report"
            )
        if isinstance(self.side, WoodMember) and self.side.end_grain:
            raise InputError(
                "Side member: end grain applies to the main member, into which the fastener is "
                "driven (got side.end_grain = True)",
                name="side.end_grain",
                value=True,
                expected="False",
            )
        if self.penetration is not None:
            require(self.penetration, "[length]", "penetration", positive=True)
        if self.threads_in_shear_plane and f.Dr is None:
            raise InputError(
                f"Fastener {f.designation} has no root diameter D_r: threads in the shear plane "
                "need it (§12.3.7)",
                name="threads_in_shear_plane",
                value=True,
                expected="False, or a fastener with Dr",
            )
        if f.kind == "bolt":
            need = self.side.thickness * (2 if self.shear == "double" else 1)
            need = need + self.main.thickness
            if f.length is not None:
                within("length", f.length, lo=need, rule="the bolt must reach through all members")
            return
        if self.shear == "double":
            raise OutOfScopeError(
                f"{f.kind} in double shear: NDS 2018 Table 12.3.1A double shear is applied here "
                "to bolts through three members only"
            )
        p = self.main_bearing_length
        pmin = MIN_PENETRATION[f.kind] * f.D
        if p < pmin:
            raise InputError(
                f"Penetration p of the {f.designation} into the main member must be at least "
                f"{MIN_PENETRATION[f.kind]:g}D = {pmin.to('inch'):~.3gP} (got p = "
                f"{p.to('inch'):~.3gP}; fastener length {f.length}, side member "
                f"{self.side.thickness:~P}); a fastener shorter than the side member plus this "
                "penetration cannot be used",
                name="penetration",
                value=p,
                expected=f"p ≥ {pmin.to('inch'):~.3gP}",
            )

    @property
    def main_bearing_length(self) -> Quantity:
        """ℓ_m: the main member thickness (bolts), or the penetration (screws, nails)."""
        f = self.fastener
        if f.kind == "bolt":
            return self.main.thickness
        if self.penetration is not None:
            p = self.penetration
        elif f.length is not None:
            p = f.length - self.side.thickness
            if f.tip is not None:
                p = p - f.tip
        else:
            p = required(
                "penetration",
                self.penetration,
                expected="the penetration into the main member, or the fastener's length",
                when=f"for fastener {f.designation}",
            )
        return p if p <= self.main.thickness else self.main.thickness

    @property
    def diameter(self) -> Quantity:
        """The diameter used in Table 12.3.1A (§12.3.7): D, or D_r with threads in shear."""
        f = self.fastener
        if self.threads_in_shear_plane and f.Dr is not None:
            return f.Dr
        return f.D

    @property
    def theta_max(self) -> Quantity:
        """The largest load angle to grain of the wood members (for K_θ)."""
        angs = [m.angle for m in (self.side, self.main) if isinstance(m, WoodMember)]
        return max(angs, key=lambda a: float(a.to("degree").magnitude), default=Q_(0.0, "degree"))


@dataclass(frozen=True)
class YieldLimits:
    """The yield limit equations' results for one fastener and one shear plane set.

    Attributes:
        modes: Z of each mode by name ("I_m", "I_s", "II", "III_m", "III_s", "IV").
        Z: the least (governing) value. governing: its mode. values: every intermediate value.
    """

    modes: Mapping[str, Quantity]
    Z: Quantity
    governing: str
    values: Mapping[str, Quantity]


def _bearing(c: Recorder, tag: str, m: Member, D: Any, j: DowelJoint) -> Any:
    """F_e of member ``m`` (tag "m" or "s") at its load angle, as working."""
    name = f"F_e{tag}"
    if isinstance(m, Embedment):
        return c.given(
            name, m.Fe, f"dowel bearing strength, {m.label}",
            source="NDS 2018 wood-to-concrete bolt values (7 500 psi, from memory)",
        )  # fmt: skip
    if isinstance(m, SteelPlate):
        if m.Fe is not None:
            return c.given(name, m.Fe, f"dowel bearing strength, {m.label}", source="given")
        Fu = c.given(f"F_u{tag}", m.Fu, f"tensile strength, {m.label}", source="given")
        return c.derive(
            name,
            1.5 * Fu,
            f"dowel bearing strength, {m.label}",
            unit="psi",
            ref="NDS 2018 Table 12.3.3 footnote (hot-rolled steel, from memory)",
        )
    G_val, G_src = m.gravity
    G = c.given(f"G_{tag}", G_val, f"specific gravity, {m.label}", source=G_src)
    if j.fastener.D < _SMALL:
        return c.derive(
            name,
            G**1.84 * Q_(16600.0, "psi"),
            f"dowel bearing strength, {m.label} (D < 1/4 in.)",
            unit="psi",
            ref="NDS 2018 Table 12.3.3 footnote 2",
        )
    th = float(m.angle.to("radian").magnitude)
    Fpar = c.derive(
        f"F_e{tag}_par",
        G * Q_(11200.0, "psi"),
        f"dowel bearing parallel to grain, {m.label}",
        unit="psi",
        ref="NDS 2018 Table 12.3.3 footnote 2",
    )
    if th == 0.0:
        return c.derive(name, Fpar, "θ = 0°", unit="psi", ref="NDS 2018 §12.3.4")
    Fperp = c.derive(
        f"F_e{tag}_perp",
        G**1.45 * Q_(6100.0, "psi*inch**0.5") / c.sqrt(D),
        f"dowel bearing perpendicular to grain, {m.label}",
        unit="psi",
        ref="NDS 2018 Table 12.3.3 footnote 2",
    )
    if abs(th - math.pi / 2) < 1e-12:
        return c.derive(name, Fperp, "θ = 90°", unit="psi", ref="NDS 2018 §12.3.4")
    s2 = c.given(f"sin2_{tag}", math.sin(th) ** 2, f"sin²θ, θ = {m.angle:~P}", source="given")
    c2 = c.given(f"cos2_{tag}", math.cos(th) ** 2, "cos²θ", source="given")
    return c.derive(
        name,
        Fpar * Fperp / (Fpar * s2 + Fperp * c2),
        f"dowel bearing at θ = {m.angle:~P} to grain (Hankinson)",
        unit="psi",
        ref="NDS 2018 Eq. (12.3-11)",
    )


def yield_logic(c: Recorder, j: DowelJoint) -> Any:
    """The yield limit equations as working; returns the governing Z handle (lbf).

    Follows NDS 2018 Tables 12.3.1A (equations) and 12.3.1B (k1, k2, k3, R_d).
    """
    f = j.fastener
    double = j.shear == "double"
    c.heading(f"Yield limit equations, {j.shear} shear (NDS 2018 §12.3.1)", 3)
    D = c.given(
        "D",
        j.diameter,
        "root diameter D_r (threads in the shear plane)"
        if j.threads_in_shear_plane
        else "fastener diameter",
        source=f.source,
        unit="inch",
    )
    Fyb = c.given("F_yb", f.Fyb, "dowel bending yield strength", source=f.source, unit="psi")
    ls = c.given(
        "l_s", j.side.thickness, f"side member bearing length, {j.side.label}", unit="inch"
    )
    lm = c.given(
        "l_m",
        j.main_bearing_length,
        f"main member bearing length, {j.main.label}"
        + ("" if f.kind == "bolt" else " (penetration)"),
        unit="inch",
    )
    Fes = _bearing(c, "s", j.side, D, j)
    Fem = _bearing(c, "m", j.main, D, j)
    Re = c.derive("R_e", Fem / Fes, "", ref="NDS 2018 Table 12.3.1B")
    Rt = c.derive("R_t", lm / ls, "", ref="NDS 2018 Table 12.3.1B")
    small = f.D < _SMALL
    if small:
        Dn = float(f.D.to("inch").magnitude)
        if Dn <= 0.17:
            KD = c.given("K_D", 2.2, "D ≤ 0.17 in.", source="NDS 2018 Table 12.3.1B")
        else:
            KD = c.derive(
                "K_D",
                10.0 * D / Q_(1.0, "inch") + 0.5,
                "0.17 in. < D < 0.25 in.",
                ref="NDS 2018 Table 12.3.1B",
            )
        Rd = dict.fromkeys(("I", "II", "III", "IV"), KD)
    else:
        th = float(j.theta_max.to("degree").magnitude)
        theta = c.given("theta", Q_(th, "degree"), "largest angle of load to grain", source="given")
        Kth = c.derive(
            "K_theta", 1 + 0.25 * theta / Q_(90.0, "degree"), "", ref="NDS 2018 Table 12.3.1B"
        )
        Rd = {
            "I": c.derive("R_d_I", 4 * Kth, "modes I_m, I_s", ref="NDS 2018 Table 12.3.1B"),
            "II": c.derive("R_d_II", 3.6 * Kth, "mode II", ref="NDS 2018 Table 12.3.1B"),
            "III": c.derive("R_d_III", 3.2 * Kth, "modes III, IV", ref="NDS 2018 Table 12.3.1B"),
        }
        Rd["IV"] = Rd["III"]
    k2sq = 2 * Fyb * (2 + Re) * D**2 / (3 * Fem * ls**2)
    k3 = c.derive(
        "k_3",
        -1 + c.sqrt(2 * (1 + Re) / Re + k2sq),
        "",
        ref="NDS 2018 Table 12.3.1B",
    )
    ref = "NDS 2018 Table 12.3.1A"
    modes: dict[str, Any] = {}
    modes["I_m"] = c.derive("Z_Im", D * lm * Fem / Rd["I"], "mode I_m", unit="lbf", ref=ref)
    modes["I_s"] = c.derive(
        "Z_Is",
        (2 * D * ls * Fes if double else D * ls * Fes) / Rd["I"],
        "mode I_s",
        unit="lbf",
        ref=ref,
    )
    if not double:
        k1 = c.derive(
            "k_1",
            (c.sqrt(Re + 2 * Re**2 * (1 + Rt + Rt**2) + Rt**2 * Re**3) - Re * (1 + Rt)) / (1 + Re),
            "",
            ref="NDS 2018 Table 12.3.1B",
        )
        k2 = c.derive(
            "k_2",
            -1 + c.sqrt(2 * (1 + Re) + 2 * Fyb * (1 + 2 * Re) * D**2 / (3 * Fem * lm**2)),
            "",
            ref="NDS 2018 Table 12.3.1B",
        )
        modes["II"] = c.derive("Z_II", k1 * D * ls * Fes / Rd["II"], "mode II", unit="lbf", ref=ref)
        modes["III_m"] = c.derive(
            "Z_IIIm",
            k2 * D * lm * Fem / ((1 + 2 * Re) * Rd["III"]),
            "mode III_m",
            unit="lbf",
            ref=ref,
        )
    modes["III_s"] = c.derive(
        "Z_IIIs",
        (2 * k3 if double else k3) * D * ls * Fem / ((2 + Re) * Rd["III"]),
        "mode III_s",
        unit="lbf",
        ref=ref,
    )
    modes["IV"] = c.derive(
        "Z_IV",
        (2 * D**2 if double else D**2) / Rd["IV"] * c.sqrt(2 * Fem * Fyb / (3 * (1 + Re))),
        "mode IV",
        unit="lbf",
        ref=ref,
    )
    qs = {k: c.q(v) for k, v in modes.items()}
    gov = min(qs, key=lambda k: float(qs[k].to("lbf").magnitude))
    c.table(
        ["Mode", "Z"],
        [[k, f"{qs[k].to('lbf').magnitude:,.0f} lbf"] for k in modes],
        caption=f"Yield modes: mode {gov} governs",
    )
    return c.derive("Z", c.min(*modes.values()), f"governing mode {gov}", unit="lbf", ref=ref)


def yield_limits(joint: DowelJoint) -> YieldLimits:
    """Every yield mode of ``joint`` and the governing reference lateral value Z (one fastener).

    Raises:
        OutOfScopeError: D > 1 in. (at construction of the fastener).
    """
    rec = Recorder("Z")
    yield_logic(rec, joint)
    names = {"Z_Im": "I_m", "Z_Is": "I_s", "Z_II": "II", "Z_IIIm": "III_m", "Z_IIIs": "III_s"}
    names["Z_IV"] = "IV"
    modes = {names[k]: v for k, v in rec.values.items() if k in names}
    gov = min(modes, key=lambda k: float(modes[k].to("lbf").magnitude))
    return YieldLimits(modes, rec.values["Z"], gov, dict(rec.values))


def lookup_kind(kind: str) -> str:
    """``kind`` if it is a fastener kind of this module (InputError otherwise)."""
    return str(lookup("kind", kind, {k: k for k in KINDS}, what="fastener kind"))
