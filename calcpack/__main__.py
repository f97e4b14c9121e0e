"""``python -m calcpack``: the same command line as ``calcpack``."""

from calcpack.cli import main

raise SystemExit(main())
