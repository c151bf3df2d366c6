"""Wording and numbers of the outputs (issue 15 item 7): trade units for every derived quantity,
round-off printed as 0 and never governing, spans and lengths along the member in feet-inches or
metres, and no "from memory" in any report.

References: 1 kip = 1,000 lbf and 1 kN·m² = 10⁹ N·mm² (NIST SP 811, 2008 ed., Appendix B.8 and
the SI prefixes of §4.3 — from memory); a simple span under gravity load has no negative moment and
V = wL/2, M = wL²/8 (AISC Steel Construction Manual 15th ed., Table 3-23, case 1 — from memory);
two equal spans under uniform load have M_support = −wl²/8 (same table, case 29 — from memory).
"""

from __future__ import annotations

import io
import re
from pathlib import Path

import numpy as np
import pytest

from calcreport.outputs.fmt import Display, kind_of
from calcreport.solve.tolerance import REL_TOL, difference, negligible, snap, snap_together
from calcreport.units import Q_, Quantity
from tests.conftest import TEE_PARTS, job_text

pypdf = pytest.importorskip("pypdf")

ROOT = Path(__file__).resolve().parent.parent
DEMOS = sorted((ROOT / "jobs").glob("*.toml"))

MEMBER = (
    """
[[member]]
id = "M"
span = "{span}"
{supports}
[[member.load]]
case = "D"
kind = "uniform"
w = "{w}"
"""
    + TEE_PARTS
)


def _job(span: str = "14 ft", w: str = "100 plf", supports: str = "", units: str = "US") -> str:
    text = job_text(MEMBER.format(span=span, w=w, supports=supports))
    return text.replace('units = "US"', f'units = "{units}"')


def _solve(text: str, write_job):
    from calcreport.pipeline import solve_file

    return solve_file(write_job(text))


def _report_text(result) -> str:
    from calcreport.outputs.report.build import render_pdf

    pdf = render_pdf(result)
    return "\n".join(p.extract_text() or "" for p in pypdf.PdfReader(io.BytesIO(pdf)).pages)


def squash(text: str) -> str:
    return re.sub(r"\s+", "", text)


# -- trade units ---------------------------------------------------------------------------------


def test_flexural_stiffness_in_kip_in2_and_kn_m2():
    """E·I: 29,000 ksi × 8,580 in⁴ = 248.82 × 10⁹ lbf·in² = 248.8 × 10⁶ kip·in² (1 kip = 1,000 lbf);
    12,400 MPa × 381.2 × 10⁶ mm⁴ = 4.727 × 10¹² N·mm² = 4,727 kN·m² (1 kN·m² = 10⁹ N·mm²)."""
    us = Q_(29_000, "ksi") * Q_(8_580, "inch**4")
    si = Q_(12_400, "MPa") * Q_(381.2e6, "mm**4")
    assert kind_of(us) == kind_of(si) == "flexural_stiffness"
    assert Display("US").quantity(us) == "248.8 × 10⁶ kip·in²"
    assert Display("SI").quantity(si) == "4,727 kN·m²"
    assert Display("US").json_value(us) == {"value": 248_820_000.0, "unit": "kip*in^2"}
    assert Display("SI").json_value(si) == {"value": 4726.88, "unit": "kN*m^2"}
    # a US job printing an SI-written EI, and the other way round, still in the job's trade unit
    assert Display("SI").quantity(us).endswith(" kN·m²")
    assert Display("US").quantity(si).endswith(" kip·in²")


@pytest.mark.parametrize(
    ("q", "us", "si"),
    [
        # no trade unit of its own: force·length³ (1 lbf = 4.448222 N, 1 in = 25.4 mm, NIST SP 811)
        (Q_(1.0, "lbf*inch**3"), "1.000 lbf·in³", "72,890 N·mm³"),
        (Q_(180_000.0, "lbf/inch**2.5"), "180,000 lbf/in²·⁵", "246.2 N/mm²·⁵"),  # NDS §11.3.6 γ = c·D^1.5
        (Q_(1.0, "inch**6"), "1.000 in⁶", "268.5 × 10⁶ mm⁶"),  # warping constant, 25.4⁶ = 268,535,866
    ],
)
def test_other_derived_kinds_have_trade_units(q, us, si):
    assert Display("US").quantity(q) == us
    assert Display("SI").quantity(q) == si
    for d in (Display("US"), Display("SI")):
        text = d.quantity(q)
        assert "kg" not in text and "s²" not in text and "/s" not in text


def test_plot_arrays_convert_once_as_each_element_would():
    d = Display("SI")
    arr = Q_(np.array([0.0, 1200.0, -3400.5]), "lbf*inch")
    values, unit = d.convert_array(arr)
    assert unit == "kN·m"
    assert values == [d.convert(v)[0] for v in arr]


@pytest.mark.parametrize("job", DEMOS, ids=lambda p: p.stem)
def test_every_step_of_every_demo_prints_in_trade_units(job):
    from calcreport.pipeline import solve_file

    result = solve_file(str(job))
    d = Display(result.job.settings.units)
    for m in result.members:
        for s in m.steps:
            for v in [*s.values.values(), s.result]:
                if isinstance(v, Quantity):
                    text = d.value(v)
                    # base SI never; a mass density in kg/m³ is the trade unit (EN 338 ρ_k, ρ_mean)
                    assert not re.search(r"kg(?!/m³)|s²|s⁻|/s\b", text), (s.key, text)


# -- round-off is 0 and never governs -----------------------------------------------------------


def test_relative_tolerance():
    assert negligible(1e-12, 10.0) and negligible(0.0, 0.0)
    assert not negligible(1e-6, 10.0)
    assert not negligible(1e-12, 0.0)  # nothing around it to be noise of
    hi, lo = snap_together(np.array([0.0, 5.0e4, 1e-11]), np.array([-2e-11, 0.0, -3.0]))
    assert hi.tolist() == [0.0, 5.0e4, 0.0] and lo.tolist() == [0.0, 0.0, -3.0]
    assert snap(np.array([1.0, 1e-10 * REL_TOL])).tolist() == [1.0, 0.0]
    assert difference(12.0, 12.0 - 1.8e-15) == 0.0 and difference(12.0, 11.0) == 1.0


def test_simple_span_has_no_negative_moment_that_governs(write_job):
    """Simple span, uniform gravity load: M ≥ 0 everywhere, M_max = wL²/8 (AISC Table 3-23)."""
    r = _solve(_job(), write_job)
    m = r.members[0]
    env = m.beam.analysis.envelope
    assert np.all(env.M_min.to("lbf*inch").magnitude >= 0.0)
    keys = {s.key.rsplit(".", 1)[-1] for s in m.steps if "envelope" in s.key}
    assert "M_neg" not in keys and "M_pos" in keys
    M_pos = next(s for s in m.steps if s.key.endswith("envelope.M_pos"))
    assert M_pos.result.to("lbf*ft").magnitude == pytest.approx(100.0 * 14**2 / 8, rel=1e-6)
    for s in m.steps:  # no step that governs is round-off
        if s.governs and isinstance(s.result, Quantity):
            assert float(abs(s.result.magnitude)) > 1e-6, s.key


def test_two_spans_keep_their_real_negative_moment(write_job):
    """Two equal 14 ft spans: M_support = −wl²/8 (AISC Table 3-23, case 29) is a real value."""
    sup = "".join(f'\n[[member.support]]\nat = "{x} ft"\n' for x in (0, 14, 28))
    r = _solve(_job(span="28 ft", supports=sup), write_job)
    m = r.members[0]
    neg = next(s for s in m.steps if s.key.endswith("envelope.M_neg"))
    assert neg.governs
    assert neg.result.to("lbf*ft").magnitude == pytest.approx(-100.0 * 14**2 / 8, rel=1e-3)


def test_parallel_axis_distance_on_the_neutral_axis_is_exactly_zero():
    """The door header's webs are centred on the neutral axis of a symmetric box: d = 0."""
    from calcreport.pipeline import solve_file

    r = solve_file(str(ROOT / "jobs" / "boathouse-door-header.toml"))
    for s in r.members[0].steps:
        if s.key.endswith(".I") and ".part.web" in s.key:
            assert s.values["d"].magnitude == 0.0


# -- lengths along the member -------------------------------------------------------------------


def test_spans_print_in_feet_and_inches(write_job):
    r = _solve(_job(span="14 ft"), write_job)
    flat = squash(_report_text(r))
    assert squash("Span 14'-0\"") in flat and "168.0in" not in flat
    assert re.search(r"=14'-0\"/\d{3}", flat)  # the deflection limit's span: ℓ / ratio


def test_two_spans_of_14_ft_print_as_28_ft(write_job):
    sup = "".join(f'\n[[member.support]]\nat = "{x} ft"\n' for x in (0, 14, 28))
    flat = squash(_report_text(_solve(_job(span="28 ft", supports=sup), write_job)))
    assert squash("Span 28'-0\"") in flat and "336.0in" not in flat
    assert squash("Support 2 (pin)") in flat and squash("= 14'-0\"") in flat


def test_si_spans_print_in_metres(write_job):
    flat = squash(_report_text(_solve(_job(span="4.2 m", w="1.5 kN/m", units="SI"), write_job)))
    assert squash("Span 4.200 m") in flat and "4,200mm" not in flat


# -- every demo report --------------------------------------------------------------------------


@pytest.fixture(scope="module")
def demo_texts() -> dict[str, str]:
    from calcreport.pipeline import solve_file

    return {job.stem: _report_text(solve_file(str(job))) for job in DEMOS}


def test_no_report_says_from_memory(demo_texts):
    """Reports cite the clause; how a value was checked belongs in docs/sources.md."""
    for name, text in demo_texts.items():
        assert "memory" not in text.lower(), name


def test_no_report_prints_base_si_or_round_off(demo_texts):
    for name, text in demo_texts.items():
        assert not re.search(r"kg·m|m³/s²|/s²", text), name
        assert not re.search(r"× 10⁻(9|1\d)", text), name  # round-off printed as a number
