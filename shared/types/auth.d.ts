import type { Role } from '../utils/roles'

// What the sealed session cookie carries; the role is re-read from the database on every request.
declare module '#auth-utils' {
  interface User {
    id: number
    email: string
    name: string
    role: Role
  }
}

export {}
