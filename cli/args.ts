/** Argument helpers shared by the CLI commands. */
import type { parseArgs } from 'node:util'

type ParseArgsOptions = NonNullable<NonNullable<Parameters<typeof parseArgs>[0]>['options']>

/**
 * Joins `--to -0.5` into `--to=-0.5` for every string option (node's parseArgs reads a value with
 * a leading '-' as an option of its own), so negative numbers work with or without '='.
 */
export function joinNegativeValues(args: string[], options: ParseArgsOptions): string[] {
  const takesValue = new Set(Object.entries(options).flatMap(([k, o]) => o.type === 'string' ? [`--${k}`, ...(o.short ? [`-${o.short}`] : [])] : []))
  const out: string[] = []
  for (let k = 0; k < args.length; k++) {
    const a = args[k]!, b = args[k + 1]
    if (takesValue.has(a) && b !== undefined && /^-\.?\d/.test(b)) { out.push(`${a}=${b}`); k++ } else out.push(a)
  }
  return out
}
