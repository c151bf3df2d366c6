"""Digital seals and later updates of a report PDF (the second half of ``calcreport verify``).

For each signature pyHanko (``validate_pdf_signature``) checks the CMS signature over its byte
range (integrity), the signer's certificate chain against the trust roots the user gives with
``--trust`` — and no others: no operating-system store, no network, so revocation is not checked —
and how much of the file the signature covers. Each revision after the build must be the signing
revision of a seal and change nothing but that signature (pyHanko's difference policy between
the revision and the one before it); every other update, and any data appended after the last
``%%EOF``, is reported with what it changes and that no seal covers it.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from .pdf_revisions import FileRevisions, describe

if TYPE_CHECKING:
    from .verify_pdf import Proof

__all__ = ["check_seals", "load_trust_roots"]

OK, FAIL, NOTE = "ok", "FAIL", "note"


def load_trust_roots(paths: tuple[str, ...]) -> list:
    """asn1crypto certificates from PEM or DER files; JobError names a file that is not one."""
    from asn1crypto import pem, x509

    from ..errors import JobError
    from ..safeio import read_input

    roots = []
    for p in paths:
        data = read_input(p, 1_000_000, "a trust root certificate")
        try:
            blobs = [der for _, _, der in pem.unarmor(data, multiple=True)] if pem.detect(data) else [data]
            for der in blobs:
                cert = x509.Certificate.load(der)
                _ = cert.native  # parse now: a bad file fails here, not inside the validator
                roots.append(cert)
        except Exception:
            raise JobError(p, "", "expected an X.509 certificate in PEM or DER form (--trust)") from None
        if not blobs:
            raise JobError(p, "", "no certificate in the file (--trust)")
    return roots


def _name(cert) -> str:
    try:
        return cert.subject.human_friendly
    except Exception:
        return "?"


def _cn(cert) -> str:
    try:
        return str(cert.subject.native.get("common_name", "")) or _name(cert)
    except Exception:
        return "?"


def check_seals(
    proof: Proof, data: bytes, revs: FileRevisions, build_len: int | None, trust: tuple[str, ...]
) -> None:
    """Add findings for every revision after the build, every signature and any appended data."""
    reader = revs.reader
    if revs.trailing:
        proof.add(
            FAIL,
            "appended",
            f"{revs.trailing:,} bytes after the last %%EOF are no part of the report or of any update "
            "(data appended to the file)",
        )
    if reader is None or not revs.revisions:
        return
    if build_len is not None and revs.revisions[0].end != build_len:
        proof.add(
            FAIL,
            "structure",
            f"the file's first revision ends at byte {revs.revisions[0].end:,}, the rebuilt report at {build_len:,}",
        )
    fields = _sig_fields(reader)
    sigs = []
    try:
        sigs = list(reader.embedded_signatures)
    except Exception as exc:
        proof.add(FAIL, "seal", f"the signatures cannot be read ({type(exc).__name__})")
    by_rev: dict[int, list] = {}
    for s in sigs:
        by_rev.setdefault(s.signed_revision, []).append(s)
    for name in fields:
        if not any(s.field_name == name for s in sigs):
            proof.add(
                NOTE,
                "seal field",
                f"{name!r} is empty: no digital seal in it (it prints blank for a wet seal)",
            )
    roots = load_trust_roots(trust)
    if trust and not sigs:
        proof.add(NOTE, "trust", "--trust was given, but the report carries no digital seal to check")
    last_seal_rev = max(by_rev, default=0)
    for r in revs.revisions[1:]:
        if r.number in by_rev:
            _check_signing_revision(proof, reader, r, by_rev[r.number])
        else:
            where = "after the last seal" if r.number > last_seal_rev and sigs else "after the build"
            if last_seal_rev and r.number < last_seal_rev:
                where = "between seals"
            proof.add(
                FAIL,
                f"update {r.number}",
                f"an incremental update {where} (bytes {r.start:,}–{r.end:,}) {describe(r)}; "
                + ("no seal covers it" if r.number > last_seal_rev else "it is not a seal"),
            )
    for i, s in enumerate(sorted(sigs, key=lambda s: s.signed_revision), 1):
        _check_signature(proof, i, s, roots, revs, by_rev)


def _sig_fields(reader) -> list[str]:
    try:
        from pyhanko.sign.fields import enumerate_sig_fields

        return [name for name, _value, _ref in enumerate_sig_fields(reader)]
    except Exception:
        return []


def _check_signing_revision(proof: Proof, reader, r, sigs) -> None:
    """The revision that adds a seal may change nothing else (pyHanko's difference policy)."""
    from pyhanko.sign.diff_analysis import DEFAULT_DIFF_POLICY, ModificationLevel, SuspiciousModification

    label = f"update {r.number}"
    names = ", ".join(repr(s.field_name) for s in sigs)
    try:
        res = DEFAULT_DIFF_POLICY.apply(
            reader.get_historical_resolver(r.number - 1),
            reader.get_historical_resolver(r.number),
            field_mdp_spec=None,
            doc_mdp=None,
        )
        level = res.modification_level
        bad = level.value > ModificationLevel.FORM_FILLING.value
        extra = set(res.changed_form_fields) - {s.field_name for s in sigs}
    except SuspiciousModification as exc:
        bad, extra, level = True, set(), None
        proof.add(FAIL, label, f"the revision that adds the seal in {names} also changes the report ({exc})")
        return
    except Exception as exc:
        proof.add(FAIL, label, f"the seal's revision cannot be analysed ({type(exc).__name__})")
        return
    if bad or extra:
        proof.add(
            FAIL,
            label,
            f"the revision that adds the seal in {names} also changes the report ({describe(r)}"
            + (f"; fields {', '.join(sorted(extra))}" if extra else "")
            + ")",
        )
    else:
        proof.add(OK, label, f"adds the seal in {names} and changes nothing else of the report")


def _check_signature(proof: Proof, i: int, s, roots: list, revs: FileRevisions, by_rev: dict) -> None:
    from pyhanko.sign.validation import validate_pdf_signature
    from pyhanko.sign.validation.status import SignatureCoverageLevel
    from pyhanko_certvalidator import ValidationContext

    label = f"seal {i}"
    cert = s.signer_cert
    when = s.self_reported_timestamp
    when_text = when.strftime("%Y-%m-%d %H:%M:%S %Z").strip() if when else "no signing time"
    entry: dict = {
        "number": i,
        "field": s.field_name,
        "revision": s.signed_revision,
        "signer": _name(cert),
        "issuer": cert.issuer.human_friendly,
        "serial": format(cert.serial_number, "x"),
        "signing_time": when.isoformat() if when else None,
    }
    proof.signatures.append(entry)
    vc = ValidationContext(trust_roots=roots, allow_fetching=False, revocation_mode="soft-fail")
    try:
        st = validate_pdf_signature(s, vc, skip_diff=True)
    except Exception as exc:
        entry.update(intact=False, valid=False, trusted=False)
        proof.add(
            FAIL,
            label,
            f"field {s.field_name!r}: the signature cannot be validated ({type(exc).__name__}: {exc})",
        )
        return
    entry.update(intact=bool(st.intact), valid=bool(st.valid), trusted=bool(st.trusted))
    entry["covers_whole_file"] = st.coverage == SignatureCoverageLevel.ENTIRE_FILE
    who = f"signed by {_cn(cert)} (certificate {entry['serial'][:16]}…, issued by {_cn_issuer(cert)}) at {when_text}"
    if st.intact and st.valid:
        proof.add(OK, label, f"field {s.field_name!r}: intact and valid, {who}")
    else:
        what = "the signed bytes were changed" if not st.intact else "the signature does not verify"
        proof.add(FAIL, label, f"field {s.field_name!r}: {what}; {who}")
    if not roots:
        proof.add(
            FAIL,
            f"{label} chain",
            "not checked: no trust root given (name the issuing authority's certificate with --trust)",
        )
    elif st.trusted:
        proof.add(OK, f"{label} chain", "the certificate chain ends at a trust root given with --trust")
        proof.add(NOTE, f"{label} chain", "revocation not checked (verify makes no network requests)")
    else:
        proof.add(
            FAIL,
            f"{label} chain",
            f"the certificate of {_cn(cert)} (issued by {_cn_issuer(cert)}) does not chain to a trust root "
            f"given with --trust{_why(st)}",
        )
    if st.coverage == SignatureCoverageLevel.ENTIRE_FILE:
        proof.add(OK, f"{label} cover", "covers the whole file: nothing was added after this seal")
    elif st.coverage == SignatureCoverageLevel.ENTIRE_REVISION:
        later = [r for r in revs.revisions if r.number > s.signed_revision]
        seals = [r for r in later if r.number in by_rev]
        others = [r for r in later if r.number not in by_rev]
        parts = []
        if seals:
            parts.append("later seals in update " + ", ".join(str(r.number) for r in seals))
        if others:
            parts.append("update " + ", ".join(str(r.number) for r in others) + " (see above)")
        proof.add(
            NOTE if not others else FAIL,
            f"{label} cover",
            "covers the file up to its own revision; it does not cover " + " and ".join(parts),
        )
    else:
        proof.add(FAIL, f"{label} cover", "covers only part of its revision (nonstandard byte range)")


def _cn_issuer(cert) -> str:
    try:
        return str(cert.issuer.native.get("common_name", "")) or cert.issuer.human_friendly
    except Exception:
        return "?"


def _why(st) -> str:
    try:
        err = getattr(st, "trust_problem_indic", None)
        err = getattr(err, "name", err)
    except Exception:
        err = None
    return f" ({err})" if err else ""
