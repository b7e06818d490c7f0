// Signs this session out; the clear hook (server/plugins/session-revocation.ts) records it as revoked.
export default defineEventHandler(async (event) => {
  await clearUserSession(event)
  return { ok: true }
})
