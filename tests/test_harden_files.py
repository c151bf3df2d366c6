"""Special files (issue 13, item 3): job files, templates, logos and PDFs given to ``verify`` must
be regular files, opened without blocking and read with a size cap. A named pipe (FIFO) once
blocked the open forever and ``/dev/zero`` was read until memory ran out; a folder gave an
operating-system message. Now each is one line naming the file, exit 2.

Commands that could hang before the fix run in a child process with a time limit, so a regression
fails instead of stalling the suite.
"""

from __future__ import annotations

import os
import subprocess
import sys

import pytest

from calcreport.safeio import FileRefused, read_regular
from tests.conftest import ROOT, job_text
from tests.test_bad_input import GOOD


def _child(*args: str) -> tuple[int, str, str]:
    done = subprocess.run(
        [sys.executable, "-m", "calcreport", *args],
        cwd=ROOT,
        capture_output=True,
        text=True,
        timeout=30,
        env=dict(os.environ, PYTHONPATH=str(ROOT)),
    )
    return done.returncode, done.stdout, done.stderr


def _one_line(code: int, out: str, err: str, *words: str) -> str:
    assert code == 2 and "Traceback" not in err, (code, err[-400:])
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    for w in words:
        assert w in lines[0], (w, lines[0])
    return lines[0]


@pytest.fixture
def fifo(tmp_path):
    p = tmp_path / "pipe.toml"
    os.mkfifo(p)
    return str(p)


def test_fifo_job_file_check_and_verify(fifo, tmp_path):
    _one_line(*_child("check", fifo), fifo, "named pipe")
    job = tmp_path / "job.toml"
    job.write_text(job_text(GOOD), encoding="utf-8")
    _one_line(*_child("verify", fifo, str(job)), fifo, "named pipe")


def test_dev_zero_as_job_and_as_pdf(tmp_path):
    _one_line(*_child("check", "/dev/zero"), "/dev/zero", "device")
    job = tmp_path / "job.toml"
    job.write_text(job_text(GOOD), encoding="utf-8")
    _one_line(*_child("verify", "/dev/zero", str(job)), "/dev/zero", "device")


def test_folder_as_job_pdf_and_diff_side(tmp_path, cli):
    folder = tmp_path / "looks-like.toml"
    folder.mkdir()
    job = tmp_path / "job.toml"
    job.write_text(job_text(GOOD), encoding="utf-8")
    _one_line(*cli("check", str(folder)), str(folder), "folder")
    _one_line(*cli("verify", str(folder), str(job)), str(folder), "folder")
    _one_line(*cli("diff", str(job), str(folder)), str(folder), "folder")


def test_fifo_template_and_logo(tmp_path, cli):
    os.mkfifo(tmp_path / "firm.toml")
    job = tmp_path / "job.toml"
    job.write_text(job_text(GOOD, settings='template = "firm.toml"\n'), encoding="utf-8")
    _one_line(*cli("build", str(job), "-o", str(tmp_path / "out") + "/"), "settings.template")
    (tmp_path / "firm2.toml").write_text('[firm]\nlogo = "logo.png"\n', encoding="utf-8")
    os.mkfifo(tmp_path / "logo.png")
    job.write_text(job_text(GOOD, settings='template = "firm2.toml"\n'), encoding="utf-8")
    _one_line(*cli("build", str(job), "-o", str(tmp_path / "out") + "/"), "firm.logo")
    assert not (tmp_path / "out").exists() or not any((tmp_path / "out").iterdir())


def test_read_regular_caps_the_size(tmp_path):
    p = tmp_path / "f"
    p.write_bytes(b"x" * 101)
    assert read_regular(p, 101) == b"x" * 101
    with pytest.raises(FileRefused, match="101 bytes; a thing may have at most 100"):
        read_regular(p, 100, "a thing")
    with pytest.raises(FileRefused, match="cannot read"):
        read_regular(tmp_path / "missing", 100)
