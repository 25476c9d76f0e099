/**
 * The Wingfold pattern document (file extension `.wfp.json`): one gluing pattern — a graph drawn
 * in a flat torus or in the plane, with its rotation system, lattice shifts, open wings, phase
 * data and display hints. See docs/pattern-format.md for the field-by-field description and
 * docs/pattern.schema.json for the generated JSON Schema.
 *
 * The zod schema checks the shape of each field; `parsePatternDocument` adds the cross-reference
 * checks (unknown vertex ids, duplicate ids, loops without shift, wings in the torus, …) and
 * reports every problem with its JSON path.
 */
import { z } from 'zod'

/** Format tag written into every document. */
export const PATTERN_FORMAT = 'wingfold-pattern' as const
/** Current format version. */
export const PATTERN_VERSION = 1 as const
/** File extension of pattern documents. */
export const PATTERN_EXTENSION = '.wfp.json' as const

/** The two spaces a pattern can live in. */
export const PATTERN_SPACES = ['torus', 'plane'] as const
export type PatternSpace = (typeof PATTERN_SPACES)[number]

const idPattern = /^[A-Za-z0-9_.-]{1,64}$/
const Id = z.string().regex(idPattern, 'ids use 1–64 letters, digits, "_", "." or "-"')
const Vec2 = z.tuple([z.number(), z.number()])
const IntVec2 = z.tuple([z.number().int(), z.number().int()])

/** A vertex: one saddle tower, at a position in the plane (torus: any representative). */
export const PatternVertexSchema = z.strictObject({
  id: Id,
  position: Vec2.describe('Position [x, y]; in the torus any representative of the vertex'),
  label: z.string().max(200).optional(),
})

/** A closed edge: a glued pair of wings from `from` to `to`, reaching `to + k1 ω1 + k2 ω2`. */
export const PatternEdgeSchema = z.strictObject({
  id: Id,
  from: Id,
  to: Id,
  /** Integer lattice shift k (torus only; absent means [0, 0]). */
  shift: IntVec2.optional().describe('Integer lattice shift [k1, k2]: the edge ends at to + k1 w1 + k2 w2 (torus only; default [0, 0])'),
  /** Phase weight K_e > 0 (vertical balance); default 1. */
  weight: z.number().positive().optional().describe('Phase weight K > 0 of the edge (default 1)'),
})

/** An open wing (plane only): a free end at a vertex pointing in a fixed direction. */
export const PatternWingSchema = z.strictObject({
  id: Id,
  vertex: Id,
  direction: Vec2.describe('Direction [x, y] of the open wing (any non-zero length)'),
})

/** Torus lattice Λ = Z ω1 + Z ω2 with det(ω1, ω2) > 0. */
export const PatternLatticeSchema = z.strictObject({
  w1: Vec2,
  w2: Vec2,
})

/** Phase data: period phases α = (α1, α2) and optional vertex phases ψ (radians). */
export const PatternPhasesSchema = z.strictObject({
  alpha: Vec2.describe('Period phases [α1, α2] in radians: the phase gained along w1 and w2'),
  /** Vertex phases by vertex id; missing vertices start at 0. */
  vertexPhases: z.record(z.string(), z.number()).optional(),
})

/** Display hints: they never change a verdict. */
export const PatternDisplaySchema = z.strictObject({
  /** Copies of the fundamental domain to draw along ω1 and ω2. */
  tiles: IntVec2.optional().describe('Copies of the fundamental domain to draw along w1 and w2'),
  /** A CSS colour for the edges. */
  edgeColor: z.string().max(40).optional(),
  showLabels: z.boolean().optional(),
  showLattice: z.boolean().optional(),
})

/**
 * The document. `rotation` optionally gives, per vertex id, the counter-clockwise order of the
 * half-edges at that vertex: `"<edgeId>:from"`, `"<edgeId>:to"` or a wing id. Without it the
 * order is read from the drawing (needed only when directions at a vertex coincide).
 */
export const PatternDocumentSchema = z.strictObject({
  format: z.literal(PATTERN_FORMAT).describe('Always "wingfold-pattern"'),
  version: z.literal(PATTERN_VERSION).describe('Format version (1)'),
  name: z.string().min(1).max(200),
  notes: z.string().max(20000).optional(),
  space: z.enum(PATTERN_SPACES).describe('torus: triply periodic construction with a lattice; plane: singly periodic, with open wings'),
  lattice: PatternLatticeSchema.optional().describe('Torus lattice {w1, w2} with det(w1, w2) > 0 (torus only)'),
  vertices: z.array(PatternVertexSchema).min(1, 'add at least one tower'),
  edges: z.array(PatternEdgeSchema),
  wings: z.array(PatternWingSchema).optional(),
  rotation: z.record(z.string(), z.array(z.string())).optional()
    .describe('Optional counter-clockwise order of half-edges per vertex id: "<edge>:from", "<edge>:to" or a wing id'),
  phases: PatternPhasesSchema.optional(),
  display: PatternDisplaySchema.optional(),
})

export type PatternDocument = z.infer<typeof PatternDocumentSchema>
export type PatternVertex = z.infer<typeof PatternVertexSchema>
export type PatternEdge = z.infer<typeof PatternEdgeSchema>
export type PatternWing = z.infer<typeof PatternWingSchema>
export type PatternLattice = z.infer<typeof PatternLatticeSchema>
export type PatternPhases = z.infer<typeof PatternPhasesSchema>

/** One problem found while parsing: a JSON path such as `edges[3].to` and what is wrong. */
export interface PatternIssue {
  path: string
  message: string
}

/** Thrown by `parsePatternDocument`; `message` lists the issues as `path: message` lines. */
export class PatternParseError extends Error {
  readonly issues: PatternIssue[]
  constructor(issues: PatternIssue[]) {
    super(issues.map(i => (i.path ? `${i.path}: ${i.message}` : i.message)).join('\n'))
    this.name = 'PatternParseError'
    this.issues = issues
  }
}

/** Formats a path like ['edges', 3, 'to'] as `edges[3].to`. */
export function formatIssuePath(path: ReadonlyArray<PropertyKey>): string {
  let out = ''
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`
    else out += out ? `.${String(key)}` : String(key)
  }
  return out
}

/** The half-edge reference names used in `rotation` for an edge. */
export function halfEdgeRefs(edgeId: string): [from: string, to: string] {
  return [`${edgeId}:from`, `${edgeId}:to`]
}

function duplicateIds(items: { id: string }[], key: string, issues: PatternIssue[]): Set<string> {
  const seen = new Set<string>()
  items.forEach((item, i) => {
    if (seen.has(item.id)) issues.push({ path: `${key}[${i}].id`, message: `duplicate id '${item.id}'` })
    seen.add(item.id)
  })
  return seen
}

/** Cross-reference checks on a document whose shape is already valid. */
function crossCheck(doc: PatternDocument): PatternIssue[] {
  const issues: PatternIssue[] = []
  const vertexIds = duplicateIds(doc.vertices, 'vertices', issues)
  const edgeIds = duplicateIds(doc.edges, 'edges', issues)
  const wings = doc.wings ?? []
  const wingIds = duplicateIds(wings, 'wings', issues)
  for (const id of wingIds) {
    if (edgeIds.has(id)) issues.push({ path: 'wings', message: `wing id '${id}' is also an edge id` })
  }
  const torus = doc.space === 'torus'
  if (torus) {
    if (!doc.lattice) issues.push({ path: 'lattice', message: 'a torus pattern needs a lattice' })
    else {
      const [a, b] = doc.lattice.w1
      const [c, d] = doc.lattice.w2
      if (!(a * d - b * c > 0)) issues.push({ path: 'lattice', message: 'det(w1, w2) must be positive' })
    }
    if (wings.length > 0) issues.push({ path: 'wings', message: 'open wings belong to plane patterns, not the torus' })
  } else if (doc.lattice) {
    issues.push({ path: 'lattice', message: 'a plane pattern has no lattice' })
  }
  doc.edges.forEach((e, i) => {
    if (!vertexIds.has(e.from)) issues.push({ path: `edges[${i}].from`, message: `no vertex '${e.from}'` })
    if (!vertexIds.has(e.to)) issues.push({ path: `edges[${i}].to`, message: `no vertex '${e.to}'` })
    const [k1, k2] = e.shift ?? [0, 0]
    if (!torus && (k1 !== 0 || k2 !== 0)) {
      issues.push({ path: `edges[${i}].shift`, message: 'a plane pattern has no lattice shifts' })
    }
    if (e.from === e.to && k1 === 0 && k2 === 0) {
      issues.push({ path: `edges[${i}]`, message: 'a loop needs a non-zero lattice shift' })
    }
  })
  wings.forEach((w, i) => {
    if (!vertexIds.has(w.vertex)) issues.push({ path: `wings[${i}].vertex`, message: `no vertex '${w.vertex}'` })
    if (w.direction[0] === 0 && w.direction[1] === 0) {
      issues.push({ path: `wings[${i}].direction`, message: 'direction must be non-zero' })
    }
  })
  if (doc.rotation) checkRotation(doc, vertexIds, issues)
  if (doc.phases?.vertexPhases) {
    for (const id of Object.keys(doc.phases.vertexPhases)) {
      if (!vertexIds.has(id)) issues.push({ path: `phases.vertexPhases.${id}`, message: `no vertex '${id}'` })
    }
  }
  return issues
}

/** The rotation must list, for every vertex, exactly the half-edges at that vertex, once each. */
function checkRotation(doc: PatternDocument, vertexIds: Set<string>, issues: PatternIssue[]): void {
  const rotation = doc.rotation ?? {}
  const atVertex = new Map<string, string>() // half-edge ref -> vertex id
  for (const e of doc.edges) {
    const [f, t] = halfEdgeRefs(e.id)
    atVertex.set(f, e.from)
    atVertex.set(t, e.to)
  }
  for (const w of doc.wings ?? []) atVertex.set(w.id, w.vertex)
  const listed = new Set<string>()
  for (const [vid, refs] of Object.entries(rotation)) {
    const base = `rotation.${vid}`
    if (!vertexIds.has(vid)) { issues.push({ path: base, message: `no vertex '${vid}'` }); continue }
    refs.forEach((ref, j) => {
      const owner = atVertex.get(ref)
      if (owner === undefined) issues.push({ path: `${base}[${j}]`, message: `no half-edge '${ref}'` })
      else if (owner !== vid) issues.push({ path: `${base}[${j}]`, message: `half-edge '${ref}' is at vertex '${owner}', not '${vid}'` })
      else if (listed.has(ref)) issues.push({ path: `${base}[${j}]`, message: `half-edge '${ref}' listed twice` })
      listed.add(ref)
    })
  }
  for (const [ref, vid] of atVertex) {
    if (vid in rotation && !listed.has(ref)) {
      issues.push({ path: `rotation.${vid}`, message: `half-edge '${ref}' is missing` })
    }
  }
  for (const v of doc.vertices) {
    if (!(v.id in rotation)) issues.push({ path: 'rotation', message: `vertex '${v.id}' has no order (list every vertex or none)` })
  }
}

/** Parses without throwing: either the document or the list of issues. */
export function safeParsePatternDocument(
  input: unknown,
): { success: true, data: PatternDocument } | { success: false, issues: PatternIssue[] } {
  const shape = PatternDocumentSchema.safeParse(input)
  if (!shape.success) {
    return {
      success: false,
      issues: shape.error.issues.map(i => ({ path: formatIssuePath(i.path), message: i.message })),
    }
  }
  const issues = crossCheck(shape.data)
  return issues.length ? { success: false, issues } : { success: true, data: shape.data }
}

/**
 * Validates an unknown value (for instance `JSON.parse` output) as a pattern document.
 * @throws PatternParseError listing every problem with its JSON path.
 */
export function parsePatternDocument(input: unknown): PatternDocument {
  const result = safeParsePatternDocument(input)
  if (!result.success) throw new PatternParseError(result.issues)
  return result.data
}
