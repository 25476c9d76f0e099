/**
 * Names and units of the quantities a run records: λ per path kind (shared/families/README.md)
 * and the per-point diagnostics. Used by the CSV header, the axis labels, the inspector and the
 * exports. One quantity has one name and one unit.
 */
import { PHASE_PATH_KINDS } from '../types/family'

/** Unit of pure numbers. */
export const DIMENSIONLESS = 'dimensionless'

/** A quantity with its display label and unit ("dimensionless" for pure numbers). */
export interface Quantity { key: string, label: string, unit: string }

const LAMBDA: Record<string, { label: string, unit: string }> = {
  'shear': { label: 'shear s (ω2 = ω2⁰ + s·ω1)', unit: DIMENSIONLESS },
  'stretch': { label: 'Im τ', unit: DIMENSIONLESS },
  'angle': { label: 'angle of ω2', unit: 'rad' },
  'interpolate': { label: 'interpolation t', unit: DIMENSIONLESS },
  'tau-polyline': { label: 'position on the τ polyline', unit: 'segments' },
  'wing-rotation': { label: 'wing angle', unit: 'rad' },
  'alpha1': { label: 'α1', unit: 'rad' },
  'alpha2': { label: 'α2', unit: 'rad' },
  'alpha-line': { label: 'line parameter t', unit: DIMENSIONLESS },
  'weight-scale': { label: 'weight factor s', unit: DIMENSIONLESS },
}

const DIAGNOSTICS: Record<string, { label: string, unit: string }> = {
  totalLength: { label: 'total length', unit: 'length' },
  minEdgeRatio: { label: 'min edge / mean edge', unit: DIMENSIONLESS },
  tauRe: { label: 'Re τ', unit: DIMENSIONLESS },
  tauIm: { label: 'Im τ', unit: DIMENSIONLESS },
  area: { label: 'cell area', unit: 'length²' },
  shapeArea: { label: 'shape area', unit: DIMENSIONLESS },
  compensateAngle: { label: 'compensating angle μ', unit: 'rad' },
  alpha1: { label: 'α1', unit: 'rad' },
  alpha2: { label: 'α2', unit: 'rad' },
  minCos: { label: 'smallest cos φ', unit: DIMENSIONLESS },
  latticeAngle: { label: 'lattice angle arg τ', unit: 'rad' },
}

const isPhase = (kind?: string) => !!kind && (PHASE_PATH_KINDS as readonly string[]).includes(kind)

/**
 * The rigidity margin a run records: for torus lattice and phase runs the rigidity verdict's own
 * σ_min (trivial motions removed, × ℓ̄ for drawings, ÷ K̄ for phases); for plane wing runs
 * ℓ̄·σ_min(F_u). Dimensionless in every case, so runs and maps of any size compare.
 */
export function sigmaMinQuantity(_kind?: string): Quantity {
  return { key: 'sigmaMin', label: 'rigidity margin σ_min', unit: DIMENSIONLESS }
}

/** max|F| of a point: dimensionless for drawings, in units of the weights for phases. */
export function residualQuantity(kind?: string): Quantity {
  return isPhase(kind) ? { key: 'residual', label: 'max|F| of the phases', unit: 'weight' } : { key: 'residual', label: 'max|F| of the drawing', unit: DIMENSIONLESS }
}

/** Pseudo-arclength and step sizes are measured in (u, λ) together, whose units mix. */
export const ARCLENGTH: Quantity = { key: 'arclength', label: 'pseudo-arclength', unit: 'u and λ units' }
export const STEP_SIZE: Quantity = { key: 'stepSize', label: 'step size', unit: 'u and λ units' }

/** λ of a path kind. */
export function lambdaQuantity(kind: string): Quantity {
  const q = LAMBDA[kind] ?? { label: 'λ', unit: DIMENSIONLESS }
  return { key: 'lambda', ...q }
}

/** A diagnostic by key (σ_min by path kind; unknown keys keep their name, dimensionless). */
export function diagnosticQuantity(key: string, kind?: string): Quantity {
  if (key === 'sigmaMin') return sigmaMinQuantity(kind)
  return { key, ...(DIAGNOSTICS[key] ?? { label: key, unit: DIMENSIONLESS }) }
}

/** "label [unit]" for headers and axes. */
export function withUnit(q: Quantity): string {
  return `${q.label} [${q.unit}]`
}

/** Diagnostics every point of a path kind records (shared/families/README.md). */
export function expectedDiagnostics(kind: string): string[] {
  if (kind === 'wing-rotation') return ['totalLength', 'minEdgeRatio', 'compensateAngle']
  if (['alpha1', 'alpha2', 'alpha-line', 'weight-scale'].includes(kind)) return ['alpha1', 'alpha2', 'minCos']
  return ['totalLength', 'minEdgeRatio', 'tauRe', 'tauIm', 'area', 'shapeArea']
}
