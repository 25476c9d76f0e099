import { certificateClaimsSchema } from '#shared/types/certificates'
import { runRouteParamsSchema } from '#shared/types/runs'

/**
 * Claim interval certificates for saved points (and segments between them): the server re-proves
 * each; 422 refuses a claim it cannot prove (nothing stored).
 */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  const { run } = await requireRunAccess(event, runId, 'editor')
  const { claims, segments } = await readValidatedBody(event, certificateClaimsSchema.parse)
  return storeCertificateClaims(run, claims, segments)
})
