"""A QR code drawn straight on the canvas (the fabrication sheet's link to the calculation).

The symbol is encoded by reportlab's own encoder (``reportlab.graphics.barcode.qrencoder``) once
per code; its dark modules are then filled as one path of rectangles, one per run of dark
modules in a row — the geometry of reportlab's ``QrCodeWidget`` (quiet zone of ``border``
modules, row 0 at the top) scaled to ``size``. The widget route encoded each symbol twice (its
bounds and its drawing each call the encoder, whose mask choice tries all eight masks) and drew
every run as a validated shape with its own saved graphics state: about 0.1 s a code, a third
of the rendering time of a report of many short members.
"""

from __future__ import annotations

import importlib.util
import sys
from functools import lru_cache
from itertools import groupby
from types import ModuleType

from reportlab.lib import colors

__all__ = ["qr_modules", "draw_qr"]

_ENCODER = "reportlab.graphics.barcode.qrencoder"


@lru_cache(maxsize=1)
def _qrencoder() -> ModuleType:
    """reportlab's QR encoder module. It needs only ``re`` and ``itertools``; importing it by its
    dotted name would first run the barcode package's ``__init__``, which imports and registers
    every barcode widget reportlab has (15-35 ms of each build). So it is loaded from its file
    under its own name, unless the package is loaded already; on any surprise, the usual import."""
    if _ENCODER in sys.modules:
        return sys.modules[_ENCODER]
    try:
        graphics = importlib.util.find_spec("reportlab.graphics")
        assert graphics is not None and graphics.submodule_search_locations
        path = f"{list(graphics.submodule_search_locations)[0]}/barcode/qrencoder.py"
        spec = importlib.util.spec_from_file_location("calcreport._rl_qrencoder", path)
        assert spec is not None and spec.loader is not None
        module = importlib.util.module_from_spec(spec)
        spec.loader.exec_module(module)
        module.QRCode  # noqa: B018 - the encoder is there
        return module
    except Exception:  # pragma: no cover - another reportlab layout: the ordinary import
        from reportlab.graphics.barcode import qrencoder

        return qrencoder


def qr_modules(text: str, level: str = "M") -> list[list[bool]]:
    """The symbol's modules (rows from the top, ``True`` dark), encoded once.

    Text with a lower-case ASCII letter and nothing beyond ASCII is one 8-bit byte segment — the
    segment reportlab's ``addData`` ends with for it (such text is neither numeric nor
    alphanumeric, and ASCII is never Kanji), without trying a Shift-JIS encoding first (which
    imports the Japanese codecs)."""
    enc = _qrencoder()
    code = enc.QRCode(None, getattr(enc.QRErrorCorrectLevel, level))
    plain_8bit = text.isascii() and any("a" <= c <= "z" for c in text)
    code.addData(enc.QR8bitByte(text) if plain_8bit else text)
    code.make()
    return [[bool(m) for m in row] for row in code.modules]


def draw_qr(canvas, text: str, x: float, y: float, size: float, border: int = 2, level: str = "M") -> None:
    """Draw the QR code of ``text`` in the square of side ``size`` whose lower left is (x, y),
    ``border`` light modules of quiet zone inside the square."""
    modules = qr_modules(text, level)
    box = size / (len(modules) + 2 * border)
    top = y + size
    path = canvas.beginPath()
    for r, row in enumerate(modules):
        c = 0
        y0 = top - (r + border + 1) * box
        for dark, run in groupby(row):
            n = sum(1 for _ in run)
            if dark:
                path.rect(x + (c + border) * box, y0, n * box, box)
            c += n
    canvas.saveState()
    canvas.setFillColor(colors.black)
    canvas.drawPath(path, stroke=0, fill=1)
    canvas.restoreState()
