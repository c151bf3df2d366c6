"""Fuzzing the review commands (issue 13, item 11): ``diff``, ``verify`` and ``build --since`` get
mutated demo jobs — with hostile mutations on top: long whitespace runs, subnormal and non-finite
magnitudes, long lists — and must answer with exit 0/1, or exit 2 and one line, never a
traceback; every JSON they print is strict. The example counts keep this file within about ten
seconds on two cores (common practice for robustness testing, no source)."""

from __future__ import annotations

import random
import subprocess

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from tests.conftest import run_cli
from tests.test_fuzz import DEMOS, mutate, strict_json

HOSTILE = (
    lambda r: " " * r.choice([800, 4000]) + "x",
    lambda r: '"' + " " * r.choice([500, 3000]) + '"',
    lambda r: '"5e-324 in"',
    lambda r: '"1e-310 kip"',
    lambda r: '"nan in"',
    lambda r: "-inf",
    lambda r: "nan",
    lambda r: "5e-324",
    lambda r: "[" + ", ".join(['"x"'] * r.choice([49, 51, 400])) + "]",
)


def hostile(text: str, rng: random.Random, n: int) -> str:
    """``mutate`` from test_fuzz, then ``n`` values replaced by hostile ones (a line's text after
    its ``=``), or a long whitespace run inserted inside a line."""
    lines = mutate(text, rng, max(0, n - 1)).splitlines()
    for _ in range(n):
        i = rng.randrange(len(lines))
        if "=" in lines[i] and rng.random() < 0.8:
            lines[i] = lines[i].split("=", 1)[0] + "= " + rng.choice(HOSTILE)(rng)
        else:
            k = rng.randrange(len(lines[i]) + 1)
            lines[i] = lines[i][:k] + " " * rng.choice([200, 2500]) + lines[i][k:]
    return "\n".join(lines) + "\n"


def _answer(code: int, out: str, err: str, path: str, json_out: bool = False) -> None:
    assert code in (0, 1, 2), (code, err)
    assert "Traceback" not in err and "internal error" not in err, err
    if code == 2:
        lines = err.strip().splitlines()
        assert len(lines) == 1 and path in lines[0], err
    elif json_out:
        strict_json(out)


def fuzz(examples: int):
    return settings(
        max_examples=examples,
        deadline=None,
        suppress_health_check=[HealthCheck.function_scoped_fixture, HealthCheck.too_slow],
    )


CASE = dict(rng_key=st.integers(0, 2**32 - 1), which=st.integers(0, 100), n=st.integers(1, 4))


@fuzz(40)
@given(**CASE)
def test_check_on_hostile_values(tmp_path, rng_key, which, n):
    p = tmp_path / "fuzz.toml"
    p.write_text(hostile(DEMOS[which % len(DEMOS)], random.Random(rng_key), n), encoding="utf-8")
    _answer(*run_cli("check", "--json", str(p)), str(p), json_out=True)


@fuzz(10)
@given(**CASE)
def test_diff_of_a_demo_and_its_hostile_revision(tmp_path, rng_key, which, n):
    demo = DEMOS[which % len(DEMOS)]
    old, new = tmp_path / "old.toml", tmp_path / "new.toml"
    old.write_text(demo, encoding="utf-8")
    new.write_text(hostile(demo, random.Random(rng_key), n), encoding="utf-8")
    _answer(*run_cli("diff", str(old), str(new), "--json"), str(new), json_out=True)


@pytest.fixture(scope="module")
def built(tmp_path_factory):
    """A report of the smallest demo job, built once: (job text, PDF bytes)."""
    base = tmp_path_factory.mktemp("verify")
    demo = min(DEMOS, key=len)
    job = base / "demo.toml"
    job.write_text(demo, encoding="utf-8")
    code, _, err = run_cli("build", str(job), "-o", str(base / "demo.pdf"))
    assert code in (0, 1), err
    return demo, (base / "demo.pdf").read_bytes()


@fuzz(15)
@given(rng_key=st.integers(0, 2**32 - 1), n=st.integers(1, 4), damage=st.integers(0, 3))
def test_verify_against_hostile_jobs_and_damaged_pdfs(tmp_path, built, rng_key, n, damage):
    demo, pdf = built
    rng = random.Random(rng_key)
    job, out = tmp_path / "job.toml", tmp_path / "r.pdf"
    job.write_text(hostile(demo, rng, n) if damage != 1 else demo, encoding="utf-8")
    data = bytearray(pdf)
    if damage >= 2:  # damage the PDF: flip bytes, or cut it short
        for _ in range(rng.randint(1, 40)):
            data[rng.randrange(len(data))] = rng.randrange(256)
        if damage == 3:
            data = data[: rng.randrange(len(data))]
    out.write_bytes(bytes(data))
    code, stdout, err = run_cli("verify", str(out), str(job))
    assert code in (0, 1, 2) and "Traceback" not in err, err
    if code == 2:
        assert len(err.strip().splitlines()) == 1 and (str(out) in err or str(job) in err), err


@pytest.fixture(scope="module")
def repo(tmp_path_factory):
    """A git repository with the smallest demo job committed."""
    base = tmp_path_factory.mktemp("since")
    job = base / "job.toml"
    job.write_text(min(DEMOS, key=len), encoding="utf-8")
    git = ["git", "-c", "user.name=t", "-c", "user.email=t@example.invalid", "-c", "safe.directory=*"]
    try:
        subprocess.run([*git, "init", "-q", str(base)], check=True, capture_output=True)
        subprocess.run([*git, "-C", str(base), "add", "job.toml"], check=True, capture_output=True)
        subprocess.run([*git, "-C", str(base), "commit", "-qm", "first"], check=True, capture_output=True)
    except (OSError, subprocess.CalledProcessError):
        pytest.skip("git not available")
    return base


@fuzz(5)
@given(rng_key=st.integers(0, 2**32 - 1), n=st.integers(1, 3))
def test_build_since_with_a_hostile_working_copy(repo, rng_key, n):
    job = repo / "job.toml"
    committed = subprocess.run(
        ["git", "-C", str(repo), "show", "HEAD:job.toml"], capture_output=True, text=True
    )
    job.write_text(hostile(committed.stdout, random.Random(rng_key), n), encoding="utf-8")
    out = repo / "out"
    code, stdout, err = run_cli("build", str(job), "--since", "HEAD", "-o", str(out) + "/")
    _answer(code, stdout, err, str(job))
    written = sorted(p.name for p in out.iterdir()) if out.exists() else []
    assert all(not n.endswith(".tmp") for n in written)
    if code == 2:
        assert "job.pdf" not in written or stdout == ""
    for p in written:
        (out / p).unlink()
