"""Scope of every result: a status rests only on checks that ran; what a plan checker expects and did
not run is listed with clause and reason; assumed values are recorded and shown.

Sources: the list of checks a reviewer expects for each kind of member is common practice of plan
review, no source; the clauses named are AISC 360-16 Chapters F and G, Table B4.1b, J10.2, J10.3,
NDS 2018 §3.3, §3.4, §3.10 and the IBC 2021 Table 1604.3 deflection limits (from memory).
"""

from __future__ import annotations

import json
import re
from pathlib import Path

import pytest

from calcreport.model import Material, Member, Part, Shape
from calcreport.outputs.json_out import to_dict
from calcreport.outputs.table import render_job
from calcreport.pipeline import solve_file
from calcreport.solve.results import Check
from calcreport.solve.scope import check_tags, not_checked
from calcreport.units import Q_

ROOT = Path(__file__).resolve().parent.parent
GIRDER = ROOT / "jobs" / "pavilion-plate-girder.toml"
HEADER = ROOT / "jobs" / "boathouse-door-header.toml"
RIDGE = ROOT / "jobs" / "pavilion-ridge-box-beam.toml"


FY50 = Q_(50, "ksi")


def _member(family="steel", Fy=FY50, Fb=None) -> Member:
    mat = Material("m", "m", Q_(29000, "ksi"), family=family, Fy=Fy, Fb=Fb)
    p = Part("web", Shape("polygon", (0, 0, 0.5, 30)), mat)
    return Member("G", "G", "", (p,), (), mat)


def keys(items) -> set[str]:
    return {u.key.split(".", 1)[1] for u in items}


def test_steel_girder_checks_flexure_and_web_shear_and_lists_the_rest():
    # The girder demo has loads along it: flexure (F2-F5) and web shear (G2.1) ran; stiffeners and
    # plate splices are not designed and are listed with their clauses.
    r = solve_file(str(GIRDER)).members[0]
    assert r.status == "OK" and not r.connectors_only
    left = keys(r.not_checked)
    assert not {"flexure", "web_shear", "local_buckling", "web_crippling"} & left
    assert {"stiffeners", "splices"} <= left
    text = render_job(solve_file(str(GIRDER)))
    assert re.search(r"not checked \(\d+\): transverse and bearing stiffeners", text)


def test_steel_girder_given_only_a_shear_lists_flexure_with_its_reason():
    starter = ROOT / "calcreport" / "data" / "templates" / "starter-plate-girder.toml"
    r = solve_file(str(starter)).members[0]
    flex = next(u for u in r.not_checked if u.key.endswith(".flexure"))
    assert flex.clause.startswith("AISC 360-16 Chapter F")
    assert "shear only" in flex.reason  # no moment is known from a design shear alone
    names = [u.key.rsplit(".", 1)[-1] for u in r.not_checked]
    assert len(names) == len(set(names)) and not ({"web_local_yielding", "web_yielding"} <= set(names))


def test_a_check_that_ran_removes_its_expectation_by_key_or_scope_tag():
    m = _member()
    base = keys(not_checked(m, (), True))
    assert {"flexure", "local_buckling", "web_shear"} <= base
    # Key suffix: member[G].flexure.F2 covers "flexure" (and local buckling, which F2-F5 classify).
    ran = Check("member[G].flexure.F2", "Flexure F2", Q_(1, "kip*ft"), Q_(2, "kip*ft"), 0.5, "OK")
    left = keys(not_checked(m, (ran,), True))
    assert "flexure" not in left and "local_buckling" not in left and "web_shear" in left
    # Explicit scope tag on a check whose key says something else.
    shear = Check("member[G].girder.V", "Web shear", None, None, 0.4, "OK", scope="web_shear")
    assert "web_shear" not in keys(not_checked(m, (ran, shear), True))
    assert {"girder", "V", "girder:V", "web_shear"} <= check_tags(shear, "G")
    # An INFO row (no ratio) never meets an expectation; its note becomes the reason.
    info = Check("member[G].flexure", "Flexure", None, None, None, "INFO", note="not checked: no Lb given")
    left = not_checked(m, (info,), True)
    assert next(u for u in left if u.key.endswith(".flexure")).reason == "no Lb given"
    # Joint checks are connectors: they never meet a member expectation.
    joint = Check("member[G].joint[j].flexure", "x", None, None, 0.1, "OK")
    assert "flexure" in keys(not_checked(m, (joint,), True))


def test_steel_without_fy_gets_an_info_row_and_the_reason():
    from calcreport.solve.scope import missing_stress_rows

    m = _member(Fy=None)
    rows = missing_stress_rows(m, True)
    assert [r.status for r in rows] == ["INFO"] and "no Fy given" in rows[0].note
    u = next(u for u in not_checked(m, tuple(rows), True) if u.key.endswith(".flexure"))
    assert u.reason == "no Fy given for material m"


def test_wood_without_fb_with_loads_gives_info_row_and_unchecked():
    # The boardwalk demo's deck plank material states no Fb: bending is an INFO row, never silence.
    r = solve_file(str(ROOT / "jobs" / "boardwalk-glued-tee.toml")).members[0]
    info = [c for c in r.checks if c.key.endswith("bending.deck_plank")]
    assert info and info[0].status == "INFO" and "no Fb given" in info[0].note
    u = next(u for u in r.not_checked if u.key.endswith("bending.deck_plank"))
    assert u.reason == "no Fb given for material deck_plank" and u.clause == "NDS 2018 §3.3"
    assert not r.connectors_only and "bending stress" in r.checked


def test_header_json_carries_scope_and_assumed():
    # The header gives a design shear only: its nails and the plywood panel shear (V·Q/(I·Σt)
    # against Fv·tv, which also answers for the shear at the neutral axis of a plywood web) ran;
    # deflection cannot run without loads and says so.
    res = solve_file(str(HEADER))
    data = json.loads(json.dumps(to_dict(res)))
    m = data["members"][0]
    assert m["connectors_only"] is False and m["checked"][0] == "connectors at 2 joints"
    assert any("panel shear" in w for w in m["checked"])
    nc = {u["key"]: u for u in m["not_checked"]}
    assert nc["member[H1].deflection"]["reason"] == "no loads given"
    assert "member[H1].shear.neutral_axis" not in nc
    assumed = {a["key"]: a for a in m["assumed"]}
    cd = assumed["member[H1].joint[top-webs].connector.CD"]
    assert cd["value"] == 1.0 and "load_duration" in cd["where"]  # ASD, C_D not stated
    assert assumed["member[H1].joint[top-webs].connector.Fyb"]["value"]["value"] == 100000.0  # 8d common
    assert "member[H1].joint[top-webs].connector.staggered" not in assumed  # stated in the job
    # The header states units, method and spacings: none of them is listed as assumed.
    assert not any(a["key"] in ("settings.units", "settings.method") for a in data["assumed"])


def test_assumed_settings_and_combinations_of_a_job_with_loads():
    res = solve_file(str(RIDGE))
    keys_ = {a.key for a in res.assumed}
    assert "settings.zone_module" in keys_ and "settings.units" not in keys_
    m = res.members[0]
    combos = next(a for a in m.assumed if a.key == "member[RB1].combination")
    assert "ASCE 7-22 §2.4.1" in combos.value  # ASD basic combinations, edition named
    assert any(a.key == "member[RB1].load" and "pattern" in a.value for a in m.assumed)


def test_given_connector_without_minimum_spacing_gets_an_info_row(tmp_path):
    text = HEADER.read_text(encoding="utf-8")
    text = text.replace('spacing_min = "1.5 in"\n', "")
    text = re.sub(
        r'type = "nail"\nsize = "8d common".*?\nstaggered = true.*?\nG_side = 0.50.*?\n',
        'type = "given"\nvalue = "90 lbf"\nsource = "test value"\n',
        text,
        flags=re.S,
    )
    job = tmp_path / "given.toml"
    job.write_text(text, encoding="utf-8")
    r = solve_file(str(job)).members[0]
    rows = [c for j in r.joints for c in j.checks if c.key.endswith("connector.spacing_min")]
    assert len(rows) == 2 and all(c.status == "INFO" and "not checked" in c.note for c in rows)


def test_ng_joint_shows_its_real_utilisation(tmp_path):
    # Shear raised to 7 kip: four 8d nails per row carry 4 × 88.0 = 352 lbf, and q = V·Q/I is then
    # so high that s_req = 352 lbf / q falls below spacing_min = 2 in (set here). At the closest
    # spacing allowed (2 in) the utilisation is q × 2 in / 352 lbf, above 1 — never the 0 of a zero
    # spacing.
    text = HEADER.read_text(encoding="utf-8").replace('shear = "2.9 kip"', 'shear = "7 kip"')
    text = text.replace('spacing_min = "1.5 in"', 'spacing_min = "2 in"')
    job = tmp_path / "ng.toml"
    job.write_text(text, encoding="utf-8")
    res = solve_file(str(job))
    j = res.members[0].joints[0]
    assert j.status == "NG"
    assert j.spacing_provided.to("in").magnitude == pytest.approx(2.0)
    hand = j.shear_flow.to("lbf/in").magnitude * 2.0 / j.capacity_row.to("lbf").magnitude
    assert j.utilisation == pytest.approx(hand) and j.utilisation > 1.15
    assert j.spacing_required.to("in").magnitude < 2.0


def test_report_shows_scope_and_the_assumed_values_page(tmp_path):
    pypdf = pytest.importorskip("pypdf")
    from calcreport.outputs.report.build import build_pdf

    out = tmp_path / "g.pdf"
    build_pdf(solve_file(str(GIRDER)), out)
    pages = [re.sub(r"\s+", " ", p.extract_text() or "") for p in pypdf.PdfReader(str(out)).pages]
    cover = pages[0]
    assert "not checked" in cover.lower() and "connectors only" not in cover  # flexure, web shear ran
    n = len(solve_file(str(GIRDER)).members[0].not_checked)
    assert any(f"Not checked ({n})" in p and "stiffeners" in p for p in pages)
    # the assumed values' table may run onto the next sheet (split with three rows on each side)
    assert any(
        "Assumed values" in p and "values assumed" in p and "FEXX" in p + nxt
        for p, nxt in zip(pages, [*pages[1:], ""])
    )
    assert not any("from memory" in p for p in pages)  # reports cite clauses only


def test_unchecked_items_of_a_check_module_merge_by_key():
    from calcreport.solve.results import Unchecked

    m = _member()
    mine = Unchecked("member[G].stiffeners", "bearing stiffeners", "AISC 360-16 J10.8", "no bearing length")
    new = Unchecked("member[G].splices", "flange splices", "common practice, no source", "not designed")
    left = {u.key: u for u in not_checked(m, (), True, extra=(mine, new))}
    assert left["member[G].stiffeners"].reason == "no bearing length"  # replaces the expectation
    assert "member[G].splices" in left
    ran = Check("member[G].splices.weld", "Splice", None, None, 0.5, "OK")
    assert "member[G].splices" not in {u.key for u in not_checked(m, (ran,), True, extra=(new,))}


STACK = """
[job]
project = "Boathouse test"
[settings]
units = "US"
method = "ASD"
[[material]]
id = "df"
family = "wood"
E = "1600 ksi"
G = 0.5
[[member]]
id = "B1"
shear = "1 kip"
[[member.part]]
id = "bot"
shape = "lumber"
size = "2x8"
flat = true
material = "df"
[[member.part]]
id = "top"
shape = "lumber"
size = "2x8"
flat = true
material = "df"
on = "bot"
[[member.joint]]
id = "j"
holds = ["top"]
[member.joint.connector]
type = "nail"
size = "10d common"
"""


def test_plane_shear_without_fv_is_an_info_row_and_a_10d_fits_two_flat_2x(tmp_path):
    # Two flat 2x8 (1-1/2 in each): 10d common (3 in) ends exactly at the far face, 3.0 − 3.0 = 0 →
    # fits. No Fv on the wood: the horizontal shear at the plane is an INFO row, never silence.
    job = tmp_path / "stack.toml"
    job.write_text(STACK, encoding="utf-8")
    r = solve_file(str(job)).members[0]
    checks = {c.key.split(".", 2)[-1]: c for c in r.joints[0].checks}
    assert checks["shear.joint.j"].status == "INFO" and "no Fv" in checks["shear.joint.j"].note
    assert checks["connector.fit"].status == "OK" and checks["connector.fit"].ratio == pytest.approx(1.0)
    bending = next(u for u in r.not_checked if u.key == "member[B1].bending.df")
    assert "only a design shear" in bending.reason


def test_a_pennyweight_without_a_type_is_listed_as_assumed_common(tmp_path):
    job = tmp_path / "stack.toml"
    job.write_text(STACK.replace('"10d common"', '"10d"'), encoding="utf-8")
    m = solve_file(str(job)).members[0]
    a = next(a for a in m.assumed if a.key == "member[B1].joint[j].connector.size")
    assert a.value == "common"
