"""What a reader finds in a package's text layer that a typeset page would not show: raw
symbol names, Python's float noise, programmer's operators, unrendered TeX."""

from __future__ import annotations

import re

# file names (sheets/02_beam_B1.ipynb) are names, not symbols: taken out before the search
_FILE = re.compile(r"\S+\.(?:ipynb|toml|json|pdf|csv|svg|png)\b")

RAW_PATTERNS: dict[str, re.Pattern[str]] = {
    "symbol name with an underscore (R_A, F_c)": re.compile(r"(?<![\w/.])[^\W\d_]+_[^\W_]+"),
    "float noise (7.800000000000001)": re.compile(r"\d\.\d*(?:0{6,}|9{6,})\d"),
    "programmer's product in a unit (ft * lbf)": re.compile(r"[a-z] \* [a-z]"),
    "programmer's power (m**2)": re.compile(r"\w\*\*\d"),
    "word in place of a mark (,star, perp)": re.compile(r",star\b|(?<=\w)perp\b"),
    "π² as a number (9.8696)": re.compile(r"9\.869\d"),
    "unrendered TeX": re.compile(r"\\(?:frac|mathrm|left|right|cdot|sqrt)\b"),
    "load numbered as a decimal (1.00/2.00/3.00)": re.compile(r"\b1\.00 ?/ ?2\.00\b"),
}


def raw_identifiers(text: str) -> list[tuple[str, str]]:
    """(what, found) for each raw identifier in ``text``."""
    clean = _FILE.sub(" ", text)
    found = []
    for what, pattern in RAW_PATTERNS.items():
        found += [(what, m.group(0)) for m in pattern.finditer(clean)]
    return found


def repeated_headings(text: str) -> list[str]:
    """Headings that name their member twice ("B1: B1: deflection")."""
    return [m.group(0) for m in re.finditer(r"\b([A-Z][\w,]*(?: [\w,]+)?): \1:", text)]
