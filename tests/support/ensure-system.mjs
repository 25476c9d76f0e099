#!/usr/bin/env node
// Makes sure the programs the test layers start are on this machine before `npm test` spends
// minutes on the unit layer and the build: Chromium for the browser tests (Debian's package, or
// CHROMIUM_PATH) and redis-server for the queue tests (or REDIS_SERVER_PATH). Where they are
// missing it installs Debian's packages through apt-get when it can (root, or sudo without a
// password); otherwise it stops at once with one line saying what to install.
import { execFileSync, spawnSync } from 'node:child_process'
import { existsSync } from 'node:fs'

const needs = [
  { what: 'Chromium', env: 'CHROMIUM_PATH', paths: ['/usr/bin/chromium'], apt: 'chromium' },
  { what: 'redis-server', env: 'REDIS_SERVER_PATH', paths: ['/usr/bin/redis-server'], apt: 'redis-server' },
]

const onPath = (name) => spawnSync('sh', ['-c', `command -v ${name}`], { stdio: 'ignore' }).status === 0
const present = (n) => (process.env[n.env] && existsSync(process.env[n.env])) || n.paths.some(p => existsSync(p)) || onPath(n.apt)
const missing = needs.filter(n => !present(n))
if (missing.length === 0) process.exit(0)

const packages = missing.map(n => n.apt)
const isRoot = typeof process.getuid === 'function' && process.getuid() === 0
const sudo = isRoot ? [] : (spawnSync('sudo', ['-n', 'true'], { stdio: 'ignore' }).status === 0 ? ['sudo', '-n'] : null)
if (sudo === null || !onPath('apt-get')) {
  console.error(`npm test needs ${missing.map(n => n.what).join(' and ')}: install ${packages.join(' ')} `
    + `(Debian: sudo apt-get install -y ${packages.join(' ')}) or set ${missing.map(n => n.env).join(' / ')}.`)
  process.exit(1)
}
const run = (args) => {
  const [cmd, ...rest] = [...sudo, ...args]
  execFileSync(cmd, rest, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } })
}
console.log(`npm test: installing ${packages.join(' ')} from Debian's packages for the test layers`)
try {
  run(['apt-get', 'update'])
  run(['apt-get', 'install', '-y', ...packages])
}
catch {
  console.error(`npm test: apt-get could not install ${packages.join(' ')}; install them by hand and run npm test again.`)
  process.exit(1)
}
