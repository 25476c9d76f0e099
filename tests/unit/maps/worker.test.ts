/**
 * The map worker's API through comlink over a Node MessageChannel: spine and rows posted across
 * the channel assemble (and fill) into the same map as the one-thread sweep; a traced collapse curve of the
 * Fermat pair crosses the channel and lies on arg τ = 120° (Fermat–Torricelli, Kimberling X(13)).
 */
import { MessageChannel } from 'node:worker_threads'
import { expose, wrap, type Remote } from 'comlink'
import nodeEndpoint from 'comlink/dist/esm/node-adapter'
import { afterEach, describe, expect, it } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { assembleMap, runMapSweep } from '../../../shared/maps'
import { createMapWorkerApi, type MapWorkerApi } from '../../../workers/map.worker'

const channels: MessageChannel[] = []
function connect(): Remote<MapWorkerApi> {
  const channel = new MessageChannel()
  channels.push(channel)
  expose(createMapWorkerApi(), nodeEndpoint(channel.port1))
  return wrap<MapWorkerApi>(nodeEndpoint(channel.port2))
}
afterEach(() => { for (const c of channels.splice(0)) { c.port1.close(); c.port2.close() } })

const doc = findPatternExample('fermat-pair')!.document
const settings = { plane: 'tau', x: { min: -0.8, max: 0.4, count: 7 }, y: { min: 0.6, max: 1.2, count: 4 } }

describe('map worker over comlink', () => {
  it('rows shared between two endpoints give the one-thread map', async () => {
    const [a, b] = [connect(), connect()]
    const spine = await a.spine(doc, settings)
    const rows = await Promise.all(spine.starts.map((s, k) => (k % 2 ? b : a).row(doc, spine.settings, s, spine.spineColumn)))
    expect(await b.fill(doc, spine.settings, assembleMap(spine, rows))).toEqual(runMapSweep(doc, settings))
  })

  it('traces the collapse curve of the corner at 0 through the channel', async () => {
    const api = connect()
    const map = runMapSweep(doc, settings)
    const crossing = map.rows.flatMap(r => r.crossings).find(c => c.kind === 'collapse')!
    const curve = await api.trace(doc, settings, crossing)
    expect(curve.kind).toBe('collapse of edge to-origin')
    for (const [x, y] of curve.points) expect(Math.abs(Math.atan2(y, x) - 2 * Math.PI / 3)).toBeLessThan(1e-8)
  })
})
