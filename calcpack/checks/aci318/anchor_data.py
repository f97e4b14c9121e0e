"""Inputs, materials and strength reduction factors of cast-in anchors, ACI CODE-318-19
Chapter 17 (no working here; the clauses are in :mod:`calcpack.checks.aci318.anchors`).

Scope, refused outside it with the limit named: cast-in headed studs, headed bolts and hooked
bolts (post-installed anchors need the product's qualification data, ACI 355.2, and are not
covered); d_a ≤ 4 in. and h_ef ≤ 25 in. (the Chapter 17 breakout method, §17.1 and §17.6.2,
from memory); h_ef less than the member thickness h_a; f'c at least 2500 psi (§19.2.1.1), with
√f'c taken at most 100 psi (§17.3.1); minimum spacing and edge distances of §17.9.2 (cast-in:
spacing 4 d_a, edge distance the specified cover, both 6 d_a for anchors that will be torqued);
hooked bolts with 3 d_a ≤ e_h (§17.6.3.2.2(b)); no seismic design category C to F demand
(§17.10 is not implemented). A group is a rectangular pattern of nx × ny anchors; its edges are
given by their distance from the outermost anchors ("-x", "+x", "-y", "+y"; an edge not given is
far enough not to matter).

Edition implemented: ACI CODE-318-19. Its provisions must be confirmed against the edition
adopted locally before issue.
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass, field
from types import MappingProxyType
from typing import Literal

from calcpack.errors import InputError, OutOfScopeError
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, one_of, positive, required, whole, within

__all__ = [
    "ANCHOR_FACTORS",
    "AnchorFactor",
    "AnchorGroup",
    "AnchorLoads",
    "AnchorSteel",
    "anchor_steel",
    "threaded_area",
]

AnchorKind = Literal["headed stud", "headed bolt", "hooked bolt"]
Cracking = Literal["cracked", "uncracked"]
Condition = Literal["A", "B"]
EdgeBars = Literal["none", "edge bar", "edge bar and stirrups"]
Side = Literal["-x", "+x", "-y", "+y"]
SIDES: tuple[Side, ...] = ("-x", "+x", "-y", "+y")
KINDS: tuple[AnchorKind, ...] = ("headed stud", "headed bolt", "hooked bolt")

_STEELS = "aci318_19_anchor_steels.csv"
_THREADS = "asme_b1_1_unc_threads.csv"
_BASIS = "from memory"


@dataclass(frozen=True)
class AnchorFactor:
    """A strength reduction factor φ and the clause (table row) that sets it."""

    phi: float
    clause: str


ANCHOR_FACTORS: Mapping[str, AnchorFactor] = MappingProxyType(
    {
        "steel tension, ductile": AnchorFactor(0.75, "ACI 318-19 Table 17.5.3(a)"),
        "steel tension, brittle": AnchorFactor(0.65, "ACI 318-19 Table 17.5.3(a)"),
        "steel shear, ductile": AnchorFactor(0.65, "ACI 318-19 Table 17.5.3(b)"),
        "steel shear, brittle": AnchorFactor(0.60, "ACI 318-19 Table 17.5.3(b)"),
        "concrete tension, A": AnchorFactor(0.75, "ACI 318-19 Table 17.5.3(c), Condition A"),
        "concrete tension, B": AnchorFactor(0.70, "ACI 318-19 Table 17.5.3(c), Condition B"),
        "concrete shear, A": AnchorFactor(0.75, "ACI 318-19 Table 17.5.3(c), Condition A"),
        "concrete shear, B": AnchorFactor(0.70, "ACI 318-19 Table 17.5.3(c), Condition B"),
        # Condition A is not used for pullout and pryout (Table 17.5.3 note, from memory)
        "pullout": AnchorFactor(0.70, "ACI 318-19 Table 17.5.3(c), Condition B"),
        "pryout": AnchorFactor(0.70, "ACI 318-19 Table 17.5.3(c), Condition B"),
    }
)
"""φ of ACI 318-19 Table 17.5.3 for cast-in anchors (from memory), declared once."""


@dataclass(frozen=True)
class AnchorSteel:
    """An anchor steel: specified yield and tensile strengths and ductility (ACI 318-19 §2.3)."""

    grade: str
    f_ya: Quantity
    f_uta: Quantity
    ductile: bool
    source: str


def anchor_steel(grade: str) -> AnchorSteel:
    """The anchor steel ``grade`` ("F1554 Gr. 36", "F1554 Gr. 55", "F1554 Gr. 105", "A307",
    "AWS D1.1 Type B stud") from ``refdata/aci318_19_anchor_steels.csv``.

    Raises:
        InputError: a grade the table does not hold (with "did you mean").
    """
    table = read_table(_STEELS, key="grade")
    row = table.row(grade, what="anchor steel")
    return AnchorSteel(
        grade=str(row["grade"]),
        f_ya=Q_(float(row["f_ya"]), "ksi"),
        f_uta=Q_(float(row["f_uta"]), "ksi"),
        ductile=row["ductile"] == "yes",
        source=f"{table.citation.split(';')[0]} ({row['basis']})",
    )


def threaded_area(d_a: Quantity) -> tuple[Quantity, str]:
    """Effective area A_se of a UNC-threaded anchor of diameter ``d_a`` and its source:
    A_se = (π/4)(d_a − 0.9743/n_t)², ACI 318-19 Commentary R17.6.1.2, n_t from ASME B1.1.

    Raises:
        InputError: a diameter that is not a UNC size of the table (give ``A_se``).
    """
    d_in = float(dimension("d_a", d_a, "[length]").to("inch").magnitude)
    table = read_table(_THREADS, key="d")
    for k, row in table.rows.items():
        if abs(float(k) - d_in) < 1e-6:
            n_t = float(row["n_t"])
            area = math.pi / 4 * (d_in - 0.9743 / n_t) ** 2
            return Q_(area, "inch**2"), (
                f"ACI 318-19 R17.6.1.2 with n_t = {n_t:g} threads per in. (ASME B1.1 UNC, "
                f"{row['basis']})"
            )
    sizes = ", ".join(k for k in table.rows)
    raise InputError(
        name="d_a",
        value=d_a,
        rule="must be a UNC thread size of ASME B1.1 to take A_se from the thread table",
        expected=f"one of {sizes} in., or give A_se",
    )


@dataclass(frozen=True)
class AnchorGroup:
    """Cast-in anchors in concrete, one or a rectangular group, ACI 318-19 Chapter 17.

    Args:
        kind: "headed stud", "headed bolt" (a rod with a nut or a head) or "hooked bolt".
        d_a: outside diameter of the anchor [length].
        h_ef: effective embedment depth [length] (to the bearing surface of the head, or to the
            inside of the hook).
        grade: anchor steel (:func:`anchor_steel`).
        f_c: specified concrete strength f'c [pressure].
        h_a: thickness of the member the anchors are in [length].
        edges: distance from the outermost anchors to each edge within reach, by side
            ("-x", "+x", "-y", "+y") [length]; a side not given has no edge near.
        nx, ny: anchors along x and along y; s_x, s_y: their spacings [length].
        A_brg: net bearing area of the head or nut [area] (headed anchors).
        e_h: inside length of the hook [length] (hooked bolts).
        A_se: effective cross-sectional area [area]; None takes it from the UNC thread table
            (bolts) or the shank (studs).
        cracking: "cracked" (no analysis showing the concrete uncracked at service) or
            "uncracked".
        lam: λ of the concrete (1.0 normal weight; λ_a = λ for cast-in anchors, §17.2.4).
        condition: "A" with supplementary reinforcement for breakout (Table 17.5.3), else "B".
        edge_bars: reinforcement at the edge the shear acts towards (ψ_c,V, §17.7.2.5).
        grout_pad: the anchors pass through a grout pad (V_sa × 0.80, §17.7.1.2.1).
        torqued: the anchors will be torqued (minimum edge distance and spacing 6 d_a).
        cover: specified cover of the reinforcement [length], the minimum edge distance of
            anchors not torqued (§17.9.2); None: not checked (state it on the drawing).
        seismic: the anchors resist earthquake forces in Seismic Design Category C to F:
            refused (§17.10 is not implemented).
    """

    kind: AnchorKind
    d_a: Quantity
    h_ef: Quantity
    grade: str
    f_c: Quantity
    h_a: Quantity
    edges: Mapping[str, Quantity] = field(default_factory=dict)
    nx: int = 1
    ny: int = 1
    s_x: Quantity | None = None
    s_y: Quantity | None = None
    A_brg: Quantity | None = None
    e_h: Quantity | None = None
    A_se: Quantity | None = None
    cracking: Cracking = "cracked"
    lam: float = 1.0
    condition: Condition = "B"
    edge_bars: EdgeBars = "none"
    grout_pad: bool = False
    torqued: bool = False
    cover: Quantity | None = None
    seismic: bool = False

    def __post_init__(self) -> None:
        one_of("kind", self.kind, KINDS)
        one_of("cracking", self.cracking, ("cracked", "uncracked"))
        one_of("condition", self.condition, ("A", "B"))
        one_of("edge_bars", self.edge_bars, ("none", "edge bar", "edge bar and stirrups"))
        if self.seismic:
            raise OutOfScopeError(
                "Anchors resisting earthquake forces (seismic = True): the requirements of "
                "ACI 318-19 §17.10 for Seismic Design Categories C to F are not implemented; "
                "design these anchors to §17.10"
            )
        d_a = positive("d_a", dimension("d_a", self.d_a, "[length]"))
        within("d_a", d_a, hi=Q_(4, "inch"), rule="ACI 318-19 Chapter 17 covers d_a ≤ 4 in.")
        h_a = positive("h_a", dimension("h_a", self.h_a, "[length]"))
        h_ef = positive("h_ef", dimension("h_ef", self.h_ef, "[length]"))
        within("h_ef", h_ef, hi=Q_(25, "inch"), rule="ACI 318-19 §17.6.2 covers h_ef ≤ 25 in.")
        within(
            "h_ef",
            h_ef,
            hi=h_a,
            inclusive=False,
            rule=f"the anchor must end inside the member (h_a = {h_a:~P})",
        )
        within(
            "f_c",
            dimension("f_c", self.f_c, "[pressure]"),
            lo=Q_(2500, "psi"),
            rule="ACI 318-19 §19.2.1.1 (at least 2500 psi)",
        )
        within("lam", float(self.lam), 0.75, 1.0, rule="ACI 318-19 Table 19.2.4.2")
        whole("nx", self.nx, lo=1)
        whole("ny", self.ny, lo=1)
        d_min = 6 * d_a if self.torqued else 4 * d_a
        why = "6 d_a, cast-in anchors torqued" if self.torqued else "4 d_a, cast-in anchors"
        for n_, s_nm in ((self.nx, "s_x"), (self.ny, "s_y")):
            if n_ > 1:
                s = required(s_nm, getattr(self, s_nm), expected="the anchor spacing",
                             when=f"with {n_} anchors in a line")  # fmt: skip
                within(s_nm, dimension(s_nm, s, "[length]"), lo=d_min,
                       rule=f"ACI 318-19 §17.9.2, cast-in anchors {why}")  # fmt: skip
        clean: dict[str, Quantity] = {}
        for side, c in self.edges.items():
            one_of("edges", side, SIDES)
            nm = f"edges[{side}]"
            c = positive(nm, dimension(nm, c, "[length]"))
            if self.torqued:
                within(
                    nm,
                    c,
                    lo=6 * d_a,
                    rule="ACI 318-19 §17.9.2: 6 d_a for anchors that will be torqued",
                )
            if self.cover is not None:
                cov = dimension("cover", self.cover, "[length]")
                within(nm, c, lo=cov, rule="ACI 318-19 §17.9.2: the specified cover")
            clean[side] = c
        object.__setattr__(self, "edges", MappingProxyType(clean))
        if self.kind in ("headed stud", "headed bolt"):
            a = required("A_brg", self.A_brg, expected="the net bearing area of the head",
                         when=f"for a {self.kind}")  # fmt: skip
            positive("A_brg", dimension("A_brg", a, "[area]"))
        else:
            e = required("e_h", self.e_h, expected="the inside length of the hook",
                         when="for a hooked bolt")  # fmt: skip
            within("e_h", dimension("e_h", e, "[length]"), lo=3 * d_a,
                   rule="ACI 318-19 §17.6.3.2.2(b): e_h ≥ 3 d_a")  # fmt: skip
        if self.A_se is not None:
            area = positive("A_se", dimension("A_se", self.A_se, "[area]"))
            within("A_se", area, hi=math.pi / 4 * d_a**2,
                   rule="the effective area is at most the shank area π d_a²/4")  # fmt: skip
        self.steel()
        self.effective_area()

    @property
    def n(self) -> int:
        """Number of anchors."""
        return self.nx * self.ny

    def steel(self) -> AnchorSteel:
        return anchor_steel(self.grade)

    def effective_area(self) -> tuple[Quantity, str]:
        """A_se and where it comes from (given, the shank of a stud, or the thread table)."""
        if self.A_se is not None:
            return self.A_se, "given"
        if self.kind == "headed stud":
            return (math.pi / 4 * self.d_a**2).to("inch**2"), "shank area π d_a²/4"
        return threaded_area(self.d_a)

    def spacing(self, axis: Literal["x", "y"]) -> Quantity:
        """Spacing along ``axis`` (zero for one anchor in that direction)."""
        s = self.s_x if axis == "x" else self.s_y
        count = self.nx if axis == "x" else self.ny
        return s if (s is not None and count > 1) else 0 * self.d_a


@dataclass(frozen=True)
class AnchorLoads:
    """Factored loads on the anchors (strength combinations).

    Args:
        N: tension on the group [force] (zero for none). V: shear on the group [force].
        toward: the side the shear acts towards ("-x", "+x", "-y", "+y"), required with V.
        e_N: eccentricity of the tension resultant from the group's centroid [length].
        e_V: eccentricity of the shear, along the edge it acts towards [length].
        N_max, V_max: tension and shear on the most loaded anchor; required when the load is
            eccentric, else N/n and V/n (the anchors share it equally).
        combination: the load combination.
    """

    N: Quantity = field(default_factory=lambda: Q_(0.0, "lbf"))
    V: Quantity = field(default_factory=lambda: Q_(0.0, "lbf"))
    toward: Side | None = None
    e_N: Quantity = field(default_factory=lambda: Q_(0.0, "inch"))
    e_V: Quantity = field(default_factory=lambda: Q_(0.0, "inch"))
    N_max: Quantity | None = None
    V_max: Quantity | None = None
    combination: str | None = None

    def __post_init__(self) -> None:
        positive("N", dimension("N", self.N, "[force]"), allow_zero=True)
        positive("V", dimension("V", self.V, "[force]"), allow_zero=True)
        positive("e_N", dimension("e_N", self.e_N, "[length]"), allow_zero=True)
        positive("e_V", dimension("e_V", self.e_V, "[length]"), allow_zero=True)
        if self.N.magnitude == 0 and self.V.magnitude == 0:
            raise InputError(
                name="N", value=self.N, rule="and V are both zero",
                expected="a tension N or a shear V on the anchors",
            )  # fmt: skip
        if self.V.magnitude > 0:
            required("toward", self.toward, expected="the side the shear acts towards",
                     when="with a shear V")  # fmt: skip
            one_of("toward", self.toward, SIDES)
        if self.e_N.magnitude > 0 and self.N.magnitude > 0:
            required("N_max", self.N_max, expected="the tension on the most loaded anchor",
                     when="with an eccentric tension e_N")  # fmt: skip
        if self.e_V.magnitude > 0 and self.V.magnitude > 0:
            required("V_max", self.V_max, expected="the shear on the most loaded anchor",
                     when="with an eccentric shear e_V")  # fmt: skip
        for nm, total in (("N_max", self.N), ("V_max", self.V)):
            v = getattr(self, nm)
            if v is not None:
                rule = f"the most loaded anchor carries at most the whole {nm[0]}"
                within(nm, dimension(nm, v, "[force]"), lo=0 * total, hi=total, rule=rule)
