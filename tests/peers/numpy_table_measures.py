#!/usr/bin/env python3
"""Peer for the table measures: numpy on the same tensors.

Usage: numpy_table_measures.py IN.f64 OUT.f64 SY
IN holds N tensors as little-endian f64 sxx, syy, szz, sxy, syz, szx. OUT receives N×8 values:
s1 >= s2 >= s3 (numpy's eigvalsh, reversed), tau_max = (s1 - s3)/2, von Mises from the
components (sqrt(sx² + sy² + sz² - sx·sy - sy·sz - sz·sx + 3(txy² + tyz² + tzx²))), Tresca
s1 - s3, triaxiality (mean stress / von Mises), and the von Mises factor of safety SY / vm.
"""
import sys

import numpy as np

src, dst, sy = sys.argv[1], sys.argv[2], float(sys.argv[3])
c = np.fromfile(src, dtype="<f8").reshape(-1, 6)
sx, syy, sz, txy, tyz, tzx = (c[:, k] for k in range(6))
a = np.empty((c.shape[0], 3, 3))
a[:, 0, 0], a[:, 1, 1], a[:, 2, 2] = sx, syy, sz
a[:, 0, 1] = a[:, 1, 0] = txy
a[:, 1, 2] = a[:, 2, 1] = tyz
a[:, 2, 0] = a[:, 0, 2] = tzx
w = np.linalg.eigvalsh(a)[:, ::-1]
vm = np.sqrt(sx**2 + syy**2 + sz**2 - sx * syy - syy * sz - sz * sx + 3 * (txy**2 + tyz**2 + tzx**2))
with np.errstate(divide="ignore", invalid="ignore"):
    tri = (sx + syy + sz) / 3 / vm
    n = sy / vm
out = np.column_stack([w, (w[:, 0] - w[:, 2]) / 2, vm, w[:, 0] - w[:, 2], tri, n])
out.astype("<f8").tofile(dst)
