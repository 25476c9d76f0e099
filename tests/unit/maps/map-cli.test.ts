/** `wingfold map` as a user runs it: JSON of the Fermat pair's τ map, text picture, exit codes. */
import { execFile } from 'node:child_process'
import { resolve } from 'node:path'
import { promisify } from 'node:util'
import { describe, expect, it } from 'vitest'
import type { MapResult } from '../../../shared/types/maps'

const root = resolve(__dirname, '../../..')
const map = async (...args: string[]) => {
  try {
    const r = await promisify(execFile)('node', ['--import', 'tsx', 'cli/wingfold.ts', 'map', ...args], { cwd: root, maxBuffer: 64 << 20 })
    return { code: 0, stdout: r.stdout, stderr: r.stderr }
  } catch (e) {
    const err = e as { code: number, stdout: string, stderr: string }
    return { code: err.code, stdout: err.stdout, stderr: err.stderr }
  }
}

describe('wingfold map', () => {
  it('maps the Fermat pair: unreachable exactly where arg τ ≥ 120° (the corner angle at 0)', async () => {
    const r = await map('shared/examples/fermat-pair.wfp.json', '--plane', 'tau', '--re', '-0.5:0.5:11', '--im', '0.8:2:5', '--json', '--collapse-tolerance', '1e-7')
    expect(r.code).toBe(0)
    const m = JSON.parse(r.stdout) as MapResult
    // Fermat–Torricelli (Kimberling X(13)): in this window only the angle at 0, arg τ, can reach 120°
    for (const c of m.rows.flatMap(row => row.cells)) expect(c.status).toBe(Math.atan2(c.y, c.x) < 2 * Math.PI / 3 ? 'solved' : 'unreachable')
    expect(m.rows.flatMap(row => row.cells).some(c => c.status === 'unreachable')).toBe(true)
  })

  it('prints a picture and exits 2 on bad axes', async () => {
    const ok = await map('shared/examples/square-pair.wfp.json', '--re', '-0.2:0.2:3', '--im', '1:1.2:2')
    expect(ok.code).toBe(0)
    expect(ok.stdout).toMatch(/tau map 3×2: 6 cells solved, 0 past a degeneration, 0 unreachable from the seed/)
    expect((await map('shared/examples/square-pair.wfp.json', '--re', '1:0:3', '--im', '1:2:3')).code).toBe(2)
    expect((await map('shared/examples/square-pair.wfp.json', '--re', 'x')).code).toBe(2)
  })
})
