"""Read the two revisions a review compares: job files on disk, or an older revision from git.

Every job is fully validated and solved through :mod:`calcreport.pipeline`; problems raise
:class:`calcreport.errors.JobError` so the command line prints one line and exits 2.
"""

from __future__ import annotations

import hashlib
import os
import subprocess
import tomllib
from dataclasses import dataclass

from ..errors import JobError, excerpt
from ..jobfile import load_text
from ..jobfile.load import MAX_FILE_BYTES
from ..pipeline import STDIN, label_for, read_bytes, solve
from ..solve.results import JobResult
from .diff import Side, changed_keys, compute_diff

__all__ = [
    "side_from_file",
    "side_from_bytes",
    "side_from_git",
    "git_show",
    "RevisionMarks",
    "revision_marks",
    "revision_marks_since",
]

GIT_TIMEOUT_S = 30


def side_from_bytes(data: bytes, label: str) -> Side:
    """Validate, solve and keep the raw TOML of job-file bytes; ``label`` names it in messages."""
    job = load_text(data, label)
    doc = tomllib.loads(data.decode("utf-8"))  # cannot fail: load_text has read it already
    return Side(label, job, solve(job), doc)


def side_from_file(path: str) -> Side:
    """A revision read from a job file on disk (``-``: standard input)."""
    return side_from_bytes(read_bytes(path), label_for(path))


def _git(args: list[str], cwd: str, path: str) -> bytes:
    try:
        done = subprocess.run(
            ["git", *args], cwd=cwd, capture_output=True, timeout=GIT_TIMEOUT_S, check=False
        )
    except FileNotFoundError:
        raise JobError(path, "", "git is not installed or not on PATH (needed for --since)") from None
    except subprocess.TimeoutExpired:
        raise JobError(path, "", f"git did not answer within {GIT_TIMEOUT_S} s") from None
    if done.returncode != 0:
        msg = done.stderr.decode("utf-8", "replace").strip().splitlines()
        raise _GitError(msg[0] if msg else f"git {args[0]} failed")
    return done.stdout


class _GitError(Exception):
    pass


def git_show(path: str, rev: str) -> tuple[bytes, str]:
    """The bytes of ``path`` as committed at ``rev``, and the label ``REV:repo/relative/path``.

    Raises:
        JobError: not inside a git repository, or the revision or the path does not exist there.
    """
    if path == STDIN:
        raise JobError(
            label_for(path), "", "--since needs a job file in a git repository, not standard input"
        )
    if not rev or rev.startswith("-"):
        raise JobError(path, "", f"expected a git revision after --since, got {excerpt(rev)}")
    real = os.path.realpath(path)
    if not os.path.isfile(real):
        raise JobError(path, "", "cannot read the file (No such file or directory)")
    folder = os.path.dirname(real)
    try:
        top = _git(["rev-parse", "--show-toplevel"], folder, path).decode("utf-8").strip()
    except _GitError as exc:
        if "dubious ownership" in str(exc):  # git ≥ 2.35.2 refuses repositories of other users
            said = str(exc)
            repo = (
                said.split("repository at '", 1)[1].rsplit("'", 1)[0] if "repository at '" in said else folder
            )
            raise JobError(
                path,
                "",
                'git refuses to read the repository here: it belongs to another user ("dubious ownership"); '
                f"if you trust it, run: git config --global --add safe.directory {excerpt(repo, 200)}",
            ) from None
        raise JobError(path, "", "not inside a git repository (needed for --since)") from None
    rel = os.path.relpath(real, os.path.realpath(top)).replace(os.sep, "/")
    try:
        _git(["rev-parse", "--verify", "--quiet", f"{rev}^{{commit}}"], top, path)
    except _GitError:
        raise JobError(path, "", f"git revision {excerpt(rev)} not found in {top}") from None
    try:
        data = _git(["show", f"{rev}:{rel}"], top, path)
    except _GitError:
        raise JobError(path, "", f"{rel} does not exist at git revision {excerpt(rev)}") from None
    if len(data) > MAX_FILE_BYTES:
        raise JobError(
            f"{rev}:{rel}", "", f"file is {len(data):,} bytes; a job file may have at most {MAX_FILE_BYTES:,}"
        )
    return data, f"{rev}:{rel}"


def side_from_git(path: str, rev: str) -> Side:
    """The revision of job file ``path`` committed at git revision ``rev``."""
    data, label = git_show(path, rev)
    return side_from_bytes(data, label)


@dataclass(frozen=True)
class RevisionMarks:
    """What the build report marks: keys that changed and the letter drawn in the triangle."""

    changed_keys: frozenset[str]
    mark: str


def revision_marks(old: Side, new: Side) -> RevisionMarks:
    """Changed keys from ``old`` to ``new`` (see :func:`.diff.changed_keys`); mark = new revision."""
    return RevisionMarks(changed_keys(compute_diff(old, new)), new.job.header.revision)


def revision_marks_since(job_path: str, rev: str, new_result: JobResult | None = None) -> RevisionMarks:
    """Revision marks for ``build --since REV``: the job file now against its version at git ``rev``.

    ``new_result`` is the already solved job (saves solving it twice); it must come from the
    same bytes as the file, which is checked by hash.
    """
    if new_result is None:
        new = side_from_file(job_path)
    else:
        data = read_bytes(job_path)
        if hashlib.sha256(data).hexdigest() != new_result.job.sha256:
            raise JobError(job_path, "", "the file changed while the report was being built; run again")
        new = Side(job_path, new_result.job, new_result, tomllib.loads(data.decode("utf-8")))
    return revision_marks(side_from_git(job_path, rev), new)
