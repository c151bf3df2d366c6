"""Connector models: each turns a connector spec into a design value plus derivation steps.

A model is a module (or object) with

* ``KIND`` — the ``type`` name used in the job file;
* ``FIELDS`` — a tuple of :class:`calcreport.fields.Field` describing its keys (the reader
  validates the job file against them, so ``design`` receives typed values);
* ``design(spec, ctx, log) -> Capacity`` — the design value per connector (or per unit length
  for a continuous connector such as a glue line), appending its steps to ``log``.

Register a new model by adding its module to :data:`_MODULES` below.
"""

from __future__ import annotations

import importlib
from dataclasses import dataclass
from types import ModuleType

from ...model import ConnectorSpec, Part, Settings
from ...steps import StepLog
from ...units import Quantity
from ..results import Capacity

__all__ = ["JointContext", "ConnectorError", "model_for", "kinds", "design"]

#: type name in the job file → module implementing it (imported on first use).
_MODULES: dict[str, str] = {
    "given": "calcreport.solve.connectors.given",
    "given_line": "calcreport.solve.connectors.given_line",
    "shank": "calcreport.solve.connectors.shank",
    "glue": "calcreport.solve.connectors.glue",
    "nail": "calcreport.solve.connectors.nail",
    "wood_screw": "calcreport.solve.connectors.wood_screw",
    "lag_screw": "calcreport.solve.connectors.lag_screw",
    "wood_bolt": "calcreport.solve.connectors.wood_bolt",
    "steel_bolt": "calcreport.solve.connectors.aisc_bolt",
    "fillet_weld": "calcreport.solve.connectors.fillet_weld",
    "stud": "calcreport.solve.connectors.stud",
}


class ConnectorError(ValueError):
    """A connector cannot be designed as specified (message names what is wrong)."""

    def __init__(self, key: str, message: str):
        super().__init__(message)
        self.key = key


@dataclass(frozen=True)
class JointContext:
    """What a connector model may know about the joint it serves."""

    method: str  # "ASD" or "LRFD"
    held: tuple[Part, ...]  # parts on the held side of the shear plane
    other: tuple[Part, ...]  # parts across the plane that the held side touches
    plane_width: Quantity  # total contact width b of the shear plane
    settings: Settings
    key: str  # job-file key path of the joint, for messages
    parts: tuple[Part, ...] = ()  # every part of the member (what a fastener may pass beyond)
    per_row: int = 1  # connectors side by side in one row across the plane
    load_angle: float = 0.0  # degrees between the fastener's load and the grain (90: plies)


def kinds() -> list[str]:
    """All connector type names, in registration order."""
    return list(_MODULES)


def model_for(kind: str) -> ModuleType:
    """The module implementing connector type ``kind`` (KeyError if unknown)."""
    return importlib.import_module(_MODULES[kind])


def design(spec: ConnectorSpec, ctx: JointContext, log: StepLog) -> Capacity:
    """Design value of the connector ``spec`` in the joint described by ``ctx``."""
    return model_for(spec.kind).design(spec, ctx, log)
