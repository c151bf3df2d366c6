"""Connector registry contract, shear-plane geometry, and the glue line with plywood rolling shear.

Sources: mechanics of materials (τ = V·Q/(I·b)); rolling shear of plywood glued on its face per
the panel design specification the job names (the value itself is job data here: 53 psi is used
only as an input, not checked against a publication).
"""

import pytest
from conn_fixtures import context, rect, run, step, wood

from calcreport.fields import Field
from calcreport.solve.connectors import _MODULES, kinds, model_for
from calcreport.solve.connectors.shear_plane import find_contact, plate_thickness, thickness_normal
from calcreport.units import DIMENSIONS, Q_

KINDS = {"nail", "wood_screw", "lag_screw", "wood_bolt", "steel_bolt", "fillet_weld", "stud", "glue"}


def test_every_model_declares_kind_fields_and_design():
    assert KINDS <= set(kinds())
    ok_kinds = set(DIMENSIONS) | {"text", "int", "number", "bool", "choice"}
    for k in kinds():
        m = model_for(k)
        assert m.KIND == k, _MODULES[k]
        assert isinstance(m.FIELDS, tuple) and all(isinstance(f, Field) for f in m.FIELDS)
        names = [f.name for f in m.FIELDS]
        assert len(names) == len(set(names)), k
        for f in m.FIELDS:
            assert f.kind in ok_kinds, (k, f.name)
            if f.kind == "choice":
                assert f.default is None or f.default in f.choices
        assert callable(m.design)


def test_contact_horizontal_and_vertical():
    a = rect("a", 0, 1.5, 3.5, 3.0, wood())
    b = rect("b", 0, 0, 3.5, 1.5, wood())
    c = find_contact((a,), (b,))
    assert c.orientation == "horizontal" and c.at == 1.5 and c.held_side == 1
    web = rect("web", 1.5, 0, 2.0, 12, wood())
    fl = rect("fl", 0, 10.5, 1.5, 12, wood())
    c = find_contact((fl,), (web,))
    assert c.orientation == "vertical" and (c.hi - c.lo) == pytest.approx(1.5)
    assert thickness_normal(web, c) == pytest.approx(0.5)
    assert plate_thickness(fl, c) == pytest.approx(1.5)
    assert find_contact((a,), (rect("far", 10, 10, 11, 11, wood()),)) is None


def test_glue_backward_compatible():
    a = rect("a", 0, 1.5, 3.5, 3.0, wood())
    b = rect("b", 0, 0, 3.5, 1.5, wood())
    cap, log = run("glue", {"tau": Q_(90, "psi")}, context([a], [b]))
    assert cap.continuous
    assert cap.value.to("lbf/in").magnitude == pytest.approx(90 * 3.5)
    assert len(log.steps) == 1


def box_beam():
    ply = wood(G=0.42, id="ply", family="plywood")
    web = rect("web", 1.5, 0, 1.5 + 0.5, 12, ply)
    fl = rect("fl", 0, 10.5, 1.5, 12, wood())
    return web, fl


def test_glue_rolling_shear_governs_on_plywood_face():
    web, fl = box_beam()
    cap, log = run(
        "glue",
        {
            "tau": Q_(95, "psi"),
            "rolling_shear": Q_(53, "psi"),
            "rolling_source": "panel design specification as adopted by the job",
        },
        context([fl], [web], width=1.5),
    )
    assert cap.value.to("lbf/in").magnitude == pytest.approx(53 * 1.5)
    assert step(log, "q_glue").note == "rolling shear governs"


def test_glue_rolling_shear_from_material_extra_and_missing():
    web, fl = box_beam()
    from dataclasses import replace

    web2 = replace(web, material=replace(web.material, extra={"Fs": Q_(53, "psi"), "grade": ""}))
    cap, _ = run("glue", {"tau": Q_(95, "psi")}, context([fl], [web2], width=1.5))
    assert cap.value.to("lbf/in").magnitude == pytest.approx(53 * 1.5)
    cap, _ = run("glue", {"tau": Q_(95, "psi")}, context([fl], [web], width=1.5))
    assert cap.value.to("lbf/in").magnitude == pytest.approx(95 * 1.5)
    assert cap.checks[0].status == "INFO"


def test_declared_keys_and_models_agree():
    """Every declared connector type has a model and each model takes its keys from the declarations
    (calcreport/keys/connectors.py), which the job-file reader validates against."""
    from calcreport.keys.connectors import CONNECTOR_FIELDS

    assert list(CONNECTOR_FIELDS) == list(_MODULES)
    for kind in kinds():
        assert model_for(kind).FIELDS is CONNECTOR_FIELDS[kind]
        assert model_for(kind).KIND == kind
