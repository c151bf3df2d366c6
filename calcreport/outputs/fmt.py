"""Display units and number formatting shared by every output (terminal, JSON, PDF, diff).

Outputs convert quantities to the job's unit system here, at the edge; nothing here computes
engineering values.
"""

from __future__ import annotations

import math
import string
from functools import cache
from typing import Any

from ..steps import Step
from ..units import Q_, Quantity, dimension_name, ureg

__all__ = ["Display", "fmt_number", "json_number", "feet_inches", "kind_of"]

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

#: Derived kinds the solver produces beyond the job-file dimensions, by dimensionality, with their
#: trade unit per system (common practice, no source): flexural stiffness E·I in kip·in² / kN·m²,
#: warping constant in in⁶ / mm⁶, the load-slip coefficient of NDS 2018 §11.3.6 (γ = c·D^1.5)
#: in lbf/in^2.5 / N/mm^2.5.
_DERIVED: dict[str, tuple[str, dict[str, tuple[str, str, str]]]] = {
    "flexural_stiffness": (
        "[force] * [length] ** 2",
        {"US": ("kip*inch**2", "kip·in²", "kip*in^2"), "SI": ("kN*m**2", "kN·m²", "kN*m^2")},
    ),
    "warping_constant": (
        "[length] ** 6",
        {"US": ("inch**6", "in⁶", "in^6"), "SI": ("mm**6", "mm⁶", "mm^6")},
    ),
    "slip_coefficient": (
        "[force] / [length] ** 2.5",
        {"US": ("lbf/inch**2.5", "lbf/in²·⁵", "lbf/in^2.5"), "SI": ("N/mm**2.5", "N/mm²·⁵", "N/mm^2.5")},
    ),
}
for _name, (_dim, _units) in _DERIVED.items():
    for _system, _unit in _units.items():
        _SYSTEMS[_system][_name] = _unit

#: force and length units of the generic trade unit of any other force·length kind (never base SI)
_GENERIC = {"US": ("lbf", "inch", "lbf", "in"), "SI": ("N", "mm", "N", "mm")}

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
_SUPER_EXP = str.maketrans("-0123456789.", "⁻⁰¹²³⁴⁵⁶⁷⁸⁹·")


def kind_of(q: Quantity) -> str:
    """Our name for the kind of ``q``: a job-file dimension (:func:`..units.dimension_name`) or a
    derived kind of ``_DERIVED`` (``"flexural_stiffness"`` for E·I …)."""
    name = dimension_name(q)
    if name.startswith("["):
        for kind, (dim, _) in _DERIVED.items():
            if q.dimensionality == _derived_dim(dim):
                return kind
    return name


@cache
def _derived_dim(text: str):
    return ureg.get_dimensionality(text)


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
        dim = kind_of(q)
        if dim in self.units:
            unit, pretty, js = self.units[dim]
            return float(q.to(unit).magnitude), pretty, js
        if dim == "number":
            return float(q.to("").magnitude), "", ""
        generic = self._generic(q)
        if generic is not None:
            unit, pretty, js = generic
            return float(q.to(unit).magnitude), pretty, js
        base = q.to_base_units() if self.system == "SI" else q
        return float(base.magnitude), f"{base.units:~P}", f"{base.units:~C}"

    def convert_array(self, q: Quantity) -> tuple[list[float], str]:
        """An array quantity in the display unit, converted once (not element by element), and
        the printed symbol of its unit."""
        plan = self._plan(q.units)
        if plan is not None:
            factor, pretty, _ = plan
            return (q.magnitude * factor).tolist(), pretty
        _, pretty, _ = self.convert(q[0]) if len(q.magnitude) else (0.0, "", "")
        return [self.convert(v)[0] for v in q], pretty

    def _generic(self, q: Quantity) -> tuple[str, str, str] | None:
        """Force^a·length^b in the system's force and length units for a kind without its own
        trade unit (``lbf·in³`` rather than ``kg·m⁴/s²``); ``None`` when ``q`` is not made of
        force and length."""
        dims = {k: float(v) for k, v in dict(q.dimensionality).items()}  # type: ignore[arg-type]
        mass, time_, length = dims.pop("[mass]", 0.0), dims.pop("[time]", 0.0), dims.pop("[length]", 0.0)
        if dims or time_ != -2 * mass or not (mass or length):
            return None
        a, b = mass, length - mass
        f_unit, l_unit, f_txt, l_txt = _GENERIC[self.system]
        parts = [(f_unit, f_txt, a), (l_unit, l_txt, b)]
        unit = "*".join(f"{u}**{e:g}" for u, _, e in parts if e)
        pretty = "·".join(t + ("" if e == 1 else f"{e:g}".translate(_SUPER_EXP)) for _, t, e in parts if e)
        js = "*".join(t + ("" if e == 1 else f"^{e:g}") for _, t, e in parts if e)
        return unit, pretty, js

    def _plan(self, units) -> tuple[float, str, str] | None:
        key = units  # pint units hash by their container (no text formatting per value)
        cache = self.__dict__.setdefault("_plans", {})
        if key not in cache:
            one = Q_(1.0, units)
            dim = kind_of(one)
            plan = None
            target = self.units.get(dim) or (None if dim == "number" else self._generic(one))
            if target is not None:
                unit, pretty, js = target
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
