/** `wingfold schema [-o OUT]`: print the JSON Schema of the pattern document (from the zod schema). */
import { writeFile } from 'node:fs/promises'
import { parseArgs } from 'node:util'
import { z } from 'zod'
import { PatternDocumentSchema } from '../../shared/types/pattern'

export const summary = '[-o OUT]                print the JSON Schema of pattern documents'

/** The JSON Schema text as committed in docs/pattern.schema.json. */
export function patternJsonSchemaText(): string {
  const schema = {
    ...z.toJSONSchema(PatternDocumentSchema),
    $id: 'https://wingfold.example/pattern.schema.json',
    title: 'Wingfold pattern document (.wfp.json)',
  }
  return `${JSON.stringify(schema, null, 2)}\n`
}

/** Runs the command; returns the exit code. */
export async function run(args: string[]): Promise<number> {
  let parsed
  try {
    parsed = parseArgs({ args, options: { output: { type: 'string', short: 'o' } } })
  } catch (e) {
    console.error(`wingfold schema: ${(e as Error).message}`)
    return 2
  }
  const text = patternJsonSchemaText()
  if (parsed.values.output) await writeFile(parsed.values.output, text)
  else process.stdout.write(text)
  return 0
}
