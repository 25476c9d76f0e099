/**
 * Command-line edges: `balance` refuses a document whose faces do not close, negative values
 * after a space (`--to -0.5`), output piped into a reader that stops early, `map --trace`.
 */
import { execFile } from 'node:child_process'
import { existsSync } from 'node:fs'
import { mkdtemp, rm, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { promisify } from 'node:util'
import { afterAll, describe, expect, it } from 'vitest'
import { findPatternExample } from '../../../shared/examples'

const root = resolve(__dirname, '../../..')
const exec = async (file: string, args: string[]) => {
  try {
    const r = await promisify(execFile)(file, args, { cwd: root, maxBuffer: 64 << 20 })
    return { code: 0, stdout: r.stdout, stderr: r.stderr }
  } catch (e) {
    const err = e as { code: number, stdout: string, stderr: string }
    return { code: err.code, stdout: err.stdout, stderr: err.stderr }
  }
}
const wingfold = (...args: string[]) => exec('node', ['--import', 'tsx', 'cli/wingfold.ts', ...args])
const dir = mkdtemp(join(tmpdir(), 'wf-cli-'))
afterAll(async () => rm(await dir, { recursive: true, force: true }))

describe('wingfold balance', () => {
  it('refuses a balanced drawing whose faces do not close: exit 1, the faces named, nothing written', async () => {
    // square-pair with the rotation at a swapped: the face walk ne:from → nw:to → sw:from → ne:to → se:from → sw:to
    // has shift sum (0,0) + (1,0) + (−1,−1) − (0,0)… = (1, −1) ≠ 0 (face closure, Mohar–Thomassen §3.2 face walks; sums derived)
    const doc = structuredClone(findPatternExample('square-pair')!.document)
    doc.rotation = { a: ['ne:from', 'se:from', 'nw:from', 'sw:from'], b: ['ne:to', 'nw:to', 'se:to', 'sw:to'] }
    const file = join(await dir, 'open.wfp.json'), out = join(await dir, 'out.wfp.json')
    await writeFile(file, JSON.stringify(doc))
    const r = await wingfold('balance', file, '-o', out)
    expect(r.code).toBe(1)
    expect(r.stderr).toMatch(/faces of the drawing do not close/)
    expect(r.stderr).toContain('face 0 (ne:from → nw:to → sw:from → ne:to → se:from → sw:to): shifts sum to (1, -1)')
    expect(r.stderr).toContain('face 1 (nw:from → se:to): shifts sum to (-1, 1)')
    expect(existsSync(out)).toBe(false)
    // the closing original still balances
    expect((await wingfold('balance', 'shared/examples/square-pair.wfp.json')).code).toBe(0)
  })
})

describe('negative values', () => {
  it('--to -0.5 works like --to=-0.5', async () => {
    const a = await wingfold('follow', 'shared/examples/fermat-pair.wfp.json', '--path', 'shear', '--to', '-0.5', '--json')
    const b = await wingfold('follow', 'shared/examples/fermat-pair.wfp.json', '--path', 'shear', '--to=-0.5', '--json')
    expect(a.code).toBe(0)
    const [ra, rb] = [JSON.parse(a.stdout), JSON.parse(b.stdout)]
    expect(ra.settings.to).toBe(-0.5)
    expect(ra.branch.points.at(-1).lambda).toBeCloseTo(-0.5, 8)
    expect(ra.branch.points.length).toBe(rb.branch.points.length)
  })
})

describe('output into a pipe that closes early', () => {
  it('map … | head ends quietly with exit 0 (no EPIPE crash)', async () => {
    // ~100 kB of JSON, more than a pipe holds, so the writer meets the closed pipe
    const cmd = 'set -o pipefail; node --import tsx cli/wingfold.ts map shared/examples/fermat-pair.wfp.json --re -0.5:1.5:20 --im 0.3:1.5:20 --json | head -c 200 > /dev/null'
    const r = await exec('bash', ['-c', cmd])
    expect(r.stderr).not.toMatch(/EPIPE/)
    expect(r.code).toBe(0)
  })
})

describe('wingfold map --trace', () => {
  it('traces the collapse curve through the crossings: arg τ = 120° (Fermat–Torricelli, Kimberling X(13))', async () => {
    // in this window only the angle at 0, arg τ, reaches 120° (see tests/unit/maps/map-cli.test.ts)
    const args = ['map', 'shared/examples/fermat-pair.wfp.json', '--re', '-0.5:0.5:11', '--im', '0.8:2:5', '--trace']
    const json = await wingfold(...args, '--json')
    expect(json.code).toBe(0)
    const m = JSON.parse(json.stdout) as { curves: { kind: string, points: [number, number][] }[] }
    expect(m.curves.map(c => c.kind)).toEqual(['collapse of edge to-origin'])
    for (const [x, y] of m.curves[0]!.points) expect(Math.abs(Math.atan2(y, x) - 2 * Math.PI / 3)).toBeLessThan(1e-8)
    const text = await wingfold(...args)
    expect(text.stdout).toMatch(/curve: collapse of edge to-origin, \d+ points/)
  })
})
