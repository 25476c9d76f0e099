/**
 * Payloads of the certificate routes: a client (the run page's worker) claims interval
 * certificates for saved points; the server re-proves every claim before storing it.
 */
import { z } from 'zod'

/** Largest number of claims one request may carry (each is re-proven on the server). */
export const MAX_CERTIFICATE_CLAIMS = 100

/**
 * Work one request may ask of the server, in n² units (n unknowns per point; a re-proof costs
 * about n² dense operations plus n sparse solves): about one 1400-unknown certificate, or many
 * small ones. The client splits its claims with {@link claimsPerRequest}.
 */
export const CERTIFICATE_WORK_PER_REQUEST = 2_000_000

/** How many claims (and segments) of points with n unknowns fit in one request. */
export function claimsPerRequest(n: number): number {
  return Math.max(1, Math.min(MAX_CERTIFICATE_CLAIMS, Math.floor(CERTIFICATE_WORK_PER_REQUEST / Math.max(1, n * n))))
}

/** One claim: a unique zero within rMin of saved point `index`, no other within rMax (max-norm). */
export const CertificateClaimSchema = z.object({
  index: z.number().int().min(0),
  rMin: z.number().finite().positive(),
  rMax: z.number().finite().positive(),
}).refine(c => c.rMax >= c.rMin, { message: 'rMax must be at least rMin' })

/** A segment claim: the branch between saved points `from` and `from + 1` is certified (the server recomputes it). */
export const SegmentClaimSchema = z.object({ from: z.number().int().min(0) })

/** POST /api/runs/[runId]/certificates. */
export const certificateClaimsSchema = z.object({
  claims: z.array(CertificateClaimSchema).max(MAX_CERTIFICATE_CLAIMS).default([]),
  segments: z.array(SegmentClaimSchema).max(MAX_CERTIFICATE_CLAIMS).default([]),
}).refine(b => b.claims.length + b.segments.length > 0, { message: 'claim at least one point or segment' })
export type CertificateClaimsPayload = z.input<typeof certificateClaimsSchema>

/** A stored (server-proven) certificate. */
export interface StoredCertificate { index: number; rMin: number; rMax: number; provenAt: string }

/** A stored (server-proven) segment certificate between points `from` and `to`. */
export interface StoredSegmentCertificate { from: number; to: number; rMin: number; rMax: number }

/** GET /api/runs/[runId]/certificates. */
export interface RunCertificates { certificates: StoredCertificate[]; segments: StoredSegmentCertificate[] }
