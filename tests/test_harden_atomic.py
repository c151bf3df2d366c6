"""Atomic outputs as a set, clean kills (issue 13, item 5): ``build --json`` moves the PDF and the
JSON into place only when both are complete (a full disk leaves the old pair untouched and says
so); SIGTERM and SIGINT remove temporary files; a later build removes the temporary files of ours
that a SIGKILL left — and nothing that only looks like them."""

from __future__ import annotations

import errno
import os
import signal
import socket
import subprocess
import sys
import textwrap
from pathlib import Path

import pytest

from calcreport import safewrite
from calcreport.safewrite import TEMP_PATTERN, remove_stale_temps, temp_name, write_set
from tests.conftest import ROOT, job_text
from tests.test_bad_input import GOOD


def _temps(folder: Path) -> list[str]:
    return sorted(p.name for p in folder.iterdir() if p.name.endswith(".tmp"))


def test_full_disk_leaves_the_old_pdf_and_json_pair_untouched(tmp_path, cli, monkeypatch):
    job = tmp_path / "job.toml"
    job.write_text(job_text(GOOD), encoding="utf-8")
    out = tmp_path / "out"
    out.mkdir()
    (out / "job.pdf").write_bytes(b"old pdf")
    (out / "job.json").write_bytes(b"old json")
    real = safewrite._write_fd
    calls = []

    def disk_fills_on_the_second_file(fd, data):
        calls.append(1)
        if len(calls) == 2:
            raise OSError(errno.ENOSPC, os.strerror(errno.ENOSPC))
        real(fd, data)

    monkeypatch.setattr(safewrite, "_write_fd", disk_fills_on_the_second_file)
    code, stdout, err = cli("build", str(job), "-o", str(out) + "/", "--json", "-j", "1")
    assert code == 2 and stdout == ""
    lines = err.strip().splitlines()
    assert len(lines) == 1 and "No space left on device" in lines[0], err
    assert "job.pdf and job.json left as they were" in lines[0]
    assert (out / "job.pdf").read_bytes() == b"old pdf" and (out / "job.json").read_bytes() == b"old json"
    assert _temps(out) == []


def test_write_set_moves_all_files_or_none(tmp_path, monkeypatch):
    a, b = tmp_path / "a.pdf", tmp_path / "sub" / "a.json"
    write_set([(a, b"1"), (b, b"2")])
    assert a.read_bytes() == b"1" and b.read_bytes() == b"2"
    monkeypatch.setattr(os, "replace", lambda *x: (_ for _ in ()).throw(OSError(errno.EIO, "I/O error")))
    with pytest.raises(OSError):
        write_set([(a, b"3"), (b, b"4")])
    assert a.read_bytes() == b"1" and _temps(tmp_path) == [] and _temps(tmp_path / "sub") == []


# A child that builds with every write held open half-way, so the signal surely lands mid-write.
_HELD_BUILD = textwrap.dedent(
    """
    import sys, time
    from calcreport import safewrite
    real = safewrite._write_fd
    def slow(fd, data):
        real(fd, data[: len(data) // 2])
        sys.stdout.write("writing\\n")  # one write: two workers' lines never interleave in the pipe
        sys.stdout.flush()
        time.sleep(60)
    safewrite._write_fd = slow
    from calcreport.cli import main
    sys.exit(main(sys.argv[1:]))
    """
)


def _held_build(folder: Path, out: Path, workers: str) -> subprocess.Popen:
    return subprocess.Popen(
        [sys.executable, "-c", _HELD_BUILD, "build", str(folder), "-o", str(out), "-j", workers, "--json"],
        cwd=ROOT,
        stdout=subprocess.PIPE,
        stderr=subprocess.PIPE,
        text=True,
        env=dict(os.environ, PYTHONPATH=str(ROOT)),
    )


@pytest.fixture
def two_jobs(tmp_path) -> Path:
    folder = tmp_path / "jobs"
    folder.mkdir()
    for n in ("a", "b"):
        (folder / f"{n}.toml").write_text(job_text(GOOD), encoding="utf-8")
    return folder


@pytest.mark.parametrize("sig, workers", [(signal.SIGTERM, "1"), (signal.SIGINT, "1"), (signal.SIGTERM, "2")])
def test_no_temporary_file_survives_sigterm_or_sigint(two_jobs, tmp_path, sig, workers):
    out = tmp_path / "out"
    proc = _held_build(two_jobs, out, workers)
    try:
        assert proc.stdout.readline().strip() == "writing"
        assert _temps(out)  # a temporary file really is there, half-written
        proc.send_signal(sig)
        _, err = proc.communicate(timeout=30)
    finally:
        proc.kill()
    assert proc.returncode == 2, err
    assert _temps(out) == [] and not (out / "a.pdf").exists()
    assert len(err.strip().splitlines()) == 1 and ("terminated" in err or "interrupted" in err), err


def test_a_later_build_removes_what_a_sigkill_left(two_jobs, tmp_path, cli):
    out = tmp_path / "out"
    proc = _held_build(two_jobs, out, "1")
    try:
        assert proc.stdout.readline().strip() == "writing"
        proc.kill()
        proc.wait(timeout=30)
    finally:
        proc.kill()
    left = _temps(out)
    assert left and all(TEMP_PATTERN.match(n) for n in left)
    lookalikes = [".a.pdf.x1y2z3.tmp", ".a.pdf.calcreport-zz-1-00000000.tmp", "a.pdf.calcreport.tmp"]
    for n in lookalikes:
        (out / n).write_bytes(b"not ours")
    alive = temp_name(out / "a.pdf")  # this very process is alive: its file is kept
    alive.write_bytes(b"in progress")
    code, stdout, err = cli("build", str(two_jobs), "-o", str(out), "-j", "1")
    assert code == 0, err
    assert _temps(out) == sorted(lookalikes + [alive.name])
    assert (out / "a.pdf").read_bytes().startswith(b"%PDF")


def test_stale_rules(tmp_path):
    dead = subprocess.Popen([sys.executable, "-c", "pass"])
    dead.wait()
    host = safewrite._host()
    assert len(host) == 8 and host == safewrite._host() and socket.gethostname()
    mine_dead = tmp_path / f".r.pdf.calcreport-{host}-{dead.pid}-0123abcd.tmp"
    other_host = (
        tmp_path / f".r.pdf.calcreport-{'0' * 8 if host != '0' * 8 else '1' * 8}-{dead.pid}-0123abcd.tmp"
    )
    old_other_host = tmp_path / f".s.pdf.calcreport-{'0' * 8 if host != '0' * 8 else '1' * 8}-1-0123abcd.tmp"
    for p in (mine_dead, other_host, old_other_host):
        p.write_bytes(b"x")
    os.utime(old_other_host, (0, 0))  # 1970: older than a day
    os.mkdir(tmp_path / f".d.pdf.calcreport-{host}-{dead.pid}-0123abcd.tmp")  # not a regular file
    assert sorted(remove_stale_temps(tmp_path)) == sorted([mine_dead.name, old_other_host.name])
    assert other_host.exists()
