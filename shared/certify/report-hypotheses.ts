/**
 * The hypothesis list of an analysis report: its existence checklist (shared/pattern/existence.ts,
 * T1–T11 or P1–P9), each id with its statement, status and detail, in the report's order.
 */
import type { PatternReport } from '../pattern/report'
import { hypothesesOf, type HypothesisInput } from './checklist'

/** The hypotheses of the report's existence checklist. */
export function hypothesesFromReport(r: PatternReport): HypothesisInput[] {
  return hypothesesOf(r.existence)
}
