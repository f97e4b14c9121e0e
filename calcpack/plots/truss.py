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

import itertools
import math
from typing import TYPE_CHECKING, Any

from calcpack.plots.drawing import Drawing, force_arrow

if TYPE_CHECKING:
    from calcpack.analysis.truss_model import Truss
    from calcpack.analysis.truss_solve import TrussResult

__all__ = ["TrussDiagram", "truss_svg"]

_TENSION = "#1f5fa8"
_COMPRESSION = "#c0392b"
_ZERO = "#8a8f96"
_LOAD = "#222222"
_REACTION = "#1e8449"


def _ureg() -> Any:
    from calcpack.units import ureg

    return ureg


def _fmt_force(value: float, unit: str, sig: int) -> str:
    """A force's size by the one number formatter of the working (the sign is shown as T/C or
    by the arrow)."""
    from calcpack.working.format import format_number

    return f"{format_number(abs(value), sig)} {unit}"


def _draw_support(ax: Any, kind: str, theta: float, at: tuple[float, float], size: float) -> None:
    """A pin (triangle), roller (triangle on wheels, surface at theta) or fixed support."""
    from matplotlib.patches import Circle, Polygon, Rectangle

    if kind == "fixed":
        t = 0.035 * size
        ax.add_patch(
            Rectangle(
                (at[0] - 0.6 * t, at[1] - 1.5 * t),
                0.6 * t,
                3 * t,
                fc="#dddddd",
                ec="#333333",
                lw=1,
                hatch="///",
                zorder=1,
            )
        )
        return

    c, s = math.cos(theta), math.sin(theta)
    t = 0.035 * size

    def rot(px: float, py: float) -> tuple[float, float]:
        return float(at[0] + c * px - s * py), float(at[1] + s * px + c * py)

    tri = [rot(0, 0), rot(-t, -1.4 * t), rot(t, -1.4 * t)]
    ax.add_patch(Polygon(tri, closed=True, fc="#dddddd", ec="#333333", lw=1, zorder=1))
    base = -1.4 * t
    if kind == "roller":
        r = 0.28 * t
        for px in (-0.55 * t, 0.55 * t):
            ax.add_patch(Circle(rot(px, base - r), r, fc="white", ec="#333333", lw=1, zorder=1))
        base -= 2 * r
    g0, g1 = rot(-1.5 * t, base), rot(1.5 * t, base)
    ax.plot([g0[0], g1[0]], [g0[1], g1[1]], color="#333333", lw=1.2, zorder=1)


class TrussDiagram(Drawing):
    """A to-scale drawing of a truss and, when given a result, its member forces.

    Args:
        subject: a :class:`TrussResult` (forces and reactions labelled) or a :class:`Truss`.
        title: the figure title (default: the truss name and load case).
        width_in: figure width in inches (height follows the truss's proportions).
        show_forces: label members with force and T/C.
        show_names: label joints and members by name.
        force_unit: the unit member forces and loads are labelled in (default kN, or kip when
            the display system is US).
        case: draw only the loads of this load case (a truss; default every load as given).
        loads: draw the loads (False for the bare geometry).
        dimensions: draw dimension chains of the joints' positions (in the display length
            unit) below and beside the truss.
    """

    searchable_text = True  # member forces and joint names can be searched in the PDF

    def __init__(
        self,
        subject: TrussResult | Truss,
        *,
        title: str | None = None,
        width_in: float = 9.0,
        show_forces: bool = True,
        show_names: bool = True,
        force_unit: str | None = None,
        case: str | None = None,
        loads: bool = True,
        dimensions: bool = False,
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
        self.length_unit = "ft" if get_display().system == "US" else "m"
        self.sig = get_display().sig_figs
        if case is not None and case not in self.truss.load_cases:
            from calcpack.errors import InputError

            raise InputError(
                f"Load case {case!r} is not a case of truss {self.truss.name} (got case = "
                f"{case!r}; cases: {', '.join(self.truss.load_cases)})",
                name="case",
                value=case,
                expected=", ".join(self.truss.load_cases),
            )
        self.case = case
        self.loads = loads
        self.dimensions = dimensions

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
            if self.result is None and self.case is not None:
                label += f" — loads of case {self.case}, unfactored"
        ax.set_title(label, fontsize=11)
        fig.tight_layout()
        if self.show_names:
            from calcpack.plots.labels import Label, place_labels

            names = [
                Label(ax, float(xy[i, 0]), float(xy[i, 1]), n.name, "#333333", 8.0, gap)
                for i, (n, gap) in enumerate(zip(self.truss.nodes, self._gaps(), strict=True))
            ]
            place_labels(fig, names, gid="cp-joint")
        return fig

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
        for sup in truss.supports:
            self._support(ax, sup, xy[truss.node_index[sup.node]], size)
        if self.loads:
            self._loads(ax, arrow)
        self._reactions(ax, arrow)
        if self.dimensions:
            self._dimensions(ax, size)
        if seen:
            ax.legend(loc="upper right", fontsize=7, frameon=False)

    def _gaps(self) -> list[tuple[float, float]]:
        """For each joint, the unit direction halfway across the widest free angle between its
        members, loads and support (where its name is written)."""
        truss = self.truss
        xy = truss.xy_m
        p = self.result.loads_N() if self.result is not None else truss.load_vector(case=self.case)
        angles: list[list[float]] = [[] for _ in truss.nodes]
        for k in range(len(truss.members)):
            a, b = truss.member_ends[k]
            dx, dy = xy[b] - xy[a]
            angles[a].append(math.atan2(dy, dx))
            angles[b].append(math.atan2(-dy, -dx))
        for i in range(len(truss.nodes)):
            fx, fy = float(p[2 * i]), float(p[2 * i + 1])
            if self.loads and math.hypot(fx, fy) > 0:
                angles[i] += [math.atan2(fy, fx), math.atan2(-fy, -fx)]
        for sup in truss.supports:
            angles[truss.node_index[sup.node]].append(-math.pi / 2)
        out = []
        for angs in angles:
            if not angs:
                out.append((0.7, 0.7))
                continue
            angs = sorted(a % (2 * math.pi) for a in angs)
            if len(angs) == 1:
                gaps = [(2 * math.pi, angs[0])]
            else:
                gaps = [
                    ((angs[(j + 1) % len(angs)] - a) % (2 * math.pi), a) for j, a in enumerate(angs)
                ]
            width, start = max(gaps)
            mid = start + width / 2
            out.append((math.cos(mid), math.sin(mid)))
        return out

    def _dimensions(self, ax: Any, size: float) -> None:
        """Chains of dimensions between the joints' distinct x (below) and y (right side), and
        the overall span, each labelled in the display length unit."""
        from calcpack.working.format import format_number

        xy = self.truss.xy_m
        per_m = float((1.0 * _ureg().m).to(self.length_unit).magnitude)

        def text(d_m: float) -> str:
            return f"{format_number(d_m * per_m, self.sig)} {self.length_unit}"

        def distinct(values: Any) -> list[float]:
            out: list[float] = []
            for v in sorted(float(v) for v in values):
                if not out or v - out[-1] > 1e-6 * size:
                    out.append(v)
            return out

        xs, ys = distinct(xy[:, 0]), distinct(xy[:, 1])
        tick = 0.012 * size
        below = ys[0] - 0.16 * size
        right = xs[-1] + 0.14 * size
        style = {"color": "#444444", "lw": 0.7, "zorder": 1}

        def horizontal(a: float, b: float, y: float) -> None:
            ax.plot([a, b], [y, y], **style)
            for x in (a, b):
                ax.plot([x - tick, x + tick], [y - tick, y + tick], **style)
            ax.text((a + b) / 2, y + tick, text(b - a), ha="center", va="bottom", fontsize=6.5)

        if len(xs) > 1:
            for x in xs:
                ax.plot([x, x], [ys[0] - 0.05 * size, below - 0.09 * size], lw=0.4, color="#999")
            for a, b in itertools.pairwise(xs):
                horizontal(a, b, below)
            if len(xs) > 2:
                horizontal(xs[0], xs[-1], below - 0.08 * size)
        if len(ys) > 1:
            for y in ys:
                ax.plot([xs[-1] + 0.03 * size, right + 0.02 * size], [y, y], lw=0.4, color="#999")
            for a, b in itertools.pairwise(ys):
                ax.plot([right, right], [a, b], **style)
                for y in (a, b):
                    ax.plot([right - tick, right + tick], [y - tick, y + tick], **style)
                ax.text(
                    right + tick, (a + b) / 2, text(b - a), ha="left", va="center", fontsize=6.5
                )
        ax.update_datalim([(xs[0], below - 0.12 * size), (right + 0.1 * size, ys[-1])])

    def _support(self, ax: Any, sup: Any, at: Any, size: float) -> None:
        theta = float(sup.surface.to("radian").magnitude) if sup.kind == "roller" else 0.0
        _draw_support(ax, sup.kind, theta, (float(at[0]), float(at[1])), size)

    def _loads(self, ax: Any, arrow: float) -> None:
        truss = self.truss
        xy = truss.xy_m
        p = self.result.loads_N() if self.result is not None else truss.load_vector(case=self.case)
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
                force_arrow(ax, pull_tip, d, arrow, _LOAD, text, label_at_tip=True)
                continue
            force_arrow(ax, node, d, arrow, _LOAD, _fmt_force(value, self.force_unit, self.sig))

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
                f"reaction at {rec.node}: "
                f"{_fmt_force(self._kN_to_unit(abs(v)), self.force_unit, self.sig)}"
            )
            force_arrow(ax, tip, d, arrow, _REACTION, label)


def truss_svg(subject: TrussResult | Truss, settings: Any = None, **options: Any) -> str:
    """A :class:`TrussDiagram` of ``subject`` as SVG, forces in the unit of ``settings``'s
    system (kip for US, kN for SI); ``options`` as :class:`TrussDiagram`."""
    from calcpack.units import get_display

    system = (settings or get_display()).system
    options.setdefault("force_unit", "kip" if system == "US" else "kN")
    options.setdefault("width_in", 7.0)
    diagram = TrussDiagram(subject, **options)
    if settings is not None:
        diagram.sig = settings.sig_figs
        diagram.length_unit = "ft" if system == "US" else "m"
    return diagram.svg()
