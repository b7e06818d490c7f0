import { z } from 'zod'

export const idParamSchema = z.object({
  id: z.coerce.number({ invalid_type_error: 'The id must be a number' }).int().positive('The id must be a positive whole number'),
})

export const emailSchema = z.string({ required_error: 'E-mail is required' }).trim().toLowerCase()
  .email('Enter a valid e-mail address').max(254)

export const personNameSchema = z.string({ required_error: 'Name is required' }).trim()
  .min(1, 'Name is required').max(120, 'Name is at most 120 characters')

export const passwordSchema = z.string({ required_error: 'Password is required' })
  .min(10, 'Use at least 10 characters').max(200, 'Use at most 200 characters')
