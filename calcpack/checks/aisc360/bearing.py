"""ANSI/AISC 360-16 §J10 (flanges and webs with concentrated forces) and §J8 (bearing on
concrete) with the base plate under a column, LRFD or ASD.

* :func:`check_aisc_web_bearing`: web local yielding (§J10.2), web local crippling (§J10.3)
  and web sidesway buckling (§J10.4) of a rolled I-shape (W, M, S, HP) under a concentrated
  compressive force on one flange (a reaction at a bearing, or a load). Webs without
  stiffeners or doublers.
* :func:`check_aisc_base_plate`: concrete bearing under a concentrically loaded base plate
  (§J8, Eq. J8-2 with the supporting area A_2) and the plate thickness for cantilever bending
  of the plate (AISC Design Guide 1, 2nd ed., §3.1.2: l = max(m, n, λn′)), plate yielding with
  φ_b = 0.90 / Ω_b = 1.67 (§F1).

Units: pint quantities; sign: forces are magnitudes in compression.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from calcpack.checks.aisc360.member_data import check_method, design_strength, member_standard
from calcpack.checks.aisc360.shape import E_SOURCE, E_STEEL
from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.checks.scope import material_in_scope
from calcpack.errors import OutOfScopeError
from calcpack.sections.aisc_database import SteelShape
from calcpack.units import Q_, Quantity, require
from calcpack.validate import positive_fields, within

__all__ = ["BasePlate", "ConcentratedForce", "check_aisc_base_plate", "check_aisc_web_bearing"]


@dataclass(frozen=True)
class ConcentratedForce:
    """A concentrated compressive force on one flange of a beam.

    Args:
        R: required strength (R_u LRFD, R_a ASD), compression. lb: length of bearing (≥ k for
            end reactions, §J10.2). at: distance from the member end to the force.
        Lb: largest laterally unbraced length along either flange at the force (for §J10.4;
            None: sidesway web buckling not checked because the flanges are held against
            relative lateral movement at the force, stated on the sheet).
        flange_restrained: the loaded (compression) flange is restrained against rotation.
        moment_below_yield: the required moment at the force is below M_y (C_r = 960 000
            ksi), else C_r = 480 000 ksi (§J10.4).
        combination: the load combination.
    """

    R: Quantity
    lb: Quantity
    at: Quantity
    Lb: Quantity | None = None
    flange_restrained: bool = True
    moment_below_yield: bool = True
    combination: str | None = None

    def __post_init__(self) -> None:
        require(self.R, "[force]", "R", positive=True)
        require(self.lb, "[length]", "lb", positive=True)
        require(self.at, "[length]", "at", nonnegative=True)
        if self.Lb is not None:
            require(self.Lb, "[length]", "Lb", positive=True)


def check_aisc_web_bearing(
    shape: SteelShape,
    *,
    Fy: Quantity,
    force: ConcentratedForce,
    method: str = "LRFD",
    mark: str = "B1",
    E: Quantity = E_STEEL,
    material: str = "",
) -> MemberChecks:
    """Web local yielding, crippling and sidesway buckling of a rolled I-shape (§J10.2-§J10.4).

    ``material``: the steel's material standard and grade (``"ASTM A992"``), shown as the
    source of F_y.

    Raises:
        OutOfScopeError: not a rolled I-shape.
        InputError: bad units, F_y out of range, bad method.
    """
    method = check_method(method)
    material_in_scope("AISC 360-16|steel|Fy", "Fy", Fy)
    material_in_scope("AISC 360-16|steel|E", "E", E)
    if shape.type not in ("W", "M", "S", "HP"):
        raise OutOfScopeError(
            f"Shape {shape.designation} ({shape.type}): §J10.2-§J10.4 are implemented here for "
            "rolled I-shapes (W, M, S, HP) only"
        )
    f = force
    combo = f.combination
    s = shape

    def logic(c: Recorder) -> None:
        c.assume("Web without stiffeners or doubler plates at the force; Q_f = 1 (not an HSS).")
        Fy_ = c.given("F_y", Fy, "yield stress", source=material or "given")
        E_ = c.given("E", E, "modulus of elasticity", source=E_SOURCE)
        d = c.given("d", s["d"], "depth", source=s.source)
        tw = c.given("t_w", s["tw"], "web thickness", source=s.source)
        tf = c.given("t_f", s["tf"], "flange thickness", source=s.source)
        k = c.given("k", s["kdes"], "flange face to web toe of fillet (k_des)", source=s.source)
        lb = c.given("l_b", f.lb, "length of bearing", source="given", unit="inch")
        at = c.given("a", f.at, "distance from the member end", source="given", unit="inch")
        R = c.given(
            "R_u" if method == "LRFD" else "R_a",
            f.R,
            "required strength",
            source=combo or "given",
            unit="kip",
        )
        c.heading("Web local yielding, §J10.2", 3)
        kk, where, eq = (
            (5, "force farther than d from the end", "J10-2")
            if c.q(at) > c.q(d)
            else (2.5, "force within d of the end", "J10-3")
        )
        Rn = c.derive(
            "R_n_WLY", Fy_ * tw * (kk * k + lb), where, unit="kip", ref=f"AISC 360-16 Eq. ({eq})"
        )
        cap = design_strength(
            c, "web local yielding", Rn, method, name="R_c_WLY", unit="kip", what="strength"
        )
        c.check("Web local yielding", R, cap, ref="AISC 360-16 §J10.2", combination=combo)
        c.heading("Web local crippling, §J10.3", 3)
        root = c.sqrt(E_ * Fy_ * tf / tw)
        lb_d = float((f.lb / s["d"]).to("").magnitude)
        far = c.q(at) >= c.q(d) / 2
        if far or lb_d <= 0.2:
            coef, where, eq = (
                (0.80, "force at least d/2 from the end", "J10-4")
                if far
                else (0.40, "within d/2 of the end, l_b/d ≤ 0.2", "J10-5a")
            )
            Rn = c.derive(
                "R_n_WCr",
                coef * tw**2 * (1 + 3 * (lb / d) * (tw / tf) ** 1.5) * root,
                where,
                unit="kip",
                ref=f"AISC 360-16 Eq. ({eq})",
            )
        else:
            Rn = c.derive(
                "R_n_WCr",
                0.40 * tw**2 * (1 + (4 * lb / d - 0.2) * (tw / tf) ** 1.5) * root,
                "within d/2 of the end, l_b/d > 0.2",
                unit="kip",
                ref="AISC 360-16 Eq. (J10-5b)",
            )
        cap = design_strength(
            c, "web local crippling", Rn, method, name="R_c_WCr", unit="kip", what="strength"
        )
        c.check("Web local crippling", R, cap, ref="AISC 360-16 §J10.3", combination=combo)
        _sidesway(c, s, f, tw, tf, R, method)

    return run_checks(
        mark, f"{s.designation} web at a concentrated force", member_standard(method), logic
    )


def _sidesway(
    c: Recorder, s: SteelShape, f: ConcentratedForce, tw: Any, tf: Any, R: Any, method: str
) -> None:
    c.heading("Web sidesway buckling, §J10.4", 3)
    if f.Lb is None:
        c.assume(
            "The flanges are held against relative lateral movement at the force: web "
            "sidesway buckling does not apply (AISC 360-16 §J10.4)."
        )
        return
    h = c.given(
        "h", s["d"] - 2 * s["kdes"], "clear web depth less the fillets, d − 2k_des", source=s.source
    )
    bf = c.given("b_f", s["bf"], "flange width", source=s.source)
    Lb = c.given("L_b", f.Lb, "largest unbraced length of either flange at the force", unit="ft")
    ratio = c.derive("rho_w", (h / tw) / (Lb / bf), "(h/t_w)/(L_b/b_f)", ref="AISC 360-16 §J10.4")
    limit = 2.3 if f.flange_restrained else 1.7
    if c.f(ratio) > limit:
        c.text(f"(h/t_w)/(L_b/b_f) > {limit}: web sidesway buckling does not apply (§J10.4).")
        return
    Cr = c.given(
        "C_r",
        Q_(960000.0 if f.moment_below_yield else 480000.0, "ksi"),
        "M_r < M_y" if f.moment_below_yield else "M_r ≥ M_y",
        source="AISC 360-16 §J10.4",
    )
    if f.flange_restrained:
        Rn = c.derive(
            "R_n_WSB",
            Cr * tw**3 * tf / h**2 * (1 + 0.4 * ratio**3),
            "compression flange restrained against rotation",
            unit="kip",
            ref="AISC 360-16 Eq. (J10-6)",
        )
    else:
        Rn = c.derive(
            "R_n_WSB",
            Cr * tw**3 * tf / h**2 * (0.4 * ratio**3),
            "compression flange not restrained against rotation",
            unit="kip",
            ref="AISC 360-16 Eq. (J10-7)",
        )
    cap = design_strength(
        c, "web sidesway buckling", Rn, method, name="R_c_WSB", unit="kip", what="strength"
    )
    c.check("Web sidesway buckling", R, cap, ref="AISC 360-16 §J10.4", combination=f.combination)


@dataclass(frozen=True)
class BasePlate:
    """A rectangular base plate centred under a column on a concrete support.

    Args:
        B: plate width (parallel to the column flanges), N: plate length (parallel to the
            depth). t: plate thickness (None: only the required thickness is reported).
        Fy: plate yield stress. fc: specified concrete strength f′_c.
        A2: the largest area of the supporting surface geometrically similar to and concentric
            with the plate (§J8); None: the plate covers the whole support (A_2 = A_1).
    """

    B: Quantity
    N: Quantity
    Fy: Quantity
    fc: Quantity
    t: Quantity | None = None
    A2: Quantity | None = None

    def __post_init__(self) -> None:
        positive_fields(self, "[length]", ("B", "N"))
        require(self.Fy, "[pressure]", "Fy", positive=True)
        require(self.fc, "[pressure]", "fc", positive=True)
        if self.t is not None:
            require(self.t, "[length]", "t", positive=True)
        if self.A2 is not None:
            require(self.A2, "[area]", "A2", positive=True)
            within(
                "A2",
                self.A2,
                lo=self.B * self.N,
                rule="A_2 is at least the plate area A_1 = B·N (§J8)",
            )


def check_aisc_base_plate(
    column: SteelShape,
    plate: BasePlate,
    *,
    P: Quantity,
    method: str = "LRFD",
    mark: str = "BP1",
    combination: str | None = None,
) -> MemberChecks:
    """Concrete bearing (§J8) and plate thickness under a concentrically loaded I-shape column.

    Raises:
        OutOfScopeError: the column is not an I-shape, or the plate is smaller than the column.
    """
    method = check_method(method)
    require(P, "[force]", "P", positive=True)
    if column.type not in ("W", "M", "S", "HP"):
        raise OutOfScopeError(
            f"Column {column.designation} ({column.type}): the base plate check is implemented "
            "for I-shape columns (m, n and λn′ of Design Guide 1) only"
        )
    s = column
    if s["d"] >= plate.N or s["bf"] >= plate.B:
        raise OutOfScopeError(
            f"Base plate {plate.B:~P} × {plate.N:~P} does not project beyond column "
            f"{s.designation} (d = {s['d']:~P}, b_f = {s['bf']:~P}): the cantilever model "
            "needs N > d and B > b_f"
        )

    def logic(c: Recorder) -> None:
        c.assume("Concentric axial load; no moment or uplift on the base plate.")
        c.heading("Bearing on concrete, §J8", 3)
        fc = c.given("f_c", plate.fc, "specified compressive strength of concrete", source="given")
        B = c.given("B", plate.B, "plate width", source="given", unit="inch")
        N = c.given("N", plate.N, "plate length", source="given", unit="inch")
        A1 = c.derive("A_1", B * N, "plate area", unit="inch**2", ref="AISC 360-16 §J8")
        A2 = c.given(
            "A_2",
            plate.A2 if plate.A2 is not None else plate.B * plate.N,
            "supporting area, concentric and similar",
            source="given",
            unit="inch**2",
        )
        Pp = c.derive(
            "P_p",
            c.min(0.85 * fc * A1 * c.sqrt(A2 / A1), 1.7 * fc * A1),
            "nominal bearing strength",
            unit="kip",
            ref="AISC 360-16 Eq. (J8-2)",
        )
        Pc = design_strength(
            c, "concrete bearing", Pp, method, name="P_c_brg", unit="kip", what="bearing strength"
        )
        Pr = c.given(
            "P_u" if method == "LRFD" else "P_a",
            P,
            "required axial strength",
            source=combination or "given",
            unit="kip",
        )
        c.check("Concrete bearing", Pr, Pc, ref="AISC 360-16 §J8", combination=combination)
        c.heading("Plate thickness (AISC Design Guide 1, 2nd ed., §3.1.2)", 3)
        d = c.given("d", s["d"], "column depth", source=s.source)
        bf = c.given("b_f", s["bf"], "column flange width", source=s.source)
        m = c.derive(
            "m",
            (N - 0.95 * d) / 2,
            "cantilever along N",
            unit="inch",
            ref="AISC Design Guide 1 Eq. (3.1.5)",
        )
        n = c.derive(
            "n",
            (B - 0.8 * bf) / 2,
            "cantilever along B",
            unit="inch",
            ref="AISC Design Guide 1 Eq. (3.1.6)",
        )
        X = c.derive(
            "X", 4 * d * bf / (d + bf) ** 2 * Pr / Pc, "", ref="AISC Design Guide 1 Eq. (3.1.4)"
        )
        lam = c.derive(
            "lambda",
            c.min(2 * c.sqrt(X) / (1 + c.sqrt(1 - X)), 1.0),
            "≤ 1",
            ref="AISC Design Guide 1 Eq. (3.1.3)",
        )
        lnp = c.derive(
            "lambda_n_p",
            lam * c.sqrt(d * bf) / 4,
            "λn′",
            unit="inch",
            ref="AISC Design Guide 1 Eq. (3.1.2)",
        )
        ll = c.derive(
            "l",
            c.max(m, n, lnp),
            "governing cantilever",
            unit="inch",
            ref="AISC Design Guide 1 §3.1.2",
        )
        Fyp = c.given("F_y_p", plate.Fy, "plate yield stress", source="given")
        if method == "LRFD":
            phi = c.given(
                "phi_b", 0.90, "resistance factor, plate flexure", source="AISC 360-16 §F1"
            )
            t_req = c.derive(
                "t_min",
                ll * c.sqrt(2 * Pr / (phi * Fyp * B * N)),
                "minimum plate thickness",
                unit="inch",
                ref="AISC Design Guide 1 Eq. (3.3.14a)",
            )
        else:
            om = c.given("Omega_b", 1.67, "safety factor, plate flexure", source="AISC 360-16 §F1")
            t_req = c.derive(
                "t_min",
                ll * c.sqrt(2 * Pr * om / (Fyp * B * N)),
                "minimum plate thickness",
                unit="inch",
                ref="AISC Design Guide 1 Eq. (3.3.15a)",
            )
        if plate.t is None:
            c.text("No plate thickness given: the minimum thickness is reported only.")
            return
        t = c.given("t_p", plate.t, "plate thickness provided", source="given", unit="inch")
        c.check(
            "Plate thickness", t_req, t, ref="AISC Design Guide 1 §3.1.2", combination=combination
        )

    return run_checks(mark, f"Base plate under {s.designation}", member_standard(method), logic)
