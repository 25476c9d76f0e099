/**
 * Completing a map: after the spine and the rows, every cell connected to the seed through
 * balanced cells is reached. Repeatedly, from every solved cell and in each of the four grid
 * directions, continue (pseudo-arclength, Keller 1977, segment.ts) through the run of unsolved
 * cells next to it, up to the next solved cell or the window's edge: along rows as well as columns,
 * so a row whose spine cell is collapsed is re-seeded from its solved neighbours above or below.
 * Stops when a pass solves no new cell. Each (cell, direction) is tried once.
 *
 * What an unsolved cell then says (`endedBy`):
 * - a degeneration ("collapse", "order flip", "lattice degeneracy", "fold"): a straight run from a
 *   solved cell met it before reaching the cell — the cell lies past a degeneration;
 * - "no convergence": runs towards it failed without an event;
 * - {@link NOT_REACHED}: no straight run from a solved cell ever got to it (no balanced cell in its
 *   row or column is connected to the seed) — unreachable from the seed, nothing said about it.
 */
import { DEGENERATIONS, NOT_REACHED, pastDegeneration, type MapCell, type MapResult, type MapRow } from '../types/maps'
import type { PatternDocument } from '../types/pattern'
import { crossingsOf, segOpts, solvedCell, bind } from './sweep'
import { runSegment } from './segment'


const DIRECTIONS: readonly [number, number][] = [[0, 1], [0, -1], [1, 0], [-1, 0]]

/** The map with every cell reachable from its solved cells solved and every other cell classified (see file header). */
export function fillMap(doc: PatternDocument, settingsInput: unknown, map: MapResult): MapResult {
  const { plane, settings } = bind(doc, settingsInput)
  const rows: MapRow[] = map.rows.map(r => ({ ...r, cells: r.cells.map(c => ({ ...c })), crossings: [...r.crossings] }))
  const byI = new Map(rows.map(r => [r.i, r]))
  const at = (i: number, j: number): MapCell | undefined => byI.get(i)?.cells[j]
  const key = (c: MapCell) => `${c.i},${c.j}`
  const degeneration = new Map<string, string>()
  const failed = new Set<string>()
  // the rows' own evidence: cells after a half row's ending event
  for (const r of rows) for (const c of r.cells) if (pastDegeneration(c)) degeneration.set(key(c), c.endedBy!)
  const tried = new Set<string>()
  for (let progress = true; progress;) {
    progress = false
    for (const r of rows) {
      for (const c of r.cells) {
        if (c.status !== 'solved' || !c.u) continue
        for (const [di, dj] of DIRECTIONS) {
          const run: MapCell[] = []
          for (let i = c.i + di, j = c.j + dj; ; i += di, j += dj) {
            const n = at(i, j)
            if (!n || n.status === 'solved') break
            run.push(n)
          }
          const k = `${c.i},${c.j},${di},${dj}`
          if (!run.length || tried.has(k)) continue
          tried.add(k)
          const along = di === 0 ? 'row' : 'column'
          const slice = along === 'row' ? plane.row(c.y) : plane.column(c.x)
          const seg = runSegment(slice, c.u, along === 'row' ? c.x : c.y, run.map(n => along === 'row' ? n.x : n.y), segOpts(settings))
          r.crossings.push(...crossingsOf(seg, along, along === 'row' ? c.y : c.x))
          run.forEach((n, m) => {
            const p = seg.points[m]
            if (p) {
              byI.get(n.i)!.cells[n.j] = solvedCell(slice, n.i, n.j, n.x, n.y, p)
              progress = true
            } else if (seg.endedBy && DEGENERATIONS.includes(seg.endedBy)) {
              if (!degeneration.has(key(n))) degeneration.set(key(n), seg.endedBy)
            } else failed.add(key(n))
          })
        }
      }
    }
  }
  for (const r of rows) {
    r.cells = r.cells.map(c => c.status === 'solved' ? c : { ...c, endedBy: degeneration.get(key(c)) ?? (failed.has(key(c)) ? 'no convergence' : NOT_REACHED) })
  }
  return { ...map, rows }
}
