"""A real JupyterLab server and a headless Chromium page driving it, for the browser tests.

The server runs on 127.0.0.1 with a random free port and a random token; it and the browser get
a temporary HOME and Jupyter config/data/runtime directories, so nothing touches the user's own.
The server runs under the same Python as pytest (``sys.executable``), whose environment
provides calcpack (installed, or the source tree on PYTHONPATH).
"""

from __future__ import annotations

import json
import os
import re
import secrets
import shutil
import socket
import subprocess
import sys
import time
import urllib.error
import urllib.request
from collections.abc import Iterator, Sequence
from contextlib import contextmanager
from dataclasses import dataclass
from pathlib import Path
from typing import Any

import calcpack

CHROMIUM = Path("/usr/bin/chromium")
CHROMIUM_ARGS = [
    "--no-sandbox",
    "--disable-gpu",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
    "--no-first-run",
]
# JupyterLab's news and update checks would open a notification over the notebook.
_NOTIFICATION_SETTINGS = {"fetchNews": "false", "checkForUpdates": False}


def _free_port() -> int:
    with socket.socket(socket.AF_INET, socket.SOCK_STREAM) as s:
        s.bind(("127.0.0.1", 0))
        return int(s.getsockname()[1])


def isolated_env(home: Path) -> dict[str, str]:
    """Environment for the server (and so its kernels): temporary HOME and Jupyter dirs,
    this Python first on PATH, and calcpack importable from its source tree if not installed."""
    env = {k: v for k, v in os.environ.items() if not k.startswith("JUPYTER")}
    env.update(
        HOME=str(home),
        JUPYTER_CONFIG_DIR=str(home / ".jupyter"),
        JUPYTER_DATA_DIR=str(home / ".local" / "share" / "jupyter"),
        JUPYTER_RUNTIME_DIR=str(home / ".local" / "share" / "jupyter" / "runtime"),
        IPYTHONDIR=str(home / ".ipython"),
        MPLCONFIGDIR=str(home / ".config" / "matplotlib"),
        MPLBACKEND="Agg",
        PYDEVD_DISABLE_FILE_VALIDATION="1",
        JUPYTER_PLATFORM_DIRS="1",
    )
    env["PATH"] = os.pathsep.join([str(Path(sys.executable).parent), env.get("PATH", "")])
    source_root = str(Path(calcpack.__file__).resolve().parent.parent)
    if not re.search(r"[\\/](site|dist)-packages$", source_root):
        parts = [source_root, *[p for p in env.get("PYTHONPATH", "").split(os.pathsep) if p]]
        env["PYTHONPATH"] = os.pathsep.join(dict.fromkeys(parts))
    return env


@dataclass
class LabServer:
    """A running JupyterLab: its base URL, token, notebook folder and process."""

    url: str
    token: str
    root: Path
    process: subprocess.Popen[bytes]
    log: Path

    def api(self, path: str, method: str = "GET", body: Any = None) -> Any:
        data = None if body is None else json.dumps(body).encode()
        req = urllib.request.Request(
            f"{self.url}{path}",
            data=data,
            method=method,
            headers={"Authorization": f"token {self.token}", "Content-Type": "application/json"},
        )
        with urllib.request.urlopen(req, timeout=10) as resp:
            raw = resp.read()
        return json.loads(raw) if raw else None

    def lab_url(self, notebook: str) -> str:
        return f"{self.url}/lab/tree/{notebook}?token={self.token}&reset"


@contextmanager
def lab_server(root: Path, home: Path, *, timeout_s: float = 90.0) -> Iterator[LabServer]:
    """Start JupyterLab serving ``root``; shut it down (kernels too) on exit."""
    settings = home / ".jupyter" / "lab" / "user-settings" / "@jupyterlab" / "apputils-extension"
    settings.mkdir(parents=True, exist_ok=True)
    (settings / "notification.jupyterlab-settings").write_text(
        json.dumps(_NOTIFICATION_SETTINGS), encoding="utf-8"
    )
    port = _free_port()
    token = secrets.token_hex(16)
    log = home / "jupyterlab.log"
    cmd = [
        sys.executable,
        "-m",
        "jupyterlab",
        "--no-browser",
        "--allow-root",
        "--ServerApp.ip=127.0.0.1",
        f"--ServerApp.port={port}",
        "--ServerApp.port_retries=0",
        f"--IdentityProvider.token={token}",
        f"--ServerApp.root_dir={root}",
        "--LabApp.news_url=",
    ]
    with log.open("wb") as fh:
        proc = subprocess.Popen(cmd, env=isolated_env(home), stdout=fh, stderr=subprocess.STDOUT)
    server = LabServer(f"http://127.0.0.1:{port}", token, root, proc, log)
    try:
        deadline = time.monotonic() + timeout_s
        while True:
            if proc.poll() is not None:
                raise RuntimeError(f"JupyterLab exited early:\n{log.read_text()[-3000:]}")
            try:
                server.api("/api/status")
                break
            except (urllib.error.URLError, ConnectionError, TimeoutError):
                if time.monotonic() > deadline:
                    raise RuntimeError(
                        f"JupyterLab not ready after {timeout_s} s:\n{log.read_text()[-3000:]}"
                    ) from None
                time.sleep(0.3)
        yield server
    finally:
        try:
            server.api("/api/shutdown", method="POST")
            proc.wait(timeout=20)
        except Exception:
            proc.terminate()
            try:
                proc.wait(timeout=10)
            except subprocess.TimeoutExpired:
                proc.kill()
                proc.wait(timeout=5)


@contextmanager
def chromium_page(profile: Path) -> Iterator[Any]:
    """A headless Chromium page (Debian's /usr/bin/chromium; Playwright downloads nothing)."""
    from playwright.sync_api import sync_playwright

    with sync_playwright() as pw:
        context = pw.chromium.launch_persistent_context(
            str(profile),
            executable_path=str(CHROMIUM),
            headless=True,
            args=CHROMIUM_ARGS,
            viewport={"width": 1400, "height": 1000},
        )
        try:
            page = context.pages[0] if context.pages else context.new_page()
            page.set_default_timeout(60_000)
            yield page
        finally:
            context.close()


# -- driving JupyterLab ---------------------------------------------------------------------
def open_notebook(page: Any, server: LabServer, notebook: str) -> None:
    """Open ``notebook`` and wait until its kernel is attached and idle."""
    page.goto(server.lab_url(notebook))
    page.wait_for_selector(".jp-NotebookPanel .jp-Cell", timeout=90_000)
    # The execution indicator reads idle before a kernel is attached: wait for the kernel name
    # first, then for idle.
    page.wait_for_function(
        """() => {
            const n = document.querySelector('.jp-NotebookPanel .jp-KernelName, '
                + '.jp-NotebookPanel [data-jp-item-name="kernelName"]');
            return n && /Python/.test(n.textContent || '');
        }""",
        timeout=90_000,
    )
    wait_idle(page)


def wait_idle(page: Any, timeout_ms: int = 120_000) -> None:
    page.wait_for_function(
        """() => {
            const i = document.querySelector('.jp-NotebookPanel .jp-Notebook-ExecutionIndicator');
            return i && i.getAttribute('data-status') === 'idle';
        }""",
        timeout=timeout_ms,
    )


def run_all_cells(page: Any) -> None:
    """Run every cell from the Run menu (JupyterLab 4 has no default shortcut for it)."""
    page.locator(".lm-MenuBar-itemLabel", has_text=re.compile(r"^Run$")).click()
    page.locator(".lm-Menu-itemLabel", has_text=re.compile(r"^Run All Cells$")).click()
    page.wait_for_timeout(500)
    wait_idle(page)
    page.wait_for_function(
        """() => {
            const prompts = [...document.querySelectorAll('.jp-NotebookPanel .jp-InputPrompt')];
            return prompts.length > 0 && prompts.every(p => !/\\[\\*\\]/.test(p.textContent));
        }""",
        timeout=120_000,
    )


# -- timing a panel edit in the page ----------------------------------------------------------
# Stamped in the page itself (performance.now()), so Playwright's round trips are not counted:
# a capturing keydown listener marks the Enter key in the panel, MutationObservers mark every
# change of the panel's outputs.
_WATCH = """
([panelSel, outputs]) => {
  const panel = document.querySelector(panelSel);
  window.__cpEdit = {key: null, changes: [], outputs: outputs.length};
  document.addEventListener('keydown', (e) => {
    if (e.key === 'Enter' && e.target.closest(panelSel)) {
      window.__cpEdit = {key: performance.now(), changes: [], outputs: outputs.length};
    }
  }, true);
  for (const sel of outputs) {
    new MutationObserver(() => {
      window.__cpEdit.changes.push({t: performance.now(), what: sel});
    }).observe(panel.querySelector(sel),
               {childList: true, subtree: true, characterData: true, attributes: true});
  }
}
"""

_SETTLED = """
([quietMs]) => {
  const e = window.__cpEdit;
  if (!e || e.key === null || e.changes.length === 0) return false;
  const last = e.changes[e.changes.length - 1].t;
  const kinds = new Set(e.changes.map(c => c.what));
  return kinds.size === e.outputs && performance.now() - last > quietMs;
}
"""

_READ = """
() => {
  const e = window.__cpEdit;
  const frames = (window.__cpFrames || []).filter(f => f.t >= e.key);
  const last = Math.max(...e.changes.map(c => c.t));
  const first = Math.min(...e.changes.map(c => c.t));
  const updates = frames.filter(f => f.t <= last);
  return {origin: performance.timeOrigin, key: e.key, first_change: first, last_change: last,
          n_changes: e.changes.length,
          frames: updates.length, bytes: updates.reduce((a, f) => a + f.size, 0),
          types: updates.map(f => f.type),
          timeline: updates.map(f => [f.t - e.key, f.type, f.size]),
          first_frame: updates.length ? updates[0].t : null};
}
"""


def watch_panel(page: Any, panel: str, outputs: Sequence[str]) -> None:
    """Start stamping edits of the panel ``panel`` (a selector) and changes of its ``outputs``
    (selectors inside it); see :func:`panel_edit_timing`."""
    page.evaluate(_WATCH, [panel, list(outputs)])


def panel_edit_timing(page: Any, *, quiet_ms: int = 300, timeout_ms: int = 30_000) -> Any:
    """After Enter in a watched panel: wait until every watched output has changed and the page
    has been quiet for ``quiet_ms``, then return the page's stamps (ms, page clock): ``key``,
    ``first_change``, ``last_change``, and the kernel frames if the page records them."""
    try:
        page.wait_for_function(_SETTLED, arg=[quiet_ms], timeout=timeout_ms)
    except Exception:
        state = page.evaluate("() => JSON.stringify(window.__cpEdit)")
        raise AssertionError(f"the panel did not update after the edit ({state})") from None
    return page.evaluate(_READ)


def cell_errors(page: Any) -> list[str]:
    """Text of any error outputs (tracebacks) on the page."""
    errs = page.locator(".jp-OutputArea-output[data-mime-type='application/vnd.jupyter.stderr']")
    return [errs.nth(i).inner_text() for i in range(errs.count())]


def save_screenshot(page: Any, name: str) -> Path:
    out = Path(__file__).resolve().parents[1] / "artifacts"
    out.mkdir(parents=True, exist_ok=True)
    path = out / name
    page.screenshot(path=str(path), full_page=False)
    return path


def copy_into(root: Path, *sources: Path) -> None:
    for src in sources:
        shutil.copy2(src, root / src.name)
