import { createServer, type Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest'
import { createApp, createRouter, defineEventHandler, toNodeListener, useSession, type SessionConfig } from 'h3'

// Opened sessions are kept by cookie (server/utils/auth/unsealed-sessions.ts): checked through h3's
// real sessions over HTTP, with the WebCrypto calls counted to see when a cookie is really unsealed.
const MAX_AGE_S = 60
vi.stubGlobal('useRuntimeConfig', () => ({ session: { name: 'nuxt-session', maxAge: MAX_AGE_S } }))
const { keepOpenedSession, reuseOpenedSession, sealedSessionOf } = await import('../../../../../server/utils/auth/unsealed-sessions')

let derivations = 0
const countingCrypto = {
  getRandomValues: <T extends ArrayBufferView | null>(array: T) => globalThis.crypto.getRandomValues(array),
  randomUUID: () => globalThis.crypto.randomUUID(),
  subtle: new Proxy(globalThis.crypto.subtle, {
    get(target, key) {
      const value = Reflect.get(target, key)
      if (key === 'deriveBits') return (...args: Parameters<SubtleCrypto['deriveBits']>) => (derivations++, target.deriveBits(...args))
      return typeof value === 'function' ? value.bind(target) : value
    },
  }),
} as unknown as Crypto

const config: SessionConfig = { name: 'nuxt-session', password: 'p'.repeat(40), maxAge: MAX_AGE_S, crypto: countingCrypto }

let server: Server
let base = ''
beforeAll(async () => {
  const router = createRouter()
    .post('/sign-in', defineEventHandler(async (event) => {
      const session = await useSession(event, config)
      await session.update({ user: { id: 7, role: 'engineer' } })
      return { id: session.id }
    }))
    // What requireUser does around its read of the session.
    .get('/me', defineEventHandler(async (event) => {
      const sealed = sealedSessionOf(event)
      const reused = reuseOpenedSession(event, sealed)
      const session = await useSession(event, config)
      if (!session.data.user) return { user: null, reused }
      if (!reused) keepOpenedSession(event, sealed)
      return { id: session.id, user: session.data.user, reused }
    }))
    // A request that changes its own session must not change what the old cookie opens to.
    .post('/rename', defineEventHandler(async (event) => {
      const sealed = sealedSessionOf(event)
      const reused = reuseOpenedSession(event, sealed)
      const session = await useSession(event, config)
      if (!reused) keepOpenedSession(event, sealed)
      await session.update({ user: { id: 7, role: 'reviewer' } })
      return { reused }
    }))
  server = createServer(toNodeListener(createApp().use(router)))
  await new Promise<void>(resolve => server.listen(0, '127.0.0.1', resolve))
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
})
afterAll(() => new Promise<void>(resolve => server.close(() => resolve())))
afterEach(() => vi.useRealTimers())

async function signIn() {
  const res = await fetch(`${base}/sign-in`, { method: 'POST' })
  return res.headers.getSetCookie()[0]!.split(';')[0]!
}
const me = async (cookie: string) => (await fetch(`${base}/me`, { headers: { cookie } })).json()

describe('sessions opened once per cookie', () => {
  it('unseals a cookie the first time only, and gives back the same session after', async () => {
    const cookie = await signIn()
    derivations = 0
    const first = await me(cookie)
    const unsealCost = derivations
    expect(first).toMatchObject({ user: { id: 7, role: 'engineer' }, reused: false })
    expect(unsealCost).toBeGreaterThan(0)
    const again = await me(cookie)
    expect(again).toEqual({ ...first, reused: true })
    expect(derivations).toBe(unsealCost)
  })

  it('keeps what the cookie opened to when a request updates its own session', async () => {
    const cookie = await signIn()
    await me(cookie)
    expect(await (await fetch(`${base}/rename`, { method: 'POST', headers: { cookie } })).json()).toEqual({ reused: true })
    expect(await me(cookie)).toMatchObject({ user: { role: 'engineer' }, reused: true })
  })

  it('stops reusing a session once it is older than the maximum age', async () => {
    const cookie = await signIn()
    await me(cookie)
    vi.useFakeTimers({ toFake: ['Date'], now: Date.now() + (MAX_AGE_S + 1) * 1000 })
    // Neither the kept copy nor h3's own unseal accepts it any more.
    expect(await me(cookie)).toEqual({ user: null, reused: false })
  })

  it('never keeps a cookie that did not open', async () => {
    const forged = 'nuxt-session=Fe26.2**forged*iv*data*9999999999999*salt*mac'
    expect(await me(forged)).toEqual({ user: null, reused: false })
    expect(await me(forged)).toEqual({ user: null, reused: false })
  })
})
