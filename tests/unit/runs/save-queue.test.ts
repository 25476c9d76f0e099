/** The live run's save queue: saves in order, bounds the unsaved points, releases on error, flushes. */
import { describe, expect, it } from 'vitest'
import type { FamilyBatch } from '../../../shared/families/runner'
import { SaveQueue } from '../../../app/utils/family/save-queue'

const batch = (n: number): FamilyBatch => ({ points: Array.from({ length: n }, (_, i) => ({ index: i }) as never), specialPoints: [], progress: {} as never, done: false })

/** A save the test resolves by hand, one at a time. */
function manualServer() {
  const pending: { resolve: () => void, reject: (e: Error) => void }[] = []
  return { save: () => new Promise<void>((resolve, reject) => { pending.push({ resolve, reject }) }), pending }
}
const settle = () => new Promise<void>(r => setImmediate(r))

describe('SaveQueue', () => {
  it('makes the producer wait while more than maxUnsaved points are unsaved, and lets it go on once saved', async () => {
    const server = manualServer()
    const q = new SaveQueue(server.save, String, undefined, 25)
    let released = 0
    await q.push(batch(10)) // 10 unsaved: room
    await q.push(batch(10)) // 20: room
    const third = q.push(batch(10)).then(() => { released++ }) // 30 > 25: wait
    await settle()
    expect(released).toBe(0)
    expect(q.unsaved).toBe(30)
    server.pending[0]!.resolve() // 20 unsaved
    await settle()
    expect(released).toBe(1)
    expect(q.saved).toBe(10)
    await third
  })

  it('saves in order and flush waits for the last save', async () => {
    const order: number[] = []
    const q = new SaveQueue(async (b) => { order.push(b.points.length) }, String)
    for (const n of [3, 1, 2]) await q.push(batch(n))
    await q.flush()
    expect(order).toEqual([3, 1, 2])
    expect(q.saved).toBe(6)
  })

  it('a failed save stops saving and releases the producer (nothing waits for ever)', async () => {
    const server = manualServer()
    const states: string[] = []
    const q = new SaveQueue(server.save, e => (e as Error).message, s => states.push(s.error), 5)
    const waiting = q.push(batch(10))
    await settle()
    server.pending[0]!.reject(new Error('rejected: residual'))
    await waiting
    await q.push(batch(10))
    await q.flush()
    expect(q.error).toBe('rejected: residual')
    expect(q.saved).toBe(0)
    expect(server.pending).toHaveLength(1) // the later batch was not sent
    expect(states.at(-1)).toBe('rejected: residual')
  })
})
