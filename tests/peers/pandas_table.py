#!/usr/bin/env python3
"""Peer for the table benchmark: pandas.read_csv plus numpy on the same file.

Usage: pandas_table.py FILE.csv [repeats]
Reads the six stress columns, computes the principal stresses (numpy eigvalsh) and von Mises,
and ranks the rows by von Mises (highest first). Prints one JSON line with the best time in
seconds and the worst row's 0-based index and von Mises, for a cross-check.
"""
import json
import sys
import time

import numpy as np
import pandas as pd


def run(path):
    df = pd.read_csv(path, comment="#")
    c = df.iloc[:, -6:].to_numpy(dtype=np.float64)
    a = np.empty((c.shape[0], 3, 3))
    a[:, 0, 0], a[:, 1, 1], a[:, 2, 2] = c[:, 0], c[:, 1], c[:, 2]
    a[:, 0, 1] = a[:, 1, 0] = c[:, 3]
    a[:, 1, 2] = a[:, 2, 1] = c[:, 4]
    a[:, 2, 0] = a[:, 0, 2] = c[:, 5]
    w = np.linalg.eigvalsh(a)
    sx, sy, sz, txy, tyz, tzx = (c[:, k] for k in range(6))
    vm = np.sqrt(sx**2 + sy**2 + sz**2 - sx * sy - sy * sz - sz * sx + 3 * (txy**2 + tyz**2 + tzx**2))
    order = np.argsort(-vm, kind="stable")
    return w, vm, order


path = sys.argv[1]
repeats = int(sys.argv[2]) if len(sys.argv) > 2 else 3
best = float("inf")
for _ in range(repeats):
    t0 = time.perf_counter()
    w, vm, order = run(path)
    best = min(best, time.perf_counter() - t0)
print(json.dumps({"seconds": best, "rows": int(vm.shape[0]), "worst": int(order[0]), "worst_vm": float(vm[order[0]])}))
