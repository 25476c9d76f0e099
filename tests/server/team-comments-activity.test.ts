/**
 * Comments on runs and on points (one level of answers, safe Markdown, edit/delete rules,
 * notices to the run's author with opt-out) and the paginated, filtered activity log.
 * The run is started through the run route, as the run page does.
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { signInAs, signUp, type ApiClient } from '../support/http'
import { lastMailId, mailsTo, waitForMail } from './team-support'
import { graphIdByName } from './runs-helpers'

const ctx = useTestServer()
let owner: ApiClient, editor: ApiClient, viewer: ApiClient, admin: ApiClient, stranger: ApiClient
let projectId: number, runId: number

beforeAll(async () => {
  const url = ctx.server.url
  ;[owner, editor, viewer, admin] = await Promise.all([signInAs(url, 'owner'), signInAs(url, 'editor'), signInAs(url, 'viewer'), signInAs(url, 'admin')])
  stranger = await signUp(ctx.server.url, 'Stranger', 'stranger@example.org')
  projectId = ((await owner.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>).find(p => p.name === 'Genus-three torus gluings')!.id
  // the editor starts a run (valid settings, no points yet): the editor is its author
  const graphId = await graphIdByName(editor, projectId, 'Fermat pair (rough drawing)')
  const run = await editor.json('POST', `/api/projects/${projectId}/runs`, { graphId, name: 'shear sweep', settings: { path: { kind: 'shear' }, to: -2 } })
  expect(run.status).toBe(201)
  runId = run.body.id as number
})

describe('comments', () => {
  it('renders Markdown with raw HTML shown as text, and mails the run author', async () => {
    const after = await lastMailId(admin)
    const res = await viewer.json('POST', `/api/runs/${runId}/comments`, { body: 'The *fold* near a = 0.3 <script>alert(1)</script>' })
    expect(res.status).toBe(201)
    expect(res.body.html).toBe('<p>The <em>fold</em> near a = 0.3 &lt;script&gt;alert(1)&lt;/script&gt;</p>\n')
    expect(res.body.author.name).toBe('Rafi Okonkwe')
    const mail = await waitForMail(admin, m => m.id > after && m.kind === 'comment')
    expect(mail.toAddress).toContain('editor@lanternbay.example')
    expect(mail.subject).toBe('Rafi Okonkwe commented on your run “shear sweep”')
    expect(mail.textBody).toContain(`/projects/${projectId}/runs/${runId}`)
  })

  it('threads answers one level deep and pins point comments', async () => {
    const top = (await editor.json('POST', `/api/runs/${runId}/comments`, { body: 'On this branch point', pointIndex: -1 })).body
    const answer = await owner.json('POST', `/api/runs/${runId}/comments`, { body: 'Agreed', parentId: top.id })
    expect(answer.status).toBe(201)
    expect(answer.body.pointIndex).toBe(-1)
    const deeper = await viewer.json('POST', `/api/runs/${runId}/comments`, { body: 'too deep', parentId: answer.body.id })
    expect(deeper.status).toBe(400)
    expect(deeper.body.data.code).toBe('reply_too_deep')
    const onPoint = (await viewer.json('GET', `/api/runs/${runId}/comments?pointIndex=-1`)).body as Array<{ id: number }>
    expect(onPoint.map(c => c.id)).toEqual([top.id, answer.body.id])
  })

  it('lets authors edit their own, owners delete any, nobody else', async () => {
    const c = (await viewer.json('POST', `/api/runs/${runId}/comments`, { body: 'first thought' })).body
    expect((await editor.json('PATCH', `/api/runs/${runId}/comments/${c.id}`, { body: 'hijack' })).status).toBe(403)
    expect((await editor.json('DELETE', `/api/runs/${runId}/comments/${c.id}`)).status).toBe(403)
    const edited = await viewer.json('PATCH', `/api/runs/${runId}/comments/${c.id}`, { body: 'second thought' })
    expect(edited.body).toMatchObject({ body: 'second thought', edited: true, canEdit: true })
    const asOwner = ((await owner.json('GET', `/api/runs/${runId}/comments`)).body as Array<{ id: number, canDelete: boolean, canEdit: boolean }>).find(x => x.id === c.id)!
    expect(asOwner).toMatchObject({ canDelete: true, canEdit: false })
    expect((await owner.json('DELETE', `/api/runs/${runId}/comments/${c.id}`)).status).toBe(200)
    expect(((await viewer.json('GET', `/api/runs/${runId}/comments`)).body as Array<{ id: number }>).some(x => x.id === c.id)).toBe(false)
  })

  it('answers 404 to someone outside the project', async () => {
    expect((await stranger.json('GET', `/api/runs/${runId}/comments`)).status).toBe(404)
    expect((await stranger.json('POST', `/api/runs/${runId}/comments`, { body: 'hi' })).status).toBe(404)
  })

  it('sends no notice to an author who opted out', async () => {
    expect((await editor.json('PATCH', '/api/account/notifications', { notifyOptOut: true })).body).toEqual({ notifyOptOut: true })
    const before = (await mailsTo(admin, 'editor@lanternbay.example')).length
    expect((await viewer.json('POST', `/api/runs/${runId}/comments`, { body: 'quietly' })).status).toBe(201)
    // no waiting needed: a notice is written to the outbox before the comment route answers
    // (noticeComment → enqueueMail inserts the row, only the delivery runs in the background)
    expect((await mailsTo(admin, 'editor@lanternbay.example')).length).toBe(before)
  })
})

describe('activity log', () => {
  it('pages newest first and filters by action', async () => {
    for (const email of ['a1@example.org', 'a2@example.org', 'a3@example.org']) {
      expect((await owner.json('POST', `/api/projects/${projectId}/invitations`, { email, role: 'viewer' })).status).toBe(201)
    }
    const first = (await viewer.json('GET', `/api/projects/${projectId}/activity/entries?verb=invited&pageSize=2`)).body
    expect(first.total).toBe(3)
    expect(first.items.map((e: { data: { email: string } }) => e.data.email)).toEqual(['a3@example.org', 'a2@example.org'])
    const second = (await viewer.json('GET', `/api/projects/${projectId}/activity/entries?verb=invited&pageSize=2&page=2`)).body
    expect(second.items.map((e: { data: { email: string } }) => e.data.email)).toEqual(['a1@example.org'])
    expect(first.facets.verbs).toEqual(expect.arrayContaining(['commented', 'invited']))
    const comments = (await viewer.json('GET', `/api/projects/${projectId}/activity/entries?verb=commented`)).body
    expect(comments.items.every((e: { verb: string, actor: string }) => e.verb === 'commented')).toBe(true)
  })

  it('shows every project to admins and nobody else', async () => {
    const all = await admin.json('GET', '/api/admin/activity?pageSize=100')
    expect(all.status).toBe(200)
    expect(all.body.items.some((e: { projectId: number }) => e.projectId === projectId)).toBe(true)
    expect((await owner.json('GET', '/api/admin/activity')).status).toBe(403)
    expect((await stranger.json('GET', `/api/projects/${projectId}/activity/entries`)).status).toBe(404)
  })
})
