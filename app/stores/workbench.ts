/**
 * The pattern workbench's editing state: the document being drawn, the selection, the tool, the
 * snapping, and undo/redo as document snapshots. The analysis lives in useWorkbenchAnalysis.
 */
import { defineStore } from 'pinia'
import type { PatternDocument, PatternLattice } from '#shared/types/pattern'
import { PATTERN_FORMAT, PATTERN_VERSION } from '#shared/types/pattern'
import { freshId } from '~/utils/workbench/hit'
import { latticeCoords, latticePoint, type SnapOptions } from '~/utils/workbench/lattice'
import type { Vec } from '~/utils/workbench/view'

/** Canvas tools: select and move, add vertex, add edge (drag vertex → vertex copy), add open wing. */
export const WORKBENCH_TOOLS = ['select', 'vertex', 'edge', 'wing'] as const
export type WorkbenchTool = typeof WORKBENCH_TOOLS[number]

/** Snapshots kept for undo (oldest dropped first). */
const HISTORY_LIMIT = 200

/** A new, empty torus pattern on the unit square lattice. */
/** What the app asks before an unsaved drawing would be lost. */
export const UNSAVED_DRAWING_MESSAGE = 'The drawing has changes that are not saved as a version; they will be lost. Continue anyway?'

export function blankPattern(name = 'Untitled pattern', space: 'torus' | 'plane' = 'torus'): PatternDocument {
  return {
    format: PATTERN_FORMAT, version: PATTERN_VERSION, name, space,
    ...(space === 'torus' ? { lattice: { w1: [1, 0], w2: [0, 1] } as PatternLattice } : {}),
    vertices: [], edges: [], ...(space === 'plane' ? { wings: [] } : {}),
  }
}

const clone = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T

export const useWorkbenchStore = defineStore('workbench', () => {
  const doc = ref<PatternDocument>(blankPattern())
  const readOnly = ref(false)
  const tool = ref<WorkbenchTool>('select')
  const snap = ref<SnapOptions>({ divisions: 0 })
  const selection = ref<string[]>([])
  /** True while the pointer drags vertices or lattice handles (the analysis waits for a pause). */
  const gesture = ref(false)
  const past = ref<string[]>([])
  const future = ref<string[]>([])
  /** Bumped on every change of the document (the analysis watches it, not the deep document). */
  const revision = ref(0)
  /** Revision of the last save or load. */
  const savedRevision = ref(0)
  const dirty = computed(() => revision.value !== savedRevision.value)

  function touch() { revision.value++ }

  /** Replace the document (opening a version or a file); clears history and selection. */
  function load(next: PatternDocument, opts: { readOnly?: boolean, dirty?: boolean } = {}) {
    doc.value = clone(next)
    readOnly.value = opts.readOnly ?? false
    past.value = []; future.value = []; selection.value = []
    touch()
    if (!opts.dirty) savedRevision.value = revision.value
  }

  function markSaved() { savedRevision.value = revision.value }

  /** Record the current document for undo; call before a change (a drag calls it once at its start). */
  function checkpoint() {
    past.value.push(JSON.stringify(toRaw(doc.value)))
    if (past.value.length > HISTORY_LIMIT) past.value.shift()
    future.value = []
  }

  function undo() {
    const prev = past.value.pop()
    if (prev === undefined) return
    future.value.push(JSON.stringify(doc.value))
    doc.value = JSON.parse(prev); touch()
  }

  function redo() {
    const next = future.value.pop()
    if (next === undefined) return
    past.value.push(JSON.stringify(doc.value))
    doc.value = JSON.parse(next); touch()
  }

  function guard() { if (readOnly.value) throw new Error('This pattern is open read-only.') }

  /** Add a vertex at p; returns its id. */
  function addVertex(p: Vec): string {
    guard(); checkpoint()
    const id = freshId('v', doc.value.vertices.map(v => v.id))
    doc.value.vertices.push({ id, position: [p[0], p[1]] })
    dropRotation(); touch()
    return id
  }

  /** Add a closed edge from vertex index `from` to the copy of `to` at lattice shift `shift`. */
  function addEdge(from: number, to: number, shift: [number, number]): string | null {
    guard()
    if (from === to && shift[0] === 0 && shift[1] === 0) return null
    checkpoint()
    const d = doc.value
    const id = freshId('e', [...d.edges.map(e => e.id), ...(d.wings ?? []).map(w => w.id)])
    d.edges.push({ id, from: d.vertices[from]!.id, to: d.vertices[to]!.id, ...(d.space === 'torus' ? { shift } : {}) })
    dropRotation(); touch()
    return id
  }

  /** Add an open wing (plane only) at vertex index `vertex` pointing along `direction`. */
  function addWing(vertex: number, direction: Vec): string | null {
    guard()
    if (doc.value.space !== 'plane' || Math.hypot(direction[0], direction[1]) === 0) return null
    checkpoint()
    const d = doc.value
    const id = freshId('w', [...d.edges.map(e => e.id), ...(d.wings ?? []).map(w => w.id)])
    d.wings = [...(d.wings ?? []), { id, vertex: d.vertices[vertex]!.id, direction: [direction[0], direction[1]] }]
    dropRotation(); touch()
    return id
  }

  /** Delete the selected vertices with their edges and wings, and any selected edges/wings. */
  function deleteSelection() {
    guard()
    if (!selection.value.length) return
    checkpoint()
    const gone = new Set(selection.value)
    const d = doc.value
    d.vertices = d.vertices.filter(v => !gone.has(v.id))
    d.edges = d.edges.filter(e => !gone.has(e.id) && !gone.has(e.from) && !gone.has(e.to))
    if (d.wings) d.wings = d.wings.filter(w => !gone.has(w.id) && !gone.has(w.vertex))
    if (d.phases?.vertexPhases) d.phases.vertexPhases = Object.fromEntries(Object.entries(d.phases.vertexPhases).filter(([id]) => !gone.has(id)))
    selection.value = []
    dropRotation(); touch()
  }

  /** Move vertex `index` to p without a checkpoint (drags checkpoint once at their start). */
  function moveVertex(index: number, p: Vec) {
    guard()
    const v = doc.value.vertices[index]!
    v.position = [p[0], p[1]]
    touch()
  }

  /** Set every position at once (balance animation frames); no checkpoint. */
  function setPositions(positions: Vec[]) {
    guard()
    doc.value.vertices.forEach((v, i) => { v.position = [positions[i]![0], positions[i]![1]] })
    touch()
  }

  /** A new lattice; vertices keep their lattice coordinates so the drawing follows the cell. */
  function setLattice(l: PatternLattice, opts: { checkpoint?: boolean } = {}) {
    guard()
    const old = doc.value.lattice
    if (!old) return
    if (opts.checkpoint !== false) checkpoint()
    for (const v of doc.value.vertices) v.position = latticePoint(l, latticeCoords(old, v.position))
    doc.value.lattice = { w1: [l.w1[0], l.w1[1]], w2: [l.w2[0], l.w2[1]] }
    touch()
  }

  function setEdgeWeight(edgeId: string, weight: number) {
    guard()
    if (!(weight > 0)) throw new Error('A weight must be positive.')
    checkpoint()
    const e = doc.value.edges.find(x => x.id === edgeId)
    if (e) e.weight = weight
    touch()
  }

  /** Set α (radians), or vertex phases too, as one undoable change. */
  function setPhases(alpha: [number, number], vertexPhases?: Record<string, number>) {
    guard(); checkpoint()
    doc.value.phases = { alpha, vertexPhases: vertexPhases ?? doc.value.phases?.vertexPhases ?? {} }
    touch()
  }

  function rename(name: string) { guard(); checkpoint(); doc.value.name = name; touch() }

  /** An explicit rotation no longer matches after the combinatorics change: read it from the drawing. */
  function dropRotation() { if (doc.value.rotation) delete doc.value.rotation }

  return {
    doc, readOnly, tool, snap, selection, gesture, revision, dirty, past, future,
    load, markSaved, checkpoint, undo, redo, addVertex, addEdge, addWing, deleteSelection,
    moveVertex, setPositions, setLattice, setEdgeWeight, setPhases, rename,
  }
})
