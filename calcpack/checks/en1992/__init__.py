"""EN 1992-1-1:2004 (Eurocode 2) concrete checks: pad footings.

Recommended values with the UK National Annex α_cc as an option; the provisions and annex values
must be confirmed against those adopted locally before issue.
"""

from calcpack.checks.en1992.footing import EN1992, ECFootingDesign, check_en1992_footing

__all__ = ["EN1992", "ECFootingDesign", "check_en1992_footing"]
