"""The report with hostile text, bad templates, failing builds and the `build` command's contract."""

from __future__ import annotations

import re
import textwrap
from pathlib import Path

import pytest

pypdf = pytest.importorskip("pypdf")

from calcreport.errors import JobError  # noqa: E402
from calcreport.outputs.report import member_story as member_story_mod  # noqa: E402
from calcreport.outputs.report.build import build_pdf  # noqa: E402
from calcreport.outputs.report.template import load_template  # noqa: E402
from calcreport.pipeline import solve_file  # noqa: E402

ROOT = Path(__file__).resolve().parent.parent
DEMO = ROOT / "jobs" / "boathouse-door-header.toml"
LONG_WORD = "W" + "x" * 298 + "Z"  # 300 characters, no break opportunity

HOSTILE = textwrap.dedent(f"""
    [job]
    project = "Dock <b>bold</b> & <font name='Courier'>shed</font>"
    number = "N&1"
    subject = "Subject </para> <br/> & more"
    prepared_by = "P. <i>Writer</i>"
    checked_by = "C & D"
    revision = "A"
    date = "2026-03-04"

    [[job.history]]
    mark = "A"
    date = "2026-03-04"
    by = "P"
    description = "First issue <unclosed"

    [settings]
    units = "US"
    method = "ASD"
    {{template}}

    [[material]]
    id = "w<1>"
    name = "Wood & co <b>"
    family = "wood"
    E = "1600 ksi"

    [[member]]
    id = "M&1"
    title = "Beam <font"
    description = "Καλημέρα — τ ≤ φ·Ω, Σ ≥ 0; 船屋の梁; {LONG_WORD} end"
    shear = "2 kip"
    assumptions = ["<b>not bold</b> & literal"]

    [[member.part]]
    id = "a"
    shape = "rect"
    width = "1.5 in"
    depth = "9 in"
    material = "w<1>"

    [[member.part]]
    id = "b"
    shape = "rect"
    width = "1.5 in"
    depth = "9 in"
    material = "w<1>"
    on = "a"

    [[member.joint]]
    id = "j<1>"
    holds = ["b"]

    [member.joint.connector]
    type = "given"
    name = "nail & glue <b>"
    value = "100 lbf"
    source = "{LONG_WORD}"
""")


def squash(text: str) -> str:
    return re.sub(r"\s+", "", text)


def write(tmp_path: Path, text: str, name: str = "job.toml") -> Path:
    p = tmp_path / name
    p.write_text(text, encoding="utf-8")
    return p


def hostile(tmp_path: Path, template: str = "") -> Path:
    return write(tmp_path, HOSTILE.replace("{template}", template))


def test_markup_in_job_text_prints_literally(tmp_path):
    out = build_pdf(solve_file(str(hostile(tmp_path))), tmp_path / "h.pdf")
    text = "".join(p.extract_text() for p in pypdf.PdfReader(str(out)).pages)
    flat = squash(text)
    for literal in (
        "Dock <b>bold</b> & <font name='Courier'>shed</font>",
        "Subject </para> <br/> & more",
        "P. <i>Writer</i>",
        "First issue <unclosed",
        "Wood & co <b>",
        "Beam <font",
        "<b>not bold</b> & literal",
        "nail & glue <b>",
        "j<1>",
        "M&1",
        "Καλημέρα — τ ≤ φ·Ω, Σ ≥ 0",
    ):
        assert squash(literal) in flat, literal
    assert LONG_WORD in flat  # broken across lines, never dropped
    assert "船屋の梁" in flat  # set in the CJK fallback font


def test_long_word_is_wrapped_inside_the_page(tmp_path):
    out = build_pdf(solve_file(str(hostile(tmp_path))), tmp_path / "h.pdf")
    reader = pypdf.PdfReader(str(out))
    width = float(reader.pages[0].mediabox.width)
    xs = []

    def visit(text, cm, tm, font, size):
        if text.strip():
            xs.append(tm[4] * cm[0] + cm[4])

    for page in reader.pages:
        page.extract_text(visitor_text=visit)
    assert xs and max(xs) < width  # every run starts on the page


def test_a_failing_build_leaves_the_earlier_report(tmp_path, monkeypatch):
    result = solve_file(str(DEMO))
    target = tmp_path / "report.pdf"
    target.write_bytes(b"earlier report")

    def boom(*a, **k):
        raise RuntimeError("drawing failed")

    monkeypatch.setattr(member_story_mod, "section_drawing", boom)  # the member section draws it
    with pytest.raises(RuntimeError):
        build_pdf(result, target)
    assert target.read_bytes() == b"earlier report"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["report.pdf"]  # no temporary left


def test_cli_build_exit_codes_and_paths(tmp_path, monkeypatch, cli):
    monkeypatch.chdir(tmp_path)
    code, out, err = cli("build", str(DEMO))
    assert code == 0, err
    assert (tmp_path / "out" / "boathouse-door-header.pdf").is_file()
    ng = ROOT / "tests" / "data" / "report-mixed.toml"
    code, out, err = cli("build", str(ng), "-o", "one.pdf")
    assert code == 1 and (tmp_path / "one.pdf").is_file()
    code, out, err = cli("build", str(DEMO), str(ng), "-o", "many")
    assert code == 1
    assert sorted(p.name for p in (tmp_path / "many").iterdir()) == [
        "boathouse-door-header.pdf",
        "report-mixed.pdf",
    ]


def test_cli_invalid_job_writes_nothing_the_others_are_written(tmp_path, monkeypatch, cli):
    monkeypatch.chdir(tmp_path)
    bad = write(tmp_path, "[job]\nproject = 1\n", "bad.toml")
    (tmp_path / "out").mkdir()
    (tmp_path / "out" / "bad.pdf").write_bytes(b"earlier")
    code, out, err = cli("build", "-j", "1", str(DEMO), str(bad))
    assert code == 2
    # each job of a batch is built on its own: the invalid one writes nothing (its earlier report
    # stays), the valid one is written, and the summary names the failure on one line
    assert "1 of 2 jobs not built" in err and err.count("bad.toml") == 1
    assert (tmp_path / "out" / "bad.pdf").read_bytes() == b"earlier"
    assert (tmp_path / "out" / "boathouse-door-header.pdf").is_file()
    assert sorted(p.name for p in (tmp_path / "out").iterdir()) == ["bad.pdf", "boathouse-door-header.pdf"]
    code, out, err = cli("build", str(bad))  # one job: just its one-line error
    assert code == 2 and err.count("\n") == 1 and err.startswith(str(bad))


@pytest.mark.parametrize(
    "value, message",
    [
        ('template = "no-such"', "expected one of the report templates"),
        ('template = "missing/file.toml"', "does not exist"),
        ('template = "bad name!"', "expected a template name"),
    ],
)
def test_bad_template_names(tmp_path, cli, value, message):
    job = hostile(tmp_path, value)
    code, out, err = cli("build", str(job), "-o", str(tmp_path / "x.pdf"))
    assert code == 2
    assert "settings.template" in err and message in err
    assert not (tmp_path / "x.pdf").exists()


@pytest.mark.parametrize(
    "body, key",
    [
        ('[page]\nsize = "tabloid"\n', "page.size"),
        ('[page]\nmargin_left = "5 in"\n', "page.margin_left"),
        ('[page]\nmargin_left = "5 kip"\n', "page.margin_left"),
        ('[style]\naccent = "blue"\n', "style.accent"),
        ("[style]\nfont_size = 30\n", "style.font_size"),
        ('[firm]\nlogo = "logo.png"\n', "firm.logo"),  # missing
        ('[firm]\nlogo = "sub"\n', "firm.logo"),  # not a PNG/JPEG name
        ('[firm]\nlogo = "fake.png"\n', "firm.logo"),  # not an image
        ('[style]\nfont = "fake.ttf"\n', "style.font"),
        ("[colour]\n", "colour"),
        ("[page]\nsize = \n", "TOML"),
    ],
)
def test_bad_template_contents(tmp_path, body, key):
    (tmp_path / "sub").mkdir()
    (tmp_path / "fake.png").write_bytes(b"not an image")
    (tmp_path / "fake.ttf").write_bytes(b"not a font")
    write(tmp_path, body, "firm.toml")
    with pytest.raises(JobError) as exc:
        load_template("firm.toml", str(tmp_path / "job.toml"))
    assert exc.value.key == "settings.template"
    assert key in str(exc.value) and "\n" not in str(exc.value)


def test_template_with_logo_and_firm(tmp_path):
    from PIL import Image

    Image.new("RGB", (60, 30), (40, 90, 120)).save(tmp_path / "logo.png")
    write(
        tmp_path,
        '[page]\nsize = "a4"\nmargin_left = "25 mm"\n[firm]\nname = "Quayside Engineers"\n'
        'address = ["1 Pier Road"]\nlogo = "logo.png"\n[style]\naccent = "#804000"\n',
        "firm.toml",
    )
    job = hostile(tmp_path, 'template = "firm.toml"')
    result = solve_file(str(job))
    tpl = load_template(result.job.settings.template, result.job.path)
    assert tpl.page == "a4" and tpl.logo == (tmp_path / "logo.png").resolve()
    out = build_pdf(result, tmp_path / "f.pdf")
    reader = pypdf.PdfReader(str(out))
    for page in reader.pages:
        t = page.extract_text()
        assert "Quayside Engineers" in t and "1 Pier Road" in t


def test_shipped_templates_load(tmp_path):
    for name in ("letter", "a4"):
        tpl = load_template(name, str(tmp_path / "job.toml"))
        assert tpl.page == name


def test_escaping_whole_texts_equals_the_character_by_character_rule():
    """The shortcuts for printable text in the body font give what escaping character by character
    gives (the rule they stand for): controls dropped, tabs and breaks as spaces, markup escaped,
    characters the body face lacks set in the fallback font."""
    import unicodedata

    from calcreport.outputs.report import styles as S

    def by_char(text: str, font: str) -> str:
        text = unicodedata.normalize("NFC", text)
        text = "".join(
            " " if c in "\t\r\n" else c for c in text if c in "\t\r\n" or unicodedata.category(c)[0] != "C"
        )
        covered = S._covered(font)
        out, run = [], []
        for c in text:
            if ord(c) in covered or c == " ":
                if run:
                    out.append(f'<font name="{S.FALLBACK_FONT}">{S.escape("".join(run))}</font>')
                    run = []
                out.append(S.escape(c))
            else:
                run.append(c)
        if run:
            out.append(f'<font name="{S.FALLBACK_FONT}">{S.escape("".join(run))}</font>')
        return "".join(out)

    S.register_fonts()
    font = S._BODY[0]
    for text in (
        "q = V·Q / I = 93.59 lbf/in",
        "a <b>bold</b> & more",
        "tab\there\r\nline",
        "nul\x00 and bell\x07",
        "桁 beam 梁 & <x>",
        "nbsp\u00a0and\u2028separator",
        "",
        "   ",
        "e\u0301 (decomposed é)",
    ):
        S._esc.cache_clear()
        assert S._esc(text, font) == by_char(text, font), text
