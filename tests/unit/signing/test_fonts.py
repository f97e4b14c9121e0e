"""The stamp font: rescaled to 1000 units per em once, cached, with a Courier fallback."""

from __future__ import annotations

import shutil
import subprocess
from pathlib import Path
from typing import Any

import pytest

from calcpack.signing import fonts
from calcpack.signing.sign import sign_package

DEJAVU = Path("/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf")


def _upm(path: Path) -> int:
    from fontTools.ttLib import TTFont

    return int(TTFont(str(path))["head"].unitsPerEm)


@pytest.mark.skipif(not DEJAVU.is_file(), reason="needs fonts-dejavu-core")
def test_dejavu_is_rescaled_to_1000_units_once(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    monkeypatch.setenv("XDG_CACHE_HOME", str(tmp_path))
    monkeypatch.delenv(fonts.FONT_ENV, raising=False)
    assert _upm(DEJAVU) == 2048  # the reason for rescaling
    first = fonts.stamp_font()
    assert first is not None
    assert first.is_relative_to(tmp_path)
    assert _upm(first) == 1000
    mtime = first.stat().st_mtime_ns
    assert fonts.stamp_font() == first
    assert first.stat().st_mtime_ns == mtime  # served from the cache, not remade


def test_a_1000_unit_font_is_used_as_it_is(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setenv("XDG_CACHE_HOME", str(tmp_path / "cache"))
    made = fonts.stamp_font()
    if made is None:
        pytest.skip("no TrueType font on this machine")
    own = tmp_path / "own.ttf"
    shutil.copy(made, own)
    monkeypatch.setenv(fonts.FONT_ENV, str(own))
    assert fonts.stamp_font() == own


@pytest.mark.skipif(shutil.which("pdftotext") is None, reason="needs poppler's pdftotext")
def test_without_any_font_the_stamp_uses_courier(
    package: Path, demo: Any, monkeypatch: pytest.MonkeyPatch
) -> None:
    monkeypatch.delenv(fonts.FONT_ENV, raising=False)
    monkeypatch.setattr(fonts, "_SEARCH", ())
    assert fonts.stamp_font() is None
    sign_package(package, "preparer", demo.keys["preparer"], demo.password)
    text = subprocess.run(
        ["pdftotext", "-f", "1", "-l", "1", str(package), "-"],
        capture_output=True,
        text=True,
        check=True,
    ).stdout
    assert "Prepared by: Ines Calloway" in text
