"""`calcreport build FOLDER`: every job built on its own and written atomically, several at a time
with -j; the worst exit code wins; failures listed in a summary (common practice for batch tools,
no source)."""

from __future__ import annotations

import io
import shutil
from pathlib import Path

import pytest

from calcreport.commands.batch import Task, build_one, expand_jobs, run_jobs
from tests.conftest import ROOT

JOBS = sorted((ROOT / "jobs").glob("*.toml"))
NG_JOB = ROOT / "tests" / "data" / "report-mixed.toml"


@pytest.fixture
def folder(tmp_path):
    src = tmp_path / "jobs"
    src.mkdir()
    for p in JOBS[:2]:
        shutil.copy(p, src / p.name)
    (src / "b-broken.toml").write_text('[job]\nproject = "Broken"\n[[member]]\nid = 3\n', encoding="utf-8")
    (src / "notes.txt").write_text("not a job", encoding="utf-8")
    return src


def _files(p: Path) -> list[str]:
    return sorted(x.name for x in p.iterdir())


@pytest.mark.parametrize("workers", ["1", "2"])
def test_bad_job_among_good_ones(folder, tmp_path, cli, workers):
    out = tmp_path / "out"
    code, stdout, err = cli("build", str(folder), "-o", str(out), "-j", workers)
    assert code == 2
    good = [p.stem + ".pdf" for p in JOBS[:2]]
    assert _files(out) == sorted(good)  # the good ones are written; nothing from the bad one, no temp files
    assert [ln.split()[1] for ln in stdout.splitlines()] == [str(out / g) for g in sorted(good)]
    lines = err.strip().splitlines()
    assert lines[0] == "calcreport build: 1 of 3 jobs not built:"
    assert len(lines) == 2 and "b-broken.toml" in lines[1] and "Traceback" not in err


def test_one_and_two_processes_give_byte_identical_reports(tmp_path, cli):
    src = tmp_path / "jobs"
    src.mkdir()
    for p in JOBS:
        shutil.copy(p, src / p.name)
    a, b = tmp_path / "a", tmp_path / "b"
    assert cli("build", str(src), "-o", str(a), "-j", "1")[0] == 0
    assert cli("build", str(src), "-o", str(b), "-j", "2")[0] == 0
    assert _files(a) == _files(b) == sorted(p.stem + ".pdf" for p in JOBS)
    for name in _files(a):
        assert (a / name).read_bytes() == (b / name).read_bytes(), name


def test_worst_exit_code_wins_and_json_beside_each(tmp_path, cli):
    src = tmp_path / "jobs"
    src.mkdir()
    shutil.copy(JOBS[0], src / JOBS[0].name)
    shutil.copy(NG_JOB, src / NG_JOB.name)
    code, stdout, err = cli("build", str(src), "-o", str(tmp_path / "o"), "--json", "-j", "2")
    assert code == 1, err
    assert _files(tmp_path / "o") == sorted(
        [JOBS[0].stem + ".pdf", JOBS[0].stem + ".json", NG_JOB.stem + ".pdf", NG_JOB.stem + ".json"]
    )
    assert "[NG]" in stdout and "[OK]" in stdout and err == ""


def test_folder_expands_to_sorted_toml_files(folder):
    assert [Path(j).name for j in expand_jobs([str(folder)])] == sorted(
        [p.name for p in JOBS[:2]] + ["b-broken.toml"]
    )
    empty = folder.parent / "empty"
    empty.mkdir()
    with pytest.raises(ValueError, match="no \\*.toml"):
        expand_jobs([str(empty)])


def test_single_folder_job_goes_into_the_output_folder(tmp_path, cli):
    src = tmp_path / "one"
    src.mkdir()
    shutil.copy(JOBS[0], src / JOBS[0].name)
    code, _, err = cli("build", str(src), "-o", str(tmp_path / "dest"))
    assert code == 0, err
    assert _files(tmp_path / "dest") == [JOBS[0].stem + ".pdf"]


def test_bad_worker_count_is_a_usage_error(cli, folder):
    code, _, err = cli("build", str(folder), "-j", "0")
    assert code == 2 and "number of processes" in err


def test_unexpected_failure_is_one_line_and_writes_nothing(tmp_path, monkeypatch):
    from calcreport.outputs.report import member_story as member_story_mod

    def boom(*a, **k):
        raise RuntimeError("drawing failed")

    monkeypatch.setattr(member_story_mod, "section_drawing", boom)  # the member section draws it
    out = tmp_path / "x.pdf"
    o = build_one(Task(str(JOBS[0]), out))
    assert o.code == 2 and "internal error" in o.line and "\n" not in o.line
    assert list(tmp_path.iterdir()) == []


def test_progress_line_only_on_a_terminal(tmp_path):
    class Tty(io.StringIO):
        def isatty(self):
            return True

    tasks = [Task(f"job{i}.toml", tmp_path / f"job{i}.pdf") for i in range(3)]
    from calcreport.commands.batch import Outcome

    def work(t):
        return Outcome(t.job, 0, f"wrote {t.out}")

    tty, pipe = Tty(), io.StringIO()
    assert [o.job for o in run_jobs(tasks, 1, tty, work)] == [t.job for t in tasks]
    run_jobs(tasks, 1, pipe, work)
    shown = tty.getvalue()
    assert "\r[0/3] building job0.toml…" in shown and "[2/3] building job2.toml…" in shown
    assert shown.endswith("\r") and pipe.getvalue() == ""
