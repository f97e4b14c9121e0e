"""Roof snow loads to EN 1991-1-3:2003 with the UK National Annex (or the recommended values).

Units: loads are kN/m² on the horizontal projection of the roof, downward positive; lengths in m.

Clauses followed (from memory; confirm against the printed standard and annex):

* characteristic ground snow load s_k: the UK National Annex altitude rule (Figure NA.1,
  Eq. NA.1) s_k = 0.15 + (0.1·Z + 0.05) + (A − 100)/525 kN/m², Z the zone number of the map,
  A the site altitude in m (up to 500 m here); or a value given with its source;
* roof snow s = μ_i·C_e·C_t·s_k (Eq. 5.1, persistent and transient situations), C_e of
  Table 5.1 (the UK annex takes 1.0), C_t = 1.0 unless stated (§5.2(8));
* shape coefficients Table 5.2: μ1 = 0.8 (0° ≤ α ≤ 30°), 0.8·(60° − α)/30° (30° < α < 60°),
  0 (α ≥ 60°); μ2 = 0.8 + 0.8·α/30° (0° ≤ α ≤ 30°), 1.6 (30° < α < 60°); μ1 at least 0.8 where
  snow fences or parapets stop the snow sliding off (§5.3.2(2), §5.3.3(2));
* monopitch roofs §5.3.2 (Figure 5.2), duopitch roofs §5.3.3 (Figure 5.3: undrifted case (i),
  drifted cases (ii) and (iii) with half the load on one slope), the multi-span valley §5.3.4;
* drift at roofs abutting taller construction §5.3.6 (Figure 5.7: μ1 = 0.8; μ2 = μs + μw,
  μw = (b1 + b2)/(2h) ≤ γ·h/s_k with 0.8 ≤ μw ≤ 4, μs from half the load on the upper slope for
  α > 15°, l_s = 2h with 5 m ≤ l_s ≤ 15 m, γ = 2 kN/m³) and at projections and obstructions §6.2
  (Figure 6.2: μ2 = γ·h/s_k with 0.8 ≤ μ2 ≤ 2.0, l_s = 2h with 5 m ≤ l_s ≤ 15 m).

Not covered (refused or stated): the exceptional snow drifts of Annex B (the UK annex uses them
for the accidental design situation at steps, parapets and valleys), cylindrical roofs, snow
overhanging the eaves (§6.3) and snow guards (§6.4).
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any, Literal

from calcpack.checks.base import Recorder
from calcpack.errors import InputError
from calcpack.loads.derive import Derivation, LoadStandard, run_derivation
from calcpack.refdata import read_table
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, non_empty, one_of, positive, required, within

__all__ = [
    "EN1991_SNOW",
    "EN1991_SNOW_UK",
    "RoofSnowEN",
    "SnowDriftEN",
    "SnowRoofEN",
    "SnowSiteEN",
    "mu1_en",
    "mu2_en",
    "roof_snow_en",
    "snow_drift_en",
]

EN1991_SNOW = LoadStandard("EN 1991-1-3:2003", "Snow loads")
EN1991_SNOW_UK = LoadStandard(
    "EN 1991-1-3:2003", "Snow loads", "the UK National Annex (NA to BS EN 1991-1-3:2003)"
)

Annex = Literal["UK", "recommended"]
Topography = Literal["windswept", "normal", "sheltered"]
RoofShapeEN = Literal["monopitch", "duopitch"]
ANNEXES: tuple[Annex, ...] = ("UK", "recommended")
TOPOGRAPHIES: tuple[Topography, ...] = ("windswept", "normal", "sheltered")
KN_M2 = "kN/m^2"
GAMMA_SNOW = Q_(2.0, "kN/m^3")  # EN 1991-1-3 §5.3.6(3), weight density of snow for drifts
UK_ALTITUDE_MAX = Q_(500.0, "m")  # UK NA: above this, specialist advice (from memory)
_PRESSURE = "[force] / [length] ** 2"


def _standard(annex: Annex) -> LoadStandard:
    return EN1991_SNOW_UK if annex == "UK" else EN1991_SNOW


def mu1_en(alpha: Quantity, *, sliding_prevented: bool = False) -> float:
    """μ1 of EN 1991-1-3 Table 5.2 for a roof pitch α (at least 0.8 where sliding is
    prevented by snow fences, parapets or other obstructions, §5.3.2(2))."""
    a = float(
        within(
            "alpha", dimension("alpha", alpha, "[]").to("deg"), Q_(0, "deg"), Q_(90, "deg")
        ).magnitude
    )
    mu = 0.8 if a <= 30 else (0.8 * (60 - a) / 30 if a < 60 else 0.0)
    return max(mu, 0.8) if sliding_prevented else mu


def mu2_en(alpha: Quantity) -> float:
    """μ2 of EN 1991-1-3 Table 5.2 (multi-span valley) for the mean pitch ᾱ, 0° ≤ ᾱ < 60°."""
    a = float(
        within(
            "alpha",
            dimension("alpha", alpha, "[]").to("deg"),
            Q_(0, "deg"),
            Q_(60, "deg"),
            inclusive=True,
            rule="EN 1991-1-3 Table 5.2 gives μ2 for 0° ≤ α < 60° only",
        ).magnitude
    )
    if a >= 60:
        raise InputError(
            f"Input alpha must be less than 60° for μ2 (got alpha = {a:g}°); "
            "EN 1991-1-3 Table 5.2 gives no μ2 at 60° or steeper",
            name="alpha",
            value=alpha,
            expected="0° ≤ alpha < 60°",
        )
    return 0.8 + 0.8 * a / 30 if a <= 30 else 1.6


@dataclass(frozen=True)
class SnowSiteEN:
    """The site's snow data.

    Attributes:
        annex: ``"UK"`` (the UK National Annex: s_k from the zone map and the altitude, C_e = 1.0)
            or ``"recommended"`` (the values recommended in EN 1991-1-3; s_k given).
        altitude: site altitude above sea level A [length] (UK annex rule).
        zone: zone number Z of the UK annex map (Figure NA.1), 1 to 5 (half zones allowed).
        sk: the characteristic ground snow load [force/area], when not found from the UK rule
            (required with ``annex="recommended"``), with ``sk_source`` naming its source.
        topography: ``"windswept"``, ``"normal"`` or ``"sheltered"`` (Table 5.1).
        Ct: thermal coefficient (1.0 unless a study of heat loss through the roof sets it).
    """

    annex: Annex = "UK"
    altitude: Quantity | None = None
    zone: float | None = None
    sk: Quantity | None = None
    sk_source: str = ""
    topography: Topography = "normal"
    Ct: float = 1.0

    def __post_init__(self) -> None:
        one_of("annex", self.annex, ANNEXES)
        one_of("topography", self.topography, TOPOGRAPHIES)
        within("Ct", self.Ct, 0.0, 1.0, rule="EN 1991-1-3 §5.2(8): C_t is 1.0 or a reduction")
        if self.sk is not None:
            dimension("sk", self.sk, _PRESSURE)
            positive("sk", self.sk, allow_zero=True)
            non_empty(
                "sk_source",
                self.sk_source,
                expected="where the ground snow load comes from, e.g. 'national annex map' or a "
                "site study",
            )
            return
        if self.annex != "UK":
            required(
                "sk",
                self.sk,
                expected="a characteristic ground snow load in kN/m² with sk_source",
                when="with annex = 'recommended' (EN 1991-1-3 leaves it to the national annex)",
            )
        wanted = "zone 1 to 5 from Figure NA.1 and the site altitude in m"
        required("zone", self.zone, expected=wanted, when="for the UK annex rule")
        altitude = required(
            "altitude", self.altitude, expected=wanted, when="for the UK annex rule"
        )
        within("zone", self.zone, 1.0, 5.0, rule="UK NA Figure NA.1 zones 1 to 5 (from memory)")
        dimension("altitude", self.altitude, "[length]")
        within(
            "altitude",
            altitude.to("m"),
            Q_(0.0, "m"),
            UK_ALTITUDE_MAX,
            rule="the UK annex rule to 500 m; above it, specialist advice (from memory)",
        )


@dataclass(frozen=True)
class SnowRoofEN:
    """The roof: shape and pitch.

    Attributes:
        shape: ``"monopitch"`` or ``"duopitch"``.
        alpha1: pitch of the (first) slope [angle], 0° to 90°.
        alpha2: pitch of the second slope of a duopitch roof (default: alpha1).
        sliding_prevented: snow fences, parapets or other obstructions at the low eave stop the
            snow sliding off: μ1 is at least 0.8 (§5.3.2(2), §5.3.3(2)).
    """

    shape: RoofShapeEN
    alpha1: Quantity
    alpha2: Quantity | None = None
    sliding_prevented: bool = False

    def __post_init__(self) -> None:
        one_of("shape", self.shape, ("monopitch", "duopitch"))
        for name in ("alpha1", "alpha2"):
            v = getattr(self, name)
            if v is not None:
                dimension(name, v, "[]")
                within(name, v.to("deg"), Q_(0.0, "deg"), Q_(90.0, "deg"))
        if self.shape == "monopitch" and self.alpha2 is not None:
            raise InputError(
                f"Input alpha2 is for duopitch roofs only (got alpha2 = {self.alpha2:~P} on a "
                "monopitch roof)",
                name="alpha2",
                value=self.alpha2,
                expected="None for a monopitch roof",
            )


@dataclass(frozen=True)
class RoofSnowEN:
    """Roof snow loads, kN/m² on plan, downward +.

    Attributes:
        sk: characteristic ground snow load. Ce, Ct: coefficients.
        mu1: μ1 of each slope (one for a monopitch roof, two for a duopitch roof).
        cases: load arrangement name -> the load on each slope (Figure 5.2 or 5.3).
        derivation: values and working.
    """

    sk: Quantity
    Ce: float
    Ct: float
    mu1: tuple[float, ...]
    cases: dict[str, tuple[Quantity, ...]]
    derivation: Derivation

    @property
    def balanced(self) -> Quantity:
        """The largest undrifted load on any slope."""
        return max(self.cases["(i)"])

    def working(self, *, settings: Any = None) -> list[Any]:
        return self.derivation.working(settings=settings)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return self.derivation._repr_mimebundle_(include, exclude)


def record_ground_snow(r: Recorder, site: SnowSiteEN) -> Any:
    """Record s_k (given, or the UK annex altitude rule) and return it."""
    if site.sk is not None:
        return r.given(
            "s_k", site.sk.to(KN_M2), "characteristic ground snow load", source=site.sk_source
        )
    assert site.zone is not None
    assert site.altitude is not None
    Z = r.given("Z", float(site.zone), "zone number of the snow map", source="UK NA Figure NA.1")
    A = r.given("A", site.altitude.to("m"), "site altitude above sea level")
    return r.derive(
        "s_k",
        (0.15 + (0.1 * Z + 0.05) + (A - Q_(100.0, "m")) / Q_(525.0, "m")) * Q_(1.0, KN_M2),
        "characteristic ground snow load",
        unit=KN_M2,
        ref="UK NA to BS EN 1991-1-3, Eq. NA.1 (from memory)",
    )


def _record_ce_ct(r: Recorder, site: SnowSiteEN) -> tuple[Any, Any]:
    row = read_table("en1991_1_3_snow_ce.csv", key="topography").row(site.topography)
    col = "UK NA" if site.annex == "UK" else "recommended"
    src = "UK NA to BS EN 1991-1-3 (from memory)" if site.annex == "UK" else "EN 1991-1-3 Table 5.1"
    Ce = r.given(
        "C_e", float(row[col]), f"exposure coefficient, {site.topography} topography", source=src
    )
    Ct = r.given("C_t", site.Ct, "thermal coefficient", source="EN 1991-1-3 §5.2(8)")
    return Ce, Ct


def _record_mu1(r: Recorder, name: str, alpha: Quantity, prevented: bool) -> Any:
    a = float(alpha.to("deg").magnitude)
    r.given(f"alpha_{name}", alpha.to("deg"), "roof pitch")
    how = (
        "0° ≤ α ≤ 30°" if a <= 30 else ("30° < α < 60°: 0.8(60° − α)/30°" if a < 60 else "α ≥ 60°")
    )
    note = ", at least 0.8 (sliding prevented, §5.3.2(2))" if prevented and a > 30 else ""
    return r.given(
        f"mu_1_{name}",
        mu1_en(alpha, sliding_prevented=prevented),
        f"shape coefficient ({how}{note})",
        source="EN 1991-1-3 Table 5.2",
    )


def roof_snow_en(site: SnowSiteEN, roof: SnowRoofEN) -> RoofSnowEN:
    """Snow on a monopitch or duopitch roof (EN 1991-1-3 §5.2, §5.3.2, §5.3.3), in kN/m² on plan.

    A monopitch roof has the one case μ1·C_e·C_t·s_k. A duopitch roof has case (i) undrifted,
    and the drifted cases (ii), (iii) with half the load on one slope (Figure 5.3).
    """
    out: dict[str, Any] = {}

    def logic(r: Recorder) -> None:
        r.heading("Characteristic ground snow load", 3)
        sk = record_ground_snow(r, site)
        Ce, Ct = _record_ce_ct(r, site)
        r.heading("Snow load on the roof", 3)
        alphas = (
            [roof.alpha1]
            if roof.shape == "monopitch"
            else [roof.alpha1, roof.alpha2 or roof.alpha1]
        )
        tags = ["1"] if roof.shape == "monopitch" else ["1", "2"]
        loads = []
        mus = []
        for tag, alpha in zip(tags, alphas, strict=True):
            mu = _record_mu1(r, tag, alpha, roof.sliding_prevented)
            mus.append(r.f(mu))
            s = r.derive(
                f"s_{tag}",
                mu * Ce * Ct * sk,
                f"snow load on slope {tag}",
                unit=KN_M2,
                ref="EN 1991-1-3 Eq. 5.1",
            )
            loads.append(r.q(s))
        cases: dict[str, tuple[Quantity, ...]] = {"(i)": tuple(loads)}
        if roof.shape == "duopitch":
            r.text(
                "Drifted cases (ii) and (iii): half the load on one slope, the full load on the "
                "other (EN 1991-1-3 Figure 5.3)."
            )
            cases["(ii)"] = (0.5 * loads[0], loads[1])
            cases["(iii)"] = (loads[0], 0.5 * loads[1])
        out.update(sk=r.q(sk), Ce=r.f(Ce), Ct=r.f(Ct), mu=tuple(mus), cases=cases)

    d = run_derivation(f"Roof snow load ({roof.shape} roof)", _standard(site.annex), logic)
    return RoofSnowEN(out["sk"], out["Ce"], out["Ct"], out["mu"], out["cases"], d)


DriftKindEN = Literal["roof step", "obstruction"]


@dataclass(frozen=True)
class SnowDriftEN:
    """Drift against a taller roof (§5.3.6) or a projection or obstruction (§6.2).

    Attributes:
        kind: ``"roof step"`` or ``"obstruction"`` (a parapet, plant, a wall on the roof).
        h: height of the step or obstruction above the lower roof [length].
        b1: plan width of the upper roof, perpendicular to the step (roof step only) [length].
        b2: plan width of the lower roof, perpendicular to the step (roof step only) [length].
        alpha_upper: pitch of the upper roof slope that drains onto the lower roof (roof step;
            above 15° the sliding snow μs is added).
        lower_width: length of the lower roof from the step or obstruction in the direction of
            the drift (the drift is cut off there); None when the roof runs on past it.
    """

    kind: DriftKindEN
    h: Quantity
    b1: Quantity | None = None
    b2: Quantity | None = None
    alpha_upper: Quantity = field(default_factory=lambda: Q_(0.0, "deg"))
    lower_width: Quantity | None = None

    def __post_init__(self) -> None:
        one_of("kind", self.kind, ("roof step", "obstruction"))
        dimension("h", self.h, "[length]")
        positive("h", self.h)
        if self.kind == "roof step":
            for name in ("b1", "b2"):
                v = required(
                    name,
                    getattr(self, name),
                    expected="the plan width of the roof in m (EN 1991-1-3 Figure 5.7)",
                    when="for a roof step",
                )
                dimension(name, v, "[length]")
                positive(name, v)
        dimension("alpha_upper", self.alpha_upper, "[]")
        within("alpha_upper", self.alpha_upper.to("deg"), Q_(0.0, "deg"), Q_(90.0, "deg"))
        if self.lower_width is not None:
            dimension("lower_width", self.lower_width, "[length]")
            positive("lower_width", self.lower_width)


@dataclass(frozen=True)
class DriftEN:
    """A drift: μ1 away from it, μ2 at the step or obstruction, tapering over l_s.

    Attributes:
        mu1, mu2: shape coefficients. ls: drift length. s_undrifted = μ1·C_e·C_t·s_k;
        s_peak = μ2·C_e·C_t·s_k at the step; s_edge: the load at the far edge of a lower roof
        shorter than l_s (else s_undrifted). lower_width: as input. derivation: the working.
    """

    kind: str
    mu1: float
    mu2: float
    ls: Quantity
    s_undrifted: Quantity
    s_peak: Quantity
    s_edge: Quantity
    lower_width: Quantity | None
    derivation: Derivation

    def load_at(self, x: Quantity) -> Quantity:
        """The snow load at distance x from the step or obstruction (kN/m²)."""
        dimension("x", x, "[length]")
        if self.lower_width is not None and x > self.lower_width:
            return Q_(0.0, KN_M2)
        t = min(max(float((x / self.ls).to("").magnitude), 0.0), 1.0)
        return self.s_peak + t * (self.s_undrifted - self.s_peak)

    def working(self, *, settings: Any = None) -> list[Any]:
        return self.derivation.working(settings=settings)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return self.derivation._repr_mimebundle_(include, exclude)


def snow_drift_en(site: SnowSiteEN, inputs: SnowDriftEN) -> DriftEN:
    """Drift at a roof step (§5.3.6) or an obstruction (§6.2), persistent/transient situation.

    The lower roof is taken as flat (pitch at most 15°); the UK annex's exceptional drift
    (Annex B, accidental situation) is stated as not covered.
    """
    step = inputs.kind == "roof step"
    ref = "EN 1991-1-3 §5.3.6" if step else "EN 1991-1-3 §6.2"
    out: dict[str, Any] = {}

    def logic(r: Recorder) -> None:
        sk = record_ground_snow(r, site)
        Ce, Ct = _record_ce_ct(r, site)
        r.heading(f"Drift at a {inputs.kind}", 3)
        if site.annex == "UK":
            r.caution(
                "The UK annex also asks for the exceptional drift of Annex B at this location "
                "in the accidental design situation (from memory); that case is not derived here."
            )
        h = r.given("h", inputs.h.to("m"), f"height of the {inputs.kind}")
        gam = r.given("gamma", GAMMA_SNOW, "weight density of snow", source="EN 1991-1-3 §5.3.6(3)")
        mu1 = r.given(
            "mu_1", 0.8, "shape coefficient away from the drift (lower roof flat)", source=ref
        )
        cap = r.derive("mu_gamma", gam * h / sk, "γ·h/s_k", unit="", ref=ref)

        def drift_length(eq: str) -> Any:
            return r.derive(
                "l_s",
                r.min(r.max(2 * h, Q_(5.0, "m")), Q_(15.0, "m")),
                "drift length 2h, 5 m ≤ l_s ≤ 15 m",
                unit="m",
                ref=f"EN 1991-1-3 Eq. {eq}",
            )

        if step:
            assert inputs.b1 is not None
            assert inputs.b2 is not None
            b1 = r.given("b_1", inputs.b1.to("m"), "plan width of the upper roof")
            b2 = r.given("b_2", inputs.b2.to("m"), "plan width of the lower roof")
            ls = drift_length("5.9")
            muw = r.derive(
                "mu_w",
                r.min(r.max(r.min((b1 + b2) / (2 * h), cap), 0.8), 4.0),
                "drift from wind: (b1 + b2)/2h ≤ γh/s_k, 0.8 ≤ μ_w ≤ 4",
                unit="",
                ref="EN 1991-1-3 Eq. 5.8",
            )
            au = float(inputs.alpha_upper.to("deg").magnitude)
            if au <= 15:
                mus = r.given("mu_s", 0.0, "sliding from the upper roof (α ≤ 15°)", source=ref)
            else:
                mu_up = _record_mu1(r, "upper", inputs.alpha_upper, False)
                mus = r.derive(
                    "mu_s",
                    mu_up * b1 / ls,
                    "sliding: half the upper slope's load μ1·s·b1 as a triangle over l_s",
                    unit="",
                    ref=ref + "(2)",
                )
            mu2 = r.derive(
                "mu_2",
                mus + muw,
                "shape coefficient at the step",
                unit="",
                ref="EN 1991-1-3 Eq. 5.7",
            )
        else:
            ls = drift_length("6.1")
            mu2 = r.derive(
                "mu_2",
                r.min(r.max(cap, 0.8), 2.0),
                "shape coefficient at the obstruction: γh/s_k, 0.8 ≤ μ2 ≤ 2.0",
                unit="",
                ref="EN 1991-1-3 Eq. 6.1",
            )
        s1 = r.derive(
            "s_1", mu1 * Ce * Ct * sk, "undrifted load", unit=KN_M2, ref="EN 1991-1-3 Eq. 5.1"
        )
        s2 = r.derive(
            "s_2",
            mu2 * Ce * Ct * sk,
            "peak load at the " + inputs.kind,
            unit=KN_M2,
            ref="EN 1991-1-3 Eq. 5.1",
        )
        edge = r.q(s1)
        if inputs.lower_width is not None and inputs.lower_width < r.q(ls):
            lw = r.given("l_lower", inputs.lower_width.to("m"), "length of the lower roof")
            r.text("The drift is longer than the lower roof: it is cut off at the roof edge.")
            edge = r.q(
                r.derive("s_edge", s2 + (s1 - s2) * lw / ls, "load at the far edge", unit=KN_M2)
            )
        r.text("The load falls linearly from s_2 at the " + inputs.kind + " to s_1 at l_s.")
        out.update(mu1=r.f(mu1), mu2=r.f(mu2), ls=r.q(ls), s1=r.q(s1), s2=r.q(s2), edge=edge)

    d = run_derivation(f"Snow drift at a {inputs.kind}", _standard(site.annex), logic)
    return DriftEN(
        inputs.kind,
        out["mu1"],
        out["mu2"],
        out["ls"],
        out["s1"],
        out["s2"],
        out["edge"],
        inputs.lower_width,
        d,
    )
