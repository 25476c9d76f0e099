/** Wingfold's families on the continuation engine: problems, runner, verification. */
export * from './lattice-paths'
export * from './events'
export * from './torus'
export * from './plane'
export * from './phase'
export * from './build'
export * from './runner'
export * from './verify'
