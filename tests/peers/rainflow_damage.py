#!/usr/bin/env python3
"""Peer for rainflow counting and Miner's rule: the `rainflow` package (ASTM E1049 §5.4.4) and
the `fatpack` package on the same histories.

Usage: rainflow_damage.py IN.f64 SUT NREF SREF K
IN holds histories as little-endian f64, each preceded by its length (an f64 holding a whole
number). For each history prints one JSON object per line:
  cycles:   rainflow.extract_cycles -> [range, mean, count, i_start, i_end]
  closed:   fatpack.find_rainflow_cycles on rainflow.reversals' values -> [[from, to], ...]
  goodman:  Miner sum by fatpack: the package's cycles, fatpack's Goodman equivalent range
            (S / (1 - Sm/SUT)), and fatpack.LinearEnduranceCurve with Nc = NREF, m = K and
            Sc = 2*SREF (the curve is in ranges, so twice the amplitude)
  swt:      the same with fatpack's Walker equivalent at gamma = 0.5 (Smith-Watson-Topper), or
            null when some cycle has Smax <= 0
"""
import json
import sys

import fatpack
import numpy as np
import rainflow


def main():
    raw = np.fromfile(sys.argv[1], dtype="<f8")
    sut, nref, sref, k = (float(a) for a in sys.argv[2:6])
    curve = fatpack.LinearEnduranceCurve(2.0 * sref)
    curve.Nc = nref
    curve.m = k
    at = 0
    while at < len(raw):
        n = int(raw[at])
        h = raw[at + 1 : at + 1 + n].tolist()
        at += 1 + n
        cycles = [list(c) for c in rainflow.extract_cycles(h)]
        rev = [v for _, v in rainflow.reversals(h)]
        closed, _ = fatpack.find_rainflow_cycles(rev) if len(rev) >= 4 else (np.empty((0, 2)), None)
        out = {"cycles": cycles, "closed": np.asarray(closed).tolist()}
        if cycles:
            c = np.asarray(cycles)
            s, sm, cnt = c[:, 0], c[:, 1], c[:, 2]
            st = fatpack.find_goodman_equivalent_stress(s, sm, sut)
            out["goodman"] = float(curve.find_miner_sum(np.column_stack([st, cnt])))
            if np.all(sm + s / 2.0 > 0.0):
                sw = fatpack.find_walker_equivalent_stress(s, sm, 0.5)
                out["swt"] = float(curve.find_miner_sum(np.column_stack([sw, cnt])))
            else:
                out["swt"] = None
        print(json.dumps(out))


if __name__ == "__main__":
    main()
