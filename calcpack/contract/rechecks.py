"""Independent checks in a comparison of two manifests: a past agreement the change upstream
invalidates is flagged "re-check needed".

The manifest's ``verifications`` hold each of the checker's independent checks compared with
the preparer's value. When the preparer's value of a checked result differs between the two
manifests, the checker's earlier agreement was with another number: the comparison lists the
check as a change of kind ``"verification"`` whose new text says the check must be redone
(with the new comparison's outcome). A check added or removed is listed too.
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    from calcpack.contract.compare import Change

__all__ = ["verification_changes"]


def _key(v: Mapping[str, Any]) -> tuple[str, ...]:
    return tuple(
        str(v.get(k) or "") for k in ("checker_sheet", "of_sheet", "of_name", "member", "case")
    )


def _label(v: Mapping[str, Any]) -> str:
    what = str(v.get("of_name", "?")) + (f" ({v['member']})" if v.get("member") else "")
    if v.get("case"):
        what += f", case {v['case']}"
    return f"{what}, checked on sheet {v.get('checker_number', '?')}"


def _text(v: Mapping[str, Any]) -> str:
    unit = f" {v.get('unit')}" if v.get("unit") else ""
    outcome = "agreed" if v.get("agreed") else "DISAGREES"
    return (
        f"preparer {v.get('preparer_value', 0):.6g}{unit}, checker "
        f"{v.get('checker_value', 0):.6g}{unit}: {outcome}"
    )


def _differs(a: Any, b: Any, rel_tol: float) -> bool:
    if isinstance(a, int | float) and isinstance(b, int | float):
        return not math.isclose(float(a), float(b), rel_tol=rel_tol, abs_tol=1e-300)
    return bool(a != b)


def verification_changes(
    old: Mapping[str, Any], new: Mapping[str, Any], rel_tol: float
) -> list[Change]:
    """Changes of kind ``"verification"`` between two manifests that both record them."""
    from calcpack.contract.compare import Change

    if "verifications" not in old or "verifications" not in new:
        return []
    a = {_key(v): v for v in old.get("verifications") or [] if isinstance(v, Mapping)}
    b = {_key(v): v for v in new.get("verifications") or [] if isinstance(v, Mapping)}
    numbers = {str(s.get("path")): str(s.get("number", "?")) for s in new.get("sheets", [])}
    out = []
    for key in [*b, *(k for k in a if k not in b)]:
        va, vb = a.get(key), b.get(key)
        v = vb or va
        assert v is not None
        sheet = f"sheet {numbers.get(key[1], key[1])}"
        if va is None or vb is None:
            old_text = _text(va) if va else None
            new_text = _text(vb) if vb else None
            out.append(Change(sheet, "verification", _label(v), old_text, new_text, path=key[1]))
        elif _differs(va.get("preparer_value"), vb.get("preparer_value"), rel_tol):
            out.append(
                Change(
                    sheet,
                    "verification",
                    _label(v),
                    _text(va),
                    "re-check needed, the preparer's value changed; now " + _text(vb),
                    verdict_changed=bool(va.get("agreed")) != bool(vb.get("agreed")),
                    path=key[1],
                )
            )
        elif any(_differs(va.get(f), vb.get(f), rel_tol) for f in ("checker_value", "agreed")):
            out.append(Change(sheet, "verification", _label(v), _text(va), _text(vb), path=key[1]))
    return out
