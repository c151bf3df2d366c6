"""Text of the report's TrueType fonts encoded once per document (issue 15 item 8).

Every string drawn in an embedded TrueType font goes through the font's ``splitString``: a loop in
Python over the string's characters that gives each new character its code in the document's
subsets of the font and returns the string as (subset, bytes) pieces. A report draws the same
strings over and over (labels, symbols, units, sources, column heads, the title block of every
sheet), and once its characters have their codes the pieces of a string never change for that
document: reportlab never takes a code back. :func:`memoise_fonts` makes the fonts look each
string up first, in a table kept with the font's own state for that document (so it goes when the
document goes); a string met for the first time is split by reportlab as before, so the codes,
subsets and page content are byte for byte those reportlab writes.

:func:`draw_line` writes one line of runs (a one-line table cell) as the operators reportlab's
text object writes for it — the same ``q BT … Tm … Tf … rg (…) Tj … T* ET Q``, byte for byte —
without building a text object, saving and restoring the canvas's state (the line changes none
of it) or measuring each run again; each run's operators are kept with the font's state for the
document. Where the line needs anything else (a font that is not an embedded TrueType font, a
colour that is not plain RGB, a transparency other than the current one, a top-down canvas) it
returns ``False`` and the caller draws through reportlab's text object.
"""

from __future__ import annotations

from collections.abc import Callable

from reportlab.lib.colors import Color
from reportlab.lib.rl_accel import fp_str
from reportlab.pdfbase import pdfmetrics

__all__ = ["memoise_fonts", "draw_line", "MEMO_MAX"]

#: strings remembered per font and document before the table starts afresh (bounds its memory)
MEMO_MAX = 50_000
_DONE: set[str] = set()

Pieces = list[tuple[int, bytes]]


def _memoised(font, split: Callable[..., Pieces]) -> Callable[..., Pieces]:
    def split_string(text, doc, encoding="utf-8") -> Pieces:
        state = font.state.get(doc) if type(text) is str else None
        if state is None:  # the document's first string in this font (or bytes): as reportlab does
            return split(text, doc, encoding)
        memo = state.__dict__.get("_calc_split")
        if memo is None:
            memo = state._calc_split = {}
        hit = memo.get(text)
        if hit is None:
            if len(memo) >= MEMO_MAX:
                memo.clear()
            hit = memo[text] = split(text, doc, encoding)
        return hit[:]  # a fresh list, as reportlab returns: the pieces themselves are immutable

    return split_string


def memoise_fonts(*names: str) -> None:
    """Make the registered TrueType fonts ``names`` remember how each string splits (idempotent;
    fonts of other kinds, and names not registered, are left as they are)."""
    for name in names:
        if name in _DONE:
            continue
        _DONE.add(name)
        try:
            font = pdfmetrics.getFont(name)
        except KeyError:
            continue
        state = getattr(font, "state", None)
        if not getattr(font, "_dynamicFont", 0) or not hasattr(state, "get") or "splitString" in vars(font):
            continue
        font.splitString = _memoised(font, font.splitString)


def _run_ops(font, canvas, text: str, size: float, leading: float, subset: int) -> tuple[str, int]:
    """The operators reportlab's text object writes for ``text`` in ``font`` (its ``_formatText``)
    when the subset selected so far is ``subset``, and the subset selected after it."""
    doc = canvas._doc
    state = font.state.get(doc)
    memo = state.__dict__.get("_calc_ops") if state is not None else None
    key = (text, size, leading, subset)
    if memo is not None:
        hit = memo.get(key)
        if hit is not None:
            return hit
    ops: list[str] = []
    head = ""
    for piece_subset, piece in font.splitString(text, doc):
        if piece_subset != subset:
            head = head or f"{fp_str(size)} Tf {fp_str(leading)} TL"
            ops.append(f"{font.getSubsetInternalName(piece_subset, doc)} {head}")
            subset = piece_subset
        ops.append(f"({canvas._escape(piece)}) Tj")
    out = (" ".join(ops), subset)
    state = font.state[doc]
    memo = state.__dict__.get("_calc_ops")
    if memo is None or len(memo) >= MEMO_MAX:
        memo = state._calc_ops = {}
    memo[key] = out
    return out


def draw_line(canvas, x: float, y: float, dx: float, runs, size: float, leading: float) -> bool:
    """Write the runs ``(text, font name, colour)`` as one line of text starting at (x, y),
    moved ``dx`` along it, ended by T* — what ``beginText(x, y)``, ``setXPos(dx)``, ``setFont``
    and ``setFillColor`` on each change, ``textOut`` and a last ``textLine``, ``setXPos(-dx)``
    and ``drawText`` inside ``saveState``/``restoreState`` write. ``False``: nothing written,
    the line needs reportlab's text object (module docstring)."""
    if not canvas.bottomup or canvas._enforceColorSpace is not None:
        return False
    alpha = canvas._extgstate.getValue("ca")
    fonts = []
    for _, name, colour in runs:
        font = pdfmetrics.getFont(name)
        if not getattr(font, "_dynamicFont", 0) or type(colour) is not Color:
            return False
        if colour.alpha is not None and colour.alpha != alpha:
            return False
        fonts.append(font)
    code = ["BT", f"1 0 0 1 {fp_str(x, y)} Tm"]
    if dx:
        code.append(f"{fp_str(dx, 0)} Td")
    current_font = current_colour = None
    subset = -1
    last = len(runs) - 1
    for k, ((text, name, colour), font) in enumerate(zip(runs, fonts)):
        if name != current_font:
            current_font, subset = name, -1  # setFont of a TrueType font selects no subset yet
        if colour != current_colour:
            code.append(f"{fp_str((colour.red, colour.green, colour.blue))} rg")
            if colour.alpha is not None:
                canvas._doc.ensureMinPdfVersion("transparency")
            current_colour = colour
        ops, subset = _run_ops(font, canvas, text, size, leading, subset)
        code.append(f"{ops} T*" if k == last else ops)
    if dx:
        code.append(f"{fp_str(-dx, 0)} Td")
    code.append("ET")
    canvas._code.extend(("q", " ".join(code), "Q"))
    return True
