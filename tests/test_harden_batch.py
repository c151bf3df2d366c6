"""Batch resilience (issue 13, item 4): a worker that dies fails only the job it held, the other
jobs finish; ``--timeout`` stops a stuck job with one line. Each job runs in its own child
process (calcreport/commands/isolated.py)."""

from __future__ import annotations

import os
import shutil
import signal
import time

import pytest

from calcreport.commands.batch import Outcome, Task, build_one, run_jobs
from tests.conftest import ROOT, job_text
from tests.test_bad_input import GOOD


def _dies_on_c(task: Task) -> Outcome:
    """Stands in for a job killed by the kernel's out-of-memory killer or by an operator."""
    if task.job == "c":
        os.kill(os.getpid(), signal.SIGKILL)
    time.sleep(0.05)
    return Outcome(task.job, 0, f"wrote {task.job}")


def _hangs_on_b(task: Task) -> Outcome:
    if task.job == "b":
        time.sleep(120)
    return Outcome(task.job, 0, f"wrote {task.job}")


def _tasks(names: str) -> list[Task]:
    return [Task(n, ROOT / "unused" / f"{n}.pdf") for n in names]


@pytest.mark.parametrize("workers", [1, 2])
def test_a_killed_worker_fails_only_its_job(workers):
    if workers == 1:  # one worker runs in-process unless isolated by a time limit
        out = run_jobs(_tasks("abcdef"), 1, work=_dies_on_c, timeout=60)
    else:
        out = run_jobs(_tasks("abcdef"), workers, work=_dies_on_c)
    assert [o.code for o in out] == [0, 0, 2, 0, 0, 0]
    assert [o.line for o in out if o.code == 0] == [f"wrote {n}" for n in "abdef"]
    assert out[2].line == "c: the build process died (killed by SIGKILL); no report written"


def test_a_stuck_job_is_stopped_by_the_time_limit():
    t = time.monotonic()
    out = run_jobs(_tasks("abc"), 2, work=_hangs_on_b, timeout=1.0)
    assert time.monotonic() - t < 60  # not the 120 s the job wanted (a stall guard, not a target)
    assert [o.code for o in out] == [0, 2, 0]
    assert out[1].line == "b: stopped after the time limit of 1 s (--timeout); no report written"


def _real_but_killed(task: Task) -> Outcome:
    if task.job.endswith("killed.toml"):
        os.kill(os.getpid(), signal.SIGKILL)
    return build_one(task)


def test_real_builds_around_a_killed_one(tmp_path):
    src = tmp_path / "jobs"
    src.mkdir()
    for name in ("a.toml", "killed.toml", "z.toml"):
        (src / name).write_text(job_text(GOOD), encoding="utf-8")
    out = tmp_path / "out"
    tasks = [Task(str(src / n), out / f"{n[:-5]}.pdf") for n in ("a.toml", "killed.toml", "z.toml")]
    got = run_jobs(tasks, 2, work=_real_but_killed)
    assert [o.code for o in got] == [0, 2, 0]
    assert sorted(p.name for p in out.iterdir()) == ["a.pdf", "z.pdf"]  # no temporary file either


def test_timeout_option_on_the_command_line(tmp_path, cli):
    job = tmp_path / "job.toml"
    job.write_text(job_text(GOOD), encoding="utf-8")
    code, out, err = cli("build", str(job), "-o", str(tmp_path / "o") + "/", "--timeout", "600")
    assert code == 0 and out.startswith("wrote "), err
    for bad in ("0", "-1", "nan", "inf", "soon", "1e9"):
        code, out, err = cli("build", str(job), "--timeout", bad)
        assert code == 2 and len(err.strip().splitlines()) == 1 and "--timeout" in err, (bad, err)


def test_timeout_stops_a_real_build_with_one_line(tmp_path, cli):
    src = ROOT / "jobs" / "pavilion-ridge-box-beam.toml"
    job = tmp_path / src.name
    shutil.copy(src, job)
    code, out, err = cli("build", str(job), "-o", str(tmp_path / "o") + "/", "--timeout", "0.1")
    assert code == 2, (out, err)
    lines = err.strip().splitlines()
    assert len(lines) == 1 and "time limit of 0.1 s" in lines[0], err
    assert not (tmp_path / "o").exists() or list((tmp_path / "o").iterdir()) == []
