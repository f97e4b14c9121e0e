r"""Break a displayed formula that is wider than the working column over several lines.

A long substitution line (the moments of twelve loads about a support, a reaction whose
numerator lists every load) is broken the way displayed equations are broken by hand:

- the formula is aligned at its first relation and the right-hand side continues on the next
  line, indented by a quad, each continuation line starting with its binary operator (``+``,
  ``-``) or relation (``=``);
- a bracketed group ``\left( .. \right)`` too wide for a line is broken inside, closing each
  line with ``\right.`` and opening the next with ``\left.``;
- a fraction whose numerator (or denominator) is too wide gets a numerator of several lines.

This is string work on the TeX that calcpack.working emits; widths come from a measuring
function (the typesetter), so the breaks follow the real glyph widths. What cannot be broken
(one very long term) is left to the caller, which scales the image to the column.
"""

from __future__ import annotations

import re
from collections.abc import Callable

__all__ = ["break_display", "top_level_atoms"]

Measure = Callable[[str], float]
"""Width in CSS px of a TeX fragment typeset in display style."""

RELATIONS = frozenset(
    {"=", "<", ">", r"\leq", r"\geq", r"\le", r"\ge", r"\neq", r"\approx", r"\equiv"}
)
OPERATORS = frozenset({"+", "-", r"\pm", r"\mp"})
QUAD_PX = 13.5
r"""Width of the continuation indent ``\quad`` (one em of the math font, see mathsvg)."""

_TALL = re.compile(r"\\(?:frac|dfrac|tfrac|sqrt|begin|sum|int|prod|over|atop|binom)\b")


_WORD_RE = re.compile(r"\\[A-Za-z]+\*?|\\.", re.DOTALL)


def _group_end(tex: str, start: int, open_: str, close: str) -> int:
    """Index just past the group opening at ``start`` (balanced ``open_``/``close``)."""
    depth = 0
    i = start
    while i < len(tex):
        ch = tex[i]
        if ch == "\\":
            i += 2
            continue
        if ch == open_:
            depth += 1
        elif ch == close:
            depth -= 1
            if depth == 0:
                return i + 1
        i += 1
    return len(tex)


def _pair_end(tex: str, start: int, opener: str, closer: str) -> int:
    """Index just past the ``closer`` matching the ``opener`` at ``start`` (and its argument)."""
    depth = 0
    i = start
    while i < len(tex):
        if tex.startswith("\\", i):
            m = _WORD_RE.match(tex, i)
            word = m.group(0) if m else "\\"
            if word == opener:
                depth += 1
            elif word == closer:
                depth -= 1
                if depth == 0:
                    return _argument_end(tex, i + len(word), delimiter=closer != r"\end")
            i += len(word)
            continue
        i += 1
    return len(tex)


def _argument_end(tex: str, i: int, *, delimiter: bool) -> int:
    """Past the delimiter after ``\\left``/``\\right`` or the ``{name}`` after ``\\end``."""
    while i < len(tex) and tex[i] == " ":
        i += 1
    if i >= len(tex):
        return i
    if not delimiter:
        return _group_end(tex, i, "{", "}") if tex[i] == "{" else i
    if tex[i] == "\\":
        m = _WORD_RE.match(tex, i)
        return i + len(m.group(0)) if m else i + 1
    return i + 1


def _atom_end(tex: str, i: int) -> int:
    """Index just past the atom starting at ``i`` (not a space), without its scripts."""
    n = len(tex)
    ch = tex[i]
    if ch == "{":
        return _group_end(tex, i, "{", "}")
    if ch != "\\":
        return i + 1
    m = _WORD_RE.match(tex, i)
    word = m.group(0) if m else "\\"
    if word == r"\left":
        return _pair_end(tex, i, r"\left", r"\right")
    if word == r"\begin":
        return _pair_end(tex, i, r"\begin", r"\end")
    j = i + len(word)
    if word[1:].isalpha():
        while True:
            k = j
            while k < n and tex[k] == " ":
                k += 1
            if k < n and tex[k] == "{":
                j = _group_end(tex, k, "{", "}")
            elif k < n and tex[k] == "[" and word == r"\sqrt":
                j = _group_end(tex, k, "[", "]")
            else:
                return j
    return j


def top_level_atoms(tex: str) -> list[str]:
    r"""Split TeX into the atoms of its outermost level.

    An atom is a brace group, a ``\left .. \right`` group, an environment, a command with its
    brace (and ``[..]``) arguments, ``\\``, ``&`` or one character; sub- and superscripts stay
    attached to their nucleus. Spaces between atoms are dropped (they do not matter in math).
    """
    atoms: list[str] = []
    i = 0
    n = len(tex)
    while i < n:
        if tex[i].isspace():
            i += 1
            continue
        j = _atom_end(tex, i)
        while True:  # scripts belong to the atom before them
            k = j
            while k < n and tex[k] == " ":
                k += 1
            if k < n and tex[k] in "^_":
                k += 1
                while k < n and tex[k] == " ":
                    k += 1
                j = _atom_end(tex, k) if k < n else k
            else:
                break
        atoms.append(tex[i:j])
        i = j
    return atoms


def _is_break(atoms: list[str], k: int) -> bool:
    """A relation, or a binary (not leading, not unary) operator, starts a new term at ``k``."""
    atom = atoms[k]
    if atom in RELATIONS:
        return k > 0
    if atom in OPERATORS:
        prev = atoms[k - 1] if k > 0 else ""
        return bool(prev) and prev not in RELATIONS | OPERATORS | {"&", "(", "[", r"\left("}
    return False


def _segments(atoms: list[str]) -> list[list[str]]:
    """Atoms grouped into terms, each (after the first) starting with its operator/relation."""
    out: list[list[str]] = [[]]
    for k in range(len(atoms)):
        if _is_break(atoms, k) and out[-1]:
            out.append([])
        out[-1].append(atoms[k])
    return [s for s in out if s]


_NUMERAL = frozenset("0123456789.,")


def _join(atoms: list[str]) -> str:
    """Atoms back into TeX; the digits of a number stay together (``1.45``, not ``1 . 4 5``)."""
    out = ""
    for atom in atoms:
        if out and not (atom in _NUMERAL and out[-1] in _NUMERAL):
            out += " "
        out += atom
    return out


_BINARY_GAP_EM = 2 * 4 / 18
"""TeX's medium space on both sides of a binary operator (display style), in em."""
_RELATION_GAP_EM = 2 * 5 / 18
"""TeX's thick space on both sides of a relation, in em."""


def _estimate(atoms: list[str], measure: Measure) -> float:
    """Width (px) of a run of atoms: their own widths plus TeX's spacing around operators.

    Typesetting each distinct atom once and adding is far cheaper than typesetting every
    candidate line, and close enough to choose breaks; the broken result is measured whole.
    """
    width = 0.0
    for k, atom in enumerate(atoms):
        width += measure(atom)
        if atom in RELATIONS and k > 0:
            width += _RELATION_GAP_EM * QUAD_PX
        elif atom in OPERATORS and _is_break(atoms, k):
            width += _BINARY_GAP_EM * QUAD_PX
    return width


def _split_group(atom: str, room: float, measure: Measure) -> list[str] | None:
    r"""Break a ``\left( .. \right)`` group over lines; None when it cannot be broken."""
    m = re.match(r"\\left\s*(\\[A-Za-z]+|\\.|.)", atom)
    end = re.search(r"\\right\s*(\\[A-Za-z]+|\\.|.)$", atom)
    if m is None or end is None:
        return None
    inner = atom[m.end() : end.start()]
    lines = _fill(_segments(top_level_atoms(inner)), room, room - QUAD_PX, measure)
    if len(lines) < 2:
        return None
    left, right = m.group(1), end.group(1)
    # Each line's delimiter would be sized to that line alone; a fixed size keeps the pair alike.
    size = ("\\Bigl", "\\Bigr") if _TALL.search(inner) else ("", "")
    out = []
    for k, line in enumerate(lines):
        opening = f"{size[0]}{left} " if k == 0 and left != "." else ("" if k == 0 else "\\quad ")
        closing = f" {size[1]}{right}" if k == len(lines) - 1 and right != "." else ""
        out.append(f"{opening}{line}{closing}")
    return out


def _split_fraction(atom: str, room: float, measure: Measure) -> str | None:
    r"""A ``\frac`` whose too-wide numerator/denominator is set on several lines."""
    parts = top_level_atoms(atom[len(r"\frac") :]) if atom.startswith(r"\frac{") else []
    if len(parts) != 2:
        return None
    changed = False
    out = []
    for part in parts:
        body = part[1:-1]
        body_atoms = top_level_atoms(body)
        if _estimate(body_atoms, measure) > room:
            lines = _fill(_segments(body_atoms), room, room - QUAD_PX, measure)
            if len(lines) > 1:
                rows = [f"&{lines[0]}", *(f"&\\quad {line}" for line in lines[1:])]
                body = r"\begin{aligned}" + r" \\ ".join(rows) + r"\end{aligned}"
                changed = True
        out.append("{" + body + "}")
    return r"\frac" + "".join(out) if changed else None


def _split_segment(segment: list[str], room: float, measure: Measure) -> list[str] | None:
    """Break one term too wide for a line at its widest breakable atom; None if none is."""
    best = max(range(len(segment)), key=lambda k: measure(segment[k]))
    atom = segment[best]
    head, tail = _join(segment[:best]), _join(segment[best + 1 :])
    spare = room - _estimate(segment[:best] + segment[best + 1 :], measure)
    if atom.startswith(r"\left"):
        lines = _split_group(atom, spare, measure)
        if lines:
            lines[0] = f"{head} {lines[0]}".strip()
            lines[-1] = f"{lines[-1]} {tail}".strip()
            return lines
    if atom.startswith(r"\frac{"):
        fraction = _split_fraction(atom, spare, measure)
        if fraction:
            return [f"{head} {fraction} {tail}".strip()]
    return None


def _fill(segments: list[list[str]], first_room: float, room: float, measure: Measure) -> list[str]:
    """Greedy line filling: as many whole terms per line as fit the room (px)."""
    lines: list[str] = []
    current: list[str] = []
    for segment in segments:
        limit = first_room if not lines else room
        if current and _estimate(current + segment, measure) <= limit:
            current += segment
            continue
        if current:
            lines.append(_join(current))
            current = []
            limit = room
        if _estimate(segment, measure) <= limit:
            current = list(segment)
            continue
        lines += _split_segment(segment, limit, measure) or [_join(segment)]
    if current:
        lines.append(_join(current))
    return lines


def _rows(tex: str) -> tuple[list[str], bool]:
    """The rows of a top-level ``aligned`` environment (else the formula), and whether aligned."""
    text = tex.strip()
    m = re.fullmatch(r"\\begin\{aligned\}(.*)\\end\{aligned\}", text, re.DOTALL)
    if m is None or len(top_level_atoms(text)) != 1:
        return [text], False
    rows: list[list[str]] = [[]]
    for atom in top_level_atoms(m.group(1)):
        if atom == "\\\\":
            rows.append([])
        else:
            rows[-1].append(atom)
    return [_join(r) for r in rows if r], True


def _break_row(row: str, width: float, measure: Measure) -> tuple[list[str], bool]:
    """One row as one or more aligned rows (each with its ``&``) no wider than ``width``.

    Also returns whether the row was broken (False: it fits or offers no break).
    """
    atoms = top_level_atoms(row)
    if "&" in atoms:
        k = atoms.index("&")
        lhs, rhs = atoms[:k], atoms[k + 1 :]
    else:
        k = next((i for i in range(1, len(atoms)) if atoms[i] in RELATIONS), len(atoms))
        lhs, rhs = atoms[:k], atoms[k:]
        if not rhs or _estimate(lhs, measure) > 0.4 * width:
            lhs, rhs = [], atoms
    unbroken = [row if "&" in atoms else f"{_join(lhs)} & {_join(rhs)}"]
    if _estimate(lhs + rhs, measure) <= width:
        return unbroken, False
    lhs_px = _estimate(lhs, measure)
    lines = _fill(_segments(rhs), width - lhs_px, width - lhs_px - QUAD_PX, measure)
    out = [f"{_join(lhs)} & {lines[0]}"]
    out += [f"& \\quad {line}" for line in lines[1:]]
    return out, out != [f"{_join(lhs)} & {_join(rhs)}"]


def flatten_delimiters(tex: str) -> str:
    r"""``\left( x \right)`` around content of text height written as plain ``( x )``.

    Such delimiters come out the normal size either way, but the typesetter sizes every
    ``\left``/``\right`` pair by laying its content out again, which for a broken formula of
    many substituted values (each one bracketed) multiplies the typesetting time.
    """
    out: list[str] = []
    i = 0
    while True:
        k = tex.find(r"\left", i)
        if k < 0 or tex[k + 5 : k + 6].isalpha():
            if k < 0:
                out.append(tex[i:])
                return "".join(out)
            out.append(tex[i : k + 5])
            i = k + 5
            continue
        end = _pair_end(tex, k, r"\left", r"\right")
        group = tex[k:end]
        m = re.match(r"\\left\s*(\\[A-Za-z]+|\\.|.)", group)
        close = re.search(r"\\right\s*(\\[A-Za-z]+|\\.|.)$", group)
        out.append(tex[i:k])
        if m is None or close is None:
            out.append(group)
        else:
            inner = flatten_delimiters(group[m.end() : close.start()])
            left, right = m.group(1), close.group(1)
            if _TALL.search(inner):
                out.append(f"\\left{left} {inner} \\right{right}")
            else:
                out.append(" ".join(d for d in (left, inner, right) if d != "."))
        i = end


def break_display(tex: str, width: float, measure: Measure, *, known_wide: bool = False) -> str:
    """The formula with every row wider than ``width`` (CSS px) broken over several lines.

    Returns ``tex`` unchanged when it already fits or offers no place to break. The result may
    still be wider than ``width`` where a single term is; the caller scales what remains.
    ``known_wide`` skips measuring the whole formula first (the caller knows it is too wide).
    """
    rows, aligned = _rows(tex)
    if not aligned and not known_wide and measure(tex) <= width:
        return tex
    out: list[str] = []
    broken = False
    for row in rows:
        lines, changed = _break_row(row, width, measure)
        out += lines
        broken = broken or changed
    if not broken:
        return tex
    return flatten_delimiters(r"\begin{aligned}" + r" \\ ".join(out) + r"\end{aligned}")
