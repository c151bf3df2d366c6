"""Where a job may take its report template, logo and fonts from.

A job file arrives from many hands; its ``[settings] template`` (and the template's logo and font
paths) may name any path. By default each file must resolve — symbolic links followed — inside
the job file's folder (or below it) or inside the templates shipped with calcreport, so a job
cannot make the tool read, embed or quote a file from elsewhere on the machine
(``../../home/x/.ssh/id_rsa.png``). ``build --allow-outside`` (and ``diff --allow-outside``)
lifts the rule for a user who means it.
"""

from __future__ import annotations

from pathlib import Path

__all__ = ["allowed_roots", "outside_message"]


def allowed_roots(job_path: str) -> list[Path]:
    """The job's folder and the shipped template folders, resolved."""
    from ...resources import templates_dir

    roots = [Path(job_path).resolve().parent]
    shipped = Path(str(templates_dir()))
    if shipped.is_dir():
        roots.append(shipped.resolve())
    return roots


def outside_message(path: Path, job_path: str) -> str:
    """'' when ``path`` resolves inside :func:`allowed_roots`, else the end of an error line."""
    real = Path(path).resolve()
    for root in allowed_roots(job_path):
        if real == root or real.is_relative_to(root):
            return ""
    return (
        "resolves outside the job's folder and the shipped templates; put the file beside the job "
        "file, or build with --allow-outside"
    )
