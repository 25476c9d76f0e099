/**
 * glTF 2.0 (Khronos Group, "glTF 2.0 Specification", 2021) as one .gltf JSON file with the
 * buffer embedded as a base64 data URI: one mesh, one primitive with POSITION (float32, with the
 * min/max the specification requires), optional COLOR_0 and uint32 indices; the meta in
 * `asset.extras`. Written here rather than with three's GLTFExporter, which needs the browser's
 * Blob/FileReader and so does not run in the CLI.
 */
import type { SurfaceExportMeta } from './export-meta'
import type { UnrolledMesh } from './unroll'

function base64(bytes: Uint8Array): string {
  let s = ''
  for (let i = 0; i < bytes.length; i += 0x8000) s += String.fromCharCode(...bytes.subarray(i, i + 0x8000))
  return btoa(s)
}

/** The glTF JSON text; `colors` (r, g, b in 0..1 per vertex) is optional. */
export function writeGltf(u: UnrolledMesh, meta: SurfaceExportMeta, colors?: Float32Array): string {
  const nV = u.positions.length / 3, s = meta.unitScale
  const pos = new Float32Array(u.positions.length)
  const min = [Infinity, Infinity, Infinity], max = [-Infinity, -Infinity, -Infinity]
  for (let i = 0; i < pos.length; i++) {
    pos[i] = u.positions[i]! * s
    min[i % 3] = Math.min(min[i % 3]!, pos[i]!); max[i % 3] = Math.max(max[i % 3]!, pos[i]!)
  }
  const parts: Uint8Array[] = [new Uint8Array(pos.buffer)]
  if (colors) parts.push(new Uint8Array(colors.buffer, colors.byteOffset, colors.byteLength))
  parts.push(new Uint8Array(u.indices.buffer, u.indices.byteOffset, u.indices.byteLength))
  const total = parts.reduce((n, p) => n + p.byteLength, 0)
  const buf = new Uint8Array(total)
  let off = 0
  const views = parts.map((p) => { buf.set(p, off); const v = { buffer: 0, byteOffset: off, byteLength: p.byteLength }; off += p.byteLength; return v })
  const accessors: object[] = [{ bufferView: 0, componentType: 5126, count: nV, type: 'VEC3', min, max }]
  const attributes: Record<string, number> = { POSITION: 0 }
  if (colors) { accessors.push({ bufferView: 1, componentType: 5126, count: nV, type: 'VEC3' }); attributes.COLOR_0 = 1 }
  accessors.push({ bufferView: views.length - 1, componentType: 5125, count: u.indices.length, type: 'SCALAR' })
  const doc = {
    asset: { version: '2.0', generator: 'Wingfold', extras: meta },
    scene: 0,
    scenes: [{ nodes: [0] }],
    nodes: [{ mesh: 0, name: meta.pattern }],
    materials: [{ pbrMetallicRoughness: { baseColorFactor: [0.55, 0.7, 0.8, 1], metallicFactor: 0, roughnessFactor: 0.7 }, doubleSided: true }],
    meshes: [{ name: 'surface', primitives: [{ attributes, indices: accessors.length - 1, material: 0, mode: 4 }] }],
    buffers: [{ byteLength: total, uri: `data:application/octet-stream;base64,${base64(buf)}` }],
    bufferViews: views.map((v, i) => ({ ...v, target: i === views.length - 1 ? 34963 : 34962 })),
    accessors,
  }
  return JSON.stringify(doc)
}
