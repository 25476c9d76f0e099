/**
 * Database backups against the built server: `npm run db:backup` while projects are being created
 * through the API, `npm run db:restore` of that copy into a new place (integrity_check passes and
 * every row committed before the backup started is there), the restore refusals (a server holds
 * the database, a damaged file, a file from a newer schema) and the scheduled backups with their
 * retention.
 */
import { spawn } from 'node:child_process'
import { existsSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { createClient } from '@libsql/client'
import { afterAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { signInAs } from '../support/http'
import { ROOT, startServer } from '../support/server'

const ctx = useTestServer()
const work = mkdtempSync(join(tmpdir(), 'wingfold-backup-test-'))
afterAll(() => rmSync(work, { recursive: true, force: true }))

/** Run one of the npm scripts' entry files with tsx; resolves with exit code and output. */
function script(file: 'backup-cli.ts' | 'restore-cli.ts', arg: string, dbFile: string): Promise<{ code: number, out: string }> {
  return new Promise((ok) => {
    const child = spawn(join(ROOT, 'node_modules/.bin/tsx'), [join(ROOT, 'server/db', file), arg], {
      cwd: ROOT, env: { ...process.env, NUXT_DATABASE_URL: `file:${dbFile}`, NUXT_MIGRATIONS_DIR: join(ROOT, 'server/migrations') },
    })
    let out = ''
    child.stdout.on('data', (d) => { out += d })
    child.stderr.on('data', (d) => { out += d })
    child.on('exit', code => ok({ code: code ?? -1, out }))
  })
}

async function query(file: string, sql: string) {
  const db = createClient({ url: `file:${file}` })
  try { return (await db.execute(sql)).rows } finally { db.close() }
}

const serverDb = () => join(ctx.server.dataDir, 'wingfold.db')

describe('database backup and restore', () => {
  it('a backup taken during concurrent writes restores to a sound database with every row committed before it began', async () => {
    const owner = await signInAs(ctx.server.url, 'owner')
    const committed: Array<{ name: string, at: number }> = []
    let writing = true, n = 0
    const writers = [0, 1].map(async (w) => {
      while (writing) {
        const name = `backup load ${w}-${n++}`
        const r = await owner.json('POST', '/api/projects', { name })
        expect(r.status).toBe(201)
        committed.push({ name, at: Date.now() })
      }
    })
    while (committed.length < 20) await new Promise(ok => setImmediate(ok)) // writes are under way
    const out = join(work, 'during-writes.db')
    const started = Date.now()
    // every write answered by now was committed before the backup begins (the list is a snapshot
    // taken synchronously here; a write answered in this same millisecond is in it too)
    const before = committed.map(c => c.name)
    const backup = await script('backup-cli.ts', out, serverDb())
    const finished = Date.now()
    writing = false
    await Promise.all(writers)
    expect(backup.code, backup.out).toBe(0)
    expect(committed.filter(c => c.at > started && c.at < finished).length).toBeGreaterThan(0) // writes went on meanwhile

    const restored = join(work, 'restored', 'wingfold.db')
    const restore = await script('restore-cli.ts', out, restored)
    expect(restore.code, restore.out).toBe(0)
    expect((await query(restored, 'PRAGMA integrity_check'))[0]![0]).toBe('ok')
    const names = new Set((await query(restored, 'SELECT name FROM projects')).map(r => String(r.name)))
    expect(before.length).toBeGreaterThanOrEqual(20)
    for (const name of before) expect(names.has(name), name).toBe(true)
    const live = Number((await query(serverDb(), 'SELECT count(*) FROM projects'))[0]![0])
    expect(names.size).toBeLessThan(live) // the copy is a snapshot: later writes are not in it
  })

  it('refuses to write over an existing file', async () => {
    const out = join(work, 'exists.db')
    writeFileSync(out, 'x')
    const r = await script('backup-cli.ts', out, serverDb())
    expect(r.code).toBe(1)
    expect(r.out).toContain('already exists')
  })

  it('refuses to restore over the database of a running server, and changes nothing', async () => {
    expect(existsSync(`${serverDb()}.server.json`)).toBe(true)
    const copy = join(work, 'copy.db')
    expect((await script('backup-cli.ts', copy, serverDb())).code).toBe(0)
    const r = await script('restore-cli.ts', copy, serverDb())
    expect(r.code).toBe(1)
    expect(r.out).toMatch(/a Wingfold server \(process \d+.*holds/)
    expect(r.out).toContain('Nothing was replaced')
    expect(readdirSync(ctx.server.dataDir).some(f => f.includes('before-restore'))).toBe(false)
  })

  it('refuses a damaged file and a file from a newer schema', async () => {
    const target = join(work, 'target', 'wingfold.db')
    const junk = join(work, 'junk.db')
    writeFileSync(junk, 'SQLite format 3\0but nothing else of a database')
    const bad = await script('restore-cli.ts', junk, target)
    expect(bad.code).toBe(1)
    expect(bad.out).toContain('Refused')
    expect(existsSync(target)).toBe(false)

    const newer = join(work, 'newer.db')
    expect((await script('backup-cli.ts', newer, serverDb())).code).toBe(0)
    const db = createClient({ url: `file:${newer}` })
    await db.execute({ sql: 'INSERT INTO __drizzle_migrations (hash, created_at) VALUES (?, ?)', args: ['f'.repeat(64), 4102444800000] })
    db.close()
    const r = await script('restore-cli.ts', newer, target)
    expect(r.code).toBe(1)
    expect(r.out).toMatch(/newer version/)
    expect(existsSync(target)).toBe(false)
  })

  it('takes scheduled backups into the configured folder and keeps the newest ones', async () => {
    const dir = join(work, 'scheduled')
    const server = await startServer({ env: { NUXT_BACKUP_INTERVAL_MINUTES: '0.01', NUXT_BACKUP_DIR: dir, NUXT_BACKUP_KEEP: '2' } })
    try {
      const deadline = Date.now() + 30_000
      while (!/removed 1 older/.test(server.output()) && Date.now() < deadline) await new Promise(ok => setTimeout(ok, 100))
      expect(server.output()).toMatch(/removed 1 older/)
      const files = readdirSync(dir).filter(f => f.endsWith('.db'))
      expect(files.length).toBeLessThanOrEqual(2)
      expect((await query(join(dir, files[0]!), 'PRAGMA integrity_check'))[0]![0]).toBe('ok')
    } finally {
      await server.stop()
    }
  })
})
