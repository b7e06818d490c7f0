// The team lead's overview query: an optional project and an optional range of creation dates.
import { z } from 'zod'
import { INT32_MAX } from './common'

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/

// An empty field in the query means "not set", as a cleared date input sends it.
const blankIsUnset = (value: unknown) => (value === '' ? undefined : value)

export function isoDate(what: string) {
  return z.preprocess(blankIsUnset, z.string({ invalid_type_error: `${what} must be a date.` })
    .regex(ISO_DATE, `${what} must be a date written YYYY-MM-DD.`)
    .refine(text => !Number.isNaN(Date.parse(`${text}T00:00:00Z`)) && new Date(`${text}T00:00:00Z`).toISOString().startsWith(text), `${what} is not a calendar date.`)
    .optional())
}

export const projectFilterSchema = z.preprocess(blankIsUnset, z.coerce.number({ invalid_type_error: 'The project must be given by its id.' })
  .int('The project id must be a whole number.').positive('The project id must be a positive whole number.')
  .max(INT32_MAX, `The project id must be at most ${INT32_MAX}.`).optional())

export const overviewQuerySchema = z.object({
  from: isoDate('From'),
  to: isoDate('To'),
  projectId: projectFilterSchema,
}).refine(q => !q.from || !q.to || q.from <= q.to, { path: ['to'], message: 'To must be on or after From.' })
export type OverviewQuery = z.infer<typeof overviewQuerySchema>
