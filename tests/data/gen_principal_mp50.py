#!/usr/bin/env python3
"""Reference principal stresses to 50 significant digits for tests/principal_reference.rs.

Regenerate (needs mpmath: `pip install mpmath`):

    python3 tests/data/gen_principal_mp50.py > tests/data/principal_mp50.csv

Each tensor is written with repr(), so the Rust test reads exactly the f64 values used here; the
eigenvalues of those exact values are computed in 60-digit arithmetic (mpmath.eigsy) and printed to
50 significant digits. The cases are generated, not taken from any publication.
"""
import math
import random

import mpmath as mp

mp.mp.dps = 60
rng = random.Random(20261201)


def rotation():
    """A random rotation matrix from a random unit quaternion (float arithmetic)."""
    q = [rng.gauss(0.0, 1.0) for _ in range(4)]
    n = math.sqrt(sum(v * v for v in q))
    w, x, y, z = (v / n for v in q)
    return [
        [1 - 2 * (y * y + z * z), 2 * (x * y - w * z), 2 * (x * z + w * y)],
        [2 * (x * y + w * z), 1 - 2 * (x * x + z * z), 2 * (y * z - w * x)],
        [2 * (x * z - w * y), 2 * (y * z + w * x), 1 - 2 * (x * x + y * y)],
    ]


def from_eigs(lam):
    """R diag(lam) R^T rounded to floats; symmetric by construction."""
    r = rotation()
    a = [[sum(r[i][k] * lam[k] * r[j][k] for k in range(3)) for j in range(3)] for i in range(3)]
    return [a[0][0], a[1][1], a[2][2], 0.5 * (a[0][1] + a[1][0]), 0.5 * (a[1][2] + a[2][1]), 0.5 * (a[2][0] + a[0][2])]


def rand_tensor(scale=100.0):
    return [rng.uniform(-scale, scale) for _ in range(6)]


cases = [
    ("zero", [0.0] * 6),
    ("uniaxial", [100.0, 0, 0, 0, 0, 0]),
    ("hydrostatic", [-50.0, -50.0, -50.0, 0, 0, 0]),
    ("hydrostatic_rotated", from_eigs([7.0, 7.0, 7.0])),
    ("pure_shear_plane", [0.0, 0.0, 0.0, 40.0, 0.0, 0.0]),
    ("pure_shear_rotated", from_eigs([40.0, 0.0, -40.0])),
    ("pure_shear_3d", [0.0, 0.0, 0.0, 10.0, 10.0, 10.0]),
    ("triple_near_equal", from_eigs([1 + 1e-9, 1.0, 1 - 1e-9])),
]
for i in range(4):
    cases.append((f"two_equal_top_{i}", from_eigs([30.0, 30.0, -10.0 - 5 * i])))
    cases.append((f"two_equal_bottom_{i}", from_eigs([30.0 + 5 * i, -10.0, -10.0])))
for e in range(1, 16):
    g = 10.0 ** -e
    cases.append((f"near_equal_top_1e-{e}", from_eigs([10.0 + 10.0 * g, 10.0, -5.0])))
    cases.append((f"near_equal_bottom_1e-{e}", from_eigs([5.0, -10.0, -10.0 - 10.0 * g])))
for i in range(40):
    cases.append((f"random_{i}", rand_tensor()))
for i in range(10):
    sx, sy, txy = (rng.uniform(-300, 300) for _ in range(3))
    cases.append((f"plane_{i}", [sx, sy, 0.0, txy, 0.0, 0.0]))
for i in range(10):
    t = rand_tensor()
    cases.append((f"scaled_1e150_{i}", [v * 1e150 for v in t]))
    cases.append((f"scaled_1e-150_{i}", [v * 1e-150 for v in t]))
cases.append(("scaled_1e150_near_equal", [v * 1e150 for v in from_eigs([2.0 + 1e-11, 2.0, -1.0])]))
cases.append(("scaled_1e-150_two_equal", [v * 1e-150 for v in from_eigs([-3.0, 4.0, 4.0])]))
cases.append(("mixed_magnitudes", [1e6, 1.0, 1e-6, 1e3, 1e-3, 0.5]))
cases.append(("dominant_shear", [1e-8, -1e-8, 0.0, 250.0, 1e-8, 0.0]))

print("case,sxx,syy,szz,sxy,syz,szx,s1,s2,s3")
for name, c in cases:
    a, b, cc, d, e, f = (mp.mpf(v) for v in c)
    m = mp.matrix([[a, d, f], [d, b, e], [f, e, cc]])
    ev = mp.eigsy(m, eigvals_only=True)
    vals = sorted((ev[i] for i in range(3)), reverse=True)
    print(",".join([name] + [repr(float(v)) for v in c] + [mp.nstr(v, 50, min_fixed=1, max_fixed=0) for v in vals]))
