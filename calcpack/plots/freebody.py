"""Free-body sketches: a body's outline, its known loads and its unknown reactions.

Reads a :class:`~calcpack.analysis.freebody.FreeBodyResult` (or a bare
:class:`~calcpack.analysis.freebody.FreeBody`). Drawn like the truss diagrams
(:mod:`calcpack.plots.truss`, whose supports, arrows and colours it shares): known loads dark,
distributed loads with their resultants dashed, unknown reactions green in their positive sense.
"""

from __future__ import annotations

import math
from typing import TYPE_CHECKING, Any

from calcpack.plots.drawing import Drawing, force_arrow
from calcpack.plots.truss import (
    _LOAD,
    _REACTION,
    _draw_support,
    _fmt_force,
)

if TYPE_CHECKING:
    from calcpack.analysis.freebody import FreeBody, FreeBodyResult

__all__ = ["FreeBodySketch"]


def _hull(points: list[tuple[float, float]]) -> list[tuple[float, float]]:
    """Convex hull (monotone chain), counter-clockwise."""
    pts = sorted(set(points))
    if len(pts) < 3:
        return pts

    def cross(o: tuple[float, float], a: tuple[float, float], b: tuple[float, float]) -> float:
        return (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0])

    lower: list[tuple[float, float]] = []
    for p in pts:
        while len(lower) >= 2 and cross(lower[-2], lower[-1], p) <= 0:
            lower.pop()
        lower.append(p)
    upper: list[tuple[float, float]] = []
    for p in reversed(pts):
        while len(upper) >= 2 and cross(upper[-2], upper[-1], p) <= 0:
            upper.pop()
        upper.append(p)
    return lower[:-1] + upper[:-1]


class FreeBodySketch(Drawing):
    """A sketch of a free body: its outline (through its support and load points), known loads
    (dark), distributed loads with their resultants (dashed), couples, and the unknown
    reactions in their positive sense (green), labelled with their values when solved.

    Args:
        subject: a :class:`FreeBodyResult` or a :class:`FreeBody`.
        width_in: figure width in inches.
    """

    def __init__(self, subject: FreeBodyResult | FreeBody, *, width_in: float = 7.0) -> None:
        from calcpack.analysis.freebody import FreeBody

        if isinstance(subject, FreeBody):
            self.body, self.result = subject, None
        else:
            self.body, self.result = subject.body, subject
        self.width_in = width_in

    def figure(self) -> Any:
        """The sketch as a matplotlib Figure (Agg canvas)."""
        from matplotlib.backends.backend_agg import FigureCanvasAgg
        from matplotlib.figure import Figure
        from matplotlib.patches import Polygon

        from calcpack.analysis.freebody import DistributedLoad
        from calcpack.units import get_display, si

        sig = get_display().sig_figs
        body = self.body
        pts = [p for _, p in body.named_points()]
        pts += [(si(f.x), si(f.y)) for f in body.point_loads()]
        for ld in body.loads:
            if isinstance(ld, DistributedLoad):
                pts += [(si(ld.x1), si(ld.y1)), (si(ld.x2), si(ld.y2))]
        size = body.scale_m()
        arrow = 0.15 * size
        fig = Figure(figsize=(self.width_in, self.width_in * 0.6))
        FigureCanvasAgg(fig)
        ax = fig.add_subplot(1, 1, 1)
        ax.set_aspect("equal")
        ax.axis("off")
        hull = _hull(pts)
        area = 0.0
        if len(hull) >= 3:
            area = (
                abs(
                    sum(
                        hull[i][0] * hull[i - 1][1] - hull[i - 1][0] * hull[i][1]
                        for i in range(len(hull))
                    )
                )
                / 2
            )
        if area > 1e-3 * size**2:
            ax.add_patch(Polygon(hull, closed=True, fc="#eef1f4", ec="#555555", lw=1.5, zorder=0))
        elif hull:
            xs, ys = zip(*hull, strict=True)
            ax.plot(
                [min(xs), max(xs)],
                [ys[xs.index(min(xs))], ys[xs.index(max(xs))]],
                color="#555555",
                lw=4,
                solid_capstyle="butt",
                zorder=0,
            )
        for sup in body.supports:
            at = (si(sup.x), si(sup.y))
            theta = float(sup.angle.to("radian").magnitude)
            if sup.kind in ("pin", "roller", "fixed"):
                _draw_support(ax, sup.kind, theta if sup.kind == "roller" else 0.0, at, size)
            ax.annotate(sup.name, at, textcoords="offset points", xytext=(6, 6), fontsize=8)
        for ld in body.loads:
            if isinstance(ld, DistributedLoad):
                a, b = (si(ld.x1), si(ld.y1)), (si(ld.x2), si(ld.y2))
                th = float(ld.angle.to("radian").magnitude)
                d = (math.cos(th), math.sin(th))
                for k in range(7):
                    t = k / 6
                    tip = (a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1]))
                    force_arrow(ax, tip, d, 0.5 * arrow, _LOAD, "")
                ax.text(
                    a[0] + 0.25 * (b[0] - a[0]) - d[0] * 0.6 * arrow,
                    a[1] + 0.25 * (b[1] - a[1]) - d[1] * 0.6 * arrow,
                    f"{ld.label} = {ld.w1:.{sig}g~P}",
                    fontsize=8,
                    ha="center",
                    va="bottom",
                    color=_LOAD,
                )
        for f in body.point_loads():
            fx, fy = si(f.Fx), si(f.Fy)
            mag = math.hypot(fx, fy)
            if mag == 0:
                continue
            dashed = f.label.startswith("W_")
            colour = "#7a7f87" if dashed else _LOAD
            force_arrow(
                ax,
                (si(f.x), si(f.y)),
                (fx / mag, fy / mag),
                arrow * (1.3 if dashed else 1.0),
                colour,
                f"{f.label} = {_fmt_force(mag / 1e3, 'kN', sig)}",
            )
        cx = float(sum(p[0] for p in pts) / len(pts))
        cy = float(sum(p[1] for p in pts) / len(pts))
        for n, c in enumerate(body.couples()):
            ax.text(
                cx,
                cy - (0.45 + 0.25 * n) * arrow,
                f"↺ {c.label} = {c.M.to('kN*m'):.{sig}g~P}",
                fontsize=8,
                ha="center",
                va="top",
                color=_LOAD,
            )
        for u in body.unknowns():
            value = self.result.reactions[u.name] if self.result is not None else None
            text = u.name if value is None else f"{u.name} = {value:.{sig}g~P}"
            if u.direction is None:
                ax.annotate(
                    f"↺ {text}",
                    u.point,
                    textcoords="offset points",
                    xytext=(-10, -28),
                    fontsize=8,
                    color=_REACTION,
                )
                continue
            tip = (
                u.point[0] - u.direction[0] * 0.25 * arrow,
                u.point[1] - u.direction[1] * 0.25 * arrow,
            )
            force_arrow(ax, tip, u.direction, arrow, _REACTION, text)
        ax.margins(0.15)
        ax.autoscale_view()
        ax.set_title(f"Free body: {body.name}", fontsize=10)
        fig.tight_layout()
        return fig
