"""Benchmark: beam panel edit -> updated display, for a three-span beam (target < 100 ms).

Run with ``python tests/benchmarks/bench_widgets.py [--repeat N] [--no-browser]``. Not a timed
test: the machine's load varies, so the result is also reported as ratios against references
measured in the same run -- the beam solve itself (all load cases and both combinations) and one
plain numpy operation (a 200 × 200 matrix product) -- and the absolute times are printed beside
them.

Two figures:

* **kernel side** -- what happens in Python when the engineer changes a value in the panel: the
  new value is validated, the beam is solved per load case and combined, the checks made, and the
  diagrams and results redrawn (the inputs file is written off this path, see
  :mod:`calcpack.widgets.beam`);
* **end to end** -- in a real JupyterLab in Debian's chromium (driven by Playwright, as the
  browser tests): from the Enter key in the span box to the last change of the panel's diagrams
  and results in the page, stamped in the page itself (a capturing ``keydown`` listener and a
  ``MutationObserver``, both reading ``performance.now()``), so Playwright's own round trips are
  not counted. The kernel websocket frames received per edit (count and bytes) are recorded by
  wrapping the page's ``WebSocket``.
"""

from __future__ import annotations

import argparse
import json
import re
import shutil
import statistics
import sys
import tempfile
import time
from collections.abc import Callable
from pathlib import Path
from typing import Any

import numpy as np

REPO = Path(__file__).resolve().parents[2]
sys.path.insert(0, str(REPO))
sys.path.insert(0, str(REPO / "tests" / "browser"))

TARGET_S = 0.100
GARDEN = REPO / "example_projects" / "beam_examples"
SHEET = GARDEN / "ridge_beam_panel.ipynb"
INPUTS = GARDEN / "ridge_beam_panel.inputs.toml"
SPANS_M = (4.4, 5.0, 4.1, 4.7)  # none equal to the file's 3.8 m, so every edit changes


def _median_time(fn: Callable[[], object], repeat: int) -> float:
    times = []
    for _ in range(repeat):
        t0 = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t0)
    return statistics.median(times)


def kernel_side(repeat: int) -> dict[str, float]:
    """Median seconds of a panel edit in Python, and the references."""
    from calcpack.inputs import beam_inputs, evaluate_beam, load_inputs
    from calcpack.units import Q_
    from calcpack.widgets.beam import BeamPanel

    with tempfile.TemporaryDirectory() as tmp:
        path = Path(tmp) / INPUTS.name
        shutil.copy(INPUTS, path)
        panel = BeamPanel(path)
        k = [0]

        def edit() -> None:
            k[0] += 1
            panel.set("beam.spans[2]", Q_(SPANS_M[k[0] % len(SPANS_M)], "m"))

        edit()  # warm caches (pint unit parsing, imports)
        t_edit = _median_time(edit, repeat)
        # An older panel (--source) keeps no split: its whole call is display and file.
        timed = list(getattr(panel, "edit_times", []))[-repeat:] or [(0.0, t_edit, t_edit)]
        data = load_inputs(path)
        # A fresh validation each time, as a sheet run does (the section's properties included).
        t_solve = _median_time(lambda: evaluate_beam(beam_inputs(data)), repeat)
        a = np.random.default_rng(1).random((200, 200))
        t_numpy = _median_time(lambda: a @ a, repeat * 4)
        t_python = _median_time(lambda: sum(i * i for i in range(100_000)), repeat)
    return {
        "edit": t_edit,
        "display": statistics.median(t[1] for t in timed),
        "saved": statistics.median(t[2] for t in timed),
        "solve": t_solve,
        "numpy": t_numpy,
        "python": t_python,
    }


# The catalogue panels: (template, key edited, values cycled) -- each edit changes the value.
CATALOGUE = (
    ("steel_column", "forces[1].P", [(v, "kip") for v in (20.0, 26.0, 31.0, 23.0)]),
    ("footing", "footing.B", [(v, "ft") for v in (3.5, 4.0, 3.25, 3.75)]),
    ("site_loads", "snow.pg", [(v, "psf") for v in (20.0, 30.0, 35.0, 40.0)]),
    ("deck_ledger", "load.R", [(v, "lbf") for v in (250.0, 280.0, 310.0, 260.0)]),
    ("timber_post", "forces[1].P", [(v, "kip") for v in (4.0, 5.0, 6.0, 4.5)]),
)

# The beam member panels, checked for a sheet's analysis (a 14 ft simple span, dead and live,
# ASCE 7-16 combinations, live deflection span/360): (name, table, key edited, values cycled).
MEMBERS = (
    ("steel beam", 'material = "steel"\nsection = "W8X18"\nFy = "50 ksi"', "m.Fy",
     [(v, "ksi") for v in (50.0, 46.0, 42.0, 36.0)]),
    ("sawn beam", 'material = "sawn"\nspecies = "Douglas Fir-Larch"\ngrade = "No.2"\n'
     'size = "4x12"', "m.size", ["4x10", "3x12", "4x12", "2x12"]),
    ("glulam beam", 'material = "glulam"\nstress_class = "24F-1.8E"\nwidth = "5.125 in"\n'
     'depth = "12 in"', "m.depth", [(v, "inch") for v in (13.5, 15.0, 12.0, 10.5)]),
)  # fmt: skip


def _member_demand(material: str) -> Any:
    from calcpack.analysis.beam import Beam, Pin, Roller, solve_cases
    from calcpack.combinations import analyse_combinations, asce7_allowable_stress, asce7_strength
    from calcpack.inputs.beam_member import BeamDemand
    from calcpack.loads.types import UniformLoad
    from calcpack.sizing import DeflectionLimit
    from calcpack.units import Q_

    steel = material == "steel beam"
    L = Q_(14, "ft")
    w = ("0.3 kip/ft", "0.6 kip/ft") if steel else ("60 lbf/ft", "180 lbf/ft")
    beam = Beam(
        length=L,
        supports=[Pin(Q_(0, "ft"), name="A"), Roller(L, name="B")],
        loads=[UniformLoad(w=Q_(w[0]), case="D"), UniformLoad(w=Q_(w[1]), case="L")],
        EI=Q_(1.6e6, "psi") * Q_(200, "in**4"),
        name="B1",
    )
    cases = solve_cases(beam)
    strength = analyse_combinations(cases, asce7_strength() if steel else asce7_allowable_stress())
    return BeamDemand(strength, deflections=[DeflectionLimit(cases["L"], L, 360)],
                      continuous_bracing=steel)  # fmt: skip


def _time_panel(panel: Any, key: str, values: list[Any], repeat: int) -> dict[str, float]:
    from calcpack.units import Q_

    k = [0]
    shown: list[float] = []

    def edit() -> None:
        k[0] += 1
        v = values[k[0] % len(values)]
        panel.set(key, Q_(*v) if isinstance(v, tuple) else v)
        shown.append(panel.last_update_s)

    edit()  # warm caches
    shown.clear()
    whole = _median_time(edit, repeat)
    out = {"display": statistics.median(shown), "edit": whole}
    if hasattr(panel, "search"):
        t0 = time.perf_counter()
        found = panel.search()
        out["search"] = time.perf_counter() - t0
        out["tried"] = float(len(found.tried)) if found else 0.0
    return out


def catalogue_side(repeat: int) -> dict[str, dict[str, float]]:
    """Median seconds of an edit in each catalogue and member panel (validate, compute, redraw:
    the panel's own stamp) and of the whole edit call (with the file written), and each member
    panel's search for the lightest section that passes."""
    from calcpack.widgets.footing import FootingPanel
    from calcpack.widgets.ledger import LedgerPanel
    from calcpack.widgets.member import MemberPanel
    from calcpack.widgets.site_loads import SiteLoadsPanel
    from calcpack.widgets.sized_member import BeamMemberPanel, TimberPostPanel

    kinds = {
        "steel_column": MemberPanel,
        "footing": FootingPanel,
        "site_loads": SiteLoadsPanel,
        "deck_ledger": LedgerPanel,
        "timber_post": TimberPostPanel,
    }
    out: dict[str, dict[str, float]] = {}
    templates = REPO / "templates" / "sheets"
    with tempfile.TemporaryDirectory() as tmp:
        for name, key, values in CATALOGUE:
            path = Path(tmp) / f"{name}.inputs.toml"
            shutil.copy(templates / f"{name}.inputs.toml", path)
            out[name] = _time_panel(kinds[name](path), key, values, repeat)  # type: ignore[abstract]
        for name, table, key, values in MEMBERS:
            path = Path(tmp) / f"{name.replace(' ', '_')}.inputs.toml"
            path.write_text(f"[m]\n{table}\n", encoding="utf-8")
            panel = BeamMemberPanel(path, _member_demand(name), table="m")
            out[name] = _time_panel(panel, key, values, repeat)
    return out


# -- end to end in JupyterLab ---------------------------------------------------------------------
# Installed before any page script: every frame the kernel websocket receives is stamped with
# the page clock, its size and its message type.
_WS_HOOK = """
(() => {
  window.__cpFrames = [];
  const Orig = window.WebSocket;
  class Stamped extends Orig {
    constructor(...args) {
      super(...args);
      this.addEventListener('message', (ev) => {
        const t = performance.now();
        let size = 0, text = '';
        if (typeof ev.data === 'string') { size = ev.data.length; text = ev.data.slice(0, 4000); }
        else if (ev.data instanceof ArrayBuffer) {
          size = ev.data.byteLength;
          text = new TextDecoder().decode(new Uint8Array(ev.data, 0, Math.min(size, 4000)));
        }
        const m = /"msg_type"\\s*:\\s*"(\\w+)"/.exec(text);
        window.__cpFrames.push({t, size, type: m ? m[1] : '?'});
      });
    }
  }
  window.WebSocket = Stamped;
})();
"""

_TIMES_CELL = (
    "import json as _json\n"
    "print('CP-KERNEL-TIMES', _json.dumps(list(getattr(panel, 'edit_times', [[]]))))"
)


def _bench_notebook(root: Path) -> str:
    """The example beam sheet with the panel kept in a variable and a cell that prints the
    panel's own timings."""
    import nbformat

    nb = nbformat.read(SHEET, as_version=4)
    for cell in nb.cells:
        if cell.cell_type == "code" and cell.source.rstrip().endswith("beam_panel(INPUTS)"):
            cell.source = cell.source.rstrip()[: -len("beam_panel(INPUTS)")]
            cell.source += "panel = beam_panel(INPUTS)\npanel"
    nb.cells.append(nbformat.v4.new_code_cell(_TIMES_CELL))
    name = "bench_" + SHEET.name
    nbformat.write(nb, root / name)
    shutil.copy(INPUTS, root / INPUTS.name)
    return name


def browser_side(repeat: int) -> dict[str, Any]:
    """Edit the middle span ``repeat`` times in a real JupyterLab; per-edit page timings."""
    from lab_harness import (
        CHROMIUM,
        cell_errors,
        chromium_page,
        lab_server,
        open_notebook,
        panel_edit_timing,
        run_all_cells,
        wait_idle,
        watch_panel,
    )

    if not CHROMIUM.exists():
        raise SystemExit(f"{CHROMIUM} is missing (Debian package chromium); use --no-browser")
    with tempfile.TemporaryDirectory() as tmp:
        home, root, profile = (Path(tmp) / n for n in ("home", "root", "profile"))
        for d in (home, root, profile):
            d.mkdir()
        name = _bench_notebook(root)
        with lab_server(root, home) as server, chromium_page(profile) as page:
            page.add_init_script(_WS_HOOK)
            open_notebook(page, server, name)
            run_all_cells(page)
            errors = cell_errors(page)
            if errors:
                raise SystemExit("the sheet failed in JupyterLab:\n" + "\n".join(errors))
            page.locator(".cp-beam-panel .cp-panel-diagrams svg").first.wait_for()
            watch_panel(page, ".cp-beam-panel", (".cp-panel-diagrams", ".cp-panel-results-box"))
            box = page.locator(".cp-beam-panel .cp-key-beam-spans-2 input")
            edits = []
            for i in range(repeat + 1):  # the first edit warms up and is not counted
                box.fill(f"{SPANS_M[i % len(SPANS_M)]}")
                box.press("Enter")
                edit = panel_edit_timing(page, quiet_ms=400)
                if i:
                    edits.append(edit)
            wait_idle(page)
            # Shift+Enter on the last cell adds a new one below: hold the cell by its index.
            cells = page.locator(".jp-NotebookPanel .jp-Cell")
            last = cells.nth(cells.count() - 1)
            last.scroll_into_view_if_needed()
            last.locator(".jp-InputArea-editor").click()
            page.keyboard.press("Shift+Enter")
            # Run All printed the timings before any edit ("[]"); wait for the new list.
            out = last.locator(".jp-OutputArea-output", has_text=re.compile(r"TIMES \[\["))
            out.wait_for(timeout=30_000)
            kernel = json.loads(out.inner_text().split("CP-KERNEL-TIMES", 1)[1])
            final = (root / INPUTS.name).read_text(encoding="utf-8")
    return {"edits": edits, "kernel": kernel[-repeat:], "file": final}


def _ms(v: float) -> str:
    return f"{v:8.1f} ms"


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    parser.add_argument("--repeat", type=int, default=15, help="edits to time (default 15)")
    parser.add_argument("--no-browser", action="store_true", help="kernel side only")
    parser.add_argument(
        "--source",
        type=Path,
        help="measure the calcpack of this source tree instead (e.g. `git archive` of an "
        "earlier commit), to compare before and after under the same machine load",
    )
    args = parser.parse_args(argv)
    if args.source is not None:
        sys.path.insert(0, str(args.source.resolve()))
    import calcpack

    print(f"calcpack from {Path(calcpack.__file__).parent}")
    k = kernel_side(args.repeat)
    print("Beam panel edit -> updated display (three-span beam, 3 loads, 2 cases)")
    print(f"Kernel side (in this process, no front end), median of {args.repeat}:")
    print(f"  edit -> display ready:                 {_ms(k['display'] * 1e3)}  (target < 100 ms)")
    print(f"  edit -> file written:                  {_ms(k['saved'] * 1e3)}")
    print(f"  whole edit call:                       {_ms(k['edit'] * 1e3)}")
    print(f"  reference: validate + solve + checks:  {_ms(k['solve'] * 1e3)}")
    print(f"  reference: pure Python loop (1e5):     {_ms(k['python'] * 1e3)}")
    print(f"  reference: numpy 200x200 matmul:       {k['numpy'] * 1e3:8.3f} ms")
    print(f"  ratio display / solve:                 {k['display'] / k['solve']:8.2f}")
    print(f"  ratio display / Python loop:           {k['display'] / k['python']:8.2f}")
    print(f"Catalogue panels, kernel side, median of {args.repeat} edits (target < 100 ms):")
    for name, c in catalogue_side(args.repeat).items():
        print(
            f"  {name:14s} edit -> display ready:   {_ms(c['display'] * 1e3)}  "
            f"(whole call {_ms(c['edit'] * 1e3)}, ratio display / Python loop "
            f"{c['display'] / k['python']:.2f})"
        )
        if "search" in c:
            print(
                f"  {name:14s} lightest that passes:  {_ms(c['search'] * 1e3)}  "
                f"({int(c['tried'])} sections tried, "
                f"{c['search'] / max(c['tried'], 1) * 1e3:.1f} ms each)"
            )
    if args.no_browser:
        return 0
    b = browser_side(args.repeat)
    e = b["edits"]
    med = statistics.median
    total = med(x["last_change"] - x["key"] for x in e)
    first_change = med(x["first_change"] - x["key"] for x in e)
    print(f"End to end in JupyterLab (chromium), median of {len(e)} edits of span 2:")
    print(f"  Enter -> panel display updated:        {_ms(total)}  (target < 100 ms)")
    print(f"  Enter -> first display change:         {_ms(first_change)}")
    print(f"  ratio end to end / solve:              {total / (k['solve'] * 1e3):8.2f}")
    print(f"  ratio end to end / Python loop:        {total / (k['python'] * 1e3):8.2f}")
    # The panel's own wall-clock stamps, aligned with the page's clock (same machine).
    to_kernel, display, saved, to_page = [], [], [], []
    timed = [t for t in b["kernel"] if len(t) == 3]  # an older panel (--source) has none
    for x, (started, display_s, saved_s) in zip(e, timed, strict=False):
        key_s = (x["origin"] + x["key"]) / 1e3
        to_kernel.append((started - key_s) * 1e3)
        display.append(display_s * 1e3)
        saved.append(saved_s * 1e3)
        to_page.append((x["last_change"] - x["key"]) - (started - key_s + display_s) * 1e3)
    frames = med(x["frames"] for x in e)
    kbytes = med(x["bytes"] for x in e) / 1024
    types: dict[str, int] = {}
    for t in e[-1]["types"]:
        types[t] = types.get(t, 0) + 1
    if display:
        print("  where the time goes (medians; page and kernel wall clocks):")
        print(f"    Enter -> kernel starts the edit:     {_ms(med(to_kernel))}")
        print(f"    kernel: validate, solve, redraw:     {_ms(med(display))}  (kernel side)")
        print(f"    kernel done -> last change shown:    {_ms(med(to_page))}")
        print(f"    kernel: file written, after start:   {_ms(med(saved))}")
        print(f"  ratio end to end / kernel side:        {total / med(display):8.2f}")
    print(f"  websocket frames per edit:             {frames:8.0f}  ({kbytes:.1f} KiB)")
    print(f"  frame types of the last edit:          {types}")
    print("  all edits (ms): " + " ".join(f"{x['last_change'] - x['key']:.0f}" for x in e))
    last = e[-1]
    print(
        "  last edit, frames (ms after Enter, type, bytes): "
        + ", ".join(f"{t:.0f} {ty} {n}" for t, ty, n in last["timeline"])
    )
    verdict = "within" if total < TARGET_S * 1e3 else "OVER"
    print(f"  {verdict} the 100 ms target end to end")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
