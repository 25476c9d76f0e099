/**
 * The command line as a user runs it (node + tsx, as `npm run wingfold` does): exit codes 0 / 1 / 2,
 * the JSON report, the balance command writing a balanced document, and the committed JSON Schema.
 */
import { mkdtemp, readFile, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { describe, expect, it } from 'vitest'
import { runCli } from '../../support/cli'
import { patternJsonSchemaText } from '../../../cli/commands/schema'
import { parsePatternDocument } from '../../../shared/types/pattern'

const root = resolve(__dirname, '../../..')
const run = runCli
const example = (slug: string) => `shared/examples/${slug}.wfp.json`

describe('wingfold check', () => {
  it('exits 0 on a pattern whose verdicts all hold', async () => {
    const r = await run('check', example('square-pair'))
    expect(r.code).toBe(0)
    expect(r.stdout).toMatch(/all verdicts hold/)
  })

  it('exits 1 and prints the JSON report when a verdict fails', async () => {
    const r = await run('check', example('square-grid'), '--json')
    expect(r.code).toBe(1)
    const report = JSON.parse(r.stdout)
    expect(report.summary.failing).toEqual(['rigidity'])
    expect(report.verdicts.rigidity.inertia.zero).toBe(2)
  })

  it('exits 2 with the parser message on an invalid document, and on unreadable files', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'wingfold-'))
    const doc = JSON.parse(await readFile(join(root, example('square-pair')), 'utf8'))
    doc.edges[3].to = 'q'
    await writeFile(join(dir, 'bad.wfp.json'), JSON.stringify(doc))
    const r = await run('check', join(dir, 'bad.wfp.json'))
    expect(r.code).toBe(2)
    expect(r.stderr).toContain("edges[3].to: no vertex 'q'")
    await writeFile(join(dir, 'broken.json'), '{ not json')
    expect((await run('check', join(dir, 'broken.json'))).code).toBe(2)
    expect((await run('check', join(dir, 'missing.json'))).code).toBe(2)
    expect((await run('check')).code).toBe(2)
    expect((await run('no-such-command')).code).toBe(2)
  })
})

describe('wingfold balance', () => {
  it('writes the balanced document with -o, which then passes the balance verdict', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'wingfold-'))
    const out = join(dir, 'balanced.wfp.json')
    const r = await run('balance', example('fermat-pair'), '-o', out)
    expect(r.code).toBe(0)
    const doc = parsePatternDocument(JSON.parse(await readFile(out, 'utf8')))
    const [x, y] = doc.vertices[1]!.position
    // Fermat point X(13) (C. Kimberling, Encyclopedia of Triangle Centers) of (0, (2,0), (1,2)): (1, 1/√3)
    // (derived: the triangle is isosceles about x = 1, and its base subtends 120° at height 1/tan 60°)
    expect(Math.hypot(x - 1, y - 1 / Math.sqrt(3))).toBeLessThan(1e-12)
    const check = await run('check', out, '--json')
    expect(JSON.parse(check.stdout).verdicts.balance.ok).toBe(true)
  })
})

describe('wingfold schema', () => {
  it('matches the committed docs/pattern.schema.json', async () => {
    expect(await readFile(join(root, 'docs/pattern.schema.json'), 'utf8')).toBe(patternJsonSchemaText())
  })
})
