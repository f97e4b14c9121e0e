"""Fixtures for the signing tests (helpers in signing_helpers.py)."""

from __future__ import annotations

import http.server
import shutil
import threading
from collections.abc import Iterator
from pathlib import Path
from typing import Any

import pytest
from signing_helpers import attach_manifest, cover_pdf, make_manifest, make_tsa


@pytest.fixture(scope="session")
def base_package(tmp_path_factory: pytest.TempPathFactory) -> Path:
    """One unsigned test package for the session (copy it before signing)."""
    path = tmp_path_factory.mktemp("base") / "package.pdf"
    path.write_bytes(attach_manifest(cover_pdf(), make_manifest()))
    return path


@pytest.fixture
def package(base_package: Path, tmp_path: Path) -> Path:
    """A fresh unsigned package in this test's directory."""
    target = tmp_path / "package.pdf"
    shutil.copy(base_package, target)
    return target


@pytest.fixture(scope="session")
def demo(tmp_path_factory: pytest.TempPathFactory) -> Any:
    """Demo root and one key per role (made once per session)."""
    from calcpack.signing.keys import make_demo_credentials

    return make_demo_credentials(tmp_path_factory.mktemp("demo-keys"))


@pytest.fixture(scope="session")
def signed_package(tmp_path_factory: pytest.TempPathFactory, base_package: Path, demo: Any) -> Path:
    """The test package signed by preparer, checker and approver (read-only use)."""
    from calcpack.signing.sign import sign_package

    path = tmp_path_factory.mktemp("signed") / "package.pdf"
    shutil.copy(base_package, path)
    for role in ("preparer", "checker", "approver"):
        sign_package(path, role, demo.keys[role], demo.password)
    return path


@pytest.fixture
def tsa_server(tmp_path: Path) -> Iterator[tuple[str, Path]]:
    """A timestamp server on 127.0.0.1 (RFC 3161 over HTTP): yields (URL, TSA root file)."""
    from asn1crypto import tsp

    stamper, root_path = make_tsa(tmp_path)

    class Handler(http.server.BaseHTTPRequestHandler):
        def do_POST(self) -> None:
            length = int(self.headers.get("Content-Length", "0"))
            request = tsp.TimeStampReq.load(self.rfile.read(length))
            body = stamper.request_tsa_response(request).dump()
            self.send_response(200)
            self.send_header("Content-Type", "application/timestamp-reply")
            self.send_header("Content-Length", str(len(body)))
            self.end_headers()
            self.wfile.write(body)

        def log_message(self, *args: Any) -> None:  # keep test output clean
            pass

    server = http.server.ThreadingHTTPServer(("127.0.0.1", 0), Handler)
    thread = threading.Thread(target=server.serve_forever, daemon=True)
    thread.start()
    try:
        yield f"http://127.0.0.1:{server.server_address[1]}/tsa", root_path
    finally:
        server.shutdown()
        server.server_close()
