"""The package as a user gets it: build the wheel, install it in a fresh venv outside the checkout,
and run ``new``, ``check`` and ``build`` of every starter kind with every shipped report template.

Runs in CI (marker ``packaging``; deselect locally with ``-m "not packaging"``). To stay within
about a minute it installs the wheel itself with ``--no-deps`` and lends the fresh venv this
environment's dependencies through a ``.pth`` line; set ``CALCREPORT_WHEEL_FULL=1`` to let pip
install the dependencies from the index as a new user's ``pip install`` would (slower).
"""

from __future__ import annotations

import os
import re
import subprocess
import sys
import sysconfig
import zipfile
from pathlib import Path

import pytest

from calcreport.resources import STARTERS, builtin_template_names

ROOT = Path(__file__).resolve().parents[1]
pytestmark = pytest.mark.packaging


def _run(args: list[str], cwd: Path, timeout: int = 300, env=None) -> subprocess.CompletedProcess:
    return subprocess.run(args, cwd=cwd, capture_output=True, text=True, timeout=timeout, env=env)


@pytest.fixture(scope="module")
def installed(tmp_path_factory):
    """A fresh venv outside the checkout with the built wheel installed; yields its bin folder."""
    base = tmp_path_factory.mktemp("wheel")
    dist = base / "dist"
    pytest.importorskip("build")  # the PyPA build front end (test extra)
    # sdist first, then the wheel built from that sdist: proves the sdist is complete
    r = _run([sys.executable, "-m", "build", "-o", str(dist), str(ROOT)], base)
    if r.returncode != 0:
        pytest.skip(f"cannot build here (setuptools not reachable?): {(r.stderr or r.stdout).strip()[-300:]}")
    (wheel,) = dist.glob("calcreport-*.whl")
    names = zipfile.ZipFile(wheel).namelist()
    for needed in (
        "calcreport/py.typed",
        "calcreport/data/job.schema.json",
        "calcreport/data/fonts/DejaVuSansCondensed.ttf",
    ):
        assert needed in names
    assert {f"calcreport/data/templates/{s}" for s in STARTERS.values()} <= set(names)
    assert not any(n.startswith(("tests/", "jobs/")) for n in names)

    venv = base / "venv"
    full = os.environ.get("CALCREPORT_WHEEL_FULL") == "1"
    r = _run([sys.executable, "-m", "venv", *([] if full else ["--without-pip"]), str(venv)], base)
    assert r.returncode == 0, r.stderr
    py = venv / "bin" / "python"
    if full:
        r = _run([str(py), "-m", "pip", "install", "-q", str(wheel)], base, timeout=900)
    else:
        purelib = _run([str(py), "-c", "import sysconfig; print(sysconfig.get_paths()['purelib'])"], base)
        site = Path(purelib.stdout.strip())
        (site / "_borrowed_deps.pth").write_text(
            "\n".join(dict.fromkeys([sysconfig.get_paths()["purelib"], sysconfig.get_paths()["platlib"]]))
            + "\n"
        )
        r = _run(
            [sys.executable, "-m", "pip", "--python", str(py), "install", "-q", "--no-deps", str(wheel)], base
        )
    assert r.returncode == 0, r.stderr[-500:]
    where = _run([str(py), "-c", "import calcreport; print(calcreport.__file__)"], base)
    assert str(venv) in where.stdout, where.stdout  # the installed copy, not the checkout
    return venv / "bin", base, dist


def _with_template(text: str, name: str) -> str:
    if re.search(r"^\[settings\]", text, flags=re.M):
        return re.sub(r"^\[settings\]\n", f'[settings]\ntemplate = "{name}"\n', text, count=1, flags=re.M)
    return text + f'\n[settings]\ntemplate = "{name}"\n'


def test_new_check_build_every_starter_and_template(installed):
    bin_, base, _ = installed
    work = base / "work"
    work.mkdir()
    cr = str(bin_ / "calcreport")
    assert set(builtin_template_names()) >= {"letter", "a4"}
    jobs = []
    for kind in sorted(STARTERS):
        r = _run([cr, "new", f"{kind}.toml", "--kind", kind], work)
        assert r.returncode == 0, r.stderr
        text = (work / f"{kind}.toml").read_text(encoding="utf-8")
        for tpl in builtin_template_names():
            p = work / f"{kind}-{tpl}.toml"
            p.write_text(_with_template(text, tpl), encoding="utf-8")
            jobs.append(p.name)
    r = _run([cr, "check", "-q", *jobs], work)
    assert r.returncode == 0, r.stdout + r.stderr
    r = _run([cr, "build", *jobs, "-o", "out/", "-j", "2"], work)
    assert r.returncode == 0, r.stdout + r.stderr
    for j in jobs:
        pdf = work / "out" / Path(j).with_suffix(".pdf")
        assert pdf.read_bytes()[:5] == b"%PDF-", j
    a4 = (work / "out" / "box-a4.pdf").read_bytes()
    assert b"/MediaBox [ 0 0 595.2756 841.8898 ]" in a4 or b"595.27" in a4  # ISO 216 A4: 210 × 297 mm
    r = _run([cr, "schema"], work)
    assert r.returncode == 0 and '"$schema"' in r.stdout
    r = _run([cr, "--version"], work)
    assert r.returncode == 0 and r.stdout.startswith("calcreport ")


def test_sdist_carries_what_its_tests_need(installed):
    """The source distribution holds the licence, docs, demo jobs, tests and their data."""
    import tarfile

    (sdist,) = installed[2].glob("calcreport-*.tar.gz")
    names = {n.split("/", 1)[1] for n in tarfile.open(sdist).getnames() if "/" in n}
    for needed in (
        "LICENSE",
        "README.md",
        "docs/job-format.md",
        "jobs/boathouse-door-header.toml",
        "tests/conftest.py",
        "tests/data/review-box-header.toml",
        "calcreport/data/job.schema.json",
        "calcreport/data/templates/report-a4.toml",
    ):
        assert needed in names, needed
