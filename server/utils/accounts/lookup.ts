import { eq, sql } from 'drizzle-orm'
import { useDb } from '../db'

// Finding an account by its address, case-insensitively (the unique index is on lower(email)).
export function findUserByEmail(email: string) {
  return useDb().query.users.findFirst({ where: eq(sql`lower(${tables.users.email})`, email.toLowerCase()) })
}
