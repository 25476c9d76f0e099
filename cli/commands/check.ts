/** `wingfold check FILE [--json]`: analyse a pattern and print the report. */
import { analyzePattern } from '../../shared/pattern/analyze'
import { formatReport } from '../format-report'
import { readCommandInput } from '../read-document'

export const summary = 'FILE [--json]           analyse a pattern; exit 1 when a verdict fails'

/** Runs the command; returns the exit code. */
export async function run(args: string[]): Promise<number> {
  const input = await readCommandInput('check', summary, args, { json: { type: 'boolean', default: false } })
  if ('exitCode' in input) return input.exitCode
  const report = analyzePattern(input.doc)
  console.log(input.values.json ? JSON.stringify(report, null, 2) : formatReport(report))
  return report.summary.ok ? 0 : 1
}
