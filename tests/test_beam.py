"""Beam analysis against closed-form beam formulas.

Source for every formula: AISC Steel Construction Manual, 15th ed., Table 3-23 "Shears, Moments
and Deflections" (beam diagrams and formulas); case descriptions as titled there, formulas from
memory of that table and checked by statics.
"""

import math

import numpy as np
import pytest

from calcreport.model import Combination, Load, Support
from calcreport.solve.beam import BeamInputError, analyse, self_weight
from calcreport.units import Q_

w = 2.0  # lbf/in
EI = 3.0e9  # lbf·in²
L = 240.0  # in
P = 1000.0  # lbf
REL = 1e-6


def _run(length, supports, loads, combos=None, ei=EI):
    return analyse(
        Q_(length, "in"),
        supports,
        loads,
        combos or [Combination("D", {"D": 1.0})],
        EI=Q_(ei, "lbf*in**2") if ei else None,
    )


def _pin(x):
    return Support(Q_(x, "in"), "pin")


def _udl(case="D", ww=w, a=None, b=None):
    return Load(
        case,
        "uniform",
        Q_(ww, "lbf/in"),
        start=None if a is None else Q_(a, "in"),
        end=None if b is None else Q_(b, "in"),
    )


def _pt(at, p=P, case="D"):
    return Load(case, "point", Q_(p, "lbf"), at=Q_(at, "in"))


def _arrays(d):
    return (
        d.x.to("in").magnitude,
        d.V.to("lbf").magnitude,
        d.M.to("lbf*in").magnitude,
        d.deflection.to("in").magnitude if d.deflection is not None else None,
    )


def test_simple_span_uniform():
    """Table 3-23, simple beam — uniformly distributed load: R = V = wL/2, Mmax = wL²/8 at
    centre, Δmax = 5wL⁴/(384EI), Vx = w(L/2 − x)."""
    r = _run(L, [_pin(0), _pin(L)], [_udl()])
    d = r.cases[0]
    x, V, M, v = _arrays(d)
    assert [q.force.to("lbf").magnitude for q in d.reactions] == pytest.approx([w * L / 2] * 2, REL)
    assert M.max() == pytest.approx(w * L**2 / 8, REL)
    assert v.max() == pytest.approx(5 * w * L**4 / (384 * EI), REL)
    assert V == pytest.approx(w * (L / 2 - x), rel=REL, abs=1e-6)


def test_simple_span_point_at_centre():
    """Table 3-23, simple beam — concentrated load at centre: R = P/2, Mmax = PL/4,
    Δmax = PL³/(48EI); the shear jumps by P at the load."""
    r = _run(L, [_pin(0), _pin(L)], [_pt(L / 2)])
    x, V, M, v = _arrays(r.cases[0])
    assert M.max() == pytest.approx(P * L / 4, REL)
    assert v.max() == pytest.approx(P * L**3 / (48 * EI), REL)
    k = np.where(np.isclose(x, L / 2))[0]
    assert len(k) == 2 and V[k[0]] == pytest.approx(P / 2, REL) and V[k[1]] == pytest.approx(-P / 2, REL)


@pytest.mark.parametrize("a", [60.0, 90.0, 170.0])
def test_simple_span_point_anywhere(a):
    """Table 3-23, simple beam — concentrated load at any point: R1 = Pb/L, R2 = Pa/L,
    Mmax = Pab/L at the load, Δ at the load = Pa²b²/(3EIL)."""
    b = L - a
    r = _run(L, [_pin(0), _pin(L)], [_pt(a)])
    d = r.cases[0]
    x, V, M, v = _arrays(d)
    R1, R2 = (q.force.to("lbf").magnitude for q in d.reactions)
    assert (R1, R2) == pytest.approx((P * b / L, P * a / L), REL)
    assert M.max() == pytest.approx(P * a * b / L, REL)
    k = np.where(np.isclose(x, a))[0]
    assert v[k[0]] == pytest.approx(P * a * a * b * b / (3 * EI * L), REL)
    assert V[k[0]] - V[k[1]] == pytest.approx(P, REL)


def test_cantilever_uniform():
    """Table 3-23, cantilever beam — uniformly distributed load: R = wL, Mmax = wL²/2 at the
    fixed end, Δmax = wL⁴/(8EI) at the free end."""
    r = _run(L, [Support(Q_(0, "in"), "fixed")], [_udl()])
    d = r.cases[0]
    x, V, M, v = _arrays(d)
    assert d.reactions[0].force.to("lbf").magnitude == pytest.approx(w * L, REL)
    assert M.min() == pytest.approx(-w * L**2 / 2, REL)
    assert v[-1] == pytest.approx(w * L**4 / (8 * EI), REL)
    assert r.segments[0].kind == "cantilever"


def test_cantilever_point_at_free_end():
    """Table 3-23, cantilever beam — concentrated load at free end: R = V = P, Mmax = PL,
    Δmax = PL³/(3EI)."""
    r = _run(L, [Support(Q_(L, "in"), "fixed")], [_pt(0)])
    x, V, M, v = _arrays(r.cases[0])
    assert abs(M).max() == pytest.approx(P * L, REL)
    assert v[0] == pytest.approx(P * L**3 / (3 * EI), REL)
    assert abs(V).max() == pytest.approx(P, REL)


def test_overhang_one_support_uniform():
    """Table 3-23, beam overhanging one support — uniformly distributed load (span l, overhang a):
    R1 = w(l² − a²)/(2l), R2 = w(l + a)²/(2l), V2 = wa, V3 = w(l² + a²)/(2l),
    M1 = w(l + a)²(l − a)²/(8l²) at x = l/2·(1 − a²/l²), M2 = wa²/2."""
    l, a = 180.0, 60.0
    r = _run(l + a, [_pin(0), _pin(l)], [_udl()])
    d = r.cases[0]
    x, V, M, v = _arrays(d)
    R1, R2 = (q.force.to("lbf").magnitude for q in d.reactions)
    assert R1 == pytest.approx(w * (l * l - a * a) / (2 * l), REL)
    assert R2 == pytest.approx(w * (l + a) ** 2 / (2 * l), REL)
    k = np.where(np.isclose(x, l))[0]
    assert -V[k[0]] == pytest.approx(w * (l * l + a * a) / (2 * l), REL)
    assert V[k[1]] == pytest.approx(w * a, REL)
    assert M.max() == pytest.approx(w * (l + a) ** 2 * (l - a) ** 2 / (8 * l * l), 1e-4)
    assert M[k[0]] == pytest.approx(-w * a * a / 2, REL)
    assert [s.kind for s in r.segments] == ["span", "overhang"]


def test_two_equal_spans_uniform():
    """Table 3-23, continuous beam — two equal spans, uniform load on both spans:
    R1 = R3 = 3wl/8, R2 = 10wl/8, M at R2 = −wl²/8, max positive M = 9wl²/128 at 3l/8."""
    l = 120.0
    r = _run(2 * l, [_pin(0), _pin(l), _pin(2 * l)], [_udl()])
    d = r.cases[0]
    x, V, M, v = _arrays(d)
    R = [q.force.to("lbf").magnitude for q in d.reactions]
    assert R == pytest.approx([3 * w * l / 8, 10 * w * l / 8, 3 * w * l / 8], REL)
    assert M.min() == pytest.approx(-w * l * l / 8, REL)
    assert M.max() == pytest.approx(9 * w * l * l / 128, 1e-4)


def test_two_spans_live_load_worst_placement():
    """Table 3-23, continuous beam — two equal spans, uniform load on one span:
    R1 = 7wl/16, R2 = 5wl/8, R3 = −wl/16, Mmax = 49wl²/512 at x = 7l/16.
    Live load L placed for its worst effect (ASCE 7-22 §4.3.3) must reach it: at x = 7l/16 the
    influence line of M is positive on span 1 and negative on span 2."""
    l = 120.0
    r = analyse(
        Q_(2 * l, "in"),
        [_pin(0), _pin(l), _pin(2 * l)],
        [_udl("L", a=0, b=2 * l)],
        [Combination("L only", {"L": 1.0})],
        extra_x=Q_([7 * l / 16], "in"),
    )
    env = r.envelope
    x = env.x.magnitude
    k = int(np.argmin(abs(x - 7 * l / 16)))
    assert env.M_max.to("lbf*in").magnitude[k] == pytest.approx(49 * w * l * l / 512, REL)
    assert "L partial" in env.M_max_by[k]
    assert env.M_min.to("lbf*in").magnitude.min() == pytest.approx(-w * l * l / 8, REL)
    assert r.live_cases == ("L",)
    # the single-span pattern's reactions: superpose case results from the basis
    one = analyse(
        Q_(2 * l, "in"),
        [_pin(0), _pin(l), _pin(2 * l)],
        [_udl("X", a=0, b=l)],
        [Combination("X", {"X": 1.0})],
    ).cases[0]
    R = [q.force.to("lbf").magnitude for q in one.reactions]
    assert R == pytest.approx([7 * w * l / 16, 5 * w * l / 8, -w * l / 16], REL)


def test_linearly_varying_load():
    """Table 3-23, simple beam — load increasing uniformly to one end (total W): R1 = W/3,
    R2 = 2W/3, Mmax = 2WL/(9√3) at x = L/√3, Δmax = 0.01304·WL³/EI."""
    wmax = 4.0
    W = wmax * L / 2
    ld = Load(
        "D", "linear", Q_(0, "lbf/in"), start=Q_(0, "in"), end=Q_(L, "in"), magnitude_end=Q_(wmax, "lbf/in")
    )
    d = _run(L, [_pin(0), _pin(L)], [ld]).cases[0]
    x, V, M, v = _arrays(d)
    R1, R2 = (q.force.to("lbf").magnitude for q in d.reactions)
    assert (R1, R2) == pytest.approx((W / 3, 2 * W / 3), REL)
    assert M.max() == pytest.approx(2 * W * L / (9 * math.sqrt(3)), 1e-4)
    assert v.max() == pytest.approx(0.01304 * W * L**3 / EI, 1e-3)


def test_partial_uniform_load():
    """Table 3-23, simple beam — uniform load partially distributed (a, b, c along the span):
    R1 = wb(2c + b)/(2l), Mmax = R1(a + R1/(2w))."""
    a, b = 40.0, 100.0
    c = L - a - b
    d = _run(L, [_pin(0), _pin(L)], [_udl(a=a, b=a + b)]).cases[0]
    x, V, M, v = _arrays(d)
    R1 = w * b * (2 * c + b) / (2 * L)
    assert d.reactions[0].force.to("lbf").magnitude == pytest.approx(R1, REL)
    assert M.max() == pytest.approx(R1 * (a + R1 / (2 * w)), 1e-4)


def test_combination_is_linear_sum():
    """Superposition (mechanics of materials): a combination equals the factored sum of cases."""
    combo = Combination("c", {"D": 1.2, "L": 1.6})
    r = _run(L, [_pin(0), _pin(L)], [_udl("D"), _udl("L", 3.0)], [combo])
    c = r.combinations[0].M.magnitude
    assert c == pytest.approx(1.2 * r.cases[0].M.magnitude + 1.6 * r.cases[1].M.magnitude)
    assert c.max() == pytest.approx((1.2 * w + 1.6 * 3.0) * L * L / 8, REL)


def test_mechanism_is_refused():
    with pytest.raises(BeamInputError):
        _run(L, [_pin(0)], [_udl()])
    with pytest.raises(BeamInputError):
        _run(L, [_pin(0), _pin(L)], [_pt(L + 10)])


def test_self_weight():
    """Weight per length = Σ A·γ (statics). 2 in × 12 in at 36 pcf: 24 in² × 36 lbf/ft³
    = 6.0 plf."""
    sw = self_weight([(Q_(24, "in^2"), Q_(36, "pcf"))])
    assert sw.to("plf").magnitude == pytest.approx(6.0)
    two = self_weight([(Q_(24, "in^2"), Q_(36, "pcf")), (Q_(1, "in^2"), Q_(490, "pcf"))])
    assert two.to("plf").magnitude == pytest.approx(6.0 + 490 / 144)


def test_without_EI_no_deflection():
    r = _run(L, [_pin(0), _pin(L)], [_udl()], ei=None)
    assert r.cases[0].deflection is None
    assert r.deflection_max({"D": 1.0}, 0) is None
