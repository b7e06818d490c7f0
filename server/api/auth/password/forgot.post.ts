import { forgotPasswordSchema } from '#shared/schemas/account'

// The same answer whether or not the address has an account, so it cannot be used to find accounts.
export default defineEventHandler(async (event) => {
  const { email } = await readValidatedBody(event, zodValidator(forgotPasswordSchema))
  await limitPasswordResetRequests(event, email)
  if (await requestPasswordReset(email)) kickMailDelivery()
  return { message: FORGOT_PASSWORD_MESSAGE }
})
