"""The build's worker processes: started with spawn, and spared imports a build never uses."""

from __future__ import annotations

import subprocess
import sys
import textwrap

import pytest

from calcpack.package.execute import process_pool


def _worker_state() -> tuple[bool, str, bool]:
    """In a worker: is rfc3987_syntax blocked, which start method, and does nbformat validate?"""
    import multiprocessing

    import nbformat

    blocked = "rfc3987_syntax" in sys.modules and sys.modules["rfc3987_syntax"] is None
    nb = nbformat.v4.new_notebook(cells=[nbformat.v4.new_code_cell("x = 1")])
    nbformat.validate(nb)  # jsonschema still works without the optional package
    bad = nbformat.v4.new_notebook()
    bad.cells = [{"cell_type": "code"}]  # no source, no outputs: invalid
    try:
        nbformat.validate(bad)
    except nbformat.ValidationError:
        rejects = True
    else:
        rejects = False
    return blocked, multiprocessing.get_start_method(), rejects


def test_worker_is_spawned_without_the_slow_optional_import() -> None:
    # Common practice (measured here): the optional rfc3987_syntax compiles a grammar on import,
    # about 0.85 s per process, for a string format notebook validation never checks.
    with process_pool(1) as pool:
        blocked, method, rejects = pool.submit(_worker_state).result(timeout=120)
    assert blocked
    assert method == "spawn"
    assert rejects  # validation still rejects a malformed notebook


def test_an_already_imported_module_is_left_alone() -> None:
    pytest.importorskip("rfc3987_syntax")
    code = textwrap.dedent(
        """
        import sys
        import rfc3987_syntax
        from calcpack.package.execute import skip_unused_slow_imports
        skip_unused_slow_imports()
        assert sys.modules["rfc3987_syntax"] is rfc3987_syntax
        print("kept")
        """
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "kept"


def test_command_line_process_blocks_it() -> None:
    code = textwrap.dedent(
        """
        import sys
        from calcpack.cli import main
        try:
            main(["build", "/nonexistent-calcpack-project"])
        except SystemExit:
            pass
        print(sys.modules.get("rfc3987_syntax", "absent"))
        """
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip().splitlines()[-1] == "None"
