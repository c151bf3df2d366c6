"""The PDF report, read back with pypdf (an independent PDF reader).

These tests check what a reviewer sees: the title block on every sheet, every input and every
derivation step with its numbers, the sign-off block and the job hash, determinism, and metadata.
The expected numbers are the solver's steps formatted by ``Display`` — the same text the JSON output
carries — so the test checks that the report shows them, not that they are right (the solver's
own tests check values against published references).
"""

from __future__ import annotations

import os
import re
import shutil
import subprocess
from pathlib import Path

import pytest

pypdf = pytest.importorskip("pypdf")

from calcreport import __version__  # noqa: E402
from calcreport.outputs.fmt import Display  # noqa: E402
from calcreport.outputs.report.build import build_pdf, render_pdf  # noqa: E402
from calcreport.pipeline import solve_file  # noqa: E402

ROOT = Path(__file__).resolve().parent.parent
DEMO = ROOT / "jobs" / "boathouse-door-header.toml"
MIXED = ROOT / "tests" / "data" / "report-mixed.toml"


def squash(text: str) -> str:
    """Text without any whitespace (line wrapping in the PDF may break anywhere)."""
    return re.sub(r"\s+", "", text)


def pages_text(path: Path) -> list[str]:
    return [p.extract_text() or "" for p in pypdf.PdfReader(str(path)).pages]


@pytest.fixture(scope="module")
def demo(tmp_path_factory):
    result = solve_file(str(DEMO))
    out = tmp_path_factory.mktemp("rep") / "demo.pdf"
    build_pdf(result, out)
    return result, out, pages_text(out)


@pytest.fixture(scope="module")
def mixed(tmp_path_factory):
    result = solve_file(str(MIXED))
    out = tmp_path_factory.mktemp("rep") / "mixed.pdf"
    build_pdf(result, out)
    return result, out, pages_text(out)


@pytest.mark.parametrize("which", ["demo", "mixed"])
def test_title_block_on_every_sheet(which, request):
    result, _, pages = request.getfixturevalue(which)
    h = result.job.header
    n = len(pages)
    assert n >= 4
    for i, text in enumerate(pages, 1):
        flat = squash(text)
        assert squash(f"Sheet {i} of {n}") in flat, f"sheet {i}"
        for item in (h.project, h.number, h.prepared_by, h.checked_by, h.revision):
            assert squash(item) in flat, (i, item)
        assert result.job.sha256[:12] in flat, i
        assert squash(f"calcreport {__version__}") in flat, i


def test_every_input_is_shown(demo):
    result, _, pages = demo
    d = Display(result.job.settings.units, result.job.settings.display)
    flat = squash("".join(pages))
    for m in result.members:
        assert squash(m.member.description) in flat
        for p in m.member.parts:
            assert squash(p.id) in flat
            assert squash(p.material.id) in flat
        for mat in {p.material.id: p.material for p in m.member.parts}.values():
            assert squash(mat.name) in flat
            assert squash(d.quantity(mat.E)) in flat
        for j in m.member.joints:
            assert squash(j.id) in flat
            assert squash(f"type = {j.connector.kind}") in flat
            for k, v in j.connector.params.items():  # every key the job file states
                if v is not None and v != "" and k in j.connector.given:
                    assert squash(d.value(v)) in flat, (j.id, k)
        assert squash(d.quantity(m.member.shear)) in flat


def _shown(m, d):
    """Each step of ``m`` with how the report shows it: ("full", step), ("cell", step) for a table
    cell, ("follows", base step) for a step of a joint stated once (report modules decide which)."""
    from calcreport.outputs.report.derivations import member_groups
    from calcreport.outputs.report.folding import fold_groups

    groups = member_groups(m)
    for k, g in enumerate(groups, 1):
        g.number = f"1.{k}"
    folds = fold_groups(groups, d, {p.id for p in m.member.parts})
    by_gid = {g.gid: g for g in groups}
    for g in groups:
        fold = folds.get(g.gid)
        for i, s in enumerate(g.steps):
            if fold is not None and s.key not in fold.differ:
                base = by_gid[fold.base_gid].steps[i]
                yield ("cell" if base.group and base.column else "follows"), base
            elif s.group and s.column:
                yield "cell", s
            else:
                yield "full", s


@pytest.mark.parametrize("which", ["demo", "mixed"])
def test_every_step_with_substituted_numbers(which, request):
    """Every step is in the report: written out, as a table cell, or as the step of the joint it
    follows (that step written out)."""
    result, _, pages = request.getfixturevalue(which)
    d = Display(result.job.settings.units, result.job.settings.display)
    flat = squash("".join(pages))
    count = 0
    for m in result.members:
        for how, s in _shown(m, d):
            assert squash(d.value(s.result)) in flat, s.key
            if how != "cell":
                assert squash(s.label) in flat, s.key
                assert squash(s.symbol) in flat, s.key
                assert squash(d.substituted(s)) in flat, s.key
            count += 1
    assert count > 10


def test_steps_appear_in_report_order(demo):
    """Steps written out appear in the order of the work (stages), in solver order within each."""
    result, _, pages = demo
    d = Display(result.job.settings.units, result.job.settings.display)
    flat = squash("".join(pages))
    pos = 0
    for how, s in _shown(result.members[0], d):
        if how != "full":
            continue
        found = flat.find(squash(s.label), pos)
        assert found >= 0, s.key
        pos = found


def test_signoff_limitations_and_hash(demo):
    result, _, pages = demo
    flat = squash("".join(pages))
    for text in (
        "Review and sign-off",
        "Prepared by",
        "Checked by",
        "Approved by",
        "Checker's comments",
        "Limitations and cautions",
        "licensed professional engineer",
        "lateral-torsional buckling",
        "ENGINEER'S SEAL AND SIGNATURE",
        "Revision history",
        "Contents",
    ):
        assert squash(text) in flat, text
    assert result.job.sha256 in flat
    for r in result.job.header.history:
        assert squash(r.description) in flat


def test_metadata_for_verification(demo):
    result, out, _ = demo
    meta = pypdf.PdfReader(str(out)).metadata
    assert meta["/CalcreportJobSHA256"] == result.job.sha256
    assert meta["/CalcreportVersion"] == __version__
    assert meta.title.startswith(result.job.header.project)
    assert meta.author == result.job.header.prepared_by
    assert result.job.header.number in meta["/Keywords"]
    assert meta["/CreationDate"].startswith("D:" + result.job.header.date.replace("-", ""))


def test_rebuild_is_byte_identical(tmp_path, monkeypatch):
    result = solve_file(str(DEMO))
    a = build_pdf(result, tmp_path / "a.pdf").read_bytes()
    monkeypatch.setenv("SOURCE_DATE_EPOCH", "1234567890")  # the job's own date wins
    b = build_pdf(solve_file(str(DEMO)), tmp_path / "sub" / "b.pdf").read_bytes()
    assert a == b


def test_ng_is_shown_plainly(mixed):
    result, _, pages = mixed
    assert result.status == "NG"
    flat = squash("".join(pages))
    assert squash("Overall result: NG") in flat
    assert squash("practical spacing is below the minimum spacing") in flat


def test_long_derivation_tables_repeat_their_header(demo):
    """A derivation table that runs on to the next sheet starts there with its header row again
    (common typesetting practice, no source): no sheet opens on a bare step row of a derivation
    the sheet before it already showed, and at least one derivation does run on."""
    _, _, texts = demo
    # the checks table's Step column refers to step numbers; only the derivation tables are read here
    pages = [t.split("Check (note; source)", 1)[0] for t in texts]
    groups = [set(re.findall(r"^(\d+\.\d+)\.\d+", t, re.M)) for t in pages]
    runs_on = 0
    for i in range(1, len(pages)):
        lines = [ln.strip() for ln in pages[i].splitlines() if ln.strip()]
        if not lines:
            continue
        bare = re.match(r"^(\d+\.\d+)\.\d+$", lines[0])
        assert not (bare and bare.group(1) in groups[i - 1]), (i + 1, lines[:3])
        if lines[0] == "No." and len(lines) > 3:
            first = next((m for ln in lines[1:8] if (m := re.match(r"^(\d+\.\d+)\.\d+$", ln))), None)
            runs_on += bool(first and first.group(1) in groups[i - 1])
    assert runs_on >= 1


def test_a4_template_from_the_job(mixed):
    _, out, _ = mixed
    box = pypdf.PdfReader(str(out)).pages[0].mediabox
    assert (round(float(box.width)), round(float(box.height))) == (595, 842)  # ISO 216 A4 in points


def test_zone_schedule_hook_renders_a_table(tmp_path):
    from dataclasses import replace
    from types import SimpleNamespace

    from calcreport.units import Q_

    result = solve_file(str(DEMO))
    m = result.members[0]
    sched = SimpleNamespace(
        zones=[(Q_(0, "ft"), Q_(3, "ft"), Q_(2.5, "in"), 15), (Q_(3, "ft"), Q_(11, "ft"), Q_(6, "in"), 16)],
        count=46,
        status="OK",
    )
    joints = (replace(m.joints[0], schedule=sched),) + m.joints[1:]
    result = replace(result, members=(replace(m, joints=joints),))
    out = build_pdf(result, tmp_path / "z.pdf")
    flat = squash("".join(pages_text(out)))
    assert squash(f"Connector schedule — joint {m.joints[0].id}") in flat
    assert squash("Zone From To Spacing") in flat
    # positions along the member in the drawing convention (feet-inches), spacings in inches
    for text in ("3'-0\"", "11'-0\"", "2.500 in", "6.000 in"):
        assert squash(text) in flat, text


def test_revision_marks_beside_changed_rows(tmp_path):
    result = solve_file(str(DEMO))
    m = result.members[0]
    step_key = m.joints[0].steps[-1].key
    keys = frozenset({step_key, f"member[{m.id}].part[{m.member.parts[1].id}]"})
    out = build_pdf(result, tmp_path / "r.pdf", changed_keys=keys, revision_mark="Q9")
    text = "".join(pages_text(out))
    assert text.count("Q9") == 2
    plain = build_pdf(result, tmp_path / "p.pdf")
    assert "Q9" not in "".join(pages_text(plain))


def test_pdftoppm_renders_every_page(demo, tmp_path):
    exe = shutil.which("pdftoppm")
    if exe is None:
        pytest.skip("pdftoppm (poppler-utils) is not installed; .ci/run installs it")
    _, out, pages = demo
    subprocess.run([exe, "-png", "-r", "40", str(out), str(tmp_path / "pg")], check=True, timeout=120)
    pngs = sorted(tmp_path.glob("pg-*.png"))
    assert len(pngs) == len(pages)
    for p in pngs:
        assert p.read_bytes()[:8] == b"\x89PNG\r\n\x1a\n"
        assert p.stat().st_size > 2000  # a page with content, not blank


def test_render_does_not_touch_the_disk(tmp_path, monkeypatch):
    monkeypatch.chdir(tmp_path)
    pdf = render_pdf(solve_file(str(DEMO)))
    assert pdf.startswith(b"%PDF-") and pdf.rstrip().endswith(b"%%EOF")
    assert os.listdir(tmp_path) == []


@pytest.mark.parametrize("job", sorted((ROOT / "jobs").glob("*.toml")), ids=lambda p: p.stem)
def test_every_demo_job_builds(job, tmp_path):
    result = solve_file(str(job))
    out = build_pdf(result, tmp_path / "r.pdf")
    pages = pages_text(out)
    flat = squash("".join(pages))
    assert squash(f"Sheet {len(pages)} of {len(pages)}") in flat
    for m in result.members:
        assert squash(f"Member {m.id}") in flat and squash(f"Section of {m.id} to scale") in flat
