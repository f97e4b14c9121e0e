"""The text layer of the example packages: a reader searching or copying finds typeset
symbols and values, never raw identifiers; no heading names its member twice; a US package
carries no Eurocode terms. (The three jobs are built by test_example_projects' fixture; the
lintel demo by the build conftest.)"""

from __future__ import annotations

from typing import Any

import pytest
from examplekit import PROJECTS
from textlayer import raw_identifiers, repeated_headings

from calcpack.contract.numbers import format_number
from calcpack.units import Q_

pytestmark = pytest.mark.build


def test_the_pattern_list_catches_what_a_reader_saw() -> None:
    """The patterns find each defect the page-by-page reading found (issue text), and leave
    typeset text and file names alone."""
    seen = "R_A = 2.606 kip; F_c,star; F_cperp; 480 ft * lbf; 9.8696; x = 7.800000000000001 m"
    kinds = {what for what, _ in raw_identifiers(seen)}
    assert len(kinds) == 5
    assert raw_identifiers("RA = 2.61 kip from sheets/02_beam_B1.ipynb, Fc⊥ = 425 psi") == []
    assert repeated_headings("B1: B1: deflection (live)") == ["B1: B1:"]
    assert repeated_headings("B1: deflection (live)") == []


def test_demo_package_text_layer(demo_texts: list[str]) -> None:
    text = "\n".join(demo_texts)
    assert raw_identifiers(text) == []
    assert repeated_headings(text) == []


@pytest.mark.parametrize("name", PROJECTS)
def test_example_packages_text_layer(packages: dict[str, Any], name: str) -> None:
    built = packages[name]
    text = "\n".join(built.pages)
    assert raw_identifiers(text) == [], name
    assert repeated_headings(text) == [], name
    if built.manifest["project"]["units"] == "US":
        assert "national annex" not in text.lower(), name
        assert "Eurocode" not in text, name


def _q(record: dict[str, Any]) -> Any:
    return Q_(record["value"], record["unit"].replace("·", "*"))


def test_cited_values_are_searchable(packages: dict[str, Any]) -> None:
    """Values cited in prose are text: the beam sheet's sentence can be found and copied."""
    text = " ".join(" ".join(packages["alteration_ashgrove_lane"].pages).split())
    assert "The beam analysis gives RA = 2.58 kip and RB = 2.07 kip" in text
    built = packages["deck_larkspur_court"]
    deck = " ".join(" ".join(built.pages).split())
    # the bearer's dead load comes from the joist sheet's record (the joists' dead reaction by
    # case over their spacing); two equal spans under it (beam tables): R_B = 1.25 w l,
    # |M_B| = w l²/8, in the sheet's units at three significant figures
    sheets = {s["path"]: s for s in built.manifest["sheets"]}
    exports = {(e["name"], e["case"]): e for e in sheets["sheets/01_joists.ipynb"]["exports"]}
    R_D, s_J = exports[("R_J", "D")], exports[("s_J", None)]
    w = _q(R_D) / _q(s_J)
    bearer = {v["name"]: v for v in sheets["sheets/02_bearer.ipynb"]["values"]}
    span = _q(bearer["l_B"])
    # shown in the units the bearer sheet settled for a force (its R_B) and a moment (M_BD)
    fu, mu = bearer["R_B"]["unit"], bearer["M_BD"]["unit"]
    R_B = format_number((1.25 * w * span).to(fu.replace("·", "*")).magnitude)
    M_B = format_number((w * span**2 / 8).to(mu.replace("·", "*")).magnitude)
    assert f"The analysis gives RB = {R_B} {fu} and MB = {M_B} {mu}" in deck
