"""The font of the visible signature stamp.

The signing library lays out stamp text correctly only for fonts with 1000 units per em; the
DejaVu fonts (Debian package ``fonts-dejavu-core``) have 2048. So the first use subsets DejaVu Sans
to the Latin, Greek and punctuation characters a stamp needs and rescales it to 1000 units with
fontTools, into a per-user cache. Without DejaVu the stamp falls back to the standard PDF font
Courier, which needs no embedding.
"""

from __future__ import annotations

import io
import os
from pathlib import Path

from calcpack.fileio import write_atomically

__all__ = ["FONT_ENV", "stamp_font"]

#: Environment variable naming a TrueType/OpenType font to use for stamps instead.
FONT_ENV = "CALCPACK_STAMP_FONT"

_SEARCH = (
    "/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf",
    "/usr/share/fonts/dejavu/DejaVuSans.ttf",
    "/usr/local/share/fonts/DejaVuSans.ttf",
    "/Library/Fonts/DejaVuSans.ttf",
)
_UNITS_PER_EM = 1000
_CACHE_NAME = "stamp-DejaVuSans-1000upm-v1.ttf"

# Basic Latin, Latin-1, Latin Extended-A/B, Greek, and the typographic punctuation and maths
# signs a name, firm or reason may use.
_UNICODES = (
    list(range(0x20, 0x7F))
    + list(range(0xA0, 0x250))
    + list(range(0x370, 0x400))
    + [0x2013, 0x2014, 0x2018, 0x2019, 0x201C, 0x201D, 0x2022, 0x2026, 0x2032, 0x2212]
    + [0x2264, 0x2265, 0x2190, 0x2192, 0x20AC, 0x2116]
)


def _cache_dir() -> Path:
    base = os.environ.get("XDG_CACHE_HOME") or str(Path.home() / ".cache")
    return Path(base) / "calcpack" / "fonts"


def _source_font() -> Path | None:
    for candidate in _SEARCH:
        if Path(candidate).is_file():
            return Path(candidate)
    return None


def _units_per_em(path: Path) -> int:
    from fontTools.ttLib import TTFont

    with TTFont(str(path), lazy=True) as font:
        return int(font["head"].unitsPerEm)


def _rescaled(source: Path, target: Path) -> Path:
    from fontTools import subset
    from fontTools.ttLib import TTFont
    from fontTools.ttLib.scaleUpem import scale_upem

    font = TTFont(str(source))
    options = subset.Options()
    options.hinting = False  # hinting instructions do not survive rescaling
    options.layout_features = ["*"]
    options.name_IDs = ["*"]
    options.notdef_outline = True
    options.drop_tables += ["FFTM"]  # a FontForge timestamp the subsetter cannot handle
    subsetter = subset.Subsetter(options)
    subsetter.populate(unicodes=_UNICODES)
    subsetter.subset(font)
    scale_upem(font, _UNITS_PER_EM)
    buffer = io.BytesIO()
    font.save(buffer)
    write_atomically(target, buffer.getvalue())  # a concurrent build sees old or new, not part
    return target


def stamp_font() -> Path | None:
    """Path of a 1000-units-per-em TrueType font for stamps, or ``None`` to use Courier.

    ``$CALCPACK_STAMP_FONT`` overrides the choice; a font with another units-per-em is
    rescaled into the cache like DejaVu.
    """
    chosen = os.environ.get(FONT_ENV)
    source = Path(chosen) if chosen else _source_font()
    if source is None or not source.is_file():
        return None
    if _units_per_em(source) == _UNITS_PER_EM:
        return source
    name = _CACHE_NAME if not chosen else f"stamp-{source.stem}-1000upm-v1.ttf"
    cached = _cache_dir() / name
    if cached.is_file() and cached.stat().st_mtime >= source.stat().st_mtime:
        return cached
    try:
        return _rescaled(source, cached)
    except OSError:
        # a read-only home: rescale into a temporary directory for this process only
        import tempfile

        return _rescaled(source, Path(tempfile.gettempdir()) / f"calcpack-{os.getuid()}" / name)
