/** `wingfold balance FILE [-o OUT]`: balance the drawing and write the balanced document. */
import { writeFile } from 'node:fs/promises'
import { parseArgs } from 'node:util'
import { balancePattern } from '../../shared/pattern/balance-solve'
import { readPatternFile } from '../read-document'

export const summary = 'FILE [-o OUT]           balance the drawing; write the document (stdout without -o)'

/** Runs the command; returns the exit code. */
export async function run(args: string[]): Promise<number> {
  let parsed
  try {
    parsed = parseArgs({ args, allowPositionals: true, options: { output: { type: 'string', short: 'o' } } })
  } catch (e) {
    console.error(`wingfold balance: ${(e as Error).message}`)
    return 2
  }
  const file = parsed.positionals[0]
  if (!file || parsed.positionals.length > 1) {
    console.error(`usage: wingfold balance ${summary}`)
    return 2
  }
  const read = await readPatternFile(file)
  if ('error' in read) { console.error(read.error); return 2 }
  const r = balancePattern(read.doc)
  const line = `${r.converged ? 'balanced' : 'not balanced'} after ${r.iterations} Newton steps, |B| = ${r.residualNorm.toExponential(2)}`
  if (!r.converged) {
    console.error(`${line}: ${r.reason}. Nothing written.`)
    return 1
  }
  const text = `${JSON.stringify(r.document, null, 2)}\n`
  if (parsed.values.output) {
    await writeFile(parsed.values.output, text)
    console.error(`${line}; wrote ${parsed.values.output}`)
  } else {
    process.stdout.write(text)
    console.error(line)
  }
  return 0
}
