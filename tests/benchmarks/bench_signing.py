"""Benchmark: signing and verifying a package, with its structure tree flattened or not.

Run: ``PYTHONPATH=. python tests/benchmarks/bench_signing.py``.
Target: the package as the build writes it (structure tree flattened) signs twice and verifies
in less time than the same package with the tree as WeasyPrint wrote it.

Signing and verifying run the signature's difference analysis, which walks the object graph of
the document once per later revision; the flattening (:mod:`calcpack.package.pdf_tree`) drops
the bare wrapper elements and the orphaned title-block copies. The package is the stand-in of
the unit tests (tests/unit/package/test_pdf_structure.py: cover, contents, four sheets with a
table and a figure, summary, laid out one sheet per chunk, with a manifest). What is timed, in
one run:

* reference: the package joined with the flattening switched off;
* flattened: the package as the build writes it.

Each is signed as preparer and checker with demo credentials and verified. Printed: the objects
in use, the times, and the ratio of each total to the reference's. Exit status 1 if either
package does not verify. On a real package the gain is larger (the lintel demo: 5,464 objects
in use before, 1,705 after; the Ashgrove Lane job: 17,802 and 9,978).
"""

from __future__ import annotations

import argparse
import io
import sys
import tempfile
import time
from pathlib import Path

import pytest
from pypdf import PdfReader

from calcpack.package import paginate as pg
from calcpack.package import pdfjoin
from calcpack.signing.keys import make_demo_credentials
from calcpack.signing.sign import sign_package
from calcpack.signing.verify import verify_package


def objects_in_use(pdf: bytes) -> int:
    reader = PdfReader(io.BytesIO(pdf))
    numbers = {n for table in reader.xref.values() for n in table} | set(reader.xref_objStm)
    return sum(1 for n in numbers - {0} if reader.get_object(n) is not None)


def package(*, flatten: bool) -> bytes:
    """The stand-in package, one sheet per chunk, with a manifest to sign."""
    from tests.unit.package.test_pdf_structure import joined
    from tests.unit.signing.signing_helpers import make_manifest

    with pytest.MonkeyPatch.context() as mp:
        mp.setattr(pg, "CHUNK_HTML_CHARS", 1)
        if not flatten:
            mp.setattr(pdfjoin, "flatten_structure", lambda writer: None)
        return joined(make_manifest(roles=("preparer", "checker")))


def sign_and_verify(pdf: bytes, folder: Path) -> tuple[float, float, bool]:
    path = folder / "package.pdf"
    path.write_bytes(pdf)
    demo = make_demo_credentials(folder / "keys")
    start = time.perf_counter()
    for role in ("preparer", "checker"):
        sign_package(path, role, demo.keys[role], demo.password)
    signed = time.perf_counter()
    report = verify_package(path, [demo.root])
    return signed - start, time.perf_counter() - signed, report.ok


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.parse_args()
    rows = {}
    with tempfile.TemporaryDirectory() as tmp:
        for name, flatten in (("reference", False), ("flattened", True)):
            pdf = package(flatten=flatten)
            folder = Path(tmp, name)
            folder.mkdir()
            sign, verify, ok = sign_and_verify(pdf, folder)
            rows[name] = (objects_in_use(pdf), sign, verify, ok)
    ref = rows["reference"]
    print(f"{'':10} {'objects':>8} {'sign x2 s':>10} {'verify s':>9} {'ratio':>6}  verifies")
    for name, (count, sign, verify, ok) in rows.items():
        ratio = (sign + verify) / (ref[1] + ref[2])
        print(f"{name:10} {count:8d} {sign:10.1f} {verify:9.1f} {ratio:6.2f}  {ok}")
    return 0 if rows["flattened"][3] and ref[3] else 1


if __name__ == "__main__":
    sys.exit(main())
