import type { SessionUser } from './session'

// The sealed session cookie carries the SessionUser shape (shared/types/session.ts).
declare module '#auth-utils' {
  // eslint-disable-next-line @typescript-eslint/no-empty-object-type
  interface User extends SessionUser {}
}

export {}
