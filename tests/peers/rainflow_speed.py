#!/usr/bin/env python3
"""Peer for the rainflow benchmark: the `rainflow` package (pure Python, ASTM E1049 §5.4.4) on
the same history.

Usage: rainflow_speed.py IN.f64 [repeats]
IN holds the history as little-endian f64. Prints one JSON line: best seconds for
`list(rainflow.extract_cycles(history))`, the number of cycles and their summed count.
"""
import json
import sys
import time

import numpy as np
import rainflow


def main():
    h = np.fromfile(sys.argv[1], dtype="<f8").tolist()
    repeats = int(sys.argv[2]) if len(sys.argv) > 2 else 3
    best = float("inf")
    cycles = []
    for _ in range(repeats):
        t0 = time.perf_counter()
        cycles = list(rainflow.extract_cycles(h))
        best = min(best, time.perf_counter() - t0)
    print(json.dumps({
        "seconds": best,
        "cycles": len(cycles),
        "counted": sum(c[2] for c in cycles),
        "rainflow": rainflow.__version__,
    }))


if __name__ == "__main__":
    main()
