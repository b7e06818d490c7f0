// Mail end to end: the real server writes the outbox, sends over SMTP to the local mail catcher
// (maildev, started by scripts/test.sh), and we read the catcher's inbox over its REST API.
import { createHash } from 'node:crypto'
import pg from 'pg'
import { SMTPServer } from 'smtp-server'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { ApiClient, demoEmail, signIn } from '../support/api-client'
import { inbox, sentTo, until, waitForMail } from '../support/mail'
import { freePort, startServer } from '../support/test-server'

const unique = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`

function linkToken(text: string) {
  const match = text.match(/\/set-password\?token=([A-Za-z0-9_-]+)/)
  if (!match) throw new Error(`no set-password link in:\n${text}`)
  return match[1]!
}

async function withDb<T>(url: string, run: (client: pg.Client) => Promise<T>) {
  const client = new pg.Client({ connectionString: url })
  await client.connect()
  try { return await run(client) }
  finally { await client.end() }
}

async function invite(admin: ApiClient, name = 'Invited Person') {
  const email = `invitee.${unique()}@eddyledger.test`
  const res = await admin.post('/api/users', { email, name, role: 'engineer' })
  expect(res.status).toBe(201)
  const [mail] = await waitForMail(m => sentTo(m, email) && /set a password/i.test(m.subject))
  return { email, user: res.body.user as { id: number }, mail: mail! }
}

describe('invitations', () => {
  let admin: ApiClient
  beforeAll(async () => { admin = await signIn('admin') })

  it('mails a new user a link that sets the password once, then refuses it', async () => {
    const { email, mail } = await invite(admin, 'Noor Haddad')
    expect(mail.text).toContain('Noor Haddad')
    expect(mail.text).toMatch(/expires in 72 hours/)
    expect(mail.text).toMatch(/order-of-magnitude/)
    const token = linkToken(mail.text)
    expect(mail.text).toContain(`${inject('baseUrl')}/set-password?token=${token}`)

    const first = new ApiClient()
    const set = await first.post('/api/auth/password/set', { token, password: 'a-new-password-1' })
    expect(set.status).toBe(200)
    expect(set.body.user.email).toBe(email)
    // Setting the password signs the person in.
    expect((await first.get('/api/auth/me')).body.user.email).toBe(email)

    const again = await new ApiClient().post('/api/auth/password/set', { token, password: 'another-password-2' })
    expect(again.status).toBe(400)
    expect(again.body.message).toBe('This link has expired or was already used')
    // The first password stands; the second attempt changed nothing.
    expect((await new ApiClient().post('/api/auth/login', { email, password: 'a-new-password-1' })).status).toBe(200)
    expect((await new ApiClient().post('/api/auth/login', { email, password: 'another-password-2' })).status).toBe(401)
  })

  it('stores only a hash of the token, and refuses an expired link', async () => {
    const { mail } = await invite(admin)
    const token = linkToken(mail.text)
    const hash = createHash('sha256').update(token).digest('hex')
    await withDb(inject('databaseUrl'), async (db) => {
      expect((await db.query('SELECT count(*)::int AS n FROM user_tokens WHERE token_hash = $1', [token])).rows[0].n).toBe(0)
      const { rows } = await db.query(
        `UPDATE user_tokens SET expires_at = now() - interval '1 minute' WHERE token_hash = $1 RETURNING purpose`, [hash])
      expect(rows).toEqual([{ purpose: 'invite' }])
    })
    const res = await new ApiClient().post('/api/auth/password/set', { token, password: 'a-new-password-1' })
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/expired or was already used/)
  })

  it('answers a short password and a mangled token with 400 and field messages', async () => {
    const res = await new ApiClient().post('/api/auth/password/set', { token: 'short', password: 'tiny' })
    expect(res.status).toBe(400)
    expect(res.body.data.fieldErrors.password[0]).toMatch(/at least 10 characters/)
    expect(res.body.data.fieldErrors.token[0]).toMatch(/not complete/)
    const unknown = await new ApiClient().post('/api/auth/password/set', { token: 'x'.repeat(43), password: 'long-enough-pass' })
    expect(unknown.status).toBe(400)
    expect(unknown.body.message).toMatch(/expired or was already used/)
  })

  it('sends a fresh invitation on request, voids the earlier link, and refuses once a password is set', async () => {
    const { email, user, mail: first } = await invite(admin, 'Ines Carvalho')
    const listed = (await admin.get('/api/users')).body.users.find((u: { id: number }) => u.id === user.id)
    expect(listed.awaitingPassword).toBe(true)
    const engineer = await signIn('engineer')
    expect((await engineer.post(`/api/users/${user.id}/invitation`)).status).toBe(403)

    const resent = await admin.post(`/api/users/${user.id}/invitation`)
    expect(resent.status).toBe(200)
    expect(resent.body.sent.email).toBe(email)
    const mails = await waitForMail(m => sentTo(m, email) && /set a password/i.test(m.subject), { count: 2 })
    const second = mails.find(m => linkToken(m.text) !== linkToken(first.text))!
    expect(second).toBeDefined()

    const old = await new ApiClient().post('/api/auth/password/set', { token: linkToken(first.text), password: 'first-link-password' })
    expect(old.status).toBe(400)
    expect((await new ApiClient().post('/api/auth/password/set', { token: linkToken(second.text), password: 'second-link-password' })).status).toBe(200)
    expect((await admin.get('/api/users')).body.users.find((u: { id: number }) => u.id === user.id).awaitingPassword).toBe(false)

    const refused = await admin.post(`/api/users/${user.id}/invitation`)
    expect(refused.status).toBe(409)
    expect(refused.body.message).toMatch(/already set a password/)
    expect((await admin.post('/api/users/999999/invitation')).status).toBe(404)
    expect((await admin.post('/api/users/abc/invitation')).status).toBe(400)
  })

  it('refuses a weak or common password with the reason, and keeps the link usable', async () => {
    const { mail } = await invite(admin, 'Lena Voss')
    const token = linkToken(mail.text)
    const cases: [string, RegExp][] = [
      ['aaaaaaaaaa', /repeated character/],
      ['password12', /commonly used password/],
      ['qwertyuiop', /most used passwords/],
      ['abcdefghij', /sequence/],
      ['eddyledger2026', /your name, your e-mail address or the name of this product/],
    ]
    for (const [password, reason] of cases) {
      const res = await new ApiClient().post('/api/auth/password/set', { token, password })
      expect(res.status, password).toBe(400)
      expect(res.body.message, password).toMatch(/too easy to guess/)
      expect(res.body.data.fieldErrors.password[0], password).toMatch(reason)
    }
    // None of the refusals used up the link.
    expect((await new ApiClient().post('/api/auth/password/set', { token, password: 'tidal-basin-lantern-42' })).status).toBe(200)
  })

  it('sends an invitation again at most 3 times an hour per person, then answers 429 with Retry-After', async () => {
    const { user } = await invite(admin)
    const statuses: number[] = []
    for (let i = 0; i < 4; i++) statuses.push((await admin.post(`/api/users/${user.id}/invitation`)).status)
    expect(statuses).toEqual([200, 200, 200, 429])
    const limited = await admin.post(`/api/users/${user.id}/invitation`)
    expect(limited.status).toBe(429)
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(50 * 60)
    expect(limited.body.message).toMatch(/too many invitations sent to this person\. try again in \d+ minutes/i)
    // Another person's invitation is not held up.
    const other = await invite(admin)
    expect((await admin.post(`/api/users/${other.user.id}/invitation`)).status).toBe(200)
  })

  it('lets one of two simultaneous uses of a link win', async () => {
    const { mail } = await invite(admin)
    const token = linkToken(mail.text)
    const results = await Promise.all([1, 2, 3].map(i =>
      new ApiClient().post('/api/auth/password/set', { token, password: `racing-password-${i}` })))
    expect(results.map(r => r.status).sort()).toEqual([200, 400, 400])
  })
})

describe('forgotten password', () => {
  let admin: ApiClient
  beforeAll(async () => { admin = await signIn('admin') })

  it('answers a known and an unknown address alike, and mails only the known one', async () => {
    const { email: known, mail: invitation } = await invite(admin, 'Lena Voss')
    expect((await new ApiClient().post('/api/auth/password/set', { token: linkToken(invitation.text), password: 'first-password-1' })).status).toBe(200)
    const unknown = `nobody.${unique()}@eddyledger.test`

    const a = await new ApiClient().post('/api/auth/password/forgot', { email: known })
    const b = await new ApiClient().post('/api/auth/password/forgot', { email: unknown })
    expect(a.status).toBe(200)
    expect(b.status).toBe(200)
    expect(a.body).toEqual(b.body)
    expect(a.body.message).toMatch(/if the address belongs to an active account/i)

    const [reset] = await waitForMail(m => sentTo(m, known) && /reset your eddyledger password/i.test(m.subject))
    expect(reset!.text).toMatch(/expires in 1 hour/)
    expect((await inbox()).filter(m => sentTo(m, unknown))).toEqual([])
    const outbox = (await admin.get('/api/admin/mail')).body.mail as { toAddress: string }[]
    expect(outbox.some(r => r.toAddress === unknown)).toBe(false)

    const set = await new ApiClient().post('/api/auth/password/set', { token: linkToken(reset!.text), password: 'second-password-2' })
    expect(set.status).toBe(200)
    expect((await new ApiClient().post('/api/auth/login', { email: known, password: 'second-password-2' })).status).toBe(200)
    expect((await new ApiClient().post('/api/auth/login', { email: known, password: 'first-password-1' })).status).toBe(401)
  })

  it('voids the older open links of a user once one of them is used', async () => {
    const { email, mail: invitation } = await invite(admin)
    expect((await new ApiClient().post('/api/auth/password/forgot', { email })).status).toBe(200)
    const [reset] = await waitForMail(m => sentTo(m, email) && /reset/i.test(m.subject))
    expect((await new ApiClient().post('/api/auth/password/set', { token: linkToken(reset!.text), password: 'reset-password-1' })).status).toBe(200)
    const old = await new ApiClient().post('/api/auth/password/set', { token: linkToken(invitation.text), password: 'invite-password-2' })
    expect(old.status).toBe(400)
  })

  it('limits reset requests per address without locking the account out of signing in', async () => {
    const { email, mail } = await invite(admin)
    expect((await new ApiClient().post('/api/auth/password/set', { token: linkToken(mail.text), password: 'steady-password-1' })).status).toBe(200)
    const statuses: number[] = []
    for (let i = 0; i < 6; i++) {
      statuses.push((await new ApiClient().post('/api/auth/password/forgot', { email })).status)
    }
    expect(statuses).toEqual([200, 200, 200, 200, 200, 429])
    const limited = await new ApiClient().post('/api/auth/password/forgot', { email })
    expect(limited.body.message).toMatch(/too many password reset requests/i)
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(60)
    expect((await new ApiClient().post('/api/auth/login', { email, password: 'steady-password-1' })).status).toBe(200)
  })

  it('a new password ends every session signed in with the old one', async () => {
    const { email, mail } = await invite(admin)
    const first = new ApiClient()
    expect((await first.post('/api/auth/password/set', { token: linkToken(mail.text), password: 'old-harbour-pass-1' })).status).toBe(200)
    const second = new ApiClient()
    await second.login(email, 'old-harbour-pass-1')
    const stolen = new ApiClient()
    stolen.cookie = second.cookie
    expect((await stolen.get('/api/auth/me')).status).toBe(200)

    expect((await new ApiClient().post('/api/auth/password/forgot', { email })).status).toBe(200)
    const [reset] = await waitForMail(m => sentTo(m, email) && /reset/i.test(m.subject))
    const resetter = new ApiClient()
    expect((await resetter.post('/api/auth/password/set', { token: linkToken(reset!.text), password: 'new-harbour-pass-2' })).status).toBe(200)

    for (const old of [first, second, stolen]) expect((await old.get('/api/auth/me')).status).toBe(401)
    expect((await resetter.get('/api/auth/me')).body.user.email).toBe(email)
  })

  it('answers a malformed address with 400', async () => {
    const res = await new ApiClient().post('/api/auth/password/forgot', { email: 'not-an-address' })
    expect(res.status).toBe(400)
    expect(res.body.data.fieldErrors.email[0]).toMatch(/valid e-mail/i)
  })
})

describe('the outbox for admins', () => {
  it('lists messages without their bodies, filters by status, and refuses everyone else', async () => {
    const admin = await signIn('admin')
    const { email } = await invite(admin)
    const sent = await until('the invitation marked sent', async () => {
      const rows = (await admin.get('/api/admin/mail?status=sent')).body.mail as any[]
      return rows.find(r => r.toAddress === email)
    })
    expect(sent).toMatchObject({ kind: 'invite', status: 'sent', attempts: 1, lastError: null })
    expect(sent).not.toHaveProperty('text')
    expect(sent.sentAt).toBeTruthy()
    const failedOnly = (await admin.get('/api/admin/mail?status=failed')).body.mail as any[]
    expect(failedOnly.every(r => r.status === 'failed')).toBe(true)

    expect((await admin.post(`/api/admin/mail/${sent.id}/retry`)).status).toBe(409)
    expect((await admin.post('/api/admin/mail/999999/retry')).status).toBe(404)
    const bad = await admin.get('/api/admin/mail?status=lost&page=0')
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.data.fieldErrors).sort()).toEqual(['page', 'status'])

    for (const role of ['engineer', 'reviewer', 'auditor', 'lead']) {
      const client = await signIn(role)
      expect((await client.get('/api/admin/mail')).status, role).toBe(403)
      expect((await client.post(`/api/admin/mail/${sent.id}/retry`)).status, role).toBe(403)
    }
  })
})

describe('when the SMTP server is unreachable', () => {
  const database = 'eddyledger_mail_down'
  let down: Awaited<ReturnType<typeof startServer>> | undefined
  let restarted: Awaited<ReturnType<typeof startServer>> | undefined
  afterAll(async () => {
    await down?.stop()
    await restarted?.stop()
  })

  it('keeps the action and the message, shows the failure to admins, and delivers after a restart', async () => {
    // Nothing listens on a port we just found free.
    down = await startServer({ database, port: await freePort(), env: { NUXT_SMTP_PORT: String(await freePort()) } })
    const admin = new ApiClient(down.url)
    await admin.login(demoEmail('admin'))
    const email = `offline.${unique()}@eddyledger.test`
    const created = await admin.post('/api/users', { email, name: 'Offline Invitee', role: 'reviewer' })
    expect(created.status).toBe(201)
    expect(((await admin.get('/api/users')).body.users as { email: string }[]).map(u => u.email)).toContain(email)

    const row = await until('a failed attempt on the invitation', async () => {
      const rows = (await admin.get('/api/admin/mail')).body.mail as any[]
      return rows.find(r => r.toAddress === email && r.attempts >= 1)
    })
    expect(row.status).toBe('pending')
    expect(row.lastError).toMatch(/ECONNREFUSED|connect/i)
    // The next attempt waits (30 s backoff) instead of hammering the server.
    expect(new Date(row.nextAttemptAt).getTime()).toBeGreaterThan(Date.now() + 10_000)
    const early = await admin.post(`/api/admin/mail/${row.id}/retry`)
    expect(early.status).toBe(409)
    expect(early.body.message).toMatch(/retried on its own/)

    // After the last attempt a row is 'failed' until an admin retries it; age it that far directly.
    await withDb(down.databaseUrl, db => db.query(`UPDATE mail_outbox SET status = 'failed', attempts = 8 WHERE id = $1`, [row.id]))
    const failed = (await admin.get('/api/admin/mail?status=failed')).body.mail as any[]
    expect(failed.map(r => r.id)).toContain(row.id)
    const retry = await admin.post(`/api/admin/mail/${row.id}/retry`)
    expect(retry.status).toBe(200)
    expect(retry.body.mail).toEqual({ id: row.id, status: 'pending' })
    const retried = await until('the admin retry to be attempted', async () => {
      const rows = (await admin.get('/api/admin/mail')).body.mail as any[]
      return rows.find(r => r.id === row.id && r.attempts === 1)
    })
    expect(retried.status).toBe('pending')
    expect(retried.lastError).toMatch(/ECONNREFUSED|connect/i)
    expect((await inbox()).filter(m => sentTo(m, email))).toEqual([])

    // The same data under a server that can reach the mail catcher: the periodic round sends it.
    const dataUrl = down.databaseUrl
    await down.stop()
    down = undefined
    // Skip the backoff wait rather than sleep through it.
    await withDb(dataUrl, db => db.query(`UPDATE mail_outbox SET next_attempt_at = now() WHERE id = $1`, [row.id]))
    restarted = await startServer({ database, port: await freePort(), keepDatabase: true })
    const [delivered] = await waitForMail(m => sentTo(m, email), { timeout: 25_000 })
    expect(delivered!.subject).toMatch(/set a password/i)
    const again = new ApiClient(restarted.url)
    await again.login(demoEmail('admin'))
    const final = ((await again.get('/api/admin/mail')).body.mail as any[]).find(r => r.id === row.id)
    expect(final).toMatchObject({ status: 'sent', attempts: 2 })
  }, 90_000)
})

describe('two server processes on one database', () => {
  const servers: Awaited<ReturnType<typeof startServer>>[] = []
  afterAll(async () => { await Promise.all(servers.map(s => s.stop())) })

  it('send each queued message exactly once', async () => {
    const database = 'eddyledger_mail_pair'
    servers.push(await startServer({ database, port: await freePort() }))
    servers.push(await startServer({ database, port: await freePort(), keepDatabase: true }))
    const batch = unique()
    const count = 60
    // Due messages written straight into the outbox, plus one failed message per server whose
    // retry makes both servers start a delivery round at the same moment.
    const failedIds = await withDb(servers[0]!.databaseUrl, async (db) => {
      await db.query(`
        INSERT INTO mail_outbox (to_address, subject, text, kind)
        SELECT 'pair.' || n || '@eddyledger.test', $1 || ' #' || n, 'Delivery check.', 'invite'
        FROM generate_series(1, ${count}) n`, [`Pair ${batch}`])
      const { rows } = await db.query(`
        INSERT INTO mail_outbox (to_address, subject, text, kind, status, attempts)
        VALUES ('pair.a@eddyledger.test', $1, 'Retry check.', 'invite', 'failed', 8),
               ('pair.b@eddyledger.test', $2, 'Retry check.', 'invite', 'failed', 8)
        RETURNING id`, [`Pair ${batch} retry a`, `Pair ${batch} retry b`])
      return rows.map(r => r.id as number)
    })
    const admins = await Promise.all(servers.map(async (s) => {
      const c = new ApiClient(s.url)
      await c.login(demoEmail('admin'))
      return c
    }))
    const retries = await Promise.all(admins.map((c, i) => c.post(`/api/admin/mail/${failedIds[i]}/retry`)))
    expect(retries.map(r => r.status)).toEqual([200, 200])

    const mails = await waitForMail(m => m.subject.startsWith(`Pair ${batch}`), { count: count + 2, timeout: 25_000 })
    await new Promise(r => setTimeout(r, 1500))
    const subjects = (await inbox()).filter(m => m.subject.startsWith(`Pair ${batch}`)).map(m => m.subject)
    expect(mails.length).toBeGreaterThanOrEqual(count + 2)
    expect(subjects.length).toBe(count + 2)
    expect(new Set(subjects).size).toBe(count + 2)
    const states = await withDb(servers[0]!.databaseUrl, db => db.query(
      `SELECT status, attempts, count(*)::int AS n FROM mail_outbox WHERE subject LIKE $1 GROUP BY 1, 2`, [`Pair ${batch}%`]))
    expect(states.rows).toEqual([{ status: 'sent', attempts: 1, n: count + 2 }])
  }, 90_000)
})

describe('two server processes and a slow relay', () => {
  const servers: Awaited<ReturnType<typeof startServer>>[] = []
  let relay: SMTPServer | undefined
  afterAll(async () => {
    await Promise.all(servers.map(s => s.stop()))
    await new Promise<void>(resolve => (relay ? relay.close(() => resolve()) : resolve()))
  })

  it('send each message once although every send outlasts the lease', async () => {
    // A relay that takes 2.5 s to accept each message, against a 1 s lease: each send must keep
    // renewing its lease, or the other process would claim the message and send it again.
    const ANSWER_DELAY_MS = 2500
    const received: string[] = []
    relay = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData(stream, _session, callback) {
        let raw = ''
        stream.on('data', (chunk: Buffer) => { raw += chunk.toString('utf8') })
        stream.on('end', () => {
          received.push(raw.match(/^Subject: (.*)$/m)?.[1]?.trim() ?? '?')
          setTimeout(() => callback(), ANSWER_DELAY_MS)
        })
      },
    })
    const relayPort = await freePort()
    await new Promise<void>(resolve => relay!.listen(relayPort, '127.0.0.1', () => resolve()))

    const database = 'eddyledger_mail_slow'
    const env = { NUXT_SMTP_PORT: String(relayPort), NUXT_MAIL_LEASE_SECONDS: '1' }
    servers.push(await startServer({ database, port: await freePort(), env }))
    servers.push(await startServer({ database, port: await freePort(), env, keepDatabase: true }))
    const batch = unique()
    const count = 8
    // Due messages written straight into the outbox, and one failed message per server whose retry
    // starts a delivery round on both at the same moment.
    const failedIds = await withDb(servers[0]!.databaseUrl, async (db) => {
      await db.query(`
        INSERT INTO mail_outbox (to_address, subject, text, kind)
        SELECT 'slow.' || n || '@eddyledger.test', $1 || ' #' || n, 'Delivery check.', 'invite'
        FROM generate_series(1, ${count}) n`, [`Slow ${batch}`])
      const { rows } = await db.query(`
        INSERT INTO mail_outbox (to_address, subject, text, kind, status, attempts)
        VALUES ('slow.a@eddyledger.test', $1, 'Retry check.', 'invite', 'failed', 8),
               ('slow.b@eddyledger.test', $2, 'Retry check.', 'invite', 'failed', 8)
        RETURNING id`, [`Slow ${batch} retry a`, `Slow ${batch} retry b`])
      return rows.map(r => r.id as number)
    })
    const admins = await Promise.all(servers.map(async (server) => {
      const c = new ApiClient(server.url)
      await c.login(demoEmail('admin'))
      return c
    }))
    const retries = await Promise.all(admins.map((c, i) => c.post(`/api/admin/mail/${failedIds[i]}/retry`)))
    expect(retries.map(r => r.status)).toEqual([200, 200])

    const total = count + 2
    const mine = () => received.filter(subject => subject.startsWith(`Slow ${batch}`))
    await until('every message at the relay', async () => (mine().length >= total ? true : undefined), 60_000)
    // Several leases' time more for a second copy to show up, were one on its way.
    await new Promise(r => setTimeout(r, ANSWER_DELAY_MS + 3000))
    expect(mine().length).toBe(total)
    expect(new Set(mine()).size).toBe(total)
    const states = await until('every message marked sent', async () => {
      const { rows } = await withDb(servers[0]!.databaseUrl, db => db.query(
        `SELECT status, attempts, count(*)::int AS n FROM mail_outbox WHERE subject LIKE $1 GROUP BY 1, 2`, [`Slow ${batch}%`]))
      return rows.length === 1 && rows[0].status === 'sent' ? rows : undefined
    })
    expect(states).toEqual([{ status: 'sent', attempts: 1, n: total }])
  }, 120_000)
})

describe('review notices', () => {
  const CASE = {
    // Our own demo case (KB-101): a 38 m ferry hull in water at 6.2 m/s.
    regime: 'external',
    fluid: { medium: 'water', temperatureK: 288 },
    velocity: 6.2,
    length: 38,
    geometry: 'streamlined',
    separation: 'mild',
    quantities: ['forces'],
    budget: { coreHours: 50_000, cores: 256, wallClockHours: 72 },
  }
  let projects: Record<string, number>
  const clients: Record<string, ApiClient> = {}

  beforeAll(async () => {
    for (const key of ['engineer', 'engineer2', 'reviewer', 'reviewer2']) clients[key] = await signIn(key)
    const list = (await clients.reviewer!.get('/api/projects')).body.projects as { id: number; code: string }[]
    projects = Object.fromEntries(list.map(p => [p.code, p.id]))
  })

  async function submitted(code: string, author = 'engineer') {
    const title = `Notice check ${unique()}`
    const created = await clients[author]!.post(`/api/projects/${projects[code]}/decisions`, { title, caseInput: CASE })
    expect(created.status).toBe(201)
    const res = await clients[author]!.post(`/api/decisions/${created.body.decision.id}/submit`, { version: created.body.decision.version })
    expect(res.status).toBe(200)
    return { title, decision: res.body.decision as { id: number; version: number } }
  }

  it('tells every reviewer of the project, and nobody else, that a review is requested', async () => {
    const { title, decision } = await submitted('KB-102')
    const mails = await waitForMail(m => m.subject.includes(title), { count: 2 })
    const recipients = mails.flatMap(m => m.to.map(t => t.address)).sort()
    expect(recipients).toEqual([demoEmail('reviewer'), demoEmail('reviewer2')].sort())
    expect(mails[0]!.subject).toBe(`[KB-102] Review requested: ${title}`)
    expect(mails[0]!.text).toContain(`${inject('baseUrl')}/decisions/${decision.id}`)
    expect(mails[0]!.text).toMatch(/order-of-magnitude/)

    // KB-101 has one reviewer member; the other reviewer is not told.
    const one = await submitted('KB-101')
    const [single] = await waitForMail(m => m.subject.includes(one.title))
    await new Promise(r => setTimeout(r, 500))
    expect((await inbox()).filter(m => m.subject.includes(one.title)).length).toBe(1)
    expect(single!.to.map(t => t.address)).toEqual([demoEmail('reviewer')])

    // A reviewer's own decision: the other reviewers are told, not the author.
    const own = await submitted('KB-102', 'reviewer')
    const [toOther] = await waitForMail(m => m.subject.includes(own.title))
    await new Promise(r => setTimeout(r, 500))
    expect((await inbox()).filter(m => m.subject.includes(own.title)).length).toBe(1)
    expect(toOther!.to.map(t => t.address)).toEqual([demoEmail('reviewer2')])
  })

  it('gives the reviewers the case as the engineer typed it, in its units', async () => {
    // The KB-101 ferry hull in imperial units: 59 °F water, 24 ft/s, 98 ft (our own scenario).
    const entered = {
      regime: 'external', geometry: 'streamlined', separation: 'mild', quantities: ['forces'],
      fluid: { medium: 'water', temperature: { value: 59, unit: 'degF' }, pressure: { unit: 'psi' }, density: { unit: 'lb/ft3' }, viscosity: { unit: 'cP' } },
      velocity: { value: 24, unit: 'ft/s' }, length: { value: 98, unit: 'ft' }, roughness: { unit: 'in' },
      turbulenceIntensityPercent: 1, budget: { coreHours: 50_000, cores: 256, wallClockHours: 72 }, growthRatio: 1.2,
    }
    const title = `Imperial notice ${unique()}`
    const created = await clients.engineer!.post(`/api/projects/${projects['KB-101']}/decisions`, { title, entered, unitSystem: 'imperial' })
    expect(created.status, JSON.stringify(created.body)).toBe(201)
    expect((await clients.engineer!.post(`/api/decisions/${created.body.decision.id}/submit`, { version: created.body.decision.version })).status).toBe(200)
    const [mail] = await waitForMail(m => m.subject.includes(title))
    expect(mail!.text).toContain('The case, as typed (Imperial units):')
    expect(mail!.text).toContain('Free-stream velocity: 24\u202fft/s')
    expect(mail!.text).toContain('Temperature: 59\u202f°F')
    expect(mail!.text).not.toContain('m/s')
  })

  it('tells the author of an approval, an override and a request for changes, with the comment', async () => {
    const approved = await submitted('KB-102', 'engineer2')
    expect((await clients.reviewer!.post(`/api/decisions/${approved.decision.id}/approve`,
      { version: approved.decision.version, comment: 'Agreed: the wall functions suit this hull.' })).status).toBe(200)
    const [a] = await waitForMail(m => m.subject === `[KB-102] Approved: ${approved.title}`)
    expect(a!.to.map(t => t.address)).toEqual([demoEmail('engineer2')])
    expect(a!.text).toContain('Agreed: the wall functions suit this hull.')

    const overridden = await submitted('KB-102')
    const override = await clients.reviewer2!.post(`/api/decisions/${overridden.decision.id}/override`, {
      version: overridden.decision.version, approach: 'rans', model: 'k-omega SST', wallTreatment: 'resolved', yPlusTarget: 1,
      comment: 'Resolve the wall: the separation near the stern matters here.',
    })
    expect(override.status, JSON.stringify(override.body)).toBe(200)
    const [o] = await waitForMail(m => m.subject.startsWith('[KB-102] Overridden') && m.subject.endsWith(overridden.title))
    expect(o!.to.map(t => t.address)).toEqual([demoEmail('engineer')])
    expect(o!.text).toContain('Resolve the wall: the separation near the stern matters here.')
    expect(o!.text).toMatch(/reviewer's choice: .*k-omega SST/i)

    const changes = await submitted('KB-103')
    expect((await clients.reviewer!.post(`/api/decisions/${changes.decision.id}/request-changes`,
      { version: changes.decision.version, comment: 'Give the roughness of the condenser fins, please.' })).status).toBe(200)
    const [c] = await waitForMail(m => m.subject === `[KB-103] Changes requested: ${changes.title}`)
    expect(c!.to.map(t => t.address)).toEqual([demoEmail('engineer')])
    expect(c!.text).toContain('Give the roughness of the condenser fins, please.')
  })
})
