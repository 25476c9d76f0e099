/**
 * Exports read back as a user's tool would: binary STL (layout: 80-byte header, uint32 count,
 * 50 bytes per triangle; common practice), OBJ (1-based faces), glTF 2.0 (Khronos, "glTF 2.0
 * Specification", 2021: accessor min/max, buffer length). The CLI writes an STL of a relaxed demo
 * torus pattern whose quotient genus, recomputed from the file alone by welding corners modulo
 * the periods and Euler's formula (B. Mohar, C. Thomassen, Graphs on Surfaces, 2001), is E − V + 1 (H. Chen, M. Traizet, Gluing Karcher–Scherk saddle towers I, arXiv 2103.15676, 2021,
 * Thm 6.7).
 */
import { execFile } from 'node:child_process'
import { mkdtemp, readFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { promisify } from 'node:util'
import { describe, expect, it } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import type { SurfaceExportMeta } from '../../../shared/surface/export-meta'
import { readStl } from '../../../shared/surface/export-stl'
import { parseSurfaceSettings } from '../../../shared/surface/options'
import { buildSchematic } from '../../../shared/surface/schematic'
import { exportSurface } from '../../../shared/surface/surface-job'
import { soupGenus } from '../../support/surface-genus'

const root = resolve(__dirname, '../../..')

const meta = (copies: [number, number, number]): SurfaceExportMeta => ({
  pattern: 'Square pair', version: 7, mesh: 'schematic', settings: parseSurfaceSettings({ rows: 12, radial: 3 }),
  copies, unit: 'mm', unitScale: 2,
})

describe('surface exports', () => {
  const s = buildSchematic(findPatternExample('square-pair')!.document, { rows: 12, radial: 3 })
  const F = s.topology.faces

  it('binary STL: header names version, settings and unit; n1·n2·n3 copies; coordinates scaled', () => {
    const one = readStl(exportSurface(s.mesh, 'stl', meta([1, 1, 1])) as Uint8Array)
    const many = readStl(exportSurface(s.mesh, 'stl', meta([2, 3, 1])) as Uint8Array)
    expect(one.triangles.length / 9).toBe(F)
    expect(many.triangles.length / 9).toBe(6 * F)
    expect(one.header).toMatch(/^Wingfold schematic v7 rows=12 .*n=1x1x1/)
    expect(one.header.startsWith('solid')).toBe(false)
    // unit scale 2: the z extent of one cell is 2 · 2π plus the phase spread
    let zmin = Infinity, zmax = -Infinity
    for (let i = 2; i < one.triangles.length; i += 3) { zmin = Math.min(zmin, one.triangles[i]!); zmax = Math.max(zmax, one.triangles[i]!) }
    expect(zmax - zmin).toBeGreaterThan(2 * 2 * Math.PI - 1e-3)
  })

  it('OBJ: meta comment as JSON, one v line per unrolled vertex, 1-based faces', () => {
    const text = exportSurface(s.mesh, 'obj', meta([1, 1, 2])) as string
    const m = JSON.parse(text.split('\n').find(l => l.startsWith('# meta: '))!.slice(8))
    expect(m).toMatchObject({ version: 7, copies: [1, 1, 2], unit: 'mm', settings: { rows: 12 } })
    const faces = text.split('\n').filter(l => l.startsWith('f '))
    const nv = text.split('\n').filter(l => l.startsWith('v ')).length
    expect(faces.length).toBe(2 * F)
    const used = faces.flatMap(l => l.slice(2).split(' ').map(Number))
    expect(Math.min(...used)).toBe(1)
    expect(Math.max(...used)).toBe(nv)
  })

  it('glTF 2.0: buffer length, accessor counts and POSITION min/max agree with the data', () => {
    const doc = JSON.parse(exportSurface(s.mesh, 'gltf', meta([1, 1, 1])) as string)
    expect(doc.asset.version).toBe('2.0')
    expect(doc.asset.extras).toMatchObject({ version: 7, mesh: 'schematic' })
    const bytes = Buffer.from(doc.buffers[0].uri.split(',')[1], 'base64')
    expect(bytes.length).toBe(doc.buffers[0].byteLength)
    const idx = doc.accessors[doc.meshes[0].primitives[0].indices]
    expect(idx.count).toBe(3 * F)
    const pv = doc.bufferViews[doc.accessors[0].bufferView]
    const pos = new Float32Array(bytes.buffer.slice(bytes.byteOffset + pv.byteOffset, bytes.byteOffset + pv.byteOffset + pv.byteLength))
    const zs = Array.from(pos).filter((_, i) => i % 3 === 2)
    expect(Math.max(...zs)).toBeCloseTo(doc.accessors[0].max[2], 4)
    expect(Math.min(...zs)).toBeCloseTo(doc.accessors[0].min[2], 4)
  })

  it('the genus read back from the STL of the schematic is E − V + 1', () => {
    const stl = readStl(exportSurface(s.mesh, 'stl', { ...meta([1, 1, 1]), unitScale: 1 }) as Uint8Array)
    expect(soupGenus(stl.triangles, s.mesh.periods)).toBe(3) // square pair: E = 4, V = 2
  })
})

describe('wingfold surface (CLI)', () => {
  it('writes the relaxed STL of a demo torus pattern; its quotient genus read from the file is E − V + 1', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'wf-surface-'))
    const out = join(dir, 'six.stl')
    const r = await promisify(execFile)('node', ['--import', 'tsx', 'cli/wingfold.ts', 'surface', 'shared/examples/six-wing-lattice.wfp.json', '--relax', '--rows', '12', '-o', out], { cwd: root })
    expect(r.stdout).toMatch(/predicted genus E − V \+ 1 = 3 → matches/)
    expect(r.stdout).toMatch(/relaxation: /)
    const stl = readStl(new Uint8Array(await readFile(out)))
    expect(stl.header).toMatch(/^Wingfold relaxed/)
    const doc = findPatternExample('six-wing-lattice')!.document
    const s6 = buildSchematic(doc, { rows: 12 })
    expect(soupGenus(stl.triangles, s6.mesh.periods)).toBe(doc.edges.length - doc.vertices.length + 1)
  })
  it('exits 2 on a pattern without saddle towers (odd degrees), with the reason', async () => {
    const e = await promisify(execFile)('node', ['--import', 'tsx', 'cli/wingfold.ts', 'surface', 'shared/examples/fermat-pair.wfp.json'], { cwd: root }).catch(x => x)
    expect(e.code).toBe(2)
    expect(e.stderr).toMatch(/3 wings; a saddle tower needs an even number/)
  })
})

describe('genus read back from an STL of several cells', () => {
  it('copies fold onto one cell: 2 × 2 × 1 cells of the square pair still give genus 3', () => {
    const s = buildSchematic(findPatternExample('square-pair')!.document, { rows: 12, radial: 3 })
    const stl = readStl(exportSurface(s.mesh, 'stl', { ...meta([2, 2, 1]), unitScale: 1 }) as Uint8Array)
    expect(stl.triangles.length / 9).toBe(4 * s.topology.faces)
    expect(soupGenus(stl.triangles, s.mesh.periods)).toBe(3)
  })
})
