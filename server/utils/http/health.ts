import { sql } from 'drizzle-orm'
import { useDb } from '../db'

const TIMEOUT_MS = 3000

/** Whether the database answers a trivial query within a few seconds. */
export async function databaseReachable() {
  let timer: NodeJS.Timeout | undefined
  const timeout = new Promise<false>((resolve) => { timer = setTimeout(() => resolve(false), TIMEOUT_MS) })
  try {
    return await Promise.race([useDb().execute(sql`SELECT 1`).then(() => true, () => false), timeout])
  }
  catch {
    return false
  }
  finally {
    clearTimeout(timer)
  }
}
