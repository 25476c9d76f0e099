/** Reads a pattern document from a file for the CLI commands. */
import { readFile } from 'node:fs/promises'
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
