"""The validated model: plain dataclasses holding pint quantities, ids resolved, positions known.

The job-file reader (:mod:`calcreport.jobfile`) builds these; the solver reads them. Nothing here
parses text or formats output.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

from .units import Quantity

__all__ = [
    "Header",
    "RevisionEntry",
    "Settings",
    "Material",
    "Shape",
    "Part",
    "ConnectorSpec",
    "Joint",
    "Member",
    "Ply",
    "PlyFastening",
    "Job",
    "Load",
    "Support",
    "Combination",
    "WrittenValue",
    "JobWarning",
]


@dataclass(frozen=True)
class RevisionEntry:
    """One row of the revision history kept in the job file."""

    mark: str
    date: str
    by: str
    description: str


@dataclass(frozen=True)
class Header:
    """Who and what the calculation is for; shown in every title block."""

    project: str
    number: str
    client: str
    subject: str
    prepared_by: str
    checked_by: str
    revision: str
    date: str
    prepared_date: str = ""
    checked_date: str = ""
    approved_by: str = ""
    engineer: str = ""  # engineer of record (the seal's stamp); licence number and its jurisdiction
    licence: str = ""
    jurisdiction: str = ""
    history: tuple[RevisionEntry, ...] = ()
    notes: tuple[str, ...] = ()


@dataclass(frozen=True)
class LoadCaseFactors:
    """EC5: a load case's duration class (EN 1995-1-1 Table 2.1) and ψ factors (EN 1990 A1)."""

    case: str
    duration: str
    psi0: float | None = None
    psi2: float | None = None


@dataclass(frozen=True)
class Settings:
    """Job-wide choices. Defaults are stated in the report so nothing is silent."""

    units: str  # "US" or "SI"
    method: str  # "ASD" or "LRFD"
    spacing_step: Quantity
    spacing_max: Quantity | None
    spacing_min: Quantity | None
    zones_per_half: int = 3
    zone_module: Quantity | None = None
    deflection_limits: dict[str, float] = field(default_factory=dict)
    template: str = ""
    display: dict[str, str] = field(default_factory=dict)
    load_duration: float | None = None
    load_standard: str = "ASCE 7-22"  # edition of the load standard for combinations and clauses
    zones_per_span: int | None = None  # Z per half of each span/overhang (None: zones_per_half)
    given: tuple[str, ...] = ()  # keys the job's [settings] table states (the rest are defaults)
    # --- EC5 (EN 1995-1-1 with EN 1990); owner: ec5 ---
    service_class: int | None = None  # EN 1995-1-1 §2.3.1.3
    gamma_M_connections: float | None = None  # national value of γ_M for connections (Table 2.3: 1.3)
    duration: str = ""  # load-duration class of a design shear given without loads (for k_mod)
    load_cases: dict[str, LoadCaseFactors] = field(default_factory=dict)  # [[settings.load_case]]


@dataclass(frozen=True)
class Material:
    """A material: modulus, optional design stresses and density, optional grade data."""

    id: str
    name: str
    E: Quantity
    family: str = "other"  # "wood", "steel", "concrete", "plywood", "other"
    Fb: Quantity | None = None
    Fv: Quantity | None = None
    Fy: Quantity | None = None
    Fu: Quantity | None = None
    fc: Quantity | None = None  # concrete specified compressive strength f'c
    G: float | None = None  # specific gravity (wood)
    density: Quantity | None = None  # weight density (force / volume)
    extra: dict[str, Any] = field(default_factory=dict)


@dataclass(frozen=True)
class Shape:
    """Geometry of one part, already placed in section coordinates (inches internally).

    ``kind`` is ``polygon`` (``vertices`` counter-clockwise, absolute), ``circle``
    (``centre`` and ``radius``) or ``properties`` (``area``, ``inertia`` about its own centroid,
    ``centroid`` and the bounding box ``bbox`` used for placement and contact).
    All lengths are plain floats in inches so that geometry code stays fast and simple;
    :mod:`calcreport.solve.section` turns results back into quantities.
    """

    kind: str
    bbox: tuple[float, float, float, float]  # xmin, ymin, xmax, ymax
    vertices: tuple[tuple[float, float], ...] = ()
    centre: tuple[float, float] = (0.0, 0.0)
    radius: float = 0.0
    area: float = 0.0
    inertia: float = 0.0
    centroid: tuple[float, float] = (0.0, 0.0)
    description: str = ""
    nominal: str = ""  # e.g. "2x10" for dressed lumber, "W16x31" for a named rolled shape
    flange_thickness: float = 0.0  # rolled shapes: the plates a bolt or weld bears on (0 = not given)
    web_thickness: float = 0.0
    source: str = ""  # where a rolled shape's properties come from (database and edition)


@dataclass(frozen=True)
class Part:
    """A piece of the built-up section."""

    id: str
    shape: Shape
    material: Material
    label: str = ""


@dataclass(frozen=True)
class ConnectorSpec:
    """A connector as the job file gives it; ``kind`` selects the model in ``solve.connectors``."""

    kind: str
    params: dict[str, Any]
    key: str  # key path in the job file, for messages
    given: tuple[str, ...] = ()  # keys the job file states (the rest are defaults)


@dataclass(frozen=True)
class Joint:
    """A fastened interface: the parts held on one side of the shear plane and their connector."""

    id: str
    holds: tuple[str, ...]
    connector: ConnectorSpec
    per_row: int = 1
    label: str = ""
    width: Quantity | None = None  # shear-plane width b override (glue lines)
    spacing_max: Quantity | None = None
    spacing_min: Quantity | None = None


@dataclass(frozen=True)
class Support:
    """A support along the member (issue: loads along the member)."""

    x: Quantity
    kind: str = "pin"  # "pin", "roller", "fixed"


@dataclass(frozen=True)
class Load:
    """A load along the member for one load case."""

    case: str  # "D", "L", "Lr", "S", "R", "W" or a name of the job's own
    kind: str  # "uniform", "point", "linear"
    magnitude: Quantity
    start: Quantity | None = None
    end: Quantity | None = None
    magnitude_end: Quantity | None = None
    at: Quantity | None = None
    label: str = ""
    key: str = ""  # job-file key path, for messages
    moving: bool = False  # point load placed where it is worst (ASCE 7 §4.4)
    group: str = ""  # moving loads with the same group move together at fixed offsets
    offset: Quantity | None = None  # position within its group
    between: tuple[Quantity, Quantity] | None = None  # travel range of a moving load or group
    variable: bool = False  # a case of the job's own marked as variable (placed for worst effect)
    # members of plies side by side (issue 14): where the load enters the plies
    enters: str = ""  # "top" (bears on the plies' tops), "left_face", "right_face", "ply"; "" elsewhere
    ply: str = ""  # id of the ply a load enters (enters = "ply")
    transfer_length: Quantity | None = None  # point loads: length over which a ply passes it on


@dataclass(frozen=True)
class Combination:
    """A load combination: factors by case name."""

    name: str
    factors: dict[str, float]
    source: str = ""


@dataclass(frozen=True)
class Ply:
    """One ply of a member built of plies side by side (``[[member.ply]]``), in order across the
    width; its ``part`` is the placed piece of the section (also in ``Member.parts``)."""

    id: str
    part: Part
    key: str = ""  # job-file key path, for messages


@dataclass(frozen=True)
class PlyFastening:
    """The fasteners joining the plies (``[member.ply_fastening]``)."""

    connector: ConnectorSpec
    rows: int  # rows of fasteners across the depth (connectors side by side in one row)
    through: bool = False  # each fastener passes through every ply (through-bolts)
    face: str = "left"  # two plies driven from one face: the face the heads are on
    staggered: bool = False  # rows from opposite faces (or across the depth) offset along the member
    spacing_max: Quantity | None = None
    spacing_min: Quantity | None = None
    key: str = ""


@dataclass(frozen=True)
class Member:
    """One built-up member: its parts, joints and the shear it carries."""

    id: str
    title: str
    description: str
    parts: tuple[Part, ...]
    joints: tuple[Joint, ...]
    reference_material: Material
    shear: Quantity | None = None  # design shear V (shortcut when no loads are given)
    span: Quantity | None = None
    supports: tuple[Support, ...] = ()
    loads: tuple[Load, ...] = ()
    combinations: tuple[Combination, ...] = ()
    self_weight: bool = False
    assumptions: tuple[str, ...] = ()
    notes: tuple[str, ...] = ()
    design: dict[str, Any] = field(default_factory=dict)  # [member.design]: member-check inputs
    plies: tuple[Ply, ...] = ()  # [[member.ply]]: plies side by side (parts are their pieces)
    ply_fastening: PlyFastening | None = None


@dataclass(frozen=True)
class WrittenValue:
    """A value the job file gives as a product or quotient (``w = "15 psf * 14 ft"``): the
    report lists it as written beside what it was read as."""

    key: str
    line: int | None
    text: str
    value: Quantity


@dataclass(frozen=True)
class JobWarning:
    """A key that has no effect where it is written (docs/job-format.md lists which keys warn and
    which are errors). Printed by check/build on stderr and listed on the report's cover."""

    key: str
    line: int | None
    message: str

    def line_text(self, path: str) -> str:
        """``file:line: key: warning: message`` — the one line printed on stderr."""
        where = f"{path}:{self.line}" if self.line else path
        return f"{where}: {self.key}: warning: {self.message}"


@dataclass(frozen=True)
class Job:
    """A whole job file, validated."""

    path: str
    sha256: str
    header: Header
    settings: Settings
    materials: tuple[Material, ...]
    members: tuple[Member, ...]
    written: tuple[WrittenValue, ...] = ()
    warnings: tuple[JobWarning, ...] = ()
