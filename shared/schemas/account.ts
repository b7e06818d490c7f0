import { z } from 'zod'
import { emailSchema, passwordSchema } from './common'

export const forgotPasswordSchema = z.object({ email: emailSchema })
export type ForgotPasswordBody = z.infer<typeof forgotPasswordSchema>

const tokenSchema = z.string({ required_error: 'The link has no token; open the link from the e-mail again' })
  .trim().regex(/^[A-Za-z0-9_-]{20,200}$/, 'This link is not complete; open the link from the e-mail again')

export const setPasswordSchema = z.object({ token: tokenSchema, password: passwordSchema })
export type SetPasswordBody = z.infer<typeof setPasswordSchema>

// The form asks for the password twice; the route only needs it once.
export const setPasswordFormSchema = z.object({
  password: passwordSchema,
  confirm: z.string({ required_error: 'Type the password again' }).min(1, 'Type the password again'),
}).refine(v => v.password === v.confirm, { message: 'The two passwords differ', path: ['confirm'] })
