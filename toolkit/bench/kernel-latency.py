#!/usr/bin/python3
"""Measures the microtally Jupyter kernel through the real client library (jupyter_client).

    /usr/bin/python3 toolkit/bench/kernel-latency.py [--starts 5] [--cells 40]

Prints, all measured in this run:
  * start: kernel process launch -> kernel_info_reply received (median and max over --starts)
  * round trip of a trivial cell (execute_request sent -> execute_reply and idle status received)
    against the engine's own evaluation time for the same cell, which the kernel reports in the
    execute_reply metadata (microtally_eval_seconds): the ratio is round trip / bare eval
  * headless run of every notebook in notebooks/ through toolkit/bin/microtally run (if any)

The kernelspec is installed into a temporary prefix from toolkit/kernel/target/microtally.jar
(build it first: toolkit/bin/microtally --version does). Needs Debian's jupyter-client.
"""
import argparse
import glob
import json
import os
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


def round_trips(cells):
    km = KernelManager(kernel_name="microtally")
    km.start_kernel()
    kc = km.client()
    kc.start_channels()
    kc.wait_for_ready(timeout=60)
    rows = []
    try:
        for i in range(cells + 10):
            t0 = time.perf_counter()
            reply = kc.execute_interactive("1 + 1", timeout=60, output_hook=lambda m: None)
            rt = time.perf_counter() - t0
            ev = reply["metadata"].get("microtally_eval_seconds")
            kt = reply["metadata"].get("microtally_kernel_seconds", ev)
            if reply["content"]["status"] != "ok" or ev is None:
                raise RuntimeError("trivial cell failed: %r" % (reply,))
            if i >= 10:  # the first ten warm up JShell and the JIT
                rows.append((rt, ev, kt))
    finally:
        kc.stop_channels()
        km.shutdown_kernel(now=True)
    return rows


def headless():
    notebooks = sorted(glob.glob(os.path.join(ROOT, "notebooks", "*.ipynb")))
    if not notebooks:
        return None, 0
    with tempfile.TemporaryDirectory() as out:
        t0 = time.perf_counter()
        r = subprocess.run([LAUNCHER, "run", *notebooks, "--out", out], stdout=subprocess.DEVNULL,
                           stderr=subprocess.PIPE, text=True)
        elapsed = time.perf_counter() - t0
        if r.returncode != 0:
            print("headless run failed:\n" + r.stderr[-2000:], file=sys.stderr)
            return None, len(notebooks)
        return elapsed, len(notebooks)


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--starts", type=int, default=5)
    ap.add_argument("--cells", type=int, default=40)
    args = ap.parse_args()
    if not os.path.isfile(JAR):
        sys.exit("missing %s: build it with toolkit/bin/microtally --version" % JAR)
    with tempfile.TemporaryDirectory() as prefix:
        install(prefix)
        starts, plain = [], []
        for _ in range(args.starts):  # interleaved, so both see the same machine load
            starts.append(start_once())
            plain.append(start_once("microtally-plain"))
        rows = round_trips(args.cells)
    rt = [r for r, _, _ in rows]
    ev = [e for _, e, _ in rows]
    med_rt, med_ev = statistics.median(rt), statistics.median(ev)
    overhead = [r - e for r, e, _ in rows]
    inside = [k - e for _, e, k in rows]
    print("kernel start -> kernel_info_reply: median %.3f s, max %.3f s over %d starts (target <= 1.5 s)"
          % (statistics.median(starts), max(starts), len(starts)))
    print("  same without the class data archive: median %.3f s, max %.3f s" % (statistics.median(plain), max(plain)))
    print("  machine load average (1 min) at the end: %.2f on %d cores" % (os.getloadavg()[0], os.cpu_count()))
    print("trivial cell '1 + 1' over %d cells: round trip median %.2f ms, bare engine eval median %.2f ms,"
          % (len(rows), med_rt * 1e3, med_ev * 1e3))
    print("  kernel+client overhead median %.2f ms, of which inside the kernel (request received -> reply"
          " ready, minus eval) %.2f ms" % (statistics.median(overhead) * 1e3, statistics.median(inside) * 1e3))
    print("  ratio round trip / eval = %.3f (target <= 1.2)" % (med_rt / med_ev))
    seconds, count = headless()
    if seconds is None and count == 0:
        print("headless run: no notebooks in notebooks/ yet")
    elif seconds is None:
        print("headless run of %d notebooks: FAILED" % count)
    else:
        print("headless run of %d notebooks (toolkit/bin/microtally run): %.1f s (target <= 30 s)" % (count, seconds))
    print(json.dumps({"start_median_s": statistics.median(starts), "start_max_s": max(starts),
                      "start_plain_median_s": statistics.median(plain), "load1": os.getloadavg()[0],
                      "roundtrip_median_ms": med_rt * 1e3, "eval_median_ms": med_ev * 1e3,
                      "ratio": med_rt / med_ev, "inside_kernel_ms": statistics.median(inside) * 1e3, "headless_s": seconds, "notebooks": count}))


if __name__ == "__main__":
    main()
