/**
 * The verdict panel's rows from an analysis report: a label, yes/no, the deciding number as short
 * text, the one-sentence explanation when failing, and whether a witness can be shown. Pure.
 */
import type { PatternReport, VerdictName } from '#shared/pattern/report'

/** One row of the verdict panel. */
export interface VerdictRow {
  name: VerdictName
  label: string
  ok: boolean
  detail: string
  explanation?: string
  hasWitness: boolean
}

const fmt = (x: number | null | undefined, digits = 2) =>
  x === null || x === undefined || !Number.isFinite(x) ? '—' : Math.abs(x) !== 0 && (Math.abs(x) < 1e-3 || Math.abs(x) >= 1e4) ? x.toExponential(digits) : x.toFixed(digits + 1)

/** Rows in reading order: combinatorics, lattice, geometry, then phases. */
export function verdictRows(r: PatternReport): VerdictRow[] {
  const v = r.verdicts
  const inertia = v.rigidity.inertia
  const pInertia = v.phaseRigidity.inertia
  const rows: Array<[VerdictName, string, string]> = [
    ['connected', 'connected', `${v.connected.components} component${v.connected.components === 1 ? '' : 's'}`],
    ['degrees', 'degrees fit a gluing', `degrees ${[...new Set(v.degrees.degrees)].sort((a, b) => a - b).join(', ') || '—'}`],
    ['orientable', 'orientable', v.orientable.ok ? 'half-edges alternate' : 'odd chain'],
    ['lattice', 'lattice', v.lattice.relativeArea === null ? 'plane' : `area ratio ${fmt(v.lattice.relativeArea)}`],
    ['faceClosure', 'faces close', `${v.faceClosure.faces} faces, ${v.faceClosure.openFaces} open · sublattice index ${v.faceClosure.latticeIndex ?? '—'}`],
    ['cyclicOrder', 'cyclic order consistent', `min margin ${fmt(v.cyclicOrder.minMargin)} rad${v.cyclicOrder.explicit ? ' (given order)' : ''}`],
    ['edgeLengths', 'edge lengths', `shortest ${fmt(v.edgeLengths.relativeMinLength)} of mean`],
    ['openWings', 'open wings sum to zero', r.summary.space === 'plane' ? `|Σ| ${fmt(v.openWings.norm)}` : 'none in the torus'],
    ['balance', 'balanced', `max residual ${fmt(v.balance.maxVertexResidual)}`],
    ['rigidity', 'rigid', v.rigidity.plane
      ? `rank M ${v.rigidity.plane.rank} of ${v.rigidity.plane.rows} · σ_2V ${fmt(v.rigidity.plane.sigma)} · dim D ${v.rigidity.plane.familyDimension}`
      : `σ_min ${fmt(v.rigidity.sigmaMin)} · inertia ${inertia ? `${inertia.negative}/${inertia.zero}/${inertia.positive}` : '—'} (${v.rigidity.method})`],
    ['ordinary', 'every vertex ordinary', ordinaryDetail(r)],
    ['phaseClosure', 'phases close around faces', `max defect ${fmt(v.phaseClosure.maxDefect)}`],
    ['phaseBalance', 'vertically balanced on cuts', `${v.phaseBalance.equations.length} equation${v.phaseBalance.equations.length === 1 ? '' : 's'} · residual ${fmt(v.phaseBalance.residualNorm)}${v.phaseBalance.dependsOnK ? ' · depends on K' : ''}${v.phaseBalance.nearWall ? ' · near a wall' : ''}`],
    ['phaseRigidity', 'phase-rigid', `σ_min ${fmt(v.phaseRigidity.sigmaMin)} · inertia ${pInertia ? `${pInertia.negative}/${pInertia.zero}/${pInertia.positive}` : '—'}`],
  ]
  return rows.map(([name, label, detail]) => {
    const verdict = v[name] as { ok: boolean, explanation?: string, witness?: unknown }
    return {
      name, label, ok: verdict.ok, detail,
      ...(verdict.ok ? {} : { explanation: verdict.explanation ?? 'This condition fails.' }),
      hasWitness: !verdict.ok && (verdict.witness !== undefined || name === 'balance'),
    }
  })
}

/** Kinds of the vertices that are not ordinary, or near a change of kind. */
function ordinaryDetail(r: PatternReport): string {
  const n = r.verdicts.ordinary.notable
  if (!n.length) return 'no coinciding wing lines'
  return n.map(t => `${t.vertex} ${t.kind}${t.nearKind ? ` (near ${t.nearKind})` : ''}`).join(', ')
}

/** The topology line: genus of the embedding and predicted genus / ends of the glued surface. */
export function topologyLine(r: PatternReport): string {
  const t = r.topology
  return `V ${t.vertices} · E ${t.closedEdges}${t.openWings ? ` · W ${t.openWings}` : ''} · F ${t.faces} · embedding genus ${t.embeddingGenus} · glued surface: genus ${t.predictedGenus}${r.summary.space === 'plane' ? `, ${t.openEnds} open ends` : ''}`
}
