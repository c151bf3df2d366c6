"""One pipeline entry for every command: the same one-line errors and exit codes from check, build,
diff and verify; check carries on past an invalid job; '-' reads standard input; -q/--quiet."""

from __future__ import annotations

import io
import sys
from pathlib import Path

import pytest
from review_helpers import edited, run, write

import calcreport.solve
from calcreport.errors import JobError
from calcreport.pipeline import solve_bytes, solve_file

ROOT = Path(__file__).resolve().parents[1]
BAD_NAIL = ('size = "8d common"', 'size = "99d common"')  # not a nail size: refused while solving


def demo_text() -> str:
    return (ROOT / "jobs" / "boathouse-door-header.toml").read_text(encoding="utf-8")


def _bad(tmp_path: Path) -> Path:
    return write(tmp_path / "bad.toml", edited(demo_text(), BAD_NAIL))


def test_diff_of_a_job_that_fails_to_solve_is_one_line_exit_2(tmp_path, capsys):
    good = write(tmp_path / "good.toml", demo_text())
    code, out, err = run(["diff", str(good), str(_bad(tmp_path))], capsys)
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and "Traceback" not in err
    assert err.startswith(f"{tmp_path / 'bad.toml'}: member[H1].joint[top-webs].connector.size:")


def test_an_internal_solver_error_is_one_line_exit_2_in_diff(tmp_path, capsys, monkeypatch):
    """A defect of ours while solving (here a forced ZeroDivisionError) still reaches the user as
    one line naming the file, exit 2 (diff's 1 means 'results changed')."""

    def broken(job):
        raise ZeroDivisionError("float division by zero")

    monkeypatch.setattr(calcreport.solve, "solve_job", broken)
    a = write(tmp_path / "a.toml", demo_text())
    b = write(tmp_path / "b.toml", demo_text())
    code, out, err = run(["diff", str(a), str(b)], capsys)
    assert code == 2 and out == "" and "Traceback" not in err
    assert err.strip() == (
        f"{a}: internal error while solving (ZeroDivisionError: float division by zero); "
        "please report it with the job file"
    )


def test_check_carries_on_past_an_invalid_job(tmp_path, capsys):
    bad = _bad(tmp_path)
    good = write(tmp_path / "good.toml", demo_text())
    code, out, err = run(["check", str(bad), str(good)], capsys)
    assert code == 2  # the worst of all jobs, as build
    assert "H1" in out  # the valid job is still checked and printed
    lines = err.strip().splitlines()
    assert lines[0] == "calcreport check: 1 of 2 jobs invalid:"
    assert lines[1].startswith(f"  {bad}: member[H1]") and len(lines) == 2


def test_check_refuses_a_template_build_would_refuse(tmp_path, capsys):
    """check reads the report template as build does (same message)."""
    text = edited(demo_text(), ("[settings]", '[settings]\ntemplate = "no-such"'))
    job = write(tmp_path / "tpl.toml", text)
    code, out, err = run(["check", str(job)], capsys)
    assert code == 2 and "settings.template" in err and "expected one of the report templates" in err
    code_b, _, err_b = run(["build", str(job), "-o", str(tmp_path / "x.pdf")], capsys)
    assert code_b == 2 and err_b.strip() == err.strip()
    assert not (tmp_path / "x.pdf").exists()


def test_check_refuses_a_template_with_a_broken_logo(tmp_path, capsys):
    (tmp_path / "logo.png").write_bytes(b"not an image")
    (tmp_path / "firm.toml").write_text('[firm]\nname = "Harbour Engineers"\nlogo = "logo.png"\n')
    job = write(
        tmp_path / "logo.toml", edited(demo_text(), ("[settings]", '[settings]\ntemplate = "firm.toml"'))
    )
    code, _, err = run(["check", str(job)], capsys)
    assert code == 2 and "firm.logo" in err and "PNG or JPEG" in err


def test_dash_reads_the_job_from_standard_input(capsys, monkeypatch):
    data = demo_text().encode("utf-8")
    monkeypatch.setattr(sys, "stdin", io.TextIOWrapper(io.BytesIO(data)))
    code, out, err = run(["check", "-"], capsys)
    assert code == 0 and "H1" in out, err
    assert (
        solve_bytes(data, "<stdin>").status
        == solve_file(str(ROOT / "jobs" / "boathouse-door-header.toml")).status
    )


def test_dash_errors_name_standard_input(capsys, monkeypatch):
    monkeypatch.setattr(sys, "stdin", io.TextIOWrapper(io.BytesIO(b"[job\n")))
    code, _, err = run(["check", "-"], capsys)
    assert code == 2 and err.startswith("<stdin>:1:") and "TOML syntax error" in err


def test_quiet_prints_nothing_but_keeps_the_exit_code(tmp_path, capsys):
    good = write(tmp_path / "good.toml", demo_text())
    assert run(["check", "-q", str(good)], capsys) == (0, "", "")
    code, out, err = run(["build", "--quiet", str(good), "-o", str(tmp_path / "r.pdf")], capsys)
    assert (code, out, err) == (0, "", "") and (tmp_path / "r.pdf").is_file()
    code, out, _ = run(["new", "-q", str(tmp_path / "n.toml")], capsys)
    assert code == 0 and out == "" and (tmp_path / "n.toml").is_file()


def test_solve_file_raises_job_error_for_a_missing_file(tmp_path):
    with pytest.raises(JobError, match="cannot read the file"):
        solve_file(str(tmp_path / "missing.toml"))
