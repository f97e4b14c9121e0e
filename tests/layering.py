"""What each layer of calcpack may import: one list, read by the static layering test and by
the light-import tests (which check the same modules stay unloaded at run time)."""

from __future__ import annotations

#: Computation and the working: results are data, and they never reach rendering, the build,
#: signing, the command line or Jupyter -- not even inside a function.
COMPUTATION = (
    "calcpack.errors", "calcpack.validate", "calcpack.units", "calcpack.contract",
    "calcpack.views", "calcpack.refdata", "calcpack.fileio", "calcpack.loads",
    "calcpack.analysis", "calcpack.sections", "calcpack.combinations", "calcpack.checks",
    "calcpack.foundations", "calcpack.inputs", "calcpack.working",
)  # fmt: skip

#: What computation must never import (calcpack layers above it and the libraries they use).
FORBIDDEN = (
    "calcpack.plots", "calcpack.widgets", "calcpack.package", "calcpack.signing",
    "calcpack.cli", "calcpack.notebook", "matplotlib", "IPython", "ipywidgets", "ipykernel",
    "jupyter_client", "nbconvert", "nbclient", "nbformat", "weasyprint", "pyhanko", "pypdf",
    "ziamath",
)  # fmt: skip

#: The bottom of the house: these import only the standard library and what is listed.
BOTTOM = {
    "calcpack.errors": (),
    "calcpack.contract": ("calcpack.errors", "calcpack.contract"),
    "calcpack.views": ("calcpack.errors",),
}

#: The layers above computation, each with what it must never import: the dependency runs one
#: way (signing below the build, which reads the review log and refuses to replace a signed
#: package; the command line at the top, wiring the build's reproducer into verification).
ABOVE = {
    "calcpack.plots": ("calcpack.package", "calcpack.signing", "calcpack.widgets", "calcpack.cli"),
    "calcpack.signing": (
        "calcpack.package",
        "calcpack.widgets",
        "calcpack.cli",
        "calcpack.notebook",
    ),
    "calcpack.package": ("calcpack.widgets", "calcpack.cli", "calcpack.notebook"),
    "calcpack.widgets": ("calcpack.cli",),
}

#: Modules whose loading costs a sheet's import time (checked at run time by the light tests).
HEAVY = (*(m for m in FORBIDDEN if m != "calcpack.notebook"), "rich")
