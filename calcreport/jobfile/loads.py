"""Loads along the member: span, supports, loads by case, combinations, self-weight.

Keys (all optional; see docs/loads.md)::

    [[member]]
    span = "20 ft"              # member length, x measured from the left end
    self_weight = true          # adds Σ part area × material density as dead load D

    [[member.support]]          # none given: a pin at each end (simple span)
    at = "0 ft"
    type = "pin"                # pin, roller or fixed

    [[member.load]]
    case = "D"                  # D, L, Lr, S, R, W or a case name of the job's own
    kind = "uniform"            # uniform, point or linear
    w = "250 plf"               # uniform; optional from / to for a partial load
    # point:  P = "2 kip", at = "6 ft"
    # linear: w_start = "100 plf", w_end = "300 plf", optional from / to
    # moving point load (variable cases only): moving = true, no `at`, optional
    #   between = ["0 ft", "16 ft"]; loads with the same group = "cart" move together at their
    #   offset = "3 ft" from each other
    # variable = true on a case of the job's own: placed for its worst effect like L

    [[member.combination]]      # none given: basic combinations of settings.load_standard and .method
    name = "D + L"
    factors = { D = 1.0, L = 1.0 }
"""

from __future__ import annotations

from dataclasses import replace

from ..errors import excerpt
from ..keys import job as decl
from ..keys.loads import LIVE_TYPE, STANDARD_CASES
from ..model import Combination, Load, Member, Settings, Support
from ..units import Q_
from .reader import Table

__all__ = ["read_loads", "MAX_LOADS", "MAX_SUPPORTS", "MAX_COMBINATIONS", "MAX_SPAN_FT", "MIN_SPAN_IN"]

MAX_LOADS = 200
MAX_SUPPORTS = 20
MAX_COMBINATIONS = 100
#: Longest member the tool accepts (2,000 ft ≈ 610 m, far beyond any built-up member; a longer
#: span is a typing slip) and the shortest (1 in). Common practice, no source.
MAX_SPAN_FT = 2000
MIN_SPAN_IN = 1.0
SUPPORT_TYPES = decl.SUPPORT_TYPES
LOAD_KINDS = decl.LOAD_KINDS


def read_loads(t: Table, member: Member, settings: Settings) -> Member:
    """Read span, supports, loads, combinations and self-weight of one member table."""
    load_tables = t.tables("load")
    support_tables = t.tables("support")
    combo_tables = t.tables("combination")
    self_weight = t.boolean("self_weight", False)
    span = t.quantity("span", "length")
    if span is None:
        for name, items in (
            ("load", load_tables),
            ("support", support_tables),
            ("combination", combo_tables),
        ):
            if items:
                raise t.error(
                    None,
                    f"missing required key 'span' (the member length, needed by "
                    f'[[{t.key(name)}]]), like span = "20 ft"',
                )
        if self_weight:
            raise t.error("self_weight", 'self_weight needs the member length: add span = "20 ft"')
        return member
    if not MIN_SPAN_IN <= float(span.to("inch").magnitude) <= MAX_SPAN_FT * 12:
        raise t.error(
            "span",
            f"expected a span from {MIN_SPAN_IN:g} in to {MAX_SPAN_FT:,} ft (610 m), got {t.data['span']!r}",
        )
    for name, items, cap in (
        ("load", load_tables, MAX_LOADS),
        ("support", support_tables, MAX_SUPPORTS),
        ("combination", combo_tables, MAX_COMBINATIONS),
    ):
        if len(items) > cap:
            raise t.error(name, f"expected at most {cap} entries, got {len(items)}")
    if not load_tables and not self_weight:
        raise t.error("span", "a span needs loads: add [[member.load]] tables or self_weight = true")
    supports = tuple(_support(st, span) for st in support_tables) or (
        Support(Q_(0.0, "inch")),
        Support(span.to("inch")),
    )
    if (
        not any(s.kind == "fixed" for s in supports)
        and len({round(float(s.x.to("inch").magnitude), 9) for s in supports}) < 2
    ):
        target = support_tables[-1] if support_tables else t
        raise target.error(None, "the member needs one fixed support or supports at two different places")
    _check_support_gaps(support_tables, supports, span)
    loads = tuple(_load(lt, span) for lt in load_tables)
    loads = _check_variable(load_tables, loads)
    if self_weight:
        for p in member.parts:
            if p.material.density is None:
                raise t.error(
                    "self_weight",
                    f"self_weight needs a density for material "
                    f'{p.material.id!r} (part {p.id!r}), like density = "35 pcf"',
                )
    cases = {ld.case for ld in loads} | ({"D"} if self_weight else set())
    combos = tuple(_combination(ct, cases) for ct in combo_tables)
    names = [c.name for c in combos]
    for ct, c in zip(combo_tables, combos):
        if names.count(c.name) > 1:
            raise ct.error("name", f"duplicate combination name {c.name!r}")
    if not combos and settings.method == "EC5":  # EN 1990 combinations need each case described
        bare = sorted(c for c in cases if c not in settings.load_cases and c != "D")
        if bare:
            lt = next(lt for lt, ld in zip(load_tables, loads) if ld.case == bare[0])
            raise lt.error(
                "case",
                f"case {bare[0]!r} has no [[settings.load_case]] (duration and psi0) for the EN 1990 "
                'combinations of method = "EC5"',
            )
    elif not combos:
        own = sorted(cases - set(STANDARD_CASES))
        if own:
            lt = next(lt for lt, ld in zip(load_tables, loads) if ld.case in own)
            raise lt.error(
                "case",
                f"case {own[0]!r} is in no standard combination; list the "
                f"combinations with [[{t.key('combination')}]] tables",
            )
    return replace(
        member, span=span, supports=supports, loads=loads, combinations=combos, self_weight=self_weight
    )


def _position(t: Table, name: str, span, required: bool = False):
    q = t.quantity(name, "length", required=required, allow_zero=True)
    if q is not None and q > span * (1 + 1e-12):
        raise t.error(name, f"expected a position within the span (0 to {span:~P}), got {t.data[name]!r}")
    return q


#: Distinct supports closer than this (or than the span / 10,000) are refused: the element between
#: them is so short that the stiffness model of the beam becomes singular to rounding. No bearing
#: pair is built this close; one support stands for both.
SUPPORT_GAP_MIN_IN = 1.0 / 16.0


def _check_support_gaps(tables: list[Table], supports: tuple[Support, ...], span) -> None:
    """Refuse two supports at different places closer than the smallest gap the beam model solves."""
    if len(tables) < 2:
        return
    L = float(span.to("inch").magnitude)
    gap_min = max(SUPPORT_GAP_MIN_IN, L / 10_000.0)
    xs = [float(s.x.to("inch").magnitude) for s in supports]
    order = sorted(range(len(xs)), key=lambda i: xs[i])
    for a, b in zip(order, order[1:]):
        gap = xs[b] - xs[a]
        if 0.0 < gap < gap_min:
            raise tables[b].error(
                "at",
                f"this support is {gap:.4g} in ({gap * 25.4:.4g} mm) from another one: give one "
                f"support there, or place them at least {gap_min:.4g} in apart",
            )


def _support(t: Table, span) -> Support:
    t.expect(decl.names(decl.SUPPORT))
    s = Support(_position(t, "at", span, required=True), t.choice("type", SUPPORT_TYPES, "pin"))
    t.done()
    return s


def _case(t: Table) -> str:
    case = t.text("case", required=True).strip()
    if not case or len(case) > 24 or not all(ch.isalnum() or ch in "_-" for ch in case):
        raise t.error(
            "case",
            f"expected a load case name (D, L, Lr, S, R, W or a short name of "
            f"letters and digits), got {excerpt(t.data['case'])}",
        )
    for std in STANDARD_CASES:
        if case.lower() == std.lower():
            return std
    return case


def _load(t: Table, span) -> Load:
    t.expect(decl.names(decl.LOAD))
    t.ident(
        "id", required=False
    )  # optional short id: lets a revision diff follow a load that moved in the list
    case = _case(t)
    kind = t.choice("kind", LOAD_KINDS, required=True)
    label = t.text("label")
    variable = t.boolean("variable", False)
    if variable and case in STANDARD_CASES:
        raise t.error(
            "variable",
            f"case {case!r} is a standard case: L, Lr, S and R are always placed for their worst "
            "effect, D and W never; 'variable' is only for a case of the job's own",
        )
    moving = t.boolean("moving", False)
    if kind != "point":
        for name in ("moving", "group", "offset", "between"):
            if t.has(name):
                raise t.error(
                    name,
                    f"'{name}' is for point loads (kind = \"point\"); a variable uniform or linear "
                    "load is already placed only where it is worst",
                )
    if kind == "point" and (moving or t.has("group")):
        if t.has("at"):
            raise t.error(
                "at",
                "a moving load has no fixed position: drop 'at' (limit its travel with between = [from, to])",
            )
        group = t.ident("group", required=False)
        offset = t.quantity("offset", "length", allow_zero=True)
        if offset is not None and not group:
            raise t.error("offset", 'offset is a position within a group: add group = "cart"')
        if offset is not None and offset > span * (1 + 1e-12):
            raise t.error("offset", f"expected an offset within the span (0 to {span:~P})")
        ld = Load(
            case,
            kind,
            t.quantity("P", "force", required=True, positive=False),
            label=label,
            key=t.label,
            moving=True,
            group=group,
            offset=offset,
            between=_between(t, span),
            variable=variable,
        )
    elif kind == "point":
        for name in ("offset", "between"):
            if t.has(name):
                raise t.error(name, f"'{name}' is for moving loads: add moving = true (and drop 'at')")
        ld = Load(
            case,
            kind,
            t.quantity("P", "force", required=True, positive=False),
            at=_position(t, "at", span, required=True),
            label=label,
            key=t.label,
            variable=variable,
        )
    else:
        start = _position(t, "from", span)
        end = _position(t, "to", span)
        if start is not None and end is not None and not start < end:
            raise t.error("to", "expected 'to' beyond 'from'")
        if kind == "uniform":
            w1 = t.quantity("w", "line_load", required=True, positive=False)
            w2 = None
        else:
            w1 = t.quantity("w_start", "line_load", required=True, positive=False)
            w2 = t.quantity("w_end", "line_load", required=True, positive=False)
        ld = Load(
            case,
            kind,
            w1,
            start=start,
            end=end,
            magnitude_end=w2,
            label=label,
            key=t.label,
            variable=variable,
        )
        if (end is not None and end.to("inch").magnitude <= 0) or (
            start is not None and start >= span * (1 - 1e-12)
        ):
            raise t.error("from" if start is not None else "to", "the load has no length on the member")
    ld = _entry(t, ld)
    t.done()
    return ld


def _entry(t: Table, ld: Load) -> Load:
    """Where a load enters a member of plies (checked against the plies in jobfile/plies.py)."""
    enters = t.choice("enters", decl.LOAD_ENTRIES)
    if enters is None and not t.has("ply") and not t.has("transfer_length"):
        return ld
    return replace(
        ld,
        enters=enters or "",
        ply=t.text("ply"),
        transfer_length=t.quantity("transfer_length", "length"),
    )


def _between(t: Table, span):
    """``between = [from, to]``: the travel range of a moving load or group, within the span."""
    raw = t.raw("between")
    if raw is None:
        return None
    if not isinstance(raw, list) or len(raw) != 2:
        raise t.error("between", 'expected two positions, like between = ["0 ft", "16 ft"]')
    a, b = (t.parse_quantity(("between", i), v, "length", allow_zero=True) for i, v in enumerate(raw))
    if not a < b or b > span * (1 + 1e-12):
        raise t.error("between", f"expected from < to, both within the span (0 to {span:~P})")
    return (a, b)


def _check_variable(tables: list[Table], loads: tuple[Load, ...]) -> tuple[Load, ...]:
    """Cross-load rules: a case of the job's own is variable on all its loads or none; moving
    loads belong to variable cases; a group is one case, with one travel range that holds it."""
    own_var = {ld.case for ld in loads if ld.variable}
    variable = set(LIVE_TYPE) | own_var
    for t, ld in zip(tables, loads):
        if ld.case in own_var and not ld.variable:
            raise t.error(
                "case",
                f"other loads of case {ld.case!r} say variable = true: say it on every load of the case",
            )
        if ld.moving and ld.case not in variable:
            raise t.error(
                "moving",
                f"a moving load must be of a variable case (L, Lr, S, R or a case of the job's own "
                f"with variable = true), got case {ld.case!r}",
            )
    groups: dict[str, list[tuple[Table, Load]]] = {}
    where: dict[int, int] = {}
    for i, (t, ld) in enumerate(zip(tables, loads)):
        if ld.group:
            groups.setdefault(ld.group, []).append((t, ld))
            where[id(ld)] = i
    out = list(loads)
    for name, items in groups.items():
        t0, ld0 = items[0]
        ranges = {tuple(float(q.to("inch").magnitude) for q in ld.between) for _, ld in items if ld.between}
        for t, ld in items:
            if ld.case != ld0.case:
                raise t.error("case", f"the loads of group {name!r} must be of one case ({ld0.case!r})")
        if len(ranges) > 1:
            t = next(t for t, ld in items if ld.between)
            raise t.error(
                "between", f"the loads of group {name!r} give different travel ranges: give it once"
            )
        between = next((ld.between for _, ld in items if ld.between), None)
        offs = [float((ld.offset.to("inch").magnitude) if ld.offset is not None else 0.0) for _, ld in items]
        if between is not None:
            room = float((between[1] - between[0]).to("inch").magnitude)
            if max(offs) - min(offs) > room * (1 + 1e-12):
                tb = next(t for t, ld in items if ld.between)
                raise tb.error("between", f"group {name!r} is longer than its travel range")
        for _t, ld in items:
            out[where[id(ld)]] = replace(ld, between=between)
    return tuple(out)


def _combination(t: Table, cases: set[str]) -> Combination:
    t.expect(decl.names(decl.COMBINATION))
    name = t.text("name", required=True)
    ft = t.table("factors", required=True)
    factors: dict[str, float] = {}
    for raw in list(ft.data):
        case = next((s for s in STANDARD_CASES if s.lower() == str(raw).lower()), str(raw))
        f = ft.number(raw, required=True, minimum=-10.0, maximum=10.0)
        if case not in cases:
            raise ft.error(
                raw,
                f"no loads of case {excerpt(case)} on this member (cases: {', '.join(sorted(cases)) or 'none'})",
            )
        factors[case] = f
    ft.done()
    if not factors:
        raise t.error("factors", "expected at least one case factor, like factors = { D = 1.2, L = 1.6 }")
    source = t.text("source", default="stated in the job file")
    t.done()
    return Combination(name, factors, source)
