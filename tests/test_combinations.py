"""Load combinations against ASCE 7-22 (Minimum Design Loads and Associated Criteria for
Buildings and Other Structures), §2.3.1 basic combinations for strength design and §2.4.1 basic
combinations for allowable stress design (factors as printed there; combinations with E omitted)."""

import pytest

from calcreport.solve.combinations import span_patterns, standard_combinations

ALL = {"D", "L", "Lr", "S", "R", "W"}


def _factor_sets(method, cases=ALL):
    return {tuple(sorted(c.factors.items())) for c in standard_combinations(method, cases)}


def _fs(**k):
    return tuple(sorted(k.items()))


def test_lrfd_factors():
    """ASCE 7-22 §2.3.1: 1. 1.4D; 2. 1.2D + 1.6L + 0.5(Lr or S or R);
    3. 1.2D + 1.6(Lr or S or R) + (L or 0.5W); 4. 1.2D + 1.0W + L + 0.5(Lr or S or R);
    5. 0.9D + 1.0W."""
    got = _factor_sets("LRFD")
    want = {_fs(D=1.4)}
    for r in ("Lr", "S", "R"):
        want.add(_fs(D=1.2, L=1.6, **{r: 0.5}))
        want.add(_fs(D=1.2, L=1.0, **{r: 1.6}))
        want.add(_fs(D=1.2, W=0.5, **{r: 1.6}))
        want.add(_fs(D=1.2, W=1.0, L=1.0, **{r: 0.5}))
    want.add(_fs(D=0.9, W=1.0))
    assert got == want
    assert len(standard_combinations("LRFD", ALL)) == 14


def test_asd_factors():
    """ASCE 7-22 §2.4.1: 1. D; 2. D + L; 3. D + (Lr or S or R); 4. D + 0.75L + 0.75(Lr or S or R);
    5. D + 0.6W; 6. D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R); 7. 0.6D + 0.6W."""
    got = _factor_sets("ASD")
    want = {_fs(D=1.0), _fs(D=1.0, L=1.0), _fs(D=1.0, W=0.6), _fs(D=0.6, W=0.6)}
    for r in ("Lr", "S", "R"):
        want.add(_fs(D=1.0, **{r: 1.0}))
        want.add(_fs(D=1.0, L=0.75, **{r: 0.75}))
        want.add(_fs(D=1.0, L=0.75, W=0.75 * 0.6, **{r: 0.75}))
    assert {tuple((c, round(f, 12)) for c, f in s) for s in got} == {
        tuple((c, round(f, 12)) for c, f in s) for s in want
    }


def test_only_present_cases():
    """Combinations whose leading case is absent are dropped, absent companions omitted
    (ASCE 7-22 §2.3.1 / §2.4.1 applied to the cases of the job)."""
    lr = standard_combinations("LRFD", {"D", "L"})
    assert {tuple(sorted(c.factors.items())) for c in lr} == {_fs(D=1.4), _fs(D=1.2, L=1.6)}
    asd = standard_combinations("ASD", {"D", "S"})
    assert {tuple(sorted(c.factors.items())) for c in asd} == {_fs(D=1.0), _fs(D=1.0, S=1.0)}
    assert all(c.source.startswith("ASCE 7-22 §2.4.1") for c in asd)
    assert standard_combinations("ASD", {"C"}) == []


def test_names_unique_and_cite_equation():
    combos = standard_combinations("LRFD", ALL)
    assert len({c.name for c in combos}) == len(combos)
    assert all("combination" in c.source for c in combos)


@pytest.mark.parametrize("n,count", [(1, 1), (2, 3), (3, 7), (6, 63)])
def test_full_patterns(n, count):
    """All non-empty subsets of segments up to the documented cap (2^n − 1)."""
    pats = span_patterns(n)
    assert len(pats) == count and pats[0].loaded == tuple(range(n))


def test_reduced_patterns_beyond_cap():
    """Beyond the cap: all, each alone, alternates, adjacent pairs with alternates beyond
    (common practice, no source)."""
    pats = {p.loaded for p in span_patterns(8)}
    assert (0, 2, 4, 6) in pats and (1, 3, 5, 7) in pats
    assert (0, 2, 3, 5, 7) in pats  # segments 3-4 loaded, alternates beyond on both sides
    assert (1, 2, 4, 6) in pats and (3,) in pats
