/**
 * The continuation worker's API through comlink over a Node MessageChannel (comlink's node
 * adapter): batches reach a proxied callback, cancel ends the run with the points so far.
 */
import { MessageChannel } from 'node:worker_threads'
import { expose, proxy, wrap, type Remote } from 'comlink'
import nodeEndpoint from 'comlink/dist/esm/node-adapter'
import { afterEach, describe, expect, it } from 'vitest'
import type { FamilyBatch } from '../../../shared/families'
import { createContinuationWorkerApi, type ContinuationWorkerApi } from '../../../workers/continuation.worker'
import { fermatPair } from './fixtures'

let channel: MessageChannel | undefined
function connect(): Remote<ContinuationWorkerApi> {
  channel = new MessageChannel()
  expose(createContinuationWorkerApi(), nodeEndpoint(channel.port1))
  return wrap<ContinuationWorkerApi>(nodeEndpoint(channel.port2))
}
afterEach(() => { channel?.port1.close(); channel?.port2.close() })

describe('continuation worker over comlink', () => {
  it('streams batches to a proxied callback and resolves with the whole run', async () => {
    const api = connect()
    const batches: FamilyBatch[] = []
    const res = await api.start(fermatPair(), { path: { kind: 'shear' }, to: 1 }, proxy((b: FamilyBatch) => { batches.push(b) }), { points: 2 })
    expect(res.status).toBe('finished')
    expect(batches.flatMap(b => b.points).length).toBe(res.branch.points.length)
    expect(res.branch.specialPoints.map(s => s.kind)).toEqual(['bound'])
  })

  it('cancel from the page ends the run with every point so far', async () => {
    const api = connect()
    let seen = 0
    const done = api.start(fermatPair(), { path: { kind: 'shear' }, to: 1.5, step: { max: 0.02 } }, proxy((b: FamilyBatch) => {
      seen += b.points.length
      if (seen >= 3) void api.cancel()
    }), { points: 1 })
    const res = await done
    expect(res.status).toBe('cancelled')
    expect(res.branch.points.length).toBeGreaterThanOrEqual(3)
    expect((await api.result())!.branch.points.length).toBe(res.branch.points.length)
  })

  it('refuses a second start while a run is in progress', async () => {
    const api = connect()
    const first = api.start(fermatPair(), { path: { kind: 'shear' }, to: 1.5, step: { max: 0.02 } }, proxy(() => {}), { points: 1 })
    await expect(api.start(fermatPair(), { path: { kind: 'shear' }, to: 1 }, proxy(() => {}))).rejects.toThrow(/in progress/)
    await api.cancel()
    expect((await first).status).toMatch(/cancelled|finished/)
  })
})
