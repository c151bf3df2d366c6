"""Cost of the worst-placement envelope (influence lines) against a plain analysis of the same
member with every load where it is written (one stiffness solve per case).

Prints, per member: the analysis CPU time (best of 3; run with OPENBLAS_NUM_THREADS=1) with variable cases placed for their worst effect, the time
with the same cases treated as fixed (``variable=()``), and their ratio. Target: the placed
analysis stays under 0.5 s per member and within 10 × the fixed analysis (common practice for an
interactive tool, no source).
"""

from __future__ import annotations

import time

from calcreport.model import Combination, Load, Support
from calcreport.solve.beam import analyse
from calcreport.units import Q_


def _member(spans: int, cart: bool):
    L = 168.0 * spans
    sup = [Support(Q_(168.0 * i, "in")) for i in range(spans + 1)]
    loads = [
        Load("D", "uniform", Q_(8.0, "lbf/in")),
        Load("L", "uniform", Q_(16.0, "lbf/in")),
        Load("S", "uniform", Q_(12.0, "lbf/in"), start=Q_(0.0, "in"), end=Q_(L * 0.7, "in")),
    ]
    if cart:
        loads += [
            Load("L", "point", Q_(600.0, "lbf"), moving=True, group="cart", offset=Q_(0.0, "in")),
            Load("L", "point", Q_(900.0, "lbf"), moving=True, group="cart", offset=Q_(36.0, "in")),
        ]
    combos = [
        Combination("D + L", {"D": 1.0, "L": 1.0}),
        Combination("D + 0.7S", {"D": 1.0, "S": 0.7}),
        Combination("D + 0.75L + 0.525S", {"D": 1.0, "L": 0.75, "S": 0.525}),
    ]
    return Q_(L, "in"), sup, loads, combos


def _time(fn, repeat: int = 3) -> float:
    best = float("inf")
    for _ in range(repeat):
        t0 = time.process_time()  # CPU time: the machine is shared, wall time is noisy
        fn()
        best = min(best, time.process_time() - t0)
    return best


EI_REF = Q_(1e9, "lbf*in**2")


def main() -> None:
    print(f"{'member':34s} {'placed':>9s} {'as written':>11s} {'ratio':>6s}   target")
    for spans, cart in ((1, False), (1, True), (2, True), (6, False), (6, True)):
        L, sup, loads, combos = _member(spans, cart)
        fixed_loads = [ld for ld in loads if not ld.moving]
        t_placed = _time(
            lambda L=L, sup=sup, loads=loads, combos=combos: analyse(L, sup, loads, combos, EI=EI_REF)
        )
        t_fixed = _time(
            lambda L=L, sup=sup, fl=fixed_loads, combos=combos: analyse(
                L, sup, fl, combos, EI=EI_REF, variable=()
            )
        )
        name = f"{spans} span(s){' + cart (2 loads)' if cart else ''}"
        print(f"{name:34s} {t_placed:8.3f}s {t_fixed:10.3f}s {t_placed / t_fixed:6.1f}   ≤ 0.5 s, ≤ 10 ×")


if __name__ == "__main__":
    main()
