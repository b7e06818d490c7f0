// A last line of defence: a PostgreSQL error that input validation should have caught (a value out
// of range, a character the database cannot store, a duplicate that lost a race) becomes a 4xx
// with a message a person can read, never a raw 500. Used by server/plugins/database-errors.ts.

type PgErrorLike = { code?: string; constraint?: string; cause?: unknown }

// Unique constraints and what a clash means in the product's words.
const UNIQUE_MESSAGES: Record<string, string> = {
  projects_code_unique: 'A project with this code already exists; choose another code.',
  users_email_lower_idx: 'A user with this e-mail address already exists.',
}

const ANSWERS: Record<string, { statusCode: 400 | 409; message: string }> = {
  // untranslatable_character: e.g. \u0000 or a lone surrogate inside JSON
  '22P05': { statusCode: 400, message: 'The request holds a character that cannot be stored (a NUL or an unpaired surrogate). Remove it and try again.' },
  // character_not_in_repertoire: e.g. a NUL byte in text
  '22021': { statusCode: 400, message: 'The request holds a character that cannot be stored (a NUL or an invalid byte). Remove it and try again.' },
  // numeric_value_out_of_range
  '22003': { statusCode: 400, message: 'A number in the request is too large or too small to store.' },
  // invalid_text_representation: e.g. "abc" where a number is stored
  '22P02': { statusCode: 400, message: 'A value in the request is not in the form it must be stored in.' },
  // datetime_field_overflow
  '22008': { statusCode: 400, message: 'A date in the request is out of range.' },
  // unique_violation
  '23505': { statusCode: 409, message: 'This clashes with something that already exists; reload and try again.' },
}

/** The PostgreSQL error inside a (wrapped) error: drizzle and h3 keep the original as `cause`. */
export function findPgError(error: unknown): PgErrorLike | undefined {
  let current: unknown = error
  for (let depth = 0; current && typeof current === 'object' && depth < 6; depth++) {
    const e = current as PgErrorLike
    if (typeof e.code === 'string' && /^[0-9A-Z]{5}$/.test(e.code)) return e
    current = e.cause
  }
  return undefined
}

export function isUniqueViolation(error: unknown) {
  return findPgError(error)?.code === '23505'
}

/** The 4xx answer for a PostgreSQL error caused by the request, or undefined for a real fault. */
export function databaseErrorAnswer(error: unknown) {
  const pg = findPgError(error)
  if (!pg?.code) return undefined
  const answer = ANSWERS[pg.code]
  if (!answer) return undefined
  if (pg.code === '23505' && pg.constraint && UNIQUE_MESSAGES[pg.constraint]) {
    return { statusCode: answer.statusCode, message: UNIQUE_MESSAGES[pg.constraint]! }
  }
  return answer
}
