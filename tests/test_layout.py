"""The pipeline's direction: nothing downstream reaches back upstream (DEVELOPERS.md, "The pipeline")."""

from __future__ import annotations

import ast
import subprocess
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
PKG = ROOT / "calcreport"


def _imports(path: Path) -> set[str]:
    """Absolute names of the calcreport modules ``path`` imports (relative imports resolved)."""
    mod = ".".join(path.relative_to(ROOT).with_suffix("").parts)
    package = mod if path.name == "__init__.py" else mod.rsplit(".", 1)[0]
    if path.name == "__init__.py":
        package = mod.removesuffix(".__init__")
    out: set[str] = set()
    for node in ast.walk(ast.parse(path.read_text(encoding="utf-8"))):
        if isinstance(node, ast.ImportFrom):
            if node.level:
                base = package.split(".")
                base = base[: len(base) - node.level + 1]
                name = ".".join(base + ([node.module] if node.module else []))
            else:
                name = node.module or ""
            out.add(name)
            out.update(f"{name}.{a.name}" for a in node.names)
        elif isinstance(node, ast.Import):
            out.update(a.name for a in node.names)
    return {n for n in out if n.startswith("calcreport")}


def _modules(folder: str):
    return sorted((PKG / folder).rglob("*.py")) if folder else sorted(PKG.glob("*.py"))


def test_nothing_imports_the_command_line_module():
    """The package reaches the pipeline through calcreport.pipeline; tests and benchmarks take only
    ``main`` from the CLI (to run commands as a user would)."""
    offenders = [
        str(p.relative_to(ROOT))
        for p in sorted(PKG.rglob("*.py"))
        if p.name != "__main__.py" and "calcreport.cli" in _imports(p)
    ]
    assert offenders == []
    for p in sorted((ROOT / "tests").glob("*.py")) + sorted((ROOT / "benchmarks").glob("*.py")):
        used = {n for n in _imports(p) if n.startswith("calcreport.cli.")}
        assert used <= {"calcreport.cli.main"}, (p.name, used)


def test_job_reader_does_not_import_the_solver_or_outputs():
    for p in _modules("jobfile"):
        bad = {
            n
            for n in _imports(p)
            if n.startswith(("calcreport.solve", "calcreport.outputs", "calcreport.review"))
        }
        assert not bad, (p.name, bad)


def test_solver_does_not_import_reader_outputs_or_review():
    for p in _modules("solve"):
        bad = {
            n
            for n in _imports(p)
            if n.startswith(("calcreport.jobfile", "calcreport.outputs", "calcreport.review"))
        }
        assert not bad, (p.name, bad)


def test_outputs_do_not_import_review_or_reader():
    for p in _modules("outputs"):
        bad = {n for n in _imports(p) if n.startswith(("calcreport.review", "calcreport.jobfile"))}
        assert not bad, (p.name, bad)


def test_loading_a_job_imports_no_solver_module():
    code = (
        "import sys, calcreport.jobfile as j; j.load_job('jobs/pavilion-plate-girder.toml'); "
        "print([m for m in sys.modules if m.startswith('calcreport.solve')])"
    )
    r = subprocess.run([sys.executable, "-c", code], cwd=ROOT, capture_output=True, text=True, check=True)
    assert r.stdout.strip() == "[]"
