"""Instructions per row of the batch kernels, this checkout against another, side by side.

Run:
    python3 bench/bench_instructions.py --baseline /path/to/other/checkout [--rows 20000]

Builds bench/cpp/kernel_rows.cpp (one thread, the rows of bench_kernels.py's kinds) against
the headers of this checkout and of the baseline checkout (g++ -O3 -DNDEBUG), then counts
instructions with valgrind --tool=callgrind for one and for two calls of each kernel on
`rows` rows; the difference over `rows` is the cost of one row in the kernel alone (without
drawing the rows, building the batch or the tables built on first use). Instruction counts do
not depend on the load of the machine (timings do), so two builds can be compared while
others work; they are not a time (the cost of one instruction varies, and rows that overlap
in the processor are not counted cheaper). The CPU time per row of a plain run and the
outputs' checksums are printed too: equal checksums say both builds give the same numbers
on these rows. Timing lives in bench/ only.
"""
from __future__ import annotations

import argparse
import os
import re
import subprocess
import sys
import tempfile

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.dirname(HERE)
KERNELS = ("freezing_point", "ice_fraction", "seawater", "ross")


def build(checkout: str, out: str) -> None:
    subprocess.run(["g++", "-std=c++17", "-O3", "-DNDEBUG", "-I", os.path.join(checkout, "cpp", "include"),
                    "-I", "/usr/include/eigen3", os.path.join(HERE, "cpp", "kernel_rows.cpp"), "-o", out,
                    "-lpthread"], check=True)


def instructions(exe: str, kernel: str, rows: int, calls: int) -> int:
    r = subprocess.run(["valgrind", "--tool=callgrind", "--callgrind-out-file=/dev/null", exe, kernel,
                        str(rows), str(calls)], capture_output=True, text=True, check=True)
    return int(re.search(r"I\s+refs:\s+([\d,]+)", r.stderr).group(1).replace(",", ""))


def plain_run(exe: str, kernel: str, rows: int) -> tuple[float, str]:
    out = subprocess.run([exe, kernel, str(rows), "5"], capture_output=True, text=True, check=True).stdout
    return float(re.search(r"cpu_ns_per_row=([\d.]+)", out).group(1)), re.search(r"checksum=(\S+)", out).group(1)


def main() -> int:
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--baseline", required=True, help="another checkout (its cpp/include is used)")
    ap.add_argument("--rows", type=int, default=20000)
    args = ap.parse_args()
    load0 = os.getloadavg()
    with tempfile.TemporaryDirectory() as tmp:
        exes = {"this": os.path.join(tmp, "this"), "baseline": os.path.join(tmp, "baseline")}
        build(ROOT, exes["this"])
        build(args.baseline, exes["baseline"])
        print(f"load average {load0[0]:.2f} {load0[1]:.2f} {load0[2]:.2f}; baseline {args.baseline}")
        print("| kernel | instructions per row: this (baseline; ratio) | CPU ns per row, one run each: this "
              "(baseline) | same checksum |")
        print("|---|---|---|---|")
        for k in KERNELS:
            n = args.rows if k != "ross" else max(args.rows // 10, 1)
            per_row = {}
            for name, exe in exes.items():
                per_row[name] = (instructions(exe, k, n, 2) - instructions(exe, k, n, 1)) / n
            t_this, c_this = plain_run(exes["this"], k, 10 * n)
            t_base, c_base = plain_run(exes["baseline"], k, 10 * n)
            print(f"| {k} | {per_row['this']:.0f} ({per_row['baseline']:.0f}; "
                  f"{per_row['baseline'] / per_row['this']:.2f}x fewer) | {t_this:.0f} ({t_base:.0f}) | "
                  f"{'yes' if c_this == c_base else 'NO'} |")
    load1 = os.getloadavg()
    print(f"load average at the end {load1[0]:.2f} {load1[1]:.2f} {load1[2]:.2f}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
