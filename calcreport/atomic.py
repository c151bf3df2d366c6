"""The one way calcreport writes a file: through a temporary file in the target folder and
``os.replace``, so a reader never sees a half-written report, JSON or job file."""

from __future__ import annotations

import os
import tempfile
from pathlib import Path

__all__ = ["write_atomic"]


def _umask() -> int:
    mask = os.umask(0o022)
    os.umask(mask)
    return mask


def write_atomic(data: bytes | str, out_path: str | os.PathLike) -> Path:
    """Write ``data`` (text is written as UTF-8 with ``\\n`` line ends) to ``out_path`` through a
    temporary file in the same folder and ``os.replace``; the folder is created if needed. On any
    failure the temporary file is removed and the target is left as it was."""
    raw = data.encode("utf-8") if isinstance(data, str) else data
    out = Path(out_path)
    folder = out.parent if str(out.parent) else Path(".")
    folder.mkdir(parents=True, exist_ok=True)
    fd, tmp = tempfile.mkstemp(prefix=f".{out.name}.", suffix=".tmp", dir=folder)
    try:
        with os.fdopen(fd, "wb") as fh:
            fh.write(raw)
            fh.flush()
            os.fsync(fh.fileno())
        os.chmod(tmp, 0o666 & ~_umask())
        os.replace(tmp, out)
    except BaseException:
        try:
            os.unlink(tmp)
        except OSError:
            pass
        raise
    return out
