/** Human-readable text of a `PatternReport` for `wingfold check`. */
import type { PatternReport, VerdictName } from '../shared/pattern/report'

const LABELS: Record<VerdictName, string> = {
  connected: 'connected',
  degrees: 'gluing degrees (even, ≥ 4)',
  orientable: 'orientable',
  lattice: 'lattice',
  faceClosure: 'faces close in the torus',
  cyclicOrder: 'drawn order matches rotation',
  edgeLengths: 'no collapsed edge',
  openWings: 'open wings sum to zero',
  balance: 'balanced',
  rigidity: 'rigid',
  ordinary: 'every vertex ordinary',
  phaseClosure: 'phases close around faces',
  phaseBalance: 'vertically balanced on cuts',
  phaseRigidity: 'phase-rigid',
}

const num = (x: number | null) => (x === null ? '—' : x === 0 ? '0' : Math.abs(x) >= 1e-3 && Math.abs(x) < 1e4 ? x.toPrecision(6) : x.toExponential(3))

const inertiaText = (i: { negative: number, zero: number, positive: number } | null) =>
  (i ? `inertia −${i.negative}/0:${i.zero}/+${i.positive}` : 'inertia —')

/** The numbers worth a glance for each verdict. */
function details(r: PatternReport, name: VerdictName): string {
  const v = r.verdicts
  switch (name) {
    case 'connected': return `${v.connected.components} component(s)`
    case 'degrees': return `degrees ${v.degrees.degrees.join(' ')}`
    case 'lattice': return v.lattice.determinant === null ? 'plane' : `det ${num(v.lattice.determinant)}`
    case 'faceClosure': return r.summary.space === 'plane'
      ? `${v.faceClosure.faces} faces (plane: no shifts)`
      : `${v.faceClosure.faces} faces, lattice index ${v.faceClosure.latticeIndex ?? '∞'}`
    case 'cyclicOrder': return `min margin ${num(v.cyclicOrder.minMargin)} rad (${v.cyclicOrder.explicit ? 'explicit' : 'from drawing'})`
    case 'edgeLengths': return `min length ${num(v.edgeLengths.minLength)}`
    case 'openWings': return `|sum| ${num(v.openWings.norm)}`
    case 'balance': return `|B| ${num(v.balance.residualNorm)} (tol ${num(v.balance.tolerance)})`
    case 'rigidity': {
      const g = v.rigidity
      if (g.plane) return `rank M ${g.plane.rank}/${g.plane.rows}, σ_2V ${num(g.plane.sigma)}, dim D ${g.plane.familyDimension}`
      return `σ_min·ℓ̄ ${num(g.sigmaMin)}, ${inertiaText(g.inertia)}, ${g.method}`
    }
    case 'ordinary': return v.ordinary.notable.length
      ? v.ordinary.notable.map(t => `${t.vertex} ${t.kind}${t.nearKind ? ` (near ${t.nearKind})` : ''}`).join(', ')
      : 'no coinciding wing lines'

    case 'phaseClosure': return `max defect ${num(v.phaseClosure.maxDefect)}`
    case 'phaseBalance': {
      const g = v.phaseBalance
      return `|F|/K̄ ${num(g.residualNorm)}, ${g.equations.length} equation(s)${g.dependsOnK ? ', depends on K' : ''}${g.nearWall ? ', near a wall' : ''}`
    }
    case 'phaseRigidity': {
      const g = v.phaseRigidity
      return `σ_min/K̄ ${num(g.sigmaMin)}${g.pinnedDeterminant === null ? '' : `, det ${num(g.pinnedDeterminant)}`}${g.inertia ? `, ${inertiaText(g.inertia)}` : ''}`
    }
    default: return ''
  }
}

/** Multi-line text: header, topology, one line per verdict, witnesses of failures. */
export function formatReport(r: PatternReport): string {
  const t = r.topology
  const lines = [
    `${r.name} (${r.summary.space})`,
    `  V ${t.vertices}, E ${t.closedEdges}, open wings ${t.openWings}, faces ${t.faces}, χ ${t.eulerCharacteristic}, `
    + `embedding genus ${t.embeddingGenus}, predicted genus ${t.predictedGenus}, open ends ${t.openEnds}`,
    '',
  ]
  for (const name of Object.keys(LABELS) as VerdictName[]) {
    const v = r.verdicts[name]
    lines.push(`  ${v.ok ? 'ok  ' : 'FAIL'} ${LABELS[name].padEnd(30)} ${details(r, name)}`)
    if (!v.ok) {
      if (v.explanation) lines.push(`       ${v.explanation}`)
      if ('witness' in v && v.witness) lines.push(`       witness: ${JSON.stringify(v.witness)}`)
    }
  }
  lines.push('', `  phases: α = (${r.phases.alpha.map(num).join(', ')})${r.phases.keepsMirrorPlanes ? ', all φ in {0, π}: keeps horizontal mirror planes' : ''}`)
  lines.push(...verticalEquationLines(r))
  lines.push(...existenceLines(r))
  lines.push(`  ${r.summary.ok ? 'all verdicts hold' : `failing: ${r.summary.failing.join(', ')}`}. ${r.disclaimer}`)
  return lines.join('\n')
}

/** The vertical equations as edge sets, the length levels and the wall notes. */
function verticalEquationLines(r: PatternReport): string[] {
  const g = r.verdicts.phaseBalance
  if (!g.equations.length) return ['', '  vertical balance on cuts: no equations (no cut crosses a closed edge)']
  const out = ['', `  vertical balance on cuts: ${g.equations.length} equation(s), each the sum of K·sin φ over the signed edges listed:`]
  g.equations.forEach((q, i) => {
    const terms = q.terms.map(t => `${t.sign < 0 ? '−' : '+'}${t.edge}`).join(' ')
    out.push(`    [${i + 1}] level ${q.level + 1} (ℓ ${num(q.length)}), X = {${q.vertices.join(', ')}}: ${terms} = ${num(q.residual)}${q.dependsOnK ? '  (depends on K)' : ''}`)
  })
  if (g.nearWall) out.push(`    near a wall: ${g.nearWall.pairs.map(p => `${p.edges.join('/')} gap ${num(p.relativeGap)}`).join(', ')}`)
  if (g.chainedTies.length) out.push(`    chained ties in levels ${g.chainedTies.map(i => i + 1).join(', ')}`)
  out.push(`    ${g.kNote}`)
  return out
}

/** The hypotheses of the published existence theorem, one per line, and the conclusion line. */
function existenceLines(r: PatternReport): string[] {
  const x = r.existence
  return [
    '', `  existence theorem (${x.theorem}):`,
    ...x.items.map(i => `    ${i.id.padEnd(4)} ${i.status.padEnd(11)} ${i.statement}${i.detail ? ` — ${i.detail}` : ''}`),
    `    ${x.line}${x.allHold ? `: ${x.conclusion}` : ''}`,
    '',
  ]
}
