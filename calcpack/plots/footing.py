"""Plan and section sketch of a pad footing or pier (matplotlib -> SVG), reading results only.

The sketch shows, to scale: the footing and the column, post or base plate on it; the bars each
way (from the check's bar count when a concrete check is given); the critical sections — for
moment at the section of ACI 318-19 §13.2.7.1 (the column face for concrete, halfway to the
plate edge for a base plate, a quarter in for masonry), for one-way shear at d beyond it, and
the punching perimeter (at d/2 from the loaded area to ACI 318-19 §22.6.4.1; at 2d with rounded
corners to EN 1992-1-1 §6.4.2); the section with the soil cover and the bottom bars; and the
soil pressure under the section along x (from :func:`calcpack.foundations.soil_pressure`).

Drawing ``"footing"`` of :class:`calcpack.working.Figure`; :func:`footing_figure` builds the
step, :class:`FootingSketch` shows it in a notebook.
"""

from __future__ import annotations

import io
import math
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.checks.aci318.footing_data import moment_section
from calcpack.plots.labels import quantity_label
from calcpack.units import Q_

__all__ = ["FootingSketch", "FootingSketchData", "footing_figure", "footing_svg"]

_SECTION = {"M": "#cb181d", "V": "#6a51a3", "P": "#238b45"}


@dataclass(frozen=True)
class FootingSketchData:
    """What the sketch reads: the footing, and optionally its concrete checks (for the bars
    and the effective depth) and a contact pressure result (for the pressure diagram)."""

    footing: Any
    checks: Any = None
    pressure: Any = None


def _m(q: Any) -> float:
    return float(q.to("m").magnitude)


def _value(checks: Any, *names: str) -> Any:
    vals = getattr(checks, "values", {}) if checks is not None else {}
    for n in names:
        if n in vals:
            return vals[n]
    return None


def _depth(checks: Any) -> float | None:
    d = _value(checks, "d_avg", "d_eff", "d_x", "d")
    return None if d is None else _m(d)


def _is_en(checks: Any) -> bool:
    return checks is not None and "1992" in getattr(checks.standard, "code", "")


def _plan(ax: Any, data: FootingSketchData) -> None:
    from matplotlib.patches import Circle, FancyBboxPatch, Rectangle

    f, col = data.footing, data.footing.column
    B, L = _m(f.B), _m(f.length)
    if f.shape == "round":
        ax.add_patch(Circle((0, 0), B / 2, fill=False, lw=1.5))
    else:
        ax.add_patch(Rectangle((-B / 2, -L / 2), B, L, fill=False, lw=1.5))
    c1, c2 = _m(col.c1), _m(col.c2 if col.c2 is not None else col.c1)
    if col.shape == "round":
        ax.add_patch(Circle((0, 0), c1 / 2, color="#969696", alpha=0.8))
    else:
        ax.add_patch(Rectangle((-c1 / 2, -c2 / 2), c1, c2, color="#969696", alpha=0.8))
    if col.support == "base plate":
        p1, p2 = _m(col.loaded1), _m(col.loaded2)
        ax.add_patch(Rectangle((-p1 / 2, -p2 / 2), p1, p2, fill=False, ls="--", lw=1))
    _bars(ax, data, B, L)
    am1 = _m(moment_section(col)[0])
    d = _depth(data.checks)
    for s in (-1, 1):
        ax.plot([s * am1] * 2, [-L / 2, L / 2], color=_SECTION["M"], ls="-.", lw=1)
        if d is not None and am1 + d < B / 2:
            ax.plot([s * (am1 + d)] * 2, [-L / 2, L / 2], color=_SECTION["V"], ls=":", lw=1.2)
    ax.text(am1, L / 2, " M", color=_SECTION["M"], fontsize=7, va="bottom")
    if d is not None and am1 + d < B / 2:
        ax.text(am1 + d, L / 2, " V", color=_SECTION["V"], fontsize=7, va="bottom")
    if d is not None:
        l1, l2 = _m(col.loaded1), _m(col.loaded2)
        if _is_en(data.checks):
            r = 2 * d
            ax.add_patch(
                FancyBboxPatch(
                    (-l1 / 2, -l2 / 2),
                    l1,
                    l2,
                    boxstyle=f"round,pad={r}",
                    fill=False,
                    ec=_SECTION["P"],
                    ls="--",
                    lw=1.1,
                )
            )
            label = "u1 at 2d"
        else:
            ax.add_patch(
                Rectangle(
                    (-(l1 + d) / 2, -(l2 + d) / 2),
                    l1 + d,
                    l2 + d,
                    fill=False,
                    ec=_SECTION["P"],
                    ls="--",
                    lw=1.1,
                )
            )
            label = "b0 at d/2"
        ax.text(
            0,
            -(l2 / 2 + (2 * d if _is_en(data.checks) else d / 2)),
            label,
            color=_SECTION["P"],
            fontsize=7,
            ha="center",
            va="top",
        )
    ax.set_title(f"Plan — footing {f.mark}", fontsize=9)


def _bars(ax: Any, data: FootingSketchData, B: float, L: float) -> None:
    checks = data.checks
    nx, ny = _value(checks, "n_x"), _value(checks, "n_y")
    cover = _value(checks, "c_c", "c_nom")
    cv = _m(cover) if cover is not None else 0.075
    for n, along_x in ((nx, True), (ny, False)):
        if n is None:
            continue
        k = round(float(n.magnitude))
        width = L if along_x else B
        half = (B if along_x else L) / 2 - cv
        for i in range(k):
            t = -width / 2 + cv + (width - 2 * cv) * (i / (k - 1) if k > 1 else 0.5)
            if data.footing.shape == "round":
                r = _m(data.footing.B) / 2 - cv
                half = math.sqrt(max(r * r - t * t, 0.0))
            xs, ys = ([-half, half], [t, t]) if along_x else ([t, t], [-half, half])
            ax.plot(xs, ys, color="#2171b5", lw=0.6, alpha=0.8)


def _section(ax: Any, data: FootingSketchData) -> None:
    from matplotlib.patches import Rectangle

    f, col = data.footing, data.footing.column
    B, h, soil = _m(f.B), _m(f.h), _m(f.soil_cover)
    ax.add_patch(Rectangle((-B / 2, -h), B, h, fc="#d9d9d9", ec="black", lw=1.3))
    if soil > 0:
        ax.add_patch(
            Rectangle((-B / 2, 0), B, soil, fc="#f6e8c3", ec="none", hatch="..", alpha=0.6)
        )
    c1 = _m(col.c1)
    top = max(soil, 0.15 * B) + 0.1 * B
    ax.add_patch(Rectangle((-c1 / 2, 0), c1, top, fc="#969696", ec="black", lw=1))
    cover = _value(data.checks, "c_c", "c_nom")
    cv = _m(cover) if cover is not None else None
    if cv is not None:
        ax.plot([-B / 2 + cv, B / 2 - cv], [-h + cv] * 2, color="#2171b5", lw=1.8, zorder=4)
        ax.text(
            B / 2,
            -h + cv,
            f" bars, cover {quantity_label(cover.magnitude, cover.units)}",
            fontsize=7,
            va="center",
        )
    ax.annotate(
        "",
        (B / 2 + 0.04 * B, 0),
        (B / 2 + 0.04 * B, -h),
        arrowprops={"arrowstyle": "<->", "lw": 0.8},
    )
    ax.text(
        B / 2 + 0.06 * B,
        -h / 2,
        f"h = {quantity_label(f.h.magnitude, f.h.units)}",
        fontsize=7,
        va="center",
    )
    ax.text(
        0,
        -h - 0.03 * B,
        f"B = {quantity_label(f.B.magnitude, f.B.units)}",
        fontsize=7,
        ha="center",
        va="top",
    )
    ax.set_title("Section along x", fontsize=9)


def _pressure(ax: Any, data: FootingSketchData) -> None:
    p, f = data.pressure, data.footing
    B = _m(f.B)
    xs = [-B / 2 + B * i / 60 for i in range(61)]
    us = f.B.check("[length]") and any(
        u in f"{f.B.units}" for u in ("ft", "in", "foot", "inch", "yd")
    )
    unit = Q_(1.0, "psf").units if us else Q_(1.0, "kPa").units
    qs = [float(p.at(Q_(x, "m"), Q_(0.0, "m")).to(unit).magnitude) for x in xs]
    ax.fill_between(xs, [-q for q in qs], 0.0, color="#fdae6b", alpha=0.7, lw=0)
    ax.plot(xs, [-q for q in qs], color="#d94801", lw=1)
    ax.axhline(0.0, color="black", lw=1)
    for x, q in ((xs[0], qs[0]), (xs[-1], qs[-1])):
        ax.text(x, -q, quantity_label(q, unit), fontsize=7, ha="center", va="top")
    kind = "full contact" if p.full_contact else "partial contact (no tension)"
    ax.set_title(f"Soil pressure along x at y = 0, {kind}", fontsize=9)
    ax.set_yticks([])
    ax.set_xticks([])
    for side in ("top", "right", "left", "bottom"):
        ax.spines[side].set_visible(False)


def footing_figure_matplotlib(data: FootingSketchData) -> Any:
    """The sketch as a matplotlib Figure (Agg canvas)."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    rows = 3 if data.pressure is not None else 2
    fig = Figure(figsize=(5.0, 2.4 * rows + 1.2))
    FigureCanvasAgg(fig)
    ratios = [2.2, 1.2] + ([0.9] if rows == 3 else [])
    axes = fig.subplots(rows, 1, gridspec_kw={"height_ratios": ratios})
    f = data.footing
    B, L, h = _m(f.B), _m(f.length), _m(f.h)
    top = max(_m(f.soil_cover), 0.15 * B) + 0.1 * B
    _plan(axes[0], data)
    _section(axes[1], data)
    axes[0].set_xlim(-0.6 * B, 0.6 * B)
    axes[0].set_ylim(-0.62 * L, 0.62 * L)
    axes[1].set_xlim(-0.6 * B, 0.6 * B)
    axes[1].set_ylim(-h - 0.1 * B, top + 0.02 * B)
    if rows == 3:
        _pressure(axes[2], data)
        axes[2].set_xlim(-0.6 * B, 0.6 * B)
    for ax in axes[:2]:
        ax.set_aspect("equal", adjustable="box")
        ax.axis("off")
    fig.tight_layout()
    return fig


def footing_svg(data: FootingSketchData, settings: Any = None, **options: Any) -> str:
    """Drawing ``"footing"``: the plan, section and pressure sketch as SVG text."""
    del settings, options
    buf = io.StringIO()
    footing_figure_matplotlib(data).savefig(buf, format="svg", bbox_inches="tight")
    return buf.getvalue()


def footing_figure(
    footing: Any, *, checks: Any = None, pressure: Any = None, caption: str | None = None
) -> Any:
    """A :class:`calcpack.working.Figure` step of the footing sketch, for a sheet."""
    from calcpack.working import Figure

    data = FootingSketchData(footing, checks, pressure)
    words = caption or (
        f"Footing {footing.mark}: plan with the column, bars and critical sections (M moment, "
        "V one-way shear, punching perimeter), section, and soil pressure along x"
    )
    B, h, c1 = (
        quantity_label(q.magnitude, q.units) for q in (footing.B, footing.h, footing.column.c1)
    )
    alt = (
        f"Footing {footing.mark}, {footing.shape} {B} wide and {h} thick, column {c1}; "
        "sections for moment, shear and punching drawn on plan"
    )
    return Figure("footing", data, caption=words, alt=alt)


class FootingSketch:
    """The footing sketch in a notebook (``_repr_svg_``) or saved to a file."""

    def __init__(self, footing: Any, *, checks: Any = None, pressure: Any = None) -> None:
        self.data = FootingSketchData(footing, checks, pressure)

    def svg(self) -> str:
        return footing_svg(self.data)

    def save(self, path: str | Path) -> Path:
        out = Path(path)
        footing_figure_matplotlib(self.data).savefig(out, bbox_inches="tight")
        return out

    def _repr_svg_(self) -> str:
        return self.svg()
