"""Typeset formulas kept for reuse: one :class:`MathCache` object per build, passed to the stages.

A build makes a cache, reads the file an earlier build saved (``.calcpack-cache/
formulas.entry``, a sealed entry of :mod:`calcpack.package.cache`), hands the cache to every
conversion and saves what the package used. A worker process keeps a cache of its own between
the sheets it converts and sends back only the formulas the build does not have yet; while the
build runs, the workers share what they typeset through files (:class:`SharedFormulas`), so a
formula that several sheets use is typeset once.

The images (:class:`MathImage`) are made by :mod:`calcpack.package.mathsvg`.
"""

from __future__ import annotations

import base64
import json
import os
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

__all__ = ["MATH_PX_PER_EM", "BreakKey", "FormulaKey", "MathCache", "MathImage", "SharedFormulas"]

MATH_PX_PER_EM = 13.5
"""Math font size in CSS px (body text is 9.5 pt = 12.7 px; math is set a little larger)."""

FormulaKey = tuple[str, bool, float]
"""A typeset formula: (TeX, display style, size in CSS px)."""
BreakKey = tuple[str, float]
"""A display formula broken over lines: (TeX, width in CSS px)."""

_CACHE_FORMAT = "calcpack-math-cache/3"  # 2: signs after brackets set tight; 3: sealed


@dataclass(frozen=True)
class MathImage:
    """A typeset formula: SVG text, its size in CSS px and the baseline offset from its bottom."""

    tex: str
    svg: str
    width_px: float
    height_px: float
    baseline_px: float
    """Distance from the image bottom up to the math baseline (>= 0), for vertical-align."""

    def data_uri(self) -> str:
        """The SVG as a base64 ``data:`` URI."""
        return "data:image/svg+xml;base64," + base64.b64encode(self.svg.encode()).decode()


@dataclass
class MathCache:
    """Typeset formulas, line breaks of wide ones, and the formulas used since :meth:`start`.

    The saved form of a formula is ``[tex, display, size, svg, width, height, baseline]``, of a
    line break ``[tex, width, broken]`` (the cache file holds these, and workers send them).
    """

    images: dict[FormulaKey, MathImage] = field(default_factory=dict)
    breaks: dict[BreakKey, str] = field(default_factory=dict)
    """Display formulas too wide for the column: (TeX, width px) -> the TeX broken over lines."""
    used: set[FormulaKey] = field(default_factory=set)
    """Formulas looked up since :meth:`start` (a build saves only these)."""
    shared: SharedFormulas | None = None
    """In a worker: the formulas the build's other workers typeset (see :meth:`share`)."""

    def start(self) -> None:
        """Count used formulas from now on (a build, or a sheet in a worker)."""
        self.used.clear()

    def load(self, path: Path) -> int:
        """Read typeset formulas saved by an earlier build; returns how many.

        A missing file is a miss; one that fails its check (an edited or swapped image, a
        truncated file) is discarded with a warning and every formula is typeset again.
        """
        from calcpack.package.cache import discard, read_entry

        content = read_entry(path, _CACHE_FORMAT, what="formula images")
        if content is None:
            return 0
        try:
            data = json.loads(content)
        except ValueError as exc:
            discard(path, "formula images", f"not readable ({exc})")
            return 0
        if not isinstance(data, dict) or data.get("format") != _CACHE_FORMAT:
            return 0
        self.add_breaks(data.get("breaks", []))
        return self.add_images(data.get("formulas", []), mark_used=False)

    def save(self, path: Path) -> None:
        """Write the formulas used since :meth:`start` (and their line breaks) to ``path``."""
        from calcpack.package.cache import write_entry

        data = {
            "format": _CACHE_FORMAT,
            "formulas": self.image_entries(self.used),
            "breaks": self.break_entries(self.used),
        }
        write_entry(path, _CACHE_FORMAT, json.dumps(data).encode("utf-8"))

    def add_images(self, items: list[Any], *, mark_used: bool = True) -> int:
        """Add formulas in the saved form; with ``mark_used`` they count as used (and are
        saved). Returns the count added; a malformed item is passed over."""
        added = 0
        for item in items:
            try:
                tex, display, size, svg, width, height, baseline = item
                key = (str(tex), bool(display), float(size))
                self.images.setdefault(
                    key, MathImage(key[0], str(svg), float(width), float(height), float(baseline))
                )
            except (TypeError, ValueError):
                continue
            if mark_used:
                self.used.add(key)
            added += 1
        return added

    def add_breaks(self, items: list[Any]) -> int:
        """Add line breaks of wide formulas in the saved form; returns the count added."""
        added = 0
        for item in items:
            try:
                tex, width, broken = item
                self.breaks.setdefault((str(tex), float(width)), str(broken))
            except (TypeError, ValueError):
                continue
            added += 1
        return added

    def image_entries(self, used: set[FormulaKey] | None = None) -> list[list[Any]]:
        """The formulas (only ``used`` keys when given) in the saved form, sorted."""
        return [
            [k[0], k[1], k[2], v.svg, v.width_px, v.height_px, v.baseline_px]
            for k, v in sorted(self.images.items())
            if used is None or k in used
        ]

    def break_entries(self, used: set[FormulaKey] | None = None) -> list[list[Any]]:
        """The line breaks of wide formulas in the saved form, sorted.

        A break is kept while the formula it produced is used (its fragments are not kept).
        """
        return [
            [tex, width, broken]
            for (tex, width), broken in sorted(self.breaks.items())
            if used is None or (broken, True, MATH_PX_PER_EM) in used
        ]

    def share(self, folder: Path) -> set[FormulaKey]:
        """In a worker process: share typeset formulas with the build's other workers through
        ``folder`` (see :class:`SharedFormulas`). Returns the set, kept up to date, of
        formulas taken from the others. Calling it again with the same folder changes nothing."""
        if self.shared is None or self.shared.folder != folder:
            self.shared = SharedFormulas(folder, self)
        return self.shared.taken

    def forget_shared_images(self) -> int:
        """In a worker sharing formulas: drop the images the shared files hold from memory
        (they are read back if a later sheet wants them). Returns how many were dropped."""
        if self.shared is None:
            return 0
        held = [key for key in self.images if self.shared.holds(key)]
        for key in held:
            del self.images[key]
        return len(held)


class SharedFormulas:
    """Formulas typeset by the build's other worker processes, while the build runs.

    Sheets of one package share many formulas (the same check on several members), and each
    worker would otherwise typeset every one of them again. Each worker appends what it
    typesets to its own file in a shared folder, one JSON line per formula or line break, and
    reads the other workers' files (from where it stopped last time) before typesetting one.
    A line still being written is left for the next read. Of a formula only where its line is
    is kept until it is wanted, so a worker does not hold every other worker's images; and
    once a sheet is done a worker lets go of the images in the files, its own included
    (:meth:`MathCache.forget_shared_images`).
    """

    def __init__(self, folder: Path, cache: MathCache) -> None:
        self.folder = folder
        self.cache = cache
        folder.mkdir(parents=True, exist_ok=True)
        self.own = folder / f"{os.getpid()}.jsonl"
        self._out = self.own.open("ab")
        self._size = self._out.tell()
        self._read: dict[Path, int] = {}
        self._where: dict[FormulaKey, tuple[Path, int, int]] = {}
        self.taken: set[FormulaKey] = set()
        """Formulas taken from the other workers (they report them to the build)."""

    def put_formula(self, key: FormulaKey, image: MathImage) -> None:
        line = ["f", *key, image.svg, image.width_px, image.height_px, image.baseline_px]
        start, length = self._write(line)
        self._where.setdefault(key, (self.own, start, length))

    def put_break(self, key: BreakKey, broken: str) -> None:
        self._write(["b", *key, broken])

    def _write(self, line: list[Any]) -> tuple[int, int]:
        data = (json.dumps(line) + "\n").encode()
        start = self._size
        self._out.write(data)
        self._out.flush()
        self._size += len(data)
        return start, len(data)

    def holds(self, key: FormulaKey) -> bool:
        """Whether the shared files hold this formula (so its image can be read again)."""
        return key in self._where

    def get(self, key: FormulaKey) -> MathImage | None:
        """The formula if another worker typeset it (its image is read now)."""
        self.take()
        where = self._where.get(key)
        if where is None:
            return None
        path, start, length = where
        try:
            with path.open("rb") as handle:
                handle.seek(start)
                _, *item = json.loads(handle.read(length))
        except (OSError, ValueError):
            return None
        if not self.cache.add_images([item], mark_used=False):
            return None
        if path != self.own:
            self.taken.add(key)
        return self.cache.images.get(key)

    def take(self) -> None:
        """Index what the other workers added since the last call (line breaks are taken)."""
        for path in self.folder.glob("*.jsonl"):
            if path == self.own:
                continue
            start = self._read.get(path, 0)
            try:
                if path.stat().st_size <= start:
                    continue
                with path.open("rb") as handle:
                    handle.seek(start)
                    data = handle.read()
            except OSError:
                continue
            end = data.rfind(b"\n") + 1
            self._read[path] = start + end
            position = start
            for raw in data[:end].splitlines(keepends=True):
                try:
                    kind, *item = json.loads(raw)
                    if kind == "f":
                        key = (str(item[0]), bool(item[1]), float(item[2]))
                        self._where.setdefault(key, (path, position, len(raw)))
                    elif kind == "b":
                        self.cache.add_breaks([item])
                except (ValueError, TypeError, IndexError):
                    pass
                position += len(raw)
