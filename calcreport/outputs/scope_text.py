"""Words for a member's scope: what ran, what did not (read from the result records; no computing)."""

from __future__ import annotations

from ..solve.results import MemberResult

__all__ = ["status_words", "checked_line", "not_checked_line", "not_checked_items"]


def status_words(m: MemberResult) -> str:
    """The status with its scope: "OK — connectors only", "NG", "OK"; "nothing checked" when no
    check ran at all."""
    if not m.checked:
        return f"{m.status} — nothing checked"
    return f"{m.status} — connectors only" if m.connectors_only else m.status


def checked_line(m: MemberResult) -> str:
    return "checked: " + ("; ".join(m.checked) if m.checked else "nothing")


def not_checked_items(m: MemberResult) -> list[str]:
    """One phrase per item not checked: "label (clause): reason"."""
    return [f"{u.label} ({u.clause}): {u.reason}" for u in m.not_checked]


def not_checked_line(m: MemberResult, with_reasons: bool = False, clauses: bool = True) -> str:
    """ "not checked (7): flexure (AISC 360-16 Chapter F), …" — or "not checked: none listed".

    ``clauses=False`` gives the labels only (the cover's summary; the results list the clauses)."""
    if not m.not_checked:
        return "not checked: none listed"
    if with_reasons:
        items = not_checked_items(m)
    else:
        items = [f"{u.label} ({u.clause})" if clauses else u.label for u in m.not_checked]
    return f"not checked ({len(m.not_checked)}): " + "; ".join(items)
