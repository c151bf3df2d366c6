"""The grammar of a value written in a job file: numbers, trade dimensions, units, ``*`` and ``/``.

This module reads the text only; :mod:`calcreport.units` looks the units up in the one registry.
Nothing is evaluated as Python and pint's expression parser never sees the text: a unit name
(``in``, ``kN/m^3``) is the only part handed to pint, through ``parse_units``.

Grammar (documented for users in docs/job-format.md, "How values are written")::

    value    := [sign] term { ("*" | "/") term }
    term     := number [unit]
              | whole feet-mark [ ["-"] inches inch-mark ]      16'-6 1/2"   16 ft 6-1/2 in
    number   := decimal [ "×" "10" superscript ]                  9.25   1,219   5.0e8   381.2 × 10⁶
              | whole "/" whole                                   3/4
              | whole (" " | "-") whole "/" whole                 1 1/2   1-1/2
    unit     := name [power] { ("*" | "/" | "·") name [power] }   kN/m^3   kip*ft   mm⁴
    power    := ("^" | "**") integer | superscript digits         (-12 to 12)

Refused, never guessed (each with a message saying how to write it): a hyphen between two
numbers (``16-6 ft``), a mixed number without a unit (``1 1/2``), feet followed by a number
without an inch unit (``16 ft 6``), two values or two units side by side (``1 m 20 cm``,
``kip ft``), ``+`` or ``-`` between values, a sign before feet-inches or a mixed number, powers of
numbers, brackets, functions, a comma other than a thousands separator.

Source of the notation: common practice, no source (feet-inches as drawings give them, mixed
numbers as lumber and fastener sizes are written).
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from fractions import Fraction

__all__ = ["NotationError", "Term", "Expression", "read", "FEET", "INCHES"]

#: Unit names that make a term a foot or an inch for the feet-inches form.
FEET = frozenset({"'", "ft", "foot", "feet"})
INCHES = frozenset({'"', "in", "inch", "inches"})

_SUPER = str.maketrans("⁰¹²³⁴⁵⁶⁷⁸⁹⁻⁺", "0123456789-+")
_TOKEN = re.compile(
    r"""
    (?P<ws>\s+)
  | (?P<num>(?:\d{1,3}(?:,\d{3})+|\d+)(?:\.\d*)?(?:[eE][+-]?\d{1,3}(?!\d))?|\.\d+(?:[eE][+-]?\d{1,3}(?!\d))?)
  | (?P<sup>[⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+)
  | (?P<name>[A-Za-z_°µμ]+)
  | (?P<inch>"|″|'')
  | (?P<foot>'|′)
  | (?P<pow>\*\*|\^)
  | (?P<mul>[*·×])
  | (?P<div>/)
  | (?P<minus>[-−])
  | (?P<plus>\+)
    """,
    re.VERBOSE,
)
_MAX_EXPONENT = 12
_MAX_DECIMAL_EXP = 400


class NotationError(ValueError):
    """The text does not follow the grammar; the message says what to write instead."""


@dataclass(frozen=True)
class Term:
    """One number with its unit: ``magnitude`` exact, ``unit`` pint-ready text (``""``: none)."""

    magnitude: Fraction
    unit: str


@dataclass(frozen=True)
class Expression:
    """A value as written: its terms and the operators between them (``ops[i]`` joins
    ``terms[i]`` and ``terms[i + 1]``)."""

    terms: tuple[Term, ...]
    ops: tuple[str, ...]

    @property
    def arithmetic(self) -> bool:
        """True when the value is a product or quotient of several terms."""
        return bool(self.ops)


@dataclass
class _Tok:
    kind: str
    text: str
    space: bool  # whitespace right before it


def _tokens(text: str) -> list[_Tok]:
    out: list[_Tok] = []
    pos, space = 0, False
    while pos < len(text):
        m = _TOKEN.match(text, pos)
        if m is None:
            ch = text[pos]
            what = "brackets" if ch in "()[]{}" else f"the character {ch!r}"
            if ch == ",":
                raise NotationError(
                    "a comma is read only as a thousands separator (1,219 mm); write decimals with a point"
                )
            raise NotationError(f"{what} cannot be read here")
        kind = m.lastgroup or ""
        if kind == "num" and m.end() < len(text) and text[m.end()] in ",.0123456789":
            raise NotationError(
                "a comma is read only as a thousands separator (1,219 mm); write decimals with a point"
            )
        if kind == "ws":
            space = True
        else:
            out.append(_Tok(kind, m.group(), space))
            space = False
        pos = m.end()
    return out


def _decimal(text: str) -> Fraction:
    mant, _, exp = text.replace(",", "").lower().partition("e")
    if exp and abs(int(exp)) > _MAX_DECIMAL_EXP:
        raise NotationError(f"the exponent of {text} is out of range")
    value = Fraction(mant if mant not in ("", ".") else "0")
    return value * Fraction(10) ** int(exp) if exp else value


def _whole(t: _Tok) -> bool:
    return t.kind == "num" and t.text.isdigit()


class _Parser:
    def __init__(self, text: str):
        self.text = text
        self.toks = _tokens(text)
        self.i = 0

    # -- helpers --------------------------------------------------------------------------
    def peek(self, k: int = 0) -> _Tok | None:
        j = self.i + k
        return self.toks[j] if j < len(self.toks) else None

    def take(self) -> _Tok:
        t = self.toks[self.i]
        self.i += 1
        return t

    def at(self, *kinds: str, k: int = 0) -> bool:
        t = self.peek(k)
        return t is not None and t.kind in kinds

    # -- grammar --------------------------------------------------------------------------
    def value(self) -> Expression:
        if not self.toks:
            raise NotationError("nothing written")
        sign = 1
        if self.at("minus", "plus") and self.at("num", k=1) and not self.peek(1).space:  # type: ignore[union-attr]
            sign = -1 if self.take().kind == "minus" else 1
        terms = [self.term(signed=sign != 1)]
        if sign == -1:
            terms[0] = Term(-terms[0].magnitude, terms[0].unit)
        ops: list[str] = []
        while self.peek() is not None:
            t = self.take()
            if t.kind in ("mul", "div"):
                if not self.at("num"):
                    raise NotationError(
                        f"{t.text!r} must be followed by a number with its unit (15 psf * 14 ft)"
                        if not self.at("minus", "plus")
                        else "a sign inside a product or quotient cannot be read; write the value alone"
                    )
                if t.kind == "div" and not terms[-1].unit and all(not x.unit for x in terms):
                    raise NotationError(
                        "a number divided by a value is ambiguous; write a fraction without spaces "
                        "(3/4 in) or put the unit first (1 kip / 2 ft)"
                    )
                ops.append("/" if t.kind == "div" else "*")
                terms.append(self.term(signed=False))
            elif t.kind in ("minus", "plus"):
                raise NotationError(
                    "+ and - are not read between values (only * and /); a hyphen joins feet and "
                    "inches only when it touches both (16'-6\" or 16 ft-6 in)"
                )
            elif t.kind == "num":
                raise NotationError(
                    "two values side by side cannot be read; only feet then inches are written "
                    "that way (16 ft 6 in); put * or / between other values"
                )
            elif t.kind == "name":
                raise NotationError(f"two units side by side ({t.text!r} after a unit); write kip*ft")
            else:
                raise NotationError(f"{t.text!r} cannot be read here")
        return Expression(tuple(terms), tuple(ops))

    def number(self, signed: bool) -> tuple[Fraction, str]:
        """A number; returns its value and its form: "decimal", "fraction" or "mixed"."""
        t = self.take()
        nxt = self.peek()
        # whole/whole  (a fraction: no spaces)
        if _whole(t) and self.at("div") and not nxt.space and self.at("num", k=1) and not self.peek(1).space:  # type: ignore[union-attr]
            self.take()
            den = self.take()
            if not _whole(den):
                raise NotationError(f"a fraction is written with whole numbers, like 3/4 (got {self.text!r})")
            if int(den.text) == 0:
                raise NotationError("division by zero in a fraction")
            return Fraction(int(t.text), int(den.text)), "fraction"
        # whole[ |-]whole/whole  (a mixed number)
        if _whole(t) and self.at("num") and _whole(nxt) and self.at("div", k=1) and self.at("num", k=2):  # type: ignore[arg-type]
            if nxt.space and not self.peek(1).space and not self.peek(2).space:  # type: ignore[union-attr]
                return self._mixed(t, signed)
        if _whole(t) and self.at("minus") and not nxt.space:  # type: ignore[union-attr]
            if (
                self.at("num", k=1)
                and not self.peek(1).space  # type: ignore[union-attr]
                and self.at("div", k=2)
                and not self.peek(2).space  # type: ignore[union-attr]
                and self.at("num", k=3)
                and not self.peek(3).space  # type: ignore[union-attr]
            ):
                self.take()  # the hyphen of 1-1/2
                return self._mixed(t, signed)
            raise NotationError(
                "a hyphen between two numbers is read neither as a minus nor as feet-inches; write "
                "16'-6\" or 16 ft 6 in for feet-inches, 1-1/2 in for a mixed number"
            )
        if t.kind != "num":
            raise NotationError(f"expected a number, got {t.text!r}")
        value = _decimal(t.text)
        if self.at("mul") and self.peek().text == "×" and self.at("num", k=1) and self.peek(1).text == "10":  # type: ignore[union-attr]
            if self.at("sup", k=2):
                self.take(), self.take()
                exp = int(self.take().text.translate(_SUPER))
                if abs(exp) > _MAX_DECIMAL_EXP:
                    raise NotationError("the power of ten is out of range")
                value *= Fraction(10) ** exp
        if self.at("pow", "sup"):
            raise NotationError("a power applies to a unit only (in^4), not to a number; write 5.0e8")
        return value, "decimal"

    def _mixed(self, whole: _Tok, signed: bool) -> tuple[Fraction, str]:
        if signed:
            raise NotationError("a sign before a mixed number cannot be read; write -1.5 in")
        num = self.take()
        self.take()
        den = self.take()
        if not (_whole(num) and _whole(den)):
            raise NotationError("a mixed number is written with whole numbers, like 1 1/2 in or 1-1/2 in")
        if int(den.text) == 0:
            raise NotationError("division by zero in a fraction")
        frac = Fraction(int(num.text), int(den.text))
        if frac >= 1:
            raise NotationError(f"the fraction of a mixed number must be below 1 (got {num.text}/{den.text})")
        return int(whole.text) + frac, "mixed"

    def unit(self) -> str:
        """A unit expression: names with powers joined by * / ·; returns pint-ready text."""
        parts: list[str] = []
        while True:
            t = self.take()
            name = t.text.replace("µ", "u").replace("μ", "u")
            parts.append(name)
            if self.at("pow"):
                self.take()
                parts.append("**" + self._exponent())
            elif self.at("sup"):
                exp = self.take().text.translate(_SUPER)
                self._check_exponent(exp)
                parts.append("**" + exp)
            if self.at("mul", "div") and self.at("name", k=1):
                op = self.take()
                parts.append("/" if op.kind == "div" else "*")
                continue
            return "".join(parts)

    def _exponent(self) -> str:
        sign = ""
        if self.at("minus", "plus"):
            sign = "-" if self.take().kind == "minus" else ""
        t = self.peek()
        if t is None or t.kind != "num" or not re.fullmatch(r"\d{1,2}(\.\d{1,3})?", t.text):
            raise NotationError("a power must be a plain exponent from -12 to 12, like in^4")
        self.take()
        exp = sign + t.text
        self._check_exponent(exp)
        if self.at("pow", "sup"):
            raise NotationError("a power of a power cannot be read")
        return exp

    @staticmethod
    def _check_exponent(exp: str) -> None:
        if abs(float(exp)) > _MAX_EXPONENT:
            raise NotationError("a power must be a plain exponent from -12 to 12, like in^4")

    def term(self, signed: bool) -> Term:
        if not self.at("num"):
            t = self.peek()
            what = repr(t.text) if t is not None else "nothing"
            raise NotationError(f"expected a number, got {what}")
        first = self.peek()
        value, form = self.number(signed)
        if self.at("foot"):
            self.take()
            unit = "'"
        elif self.at("inch"):
            self.take()
            unit = '"'
        elif self.at("name"):
            unit = self.unit()
        else:
            if form == "mixed":
                raise NotationError("a mixed number needs its unit, like 1 1/2 in")
            return Term(value, "")
        if unit in FEET:
            inches = self._inches(signed, first)
            if inches is not None:
                if form != "decimal" or not first.text.isdigit():  # type: ignore[union-attr]
                    raise NotationError("the feet of a feet-inches value are a whole number (16'-6\")")
                return Term(value * 12 + inches, "inch")
            return Term(value, "foot")
        if unit in INCHES:
            return Term(value, "inch")
        return Term(value, unit)

    def _inches(self, signed: bool, first) -> Fraction | None:
        """The inches after feet (``-6"``, `` 6 1/2 in``, ``6-1/2"``), or None when none follow."""
        t = self.peek()
        if t is None:
            return None
        if t.kind == "minus":
            after = self.peek(1)
            if t.space or after is None or after.kind != "num" or after.space:
                return None  # a spaced hyphen: refused as an operator by the caller
            self.take()
        elif t.kind != "num":
            return None
        if signed:
            raise NotationError(
                "a sign before feet-inches cannot be read; write a negative value in one unit"
            )
        value, _ = self.number(False)
        unit_tok = self.peek()
        if unit_tok is None or unit_tok.kind not in ("inch", "name"):
            raise NotationError("the inches after feet need their unit (16 ft 6 in or 16'-6\")")
        if unit_tok.kind == "name" and unit_tok.text not in INCHES:
            raise NotationError(
                f"only inches may follow feet (16 ft 6 in); got {unit_tok.text!r} after the feet"
            )
        self.take()
        if self.at("pow", "sup"):
            raise NotationError("a power cannot follow feet-inches")
        if value >= 12:
            raise NotationError("the inches of a feet-inches value must be below 12 (16'-6\")")
        return value


def read(text: str) -> Expression:
    """Read ``text`` by the grammar above.

    Raises:
        NotationError: with a message saying what to write.

    Example:
        >>> e = read("16'-6 1/2\\"")
        >>> e.terms[0].magnitude, e.terms[0].unit
        (Fraction(397, 2), 'inch')
    """
    return _Parser(text.strip()).value()
