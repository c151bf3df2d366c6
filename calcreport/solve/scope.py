"""What a plan checker expects of a member, what ran, and what did not (with clause and reason).

:func:`expectations` lists, from the member alone (its parts' material families, its loads and its
joints), the checks a practising engineer would expect to see in the calculation: bending of wood
parts, horizontal shear, deflection, bearing at supports, flexure and web shear of steel, panel
shear of plywood webs, composite action where concrete is present, and so on. Each expectation
carries **scope tags**; :func:`not_checked` removes every expectation that a check which *ran*
(status OK or NG with a ratio) covers, and returns the rest as
:class:`calcreport.solve.results.Unchecked` records.

Scope-tag contract (for new member checks)
------------------------------------------
A :class:`Check` covers the tags

* of its key after the member prefix: ``member[G2].flexure.F2`` gives ``flexure`` and ``F2``, and
  the pair ``flexure:F2`` (each dotted segment, and each two neighbouring segments joined by ``:``);
* and of its ``scope`` field (space-separated), e.g. ``scope = "flexure local_buckling"``.

An expectation is met when any of its tags is covered by a check that ran. Joint checks
(``member[X].joint[J]...``) count as connectors only; they never meet a member expectation.
An INFO row (no ratio) never meets an expectation: it explains why the check did not run.

The tags in use are listed in :data:`TAGS` (and in DEVELOPERS.md, "How to add a member check").
Source of the list of expectations: common practice of plan review, no source; each clause names
the standard that would govern the check.
"""

from __future__ import annotations

from ..model import Member
from .results import Check, JointResult, Unchecked
from .scope_expect import AISC, NDS, Expectation, expectations, families, materials

__all__ = [
    "Expectation",
    "TAGS",
    "check_tags",
    "ran",
    "expectations",
    "not_checked",
    "checked_words",
    "missing_stress_rows",
]

#: Scope tags and what a check carrying them covers.
TAGS = {
    "bending:<material>": "bending stress of the wood parts of that material (NDS 2018 §3.3)",
    "shear:neutral_axis": "horizontal shear stress at the neutral axis (NDS 2018 §3.4)",
    "deflection": "deflection against the job's limits",
    "bearing": "bearing of wood on its supports, Fc⊥ (NDS 2018 §3.10)",
    "stability": "beam stability factor CL of wood bending (NDS 2018 §3.3.3)",
    "flange_axial": "axial stress of box- or I-beam wood flanges against Ft and Fc (NDS 2018 §3.8, §3.6)",
    "panel_shear": "shear through the thickness of plywood webs (APA Panel Design Specification)",
    "panel_stress": "axial/bending stress in the plywood webs (APA Panel Design Specification)",
    "shear_deformation": "shear deformation of the webs added to the deflection",
    "splices": "flange and web splices",
    "flexure": "flexure of the steel section, F2-F5 with lateral-torsional buckling (AISC 360-16 Ch. F)",
    "local_buckling": "flange and web slenderness classification (AISC 360-16 Table B4.1b)",
    "web_shear": "web shear and shear buckling (AISC 360-16 Chapter G)",
    "stiffeners": "transverse and bearing stiffeners (AISC 360-16 G2.3, J10.8)",
    "web_local_yielding": "web local yielding at bearings (AISC 360-16 J10.2)",
    "web_crippling": "web crippling at bearings (AISC 360-16 J10.3)",
    "cover_plate": "cover-plate termination (AISC 360-16 F13.3)",
    "composite": "composite steel-concrete flexure, cracked slab, construction stage (AISC 360-16 Ch. I)",
    "bending:<ply>": "members of plies: bending of that ply under its share (NDS 2018 §3.3)",
    "shear:<ply>": "members of plies: shear of that ply under its share (NDS 2018 §3.4.2; AISC 360-16 G2.1)",
    "plate_flexure:<ply>": "flitch plate: flexure of a rectangular bar (AISC 360-16 F11)",
    "bracing_of_assembly": "members of plies: the lateral bracing the stability checks rest on (never met: always listed)",
    "slip": "slip of mechanical connectors by the γ-method (EN 1995-1-1:2004 Annex B, solve/slip.py)",
}


def _member_prefix(member_id: str) -> str:
    return f"member[{member_id}]."


#: Key segments of the member-type checks (``solve/member_kinds.py`` and the modules it calls) and
#: the expectation tag each one meets: ``web_panel_shear`` is the plywood panel-shear check, a
#: ``flange[top]`` check is the flange's axial check, and so on.
ALIASES = {
    "web_panel_shear": "panel_shear",
    "web_axial": "panel_stress",
    "shear_deflection": "shear_deformation",
    "web_yielding": "web_local_yielding",
    "web_proportions": "local_buckling",
}

#: Expectation names whose item a member-type check module reports itself, more precisely, as
#: Unchecked items keyed with these prefixes (``member[G1].flange[bot].tension``): the general
#: line is then left out in favour of the precise ones.
PRECISE = {
    "flange_axial": ("flange[",),
    "panel_shear": ("web_panel_shear",),
    "panel_stress": ("web_axial",),
    "shear_deformation": ("shear_deflection",),
    "web_local_yielding": ("web_yielding",),
}


def check_tags(check: Check, member_id: str) -> frozenset[str]:
    """The scope tags ``check`` covers (see the module docstring); empty for joint checks."""
    key = check.key
    pre = _member_prefix(member_id)
    if key.startswith(pre):
        key = key[len(pre) :]
    if key.startswith("joint["):
        return frozenset(check.scope.split())
    segs = [s for s in key.split(".") if s]
    tags = set(segs) | {f"{a}:{b}" for a, b in zip(segs, segs[1:])}
    tags |= {ALIASES[s] for s in segs if s in ALIASES}
    tags |= {"flange_axial" for s in segs if s.startswith("flange[")}
    return frozenset(tags | set(check.scope.split()))


def ran(check: Check) -> bool:
    """A check ran when it compared a demand with a capacity (a ratio) or found an NG."""
    return check.status == "NG" or (check.status == "OK" and check.ratio is not None)


def _info_reason(tags: tuple[str, ...], infos: list[tuple[frozenset[str], Check]]) -> str | None:
    for t, c in infos:
        if any(x in t for x in tags) and c.note:
            return c.note.removeprefix("not checked: ")
    return None


def not_checked(
    member: Member,
    checks: tuple[Check, ...] | list[Check],
    has_moment: bool,
    extra: tuple[Unchecked, ...] = (),
) -> tuple[Unchecked, ...]:
    """Every expectation of ``member`` that no check that ran covers, with clause and reason.

    The reason of an INFO row that carries the expectation's tags (e.g. "no Fv given for
    material ply") replaces the default reason. ``extra`` are Unchecked items a member-check module
    reports itself (e.g. "flange splices not designed"); one with the same key as an expectation
    replaces it, and an extra item whose key's last part is a tag covered by a check that ran is
    dropped too.
    """
    covered: set[str] = set()
    infos: list[tuple[frozenset[str], Check]] = []
    for c in checks:
        tags = check_tags(c, member.id)
        if ran(c):
            covered |= tags
        elif c.status == "INFO":
            infos.append((tags, c))
    out = []
    for e in expectations(member, has_moment):
        if any(t in covered for t in e.tags):
            continue
        reason = _info_reason(e.tags, infos) or e.reason
        out.append(Unchecked(f"member[{member.id}].{e.name}", e.label, e.clause, reason))
    own = {u.key: u for u in extra if u.key.rsplit(".", 1)[-1] not in covered}
    prefix = f"member[{member.id}]."
    precise = {k[len(prefix) :] for k in own if k.startswith(prefix)}
    out = [
        u for u in out if not any(p.startswith(PRECISE.get(u.key[len(prefix) :], ("\0",))) for p in precise)
    ]
    merged = [own.pop(u.key, u) for u in out]
    return tuple(merged + list(own.values()))


#: Words for the first key segment of a member check that ran.
WORDS = {
    "bending": "bending stress",
    "shear": "horizontal shear",
    "deflection": "deflection",
    "flexure": "flexure",
    "web_shear": "web shear",
    "slip": "connector slip (γ-method)",
}


def checked_words(
    member_id: str, checks: tuple[Check, ...] | list[Check], joints: tuple[JointResult, ...]
) -> tuple[tuple[str, ...], bool]:
    """What ran, in words, and whether the connectors are all that ran."""
    words: list[str] = []
    if joints:
        words.append(f"connectors at {len(joints)} joint{'s' if len(joints) != 1 else ''}")
    member_ran = False
    pre = _member_prefix(member_id)
    for c in checks:
        if not ran(c) or c.key.startswith(pre + "joint["):
            continue
        member_ran = True
        head = c.key.removeprefix(pre).split(".")[0]
        w = WORDS.get(head, c.label[0].lower() + c.label[1:])
        if w not in words:
            words.append(w)
    return tuple(words), bool(joints) and not member_ran


def missing_stress_rows(member: Member, has_moment: bool) -> list[Check]:
    """INFO rows for material stresses whose absence disables a check (never silence): wood
    without Fb (when a moment is known), steel without Fy."""
    out: list[Check] = []
    pre = f"member[{member.id}]"
    fam = families(member)
    if has_moment:
        for mat in materials(fam.get("wood", [])):
            if mat.Fb is None:
                out.append(
                    Check(
                        f"{pre}.bending.{mat.id}",
                        f"Bending stress, {mat.id}",
                        None,
                        None,
                        None,
                        "INFO",
                        f"{NDS} §3.3",
                        note=f"not checked: no Fb given for material {mat.id}",
                    )
                )
    for mat in materials(fam.get("steel", [])):
        if mat.Fy is None:
            out.append(
                Check(
                    f"{pre}.flexure",
                    f"Flexure of the steel section ({mat.id})",
                    None,
                    None,
                    None,
                    "INFO",
                    f"{AISC} Chapter F",
                    note=f"not checked: no Fy given for material {mat.id}",
                )
            )
    return out
