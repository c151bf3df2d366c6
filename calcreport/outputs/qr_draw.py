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

from itertools import groupby

from reportlab.graphics.barcode import qrencoder
from reportlab.lib import colors

__all__ = ["qr_modules", "draw_qr"]


def qr_modules(text: str, level: str = "M") -> list[list[bool]]:
    """The symbol's modules (rows from the top, ``True`` dark), encoded once."""
    code = qrencoder.QRCode(None, getattr(qrencoder.QRErrorCorrectLevel, level))
    code.addData(text)
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
