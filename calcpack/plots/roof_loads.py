"""Roof load cases across a frame (matplotlib -> SVG), reading RoofProfile data only.

One strip per snow arrangement (its load on plan, downward), and one for the wind cases drawn
as their envelope: at each point across the frame the largest pressure toward the roof and the
largest suction over all the wind cases (each case itself is listed in the sheet's table).
Drawing ``"roof-loads"`` of :class:`calcpack.working.Figure`; data: a sequence of profiles.
"""

from __future__ import annotations

import io
import itertools
from collections.abc import Sequence
from typing import Any

from calcpack.plots.labels import number_label

__all__ = ["roof_loads_svg", "wind_envelope"]


def _steps(profile: Any, unit: Any, x_unit: Any) -> tuple[list[float], list[float]]:
    xs: list[float] = []
    ys: list[float] = []
    for a, b, v in zip(profile.breaks[:-1], profile.breaks[1:], profile.values, strict=True):
        val = float(v.to(unit).magnitude)
        xs += [float(a.to(x_unit).magnitude), float(b.to(x_unit).magnitude)]
        ys += [val, val]
    return xs, ys


def wind_envelope(
    profiles: Sequence[Any], unit: Any, x_unit: Any
) -> tuple[list[float], list[float], list[float]]:
    """(x, most positive, most negative) over the wind profiles at every break of any profile."""
    cuts = sorted({float(b.to(x_unit).magnitude) for p in profiles for b in p.breaks})
    xs: list[float] = []
    hi: list[float] = []
    lo: list[float] = []
    for a, b in itertools.pairwise(cuts):
        mid = (a + b) / 2
        vals = []
        for p in profiles:
            for s, e, v in zip(p.breaks[:-1], p.breaks[1:], p.values, strict=True):
                if float(s.to(x_unit).magnitude) <= mid <= float(e.to(x_unit).magnitude):
                    vals.append(float(v.to(unit).magnitude))
                    break
        if vals:
            xs += [a, b]
            hi += [max(vals)] * 2
            lo += [min(vals)] * 2
    return xs, hi, lo


def roof_loads_svg(profiles: Sequence[Any], settings: Any = None, **options: Any) -> str:
    """Drawing ``"roof-loads"``: snow arrangements and the wind envelope across the frame."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    del settings, options
    snow = [p for p in profiles if p.kind == "plan"]
    wind = [p for p in profiles if p.kind == "normal"]
    rows = len(snow) + (1 if wind else 0)
    if rows == 0:
        rows = 1
    first = (snow or wind)[0] if (snow or wind) else None
    us = first is not None and f"{first.breaks[-1].units:~}" in ("ft", "in", "inch", "foot")
    unit = "psf" if us else "kN/m^2"
    x_unit = "ft" if us else "m"
    fig = Figure(figsize=(6.0, 1.25 * rows + 0.4))
    FigureCanvasAgg(fig)
    axes = fig.subplots(rows, 1, squeeze=False)[:, 0]
    for ax, p in zip(axes, snow, strict=False):
        xs, ys = _steps(p, unit, x_unit)
        ax.fill_between(xs, [-y for y in ys], 0.0, color="#9ecae1", alpha=0.8, lw=0)
        ax.plot(xs, [-y for y in ys], color="#08519c", lw=1)
        for x0, y in zip(xs[::2], ys[::2], strict=True):
            ax.text(x0, -y, f" {number_label(y)}", fontsize=7, va="top")
        ax.set_title(f"{p.case} ({unit} on plan, downward)", fontsize=8, loc="left")
    if wind:
        ax = axes[len(snow)]
        xs, hi, lo = wind_envelope(wind, unit, x_unit)
        ax.fill_between(xs, hi, 0.0, color="#fc9272", alpha=0.6, lw=0, label="toward the roof")
        ax.fill_between(xs, lo, 0.0, color="#a1d99b", alpha=0.7, lw=0, label="suction")
        ax.plot(xs, hi, color="#cb181d", lw=0.8)
        ax.plot(xs, lo, color="#238b45", lw=0.8)
        ax.text(xs[0], min(lo), f" {number_label(min(lo), signed=True)}", fontsize=7, va="bottom")
        if max(hi) > 0:
            ax.text(
                xs[-1],
                max(hi),
                f"{number_label(max(hi), signed=True)} ",
                fontsize=7,
                va="bottom",
                ha="right",
            )
        ax.set_title(
            f"Wind, envelope of {len(wind)} cases ({unit} normal to the roof; + toward it)",
            fontsize=8,
            loc="left",
        )
        ax.legend(fontsize=6, loc="upper right", frameon=False)
    for ax in axes:
        ax.axhline(0.0, color="black", lw=1.2)
        ax.set_yticks([])
        for side in ("top", "right", "left"):
            ax.spines[side].set_visible(False)
        ax.tick_params(labelsize=7)
    axes[-1].set_xlabel(f"distance across the frame from the left eave ({x_unit})", fontsize=7)
    fig.tight_layout()
    buf = io.StringIO()
    fig.savefig(buf, format="svg", bbox_inches="tight")
    return buf.getvalue()
