"""Writes the reader corpus: small sweep files, each with its expected reading or its expected
message, into this folder (files NN-name.csv/.tsv/.txt and expected.csv). The expectations are
written here by hand from the file's content; ReaderCorpusTest checks Viscarta against them.

Run: python3 make_corpus.py
"""
import csv
import os

HERE = os.path.dirname(os.path.abspath(__file__))
H = "frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n"
cases = []  # (name, bytes, outcome, detail)


def ok(name, text, samples, points, storage0, enc="utf-8"):
    """storage0: E' of the first point of the first sweep, in Pa (after SI conversion)."""
    cases.append((name, text.encode(enc) if isinstance(text, str) else text, "ok", f"{samples};{points};{storage0!r}"))


def err(name, text, line, column, words, enc="utf-8"):
    cases.append((name, text.encode(enc) if isinstance(text, str) else text, "error", f"{line};{column};{words}"))


# layouts and dialects that must read
ok("plain.csv", H + "1,100,10\n2,110,12\n", 1, 2, 100.0)
ok("metadata.csv", "# sample: s1\n# temperature: 23 °C\n" + H + "1,100,10\n", 1, 1, 100.0)
ok("tidy.csv", "sample,replicate,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\na,1,1,5,1\na,2,1,6,1\nb,1,1,7,1\n", 3, 3, 5.0)
ok("tidy-group.csv", "sample,group,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\na,g,1,5,1\nb,h,1,7,1\n", 2, 2, 5.0)
ok("tidy-temperature.csv", "sample,temperature [°C],frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\na,10,1,5,1\na,20,1,4,1\n", 2, 2, 5.0)
ok("wide.csv", "frequency [Hz],A E' [Pa],A E'' [Pa],B E' [Pa],B E'' [Pa]\n1,5,1,6,2\n", 2, 2, 5.0)
ok("semicolon-comma.csv", "frequency [Hz];storage_modulus [Pa];loss_modulus [Pa]\n0,5;100,5;10\n", 1, 1, 100.5)
ok("tab.tsv", "frequency [Hz]\tstorage_modulus [Pa]\tloss_modulus [Pa]\n1\t100\t10\n", 1, 1, 100.0)
ok("tab-comma.txt", "frequency [Hz]\tstorage_modulus [Pa]\tloss_modulus [Pa]\n1\t100,5\t10\n", 1, 1, 100.5)
ok("bom.csv", b"\xef\xbb\xbf" + (H + "1,100,10\n").encode(), 1, 1, 100.0)
ok("crlf.csv", (H + "1,100,10\n2,110,12\n").replace("\n", "\r\n"), 1, 2, 100.0)
ok("quoted.csv", '"frequency [Hz]","storage_modulus [Pa]","loss_modulus [Pa]"\n"1","100","10"\n', 1, 1, 100.0)
ok("blank-and-comment-lines.csv", "\n# a note\n" + H + "1,100,10\n\n# another\n2,110,12\n", 1, 2, 100.0)
ok("latin1.csv", "# tip_radius: 5 µm\n# temperature: 23 °C\n" + H + "1,100,10\n", 1, 1, 100.0, enc="latin-1")
ok("scientific.csv", H + "1e0,1.0E2,1e+1\n", 1, 1, 100.0)
ok("parentheses.csv", "frequency (Hz),storage_modulus (kPa),loss_modulus (kPa)\n1,1,0.1\n", 1, 1, 1000.0)
ok("kpa.csv", "frequency [Hz],storage_modulus [kPa],loss_modulus [kPa]\n1,2,0.2\n", 1, 1, 2000.0)
ok("mpa.csv", "frequency [Hz],storage_modulus [MPa],loss_modulus [MPa]\n1,2,0.2\n", 1, 1, 2e6)
ok("gpa.csv", "frequency [Hz],storage_modulus [GPa],loss_modulus [GPa]\n1,2,0.2\n", 1, 1, 2e9)
ok("n-per-mm2.csv", "frequency [Hz],storage_modulus [N/mm²],loss_modulus [N/mm²]\n1,2,0.2\n", 1, 1, 2e6)
ok("khz.csv", "frequency [kHz],storage_modulus [Pa],loss_modulus [Pa]\n0.001,100,10\n", 1, 1, 100.0)
ok("rad-per-s.csv", "angular_frequency [rad/s],storage_modulus [Pa],loss_modulus [Pa]\n6.283185307179586,100,10\n", 1, 1, 100.0)
ok("omega.csv", "ω [rad/s],E′ [Pa],E″ [Pa]\n1,100,10\n", 1, 1, 100.0)
ok("g-prime.csv", "f [Hz],G' [Pa],G'' [Pa]\n1,100,10\n", 1, 1, 100.0)
ok("tan-delta.csv", "frequency [Hz],|E*| [Pa],tan δ\n1,500,0.75\n", 1, 1, 400.0)
ok("phase-deg.csv", "frequency [Hz],complex_modulus_magnitude [Pa],phase_angle [deg]\n1,200,60\n", 1, 1, 100.00000000000003)
ok("phase-rad.csv", "frequency [Hz],complex_modulus_magnitude [Pa],phase_angle [rad]\n1,100,0\n", 1, 1, 100.0)
ok("compliance.csv", "frequency [Hz],J' [1/Pa],J'' [1/Pa]\n1,0.003,0.004\n", 1, 1, 120.0)
ok("viscosity.csv", "angular_frequency [rad/s],η' [Pa·s],η'' [Pa·s]\n2,50,20\n", 1, 1, 40.0)
ok("unsorted.csv", H + "10,120,14\n1,100,10\n", 1, 2, 100.0)
ok("negative-loss.csv", H + "1,100,-1\n2,110,12\n", 1, 2, 100.0)

# bad files that must be refused with a file:line[:column] message
err("empty.csv", "", 1, 0, "empty")
err("header-only.csv", H, 1, 0, "not followed by any data")
err("no-frequency.csv", "storage_modulus [Pa],loss_modulus [Pa]\n100,10\n", 1, 0, "no frequency column")
err("non-numeric.csv", H + "1,100,10\n2,abc,12\n", 3, 2, "not a number")
err("negative-frequency.csv", H + "-1,100,10\n", 2, 1, "greater than zero")
err("zero-frequency.csv", H + "0,100,10\n", 2, 1, "greater than zero")
err("unknown-unit.csv", "frequency [Hz],storage_modulus [psi],loss_modulus [Pa]\n1,100,10\n", 1, 2, "unknown unit")
err("unknown-header.csv", H.strip() + ",colour\n1,100,10,red\n", 1, 4, "unknown column header")
err("missing-unit.csv", "frequency [Hz],storage_modulus,loss_modulus [Pa]\n1,100,10\n", 1, 2, "gives no unit")
err("short-row.csv", H + "1,100\n", 2, 3, "fields")
err("zero-storage.csv", H + "1,0,10\n", 2, 2, "greater than zero")
err("nan.csv", H + "1,NaN,10\n", 2, 2, "not a number")
err("infinity.csv", H + "1,Infinity,10\n", 2, 2, "not a number")
err("empty-cell.csv", H + "1,,10\n", 2, 2, "empty cell")
err("duplicate-column.csv", "frequency [Hz],storage_modulus [Pa],storage_modulus [kPa],loss_modulus [Pa]\n1,1,1,1\n", 1, 3, "both hold")
err("both-frequencies.csv", "frequency [Hz],angular_frequency [rad/s],storage_modulus [Pa],loss_modulus [Pa]\n1,6.28,1,1\n", 1, 2, "keep one")
err("incomplete-moduli.csv", "frequency [Hz],storage_modulus [Pa]\n1,100\n", 1, 0, "incomplete")
err("mixed-kinds.csv", "frequency [Hz],E' [Pa],G'' [Pa]\n1,100,10\n", 1, 3, "mix tensile")
err("bad-modulus-line.csv", "# modulus: bulk\n" + H + "1,100,10\n", 1, 0, "not understood")
err("group-conflict.csv", "sample,group,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\na,g,1,5,1\na,h,2,5,1\n", 3, 2, "one group")
err("wide-half-pair.csv", "frequency [Hz],A E' [Pa],B E' [Pa],B E'' [Pa]\n1,1,2,3\n", 1, 0, "only one")

for f in os.listdir(HERE):
    if f[:2].isdigit():
        os.remove(os.path.join(HERE, f))
rows = []
for i, (name, data, outcome, detail) in enumerate(cases, start=1):
    fname = f"{i:02d}-{name}"
    with open(os.path.join(HERE, fname), "wb") as fh:
        fh.write(data)
    rows.append([fname, outcome, detail])
with open(os.path.join(HERE, "expected.csv"), "w", newline="", encoding="utf-8") as fh:
    w = csv.writer(fh)
    w.writerow(["file", "outcome", "detail"])
    w.writerows(rows)
print(f"{len(cases)} corpus files")
