import type { SessionUser } from './session'

// The sealed session cookie carries the SessionUser shape (shared/types/session.ts).
declare module '#auth-utils' {
  // eslint-disable-next-line @typescript-eslint/no-empty-object-type
  interface User extends SessionUser {}
  // Server-only (never sent to the browser): which session this is and the user's session version
  // at sign-in (server/utils/auth/session-version.ts).
  interface SecureSessionData {
    sessionId?: string
    sessionVersion?: number
  }
}

export {}
