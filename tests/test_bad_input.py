"""Bad input: one line naming the file and key (and line), what was expected; exit 2; no traceback."""

from __future__ import annotations

import pytest

from tests.conftest import TEE_PARTS, job_text

GOOD = (
    """
[[member]]
id = "M"
shear = "1 kip"

"""
    + TEE_PARTS
    + """
[[member.joint]]
id = "j"
holds = ["fl"]

[member.joint.connector]
type = "given"
value = "100 lbf"
source = "test value"
"""
)

CASES = [
    # (name, replace-from, replace-to, words expected in the message,
    #  (text after which to look, text of the line the message must name) or None)
    ("toml syntax", 'id = "M"', 'id = "M', ["TOML syntax error"], None),
    (
        "unknown key",
        'depth = "10 in"',
        'dept = "10 in"',
        ["member[M].part[web].dept", "unknown key", "did you mean 'depth'"],
        ("[[member]]", "dept ="),
    ),
    (
        "missing key",
        'width = "2 in"\n',
        "",
        ["member[M].part[web]", "missing required key 'width'"],
        ("[[member]]", "[[member.part]]"),
    ),
    (
        "wrong dimension",
        'depth = "10 in"',
        'depth = "10 kip"',
        ["member[M].part[web].depth", "expected a length", "force"],
        ("[[member]]", "depth ="),
    ),
    (
        "bare number",
        'depth = "10 in"',
        "depth = 10",
        ["member[M].part[web].depth", "bare number"],
        ("[[member]]", "depth ="),
    ),
    (
        "zero size",
        'width = "8 in"',
        'width = "0 in"',
        ["member[M].part[fl].width", "greater than zero"],
        ("[[member]]", 'width = "0 in"'),
    ),
    (
        "negative size",
        'width = "8 in"',
        'width = "-8 in"',
        ["member[M].part[fl].width", "greater than zero"],
        ("[[member]]", 'width = "-8 in"'),
    ),
    ("unknown part", 'on = "web"', 'on = "wbe"', ["member[M].part[fl].on", "'wbe'"], ("[[member]]", "on =")),
    (
        "unknown material",
        'material = "wood"\non',
        'material = "oak"\non',
        ["member[M].part[fl].material", "'oak'"],
        ("[[member]]", 'material = "oak"'),
    ),
    (
        "unknown held part",
        'holds = ["fl"]',
        'holds = ["flange"]',
        ["member[M].joint[j].holds", "'flange'"],
        ("[[member]]", "holds ="),
    ),
    (
        "duplicate id",
        'id = "fl"',
        'id = "web"',
        ["member[M].part[web].id", "duplicate part id"],
        ('depth = "10 in"', 'id = "web"'),
    ),
    (
        "whole section held",
        'holds = ["fl"]',
        'holds = ["fl", "web"]',
        ["member[M].joint[j].holds", "whole section"],
        ("[[member]]", "holds ="),
    ),
    (
        "overlap",
        'on = "web"',
        'at = ["0 in", "9 in"]',
        ["member[M].part[fl]", "overlaps part 'web'"],
        ('depth = "10 in"', "[[member.part]]"),
    ),
    (
        "isolated",
        'on = "web"',
        'at = ["0 in", "12 in"]',
        ["member[M].part[fl]", "touches no other part"],
        ('depth = "10 in"', "[[member.part]]"),
    ),
    (
        "bad unit",
        'value = "100 lbf"',
        'value = "100 lbz"',
        ["member[M].joint[j].connector.value", "could not read"],
        ("[[member]]", "value ="),
    ),
    (
        "bad connector type",
        'type = "given"',
        'type = "nial"',
        ["member[M].joint[j].connector.type", "expected one of"],
        ("[[member]]", "type ="),
    ),
    (
        "bad method",
        'method = "ASD"',
        'method = "LFRD"',
        ["settings.method", "ASD, LRFD"],
        ("[settings]", "method ="),
    ),
]


def line_of(text: str, after: str, marker: str) -> int:
    at = text.index(marker, text.index(after))
    return text.count("\n", 0, at) + 1


@pytest.mark.parametrize("name, old, new, words, where", CASES, ids=[c[0] for c in CASES])
def test_bad_input_one_line_exit_2(name, old, new, words, where, write_job, cli):
    text = job_text(GOOD)
    assert old in text
    text = text.replace(old, new, 1)
    path = write_job(text)
    code, out, err = cli("check", path)
    assert code == 2, (out, err)
    assert out == ""
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    assert "Traceback" not in err
    assert lines[0].startswith(path + ":")
    for w in words:
        assert w in lines[0], (w, lines[0])
    if where is not None:
        number = line_of(text, *where)
        assert lines[0].startswith(f"{path}:{number}:"), (number, lines[0])


def test_toml_syntax_error_names_a_line(write_job, cli):
    path = write_job(job_text(GOOD).replace('id = "M"', 'id = "M', 1))
    code, _, err = cli("check", path)
    assert code == 2 and err.split(":")[1].isdigit(), err


def test_good_job_passes(write_job, cli):
    code, out, err = cli("check", write_job(job_text(GOOD)))
    assert code == 0, err
    assert "OK" in out


def test_missing_file(cli, tmp_path):
    code, out, err = cli("check", str(tmp_path / "nope.toml"))
    assert code == 2 and "cannot read the file" in err and len(err.strip().splitlines()) == 1


def test_usage_error_exit_2(cli):
    code, out, err = cli("check")
    assert code == 2


def test_misspelt_key_is_named_before_a_missing_one(write_job, cli):
    # `vertices` instead of `points`: the message names the unknown key, not a missing `points`.
    text = job_text(GOOD).replace(
        'shape = "rect"\nwidth = "2 in"\ndepth = "10 in"',
        'shape = "polygon"\nvertices = [["0 in", "0 in"], ["2 in", "0 in"], ["2 in", "10 in"]]',
        1,
    )
    code, _, err = cli("check", write_job(text))
    assert code == 2 and "unknown key 'vertices'" in err and len(err.strip().splitlines()) == 1, err


def test_misspelt_table_name_gets_a_line_and_a_suggestion(write_job, cli):
    text = job_text(GOOD) + '\n[[jobs.history]]\nmark = "A"\n'
    path = write_job(text)
    code, _, err = cli("check", path)
    assert code == 2 and "did you mean 'job'" in err, err
    assert err.startswith(f"{path}:{text[: text.index('[[jobs.history]]')].count(chr(10)) + 1}:"), err
