"""Image bombs (issue 13, item 2): a logo is checked by the pixel dimensions in its header before
anything decodes it — above 4,000 px on a side or 16 million px in all it is refused with one line
naming the key and the limit — and the image library's warnings never reach stderr.

Header layouts: PNG IHDR (ISO/IEC 15948:2004 §11.2.2: 4-byte length, "IHDR", width, height as
big-endian 32-bit); JPEG baseline start of frame SOF0 (ITU-T T.81 §B.2.2: FFC0, length, precision,
height, width as big-endian 16-bit).
"""

from __future__ import annotations

import io
import struct
import zlib

import pytest
from PIL import Image

from calcreport.outputs.report.image_guard import (
    MAX_PIXELS,
    MAX_SIDE,
    ImageRefused,
    check_dimensions,
    image_size,
)
from tests.conftest import job_text
from tests.test_bad_input import GOOD


def _chunk(kind: bytes, body: bytes) -> bytes:
    return struct.pack(">I", len(body)) + kind + body + struct.pack(">I", zlib.crc32(kind + body))


def png_claiming(width: int, height: int) -> bytes:
    """A valid-looking grey PNG of a few hundred bytes that declares ``width`` × ``height``: the
    pixel rows compress to almost nothing, so the file is small and the decode enormous."""
    ihdr = struct.pack(">IIBBBBB", width, height, 8, 0, 0, 0, 0)
    rows = zlib.compress(b"\x00" * (width + 1) * 64, 9)  # a few rows only: decoding would fail late
    return b"\x89PNG\r\n\x1a\n" + _chunk(b"IHDR", ihdr) + _chunk(b"IDAT", rows) + _chunk(b"IEND", b"")


def jpeg_claiming(width: int, height: int) -> bytes:
    app0 = b"\xff\xe0" + struct.pack(">H", 16) + b"JFIF\x00\x01\x01\x00\x00\x01\x00\x01\x00\x00"
    sof0 = b"\xff\xc0" + struct.pack(">HBHHB", 11, 8, height, width, 1) + b"\x01\x11\x00"
    return b"\xff\xd8" + app0 + sof0 + b"\xff\xd9"


def _real(fmt: str, size: tuple[int, int]) -> bytes:
    buf = io.BytesIO()
    Image.new("RGB", size, (40, 90, 125)).save(buf, fmt)
    return buf.getvalue()


def test_sizes_read_from_headers_match_the_image_library():
    for fmt in ("PNG", "JPEG"):
        assert image_size(_real(fmt, (123, 45))) == (123, 45)
    assert image_size(png_claiming(50_000, 40_000)) == (50_000, 40_000)
    assert image_size(jpeg_claiming(65_000, 3)) == (65_000, 3)
    with pytest.raises(ImageRefused):
        image_size(b"GIF89a....")
    with pytest.raises(ImageRefused):
        image_size(b"\xff\xd8\xff\xda\x00\x02")  # scan before any frame header


def test_limits():
    check_dimensions(MAX_SIDE, MAX_PIXELS // MAX_SIDE)
    for w, h in ((MAX_SIDE + 1, 10), (10, MAX_SIDE + 1), (4000, 4001), (0, 5)):
        with pytest.raises(ImageRefused):
            check_dimensions(w, h)


def _job_with_logo(tmp_path, data: bytes, name: str):
    (tmp_path / name).write_bytes(data)
    (tmp_path / "firm.toml").write_text(
        f'[firm]\nname = "Harbour Engineers"\nlogo = "{name}"\n', encoding="utf-8"
    )
    job = tmp_path / "job.toml"
    job.write_text(job_text(GOOD, settings='template = "firm.toml"\n'), encoding="utf-8")
    return job


@pytest.mark.parametrize(
    "name, data",
    [
        ("bomb.png", png_claiming(12_000, 12_000)),  # 144 Mpx: Pillow only warns (limit 89 Mpx)
        ("wide.png", png_claiming(4_001, 100)),
        ("bomb.jpg", jpeg_claiming(5_000, 5_000)),
        ("many.png", png_claiming(4_000, 4_001)),
    ],
)
def test_image_bomb_logo_refused_with_one_line(tmp_path, cli, name, data):
    job = _job_with_logo(tmp_path, data, name)
    out = tmp_path / "out"
    code, stdout, err = cli("build", str(job), "-o", str(out) + "/")
    assert code == 2 and stdout == "", err
    lines = err.strip().splitlines()
    assert len(lines) == 1, err  # no library warning as an extra line
    assert "firm.logo" in lines[0] and "4,000 px on a side" in lines[0] and "16 million" in lines[0], lines[0]
    assert not out.exists() or list(out.iterdir()) == []


def test_real_five_thousand_pixel_logo_refused_and_small_one_used(tmp_path, cli, capfd):
    big = io.BytesIO()
    Image.new("L", (5_000, 5_000), 255).save(big, "PNG")  # 25 Mpx, compresses to ~25 KB
    job = _job_with_logo(tmp_path, big.getvalue(), "logo.png")
    code, _, err = cli("build", str(job), "-o", str(tmp_path / "out") + "/")
    assert code == 2 and "5,000 × 5,000 px" in err
    job = _job_with_logo(tmp_path, _real("PNG", (300, 120)), "logo.png")
    code, out, err = cli("build", str(job), "-o", str(tmp_path / "out") + "/")
    assert code == 0 and err == "", err
    assert capfd.readouterr().err == ""  # nothing from the libraries either
