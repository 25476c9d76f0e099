/**
 * Wavefront OBJ (common practice): `v x y z` lines, `f i j k` with 1-based indices, `#` comments
 * carrying the pattern, version, settings and unit as JSON.
 */
import { unitSentence, type SurfaceExportMeta } from './export-meta'
import type { UnrolledMesh } from './unroll'

export function writeObj(u: UnrolledMesh, meta: SurfaceExportMeta): string {
  const s = meta.unitScale
  const lines = [
    `# Wingfold surface: ${meta.mesh} mesh of '${meta.pattern}'${meta.version === null ? '' : ` version ${meta.version}`}`,
    `# unit: ${unitSentence(s)}`,
    `# meta: ${JSON.stringify(meta)}`,
    'o surface',
  ]
  for (let v = 0; v < u.positions.length / 3; v++) {
    lines.push(`v ${(u.positions[3 * v]! * s).toPrecision(9)} ${(u.positions[3 * v + 1]! * s).toPrecision(9)} ${(u.positions[3 * v + 2]! * s).toPrecision(9)}`)
  }
  for (let t = 0; t < u.indices.length / 3; t++) lines.push(`f ${u.indices[3 * t]! + 1} ${u.indices[3 * t + 1]! + 1} ${u.indices[3 * t + 2]! + 1}`)
  return lines.join('\n') + '\n'
}
