/**
 * Per-matrix choice of the fill-reducing ordering: approximate minimum degree (./amd.ts) or
 * nested dissection (./ordering.ts), whichever gives the smaller nnz(L) predicted by the symbolic
 * analysis (elimination tree and column counts, T. A. Davis, ACM TOMS 31(4), 2005; O(nnz(L))
 * work, far below one numeric factorisation). Neither ordering wins everywhere: nested
 * dissection is asymptotically better on large 2-D meshes (A. George, SIAM J. Numer. Anal. 10,
 * 1973), minimum degree usually better on irregular and smaller graphs (Amestoy, Davis, Duff,
 * SIAM J. Matrix Anal. Appl. 17(4), 1996, §7).
 */
import type { Csc } from './csc'
import { symmetricAdjacency } from './csc'
import { approximateMinimumDegree } from './amd'
import { LdltSymbolic } from './ldlt'
import { nestedDissection } from './ordering'

/** The orderings {@link chooseOrdering} compares. */
export type OrderingKind = 'amd' | 'nested-dissection'

/** Outcome of {@link chooseOrdering}. */
export interface OrderingChoice {
  perm: Int32Array
  chosen: OrderingKind
  /** Predicted entries of L below the diagonal for each candidate. */
  nnzL: Record<OrderingKind, number>
}

/** Entries of L below the diagonal for the pattern of A ∪ Aᵀ eliminated in the order `perm`. */
export function predictedFill(A: Pick<Csc, 'nRows' | 'nCols' | 'colPtr' | 'rowIdx'>, perm: Int32Array): number {
  return new LdltSymbolic(A, perm).nnzL
}

/** Both orderings of A's graph and the one with less predicted fill (ties go to AMD). */
export function chooseOrdering(A: Pick<Csc, 'nRows' | 'nCols' | 'colPtr' | 'rowIdx'>, leafSize = 64): OrderingChoice {
  const { ptr, adj } = symmetricAdjacency(A)
  const amd = approximateMinimumDegree(ptr, adj)
  const nd = nestedDissection(ptr, adj, { leafSize })
  const nnzL = { amd: predictedFill(A, amd), 'nested-dissection': predictedFill(A, nd) }
  const chosen: OrderingKind = nnzL.amd <= nnzL['nested-dissection'] ? 'amd' : 'nested-dissection'
  return { perm: chosen === 'amd' ? amd : nd, chosen, nnzL }
}
