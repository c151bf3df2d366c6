"""Templates and paths (issue 13, item 8) and short echoed values (item 10): a job's template,
logo and font paths must resolve inside the job's folder or the shipped templates unless
``--allow-outside``; error lines quote at most a short, one-line excerpt of a value (about 80
characters), never a whole text or another file's content. The rules are ours (common practice for
tools that read files named by untrusted input, no source)."""

from __future__ import annotations

import os

import pytest
from PIL import Image

from calcreport.errors import excerpt
from tests.conftest import job_text
from tests.test_bad_input import GOOD


def _job(folder, template: str):
    folder.mkdir(parents=True, exist_ok=True)
    job = folder / "job.toml"
    job.write_text(job_text(GOOD, settings=f"template = {template!r}\n".replace("'", '"')), encoding="utf-8")
    return job


def _one_line(code, out, err, *words):
    assert code == 2 and "Traceback" not in err, err
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    for w in words:
        assert w in lines[0], (w, lines[0])
    return lines[0]


@pytest.mark.parametrize("how", ["parent", "absolute", "symlink"])
def test_template_outside_the_job_folder_needs_allow_outside(tmp_path, cli, how):
    elsewhere = tmp_path / "elsewhere"
    elsewhere.mkdir()
    (elsewhere / "firm.toml").write_text('[firm]\nname = "Far Away Engineers"\n', encoding="utf-8")
    jobs = tmp_path / "jobs"
    jobs.mkdir()
    if how == "parent":
        value = "../elsewhere/firm.toml"
    elif how == "absolute":
        value = str(elsewhere / "firm.toml")
    else:
        os.symlink(elsewhere / "firm.toml", jobs / "firm.toml")
        value = "firm.toml"
    job = _job(jobs, value)
    out = tmp_path / "out"
    _one_line(
        *cli("build", str(job), "-o", str(out) + "/"), "settings.template", "outside", "--allow-outside"
    )
    assert not out.exists()
    code, stdout, err = cli("build", str(job), "-o", str(out) + "/", "--allow-outside")
    assert code == 0, err


def test_logo_outside_the_job_folder_is_refused(tmp_path, cli):
    Image.new("RGB", (30, 12), (1, 2, 3)).save(tmp_path / "private.png")
    jobs = tmp_path / "jobs"
    jobs.mkdir()
    (jobs / "firm.toml").write_text('[firm]\nlogo = "../private.png"\n', encoding="utf-8")
    job = _job(jobs, "firm.toml")
    _one_line(*cli("build", str(job), "-o", str(tmp_path / "o") + "/"), "firm.logo", "outside")
    assert cli("build", str(job), "-o", str(tmp_path / "o") + "/", "--allow-outside")[0] == 0


def test_templates_below_the_job_folder_and_shipped_ones_are_fine(tmp_path, cli):
    sub = tmp_path / "jobs" / "tpl"
    sub.mkdir(parents=True)
    Image.new("RGB", (30, 12), (1, 2, 3)).save(sub / "mark.png")
    (sub / "firm.toml").write_text('[firm]\nlogo = "mark.png"\n', encoding="utf-8")
    assert (
        cli("build", str(_job(tmp_path / "jobs", "tpl/firm.toml")), "-o", str(tmp_path / "a") + "/")[0] == 0
    )
    assert cli("build", str(_job(tmp_path / "j2", "a4")), "-o", str(tmp_path / "b") + "/")[0] == 0


def test_change_report_template_rule(tmp_path, cli):
    (tmp_path / "firm.toml").write_text('[firm]\nname = "Far"\n', encoding="utf-8")
    job = _job(tmp_path / "jobs", "../firm.toml")
    pdf = str(tmp_path / "c.pdf")
    _one_line(*cli("diff", str(job), str(job), "--pdf", pdf), "outside")
    assert cli("diff", str(job), str(job), "--pdf", pdf, "--allow-outside")[0] == 0


def test_values_from_another_file_are_quoted_short(tmp_path, cli):
    secret = "line one of a private file\n" + "s3cr3t " * 400
    (tmp_path / "jobs").mkdir()
    (tmp_path / "jobs" / "firm.toml").write_text('[page]\nsize = """' + secret + '"""\n', encoding="utf-8")
    line = _one_line(
        *cli("build", str(_job(tmp_path / "jobs", "firm.toml")), "-o", str(tmp_path / "o") + "/"), "page.size"
    )
    assert line.count("s3cr3t") < 12 and len(line) < 400, line


@pytest.mark.parametrize(
    "old, new, key",
    [
        ('method = "ASD"', 'method = "' + "A" * 3000 + '"', "settings.method"),
        ('holds = ["fl"]', 'holds = ["' + "f" * 1500 + '"]', "holds"),
        ('material = "wood"', 'material = "' + "w" * 1500 + '"', "material"),
        ('id = "j"', 'id = "j"\n' + "k" * 1000 + " = 1", "unknown key"),
    ],
)
def test_job_errors_cut_long_values(write_job, cli, old, new, key):
    text = job_text(GOOD).replace(old, new, 1)
    line = _one_line(*cli("check", write_job(text)), key)
    assert len(line) < 500 and "…" in line, (len(line), line[:200])


def test_excerpt():
    assert excerpt("short") == "'short'"
    long = excerpt("x" * 500)
    assert len(long) == 80 and long.endswith("…")
    assert "\n" not in excerpt("a\nb") and excerpt(1.5) == "1.5"
