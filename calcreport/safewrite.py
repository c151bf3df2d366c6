"""Writing outputs so that a reader, a full disk or a kill never leaves a half-written file.

- :func:`write_set` writes one or more files (a report PDF and its results JSON) to temporary
  files in the target folders, flushes each to disk, and only when *all* are complete moves them
  into place with ``os.replace``. If any write fails (a full disk, a quota), every temporary file
  is removed and the earlier files stay exactly as they were.
- Temporary files are named ``.<name>.calcreport-<host>-<pid>-<random>.tmp``; while they exist
  they are listed in :data:`_LIVE`, and :func:`termination_handled` turns SIGTERM (and SIGINT)
  into an exception after removing them, so ``finally`` blocks run and nothing survives.
- A SIGKILL cannot be caught: :func:`remove_stale_temps` (called by every :func:`write_set`)
  deletes, in the folder being written, files of exactly our naming whose process, on this host,
  no longer exists — and, whatever their host, ones older than a day. Nothing else is touched.
"""

from __future__ import annotations

import hashlib
import os
import re
import secrets
import signal
import socket
import stat
import time
from collections.abc import Iterator, Sequence
from contextlib import contextmanager
from pathlib import Path

__all__ = [
    "write_atomic",
    "write_set",
    "remove_stale_temps",
    "termination_handled",
    "Terminated",
    "temp_name",
    "TEMP_PATTERN",
]

STALE_AFTER_S = 24 * 3600
TEMP_PATTERN = re.compile(
    r"^\.(?P<name>.+)\.calcreport-(?P<host>[0-9a-f]{8})-(?P<pid>\d{1,10})-[0-9a-f]{8}\.tmp$"
)
_LIVE: set[str] = set()


class Terminated(KeyboardInterrupt):
    """The process was asked to stop (SIGTERM); temporary files are already removed."""

    def __str__(self) -> str:
        return "terminated (SIGTERM); no file was left half-written"


def _host() -> str:
    return hashlib.sha256(socket.gethostname().encode("utf-8", "replace")).hexdigest()[:8]


def temp_name(target: Path) -> Path:
    """A fresh temporary path beside ``target`` in our naming (see module docstring)."""
    return target.with_name(f".{target.name}.calcreport-{_host()}-{os.getpid()}-{secrets.token_hex(4)}.tmp")


def _umask() -> int:
    mask = os.umask(0o022)
    os.umask(mask)
    return mask


def _write_fd(fd: int, data: bytes) -> None:
    view = memoryview(data)
    while view:
        n = os.write(fd, view)
        view = view[n:]
    os.fsync(fd)


def _discard(paths: Sequence[str]) -> None:
    for p in paths:
        try:
            os.unlink(p)
        except OSError:
            pass
        _LIVE.discard(p)


def write_set(files: Sequence[tuple[str | os.PathLike, bytes]]) -> list[Path]:
    """Write every ``(path, data)`` completely, then move them all into place; all or nothing
    before the moves (see module docstring). Raises OSError with the earlier files untouched."""
    targets = [Path(p) for p, _ in files]
    for t in targets:
        folder = t.parent if str(t.parent) else Path(".")
        folder.mkdir(parents=True, exist_ok=True)
    for folder in dict.fromkeys(t.parent for t in targets):
        remove_stale_temps(folder)
    temps: list[str] = []
    try:
        for t, (_, data) in zip(targets, files):
            tmp = str(temp_name(t))
            fd = os.open(tmp, os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_CLOEXEC", 0), 0o600)
            temps.append(tmp)
            _LIVE.add(tmp)
            try:
                _write_fd(fd, data)
            finally:
                os.close(fd)
            os.chmod(tmp, 0o666 & ~_umask())
        for t, tmp in zip(targets, temps):
            os.replace(tmp, t)
            _LIVE.discard(tmp)
    except BaseException:
        _discard(temps)
        raise
    return targets


def write_atomic(data: bytes | str, out_path: str | os.PathLike) -> Path:
    """Write one file by :func:`write_set` (text as UTF-8 with ``\\n`` line ends)."""
    raw = data.encode("utf-8") if isinstance(data, str) else data
    return write_set([(out_path, raw)])[0]


def _alive(pid: int) -> bool:
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    except (PermissionError, OverflowError, OSError):
        return True  # exists (someone else's) or cannot tell: keep the file
    return True


def remove_stale_temps(folder: str | os.PathLike) -> list[str]:
    """Remove our own temporary files left in ``folder`` by a killed process; return their names."""
    removed: list[str] = []
    host, now, me = _host(), time.time(), os.geteuid() if hasattr(os, "geteuid") else None
    try:
        entries = list(os.scandir(os.fspath(folder)))
    except OSError:
        return removed
    for e in entries:
        m = TEMP_PATTERN.match(str(e.name))
        if not m or os.path.join(str(folder), e.name) in _LIVE:
            continue
        try:
            st = e.stat(follow_symlinks=False)
        except OSError:
            continue
        if not stat.S_ISREG(st.st_mode) or (me is not None and st.st_uid != me):
            continue
        pid = int(m.group("pid"))
        ours_dead = m.group("host") == host and pid != os.getpid() and not _alive(pid)
        if ours_dead or now - st.st_mtime > STALE_AFTER_S:
            try:
                os.unlink(e.path)
                removed.append(str(e.name))
            except OSError:
                pass
    return removed


def _on_signal(signum, frame):  # noqa: ARG001 - signal handler signature
    _discard(sorted(_LIVE))
    if signum == signal.SIGINT:
        raise KeyboardInterrupt
    raise Terminated()


@contextmanager
def termination_handled() -> Iterator[None]:
    """Within the block, SIGTERM and SIGINT remove our temporary files and raise
    :class:`Terminated` / :class:`KeyboardInterrupt` (so ``finally`` blocks run); the previous
    handlers come back afterwards. Outside the main thread it does nothing (Python allows signal
    handlers only there)."""
    try:
        before = {s: signal.signal(s, _on_signal) for s in (signal.SIGTERM, signal.SIGINT)}
    except ValueError:  # not the main thread
        yield
        return
    try:
        yield
    finally:
        for s, h in before.items():
            signal.signal(s, h)
