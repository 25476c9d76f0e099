/**
 * The pattern document parser: readable errors with JSON paths, cross-reference checks, and
 * seeded property tests (fast-check) that random or corrupted input only ever throws
 * PatternParseError.
 */
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { parsePatternDocument, PatternParseError, safeParsePatternDocument, type PatternDocument } from '../../../shared/types/pattern'
import { PATTERN_EXAMPLES } from '../../../shared/examples'

/** A document opened up for deliberate corruption (any field may be replaced by anything). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- malformed documents on purpose
type Loose = Record<string, any>

const base = (): PatternDocument => structuredClone(PATTERN_EXAMPLES.find(e => e.slug === 'square-pair')!.document)

function messages(input: unknown): string[] {
  try {
    parsePatternDocument(input)
  } catch (e) {
    expect(e).toBeInstanceOf(PatternParseError)
    return (e as PatternParseError).issues.map(i => `${i.path}: ${i.message}`)
  }
  return []
}

describe('parsePatternDocument', () => {
  it('accepts every example', () => {
    for (const ex of PATTERN_EXAMPLES) expect(safeParsePatternDocument(ex.document).success).toBe(true)
  })

  it('names the path and the problem for an unknown vertex', () => {
    const d = base()
    d.edges[3]!.to = 'q'
    expect(messages(d)).toEqual(["edges[3].to: no vertex 'q'"])
  })

  it('says in words that a pattern needs a tower (the workbench shows this for an empty drawing)', () => {
    const d = base()
    d.vertices = []
    d.edges = []
    expect(messages(d)).toEqual(['vertices: add at least one tower'])
  })

  it('reports duplicates, loops without shift, wings in the torus, bad lattices and rotations', () => {
    const d = base() as Loose
    d.vertices.push({ id: 'a', position: [0.1, 0.1] })
    d.edges.push({ id: 'loop', from: 'a', to: 'a' })
    d.wings = [{ id: 'w', vertex: 'a', direction: [1, 0] }]
    d.lattice = { w1: [0, 1], w2: [1, 0] }
    d.rotation = { a: ['ne:from', 'zz'] }
    const m = messages(d)
    expect(m).toContain("vertices[2].id: duplicate id 'a'")
    expect(m).toContain('edges[4]: a loop needs a non-zero lattice shift')
    expect(m).toContain('wings: open wings belong to plane patterns, not the torus')
    expect(m).toContain('lattice: det(w1, w2) must be positive')
    expect(m).toContain("rotation.a[1]: no half-edge 'zz'")
    expect(m).toContain("rotation: vertex 'b' has no order (list every vertex or none)")
  })

  it('reports shape errors with their path', () => {
    const d = base() as Loose
    d.edges[1].shift = [0.5, 0]
    d.vertices[0].position = [0]
    d.space = 'sphere'
    const m = messages(d)
    expect(m.some(x => x.startsWith('edges[1].shift[0]:'))).toBe(true)
    expect(m.some(x => x.startsWith('vertices[0].position'))).toBe(true)
    expect(m.some(x => x.startsWith('space:'))).toBe(true)
  })

  it('rejects shifts and lattices in the plane', () => {
    const d = structuredClone(PATTERN_EXAMPLES.find(e => e.slug === 'plane-bridge')!.document) as Loose
    d.edges[0].shift = [1, 0]
    d.lattice = { w1: [1, 0], w2: [0, 1] }
    expect(messages(d)).toEqual(['lattice: a plane pattern has no lattice', 'edges[0].shift: a plane pattern has no lattice shifts'])
  })
})

/** Replaces the value at a random path of a JSON value by `replacement`. */
function corrupt(value: unknown, choices: number[], replacement: unknown): unknown {
  if (choices.length === 0 || value === null || typeof value !== 'object') return replacement
  const keys = Object.keys(value as object)
  if (keys.length === 0) return replacement
  const key = keys[choices[0]! % keys.length]!
  const copy: Loose = Array.isArray(value) ? [...value] : { ...(value as object) }
  copy[key] = corrupt(copy[key], choices.slice(1), replacement)
  return copy
}

describe('parser property tests (fast-check, seeded)', () => {
  const onlyTypedErrors = (input: unknown) => {
    try {
      parsePatternDocument(input)
    } catch (e) {
      if (!(e instanceof PatternParseError)) throw e
      expect(e.issues.length).toBeGreaterThan(0)
      expect(e.message).toBe(e.issues.map(i => (i.path ? `${i.path}: ${i.message}` : i.message)).join('\n'))
    }
  }

  it('random JSON values never throw anything but PatternParseError', () => {
    fc.assert(fc.property(fc.jsonValue(), onlyTypedErrors), { seed: 20261202, numRuns: 400 })
  })

  it('corrupted example documents never throw anything but PatternParseError', () => {
    const docs = PATTERN_EXAMPLES.map(e => e.document)
    fc.assert(fc.property(
      fc.constantFrom(...docs),
      fc.array(fc.nat(), { minLength: 1, maxLength: 5 }),
      fc.oneof(fc.jsonValue(), fc.constant(undefined), fc.constant(Number.NaN), fc.constant(Infinity), fc.string()),
      (doc, path, replacement) => onlyTypedErrors(corrupt(doc, path, replacement)),
    ), { seed: 7, numRuns: 1500 })
  })

  it('documents with random ids and references never throw anything but PatternParseError', () => {
    const id = fc.stringMatching(/^[a-c]{1,2}$/)
    fc.assert(fc.property(
      fc.array(id, { maxLength: 4 }),
      fc.array(fc.tuple(id, id, id, fc.integer({ min: -1, max: 1 })), { maxLength: 6 }),
      fc.boolean(),
      (vids, edges, plane) => onlyTypedErrors({
        format: 'wingfold-pattern', version: 1, name: 'fuzz', space: plane ? 'plane' : 'torus',
        ...(plane ? {} : { lattice: { w1: [1, 0], w2: [0, 1] } }),
        vertices: vids.map((v, i) => ({ id: v, position: [i, 0] })),
        edges: edges.map(([e, f, t, k]) => ({ id: e, from: f, to: t, shift: [k, 0] })),
      }),
    ), { seed: 99, numRuns: 800 })
  })
})
