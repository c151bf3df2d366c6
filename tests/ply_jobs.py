"""Job texts of members of plies side by side, shared by the ply tests."""

from __future__ import annotations

MATERIALS = """
[job]
project = "Ply trial"

[settings]
units = "US"

[[material]]
id = "df2"
family = "wood"
E = "1600 ksi"
Emin = "580 ksi"
Fb = "900 psi"
Fv = "180 psi"
G = 0.50

[[material]]
id = "lvl"
family = "wood"
E = "2000 ksi"
Fb = "2600 psi"
Fv = "285 psi"
G = 0.50
CF = 1.0

[[material]]
id = "a36"
family = "steel"
E = "29000 ksi"
Fy = "36 ksi"
Fu = "58 ksi"
"""


def ply(pid: str, spec: str, material: str = "df2") -> str:
    return f'\n[[member.ply]]\nid = "{pid}"\nmaterial = "{material}"\n{spec}\n'


def load(case: str, w: str, enters: str, extra: str = "") -> str:
    return f'\n[[member.load]]\ncase = "{case}"\nkind = "uniform"\nw = "{w}"\nenters = "{enters}"\n{extra}\n'


def point(case: str, P: str, at: str, enters: str, extra: str = "") -> str:
    return f'\n[[member.load]]\ncase = "{case}"\nkind = "point"\nP = "{P}"\nat = "{at}"\nenters = "{enters}"\n{extra}\n'


NAILS = """
[member.ply_fastening]
rows = 2
{extra}

[member.ply_fastening.connector]
type = "nail"
size = "{size}"
"""

BOLTS = """
[member.ply_fastening]
rows = 2
through = true

[member.ply_fastening.connector]
type = "wood_bolt"
diameter = "1/2 in"
"""


def member(mid: str, span: str, plies: str, fastening: str, loads: str, design: str = "") -> str:
    return (
        MATERIALS
        + f'\n[[member]]\nid = "{mid}"\nspan = "{span}"\n'
        + plies
        + fastening
        + (f"\n[member.design]\n{design}\n" if design else "")
        + loads
    )


def two_ply_side(w: str = "300 plf", size: str = "10d common") -> str:
    return member(
        "H2",
        "8 ft",
        ply("a", 'size = "2x10"') + ply("b", 'size = "2x10"'),
        NAILS.format(size=size, extra=""),
        load("D", w, "left_face"),
        "continuous_bracing = true",
    )


def three_ply_side(w_d: str = "100 plf", w_l: str = "250 plf") -> str:
    return member(
        "H3",
        "10 ft",
        ply("p1", 'size = "2x12"') + ply("p2", 'size = "2x12"') + ply("p3", 'size = "2x12"'),
        NAILS.format(size="16d common", extra="staggered = true"),
        load("D", w_d, "left_face") + load("L", w_l, "left_face"),
        "continuous_bracing = true",
    )


def flitch(w_d: str = "200 plf", w_l: str = "500 plf", post: str = "") -> str:
    return member(
        "F1",
        "14 ft",
        ply("w1", 'size = "2x12"')
        + ply("pl", 'thickness = "1/2 in"\ndepth = "11 in"', "a36")
        + ply("w2", 'size = "2x12"'),
        BOLTS,
        load("D", w_d, "top") + load("L", w_l, "top") + post,
        "continuous_bracing = true",
    )
