"""NDS 2018 yield limit equations, bearing strengths and reduction terms.

Published values reproduced (ANSI/AWC NDS-2018; table values quoted from memory):
* Table 12N, common wire nails, sawn lumber side member, single shear;
* Table 12A, bolts, single shear, sawn lumber both members; Table 12F, bolts, double shear.
NDS tables use dowel bearing strengths rounded to 50 psi (Table 12.3.3: 4650 psi at G = 0.50 for
D < 1/4 in; 5600 / 3150 psi for a 1/2 in bolt) and print Z rounded (nails to 1 lb, bolts to 10 lb).
"""

import math

import pytest

from calcreport.solve.connectors import nds_yield as y
from calcreport.solve.connectors.nds_catalog import fyb_nail, nail


def z_min(*a, **k):
    return min(y.yield_modes(*a, **k), key=lambda m: m.Z)


# --- bearing strength equations (NDS-2018 Table 12.3.3 footnote 2) -------------------------


def test_fe_small_diameter_matches_rounded_table_values():
    # Table 12.3.3 lists 4650 psi for G = 0.50 (D < 1/4 in), rounded to 50 psi; tolerance 0.5 %.
    assert y.fe_small(0.50) == pytest.approx(4650, rel=0.005)


def test_fe_large_diameter():
    # Table 12.3.3: 1/2 in bolt, G = 0.50: Fe∥ = 5600 psi, Fe⊥ = 3150 psi (rounded); tolerance 0.5 %.
    assert y.fe_parallel(0.50) == pytest.approx(5600)
    assert y.fe_perpendicular(0.50, 0.5) == pytest.approx(3150, rel=0.005)


def test_hankinson_end_points_and_midpoint():
    # NDS-2018 Appendix J, Eq. J-2: θ = 0 gives Fe∥, θ = 90° gives Fe⊥; 45° the harmonic-type mean.
    assert y.hankinson(5600, 3150, 0) == pytest.approx(5600)
    assert y.hankinson(5600, 3150, 90) == pytest.approx(3150)
    assert y.hankinson(5600, 3150, 45) == pytest.approx(5600 * 3150 / (0.5 * 5600 + 0.5 * 3150))


def test_fe_steel_hot_rolled_and_cold_formed():
    # NDS-2018 §12.3.4 / Appendix I: 1.5·Fu (A36, Fu = 58 ksi → 87,000 psi), 1.375·Fu (from memory).
    assert y.fe_steel(58_000, 0.25)[0] == pytest.approx(87_000)
    assert y.fe_steel(45_000, 0.1)[0] == pytest.approx(61_875)


# --- reduction term (NDS-2018 Table 12.3.1B) -------------------------------------------------


def test_rd_values():
    assert y.rd("IV", 0.162, 0)[0] == 2.2  # KD = 2.2 for D ≤ 0.17 in
    assert y.rd("IV", 0.20, 0)[0] == pytest.approx(2.5)  # KD = 10D + 0.5
    assert y.rd("Im", 0.5, 0)[0] == 4.0
    assert y.rd("II", 0.5, 0)[0] == pytest.approx(3.6)
    assert y.rd("IIIs", 0.5, 90)[0] == pytest.approx(3.2 * 1.25)  # Kθ = 1.25 at 90°
    assert y.rd("Im", 0.5, 45)[0] == pytest.approx(4 * 1.125)
    assert y.rd("IV", 0.375, 90, reduced=True)[0] == pytest.approx((10 * 0.375 + 0.5) * 1.25)


# --- each mode equation against a hand evaluation (NDS-2018 Table 12.3.1A) -------------------


def test_single_shear_modes_by_hand():
    D, lm, ls, Fem, Fes, Fyb = 0.5, 3.5, 1.5, 5600.0, 3150.0, 45000.0
    Re, Rt = Fem / Fes, lm / ls
    modes = {m.mode: m for m in y.yield_modes(D, lm, ls, Fem, Fes, Fyb, theta_deg=90)}
    kt = 1.25
    assert modes["Im"].Z == pytest.approx(D * lm * Fem / (4 * kt))
    assert modes["Is"].Z == pytest.approx(D * ls * Fes / (4 * kt))
    k1 = (math.sqrt(Re + 2 * Re**2 * (1 + Rt + Rt**2) + Rt**2 * Re**3) - Re * (1 + Rt)) / (1 + Re)
    assert modes["II"].Z == pytest.approx(k1 * D * ls * Fes / (3.6 * kt))
    k2 = -1 + math.sqrt(2 * (1 + Re) + 2 * Fyb * (1 + 2 * Re) * D**2 / (3 * Fem * lm**2))
    assert modes["IIIm"].Z == pytest.approx(k2 * D * lm * Fem / ((1 + 2 * Re) * 3.2 * kt))
    k3 = -1 + math.sqrt(2 * (1 + Re) / Re + 2 * Fyb * (2 + Re) * D**2 / (3 * Fem * ls**2))
    assert modes["IIIs"].Z == pytest.approx(k3 * D * ls * Fem / ((2 + Re) * 3.2 * kt))
    assert modes["IV"].Z == pytest.approx(D**2 / (3.2 * kt) * math.sqrt(2 * Fem * Fyb / (3 * (1 + Re))))


def test_double_shear_modes_by_hand():
    D, lm, ls, Fe, Fyb = 0.5, 3.5, 1.5, 5600.0, 45000.0
    modes = {m.mode: m for m in y.yield_modes(D, lm, ls, Fe, Fe, Fyb, planes=2)}
    assert set(modes) == {"Im", "Is", "IIIs", "IV"}
    assert modes["Im"].Z == pytest.approx(D * lm * Fe / 4)
    assert modes["Is"].Z == pytest.approx(2 * D * ls * Fe / 4)
    k3 = -1 + math.sqrt(2 * 2 / 1 + 2 * Fyb * 3 * D**2 / (3 * Fe * ls**2))
    assert modes["IIIs"].Z == pytest.approx(2 * k3 * D * ls * Fe / (3 * 3.2))
    assert modes["IV"].Z == pytest.approx(2 * D**2 / 3.2 * math.sqrt(2 * Fe * Fyb / 6))


def test_k1_equal_members_is_sqrt2_minus_1():
    # With Re = Rt = 1, k1 = (√(1 + 2·3 + 1) − 2)/2 = √2 − 1 (algebra of Table 12.3.1A).
    assert y.k1(1.0, 1.0) == pytest.approx(math.sqrt(2) - 1)


# --- NDS-2018 Table 12N, common nails (from memory); Fe = 4650 psi at G = 0.50 as tabulated ---
# Rows: (nail, side thickness ts, G, Fe used by the table, Z in lb). Tolerance ±1 lb (table rounding).
TABLE_12N = [
    ("16d common", 1.5, 0.50, 4650, 141),
    ("10d common", 1.5, 0.50, 4650, 118),
    ("20d common", 1.5, 0.50, 4650, 170),
    ("16d common", 0.75, 0.50, 4650, 121),
    ("8d common", 0.75, 0.50, 4650, 90),
]


@pytest.mark.parametrize("size,ts,G,Fe,Z", TABLE_12N)
def test_table_12n_common_nails(size, ts, G, Fe, Z):
    n = nail(size)
    p = n.L - ts  # penetration into a main member at least as thick (table basis)
    got = z_min(n.D, p, ts, Fe, Fe, fyb_nail(n.D)).Z
    assert got == pytest.approx(Z, abs=1.0)
    # With the unrounded bearing equation the value moves by well under 1 %.
    got_eq = z_min(n.D, p, ts, y.fe_small(G), y.fe_small(G), fyb_nail(n.D)).Z
    assert got_eq == pytest.approx(Z, rel=0.01)


def test_16d_common_mode_iv_governs():
    n = nail("16d common")
    assert z_min(n.D, 2.0, 1.5, 4650, 4650, 90000).mode == "IV"


# --- NDS-2018 Table 12A, bolts, single shear, ts = tm = 1-1/2 in, G = 0.50 (from memory) --------
# Z∥ = 480, Zs⊥ = 300, Zm⊥ = 300, Z⊥ = 220 lb for a 1/2 in bolt; table rounds to 10 lb: ±5 lb.
def test_table_12a_half_inch_bolt_row():
    D, G = 0.5, 0.50
    par, perp = y.fe_parallel(G), y.fe_perpendicular(G, D)
    assert z_min(D, 1.5, 1.5, par, par, 45000, 0).Z == pytest.approx(480, abs=5)
    assert z_min(D, 1.5, 1.5, par, perp, 45000, 90).Z == pytest.approx(300, abs=5)  # Zs⊥
    assert z_min(D, 1.5, 1.5, perp, par, 45000, 90).Z == pytest.approx(300, abs=5)  # Zm⊥
    assert z_min(D, 1.5, 1.5, perp, perp, 45000, 90).Z == pytest.approx(220, abs=5)  # Z⊥


# NDS-2018 Table 12F, bolts, double shear, tm = 3-1/2 in, ts = 1-1/2 in, G = 0.50:
# Z∥ = 1230 lb for a 1/2 in bolt (from memory); ±5 lb.
def test_table_12f_half_inch_bolt_double_shear():
    Fe = y.fe_parallel(0.50)
    assert z_min(0.5, 3.5, 1.5, Fe, Fe, 45000, 0, planes=2).Z == pytest.approx(1230, abs=5)
