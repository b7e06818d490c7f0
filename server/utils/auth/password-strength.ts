import { ZxcvbnFactory } from '@zxcvbn-ts/core'
import * as common from '@zxcvbn-ts/language-common'
import { PASSWORD_MIN_LENGTH } from '#shared/schemas/common'

// A new password must be hard to guess, as estimated by zxcvbn-ts with its dictionary of common
// passwords and keyboard patterns: score 3 of 4 or better, besides the minimum length the form
// already checks. Runs on the server only (the dictionaries are large).
export const MIN_PASSWORD_SCORE = 3

// Why a password is weak, in our words, by zxcvbn's warning key.
const REASONS: Record<string, string> = {
  straightRow: 'a straight row of keys is among the first things tried',
  keyPattern: 'a short keyboard pattern is among the first things tried',
  simpleRepeat: 'a repeated character such as "aaa" is easy to guess',
  extendedRepeat: 'a repeated group such as "abcabc" is barely stronger than the group alone',
  sequences: 'a sequence such as "abcd" or "6543" is easy to guess',
  recentYears: 'recent years are easy to guess',
  dates: 'dates are easy to guess',
  topTen: 'it is one of the ten most used passwords',
  topHundred: 'it is one of the hundred most used passwords',
  common: 'it is a commonly used password',
  similarToCommon: 'it is a small change to a commonly used password',
  wordByItself: 'a single word is easy to guess',
  namesByThemselves: 'names on their own are easy to guess',
  commonNames: 'common names are easy to guess',
  userInputs: 'it contains your name, your e-mail address or the name of this product',
  pwned: 'it has appeared in a published data breach',
}

let factory: ZxcvbnFactory | undefined
function estimator() {
  factory ??= new ZxcvbnFactory({ dictionary: { ...common.dictionary }, graphs: common.adjacencyGraphs })
  return factory
}

/** Why the password is too weak, or undefined when it is strong enough. */
export function passwordWeakness(password: string, person: { email?: string; name?: string } = {}) {
  if (password.length < PASSWORD_MIN_LENGTH) return `it is shorter than ${PASSWORD_MIN_LENGTH} characters`
  const inputs = ['eddyledger', 'kestrel', 'ledger']
  if (person.email) inputs.push(person.email, person.email.split('@')[0]!)
  if (person.name) inputs.push(person.name, ...person.name.split(/\s+/).filter(part => part.length > 2))
  // Only the first 100 characters are scored: the estimate's cost grows with length, and a password
  // that long is strong for its length alone.
  const result = estimator().check(password.slice(0, 100), inputs)
  if (result.score >= MIN_PASSWORD_SCORE) return undefined
  return (result.feedback.warning && REASONS[result.feedback.warning]) || 'it would be guessed too quickly'
}

/** Throws 400 with a field message on `password` when the password is too weak. */
export function assertStrongPassword(password: string, person: { email?: string; name?: string } = {}) {
  const weakness = passwordWeakness(password, person)
  if (!weakness) return
  const message = `This password is too easy to guess: ${weakness}. Try a longer phrase of several unrelated words.`
  throw createError({ statusCode: 400, message, data: { fieldErrors: { password: [message] } } })
}
