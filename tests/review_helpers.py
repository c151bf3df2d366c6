"""Shared helpers for the review-workflow tests: the demo job, edited copies, running the CLI."""

from __future__ import annotations

import subprocess
from pathlib import Path

from calcreport.cli import main

ROOT = Path(__file__).resolve().parent.parent
# a fixed copy of the first demo job (invented data), so demo edits do not move these tests
DEMO = ROOT / "tests" / "data" / "review-box-header.toml"

#: a part added on top of the west web (touches it, overlaps nothing)
CAP_PART = """
[[member.part]]
id = "cap"
shape = "rect"
width = "15/32 in"
depth = "1 in"
material = "ply"
on = "web_w"
"""


def demo_text() -> str:
    return DEMO.read_text(encoding="utf-8")


def edited(text: str, *pairs: tuple[str, str]) -> str:
    """``text`` with each (old, new) replaced exactly once; fails loudly if ``old`` is missing."""
    for old, new in pairs:
        assert text.count(old) >= 1, f"edit target not found: {old!r}"
        text = text.replace(old, new, 1)
    return text


def with_part(text: str, part: str = CAP_PART) -> str:
    """Insert a [[member.part]] block before the first joint."""
    marker = "[[member.joint]]"
    i = text.index(marker)
    return text[:i] + part.lstrip("\n") + "\n" + text[i:]


def without_bottom_joint(text: str) -> str:
    """The demo job with its second joint (bot-webs) removed."""
    i = text.index('[[member.joint]]\nid = "bot-webs"')
    return text[:i].rstrip() + "\n"


def write(path: Path, text: str) -> str:
    path.write_text(text, encoding="utf-8")
    return str(path)


def run(argv: list[str], capsys) -> tuple[int, str, str]:
    code = main(argv)
    out = capsys.readouterr()
    return code, out.out, out.err


def git(cwd: Path, *args: str) -> str:
    done = subprocess.run(
        ["git", *args],
        cwd=cwd,
        capture_output=True,
        text=True,
        check=True,
        env={
            "GIT_AUTHOR_NAME": "t",
            "GIT_AUTHOR_EMAIL": "t@example.invalid",
            "GIT_COMMITTER_NAME": "t",
            "GIT_COMMITTER_EMAIL": "t@example.invalid",
            "PATH": __import__("os").environ.get("PATH", ""),
            "HOME": str(cwd),
        },
    )
    return done.stdout
