/** `wingfold follow` as a user runs it (node + tsx): special points in text, all points with --json, exit codes. */
import { execFile } from 'node:child_process'
import { resolve } from 'node:path'
import { promisify } from 'node:util'
import { describe, expect, it } from 'vitest'

const root = resolve(__dirname, '../../..')
const follow = async (...args: string[]) => {
  try {
    const r = await promisify(execFile)('node', ['--import', 'tsx', 'cli/wingfold.ts', 'follow', ...args], { cwd: root })
    return { code: 0, stdout: r.stdout, stderr: r.stderr }
  } catch (e) {
    const err = e as { code: number, stdout: string, stderr: string }
    return { code: err.code, stdout: err.stdout, stderr: err.stderr }
  }
}

describe('wingfold follow', () => {
  it('prints the special points of a shear of the Fermat pair', async () => {
    // fermat-pair: ω1 = (2, 0), ω2 = (1, 2) + s·ω1; the angle at the corner ω1 of the triangle
    // (0, ω1, ω2) reaches 120° where (1 + 2s − 2, 2)·(−1, 0) = −½|…|, i.e. 2s − 1 = 2/√3,
    // s = ½ + 1/√3 (Fermat–Torricelli, C. Kimberling, Encyclopedia of Triangle Centers, X(13))
    const r = await follow('shared/examples/fermat-pair.wfp.json', '--path', 'shear', '--to', '2')
    expect(r.code).toBe(0)
    const m = r.stdout.match(/collapse\s+λ = ([\d.]+)/)
    expect(m).not.toBeNull()
    expect(Math.abs(Number(m![1]) - (0.5 + 1 / Math.sqrt(3)))).toBeLessThan(1e-2) // default collapse tolerance 1e-3 of the mean
  })

  it('prints the whole run as JSON and honours --max-points', async () => {
    const r = await follow('shared/examples/fermat-pair.wfp.json', '--path', 'shear', '--to', '0.6', '--json', '--max-points', '3')
    expect(r.code).toBe(0)
    const res = JSON.parse(r.stdout)
    expect(res.branch.points).toHaveLength(3)
    expect(res.settings.stop.maxPoints).toBe(3)
    expect(res.branch.finishReason).toMatch(/maxPoints/)
  })

  it('exits 2 on bad usage and on a path that does not fit the pattern', async () => {
    expect((await follow('shared/examples/fermat-pair.wfp.json')).code).toBe(2)
    const r = await follow('shared/examples/plane-bridge.wfp.json', '--path', 'shear', '--to', '1')
    expect(r.code).toBe(2)
    expect(r.stderr).toMatch(/torus/)
  })
})
