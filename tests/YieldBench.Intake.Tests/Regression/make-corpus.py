#!/usr/bin/env python3
"""Writes the regression corpus of broken, hostile and awkward inputs (tests/YieldBench.Intake.Tests/Regression/files).

Every file is invented (lots of an invented cellar, strain codes such as QX-7). Text files are written here; workbooks
are written here as zip packages of hand-made XML (so they can hold what spreadsheet programs never save: formulas
without a stored result, parts that share their data) or converted from CSV by LibreOffice
(`soffice --headless --convert-to xlsx|ods|xls`, Debian package libreoffice-calc-nogui). Random bytes come from a
seeded generator, so the script makes the same files each time (LibreOffice's own output aside).

    python3 tests/YieldBench.Intake.Tests/Regression/make-corpus.py

Inputs the fuzz harness found (fuzz/run.sh) are kept in fuzz-found/ and copied in as they are.

The expected codes and accounting of each file are in expected.tsv; after changing the corpus, run the tests with
YB_UPDATE_CORPUS=1 to rewrite it, and read the difference before committing it.
"""
import os, random, shutil, subprocess, sys, tempfile, zipfile, struct, zlib

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, "files")
rng = random.Random(20261)

LOTS = "Lot,Vintage,Yeast,Brix,Alcohol % v/v"
GOOD = ["A-01,2023,QX-7,24.0,14.0", "A-02,2023,QX-9,23.1,13.4", "A-03,2023,QX-7,25.2,14.9"]


HIDDEN = ' state="hidden"'


def style_attr(name):
    return f' table:style-name="{name}"' if name else ""


def path(name):
    p = os.path.join(OUT, name)
    os.makedirs(os.path.dirname(p), exist_ok=True)
    return p


def text(name, content, encoding="utf-8", newline="\n"):
    with open(path(name), "w", encoding=encoding, newline=newline) as f:
        f.write(content)


def raw(name, data):
    with open(path(name), "wb") as f:
        f.write(data)


def csv(name, *lines):
    text(name, "\n".join(lines) + "\n")


def esc(s):
    return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace('"', "&quot;")


def col(i):
    s = ""
    i += 1
    while i:
        i, r = divmod(i - 1, 26)
        s = chr(65 + r) + s
    return s


def xlsx(name, sheets, zip_writer=None):
    """sheets: [(name, rows, hidden)] where a cell is None, a number, a str, or a tuple:
    ('f', formula) formula without value; ('fv', formula, value) formula with value; ('e', formula, '#DIV/0!') error;
    ('pct', number) percent-formatted; ('shared', index) a shared formula without value. A fourth element of a sheet,
    when given, lists its merged blocks ("C3:C5")."""
    files = {}
    files["[Content_Types].xml"] = ('<?xml version="1.0" encoding="UTF-8"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types">'
        '<Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/><Default Extension="xml" ContentType="application/xml"/>'
        '<Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/>'
        '<Override PartName="/xl/styles.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.styles+xml"/>'
        + "".join(f'<Override PartName="/xl/worksheets/sheet{i+1}.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/>' for i in range(len(sheets)))
        + "</Types>")
    files["_rels/.rels"] = ('<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">'
        '<Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="xl/workbook.xml"/></Relationships>')
    files["xl/workbook.xml"] = ('<?xml version="1.0" encoding="UTF-8"?><workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><sheets>'
        + "".join(f'<sheet name="{esc(s[0])}" sheetId="{i+1}" r:id="rId{i+1}"{HIDDEN if len(s) > 2 and s[2] else ""}/>' for i, s in enumerate(sheets))
        + "</sheets></workbook>")
    files["xl/_rels/workbook.xml.rels"] = ('<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">'
        + "".join(f'<Relationship Id="rId{i+1}" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet{i+1}.xml"/>' for i in range(len(sheets)))
        + f'<Relationship Id="rId{len(sheets)+1}" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/styles" Target="styles.xml"/></Relationships>')
    files["xl/styles.xml"] = ('<?xml version="1.0" encoding="UTF-8"?><styleSheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main">'
        '<fonts count="1"><font><sz val="11"/><name val="Calibri"/></font></fonts><fills count="1"><fill><patternFill patternType="none"/></fill></fills>'
        '<borders count="1"><border/></borders><cellStyleXfs count="1"><xf numFmtId="0" fontId="0" fillId="0" borderId="0"/></cellStyleXfs>'
        '<cellXfs count="2"><xf numFmtId="0" fontId="0" fillId="0" borderId="0" xfId="0"/><xf numFmtId="10" fontId="0" fillId="0" borderId="0" xfId="0" applyNumberFormat="1"/></cellXfs></styleSheet>')
    for i, s in enumerate(sheets):
        rows = s[1]
        x = ['<?xml version="1.0" encoding="UTF-8"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>']
        for r, row in enumerate(rows):
            x.append(f'<row r="{r+1}">')
            for c, v in enumerate(row):
                ref = f"{col(c)}{r+1}"
                if v is None:
                    continue
                if isinstance(v, tuple):
                    kind = v[0]
                    if kind == "f":
                        x.append(f'<c r="{ref}"><f>{esc(v[1])}</f></c>')
                    elif kind == "fv":
                        x.append(f'<c r="{ref}"><f>{esc(v[1])}</f><v>{v[2]}</v></c>')
                    elif kind == "e":
                        x.append(f'<c r="{ref}" t="e"><f>{esc(v[1])}</f><v>{v[2]}</v></c>')
                    elif kind == "pct":
                        x.append(f'<c r="{ref}" s="1"><v>{v[1]}</v></c>')
                    elif kind == "shared":
                        x.append(f'<c r="{ref}"><f t="shared" si="0"/></c>')
                elif isinstance(v, (int, float)):
                    x.append(f'<c r="{ref}"><v>{v}</v></c>')
                else:
                    x.append(f'<c r="{ref}" t="inlineStr"><is><t xml:space="preserve">{esc(v)}</t></is></c>')
            x.append("</row>")
        x.append("</sheetData>")
        if len(s) > 3 and s[3]:
            x.append(f'<mergeCells count="{len(s[3])}">' + "".join(f'<mergeCell ref="{m}"/>' for m in s[3]) + "</mergeCells>")
        x.append("</worksheet>")
        files[f"xl/worksheets/sheet{i+1}.xml"] = "".join(x)
    with zipfile.ZipFile(path(name), "w", zipfile.ZIP_DEFLATED) as z:
        for k, v in files.items():
            z.writestr(zipfile.ZipInfo(k, (2024, 1, 1, 0, 0, 0)), v)


def ods(name, tables, automatic_styles=""):
    """tables: [(name, rows_xml, style_name_or_None)] with rows_xml the table:table-row elements."""
    content = ('<?xml version="1.0" encoding="UTF-8"?><office:document-content xmlns:office="urn:oasis:names:tc:opendocument:xmlns:office:1.0" '
        'xmlns:style="urn:oasis:names:tc:opendocument:xmlns:style:1.0" xmlns:text="urn:oasis:names:tc:opendocument:xmlns:text:1.0" '
        'xmlns:table="urn:oasis:names:tc:opendocument:xmlns:table:1.0" xmlns:calcext="urn:org:documentfoundation:names:experimental:calc:xmlns:calcext:1.0" office:version="1.2">'
        f'<office:automatic-styles>{automatic_styles}</office:automatic-styles><office:body><office:spreadsheet>'
        + "".join(f'<table:table table:name="{esc(t[0])}"{style_attr(t[2])}>{t[1]}</table:table>' for t in tables)
        + "</office:spreadsheet></office:body></office:document-content>")
    with zipfile.ZipFile(path(name), "w", zipfile.ZIP_DEFLATED) as z:
        z.writestr(zipfile.ZipInfo("mimetype", (2024, 1, 1, 0, 0, 0)), "application/vnd.oasis.opendocument.spreadsheet", compress_type=zipfile.ZIP_STORED)
        z.writestr(zipfile.ZipInfo("content.xml", (2024, 1, 1, 0, 0, 0)), content)


def orow(*cells, repeat=None):
    r = f' table:number-rows-repeated="{repeat}"' if repeat else ""
    return f"<table:table-row{r}>" + "".join(cells) + "</table:table-row>"


def ostr(s):
    return f'<table:table-cell office:value-type="string"><text:p>{esc(s)}</text:p></table:table-cell>'


def onum(v):
    return f'<table:table-cell office:value-type="float" office:value="{v}"><text:p>{v}</text:p></table:table-cell>'


def convert(csv_name, fmt, out_name):
    """LibreOffice converts a corpus CSV to another format; the CSV itself is removed afterwards if it was a helper."""
    with tempfile.TemporaryDirectory() as d:
        src = os.path.join(d, out_name.rsplit("/", 1)[-1].rsplit(".", 1)[0] + ".csv")
        shutil.copy(path(csv_name), src)
        subprocess.run(["soffice", "--headless", "--convert-to", fmt, "--outdir", d, src], check=True, capture_output=True, timeout=180)
        shutil.copy(os.path.join(d, os.path.basename(src).rsplit(".", 1)[0] + "." + fmt), path(out_name))


def main():
    if os.path.isdir(OUT):
        shutil.rmtree(OUT)
    os.makedirs(OUT)

    # ---------------------------------------------------------------- files that are not what they say
    raw("empty.csv", b"")
    raw("binary-named-csv.csv", b"Lot,Yeast\nA\x00\x01\x02\xff")
    raw("random-bytes.xlsx", bytes(rng.randrange(256) for _ in range(4096)))
    raw("zip-magic-then-random.xlsx", b"PK\x03\x04" + bytes(rng.randrange(256) for _ in range(4096)))
    raw("random-bytes.xls", bytes(rng.randrange(256) for _ in range(4096)))
    raw("random-bytes.ods", bytes(rng.randrange(256) for _ in range(4096)))
    raw("truncated-zip.xlsx", b"PK\x03\x04\x14\x00\x00\x00\x08\x00\x01\x02")
    text("text-named-xlsx.xlsx", "Lot,Yeast,Brix,ABV\nA-01,QX-7,24,14\n")
    text("lots-2023.numbers", "not a format we read")
    with zipfile.ZipFile(path("zip-without-workbook.xlsx"), "w") as z:
        z.writestr("readme.txt", "no workbook here")
    with zipfile.ZipFile(path("ods-without-content.ods"), "w") as z:
        z.writestr("mimetype", "application/vnd.oasis.opendocument.spreadsheet")
    with zipfile.ZipFile(path("zip-bomb-ratio.xlsx"), "w", zipfile.ZIP_DEFLATED) as z:
        z.writestr("xl/workbook.xml", "<workbook/>")
        z.writestr("xl/worksheets/sheet1.xml", "<a>" + " " * 20_000_000 + "</a>")
    make_overlapping_zip()
    make_lying_zip()
    # a compound file whose directory names an "EncryptedPackage" stream, as an encrypted .xlsx is (MS-OFFCRYPTO 2.3.4)
    raw("encrypted-package.xlsx", bytes([0xD0, 0xCF, 0x11, 0xE0, 0xA1, 0xB1, 0x1A, 0xE1]) + b"\x00" * 504 + "EncryptedPackage".encode("utf-16-le") + b"\x00" * 1024)
    xlsx("damaged-sheet-xml.xlsx", [("Lots", [["Lot", "Yeast", "Brix", "ABV"], ["A-01", "QX-7", 24.0, 14.0]])])
    with zipfile.ZipFile(path("damaged-sheet-xml.xlsx"), "a") as z:
        pass
    data = open(path("damaged-sheet-xml.xlsx"), "rb").read()
    with zipfile.ZipFile(path("damaged-sheet-xml.xlsx")) as zin, zipfile.ZipFile(path("damaged-sheet-xml.tmp"), "w", zipfile.ZIP_DEFLATED) as zout:
        for item in zin.infolist():
            body = zin.read(item.filename)
            if item.filename == "xl/worksheets/sheet1.xml":
                body = body[: len(body) // 2]
            zout.writestr(item, body)
    os.replace(path("damaged-sheet-xml.tmp"), path("damaged-sheet-xml.xlsx"))

    # ---------------------------------------------------------------- encodings and CSV shapes
    with open(path("utf16-bom-2023.csv"), "wb") as f:
        f.write("\ufeff".encode("utf-16-le") + "\n".join([LOTS] + GOOD).encode("utf-16-le"))
    unicode_without_mark()
    named_wrong()
    text("latin1-2023.csv", LOTS + ",Notes\nA-01,2023,QX-7,24.0,14.0,levée à froid\n", encoding="latin-1")
    text("crlf-2023.csv", "\r\n".join([LOTS] + GOOD) + "\r\n", newline="")
    csv("unquoted-thousands-2023.csv", "Lot,Vintage,Yeast,Brix,Alcohol % v/v,Must volume (L)", "A-01,2023,QX-7,24.0,14.0,4500", "A-02,2023,QX-9,23.1,13.4,4,500", "A-03,2023,QX-7,25.2,14.9,\"4,500\"")
    csv("trailing-empty-fields-2023.csv", LOTS, "A-01,2023,QX-7,24.0,14.0,,,", "A-02,2023,QX-9,23.1,13.4,,")
    csv("unclosed-quote-2023.csv", LOTS, 'A-01,2023,"QX-7,24.0,14.0', "A-02,2023,QX-9,23.1,13.4", "A-03,2023,QX-7,25.2,14.9")
    text("semicolon-dot-thousands-2023.csv", "Lot;Vintage;Yeast;Brix;Alcohol % v/v;Must volume (L)\nA-01;2023;QX-7;24;14;4.200\nA-02;2023;QX-9;23;13;3.500\n")
    text("semicolon-decimal-point-2023.csv", "Lot;Vintage;Yeast;Brix;Alcohol % v/v;Must volume (L)\nA-01;2023;QX-7;24.1;14.05;4.200\nA-02;2023;QX-9;23.3;13.4;3.5\n")
    text("semicolon-decimal-comma-2023.csv", "Lot;Vintage;Yeast;Brix;Alcohol % v/v;Must volume (L)\nA-01;2023;QX-7;24,1;14,05;4.200\nA-02;2023;QX-9;23,3;13,4;1.200,5\n")
    text("tab-separated-2023.tsv", "\n".join(l.replace(",", "\t") for l in [LOTS] + GOOD) + "\n")
    text("pipe-separated-2023.txt", "\n".join(l.replace(",", "|") for l in [LOTS] + GOOD) + "\n")
    text("notes-only.txt", "Harvest notes (invented)\nPicked the north block early because of rain.\n")
    csv("one-long-line-2023.csv", LOTS + ",Notes", "A-01,2023,QX-7,24.0,14.0," + "x" * 200_000)

    # ---------------------------------------------------------------- finding the table
    csv("title-rows-2023.csv", "Invented Cellar — finished lots", "", "exported 2023-12-01", "", LOTS, *GOOD)
    csv("no-header.csv", "A-01,QX-7,24.0,14.0", "A-02,QX-9,23.1,13.4")
    csv("units-row-2023.csv", "Lot,Vintage,Yeast,Must weight,Final alc,Must volume", ",,,°Oe,% v/v,gal", "A-01,2023,QX-7,95,13.0,500", "A-02,2023,QX-9,99,13.6,420")
    csv("summary-and-note-rows-2023.csv", LOTS, *GOOD, "Average,,,24.1,14.1", "Total of all lots,,,,", "note: tank 4 cooled overnight,,,,", ",,,,")
    csv("duplicate-and-unused-columns-2023.csv", "Lot,Vintage,Yeast,Brix,Alcohol % v/v,Brix,Picker", "A-01,2023,QX-7,24.0,14.0,23.0,Sam", "A-02,2023,QX-9,23.1,13.4,23.0,Alex")
    csv("missing-alcohol-column-2023.csv", "Lot,Vintage,Yeast,Brix", "A-01,2023,QX-7,24.0")
    csv("log-without-time-column-2023.csv", "Lot,Vintage,Brix,Temp °C", "A-01,2023,24.0,18")
    xlsx("hidden-and-empty-sheets-2023.xlsx", [("Lots", [LOTS.split(",")] + [[float(x) if x.replace('.', '').isdigit() else x for x in g.split(",")] for g in GOOD]), ("old calc", [["Lot", "Yeast", "Brix", "ABV"], ["Z-9", "QX-1", 20.0, 11.0]], True), ("Empty", []), ("Scratch", [["just some words"]])])

    # ---------------------------------------------------------------- values
    csv("not-a-number-2023.csv", LOTS + ",pH", "A-01,2023,QX-7,abc,14.0,3.4", "A-02,2023,QX-9,23.1,13.4,three", "A-03,2023,QX-7,25.2,n/a,3.5")
    csv("ambiguous-comma-2023.csv", LOTS + ",Must volume (L)", 'A-01,2023,QX-7,24.0,14.0,"4,200"', 'A-02,2023,QX-9,"23,1",13.4,1000')
    csv("out-of-range-2023.csv", LOTS + ",RS (g/L),pH,YAN (mg N/L)", "A-01,2023,QX-7,8.0,14.0,1.0,3.4,200", "A-02,2023,QX-9,23.1,25.0,1.0,3.4,200", "A-03,2023,QX-7,25.2,14.9,-3,3.4,200", "A-04,2023,QX-7,24.2,14.1,1.0,9.9,5000")
    csv("alcohol-as-fraction-2023.csv", LOTS, "A-01,2023,QX-7,24.0,0.141", "A-02,2023,QX-9,23.1,13.4")
    csv("percent-signs-2023.csv", LOTS + ",RS (g/L),pH", "A-01,2023,QX-7,24.0%,14.0%,0.15%,3.4", "A-02,2023,QX-9,23.1,13.4,1.2,3.4%")
    csv("units-in-cells-2023.csv", LOTS + ",RS (g/L),Temp (°C)", "A-01,2023,QX-7,24.5 Bx,13.8 %vol,1.4 g/L,75 F", "A-02,2023,QX-9,1.095 SG,13.4,1.2,22 C")
    csv("sg-column-one-brix-2023.csv", "Lot,Vintage,Yeast,Must SG,Alcohol % v/v", "A-01,2023,QX-7,1.101,14.0", "A-02,2023,QX-9,24.1,13.4", "A-03,2023,QX-7,1.095,13.1")
    csv("fahrenheit-in-celsius-2023.csv", LOTS + ",Peak temp (°C)", "A-01,2023,QX-7,24.0,14.0,85", "A-02,2023,QX-9,23.1,13.4,88", "A-03,2023,QX-7,25.2,14.9,29")
    csv("one-fahrenheit-in-celsius-2023.csv", LOTS + ",Peak temp (°C)", "A-01,2023,QX-7,24.0,14.0,85", "A-02,2023,QX-9,23.1,13.4,28", "A-03,2023,QX-7,25.2,14.9,29")
    csv("sugar-unit-from-values-sg-2023.csv", "Lot,Vintage,Yeast,Start sugar,Alcohol % v/v", "A-01,2023,QX-7,1.101,14.0", "A-02,2023,QX-9,1.096,13.4")
    csv("sugar-unit-from-values-oechsle-2023.csv", "Lot,Vintage,Yeast,Must weight,Alcohol % v/v", "A-01,2023,QX-7,101,14.0", "A-02,2023,QX-9,96,13.4")
    csv("sugar-unit-from-values-gl-2023.csv", "Lot,Vintage,Yeast,Must sugar,Alcohol % v/v", "A-01,2023,QX-7,238,14.0", "A-02,2023,QX-9,226,13.4")
    csv("baume-header-2023.csv", "Lot,Vintage,Yeast,Baumé,Alcohol % v/v", "A-01,2023,QX-7,13.4,14.0", "A-02,2023,QX-9,12.9,13.4")
    csv("baume-values-no-unit-2023.csv", "Lot,Vintage,Yeast,Start sugar,Alcohol % v/v", "A-01,2023,QX-7,13.4,14.0", "A-02,2023,QX-9,12.9,13.4", "A-03,2023,QX-7,14.0,14.6")
    csv("alcohol-in-grams-2023.csv", "Lot,Vintage,Yeast,Brix,Alcohol", "A-01,2023,QX-7,24.0,110.5", "A-02,2023,QX-9,23.1,105.8")
    csv("dates-ambiguous-2023.csv", LOTS + ",Inoculated", "A-01,2023,QX-7,24.0,14.0,03/04/2023", "A-02,2023,QX-9,23.1,13.4,04/05/2023")
    csv("dates-settled-by-column-2023.csv", LOTS + ",Inoculated", "A-01,2023,QX-7,24.0,14.0,03/09/2023", "A-02,2023,QX-9,23.1,13.4,25/09/2023")
    csv("dates-many-forms-2023.csv", LOTS + ",Inoculated,Dry date", "A-01,2023,QX-7,24.0,14.0,2023-09-03,3 Oct 2023", "A-02,2023,QX-9,23.1,13.4,04.09.2023,\"Oct 5, 2023\"", "A-03,2023,QX-7,25.2,14.9,45172,2023-02-30")
    csv("season-problems.csv", LOTS, "A-01,2023,QX-7,24.0,14.0", "A-02,last year,QX-9,23.1,13.4", "A-03,,QX-7,25.2,14.9")
    csv("unknown-colour-2023.csv", LOTS + ",Colour", "A-01,2023,QX-7,24.0,14.0,red", "A-02,2023,QX-9,23.1,13.4,orange", "A-03,2023,QX-7,25.2,14.9,blanc")
    csv("spelling-variants-2023.csv", LOTS + ",Vessel", "A-01,2023,QX-7,24.0,14.0,Barrel", "A-02,2023,qx-7,23.1,13.4,barrel", "A-03,2023,QX 7,25.2,14.9,Barrel", "A-04,2023,QX-9,23.8,13.9,BARREL")
    csv("duplicate-lot-2023.csv", LOTS, *GOOD, "A-02,2023,QX-9,23.4,13.5")
    csv("required-values-empty-2023.csv", LOTS, "A-01,2023,,24.0,14.0", ",2023,QX-9,23.1,13.4", "A-03,2023,QX-7,,14.9")

    # ---------------------------------------------------------------- text a workbook, chart or terminal cannot hold
    csv("vertical-tab-in-strain-2023.csv", LOTS + ",Notes", "A-01,2023,QX\v7,24.0,14.0,first\vsecond line", "A-02,2023,QX-9,23.1,13.4,ok")
    csv("escape-in-strain-2023.csv", LOTS, "A-01,2023,QX-7\x1b[31m,24.0,14.0", "A-02,2023,QX-9,23.1,13.4")
    csv("escape-in-number-2023.csv", LOTS, "A-01,2023,QX-7,2\x1b[2J4.0,14.0", "A-02,2023,QX-9,23.1,13.4")
    csv("long-note-2023.csv", LOTS + ",Notes", "A-01,2023,QX-7,24.0,14.0," + "n" * 40_000, "A-02,2023,QX-9,23.1,13.4,short")
    csv("long-number-cell-2023.csv", LOTS, "A-01,2023,QX-7," + "9" * 40_000 + ",14.0", "A-02,2023,QX-9,23.1,13.4")
    csv("control-in-header-2023.csv", "Lot,Vintage,Yeast\x07,Brix,Alcohol % v/v", *GOOD)
    csv("newline-in-lot-id-2023.csv", LOTS, '"A-\n01",2023,QX-7,24.0,14.0', "A-02,2023,QX-9,23.1,13.4")
    text("null-char-late-2023.csv", LOTS + "\n" + "\n".join(GOOD) + "\n" + "A-04,2023,QX-7,24.0,14.0" + "\n" * 70000 + "A-05\x00,2023\n")

    # ---------------------------------------------------------------- workbook cells the reader shows as empty
    xlsx("formula-without-value-2023.xlsx", [("Lots", [["Lot", "Vintage", "Yeast", "Brix", "Alcohol % v/v", "RS (g/L)", "Must volume (L)", "Water added (L)", "pH"],
        ["A-01", 2023, "QX-7", 24.0, 14.0, ("f", "ROUND(D2*0.05,2)"), 1000, 20, 3.4],
        ["A-02", 2023, "QX-9", 23.1, ("f", "ROUND(D3*0.59,2)"), 1.2, 1000, ("f", "G3*0.02"), 3.4],
        ["A-03", 2023, ("f", "VLOOKUP(A4,Strains!A:B,2,0)"), 25.2, 14.9, 1.0, None, None, ("f", "3.4")],
        ["A-04", 2023, "QX-7", 24.2, ("fv", "ROUND(D5*0.58,2)", 14.04), 1.1, None, None, 3.5],
        ["A-05", 2023, "QX-7", 24.4, ("f", "ROUND(D6*0.58,2)"), 1.0, None, None, ("shared", 0)]])])
    xlsx("error-cells-2023.xlsx", [("Lots", [["Lot", "Vintage", "Yeast", "Brix", "Alcohol % v/v", "pH", "Colour"],
        ["A-01", 2023, "QX-7", 24.0, ("e", "D2/0", "#DIV/0!"), 3.4, "red"],
        ["A-02", 2023, "QX-9", 23.1, 13.4, ("e", "NA()", "#N/A"), ("e", "X", "#NAME?")],
        ["A-03", 2023, "QX-7", 25.2, 14.9, 3.5, "white"]])])
    xlsx("percent-format-2023.xlsx", [("Lots", [["Lot", "Vintage", "Yeast", "Brix", "ABV"], ["A-01", 2023, "QX-7", 24.0, ("pct", 0.142)], ["A-02", 2023, "QX-9", 23.1, 13.4]])])
    rows = [orow(ostr("Lot"), ostr("Vintage"), ostr("Yeast"), ostr("Brix"), ostr("Alcohol % v/v"), ostr("RS (g/L)")),
            orow(ostr("A-01"), onum(2023), ostr("QX-7"), onum(24.0), onum(14.0), '<table:table-cell table:formula="of:=[.D2]*0.05"/>'),
            orow(ostr("A-02"), onum(2023), ostr("QX-9"), onum(23.1), '<table:table-cell table:formula="of:=1/0" office:value-type="float" office:value="0" calcext:value-type="error"><text:p>#DIV/0!</text:p></table:table-cell>', onum(1.2)),
            orow(ostr("A-03"), onum(2023), ostr("QX-7"), onum(25.2), '<table:table-cell office:value-type="percentage" office:value="0.149"><text:p>14.9%</text:p></table:table-cell>', onum(1.0),
                 '<table:table-cell table:number-columns-repeated="16000"/>'),
            orow('<table:table-cell table:number-columns-repeated="6"/>', repeat=1048000)]
    ods("hand-made-2023.ods", [("Lots", "".join(rows), None), ("Hidden workings", orow(ostr("Lot"), ostr("Yeast"), ostr("Brix"), ostr("ABV")) + orow(ostr("Z-1"), ostr("QX-1"), onum(20), onum(11)), "ta2")],
        automatic_styles='<style:style style:name="ta2" style:family="table"><style:table-properties table:display="false"/></style:style>')
    ods("ods-text-forms-2023.ods", [("Lots", "".join([
        orow(ostr("Lot"), ostr("Vintage"), ostr("Yeast"), ostr("Brix"), ostr("Alcohol % v/v"), ostr("Notes"), ostr("Inoculated")),
        orow(ostr("A-01"), onum(2023), ostr("QX-7"), onum(24.0), onum(14.0),
             '<table:table-cell office:value-type="string"><text:p>two<text:s text:c="3"/>spaces<text:tab/>tab</text:p><text:p>second paragraph</text:p><office:annotation xmlns:office="urn:oasis:names:tc:opendocument:xmlns:office:1.0"><text:p>a comment, not the value</text:p></office:annotation></table:table-cell>',
             '<table:table-cell office:value-type="date" office:date-value="2023-09-03T08:30:00"><text:p>03/09/23 08:30</text:p></table:table-cell>'),
        orow(ostr("A-02"), onum(2023), ostr("QX-9"), onum(23.1), onum(13.4), '<table:covered-table-cell/>', '<table:table-cell office:value-type="boolean" office:boolean-value="true"><text:p>TRUE</text:p></table:table-cell>'),
    ]), None)])
    merged_cells()
    merged_header()
    ods("damaged-content.ods", [("Lots", orow(ostr("Lot"), ostr("Yeast")), None)])
    with zipfile.ZipFile(path("damaged-content.ods")) as zin, zipfile.ZipFile(path("damaged-content.tmp"), "w") as zout:
        for item in zin.infolist():
            body = zin.read(item.filename)
            zout.writestr(item, body[: len(body) - 40] if item.filename == "content.xml" else body)
    os.replace(path("damaged-content.tmp"), path("damaged-content.ods"))

    # ---------------------------------------------------------------- values that cannot be true together
    csv("residual-above-start-2023.csv", LOTS + ",RS (g/L)", "A-01,2023,QX-7,20.0,10.0,280", "A-02,2023,QX-9,23.1,13.4,1.2")
    csv("sugar-added-implausible-2023.csv", LOTS + ",Must volume (L),Sugar added (kg),Water added (L)", "A-01,2023,QX-7,24.0,14.0,1000,900,", "A-02,2023,QX-9,23.1,13.4,1000,,5000", "A-03,2023,QX-7,22.0,14.0,1000,20,")
    csv("additions-without-volume-2023.csv", LOTS + ",Water added (L),Sugar added (kg)", "A-01,2023,QX-7,24.0,13.2,50,", "A-02,2023,QX-9,23.1,13.4,,")
    csv("dates-far-from-season-2023.csv", LOTS + ",Inoculated,Dry date", "A-01,2023,QX-7,24.0,14.0,1900-01-01,2023-10-01", "A-02,2023,QX-9,23.1,13.4,2023-09-03,2031-10-01")

    # ---------------------------------------------------------------- logs (each with its lots, in one workbook)
    lots_sheet = ["Lot", "Vintage", "Yeast", "Brix", "Alcohol % v/v"]
    def logbook(name, log_rows, log_header=("Lot", "Vintage", "Timestamp", "Brix", "Temp °C"), log_sheet="Log"):
        xlsx(name, [("Lots", [lots_sheet, ["L-1", 2023, "QX-7", 24.0, 14.0], ["L-2", 2023, "QX-9", 23.0, 13.5]]), (log_sheet, [list(log_header)] + log_rows)])
    logbook("log-one-reading-2023.xlsx", [["L-1", 2023, "2023-09-03 08:00", 24.0, 18], ["L-2", 2023, "2023-09-03 08:00", 23.0, 18], ["L-2", 2023, "2023-09-04 08:00", 20.0, 20]])
    logbook("log-all-at-one-time-2023.xlsx", [["L-1", 2023, "2023-09-03 08:00", 24.0, 18], ["L-1", 2023, "2023-09-03 08:00", 23.9, 18], ["L-2", 2023, "2023-09-03 08:00", 23.0, 18], ["L-2", 2023, "2023-09-05 08:00", 15.0, 22]])
    logbook("log-reading-dated-1900-2023.xlsx", [["L-1", 2023, "2023-09-03 08:00", 24.0, 18], ["L-1", 2023, "1900-01-01 08:00", 22.0, 19], ["L-1", 2023, "2023-09-05 08:00", 16.0, 23], ["L-2", 2023, "2023-09-03 08:00", 23.0, 18], ["L-2", 2023, "2023-09-06 08:00", 9.0, 24]])
    logbook("log-timestamps-utc-2023.xlsx", [["L-1", 2023, "2023-09-03T08:00:00Z", 24.0, 18], ["L-1", 2023, "2023-09-04T08:00:00Z", 20.0, 21], ["L-2", 2023, "2023-09-03T08:00:00Z", 23.0, 18], ["L-2", 2023, "2023-09-04T08:00:00Z", 19.0, 22]])
    logbook("log-timestamps-offset-2023.xlsx", [["L-1", 2023, "2023-09-03 08:00+02:00", 24.0, 18], ["L-1", 2023, "2023-09-04 08:00+02:00", 20.0, 21], ["L-2", 2023, "2023-09-03T08:00:00.000+0200", 23.0, 18], ["L-2", 2023, "2023-09-04T08:00:00.000+0200", 19.0, 22]])
    logbook("log-date-and-time-columns-2023.xlsx", [["L-1", "2023-09-03", "08:00", 24.0], ["L-1", "2023-09-04", "25:70", 20.0], ["L-1", "2023-09-05", "8.30", 16.0], ["L-2", "2023-09-03", "2:30 PM", 23.0], ["L-2", "2023-09-04", "", 19.0]], log_header=("Lot", "Date", "Time", "Brix reading"))
    logbook("log-no-reading-2023.xlsx", [["L-1", 2023, "2023-09-03 08:00", None, None], ["L-1", 2023, "", 22.0, 19], ["L-1", 2023, "2023-09-04 08:00", 20.0, 21], ["L-1", 2023, "2023-09-05 08:00", 16.0, 23]])
    logbook("log-fahrenheit-2023.xlsx", [["L-1", 2023, "2023-09-03 08:00", 24.0, 64], ["L-1", 2023, "2023-09-04 08:00", 20.0, 72], ["L-2", 2023, "2023-09-03 08:00", 23.0, 65], ["L-2", 2023, "2023-09-04 08:00", 19.0, 75]], log_header=("Lot", "Vintage", "Timestamp", "Brix", "Temp"))
    logbook("log-sg-2023.xlsx", [["L-1", 2023, "2023-09-03 08:00", 1.101, 18], ["L-1", 2023, "2023-09-04 08:00", 1.080, 21], ["L-1", 2023, "2023-09-05 08:00", 24.0, 21], ["L-2", 2023, "2023-09-03 08:00", 1.096, 18], ["L-2", 2023, "2023-09-05 08:00", 0.995, 22]], log_header=("Lot", "Vintage", "Timestamp", "SG", "Temp °C"))
    logbook("log-without-lot-2023.xlsx", [["L-1", 2023, "2023-09-03 08:00", 24.0, 18], ["L-1", 2023, "2023-09-04 08:00", 20.0, 21], ["Z-9", 2023, "2023-09-03 08:00", 23.0, 18], ["Z-9", 2023, "2023-09-04 08:00", 19.0, 22]])
    xlsx("log-sheet-per-lot-2023.xlsx", [("Lots", [lots_sheet, ["23-004", 2023, "QX-7", 24.0, 14.0]]), ("Lot 23-004", [["Timestamp", "Brix", "Temp °C"], ["2023-09-03 08:00", 24.0, 18], ["2023-09-04 08:00", 20.0, 21]])])
    xlsx("log-only-no-lots-2023.xlsx", [("Log", [["Lot", "Timestamp", "Brix"], ["L-1", "2023-09-03 08:00", 24.0], ["L-1", "1900-01-01 08:00", 22.0], ["L-1", "2023-09-05 08:00", 16.0]])])

    # ---------------------------------------------------------------- everyday headers
    csv("everyday-headers-2023.csv", "Lot #,Vintage,Yeast used,Tank/Vessel,Starting Brix,Vol (gal),Water Add (gal),ABV %", "A-01,2023,QX-7,Tank 3,24.0,500,10,14.0", "A-02,2023,QX-9,Barrel,23.1,60,,13.4")
    csv("german-headers-2023.csv", "Lot,Jahrgang,Hefe,Mostgewicht (°Oe),Alkohol (% vol),Restzucker (g/L)", "A-01,2023,QX-7,101,14.0,1.5", "A-02,2023,QX-9,96,13.4,2.0")
    csv("french-headers-2023.csv", "Lot,Millésime,Levure,Densité,TAV,Sucres résiduels", "A-01,2023,QX-7,1.101,14.0,1.5", "A-02,2023,QX-9,1.096,13.4,2.0")

    # ---------------------------------------------------------------- made by LibreOffice
    csv("lo-source-2023.csv", LOTS + ",RS (g/L),Inoculated", "A-01,2023,QX-7,24.1,14.2,1.5,2023-09-03 08:00", "A-02,2023,QX-9,23.5,13.6,2.1,2023-09-04", "A-03,2023,QX-9,23.9,13.9,2.1,2023-09-05")
    convert("lo-source-2023.csv", "ods", "libreoffice-2023.ods")
    convert("lo-source-2023.csv", "xlsx", "libreoffice-2023.xlsx")
    convert("lo-source-2023.csv", "xls", "libreoffice-2023.xls")
    shutil.copy(path("libreoffice-2023.xls"), path("old-workbook-named-xlsx-2023.xlsx"))
    with tempfile.TemporaryDirectory() as d:
        # The merged blocks as an Excel 97-2003 workbook, as LibreOffice saves one.
        shutil.copy(path("merged-cells-2023.xlsx"), d)
        subprocess.run(["soffice", "--headless", "--convert-to", "xls", "--outdir", d, os.path.join(d, "merged-cells-2023.xlsx")], check=True, capture_output=True, timeout=180)
        shutil.copy(os.path.join(d, "merged-cells-2023.xls"), path("merged-cells-2023.xls"))
    os.remove(path("lo-source-2023.csv"))

    # ---------------------------------------------------------------- a folder of mixed files
    csv("folder-mixed/lots-2023.csv", LOTS, *GOOD)
    csv("folder-mixed/more/lots-2024.csv", LOTS, "B-01,2024,QX-7,24.0,14.0")
    text("folder-mixed/more/readme.txt", "These files are invented.\n")
    text("folder-mixed/more/log-2024.tsv", "Lot\tTimestamp\tBrix\nB-01\t2024-09-03 08:00\t24\nB-01\t2024-09-04 08:00\t20\n")
    shutil.copy(path("hand-made-2023.ods"), path("folder-mixed/more/deeper/lots-2023b.ods"))
    raw("folder-mixed/photo.jpg", b"\xff\xd8\xff")
    text("folder-mixed/~$lots-2023.xlsx", "lock")
    text("folder-mixed/.~lock.lots-2023.ods#", "lock")
    text("folder-mixed/report.pdf", "%PDF-1.4")
    os.makedirs(path("folder-empty/sub"), exist_ok=True)
    text("folder-empty/sub/.keep", "")
    # ---------------------------------------------------------------- inputs the fuzz harness found (fuzz/run.sh)
    found = os.path.join(HERE, "fuzz-found")
    for name in sorted(os.listdir(found)):
        shutil.copy(os.path.join(found, name), path(name))
    print("corpus written to", OUT)


def unicode_without_mark():
    """UTF-16 without a byte-order mark (little- and big-endian), and UTF-32 with one."""
    body = LOTS + ",Notes\n" + "\n".join(GOOD) + ",levée à froid 12 °C\n"
    text("utf16le-no-bom-2023.csv", body, encoding="utf-16-le")
    text("utf16be-no-bom-2023.csv", body, encoding="utf-16-be")
    text("utf32-bom-2023.csv", body, encoding="utf-32")


def named_wrong():
    """A tab-separated export and a web page named .xls ("for Excel"); .xls and .xlsx content under each other's name."""
    text("tab-text-named-2023.xls", "Lot\tVintage\tYeast\tBrix\tAlcohol % v/v\n" + "\n".join(g.replace(",", "\t") for g in GOOD) + "\n")
    text("web-page-named-2023.xls", "<html><body><table><tr><td>Lot</td><td>Yeast</td></tr><tr><td>A-01</td><td>QX-7</td></tr></table></body></html>\n")


def merged_cells():
    """A strain merged over three lots, under a title merged across the sheet, as .xlsx and .ods."""
    header = ["Lot", "Vintage", "Yeast", "Brix", "Alcohol % v/v"]
    xlsx("merged-cells-2023.xlsx", [("Lots", [
        ["Tallowmere Estate lots 2023"],
        header,
        ["A-01", 2023, "QX-7", 24.0, 14.0],
        ["A-02", 2023, None, 23.1, 13.4],
        ["A-03", 2023, None, 25.2, 14.9],
        ["A-04", 2023, "QX-9", 22.8, 13.2],
    ], False, ["A1:E1", "C3:C5"])])
    spanned = '<table:table-cell table:number-rows-spanned="3" office:value-type="string"><text:p>QX-7</text:p></table:table-cell>'
    title = '<table:table-cell table:number-columns-spanned="5" office:value-type="string"><text:p>Tallowmere Estate lots 2023</text:p></table:table-cell>'
    covered = "<table:covered-table-cell/>"
    ods("merged-cells-2023.ods", [("Lots", "".join([
        orow(title, '<table:covered-table-cell table:number-columns-repeated="4"/>'),
        orow(*[ostr(h) for h in header]),
        orow(ostr("A-01"), onum(2023), spanned, onum(24.0), onum(14.0)),
        orow(ostr("A-02"), onum(2023), covered, onum(23.1), onum(13.4)),
        orow(ostr("A-03"), onum(2023), covered, onum(25.2), onum(14.9)),
        orow(ostr("A-04"), onum(2023), ostr("QX-9"), onum(22.8), onum(13.2)),
    ]), None)])


def merged_header():
    """A log whose headers are merged down two rows (Lot, Date, Time) beside group labels over the second header row
    ("Must" over Brix and Temp), as .xlsx and .ods: a block within the header rows is read with no merged-cells
    warning; in the .xlsx a lot id merged over its three data rows still gives one."""
    top = ["Lot", "Date", "Time", "Must", None, "Cap"]
    second = [None, None, None, "Brix", "Temp °C", "Temp °C"]
    data = [["M1", "2026-09-05", "08:00", 23.5, 18.0, 19.5], [None, "2026-09-06", "08:00", 21.0, 22.0, 25.0], [None, "2026-09-07", "08:00", 17.2, 25.5, 29.0]]
    xlsx("merged-header-2026.xlsx", [("Log 2026", [top, second] + data, False, ["A1:A2", "B1:B2", "C1:C2", "D1:E1", "A3:A5"])])
    down = lambda v: f'<table:table-cell table:number-rows-spanned="2" office:value-type="string"><text:p>{esc(v)}</text:p></table:table-cell>'
    covered = "<table:covered-table-cell/>"
    ods("merged-header-2026.ods", [("Log 2026", "".join([
        orow(down("Lot"), down("Date"), down("Time"), '<table:table-cell table:number-columns-spanned="2" office:value-type="string"><text:p>Must</text:p></table:table-cell>', covered, ostr("Cap")),
        orow(covered, covered, covered, ostr("Brix"), ostr("Temp °C"), ostr("Temp °C")),
    ] + [orow(ostr("M1"), ostr(d[1]), ostr(d[2]), onum(d[3]), onum(d[4]), onum(d[5])) for d in data]), None)])


def make_overlapping_zip():
    """Two workbook parts whose directory entries point at the same compressed data (the overlap of a zip bomb)."""
    body = zlib.compress(b"<worksheet/>" * 2000)[2:-4]
    crc = zlib.crc32(b"<worksheet/>" * 2000)
    usize = len(b"<worksheet/>" * 2000)
    out = bytearray()
    name1, name2 = b"xl/workbook.xml", b"xl/worksheets/sheet1.xml"
    local = struct.pack("<IHHHHHIIIHH", 0x04034B50, 20, 0, 8, 0, 0, crc, len(body), usize, len(name1), 0) + name1 + body
    out += local
    cd = b""
    for name in (name1, name2):
        cd += struct.pack("<IHHHHHHIIIHHHHHII", 0x02014B50, 20, 20, 0, 8, 0, 0, crc, len(body), usize, len(name), 0, 0, 0, 0, 0, 0) + name
    # a third entry claiming the same data once more, so the claims exceed the file
    cd += struct.pack("<IHHHHHHIIIHHHHHII", 0x02014B50, 20, 20, 0, 8, 0, 0, crc, len(body), usize, len(b"xl/x.xml"), 0, 0, 0, 0, 0, 0) + b"xl/x.xml"
    end = struct.pack("<IHHHHIIH", 0x06054B50, 0, 0, 3, 3, len(cd), len(out), 0)
    raw("zip-parts-overlap.xlsx", bytes(out + cd + end))


def make_lying_zip():
    """A workbook whose sheet part claims 300 bytes uncompressed but inflates to 30 MB."""
    xlsx("zip-lying-size.xlsx", [("Lots", [["Lot", "Yeast", "Brix", "ABV"], ["A-01", "QX-7", 24.0, 14.0]])])
    big = b'<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>' + b" " * 30_000_000 + b"</sheetData></worksheet>"
    with zipfile.ZipFile(path("zip-lying-size.xlsx")) as zin:
        items = [(i, zin.read(i.filename)) for i in zin.infolist()]
    with zipfile.ZipFile(path("zip-lying-size.xlsx"), "w", zipfile.ZIP_DEFLATED) as zout:
        for i, b in items:
            zout.writestr(i.filename, big if i.filename == "xl/worksheets/sheet1.xml" else b)
    data = bytearray(open(path("zip-lying-size.xlsx"), "rb").read())
    # patch the claimed uncompressed size of the sheet part in its local header and central directory entry
    target = b"xl/worksheets/sheet1.xml"
    for sig, off in ((b"PK\x03\x04", 22), (b"PK\x01\x02", 24)):
        start = 0
        while True:
            at = data.find(sig, start)
            if at < 0:
                break
            name_at = at + (30 if sig == b"PK\x03\x04" else 46)
            if data[name_at:name_at + len(target)] == target:
                data[at + off:at + off + 4] = struct.pack("<I", 300)
            start = at + 4
    raw("zip-lying-size.xlsx", bytes(data))


if __name__ == "__main__":
    sys.exit(main())
