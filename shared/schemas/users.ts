import { z } from 'zod'
import { ROLES } from '../utils/roles'
import { emailSchema, personNameSchema } from './common'

const roleSchema = z.enum(ROLES, { errorMap: () => ({ message: `Role must be one of ${ROLES.join(', ')}` }) })

export const userCreateSchema = z.object({
  email: emailSchema,
  name: personNameSchema,
  role: roleSchema,
})
export type UserCreateBody = z.infer<typeof userCreateSchema>

export const userUpdateSchema = z.object({
  name: personNameSchema.optional(),
  role: roleSchema.optional(),
  active: z.boolean({ invalid_type_error: 'Active must be true or false' }).optional(),
}).refine(v => Object.keys(v).length > 0, { message: 'Nothing to change: send name, role or active' })
export type UserUpdateBody = z.infer<typeof userUpdateSchema>
