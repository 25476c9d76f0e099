/**
 * `npm run db:seed`: apply migrations and (re)create the demo data in the configured database
 * (NUXT_DATABASE_URL, default file:./data/wingfold.db). Uses the same scrypt hasher as the server
 * (@adonisjs/hash with default options, which nuxt-auth-utils wraps). Run through tsx with
 * `--tsconfig .nuxt/tsconfig.server.json` (written by `nuxt prepare` at install), so the server
 * utilities the seed shares with the routes resolve their `#shared` imports.
 */
import { readFileSync } from 'node:fs'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { openDatabase } from './client'
import { applyMigrations, resolveMigrationsDir } from './migrate'
import { seedDemo } from './seed'

const url = process.env.NUXT_DATABASE_URL || 'file:./data/wingfold.db'
const hasher = new Hash(new Scrypt({}))
const { db, close } = await openDatabase(url)
await applyMigrations(db, resolveMigrationsDir(process.env.NUXT_MIGRATIONS_DIR))
const { version } = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string }
const result = await seedDemo(db, { hash: p => hasher.make(p), appVersion: version })
console.log(`Seeded ${url}: ${result.users} demo accounts, ${result.projects} projects, ${result.graphs} new graphs, ${result.runs} new runs, ${result.maps} new maps, ${result.comments} new comments.`)
close()
