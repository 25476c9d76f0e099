/**
 * Wingfold's own mail templates: each returns a subject, a plain-text body and an HTML body built
 * from the same lines. Pure functions (no Nitro), so they are unit-tested directly. Every value
 * put into HTML is escaped with markdown-it's `escapeHtml`.
 */
import MarkdownIt from 'markdown-it'

const { escapeHtml } = new MarkdownIt().utils

/** A rendered message. */
export interface RenderedMail {
  subject: string
  text: string
  html: string
}

interface Layout {
  subject: string
  greeting: string
  paragraphs: string[]
  action?: { label: string, url: string }
  footer: string
}

function render({ subject, greeting, paragraphs, action, footer }: Layout): RenderedMail {
  const text = [greeting, '', ...paragraphs.flatMap(p => [p, '']),
    ...(action ? [`${action.label}: ${action.url}`, ''] : []), '—', footer].join('\n')
  const p = (s: string) => `<p style="margin:0 0 14px">${escapeHtml(s)}</p>`
  const button = action
    ? `<p style="margin:20px 0"><a href="${escapeHtml(action.url)}" style="background:#22927f;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(action.label)}</a></p>`
      + `<p style="margin:0 0 14px;font-size:12px;color:#5b6473">Or open this address: ${escapeHtml(action.url)}</p>`
    : ''
  const html = `<!doctype html><html><body style="font-family:'Space Grotesk',Arial,sans-serif;color:#1c2230;max-width:560px;margin:0 auto;padding:24px">`
    + `<p style="font-weight:700;color:#22927f;margin:0 0 18px">Wingfold</p>${p(greeting)}${paragraphs.map(p).join('')}${button}`
    + `<hr style="border:none;border-top:1px solid #e3e6eb;margin:24px 0 12px"><p style="font-size:12px;color:#5b6473;margin:0">${escapeHtml(footer)}</p></body></html>`
  return { subject, text, html }
}

const AUTOMATIC = 'This message was sent automatically by Wingfold.'
const NOTICE_FOOTER = 'You receive notices about your runs. Turn them off on your account page.'

/** Invitation to join a project with a role. */
export function invitationMail(v: { projectName: string, inviterName: string, role: string, url: string,
  expiresAt: Date }): RenderedMail {
  return render({
    subject: `${v.inviterName} invited you to “${v.projectName}” on Wingfold`,
    greeting: 'Hello,',
    paragraphs: [
      `${v.inviterName} invited you to join the project “${v.projectName}” as ${v.role === 'editor' ? 'an' : 'a'} ${v.role}.`,
      `The link works once and until ${v.expiresAt.toUTCString()}. If you did not expect this, ignore this message.`,
    ],
    action: { label: 'Accept the invitation', url: v.url },
    footer: AUTOMATIC,
  })
}

/** Password-reset link. */
export function passwordResetMail(v: { name: string, url: string, minutes: number }): RenderedMail {
  return render({
    subject: 'Reset your Wingfold password',
    greeting: `Hello ${v.name},`,
    paragraphs: [
      `Someone (probably you) asked to reset the password of this account. The link works once and for ${v.minutes} minutes.`,
      'If you did not ask for this, ignore this message: your password stays as it is.',
    ],
    action: { label: 'Choose a new password', url: v.url },
    footer: AUTOMATIC,
  })
}

/** Notice to a run's author: the run was verified or rejected. */
export function runVerdictMail(v: { name: string, runName: string, projectName: string,
  verdict: 'verified' | 'rejected', reason?: string | null, url: string }): RenderedMail {
  return render({
    subject: `Run “${v.runName}” was ${v.verdict}`,
    greeting: `Hello ${v.name},`,
    paragraphs: [
      `Your run “${v.runName}” in “${v.projectName}” was ${v.verdict} by the server.`,
      ...(v.reason ? [`Reason: ${v.reason}`] : []),
      'Results are numerical evidence, not proofs.',
    ],
    action: { label: 'Open the run', url: v.url },
    footer: NOTICE_FOOTER,
  })
}

/** Notice to a run's author: someone commented on the run. */
export function commentMail(v: { name: string, authorName: string, runName: string, excerpt: string,
  url: string }): RenderedMail {
  return render({
    subject: `${v.authorName} commented on your run “${v.runName}”`,
    greeting: `Hello ${v.name},`,
    paragraphs: [`${v.authorName} wrote:`, v.excerpt],
    action: { label: 'Read the discussion', url: v.url },
    footer: NOTICE_FOOTER,
  })
}
