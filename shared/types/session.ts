import type { Role } from '../utils/roles'

/** The signed-in user as the sealed session carries it; the role is re-read from the database on every request. */
export interface SessionUser {
  id: number
  email: string
  name: string
  role: Role
}
