"""Truss diagrams: the truss drawn to scale with supports, loads, reactions and member forces.

Reads a :class:`~calcpack.analysis.truss_solve.TrussResult` (or a bare
:class:`~calcpack.analysis.truss_model.Truss` for its geometry and loads). Drawn with
matplotlib's object interface on an Agg canvas (no pyplot, no GUI backend) and written as SVG;
in Jupyter the diagram shows inline through ``_repr_svg_``.

Colour and line code (stated in the legend): tension members solid blue, compression members
solid red, zero-force members dashed grey; loads dark arrows ending at their joint, reactions
green arrows. Arrow lengths are a fixed fraction of the truss size (the labels carry the
values); the geometry is to scale.
"""

from __future__ import annotations

import io
import math
from pathlib import Path
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    from calcpack.analysis.truss_model import Truss
    from calcpack.analysis.truss_solve import TrussResult

__all__ = ["TrussDiagram"]

_TENSION = "#1f5fa8"
_COMPRESSION = "#c0392b"
_ZERO = "#8a8f96"
_LOAD = "#222222"
_REACTION = "#1e8449"


def _fmt_force(value_kN: float, unit: str, sig: int) -> str:
    if value_kN == 0:
        return f"0 {unit}"
    digits = max(sig - 1 - math.floor(math.log10(abs(value_kN))), 0)
    return f"{abs(value_kN):.{digits}f} {unit}"


class TrussDiagram:
    """A to-scale drawing of a truss and, when given a result, its member forces.

    Args:
        subject: a :class:`TrussResult` (forces and reactions labelled) or a :class:`Truss`.
        title: the figure title (default: the truss name and load case).
        width_in: figure width in inches (height follows the truss's proportions).
        show_forces: label members with force and T/C.
        show_names: label joints and members by name.
        force_unit: the unit member forces and loads are labelled in (default kN, or kip when
            the display system is US).
    """

    def __init__(
        self,
        subject: TrussResult | Truss,
        *,
        title: str | None = None,
        width_in: float = 9.0,
        show_forces: bool = True,
        show_names: bool = True,
        force_unit: str | None = None,
    ) -> None:
        from calcpack.analysis.truss_model import Truss
        from calcpack.units import get_display

        if isinstance(subject, Truss):
            self.truss = subject
            self.result: TrussResult | None = None
        else:
            self.truss = subject.truss
            self.result = subject
        self.title = title
        self.width_in = width_in
        self.show_forces = show_forces
        self.show_names = show_names
        self.force_unit = force_unit or ("kip" if get_display().system == "US" else "kN")
        self.sig = get_display().sig_figs

    # -- output ---------------------------------------------------------------------------

    def figure(self) -> Any:
        """The diagram as a matplotlib Figure (Agg canvas)."""
        from matplotlib.backends.backend_agg import FigureCanvasAgg
        from matplotlib.figure import Figure

        xy = self.truss.xy_m
        span = xy.max(axis=0) - xy.min(axis=0)
        size = max(float(math.hypot(*span)), 1e-9)
        w = max(float(span[0]), 0.3 * size)
        h = max(float(span[1]), 0.3 * size)
        aspect = (h + 0.7 * size) / (w + 0.7 * size)
        fig = Figure(figsize=(self.width_in, max(self.width_in * aspect, 3.0)))
        FigureCanvasAgg(fig)
        ax = fig.add_subplot(1, 1, 1)
        ax.set_aspect("equal")
        ax.axis("off")
        self._draw(ax, size)
        ax.margins(0.12)
        ax.autoscale_view()
        label = self.title
        if label is None:
            label = self.truss.name + (f" — {self.result.label}" if self.result else "")
        ax.set_title(label, fontsize=11)
        fig.tight_layout()
        return fig

    def svg(self) -> str:
        """The diagram as an SVG document."""
        buf = io.StringIO()
        self.figure().savefig(buf, format="svg", bbox_inches="tight")
        return buf.getvalue()

    def save(self, path: str | Path) -> Path:
        """Write the diagram (SVG, or PNG/PDF by the file's suffix) and return the path."""
        out = Path(path)
        self.figure().savefig(out, bbox_inches="tight")
        return out

    def _repr_svg_(self) -> str:
        return self.svg()

    # -- drawing ----------------------------------------------------------------------------

    def _kN_to_unit(self, kN: float) -> float:
        from calcpack.units import ureg

        return float((kN * ureg.kN).to(self.force_unit).magnitude)

    def _draw(self, ax: Any, size: float) -> None:
        truss, result = self.truss, self.result
        xy = truss.xy_m
        arrow = 0.12 * size
        seen: set[str] = set()
        for k, m in enumerate(truss.members):
            s, e = truss.member_ends[k]
            (x0, y0), (x1, y1) = xy[s], xy[e]
            colour, style, nat = _ZERO, "-", ""
            if result is not None:
                nat = result.nature(m.name)
                colour = {"T": _TENSION, "C": _COMPRESSION, "0": _ZERO}[nat]
                style = "--" if nat == "0" else "-"
            legend = {"T": "tension", "C": "compression", "0": "zero force"}.get(nat)
            ax.plot(
                [x0, x1],
                [y0, y1],
                style,
                color=colour,
                lw=2.2,
                zorder=2,
                label=legend if legend and legend not in seen else None,
            )
            if legend:
                seen.add(legend)
            parts = []
            if self.show_names:
                parts.append(m.name)
            if result is not None and self.show_forces:
                f = self._kN_to_unit(float(result.forces[m.name].to("kN").magnitude))
                parts.append(f"{_fmt_force(f, self.force_unit, self.sig)} {nat}".strip())
            if parts:
                angle = math.degrees(math.atan2(y1 - y0, x1 - x0))
                if angle > 90:
                    angle -= 180
                if angle < -90:
                    angle += 180
                ax.text(
                    (x0 + x1) / 2,
                    (y0 + y1) / 2,
                    "\n".join(parts),
                    rotation=angle,
                    rotation_mode="anchor",
                    ha="center",
                    va="center",
                    fontsize=7,
                    color=colour,
                    zorder=5,
                    bbox={"boxstyle": "round,pad=0.15", "fc": "white", "ec": "none", "alpha": 0.85},
                )
        ax.plot(xy[:, 0], xy[:, 1], "o", color="#333333", ms=4, zorder=3)
        if self.show_names:
            for i, n in enumerate(truss.nodes):
                ax.annotate(
                    n.name,
                    (xy[i, 0], xy[i, 1]),
                    textcoords="offset points",
                    xytext=(5, 5),
                    fontsize=8,
                    color="#333333",
                    zorder=6,
                )
        for sup in truss.supports:
            self._support(ax, sup, xy[truss.node_index[sup.node]], size)
        self._loads(ax, arrow)
        self._reactions(ax, arrow)
        if seen:
            ax.legend(loc="upper right", fontsize=7, frameon=False)

    def _support(self, ax: Any, sup: Any, at: Any, size: float) -> None:
        from matplotlib.patches import Circle, Polygon

        theta = float(sup.surface.to("radian").magnitude) if sup.kind == "roller" else 0.0
        c, s = math.cos(theta), math.sin(theta)
        t = 0.035 * size

        def rot(px: float, py: float) -> tuple[float, float]:
            return float(at[0] + c * px - s * py), float(at[1] + s * px + c * py)

        tri = [rot(0, 0), rot(-t, -1.4 * t), rot(t, -1.4 * t)]
        ax.add_patch(Polygon(tri, closed=True, fc="#dddddd", ec="#333333", lw=1, zorder=1))
        base = -1.4 * t
        if sup.kind == "roller":
            r = 0.28 * t
            for px in (-0.55 * t, 0.55 * t):
                ax.add_patch(Circle(rot(px, base - r), r, fc="white", ec="#333333", lw=1, zorder=1))
            base -= 2 * r
        g0, g1 = rot(-1.5 * t, base), rot(1.5 * t, base)
        ax.plot([g0[0], g1[0]], [g0[1], g1[1]], color="#333333", lw=1.2, zorder=1)

    def _arrow(
        self,
        ax: Any,
        tip: tuple[float, float],
        d: tuple[float, float],
        length: float,
        colour: str,
        text: str,
        *,
        label_at_tip: bool = False,
    ) -> None:
        tail = (tip[0] - d[0] * length, tip[1] - d[1] * length)
        ax.annotate(
            "",
            xy=tip,
            xytext=tail,
            zorder=4,
            arrowprops={"arrowstyle": "-|>", "color": colour, "lw": 1.6},
        )
        # The label sits beyond the arrow's outer end, on the side away from the joint.
        out = (-d[0], -d[1]) if not label_at_tip else d
        end = tail if not label_at_tip else tip
        ha = "right" if out[0] < -0.5 else "left" if out[0] > 0.5 else "center"
        va = "top" if out[1] < -0.5 else "bottom" if out[1] > 0.5 else "center"
        at = (end[0] + out[0] * 0.05 * length, end[1] + out[1] * 0.05 * length)
        ax.text(at[0], at[1], text, fontsize=7, color=colour, ha=ha, va=va, zorder=6)
        # Annotations do not widen the axes; the arrow's ends and label must stay in view.
        ax.update_datalim(
            [tail, tip, (at[0] + out[0] * 0.3 * length, at[1] + out[1] * 0.3 * length)]
        )

    def _loads(self, ax: Any, arrow: float) -> None:
        truss = self.truss
        xy = truss.xy_m
        p = self.result.loads_N() if self.result is not None else truss.load_vector()
        for i in range(len(truss.nodes)):
            fx, fy = float(p[2 * i]), float(p[2 * i + 1])
            mag = math.hypot(fx, fy)
            if mag == 0:
                continue
            d = (fx / mag, fy / mag)
            value = self._kN_to_unit(mag / 1e3)
            node = (float(xy[i, 0]), float(xy[i, 1]))
            # Draw the arrow on the outside of the truss: ending at the joint (pushing) when
            # its tail then lies away from the centre, else leaving the joint (pulling, e.g.
            # a load hung under the bottom chord).
            cx, cy = (float(v) for v in xy.mean(axis=0))
            push_tail = (node[0] - d[0] * arrow, node[1] - d[1] * arrow)
            pull_tip = (node[0] + d[0] * arrow, node[1] + d[1] * arrow)
            pulling = (
                math.hypot(pull_tip[0] - cx, pull_tip[1] - cy)
                > math.hypot(push_tail[0] - cx, push_tail[1] - cy) + 1e-9 * arrow
            )
            if pulling:
                text = _fmt_force(value, self.force_unit, self.sig)
                self._arrow(ax, pull_tip, d, arrow, _LOAD, text, label_at_tip=True)
                continue
            self._arrow(ax, node, d, arrow, _LOAD, _fmt_force(value, self.force_unit, self.sig))

    def _reactions(self, ax: Any, arrow: float) -> None:
        if self.result is None:
            return
        truss = self.truss
        xy = truss.xy_m
        for rec in self.result.reactions.values():
            v = float(rec.value.to("kN").magnitude)
            if v == 0:
                continue
            i = truss.node_index[rec.node]
            sign = 1.0 if v > 0 else -1.0
            d = (sign * rec.direction[0], sign * rec.direction[1])
            # Drawn pushing on the joint from outside, set off below the support symbol.
            tip = (
                float(xy[i, 0]) - d[0] * 0.06 * arrow * 8,
                float(xy[i, 1]) - d[1] * 0.06 * arrow * 8,
            )
            label = (
                f"{rec.name} = {_fmt_force(self._kN_to_unit(abs(v)), self.force_unit, self.sig)}"
            )
            self._arrow(ax, tip, d, arrow, _REACTION, label)
