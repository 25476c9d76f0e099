/**
 * Optional scheduled backups (runtime config `backup`: NUXT_BACKUP_INTERVAL_MINUTES > 0 turns it
 * on, NUXT_BACKUP_DIR the folder, NUXT_BACKUP_KEEP how many to keep). Each backup is a
 * `VACUUM INTO` copy (server/db/backup.ts); older scheduled copies beyond `keep` are deleted.
 */
import { resolve } from 'node:path'
import { databaseFilePath } from '../db/client'
import { scheduledBackup } from '../db/backup'

export default defineNitroPlugin((nitroApp) => {
  const { backup, databaseUrl } = useRuntimeConfig()
  const file = databaseFilePath(databaseUrl)
  const minutes = Number(backup.intervalMinutes)
  if (!file || !(minutes > 0)) return
  const dir = resolve(backup.dir)
  const timer = setInterval(() => {
    ensureDatabase()
      .then(() => scheduledBackup(file, dir, Number(backup.keep)))
      .then(r => console.info(`[wingfold] scheduled backup ${r.file}${r.removed.length ? `; removed ${r.removed.length} older` : ''}`))
      .catch(e => console.error('[wingfold] scheduled backup failed:', e))
  }, minutes * 60_000)
  timer.unref()
  nitroApp.hooks.hook('close', () => clearInterval(timer))
})
