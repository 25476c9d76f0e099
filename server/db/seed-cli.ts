/**
 * `npm run db:seed`: apply migrations and (re)create the demo data in the configured database
 * (NUXT_DATABASE_URL, default file:./data/wingfold.db). Uses the same scrypt hasher as the server
 * (@adonisjs/hash with default options, which nuxt-auth-utils wraps).
 */
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { openDatabase } from './client'
import { applyMigrations, resolveMigrationsDir } from './migrate'
import { seedDemo } from './seed'

const url = process.env.NUXT_DATABASE_URL || 'file:./data/wingfold.db'
const hasher = new Hash(new Scrypt({}))
const { db, close } = await openDatabase(url)
await applyMigrations(db, resolveMigrationsDir(process.env.NUXT_MIGRATIONS_DIR))
const result = await seedDemo(db, { hash: p => hasher.make(p) })
console.log(`Seeded ${url}: ${result.users} demo accounts, ${result.projects} projects, ${result.graphs} new graphs.`)
close()
