"""Presets that travel together: a project that declares one in its project file
(``[design] preset = "eurocode-uk"``) gets, in every sheet and in the package,

* the unit display (SI),
* the load combinations of the National Annex (EN 1990 with the UK annex: ψ of Table NA.A1.1,
  Set B of Table NA.A1.2(B) with ξ = 0.925, EQU Set A, serviceability),
* the member checks of the Eurocodes (:mod:`calcpack.checks.en1993`, ``en1995``, ``en1996``),
* the list of standards on the design-basis page (when the project lists none) and cautions
  worded for the Eurocodes and the annex.

In a sheet::

    from calcpack.presets import project_preset
    p = project_preset()          # reads the project file above the notebook
    p.apply()                     # SI display
    uls = p.combinations(variable={"Q": "A", "S": "snow_up_to_1000m"})

The package build reads the same preset from the project file
(:func:`calcpack.package.project.load_project`), so what a sheet shows and what the package
says are the same.
"""

from __future__ import annotations

import tomllib
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.errors import InputError
from calcpack.validate import lookup

__all__ = ["PRESETS", "Preset", "preset", "project_preset"]


@dataclass(frozen=True)
class Preset:
    """A set of standards that travel together.

    Attributes:
        name: ``"eurocode-uk"``. title: words for the design basis. units: the display system.
        annex: the EN 1990 National Annex (:func:`calcpack.combinations.en1990_annex`).
        standards: the standards listed on the design-basis page. cautions: added to the
            package's cautions.
    """

    name: str
    title: str
    units: str
    annex: str
    standards: tuple[str, ...]
    cautions: tuple[str, ...]

    def apply(self) -> Any:
        """Set the display defaults of this preset (units) and return them."""
        from calcpack.units import set_display

        return set_display(system=self.units)

    def combinations(
        self,
        *,
        variable: Mapping[str, Any],
        permanent: Sequence[str] = ("G",),
        equation: str = "6.10a/b",
    ) -> Any:
        """ULS STR/GEO combinations (Set B) of the preset's annex."""
        from calcpack.combinations import annex_combinations, en1990_annex

        return annex_combinations(
            en1990_annex(self.annex),
            variable=variable,
            permanent=permanent,
            equation=equation,  # type: ignore[arg-type]
        )

    def serviceability(
        self,
        *,
        variable: Mapping[str, Any],
        permanent: Sequence[str] = ("G",),
        which: Sequence[str] = ("characteristic", "frequent", "quasi-permanent"),
    ) -> Any:
        """SLS combinations of the preset's annex."""
        from calcpack.combinations import annex_serviceability, en1990_annex

        return annex_serviceability(
            en1990_annex(self.annex),
            variable=variable,
            permanent=permanent,
            which=which,
        )

    def equilibrium(
        self,
        *,
        variable: Mapping[str, Any],
        destabilising: Sequence[str],
        stabilising: Sequence[str],
    ) -> Any:
        """EQU (Set A) combinations of the preset's annex."""
        from calcpack.combinations import annex_equ_combinations, en1990_annex

        return annex_equ_combinations(
            en1990_annex(self.annex),
            variable=variable,
            destabilising=destabilising,
            stabilising=stabilising,
        )


PRESETS: Mapping[str, Preset] = {
    "eurocode-uk": Preset(
        name="eurocode-uk",
        title="Eurocodes with the UK National Annexes",
        units="SI",
        annex="UK",
        standards=(
            "BS EN 1990:2002+A1:2005 Basis of structural design, with the UK National Annex",
            "BS EN 1991-1-1:2002 Densities, self-weight, imposed loads for buildings, with the "
            "UK National Annex",
            "BS EN 1991-1-3:2003 Snow loads and BS EN 1991-1-4:2005 Wind actions, with the UK "
            "National Annexes",
            "BS EN 1993-1-1:2005+A1:2014 Design of steel structures and BS EN 1993-1-5:2006, "
            "with the UK National Annexes",
            "BS EN 1995-1-1:2004+A2:2014 Design of timber structures, with the UK National Annex",
            "BS EN 1996-1-1:2005+A1:2012 Design of masonry structures, with the UK National Annex",
        ),
        cautions=(
            "The partial factors, ψ factors and other Nationally Determined Parameters used are "
            "those of the UK National Annexes as cited on each sheet; where a value is marked "
            "'from memory' it must be confirmed against the current annex before issue.",
            "The Eurocode provisions cited must be confirmed against the editions, amendments and "
            "National Annexes in force where the work is built (the UK Building Regulations' "
            "approved documents name the standards they accept).",
        ),
    ),
}


def preset(name: str) -> Preset:
    """The preset ``name`` (``"eurocode-uk"``).

    Raises:
        InputError: unknown preset (with "did you mean").
    """
    return lookup("preset", name, PRESETS, what="preset")


def project_preset(start: str | Path = ".") -> Preset:
    """The preset declared by the project file (``calcpack.toml``, ``[design] preset``) in
    ``start`` or the nearest folder above it.

    Raises:
        InputError: no project file, or it declares no preset.
    """
    here = Path(start).resolve()
    for folder in (here, *here.parents):
        f = folder / "calcpack.toml"
        if f.is_file():
            data = tomllib.loads(f.read_text(encoding="utf-8"))
            design = data.get("design", {})
            name = design.get("preset") if isinstance(design, Mapping) else None
            if not isinstance(name, str):
                raise InputError(
                    f'{f}: [design] declares no preset (add preset = "eurocode-uk")',
                    name="design.preset",
                    value=name,
                    expected=" or ".join(repr(p) for p in PRESETS),
                )
            return preset(name)
    raise InputError(
        f"No calcpack.toml in {here} or above it: the sheet is not in a project",
        name="start",
        value=str(here),
        expected="a folder inside a project",
    )
