"""Bad truss input is refused at construction, each message naming the offending input."""

from __future__ import annotations

import pytest

from calcpack.analysis.truss_model import JointLoad, Member, Node, Support, Truss
from calcpack.errors import DimensionError, InputError
from calcpack.units import ureg

m, kN = ureg.m, ureg.kN

NODES = {"A": (0 * m, 0 * m), "B": (4 * m, 0 * m), "C": (2 * m, 2 * m)}
MEMBERS = [("A", "B"), ("B", "C"), ("C", "A")]
SUPPORTS = {"A": "pin", "B": "roller"}


def build(**kw: object) -> Truss:
    args: dict[str, object] = {"nodes": NODES, "members": MEMBERS, "supports": SUPPORTS}
    args.update(kw)
    return Truss.build(**args)  # type: ignore[arg-type]


def test_a_good_triangle_builds() -> None:
    t = build(loads=[JointLoad("C", Fy=-1 * kN)])
    assert [n.name for n in t.nodes] == ["A", "B", "C"]
    assert t.load_cases == ("D",)


def test_duplicate_node_name() -> None:
    nodes = [Node("A", 0 * m, 0 * m), Node("A", 1 * m, 0 * m)]
    with pytest.raises(InputError, match="Node name 'A' is used twice"):
        Truss(nodes, [], [])


def test_coincident_nodes() -> None:
    with pytest.raises(InputError, match=r"Nodes C and D are at the same point") as e:
        build(nodes={**NODES, "D": (2000 * ureg.mm, 2 * m)}, members=[*MEMBERS, ("C", "D")])
    assert e.value.name == "node D"


def test_member_joining_node_to_itself() -> None:
    with pytest.raises(InputError, match="Member CC joins node C to itself"):
        build(members=[*MEMBERS, ("C", "C")])


def test_zero_length_member_is_reported_by_name() -> None:
    # Nodes closer than the coincidence tolerance are refused first, naming both nodes, so a
    # zero-length member cannot be built between two distinct nodes.
    with pytest.raises(InputError, match="Nodes A and E are at the same point"):
        build(nodes={**NODES, "E": (0 * m, 0 * m)}, members=[*MEMBERS, ("A", "E")])


def test_member_to_missing_node() -> None:
    with pytest.raises(InputError, match="Member CX refers to node 'X'") as e:
        build(members=[*MEMBERS, ("C", "X")])
    assert e.value.name == "member CX"


def test_two_members_on_one_pair() -> None:
    with pytest.raises(InputError, match="Members AB and BA both join nodes"):
        build(members=[*MEMBERS, ("B", "A")])


def test_load_on_missing_node() -> None:
    with pytest.raises(InputError, match="applied at node 'Z'") as e:
        build(loads=[JointLoad("Z", Fy=-5 * kN, case="L")])
    assert e.value.name == "load at Z"
    assert "case L" in str(e.value)


def test_support_on_missing_node() -> None:
    with pytest.raises(InputError, match="support is placed on node 'Q'"):
        build(supports={"A": "pin", "Q": "roller"})


def test_two_supports_on_one_node() -> None:
    with pytest.raises(InputError, match="Node A has two supports"):
        Truss(
            [Node(n, *xy) for n, xy in NODES.items()],
            [Member(f"{a}{b}", a, b) for a, b in MEMBERS],
            [Support("A", "pin"), Support("A", "roller")],
        )


def test_disconnected_parts() -> None:
    nodes = {**NODES, "P": (10 * m, 0 * m), "Q": (12 * m, 0 * m)}
    with pytest.raises(InputError, match=r"disconnected parts: nodes P, Q are not joined"):
        build(nodes=nodes, members=[*MEMBERS, ("P", "Q")])


def test_node_without_members() -> None:
    with pytest.raises(InputError, match="Node P is not connected to any member"):
        build(nodes={**NODES, "P": (10 * m, 0 * m)})


def test_bare_float_coordinate() -> None:
    with pytest.raises(DimensionError, match="x of node A"):
        Node("A", 0.0, 0 * m)  # type: ignore[arg-type]


def test_force_given_as_length() -> None:
    with pytest.raises(DimensionError, match="Fy of the load at C"):
        JointLoad("C", Fy=3 * m)


def test_fixed_support_is_refused_on_a_truss() -> None:
    with pytest.raises(InputError, match="must be 'pin' or 'roller'"):
        Support("A", "fixed")  # type: ignore[arg-type]


def test_negative_EA() -> None:
    with pytest.raises(InputError, match="EA of member AB must be positive"):
        Member("AB", "A", "B", EA=-1 * kN)
