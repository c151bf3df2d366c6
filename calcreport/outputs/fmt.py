"""Display units and number formatting shared by every output (terminal, JSON, PDF, diff).

Outputs convert quantities to the job's unit system here, at the edge; nothing here computes
engineering values.
"""

from __future__ import annotations

import math
import string
from typing import Any

from ..steps import Step
from ..units import Q_, Quantity, dimension_name

__all__ = ["Display", "fmt_number", "json_number", "feet_inches"]

#: dimension → (pint unit, printed symbol, JSON unit text) for each unit system.
_SYSTEMS: dict[str, dict[str, tuple[str, str, str]]] = {
    "US": {
        "length": ("inch", "in", "in"),
        "area": ("inch**2", "in²", "in^2"),
        "volume": ("inch**3", "in³", "in^3"),
        "inertia": ("inch**4", "in⁴", "in^4"),
        "force": ("lbf", "lbf", "lbf"),
        "line_load": ("lbf/inch", "lbf/in", "lbf/in"),
        "stress": ("psi", "psi", "psi"),
        "moment": ("lbf*ft", "lbf·ft", "lbf*ft"),
        "weight_density": ("lbf/ft**3", "pcf", "pcf"),
        "mass_density": ("lb/ft**3", "lb/ft³", "lb/ft^3"),
    },
    "SI": {
        "length": ("mm", "mm", "mm"),
        "area": ("mm**2", "mm²", "mm^2"),
        "volume": ("mm**3", "mm³", "mm^3"),
        "inertia": ("mm**4", "mm⁴", "mm^4"),
        "force": ("kN", "kN", "kN"),
        "line_load": ("N/mm", "N/mm", "N/mm"),
        "stress": ("MPa", "MPa", "MPa"),
        "moment": ("kN*m", "kN·m", "kN*m"),
        "weight_density": ("kN/m**3", "kN/m³", "kN/m^3"),
        "mass_density": ("kg/m**3", "kg/m³", "kg/m^3"),
    },
}

#: user overrides (settings.display) by our key → dimension
_OVERRIDE_DIM = {
    "force": "force",
    "length": "length",
    "stress": "stress",
    "shear_flow": "line_load",
    "moment": "moment",
}

_PRETTY = str.maketrans({"*": "·"})


def fmt_number(x: float, sig: int = 4) -> str:
    """``x`` with ``sig`` significant figures and thousands separators; from 10⁶ up (and below
    10⁻⁴) as a mantissa × 10ⁿ with n a multiple of 3, as engineers write mm⁴ values.

    Example:
        >>> fmt_number(1234.567)
        '1,235'
        >>> fmt_number(0.0123456)
        '0.01235'
        >>> fmt_number(381156269.0)
        '381.2 × 10⁶'
    """
    if x == 0 or not math.isfinite(x):
        return "0" if x == 0 else str(x)
    mag = math.floor(math.log10(abs(x)))
    if mag >= 6 or mag < -4:
        k = 3 * math.floor(mag / 3)
        mant = fmt_number(x / 10**k, sig)
        return f"{mant} × 10{str(k).translate(_SUPER)}"
    decimals = max(0, sig - 1 - mag)
    if decimals == 0:
        x = round(x, -(mag - sig + 1))
    text = f"{x:,.{decimals}f}"
    return "−" + text[1:] if text.startswith("-") else text


_SUPER = str.maketrans("-0123456789", "⁻⁰¹²³⁴⁵⁶⁷⁸⁹")


def json_number(x: float) -> float | int | None:
    """A stable JSON number: 6 significant figures, integers stay integers; a value that is not
    finite is ``None`` (JSON null: strict JSON has no NaN or Infinity)."""
    if isinstance(x, bool):
        return x
    if isinstance(x, int):
        return x
    if x == 0 or not math.isfinite(x):
        return 0.0 if x == 0 else None
    return float(f"{x:.6g}")


def feet_inches(inches: float) -> str:
    """``134.25`` → ``11'-2 1/4"``; under a foot ``9 1/2"`` (nearest 1/16 in; common practice).

    Example:
        >>> print(feet_inches(134.25), feet_inches(9.5), feet_inches(36.0))
        11'-2 1/4" 9 1/2" 3'-0"
    """
    sign = "−" if inches < 0 else ""
    sixteenths = int(round(abs(inches) * 16))
    feet, rest = divmod(sixteenths, 12 * 16)
    whole, frac = divmod(rest, 16)
    text = str(whole)
    if frac:
        g = math.gcd(frac, 16)
        text += f" {frac // g}/{16 // g}"
    return f"{sign}{feet}'-{text}\"" if feet else f'{sign}{text}"'


class Display:
    """Unit system of one job: converts and prints quantities consistently."""

    def __init__(self, system: str = "US", overrides: dict[str, str] | None = None):
        self.system = system
        self.units = dict(_SYSTEMS[system])
        for key, unit in (overrides or {}).items():
            dim = _OVERRIDE_DIM[key]
            pretty = unit.replace("**2", "²").replace("**3", "³").replace("^2", "²").translate(_PRETTY)
            self.units[dim] = (unit, pretty, unit)

    def convert(self, q: Quantity) -> tuple[float, str, str]:
        """Magnitude in the display unit, printed symbol, JSON unit text."""
        plan = self._plan(q.units)
        if plan is not None:  # a plain scale factor to the display unit (cached per unit)
            factor, pretty, js = plan
            return float(q.magnitude) * factor, pretty, js
        dim = dimension_name(q)
        if dim in self.units:
            unit, pretty, js = self.units[dim]
            return float(q.to(unit).magnitude), pretty, js
        if dim == "number":
            return float(q.to("").magnitude), "", ""
        base = q.to_base_units() if self.system == "SI" else q
        return float(base.magnitude), f"{base.units:~P}", f"{base.units:~C}"

    def _plan(self, units) -> tuple[float, str, str] | None:
        key = str(units)
        cache = self.__dict__.setdefault("_plans", {})
        if key not in cache:
            one = Q_(1.0, units)
            dim = dimension_name(one)
            plan = None
            if dim in self.units:
                unit, pretty, js = self.units[dim]
                try:
                    factor = float(one.to(unit).magnitude)
                    if abs(float(Q_(2.0, units).to(unit).magnitude) - 2 * factor) <= 1e-12 * abs(factor):
                        plan = (factor, pretty, js)  # linear (no offset) units only
                except Exception:
                    plan = None
            cache[key] = plan
        return cache[key]

    def quantity(self, q: Quantity, sig: int = 4) -> str:
        """``"1,234 lbf"``-style text for a quantity."""
        mag, pretty, _ = self.convert(q)
        return f"{fmt_number(mag, sig)} {pretty}".rstrip()

    def position(self, q: Quantity) -> str:
        """A position or length along the member as drawings give it: feet-inches to 1/16 in
        (``11'-2 1/4"``) in US units; millimetres, or metres from 1 m, in SI."""
        if self.system == "SI":
            mm = float(q.to("mm").magnitude)
            return f"{fmt_number(mm / 1000, 4)} m" if abs(mm) >= 1000 else f"{fmt_number(mm, 3)} mm"
        return feet_inches(float(q.to("inch").magnitude))

    def value(self, v: Any, sig: int = 4) -> str:
        """Text for any step value: quantity, number, or words."""
        if isinstance(v, Quantity):
            return self.quantity(v, sig)
        if isinstance(v, bool):
            return "yes" if v else "no"
        if isinstance(v, int):
            return f"{v:,}"
        if isinstance(v, float):
            return fmt_number(v, sig)
        return str(v)

    def json_value(self, v: Any) -> Any:
        """JSON form: quantities as {"value", "unit"}; numbers stable; words as they are."""
        if isinstance(v, Quantity):
            mag, _, js = self.convert(v)
            return {"value": json_number(mag), "unit": js}
        if isinstance(v, float):
            return json_number(v)
        return v

    def _step_value(self, v: Any, is_position: bool, sig: int) -> str:
        if is_position and isinstance(v, Quantity) and dimension_name(v) == "length":
            return self.position(v)
        return self.value(v, sig)

    def substituted(self, s: Step, sig: int = 4) -> str:
        """The step's formula with numbers and units substituted into its template."""
        names = {name for _, name, _, _ in string.Formatter().parse(s.template) if name}
        return s.template.format(**{k: self._step_value(s.values[k], k in s.positions, sig) for k in names})

    def result(self, s: Step, sig: int = 4) -> str:
        """The step's result as text (a position along the member in the drawing convention)."""
        return self._step_value(s.result, "result" in s.positions, sig)
