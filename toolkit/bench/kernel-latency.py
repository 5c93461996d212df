#!/usr/bin/python3
"""Measures the microtally Jupyter kernel through the real client library (jupyter_client).

    /usr/bin/python3 toolkit/bench/kernel-latency.py [--starts 5] [--cells 50] [--no-headless]

Prints, all measured in this run (the machine is shared: compare the ratios, not the milliseconds):
  * start: kernel process launch -> kernel_info_reply received (median and max over --starts),
    with and without the class data archive
  * round trip of a trivial cell '1 + 1' (execute_request sent -> execute_reply and idle status
    received), median and p90 over --cells cells after 10 warm-up cells, interleaved cell by cell
    with the same cell on Python's ipykernel (the baseline: the same client, wire and load)
  * the same for cells that differ from the one before ('1 + 0', '1 + 1', '1 + 2', ...): the engine
    re-runs a repeated cell without compiling it (microtally_reran_snippets in the metadata), so
    this series is the one that shows the cost of compiling a new cell
  * the median of each phase the kernel reports in the execute_reply metadata
    (microtally_phases_ms: kernel_in, split, compile, define, run, display, kernel_out); "client
    and wire" is the round trip minus the kernel's own time
  * the floor JShell itself sets: a cell that times a bare JShell (no imports, execution in the same
    JVM) evaluating '1 + 1' in the kernel's JVM, so javac there is as warm as the engine's
  * headless run of every notebook in notebooks/ through toolkit/bin/microtally run, the total and
    each notebook's time as the runner prints it

The kernelspec is installed into a temporary prefix from toolkit/kernel/target/microtally.jar
(build it first: toolkit/bin/microtally --version does). Needs Debian's jupyter-client and
python3-ipykernel (for the baseline; without it the baseline is skipped).
"""
import argparse
import glob
import json
import os
import re
import statistics
import subprocess
import sys
import tempfile
import time

from jupyter_client.manager import KernelManager

ROOT = os.path.abspath(os.path.join(os.path.dirname(__file__), "..", ".."))
JAR = os.path.join(ROOT, "toolkit", "kernel", "target", "microtally.jar")
LAUNCHER = os.path.join(ROOT, "toolkit", "bin", "microtally")


def install(prefix):
    """Installs 'microtally' (with its class data archive) and 'microtally-plain' (the same without)."""
    subprocess.run(["java", "-jar", JAR, "install-kernel", "--prefix", prefix], check=True,
                   stdout=subprocess.DEVNULL)
    kernels = os.path.join(prefix, "share", "jupyter", "kernels")
    with open(os.path.join(kernels, "microtally", "kernel.json")) as f:
        spec = json.load(f)
    spec["argv"] = [a for a in spec["argv"] if not a.startswith("-XX:SharedArchiveFile=") and a != "-Xlog:cds*=off"]
    spec["display_name"] += " without class data archive"
    os.makedirs(os.path.join(kernels, "microtally-plain"))
    with open(os.path.join(kernels, "microtally-plain", "kernel.json"), "w") as f:
        json.dump(spec, f)
    os.environ["JUPYTER_PATH"] = os.path.join(prefix, "share", "jupyter")


def start_once(name="microtally"):
    """Seconds from launching the kernel process to receiving its kernel_info_reply."""
    km = KernelManager(kernel_name=name)
    t0 = time.perf_counter()
    km.start_kernel()  # returns once the process is launched (it picks the ports itself)
    kc = km.client()
    kc.start_channels()
    msg_id = kc.kernel_info()  # queued by ZeroMQ until the kernel has bound its shell socket
    while True:
        reply = kc.get_shell_msg(timeout=30)
        if reply["parent_header"].get("msg_id") == msg_id:
            break
    elapsed = time.perf_counter() - t0
    kc.stop_channels()
    km.shutdown_kernel(now=True)
    return elapsed

PHASES = ["kernel_in", "split", "compile", "define", "run", "display", "kernel_out"]

BARE_JSHELL_CELL = """
var bare = jdk.jshell.JShell.builder().executionEngine("local").build();
long[] bareNanos = new long[60];
long[] declNanos = new long[60];
for (int i = 0; i < 70; i++) {
    long t = System.nanoTime();
    var ev = bare.eval("1 + 1");
    if (ev.get(0).status() != jdk.jshell.Snippet.Status.VALID) throw new IllegalStateException(ev.toString());
    if (i >= 10) bareNanos[i - 10] = System.nanoTime() - t;
    t = System.nanoTime();
    ev = bare.eval("Object $value = (1 + " + i + "\\n);");
    if (ev.get(0).status() != jdk.jshell.Snippet.Status.VALID) throw new IllegalStateException(ev.toString());
    if (i >= 10) declNanos[i - 10] = System.nanoTime() - t;
}
bare.close();
Arrays.sort(bareNanos);
Arrays.sort(declNanos);
String.format(Locale.ROOT, "%.3f %.3f %.3f %.3f", bareNanos[30] / 1e6, bareNanos[54] / 1e6, declNanos[30] / 1e6, declNanos[54] / 1e6)
"""


def open_kernel(name):
    km = KernelManager(kernel_name=name)
    km.start_kernel()
    kc = km.client()
    kc.start_channels()
    kc.wait_for_ready(timeout=120)
    return km, kc


def close_kernel(km, kc):
    kc.stop_channels()
    km.shutdown_kernel(now=True)


def one_cell(kc, code, outputs=None):
    """Seconds from execute_request to the idle status after execute_reply; IOPub messages go to outputs."""
    hook = (lambda m: None) if outputs is None else outputs.append
    t0 = time.perf_counter()
    reply = kc.execute_interactive(code, timeout=300, output_hook=hook)
    return time.perf_counter() - t0, reply


def round_trips(cells, with_python, distinct=False):
    """'1 + 1' (or, with distinct, '1 + i' for the i-th cell) on our kernel and (interleaved, cell by
    cell) on Python's, after 10 warm-up cells each."""
    ours = open_kernel("microtally")
    py = open_kernel("python3") if with_python else None
    rows, python = [], []
    bare = None
    try:
        for i in range(cells + 10):
            code = "1 + %d" % i if distinct else "1 + 1"
            rt, reply = one_cell(ours[1], code)
            md = reply["metadata"]
            if reply["content"]["status"] != "ok" or "microtally_phases_ms" not in md:
                raise RuntimeError("trivial cell failed: %r" % (reply,))
            if py is not None:
                prt, preply = one_cell(py[1], code)
                if preply["content"]["status"] != "ok":
                    raise RuntimeError("Python baseline cell failed: %r" % (preply,))
            if i >= 10:  # the first ten warm up JShell and the JIT
                rows.append((rt, md["microtally_eval_seconds"], md["microtally_kernel_seconds"], md["microtally_phases_ms"],
                             md.get("microtally_reran_snippets", 0)))
                if py is not None:
                    python.append(prt)
        if distinct:
            outputs = []
            _, reply = one_cell(ours[1], BARE_JSHELL_CELL, outputs)
            bare = bare_result(reply, outputs)
    finally:
        close_kernel(*ours)
        if py is not None:
            close_kernel(*py)
    return rows, python, bare


def bare_result(reply, outputs):
    """The bare JShell cell's value: median and p90 (ms) of '1 + 1', then of a new declaration
    'Object $value = (1 + i);' each time (what the engine compiles for a new cell); or None."""
    for msg in outputs:
        if msg["msg_type"] == "execute_result":
            text = msg["content"]["data"]["text/plain"].strip().strip('"')
            return [float(x) for x in text.split()]
    print("the bare JShell cell gave no value: %r" % (reply["content"],), file=sys.stderr)
    return None


def report(title, rows, python, load):
    """Prints one series (round trips, the Python baseline, phase medians) and returns its figures."""
    rt = [r[0] for r in rows]
    med_rt, med_ev = statistics.median(rt), statistics.median(r[1] for r in rows)
    phases = {k: statistics.median(r[3].get(k, 0.0) for r in rows) for k in PHASES}
    wire = statistics.median((r[0] - r[2]) * 1e3 for r in rows)
    reran = sum(1 for r in rows if r[4])
    print("%s, %d cells after 10 warm-up cells: round trip median %.2f ms, p90 %.2f ms"
          " (target median <= 30 ms, p90 <= 50 ms); %d of %d cells re-ran without compiling; load average %.2f"
          % (title, len(rows), med_rt * 1e3, p90(rt) * 1e3, reran, len(rows), load))
    if python:
        print("  Python ipykernel, same cells, interleaved: median %.2f ms, p90 %.2f ms; ratio ours / Python %.2f"
              % (statistics.median(python) * 1e3, p90(python) * 1e3, med_rt / statistics.median(python)))
    print("  phase medians (ms): " + ", ".join("%s %.2f" % (k, phases[k]) for k in PHASES)
          + ", client and wire %.2f" % wire)
    print("  engine total median %.2f ms; round trip / engine = %.3f" % (med_ev * 1e3, med_rt / med_ev))
    return {"roundtrip_median_ms": med_rt * 1e3, "roundtrip_p90_ms": p90(rt) * 1e3,
            "python_median_ms": statistics.median(python) * 1e3 if python else None,
            "eval_median_ms": med_ev * 1e3, "phases_median_ms": phases, "client_wire_ms": wire,
            "reran_cells": reran, "load1": load}


def p90(values):
    v = sorted(values)
    return v[min(len(v) - 1, int(round(0.9 * (len(v) - 1))))]


def headless():
    """Total seconds and each notebook's seconds as the runner prints them."""
    notebooks = sorted(glob.glob(os.path.join(ROOT, "notebooks", "*.ipynb")))
    if not notebooks:
        return None, 0, []
    with tempfile.TemporaryDirectory() as out:
        t0 = time.perf_counter()
        r = subprocess.run([LAUNCHER, "run", *notebooks, "--out", out], stdout=subprocess.DEVNULL,
                           stderr=subprocess.PIPE, text=True)
        elapsed = time.perf_counter() - t0
        per = []
        for line in r.stderr.splitlines():
            m = re.match(r"^(.*\.ipynb): (\d+) of (\d+) code cells run in ([0-9.]+) s", line)
            if m:
                per.append((os.path.basename(m.group(1)), float(m.group(4))))
        if r.returncode != 0:
            print("headless run failed:\n" + r.stderr[-2000:], file=sys.stderr)
            return None, len(notebooks), per
        return elapsed, len(notebooks), per


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--starts", type=int, default=5)
    ap.add_argument("--cells", type=int, default=50)
    ap.add_argument("--no-headless", action="store_true")
    args = ap.parse_args()
    if not os.path.isfile(JAR):
        sys.exit("missing %s: build it with toolkit/bin/microtally --version" % JAR)
    try:
        import ipykernel  # noqa: F401
        with_python = True
    except ImportError:
        with_python = False
    with tempfile.TemporaryDirectory() as prefix:
        install(prefix)
        starts, plain = [], []
        for _ in range(args.starts):  # interleaved, so both see the same machine load
            starts.append(start_once())
            plain.append(start_once("microtally-plain"))
        rows, python, _ = round_trips(args.cells, with_python)
        load_same = os.getloadavg()[0]
        new_rows, new_python, bare = round_trips(args.cells, with_python, distinct=True)
    load = os.getloadavg()[0]
    print("kernel start -> kernel_info_reply: median %.3f s, max %.3f s over %d starts (target <= 1 s)"
          % (statistics.median(starts), max(starts), len(starts)))
    print("  same without the class data archive: median %.3f s, max %.3f s" % (statistics.median(plain), max(plain)))
    same = report("trivial cell '1 + 1' (the same cell each time)", rows, python, load_same)
    new = report("new trivial cell each time ('1 + 0', '1 + 1', '1 + 2', ...: compiled)", new_rows, new_python, load)
    if bare:
        print("  floor, in the kernel's JVM after those cells: a bare JShell (no class path, no imports, local"
              " execution) evaluating '1 + 1': median %.2f ms, p90 %.2f ms; evaluating a new 'Object $value = (1 + i);'"
              " each time (the engine's route): median %.2f ms, p90 %.2f ms; engine total / bare declaration = %.2f"
              % (bare[0], bare[1], bare[2], bare[3], new["eval_median_ms"] / bare[2]))
    print("  machine load average (1 min) at the end: %.2f on %d cores" % (load, os.cpu_count()))
    seconds, count, per = (None, 0, []) if args.no_headless else headless()
    if args.no_headless:
        pass
    elif seconds is None and count == 0:
        print("headless run: no notebooks in notebooks/ yet")
    elif seconds is None:
        print("headless run of %d notebooks: FAILED" % count)
    else:
        print("headless run of %d notebooks (toolkit/bin/microtally run): %.1f s (target <= 30 s), load average %.2f"
              % (count, seconds, os.getloadavg()[0]))
        for name, sec in per:
            print("  %-40s %.1f s" % (name, sec))
    print(json.dumps({"start_median_s": statistics.median(starts), "start_max_s": max(starts),
                      "start_plain_median_s": statistics.median(plain), "load1": load,
                      "same_cell": same, "new_cell": new,
                      "bare_jshell_ms": bare, "headless_s": seconds, "notebooks": count,
                      "per_notebook_s": dict(per)}))


if __name__ == "__main__":
    main()
