/** `wingfold check FILE [--json]`: analyse a pattern and print the report. */
import { parseArgs } from 'node:util'
import { analyzePattern } from '../../shared/pattern/analyze'
import { formatReport } from '../format-report'
import { readPatternFile } from '../read-document'

export const summary = 'FILE [--json]           analyse a pattern; exit 1 when a verdict fails'

/** Runs the command; returns the exit code. */
export async function run(args: string[]): Promise<number> {
  let parsed
  try {
    parsed = parseArgs({ args, allowPositionals: true, options: { json: { type: 'boolean', default: false } } })
  } catch (e) {
    console.error(`wingfold check: ${(e as Error).message}`)
    return 2
  }
  const file = parsed.positionals[0]
  if (!file || parsed.positionals.length > 1) {
    console.error(`usage: wingfold check ${summary}`)
    return 2
  }
  const read = await readPatternFile(file)
  if ('error' in read) { console.error(read.error); return 2 }
  const report = analyzePattern(read.doc)
  console.log(parsed.values.json ? JSON.stringify(report, null, 2) : formatReport(report))
  return report.summary.ok ? 0 : 1
}
