/**
 * A ruleset from data (a team's published or draft version, an imported file) made ready for the
 * engine once: validated against ruleset-schema.ts, deep-frozen (so advice may share its effects
 * and nothing can change it afterwards), and every json-logic expression compiled to closures
 * (compile-logic.ts). advise(input, { ruleset }) then runs it as fast as the built-in one.
 */
import { compiledLogic } from './compile-logic'
import { rulesetSchema, type Ruleset } from './ruleset-schema'

export interface RulesetProblem {
  /** index of the rule in `rules`, null for a problem of the ruleset as a whole */
  ruleIndex: number | null
  /** the rule's id when it has one */
  ruleId: string | null
  /** where inside the rule (or the ruleset), e.g. ['when', 'and', 0, 'var'] */
  path: (string | number)[]
  message: string
}

export class RulesetInvalidError extends Error {
  constructor(readonly problems: RulesetProblem[]) {
    super(problems.map(describeProblem).join('; '))
    this.name = 'RulesetInvalidError'
  }
}

/** One problem in words, naming the rule: 'Rule "buoyancy" (rule 14), when.var: Unknown fact ...'. */
export function describeProblem(problem: RulesetProblem): string {
  const where = problem.path.length ? `${problem.path.join('.')}: ` : ''
  if (problem.ruleIndex === null) return `${where}${problem.message}`
  const name = problem.ruleId ? `Rule "${problem.ruleId}" (rule ${problem.ruleIndex + 1})` : `Rule ${problem.ruleIndex + 1}`
  return `${name}, ${where}${problem.message}`
}

/** Every reason the data is not a valid ruleset, each tied to its rule; empty when valid. */
export function rulesetProblems(source: unknown): RulesetProblem[] {
  const result = rulesetSchema.safeParse(source)
  if (result.success) return []
  const rules = (source as { rules?: unknown } | null)?.rules
  return result.error.issues.map((issue) => {
    const [head, index, ...rest] = issue.path
    if (head !== 'rules' || typeof index !== 'number') return { ruleIndex: null, ruleId: null, path: issue.path, message: issue.message }
    const id = Array.isArray(rules) ? (rules[index] as { id?: unknown } | undefined)?.id : undefined
    return { ruleIndex: index, ruleId: typeof id === 'string' ? id : null, path: rest, message: issue.message }
  })
}

function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !Object.isFrozen(value)) {
    for (const key of Object.keys(value)) deepFreeze((value as Record<string, unknown>)[key])
    Object.freeze(value)
  }
  return value
}

/** Compiles a frozen ruleset's expressions now rather than on the first case. */
function warm(ruleset: Ruleset): void {
  for (const rule of ruleset.rules) {
    if (typeof rule.when === 'object' && rule.when !== null) compiledLogic(rule.when)
    for (const change of Object.values(rule.effects.scores ?? {})) {
      if (typeof change === 'object' && change !== null) compiledLogic(change)
    }
  }
}

/**
 * The engine's form of a ruleset: throws RulesetInvalidError (with every problem) when the data
 * does not fit the schema. The data is copied, so the caller's object stays as it was.
 */
export function compileRuleset(source: unknown): Ruleset {
  const result = rulesetSchema.safeParse(source)
  if (!result.success) throw new RulesetInvalidError(rulesetProblems(source))
  const ruleset = deepFreeze(structuredClone(result.data))
  warm(ruleset)
  return ruleset
}
