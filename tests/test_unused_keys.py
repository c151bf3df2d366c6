"""Keys without effect: an error naming the key and why, or a warning printed and reported.

The rule is the project's (a key that has no effect is an error or a visible warning); which keys
are errors and which warn is listed in docs/job-format.md, "Keys without effect".
"""

from __future__ import annotations

import json

import pytest

from calcreport.jobfile import load_text
from tests.conftest import job_text
from tests.test_bad_input import GOOD

LOADED = GOOD.replace(
    'shear = "1 kip"', 'span = "16 ft"\n\n[[member.load]]\ncase = "D"\nkind = "uniform"\nw = "100 plf"\n', 1
)
GLUED = GOOD.replace('type = "given"\nvalue = "100 lbf"', 'type = "glue"\ntau = "100 psi"', 1)


def one_line_error(cli, path: str) -> str:
    code, out, err = cli("check", path)
    assert code == 2 and out == "" and "Traceback" not in err, (code, err[:300])
    lines = err.strip().splitlines()
    assert len(lines) == 1 and lines[0].startswith(path + ":")
    return lines[0]


def warnings_of(cli, path: str) -> list[str]:
    code, out, err = cli("check", path)
    assert code in (0, 1) and out and "Traceback" not in err, (code, err[:300])
    return err.strip().splitlines()


@pytest.mark.parametrize(
    ("body", "key"),
    [
        (LOADED.replace('span = "16 ft"', 'shear = "1 kip"\nspan = "16 ft"', 1), "member[M].shear"),
        (
            GOOD.replace('shear = "1 kip"', 'shear = "1 kip"\nspan = "16 ft"\nself_weight = true', 1),
            "member[M].shear",
        ),
    ],
)
def test_shear_with_loads_along_the_member_is_an_error(write_job, cli, body, key):
    mats = '[[material]]\nid = "wood"\nfamily = "wood"\nE = "1600 ksi"\nFv = "180 psi"\ndensity = "35 pcf"\n'
    line = one_line_error(cli, write_job(job_text(body, materials=mats)))
    assert key in line and "no effect" in line and "shear envelope" in line
    assert line.split(":")[1].isdigit()  # the line of the key


@pytest.mark.parametrize("key", ["per_row = 2", 'spacing_max = "6 in"', 'spacing_min = "1 in"'])
def test_spacing_keys_on_a_continuous_connector_are_errors(write_job, cli, key):
    body = GLUED.replace('holds = ["fl"]', f'holds = ["fl"]\n{key}', 1)
    line = one_line_error(cli, write_job(job_text(body)))
    name = key.split(" =")[0]
    assert f"member[M].joint[j].{name}" in line and "continuous connector" in line


@pytest.mark.parametrize(
    ("body", "settings", "key"),
    [
        (GOOD, "zone_module = '6 in'\n", "settings.zone_module"),
        (GOOD, "zones_per_half = 2\n", "settings.zones_per_half"),
        (GOOD, "load_duration = 1.15\n", "settings.load_duration"),  # no NDS connector
        (GLUED, "spacing_max = '6 in'\n", "settings.spacing_max"),
        (GOOD, "[settings.deflection_limits]\nL = 360\n", "settings.deflection_limits"),
        (LOADED, "[settings.deflection_limits]\nS = 240\n", "settings.deflection_limits.S"),
    ],
)
def test_settings_without_effect_warn_on_stderr(write_job, cli, body, settings, key):
    path = write_job(job_text(body, settings=settings))
    lines = warnings_of(cli, path)
    assert len(lines) == 1
    where, rest = lines[0].split(f": {key}: warning: ")
    assert where.startswith(path + ":") and where.rsplit(":", 1)[1].isdigit() and rest
    job = load_text(job_text(body, settings=settings).encode())
    assert [w.key for w in job.warnings] == [key]


def test_lrfd_load_duration_warns():
    text = job_text(GOOD, settings="load_duration = 1.15\n").replace('method = "ASD"', 'method = "LRFD"')
    (w,) = load_text(text.encode()).warnings
    assert w.key == "settings.load_duration" and "ASD only" in w.message


def test_settings_with_effect_do_not_warn(cli):
    from tests.conftest import ROOT

    for job in sorted((ROOT / "jobs").glob("*.toml")):
        code, _, err = cli("check", str(job))
        assert code == 0 and err == "", (job, err)


def test_warnings_in_json_and_in_the_report(write_job, cli, tmp_path):
    pypdf = pytest.importorskip("pypdf")
    path = write_job(job_text(GOOD, settings="zone_module = '6 in'\n"))
    code, out, _ = cli("check", "--json", path)
    data = json.loads(out)
    assert data["warnings"][0]["key"] == "settings.zone_module" and data["warnings"][0]["line"]
    pdf = tmp_path / "out.pdf"
    code, _, err = cli("build", path, "-o", str(pdf))
    assert code == 0 and "settings.zone_module: warning:" in err
    text = "".join(p.extract_text() or "" for p in pypdf.PdfReader(str(pdf)).pages)
    assert "settings.zone_module" in text and "(warnings)" in text


def test_products_listed_in_the_report_as_written(write_job, cli, tmp_path):
    pypdf = pytest.importorskip("pypdf")
    body = LOADED.replace('w = "100 plf"', 'w = "10 psf * 10 ft"', 1)
    path = write_job(job_text(body))
    code, out, _ = cli("check", "--json", path)
    (w,) = json.loads(out)["written"]
    assert w["text"] == "10 psf * 10 ft" and w["key"] == "member[M].load[1].w"
    pdf = tmp_path / "out.pdf"
    assert cli("build", path, "-o", str(pdf))[0] == 0
    text = "".join(p.extract_text() or "" for p in pypdf.PdfReader(str(pdf)).pages)
    assert "10 psf * 10 ft" in text and "products or quotients" in text


NAILED = GOOD.replace(
    'type = "given"\nvalue = "100 lbf"\nsource = "test value"', 'type = "nail"\nsize = "16d common"', 1
)
NAIL_WOOD = '[[material]]\nid = "wood"\nfamily = "wood"\nE = "1600 ksi"\nFv = "180 psi"\nG = 0.50\n'


@pytest.mark.parametrize(
    ("method", "extra", "key", "why"),
    [
        # NDS 2018 Table 11.3.1: C_D is an ASD factor, λ an LRFD factor (from memory)
        ("LRFD", "CD = 1.15", "CD", "ASD only"),
        ("ASD", "time_effect = 0.8", "time_effect", "LRFD only"),
        ("ASD", "CM = 0.7\nwet_service = true", "wet_service", "CM overrides"),
        ("ASD", 'row_spacing = "4 in"', "row_spacing", "row_count = 1"),
    ],
)
def test_nds_connector_keys_without_effect_are_errors(write_job, cli, method, extra, key, why):
    body = NAILED.replace('size = "16d common"', f'size = "16d common"\n{extra}', 1)
    text = job_text(body, materials=NAIL_WOOD).replace('method = "ASD"', f'method = "{method}"')
    line = one_line_error(cli, write_job(text))
    assert f"member[M].joint[j].connector.{key}" in line and why in line


def test_nds_connector_keys_with_effect_are_accepted():
    text = job_text(
        NAILED.replace('size = "16d common"', 'size = "16d common"\nCD = 1.15', 1), materials=NAIL_WOOD
    )
    assert load_text(text.encode()).warnings == ()
