"""The environment every cold-process benchmark gives the tool and its import floor alike.

* one BLAS thread (``calcreport/cli.py`` sets it for itself; the floor needs it given);
* bytecode compiled and read back: ``PYTHONDONTWRITEBYTECODE`` is dropped and
  ``PYTHONPYCACHEPREFIX`` points at a cache folder of this run, so the warm-up run of each
  command writes the bytecode of every module it imports (ours and the libraries') and the timed
  runs read it — as an installed tool does (pip compiles on install). Without this, a shell that
  sets ``PYTHONDONTWRITEBYTECODE`` (the development container does) makes every timed ``build``
  compile calcreport's ~110 modules from source while the floor reads the libraries' installed
  bytecode: a few hundred milliseconds on our side only. The cache folder lives outside every
  source tree (a before tree is never written to) and is removed at exit.
"""

from __future__ import annotations

import atexit
import os
import shutil
import tempfile
from pathlib import Path

__all__ = ["footing_env", "PYCACHE"]

PYCACHE = Path(tempfile.mkdtemp(prefix="calcreport-bench-pyc-"))
atexit.register(shutil.rmtree, PYCACHE, ignore_errors=True)


def footing_env(src: Path) -> dict[str, str]:
    """``os.environ`` with ``src`` first on ``PYTHONPATH``, one BLAS thread and compiled bytecode."""
    env = dict(os.environ, PYTHONPATH=str(src) + os.pathsep + os.environ.get("PYTHONPATH", ""))
    env["OPENBLAS_NUM_THREADS"] = env["OMP_NUM_THREADS"] = env["MKL_NUM_THREADS"] = "1"
    env.pop("PYTHONDONTWRITEBYTECODE", None)
    env["PYTHONPYCACHEPREFIX"] = str(PYCACHE)
    return env
