import { forgotPasswordSchema } from '#shared/schemas/account'

// The same answer, as fast, whether or not the address has an account: the lookup and the mail
// happen after the response, so neither its content nor its timing can be used to find accounts.
export default defineEventHandler(async (event) => {
  const { email } = await readValidatedBody(event, zodValidator(forgotPasswordSchema))
  await limitPasswordResetRequests(event, email)
  event.waitUntil(sendPasswordReset(email))
  return { message: FORGOT_PASSWORD_MESSAGE }
})
