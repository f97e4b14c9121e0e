"""The ``calcpack`` command line: thin wrappers that parse, call the library, and turn a
CalcpackError into one line on stderr and a non-zero exit code.

Each command lives in its own module exposing ``register(subparsers)``; the modules are listed in
``COMMAND_MODULES``.
"""

from __future__ import annotations

import argparse
import importlib
import sys
from collections.abc import Sequence

from calcpack.errors import CalcpackError

COMMAND_MODULES: tuple[str, ...] = (
    "build",
    "demo",
    "new",
    "add_sheet",
    "keys",
    "sign",
    "verify",
    "renew",
    "review",
    "diff",
)


def build_parser() -> argparse.ArgumentParser:
    """The argument parser with every command registered."""
    from calcpack import __version__

    parser = argparse.ArgumentParser(
        prog="calcpack",
        description="Build, sign and verify structural calculation packages.",
    )
    parser.add_argument("--version", action="version", version=f"calcpack {__version__}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND")
    for name in COMMAND_MODULES:
        importlib.import_module(f"calcpack.cli.{name}").register(sub)
    return parser


def main(argv: Sequence[str] | None = None) -> int:
    """Run the command line; returns the process exit code."""
    from calcpack.package.execute import skip_unused_slow_imports

    skip_unused_slow_imports()  # this process is the command's own
    from calcpack.package.cache import one_line_warnings

    one_line_warnings()
    parser = build_parser()
    args = parser.parse_args(argv)
    if not getattr(args, "func", None):
        parser.print_help()
        return 2
    try:
        return int(args.func(args) or 0)
    except CalcpackError as exc:
        print(f"calcpack: error: {exc}", file=sys.stderr)
        return 1
    except KeyboardInterrupt:
        print("calcpack: interrupted; nothing was written", file=sys.stderr)
        return 130


if __name__ == "__main__":
    raise SystemExit(main())
