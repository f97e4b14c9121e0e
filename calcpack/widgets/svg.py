"""Light SVG drawings for the live panels: beam loading sketch, shear/moment/deflection
diagrams and a section sketch, built as strings straight from the numeric results.

The panels redraw on every edit, so these avoid matplotlib (whose figure set-up alone costs
more than the whole beam solve); the issued package uses the figures of :mod:`calcpack.plots`.
Every edit sends the drawings from the kernel to the browser, so they are kept small: each
diagram line is thinned to the points needed to draw it within a fraction of a pixel
(:func:`thin`) and drawn as one path, filled and stroked.

Sign conventions (as :mod:`calcpack.analysis.beam`): loads downward +; shear V and moment M
(sagging +) are drawn upward when positive; deflection (downward +) is drawn downward, so the
line looks like the deflected beam.
"""

from __future__ import annotations

from collections.abc import Sequence
from html import escape
from typing import Any

import numpy as np

from calcpack.inputs.file import cached_unit
from calcpack.units import Q_, si

__all__ = [
    "beam_diagram_parts",
    "beam_diagrams_svg",
    "beam_sketch_svg",
    "diagram_svg",
    "section_sketch_svg",
    "stack_svg",
    "thin",
]

WIDTH = 640
MARGIN_L = 70
MARGIN_R = 30
CASE_COLOURS = ("#1f5fa8", "#b0441c", "#2b7a3d", "#7a3d8f", "#8a6d00", "#00707a")
_SAMPLES = 241
# Largest distance (px) between a diagram line as drawn and as sampled: well under the width of
# the line itself (1.6 px), so thinning is invisible.
THIN_TOLERANCE_PX = 0.25


def _num(v: float, sig: int = 3) -> str:
    if v == 0 or not np.isfinite(v):
        return "0"
    return f"{v:.{sig}g}" if 1e-3 <= abs(v) < 1e5 else f"{v:.{sig}e}"


def _open(height: int, label: str) -> str:
    return (
        f'<svg xmlns="http://www.w3.org/2000/svg" class="cp-diagram" '
        f'data-diagram="{escape(label)}" width="{WIDTH}" height="{height}" '
        f'viewBox="0 0 {WIDTH} {height}" font-family="DejaVu Sans, sans-serif" font-size="11">'
    )


class _Xmap:
    def __init__(self, L_m: float) -> None:
        self.L = L_m
        self.w = WIDTH - MARGIN_L - MARGIN_R

    def __call__(self, x_m: float) -> float:
        return MARGIN_L + self.w * x_m / self.L


def _sample(result: Any, what: str, L_m: float, breaks: Sequence[float]) -> tuple[Any, Any]:
    """x (m) and values (SI) with both sides of each break, so steps are drawn vertical."""
    base = np.union1d(np.linspace(0.0, L_m, _SAMPLES), np.asarray(breaks, dtype=float))
    xq = Q_(base, cached_unit("m"))
    if what == "deflection":
        return base, result.deflection(xq).to(cached_unit("mm")).magnitude
    fn = getattr(result, what)
    to = cached_unit("kN" if what == "shear" else "kN*m")
    left = fn(xq, side="left").to(to).magnitude
    right = fn(xq, side="right").to(to).magnitude
    X = np.repeat(base, 2)
    Y = np.empty(2 * len(base))
    Y[0::2] = left
    Y[1::2] = right
    return X, Y


def thin(x: Any, y: Any, tolerance: float = THIN_TOLERANCE_PX) -> Any:
    """Indices of the points of the line ``x, y`` (px) to keep so that the line through them
    stays within ``tolerance`` of every point left out (Ramer-Douglas-Peucker).

    Straight runs (shear under uniform load, any diagram between loads) shrink to their ends;
    curves keep about one point per few pixels of bend. The first and last points are kept.
    """
    px = np.asarray(x, dtype=float)
    py = np.asarray(y, dtype=float)
    n = len(px)
    keep = np.zeros(n, dtype=bool)
    keep[[0, n - 1]] = True
    at = np.arange(n)
    # Every segment between kept points is split at its farthest point, all segments at once
    # (the result is the recursive algorithm's, in a few vectorised rounds instead of one small
    # numpy call per segment).
    while True:
        kept = np.flatnonzero(keep)
        seg = np.minimum(np.searchsorted(kept, at, side="right") - 1, len(kept) - 2)
        i0, i1 = kept[seg], kept[seg + 1]
        dx, dy = px[i1] - px[i0], py[i1] - py[i0]
        ux, uy = px - px[i0], py - py[i0]
        chord = np.hypot(dx, dy)
        dist = np.where(
            chord > 0, np.abs(dx * uy - dy * ux) / np.where(chord > 0, chord, 1.0), np.hypot(ux, uy)
        )
        dist[keep] = 0.0
        farthest = np.maximum.reduceat(dist, kept[:-1])
        if not np.any(farthest > tolerance):
            break
        split = (dist == farthest[seg]) & (dist > tolerance)
        first = np.flatnonzero(split)
        first = first[np.r_[True, seg[first][1:] != seg[first][:-1]]]  # first farthest per segment
        keep[first] = True
    return np.flatnonzero(keep)


def _pairs(px: Any, py: Any) -> str:
    return " ".join(f"{a:.1f},{b:.1f}" for a, b in zip(px.tolist(), py.tolist(), strict=True))


def diagram_svg(
    x_m: Any,
    values: Any,
    *,
    L_m: float,
    title: str,
    unit: str,
    colour: str,
    supports_x: Sequence[float] = (),
    down_positive: bool = False,
    height: int = 120,
) -> str:
    """One filled diagram of ``values`` (in ``unit``) along the beam, with its extremes labelled.

    Args:
        x_m: positions (m), increasing (repeated positions draw vertical steps).
        values: values at those positions, in ``unit``.
        L_m: beam length (m). supports_x: support positions (m), marked on the axis.
        down_positive: draw positive values downward (deflection).
    """
    x = np.asarray(x_m, dtype=float)
    y = np.asarray(values, dtype=float)
    X = _Xmap(L_m)
    top, bottom = 18, height - 14
    mid = (top + bottom) / 2
    span = float(np.max(np.abs(y))) if y.size else 0.0
    scale = (bottom - top) / 2 / span if span > 0 else 0.0
    sgn = 1.0 if down_positive else -1.0

    def Y(v: float) -> float:
        return mid + sgn * v * scale

    # On the 0.1 px grid the path is written in, before thinning: round-off in the values then
    # cannot change which points are kept, so an edit that leaves the diagram as it was (a
    # change of E for V and M) draws the same string, which is not sent again.
    px = np.round(MARGIN_L + X.w * x / L_m, 1)
    py = np.round(mid + sgn * y * scale, 1)
    keep = thin(px, py)
    # One open path from the axis, along the diagram and back to the axis: the fill closes it
    # along the axis, the stroke does not.
    path = f"M{px[0]:.1f},{mid:.1f}L{_pairs(px[keep], py[keep])} {px[-1]:.1f},{mid:.1f}"
    parts = [_open(height, title)]
    parts.append(f'<text x="4" y="12" font-weight="bold">{escape(title)}</text>')
    parts.append(f'<text x="4" y="{mid + 4:.1f}" fill="#555">{escape(unit)}</text>')
    parts.append(
        f'<path d="{path}" fill="{colour}" fill-opacity="0.18" stroke="{colour}" '
        'stroke-width="1.6"/>'
        f'<line x1="{X(0):.1f}" y1="{mid:.1f}" x2="{X(L_m):.1f}" y2="{mid:.1f}" '
        'stroke="#222" stroke-width="1"/>'
    )
    for s in supports_x:
        parts.append(
            f'<line x1="{X(s):.1f}" y1="{mid - 4:.1f}" x2="{X(s):.1f}" y2="{mid + 4:.1f}" '
            'stroke="#222"/>'
        )
    if span > 0:
        # Values to 12 digits: round-off below that (e.g. from a change of EI, which leaves V
        # and M unchanged) must not make the drawing differ and be sent again.
        marks = {int(np.argmax(y)), int(np.argmin(y))}
        for k in sorted(marks):
            v = float(y[k])
            if v == 0:
                continue
            yy = Y(v)
            anchor = "middle"
            xx = X(float(x[k]))
            if xx < MARGIN_L + 30:
                anchor = "start"
            elif xx > WIDTH - MARGIN_R - 30:
                anchor = "end"
            dy = -4 if yy < mid else 12
            parts.append(
                f'<circle cx="{xx:.1f}" cy="{yy:.1f}" r="2.2" fill="{colour}"/>'
                f'<text x="{xx:.1f}" y="{yy + dy:.1f}" text-anchor="{anchor}" '
                f'class="cp-diagram-extreme" data-value="{v:.12g}">{_num(v)}</text>'
            )
    parts.append("</svg>")
    return "".join(parts)


def _support_glyph(kind: str, x: float, y: float) -> str:
    if kind == "pin":
        return (
            f'<polygon points="{x:.1f},{y:.1f} {x - 7:.1f},{y + 11:.1f} {x + 7:.1f},{y + 11:.1f}" '
            'fill="none" stroke="#222" stroke-width="1.3"/>'
            f'<line x1="{x - 10:.1f}" y1="{y + 12:.1f}" x2="{x + 10:.1f}" y2="{y + 12:.1f}" '
            'stroke="#222"/>'
        )
    if kind == "roller":
        return (
            f'<polygon points="{x:.1f},{y:.1f} {x - 7:.1f},{y + 9:.1f} {x + 7:.1f},{y + 9:.1f}" '
            'fill="none" stroke="#222" stroke-width="1.3"/>'
            f'<circle cx="{x - 4:.1f}" cy="{y + 11.5:.1f}" r="2.3" fill="none" stroke="#222"/>'
            f'<circle cx="{x + 4:.1f}" cy="{y + 11.5:.1f}" r="2.3" fill="none" stroke="#222"/>'
        )
    if kind == "fixed":
        hatch = "".join(
            f'<line x1="{x:.1f}" y1="{y - 12 + 6 * i:.1f}" x2="{x - 6:.1f}" '
            f'y2="{y - 6 + 6 * i:.1f}" stroke="#222"/>'
            for i in range(4)
        )
        return (
            f'<line x1="{x:.1f}" y1="{y - 13:.1f}" x2="{x:.1f}" y2="{y + 13:.1f}" '
            f'stroke="#222" stroke-width="2"/>{hatch}'
        )
    return ""


def beam_sketch_svg(inputs: Any, *, height: int = 150) -> str:
    """The beam with its supports, spans and loads by case (magnitudes as given)."""
    L_m = inputs.support_x_m[-1]
    X = _Xmap(L_m)
    beam_y = height - 48
    parts = [_open(height, "loading")]
    parts.append('<text x="4" y="12" font-weight="bold">Loading (as given, by case)</text>')
    cases = sorted({ld.case for ld in inputs.loads})
    colour = {c: CASE_COLOURS[i % len(CASE_COLOURS)] for i, c in enumerate(cases)}
    for i, c in enumerate(cases):
        parts.append(
            f'<rect x="{WIDTH - 140 + 60 * (i % 2)}" y="{4 + 12 * (i // 2)}" width="9" height="9" '
            f'fill="{colour[c]}"/><text x="{WIDTH - 128 + 60 * (i % 2)}" '
            f'y="{12 + 12 * (i // 2)}">{escape(c)}</text>'
        )
    parts.append(
        f'<line x1="{X(0):.1f}" y1="{beam_y}" x2="{X(L_m):.1f}" y2="{beam_y}" '
        'stroke="#222" stroke-width="3"/>'
    )
    xs = list(inputs.support_x_m)
    for kind, x in zip(inputs.supports, xs, strict=True):
        parts.append(_support_glyph(kind, X(x), beam_y + 2))
    for a, b, n in zip(xs[:-1], xs[1:], range(1, len(xs)), strict=False):
        parts.append(
            f'<text x="{(X(a) + X(b)) / 2:.1f}" y="{height - 6}" text-anchor="middle" '
            f'fill="#333">span {n}: {_num(b - a)} m</text>'
        )
    # Uniform loads stacked as bands above the beam; point loads as arrows.
    level = beam_y - 6
    for ld in inputs.loads:
        c = colour[ld.case]
        if hasattr(ld, "w"):
            a, b = si(ld.start), si(ld.end)
            top = level - 14
            parts.append(
                f'<rect x="{X(a):.1f}" y="{top:.1f}" width="{X(b) - X(a):.1f}" height="14" '
                f'fill="{c}" fill-opacity="0.25" stroke="{c}"/>'
                f'<text x="{X(a) + 3:.1f}" y="{top - 2:.1f}" fill="{c}">'
                f"w = {_num(float(ld.w.to('kN/m').magnitude))} kN/m ({escape(ld.case)})</text>"
            )
            level = top - 14
    arrow_top = max(min(level, beam_y - 40), 30)
    for ld in inputs.loads:
        if hasattr(ld, "P"):
            c = colour[ld.case]
            x = X(si(ld.x))
            tip = beam_y - 2
            parts.append(
                f'<line x1="{x:.1f}" y1="{arrow_top:.1f}" x2="{x:.1f}" y2="{tip - 6:.1f}" '
                f'stroke="{c}" stroke-width="2"/>'
                f'<polygon points="{x:.1f},{tip:.1f} {x - 4:.1f},{tip - 8:.1f} '
                f'{x + 4:.1f},{tip - 8:.1f}" fill="{c}"/>'
                f'<text x="{x:.1f}" y="{arrow_top - 3:.1f}" text-anchor="middle" fill="{c}">'
                f"P = {_num(float(ld.P.to('kN').magnitude))} kN ({escape(ld.case)})</text>"
            )
    parts.append("</svg>")
    return "".join(parts)


def _breaks(inputs: Any) -> list[float]:
    out = list(inputs.support_x_m)
    for ld in inputs.loads:
        if hasattr(ld, "P"):
            out.append(si(ld.x))
        else:
            out.extend((si(ld.start), si(ld.end)))
    return out


def beam_diagrams_svg(outcome: Any) -> str:
    """Loading sketch, then V and M for the strength combination and δ for the service one,
    as one SVG."""
    return stack_svg(beam_diagram_parts(outcome))


def beam_diagram_parts(outcome: Any) -> tuple[str, str, str, str]:
    """The four drawings of :func:`beam_diagrams_svg`, each a whole ``<svg>``: loading, shear,
    moment, deflection. The beam panel shows them as separate outputs, so an edit re-sends only
    the drawings it changed."""
    inputs = outcome.inputs
    L_m = inputs.support_x_m[-1]
    sx = list(inputs.support_x_m)
    br = _breaks(inputs)
    strength, service = outcome.strength.label, outcome.service.label
    xv, v = _sample(outcome.strength, "shear", L_m, br)
    xm, m = _sample(outcome.strength, "moment", L_m, br)
    xd, d = _sample(outcome.service, "deflection", L_m, br)
    parts = (
        beam_sketch_svg(inputs),
        diagram_svg(
            xv,
            v,
            L_m=L_m,
            title=f"Shear V — {strength}",
            unit="kN",
            colour="#1f5fa8",
            supports_x=sx,
        ),
        diagram_svg(
            xm,
            m,
            L_m=L_m,
            title=f"Moment M (sagging +) — {strength}",
            unit="kN·m",
            colour="#b0441c",
            supports_x=sx,
        ),
        diagram_svg(
            xd,
            d,
            L_m=L_m,
            title=f"Deflection δ (down +) — {service}",
            unit="mm",
            colour="#2b7a3d",
            supports_x=sx,
            down_positive=True,
        ),
    )
    return parts


def stack_svg(parts: Sequence[str]) -> str:
    """One SVG document holding ``parts`` (each a whole ``<svg>``) one below the other."""
    y = 0
    inner = []
    for p in parts:
        h = int(p.split('height="', 1)[1].split('"', 1)[0])
        inner.append(p.replace("<svg ", f'<svg y="{y}" ', 1))
        y += h
    return (
        f'<svg xmlns="http://www.w3.org/2000/svg" class="cp-diagrams" width="{WIDTH}" '
        f'height="{y}" viewBox="0 0 {WIDTH} {y}">' + "".join(inner) + "</svg>"
    )


def section_sketch_svg(section: Any, props: Any, *, size: int = 240) -> str:
    """The section's outline (solid parts filled, voids white) with its centroid and axes."""
    from calcpack.sections.geometry import CircleRegion, PolygonRegion

    regions = section.weighted_regions()
    boxes = [wr.region.bbox() for wr in regions]
    x0 = min(b[0] for b in boxes)
    y0 = min(b[1] for b in boxes)
    x1 = max(b[2] for b in boxes)
    y1 = max(b[3] for b in boxes)
    pad = 24
    scale = (size - 2 * pad) / max(x1 - x0, y1 - y0)
    w = (x1 - x0) * scale + 2 * pad
    h = (y1 - y0) * scale + 2 * pad

    def P(x: float, y: float) -> str:
        return f"{pad + (x - x0) * scale:.1f},{h - pad - (y - y0) * scale:.1f}"

    parts = [
        f'<svg xmlns="http://www.w3.org/2000/svg" class="cp-diagram" data-diagram="section" '
        f'width="{w:.0f}" height="{h:.0f}" viewBox="0 0 {w:.1f} {h:.1f}" '
        'font-family="DejaVu Sans, sans-serif" font-size="10">'
    ]
    # Solids first, voids over them: a void is drawn white.
    for wr in sorted(regions, key=lambda r: -r.weight):
        fill = "#c9d7ea" if wr.weight > 0 else "#ffffff"
        reg = wr.region
        if isinstance(reg, PolygonRegion):
            pts = " ".join(P(x, y) for x, y in reg.points)
            parts.append(f'<polygon points="{pts}" fill="{fill}" stroke="#234" stroke-width="1"/>')
        elif isinstance(reg, CircleRegion):
            cx, cy = P(reg.cx, reg.cy).split(",")
            parts.append(
                f'<circle cx="{cx}" cy="{cy}" r="{reg.r * scale:.1f}" fill="{fill}" '
                'stroke="#234" stroke-width="1"/>'
            )
    cx_m, cy_m = si(props.x_bar), si(props.y_bar)
    gx, gy = (float(v) for v in P(cx_m, cy_m).split(","))
    parts.append(
        f'<line x1="4" y1="{gy:.1f}" x2="{w - 4:.1f}" y2="{gy:.1f}" stroke="#b0441c" '
        'stroke-dasharray="5,3"/>'
        f'<line x1="{gx:.1f}" y1="4" x2="{gx:.1f}" y2="{h - 4:.1f}" stroke="#b0441c" '
        'stroke-dasharray="5,3"/>'
        f'<circle cx="{gx:.1f}" cy="{gy:.1f}" r="3" fill="#b0441c"/>'
        f'<text x="{w - 6:.1f}" y="{gy - 4:.1f}" text-anchor="end" fill="#b0441c">x</text>'
        f'<text x="{gx + 4:.1f}" y="12" fill="#b0441c">y</text>'
    )
    parts.append("</svg>")
    return "".join(parts)
