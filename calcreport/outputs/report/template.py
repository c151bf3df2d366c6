"""Report templates: page size, margins, firm block, optional logo, fonts and accent colour.

A template is a small TOML file shipped in ``calcreport/data/templates/`` (``report-<name>.toml``)
or anywhere, named by ``[settings] template = "…"`` in the job file: a bare name (``"a4"``,
``"report-a4"``) is one of the shipped templates; text with a ``/`` or ending in ``.toml`` is a path relative to the job file.
Problems raise :class:`JobError` at ``settings.template`` (exit code 2, nothing written).
"""

from __future__ import annotations

import re
import tomllib
from dataclasses import dataclass, field
from pathlib import Path

from reportlab.lib import colors
from reportlab.lib.pagesizes import A4, LETTER

from ...errors import JobError, excerpt
from ...resources import builtin_template, builtin_template_names
from ...units import UnitParseError, parse

__all__ = ["Template", "DEFAULT", "resolve_template", "load_template"]

PAGE_SIZES = {"letter": LETTER, "a4": A4}
MAX_TEMPLATE_BYTES = 200_000
MAX_LOGO_BYTES = 5_000_000
_KEY = "settings.template"
_HEX = re.compile(r"^#[0-9a-fA-F]{6}$")


@dataclass(frozen=True)
class Template:
    """Page and firm settings of a report (lengths in points)."""

    name: str = "letter (built in)"
    page: str = "letter"
    margins: tuple[float, float, float, float] = (54.0, 43.2, 36.0, 36.0)  # left, right, top, bottom (in pt)
    firm: str = "Consulting Structural Engineers"
    address: tuple[str, ...] = ()
    logo: Path | None = None
    font: Path | None = None
    font_bold: Path | None = None
    font_mono: Path | None = None
    font_size: float = 8.5
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


def resolve_template(value: str, job_path: str, allow_outside: bool = False) -> Path | None:
    """The template file named by ``settings.template`` (None for the built-in default); a path
    must resolve inside the job's folder or the shipped templates unless ``allow_outside``."""
    value = value.strip()
    if not value:
        return None
    if "/" in value or "\\" in value or value.endswith(".toml"):
        path = Path(job_path).resolve().parent / value
        if not path.is_file():
            raise JobError(
                job_path,
                _KEY,
                f"expected a template file; {excerpt(value)} (relative to the job file) "
                "does not exist or is not a regular file",
            )
        if not allow_outside:
            from .paths import outside_message

            why = outside_message(path, job_path)
            if why:
                raise JobError(job_path, _KEY, f"{excerpt(value)} {why}")
        return path
    if not re.fullmatch(r"[A-Za-z0-9_.-]{1,60}", value):
        raise JobError(
            job_path,
            _KEY,
            f'expected a template name like "a4" or a path to a .toml file, got {excerpt(value)}',
        )
    found = builtin_template(value)
    if found is not None:
        return found
    known = builtin_template_names()
    raise JobError(
        job_path,
        _KEY,
        f"expected one of the report templates ({', '.join(known) or 'none installed'}) "
        f"or a path to a .toml file, got {value!r}",
    )


def load_template(value: str, job_path: str, allow_outside: bool = False) -> Template:
    """Read and validate the template named in a job; the default when ``value`` is empty.
    Template, logo and font files must lie inside the job's folder or the shipped templates
    (:mod:`.paths`) unless ``allow_outside`` (``build --allow-outside``)."""
    path = resolve_template(value, job_path, allow_outside)
    if path is None:
        return DEFAULT
    return read_template_file(path, job_path, allow_outside)


def read_template_file(path: Path, job_path: str, allow_outside: bool = False) -> Template:
    """Parse one template file; every problem is a one-line JobError at settings.template."""

    def fail(key: str, msg: str) -> JobError:
        where = f"{path.name}: {key}: " if key else f"{path.name}: "
        return JobError(job_path, _KEY, where + msg)

    from ...safeio import FileRefused, read_regular

    try:
        doc = tomllib.loads(read_regular(path, MAX_TEMPLATE_BYTES, "a report template").decode("utf-8"))
    except FileRefused as exc:
        raise fail("", str(exc)) from None
    except UnicodeDecodeError as exc:
        raise fail(
            "", f"cannot read the template (expected UTF-8 text, bad byte at offset {exc.start})"
        ) from None
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
        raise fail("page.size", f'expected "letter" or "a4", got {excerpt(size)}')
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
    inside = None if allow_outside else job_path
    logo = _file(path, firm.get("logo"), "firm.logo", fail, (".png", ".jpg", ".jpeg"), MAX_LOGO_BYTES, inside)
    if logo is not None:
        _check_image(logo, fail)
    fonts = [
        _file(path, style.get(k), f"style.{k}", fail, (".ttf",), 30_000_000, inside)
        for k in ("font", "font_bold", "font_mono")
    ]
    for f, k in zip(fonts, ("font", "font_bold", "font_mono")):
        if f is not None:
            _check_font(f, f"style.{k}", fail)
    fsize = style.get("font_size", DEFAULT.font_size)
    if isinstance(fsize, bool) or not isinstance(fsize, (int, float)) or not 7 <= fsize <= 12:
        raise fail("style.font_size", f"expected a number of points from 7 to 12, got {excerpt(fsize)}")
    accent = style.get("accent", DEFAULT.accent)
    if not isinstance(accent, str) or not _HEX.match(accent):
        raise fail("style.accent", f'expected a colour like "#2b5d7d", got {excerpt(accent)}')
    return Template(
        name=path.name,
        page=size.lower(),
        margins=(margins[0], margins[1], margins[2], margins[3]),
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


def _file(
    template: Path, value, key: str, fail, exts: tuple[str, ...], max_bytes: int, inside: str | None = None
) -> Path | None:
    """The file ``value`` names relative to the template; with ``inside`` (the job file's path)
    it must resolve inside the job's folder or the shipped templates."""
    if value is None or value == "":
        return None
    if not isinstance(value, str):
        raise fail(key, "expected a file path relative to the template")
    p = template.parent / value
    if p.suffix.lower() not in exts:
        raise fail(
            key, f"expected a {' or '.join(e.lstrip('.').upper() for e in exts)} file, got {excerpt(value)}"
        )
    if not p.is_file():
        raise fail(
            key,
            f"expected a regular file; {excerpt(value)} (relative to the template) is missing or not a file",
        )
    if inside is not None:
        from .paths import outside_message

        why = outside_message(p, inside)
        if why:
            raise fail(key, f"{excerpt(value)} {why}")
    if p.stat().st_size > max_bytes:
        raise fail(key, f"file larger than {max_bytes:,} bytes")
    return p.resolve()


def _check_image(p: Path, fail) -> None:
    """Pixel dimensions from the header first (:mod:`.image_guard`), then a guarded decode."""
    from ...safeio import FileRefused
    from .image_guard import ImageRefused, checked_image

    try:
        checked_image(p)
    except (ImageRefused, FileRefused) as exc:
        raise fail("firm.logo", f"{p.name}: {exc}") from None


def _check_font(p: Path, key: str, fail) -> None:
    try:
        from reportlab.pdfbase.ttfonts import TTFontFile

        TTFontFile(str(p))
    except Exception as exc:  # reportlab raises TTFError and others for bad fonts
        raise fail(key, f"not a usable TrueType font ({type(exc).__name__})") from None
