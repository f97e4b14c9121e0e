"""Test-suite settings shared by every folder.

Hypothesis explores new random examples on each local run; CI sets ``HYPOTHESIS_PROFILE=ci`` so
its examples are the same on every run (a failure found locally is kept in the local example
database and replayed).
"""

from __future__ import annotations

import os

from hypothesis import settings

settings.register_profile("ci", derandomize=True, print_blob=True)
settings.load_profile(os.environ.get("HYPOTHESIS_PROFILE", "default"))
