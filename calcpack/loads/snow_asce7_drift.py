"""Snow drifts and sliding snow to ASCE/SEI 7-16 Chapter 7: roof steps (§7.7), parapets and
rooftop projections (§7.8), sliding snow onto a lower roof (§7.9).

Units: pressures on plan (psf or kN/m² following the ground snow load), downward positive;
heights and widths in ft or m. The drift surcharge is a triangle of peak p_d = h_d γ at the
step, parapet or projection, falling to zero at the drift width w from it; it is added to the
balanced load p_s of the lower roof.

Provisions must be confirmed against the edition adopted locally; the derivation must be
reviewed and sealed under licensed practice.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any, Literal

from calcpack.checks.base import Recorder
from calcpack.loads.derive import Derivation, is_us_customary, run_derivation
from calcpack.loads.snow_asce7 import (
    ASCE7_SNOW,
    record_density,
    record_drift_height,
)
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, one_of, positive, required

__all__ = ["SlidingSnowASCE7", "SnowDriftASCE7", "drift_asce7", "sliding_snow_asce7"]

DriftKind = Literal["roof step", "parapet", "rooftop projection"]
_PRESSURE = "[force] / [length] ** 2"


def _length(name: str, value: Any, *, allow_zero: bool = False) -> None:
    dimension(name, value, "[length]")
    positive(name, value, allow_zero=allow_zero)


@dataclass(frozen=True)
class SnowDriftASCE7:
    """A drift against a roof step, parapet or rooftop projection.

    Attributes:
        kind: ``"roof step"`` (leeward and windward drifts, §7.7.1), ``"parapet"`` or
            ``"rooftop projection"`` (windward drift only, §7.8).
        h: height of the step, parapet or projection above the lower roof surface [length].
        lu_upper: length of the upper roof upwind of the step (leeward drift; roof step only).
        lu_lower: length of the lower roof upwind of the step, parapet or projection.
        pg: ground snow load. ps: balanced snow load on the lower roof (from
            :func:`~calcpack.loads.snow_asce7.roof_snow_asce7`).
        lower_width: length of the lower roof from the step in the direction of the drift (the
            drift is cut off there, §7.7.1); None when the roof runs on past the drift.
        projection_length: the plan dimension of a rooftop projection (drift not required
            below 15 ft, §7.8).
    """

    kind: DriftKind
    h: Quantity
    lu_lower: Quantity
    pg: Quantity
    ps: Quantity
    lu_upper: Quantity | None = None
    lower_width: Quantity | None = None
    projection_length: Quantity | None = None

    def __post_init__(self) -> None:
        one_of("kind", self.kind, ("roof step", "parapet", "rooftop projection"))
        _length("h", self.h)
        _length("lu_lower", self.lu_lower)
        dimension("pg", self.pg, _PRESSURE)
        positive("pg", self.pg, allow_zero=True)
        dimension("ps", self.ps, _PRESSURE)
        positive("ps", self.ps, allow_zero=True)
        if self.kind == "roof step":
            required(
                "lu_upper",
                self.lu_upper,
                expected="the length of the upper roof, > 0",
                when="for a roof step drift",
            )
            _length("lu_upper", self.lu_upper)
        if self.lower_width is not None:
            _length("lower_width", self.lower_width)
        if self.kind == "rooftop projection":
            required(
                "projection_length",
                self.projection_length,
                expected="a length > 0",
                when="for a rooftop projection",
            )
            _length("projection_length", self.projection_length)


@dataclass(frozen=True)
class DriftASCE7:
    """A drift load: balanced load plus a triangular surcharge (downward +).

    Attributes:
        required: False where the standard does not ask for a drift (reason in ``note``).
        gamma: snow density. hb: balanced snow depth. hc: clear height above it.
        hd_leeward, hd_windward: drift heights (leeward None for a parapet or projection).
        hd: the drift height used (at most h_c). w: drift width. pd: peak surcharge h_d γ.
        p_edge: surcharge left at the far edge of a lower roof narrower than w (else 0).
        ps: balanced load under the drift.
    """

    kind: DriftKind
    required: bool
    note: str
    ps: Quantity
    gamma: Quantity
    hb: Quantity
    hc: Quantity
    hd_leeward: Quantity | None
    hd_windward: Quantity | None
    hd: Quantity
    w: Quantity
    pd: Quantity
    p_edge: Quantity
    lower_width: Quantity | None
    derivation: Derivation

    def surcharge_at(self, x: Quantity) -> Quantity:
        """The drift surcharge at distance x from the step (0 beyond w or the roof edge)."""
        dimension("x", x, "[length]")
        if not self.required:
            return 0 * self.pd
        xr = float((x / self.w).to("").magnitude)
        beyond = self.lower_width is not None and x > self.lower_width
        if xr < 0 or xr >= 1 or beyond:
            return 0 * self.pd
        return self.pd * (1 - xr)

    def working(self, *, settings: Any = None) -> list[Any]:
        return self.derivation.working(settings=settings)

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return self.derivation._repr_mimebundle_(include, exclude)


def drift_asce7(inputs: SnowDriftASCE7) -> DriftASCE7:
    """Drift at a roof step, parapet or projection (ASCE 7-16 §7.7.1, §7.8).

    h_b = p_s / γ; h_c = h − h_b; no drift when h_c / h_b < 0.2. Leeward h_d from Figure 7.7-1
    with l_u the upper roof; windward 0.75 h_d with l_u the lower roof; the larger governs. If
    h_d <= h_c, w = 4 h_d; otherwise w = 4 h_d² / h_c <= 8 h_c and h_d = h_c. p_d = h_d γ.
    """
    us = is_us_customary(inputs.pg)
    unit = "psf" if us else "kN/m^2"
    lu_unit = "ft" if us else "m"
    out: dict[str, Any] = {"note": ""}
    step = inputs.kind == "roof step"
    ref = "ASCE 7-16 §7.7.1" if step else "ASCE 7-16 §7.8"

    def logic(r: Recorder) -> None:
        pg = r.given("p_g", inputs.pg.to(unit), "ground snow load")
        ps = r.given("p_s", inputs.ps.to(unit), "balanced snow load on the lower roof")
        h = r.given("h", inputs.h.to(lu_unit), f"height of the {inputs.kind}")
        gam = record_density(r, pg, us)
        hb = r.derive("h_b", ps / gam, "balanced snow depth", unit=lu_unit, ref=ref)
        hc = r.derive("h_c", h - hb, "clear height above the balanced snow", unit=lu_unit)
        hc_q, hb_q = r.q(hc), r.q(hb)
        out.update(gamma=r.q(gam), hb=hb_q, hc=hc_q, ps=r.q(ps))
        short = (
            inputs.kind == "rooftop projection"
            and inputs.projection_length is not None
            and inputs.projection_length < Q_(15.0, "ft")
        )
        no_drift = hc_q.magnitude <= 0 or float((hc_q / hb_q).to("").magnitude) < 0.2
        if no_drift or short:
            why = (
                "projection shorter than 15 ft (4.6 m): drift not required (§7.8)"
                if short
                else "h_c / h_b < 0.2: drift loads not required"
            )
            r.text(f"No drift: {why} ({ref}).")
            zero_l, zero_p = Q_(0.0, lu_unit), Q_(0.0, unit)
            out.update(
                required=False,
                note=why,
                hdl=None,
                hdw=None,
                hd=zero_l,
                w=zero_l,
                pd=zero_p,
                p_edge=zero_p,
            )
            return
        hdl = None
        if step:
            assert inputs.lu_upper is not None
            lu_u = r.given("l_u_upper", inputs.lu_upper.to(lu_unit), "upper roof length")
            hdl = record_drift_height(
                r, "h_d_lw", lu_u, pg, us, "leeward drift height", "ASCE 7-16 Figure 7.7-1"
            )
        lu_l = r.given(
            "l_u_lower",
            inputs.lu_lower.to(lu_unit),
            "roof length upwind of the " + ("step" if step else inputs.kind),
        )
        hd0 = record_drift_height(
            r, "h_d_0", lu_l, pg, us, "drift height for l_u,lower", "ASCE 7-16 Figure 7.7-1"
        )
        hdw = r.derive("h_d_ww", 0.75 * hd0, "windward drift height", unit=lu_unit, ref=ref)
        hd = hdw if hdl is None else r.max(hdl, hdw)
        hd = r.derive("h_d", hd, "governing drift height", unit=lu_unit, ref=ref)
        hd_q = r.q(hd)
        if hd_q <= hc_q:
            w = r.derive("w", 4 * hd, "drift width (h_d <= h_c)", unit=lu_unit, ref=ref)
            hdd = hd
        else:
            w = r.derive(
                "w", r.min(4 * hd**2 / hc, 8 * hc), "drift width (h_d > h_c)", unit=lu_unit, ref=ref
            )
            r.text("The drift is truncated by the step: its height is h_c (§7.7.1).")
            hdd = hc
        pd = r.derive("p_d", hdd * gam, "peak drift surcharge at the step", unit=unit, ref=ref)
        w_q, pd_q = r.q(w), r.q(pd)
        p_edge = Q_(0.0, unit)
        if inputs.lower_width is not None and inputs.lower_width < w_q:
            lw = r.given("l_lower", inputs.lower_width.to(lu_unit), "width of the lower roof")
            r.text(
                "The drift is wider than the lower roof: it is cut off at the roof edge, "
                "not brought to zero there (§7.7.1)."
            )
            pe = r.derive("p_edge", pd * (1 - lw / w), "surcharge at the far edge", unit=unit)
            p_edge = r.q(pe)
        r.text("Drift surcharge: triangle from p_d at the step to zero at w, added to p_s.")
        out.update(
            required=True,
            hdl=None if hdl is None else r.q(hdl),
            hdw=r.q(hdw),
            hd=r.q(hdd),
            w=w_q,
            pd=pd_q,
            p_edge=p_edge,
        )

    d = run_derivation(f"Snow drift at a {inputs.kind}", ASCE7_SNOW, logic)
    return DriftASCE7(
        kind=inputs.kind,
        required=out["required"],
        note=out["note"],
        ps=out["ps"],
        gamma=out["gamma"],
        hb=out["hb"],
        hc=out["hc"],
        hd_leeward=out["hdl"],
        hd_windward=out["hdw"],
        hd=out["hd"],
        w=out["w"],
        pd=out["pd"],
        p_edge=out["p_edge"],
        lower_width=inputs.lower_width,
        derivation=d,
    )


@dataclass(frozen=True)
class SlidingSnowASCE7:
    """Sliding snow from an upper sloped roof onto a lower roof (ASCE 7-16 §7.9).

    Attributes:
        pf: flat roof snow load of the upper roof. W: its horizontal eave-to-ridge distance.
        slope: upper roof slope. surface: ``"slippery"`` or ``"non-slippery"``.
        lower_width: width of the lower roof out from the upper roof's eave.
    """

    pf: Quantity
    W: Quantity
    slope: Quantity
    surface: Literal["slippery", "non-slippery"]
    lower_width: Quantity

    def __post_init__(self) -> None:
        dimension("pf", self.pf, _PRESSURE)
        positive("pf", self.pf, allow_zero=True)
        _length("W", self.W)
        dimension("slope", self.slope, "[]")
        one_of("surface", self.surface, ("slippery", "non-slippery"))
        _length("lower_width", self.lower_width)


@dataclass(frozen=True)
class SlidingResultASCE7:
    """Sliding snow: total per unit length of eave, spread uniformly over ``spread``."""

    required: bool
    line_total: Quantity
    spread: Quantity
    intensity: Quantity
    derivation: Derivation


def sliding_snow_asce7(inputs: SlidingSnowASCE7) -> SlidingResultASCE7:
    """Sliding load 0.4 p_f W per unit length, uniform over 15 ft (4.6 m) of the lower roof,
    reduced in proportion when the lower roof is narrower (ASCE 7-16 §7.9). Required for a
    slippery upper roof steeper than 1/4 on 12, or a non-slippery one steeper than 2 on 12.
    Superimposed on the balanced load; not combined with drift, unbalanced or partial loads.
    """
    us = is_us_customary(inputs.pf)
    unit = "psf" if us else "kN/m^2"
    lu = "ft" if us else "m"
    theta = float(inputs.slope.to("deg").magnitude)
    limit = 1.19 if inputs.surface == "slippery" else 9.46  # atan(1/48), atan(2/12)
    out: dict[str, Any] = {}

    def logic(r: Recorder) -> None:
        if theta <= limit:
            r.text(
                f"Sliding snow not required: {inputs.surface} upper roof at {theta:.3g}° "
                f"(needs more than {limit}°, ASCE 7-16 §7.9)."
            )
            out.update(req=False, tot=Q_(0.0, f"{unit}*{lu}"), spread=Q_(0.0, lu), i=Q_(0.0, unit))
            return
        pf = r.given("p_f", inputs.pf.to(unit), "flat roof snow load, upper roof")
        W = r.given("W", inputs.W.to(lu), "upper roof eave-to-ridge distance")
        s15 = Q_(15.0, "ft") if us else Q_(4.6, "m")
        lw = r.given("l_lower", inputs.lower_width.to(lu), "lower roof width")
        tot = r.derive(
            "S_slide",
            0.4 * pf * W,
            "sliding load per unit length of eave",
            unit=f"{'plf' if us else 'kN/m'}",
            ref="ASCE 7-16 §7.9",
        )
        spread = r.derive(
            "l_slide", r.min(lw, s15), "width it spreads over", unit=lu, ref="ASCE 7-16 §7.9"
        )
        i = r.derive(
            "p_slide",
            tot / s15,
            "uniform sliding load on the lower roof",
            unit=unit,
            ref="ASCE 7-16 §7.9",
        )
        out.update(req=True, tot=r.q(tot) * r.q(spread) / s15, spread=r.q(spread), i=r.q(i))

    d = run_derivation("Sliding snow onto a lower roof", ASCE7_SNOW, logic)
    return SlidingResultASCE7(out["req"], out["tot"], out["spread"], out["i"], d)
