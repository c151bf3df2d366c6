"""The section detail's dimensions and callouts, and the fabrication sheets (in the report and as
``build --fabrication``): callouts match each joint's connector and schedule, counts equal the
schedule's, the QR code holds the job file's SHA-256 and the sheet reference.

External references: the SHA-256 is recomputed with :mod:`hashlib` from the job file's bytes; the
QR code is decoded with zxing-cpp (test-only dependency, skipped when absent) from the page as
rendered by poppler's pdftoppm. Fillet-weld length-pitch notation ("3-12": segment length, then
pitch centre to centre) follows AWS A2.4 (from memory). Writing dimensions in inches with fractions
and positions along a member in feet-inches from a stated end is common practice, no source.
"""

from __future__ import annotations

import hashlib
import io
import re
import shutil
import subprocess
from pathlib import Path

import pypdf
import pytest

from calcreport.outputs.callouts import fraction_inches, joint_callout_text, shop_length
from calcreport.outputs.fabrication_pdf import fabrication_path_for, render_fabrication_pdf
from calcreport.outputs.report.build import render_pdf
from calcreport.pipeline import solve_file
from calcreport.units import Q_
from tests.conftest import ROOT

JOBS = sorted((ROOT / "jobs").glob("*.toml"))
GIRDER = ROOT / "jobs" / "pavilion-plate-girder.toml"
HEADER = ROOT / "jobs" / "boathouse-door-header.toml"
RIDGE = ROOT / "jobs" / "pavilion-ridge-box-beam.toml"
TEE = ROOT / "jobs" / "boardwalk-glued-tee.toml"


def squash(text: str) -> str:
    return re.sub(r"\s+", "", text)


def _pages(pdf: bytes) -> list[str]:
    return [p.extract_text() or "" for p in pypdf.PdfReader(io.BytesIO(pdf)).pages]


def _section_page(pages: list[str], member: str) -> str:
    hits = [t for t in pages if f"Section of {member} to scale" in t.replace("\n", " ")]
    assert hits, "no section detail found"
    return hits[0]


@pytest.fixture(scope="module")
def built() -> dict[Path, tuple]:
    out = {}
    for job in JOBS:
        r = solve_file(str(job))
        sheets: dict[str, int] = {}
        pdf = render_pdf(r, fab_sheets=sheets)
        out[job] = (r, pdf, sheets)
    return out


def test_fractions_as_the_shop_reads_them():
    # common practice, no source: 1/16 in, exact 32nds kept (23/32 in plywood)
    assert shop_length(Q_(2.25, "in")) == "2-1/4 in"
    assert shop_length(Q_(23 / 32, "in")) == "23/32 in"
    assert fraction_inches(5.8125) == "5-13/16"
    assert shop_length(Q_(90, "mm"), "SI") == "90 mm"


def test_weld_callouts_in_words_and_numbers(built):
    r, pdf, _ = built[GIRDER]
    m = r.members[0]
    joints = {j.id: j for j in m.joints}
    tf, bf = joints["tf-web"], joints["bf-web"]
    # the job file: tf-web 5/16 in, segment 3 in, 2 welds; bf-web 1/4 in continuous, 2 welds
    assert not tf.callout.continuous and bf.callout.continuous
    pitch = tf.schedule.zones[0].spacing  # the schedule's spacing is the pitch
    assert tf.callout.spacing == min((z.spacing for z in tf.schedule.zones), key=lambda q: q.m)
    expect_tf = (
        f"5/16 in fillet weld, 3-{fraction_inches(pitch.to('inch').magnitude)} intermittent, both sides"
    )
    assert joint_callout_text(tf.callout) == expect_tf
    assert joint_callout_text(bf.callout) == "1/4 in fillet weld, continuous, both sides"
    page = squash(_section_page(_pages(pdf), m.id))
    assert squash(expect_tf) in page and squash("1/4 in fillet weld, continuous, both sides") in page
    # the AWS A2.4 symbol: size and length-pitch beside the fillet, both sides of the line
    assert page.count(squash(f"3-{fraction_inches(pitch.to('inch').magnitude)}")) >= 3
    assert "continuousweld" in page and "intermittentweld" in page  # told apart in the legend


def test_fastener_and_glue_callouts_match_the_joints(built):
    for job in JOBS:
        r, pdf, _ = built[job]
        pages = _pages(pdf)
        for m in r.members:
            page = squash(_section_page(pages, m.id))
            for j in m.joints:
                c = j.callout
                assert c is not None and c.per_row == j.per_row
                # rows are shared out over the planes, except by a through-bolt (each plane has all)
                rows = {p.rows for p in c.planes}
                assert rows == {j.per_row} if c.through else sum(p.rows for p in c.planes) == j.per_row
                if not c.continuous:
                    gov = (
                        min((z.spacing for z in j.schedule.zones), key=lambda q: q.m)
                        if j.schedule is not None and j.schedule.feasible
                        else j.spacing_provided
                    )
                    assert c.spacing == gov
                    assert squash(shop_length(gov)) in squash(joint_callout_text(c))
                assert squash(joint_callout_text(c, r.job.settings.units)) in page, (job.name, j.id)
    r, pdf, _ = built[HEADER]
    # the job: per_row = 4 nails across the flange, two planes (one per plywood web), 8d common
    top = r.members[0].joints[0]
    s = fraction_inches(top.spacing_provided.to("inch").magnitude)
    # staggered = true in the job: the rows from the two webs are offset (their points do not meet)
    assert joint_callout_text(top.callout) == f"2 rows 8d common @ {s} in o.c., each web, staggered"
    # the job: 1/2 in through-bolts, two across the depth, through both timbers and the plate
    flitch = built[ROOT / "jobs" / "boardwalk-flitch-beam.toml"][0].members[0].joints[0]
    text = joint_callout_text(flitch.callout)
    assert text.startswith("2 rows 1/2 in bolt @ ") and text.endswith(" in o.c., through all plies"), text
    r, pdf, _ = built[TEE]
    glue = r.members[0].joints[0]
    assert joint_callout_text(glue.callout, "SI") == "glue line, full width (90 mm)"


def test_every_part_dimensioned_and_neutral_axis_located(built):
    r, pdf, _ = built[GIRDER]
    page = _section_page(_pages(pdf), "G2")
    # the job: flanges 12 in × 1 in, web 3/8 in × 34 in on the flange's centre; depth 36 in
    for text in ("12 × 1", "3/8 × 34", "5-13/16", "36", "ȳ = 18"):
        assert squash(text) in squash(page), text
    assert "Dimensions in inches" in page.replace("\n", " ")
    assert re.search(r"scale 1:\d+ \(.+ = 1 ft\)", page.replace("\n", " "))
    r, pdf, _ = built[HEADER]
    page = _section_page(_pages(pdf), "H1")
    # 23/32 in plywood webs 24 in deep, 2x6 flanges (1-1/2 × 5-1/2 in dressed, ASTM D245/PS 20)
    for text in ("23/32 × 24", "1-1/2 × 5-1/2", "2-15/16", "24"):
        assert squash(text) in squash(page), text
    ybar = fraction_inches(r.members[0].section.centroid.to("inch").magnitude)
    assert squash(f"ȳ = {ybar}") in squash(page)
    r, pdf, _ = built[TEE]
    page = _section_page(_pages(pdf), "S3")
    assert "Dimensions in millimetres" in page.replace("\n", " ") and "scale 1:" in page


def _fab_pages(pages: list[str]) -> list[str]:
    return [t for t in pages[1:] if "Fabrication sheet — member" in t]  # the cover lists them


def test_fabrication_counts_equal_the_schedule(built):
    for job in (RIDGE, GIRDER):
        r, pdf, sheets = built[job]
        fab = "\n".join(_fab_pages(_pages(pdf)))
        for m in r.members:
            for j in m.joints:
                if j.schedule is None or not j.schedule.feasible:
                    continue
                c = j.callout
                assert [z.rows for z in c.zones] == [z.count for z in j.schedule.zones]
                assert sum(z.count for z in j.schedule.zones) == j.schedule.count == c.rows_total
                per = c.weld_lines if c.kind == "fillet_weld" else j.per_row
                # staggered rows (the ridge's webs): the offset face has no row at x = 0
                moved = sum(p.rows for i, p in enumerate(c.planes) if i in c.offset_planes)
                assert c.pieces_total == j.schedule.count * per - (moved if c.staggered else 0)
                rows = f"{c.rows_total} + {c.rows_total - 1}" if c.offset_planes else str(c.rows_total)
                assert f"{c.rows_total} rows, {c.pieces_total}" in fab or re.search(
                    rf"Total\n[^\n]*\n{re.escape(rows)}\n{c.pieces_total}\n", fab
                ), (job.name, j.id)
                for z in j.schedule.zones:  # the zone rows leave the stagger to the joint's heading
                    assert squash(joint_callout_text(c, spacing=z.spacing, stagger=False)) in squash(fab)
                assert squash(joint_callout_text(c)) in squash(fab)


def test_qr_payload_holds_job_hash_and_sheet(built, tmp_path):
    r, pdf, sheets = built[GIRDER]
    sha = hashlib.sha256(GIRDER.read_bytes()).hexdigest()  # independent of calcreport
    pages = _pages(pdf)
    fab_sheet = max(i for i, t in enumerate(pages, 1) if "Fabrication sheet — member G2" in t)  # not contents
    assert sheets == {"G2": fab_sheet}
    payloads: dict[str, str] = {}
    shop = render_fabrication_pdf(r, sheets, payloads=payloads)
    text = payloads["G2"]
    assert sha in text and f"sheet {fab_sheet}" in text
    assert f"job {r.job.header.number}" in text and f"revision {r.job.header.revision}" in text
    shop_text = squash(_pages(shop)[0])
    assert squash(sha) in shop_text and squash(f"sheet {fab_sheet}") in shop_text  # printed under it
    assert f"Copy of report sheet {fab_sheet}" in _pages(shop)[0].replace("\n", " ")
    zx = pytest.importorskip("zxingcpp")
    if shutil.which("pdftoppm") is None:
        pytest.skip("pdftoppm (poppler-utils) not installed")
    Image = pytest.importorskip("PIL.Image")
    (tmp_path / "shop.pdf").write_bytes(shop)
    subprocess.run(
        [
            "pdftoppm",
            "-png",
            "-r",
            "200",
            "-f",
            "1",
            "-l",
            "1",
            str(tmp_path / "shop.pdf"),
            str(tmp_path / "p"),
        ],
        check=True,
    )
    png = sorted(tmp_path.glob("p*.png"))[0]
    decoded = [b.text for b in zx.read_barcodes(Image.open(png))]
    assert text in decoded


def test_build_fabrication_writes_report_and_shop_copy(cli, tmp_path):
    out = tmp_path / "out"
    code, stdout, err = cli("build", str(RIDGE), "-o", str(out) + "/", "--fabrication")
    assert code == 0, err
    report, shop = out / "pavilion-ridge-box-beam.pdf", out / "pavilion-ridge-box-beam-fabrication.pdf"
    assert report.exists() and shop.exists()
    assert Path(fabrication_path_for(report)) == shop
    meta = pypdf.PdfReader(shop).metadata
    assert meta["/CalcreportDocument"] == "fabrication sheet"
    assert meta["/CalcreportJobSHA256"] == hashlib.sha256(RIDGE.read_bytes()).hexdigest()
    # a rebuild into another folder gives the same bytes (outputs/report/epoch.py: dates from the job)
    first = shop.read_bytes()
    code2, _, err2 = cli("build", str(RIDGE), "-o", str(tmp_path / "again") + "/", "--fabrication")
    assert code2 == 0, err2
    assert (tmp_path / "again" / shop.name).read_bytes() == first


def test_fabrication_refuses_a_clash(cli, tmp_path):
    src = tmp_path / "jobs"
    src.mkdir()
    shutil.copy(TEE, src / "a.toml")
    shutil.copy(TEE, src / "a-fabrication.toml")
    out = tmp_path / "out"
    code, stdout, err = cli("build", str(src), "-o", str(out), "--fabrication")
    assert code == 2
    lines = [x for x in err.splitlines() if x.strip()]
    assert len(lines) == 1 and "--fabrication" in lines[0] and "a-fabrication.pdf" in lines[0]
    assert not out.exists() or not any(out.iterdir())


def test_fabrication_refuses_a_job_without_joints(cli, tmp_path):
    text = TEE.read_text(encoding="utf-8")
    cut = text.index("[[member.joint]]")
    job = tmp_path / "nojoint.toml"
    job.write_text(text[:cut], encoding="utf-8")
    code0, _, err0 = cli("check", str(job))
    if code0 == 2:
        pytest.skip(f"a member without joints is not a valid job: {err0.strip()}")
    out = tmp_path / "out"
    code, stdout, err = cli("build", str(job), "-o", str(out) + "/", "--fabrication")
    assert code == 2
    lines = [x for x in err.splitlines() if x.strip()]
    assert len(lines) == 1 and "nothing to fabricate" in lines[0]
    assert not out.exists() or not any(out.iterdir())  # not even the report: one set or nothing


def test_fabrication_same_bytes_in_two_time_zones_and_folders(tmp_path):
    from tests.test_harden_repro import _run

    got = []
    for i, (tz, cwd) in enumerate((("UTC", str(ROOT)), ("Australia/Sydney", str(tmp_path)))):
        out = tmp_path / f"out{i}"
        done = _run(
            ["build", str(RIDGE), "-o", str(out) + "/", "--fabrication"], tz, {"LANG": "C"}, cwd, None
        )
        assert done.returncode == 0, done.stderr
        got.append({p.name: p.read_bytes() for p in sorted(out.iterdir())})
    assert sorted(got[0]) == ["pavilion-ridge-box-beam-fabrication.pdf", "pavilion-ridge-box-beam.pdf"]
    assert got[0] == got[1]
