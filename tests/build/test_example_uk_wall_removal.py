"""The fourth example job, in SI to the Eurocodes with the UK annexes (preset "eurocode-uk"):
a ground-floor wall removal with a steel beam on padstones and C24 joists framing in. It
builds, signs as preparer and checker, verifies, and every check of its manifest is recomputed
here from the project's inputs file -- the clause formulas written out by hand where they are
short (joists, padstone, masonry), calcpack's checked functions where they are long (beam LTB:
M_cr from the moment diagram, tested against published C1/C2 values in
tests/validation/test_en1993_critical_moment.py).
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

PROJECT = Path(__file__).resolve().parents[2] / "example_projects" / "wall_removal_hollins_road"


@pytest.fixture(scope="module")
def built(packages: dict[str, Built]) -> dict[str, Any]:
    """The job as built, signed and read once per session by the shared ``packages`` fixture."""
    b = packages["wall_removal_hollins_road"]
    return {
        "project": b.project,
        "pdf": b.pdf,
        "root": b.root,
        "manifest": b.manifest,
        "pages": b.pages,
    }


def _inputs() -> dict[str, Any]:
    return tomllib.loads((PROJECT / "inputs" / "design.toml").read_text(encoding="utf-8"))


def _expected() -> dict[tuple[str, str, str | None], tuple[Any, Any]]:
    from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
    from calcpack.checks.en1993 import check_en1993_beam
    from calcpack.combinations import analyse_combinations, annex_combinations, en1990_annex
    from calcpack.loads import UniformLoad
    from calcpack.sections.eurocode_tables import euro_section

    d = _inputs()
    geo, lds, st, tim, mas = d["geometry"], d["loads"], d["steel"], d["timber"], d["masonry"]
    mm = lambda q: Q_(q).to("mm").magnitude  # noqa: E731
    gk = Q_(lds["floor_permanent"]).to("kN/m**2").magnitude
    qk = (Q_(lds["floor_imposed"]) + Q_(lds["partitions"])).to("kN/m**2").magnitude
    exp: dict[tuple[str, str, str | None], tuple[Any, Any]] = {}
    # BS EN 1990 + UK NA (Table NA.A1.2(B)): 6.10a 1.35G + 1.5 x 0.7 Q; 6.10b 0.925 x 1.35 G + 1.5 Q
    combos = {
        "6.10a: 1.35G + 1.05Q": (1.35, 1.05),
        "6.10b (Q leading): 1.249G + 1.5Q": (0.925 * 1.35, 1.5),
    }
    # -- joists J1: C24 47 x 200 at 400 mm, span 3.9 m (EN 1995-1-1, UK NA)
    b, h, s = mm(tim["b"]), mm(tim["h"]), mm(geo["joist_spacing"])
    L = mm(geo["joist_span_front"])
    W = b * h**2 / 6
    kmod = {"permanent": 0.6, "medium": 0.8}  # Table 3.1, service class 1
    jcombos = {"6.10a (G only)": (1.35, 0.0, "permanent")}
    jcombos.update({k: (a, c, "medium") for k, (a, c) in combos.items()})
    for name, (fg, fq, dur) in jcombos.items():
        w = (fg * gk + fq * qk) * s / 1e3  # N/mm
        M, V = w * L**2 / 8, w * L / 2
        k = kmod[dur]
        exp[("J1", "Bending (6.1.6)", name)] = (Q_(M / W, "MPa"), Q_(k * 1.1 * 24 / 1.3, "MPa"))
        exp[("J1", "Shear (6.1.7)", name)] = (
            Q_(1.5 * V / (0.67 * b * h), "MPa"),
            Q_(k * 4.0 / 1.3, "MPa"),
        )
        lb = mm(geo["joist_bearing"])
        exp[("J1", "Bearing (6.1.5)", name)] = (
            Q_(V / (b * (lb + 30)), "MPa"),
            Q_(1.5 * k * 2.5 / 1.3, "MPa"),
        )
    EI = 11000 * b * h**3 / 12  # N mm², E_0,mean of C24
    wG = 5 * gk * s / 1e3 * L**4 / (384 * EI)
    wQ = 5 * qk * s / 1e3 * L**4 / (384 * EI)
    exp[("J1", "Final deflection (2.2.3)", None)] = (
        Q_(wG * 1.6 + wQ * (1 + 0.3 * 0.6), "mm"),
        Q_(L / 250, "mm"),
    )
    # vibration (§7.3, UK NA): w = 1000 k_dist ℓ³ k_amp/(48 EI), k_dist = 0.30 governs here;
    # the floor mass is the permanent load over g (kg/m²)
    EIj = EI * 1e-6  # N m²
    mass = gk * 1e3 / 9.81
    f1 = math.pi / (2 * (L / 1e3) ** 2) * math.sqrt(EIj / (s / 1e3) / mass)
    eib = Q_(lds["deck_EI"]).to("N*m**2/m").magnitude
    kd = max(0.38 - 0.08 * math.log(14 * eib / (s / 1e3) ** 4), 0.30)
    w1 = 1000 * kd * (L / 1e3) ** 3 * 1.05 / (48 * EIj) * 1e3
    exp[("J1 floor", "Floor deflection under 1 kN (7.3)", None)] = (Q_(w1, "mm"), Q_(1.8, "mm"))
    B = Q_(geo["floor_width"]).to("m").magnitude
    n40 = (((40 / f1) ** 2 - 1) * (B / (L / 1e3)) ** 4 * (EIj / (s / 1e3)) / eib) ** 0.25
    v = 4 * (0.4 + 0.6 * n40) / (mass * B * L / 1e3 + 200)
    exp[("J1 floor", "Unit impulse velocity (7.4)", None)] = (
        Q_(v, "m/(N*s**2)"),
        Q_((180 - 60 * 1.8 if 1.8 <= 1 else 160 - 40 * 1.8) ** (f1 * 0.02 - 1), "m/(N*s**2)"),
    )
    # -- beam B1 (EN 1993-1-1): UDL from the joists, self-weight from the section's mass
    sec = euro_section(st["section"])
    bt = (Q_(geo["joist_span_front"]) + Q_(geo["joist_span_rear"])) / 2
    wG_b = (Q_(lds["floor_permanent"]) * bt + sec.mass * Q_(9.81, "m/s**2")).to("kN/m")
    wQ_b = (Q_(qk, "kN/m**2") * bt).to("kN/m")
    Lb = Q_(geo["beam_span"])
    beam = Beam(length=Lb, supports=[Pin(0 * ureg.m, name="P1"), Roller(Lb, name="P2")],
                loads=[UniformLoad(w=wG_b, case="G"), UniformLoad(w=wQ_b, case="Q")],
                EI=Q_(210000, "MPa") * sec.Iy, name="B1")  # fmt: skip
    cases = solve_cases(beam)
    uls = analyse_combinations(cases, annex_combinations(en1990_annex("UK"), variable={"Q": "A"}))
    gov = "6.10b (Q leading): 1.249G + 1.5Q"
    wu = (combos[gov][0] * wG_b + combos[gov][1] * wQ_b).to("kN/m")
    Mu, Vu = (wu * Lb**2 / 8).to("kN*m"), (wu * Lb / 2).to("kN")
    # S355, t_f = 7.8 mm: f_y = 355 MPa; class 1; V_pl = A_v f_y/√3 with A_v of §6.2.6(3)(a)
    fy = 355.0
    Av = max(
        sec.A.to("mm**2").magnitude - 2 * mm(sec.b) * mm(sec.tf)
        + (mm(sec.tw) + 2 * mm(sec.r)) * mm(sec.tf),
        (mm(sec.h) - 2 * mm(sec.tf)) * mm(sec.tw),
    )  # fmt: skip
    exp[("B1", "Shear (6.2.6)", gov)] = (Vu, Q_(Av * fy / math.sqrt(3) / 1e3, "kN"))
    exp[("B1", "Bending y-y (6.2.5)", gov)] = (
        Mu,
        Q_(sec.Wpl_y.to("mm**3").magnitude * fy / 1e6, "kN*m"),
    )
    ltb = check_en1993_beam(sec, st["grade"], demand=uls, load_level="top flange", mark="B1")
    lt = ltb["Lateral-torsional buckling (6.3.2)"]
    # χ_LT by §6.3.2.3 with the UK NA: curve b for h/b ≤ 2, λ̄_LT,0 = 0.4, β = 0.75,
    # f with k_c = 1/√C1
    Mcr, C1 = ltb.values["M_cr"].to("kN*m").magnitude, ltb.values["C_1"].magnitude
    Mpl = sec.Wpl_y.to("mm**3").magnitude * fy / 1e6
    lam = math.sqrt(Mpl / Mcr)
    phi = 0.5 * (1 + 0.34 * (lam - 0.4) + 0.75 * lam**2)
    chi = min(1 / (phi + math.sqrt(phi**2 - 0.75 * lam**2)), 1.0, 1 / lam**2)
    f = min(1 - 0.5 * (1 - 1 / math.sqrt(C1)) * (1 - 2 * (lam - 0.8) ** 2), 1.0)
    exp[("B1", "Lateral-torsional buckling (6.3.2)", gov)] = (
        Mu,
        Q_(min(chi / f, 1.0, 1 / lam**2) * Mpl, "kN*m"),
    )
    assert lt.demand.to("kN*m").magnitude == pytest.approx(Mu.magnitude, rel=1e-6)
    # web bearing, EN 1993-1-5 §6 type (c), s_s = 100 mm, c = 0
    tw, tf, bf, hw = mm(sec.tw), mm(sec.tf), mm(sec.b), mm(sec.h) - 2 * mm(sec.tf)
    ss = mm(st["bearing_length"])
    kF = min(2 + 6 * ss / hw, 6)
    Fcr = 0.9 * kF * 210000 * tw**3 / hw
    m1 = bf / tw
    le = min(kF * 210000 * tw**2 / (2 * fy * hw), ss)
    for m2 in (0.02 * (hw / tf) ** 2, 0.0):
        ly = min(le + tf * math.sqrt(m1 / 2 + (le / tf) ** 2 + m2), le + tf * math.sqrt(m1 + m2))
        lamF = math.sqrt(ly * tw * fy / Fcr)
        if lamF > 0.5:
            break
    exp[("B1 at P1, P2", "Web bearing (EN 1993-1-5 §6)", None)] = (
        Vu,
        Q_(fy * min(0.5 / lamF, 1) * ly * tw / 1e3, "kN"),
    )
    wq = (5 * wQ_b * Lb**4 / (384 * Q_(210000, "MPa") * sec.Iy)).to("mm")
    exp[("B1", "Deflection (imposed)", "Q")] = (wq, (Lb / 360).to("mm"))
    # -- padstones and brickwork (EN 1992-1-1 §6.7, EN 1996-1-1 §6.1.3)
    pl, pw, pd = mm(mas["padstone_length"]), mm(mas["padstone_width"]), mm(mas["padstone_depth"])
    a0 = ss * mm(sec.b)
    # B1's end bears at the padstone's end by the jamb: its load line is x_c from that end and
    # only l_c = 2 min(x_c, l_p - x_c) of padstone is centred on it
    xc = mm(geo["padstone_to_bearing"]) + ss / 2
    lc = 2 * min(xc, pl - xc)
    # A_c1 similar to and concentric with A_c0 (§6.7(2), (3)), within l_c and the padstone's
    # width, each side at most 3 x and grown by at most the depth (Figure 6.29)
    k = max(min(lc / ss, pw / mm(sec.b), 1 + pd / max(ss, mm(sec.b)), 3.0), 1.0)
    a1 = k**2 * a0
    exp[("P1, P2", "Padstone bearing (EN 1992-1-1 6.7)", gov)] = (
        Vu,
        Q_(a0 * 0.85 * 30 / 1.5 * min(math.sqrt(a1 / a0), 3.0) / 1e3, "kN"),
    )
    t, hc = mm(mas["t"]), mm(geo["pier_height"])
    # 45° spread through the padstone, concentric with the load (common practice)
    lb_m = min(lc, ss + 2 * pd)
    wb = min(pw, mm(sec.b) + 2 * pd, t)
    a_1 = mm(geo["padstone_to_jamb"]) + xc - lb_m / 2  # wall end (jamb) to the loaded area
    spread = hc / 2 * math.tan(math.radians(30))
    lefm = lb_m + min(a_1, spread) + spread  # Figure 6.2, stopped by the jamb
    ratio = min(lb_m * wb / (lefm * t), 0.45)
    beta = max(min((1 + 0.3 * a_1 / hc) * (1.5 - 1.1 * ratio), 1.25 + a_1 / (2 * hc), 1.5), 1.0)
    fk = 0.5 * 20**0.7 * 4**0.3
    exp[("P1, P2", "Masonry bearing (6.1.3)", gov)] = (
        Vu,
        Q_(beta * lb_m * wb * fk / 2.7 / 1e3, "kN"),
    )
    # declared out of scope on sheet 4, with its reason
    exp[("P1, P2", "Foundations under the brick piers", None)] = (None, None)
    return exp


def _reported(manifest: dict[str, Any]) -> dict[tuple[str, str, str | None], dict[str, Any]]:
    out = {}
    for sheet in manifest["sheets"]:
        for c in sheet["checks"]:
            comb = c.get("combination")
            out[(c["member"], c["name"], comb)] = c
    return out


def test_every_check_matches_an_independent_recomputation(built: dict[str, Any]) -> None:
    reported = _reported(built["manifest"])
    expected = _expected()
    assert set(reported) == set(expected)
    for key, (demand, capacity) in expected.items():
        c = reported[key]
        if demand is None:
            assert c["verdict"] == "NOT COVERED", key
            assert "trial pit" in c["description"], key
            continue
        u = ureg(c["unit"].replace("·", "*")).units if c["unit"] else ureg.dimensionless
        # 1e-6: the same arithmetic in another order; the manifest keeps full precision
        assert c["demand"] == pytest.approx(Q_(demand).to(u).magnitude, rel=1e-6), key
        assert c["capacity"] == pytest.approx(Q_(capacity).to(u).magnitude, rel=1e-6), key
        assert c["verdict"] == "OK", key


def test_package_verifies_and_carries_the_eurocode_basis(built: dict[str, Any]) -> None:
    from calcpack.signing.verify import verify_package

    report = verify_package(built["pdf"], [built["root"]])
    assert report.ok
    assert [s.role for s in report.signatures] == ["preparer", "checker"]
    flat = [re.sub(r"\s+", " ", p) for p in built["pages"]]
    text = " ".join(flat)
    # the preset's standards and cautions reach the package; SI units throughout
    assert "BS EN 1993-1-1" in text
    assert "UK National Annexes" in text
    assert "kN" in text
    assert " kip" not in text
    assert built["manifest"]["project"]["units"] == "SI"


def test_values_cross_sheets_as_links_and_the_checker_verifies_the_reactions(
    built: dict[str, Any],
) -> None:
    """The floor loads of sheet 1 reach the joists and B1, and B1's reactions by case reach
    the padstones, as links (never retyped); the checker's w·L/2 agrees with them."""
    man = built["manifest"]
    pairs = {(x["from_sheet"], x["from_name"], x["to_sheet"]) for x in man["links"]}
    for to in ("02_joists", "03_beam_B1"):
        for name in ("g_k", "q_k"):
            assert ("sheets/01_loads.ipynb", name, f"sheets/{to}.ipynb") in pairs
    assert ("sheets/03_beam_B1.ipynb", "R_P1", "sheets/04_padstones.ipynb") in pairs
    checked = {(v["of_name"], v["case"]): v for v in man["verifications"]}
    assert set(checked) == {("R_P1", "G"), ("R_P1", "Q")}
    assert all(v["agreed"] for v in checked.values())
    # statics of the simple span, by hand from the inputs file: w_Q = 2.0 kN/m² x (3.9 + 3.3)/2
    # = 7.2 kN/m, R = 7.2 x 4.2 / 2 = 15.12 kN
    assert checked[("R_P1", "Q")]["preparer_value"] == pytest.approx(15.12, rel=1e-9)


def test_not_covered_is_what_the_job_declares_each_with_its_reason(built: dict[str, Any]) -> None:
    from calcpack.checks.checklists import resolve_checklists

    sheets = built["manifest"]["sheets"]
    status = resolve_checklists(
        [(s["number"], c) for s in sheets for c in s.get("checklists", [])],
        [(s["number"], c) for s in sheets for c in s["checks"]],
    )
    assert {s.member for s in status} == {"J1", "B1", "P1, P2"}
    left = {(s.member, s.item): s.detail for s in status if s.status == "NOT COVERED"}
    assert set(left) == {("J1", "connections (hangers, fasteners)")}
    assert "hangers" in left[("J1", "connections (hangers, fasteners)")]
    cover = re.sub(r"\s+", " ", built["pages"][0])
    assert "2 NOT COVERED" in cover
    assert "Engineer of record" in cover
    assert "G. Llewellyn-Shaw" in cover


def test_pagination_and_outline_rules(built: dict[str, Any]) -> None:
    """The pagination and outline rules of every package (tests/build/pagerules.py)."""
    from pagerules import package_problems, titleblock_names

    names = titleblock_names(built["project"])
    assert package_problems(built["pdf"], built["manifest"], names) == []
