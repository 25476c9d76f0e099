/**
 * Mail at start-up: when no SMTP server is configured, start the in-process fake server; then
 * run the outbox timer, which retries due messages every few seconds and drops the working
 * copies of security mail whose links have expired (outbox.ts).
 */
import { deliverDue, dropExpiredDeliveryBodies, releaseStuckMessages } from '../mail/outbox'
import { mailSettings } from '../mail/config'
import { startFakeSmtp } from '../mail/fake-server'

const TICK_MS = 5000

export default defineNitroPlugin(async () => {
  try {
    const settings = mailSettings()
    await ensureDatabase()
    if (!settings.smtpUrl) {
      const port = await startFakeSmtp()
      console.info(`[wingfold] no NUXT_SMTP_URL: mail goes to the local fake SMTP server on 127.0.0.1:${port} (see /admin/outbox)`)
    }
    await releaseStuckMessages()
    const timer = setInterval(() => { deliverDue().then(dropExpiredDeliveryBodies).catch(error => console.error('[wingfold] outbox:', error)) }, TICK_MS)
    timer.unref()
  }
  catch (error) {
    console.error('[wingfold] mail start-up failed:', error)
  }
})
