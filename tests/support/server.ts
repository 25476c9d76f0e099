/**
 * Start Wingfold as a child process on a free port, with a fresh temporary SQLite file and a
 * generated session password: by default the BUILT server (`.output/server/index.mjs`, made by
 * `nuxt build`), or `nuxt dev` with `mode: 'dev'`. The demo seed runs on its first start, so the
 * demo accounts of server/db/demo-data.ts exist. The process runs in its own process group, and
 * `stop()` ends that group only.
 */
import { spawn, type ChildProcess } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import { existsSync, mkdtempSync, rmSync } from 'node:fs'
import { createServer } from 'node:net'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'

/** Repository root (tests/support/ → ../..). */
export const ROOT = resolve(import.meta.dirname, '../..')

/** A running test server. */
export interface TestServer {
  /** Base URL, e.g. http://127.0.0.1:41234 */
  url: string
  /** Temporary folder holding the SQLite file (removed by `stop`). */
  dataDir: string
  /** Everything the server printed so far (stdout and stderr). */
  output: () => string
  /** Stop the process and delete the temporary folder. */
  stop: () => Promise<void>
  /** SIGKILL the process (a crash) and keep the folder, to restart on the same file. */
  kill: () => Promise<void>
}

/** Options of {@link startServer}. */
export interface StartServerOptions {
  /** Extra environment variables (e.g. `NUXT_SIGN_IN_LIMIT_PER_ADDRESS`). */
  env?: Record<string, string>
  /** Milliseconds to wait for /api/health (default 60 000 for the build, 180 000 for dev). */
  timeoutMs?: number
  /** `build` (default): the production build; `dev`: `nuxt dev` with hot reload. */
  mode?: 'build' | 'dev'
  /** Reuse this data folder (e.g. restart after `kill()`) instead of a new temporary one. */
  dataDir?: string
}

const mailboxes = new Map<string, string>()

/** The fake SMTP server's mailbox folder of the test server at `url` (what recipients received). */
export function mailboxDirOf(url: string): string {
  const dir = mailboxes.get(url)
  if (!dir) throw new Error(`no test server at ${url}`)
  return dir
}

/** Ask the OS for a free TCP port. */
export function freePort(): Promise<number> {
  return new Promise((ok, fail) => {
    const srv = createServer()
    srv.once('error', fail)
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number }
      srv.close(() => ok(port))
    })
  })
}

/** Start the built server; resolves once /api/health answers 200 (migrated and seeded). */
export async function startServer(opts: StartServerOptions = {}): Promise<TestServer> {
  const dev = opts.mode === 'dev'
  const entry = join(ROOT, process.env.WINGFOLD_OUTPUT_DIR || '.output', 'server/index.mjs')
  if (!dev && !existsSync(entry)) throw new Error('No build found: run `npx nuxt build` before the server and e2e tests (npm test does).')
  const dataDir = opts.dataDir ?? mkdtempSync(join(tmpdir(), 'wingfold-test-'))
  const port = await freePort()
  const url = `http://127.0.0.1:${port}`
  let log = ''
  const devDirs = { build: join(ROOT, `.nuxt-devtest-${port}`), output: join(ROOT, `.output-devtest-${port}`) }
  const args = dev
    ? [join(ROOT, 'node_modules/nuxt/bin/nuxt.mjs'), 'dev', '--port', String(port), '--host', '127.0.0.1', '--no-fork']
    : [entry]
  const child: ChildProcess = spawn(process.execPath, args, {
    cwd: ROOT,
    detached: true,
    env: {
      ...process.env,
      HOST: '127.0.0.1',
      PORT: String(port),
      NODE_ENV: dev ? 'development' : 'production',
      NUXT_DATABASE_URL: `file:${join(dataDir, 'wingfold.db')}`,
      NUXT_MIGRATIONS_DIR: join(ROOT, 'server/migrations'),
      NUXT_SESSION_PASSWORD: randomBytes(32).toString('hex'),
      NUXT_PUBLIC_BASE_URL: url,
      // the recipients' mailbox of the fake SMTP server (tests read single-use links from it)
      NUXT_MAILBOX_DIR: join(dataDir, 'mailbox'),
      // nuxt dev clears its build and output folders: keep it away from the build under test
      // (inside the project root, where Vite may serve from; git-ignored `.nuxt-*` / `.output-*`)
      ...(dev ? { WINGFOLD_BUILD_DIR: devDirs.build, WINGFOLD_OUTPUT_DIR: devDirs.output } : {}),
      ...opts.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  child.stdout!.on('data', (d) => { log += d })
  child.stderr!.on('data', (d) => { log += d })
  const exited = new Promise<void>(ok => child.once('exit', () => ok()))

  const stop = async () => {
    if (child.exitCode === null) {
      process.kill(-child.pid!, 'SIGTERM')
      await Promise.race([exited, new Promise(ok => setTimeout(ok, 5000))])
      if (child.exitCode === null) process.kill(-child.pid!, 'SIGKILL')
    }
    rmSync(dataDir, { recursive: true, force: true })
    if (dev) for (const d of Object.values(devDirs)) rmSync(d, { recursive: true, force: true })
  }

  const kill = async () => {
    if (child.exitCode === null && child.signalCode === null) {
      process.kill(-child.pid!, 'SIGKILL')
      await exited
    }
  }

  const deadline = Date.now() + (opts.timeoutMs ?? (dev ? 180_000 : 60_000))
  while (Date.now() < deadline) {
    if (child.exitCode !== null) break
    try {
      const res = await fetch(`${url}/api/health`)
      if (res.ok) {
        mailboxes.set(url, join(dataDir, 'mailbox'))
        return { url, dataDir, output: () => log, stop, kill }
      }
    }
    catch { /* not listening yet */ }
    await new Promise(ok => setTimeout(ok, 200))
  }
  await stop()
  throw new Error(`The Wingfold server did not become healthy at ${url}.\n${log}`)
}
