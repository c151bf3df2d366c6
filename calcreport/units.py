"""The one pint registry of the process, trade units, and parsing of unit strings.

Every dimensional value in a job file is a string such as ``"5.5 in"``, ``"140 mm"``,
``"1600 ksi"`` or ``"250 plf"``. :func:`parse` turns it into a :class:`pint.Quantity` and
checks its dimension. The text is read by our own grammar (:mod:`calcreport.notation`: trade
feet-inches, mixed numbers, products and quotients of values); only unit names reach pint (its
``parse_units``, looked up once per unit and cached). Nothing is evaluated as Python.
"""

from __future__ import annotations

import math
import re
import sys
from dataclasses import dataclass
from functools import cache, lru_cache
from typing import Any

import pint

from . import notation
from .notation import NotationError

__all__ = [
    "ureg",
    "Q_",
    "Quantity",
    "DIMENSIONS",
    "UnitParseError",
    "Written",
    "parse",
    "parse_value",
    "dimension_name",
]


def _registry() -> pint.UnitRegistry:
    """The registry, loaded from pint's definition cache when it can be (about 0.2 s faster to
    start; see benchmarks/cold_start.py). CALCREPORT_NO_UNIT_CACHE=1 turns the cache off."""
    import os

    if os.environ.get("CALCREPORT_NO_UNIT_CACHE") != "1":
        try:
            return pint.UnitRegistry(autoconvert_offset_to_baseunit=True, cache_folder=":auto:")
        except Exception:  # an unwritable or damaged cache must never stop the tool
            pass
    return pint.UnitRegistry(autoconvert_offset_to_baseunit=True)


ureg = _registry()
# Trade units (common practice, no source): pounds per linear foot, kips per linear foot,
# pounds per square foot, pounds per cubic foot.
ureg.define("plf = lbf / ft")
ureg.define("klf = kip / ft")
ureg.define("psf = lbf / ft ** 2")
ureg.define("pcf = lbf / ft ** 3")
ureg.define("ksf = kip / ft ** 2")
Q_ = ureg.Quantity
Quantity = pint.Quantity

#: Named physical dimensions a job file key may expect, with an example for error messages.
DIMENSIONS: dict[str, tuple[str, str]] = {
    "length": ("[length]", '"9.25 in" or "235 mm"'),
    "area": ("[length] ** 2", '"16.9 in^2" or "10900 mm^2"'),
    "volume": ("[length] ** 3", '"61.9 in^3"'),
    "inertia": ("[length] ** 4", '"1210 in^4" or "5.0e8 mm^4"'),
    "force": ("[force]", '"10 kip" or "45 kN"'),
    "stress": ("[force] / [length] ** 2", '"1600 ksi" or "11 GPa"'),
    "line_load": ("[force] / [length]", '"250 plf" or "3.5 kN/m"'),
    "moment": ("[force] * [length]", '"120 kip*ft" or "160 kN*m"'),
    "weight_density": ("[force] / [length] ** 3", '"35 pcf" or "5 kN/m^3"'),
    "mass_density": ("[mass] / [length] ** 3", '"500 kg/m^3"'),
}


class UnitParseError(ValueError):
    """A unit string could not be read or has the wrong dimension."""


@cache
def _dimensionality(name: str):
    return ureg.get_dimensionality(DIMENSIONS[name][0])


def dimension_name(q: Quantity) -> str:
    """Return our name for the dimension of ``q`` (``"length"``, ``"force"`` …) or pint's text."""
    for name in DIMENSIONS:
        if q.dimensionality == _dimensionality(name):
            return name
    if q.dimensionless:
        return "number"
    return str(q.dimensionality)


def _finite(x: float, text: str, what: str) -> float:
    """``x`` when it is a finite number that is zero or normal; an infinite, NaN or subnormal
    magnitude (below about 2.2e-308, where floats lose precision) is refused."""
    if not math.isfinite(x) or (x != 0.0 and abs(x) < sys.float_info.min):
        raise UnitParseError(f"expected {what}, got {text!r} (the number is out of range)")
    return x


@lru_cache(maxsize=512)
def _unit(text: str) -> pint.Unit:
    """The registry's unit for a unit expression such as ``kN/m**3`` (looked up once, cached)."""
    return ureg.parse_units(text) if text else ureg.dimensionless


@dataclass(frozen=True)
class Written:
    """A value read from a job file: the quantity, and whether it was written as a product or
    quotient of several values (``"15 psf * 14 ft"``), which the report shows as written."""

    quantity: Quantity
    arithmetic: bool


def _what(expected: str | None) -> str:
    if not expected:
        return 'a value with its unit, like "5.5 in"'
    return f"a {expected.replace('_', ' ')} with its unit, like {DIMENSIONS[expected][1]}"


def parse(text: object, expected: str | None = None) -> Quantity:
    """Parse a value with its unit and check its dimension.

    Args:
        text: the string from the job file, e.g. ``"5.5 in"``, ``16'-6 1/2"``, ``"15 psf * 14 ft"``
            (the grammar is in :mod:`calcreport.notation` and docs/job-format.md).
        expected: a key of :data:`DIMENSIONS`, or ``None`` to accept any dimension.

    Returns:
        A quantity of the shared registry (a float magnitude).

    Raises:
        UnitParseError: with a message that says what was expected.

    Example:
        >>> round(parse("1-1/2 in", "length").to("mm").magnitude, 6)
        38.1
        >>> parse("16 ft 6-1/2 in", "length")
        <Quantity(198.5, 'inch')>
    """
    return parse_value(text, expected).quantity


def parse_value(text: object, expected: str | None = None) -> Written:
    """:func:`parse`, also saying whether the text was a product or quotient of values."""
    what = _what(expected)
    if isinstance(text, bool) or not isinstance(text, (str, int, float)):
        raise UnitParseError(f"expected {what}, got {type(text).__name__}")
    if isinstance(text, (int, float)):
        if expected:
            raise UnitParseError(f"expected {what}, got the bare number {text!r}")
        return Written(check_magnitude(Q_(_finite(float(text), str(text), what), ""), text, what), False)
    if len(text) > 80:
        raise UnitParseError(f"expected {what}, got {text[:40]!r}… (at most 80 characters)")
    plain = _PLAIN.fullmatch(text)
    if plain is not None:  # fast path: "9.25 in", "-2 kip", "5.0 kN/m^3"
        found = _plain_unit(plain.group(3))
        if found is not None:
            unit, dim = found
            value = _finite(float(plain.group(2)), text, what)
            q = Q_(-value if plain.group(1) else value, unit)
            if expected and dim != _dimensionality(expected):
                _wrong_dimension(q, text, what)
            return Written(check_magnitude(q, text, what), False)
    try:
        expr = notation.read(text)
    except NotationError as exc:
        raise UnitParseError(f"expected {what}, could not read {text!r}: {exc}") from None
    try:
        mag = expr.terms[0].magnitude
        unit = _unit(expr.terms[0].unit)
        for op, term in zip(expr.ops, expr.terms[1:]):
            if op == "*":
                mag, unit = mag * term.magnitude, unit * _unit(term.unit)
            else:
                if term.magnitude == 0:
                    raise UnitParseError(f"expected {what}, got {text!r} (division by zero)")
                mag, unit = mag / term.magnitude, unit / _unit(term.unit)
        value = float(mag)
    except UnitParseError:
        raise
    except OverflowError:
        raise UnitParseError(f"expected {what}, got {text!r} (the number is out of range)") from None
    except Exception as exc:  # pint raises several kinds for unknown units; the message is ours
        raise UnitParseError(f"expected {what}, could not read {text!r} ({type(exc).__name__})") from None
    q = Q_(_finite(value, text, what), unit)
    if expected and q.dimensionality != _dimensionality(expected):
        _wrong_dimension(q, text, what)
    return Written(check_magnitude(q, text, what), expr.arithmetic)


def _wrong_dimension(q: Quantity, text: str, what: str) -> None:
    if q.dimensionless:
        raise UnitParseError(f"expected {what}, got {text!r} without a unit")
    raise UnitParseError(f"expected {what}, got {text!r} which is a {dimension_name(q).replace('_', ' ')}")


#: A plain "number unit" string: optional minus, a decimal number, names joined by * or / with
#: integer powers. Every string it matches reads the same through :mod:`calcreport.notation`
#: (the unit part is read by that grammar once and cached); anything else takes the full grammar.
_PLAIN = re.compile(
    r"\s*([-−]?)(\d+(?:\.\d*)?(?:[eE][+-]?\d{1,3})?|\.\d+(?:[eE][+-]?\d{1,3})?)"
    r"\s*([A-Za-z_]+(?:\s*(?:\*\*|\^)\s*-?\d{1,2}|\s*[*/]\s*[A-Za-z_]+)*)\s*"
)


@lru_cache(maxsize=512)
def _plain_unit(text: str) -> tuple[pint.Unit, Any] | None:
    """The unit of a plain value's unit part and its dimensionality, read once by the full
    grammar (``None`` when that part is not a plain unit)."""
    try:
        expr = notation.read("1 " + text)
        if expr.ops or len(expr.terms) != 1 or expr.terms[0].magnitude != 1:
            return None
        unit = _unit(expr.terms[0].unit)
    except Exception:
        return None
    return unit, ureg.get_dimensionality(unit)


def check_magnitude(q: Quantity, text: object, what: str) -> Quantity:
    """``q`` unchanged if its magnitude, as written and in base units, is finite and either zero or
    a normal float (not subnormal, i.e. not below 2.2e-308 in size, where floats lose digits).

    A value that cannot be held exactly as written (``"5e-324 in"``, ``"nan in"``, ``"inf psi"``,
    ``"1e308 mi"`` which overflows in metres) is refused rather than silently rounded.
    """
    shown = repr(text)[:80]
    try:
        mags = [float(q.magnitude), float(q.to_base_units().magnitude)]
    except (TypeError, ValueError, ArithmeticError):
        raise UnitParseError(f"expected {what}, got {shown}") from None
    for m in mags:
        if not math.isfinite(m):
            raise UnitParseError(f"expected {what}, got {shown} (not a finite number)")
        if m != 0 and abs(m) < sys.float_info.min:
            raise UnitParseError(
                f"expected {what}, got {shown} (too small to hold exactly; use zero or a normal size)"
            )
    return q
