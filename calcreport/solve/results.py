"""Result records returned by the solver. Plain data: every output reads these and the steps."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from ..model import Job, Member
from ..steps import Phrase, Step
from ..units import Quantity

__all__ = [
    "SolveError",
    "Check",
    "Unchecked",
    "Assumed",
    "PartProps",
    "SectionResult",
    "Capacity",
    "JointResult",
    "MemberResult",
    "JobResult",
    "worst",
]


class SolveError(ValueError):
    """The model is valid but cannot be solved as given (names the job key)."""

    def __init__(self, key: str, message: str):
        super().__init__(message)
        self.key = key


def worst(statuses) -> str:
    """ "NG" if any status is NG, else "OK"."""
    return "NG" if any(s == "NG" for s in statuses) else "OK"


@dataclass(frozen=True)
class Check:
    """A demand/capacity comparison or a detailing rule, with its utilisation and status."""

    key: str
    label: str
    demand: Quantity | float | None
    capacity: Quantity | float | None
    ratio: float | None
    status: str  # "OK", "NG" or "INFO"
    source: str = ""
    note: str = ""
    scope: str = ""  # space-separated scope tags this check covers (see solve/scope.py); optional
    #: key of the step that states the check's limit or working (``member.H1.joint.top.connector.
    #: detail.W_across``), when there is one; outputs refer to it instead of repeating its numbers
    step: str = ""
    #: data the outputs word into the label and note in the job's units (``outputs/phrases.py``),
    #: where the wording needs a number; ``label`` and ``note`` then hold words only
    phrase: Phrase | None = None


@dataclass(frozen=True)
class Unchecked:
    """A check a practising engineer would expect for this member that did not run, and why.

    ``key`` names the member (``member[H1].flexure``); ``label`` says what was not checked in words
    ("flexure of the steel girder"); ``clause`` is the standard's clause that would govern it
    ("AISC 360-16 Chapter F"); ``reason`` says why it did not run ("no Fy given for part web",
    "not implemented"). Outputs list these beside the status; a status never rests on them.
    """

    key: str
    label: str
    clause: str
    reason: str


@dataclass(frozen=True)
class Assumed:
    """A value the tool chose because the job did not state it.

    ``key`` is the job-file key the value stands for (``member[H1].joint[top].connector.CD``);
    ``label`` says what it is in words; ``value`` is the value used (a quantity, number, text or
    flag — outputs format it); ``where`` says how to state it instead (the key to write, and in
    which table); ``source`` names the rule or standard behind the default, if any.
    """

    key: str
    label: str
    value: Any
    where: str
    source: str = ""


@dataclass(frozen=True)
class PartProps:
    """One part's contribution to the section (transformed by modular ratio n = E / E_ref)."""

    id: str
    area: Quantity
    n: float
    area_transformed: Quantity
    centroid_y: Quantity
    inertia_own: Quantity  # about its own horizontal centroidal axis, untransformed
    depth: Quantity
    width: Quantity
    area_gross: Quantity | None = None  # layered panels: gross area (``area`` is the effective one)


@dataclass(frozen=True)
class SectionResult:
    """Transformed-section properties about the horizontal centroidal axis."""

    E_ref: Quantity
    reference_material: str
    area: Quantity  # transformed area
    centroid: Quantity  # neutral axis height above the section's lowest point
    inertia: Quantity  # transformed I about the neutral axis
    depth: Quantity
    bottom: Quantity  # lowest y of the section (y coordinates are as placed)
    parts: tuple[PartProps, ...]
    steps: tuple[Step, ...]


@dataclass(frozen=True)
class Capacity:
    """A connector model's answer: design value per connector (or per length if continuous)."""

    value: Quantity
    continuous: bool
    description: str
    source: str
    checks: tuple[Check, ...] = ()
    spacing_min: Quantity | None = None  # detailing limits from the connector's standard
    spacing_max: Quantity | None = None
    limits_source: str = ""
    duration_factor: float | None = None  # wood: C_D (ASD) or time effect λ (LRFD) in the value


@dataclass(frozen=True)
class JointResult:
    """Shear flow, connector capacity and spacing at one fastened interface."""

    id: str
    label: str
    holds: tuple[str, ...]
    Q: Quantity | None  # None on fastener lines between plies (they carry no shear flow V·Q/I)
    shear: Quantity  # design shear V used for the single spacing
    shear_flow: Quantity  # q = V·Q/I
    connector: str  # description of the connector
    connector_source: str  # standard/clause or stated source of its design value
    per_row: int
    capacity: Quantity  # per connector, or per length for a continuous connector
    capacity_row: Quantity  # n·F (or the continuous capacity)
    continuous: bool
    spacing_required: Quantity | None
    spacing_provided: Quantity | None
    spacing_min: Quantity | None
    spacing_max: Quantity | None
    utilisation: float
    status: str
    reasons: tuple[str, ...]
    checks: tuple[Check, ...]
    plane: tuple[tuple[tuple[float, float], tuple[float, float]], ...]  # shear-plane segments, in
    plane_width: Quantity
    steps: tuple[Step, ...]
    schedule: Any = None  # zoned schedule (loads along the member)
    callout: Any = None  # what a detail calls out (solve/callout.py Callout)


@dataclass(frozen=True)
class MemberResult:
    id: str
    member: Member
    section: SectionResult
    shear: Quantity
    joints: tuple[JointResult, ...]
    checks: tuple[Check, ...]
    steps: tuple[Step, ...]
    status: str
    beam: Any = None  # analysis along the member, when loads are given
    not_checked: tuple[Unchecked, ...] = ()  # what a checker would expect that did not run
    checked: tuple[str, ...] = ()  # what did run, in words ("connectors (2 joints)", "deflection")
    connectors_only: bool = False  # the only checks that ran are the joints' connectors
    assumed: tuple[Assumed, ...] = ()  # values the tool chose for this member (see Assumed)
    slip: Any = None  # γ-method beside the rigid results (solve/slip.py SlipResult), when asked for


@dataclass(frozen=True)
class JobResult:
    job: Job
    members: tuple[MemberResult, ...]
    status: str
    assumed: tuple[Assumed, ...] = ()  # job-wide values the tool chose (settings)
