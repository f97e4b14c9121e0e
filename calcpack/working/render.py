"""Renderers for sheet steps: LaTeX (Jupyter), HTML with TeX math (Jupyter and the PDF
pipeline) and plain text. They read steps; steps never format themselves.

HTML contract (the package build relies on it): each step is a ``<div class="cp-step cp-KIND">``;
math is TeX inside ``<span class="cp-math cp-math-display">\\[...\\]</span>`` or
``<span class="cp-math cp-math-inline">\\(...\\)</span>``, HTML-escaped. A ``<style
class="cp-style">`` block travels with each output so JupyterLab shows the layout; the PDF build
drops it and uses its own stylesheet.
"""

from __future__ import annotations

import base64
import html
import re
from typing import Any

from calcpack.contract.verdict import ratio_text, verdict_words
from calcpack.units import ureg
from calcpack.working.expr import Term
from calcpack.working.expr_print import _GREEK_TEXT, symbol_latex, to_latex, to_text
from calcpack.working.figure import Figure
from calcpack.working.figure_bands import panel_bands
from calcpack.working.format import (
    format_cell,
    format_number,
    format_quantity_latex,
    format_quantity_text,
)
from calcpack.working.prose import Citation, fill
from calcpack.working.steps import (
    RECORDS_MIMETYPE,
    Block,
    Check,
    Derived,
    Equation,
    Given,
    Heading,
    NotCovered,
    Step,
    Table,
    Text,
    Value,
    Verdict,
)

__all__ = ["STYLE", "mimebundle", "step_html", "step_latex", "step_text"]

STYLE = """<style class="cp-style">
.cp-step.cp-row{display:grid;gap:0 .8em;
grid-template-columns:minmax(6em,13%) minmax(8em,19%) minmax(0,1fr) minmax(8em,17%);
align-items:baseline;font-size:0.95em}
.cp-row>div{padding:.15em 0}
.cp-row>.cp-ref{border-right:1px solid #b9c0c8;padding-right:.6em;align-self:stretch}
.cp-row>.cp-out{border-left:1px solid #b9c0c8;padding-left:.6em;align-self:stretch}
.cp-row>.cp-wide{grid-column:2/4}
.cp-body mjx-container[display="true"]{text-align:left!important;margin:.2em 0!important}
.cp-desc{color:#333}.cp-ref,.cp-src{color:#555;font-size:.85em}
.cp-note{color:#555;font-size:.85em;font-style:italic}
.cp-out{font-size:.9em}.cp-verdict{display:block}.cp-notok{font-weight:bold}
.cp-heading{display:block;border-bottom:1.5px solid #333;margin-top:.6em}
.cp-heading h2,.cp-heading h3,.cp-heading h4{margin:.2em 0}
.cp-text,.cp-assume,.cp-caution,.cp-table,.cp-block,.cp-figure{display:block}
.cp-figure img{display:block;max-width:100%;height:auto}.cp-figure figure{margin:.4em 0}
.cp-figure figcaption{font-size:.85em;color:#333}.cp-cite{white-space:nowrap}
.cp-caution{border-left:4px solid #a06000;padding-left:.6em}
.cp-assume{border-left:4px solid #4a6a8a;padding-left:.6em}
.cp-table table{border-collapse:collapse;margin:.3em 0}
.cp-table th,.cp-table td{border:1px solid #aab;padding:.1em .5em;text-align:right}
.cp-table th{background:#eef0f3}.cp-table .cp-out p{margin:0}
</style>"""

_WIDE = 60  # visible characters beyond which a derivation is broken over aligned lines


def _esc(text: str) -> str:
    return html.escape(text, quote=False)


def _display_math(tex: str) -> str:
    return f'<span class="cp-math cp-math-display">\\[{_esc(tex)}\\]</span>'


def _inline_math(tex: str) -> str:
    return f'<span class="cp-math cp-math-inline">\\({_esc(tex)}\\)</span>'


def _visible_length(tex: str) -> int:
    stripped = re.sub(r"\\(left|right|mathrm|mathit|frac|cdot|times|sqrt|,|\s)", "", tex)
    stripped = re.sub(r"[{}^_\\ ]", "", stripped)
    return len(stripped)


def _prose_html(text: str) -> str:
    """Escape prose and turn ``$...$`` into inline math spans, ``**x**`` into bold and symbol
    names written in it (``F_c``, ``R_A,max``, ``sigma_b``) into set symbols."""
    parts = re.split(r"(?<!\\)\$(.+?)(?<!\\)\$", text)
    out = []
    for i, part in enumerate(parts):
        if i % 2:
            out.append(_inline_math(part))
        else:
            esc = symbols_html(_esc(part))
            esc = re.sub(r"\*\*(.+?)\*\*", r"<strong>\1</strong>", esc)
            out.append(esc)
    return "".join(out)


# A symbol name in prose: letters, then one or more _subscripts (letters, digits, ⊥), then
# optional ,qualifiers (R_A,max). Not inside a path or a dotted name (01_loads.ipynb, a.b_c).
_SYMBOL_IN_PROSE = re.compile(
    r"(?<![^\W\d]|[.\\-])([^\W\d_]+(?:_[^\W_]+[⊥]?)+(?:,[^\W\d_]+(?![\w]*_))*)(?!\w|\.\w)"
)


def symbols_html(escaped: str) -> str:
    """Set the symbol names in escaped prose as symbols: ``F_c`` → F<sub>c</sub>.

    Writers of prose (and of the library's descriptions) write symbols by name; the page shows
    the symbol as the working does, never the raw name.
    """

    def one(m: re.Match[str]) -> str:
        token = m.group(1)
        base, _, rest = token.partition("_")
        return _symbol_html(base + "_" + rest.replace(",", "_"))

    return _SYMBOL_IN_PROSE.sub(one, escaped)


def _prose_latex(text: str) -> str:
    return re.sub(r"([%#&])", r"\\\1", text)


# -- derivation lines -----------------------------------------------------------------------


def _derived_lines(step: Derived) -> list[str]:
    """The right-hand sides after the symbol: formula, substitution, result (as applicable)."""
    sig = step.sig
    result = format_quantity_latex(step.display_quantity, sig)
    if step.formula is None:
        return [result]
    symbolic = to_latex(step.formula, sig=sig)
    lines = [symbolic]
    if _has_values(step.formula):
        subst = to_latex(step.formula, substitute=True, sig=sig)
        if subst != symbolic:
            lines.append(subst)
    if lines[-1] != result:
        lines.append(result)
    return lines


def _has_values(term: Term) -> bool:
    return any(isinstance(b, Value) for b in term.bindings.values())


def _equation_tex(lhs: str, rhs_lines: list[str]) -> str:
    total = _visible_length(lhs) + sum(_visible_length(r) for r in rhs_lines)
    if total <= _WIDE or len(rhs_lines) == 1:
        return lhs + " = " + " = ".join(rhs_lines)
    body = " \\\\ ".join(f"&= {r}" for r in rhs_lines)
    return f"\\begin{{aligned}} {lhs} {body} \\end{{aligned}}"


def _given_tex(step: Given) -> str:
    return f"{step.latex_symbol} = {format_quantity_latex(step.display_quantity, step.sig)}"


def _equation_lines(step: Equation) -> tuple[str, str]:
    sig = step.sig
    sym = f"{to_latex(step.lhs, sig=sig)} = {to_latex(step.rhs, sig=sig)}"
    sub = (
        f"{to_latex(step.lhs, substitute=True, sig=sig)} = "
        f"{to_latex(step.rhs, substitute=True, sig=sig)}"
    )
    return sym, sub


def _check_tex(step: Check) -> tuple[str, str]:
    sig = step.sig
    d = format_quantity_latex(step.demand_q, sig)
    c = format_quantity_latex(step.capacity_q, sig)
    dsym = step.demand.latex_symbol if isinstance(step.demand, Value) else ""
    csym = step.capacity.latex_symbol if isinstance(step.capacity, Value) else ""
    rel = r"\le" if step.passed else r">"
    left = f"\\left|{dsym}\\right| = {d}" if dsym else d
    if dsym and float(step.demand_q.magnitude) >= 0:
        left = f"{dsym} = {d}"
    right = f"{csym} = {c}" if csym else c
    comparison = f"{left} \\;{rel}\\; {right}"
    num = format_number(abs(float(step.demand_q.magnitude)), sig, latex=True)
    den = format_number(float(step.capacity_q.magnitude), sig, latex=True)
    util = format_number(step.utilisation, sig, latex=True)
    ratio = f"\\eta = \\frac{{{num}}}{{{den}}} = {util}"
    return comparison, ratio


def _verdict_html(verdict: str, utilisation: float | None, ref: str | None, sig: int) -> str:
    """The verdict in words beside the utilisation (``0.64 ≤ 1.00, satisfies §F2``), for the
    output margin: written, not coloured; a failure in capitals."""
    classes: dict[str, str] = {Verdict.OK: "cp-ok", Verdict.NOT_OK: "cp-notok"}
    cls = classes.get(verdict, "cp-nc")
    ratio = ratio_text(utilisation, sig) if verdict != Verdict.NOT_COVERED else ""
    words = symbols_html(_esc(verdict_words(verdict, ref)))
    lead = f'<span class="cp-ratio">{_esc(ratio)}</span>, ' if ratio else ""
    return f'<span class="cp-verdict {cls}">{lead}<span class="cp-words">{words}</span></span>'


# -- HTML ------------------------------------------------------------------------------------
# A step is a row of the calc pad: the reference margin (clause, table, source), the
# description and the working (the body), and the output margin (what leaves the sheet: a
# check's verdict, an exported value).


def _row(
    kind: str, desc: str, body: str, ref: str = "", name: str | None = None, out: str = ""
) -> str:
    attr = f' data-name="{html.escape(name)}"' if name else ""
    return (
        f'<div class="cp-step cp-{kind} cp-row"{attr}><div class="cp-ref">{ref}</div>'
        f'<div class="cp-desc">{desc}</div><div class="cp-body">{body}</div>'
        f'<div class="cp-out">{out}</div></div>'
    )


def _step_html_body(step: Step) -> str:
    if isinstance(step, Given):
        src = f'<div class="cp-src">{symbols_html(_esc(step.source))}</div>' if step.source else ""
        link = getattr(step, "link", None)
        if link and step.source:
            # An imported value: its source links to the exporting sheet (page set at layout).
            src = (
                f'<div class="cp-src"><a class="cp-link" href="{html.escape(link)}">'
                f"{symbols_html(_esc(step.source))}</a></div>"
            )
        return _row(
            "given", _prose_html(step.description), _display_math(_given_tex(step)), src, step.name
        )
    if isinstance(step, Derived):
        tex = _equation_tex(step.latex_symbol, _derived_lines(step))
        note = f'<div class="cp-note">{_prose_html(step.note)}</div>' if step.note else ""
        return _row(
            "derived",
            _prose_html(step.description),
            _display_math(tex) + note,
            symbols_html(_esc(step.ref or "")),
            step.name,
        )
    if isinstance(step, Equation):
        sym, sub = _equation_lines(step)
        label = _inline_math(step.label) if step.label else ""
        desc = _prose_html(step.description) + (" " if step.description else "") + label
        body = _display_math(sym) + (_display_math(sub) if sub != sym else "")
        return _row("equation", desc, body)
    if isinstance(step, Check):
        comparison, ratio = _check_tex(step)
        body = _display_math(comparison) + _display_math(ratio)
        member = f"{_esc(step.member)}: " if step.member else ""
        combo = f'<div class="cp-note">{_esc(step.combination)}</div>' if step.combination else ""
        name = symbols_html(_esc(step.name))
        desc = f"<strong>{member}{name}</strong> {_prose_html(step.description)}"
        verdict = _verdict_html(step.verdict, step.utilisation, step.ref, step.sig)
        return _row(
            "check", desc, body + combo, symbols_html(_esc(step.ref or "")), step.name, verdict
        )
    if isinstance(step, NotCovered):
        return _row(
            "check",
            f"<strong>{symbols_html(_esc(step.name))}</strong>",
            _prose_html(step.reason),
            symbols_html(_esc(step.ref or "")),
            out=_verdict_html(step.verdict, None, step.ref, step.sig),
        )
    if isinstance(step, Heading):
        lvl = min(step.level + 1, 4)
        return f'<div class="cp-step cp-heading"><h{lvl}>{_prose_html(step.title)}</h{lvl}></div>'
    if isinstance(step, Text):
        labels = {
            "assume": "<strong>Assumption.</strong> ",
            "caution": "<strong>Caution.</strong> ",
        }
        paras = [p for p in re.split(r"\n\s*\n", step.template.strip()) if p.strip()]
        inner = "".join(
            f"<p>{labels.get(step.kind, '') if i == 0 else ''}{_prose_html(p)}</p>"
            for i, p in enumerate(paras)
        )
        if step.citations:
            inner = fill(inner, step.citations, _cite_html)
        return f'<div class="cp-step cp-{step.kind}">{inner}</div>'
    if isinstance(step, Table):
        head = "".join(f"<th>{_prose_html(c)}</th>" for c in step.columns)
        body = "".join(
            "<tr>"
            + "".join(f"<td>{_cell_html(c, step.sig, step.settings)}</td>" for c in r)
            + "</tr>"
            for r in step.rows
        )
        cap = f"<caption>{_prose_html(step.caption)}</caption>" if step.caption else ""
        table = f"<table>{cap}<thead><tr>{head}</tr></thead><tbody>{body}</tbody></table>"
        entries = getattr(step, "entries", None)
        if entries is not None:
            # values that leave the sheet: a row of the calc pad, listed in the output margin
            return (
                f'<div class="cp-step cp-table cp-row cp-exports"><div class="cp-ref">'
                f'exported</div><div class="cp-body cp-wide">{table}</div>'
                f'<div class="cp-out">{_exported_html(entries, step)}</div></div>'
            )
        return (
            f'<div class="cp-step cp-table">{table}'
            # the end of a box that may run over a page (the PDF's "continued" mark stops)
            '<div class="cp-boxend"></div></div>'
        )
    if isinstance(step, Figure):
        return _figure_html(step)
    if isinstance(step, Block):
        title = (
            f'<div class="cp-step cp-heading"><h4>{symbols_html(_esc(step.title or ""))}</h4></div>'
        )
        inner = "".join(_step_html_body(s) for s in step.steps)
        return f'<div class="cp-step cp-block">{title if step.title else ""}{inner}</div>'
    raise TypeError(f"no HTML renderer for {type(step).__name__}")


_SKIP_OPEN = re.compile(r"<(code|pre)\b|<span class=\"cp-math")


def symbols_in_html(markup: str) -> str:
    """:func:`symbols_html` on the text of an HTML fragment (markdown cells, project texts),
    leaving tags, code and math alone."""
    out: list[str] = []
    closing: str | None = None
    for piece in re.split(r"(<[^>]+>)", markup):
        if piece.startswith("<"):
            if closing is None:
                m = _SKIP_OPEN.match(piece)
                if m:
                    closing = f"</{m.group(1) or 'span'}>"
            elif piece.startswith(closing):
                closing = None
            out.append(piece)
        else:
            out.append(piece if closing else symbols_html(piece))
    return "".join(out)


def _symbol_html(name: str) -> str:
    """A symbol name as HTML text, set as the TeX symbol is: ``M_max`` → M<sub>max</sub>."""
    primes = 0
    while name.endswith("_prime"):
        name, primes = name[: -len("_prime")], primes + 1
    base, *subs = name.split("_")

    star = bool(subs) and subs[-1] == "star"
    subs = [_SUB_WORDS.get(p, p) for p in (subs[:-1] if star else subs) if p]

    def part(p: str) -> str:
        if p in _GREEK_TEXT:
            return _GREEK_TEXT[p]
        if p.endswith("perp") and len(p) > 4:
            return part(p[:-4]) + "⊥"
        # one letter is a variable (italic); a word or a numeral (max, III) is upright
        return f"<i>{_esc(p)}</i>" if len(p) == 1 and p.isalpha() else _esc(p)

    out = part(base)
    if subs:
        out += "<sub>" + ",".join(part(p) for p in subs) + "</sub>"
    return out + ("*" if star else "") + "\u2032" * primes


_SUB_WORDS = {"perp": "⊥"}


def _cite_html(c: Citation) -> str:
    """A cited value as HTML text (searchable and copyable in the PDF), number and unit kept
    on one line; a symbol with its own TeX form is typeset as math."""
    if c.latex == symbol_latex(c.name):
        sym = f'<span class="cp-sym">{_symbol_html(c.name)}</span>'
    else:
        sym = _inline_math(c.latex)
    nbsp = _esc(c.value_text).replace(" ", "\u00a0")
    value = f'<span class="cp-val">{nbsp}</span>'
    body = {"full": f"{sym} = {value}", "value": value, "symbol": sym}[c.form]
    return f'<span class="cp-cite">{body}</span>'


_MARGIN_VALUES = 6  # exported values listed one a line in the output margin; more are counted


def _exported_html(entries: list[dict[str, Any]], step: Table) -> str:
    """The output margin of an exports table: each value that leaves the sheet, or how many."""
    if len(entries) > _MARGIN_VALUES:
        return f"<p>{len(entries)} values to other sheets</p>"
    lines = []
    for e in entries:
        q = ureg.Quantity(e["value"], e["pint_unit"])
        case = f" ({_esc(str(e['case']))})" if e.get("case") else ""
        value = _esc(format_cell(q, step.sig, step.settings)).replace(" ", "\u00a0")
        lines.append(f"<p>{_inline_math(e['symbol'])}{case} = {value}</p>")
    return "".join(lines)


def _figure_html(step: Figure) -> str:
    """The figure as an SVG image (a ``data:`` URI) with its alternative text and caption; a
    figure of stacked panels as one image per panel, so a page may break between panels
    (:mod:`calcpack.working.figure_bands`)."""
    svg = step.svg()
    bands = panel_bands(svg)
    alt = html.escape(step.alt, quote=True)
    if not bands:
        images = f'<img class="cp-figure-img" alt="{alt}" src="{_svg_uri(svg)}"/>'
    else:
        # the first panel carries the figure's words; the others say what they continue
        first = html.escape(step.alt.rstrip(". "), quote=True)
        more = f"{first}, continued"
        images = "".join(
            f'<img class="cp-figure-img cp-band" alt="{first if k == 1 else more}: panel {k} of '
            f'{len(bands)}" src="{_svg_uri(band.svg)}"/>'
            for k, band in enumerate(bands, start=1)
        )
    split = " cp-split" if bands else ""
    return (
        f'<div class="cp-step cp-figure{split}"><figure>{images}'
        f"<figcaption>{_prose_html(step.caption)}</figcaption></figure></div>"
    )


def _svg_uri(svg: str) -> str:
    return "data:image/svg+xml;base64," + base64.b64encode(svg.encode("utf-8")).decode("ascii")


def _cell_html(cell: Any, sig: int, settings: Any = None) -> str:
    if isinstance(cell, Value):
        return _esc(format_quantity_text(cell.display_quantity, sig))
    if isinstance(cell, str):
        return _prose_html(cell)
    return _esc(format_cell(cell, sig, settings))


def _cell_text(cell: Any, sig: int, settings: Any = None) -> str:
    if isinstance(cell, Value):
        return format_quantity_text(cell.display_quantity, sig)
    return format_cell(cell, sig, settings)


def step_html(step: Step) -> str:
    """One step (or block) as HTML with its style block, ready for Jupyter or the build."""
    return STYLE + _step_html_body(step)


def steps_html(steps: list[Step]) -> str:
    """Several steps as one HTML fragment with a single style block."""
    return STYLE + "".join(_step_html_body(s) for s in steps)


# -- LaTeX -----------------------------------------------------------------------------------


def _latex_body(step: Step) -> str:
    if isinstance(step, Given):
        return _given_tex(step)
    if isinstance(step, Derived):
        return _equation_tex(step.latex_symbol, _derived_lines(step))
    if isinstance(step, Equation):
        sym, sub = _equation_lines(step)
        lab = f"{step.label}:\\quad " if step.label else ""
        return lab + sym + (f" \\;\\Rightarrow\\; {sub}" if sub != sym else "")
    if isinstance(step, Check):
        comparison, ratio = _check_tex(step)
        return f"{comparison},\\quad {ratio}\\quad \\text{{{step.verdict}}}"
    if isinstance(step, NotCovered):
        return f"\\text{{{step.name}: {step.verdict}}}"
    if isinstance(step, Heading | Text):
        body = step.title if isinstance(step, Heading) else step.tex_body
        parts = re.split(r"(?<!\\)\$(.+?)(?<!\\)\$", body)
        return "".join(
            part if i % 2 else (f"\\text{{{_prose_latex(part)}}}" if part else "")
            for i, part in enumerate(parts)
        )
    if isinstance(step, Table):
        return f"\\text{{[table: {len(step.rows)} rows]}}"
    if isinstance(step, Figure):
        return f"\\text{{[figure: {_prose_latex(step.caption)}]}}"
    if isinstance(step, Block):
        return " \\\\ ".join(_latex_body(s) for s in step.steps)
    raise TypeError(f"no LaTeX renderer for {type(step).__name__}")


def step_latex(step: Step) -> str:
    """One step as display LaTeX (``$$...$$``) for Jupyter's text/latex output."""
    if isinstance(step, Block):
        return "$$\\begin{gathered}" + _latex_body(step) + "\\end{gathered}$$"
    return f"$${_latex_body(step)}$$"


# -- plain text ------------------------------------------------------------------------------


def step_text(step: Step) -> str:
    """One step as plain text, one or more lines."""
    sig = step.sig
    if isinstance(step, Given):
        src = f"  [{step.source}]" if step.source else ""
        desc = f"  ({step.description})" if step.description else ""
        return f"{step.text_symbol} = {step.result_text()}{desc}{src}"
    if isinstance(step, Derived):
        parts = [step.text_symbol]
        if step.formula is not None:
            parts.append(to_text(step.formula, sig=sig))
            if _has_values(step.formula):
                parts.append(to_text(step.formula, substitute=True, sig=sig))
        parts.append(step.result_text())
        dedup = [parts[0]] + [p for i, p in enumerate(parts[1:], 1) if p != parts[i - 1]]
        ref = f"  [{step.ref}]" if step.ref else ""
        desc = f"  ({step.description})" if step.description else ""
        return " = ".join(dedup) + desc + ref
    if isinstance(step, Equation):
        lab = f"{_plain_label(step.label)}: " if step.label else ""
        sym = f"{to_text(step.lhs, sig=sig)} = {to_text(step.rhs, sig=sig)}"
        sub = (
            f"{to_text(step.lhs, substitute=True, sig=sig)} = "
            f"{to_text(step.rhs, substitute=True, sig=sig)}"
        )
        return lab + sym + (f"  →  {sub}" if sub != sym else "")
    if isinstance(step, Check):
        rel = "≤" if step.passed else ">"
        d = format_quantity_text(step.demand_q, sig)
        c = format_quantity_text(step.capacity_q, sig)
        who = f"{step.member}: " if step.member else ""
        ref = f"  [{step.ref}]" if step.ref else ""
        util = format_number(step.utilisation, sig)
        return f"{who}{step.name}: {d} {rel} {c}, utilisation {util}  {step.verdict}{ref}"
    if isinstance(step, NotCovered):
        return f"{step.name}: {step.verdict} — {step.reason}"
    if isinstance(step, Figure):
        return f"[Figure: {step.caption}] {step.alt}"
    if isinstance(step, Heading):
        return step.title.upper() if step.level <= 2 else step.title
    if isinstance(step, Text):
        prefix = {"assume": "Assumption: ", "caution": "Caution: "}.get(step.kind, "")
        return prefix + step.body
    if isinstance(step, Table):
        rows = [step.columns] + [[_cell_text(c, sig, step.settings) for c in r] for r in step.rows]
        widths = [max(len(str(r[i])) for r in rows) for i in range(len(step.columns))]
        lines = [" | ".join(str(c).rjust(w) for c, w in zip(r, widths, strict=True)) for r in rows]
        lines.insert(1, "-+-".join("-" * w for w in widths))
        return "\n".join(([step.caption] if step.caption else []) + lines)
    if isinstance(step, Block):
        head = [step.title] if step.title else []
        return "\n".join(head + [step_text(s) for s in step.steps])
    raise TypeError(f"no text renderer for {type(step).__name__}")


def _plain_label(tex: str) -> str:
    out = re.sub(r"\\(Sigma|sum)\s*", "Σ", tex).replace("\\", "")
    return re.sub(r"[{}]", "", out)


def mimebundle(step: Step) -> dict[str, Any]:
    """The rich-display bundle: HTML, LaTeX, plain text and the step's records."""
    bundle: dict[str, Any] = {
        "text/html": step_html(step),
        "text/latex": step_latex(step),
        "text/plain": step_text(step),
    }
    records = step.records()
    if records:
        bundle[RECORDS_MIMETYPE] = records
    return bundle
