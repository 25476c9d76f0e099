/**
 * Real Chromium for e2e tests through playwright-core (Debian's /usr/bin/chromium, or
 * CHROMIUM_PATH). Screenshots go to the git-ignored tests/artifacts/.
 */
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { chromium, type BrowserContext, type Page } from 'playwright-core'
import { ROOT } from './server'
import { demo } from './http'
import type { DemoAccount } from '../../server/db/demo-data'

/** Folder for screenshots and other test output (git-ignored). */
export const ARTIFACTS = join(ROOT, 'tests/artifacts')

/** Flags that keep Chromium quiet and working in a container (see shared stack notes). */
export const CHROMIUM_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync']

/** A browser context plus its clean-up. */
export interface TestBrowser {
  context: BrowserContext
  /** A new page with a laptop-sized viewport (1366×860 unless given). */
  newPage: (viewport?: { width: number, height: number }) => Promise<Page>
  /**
   * Content-Security-Policy violations seen on any page of this context (console messages and
   * `securitypolicyviolation` events); fixtures.ts fails the file when there is one.
   */
  cspViolations: () => string[]
  close: () => Promise<void>
}

/** Record CSP violations of `page` into `into`. */
function watchCsp(page: Page, into: string[]): void {
  page.on('console', (m) => { if (/Content Security Policy|Refused to (load|execute|create|apply|connect|frame)/i.test(m.text())) into.push(`${page.url()}: ${m.text()}`) })
  void page.exposeBinding('__wingfoldCspViolation', (_src, text: string) => { into.push(`${page.url()}: ${text}`) }).catch(() => undefined)
  void page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window as unknown as { __wingfoldCspViolation?: (t: string) => void }).__wingfoldCspViolation?.(`${e.violatedDirective} blocked ${e.blockedURI || 'inline'}`)
    })
  }).catch(() => undefined)
}

/** Launch headless Chromium with a throwaway profile. */
export async function launchBrowser(): Promise<TestBrowser> {
  const profile = mkdtempSync(join(tmpdir(), 'wingfold-chromium-'))
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: { width: 1366, height: 860 },
  })
  const violations: string[] = []
  context.on('page', page => watchCsp(page, violations))
  for (const page of context.pages()) watchCsp(page, violations)
  return {
    context,
    cspViolations: () => [...violations],
    newPage: async (viewport) => {
      const page = await context.newPage()
      if (viewport) await page.setViewportSize(viewport)
      return page
    },
    close: async () => {
      await context.close()
      rmSync(profile, { recursive: true, force: true })
    },
  }
}

/** Save a full-page screenshot as tests/artifacts/<name>.png and return its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(ARTIFACTS, { recursive: true })
  const path = join(ARTIFACTS, `${name}.png`)
  await page.screenshot({ path, fullPage: true })
  return path
}

/**
 * Open a URL and wait until the Vue app has hydrated (app.vue sets `data-hydrated` on <html>).
 * @param timeoutMs for navigation and hydration (default 30 000; give `nuxt dev` more, it compiles on first visit)
 */
export async function gotoHydrated(page: Page, url: string, timeoutMs = 30_000): Promise<void> {
  await page.goto(url, { timeout: timeoutMs })
  await page.waitForSelector('html[data-hydrated="true"]', { state: 'attached', timeout: timeoutMs })
}

/** Sign in through the sign-in form as a demo account; waits for the projects page. */
export async function signInWithForm(page: Page, baseUrl: string, key: DemoAccount['key']): Promise<void> {
  const a = demo(key)
  await gotoHydrated(page, `${baseUrl}/sign-in`)
  await page.fill('#email', a.email)
  await page.fill('#password', a.password)
  await Promise.all([page.waitForURL('**/projects'), page.click('button[type=submit]')])
}
