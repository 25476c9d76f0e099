/**
 * Names and units of the quantities a run records: λ per path kind (shared/families/README.md)
 * and the per-point diagnostics. Used by the CSV header, the axis labels and the exports.
 */

/** A quantity with its display label and unit ("1" for dimensionless). */
export interface Quantity { key: string, label: string, unit: string }

const LAMBDA: Record<string, { label: string, unit: string }> = {
  'shear': { label: 'shear s (ω2 = ω2⁰ + s·ω1)', unit: '1' },
  'stretch': { label: 'Im τ', unit: '1' },
  'angle': { label: 'angle of ω2', unit: 'rad' },
  'interpolate': { label: 'interpolation t', unit: '1' },
  'tau-polyline': { label: 'position on the τ polyline', unit: 'segments' },
  'wing-rotation': { label: 'wing angle', unit: 'rad' },
  'alpha1': { label: 'α1', unit: 'rad' },
  'alpha2': { label: 'α2', unit: 'rad' },
  'alpha-line': { label: 'line parameter t', unit: '1' },
  'weight-scale': { label: 'weight factor s', unit: '1' },
}

const DIAGNOSTICS: Record<string, { label: string, unit: string }> = {
  totalLength: { label: 'total length', unit: 'length' },
  minEdgeRatio: { label: 'min edge / mean edge', unit: '1' },
  tauRe: { label: 'Re τ', unit: '1' },
  tauIm: { label: 'Im τ', unit: '1' },
  area: { label: 'cell area', unit: 'length²' },
  shapeArea: { label: 'shape area', unit: '1' },
  compensateAngle: { label: 'compensating angle μ', unit: 'rad' },
  alpha1: { label: 'α1', unit: 'rad' },
  alpha2: { label: 'α2', unit: 'rad' },
  minCos: { label: 'smallest cos φ', unit: '1' },
  latticeAngle: { label: 'lattice angle arg τ', unit: 'rad' },
  sigmaMin: { label: 'σ_min(F_u)', unit: '1/length' },
}

/** λ of a path kind. */
export function lambdaQuantity(kind: string): Quantity {
  const q = LAMBDA[kind] ?? { label: 'λ', unit: '1' }
  return { key: 'lambda', ...q }
}

/** A diagnostic by key (unknown keys keep their name, unit "1"). */
export function diagnosticQuantity(key: string): Quantity {
  return { key, ...(DIAGNOSTICS[key] ?? { label: key, unit: '1' }) }
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
