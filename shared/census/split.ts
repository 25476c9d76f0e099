/**
 * Splitting the census search for threads. The canonical augmentation (augment.ts) is a tree with
 * one node per class, so the subtrees below the nodes of one depth are independent searches whose
 * maps are pairwise non-isomorphic (B. D. McKay, "Isomorph-free exhaustive generation",
 * J. Algorithms 26, 1998: the search needs no global table). `splitCensus` searches the tree down
 * to `depth` edges on the calling thread and returns the nodes at that depth as tasks;
 * `subtreeCensus` searches below one task. Together they yield exactly `enumerateCensus`.
 */
import { generateMaps, growFrom, type GeneratedMap } from './augment'
import { censusSearchBounds, checkCensusBounds, describeCensusMap, isCensusMap, type CensusBounds, type CensusPattern } from './enumerate'

/** A node of the search tree handed to a thread (structured-clone friendly). */
export type CensusTask = GeneratedMap

/** The shallow part of the search: the census patterns in it, the nodes met, and the tasks. */
export interface CensusSplit {
  depth: number
  patterns: CensusPattern[]
  visited: number
  tasks: CensusTask[]
}

/**
 * Searches down to `depth` edges; the nodes with exactly `depth` edges (and room for more) become
 * tasks, their subtrees are not searched here. Depth 0 or 1 splits at the seeds' children.
 */
export function splitCensus(bounds: CensusBounds, depth: number): CensusSplit {
  const b = checkCensusBounds(bounds)
  const sb = censusSearchBounds(b)
  const patterns: CensusPattern[] = []
  const tasks: CensusTask[] = []
  let visited = 0
  for (const m of generateMaps(sb, n => n.edges >= depth)) {
    if (m.edges === depth && m.edges < sb.maxEdges) { tasks.push(m); continue }
    visited++
    if (isCensusMap(m)) patterns.push(describeCensusMap(m))
  }
  return { depth, patterns, visited, tasks }
}

/**
 * The least depth whose tasks number at least `want` (more tasks than threads balance the load:
 * subtrees differ in size by orders of magnitude), at most maxEdges − 1.
 */
export function splitDepth(bounds: CensusBounds, want: number): number {
  const maxEdges = censusSearchBounds(checkCensusBounds(bounds)).maxEdges
  let depth = 1
  while (depth < maxEdges - 1 && splitCensus(bounds, depth).tasks.length < want) depth++
  return depth
}

/** Every census pattern in the subtree of one task (the task itself included). */
export function* subtreeCensus(bounds: CensusBounds, task: CensusTask, onVisit?: (m: GeneratedMap) => void): Generator<CensusPattern> {
  for (const m of growFrom(task, censusSearchBounds(checkCensusBounds(bounds)))) {
    onVisit?.(m)
    if (isCensusMap(m)) yield describeCensusMap(m)
  }
}
