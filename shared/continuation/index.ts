/** Generic pseudo-arclength continuation engine (see engine.ts). */
export * from './types'
export * from './options'
export { Continuation, createContinuation, runContinuation, restartFrom, validateProblem } from './engine'
export { switchBranch } from './branch-switch'
export { estimateSigmaMin } from './sigma-min'
