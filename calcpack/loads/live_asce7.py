"""Live load reduction to ASCE/SEI 7-16 Chapter 4, as load derivations with their working.

* :func:`floor_live_reduction_asce7`: §4.7.2, Eq. 4.7-1, L = L_o (0.25 + 15/√(K_LL A_T))
  (US: A_T in ft²; SI: 4.57/√(K_LL A_T), A_T in m²), permitted where K_LL A_T ≥ 400 ft²
  (37.16 m²), and not less than 0.50 L_o for a member supporting one floor, 0.40 L_o for two or
  more. Live loads above 100 psf (4.79 kN/m²), garages and assembly uses (§4.7.3-§4.7.5) are
  refused: their rules are not implemented.
* :func:`roof_live_reduction_asce7`: §4.8.2, Eq. 4.8-1, L_r = L_o R_1 R_2 with
  12 ≤ L_r ≤ 20 psf (0.58 ≤ L_r ≤ 0.96 kN/m²), for ordinary flat, pitched and curved roofs.

The equations and limits are those of ASCE/SEI 7-16 (from memory: confirm against the printed
standard). K_LL is the live load element factor of Table 4.7-1, given by the caller with the
member type it was read for.

Units: pint quantities; loads are pressures, downward positive.
"""

from __future__ import annotations

from dataclasses import dataclass

from calcpack.checks.base import Recorder
from calcpack.errors import OutOfScopeError
from calcpack.loads.derive import Derivation, LoadStandard, is_us_customary, run_derivation
from calcpack.units import Q_, Quantity
from calcpack.validate import dimension, one_of, positive, whole, within

__all__ = [
    "LiveReduction",
    "floor_live_reduction_asce7",
    "roof_live_reduction_asce7",
]

_STANDARD = LoadStandard("ASCE/SEI 7-16", "Chapter 4, Live Loads")
_K_LL = (1.0, 2.0, 3.0, 4.0)  # the values Table 4.7-1 lists


@dataclass(frozen=True)
class LiveReduction:
    """A reduced live load and its working.

    Attributes:
        reduced: the design live load (pressure). factor: reduced / unreduced.
        permitted: whether the standard permits a reduction for this member at all.
        derivation: values and working.
    """

    reduced: Quantity
    factor: float
    permitted: bool
    derivation: Derivation

    def add_to(self, sheet: object) -> LiveReduction:
        """Add the working to ``sheet``."""
        self.derivation.add_to(sheet)
        return self


def floor_live_reduction_asce7(
    Lo: Quantity,
    *,
    K_LL: float,
    member: str,
    A_T: Quantity,
    floors_supported: int = 1,
) -> LiveReduction:
    """Reduced floor live load on a member, ASCE/SEI 7-16 §4.7.2 (Eq. 4.7-1).

    Args:
        Lo: unreduced design live load (Table 4.3-1) [pressure], at most 100 psf.
        K_LL: live load element factor of Table 4.7-1 (1, 2, 3 or 4) for ``member``
            (e.g. ``"interior beam"``: 2).
        A_T: tributary area [area]. floors_supported: floors the member supports (≥ 1).

    Returns:
        The reduced load in the unit of ``Lo``, with the working.

    Raises:
        OutOfScopeError: L_o above 100 psf (4.79 kN/m²): §4.7.3 applies.
        InputError: bad units or values.
    """
    dimension("Lo", Lo, "[force] / [length] ** 2")
    positive("Lo", Lo)
    dimension("A_T", A_T, "[length] ** 2")
    positive("A_T", A_T)
    one_of("K_LL", float(K_LL), _K_LL)
    whole("floors_supported", floors_supported, lo=1)
    if Lo > Q_(100.0, "psf"):
        raise OutOfScopeError(
            f"Live load L_o = {Lo:~P} exceeds 100 psf: ASCE/SEI 7-16 §4.7.3 (heavy live loads) "
            "applies, which calcpack does not implement; use the unreduced load"
        )
    us = is_us_customary(Lo)
    a_unit = "ft**2" if us else "m**2"
    p_unit = f"{Lo.units:~}"
    limit = Q_(400.0, "ft**2") if us else Q_(37.16, "m**2")
    coef = Q_(15.0, "ft") if us else Q_(4.57, "m")
    floor = 0.5 if floors_supported == 1 else 0.4
    out: dict[str, object] = {}

    def logic(r: Recorder) -> None:
        L0 = r.given("L_o", Lo, "unreduced design live load", source="ASCE/SEI 7-16 Table 4.3-1")
        k = r.given("K_LL", float(K_LL), f"live load element factor, {member}",
                    source="ASCE/SEI 7-16 Table 4.7-1")  # fmt: skip
        at = r.given("A_T", A_T.to(a_unit), "tributary area", source="given")
        kat = r.derive("K_LL_A_T", k * at, "influence area", unit=a_unit,
                       ref="ASCE/SEI 7-16 §4.7.2")  # fmt: skip
        if r.q(kat) < limit:
            r.text(
                f"K_LL A_T is less than {limit:~P}: ASCE/SEI 7-16 §4.7.2 does not permit a "
                "reduction; L = L_o."
            )
            L = r.derive("L", 1.0 * L0, "design live load, not reduced", unit=p_unit)
            out["permitted"] = False
        else:
            c15 = r.given("c_LL", coef, "coefficient of Eq. 4.7-1 in these units",
                          source="ASCE/SEI 7-16 Eq. 4.7-1")  # fmt: skip
            f = r.derive("f_LL", 0.25 + c15 / r.sqrt(kat), "reduction factor", unit="",
                         ref="ASCE/SEI 7-16 Eq. 4.7-1")  # fmt: skip
            fmin = r.given("f_min", floor, f"lower limit, member supporting "
                           f"{'one floor' if floors_supported == 1 else 'two or more floors'}",
                           source="ASCE/SEI 7-16 §4.7.2")  # fmt: skip
            fu = r.derive("f_LL_used", r.min(r.max(f, fmin), 1.0), "factor applied (≤ 1.00)",
                          unit="")  # fmt: skip
            L = r.derive("L", fu * L0, "reduced design live load", unit=p_unit,
                         ref="ASCE/SEI 7-16 Eq. 4.7-1")  # fmt: skip
            out["permitted"] = True
        out["L"] = r.q(L)

    d = run_derivation("Floor live load reduction", _STANDARD, logic)
    reduced = d["L"]
    return LiveReduction(reduced, float((reduced / Lo).to("").magnitude), bool(out["permitted"]), d)


def roof_live_reduction_asce7(
    Lo: Quantity, *, A_T: Quantity, rise_per_foot: float
) -> LiveReduction:
    """Reduced roof live load, ASCE/SEI 7-16 §4.8.2 (Eq. 4.8-1), ordinary roofs.

    Args:
        Lo: unreduced roof live load of Table 4.3-1 for an ordinary flat, pitched or curved
            roof (20 psf, 0.96 kN/m²). A_T: tributary area supported by the member [area].
        rise_per_foot: F, the rise of a pitched roof in inches per foot (0 for a flat roof).

    Returns:
        L_r = L_o R_1 R_2 with 12 psf ≤ L_r ≤ 20 psf, in the unit of ``Lo``.
    """
    dimension("Lo", Lo, "[force] / [length] ** 2")
    positive("Lo", Lo)
    dimension("A_T", A_T, "[length] ** 2")
    positive("A_T", A_T)
    within("rise_per_foot", float(rise_per_foot), 0.0, 60.0)
    us = is_us_customary(Lo)
    p_unit = f"{Lo.units:~}"
    a_ft2 = float(A_T.to("ft**2").magnitude)
    F = float(rise_per_foot)
    lo_min = Q_(12.0, "psf").to(p_unit)

    def logic(r: Recorder) -> None:
        L0 = r.given("L_o", Lo, "unreduced roof live load, ordinary roof",
                     source="ASCE/SEI 7-16 Table 4.3-1")  # fmt: skip
        at = r.given("A_T", A_T.to("ft**2" if us else "m**2"), "tributary area", source="given")
        if a_ft2 <= 200.0:
            R1 = r.given("R_1", 1.0, "A_T ≤ 200 ft² (18.58 m²)", source="ASCE/SEI 7-16 Eq. 4.8-2")
        elif a_ft2 < 600.0:
            k1 = r.given("k_1", Q_(0.001, "1/ft**2"), "coefficient of Eq. 4.8-2",
                         source="ASCE/SEI 7-16 Eq. 4.8-2")  # fmt: skip
            R1 = r.derive("R_1", 1.2 - k1 * at, "200 < A_T < 600 ft²",
                          unit="", ref="ASCE/SEI 7-16 Eq. 4.8-2")  # fmt: skip
        else:
            R1 = r.given("R_1", 0.6, "A_T ≥ 600 ft² (55.74 m²)", source="ASCE/SEI 7-16 Eq. 4.8-2")
        Fv = r.given("F", F, "rise of the roof, in. per ft", source="given")
        if F <= 4.0:
            R2 = r.given("R_2", 1.0, "F ≤ 4", source="ASCE/SEI 7-16 Eq. 4.8-3")
        elif F < 12.0:
            R2 = r.derive("R_2", 1.2 - 0.05 * Fv, "4 < F < 12", unit="",
                          ref="ASCE/SEI 7-16 Eq. 4.8-3")  # fmt: skip
        else:
            R2 = r.given("R_2", 0.6, "F ≥ 12", source="ASCE/SEI 7-16 Eq. 4.8-3")
        raw = r.derive("L_r_calc", L0 * R1 * R2, "L_o R_1 R_2", unit=p_unit,
                       ref="ASCE/SEI 7-16 Eq. 4.8-1")  # fmt: skip
        r.derive("L_r", r.min(r.max(raw, lo_min), L0), "roof live load, 12 psf ≤ L_r ≤ L_o",
                 unit=p_unit, ref="ASCE/SEI 7-16 §4.8.2")  # fmt: skip

    d = run_derivation("Roof live load reduction", _STANDARD, logic)
    reduced = d["L_r"]
    return LiveReduction(reduced, float((reduced / Lo).to("").magnitude), True, d)
