/**
 * HTTP helpers for server tests: a tiny client that keeps the session cookie, and sign-in as a
 * demo account or any e-mail/password.
 */
import { DEMO_ACCOUNTS, type DemoAccount } from '../../server/db/demo-data'

export { DEMO_ACCOUNTS }

/** A cookie-keeping client bound to one server. */
export interface ApiClient {
  /** `fetch` relative to the server URL, sending the session cookie (if any). */
  fetch: (path: string, init?: RequestInit) => Promise<Response>
  /** JSON request; returns status and parsed body (null when empty). */
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- tests read bodies loosely and assert their shape
  json: <T = any>(method: string, path: string, body?: unknown) => Promise<{ status: number, body: T }>
  /** The current `name=value` cookie header (empty when signed out). */
  cookie: () => string
  /** The server this client talks to. */
  baseUrl: string
}

/** A client without a session. */
export function client(baseUrl: string): ApiClient {
  const jar = new Map<string, string>()
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ')
  const doFetch = async (path: string, init: RequestInit = {}) => {
    const headers = new Headers(init.headers)
    if (jar.size) headers.set('cookie', cookie())
    const res = await fetch(new URL(path, baseUrl), { ...init, headers, redirect: 'manual' })
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';')
      const eq = pair!.indexOf('=')
      const name = pair!.slice(0, eq).trim()
      const value = pair!.slice(eq + 1).trim()
      if (value === '' || /max-age=0/i.test(line)) jar.delete(name)
      else jar.set(name, value)
    }
    return res
  }
  const json = async (method: string, path: string, body?: unknown) => {
    const res = await doFetch(path, {
      method,
      headers: body === undefined ? {} : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    })
    const text = await res.text()
    return { status: res.status, body: text ? JSON.parse(text) : null }
  }
  return { fetch: doFetch, json, cookie, baseUrl }
}

/** Sign in with e-mail and password; throws unless the server answers 200. */
export async function signIn(baseUrl: string, email: string, password: string): Promise<ApiClient> {
  const c = client(baseUrl)
  const res = await c.json('POST', '/api/auth/sign-in', { email, password })
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed with ${res.status}: ${JSON.stringify(res.body)}`)
  return c
}

/** The demo account with this key (admin, owner, editor, viewer). */
export function demo(key: DemoAccount['key']): DemoAccount {
  return DEMO_ACCOUNTS.find(a => a.key === key)!
}

/** Sign in as a demo account. */
export function signInAs(baseUrl: string, key: DemoAccount['key']): Promise<ApiClient> {
  const a = demo(key)
  return signIn(baseUrl, a.email, a.password)
}

/** Create a fresh account through sign-up (returns a signed-in client). */
export async function signUp(baseUrl: string, name: string, email: string, password = 'a-long-test-passphrase'): Promise<ApiClient> {
  const c = client(baseUrl)
  const res = await c.json('POST', '/api/auth/sign-up', { name, email, password })
  if (res.status !== 201) throw new Error(`sign-up of ${email} failed with ${res.status}: ${JSON.stringify(res.body)}`)
  return c
}
