/**
 * The in-process fake SMTP server used when no `smtpUrl` is configured: smtp-server accepts
 * every message on a loopback port, mailparser decodes it, and the decoded message is written to
 * `mail_messages` (matched to the outbox row by its Message-ID, or added as a new row). So every
 * notice travels through a real SMTP conversation. A matched row only changes its status: its
 * stored bodies stay the redacted copy (see outbox.ts), never the received one with its link.
 * With NUXT_MAILBOX_DIR set, each received message is also written there as one JSON file: the
 * recipient's mailbox (tests read links from it; no route serves it).
 */
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import type { AddressInfo } from 'node:net'
import { SMTPServer } from 'smtp-server'
import { simpleParser, type AddressObject, type ParsedMail } from 'mailparser'
import { eq } from 'drizzle-orm'

let started: Promise<number> | undefined

function addresses(to: ParsedMail['to']): string {
  const list: AddressObject[] = !to ? [] : Array.isArray(to) ? to : [to]
  return list.map(a => a.text).join(', ')
}

/** Store a received message: update the outbox row with the same Message-ID, else insert one. */
export async function recordReceived(mail: ParsedMail): Promise<void> {
  const m = tables.mailMessages
  const values = {
    toAddress: addresses(mail.to),
    subject: mail.subject ?? '',
    textBody: mail.text ?? '',
    htmlBody: typeof mail.html === 'string' ? mail.html : null,
    status: 'delivered',
  }
  const db = useDb()
  const id = mail.messageId ?? null
  let [row] = id ? await db.update(m).set({ status: 'delivered' }).where(eq(m.messageId,
    id)).returning({ id: m.id }) : []
  if (!row) [row] = await db.insert(m).values({ ...values, fromAddress: mail.from?.text ?? '', messageId: id,
    sentAt: new Date() }).returning({ id: m.id })
  writeToMailbox({ outboxId: row!.id, to: values.toAddress, subject: values.subject, text: values.textBody,
    html: values.htmlBody ?? '', messageId: id ?? '' })
}

let received = 0
function writeToMailbox(message: { outboxId: number, to: string, subject: string, text: string, html: string,
  messageId: string }): void {
  const dir = process.env.NUXT_MAILBOX_DIR
  if (!dir) return
  mkdirSync(dir, { recursive: true })
  writeFileSync(join(dir, `${String(Date.now()).padStart(15, '0')}-${String(++received).padStart(6, '0')}.json`),
    JSON.stringify(message))
}

/** Start the fake server once on 127.0.0.1 (a free port); resolves to the port. */
export function startFakeSmtp(): Promise<number> {
  started ??= new Promise((resolve, reject) => {
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      banner: 'Wingfold local mailbox',
      onData(stream, _session, callback) {
        simpleParser(stream)
          .then(recordReceived)
          .then(() => callback(), error => callback(error as Error))
      },
    })
    server.on('error', error => console.error('[wingfold] fake SMTP server:', error))
    server.listen(0, '127.0.0.1', () => resolve((server.server.address() as AddressInfo).port))
    server.server.once('error', reject)
  })
  return started
}
