// The built app (.output, or .output-<slot>) started on a database for the benchmark, and a
// signed-in client of it. Relative imports only: run under plain Node by tsx.
import { spawn } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import { readFileSync } from 'node:fs'
import { createServer } from 'node:net'
import { serverNodeArgs } from '../../scripts/lib/server-node'

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer()
    server.once('error', reject)
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number }
      server.close(() => resolve(port))
    })
  })
}

export type RunningServer = Awaited<ReturnType<typeof startApp>>

export async function startApp(databaseUrl: string, env: Record<string, string> = {}) {
  const port = await freePort()
  const base = `http://127.0.0.1:${port}`
  // As deployed (scripts/lib/server-node.ts); BENCH_NODE_ARGS adds options, e.g. '--cpu-prof --cpu-prof-dir=/tmp/profiles'.
  const nodeArgs = [...serverNodeArgs(), ...(process.env.BENCH_NODE_ARGS?.split(/\s+/).filter(Boolean) ?? [])]
  const child = spawn(process.execPath, [...nodeArgs, `${process.env.EDDY_OUTPUT_DIR || '.output'}/server/index.mjs`], {
    stdio: ['ignore', 'ignore', 'inherit'],
    env: {
      ...process.env,
      HOST: '127.0.0.1',
      PORT: String(port),
      NUXT_DATABASE_URL: databaseUrl,
      NUXT_APP_URL: base,
      NUXT_SESSION_PASSWORD: process.env.NUXT_SESSION_PASSWORD || randomBytes(32).toString('hex'),
      // No mail leaves the benchmark: the outbox points at a closed port.
      NUXT_SMTP_PORT: '9',
      ...env,
    },
  })
  const deadline = Date.now() + 60_000
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the app exited with ${child.exitCode}`)
    try {
      if ((await fetch(`${base}/login`)).ok) break
    } catch { /* not listening yet */ }
    if (Date.now() > deadline) throw new Error('the app did not start within 60 s')
    await new Promise(r => setTimeout(r, 200))
  }
  return {
    base,
    pid: child.pid!,
    /** Resident memory of the server process, in MB (Linux). */
    rssMb() {
      const line = readFileSync(`/proc/${child.pid}/status`, 'utf8').split('\n').find(l => l.startsWith('VmRSS:'))
      return Number(line?.match(/(\d+)/)?.[1] ?? 0) / 1024
    },
    stop: () => new Promise<void>((resolve) => {
      if (child.exitCode !== null) return resolve()
      child.once('exit', () => resolve())
      child.kill('SIGTERM')
    }),
  }
}

/** A demo account signed in to the app: its cookie and a GET that fails loudly. */
export async function signedIn(base: string, key: string) {
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base },
    body: JSON.stringify({ email: `${key}@eddyledger.test`, password: process.env.DEMO_PASSWORD || 'ledger-demo-2026' }),
  })
  if (res.status !== 200) throw new Error(`sign-in of ${key} failed: ${res.status} ${await res.text()}`)
  const cookie = res.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
  const headers = { cookie, accept: 'application/json', origin: base }
  return {
    cookie,
    headers,
    async get<T = any>(path: string): Promise<T> {
      const answer = await fetch(base + path, { headers })
      if (answer.status !== 200) throw new Error(`GET ${path}: ${answer.status} ${(await answer.text()).slice(0, 200)}`)
      return answer.json() as Promise<T>
    },
  }
}
