/**
 * Wingfold command line: `wingfold <command> [args]` (run as `npm run wingfold -- <command> …`).
 * Each command is a module in ./commands exporting `run(args): Promise<number>` (the exit code):
 * 0 success, 1 a verdict fails or a solve does not converge, 2 unreadable input or bad usage.
 * Add a command by adding a row to COMMANDS.
 */
import process from 'node:process'

/** A command module. */
export interface CliCommand {
  /** One line for the help text. */
  summary: string
  run: (args: string[]) => Promise<number>
}

const COMMANDS: Record<string, () => Promise<CliCommand>> = {
  check: () => import('./commands/check'),
  balance: () => import('./commands/balance'),
  schema: () => import('./commands/schema'),
  follow: () => import('./commands/follow'),
  map: () => import('./commands/map'),
  surface: () => import('./commands/surface'),
  certify: () => import('./commands/certify'),
  census: () => import('./commands/census'),
}

async function help(): Promise<string> {
  const lines = ['Usage: wingfold <command> [options]', '', 'Commands:']
  for (const [name, load] of Object.entries(COMMANDS)) lines.push(`  ${name.padEnd(10)} ${(await load()).summary}`)
  return lines.join('\n')
}

/** Dispatches argv (without node and script) and returns the exit code. */
export async function main(argv: string[]): Promise<number> {
  const [name, ...rest] = argv
  if (!name || name === '--help' || name === '-h' || name === 'help') {
    console.log(await help())
    return name ? 0 : 2
  }
  const load = COMMANDS[name]
  if (!load) {
    console.error(`wingfold: unknown command '${name}'\n\n${await help()}`)
    return 2
  }
  return (await load()).run(rest)
}

// a reader that stops early (`… | head`) closes the pipe: end quietly instead of crashing with EPIPE
process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  if (e.code === 'EPIPE') process.exit(0)
  throw e
})

main(process.argv.slice(2)).then(
  (code) => { process.exitCode = code },
  (err: unknown) => { console.error(err instanceof Error ? err.stack ?? err.message : String(err)); process.exitCode = 2 },
)
