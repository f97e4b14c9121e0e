"""Formulas typeset by one build worker are reused by the others while the build runs."""

from __future__ import annotations

import json
import sys
from pathlib import Path

from calcpack.package.execute import process_pool
from calcpack.package.mathcache import MathCache, SharedFormulas
from calcpack.package.mathsvg import MATH_MAX_WIDTH_PX

SHARED = [
    r"M = \frac{w L^{2}}{8} = \frac{2.5\ \mathrm{kN/m} \cdot (4.2\ \mathrm{m})^{2}}{8}",
    r"\sigma_{b} = \frac{M}{S_{x}} \leq F_{b}",
]
WIDE = " + ".join(rf"\frac{{w_{{{i}}} L^{{2}}}}{{8}}" for i in range(1, 25))
"""A display formula far wider than the column: it is broken over lines."""


def _typeset_in_worker(folder: str) -> tuple[list[str], int, bool]:
    """In a fresh worker: typeset SHARED and WIDE; their SVGs, how many formulas came from
    the other workers, and whether this process had to load the typesetter at all.

    Then, as after a sheet, the images are dropped from memory, and asked for again: they must
    be read back from the shared files, the same, not typeset again."""
    from calcpack.package.mathsvg import fitted_image, tex_to_svg

    math = MathCache()
    taken = math.share(Path(folder))
    svgs = [tex_to_svg(tex, display=True, cache=math).svg for tex in SHARED]
    svgs.append(fitted_image(WIDE, True, cache=math).svg)
    loaded = "ziamath" in sys.modules
    assert math.forget_shared_images() >= len(SHARED)
    assert not any(key[0] in SHARED for key in math.images)
    again = [tex_to_svg(tex, display=True, cache=math).svg for tex in SHARED]
    again.append(fitted_image(WIDE, True, cache=math).svg)
    assert again == svgs
    assert ("ziamath" in sys.modules) == loaded  # read back, not typeset
    return svgs, len(taken), loaded


def test_second_worker_takes_what_the_first_typeset(tmp_path: Path) -> None:
    folder = str(tmp_path / "formulas")
    with process_pool(1) as pool:
        first, taken, loaded = pool.submit(_typeset_in_worker, folder).result(timeout=180)
    assert taken == 0  # nothing to take: it typeset everything itself
    assert loaded
    with process_pool(1) as pool:  # a new process, with an empty cache of its own
        second, taken, loaded = pool.submit(_typeset_in_worker, folder).result(timeout=180)
    assert second == first
    # Every formula came from the first worker's file (the two, and the wide one broken over
    # lines: its line breaks were read first, so its whole image was not even wanted), and the
    # typesetter was never loaded: nothing was typeset twice.
    assert taken == len(SHARED) + 1
    assert not loaded


def test_a_line_still_being_written_waits_for_the_next_read(tmp_path: Path) -> None:
    folder = tmp_path / "formulas"
    math = MathCache()
    shared = SharedFormulas(folder, math)
    other = folder / "999999.jsonl"
    key = ("q_{partial} = 1", True, 13.5)
    line = json.dumps(["f", *key, "<svg/>", 10.0, 5.0, 1.0]) + "\n"
    other.write_text(line[:20], "utf-8")
    assert shared.get(key) is None
    with other.open("a", encoding="utf-8") as handle:
        handle.write(line[20:])
        handle.write(json.dumps(["b", WIDE + " x", MATH_MAX_WIDTH_PX, "broken"]) + "\n")
        handle.write("not json\n")
    shared.take()
    assert key not in math.images  # only indexed: the image is read when it is wanted
    assert (WIDE + " x", MATH_MAX_WIDTH_PX) in math.breaks  # line breaks are taken at once
    image = shared.get(key)
    assert image is not None
    assert image.svg == "<svg/>"
    assert key in math.images
    assert key in shared.taken
