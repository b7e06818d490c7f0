import { describe, expect, it } from 'vitest'
import { databaseErrorAnswer, findPgError, isUniqueViolation } from '../../../../../server/utils/http/db-errors'

// What node-postgres throws, wrapped the way drizzle (DrizzleQueryError) and h3 (H3Error) wrap it.
function pgError(code: string, constraint?: string) {
  return Object.assign(new Error(`database error ${code}`), { code, constraint, severity: 'ERROR' })
}
const wrapped = (cause: unknown) => Object.assign(new Error('Failed query: ...'), { cause })
const asH3 = (cause: unknown) => Object.assign(new Error('Server Error'), { statusCode: 500, cause })

describe('databaseErrorAnswer', () => {
  it('finds the PostgreSQL error under the wrappers', () => {
    expect(findPgError(asH3(wrapped(pgError('22003'))))?.code).toBe('22003')
    expect(findPgError(asH3(new Error('plain')))).toBeUndefined()
  })

  it('answers characters the database cannot store and numbers out of range with 400', () => {
    for (const code of ['22P05', '22021', '22003']) {
      const answer = databaseErrorAnswer(asH3(wrapped(pgError(code))))
      expect(answer?.statusCode, code).toBe(400)
      expect(answer?.message, code).toMatch(/cannot be stored|too large or too small/)
    }
  })

  it('answers a unique clash with 409, in the words of the constraint when it is known', () => {
    expect(databaseErrorAnswer(wrapped(pgError('23505', 'projects_code_unique')))).toEqual({
      statusCode: 409, message: 'A project with this code already exists; choose another code.',
    })
    expect(databaseErrorAnswer(wrapped(pgError('23505', 'decision_events_seq_unique')))?.statusCode).toBe(409)
    expect(isUniqueViolation(wrapped(pgError('23505')))).toBe(true)
  })

  it('leaves real faults alone (a lost connection, a refused privilege) to be a 500', () => {
    expect(databaseErrorAnswer(wrapped(pgError('08006')))).toBeUndefined()
    expect(databaseErrorAnswer(wrapped(pgError('42501')))).toBeUndefined()
    expect(databaseErrorAnswer(Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' }))).toBeUndefined()
  })
})
