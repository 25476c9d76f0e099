/**
 * The nodemailer transport: the configured SMTP server (`smtpUrl`), or the in-process fake
 * server on its loopback port. Either way mail leaves through nodemailer's SMTP client.
 */
import nodemailer, { type Transporter } from 'nodemailer'
import { startFakeSmtp } from './fake-server'
import { mailSettings } from './config'

let transporter: Promise<Transporter> | undefined

async function create(): Promise<Transporter> {
  const { smtpUrl } = mailSettings()
  if (smtpUrl) return nodemailer.createTransport(smtpUrl)
  const port = await startFakeSmtp()
  return nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true,
    connectionTimeout: 5000 })
}

/** The shared transport (created on first use). */
export function useMailTransport(): Promise<Transporter> {
  transporter ??= create()
  return transporter
}
