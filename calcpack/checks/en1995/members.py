"""Rectangular solid timber and glulam members to BS EN 1995-1-1:2004+A2:2014 with the UK
National Annex: bending (§6.1.6 with k_h §3.2/§3.3, k_sys §6.6, k_m), lateral torsional
stability (§6.3.3, k_crit with σ_m,crit of Eq. (6.32)), shear (§6.1.7 with k_cr = 0.67),
compression parallel to the grain with buckling (§6.1.4, §6.3.2 k_c), combined bending and
compression (§6.2.4 and §6.3.2 Eq. (6.23), (6.24); §6.3.3 Eq. (6.35)), and bearing
perpendicular to the grain at a support (§6.1.5, k_c,90 and the effective contact length).

Design strengths f_d = k_mod k_sys k_h f_k / γ_M (§2.4.1, Eq. (2.14)); k_mod of the shortest
load-duration class in the combination (§3.1.3(2)). Units: MPa, mm, kN, kN·m.
Sign convention: N_c,Ed compression positive; moments and shears as magnitudes.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.base import MemberChecks, Recorder, Standard, run_checks
from calcpack.checks.en1995.values import (
    DURATIONS,
    Duration,
    StrengthClass,
    gamma_M,
    k_mod,
    strength_class,
)
from calcpack.units import Q_, Quantity, require, si
from calcpack.validate import at_least, each_instance, one_of, required, within

__all__ = ["EN1995", "TimberForcesEC", "TimberMemberEC", "check_en1995_member"]

EN1995 = Standard(
    "BS EN 1995-1-1:2004+A2:2014 with the UK National Annex",
    "Eurocode 5: Design of timber structures, Part 1-1",
)
K_CR = 0.67  # EN 1995-1-1 §6.1.7(2), recommended and adopted by the UK NA (from memory)
K_M = 0.7  # EN 1995-1-1 §6.1.6(2), rectangular sections
_ZERO_F = Q_(0.0, "kN")
_ZERO_M = Q_(0.0, "kN*m")
Support = Literal["none", "discrete", "continuous"]


@dataclass(frozen=True)
class TimberMemberEC:
    """A rectangular timber member.

    Args:
        material: strength class (``"C24"``, ``"GL28h"``). b: breadth. h: depth (bending about
            y-y stresses h). service_class: 1, 2 or 3 (§2.3.1.3). load_sharing: a system of at
            least four members at close spacing tied by a continuous load-distribution system
            (k_sys = 1.1, §6.6). L_ef_LT: effective length for lateral torsional stability
            (Table 6.1; None: compression edge held laterally). L_ef_y, L_ef_z: buckling lengths
            as a strut about y-y (in the plane of h) and z-z (None: not a strut).
    """

    material: str
    b: Quantity
    h: Quantity
    service_class: int = 1
    load_sharing: bool = False
    L_ef_LT: Quantity | None = None
    L_ef_y: Quantity | None = None
    L_ef_z: Quantity | None = None

    def __post_init__(self) -> None:
        require(self.b, "[length]", "b", positive=True)
        require(self.h, "[length]", "h", positive=True)
        one_of("service_class", self.service_class, (1, 2, 3))
        for n in ("L_ef_LT", "L_ef_y", "L_ef_z"):
            v = getattr(self, n)
            if v is not None:
                require(v, "[length]", n, positive=True)
        strength_class(self.material)  # refuses an unknown class at construction

    @property
    def grade(self) -> StrengthClass:
        return strength_class(self.material)


@dataclass(frozen=True)
class TimberForcesEC:
    """Design forces for one combination.

    Args:
        combination: its name. duration: the shortest load-duration class of its actions.
        M_Ed: bending about y-y. Mz_Ed: about z-z. V_Ed: shear. N_Ed: axial compression.
        F_c90_Ed: a support reaction for the bearing check, with bearing_length (along the
        member), end_distance (from the bearing to the member end, 0 at a flush end) and
        support (``"discrete"`` or ``"continuous"`` for the k_c,90 of §6.1.5(4), else 1.0).
    """

    combination: str = ""
    duration: Duration = "medium"
    M_Ed: Quantity = _ZERO_M
    Mz_Ed: Quantity = _ZERO_M
    V_Ed: Quantity = _ZERO_F
    N_Ed: Quantity = _ZERO_F
    F_c90_Ed: Quantity = _ZERO_F
    bearing_length: Quantity | None = None
    end_distance: Quantity | None = None
    support: Support = "none"

    def __post_init__(self) -> None:
        one_of("duration", self.duration, DURATIONS)
        one_of("support", self.support, ("none", "discrete", "continuous"))
        for n, d in (
            ("M_Ed", "[force]*[length]"),
            ("Mz_Ed", "[force]*[length]"),
            ("V_Ed", "[force]"),
            ("N_Ed", "[force]"),
            ("F_c90_Ed", "[force]"),
        ):
            require(getattr(self, n), d, n)
        within(
            "N_Ed",
            self.N_Ed,
            lo=Q_(0.0, "kN"),
            rule="N_Ed is axial compression; tension members are not covered here",
        )
        if si(self.F_c90_Ed) > 0:
            required(
                "bearing_length",
                self.bearing_length,
                expected="the bearing length along the member",
                when="with F_c90_Ed",
            )
        if self.bearing_length is not None:
            require(self.bearing_length, "[length]", "bearing_length", positive=True)
        if self.end_distance is not None:
            require(self.end_distance, "[length]", "end_distance", nonnegative=True)


class _Logic:
    def __init__(self, m: TimberMemberEC, items: Sequence[TimberForcesEC]) -> None:
        self.m, self.items, self.g = m, list(items), m.grade

    def __call__(self, c: Recorder) -> None:
        m, g = self.m, self.g
        c.heading("Section and material", 3)
        b = c.given("b", m.b.to("mm"), "breadth", source="drawing")
        h = c.given("h", m.h.to("mm"), "depth", source="drawing")
        gM = c.given(
            "gamma_M",
            gamma_M(g.product),
            f"partial factor, {g.product} timber",
            source="UK NA to BS EN 1995-1-1 Table NA.3",
        )
        A = c.derive("A", b * h, "area", unit="mm**2")
        W = c.derive("W_y", b * h**2 / 6, "section modulus about y-y", unit="mm**3")
        hb = (150.0, 0.2, 1.3) if g.product == "solid" else (600.0, 0.1, 1.1)
        ref_kh = "EN 1995-1-1 Eq. (3.1)" if g.product == "solid" else "EN 1995-1-1 Eq. (3.2)"
        if si(m.h) * 1e3 < hb[0]:
            h0 = c.given("h_0", Q_(hb[0], "mm"), "reference depth", source=ref_kh)
            kh = c.derive("k_h", c.min((h0 / h) ** hb[1], hb[2]), "depth factor", ref=ref_kh)
        else:
            kh = c.given("k_h", 1.0, f"depth factor (h ≥ {hb[0]:g} mm)", source=ref_kh)
        ksys = c.given(
            "k_sys",
            1.1 if m.load_sharing else 1.0,
            "load-sharing system" if m.load_sharing else "single member",
            source="EN 1995-1-1 §6.6",
        )
        for f in self.items:
            c.heading(f"Design forces: {f.combination or 'as given'} ({f.duration}-term)", 3)
            self._one(c, f, b, h, A, W, gM, kh, ksys)

    def _fd(
        self, c: Recorder, name: str, fk: Quantity, what: str, kmod: Any, gM: Any, *extra: Any
    ) -> Any:
        fkh = c.given(name + "_k", fk, f"characteristic {what}", source=self.g.source)
        expr = kmod * fkh / gM
        for e in extra:
            expr = expr * e
        return c.derive(
            name + "_d", expr, f"design {what}", unit="MPa", ref="EN 1995-1-1 Eq. (2.14)"
        )

    def _one(
        self,
        c: Recorder,
        f: TimberForcesEC,
        b: Any,
        h: Any,
        A: Any,
        W: Any,
        gM: Any,
        kh: Any,
        ksys: Any,
    ) -> None:
        m, g = self.m, self.g
        comb = f.combination or None
        km = c.given(
            "k_mod",
            k_mod(g.product, m.service_class, f.duration),
            f"service class {m.service_class}, {f.duration}-term action",
            source="EN 1995-1-1 Table 3.1, §3.1.3(2)",
        )
        sm = None
        if si(f.M_Ed) > 0 or si(f.Mz_Ed) > 0:
            fmd = self._fd(c, "f_m", g.fm_k, "bending strength", km, gM, ksys, kh)
            M = c.given("M_y_Ed", f.M_Ed.to("kN*m"), "bending moment about y-y")
            sm = c.derive(
                "sigma_m_y_d", M / W, "bending stress", unit="MPa", ref="EN 1995-1-1 §6.1.6"
            )
            if si(f.Mz_Ed) > 0:
                Wz = c.derive("W_z", h * b**2 / 6, "section modulus about z-z", unit="mm**3")
                Mz = c.given("M_z_Ed", f.Mz_Ed.to("kN*m"), "bending moment about z-z")
                smz = c.derive("sigma_m_z_d", Mz / Wz, "bending stress", unit="MPa")
                u1 = c.derive(
                    "U_6_11", sm / fmd + K_M * smz / fmd, "k_m = 0.7", ref="EN 1995-1-1 Eq. (6.11)"
                )
                u2 = c.derive(
                    "U_6_12", K_M * sm / fmd + smz / fmd, "k_m = 0.7", ref="EN 1995-1-1 Eq. (6.12)"
                )
                c.check(
                    "Biaxial bending (6.11)",
                    u1,
                    Q_(1.0, ""),
                    ref="EN 1995-1-1 §6.1.6",
                    combination=comb,
                )
                c.check(
                    "Biaxial bending (6.12)",
                    u2,
                    Q_(1.0, ""),
                    ref="EN 1995-1-1 §6.1.6",
                    combination=comb,
                )
            elif si(f.N_Ed) == 0:
                c.check("Bending (6.1.6)", sm, fmd, ref="EN 1995-1-1 Eq. (6.11)", combination=comb)
            kcrit = self._kcrit(c, b, h)
            if kcrit is not None and si(f.N_Ed) == 0:
                cap = c.derive(
                    "f_m_crit_d",
                    kcrit * fmd,
                    "bending strength reduced for lateral torsional stability",
                    unit="MPa",
                    ref="EN 1995-1-1 Eq. (6.33)",
                )
                c.check(
                    "Lateral torsional stability (6.3.3)",
                    sm,
                    cap,
                    ref="EN 1995-1-1 Eq. (6.33)",
                    combination=comb,
                )
        if si(f.V_Ed) > 0:
            fvd = self._fd(c, "f_v", g.fv_k, "shear strength", km, gM)
            V = c.given("V_Ed", f.V_Ed.to("kN"), "shear force")
            kcr = c.given("k_cr", K_CR, "crack factor for shear", source="EN 1995-1-1 §6.1.7(2)")
            tau = c.derive(
                "tau_d",
                1.5 * V / (kcr * b * h),
                "shear stress on b_ef = k_cr b",
                unit="MPa",
                ref="EN 1995-1-1 Eq. (6.13), (6.60)",
            )
            c.check("Shear (6.1.7)", tau, fvd, ref="EN 1995-1-1 Eq. (6.13)", combination=comb)
        if si(f.N_Ed) > 0:
            self._compression(c, f, A, b, h, km, gM, sm, comb)
        if si(f.F_c90_Ed) > 0:
            self._bearing(c, f, b, h, km, gM, comb)

    def _kcrit(self, c: Recorder, b: Any, h: Any) -> Any:
        m, g = self.m, self.g
        if m.L_ef_LT is None:
            c.text("The compression edge is held laterally: k_crit = 1 (EN 1995-1-1 §6.3.3(5)).")
            return None
        lef = c.given(
            "l_ef",
            m.L_ef_LT.to("mm"),
            "effective length for lateral torsional stability",
            source="EN 1995-1-1 Table 6.1 (engineer)",
        )
        E05 = c.given("E_0_05", g.E0_05, "5-percentile modulus", source=g.source)
        scrit = c.derive(
            "sigma_m_crit",
            0.78 * b**2 * E05 / (h * lef),
            "critical bending stress",
            unit="MPa",
            ref="EN 1995-1-1 Eq. (6.32)",
        )
        fmk = c.given("f_m_k_LT", g.fm_k, "characteristic bending strength", source=g.source)
        lam = c.derive(
            "lambda_rel_m",
            c.sqrt(fmk / scrit),
            "relative slenderness for bending",
            ref="EN 1995-1-1 Eq. (6.30)",
        )
        lf = c.f(lam)
        if lf <= 0.75:
            return c.derive("k_crit", Q_(1.0, ""), "λ_rel,m ≤ 0.75", ref="EN 1995-1-1 Eq. (6.34)")
        if lf <= 1.4:
            return c.derive(
                "k_crit", 1.56 - 0.75 * lam, "0.75 < λ_rel,m ≤ 1.4", ref="EN 1995-1-1 Eq. (6.34)"
            )
        return c.derive("k_crit", 1 / lam**2, "λ_rel,m > 1.4", ref="EN 1995-1-1 Eq. (6.34)")

    def _compression(
        self,
        c: Recorder,
        f: TimberForcesEC,
        A: Any,
        b: Any,
        h: Any,
        km: Any,
        gM: Any,
        sm: Any,
        comb: str | None,
    ) -> None:
        m, g = self.m, self.g
        fc = self._fd(c, "f_c_0", g.fc0_k, "compressive strength parallel to grain", km, gM)
        N = c.given("N_Ed", f.N_Ed.to("kN"), "axial compression")
        sc = c.derive("sigma_c_0_d", N / A, "compressive stress", unit="MPa")
        beta = 0.2 if g.product == "solid" else 0.1
        kc: dict[str, Any] = {}
        for ax, L, d in (("y", m.L_ef_y, h), ("z", m.L_ef_z, b)):
            if L is None:
                continue
            Le = c.given(
                f"l_ef_{ax}", L.to("mm"), f"buckling length about {ax}-{ax}", source="engineer"
            )
            lam = c.derive(
                f"lambda_{ax}", Le * c.sqrt(12) / d, "slenderness ℓ_ef/i", ref="EN 1995-1-1 §6.3.2"
            )
            E05 = c.given(f"E_0_05_{ax}", g.E0_05, "5-percentile modulus", source=g.source)
            fck = c.given(f"f_c_0_k_{ax}", g.fc0_k, "characteristic strength", source=g.source)
            lr = c.derive(
                f"lambda_rel_{ax}",
                lam / c.pi * c.sqrt(fck / E05),
                "relative slenderness",
                ref="EN 1995-1-1 Eq. (6.21), (6.22)",
            )
            if c.f(lr) <= 0.3:
                kc[ax] = c.derive(
                    f"k_c_{ax}",
                    Q_(1.0, ""),
                    "λ_rel ≤ 0.3: no buckling reduction",
                    ref="EN 1995-1-1 §6.3.2(2)",
                )
                continue
            k = c.derive(
                f"k_{ax}",
                0.5 * (1 + beta * (lr - 0.3) + lr**2),
                f"β_c = {beta} ({g.product})",
                ref="EN 1995-1-1 Eq. (6.27), (6.28)",
            )
            kc[ax] = c.derive(
                f"k_c_{ax}",
                1 / (k + c.sqrt(k**2 - lr**2)),
                "instability factor",
                ref="EN 1995-1-1 Eq. (6.25), (6.26)",
            )
        fmd = c.values.get("f_m_d")
        if sm is None:
            for ax, kk in kc.items():
                cap = c.derive(
                    f"f_c_{ax}_d",
                    kk * fc,
                    "buckling strength k_c f_c,0,d",
                    unit="MPa",
                    ref="EN 1995-1-1 Eq. (6.23), (6.24)",
                )
                c.check(
                    f"Compression with buckling {ax}-{ax} (6.3.2)",
                    sc,
                    cap,
                    ref="EN 1995-1-1 Eq. (6.23), (6.24)",
                    combination=comb,
                )
            if not kc:
                c.check(
                    "Compression (6.1.4)", sc, fc, ref="EN 1995-1-1 Eq. (6.2)", combination=comb
                )
            return
        assert fmd is not None
        fm = c.given("f_m_d_c", fmd, "design bending strength (above)")
        if kc:
            den = kc["y"] * fc if "y" in kc else fc
            u = c.derive(
                "U_6_23",
                sc / den + sm / fm,
                "compression and bending about y-y",
                ref="EN 1995-1-1 Eq. (6.23)",
            )
            c.check(
                "Compression and bending (6.23)",
                u,
                Q_(1.0, ""),
                ref="EN 1995-1-1 §6.3.2",
                combination=comb,
            )
            if "z" in kc:
                u2 = c.derive(
                    "U_6_24",
                    sc / (kc["z"] * fc) + K_M * sm / fm,
                    "k_m = 0.7",
                    ref="EN 1995-1-1 Eq. (6.24)",
                )
                c.check(
                    "Compression and bending (6.24)",
                    u2,
                    Q_(1.0, ""),
                    ref="EN 1995-1-1 §6.3.2",
                    combination=comb,
                )
        else:
            u = c.derive(
                "U_6_19",
                (sc / fc) ** 2 + sm / fm,
                "compression and bending",
                ref="EN 1995-1-1 Eq. (6.19)",
            )
            c.check(
                "Compression and bending (6.19)",
                u,
                Q_(1.0, ""),
                ref="EN 1995-1-1 §6.2.4",
                combination=comb,
            )
        kcrit = c.values.get("k_crit")
        if kcrit is not None and "z" in kc:
            u3 = c.derive(
                "U_6_35",
                (sm / (c.given("k_crit_c", kcrit, "from above") * fm)) ** 2 + sc / (kc["z"] * fc),
                "bending with LTB and compression",
                ref="EN 1995-1-1 Eq. (6.35)",
            )
            c.check(
                "Lateral torsional stability with compression (6.35)",
                u3,
                Q_(1.0, ""),
                ref="EN 1995-1-1 §6.3.3(6)",
                combination=comb,
            )

    def _bearing(
        self, c: Recorder, f: TimberForcesEC, b: Any, h: Any, km: Any, gM: Any, comb: str | None
    ) -> None:
        g = self.g
        assert f.bearing_length is not None
        c.heading("Bearing at the support", 4)
        fc90 = self._fd(
            c, "f_c_90", g.fc90_k, "compressive strength perpendicular to grain", km, gM
        )
        F = c.given("F_c_90_Ed", f.F_c90_Ed.to("kN"), "support reaction")
        ll = c.given("l_b", f.bearing_length.to("mm"), "bearing length", source="detail")
        a = f.end_distance if f.end_distance is not None else Q_(0.0, "mm")
        ext_end = min(Q_(30.0, "mm"), a.to("mm"), f.bearing_length.to("mm"))
        ext_in = min(Q_(30.0, "mm"), f.bearing_length.to("mm"))
        ext = c.given(
            "Delta_l",
            (ext_end + ext_in).to("mm"),
            "effective contact length added (30 mm each side, limited by a and ℓ)",
            source="EN 1995-1-1 §6.1.5(1)",
        )
        Aef = c.derive(
            "A_ef",
            b * (ll + ext),
            "effective contact area",
            unit="mm**2",
            ref="EN 1995-1-1 §6.1.5(1)",
        )
        kc90 = 1.0
        if f.support != "none":
            solid = g.product == "solid"
            kc90 = {"discrete": 1.5 if solid else 1.75, "continuous": 1.25 if solid else 1.5}[
                f.support
            ]
            if f.support == "discrete" and not solid and si(f.bearing_length) > 0.4:
                kc90 = 1.0
        k90 = c.given(
            "k_c_90",
            kc90,
            f"{f.support} support" if kc90 > 1 else "no enhancement",
            source="EN 1995-1-1 §6.1.5(4)",
        )
        s90 = c.derive(
            "sigma_c_90_d", F / Aef, "bearing stress", unit="MPa", ref="EN 1995-1-1 Eq. (6.4)"
        )
        cap = c.derive(
            "f_c_90_d_ef",
            k90 * fc90,
            "bearing resistance stress",
            unit="MPa",
            ref="EN 1995-1-1 Eq. (6.3)",
        )
        c.check("Bearing (6.1.5)", s90, cap, ref="EN 1995-1-1 Eq. (6.3)", combination=comb)


def check_en1995_member(
    member: TimberMemberEC,
    forces: TimberForcesEC | Sequence[TimberForcesEC],
    *,
    mark: str = "member",
) -> MemberChecks:
    """Check ``member`` under ``forces`` (one or more combinations, each with its duration).

    Raises:
        InputError: inputs (the message names the input), including a service class the
            k_mod table does not cover for the product.
    """
    items = [forces] if isinstance(forces, TimberForcesEC) else list(forces)
    at_least("forces", items, what="TimberForcesEC")
    each_instance("forces", items, TimberForcesEC, expected="TimberForcesEC")
    for f in items:
        k_mod(member.grade.product, member.service_class, f.duration)
    title = (
        f"{member.material} {member.b.to('mm'):~.0f} × {member.h.to('mm'):~.0f} to {EN1995.code}"
    )
    return run_checks(mark, title, EN1995, _Logic(member, items))
