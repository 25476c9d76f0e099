/**
 * The map sweep: from the seed, continue to the spine column (the grid column nearest the seed's
 * x), along the spine to every row, then along each row to both sides. Every cell is reached by
 * continuation (warm starts); cells a row never reaches are "unreachable" with the reason.
 * Rows are independent once the spine is known: {@link sweepRow} is what a worker pool hands out.
 */
import { compilePattern, type PatternModel } from '../pattern/model'
import { axisValues, parseMapSettings, type MapCell, type MapCrossing, type MapResult, type MapRow, type MapRowStart, type MapSettings } from '../types/maps'
import type { PatternDocument } from '../types/pattern'
import { mapPlane, type MapPlaneModel, type PlaneSlice } from './plane'
import { fillMap } from './fill'
import { runSegment, type SegmentResult } from './segment'

/** The spine: where each row starts, plus the spine's own crossings. */
export interface MapSpine {
  settings: MapSettings
  xs: number[]
  ys: number[]
  seed: [number, number]
  spineColumn: number
  starts: MapRowStart[]
  crossings: MapCrossing[]
}

interface Bound { model: PatternModel; plane: MapPlaneModel; settings: MapSettings }

/** The pattern, its plane and the parsed settings. */
export function bind(doc: PatternDocument, settingsInput: unknown): Bound {
  const settings = parseMapSettings(settingsInput)
  const model = compilePattern(doc)
  return { model, plane: mapPlane(model, settings), settings }
}

/** Segment options from the map settings. */
export const segOpts = (s: MapSettings) => ({ ...(s.maxStep !== undefined ? { maxStep: s.maxStep } : {}), maxPoints: s.maxPointsPerRow })

/** The crossings of a segment (and the event that ended it) in plane coordinates. */
export function crossingsOf(r: SegmentResult, along: 'row' | 'column', fixed: number): MapCrossing[] {
  const list = r.crossings.map(c => ({ ...c }))
  if (r.end) list.push({ kind: r.endedBy!, lambda: r.end.lambda, u: r.end.u })
  return list.map(c => ({ kind: c.kind, lambda: c.lambda, u: c.u, along, x: along === 'row' ? c.lambda : fixed, y: along === 'row' ? fixed : c.lambda }))
}

/** Seed → spine column → every row's start. Sequential (one continuation). */
export function sweepSpine(doc: PatternDocument, settingsInput: unknown): MapSpine {
  const { plane, settings } = bind(doc, settingsInput)
  const xs = axisValues(settings.x), ys = axisValues(settings.y)
  const seed = settings.seed ?? plane.documentPoint
  let spineColumn = 0
  xs.forEach((x, j) => { if (Math.abs(x - seed[0]) < Math.abs(xs[spineColumn]! - seed[0])) spineColumn = j })
  const x0 = xs[spineColumn]!
  const starts: MapRowStart[] = ys.map((y, i) => ({ i, y }))
  const crossings: MapCrossing[] = []
  const s0 = plane.seedState(seed[0], seed[1])
  if (!s0.converged) {
    for (const r of starts) r.endedBy = 'no convergence at the seed'
    return { settings, xs, ys, seed, spineColumn, starts, crossings }
  }
  // along the seed's row to the spine column
  const toSpine = runSegment(plane.row(seed[1]), s0.u, seed[0], [x0], segOpts(settings))
  crossings.push(...crossingsOf(toSpine, 'row', seed[1]))
  const p0 = toSpine.points[0]
  if (!p0) {
    for (const r of starts) r.endedBy = toSpine.endedBy ?? 'no convergence'
    return { settings, xs, ys, seed, spineColumn, starts, crossings }
  }
  const column = plane.column(x0)
  for (const dir of [1, -1]) {
    const idx = ys.map((_, i) => i).filter(i => dir > 0 ? ys[i]! >= seed[1] : ys[i]! < seed[1])
    if (dir < 0) idx.reverse()
    const seg = runSegment(column, p0.u, seed[1], idx.map(i => ys[i]!), segOpts(settings))
    crossings.push(...crossingsOf(seg, 'column', x0))
    idx.forEach((i, k) => {
      const p = seg.points[k]
      if (p) starts[i]!.u = p.u
      else starts[i]!.endedBy = seg.endedBy ?? 'no convergence'
    })
  }
  return { settings, xs, ys, seed, spineColumn, starts, crossings }
}

/** A solved cell from the engine point reached at it. */
export function solvedCell(slice: PlaneSlice, i: number, j: number, x: number, y: number, p: NonNullable<SegmentResult['points'][number]>): MapCell {
  const v = slice.values(p)
  const cell: MapCell = { i, j, x, y, status: 'solved', residualNorm: p.residualNorm, lambda: p.lambda, u: p.u }
  for (const [k, val] of Object.entries(v)) if (val !== undefined && Number.isFinite(val)) (cell as unknown as Record<string, number>)[k] = val
  return cell
}

/** One row from its spine start: both halves, every cell solved or marked unreachable. */
export function sweepRow(doc: PatternDocument, settingsInput: unknown, start: MapRowStart, spineColumn: number): MapRow {
  const { plane, settings } = bind(doc, settingsInput)
  const xs = axisValues(settings.x)
  const { i, y } = start
  if (!start.u) {
    return { i, y, cells: xs.map((x, j) => ({ i, j, x, y, status: 'unreachable', endedBy: `row unreachable (${start.endedBy ?? 'no start'})` })), crossings: [] }
  }
  const slice = plane.row(y)
  const cells: MapCell[] = new Array(xs.length)
  const row: MapRow = { i, y, cells, crossings: [] }
  const x0 = xs[spineColumn]!
  for (const dir of [1, -1]) {
    const idx = xs.map((_, j) => j).filter(j => dir > 0 ? j >= spineColumn : j < spineColumn)
    if (dir < 0) idx.reverse()
    if (idx.length === 0) continue
    const seg = runSegment(slice, start.u, x0, idx.map(j => xs[j]!), segOpts(settings))
    row.crossings.push(...crossingsOf(seg, 'row', y))
    if (dir > 0) row.endedRight = seg.endedBy
    else row.endedLeft = seg.endedBy
    idx.forEach((j, k) => {
      const p = seg.points[k]
      cells[j] = p ? solvedCell(slice, i, j, xs[j]!, y, p) : { i, j, x: xs[j]!, y, status: 'unreachable', endedBy: seg.endedBy ?? 'no convergence' }
    })
  }
  return row
}

/** Puts rows (in any order, some possibly missing after a cancel) into a map result. */
export function assembleMap(spine: MapSpine, rows: (MapRow | undefined)[]): MapResult {
  const got = new Map(rows.filter((r): r is MapRow => !!r).map(r => [r.i, r]))
  return {
    settings: spine.settings, xs: spine.xs, ys: spine.ys, spineColumn: spine.spineColumn, seed: spine.seed,
    rows: [...got.values()].sort((a, b) => a.i - b.i),
    spineCrossings: spine.crossings,
    missingRows: spine.ys.map((_, i) => i).filter(i => !got.has(i)),
  }
}

/**
 * The whole map in this thread (CLI, tests, the server's reference): spine, rows, then the fill
 * through columns and re-seeded rows (fill.ts). `onRow` sees each row as the row sweep ends it.
 */
export function runMapSweep(doc: PatternDocument, settingsInput: unknown, onRow?: (row: MapRow) => void): MapResult {
  const spine = sweepSpine(doc, settingsInput)
  const rows = spine.starts.map((st) => {
    const r = sweepRow(doc, spine.settings, st, spine.spineColumn)
    onRow?.(r)
    return r
  })
  return fillMap(doc, spine.settings, assembleMap(spine, rows))
}
