/** The command line as a user runs it (node + tsx, as `npm run wingfold` does), for the CLI tests. */
import { execFile } from 'node:child_process'
import { resolve } from 'node:path'
import { promisify } from 'node:util'

/** The repository root (the CLI resolves files from it). */
export const ROOT_DIR = resolve(__dirname, '../..')

/** Runs `wingfold ARGS…` and returns its exit code and output (never throws on a non-zero exit). */
export async function runCli(...args: string[]): Promise<{ code: number, stdout: string, stderr: string }> {
  try {
    const r = await promisify(execFile)('node', ['--import', 'tsx', 'cli/wingfold.ts', ...args], { cwd: ROOT_DIR })
    return { code: 0, stdout: r.stdout, stderr: r.stderr }
  } catch (e) {
    const err = e as { code: number, stdout: string, stderr: string }
    return { code: err.code, stdout: err.stdout, stderr: err.stderr }
  }
}

/** Path of a committed example document, relative to the root. */
export const examplePath = (slug: string) => `shared/examples/${slug}.wfp.json`
