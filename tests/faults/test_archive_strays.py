"""Fault injection: a build killed between writing and moving its output leaves temporaries
behind; the next build removes the ones it owns, says so, and never removes a signed file.

The safe outcome is common practice for a tool that publishes files by writing beside them and
renaming (nothing half-written is ever in place, nothing stray is kept for ever, and nothing
someone signed is deleted).
"""

from __future__ import annotations

import os
import subprocess
import sys
import textwrap
from pathlib import Path

import pytest

from calcpack.package.publish import clean_stale_outputs
from calcpack.signing.keys import make_demo_credentials
from calcpack.signing.sign import sign_package
from tests.unit.signing.signing_helpers import attach_manifest, cover_pdf, make_manifest

REPO = Path(__file__).resolve().parents[2]


def _dead_pid() -> int:
    """The id of a process that has ended (and been reaped)."""
    proc = subprocess.Popen([sys.executable, "-c", "pass"])
    proc.wait()
    return proc.pid


def test_only_strays_of_builds_that_stopped_are_removed_and_signed_ones_kept(
    tmp_path: Path,
) -> None:
    out = tmp_path / "build"
    out.mkdir()
    dead = _dead_pid()
    stray_pdf = out / f".2417-calcs-revA.pdf.build-{dead}-abcd1234.tmp"
    stray_manifest = out / f".2417-calcs-revA.manifest.json.build-{dead}-zz9_0000.tmp"
    running = out / f".2417-calcs-revA.pdf.build-{os.getpid()}-abcd1234.tmp"  # a build now
    unrelated = [out / ".notes.tmp", out / ".2417-calcs-revA.pdf.abcd1234.partial"]
    for path in (stray_pdf, stray_manifest, running, *unrelated):
        path.write_bytes(b"%PDF-1.7\n% half a package\n")
    demo = make_demo_credentials(tmp_path / "keys")
    signed = tmp_path / "signed.pdf"
    signed.write_bytes(attach_manifest(cover_pdf(), make_manifest()))
    sign_package(signed, "preparer", demo.keys["preparer"], demo.password)
    signed_stray = out / f".2417-calcs-revB.pdf.build-{dead}-signed00.tmp"
    signed_stray.write_bytes(signed.read_bytes())

    messages = clean_stale_outputs(out)

    assert not stray_pdf.exists()
    assert not stray_manifest.exists()
    assert running.exists()
    assert all(p.exists() for p in unrelated)
    assert signed_stray.read_bytes() == signed.read_bytes()  # never removed, never changed
    assert len(messages) == 3
    assert any(m.startswith("removed") and stray_pdf.name in m for m in messages)
    assert any(m.startswith("kept") and "carries signatures" in m for m in messages)
    assert clean_stale_outputs(tmp_path / "missing") == ()


def test_a_stray_from_before_builds_named_their_process_is_removed_only_when_old(
    tmp_path: Path,
) -> None:
    fresh = tmp_path / ".job-calcs-revA.pdf.k3j9x0qa.tmp"
    old = tmp_path / ".job-calcs-revA.manifest.json.p0o9i8u7.tmp"
    for path in (fresh, old):
        path.write_bytes(b"{}")
    two_hours_ago = old.stat().st_mtime - 7200
    os.utime(old, (two_hours_ago, two_hours_ago))
    messages = clean_stale_outputs(tmp_path)
    assert fresh.exists()  # may be a build writing now
    assert not old.exists()
    assert len(messages) == 1


_KILL_BETWEEN_MOVES = textwrap.dedent(
    """
    import os, signal, sys
    from pathlib import Path
    from calcpack.package import pipeline

    real = os.replace

    def die_before_the_pdf(src, dst):  # the manifest is moved into place, then the power fails
        if ".build-" in str(src) and str(dst).endswith(".pdf"):
            os.kill(os.getpid(), signal.SIGKILL)
        return real(src, dst)

    pipeline.os.replace = die_before_the_pdf
    pipeline.build(Path(sys.argv[1]), workers=1)
    """
)


@pytest.mark.build
def test_a_build_killed_between_its_two_moves_is_cleaned_up_by_the_next(tmp_path: Path) -> None:
    from calcpack.cli import main
    from calcpack.package.cache import CacheWarning
    from calcpack.package.pipeline import build
    from tests.faults.archivekit import built_project

    project, pdf = built_project(tmp_path)
    nb = project / "sheets" / "01.ipynb"
    nb.write_text(nb.read_text("utf-8").replace("2.5", "3.5"), "utf-8")
    env = {**os.environ, "PYTHONPATH": str(REPO)}
    killed = subprocess.run(
        [sys.executable, "-c", _KILL_BETWEEN_MOVES, str(project)], env=env, timeout=600
    )
    assert killed.returncode == -9
    out = project / "build"
    (stray,) = out.glob(f".{pdf.name}.build-*.tmp")
    with pytest.warns(CacheWarning, match="does not carry the manifest beside it"):
        result = build(project, workers=1)
    assert not stray.exists()
    assert any("removed" in w and stray.name in w for w in result.warnings)
    assert not result.up_to_date  # the PDF in place was the old one: rebuilt
    assert list(out.glob(".*.tmp")) == []
    assert "3.5" in result.manifest_path.read_text("utf-8")
    assert main(["build", str(project), "--quiet", "--workers", "1"]) == 0  # and quiet again
