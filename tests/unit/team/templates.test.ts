/** Mail templates: same content in text and HTML, every inserted value escaped. */
import { describe, expect, it } from 'vitest'
import { commentMail, invitationMail, passwordResetMail, runVerdictMail } from '../../../server/mail/templates'

const url = 'https://wingfold.example/invitations/abc_DEF-123'

describe('mail templates', () => {
  it('puts the link in both bodies and names project, inviter and role', () => {
    const m = invitationMail({ projectName: 'Torus gluings', inviterName: 'Tomas', role: 'editor', url, expiresAt: new Date('2030-01-02T03:04:05Z') })
    expect(m.subject).toBe('Tomas invited you to “Torus gluings” on Wingfold')
    expect(m.text).toContain(`Accept the invitation: ${url}`)
    expect(m.text).toContain('as an editor')
    expect(m.html).toContain(`href="${url}"`)
    expect(m.text).toContain('Wed, 02 Jan 2030 03:04:05 GMT')
  })

  it('escapes markup coming from user-chosen names', () => {
    const m = invitationMail({ projectName: '<img src=x onerror=alert(1)>', inviterName: 'A & B', role: 'viewer', url, expiresAt: new Date(0) })
    expect(m.html).not.toContain('<img')
    expect(m.html).toContain('&lt;img src=x onerror=alert(1)&gt;')
    expect(m.html).toContain('A &amp; B')
    // the plain-text body carries the names as typed
    expect(m.text).toContain('<img src=x onerror=alert(1)>')
  })

  it('escapes a quote in a link so it cannot leave the href attribute', () => {
    const m = passwordResetMail({ name: 'X', url: 'https://a.example/"onmouseover="x', minutes: 60 })
    expect(m.html).toContain('href="https://a.example/&quot;onmouseover=&quot;x"')
    expect(m.text).toContain('for 60 minutes')
  })

  it('states the verdict, the reason and the evidence caveat', () => {
    const m = runVerdictMail({ name: 'Neve', runName: 'shear a', projectName: 'P', verdict: 'rejected', reason: 'point 7: residual 3e-2', url })
    expect(m.subject).toBe('Run “shear a” was rejected')
    expect(m.text).toContain('Reason: point 7: residual 3e-2')
    expect(m.text).toContain('Results are numerical evidence, not proofs.')
    expect(m.text).toContain('Turn them off on your account page.')
  })

  it('quotes the comment in a notice', () => {
    const m = commentMail({ name: 'Neve', authorName: 'Rafi', runName: 'shear a', excerpt: 'Look at the fold near *a* = 0.3', url })
    expect(m.text).toContain('Rafi wrote:\n\nLook at the fold near *a* = 0.3')
  })
})
