"""Properties of doubly symmetric I-shapes for ANSI/AISC 360-16 §F2 and §G2."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_, Quantity, require, si
from calcpack.validate import instance, non_empty, positive, within

__all__ = ["AISC360_EDITION", "E_SOURCE", "E_STEEL", "IShape"]

AISC360_EDITION = "ANSI/AISC 360-16"
_TITLE = "Specification for Structural Steel Buildings"
E_STEEL = Q_(29000.0, "ksi")  # modulus of elasticity of steel, AISC 360-16 (E = 29 000 ksi)
# Where the Specification defines E: its list of symbols, "E  Modulus of elasticity of steel =
# 29,000 ksi (200 000 MPa)" (from memory; confirm against the printed Specification).
E_SOURCE = "AISC 360-16, Symbols: E of steel = 29 000 ksi (200 000 MPa)"


H_TW_TOLERANCE = 0.02
"""A stated h/t_w may differ from the one its dimensions imply by this much (rounding of
tabulated values)."""
ROLLED_H_MIN_FRACTION = 0.6
"""Without k_des, the clear web height of a rolled shape, h, is taken to be at least this share
of d − 2 t_f: the fillets of rolled W, M, S and HP shapes take less than that (common practice;
e.g. about 0.95 of d − 2 t_f for a W18x50 and 0.7 for the small S shapes, from memory)."""


def _ratio_error(name: str, stated: float, implied: float, rule: str, span: str) -> InputError:
    return InputError(
        f"Section {name}: the stated web slenderness h_tw = {stated:.4g} disagrees with its "
        f"dimensions, {rule} = {implied:.4g}; it must be {span}. Check t_w, d and h_tw",
        name="h_tw",
        value=stated,
        expected=f"{span} of {rule} = {implied:.4g}",
    )


@dataclass(frozen=True)
class IShape:
    """Properties of a doubly symmetric I-shape for §F2 and §G2 (as tabulated for rolled shapes).

    Args:
        name: designation (``"W18x50"``). source: where the properties come from (required,
            e.g. ``"AISC Manual Table 1-1"``; or a calcpack section calculation).
        d: depth. bf: flange width. tf: flange thickness. tw: web thickness.
        h_tw: web slenderness h/t_w (h: clear distance between flanges less the fillets, or
            the clear distance for built-up shapes), dimensionless.
        Ix: major-axis second moment. Sx: elastic and Zx: plastic section modulus.
        Iy: minor-axis second moment. ry: minor-axis radius of gyration.
        J: torsion constant. Cw: warping constant.
        h0: distance between flange centroids (default d − t_f).
        rolled: rolled shape (True) or built-up (False); matters for §G2.1(a).
        kdes: design distance from the outer flange face to the web toe of the fillet (as
            tabulated for rolled shapes). With it, the stated h_tw must agree within 2 % with
            (d − 2 k_des)/t_w; for a built-up shape, with (d − 2 t_f)/t_w. A rolled shape
            without k_des is checked more loosely: h = h_tw·t_w must lie between
            ``ROLLED_H_MIN_FRACTION`` × (d − 2 t_f) and (d − 2 t_f) + 2 %.

    Raises:
        InputError: a dimension missing, not positive or of the wrong unit; t_w ≥ b_f;
            Z_x < S_x; a stated h_tw that the shape's own dimensions contradict.
    """

    name: str
    source: str
    d: Quantity
    bf: Quantity
    tf: Quantity
    tw: Quantity
    h_tw: float
    Ix: Quantity
    Sx: Quantity
    Zx: Quantity
    Iy: Quantity
    ry: Quantity
    J: Quantity
    Cw: Quantity
    h0: Quantity | None = None
    rolled: bool = True
    kdes: Quantity | None = None

    def __post_init__(self) -> None:
        non_empty(
            "source",
            self.source,
            expected=f"the source of section {self.name}'s properties (AISC Manual Table 1-1)",
        )
        for nm, dim in (
            ("d", "[length]"),
            ("bf", "[length]"),
            ("tf", "[length]"),
            ("tw", "[length]"),
            ("Ix", "[length]**4"),
            ("Sx", "[length]**3"),
            ("Zx", "[length]**3"),
            ("Iy", "[length]**4"),
            ("ry", "[length]"),
            ("J", "[length]**4"),
            ("Cw", "[length]**6"),
        ):
            require(getattr(self, nm), dim, nm, positive=True)
        if self.h0 is not None:
            require(self.h0, "[length]", "h0", positive=True)
        positive("h_tw", instance("h_tw", self.h_tw, (int, float), expected="h/t_w as tabulated"))
        within(
            "tw",
            self.tw,
            hi=self.bf,
            inclusive=False,
            rule="the web must be thinner than the flange width bf",
        )
        self._check_h_tw()
        within("Zx", self.Zx, lo=self.Sx, rule="plastic modulus Zx >= elastic modulus Sx")

    def _check_h_tw(self) -> None:
        """The stated web slenderness against the section's own dimensions (see the class)."""
        d, tf, tw = si(self.d), si(self.tf), si(self.tw)
        clear = d - 2.0 * tf
        if clear <= 0:
            raise InputError(
                f"Section {self.name}: depth d must exceed twice the flange thickness (got "
                f"d = {self.d:~P}, tf = {self.tf:~P})",
                name="d",
                value=self.d,
                expected="d > 2·tf",
            )
        if self.kdes is not None:
            require(self.kdes, "[length]", "kdes", positive=True)
        if self.kdes is not None or not self.rolled:
            h = d - 2.0 * si(self.kdes) if self.kdes is not None else clear
            rule = "(d − 2·kdes)/tw" if self.kdes is not None else "(d − 2·tf)/tw (built-up)"
            implied = h / tw
            if implied <= 0 or abs(self.h_tw / implied - 1.0) > H_TW_TOLERANCE:
                raise _ratio_error(self.name, self.h_tw, implied, rule, "within 2 %")
            return
        lo = ROLLED_H_MIN_FRACTION * clear / tw
        hi = (1.0 + H_TW_TOLERANCE) * clear / tw
        if not lo <= self.h_tw <= hi:
            raise _ratio_error(
                self.name,
                self.h_tw,
                clear / tw,
                "(d − 2·tf)/tw",
                f"between {lo:.3g} and {hi:.3g} for a rolled shape (give kdes for the 2 % check)",
            )

    @classmethod
    def from_section(cls, shape: Any, *, source: str = "", rolled: bool = True) -> IShape:
        """The properties of a :class:`calcpack.sections.ISection` (computed by calcpack).

        Raises:
            OutOfScopeError: the I-section is not doubly symmetric (§F2 covers doubly symmetric
                members only).
        """
        if not getattr(shape, "doubly_symmetric", False):
            raise OutOfScopeError(
                f"Section {getattr(shape, 'name', '') or 'I'} is not doubly symmetric: AISC "
                "360-16 §F2 covers doubly symmetric I-shapes only (§F4/§F5 are not implemented)"
            )
        p = shape.properties()
        name = getattr(shape, "name", "") or "I-section"
        return cls(
            name,
            source or f"calcpack section properties of {name}",
            d=shape.d,
            bf=shape.bf,
            tf=shape.tf,
            tw=shape.tw,
            h_tw=float((shape.h / shape.tw).to("").magnitude),
            Ix=p.Ix,
            Sx=p.Sx,
            Zx=p.Zx,
            Iy=p.Iy,
            ry=p.ry,
            J=p.J,
            Cw=p.Cw,
            h0=shape.h0,
            rolled=rolled,
            kdes=shape.d / 2 - shape.h / 2,
        )

    @property
    def h0_value(self) -> Quantity:
        return self.h0 if self.h0 is not None else self.d - self.tf
