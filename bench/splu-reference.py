"""SuperLU reference for the Wingfold bench (scipy.sparse.linalg.splu, X. S. Li, "An overview of
SuperLU", ACM TOMS 31(3), 2005). Reads a CSC matrix written by bench/reference.ts
(<base>.json: n, nnz; <base>.ptr int32, <base>.idx int32, <base>.val float64) and prints one JSON
line: for each column ordering, the median full factorisation time (ordering + symbolic +
numeric, as splu does them in one call) of `reps` runs and nnz(L) + nnz(U)."""
import json, sys, time
import numpy as np
import scipy
from scipy.sparse import csc_matrix
from scipy.sparse.linalg import splu

base, reps = sys.argv[1], int(sys.argv[2]) if len(sys.argv) > 2 else 3
meta = json.load(open(base + '.json'))
n = meta['n']
ptr = np.fromfile(base + '.ptr', dtype=np.int32)
idx = np.fromfile(base + '.idx', dtype=np.int32)
val = np.fromfile(base + '.val', dtype=np.float64)
A = csc_matrix((val, idx, ptr), shape=(n, n))
out = {'scipy': scipy.__version__, 'orderings': {}}
for spec in ('MMD_AT_PLUS_A', 'COLAMD', 'MMD_ATA'):
    times = []
    fill = 0
    for _ in range(reps):
        t0 = time.perf_counter()
        # symmetric mode (diagonal pivots preferred), as SuperLU recommends for symmetric matrices
        f = splu(A, permc_spec=spec, diag_pivot_thresh=0.0 if spec == 'MMD_AT_PLUS_A' else 1.0,
                 options={'SymmetricMode': spec == 'MMD_AT_PLUS_A'})
        times.append((time.perf_counter() - t0) * 1000)
        fill = int(f.L.nnz + f.U.nnz)
    times.sort()
    out['orderings'][spec] = {'ms': times[len(times) // 2], 'fill': fill}
print(json.dumps(out))
