"""Flatten a tagged PDF's structure tree: drop the grouping elements that carry no meaning.

WeasyPrint tags every HTML box it lays out: a ``<span>`` becomes a ``Span`` element, a ``<div>``
a ``Div``, an anonymous box a ``NonStruct``. In a calculation package most structure elements
are of these three kinds (about 14,000 of the 20,000 elements of a 100-page package), each an
object of its own in the file. Signing and verifying cost time in proportion to the objects of
the file (the signature's difference analysis walks the object graph once per revision), and a
reader of the tags gains nothing from them: ``Span``, ``Div`` and ``NonStruct`` are grouping
types with no semantics of their own (ISO 32000-1 §14.8.4.2 and §14.8.4.4, table 333 and 338),
so a reader takes their content as the content of the enclosing element.

:func:`flatten_structure` replaces each such element, in its parent's ``/K``, by its own kids in
order, when it carries nothing but its type, parent, page and kids (no ``/A`` attributes,
``/C`` classes, ``/ID``, ``/Alt``, ``/ActualText``, ``/E``, ``/Lang``, ``/T`` or revision
``/R``): then nothing is lost. Every other element is kept -- the document and its sections,
headings, paragraphs, lists (``L``, ``LI``, ``Lbl``, ``LBody``), tables (``Table``, ``THead``,
``TBody``, ``TR``, ``TH``, ``TD``), figures with their alternative text, captions and links -- and
so is any ``Span``, ``Div`` or ``NonStruct`` with an attribute.

What moves with the content (ISO 32000-1 §14.7.4):

- a marked-content id (``MCID``) given as an integer belongs to the page of its element
  (``/Pg``, inherited from the nearest ancestor that has one); moved to an owner on another page
  (or with no ``/Pg``) it becomes a marked-content reference ``<< /Type /MCR /Pg page /MCID n >>``;
- the parent tree (the number tree from each page's ``/StructParents`` to an array of the
  elements owning its ids, and from each annotation's ``/StructParent`` to its element) names the
  new owner wherever it named a dropped element;
- object references (``/OBJR``) to annotations move like content; a kept element's ``/P`` names
  its new parent.

The dropped elements are then unreachable, and :func:`drop_unreachable` frees every object that
can no longer be reached from the document catalog or the information dictionary, so that they
are not written.
"""

from __future__ import annotations

import re
from collections.abc import Iterator
from dataclasses import dataclass
from typing import Any

__all__ = ["FlattenResult", "drop_unreachable", "flatten_structure"]

FLATTENED_TYPES = frozenset({"/Span", "/Div", "/NonStruct"})
"""Structure types with no meaning of their own (ISO 32000-1 §14.8.4: grouping and inline
elements), dropped when they carry no attribute."""

_BARE_KEYS = frozenset({"/Type", "/S", "/P", "/Pg", "/K"})
"""The keys an element may have and still be dropped: anything else (attributes, classes,
identifiers, alternative or replacement text, language, title, revision) is kept with it."""


@dataclass(frozen=True)
class FlattenResult:
    """What :func:`flatten_structure` did.

    Attributes:
        elements_before: structure elements reachable from the tree root before.
        elements_after: the same, after.
        moved_ids: marked-content ids that moved to another element.
        artifacts: marked-content sequences of copied page-margin boxes, which no element of
            the tree held, marked as pagination artifacts.
    """

    elements_before: int
    elements_after: int
    moved_ids: int
    artifacts: int = 0


def _kids(value: Any) -> list[Any]:
    """A ``/K`` value as a list (it may be one kid or an array of kids)."""
    from pypdf.generic import ArrayObject

    if value is None:
        return []
    target = value.get_object()
    if isinstance(target, ArrayObject):
        return list(target)
    return [value]


def _is_element(obj: Any) -> bool:
    from pypdf.generic import DictionaryObject

    return (
        isinstance(obj, DictionaryObject)
        and "/S" in obj
        and obj.get("/Type")
        not in (
            "/MCR",
            "/OBJR",
        )
    )


def _droppable(kid: Any) -> bool:
    """A structure element (given by reference) that carries nothing but grouping."""
    from pypdf.generic import IndirectObject

    if not isinstance(kid, IndirectObject):
        return False
    obj = kid.get_object()
    return (
        _is_element(obj)
        and str(obj["/S"]) in FLATTENED_TYPES
        and all(str(key) in _BARE_KEYS for key in obj)
    )


def _same(a: Any, b: Any) -> bool:
    """Two page references name the same page."""
    from pypdf.generic import IndirectObject

    if isinstance(a, IndirectObject) and isinstance(b, IndirectObject):
        return bool(a.idnum == b.idnum)
    return a is not None and a is b


def flatten_structure(writer: Any) -> FlattenResult:
    """Drop the structure elements of ``writer``'s document that carry no meaning (see the
    module docstring), moving their content to the nearest kept ancestor, then free the objects
    no longer reachable. A document without a structure tree is left as it is.

    Args:
        writer: a ``pypdf.PdfWriter`` holding the whole document (changed in place).

    Returns:
        The count of structure elements before and after, and of marked-content ids moved.
    """
    from pypdf.generic import ArrayObject, IndirectObject, NameObject

    tree = writer.root_object.get("/StructTreeRoot")
    if tree is None:
        return FlattenResult(0, 0, 0)
    tree = tree.get_object()
    flattener = _Flattener()
    queue: list[tuple[Any, Any]] = []
    for kid in _kids(tree.get("/K")):
        if isinstance(kid, IndirectObject) and _is_element(kid.get_object()):
            queue.append((kid, kid.get_object().get("/Pg")))
            flattener.before += 1
    seen: set[int] = set()
    while queue:
        ref, page = queue.pop()
        if ref.idnum in seen:
            continue
        seen.add(ref.idnum)
        element = ref.get_object()
        out: list[Any] = []
        dropped = flattener.lift(element.get("/K"), page, ref, element.get("/Pg"), out, queue)
        if dropped:
            element[NameObject("/K")] = ArrayObject(out)
    outside = _renumber_owners(tree.get("/ParentTree"), flattener.owner_of, seen)
    artifacts = _mark_artifacts(writer, outside)
    for entries in outside.values():
        for _, _, ref, _ in entries:
            if ref is not None:  # not made an artifact
                _reattach(ref, flattener.owner_of, seen)
    drop_unreachable(writer)
    return FlattenResult(
        elements_before=flattener.before,
        elements_after=flattener.before - len(flattener.owner_of),
        moved_ids=flattener.moved,
        artifacts=artifacts,
    )


class _Flattener:
    """The walk of :func:`flatten_structure`: which elements were dropped, and for whom."""

    def __init__(self) -> None:
        self.owner_of: dict[int, Any] = {}
        """Object number of a dropped element -> reference of the element now owning its
        content."""
        self.moved = 0
        self.before = 0

    def lift(
        self,
        kids: Any,
        page: Any,
        owner: Any,
        owner_page: Any,
        out: list[Any],
        queue: list[tuple[Any, Any]],
    ) -> bool:
        """Append to ``out`` the new kids of ``owner``: its own kids (``kids``, on ``page``,
        its effective page), with every droppable element among them replaced by its kids, depth
        first and in order. ``owner_page`` is the owner's own ``/Pg`` (or None). Kept elements
        met are given ``owner`` as parent and queued with their effective page. Returns whether
        any element was dropped."""
        from pypdf.generic import DictionaryObject, IndirectObject, NameObject, NumberObject

        dropped = False
        # An explicit stack of iterators (the nesting of boxes may be deep); depth 1 is the
        # owner's own kids, which stay as they are.
        stack: list[tuple[Iterator[Any], Any]] = [(iter(_kids(kids)), page)]
        while stack:
            items, here = stack[-1]
            kid = next(items, None)
            if kid is None:
                stack.pop()
                continue
            own = len(stack) == 1
            obj = kid.get_object()
            if isinstance(obj, NumberObject):
                if own or here is None or _same(here, owner_page):
                    out.append(kid)
                else:
                    mcr = {NameObject("/Type"): NameObject("/MCR"), NameObject("/Pg"): here}
                    mcr[NameObject("/MCID")] = NumberObject(int(obj))
                    out.append(DictionaryObject(mcr))
                self.moved += 0 if own else 1
            elif isinstance(obj, DictionaryObject) and obj.get("/Type") == "/MCR":
                moved_here = not own and here is not None and not _same(here, owner_page)
                if moved_here and "/Pg" not in obj:
                    obj[NameObject("/Pg")] = here
                self.moved += 0 if own else 1
                out.append(kid)
            elif not _is_element(obj):  # an object reference (OBJR)
                out.append(kid)
            elif _droppable(kid) and isinstance(owner, IndirectObject):
                self.before += 1
                self.owner_of[kid.idnum] = owner
                dropped = True
                stack.append((iter(_kids(obj.get("/K"))), obj.get("/Pg", here)))
            else:
                self.before += 1
                if not own:
                    obj[NameObject("/P")] = owner
                out.append(kid)
                if isinstance(kid, IndirectObject):
                    queue.append((kid, obj.get("/Pg", here)))
        return dropped


_Outside = dict[int, list[tuple[Any, int, Any, bool]]]
"""Parent-tree entries naming an element the tree does not hold: by parent-tree key, the
array holding the entry, its index there, the element's reference, and whether the entry is
one of a page's marked-content ids (else the key is an annotation's)."""


def _renumber_owners(parent_tree: Any, owner_of: dict[int, Any], kept: set[int]) -> _Outside:
    """Point every entry of the parent tree that names a dropped element at its new owner, and
    return the entries that name an element the tree does not hold.

    WeasyPrint writes such entries for the content of page-margin boxes (the running title block
    copied onto every page): their elements name as ``/P`` the element the box was copied from,
    which does not list them, so no reader of the tree meets them (see :func:`_mark_artifacts`).
    """
    from pypdf.generic import ArrayObject, IndirectObject

    outside: _Outside = {}
    if parent_tree is None:
        return outside
    nodes = [parent_tree.get_object()]
    while nodes:
        node = nodes.pop()
        nums = node.get("/Nums")
        if nums is not None:
            nums = nums.get_object()
            for i in range(1, len(nums), 2):
                key, value = int(nums[i - 1]), nums[i]
                target = value.get_object()
                rows = [(target, j) for j in range(len(target))]
                if not isinstance(target, ArrayObject):
                    rows = [(nums, i)]
                for row, j in rows:
                    entry = row[j]
                    if not isinstance(entry, IndirectObject):
                        continue
                    if entry.idnum in owner_of:
                        row[j] = owner_of[entry.idnum]
                    elif entry.idnum not in kept:
                        in_page = row is not nums
                        outside.setdefault(key, []).append((row, j, entry, in_page))
        nodes.extend(kid.get_object() for kid in node.get("/Kids", ()) or ())
    return outside


def _reattach(orphan: Any, owner_of: dict[int, Any], kept: set[int]) -> None:
    """Point an element the tree does not hold at its nearest ancestor the tree still holds,
    so that it does not keep dropped elements (and their stale kids) alive."""
    from pypdf.generic import IndirectObject, NameObject

    element = orphan.get_object()
    parent = element.get("/P") if _is_element(element) else None
    for _ in range(10_000):  # a /P chain is finite; the bound guards against a loop
        if not isinstance(parent, IndirectObject):
            return
        if parent.idnum in owner_of:
            element[NameObject("/P")] = owner_of[parent.idnum]
            return
        if parent.idnum in kept:
            element[NameObject("/P")] = parent
            return
        parent = parent.get_object().get("/P")


_MARKED = re.compile(rb"/[^\s/<>\[\]()%]+\s*<<\s*/MCID\s+(\d+)\s*>>\s*BDC")
"""A marked-content sequence with an id and nothing else in its properties (as WeasyPrint
writes them: ``/Span <</MCID 12>> BDC``)."""


def _mark_artifacts(writer: Any, outside: _Outside) -> int:
    """Mark as pagination artifacts (ISO 32000-1 §14.8.2.2) the page content whose parent-tree
    entry names an element the tree does not hold, and empty those entries; returns how many.

    That content is the running title block of each page: no reader of the structure tree
    meets it (its elements are not in the tree), and a running header is an artifact, so its
    marked-content sequences become ``/Artifact BMC`` (its text is still text: search and
    copying are unchanged). A page whose content streams are filtered other than by Flate
    keeps its entries (they are re-attached instead)."""
    from pypdf.generic import NullObject

    pages = {int(p["/StructParents"]): p for p in writer.pages if "/StructParents" in p}
    done = 0
    for key, entries in outside.items():
        page = pages.get(key)
        ids = {j for _, j, _, in_page in entries if in_page}
        if page is None or not ids:
            continue
        streams = _content_streams(page)
        if streams is None:
            continue
        found: set[int] = set()

        def artifact(match: re.Match[bytes], ids: set[int] = ids, found: set[int] = found) -> bytes:
            mcid = int(match[1])
            if mcid not in ids:
                return match[0]
            found.add(mcid)
            return b"/Artifact BMC"

        for stream in streams:
            data = stream.get_data()
            changed = _MARKED.sub(artifact, data)
            if changed != data:
                stream.set_data(changed)
        for index, (row, j, _ref, in_page) in enumerate(entries):
            if in_page and j in found:
                row[j] = NullObject()
                entries[index] = (row, j, None, in_page)
                done += 1
    return done


def _content_streams(page: Any) -> list[Any] | None:
    """The content streams of a page, if each is unfiltered or Flate-encoded (pypdf can write
    those back); else None."""
    from pypdf.generic import ArrayObject, StreamObject

    contents = page.get("/Contents")
    if contents is None:
        return []
    target = contents.get_object()
    streams = list(target) if isinstance(target, ArrayObject) else [contents]
    out = []
    for stream in streams:
        obj = stream.get_object()
        if not isinstance(obj, StreamObject) or obj.get("/Filter") not in (None, "/FlateDecode"):
            return None
        if obj.get("/DecodeParms") is not None:
            return None
        out.append(obj)
    return out


def drop_unreachable(writer: Any) -> int:
    """Free every object of ``writer`` that cannot be reached from the document catalog or the
    information dictionary (it is then not written); returns how many were freed."""
    from pypdf.generic import ArrayObject, DictionaryObject, IndirectObject

    objects = writer._objects
    reached = [False] * len(objects)
    starts: list[Any] = [writer.root_object]
    info = getattr(writer, "_info", None)
    if info is not None:
        starts.append(info.get_object())
    for start in starts:
        ref = start.indirect_reference
        if ref is not None:
            reached[ref.idnum - 1] = True
    stack = starts
    while stack:
        obj = stack.pop()
        if isinstance(obj, IndirectObject):
            if obj.pdf is not writer:
                continue
            index = obj.idnum - 1
            if index >= len(objects) or reached[index]:
                continue
            reached[index] = True
            stack.append(objects[index])
        elif isinstance(obj, DictionaryObject):  # streams too
            stack.extend(obj.values())
        elif isinstance(obj, ArrayObject):
            stack.extend(obj)
    freed = 0
    for index, obj in enumerate(objects):
        if obj is not None and not reached[index]:
            objects[index] = None
            freed += 1
    return freed
