"""Gust-effect factor, ASCE/SEI 7-16 §26.11: rigid buildings (§26.11.4, Eq. 26.11-6) and
flexible buildings (§26.11.5, Eq. 26.11-10), as working.

    z̄ = max(0.6 h, z_min)                  I_z̄ = c (33 ft / z̄)^(1/6)        (Eq. 26.11-7)
    L_z̄ = ℓ (z̄ / 33 ft)^ε̄  (Eq. 26.11-9)    Q = √(1 / (1 + 0.63 ((B + h)/L_z̄)^0.63))  (26.11-8)
    G = 0.925 (1 + 1.7 g_Q I_z̄ Q) / (1 + 1.7 g_v I_z̄),   g_Q = g_v = 3.4       (Eq. 26.11-6)

Flexible (natural frequency n_1 < 1 Hz):

    V̄_z̄ = b̄ (z̄ / 33 ft)^ᾱ V (Eq. 26.11-16)     N_1 = n_1 L_z̄ / V̄_z̄ (Eq. 26.11-14)
    R_n = 7.47 N_1 / (1 + 10.3 N_1)^(5/3)                               (Eq. 26.11-13)
    R_ℓ = 1/η − (1 − e^(−2η)) / (2η²), with η = 4.6 n_1 h / V̄_z̄ (R_h), 4.6 n_1 B / V̄_z̄ (R_B),
          15.4 n_1 L / V̄_z̄ (R_L)                                      (Eq. 26.11-15)
    R = √((1/β) R_n R_h R_B (0.53 + 0.47 R_L))                         (Eq. 26.11-12)
    g_R = √(2 ln(3600 n_1)) + 0.577 / √(2 ln(3600 n_1))                 (Eq. 26.11-11)
    G_f = 0.925 (1 + 1.7 I_z̄ √(g_Q² Q² + g_R² R²)) / (1 + 1.7 g_v I_z̄)  (Eq. 26.11-10)

B is the horizontal dimension normal to the wind, L the one parallel to it, β the damping
ratio (a fraction of critical), n_1 the fundamental natural frequency (§26.11.3) given with its
source. The terrain constants come from Table 26.11-1 (``asce7_16_wind_exposure.csv``).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.base import Recorder
from calcpack.errors import OutOfScopeError
from calcpack.loads.derive import Derivation, is_us_customary, run_derivation
from calcpack.loads.wind_asce7 import ASCE7_WIND, WindSiteASCE7
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, non_empty, one_of, positive, within

__all__ = [
    "BuildingVibration",
    "GustEffectASCE7",
    "approximate_vibration_asce7",
    "gust_effect_factor_asce7",
    "record_gust_effect",
]

G_PEAK = 3.4  # g_Q = g_v, ASCE 7-16 §26.11.4 (from memory)
_TABLE = "ASCE 7-16 Table 26.11-1"


@dataclass(frozen=True)
class BuildingVibration:
    """The building's dynamic properties for the gust-effect factor (§26.11.3, §26.11.5).

    Attributes:
        n1: fundamental natural frequency [frequency] (below 1 Hz: flexible).
        n1_source: where n1 comes from (analysis, or an approximate formula of §26.11.3).
        damping: damping ratio β as a fraction of critical (needed when n1 < 1 Hz).
    """

    n1: Quantity
    n1_source: str
    damping: float | None = None

    def __post_init__(self) -> None:
        dimension("n1", self.n1, "[frequency]")
        # g_R needs ln(3600 n1) > 0; below 0.01 Hz no building is in scope
        within("n1", self.n1.to("Hz"), lo=Q_(0.01, "Hz"), hi=Q_(100.0, "Hz"),
               rule="a building's fundamental natural frequency")  # fmt: skip
        non_empty(
            "n1_source",
            self.n1_source,
            expected="the analysis or approximate formula of ASCE 7-16 §26.11.3 that gave n1",
        )
        if self.damping is not None:
            within(
                "damping",
                float(self.damping),
                0.0,
                0.2,
                inclusive=False,
                rule="damping ratio β, a fraction of critical (typically 0.01 to 0.05)",
            )

    @property
    def flexible(self) -> bool:
        return float(self.n1.to("Hz").magnitude) < 1.0


@dataclass(frozen=True)
class GustEffectASCE7:
    """The gust-effect factor and its terms.

    Attributes:
        G: the factor used: G_f (flexible) or G of Eq. 26.11-6 (rigid). G_rigid: Eq. 26.11-6.
        flexible: n1 < 1 Hz. z_bar, I_z, L_z, Q: the terms of §26.11.4. R: resonant response
            factor (flexible only, else 0).
    """

    G: float
    G_rigid: float
    flexible: bool
    z_bar: Quantity
    I_z: float
    L_z: Quantity
    Q: float
    R: float
    derivation: Derivation

    def working(self, *, settings: Any = None) -> list[Any]:
        return self.derivation.working(settings=settings)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return self.derivation._repr_mimebundle_(include, exclude)


def _r_l(eta: float) -> float:
    if eta <= 0.0:
        return 1.0
    return 1.0 / eta - (1.0 - math.exp(-2.0 * eta)) / (2.0 * eta * eta)


def record_gust_effect(
    r: Recorder,
    site: WindSiteASCE7,
    *,
    h: Quantity,
    B: Quantity,
    L: Quantity,
    vibration: BuildingVibration | None,
) -> Any:
    """Record the gust-effect factor: Eq. 26.11-6 (rigid) or Eq. 26.11-10 (n1 < 1 Hz)."""
    lu = "ft" if is_us_customary(site.V) else "m"
    row = read_table("asce7_16_wind_exposure.csv", key="exposure").row(site.exposure)
    exp = f"exposure {site.exposure}"
    hh = r.given("h", h.to(lu), "mean roof height")
    zmin = r.given("z_min", Q_(float(row["zmin_ft"]), "ft").to(lu), exp, source=_TABLE)
    zbar = r.derive("z_bar", r.max(0.6 * hh, zmin), "equivalent height of the structure",
                    unit=lu, ref="ASCE 7-16 §26.11.4")  # fmt: skip
    c = r.given("c", float(row["c"]), exp, source=_TABLE)
    ft33 = r.given("z_ref", Q_(33.0, "ft").to(lu), "reference height of the turbulence formulas",
                   source="ASCE 7-16 Eqs. 26.11-7, 26.11-9")  # fmt: skip
    Iz = r.derive("I_z", c * (ft33 / zbar) ** (1 / 6), "intensity of turbulence at z̄",
                  unit="", ref="ASCE 7-16 Eq. 26.11-7")  # fmt: skip
    ell = r.given("ell", Q_(float(row["ell_ft"]), "ft").to(lu), exp, source=_TABLE)
    eps = r.given("epsilon_bar", 1.0 / float(row["eps_bar_inv"]), exp, source=_TABLE)
    Lz = r.derive("L_z", ell * (zbar / ft33) ** eps, "integral length scale of turbulence",
                  unit=lu, ref="ASCE 7-16 Eq. 26.11-9")  # fmt: skip
    BB = r.given("B", B.to(lu), "horizontal dimension normal to the wind")
    Q = r.derive("Q", r.sqrt(1 / (1 + 0.63 * ((BB + hh) / Lz) ** 0.63)),
                 "background response factor", unit="", ref="ASCE 7-16 Eq. 26.11-8")  # fmt: skip
    g = r.given("g_Q", G_PEAK, "peak factor for background response (= g_v)",
                source="ASCE 7-16 §26.11.4")  # fmt: skip
    G = r.derive(
        "G",
        0.925 * (1 + 1.7 * g * Iz * Q) / (1 + 1.7 * g * Iz),
        "gust-effect factor, rigid building",
        unit="",
        ref="ASCE 7-16 Eq. 26.11-6",
    )
    if vibration is None or not vibration.flexible:
        return G
    if vibration.damping is None:
        from calcpack.errors import InputError

        raise InputError(
            name="damping",
            value=None,
            rule=f"is needed for a flexible building (n1 = {vibration.n1:~P} < 1 Hz, §26.11.5)",
            expected="damping ratio β, e.g. 0.01 for steel, 0.02 for concrete frames",
        )
    n1 = r.given("n_1", vibration.n1.to("Hz"), "fundamental natural frequency",
                 source=vibration.n1_source)  # fmt: skip
    beta = r.given("beta", float(vibration.damping), "damping ratio (fraction of critical)")
    b_bar = r.given("b_bar", float(row["b_bar"]), exp, source=_TABLE)
    a_bar = r.given("alpha_bar", 1.0 / float(row["alpha_bar_inv"]), exp, source=_TABLE)
    V = r.given("V", site.V.to("mph" if lu == "ft" else "m/s"), "basic wind speed",
                source=site.V_source)  # fmt: skip
    Vz = r.derive("V_z", b_bar * (zbar / ft33) ** a_bar * V, "mean hourly wind speed at z̄",
                  unit="ft/s" if lu == "ft" else "m/s", ref="ASCE 7-16 Eq. 26.11-16")  # fmt: skip
    N1 = r.derive("N_1", n1 * Lz / Vz, "reduced frequency", unit="",
                  ref="ASCE 7-16 Eq. 26.11-14")  # fmt: skip
    Rn = r.derive("R_n", 7.47 * N1 / (1 + 10.3 * N1) ** (5 / 3), "", unit="",
                  ref="ASCE 7-16 Eq. 26.11-13")  # fmt: skip
    vz = r.q(Vz)
    f1 = r.q(n1)
    Rs = []
    for name, coef, dim, what in (
        ("R_h", 4.6, h, "height"),
        ("R_B", 4.6, B, "width normal to the wind"),
        ("R_L", 15.4, L, "depth along the wind"),
    ):
        eta = float((coef * f1 * dim / vz).to("").magnitude)
        Rs.append(
            r.given(
                name,
                _r_l(eta),
                f"1/η − (1 − e^(−2η))/(2η²), η = {coef:g} n_1 ({what}) / V̄_z̄ = {eta:.4g}",
                source="ASCE 7-16 Eq. 26.11-15",
            )
        )
    Rh, RB, RL = Rs
    R = r.derive("R", r.sqrt(1 / beta * Rn * Rh * RB * (0.53 + 0.47 * RL)),
                 "resonant response factor", unit="", ref="ASCE 7-16 Eq. 26.11-12")  # fmt: skip
    x = 2.0 * math.log(3600.0 * float(vibration.n1.to("Hz").magnitude))
    gR = r.given("g_R", math.sqrt(x) + 0.577 / math.sqrt(x),
                 "√(2 ln(3600 n_1)) + 0.577/√(2 ln(3600 n_1)), peak factor for resonant response",
                 source="ASCE 7-16 Eq. 26.11-11")  # fmt: skip
    return r.derive(
        "G_f",
        0.925 * (1 + 1.7 * Iz * r.sqrt(g**2 * Q**2 + gR**2 * R**2)) / (1 + 1.7 * g * Iz),
        "gust-effect factor, flexible building",
        unit="",
        ref="ASCE 7-16 Eq. 26.11-10",
    )


def gust_effect_factor_asce7(
    site: WindSiteASCE7,
    *,
    h: Quantity,
    B: Quantity,
    L: Quantity,
    vibration: BuildingVibration | None = None,
) -> GustEffectASCE7:
    """The gust-effect factor of a building (ASCE 7-16 §26.11), with its working.

    Args:
        site: the wind site (V, exposure). h: mean roof height [length]. B: horizontal dimension
            normal to the wind [length]. L: horizontal dimension parallel to the wind [length].
        vibration: n1 and β; None or n1 >= 1 Hz gives the rigid building's G (Eq. 26.11-6,
            which §26.11.1 permits to be replaced by 0.85).

    Raises:
        InputError: a dimension missing or not a length; β missing when n1 < 1 Hz.
    """
    for name, v in (("h", h), ("B", B), ("L", L)):
        positive(name, dimension(name, v, "[length]"))
    out: dict[str, Any] = {}

    def logic(r: Recorder) -> None:
        G = record_gust_effect(r, site, h=h, B=B, L=L, vibration=vibration)
        out.update(G=r.f(G))

    d = run_derivation("Gust-effect factor", ASCE7_WIND, logic)
    v = d.values
    return GustEffectASCE7(
        G=out["G"],
        G_rigid=float(v["G"].to("").magnitude),
        flexible="G_f" in v,
        z_bar=v["z_bar"],
        I_z=float(v["I_z"].to("").magnitude),
        L_z=v["L_z"],
        Q=float(v["Q"].to("").magnitude),
        R=float(v["R"].to("").magnitude) if "R" in v else 0.0,
        derivation=d,
    )


LateralSystem = Literal[
    "steel moment frame", "concrete moment frame", "other steel or concrete", "shear wall"
]
# §26.11.3 approximate lower-bound natural frequencies, h in ft (from memory): coefficient,
# exponent and equation
_NA = {
    "steel moment frame": (22.2, 0.8, "Eq. 26.11-2"),
    "concrete moment frame": (43.5, 0.9, "Eq. 26.11-3"),
    "other steel or concrete": (75.0, 1.0, "Eq. 26.11-4"),
}


def approximate_vibration_asce7(
    h: Quantity, system: LateralSystem, *, damping: float | None = None
) -> BuildingVibration:
    """The approximate natural frequency n_a of §26.11.3 as a :class:`BuildingVibration`.

    n_a = 22.2/h^0.8 (steel moment frames), 43.5/h^0.9 (concrete moment frames), 75/h (other
    steel or concrete systems), h the mean roof height in ft, n_a in Hz.

    Raises:
        OutOfScopeError: h over 300 ft (the limit of §26.11.2.1), or a shear wall building
            (Eq. 26.11-5 needs C_w, not implemented).
    """
    dimension("h", h, "[length]")
    positive("h", h)
    one_of(
        "system",
        system,
        ("steel moment frame", "concrete moment frame", "other steel or concrete", "shear wall"),
    )
    h_ft = float(h.to("ft").magnitude)
    if h_ft > 300.0:
        raise OutOfScopeError(
            f"Input h = {h:~P}: the approximate natural frequencies of ASCE 7-16 §26.11.3 hold "
            "for buildings up to 300 ft (§26.11.2.1); give n1 from an analysis"
        )
    if system == "shear wall":
        raise OutOfScopeError(
            "Input system = 'shear wall': Eq. 26.11-5 needs the shear walls' C_w, not "
            "implemented here; give n1 from an analysis"
        )
    coef, exp, eq = _NA[system]
    n_a = coef / h_ft**exp
    source = (
        f"ASCE 7-16 {eq}, {system}: n_a = {coef:g}/h^{exp:g} with h = {h_ft:.4g} ft "
        "(valid where the building height is also under 4 L_eff, §26.11.2.1: confirm)"
    )
    return BuildingVibration(Q_(n_a, "Hz"), source, damping)
