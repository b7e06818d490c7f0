// Every way a session is cleared (our sign-out route, the auth module's own DELETE /api/_auth/session,
// an ended session found by requireUser) records its id as revoked, so a copy of the cookie dies too.
export default defineNitroPlugin(() => {
  sessionHooks.hook('clear', async (session) => {
    await revokeSession(session)
  })
})
