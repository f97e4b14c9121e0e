"""Properties of doubly symmetric I-shapes for ANSI/AISC 360-16 §F2 and §G2."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from calcpack.errors import InputError, OutOfScopeError
from calcpack.units import Q_, Quantity, require, si

__all__ = ["AISC360_EDITION", "E_STEEL", "IShape"]

AISC360_EDITION = "ANSI/AISC 360-16"
_TITLE = "Specification for Structural Steel Buildings"
E_STEEL = Q_(29000.0, "ksi")  # modulus of elasticity of steel, AISC 360-16 (E = 29 000 ksi)


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

    def __post_init__(self) -> None:
        if not isinstance(self.source, str) or not self.source.strip():
            raise InputError(
                f"Section {self.name}: the source of its properties must be given (got source = "
                f"{self.source!r})",
                name="source",
                value=self.source,
                expected="e.g. 'AISC Manual Table 1-1'",
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
        if isinstance(self.h_tw, bool) or not isinstance(self.h_tw, int | float) or self.h_tw <= 0:
            raise InputError(
                f"Section {self.name}: web slenderness h_tw must be a positive number (got "
                f"h_tw = {self.h_tw!r})",
                name="h_tw",
                value=self.h_tw,
                expected="a number > 0 (h/t_w as tabulated)",
            )
        if si(self.tw) >= si(self.bf):
            raise InputError(
                f"Web thickness tw must be less than flange width bf (got tw = {self.tw:~P}, "
                f"bf = {self.bf:~P})",
                name="tw",
                value=self.tw,
                expected="tw < bf",
            )
        if si(self.Zx) < si(self.Sx):
            raise InputError(
                f"Plastic modulus Zx must not be less than elastic modulus Sx (got Zx = "
                f"{self.Zx:~P}, Sx = {self.Sx:~P})",
                name="Zx",
                value=self.Zx,
                expected="Zx >= Sx",
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
        )

    @property
    def h0_value(self) -> Quantity:
        return self.h0 if self.h0 is not None else self.d - self.tf
