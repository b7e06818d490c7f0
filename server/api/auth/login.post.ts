import { loginSchema } from '#shared/schemas/auth'

// A fixed hash to verify against when the account does not exist, so the answer takes as long.
let decoyHash: Promise<string> | undefined

export default defineEventHandler(async (event) => {
  const { email, password } = await readValidatedBody(event, zodValidator(loginSchema))
  const keys = loginKeys(event, email)
  await assertNotLocked(event, keys)

  const user = await findUserByEmail(email)
  const ok = user?.passwordHash
    ? await verifyPassword(user.passwordHash, password)
    : await verifyPassword(await (decoyHash ??= hashPassword('decoy-password-never-used')), password).then(() => false)
  if (!user || !ok || !user.active) {
    await recordLoginFailure(keys)
    throw createError({ statusCode: 401, message: 'E-mail or password is not right, or the account is inactive' })
  }
  await recordLoginSuccess(keys)
  const sessionUser = { id: user.id, email: user.email, name: user.name, role: user.role }
  await setUserSession(event, { user: sessionUser, loggedInAt: Date.now() })
  return { user: sessionUser }
})
