/** Pattern (graph) and version routes against the built server: create, save, read, restore, roles, limits. */
import { beforeAll, describe, expect, it } from 'vitest'
import { useTestServer } from '../support/fixtures'
import { signInAs, signUp, type ApiClient } from '../support/http'
import { MAX_PATTERN_BYTES } from '../../shared/types/graphs'

const ctx = useTestServer()
let editor: ApiClient, viewer: ApiClient, stranger: ApiClient
let projectId: number

/**
 * Two degree-4 towers at (0,0) and (½,½) in the unit square torus joined by the four diagonals:
 * the unit edge vectors are (±1,±1)/√2 and sum to zero at both towers, so the drawing is balanced
 * (closed form, from memory); the glued surface has genus E − V + 1 = 3 (H. Chen, M. Traizet, Gluing Karcher–Scherk saddle towers I: Triply periodic minimal surfaces, arXiv 2103.15676, 2021, Thm 6.7).
 */
function diagonalPair(b: [number, number] = [0.5, 0.5]) {
  return {
    format: 'wingfold-pattern', version: 1, name: 'Diagonal pair', space: 'torus',
    lattice: { w1: [1, 0], w2: [0, 1] },
    vertices: [{ id: 'a', position: [0, 0] }, { id: 'b', position: b }],
    edges: [
      { id: 'e1', from: 'a', to: 'b' },
      { id: 'e2', from: 'a', to: 'b', shift: [-1, 0] },
      { id: 'e3', from: 'a', to: 'b', shift: [0, -1] },
      { id: 'e4', from: 'a', to: 'b', shift: [-1, -1] },
    ],
  }
}

beforeAll(async () => {
  ;[editor, viewer] = await Promise.all([signInAs(ctx.server.url, 'editor'), signInAs(ctx.server.url, 'viewer')])
  stranger = await signUp(ctx.server.url, 'Passer-by', 'passer-by@example.org')
  const list = (await editor.json('GET', '/api/projects')).body as Array<{ id: number, name: string }>
  projectId = list.find(p => p.name === 'Genus-three torus gluings')!.id
})

describe('pattern versions', () => {
  let graphId: number

  it('creates a pattern with its first version and stores the analysis summary for the list', async () => {
    const res = await editor.json('POST', `/api/projects/${projectId}/graphs`, { name: 'Diagonal pair', document: diagonalPair(), message: 'drawn by hand' })
    expect(res.status).toBe(201)
    expect(res.body.version).toBe(1)
    graphId = res.body.id
    const list = (await viewer.json('GET', `/api/projects/${projectId}/graphs`)).body as Array<{ id: number, version: number, summary: Record<string, unknown> }>
    const item = list.find(g => g.id === graphId)!
    expect(item.version).toBe(1)
    expect(item.summary).toMatchObject({ balanced: true, rigid: true, orientable: true, gluingPattern: true, predictedGenus: 3 })
  })

  it('saves a new version with a message; the moved drawing is stored as unbalanced', async () => {
    // b moved off the centre: the unit vectors no longer cancel (closed form above)
    const res = await editor.json('POST', `/api/projects/${projectId}/graphs/${graphId}/versions`, { document: diagonalPair([0.62, 0.41]), message: 'moved b' })
    expect(res.status).toBe(201)
    expect(res.body.version).toBe(2)
    const detail = (await viewer.json('GET', `/api/projects/${projectId}/graphs/${graphId}`)).body
    expect(detail.version).toBe(2)
    expect(detail.latestVersion).toBe(2)
    expect(detail.document.vertices[1].position).toEqual([0.62, 0.41])
    expect(detail.summary.balanced).toBe(false)
    expect(detail.versions.map((v: { version: number, message: string, authorName: string }) => [v.version, v.message, v.authorName]))
      .toEqual([[2, 'moved b', 'Neve Ashdown'], [1, 'drawn by hand', 'Neve Ashdown']])
    const old = (await viewer.json('GET', `/api/projects/${projectId}/graphs/${graphId}/versions/1`)).body
    expect(old.document.vertices[1].position).toEqual([0.5, 0.5])
  })

  it('restores an old version as a new version and logs the activity', async () => {
    const res = await editor.json('POST', `/api/projects/${projectId}/graphs/${graphId}/versions/1/restore`, {})
    expect(res.status).toBe(201)
    expect(res.body.version).toBe(3)
    const detail = (await editor.json('GET', `/api/projects/${projectId}/graphs/${graphId}`)).body
    expect(detail.document.vertices[1].position).toEqual([0.5, 0.5])
    expect(detail.versions[0].message).toBe('Restored version 1')
    expect(detail.summary.balanced).toBe(true)
    const versions = (await editor.json('GET', `/api/projects/${projectId}/graphs/${graphId}/versions`)).body
    expect(versions).toHaveLength(3)
  })

  it('refuses a viewer’s save and restore (403) and hides the pattern from non-members (404)', async () => {
    const save = await viewer.json('POST', `/api/projects/${projectId}/graphs/${graphId}/versions`, { document: diagonalPair(), message: 'sneaky' })
    expect(save.status).toBe(403)
    expect(save.body.message).toContain('editor')
    expect((await viewer.json('POST', `/api/projects/${projectId}/graphs`, { name: 'x', document: diagonalPair() })).status).toBe(403)
    expect((await viewer.json('POST', `/api/projects/${projectId}/graphs/${graphId}/versions/1/restore`, {})).status).toBe(403)
    expect((await stranger.json('GET', `/api/projects/${projectId}/graphs/${graphId}`)).status).toBe(404)
    expect((await editor.json('GET', `/api/projects/${projectId}/graphs/999999`)).status).toBe(404)
    expect((await editor.json('GET', `/api/projects/${projectId}/graphs/${graphId}/versions/42`)).status).toBe(404)
  })

  it('answers 422 with the parser’s JSON paths for a document that fails the cross-checks', async () => {
    const doc = diagonalPair()
    doc.edges[2]!.to = 'q'
    const res = await editor.json('POST', `/api/projects/${projectId}/graphs/${graphId}/versions`, { document: doc, message: 'broken' })
    expect(res.status).toBe(422)
    expect(res.body.data.issues).toContainEqual({ path: 'edges[2].to', message: "no vertex 'q'" })
    const shape = await editor.json('POST', `/api/projects/${projectId}/graphs/${graphId}/versions`, { document: { ...doc, format: 'other' }, message: 'x' })
    expect(shape.status).toBe(400)
    const noMessage = await editor.json('POST', `/api/projects/${projectId}/graphs/${graphId}/versions`, { document: diagonalPair(), message: '  ' })
    expect(noMessage.status).toBe(400)
  })

  it('answers 413 with a clear message for an upload over the size limit', async () => {
    const doc = { ...diagonalPair(), notes: 'x'.repeat(MAX_PATTERN_BYTES) }
    const res = await editor.json('POST', `/api/projects/${projectId}/graphs/${graphId}/versions`, { document: doc, message: 'huge' })
    expect(res.status).toBe(413)
    expect(res.body.message).toMatch(/limited to 2\.0 MB/)
  })
})
