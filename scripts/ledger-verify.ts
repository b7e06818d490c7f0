// npm run ledger:verify [-- --incremental] [--json]: the whole ledger verified, the same checks as
// the auditor's page (server/db/ledger-verify.ts); a full run unless --incremental. Prints the
// problems by kind and exits 1 when there is any.
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import { PROBLEM_KIND_LABELS, PROBLEM_KINDS } from '../shared/schemas/ledger'
import { keySettingsFromEnv, loadSigningKey, loadTrustedKeys } from '../server/db/ledger-keys'
import { countByKind, verifyLedger } from '../server/db/ledger-verify'
import * as schema from '../server/db/schema'

const url = process.env.DATABASE_URL || process.env.NUXT_DATABASE_URL
if (!url) throw new Error('DATABASE_URL is not set')
const mode = process.argv.includes('--incremental') ? 'incremental' : 'full'
const json = process.argv.includes('--json')

const settings = keySettingsFromEnv()
const signingKey = loadSigningKey(settings)
const trusted = loadTrustedKeys(settings, signingKey)
const pool = new pg.Pool({ connectionString: url, max: 2 })
const progress = process.stderr.isTTY && !json
  ? (done: number, total: number) => process.stderr.write(`\r[ledger] recomputed ${done} of ${total} entries`)
  : undefined
try {
  const report = await verifyLedger(drizzle(pool, { schema }), { mode, trusted, signingKey, onProgress: progress })
  if (progress) process.stderr.write('\n')
  if (json) {
    console.log(JSON.stringify(report, null, 2))
  } else {
    console.log(`[ledger] ${mode} verification: ${report.entries} entries (head #${report.head.seq} ${report.head.hash.slice(0, 16)}…), ${report.checkpoints} checkpoints, ${report.recomputed} entries recomputed`)
    if (!trusted.size) console.log('[ledger] no signing key or retired public key is configured here, so no checkpoint can be confirmed')
    if (report.valid) console.log('[ledger] valid: no problem found')
    const counts = countByKind(report.problems)
    for (const kind of PROBLEM_KINDS.filter(k => counts[k])) {
      console.log(`\n${PROBLEM_KIND_LABELS[kind]} (${kind}): ${counts[kind]}`)
      for (const p of report.problems.filter(x => x.kind === kind)) console.log(`  - ${p.detail}`)
    }
  }
  process.exitCode = report.valid ? 0 : 1
} finally {
  await pool.end()
}
