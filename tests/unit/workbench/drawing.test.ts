/** The moving part of a drag and the one-path drawings of the faded copies. */
import { describe, expect, it } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { dotsPath, movingPart, reuseItems, segmentsPath } from '../../../app/utils/workbench/drawing'

describe('moving part of a drag', () => {
  it('takes the dragged towers with exactly the edges that touch them', () => {
    // square pair: two towers joined by four edges (shared/examples); every edge touches both towers
    const doc = findPatternExample('square-pair')!.document
    const one = movingPart(doc, [0])
    expect(one.vertices).toEqual([0])
    expect(one.edges).toEqual(doc.edges.map((_, i) => i))
    // worked example by hand: a path a–b–c, dragging c moves only the edge b–c
    const path = { ...doc, vertices: [{ id: 'a', position: [0, 0] }, { id: 'b', position: [1, 0] }, { id: 'c', position: [2, 0] }],
      edges: [{ id: 'ab', from: 'a', to: 'b' }, { id: 'bc', from: 'b', to: 'c' }], space: 'plane', wings: [{ id: 'w', vertex: 'c', direction: [1, 1] }] } as unknown as typeof doc
    const m = movingPart(path, [2, 2, 7])
    expect(m.vertices).toEqual([2])
    expect([...m.vertexIds]).toEqual(['c'])
    expect(m.edges).toEqual([1])
    expect(m.wings).toEqual([0])
    expect(movingPart(path, [0]).wings).toEqual([])
  })
})

describe('one-path drawings', () => {
  it('writes a move-to and line-to per segment, rounded to hundredths of a pixel', () => {
    // SVG 1.1 path grammar (W3C, "Paths", 2011): M x y starts a subpath, L x y draws a line to it
    expect(segmentsPath([{ x1: 0, y1: 1, x2: 2.345, y2: 3 }, { x1: 4, y1: 5, x2: 6, y2: 7.001 }])).toBe('M0 1L2.35 3M4 5L6 7')
    expect(segmentsPath([])).toBe('')
  })

  it('draws each dot as two half-circle arcs starting at its left edge', () => {
    // SVG 1.1 elliptical arc: a rx ry rotation large-arc sweep dx dy (W3C, "Paths", 2011)
    expect(dotsPath([{ x: 10, y: 20 }], 5)).toBe('M5 20a5 5 0 1 0 10 0a5 5 0 1 0 -10 0z')
  })
})

describe('reusing drawn items', () => {
  it('keeps the earlier object for every unchanged item and takes the new one where a field changed', () => {
    const prev = [{ id: 'a', x: 1, y: 2 }, { id: 'b', x: 3, y: 4 }, { id: 'c', x: 5, y: 6 }]
    const next = [{ id: 'a', x: 1, y: 2 }, { id: 'b', x: 3.5, y: 4 }, { id: 'd', x: 5, y: 6 }]
    const out = reuseItems(prev, next)
    expect(out[0]).toBe(prev[0])
    expect(out[1]).toBe(next[1])
    expect(out[2]).toBe(next[2]) // a new id is never matched to another item's drawing
    expect(out.map(x => x.id)).toEqual(['a', 'b', 'd'])
    expect(reuseItems([{ id: 'a', x: 1 }], [{ id: 'a', x: 1, extra: true } as { id: string, x: number }])[0]).not.toBe(prev[0])
  })
})
