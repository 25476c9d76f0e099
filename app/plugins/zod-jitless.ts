/**
 * zod 4 compiles object parsers with `new Function` after probing whether eval is allowed; under
 * our Content-Security-Policy (no 'unsafe-eval', docs/security.md) that probe is reported as a
 * violation on every page. Parse without compiling instead (same results, no eval). Set when this
 * module is evaluated (with the entry, before any page chunk builds its schemas): zod reads the
 * flag when a schema is constructed.
 */
import { z } from 'zod'

z.config({ jitless: true })

export default defineNuxtPlugin({ name: 'zod-jitless', enforce: 'pre', setup() {} })
