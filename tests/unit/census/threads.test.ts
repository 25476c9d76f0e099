import { describe, expect, it } from 'vitest'
import { censusThreads } from '../../../server/jobs/census-threads'
import { enumerateCensus } from '../../../shared/census/enumerate'
import { runCensus, type CensusRow } from '../../../shared/census/run'
import { splitCensus, subtreeCensus } from '../../../shared/census/split'

const bounds = { maxTowers: 3, maxHalfEdges: 12 }

describe('census split into subtrees', () => {
  it('the shallow part and the subtrees together give the whole census, each class once, at every split depth', () => {
    // derived: the search tree has one node per class, so subtrees below one depth partition it
    let visitedAll = 0
    const all = [...enumerateCensus(bounds, () => { visitedAll++ })].map(p => p.code).sort()
    for (const depth of [1, 2, 3, 4]) {
      const s = splitCensus(bounds, depth)
      let visited = s.visited
      const codes = s.patterns.map(p => p.code)
      for (const t of s.tasks) for (const p of subtreeCensus(bounds, t, () => { visited++ })) codes.push(p.code)
      expect(codes.sort()).toEqual(all)
      expect(visited).toBe(visitedAll)
    }
  })
})

describe('census on worker threads', () => {
  it('two threads find the same classes with the same verdicts as one', async () => {
    const one: CensusRow[] = [], two: CensusRow[] = []
    await runCensus({ bounds, classify: { searchTau: false }, onRow: (r) => { one.push(r) } })
    const threads = censusThreads(2)
    expect(threads).not.toBeNull()
    const r = await runCensus({ bounds, classify: { searchTau: false }, onRow: (row) => { two.push(row) }, subtrees: { ...threads!, minHalfEdges: 0 } })
    const key = (x: CensusRow) => `${x.code} ${x.balanced} ${x.rigid} ${x.automorphisms}`
    expect(two.map(key).sort()).toEqual(one.map(key).sort())
    expect(new Set(two.map(x => x.code)).size).toBe(two.length)
    expect(r.progress.found).toBe(one.length)
    let visited = 0
    for (const _ of enumerateCensus(bounds, () => { visited++ })) { /* count the maps searched */ }
    expect(r.progress.visited).toBe(visited)
  }, 120_000)

  it('skips stored codes in the threads (resume)', async () => {
    const all = [...enumerateCensus(bounds)].map(p => p.code)
    const skip = all.slice(0, 5)
    const rows: CensusRow[] = []
    const r = await runCensus({ bounds, classify: { searchTau: false }, skip, onRow: (row) => { rows.push(row) }, subtrees: { ...censusThreads(2)!, minHalfEdges: 0 } })
    expect(rows.map(x => x.code).sort()).toEqual(all.slice(5).sort())
    expect(r.progress.found).toBe(all.length)
  }, 120_000)
})
