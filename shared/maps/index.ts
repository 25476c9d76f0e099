/** Moduli maps: the sweep over a 2-parameter plane, curve tracing, verification. */
export * from './augmented'
export * from './collapse'
export * from './plane'
export * from './segment'
export * from './sweep'
export * from './trace'
export * from './verify'
export * from './export'
