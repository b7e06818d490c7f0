import { z } from 'zod'

// Ids, versions and counts are PostgreSQL integers: 1 .. 2^31 - 1. A bigger number is refused here
// with a message instead of failing in the database.
export const INT32_MAX = 2_147_483_647

/** A positive whole number that fits the database's integer columns; `coerce` for path and query text. */
export function positiveInt(what: string, options: { coerce?: boolean; required?: string } = {}) {
  const base = options.coerce
    ? z.coerce.number({ invalid_type_error: `${what} must be a number` })
    : z.number({ required_error: options.required ?? `${what} is required`, invalid_type_error: `${what} must be a number` })
  return base.int(`${what} must be a whole number`).positive(`${what} must be a positive whole number`)
    .max(INT32_MAX, `${what} must be at most ${INT32_MAX}`)
}

// Text PostgreSQL cannot store as sent: a NUL character (text and jsonb refuse it) and a lone UTF-16
// surrogate (jsonb refuses it; text would silently turn it into U+FFFD).
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/

export function isStorableText(text: string) {
  return !text.includes('\u0000') && !LONE_SURROGATE.test(text)
}

export const UNSTORABLE_TEXT_MESSAGE = 'Contains a character that cannot be stored (a NUL or an unpaired surrogate)'

type Visit = { value: unknown; key?: string | number; parent?: Visit }

function pathOf(visit: Visit) {
  const path: (string | number)[] = []
  for (let v: Visit | undefined = visit; v?.parent; v = v.parent) path.push(v.key!)
  return path.reverse()
}

/** The path of the first string (value or object key) in `value` that cannot be stored, if any. */
export function findUnstorableText(value: unknown): (string | number)[] | undefined {
  // Iterative, with parent links instead of copied paths, so a deeply nested body costs linear time.
  const stack: Visit[] = [{ value }]
  while (stack.length) {
    const visit = stack.pop()!
    const item = visit.value
    if (typeof item === 'string') {
      if (!isStorableText(item)) return pathOf(visit)
    }
    else if (Array.isArray(item)) {
      for (let i = item.length - 1; i >= 0; i--) stack.push({ value: item[i], key: i, parent: visit })
    }
    else if (item && typeof item === 'object') {
      const entries = Object.entries(item)
      // A bad key is reported at its object: the key itself is not fit to show.
      for (const [key] of entries) if (!isStorableText(key)) return pathOf(visit)
      for (let i = entries.length - 1; i >= 0; i--) stack.push({ value: entries[i]![1], key: entries[i]![0], parent: visit })
    }
  }
  return undefined
}

/** The refinement every free-text field ends with: `.refine(...storable('Name'))`. */
export function storable(what: string) {
  return [isStorableText, `${what}: ${UNSTORABLE_TEXT_MESSAGE.toLowerCase()}`] as const
}

export const idParamSchema = z.object({ id: positiveInt('The id', { coerce: true }) })

export const emailSchema = z.string({ required_error: 'E-mail is required' }).trim().toLowerCase()
  .email('Enter a valid e-mail address').max(254)

export const personNameSchema = z.string({ required_error: 'Name is required' }).trim()
  .min(1, 'Name is required').max(120, 'Name is at most 120 characters').refine(...storable('Name'))

export const PASSWORD_MIN_LENGTH = 10

// Length only: the strength check (common passwords, repeats, the person's own name) runs on the
// server when a password is set (server/utils/auth/password-strength.ts).
export const passwordSchema = z.string({ required_error: 'Password is required' })
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters`).max(200, 'Use at most 200 characters')
  .refine(...storable('Password'))
