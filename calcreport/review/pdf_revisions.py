"""The revisions of a PDF file: what the build wrote, and what each later incremental update changed.

A PDF may be extended by appending incremental updates (ISO 32000-1 §7.5.6): each adds or replaces
objects and ends with its own cross-reference section, trailer and ``%%EOF``. A viewer shows the
last revision. ``calcreport verify`` must therefore look past the first ``%%EOF``: every update
after the build is listed here with what kind of objects it touches (a page's content, the
document information, an annotation, a signature …), and any bytes after the last ``%%EOF`` that
are not an update are reported as appended data.

pyHanko's reader gives the revisions (``xrefs.total_revisions``, ``explicit_refs_in_revision``,
``get_historical_resolver``). Imported only when a PDF is checked.
"""

from __future__ import annotations

import io
from dataclasses import dataclass, field
from typing import Any

__all__ = ["Revision", "FileRevisions", "read_revisions", "describe"]


@dataclass(frozen=True)
class Revision:
    """One revision: its number (0 = the first), byte span and what its objects are."""

    number: int
    start: int
    end: int  # one past its %%EOF (and end-of-line)
    kinds: tuple[str, ...] = ()  # "content of sheet 1", "document information", "signature" …
    sheets: tuple[int, ...] = ()  # sheets whose page or content it replaces
    signature_only: bool = False  # adds or fills signature fields and their appearance only


@dataclass
class FileRevisions:
    revisions: list[Revision] = field(default_factory=list)
    trailing: int = 0  # bytes after the last %%EOF that are not whitespace
    error: str = ""  # the file's revisions could not be read (damaged cross-references)
    reader: Any = None  # pyHanko PdfFileReader, for signature checks


def _eof_end(data: bytes, start: int) -> int:
    """One past the first ``%%EOF`` (and its end-of-line) at or after ``start``; -1 if none."""
    i = data.find(b"%%EOF", start)
    if i < 0:
        return -1
    j = i + 5
    if data[j : j + 2] == b"\r\n":
        return j + 2
    if data[j : j + 1] in (b"\n", b"\r"):
        return j + 1
    return j


def _trailing(data: bytes, end: int) -> int:
    return len(data[end:].strip(b" \t\r\n\f\x00"))


def read_revisions(data: bytes) -> FileRevisions:
    """Split ``data`` into revisions (with pyHanko's reader) and describe each update."""
    import logging

    logging.getLogger("pyhanko").setLevel(logging.CRITICAL + 10)
    out = FileRevisions()
    from pyhanko.pdf_utils.reader import PdfFileReader  # a missing package is not a damaged file

    try:
        reader = PdfFileReader(io.BytesIO(data), strict=False)
        total = reader.xrefs.total_revisions
    except Exception as exc:  # a damaged or forged file: say so, the rest of verify still runs
        out.error = f"the file's cross-reference sections cannot be read ({type(exc).__name__})"
        end = _eof_end(data, 0)
        if end > 0:
            out.revisions.append(Revision(0, 0, end))
            out.trailing = _trailing(data, end)
        return out
    out.reader = reader
    start = 0
    pages0 = _page_refs(reader, 0)
    for rev in range(total):
        try:
            sx = reader.xrefs.get_startxref_for_revision(rev)
        except Exception:
            sx = start
        end = _eof_end(data, max(sx, start))
        if end < 0:
            end = len(data)
        if rev == 0:
            out.revisions.append(Revision(0, 0, end))
        else:
            out.revisions.append(_describe_update(reader, rev, start, end, pages0))
        start = end
    out.trailing = _trailing(data, start)
    return out


def _page_refs(reader, rev: int) -> dict[tuple[int, int], int]:
    """Object id → sheet number, for pages and their content streams in revision ``rev``."""
    from pyhanko.pdf_utils import generic

    hist = reader.get_historical_resolver(rev)
    out: dict[tuple[int, int], int] = {}
    try:
        pages = _page_list(hist)
    except Exception:
        return out
    for sheet, ref in enumerate(pages, 1):
        out[(ref.idnum, ref.generation)] = sheet
        try:
            page = ref.get_object()
            c = page.raw_get("/Contents") if "/Contents" in page else None
            if isinstance(c, generic.IndirectObject) and isinstance(c.get_object(), generic.ArrayObject):
                out.setdefault((c.idnum, c.generation), sheet)
                c = c.get_object()
            for r in c if isinstance(c, generic.ArrayObject) else [c]:
                if isinstance(r, generic.IndirectObject):
                    out.setdefault((r.idnum, r.generation), sheet)
        except Exception:
            continue
    return out


def _page_list(hist) -> list:
    from pyhanko.pdf_utils import generic

    found: list = []

    def walk(node, depth: int) -> None:
        if depth > 32:
            return
        for k in node["/Kids"]:
            ref = k if isinstance(k, generic.IndirectObject) else None
            obj = k.get_object()
            if obj.get("/Type") == "/Pages":
                walk(obj, depth + 1)
            elif ref is not None:
                found.append(ref)

    walk(hist.root["/Pages"], 0)
    return found


def _describe_update(reader, rev: int, start: int, end: int, pages0: dict) -> Revision:
    """What the objects written in revision ``rev`` are."""
    from pyhanko.pdf_utils import generic

    hist = reader.get_historical_resolver(rev)
    pages_now = _page_refs(reader, rev)
    try:
        info = hist.trailer_view.raw_get("/Info")
        info_id = (info.idnum, info.generation) if isinstance(info, generic.IndirectObject) else None
    except Exception:
        info_id = None
    kinds: set[str] = set()
    sheets: set[int] = set()
    sig_only = True
    for ref in sorted(reader.xrefs.explicit_refs_in_revision(rev), key=lambda r: (r.idnum, r.generation)):
        key = (ref.idnum, ref.generation)
        try:
            obj = hist(ref)
        except Exception:
            kinds.add("an unreadable object")
            sig_only = False
            continue
        d = obj if isinstance(obj, generic.DictionaryObject) else None
        typ = str(d.get("/Type", "")) if d is not None else ""
        sheet = pages_now.get(key) or pages0.get(key)
        if key == info_id:
            kinds.add("document information (metadata)")
            sig_only = False
        elif typ == "/Page":
            kinds.add(f"page dictionary of sheet {sheet}" if sheet else "a page dictionary")
            if sheet:
                sheets.add(sheet)
            sig_only = False if not _only_annots_changed(reader, ref, rev) else sig_only
        elif typ == "/Sig" or typ == "/DocTimeStamp":
            kinds.add("a signature" if typ == "/Sig" else "a document timestamp")
        elif d is not None and d.get("/FT") == "/Sig":
            kinds.add("a signature field")
        elif typ == "/Catalog":
            kinds.add("document catalog")
        elif typ == "/DSS" or typ == "/VRI":
            kinds.add("validation data (DSS)")
        elif d is not None and "/Fields" in d:
            kinds.add("form (AcroForm)")
        elif typ == "/XObject" or (d is not None and d.get("/Subtype") == "/Form"):
            kinds.add("an appearance stream")
        elif typ == "/Font" or typ == "/FontDescriptor" or typ == "/Encoding":
            kinds.add("fonts")
        elif typ == "/Annot" or (d is not None and "/Subtype" in d and "/Rect" in d):
            sub = str(d.get("/Subtype", "?")) if d is not None else "?"
            kinds.add(f"an annotation ({sub.lstrip('/')})")
            sig_only = False
        elif sheet:
            kinds.add(f"content of sheet {sheet}")
            sheets.add(sheet)
            sig_only = False
        elif isinstance(obj, generic.StreamObject):
            kinds.add("a stream")
        else:
            kinds.add("other objects")
            sig_only = False
    if reader.xrefs.refs_freed_in_revision(rev):
        kinds.add("deleted objects")
        sig_only = False
    return Revision(rev, start, end, tuple(sorted(kinds)), tuple(sorted(sheets)), sig_only and bool(kinds))


def _only_annots_changed(reader, ref, rev: int) -> bool:
    """A page rewritten only to list a new annotation (what adding a signature field does)."""
    try:
        old = reader.get_historical_resolver(rev - 1)(ref)
        new = reader.get_historical_resolver(rev)(ref)
        keys = set(old.keys()) | set(new.keys())
        return all(
            k == "/Annots" or old.raw_get(k) == new.raw_get(k) for k in keys if k in old and k in new
        ) and (set(old.keys()) ^ set(new.keys()) <= {"/Annots"})
    except Exception:
        return False


def describe(r: Revision) -> str:
    """ "changes the content of sheet 1 and document information (metadata)"."""
    if not r.kinds:
        return "writes no objects"
    return "changes: " + ", ".join(r.kinds)
