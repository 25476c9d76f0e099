/**
 * Certificates of run points on the server: every claim is re-proven from the stored point, the
 * run's settings and its pattern version (shared/certify), never taken on trust; a claim that
 * cannot be proven refuses the whole request and nothing is written. Segment claims name only
 * the pair of points: the server computes the segment certificate itself from the two points'
 * proven radii and stores its own result.
 */
import { and, eq, inArray } from 'drizzle-orm'
import { certifiedExistence, runProvenParts, type CertifiedExistence } from '#shared/certify/checklist'
import { certifyFamilySegments, verifyCertificateClaims, type CertificateClaim,
  type PointCertificate } from '#shared/certify/family'
import { analyzePattern } from '#shared/pattern/analyze'
import { claimsPerRequest, type RunCertificates } from '#shared/types/certificates'

/** Re-proves the claims of run `run` and stores them (one transaction); 422 when one fails. */
export async function storeCertificateClaims(run: { id: number, graphVersionId: number, settings: string },
  claims: CertificateClaim[], segments: { from: number }[] = []): Promise<RunCertificates> {
  const { doc, settings } = await loadRunProblem(run)
  const rp = tables.runPoints
  const wanted = new Set([...claims.map(c => c.index), ...segments.flatMap(s => [s.from, s.from + 1])])
  const rows = await useDb().select().from(rp).where(and(eq(rp.runId, run.id), inArray(rp.index, [...wanted])))
  const points = rows.map(r => ({ index: r.index, lambda: r.lambda, u: (JSON.parse(r.state) as { u: number[] }).u }))
  const n = points[0]?.u.length ?? 0
  if (claims.length + segments.length > claimsPerRequest(n)) {
    throw httpError(413, 'too_much_work',
      `Re-proving ${claims.length + segments.length} certificates of ${n} unknowns is more than one request may ask; send at most ${claimsPerRequest(n)}.`)
  }
  const check = verifyCertificateClaims(doc, settings, points, claims)
  const refused = [...check.refused]
  // segments: both ends must be proven (in this request or stored before)
  const stored = new Map((await loadCertificates(run.id)).certificates.map(c => [c.index, c]))
  const proven = new Map<number, { rMin: number, rMax: number }>([...stored, ...claims.map(c => [c.index, c] as const)])
  const segmentRows: { fromIndex: number, toIndex: number, rMin: number, rMax: number }[] = []
  for (const s of segments) {
    const a = points.find(p => p.index === s.from), b = points.find(p => p.index === s.from + 1)
    const ca = proven.get(s.from), cb = proven.get(s.from + 1)
    if (!a || !b || !ca || !cb) { refused.push({ index: s.from,
      reason: 'segment: both end points must exist and be certified' }); continue }
    const asCert = (i: number,
      c: { rMin: number, rMax: number }): PointCertificate => ({ index: i, lambda: 0,
      certificate: { certified: true, size: a.u.length, rMin: c.rMin, rMax: c.rMax, y: 0, z0: 0, norm: 'max' } })
    const [seg] = certifyFamilySegments(doc, settings, [a, b], [asCert(a.index, ca), asCert(b.index, cb)])
    if (!seg?.certificate.certified) { refused.push({ index: s.from,
      reason: 'segment: not proven by the server' }); continue }
    segmentRows.push({ fromIndex: a.index, toIndex: b.index, rMin: seg.certificate.rMin, rMax: seg.certificate.rMax })
  }
  if (refused.length) {
    throw createError({ statusCode: 422,
      message: `Certificate refused: ${refused.map(r => `point ${r.index}: ${r.reason}`).join('; ')}.`, data: { code: 'certificate_refused', refused } })
  }
  const pc = tables.pointCertificates, sc = tables.segmentCertificates
  await useDb().transaction(async (tx) => {
    for (const c of claims) {
      await tx.insert(pc).values({ runId: run.id, pointIndex: c.index, rMin: c.rMin, rMax: c.rMax })
        .onConflictDoUpdate({ target: [pc.runId, pc.pointIndex],
          set: { rMin: c.rMin, rMax: c.rMax, updatedAt: new Date() } })
    }
    for (const s of segmentRows) {
      await tx.insert(sc).values({ runId: run.id, ...s })
        .onConflictDoUpdate({ target: [sc.runId, sc.fromIndex],
          set: { toIndex: s.toIndex, rMin: s.rMin, rMax: s.rMax, updatedAt: new Date() } })
    }
  })
  return loadCertificates(run.id)
}

/** The stored certificates of a run, by point index, and its certified segments. */
export async function loadCertificates(runId: number): Promise<RunCertificates> {
  const pc = tables.pointCertificates, sc = tables.segmentCertificates
  const [rows, segs] = await Promise.all([
    useDb().select().from(pc).where(eq(pc.runId, runId)).orderBy(pc.pointIndex),
    useDb().select().from(sc).where(eq(sc.runId, runId)).orderBy(sc.fromIndex),
  ])
  return {
    certificates: rows.map(r => ({ index: r.pointIndex, rMin: r.rMin, rMax: r.rMax,
      provenAt: r.updatedAt.toISOString() })),
    segments: segs.map(s => ({ from: s.fromIndex, to: s.toIndex, rMin: s.rMin, rMax: s.rMax })),
  }
}

/**
 * The certified checklist of a run's pattern (shared/certify/checklist.ts, the one builder): the
 * run's equations count as proven when every saved point has a stored certificate.
 */
export async function runExistence(run: { graphVersionId: number, settings: string }, pointIndices: number[],
  certificates: RunCertificates): Promise<CertifiedExistence> {
  const { doc, settings } = await loadRunProblem(run)
  return certifiedExistence(analyzePattern(doc).existence,
    runProvenParts(settings.path.kind, pointIndices, new Set(certificates.certificates.map(c => c.index))))
}
