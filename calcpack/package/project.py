"""The project file: one TOML file per job naming the sheets, the people and the design basis.

A project folder holds ``calcpack.toml`` and the sheet notebooks it lists. :func:`load_project`
reads and validates it; every problem is reported with the file, the field (as a dotted path such
as ``sheets[2].path``) and what was expected, e.g.::

    calcpack.toml: field 'job.number' is missing (expected a job number such as "2417")

The file layout (every table below is required unless marked optional)::

    [job]
    number = "2417"                  # job number, printed on every page
    title = "Rear extension, 14 Quarry Lane"
    client = "Harrow & Finch Builders"
    site = "14 Quarry Lane, Eastmoor"
    units = "SI"                     # "SI" or "US"
    paper = "A4"                     # optional: "A4" (default) or "Letter"
    firm = "Northgate Structural"    # optional: the issuing practice
    firm_address = "..."             # optional

    [people]
    preparer = "A. Okafor"           # or { name = "A. Okafor", date = 2026-11-18 }
    checker = "J. Lindqvist"
    approver = "R. Mbeki"

    [[revisions]]                    # oldest first; the last one is the revision being issued
    rev = "A"
    date = 2026-11-20
    description = "First issue"
    status = "For comment"           # optional, e.g. "Preliminary", "For construction"
    issued = true                    # optional (default false): this revision went out; its
                                     # build keeps its manifest in issued/<rev>.manifest.json
                                     # so later revisions mark what changed since

    [[sheets]]                       # in issue order
    path = "sheets/01_loads.ipynb"
    title = "Loads"                  # optional: defaults to the notebook's first heading
    inputs = ["inputs/loads.csv"]    # optional: files the sheet reads (hashed for the cache)

    [engineer_of_record]             # optional: the block on the cover the seal goes on
    name = "R. Mbeki"
    licence = "PE 48213"             # licence or registration number
    jurisdiction = "State of Oregon" # where the licence is held
    seal = "seal.png"                # optional: the firm's seal image (PNG, JPEG or SVG)

    [design]
    standards = ["EN 1990:2002 Basis of structural design"]
    materials = ["Timber C24"]        # optional
    loads = ["Imposed floor load 1.5 kN/m²"]  # optional
    basis = "Markdown text"           # optional
    assumptions = ["..."]             # optional
    cautions = ["..."]                # optional
    preset = "eurocode-uk"            # optional: standards that travel together
                                      # (calcpack.presets): SI units, its standards when none
                                      # are listed, its cautions added
"""

from __future__ import annotations

import datetime as _dt
import tomllib
from collections.abc import Mapping
from pathlib import Path
from typing import Any

# The project model is re-exported: ``from calcpack.package.project import Project`` works.
from calcpack.package.project_model import *  # noqa: F403
from calcpack.package.project_model import (
    JOB_KEYS,
    PAPER_SIZES,
    SEAL_TYPES,
    TOP_LEVEL_KEYS,
    UNIT_SYSTEMS,
    Design,
    EngineerOfRecord,
    Person,
    Project,
    ProjectFileError,
    Revision,
    SheetEntry,
    find_project_file,
)

__all__ = ["load_project"]


class _Reader:
    """Pulls typed fields out of the parsed TOML, naming the file and field on every error."""

    def __init__(self, file: Path) -> None:
        self.file = file

    def fail(self, where: str, value: Any, expected: str, problem: str | None = None) -> None:
        if problem is None:
            problem = f"is {type(value).__name__} {value!r}"
        raise ProjectFileError(
            f"{self.file.name}: field {where!r} {problem} (expected {expected})",
            name=where,
            value=value,
            expected=expected,
        )

    def known(self, data: Mapping[str, Any], where: str, keys: tuple[str, ...]) -> None:
        """Refuse a key not in ``keys`` (a misspelt key would otherwise be silently ignored)."""
        from calcpack.validate import unknown_key

        found = unknown_key(data, keys)
        if found is not None:
            key, close = found
            hint = f"; did you mean {close!r}?" if close else ""
            self.fail(
                f"{where}.{key}" if where else key,
                data[key],
                "one of " + ", ".join(keys),
                (f"is not a known key in [{where}]" if where else "is not a known table") + hint,
            )

    def inside(self, where: str, path: str, expected: str) -> None:
        """Refuse a path that leads out of the project folder (absolute, or through ``..``)."""
        root = self.file.parent.resolve()
        if Path(path).is_absolute() or not (root / path).resolve().is_relative_to(root):
            self.fail(
                where,
                path,
                f"{expected} (a path inside the project folder {str(root)!r})",
                "leads outside the project folder",
            )

    def table(
        self, data: Mapping[str, Any], key: str, where: str, *, required: bool = True
    ) -> Mapping[str, Any]:
        if key not in data:
            if required:
                self.fail(where, None, "a table [" + where + "]", "is missing")
            return {}
        value = data[key]
        if not isinstance(value, Mapping):
            self.fail(where, value, "a table [" + where + "]")
        table: Mapping[str, Any] = value
        return table

    def tables(self, data: Mapping[str, Any], key: str, expected: str) -> list[Mapping[str, Any]]:
        """An array of tables (``[[key]]``) holding at least one table; ``expected`` says what
        a table of it holds (``"a [[sheets]] table with a path"``)."""
        items = data.get(key)
        if not isinstance(items, list) or not items:
            problem = "is missing" if items is None else None
            self.fail(key, items, f"at least one [[{key}]] table{expected}", problem)
        assert isinstance(items, list)
        for i, item in enumerate(items, start=1):
            if not isinstance(item, Mapping):
                self.fail(f"{key}[{i}]", item, f"a [[{key}]] table{expected}")
        return items

    def text(
        self,
        data: Mapping[str, Any],
        key: str,
        where: str,
        expected: str,
        *,
        default: str | None = None,
    ) -> str:
        if key not in data:
            if default is not None:
                return default
            self.fail(where, None, expected, "is missing")
        value = data[key]
        if not isinstance(value, str):
            self.fail(where, value, expected)
        if default is None and not str(value).strip():
            self.fail(where, value, expected, "is empty")
        return str(value).strip()

    def choice(
        self,
        data: Mapping[str, Any],
        key: str,
        where: str,
        options: tuple[str, ...],
        default: str | None = None,
    ) -> str:
        expected = " or ".join(repr(o) for o in options)
        value = self.text(data, key, where, expected, default=default)
        if value not in options:
            self.fail(where, value, expected)
        return value

    def date(
        self, data: Mapping[str, Any], key: str, where: str, *, required: bool = True
    ) -> _dt.date | None:
        expected = "a TOML date such as 2026-11-20 (no quotes)"
        if key not in data:
            if required:
                self.fail(where, None, expected, "is missing")
            return None
        value = data[key]
        if isinstance(value, _dt.datetime):
            return value.date()
        if isinstance(value, _dt.date):
            return value
        if isinstance(value, str):
            try:
                return _dt.date.fromisoformat(value)
            except ValueError:
                pass
        self.fail(where, value, expected)
        return None  # pragma: no cover - fail() raises

    def texts(
        self, data: Mapping[str, Any], key: str, where: str, *, required: bool = False
    ) -> tuple[str, ...]:
        expected = 'a list of strings such as ["..."]'
        if key not in data:
            if required:
                self.fail(where, None, expected, "is missing")
            return ()
        value = data[key]
        if isinstance(value, str):
            value = [value]
        if not isinstance(value, list):
            self.fail(where, value, expected)
        out = []
        for i, item in enumerate(value):
            if not isinstance(item, str) or not item.strip():
                self.fail(f"{where}[{i + 1}]", item, "a non-empty string")
            out.append(item.strip())
        return tuple(out)

    def person(self, data: Mapping[str, Any], key: str, where: str) -> Person:
        expected = 'a name such as "A. Okafor" or { name = "...", date = 2026-11-18 }'
        if key not in data:
            self.fail(where, None, expected, "is missing")
        value = data[key]
        if isinstance(value, str):
            if not value.strip():
                self.fail(where, value, expected, "is empty")
            return Person(value.strip())
        if isinstance(value, Mapping):
            self.known(value, where, ("name", "date"))
            name = self.text(value, "name", f"{where}.name", "the person's name")
            return Person(name, self.date(value, "date", f"{where}.date", required=False))
        self.fail(where, value, expected)
        raise AssertionError  # pragma: no cover


def load_project(location: str | Path) -> Project:
    """Read and validate a project file (or the ``calcpack.toml`` in a folder).

    Raises:
        ProjectFileError: the file is missing or is not valid TOML, a field is missing or
            malformed, or a listed sheet notebook or inputs file does not exist.
    """
    file = find_project_file(location)
    try:
        data = tomllib.loads(file.read_text(encoding="utf-8"))
    except (tomllib.TOMLDecodeError, UnicodeDecodeError) as exc:
        raise ProjectFileError(
            f"{file.name}: not valid TOML ({exc})",
            name="project",
            value=str(file),
            expected="a TOML file",
        ) from exc
    r = _Reader(file)
    r.known(data, "", TOP_LEVEL_KEYS)

    job = r.table(data, "job", "job")
    r.known(job, "job", JOB_KEYS)
    job_number = r.text(job, "number", "job.number", 'a job number such as "2417"')
    job_title = r.text(job, "title", "job.title", "the job title")
    client = r.text(job, "client", "job.client", "the client's name")
    site = r.text(job, "site", "job.site", "the site address")
    units = r.choice(job, "units", "job.units", UNIT_SYSTEMS)
    paper = r.choice(job, "paper", "job.paper", PAPER_SIZES, default="A4")
    firm = r.text(job, "firm", "job.firm", "the practice's name", default="")
    firm_address = r.text(job, "firm_address", "job.firm_address", "an address", default="")

    people = r.table(data, "people", "people")
    r.known(people, "people", ("preparer", "checker", "approver"))
    preparer = r.person(people, "preparer", "people.preparer")
    checker = r.person(people, "checker", "people.checker")
    approver = r.person(people, "approver", "people.approver")

    revisions = []
    for i, item in enumerate(r.tables(data, "revisions", " with rev, date and description"), 1):
        where = f"revisions[{i}]"
        r.known(item, where, ("rev", "date", "description", "status", "issued"))
        rev_value = item.get("rev")
        if isinstance(rev_value, int) and not isinstance(rev_value, bool):
            rev = str(rev_value)
        else:
            rev = r.text(item, "rev", f"{where}.rev", 'a revision letter or number such as "A"')
        date = r.date(item, "date", f"{where}.date")
        assert date is not None
        description = r.text(
            item, "description", f"{where}.description", "what the revision changed"
        )
        status = r.text(item, "status", f"{where}.status", "a status", default="")
        issued = item.get("issued", False)
        if not isinstance(issued, bool):
            r.fail(f"{where}.issued", issued, "true or false")
        revisions.append(Revision(rev, date, description, status, issued))
    seen: set[str] = set()
    for i, revision in enumerate(revisions, start=1):
        if revision.rev in seen:
            r.fail(
                f"revisions[{i}].rev",
                revision.rev,
                "a revision not listed before",
                f"repeats revision {revision.rev!r}",
            )
        seen.add(revision.rev)
        if i > 1 and revision.date < revisions[i - 2].date:
            r.fail(
                f"revisions[{i}].date",
                revision.date.isoformat(),
                f"a date on or after {revisions[i - 2].date.isoformat()} (oldest first)",
                "is earlier than the revision before it",
            )

    sheets = []
    paths: set[str] = set()
    for i, item in enumerate(r.tables(data, "sheets", " with a path"), start=1):
        where = f"sheets[{i}]"
        r.known(item, where, ("path", "title", "number", "inputs"))
        path = r.text(item, "path", f"{where}.path", "a notebook path relative to the project")
        path = path.replace("\\", "/")
        r.inside(f"{where}.path", path, "a notebook path relative to the project")
        if not path.endswith(".ipynb"):
            r.fail(f"{where}.path", path, "a notebook path ending in .ipynb")
        if path in paths:
            r.fail(f"{where}.path", path, "each notebook listed once", "repeats a sheet")
        paths.add(path)
        if not (file.parent / path).is_file():
            r.fail(
                f"{where}.path",
                path,
                "an existing notebook in the project folder",
                "names a notebook that does not exist",
            )
        title = item.get("title")
        if title is not None and (not isinstance(title, str) or not title.strip()):
            r.fail(f"{where}.title", title, "the sheet title as a non-empty string")
        number = item.get("number", str(i))
        if isinstance(number, int) and not isinstance(number, bool):
            number = str(number)
        if not isinstance(number, str) or not number.strip():
            r.fail(f"{where}.number", number, 'a sheet number such as "3" or "L1"')
        inputs = r.texts(item, "inputs", f"{where}.inputs")
        for k, inp in enumerate(inputs, start=1):
            r.inside(f"{where}.inputs[{k}]", inp, "a file the sheet reads")
            if not (file.parent / inp).is_file():
                r.fail(
                    f"{where}.inputs[{k}]",
                    inp,
                    "an existing file in the project folder",
                    "names a file that does not exist",
                )
        sheets.append(SheetEntry(number.strip(), path, title.strip() if title else None, inputs))

    design_table = r.table(data, "design", "design")
    r.known(
        design_table,
        "design",
        ("standards", "materials", "loads", "basis", "assumptions", "cautions", "preset"),
    )
    from calcpack.presets import PRESETS

    preset_name = r.choice(design_table, "preset", "design.preset", ("", *PRESETS), default="")
    the_preset = PRESETS.get(preset_name)
    if the_preset is not None and units != the_preset.units:
        r.fail(
            "job.units",
            units,
            repr(the_preset.units),
            f"does not match the preset {preset_name!r} (design.preset)",
        )
    standards = r.texts(design_table, "standards", "design.standards", required=the_preset is None)
    design = Design(
        standards=standards or (the_preset.standards if the_preset else ()),
        materials=r.texts(design_table, "materials", "design.materials"),
        loads=r.texts(design_table, "loads", "design.loads"),
        basis=r.text(design_table, "basis", "design.basis", "markdown text", default=""),
        assumptions=r.texts(design_table, "assumptions", "design.assumptions"),
        cautions=(the_preset.cautions if the_preset else ())
        + r.texts(design_table, "cautions", "design.cautions"),
        preset=preset_name,
    )
    if not design.standards:
        r.fail("design.standards", [], "at least one design standard", "is empty")

    inputs = r.texts(data, "inputs", "inputs")
    for k, inp in enumerate(inputs, start=1):
        r.inside(f"inputs[{k}]", inp, "a file every sheet reads")
        if not (file.parent / inp).is_file():
            r.fail(
                f"inputs[{k}]",
                inp,
                "an existing file in the project folder",
                "names a file that does not exist",
            )

    engineer = _engineer(r, data, file.parent)

    return Project(
        path=file,
        job_number=job_number,
        job_title=job_title,
        client=client,
        site=site,
        units=units,
        paper=paper,
        firm=firm,
        firm_address=firm_address,
        preparer=preparer,
        checker=checker,
        approver=approver,
        revisions=tuple(revisions),
        sheets=tuple(sheets),
        design=design,
        inputs=inputs,
        engineer=engineer,
    )


def _engineer(r: _Reader, data: Mapping[str, Any], folder: Path) -> EngineerOfRecord | None:
    """The optional ``[engineer_of_record]`` table, its seal file checked."""
    where = "engineer_of_record"
    table = r.table(data, where, where, required=False)
    if not table:
        return None
    r.known(table, where, ("name", "licence", "jurisdiction", "seal"))
    name = r.text(table, "name", f"{where}.name", "the engineer's name")
    licence = r.text(table, "licence", f"{where}.licence", 'a licence number such as "PE 48213"')
    place = r.text(table, "jurisdiction", f"{where}.jurisdiction", "where the licence is held")
    seal_name = r.text(table, "seal", f"{where}.seal", "an image file", default="")
    seal = None
    if seal_name:
        seal = folder / seal_name
        if seal.suffix.lower() not in SEAL_TYPES:
            r.fail(f"{where}.seal", seal_name, "a PNG, JPEG or SVG image")
        if not seal.is_file():
            r.fail(
                f"{where}.seal",
                seal_name,
                "an existing image in the project folder",
                "names a file that does not exist",
            )
    return EngineerOfRecord(name, licence, place, seal)
