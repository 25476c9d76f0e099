/** Reads a pattern document from a file for the CLI commands. */
import { readFile } from 'node:fs/promises'
import { parseArgs } from 'node:util'
import { joinNegativeValues } from './args'
import { parsePatternDocument, PatternParseError, type PatternDocument } from '../shared/types/pattern'

/** The document, or the message to print (exit code 2) when the file is unreadable or invalid. */
export async function readPatternFile(file: string): Promise<{ doc: PatternDocument } | { error: string }> {
  let text: string
  try {
    text = await readFile(file, 'utf8')
  } catch (e) {
    return { error: `${file}: cannot read (${(e as NodeJS.ErrnoException).code ?? String(e)})` }
  }
  let json: unknown
  try {
    json = JSON.parse(text)
  } catch (e) {
    return { error: `${file}: not JSON (${(e as Error).message})` }
  }
  try {
    return { doc: parsePatternDocument(json) }
  } catch (e) {
    if (e instanceof PatternParseError) return { error: `${file}: not a valid pattern document\n${e.message}` }
    throw e
  }
}

type ParseArgsOptions = NonNullable<Parameters<typeof parseArgs>[0]>['options']

/**
 * Common start of the FILE commands: parse the arguments (one positional FILE), read and
 * validate the document. Returns the document and option values, or the exit code 2 after
 * printing the usage or the parser's message.
 */
export async function readCommandInput<O extends ParseArgsOptions>(
  command: string, summary: string, args: string[], options: O,
): Promise<{ doc: PatternDocument, values: Record<string, unknown> } | { exitCode: number }> {
  let parsed
  try {
    parsed = parseArgs({ args: joinNegativeValues(args, options ?? {}), allowPositionals: true, options })
  } catch (e) {
    console.error(`wingfold ${command}: ${(e as Error).message}`)
    return { exitCode: 2 }
  }
  const file = parsed.positionals[0]
  if (!file || parsed.positionals.length > 1) {
    console.error(`usage: wingfold ${command} ${summary}`)
    return { exitCode: 2 }
  }
  const read = await readPatternFile(file)
  if ('error' in read) { console.error(read.error); return { exitCode: 2 } }
  return { doc: read.doc, values: parsed.values }
}
