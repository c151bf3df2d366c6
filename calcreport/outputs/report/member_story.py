"""One member's section of the report, in the order of the work.

1. description and assumptions; 2. inputs (parts, materials, connectors, design shear and settings);
3. loads, combinations and the load diagram; 4. section properties (the section to scale and its
table); 5. analysis (design shear, or the beam analysis with the V and M envelopes); 6. connector
design, joint by joint (a joint equal to an earlier one is stated once, :mod:`.folding`); 7.
spacing and schedule (zoned schedules, q(x) against n·F/s, the zone elevation); 8. member checks;
9. results and the scope line (what did not run).

Derivation headings are numbered ``<member>.<n>`` through the member in that order; the stages
without content are left out. Nothing here computes: it orders what the solver returned.
"""

from __future__ import annotations

from reportlab.graphics.shapes import Drawing
from reportlab.platypus import Flowable, KeepTogether, Paragraph

from ...solve.results import MemberResult
from .common import Ctx, heading, para
from .derivations import STAGES, Group, member_groups, stage_story
from .drawing import section_drawing
from .folding import fold_groups
from .inputs import assumptions_story, description_story, inputs_story
from .loads_figures import demand_capacity_chart, loading_diagram, zone_elevation
from .loads_section import beam_figures, combinations_table, schedule_figures, schedule_key
from .pages import OutlineMark
from .results_tables import results_story
from .slip_section import slip_story
from .styles import esc

__all__ = ["member_story", "fit_figure", "STAGE_TITLES"]

STAGE_TITLES = dict(STAGES)


def fit_figure(fig: Flowable, ctx: Ctx, share: float = 0.85) -> Flowable:
    """A drawing scaled down (never up) to the frame's width and ``share`` of its height."""
    if not isinstance(fig, Drawing):
        return fig
    w, h = float(fig.width), float(fig.height)
    k = min(1.0, ctx.width / w if w else 1.0, share * ctx.frame_height / h if h else 1.0)
    if k < 0.999:
        fig.scale(k, k)
        fig.width, fig.height = w * k, h * k
    return fig


def _figure(fig: Flowable | None, caption: str, ctx: Ctx, marks: list | None = None) -> list:
    if fig is None:
        return []
    return [KeepTogether([*(marks or []), fit_figure(fig, ctx), para(caption, ctx.styles.caption)])]


def _loads_figures(m: MemberResult, ctx: Ctx) -> list:
    fig = loading_diagram(
        m.member, ctx.q, ctx.display.position, ctx.styles.fonts, ctx.width, ctx.display.system
    )
    out = _figure(fig, "Loads by case (downward positive) on the member, with its supports and spans.", ctx)
    if m.beam is not None:
        out += combinations_table(m, ctx)
    return out


def _schedule_figures(m: MemberResult, ctx: Ctx, jid: str, charts: bool = True) -> list:
    j = next((x for x in m.joints if x.id == jid), None)
    if j is None or j.schedule is None:
        return []
    out = list(schedule_figures(j, ctx, m.id))
    if not charts:
        return out
    mark = ctx.mark(schedule_key(m.id, j.id))
    chart = demand_capacity_chart(j, ctx.display, ctx.styles.fonts, ctx.width)
    out += _figure(
        chart,
        (
            f"Shear flow q(x) = V(x)·Q/I at joint {j.id} from the envelope, against the capacity "
            if j.Q is not None  # fastener lines between plies carry no V·Q/I
            else f"Transfer demand t(x) between the plies at line {j.id}, from the loads that "
            "enter one ply (share by E·I, C_D per combination), against the capacity "
        )
        + "n·F/s that each zone provides.",
        ctx,
        mark,
    )
    elev = zone_elevation(j, m.member, ctx.q, ctx.display.position, ctx.styles.fonts, ctx.width)
    out += _figure(
        elev,
        f"Elevation of the member: connector rows of joint {j.id} by zone, with each zone's spacing "
        "(above) and length and number of rows (below).",
        ctx,
        mark,
    )
    return out


def member_story(m: MemberResult, ctx: Ctx, number: int) -> list:
    """The flowables of member ``m`` (numbered ``number``) after its title, in the order above."""
    st = ctx.styles
    out: list = []
    out += description_story(m, ctx)
    out += assumptions_story(m, ctx)
    drawing, caption = section_drawing(m, ctx)  # the detail heads the parts it dimensions
    out += inputs_story(m, ctx, [KeepTogether([fit_figure(drawing, ctx), para(caption, st.caption)])])
    groups = member_groups(m)
    for k, g in enumerate(groups, 1):
        g.number = f"{number}.{k}"
    folds = fold_groups(groups, ctx.display, {p.id for p in m.member.parts})
    by_stage: dict[str, list[Group]] = {}
    for g in groups:
        by_stage.setdefault(g.stage, []).append(g)
    intro: Paragraph | None = para(
        "Each step: its formula, the numbers substituted, the result (bold) and its source (right); "
        "governing steps tinted; headings numbered in the order of the work.",
        st.small,
    )
    done_schedules: set[str] = set()
    for sid, title in STAGES:
        body: list = []
        stage_groups = by_stage.get(sid, [])
        single = (
            sid not in ("loads", "section", "analysis", "schedule")
            and len(stage_groups) == 1
            and stage_groups[0].title.strip().lower() == title.strip().lower()
        )
        if sid == "loads":
            body += _loads_figures(m, ctx)
            body += stage_story(by_stage.get(sid, []), ctx, folds)
        elif sid == "section":
            body += stage_story(by_stage.get(sid, []), ctx, folds)
        elif sid == "analysis":
            body += stage_story(by_stage.get(sid, []), ctx, folds)
            if m.beam is not None:
                body += [f for f in beam_figures(m, ctx) if not isinstance(f, Paragraph)]
        elif sid == "schedule":
            for g in by_stage.get(sid, []):
                body += stage_story([g], ctx, folds)
                fold = folds.get(g.gid)
                jid = g.gid.split(".", 1)[1]
                done_schedules.add(jid)
                body += _schedule_figures(m, ctx, jid, charts=fold is None or bool(fold.differ))
                if fold is not None and not fold.differ:
                    base = fold.base_gid.split(".", 1)[1]
                    body.append(
                        para(f"Its q(x) chart and zone elevation are those of joint {base}.", st.small)
                    )
        else:
            body += stage_story(stage_groups, ctx, folds, st.h2 if single else None)
        if sid == "schedule":  # a schedule without steps of its own still shows its table
            for j in m.joints:
                if j.schedule is not None and j.id not in done_schedules:
                    body += _schedule_figures(m, ctx, j.id)
        if body:
            out.append(OutlineMark(title, 1))
            if not single:  # a lone group named as its stage ("1.5 Member checks") heads it
                out += heading(title, st.h2, need=80)
            if intro is not None and by_stage.get(sid):
                out.append(intro)
                intro = None
            out += body
    slip = slip_story(m, ctx)  # connector slip: rigid beside the γ-method (solve/slip.py)
    if slip:
        out += [OutlineMark("Connector slip", 1), *slip]
    out.append(OutlineMark("Results and scope", 1))
    out += results_story(m, ctx)  # the status line kept with the checks' last rows there
    return out


def member_title(m: MemberResult, number: int, ctx: Ctx) -> Paragraph:
    """The member's heading (with NG in red when it fails)."""
    subject = f"Member {m.id} — {m.member.title}"
    status = "" if m.status == "OK" else '   <font color="#b3261e">NG</font>'
    return Paragraph(f"{number}  {esc(subject)}{status}", ctx.styles.h1)
