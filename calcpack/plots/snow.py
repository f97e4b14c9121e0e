"""Sketches of snow load distributions (matplotlib -> SVG), reading snow results only.

:class:`SnowSketch` draws, for a roof snow result, the balanced load and the unbalanced
distribution across a gable (windward, leeward with its surcharge from the ridge), and for a
drift result the balanced load with the drift surcharge against the step, parapet or
projection. Loads are drawn downward onto a baseline (the roof on plan), values labelled.
"""

from __future__ import annotations

from typing import Any

from calcpack.plots.drawing import Drawing
from calcpack.plots.labels import quantity_label, unit_label

__all__ = ["SnowSketch", "drift_profile", "drift_profile_en", "unbalanced_profile"]


def unbalanced_profile(result: Any) -> list[tuple[float, float]] | None:
    """(x, p) points of the §7.6.1 distribution across a gable, x from the windward eave
    in the result's length unit, p in its pressure unit; None when there is no unbalanced case."""
    if result.unbalanced_windward is None or result.unbalanced_leeward is None:
        return None
    unit = str(result.ps.units)
    W = float(result.derivation.values.get("W", result.ps * 0).magnitude) or 1.0
    ww = float(result.unbalanced_windward.to(unit).magnitude)
    lw = float(result.unbalanced_leeward.to(unit).magnitude)
    pts = [(0.0, ww), (W, ww), (W, lw)]
    if result.surcharge is not None and result.surcharge_width is not None:
        s = float(result.surcharge.to(unit).magnitude)
        sw = min(float(result.surcharge_width.magnitude), W)
        pts = [(0.0, ww), (W, ww), (W, lw + s), (W + sw, lw + s), (W + sw, lw)]
    pts.append((2 * W, lw))
    return pts


def drift_profile(result: Any) -> list[tuple[float, float]]:
    """(x, p) points of balanced load plus drift surcharge, x from the step (length unit of the
    drift width), p in the balanced load's unit."""
    unit = str(result.ps.units)
    ps = float(result.ps.magnitude)
    if not result.required:
        return [(0.0, ps), (10.0, ps)]
    w = float(result.w.magnitude)
    pd = float(result.pd.to(unit).magnitude)
    end = w
    if result.lower_width is not None:
        end = min(w, float(result.lower_width.to(result.w.units).magnitude))
    p_end = ps + pd * (1 - end / w)
    pts = [(0.0, ps + pd), (end, p_end)]
    if end < w:
        pts.append((end, 0.0))
    else:
        pts.append((1.5 * w, ps))
    return pts


def drift_profile_en(result: Any) -> list[tuple[float, float]]:
    """(x, s) points of an EN 1991-1-3 drift (§5.3.6, §6.2): s_2 at the step falling linearly
    to s_1 at l_s, cut off at the end of a shorter lower roof; x in m, s in kN/m²."""
    ls = float(result.ls.to("m").magnitude)
    s1 = float(result.s_undrifted.to("kN/m^2").magnitude)
    s2 = float(result.s_peak.to("kN/m^2").magnitude)
    if result.lower_width is not None and result.lower_width < result.ls:
        end = float(result.lower_width.to("m").magnitude)
        return [(0.0, s2), (end, float(result.s_edge.to("kN/m^2").magnitude)), (end, 0.0)]
    return [(0.0, s2), (ls, s1), (1.5 * ls, s1)]


class SnowSketch(Drawing):
    """Sketch of a roof snow result (unbalanced across a gable) or a drift result."""

    def __init__(self, result: Any, *, title: str | None = None, width_in: float = 6.0) -> None:
        self.result = result
        self.title = title
        self.width_in = width_in

    def _points(self) -> tuple[list[tuple[float, float]], str, str]:
        r = self.result
        if hasattr(r, "s_peak"):
            return drift_profile_en(r), "m", f"Snow drift at a {r.kind} (EN 1991-1-3)"
        if hasattr(r, "pd"):
            return drift_profile(r), str(r.w.units), f"Snow drift at a {r.kind}"
        pts = unbalanced_profile(r)
        if pts is None:
            return (
                [(0.0, float(r.balanced.magnitude)), (1.0, float(r.balanced.magnitude))],
                "",
                ("Balanced roof snow load"),
            )
        W = r.derivation.values["W"]
        return pts, str(W.units), "Unbalanced snow load across the gable (wind from the left)"

    def figure(self) -> Any:
        """The sketch as a matplotlib Figure (Agg canvas)."""
        from matplotlib.backends.backend_agg import FigureCanvasAgg
        from matplotlib.figure import Figure

        pts, xunit, label = self._points()
        ref = self.result.s_peak if hasattr(self.result, "s_peak") else self.result.ps
        punit = "kN/m**2" if hasattr(self.result, "s_peak") else ref.units
        fig = Figure(figsize=(self.width_in, self.width_in * 0.4))
        FigureCanvasAgg(fig)
        ax = fig.add_subplot(1, 1, 1)
        xs = [p[0] for p in pts]
        ys = [-p[1] for p in pts]
        ax.fill_between(xs, ys, 0.0, step=None, color="#9ecae1", alpha=0.7, linewidth=0)
        ax.plot(xs, ys, color="#08519c", linewidth=1.2)
        ax.axhline(0.0, color="black", linewidth=1.5)
        for x, y in pts:
            ax.annotate(
                quantity_label(-y, punit),
                (x, y),
                textcoords="offset points",
                xytext=(2, -10),
                fontsize=7,
            )
        ax.set_xlabel(f"distance ({unit_label(xunit)})" if xunit else "")
        ax.set_yticks([])
        ax.set_title(self.title or label, fontsize=10)
        for side in ("top", "right", "left"):
            ax.spines[side].set_visible(False)
        fig.tight_layout()
        return fig
