import type { z } from 'zod'
import { UNSTORABLE_TEXT_MESSAGE, findUnstorableText } from '#shared/schemas/common'

/**
 * A validator for h3's readValidatedBody / getValidatedQuery / getValidatedRouterParams that turns a
 * zod failure into a 400 a person can read: `message` sums it up, `data.fieldErrors` maps each
 * field path ("fluid.density") to its messages for the form.
 */
export function zodValidator<T extends z.ZodTypeAny>(schema: T) {
  return (data: unknown): z.output<T> => {
    // Any string, even one a schema would drop or not look at, that the database could not store.
    const unstorable = findUnstorableText(data)
    if (unstorable) {
      const key = (unstorable.slice(0, 8).join('.') + (unstorable.length > 8 ? '...' : '')) || '_form'
      throw { message: `${key}: ${UNSTORABLE_TEXT_MESSAGE}`, fieldErrors: { [key]: [UNSTORABLE_TEXT_MESSAGE] } }
    }
    const result = schema.safeParse(data)
    if (result.success) return result.data
    const fieldErrors: Record<string, string[]> = {}
    for (const issue of result.error.issues) {
      const key = issue.path.join('.') || '_form'
      ;(fieldErrors[key] ??= []).push(issue.message)
    }
    const message = result.error.issues
      .map(issue => (issue.path.length ? `${issue.path.join('.')}: ` : '') + issue.message)
      .join('; ')
    throw { message, fieldErrors }
  }
}
