/** Sparse linear algebra for Wingfold: storage, ordering, LDLᵀ, LU, dense reference. */
export * from './triplets'
export * from './csc'
export * from './ordering'
export * from './ldlt'
export * from './lu'
export * from './dense'
export * from './solver'
export * from './supernodal'
