// A small cookie-keeping HTTP client for the API tests: real requests to the real server.
import { inject } from 'vitest'
import { DEMO_PASSWORD } from './test-server'

import { randomInt } from 'node:crypto'

export type ApiResponse<T = any> = { status: number; body: T; headers: Headers }

// A random block per test file, so that files never share a limiter address.
const block = [randomInt(1, 255), randomInt(0, 255)]
let clientCounter = 0

export class ApiClient {
  cookie = ''
  // Each client is its own "address" for the login limiter (the test server trusts X-Forwarded-For).
  readonly address = `10.${block[0]}.${(block[1]! + Math.floor(clientCounter / 250)) % 256}.${(clientCounter++ % 250) + 1}`

  constructor(readonly baseUrl: string = inject('baseUrl')) {}

  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<ApiResponse<T>> {
    const res = await fetch(this.baseUrl + path, {
      method,
      headers: {
        accept: 'application/json',
        'x-forwarded-for': this.address,
        // As a browser does for a write from our own pages (the server refuses other origins).
        ...(method !== 'GET' && method !== 'HEAD' ? { origin: this.baseUrl } : {}),
        ...(body !== undefined ? { 'content-type': 'application/json' } : {}),
        ...(this.cookie ? { cookie: this.cookie } : {}),
        ...headers,
      },
      body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
    })
    const setCookies = res.headers.getSetCookie()
    if (setCookies.length) this.cookie = setCookies.map(c => c.split(';')[0]).join('; ')
    const text = await res.text()
    let parsed: unknown = text
    try { parsed = text ? JSON.parse(text) : null } catch { /* not JSON */ }
    return { status: res.status, body: parsed as T, headers: res.headers }
  }

  get<T = any>(path: string) { return this.request<T>('GET', path) }
  post<T = any>(path: string, body?: unknown) { return this.request<T>('POST', path, body ?? {}) }
  put<T = any>(path: string, body?: unknown) { return this.request<T>('PUT', path, body ?? {}) }
  patch<T = any>(path: string, body?: unknown) { return this.request<T>('PATCH', path, body ?? {}) }
  delete<T = any>(path: string) { return this.request<T>('DELETE', path) }

  async login(email: string, password = DEMO_PASSWORD) {
    const res = await this.post('/api/auth/login', { email, password })
    if (res.status !== 200) throw new Error(`login ${email} failed: ${res.status} ${JSON.stringify(res.body)}`)
    return res
  }
}

export const demoEmail = (key: string) => `${key}@eddyledger.test`

/** A signed-in client for a demo account: signIn('reviewer'). */
export async function signIn(key: string) {
  const client = new ApiClient()
  await client.login(demoEmail(key))
  return client
}
