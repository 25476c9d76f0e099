import { createError } from 'h3'

/**
 * Build an HTTP error with a stable machine code (`data.code`) and a human message.
 * @example throw httpError(404, 'project_not_found', 'No such project.')
 */
export function httpError(statusCode: number, code: string, message: string) {
  return createError({ statusCode, message, data: { code } })
}
