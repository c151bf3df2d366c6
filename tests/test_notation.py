"""How values are written: trade feet-inches, mixed numbers, products and quotients, refusals.

Sources: feet-inches (16'-6") and mixed numbers (1-1/2 in) as drawings and lumber/fastener
sizes are written — common practice, no source. pint (a general-purpose units library, the
reference here) gives the value of every plain "number unit" string; 1 ft = 12 in exactly and
1 in = 25.4 mm exactly (the international yard and pound agreement of 1959, from memory).
"""

from __future__ import annotations

from fractions import Fraction

import pytest
from hypothesis import given
from hypothesis import strategies as st

from calcreport.jobfile.load import load_text
from calcreport.outputs.fmt import Display, feet_inches, fmt_number
from calcreport.units import Q_, UnitParseError, parse, parse_value
from tests.conftest import job_text
from tests.test_bad_input import GOOD

# -- accepted: trade notation, exact ---------------------------------------------------------

ACCEPTED_LENGTHS = [
    # text, inches exactly (Fraction)
    ("16'-6\"", Fraction(198)),
    ("16' 6\"", Fraction(198)),
    ("16'6\"", Fraction(198)),
    ("16'-6 1/2\"", Fraction(397, 2)),
    ("16'-6-1/2\"", Fraction(397, 2)),
    ("16 ft 6 in", Fraction(198)),
    ("16 ft-6 in", Fraction(198)),
    ("16 ft 6-1/2 in", Fraction(397, 2)),
    ("16 feet 6 inches", Fraction(198)),
    ("16′-6″", Fraction(198)),
    ("0'-3/4\"", Fraction(3, 4)),
    ("3'-0\"", Fraction(36)),
    ('6"', Fraction(6)),
    ("16'", Fraction(192)),
    ("1 1/2 in", Fraction(3, 2)),
    ("1-1/2 in", Fraction(3, 2)),
    ("15 3/4 in", Fraction(63, 4)),
    ("3/4 in", Fraction(3, 4)),
    ("15/32 in", Fraction(15, 32)),
    ("9.25 in", Fraction(37, 4)),
    ("4.2 m", Fraction(42000, 254)),
    ("4200 mm", Fraction(42000, 254)),
    ("1,219 mm", Fraction(12190, 254)),
]


@pytest.mark.parametrize(("text", "inches"), ACCEPTED_LENGTHS)
def test_trade_lengths_read_as_written(text, inches):
    q = parse(text, "length")
    assert q.to("inch").magnitude == pytest.approx(float(inches), rel=1e-15, abs=0)


def test_feet_inches_are_exact():
    # 16'-6 1/2" is 198.5 in exactly, held in inches with no round-off
    q = parse("16'-6 1/2\"", "length")
    assert str(q.units) == "inch" and q.magnitude == 198.5
    assert parse("16 ft 6-1/16 in", "length").magnitude == 198 + 1 / 16


def test_old_misreadings_are_gone():
    # the reports: the hyphen was a minus, a space a multiplication
    assert parse("16'-6\"", "length").to("inch").magnitude == 198.0  # was 186 (15'-6")
    assert parse("16 ft-6 in", "length").to("inch").magnitude == 198.0
    assert parse("10'-9\"", "length").to("inch").magnitude == 129.0  # was 9'-3"
    assert parse("1 1/2 in", "length").magnitude == 1.5  # was 0.5 in
    assert parse("15 3/4 in", "length").magnitude == 15.75  # was 11.25 in
    assert parse("16 ft 6 in", "length").to("inch").magnitude == 198.0  # was 96 ft·in


# -- refused: ambiguous forms -----------------------------------------------------------------

REFUSED = [
    ("16-6 ft", "hyphen between two numbers"),
    ("1 1/2", "needs its unit"),
    ("16 ft 6", "need their unit"),
    ("16' 6", "need their unit"),
    ("16 ft 6 lbf", "only inches may follow feet"),
    ("2 kip ft", "two units side by side"),
    ("1 m 20 cm", "two values side by side"),
    ("6 in 16 ft", "two values side by side"),
    ("-16'-6\"", "sign before feet-inches"),
    ("−1'-2\"", "sign before feet-inches"),
    ("-1 1/2 in", "sign before a mixed number"),
    ("16 ft - 6 in", "+ and - are not read"),
    ("16' -6\"", "+ and - are not read"),
    ("1 in + 2 in", "+ and - are not read"),
    ("16'-14\"", "below 12"),
    ("16.5'-6\"", "whole number"),
    ("1 3/2 in", "below 1"),
    ("1,5 mm", "thousands separator"),
    ("1,2345 mm", "thousands separator"),
    ("3 / 4 in", "fraction without spaces"),
    ("2^3 in", "power applies to a unit only"),
    ("2 in^2^2", "power of a power"),
    ("2 in^13", "from -12 to 12"),
    ("(2 in)", "brackets"),
    ("sqrt(4) in", "brackets"),
    ("__import__", "expected a number"),
    ("1/0 in", "division by zero"),
    ("2 kip / 0 ft", "division by zero"),
    ("nan in", "expected a number"),
    ("1e400 in", "out of range"),
    ("1e-320 in", "out of range"),  # subnormal
    ("2 in *", "followed by a number"),
    ("15 psf * -14 ft", "sign inside a product"),
]


@pytest.mark.parametrize(("text", "why"), REFUSED)
def test_ambiguous_forms_are_refused(text, why):
    with pytest.raises(UnitParseError) as exc:
        parse(text, None)
    msg = str(exc.value)
    assert why in msg and "\n" not in msg


def test_bare_and_non_finite_numbers_refused():
    for v in (float("nan"), float("inf"), 1e-310):
        with pytest.raises(UnitParseError):
            parse(v, None)
    with pytest.raises(UnitParseError, match="bare number"):
        parse(2.0, "length")


@pytest.mark.parametrize(
    ("key_line", "text", "words"),
    [
        ('width = "2 in"', "16-6 ft", ["member[M].part[web].width", "hyphen"]),
        ('width = "2 in"', "1 1/2", ["member[M].part[web].width", "needs its unit"]),
        ('width = "2 in"', "16 ft 6", ["member[M].part[web].width", "need their unit"]),
        ('width = "2 in"', "2 in 3 lbf", ["member[M].part[web].width", "two values side by side"]),
        ('width = "2 in"', "-1'-6\"", ["member[M].part[web].width", "sign before feet-inches"]),
        ('width = "2 in"', "15 psf * 14 ft", ["member[M].part[web].width", "which is a line load"]),
    ],
)
def test_refusals_reach_the_user_as_one_line(write_job, cli, key_line, text, words):
    value = text.replace('"', '\\"')
    path = write_job(job_text(GOOD.replace(key_line, f'width = "{value}"', 1)))
    code, out, err = cli("check", path)
    assert code == 2 and out == "" and "Traceback" not in err
    lines = err.strip().splitlines()
    assert len(lines) == 1 and lines[0].startswith(path + ":")
    for w in words:
        assert w in lines[0]


def test_reader_gets_the_trade_value():
    job = load_text(job_text(GOOD.replace('width = "2 in"', 'width = "1 1/2 in"', 1)).encode())
    web = job.members[0].parts[0]
    assert web.shape.bbox[2] - web.shape.bbox[0] == 1.5


# -- arithmetic: * and / between values only ------------------------------------------------------


def test_tributary_load_product():
    # 15 psf × 14 ft = 210 plf (arithmetic)
    w = parse_value("15 psf * 14 ft", "line_load")
    assert w.arithmetic and w.quantity.to("plf").magnitude == pytest.approx(210, rel=1e-15)
    assert parse("20 psf × 7 ft", "line_load").to("plf").magnitude == pytest.approx(140, rel=1e-15)
    assert parse("0.6 kPa * 0.6 m", "line_load").to("N/m").magnitude == pytest.approx(360, rel=1e-12)


def test_quotient_binds_each_unit_to_its_number():
    # 12 kip / 24 ft is 12 kip ÷ (24 ft) = 0.5 kip/ft (pint alone reads it as 0.5 kip·ft)
    assert parse("12 kip / 24 ft", "line_load").to("klf").magnitude == pytest.approx(0.5, rel=1e-15)
    assert parse("15 psf * 14 ft / 2", "line_load").to("plf").magnitude == pytest.approx(105, rel=1e-15)


def test_plain_values_are_not_arithmetic():
    for text in ("3.5 kN/m", "120 kip*ft", "16'-6\"", "1-1/2 in", "5.0e8 mm^4"):
        assert not parse_value(text, None).arithmetic, text


def test_product_dimension_checked_against_the_key():
    with pytest.raises(UnitParseError, match="which is a"):
        parse("15 psf * 14 ft * 2 ft", "line_load")


def test_expression_listed_in_the_job_as_written():
    body = GOOD.replace('shear = "1 kip"', 'shear = "0.5 kip * 2"', 1)
    job = load_text(job_text(body).encode())
    assert job.members[0].shear.to("kip").magnitude == pytest.approx(1.0)
    (w,) = job.written
    assert w.key == "member[M].shear" and w.text == "0.5 kip * 2" and w.line is not None


# -- every printed notation reads back -------------------------------------------------------------

SIXTEENTHS = st.integers(min_value=1, max_value=200 * 12 * 16)  # 1/16 in to 200 ft


@given(SIXTEENTHS)
def test_printed_feet_inches_read_back_exactly(k):
    inches = k / 16
    for text in (feet_inches(inches), Display("US").position(Q_(inches, "inch"))):
        assert parse(text, "length").to("inch").magnitude == inches, text


@given(SIXTEENTHS)
def test_printed_quantities_read_back_as_printed(k):
    q = Q_(k / 16, "inch")
    si = Display("SI")
    for text, sig in ((Display("US").quantity(q), 4), (si.quantity(q), 4), (si.quantity(q, 3), 3)):
        number, _ = text.rsplit(" ", 1)
        back = parse(text, "length")
        assert back.magnitude == float(number.replace(",", "")), text  # the number as printed
        assert back.to("inch").magnitude == pytest.approx(k / 16, rel=0.5 * 10 ** (1 - sig)), text
    text = si.position(q)  # 350 mm, 4.2 m
    assert parse(text, "length").magnitude == float(text.split()[0].replace(",", "")), text


def test_printed_powers_of_ten_read_back():
    assert parse(f"{fmt_number(381156269.0)} mm⁴", "inertia").magnitude == pytest.approx(381.2e6, rel=1e-15)


# -- the plain "number unit" path against pint's own parser ------------------------------------------

UNITS = [
    "in",
    "ft",
    "mm",
    "m",
    "kip",
    "lbf",
    "kN",
    "N",
    "psi",
    "ksi",
    "MPa",
    "GPa",
    "kPa",
    "plf",
    "klf",
    "psf",
    "pcf",
    "kN/m",
    "kip/in",
    "lbf/ft**2",
    "kN/m^3",
    "in^4",
    "mm**4",
    "kip*ft",
    "kN*m",
    "N/mm",
    "lbf/in",
    "inch",
    "feet",
]

NUMBERS = st.one_of(
    st.integers(min_value=0, max_value=10**9).map(str),
    st.decimals(min_value=0, max_value=10**7, allow_nan=False, allow_infinity=False, places=4).map(str),
    st.floats(min_value=1e-30, max_value=1e30, allow_nan=False, allow_infinity=False).map(repr),
    st.tuples(st.integers(1, 999), st.integers(-30, 30)).map(lambda t: f"{t[0]}.{t[0] % 7}e{t[1]}"),
)


@given(NUMBERS, st.sampled_from(UNITS), st.sampled_from([" ", "", "  "]), st.booleans())
def test_plain_values_identical_to_pint(number, unit, gap, negative):
    # pint's full expression parser is the reference for "number unit" strings
    text = ("-" if negative else "") + number + gap + unit
    if "e" in number and gap == "" and unit[0] in "eE":
        return
    ours = parse(text, None)
    ref = Q_(text)
    assert float(ours.magnitude) == float(ref.magnitude)
    assert ours.units == ref.units
    assert isinstance(ours.magnitude, float)


@given(NUMBERS, st.sampled_from(UNITS + ["in^12", "ft ** -1", "kip / in / in", "mm^-4"]), st.booleans())
def test_plain_fast_path_equals_the_full_grammar(number, unit, negative):
    # the fast path for "number unit" must read exactly as the grammar does
    from calcreport import notation
    from calcreport.units import _PLAIN, _unit

    text = ("−" if negative else "") + number + " " + unit
    assert _PLAIN.fullmatch(text)
    (term,) = notation.read(text).terms
    ours = parse(text, None)
    assert ours.magnitude == float(term.magnitude) and ours.units == _unit(term.unit)
