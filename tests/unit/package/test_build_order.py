"""The build's links between sheets: found without running, ordered, cycles refused, cache keys
carrying the imported values, failures naming the sheets not built.

Sheets run in this process (``linkkit.run_in_process`` in place of a kernel), so the build's
own scheduling, cache and value passing are what is tested.
"""

from __future__ import annotations

from pathlib import Path

import pytest
from linkkit import exported, run_in_process, write_linked_project

from calcpack.errors import BuildError, NotebookExecutionError
from calcpack.package import execute
from calcpack.package.links import execution_order, scan_imports, sheet_dependencies
from calcpack.package.project import load_project


def _given(name: str, kN: float) -> str:
    return f's.export(s.given("{name}", {kN!r} * ureg.kN, "load"))\n'


def _sum(name: str, sources: list[tuple[str, str]], own: float) -> str:
    lines = [
        f'{n}_in = s.import_value("{sheet}", "{n}", dimension="[force]")' for sheet, n in sources
    ]
    total = " + ".join([f"{n}_in" for _, n in sources] + [f"{own!r} * ureg.kN"])
    return "\n".join([*lines, f's.export(s.derive("{name}", {total}, unit="kN"))']) + "\n"


@pytest.fixture
def in_process(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr(execute, "_execute", run_in_process)


def test_imports_are_found_without_running(tmp_path: Path) -> None:
    root = write_linked_project(
        tmp_path,
        {
            "a": _given("P", 1.0),
            "b": 'x = s.import_value("a", "P")\n'
            'y = s.import_cases(sheet="sheets/a.ipynb", name="R")',
        },
        ["a", "b"],
    )
    assert scan_imports(root / "sheets" / "b.ipynb", sheet="b") == ("a", "sheets/a.ipynb")
    deps = sheet_dependencies(load_project(root))
    assert deps == {"sheets/a.ipynb": (), "sheets/b.ipynb": ("sheets/a.ipynb",)}


def test_an_import_naming_its_sheet_by_an_expression_is_refused(tmp_path: Path) -> None:
    root = write_linked_project(tmp_path, {"b": 'name = "a"\nx = s.import_value(name, "P")'}, ["b"])
    with pytest.raises(BuildError, match=r"Sheet 'b', cell 2: import_value names the sheet"):
        scan_imports(root / "sheets" / "b.ipynb", sheet="b")


def test_an_import_of_values_by_case_is_found_before_execution(tmp_path: Path) -> None:
    root = write_linked_project(
        tmp_path, {"b": 'N = s.import_by_case("a", "N", dimension="[force]")'}, ["b"]
    )
    assert scan_imports(root / "sheets" / "b.ipynb", sheet="b") == ("a",)


def test_a_sheet_removed_while_others_import_from_it_is_named(tmp_path: Path) -> None:
    root = write_linked_project(
        tmp_path, {"a": _given("P", 1.0), "b": _sum("Q", [("a", "P")], 0.0)}, ["b"]
    )
    with pytest.raises(BuildError) as info:
        sheet_dependencies(load_project(root))
    assert "Sheet 'sheets/b.ipynb' imports from sheet 'a', which is not in the project" in str(
        info.value
    )


def test_a_cycle_is_refused_naming_its_sheets(tmp_path: Path) -> None:
    root = write_linked_project(
        tmp_path,
        {
            "a": _sum("P", [("c", "R")], 1.0),
            "b": _sum("Q", [("a", "P")], 1.0),
            "c": _sum("R", [("b", "Q")], 1.0),
            "d": _given("S", 1.0),
        },
        ["d", "a", "b", "c"],
    )
    project = load_project(root)
    with pytest.raises(BuildError) as info:
        execution_order([s.path for s in project.sheets], sheet_dependencies(project))
    message = str(info.value)
    assert "cycle" in message
    for name in ("sheets/a.ipynb", "sheets/b.ipynb", "sheets/c.ipynb"):
        assert name in message
    assert "sheets/d.ipynb" not in message


def test_order_follows_imports_and_keeps_project_order_otherwise() -> None:
    deps = {"b2": ("b1",), "a2": ("a1",), "a1": (), "b1": ()}
    assert execution_order(["a2", "b2", "a1", "b1"], deps) == ["a1", "b1", "a2", "b2"]


def test_values_flow_down_a_chain_listed_backwards(tmp_path: Path, in_process: None) -> None:
    root = write_linked_project(
        tmp_path,
        {
            "loads": _given("P", 2.5),
            "beam": _sum("R", [("loads", "P")], 1.25),
            "post": _sum("N", [("beam", "R"), ("loads", "P")], 0.5),
        },
        ["post", "beam", "loads"],
    )
    done = execute.execute_sheets(load_project(root), workers=1, use_cache=False)
    values = {item.entry.path: exported(item.notebook_json) for item in done}
    # 2.5 + 1.25 = 3.75; 3.75 + 2.5 + 0.5 = 6.75 (arithmetic)
    assert values["sheets/beam.ipynb"]["R"] == 3.75
    assert values["sheets/post.ipynb"]["N"] == 6.75
    assert [i.entry.path for i in done] == [
        "sheets/post.ipynb",
        "sheets/beam.ipynb",
        "sheets/loads.ipynb",
    ]


def test_change_upstream_reexecutes_exactly_the_sheets_downstream(
    tmp_path: Path, in_process: None
) -> None:
    sheets = {
        "loads": _given("P", 2.0),
        "beam": _sum("R", [("loads", "P")], 1.0),
        "post": _sum("N", [("beam", "R")], 1.0),
        "other": _given("Q", 7.0),
        "other_user": _sum("T", [("other", "Q")], 0.0),
    }
    order = list(sheets)
    root = write_linked_project(tmp_path, sheets, order)
    first = execute.execute_sheets(load_project(root), workers=1)
    assert all(not i.from_cache for i in first)

    write_linked_project(tmp_path, {"loads": _given("P", 3.0)}, order)
    second = execute.execute_sheets(load_project(root), workers=1)
    ran = {i.entry.path for i in second if not i.from_cache}
    assert ran == {"sheets/loads.ipynb", "sheets/beam.ipynb", "sheets/post.ipynb"}
    post = next(i for i in second if i.entry.path == "sheets/post.ipynb")
    assert exported(post.notebook_json)["N"] == 5.0  # 3 + 1 + 1 (arithmetic)

    # An upstream edit that leaves its exported values alone re-executes only that sheet.
    write_linked_project(tmp_path, {"loads": "# a comment\n" + _given("P", 3.0)}, order)
    third = execute.execute_sheets(load_project(root), workers=1)
    assert {i.entry.path for i in third if not i.from_cache} == {"sheets/loads.ipynb"}


def test_a_failing_exporter_names_the_sheets_not_built(tmp_path: Path, in_process: None) -> None:
    root = write_linked_project(
        tmp_path,
        {
            "loads": "x = 1 / 0\n" + _given("P", 2.0),
            "beam": _sum("R", [("loads", "P")], 1.0),
            "post": _sum("N", [("beam", "R")], 1.0),
            "other": _given("Q", 7.0),
        },
        ["loads", "beam", "post", "other"],
    )
    with pytest.raises(NotebookExecutionError) as info:
        execute.execute_sheets(load_project(root), workers=1, use_cache=False)
    message = str(info.value)
    assert "Sheet 'sheets/loads.ipynb' failed" in message
    assert "Not built, as they import from it" in message
    assert "sheets/beam.ipynb, sheets/post.ipynb" in message
    assert "sheets/other.ipynb" not in message
