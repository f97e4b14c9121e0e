"""Load combinations as data: each combination has its factors, its clause and the actions it
exists for; a set groups the combinations of one standard (or of the engineer's own choosing).

A combination names load cases by *symbol* (``"D"``, ``"L"``, ``"W"`` for ASCE/SEI 7, ``"G"``,
``"Q"`` for EN 1990 and AS/NZS 1170.0, or any names in a user-defined set). Applying a set to
the load cases of a job (:meth:`CombinationSet.apply`) gives the combinations that act:

* a case with no loads on the job contributes nothing, and a combination whose *leading*
  actions are all absent is left out (it would repeat another one);
* a symbol may stand for several cases of the job (``groups={"W": ("W_down", "W_up")}``): the
  combination is then repeated once per alternative; an alternative may itself be several cases
  loaded together, which is how pattern live loading is expressed;
* identical factor sets are kept once, under the first name;
* a case of the job that no combination uses is an error -- never silently ignored.
"""

from __future__ import annotations

from collections.abc import Iterable, Iterator, Mapping, Sequence
from dataclasses import dataclass, field

from calcpack.errors import InputError
from calcpack.validate import at_least, each_instance, find, finite, instance, non_empty, one_of

__all__ = [
    "AppliedCombination",
    "CombinationSet",
    "LoadCombination",
    "combination_set",
    "format_factors",
    "get_combination_set",
    "register_combination_set",
]

KINDS = ("strength", "allowable stress", "serviceability", "stability", "user")


def format_factors(factors: Iterable[tuple[str, float]]) -> str:
    """``"1.2D + 1.6L + 0.5Lr"`` from (case, factor) pairs (factor 1 is not written)."""
    parts: list[str] = []
    for i, (case, f) in enumerate(factors):
        mag = abs(f)
        coeff = "" if mag == 1.0 else f"{mag:.4g}"
        if i == 0:
            parts.append(f"{'-' if f < 0 else ''}{coeff}{case}")
        else:
            parts.append(f"{'-' if f < 0 else '+'} {coeff}{case}")
    return " ".join(parts) if parts else "0"


def _check_factors(factors: Mapping[str, float], where: str) -> dict[str, float]:
    out: dict[str, float] = {}
    at_least(f"factors of combination {where}", factors, what="load factor")
    for case, f in factors.items():
        non_empty(f"load case of combination {where}", case, expected="a case name such as 'D'")
        factor = f"factors[{case!r}] of combination {where}"
        finite(factor, instance(factor, f, (int, float), expected="a finite number"))
        out[case] = float(f)
    return out


@dataclass(frozen=True)
class LoadCombination:
    """One load combination: load factors on case symbols, with the clause that sets them.

    Args:
        name: its number or label in the standard (``"2"``, ``"6.10a (Q leading)"``).
        factors: case symbol -> load factor (dimensionless), e.g. ``{"D": 1.2, "L": 1.6}``.
        clause: the clause or equation it comes from (``"ASCE/SEI 7-16 §2.3.1 (2)"``).
        leading: the symbols this combination exists for; if none of them has loads on the job
            the combination is left out. Empty: always kept.
        note: words shown beside it (e.g. which factors are ψ values and where they are from).
    """

    name: str
    factors: Mapping[str, float]
    clause: str
    leading: tuple[str, ...] = ()
    note: str = ""

    def __post_init__(self) -> None:
        object.__setattr__(self, "factors", _check_factors(self.factors, repr(self.name)))
        object.__setattr__(self, "leading", tuple(self.leading))
        for s in self.leading:
            if s not in self.factors:
                raise InputError(
                    f"Combination {self.name!r}: leading action {s!r} has no load factor "
                    f"(factors are for {list(self.factors)})",
                    name="leading",
                    value=s,
                    expected="a symbol among the factors",
                )

    @property
    def expression(self) -> str:
        """``"1.2D + 1.6L"``."""
        return format_factors(self.factors.items())

    def __str__(self) -> str:
        return f"{self.name}: {self.expression}"


@dataclass(frozen=True)
class AppliedCombination:
    """A combination as it acts on a job: factors on the job's own case names.

    Attributes:
        name: unique label, e.g. ``"2: 1.2D + 1.6L"``, used to name the governing combination.
        factors: job case name -> load factor.
        clause: the clause it comes from. kind: strength, allowable stress, serviceability...
        source: the combination of the set it was made from. alternative: for symbols standing
            for several cases, which alternative was taken (symbol -> cases), else empty.
    """

    name: str
    factors: Mapping[str, float]
    clause: str
    kind: str
    source: LoadCombination
    alternative: Mapping[str, tuple[str, ...]] = field(default_factory=dict)

    @property
    def expression(self) -> str:
        return format_factors(self.factors.items())


def _alternatives(
    symbol: str, groups: Mapping[str, Sequence[str | Sequence[str]]]
) -> list[tuple[str, ...]]:
    if symbol not in groups:
        return [(symbol,)]
    out: list[tuple[str, ...]] = []
    for alt in groups[symbol]:
        out.append((alt,) if isinstance(alt, str) else tuple(alt))
    return out


@dataclass(frozen=True)
class CombinationSet:
    """A named set of load combinations from one standard (or the engineer's own).

    Args:
        name: the set's name (``"ASCE/SEI 7-16 §2.3 strength"``).
        kind: ``"strength"``, ``"allowable stress"``, ``"serviceability"``, ``"stability"`` or
            ``"user"``.
        combinations: the combinations, in the standard's order.
        standard: the standard and edition (``"ASCE/SEI 7-16"``); used in cautions.
        symbols: the load-case symbols the set knows, with their meaning (``{"D": "dead"}``).
        strict: if True, every symbol named by a combination must be a case of the job (user
            sets); if False, absent cases count as zero (a standard's full list).
    """

    name: str
    kind: str
    combinations: tuple[LoadCombination, ...]
    standard: str = ""
    symbols: Mapping[str, str] = field(default_factory=dict)
    strict: bool = False

    def __post_init__(self) -> None:
        one_of("kind", self.kind, KINDS)
        combos = tuple(self.combinations)
        at_least(f"combinations of set {self.name!r}", combos, what="LoadCombination")
        each_instance("combinations", combos, LoadCombination, expected="a LoadCombination")
        object.__setattr__(self, "combinations", combos)
        if not self.symbols:
            syms: dict[str, str] = {}
            for c in combos:
                for s in c.factors:
                    syms.setdefault(s, s)
            object.__setattr__(self, "symbols", syms)

    def __getitem__(self, name: str) -> LoadCombination:
        by_name = {c.name: c for c in self.combinations}
        return find("name", name, by_name, what="combination", where=f"in set {self.name!r}")

    def __iter__(self) -> Iterator[LoadCombination]:
        return iter(self.combinations)

    def __len__(self) -> int:
        return len(self.combinations)

    def apply(
        self,
        cases: Iterable[str],
        *,
        groups: Mapping[str, Sequence[str | Sequence[str]]] | None = None,
    ) -> tuple[AppliedCombination, ...]:
        """The combinations acting on a job with load cases ``cases``.

        Args:
            cases: the job's load-case names (e.g. ``solve_cases(beam).keys()``).
            groups: symbol -> the job cases it stands for, one combination per alternative; an
                alternative may be a tuple of cases loaded together (pattern loading).

        Raises:
            InputError: a case of the job is used by no combination of the set (names it and
                the set's symbols); in a strict set, a combination names a case the job lacks.
        """
        present = list(dict.fromkeys(cases))
        groups = dict(groups or {})
        for sym, alts in groups.items():
            if sym not in self.symbols:
                raise InputError(
                    f"groups names symbol {sym!r}, which set {self.name!r} does not use (its "
                    f"symbols are {list(self.symbols)})",
                    name=f"groups[{sym!r}]",
                    value=alts,
                    expected=f"one of {list(self.symbols)}",
                )
            if isinstance(alts, str) or not alts:
                raise InputError(
                    f"groups[{sym!r}] must be a non-empty list of case names or tuples of case "
                    f"names (got {alts!r})",
                    name=f"groups[{sym!r}]",
                    value=alts,
                    expected="e.g. ('W_down', 'W_up')",
                )
        grouped = {c for alts in groups.values() for alt in alts for c in _alternatives_one(alt)}
        covered = {s for s in self.symbols if s not in groups} | grouped
        unused = [c for c in present if c not in covered]
        if unused:
            raise InputError(
                f"Load case {unused[0]!r} is used in no combination of set {self.name!r} (its "
                f"cases are {list(self.symbols)}"
                + (f", groups {dict(groups)}" if groups else "")
                + "): rename the case, map it with groups=, or use another set",
                name="cases",
                value=unused[0],
                expected=f"one of {sorted(covered)}",
            )
        have = set(present)
        out: list[AppliedCombination] = []
        seen: set[tuple[tuple[str, float], ...]] = set()
        for combo in self.combinations:
            if self.strict:
                for s in combo.factors:
                    alts = _alternatives(s, groups)
                    missing = [c for alt in alts for c in alt if c not in have]
                    if missing:
                        raise InputError(
                            f"Combination {combo.name!r} of set {self.name!r} names load case "
                            f"{missing[0]!r}, which has no result (cases are {present})",
                            name="cases",
                            value=missing[0],
                            expected=f"one of {present}",
                        )
            if combo.leading and not any(
                c in have for s in combo.leading for alt in _alternatives(s, groups) for c in alt
            ):
                continue
            # one combination per choice of alternative for each grouped symbol
            choices: list[tuple[dict[str, float], dict[str, tuple[str, ...]]]] = [({}, {})]
            for sym, f in combo.factors.items():
                alts = _alternatives(sym, groups)
                nxt = []
                for factors, picked in choices:
                    for alt in alts:
                        nf = dict(factors)
                        for c in alt:
                            if c in have:
                                nf[c] = nf.get(c, 0.0) + f
                        np_ = dict(picked)
                        if sym in groups:
                            np_[sym] = alt
                        nxt.append((nf, np_))
                choices = nxt
            for factors, picked in choices:
                factors = {c: f for c, f in factors.items() if f != 0.0}
                if not factors:
                    continue
                key = tuple(sorted(factors.items()))
                if key in seen:
                    continue
                seen.add(key)
                label = format_factors(factors.items())
                if picked and len(choices) > 1:
                    alt_text = "; ".join(_alternative_text(s, a) for s, a in picked.items())
                    label = f"{label} [{alt_text}]"
                out.append(
                    AppliedCombination(
                        name=f"{combo.name}: {label}",
                        factors=factors,
                        clause=combo.clause,
                        kind=self.kind,
                        source=combo,
                        alternative=picked,
                    )
                )
        if not out:
            raise InputError(
                f"No combination of set {self.name!r} applies to load cases {present}",
                name="cases",
                value=present,
                expected=f"cases among {list(self.symbols)}",
            )
        return tuple(out)


def _alternative_text(symbol: str, cases: tuple[str, ...]) -> str:
    """Words for the alternative taken for ``symbol``: a pattern of spans
    (:func:`calcpack.combinations.pattern_cases` names its cases ``"L#2"``) reads by the spans
    it loads ("L on spans 1, 3"); other groups list their cases ("W: W_up")."""
    spans = [c[len(symbol) + 1 :] for c in cases if c.startswith(f"{symbol}#")]
    if spans and len(spans) == len(cases) and all(n.isdigit() for n in spans):
        return f"{symbol} on span{'s' if len(spans) > 1 else ''} {', '.join(spans)}"
    return f"{symbol}: {'+'.join(cases)}"


def _alternatives_one(alt: str | Sequence[str]) -> tuple[str, ...]:
    return (alt,) if isinstance(alt, str) else tuple(alt)


def combination_set(
    name: str,
    combinations: Mapping[str, Mapping[str, float]] | Sequence[LoadCombination],
    *,
    kind: str = "user",
    clause: str = "user-defined",
    standard: str = "",
) -> CombinationSet:
    """A user-defined combination set (strict: every case it names must exist on the job).

    Args:
        name: the set's name.
        combinations: ``{"C1": {"D": 1.25, "L": 1.5}, ...}`` or a list of
            :class:`LoadCombination`.
        kind: strength, allowable stress, serviceability, stability or user.
        clause: the reference shown beside each combination (e.g. the client's specification).
    """
    if isinstance(combinations, Mapping):
        combos = tuple(LoadCombination(n, dict(f), clause) for n, f in combinations.items())
    else:
        combos = tuple(combinations)
    return CombinationSet(name, kind, combos, standard=standard, strict=True)


_REGISTRY: dict[str, CombinationSet] = {}


def register_combination_set(key: str, cset: CombinationSet) -> None:
    """Make ``cset`` available as ``get_combination_set(key)``."""
    _REGISTRY[key] = cset


def get_combination_set(key: str) -> CombinationSet:
    """A built-in (or registered) combination set by key, e.g. ``"ASCE7-16 strength"``.

    Raises:
        InputError: no set of that name (the message lists the known keys).
    """
    from calcpack.combinations import asce7, asnzs1170  # noqa: F401  (registers the sets)

    if key not in _REGISTRY:
        raise InputError(
            f"Unknown combination set {key!r} (known sets: {sorted(_REGISTRY)}; EN 1990 sets "
            "are built with en1990_combinations(...) because they need the ψ categories)",
            name="combination set",
            value=key,
            expected=" / ".join(sorted(_REGISTRY)),
        )
    return _REGISTRY[key]
