"""Load combinations against ASCE 7 (Minimum Design Loads and Associated Criteria for Buildings
and Other Structures), editions 7-16 and 7-22: §2.3.1 basic combinations for strength design and
§2.4.1 basic combinations for allowable stress design (combinations with E omitted).

Where the lists come from:
* ASCE 7-16 §2.3.1 eqs 1-5 and §2.4.1 eqs 1-7: from memory (long-standing lists, unchanged
  since 7-10 apart from wind at strength level).
* ASCE 7-22 §2.4.1 eqs 3, 4 and 6 with 0.7S: STRUCTURE magazine, "ASCE 7-22 Flat Roof Snow Load
  versus Minimum Snow Load" (quotes D + (Lr or 0.7S or R); D + 0.75L + 0.75(Lr or 0.7S or R);
  D + 0.75L + 0.75(0.6W) + 0.75(Lr or 0.7S or R)).
* ASCE 7-22 §2.3.1: snow at strength level with load factor 1.0 — STRUCTURE magazine, "Ground Snow
  Loads for ASCE 7-22" (φRn = 1.2D + 1.0S); the companion factor 0.3S in eqs 2 and 4 (in place of
  0.5S) is from memory.
"""

import pytest

from calcreport.solve.combinations import standard_combinations

ALL = {"D", "L", "Lr", "S", "R", "W"}


def _factor_sets(method, cases=ALL, standard="ASCE 7-22"):
    return {
        tuple((c, round(f, 12)) for c, f in sorted(c.factors.items()))
        for c in standard_combinations(method, cases, standard)
    }


def _fs(**k):
    return tuple((c, round(f, 12)) for c, f in sorted(k.items()))


def _lrfd_want(snow, snow_companion):
    """§2.3.1: 1. 1.4D; 2. 1.2D + 1.6L + 0.5(Lr or R) / companion S;
    3. 1.2D + 1.6(Lr or R) / snow S, + (L or 0.5W); 4. 1.2D + 1.0W + L + 0.5(Lr or R) / companion S;
    5. 0.9D + 1.0W."""
    want = {_fs(D=1.4), _fs(D=0.9, W=1.0)}
    for r, lead, comp in (("Lr", 1.6, 0.5), ("R", 1.6, 0.5), ("S", snow, snow_companion)):
        want.add(_fs(D=1.2, L=1.6, **{r: comp}))
        want.add(_fs(D=1.2, L=1.0, **{r: lead}))
        want.add(_fs(D=1.2, W=0.5, **{r: lead}))
        want.add(_fs(D=1.2, W=1.0, L=1.0, **{r: comp}))
    return want


def _asd_want(snow):
    """§2.4.1: 1. D; 2. D + L; 3. D + (Lr or S·k or R); 4. D + 0.75L + 0.75(Lr or S·k or R);
    5. D + 0.6W; 6. D + 0.75L + 0.75(0.6W) + 0.75(Lr or S·k or R); 7. 0.6D + 0.6W."""
    want = {_fs(D=1.0), _fs(D=1.0, L=1.0), _fs(D=1.0, W=0.6), _fs(D=0.6, W=0.6)}
    for r, k in (("Lr", 1.0), ("S", snow), ("R", 1.0)):
        want.add(_fs(D=1.0, **{r: k}))
        want.add(_fs(D=1.0, L=0.75, **{r: 0.75 * k}))
        want.add(_fs(D=1.0, L=0.75, W=0.75 * 0.6, **{r: 0.75 * k}))
    return want


def test_lrfd_asce7_16():
    """ASCE 7-16 §2.3.1 eqs 1-5: 1.6S leading, 0.5S companion."""
    assert _factor_sets("LRFD", standard="ASCE 7-16") == _lrfd_want(1.6, 0.5)
    assert len(standard_combinations("LRFD", ALL, "ASCE 7-16")) == 14


def test_lrfd_asce7_22():
    """ASCE 7-22 §2.3.1 eqs 1-5: strength-level snow, 1.0S leading, 0.3S companion."""
    assert _factor_sets("LRFD") == _lrfd_want(1.0, 0.3)
    names = [c.name for c in standard_combinations("LRFD", {"D", "S"})]
    assert names == ["LRFD 1: 1.4D", "LRFD 3: 1.2D + S"]


def test_asd_asce7_16():
    """ASCE 7-16 §2.4.1 eqs 1-7: S with factor 1.0 (0.75 in eqs 4 and 6)."""
    assert _factor_sets("ASD", standard="ASCE 7-16") == _asd_want(1.0)


def test_asd_asce7_22():
    """ASCE 7-22 §2.4.1 eqs 1-7: 0.7S (0.75 × 0.7S = 0.525S in eqs 4 and 6)."""
    assert _factor_sets("ASD") == _asd_want(0.7)
    names = [c.name for c in standard_combinations("ASD", {"D", "L", "S"})]
    assert "ASD 3: D + 0.7S" in names and "ASD 4: D + 0.75L + 0.525S" in names


def test_edition_cited():
    for std in ("ASCE 7-16", "ASCE 7-22"):
        for c in standard_combinations("LRFD", ALL, std):
            assert c.source.startswith(f"{std} §2.3.1") and "combination" in c.source
        for c in standard_combinations("ASD", ALL, std):
            assert c.source.startswith(f"{std} §2.4.1")
    with pytest.raises(ValueError):
        standard_combinations("ASD", ALL, "ASCE 7-10")


def test_only_present_cases():
    """Combinations whose leading case is absent are dropped, absent companions omitted
    (ASCE 7-22 §2.3.1 / §2.4.1 applied to the cases of the job)."""
    lr = standard_combinations("LRFD", {"D", "L"})
    assert {tuple(sorted(c.factors.items())) for c in lr} == {_fs(D=1.4), _fs(D=1.2, L=1.6)}
    asd = standard_combinations("ASD", {"D", "S"})
    assert {tuple(sorted(c.factors.items())) for c in asd} == {_fs(D=1.0), _fs(D=1.0, S=0.7)}
    assert all(c.source.startswith("ASCE 7-22 §2.4.1") for c in asd)
    assert standard_combinations("ASD", {"C"}) == []


def test_names_unique_and_cite_equation():
    combos = standard_combinations("LRFD", ALL)
    assert len({c.name for c in combos}) == len(combos)
    assert all("combination" in c.source for c in combos)
