"""Results JSON is stable for git: same bytes from anywhere, sorted keys, 6 significant figures,
no timestamps or absolute paths, and written atomically next to the PDF (``build --json``).

Stability requirements are common practice for files kept under version control, no source.
"""

from __future__ import annotations

import json
import re

from review_helpers import demo_text, run, write

from calcreport.outputs.json_out import dumps, json_path_for, to_dict, write_results_json
from calcreport.pipeline import solve_file


def _numbers(node):
    if isinstance(node, dict):
        for v in node.values():
            yield from _numbers(v)
    elif isinstance(node, list):
        for v in node:
            yield from _numbers(v)
    elif isinstance(node, float):
        yield node


def test_same_bytes_from_two_folders_and_no_paths(tmp_path):
    a = write((tmp_path / "one").mkdir() or tmp_path / "one" / "job.toml", demo_text())
    b = write((tmp_path / "two").mkdir() or tmp_path / "two" / "job.toml", demo_text())
    ta, tb = dumps(to_dict(solve_file(a))), dumps(to_dict(solve_file(b)))
    assert ta == tb
    assert str(tmp_path) not in ta and "/one/" not in ta
    assert json.loads(ta)["job"]["file"] == "job.toml"


def test_sorted_keys_six_significant_figures_no_timestamps(tmp_path):
    text = dumps(to_dict(solve_file(write(tmp_path / "job.toml", demo_text()))))
    data = json.loads(text)
    assert dumps(data) == text  # already in sorted-key canonical form
    assert text.endswith("}\n")
    for x in _numbers(data):
        assert float(f"{x:.6g}") == x
    assert not re.search(r"\d{4}-\d\d-\d\dT\d\d:\d\d", text)  # no ISO timestamps
    assert "time" not in {k.lower() for k in _keys(data)}


def _keys(node):
    if isinstance(node, dict):
        for k, v in node.items():
            yield k
            yield from _keys(v)
    elif isinstance(node, list):
        for v in node:
            yield from _keys(v)


def test_write_results_json_beside_the_pdf(tmp_path, capsys):
    job = write(tmp_path / "job.toml", demo_text())
    result = solve_file(job)
    out = write_results_json(result, tmp_path / "report.pdf")
    assert out == json_path_for(tmp_path / "report.pdf")
    assert out.name == "report.json"
    code, expected, _ = run(["check", "--json", job], capsys)
    assert out.read_text(encoding="utf-8") == expected
    assert sorted(p.name for p in tmp_path.iterdir()) == ["job.toml", "report.json"]
