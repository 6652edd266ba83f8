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


def ok(name, text, samples, points, storage0, enc="utf-8", **expect):
    """storage0: E' of the first point of the first sweep, in Pa (after SI conversion).
    expect: further checks of the first sweep and the file — sample, replicate, temperature (°C),
    attribute ("header=value"), warning (words a warning contains), nowarning (words none contains)."""
    extra = "".join(f";{k}={v}" for k, v in expect.items())
    cases.append((name, text.encode(enc) if isinstance(text, str) else text, "ok", f"{samples};{points};{storage0!r}{extra}"))


def ramp(name, text, ramps, points, storage0, **expect):
    """A file of temperature ramps: how many (sample × replicate × frequency), their points, E' of
    the coldest point of the first ramp; expect: frequency (Hz) of the first ramp, unsorted (points
    sorted into place), heating (K/min), sweeps (frequency sweeps besides), warning."""
    extra = "".join(f";{k}={v}" for k, v in expect.items())
    cases.append((name, text.encode("utf-8"), "ramp", f"{ramps};{points};{storage0!r}{extra}"))


def timetest(name, text, tests, points, value0, **expect):
    """A file of time-domain tests: how many (sample × replicate), their points, M(t) or J(t) of the
    earliest point of the first test in SI; expect: type (RELAXATION or CREEP), kind (tensile, shear),
    time0 (the earliest time in s), sweeps (frequency sweeps besides), warning."""
    extra = "".join(f";{k}={v}" for k, v in expect.items())
    cases.append((name, text.encode("utf-8"), "timetest", f"{tests};{points};{value0!r}{extra}"))


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
# a descriptive column of unknown name beside complete moduli is an attribute of the sample
ok("unknown-header.csv", H.strip() + ",colour\n1,100,10,red\n", 1, 1, 100.0, attribute="colour=red")
err("missing-unit.csv", "frequency [Hz],storage_modulus,loss_modulus [Pa]\n1,100,10\n", 1, 2, "gives no unit")
# a short row's missing cells are blank: that point is left out with a warning
ok("short-row.csv", H + "1,100\n2,110,12\n", 1, 1, 110.0, warning="left out")
err("zero-storage.csv", H + "1,0,10\n", 2, 2, "greater than zero")
ok("nan.csv", H + "1,NaN,10\n2,110,12\n", 1, 1, 110.0, warning="1 point was left out")
err("infinity.csv", H + "1,Infinity,10\n", 2, 2, "not a number")
ok("empty-cell.csv", H + "1,,10\n2,110,12\n", 1, 1, 110.0, warning="on line 2")
err("duplicate-column.csv", "frequency [Hz],storage_modulus [Pa],storage_modulus [kPa],loss_modulus [Pa]\n1,1,1,1\n", 1, 3, "both hold")
err("both-frequencies.csv", "frequency [Hz],angular_frequency [rad/s],storage_modulus [Pa],loss_modulus [Pa]\n1,6.28,1,1\n", 1, 2, "keep one")
err("incomplete-moduli.csv", "frequency [Hz],storage_modulus [Pa]\n1,100\n", 1, 0, "incomplete")
err("mixed-kinds.csv", "frequency [Hz],E' [Pa],G'' [Pa]\n1,100,10\n", 1, 3, "mix tensile")
err("bad-modulus-line.csv", "# modulus: bulk\n" + H + "1,100,10\n", 1, 0, "not understood")
err("group-conflict.csv", "sample,group,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\na,g,1,5,1\na,h,2,5,1\n", 3, 2, "one group")
err("wide-half-pair.csv", "frequency [Hz],A E' [Pa],B E' [Pa],B E'' [Pa]\n1,1,2,3\n", 1, 0, "only one")

# --- exports as lab instruments and spreadsheets typically write them (invented values; the general
# traits of lab exports — preambles, units rows, extra columns, blocks, gaps, footers — not any one
# instrument's format). Expectations written by hand from each file's content.
T = "\t"
ok("export-preamble.txt",
   "Sample name:\tCollagen gel A\nOperator:\tinvented demo\nTemperature:\t37.0 °C\nGeometry:\tparallel plate 20 mm\n"
   "Test:\tfrequency sweep\n\nPoint\tFrequency (Hz)\tG' (Pa)\tG'' (Pa)\tTan(delta)\tStrain (%)\tTorque (µN.m)\n"
   "1\t0.1\t820\t95\t0.1159\t1.0\t12.1\n2\t1\t900\t120\t0.1333\t1.0\t13.3\n3\t10\t1010\t160\t0.1584\t1.0\t15.0\n",
   1, 3, 820.0, sample="Collagen gel A", temperature="37.0", warning="columns not used", nowarning="disagrees")
ok("units-row.csv", "Frequency,Storage modulus,Loss modulus\nHz,kPa,kPa\n1,2,0.2\n10,2.5,0.4\n", 1, 2, 2000.0)
ok("units-row-brackets.csv", "Freq;E';E''\n[Hz];[MPa];[MPa]\n0,1;1,5;0,1\n1;1,6;0,12\n", 1, 2, 1.5e6)
ok("units-row-rad.tsv", "Angular frequency\tG'\tG''\tTan d\nrad/s\tPa\tPa\t\n6.283185307179586\t100\t10\t0.1\n", 1, 1, 100.0)
ok("units-row-parentheses.csv", "Frequency,Storage modulus,Loss modulus,Phase angle\n(Hz),(Pa),(Pa),(deg)\n1,100,10,5.710593\n",
   1, 1, 100.0, nowarning="disagrees")
ok("blank-cells.csv", H + "0.1,90,8\n0.2,,9\n0.5,--,9\n1,n/a,10\n2,*,11\n5,NaN,12\n10,130,15\n", 1, 2, 90.0,
   warning="5 points were left out")
ok("footer.csv", H + "1,100,10\n2,110,12\nEnd of data\n", 1, 2, 100.0)
ok("footer-with-empties.csv", H + "1,100,10\n2,110,12\nMeasured with an invented instrument,,\n", 1, 2, 100.0)
ok("trailing-empty-columns.csv", H.strip() + ",,\n1,100,10,,\n2,110,12,,\n", 1, 2, 100.0)
ok("leading-empty-column.csv", "," + H + ",1,100,10\n,2,110,12\n", 1, 2, 100.0)
ok("blocks-own-headers.txt", "Sample: gel A\n" + H + "1,100,10\n2,110,12\n\nSample: gel B\n" + H + "1,200,20\n2,210,22\n",
   2, 4, 100.0, sample="gel A")
ok("blocks-header-once.csv", "Sample: gel A\n" + H + "1,100,10\n2,110,12\nSample: gel B\n1,200,20\n2,210,22\n", 2, 4, 100.0)
ok("blocks-no-sample.csv", H + "1,100,10\n2,110,12\n\nRun 2\n" + H + "1,105,11\n2,115,13\n", 2, 4, 100.0, replicate="1")
ok("fill-down-labels.csv", "sample,replicate,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n"
   "gel A,1,1,100,10\n,,2,110,12\n,2,1,101,10\n,,2,111,12\ngel B,1,1,200,20\n,,2,210,22\n", 3, 6, 100.0, sample="gel A")
ok("attributes.csv", "sample,composition (%),exposure (s),frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n"
   "gel A,10,6,1,100,10\ngel A,10,6,2,110,12\ngel B,15,12,1,200,20\n", 2, 3, 100.0, attribute="composition (%)=10",
   nowarning="not used")
ok("attribute-varies.csv", "sample,note,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n"
   "gel A,first,1,100,10\ngel A,second,2,110,12\n", 1, 2, 100.0, warning="varies within a sweep")
ok("redundant-tan-agrees.csv", "frequency [Hz],E' [Pa],E'' [Pa],tan δ\n1,100,10,0.1\n2,110,12,0.10909\n", 1, 2, 100.0,
   warning="columns not used", nowarning="disagrees")
ok("redundant-tan-disagrees.csv", "frequency [Hz],E' [Pa],E'' [Pa],tan δ\n1,100,10,0.1\n2,110,12,0.2\n", 1, 2, 100.0,
   warning="disagrees with the moduli by more than 1 % on 1 row")
ok("redundant-phase.csv", "frequency [Hz],G' [Pa],G'' [Pa],phase_angle [deg]\n1,100,100,45\n", 1, 1, 100.0, nowarning="disagrees")
ok("measured-temperature.csv", "frequency [Hz],temperature [°C],storage_modulus [Pa],loss_modulus [Pa]\n"
   "0.1,22.9,90,8\n1,23.1,100,10\n10,23.0,110,12\n", 1, 3, 90.0, temperature="23.0")
ramp("temperature-ramp.csv", "sample,temperature [°C],frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n"
     + "".join(f"film,{t},1,{1e9 / (1 + t)},{1e7}\n" for t in range(20, 80, 5)), 1, 12, 1e9 / 21, frequency="1.0")
ok("semicolon-preamble.csv", "Sample;gel C\nTemperature;25;°C\n\nFrequency;G';G''\nHz;Pa;Pa\n0,1;100,5;10\n1;120;12\n",
   1, 2, 100.5, sample="gel C", temperature="25.0")
ok("hash-preamble-spellings.csv", "# Sample name: gel D\n# Temperature: 30 °C\n" + H + "1,100,10\n", 1, 1, 100.0,
   sample="gel D", temperature="30.0")
ok("title-line.csv", "Frequency sweep export (invented)\n\n" + H + "1,100,10\n", 1, 1, 100.0)
err("unknown-needed.csv", "Frequenz (Hz),Speichermodul (Pa),Verlustmodul (Pa),Farbe\n1,100,10,rot\n", 1, 1,
    "--column \"Speichermodul (Pa)=storage_modulus [Pa]\"")
err("bad-preamble-temperature.csv", "Temperature: warm\n" + H + "1,100,10\n", 1, 0, "temperature")
err("overflow-after-unit.csv", "frequency [Hz],storage_modulus [GPa],loss_modulus [GPa]\n1,1e308,1\n", 2, 2, "once converted")
err("long-cell.csv", H + "1," + "x" * 200 + ",10\n", 2, 2, "x" * 80 + "…' in column")
ok("latin1-preamble.txt", "Sample name:\tGel ü\n\nFrequency (Hz)\tG' (Pa)\tG'' (Pa)\n1\t100\t10\n", 1, 1, 100.0,
   enc="cp1252", sample="Gel ü")
ok("crlf-preamble-units.csv", "Specimen: film 1\r\nFrequency,E',E''\r\nHz,MPa,MPa\r\n1,2,0.2\r\n", 1, 1, 2e6, sample="film 1")
ok("tab-decimal-comma-preamble.txt", "Probe:\tsphere 0,5 mm\nFrequency\tE'\tE''\nHz\tkPa\tkPa\n0,5\t1,5\t0,2\n", 1, 1, 1500.0)
ok("quoted-units-row.csv", '"Frequency","G\'","G\'\'"\n"Hz","Pa","Pa"\n"1","100","10"\n', 1, 1, 100.0)
err("all-blank.csv", H + "1,,10\n2,--,12\n", 2, 0, "no data row can be used")
ok("second-table-not-sweeps.csv", H + "1,100,10\n2,110,12\n\nStatistics\nMean,SD\n105,5\n", 1, 2, 100.0,
   warning="not a sweep table")
ok("storage-words.csv", "Freq. (Hz),Storage modulus (MPa),Loss modulus (MPa),Tan(delta),Normal force (N),Gap (mm)\n"
   "1,2,0.2,0.1,0.5,1.0\n", 1, 1, 2e6, warning="columns not used")
# temperature ramps (added after the cases above, so that their numbers stay)
RH = "sample,replicate,temperature [°C],frequency [Hz],E' [MPa],E'' [MPa]\n"
ramp("ramp-three-frequencies.csv", RH + "".join(f"varnish,{r},{t},{f},{2000 / (3 + t / 10)},{50 + t}\n"
     for r in (1, 2) for t in range(-20, 80, 10) for f in (0.3, 1, 10)), 6, 60, 2000 / (3 - 2) * 1e6, frequency="0.3")
ramp("ramp-one-frequency-file.csv", "# sample: acrylic\n# frequency: 10 Hz\n# heating rate: 3 °C/min\n"
     "temperature [°C],storage_modulus [Pa],loss_modulus [Pa]\n"
     + "".join(f"{t},{1e9 - 1e6 * t},{1e7}\n" for t in range(0, 30, 2)), 1, 15, 1e9, frequency="10.0", heating="3.0")
ramp("ramp-heating-then-cooling.csv", "sample,temperature [°C],frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n"
     + "".join(f"film,{t},1,{1e9 - 1e6 * t},{1e7}\n" for t in list(range(20, 60, 4)) + [50, 40]), 1, 12, 1e9 - 2e7,
     unsorted="2", warning="sorted by temperature")
ramp("ramp-beside-frequency-sweeps.csv", "sample,temperature [°C],frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n"
     + "".join(f"gel,23,{f},{100 + f},{10}\n" for f in (0.1, 0.3, 1, 3, 10, 30, 100))
     + "".join(f"film,{t},1,{1e9 - 1e6 * t},{1e7}\n" for t in range(20, 60, 4)), 1, 10, 1e9 - 2e7, sweeps="1")

# time-domain tests (added after the cases above, so that their numbers stay)
timetest("relaxation-one-test.csv", "# sample: gel\n# modulus: tensile\ntime [s],relaxation_modulus [kPa]\n"
         "0.01,30\n0.1,25\n1,21\n10,20\n", 1, 4, 30e3, type="RELAXATION", kind="tensile", time0="0.01")
timetest("creep-tidy-ms.csv", "sample,replicate,time [ms],J(t) [1/MPa]\nfilm,1,5,2\nfilm,1,50,2.5\nfilm,1,500,3\n"
         "film,2,5,2.1\nfilm,2,50,2.6\nfilm,2,500,3.2\n", 2, 6, 2e-6, type="CREEP", time0="0.005",
         warning="taken as tensile")
timetest("relaxation-shear-unsorted-with-clock.csv", "Elapsed time (s),G(t) (Pa),Temperature (°C)\n"
         "1,900,25\n0.1,1000,25\n10,800,25\n", 1, 3, 1000.0, type="RELAXATION", kind="shear", time0="0.1",
         warning="out of order")
err("relaxation-time-zero.csv", "time [s],E(t) [Pa]\n0,100\n1,90\n", 2, 1, "time must be greater than zero")
err("relaxation-beside-sweep-moduli.csv", "time [s],relaxation_modulus [Pa],storage_modulus [Pa]\n1,100,90\n", 1, 3,
    "a table holds one kind of test")
err("relaxation-without-time-unit.csv", "time,relaxation_modulus [Pa]\n1,100\n", 1, 0, "needs the time since the step")

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
