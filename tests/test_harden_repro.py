"""Reproducible bytes in every environment (issue 13, item 6): a report's dates and /ID come from
the job's date in UTC, so the same job gives the same PDF under any time zone, locale, working
directory, ``-j`` and SOURCE_DATE_EPOCH; a malformed SOURCE_DATE_EPOCH is refused with one line.

The job is dated 2026-01-01: Australia/Sydney is then on daylight time (AEDT, UTC+11; NSW
daylight saving runs from the first Sunday of October to the first Sunday of April — common
knowledge, from memory), America/New_York on standard time (UTC−5), Asia/Kathmandu at UTC+5:45 (all from memory).
"""

from __future__ import annotations

import calendar
import os
import subprocess
import sys
from pathlib import Path

import pytest

from calcreport.outputs.report.epoch import DEFAULT_EPOCH, EpochError, job_epoch, source_date_epoch
from tests.conftest import ROOT, job_text
from tests.test_bad_input import GOOD

UNDATED = job_text(GOOD).replace('date = "2026-01-01"\n', "", 1)

# (time zone, locale variables, working directory, -j, SOURCE_DATE_EPOCH or None)
ENVIRONMENTS = [
    ("UTC", {"LANG": "C"}, "root", "1", None),
    ("Australia/Sydney", {"LANG": "de_DE.UTF-8", "LC_ALL": "de_DE.UTF-8"}, "tmp", "2", "1700000000"),
    ("America/New_York", {"LC_ALL": "tr_TR.UTF-8"}, "/", "2", "0"),
]


def _run(args: list[str], tz: str, extra: dict, cwd: str, epoch: str | None) -> subprocess.CompletedProcess:
    env = {k: v for k, v in os.environ.items() if k not in ("LANG", "LC_ALL", "SOURCE_DATE_EPOCH", "TZ")}
    env.update(extra, TZ=tz, PYTHONPATH=str(ROOT))
    if epoch is not None:
        env["SOURCE_DATE_EPOCH"] = epoch
    return subprocess.run(
        [sys.executable, "-m", "calcreport", *args],
        cwd=cwd,
        env=env,
        capture_output=True,
        text=True,
        timeout=120,
    )


@pytest.fixture(scope="module")
def jobs(tmp_path_factory) -> Path:
    folder = tmp_path_factory.mktemp("repro") / "jobs"
    folder.mkdir()
    (folder / "dated.toml").write_text(job_text(GOOD), encoding="utf-8")
    (folder / "second.toml").write_text(job_text(GOOD).replace("T-1", "T-2"), encoding="utf-8")
    return folder


def test_same_bytes_under_three_time_zones_locales_folders_workers_and_epochs(jobs, tmp_path):
    outputs = []
    for i, (tz, extra, where, workers, epoch) in enumerate(ENVIRONMENTS):
        cwd = {"root": str(ROOT), "tmp": str(tmp_path), "/": "/"}[where]
        out = tmp_path / f"out{i}"
        done = _run(["build", str(jobs), "-o", str(out), "-j", workers, "--json"], tz, extra, cwd, epoch)
        assert done.returncode == 0, done.stderr
        outputs.append({p.name: p.read_bytes() for p in sorted(out.iterdir())})
    assert sorted(outputs[0]) == ["dated.json", "dated.pdf", "second.json", "second.pdf"]
    for other in outputs[1:]:
        assert other == outputs[0]
    pdf = outputs[0]["dated.pdf"]
    assert b"D:20260101000000+00'00'" in pdf  # the job's date at 00:00 UTC, in every zone


def test_undated_job_takes_source_date_epoch_the_same_in_every_zone(tmp_path):
    job = tmp_path / "undated.toml"
    job.write_text(UNDATED, encoding="utf-8")
    got = []
    for tz in ("Asia/Kathmandu", "Australia/Sydney"):
        out = tmp_path / f"{tz.replace('/', '_')}.pdf"
        done = _run(["build", str(job), "-o", str(out)], tz, {}, str(tmp_path), "1767225600")
        assert done.returncode == 0, done.stderr
        got.append(out.read_bytes())
    assert got[0] == got[1]
    assert b"D:20260101000000+00'00'" in got[0]  # 1767225600 = 2026-01-01 00:00 UTC


@pytest.mark.parametrize("value", ["1.5", "2026-01-01", "99999999999999999999", "-5", "1e9", "12 34", "٣٣"])
def test_malformed_source_date_epoch_is_one_line_and_writes_nothing(tmp_path, cli, monkeypatch, value):
    job = tmp_path / "job.toml"
    job.write_text(job_text(GOOD), encoding="utf-8")
    monkeypatch.setenv("SOURCE_DATE_EPOCH", value)
    code, out, err = cli("build", str(job), "-o", str(tmp_path / "out") + "/")
    assert code == 2 and out == "" and "Traceback" not in err
    lines = err.strip().splitlines()
    assert len(lines) == 1 and "SOURCE_DATE_EPOCH" in lines[0] and "whole seconds" in lines[0], err
    assert not (tmp_path / "out").exists()
    code, out, err = cli("diff", str(job), str(job), "--pdf", str(tmp_path / "c.pdf"))
    assert code == 2 and len(err.strip().splitlines()) == 1 and "SOURCE_DATE_EPOCH" in err
    assert not (tmp_path / "c.pdf").exists()


def test_epoch_rules():
    assert source_date_epoch({}) is None
    assert source_date_epoch({"SOURCE_DATE_EPOCH": ""}) is None
    assert source_date_epoch({"SOURCE_DATE_EPOCH": " 42 "}) == 42
    with pytest.raises(EpochError):
        source_date_epoch({"SOURCE_DATE_EPOCH": "4.2"})
    assert job_epoch("2026-03-08", {}) == calendar.timegm((2026, 3, 8, 0, 0, 0))  # US clocks change that day
    assert job_epoch("2026-02-30", {"SOURCE_DATE_EPOCH": "7"}) == 7  # not a date: the epoch
    assert job_epoch("", {}) == DEFAULT_EPOCH
    with pytest.raises(EpochError):  # refused even when the job's date would win
        job_epoch("2026-01-01", {"SOURCE_DATE_EPOCH": "soon"})


def test_change_report_same_bytes_under_two_zones(tmp_path):
    old, new = tmp_path / "old.toml", tmp_path / "new.toml"
    old.write_text(job_text(GOOD), encoding="utf-8")
    new.write_text(job_text(GOOD).replace('value = "100 lbf"', 'value = "120 lbf"'), encoding="utf-8")
    got = []
    for tz in ("UTC", "Australia/Sydney"):
        out = tmp_path / f"c-{tz.replace('/', '_')}.pdf"
        done = _run(["diff", str(old), str(new), "--pdf", str(out)], tz, {}, str(tmp_path), None)
        assert done.returncode in (0, 1), done.stderr
        got.append(out.read_bytes())
    assert got[0] == got[1] and b"D:20260101000000+00'00'" in got[0]
