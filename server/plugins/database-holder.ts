/**
 * Writes `<database>.server.json` (this process id) while the server runs, so `npm run
 * db:restore` refuses to replace a database in use; removed again on close. A file left by a
 * crashed server names a dead process and is ignored.
 */
import { rmSync, writeFileSync } from 'node:fs'
import { databaseFilePath } from '../db/client'
import { holderFile } from '../db/backup'

export default defineNitroPlugin((nitroApp) => {
  const file = databaseFilePath(useRuntimeConfig().databaseUrl)
  if (!file) return
  ensureDatabase().then(() => writeFileSync(holderFile(file),
    JSON.stringify({ pid: process.pid, startedAt: new Date().toISOString() })))
    .catch(e => console.error('[wingfold] could not write the database holder file:', e))
  nitroApp.hooks.hook('close', () => rmSync(holderFile(file), { force: true }))
})
