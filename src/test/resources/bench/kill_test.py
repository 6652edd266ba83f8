#!/usr/bin/env python3
"""Kill test: stops `report` and `library add` with SIGKILL at random moments, many times, and
checks what is left. Promises checked after every kill:

- library: every entry that was there is still there and readable (`library check` exits 0,
  `library list` names them all), and the entry being replaced holds either its old or its new
  version, never a mix;
- report: the output folder holds either the complete previous set or the complete new one:
  report.xlsx is a valid ZIP, report.html is whole, and both state the same run time.

Usage (after `mvn -q -B -DskipTests package`, from the repository's top folder):

    python3 src/test/resources/bench/kill_test.py [ROUNDS]
"""
import os
import random
import re
import shutil
import signal
import subprocess
import sys
import tempfile
import time
import zipfile

JAR = os.path.join("target", "viscarta.jar")


def run(args, **kw):
    return subprocess.run(["java", "-jar", JAR] + args, capture_output=True, text=True, **kw)


def kill_at_random(args, longest):
    p = subprocess.Popen(["java", "-jar", JAR] + args, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
    time.sleep(random.uniform(0, longest))
    killed = p.poll() is None
    if killed:
        p.send_signal(signal.SIGKILL)
    p.wait()
    return killed


def library_rounds(rounds, work):
    lib = os.path.join(work, "lib")
    shutil.copytree("reference-materials", lib)
    names = sorted(run(["library", "list", "--library", lib]).stdout.splitlines())
    new = os.path.join(work, "new.csv")
    with open(new, "w") as f:
        f.write("# temperature: 23 °C\n# method: rheometer\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n"
                "0.1,1000,100\n1,1200,150\n10,1500,300\n")
    killed = broken = 0
    for _ in range(rounds):
        killed += kill_at_random(["library", "add", new, "--name", "gelatin-8pct", "--class", "gel", "--replace",
                                  "--library", lib], 1.5)
        check = run(["library", "check", "--library", lib])
        listed = sorted(run(["library", "list", "--library", lib]).stdout.splitlines())
        if check.returncode != 0 or [n.split()[0] for n in listed if n.strip()] != [n.split()[0] for n in names if n.strip()]:
            broken += 1
            print("library broken after a kill:", check.stdout, check.stderr, file=sys.stderr)
    leftovers = [f for f in os.listdir(lib) if f.endswith(".part")]
    return killed, broken, len(leftovers)


def report_rounds(rounds, work):
    out = os.path.join(work, "report")
    args = ["report", "demo-data/paint-light-ageing.csv", "--models", "springpot,zener", "--out", out, "--force", "--quiet"]
    first = run(args + ["--timestamp", "2026-01-01T00:00:00Z"])
    assert first.returncode == 0, first.stderr
    killed = broken = 0
    for i in range(rounds):
        stamp = "2026-01-01T00:%02d:%02dZ" % ((i + 1) // 60 % 60, (i + 1) % 60)
        killed += kill_at_random(args + ["--timestamp", stamp], 6.0)
        try:
            with zipfile.ZipFile(os.path.join(out, "report.xlsx")) as z:
                assert z.testzip() is None
                core = z.read("docProps/core.xml").decode()
            html = open(os.path.join(out, "report.html"), encoding="utf-8").read()
            assert html.endswith("</html>\n")
            html_time = re.search(r"run at \(UTC\)</th><td>([^<]+)<", html).group(1)
            xlsx_time = re.search(r"<dcterms:created[^>]*>([^<]+)<", core).group(1)
            assert html_time.replace(".000", "") == xlsx_time.replace(".000", ""), (html_time, xlsx_time)
            assert os.path.isdir(os.path.join(out, "figures"))
        except Exception as e:  # noqa: BLE001 - any failure is a broken set
            broken += 1
            print("report set broken after a kill:", repr(e), file=sys.stderr)
    leftovers = [f for f in os.listdir(work) if f.startswith(".report.")]
    return killed, broken, len(leftovers)


def main():
    rounds = int(sys.argv[1]) if len(sys.argv) > 1 else 30
    random.seed(20261202)
    work = tempfile.mkdtemp(prefix="viscarta-kill-")
    try:
        t0 = time.time()
        lk, lb, lp = library_rounds(rounds, work)
        rk, rb, rs = report_rounds(rounds, work)
        print("kill test: %d rounds each in %.0f s; library add: %d killed mid-run, %d left the library broken, "
              "%d temporary files left; report: %d killed mid-run, %d left a broken set, %d staging folders left"
              % (rounds, time.time() - t0, lk, lb, lp, rk, rb, rs))
        return 1 if lb or rb else 0
    finally:
        shutil.rmtree(work, ignore_errors=True)


if __name__ == "__main__":
    sys.exit(main())
