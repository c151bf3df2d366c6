"""Moving loads, variable cases of the job's own and the ASCE 7 edition through the job file.

Reference values: influence line of shear of a simple span (any mechanics text) —
V_max(0) = P + P(L − a)/L for two loads P at spacing a, the first at the support;
V_max(0) = w·L/2 for a uniform variable load; ASCE 7-22 §2.4.1 / ASCE 7-16 §2.4.1 combination 3
(D + 0.7S and D + S; 7-22 factor: STRUCTURE magazine, "ASCE 7-22 Flat Roof Snow Load versus
Minimum Snow Load").
"""

from __future__ import annotations

import pytest

from tests.conftest import job_text
from tests.test_beam_job import MEMBER, SETTINGS, _solve

CART = """
[[member.load]]
case = "L"
kind = "point"
P = "500 lbf"
moving = true
group = "cart"
offset = "0 ft"

[[member.load]]
case = "L"
kind = "point"
P = "500 lbf"
moving = true
group = "cart"
offset = "4 ft"
"""


def _job(member=MEMBER, settings=SETTINGS):
    return job_text(member).replace('method = "ASD"\n', 'method = "ASD"\n' + settings)


def _with_cart(extra=CART):
    return MEMBER.replace('w = "200 plf"\n', 'w = "200 plf"\n' + extra, 1)


def test_moving_cart_governs_shear(write_job):
    """Simple span 16 ft: D 100 plf, L 200 plf and a cart of two 500 lbf wheels 4 ft apart (same
    case L, all placed for their worst effect). V(0) = 100·8 + 200·8 + 500 + 500·12/16 = 3,275 lbf."""
    r = _solve(_job(_with_cart()), write_job)
    along = r.members[0].beam
    assert along.V_design.to("lbf").magnitude == pytest.approx(800 + 1600 + 500 + 375, rel=1e-9)
    assert "L moving" in along.V_governing


def test_variable_own_case(write_job):
    """A case of the job's own with variable = true is placed like L: its own combination D + crowd
    reaches V_max(0) = 100·8 + 200·8 lbf (full span) and the middle of the span sees the partial
    placement w(L − x)²/(2L) (influence line of shear, any mechanics text)."""
    member = MEMBER.replace('case = "L"', 'case = "crowd"\nvariable = true').replace(
        'span = "16 ft"',
        'span = "16 ft"\n[[member.combination]]\nname = "D + crowd"\nfactors = { D = 1.0, crowd = 1.0 }',
    )
    r = _solve(_job(member), write_job)
    b = r.members[0].beam
    assert b.V_design.to("lbf").magnitude == pytest.approx(2400.0, rel=1e-9)
    assert b.analysis.live_cases == ("crowd",)
    env = b.analysis.envelope
    x = env.x.to("ft").magnitude
    import numpy as np

    k = int(np.argmin(abs(x - 8.0)))
    assert env.V_max.to("lbf").magnitude[k] == pytest.approx(200 * 8**2 / 32, rel=1e-9)
    assert "crowd partial" in env.V_max_by[k]


@pytest.mark.parametrize("standard, factor", [("ASCE 7-22", 0.7), ("ASCE 7-16", 1.0)])
def test_load_standard_edition(write_job, standard, factor):
    member = MEMBER.replace('case = "L"', 'case = "S"')
    r = _solve(_job(member, SETTINGS + f'load_standard = "{standard}"\n'), write_job)
    b = r.members[0].beam
    names = [c.name for c in b.combinations]
    assert (f"ASD 3: D + {factor!r}S" if factor != 1.0 else "ASD 3: D + S") in names
    assert b.combinations_source.startswith(standard)
    assert all(c.source.startswith(standard) for c in b.combinations)
    assert b.V_design.to("lbf").magnitude == pytest.approx(800 + factor * 1600, rel=1e-9)


BAD = [
    (
        "moving with at",
        'moving = true\ngroup = "cart"\noffset = "0 ft"',
        'moving = true\nat = "3 ft"',
        ["at", "no fixed position"],
    ),
    (
        "moving dead load",
        'case = "L"\nkind = "point"',
        'case = "D"\nkind = "point"',
        ["moving", "variable case"],
    ),
    ("offset without group", 'group = "cart"\noffset = "4 ft"', 'offset = "4 ft"', ["offset", "group"]),
    (
        "between too short",
        'offset = "4 ft"',
        'offset = "4 ft"\nbetween = ["0 ft", "2 ft"]',
        ["between", "longer than its travel"],
    ),
    (
        "between backwards",
        'offset = "4 ft"',
        'offset = "4 ft"\nbetween = ["9 ft", "2 ft"]',
        ["between", "from < to"],
    ),
    (
        "between not a pair",
        'offset = "4 ft"',
        'offset = "4 ft"\nbetween = "2 ft"',
        ["between", "two positions"],
    ),
    (
        "variable on a standard case",
        'P = "500 lbf"\nmoving',
        'P = "500 lbf"\nvariable = true\nmoving',
        ["variable", "standard case"],
    ),
    ("bad edition", None, 'load_standard = "ASCE 7-10"\n', ["load_standard", "ASCE 7-22, ASCE 7-16"]),
]


@pytest.mark.parametrize("name, old, new, words", BAD, ids=[b[0] for b in BAD])
def test_bad_moving_input_one_line_exit_2(name, old, new, words, write_job, cli):
    if old is None:
        text = _job(_with_cart(), SETTINGS + new)
    else:
        member = _with_cart()
        assert old in member, old
        text = _job(member.replace(old, new, 1))
    path = write_job(text)
    code, out, err = cli("check", path)
    assert code == 2, (out, err)
    lines = err.strip().splitlines()
    assert len(lines) == 1 and "Traceback" not in err and lines[0].startswith(path + ":")
    for w in words:
        assert w in lines[0], (w, lines[0])
