import { setPasswordSchema } from '#shared/schemas/account'

// Sets the password from an invitation or reset link and signs the person in.
export default defineEventHandler(async (event) => {
  const { token, password } = await readValidatedBody(event, zodValidator(setPasswordSchema))
  const user = await setPasswordWithToken(token, await hashPassword(password))
  await recordLoginSuccess({ account: loginKeys(event, user.email).account })
  await setUserSession(event, { user, loggedInAt: Date.now() })
  return { user }
})
