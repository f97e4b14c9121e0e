"""Give each page (and each tiling pattern and form drawn on it) only the resources it names.

WeasyPrint writes one resource dictionary per layout chunk, shared by every page of the chunk
and by the patterns and forms drawn on them: each page then names every font, pattern, image and
graphics state of its chunk. A reader only looks a name up, so that costs nothing when
displaying; but the signature's difference analysis (signing and verifying) follows every path
from the document catalog to every object, and a shared dictionary reached from each of a
chunk's pages, and again through each pattern, multiplies the paths (a 116-page package had
about 700,000). :func:`prune_resources` replaces each such dictionary by a direct copy holding,
in each category, only the names that occur as name tokens in the object's content stream(s):
a name kept that is not used is harmless, and a name used always occurs in the stream
(ISO 32000-1 §7.8.3: content streams refer to resources by name only).
"""

from __future__ import annotations

import re
from typing import Any

__all__ = ["prune_resources"]

_NAME = re.compile(rb"/([^\s/<>\[\]()%{}]+)")
"""A name token (its characters as written; ``#xx`` escapes are kept as they are and compared
as written -- a resource name with an escape is kept whenever any token could be it)."""

_CATEGORIES = ("/Font", "/XObject", "/Pattern", "/ExtGState", "/ColorSpace", "/Shading")


def prune_resources(writer: Any) -> int:
    """Prune the resources of every page of ``writer``'s document and of the tiling patterns
    and forms they draw (recursively), each to the names its content uses. Returns how many
    resource dictionaries were replaced. Objects no longer referenced are left for the caller
    to free."""
    done = 0
    seen: set[int] = set()
    for page in writer.pages:
        streams = _streams(page.get("/Contents"))
        if streams is None:
            continue
        done += _prune(page, streams, seen)
    return done


def _streams(contents: Any) -> list[Any] | None:
    from pypdf.generic import ArrayObject, StreamObject

    if contents is None:
        return []
    target = contents.get_object()
    items = list(target) if isinstance(target, ArrayObject) else [contents]
    out = []
    for item in items:
        obj = item.get_object()
        if not isinstance(obj, StreamObject):
            return None
        out.append(obj)
    return out


def _prune(holder: Any, streams: list[Any], seen: set[int]) -> int:
    """Replace ``holder``'s ``/Resources`` by the entries its ``streams`` name, then do the same
    for the tiling patterns and forms among them (each once)."""
    from pypdf.generic import DictionaryObject, NameObject, StreamObject

    resources = holder.get("/Resources")
    if resources is None:
        return 0
    resources = resources.get_object()
    if not isinstance(resources, DictionaryObject):
        return 0
    try:
        used = {b"/" + m for s in streams for m in _NAME.findall(s.get_data())}
    except Exception:  # a filter pypdf cannot decode: leave the resources as they are
        return 0
    names = {n.decode("latin-1") for n in used}
    pruned = DictionaryObject()
    for key, value in resources.items():
        category = value.get_object()
        if key in _CATEGORIES and isinstance(category, DictionaryObject):
            pruned[NameObject(key)] = DictionaryObject(
                {NameObject(k): v for k, v in category.items() if k in names}
            )
        else:
            pruned[NameObject(key)] = value
    holder[NameObject("/Resources")] = pruned
    done = 1
    for key in ("/Pattern", "/XObject"):
        category = pruned.get(key)
        if category is None:
            continue
        for ref in category.get_object().values():
            obj = ref.get_object()
            number = getattr(ref, "idnum", None)
            if number is None or number in seen or not isinstance(obj, StreamObject):
                continue
            seen.add(number)
            drawn = key == "/XObject" and obj.get("/Subtype") == "/Form"
            if drawn or (key == "/Pattern" and obj.get("/PatternType") == 1):
                done += _prune(obj, [obj], seen)
    return done
