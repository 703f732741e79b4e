#!/usr/bin/env python3
"""Peer for the principal-value benchmark: numpy's batched eigvalsh on the same tensors.

Usage: numpy_eigvalsh.py IN.f64 OUT.f64 [repeats]
IN holds N tensors as little-endian f64 sxx, syy, szz, sxy, syz, szx. OUT receives N×3 eigenvalues
(ascending, as numpy returns them). Prints one JSON line: {"ns_per_tensor": best, "n": N, ...}.
Run single-threaded (the caller sets OMP/OPENBLAS/MKL thread counts to 1).
"""
import json
import sys
import time

import numpy as np


def main():
    src, dst = sys.argv[1], sys.argv[2]
    repeats = int(sys.argv[3]) if len(sys.argv) > 3 else 5
    c = np.fromfile(src, dtype="<f8").reshape(-1, 6)
    n = c.shape[0]
    a = np.empty((n, 3, 3))
    a[:, 0, 0], a[:, 1, 1], a[:, 2, 2] = c[:, 0], c[:, 1], c[:, 2]
    a[:, 0, 1] = a[:, 1, 0] = c[:, 3]
    a[:, 1, 2] = a[:, 2, 1] = c[:, 4]
    a[:, 2, 0] = a[:, 0, 2] = c[:, 5]
    best = float("inf")
    w = None
    for _ in range(repeats):
        t0 = time.perf_counter()
        w = np.linalg.eigvalsh(a)
        best = min(best, time.perf_counter() - t0)
    w.astype("<f8").tofile(dst)
    print(json.dumps({"ns_per_tensor": best * 1e9 / n, "n": n, "numpy": np.__version__}))


if __name__ == "__main__":
    main()
