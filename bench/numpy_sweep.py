"""Reference sweep for the RF benchmark: the same ladder and band as bench/rf.ts, vectorised with numpy.

Reads {"z0", "frequencies", "load": {"re","im"}, "elements", "repeats"} as JSON on stdin and prints
{"medianMs", "minMs", "re", "im"}: the median and fastest time of one whole sweep over `repeats`
runs (time.perf_counter) and the source-end impedances, for a correctness cross-check.
Same conventions as the RF core: series adds Z, shunt adds Y, line z' = Zc(z + jZc tan t)/(Zc + jz tan t)
with t = deg*f/fRef, open stub -jZc cot t, short stub jZc tan t, transformer n:1 gives n^2 z,
finite Q an ESR of |X|/Q.
"""
import json
import sys
import time

import numpy as np


def sweep(f, load, elements):
    w = 2 * np.pi * f
    z = np.full(f.shape, load, dtype=complex)
    for e in elements:
        k = e["kind"]
        if k == "xfmr":
            z = z * e["ratio"] ** 2
            continue
        if k == "line":
            t = np.tan(np.deg2rad(e["deg"]) * f / e["fRef"])
            zc = e["z0"]
            z = zc * (z + 1j * zc * t) / (zc + 1j * z * t)
            continue
        if k == "stub":
            t = np.tan(np.deg2rad(e["deg"]) * f / e["fRef"])
            part = -1j * e["z0"] / t if e["end"] == "open" else 1j * e["z0"] * t
        elif k == "R":
            part = np.full(f.shape, e["value"], dtype=complex)
        else:
            x = w * e["value"] if k == "L" else -1 / (w * e["value"])
            part = (np.abs(x) / e["q"] if "q" in e else 0) + 1j * x
        z = z + part if e["placement"] == "series" else 1 / (1 / z + 1 / part)
    return z


def main():
    spec = json.load(sys.stdin)
    f = np.asarray(spec["frequencies"], dtype=float)
    load = complex(spec["load"]["re"], spec["load"]["im"])
    times = []
    for _ in range(spec["repeats"]):
        start = time.perf_counter()
        z = sweep(f, load, spec["elements"])
        times.append(time.perf_counter() - start)
    print(json.dumps({"medianMs": float(np.median(times)) * 1e3, "minMs": float(np.min(times)) * 1e3,
                      "re": z.real.tolist(), "im": z.imag.tolist(),
                      "numpy": np.__version__}))


if __name__ == "__main__":
    main()
