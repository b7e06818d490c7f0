import type { H3Event } from 'h3'
import { countAttempt, refuseTooMany } from '../auth/login-limiter'

// Resending an invitation mails someone else's inbox, so it is limited per invited user
// (runtimeConfig.invitationResendsPerHour, 3 by default): then 429 with Retry-After until the hour ends.
export async function limitInvitationResends(event: H3Event, userId: number) {
  const limit = Number(useRuntimeConfig().invitationResendsPerHour)
  const wait = await countAttempt([{ key: `invite-resend:${userId}`, limit, lock: 'window', windowSeconds: 3600 }])
  if (wait !== undefined) refuseTooMany(event, wait, 'invitations sent to this person')
}
