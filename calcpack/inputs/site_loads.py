"""The site loads of a roof described in an inputs file: snow and wind derived to ASCE/SEI 7-16
or to EN 1991-1-3/1-4 with the UK annex, and the load cases they give the roof members.

Layout (see ``templates/sheets/site_loads.inputs.toml``)::

    [site]
    standard = "ASCE 7-16"         # or "EN 1991 UK"
    [roof]
    shape = "gable"                # gable, hip or monoslope (ASCE); duopitch or monopitch (EN)
    slope = "26.57 deg"
    width = "24 ft"                # plan width of the frame, eave to eave
    length = "40 ft"               # along the ridge
    height = "12 ft"               # mean roof height (ASCE) or height to the ridge (EN)
    spacing = "2 ft"               # member centres: the tributary width of each member
    [snow]  ... [wind]  ...        # the site data of the standard chosen (see the template)

:func:`site_loads_inputs` validates the file (every error names its key) and derives the loads;
the :class:`SiteLoads` it returns adds the working, the load-case sketch, the table of line
loads by case and the exports to a sheet.
"""

from __future__ import annotations

from collections.abc import Iterator, Mapping
from contextlib import contextmanager
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from calcpack.errors import InputError
from calcpack.inputs.file import InputsFileError, Spec, require_input
from calcpack.inputs.layout import Table, refuse_unknown_keys
from calcpack.loads.derive import Derivation
from calcpack.loads.roof_cases import RoofProfile, case_groups
from calcpack.loads.roof_profiles import (
    snow_profiles_asce7,
    snow_profiles_en,
    wind_profiles_asce7,
    wind_profiles_en,
)
from calcpack.units import Q_, Quantity

__all__ = ["STANDARDS", "SiteLoads", "site_loads_inputs"]

STANDARDS = ("ASCE 7-16", "EN 1991 UK")
_P = "[force] / [length] ** 2"
_SNOW = {
    "ASCE 7-16": ("pg", "pg_source", "terrain", "exposure", "thermal", "risk_category", "surface"),
    "EN 1991 UK": ("altitude", "zone", "topography"),
}
_WIND = {
    "ASCE 7-16": ("V", "V_source", "exposure", "enclosure"),
    "EN 1991 UK": ("vb_map", "vb_source", "altitude", "c_e", "c_e_source", "c_eT", "loaded_area"),
}


def layout(standard: str) -> Table:
    """The keys a site loads inputs file may hold for ``standard`` (one of STANDARDS)."""
    note = f"for standard {standard!r}"
    return Table(
        {
            "site": Table(dict.fromkeys(("mark", "standard"))),
            "roof": Table(
                dict.fromkeys(("shape", "slope", "width", "length", "height", "spacing"))
            ),
            "snow": Table(dict.fromkeys(_SNOW[standard]), note=note),
            "wind": Table(dict.fromkeys(_WIND[standard]), note=note),
        }
    )


def _get(
    table: Mapping[str, Any],
    section: str,
    key: str,
    spec: Spec | str,
    path: Any,
    default: Any = ...,
) -> Any:
    if key not in table:
        if default is not ...:
            return default
        raise InputsFileError(
            f"Inputs file {path}: [{section}] needs {key} (got nothing)",
            name=f"{section}.{key}",
            value=None,
            expected=f"a value for {key}",
        )
    return require_input(table[key], spec, f"{section}.{key}", path=path)


@contextmanager
def _file_keys(path: Any, *tables: tuple[str, Mapping[str, Any]]) -> Iterator[None]:
    """Re-raise an input error of a derivation named by its own argument (``terrain``) as an
    error of the inputs file's key (``snow.terrain``), so that the file's key and the panel's
    field are found from it."""
    try:
        yield
    except InputsFileError:
        raise
    except InputError as exc:
        for section, table in tables:
            if exc.name is not None and exc.name in table:
                raise InputsFileError(
                    f"Inputs file {path}: [{section}] {exc.name} = {table[exc.name]!r}: {exc}",
                    name=f"{section}.{exc.name}",
                    value=exc.value,
                    expected=exc.expected,
                ) from exc
        raise


@dataclass(frozen=True)
class SiteLoads:
    """The derivations and the roof load cases of one frame.

    Attributes:
        title: the roof's name. standard: as in the inputs. derivations: snow and wind
        derivations (each with its working). profiles: the load cases across the frame.
        spacing: member centres. groups: ``groups=`` for the combinations.
    """

    title: str
    standard: str
    derivations: tuple[Derivation, ...]
    profiles: tuple[RoofProfile, ...]
    spacing: Quantity

    @property
    def groups(self) -> dict[str, tuple[str, ...]]:
        return case_groups(self.profiles)

    def line_load_rows(self) -> list[list[Any]]:
        """Rows: case, from x, to x, area load, line load on a member (area × spacing)."""
        us = f"{self.spacing.units:~}" in ("ft", "in")
        lu = "plf" if us else "kN/m"
        rows = []
        for p in self.profiles:
            for a, b, v in zip(p.breaks[:-1], p.breaks[1:], p.values, strict=True):
                rows.append(
                    [p.case, a, b, v.to("psf" if us else "kN/m^2"), (v * self.spacing).to(lu)]
                )
        return rows

    def add_to(self, sheet: Any) -> SiteLoads:
        """Add the derivations, the load-case sketch, the table and the exports to ``sheet``."""
        from calcpack.working import Figure, Table

        for d in self.derivations:
            d.add_to(sheet)
        sheet.heading("Load cases on the roof members", 2)
        sheet.text(
            "Each snow arrangement and each wind case (direction, pressure case, internal "
            "pressure) is a load case of its own; the combinations repeat once per case. Line "
            "load on a member = area load × member spacing; wind acts normal to the roof "
            "(+ toward it), snow on plan (downward)."
        )
        sheet.add(
            Figure(
                "roof-loads",
                self.profiles,
                caption=f"{self.title}: snow arrangements and the envelope of the wind cases "
                "across the frame",
                alt="Strips of the snow load on plan for each arrangement and the largest wind "
                "pressure and suction across the frame",
            )
        )
        sheet.add(
            Table(
                columns=["Case", "from x", "to x", "area load", "line load"],
                rows=self.line_load_rows(),
                caption=f"Load cases by piece across the frame, member spacing {self.spacing:~P}",
            )
        )
        snow = [p for p in self.profiles if p.symbol == "S"]
        wind = [p for p in self.profiles if p.symbol == "W"]
        if snow:
            worst = max((v for p in snow for v in p.values), key=lambda q: q.to("kN/m^2").magnitude)
            sheet.export(
                worst, name="s_roof_max", case="S", description="largest roof snow load on plan"
            )
        if wind:
            low = min((v for p in wind for v in p.values), key=lambda q: q.to("kN/m^2").magnitude)
            sheet.export(
                low,
                name="w_roof_suction",
                case="W",
                description="largest net wind suction on the roof",
            )
        return self


def _roof(
    roof: Mapping[str, Any], shapes: tuple[str, ...], path: Any
) -> tuple[Any, Quantity, Quantity, Quantity, Quantity]:
    """The ``[roof]`` table's shape (one of ``shapes``, the standard's roof forms), slope,
    width, length and height (lengths positive)."""
    shape = _get(roof, "roof", "shape", Spec("text", choices=shapes), path)
    slope = _get(roof, "roof", "slope", "[]", path)
    width, length, height = (
        _get(roof, "roof", key, Spec("[length]", positive=True), path)
        for key in ("width", "length", "height")
    )
    return shape, slope, width, length, height


def _asce(
    data: Mapping[str, Any], roof: Mapping[str, Any], path: Any
) -> tuple[list[Derivation], list[RoofProfile]]:
    from calcpack.loads.snow_asce7 import SnowRoofASCE7, SnowSiteASCE7, roof_snow_asce7
    from calcpack.loads.wind_asce7 import WindSiteASCE7
    from calcpack.loads.wind_asce7_lowrise import LowRiseBuildingASCE7, envelope_wind_asce7

    shape, slope, width, length, height = _roof(roof, ("gable", "hip", "monoslope"), path)
    sn, wi = data.get("snow", {}), data.get("wind", {})
    derivs: list[Derivation] = []
    profiles: list[RoofProfile] = []
    if sn:
        with _file_keys(path, ("snow", sn), ("roof", roof)):
            site = SnowSiteASCE7(
                pg=_get(sn, "snow", "pg", Spec(_P, nonnegative=True), path),
                pg_source=_get(sn, "snow", "pg_source", "text", path),
                terrain=_get(sn, "snow", "terrain", "text", path, "C"),
                exposure=_get(sn, "snow", "exposure", "text", path, "partially exposed"),
                thermal=_get(sn, "snow", "thermal", "text", path, "heated"),
                risk_category=_get(sn, "snow", "risk_category", "text", path, "II"),
            )
            W = width / 2 if shape in ("gable", "hip") else width
            sroof = SnowRoofASCE7(
                shape, slope, W, _get(sn, "snow", "surface", "text", path, "non-slippery")
            )
            snow = roof_snow_asce7(site, sroof)
            derivs.append(snow.derivation)
            profiles += snow_profiles_asce7(snow, sroof)
    if wi:
        with _file_keys(path, ("wind", wi), ("roof", roof)):
            wsite = WindSiteASCE7(
                V=_get(wi, "wind", "V", "[speed]", path),
                V_source=_get(wi, "wind", "V_source", "text", path),
                exposure=_get(wi, "wind", "exposure", "text", path, "C"),
            )
            bld = LowRiseBuildingASCE7(
                height,
                width,
                length,
                slope,
                shape,
                _get(wi, "wind", "enclosure", "text", path, "enclosed"),
            )
            env = envelope_wind_asce7(wsite, bld)
            derivs.append(env.derivation)
            profiles += wind_profiles_asce7(env, bld)
    return derivs, profiles


def _en(
    data: Mapping[str, Any], roof: Mapping[str, Any], path: Any
) -> tuple[list[Derivation], list[RoofProfile]]:
    from calcpack.loads.snow_en1991 import SnowRoofEN, SnowSiteEN, roof_snow_en
    from calcpack.loads.wind_en1991 import WindSiteEN
    from calcpack.loads.wind_en1991_cpe import BuildingEN, wind_pressures_en

    shape, slope, width, length, height = _roof(roof, ("duopitch", "monopitch"), path)
    sn, wi = data.get("snow", {}), data.get("wind", {})
    derivs: list[Derivation] = []
    profiles: list[RoofProfile] = []
    if sn:
        with _file_keys(path, ("snow", sn), ("roof", roof)):
            site = SnowSiteEN(
                altitude=_get(sn, "snow", "altitude", "[length]", path),
                zone=_get(sn, "snow", "zone", Spec("number", positive=True), path),
                topography=_get(sn, "snow", "topography", "text", path, "normal"),
            )
            snow = roof_snow_en(site, SnowRoofEN(shape, slope))
            derivs.append(snow.derivation)
            profiles += snow_profiles_en(snow, width)
    if wi:
        with _file_keys(path, ("wind", wi), ("roof", roof)):
            wsite = WindSiteEN(
                _get(wi, "wind", "vb_map", "[speed]", path),
                _get(wi, "wind", "vb_source", "text", path),
                altitude=_get(wi, "wind", "altitude", "[length]", path),
                c_e=_get(wi, "wind", "c_e", Spec("number", positive=True), path),
                c_e_source=_get(wi, "wind", "c_e_source", "text", path),
                c_eT=_get(wi, "wind", "c_eT", Spec("number", positive=True), path, 1.0),
            )
            bld = BuildingEN(shape, slope, height, length, width)
            area = _get(
                wi, "wind", "loaded_area", Spec("[area]", positive=True), path, Q_(10.0, "m^2")
            )
            thetas = (0, 180, 90) if shape == "monopitch" else (0, 90)
            for th in thetas:
                w = wind_pressures_en(wsite, bld, theta=th, area=area)  # type: ignore[arg-type]
                derivs.append(w.derivation)
                profiles += wind_profiles_en(w, bld)
    return derivs, profiles


def site_loads_inputs(data: Mapping[str, Any], *, path: Path | str | None = None) -> SiteLoads:
    """Derive the site loads described by an inputs file's tables (see the module notes).

    Raises:
        InputsFileError: a missing or malformed key (named). InputError: a value outside the
            provisions (named by the derivation).
    """
    where = str(path) if path is not None else "(inputs)"
    refuse_unknown_keys(data, Table(dict.fromkeys(("site", "roof", "snow", "wind"))), path=path)
    site = data.get("site", {})
    standard = _get(site, "site", "standard", Spec("text", choices=STANDARDS), where)
    refuse_unknown_keys(data, layout(standard), path=path)
    roof = data.get("roof")
    if not isinstance(roof, Mapping):
        raise InputsFileError(
            f"Inputs file {where}: a [roof] table is required",
            name="roof",
            value=roof,
            expected="[roof] with shape, slope, width, length, height and spacing",
        )
    spacing = _get(roof, "roof", "spacing", Spec("[length]", positive=True), where)
    if not data.get("snow") and not data.get("wind"):
        raise InputError(
            f"Inputs file {where}: give a [snow] or a [wind] table (got neither)",
            name="snow",
            value=None,
            expected="[snow] and/or [wind]",
        )
    fn = _asce if standard == "ASCE 7-16" else _en
    derivs, profiles = fn(data, roof, where)
    title = str(site.get("mark", "Roof"))
    return SiteLoads(title, standard, tuple(derivs), tuple(profiles), spacing)
