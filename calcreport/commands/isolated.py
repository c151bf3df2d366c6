"""Run batch tasks in child processes so that a dead or stuck job fails alone.

``workers`` child processes (``multiprocessing`` with the ``fork`` start method where the
platform has it: the parent's loaded modules and fonts are inherited) each take one job at a time
through a pipe and answer with its :class:`~.batch.Outcome`. The parent always knows which job
each child holds, so:

- a child that dies without answering (killed, out of memory, a crash in a C library) fails only
  the job it held, with one line naming the signal or exit code; a fresh child takes its place
  and the remaining jobs go on;
- with ``timeout``, a child still on the same job after that many seconds is stopped (SIGTERM, so
  it removes its temporary files, then SIGKILL after a grace period), its job fails with one line,
  and a fresh child takes its place.

A :class:`concurrent.futures.ProcessPoolExecutor` cannot do this: one dead worker breaks the pool
and fails every job still pending, and it cannot say which job the dead worker held.
"""

from __future__ import annotations

import multiprocessing as mp
import signal
import time
from collections import deque
from collections.abc import Callable, Sequence
from multiprocessing.connection import wait

__all__ = ["run_isolated", "TERM_GRACE_S"]

TERM_GRACE_S = 3.0


def _context():
    methods = mp.get_all_start_methods()
    return mp.get_context("fork" if "fork" in methods else methods[0])


def _worker(work: Callable, conn) -> None:
    """Child loop: a task in, its outcome out, until the parent closes the pipe or sends None."""
    from ..safewrite import termination_handled

    try:
        with termination_handled():  # SIGTERM: temporary files removed, then we exit
            signal.signal(signal.SIGINT, signal.SIG_IGN)  # Ctrl-C: the parent stops us by SIGTERM
            while True:
                try:
                    task = conn.recv()
                except (EOFError, OSError):
                    break
                if task is None:
                    break
                conn.send(work(task))
    except BaseException:  # Terminated: say nothing, the parent reports the job
        pass
    finally:
        conn.close()


def _signal_name(code: int | None) -> str:
    if code is None:
        return "no exit status"
    if code < 0:
        try:
            return f"killed by {signal.Signals(-code).name}"
        except ValueError:
            return f"killed by signal {-code}"
    return f"exit code {code}"


def _stop(proc) -> None:
    if proc.is_alive():
        proc.terminate()  # SIGTERM: the child removes its temporary files
        proc.join(TERM_GRACE_S)
    if proc.is_alive():
        proc.kill()
        proc.join(TERM_GRACE_S)


class _Child:
    def __init__(self, ctx, work: Callable):
        self.conn, child_end = ctx.Pipe(duplex=True)
        self.proc = ctx.Process(target=_worker, args=(work, child_end), daemon=True)
        self.proc.start()
        child_end.close()
        self.job: int | None = None
        self.since = 0.0

    def give(self, i: int, task) -> None:
        self.job, self.since = i, time.monotonic()
        self.conn.send(task)

    def close(self) -> None:
        try:
            self.conn.send(None)
        except OSError:
            pass
        self.proc.join(TERM_GRACE_S)
        _stop(self.proc)
        self.conn.close()


def run_isolated(
    tasks: Sequence,
    workers: int,
    work: Callable,
    failed: Callable[[int, str], object],
    timeout: float | None = None,
    done: Callable[[int], None] | None = None,
) -> dict[int, object]:
    """Outcomes by task index. ``failed(i, why)`` makes the outcome of a job whose child died or
    ran out of time; ``done(i)`` is called as each job finishes (for progress)."""
    ctx = _context()
    pending = deque(range(len(tasks)))
    children: list[_Child] = []
    results: dict[int, object] = {}

    def finish(i: int, outcome: object) -> None:
        results[i] = outcome
        if done is not None:
            done(i)

    try:
        while pending or any(c.job is not None for c in children):
            children = [
                c for c in children if c.job is not None or c.proc.is_alive()
            ]  # never drop a held job
            while len(children) < min(
                max(1, workers), len(pending) + sum(c.job is not None for c in children)
            ):
                children.append(_Child(ctx, work))
            for c in children:
                if c.job is None and pending:
                    i: int = pending.popleft()
                    try:
                        c.give(i, tasks[i])
                    except OSError:  # the child is already gone: it answers as dead below
                        pass
            busy = [c for c in children if c.job is not None]
            wait_for = None
            if timeout is not None and busy:
                wait_for = max(0.0, min(c.since + timeout for c in busy) - time.monotonic())
            wait([c.conn for c in busy] + [c.proc.sentinel for c in busy], wait_for)
            for c in busy:
                if c.job is None:
                    continue
                i = c.job
                outcome = None
                if c.conn.poll():
                    try:
                        outcome = c.conn.recv()
                    except (EOFError, OSError):
                        outcome = None
                    if outcome is None:
                        c.proc.join(TERM_GRACE_S)
                        outcome = failed(i, f"the build process died ({_signal_name(c.proc.exitcode)})")
                elif not c.proc.is_alive():
                    c.proc.join()
                    outcome = failed(i, f"the build process died ({_signal_name(c.proc.exitcode)})")
                elif timeout is not None and time.monotonic() - c.since >= timeout:
                    _stop(c.proc)
                    outcome = failed(i, f"stopped after the time limit of {timeout:g} s (--timeout)")
                if outcome is not None:
                    c.job = None
                    if not c.proc.is_alive():
                        c.conn.close()
                    finish(i, outcome)
    finally:
        for c in children:  # normal end: each idle child is told to stop; interrupted: stopped
            if c.job is None:
                c.close()
            else:
                _stop(c.proc)
                c.conn.close()
    return results
