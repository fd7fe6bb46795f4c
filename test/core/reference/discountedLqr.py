"""Reference values for test/core/lqOptimalGain.test.ts, from an independent general-purpose library.

The discounted problem min E sum_t g^t (x'Qx + u'Ru), x+ = Ax + Bu + w, is the undiscounted one with
A and B scaled by sqrt(g) (Bertsekas, Dynamic Programming and Optimal Control, Vol. I, 4.1), so
scipy.linalg.solve_discrete_are(sqrt(g)A, sqrt(g)B, Q, R) gives P, and K = g (R + g B'PB)^-1 B'PA.
Run: python3 test/core/reference/discountedLqr.py
"""
import numpy as np
from scipy.linalg import solve_discrete_are

def gain(a, b, q, r, g):
    p = solve_discrete_are(np.sqrt(g) * a, np.sqrt(g) * b, q, r)
    k = g * np.linalg.solve(r + g * b.T @ p @ b, b.T @ p @ a)
    return k, p

plants = {
    "tank": (np.array([[0.92, 0], [0.06, 0.95]]), np.array([[0.004], [0]]), np.diag([100.0, 400.0]), np.array([[0.01]]), 0.95),
    "three": (np.array([[1.02, 0.1, 0], [0, 0.95, 0.2], [0.05, 0, 0.9]]), np.array([[0.5, 0], [0, 0.3], [0.1, 0.4]]),
              np.diag([2.0, 1.0, 0.5]), np.array([[0.3, 0.05], [0.05, 0.2]]), 0.97),
    "piLoop": (np.array([[0.9, 0], [-10, 1]]), np.array([[0.05], [0]]), np.diag([1.0, 0]), np.array([[0.01]]), 0.95),
}
np.set_printoptions(precision=17)
for name, (a, b, q, r, g) in plants.items():
    k, p = gain(a, b, q, r, g)
    print(name, "K =", repr(k.flatten().tolist()))
    print(name, "P =", repr(p.flatten().tolist()))
