"""A kernel's channels fit the operating system's limit on socket addresses.

A Unix socket address holds at most 107 bytes on Linux (``sun_path`` is 108 bytes with its
terminating NUL; unix(7) manual page). A build run with a deep TMPDIR (a test runner's per-worker
folders, a CI workspace) must not fail with "File name too long": it uses the loopback interface
instead.
"""

from __future__ import annotations

import os

from calcpack.package.execute import _SOCKET_PATH_MAX, _kernel_transport


def test_short_folder_uses_unix_sockets_in_it() -> None:
    folder = "/tmp/calcpack-build-1-kernel-abc"
    chosen = _kernel_transport(folder)
    assert chosen == {"transport": "ipc", "ip": os.path.join(folder, "k")}


def test_deep_folder_uses_loopback() -> None:
    folder = "/tmp/" + "d" * 120
    assert _kernel_transport(folder) == {"transport": "tcp", "ip": "127.0.0.1"}


def test_every_ipc_channel_address_fits_the_linux_limit() -> None:
    for depth in range(1, 140):
        folder = "/" + "x" * depth
        chosen = _kernel_transport(folder)
        if chosen["transport"] == "ipc":
            # jupyter_client names each channel IP-PORT with small port numbers (1..5 per
            # kernel, counted up while a name is taken): allow a five-digit suffix.
            longest = len(os.fsencode(chosen["ip"])) + len("-99999")
            assert longest <= 107, (folder, longest)
    assert _SOCKET_PATH_MAX <= 107
