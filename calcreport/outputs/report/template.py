"""Report templates: page size, margins, firm block, optional logo, fonts and accent colour.

A template is a small TOML file in ``templates/`` (``report-<name>.toml``) or anywhere, named by
``[settings] template = "…"`` in the job file: a bare name (``"a4"``, ``"report-a4"``) is looked up
in ``templates/``; text with a ``/`` or ending in ``.toml`` is a path relative to the job file.
Problems raise :class:`JobError` at ``settings.template`` (exit code 2, nothing written).
"""

from __future__ import annotations

import re
from dataclasses import dataclass, field
from pathlib import Path

try:
    import tomllib
except ModuleNotFoundError:  # pragma: no cover
    import tomli as tomllib  # type: ignore[no-redef]

from reportlab.lib import colors
from reportlab.lib.pagesizes import A4, LETTER

from ...errors import JobError
from ...units import UnitParseError, parse

__all__ = ["Template", "DEFAULT", "resolve_template", "load_template", "TEMPLATE_DIRS"]

PAGE_SIZES = {"letter": LETTER, "a4": A4}
TEMPLATE_DIRS = (
    Path(__file__).resolve().parents[3] / "templates",
    Path(__file__).resolve().parents[2] / "templates",
)
MAX_TEMPLATE_BYTES = 200_000
MAX_LOGO_BYTES = 5_000_000
_KEY = "settings.template"
_HEX = re.compile(r"^#[0-9a-fA-F]{6}$")


@dataclass(frozen=True)
class Template:
    """Page and firm settings of a report (lengths in points)."""

    name: str = "letter (built in)"
    page: str = "letter"
    margins: tuple[float, float, float, float] = (54.0, 54.0, 40.0, 40.0)  # left, right, top, bottom
    firm: str = "Consulting Structural Engineers"
    address: tuple[str, ...] = ()
    logo: Path | None = None
    font: Path | None = None
    font_bold: Path | None = None
    font_mono: Path | None = None
    font_size: float = 9.0
    accent: str = "#2b5d7d"
    seal_field: str = "engineer-seal"  # the empty signature field reserved in the cover's seal box
    extra: dict = field(default_factory=dict)

    @property
    def pagesize(self) -> tuple[float, float]:
        return PAGE_SIZES[self.page]

    @property
    def accent_color(self) -> colors.Color:
        return colors.HexColor(self.accent)


DEFAULT = Template()


def resolve_template(value: str, job_path: str) -> Path | None:
    """The template file named by ``settings.template`` (None for the built-in default)."""
    value = value.strip()
    if not value:
        return None
    if "/" in value or "\\" in value or value.endswith(".toml"):
        path = Path(job_path).resolve().parent / value
        if not path.is_file():
            raise JobError(
                job_path,
                _KEY,
                f"expected a template file; {value!r} (relative to the job file) "
                "does not exist or is not a regular file",
            )
        return path
    if not re.fullmatch(r"[A-Za-z0-9_.-]{1,60}", value):
        raise JobError(
            job_path, _KEY, f'expected a template name like "a4" or a path to a .toml file, got {value!r}'
        )
    names = [f"report-{value}.toml", f"{value}.toml"]
    for folder in TEMPLATE_DIRS:
        for n in names:
            if (folder / n).is_file():
                return folder / n
    known = sorted(
        {p.stem.removeprefix("report-") for d in TEMPLATE_DIRS if d.is_dir() for p in d.glob("report-*.toml")}
    )
    raise JobError(
        job_path,
        _KEY,
        f"expected one of the report templates ({', '.join(known) or 'none installed'}) "
        f"or a path to a .toml file, got {value!r}",
    )


def load_template(value: str, job_path: str) -> Template:
    """Read and validate the template named in a job; the default when ``value`` is empty."""
    path = resolve_template(value, job_path)
    if path is None:
        return DEFAULT
    return read_template_file(path, job_path)


def read_template_file(path: Path, job_path: str) -> Template:
    """Parse one template file; every problem is a one-line JobError at settings.template."""

    def fail(key: str, msg: str) -> JobError:
        where = f"{path.name}: {key}: " if key else f"{path.name}: "
        return JobError(job_path, _KEY, where + msg)

    try:
        if path.stat().st_size > MAX_TEMPLATE_BYTES:
            raise fail("", f"template file larger than {MAX_TEMPLATE_BYTES:,} bytes")
        doc = tomllib.loads(path.read_bytes().decode("utf-8"))
    except (OSError, UnicodeDecodeError) as exc:
        raise fail("", f"cannot read the template ({exc})") from None
    except tomllib.TOMLDecodeError as exc:
        raise fail("", f"TOML syntax error: {exc}") from None
    known = {"page", "firm", "style", "seal"}
    for k in doc:
        if k not in known:
            raise fail(k, f"unknown table; expected one of {', '.join(sorted(known))}")
    page = _table(doc, "page", fail)
    firm = _table(doc, "firm", fail)
    style = _table(doc, "style", fail)
    seal = _table(doc, "seal", fail)
    _only(page, {"size", "margin_left", "margin_right", "margin_top", "margin_bottom"}, "page", fail)
    _only(firm, {"name", "address", "logo"}, "firm", fail)
    _only(style, {"font", "font_bold", "font_mono", "font_size", "accent"}, "style", fail)
    _only(seal, {"field"}, "seal", fail)
    seal_field = seal.get("field", DEFAULT.seal_field)
    if not isinstance(seal_field, str) or not re.fullmatch(r"[A-Za-z][A-Za-z0-9_-]{0,39}", seal_field):
        raise fail("seal.field", "expected a field name of letters, digits, '-' or '_' (at most 40, no dots)")

    size = page.get("size", "letter")
    if not isinstance(size, str) or size.lower() not in PAGE_SIZES:
        raise fail("page.size", f'expected "letter" or "a4", got {size!r}')
    margins = []
    for side, default in (("left", 54.0), ("right", 54.0), ("top", 40.0), ("bottom", 40.0)):
        raw = page.get(f"margin_{side}")
        if raw is None:
            margins.append(default)
            continue
        try:
            pts = float(parse(raw, "length").to("inch").magnitude) * 72.0
        except (UnitParseError, TypeError, ValueError) as exc:
            raise fail(
                f"page.margin_{side}", f'expected a length like "0.75 in" or "20 mm" ({exc})'
            ) from None
        if not 14.0 <= pts <= 144.0:
            raise fail(f"page.margin_{side}", "expected a margin from 0.2 in to 2 in (5 mm to 50 mm)")
        margins.append(pts)
    name = _text(firm, "name", fail, "firm", DEFAULT.firm)
    address = firm.get("address", [])
    if isinstance(address, str):
        address = [address]
    if (
        not isinstance(address, list)
        or not all(isinstance(a, str) and len(a) <= 200 for a in address)
        or len(address) > 6
    ):
        raise fail("firm.address", "expected up to 6 lines of text")
    logo = _file(path, firm.get("logo"), "firm.logo", fail, (".png", ".jpg", ".jpeg"), MAX_LOGO_BYTES)
    if logo is not None:
        _check_image(logo, fail)
    fonts = [
        _file(path, style.get(k), f"style.{k}", fail, (".ttf",), 30_000_000)
        for k in ("font", "font_bold", "font_mono")
    ]
    for f, k in zip(fonts, ("font", "font_bold", "font_mono")):
        if f is not None:
            _check_font(f, f"style.{k}", fail)
    fsize = style.get("font_size", DEFAULT.font_size)
    if isinstance(fsize, bool) or not isinstance(fsize, (int, float)) or not 7 <= fsize <= 12:
        raise fail("style.font_size", f"expected a number of points from 7 to 12, got {fsize!r}")
    accent = style.get("accent", DEFAULT.accent)
    if not isinstance(accent, str) or not _HEX.match(accent):
        raise fail("style.accent", f'expected a colour like "#2b5d7d", got {accent!r}')
    return Template(
        name=path.name,
        page=size.lower(),
        margins=tuple(margins),
        firm=name,
        address=tuple(address),
        logo=logo,
        font=fonts[0],
        font_bold=fonts[1],
        font_mono=fonts[2],
        font_size=float(fsize),
        accent=accent,
        seal_field=seal_field,
    )


def _table(doc: dict, name: str, fail) -> dict:
    t = doc.get(name, {})
    if not isinstance(t, dict):
        raise fail(name, "expected a table")
    return t


def _only(t: dict, allowed: set[str], prefix: str, fail) -> None:
    for k in t:
        if k not in allowed:
            raise fail(f"{prefix}.{k}", f"unknown key; expected one of {', '.join(sorted(allowed))}")


def _text(t: dict, key: str, fail, prefix: str, default: str) -> str:
    v = t.get(key, default)
    if not isinstance(v, str) or len(v) > 200:
        raise fail(f"{prefix}.{key}", "expected text of at most 200 characters")
    return v


def _file(template: Path, value, key: str, fail, exts: tuple[str, ...], max_bytes: int) -> Path | None:
    if value is None or value == "":
        return None
    if not isinstance(value, str):
        raise fail(key, "expected a file path relative to the template")
    p = template.parent / value
    if p.suffix.lower() not in exts:
        raise fail(key, f"expected a {' or '.join(e.lstrip('.').upper() for e in exts)} file, got {value!r}")
    if not p.is_file():
        raise fail(
            key, f"expected a regular file; {value!r} (relative to the template) is missing or not a file"
        )
    if p.stat().st_size > max_bytes:
        raise fail(key, f"file larger than {max_bytes:,} bytes")
    return p.resolve()


def _check_image(p: Path, fail) -> None:
    head = p.read_bytes()[:8]
    if not (head.startswith(b"\x89PNG\r\n\x1a\n") or head.startswith(b"\xff\xd8\xff")):
        raise fail("firm.logo", f"expected a PNG or JPEG image; {p.name} is neither")
    try:
        from reportlab.lib.utils import ImageReader

        w, h = ImageReader(str(p)).getSize()
    except Exception as exc:  # reportlab/PIL raise many kinds for broken images
        raise fail("firm.logo", f"cannot read the image ({type(exc).__name__})") from None
    if w <= 0 or h <= 0:
        raise fail("firm.logo", "image has no size")


def _check_font(p: Path, key: str, fail) -> None:
    try:
        from reportlab.pdfbase.ttfonts import TTFontFile

        TTFontFile(str(p))
    except Exception as exc:  # reportlab raises TTFError and others for bad fonts
        raise fail(key, f"not a usable TrueType font ({str(exc)[:80]})") from None
