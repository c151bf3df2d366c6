"""``calcreport seal`` and ``verify`` of sealed reports, with throw-away certificates (seal_helpers).

Signatures are PAdES baseline (ETSI EN 319 142-1) made by pyHanko; the tampering is done with
pypdf (a general-purpose PDF library) as an attacker would. No network: no timestamp authority is
named, and verify never fetches revocation data.
"""

from __future__ import annotations

import io
import json
import re

import pypdf
import pytest
from review_helpers import demo_text, edited, run, write
from seal_helpers import make_pki

ENGINEER = (
    'checked_by = "M. Lindqvist"',
    'checked_by = "M. Lindqvist"\nengineer = "R. Okafor, P.E."\nlicence = "PE-48213"\njurisdiction = "Test State"',
)


@pytest.fixture(scope="module")
def setup(tmp_path_factory):
    """A job naming its engineer of record, its report, and two throw-away PKIs."""
    d = tmp_path_factory.mktemp("seal")
    job = write(d / "job.toml", edited(demo_text(), ENGINEER))
    pdf = d / "job.pdf"
    code, _, _ = _run_plain(["build", job, "-o", str(pdf)])
    assert code in (0, 1)
    return {
        "job": job,
        "pdf": pdf.read_bytes(),
        "eng": make_pki(d / "eng", signer="Test Engineer", state="Cert State"),
        "chk": make_pki(d / "chk", signer="Test Checker", passphrase=b"checker-pass"),
    }


def _run_plain(argv):
    from calcreport.cli import main

    return main(argv), "", ""


def _seal(tmp_path, capsys, src: bytes, pki, name="sealed.pdf", *extra):
    inp = tmp_path / f"in-{name}"
    inp.write_bytes(src)
    out = tmp_path / name
    code, o, e = run(
        ["seal", str(inp), "--cert", str(pki.cert_pem), "--key", str(pki.key_pem), "-o", str(out), *extra],
        capsys,
    )
    assert code == 0, e
    return out, o


def _verify_json(capsys, pdf, job, *trust):
    args = ["verify", str(pdf), job, "--json"]
    for t in trust:
        args += ["--trust", str(t)]
    code, out, err = run(args, capsys)
    assert err == "", err
    return code, json.loads(out)


def _find(doc, check):
    return [f for f in doc["findings"] if f["check"] == check]


def test_unsigned_build_reserves_an_empty_seal_field_and_stays_reproducible(tmp_path, capsys, setup):
    again = tmp_path / "again.pdf"
    assert run(["build", setup["job"], "-o", str(again)], capsys)[0] in (0, 1)
    assert again.read_bytes() == setup["pdf"]  # byte-identical across rebuilds
    r = pypdf.PdfReader(io.BytesIO(setup["pdf"]))
    fields = r.get_fields()
    assert fields["engineer-seal"]["/FT"] == "/Sig" and "/V" not in fields["engineer-seal"]
    widget = [a.get_object() for a in r.pages[0]["/Annots"] if a.get_object().get("/FT") == "/Sig"][0]
    assert "/AP" not in widget  # no appearance: the box prints blank for a wet seal
    meta = r.metadata
    assert meta["/CalcreportEngineer"] == "R. Okafor, P.E." and meta["/CalcreportLicence"] == "PE-48213"


def test_seal_then_verify_ok(tmp_path, capsys, setup):
    out, said = _seal(tmp_path, capsys, setup["pdf"], setup["eng"])
    # the job's engineer of record wins over the certificate's names; the time is UTC
    assert "Digitally sealed by / R. Okafor, P.E. / Licence PE-48213 / Test State /" in said and "UTC" in said
    data = out.read_bytes()
    assert data.startswith(setup["pdf"])  # an incremental update: the report as built is untouched
    r = pypdf.PdfReader(io.BytesIO(data))
    sig = r.get_fields()["engineer-seal"]["/V"]
    assert sig["/SubFilter"] == "/ETSI.CAdES.detached"  # PAdES baseline
    widget = [a.get_object() for a in r.pages[0]["/Annots"] if a.get_object().get("/FT") == "/Sig"][0]
    ap = widget["/AP"]["/N"].get_object().get_data()
    ap = re.sub(rb"\\([0-7]{3})", lambda m: bytes([int(m.group(1), 8)]), ap)  # PDF octal escapes
    for line in (b"Digitally sealed by", b"R. Okafor, P.E.", b"Licence PE-48213", b"Test State"):
        assert b"(" + line + b") Tj" in ap  # the visible stamp (ISO 32000-1 §9.4.3 show-text operator)
    code, doc = _verify_json(capsys, out, setup["job"], setup["eng"].ca_pem)
    assert code == 0, doc["findings"]
    assert doc["exact"] and len(doc["signatures"]) == 1
    s = doc["signatures"][0]
    assert (
        s["field"] == "engineer-seal"
        and s["intact"]
        and s["valid"]
        and s["trusted"]
        and s["covers_whole_file"]
    )
    assert "Test Engineer" in s["signer"]


def test_certificate_names_are_used_when_the_job_gives_none(tmp_path, capsys, setup):
    plain = write(tmp_path / "plain.toml", demo_text())
    pdf = tmp_path / "plain.pdf"
    assert run(["build", plain, "-o", str(pdf)], capsys)[0] in (0, 1)
    _, said = _seal(tmp_path, capsys, pdf.read_bytes(), setup["eng"])
    assert "Digitally sealed by / Test Engineer / Cert State /" in said and "Licence" not in said


def test_a_name_the_stamp_cannot_show_exactly_is_refused(tmp_path, capsys, setup):
    plain = write(tmp_path / "plain.toml", demo_text())
    pdf = tmp_path / "plain.pdf"
    assert run(["build", plain, "-o", str(pdf)], capsys)[0] in (0, 1)
    before = pdf.read_bytes()
    pki = make_pki(tmp_path / "cjk", signer="王小明")
    code, out, err = run(["seal", str(pdf), "--cert", str(pki.cert_pem), "--key", str(pki.key_pem)], capsys)
    assert code == 2 and out == "" and "cannot show '王小明' exactly" in err and err.count("\n") == 1
    assert pdf.read_bytes() == before


def test_one_byte_changed_after_sealing_fails(tmp_path, capsys, setup):
    out, _ = _seal(tmp_path, capsys, setup["pdf"], setup["eng"])
    data = bytearray(out.read_bytes())
    i = data.index(b"/Title (") + 8  # a byte of the build's document information, inside the signed range
    data[i] ^= 0x20
    bad = tmp_path / "bad.pdf"
    bad.write_bytes(bytes(data))
    code, doc = _verify_json(capsys, bad, setup["job"], setup["eng"].ca_pem)
    assert code == 1
    assert _find(doc, "rebuild")[0]["status"] == "FAIL"
    seal = _find(doc, "seal 1")[0]
    assert seal["status"] == "FAIL" and "signed bytes were changed" in seal["text"]


def test_incremental_update_after_sealing_is_reported(tmp_path, capsys, setup):
    out, _ = _seal(tmp_path, capsys, setup["pdf"], setup["eng"])
    w = pypdf.PdfWriter(str(out), incremental=True)
    page = w.pages[0]
    c = page.get_contents()
    c.set_data(c.get_data() + b"\nq 1 g 300 400 60 12 re f Q\n")  # paint over a value on sheet 1
    page.replace_contents(c)
    buf = io.BytesIO()
    w.write(buf)
    upd = tmp_path / "updated.pdf"
    upd.write_bytes(buf.getvalue())
    code, doc = _verify_json(capsys, upd, setup["job"], setup["eng"].ca_pem)
    assert code == 1 and doc["sheets_differ"] == [1]
    u = _find(doc, "update 2")[0]
    assert u["status"] == "FAIL" and "after the last seal" in u["text"] and "content of sheet 1" in u["text"]
    assert "no seal covers it" in u["text"]
    cover = _find(doc, "seal 1 cover")[0]
    assert cover["status"] == "FAIL" and "does not cover" in cover["text"]
    assert _find(doc, "seal 1")[0]["status"] == "ok"  # the seal itself is still intact


def test_wrong_trust_root_is_reported(tmp_path, capsys, setup):
    out, _ = _seal(tmp_path, capsys, setup["pdf"], setup["eng"])
    code, doc = _verify_json(capsys, out, setup["job"], setup["chk"].ca_pem)
    assert code == 1
    chain = _find(doc, "seal 1 chain")[0]
    assert chain["status"] == "FAIL" and "does not chain to a trust root" in chain["text"]
    code, doc = _verify_json(capsys, out, setup["job"])  # no root at all: not checked, never OK
    assert code == 1 and "no trust root given" in _find(doc, "seal 1 chain")[0]["text"]


def test_sealed_twice_lists_both_signatures(tmp_path, capsys, setup, monkeypatch):
    first, _ = _seal(tmp_path, capsys, setup["pdf"], setup["eng"], "first.pdf")
    monkeypatch.setenv("CHECKER_PASS", "checker-pass")
    second = tmp_path / "second.pdf"
    code, said, err = run(
        [
            "seal",
            str(first),
            "--cert",
            str(setup["chk"].p12),
            "--passphrase-env",
            "CHECKER_PASS",
            "-o",
            str(second),
        ],
        capsys,
    )
    assert code == 0, err
    assert "new invisible field 'seal-2'" in said
    code, doc = _verify_json(capsys, second, setup["job"], setup["eng"].ca_pem, setup["chk"].ca_pem)
    assert code == 0, doc["findings"]
    sigs = doc["signatures"]
    assert [s["field"] for s in sigs] == ["engineer-seal", "seal-2"]
    assert "Test Engineer" in sigs[0]["signer"] and "Test Checker" in sigs[1]["signer"]
    assert not sigs[0]["covers_whole_file"] and sigs[1]["covers_whole_file"]
    assert _find(doc, "update 2")[0]["status"] == "ok"  # adds the second seal only


def test_in_place_seal_and_encrypted_pem_key(tmp_path, capsys, setup, monkeypatch):
    pki = make_pki(tmp_path / "pki", passphrase=b"s3cret")
    pdf = tmp_path / "inplace.pdf"
    pdf.write_bytes(setup["pdf"])
    base = ["seal", str(pdf), "--cert", str(pki.cert_pem), "--key", str(pki.key_pem)]
    code, out, err = run(base, capsys)  # no terminal, no variable: refused, one line
    assert code == 2 and out == "" and "encrypted" in err and err.count("\n") == 1
    code, _, err = run([*base, "--passphrase-env", "NOT_SET_ANYWHERE"], capsys)
    assert code == 2 and "NOT_SET_ANYWHERE is not set" in err
    monkeypatch.setenv("SEAL_PW", "wrong")
    code, _, err = run([*base, "--passphrase-env", "SEAL_PW"], capsys)
    assert code == 2 and "wrong passphrase" in err
    assert pdf.read_bytes() == setup["pdf"]  # nothing written on failure
    monkeypatch.setenv("SEAL_PW", "s3cret")
    code, _, err = run([*base, "--passphrase-env", "SEAL_PW"], capsys)
    assert code == 0, err
    assert pdf.read_bytes().startswith(setup["pdf"]) and len(pdf.read_bytes()) > len(setup["pdf"])
    with pytest.raises(SystemExit):  # a passphrase is never an argument
        run([*base, "--passphrase", "s3cret"], capsys)
    capsys.readouterr()


def test_seal_with_job_refuses_a_report_the_job_does_not_build(tmp_path, capsys, setup):
    data = bytearray(setup["pdf"])
    i = data.index(b"/Title (") + 8
    data[i] ^= 0x20
    inp = tmp_path / "tampered.pdf"
    inp.write_bytes(bytes(data))
    eng = setup["eng"]
    argv = ["seal", str(inp), "--cert", str(eng.cert_pem), "--key", str(eng.key_pem), "--job", setup["job"]]
    code, out, err = run(argv, capsys)
    assert code == 1 and "not sealed" in err and "FAIL" in out
    assert inp.read_bytes() == bytes(data)


def test_bad_credentials_are_one_line_errors(tmp_path, capsys, setup):
    pdf = tmp_path / "r.pdf"
    pdf.write_bytes(setup["pdf"])
    eng, chk = setup["eng"], setup["chk"]
    junk = write(tmp_path / "junk.pem", "not a certificate")
    for argv, expect in (
        (["--cert", junk, "--key", str(eng.key_pem)], "expected an X.509 certificate"),
        (["--cert", str(eng.cert_pem), "--key", junk], "expected a private key"),
        (["--cert", str(eng.cert_pem), "--key", str(chk.key_pem), "--passphrase-env", "X"], "not set"),
        (["--cert", str(tmp_path / "missing.pem"), "--key", str(eng.key_pem)], "cannot read"),
    ):
        code, out, err = run(["seal", str(pdf), *argv], capsys)
        assert code == 2 and out == "" and expect in err and err.count("\n") == 1, (argv, err)
    other = make_pki(tmp_path / "other")
    code, _, err = run(["seal", str(pdf), "--cert", str(eng.cert_pem), "--key", str(other.key_pem)], capsys)
    assert code == 2 and "does not belong to the certificate" in err
    assert pdf.read_bytes() == setup["pdf"]


def test_template_names_the_seal_field(tmp_path, capsys, setup):
    write(tmp_path / "ours.toml", '[seal]\nfield = "pe-stamp"\n')
    job = write(
        tmp_path / "job.toml", edited(demo_text(), ('units = "US"', 'units = "US"\ntemplate = "ours.toml"'))
    )
    pdf = tmp_path / "job.pdf"
    code, _, err = run(["build", job, "-o", str(pdf)], capsys)
    assert code in (0, 1), err
    assert list(pypdf.PdfReader(str(pdf)).get_fields()) == ["pe-stamp"]
    out, said = _seal(tmp_path, capsys, pdf.read_bytes(), setup["eng"])
    assert "field 'pe-stamp' in the seal box" in said
    write(tmp_path / "ours.toml", '[seal]\nfield = "pe.stamp"\n')
    code, out, err = run(["build", job, "-o", str(tmp_path / "bad.pdf")], capsys)
    assert code == 2 and "seal.field" in err and "no dots" in err and err.count("\n") == 1


def test_trust_given_for_an_unsealed_report_is_said_and_a_bad_trust_file_is_exit_2(tmp_path, capsys, setup):
    pdf = tmp_path / "r.pdf"
    pdf.write_bytes(setup["pdf"])
    code, doc = _verify_json(capsys, pdf, setup["job"], setup["eng"].ca_pem)
    assert code == 0 and "no digital seal" in _find(doc, "trust")[0]["text"]
    junk = write(tmp_path / "junk.pem", "not a certificate")
    code, out, err = run(["verify", str(pdf), setup["job"], "--trust", junk], capsys)
    assert code == 2 and out == "" and "junk.pem" in err and "X.509" in err and err.count("\n") == 1


def test_a_report_changed_after_its_build_is_not_sealed(tmp_path, capsys, setup):
    src = tmp_path / "src.pdf"
    src.write_bytes(setup["pdf"])
    w = pypdf.PdfWriter(str(src), incremental=True)
    w.add_metadata({"/Subject": "something else"})
    buf = io.BytesIO()
    w.write(buf)
    eng = setup["eng"]
    for name, data in (("upd.pdf", buf.getvalue()), ("junk.pdf", setup["pdf"] + b"trailing junk\n")):
        p = tmp_path / name
        p.write_bytes(data)
        code, out, err = run(["seal", str(p), "--cert", str(eng.cert_pem), "--key", str(eng.key_pem)], capsys)
        assert code == 2 and out == "" and err.count("\n") == 1, err
        assert ("changed after it was built" in err) if name == "upd.pdf" else ("appended" in err)
        assert p.read_bytes() == data
