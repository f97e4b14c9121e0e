"""Diagrams of a beam under a set of load combinations: the loads of each case, then the shear,
bending-moment and (for service and allowable-stress sets) displacement envelopes over the
combinations, with the governing values labelled.

Reads :class:`calcpack.combinations.CombinedResults` only. Conventions as
:mod:`calcpack.plots.beam`: shear positive when the left face of an element is pushed up,
sagging moment positive plotted above the axis, displacement upward positive (a downward
deflection is drawn below the axis). Ticks fall on round values of the sheet's display units.
A strength set has no displacement panel: deflection is checked under service loads.
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

import numpy as np
from matplotlib.figure import Figure
from matplotlib.ticker import FixedLocator, FuncFormatter

from calcpack.combinations.superpose import superpose
from calcpack.plots.beam import _BLUE, _GREEN, _GREY, _RED, _SYSTEM_UNITS, _loading
from calcpack.plots.labels import Label, place_labels, round_ticks, svg_text, tick_text
from calcpack.units import get_display, ureg
from calcpack.working.format import format_number

if TYPE_CHECKING:
    from calcpack.combinations.superpose import CombinedResults
    from calcpack.units import DisplaySettings

__all__ = ["combinations_figure", "combinations_svg", "draws_displacement"]


def draws_displacement(cr: CombinedResults) -> bool:
    """True when the figure has a displacement panel: service or allowable-stress sets of a
    beam with a stiffness (a factored strength deflection is not drawn)."""
    first = next(iter(cr.results.values()))
    return cr.combination_set.kind != "strength" and bool(first.has_deflection)


def _positions(cr: CombinedResults) -> np.ndarray:
    """x (m) to sample: a fine grid plus both sides of every support and point load."""
    beam = next(iter(cr.case_results.values())).beam
    L = beam.L_m
    xs = list(np.linspace(0.0, L, 241))
    eps = 1e-7 * L
    for s in beam.supports:
        xs += [s.x_m - eps, s.x_m, s.x_m + eps]
    for ld in beam.loads:
        for attr in ("x_m", "a_m", "b_m"):
            v = getattr(ld, attr, None)
            if v is not None:
                xs += [v - eps, v + eps]
    arr = np.unique(np.clip(np.array(xs, dtype=float), 0.0, L))
    return arr


def _fmt(value: float, sig: int) -> str:
    return format_number(value, sig)


def combinations_figure(cr: CombinedResults, settings: DisplaySettings | None = None) -> Any:
    """The matplotlib figure of :func:`combinations_svg` (labels placed)."""
    display = settings or get_display()
    sig = display.sig_figs
    u = _SYSTEM_UNITS.get(display.system, _SYSTEM_UNITS["SI"])
    f_len, f_force, f_mom, f_defl = (u.si(x) for x in (u.length, u.force, u.moment, u.deflection))
    lu, fu, mu, du = (u.label(x) for x in (u.length, u.force, u.moment, u.deflection))
    unfactored = superpose(cr.case_results, dict.fromkeys(cr.case_results, 1.0))
    beam = unfactored.beam
    L = beam.L_m
    env = cr.envelope()
    x = _positions(cr)
    xq = x * ureg.m
    deflection = draws_displacement(cr)
    panels = 4 if deflection else 3
    fig = Figure(figsize=(6.6, 1.35 * panels + 0.6), layout="constrained")
    axes = fig.subplots(
        panels, 1, sharex=True, gridspec_kw={"height_ratios": [1.2] + [1.0] * (panels - 1)}
    )
    _loading(axes[0], unfactored, sig, aspect=1.0, u=u, by_case=True)
    axes[0].set_title(f"{beam.name}: loads of each case, unfactored", fontsize=8.5, loc="left")
    labels: list[Label] = []
    one = len(cr.results) == 1
    what = "" if one else " envelope"
    specs: list[tuple[str, str, float, str, str]] = [
        ("shear", "V", f_force, fu, _BLUE),
        ("moment", "M", f_mom, mu, _RED),
    ]
    if deflection:
        specs.append(("deflection", "δ", f_defl, du, _GREEN))
    for ax, (kind, sym, scale, unit, color) in zip(axes[1:], specs, strict=True):
        upper_q, lower_q, up_by, low_by = env.curve(kind, xq)
        upper = upper_q.to_base_units().magnitude / scale
        lower = lower_q.to_base_units().magnitude / scale
        if kind == "deflection":  # δ is positive down; the drawing shows displacement, up +
            upper, lower, up_by, low_by = -lower, -upper, low_by, up_by
        fill_top, fill_bottom = np.maximum(upper, 0.0), np.minimum(lower, 0.0)
        ax.fill_between(x, fill_top, fill_bottom, color=color, alpha=0.15, lw=0)
        ax.plot(x, upper, color=color, lw=1.2)
        if not one:
            ax.plot(x, lower, color=color, lw=1.2, ls="-")
        ax.axhline(0.0, color="black", lw=0.6)
        top, bottom = float(np.max(upper)), float(np.min(lower))
        span = max(top - bottom, abs(top), abs(bottom)) or 1.0
        ax.set_ylim(bottom - 0.35 * span, top + 0.35 * span)
        yt = round_ticks(bottom - 0.3 * span, top + 0.3 * span, n=5)
        ax.yaxis.set_major_locator(FixedLocator(list(yt)))
        ax.yaxis.set_major_formatter(FuncFormatter(lambda v, _p: tick_text(v)))
        sign_word = {
            "shear": "left face up +",
            "moment": "sagging +",
            "deflection": "up +",
        }[kind]
        ax.set_ylabel(f"{sym}{what} ({unit})\n{sign_word}", fontsize=7.5)
        ax.grid(True, lw=0.3, alpha=0.5)
        ax.tick_params(labelsize=7)
        i_max, i_min = int(np.argmax(upper)), int(np.argmin(lower))
        for i, arr, by in ((i_max, upper, up_by), (i_min, lower, low_by)):
            val = float(arr[i])
            if abs(val) <= 1e-9 * span:
                continue
            where = f"x = {_fmt(x[i] / f_len, sig)} {lu}"
            gov = "" if one else f", {by[i]}"
            if kind == "deflection":
                text = f"δ = {_fmt(abs(val), sig)} {unit} {'down' if val < 0 else 'up'}, {where}"
            else:
                text = f"{sym} = {_fmt(val, sig)} {unit}, {where}{gov}"
            ax.plot([x[i]], [val], "o", color=color, ms=2.5)
            labels.append(Label(ax, float(x[i]), val, text, color))
    for ax in axes[1:]:
        for s in beam.supports:
            ax.axvline(s.x_m, color=_GREY, lw=0.5, ls="--")
    ticks = round_ticks(0.0, L / f_len, n=10)
    axes[-1].xaxis.set_major_locator(FixedLocator(list(ticks * f_len)))
    axes[-1].xaxis.set_major_formatter(FuncFormatter(lambda v, _p: tick_text(v / f_len)))
    axes[-1].set_xlabel(f"x from the left end ({lu})", fontsize=7.5)
    axes[0].set_xlim(-0.04 * L, 1.04 * L)
    place_labels(fig, labels)
    return fig


def combinations_svg(cr: CombinedResults, settings: DisplaySettings | None = None) -> str:
    """SVG text of the loads of each case and the envelopes over ``cr``'s combinations."""
    return svg_text(combinations_figure(cr, settings))
