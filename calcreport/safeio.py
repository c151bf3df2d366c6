"""File access that a hostile or careless path cannot stall: regular files only, size-capped reads.

Every file the tool reads on a user's say-so (job files, report templates, logos, PDFs given to
``verify``) goes through :func:`read_regular`: it opens without blocking (``O_NONBLOCK``, so a
FIFO with no writer cannot hang the open), refuses anything that is not a regular file (a FIFO,
a device such as ``/dev/zero``, a directory, a socket) and reads at most ``limit`` bytes, so a
file that grows while it is read cannot exhaust memory either.

Writing (``write_set``) and stale temporary files (``remove_stale_temps``) live in
:mod:`calcreport.safewrite`.
"""

from __future__ import annotations

import os
import stat

__all__ = ["FileRefused", "read_regular", "read_input", "file_kind"]


class FileRefused(Exception):
    """The path cannot be read as asked; ``str()`` is one line without the path."""


def file_kind(mode: int) -> str:
    """Words for a non-regular file type, for messages."""
    if stat.S_ISDIR(mode):
        return "a folder"
    if stat.S_ISFIFO(mode):
        return "a named pipe (FIFO)"
    if stat.S_ISCHR(mode) or stat.S_ISBLK(mode):
        return "a device"
    if stat.S_ISSOCK(mode):
        return "a socket"
    return "not a regular file"


def read_regular(path: str | os.PathLike, limit: int, what: str = "file") -> bytes:
    """The bytes of the regular file at ``path``, at most ``limit`` of them.

    Raises:
        FileRefused: missing or unreadable, not a regular file, or larger than ``limit`` bytes
            (``what`` names the kind of file in the message, e.g. "a job file").
    """
    flags = (
        os.O_RDONLY | getattr(os, "O_NONBLOCK", 0) | getattr(os, "O_NOCTTY", 0) | getattr(os, "O_CLOEXEC", 0)
    )
    try:
        fd = os.open(path, flags)
    except IsADirectoryError:
        raise FileRefused(f"expected {what}, got a folder") from None
    except OSError as exc:
        raise FileRefused(f"cannot read the file ({exc.strerror or exc})") from None
    try:
        st = os.fstat(fd)
        if not stat.S_ISREG(st.st_mode):
            raise FileRefused(f"expected {what} (a regular file), got {file_kind(st.st_mode)}")
        if st.st_size > limit:
            raise FileRefused(f"file is {st.st_size:,} bytes; {what} may have at most {limit:,}")
        chunks, total = [], 0
        while True:
            chunk = os.read(fd, min(1 << 20, limit + 1 - total))
            if not chunk:
                break
            chunks.append(chunk)
            total += len(chunk)
            if total > limit:
                raise FileRefused(
                    f"file grew past {limit:,} bytes while it was read; {what} may have at most that"
                )
        return b"".join(chunks)
    except OSError as exc:
        raise FileRefused(f"cannot read the file ({exc.strerror or exc})") from None
    finally:
        os.close(fd)


def read_input(path: str | os.PathLike, limit: int, what: str = "file") -> bytes:
    """:func:`read_regular`, with a refusal raised as the one-line :class:`~calcreport.errors.JobError`
    that names ``path`` (exit code 2)."""
    from .errors import JobError

    try:
        return read_regular(path, limit, what)
    except FileRefused as exc:
        raise JobError(str(path), "", str(exc)) from None
