"""Single-threaded LAPACK timings through Debian's python3-scipy, for benchmarks/factorisations.bench.ts.

Reads a JSON object {"sizes": [...], "rounds": {"<n>": r}} on stdin and prints
{"available": true, "scipy": ..., "results": [{"routine", "n", "medianMs"}]} on stdout, or
{"available": false, "reason": ...} when scipy is missing. The caller sets the thread-count
variables (OMP_NUM_THREADS and friends) to 1 before this starts. Inputs are seeded uniform
(-1, 1) matrices (LU, QR) and B·Bᵀ + n·I (Cholesky); LAPACK's speed does not depend on the values.
"""
import json
import sys
import time

try:
    import numpy as np
    import scipy
    from scipy.linalg import lapack
except ImportError as err:  # scipy absent: skip cleanly
    print(json.dumps({"available": False, "reason": str(err)}))
    sys.exit(0)


def timed(fn, a, rounds):
    times = []
    fn(a.copy(order="F"))  # warm-up
    for _ in range(rounds):
        b = a.copy(order="F")
        t0 = time.perf_counter()
        fn(b)
        times.append((time.perf_counter() - t0) * 1e3)
    times.sort()
    return times[len(times) // 2]


def main():
    plan = json.load(sys.stdin)
    rng = np.random.default_rng(20261202)
    results = []
    for n in plan["sizes"]:
        rounds = int(plan["rounds"][str(n)])
        a = rng.uniform(-1.0, 1.0, size=(n, n))
        s = a @ a.T + n * np.eye(n)
        routines = {
            "lu": (lambda x: lapack.dgetrf(x, overwrite_a=1), a),
            "cholesky": (lambda x: lapack.dpotrf(x, lower=1, overwrite_a=1), s),
            "qr": (lambda x: lapack.dgeqrf(x, overwrite_a=1), a),
        }
        for name, (fn, m) in routines.items():
            results.append({"routine": name, "n": n, "medianMs": timed(fn, m, rounds)})
    print(json.dumps({"available": True, "scipy": scipy.__version__, "numpy": np.__version__, "results": results}))


main()
