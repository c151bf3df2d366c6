"""The one pint registry of the process, trade units, and parsing of unit strings.

Every dimensional value in a job file is a string such as ``"5.5 in"``, ``"140 mm"``,
``"1600 ksi"`` or ``"250 plf"``. :func:`parse` turns it into a :class:`pint.Quantity` and
checks its dimension. Only pint's own expression parser ever sees the text; nothing is
evaluated as Python.
"""

from __future__ import annotations

import re
from functools import cache
from typing import Any

import pint

__all__ = ["ureg", "Q_", "Quantity", "DIMENSIONS", "UnitParseError", "parse", "dimension_name"]


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

_MIXED_FRACTION = re.compile(r"^\s*(\d+)\s*-\s*(\d+)\s*/\s*(\d+)(?=\s|[a-zA-Z\"']|$)")
_SAFE = re.compile(r"^[0-9A-Za-z_ .+\-*/^()°µμ²³⁴'\"]*$")
_POWER = re.compile(r"\*\*|\^")
#: What may follow a power operator: one small literal exponent (``in^2``, ``ft ** -1``), not a
#: bracket or another power, so no text can ask pint for a number with millions of digits.
_EXPONENT = re.compile(r"\s*[+-]?\d{1,2}(\.\d{1,3})?(?!\s*(\*\*|\^|\d|\.))")


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


def _normalise(text: str) -> str:
    """Trade notation to pint's: ``1-1/2 in`` → ``1.5 in``; ``²`` → ``^2``; feet/inch marks."""
    m = _MIXED_FRACTION.match(text)
    if m:
        whole, num, den = (int(g) for g in m.groups())
        if den == 0:
            raise UnitParseError("division by zero in a fraction")
        text = f"{whole + num / den!r}{text[m.end() :]}"
    text = text.replace("²", "^2").replace("³", "^3").replace("⁴", "^4")
    text = text.replace("·", "*").replace("×", "*").replace("μ", "u").replace("µ", "u")
    text = text.replace("'", " ft ").replace('"', " in ")
    return text.strip()


def parse(text: object, expected: str | None = None) -> Quantity:
    """Parse a value with its unit and check its dimension.

    Args:
        text: the string from the job file, e.g. ``"5.5 in"``.
        expected: a key of :data:`DIMENSIONS`, or ``None`` to accept any dimension.

    Returns:
        A quantity of the shared registry.

    Raises:
        UnitParseError: with a message that says what was expected.

    Example:
        >>> round(parse("1-1/2 in", "length").to("mm").magnitude, 6)
        38.1
    """
    example = DIMENSIONS[expected][1] if expected else '"5.5 in"'
    what = (
        f"a {expected.replace('_', ' ')} with its unit, like {example}"
        if expected
        else (f"a value with its unit, like {example}")
    )
    if isinstance(text, bool) or not isinstance(text, (str, int, float)):
        raise UnitParseError(f"expected {what}, got {type(text).__name__}")
    if isinstance(text, (int, float)):
        if expected:
            raise UnitParseError(f"expected {what}, got the bare number {text!r}")
        return check_magnitude(Q_(float(text), ""), text, what)
    if len(text) > 80 or not _SAFE.match(text):
        raise UnitParseError(f"expected {what}, got {text[:40]!r}")
    norm = _normalise(text)
    for m in _POWER.finditer(norm):
        exp = _EXPONENT.match(norm, m.end())
        if norm[: m.start()].rstrip().endswith(")") or exp is None or abs(float(exp.group(0))) > 12:
            raise UnitParseError(
                f"expected {what}, got {text!r} (a power must be a unit or number "
                "raised to a plain exponent from -12 to 12, like in^4)"
            )
    try:
        q: Any = Q_(norm)
    except Exception as exc:  # pint raises several kinds; the message is ours
        raise UnitParseError(f"expected {what}, could not read {text!r} ({type(exc).__name__})") from None
    if not isinstance(q, pint.Quantity):
        q = Q_(float(q), "")
    mag = q.magnitude
    try:
        finite = float(mag) == float(mag) and abs(float(mag)) != float("inf")
    except (TypeError, ValueError, ArithmeticError):
        finite = False
    if not finite:
        raise UnitParseError(f"expected {what}, got {text!r}")
    if expected and q.dimensionality != _dimensionality(expected):
        if q.dimensionless:
            raise UnitParseError(f"expected {what}, got {text!r} without a unit")
        raise UnitParseError(f"expected {what}, got {text!r} which is a {dimension_name(q)}")
    return check_magnitude(q, text, what)


def check_magnitude(q: Quantity, text: object, what: str) -> Quantity:
    """``q`` unchanged if its magnitude, as written and in base units, is finite and either zero or
    a normal float (not subnormal, i.e. not below 2.2e-308 in size, where floats lose digits).

    A value that cannot be held exactly as written (``"5e-324 in"``, ``"nan in"``, ``"inf psi"``,
    ``"1e308 mi"`` which overflows in metres) is refused rather than silently rounded.
    """
    import math
    import sys

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
