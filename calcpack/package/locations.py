"""Where calcpack's templates are, without importing nbconvert (kept light for quick checks)."""

from __future__ import annotations

from pathlib import Path

__all__ = ["template_dirs"]


def template_dirs() -> list[str]:
    """Extra template folders: the source tree's ``templates/`` when running from a checkout.

    An installed calcpack has its templates in ``share/jupyter/nbconvert/templates``, which
    nbconvert searches by itself.
    """
    import calcpack

    source = Path(calcpack.__file__).resolve().parent.parent / "templates"
    return [str(source)] if (source / "calcpack" / "conf.json").is_file() else []
