"""The README's quick start is exactly two commands, and CI runs the README's test command."""

from __future__ import annotations

import re
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]


def _quick_start_commands() -> list[str]:
    text = (ROOT / "README.md").read_text(encoding="utf-8")
    section = text.split("## Quick start", 1)[1].split("\n## ", 1)[0]
    return [b.strip() for b in re.findall(r"```bash\n(.*?)```", section, flags=re.S)]


def test_quick_start_has_two_commands():
    commands = _quick_start_commands()
    assert len(commands) == 2
    assert all("\n" not in c for c in commands)
    assert commands[0].endswith("calcpack demo")
    assert "pytest" in commands[1]


def test_ci_runs_the_readme_test_command():
    test_command = _quick_start_commands()[1].split("&& ", 2)[-1]
    assert test_command == "pip install -e '.[test]' && pytest"
    ci = (ROOT / ".ci" / "run").read_text(encoding="utf-8")
    assert test_command in ci.splitlines()
