/** `wingfold balance FILE [-o OUT]`: balance the drawing and write the balanced document. */
import { writeFile } from 'node:fs/promises'
import { balancePattern } from '../../shared/pattern/balance-solve'
import { readCommandInput } from '../read-document'

export const summary = 'FILE [-o OUT]           balance the drawing; write the document (stdout without -o)'

/** Runs the command; returns the exit code. */
export async function run(args: string[]): Promise<number> {
  const input = await readCommandInput('balance', summary, args, { output: { type: 'string', short: 'o' } })
  if ('exitCode' in input) return input.exitCode
  const r = balancePattern(input.doc)
  const line = `${r.converged ? 'balanced' : 'not balanced'} after ${r.iterations} Newton steps, |B| = ${r.residualNorm.toExponential(2)}`
  if (!r.converged) {
    console.error(`${line}: ${r.reason}. Nothing written.`)
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
