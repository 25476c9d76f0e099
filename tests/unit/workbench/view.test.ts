/** View transforms, lattice helpers and hit testing of the workbench canvas. */
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { fitView, panBy, toScreen, toWorld, zoomAt, type View } from '../../../app/utils/workbench/view'
import { latticeCoords, latticePoint, latticeShape, presetLattice, snapPoint } from '../../../app/utils/workbench/lattice'
import { edgeEnd, freshId, hitVertex, verticesInBox } from '../../../app/utils/workbench/hit'
import { findPatternExample } from '../../../shared/examples'

const view: View = { cx: 0.5, cy: 0.5, scale: 200, width: 800, height: 600 }
const finite = fc.double({ min: -50, max: 50, noNaN: true })

describe('view transforms', () => {
  it('maps the view centre to the canvas centre with y pointing down', () => {
    expect(toScreen(view, [0.5, 0.5])).toEqual([400, 300])
    // one world unit up is `scale` pixels up the screen (common practice: SVG y grows downward)
    expect(toScreen(view, [0.5, 1.5])).toEqual([400, 100])
  })

  it('round-trips world → screen → world (seeded property test)', () => {
    fc.assert(fc.property(finite, finite, (x, y) => {
      const [u, v] = toWorld(view, toScreen(view, [x, y]))
      expect(u).toBeCloseTo(x, 9); expect(v).toBeCloseTo(y, 9)
    }), { seed: 6 })
  })

  it('keeps the world point under the cursor fixed when zooming, and pans by screen pixels', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 800, noNaN: true }), fc.double({ min: 0, max: 600, noNaN: true }), fc.double({ min: 0.1, max: 10, noNaN: true }), (sx, sy, f) => {
      const before = toWorld(view, [sx, sy])
      const after = toWorld(zoomAt(view, [sx, sy], f), [sx, sy])
      expect(after[0]).toBeCloseTo(before[0], 9); expect(after[1]).toBeCloseTo(before[1], 9)
    }), { seed: 7 })
    const moved = panBy(view, 20, -40)
    expect(toScreen(moved, [0.5, 0.5])).toEqual([420, 260])
  })

  it('fits the fundamental cell and every vertex inside the canvas', () => {
    const doc = findPatternExample('three-line-weave')!.document
    const v = fitView(doc, 640, 480)
    const pts = [[0, 0], doc.lattice!.w1, doc.lattice!.w2, ...doc.vertices.map(x => x.position)] as [number, number][]
    for (const p of pts) {
      const [x, y] = toScreen(v, p)
      expect(x).toBeGreaterThanOrEqual(0); expect(x).toBeLessThanOrEqual(640)
      expect(y).toBeGreaterThanOrEqual(0); expect(y).toBeLessThanOrEqual(480)
    }
  })
})

describe('lattice helpers', () => {
  const hex = { w1: [2, 0] as [number, number], w2: [1, Math.sqrt(3)] as [number, number] }

  it('gives τ = e^{iπ/3} for the hexagonal lattice and i for the square one (closed forms, from memory)', () => {
    const [re, im] = latticeShape(hex)
    expect(re).toBeCloseTo(0.5, 14); expect(im).toBeCloseTo(Math.sqrt(3) / 2, 14)
    expect(latticeShape(presetLattice(hex, 'square'))).toEqual([0, 1])
    const rect = presetLattice(hex, 'rectangular', 2.5)
    expect(rect.w2[0]).toBeCloseTo(0, 14); expect(rect.w2[1]).toBeCloseTo(5, 14)
    expect(() => presetLattice(hex, 'rectangular', 0)).toThrow(/positive/)
  })

  it('inverts lattice coordinates, and snaps to a grid of the periods', () => {
    fc.assert(fc.property(finite, finite, (a, b) => {
      const [s, t] = latticeCoords(hex, latticePoint(hex, [a, b]))
      expect(s).toBeCloseTo(a, 9); expect(t).toBeCloseTo(b, 9)
    }), { seed: 8 })
    const p = snapPoint(latticePoint(hex, [0.26, 0.49]), { divisions: 4 }, hex)
    const q = latticePoint(hex, [0.25, 0.5])
    expect(p[0]).toBeCloseTo(q[0], 12); expect(p[1]).toBeCloseTo(q[1], 12)
    expect(snapPoint([0.33, 0.71], { divisions: 0 })).toEqual([0.33, 0.71])
    expect(snapPoint([0.33, 0.71], { divisions: 10 })).toEqual([0.3, 0.7])
  })
})

describe('hit testing', () => {
  const doc = findPatternExample('square-pair')!.document

  it('finds a vertex copy and the lattice shift of the copy', () => {
    const b = doc.vertices[1]!
    const hit = hitVertex(doc, [b.position[0] - 1 + 0.01, b.position[1] - 1], 0.05)
    expect(hit).toMatchObject({ index: 1, shift: [-1, -1] })
    expect(hitVertex(doc, [b.position[0] + 0.3, b.position[1] + 0.17], 0.05)).toBeNull()
    expect(edgeEnd(doc, 1, [-1, 0])).toEqual([b.position[0] - 1, b.position[1]])
  })

  it('selects by box and makes fresh ids', () => {
    expect(verticesInBox(doc, [-0.1, -0.1], [0.1, 0.1])).toEqual([0])
    expect(freshId('v', ['v1', 'v2', 'v4'])).toBe('v3')
  })
})
