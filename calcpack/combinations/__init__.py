"""Load combinations as data (with their clauses), superposition of per-case results, envelopes
naming the governing combination, and pattern loading of continuous spans.

Built-in sets: ASCE/SEI 7-16 §2.3 strength and §2.4 allowable stress (:func:`asce7_strength`,
:func:`asce7_allowable_stress`); EN 1990 Eq. 6.10 or 6.10a/b and §6.5.3 serviceability with the
ψ factors of Annex A1 (:func:`en1990_combinations`, :func:`en1990_serviceability`), and
the same with a National Annex's values (:func:`en1990_annex`, ``"UK"`` or ``"recommended"``:
:func:`annex_combinations`, :func:`annex_serviceability`, EQU
:func:`annex_equ_combinations`); AS/NZS 1170.0 §4.2.2 strength and §4.3 serviceability
(:func:`asnzs1170_strength`,
:func:`asnzs1170_serviceability`); and user-defined sets (:func:`combination_set`).
"""

from calcpack.combinations.asce7 import ASCE7_EDITION, asce7_allowable_stress, asce7_strength
from calcpack.combinations.asnzs1170 import (
    ASNZS1170_EDITION,
    PSI_TABLE_4_1,
    ImposedPsi,
    asnzs1170_serviceability,
    asnzs1170_strength,
)
from calcpack.combinations.en1990 import (
    EN1990_EDITION,
    PSI_BUILDINGS,
    Psi,
    en1990_combinations,
    en1990_serviceability,
)
from calcpack.combinations.en1990_annex import (
    NationalAnnex,
    annex_combinations,
    annex_equ_combinations,
    annex_serviceability,
    en1990_annex,
)
from calcpack.combinations.model import (
    AppliedCombination,
    CombinationSet,
    LoadCombination,
    combination_set,
    format_factors,
    get_combination_set,
    register_combination_set,
)
from calcpack.combinations.pattern import pattern_cases, span_limits
from calcpack.combinations.superpose import (
    CombinedResults,
    Envelope,
    Governing,
    analyse_combinations,
    superpose,
)

__all__ = [
    "ASCE7_EDITION",
    "ASNZS1170_EDITION",
    "EN1990_EDITION",
    "PSI_BUILDINGS",
    "PSI_TABLE_4_1",
    "AppliedCombination",
    "CombinationSet",
    "CombinedResults",
    "Envelope",
    "Governing",
    "ImposedPsi",
    "LoadCombination",
    "NationalAnnex",
    "Psi",
    "analyse_combinations",
    "annex_combinations",
    "annex_equ_combinations",
    "annex_serviceability",
    "asce7_allowable_stress",
    "asce7_strength",
    "asnzs1170_serviceability",
    "asnzs1170_strength",
    "combination_set",
    "en1990_annex",
    "en1990_combinations",
    "en1990_serviceability",
    "format_factors",
    "get_combination_set",
    "pattern_cases",
    "register_combination_set",
    "span_limits",
    "superpose",
]
