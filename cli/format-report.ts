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
  phaseClosure: 'phases close around faces',
  phaseBalance: 'vertically balanced',
  phaseRigidity: 'phase-rigid',
}

const num = (x: number | null) => (x === null ? '—' : x === 0 ? '0' : Math.abs(x) >= 1e-3 && Math.abs(x) < 1e4 ? x.toPrecision(6) : x.toExponential(3))

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
      const i = g.inertia!
      return `σ_min·ℓ̄ ${num(g.sigmaMin)}, inertia −${i.negative}/0:${i.zero}/+${i.positive}, ${g.method}`
    }
    case 'phaseClosure': return `max defect ${num(v.phaseClosure.maxDefect)}`
    case 'phaseBalance': return `|G|/K̄ ${num(v.phaseBalance.residualNorm)}`
    case 'phaseRigidity': {
      const g = v.phaseRigidity
      const i = g.inertia!
      return `σ_min/K̄ ${num(g.sigmaMin)}, inertia −${i.negative}/0:${i.zero}/+${i.positive}`
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
  lines.push(`  ${r.summary.ok ? 'all verdicts hold' : `failing: ${r.summary.failing.join(', ')}`}. ${r.disclaimer}`)
  return lines.join('\n')
}
