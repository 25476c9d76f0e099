/**
 * Combinatorial maps as rotation systems (σ, ι) on darts 0..n−1 with ι(d) = d xor 1 (dart 2i and
 * 2i+1 form edge i), and their canonical code.
 *
 * Canonical code (T. R. S. Walsh, "Space-efficient generation of nonisomorphic maps and
 * hypermaps", J. Integer Seq. 18, 2015, §2): from a root dart r, number the darts in the order a
 * breadth-first traversal meets them (each numbered dart, in number order, looks at σ(d) then
 * ι(d)); the code is the sequence (label σ(d), label ι(d)) over d in number order. The least code
 * over all n roots is the canonical code. Two connected maps are isomorphic (orientation kept)
 * iff their canonical codes are equal, and the roots that reach the least code are exactly one
 * orbit of the automorphism group, which acts freely on darts: their number is |Aut|.
 * The code is self-describing: σ'(i) = code[2i], ι'(i) = code[2i+1] is the map relabelled.
 */

/** A map with n = 2E darts; σ as an array, ι(d) = d ^ 1. */
export interface DartMap {
  sigma: Int32Array
}

/** Result of canonisation: least code, the roots that reach it (one Aut orbit). */
export interface Canonical {
  code: Int32Array
  roots: number[]
}

/**
 * Code from one root compared with `best` as it is written: returns −1 (smaller: `out` holds the
 * new code), 0 (equal), 1 (larger: abandoned early, `out` is partial).
 */
function codeFromRoot(
  sigma: Int32Array, root: number, best: Int32Array | null,
  out: Int32Array, label: Int32Array, order: Int32Array,
): -1 | 0 | 1 {
  const n = sigma.length
  label.fill(-1)
  label[root] = 0; order[0] = root
  let next = 1
  let state: -1 | 0 = best ? 0 : -1
  for (let i = 0; i < n; i++) {
    const d = order[i]!
    for (let k = 0; k < 2; k++) {
      const t = k === 0 ? sigma[d]! : d ^ 1
      if (label[t]! < 0) { label[t] = next; order[next++] = t }
      const v = label[t]!
      const pos = 2 * i + k
      if (state === 0) {
        const b = best![pos]!
        if (v > b) return 1
        if (v < b) state = -1
      }
      out[pos] = v
    }
  }
  return state
}

/**
 * Canonical code and automorphism orbit of the roots of a connected map. With `candidates` (a set
 * of darts that every automorphism maps onto itself, e.g. chosen by an invariant), only those are
 * tried as roots: the least code among them is still a canonical form, and the roots reaching it
 * are still one free Aut orbit, so their number is still |Aut|.
 */
export function canonicalize(sigma: Int32Array, candidates?: readonly number[]): Canonical {
  const n = sigma.length
  const label = new Int32Array(n), order = new Int32Array(n)
  let best = new Int32Array(2 * n), scratch = new Int32Array(2 * n)
  let roots: number[] = []
  const tries = candidates ?? Array.from({ length: n }, (_, d) => d)
  for (const r of tries) {
    const c = codeFromRoot(sigma, r, roots.length ? best : null, scratch, label, order)
    if (c < 0) { [best, scratch] = [scratch, best]; roots = [r] } else if (c === 0) roots.push(r)
  }
  return { code: best, roots }
}

/** The code as a compact string (dart count, then the labels), the census' unique key. */
export function codeToString(code: Int32Array): string {
  return `${code.length / 2}:${Array.from(code).join('.')}`
}

/** Inverse of `codeToString`: σ and ι of the relabelled map (darts numbered by the traversal). */
export function parseCode(s: string): { sigma: Int32Array, iota: Int32Array } {
  const m = /^(\d+):([\d.]+)$/.exec(s)
  if (!m) throw new Error('not a map code')
  const n = Number(m[1])
  const v = m[2]!.split('.').map(Number)
  if (v.length !== 2 * n || v.some(x => !(x >= 0 && x < n))) throw new Error('map code has the wrong length or labels')
  const sigma = new Int32Array(n), iota = new Int32Array(n)
  for (let i = 0; i < n; i++) { sigma[i] = v[2 * i]!; iota[i] = v[2 * i + 1]! }
  return { sigma, iota }
}

/** Brings a map given by (σ, ι) with any involution ι back to the ι(d) = d ^ 1 numbering. */
export function pairDarts(sigma: Int32Array, iota: Int32Array): Int32Array {
  const n = sigma.length
  const newOf = new Int32Array(n).fill(-1)
  let next = 0
  for (let d = 0; d < n; d++) {
    if (newOf[d]! >= 0) continue
    const e = iota[d]!
    if (e === d || iota[e] !== d) throw new Error('ι must be a fixed-point-free involution')
    newOf[d] = next; newOf[e] = next + 1; next += 2
  }
  const out = new Int32Array(n)
  for (let d = 0; d < n; d++) out[newOf[d]!] = newOf[sigma[d]!]!
  return out
}

/** The mirror image (σ⁻¹, ι). */
export function mirrorSigma(sigma: Int32Array): Int32Array {
  const inv = new Int32Array(sigma.length)
  for (let d = 0; d < sigma.length; d++) inv[sigma[d]!] = d
  return inv
}

/** Orbits of a permutation: orbit index of each element and the orbit count. */
export function orbits(perm: (d: number) => number, n: number): { of: Int32Array, count: number, sizes: number[] } {
  const of = new Int32Array(n).fill(-1)
  const sizes: number[] = []
  for (let d = 0; d < n; d++) {
    if (of[d]! >= 0) continue
    let x = d, size = 0
    while (of[x]! < 0) { of[x] = sizes.length; size++; x = perm(x) }
    sizes.push(size)
  }
  return { of, count: sizes.length, sizes }
}

/** Vertices (σ orbits), faces (φ = σ∘ι orbits) and genus of a connected map. */
export function mapShape(sigma: Int32Array): { vertices: ReturnType<typeof orbits>, faces: ReturnType<typeof orbits>, genus: number } {
  const n = sigma.length
  const vertices = orbits(d => sigma[d]!, n)
  const faces = orbits(d => sigma[d ^ 1]!, n)
  const chi = vertices.count - n / 2 + faces.count
  return { vertices, faces, genus: (2 - chi) / 2 }
}

/**
 * Orientability as a 2-colouring s with s(ι h) = −s(h) and s(σ h) = −s(h): BFS over the
 * relation graph, false on an odd cycle.
 */
export function isOrientableMap(sigma: Int32Array): boolean {
  const n = sigma.length
  const s = new Int8Array(n)
  const inv = mirrorSigma(sigma)
  const queue = new Int32Array(n)
  for (let start = 0; start < n; start++) {
    if (s[start]) continue
    s[start] = 1
    let head = 0, tail = 0
    queue[tail++] = start
    while (head < tail) {
      const d = queue[head++]!
      for (const t of [sigma[d]!, inv[d]!, d ^ 1]) {
        if (!s[t]) { s[t] = -s[d]! as 1 | -1; queue[tail++] = t } else if (s[t] === s[d]) return false
      }
    }
  }
  return true
}
