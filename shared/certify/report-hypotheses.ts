/**
 * Hypothesis ids from the analysis report's verdicts, for reports that do not list the ids
 * themselves: each id present in the report maps to the verdicts that decide it (ids without a
 * verdict of their own are left out rather than guessed).
 */
import type { PatternReport } from '../pattern/report'
import type { HypothesisInput } from './checklist'

/** The hypothesis list of a report (torus T…, plane P…). */
export function hypothesesFromReport(r: PatternReport): HypothesisInput[] {
  const v = r.verdicts
  const phases = r.phases.present
  const list: [string, boolean][] = r.summary.space === 'torus'
    ? [
        ['T1', v.connected.ok && v.lattice.ok && v.faceClosure.ok], ['T3', v.degrees.ok], ['T4', v.orientable.ok],
        ['T5', v.cyclicOrder.ok && v.edgeLengths.ok], ['T6', v.balance.ok], ['T7', v.rigidity.ok],
        ...(phases ? [['T9', v.phaseClosure.ok], ['T10', v.phaseBalance.ok], ['T11', v.phaseRigidity.ok]] as [string, boolean][] : []),
      ]
    : [
        ['P1', v.connected.ok], ['P2', v.degrees.ok], ['P3', v.orientable.ok], ['P4', v.cyclicOrder.ok && v.edgeLengths.ok],
        ['P5', v.balance.ok && v.openWings.ok], ['P6', v.rigidity.ok],
        ...(phases ? [['P8', v.phaseBalance.ok], ['P9', v.phaseRigidity.ok]] as [string, boolean][] : []),
      ]
  return list.map(([id, holds]) => ({ id, holds }))
}
