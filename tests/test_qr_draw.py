"""The fabrication sheet's QR symbols (outputs/qr_draw.py) against reportlab's own QR encoder.

The reference is reportlab's ``QRCode.make`` (a general-purpose encoder outside the project): our
mask choice on arrays must give the very symbol it gives — same version, same mask, same modules —
for payloads as the fabrication sheet writes them, at every error-correction level, including
symbols of version 7 and above (which carry version information). Decoding the drawn symbol from
the rendered page is tested in test_detail_fabrication.py (zxing-cpp).
"""

from __future__ import annotations

import hashlib
import io

import pytest
from reportlab.graphics.barcode import qrencoder
from reportlab.pdfgen.canvas import Canvas

from calcreport.outputs.fabrication_draw import qr_payload
from calcreport.outputs.qr_draw import draw_qr, qr_modules


def _reportlab(text: str, level: str) -> tuple[int, list[list[bool]]]:
    code = qrencoder.QRCode(None, getattr(qrencoder.QRErrorCorrectLevel, level))
    code.addData(text)
    code.make()
    return code.version, [[bool(m) for m in row] for row in code.modules]


PAYLOADS = [
    qr_payload(number, revision, sheet, member, hashlib.sha256(f"{k}".encode()).hexdigest())
    for k, (number, revision, sheet, member) in enumerate(
        [
            ("HB-2026-014", "B", 13, "H1"),
            ("", "", 1, "S1"),
            ("BM-200", "A", 1851, "S200"),
            ("PV-7", "C", 24, "RB-1"),
            ("X" * 60, "-", 99, "member with a long id 17"),
        ]
    )
]
SHORT = ["calcreport", "a", "sheet 3\nmember b1", "0123 lower", "Träger ü"]  # 8-bit, small versions


@pytest.mark.parametrize("level", ["L", "M", "Q", "H"])
@pytest.mark.parametrize("text", PAYLOADS + SHORT)
def test_symbols_equal_reportlabs(text, level):
    version, modules = _reportlab(text, level)
    assert qr_modules(text, level) == modules
    assert len(modules) == 4 * version + 17


def test_large_symbols_with_version_information_are_covered():
    versions = {_reportlab(t, "H")[0] for t in PAYLOADS}
    assert max(versions) >= 7


def test_drawn_as_one_filled_path_in_its_square():
    c = Canvas(io.BytesIO())
    draw_qr(c, PAYLOADS[0], 100, 200, 92.0)
    ops = " ".join(c._code).split()
    assert ops.count("f*") + ops.count("f") == 1  # one fill of one path
    rects = [ops[i - 4 : i] for i, op in enumerate(ops) if op == "re"]
    assert len(rects) > 50
    for x, y, w, h in (map(float, r) for r in rects):
        assert 100 <= x < x + w <= 192.01 and 200 <= y < y + h <= 292.01


@pytest.mark.parametrize("level", ["L", "M", "Q", "H"])
def test_codewords_equal_reportlabs(level):
    # data and error-correction codewords, interleaved, as reportlab's createData makes them
    from calcreport.outputs.qr_draw import _code_words

    for text in PAYLOADS + SHORT:
        code = qrencoder.QRCode(None, getattr(qrencoder.QRErrorCorrectLevel, level))
        code.addData(text)
        version = code.calculate_version()
        ours = _code_words(qrencoder, version, code.errorCorrectLevel, code.dataList)
        assert ours == qrencoder.QRCode.createData(version, code.errorCorrectLevel, code.dataList)
