"""The one date a PDF carries, computed the same way on every machine.

A report's ``/CreationDate``, ``/ModDate`` and ``/ID`` come from the job's ``[job] date``
(``YYYY-MM-DD``, taken as 00:00 UTC with :func:`calendar.timegm` — never the local time zone),
else from ``SOURCE_DATE_EPOCH`` (whole seconds since 1970-01-01 UTC, the reproducible-builds
convention), else 2000-01-01 UTC. The bytes therefore do not depend on TZ, LANG/LC_ALL, the
working directory or ``-j``.

A ``SOURCE_DATE_EPOCH`` that is set but is not a whole number of seconds from 0 to
253402300799 (9999-12-31) is refused with one line (:class:`EpochError`) before anything is
built — whether or not the job's date overrides it, so the outcome never depends on the job.
reportlab reads the variable itself (with ``int()``) whenever it starts a document, so
:func:`reportlab_epoch` sets it to our validated value for the duration of a render.
"""

from __future__ import annotations

import calendar
import os
import re
from collections.abc import Iterator, Mapping
from contextlib import contextmanager

__all__ = ["EpochError", "source_date_epoch", "job_epoch", "timestamp", "reportlab_epoch", "DEFAULT_EPOCH"]

DEFAULT_EPOCH = 946_684_800  # 2000-01-01 00:00:00 UTC
MAX_EPOCH = 253_402_300_799  # 9999-12-31 23:59:59 UTC
_VAR = "SOURCE_DATE_EPOCH"
_DATE = re.compile(r"(\d{4})-(\d{2})-(\d{2})")


class EpochError(ValueError):
    """SOURCE_DATE_EPOCH is set to something that is not whole seconds since 1970 (one line)."""


def source_date_epoch(environ: Mapping[str, str] | None = None) -> int | None:
    """``SOURCE_DATE_EPOCH`` as whole seconds, None when unset or empty; raises :class:`EpochError`."""
    env = os.environ if environ is None else environ
    raw = env.get(_VAR)
    if raw is None or raw.strip() == "":
        return None
    text = raw.strip()
    if not (text.isascii() and text.isdigit() and len(text) <= 12) or int(text) > MAX_EPOCH:
        shown = text[:40] + ("…" if len(text) > 40 else "")
        raise EpochError(
            f"{_VAR}: expected whole seconds since 1970-01-01 UTC from 0 to {MAX_EPOCH} "
            f"(like 1767225600), got {shown!r}; unset it or fix it"
        )
    return int(text)


def job_epoch(job_date: str, environ: Mapping[str, str] | None = None) -> int:
    """Seconds since 1970 UTC for a report of a job dated ``job_date`` (see module docstring)."""
    epoch = source_date_epoch(environ)  # validated even when the job's date wins
    m = _DATE.fullmatch((job_date or "").strip())
    if m:
        y, mo, d = (int(g) for g in m.groups())
        try:
            if 1 <= mo <= 12 and 1 <= d <= calendar.monthrange(y, mo)[1] and y >= 1:
                return calendar.timegm((y, mo, d, 0, 0, 0))
        except (ValueError, OverflowError):
            pass
    return epoch if epoch is not None else DEFAULT_EPOCH


def timestamp(job_date: str, environ: Mapping[str, str] | None = None):
    """A reportlab ``TimeStamp`` at :func:`job_epoch`, in UTC (offset +00'00')."""
    import time

    from reportlab.lib.utils import TimeStamp

    t = job_epoch(job_date, environ)
    with reportlab_epoch(t):
        ts = TimeStamp(invariant=1)
    lt = tuple(time.gmtime(t))
    ts.t = float(t)
    ts.lt = lt
    ts.YMDhms = lt[:6]
    ts.dhh = ts.dmm = 0
    ts.tzname = "UTC"
    return ts


@contextmanager
def reportlab_epoch(seconds: int) -> Iterator[None]:
    """Within the block, ``SOURCE_DATE_EPOCH`` is ``seconds`` (reportlab reads it with ``int()``);
    the previous value, or its absence, is restored afterwards."""
    before = os.environ.get(_VAR)
    os.environ[_VAR] = str(int(seconds))
    try:
        yield
    finally:
        if before is None:
            os.environ.pop(_VAR, None)
        else:
            os.environ[_VAR] = before
