"""``calcreport seal``: apply the engineer's digital seal to a calculation report.

The report's cover reserves an empty signature field in its seal box (named by the report
template, ``[seal] field``, default ``engineer-seal``). Sealing signs into that field with pyHanko:
a PAdES baseline B-B signature (ETSI EN 319 142-1; CMS with SHA-256, sub-filter
``ETSI.CAdES.detached``), B-T when a timestamp authority is named, written as an incremental
update so the bytes of the report as built stay untouched and ``calcreport verify`` can still
prove them against a rebuild. The visible stamp shows the signer's name, licence number and
state/province — from the job file (``[job] engineer``, ``licence``, ``jurisdiction``, stamped
in the PDF's metadata by ``build``) or else from the certificate (common name, state or province)
— and the signing time in UTC. When the seal box already holds a seal (a checker sealing after
the engineer), the next seal goes into a new invisible signature field.

Keys: a PKCS#12 file (``--cert file.p12``, key inside) or PEM/DER certificate and key files. A
passphrase is never a command-line argument: it comes from the environment variable named by
``--passphrase-env`` or from a prompt (``getpass``).
"""

from __future__ import annotations

import io
import os
from collections.abc import Callable
from dataclasses import dataclass
from datetime import UTC, datetime
from typing import Any

from ..errors import JobError

__all__ = ["Credentials", "SealResult", "load_credentials", "seal_pdf", "stamp_lines"]

MAX_LINE = 34  # characters per stamp line (the stamp text is scaled to the box)


@dataclass(frozen=True)
class Credentials:
    signer: Any  # pyhanko.sign.signers.SimpleSigner
    subject: dict  # the certificate's subject (asn1crypto native names)
    not_after: datetime


@dataclass(frozen=True)
class SealResult:
    out: str
    field: str
    visible: bool
    lines: tuple[str, ...]


def _need_pyhanko() -> None:
    try:
        import pyhanko  # noqa: F401
    except ModuleNotFoundError:
        raise JobError("calcreport seal", "", "needs the pyHanko package (pip install pyHanko)") from None


MAX_CREDENTIAL_BYTES = 1_000_000  # a certificate, key or PKCS#12 file is a few kilobytes
MAX_REPORT_BYTES = 200_000_000


def _read(path: str, what: str) -> bytes:
    from ..safeio import read_input

    limit = MAX_REPORT_BYTES if what.endswith("report") else MAX_CREDENTIAL_BYTES
    return read_input(path, limit, what if what.startswith(("a ", "an ")) else f"the {what}")


def load_credentials(
    cert_path: str,
    key_path: str | None,
    chain: tuple[str, ...] = (),
    passphrase: Callable[[], bytes] | None = None,
) -> Credentials:
    """The signer from a PKCS#12 file (``key_path`` None) or a certificate and a key file.

    ``passphrase`` is called only when the key (or PKCS#12 file) is encrypted.
    """
    _need_pyhanko()
    from cryptography import x509 as cx509
    from cryptography.hazmat.primitives import serialization as ser
    from cryptography.hazmat.primitives.serialization import pkcs12

    data = _read(cert_path, "certificate")
    extra: list = []
    if key_path is None:
        key, cert, extra = _pkcs12(cert_path, data, passphrase, pkcs12)
    else:
        try:
            cert = (
                cx509.load_pem_x509_certificate(data)
                if b"-----BEGIN" in data
                else cx509.load_der_x509_certificate(data)
            )
        except ValueError:
            raise JobError(
                cert_path, "", "expected an X.509 certificate (PEM or DER), or a PKCS#12 file without --key"
            ) from None
        key = _private_key(key_path, _read(key_path, "key"), passphrase, ser)
    for p in chain:
        blob = _read(p, "chain certificate")
        try:
            extra += (
                cx509.load_pem_x509_certificates(blob)
                if b"-----BEGIN" in blob
                else [cx509.load_der_x509_certificate(blob)]
            )
        except ValueError:
            raise JobError(p, "", "expected X.509 certificates in PEM or DER form (--chain)") from None
    if cert is None or key is None:
        raise JobError(cert_path, "", "the PKCS#12 file holds no certificate with its private key")
    der = ser.Encoding.DER
    if key.public_key().public_bytes(
        der, ser.PublicFormat.SubjectPublicKeyInfo
    ) != cert.public_key().public_bytes(der, ser.PublicFormat.SubjectPublicKeyInfo):
        raise JobError(key_path or cert_path, "", "the private key does not belong to the certificate")
    now = datetime.now(UTC)
    if not cert.not_valid_before_utc <= now <= cert.not_valid_after_utc:
        raise JobError(
            cert_path,
            "",
            f"the certificate is valid from {cert.not_valid_before_utc:%Y-%m-%d} to "
            f"{cert.not_valid_after_utc:%Y-%m-%d}, not now",
        )
    from asn1crypto import keys as akeys
    from asn1crypto import x509 as ax509
    from pyhanko.sign.signers import SimpleSigner
    from pyhanko_certvalidator.registry import SimpleCertificateStore

    acert = ax509.Certificate.load(cert.public_bytes(der))
    akey = akeys.PrivateKeyInfo.load(key.private_bytes(der, ser.PrivateFormat.PKCS8, ser.NoEncryption()))
    others = [ax509.Certificate.load(c.public_bytes(der)) for c in extra]
    signer = SimpleSigner(
        signing_cert=acert,
        signing_key=akey,
        cert_registry=SimpleCertificateStore.from_certs([acert, *others]),
    )
    return Credentials(signer, dict(acert.subject.native), cert.not_valid_after_utc)


def _pkcs12(path: str, data: bytes, passphrase, pkcs12):
    for attempt in (None, b"", "ask"):
        pw = passphrase() if attempt == "ask" and passphrase else attempt
        if attempt == "ask" and passphrase is None:
            break
        try:
            key, cert, extra = pkcs12.load_key_and_certificates(data, pw)
            return key, cert, list(extra or [])
        except ValueError:
            if attempt == "ask":
                raise JobError(path, "", "wrong passphrase, or not a PKCS#12 file") from None
            continue
    raise JobError(
        path, "", "expected a PKCS#12 file (or give --key for a PEM certificate); it may need a passphrase"
    )


def _private_key(path: str, data: bytes, passphrase, ser):
    load = ser.load_pem_private_key if b"-----BEGIN" in data else ser.load_der_private_key
    try:
        return load(data, password=None)
    except TypeError:  # encrypted: ask
        if passphrase is None:
            raise JobError(path, "", "the key is encrypted and no passphrase was given") from None
        try:
            return load(data, password=passphrase())
        except (ValueError, TypeError):
            raise JobError(path, "", "wrong passphrase for the key") from None
    except ValueError:
        raise JobError(
            path, "", "expected a private key in PEM or DER form (PKCS#8 or traditional)"
        ) from None


def stamp_lines(info: dict[str, str], subject: dict, when: datetime) -> tuple[str, ...]:
    """The stamp's lines: the job's engineer of record, else the certificate's names."""
    from ..outputs.pdfmeta import KEY_ENGINEER, KEY_JURISDICTION, KEY_LICENCE

    name = info.get("/" + KEY_ENGINEER) or str(subject.get("common_name", "") or "")
    licence = info.get("/" + KEY_LICENCE, "")
    place = info.get("/" + KEY_JURISDICTION) or str(subject.get("state_or_province_name", "") or "")
    lines = ["Digitally sealed by", name or "(signer not named)"]
    if licence:
        lines.append(f"Licence {licence}")
    if place:
        lines.append(place)
    lines.append(when.strftime("%Y-%m-%d %H:%M UTC"))
    return tuple(_fit(x) for x in lines)


def _fit(text: str) -> str:
    text = " ".join(text.split())
    return text if len(text) <= MAX_LINE else text[: MAX_LINE - 1] + "…"


def _fields(reader) -> tuple[list[str], list[str]]:
    from pyhanko.sign.fields import enumerate_sig_fields

    empty: list[str] = []
    filled: list[str] = []
    for name, value, _ref in enumerate_sig_fields(reader):
        (filled if value is not None else empty).append(name)
    return empty, filled


def seal_pdf(
    pdf_path: str,
    out_path: str,
    cred: Credentials,
    field: str | None = None,
    tsa_url: str | None = None,
) -> SealResult:
    """Sign ``pdf_path`` into its reserved (or the named) field; write ``out_path`` atomically."""
    _need_pyhanko()
    import logging

    from pyhanko.pdf_utils.incremental_writer import IncrementalPdfFileWriter
    from pyhanko.pdf_utils.text import TextBoxStyle
    from pyhanko.sign import fields, signers
    from pyhanko.stamp import TextStampStyle

    from ..safewrite import write_atomic
    from .verify import read_stamp

    logging.getLogger("pyhanko").setLevel(logging.CRITICAL + 10)
    read_stamp(pdf_path)  # a calcreport report, readable (JobError otherwise)
    data = _read(pdf_path, "report")
    _refuse_changed(pdf_path, data)
    try:
        w = IncrementalPdfFileWriter(io.BytesIO(data), strict=False)
        empty, filled = _fields(w.prev)
        ref = w.prev.trailer_view.get("/Info")
        info = {str(k): str(v) for k, v in (ref.get_object() if ref is not None else {}).items()}
    except Exception as exc:
        raise JobError(pdf_path, "", f"not a readable PDF ({type(exc).__name__})") from None
    new_spec = None
    if field is None:
        if empty:
            field = empty[0]
        else:
            n = len(filled) + 1
            while f"seal-{n}" in filled:
                n += 1
            field = f"seal-{n}"
            new_spec = fields.SigFieldSpec(sig_field_name=field)  # invisible: the box is taken
    elif field in filled:
        raise JobError(pdf_path, "", f"the signature field {field!r} is already signed")
    elif field not in empty:
        if not all(c.isalnum() or c in "-_" for c in field):
            raise JobError(pdf_path, "", f"a field name is letters, digits, '-' and '_', got {field!r}")
        new_spec = fields.SigFieldSpec(sig_field_name=field)
    when = datetime.now(UTC)
    lines = stamp_lines(info, cred.subject, when)
    for line in lines:
        try:
            line.encode("cp1252")  # the stamp's font is the standard Courier (WinAnsiEncoding)
        except UnicodeEncodeError:
            raise JobError(
                pdf_path,
                "",
                f"the stamp's font shows Western European letters only and cannot show {line!r} exactly; "
                "give the name in those letters in the job ([job] engineer, jurisdiction) and rebuild",
            ) from None
    meta = signers.PdfSignatureMetadata(
        field_name=field,
        md_algorithm="sha256",
        subfilter=fields.SigSeedSubFilter.PADES,
        name=lines[1],
        reason="Engineer's seal on a calculation report",
        location=info.get("/CalcreportJurisdiction") or None,
    )
    style = TextStampStyle(
        stamp_text="\n".join(lines),
        text_box_style=TextBoxStyle(font_size=9, leading=12),
        border_width=1,
        background=None,
    )
    pdf_signer = signers.PdfSigner(
        meta, cred.signer, stamp_style=style, timestamper=_timestamper(tsa_url), new_field_spec=new_spec
    )
    out = io.BytesIO()
    try:
        pdf_signer.sign_pdf(w, existing_fields_only=new_spec is None, output=out)
    except Exception as exc:  # pyHanko's signing errors: one line, nothing written
        raise JobError(pdf_path, "", f"signing failed ({type(exc).__name__}: {exc})") from None
    signed = out.getvalue()
    if not signed.startswith(data):  # never rewrite the report as built
        raise JobError(pdf_path, "", "internal error: signing did not append an incremental update")
    try:
        write_atomic(signed, out_path)
    except OSError as exc:
        raise JobError(out_path, "", f"cannot write the sealed report ({exc.strerror or exc})") from None
    return SealResult(str(out_path), field, new_spec is None, lines)


def _refuse_changed(pdf_path: str, data: bytes) -> None:
    """Refuse a report changed after its build: every later revision must be a seal's own."""
    from .pdf_revisions import describe, read_revisions

    revs = read_revisions(data)
    if revs.error or revs.reader is None:
        raise JobError(pdf_path, "", revs.error or "the file's revisions cannot be read")
    if revs.trailing:
        raise JobError(
            pdf_path, "", f"{revs.trailing:,} bytes were appended after the report's end; not sealed"
        )
    try:
        signed = {s.signed_revision for s in revs.reader.embedded_signatures}
    except Exception as exc:
        raise JobError(
            pdf_path, "", f"the signatures in the file cannot be read ({type(exc).__name__})"
        ) from None
    for r in revs.revisions[1:]:
        if r.number not in signed:
            raise JobError(
                pdf_path,
                "",
                f"the report was changed after it was built (update {r.number} {describe(r)}); "
                "seal the report as built (calcreport verify says what changed)",
            )


def _timestamper(url: str | None):
    if not url:
        return None
    if not url.startswith(("http://", "https://")):
        raise JobError("--tsa", "", f"expected an http:// or https:// address, got {url!r}")
    try:
        import requests  # noqa: F401
        from pyhanko.sign.timestamps.requests_client import HTTPTimeStamper
    except ModuleNotFoundError:
        raise JobError(
            "--tsa", "", "a timestamp authority needs the requests package (pip install requests)"
        ) from None
    return HTTPTimeStamper(url)


def passphrase_source(env_name: str | None, interactive: bool) -> Callable[[], bytes] | None:
    """Where a passphrase comes from: the named environment variable, else a prompt on a terminal."""
    if env_name:

        def from_env() -> bytes:
            value = os.environ.get(env_name)
            if value is None:
                raise JobError("--passphrase-env", "", f"the environment variable {env_name} is not set")
            return value.encode("utf-8")

        return from_env
    if interactive:
        import getpass

        return lambda: getpass.getpass("passphrase for the signing key: ").encode("utf-8")
    return None
