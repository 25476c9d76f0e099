/**
 * Certificates of run points on the server: every claim is re-proven from the stored point, the
 * run's settings and its pattern version (shared/certify), never taken on trust; a claim that
 * cannot be proven refuses the whole request and nothing is written.
 */
import { and, eq, inArray } from 'drizzle-orm'
import { verifyCertificateClaims, type CertificateClaim } from '#shared/certify/family'
import type { StoredCertificate } from '#shared/types/certificates'

/** Re-proves the claims of run `run` and stores them (one transaction); 422 when one fails. */
export async function storeCertificateClaims(run: { id: number, graphVersionId: number, settings: string }, claims: CertificateClaim[]): Promise<StoredCertificate[]> {
  const { doc, settings } = await loadRunProblem(run)
  const rp = tables.runPoints
  const rows = await useDb().select().from(rp).where(and(eq(rp.runId, run.id), inArray(rp.index, claims.map(c => c.index))))
  const points = rows.map(r => ({ index: r.index, lambda: r.lambda, u: (JSON.parse(r.state) as { u: number[] }).u }))
  const check = verifyCertificateClaims(doc, settings, points, claims)
  if (!check.accepted) {
    throw createError({ statusCode: 422, message: `Certificate refused: ${check.refused.map(r => `point ${r.index}: ${r.reason}`).join('; ')}.`, data: { code: 'certificate_refused', refused: check.refused } })
  }
  const pc = tables.pointCertificates
  await useDb().transaction(async (tx) => {
    for (const c of claims) {
      await tx.insert(pc).values({ runId: run.id, pointIndex: c.index, rMin: c.rMin, rMax: c.rMax })
        .onConflictDoUpdate({ target: [pc.runId, pc.pointIndex], set: { rMin: c.rMin, rMax: c.rMax, updatedAt: new Date() } })
    }
  })
  return loadCertificates(run.id)
}

/** The stored certificates of a run, by point index. */
export async function loadCertificates(runId: number): Promise<StoredCertificate[]> {
  const pc = tables.pointCertificates
  const rows = await useDb().select().from(pc).where(eq(pc.runId, runId)).orderBy(pc.pointIndex)
  return rows.map(r => ({ index: r.pointIndex, rMin: r.rMin, rMax: r.rMax, provenAt: r.updatedAt.toISOString() }))
}
