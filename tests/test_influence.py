"""Worst placement of variable (live-type) loads from influence lines, against closed forms.

Sources named beside each check:
* influence line of shear and moment of a simple span (any mechanics text, e.g. the Müller-Breslau
  principle): η_V(ξ) = −ξ/L left of the cut, 1 − ξ/L right of it; η_M(ξ) = ξ(L − x)/L or x(L − ξ)/L;
* AISC Steel Construction Manual, 15th ed., Table 3-23, case 44 "simple beam — two equal concentrated
  moving loads": M_max = P(2L − a)²/(8L) under one load at a/4 from midspan, for a ≤ 0.586L
  (from memory);
* AISC Table 3-23, "continuous beam — two equal spans — concentrated load at any point": the
  interior-support moment −Pab(l + a)/(4l²) for a load at a from the end support (from memory; the
  same result follows from the three-moment equation). The two-span checks integrate the influence
  line built from it with numpy's exact polynomial integration, independently of the code.
Match: 1e-9 relative (the ordinates come from a coarse stiffness model and statics; rounding only).
"""

import numpy as np
import pytest
from numpy.polynomial import Polynomial as Poly

from calcreport.model import Combination, Load, Support
from calcreport.solve.beam import analyse
from calcreport.units import Q_

REL = 1e-9
Lspan = 198.0  # in (16.5 ft)
w = 3.0  # lbf/in
P = 1200.0  # lbf


def _pin(x):
    return Support(Q_(x, "in"), "pin")


def _run(length, supports, loads, extra=None, combos=None):
    return analyse(
        Q_(length, "in"),
        supports,
        loads,
        combos or [Combination("L", {"L": 1.0})],
        EI=Q_(1.0e9, "lbf*in**2"),
        extra_x=None if extra is None else Q_(extra, "in"),
    )


def _env(r):
    e = r.envelope
    return (
        e.x.to("in").magnitude,
        e.V_max.to("lbf").magnitude,
        e.V_min.to("lbf").magnitude,
        e.M_max.to("lbf*in").magnitude,
        e.M_min.to("lbf*in").magnitude,
    )


def _close(got, want, scale):
    assert np.max(np.abs(got - want)) <= REL * scale


def _moving(p, offset=None, group="", between=None, case="L"):
    return Load(
        case,
        "point",
        Q_(p, "lbf"),
        moving=True,
        group=group,
        offset=None if offset is None else Q_(offset, "in"),
        between=None if between is None else (Q_(between[0], "in"), Q_(between[1], "in")),
    )


def test_simple_span_uniform_live_every_station():
    """Influence line of shear (any mechanics text): V_max(x) = w(L − x)²/(2L), V_min(x) = −wx²/(2L);
    M_max(x) = wx(L − x)/2, so M_max = wL²/8 at midspan."""
    r = _run(Lspan, [_pin(0), _pin(Lspan)], [Load("L", "uniform", Q_(w, "lbf/in"))])
    x, vmax, vmin, mmax, mmin = _env(r)
    _close(vmax, w * (Lspan - x) ** 2 / (2 * Lspan), w * Lspan / 2)
    _close(vmin, -w * x**2 / (2 * Lspan), w * Lspan / 2)
    _close(mmax, w * x * (Lspan - x) / 2, w * Lspan**2 / 8)
    assert mmax.max() == pytest.approx(w * Lspan**2 / 8, rel=REL)
    assert np.all(mmin > -REL * w * Lspan**2)
    k = int(np.argmin(abs(x - Lspan / 2)))
    assert "L partial" in r.envelope.V_max_by[k]  # only the right part loaded at midspan
    assert "partial" not in r.envelope.V_max_by[0]  # the whole span at the support


def test_simple_span_one_moving_point_load():
    """Influence line of shear of a simple span (any mechanics text): V_max(x) = P(L − x)/L with the
    load just right of x, V_min(x) = −Px/L; M_max(x) = Px(L − x)/L (load at x)."""
    r = _run(Lspan, [_pin(0), _pin(Lspan)], [_moving(P)])
    x, vmax, vmin, mmax, _ = _env(r)
    _close(vmax, P * (Lspan - x) / Lspan, P)
    _close(vmin, -P * x / Lspan, P)
    _close(mmax, P * x * (Lspan - x) / Lspan, P * Lspan / 4)
    assert "L moving" in r.envelope.V_abs_by[0]


@pytest.mark.parametrize("a", [24.0, 60.0, 0.586 * Lspan])
def test_two_equal_moving_loads_simple_span(a):
    """AISC Manual Table 3-23 case 44 (from memory): two equal moving loads P at spacing a,
    M_max = P(2L − a)²/(8L) under one load at a/4 from midspan, for a ≤ 0.586L."""
    xs = Lspan / 2 - a / 4
    r = _run(
        Lspan,
        [_pin(0), _pin(Lspan)],
        [_moving(P, 0.0, "cart"), _moving(P, a, "cart")],
        extra=[xs, Lspan - xs],
    )
    x, _, _, mmax, _ = _env(r)
    want = P * (2 * Lspan - a) ** 2 / (8 * Lspan)
    assert mmax.max() == pytest.approx(want, rel=REL)
    k = int(np.argmax(mmax))
    assert min(abs(x[k] - xs), abs(x[k] - (Lspan - xs))) < 1e-9 * Lspan
    # shear at the support: both loads on the span, the first at the support (statics)
    assert r.envelope.V_max.to("lbf").magnitude[0] == pytest.approx(P + P * (Lspan - a) / Lspan, rel=REL)


def test_moving_load_travel_range():
    """A moving load confined to [60, 120] in: at the left support V_max = P(L − 60)/L (statics)."""
    r = _run(Lspan, [_pin(0), _pin(Lspan)], [_moving(P, between=(60.0, 120.0))])
    assert r.envelope.V_max.to("lbf").magnitude[0] == pytest.approx(P * (Lspan - 60) / Lspan, rel=REL)


def _two_span_il_M(x, l):
    """Influence line of M(x), x in span 1 of two equal spans l, as polynomials in ξ on
    [0, x], [x, l] (span 1) and [l, 2l] (span 2): AISC Table 3-23 two equal spans, concentrated
    load at any point — support moment −Pab(l + a)/(4l²), by symmetry for span 2."""
    xi = Poly([0, 1])
    MB1 = -xi * (l - xi) * (l + xi) / (4 * l * l)  # load in span 1 at ξ
    left = xi * (l - x) / l + (x / l) * MB1  # ξ < x
    right = x * (l - xi) / l + (x / l) * MB1  # ξ > x
    xi2 = 2 * l - xi  # load in span 2: distance from the far end support
    MB2 = -xi2 * (l - xi2) * (l + xi2) / (4 * l * l)
    span2 = (x / l) * MB2
    return left, right, span2


def _pos_integral(poly, a, b):
    """∫ max(poly, 0) over [a, b], cutting at the real roots (numpy, exact polynomial integrals)."""
    cuts = sorted({a, b} | {float(t.real) for t in poly.roots() if abs(t.imag) < 1e-12 and a < t.real < b})
    F = poly.integ()
    total = 0.0
    for lo, hi in zip(cuts, cuts[1:]):
        if poly((lo + hi) / 2) > 0:
            total += F(hi) - F(lo)
    return total


@pytest.mark.parametrize("frac", [0.2, 7 / 16, 0.6, 0.85, 0.95])
def test_two_span_continuous_uniform_live_moment(frac):
    """Two equal spans, uniform live load w placed for the largest M(x) in span 1: the integral of
    w·max(η_M, 0), η_M from the AISC Table 3-23 support moment (see _two_span_il_M). For x < 0.8l
    this is span 1 alone loaded, M = 7wlx/16 − wx²/2; beyond, only part of span 1."""
    l = 120.0
    x0 = frac * l
    r = _run(2 * l, [_pin(0), _pin(l), _pin(2 * l)], [Load("L", "uniform", Q_(w, "lbf/in"))], extra=[x0])
    x, _, _, mmax, mmin = _env(r)
    k = int(np.argmin(abs(x - x0)))
    left, right, span2 = _two_span_il_M(x0, l)
    want = w * (_pos_integral(left, 0, x0) + _pos_integral(right, x0, l) + _pos_integral(span2, l, 2 * l))
    assert mmax[k] == pytest.approx(want, rel=REL)
    if frac < 0.8:
        assert want == pytest.approx(7 * w * l * x0 / 16 - w * x0**2 / 2, rel=1e-12)
    neg = w * (-_pos_integral(-left, 0, x0) - _pos_integral(-right, x0, l) - _pos_integral(-span2, l, 2 * l))
    assert mmin[k] == pytest.approx(neg, rel=REL, abs=REL * w * l * l)


def test_two_span_continuous_shear_and_reactions():
    """Two equal spans, uniform live w (AISC Table 3-23): largest end reaction 7wl/16 with span 1
    alone loaded; shear beside the centre support 5wl/8 with both loaded; largest centre reaction
    10wl/8 = 1.25wl."""
    l = 120.0
    r = _run(2 * l, [_pin(0), _pin(l), _pin(2 * l)], [Load("L", "uniform", Q_(w, "lbf/in"))])
    x, vmax, vmin, _, mmin = _env(r)
    assert vmax[0] == pytest.approx(7 * w * l / 16, rel=REL)
    assert vmin.min() == pytest.approx(-5 * w * l / 8, rel=REL)
    assert mmin.min() == pytest.approx(-w * l * l / 8, rel=REL)
    steps = {s.key: s for s in r.steps}
    assert steps["beam.case.L.R1"].result.to("lbf").magnitude == pytest.approx(7 * w * l / 16, rel=REL)
    assert steps["beam.case.L.R2"].result.to("lbf").magnitude == pytest.approx(1.25 * w * l, rel=REL)
    assert "§4.3.3" in steps["beam.placement.L"].source


def test_dead_load_stays_and_factors_apply():
    """Combination 1.2D + 1.6L (factors as given): the dead load is not placed, the live load is —
    V_max(x) = 1.2·w_D(L/2 − x) + 1.6·w_L(L − x)²/(2L) (superposition, simple span formulas)."""
    wd = 1.5
    r = _run(
        Lspan,
        [_pin(0), _pin(Lspan)],
        [Load("D", "uniform", Q_(wd, "lbf/in")), Load("L", "uniform", Q_(w, "lbf/in"))],
        combos=[Combination("U", {"D": 1.2, "L": 1.6})],
    )
    x, vmax, _, _, _ = _env(r)
    _close(vmax, 1.2 * wd * (Lspan / 2 - x) + 1.6 * w * (Lspan - x) ** 2 / (2 * Lspan), w * Lspan)


def test_deflection_from_worst_placement():
    """Deflection of a simple span under uniform live load: every influence ordinate of deflection
    is positive, so the worst placement is the full span, 5wL⁴/(384EI) (AISC Table 3-23, case 1)."""
    r = _run(Lspan, [_pin(0), _pin(Lspan)], [Load("L", "uniform", Q_(w, "lbf/in"))])
    d = r.deflection_max({"L": 1.0}, 0).to("in").magnitude
    assert d == pytest.approx(5 * w * Lspan**4 / (384 * 1.0e9), rel=1e-6)


def test_overhang_partial_live_negative_moment():
    """Simple span l with an overhang c, uniform live w: the support moment is −wc²/2 with the
    overhang alone loaded, and the largest span moment w l²/8 with the span alone loaded (statics:
    the overhang load only reduces span moments)."""
    l, c = 180.0, 48.0
    r = _run(l + c, [_pin(0), _pin(l)], [Load("L", "uniform", Q_(w, "lbf/in"))], extra=[l / 2])
    x, _, _, mmax, mmin = _env(r)
    assert mmin.min() == pytest.approx(-w * c * c / 2, rel=REL)
    k = int(np.argmin(abs(x - l / 2)))
    assert mmax[k] == pytest.approx(w * l * l / 8, rel=REL)


@pytest.mark.parametrize("variable", [(), ("D",)])
def test_point_loads_at_the_member_ends(variable):
    """Point loads exactly at the ends, as written (variable=()) and placed (D marked variable): on
    a simple span a load on a support goes straight into it (V(0+) gets nothing from it); at the free
    end of an overhang V = +P just inside the tip (statics, V positive when the part left of the cut
    is pushed up). Placed: each load on or off, V_max(0+) = P·90/180."""
    l, c = 180.0, 48.0
    loads = [
        Load("D", "point", Q_(P, "lbf"), at=Q_(0.0, "in")),
        Load("D", "point", Q_(P, "lbf"), at=Q_(l + c, "in")),
        Load("D", "point", Q_(P, "lbf"), at=Q_(90.0, "in")),
    ]
    r = analyse(
        Q_(l + c, "in"),
        [_pin(0), _pin(l)],
        loads,
        [Combination("D", {"D": 1.0})],
        variable=variable,
    )
    V = r.cases[0].V.to("lbf").magnitude
    env = r.envelope.V_max.to("lbf").magnitude
    # R1 from statics: P (on the support) + P·90/180 − P·48/180
    assert V[0] == pytest.approx(P * (90 - 48) / 180, rel=REL)
    assert V[-1] == pytest.approx(P, rel=REL)
    if variable:
        assert env[0] == pytest.approx(P * 90 / 180, rel=REL)
        assert env[-1] == pytest.approx(P, rel=REL)
