import { afterEach, describe, expect, it, vi } from 'vitest'
import { run } from '../../../cli/commands/census'

afterEach(() => { vi.restoreAllMocks() })

function capture() {
  const out: string[] = [], err: string[] = []
  vi.spyOn(console, 'log').mockImplementation((...a: unknown[]) => { out.push(a.join(' ')) })
  vi.spyOn(console, 'error').mockImplementation((...a: unknown[]) => { err.push(a.join(' ')) })
  return { out, err }
}

describe('wingfold census', () => {
  it('prints the census as JSON with both bounds', async () => {
    const { out } = capture()
    expect(await run(['--max-towers', '2', '--max-half-edges', '8', '--json'])).toBe(0)
    const r = JSON.parse(out.join('\n'))
    expect(r.bounds).toEqual({ maxTowers: 2, maxHalfEdges: 8 })
    expect(r.count).toBe(r.patterns.length)
    // H. Chen, M. Traizet, arXiv 2103.15676 (2021), Theorem C.1: the two genus-3 graphs
    const g3 = r.patterns.filter((p: { predictedGenus: number }) => p.predictedGenus === 3)
    expect(g3.map((p: { towers: number, edges: number }) => `${p.towers}/${p.edges}`).sort()).toEqual(['1/3', '2/4'])
    for (const p of r.patterns) expect(p.halfEdges).toBeLessThanOrEqual(8)
  })

  it('prints a table with the evidence line, and refuses missing bounds with exit code 2', async () => {
    const { out, err } = capture()
    expect(await run(['--max-towers', '1', '--max-half-edges', '6', '--no-search'])).toBe(0)
    expect(out.join('\n')).toMatch(/1 patterns with towers ≤ 1 and half-edges ≤ 6/)
    expect(out.at(-1)).toBe('Results are numerical evidence, not proofs.')
    expect(await run(['--max-towers', '2'])).toBe(2)
    expect(err.join('\n')).toMatch(/--max-half-edges wants an integer/)
    expect(await run(['--max-towers', '2', '--max-half-edges', '8', '--lattice', '1,0,2,0'])).toBe(2)
  })
})
