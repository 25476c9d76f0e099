/**
 * `wingfold certify` as a user runs it (node + tsx): a rigid demo pattern certifies (exit 0) with
 * its checklist; a non-rigid one (square grid: its lines slide, see the check command's verdict)
 * does not (exit 1, "not rigid"); a run export certifies every point given its pattern, and
 * without the pattern is bad usage (exit 2).
 */
import { mkdtemp, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { runCli } from '../../support/cli'
import { FamilyRunner } from '../../../shared/families/runner'
import { findPatternExample } from '../../../shared/examples'

const run = runCli
const example = (slug: string) => `shared/examples/${slug}.wfp.json`

describe('wingfold certify', () => {
  it('certifies the square pair and marks rigidity as proven by interval arithmetic', async () => {
    const r = await run('certify', example('square-pair'))
    expect(r.code).toBe(0)
    expect(r.stdout).toMatch(/horizontal balance: certified \(radius/)
    expect(r.stdout).toMatch(/T7 +rigid .*proven by interval arithmetic/)
    expect(r.stdout).toMatch(/T5 .* numerical evidence/)
  })
  it('refuses the non-rigid square grid', async () => {
    const r = await run('certify', example('square-grid'), '--json')
    expect(r.code).toBe(1)
    const out = JSON.parse(r.stdout)
    expect(out.certificate.horizontal.certified).toBe(false)
    expect(out.certificate.horizontal.reason).toBe('not-rigid')
    expect(out.checklist.find((c: { id: string }) => c.id === 'T7').status).toBe('fails')
  })
  it('certifies every point of a run export given its pattern', async () => {
    const fermat = findPatternExample('fermat-pair')!
    const settings = { path: { kind: 'shear' as const }, to: -0.3, stop: { maxPoints: 6 } }
    const runner = new FamilyRunner(fermat.document, settings)
    const points: unknown[] = []
    for (;;) {
      const b = runner.step({ points: 10, ms: 60_000 })
      points.push(...b.points.map(p => ({ index: p.index, lambda: p.lambda, u: Array.from(p.u) })))
      if (b.done) break
    }
    const dir = await mkdtemp(join(tmpdir(), 'wingfold-certify-'))
    const file = join(dir, 'run.json')
    await writeFile(file, JSON.stringify({ format: 'wingfold-run', name: 'shear', settings, points }))
    const r = await run('certify', file, '--pattern', example('fermat-pair'))
    expect(r.code).toBe(0)
    expect(r.stdout).toContain(`${points.length} of ${points.length} points certified, ${points.length - 1} of ${points.length - 1} segments`)
    expect((await run('certify', file)).code).toBe(2)
  })
})
