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
from itertools import groupby, zip_longest
from types import ModuleType

import numpy as np
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
    try:
        code.version = code.calculate_version()
        code.dataCache = _code_words(enc, code.version, code.errorCorrectLevel, code.dataList)
        best, sym = _best_mask(code, enc)
        # the symbol make() ends with (makeImpl(False, best)): the masked data as scored, with
        # the format (and version) information of the chosen mask written in
        code.modules = sym.tolist()
        code.setupTypeInfo(False, best)
        if code.version >= 7:
            code.setupTypeNumber(False)
    except Exception:  # pragma: no cover - an encoder laid out otherwise: its own make()
        code = enc.QRCode(None, getattr(enc.QRErrorCorrectLevel, level))
        code.addData(text)
        code.make()
    return [[bool(m) for m in row] for row in code.modules]


def _code_words(enc, version: int, level: int, segments) -> list[int]:
    """The symbol's codewords, as reportlab's ``QRCode.createData`` makes them: the segments, the
    terminator, the bit padding and the pad bytes 0xEC/0x11 (ISO/IEC 18004:2015 §7.4.9-10), split
    into reportlab's blocks, each block's error-correction codewords appended by
    :func:`_ec_words`, data and error-correction codewords interleaved block by block (§7.6).
    The encoder's own ``createBytes`` divides polynomials with recursive list copies and builds
    each block's generator anew (about 10 ms a code)."""
    blocks = enc.QRRSBlock.getRSBlocks(version, level)
    buffer = enc.QRBitBuffer()
    for segment in segments:
        segment.write(buffer, version)
    capacity = 8 * sum(b.dataCount for b in blocks)
    if buffer.getLengthInBits() > capacity:
        raise ValueError(f"code length overflow. ({buffer.getLengthInBits()} > {capacity})")
    if buffer.getLengthInBits() + 4 <= capacity:
        buffer.put(0, 4)
    while buffer.getLengthInBits() % 8:
        buffer.putBit(False)
    pad = (enc.QRCode.PAD0, enc.QRCode.PAD1)
    k = 0
    while buffer.getLengthInBits() < capacity:
        buffer.put(pad[k % 2], 8)
        k += 1
    data, ec, offset = [], [], 0
    for b in blocks:
        words = list(buffer.buffer[offset : offset + b.dataCount])
        offset += b.dataCount
        data.append(words)
        ec.append(_ec_words(words, b.totalCount - b.dataCount))
    out = [w for column in zip_longest(*data) for w in column if w is not None]
    return out + [w for column in zip_longest(*ec) for w in column if w is not None]


_EXP = [0] * 510  # α^i in GF(256) with the QR field polynomial x⁸ + x⁴ + x³ + x² + 1 (§7.5.2)
_LOG = [0] * 256
_v = 1
for _i in range(255):
    _EXP[_i] = _EXP[_i + 255] = _v
    _LOG[_v] = _i
    _v <<= 1
    if _v & 0x100:
        _v ^= 0x11D


@lru_cache(maxsize=64)
def _generator(n: int) -> tuple[int, ...]:
    """Logs of the coefficients after the leading 1 of Π (x − α^i), i = 0 … n − 1 (§7.5.2)."""
    g = [1]
    for i in range(n):
        nxt = g + [0]
        for j, c in enumerate(g):  # nxt = g·x + α^i·g
            if c:
                nxt[j + 1] ^= _EXP[_LOG[c] + i]
        g = nxt
    return tuple(_LOG[c] if c else -1 for c in g[1:])


def _ec_words(data: list[int], n: int) -> list[int]:
    """The ``n`` error-correction codewords of one block: the remainder of data(x)·xⁿ divided by
    the generator polynomial (§7.5.2), by the usual shift-register division."""
    gen = _generator(n)
    rem = [0] * n
    for word in data:
        factor = word ^ rem[0]
        rem = rem[1:] + [0]
        if factor:
            lf = _LOG[factor]
            for j, lg in enumerate(gen):
                if lg >= 0:
                    rem[j] ^= _EXP[lf + lg]
    return rem


def _best_mask(code, enc) -> tuple[int, np.ndarray]:
    """The mask ``QRCode.make`` chooses (the first of the lowest penalty over the eight masks,
    scored on the symbol laid out with blank format information), computed on arrays.

    ``make`` lays out and scores the symbol once per mask in Python loops (20-30 ms a code).
    Here it is laid out once (mask 0), the data modules unmasked, and each mask applied to them
    at once with reportlab's own mask functions; the penalty is reportlab's ``getLostPoint``
    rule for rule: runs of five or more equal modules in a column or a row (length − 2 each),
    2 × 2 blocks of one colour (3 each), the finder-like run dark-light-dark-dark-dark-light-dark
    followed by four light modules along a row, starting before the last 11 modules (40 each; its
    column count compares a tuple with a list and is always 0, so it is left out here too), and
    the dark share (10 per 5 % away from half). ``tests/test_qr_draw.py`` compares the symbols
    with reportlab's own ``make`` over hundreds of texts and all four levels."""
    code.makeImpl(True, 0)
    m = np.array(code.modules, dtype=bool)
    n = m.shape[0]
    pos = np.array(code.dataPosIterator(), dtype=np.intp).reshape(-1, 2)  # (col, row)
    cols, rows = pos[:, 0], pos[:, 1]
    bits = np.zeros(len(pos), dtype=bool)
    data = np.array(code._dataBitList or [], dtype=bool)[: len(pos)]
    bits[: len(data)] = data
    unmasked = m.copy()
    unmasked[rows, cols] = bits
    masks = enc.QRUtil.maskPattern
    finder = np.array([1, 0, 1, 1, 1, 0, 1, 0, 0, 0, 0], dtype=bool)
    best, lowest, chosen = 0, None, unmasked
    for i in range(8):
        sym = unmasked.copy()
        sym[rows, cols] ^= np.asarray(masks[i](rows, cols), dtype=bool)
        lost = _runs(sym) + _runs(sym.T) + _blocks(sym) + _finder(sym, finder)
        dark = int(sym.sum())
        lost += 10 * (abs(100 * dark // (n * n) - 50) // 5)
        if lowest is None or lost < lowest:
            best, lowest, chosen = i, lost, sym
    return best, chosen


def _runs(sym: np.ndarray) -> int:
    """Σ (length − 2) over the runs of 5 or more equal modules down each column."""
    n = sym.shape[0]
    change = np.ones((sym.shape[1], n + 1), dtype=bool)  # a column per row, its ends marked
    change[:, 1:n] = sym[1:].T != sym[:-1].T
    lengths = np.diff(np.flatnonzero(change))  # between two columns: a run of 1, never counted
    long = lengths[lengths >= 5]
    return int(long.sum()) - 2 * len(long)


def _blocks(sym: np.ndarray) -> int:
    a = sym[:-1, :-1]
    same = (a == sym[1:, :-1]) & (a == sym[:-1, 1:]) & (a == sym[1:, 1:])
    return 3 * int(same.sum())


def _finder(sym: np.ndarray, pattern: np.ndarray) -> int:
    """40 per run of ``pattern`` along a row starting at 0 … n − 12 (reportlab's range)."""
    n, k = sym.shape[1], len(pattern)
    starts = n - k
    if starts <= 0:
        return 0
    hit = np.ones((sym.shape[0], starts), dtype=bool)
    for d in range(k):
        hit &= sym[:, d : d + starts] == pattern[d]
    return 40 * int(hit.sum())


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
