"""Import reportlab's page-layout package without compiling patterns a report never uses.

Importing ``reportlab.platypus`` compiles, at module level, a URL pattern of the paragraph
module (``uri_pat``: case-insensitive character classes up to U+FFFF, which the ``re`` compiler
case-folds range by range) and the Python-source colouring patterns of ``PyFontify`` (for
preformatted code listings). Together they are 70-100 ms of every ``build`` — about a quarter of
reportlab's import and as much as the whole solve of a small member — and a report uses neither:
the URL pattern only serves splitting a long link across lines, the colouring only
``XPreformatted`` Python listings.

:func:`install` (called by this package's ``__init__``; it imports nothing) puts a finder first
on ``sys.meta_path`` that loads those two modules, whenever something first imports them, with
their loader as found by the other finders, while ``re.compile`` hands back a :class:`LazyPattern`
for the patterns named in :data:`_LAZY` only: it compiles the same pattern with the same flags the
first time any attribute (``match``, ``search``…) is asked for. Every other pattern compiles as
before, and nothing changes in what reportlab does or draws. When reportlab was imported already,
or a version writes the patterns differently, the patterns are simply compiled as usual.

The same finder loads ``reportlab.graphics.shapes`` with ``rl_config.shapeChecking`` off while
the module runs: the shape classes are then defined without their per-attribute validator (a
``__setattr__`` that looks every assignment up in the class's attribute map — "a big help when
developing", by reportlab's own note, and about 60,000 calls in the drawings of ten members).
The setting is restored at once, so widgets and everything else still check as configured;
shapes hold and draw the same values.
"""

from __future__ import annotations

import re
import sys
import threading

__all__ = ["LazyPattern", "install"]

#: (module, start of the pattern, flags) of the patterns compiled on first use
_LAZY = (
    ("reportlab.platypus.paragraph", "(^(?:[a-z0-9\\.\\-\\+]*)://)", re.IGNORECASE),
    ("reportlab.lib.PyFontify", "", 0),
)
#: modules run with ``rl_config.shapeChecking`` off (their classes skip the per-attribute validator)
_UNCHECKED = frozenset({"reportlab.graphics.shapes"})
_LOCK = threading.RLock()  # re-entrant: a module loaded here may import another one


class LazyPattern:
    """A pattern compiled the first time it is used; then it is the compiled pattern's methods."""

    def __init__(self, pattern: str, flags: int):
        self._pattern, self._flags = pattern, flags
        self._compiled: re.Pattern[str] | None = None

    def __getattr__(self, name: str):
        if self._compiled is None:
            self._compiled = re.compile(self._pattern, self._flags)
        return getattr(self._compiled, name)


def _lazy(module: str, pattern: object, flags: int) -> bool:
    if not isinstance(pattern, str):
        return False
    return any(module == m and pattern.startswith(head) and flags == f for m, head, f in _LAZY)


class _Loader:
    """The module's own loader, run with the patterns of :data:`_LAZY` compiled on first use."""

    def __init__(self, loader):
        self._loader = loader

    def create_module(self, spec):
        return self._loader.create_module(spec)

    def exec_module(self, module) -> None:
        with _LOCK:
            real = re.compile

            def compile_(pattern, flags=0):
                caller = sys._getframe(1).f_globals.get("__name__", "")
                if _lazy(caller, pattern, int(flags)):
                    return LazyPattern(pattern, flags)
                return real(pattern, flags)

            re.compile = compile_
            unchecked = module.__name__ in _UNCHECKED
            if unchecked:
                from reportlab import rl_config

                checking = rl_config.shapeChecking
                rl_config.shapeChecking = 0
            try:
                self._loader.exec_module(module)
            finally:
                re.compile = real
                if unchecked:
                    rl_config.shapeChecking = checking

    def __getattr__(self, name: str):  # get_code, get_source, is_package… as the loader has them
        return getattr(self._loader, name)


class _Finder:
    """Finds the modules of :data:`_LAZY` as the other finders do and wraps their loader."""

    def find_spec(self, name, path, target=None):
        if name not in _MODULES:
            return None
        for finder in sys.meta_path:
            if finder is self or not hasattr(finder, "find_spec"):
                continue
            spec = finder.find_spec(name, path, target)
            if spec is not None:
                if spec.loader is not None and hasattr(spec.loader, "exec_module"):
                    spec.loader = _Loader(spec.loader)
                return spec
        return None


_MODULES = frozenset(m for m, _, _ in _LAZY) | _UNCHECKED
_FINDER = _Finder()


def install() -> None:
    """Import the modules of :data:`_LAZY`, whenever they are first imported, with their patterns
    compiled on first use (idempotent; imports nothing now)."""
    if not any(isinstance(f, _Finder) for f in sys.meta_path):
        sys.meta_path.insert(0, _FINDER)
