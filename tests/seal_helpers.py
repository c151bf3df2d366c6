"""Throw-away certificates for the seal tests, made with the `cryptography` package.

Each call makes a fresh self-signed test authority and a signer certificate issued by it (RSA 2048,
SHA-256, valid from yesterday for 30 days), following RFC 5280: the authority has basicConstraints
CA:TRUE and keyCertSign; the signer has digitalSignature and nonRepudiation key usage. Nothing here
is a real key, and nothing leaves the test's temporary folder.
"""

from __future__ import annotations

from dataclasses import dataclass
from datetime import UTC, datetime, timedelta
from pathlib import Path

from cryptography import x509
from cryptography.hazmat.primitives import hashes, serialization
from cryptography.hazmat.primitives.asymmetric import rsa
from cryptography.hazmat.primitives.serialization import pkcs12
from cryptography.x509.oid import NameOID


@dataclass(frozen=True)
class TestPki:
    ca_pem: Path
    cert_pem: Path
    key_pem: Path
    p12: Path


def _name(cn: str, state: str = "") -> x509.Name:
    attrs = [x509.NameAttribute(NameOID.COMMON_NAME, cn), x509.NameAttribute(NameOID.COUNTRY_NAME, "US")]
    if state:
        attrs.append(x509.NameAttribute(NameOID.STATE_OR_PROVINCE_NAME, state))
    return x509.Name(attrs)


def make_pki(
    folder: Path, signer: str = "Test Engineer", state: str = "Test State", passphrase: bytes | None = None
) -> TestPki:
    folder.mkdir(parents=True, exist_ok=True)
    now = datetime.now(UTC)
    ca_key = rsa.generate_private_key(public_exponent=65537, key_size=2048)
    ca_name = _name(f"Throw-away Test Authority for {signer}")
    ca = (
        x509.CertificateBuilder()
        .subject_name(ca_name)
        .issuer_name(ca_name)
        .public_key(ca_key.public_key())
        .serial_number(x509.random_serial_number())
        .not_valid_before(now - timedelta(days=1))
        .not_valid_after(now + timedelta(days=30))
        .add_extension(x509.BasicConstraints(ca=True, path_length=0), critical=True)
        .add_extension(
            x509.KeyUsage(False, False, False, False, False, True, True, False, False), critical=True
        )
        .add_extension(x509.SubjectKeyIdentifier.from_public_key(ca_key.public_key()), critical=False)
        .sign(ca_key, hashes.SHA256())
    )
    key = rsa.generate_private_key(public_exponent=65537, key_size=2048)
    cert = (
        x509.CertificateBuilder()
        .subject_name(_name(signer, state))
        .issuer_name(ca_name)
        .public_key(key.public_key())
        .serial_number(x509.random_serial_number())
        .not_valid_before(now - timedelta(days=1))
        .not_valid_after(now + timedelta(days=30))
        .add_extension(x509.BasicConstraints(ca=False, path_length=None), critical=True)
        .add_extension(
            x509.KeyUsage(True, True, False, False, False, False, False, False, False), critical=True
        )
        .add_extension(
            x509.AuthorityKeyIdentifier.from_issuer_public_key(ca_key.public_key()), critical=False
        )
        .sign(ca_key, hashes.SHA256())
    )
    pem = serialization.Encoding.PEM
    ca_pem, cert_pem, key_pem, p12 = (
        folder / "ca.pem",
        folder / "signer.pem",
        folder / "signer.key",
        folder / "signer.p12",
    )
    ca_pem.write_bytes(ca.public_bytes(pem))
    cert_pem.write_bytes(cert.public_bytes(pem))
    enc = serialization.BestAvailableEncryption(passphrase) if passphrase else serialization.NoEncryption()
    key_pem.write_bytes(key.private_bytes(pem, serialization.PrivateFormat.PKCS8, enc))
    p12.write_bytes(
        pkcs12.serialize_key_and_certificates(
            b"signer", key, cert, [ca], serialization.BestAvailableEncryption(passphrase or b"p12-test")
        )
    )
    return TestPki(ca_pem, cert_pem, key_pem, p12)
