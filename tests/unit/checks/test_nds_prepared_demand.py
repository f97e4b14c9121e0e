"""A timber demand read once (PreparedTimberDemand) checks sawn and glulam beams exactly as the
combined results it was read from, and is refused by a check given other load durations."""

from __future__ import annotations

import pytest

from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
from calcpack.checks.nds.beam import check_nds_beam, prepare_timber_demand
from calcpack.checks.nds.factors import ReferenceDesignValues, SawnMember
from calcpack.checks.nds.glulam import check_nds_glulam_beam
from calcpack.checks.nds.members import TimberMember
from calcpack.checks.nds.values import nds_glulam_values, nds_sawn_values
from calcpack.combinations import analyse_combinations, asce7_allowable_stress
from calcpack.errors import InputError
from calcpack.loads.types import UniformLoad
from calcpack.units import Q_


def _asd():  # type: ignore[no-untyped-def]
    L = Q_(16, "ft")
    beam = Beam(
        length=L,
        supports=[Pin(Q_(0, "ft"), name="A"), Roller(L, name="B")],
        loads=[
            UniformLoad(w=Q_(60, "lbf/ft"), case="D"),
            UniformLoad(w=Q_(150, "lbf/ft"), case="L"),
            UniformLoad(w=Q_(90, "lbf/ft"), case="S"),
        ],
        EI=Q_(1.6e6, "psi") * Q_(200, "in**4"),
        name="J1",
    )
    return analyse_combinations(solve_cases(beam), asce7_allowable_stress())


def _rows(mc):  # type: ignore[no-untyped-def]
    return [(r.name, r.combination, r.utilisation, r.verdict) for r in mc.results]


def test_sawn_and_glulam_checks_agree_with_and_without_the_prepared_demand() -> None:
    asd = _asd()
    v = nds_sawn_values("Douglas Fir-Larch", "No.2")
    ref = ReferenceDesignValues(v.name, "No.2", v.source, Fb=v.Fb, Fv=v.Fv, E=v.E, Emin=v.Emin)
    size = SawnMember.dimension("4x12")
    prepared = prepare_timber_demand(asd)
    direct = check_nds_beam(size, ref, demand=asd)
    via = check_nds_beam(size, ref, demand=prepared)
    assert _rows(via) == _rows(direct)
    assert [s.text() for s in via.working()] == [s.text() for s in direct.working()]
    gl = TimberMember(nds_glulam_values("24F-1.8E"), b=Q_(3.125, "inch"), d=Q_(12, "inch"))
    assert _rows(check_nds_glulam_beam(gl, demand=prepared)) == _rows(
        check_nds_glulam_beam(gl, demand=asd)
    )


def test_a_prepared_demand_read_with_other_durations_is_refused() -> None:
    asd = _asd()
    v = nds_sawn_values("Douglas Fir-Larch", "No.2")
    ref = ReferenceDesignValues(v.name, "No.2", v.source, Fb=v.Fb, Fv=v.Fv, E=v.E, Emin=v.Emin)
    prepared = prepare_timber_demand(asd, {"S": "seven days"})
    with pytest.raises(InputError, match="durations"):
        check_nds_beam(SawnMember.dimension("4x12"), ref, demand=prepared)
    ok = check_nds_beam(
        SawnMember.dimension("4x12"), ref, demand=prepared, durations={"S": "seven days"}
    )
    assert any(r.name == "Bending" for r in ok.results)
