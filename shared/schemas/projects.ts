import { z } from 'zod'
import { positiveInt, storable } from './common'

export const projectCreateSchema = z.object({
  code: z.string({ required_error: 'Code is required' }).trim().toUpperCase()
    .regex(/^[A-Z0-9][A-Z0-9-]{1,19}$/, 'Code: 2-20 letters, digits or dashes, e.g. KB-105'),
  name: z.string({ required_error: 'Name is required' }).trim().min(1, 'Name is required').max(160).refine(...storable('Name')),
  client: z.string().trim().max(160).refine(...storable('Client')).default(''),
  description: z.string().trim().max(2000).refine(...storable('Description')).default(''),
})
export type ProjectCreateBody = z.infer<typeof projectCreateSchema>

export const projectUpdateSchema = projectCreateSchema.partial().extend({
  archived: z.boolean({ invalid_type_error: 'Archived must be true or false' }).optional(),
}).refine(v => Object.keys(v).length > 0, { message: 'Nothing to change' })
export type ProjectUpdateBody = z.infer<typeof projectUpdateSchema>

export const memberAddSchema = z.object({
  userId: positiveInt('The user id', { required: 'Choose a user' }),
})

export const memberParamsSchema = z.object({
  id: positiveInt('The project id', { coerce: true }),
  userId: positiveInt('The user id', { coerce: true }),
})
