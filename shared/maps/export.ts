/** Plain-text forms of a map: CSV (one line per cell) and a character picture for terminals. */
import { pastDegeneration, type MapResult } from '../types/maps'

const CSV_COLUMNS = ['i', 'j', 'x', 'y', 'status', 'sigmaMin', 'negativeEigenvalues', 'minEdgeRatio', 'lengthPerRootArea', 'minCos', 'residualNorm', 'endedBy'] as const

/** CSV with a header; x, y are Re τ, Im τ or α1, α2; empty fields where a value does not apply. */
export function mapToCsv(map: MapResult): string {
  const esc = (v: unknown) => v === undefined || v === null ? '' : typeof v === 'string' && /[",\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : String(v)
  const lines = [CSV_COLUMNS.join(',')]
  for (const r of map.rows) for (const c of r.cells) lines.push(CSV_COLUMNS.map(k => esc((c as unknown as Record<string, unknown>)[k])).join(','))
  return `${lines.join('\n')}\n`
}

/**
 * One line per row, top row = largest y: a digit is the cell's number of negative eigenvalues
 * (`?` when unknown), `x` a cell past a collapse (or order flip, lattice degeneracy, fold) met on
 * the way from a solved cell, `.` a cell unreachable from the seed; `^` marks the spine column.
 */
export function mapToText(map: MapResult): string {
  const out: string[] = []
  for (const r of [...map.rows].sort((a, b) => b.y - a.y)) {
    const chars = r.cells.map(c => c.status === 'solved' ? (c.negativeEigenvalues === undefined ? '?' : String(Math.min(9, c.negativeEigenvalues))) : pastDegeneration(c) ? 'x' : '.')
    out.push(`${r.y.toFixed(4).padStart(10)} ${chars.join('')}`)
  }
  out.push(`${''.padStart(10)} ${map.xs.map((_, j) => j === map.spineColumn ? '^' : ' ').join('')}`)
  return out.join('\n')
}
