/**
 * SuperLU (scipy) side by side: writes a CSC matrix to a temporary folder and runs
 * bench/splu-reference.py with python3. Returns null ("reference not available") when python3 or
 * scipy is missing or the script fails; the bench never depends on it.
 */
import { execFileSync } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import type { Csc } from '../shared/linalg/csc'

/** One scipy ordering's median time and fill. */
export interface SpluFigure { ms: number; fill: number }
export interface SpluReference { scipy: string; orderings: Record<string, SpluFigure>; best: { spec: string } & SpluFigure }

let available: boolean | undefined

/** scipy's splu on A with each column ordering (median of `reps`), or null when not available. */
export function spluReference(A: Csc, reps = 3): SpluReference | null {
  if (available === false) return null
  const dir = mkdtempSync(join(tmpdir(), 'wingfold-bench-'))
  try {
    const base = join(dir, 'A')
    writeFileSync(`${base}.json`, JSON.stringify({ n: A.nCols, nnz: A.colPtr[A.nCols] }))
    writeFileSync(`${base}.ptr`, Buffer.from(A.colPtr.buffer, A.colPtr.byteOffset, A.colPtr.byteLength))
    const nz = A.colPtr[A.nCols]!
    writeFileSync(`${base}.idx`, Buffer.from(A.rowIdx.buffer, A.rowIdx.byteOffset, 4 * nz))
    writeFileSync(`${base}.val`, Buffer.from(A.values.buffer, A.values.byteOffset, 8 * nz))
    const script = fileURLToPath(new URL('./splu-reference.py', import.meta.url))
    const out = execFileSync('python3', [script, base, String(reps)], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'], timeout: 300_000 })
    const r = JSON.parse(out.trim().split('\n').at(-1)!) as Omit<SpluReference, 'best'>
    available = true
    let best: SpluReference['best'] | undefined
    for (const [spec, f] of Object.entries(r.orderings)) if (!best || f.ms < best.ms) best = { spec, ...f }
    return { ...r, best: best! }
  } catch {
    available = false
    return null
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}
