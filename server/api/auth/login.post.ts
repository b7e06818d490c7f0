import { loginSchema } from '#shared/schemas/auth'

// A fixed hash to verify against when the account does not exist, so the answer takes as long.
let decoyHash: Promise<string> | undefined

export default defineEventHandler(async (event) => {
  const { email, password } = await readValidatedBody(event, zodValidator(loginSchema))
  const keys = loginKeys(event, email)
  // Counted before the password is checked, so parallel guesses cannot slip past the limit.
  await countLoginAttempt(event, keys)

  const user = await findUserByEmail(email)
  const ok = user?.passwordHash
    ? await verifyPassword(user.passwordHash, password)
    : await verifyPassword(await (decoyHash ??= hashPassword('decoy-password-never-used')), password).then(() => false)
  if (!user || !ok || !user.active) {
    throw createError({ statusCode: 401, message: 'E-mail or password is not right, or the account is inactive' })
  }
  await recordLoginSuccess(keys)
  return { user: await startUserSession(event, user) }
})
