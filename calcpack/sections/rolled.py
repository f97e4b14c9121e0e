"""Rolled and welded open shapes: I (doubly and singly symmetric), tee, channel and angle.

Built from the published plate dimensions (d, bf, tf, tw) and the root fillet radius r; no shape
tables are stored. For a US wide-flange shape take r = k_des - tf. Flange toe radii are not
modelled; channels have parallel flanges. Own coordinates as for every shape: origin at the
lower left corner of the bounding box, x right, y up.

Torsion constant J: Σ b t³/3 over the plates' centre lines (thin-walled open section), which
leaves out the fillets and so errs low (on the safe side for lateral-torsional buckling).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from calcpack.sections.base import fmt_len, validate_length
from calcpack.sections.geometry import Region
from calcpack.sections.shapes import (
    Shape,
    _check_fits,
    _fail,
    _fillet,
    _mm,
    _optional_radius,
    _rect,
    _require_less,
    _set_name,
    _thin_plates_J,
)
from calcpack.units import Q_, Quantity, si

__all__ = ["Angle", "Channel", "ISection", "Tee"]


def _plate_dims(shape: _Plates, web: str) -> tuple[float, ...]:
    """d, bf, tf, tw and r (m) of a shape made of flange and web plates, each validated by
    name (r may be zero)."""
    return (
        validate_length(shape.d, "d", "Depth"),
        validate_length(shape.bf, "bf", "Flange width"),
        validate_length(shape.tf, "tf", "Flange thickness"),
        validate_length(shape.tw, "tw", f"{web} thickness"),
        _optional_radius(shape.r, "r", "Root fillet radius"),
    )


def _web_and_fillet(
    shape: _Plates, kind: str, web: str, dims: tuple[float, ...], excess: float
) -> None:
    """A tee's or channel's web (stem) thinner than the flange is wide, flange thinner than
    the depth (half the depth for two flanges), and root fillets that fit (``excess`` < 0)."""
    d, bf, tf, tw, r = dims
    _require_less(f"{web} thickness", "tw", tw, shape.tw, "flange width", "bf", bf)
    half = kind == "channel"
    _require_less("Flange thickness", "tf", tf, shape.tf, "depth", "d", d, half=half)
    _check_fits(
        excess,
        1e-15,
        f"Root fillet radius r does not fit the {kind} (got r = {fmt_len(r)})",
        "r",
        shape.r,
    )
    _set_name(shape, f"{kind} {_mm(d)} × {_mm(bf)} mm")


@dataclass(frozen=True, kw_only=True, eq=False)
class _Plates(Shape):
    """The fields of a shape made of flange and web plates: depth d, flange width bf and
    thickness tf, web thickness tw, root fillet radius r."""

    d: Quantity
    bf: Quantity
    tf: Quantity
    tw: Quantity
    r: Quantity = field(default_factory=lambda: Q_(0.0, "mm"))
    name: str = ""


@dataclass(frozen=True, kw_only=True, eq=False)
class ISection(_Plates):
    """An I-section: depth d, flange width bf and thickness tf, web thickness tw, root fillet
    radius r (0 for a welded plate girder). A singly symmetric I has a different bottom flange
    ``bf_bot`` × ``tf_bot``; bf and tf are then the top flange.

    Attributes exposed for compactness checks: d, bf, tf, tw, r, bf_bot, tf_bot, h (clear web
    depth between the fillets, d - tf - tf_bot - 2r), h0 (distance between flange centroids).
    """

    bf_bot: Quantity | None = None
    tf_bot: Quantity | None = None

    def __post_init__(self) -> None:
        d, bf, tf, tw, r = _plate_dims(self, "Web")
        bfb = bf if self.bf_bot is None else validate_length(self.bf_bot, "bf_bot", "Flange width")
        tfb = (
            tf
            if self.tf_bot is None
            else validate_length(self.tf_bot, "tf_bot", "Flange thickness")
        )
        for b, name in ((bf, "bf"), (bfb, "bf_bot")):
            _require_less("Web thickness", "tw", tw, self.tw, "flange width", name, b)
            _check_fits(
                tw + 2 * r,
                b + 1e-15,
                f"Root fillet radius r does not fit: tw + 2r must not exceed flange width {name} "
                f"(got r = {fmt_len(r)}, tw = {fmt_len(tw)}, {name} = {fmt_len(b)})",
                "r",
                self.r,
            )
        if not tf + tfb < d:
            raise _fail(
                f"Flange thicknesses tf + tf_bot must be less than depth d (got tf = "
                f"{fmt_len(tf)}, tf_bot = {fmt_len(tfb)}, d = {fmt_len(d)})",
                "tf",
                self.tf,
                "tf + tf_bot < d",
            )
        _check_fits(
            tf + tfb + 2 * r,
            d,
            f"Root fillet radius r does not fit: the fillets leave no straight web (got r = "
            f"{fmt_len(r)}, d - tf - tf_bot = {fmt_len(d - tf - tfb)})",
            "r",
            self.r,
        )
        _set_name(self, f"I-section {_mm(d)} × {_mm(bf)} mm")

    def _dims(self) -> tuple[float, float, float, float, float, float, float]:
        bf, tf = si(self.bf), si(self.tf)
        bfb = bf if self.bf_bot is None else si(self.bf_bot)
        tfb = tf if self.tf_bot is None else si(self.tf_bot)
        return si(self.d), bf, tf, si(self.tw), si(self.r), bfb, tfb

    @property
    def doubly_symmetric(self) -> bool:
        _d, bf, tf, _tw, _r, bfb, tfb = self._dims()
        return math.isclose(bf, bfb) and math.isclose(tf, tfb)

    @property
    def h(self) -> Quantity:
        """Clear depth of the web between the fillets (or flanges), d - tf - tf_bot - 2r."""
        d, _bf, tf, _tw, r, _bfb, tfb = self._dims()
        return Q_(d - tf - tfb - 2 * r, "m").to("mm")

    @property
    def h0(self) -> Quantity:
        """Distance between the flange centroids, d - (tf + tf_bot)/2."""
        d, _bf, tf, _tw, _r, _bfb, tfb = self._dims()
        return Q_(d - (tf + tfb) / 2, "m").to("mm")

    @property
    def bf_bottom(self) -> Quantity:
        """Bottom flange width (bf for a doubly symmetric I)."""
        return self.bf if self.bf_bot is None else self.bf_bot

    @property
    def tf_bottom(self) -> Quantity:
        """Bottom flange thickness (tf for a doubly symmetric I)."""
        return self.tf if self.tf_bot is None else self.tf_bot

    def local_regions(self) -> list[tuple[Region, float]]:
        d, bf, tf, tw, r, bfb, tfb = self._dims()
        B = max(bf, bfb)
        xc = B / 2
        xl, xr = xc - tw / 2, xc + tw / 2
        out: list[tuple[Region, float]] = [
            (_rect(xc - bf / 2, d - tf, xc + bf / 2, d, "top flange"), 1.0),
            (_rect(xl, tfb, xr, d - tf, "web"), 1.0),
            (_rect(xc - bfb / 2, 0.0, xc + bfb / 2, tfb, "bottom flange"), 1.0),
        ]
        if r > 0:
            label = "root fillets (4)"
            out += [
                (_fillet((xl, d - tf), (-1, 0), (0, -1), r, label), 1.0),
                (_fillet((xr, d - tf), (1, 0), (0, -1), r, label), 1.0),
                (_fillet((xl, tfb), (-1, 0), (0, 1), r, label), 1.0),
                (_fillet((xr, tfb), (1, 0), (0, 1), r, label), 1.0),
            ]
        return out

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        d, bf, tf, tw, _r, bfb, tfb = self._dims()
        h0 = d - (tf + tfb) / 2
        return _thin_plates_J(
            [(bf, tf, "top flange"), (bfb, tfb, "bottom flange"), (h0, tw, "web")]
        )

    def warping_constant_m6(self) -> tuple[float | None, str]:
        """Cw = Iy h0² / 4 for a doubly symmetric I; h0² I_top I_bot / (I_top + I_bot) with the
        flanges' own second moments for a singly symmetric I (AISC Design Guide 9, common
        practice); web and fillets neglected in the latter."""
        d, bf, tf, _tw, _r, bfb, tfb = self._dims()
        h0 = d - (tf + tfb) / 2
        if self.doubly_symmetric:
            B = max(bf, bfb)
            Iy = 0.0
            for region, _ in self.local_regions():
                m = region.moments()
                Iy += m.Iy + m.A * (m.cx - B / 2) ** 2
            return Iy * h0**2 / 4, ""
        i_top = tf * bf**3 / 12
        i_bot = tfb * bfb**3 / 12
        return h0**2 * i_top * i_bot / (i_top + i_bot), ""

    def is_open_thin_walled(self) -> bool:
        return True


@dataclass(frozen=True, kw_only=True, eq=False)
class Tee(_Plates):
    """A tee with its flange on top: overall depth d, flange bf × tf, stem (web) thickness tw,
    root fillet radius r."""

    def __post_init__(self) -> None:
        dims = _plate_dims(self, "Stem")
        d, bf, tf, tw, r = dims
        _web_and_fillet(self, "tee", "Stem", dims, max(tw + 2 * r - bf, tf + r - d))

    def local_regions(self) -> list[tuple[Region, float]]:
        d, bf, tf, tw, r = si(self.d), si(self.bf), si(self.tf), si(self.tw), si(self.r)
        xl, xr = (bf - tw) / 2, (bf + tw) / 2
        out: list[tuple[Region, float]] = [
            (_rect(0.0, d - tf, bf, d, "flange"), 1.0),
            (_rect(xl, 0.0, xr, d - tf, "stem"), 1.0),
        ]
        if r > 0:
            out += [
                (_fillet((xl, d - tf), (-1, 0), (0, -1), r, "root fillets (2)"), 1.0),
                (_fillet((xr, d - tf), (1, 0), (0, -1), r, "root fillets (2)"), 1.0),
            ]
        return out

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        d, bf, tf, tw = si(self.d), si(self.bf), si(self.tf), si(self.tw)
        return _thin_plates_J([(bf, tf, "flange"), (d - tf / 2, tw, "stem")])

    def warping_constant_m6(self) -> tuple[float | None, str]:
        return None, "warping of a tee is small and not coded; treat Cw as negligible explicitly"

    def is_open_thin_walled(self) -> bool:
        return True


@dataclass(frozen=True, kw_only=True, eq=False)
class Channel(_Plates):
    """A channel with parallel flanges, web on the left: depth d, flange width bf (including the
    web), flange thickness tf, web thickness tw, root fillet radius r."""

    def __post_init__(self) -> None:
        dims = _plate_dims(self, "Web")
        d, bf, tf, tw, r = dims
        _web_and_fillet(self, "channel", "Web", dims, max(tw + r - bf, 2 * tf + 2 * r - d))

    def local_regions(self) -> list[tuple[Region, float]]:
        d, bf, tf, tw, r = si(self.d), si(self.bf), si(self.tf), si(self.tw), si(self.r)
        out: list[tuple[Region, float]] = [
            (_rect(tw, d - tf, bf, d, "top flange"), 1.0),
            (_rect(0.0, 0.0, tw, d, "web"), 1.0),
            (_rect(tw, 0.0, bf, tf, "bottom flange"), 1.0),
        ]
        if r > 0:
            out += [
                (_fillet((tw, d - tf), (1, 0), (0, -1), r, "root fillets (2)"), 1.0),
                (_fillet((tw, tf), (1, 0), (0, 1), r, "root fillets (2)"), 1.0),
            ]
        return out

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        d, bf, tf, tw = si(self.d), si(self.bf), si(self.tf), si(self.tw)
        b = bf - tw / 2
        return _thin_plates_J(
            [(b, tf, "top flange"), (b, tf, "bottom flange"), (d - tf, tw, "web")]
        )

    def warping_constant_m6(self) -> tuple[float | None, str]:
        """Cw = tf b³ h0² / 12 · (3 b tf + 2 h0 tw) / (6 b tf + h0 tw) on centre-line dimensions
        b = bf - tw/2, h0 = d - tf (AISC Design Guide 9, common practice)."""
        d, bf, tf, tw = si(self.d), si(self.bf), si(self.tf), si(self.tw)
        b = bf - tw / 2
        h0 = d - tf
        return tf * b**3 * h0**2 / 12 * (3 * b * tf + 2 * h0 * tw) / (6 * b * tf + h0 * tw), ""

    def is_open_thin_walled(self) -> bool:
        return True


@dataclass(frozen=True, kw_only=True, eq=False)
class Angle(Shape):
    """An angle with its heel at the lower left: vertical leg d, horizontal leg b, thickness t,
    root fillet radius r (toe radii not modelled)."""

    d: Quantity
    b: Quantity
    t: Quantity
    r: Quantity = field(default_factory=lambda: Q_(0.0, "mm"))
    name: str = ""

    def __post_init__(self) -> None:
        d = validate_length(self.d, "d", "Leg length")
        b = validate_length(self.b, "b", "Leg length")
        t = validate_length(self.t, "t", "Leg thickness")
        r = _optional_radius(self.r, "r", "Root fillet radius")
        for leg, name in ((d, "d"), (b, "b")):
            _require_less("Leg thickness", "t", t, self.t, "leg length", name, leg)
        _check_fits(
            t + r,
            min(b, d) + 1e-15,
            f"Root fillet radius r does not fit the angle (got r = {fmt_len(r)}, t = "
            f"{fmt_len(t)}, shorter leg {fmt_len(min(b, d))})",
            "r",
            self.r,
        )
        _set_name(self, f"angle {_mm(d)} × {_mm(b)} × {_mm(t)} mm")

    def local_regions(self) -> list[tuple[Region, float]]:
        d, b, t, r = si(self.d), si(self.b), si(self.t), si(self.r)
        out: list[tuple[Region, float]] = [
            (_rect(0.0, 0.0, t, d, "vertical leg"), 1.0),
            (_rect(t, 0.0, b, t, "horizontal leg"), 1.0),
        ]
        if r > 0:
            out.append((_fillet((t, t), (1, 0), (0, 1), r, "root fillet"), 1.0))
        return out

    def torsion_constant_m4(self) -> tuple[float | None, str]:
        d, b, t = si(self.d), si(self.b), si(self.t)
        return _thin_plates_J([(d - t / 2, t, "vertical leg"), (b - t / 2, t, "horizontal leg")])

    def warping_constant_m6(self) -> tuple[float | None, str]:
        return None, "warping of an angle is small and not coded; treat Cw as negligible explicitly"

    def is_open_thin_walled(self) -> bool:
        return True
