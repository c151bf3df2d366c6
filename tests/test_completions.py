"""The development-time shell-completion generator covers every command of the parser."""

from __future__ import annotations

import shutil
import subprocess
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT / "tools"))

import completions  # noqa: E402

from calcreport.cli import main  # noqa: E402, F401  (the parser the generator reads)


def test_every_command_and_option_is_completed():
    text = completions.bash()
    for cmd in ("check", "new", "build", "diff", "verify", "schema"):
        assert f"        {cmd}) opts=" in text
    assert "--since" in text and "--quiet" in text and "--results" in text
    assert completions.zsh().startswith("#compdef calcreport\n")


@pytest.mark.skipif(shutil.which("bash") is None, reason="bash not installed")
def test_bash_completes_a_command_name(tmp_path):
    script = tmp_path / "c.bash"
    script.write_text(completions.bash())
    probe = (
        f'source {script}; COMP_WORDS=(calcreport ver); COMP_CWORD=1; _calcreport; echo "${{COMPREPLY[@]}}"'
    )
    r = subprocess.run(["bash", "-c", probe], capture_output=True, text=True, check=True)
    assert r.stdout.split() == ["verify"]
