"""ANSI/AISC 360-16 fillet welds (§J2.2b, §J2.4) and the base metal along them, LRFD or ASD.

* Sizes: the minimum size of Table J2.4 from the thinner part joined, the maximum size along
  an edge (§J2.2b(b): the edge thickness below 1/4 in., else that thickness less 1/16 in.),
  the minimum length of four times the size (§J2.2b(c)).
* Strength: R_n = F_nw A_we with F_nw = 0.60 F_EXX (1.0 + 0.50 sin^1.5 θ) (Eq. J2-4, J2-5),
  A_we = the effective throat (w/√2 for an equal-leg fillet) times the effective length; for
  end-loaded longitudinal welds longer than 100 w the length is reduced by β = 1.2 − 0.002 L/w
  (Eq. J2-1), and beyond 300 w taken as 180 w (§J2.2b(d)).
* Base metal: shear yielding (0.60 F_y, φ = 1.00) and shear rupture (0.60 F_u, φ = 0.75) of
  the base metal along the weld (§J4.2).

θ is the angle of the load to the weld axis (0° longitudinal, 90° transverse). Units: pint.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from calcpack.checks.aisc360.bolts import factored, symbol_part
from calcpack.checks.aisc360.member_data import check_method, member_standard
from calcpack.checks.base import MemberChecks, Recorder, run_checks
from calcpack.errors import InputError
from calcpack.units import Q_, Quantity, require
from calcpack.validate import positive, positive_fields, within

__all__ = ["BaseMetal", "FilletWeld", "check_aisc_fillet_weld", "minimum_fillet_size"]

# AISC 360-16 Table J2.4: (thinner part up to and including, minimum size), inches
_MIN_SIZE = ((0.25, 0.125), (0.5, 0.1875), (0.75, 0.25), (float("inf"), 0.3125))


def minimum_fillet_size(t_thin: Quantity) -> Quantity:
    """Minimum fillet weld size for the thinner part joined (AISC 360-16 Table J2.4)."""
    require(t_thin, "[length]", "t_thin", positive=True)
    t = float(t_thin.to("inch").magnitude)
    return Q_(next(w for lim, w in _MIN_SIZE if t <= lim), "inch")


@dataclass(frozen=True)
class BaseMetal:
    """The base metal along a weld: thickness, F_y, F_u, name (shear along the weld, §J4.2)."""

    t: Quantity
    Fy: Quantity
    Fu: Quantity
    name: str = "base metal"

    def __post_init__(self) -> None:
        require(self.t, "[length]", "t", positive=True)
        require(self.Fy, "[pressure]", "Fy", positive=True)
        require(self.Fu, "[pressure]", "Fu", positive=True)


@dataclass(frozen=True)
class FilletWeld:
    """Equal-leg fillet welds of one size.

    Args:
        w: leg size. L: length of each weld. n: number of welds alike. FEXX: electrode
            strength (70 ksi for E70). theta: angle of the load to the weld axis.
        end_loaded: longitudinal welds in an end-loaded connection (β of Eq. J2-1 applies).
        t_thin: thinner part joined (Table J2.4). t_edge: thickness of the edge the weld runs
            along (None: not along an edge). base: base metal to check along the weld.
    """

    w: Quantity
    L: Quantity
    n: int = 1
    FEXX: Quantity = field(default_factory=lambda: Q_(70.0, "ksi"))
    theta: Quantity = field(default_factory=lambda: Q_(0.0, "degree"))
    end_loaded: bool = False
    t_thin: Quantity | None = None
    t_edge: Quantity | None = None
    base: tuple[BaseMetal, ...] = ()

    def __post_init__(self) -> None:
        require(self.w, "[length]", "w", positive=True)
        require(self.L, "[length]", "L", positive=True)
        positive("n", self.n)
        require(self.FEXX, "[pressure]", "FEXX", positive=True)
        require(self.theta, "[]", "theta")
        within("theta", self.theta.to("degree"), Q_(0, "degree"), Q_(90, "degree"),
               rule="θ from the weld axis, 0° to 90°")  # fmt: skip
        positive_fields(self, "[length]", ("t_thin", "t_edge"), optional=True)
        if self.end_loaded and float(self.theta.to("degree").magnitude) != 0.0:
            raise InputError(
                f"End-loaded welds (β, Eq. J2-1) are longitudinal: θ must be 0° (got theta = "
                f"{self.theta:~P})",
                name="theta",
                value=self.theta,
                expected="0°",
            )


def check_aisc_fillet_weld(
    weld: FilletWeld,
    *,
    R: Quantity,
    method: str = "LRFD",
    mark: str = "W1",
    combination: str | None = None,
) -> MemberChecks:
    """Fillet welds against the required force R (R_u LRFD, R_a ASD), AISC 360-16 §J2.4."""
    method = check_method(method)
    require(R, "[force]", "R", nonnegative=True)
    wd = weld
    import math

    th = float(wd.theta.to("radian").magnitude)
    ratio = float((wd.L / wd.w).to("").magnitude)

    def logic(c: Recorder) -> None:
        c.assume("Equal-leg fillet welds loaded through their centre of gravity.")
        c.heading("Weld size and length, §J2.2b", 3)
        w = c.given("w", wd.w, "fillet weld size", source="given", unit="inch")
        L = c.given("L_w", wd.L, "length of each weld", source="given", unit="inch")
        if wd.t_thin is not None:
            wmin = minimum_fillet_size(wd.t_thin)
            c.check("Minimum weld size", wmin, wd.w.to("inch"), ref="AISC 360-16 Table J2.4",
                    description=f"thinner part {wd.t_thin:~P}")  # fmt: skip
        if wd.t_edge is not None:
            te = wd.t_edge.to("inch")
            wmax = te if te < Q_(0.25, "inch") else te - Q_(1 / 16, "inch")
            c.check("Maximum weld size", wd.w.to("inch"), wmax, ref="AISC 360-16 §J2.2b(b)",
                    description=f"along an edge {te:~P} thick")  # fmt: skip
        c.check("Minimum weld length", 4 * wd.w.to("inch"), wd.L.to("inch"),
                ref="AISC 360-16 §J2.2b(c)", description="L ≥ 4w")  # fmt: skip
        if wd.end_loaded and ratio > 300.0:
            Le = c.derive("L_e", 180 * w, "effective length, L > 300w", unit="inch",
                          ref="AISC 360-16 §J2.2b(d)")  # fmt: skip
        elif wd.end_loaded and ratio > 100.0:
            beta = c.derive("beta", 1.2 - 0.002 * L / w, "length reduction, L > 100w",
                            ref="AISC 360-16 Eq. (J2-1)")  # fmt: skip
            Le = c.derive("L_e", beta * L, "effective length", unit="inch",
                          ref="AISC 360-16 §J2.2b(d)")  # fmt: skip
        else:
            Le = c.derive("L_e", 1.0 * L, "effective length (β = 1.0)", unit="inch",
                          ref="AISC 360-16 §J2.2b(d)")  # fmt: skip
        c.heading("Weld strength, §J2.4", 3)
        F = c.given("F_EXX", wd.FEXX, "electrode classification strength", source="given")
        s15 = c.given("sin15", math.sin(th) ** 1.5, f"sin^1.5 θ, θ = {wd.theta:~P}",
                      source="given")  # fmt: skip
        kds = c.derive("k_ds", 1.0 + 0.5 * s15, "directional strength increase",
                       ref="AISC 360-16 Eq. (J2-5)")  # fmt: skip
        Fnw = c.derive("F_nw", 0.60 * F * kds, "nominal weld stress", unit="ksi",
                       ref="AISC 360-16 Eq. (J2-5)")  # fmt: skip
        n = c.given("n_w", float(wd.n), "number of welds", source="given")
        Awe = c.derive("A_we", w / c.sqrt(2) * Le * n, "effective throat area", unit="inch**2",
                       ref="AISC 360-16 §J2.2a")  # fmt: skip
        Rn = c.derive("R_n_w", Fnw * Awe, "nominal weld strength", unit="kip",
                      ref="AISC 360-16 Eq. (J2-4)")  # fmt: skip
        cap = factored(c, "weld", Rn, method, name="R_c_w", unit="kip")
        sym = "u" if method == "LRFD" else "a"
        Rr = c.given(f"R_{sym}", R, "required strength", source=combination or "given",
                     unit="kip")  # fmt: skip
        c.check("Fillet weld strength", Rr, cap, ref="AISC 360-16 §J2.4", combination=combination)
        for b in wd.base:
            k = symbol_part(b.name)
            c.heading(f"Base metal along the weld, {b.name} (§J4.2)", 3)
            t = c.given(f"t_{k}", b.t, f"thickness, {b.name}", source="given", unit="inch")
            Fy = c.given(f"F_y_{k}", b.Fy, f"yield stress, {b.name}", source="given")
            Fu = c.given(f"F_u_{k}", b.Fu, f"tensile strength, {b.name}", source="given")
            Ay = c.derive(f"A_gv_{k}", t * L * n, "shear area along the welds",
                          unit="inch**2", ref="AISC 360-16 §J4.2")  # fmt: skip
            Rny = c.derive(f"R_n_y_{k}", 0.60 * Fy * Ay, "shear yielding", unit="kip",
                           ref="AISC 360-16 Eq. (J4-3)")  # fmt: skip
            Rnr = c.derive(f"R_n_r_{k}", 0.60 * Fu * Ay, "shear rupture", unit="kip",
                           ref="AISC 360-16 Eq. (J4-4)")  # fmt: skip
            cy = factored(c, "shear yielding", Rny, method, name=f"R_c_y_{k}", unit="kip")
            cr = factored(c, "shear rupture", Rnr, method, name=f"R_c_r_{k}", unit="kip")
            c.check(f"Base metal shear yielding, {b.name}", Rr, cy, ref="AISC 360-16 §J4.2(a)",
                    combination=combination)  # fmt: skip
            c.check(f"Base metal shear rupture, {b.name}", Rr, cr, ref="AISC 360-16 §J4.2(b)",
                    combination=combination)  # fmt: skip

    title = f"{wd.n} × {wd.w.to('inch'):~P} fillet weld, {wd.L.to('inch'):~P} long"
    return run_checks(mark, title, member_standard(method), logic)
