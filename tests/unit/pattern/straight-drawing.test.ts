/** The straight-drawing hypothesis (T5 / P4): crossings, coincident points, 2-face edges on one segment (elementary geometry, derived). */
import { describe, expect, it } from 'vitest'
import { compilePattern } from '../../../shared/pattern/model'
import { checkStraightDrawing } from '../../../shared/pattern/straight-drawing'
import { parsePatternDocument } from '../../../shared/types/pattern'
import { meeks, threeLines } from './published-patterns'

const plane = (positions: [number, number][], edges: [number, number][]) => compilePattern(parsePatternDocument({
  format: 'wingfold-pattern', version: 1, name: 't', space: 'plane',
  vertices: positions.map((position, i) => ({ id: `v${i}`, position })),
  edges: edges.map(([a, b], i) => ({ id: `e${i}`, from: `v${a}`, to: `v${b}` })),
}))

describe('checkStraightDrawing', () => {
  it('finds the crossing of the two diagonals of a square, and none for its sides', () => {
    const sq: [number, number][] = [[0, 0], [1, 0], [1, 1], [0, 1]]
    expect(checkStraightDrawing(plane(sq, [[0, 2], [1, 3]])).crossings).toEqual([[0, 1]])
    expect(checkStraightDrawing(plane(sq, [[0, 1], [1, 2], [2, 3], [3, 0]])).ok).toBe(true)
  })

  it('a vertex on the interior of an edge is a crossing; coincident points are named', () => {
    expect(checkStraightDrawing(plane([[0, 0], [2, 0], [1, 0], [1, 1]], [[0, 1], [2, 3]])).crossings).toEqual([[0, 1]])
    expect(checkStraightDrawing(plane([[0, 0], [0, 0], [1, 1]], [[0, 2], [1, 2]])).coincidentVertices).toEqual([[0, 1]])
  })

  it('torus: Meeks and the three lines are straight drawings; moving a tower onto a lattice translate of another is not', () => {
    expect(checkStraightDrawing(compilePattern(meeks([1, 0], [0.3, 1.3], 0.5, 1))).ok).toBe(true)
    expect(checkStraightDrawing(compilePattern(threeLines())).ok).toBe(true)
    const d = meeks([1, 0], [0.3, 1.3], 0.5, 1)
    d.vertices[1]!.position = [d.vertices[0]!.position[0] + 1, d.vertices[0]!.position[1]]
    expect(checkStraightDrawing(compilePattern(d)).coincidentVertices).toEqual([[0, 1]])
  })
})
