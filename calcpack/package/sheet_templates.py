"""Sheet templates (beam, section, truss, member sheets...) and adding a sheet to a project.

A template is a notebook ``templates/sheets/<name>.ipynb`` with, optionally, an inputs file
``<name>.inputs.toml`` beside it. The notebook's text may hold two placeholders, replaced when
the sheet is made: ``__TITLE__`` (the sheet title) and ``__INPUTS__`` (the inputs file's name,
which sits beside the notebook). Templates are found in the source tree's ``templates/sheets``
or, for an installed calcpack, in ``share/calcpack/templates/sheets`` of the environment.
"""

from __future__ import annotations

import re
import site
import sys
import sysconfig
from dataclasses import dataclass
from pathlib import Path

from calcpack.errors import BuildError, InputError

__all__ = ["AddedSheet", "add_sheet", "sheet_template_names", "sheet_templates_dir"]

PROJECT_FILE_NAME = "calcpack.toml"


def sheet_templates_dir() -> Path:
    """The folder holding the sheet templates.

    Raises:
        BuildError: no template folder found (names the places searched).
    """
    import calcpack

    candidates = [Path(calcpack.__file__).resolve().parent.parent / "templates" / "sheets"]
    bases = [sys.prefix, sys.exec_prefix, sysconfig.get_path("data"), site.USER_BASE or ""]
    for base in dict.fromkeys(b for b in bases if b):
        candidates.append(Path(base) / "share" / "calcpack" / "templates" / "sheets")
    for c in candidates:
        if any(c.glob("*.ipynb")):
            return c
    raise BuildError(
        "No sheet templates found (looked in " + ", ".join(str(c) for c in candidates) + "); "
        "reinstall calcpack with pip"
    )


def sheet_template_names() -> list[str]:
    """The template names, e.g. ``["beam", "free_body", "section", "truss"]``."""
    return sorted(p.stem for p in sheet_templates_dir().glob("*.ipynb"))


@dataclass(frozen=True)
class AddedSheet:
    """What :func:`add_sheet` made: paths relative to the project folder."""

    notebook: Path
    inputs: Path | None
    number: int
    title: str


def _slug(text: str) -> str:
    s = re.sub(r"[^a-z0-9]+", "_", text.lower()).strip("_")
    return s or "sheet"


def add_sheet(
    project: Path,
    template: str,
    *,
    title: str | None = None,
    name: str | None = None,
    folder: str = "sheets",
) -> AddedSheet:
    """Add a sheet made from ``template`` to the project in ``project``.

    The notebook becomes ``<folder>/NN_<name>.ipynb`` (NN: the next sheet number), its inputs
    file ``NN_<name>.inputs.toml`` beside it, and a ``[[sheets]]`` entry naming both is
    appended to the project file (its comments and layout are kept).

    Args:
        project: the project folder (holding calcpack.toml).
        template: a name from :func:`sheet_template_names`.
        title: the sheet title (default from the template name, e.g. "Beam").
        name: the file-name stem after the number (default from the title).
        folder: the sheets folder inside the project.

    Raises:
        InputError: no project file, an unknown template, or a file that already exists
            (nothing is overwritten).
    """
    import tomlkit

    project_file = project / PROJECT_FILE_NAME
    if not project_file.is_file():
        raise InputError(
            f"No {PROJECT_FILE_NAME} in {str(project)!r}: run `calcpack new PROJECT` first, or "
            "give the project folder with --project",
            name="project",
            value=str(project),
            expected=f"a folder holding {PROJECT_FILE_NAME}",
        )
    names = sheet_template_names()
    if template not in names:
        raise InputError(
            f"Unknown sheet template {template!r} (templates: {', '.join(names)})",
            name="template",
            value=template,
            expected=" or ".join(names),
        )
    title = title or template.replace("_", " ").capitalize()
    if "\n" in title or '"' in title or "\\" in title:
        raise InputError(
            f"Sheet title must not contain quotes, backslashes or line breaks (got {title!r})",
            name="title",
            value=title,
            expected="plain text",
        )
    doc = tomlkit.parse(project_file.read_text(encoding="utf-8"))
    sheets = doc.get("sheets")
    number = (len(sheets) if sheets is not None else 0) + 1
    stem = f"{number:02d}_{_slug(name or title)}"
    src = sheet_templates_dir()
    nb_rel = Path(folder) / f"{stem}.ipynb"
    inputs_src = src / f"{template}.inputs.toml"
    inputs_rel = Path(folder) / f"{stem}.inputs.toml" if inputs_src.is_file() else None
    for rel in (nb_rel, inputs_rel):
        if rel is not None and (project / rel).exists():
            raise InputError(
                f"Sheet file {rel.as_posix()!r} already exists in {str(project)!r}; choose "
                "another --name",
                name="name",
                value=stem,
                expected="a name not used yet",
            )
    text = (src / f"{template}.ipynb").read_text(encoding="utf-8")
    text = text.replace("__TITLE__", title.replace('"', ""))
    if inputs_rel is not None:
        text = text.replace("__INPUTS__", inputs_rel.name)
    (project / folder).mkdir(parents=True, exist_ok=True)
    (project / nb_rel).write_text(text, encoding="utf-8")
    if inputs_rel is not None:
        (project / inputs_rel).write_text(inputs_src.read_text(encoding="utf-8"), encoding="utf-8")
    entry = tomlkit.table()
    entry["path"] = nb_rel.as_posix()
    entry["title"] = title
    if inputs_rel is not None:
        entry["inputs"] = [inputs_rel.as_posix()]
    entry.add(tomlkit.nl())
    if sheets is None:
        aot = tomlkit.aot()
        aot.append(entry)
        doc["sheets"] = aot
    else:
        sheets.append(entry)
    project_file.write_text(tomlkit.dumps(doc), encoding="utf-8")
    return AddedSheet(nb_rel, inputs_rel, number, title)
