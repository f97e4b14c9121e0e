"""The bundled demo project and new-project scaffolding.

The demo project (the first example job) lives in ``example_projects/alteration_ashgrove_lane``
of the source tree and is installed as data files under
``share/calcpack/example_projects/alteration_ashgrove_lane`` of the environment, so it is found
from a wheel install as well as from a checkout.
"""

from __future__ import annotations

import datetime as _dt
import shutil
import site
import sys
import sysconfig
from pathlib import Path

from calcpack.errors import BuildError, InputError
from calcpack.package.project import PROJECT_FILE_NAME

__all__ = [
    "DEMO_PROJECT_NAME",
    "FIRST_SHEET_INPUTS",
    "copy_demo_project",
    "demo_project_source",
    "new_project",
]

DEMO_PROJECT_NAME = "alteration_ashgrove_lane"


def demo_project_source() -> Path:
    """The folder of the bundled demo project.

    Raises:
        BuildError: the demo project is not installed (names the places searched).
    """
    import calcpack

    candidates = [
        Path(calcpack.__file__).resolve().parent.parent / "example_projects" / DEMO_PROJECT_NAME
    ]
    bases = [sys.prefix, sys.exec_prefix, sysconfig.get_path("data"), site.USER_BASE or ""]
    for base in dict.fromkeys(b for b in bases if b):
        candidates.append(
            Path(base) / "share" / "calcpack" / "example_projects" / DEMO_PROJECT_NAME
        )
    for candidate in candidates:
        if (candidate / PROJECT_FILE_NAME).is_file():
            return candidate
    raise BuildError(
        "The demo project is not installed (looked in "
        + ", ".join(str(c) for c in candidates)
        + "); reinstall calcpack with pip"
    )


def copy_demo_project(target: Path) -> Path:
    """Copy the demo project into ``target`` (replacing an earlier copy); returns the copy.

    The build's cache and outputs then live beside the user's copy, never inside the install.
    """
    source = demo_project_source()
    if target.exists():
        if not (target / PROJECT_FILE_NAME).is_file():
            raise InputError(
                f"Folder {str(target)!r} exists and is not a calcpack project; choose another "
                "folder for the demo",
                name="target",
                value=str(target),
                expected="a new or demo folder",
            )
        for item in source.rglob("*"):
            if item.is_file():
                dest = target / item.relative_to(source)
                dest.parent.mkdir(parents=True, exist_ok=True)
                if not dest.is_file() or dest.read_bytes() != item.read_bytes():
                    shutil.copyfile(item, dest)
        return target
    shutil.copytree(source, target, ignore=shutil.ignore_patterns(".calcpack-cache", "build"))
    return target


_PROJECT_TEMPLATE = """\
# calcpack project file. Every field is described in calcpack.package.project.

[job]
number = "{number}"
title = "{title}"
client = "Client name"
site = "Site address"
units = "{units}"
paper = "{paper}"
firm = "Your practice"
firm_address = ""

[people]
preparer = "Preparer's name"
checker = "Checker's name"
approver = "Approver's name"

[[revisions]]
rev = "P1"
date = {today}
description = "Preliminary issue"
status = "Preliminary"
# issued = true  # once this revision has gone out: its manifest is kept in issued/ and the
#                # next revision's package marks the sheets changed since

[[sheets]]
path = "sheets/01_first_sheet.ipynb"
title = "First sheet"
inputs = ["sheets/01_first_sheet.inputs.toml"]

[design]
standards = ["Name the design standards and their editions here"]
materials = []
loads = []
basis = \"\"\"
Describe the structure, the load path and the method of design.
\"\"\"
assumptions = []
cautions = []
"""


FIRST_SHEET_INPUTS = "01_first_sheet.inputs.toml"

_INPUTS_HEAD = """\
# Inputs for the first sheet. Its calc cells read this file, so a build uses exactly these
# values: edit them here, then run the sheet's cells again.
# Quantities are quoted with their unit ("3 m", "5 kN/m").

[member]
"""
_FIRST_INPUTS = {
    "SI": _INPUTS_HEAD + 'L = "3 m"        # span\nw = "5 kN/m"     # line load\n',
    "US": _INPUTS_HEAD + 'L = "10 ft"       # span\nw = "0.3 klf"     # line load\n',
}


def new_project(
    folder: Path,
    *,
    number: str = "0000",
    title: str = "New job",
    units: str = "SI",
    paper: str = "A4",
    today: _dt.date | None = None,
) -> Path:
    """Scaffold a project folder; returns the project file.

    The folder gets ``calcpack.toml`` and a first sheet, ``sheets/01_first_sheet.ipynb`` (with a
    kernelspec, so JupyterLab opens it without asking), whose calc cells read their values from
    the inputs file ``sheets/01_first_sheet.inputs.toml`` beside it; the project file lists
    that file with the sheet, so a build re-runs the sheet when it changes.

    Raises:
        InputError: the folder exists and is not empty, or units/paper are not valid.
    """
    import nbformat

    if units not in ("SI", "US"):
        raise InputError(
            f"Unit system must be 'SI' or 'US' (got units = {units!r})",
            name="units",
            value=units,
            expected="'SI' or 'US'",
        )
    if paper not in ("A4", "Letter"):
        raise InputError(
            f"Paper must be 'A4' or 'Letter' (got paper = {paper!r})",
            name="paper",
            value=paper,
            expected="'A4' or 'Letter'",
        )
    if folder.exists() and any(folder.iterdir()):
        raise InputError(
            f"Folder {str(folder)!r} already exists and is not empty; choose a new folder",
            name="PROJECT",
            value=str(folder),
            expected="a new or empty folder",
        )
    for name, value in (("number", number), ("title", title)):
        if '"' in value or "\\" in value or "\n" in value:
            raise InputError(
                f"Job {name} must not contain quotes, backslashes or line breaks "
                f"(got {name} = {value!r})",
                name=name,
                value=value,
                expected="plain text",
            )
    (folder / "sheets").mkdir(parents=True, exist_ok=True)
    project_file = folder / PROJECT_FILE_NAME
    project_file.write_text(
        _PROJECT_TEMPLATE.format(
            number=number,
            title=title,
            units=units,
            paper=paper,
            today=(today or _dt.date.today()).isoformat(),
        ),
        encoding="utf-8",
    )
    (folder / "sheets" / FIRST_SHEET_INPUTS).write_text(_FIRST_INPUTS[units], encoding="utf-8")
    nb = nbformat.v4.new_notebook()
    nb.metadata = {
        "kernelspec": {
            "display_name": "Python 3 (ipykernel)",
            "language": "python",
            "name": "python3",
        },
        "language_info": {"name": "python"},
    }
    unit = {"SI": "kN*m", "US": "kip*ft"}[units]
    nb.cells = [
        nbformat.v4.new_markdown_cell(
            "# First sheet\n\nWhat this sheet checks and why. Its input values are in "
            f"`{FIRST_SHEET_INPUTS}` beside it: edit them there, then run all cells."
        ),
        nbformat.v4.new_code_cell(
            "from calcpack.inputs import Spec, get_path, load_inputs, require_input\n"
            "from calcpack.working import Sheet\n\n"
            f'INPUTS = "{FIRST_SHEET_INPUTS}"  # this sheet\'s inputs file, beside the notebook\n'
            "inputs = load_inputs(INPUTS)\n\n\n"
            "def read(key, dimension):\n"
            '    """A positive value of the inputs file, checked for its dimension."""\n'
            "    return require_input(\n"
            "        get_path(inputs, key), Spec(dimension, positive=True), key, path=INPUTS\n"
            "    )\n\n\n"
            f's = Sheet("First sheet", system="{units}")'
        ),
        nbformat.v4.new_code_cell(
            's.heading("Inputs")\n'
            'L = s.given("L", read("member.L", "[length]"), "span", source=INPUTS)\n'
            'w = s.given("w", read("member.w", "[force] / [length]"), "line load", '
            "source=INPUTS)\n"
            f'M = s.derive("M_max", w * L**2 / 8, "maximum moment", unit="{unit}", '
            'ref="simple span, uniform load")'
        ),
    ]
    nbformat.write(nb, folder / "sheets" / "01_first_sheet.ipynb")
    if not project_file.is_file():  # pragma: no cover - defensive
        raise BuildError(f"Could not write {project_file}")
    return project_file
