"""The garden studio job (SI, the Eurocodes with the UK annexes): a continuous C24 ridge beam
on four posts under roof loads derived on sheet 1, the imposed load placed span by span.

It builds, signs as preparer and checker and verifies; every check of its manifest is
recomputed here from the project's inputs file -- the loads by hand from the roof build-up,
the continuous beam with calcpack's beam solver (validated against published beam tables in
tests/validation), the BS EN 1995-1-1 clauses written out below with the BS EN 338 C24 values
(Table 1, from memory) and k_mod, γ_M of Table 3.1 and the UK annex (from memory). The NOT
COVERED list is what the job declares, each item with its reason.
"""

from __future__ import annotations

import math
import re
import tomllib
from pathlib import Path
from typing import Any

import pytest
from examplekit import Built

from calcpack.units import Q_, ureg

pytestmark = pytest.mark.build

PROJECT = Path(__file__).resolve().parents[2] / "example_projects" / "garden_studio"

# BS EN 338:2016 Table 1, C24 (from memory): MPa and kg/m³
C24 = {"fm_k": 24.0, "fv_k": 4.0, "fc90_k": 2.5, "E0_mean": 11000.0, "E0_05": 7400.0,
       "rho_mean": 420.0}  # fmt: skip
GAMMA_M = 1.3  # UK NA to BS EN 1995-1-1 Table NA.3, solid timber (from memory)
K_MOD = {"permanent": 0.6, "medium": 0.8}  # EN 1995-1-1 Table 3.1, service class 1


@pytest.fixture(scope="module")
def built(packages: dict[str, Built]) -> dict[str, Any]:
    """The job as built, signed and read once per session by the shared ``packages`` fixture."""
    b = packages["garden_studio"]
    return {
        "project": b.project,
        "pdf": b.pdf,
        "root": b.root,
        "manifest": b.manifest,
        "pages": b.pages,
    }


def _inputs() -> dict[str, Any]:
    return tomllib.loads((PROJECT / "inputs" / "design.toml").read_text(encoding="utf-8"))


def _line_loads() -> tuple[float, float, float]:
    """(w_G, w_Q, w_S) in kN/m, by hand from the roof build-up and the site."""
    d = _inputs()
    roof, site, ridge = d["roof"], d["site"], d["ridge"]
    a = math.radians(Q_(roof["pitch"]).to("deg").magnitude)
    slope = sum(
        Q_(roof[k]).to("kN/m**2").magnitude
        for k in ("tiles_battens", "sarking_felt", "rafters_insulation", "ceiling")
    )
    bt = Q_(roof["rafter_plan_span"]).to("m").magnitude  # half of each of the two rafters
    b, h = Q_(ridge["b"]).to("m").magnitude, Q_(ridge["h"]).to("m").magnitude
    w_G = slope / math.cos(a) * bt + C24["rho_mean"] * 9.81 * b * h / 1e3
    w_Q = Q_(roof["roof_imposed"]).to("kN/m**2").magnitude * bt
    # UK NA to BS EN 1991-1-3 Eq. NA.1 (from memory), C_e = C_t = 1, μ1 = 0.8 for α ≤ 30°
    A = Q_(site["altitude"]).to("m").magnitude
    sk = 0.15 + (0.1 * site["snow_zone"] + 0.05) + (A - 100) / 525
    return w_G, w_Q, 0.8 * sk * bt


def _expected() -> dict[tuple[str, str, str | None], tuple[float, float]]:
    from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
    from calcpack.checks.demand import max_abs

    d = _inputs()
    ridge = d["ridge"]
    spans = [Q_(x).to("m").magnitude for x in ridge["spans"]]
    lines = [0.0, *[sum(spans[: i + 1]) for i in range(len(spans))]]
    b, h = Q_(ridge["b"]).to("mm").magnitude, Q_(ridge["h"]).to("mm").magnitude
    w_G, w_Q, w_S = _line_loads()
    EI = Q_(C24["E0_mean"] * b * h**3 / 12, "N*mm**2")
    m = ureg.m
    from calcpack.loads import UniformLoad

    def solve(loads: list[tuple[float, float, float]]) -> Any:
        beam = Beam(
            length=lines[-1] * m,
            supports=[Pin(0 * m, name="A")]
            + [Roller(x * m, name=n) for x, n in zip(lines[1:], "BCD", strict=True)],
            loads=[
                UniformLoad(w=w * ureg.kN / m, start=a * m, end=e * m, case="X")
                for w, a, e in loads
            ],
            EI=EI,
        )
        return solve_cases(beam)["X"]

    # BS EN 1990 + UK NA: 6.10a 1.35 G + 1.5 ψ0 Q; 6.10b 0.925 × 1.35 G + 1.5 Q; ψ0 = 0.7
    # for roofs (category H) and 0.5 for snow (Table NA.A1.1, from memory). The imposed load on
    # every non-empty set of spans; snow over the whole beam; never both (EN 1991-1-1 §3.3.2).
    combos: dict[str, list[tuple[float, float, float]]] = {}
    sets = [(1,), (2,), (3,), (1, 2), (1, 3), (2, 3), (1, 2, 3)]
    for gq, fq, tag in ((1.35, 1.05, "6.10a"), (0.925 * 1.35, 1.5, "6.10b (Q leading)")):
        for on in sets:
            loads = [(gq * w_G, 0.0, lines[-1])]
            loads += [(fq * w_Q, lines[i - 1], lines[i]) for i in on]
            combos[f"Q|{tag}|{on}"] = loads
    for gs, fs, tag in ((1.35, 0.75, "6.10a"), (0.925 * 1.35, 1.5, "6.10b (S leading)")):
        combos[f"S|{tag}"] = [(gs * w_G + fs * w_S, 0.0, lines[-1])]

    def peaks(r: Any) -> tuple[float, float, float]:
        M = max_abs(r, "moment")[0].to("kN*m").magnitude
        V = max_abs(r, "shear")[0].to("kN").magnitude
        R = max(abs(r.reaction(p).Fy.to("kN").magnitude) for p in "ABCD")
        return M, V, R

    found = {k: peaks(solve(v)) for k, v in combos.items()}
    chosen: dict[str, tuple[tuple[float, float, float], str]] = {
        "6.10a (G only)": (peaks(solve([(1.35 * w_G, 0.0, lines[-1])])), "permanent")
    }
    for family in ("Q", "S"):
        group = {k: v for k, v in found.items() if k.startswith(family)}
        for i in range(3):
            key = max(group, key=lambda k: group[k][i])
            chosen[key] = (group[key], "medium")
    exp: dict[tuple[str, str, str | None], tuple[float, float]] = {}
    W = b * h**2 / 6
    lef = max(spans) * 1e3
    s_crit = 0.78 * b**2 * C24["E0_05"] / (h * lef)  # EN 1995-1-1 Eq. (6.32)
    lam = math.sqrt(C24["fm_k"] / s_crit)
    k_crit = 1.0 if lam <= 0.75 else (1.56 - 0.75 * lam if lam <= 1.4 else 1 / lam**2)
    l_b = Q_(ridge["bearing_length"]).to("mm").magnitude
    for key, ((M, V, R), dur) in chosen.items():
        k = K_MOD[dur]
        f_md = k * C24["fm_k"] / GAMMA_M  # k_h = 1 for h ≥ 150 mm, k_sys = 1
        exp[(key, "Bending (6.1.6)")] = (M * 1e6 / W, f_md)
        exp[(key, "Lateral torsional stability (6.3.3)")] = (M * 1e6 / W, k_crit * f_md)
        exp[(key, "Shear (6.1.7)")] = (1.5 * V * 1e3 / (0.67 * b * h), k * C24["fv_k"] / GAMMA_M)
        # bearing: ℓ + 30 mm on the inner side only (end distance 0), k_c,90 = 1.5
        exp[(key, "Bearing (6.1.5)")] = (
            R * 1e3 / (b * (l_b + 30)),
            1.5 * k * C24["fc90_k"] / GAMMA_M,
        )
    # final deflection per span: G × (1 + k_def) + the worse of the imposed load on the spans
    # deflecting the point down and the snow, × (1 + ψ2 k_def) with ψ2 = 0; k_def = 0.6
    per_span = {i: solve([(1.0, lines[i - 1], lines[i])]) for i in (1, 2, 3)}
    whole = solve([(1.0, 0.0, lines[-1])])
    for i in (1, 2, 3):
        a, e = lines[i - 1], lines[i]
        best = None
        for t in range(1, 40):
            x = (a + (e - a) * t / 40) * m
            dG = w_G * whole.deflection(x).to("mm").magnitude
            dQ = w_Q * sum(max(per_span[j].deflection(x).to("mm").magnitude, 0.0) for j in per_span)
            dS = w_S * whole.deflection(x).to("mm").magnitude
            score = dG + dQ + max(dQ, dS)
            if best is None or score > best[0]:
                best = (score, dG, dQ, dS)
        assert best is not None
        _, dG, dQ, dS = best
        exp[(f"RB1 span {i}", "Final deflection (2.2.3)")] = (
            dG * 1.6 + max(dQ, dS),
            spans[i - 1] * 1e3 / 250,
        )
    return {(k[0], k[1], None): v for k, v in exp.items()}


def _reported(manifest: dict[str, Any]) -> dict[tuple[str, str], dict[str, Any]]:
    out = {}
    for sheet in manifest["sheets"]:
        for c in sheet["checks"]:
            out[(c.get("combination") or c["member"], c["name"])] = c
    return out


def _label(key: str) -> str:
    """The combination label the package writes for a key of _expected."""
    if key == "6.10a (G only)" or not key.startswith(("Q|", "S|")):
        return key
    family, tag, *rest = key.split("|")
    if family == "S":
        return f"{tag}: " + ("1.35G + 0.75S" if tag == "6.10a" else "1.249G + 1.5S")
    on = tuple(int(c) for c in rest[0].strip("()").split(",") if c.strip())
    g, q = ("1.35G", "1.05") if tag == "6.10a" else ("1.249G", "1.5")
    terms = " + ".join(f"{q}Q#{i}" for i in on)
    spans = ", ".join(str(i) for i in on)
    return f"{tag}: {g} + {terms} [Q on span{'s' if len(on) > 1 else ''} {spans}]"


def _canonical(label: str) -> str:
    """The beam is symmetric (spans L1, L2, L1): loading spans 1, 2 and spans 2, 3 give the
    same peaks to the last few bits, so either may be the one found largest. A label and its
    mirror image (span 1 <-> span 3) count as the same combination."""

    def mirror(text: str) -> str:
        out = re.sub(r"Q#([13])", lambda m: "Q#" + {"1": "3", "3": "1"}[m.group(1)], text)
        terms = sorted(re.findall(r"\d+(?:\.\d+)?Q#\d", out), key=lambda s: s[-1])
        if terms:
            out = re.sub(r"(\d+(?:\.\d+)?Q#\d)( \+ \d+(?:\.\d+)?Q#\d)*", " + ".join(terms), out)
        m = re.search(r"\[Q on spans? ([\d, ]+)\]", out)
        if m:
            on = sorted({"1": "3", "3": "1"}.get(x, x) for x in m.group(1).split(", "))
            out = out[: m.start(1)] + ", ".join(on) + out[m.end(1) :]
        return out

    return min(label, mirror(label))


def test_every_check_matches_an_independent_recomputation(built: dict[str, Any]) -> None:
    reported = {(_canonical(k[0]), k[1]): v for k, v in _reported(built["manifest"]).items()}
    expected = {(_canonical(_label(k[0])), k[1]): v for k, v in _expected().items()}
    assert set(reported) == set(expected)
    for key, (demand, capacity) in expected.items():
        c = reported[key]
        # 1e-6: the same arithmetic in another order; the manifest keeps full precision
        assert c["demand"] == pytest.approx(demand, rel=1e-6), key
        assert c["capacity"] == pytest.approx(capacity, rel=1e-6), key
        assert c["verdict"] == "OK", key


def test_loads_cross_sheets_as_links_and_the_checker_verifies_the_reactions(
    built: dict[str, Any],
) -> None:
    man = built["manifest"]
    links = {(x["from_name"], x["to_sheet"]) for x in man["links"]}
    for name in ("w_G", "w_Q", "w_S"):
        assert (name, "sheets/02_ridge_beam.ipynb") in links
    (w_G,) = [x for x in man["links"] if x["from_name"] == "w_G" and "02_" in x["to_sheet"]]
    assert w_G["value"] == pytest.approx(_line_loads()[0], rel=1e-9)
    checked = {(v["of_name"], v["case"]) for v in man["verifications"]}
    assert checked == {("R_A", "G"), ("R_B", "G")}
    assert all(v["agreed"] for v in man["verifications"])


def test_not_covered_is_what_the_job_declares_each_with_its_reason(built: dict[str, Any]) -> None:
    from calcpack.checks.checklists import resolve_checklists

    sheets = built["manifest"]["sheets"]
    status = resolve_checklists(
        [(s["number"], c) for s in sheets for c in s.get("checklists", [])],
        [(s["number"], c) for s in sheets for c in s["checks"]],
    )
    left = {(s.member, s.item): s.detail for s in status if s.status == "NOT COVERED"}
    assert set(left) == {
        ("RB1", "connections (hangers, fasteners)"),
        ("RB1", "the supports' own design"),
    }
    assert all("timber frame supplier" in why for why in left.values())
    cover = re.sub(r"\s+", " ", built["pages"][0])
    assert "2 NOT COVERED" in cover
    assert "R. Mbeki" in cover
    assert "Engineer of record" in cover


def test_package_verifies_on_the_eurocode_basis(built: dict[str, Any]) -> None:
    from calcpack.signing.verify import verify_package

    report = verify_package(built["pdf"], [built["root"]])
    assert report.ok
    assert [s.role for s in report.signatures] == ["preparer", "checker"]
    text = " ".join(re.sub(r"\s+", " ", p) for p in built["pages"])
    assert "BS EN 1995-1-1" in text
    assert "[Q on spans 1, 2]" in text
    for us_word in (" kip", "1.2D", "1.6L"):
        assert us_word not in text


def test_pagination_and_outline_rules(built: dict[str, Any]) -> None:
    """The pagination and outline rules of every package (tests/build/pagerules.py)."""
    from pagerules import package_problems, titleblock_names

    names = titleblock_names(built["project"])
    assert package_problems(built["pdf"], built["manifest"], names) == []
