// Belt and braces: every /api route needs a signed-in user except these. Each route still checks
// role and membership itself through server/utils/auth.ts.
const PUBLIC_API = new Set([
  '/api/auth/login',
  '/api/auth/password/forgot',
  '/api/auth/password/set',
  '/api/health',
])

export default defineEventHandler(async (event) => {
  const path = event.path.split('?')[0]!
  if (!path.startsWith('/api/') || PUBLIC_API.has(path)) return
  await requireUser(event)
})
