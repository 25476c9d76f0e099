/**
 * `wingfold balance FILE [-o OUT]`: balance the drawing and write the balanced document. A torus
 * document whose faces do not close (lattice shifts around a face not summing to zero) is refused
 * (exit 1, the faces named, nothing written): it does not describe a drawing in the torus.
 */
import { formatNumber } from '../../shared/format'
import { writeFile } from 'node:fs/promises'
import { balancePattern } from '../../shared/pattern/balance-solve'
import { computeFaces } from '../../shared/pattern/combinatorics'
import { compilePattern } from '../../shared/pattern/model'
import { openFaces } from '../../shared/pattern/shifts'
import type { PatternDocument } from '../../shared/types/pattern'
import { readCommandInput } from '../read-document'

/** One line per face whose shifts do not sum to zero (its half-edges and the sum), empty when all close. */
function openFaceLines(doc: PatternDocument): string[] {
  const m = compilePattern(doc)
  if (m.space !== 'torus') return []
  const faces = computeFaces(m)
  return openFaces(m, faces).map(f => `face ${f.face} (${faces.cycles[f.face]!.map(h => m.halfEdgeIds[h]).join(' → ')}): shifts sum to (${f.sum.join(', ')})`)
}

export const summary = 'FILE [-o OUT]           balance the drawing; write the document (stdout without -o)'

/** Runs the command; returns the exit code. */
export async function run(args: string[]): Promise<number> {
  const input = await readCommandInput('balance', summary, args, { output: { type: 'string', short: 'o' } })
  if ('exitCode' in input) return input.exitCode
  const r = balancePattern(input.doc)
  const line = `${r.converged ? 'balanced' : 'not balanced'} after ${r.iterations} Newton steps, |B| = ${formatNumber(r.residualNorm)}`
  if (!r.converged) {
    console.error(`${line}: ${r.reason}. Nothing written.`)
    return 1
  }
  const open = openFaceLines(r.document)
  if (open.length) {
    console.error(`${line}, but the faces of the drawing do not close, so it is not a drawing in the torus. Nothing written.\n${open.map(l => `  ${l}`).join('\n')}`)
    return 1
  }
  const text = `${JSON.stringify(r.document, null, 2)}\n`
  const out = input.values.output
  if (typeof out === 'string') {
    await writeFile(out, text)
    console.error(`${line}; wrote ${out}`)
  } else {
    process.stdout.write(text)
    console.error(line)
  }
  return 0
}
