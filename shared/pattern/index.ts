/**
 * Public entry of the pattern core: parse → compile → analyse / balance / solve phases.
 * Everything here is pure TypeScript (no Vue, Nitro or DOM) for workers, server and CLI.
 */
export * from './model'
export * from './combinatorics'
export * from './orientability'
export * from './operators'
export * from './shifts'
export * from './geometry'
export * from './balance'
export * from './balance-solve'
export * from './rigidity'
export * from './spectrum'
export * from './phases'
export * from './phase-solve'
export * from './newton'
export * from './report'
export * from './analyze'
export * from './vector'
export * from './rigidity-sparse'
export * from './supercell'
