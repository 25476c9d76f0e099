/**
 * vitest fixtures: one server (and optionally one Chromium) per test file, started in
 * `beforeAll` and stopped in `afterAll`. Read the fields inside tests, not at import time.
 */
import { afterAll, beforeAll } from 'vitest'
import { startServer, type StartServerOptions, type TestServer } from './server'
import { launchBrowser, type TestBrowser } from './browser'

/** A built (or dev) server for this test file. */
export function useTestServer(opts?: StartServerOptions): { server: TestServer } {
  const ctx = {} as { server: TestServer }
  beforeAll(async () => { ctx.server = await startServer(opts) })
  afterAll(async () => { await ctx.server?.stop() })
  return ctx
}

/** A server and a Chromium for this test file (started in parallel). */
export function useServerAndBrowser(opts?: StartServerOptions): { server: TestServer, browser: TestBrowser } {
  const ctx = {} as { server: TestServer, browser: TestBrowser }
  beforeAll(async () => { [ctx.server, ctx.browser] = await Promise.all([startServer(opts), launchBrowser()]) })
  afterAll(async () => {
    const violations = ctx.browser?.cspViolations() ?? []
    await ctx.browser?.close(); await ctx.server?.stop()
    // the security headers must not block anything the app does (workers, charts, fonts)
    if (violations.length) throw new Error(`Content-Security-Policy violations in the browser:\n${violations.join('\n')}`)
  })
  return ctx
}
