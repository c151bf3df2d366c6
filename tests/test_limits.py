"""Absurd inputs get a one-line refusal (exit 2) naming the file and key, without a hang or a memory
blow-up, and the refusal comes before the expensive work. The limits themselves are ours (common
practice, no source): no built-up member has tens of thousands of parts, a 2,000-ft span or a
polygon with thousands of corners. Nothing here is timed; "before the expensive work" is checked
by counting calls of the readers that do it."""

from __future__ import annotations

import json
import os

import pytest

from calcreport.jobfile import load as load_mod
from calcreport.jobfile import parts as parts_mod
from calcreport.jobfile.load import MAX_FILE_BYTES, MAX_MATERIALS, MAX_PARTS
from calcreport.jobfile.loads import MAX_SPAN_FT
from calcreport.jobfile.parts import MAX_VERTICES
from calcreport.jobfile.reader import MAX_TEXT, Table
from calcreport.solve.schedule import MAX_GRID
from calcreport.units import UnitParseError, parse
from tests.conftest import MATERIALS, job_text
from tests.test_bad_input import GOOD

LOADED = GOOD.replace(
    'shear = "1 kip"', 'span = "16 ft"\n\n[[member.load]]\ncase = "D"\nkind = "uniform"\nw = "100 plf"\n', 1
)


def refused(cli, path: str, *words: str) -> str:
    code, out, err = cli("check", path)
    assert code == 2, (code, out, err[:300])
    assert out == "" and "Traceback" not in err
    lines = err.strip().splitlines()
    assert len(lines) == 1 and lines[0].startswith(path), err[:300]
    for w in words:
        assert w in lines[0], (w, lines[0][:300])
    return lines[0]


def test_file_over_the_size_limit(write_job, cli):
    text = job_text(GOOD) + "# " + "x" * MAX_FILE_BYTES + "\n"
    refused(cli, write_job(text), "bytes", f"{MAX_FILE_BYTES:,}")


def test_tens_of_thousands_of_parts_refused_before_any_part_is_read(write_job, cli, monkeypatch):
    part = '[[member.part]]\nid="p{i}"\nshape="rect"\n'
    body = '[[member]]\nid = "M"\nshear = "1 kip"\n' + "".join(part.format(i=i) for i in range(30_000))
    calls = []
    real = parts_mod.read_part
    monkeypatch.setattr(load_mod, "read_part", lambda *a: calls.append(1) or real(*a))
    refused(cli, write_job(job_text(body)), "member[M].part", f"at most {MAX_PARTS} parts", "30000")
    assert calls == []  # refused by count: not one part was read


def test_thousands_of_materials_refused_by_count(write_job, cli):
    mats = "".join(f'[[material]]\nid = "m{i}"\nE = "1600 ksi"\n' for i in range(20_000))
    refused(cli, write_job(job_text(GOOD, materials=MATERIALS + mats)), f"at most {MAX_MATERIALS} materials")


def test_polygon_with_a_huge_vertex_list_refused_before_parsing_its_points(write_job, cli, monkeypatch):
    n = 100_000  # about as many as fit in a job file under the size limit
    pts = ",".join(['["0 in","0 in"]'] * n)
    body = GOOD.replace(
        'shape = "rect"\nwidth = "2 in"\ndepth = "10 in"', f'shape = "polygon"\npoints = [{pts}]', 1
    )
    seen = []
    real = Table.parse_quantity
    monkeypatch.setattr(
        Table, "parse_quantity", lambda self, name, *a, **k: (seen.append(name), real(self, name, *a, **k))[1]
    )
    refused(cli, write_job(job_text(body)), "member[M].part[web].points", f"3 to {MAX_VERTICES}")
    assert not any(isinstance(nm, tuple) and nm[0] == "points" for nm in seen)  # no point was parsed


@pytest.mark.parametrize("span", ["1e9 ft", "2001 ft", "0.5 in"])
def test_span_beyond_the_sane_range(write_job, cli, span):
    text = job_text(LOADED.replace('span = "16 ft"', f'span = "{span}"'))
    refused(cli, write_job(text), "member[M].span", f"{MAX_SPAN_FT:,} ft", span)


def test_longest_span_with_the_finest_step_finishes_on_a_bounded_grid(write_job, cli):
    """1,000 ft at a 1/64-in step would be 768,000 grid points; the schedule coarsens its zone
    module so that at most MAX_GRID module lengths cover the member, and says so in a step."""
    text = job_text(
        LOADED.replace('span = "16 ft"', 'span = "1000 ft"').replace('w = "100 plf"', 'w = "1 plf"'),
        settings='spacing_step = "1/64 in"\n',
    )
    code, out, err = cli("check", "--json", write_job(text))
    assert code in (0, 1), err
    joint = json.loads(out)["members"][0]["joints"][0]
    steps = {s["key"].rsplit(".", 1)[-1]: s for s in joint["steps"]}
    assert "module" in steps, sorted(steps)
    module = steps["module"]["result"]
    assert module["value"] * MAX_GRID >= 1000 * 12 * (1 - 1e-9)


def test_tiny_zone_module_is_coarsened_not_expanded(write_job, cli):
    text = job_text(LOADED, settings='zone_module = "1/1000 in"\n')
    code, out, err = cli("check", "--json", write_job(text))
    assert code in (0, 1), err
    joint = json.loads(out)["members"][0]["joints"][0]
    module = [s for s in joint["steps"] if s["key"].endswith(".module")]
    assert module and module[0]["result"]["value"] * MAX_GRID >= 16 * 12 * (1 - 1e-9)


@pytest.mark.parametrize("opening, closing", [("[", "]"), ("{a = ", "}")])
def test_deeply_nested_toml(write_job, cli, opening, closing):
    text = job_text(GOOD) + "deep = " + opening * 50_000 + "1" * (opening != "[") + closing * 50_000 + "\n"
    refused(cli, write_job(text), "nested too deeply")


def test_huge_array_of_text_lines_is_read_once_and_refused_by_key(write_job, cli):
    body = GOOD.replace('id = "M"', 'id = "M"\nnotes = [' + ", ".join(['"x"'] * 300_000) + "]", 1)
    refused(cli, write_job(job_text(body)), "member[M].notes", "at most 50 lines", "300,000")


def test_very_long_text_is_refused(write_job, cli):
    body = GOOD.replace('id = "M"', f'id = "M"\ntitle = "{"t" * (MAX_TEXT + 1)}"', 1)
    refused(cli, write_job(job_text(body)), "member[M].title", f"at most {MAX_TEXT} characters")


def test_vanishing_part_dimension_is_refused(write_job, cli):
    # found by fuzzing: a width of 2.3e-91 in made the section's area zero
    body = GOOD.replace('width = "2 in"', 'width = "2.3e-91 in"', 1)
    refused(cli, write_job(job_text(body)), "member[M].part[web].width", "at least 0.001 in")


@pytest.mark.parametrize(
    "text",
    [
        "__import__('os').system('x')",
        "1 in ** 99999",
        "10 ** 99999 in",
        "9 ** 9 ** 9 in",
        "((((9**4)**4)**4)**4) in",
        "2 ** 2 ** 2 ** 2 ** 2 ** 2 in",
        "eval('1') in",
        "1 in; import os",
        "exec(1) in",
        "1e309 in",
        "[1] in",
    ],
)
def test_unit_strings_are_parsed_never_evaluated(text, write_job, cli, tmp_path):
    marker = tmp_path / "x"
    with pytest.raises(UnitParseError):
        parse(text, "length")
    body = GOOD.replace('depth = "10 in"', f'depth = "{text}"', 1)
    refused(cli, write_job(job_text(body)), "member[M].part[web].depth")
    assert not marker.exists() and not os.path.exists("x")  # nothing ran


def test_ordinary_powers_still_parse():
    assert parse("5 in^2", "area").to("inch**2").magnitude == 5
    assert parse("12 lbf/ft ** 3", "weight_density").to("lbf/ft**3").magnitude == pytest.approx(12)
    assert parse("1210 in^4", "inertia").to("inch**4").magnitude == 1210


# -- report templates: logo paths resolve relative to the template and must be image files ------


def _template_job(tmp_path, logo: str):
    (tmp_path / "firm.toml").write_text(
        f'[firm]\nname = "Harbour Engineers"\nlogo = "{logo}"\n', encoding="utf-8"
    )
    job = tmp_path / "job.toml"
    job.write_text(job_text(GOOD, settings='template = "firm.toml"\n'), encoding="utf-8")
    return job


@pytest.mark.parametrize("kind", ["directory", "fifo", "dev-zero", "not-an-image", "missing"])
def test_logo_must_be_a_regular_image_file(tmp_path, cli, kind):
    if kind == "directory":
        (tmp_path / "logo.png").mkdir()
    elif kind == "fifo":
        if not hasattr(os, "mkfifo"):
            pytest.skip("no FIFOs here")
        os.mkfifo(tmp_path / "logo.png")  # reading it would block forever
    elif kind == "dev-zero":
        if not os.path.exists("/dev/zero"):
            pytest.skip("no /dev/zero")
        os.symlink("/dev/zero", tmp_path / "logo.png")  # endless bytes
    elif kind == "not-an-image":
        (tmp_path / "logo.png").write_text("#!/bin/sh\necho not an image\n", encoding="utf-8")
    job = _template_job(tmp_path, "logo.png")
    out = tmp_path / "out"
    code, stdout, err = cli("build", str(job), "-o", str(out) + "/")
    assert code == 2, err
    assert err.count("\n") == 1 and "settings.template" in err and "firm.logo" in err, err
    assert not out.exists() or list(out.iterdir()) == []


def test_logo_path_is_relative_to_the_template_not_the_working_folder(tmp_path, cli, monkeypatch):
    from PIL import Image

    sub = tmp_path / "tpl"
    sub.mkdir()
    Image.new("RGB", (40, 20), (10, 60, 90)).save(sub / "mark.png")
    (sub / "firm.toml").write_text('[firm]\nlogo = "mark.png"\n', encoding="utf-8")
    job = tmp_path / "job.toml"
    job.write_text(job_text(GOOD, settings='template = "tpl/firm.toml"\n'), encoding="utf-8")
    elsewhere = tmp_path / "elsewhere"
    elsewhere.mkdir()
    Image.new("RGB", (5, 5)).save(elsewhere / "mark.png")
    monkeypatch.chdir(elsewhere)
    from calcreport.outputs.report.template import load_template

    assert load_template("tpl/firm.toml", str(job)).logo == (sub / "mark.png").resolve()
