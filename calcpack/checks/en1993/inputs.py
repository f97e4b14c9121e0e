"""Inputs of the EN 1993-1-1 member checks: the member (section, grade, buckling lengths,
C_m factors of Annex B Table B.3) and the design forces of one combination.

Sign convention: N_Ed compression positive; moments and shears as magnitudes.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

from calcpack.checks.en1993.data import LTBMethod
from calcpack.errors import InputError
from calcpack.sections.eurocode_tables import EuroSection
from calcpack.units import Q_, Quantity, require
from calcpack.validate import instance, one_of, within

__all__ = ["DesignForces", "LoadLevel", "SteelMemberEC", "cm_linear"]

LoadLevel = Literal["shear centre", "top flange", "bottom flange"]
_NO_FORCE = Q_(0.0, "kN")
_NO_MOMENT = Q_(0.0, "kN*m")


@dataclass(frozen=True)
class SteelMemberEC:
    """A steel member: section, grade and the lengths that set its buckling resistance.

    Args:
        section: from :func:`calcpack.sections.eurocode_tables.euro_section`.
        grade: ``"S275"``, ``"S355"`` or ``"S235"`` (f_y by the thickest element).
        Lcr_y, Lcr_z: flexural buckling lengths about y-y and z-z (None: not a strut).
        ltb_method: ``"6.3.2.3"`` (rolled I and H, UK NA values, with f) or ``"6.3.2.2"``.
        Cmy, Cmz, CmLT: equivalent uniform moment factors of Annex B Table B.3 (1.0, the upper
            bound of the table, unless the moment diagram is stated; see :func:`cm_linear`).
    """

    section: EuroSection
    grade: str = "S355"
    Lcr_y: Quantity | None = None
    Lcr_z: Quantity | None = None
    ltb_method: LTBMethod = "6.3.2.3"
    Cmy: float = 1.0
    Cmz: float = 1.0
    CmLT: float = 1.0

    def __post_init__(self) -> None:
        instance("section", self.section, EuroSection, expected="a section from euro_section(...)")
        for n in ("Lcr_y", "Lcr_z"):
            v = getattr(self, n)
            if v is not None:
                require(v, "[length]", n, positive=True)
        one_of("ltb_method", self.ltb_method, ("6.3.2.2", "6.3.2.3"))
        for n in ("Cmy", "Cmz", "CmLT"):
            within(n, getattr(self, n), 0.4, 1.0, rule="Annex B Table B.3 gives 0.4 ≤ C_m ≤ 1")

    @property
    def thickness(self) -> Quantity:
        s = self.section
        if s.t is not None:
            return s.t
        assert s.tf is not None
        assert s.tw is not None
        return max(s.tf, s.tw)


def cm_linear(psi: float) -> float:
    """C_m of Annex B Table B.3 for a linear moment diagram, end moment ratio ψ (−1 ≤ ψ ≤ 1):
    0.6 + 0.4ψ ≥ 0.4."""
    within("psi", psi, -1.0, 1.0, rule="ψ is the ratio of the end moments")
    return max(0.4, 0.6 + 0.4 * psi)


@dataclass(frozen=True)
class DesignForces:
    """Design forces on the member for one combination (or an envelope, stated in ``where``).

    Args:
        combination: its name. N_Ed: axial force, compression + [force]. My_Ed, Mz_Ed: bending
        moments about y-y and z-z (magnitudes). V_Ed: shear parallel to the web.
        L_LT: length between lateral-torsional restraints of the segment checked (None: the
            compression flange is restrained throughout). C1: from the moment diagram (≥ 1;
            1.0 is the uniform-moment value). Mcr: the elastic critical moment when found
            from the diagram (then C1 is shown as M_cr/M_cr,uniform). load_level: where the
            loads act (top flange is destabilising; only with Mcr from the diagram).
        M_LT_Ed: largest moment on the segment checked for LTB (default My_Ed). where: words.
    """

    combination: str = ""
    N_Ed: Quantity = _NO_FORCE
    My_Ed: Quantity = _NO_MOMENT
    Mz_Ed: Quantity = _NO_MOMENT
    V_Ed: Quantity = _NO_FORCE
    L_LT: Quantity | None = None
    C1: float = 1.0
    Mcr: Quantity | None = None
    M_LT_Ed: Quantity | None = None
    load_level: LoadLevel = "shear centre"
    where: str = ""

    def __post_init__(self) -> None:
        require(self.N_Ed, "[force]", "N_Ed")
        require(self.My_Ed, "[force]*[length]", "My_Ed")
        require(self.Mz_Ed, "[force]*[length]", "Mz_Ed")
        require(self.V_Ed, "[force]", "V_Ed")
        if self.L_LT is not None:
            require(self.L_LT, "[length]", "L_LT", positive=True)
        if self.Mcr is not None:
            require(self.Mcr, "[force]*[length]", "Mcr", positive=True)
        within("C1", self.C1, 1.0, 3.5, rule="C1 of a fork-supported segment lies from 1 to ~3")
        one_of("load_level", self.load_level, ("shear centre", "top flange", "bottom flange"))
        if self.load_level != "shear centre" and self.Mcr is None and self.L_LT is not None:
            raise InputError(
                f"Load level {self.load_level!r} needs M_cr from the moment diagram "
                "(check_en1993_beam computes it); with C1 alone the loads are taken at the "
                "shear centre",
                name="load_level",
                value=self.load_level,
                expected="'shear centre', or give Mcr",
            )
