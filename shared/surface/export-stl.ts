/**
 * Binary STL (the de-facto 3D Systems format, common practice): 80-byte header, uint32 triangle
 * count, then per triangle a float32 normal, three float32 vertices and a uint16 attribute, little
 * endian. STL has no units: the header names the unit (see ./export-meta.ts).
 */
import { shortMeta, type SurfaceExportMeta } from './export-meta'
import type { UnrolledMesh } from './unroll'

export function writeStl(u: UnrolledMesh, meta: SurfaceExportMeta): Uint8Array {
  const F = u.indices.length / 3
  const out = new Uint8Array(84 + 50 * F)
  const view = new DataView(out.buffer)
  const header = new TextEncoder().encode(shortMeta(meta).replace(/[^\x20-\x7e]/g, '?')).subarray(0, 80)
  // An ASCII STL starts with "solid"; a binary header must not, or readers guess wrong.
  out.set(header)
  view.setUint32(80, F, true)
  const s = meta.unitScale
  for (let t = 0; t < F; t++) {
    const o = 84 + 50 * t
    const p = [0, 1, 2].map(i => [0, 1, 2].map(d => u.positions[3 * u.indices[3 * t + i]! + d]! * s))
    const [a, b, c] = p as [number[], number[], number[]]
    const ux = b[0]! - a[0]!, uy = b[1]! - a[1]!, uz = b[2]! - a[2]!
    const vx = c[0]! - a[0]!, vy = c[1]! - a[1]!, vz = c[2]! - a[2]!
    let nx = uy * vz - uz * vy, ny = uz * vx - ux * vz, nz = ux * vy - uy * vx
    const l = Math.hypot(nx, ny, nz) || 1
    nx /= l; ny /= l; nz /= l
    view.setFloat32(o, nx, true); view.setFloat32(o + 4, ny, true); view.setFloat32(o + 8, nz, true)
    for (let i = 0; i < 3; i++) for (let d = 0; d < 3; d++) view.setFloat32(o + 12 + 12 * i + 4 * d, p[i]![d]!, true)
    view.setUint16(o + 48, 0, true)
  }
  return out
}

/** Reads a binary STL back (tests, the CLI's summary): header text and triangle corners. */
export function readStl(bytes: Uint8Array): { header: string, triangles: Float32Array } {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength)
  const F = view.getUint32(80, true)
  if (bytes.byteLength !== 84 + 50 * F) throw new Error(`STL: ${bytes.byteLength} bytes, expected ${84 + 50 * F} for ${F} triangles`)
  const tri = new Float32Array(9 * F)
  for (let t = 0; t < F; t++) for (let k = 0; k < 9; k++) tri[9 * t + k] = view.getFloat32(84 + 50 * t + 12 + 4 * k, true)
  return { header: new TextDecoder().decode(bytes.subarray(0, 80)).replace(/\0+$/, ''), triangles: tri }
}
