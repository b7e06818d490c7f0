import { setPasswordSchema } from '#shared/schemas/account'

// Sets the password from an invitation or reset link and signs the person in.
export default defineEventHandler(async (event) => {
  const { token, password } = await readValidatedBody(event, zodValidator(setPasswordSchema))
  const holder = await findTokenHolder(token)
  if (!holder) throw createError({ statusCode: 400, message: INVALID_LINK_MESSAGE })
  assertStrongPassword(password, holder)
  const user = await setPasswordWithToken(token, await hashPassword(password))
  await clearLoginLimits(user.email)
  return { user: await startUserSession(event, user) }
})
