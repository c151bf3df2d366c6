"""Counts and small items (issue 13, items 9 and 10): caps on the lists that drive page count
(notes, assumptions, revision history, loads) with one-line refusals; point-load labels drawn in
the report; git's "dubious ownership" refusal reported as such with the safe.directory hint.
The caps are ours (common practice, no source); the report of a job at the caps is timed by
``benchmarks/report_at_caps.py``."""

from __future__ import annotations

import io
import os
import subprocess

import pypdf
import pytest

from calcreport.jobfile.load import MAX_HISTORY
from calcreport.jobfile.loads import MAX_LOADS
from calcreport.jobfile.reader import MAX_LINES
from calcreport.review import revisions as review_io
from tests.conftest import job_text
from tests.test_bad_input import GOOD
from tests.test_limits import LOADED

POINT = '\n[[member.load]]\ncase = "D"\nkind = "point"\nP = "400 lbf"\nat = "7 ft"\nlabel = "{label}"\n'


def _refused(cli, path, *words):
    code, out, err = cli("check", path)
    assert code == 2 and "Traceback" not in err, err
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    for w in words:
        assert w in lines[0], (w, lines[0])


def _lines(n: int) -> str:
    return "[" + ", ".join(f'"line {i}"' for i in range(n)) + "]"


@pytest.mark.parametrize("where", ["job", "member"])
@pytest.mark.parametrize("key", ["notes", "assumptions"])
def test_text_lists_capped(write_job, cli, where, key):
    if where == "job" and key == "assumptions":
        pytest.skip("assumptions belong to a member")
    at_cap = _lines(MAX_LINES)
    over = _lines(MAX_LINES + 1)
    for value, ok in ((at_cap, True), (over, False)):
        if where == "job":
            text = job_text(GOOD).replace("[job]\n", f"[job]\n{key} = {value}\n", 1)
        else:
            text = job_text(GOOD.replace('id = "M"', f'id = "M"\n{key} = {value}', 1))
        path = write_job(text)
        if ok:
            assert cli("check", path)[0] == 0
        else:
            _refused(cli, path, f"{key}", f"at most {MAX_LINES} lines", f"{MAX_LINES + 1}")


def test_history_capped(write_job, cli):
    entry = '\n[[job.history]]\nmark = "{i}"\ndate = "2026-01-01"\ndescription = "issued"\n'
    head = job_text(GOOD).split("[settings]")[0]
    rest = "[settings]" + job_text(GOOD).split("[settings]", 1)[1]
    ok = head + "".join(entry.format(i=i) for i in range(MAX_HISTORY)) + "\n" + rest
    assert cli("check", write_job(ok))[0] == 0
    over = head + "".join(entry.format(i=i) for i in range(MAX_HISTORY + 1)) + "\n" + rest
    _refused(cli, write_job(over), "job.history", f"at most {MAX_HISTORY} revision history entries")


def test_loads_capped(write_job, cli):
    text = job_text(LOADED) + "".join(POINT.format(label=f"p{i}") for i in range(MAX_LOADS))
    _refused(cli, write_job(text), "load", f"{MAX_LOADS}")


def test_point_load_labels_appear_in_the_report(write_job, cli, tmp_path):
    text = job_text(LOADED) + POINT.format(label="forklift axle")
    out = tmp_path / "r.pdf"
    code, _, err = cli("build", write_job(text), "-o", str(out))
    assert code == 0, err
    pages = "".join(p.extract_text() for p in pypdf.PdfReader(io.BytesIO(out.read_bytes())).pages)
    assert "forklift axle" in pages


def test_dubious_ownership_is_named_with_the_safe_directory_hint(tmp_path, monkeypatch, cli):
    job = tmp_path / "job.toml"
    job.write_text(job_text(GOOD), encoding="utf-8")

    def refuses(args, cwd, path):
        raise review_io._GitError(f"fatal: detected dubious ownership in repository at '{tmp_path}'")

    monkeypatch.setattr(review_io, "_git", refuses)
    code, out, err = cli("diff", str(job), "--since", "HEAD")
    assert code == 2 and len(err.strip().splitlines()) == 1
    assert "dubious ownership" in err and f"safe.directory '{tmp_path}'" in err
    assert "not inside a git repository" not in err


@pytest.mark.skipif(
    not hasattr(os, "geteuid") or os.geteuid() != 0, reason="needs root to hand a repo to another user"
)
def test_dubious_ownership_from_real_git(tmp_path, monkeypatch, cli):
    repo = tmp_path / "repo"
    repo.mkdir()
    job = repo / "job.toml"
    job.write_text(job_text(GOOD), encoding="utf-8")
    empty = tmp_path / "gitconfig"
    empty.write_text("", encoding="utf-8")
    monkeypatch.setenv("GIT_CONFIG_GLOBAL", str(empty))
    monkeypatch.setenv("GIT_CONFIG_NOSYSTEM", "1")
    git = ["git", "-c", "user.name=t", "-c", "user.email=t@example.invalid"]
    subprocess.run([*git, "init", "-q", str(repo)], check=True)
    subprocess.run([*git, "-C", str(repo), "add", "job.toml"], check=True)
    subprocess.run([*git, "-C", str(repo), "commit", "-qm", "first"], check=True)
    for root, dirs, files in os.walk(repo):
        for name in dirs + files:
            os.lchown(os.path.join(root, name), 54321, 54321)
    os.chown(repo, 54321, 54321)
    code, out, err = cli("build", str(job), "--since", "HEAD", "-o", str(tmp_path / "o") + "/")
    assert code == 2 and "dubious ownership" in err and "safe.directory" in err, err
