"""Files shipped inside the package (starter jobs, report templates, fonts), read with
:mod:`importlib.resources` so they are found wherever the package is installed."""

from __future__ import annotations

from importlib.resources import files
from importlib.resources.abc import Traversable
from pathlib import Path

__all__ = ["STARTERS", "templates_dir", "starter_text", "builtin_template", "builtin_template_names"]

#: ``calcreport new --kind`` → starter job file in ``calcreport/data/templates/``.
STARTERS = {
    "box": "starter-box-beam.toml",
    "girder": "starter-plate-girder.toml",
    "tee": "starter-glued-tee.toml",
    "plies": "starter-multi-ply-header.toml",
    "side-loaded": "starter-side-loaded-3-ply.toml",
    "flitch": "starter-flitch-beam.toml",
}


def templates_dir() -> Traversable:
    """The folder of shipped starter jobs and report templates."""
    return files("calcreport").joinpath("data", "templates")


def starter_text(kind: str) -> str:
    """The text of the starter job of ``kind`` (a key of :data:`STARTERS`)."""
    return templates_dir().joinpath(STARTERS[kind]).read_text(encoding="utf-8")


def builtin_template(name: str) -> Path | None:
    """The shipped report template called ``name`` (``a4`` or ``report-a4``), or None."""
    for candidate in (f"report-{name}.toml", f"{name}.toml"):
        if not candidate.startswith("report-"):
            continue
        item = templates_dir().joinpath(candidate)
        if item.is_file():
            return Path(str(item))
    return None


def builtin_template_names() -> list[str]:
    """Names of the shipped report templates (``letter``, ``a4``)."""
    return sorted(
        p.name.removeprefix("report-").removesuffix(".toml")
        for p in templates_dir().iterdir()
        if p.name.startswith("report-") and p.name.endswith(".toml")
    )
