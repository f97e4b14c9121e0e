"""What the drawings made by a ``figure()`` method share: their SVG, saving to a file and the
notebook display (:class:`Drawing`), and the labelled force arrow of the truss and free-body
sketches (:func:`force_arrow`), and the bare axes of a to-scale sketch (:func:`sketch_axes`,
:func:`frame`)."""

from __future__ import annotations

import io
from pathlib import Path
from typing import Any, ClassVar

__all__ = ["Drawing", "force_arrow", "frame", "sketch_axes"]


class Drawing:
    """A drawing whose ``figure()`` returns a matplotlib Figure: its SVG (``svg``), a file
    (``save``, the format by the file's suffix: SVG, PNG or PDF) and its display in a notebook.

    ``searchable_text``: the SVG keeps its text as text (``svg.fonttype = none``), so the
    labels can be searched and copied in the PDF; otherwise matplotlib's setting holds.
    """

    searchable_text: ClassVar[bool] = False

    def figure(self) -> Any:
        raise NotImplementedError

    def svg(self) -> str:
        """The drawing as an SVG document."""
        import matplotlib

        buf = io.StringIO()
        settings = {"svg.fonttype": "none"} if self.searchable_text else {}
        with matplotlib.rc_context(settings):
            self.figure().savefig(buf, format="svg", bbox_inches="tight")
        return buf.getvalue()

    def save(self, path: str | Path) -> Path:
        """Write the drawing (SVG, PNG or PDF by the file's suffix) and return the path."""
        out = Path(path)
        self.figure().savefig(out, bbox_inches="tight")
        return out

    def _repr_svg_(self) -> str:
        return self.svg()


def force_arrow(
    ax: Any,
    tip: tuple[float, float],
    d: tuple[float, float],
    length: float,
    colour: str,
    text: str,
    *,
    label_at_tip: bool = False,
) -> None:
    """A force arrow ending at ``tip``, pointing along the unit direction ``d``, ``length``
    long (data units), labelled ``text`` beyond its outer end (beyond the tip with
    ``label_at_tip``: a pull drawn away from its joint)."""
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
    ax.update_datalim([tail, tip, (at[0] + out[0] * 0.3 * length, at[1] + out[1] * 0.3 * length)])


def sketch_axes(width_in: float, height_in: float) -> tuple[Any, Any]:
    """(figure, axes) of a to-scale sketch ``width_in`` × ``height_in`` inches: one axes with
    equal scales in x and y and no axis lines or ticks (a plan or elevation, not a graph), on
    an Agg canvas."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    fig = Figure(figsize=(width_in, height_in))
    FigureCanvasAgg(fig)
    ax = fig.add_subplot(1, 1, 1)
    ax.set_aspect("equal")
    ax.axis("off")
    return fig, ax


def frame(
    ax: Any,
    title: str,
    *,
    x: tuple[float, float],
    y: tuple[float, float],
    fontsize: float = 8,
) -> None:
    """Title a sketch and show the region ``x`` × ``y`` (data units) of it."""
    ax.set_title(title, fontsize=fontsize)
    ax.set_xlim(*x)
    ax.set_ylim(*y)
