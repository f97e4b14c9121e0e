"""Join the PDFs of a package's layout chunks into one tagged PDF.

WeasyPrint writes each chunk as a tagged PDF/A-3b file: a structure tree (headings, paragraphs,
tables with their header cells, figures with alternative text, links) over marked content in
the page streams. The first chunk's file is the package's (its catalog, XMP metadata, output
intent and attachments); the other chunks' pages, outline and named destinations are appended
with pypdf, which copies pages but not structure. This module grafts each appended chunk's
structure tree onto the first's, under its one ``Document`` element, so that the joined PDF has
one tree in reading order:

- structure elements are copied with their page (``/Pg``) and annotation (``/OBJR``) references
  pointed at the appended pages and annotations; an annotation pypdf did not carry over is
  left out of the tree;
- the parent tree's keys (one per page, one per tagged annotation) are renumbered after the
  first chunk's, and the pages' ``/StructParents`` and annotations' ``/StructParent`` with
  them;
- the table-header identifiers WeasyPrint writes (``/ID``, and the cells' ``/Headers`` that
  cite them) are numbered by object number within a chunk, so they are prefixed by the chunk
  to stay unique.

Links to a section laid out in another chunk are added after the join, as link annotations to
named destinations (WeasyPrint could not resolve them within the chunk). Last, the joined tree
is flattened (:mod:`calcpack.package.pdf_tree`: the bare ``Span``, ``Div`` and ``NonStruct``
wrappers WeasyPrint writes for every box are dropped), for a single chunk too, and each page
is given only the resources it names (:mod:`calcpack.package.pdf_resources`).
"""

from __future__ import annotations

import io
from collections.abc import Callable, Iterator, Sequence
from typing import Any

from calcpack.errors import BuildError
from calcpack.package.layout_boxes import Link
from calcpack.package.pdf_resources import prune_resources
from calcpack.package.pdf_tree import drop_unreachable, flatten_structure

__all__ = ["join_chunks", "structure_summary"]


def join_chunks(first: bytes, rest: Sequence[bytes], links: Sequence[Link]) -> bytes:
    """Append the other chunks' pages to the first chunk's PDF (its catalog, metadata and
    attachments are the package's), with their outline, named destinations and structure
    tree, then add the links between chunks and flatten the structure tree
    (:func:`calcpack.package.pdf_tree.flatten_structure`). Given one chunk (``rest`` and
    ``links`` empty), only its structure tree is flattened.

    Raises:
        BuildError: the first chunk is tagged and another is not (their trees cannot join).
    """
    from pypdf import PdfReader, PdfWriter

    base = PdfReader(io.BytesIO(first))
    _share_streams_in_arrays(base)
    writer = PdfWriter(clone_from=base)
    writer.pdf_header = base.pdf_header
    tagged = "/StructTreeRoot" in writer.root_object
    for n, data in enumerate(rest, start=1):
        reader = PdfReader(io.BytesIO(data))
        _share_streams_in_arrays(reader)
        start = len(writer.pages)
        writer.append(reader, import_outline=True)
        if tagged:
            _graft_structure(writer, reader, start, prefix=f"c{n}-")
    added = [(link, _add_link(writer, link)) for link in links]
    if tagged and added:
        _tag_links(writer, added)
    prune_resources(writer)
    if tagged:
        flatten_structure(writer)  # frees what is no longer reachable, resources too
    else:
        drop_unreachable(writer)
    out = io.BytesIO()
    writer.write(out)
    return out.getvalue()


def _share_streams_in_arrays(reader: Any) -> None:
    """Point every direct array's reference to a stream at the stream object itself, so that
    cloning or appending the document copies each stream once.

    pypdf clones a referenced stream inside a direct array as a new object each time it meets
    the array (``ArrayObject.clone`` forces the duplicate): WeasyPrint's transparency groups
    each carry ``/CS [/ICCBased n 0 R]``, so the sRGB profile was copied once per group, the
    clone held more objects than the chunk's trailer ``/Size`` and pypdf warned "Object count
    N exceeds defined trailer size". Given the stream object (which keeps its own reference),
    the clone finds the copy it already made. Only this reader's objects in memory change.
    """
    from pypdf.generic import ArrayObject, DictionaryObject, IndirectObject, StreamObject

    def visit(obj: Any) -> None:
        if isinstance(obj, ArrayObject):
            for i, item in enumerate(obj):
                if isinstance(item, IndirectObject):
                    target = item.get_object()
                    if isinstance(target, StreamObject):
                        obj[i] = target
                else:
                    visit(item)
        elif isinstance(obj, DictionaryObject):
            for value in obj.values():
                if not isinstance(value, IndirectObject):
                    visit(value)

    numbers = {n for table in reader.xref.values() for n in table} | set(reader.xref_objStm)
    for number in sorted(numbers - {0}):
        visit(reader.get_object(number))


def _add_link(writer: Any, link: Link) -> Any:
    """Add a link annotation to a named destination; returns its reference."""
    from pypdf.generic import (
        ArrayObject,
        DictionaryObject,
        FloatObject,
        NameObject,
        NumberObject,
        TextStringObject,
    )

    annotation = DictionaryObject(
        {
            NameObject("/Type"): NameObject("/Annot"),
            NameObject("/Subtype"): NameObject("/Link"),
            NameObject("/Rect"): ArrayObject(FloatObject(v) for v in link.rect),
            NameObject("/BS"): DictionaryObject({NameObject("/W"): NumberObject(0)}),
            # PDF/A: annotations must be printable (flag 4).
            NameObject("/F"): NumberObject(4),
            NameObject("/Dest"): TextStringObject(link.target),
        }
    )
    page = writer.pages[link.page]
    if "/Annots" not in page:
        page[NameObject("/Annots")] = ArrayObject()
    reference = writer._add_object(annotation)
    page["/Annots"].get_object().append(reference)
    return reference


def _tree_nodes(start: Any, into: Callable[[Any], bool] = lambda obj: True) -> Iterator[Any]:
    """The dictionaries of a structure tree from ``start`` on (elements, object references),
    in reading order, each once; an element's kids are visited when ``into(element)``."""
    from pypdf.generic import ArrayObject, DictionaryObject, IndirectObject

    seen: set[int] = set()
    stack = [start]
    while stack:
        node = stack.pop()
        if isinstance(node, IndirectObject):
            if node.idnum in seen:
                continue
            seen.add(node.idnum)
        obj = node.get_object()
        if isinstance(obj, ArrayObject):
            stack.extend(reversed(list(obj)))
        elif isinstance(obj, DictionaryObject):
            yield obj
            if "/S" in obj and obj.get("/K") is not None and into(obj):
                stack.append(obj["/K"])


def _untagged_links(tree: Any, page_numbers: dict[int, int]) -> dict[int, list[Any]]:
    """The tree's ``Link`` elements that no annotation belongs to yet (WeasyPrint tags the
    words of a link whose target was in another chunk, without its annotation), by page, in
    reading order."""
    from pypdf.generic import ArrayObject, DictionaryObject, IndirectObject

    found: dict[int, list[Any]] = {}
    for obj in _tree_nodes(tree["/K"], into=lambda element: element["/S"] != "/Link"):
        if obj.get("/S") != "/Link":
            continue
        kids = obj.get("/K")
        kid_list = list(kids) if isinstance(kids, ArrayObject) else [kids] if kids else []
        has_annotation = any(
            isinstance(k.get_object(), DictionaryObject) and k.get_object().get("/Type") == "/OBJR"
            for k in kid_list
            if isinstance(k, IndirectObject | DictionaryObject)
        )
        page = obj.get("/Pg")
        if not has_annotation and isinstance(page, IndirectObject):
            number = page_numbers.get(page.idnum)
            if number is not None:
                found.setdefault(number, []).append(obj)
    return found


def _tag_links(writer: Any, added: Sequence[tuple[Link, Any]]) -> None:
    """Give each link added after the join its place in the structure tree: the ``Link``
    element holding its words (the page's untagged ``Link`` elements in reading order, one per
    ``<a>``: ``Link.element``), with an object reference to each of its annotations and a
    parent-tree entry; a link whose words cannot be matched gets a ``Link`` element of its own
    under the ``Document`` element."""
    from pypdf.generic import ArrayObject, DictionaryObject, NameObject, NumberObject

    tree = writer.root_object["/StructTreeRoot"].get_object()
    document = _document(tree)
    page_numbers = {p.indirect_reference.idnum: i for i, p in enumerate(writer.pages)}
    waiting = _untagged_links(tree, page_numbers)
    nums = _flat_parent_tree(tree)
    next_key = max(
        [
            int(tree.get("/ParentTreeNextKey", 0)),
            *(k + 1 for k, _ in _number_tree(tree["/ParentTree"])),
        ]
    )
    taken: dict[tuple[int, int], Any] = {}
    for link, annotation in added:
        page = writer.pages[link.page].indirect_reference
        candidates = waiting.get(link.page, [])
        key = (link.page, link.element)
        if link.element >= 0 and key in taken:  # another box of the same <a>
            element = taken[key]
        elif link.element >= 0 and link.element < len(candidates):
            element = taken[key] = candidates[link.element]
        else:
            element = DictionaryObject(
                {
                    NameObject("/Type"): NameObject("/StructElem"),
                    NameObject("/S"): NameObject("/Link"),
                    NameObject("/P"): document,
                    NameObject("/Pg"): page,
                    NameObject("/K"): ArrayObject(),
                }
            )
            document.get_object()["/K"].append(writer._add_object(element))
        if not isinstance(element.get("/K"), ArrayObject):
            element[NameObject("/K")] = ArrayObject([element["/K"]] if "/K" in element else [])
        objr = DictionaryObject(
            {
                NameObject("/Type"): NameObject("/OBJR"),
                NameObject("/Obj"): annotation,
                NameObject("/Pg"): page,
            }
        )
        element["/K"].append(writer._add_object(objr))
        annotation.get_object()[NameObject("/StructParent")] = NumberObject(next_key)
        nums.extend([NumberObject(next_key), element.indirect_reference])
        next_key += 1
    tree[NameObject("/ParentTreeNextKey")] = NumberObject(next_key)


# --------------------------------------------------------------------------- structure


def _number_tree(node: Any) -> Iterator[tuple[int, Any]]:
    """(key, value) of a number tree (``/Nums`` leaves under ``/Kids``), in key order."""
    node = node.get_object()
    nums = node.get("/Nums")
    if nums is not None:
        items = list(nums.get_object())
        for i in range(0, len(items) - 1, 2):
            yield int(items[i]), items[i + 1]
    for kid in node.get("/Kids", ()) or ():
        yield from _number_tree(kid)


def _annotation_key(annotation: Any) -> tuple[str, tuple[float, ...]]:
    rect = tuple(round(float(v), 2) for v in annotation.get("/Rect", ()))
    return str(annotation.get("/Subtype")), rect


class _Copier:
    """Copies a chunk's structure objects into the writer, with references to the chunk's
    pages and annotations pointed at their copies in the joined document."""

    def __init__(self, writer: Any, prefix: str) -> None:
        self.writer = writer
        self.prefix = prefix
        self.done: dict[int, Any] = {}
        """Chunk object number -> the writer's indirect reference for it."""
        self.annotations: set[int] = set()
        """Chunk object numbers of every annotation on its pages (carried over or not)."""

    def ref(self, obj: Any) -> Any:
        """The writer's reference for an indirect object of the chunk, copying it once."""
        from pypdf.generic import ArrayObject, DictionaryObject, StreamObject

        if obj.idnum in self.done:
            return self.done[obj.idnum]
        target = obj.get_object()
        if isinstance(target, StreamObject):
            copied = target.clone(self.writer)
            self.done[obj.idnum] = copied.indirect_reference
            return copied.indirect_reference
        shell: Any = DictionaryObject() if isinstance(target, DictionaryObject) else None
        if shell is None:
            shell = ArrayObject() if isinstance(target, ArrayObject) else None
        if shell is None:  # a number, name or string kept as an object of its own
            reference = self.writer._add_object(target.clone(self.writer))
            self.done[obj.idnum] = reference
            return reference
        reference = self.writer._add_object(shell)
        self.done[obj.idnum] = reference  # before the contents: structure refers back (/P)
        filled = self.value(target)
        if isinstance(shell, DictionaryObject):
            shell.update(filled)
        else:
            shell.extend(filled)
        return reference

    def dropped(self, obj: Any) -> bool:
        """An object reference to an annotation that was not carried over (``/OBJR``)."""
        from pypdf.generic import DictionaryObject, IndirectObject

        target = obj.get_object() if isinstance(obj, IndirectObject) else obj
        if not isinstance(target, DictionaryObject) or target.get("/Type") != "/OBJR":
            return False
        annotation = target.get("/Obj")
        return (
            isinstance(annotation, IndirectObject)
            and annotation.idnum in self.annotations
            and annotation.idnum not in self.done
        )

    def value(self, obj: Any) -> Any:
        """A direct object copied, its indirect references through :meth:`ref`."""
        from pypdf.generic import (
            ArrayObject,
            DictionaryObject,
            IndirectObject,
            NameObject,
            TextStringObject,
        )

        if isinstance(obj, IndirectObject):
            return self.ref(obj)
        if isinstance(obj, DictionaryObject):
            out = DictionaryObject()
            for key, item in obj.items():
                if key == "/ID" and isinstance(item, str):
                    out[NameObject(key)] = TextStringObject(self.prefix + item)
                elif key == "/Headers" and isinstance(item, ArrayObject):
                    out[NameObject(key)] = ArrayObject(
                        TextStringObject(self.prefix + str(h)) for h in item
                    )
                elif key == "/K" and isinstance(item, ArrayObject):
                    out[NameObject(key)] = ArrayObject(
                        self.value(kid) for kid in item if not self.dropped(kid)
                    )
                else:
                    out[NameObject(key)] = self.value(item)
            return out
        if isinstance(obj, ArrayObject):
            return ArrayObject(self.value(item) for item in obj)
        return obj.clone(self.writer)


def _document(tree: Any) -> Any:
    """The one ``Document`` element under a structure tree root (its reference)."""
    from pypdf.generic import ArrayObject

    kids = tree["/K"]
    (document,) = list(kids) if isinstance(kids, ArrayObject) else [kids]
    return document


def _flat_parent_tree(tree: Any) -> Any:
    """The parent tree's ``/Nums`` array, a tree with ``/Kids`` first flattened into one leaf."""
    from pypdf.generic import ArrayObject, NameObject, NumberObject

    leaf = tree["/ParentTree"].get_object()
    if "/Nums" not in leaf:
        entries = list(_number_tree(leaf))
        leaf[NameObject("/Nums")] = ArrayObject()
        for key, value in entries:
            leaf["/Nums"].extend([NumberObject(key), value])
        del leaf["/Kids"]
    return leaf["/Nums"].get_object()


def _graft_structure(writer: Any, reader: Any, start: int, *, prefix: str) -> None:
    """Copy ``reader``'s structure tree under the writer's ``Document`` element; its pages
    were appended to the writer from page ``start`` on."""
    from pypdf.generic import ArrayObject, NameObject, NumberObject

    tree = writer.root_object["/StructTreeRoot"].get_object()
    theirs = reader.root_object.get("/StructTreeRoot")
    if theirs is None:
        raise BuildError(
            "A layout chunk of the package was written without its structure tree (tags); "
            "delete PROJECT/.calcpack-cache/layout and build again"
        )
    theirs = theirs.get_object()
    document = _document(tree)
    their_kids = theirs["/K"]
    (their_document,) = list(their_kids) if isinstance(their_kids, ArrayObject) else [their_kids]

    copier = _Copier(writer, prefix)
    copier.done[their_document.idnum] = document
    copier.done[theirs.indirect_reference.idnum] = tree.indirect_reference
    pairs = []
    for i, their_page in enumerate(reader.pages):
        page = writer.pages[start + i]
        copier.done[their_page.indirect_reference.idnum] = page.indirect_reference
        pairs.append((their_page, page))
        # Matched in order: two boxes of one link may share a rectangle.
        ours: dict[tuple[str, tuple[float, ...]], list[Any]] = {}
        for a in page.get("/Annots", ()) or ():
            ours.setdefault(_annotation_key(a.get_object()), []).append(a)
        for annotation in their_page.get("/Annots", ()) or ():
            copier.annotations.add(annotation.idnum)
            same = ours.get(_annotation_key(annotation.get_object()))
            if same:
                copier.done[annotation.idnum] = same.pop(0)

    nums = tree["/ParentTree"].get_object()
    entries = list(_number_tree(nums))
    next_key = max([k for k, _ in entries], default=-1) + 1
    next_key = max(next_key, int(tree.get("/ParentTreeNextKey", 0)))
    keys: dict[int, int] = {}
    for key, _ in _number_tree(theirs["/ParentTree"]):
        keys[key] = next_key
        next_key += 1

    # The tree itself, in reading order after the first chunk's.
    kids = document.get_object()["/K"]
    for kid in their_document.get_object()["/K"]:
        if not copier.dropped(kid):
            kids.append(copier.value(kid))

    # Pages and annotations point into the parent tree by key: renumber them.
    for their_page, page in pairs:
        if "/StructParents" in their_page:
            page[NameObject("/StructParents")] = NumberObject(
                keys[int(their_page["/StructParents"])]
            )
        for annotation in their_page.get("/Annots", ()) or ():
            copied = copier.done.get(annotation.idnum)
            old = annotation.get_object().get("/StructParent")
            if copied is not None and old is not None:
                copied.get_object()[NameObject("/StructParent")] = NumberObject(keys[int(old)])

    array = _flat_parent_tree(tree)
    for key, value in _number_tree(theirs["/ParentTree"]):
        if isinstance(value, ArrayObject) or not copier.dropped(value):
            array.extend([NumberObject(keys[key]), copier.value(value)])
    tree[NameObject("/ParentTreeNextKey")] = NumberObject(next_key)


# --------------------------------------------------------------------------- reading it back


def structure_summary(pdf: bytes) -> dict[str, Any]:
    """What a tagged PDF's structure tree holds, for tests and checks: the count of each
    structure type, the alternative texts of figures, the heading levels in reading order,
    whether every marked-content id on every page is reachable from the parent tree, and the
    link annotations that no ``Link`` element of the tree holds.

    Returns:
        ``{"types": {"/H1": n, ...}, "figures": [alt or None, ...], "headings": [1, 2, ...],
        "pages_mapped": bool, "untagged_links": n}``.
    """
    from pypdf import PdfReader
    from pypdf.generic import IndirectObject

    reader = PdfReader(io.BytesIO(pdf))
    root = reader.root_object.get("/StructTreeRoot")
    if root is None:
        return {
            "types": {},
            "figures": [],
            "headings": [],
            "pages_mapped": False,
            "untagged_links": sum(1 for _ in _link_annotations(reader)),
        }
    types: dict[str, int] = {}
    figures: list[str | None] = []
    headings: list[int] = []
    held: set[int] = set()
    for obj in _tree_nodes(root["/K"]):
        target = obj.get("/Obj")  # .get keeps the reference ([] would resolve it)
        if obj.get("/Type") == "/OBJR" and isinstance(target, IndirectObject):
            held.add(target.idnum)
            continue
        if "/S" not in obj:
            continue
        kind = str(obj["/S"])
        types[kind] = types.get(kind, 0) + 1
        if kind in ("/H1", "/H2", "/H3", "/H4", "/H5", "/H6"):
            headings.append(int(kind[2]))
        if kind == "/Figure":
            alt = obj.get("/Alt")
            figures.append(str(alt) if alt is not None else None)
    parents = dict(_number_tree(root["/ParentTree"]))
    mapped = all(
        "/StructParents" in page and int(page["/StructParents"]) in parents for page in reader.pages
    )
    untagged = sum(1 for a in _link_annotations(reader) if a.idnum not in held)
    return {
        "types": types,
        "figures": figures,
        "headings": headings,
        "pages_mapped": mapped,
        "untagged_links": untagged,
    }


def _link_annotations(reader: Any) -> Iterator[Any]:
    """The references of every link annotation of every page."""
    for page in reader.pages:
        for annotation in page.get("/Annots", ()) or ():
            if annotation.get_object().get("/Subtype") == "/Link":
                yield annotation
