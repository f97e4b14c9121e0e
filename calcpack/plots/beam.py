"""The stacked beam figure: loading diagram, shear, bending moment and deflected shape.

Drawn with matplotlib's object interface (no pyplot state, so nothing leaks into a notebook's
own figures) and rendered as SVG for the PDF and inline display. Reads results only.

Conventions drawn: loads downward as arrows pointing down; shear positive when the left face
of an element is pushed up (the small sketch in the shear panel's label), bending moment
sagging positive plotted above the axis, displacement plotted upward positive so the drawn
shape matches the beam (a downward deflection δ appears below the axis and is labelled
"down").
"""

from __future__ import annotations

import io
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

import numpy as np
from matplotlib.figure import Figure
from matplotlib.patches import Arc, Circle, FancyArrowPatch, Polygon, Rectangle

from calcpack.loads.types import DistributedLoad, PointLoad, PointMoment
from calcpack.units import get_display, ureg

if TYPE_CHECKING:
    from calcpack.analysis.beam.result import BeamResult

__all__ = ["BeamFigure", "beam_figure", "beam_svg"]

_BLUE = "#1f4e79"
_RED = "#a32020"
_GREEN = "#2e6b30"
_GREY = "#555555"


@dataclass(frozen=True, eq=False)
class BeamFigure:
    """A rendered beam figure: ``svg`` text, and the matplotlib ``figure`` for further work."""

    svg: str
    figure: Any

    def _repr_svg_(self) -> str:
        return self.svg

    def _repr_mimebundle_(self, include: Any = None, exclude: Any = None) -> dict[str, Any]:
        return {"image/svg+xml": self.svg}

    def save(self, path: str) -> None:
        """Write the SVG to ``path``."""
        with open(path, "w", encoding="utf-8") as fh:
            fh.write(self.svg)


@dataclass(frozen=True)
class _Units:
    """Display units of the figure; each ``*_si`` is the size of one display unit in SI."""

    length: str
    force: str
    moment: str
    line: str
    deflection: str

    def si(self, unit: str) -> float:
        return float(ureg.Quantity(1.0, unit).to_base_units().magnitude)

    def label(self, unit: str) -> str:
        return f"{ureg.Unit(unit):~P}".replace("ft·kip", "kip·ft").replace("in", "in")


_SYSTEM_UNITS = {
    "SI": _Units("m", "kN", "kN*m", "kN/m", "mm"),
    "US": _Units("ft", "kip", "kip*ft", "klf", "inch"),
}


def _fmt(value: float, sig: int) -> str:
    """A value on a figure, by the one number formatter of the working."""
    from calcpack.working.format import format_number

    return format_number(float(value), sig)


def _sample(X: np.ndarray, g: np.ndarray, per_segment: int = 40) -> tuple[np.ndarray, np.ndarray]:
    """Points along each segment (both ends), so jumps show as vertical lines."""
    xs, ys = [], []
    for j in range(len(X) - 1):
        xi = np.linspace(0.0, X[j + 1] - X[j], per_segment)
        xs.append(X[j] + xi)
        ys.append(np.polynomial.polynomial.polyval(xi, g[j]))
    return np.concatenate(xs), np.concatenate(ys)


def _support(ax: Any, kind: str, x: float, size: float, at_left: bool, at_right: bool) -> None:
    s = size
    if kind == "fixed" and (at_left or at_right):
        sign = -1.0 if at_left else 1.0
        ax.plot([x, x], [-1.6 * s, 1.6 * s], color="black", lw=2.0)
        for k in np.linspace(-1.4 * s, 1.6 * s, 7):
            ax.plot([x, x + sign * 0.6 * s], [k, k - 0.5 * s], color="black", lw=0.8)
        return
    if kind == "fixed":
        ax.add_patch(Rectangle((x - 0.5 * s, -1.2 * s), s, 2.4 * s, fill=False, hatch="////"))
        return
    if kind == "spring":
        zig_x = x + 0.35 * s * np.array([0, 0, 1, -1, 1, -1, 1, 0, 0])
        zig_y = -np.linspace(0, 2.2 * s, 9)
        ax.plot(zig_x, zig_y, color="black", lw=1.0)
        ax.plot([x - 0.8 * s, x + 0.8 * s], [-2.2 * s, -2.2 * s], color="black", lw=1.2)
        return
    tri = Polygon(
        [[x, 0.0], [x - 0.7 * s, -1.2 * s], [x + 0.7 * s, -1.2 * s]],
        closed=True,
        fill=False,
        edgecolor="black",
        lw=1.2,
    )
    ax.add_patch(tri)
    base = -1.2 * s
    if kind == "roller":
        for dx in (-0.35 * s, 0.35 * s):
            ax.add_patch(Circle((x + dx, base - 0.25 * s), 0.22 * s, fill=False, lw=1.0))
        base -= 0.5 * s
    ax.plot([x - s, x + s], [base, base], color="black", lw=1.2)
    for k in np.linspace(x - s, x + 0.8 * s, 6):
        ax.plot([k, k + 0.25 * s], [base, base - 0.35 * s], color="black", lw=0.7)


def _loading(
    ax: Any, result: BeamResult, sig: int, aspect: float, u: _Units, *, by_case: bool = False
) -> None:
    """Draw the beam, its supports and its loads (factored by ``result.cases``); with
    ``by_case`` each load's label starts with its load case."""
    beam = result.beam
    L = beam.L_m
    factors = dict(result.cases)
    ax.plot([0, L], [0, 0], color="black", lw=3.0, solid_capstyle="butt")
    size = 0.035 * L
    for s in beam.supports:
        _support(ax, s.kind, s.x_m, size, s.x_m <= 1e-9 * L, s.x_m >= L * (1 - 1e-9))
        ax.text(s.x_m, -3.2 * size, s.label, ha="center", va="top", fontsize=8, color=_GREY)
    for h in beam.hinges:
        ax.add_patch(
            Circle(
                (h.x_m, 0.0), 0.35 * size, facecolor="white", edgecolor="black", lw=1.2, zorder=5
            )
        )
    # distributed loads, drawn above the beam, height proportional to the factored intensity
    dist = [ld for ld in beam.loads if isinstance(ld, DistributedLoad) and ld.case in factors]
    wmax = 0.0
    shapes = []
    for ld in dist:
        f = factors[ld.case]
        xs = np.linspace(ld.a_m, ld.b_m, 60)
        ws = f * ld.intensity_si(xs)
        shapes.append((ld, xs, ws))
        wmax = max(wmax, float(np.max(np.abs(ws))))
    level = 0.6 * size
    height = 2.4 * size  # each distributed load in its own band, stacked like the trade does
    for _ld, xs, ws in shapes:
        top = level + height * ws / wmax if wmax else level + 0 * ws
        poly = np.column_stack(
            [np.concatenate([xs, xs[::-1]]), np.concatenate([top, np.full_like(xs, level)])]
        )
        ax.add_patch(Polygon(poly, closed=True, facecolor="#dbe7f3", edgecolor=_BLUE, lw=0.8))
        for xa in np.linspace(xs[0], xs[-1], max(3, int(12 * (xs[-1] - xs[0]) / L) + 2)):
            wa = np.interp(xa, xs, top)
            if abs(wa - level) > 0.2 * size:
                ax.add_patch(
                    FancyArrowPatch(
                        (xa, wa),
                        (xa, level),
                        arrowstyle="-|>",
                        mutation_scale=6,
                        color=_BLUE,
                        lw=0.6,
                    )
                )
        w1, w2 = ws[0] / u.si(u.line), ws[-1] / u.si(u.line)
        wl = u.label(u.line)
        label = ((f"{_ld.case}: ") if by_case else "") + (
            f"{_fmt(w1, sig)} {wl}"
            if abs(w1 - w2) <= 1e-9 * max(abs(w1), abs(w2), 1)
            else f"{_fmt(w1, sig)} → {_fmt(w2, sig)} {wl}"
        )
        ax.text(
            0.5 * (xs[0] + xs[-1]),
            float(np.max(top)) + 0.4 * size,
            label,
            ha="center",
            va="bottom",
            fontsize=7,
            color=_BLUE,
        )
        level = float(max(np.max(top), level)) + 1.6 * size
    # point loads and couples
    ptop = level + 1.5 * size
    point_labels: dict[tuple[float, bool], Any] = {}
    for pl in beam.loads:
        if pl.case not in factors:
            continue
        f = factors[pl.case]
        if isinstance(pl, PointLoad):
            P = f * pl.P.to(u.force).magnitude
            H = f * pl.H.to(u.force).magnitude
            x = pl.x.to("m").magnitude
            if P == 0 and H == 0:
                continue
            length = max(level, 3.0 * size) + 0.8 * size
            direction = np.array([H, -P]) / np.hypot(H, P)
            tail = np.array([x, 0.0]) - direction * length
            ax.add_patch(
                FancyArrowPatch(
                    tuple(tail),
                    (x, 0.0),
                    arrowstyle="-|>",
                    mutation_scale=10,
                    color=_RED,
                    lw=1.3,
                    zorder=6,
                )
            )
            text = (f"{pl.case}: " if by_case else "") + (
                f"{_fmt(np.hypot(P, H), sig)} {u.label(u.force)}"
            )
            key = (round(x / L, 6), P >= 0)
            if key in point_labels:  # loads at one point share one label, a line each
                point_labels[key].set_text(point_labels[key].get_text() + "\n" + text)
                continue
            point_labels[key] = ax.text(
                tail[0],
                tail[1] + (0.3 * size if P >= 0 else -0.3 * size),
                text,
                ha="center",
                va="bottom" if P >= 0 else "top",
                fontsize=7,
                color=_RED,
            )
        elif isinstance(pl, PointMoment):
            C = f * pl.C.to(u.moment).magnitude
            x = pl.x.to("m").magnitude
            r = 1.6 * size
            # clockwise couple: arrow head at the right going down
            arc = Arc((x, 0.0), 2 * r, 2 * r * aspect, theta1=20, theta2=160, color=_GREEN, lw=1.2)
            ax.add_patch(arc)
            head_x = x + r * np.cos(np.radians(20 if C > 0 else 160))
            head_y = r * aspect * np.sin(np.radians(20))
            dx = 0.01 * L * (1 if C > 0 else -1)
            ax.add_patch(
                FancyArrowPatch(
                    (head_x - 0.3 * dx, head_y + 0.3 * size),
                    (head_x + 0.2 * dx, head_y - 0.2 * size),
                    arrowstyle="-|>",
                    mutation_scale=8,
                    color=_GREEN,
                )
            )
            ax.text(
                x,
                r * aspect + 0.3 * size,
                f"{_fmt(abs(C), sig)} {u.label(u.moment)} "
                f"{'clockwise' if C > 0 else 'anticlockwise'}",
                ha="center",
                va="bottom",
                fontsize=7,
                color=_GREEN,
            )
    ax.set_ylim(-5.0 * size, ptop + 2.5 * size)
    ax.set_yticks([])
    for side in ("left", "right", "top"):
        ax.spines[side].set_visible(False)
    ax.set_title(f"{beam.name}: loading ({result.label})", fontsize=9, loc="left")


def _diagram(
    ax: Any,
    X: np.ndarray,
    g: np.ndarray,
    scale: float,
    color: str,
    ylabel: str,
    notes: list[tuple[float, float, str]],
) -> None:
    xs, ys = _sample(X, g)
    ys = ys * scale
    ax.fill_between(xs, ys, 0.0, color=color, alpha=0.18, lw=0)
    ax.plot(xs, ys, color=color, lw=1.3)
    ax.axhline(0.0, color="black", lw=0.6)
    ax.set_ylabel(ylabel, fontsize=8)
    span = float(np.max(np.abs(ys))) or 1.0
    ax.set_ylim(float(np.min(ys)) - 0.3 * span, float(np.max(ys)) + 0.3 * span)
    for x, y, text in notes:
        ax.plot([x], [y], "o", color=color, ms=3)
        ax.annotate(
            text,
            (x, y),
            textcoords="offset points",
            xytext=(0, 6 if y >= 0 else -11),
            ha="center",
            fontsize=7,
            color=color,
        )
    ax.grid(True, lw=0.3, alpha=0.5)
    ax.tick_params(labelsize=7)


def beam_figure(
    result: BeamResult,
    *,
    width_in: float = 7.0,
    sig_figs: int | None = None,
    system: str | None = None,
) -> BeamFigure:
    """The stacked loading / shear / moment / deflection figure of ``result``, as SVG.

    Args:
        result: a solved beam. width_in: figure width in inches. sig_figs: digits shown
            (default: the global display setting, 3). system: ``"SI"`` (kN, kN·m, m, mm) or
            ``"US"`` (kip, kip·ft, ft, in); default: the global display setting.
    """
    from matplotlib.ticker import FixedLocator, FuncFormatter

    from calcpack.plots.labels import round_ticks, tick_text

    display = get_display()
    sig = sig_figs or display.sig_figs
    u = _SYSTEM_UNITS.get(system or display.system, _SYSTEM_UNITS["SI"])
    f_len, f_force, f_mom = u.si(u.length), u.si(u.force), u.si(u.moment)
    f_defl = u.si(u.deflection)
    lu, fu, mu, du = (u.label(x) for x in (u.length, u.force, u.moment, u.deflection))
    core = result.core
    X = core.X
    L = X[-1]
    ex = result.extremes
    panels = 4 if result.has_deflection else 3
    fig = Figure(figsize=(width_in, 1.9 * panels + 0.6), layout="constrained")
    axes = fig.subplots(
        panels, 1, sharex=True, gridspec_kw={"height_ratios": [1.3] + [1.0] * (panels - 1)}
    )
    _loading(axes[0], result, sig, aspect=1.0, u=u)

    notes_v: list[tuple[float, float, str]] = []
    for e in (ex.V_max, ex.V_min):
        v = e.value_si / f_force
        notes_v.append((e.x_m, v, f"{_fmt(v, sig)} {fu}"))
    for s in result.beam.supports:  # shear either side of each support
        for side in ("left", "right"):
            if (side == "left" and s.x_m <= 0) or (side == "right" and s.x_m >= L):
                continue
            v = float(result.shear(s.x, side=side).to(u.force).magnitude)
            if abs(v) > 1e-9 and all(
                abs(v - n[1]) > 1e-9 or abs(s.x_m - n[0]) > 1e-9 for n in notes_v
            ):
                notes_v.append((s.x_m, v, f"{_fmt(v, sig)}"))
    _diagram(axes[1], X, core.V, 1 / f_force, _BLUE, f"V ({fu})\nleft face up +", notes_v)
    for x0 in ex.zero_shear_m:
        axes[1].axvline(x0, color=_BLUE, lw=0.5, ls=":")

    notes_m = []
    for e in (ex.M_max, ex.M_min):
        mval = e.value_si / f_mom
        if abs(mval) > 1e-12:
            at = _fmt(e.x_m / f_len, sig)
            notes_m.append((e.x_m, mval, f"{_fmt(mval, sig)} {mu}\nat x = {at} {lu}"))
    for x0 in ex.contraflexure_m:
        notes_m.append((x0, 0.0, f"M = 0 at {_fmt(x0 / f_len, sig)} {lu}"))
    _diagram(axes[2], X, core.M, 1 / f_mom, _RED, f"M ({mu})\nsagging +", notes_m)

    if result.has_deflection and core.v is not None:
        notes_d = []
        if ex.deflection_down is not None:
            d = ex.deflection_down
            notes_d.append(
                (
                    d.x_m,
                    -d.value_si / f_defl,
                    f"δ = {_fmt(d.value_si / f_defl, sig)} {du} down\n"
                    f"at x = {_fmt(d.x_m / f_len, sig)} {lu}",
                )
            )
        if ex.deflection_up is not None:
            up = ex.deflection_up
            notes_d.append(
                (up.x_m, up.value_si / f_defl, f"{_fmt(up.value_si / f_defl, sig)} {du} up")
            )
        _diagram(axes[3], X, core.v, 1 / f_defl, _GREEN, f"displacement ({du})\nup +", notes_d)
    axes[-1].set_xlabel(f"x from left end ({lu})", fontsize=8)
    axes[-1].xaxis.set_major_locator(FixedLocator(list(round_ticks(0.0, L / f_len, n=10) * f_len)))
    axes[-1].xaxis.set_major_formatter(FuncFormatter(lambda v, _pos: tick_text(v / f_len)))
    for ax in axes[1:]:
        for s in result.beam.supports:
            ax.axvline(s.x_m, color=_GREY, lw=0.5, ls="--")
    axes[0].set_xlim(-0.04 * L, 1.04 * L)
    buf = io.StringIO()
    fig.savefig(buf, format="svg")
    return BeamFigure(svg=buf.getvalue(), figure=fig)


def beam_svg(result: BeamResult, settings: Any = None) -> str:
    """The stacked figure of ``result`` as SVG, in the units and figures of ``settings``."""
    if settings is None:
        return beam_figure(result).svg
    return beam_figure(result, sig_figs=settings.sig_figs, system=settings.system).svg
