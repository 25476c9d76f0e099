/**
 * A throwaway Redis server (Debian's `redis-server`) on a free loopback port, without
 * persistence (`--save '' --appendonly no`), stopped by its process id. Used by the BullMQ
 * census tests; `.ci/run` installs the package.
 */
import { spawn } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { freePort } from './server'

export interface TestRedis {
  url: string
  stop: () => Promise<void>
}

/** Starts redis-server and waits until it accepts connections (its own log line says so). */
export async function startRedis(timeoutMs = 20_000): Promise<TestRedis> {
  const port = await freePort()
  const dir = mkdtempSync(join(tmpdir(), 'wingfold-redis-'))
  const child = spawn('redis-server', ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no', '--dir', dir], { stdio: ['ignore', 'pipe', 'pipe'] })
  let log = ''
  const ready = new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`redis-server did not start:\n${log}`)), timeoutMs)
    const onData = (b: Buffer) => {
      log += b.toString()
      if (log.includes('Ready to accept connections')) { clearTimeout(timer); resolve() }
    }
    child.stdout.on('data', onData); child.stderr.on('data', onData)
    child.on('exit', code => { clearTimeout(timer); reject(new Error(`redis-server exited (${code}):\n${log}`)) })
  })
  await ready
  const stop = async () => {
    if (child.exitCode === null && child.pid) {
      const gone = new Promise(resolve => child.once('exit', resolve))
      process.kill(child.pid, 'SIGTERM')
      await gone
    }
    rmSync(dir, { recursive: true, force: true })
  }
  return { url: `redis://127.0.0.1:${port}`, stop }
}
