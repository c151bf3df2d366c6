"""Logo images checked by their pixel dimensions before anything decodes them.

A PNG or JPEG of a few kilobytes can declare 50,000 × 50,000 pixels (an "image bomb"): decoding
it takes minutes and gigabytes. :func:`image_size` reads the width and height from the file's own
header (PNG: the IHDR chunk, ISO/IEC 15948 §11.2.2; JPEG: the start-of-frame segment, ITU-T T.81
§B.2.2) without decoding, and :func:`checked_image` refuses anything above
:data:`MAX_SIDE` px on a side or :data:`MAX_PIXELS` in all, before the image library sees the
bytes. The image library's own warnings (Pillow's DecompressionBombWarning and the like) are
silenced while it decodes: our one line says what is wrong.

The limits are ours (common practice, no source): a title-block logo is printed under 1.5 in
wide, where 4,000 px is already over 2,600 dpi.
"""

from __future__ import annotations

import io
import struct
import warnings
from functools import lru_cache
from pathlib import Path

__all__ = ["ImageRefused", "image_size", "check_dimensions", "checked_image", "MAX_SIDE", "MAX_PIXELS"]

MAX_SIDE = 4000
MAX_PIXELS = 16_000_000
MAX_BYTES = 5_000_000
_PNG = b"\x89PNG\r\n\x1a\n"
# Start-of-frame markers: C0-C3, C5-C7, C9-CB, CD-CF (C4 DHT, C8 JPG, CC DAC are not frames).
_SOF = {0xC0, 0xC1, 0xC2, 0xC3, 0xC5, 0xC6, 0xC7, 0xC9, 0xCA, 0xCB, 0xCD, 0xCE, 0xCF}


class ImageRefused(ValueError):
    """The image cannot be used; ``str()`` is one line."""


def image_size(data: bytes) -> tuple[int, int]:
    """(width, height) in pixels from a PNG or JPEG header; raises ImageRefused otherwise."""
    if data.startswith(_PNG):
        if len(data) < 24 or data[12:16] != b"IHDR":
            raise ImageRefused("a PNG without its IHDR header chunk")
        return struct.unpack(">II", data[16:24])
    if data.startswith(b"\xff\xd8"):
        return _jpeg_size(data)
    raise ImageRefused("expected a PNG or JPEG image")


def _jpeg_size(data: bytes) -> tuple[int, int]:
    i, n = 2, len(data)
    while i < n:
        if data[i] != 0xFF:
            raise ImageRefused("a damaged JPEG (marker expected)")
        while i < n and data[i] == 0xFF:  # fill bytes
            i += 1
        if i >= n:
            break
        marker = data[i]
        i += 1
        if marker == 0x01 or 0xD0 <= marker <= 0xD8:  # no length field
            continue
        if marker in (0xD9, 0xDA):  # end of image, or scan data before any frame header
            break
        if i + 2 > n:
            break
        (length,) = struct.unpack(">H", data[i : i + 2])
        if length < 2:
            raise ImageRefused("a damaged JPEG (segment length)")
        if marker in _SOF:
            if i + 7 > n:
                break
            height, width = struct.unpack(">HH", data[i + 3 : i + 7])
            return width, height
        i += length
    raise ImageRefused("a JPEG without a frame header (no image size)")


def check_dimensions(width: int, height: int) -> None:
    """Refuse an image larger than the limits, or of no size."""
    if width <= 0 or height <= 0:
        raise ImageRefused("image has no size (0 pixels wide or high)")
    if width > MAX_SIDE or height > MAX_SIDE or width * height > MAX_PIXELS:
        raise ImageRefused(
            f"image is {width:,} × {height:,} px; a logo may have at most {MAX_SIDE:,} px on a side "
            f"and {MAX_PIXELS // 1_000_000} million px in all"
        )


def checked_image(path: str | Path):
    """A reportlab ``ImageReader`` of the logo at ``path``, decoded only after its header passed
    :func:`check_dimensions`; raises ImageRefused (or :class:`calcreport.safeio.FileRefused`).
    The same unchanged file is read and decoded once per process (every sheet shows the logo)."""
    from ...safeio import read_regular

    data = read_regular(path, MAX_BYTES, "a logo image")
    return _decoded(data)


@lru_cache(maxsize=4)
def _decoded(data: bytes):
    from reportlab.lib.utils import ImageReader

    width, height = image_size(data)
    check_dimensions(width, height)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        try:
            reader = ImageReader(io.BytesIO(data))
            size = reader.getSize()
            reader.getRGBData()  # decode now, inside the guard, so a broken image fails here
        except Exception as exc:  # Pillow and reportlab raise many kinds for broken images
            raise ImageRefused(f"cannot read the image ({type(exc).__name__})") from None
    if tuple(size) != (width, height):
        raise ImageRefused("the image's header and its data disagree on its size")
    return reader
