"""ACI CODE-318-19 concrete checks: pad footings and piers (reinforced and plain); cast-in
anchors (Chapter 17).

Edition implemented: ACI CODE-318-19 (with the clause numbers of that edition). Its provisions
must be confirmed against the edition adopted locally before issue.
"""

from calcpack.checks.aci318.anchor_data import (
    ANCHOR_FACTORS,
    AnchorGroup,
    AnchorLoads,
    anchor_steel,
)
from calcpack.checks.aci318.anchors import check_aci_anchors
from calcpack.checks.aci318.footing import ACI318, beta1, check_aci_footing, size_effect
from calcpack.checks.aci318.footing_data import ACI318_EDITION, ACIFootingDesign
from calcpack.checks.aci318.plain import check_plain_footing

__all__ = [
    "ACI318",
    "ACI318_EDITION",
    "ANCHOR_FACTORS",
    "ACIFootingDesign",
    "AnchorGroup",
    "AnchorLoads",
    "anchor_steel",
    "beta1",
    "check_aci_anchors",
    "check_aci_footing",
    "check_plain_footing",
    "size_effect",
]
