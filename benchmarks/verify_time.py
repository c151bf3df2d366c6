"""`calcreport verify` of each demo report, against building the same report: verify rebuilds the
report in memory and then reads both PDFs, so its floor is one build. In this process, after
imports; best of 3. Target: verify ≤ 1.5 × build (unsealed) and ≤ 2 × build (sealed twice, both
seals validated against their trust roots).

Run:  PYTHONPATH=$PWD python benchmarks/verify_time.py
"""

from __future__ import annotations

import contextlib
import io
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))
sys.path.insert(0, str(ROOT / "tests"))


def best(fn, n: int = 3) -> float:
    times = []
    for _ in range(n):
        t = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t)
    return min(times)


def main() -> None:
    from seal_helpers import make_pki

    from calcreport.cli import main as cli

    def quiet(argv: list[str]) -> int:
        with contextlib.redirect_stdout(io.StringIO()):
            return cli(argv)

    with tempfile.TemporaryDirectory() as d:
        eng, chk = make_pki(Path(d) / "eng"), make_pki(Path(d) / "chk", signer="Test Checker")
        print(
            f"{'job':34} {'sheets':>6} {'bytes':>9} {'build s':>8} {'verify s':>9} {'ratio':>6} "
            f"{'sealed×2 s':>10} {'ratio':>6}"
        )
        quiet(["build", str(ROOT / "jobs" / "boathouse-door-header.toml"), "-o", f"{d}/warm.pdf"])
        for job in sorted((ROOT / "jobs").glob("*.toml")):
            pdf = f"{d}/{job.stem}.pdf"
            t_build = best(lambda j=job, p=pdf: quiet(["build", str(j), "-o", p, "-j", "1"]))
            t_verify = best(lambda j=job, p=pdf: quiet(["verify", p, str(j)]))
            s1, s2 = f"{d}/{job.stem}-1.pdf", f"{d}/{job.stem}-2.pdf"
            quiet(["seal", pdf, "--cert", str(eng.cert_pem), "--key", str(eng.key_pem), "-o", s1])
            quiet(["seal", s1, "--cert", str(chk.cert_pem), "--key", str(chk.key_pem), "-o", s2])
            trust = ["--trust", str(eng.ca_pem), "--trust", str(chk.ca_pem)]
            code = quiet(["verify", s2, str(job), *trust])
            t_sealed = best(lambda j=job, p=s2, t=trust: quiet(["verify", p, str(j), *t]))
            import pypdf

            sheets = len(pypdf.PdfReader(pdf).pages)
            size = Path(pdf).stat().st_size
            print(
                f"{job.name:34} {sheets:>6} {size:>9,} {t_build:>8.2f} {t_verify:>9.2f} "
                f"{t_verify / t_build:>6.2f} {t_sealed:>10.2f} {t_sealed / t_build:>6.2f}"
                + ("" if code == 0 else f"  (sealed verify exit {code}!)")
            )
        print("targets: verify/build <= 1.5 (unsealed), <= 2.0 (sealed twice)")


if __name__ == "__main__":
    main()
