"""Unbraced length of a compression flange, from ``[member.design]``: the top flange's
``unbraced_length`` / ``continuous_bracing``, the bottom flange's ``bottom_unbraced_length`` /
``bottom_continuous_bracing``. Without them the whole span is taken as unbraced (conservative,
stated in the step)."""

from __future__ import annotations

from ..model import Member
from ..steps import StepLog
from ..units import Q_

__all__ = ["unbraced_length"]


def unbraced_length(
    member: Member, flange: str, log: StepLog, symbol: str = "Lb", source: str = ""
) -> float | None:
    """Unbraced length (in) of the ``flange`` ("top" or "bottom") in compression, as a step; None
    when neither the job nor a span gives one."""
    d = member.design
    pre = "" if flange == "top" else "bottom_"
    if d.get(f"{pre}continuous_bracing"):
        val, note, src = (
            0.0,
            f"{flange} flange braced continuously (stated in the job)",
            "stated in the job file",
        )
    elif f"{pre}unbraced_length" in d:
        val, note, src = float(d[f"{pre}unbraced_length"].to("in").magnitude), "", "stated in the job file"
    elif member.span is not None:
        val = float(member.span.to("in").magnitude)
        note = (
            f"assumed: no {pre}unbraced_length or {pre}continuous_bracing in [member.design]; "
            "the whole member length taken as unbraced (conservative)"
        )
        src = "assumed by the tool (conservative)" + (f"; {source}" if source else "")
    else:
        return None
    log.add(
        f"{symbol}_{flange}",
        f"Unbraced length of the {flange} flange in compression",
        symbol,
        "{L}",
        {"L": Q_(val, "in")},
        Q_(val, "in"),
        source=src,
        note=note,
        positions=("L", "result"),
    )
    return val
